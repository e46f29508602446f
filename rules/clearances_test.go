package rules

import (
	"errors"
	"testing"

	"gaugeline/rules/units"
)

// Entering and tightening clearances against AISC Manual Table 8-4
// "Entering and Tightening Clearances, in., Conventional ASTM A325 and A490
// Bolts" (an LRFD-era Manual, page "BOLTED CONSTRUCTION 8-13", edition not
// shown), as read in two stored copies that agree; not confirmed against the
// current Manual's Tables 7-15/7-16. Exact.
func TestBoltClearances(t *testing.T) {
	in := func(v float64) units.Length { return units.Length(v) * units.Inch }
	for _, tc := range []struct {
		name      string
		d, c1, c2 float64 // in
	}{
		{"5/8", 5.0 / 8, 1, 11.0 / 16},
		{"3/4", 3.0 / 4, 1.25, 3.0 / 4},
		{"7/8", 7.0 / 8, 1.375, 7.0 / 8},
		{"1", 1, 1 + 7.0/16, 15.0 / 16},
		{"1-1/8", 1.125, 1 + 9.0/16, 1 + 1.0/16},
		{"1-1/4", 1.25, 1 + 11.0/16, 1.125},
		{"1-3/8", 1.375, 1.75, 1.25},
		{"1-1/2", 1.5, 1 + 15.0/16, 1 + 5.0/16},
	} {
		r, err := BoltClearances(in(tc.d))
		if err != nil {
			t.Errorf("%s in: %v", tc.name, err)
			continue
		}
		if r.D != in(tc.d) || r.Tightening != in(tc.c1) || r.Entering != in(tc.c2) {
			t.Errorf("%s in: C1 %v in, C2 %v in; want %v and %v (AISC Manual Table 8-4)",
				tc.name, r.Tightening.In(), r.Entering.In(), tc.c1, tc.c2)
		}
	}
}

// A diameter the table does not list is an error naming the table: 1/2 in
// (the table starts at 5/8), an odd size, and every metric bolt.
func TestBoltClearancesNotTabulated(t *testing.T) {
	for _, d := range []units.Length{units.Inch / 2, 0.8 * units.Inch, 20, 3 * units.Inch / 4 * 1.001} {
		_, err := BoltClearances(d)
		var nt *NotTabulatedError
		if !errors.As(err, &nt) || nt.Table != "Table 8-4" {
			t.Errorf("%v mm: err %v, want a *NotTabulatedError for Table 8-4", float64(d), err)
		}
	}
}
