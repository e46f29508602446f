package engine

import (
	"math"
	"slices"
	"testing"

	"pgregory.net/rapid"

	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// A U-shaped plate (not convex), mm: the notch x 3 … 7 runs down from the
// top to y = 3. Every expected value is read off the figure by hand.
func uPlate() *Plate {
	return &Plate{Outline: []r2.Vec{{X: 0, Y: 0}, {X: 10, Y: 0}, {X: 10, Y: 10}, {X: 7, Y: 10}, {X: 7, Y: 3}, {X: 3, Y: 3}, {X: 3, Y: 10}, {X: 0, Y: 10}}}
}

func TestOutlineSectionOfANonConvexPlate(t *testing.T) {
	p := uPlate()
	for _, c := range []struct {
		x, y0, y1, want units.Length
	}{
		{5, -1, 20, 3},  // under the notch: 0 … 3
		{2, -1, 20, 10}, // a leg of the U: 0 … 10
		{2, 4, 6, 2},    // clipped by the spread, not the outline
		{5, 4, 6, 0},    // in the notch: nothing inside
	} {
		if got, _, _ := p.SectionLength(c.x, c.y0, c.y1); got != c.want {
			t.Errorf("x = %v, %v … %v: %v inside, want %v", c.x, c.y0, c.y1, got, c.want)
		}
	}
	// Across at y = 5 the line is inside twice, 0 … 3 and 7 … 10: the sum
	// of the parts, 6.
	parts := p.ClipToOutline(r2.Vec{X: -1, Y: 5}, r2.Vec{X: 11, Y: 5})
	if len(parts) != 2 || parts[0][0].X != 0 || parts[0][1].X != 3 || parts[1][0].X != 7 || parts[1][1].X != 10 {
		t.Errorf("clip at y = 5: %v, want 0 … 3 and 7 … 10", parts)
	}
	if got := p.EdgeAlong(1, 5, false, 1); got != 3 {
		t.Errorf("from (1, 5) toward +x the plate ends at x = %v, want 3 (the notch)", got)
	}
	if got := p.EdgeAlong(5, 1, true, 1); got != 3 {
		t.Errorf("from (5, 1) toward +y the plate ends at y = %v, want 3 (the notch's floor)", got)
	}
	if p.Inside(5, 5) || !p.Inside(5, 1) {
		t.Error("inside: (5, 5) is in the notch, (5, 1) in the plate")
	}
}

// The plate's rectangle given as an outline (closed 1 m behind the holes,
// either way round) is the same plate: every limit state of a random
// connection gives the strength the open rectangle gives (a property of
// the model, no outside source), to 1e-9 relative.
func TestPropertyRectangleAsOutline(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		c := drawParams(rt).build(t)
		want, err := Check(c)
		if err != nil {
			rt.Fatal(err)
		}
		pl := *c.Plate
		back, lo, hi, fe := float64(pl.FreeEdge-units.Metre), float64(pl.YMin()), float64(pl.YMax()), float64(pl.FreeEdge)
		pl.Outline = []r2.Vec{{X: back, Y: lo}, {X: fe, Y: lo}, {X: fe, Y: hi}, {X: back, Y: hi}}
		if rapid.Bool().Draw(rt, "clockwise") {
			slices.Reverse(pl.Outline)
		}
		c.Plate = &pl
		got, err := Check(c)
		if err != nil {
			rt.Fatal(err)
		}
		for i := range want {
			g, w := float64(got[i].Nominal), float64(want[i].Nominal)
			if math.Abs(g-w) > 1e-9*math.Max(1, math.Abs(w)) {
				rt.Errorf("%s: %v as an outline, %v as the rectangle", want[i].ID, got[i].Nominal, want[i].Nominal)
			}
		}
	})
}
