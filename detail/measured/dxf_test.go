package measured

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// noUnits tells dxf to write no HEADER.
const noUnits = -1 << 31

// dxf writes a minimal ASCII DXF: a header setting $INSUNITS (omitted
// when insunits is noUnits) and the given entity groups, one "code\nvalue" per
// string.
func dxf(insunits int, blocks string, entities ...string) string {
	var b strings.Builder
	if insunits != noUnits {
		b.WriteString("0\nSECTION\n2\nHEADER\n9\n$ACADVER\n1\nAC1015\n9\n$INSUNITS\n70\n")
		b.WriteString(strconv.Itoa(insunits) + "\n0\nENDSEC\n")
	}
	b.WriteString("0\nSECTION\n2\nBLOCKS\n" + blocks + "0\nENDSEC\n")
	b.WriteString("0\nSECTION\n2\nENTITIES\n")
	for _, e := range entities {
		b.WriteString(e)
	}
	b.WriteString("0\nENDSEC\n0\nEOF\n")
	return b.String()
}

func circleE(layer string, x, y, r string) string {
	return "0\nCIRCLE\n8\n" + layer + "\n10\n" + x + "\n20\n" + y + "\n30\n0\n40\n" + r + "\n"
}

// rect is a closed LWPOLYLINE 0..w × 0..h.
func rect(w, h string) string {
	return "0\nLWPOLYLINE\n8\ncontour\n90\n4\n70\n1\n10\n0\n20\n0\n10\n" + w + "\n20\n0\n10\n" + w + "\n20\n" + h + "\n10\n0\n20\n" + h + "\n"
}

func read(t *testing.T, src string, def Unit, layer string) *Set {
	t.Helper()
	s, err := ReadDXF(strings.NewReader(src), "part.dxf", def, layer)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-9*(1+math.Abs(b)) }

func TestReadDXFCirclesInsideContour(t *testing.T) {
	// Inputs only: an 8 × 4 in part with two holes, a circle outside it,
	// one in a block definition and one in paper space.
	blocks := "0\nBLOCK\n8\n0\n2\nSYM\n70\n0\n10\n0\n20\n0\n" + circleE("0", "0", "0", "0.5") + "0\nENDBLK\n"
	src := dxf(1, blocks,
		rect("8", "4"),
		circleE("holes", "1.5", "2.5", "0.40625"),
		"0\nMTEXT\n8\nnotes\n10\n1\n20\n1\n1\nHOLES {\\P}2 x 13/16\n",
		"0\nINSERT\n8\n0\n2\nSYM\n10\n4\n20\n2\n",
		circleE("holes", "4.5", "2.5", "0.40625"),
		circleE("notes", "20", "20", "1"),
		"0\nCIRCLE\n8\n0\n67\n1\n10\n2\n20\n2\n40\n0.2\n",
	)
	s := read(t, src, Millimetres, "")
	if s.Units != "in ($INSUNITS)" || len(s.Holes) != 2 {
		t.Fatalf("units %q, holes %+v", s.Units, s.Holes)
	}
	// 1 in = 25.4 mm exactly (NIST SP 811).
	want := []Hole{{ID: "C1", X: 38.1, Y: 63.5, Width: 20.6375}, {ID: "C2", X: 114.3, Y: 63.5, Width: 20.6375}}
	for i, w := range want {
		g := s.Holes[i]
		if g.ID != w.ID || !near(g.X, w.X) || !near(g.Y, w.Y) || !near(g.Width, w.Width) {
			t.Errorf("hole %d = %+v, want %+v", i, g, w)
		}
	}
	if len(s.Contour) != 4 || !near(area(s.Contour), 8*4*25.4*25.4) {
		t.Errorf("contour %v", s.Contour)
	}
	if !strings.Contains(strings.Join(s.Notes, "|"), "1 circle(s) outside") {
		t.Errorf("notes %q", s.Notes)
	}
	// --layer takes the layer whatever the contour says.
	s = read(t, src, Millimetres, "NOTES")
	if len(s.Holes) != 1 || !near(s.Holes[0].X, 508) {
		t.Errorf("--layer notes: %+v", s.Holes)
	}
}

