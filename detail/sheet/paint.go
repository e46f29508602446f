package sheet

import "gonum.org/v1/gonum/spatial/r2"

// This file is the one walk over the sheet model: what a drawing of a cut
// sheet or of one part holds, in which order, and how far it reaches. A
// back end (package dxfout) implements Painter and draws only what it is
// handed.

// Painter is a drawing back end. Coordinates are the drawing's: a view's
// origin is already added. A painter must not keep the slices it is
// handed; they are reused after the call returns.
type Painter interface {
	// Layers comes first, once, with every layer the drawing may use, in
	// the order a layer table lists them.
	Layers(ls []Layer)
	Line(a, b r2.Vec, l Layer)
	Circle(centre r2.Vec, r float64, l Layer)
	// ClosedPolyline draws a closed outline through pts. The side from
	// pts[i] to the next vertex is straight where bulges is nil or
	// bulges[i] is 0, else an arc of bulge bulges[i] (the tangent of a
	// quarter of its included angle, positive counter-clockwise): a slot's
	// ends are half circles of bulge 1.
	ClosedPolyline(pts []r2.Vec, bulges []float64, l Layer)
	// Text draws one line of text at t.At with its height, rotation and
	// alignment.
	Text(t Text)
}

// PartLayers are the layers of a part drawn alone (Part.Paint): a CAM file
// has entities on these only.
func PartLayers() []Layer { return []Layer{LayerContour, LayerHoles} }

// HoleMarker is what a Painter implements to learn which hole it draws
// (the report's SVG tags each hole with its part, id and position). The
// walk calls BeginHole before the Circle or ClosedPolyline of each hole:
// the part's name, the hole in the part's frame and its centre on the
// drawing. A painter without it is handed the same items.
type HoleMarker interface {
	BeginHole(part string, h SheetHole, at r2.Vec)
}

// Paint draws the cut sheet on p: every view at its origin (as PaintView
// draws it), then the sheet's own lines and texts (title block, hole
// schedule). It returns the corners of what it drew, text by Text.Box, a
// slot by its extents.
func (s *Sheet) Paint(to Painter) (lo, hi r2.Vec) {
	w := newWalk(to)
	to.Layers(Layers())
	for i := range s.Views {
		v := &s.Views[i]
		w.view(v, v.Origin, s.TextHeight)
	}
	w.at = r2.Vec{}
	for _, l := range s.Lines {
		w.line(l)
	}
	for _, t := range s.Texts {
		w.text(t)
	}
	return w.lo, w.hi
}

// PaintView draws view i alone, with its part's frame at `at` rather than
// at the view's Origin: the part's contour and holes, then the view's
// reference lines, dimensions and texts, as Paint draws each view. It
// returns the corners of what it drew. The report stacks the views this
// way, each in its own frame.
func (s *Sheet) PaintView(to Painter, i int, at r2.Vec) (lo, hi r2.Vec) {
	w := newWalk(to)
	to.Layers(Layers())
	w.view(&s.Views[i], at, s.TextHeight)
	return w.lo, w.hi
}

// Paint draws the part alone in its own frame, as its CAM file holds it:
// the closed contour and the holes, nothing else. It returns the corners
// of what it drew.
func (p *Part) Paint(to Painter) (lo, hi r2.Vec) {
	w := newWalk(to)
	to.Layers(PartLayers())
	w.part(p)
	return w.lo, w.hi
}

// PaintMarked draws the part as Paint does, then its Label on LayerMark,
// left-aligned at height h, h above the contour's top left corner: a CAM
// file that names its piece away from every cut. Without a label it is
// Paint, with LayerMark declared.
func (p *Part) PaintMarked(to Painter, h float64) (lo, hi r2.Vec) {
	w := newWalk(to)
	to.Layers(append(PartLayers(), LayerMark))
	w.part(p)
	if p.Label != "" {
		plo, phi := corners(p.Contour)
		w.text(Text{At: r2.Vec{X: plo.X, Y: phi.Y + h}, Height: h, Align: AlignLeftBase, Value: p.Label, Layer: LayerMark})
	}
	return w.lo, w.hi
}

// walk hands the model to a painter, shifted by the origin of the current
// view, and keeps the extents of what it handed over.
type walk struct {
	p      Painter
	marker HoleMarker // p, when it wants to know its holes; else nil
	at     r2.Vec     // origin of the current view on the drawing
	broken *View      // the current view where it has a break (member.go); else nil
	lo, hi r2.Vec
	empty  bool
	pts    []r2.Vec // reused for the vertices handed to ClosedPolyline
}

func newWalk(p Painter) *walk {
	m, _ := p.(HoleMarker)
	return &walk{p: p, marker: m, empty: true}
}

// view draws v with its part's frame at `at`, dimensions for text height h.
func (w *walk) view(v *View, at r2.Vec, h float64) {
	w.at = at
	if v.Break != nil {
		w.broken = v
		defer func() { w.broken = nil }()
	}
	w.part(&v.Part)
	for _, l := range v.Lines {
		w.line(l)
	}
	for _, d := range v.Dims {
		w.dimension(d, h)
	}
	for _, t := range v.Texts {
		w.text(t)
	}
}

