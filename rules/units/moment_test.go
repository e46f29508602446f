package units

import (
	"math"
	"testing"
)

// Moments and section moduli print in kip-in and in³ (us), kN-m and mm³
// (si). Exact factors (srcInch, srcLbf): 1 kip-in = 4448.2216152605 N ×
// 25.4 mm = 112 984.829 027 616 7 N·mm and 1 in³ = 25.4³ mm³ =
// 16 387.064 mm³; 1 kN-m = 10⁶ N·mm (srcSI). Relative tolerance 1e-12:
// the same products in another order.
func TestMomentAndModulusUnits(t *testing.T) {
	cases := []struct {
		sys      System
		d        Dim
		internal float64
		job      float64
		label    string
	}{
		{US, DimMoment, 112984.8290276167, 1, "kip-in"},
		{SI, DimMoment, 2.5e6, 2.5, "kN-m"},
		{US, DimModulus, 16387.064, 1, "in3"},
		{SI, DimModulus, 60000, 60000, "mm3"},
	}
	for _, c := range cases {
		if got := c.sys.ToJob(c.internal, c.d); math.Abs(got-c.job) > 1e-12*c.job {
			t.Errorf("%s %s: %v internal is %v, want %v", c.sys, c.d, c.internal, got, c.job)
		}
		if got := c.sys.Label(c.d); got != c.label {
			t.Errorf("%s %s: label %q, want %q", c.sys, c.d, got, c.label)
		}
	}
	if m := Kip.At(Inch); math.Abs(float64(m)-112984.8290276167) > 1e-6 {
		t.Errorf("1 kip at 1 in = %v N·mm", m)
	}
}
