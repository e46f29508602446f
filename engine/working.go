package engine

import "gaugeline/engine/working"

// The working of a limit state (Result.Working) is built from the
// expressions of package working; these aliases keep the names a report
// and the limit states use.
type (
	Value       = working.Value
	Working     = working.Working
	Interaction = working.Interaction
	Table       = working.Table
	Column      = working.Column
	Cell        = working.Cell
	Step        = working.Step
	Expr        = working.Expr
	Format      = working.Format
)
