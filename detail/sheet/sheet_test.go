package sheet

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// sheetJobs are the job files the sheet tests draw: a US angle, a US
// two-line staggered flat, an SI double angle, an SI slotted angle, the
// demo and AISC Design Example D.2 (a member without a plate).
var sheetJobs = []string{
	"../../testdata/jobs/us-single-angle.yaml",
	"../../testdata/jobs/us-staggered-flat.yaml",
	"../../testdata/jobs/si-double-angle.yaml",
	"../../testdata/jobs/si-slotted.yaml",
	"../../testdata/jobs/us-pipe-rack-brace.yaml",
	"../../testdata/examples/aisc-d2.yaml",
}

func checkedJob(t *testing.T, path string) *detail.Report {
	t.Helper()
	j, err := jobfile.LoadJob(path)
	if err != nil {
		t.Fatal(err)
	}
	r, err := detail.CheckJob(j) // both ends
	if err != nil {
		t.Fatal(err)
	}
	return r
}

func sheetOf(t *testing.T, path string) (*detail.Report, *Sheet) {
	t.Helper()
	r := checkedJob(t, path)
	s, err := NewSheet(r, true)
	if err != nil {
		t.Fatal(err)
	}
	return r, s
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-9 }

// The parts carry the job's holes: the member in the job's own frame, the
// plate turned half a turn about its free edge (x' = FreeEdge − x,
// y' = YMax − y); diameters and slot lengths from Table J3.3.
func TestSheetHolesAreTheJobs(t *testing.T) {
	for _, path := range sheetJobs {
		t.Run(filepath.Base(path), func(t *testing.T) {
			r, s := sheetOf(t, path)
			c := &r.Design.Conn
			sys := r.Design.Job.Units
			in := func(l units.Length) float64 { return sys.ToJob(float64(l), units.DimLength) }
			views := 1
			if c.Plate != nil {
				views = 2
			}
			if len(s.Views) != views {
				t.Fatalf("%d views, want %d", len(s.Views), views)
			}
			for vi, v := range s.Views {
				// The member is whole: the job's holes, then the far end's,
				// the same mirrored about mid-length (x' = length − x); a
				// splice plate carries both members' groups, member A's first
				// (TestSplicePlateCarriesBothGroups).
				n := len(c.Holes)
				if vi == 0 {
					n *= 2
				}
				if vi == 1 && c.Plate.Kind == engine.Splice {
					n *= 2
				}
				if len(v.Part.Holes) != n {
					t.Fatalf("%s: %d holes, want %d", v.Part.Name, len(v.Part.Holes), n)
				}
				for i := range n {
					h := c.Holes[i%len(c.Holes)]
					want := r2.Vec{X: in(h.X), Y: in(h.Y)}
					switch {
					case vi == 1 && i >= len(c.Holes): // member B's group, mirrored about the joint
						want = r2.Vec{X: in(c.Plate.FreeEdge+c.Plate.Gap) + in(h.X), Y: in(c.Plate.YMax()) - in(h.Y)}
					case vi == 1:
						want = r2.Vec{X: in(c.Plate.FreeEdge) - in(h.X), Y: in(c.Plate.YMax()) - in(h.Y)}
					case i >= len(c.Holes):
						want.X = in(r.Design.Job.Member.Length) - in(h.X)
					}
					got := v.Part.Holes[i]
					if !near(got.Centre.X, want.X) || !near(got.Centre.Y, want.Y) {
						t.Errorf("%s %s: centre %v, want %v", v.Part.Name, h.ID, got.Centre, want)
					}
					if !near(got.Dx, in(h.Dx)) || !near(got.Dy, in(h.Dy)) || got.Type != h.Type {
						t.Errorf("%s %s: %v × %v %v, want %v × %v %v", v.Part.Name, h.ID, got.Dx, got.Dy, got.Type, in(h.Dx), in(h.Dy), h.Type)
					}
				}
			}
		})
	}
}

