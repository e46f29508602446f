package engine

import "gaugeline/rules/units"

// FlatBar is a flat bar bolted through its width: its whole section is
// the connected element, both long edges free.
type FlatBar struct{}

// Flat is the flat bar (the type has one value).
var Flat FlatBar

func (FlatBar) String() string                     { return "flat" }
func (FlatBar) Pieces() int                        { return 1 }
func (FlatBar) FreeEdges() (low, high bool)        { return true, true }
func (FlatBar) ConnectedArea(m *Member) units.Area { return m.Ag }
func (FlatBar) ShearLagCases() D31                 { return D31Case1 }
func (FlatBar) CentredGroup() bool                 { return true }

// MonotoneGage: the search places a flat's group in one position (centred
// on the bar, J1.7), so there is nothing to prune.
func (FlatBar) MonotoneGage() bool { return false }
