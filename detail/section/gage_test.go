package section

import (
	"testing"

	"github.com/stretchr/testify/assert"

	"gaugeline/rules/units"
)

func TestWorkableGage(t *testing.T) {
	const us = "common practice, no source (from memory)"
	const si = "usual back marks, common practice, no source (from memory)"
	in := func(n, d float64) units.Length { return units.Length(n/d) * units.Inch }
	tests := []struct {
		name string
		leg  units.Length
		sys  units.System
		want UsualGages
		ok   bool
		src  string
	}{
		{"4 in", 4 * units.Inch, units.US, UsualGages{G: in(5, 2)}, true, us},
		{"3-1/2 in", in(7, 2), units.US, UsualGages{G: 2 * units.Inch}, true, us},
		{"2 in", 2 * units.Inch, units.US, UsualGages{G: in(9, 8)}, true, us},
		{"8 in, two lines", 8 * units.Inch, units.US, UsualGages{G: in(9, 2), G1: 3 * units.Inch, G2: 3 * units.Inch}, true, us},
		{"6 in, two lines", 6 * units.Inch, units.US, UsualGages{G: in(7, 2), G1: in(9, 4), G2: in(5, 2)}, true, us},
		{"4-1/2 in not tabulated", in(9, 2), units.US, UsualGages{}, false, "no row"},
		{"100 mm", 100, units.SI, UsualGages{G: 55}, true, si},
		{"150 mm, two lines", 150, units.SI, UsualGages{G: 55, G1: 55, G2: 55}, true, si},
		{"130 mm not listed", 130, units.SI, UsualGages{}, false, "no row"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, ok := WorkableGage(tc.leg, tc.sys)
			assert.Equal(t, tc.ok, ok, tc.src)
			assert.InDelta(t, float64(tc.want.G), float64(got.G), 1e-9, "G (src: %s)", tc.src)
			assert.InDelta(t, float64(tc.want.G1), float64(got.G1), 1e-9, "G1 (src: %s)", tc.src)
			assert.InDelta(t, float64(tc.want.G2), float64(got.G2), 1e-9, "G2 (src: %s)", tc.src)
		})
	}
}

// Every catalog leg gets a gage, except the metric legs the back-mark table
// does not list.
func TestWorkableGageCoversCatalog(t *testing.T) {
	unlisted := map[float64]bool{130: true, 135: true, 160: true, 180: true}
	for _, sys := range []units.System{units.US, units.SI} {
		for _, f := range catalog(sys) {
			for _, leg := range []units.Length{f.a, f.b} {
				g, ok := WorkableGage(leg, sys)
				if sys == units.SI && unlisted[leg.Mm()] {
					assert.False(t, ok, "%s leg %v", f.legs, leg)
					continue
				}
				if assert.True(t, ok, "%s leg %v mm", f.legs, leg.Mm()) {
					assert.Less(t, g.G, leg, f.legs)
					assert.Less(t, g.G1+g.G2, leg, f.legs)
				}
			}
		}
	}
}
