package engine

import "gaugeline/rules/units"

// Junction is where another element of the section stands on the
// connected element: an angle's outstanding leg at its heel, a tee's stem,
// a channel's flange, a W's web. The holes keep clear of its fillet and
// leave room beside it for the wrench (gage.workable); the sheet draws its
// faces for reference. Distances are across the connected element (y),
// measured from At, the line the tables measure from: an angle's heel
// (y = 0), a tee's or a W's web centre line, a channel's flange back.
type Junction struct {
	// Name is what a report calls the element: "outstanding leg", "stem",
	// "web", "flange".
	Name string
	// Fillet is the symbol of the toe distance in the shape tables: "k"
	// (from the heel or the flange back), "k1" (from the web centre line).
	Fillet string
	At     units.Length
	// Face is the distance from At to the element's face on the holes'
	// side (t of an angle's leg, tw/2 of a stem, tf of a channel's flange);
	// Toe to the toe of its fillet.
	Face, Toe units.Length
	// Side is +1 when the holes lie at greater y, −1 at smaller y, 0 on
	// both sides (a stem or web in the middle of a flange).
	Side int
}

// Sides lists the sides of the junction that holes may lie on.
func (j Junction) Sides() []int {
	if j.Side == 0 {
		return []int{-1, 1}
	}
	return []int{j.Side}
}

// Offset is how far y lies from At on side s (negative: on the other side).
func (j Junction) Offset(y units.Length, s int) units.Length {
	return units.Length(s) * (y - j.At)
}

// ConnectedElement names the element of a rolled section the holes are
// in, by the junctions on it: "web" (its edges join flanges), "flanges"
// (a W's two, Apart) or "flange".
func (m *Member) ConnectedElement() string {
	for _, j := range m.Junctions {
		if j.Name == "flange" {
			return "web"
		}
	}
	if Apart(m.Shape) {
		return "flanges"
	}
	return "flange"
}

// TearOff is the block a rolled section has besides those in the plane of
// its connected element (the AISC teaching model of a WT bolted through
// its flange, aisc-org/aisc-model-viewer src/wt-plate/calculations.md,
// "block shear 1"): the connected element torn across one row of bolts,
// in tension over At less the holes of that row, and the rest of the
// section sheared off along the toes of its fillets, Planes planes of
// thickness T from the member end to that row (no holes: Agv = Anv).
type TearOff struct {
	Planes int
	T      units.Length
	// At is the gross area in tension: for a tee, Ag less the stem beyond
	// the toe of its fillet, A − tw·(d − k).
	At units.Area
	// What names the shear planes for a report: "stem at the toe of the fillet".
	What string
}
