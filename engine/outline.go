package engine

import (
	"fmt"
	"math"
	"slices"

	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// This file is the plate's true outline (Plate.Outline): a simple polygon
// in the member frame, in mm, its points in the job's order and closed by
// itself (the last point joins the first). The limit states and the
// detailing rules read it through the questions below; a plate without an
// outline is today's rectangle, open toward −x, and none of them is asked.

// OutlineEdge is one edge of the outline, from point I to point I+1 (the
// last to the first), with its outward normal.
type OutlineEdge struct {
	I      int
	A, B   r2.Vec
	Normal r2.Vec // unit, pointing out of the plate
}

// Free says the edge faces the plate's free edge (+x, where the member
// laps the plate): its outward normal points more along +x than across.
func (e OutlineEdge) Free() bool {
	return e.Normal.X > 0 && math.Abs(e.Normal.X) >= math.Abs(e.Normal.Y)-1e-12
}

// Side says the edge runs more along the load than across it (a side of
// the plate, a corner clip leaning that way).
func (e OutlineEdge) Side() bool { return math.Abs(e.Normal.Y) > math.Abs(e.Normal.X)+1e-12 }

// Distance is the shortest distance from (x, y) to the edge: perpendicular
// where the foot falls on it, else to its nearer end.
func (e OutlineEdge) Distance(x, y units.Length) units.Length {
	p := r2.Vec{X: float64(x), Y: float64(y)}
	d := r2.Sub(e.B, e.A)
	t := 0.0
	if l2 := r2.Dot(d, d); l2 > 0 {
		t = min(max(r2.Dot(r2.Sub(p, e.A), d)/l2, 0), 1)
	}
	return units.Length(r2.Norm(r2.Sub(p, r2.Add(e.A, r2.Scale(t, d)))))
}

// OutlineArea is the signed area of a closed polygon: positive
// counter-clockwise.
func OutlineArea(pts []r2.Vec) float64 {
	a := 0.0
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		a += p.X*q.Y - q.X*p.Y
	}
	return a / 2
}

// Edges lists the outline's edges in the job's order.
func (p *Plate) Edges() []OutlineEdge {
	pts := p.Outline
	sign := 1.0
	if OutlineArea(pts) < 0 {
		sign = -1
	}
	es := make([]OutlineEdge, len(pts))
	for i, a := range pts {
		b := pts[(i+1)%len(pts)]
		d := r2.Sub(b, a)
		n := r2.Scale(sign/max(r2.Norm(d), 1e-300), r2.Vec{X: d.Y, Y: -d.X}) // right of a CCW edge is out
		es[i] = OutlineEdge{I: i, A: a, B: b, Normal: n}
	}
	return es
}

// crossings are the coordinates where the line u = at (u is x when alongY,
// else y) crosses the outline's edges, sorted; a vertex on the line
// counts once (half-open edges), so they pair into the intervals inside.
func (p *Plate) crossings(at float64, alongY bool) []float64 {
	var out []float64
	pts := p.Outline
	for i, a := range pts {
		b := pts[(i+1)%len(pts)]
		au, av, bu, bv := a.Y, a.X, b.Y, b.X
		if alongY {
			au, av, bu, bv = a.X, a.Y, b.X, b.Y
		}
		if (au <= at) != (bu <= at) {
			out = append(out, av+(at-au)*(bv-av)/(bu-au))
		}
	}
	slices.Sort(out)
	return out
}

