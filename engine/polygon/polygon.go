// Package polygon is the geometry of a plate's outline: a simple polygon
// of r2.Vec points (mm, the member frame of package engine), in the job's
// order and closed by itself (the last point joins the first), either way
// round. It answers where lines cross it, what lies inside, and whether
// points make an outline at all; it knows nothing of plates or limit
// states (package engine asks it).
package polygon

import (
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r2"
)

// Edge is one edge, from point I to point I+1 (the last to the first),
// with its outward normal.
type Edge struct {
	I      int
	A, B   r2.Vec
	Normal r2.Vec // unit, pointing out of the polygon
}

// Distance is the shortest distance from p to the edge: perpendicular
// where the foot falls on it, else to its nearer end.
func (e Edge) Distance(p r2.Vec) float64 {
	d := r2.Sub(e.B, e.A)
	t := 0.0
	if l2 := r2.Dot(d, d); l2 > 0 {
		t = min(max(r2.Dot(r2.Sub(p, e.A), d)/l2, 0), 1)
	}
	return r2.Norm(r2.Sub(p, r2.Add(e.A, r2.Scale(t, d))))
}

// Area is the signed area: positive counter-clockwise.
func Area(pts []r2.Vec) float64 {
	a := 0.0
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		a += p.X*q.Y - q.X*p.Y
	}
	return a / 2
}

// Edges lists the edges in the points' order.
func Edges(pts []r2.Vec) []Edge {
	sign := 1.0
	if Area(pts) < 0 {
		sign = -1
	}
	es := make([]Edge, len(pts))
	for i, a := range pts {
		b := pts[(i+1)%len(pts)]
		d := r2.Sub(b, a)
		n := r2.Scale(sign/max(r2.Norm(d), 1e-300), r2.Vec{X: d.Y, Y: -d.X}) // right of a CCW edge is out
		es[i] = Edge{I: i, A: a, B: b, Normal: n}
	}
	return es
}

// Crossings are the coordinates where the line u = at crosses the edges
// (u is x when vertical, the crossings then are y; else u is y and they
// are x), sorted; a vertex on the line counts once (half-open edges), so
// they pair into the intervals inside.
func Crossings(pts []r2.Vec, at float64, vertical bool) []float64 {
	var out []float64
	for i, a := range pts {
		b := pts[(i+1)%len(pts)]
		au, av, bu, bv := a.Y, a.X, b.Y, b.X
		if vertical {
			au, av, bu, bv = a.X, a.Y, b.X, b.Y
		}
		if (au <= at) != (bu <= at) {
			out = append(out, av+(at-au)*(bv-av)/(bu-au))
		}
	}
	slices.Sort(out)
	return out
}

// Section is the parts of the line x = x inside, as intervals [y0, y1]
// from low y to high (one for a convex polygon).
func Section(pts []r2.Vec, x float64) [][2]float64 {
	cs := Crossings(pts, x, true)
	var out [][2]float64
	for i := 0; i+1 < len(cs); i += 2 {
		out = append(out, [2]float64{cs[i], cs[i+1]})
	}
	return out
}

// Ray is where a ray from p leaves the polygon: along x (vertical false)
// toward dir = ±1, the x where it first crosses an edge; along y, the y.
// ±Inf when it crosses none. A crossing less than tol behind p counts.
func Ray(pts []r2.Vec, p r2.Vec, vertical bool, dir, tol float64) float64 {
	at, from := p.Y, p.X
	if vertical {
		at, from = p.X, p.Y
	}
	best := math.Inf(int(dir))
	for _, c := range Crossings(pts, at, vertical) {
		if dir*(c-from) > -tol && dir*(c-best) < 0 {
			best = c
		}
	}
	return best
}

// Inside reports whether p lies inside (crossing number).
func Inside(pts []r2.Vec, p r2.Vec) bool {
	n := 0
	for _, c := range Crossings(pts, p.Y, false) {
		if c > p.X {
			n++
		}
	}
	return n%2 == 1
}

// Clip returns the parts of the segment a–b inside the polygon.
func Clip(pts []r2.Vec, a, b r2.Vec) [][2]r2.Vec {
	ts := []float64{0, 1}
	d := r2.Sub(b, a)
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
		if ts[k+1]-ts[k] < 1e-12 || !Inside(pts, r2.Add(a, r2.Scale((ts[k]+ts[k+1])/2, d))) {
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

// Problem says what keeps the points from being an outline, with the
// index of the point it concerns: fewer than three points, a point within
// tol of the one before it, edges that cross or touch, no area, or an edge
// that turns straight back along the one before (the points do not close
// around one piece). "" when they make one.
func Problem(pts []r2.Vec, tol float64) (int, string) {
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
	if math.Abs(Area(pts)) <= tol*tol {
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
