package engine

import (
	"math"
	"testing"

	"gaugeline/engine/netsection"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// The double-plate splice of Tamboli (ed.), Handbook of Structural Steel
// Connection Design and Details, 2nd ed. (McGraw-Hill 2009), §2.2.5.2
// "Splices in truss chords", Example, web splice, printed p. 125: the
// W14×99 web (t = 0.440 in, A992: Fy 50, Fu 65 ksi) between two 5/8-in A36
// splice plates (Fu 58 ksi), 7/8-in A325-X bolts in 15/16-in holes, two
// lines at 3-in gage × three bolts at 3-in pitch each side of the joint,
// end distance 1.75 in (member and splice plates), LRFD, the web's share
// of the load 178 kips. The layout is inferred from the printed block
// shear lengths (7.75 = 1.75 + 2·3 in; Ant = (3 − 1.0)·0.440).
//
// The web is modelled as a flat of the web's thickness. A flat has free
// side edges, which a web between flanges has not: it also has blocks
// to its sides. Its width is chosen so that the printed U block (between
// the two lines, all six bolts) governs the member's block shear. With an
// edge distance e to each side edge (hand calculation, J4.3, Ubs = 1):
//   - U block: Rn = 65·0.88 + min(0.6·65·4.62, 0.6·50·6.82) = 237.4 kips.
//   - edge to the far line (tension through the near line's hole, one
//     shear plane, all six bolts): Rn = 65·(e + 3 − 1.5·1.0)·0.440 +
//     0.6·65·(7.75 − 2.5)·0.440 ≥ 237.4 when e ≥ 3.65 in.
//   - edge to the near line (three bolts, half the force): 2·Rn ≥ 237.4
//     when e ≥ 1.5 in.
//
// e = 4.5 in (a 12-in flat, lines at y = 4.5 and 7.5 in) keeps the U block
// governing. The splice plates are taken 12 in wide too: the printed
// values compared do not depend on their width.
//
// Edition: the example is 360-05 (Fnv 60 ksi for A325-X, 27.1 kips per
// plane); the connection here is checked to 360-16 (Fnv 68 ksi). The
// compared bearing and tearout values use 2.4·d·t·Fu and 1.2·lc·t·Fu in
// both editions (deformation at service load considered), so they hold; the
// bolt group's 246 kips holds because no bolt reaches its shear strength
// in either edition (54.2 or 61.3 kips per bolt in double shear, above
// every hole's 45.0 or 33.0).
func tamboliWebSplice(t testing.TB) *Connection {
	e := edition(t, "aisc360-16", units.US)
	grade, err := e.Bolt("A325")
	if err != nil {
		t.Fatal(err)
	}
	dh := in(15.0 / 16)
	holes := append(line(1, 3, in(1.75), in(3), in(4.5), dh, dh, rules.Standard),
		line(4, 3, in(1.75), in(3), in(7.5), dh, dh, rules.Standard)...)
	return &Connection{
		Edition: e,
		Method:  rules.LRFD,
		Member:  Member{Shape: Flat, Width: in(12), T: in(0.44), Ag: in2(12 * 0.44), Pieces: 1, Fy: ksi(50), Fu: ksi(65)},
		Plate: &Plate{Kind: Splice, Count: 2, T: in(0.625), Width: in(12), FreeEdge: in(7.75 + 1.75), YCentre: in(6),
			Fy: ksi(36), Fu: ksi(58), Gap: in(0.25)},
		Bolt:   Bolt{D: in(0.875), Grade: grade, Threads: rules.ThreadsExcluded, DeformationConsidered: true},
		Holes:  holes,
		Demand: kip(178),
	}
}

func TestTamboliDoubleSplice(t *testing.T) {
	const src = "Tamboli (ed.), Handbook of Structural Steel Connection Design and Details, 2nd ed., §2.2.5.2, p. 125"
	c := tamboliWebSplice(t)
	if got := c.ShearPlanes(); got != 2 {
		t.Fatalf("shear planes = %d, want 2 (a flat between two splice plates)", got)
	}
	phi := c.Edition.BearingFactor().Phi
	rs, err := Check(c)
	if err != nil {
		t.Fatal(err)
	}
	byID := map[string]Result{}
	for _, r := range rs {
		byID[r.ID] = r
	}
	// Per bolt, φ·rn: the end bolt is H1 (x = 1.75, the member end) in the
	// member and H3 (x = 7.75, 1.75 in from the plates' end) in the plates.
	share := func(id, hole string) BoltShare {
		for _, s := range byID[id].PerBolt {
			if s.Hole == hole {
				return s
			}
		}
		t.Fatalf("%s has no bolt %s", id, hole)
		return BoltShare{}
	}
	near(t, "bearing on both splice plates, inner bolt (2.4dtFu, t = 2 × 5/8)", phi*share("plate.bearing", "H1").Rn.Kip(), 114, pubTol, src)
	near(t, "tearout of both splice plates, end bolt", phi*share("plate.bearing", "H3").Tearout.Kip(), 83.6, pubTol, src)
	near(t, "tearout of the web, end bolt", phi*share("member.bearing", "H1").Rn.Kip(), 33.0, pubTol, src)
	near(t, "web bearing, inner bolt", phi*share("member.bearing", "H2").Rn.Kip(), 45.0, pubTol, src)
	near(t, "bolt group 2×33.0 + 4×45.0", byID["bolts.group"].Available.Kip(), 246, pubTol, src)

	bs := byID["member.block-shear"]
	near(t, "web block shear φRn", bs.Available.Kip(), 178, pubTol, src)
	near(t, "Agv", value(t, bs, "Agv")/float64(units.SquareInch), 6.82, pubTol, src)
	near(t, "Anv", value(t, bs, "Anv")/float64(units.SquareInch), 4.62, pubTol, src)
	near(t, "Ant", value(t, bs, "Ant")/float64(units.SquareInch), 0.88, pubTol, src)
	if bs.Demand != c.Demand {
		t.Errorf("governing block carries %v of %v: want the U block of all six bolts", bs.Demand.Kip(), c.Demand.Kip())
	}

	// Double shear with Fnv = 68 ksi (360-16): AISC Design Guide 29,
	// Example 5.1, 7/8-in A325-X, φrn = 61.3 kips per bolt.
	sh := byID["bolts.shear"]
	near(t, "bolt double shear per bolt", sh.Available.Kip()/6, 61.3, pubTol, "AISC Design Guide 29, Example 5.1")
	if got := value(t, sh, "planes"); got != 2 {
		t.Errorf("bolts.shear planes = %v, want 2", got)
	}
}

// Two splice plates together are one plate of twice the thickness in
// every plate limit state (hand calculation: each of J4.1, J4.3, J3.10
// is linear in t); only the bolts see two shear planes.
func TestTwoSplicePlatesAreTwiceTheThickness(t *testing.T) {
	two := tamboliWebSplice(t)
	one := tamboliWebSplice(t)
	one.Plate.Count, one.Plate.T = 1, 2*two.Plate.T
	for _, f := range []func(*Connection) Result{PlateYield, PlateRupture, PlateBlockShear, PlateBearing} {
		a, b := f(two), f(one)
		if math.Abs(float64(a.Nominal-b.Nominal)) > 1e-9*math.Abs(float64(b.Nominal)) {
			t.Errorf("%s: two plates %v kips, one of twice the thickness %v", a.ID, a.Nominal.Kip(), b.Nominal.Kip())
		}
	}
	if one.ShearPlanes() != 1 || two.ShearPlanes() != 2 {
		t.Errorf("shear planes: one plate %d, two %d; want 1, 2", one.ShearPlanes(), two.ShearPlanes())
	}
	// Working states it: the thickness is both plates'.
	for _, v := range PlateYield(two).Values {
		if v.Name == "t" && v.What != "thickness of the 2 splice plates together (2 × 5/8 in)" {
			t.Errorf("t is %q", v.What)
		}
	}
}

// The splice plate's net path is searched across both groups; for a group
// and its mirror image it is one group's worst path (splice.go's argument),
// for any gap, staggered groups included.
func TestSpliceNetPathIsOneGroups(t *testing.T) {
	for _, gap := range []float64{0, 0.25, 2} {
		c := tamboliWebSplice(t)
		c.Plate.Gap = in(gap)
		// stagger the second line by 1.5 in: zig-zag paths inside a group
		for i := 3; i < 6; i++ {
			c.Holes[i].X += in(1.5)
		}
		one, _ := netsection.NetWidthDeduction(pathHoles(c, platePly))
		both, _ := netsection.NetWidthDeduction(platePathHoles(c))
		if len(platePathHoles(c)) != 12 {
			t.Fatalf("gap %v: %d holes on the plate, want both groups' 12", gap, len(platePathHoles(c)))
		}
		if math.Abs(float64(one-both)) > 1e-9 {
			t.Errorf("gap %v in: across both groups %v mm, one group %v mm", gap, float64(both), float64(one))
		}
	}
	// Member B's holes are A's mirrored about the joint: x_B = −gap − x.
	c := tamboliWebSplice(t)
	b := SpliceHoles(c)
	if len(b) != 6 || b[0].ID != "BH1" || math.Abs(float64(b[0].X+in(0.25)+in(1.75))) > 1e-9 || b[0].Y != c.Holes[0].Y {
		t.Errorf("member B's first hole %+v, want BH1 at x = −0.25 − 1.75 in, y = %v", b[0], c.Holes[0].Y)
	}
}

// The 360-16 cap of 0.85·Ag holds per splice plate, so for two plates it
// is 0.85 of both plates' Ag: two 3/8 x 8 plates with one 15/16-in hole
// across, An = (8 − 1)(2 × 0.375) = 5.25 in² > 0.85·(8)(0.75) = 5.10 in²
// (hand calculation, AISC 360-16 J4.1(b)); 360-22 has no cap.
func TestSplicePlateCapPerPlate(t *testing.T) {
	for _, c := range []struct {
		ed   string
		want float64
	}{{"aisc360-16", 5.10}, {"aisc360-22", 5.25}} {
		e := edition(t, c.ed, units.US)
		grade, _ := e.Bolt("A325")
		conn := &Connection{
			Edition: e, Method: rules.LRFD,
			Member: Member{Shape: Flat, Width: in(8), T: in(0.75), Ag: in2(6), Pieces: 1, Fy: ksi(36), Fu: ksi(58)},
			Plate:  &Plate{Kind: Splice, Count: 2, T: in(0.375), Width: in(8), YCentre: in(4), FreeEdge: in(30), Fy: ksi(36), Fu: ksi(58)},
			Bolt:   Bolt{D: in(7.0 / 8), Grade: grade, DeformationConsidered: true},
			Holes:  line(1, 8, in(1.5), in(3), in(4), in(15.0/16), in(15.0/16), rules.Standard),
		}
		near(t, c.ed+" An", value(t, PlateRupture(conn), "An")/float64(units.SquareInch), c.want, 1e-9, "AISC "+c.ed+" J4.1(b), hand calculation")
	}
}