// HB-7 (L4x4x1/2 9'-6" long, (4) 3/4-in bolts at 3 in, end 1-1/2 in, gage
// 2-1/2 in; plate 12 in wide, edge 1-1/2 in): numbers from the job file.
// The member is whole: 114 in by the 4-in leg; its view leaves out the
// stretch from 19-1/2 in (the last bolt, 10-1/2, and the longer of the
// pattern, 9 in, and 6 in) to 114 − 19-1/2 = 94-1/2 in, the far end's
// mirror. The plate runs from its free edge through the pattern
// (1-1/2 + 9) and 9 in on: 19-1/2.
func TestSheetOutlines(t *testing.T) {
	_, s := sheetOf(t, "../../testdata/jobs/us-single-angle.yaml")
	member, plate := s.Views[0].Part, s.Views[1].Part
	if want := []r2.Vec{{X: 0, Y: 0}, {X: 114, Y: 0}, {X: 114, Y: 4}, {X: 0, Y: 4}}; !slices.Equal(member.Contour, want) {
		t.Errorf("member contour %v, want %v", member.Contour, want)
	}
	if b := s.Views[0].Break; b == nil || !near(b.X0, 19.5) || !near(b.X1, 94.5) {
		t.Errorf("member break %+v, want 19.5 to 94.5", b)
	}
	if want := []r2.Vec{{X: 0, Y: 0}, {X: 19.5, Y: 0}, {X: 19.5, Y: 12}, {X: 0, Y: 12}}; !slices.Equal(plate.Contour, want) {
		t.Errorf("plate contour %v, want %v", plate.Contour, want)
	}
	// The edge distance to the free edge is the job's 1-1/2 in; the bolt
	// group sits mid-width.
	if h := plate.Holes[3]; h.Centre != (r2.Vec{X: 1.5, Y: 6}) {
		t.Errorf("plate H4 at %v, want (1.5, 6)", h.Centre)
	}
	if member.Thickness != 0.5 || plate.Thickness != 0.5 || member.Pieces != 1 {
		t.Errorf("thickness %v / %v, pieces %d", member.Thickness, plate.Thickness, member.Pieces)
	}
}

func TestViewBeyond(t *testing.T) {
	for _, tt := range []struct {
		name    string
		pattern units.Length
		sys     units.System
		want    units.Length
	}{
		{"short US pattern: 6 in", 3 * units.Inch, units.US, 6 * units.Inch},
		{"long US pattern: its length", 9 * units.Inch, units.US, 9 * units.Inch},
		{"single row SI: 150 mm", 0, units.SI, 150},
		{"long SI pattern", 195, units.SI, 195},
	} {
		if got := ViewBeyond(tt.pattern, tt.sys); math.Abs(float64(got-tt.want)) > 1e-9 {
			t.Errorf("%s: %v, want %v", tt.name, got, tt.want)
		}
	}
}

// Punch when t ≤ d + 1/8 in (d + 3 mm): common practice, no source.
func TestHowMade(t *testing.T) {
	in := func(v float64) units.Length { return units.Length(v) * units.Inch }
	for _, tt := range []struct {
		t, d units.Length
		sys  units.System
		want string
	}{
		{in(0.875), in(0.75), units.US, "PUNCH"},
		{in(1), in(0.75), units.US, "DRILL"},
		{23, 20, units.SI, "PUNCH"},
		{25, 20, units.SI, "DRILL"},
	} {
		if got := HowMade(tt.t, tt.d, tt.sys); got != tt.want {
			t.Errorf("t %v d %v: %s, want %s", tt.t, tt.d, got, tt.want)
		}
	}
}

// An M20 short slot is 22 × 26 mm (Table J3.3M): straight sides 4 mm
// long, half-circle ends of radius 11.
func TestSlotOutline(t *testing.T) {
	for _, tt := range []struct {
		name string
		h    SheetHole
		want []r2.Vec
	}{
		{"along y", SheetHole{Centre: r2.Vec{X: 100, Y: 50}, Dx: 22, Dy: 26, Type: rules.ShortSlot},
			[]r2.Vec{{X: 111, Y: 48}, {X: 111, Y: 52}, {X: 89, Y: 52}, {X: 89, Y: 48}}},
		{"along x", SheetHole{Centre: r2.Vec{X: 100, Y: 50}, Dx: 26, Dy: 22, Type: rules.ShortSlot},
			[]r2.Vec{{X: 98, Y: 39}, {X: 102, Y: 39}, {X: 102, Y: 61}, {X: 98, Y: 61}}},
	} {
		pts, bulges := tt.h.SlotOutline()
		if !slices.Equal(pts, tt.want) || !slices.Equal(bulges, []float64{0, 1, 0, 1}) {
			t.Errorf("%s: %v %v, want %v", tt.name, pts, bulges, tt.want)
		}
		if tt.h.Round() || tt.h.Diameter() != 22 {
			t.Errorf("%s: round %v, width %v", tt.name, tt.h.Round(), tt.h.Diameter())
		}
	}
}

