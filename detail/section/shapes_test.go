package section

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

// aiscDB is where the tabulated values below were read: AISC Shapes
// Database v15.0 (the data of the 15th-edition Manual's Tables 1-1, 1-5,
// 1-6 and 1-8), file aisc-shapes-database-v15.0.csv in repository
// jonsadka/steel-explorer.
const aiscDB = "AISC Shapes Database v15.0 (aisc-shapes-database-v15.0.csv, jonsadka/steel-explorer)"

// Tolerances against the table, which rounds to 3 significant figures
// (up to 0.5 %).
//
//   - W and WT: rectangles plus the four (two) root fillets of radius
//     kdes − tf, exact pieces. What is left out is the table's rounding and
//     kdes's (the fillet radius is read to 3 figures of k): 1 % on every
//     property. Seen: within 0.54 % (WT6x36 A).
//   - C: the sloped flange is modelled (16-2/3 %, tf at mid-flange) but not
//     the web-flange fillet nor the rounded toes; the missing fillet is
//     under 1 % of the area: 1.5 % on A, x̄ and ry, 1 % on rx (the fillet
//     sits near the x axis). Seen: within 1.1 % (C8x11.5 ry).
//   - MC: as C but with parallel flanges, the slope not being published in
//     a source read; x̄ and ry are carried from the table (see
//     TestMCGeometryMissesTable).
const (
	tolW    = 0.01
	tolC    = 0.015
	tolCrx  = 0.01
	tolCarr = 1e-9 // carried values are the table's own
)

func TestShapePropertiesW(t *testing.T) {
	tests := []struct {
		name   string
		A      float64 // in²
		rx, ry float64 // in
		src    string
	}{
		{"W8x21", 6.16, 3.49, 1.26, aiscDB + "; also AISC Design Examples v16.0 D.1 (Ag 6.16, ry 1.26)"},
		{"W8x24", 7.08, 3.42, 1.61, aiscDB},
		{"W10x33", 9.71, 4.19, 1.94, aiscDB},
		{"W12x40", 11.7, 5.13, 1.94, aiscDB},
		{"W12x72", 21.1, math.NaN(), math.NaN(), "aisc-org/aisc-model-viewer src/wf-truss/calculations.md (Ag 21.1)"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, err := LookupW(tc.name)
			require.NoError(t, err)
			p := s.Properties()
			assertRel(t, tc.A, float64(p.Area/units.SquareInch), tolW, "A", tc.src)
			if !math.IsNaN(tc.rx) {
				assertRel(t, tc.rx, p.Rx.In(), tolW, "rx", tc.src)
				assertRel(t, tc.ry, p.Ry.In(), tolW, "ry", tc.src)
			}
			assert.InDelta(t, s.D.In()/2, p.Ybar.In(), 1e-9, "doubly symmetric")
			assert.InDelta(t, s.Bf.In()/2, p.Xbar.In(), 1e-9, "doubly symmetric")
			assert.Empty(t, p.Carried)
		})
	}
}

func TestShapePropertiesW8x24Inertia(t *testing.T) {
	s, err := LookupW("W8x24")
	require.NoError(t, err)
	p := s.Properties()
	in4 := math.Pow(float64(units.Inch), 4)
	assertRel(t, 82.7, p.Ix/in4, tolW, "Ix", aiscDB)
	assertRel(t, 18.3, p.Iy/in4, tolW, "Iy", aiscDB)
}

func TestShapePropertiesWT(t *testing.T) {
	tests := []struct {
		name    string
		A, ybar float64 // in², in from the flange's outer face
		rx, ry  float64 // in
		src     string
	}{
		{"WT4x10.5", 3.08, 0.831, 1.12, 1.26, aiscDB + "; ȳ 0.831 also AISC Design Examples v16.0 D.1"},
		{"WT6x20", 5.84, 1.09, 1.57, 1.94, aiscDB + "; also AISC Design Examples v16.0 D.3"},
		{"WT6x25", 7.30, 1.17, 1.60, 1.96, aiscDB},
		{"WT6x36", 10.6, 1.02, 1.48, 3.04, aiscDB + "; ȳ 1.02 also aisc-model-viewer wf-truss"},
		{"WT8x25", 7.37, 1.89, 2.40, 1.59, aiscDB + "; A, ȳ also aisc-model-viewer wt-plate"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, err := LookupWT(tc.name)
			require.NoError(t, err)
			p := s.Properties()
			assertRel(t, tc.A, float64(p.Area/units.SquareInch), tolW, "A", tc.src)
			assertRel(t, tc.ybar, p.Ybar.In(), tolW, "ȳ", tc.src)
			assertRel(t, tc.rx, p.Rx.In(), tolW, "rx", tc.src)
			assertRel(t, tc.ry, p.Ry.In(), tolW, "ry", tc.src)
			assert.InDelta(t, s.Bf.In()/2, p.Xbar.In(), 1e-9, "symmetric about the stem")
		})
	}
}

