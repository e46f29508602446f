// Package loads combines a member's service loads by load type into its
// required strength with the basic load combinations of ASCE/SEI 7: the
// demand that the limit states of package engine are checked against.
// Forces are in the internal units of package units (N), tension positive.
package loads

import (
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// ServiceLoads are nominal (service-level) axial tensions by load type,
// combined by Combine with the basic combinations of ASCE 7.
type ServiceLoads struct {
	D, L, Lr, S, R, W, E units.Force
}

type combination struct {
	name  string
	value func(l ServiceLoads, roof units.Force) units.Force
}

// lrfdCombinations are ASCE/SEI 7-16 2.3.1 (and 2.3.6 for seismic), all
// loads taken as tension of the member.
var lrfdCombinations = []combination{
	{"1.4D", func(l ServiceLoads, _ units.Force) units.Force { return 1.4 * l.D }},
	{"1.2D + 1.6L + 0.5(Lr or S or R)", func(l ServiceLoads, r units.Force) units.Force { return 1.2*l.D + 1.6*l.L + 0.5*r }},
	{"1.2D + 1.6(Lr or S or R) + (L or 0.5W)", func(l ServiceLoads, r units.Force) units.Force {
		return 1.2*l.D + 1.6*r + max(l.L, 0.5*l.W)
	}},
	{"1.2D + 1.0W + L + 0.5(Lr or S or R)", func(l ServiceLoads, r units.Force) units.Force { return 1.2*l.D + l.W + l.L + 0.5*r }},
	{"1.2D + 1.0E + L + 0.2S", func(l ServiceLoads, _ units.Force) units.Force { return 1.2*l.D + l.E + l.L + 0.2*l.S }},
	{"0.9D + 1.0W", func(l ServiceLoads, _ units.Force) units.Force { return 0.9*l.D + l.W }},
	{"0.9D + 1.0E", func(l ServiceLoads, _ units.Force) units.Force { return 0.9*l.D + l.E }},
}

// asdCombinations are ASCE/SEI 7-16 2.4.1.
var asdCombinations = []combination{
	{"D", func(l ServiceLoads, _ units.Force) units.Force { return l.D }},
	{"D + L", func(l ServiceLoads, _ units.Force) units.Force { return l.D + l.L }},
	{"D + (Lr or S or R)", func(l ServiceLoads, r units.Force) units.Force { return l.D + r }},
	{"D + 0.75L + 0.75(Lr or S or R)", func(l ServiceLoads, r units.Force) units.Force { return l.D + 0.75*l.L + 0.75*r }},
	{"D + (0.6W or 0.7E)", func(l ServiceLoads, _ units.Force) units.Force { return l.D + max(0.6*l.W, 0.7*l.E) }},
	{"D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)", func(l ServiceLoads, r units.Force) units.Force {
		return l.D + 0.75*l.L + 0.75*0.6*l.W + 0.75*r
	}},
	{"D + 0.75L + 0.75(0.7E) + 0.75S", func(l ServiceLoads, _ units.Force) units.Force {
		return l.D + 0.75*l.L + 0.75*0.7*l.E + 0.75*l.S
	}},
	{"0.6D + 0.6W", func(l ServiceLoads, _ units.Force) units.Force { return 0.6*l.D + 0.6*l.W }},
	{"0.6D + 0.7E", func(l ServiceLoads, _ units.Force) units.Force { return 0.6*l.D + 0.7*l.E }},
}

// Combine returns the governing required strength of the basic load
// combinations of ASCE/SEI 7 (2.3.1 strength design for LRFD, 2.4.1
// allowable stress design for ASD) and the combination that governs. All
// loads are tensions of the member; the first combination reaching the
// largest value is named.
func Combine(m rules.Method, l ServiceLoads) (units.Force, string) {
	combos := lrfdCombinations
	if m == rules.ASD {
		combos = asdCombinations
	}
	roof := max(l.Lr, l.S, l.R)
	var best units.Force
	name := combos[0].name
	for _, c := range combos {
		if v := c.value(l, roof); v > best {
			best, name = v, c.name
		}
	}
	return best, "ASCE 7 " + m.String() + ": " + name
}
