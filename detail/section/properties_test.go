package section

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

// tabTol is the relative tolerance against section tables. The tables
// round to 3 significant figures (up to 0.5 %): 1 % covers that and still
// catches a wrong leg, thickness or formula. (SI angles against their
// published rows: enTol, en10056_test.go.)
const tabTol = 0.01

// assertRel checks got against want within the relative tolerance tol.
func assertRel(t *testing.T, want, got, tol float64, what, src string) {
	t.Helper()
	assert.InEpsilon(t, want, got, tol, "%s (src: %s)", what, src)
}

// The angles of the AISC Shapes Database v15.0 (the data of AISC Manual
// Table 1-7), read in the copy v15.0/Shapes-US.csv of repository
// ambaker1/aisc-csv: the US catalog carries their A, x̄, ȳ, rx, ry, rz.
const aiscAngles = "AISC Shapes Database v15.0 (Shapes-US.csv, ambaker1/aisc-csv)"

// The published properties come through in the catalog's axes: x̄ from the
// connected leg, Iaa about the axis parallel to it (the database's ry for
// the long leg), exchanged when the short leg is connected. The values are
// the database's; what is checked is the mapping (units, axes, swap).
func TestPropertiesUS(t *testing.T) {
	tests := []struct {
		name    string
		swapped bool    // connect the short leg (leg B of the designation)
		A       float64 // in²
		Xbar    float64 // in, along the outstanding leg
		Ybar    float64 // in, along the connected leg
		Ra      float64 // in, about the axis parallel to the connected leg
		Rb      float64 // in, about the axis parallel to the outstanding leg
		Rmin    float64 // in, rz
	}{
		{name: "L4x4x1/2", A: 3.75, Xbar: 1.18, Ybar: 1.18, Ra: 1.21, Rb: 1.21, Rmin: 0.776},
		{name: "L6x4x1/2", A: 4.75, Xbar: 0.981, Ybar: 1.98, Ra: 1.14, Rb: 1.91, Rmin: 0.864},
		{name: "L6x4x1/2", swapped: true, A: 4.75, Xbar: 1.98, Ybar: 0.981, Ra: 1.91, Rb: 1.14, Rmin: 0.864},
		{name: "L5x3x1/2", A: 3.75, Xbar: 0.746, Ybar: 1.74, Ra: 0.824, Rb: 1.58, Rmin: 0.642},
		{name: "L5x3x1/2", swapped: true, A: 3.75, Xbar: 1.74, Ybar: 0.746, Ra: 1.58, Rb: 0.824, Rmin: 0.642},
		{name: "L8x6x1", A: 13.1, Xbar: 1.65, Ybar: 2.65, Ra: 1.72, Rb: 2.49, Rmin: 1.28},
		{name: "L2x2x1/4", A: 0.944, Xbar: 0.586, Ybar: 0.586, Ra: 0.605, Rb: 0.605, Rmin: 0.387},
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
			require.True(t, a.Tabulated())
			p := a.Properties()
			area := float64(p.Area)
			const tol = 1e-9
			assertRel(t, tc.A, float64(p.Area/units.SquareInch), tol, "A", aiscAngles)
			assertRel(t, tc.Xbar, p.Xbar.In(), tol, "Xbar", aiscAngles)
			assertRel(t, tc.Ybar, p.Ybar.In(), tol, "Ybar", aiscAngles)
			assertRel(t, tc.Ra, units.Length(math.Sqrt(p.Iaa/area)).In(), tol, "ra", aiscAngles)
			assertRel(t, tc.Rb, units.Length(math.Sqrt(p.Ibb/area)).In(), tol, "rb", aiscAngles)
			assertRel(t, tc.Rmin, p.Rmin.In(), tol, "Rmin", aiscAngles)
		})
	}
}

