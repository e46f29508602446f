package detail

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

func mustBuild(t *testing.T, j *jobfile.Job) *Design {
	t.Helper()
	d, err := Build(j)
	if err != nil {
		t.Fatalf("Build: %v", err)
	}
	return d
}

func buildErr(t *testing.T, src string) *jobfile.InputError {
	t.Helper()
	j := mustParse(t, src)
	_, err := Build(j)
	var ie *jobfile.InputError
	if !errors.As(err, &ie) {
		t.Fatalf("Build: %v (%T), want an *InputError", err, err)
	}
	return ie
}

type wantHole struct {
	id     string
	x, y   float64 // job units
	dx, dy float64 // job units
}

func checkHoles(t *testing.T, got []engine.Hole, want []wantHole, unit units.Length) {
	t.Helper()
	if len(got) != len(want) {
		t.Fatalf("%d holes, want %d: %+v", len(got), len(want), got)
	}
	u := float64(unit)
	for i, w := range want {
		g := got[i]
		if g.ID != w.id || !closeTo(float64(g.X)/u, w.x, 1e-12) || !closeTo(float64(g.Y)/u, w.y, 1e-12) ||
			!closeTo(float64(g.Dx)/u, w.dx, 1e-12) || !closeTo(float64(g.Dy)/u, w.dy, 1e-12) {
			t.Errorf("hole %d = %s (%g, %g) %g×%g, want %s (%g, %g) %g×%g", i, g.ID,
				float64(g.X)/u, float64(g.Y)/u, float64(g.Dx)/u, float64(g.Dy)/u, w.id, w.x, w.y, w.dx, w.dy)
		}
	}
}

// The US single angle of AISC Design Examples v15.0, Example D.2 (from
// memory): L4x4x1/2 A36, one line of (4) 3/4-in bolts at 3 in.
const usAngle = `mark: D2
load:
  dead: 20 kip
  live: 60 kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
  length: 10 ft
plate:
  thickness: 1/2 in
  grade: A572-50
  width: 12 in
  edge: 1-1/2 in
bolts:
  diameter: 3/4 in
  grade: A325
  per_line: 4
  pitch: 3 in
  end: 1-1/2 in
  gage: 2-1/2 in
`

func TestBuildUSSingleAngle(t *testing.T) {
	d := mustBuild(t, mustParse(t, usAngle))
	c := d.Conn
	// Holes: x = end + k·pitch, y = gage (SPEC §3); 13/16 in standard hole
	// for a 3/4-in bolt (AISC 360-22 Table J3.3).
	checkHoles(t, c.Holes, []wantHole{
		{"H1", 1.5, 2.5, 13.0 / 16, 13.0 / 16},
		{"H2", 4.5, 2.5, 13.0 / 16, 13.0 / 16},
		{"H3", 7.5, 2.5, 13.0 / 16, 13.0 / 16},
		{"H4", 10.5, 2.5, 13.0 / 16, 13.0 / 16},
	}, units.Inch)
	for _, h := range c.Holes {
		if h.Type != rules.Standard {
			t.Errorf("%s type %v", h.ID, h.Type)
		}
	}
	m := c.Member
	// Ag = 3.75 in², x̄ = 1.18 in: AISC Manual Table 1-7, L4x4x1/2 (AISC
	// Shapes Database v15.0, read); 1 % for the table's rounding.
	if ag := float64(m.Ag) / float64(units.SquareInch); !closeTo(ag, 3.75, 0.01) {
		t.Errorf("Ag = %g in², want 3.75", ag)
	}
	if !closeTo(m.Xbar.In(), 1.18, 0.01) {
		t.Errorf("x̄ = %g in, want 1.18", m.Xbar.In())
	}
	// Legs and thickness are the designation's (input read back).
	if m.Shape != engine.Angle || m.Pieces != 1 || !closeTo(m.Width.In(), 4, readBack) ||
		!closeTo(m.Outstanding.In(), 4, readBack) || !closeTo(m.T.In(), 0.5, readBack) {
		t.Errorf("member = %+v", m)
	}
	// A36: Fy 36, Fu 58 ksi (AISC Manual Table 2-3, from memory).
	if !closeTo(m.Fy.Ksi(), 36, 1e-9) || !closeTo(m.Fu.Ksi(), 58, 1e-9) {
		t.Errorf("Fy, Fu = %g, %g ksi", m.Fy.Ksi(), m.Fu.Ksi())
	}
	// Pu = 1.2D + 1.6L = 120 kips (ASCE 7 2.3.1; Example D.2, from memory).
	if !closeTo(c.Demand.Kip(), 120, 1e-9) || d.Combination == "" {
		t.Errorf("demand %g kip by %q, want 120 kip", c.Demand.Kip(), d.Combination)
	}
	// Plate: free edge at last bolt + edge = 10.5 + 1.5 in, centred on the
	// single gage line (SPEC §3).
	p := c.Plate
	if p == nil || !closeTo(p.FreeEdge.In(), 12, 1e-12) || !closeTo(p.YCentre.In(), 2.5, 1e-12) ||
		p.Kind != engine.Gusset || !closeTo(p.T.In(), 0.5, readBack) || !closeTo(p.Width.In(), 12, readBack) {
		t.Errorf("plate = %+v", p)
	}
	// A572 Gr 50: Fy 50, Fu 65 ksi (AISC Manual Table 2-3, from memory).
	if !closeTo(p.Fy.Ksi(), 50, 1e-9) || !closeTo(p.Fu.Ksi(), 65, 1e-9) {
		t.Errorf("plate Fy, Fu = %g, %g ksi", p.Fy.Ksi(), p.Fu.Ksi())
	}
	b := c.Bolt
	if !closeTo(b.D.In(), 0.75, readBack) || b.Grade.Name == "" || b.Joint != rules.Bearing || !b.DeformationConsidered {
		t.Errorf("bolt = %+v", b)
	}
	if c.Method != rules.LRFD || c.Edition == nil || c.Edition.Name() != "aisc360-22" || d.Job == nil {
		t.Errorf("method %v, edition %v", c.Method, c.Edition)
	}
	i := d.Info
	a, _ := section.Lookup("L4x4x1/2", units.US)
	if i.Designation != "L4x4x1/2" || i.K != a.K || i.Grade != "A36" || i.PlateGrade != "A572-50" || i.Weathering ||
		!closeTo(i.Length.In(), 120, readBack) || i.Rmin != a.Properties().Rmin {
		t.Errorf("info = %+v", i)
	}
	// rz = 0.776 in: AISC Manual Table 1-7 (AISC Shapes Database v15.0,
	// read), which the catalog carries.
	if !closeTo(i.Rmin.In(), 0.776, 0.015) {
		t.Errorf("rmin = %g in, want 0.776", i.Rmin.In())
	}
}

