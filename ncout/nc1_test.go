package ncout_test

import (
	"bytes"
	"math"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/sheet"
	"gaugeline/engine"
	"gaugeline/ncout"
	"gaugeline/ncout/internal/nc1check"
)

// The NC1 layout tested here is from memory of the standard (DSTV,
// "Standard Description for Steel Structure Pieces for the Numerical
// Controls", 7th edition, July 1998): see ncout's doc.go.

type written struct {
	path  string
	r     *detail.Report
	s     *sheet.Sheet
	files []ncout.File
}

// everyJob writes the NC1 files of every testdata job that passes and
// gives member.length (a cut sheet needs it).
func everyJob(t *testing.T) []written {
	t.Helper()
	var paths []string
	for _, g := range []string{"../testdata/jobs/*.yaml", "../testdata/examples/*.yaml"} {
		ps, _ := filepath.Glob(g)
		paths = append(paths, ps...)
	}
	var out []written
	for _, p := range paths {
		r, err := detail.CheckFile(p)
		if err != nil || !r.Pass || r.Design.MemberLength() == 0 {
			continue
		}
		r.Design.Job.Stamp = "gaugeline test; check; input sha256 00" // as cmd sets it before drawing
		s, err := sheet.NewSheet(r, false)
		if err != nil {
			t.Fatalf("%s: %v", p, err)
		}
		fs, err := ncout.Files(r, s)
		if err != nil {
			t.Fatalf("%s: %v", p, err)
		}
		out = append(out, written{p, r, s, fs})
	}
	if len(out) < 8 {
		t.Fatalf("only %d testdata jobs make NC1 files", len(out))
	}
	return out
}

func parse(t *testing.T, f ncout.File) *nc1check.File {
	t.Helper()
	nc, err := nc1check.Parse(f.Data)
	if err != nil {
		t.Fatalf("%s: %v\n%s", f.Name, err, f.Data)
	}
	return nc
}

// Every file of every job keeps the layout (nc1check), names its piece
// mark in the header (field 4) and in a comment, carries the stamp on its
// second line, and gives the member's cut length in mm.
func TestEveryFileKeepsTheLayout(t *testing.T) {
	shapes := map[string]bool{}
	for _, w := range everyJob(t) {
		if len(w.files) == 0 || !strings.HasSuffix(w.files[0].Name, "-member.nc1") {
			t.Fatalf("%s: files %v", w.path, names(w.files))
		}
		shapes[w.r.Design.Conn.Member.Shape.String()] = true
		for _, f := range w.files {
			nc := parse(t, f)
			mark := strings.TrimSuffix(f.Name, ncout.Ext)
			if nc.Header[3] != mark {
				t.Errorf("%s: piece mark %q, want %q", f.Name, nc.Header[3], mark)
			}
			if !slices.Contains(nc.Comments, "piece "+mark) {
				t.Errorf("%s: no comment names the piece: %q", f.Name, nc.Comments)
			}
			if lines := strings.Split(string(f.Data), "\n"); lines[1] != ncout.StampComment+w.s.Stamp {
				t.Errorf("%s: line 2 %q is not the stamp", f.Name, lines[1])
			}
		}
		nc := parse(t, w.files[0])
		// Internal lengths are mm: the job's length read back.
		if got, want := nc.Number(8), float64(w.r.Design.MemberLength()); math.Abs(got-want) > 1e-3 {
			t.Errorf("%s: length %.4f mm, want %.4f", w.path, got, want)
		}
	}
	for _, s := range []string{"angle", "double-angle", "flat", "wt", "channel", "w"} {
		if !shapes[s] {
			t.Errorf("no testdata job of shape %s made an NC1 file", s)
		}
	}
}

func names(fs []ncout.File) []string {
	var out []string
	for _, f := range fs {
		out = append(out, f.Name)
	}
	return out
}

// want is a hole the design asks for, in mm on an NC1 face.
type want struct {
	face       byte
	x, y, d    float64
	ex, ey     float64
	slot       bool
	designedAs string
}

// designHoles are the member's holes from the design (both ends, the
// engine's frame, mm) on the faces doc.go's table gives each shape.
func designHoles(w written, opposite bool) []want {
	d := w.r.Design
	m := d.Conn.Member
	faces, mirror := []byte{'v'}, 0.0
	switch m.Shape {
	case engine.Tee:
		faces = []byte{'o'}
	case engine.Wide:
		faces, mirror = []byte{'o', 'u'}, float64(m.Width)
	}
	L := float64(d.MemberLength())
	var out []want
	for _, f := range faces {
		for _, h := range append(d.Conn.Holes[:len(d.Conn.Holes):len(d.Conn.Holes)], w.r.FarHoles()...) {
			x, y := float64(h.X), float64(h.Y)
			if opposite {
				x = L - x
			}
			if f == 'u' {
				y = mirror - y
			}
			dd := float64(min(h.Dx, h.Dy))
			wh := want{face: f, x: x, y: y, d: dd, designedAs: h.ID}
			if h.Type.IsSlot() {
				wh.slot, wh.ex, wh.ey = true, float64(h.Dx)-dd, float64(h.Dy)-dd
			}
			out = append(out, wh)
		}
	}
	return out
}

