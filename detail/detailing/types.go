package detailing

import "gaugeline/rules/units"

// MemberInfo is what the detailing checks need of the member beyond the
// limit states' model.
type MemberInfo struct {
	Designation string       // "L4x4x1/2", "PL 6x1/2", for people
	K           units.Length // angles: heel to the end of the fillet
	Length      units.Length // unbraced length for slenderness; 0 = not given
	Rmin        units.Length // least radius of gyration of the member
	Weathering  bool         // unpainted weathering steel (A588)
	Grade       string       // member steel grade name
	PlateGrade  string       // plate steel grade name
	// PositionTol is the fabrication tolerance on a hole's position (the
	// job's tolerance.position): how far a flat's bolt group may sit off
	// the bar's centre line before J1.7's finding fails.
	PositionTol units.Length
	// AsBuilt marks a model of measured holes (reverify): its hole.size
	// finding allows DiameterTol, the fabrication tolerance, over the
	// nominal size.
	AsBuilt     bool
	DiameterTol units.Length
}

// Finding is the outcome of one detailing check.
type Finding struct {
	ID       string // stable id, e.g. "edge.min"
	Clause   string
	Measured float64 // internal units of Dim
	Limit    float64
	Dim      units.Dim
	// Pass is true when the rule is met; Advisory findings never fail a job.
	Pass     bool
	Advisory bool
	Where    string // which holes or edge, e.g. "H1 to member end"
}