// The chain along x runs end distance then pitch; the baselines from the
// datum reach every row; US text in feet-inches-sixteenths, SI whole mm.
func TestSheetDimensions(t *testing.T) {
	for _, tt := range []struct {
		path       string
		view       int
		chainX     []string
		baselinesX []string
		chainY     []string
		length     string // the member's overall dimension: member.length as the job gives it
	}{
		// HB-7: end 1-1/2, pitch 3 (× 3), gage 2-1/2 on a 4-in leg.
		{"../../testdata/jobs/us-single-angle.yaml", 0, []string{`1 1/2"`, `3"`, `3"`, `3"`},
			[]string{`4 1/2"`, `7 1/2"`, `10 1/2"`}, []string{`2 1/2"`, `1 1/2"`}, `9'-6"`},
		// HB-7 plate: edge 1-1/2 from the free edge; 12 in wide, bolts mid-width;
		// overall 1'-7 1/2" (19.5 in).
		{"../../testdata/jobs/us-single-angle.yaml", 1, []string{`1 1/2"`, `3"`, `3"`, `3"`},
			[]string{`4 1/2"`, `7 1/2"`, `10 1/2"`, `1'-7 1/2"`}, []string{`6"`, `6"`}, ""},
		// KB-40: end 40, pitch 65, gage 65 on the 120 leg.
		{"../../testdata/jobs/si-slotted.yaml", 0, []string{"40", "65", "65", "65"},
			[]string{"105", "170", "235"}, []string{"65", "55"}, "3600"},
		// FT_03: end 2, pitch 3, stagger 1-1/2; gages 2 and 2 + 4 on an 8-in flat.
		{"../../testdata/jobs/us-staggered-flat.yaml", 0, []string{`2"`, `1 1/2"`, `1 1/2"`, `1 1/2"`, `1 1/2"`, `1 1/2"`},
			[]string{`3 1/2"`, `5"`, `6 1/2"`, `8"`, `9 1/2"`}, []string{`2"`, `4"`, `2"`}, `12'-0"`},
	} {
		_, s := sheetOf(t, tt.path)
		v := s.Views[tt.view]
		var xs, ys []Dimension
		for _, d := range v.Dims {
			if d.Axis == AlongX {
				xs = append(xs, d)
			} else {
				ys = append(ys, d)
			}
		}
		texts := func(ds []Dimension) []string {
			var out []string
			for _, d := range ds {
				out = append(out, d.Text)
			}
			return out
		}
		gotX := texts(xs)
		wantX := append(slices.Clone(tt.chainX), tt.baselinesX...)
		member := tt.view == 0
		var length float64
		if member {
			// The whole member: the near end's chain, the far end's (its
			// mirror, from the far cut end), each end's baselines in turn,
			// then the overall length (the job's member.length).
			length = s.Views[0].Part.Contour[1].X
			wantX = append(slices.Clone(tt.chainX), tt.chainX...)
			for _, b := range tt.baselinesX {
				wantX = append(wantX, b, b)
			}
			wantX = append(wantX, tt.length)
		}
		if !slices.Equal(gotX, wantX) {
			t.Errorf("%s view %d: along x %q, want %q", tt.path, tt.view, gotX, wantX)
		}
		gotY := texts(ys)
		if !slices.Equal(gotY[:len(tt.chainY)], tt.chainY) {
			t.Errorf("%s view %d: along y %q, want chain %q", tt.path, tt.view, gotY, tt.chainY)
		}
		// Every chain dimension starts where the previous one ended, at the datum first.
		at := 0.0
		for _, d := range xs[:len(tt.chainX)] {
			if !near(d.A.X, at) {
				t.Errorf("%s: chain breaks at %v (want %v)", tt.path, d.A.X, at)
			}
			at = d.B.X
		}
		rest := xs[len(tt.chainX):]
		if member {
			at = length // the far end's chain, from the far cut end back
			for _, d := range rest[:len(tt.chainX)] {
				if !near(d.B.X, at) {
					t.Errorf("%s: far chain breaks at %v (want %v)", tt.path, d.B.X, at)
				}
				at = d.A.X
			}
			rest = rest[len(tt.chainX):]
			for i, d := range rest[:len(rest)-1] {
				if i%2 == 1 && !near(d.B.X, length) {
					t.Errorf("%s: far baseline to %v, want the far cut end", tt.path, d.B.X)
				}
				if i%2 == 0 && d.A.X != 0 {
					t.Errorf("%s: baseline from %v, want the datum", tt.path, d.A.X)
				}
			}
			if d := rest[len(rest)-1]; d.A.X != 0 || !near(d.B.X, length) {
				t.Errorf("%s: overall %v to %v, want 0 to %v", tt.path, d.A.X, d.B.X, length)
			}
			continue
		}
		for _, d := range rest {
			if d.A.X != 0 {
				t.Errorf("%s: baseline from %v, want the datum", tt.path, d.A.X)
			}
		}
	}
}

