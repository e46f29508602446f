package detail

import (
	"testing"

	"gaugeline/rules/units"
)

// A metric bolt keeps its metric name in a US job, and an inch bolt its
// inch size (ASME B18.2.6 / ISO designations; common practice, no source).
func TestBoltSizeNames(t *testing.T) {
	for _, c := range []struct {
		d    units.Length
		sys  units.System
		want string
	}{
		{20, units.US, "M20"},
		{22, units.SI, "M22"},
		{units.Inch * 3 / 4, units.US, `3/4"`},
		{units.Inch, units.US, `1"`},
	} {
		if got := BoltSize(c.d, c.sys); got != c.want {
			t.Errorf("BoltSize(%g mm, %v) = %q, want %q", float64(c.d), c.sys, got, c.want)
		}
	}
}
