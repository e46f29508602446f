package engine

import (
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Code is the design standard a connection is checked to: what checking
// it asks of the standard, as numbers, tables and clause labels. The limit
// states here read its resistance factors and coefficients; the detailing
// rules (package detail/detailing) its hole, edge and spacing tables; the
// reports its name and the clause each label has in this edition.
//
// AISC 360 is one Code: *rules.Edition, editions 360-22 and 360-16, each
// in US or SI units (rules.Lookup). A second standard is a sibling package
// of rules with a type of its own that implements Code; whoever reads the
// job's standard (detail.Build) picks it, and nothing here asks which one
// it is. Clause labels are asked by their AISC 360-16 number; a standard
// of another numbering maps them to its own.
type Code interface {
	// Name is the job-file spelling ("aisc360-22"); System the unit system
	// the tables are read in.
	Name() string
	System() units.System
	// Clause is the clause or table of this edition a 360-16 label names.
	Clause(label16 string) string
	// Unconfirmed lists the tables of this edition and unit system whose
	// values were not read in the standard's own text.
	Unconfirmed() []string

	// Resistance factors (φ and Ω) of the limit states.
	YieldFactor() rules.Factor
	RuptureFactor() rules.Factor
	BlockShearFactor() rules.Factor
	BoltShearFactor() rules.Factor
	BearingFactor() rules.Factor
	FlexureFactor() rules.Factor
	SlipFactor(t rules.HoleType, dir rules.SlotDir) rules.Factor

	// Net sections, bolts and plates.
	HoleAllowance() units.Length
	BearingCoefficients(t rules.HoleType, dir rules.SlotDir, deformationConsidered bool) (bearing, tearout float64)
	LongJoint() (units.Length, float64)
	FillerFactor(t units.Length) float64
	Pretension(b rules.BoltGrade, d units.Length) (units.Force, error)
	Mu(c rules.SlipClass) float64
	Du() float64
	Hf(fillers int) float64
	SplicePlateCap() (float64, bool)
	BarPlasticCap() float64
	SteelModulus() units.Stress
	// Compression (Chapter E and J4.4).
	CompressionFactor() rules.Factor
	ShearModulus() units.Stress

	// Detailing tables.
	Hole(d units.Length, t rules.HoleType) (rules.HoleSize, error)
	HolePermitted(t rules.HoleType, dir rules.SlotDir, j rules.Joint) (ok bool, why string)
	MinEdge(d units.Length) (units.Length, error)
	EdgeIncrement(d units.Length, t rules.HoleType) (units.Length, error)
	MaxEdge(t units.Length) units.Length
	MinSpacing(d units.Length) units.Length
	ClearSpacingRule() bool
	MaxSpacing(t units.Length, weathering bool) units.Length
}

// AISC 360 is a Code.
var _ Code = (*rules.Edition)(nil)
