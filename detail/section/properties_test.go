package section

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

// tabTol is the relative tolerance against section tables. The tables
// round to 3 significant figures (up to 0.5 %), and the US catalog's plain
// section sits up to about 0.9 % above the fillet-and-toe rz of the
// 15th-edition Manual (see the package comment): 1 % covers both and still
// catches a wrong leg, thickness or formula.
const tabTol = 0.01

// assertRel checks got against want within the relative tolerance tol.
func assertRel(t *testing.T, want, got, tol float64, what, src string) {
	t.Helper()
	assert.InEpsilon(t, want, got, tol, "%s (src: %s)", what, src)
}

// AISC Manual Table 1-7 values, recalled rather than read: tests name the
// table and say so.
const aiscT17 = "AISC Manual (15th ed.) Table 1-7, from memory"

func TestPropertiesUS(t *testing.T) {
	tests := []struct {
		name    string
		swapped bool    // connect the short leg (leg B of the designation)
		A       float64 // in²
		Xbar    float64 // in, along the outstanding leg
		Ybar    float64 // in, along the connected leg
		Rmin    float64 // in, rz
		src     string
	}{
		{name: "L4x4x1/2", A: 3.75, Xbar: 1.18, Ybar: 1.18, Rmin: 0.776,
			src: aiscT17 + "; x̄ = 1.18 also in AISC Design Examples D.2"},
		{name: "L6x4x1/2", A: 4.75, Xbar: 0.987, Ybar: 1.99, Rmin: 0.864, src: aiscT17},
		{name: "L6x4x1/2", swapped: true, A: 4.75, Xbar: 1.99, Ybar: 0.987, Rmin: 0.864,
			src: aiscT17 + " (x̄ and ȳ exchange when the 4-in leg is connected)"},
		{name: "L5x3x1/2", A: 3.75, Xbar: 0.750, Ybar: 1.75, Rmin: 0.642, src: aiscT17},
		{name: "L5x3x1/2", swapped: true, A: 3.75, Xbar: 1.75, Ybar: 0.750, Rmin: 0.642, src: aiscT17},
		{name: "L8x8x1", A: 15.0, Xbar: 2.36, Ybar: 2.36, Rmin: 1.56, src: aiscT17},
		{name: "L3x3x1/4", A: 1.44, Xbar: 0.842, Ybar: 0.842, Rmin: 0.589,
			src: aiscT17 + " (rz least sure)"},
		{name: "L2x2x1/4", A: 0.938, Xbar: 0.592, Ybar: 0.592, Rmin: 0.391,
			src: aiscT17 + " (rz least sure)"},
	}
	for _, tc := range tests {
		label := tc.name
		if tc.swapped {
			label += "/short-leg-connected"
		}
		t.Run(label, func(t *testing.T) {
			a, err := Lookup(tc.name, units.US)
			require.NoError(t, err)
			if tc.swapped {
				a = a.Swapped()
			}
			p := a.Properties()
			assertRel(t, tc.A, float64(p.Area/units.SquareInch), tabTol, "A", tc.src)
			assertRel(t, tc.Xbar, p.Xbar.In(), tabTol, "Xbar", tc.src)
			assertRel(t, tc.Ybar, p.Ybar.In(), tabTol, "Ybar", tc.src)
			assertRel(t, tc.Rmin, p.Rmin.In(), tabTol, "Rmin", tc.src)
		})
	}
}

// enTables are EN 10056-1 angles as printed in a mill's section tables
// (ArcelorMittal / Tata Steel "Blue Book" style, in cm), from memory.
const enTables = "EN 10056-1 section tables (mill catalogue, cm units), from memory"

func TestPropertiesSI(t *testing.T) {
	tests := []struct {
		name    string
		swapped bool
		A       float64 // cm²
		Xbar    float64 // cm: e (equal), ez / ey (unequal)
		Ybar    float64 // cm
		Rmin    float64 // cm: iv
		src     string
	}{
		{name: "L50x50x5", A: 4.80, Xbar: 1.40, Ybar: 1.40, Rmin: 0.98, src: enTables},
		{name: "L60x60x6", A: 6.91, Xbar: 1.69, Ybar: 1.69, Rmin: 1.17, src: enTables},
		{name: "L80x80x8", A: 12.3, Xbar: 2.26, Ybar: 2.26, Rmin: 1.57, src: enTables},
		{name: "L100x100x10", A: 19.2, Xbar: 2.82, Ybar: 2.82, Rmin: 1.95, src: enTables},
		{name: "L150x150x15", A: 43.0, Xbar: 4.25, Ybar: 4.25, Rmin: 2.93, src: enTables},
		{name: "L200x200x20", A: 76.3, Xbar: 5.68, Ybar: 5.68, Rmin: 3.93, src: enTables + " (iv least sure)"},
		{name: "L150x90x10", A: 23.2, Xbar: 2.04, Ybar: 5.00, Rmin: 1.95, src: enTables},
		{name: "L150x90x10", swapped: true, A: 23.2, Xbar: 5.00, Ybar: 2.04, Rmin: 1.95,
			src: enTables + " (ey and ez exchange when the 90-mm leg is connected)"},
		{name: "L200x100x10", A: 29.2, Xbar: 2.01, Ybar: 6.93, Rmin: 2.15, src: enTables},
	}
	for _, tc := range tests {
		label := tc.name
		if tc.swapped {
			label += "/short-leg-connected"
		}
		t.Run(label, func(t *testing.T) {
			a, err := Lookup(tc.name, units.SI)
			require.NoError(t, err)
			if tc.swapped {
				a = a.Swapped()
			}
			p := a.Properties()
			assertRel(t, tc.A, float64(p.Area)/100, tabTol, "A", tc.src)
			assertRel(t, tc.Xbar, p.Xbar.Mm()/10, tabTol, "Xbar", tc.src)
			assertRel(t, tc.Ybar, p.Ybar.Mm()/10, tabTol, "Ybar", tc.src)
			assertRel(t, tc.Rmin, p.Rmin.Mm()/10, tabTol, "Rmin", tc.src)
		})
	}
}

