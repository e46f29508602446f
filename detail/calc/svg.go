package calc

import (
	"fmt"
	"gaugeline/detail/sheet"
	"html/template"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"
)

// This file draws the views of a cut sheet (sheet.Sheet, the model the
// DXF is drawn from) as one inline SVG. The SVG's user unit is the sheet's
// drawing unit (inches for us, millimetres for si), so the browser scales
// the drawing to fit through the viewBox alone.
//
// The sheet is y up, SVG is y down: a view's point (x, y) in its part's
// frame is drawn at (x + tx, ty − y), where translate(tx ty) is the
// transform of the view's group. The views are stacked top to bottom,
// member first, rather than side by side as on the sheet, so that a page
// width shows them at a scale whose text can be read. The sheet's own
// title block and hole schedule are left to the HTML around the drawing.
//
// Every hole carries data-part, data-hole, data-x and data-y (its centre
// in the part's frame, in the job's units, full precision), so that a
// reader can match the drawing to the job without undoing the transform.

// capHeight is the height of capitals over the font size of a plain
// sans-serif font: a sheet text of height h is drawn at font size
// h/capHeight, so that its capitals stand h tall as in the DXF.
const capHeight = 0.72

// minTextPx and maxTextPx bound the font size, in CSS pixels, that
// dimension text is shown at on screen.
const (
	minTextPx = 10.0
	maxTextPx = 16.0
)