func TestReadDXFBulgeBelongsToItsVertex(t *testing.T) {
	// A stadium 22 × 26 mm (the M20 short slot of Table J3.3M, used as an
	// input) centred at (40, 65), long axis along y: the bulge of 1 on the
	// second and fourth vertices makes the top and bottom half circles. A
	// reader that puts each bulge one vertex late draws the half circles on
	// the straight sides and sees no slot.
	slot := "0\nLWPOLYLINE\n8\nholes\n90\n4\n70\n1\n" +
		"10\n51\n20\n63\n" +
		"10\n51\n20\n67\n42\n1.0\n" +
		"10\n29\n20\n67\n" +
		"10\n29\n20\n63\n42\n1.0\n"
	s := read(t, dxf(4, "", rect("300", "120"), slot), Inches, "")
	if len(s.Holes) != 1 {
		t.Fatalf("holes %+v", s.Holes)
	}
	h := s.Holes[0]
	if !h.Slot || !near(h.X, 40) || !near(h.Y, 65) || !near(h.Width, 22) || !near(h.Length, 26) || !near(h.Axis, math.Pi/2) {
		t.Errorf("slot = %+v", h)
	}
	// Two half-circle bulges make a circle (how some CAM systems draw holes).
	round := "0\nLWPOLYLINE\n8\nholes\n90\n2\n70\n1\n10\n100\n20\n65\n42\n1\n10\n122\n20\n65\n42\n1\n"
	s = read(t, dxf(4, "", rect("300", "120"), round), Inches, "")
	if len(s.Holes) != 1 || s.Holes[0].Slot || !near(s.Holes[0].X, 111) || !near(s.Holes[0].Width, 22) {
		t.Errorf("two-bulge circle = %+v", s.Holes)
	}
	// A 36-gon with its corners on a circle of radius 11 about (200, 60),
	// as a scanner writes a hole: a round hole 22 across.
	var b strings.Builder
	b.WriteString("0\nLWPOLYLINE\n8\nscan\n90\n36\n70\n1\n")
	for k := range 36 {
		a := float64(k) * math.Pi / 18
		b.WriteString("10\n" + strconv.FormatFloat(200+11*math.Cos(a), 'g', -1, 64) + "\n20\n" + strconv.FormatFloat(60+11*math.Sin(a), 'g', -1, 64) + "\n")
	}
	s = read(t, dxf(4, "", rect("300", "120"), b.String()), Inches, "")
	if len(s.Holes) != 1 || !near(s.Holes[0].X, 200) || !near(s.Holes[0].Y, 60) || !near(s.Holes[0].Width, 22) {
		t.Errorf("36-gon = %+v", s.Holes)
	}
}

func TestReadDXFR12PolylineMirroredAndLines(t *testing.T) {
	// An R12 file (no $INSUNITS: the job's unit), its contour a POLYLINE
	// with VERTEX entities, one hole drawn mirrored (extrusion 0,0,-1: its
	// OCS x is the negated world x), and a second part drawn with LINEs.
	poly := "0\nPOLYLINE\n8\ncontour\n66\n1\n70\n1\n" +
		"0\nVERTEX\n8\ncontour\n10\n0\n20\n0\n" +
		"0\nVERTEX\n8\ncontour\n10\n340\n20\n0\n" +
		"0\nVERTEX\n8\ncontour\n10\n340\n20\n100\n" +
		"0\nVERTEX\n8\ncontour\n10\n0\n20\n100\n" +
		"0\nSEQEND\n8\ncontour\n"
	mirrored := "0\nCIRCLE\n8\nholes\n10\n-110\n20\n55\n30\n0\n40\n11\n210\n0\n220\n0\n230\n-1\n"
	line := func(x1, y1, x2, y2 string) string {
		return "0\nLINE\n8\n0\n10\n" + x1 + "\n20\n" + y1 + "\n11\n" + x2 + "\n21\n" + y2 + "\n"
	}
	src := dxf(noUnits, "", poly, circleE("holes", "40", "55", "11"), mirrored,
		line("0", "200", "50", "200"), line("50", "200", "50", "210"), line("0", "210", "50", "210"), line("0", "200", "0", "210"),
		"0\nDIMENSION\n8\ndim\n2\n*D1\n10\n0\n20\n0\n")
	s := read(t, src, Millimetres, "")
	if len(s.Holes) != 2 || !near(s.Holes[1].X, 110) || !near(s.Holes[1].Y, 55) || !near(s.Holes[1].Width, 22) {
		t.Fatalf("holes %+v", s.Holes)
	}
	if !near(math.Abs(area(s.Contour)), 34000) || !strings.HasPrefix(s.Units, "mm (no $INSUNITS") {
		t.Errorf("contour area %g, units %q", area(s.Contour), s.Units)
	}
	// Lines alone chain into the contour.
	src = dxf(4, "", line("0", "0", "340", "0"), line("340", "100", "340", "0"), line("340", "100", "0", "100"), line("0", "0", "0", "100"),
		circleE("0", "40", "55", "11"), circleE("0", "400", "55", "11"))
	s = read(t, src, Inches, "")
	if len(s.Holes) != 1 || !near(math.Abs(area(s.Contour)), 34000) {
		t.Errorf("chained contour: holes %+v, area %g", s.Holes, area(s.Contour))
	}
}

