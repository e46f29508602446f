package engine

import "gaugeline/rules/units"

// ChannelWeb is a channel (C or MC) bolted through its web to one plate:
// the web is the connected element, y from one flange's back (0) to the
// other's (Width = d); both long edges join a flange (two Junctions the
// builder sets), so neither is free. U is Table D3.1 case 2 (x̄ of the
// channel, from the back of the web), never below the web's area over Ag
// (D3).
type ChannelWeb struct{}

// Channel is the channel bolted through its web (the type has one value).
var Channel ChannelWeb

func (ChannelWeb) String() string                     { return "channel" }
func (ChannelWeb) Catalog() (family, example string)  { return "C or MC", "C8x11.5" }
func (ChannelWeb) Pieces() int                        { return 1 }
func (ChannelWeb) FreeEdges() (low, high bool)        { return false, false }
func (ChannelWeb) ConnectedArea(m *Member) units.Area { return m.Width.Mul(m.T) }
func (ChannelWeb) ShearLagCases() D31                 { return D31Case2 | D31Bound }

// CentredGroup: the lines symmetric about the web's centre line, the
// section's axis in the web's plane (common practice, no source).
func (ChannelWeb) CentredGroup() bool { return true }

// MonotoneGage: the group is placed centred, in one position.
func (ChannelWeb) MonotoneGage() bool { return false }
