package engine

import (
	"math"

	"gaugeline/engine/polygon"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// This file is what the limit states and the detailing rules ask of a
// plate's true outline (Plate.Outline; its geometry is package polygon). A
// plate without an outline is today's rectangle, open toward −x, and the
// questions answer for it.

// OutlineEdge is one edge of the outline and its outward normal.
type OutlineEdge struct{ polygon.Edge }

// Free says the edge faces the plate's free edge (+x, where the member
// laps the plate): its outward normal points more along +x than across.
func (e OutlineEdge) Free() bool {
	return e.Normal.X > 0 && math.Abs(e.Normal.X) >= math.Abs(e.Normal.Y)-1e-12
}

// Side says the edge runs more along the load than across it (a side of
// the plate, a corner clip leaning that way).
func (e OutlineEdge) Side() bool { return math.Abs(e.Normal.Y) > math.Abs(e.Normal.X)+1e-12 }

// DistanceTo is the shortest distance from (x, y) to the edge: square to it
// where the foot falls on it, else to its nearer end.
func (e OutlineEdge) DistanceTo(x, y units.Length) units.Length {
	return units.Length(e.Distance(r2.Vec{X: float64(x), Y: float64(y)}))
}

// Edges lists the outline's edges in the job's order.
func (p *Plate) Edges() []OutlineEdge {
	var es []OutlineEdge
	for _, e := range polygon.Edges(p.Outline) {
		es = append(es, OutlineEdge{e})
	}
	return es
}

// SectionAt is the parts of the line x = x inside the outline, as
// intervals [y0, y1] from low y to high (one for a convex outline).
func (p *Plate) SectionAt(x units.Length) [][2]units.Length {
	var out [][2]units.Length
	for _, iv := range polygon.Section(p.Outline, float64(x)) {
		out = append(out, [2]units.Length{units.Length(iv[0]), units.Length(iv[1])})
	}
	return out
}

// SectionLength is the length of the line x = x between y0 and y1 that
// lies inside the plate, and the ends of what lies inside (lo > hi when
// none does). Without an outline it is the rectangle's clip.
func (p *Plate) SectionLength(x, y0, y1 units.Length) (l, lo, hi units.Length) {
	if p.Outline == nil {
		lo, hi = max(y0, p.YMin()), min(y1, p.YMax())
		return max(hi-lo, 0), lo, hi
	}
	lo, hi = units.Length(math.Inf(1)), units.Length(math.Inf(-1))
	for _, iv := range p.SectionAt(x) {
		a, b := max(iv[0], y0), min(iv[1], y1)
		if b > a {
			l += b - a
			lo, hi = min(lo, a), max(hi, b)
		}
	}
	return l, lo, hi
}

// EdgeAlong is where a ray from (x, y) inside the plate leaves it: along x
// (alongY false) toward dir = ±1, the x where it crosses the outline; along
// y, the y. Without an outline, the rectangle's free edge or sides.
func (p *Plate) EdgeAlong(x, y units.Length, alongY bool, dir float64) units.Length {
	if p.Outline == nil {
		switch {
		case !alongY:
			return p.FreeEdge
		case dir < 0:
			return p.YMin()
		}
		return p.YMax()
	}
	return units.Length(polygon.Ray(p.Outline, r2.Vec{X: float64(x), Y: float64(y)}, alongY, dir, float64(eps)))
}

// Inside reports whether (x, y) lies inside the outline.
func (p *Plate) Inside(x, y units.Length) bool {
	return polygon.Inside(p.Outline, r2.Vec{X: float64(x), Y: float64(y)})
}

// ClipToOutline returns the parts of the segment a–b (mm) inside the
// outline.
func (p *Plate) ClipToOutline(a, b r2.Vec) [][2]r2.Vec { return polygon.Clip(p.Outline, a, b) }
