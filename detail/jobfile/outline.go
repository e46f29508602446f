package jobfile

import (
	"fmt"
	"math"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine/polygon"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// maxOutline is the most points a plate's outline may have: beyond it the
// input is a typo (a plate is cut from a handful of straight edges).
const maxOutline = 200

// outlineTol is how near two points of an outline may come before they are
// one point: 0.001 mm, the least length a job gives (minLength).
const outlineTol = float64(minLength)

// parseOutline reads plate.outline: a list of [x, y] points in the job
// frame (SPEC §3), at least three, closed by itself (a last point equal
// to the first within outlineTol is dropped). It must close around one
// piece: no point repeating the one before it, some area, no edges that
// cross or fold back (polygon.Problem).
func (p *parser) parseOutline(n *yaml.Node) ([]r2.Vec, error) {
	const path = "plate.outline"
	const example = "[[-10 in, -4 in], [12 in, -4 in], [12 in, 9 in], [-10 in, 9 in]]"
	items, err := p.list(n, path, example, maxOutline+1)
	if err != nil {
		return nil, err
	}
	pts := make([]r2.Vec, len(items))
	for i, it := range items {
		ip := fmt.Sprintf("%s[%d]", path, i)
		p.job.lines[ip] = it.Line
		if it.Kind != yaml.SequenceNode || len(it.Content) != 2 {
			return nil, p.errAt(it, ip, "want a point [x, y]", "e.g. - [12 in, -4 in]: x along the member from its end, y from the heel or edge")
		}
		var xy [2]units.Length
		for c, name := range []string{"x", "y"} {
			v, err := p.length(it.Content[c], fmt.Sprintf("%s[%d]", ip, c), anySign)
			if err != nil {
				e := err.(*InputError)
				e.Field, e.Msg = ip, name+" "+e.Msg
				return nil, e
			}
			xy[c] = v
		}
		pts[i] = r2.Vec{X: float64(xy[0]), Y: float64(xy[1])}
	}
	if k := len(pts) - 1; k > 0 && r2.Norm(r2.Sub(pts[k], pts[0])) <= outlineTol {
		pts = pts[:k] // the closing point, given again
	}
	if i, msg := polygon.Problem(pts, outlineTol); msg != "" {
		i = max(i, 0)
		return nil, p.errAt(items[i], fmt.Sprintf("%s[%d]", path, i), msg,
			"list the plate's corners in order around it; the last joins the first")
	}
	return pts, nil
}

// parseClips reads plate.clip and cuts the corners off the outline: each
// item {corner: N, size: S} cuts off the corner at point N of plate.outline
// (counted from 0, as plate.outline[N]) by a straight line from S along
// the edge to the previous point to S along the edge to the next; size
// [a, b] gives the two legs apart (a toward the previous point, b toward
// the next). A corner is clipped once, only where it points out of the
// plate (convex), and the clips on one edge must leave some of it.
func (p *parser) parseClips(n *yaml.Node, pts []r2.Vec) ([]r2.Vec, error) {
	const path = "plate.clip"
	items, err := p.list(n, path, "[{corner: 2, size: 1 in}]", len(pts))
	if err != nil {
		return nil, err
	}
	nPts := len(pts)
	legs := make([][2]float64, nPts) // per corner: toward the previous point, toward the next
	clipped := make([]bool, nPts)
	itemOf := make([]int, nPts) // the clip item of each clipped corner
	ccw := polygon.Area(pts) > 0
	for i, it := range items {
		ip := fmt.Sprintf("%s[%d]", path, i)
		p.job.lines[ip] = it.Line
		b, err := p.mapping(it, ip, []string{"corner", "size"})
		if err != nil {
			return nil, err
		}
		if !b.has("corner") || !b.has("size") {
			return nil, p.errAt(it, ip, "wants corner and size", "e.g. {corner: 2, size: 1 in} or {corner: 2, size: [2 in, 1 in]}")
		}
		k, err := p.integer(b.vals["corner"], ip+".corner", 0, nPts-1)
		if err != nil {
			return nil, err
		}
		if clipped[k] {
			return nil, p.errAt(b.vals["corner"], ip+".corner", fmt.Sprintf("corner %d is clipped twice", k), "give one clip per corner")
		}
		prev, next := pts[(k+nPts-1)%nPts], pts[(k+1)%nPts]
		turn := cross(r2.Sub(pts[k], prev), r2.Sub(next, pts[k]))
		if (turn > 0) != ccw {
			return nil, p.errAt(b.vals["corner"], ip+".corner", fmt.Sprintf("corner %d points into the plate: a clip cuts off a corner that points out", k), "")
		}
		ab, err := p.clipSize(b.vals["size"], ip+".size")
		if err != nil {
			return nil, err
		}
		clipped[k], legs[k], itemOf[k] = true, ab, i
	}
	// Each edge k–k+1 loses legs[k][1] at its start and legs[k+1][0] at its end.
	for k := range nPts {
		e := r2.Norm(r2.Sub(pts[(k+1)%nPts], pts[k]))
		if used := legs[k][1] + legs[(k+1)%nPts][0]; used >= e-outlineTol {
			i := itemOf[(k+1)%nPts]
			if clipped[k] {
				i = itemOf[k]
			}
			return nil, p.errAt(items[i], fmt.Sprintf("%s[%d].size", path, i), fmt.Sprintf("the clips take %s of edge %d–%d, which is %s long: keep some of the edge",
				units.FormatJob(units.Length(used), p.sys()), k, (k+1)%nPts, units.FormatJob(units.Length(e), p.sys())), "make the clips smaller")
		}
	}
	var out []r2.Vec
	for k, q := range pts {
		if !clipped[k] {
			out = append(out, q)
			continue
		}
		prev, next := pts[(k+nPts-1)%nPts], pts[(k+1)%nPts]
		out = append(out, toward(q, prev, legs[k][0]), toward(q, next, legs[k][1]))
	}
	return out, nil
}

// clipSize reads one length (equal legs) or a pair [a, b].
func (p *parser) clipSize(n *yaml.Node, path string) ([2]float64, error) {
	if n.Kind != yaml.SequenceNode {
		a, err := p.length(n, path, positive)
		return [2]float64{float64(a), float64(a)}, err
	}
	if len(n.Content) != 2 {
		return [2]float64{}, p.errAt(n, path, "want one length, or two [a, b]", "a along the edge to the previous point, b along the edge to the next")
	}
	var ab [2]float64
	for i, c := range n.Content {
		v, err := p.length(c, fmt.Sprintf("%s[%d]", path, i), positive)
		if err != nil {
			return ab, err
		}
		ab[i] = float64(v)
	}
	return ab, nil
}

// toward is the point d from q toward r.
func toward(q, r r2.Vec, d float64) r2.Vec {
	u := r2.Sub(r, q)
	return r2.Add(q, r2.Scale(d/math.Max(r2.Norm(u), 1e-300), u))
}

func cross(u, v r2.Vec) float64 { return u.X*v.Y - u.Y*v.X }