func TestShapePropertiesC(t *testing.T) {
	tests := []struct {
		name    string
		A, xbar float64 // in², in from the back of the web
		rx, ry  float64 // in
		carried bool    // x̄ and ry carried from the table (MC)
		src     string
	}{
		{"C8x11.5", 3.37, 0.572, 3.11, 0.623, false, aiscDB},
		{"C9x20", 5.87, 0.583, 3.22, 0.640, false, aiscDB},
		{"C10x15.3", 4.48, 0.634, 3.88, 0.711, false, aiscDB},
		{"C12x25", 7.34, 0.674, 4.43, 0.779, false, aiscDB},
		{"MC6x12", 3.53, 0.704, 2.30, 0.724, true, aiscDB},
		{"MC8x18.7", 5.50, 0.849, 3.09, 0.868, true, aiscDB},
		{"MC10x22", 6.45, 0.990, 3.99, 0.997, true, aiscDB},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			s, err := LookupC(tc.name)
			require.NoError(t, err)
			p := s.Properties()
			tol := tolC
			if tc.carried {
				tol = tolCarr
				assert.Equal(t, []string{"xbar", "ry"}, p.Carried)
			} else {
				assert.Empty(t, p.Carried)
			}
			assertRel(t, tc.A, float64(p.Area/units.SquareInch), tolC, "A", tc.src)
			assertRel(t, tc.xbar, p.Xbar.In(), tol, "x̄", tc.src)
			assertRel(t, tc.rx, p.Rx.In(), tolCrx, "rx", tc.src)
			assertRel(t, tc.ry, p.Ry.In(), tol, "ry", tc.src)
			assert.InDelta(t, s.D.In()/2, p.Ybar.In(), 1e-9, "symmetric about the x axis")
		})
	}
}

// C8x11.5's second moments, computed against the table.
func TestShapePropertiesC8Inertia(t *testing.T) {
	s, err := LookupC("C8x11.5")
	require.NoError(t, err)
	p := s.Properties()
	in4 := math.Pow(float64(units.Inch), 4)
	assertRel(t, 32.5, p.Ix/in4, tolCrx, "Ix", aiscDB)
	assertRel(t, 1.31, p.Iy/in4, 2*tolC, "Iy (∝ ry², twice ry's tolerance)", aiscDB)
}

// Why the MC rows carry x̄ and ry: the parallel-flange geometry puts them
// 3 to 7 % above the table (seen: 3.9–6.2 %), past what the model's
// omissions (fillets, rounding) explain. Should the catalog learn the MC
// slopes, this test says the override can go.
func TestMCGeometryMissesTable(t *testing.T) {
	for _, name := range ShapeNames(FamilyMC) {
		s, err := LookupC(name)
		require.NoError(t, err)
		g, p := s.Geometry(), s.Properties()
		for _, v := range []struct {
			what     string
			geo, tab units.Length
		}{{"x̄", g.Xbar, p.Xbar}, {"ry", g.Ry, p.Ry}} {
			dev := float64(v.geo/v.tab) - 1
			assert.True(t, dev > 0.03 && dev < 0.07, "%s %s: geometry %.3f in against the table's %.3f in (%+.1f %%; src: %s)",
				name, v.what, v.geo.In(), v.tab.In(), 100*dev, aiscDB)
		}
		assert.Equal(t, g.Area, p.Area, "area is computed")
		assert.Equal(t, g.Rx, p.Rx, "rx is computed")
	}
}

