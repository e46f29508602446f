package engine_test

// "Adding a shape" (DEVELOPERS.md) followed in a test: two shapes that
// exist only here, in another package, plugged into engine.Check through
// engine.Shape alone. Nothing in package engine names them.

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// testBar is a renamed copy of the flat bar.
type testBar struct{}

func (testBar) String() string                            { return "test-bar" }
func (testBar) Pieces() int                               { return 1 }
func (testBar) FreeEdges() (low, high bool)               { return true, true }
func (testBar) ConnectedArea(m *engine.Member) units.Area { return m.Ag }
func (testBar) ShearLagCases() engine.D31                 { return engine.D31Case1 }
func (testBar) CentredGroup() bool                        { return true }
func (testBar) MonotoneGage() bool                        { return false }

// teeStem is a hypothetical tee bolted through its stem: the flange at
// the heel (y = 0), the stem's end free; Table D3.1 case 2 and the D3
// bound apply, case 8 (angles only) does not.
type teeStem struct{}

func (teeStem) String() string              { return "tee-stem" }
func (teeStem) Pieces() int                 { return 1 }
func (teeStem) FreeEdges() (low, high bool) { return false, true }
func (teeStem) ConnectedArea(m *engine.Member) units.Area {
	return m.Width.Mul(m.T)
}
func (teeStem) ShearLagCases() engine.D31 { return engine.D31Case2 | engine.D31Bound }
func (teeStem) CentredGroup() bool        { return false }
func (teeStem) MonotoneGage() bool        { return true }

func shapeEdition(t *testing.T, name string, sys units.System) *rules.Edition {
	t.Helper()
	e, err := rules.Lookup(name, sys)
	if err != nil {
		t.Fatal(err)
	}
	return e
}

func holesOnLine(n int, x0, pitch, y, d units.Length) []engine.Hole {
	hs := make([]engine.Hole, n)
	for i := range hs {
		hs[i] = engine.Hole{ID: fmt.Sprintf("H%d", i+1), X: x0 + units.Length(i)*pitch, Y: y,
			HoleShape: engine.HoleShape{Type: rules.Standard, Dx: d, Dy: d}}
	}
	return hs
}

func find(t *testing.T, rs []engine.Result, id string) engine.Result {
	t.Helper()
	for _, r := range rs {
		if r.ID == id {
			return r
		}
	}
	t.Fatalf("no %s in %d results", id, len(rs))
	return engine.Result{}
}

func valueOf(t *testing.T, r engine.Result, name string) float64 {
	t.Helper()
	for _, v := range r.Values {
		if v.Name == name {
			return v.V
		}
	}
	t.Fatalf("%s: no value %s", r.ID, name)
	return 0
}

func relNear(t *testing.T, what string, got, want, tol float64, src string) {
	t.Helper()
	if math.Abs(got-want) > tol*math.Abs(want) {
		t.Errorf("%s = %.4g, want %.4g ± %.1f %% (%s)", what, got, want, 100*tol, src)
	}
}

