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