// The composed sections against brute-force integration over a grid
// (midpoint rule, cell 0.005 in): the pieces are exact, so within 0.1 %.
func TestShapeGeometryByIntegration(t *testing.T) {
	for _, name := range []string{"W8x21", "WT8x25", "C8x11.5"} {
		t.Run(name, func(t *testing.T) {
			var s Shape
			var err error
			switch name[:2] {
			case "WT":
				s, err = LookupWT(name)
			case "W8":
				s, err = LookupW(name)
			default:
				s, err = LookupC(name)
			}
			require.NoError(t, err)
			d, bf, tw, tf, r := s.D.In(), s.Bf.In(), s.Tw.In(), s.Tf.In(), (s.K - s.Tf).In()
			inside := func(x, y float64) bool { // x from a toe (channels: web back), y from the bottom face
				switch s.Family {
				case FamilyC:
					tt := tf + CSlope*((tw+bf)/2-x)
					return x < tw || y < tt || y > d-tt
				case FamilyWT:
					u := math.Abs(x - bf/2)
					if y < tf || u < tw/2 {
						return true
					}
					du, dy := u-(tw/2+r), y-(tf+r)
					return u < tw/2+r && y < tf+r && du*du+dy*dy > r*r
				default:
					u := math.Abs(x - bf/2)
					yy := math.Min(y, d-y)
					if yy < tf || u < tw/2 {
						return true
					}
					du, dy := u-(tw/2+r), yy-(tf+r)
					return u < tw/2+r && yy < tf+r && du*du+dy*dy > r*r
				}
			}
			const h = 0.005
			var n, sx, sy, sxx, syy float64
			for x := h / 2; x < bf; x += h {
				for y := h / 2; y < d; y += h {
					if inside(x, y) {
						n++
						sx += x
						sy += y
						sxx += x * x
						syy += y * y
					}
				}
			}
			area := n * h * h
			cx, cy := sx/n, sy/n
			iy := (sxx/n - cx*cx) * area
			ix := (syy/n - cy*cy) * area
			p := s.Geometry()
			in4 := math.Pow(float64(units.Inch), 4)
			src := "numerical integration, midpoint rule"
			assertRel(t, area, float64(p.Area/units.SquareInch), 0.001, "A", src)
			assertRel(t, cx, p.Xbar.In(), 0.001, "Xbar", src)
			assertRel(t, cy, p.Ybar.In(), 0.001, "Ybar", src)
			assertRel(t, ix, p.Ix/in4, 0.001, "Ix", src)
			assertRel(t, iy, p.Iy/in4, 0.001, "Iy", src)
		})
	}
}

func TestLookupShapeSpellings(t *testing.T) {
	for _, tc := range []struct {
		in, want string
		lookup   func(string) (Shape, error)
	}{
		{"W8x21", "W8x21", LookupW},
		{"w8X21", "W8x21", LookupW},
		{" W 8 × 21 ", "W8x21", LookupW},
		{"WT4x10.5", "WT4x10.5", LookupWT},
		{"wt 6 x 20", "WT6x20", LookupWT},
		{"C8x11.5", "C8x11.5", LookupC},
		{"mc10x22", "MC10x22", LookupC},
	} {
		s, err := tc.lookup(tc.in)
		require.NoError(t, err, tc.in)
		assert.Equal(t, tc.want, s.Name, tc.in)
	}
}

func TestLookupShapeUnknown(t *testing.T) {
	for _, tc := range []struct {
		in       string
		lookup   func(string) (Shape, error)
		contains []string
	}{
		{"W8x22", LookupW, []string{`"W8x22"`, "W8x21", "W12x72"}},
		{"WT4x10.5", LookupW, []string{"W8x21"}},  // a WT is not a W
		{"W8x21", LookupWT, []string{"WT4x10.5"}}, // nor the reverse
		{"C6x12", LookupC, []string{"C8x11.5", "MC6x12"}},
		{"L4x4x1/2", LookupC, []string{"MC10x22"}},
	} {
		_, err := tc.lookup(tc.in)
		require.Error(t, err, tc.in)
		var ue *UnknownShapeError
		require.True(t, errors.As(err, &ue), tc.in)
		for _, s := range tc.contains {
			assert.Contains(t, err.Error(), s, tc.in)
		}
	}
}

