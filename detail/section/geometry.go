package section

import "math"

// part is a plane figure: its area and centroid, and its second moments
// about axes through its own centroid parallel to x and y. A hole is a part
// with every field but the centroid negated.
type part struct {
	a, cx, cy     float64 // mm², mm
	ixx, iyy, ixy float64 // mm⁴: ∫(y−cy)², ∫(x−cx)², ∫(x−cx)(y−cy)
}

// rect is the rectangle [x0, x1] × [y0, y1].
func rect(x0, x1, y0, y1 float64) part {
	w, h := x1-x0, y1-y0
	return part{
		a: w * h, cx: (x0 + x1) / 2, cy: (y0 + y1) / 2,
		ixx: w * h * h * h / 12, iyy: h * w * w * w / 12,
	}
}

// quarterDisc is the quarter of the disc of radius r centred at (xc, yc)
// that lies on the side sx of x = xc and sy of y = yc (sx, sy = ±1).
func quarterDisc(xc, yc, r, sx, sy float64) part {
	a := math.Pi * r * r / 4
	d := 4 * r / (3 * math.Pi) // centroid offset from the centre, each way
	i := math.Pi*r*r*r*r/16 - a*d*d
	return part{
		a: a, cx: xc + sx*d, cy: yc + sy*d,
		ixx: i, iyy: i,
		ixy: sx * sy * (r*r*r*r/8 - a*d*d),
	}
}

// spandrel is the corner piece of a square of side r, with its right-angled
// corner at (px, py) and extending to the side sx in x and sy in y, less the
// quarter disc of radius r centred at the opposite corner of the square:
// area (1 − π/4)·r². A fillet adds one; a rounded toe removes one.
func spandrel(px, py, r, sx, sy float64) part {
	if r == 0 {
		return part{}
	}
	sq := rect(math.Min(px, px+sx*r), math.Max(px, px+sx*r), math.Min(py, py+sy*r), math.Max(py, py+sy*r))
	return sum(sq, neg(quarterDisc(px+sx*r, py+sy*r, r, -sx, -sy)))
}

// neg turns a part into a hole of the same shape.
func neg(p part) part {
	return part{a: -p.a, cx: p.cx, cy: p.cy, ixx: -p.ixx, iyy: -p.iyy, ixy: -p.ixy}
}

// sum combines parts by the parallel-axis theorem. Parts of zero area
// (radius zero) are ignored.
func sum(ps ...part) part {
	var s part
	var mx, my float64
	for _, p := range ps {
		s.a += p.a
		mx += p.a * p.cx
		my += p.a * p.cy
	}
	if s.a == 0 {
		return part{}
	}
	s.cx, s.cy = mx/s.a, my/s.a
	for _, p := range ps {
		dx, dy := p.cx-s.cx, p.cy-s.cy
		s.ixx += p.ixx + p.a*dy*dy
		s.iyy += p.iyy + p.a*dx*dx
		s.ixy += p.ixy + p.a*dx*dy
	}
	return s
}

// principalMin is the least principal second moment of p.
func (p part) principalMin() float64 {
	m, d := (p.ixx+p.iyy)/2, (p.ixx-p.iyy)/2
	return m - math.Hypot(d, p.ixy)
}

// angleShape is an angle with its heel at the origin: leg A of length a
// along +y, leg B of length b along +x, thickness t, root fillet r1 and toe
// radius r2.
func angleShape(a, b, t, r1, r2 float64) part {
	return sum(
		rect(0, t, 0, a),                // leg A, full length
		rect(t, b, 0, t),                // leg B beyond leg A
		spandrel(t, t, r1, 1, 1),        // root fillet
		neg(spandrel(t, a, r2, -1, -1)), // toe of leg A, inner corner
		neg(spandrel(b, t, r2, -1, -1)), // toe of leg B, inner corner
	)
}
