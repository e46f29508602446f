package rules

import (
	"testing"

	"gaugeline/rules/units"
)

// Chapter F values for a flat bar bent in its plane, each as the edition
// prints it.
func TestFlexureValues(t *testing.T) {
	const (
		src22F1  = "AISC 360-22 F1(a): φb = 0.90 (LRFD), Ωb = 1.67 (ASD) (read)"
		src22F11 = "AISC 360-22 Eq. F11-1: rectangular bars Mn = Mp = Fy·Z ≤ 1.5·Fy·Sx (read)"
		src16F11 = "AISC 360-16 Eq. F11-1: Mn = Mp = Fy·Z ≤ 1.6·Fy·Sx (from memory)"
		srcE     = "AISC 360-22 G2.1 and F11: E = 29,000 ksi (200 000 MPa) (read)"
	)
	for _, name := range Names() {
		for _, sys := range []units.System{units.US, units.SI} {
			ed, err := Lookup(name, sys)
			if err != nil {
				t.Fatal(err)
			}
			if f := ed.FlexureFactor(); f.Phi != 0.90 || f.Omega != 1.67 {
				t.Errorf("%s: φb, Ωb = %v, %v (%s)", ed, f.Phi, f.Omega, src22F1)
			}
			want, src := 1.5, src22F11
			if ed.Year() == 2016 {
				want, src = 1.6, src16F11
			}
			if got := ed.BarPlasticCap(); got != want {
				t.Errorf("%s: cap %v, want %v (%s)", ed, got, want, src)
			}
			wantE := 29000 * units.Ksi
			if sys == units.SI {
				wantE = 200000 * units.Megapascal
			}
			if got := ed.SteelModulus(); got != wantE {
				t.Errorf("%s: E = %v MPa, want %v (%s)", ed, float64(got), float64(wantE), srcE)
			}
		}
	}
	// φ·Mn and Mn/Ω: 100 kip-in nominal gives 90 and 100/1.67 = 59.88
	// (hand calculation with the factors above).
	f := Factor{0.90, 1.67}
	if got := f.AvailableMoment(LRFD, 100); got != 90 {
		t.Errorf("φMn = %v", got)
	}
	if got := float64(f.AvailableMoment(ASD, 100)); got < 59.880 || got > 59.881 {
		t.Errorf("Mn/Ω = %v", got)
	}
}