func TestReadDXFErrors(t *testing.T) {
	tests := []struct {
		name, in string
		layer    string
		line     int
		field    string
		msg      string
	}{
		{"empty", "", "", 0, "", "empty"},
		{"binary", "AutoCAD Binary DXF\r\n\x1a\x00", "", 1, "", "binary DXF"},
		{"not a dxf", "hello world\n", "", 1, "", "not a DXF group code"},
		{"no sections", "999\ncomment\n", "", 0, "", "no DXF sections"},
		{"odd number of lines", "0\nSECTION\n2\n", "", 3, "group 2", "ends before"},
		{"bad radius", dxf(4, "", "0\nCIRCLE\n8\n0\n10\n1\n20\n1\n40\nbig\n"), "", 33, "group 40", "not a number"},
		{"negative radius", dxf(4, "", "0\nCIRCLE\n8\n0\n10\n1\n20\n1\n40\n-1\n"), "", 25, "CIRCLE group 40", "not positive"},
		{"circle without centre", dxf(4, "", "0\nCIRCLE\n8\n0\n40\n1\n"), "", 25, "CIRCLE group 10", "missing"},
		// $INSUNITS codes run from 0 (unitless) to 24 (US survey mile):
		// DXF Reference, HEADER section variables (from memory). Line 11
		// is the group 70 of $INSUNITS in the file dxf writes.
		{"unit code", dxf(3, "", circleE("0", "1", "1", "1")), "", 11, "$INSUNITS", "not a unit"},
		{"negative unit code", dxf(-5, "", circleE("0", "1", "1", "1")), "", 11, "$INSUNITS", "not a $INSUNITS code"},
		{"unit code too large", dxf(99999, "", circleE("0", "1", "1", "1")), "", 11, "$INSUNITS", "not a $INSUNITS code"},
		{"unit code 25", dxf(25, "", circleE("0", "1", "1", "1")), "", 11, "$INSUNITS", "not a $INSUNITS code"},
		// A transfer cut off anywhere before the 0/EOF record: the reader
		// names the last line of the file (62, 60 and 64 lines here).
		{"truncated before EOF", strings.TrimSuffix(dxf(4, "", rect("300", "120"), circleE("0", "40", "55", "11")), "0\nEOF\n"), "", 62, "", "ends before EOF"},
		{"truncated in ENTITIES", strings.Split(dxf(4, "", rect("300", "120"), circleE("0", "40", "55", "11"), circleE("0", "110", "55", "11")), "0\nCIRCLE\n8\n0\n10\n110")[0], "", 60, "", "ends before EOF"},
		{"EOF cut short", strings.TrimSuffix(dxf(4, "", rect("300", "120"), circleE("0", "40", "55", "11")), "EOF\n") + "EO\n", "", 64, "", "ends before EOF"},
		{"no holes", dxf(4, "", rect("10", "10")), "", 0, "", "no holes"},
		{"no circles on layer", dxf(4, "", circleE("holes", "1", "1", "1")), "cam", 0, "--layer", `no circles on layer "cam"`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ReadDXF(strings.NewReader(tt.in), "part.dxf", Millimetres, tt.layer)
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("err = %v, want *Error", err)
			}
			if e.File != "part.dxf" || e.Line != tt.line || e.Field != tt.field || !strings.Contains(e.Msg, tt.msg) {
				t.Errorf("got %q (line %d, field %q), want line %d, field %q, containing %q", e.Error(), e.Line, e.Field, tt.line, tt.field, tt.msg)
			}
		})
	}
}

