package section

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

// 2L4x4x1/2 back to back on a 3/8-in gusset, by hand (parallel-axis
// theorem) from the single angle's published A = 3.75 in², x̄ = 1.18 in
// and r = 1.21 in (AISC Shapes Database v15.0):
//
//	Ry = √(1.21² + (1.18 + 0.1875)²) = 1.82597 in
//	Rx = 1.21 in
func TestDoubleHandCalculation(t *testing.T) {
	a, err := Lookup("L4x4x1/2", units.US)
	require.NoError(t, err)
	d := a.Double(units.Inch * 3 / 8)
	const src = "hand calculation, parallel-axis theorem"
	const tol = 1e-5 // hand values carry 6 significant figures
	assertRel(t, 7.5, float64(d.Area/units.SquareInch), tol, "Area", src)
	assertRel(t, 1.82597, d.Ry.In(), tol, "Ry", src)
	assertRel(t, 1.21, d.Rx.In(), tol, "Rx", src)
	assert.Equal(t, d.Rx, d.Rmin)
}

func TestDoubleGapMatters(t *testing.T) {
	a, err := Lookup("L150x90x10", units.SI)
	require.NoError(t, err)
	d0, d10 := a.Double(0), a.Double(10)
	assert.Greater(t, d10.Ry, d0.Ry, "a wider gap stiffens the pair about the plate's axis")
	assert.Equal(t, d0.Rx, d10.Rx, "the gap does not change Rx")
	p := a.Properties()
	assert.InDelta(t, math.Sqrt(p.Ibb/float64(p.Area)), d0.Rx.Mm(), 1e-9)
	assert.Equal(t, math.Min(float64(d10.Rx), float64(d10.Ry)), float64(d10.Rmin))
	assert.Panics(t, func() { a.Double(-1) })
}

// Two angles back to back against the double-angle rows of the AISC
// Shapes Database v15.0 (read, same copy as the single angles): ry of the
// pair at 3/8 and 3/4 in separation and rx, from the single angle's
// published values; the rows print three figures.
func TestDoublePublished(t *testing.T) {
	tests := []struct {
		name   string
		gap    units.Length
		rx, ry float64 // in
	}{
		{"L4x4x1/2", 0, 1.21, 1.69},
		{"L4x4x1/2", units.Inch * 3 / 8, 1.21, 1.83},
		{"L4x4x1/2", units.Inch * 3 / 4, 1.21, 1.97},
		{"L5x5x1/2", units.Inch * 3 / 8, 1.53, 2.22},
		{"L3-1/2x3-1/2x3/8", units.Inch * 3 / 4, 1.07, 1.74},
		{"L3x3x1/4", units.Inch * 3 / 4, 0.926, 1.52},
		{"L2-1/2x2-1/2x5/16", units.Inch * 3 / 8, 0.756, 1.19},
	}
	for _, tc := range tests {
		a, err := Lookup(tc.name, units.US)
		require.NoError(t, err)
		d := a.Double(tc.gap)
		src := aiscAngles + ", 2" + strings.ToUpper(tc.name) + " at " + units.FormatLength(tc.gap, units.US, units.Job.Bare())
		assert.InDelta(t, tc.ry, d.Ry.In(), 0.005+1e-9, "ry (src: %s)", src)
		assert.InDelta(t, tc.rx, d.Rx.In(), 0.005+1e-9, "rx (src: %s)", src)
	}
}
