package engine

import "gaugeline/rules/units"

// Value is a named intermediate value of a limit state, with its dimension
// so that it can be printed in the job's units.
type Value struct {
	Name string
	V    float64 // internal units
	Dim  units.Dim
}

// BoltShare is one bolt's contribution to a per-bolt limit state.
type BoltShare struct {
	Hole     string
	Lc       units.Length // clear distance in the direction of the force
	Bearing  units.Force  // bearing nominal strength of this hole
	Tearout  units.Force  // tearout nominal strength of this hole
	Rn       units.Force  // the smaller
	Governed string       // "bearing" or "tearout"
}

// Result is the outcome of one limit state.
type Result struct {
	ID        string // stable id, e.g. "member.rupture"
	Clause    string // in the edition in force, e.g. "D2(b)"
	Nominal   units.Force
	Available units.Force
	Demand    units.Force
	Ratio     float64 // demand / available
	Pass      bool
	Values    []Value
	Note      string      // what was checked, e.g. "toe strip of line 1"
	PerBolt   []BoltShare // bearing and tearout only
}
