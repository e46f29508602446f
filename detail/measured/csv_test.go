package measured

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"
)

// Expected values in these tests are inputs read back, converted by the
// exact definition 1 in = 25.4 mm (NIST SP 811); there is no other source.

func TestReadCSV(t *testing.T) {
	tests := []struct {
		name string
		in   string
		def  Unit
		want []Hole // mm
		unit string
	}{
		{"plain rows in the job's inches", "1.5,2.5,0.8125\n4.5,2.5,0.8125,B\n", Inches,
			[]Hole{{ID: "M1", X: 38.1, Y: 63.5, Width: 20.6375}, {ID: "B", X: 114.3, Y: 63.5, Width: 20.6375}}, "in (the job's units)"},
		{"header in mm for an inch job", "x_mm,y_mm,diameter_mm,id\n38.1,63.5,20.6375,H1\n", Inches,
			[]Hole{{ID: "H1", X: 38.1, Y: 63.5, Width: 20.6375}}, "mm (from the header)"},
		{"header with units in brackets, reordered, extra column", "id;z (mm);diameter (mm);y [mm];x [mm]\nA;0;22;55;40\n", Inches,
			[]Hole{{ID: "A", X: 40, Y: 55, Width: 22}}, "mm (from the header)"},
		{"comments, blank lines, CRLF, BOM, tabs", "\ufeff# measured by CMM 3\r\n\r\nx\ty\td\r\n40\t55\t22\r\n# end\r\n", Millimetres,
			[]Hole{{ID: "M1", X: 40, Y: 55, Width: 22}}, "mm (the job's units)"},
		{"values with their own unit", "x,y,diameter\n1-1/2 in,63.5 mm,13/16\n", Inches,
			[]Hole{{ID: "M1", X: 38.1, Y: 63.5, Width: 20.6375}}, "in (the job's units)"},
		{"hole_id and radius columns, z ignored", "Hole_ID,X (mm),Y (mm),Z (mm),Radius (mm)\nP1,40,55,-3,11\n", Inches,
			[]Hole{{ID: "P1", X: 40, Y: 55, Width: 22}}, "mm (from the header)"},
		{"semicolons and decimal commas", "x;y;diameter\n38,1;63,5;20,6375\n", Millimetres,
			[]Hole{{ID: "M1", X: 38.1, Y: 63.5, Width: 20.6375}}, "mm (the job's units)"},
		{"quoted cells", "\"x\",\"y\",\"diameter\"\n\"40\",\"55\",\"22\"\n", Millimetres,
			[]Hole{{ID: "M1", X: 40, Y: 55, Width: 22}}, "mm (the job's units)"},
		// RFC 4180 quoting: a quoted cell may hold the delimiter, and a
		// doubled quote inside it is one quote; an inch mark ends a value.
		{"quoted delimiter and doubled quote", "x,y,diameter,id\n40,\"55\" ,22,\"A,\"\"1\"\"\"\n'40',55,22,'B'\n", Millimetres,
			[]Hole{{ID: `A,"1"`, X: 40, Y: 55, Width: 22}, {ID: "B", X: 40, Y: 55, Width: 22}}, "mm (the job's units)"},
		{"inch marks", "1-1/2\",2.5 in,13/16\"\n", Inches,
			[]Hole{{ID: "M1", X: 38.1, Y: 63.5, Width: 20.6375}}, "in (the job's units)"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			s, err := ReadCSV(strings.NewReader(tt.in), "m.csv", tt.def)
			if err != nil {
				t.Fatal(err)
			}
			if s.Units != tt.unit {
				t.Errorf("units %q, want %q", s.Units, tt.unit)
			}
			if len(s.Holes) != len(tt.want) {
				t.Fatalf("%d holes, want %d", len(s.Holes), len(tt.want))
			}
			for i, w := range tt.want {
				g := s.Holes[i]
				if g.ID != w.ID || math.Abs(g.X-w.X) > 1e-9 || math.Abs(g.Y-w.Y) > 1e-9 || math.Abs(g.Width-w.Width) > 1e-9 || g.Length != g.Width || g.Slot {
					t.Errorf("hole %d = %+v, want %+v", i, g, w)
				}
			}
		})
	}
}

