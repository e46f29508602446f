package section

import (
	"math"
	"testing"

	"pgregory.net/rapid"

	"gaugeline/rules/units"
)

func within(t *testing.T, name, what string, v, lo, hi float64) {
	t.Helper()
	if !(v >= lo && v <= hi) {
		t.Errorf("%s: %s %g outside [%g, %g]", name, what, v, lo, hi)
	}
}

func checkBounds(t *testing.T, name string, a Angle, p Props) {
	t.Helper()
	b := a.Bounds()
	within(t, name, "area", float64(p.Area), float64(b.AreaMin), float64(b.AreaMax))
	within(t, name, "x̄", float64(p.Xbar), float64(b.XbarMin), float64(b.XbarMax))
	within(t, name, "rmin", float64(p.Rmin), float64(b.RminMin), float64(b.RminMax))
}

// Bounds never refuse an angle of the catalogs, connected by either leg.
func TestBoundsHoldForTheCatalog(t *testing.T) {
	n := 0
	for _, sys := range []units.System{units.US, units.SI} {
		for _, name := range Names(sys) {
			a, err := Lookup(name, sys)
			if err != nil {
				t.Fatal(err)
			}
			for _, c := range []Angle{a, a.Swapped()} {
				checkBounds(t, name, c, c.Properties())
				n++
			}
		}
	}
	if n < 200 {
		t.Errorf("%d catalog angles checked", n)
	}
}

// Published properties lie inside the bounds, and the bounds are not so
// wide that the wrong unit or a leg for x̄ passes.
func TestBoundsPublishedValues(t *testing.T) {
	us, err := Lookup("L4x4x1/2", units.US)
	if err != nil {
		t.Fatal(err)
	}
	in, in2 := float64(units.Inch), float64(units.SquareInch)
	// AISC Manual Table 1-7, L4x4x1/2: A = 3.75 in², x̄ = 1.18 in,
	// rz = 0.776 in (AISC Shapes Database v15.0, read).
	checkBounds(t, "L4x4x1/2 (AISC)", us, Props{Area: units.Area(3.75 * in2), Xbar: units.Length(1.18 * in), Rmin: units.Length(0.776 * in)})
	si, err := Lookup("L100x100x10", units.SI)
	if err != nil {
		t.Fatal(err)
	}
	// EN 10056-1, L100x100x10: A = 19.2 cm², e = 2.82 cm, iv = 1.95 cm
	// (SCI Blue Book, read; see blueBook in en10056_test.go).
	checkBounds(t, "L100x100x10 (EN 10056-1)", si, Props{Area: 1920, Xbar: 28.2, Rmin: 19.5})

	b := us.Bounds()
	for _, c := range []struct {
		what   string
		v      float64
		lo, hi float64
	}{
		{"x̄ of 100 in", 100 * in, float64(b.XbarMin), float64(b.XbarMax)},
		{"x̄ = the leg, 4 in", 4 * in, float64(b.XbarMin), float64(b.XbarMax)},
		{"x̄ 1.18 mm (unit)", 1.18, float64(b.XbarMin), float64(b.XbarMax)},
		{"area of the pair, 7.5 in²", 7.5 * in2, float64(b.AreaMin), float64(b.AreaMax)},
		{"area 3.75 mm² (unit)", 3.75, float64(b.AreaMin), float64(b.AreaMax)},
		{"rmin = the leg, 4 in", 4 * in, float64(b.RminMin), float64(b.RminMax)},
		{"rmin 0.776 mm (unit)", 0.776, float64(b.RminMin), float64(b.RminMax)},
	} {
		if c.v >= c.lo && c.v <= c.hi {
			t.Errorf("L4x4x1/2: %s is inside [%g, %g]", c.what, c.lo, c.hi)
		}
	}
}

// Bounds hold for any angle Properties accepts: legs 1 to 300 mm, any
// thickness below the shorter leg, any radii that fit.
func TestRapidBoundsHoldForAnyAngle(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		A := rapid.Float64Range(1, 300).Draw(rt, "A")
		B := rapid.Float64Range(1, 300).Draw(rt, "B")
		tt := rapid.Float64Range(1e-3, 0.999).Draw(rt, "t/min") * math.Min(A, B)
		r2 := rapid.Float64Range(0, 1).Draw(rt, "r2/t") * tt
		r1 := rapid.Float64Range(0, 1).Draw(rt, "r1/room") * (math.Min(A, B) - tt - r2)
		a := Angle{Name: "random", A: units.Length(A), B: units.Length(B), T: units.Length(tt), R1: units.Length(r1), R2: units.Length(r2)}
		if a.check() != nil {
			return
		}
		p := a.Properties()
		b := a.Bounds()
		// The slack is for rounded published values; the geometry itself
		// stays inside the unwidened ranges.
		s0, s1 := 1/(1-Slack), 1/(1+Slack)
		for _, c := range []struct {
			what      string
			v, lo, hi float64
		}{
			{"area", float64(p.Area), float64(b.AreaMin) * s0, float64(b.AreaMax) * s1},
			{"x̄", float64(p.Xbar), float64(b.XbarMin) * s0, float64(b.XbarMax) * s1},
			{"rmin", float64(p.Rmin), float64(b.RminMin) * s0, float64(b.RminMax) * s1},
		} {
			if tol := 1e-9 * c.hi; !(c.v >= c.lo-tol && c.v <= c.hi+tol) {
				rt.Fatalf("%+v: %s %g outside [%g, %g]", a, c.what, c.v, c.lo, c.hi)
			}
		}
	})
}
