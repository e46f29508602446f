package engine

import "gaugeline/rules/units"

// AnglePair is two angles back to back, both bolted through the plate
// between them: each piece is a single angle's connected leg, heel at
// y = 0, toe at y = Width; two shear planes.
type AnglePair struct{}

// DoubleAngle is the double angle (the type has one value).
var DoubleAngle AnglePair

func (AnglePair) String() string              { return "double-angle" }
func (AnglePair) Pieces() int                 { return 2 }
func (AnglePair) FreeEdges() (low, high bool) { return false, true }
func (AnglePair) ConnectedArea(m *Member) units.Area {
	return units.Area(float64(m.Pieces) * float64(m.Width) * float64(m.T))
}
func (AnglePair) ShearLagCases() D31 { return D31Case2 | D31Case8 | D31Bound }
func (AnglePair) CentredGroup() bool { return false }
func (AnglePair) MonotoneGage() bool { return true }
