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