func TestBuildRequiredDemand(t *testing.T) {
	src := strings.Replace(usAngle, "  dead: 20 kip\n  live: 60 kip", "  required: 95 kip", 1)
	d := mustBuild(t, mustParse(t, src))
	if !closeTo(d.Conn.Demand.Kip(), 95, 1e-12) || d.Combination != "" {
		t.Errorf("demand %g kip by %q, want the 95 kip given", d.Conn.Demand.Kip(), d.Combination)
	}
}

func TestBuildSwappedSize(t *testing.T) {
	// L4x6x1/2: connect the 4-in leg of L6x4x1/2 (SPEC §3).
	src := strings.Replace(usAngle, "L4x4x1/2", "L4x6x1/2", 1)
	d := mustBuild(t, mustParse(t, src))
	m := d.Conn.Member
	if !closeTo(m.Width.In(), 4, readBack) || !closeTo(m.Outstanding.In(), 6, readBack) || d.Info.Designation != "L4x6x1/2" {
		t.Errorf("member %+v, designation %q", m, d.Info.Designation)
	}
	// L6x4x1/2: A = 4.75 in², y = 1.99 in (the centroid from the 4-in leg's
	// back, the eccentricity when that leg is bolted): AISC Manual Table
	// 1-7 (from memory); 1 % for rounding.
	if ag := float64(m.Ag) / float64(units.SquareInch); !closeTo(ag, 4.75, 0.01) {
		t.Errorf("Ag = %g in², want 4.75", ag)
	}
	if !closeTo(m.Xbar.In(), 1.99, 0.01) {
		t.Errorf("x̄ = %g in, want 1.99", m.Xbar.In())
	}
}