// matchHoles pairs every design hole with one read back within 1e-3 mm
// (the done-when: the round trip gives back every hole).
func matchHoles(t *testing.T, name string, wants []want, got []nc1check.Hole) {
	t.Helper()
	if len(got) != len(wants) {
		t.Errorf("%s: %d holes read back, the design has %d", name, len(got), len(wants))
	}
	const tol = 1e-3
	used := make([]bool, len(got))
	for _, w := range wants {
		found := false
		for i, g := range got {
			if used[i] || g.Face != w.face || g.Slot != w.slot || math.Abs(g.X-w.x) > tol || math.Abs(g.Y-w.y) > tol ||
				math.Abs(g.D-w.d) > tol || math.Abs(g.Ex-w.ex) > tol || math.Abs(g.Ey-w.ey) > tol {
				continue
			}
			if g.Slot && (g.Depth != 0 || g.Angle != 0) {
				t.Errorf("%s: slot %+v: depth and angle not 0", name, g)
			}
			used[i], found = true, true
			break
		}
		if !found {
			t.Errorf("%s: hole %s (%c %.4f, %.4f, d %.4f, slot %v %.4f %.4f) not read back", name, w.designedAs, w.face, w.x, w.y, w.d, w.slot, w.ex, w.ey)
		}
	}
}

// The member's file read back gives every hole of the design, both
// ends, within 1e-3 mm; a pair's opposite hand, written apart, its holes
// turned end for end.
func TestMemberRoundTripGivesBackEveryHole(t *testing.T) {
	slots := 0
	for _, w := range everyJob(t) {
		nc := parse(t, w.files[0])
		wants := designHoles(w, false)
		matchHoles(t, w.files[0].Name, wants, nc.Holes)
		for _, h := range nc.Holes {
			if h.Slot {
				slots++
			}
		}
		if len(w.files) > 1 && strings.HasSuffix(w.files[1].Name, "-member-opp.nc1") {
			matchHoles(t, w.files[1].Name, designHoles(w, true), parse(t, w.files[1]).Holes)
		}
	}
	if slots == 0 {
		t.Error("no testdata job wrote a slot: the slot's fields went untested")
	}
}

// A plate's file gives back every hole of the plate's part as the sheet
// lays it out (the plate frame, from its datum corner), in mm, and its
// contour closed.
func TestPlateRoundTrip(t *testing.T) {
	plates := 0
	for _, w := range everyJob(t) {
		for i := range w.s.Views {
			p := &w.s.Views[i].Part
			if p.Name == "member" {
				continue
			}
			plates++
			f := find(t, w.files, w.s.Mark+"-"+p.Name+ncout.Ext)
			nc := parse(t, f)
			k := 1.0
			if w.s.Units.String() == "us" {
				k = 25.4
			}
			lo, _ := p.Bounds()
			var wants []want
			for _, h := range p.Holes {
				dd := h.Diameter() * k
				wh := want{face: 'v', x: (h.Centre.X - lo.X) * k, y: (h.Centre.Y - lo.Y) * k, d: dd, designedAs: h.ID}
				if !h.Round() {
					wh.slot, wh.ex, wh.ey = true, h.Dx*k-dd, h.Dy*k-dd
				}
				wants = append(wants, wh)
			}
			matchHoles(t, f.Name, wants, nc.Holes)
			if len(nc.Contour) != len(p.Contour)+1 {
				t.Errorf("%s: %d contour points, the part has %d (+1 closing)", f.Name, len(nc.Contour), len(p.Contour))
			}
			if nc.Header[7] != "B" {
				t.Errorf("%s: profile code %q, want B", f.Name, nc.Header[7])
			}
		}
	}
	if plates == 0 {
		t.Fatal("no plate written")
	}
}

func find(t *testing.T, fs []ncout.File, name string) ncout.File {
	t.Helper()
	for _, f := range fs {
		if f.Name == name {
			return f
		}
	}
	t.Fatalf("no file %s in %v", name, names(fs))
	return ncout.File{}
}

// Marks stand in the header and comments only: no contour or hole line
// holds the job's mark.
func TestMarkNeverInAHoleOrContourBlock(t *testing.T) {
	for _, w := range everyJob(t) {
		for _, f := range w.files {
			_, body, _ := strings.Cut(string(f.Data), "\nAK\n")
			if body == "" {
				_, body, _ = strings.Cut(string(f.Data), "\nBO\n")
			}
			if strings.Contains(body, w.s.Mark) {
				t.Errorf("%s: the mark %q in a contour or hole block", f.Name, w.s.Mark)
			}
		}
	}
}

