package rules

import "gaugeline/rules/units"

// Chapter F, as far as a flat bar bent in its plane needs it (F1, F11).

// FlexureFactor is φb and Ωb of F1(a): 0.90 (LRFD), 1.67 (ASD), the same
// in 360-16 and 360-22.
func (e *Edition) FlexureFactor() Factor { return Factor{0.90, 1.67} }

// AvailableMoment returns φ·Mn for LRFD and Mn/Ω for ASD.
func (f Factor) AvailableMoment(m Method, Mn units.Moment) units.Moment {
	if m == ASD {
		return Mn / units.Moment(f.Omega)
	}
	return Mn * units.Moment(f.Phi)
}

// BarPlasticCap is k of F11.1, Mn = Mp = Fy·Z ≤ k·Fy·Sx, for rectangular
// bars: 360-22 prints 1.5 (Eq. F11-1; rounds keep 1.6, Eq. F11-2);
// 360-16 gives 1.6 for bars and rounds alike (from memory). A rectangle
// has Z = 1.5·Sx, so the cap never lowers Mp in either edition.
func (e *Edition) BarPlasticCap() float64 {
	if e.is22() {
		return 1.5
	}
	return 1.6
}

// SteelModulus is E as the Specification prints it: 29,000 ksi in US
// units, 200 000 MPa in SI (both editions).
func (e *Edition) SteelModulus() units.Stress {
	if e.si() {
		return 200000 * units.Megapascal
	}
	return 29000 * units.Ksi
}
