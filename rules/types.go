package rules

import (
	"fmt"

	"gaugeline/rules/units"
	"gaugeline/rules/words"
)

// HoleType is the kind of bolt hole (AISC 360 J3.2 [J3.3]).
type HoleType int

const (
	Standard HoleType = iota
	Oversized
	ShortSlot
	LongSlot
)

var holeTypes = words.New[HoleType]("hole type", "standard", "oversized", "short-slot", "long-slot")

// String returns the job-file spelling.
func (h HoleType) String() string { return holeTypes.Name(h) }

// IsSlot reports whether the hole is slotted.
func (h HoleType) IsSlot() bool { return h == ShortSlot || h == LongSlot }

// ParseHoleType reads the job-file spelling.
func ParseHoleType(s string) (HoleType, error) { return holeTypes.Parse(s) }

// SlotDir is the direction of a slot's long axis relative to the load.
type SlotDir int

const (
	Transverse   SlotDir = iota // long axis across the load (along y)
	Longitudinal                // long axis along the load (along x)
)

var slotDirs = words.New[SlotDir]("slot direction", "transverse", "longitudinal")

// String returns the job-file spelling.
func (d SlotDir) String() string { return slotDirs.Name(d) }

// ParseSlotDir reads the job-file spelling.
func ParseSlotDir(s string) (SlotDir, error) { return slotDirs.Parse(s) }

// Joint is the type of bolted joint.
type Joint int

const (
	Bearing Joint = iota
	Pretensioned
	SlipCritical
)

var joints = words.New[Joint]("joint type", "bearing", "pretensioned", "slip-critical")

// String returns the job-file spelling.
func (j Joint) String() string { return joints.Name(j) }

// ParseJoint reads the job-file spelling.
func ParseJoint(s string) (Joint, error) { return joints.Parse(s) }

// Threads says whether bolt threads are in or out of the shear planes.
type Threads int

const (
	ThreadsIncluded Threads = iota // N
	ThreadsExcluded                // X
)

var threadsConditions = words.New[Threads]("threads condition", "included", "excluded")

// String returns the job-file spelling.
func (t Threads) String() string { return threadsConditions.Name(t) }

// ParseThreads reads the job-file spelling.
func ParseThreads(s string) (Threads, error) { return threadsConditions.Parse(s) }

// SlipClass is the faying-surface class of a slip-critical joint.
type SlipClass int

const (
	ClassA SlipClass = iota
	ClassB
)

var slipClasses = words.New[SlipClass]("slip class", "A", "B")

// String returns the job-file spelling.
func (c SlipClass) String() string { return slipClasses.Name(c) }

// ParseSlipClass reads the job-file spelling.
func ParseSlipClass(s string) (SlipClass, error) { return slipClasses.Parse(s) }

// Method is the design method: LRFD or ASD.
type Method int

const (
	LRFD Method = iota
	ASD
)

var methods = words.New[Method]("method", "lrfd", "asd")

// String returns the job-file spelling.
func (m Method) String() string { return methods.Name(m) }

// ParseMethod reads the job-file spelling.
func ParseMethod(s string) (Method, error) { return methods.Parse(s) }

// Factor is a resistance factor φ (LRFD) with its safety factor Ω (ASD).
type Factor struct {
	Phi   float64
	Omega float64
}

// Available returns φ·Rn for LRFD and Rn/Ω for ASD.
func (f Factor) Available(m Method, Rn units.Force) units.Force {
	if m == ASD {
		return Rn / units.Force(f.Omega)
	}
	return Rn * units.Force(f.Phi)
}

// HoleSize is the nominal size of a hole: Width across the slot (the
// diameter of a round hole) and Length along the slot (equal to Width for
// round holes).
type HoleSize struct {
	Width  units.Length
	Length units.Length
}

// Steel is a structural steel grade.
type Steel struct {
	Name string
	Fy   units.Stress
	Fu   units.Stress
	// Weathering marks grades used unpainted as weathering steel (A588),
	// for which the tighter maximum spacing of J3.5(b) [J3.6(b)] applies.
	Weathering bool
}

// BoltGroup is the strength group of a bolt grade.
type BoltGroup int

const (
	GroupA307 BoltGroup = iota // common bolts
	GroupA                     // 360-22: Group 120 (A325, F1852, A325M)
	GroupB                     // 360-22: Group 150 (A490, F2280, A490M)
)

// BoltGrade is a bolt grade with its nominal stresses (Table J3.2).
type BoltGrade struct {
	Name  string
	Group BoltGroup
	Fnt   units.Stress
	FnvN  units.Stress // threads included in the shear planes
	FnvX  units.Stress // threads excluded from the shear planes
}

// Fnv returns the nominal shear stress for the threads condition.
func (b BoltGrade) Fnv(t Threads) units.Stress {
	if t == ThreadsExcluded {
		return b.FnvX
	}
	return b.FnvN
}

// NotTabulatedError is returned when a lookup asks for a value the standard
// does not tabulate (a bolt diameter with no hole size, an unknown grade).
type NotTabulatedError struct {
	Edition string // e.g. "aisc360-22 (si)"
	Table   string // e.g. "Table J3.3M"
	Key     string // what was asked, e.g. "M14" or "grade A999"
}

func (e *NotTabulatedError) Error() string {
	return fmt.Sprintf("%s: %s has no entry for %s", e.Edition, e.Table, e.Key)
}