func TestShapeNames(t *testing.T) {
	assert.Equal(t, []string{"MC6x12", "MC8x18.7", "MC10x22"}, ShapeNames(FamilyMC))
	assert.Len(t, ShapeNames(FamilyW), 5)
	assert.Len(t, ShapeNames(FamilyWT), 5)
	assert.Len(t, ShapeNames(FamilyC), 4)
	for _, f := range []Family{FamilyW, FamilyWT, FamilyC, FamilyMC} {
		for _, n := range ShapeNames(f) {
			s, err := lookupShape(n, f)
			require.NoError(t, err)
			require.NoError(t, s.check(), n)
			assert.Equal(t, f, s.Family)
		}
	}
	assert.Equal(t, CSlope, mustC(t, "C10x15.3").Slope, "C: 16-2/3 % slope")
	assert.Zero(t, mustC(t, "MC10x22").Slope, "MC: parallel flanges in the model")
}

func mustC(t *testing.T, name string) Shape {
	t.Helper()
	s, err := LookupC(name)
	require.NoError(t, err)
	return s
}

func TestShapePropertiesPanicsOnInvalid(t *testing.T) {
	good, err := LookupW("W8x21")
	require.NoError(t, err)
	bad := []Shape{{}, good, good, good}
	bad[1].K = good.Tf / 2    // kdes below tf
	bad[2].Tf = good.D / 2    // flanges fill the depth
	bad[3].Family = Family(9) // no such family
	for _, s := range bad {
		assert.PanicsWithValue(t, "section: "+s.check().Error(), func() { s.Properties() }, s.Name)
	}
}

// A metric designation names the same shape as the US one, and its mass
// per metre is the section's area times the density of steel, 7850 kg/m³
// (common practice, no source), within 3 %: the designations are from
// memory and round the mass to two or three figures (MC250x33 for 32.7
// kg/m: 1 %), the areas come from the nominal dimensions (within 1 to
// 1.5 % of the AISC Shapes Database v15.0).
func TestMetricDesignations(t *testing.T) {
	for _, f := range []Family{FamilyW, FamilyWT, FamilyC, FamilyMC} {
		for _, name := range ShapeNames(f) {
			us, err := lookupShape(name, f)
			if err != nil {
				t.Fatal(err)
			}
			si, err := lookupShape(us.Metric, f)
			if err != nil || si.Name != us.Name {
				t.Errorf("%s: metric %q finds %q (%v)", name, us.Metric, si.Name, err)
				continue
			}
			var depth, mass float64
			if _, err := fmt.Sscanf(strings.TrimLeft(us.Metric, "WTMC"), "%gx%g", &depth, &mass); err != nil {
				t.Fatalf("%s: %v", us.Metric, err)
			}
			kgm := float64(us.Properties().Area) * 7850e-6 // mm² × kg/m³ → kg/m
			if math.Abs(kgm-mass) > 0.03*mass {
				t.Errorf("%s = %s: %.1f kg/m from the area, the designation says %g", name, us.Metric, kgm, mass)
			}
		}
	}
}

// k1Src is where the k1 values and the rows' other dimensions below were
// read: the AISC Shapes Database v15.0 in its text copy v15.0/Shapes-US.csv
// (repository ambaker1/aisc-csv), columns d, bf, tw, tf, kdes and k1.
const k1Src = "AISC Shapes Database v15.0, ambaker1/aisc-csv v15.0/Shapes-US.csv, column k1 (read)"

// dbRow is one row of the database as read, in inches; k1 0 where the
// database leaves it blank (every WT row; the WT4X10.5 row was also read
// blank in jonsadka/steel-explorer aisc-shapes-database-v15.0.csv).
type dbRow struct{ d, bf, tw, tf, kdes, k1 float64 }