// The shear-lag eccentricity is measured from the connected leg: bolting the
// 4-in leg of an L6x4x1/2 doubles it.
func TestXbarSwapped(t *testing.T) {
	a, err := Lookup("L6x4x1/2", units.US)
	require.NoError(t, err)
	long, short := a.Properties(), a.Swapped().Properties()
	src := aiscT17 + ": x̄ 0.987 in, ȳ 1.99 in"
	assertRel(t, 0.987, long.Xbar.In(), tabTol, "6-in leg connected", src)
	assertRel(t, 1.99, short.Xbar.In(), tabTol, "4-in leg connected", src)
	assert.InDelta(t, long.Imin, short.Imin, 1e-9*long.Imin, "Imin does not depend on which leg is connected")
	assert.InDelta(t, long.Iaa, short.Ibb, 1e-9*long.Iaa)
	assert.Equal(t, a, a.Swapped().Swapped())
}

// The fillet and toe pieces are exact: check them against their closed
// forms (hand derivation: square less quarter disc).
func TestSpandrelClosedForm(t *testing.T) {
	const r = 12.0
	s := spandrel(0, 0, r, 1, 1)
	assert.InEpsilon(t, (1-math.Pi/4)*r*r, s.a, 1e-12, "area (1 − π/4)r²")
	c := (10 - 3*math.Pi) / (12 - 3*math.Pi) * r // centroid from each edge
	assert.InEpsilon(t, c, s.cx, 1e-12)
	assert.InEpsilon(t, c, s.cy, 1e-12)
	// Second moment about the edge y = 0: r⁴(1 − 5π/16).
	assert.InEpsilon(t, r*r*r*r*(1-5*math.Pi/16), s.ixx+s.a*s.cy*s.cy, 1e-9)
}

// Cross-check the composed section against brute-force integration over a
// fine grid (midpoint rule, cell 0.02 mm): agreement well inside 0.1 %.
func TestPropertiesByIntegration(t *testing.T) {
	a, err := Lookup("L150x90x10", units.SI)
	require.NoError(t, err)
	p := a.Properties()

	A, B, T, r1, r2 := a.A.Mm(), a.B.Mm(), a.T.Mm(), a.R1.Mm(), a.R2.Mm()
	inside := func(x, y float64) bool {
		inLegs := (x < T && y < A) || (y < T && x < B)
		switch {
		case x > T && y > T && x < T+r1 && y < T+r1: // root fillet
			dx, dy := x-(T+r1), y-(T+r1)
			return dx*dx+dy*dy > r1*r1
		case x < T && x > T-r2 && y > A-r2: // toe of leg A
			dx, dy := x-(T-r2), y-(A-r2)
			return dx*dx+dy*dy <= r2*r2
		case y < T && y > T-r2 && x > B-r2: // toe of leg B
			dx, dy := x-(B-r2), y-(T-r2)
			return dx*dx+dy*dy <= r2*r2
		}
		return inLegs
	}
	const h = 0.02
	var n, sx, sy, sxx, syy, sxy float64
	for x := h / 2; x < B; x += h {
		for y := h / 2; y < A; y += h {
			if (x > T+r1+h && y > T+r1+h) || !inside(x, y) {
				continue
			}
			n++
			sx += x
			sy += y
			sxx += x * x
			syy += y * y
			sxy += x * y
		}
	}
	area := n * h * h
	cx, cy := sx/n, sy/n
	iyy := (sxx/n - cx*cx) * area
	ixx := (syy/n - cy*cy) * area
	ixy := (sxy/n - cx*cy) * area
	imin := (ixx+iyy)/2 - math.Hypot((ixx-iyy)/2, ixy)

	const tol = 0.001 // the 0.1 % the package promises
	src := "numerical integration, midpoint rule"
	assertRel(t, area, float64(p.Area), tol, "A", src)
	assertRel(t, cx, p.Xbar.Mm(), tol, "Xbar", src)
	assertRel(t, cy, p.Ybar.Mm(), tol, "Ybar", src)
	assertRel(t, iyy, p.Iaa, tol, "Iaa", src)
	assertRel(t, ixx, p.Ibb, tol, "Ibb", src)
	assertRel(t, imin, p.Imin, tol, "Imin", src)
}

func TestCatalogAnglesAreValid(t *testing.T) {
	for _, sys := range []units.System{units.US, units.SI} {
		for _, name := range Names(sys) {
			a, err := Lookup(name, sys)
			require.NoError(t, err, name)
			require.NoError(t, a.check(), name)
			assert.Greater(t, a.K, a.T, "%s: K beyond the thickness", name)
			assert.GreaterOrEqual(t, a.A, a.B, "%s: long leg first", name)
			p := a.Properties()
			assert.Greater(t, float64(p.Rmin), 0.0, name)
			assert.Less(t, p.Imin, math.Min(p.Iaa, p.Ibb), name)
		}
	}
}

func TestPropertiesPanicsOnInvalidAngle(t *testing.T) {
	for _, a := range []Angle{
		{},
		{Name: "thick", A: 50, B: 50, T: 60},
		{Name: "toe", A: 50, B: 50, T: 5, R2: 6},
		{Name: "nan", A: units.Length(math.NaN()), B: 50, T: 5},
	} {
		assert.PanicsWithValue(t, "section: "+a.check().Error(), func() { a.Properties() }, a.Name)
	}
}