// Every US catalog angle's published row against its own geometry (the
// two rectangles, no radii): a mistyped row or a size the table does not
// describe shows as a gap wider than the fillets and rounded toes make.
// Measured: A within 1.7 %, x̄ and ȳ within 2.3 %, rx and ry within
// 1.5 %, rz within 2.6 % (the largest gaps on the thinnest legs). kdet − t is whole sixteenths, 1/4 to 5/8 in.
// Independent of the table: geometry from the designation (hand formulas).
func TestPublishedRowsMatchGeometry(t *testing.T) {
	names := Names(units.US)
	require.Len(t, usTable, len(names), "one published row per catalog size")
	for _, name := range names {
		a, err := Lookup(name, units.US)
		require.NoError(t, err)
		p, g := a.Properties(), a.Geometric()
		r := func(i float64, area units.Area) float64 { return math.Sqrt(i / float64(area)) }
		src := aiscAngles + " against the plain section, " + name
		assertRel(t, float64(g.Area), float64(p.Area), 0.018, "A", src)
		assertRel(t, float64(g.Xbar), float64(p.Xbar), 0.024, "x̄", src)
		assertRel(t, float64(g.Ybar), float64(p.Ybar), 0.024, "ȳ", src)
		assertRel(t, r(g.Iaa, g.Area), r(p.Iaa, p.Area), 0.016, "ra", src)
		assertRel(t, r(g.Ibb, g.Area), r(p.Ibb, p.Area), 0.016, "rb", src)
		assertRel(t, float64(g.Rmin), float64(p.Rmin), 0.027, "rz", src)
		off := float64((a.K - a.T) / units.Inch * 16)
		assert.InDelta(t, math.Round(off), off, 1e-6, "%s: kdet − t in sixteenths", name)
		assert.True(t, off >= 4-1e-6 && off <= 10+1e-6, "%s: kdet − t = %g/16 in", name, off)
	}
}

// Properties of SI angles are their geometry's (nominal legs, thickness
// and radii), in the catalog's axes: x̄ (Xbar) from the connected leg's
// back, exchanged when the short leg is connected. Each value is the
// published one, read as printed (cm, cm²); TestSIPublishedRowsMatchGeometry
// checks every other row the same way.
func TestPropertiesSI(t *testing.T) {
	tests := []struct {
		name    string
		swapped bool
		A       float64 // cm²
		Xbar    float64 // cm: e (equal), ez (unequal, from the long leg's back)
		Ybar    float64 // cm: e, ey
		Rmin    float64 // cm: iv
		src     string
	}{
		{name: "L50x50x5", A: 4.80, Xbar: 1.40, Ybar: 1.40, Rmin: 0.973, src: blueBook},
		{name: "L60x60x6", A: 6.91, Xbar: 1.69, Ybar: 1.69, Rmin: 1.17, src: blueBook},
		{name: "L80x80x8", A: 12.3, Xbar: 2.26, Ybar: 2.26, Rmin: 1.56, src: blueBook},
		{name: "L100x100x10", A: 19.2, Xbar: 2.82, Ybar: 2.82, Rmin: 1.95, src: blueBook},
		{name: "L150x150x15", A: 43.0, Xbar: 4.25, Ybar: 4.25, Rmin: 2.93, src: blueBook},
		{name: "L200x200x20", A: 76.3, Xbar: 5.68, Ybar: 5.68, Rmin: 3.92, src: blueBook},
		{name: "L100x75x8", A: 13.5, Xbar: 1.87, Ybar: 3.10, Rmin: 1.60, src: blueBook},
		{name: "L120x80x10", A: 19.1, Xbar: 1.95, Ybar: 3.92, Rmin: 1.72, src: arcelor},
		{name: "L150x90x10", A: 23.2, Xbar: 2.04, Ybar: 5.00, Rmin: 1.95, src: blueBook},
		{name: "L150x90x10", swapped: true, A: 23.2, Xbar: 5.00, Ybar: 2.04, Rmin: 1.95,
			src: blueBook + " (ey and ez exchange when the 90-mm leg is connected)"},
		{name: "L200x100x10", A: 29.2, Xbar: 2.01, Ybar: 6.93, Rmin: 2.15, src: blueBook},
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
			require.False(t, a.Tabulated(), "SI properties are the geometry's")
			p := a.Properties()
			assertRel(t, tc.A, float64(p.Area)/100, enTol, "A", tc.src)
			assertRel(t, tc.Xbar, p.Xbar.Mm()/10, enTol, "Xbar", tc.src)
			assertRel(t, tc.Ybar, p.Ybar.Mm()/10, enTol, "Ybar", tc.src)
			assertRel(t, tc.Rmin, p.Rmin.Mm()/10, enTol, "Rmin", tc.src)
		})
	}
}

// The shear-lag eccentricity is measured from the connected leg: bolting the
// 4-in leg of an L6x4x1/2 doubles it.
func TestXbarSwapped(t *testing.T) {
	a, err := Lookup("L6x4x1/2", units.US)
	require.NoError(t, err)
	long, short := a.Properties(), a.Swapped().Properties()
	src := aiscAngles + ": x̄ 0.981 in, ȳ 1.98 in"
	assertRel(t, 0.981, long.Xbar.In(), tabTol, "6-in leg connected", src)
	assertRel(t, 1.98, short.Xbar.In(), tabTol, "4-in leg connected", src)
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
