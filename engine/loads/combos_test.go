package loads

import (
	"math"
	"testing"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

func kip(v float64) units.Force { return units.Force(v) * units.Kip }

func TestDesignExampleD2Loads(t *testing.T) {
	const src = "AISC Design Examples v15.0, Example D.2 (from memory)"
	// Required strength from D = 20 kips, L = 60 kips; published to three
	// significant figures, so compared within 0.5 %.
	const tol = 0.005
	for _, tt := range []struct {
		m    rules.Method
		want float64 // kips
	}{{rules.LRFD, 120}, {rules.ASD, 80}} {
		got, _ := Combine(tt.m, ServiceLoads{D: kip(20), L: kip(60)})
		if math.Abs(got.Kip()-tt.want) > tol*tt.want {
			t.Errorf("%v: required strength %.6g kips, want %.6g (%s)", tt.m, got.Kip(), tt.want, src)
		}
	}
}

// A brace under dead load and wind that reverses: ASCE/SEI 7-16 2.3.1
// (LRFD) and 2.4.1 (ASD) by hand. D = 10 kip tension, W = ±50 kip:
// tension 1.2(10) + 1.0(50) = 62 (combination 4), compression
// 0.9(10) − 1.0(50) = −41 (combination 6 with W reversed); ASD tension
// 10 + 0.6(50) = 40, compression 0.6(10) − 0.6(50) = −24.
func TestDemandsWindReverses(t *testing.T) {
	const src = "ASCE/SEI 7-16 2.3.1 and 2.4.1, hand calculation"
	l := ServiceLoads{D: kip(10), W: kip(50)}
	for _, tt := range []struct {
		m                    rules.Method
		tension, compression float64
		tName, cName         string
	}{
		{rules.LRFD, 62, 41, "ASCE 7 lrfd: 1.2D + 1.0W + L + 0.5(Lr or S or R)", "ASCE 7 lrfd: 0.9D + 1.0W, W reversed"},
		{rules.ASD, 40, 24, "ASCE 7 asd: D + (0.6W or 0.7E)", "ASCE 7 asd: 0.6D + 0.6W, W reversed"},
	} {
		tn, cp := Demands(tt.m, l, Reverses{W: true})
		if math.Abs(tn.Force.Kip()-tt.tension) > 1e-9 || tn.Name != tt.tName {
			t.Errorf("%v tension %g kip (%s), want %g (%s) (%s)", tt.m, tn.Force.Kip(), tn.Name, tt.tension, tt.tName, src)
		}
		if math.Abs(cp.Force.Kip()-tt.compression) > 1e-9 || cp.Name != tt.cName {
			t.Errorf("%v compression %g kip (%s), want %g (%s) (%s)", tt.m, cp.Force.Kip(), cp.Name, tt.compression, tt.cName, src)
		}
		// without reversal the wind only pulls: no compression
		if _, c := Demands(tt.m, l, Reverses{}); c.Force != 0 {
			t.Errorf("%v: compression %g kip without reversal, want none", tt.m, c.Force.Kip())
		}
	}
	// A dead load that compresses the member (a truss web): D = −20 kip,
	// L = −30 kip: LRFD compression 1.2(20) + 1.6(30) = 72, no tension
	// (combination 1 still names itself; the live load is left out).
	tn, cp := Demands(rules.LRFD, ServiceLoads{D: kip(-20), L: kip(-30)}, Reverses{})
	if tn.Force != 0 || math.Abs(cp.Force.Kip()-72) > 1e-9 {
		t.Errorf("truss web: tension %g, compression %g kip; want 0 and 72 (%s)", tn.Force.Kip(), cp.Force.Kip(), src)
	}
}
