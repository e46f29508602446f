package fit

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/spatial/r2"
)

func TestAssignIsOptimalNotGreedy(t *testing.T) {
	// Greedy nearest-first pairs d2–m1 (1.4) and leaves d1 and m2 4.5
	// apart, past the gate of 2; the optimal assignment pairs d1–m1 (1.6)
	// and d2–m2 (1.5). Inputs only; the answer is the definition.
	des := []r2.Vec{{X: 0, Y: 0}, {X: 3, Y: 0}}
	mea := []r2.Vec{{X: 1.6, Y: 0}, {X: 4.5, Y: 0}}
	if got := Assign(des, mea, 2); !slices.Equal(got, []int{0, 1}) {
		t.Errorf("assignment %v, want [0 1]", got)
	}
	// Past the gate a hole is extra and its design hole missing.
	if got := Assign(des, []r2.Vec{{X: 0.1, Y: 0}, {X: 9, Y: 9}}, 2); !slices.Equal(got, []int{0, -1}) {
		t.Errorf("gated assignment %v, want [0 -1]", got)
	}
	// Against brute force over every injective partial matching.
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := range 300 {
		n, m := 1+rng.IntN(5), 1+rng.IntN(6)
		des, mea := make([]r2.Vec, n), make([]r2.Vec, m)
		for i := range des {
			des[i] = r2.Vec{X: rng.Float64() * 10, Y: rng.Float64() * 10}
		}
		for i := range mea {
			mea[i] = r2.Vec{X: rng.Float64() * 10, Y: rng.Float64() * 10}
		}
		gate := 1 + rng.Float64()*4
		got := Assign(des, mea, gate)
		if c, b := matchCost(des, mea, got, gate), bruteCost(des, mea, gate); math.Abs(c-b) > 1e-9 {
			t.Fatalf("trial %d: cost %g, brute force %g (%v)", trial, c, b, got)
		}
	}
}

func matchCost(des, mea []r2.Vec, match []int, gate float64) float64 {
	var c float64
	for i, k := range match {
		if k < 0 {
			c += gate * gate
			continue
		}
		c += abSq(des[i].X-mea[k].X) + abSq(des[i].Y-mea[k].Y)
	}
	return c
}

func bruteCost(des, mea []r2.Vec, gate float64) float64 {
	best := math.Inf(1)
	used := make([]bool, len(mea))
	match := make([]int, len(des))
	var rec func(i int)
	rec = func(i int) {
		if i == len(des) {
			best = min(best, matchCost(des, mea, match, gate))
			return
		}
		match[i] = -1
		rec(i + 1)
		for k := range mea {
			if used[k] || math.Hypot(des[i].X-mea[k].X, des[i].Y-mea[k].Y) > gate {
				continue
			}
			used[k], match[i] = true, k
			rec(i + 1)
			used[k] = false
		}
	}
	rec(0)
	return best
}
