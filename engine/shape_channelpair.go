package engine

import "gaugeline/rules/units"

// ChannelPairWebs is two channels back to back, both bolted through their
// webs to the plate between them: each piece is a channel's web, y from
// one flange back (0) to the other (Width = d), neither edge free; two
// shear planes. U is Table D3.1 case 2 (x̄ of one channel, from the back of
// its web), never below the webs' area over Ag (D3).
type ChannelPairWebs struct{}

// DoubleChannel is the pair of channels (the type has one value).
var DoubleChannel ChannelPairWebs

func (ChannelPairWebs) String() string                    { return "double-channel" }
func (ChannelPairWebs) Catalog() (family, example string) { return "C or MC", "2C8x11.5" }
func (ChannelPairWebs) Pieces() int                       { return 2 }
func (ChannelPairWebs) PieceName() string                 { return "channel" }
func (ChannelPairWebs) FreeEdges() (low, high bool)       { return false, false }
func (ChannelPairWebs) ConnectedArea(m *Member) units.Area {
	return units.Area(float64(m.Pieces) * float64(m.Width) * float64(m.T))
}
func (ChannelPairWebs) ShearLagCases() D31 { return D31Case2 | D31Bound }

// CentredGroup: the lines symmetric about the webs' centre line (common
// practice, no source).
func (ChannelPairWebs) CentredGroup() bool { return true }

// MonotoneGage: the group is placed centred, in one position.
func (ChannelPairWebs) MonotoneGage() bool { return false }
