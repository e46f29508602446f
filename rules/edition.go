package rules

import (
	"fmt"
	"strings"

	"gaugeline/rules/units"
)

// Edition is one edition of the standard in one unit system. Obtain it
// with Lookup; its zero value is not usable.
type Edition struct {
	name   string       // "aisc360-22" or "aisc360-16"
	year   int          // 2022 or 2016
	system units.System // the unit system its tables are read in
}

// Name is the edition's job-file spelling: "aisc360-22" or "aisc360-16".
func (e *Edition) Name() string { return e.name }

// Year is the year of the edition: 2022 or 2016.
func (e *Edition) Year() int { return e.year }

// System is the unit system the edition's tables are read in.
func (e *Edition) System() units.System { return e.system }

// Names lists the editions Lookup knows, newest first.
func Names() []string { return []string{"aisc360-22", "aisc360-16"} }

// Lookup returns the named edition with its tables in the given unit system.
func Lookup(name string, sys units.System) (*Edition, error) {
	if sys != units.US && sys != units.SI {
		return nil, fmt.Errorf("unknown unit system %d (want us or si)", int(sys))
	}
	switch name {
	case "aisc360-22":
		return &Edition{name: name, year: 2022, system: sys}, nil
	case "aisc360-16":
		return &Edition{name: name, year: 2016, system: sys}, nil
	}
	return nil, fmt.Errorf("unknown edition %q (want one of %s)", name, strings.Join(Names(), ", "))
}

// String names the edition and its unit system, e.g. "aisc360-22 (us)".
func (e *Edition) String() string { return e.name + " (" + e.system.String() + ")" }

// Clause returns the label, in this edition, of the clause a 360-16 label
// names: under 360-22 "J3.10" becomes "J3.11"; labels outside J3 (and table
// names) are unchanged.
func (e *Edition) Clause(label16 string) string { return e.clause(label16) }

// Diameters lists the bolt diameters tabulated in this edition and system,
// smallest first (us: 1/2 … 1-1/2 in; si: M12 (360-22 only) … M36).
func (e *Edition) Diameters() []units.Length {
	tab := e.tableDiameters()
	ds := make([]units.Length, len(tab))
	for i, D := range tab {
		ds[i] = units.Length(D) * e.unit()
	}
	return ds
}

// Hole returns the nominal hole size for bolt diameter d (Table J3.3 [J3.3M]).
func (e *Edition) Hole(d units.Length, t HoleType) (HoleSize, error) {
	return e.hole(d, t)
}

// HoleAllowance is what B4.3 adds to the nominal hole for net area:
// 1/16 in (us) or 2 mm (si).
func (e *Edition) HoleAllowance() units.Length { return e.holeAllowance() }

// MinEdge is the minimum distance from the centre of a standard hole to any
// edge (Table J3.4 [J3.4M]).
func (e *Edition) MinEdge(d units.Length) (units.Length, error) { return e.minEdge(d) }

// EdgeIncrement is C2 of Table J3.5 [J3.5M] for a hole of type t whose long
// axis is perpendicular to the edge (0 for standard holes; callers pass
// Standard for slots parallel to the edge).
func (e *Edition) EdgeIncrement(d units.Length, t HoleType) (units.Length, error) {
	return e.edgeIncrement(d, t)
}

// MinSpacing is 2-2/3·d, the least centre-to-centre spacing (J3.3 [J3.4]).
func (e *Edition) MinSpacing(d units.Length) units.Length { return minSpacing(d) }

// ClearSpacingRule reports whether the clear distance between holes must
// also be at least d (360-22 only).
func (e *Edition) ClearSpacingRule() bool { return e.is22() }

// MaxEdge is the largest distance from a bolt centre to the nearest edge of
// a part of thickness t in contact: 12t, at most 6 in (150 mm) (J3.5 [J3.6]).
func (e *Edition) MaxEdge(t units.Length) units.Length { return e.maxEdge(t) }

// MaxSpacing is the largest longitudinal spacing for a plate and shape in
// continuous contact, t the thinner part: 24t ≤ 12 in (300 mm); unpainted
// weathering steel 14t ≤ 7 in (180 mm).
func (e *Edition) MaxSpacing(t units.Length, weathering bool) units.Length {
	return e.maxSpacing(t, weathering)
}

// Bolt returns a bolt grade by its job-file name (us: A307, A325, A490,
// F1852, F2280 and the F3125 spellings; si: A325M, A490M).
func (e *Edition) Bolt(name string) (BoltGrade, error) { return e.bolt(name) }

// BoltGrades lists the grade names Bolt accepts in this edition and system.
func (e *Edition) BoltGrades() []string { return e.boltGrades() }

// GroupName is the edition's name for a bolt group ("Group A" under
// 360-16, "Group 120" under 360-22).
func (e *Edition) GroupName(g BoltGroup) string { return e.groupName(g) }