func (w *walk) grow(q r2.Vec) {
	if w.empty {
		w.lo, w.hi, w.empty = q, q, false
		return
	}
	w.lo = r2.Vec{X: min(w.lo.X, q.X), Y: min(w.lo.Y, q.Y)}
	w.hi = r2.Vec{X: max(w.hi.X, q.X), Y: max(w.hi.Y, q.Y)}
}

// put is where a point of the current view's frame is drawn.
func (w *walk) put(q r2.Vec) r2.Vec {
	if w.broken != nil {
		q = w.broken.Fold(q)
	}
	return r2.Add(q, w.at)
}

func (w *walk) line(s Segment) {
	if v := w.broken; v != nil {
		if l, r, ok := splitAtBreak(s, v.Break); ok {
			w.line(l)
			w.line(r)
			return
		}
	}
	a, b := w.put(s.A), w.put(s.B)
	w.p.Line(a, b, s.Layer)
	w.grow(a)
	w.grow(b)
}

// polyline hands over a closed outline given in the view's frame; lo and
// hi bound it there.
func (w *walk) polyline(pts []r2.Vec, bulges []float64, l Layer, lo, hi r2.Vec) {
	w.pts = w.pts[:0]
	for _, q := range pts {
		w.pts = append(w.pts, w.put(q))
	}
	w.p.ClosedPolyline(w.pts, bulges, l)
	w.grow(w.put(lo))
	w.grow(w.put(hi))
}

func (w *walk) part(p *Part) {
	lo, hi := corners(p.Contour)
	if v := w.broken; v != nil {
		// A broken view draws the contour as its two pieces, already
		// folded: the walk draws them as they are.
		left, right := breakLines(lo, hi, v.Break, v.Fold)
		w.broken = nil
		for _, piece := range [][]r2.Vec{left, right} {
			plo, phi := corners(piece)
			w.polyline(piece, nil, LayerContour, plo, phi)
		}
		w.broken = v
	} else {
		w.polyline(p.Contour, nil, LayerContour, lo, hi)
	}
	for _, h := range p.Holes {
		if w.marker != nil {
			w.marker.BeginHole(p.Name, h, w.put(h.Centre))
		}
		w.hole(h)
	}
}

// hole draws a round hole as a circle, a slot as its closed outline of
// two straight sides and two half circles.
func (w *walk) hole(h SheetHole) {
	if h.Round() {
		c := w.put(h.Centre)
		r := h.Diameter() / 2
		w.p.Circle(c, r, LayerHoles)
		w.grow(r2.Vec{X: c.X - r, Y: c.Y - r})
		w.grow(r2.Vec{X: c.X + r, Y: c.Y + r})
		return
	}
	pts, bulges := h.SlotOutline()
	half := r2.Vec{X: h.Dx / 2, Y: h.Dy / 2}
	w.polyline(pts, bulges, LayerHoles, r2.Vec{X: h.Centre.X - half.X, Y: h.Centre.Y - half.Y}, r2.Add(h.Centre, half))
}

func (w *walk) text(t Text) {
	t.At = w.put(t.At)
	w.p.Text(t)
	lo, hi := t.Box()
	w.grow(lo)
	w.grow(hi)
}

// dimension draws a dimension as Dimension.Graphics lays it out for text
// height h, in its order.
func (w *walk) dimension(d Dimension, h float64) {
	if v := w.broken; v != nil {
		// Laid out where its points are drawn; its text, the part's
		// distance, stays true across a break.
		d.A, d.B = v.Fold(d.A), v.Fold(d.B)
		if d.Axis == AlongY {
			d.Offset = v.Fold(r2.Vec{X: d.Offset}).X
		}
		w.broken = nil
		defer func() { w.broken = v }()
	}
	g := d.Graphics(h)
	for _, l := range g.Lines {
		w.line(l)
	}
	for _, tri := range g.Arrows {
		pts := tri[:]
		lo, hi := corners(pts)
		w.polyline(pts, nil, LayerDimensions, lo, hi)
	}
	for _, l := range g.Leaders {
		w.line(l)
	}
	for _, t := range g.Texts {
		w.text(t)
	}
}

// splitAtBreak splits a segment that runs across the break b into the
// piece before the break and the piece after it.
func splitAtBreak(s Segment, b *Break) (Segment, Segment, bool) {
	a, c := s.A, s.B
	if a.X > c.X {
		a, c = c, a
	}
	if a.X >= b.X0 || c.X <= b.X1 {
		return s, s, false
	}
	at := func(x float64) r2.Vec { return r2.Vec{X: x, Y: a.Y + (c.Y-a.Y)*(x-a.X)/(c.X-a.X)} }
	return Segment{A: a, B: at(b.X0), Layer: s.Layer}, Segment{A: at(b.X1), B: c, Layer: s.Layer}, true
}

// corners returns the corners of the box around pts (at least one).
func corners(pts []r2.Vec) (lo, hi r2.Vec) {
	lo, hi = pts[0], pts[0]
	for _, q := range pts {
		lo = r2.Vec{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = r2.Vec{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	return lo, hi
}

// eps is the geometric tolerance of the sheet's comparisons, in mm.
const eps = 1e-6