var k1Rows = map[string]dbRow{
	"W8X21":    {8.28, 5.27, 0.25, 0.4, 0.7, 0.5625},
	"W8X24":    {7.93, 6.5, 0.245, 0.4, 0.794, 0.5625},
	"W10X33":   {9.73, 7.96, 0.29, 0.435, 0.935, 0.75},
	"W12X40":   {11.9, 8.01, 0.295, 0.515, 1.02, 0.875},
	"W12X50":   {12.2, 8.08, 0.37, 0.64, 1.14, 0.9375},
	"W12X72":   {12.3, 12, 0.43, 0.67, 1.27, 1.0625},
	"W16X50":   {16.3, 7.07, 0.38, 0.63, 1.03, 0.8125},
	"WT4X10.5": {4.14, 5.27, 0.25, 0.4, 0.7, 0},
	"WT6X20":   {5.97, 8.01, 0.295, 0.515, 1.02, 0},
	"WT6X25":   {6.1, 8.08, 0.37, 0.64, 1.14, 0},
	"WT6X36":   {6.13, 12, 0.43, 0.67, 1.27, 0},
	"WT8X25":   {8.13, 7.07, 0.38, 0.63, 1.03, 0},
}

// Every W and WT row's K1 is the published k1: a W's from its own row, a
// WT's (blank in the database) from the row of the W it is cut from, whose
// flange, web and kdes, so its fillet, are the WT's. The row's d, bf, tw,
// tf and kdes are the catalog's too. Exact: the database prints k1 in
// sixteenths and the catalog stores the read decimals.
func TestShapeK1Published(t *testing.T) {
	tests := []struct {
		name, row string
		cutFrom   string // the W a WT is cut from ("" for a W)
	}{
		{"W8x21", "W8X21", ""},
		{"W8x24", "W8X24", ""},
		{"W10x33", "W10X33", ""},
		{"W12x40", "W12X40", ""},
		{"W12x72", "W12X72", ""},
		{"WT4x10.5", "WT4X10.5", "W8X21"},
		{"WT6x20", "WT6X20", "W12X40"},
		{"WT6x25", "WT6X25", "W12X50"},
		{"WT6x36", "WT6X36", "W12X72"},
		{"WT8x25", "WT8X25", "W16X50"},
	}
	const exact = 1e-9 // in
	seen := map[string]bool{}
	for _, tc := range tests {
		seen[tc.name] = true
		t.Run(tc.name, func(t *testing.T) {
			family := "W"
			if tc.cutFrom != "" {
				family = "WT"
			}
			s, err := LookupIn(family, tc.name)
			require.NoError(t, err)
			r := k1Rows[tc.row]
			src := k1Src + ", row " + tc.row
			for _, c := range []struct {
				what      string
				got, want float64
			}{
				{"d", s.D.In(), r.d}, {"bf", s.Bf.In(), r.bf}, {"tw", s.Tw.In(), r.tw},
				{"tf", s.Tf.In(), r.tf}, {"kdes", s.K.In(), r.kdes},
			} {
				assert.InDelta(t, c.want, c.got, exact, "%s (%s)", c.what, src)
			}
			want, from := r.k1, src
			if tc.cutFrom != "" {
				assert.Zero(t, r.k1, "the database's WT rows leave k1 blank (%s)", src)
				w := k1Rows[tc.cutFrom]
				from = k1Src + ", row " + tc.cutFrom + ", the W the tee is cut from (the " + tc.row + " row's k1 is blank)"
				for _, c := range []struct {
					what      string
					got, want float64
				}{{"bf", w.bf, r.bf}, {"tw", w.tw, r.tw}, {"tf", w.tf, r.tf}, {"kdes", w.kdes, r.kdes}} {
					assert.InDelta(t, c.want, c.got, exact, "%s of %s against %s's: the same fillet (%s)", c.what, tc.cutFrom, tc.row, k1Src)
				}
				want = w.k1
			}
			require.NotZero(t, want, "no published k1 (%s)", from)
			assert.InDelta(t, want, s.K1.In(), exact, "k1 (%s)", from)
			// the geometry's fillet toe, tw/2 + kdes − tf, falls short of it
			approx := s.Tw/2 + s.K - s.Tf
			assert.Less(t, approx.In(), s.K1.In(), "tw/2 + kdes − tf against the published k1 (%s)", from)
		})
	}
	for _, f := range []Family{FamilyW, FamilyWT} {
		for _, n := range ShapeNames(f) {
			assert.True(t, seen[n], "%s has no published k1 checked here", n)
		}
	}
	for _, n := range ShapeNamesIn("C or MC") {
		s, err := LookupC(n)
		require.NoError(t, err)
		assert.Zero(t, s.K1, "%s: a channel has no k1", n)
	}
}
