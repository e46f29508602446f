package engine

import (
	"gaugeline/engine/loads"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// ServiceLoads are nominal (service-level) axial tensions by load type
// (package loads).
type ServiceLoads = loads.ServiceLoads

// Combine is loads.Combine: the governing required strength of the basic
// load combinations of ASCE/SEI 7 and the combination that governs. It
// stays here for the callers that read a job's loads.
func Combine(m rules.Method, l ServiceLoads) (units.Force, string) { return loads.Combine(m, l) }

// Reverses and Demand are package loads' (which service loads act either
// way; a governing required strength of one sign and its combination).
type (
	Reverses       = loads.Reverses
	Demand         = loads.Demand
	CombinationRow = loads.Row
)

// Combinations is loads.Table: every basic combination's tension and
// compression, for the report.
func Combinations(m rules.Method, l ServiceLoads, r Reverses) []CombinationRow {
	return loads.Table(m, l, r)
}

// Demands is loads.Demands: the governing required tension and
// compression of the basic load combinations of ASCE/SEI 7.
func Demands(m rules.Method, l ServiceLoads, r Reverses) (tension, compression Demand) {
	return loads.Demands(m, l, r)
}
