package engine

import "gaugeline/rules/units"

// WideFlanges is a W (or S, HP) shape bolted through both flanges, each to
// a plate of its own: each flange is a connected element and a piece
// (Pieces 2, Apart), y from one tip (0) to the other (Width = bf), the web
// on its centre line (a Junction the builder sets). The holes are one
// flange's; the other flange has the same. U is the larger of Table D3.1
// case 2 (x̄ = ȳ of the half-section tee) and case 7, never below the
// flanges' area over Ag (D3).
type WideFlanges struct{}

// Wide is the W shape bolted through both flanges (the type has one value).
var Wide WideFlanges

func (WideFlanges) String() string                    { return "w" }
func (WideFlanges) Catalog() (family, example string) { return "W", "W8x21" }
func (WideFlanges) Pieces() int                       { return 2 }
func (WideFlanges) Apart() bool                       { return true }
func (WideFlanges) PieceName() string                 { return "flange" }
func (WideFlanges) FreeEdges() (low, high bool)       { return true, true }
func (WideFlanges) ConnectedArea(m *Member) units.Area {
	return units.Area(float64(m.Pieces) * float64(m.Width) * float64(m.T))
}
func (WideFlanges) ShearLagCases() D31 { return D31Case2 | D31Case7 | D31Bound }

// CentredGroup: the group symmetric about the web (common practice, no
// source).
func (WideFlanges) CentredGroup() bool { return true }

// MonotoneGage: the group is placed centred, in one position.
func (WideFlanges) MonotoneGage() bool { return false }