// Pretension is the minimum bolt pretension Tb (Table J3.1 [J3.1M]).
func (e *Edition) Pretension(b BoltGrade, d units.Length) (units.Force, error) {
	return e.pretension(b, d)
}

// LongJoint returns the pattern length beyond which Fnv is reduced for
// end-loaded joints (38 in, 950 mm) and the factor applied (0.833).
func (e *Edition) LongJoint() (units.Length, float64) { return e.longJoint() }

// Steel returns a steel grade by name: A36, A572-50, A992, A588, A529-50
// (si values per the ASTM metric designations).
func (e *Edition) Steel(name string) (Steel, error) { return e.steel(name) }

// SteelGrades lists the grade names Steel accepts.
func (e *Edition) SteelGrades() []string { return steelGrades() }

// Resistance factors of chapters D, J.
func (e *Edition) YieldFactor() Factor   { return Factor{0.90, 1.67} }
func (e *Edition) RuptureFactor() Factor { return Factor{0.75, 2.00} }

// CompressionFactor is φc 0.90 / Ωc 1.67 (E1; J4.4 for connecting
// elements in compression).
func (e *Edition) CompressionFactor() Factor { return Factor{0.90, 1.67} }

// ShearModulus is G as the Specification prints it: 11,200 ksi in US
// units, 77 200 MPa in SI (both editions; from memory).
func (e *Edition) ShearModulus() units.Stress {
	if e.si() {
		return 77200 * units.Megapascal
	}
	return 11200 * units.Ksi
}

// BlockShearFactor, BoltShearFactor and BearingFactor are φ 0.75 / Ω 2.00.
func (e *Edition) BlockShearFactor() Factor { return Factor{0.75, 2.00} }
func (e *Edition) BoltShearFactor() Factor  { return Factor{0.75, 2.00} }
func (e *Edition) BearingFactor() Factor    { return Factor{0.75, 2.00} }

// SlipFactor is φ/Ω for slip by hole type and slot direction relative to
// the load (J3.8 [J3.9]).
func (e *Edition) SlipFactor(t HoleType, dir SlotDir) Factor { return slipFactor(t, dir) }

// Mu is the mean slip coefficient of a faying surface class.
func (e *Edition) Mu(c SlipClass) float64 { return mu(c) }

// Du is the ratio of mean installed to specified minimum pretension (1.13).
func (e *Edition) Du() float64 { return 1.13 }

// FillerFactor is the J5.2(a) multiplier of the bolts' shear strength for
// undeveloped fillers of total thickness t: 1 up to 1/4 in (6 mm), then
// 1 − 0.4(t − 0.25) in inches (SI 1 − 0.0154(t − 6) in mm), not below 0.85.
func (e *Edition) FillerFactor(t units.Length) float64 { return e.fillerFactor(t) }

// Hf is the filler factor: 1.0 with no filler or one, 0.85 with two or more.
func (e *Edition) Hf(fillers int) float64 { return hf(fillers) }

// BearingCoefficients returns the multipliers of d·t·Fu (bearing) and
// lc·t·Fu (tearout) of J3.10 [J3.11]: 2.4 and 1.2 when deformation at
// service load is a design consideration, 3.0 and 1.5 when it is not, 2.0
// and 1.0 for long-slotted holes with the slot perpendicular to the force.
func (e *Edition) BearingCoefficients(t HoleType, dir SlotDir, deformationConsidered bool) (bearing, tearout float64) {
	return bearingCoefficients(t, dir, deformationConsidered)
}

// SplicePlateCap returns the cap on An/Ag for bolted splice plates and
// whether the edition has it (360-16 J4.1(b): 0.85; 360-22: none).
func (e *Edition) SplicePlateCap() (float64, bool) { return e.splicePlateCap() }

// HolePermitted says whether a hole type is permitted for the joint type
// and slot direction (J3.2 [J3.3]); why explains a refusal.
func (e *Edition) HolePermitted(t HoleType, dir SlotDir, j Joint) (ok bool, why string) {
	return e.holePermitted(t, dir, j)
}

// Unconfirmed lists the values this edition uses that could not be read in
// the standard's printed text, in words a report can print. An empty list
// means every value the edition uses was read (or computed from a printed
// formula).
func (e *Edition) Unconfirmed() []string {
	if !e.si() || e.is22() {
		return nil
	}
	return []string{"The MPa values of Table J3.2 used for AISC 360-16 (A307 310 / 188, Group A 620 / 370 / 470, " +
		"Group B 780 / 470 / 580 MPa) and its 950 mm long-joint length could not be read in 360-16's printed text: " +
		"they are 360-22's, with A307 at 188 MPa. A reading of 360-16 gave 372 / 469 / 579 MPa; " +
		"confirm the bolt stresses against the printed table."}
}