// SectionAt is the parts of the line x = x inside the outline, as
// intervals [y0, y1] from low y to high (one for a convex outline).
func (p *Plate) SectionAt(x units.Length) [][2]units.Length {
	cs := p.crossings(float64(x), true)
	var out [][2]units.Length
	for i := 0; i+1 < len(cs); i += 2 {
		out = append(out, [2]units.Length{units.Length(cs[i]), units.Length(cs[i+1])})
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
	at, from := float64(y), float64(x)
	if alongY {
		at, from = float64(x), float64(y)
	}
	best := math.Inf(int(dir))
	for _, c := range p.crossings(at, alongY) {
		if d := dir * (c - from); d > -eps && dir*(c-best) < 0 {
			best = c
		}
	}
	return units.Length(best)
}

// Inside reports whether (x, y) lies inside the outline (crossing number).
func (p *Plate) Inside(x, y units.Length) bool {
	n := 0
	for _, c := range p.crossings(float64(y), false) {
		if c > float64(x) {
			n++
		}
	}
	return n%2 == 1
}

// ClipToOutline returns the parts of the segment a–b inside the outline.
func (p *Plate) ClipToOutline(a, b r2.Vec) [][2]r2.Vec {
	ts := []float64{0, 1}
	d := r2.Sub(b, a)
	pts := p.Outline
	for i, q0 := range pts {
		e := r2.Sub(pts[(i+1)%len(pts)], q0)
		den := d.X*e.Y - d.Y*e.X
		if math.Abs(den) < 1e-12 {
			continue
		}
		w := r2.Sub(q0, a)
		t, s := (w.X*e.Y-w.Y*e.X)/den, (w.X*d.Y-w.Y*d.X)/den
		if t > 0 && t < 1 && s >= 0 && s <= 1 {
			ts = append(ts, t)
		}
	}
	slices.Sort(ts)
	var out [][2]r2.Vec
	for k := 0; k+1 < len(ts); k++ {
		if ts[k+1]-ts[k] < 1e-12 {
			continue
		}
		m := r2.Add(a, r2.Scale((ts[k]+ts[k+1])/2, d))
		if !p.Inside(units.Length(m.X), units.Length(m.Y)) {
			continue
		}
		s0, s1 := r2.Add(a, r2.Scale(ts[k], d)), r2.Add(a, r2.Scale(ts[k+1], d))
		if n := len(out); n > 0 && out[n-1][1] == s0 {
			out[n-1][1] = s1
			continue
		}
		out = append(out, [2]r2.Vec{s0, s1})
	}
	return out
}

// OutlineProblem says what keeps the points from being a plate's outline,
// with the index of the point it concerns: fewer than three points, a
// point repeating the one before it, no area, or edges that cross (the
// outline does not close around one piece). "" when it is one.
func OutlineProblem(pts []r2.Vec, tol float64) (int, string) {
	n := len(pts)
	if n < 3 {
		return n - 1, fmt.Sprintf("has %d points: an outline needs at least 3", n)
	}
	for i := range pts {
		if r2.Norm(r2.Sub(pts[i], pts[(i+n-1)%n])) <= tol {
			return i, fmt.Sprintf("repeats point %d", (i+n-1)%n)
		}
	}
	adjacent := func(i, j int) bool { return j == i+1 || (i == 0 && j == n-1) }
	for i := range n {
		for j := i + 1; j < n; j++ {
			if !adjacent(i, j) && segmentsMeet(pts[i], pts[(i+1)%n], pts[j], pts[(j+1)%n]) {
				return j, fmt.Sprintf("edge %d–%d crosses edge %d–%d: the outline does not close around one piece", j, (j+1)%n, i, (i+1)%n)
			}
		}
	}
	if math.Abs(OutlineArea(pts)) <= tol*tol {
		return n - 1, "the outline encloses no area (its points lie on one line): it does not close around a plate"
	}
	for i := range n {
		j := (i + 1) % n // edge i–j, then j–k
		if foldsBack(pts[i], pts[j], pts[(j+1)%n]) {
			return j, fmt.Sprintf("turns straight back at point %d: the outline does not close around one piece", j)
		}
	}
	return -1, ""
}

// foldsBack reports whether the edges p–q and q–r overlap: the second
// turns straight back along the first.
func foldsBack(p, q, r r2.Vec) bool {
	u, v := r2.Sub(p, q), r2.Sub(r, q)
	cross := u.X*v.Y - u.Y*v.X
	return math.Abs(cross) <= 1e-9*r2.Norm(u)*r2.Norm(v) && r2.Dot(u, v) > 0
}

// segmentsMeet reports whether the closed segments a–b and c–d touch.
func segmentsMeet(a, b, c, d r2.Vec) bool {
	orient := func(p, q, r r2.Vec) float64 {
		return (q.X-p.X)*(r.Y-p.Y) - (q.Y-p.Y)*(r.X-p.X)
	}
	on := func(p, q, r r2.Vec) bool { // r on segment p–q, given collinear
		return min(p.X, q.X)-1e-9 <= r.X && r.X <= max(p.X, q.X)+1e-9 && min(p.Y, q.Y)-1e-9 <= r.Y && r.Y <= max(p.Y, q.Y)+1e-9
	}
	o1, o2, o3, o4 := orient(a, b, c), orient(a, b, d), orient(c, d, a), orient(c, d, b)
	const z = 1e-9
	if ((o1 > z && o2 < -z) || (o1 < -z && o2 > z)) && ((o3 > z && o4 < -z) || (o3 < -z && o4 > z)) {
		return true
	}
	return (math.Abs(o1) <= z && on(a, b, c)) || (math.Abs(o2) <= z && on(a, b, d)) ||
		(math.Abs(o3) <= z && on(c, d, a)) || (math.Abs(o4) <= z && on(c, d, b))
}
