package engine

import (
	"gaugeline/rules"
	"gaugeline/rules/units"
)

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
	// Factor is the φ and Ω applied: Available = Factor.Available(method,
	// Nominal). Zero for an interaction (Working.Interaction).
	Factor rules.Factor
	Values []Value
	Note   string // what was checked, e.g. "toe strip of line 1"
	// Case is "compression" for a limit state of the member pushing
	// (Connection.Compression); "" for the tension case.
	Case    string
	PerBolt []BoltShare // bearing and tearout only
	// explain builds the working; set by the limit state where it
	// computes the result, from copies of what it used (never the
	// Connection, which the caller may change), and called only when a
	// report asks, so that the layout search pays nothing for it.
	explain func() Working
}

// Working is how the result was reached, for a report: see Working.
func (r *Result) Working() Working {
	if r.explain == nil {
		return Working{}
	}
	return r.explain()
}

// valueList collects a limit state's values in the order of
// Result.Values. add returns where the value lies in the list, so that the
// working, built later, reads it there instead of holding a copy.
type valueList struct{ list []Value }

func newValues(n int) valueList { return valueList{make([]Value, 0, n)} }

// add appends v; the list never grows past its capacity, so the pointers
// add returned stay in it.
func (vs *valueList) add(v Value) *Value {
	if len(vs.list) == cap(vs.list) {
		panic("engine: valueList: more values than its capacity")
	}
	vs.list = append(vs.list, v)
	return &vs.list[len(vs.list)-1]
}

// named adds the value name = v of dimension d, printed sym, meaning what.
func (vs *valueList) named(name string, v float64, d units.Dim, sym, what string) *Value {
	return vs.add(Value{Name: name, V: v, Dim: d, Sym: sym, What: what})
}
