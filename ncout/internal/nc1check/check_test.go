package nc1check_test

import (
	"strings"
	"testing"

	"gaugeline/ncout"
	"gaugeline/ncout/internal/nc1check"
)

// A piece of every block: the layout (from memory of the standard, see
// ncout's doc.go) read back, then broken one way at a time; each break is
// refused with the line that breaks it. The numbers only fill fields.
func TestParseRefusesEveryBreak(t *testing.T) {
	p := &ncout.Piece{Mark: "T-plate", Grade: "A36", Quantity: 2, Profile: "PL10x200", Code: "B", Length: 430,
		Height: 200, FlangeWidth: 10, FlangeT: 10, WebT: 10,
		Contour: []ncout.Point{{X: 0, Y: 0}, {X: 430, Y: 0}, {X: 430, Y: 200}, {X: 0, Y: 200}},
		Holes:   []ncout.Hole{{Face: ncout.FaceFront, X: 40, Y: 100, D: 22}, {Face: ncout.FaceFront, X: 105, Y: 100, D: 22, Ey: 4}}}
	good := string(ncout.Write(p, "s"))
	f, err := nc1check.Parse([]byte(good))
	if err != nil {
		t.Fatalf("%v\n%s", err, good)
	}
	if len(f.Header) != ncout.HeaderLines || len(f.Contour) != 5 || len(f.Holes) != 2 || !f.Holes[1].Slot || f.Holes[1].Ey != 4 {
		t.Fatalf("read back %+v", f)
	}
	for _, c := range []struct{ name, from, to string }{
		{"no ST first", "ST\n", "BO\n"},
		{"a header field missing", "  PL10x200\n", ""},
		{"an unknown profile code", "  B\n", "  X\n"},
		{"a quantity that is not whole", "  2\n", "  2.5\n"},
		{"a decimal comma", "  430.000\n", "  430,000\n"},
		{"a number without its places", "  200.000\n", "  200\n"},
		{"three blanks before a field", "  A36\n", "   A36\n"},
		{"an unknown block", "AK\n", "XX\n"},
		{"blocks out of order (BO twice)", "AK\n", "BO\n"},
		{"a contour not closed", "  v      0.000      0.000      0.000\nBO", "BO"},
		{"a face that is none", "  v     40.000", "  x     40.000"},
		{"a hole of five fields", "  v     40.000    100.000     22.000\n", "  v     40.000    100.000     22.000      0.000\n"},
		{"a slot without its letter", "0.000l", "0.000 "},
		{"no EN", "EN\n", ""},
		{"lines after EN", "EN\n", "EN\n  x\n"},
		{"a carriage return", "ST\n", "ST\r\n"},
	} {
		bad := strings.Replace(good, c.from, c.to, 1)
		if bad == good {
			t.Fatalf("%s: %q not in the file", c.name, c.from)
		}
		if _, err := nc1check.Parse([]byte(bad)); err == nil {
			t.Errorf("%s: read without an error", c.name)
		} else {
			t.Logf("%s: %v", c.name, err)
		}
	}
}