// svgNum writes a coordinate: rounded to 1e-7 of a drawing unit (far below
// anything drawn, and below the 1e-6 at which a hole is matched), the
// shortest decimal that says it, never "-0".
func svgNum(v float64) string {
	v = math.Round(v*1e7) / 1e7
	if v == 0 {
		v = 0
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}

// exact writes a value at full precision (data attributes).
func exact(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// svgPen writes the elements of one view and keeps their extents in the
// view's (y-up) frame.
type svgPen struct {
	b      strings.Builder
	lo, hi r2.Vec
	empty  bool
}

func (p *svgPen) grow(q r2.Vec) {
	if p.empty {
		p.lo, p.hi, p.empty = q, q, false
		return
	}
	p.lo = r2.Vec{X: min(p.lo.X, q.X), Y: min(p.lo.Y, q.Y)}
	p.hi = r2.Vec{X: max(p.hi.X, q.X), Y: max(p.hi.Y, q.Y)}
}

// pt writes a point flipped to SVG's y-down sense.
func pt(q r2.Vec) string { return svgNum(q.X) + "," + svgNum(-q.Y) }

func (p *svgPen) line(a, b r2.Vec, class string) {
	fmt.Fprintf(&p.b, `<line class="%s" x1="%s" y1="%s" x2="%s" y2="%s"/>`+"\n",
		class, svgNum(a.X), svgNum(-a.Y), svgNum(b.X), svgNum(-b.Y))
	p.grow(a)
	p.grow(b)
}

func (p *svgPen) polygon(pts []r2.Vec, class string) {
	s := make([]string, len(pts))
	for i, q := range pts {
		s[i] = pt(q)
		p.grow(q)
	}
	fmt.Fprintf(&p.b, `<polygon class="%s" points="%s"/>`+"\n", class, strings.Join(s, " "))
}

func (p *svgPen) hole(part string, h sheet.SheetHole) {
	data := fmt.Sprintf(`data-part="%s" data-hole="%s" data-x="%s" data-y="%s" data-dx="%s" data-dy="%s"`,
		template.HTMLEscapeString(part), template.HTMLEscapeString(h.ID),
		exact(h.Centre.X), exact(h.Centre.Y), exact(h.Dx), exact(h.Dy))
	half := r2.Vec{X: h.Dx / 2, Y: h.Dy / 2}
	p.grow(r2.Vec{X: h.Centre.X - half.X, Y: h.Centre.Y - half.Y})
	p.grow(r2.Add(h.Centre, half))
	if h.Round() {
		fmt.Fprintf(&p.b, `<circle class="hole" cx="%s" cy="%s" r="%s" %s><title>%s</title></circle>`+"\n",
			svgNum(h.Centre.X), svgNum(-h.Centre.Y), svgNum(h.Diameter()/2), data, template.HTMLEscapeString(h.ID))
		return
	}
	// Straight sides and half-circle ends, counter-clockwise in the y-up
	// frame; the flip keeps the picture's sense, so each end is an arc
	// with sweep flag 0.
	pts, bulges := h.SlotOutline()
	r := svgNum(h.Diameter() / 2)
	var d strings.Builder
	d.WriteString("M" + pt(pts[0]))
	for i := range pts {
		next := pts[(i+1)%len(pts)]
		if bulges[i] != 0 {
			d.WriteString(" A" + r + "," + r + " 0 0 0 " + pt(next))
		} else {
			d.WriteString(" L" + pt(next))
		}
	}
	d.WriteString(" Z")
	fmt.Fprintf(&p.b, `<path class="hole slot" d="%s" %s><title>%s</title></path>`+"\n",
		d.String(), data, template.HTMLEscapeString(h.ID))
	// The centre, for a reader checking positions.
	fmt.Fprintf(&p.b, `<circle class="slot-centre" cx="%s" cy="%s" r="%s"/>`+"\n",
		svgNum(h.Centre.X), svgNum(-h.Centre.Y), svgNum(h.Diameter()/10))
}

// anchors maps a sheet alignment onto SVG's text-anchor and
// dominant-baseline.
func anchors(a sheet.Align) (anchor, baseline string) {
	switch a {
	case sheet.AlignCenterBottom:
		return "middle", "alphabetic"
	case sheet.AlignCenterMiddle:
		return "middle", "central"
	case sheet.AlignCenterTop:
		return "middle", "hanging"
	case sheet.AlignRightBottom:
		return "end", "alphabetic"
	case sheet.AlignRightMiddle:
		return "end", "central"
	case sheet.AlignRightTop:
		return "end", "hanging"
	}
	return "start", "alphabetic"
}

func (p *svgPen) text(t sheet.Text, class string) {
	anchor, base := anchors(t.Align)
	rot := ""
	if t.Rotation != 0 {
		// Counter-clockwise on the sheet is counter-clockwise on the
		// screen too, which SVG writes as a negative angle.
		rot = fmt.Sprintf(` transform="rotate(%s %s %s)"`, svgNum(-t.Rotation), svgNum(t.At.X), svgNum(-t.At.Y))
	}
	fmt.Fprintf(&p.b, `<text class="%s" x="%s" y="%s" font-size="%s" text-anchor="%s" dominant-baseline="%s"%s>%s</text>`+"\n",
		class, svgNum(t.At.X), svgNum(-t.At.Y), svgNum(t.Height/capHeight), anchor, base, rot,
		template.HTMLEscapeString(t.Value))
	lo, hi := t.Box()
	p.grow(lo)
	p.grow(hi)
}

// dimension draws a dimension as the sheet model lays it out (the same
// layout the DXF draws).
func (p *svgPen) dimension(d sheet.Dimension, h float64) {
	cls := sheet.LayerDimensions.String()
	g := d.Graphics(h)
	for _, l := range g.Lines {
		p.line(l.A, l.B, cls)
	}
	for _, tri := range g.Arrows {
		p.polygon(tri[:], "arrow")
	}
	for _, l := range g.Leaders {
		p.line(l.A, l.B, cls)
	}
	for _, t := range g.Texts {
		p.text(t, cls)
	}
}

// viewSVG draws one view in its part's frame.
func viewSVG(v *sheet.View, h float64) *svgPen {
	p := &svgPen{empty: true}
	part := v.Part.Name
	pts := make([]string, len(v.Part.Contour))
	for i, q := range v.Part.Contour {
		pts[i] = pt(q)
		p.grow(q)
	}
	fmt.Fprintf(&p.b, `<polygon class="contour" points="%s"/>`+"\n", strings.Join(pts, " "))
	for _, l := range v.Lines {
		p.line(l.A, l.B, l.Layer.String())
	}
	for _, hole := range v.Part.Holes {
		p.hole(part, hole)
	}
	for _, d := range v.Dims {
		p.dimension(d, h)
	}
	for _, t := range v.Texts {
		class := t.Layer.String()
		if t.Value == sheet.Stamp {
			class += " stamp"
		}
		p.text(t, class)
	}
	return p
}

// drawing returns the views of the sheet as one SVG element, stacked top
// to bottom with a gap of six text heights, a margin of two all round.
//
// wide reports whether the drawing is wider on screen than a page (about
// 1000 CSS pixels) at its least text size.
func drawing(s *sheet.Sheet) (svg template.HTML, wide bool) {
	h := s.TextHeight
	margin, gap := 2*h, 6*h
	var body strings.Builder
	width, cursor := 0.0, margin
	for i := range s.Views {
		v := &s.Views[i]
		p := viewSVG(v, h)
		tx, ty := margin-p.lo.X, cursor+p.hi.Y
		fmt.Fprintf(&body, `<g class="view" data-part="%s" transform="translate(%s %s)">`+"\n%s</g>\n",
			template.HTMLEscapeString(v.Part.Name), svgNum(tx), svgNum(ty), p.b.String())
		width = max(width, p.hi.X-p.lo.X+2*margin)
		cursor = ty - p.lo.Y + gap
	}
	height := cursor - gap + margin
	unit := "in"
	if s.Units.String() == "si" {
		unit = "mm"
	}
	// Scaled to fit the page, but never so far that dimension text falls
	// below minTextPx (a long part scrolls sideways on screen instead) nor
	// grows past maxTextPx (a small part stays at a drawing's scale).
	perPx := (h / capHeight) // drawing units per CSS pixel of text, times the text size
	minWidth, maxWidth := math.Ceil(width*minTextPx/perPx), math.Ceil(width*maxTextPx/perPx)
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" class="sheet" viewBox="0 0 %s %s" style="min-width: %spx; max-width: %spx" data-units="%s" role="img" aria-label="layout of %s">`+"\n",
		svgNum(width), svgNum(height), svgNum(minWidth), svgNum(maxWidth), unit, template.HTMLEscapeString(s.Mark))
	b.WriteString(body.String())
	b.WriteString("</svg>")
	return template.HTML(b.String()), minWidth > 1000
}