func TestSheetRefusesFailing(t *testing.T) {
	r := checkedJob(t, "../../testdata/jobs/us-single-angle.yaml")
	if r.Pass {
		t.Fatal("HB-7 passes; the test needs a failing job")
	}
	if _, err := NewSheet(r, false); !errors.Is(err, ErrRefused) {
		t.Fatalf("err %v, want ErrRefused", err)
	}
	s, err := NewSheet(r, true)
	if err != nil {
		t.Fatal(err)
	}
	for _, v := range s.Views {
		if !slices.ContainsFunc(v.Texts, func(x Text) bool { return x.Value == Stamp }) {
			t.Errorf("view %s not stamped", v.Part.Name)
		}
	}
}

func TestSheetTitleBlock(t *testing.T) {
	_, s := sheetOf(t, "../../testdata/jobs/si-double-angle.yaml")
	var all []string
	for _, x := range s.Texts {
		all = append(all, x.Value)
	}
	joined := strings.Join(all, "\n")
	for _, want := range []string{"TD-21.b", "2L100x75x8", "A572-50", "A36", "(3 EACH END) M20 A325M", "AISC 360-16 ASD",
		"MILLIMETRES", "MEMBER (EACH OF 2)", "22 DIA", "PUNCH", Stamp, "engineer of record"} {
		if !strings.Contains(joined, want) {
			t.Errorf("sheet text lacks %q", want)
		}
	}
	var labels []string
	for _, f := range s.Title {
		labels = append(labels, f[0])
	}
	if want := []string{"SCALE", "MARK", "QUANTITY", "MEMBER", "GRADE", "THICKNESS", "BOLTS", "STANDARD", "GOVERNING", "UNITS", "STATUS"}; !slices.Equal(labels, want) {
		t.Errorf("title block %q, want %q", labels, want)
	}
	if got := s.Title[2][1]; got != "1 (2 pieces each)" {
		t.Errorf("quantity %q", got)
	}
	if len(s.Schedule) != 3 || s.Schedule[1][0] != "MEMBER (EACH OF 2)" || s.Schedule[2][4] != `PUNCH (t 12, punch limit 23)` {
		t.Errorf("schedule %q", s.Schedule)
	}
	for _, x := range all {
		for _, r := range x {
			if r < 0x20 || r >= 0x7f {
				t.Errorf("non-ASCII text %q", x)
			}
		}
	}
}

