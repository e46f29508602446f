package section

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

// 2L4x4x1/2 back to back on a 3/8-in gusset, by hand (parallel-axis
// theorem) on the plain section:
//
//	A   = 4·½ + 3½·½ = 3.75 in²
//	x̄  = (2·0.25 + 1.75·2.25) / 3.75 = 1.18333 in
//	Iaa = 4·½³/12 + 2·0.93333² + ½·3.5³/12 + 1.75·1.06667² = 5.56146 in⁴
//	Ry  = √(5.56146/3.75 + (1.18333 + 0.1875)²) = 1.83364 in
//	Rx  = √(5.56146/3.75) = 1.21781 in
func TestDoubleHandCalculation(t *testing.T) {
	a, err := Lookup("L4x4x1/2", units.US)
	require.NoError(t, err)
	d := a.Double(units.Inch * 3 / 8)
	const src = "hand calculation, parallel-axis theorem"
	const tol = 1e-5 // hand values carry 6 significant figures
	assertRel(t, 7.5, float64(d.Area/units.SquareInch), tol, "Area", src)
	assertRel(t, 1.83364, d.Ry.In(), tol, "Ry", src)
	assertRel(t, 1.21781, d.Rx.In(), tol, "Rx", src)
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
