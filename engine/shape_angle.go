package engine

import "gaugeline/rules/units"

// SingleAngle is a single angle bolted through one leg: the heel at y = 0
// joins the outstanding leg, the toe at y = Width is free.
type SingleAngle struct{}

// Angle is the single angle (the type has one value).
var Angle SingleAngle

func (SingleAngle) String() string              { return "angle" }
func (SingleAngle) Pieces() int                 { return 1 }
func (SingleAngle) FreeEdges() (low, high bool) { return false, true }
func (SingleAngle) ConnectedArea(m *Member) units.Area {
	return units.Area(float64(m.Pieces) * float64(m.Width) * float64(m.T))
}
func (SingleAngle) ShearLagCases() D31 { return D31Case2 | D31Case8 | D31Bound }
func (SingleAngle) CentredGroup() bool { return false }
func (SingleAngle) MonotoneGage() bool { return true }