func TestReadCSVErrors(t *testing.T) {
	tests := []struct {
		name, in string
		line     int
		field    string
		msg      string
	}{
		{"empty", "", 0, "", "empty"},
		{"comments only", "# nothing\n\n", 0, "", "no holes"},
		{"not a number", "x,y,diameter\n1,2,0.8\n1,two,0.8\n", 3, "y", "not a number"},
		{"missing diameter", "1,2,0.8\n3,2\n", 2, "diameter", "missing"},
		{"zero diameter", "1,2,0\n", 1, "diameter", "not a hole diameter"},
		{"negative diameter", "1,2,-0.8\n", 1, "diameter", "not a hole diameter"},
		{"NaN", "x,y,diameter\nNaN,2,0.8\n", 2, "x", "out of range"},
		{"infinite", "1,1e400,0.8\n", 1, "y", ""},
		{"too many columns", "1,2,0.8,A,9\n", 1, "", "columns"},
		{"header without y", "x,diameter\n1,0.8\n", 1, "y", "no y column"},
		{"unknown unit", "x_furlong,y,diameter\n1,2,3\n", 1, "x_furlong", "unknown unit"},
		{"duplicate column", "x,x,y,diameter\n", 1, "column 2", "given twice"},
		{"radius and diameter", "x,y,r,d\n1,2,3,6\n", 1, "radius", "not both"},
		{"duplicate id", "1,2,0.8,A\n4,2,0.8,A\n", 2, "id", "already used on line 1"},
		{"ragged row", "x,y,diameter\n1,2,0.8,9\n", 2, "", "columns"},
		// A quote opened and not closed on its line: a cell cut short or a
		// row broken across lines, not data.
		{"unclosed quote", "x,y,diameter\n1,2,0.8\n\"1.5,2.5,0.8125\n", 3, "column 1", "unclosed quote"},
		{"unclosed quote last cell", "1,2,0.8\n1.5,2.5,\"0.8125\n", 2, "column 3", "unclosed quote"},
		{"unclosed quote in header", "x,y,\"diameter\n1,2,0.8\n", 1, "column 3", "unclosed quote"},
		{"unclosed single quote", "1.5;'2,5;0,8125\n", 1, "column 2", "unclosed quote"},
		{"quote spans the row", "\"1.5,2.5,0.8125\n4.5,2.5,0.8125\"\n", 1, "column 1", "unclosed quote"},
		{"text after the closing quote", "1,\"2\"5,0.8\n", 1, "column 2", "after the closing quote"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ReadCSV(strings.NewReader(tt.in), "m.csv", Inches)
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("err = %v, want *Error", err)
			}
			if e.File != "m.csv" || e.Line != tt.line || e.Field != tt.field || !strings.Contains(e.Msg, tt.msg) {
				t.Errorf("got %q (line %d, field %q), want line %d field %q containing %q", e.Error(), e.Line, e.Field, tt.line, tt.field, tt.msg)
			}
		})
	}
}

func TestReadCSVCaps(t *testing.T) {
	var b strings.Builder
	for i := range MaxHoles + 1 {
		fmt.Fprintf(&b, "%d,1,0.8\n", i)
	}
	_, err := ReadCSV(strings.NewReader(b.String()), "big.csv", Inches)
	var e *Error
	if !errors.As(err, &e) || e.Line != MaxHoles+1 || !strings.Contains(e.Msg, "more than") {
		t.Errorf("too many rows: %v", err)
	}
	_, err = ReadCSV(strings.NewReader("1,2,"+strings.Repeat("9", maxLineLen)+"\n"), "long.csv", Inches)
	if !errors.As(err, &e) || e.Line != 1 || !strings.Contains(e.Msg, "longer than") {
		t.Errorf("long line: %v", err)
	}
	_, err = ReadCSV(strings.NewReader(strings.Repeat(" ", MaxFileSize+1)), "huge.csv", Inches)
	if !errors.As(err, &e) || !strings.Contains(e.Msg, "larger than") {
		t.Errorf("huge file: %v", err)
	}
}

// A measuring machine's export: a header block of key/value lines before
// the table, a semicolon table with decimal commas and quoted ids that
// hold the delimiter (the layout of common CMM exports; common practice,
// no source: the values are the test's own input, read back as written).
func TestReadCSVMachineExport(t *testing.T) {
	src := "Part: BR-12 member\nProgram;gl-check-3\nOperator: QA\nDate;2026-12-03\n\n" +
		"Feature;X_mm;Y_mm;Diameter_mm\n\"H1;near\";38,10;63,50;20,64\n\"H2, far\";114,30;63,50;20,60\n"
	set, err := ReadCSV(strings.NewReader(src), "cmm.csv", Inches)
	if err != nil {
		t.Fatal(err)
	}
	want := []Hole{{ID: "H1;near", X: 38.1, Y: 63.5, Width: 20.64}, {ID: "H2, far", X: 114.3, Y: 63.5, Width: 20.6}}
	if len(set.Holes) != len(want) {
		t.Fatalf("%d holes, want %d", len(set.Holes), len(want))
	}
	for i, h := range set.Holes {
		w := want[i]
		if h.ID != w.ID || math.Abs(h.X-w.X) > 1e-9 || math.Abs(h.Y-w.Y) > 1e-9 || math.Abs(h.Width-w.Width) > 1e-9 {
			t.Errorf("hole %d: %+v, want %+v", i, h, w)
		}
	}
	// a header block with no table after it is still an empty file
	if _, err := ReadCSV(strings.NewReader("Part: BR-12\nDate: today\n"), "cmm.csv", Inches); err == nil {
		t.Error("a header block alone read as holes")
	}
}
