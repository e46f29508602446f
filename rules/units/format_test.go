package units

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

// The styles other than Job and Shop (parse_test.go tests those).
func TestFormatStyles(t *testing.T) {
	const grid = "on the style's grid, printed as is (gaugeline convention: a rounded value gets its exact value beside it)"
	tests := []struct {
		name string
		v    float64
		d    Dim
		sys  System
		st   Style
		want string
		src  string
	}{
		// People: the check's tables (moved from detail.TestFormatLength).
		{"people 13/16", float64(Inch * 13 / 16), DimLength, US, People, `13/16"`, "AISC 360-22 Table J3.3: 3/4-in bolt, standard hole 13/16 in"},
		{"people 27/32", float64(Inch * (13.0/16 + 1.0/32)), DimLength, US, People, `7/8" (0.84375 in)`, "Table J3.3 13/16 in plus 1/32 in (common practice, no source)"},
		{"people 1 1/2", float64(Inch * 1.5), DimLength, US, People, `1 1/2"`, grid},
		{"people 0.06 in", float64(Inch * 0.06), DimLength, US, People, `1/16" (0.06 in)`, "rounds to 1/16 in"},
		{"people 26 mm", 26, DimLength, SI, People, "26.0 mm", "AISC 360-16 Table J3.4M: M20, 26 mm"},
		{"people 2-2/3 d", 20 * 8.0 / 3, DimLength, SI, People, "53.3 mm (53.333333 mm)", "AISC 360-16 J3.3: 2-2/3 · 20 mm"},
		{"people 25.96 mm", 25.96, DimLength, SI, People, "26.0 mm (25.96 mm)", "rounds to 0.1 mm"},
		{"people force", float64(95 * Kip), DimForce, US, People, "95.0 kip", "forces to 0.1 of the unit (gaugeline convention)"},
		{"people area", float64(2.25 * SquareInch), DimArea, US, People, "2.250 in2", "areas to 0.001 in² (gaugeline convention)"},
		{"people number", 1.0 / 3, Dimensionless, US, People, "0.333", "numbers to 3 significant figures (gaugeline convention)"},
		// Shop with the exact value: the sheet's limits.
		{"shop exact 0.9 in", float64(0.9 * Inch), DimLength, US, Shop.WithExact(), `7/8" (0.9 in)`, "0.9 in rounds to 14/16 in"},
		{"shop exact 3/4", float64(0.75 * Inch), DimLength, US, Shop.WithExact(), `3/4"`, grid},
		{"shop exact 12.5 mm", 12.5, DimLength, SI, Shop.WithExact(), "13 (12.5 mm)", "whole millimetres (common practice, no source)"},
		{"shop exact 12 mm", 12, DimLength, SI, Shop.WithExact(), "12", grid},
		// Exact and Job without the unit.
		{"exact 1/32", float64(Inch / 32), DimLength, US, Exact, "0.03125 in", "1/32 = 0.03125, exact"},
		{"exact mm", 25.9600001, DimLength, SI, Exact, "25.96 mm", "rounded to 1e-6 mm"},
		{"job bare", float64(3.5 * Inch), DimLength, US, Job.Bare(), "3-1/2", srcJob},
		{"job bare si", 22.5, DimLength, SI, Job.Bare(), "22.5", srcJob},
		// Gauge: as measuring equipment reports.
		{"gauge us", float64(Inch * 13 / 16), DimLength, US, Gauge, "0.8125 in", "13/16 = 0.8125, to 0.0001 in (gaugeline convention)"},
		{"gauge si", 21.966, DimLength, SI, Gauge, "21.97 mm", "to 0.01 mm (gaugeline convention)"},
		// Report: fixed decimals per dimension.
		{"report length us", float64(1.5 * Inch), DimLength, US, Report, "1.500 in", "lengths to 0.001 in (gaugeline convention)"},
		{"report length si", 38.1, DimLength, SI, Report, "38.1 mm", "lengths to 0.1 mm (gaugeline convention)"},
		{"report moment si", 2.5e6, DimMoment, SI, Report, "2.500 kN-m", "2.5e6 N·mm = 2.5 kN·m, to 0.001"},
		{"report typeset", float64(2.25 * SquareInch), DimArea, US, Report.Typeset(), "2.250 in²", "areas to 0.001 in²"},
		{"report bare", float64(95 * Kip), DimForce, US, Report.Bare(), "95.0", "forces to 0.1 kip"},
		{"report integer", 4, Dimensionless, US, Report, "4", "whole numbers as integers (gaugeline convention)"},
		{"report no -0", -0.01, DimForce, SI, Report, "0.0 kN", "no sign on a zero (gaugeline convention)"},
		{"report infinite", math.Inf(1), DimForce, US, Report, "∞ kip", "gaugeline convention"},
		{"places", float64(Kip) * 1.23456, DimForce, US, Report.Places(4), "1.2346 kip", "4 decimals asked"},
		{"significant", float64(SquareInch) * 0.0123456, DimArea, US, Report.Places(-3), "0.0123 in2", "3 significant figures asked"},
		{"places infinite", math.Inf(1), DimForce, US, Report.Places(2), "∞", "gaugeline convention: no unit after ∞ when places are asked"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, Format(tt.v, tt.d, tt.sys, tt.st), tt.src)
		})
	}
}
