package dxfout

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"gaugeline/detail/sheet"
	"gaugeline/rules/units"
)

// r12Pair is one CAM part of a job: its R12 file and, for comparison, the
// AutoCAD 2000 file of the same part.
type r12Pair struct {
	name       string
	part       *sheet.Part
	sys        units.System
	r12, r2000 []byte
}

func r12Pairs(t *testing.T) []r12Pair {
	t.Helper()
	var out []r12Pair
	for _, job := range jobs {
		_, s := sheetOf(t, job)
		for i := range s.Views {
			p := &s.Views[i].Part
			b, err := CAMR12(p, s.Units, s.TextHeight)
			if err != nil {
				t.Fatal(err)
			}
			a, err := CAM(p, s.Units)
			if err != nil {
				t.Fatal(err)
			}
			out = append(out, r12Pair{name: s.Mark + "-" + p.Name, part: p, sys: s.Units, r12: b, r2000: a})
		}
	}
	return out
}

// The R12 bytes, read by our own pair reader: AC1009 in the header, no
// handles (R12 has none) and none of the AutoCAD 2000 sections, the units
// in a comment, the layer table 0, contour, holes, mark; the contour one
// closed POLYLINE; each hole a CIRCLE of the part's diameter or a closed
// POLYLINE of four VERTEXes whose bulges are 0, 1, 0, 1 (two sides, two
// half circles), each POLYLINE ended by SEQEND; the label one TEXT on
// mark. Drawn twice, the bytes are the same.
func TestR12Bytes(t *testing.T) {
	slots := 0
	for _, c := range r12Pairs(t) {
		ps, err := pairs(c.r12)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		again, _ := CAMR12(c.part, c.sys, 1)
		if first, _ := CAMR12(c.part, c.sys, 1); !bytes.Equal(first, again) {
			t.Errorf("%s: two drawings differ", c.name)
		}
		if want := (pair{999, unitsComment(c.sys)}); ps[0] != want {
			t.Errorf("%s: first pair %v, want %v", c.name, ps[0], want)
		}
		if v := headerVar(ps, "$ACADVER"); v != "AC1009" {
			t.Errorf("%s: $ACADVER %q, want AC1009", c.name, v)
		}
		for _, p := range ps {
			if p.code == 5 || p.code == 330 || p.code == 100 || p.code == 0 && (p.value == "LWPOLYLINE" || p.value == "CLASSES") ||
				p.code == 9 && (p.value == "$INSUNITS" || p.value == "$MEASUREMENT" || p.value == "$HANDSEED") {
				t.Errorf("%s: %v is not R12", c.name, p)
			}
		}
		if got := tableNames(ps, "LAYER"); strings.Join(got, " ") != "0 contour holes mark" {
			t.Errorf("%s: layers %q", c.name, got)
		}
		slots += checkR12Entities(t, c, ps)
	}
	if slots == 0 {
		t.Error("no job of the set has a slot: the slot outline is not checked")
	}
}