func TestTextBox(t *testing.T) {
	// 4 characters of height 1 at charWidth 0.9: 3.6 wide; rotated a
	// quarter turn, the box stands upright and reaches left (−x).
	lo, hi := Text{Height: 1, Value: "ABCD", Align: AlignCenterBottom}.Box()
	if !near(lo.X, -1.8) || !near(hi.X, 1.8) || !near(lo.Y, 0) || !near(hi.Y, 1.3) {
		t.Errorf("box %v %v", lo, hi)
	}
	lo, hi = Text{Height: 1, Value: "ABCD", Align: AlignCenterBottom, Rotation: 90}.Box()
	if !near(lo.X, -1.3) || !near(hi.X, 0) || !near(lo.Y, -1.8) || !near(hi.Y, 1.8) {
		t.Errorf("rotated box %v %v", lo, hi)
	}
}

// titleField returns the value of a title block field.
func titleField(t *testing.T, s *Sheet, label string) string {
	t.Helper()
	for _, f := range s.Title {
		if f[0] == label {
			return f[1]
		}
	}
	t.Fatalf("no %s in the title block %q", label, s.Title)
	return ""
}

// A stamped sheet of a layout that fails a detailing rule says what fails,
// not only the governing limit state, which passes.
func TestSheetTitleNamesWhatFails(t *testing.T) {
	// TE-9: end distance 5/8 in < 1 in for a 3/4-in bolt (AISC 360-16
	// Table J3.4); every limit state passes.
	r, s := sheetOf(t, "../../testdata/batch/e-tight-edge.yaml")
	g := r.GoverningResult()
	if !g.Pass {
		t.Fatalf("TE-9: %s fails; the test needs a failing rule and passing limit states", g.ID)
	}
	if got := titleField(t, s, "GOVERNING"); !strings.HasSuffix(got, "FAIL: edge.min") || !strings.HasPrefix(got, g.ID) {
		t.Errorf("GOVERNING %q, want %s ... FAIL: edge.min", got, g.ID)
	}
	// Where the governing limit state fails, it is what the title names.
	_, s = sheetOf(t, "../../testdata/jobs/us-single-angle.yaml")
	if got := titleField(t, s, "GOVERNING"); !strings.HasPrefix(got, "bolts.shear") || !strings.HasSuffix(got, " - FAIL") {
		t.Errorf("GOVERNING %q, want bolts.shear ... - FAIL", got)
	}
}

// Thicknesses and the punch limit the shop compares them with are printed
// with their exact values where 1/16 in (1 mm) rounds them: a 0.9-in bar
// over the 7/8-in punch limit of a 3/4-in bolt does not read 7/8".
func TestSheetPrintsExactLimits(t *testing.T) {
	for _, tc := range []struct {
		name, yaml, made, thickness string
	}{
		{"us", `mark: TB-1
units: us
load:
  required: 20 kip
member:
  shape: flat
  width: 5 in
  thickness: 0.9 in
  grade: A36
  length: 4 ft
bolts:
  diameter: 3/4 in
  grade: A325
  per_line: 2
  pitch: 3 in
  end: 1-1/2 in
  gage: 2-1/2 in
`,
			// Punch limit d + 1/8 = 7/8 in (common practice, no source).
			`DRILL (t 7/8" (0.9 in), punch limit 7/8")`, `member 7/8" (0.9 in)`},
		{"si", `mark: TB-2
units: si
load:
  required: 100 kN
member:
  shape: flat
  width: 120 mm
  thickness: 23.4 mm
  grade: A36
  length: 1.2 m
bolts:
  diameter: M20
  grade: A325M
  per_line: 2
  pitch: 75 mm
  end: 40 mm
  gage: 60 mm
`,
			// Punch limit d + 3 mm = 23 mm (common practice, no source).
			`DRILL (t 23 (23.4 mm), punch limit 23)`, `member 23 (23.4 mm)`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, s := sheetOf(t, writeJob(t, tc.name+".yaml", tc.yaml))
			if got := s.Schedule[1][4]; got != tc.made {
				t.Errorf("MADE BY %q, want %q", got, tc.made)
			}
			if got := titleField(t, s, "THICKNESS"); got != tc.thickness {
				t.Errorf("THICKNESS %q, want %q", got, tc.thickness)
			}
		})
	}
}

func writeJob(t *testing.T, name, yaml string) string {
	t.Helper()
	p := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(p, []byte(yaml), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}
