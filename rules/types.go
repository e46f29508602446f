package rules

import (
	"fmt"

	"gaugeline/rules/units"
)

// HoleType is the kind of bolt hole (AISC 360 J3.2 [J3.3]).
type HoleType int

const (
	Standard HoleType = iota
	Oversized
	ShortSlot
	LongSlot
)

var holeTypeNames = [...]string{"standard", "oversized", "short-slot", "long-slot"}

// String returns the job-file spelling.
func (h HoleType) String() string { return holeTypeNames[h] }

// IsSlot reports whether the hole is slotted.
func (h HoleType) IsSlot() bool { return h == ShortSlot || h == LongSlot }

// ParseHoleType reads the job-file spelling.
func ParseHoleType(s string) (HoleType, error) {
	for i, n := range holeTypeNames {
		if n == s {
			return HoleType(i), nil
		}
	}
	return Standard, fmt.Errorf("unknown hole type %q (want standard, oversized, short-slot or long-slot)", s)
}

// SlotDir is the direction of a slot's long axis relative to the load.
type SlotDir int

const (
	Transverse   SlotDir = iota // long axis across the load (along y)
	Longitudinal                // long axis along the load (along x)
)

// String returns the job-file spelling.
func (d SlotDir) String() string {
	if d == Longitudinal {
		return "longitudinal"
	}
	return "transverse"
}

// ParseSlotDir reads the job-file spelling.
func ParseSlotDir(s string) (SlotDir, error) {
	switch s {
	case "transverse":
		return Transverse, nil
	case "longitudinal":
		return Longitudinal, nil
	}
	return Transverse, fmt.Errorf("unknown slot direction %q (want transverse or longitudinal)", s)
}

// Joint is the type of bolted joint.
type Joint int

const (
	Bearing Joint = iota
	Pretensioned
	SlipCritical
)

var jointNames = [...]string{"bearing", "pretensioned", "slip-critical"}

// String returns the job-file spelling.
func (j Joint) String() string { return jointNames[j] }

// ParseJoint reads the job-file spelling.
func ParseJoint(s string) (Joint, error) {
	for i, n := range jointNames {
		if n == s {
			return Joint(i), nil
		}
	}
	return Bearing, fmt.Errorf("unknown joint type %q (want bearing, pretensioned or slip-critical)", s)
}

// Threads says whether bolt threads are in or out of the shear planes.
type Threads int

const (
	ThreadsIncluded Threads = iota // N
	ThreadsExcluded                // X
)

// String returns the job-file spelling.
func (t Threads) String() string {
	if t == ThreadsExcluded {
		return "excluded"
	}
	return "included"
}

// ParseThreads reads the job-file spelling.
func ParseThreads(s string) (Threads, error) {
	switch s {
	case "included":
		return ThreadsIncluded, nil
	case "excluded":
		return ThreadsExcluded, nil
	}
	return ThreadsIncluded, fmt.Errorf("unknown threads condition %q (want included or excluded)", s)
}

// SlipClass is the faying-surface class of a slip-critical joint.
type SlipClass int

const (
	ClassA SlipClass = iota
	ClassB
)

// String returns the job-file spelling.
func (c SlipClass) String() string {
	if c == ClassB {
		return "B"
	}
	return "A"
}

// ParseSlipClass reads the job-file spelling.
func ParseSlipClass(s string) (SlipClass, error) {
	switch s {
	case "A":
		return ClassA, nil
	case "B":
		return ClassB, nil
	}
	return ClassA, fmt.Errorf("unknown slip class %q (want A or B)", s)
}

// Method is the design method: LRFD or ASD.
type Method int

const (
	LRFD Method = iota
	ASD
)

// String returns the job-file spelling.
func (m Method) String() string {
	if m == ASD {
		return "asd"
	}
	return "lrfd"
}

// ParseMethod reads the job-file spelling.
func ParseMethod(s string) (Method, error) {
	switch s {
	case "lrfd":
		return LRFD, nil
	case "asd":
		return ASD, nil
	}
	return LRFD, fmt.Errorf("unknown method %q (want lrfd or asd)", s)
}

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