// A renamed copy of the flat checks as the flat does, limit state by limit
// state, and meets a published bar: PL 3/4 x 4 A36, one 15/16-in hole
// across, An = 2.25 in², φRn = 97.9 kips.
func TestAddedShapeRenamedFlat(t *testing.T) {
	const src = "Tamboli (ed.), Handbook of Structural Steel Connection Design and Details, 2nd ed., ch. 2, flange splice (inner plate)"
	e := shapeEdition(t, "aisc360-22", units.US)
	grade, err := e.Bolt("A325")
	if err != nil {
		t.Fatal(err)
	}
	conn := func(s engine.Shape) *engine.Connection {
		c := &engine.Connection{
			Edition: e, Method: rules.LRFD,
			Member: engine.Member{Shape: s, Width: 4 * units.Inch, T: 0.75 * units.Inch, Ag: 3 * units.SquareInch, Pieces: 1,
				Fy: 36 * units.Ksi, Fu: 58 * units.Ksi, Eccentricity: engine.EccentricityProvided},
			Plate: &engine.Plate{Kind: engine.Splice, T: 0.75 * units.Inch, Width: 4 * units.Inch, YCentre: 2 * units.Inch,
				FreeEdge: 9 * units.Inch, Fy: 36 * units.Ksi, Fu: 58 * units.Ksi},
			Bolt:   engine.Bolt{D: 0.875 * units.Inch, Grade: grade, DeformationConsidered: true},
			Holes:  holesOnLine(3, 1.5*units.Inch, 3*units.Inch, 2*units.Inch, 15.0/16*units.Inch),
			Demand: 60 * units.Kip,
		}
		return c
	}
	want, err := engine.Check(conn(engine.Flat))
	if err != nil {
		t.Fatal(err)
	}
	got, err := engine.Check(conn(testBar{}))
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != len(want) {
		t.Fatalf("%d results, the flat has %d", len(got), len(want))
	}
	for i := range want {
		g, w := got[i], want[i]
		if g.ID != w.ID || g.Nominal != w.Nominal || g.Available != w.Available || g.Ratio != w.Ratio || g.Note != w.Note {
			t.Errorf("result %d: %s %v %v %q, the flat gives %s %v %v %q (common practice, no source: a renamed copy checks alike)",
				i, g.ID, g.Nominal, g.Available, g.Note, w.ID, w.Nominal, w.Available, w.Note)
		}
	}
	find(t, got, "member.combined") // J1.7 asked of the shape: the eccentricity is provided for
	r := find(t, got, "member.rupture")
	relNear(t, "member.rupture An", valueOf(t, r, "An")/float64(units.SquareInch), 2.25, 0.005, src)
	relNear(t, "member.rupture U", valueOf(t, r, "U"), 1, 0, "AISC 360-22 Table D3.1 case 1")
	relNear(t, "member.rupture φRn", r.Available.Kip(), 97.9, 0.005, src)
	if e := engine.ShapeNames(); e != "angle, double-angle, flat, wt, channel, double-channel or w" {
		t.Errorf("ShapeNames = %q: the test shapes must not be listed", e)
	}
}

// A tee connected through its stem takes U from Table D3.1 case 2 (or the
// D3 bound), never case 8, which is for angles: on a short connection,
// where an angle's four bolts in a line get case 8's 0.80, the stem keeps
// 1 − x̄/l. Its heel has no free edge, so block shear tears to the free
// end only.
func TestAddedShapeTeeStem(t *testing.T) {
	e := shapeEdition(t, "aisc360-22", units.SI)
	grade, err := e.Bolt("A325M")
	if err != nil {
		t.Fatal(err)
	}
	conn := func(s engine.Shape) *engine.Connection {
		// The section's figures are inputs only (hypothetical, not a
		// catalog size); l = 3 × 30 mm = 90 mm.
		return &engine.Connection{
			Edition: e, Method: rules.LRFD,
			Member: engine.Member{Shape: s, Width: 100, Outstanding: 100, T: 10, Ag: 1920, Xbar: 28.2, Pieces: 1, Fy: 345, Fu: 450},
			Bolt:   engine.Bolt{D: 20, Grade: grade, DeformationConsidered: true},
			Holes:  holesOnLine(4, 40, 30, 60, 22),
			Demand: 100 * units.Kilonewton,
		}
	}
	rs, err := engine.Check(conn(teeStem{}))
	if err != nil {
		t.Fatal(err)
	}
	r := find(t, rs, "member.rupture")
	// Table D3.1 case 2: U = 1 − x̄/l = 1 − 28.2/90 = 0.6867 (hand
	// calculation); the bound 100·10/1920 = 0.521 is smaller.
	relNear(t, "tee stem U", valueOf(t, r, "U"), 1-28.2/90, 1e-12, "AISC 360-22 Table D3.1 case 2, hand calculation")
	for _, v := range r.Values {
		if v.Name == "U_case8" || v.Name == "U_case7" {
			t.Errorf("tee stem: rupture carries %s = %g; AISC 360-22 Table D3.1: case 8 is for angles, case 7 for flanges", v.Name, v.V)
		}
	}
	if !strings.Contains(r.Note, "case 2") {
		t.Errorf("rupture note %q, want Table D3.1 case 2", r.Note)
	}
	bs := find(t, rs, "member.block-shear")
	if strings.Contains(bs.Note, "near edge") {
		t.Errorf("block shear %q tears to the heel, which is no free edge", bs.Note)
	}
	ra, err := engine.Check(conn(engine.Angle))
	if err != nil {
		t.Fatal(err)
	}
	relNear(t, "angle U", valueOf(t, find(t, ra, "member.rupture"), "U"), 0.80, 0, "AISC 360-22 Table D3.1 case 8, four bolts per line")
}
