package engine

import "gaugeline/rules/units"

// TeeFlange is a tee (WT) bolted through its flange to one plate: the
// flange is the connected element, y from one flange tip (0) to the other
// (Width = bf), both tips free edges, the stem standing on its centre line
// (a Junction the builder sets). U is the larger of Table D3.1 case 2
// (x̄ = ȳ of the tee, from the flange's outer face) and case 7 (tees cut
// from W shapes), never below the flange's area over Ag (D3).
type TeeFlange struct{}

// Tee is the tee bolted through its flange (the type has one value).
var Tee TeeFlange

func (TeeFlange) String() string                     { return "wt" }
func (TeeFlange) Catalog() (family, example string)  { return "WT", "WT8x25" }
func (TeeFlange) Pieces() int                        { return 1 }
func (TeeFlange) FreeEdges() (low, high bool)        { return true, true }
func (TeeFlange) ConnectedArea(m *Member) units.Area { return m.Width.Mul(m.T) }
func (TeeFlange) ShearLagCases() D31                 { return D31Case2 | D31Case7 | D31Bound }

// CentredGroup: the group symmetric about the stem, the section's axis
// in the flange's plane (J1.7 exempts "similar members" from the gravity
// axis out of that plane; across the flange a shop keeps the lines
// symmetric, common practice, no source).
func (TeeFlange) CentredGroup() bool { return true }

// MonotoneGage: the group is placed centred, in one position.
func (TeeFlange) MonotoneGage() bool { return false }