// checkR12Entities checks the ENTITIES section of one R12 CAM file
// against its part and returns how many slots it holds.
func checkR12Entities(t *testing.T, c r12Pair, ps []pair) (slots int) {
	t.Helper()
	es := r12Entities(ps)
	if len(es) == 0 || es[0].kind != "POLYLINE" || es[0].layer != "contour" || !es[0].closed || len(es[0].verts) != len(c.part.Contour) {
		t.Fatalf("%s: the first entity is not the closed contour of %d corners: %+v", c.name, len(c.part.Contour), es[:min(1, len(es))])
	}
	holes := es[1:]
	if c.part.Label != "" {
		if last := es[len(es)-1]; last.kind != "TEXT" || last.layer != "mark" || last.text != c.part.Label {
			t.Errorf("%s: last entity %+v, want the TEXT %q on mark", c.name, last, c.part.Label)
		}
		holes = es[1 : len(es)-1]
	}
	if len(holes) != len(c.part.Holes) {
		t.Fatalf("%s: %d entities between contour and label, the part has %d holes", c.name, len(holes), len(c.part.Holes))
	}
	for i, h := range c.part.Holes {
		e := holes[i]
		if e.layer != "holes" {
			t.Errorf("%s hole %s: on layer %q", c.name, h.ID, e.layer)
		}
		if h.Round() {
			if e.kind != "CIRCLE" || math.Abs(2*e.radius-h.Diameter()) > tol {
				t.Errorf("%s hole %s: %s of radius %v, want a CIRCLE of diameter %v", c.name, h.ID, e.kind, e.radius, h.Diameter())
			}
			continue
		}
		slots++
		if e.kind != "POLYLINE" || !e.closed || len(e.verts) != 4 || !e.seqend {
			t.Errorf("%s hole %s: %s closed %v of %d vertices, SEQEND %v", c.name, h.ID, e.kind, e.closed, len(e.verts), e.seqend)
			continue
		}
		for k, want := range []float64{0, 1, 0, 1} {
			if e.verts[k][2] != want {
				t.Errorf("%s hole %s: vertex %d bulge %v, want %v", c.name, h.ID, k, e.verts[k][2], want)
			}
		}
	}
	return slots
}

func headerVar(ps []pair, name string) string {
	for i := 0; i+1 < len(ps); i++ {
		if ps[i].code == 9 && ps[i].value == name {
			return ps[i+1].value
		}
	}
	return ""
}

// tableNames lists the names (group 2) of the entries of a table.
func tableNames(ps []pair, table string) []string {
	var names []string
	in := false
	for i := 0; i+1 < len(ps); i++ {
		switch {
		case ps[i].code == 0 && ps[i].value == "TABLE":
			in = ps[i+1] == pair{2, table}
		case ps[i].code == 0 && ps[i].value == "ENDTAB":
			in = false
		case in && ps[i].code == 0 && ps[i+1].code == 2:
			names = append(names, ps[i+1].value)
		}
	}
	return names
}

// r12Ent is an entity of an R12 file, its VERTEXes and SEQEND folded
// into their POLYLINE.
type r12Ent struct {
	kind, layer, text string
	radius            float64
	closed, seqend    bool
	verts             [][3]float64 // x, y, bulge
}

func r12Entities(ps []pair) []r12Ent {
	var out []r12Ent
	in := false
	for i, p := range ps {
		if p.code == 2 && i > 0 && ps[i-1] == (pair{0, "SECTION"}) {
			in = p.value == "ENTITIES"
		}
		if p == (pair{0, "ENDSEC"}) {
			in = false
		}
		if !in || p.code == 2 {
			continue
		}
		f, _ := strconv.ParseFloat(p.value, 64)
		switch {
		case p.code == 0 && p.value == "VERTEX":
			last := &out[len(out)-1]
			last.verts = append(last.verts, [3]float64{})
		case p.code == 0 && p.value == "SEQEND":
			out[len(out)-1].seqend = true
		case p.code == 0:
			out = append(out, r12Ent{kind: p.value})
		case len(out) == 0:
		case p.code == 8:
			out[len(out)-1].layer = p.value
		case p.code == 1:
			out[len(out)-1].text = p.value
		case p.code == 40:
			out[len(out)-1].radius = f
		case p.code == 70 && len(out[len(out)-1].verts) == 0:
			out[len(out)-1].closed = int(f)&1 == 1
		case p.code == 10 || p.code == 20 || p.code == 42:
			if e := &out[len(out)-1]; len(e.verts) > 0 {
				e.verts[len(e.verts)-1][map[int]int{10: 0, 20: 1, 42: 2}[p.code]] = f
			}
		}
	}
	return out
}

