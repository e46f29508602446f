package engine_test

import (
	"math"
	"testing"

	"gaugeline/engine"
	"gaugeline/rules/units"
)

// The formulas of Chapter E, each against a hand calculation with the
// equation it comes from (AISC 360-16, the same in 360-22 as far as read;
// docs/sources/compression.md).
func TestChapterEFormulas(t *testing.T) {
	const ksi = units.Ksi
	rel := func(what string, got, want, tol float64, src string) {
		t.Helper()
		if math.Abs(got-want) > tol*math.Max(math.Abs(want), 1e-12) {
			t.Errorf("%s = %.6g, want %.6g (%s)", what, got, want, src)
		}
	}
	// E3-2 and E3-3: Fy 36 ksi; Fe 50 ksi gives 0.658^0.72·36 = 26.81 ksi;
	// Fe 10 ksi (Fy/Fe = 3.6 > 2.25) gives 0.877·10 = 8.77 ksi.
	rel("Fcr (E3-2)", float64(engine.CriticalStress(36*ksi, 50*ksi)/ksi), math.Pow(0.658, 0.72)*36, 1e-12, "AISC 360-16 Eq. E3-2, hand calculation")
	rel("Fcr (E3-3)", float64(engine.CriticalStress(36*ksi, 10*ksi)/ksi), 8.77, 1e-12, "AISC 360-16 Eq. E3-3, hand calculation")
	// Fe = π²E/(Lc/r)²: E 29,000 ksi, Lc/r 100 → 28.62 ksi.
	rel("Fe (E3-4)", float64(engine.ElasticBucklingStress(29000*ksi, 100)/ksi), math.Pi*math.Pi*2.9, 1e-12, "AISC 360-16 Eq. E3-4, hand calculation")

	// E5: equal legs, ra 1 in: L/ra 60 → 72 + 45 = 117 (E5-1); 100 → 32 +
	// 125 = 157 (E5-2); a space truss 60 → 60 + 48 = 108 (E5-3), 100 → 145
	// (E5-4). Connected by the 3 in leg of an L4x3 (L/ra 60): 117 +
	// 4[(4/3)² − 1] = 120.1, not less than 0.95·L/rz.
	in := units.Inch
	for _, c := range []struct {
		L, conn, out units.Length
		space        bool
		want         float64
		src          string
	}{
		{60 * in, 4 * in, 4 * in, false, 117, "AISC 360-16 Eq. E5-1"},
		{100 * in, 4 * in, 4 * in, false, 157, "AISC 360-16 Eq. E5-2"},
		{60 * in, 4 * in, 4 * in, true, 108, "AISC 360-16 Eq. E5-3"},
		{100 * in, 4 * in, 4 * in, true, 145, "AISC 360-16 Eq. E5-4"},
		{60 * in, 3 * in, 4 * in, false, 117 + 4*(16.0/9-1), "AISC 360-16 E5(a), shorter leg connected"},
	} {
		rel("Lc/r (E5)", engine.AngleSlenderness(c.L, in, 0.8*in, c.conn, c.out, c.space), c.want, 1e-12, c.src+", hand calculation")
	}
	// the 0.95·L/rz floor: rz 0.5 in, L 60 in → 114, below 120.1; rz 0.4 in → 142.5
	rel("Lc/r floor", engine.AngleSlenderness(60*in, in, 0.4*in, 3*in, 4*in, false), 0.95*60/0.4, 1e-12, "AISC 360-16 E5(a), hand calculation")

	// E6.1 (from memory): (Lc/r)o 80, a/ri 30: snug-tight √(80² + 30²) =
	// 85.44; welded or pretensioned with a/ri ≤ 40, 80; a/ri 60 with Ki 0.5,
	// √(80² + 30²).
	rel("(Lc/r)m snug", engine.ModifiedSlenderness(80, 30*in, in, 0.5, true), math.Hypot(80, 30), 1e-12, "AISC 360-16 Eq. E6-1, hand calculation")
	rel("(Lc/r)m tight, a/ri ≤ 40", engine.ModifiedSlenderness(80, 30*in, in, 0.5, false), 80, 1e-12, "AISC 360-16 E6.1(b)")
	rel("(Lc/r)m tight, a/ri > 40", engine.ModifiedSlenderness(80, 60*in, in, 0.5, false), math.Hypot(80, 30), 1e-12, "AISC 360-16 Eq. E6-2, hand calculation")

	// E4-2 [E4-5]: with H = 1 the flexural-torsional stress is the lesser
	// of Fey and Fez; with H < 1 it is less than both.
	rel("Fe (E4), H = 1", float64(engine.FlexuralTorsionalStress(30*ksi, 50*ksi, 1)/ksi), 30, 1e-9, "AISC 360-16 Eq. E4-2, algebra")
	if fe := engine.FlexuralTorsionalStress(30*ksi, 50*ksi, 0.8); fe >= 30*ksi {
		t.Errorf("Fe (E4) with H 0.8 = %g ksi, want under 30 (AISC 360-16 Eq. E4-2)", float64(fe/ksi))
	}

	// E7: an unstiffened leg 5 in × 0.25 in, Fy 36 ksi: λ = 20 > λr =
	// 0.45√(29000/36) = 12.77. At Fcr = 20 ksi: Fel = (1.49·12.77/20)²·36 =
	// 32.60 ksi, √(Fel/Fcr) = 1.277, be = 5(1 − 0.22·1.277)(1.277) = 4.591 in;
	// Ae = Ag − (5 − 4.591)(0.25) (AISC 360-16 Eqs. E7-3, E7-5, hand
	// calculation).
	el := []engine.Element{{Name: "leg", B: 5 * in, T: in / 4, Count: 1, Lr: 0.45}}
	Ag := units.Area(2.5 * float64(units.SquareInch))
	lr := 0.45 * math.Sqrt(29000.0/36)
	k := math.Sqrt(math.Pow(1.49*lr/20, 2) * 36 / 20)
	be := 5 * (1 - 0.22*k) * k
	Ae, slender := engine.EffectiveArea(Ag, el, 29000*ksi, 36*ksi, 20*ksi)
	rel("Ae (E7)", float64(Ae)/float64(units.SquareInch), 2.5-(5-be)*0.25, 1e-9, "AISC 360-16 E7.1, hand calculation")
	if len(slender) != 1 {
		t.Errorf("slender elements %v, want the leg", slender)
	}
	// a leg of λ 10 is not slender: Ae = Ag
	if Ae, s := engine.EffectiveArea(Ag, []engine.Element{{Name: "leg", B: 2.5 * in, T: in / 4, Count: 1, Lr: 0.45}}, 29000*ksi, 36*ksi, 20*ksi); Ae != Ag || len(s) != 0 {
		t.Errorf("a stocky leg reduces Ag to %g (%v), want none (AISC 360-16 Table B4.1a case 3)", float64(Ae), s)
	}
}
