package engine

import "gaugeline/rules/units"

// angleLegs is what the angle shapes share: each piece is bolted through
// its connected leg, the heel at y = 0 joining the outstanding leg, the
// toe at y = Width free.
type angleLegs struct{}

func (angleLegs) FreeEdges() (low, high bool) { return false, true }
func (angleLegs) ConnectedArea(m *Member) units.Area {
	return units.Area(float64(m.Pieces) * float64(m.Width) * float64(m.T))
}
func (angleLegs) ShearLagCases() D31 { return D31Case2 | D31Case8 | D31Bound }
func (angleLegs) CentredGroup() bool { return false }
func (angleLegs) MonotoneGage() bool { return true }

// SingleAngle is a single angle bolted through one leg: the heel at y = 0
// joins the outstanding leg, the toe at y = Width is free.
type SingleAngle struct{ angleLegs }

// Angle is the single angle (the type has one value).
var Angle SingleAngle

func (SingleAngle) String() string { return "angle" }
func (SingleAngle) Pieces() int    { return 1 }
