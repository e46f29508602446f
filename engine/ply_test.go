package engine

import (
	"math"
	"testing"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// withPlies gives every hole of c the member ply m and the plate ply p, and
// adds a 1/2-in A36 gusset 12 in wide whose free edge is 1-1/2 in past the
// last bolt.
func withPlies(c *Connection, m, p HoleShape) *Connection {
	for i := range c.Holes {
		c.Holes[i].HoleShape = m
		pp := p
		c.Holes[i].Plate = &pp
	}
	c.Plate = &Plate{Kind: Gusset, T: in(0.5), Width: in(12), FreeEdge: c.Holes[len(c.Holes)-1].X + in(1.5),
		YCentre: in(2.5), Fy: ksi(36), Fu: ksi(58)}
	return c
}

// Hole shapes of a 3/4-in bolt, AISC 360-16 Table J3.3: standard 13/16,
// oversized 15/16, short slot 13/16 × 1, long slot 13/16 × 1-7/8.
var (
	std34      = HoleShape{Type: rules.Standard, Dx: in(13.0 / 16), Dy: in(13.0 / 16)}
	over34     = HoleShape{Type: rules.Oversized, Dx: in(15.0 / 16), Dy: in(15.0 / 16)}
	shortAcr34 = HoleShape{Type: rules.ShortSlot, Slot: rules.Transverse, Dx: in(13.0 / 16), Dy: in(1)}
	longAcr34  = HoleShape{Type: rules.LongSlot, Slot: rules.Transverse, Dx: in(13.0 / 16), Dy: in(1 + 7.0/8)}
	longAlg34  = HoleShape{Type: rules.LongSlot, Slot: rules.Longitudinal, Dx: in(1 + 7.0/8), Dy: in(13.0 / 16)}
)

func TestInPlate(t *testing.T) {
	h := Hole{ID: "H1", HoleShape: longAcr34}
	if got := h.InPlate(); got != longAcr34 || h.PliesDiffer() {
		t.Errorf("no plate ply: InPlate %+v, differ %v; want the member's", got, h.PliesDiffer())
	}
	p := std34
	h.Plate = &p
	if got := h.InPlate(); got != std34 || !h.PliesDiffer() {
		t.Errorf("plate ply given: InPlate %+v, differ %v", got, h.PliesDiffer())
	}
	same := longAcr34
	h.Plate = &same
	if h.PliesDiffer() {
		t.Error("a plate ply equal to the member's differs")
	}
}

// TestPlateBearingUsesThePlatePly: the member in long slots, the plate in
// standard holes. The plate's bearing takes the standard hole's
// coefficients and clear distances, the member's its slots'.
func TestPlateBearingUsesThePlatePly(t *testing.T) {
	t.Run("long slots across the load in the member", func(t *testing.T) {
		c := withPlies(designExampleD2(t, rules.LRFD), longAcr34, std34)
		pb := PlateBearing(c)
		// Hand calculation, AISC 360-16 J3.10(a)(1) for the plate's standard
		// holes: bearing 2.4·d·t·Fu = 2.4·0.75·0.5·58 = 52.2 kip; tearout
		// 1.2·lc·t·Fu with lc = 1.5 − 13/32 = 1.09375 in at the bolt next to
		// the free edge (38.0625 kip) and 3 − 13/16 = 2.1875 in elsewhere
		// (76.125 kip, so bearing governs): Rn = 38.0625 + 3·52.2.
		near(t, "plate Rn", float64(pb.Nominal/units.Kip), 38.0625+3*52.2, 1e-9, "hand calculation, AISC 360-16 J3.10(a)(1)")
		near(t, "plate bearing coefficient", value(t, pb, "bearing_coefficient"), 2.4, 0, "AISC 360-16 J3.10(a)(1)")
		mb := MemberBearing(c)
		// The member's long slots across the force, J3.10(b): 2.0·d·t·Fu =
		// 43.5 kip; tearout 1.0·lc·t·Fu, lc = 1.5 − 13/32 toward the end
		// (31.71875 kip), 2.1875 in between holes (63.4375 kip).
		near(t, "member Rn", float64(mb.Nominal/units.Kip), 31.71875+3*43.5, 1e-9, "hand calculation, AISC 360-16 J3.10(b)")
		near(t, "member bearing coefficient", value(t, mb, "bearing_coefficient"), 2.0, 0, "AISC 360-16 J3.10(b)")
	})
	t.Run("long slots along the load in the member", func(t *testing.T) {
		c := withPlies(designExampleD2(t, rules.LRFD), longAlg34, std34)
		pb := PlateBearing(c)
		// Plate: standard holes, lc = 1.5 − 13/32 = 1.09375 in at the bolt
		// next to the free edge, 3 − 13/16 = 2.1875 in elsewhere (hand
		// calculation; the member's 1-7/8-in slots would give 0.5625 and
		// 1.125 in).
		for i, want := range []float64{2.1875, 2.1875, 2.1875, 1.09375} {
			near(t, "plate lc "+pb.PerBolt[i].Hole, pb.PerBolt[i].Lc.In(), want, 1e-9, "hand calculation, AISC 360-16 J3.10 (lc)")
		}
		mb := MemberBearing(c)
		// Member: 1-7/8-in slots along the load, lc = 1.5 − 15/16 = 0.5625
		// in toward the end, 3 − 1-7/8 = 1.125 in between holes.
		for i, want := range []float64{0.5625, 1.125, 1.125, 1.125} {
			near(t, "member lc "+mb.PerBolt[i].Hole, mb.PerBolt[i].Lc.In(), want, 1e-9, "hand calculation, AISC 360-16 J3.10 (lc)")
		}
	})
}

// TestSlipFactorEitherPly: φ and Ω of slip go by the most severe hole type
// in either ply (J3.8 lists them by hole type; a bolt slips through the
// holes of every ply it clamps).
func TestSlipFactorEitherPly(t *testing.T) {
	tests := []struct {
		name          string
		member, plate HoleShape
		phi, omega    float64
		src           string
	}{
		{"standard both", std34, std34, 1.00, 1.50, "AISC 360-16 J3.8(a)"},
		{"long slot in the plate only", std34, longAcr34, 0.70, 2.14, "AISC 360-16 J3.8(c)"},
		{"long slot in the member only", longAlg34, std34, 0.70, 2.14, "AISC 360-16 J3.8(c)"},
		{"oversized member, short slot across in the plate", over34, shortAcr34, 0.85, 1.76, "AISC 360-16 J3.8(b) governs J3.8(a)"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			c := withPlies(designExampleD2(t, rules.LRFD), tt.member, tt.plate)
			c.Bolt.Joint, c.Bolt.Surface = rules.SlipCritical, rules.ClassA
			r, err := BoltSlip(c)
			if err != nil {
				t.Fatal(err)
			}
			if phi, om := value(t, r, "phi"), value(t, r, "omega"); math.Abs(phi-tt.phi) > 0 || math.Abs(om-tt.omega) > 0 {
				t.Errorf("φ %g Ω %g, want %g %g (%s)", phi, om, tt.phi, tt.omega, tt.src)
			}
		})
	}
}