// ezdxf, a reader independent of ours, reads every R12 CAM file of the
// jobs as AC1009 with nothing to repair, and finds in it the holes of the
// AutoCAD 2000 file of the same part: centres, diameters, slot lengths
// and bulges within 1e-6; the contour's corners too; besides them only
// the label, a TEXT on layer mark.
func TestEzdxfReadsR12(t *testing.T) {
	haveEzdxf(t)
	dir := t.TempDir()
	cs := r12Pairs(t)
	var paths []string
	for _, c := range cs {
		for name, data := range map[string][]byte{c.name + R12Ext: c.r12, c.name + ".cam.dxf": c.r2000} {
			if err := os.WriteFile(filepath.Join(dir, name), data, 0o644); err != nil {
				t.Fatal(err)
			}
		}
		paths = append(paths, filepath.Join(dir, c.name+R12Ext), filepath.Join(dir, c.name+".cam.dxf"))
	}
	out, err := exec.Command(python, append([]string{"-c", readBack}, paths...)...).Output()
	if err != nil {
		if ee, ok := err.(*exec.ExitError); ok {
			t.Fatalf("ezdxf: %v\n%s", err, ee.Stderr)
		}
		t.Fatal(err)
	}
	var files []ezFile
	if err := json.Unmarshal(out, &files); err != nil {
		t.Fatal(err)
	}
	if len(files) != 2*len(cs) {
		t.Fatalf("ezdxf read %d files of %d", len(files), 2*len(cs))
	}
	for i, c := range cs {
		r12, r2000 := files[2*i], files[2*i+1]
		if r12.Version != "AC1009" || r2000.Version != "AC1015" {
			t.Errorf("%s: versions %s and %s, want AC1009 and AC1015", c.name, r12.Version, r2000.Version)
		}
		if len(r12.Errors) > 0 || len(r12.Fixes) > 0 {
			t.Errorf("%s: audit errors %q, fixes %q", c.name, r12.Errors, r12.Fixes)
		}
		got, labels := ezGeometry(t, c.name+R12Ext, r12)
		want, _ := ezGeometry(t, c.name+".cam.dxf", r2000)
		sameHoles(t, c.name+R12Ext, got.holes, want.holes)
		if !sameFloats(got.bulges, want.bulges) || !sameFloats(got.contour, want.contour) {
			t.Errorf("%s: bulges %v contour %v; the R2000 file's %v, %v", c.name, got.bulges, got.contour, want.bulges, want.contour)
		}
		if c.part.Label == "" || len(labels) != 1 || labels[0] != c.part.Label {
			t.Errorf("%s: texts on mark %q, want the one label %q", c.name, labels, c.part.Label)
		}
	}
}

// ezShape is what a CAM file read by ezdxf cuts: its holes, the bulges of
// its slots' vertices and its contour's corners (x, y in turn).
type ezShape struct {
	holes           []wantHole
	bulges, contour []float64
}

// ezGeometry sorts a CAM file's entities by layer: contour, holes and the
// texts of layer mark; anything else is an error.
func ezGeometry(t *testing.T, name string, f ezFile) (s ezShape, labels []string) {
	t.Helper()
	for _, e := range f.Entities {
		switch {
		case e.Layer == "contour" && strings.HasSuffix(e.Type, "POLYLINE") && e.Closed:
			for _, p := range e.Points {
				s.contour = append(s.contour, p[0], p[1])
			}
		case e.Layer == "holes":
			h, err := ezHole(e.Type, e.X, e.Y, e.R, e.Points, e.Closed)
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			s.holes = append(s.holes, h)
			for _, p := range e.Points {
				s.bulges = append(s.bulges, p[2])
			}
		case e.Layer == "mark" && e.Type == "TEXT":
			labels = append(labels, e.Text)
		default:
			t.Errorf("%s: a %s on layer %q (closed %v)", name, e.Type, e.Layer, e.Closed)
		}
	}
	return s, labels
}

func sameFloats(a, b []float64) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if math.Abs(a[i]-b[i]) > tol {
			return false
		}
	}
	return true
}