// The same sheet writes the same bytes.
func TestDeterministic(t *testing.T) {
	for _, w := range everyJob(t)[:3] {
		again, err := ncout.Files(w.r, w.s)
		if err != nil {
			t.Fatal(err)
		}
		for i := range again {
			if !bytes.Equal(again[i].Data, w.files[i].Data) {
				t.Errorf("%s: bytes differ between two writes", again[i].Name)
			}
		}
	}
}

func jobFiles(t *testing.T, path string) written {
	t.Helper()
	for _, w := range everyJob(t) {
		if filepath.Base(w.path) == path {
			return w
		}
	}
	t.Fatalf("no NC1 files of %s", path)
	return written{}
}

// The header's profile data against published values.
func TestProfileHeader(t *testing.T) {
	const lbPerFt = 1.48816 // kg/m per lb/ft: 0.45359237 kg / 0.3048 m (exact definitions)
	for _, c := range []struct {
		job, code, profile string
		weight, tol        float64 // kg/m
		src                string
	}{
		// A W shape's designation is its nominal weight: 21 lb/ft (AISC
		// Manual Table 1-1); the area of our geometry is within 1 %.
		{"aisc-d1-w8x21.yaml", "I", "W8x21", 21 * lbPerFt, 0.01, "AISC Manual Table 1-1, W8x21: 21 lb/ft"},
		// L4x4x1/2: 12.8 lb/ft (AISC Manual Table 1-7; AISC Shapes Database v15.0, read).
		{"us-brace-16ft.yaml", "L", "L4x4x1/2", 12.8 * lbPerFt, 0.01, "AISC Manual Table 1-7 (AISC Shapes Database v15.0, read)"},
		// L120x80x10: area 19.1 cm² (ArcelorMittal's angle table, read in
		// a text copy: docs/sources/shapes.md, "EN 10056-1 angles") × 7850
		// kg/m³ = 14.99 kg/m.
		{"si-slotted.yaml", "L", "L120x80x10", 19.1e-4 * 7850, 0.01, "ArcelorMittal angle table, A = 19.1 cm² (read)"},
	} {
		w := jobFiles(t, c.job)
		nc := parse(t, w.files[0])
		if nc.Header[7] != c.code || nc.Header[6] != c.profile {
			t.Errorf("%s: profile %q code %q, want %q %q", c.job, nc.Header[6], nc.Header[7], c.profile, c.code)
		}
		if got := nc.Number(14); math.Abs(got-c.weight) > c.tol*c.weight {
			t.Errorf("%s: weight %.3f kg/m, want %.3f within %.0f %% (%s)", c.job, got, c.weight, 100*c.tol, c.src)
		}
		for i := 16; i < 20; i++ { // saw angles: square cuts
			if nc.Number(i) != 0 {
				t.Errorf("%s: saw angle field %d = %s, want 0", c.job, i+1, nc.Header[i])
			}
		}
	}
	// L4x4x1/2 in mm: legs 4 in = 101.6, t 1/2 in = 12.7 (exact inches).
	nc := parse(t, jobFiles(t, "us-brace-16ft.yaml").files[0])
	for i, v := range map[int]float64{9: 101.6, 10: 101.6, 11: 12.7, 12: 12.7} {
		if math.Abs(nc.Number(i)-v) > 1e-3 {
			t.Errorf("L4x4x1/2 field %d = %s, want %.3f", i+1, nc.Header[i], v)
		}
	}
}

// A double angle whose far end is plain (holes at the near end only):
// the opposite hand (turned end for end) has other holes, so it is a file
// of its own, each of the job's quantity, its holes at length − x; with
// the far end a mirror, one file of twice the quantity.
func TestPairOppositeHand(t *testing.T) {
	r, err := detail.CheckFile("../testdata/jobs/si-double-angle.yaml")
	if err != nil || !r.Pass {
		t.Fatalf("%v", err)
	}
	q := max(r.Design.Job.Quantity, 1)
	s, _ := sheet.NewSheet(r, false)
	fs, _ := ncout.Files(r, s)
	if nc := parse(t, fs[0]); strings.HasSuffix(fs[1].Name, "-opp.nc1") || nc.Header[5] != strconv.Itoa(2*q) {
		t.Errorf("mirror far end: %v, quantity %s, want one file of %d", names(fs), nc.Header[5], 2*q)
	}

	r.Design.Job.Member.FarEnd.Kind = jobfile.FarPlain
	s, _ = sheet.NewSheet(r, false)
	fs, _ = ncout.Files(r, s)
	w := written{"si-double-angle.yaml (far end plain)", r, s, fs}
	if len(fs) < 2 || fs[1].Name != s.Mark+"-member-opp.nc1" {
		t.Fatalf("files %v, want the opposite hand second", names(fs))
	}
	for i, opp := range []bool{false, true} {
		nc := parse(t, fs[i])
		if nc.Header[5] != strconv.Itoa(q) {
			t.Errorf("%s: quantity %s, want %d", fs[i].Name, nc.Header[5], q)
		}
		matchHoles(t, fs[i].Name, designHoles(w, opp), nc.Holes)
	}
}
