package units

import (
	"math"

	"gaugeline/rules/words"
)

// System is the unit system a job is written in.
type System int

const (
	US System = iota // US customary: in, kip, ksi, in²
	SI               // SI: mm, kN, MPa, mm²
)

var systems = words.New[System]("unit system", "us", "si")

// String returns the job-file spelling of the system.
func (s System) String() string { return systems.Name(s) }

// ParseSystem reads the job-file spelling of a unit system.
func ParseSystem(s string) (System, error) { return systems.Parse(s) }

// Dim is the physical dimension of a quantity.
type Dim int

const (
	Dimensionless Dim = iota
	DimLength
	DimForce
	DimStress
	DimArea
	// DimMoment is a bending moment (N·mm inside; printed kip-in or kN-m)
	// and DimModulus a section modulus (mm³; in3 or mm3). Results carry
	// them; job files never give them, so Parse does not read them (it
	// panics, as on any dimension it does not know).
	DimMoment
	DimModulus
)

// String names the dimension for error messages.
func (d Dim) String() string {
	switch d {
	case DimLength:
		return "length"
	case DimForce:
		return "force"
	case DimStress:
		return "stress"
	case DimArea:
		return "area"
	case DimMoment:
		return "moment"
	case DimModulus:
		return "section modulus"
	}
	return "number"
}

// Length is a length in millimetres.
type Length float64

// Force is a force in newtons.
type Force float64

// Stress is a stress in megapascals (N/mm²).
type Stress float64

// Area is an area in square millimetres.
type Area float64

// Moment is a bending moment in newton-millimetres.
type Moment float64

// Modulus is a section modulus in cubic millimetres.
type Modulus float64

// Exact conversion factors to the internal units.
const (
	Millimetre Length = 1
	Metre      Length = 1000
	Inch       Length = 25.4
	Foot       Length = 12 * Inch

	Newton     Force = 1
	Kilonewton Force = 1000
	Kip        Force = 4448.2216152605 // 1000 lbf

	Megapascal Stress = 1
	Ksi        Stress = 6.894757293168361 // kip/in²

	SquareMillimetre Area = 1
	SquareInch       Area = Area(Inch * Inch)
)

// In returns the length in inches.
func (l Length) In() float64 { return float64(l / Inch) }

// Mm returns the length in millimetres.
func (l Length) Mm() float64 { return float64(l) }

// MetricBolt reports whether a bolt diameter is a metric size, whole
// millimetres (no inch size from 1/2 to 1-1/2 in is one), and which: an
// M20 keeps its name in a US job.
func MetricBolt(d Length) (mm int, ok bool) {
	n := math.Round(float64(d))
	return int(n), n > 0 && math.Abs(float64(d)-n) <= 1e-6
}

// Kip returns the force in kips.
func (f Force) Kip() float64 { return float64(f / Kip) }

// KN returns the force in kilonewtons.
func (f Force) KN() float64 { return float64(f / Kilonewton) }

// Ksi returns the stress in ksi.
func (s Stress) Ksi() float64 { return float64(s / Ksi) }

// Mul returns the area of a rectangle.
func (l Length) Mul(m Length) Area { return Area(float64(l) * float64(m)) }

// Times returns the force a stress produces on an area.
func (s Stress) Times(a Area) Force { return Force(float64(s) * float64(a)) }

// At returns the moment of the force about a point at distance e.
func (f Force) At(e Length) Moment { return Moment(float64(f) * float64(e)) }

// Over returns the moment a stress produces over a section modulus.
func (s Stress) Over(z Modulus) Moment { return Moment(float64(s) * float64(z)) }

// Labels are the unit names printed beside values of one system.
type Labels struct {
	Length  string `json:"length"`
	Force   string `json:"force"`
	Stress  string `json:"stress"`
	Area    string `json:"area"`
	Moment  string `json:"moment"`
	Modulus string `json:"section_modulus"`
}

// Labels returns the unit names used when printing values in s.
func (s System) Labels() Labels {
	if s == SI {
		return Labels{Length: "mm", Force: "kN", Stress: "MPa", Area: "mm2", Moment: "kN-m", Modulus: "mm3"}
	}
	return Labels{Length: "in", Force: "kip", Stress: "ksi", Area: "in2", Moment: "kip-in", Modulus: "in3"}
}

// Label returns the printed unit of dimension d in s ("" for numbers).
func (s System) Label(d Dim) string {
	l := s.Labels()
	switch d {
	case DimLength:
		return l.Length
	case DimForce:
		return l.Force
	case DimStress:
		return l.Stress
	case DimArea:
		return l.Area
	case DimMoment:
		return l.Moment
	case DimModulus:
		return l.Modulus
	}
	return ""
}

// scale is the internal value of one printed unit of dimension d in s.
func (s System) scale(d Dim) float64 {
	us := s == US
	switch d {
	case DimLength:
		if us {
			return float64(Inch)
		}
		return 1
	case DimForce:
		if us {
			return float64(Kip)
		}
		return float64(Kilonewton)
	case DimStress:
		if us {
			return float64(Ksi)
		}
		return 1
	case DimArea:
		if us {
			return float64(SquareInch)
		}
		return 1
	case DimMoment:
		if us {
			return float64(Kip) * float64(Inch)
		}
		return float64(Kilonewton) * float64(Metre)
	case DimModulus:
		if us {
			return float64(Inch) * float64(Inch) * float64(Inch)
		}
		return 1
	}
	return 1
}

// ToJob converts an internal value of dimension d to the printed unit of s.
func (s System) ToJob(v float64, d Dim) float64 { return v / s.scale(d) }

// FromJob converts a value in the printed unit of s to the internal unit.
func (s System) FromJob(v float64, d Dim) float64 { return v * s.scale(d) }

// finite reports whether v is a usable number.
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// In2 returns the area in square inches.
func (a Area) In2() float64 { return float64(a / SquareInch) }
