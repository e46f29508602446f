package calc

import (
	"fmt"
	"gaugeline/detail/sheet"
	"html/template"
	"math"
	"slices"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"
)

// This file draws the views of a cut sheet (sheet.Sheet, the model the
// DXF is drawn from) as one inline SVG, through the sheet's one walk
// (Sheet.PaintView) with svgPainter as its back end: what is drawn, in
// which order (the SVG's document order, so the reference lines lie over
// the holes) and how far it reaches is the walk's, as in the DXF. The
// SVG's user unit is the sheet's drawing unit (inches for us, millimetres
// for si), so the browser scales the drawing to fit through the viewBox
// alone.
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
// reader can match the drawing to the job without undoing the transform;
// the walk tells the painter which hole it draws (sheet.HoleMarker).

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

// svgPainter is the sheet.Painter of one view of the report's SVG: it
// writes each item it is handed as an element whose class is its layer
// (a closed outline of the dimensions layer is an "arrow", a text that is
// the stamp is also a "stamp"), in the order it is handed. It is also a
// sheet.HoleMarker: a hole carries its data and a title, and a slot gets
// a small mark at its centre, for a reader checking positions.
type svgPainter struct {
	b    strings.Builder
	hole *svgHole // the hole the next Circle or ClosedPolyline draws, if any
}

// svgHole is a hole as BeginHole announced it.
type svgHole struct {
	part string
	h    sheet.SheetHole
	at   r2.Vec // its centre on the drawing
}

// pt writes a point flipped to SVG's y-down sense.
func pt(q r2.Vec) string { return svgNum(q.X) + "," + svgNum(-q.Y) }

// Layers declares nothing: the SVG's layers are its classes.
func (p *svgPainter) Layers([]sheet.Layer) {}

func (p *svgPainter) BeginHole(part string, h sheet.SheetHole, at r2.Vec) {
	p.hole = &svgHole{part: part, h: h, at: at}
}

// takeHole returns the hole an item on layer l draws, nil for none.
func (p *svgPainter) takeHole(l sheet.Layer) *svgHole {
	h := p.hole
	if l != sheet.LayerHoles {
		return nil
	}
	p.hole = nil
	return h
}

// data writes a hole's attributes: its part, id, centre and extents in the
// part's frame, in the job's units, at full precision.
func (h *svgHole) data() string {
	return fmt.Sprintf(`data-part="%s" data-hole="%s" data-x="%s" data-y="%s" data-dx="%s" data-dy="%s"`,
		template.HTMLEscapeString(h.part), template.HTMLEscapeString(h.h.ID),
		exact(h.h.Centre.X), exact(h.h.Centre.Y), exact(h.h.Dx), exact(h.h.Dy))
}

func (p *svgPainter) Line(a, b r2.Vec, l sheet.Layer) {
	fmt.Fprintf(&p.b, `<line class="%s" x1="%s" y1="%s" x2="%s" y2="%s"/>`+"\n",
		l, svgNum(a.X), svgNum(-a.Y), svgNum(b.X), svgNum(-b.Y))
}

func (p *svgPainter) Circle(c r2.Vec, r float64, l sheet.Layer) {
	if h := p.takeHole(l); h != nil {
		fmt.Fprintf(&p.b, `<circle class="hole" cx="%s" cy="%s" r="%s" %s><title>%s</title></circle>`+"\n",
			svgNum(c.X), svgNum(-c.Y), svgNum(r), h.data(), template.HTMLEscapeString(h.h.ID))
		return
	}
	fmt.Fprintf(&p.b, `<circle class="%s" cx="%s" cy="%s" r="%s"/>`+"\n", l, svgNum(c.X), svgNum(-c.Y), svgNum(r))
}

// ClosedPolyline writes an outline of straight sides as a polygon, one
// with arcs as a path; a hole's path carries its data and is followed by
// the mark at its centre.
func (p *svgPainter) ClosedPolyline(pts []r2.Vec, bulges []float64, l sheet.Layer) {
	h := p.takeHole(l)
	if h == nil && !slices.ContainsFunc(bulges, func(b float64) bool { return b != 0 }) {
		class := l.String()
		if l == sheet.LayerDimensions {
			class = "arrow"
		}
		s := make([]string, len(pts))
		for i, q := range pts {
			s[i] = pt(q)
		}
		fmt.Fprintf(&p.b, `<polygon class="%s" points="%s"/>`+"\n", class, strings.Join(s, " "))
		return
	}
	d := outlinePath(pts, bulges)
	if h == nil {
		fmt.Fprintf(&p.b, `<path class="%s" d="%s"/>`+"\n", l, d)
		return
	}
	fmt.Fprintf(&p.b, `<path class="hole slot" d="%s" %s><title>%s</title></path>`+"\n",
		d, h.data(), template.HTMLEscapeString(h.h.ID))
	fmt.Fprintf(&p.b, `<circle class="slot-centre" cx="%s" cy="%s" r="%s"/>`+"\n",
		svgNum(h.at.X), svgNum(-h.at.Y), svgNum(h.h.Diameter()/10))
}

// outlinePath writes a closed outline as path data: a side of bulge b is
// an arc of included angle 4·atan(b) (the Painter's convention), radius
// chord / (2 sin(angle/2)). The flip to y down keeps the picture's sense,
// so a counter-clockwise arc (b > 0) has sweep flag 0.
func outlinePath(pts []r2.Vec, bulges []float64) string {
	var d strings.Builder
	d.WriteString("M" + pt(pts[0]))
	for i, q := range pts {
		next := pts[(i+1)%len(pts)]
		if bulges == nil || bulges[i] == 0 {
			d.WriteString(" L" + pt(next))
			continue
		}
		theta := 4 * math.Atan(bulges[i])
		r := svgNum(math.Hypot(next.X-q.X, next.Y-q.Y) / 2 / math.Abs(math.Sin(theta/2)))
		large, sweep := "0", "0"
		if math.Abs(theta) > math.Pi {
			large = "1"
		}
		if theta < 0 {
			sweep = "1"
		}
		d.WriteString(" A" + r + "," + r + " 0 " + large + " " + sweep + " " + pt(next))
	}
	d.WriteString(" Z")
	return d.String()
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

func (p *svgPainter) Text(t sheet.Text) {
	class := t.Layer.String()
	if t.Value == sheet.Stamp {
		class += " stamp"
	}
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
		var p svgPainter
		lo, hi := s.PaintView(&p, i, r2.Vec{})
		tx, ty := margin-lo.X, cursor+hi.Y
		fmt.Fprintf(&body, `<g class="view" data-part="%s" transform="translate(%s %s)">`+"\n%s</g>\n",
			template.HTMLEscapeString(v.Part.Name), svgNum(tx), svgNum(ty), p.b.String())
		width = max(width, hi.X-lo.X+2*margin)
		cursor = ty - lo.Y + gap
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
