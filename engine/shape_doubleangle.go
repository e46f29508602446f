package engine

// AnglePair is two angles back to back, both bolted through the plate
// between them: each piece is a single angle's connected leg, heel at
// y = 0, toe at y = Width; two shear planes.
type AnglePair struct{ angleLegs }

// DoubleAngle is the double angle (the type has one value).
var DoubleAngle AnglePair

func (AnglePair) String() string { return "double-angle" }
func (AnglePair) Pieces() int    { return 2 }
