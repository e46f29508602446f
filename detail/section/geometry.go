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

// polygon is the simple polygon through vs in counter-clockwise order
// (Green's theorem: the exact area, centroid and second moments).
func polygon(vs [][2]float64) part {
	var a, mx, my, sxx, syy, sxy float64
	for i := range vs {
		x0, y0 := vs[i][0], vs[i][1]
		x1, y1 := vs[(i+1)%len(vs)][0], vs[(i+1)%len(vs)][1]
		c := x0*y1 - x1*y0
		a += c
		mx += (x0 + x1) * c
		my += (y0 + y1) * c
		syy += (x0*x0 + x0*x1 + x1*x1) * c
		sxx += (y0*y0 + y0*y1 + y1*y1) * c
		sxy += (x0*y1 + 2*x0*y0 + 2*x1*y1 + x1*y0) * c
	}
	a /= 2
	cx, cy := mx/(6*a), my/(6*a)
	return part{
		a: a, cx: cx, cy: cy,
		ixx: sxx/12 - a*cy*cy,
		iyy: syy/12 - a*cx*cx,
		ixy: sxy/24 - a*cx*cy,
	}
}

// iShape is a W shape standing on its lower flange's outer face (y = 0),
// symmetric about x = 0: depth d, flange width bf and thickness tf, web
// thickness tw, and a root fillet of radius r in each of the four corners
// between web and flange.
func iShape(d, bf, tw, tf, r float64) part {
	return sum(
		rect(-bf/2, bf/2, 0, tf),
		rect(-bf/2, bf/2, d-tf, d),
		rect(-tw/2, tw/2, tf, d-tf),
		spandrel(tw/2, tf, r, 1, 1), spandrel(-tw/2, tf, r, -1, 1),
		spandrel(tw/2, d-tf, r, 1, -1), spandrel(-tw/2, d-tf, r, -1, -1),
	)
}

// teeShape is a WT with its flange's outer face on y = 0 and the stem
// along +y to y = d, symmetric about x = 0, with a root fillet of radius r
// each side of the stem.
func teeShape(d, bf, tw, tf, r float64) part {
	return sum(
		rect(-bf/2, bf/2, 0, tf),
		rect(-tw/2, tw/2, tf, d),
		spandrel(tw/2, tf, r, 1, 1), spandrel(-tw/2, tf, r, -1, 1),
	)
}

// channelShape is a channel with the back of its web on x = 0 and its
// flanges along +x, lower flange's outer face on y = 0. The flanges'
// inner faces slope by s (rise over run, thicker at the web); tf is the
// thickness halfway along the flange's inner face (x = (tw + bf)/2), so
// that the flange's area is (bf − tw)·tf whatever the slope. No fillet
// and no toe rounding.
func channelShape(d, bf, tw, tf, s float64) part {
	t := func(x float64) float64 { return tf + s*((tw+bf)/2-x) }
	return polygon([][2]float64{
		{0, 0}, {bf, 0}, {bf, t(bf)}, {tw, t(tw)},
		{tw, d - t(tw)}, {bf, d - t(bf)}, {bf, d}, {0, d},
	})
}