func TestBuildSIDoubleAngle(t *testing.T) {
	j, err := jobfile.LoadJob(filepath.Join("..", "testdata", "jobs", "si-double-angle.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	d := mustBuild(t, j)
	c := d.Conn
	// M20: 22 mm standard hole (AISC 360-16 Table J3.3M).
	checkHoles(t, c.Holes, []wantHole{
		{"H1", 40, 55, 22, 22}, {"H2", 110, 55, 22, 22}, {"H3", 180, 55, 22, 22},
	}, units.Millimetre)
	m := c.Member
	// L100x75x8: A = 13.5 cm² per angle (EN 10056-1, from memory), two
	// angles; 1 % for rounding.
	if m.Shape != engine.DoubleAngle || m.Pieces != 2 || !closeTo(float64(m.Ag), 2*1350, 0.01) {
		t.Errorf("member = %+v", m)
	}
	if !closeTo(m.Width.Mm(), 100, readBack) || !closeTo(m.Outstanding.Mm(), 75, readBack) {
		t.Errorf("legs %g, %g mm", m.Width.Mm(), m.Outstanding.Mm())
	}
	// Gap defaults to the plate thickness (SPEC §3).
	a, _ := section.Lookup("L100x75x8", units.SI)
	if d.Info.Rmin != a.Double(12).Rmin || d.Info.Designation != "2L100x75x8" {
		t.Errorf("info = %+v", d.Info)
	}
	// A572 Gr 50 in SI: Fy 345, Fu 450 MPa (ASTM A572M Gr 345, from memory).
	if !closeTo(float64(m.Fy), 345, 1e-9) || !closeTo(float64(m.Fu), 450, 1e-9) {
		t.Errorf("Fy, Fu = %g, %g MPa", float64(m.Fy), float64(m.Fu))
	}
	// ASD, D = 60, L = 110, S = 35 kN: D + L = 170 kN governs over
	// D + 0.75L + 0.75S = 168.75 (ASCE 7 2.4.1, arithmetic).
	if !closeTo(c.Demand.KN(), 170, 1e-9) {
		t.Errorf("demand = %g kN (%s), want 170", c.Demand.KN(), d.Combination)
	}
	if c.Method != rules.ASD || c.Edition.Name() != "aisc360-16" || c.Bolt.Threads != rules.ThreadsExcluded {
		t.Errorf("method %v, edition %s, threads %v", c.Method, c.Edition, c.Bolt.Threads)
	}
	if c.ShearPlanes() != 2 {
		t.Errorf("shear planes %d", c.ShearPlanes())
	}
}

func TestBuildDoubleAngleGapAndOverrides(t *testing.T) {
	src := strings.Replace(usAngle, "shape: angle", "shape: double-angle", 1)
	src = strings.Replace(src, "  length: 10 ft\n", "  length: 10 ft\n  area: 3.5 in2\n  xbar: 1.25 in\n", 1)
	d := mustBuild(t, mustParse(t, src))
	// Overrides are of one angle; the pair doubles the area (SPEC §3).
	if !closeTo(float64(d.Conn.Member.Ag)/float64(units.SquareInch), 7, 1e-12) || !closeTo(d.Conn.Member.Xbar.In(), 1.25, 1e-12) {
		t.Errorf("Ag %g in², x̄ %g in", float64(d.Conn.Member.Ag)/float64(units.SquareInch), d.Conn.Member.Xbar.In())
	}
	a, _ := section.Lookup("L4x4x1/2", units.US)
	if d.Info.Rmin != a.Double(units.Inch/2).Rmin {
		t.Errorf("rmin %g: want the pair's with the 1/2-in plate as gap", d.Info.Rmin.In())
	}
	// Without a plate the gap is 3/8 in (SPEC §3); with gap given, it.
	noPlate := strings.Replace(src, "plate:\n  thickness: 1/2 in\n  grade: A572-50\n  width: 12 in\n  edge: 1-1/2 in\n", "", 1)
	if d := mustBuild(t, mustParse(t, noPlate)); d.Info.Rmin != a.Double(units.Inch*3/8).Rmin || d.Conn.Plate != nil {
		t.Errorf("no plate: rmin %g", d.Info.Rmin.In())
	}
	gap := strings.Replace(src, "  xbar: 1.25 in\n", "  xbar: 1.25 in\n  gap: 1 in\n", 1)
	if d := mustBuild(t, mustParse(t, gap)); d.Info.Rmin != a.Double(units.Inch).Rmin {
		t.Errorf("gap 1 in: rmin %g", d.Info.Rmin.In())
	}
}

func TestBuildUSStaggeredFlat(t *testing.T) {
	j, err := jobfile.LoadJob(filepath.Join("..", "testdata", "jobs", "us-staggered-flat.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	d := mustBuild(t, j)
	c := d.Conn
	// Line i at y = gage + i·gage2, bolt k at end + k·pitch, odd lines
	// shifted by the stagger (SPEC §3); 7/8-in bolt: 15/16 in hole (AISC
	// 360-22 Table J3.3).
	const h = 15.0 / 16
	checkHoles(t, c.Holes, []wantHole{
		{"H1", 2, 2, h, h}, {"H2", 5, 2, h, h}, {"H3", 8, 2, h, h},
		{"H4", 3.5, 6, h, h}, {"H5", 6.5, 6, h, h}, {"H6", 9.5, 6, h, h},
	}, units.Inch)
	m := c.Member
	// Ag = 8 × 5/8 = 5 in², x̄ = 0 for a flat (arithmetic).
	if m.Shape != engine.Flat || !closeTo(float64(m.Ag)/float64(units.SquareInch), 5, 1e-12) || m.Xbar != 0 ||
		!closeTo(m.Width.In(), 8, readBack) || m.Outstanding != 0 || m.Pieces != 1 {
		t.Errorf("member = %+v", m)
	}
	// r of a rectangle about its minor axis = t/√12 (mechanics).
	if !closeTo(d.Info.Rmin.In(), 0.625/math.Sqrt(12), 1e-12) || d.Info.Designation != "PL 8x5/8" || d.Info.K != 0 {
		t.Errorf("info = %+v", d.Info)
	}
	// Explicit Fy/Fu: the input read back.
	if !closeTo(m.Fy.Ksi(), 50, 1e-12) || !closeTo(m.Fu.Ksi(), 65, 1e-12) || !strings.Contains(d.Info.Grade, "50") {
		t.Errorf("Fy %g Fu %g grade %q", m.Fy.Ksi(), m.Fu.Ksi(), d.Info.Grade)
	}
	// Plate: free edge 9.5 + 2 in, centred on the mean y = 4 in (SPEC §3).
	p := c.Plate
	if p.Kind != engine.Splice || !closeTo(p.FreeEdge.In(), 11.5, 1e-12) || !closeTo(p.YCentre.In(), 4, 1e-12) {
		t.Errorf("plate = %+v", p)
	}
	if c.Bolt.Joint != rules.Pretensioned || !closeTo(c.Demand.Kip(), 240, 1e-12) {
		t.Errorf("joint %v, demand %g", c.Bolt.Joint, c.Demand.Kip())
	}
}

func TestBuildSISlotted(t *testing.T) {
	j, err := jobfile.LoadJob(filepath.Join("..", "testdata", "jobs", "si-slotted.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	d := mustBuild(t, j)
	c := d.Conn
	// M20 short slot 22 × 26 mm (AISC 360-22 Table J3.3M); transverse: the
	// long axis runs across the load, along y.
	checkHoles(t, c.Holes, []wantHole{
		{"H1", 40, 65, 22, 26}, {"H2", 105, 65, 22, 26}, {"H3", 170, 65, 22, 26}, {"H4", 235, 65, 22, 26},
	}, units.Millimetre)
	for _, h := range c.Holes {
		if h.Type != rules.ShortSlot || h.Slot != rules.Transverse {
			t.Errorf("%s: %v %v", h.ID, h.Type, h.Slot)
		}
	}
	b := c.Bolt
	if b.Joint != rules.SlipCritical || b.Surface != rules.ClassB || b.Fillers != 1 || b.DeformationConsidered {
		t.Errorf("bolt = %+v", b)
	}
	// L120x80x10: A = 19.1 cm² (EN 10056-1, from memory); 1 %.
	if !closeTo(float64(c.Member.Ag), 1910, 0.01) || !closeTo(c.Member.Width.Mm(), 120, readBack) {
		t.Errorf("member = %+v", c.Member)
	}

	// Longitudinal: the long axis along the load, along x.
	j.Bolts.Slot = rules.Longitudinal
	d = mustBuild(t, j)
	if h := d.Conn.Holes[0]; h.Dx != 26 || h.Dy != 22 || h.Slot != rules.Longitudinal {
		t.Errorf("longitudinal slot: %+v", h)
	}
	// A slot direction on a round hole is ignored.
	j.Bolts.Hole = rules.Oversized
	d = mustBuild(t, j)
	// M20 oversized: 24 mm (AISC 360-22 Table J3.3M).
	if h := d.Conn.Holes[0]; h.Dx != 24 || h.Dy != 24 || h.Slot != rules.Transverse {
		t.Errorf("oversized: %+v", h)
	}
}

func TestBuildExplicitHoles(t *testing.T) {
	src := minimalUS + `bolts:
  diameter: 3/4 in
  grade: A325
  hole: short-slot
holes:
  - [4.5 in, 2.5 in]
  - [1.5 in, 2.5 in]
  - [3 in, 1-1/4 in]
`
	d := mustBuild(t, mustParse(t, src))
	// 3/4-in short slot 13/16 × 1 in (AISC 360-22 Table J3.3), transverse
	// by default; ids follow the order given.
	checkHoles(t, d.Conn.Holes, []wantHole{
		{"H1", 4.5, 2.5, 13.0 / 16, 1}, {"H2", 1.5, 2.5, 13.0 / 16, 1}, {"H3", 3, 1.25, 13.0 / 16, 1},
	}, units.Inch)
	if d.Conn.Plate != nil || !closeTo(d.Conn.Demand.Kip(), 95, 1e-12) {
		t.Errorf("plate %v, demand %g", d.Conn.Plate, d.Conn.Demand.Kip())
	}
}

func TestBuildCustomAngle(t *testing.T) {
	src := `mark: C1
load: {required: 40 kip}
member:
  shape: angle
  legs: [5 in, 3 in]
  thickness: 3/8 in
  fy: 50 ksi
  fu: 65 ksi
bolts: {diameter: 3/4 in, grade: A325, per_line: 3, pitch: 3 in, end: 1-1/2 in, gage: 3 in}
`
	d := mustBuild(t, mustParse(t, src))
	m := d.Conn.Member
	// Plain section: (5 + 3 − 3/8)·3/8 = 2.859 in² (arithmetic; AISC
	// Manual Table 1-7 prints 2.86 for L5x3x3/8, AISC Shapes Database v15.0).
	if !closeTo(float64(m.Ag)/float64(units.SquareInch), (5+3-0.375)*0.375, 1e-9) {
		t.Errorf("Ag = %g in²", float64(m.Ag)/float64(units.SquareInch))
	}
	if d.Info.Designation != "L5x3x3/8" || d.Info.K != m.T || !closeTo(m.Width.In(), 5, readBack) {
		t.Errorf("info %+v, member %+v", d.Info, m)
	}
}

// A layout that can be made but breaks a detailing rule is a result, not
// bad input: 3/4 in to the end is under Table J3.4's 1 in, yet the hole
// (13/32 in radius) is inside the member.
func TestBuildRuleBreakIsNotInputError(t *testing.T) {
	src := strings.Replace(usAngle, "end: 1-1/2 in", "end: 3/4 in", 1)
	src = strings.Replace(src, "pitch: 3 in", "pitch: 1 in", 1)
	mustBuild(t, mustParse(t, src))
}

func TestBuildErrors(t *testing.T) {
	cases := []struct {
		name, src, field string
		line             int
		msg              string
	}{
		{"pitch missing", strings.Replace(usAngle, "  pitch: 3 in\n", "", 1), "bolts.pitch", 15, "is required"},
		{"per_line missing", strings.Replace(usAngle, "  per_line: 4\n", "", 1), "bolts.per_line", 15, "is required"},
		{"diameter missing", strings.Replace(usAngle, "  diameter: 3/4 in\n", "", 1), "bolts.diameter", 15, "is required"},
		{"bolts missing", minimalUS, "bolts.diameter", 1, "is required"},
		{"gage2 missing", strings.Replace(usAngle, "  gage: 2-1/2 in", "  gage: 1-1/4 in\n  lines: 2", 1), "bolts.gage2", 15, "is required"},
		{"second line off the leg", strings.Replace(usAngle, "  gage: 2-1/2 in", "  gage: 1-1/4 in\n  lines: 2\n  gage2: 2-1/2 in", 1), "bolts.gage2", 23, "runs off the leg"},
		{"plate edge missing", strings.Replace(usAngle, "  edge: 1-1/2 in\n", "", 1), "plate.edge", 10, "is required"},
		{"hole off the flat", `mark: F
load: {required: 10 kip}
member: {shape: flat, width: 3 in, thickness: 1/2 in, grade: A36}
bolts: {diameter: 3/4 in, grade: A325, per_line: 2, pitch: 3 in, end: 1-1/2 in, gage: 1/4 in}
`, "bolts.gage", 4, "runs off the flat"},
		{"bolt wider than the flat", `mark: F
load: {required: 10 kip}
member: {shape: flat, width: 1 in, thickness: 1/2 in, grade: A36}
bolts: {diameter: 1 in, grade: A325, per_line: 2, pitch: 3 in, end: 1-1/2 in, gage: 1/2 in}
`, "bolts.diameter", 4, "does not fit the flat"},
		{"explicit hole past the end", minimalUS + "bolts: {diameter: 3/4 in, grade: A325}\nholes:\n  - [1.5 in, 2.5 in]\n  - [0.25 in, 2.5 in]\n", "holes[1]", 11, "past the member end"},
		{"unknown plate grade", strings.Replace(usAngle, "A572-50", "S355", 1), "plate.grade", 12, "unknown steel grade"},
		{"unknown bolt grade", strings.Replace(usAngle, "grade: A325", "grade: 8.8", 1), "bolts.grade", 17, "unknown bolt grade"},
		{"stock grade", usAngle + "stock:\n  grades: [A325, A999]\n", "stock.grades[1]", 23, "unknown bolt grade"},
		{"stock diameter", usAngle + "stock:\n  diameters: [3/4 in, M14]\n", "stock.diameters[1]", 23, "no hole size"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			e := buildErr(t, c.src)
			if e.Field != c.field || e.Line != c.line || !strings.Contains(e.Msg, c.msg) {
				t.Errorf("got %s:%d %q, want %s:%d containing %q", e.Field, e.Line, e.Msg, c.field, c.line, c.msg)
			}
		})
	}
}

// Good jobs under testdata/jobs build without error.
func TestBuildGoodJobs(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "testdata", "jobs", "*.yaml"))
	if err != nil || len(files) < 4 {
		t.Fatalf("good jobs: %v, %v", files, err)
	}
	for _, f := range files {
		t.Run(filepath.Base(f), func(t *testing.T) {
			j, err := jobfile.LoadJob(f)
			if err != nil {
				t.Fatal(err)
			}
			d, err := Build(j)
			if err != nil {
				t.Fatal(err)
			}
			if len(d.Conn.Holes) == 0 || d.Conn.Demand <= 0 && d.Conn.Compression <= 0 || d.Conn.Member.Ag <= 0 {
				t.Errorf("incomplete design: %+v", d.Conn)
			}
		})
	}
}

// Every bad job under testdata/bad is an *InputError naming the field and,
// where the YAML has one, the line — whether parsing, Build or CheckJob
// finds it.
func TestBuildBadJobs(t *testing.T) {
	cases := []struct {
		file  string
		field string
		line  int // 0: the file has no line to name; -1: any line > 0
	}{
		{"absurd-count.yaml", "bolts.per_line", 11},
		{"absurd-lines.yaml", "bolts.lines", 13},
		{"alias.yaml", "mark", 1},
		{"bolt-too-big.yaml", "bolts.diameter", 10},
		{"broken-yaml.yaml", "", -1},
		{"comment-only.yaml", "", 0},
		{"duplicate-key.yaml", "bolts.pitch", 15},
		{"eccentricity-on-angle.yaml", "member.eccentricity", 8},
		{"empty.yaml", "", 0},
		{"explicit-duplicate.yaml", "holes[2]", 14},
		{"explicit-off-member.yaml", "holes[2]", 14},
		{"filler-absurd.yaml", "bolts.filler_thickness", 15},
		{"filler-negative.yaml", "bolts.filler_thickness", 15},
		{"filler-without-fillers.yaml", "bolts.filler_thickness", 16},
		{"flat-with-size.yaml", "member.size", 6},
		{"fu-below-fy.yaml", "member.fu", 8},
		{"hole-not-a-pair.yaml", "holes[1]", 13},
		{"hole-off-leg.yaml", "bolts.gage", 14},
		{"hole-past-end.yaml", "bolts.end", 13},
		{"holes-plus-pitch.yaml", "bolts.pitch", 11},
		{"legs-bad-unit.yaml", "member.legs[1]", 6},
		{"load-wrong-dimension.yaml", "load.required", 3},
		{"m14-bolt.yaml", "bolts.diameter", 10},
		{"missing-mark.yaml", "mark", 1},
		{"nan.yaml", "bolts.end", 13},
		{"negative-pitch.yaml", "bolts.pitch", 12},
		{"pitch-absurdly-small.yaml", "bolts.pitch", 12},
		{"xbar-outside-angle.yaml", "member.xbar", 8},
		{"area-outside-angle.yaml", "member.area", 8},
		{"not-a-mapping.yaml", "", 1},
		{"plate-auto-in-check.yaml", "plate.thickness", 9},
		{"plate-hole-unknown.yaml", "plate.hole", 13},
		{"plate-slot-unknown.yaml", "plate.slot", 14},
		{"member-slot-round-hole.yaml", "member.slot", 10},
		{"plate-slot-off-plate.yaml", "plate.width", 14},
		{"plate-too-narrow.yaml", "plate.width", 12},
		{"required-and-dead.yaml", "load.required", 3},
		{"typo-key.yaml", "bolts.pich", 12},
		{"unknown-bolt-grade.yaml", "bolts.grade", 10},
		{"unknown-shape.yaml", "member.shape", 5},
		{"unknown-size.yaml", "member.size", 6},
		{"unknown-standard.yaml", "standard", 2},
		{"unknown-steel-grade.yaml", "member.grade", 7},
		{"a307-slip-critical.yaml", "bolts.grade", 11},
		{"unsafe-mark.yaml", "mark", 1},
		{"wrong-dimension.yaml", "member.thickness", 7},
		{"zero-quantity.yaml", "quantity", 2},
		{"outline-hole-outside.yaml", "plate.outline", 12},
		{"outline-no-area.yaml", "plate.outline[2]", 12},
		{"outline-crossing.yaml", "plate.outline[3]", 16},
		{"outline-two-points.yaml", "plate.outline[1]", 12},
		{"outline-with-width.yaml", "plate.width", 12},
		{"outline-clip-too-big.yaml", "plate.clip[0].size", 14},
		{"plate-length-short.yaml", "plate.length", 14},
		{"far-end-no-pitch.yaml", "member.far_end.bolts.pitch", 10},
		{"far-end-overlap.yaml", "member.length", 11},
		{"far-end-unknown.yaml", "member.far_end", 9},
		{"project-unknown-key.yaml", "project.sheet", 4},
	}
	dir := filepath.Join("..", "testdata", "bad")
	listed := map[string]bool{}
	for _, c := range cases {
		listed[c.file] = true
		t.Run(c.file, func(t *testing.T) {
			path := filepath.Join(dir, c.file)
			j, err := jobfile.LoadJob(path)
			if err == nil {
				_, err = CheckJob(j) // Build, and the ends' fit (ends.go)
			}
			var ie *jobfile.InputError
			if !errors.As(err, &ie) {
				t.Fatalf("got %v (%T), want an *InputError", err, err)
			}
			if ie.File != path || ie.Field != c.field || ie.Msg == "" {
				t.Errorf("got %q field %q (%v), want field %q", ie.File, ie.Field, ie, c.field)
			}
			if (c.line >= 0 && ie.Line != c.line) || (c.line < 0 && ie.Line <= 0) {
				t.Errorf("line %d, want %d (%v)", ie.Line, c.line, ie)
			}
		})
	}
	entries, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range entries {
		if !listed[e.Name()] {
			t.Errorf("%s is not in the table", e.Name())
		}
	}
}

func TestBuildDoubleAngleSizePrefix(t *testing.T) {
	// "2L4x4x1/2" is the usual way to write a pair (AISC Manual Table 1-15
	// designations); the catalog size is L4x4x1/2.
	src := strings.Replace(usAngle, "shape: angle\n  size: L4x4x1/2", "shape: double-angle\n  size: 2L4x4x1/2", 1)
	d := mustBuild(t, mustParse(t, src))
	if d.Info.Designation != "2L4x4x1/2" || d.Conn.Member.Pieces != 2 {
		t.Errorf("designation %q, pieces %d", d.Info.Designation, d.Conn.Member.Pieces)
	}
}

func TestBuildFillers(t *testing.T) {
	src := strings.Replace(usAngle, "  gage: 2-1/2 in\n", "  gage: 2-1/2 in\n  fillers: 1\n  filler_thickness: 1/2 in\n", 1)
	d := mustBuild(t, mustParse(t, src))
	if b := d.Conn.Bolt; !closeTo(b.FillerT.In(), 0.5, 1e-12) || b.FillerDeveloped || b.Fillers != 1 {
		t.Errorf("bolt = %+v", b)
	}
	d = mustBuild(t, mustParse(t, src+"  filler_developed: true\n"))
	if !d.Conn.Bolt.FillerDeveloped {
		t.Errorf("bolt = %+v, want developed fillers", d.Conn.Bolt)
	}
}

// lengthJob writes every length field a checked job may have, one per
// line; lengthFields lists them with their lines.
const lengthJob = `mark: LEN-1
load:
  required: 95 kip
member:
  shape: double-angle
  size: L4x4x1/2
  grade: A36
  length: 10 ft
  xbar: 1.18 in
  rmin: 0.776 in
  gap: 1/2 in
  area: 3.75 in2
plate:
  thickness: 1/2 in
  grade: A572-50
  width: 12 in
  edge: 1-1/2 in
bolts:
  diameter: 3/4 in
  grade: A325
  fillers: 1
  filler_thickness: 1/4 in
  lines: 2
  per_line: 3
  pitch: 3 in
  end: 1-1/2 in
  gage: 1-1/4 in
  gage2: 1-1/2 in
  stagger: 1 in
stock:
  step: 1/4 in
  thicknesses: [3/8 in]
tolerance:
  position: 1/16 in
  diameter: 1/32 in
`

// setLine replaces the value on line n (1-based) of src.
func setLine(src string, n int, value string) string {
	lines := strings.Split(src, "\n")
	l := lines[n-1]
	if strings.HasSuffix(l, "]") {
		lines[n-1] = l[:strings.Index(l, "[")+1] + value + "]"
	} else {
		lines[n-1] = l[:strings.Index(l, ": ")+2] + value
	}
	return strings.Join(lines, "\n")
}

// Every length field that is zero (where zero is not allowed), negative,
// absurdly small or absurdly large is refused as that field, on its line,
// whether parsing or Build finds it. A pitch of 1e-300 in once came out as
// "bolts.end: hole H2 has the same centre as H1".
func TestLengthFieldsNameThemselves(t *testing.T) {
	mustBuild(t, mustParse(t, lengthJob))
	fields := []struct {
		path     string
		line     int
		zeroOK   bool
		area     bool
		flatLegs bool
	}{
		{"member.length", 8, false, false, false},
		{"member.xbar", 9, false, false, false},
		{"member.rmin", 10, false, false, false},
		{"member.gap", 11, false, false, false},
		{"member.area", 12, false, true, false},
		{"plate.thickness", 14, false, false, false},
		{"plate.width", 16, false, false, false},
		{"plate.edge", 17, false, false, false},
		{"bolts.filler_thickness", 22, true, false, false},
		{"bolts.pitch", 25, false, false, false},
		{"bolts.end", 26, false, false, false},
		{"bolts.gage", 27, false, false, false},
		{"bolts.gage2", 28, false, false, false},
		{"bolts.stagger", 29, true, false, false},
		{"stock.step", 31, false, false, false},
		{"stock.thicknesses[0]", 32, false, false, false},
		{"tolerance.position", 34, false, false, false},
		{"tolerance.diameter", 35, false, false, false},
	}
	for _, f := range fields {
		unit := " in"
		if f.area {
			unit = " in2"
		}
		values := []string{"1e-300", "-2", "1e6", "1e-9"}
		if !f.zeroOK {
			values = append(values, "0")
		}
		for _, v := range values {
			t.Run(f.path+"="+v, func(t *testing.T) {
				src := setLine(lengthJob, f.line, v+unit)
				j, err := jobfile.ParseJob("len.yaml", []byte(src))
				if err == nil {
					_, err = Build(j)
				}
				var ie *jobfile.InputError
				if !errors.As(err, &ie) {
					t.Fatalf("got %v, want an *InputError at %s", err, f.path)
				}
				if ie.File != "len.yaml" || ie.Field != f.path || ie.Line != f.line || ie.Msg == "" {
					t.Errorf("got %v (field %q, line %d), want field %q on line %d", ie, ie.Field, ie.Line, f.path, f.line)
				}
			})
		}
	}
}

// The same for the member's own dimensions and explicit holes.
func TestDimensionFieldsNameThemselves(t *testing.T) {
	legs := `mark: LEN-2
load: {required: 95 kip}
member:
  shape: angle
  legs: [4 in, 3 in]
  thickness: 1/2 in
  grade: A36
bolts: {diameter: 3/4 in, grade: A325}
holes:
  - [1.5 in, 2.5 in]
  - [4.5 in, 2.5 in]
`
	flat := `mark: LEN-3
load: {required: 95 kip}
member:
  shape: flat
  width: 6 in
  thickness: 1/2 in
  grade: A36
bolts: {diameter: 3/4 in, grade: A325, per_line: 2, pitch: 3 in, end: 1-1/2 in, gage: 3 in}
`
	mustBuild(t, mustParse(t, legs))
	mustBuild(t, mustParse(t, flat))
	cases := []struct {
		src, from, path string
		line            int
	}{
		{legs, "[4 in, 3 in]", "member.legs[0]", 5},
		{legs, "3 in]", "member.legs[1]", 5},
		{legs, "thickness: 1/2 in", "member.thickness", 6},
		{legs, "[4.5 in, 2.5 in]", "holes[1]", 11},
		{flat, "width: 6 in", "member.width", 5},
		{flat, "thickness: 1/2 in", "member.thickness", 6},
	}
	for _, c := range cases {
		for _, v := range []string{"1e-300 in", "0", "-2 in", "1e6 in"} {
			t.Run(c.path+"="+v, func(t *testing.T) {
				to := strings.NewReplacer("[4 in", "["+v, "3 in]", v+"]", "1/2 in", v, "6 in", v, "[4.5 in", "["+v).Replace(c.from)
				src := strings.Replace(c.src, c.from, to, 1)
				j, err := jobfile.ParseJob("dim.yaml", []byte(src))
				if err == nil {
					_, err = Build(j)
				}
				var ie *jobfile.InputError
				if !errors.As(err, &ie) {
					t.Fatalf("got %v, want an *InputError at %s", err, c.path)
				}
				if ie.Field != c.path || ie.Line != c.line {
					t.Errorf("got %v (field %q, line %d), want field %q on line %d", ie, ie.Field, ie.Line, c.path, c.line)
				}
			})
		}
	}
}

// Section overrides that no angle of the member's legs and thickness can
// have are refused as their field, on their line: x̄ between t/2 and half
// the outstanding leg, the area at most the legs' and the largest fillet's,
// rmin between t/√12 and half the shorter leg (section.Bounds). An area
// below the angle's own (a section loss) passes down to half of it.
func TestBuildSectionOverridesBounded(t *testing.T) {
	// usAngle's member block ends on line 9 (length: 10 ft); the override
	// goes on line 10.
	override := func(src, kv string) string {
		return strings.Replace(src, "  length: 10 ft\n", "  length: 10 ft\n  "+kv+"\n", 1)
	}
	double := strings.Replace(usAngle, "shape: angle", "shape: double-angle", 1)
	swapped := strings.Replace(usAngle, "size: L4x4x1/2", "size: L4x6x1/2", 1)
	custom := strings.Replace(usAngle, "  size: L4x4x1/2\n", "  legs: [4 in, 3 in]\n  thickness: 1/2 in\n", 1)
	si := `mark: S1
units: si
load: {required: 300 kN}
member:
  shape: angle
  size: L100x100x10
  grade: A572-50
  length: 3 m
bolts: {diameter: M20, grade: A325M, per_line: 3, pitch: 70 mm, end: 40 mm, gage: 55 mm}
`
	cases := []struct {
		name, src, kv, field string
		line                 int
		msg                  string
	}{
		{"xbar 100 in", usAngle, "xbar: 100 in", "member.xbar", 10, "is not the x̄ of an L4x4x1/2"},
		{"xbar the leg", usAngle, "xbar: 4 in", "member.xbar", 10, "between 0.25 in"},
		{"xbar below t/2", usAngle, "xbar: 0.2 in", "member.xbar", 10, "x̄"},
		{"xbar in mm for an inch job", usAngle, "xbar: 30", "member.xbar", 10, "and 2 in (half the outstanding leg)"},
		{"xbar of the pair", double, "xbar: 2.5 in", "member.xbar", 10, "x̄"},
		{"xbar of the other leg", swapped, "xbar: 3.5 in", "member.xbar", 10, "L4x6x1/2"},
		{"xbar past the custom leg", custom, "xbar: 1.6 in", "member.xbar", 11, "half the outstanding leg"},
		{"area 10x", usAngle, "area: 37.5 in2", "member.area", 10, "at most 6.44 in2"},
		{"area of the pair", double, "area: 7.5 in2", "member.area", 10, "is more than one L4x4x1/2 can have: its legs make 3.75 in2"},
		{"area in mm2 as in2", usAngle, "area: 2419", "member.area", 10, ""},
		{"area too small", usAngle, "area: 1.8 in2", "member.area", 10, "under half the area"},
		{"rmin the leg", usAngle, "rmin: 4 in", "member.rmin", 10, "least radius of gyration"},
		{"rmin below t/sqrt12", usAngle, "rmin: 0.1 in", "member.rmin", 10, ""},
		{"si xbar in cm", si, "xbar: 2.82", "member.xbar", 9, "5 mm"},
		{"si area in cm2", si, "area: 19.2", "member.area", 9, "its legs make 1900 mm2"},
		{"si rmin 300 mm", si, "rmin: 300 mm", "member.rmin", 9, ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			src := override(c.src, c.kv)
			if c.src == si {
				src = strings.Replace(si, "  length: 3 m\n", "  length: 3 m\n  "+c.kv+"\n", 1)
			}
			e := buildErr(t, src)
			if e.Field != c.field || e.Line != c.line || !strings.Contains(e.Msg, c.msg) {
				t.Errorf("got %s:%d %q, want %s:%d containing %q", e.Field, e.Line, e.Msg, c.field, c.line, c.msg)
			}
		})
	}
	// Published values pass: AISC Manual Table 1-7, L4x4x1/2, A 3.75 in²,
	// x̄ 1.18 in, rz 0.776 in; EN 10056-1 L100x100x10, A 19.2 cm², e 2.82 cm,
	// iv 1.95 cm (AISC Shapes Database v15.0, read; EN from memory).
	mustBuild(t, mustParse(t, override(usAngle, "area: 3.75 in2\n  xbar: 1.18 in\n  rmin: 0.776 in")))
	mustBuild(t, mustParse(t, override(usAngle, "area: 1.9 in2")))
	mustBuild(t, mustParse(t, strings.Replace(si, "  length: 3 m\n", "  length: 3 m\n  area: 19.2 cm2\n  xbar: 28.2 mm\n  rmin: 19.5 mm\n", 1)))
}

// No angle of the catalogs, connected by either leg, single or double, has
// its own properties (within the 0.5 % of a rounded table) refused as
// overrides.
func TestBuildOverridesNeverRefuseACatalogAngle(t *testing.T) {
	n := 0
	for _, sys := range []units.System{units.US, units.SI} {
		for _, name := range section.Names(sys) {
			a, err := section.Lookup(name, sys)
			if err != nil {
				t.Fatal(err)
			}
			for _, swap := range []bool{false, true} {
				c, size := a, name
				if swap {
					c, size = a.Swapped(), swapName(name)
				}
				p := c.Properties()
				for _, k := range []float64{0.995, 1.005} {
					for _, shape := range []string{"angle", "double-angle"} {
						src := overrideJob(sys, shape, size, c, p, k)
						j, err := jobfile.ParseJob("catalog.yaml", []byte(src))
						if err != nil {
							t.Fatalf("%s: %v\n%s", size, err, src)
						}
						if _, err := Build(j); err != nil {
							t.Errorf("%s %s ×%g: %v", shape, size, k, err)
						}
						n++
					}
				}
			}
		}
	}
	if n < 800 {
		t.Errorf("%d jobs built", n)
	}
}

// overrideJob is a job for angle size of sys with its properties p, times
// k, given as overrides, and two bolts on the connected leg's centre line.
func overrideJob(sys units.System, shape, size string, a section.Angle, p section.Props, k float64) string {
	mm := func(l units.Length) string { return strconv.FormatFloat(float64(l)*k, 'g', 10, 64) + " mm" }
	bolt, grade, steel := "3/4 in", "A325", "A36"
	if sys == units.SI {
		bolt, grade, steel = "M20", "A325M", "A572-50"
	}
	return "mark: C1\nunits: " + sys.String() + "\nload: {required: 10 kN}\nmember:\n  shape: " + shape + "\n  size: " + size +
		"\n  grade: " + steel + "\n  area: " + strconv.FormatFloat(float64(p.Area)*k, 'g', 10, 64) + " mm2\n  xbar: " + mm(p.Xbar) +
		"\n  rmin: " + mm(p.Rmin) + "\nbolts: {diameter: " + bolt + ", grade: " + grade + ", per_line: 2, pitch: 80 mm, end: 40 mm, gage: " + mm(a.A/2/units.Length(k)) + "}\n"
}