// TestReadDXFFixtures reads the files testdata/measured/make_fixtures.py
// wrote with ezdxf (an independent writer) back to the hole centres and
// sizes the script was given, within 1e-6 mm.
func TestReadDXFFixtures(t *testing.T) {
	const in = 25.4
	us := func(xs []float64, y, d float64) [][3]float64 {
		var out [][3]float64
		for _, x := range xs {
			out = append(out, [3]float64{x * in, y * in, d * in})
		}
		return out
	}
	usNominal := us([]float64{1.5, 4.5, 7.5, 10.5}, 2.5, 13.0/16)
	td := [][3]float64{{40, 55, 22}, {110, 55, 22}, {180, 55, 22}}
	tests := []struct {
		file  string
		def   Unit
		holes [][3]float64
		slots bool
	}{
		{"hb-7-qa-nominal-r12.dxf", Inches, usNominal, false},
		{"hb-7-qa-nominal-mm-r2000.dxf", Inches, usNominal, false},
		{"hb-7-qa-shifted-r2018.dxf", Inches, us([]float64{1.5, 4.6, 7.5, 10.5}, 2.5, 13.0/16), false},
		{"hb-7-qa-missing-r12.dxf", Inches, us([]float64{1.5, 4.5, 10.5}, 2.5, 13.0/16), false},
		{"td-21-nominal-r2018.dxf", Millimetres, td, false},
		{"td-21-nominal-r12.dxf", Millimetres, td, false},
		{"kb-40-slots-r2018.dxf", Millimetres, [][3]float64{{40, 65, 22}, {105, 65, 22}, {170, 65, 22}, {235, 65, 22}}, true},
		{"kb-40-slots-r12.dxf", Millimetres, [][3]float64{{40, 65, 22}, {105, 65, 22}, {170, 65, 22}, {235, 65, 22}}, true},
	}
	for _, tt := range tests {
		t.Run(tt.file, func(t *testing.T) {
			f, err := os.Open(filepath.Join("..", "..", "testdata", "measured", tt.file))
			if err != nil {
				t.Fatal(err)
			}
			defer f.Close()
			s, err := ReadDXF(f, tt.file, tt.def, "")
			if err != nil {
				t.Fatal(err)
			}
			if len(s.Holes) != len(tt.holes) {
				t.Fatalf("%d holes, want %d: %+v", len(s.Holes), len(tt.holes), s.Holes)
			}
			for i, w := range tt.holes {
				g := s.Holes[i]
				if math.Abs(g.X-w[0]) > 1e-6 || math.Abs(g.Y-w[1]) > 1e-6 || math.Abs(g.Width-w[2]) > 1e-6 || g.Slot != tt.slots {
					t.Errorf("hole %d = %+v, want centre (%g, %g), width %g", i, g, w[0], w[1], w[2])
				}
				if tt.slots && (math.Abs(g.Length-26) > 1e-6 || math.Abs(g.Axis-math.Pi/2) > 1e-9) {
					t.Errorf("slot %d = %+v, want length 26 along y", i, g)
				}
			}
		})
	}
}

// TestReadDXFTruncatedFixtures cuts every DXF fixture (written by ezdxf)
// short at ten points, each at a line end before its 0/EOF record: each
// cut file is an error naming its last line, never a set of fewer holes.
// (Before the reader required EOF, most cuts read as parts with holes
// missing.)
func TestReadDXFTruncatedFixtures(t *testing.T) {
	files, _ := filepath.Glob(filepath.Join("..", "..", "testdata", "measured", "*.dxf"))
	if len(files) < 10 {
		t.Fatalf("%d DXF fixtures", len(files))
	}
	for _, p := range files {
		data, err := os.ReadFile(p)
		if err != nil {
			t.Fatal(err)
		}
		eof := strings.LastIndex(string(data), "EOF")
		for k := 1; k <= 10; k++ {
			cut := string(data[:eof*k/10])
			cut = cut[:strings.LastIndexByte(cut, '\n')+1]
			lines := strings.Count(cut, "\n")
			_, err := ReadDXF(strings.NewReader(cut), "cut.dxf", Millimetres, "")
			var e *Error
			if !errors.As(err, &e) {
				t.Errorf("%s cut at line %d: err = %v, want *Error", filepath.Base(p), lines, err)
				continue
			}
			// Cut after a group code, the file ends before its value.
			if e.Line != lines || !strings.Contains(e.Msg, "the file ends before") {
				t.Errorf("%s cut at line %d: %v", filepath.Base(p), lines, e)
			}
		}
	}
}
