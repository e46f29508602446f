package sheet

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/bom"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// This file is the cut-sheet model: what a shop drawing of one connection
// shows, as plain geometry and text. It knows nothing of files: paint.go
// walks it over a Painter, and package dxfout is the painter of DXF.
//
// Every coordinate of the model is a float64 in the job's units (inches
// for us, millimetres for si): the drawing is 1:1 in those units. Angles
// are in degrees, counter-clockwise from +x.
//
// Frames (SPEC §7):
//
//   - member: x from the member end along the member, y from the heel
//     (angles) or one edge (flats) across the connected leg — the job's
//     own frame. The view shows the connected leg (or the flat) from the
//     end to ViewBeyond past the row farthest from the end; the far side
//     of that outline is a break, not a cut.
//   - plate: the rectangle of the job's width centred in y on the bolt
//     group (engine.Plate.YMin..YMax), from its free edge back through the
//     pattern and on ViewBeyond past the row farthest from the free edge.
//     Its datum corner is the free edge at the member frame's YMax side,
//     and the plate frame is the member frame turned half a turn about it:
//     x' = FreeEdge − x, y' = YMax − y. The plate keeps its face (no
//     mirror), the free edge is x' = 0 and every hole has x' > 0, y' > 0.

// ViewBeyond is how far a view runs past the row of holes farthest from
// its datum edge: bom.ViewBeyond, which the bill of material's plate
// length takes too.
func ViewBeyond(pattern units.Length, sys units.System) units.Length {
	return bom.ViewBeyond(pattern, sys)
}

// Layer is the drawing layer an item goes on: one per operation, so that
// CAM can pick.
type Layer int

const (
	LayerContour    Layer = iota // outer contours: cut
	LayerHoles                   // holes and slots: punch or drill
	LayerDimensions              // dimension lines, arrowheads and their text
	LayerReference               // gage lines, heel line, Whitmore section
	LayerNotes                   // view titles, hole schedule, stamps
	LayerTitle                   // title block
	LayerMark                    // a CAM file's piece mark (Part.PaintMarked); never cut
)

var layerNames = [...]string{"contour", "holes", "dimensions", "reference", "notes", "title", "mark"}

// String returns the layer's name in a drawing.
func (l Layer) String() string { return layerNames[l] }

// Layers lists every layer of a cut sheet in drawing order (LayerMark is
// a CAM file's alone).
func Layers() []Layer {
	return []Layer{LayerContour, LayerHoles, LayerDimensions, LayerReference, LayerNotes, LayerTitle}
}

// Points of the sheet are r2.Vec (gonum.org/v1/gonum/spatial/r2), in
// drawing units; the whole program uses that one point type.

// Segment is a straight line on a layer.
type Segment struct {
	A, B  r2.Vec
	Layer Layer
}

// Align is where a text's anchor point sits on the text. Only these
// alignments are offered: DXF writers and readers agree on them (others
// lose the alignment point in github.com/yofu/dxf).
type Align int

const (
	AlignLeftBase Align = iota
	AlignCenterBottom
	AlignCenterMiddle
	AlignCenterTop
	AlignRightBottom
	AlignRightMiddle
	AlignRightTop
)

// Text is one line of text.
type Text struct {
	At       r2.Vec
	Height   float64
	Rotation float64 // degrees
	Align    Align
	Value    string // plain ASCII
	Layer    Layer
}

// charWidth is the width of one character over the text height (the
// height of capitals), taken generously: capitals of a wide sans-serif
// font run to about 0.9. Layout and drawing extents use it, so that text
// does not run into its neighbours.
const charWidth = 0.9

// Box returns the corners of a generous rectangle around the text.
func (t Text) Box() (lo, hi r2.Vec) {
	w := float64(len(t.Value)) * charWidth * t.Height
	h := t.Height
	var x0, y0 float64 // lower-left corner relative to the anchor, unrotated
	switch t.Align {
	case AlignCenterBottom, AlignCenterMiddle, AlignCenterTop:
		x0 = -w / 2
	case AlignRightBottom, AlignRightMiddle, AlignRightTop:
		x0 = -w
	}
	switch t.Align {
	case AlignLeftBase:
		y0 = -0.3 * h // descenders
	case AlignCenterMiddle, AlignRightMiddle:
		y0 = -h / 2
	case AlignCenterTop, AlignRightTop:
		y0 = -h
	}
	h += 0.3 * h
	s, c := math.Sincos(t.Rotation * math.Pi / 180)
	lo = r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	hi = r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, p := range []r2.Vec{{X: x0, Y: y0}, {X: x0 + w, Y: y0}, {X: x0, Y: y0 + h}, {X: x0 + w, Y: y0 + h}} {
		q := r2.Vec{X: t.At.X + p.X*c - p.Y*s, Y: t.At.Y + p.X*s + p.Y*c}
		lo = r2.Vec{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = r2.Vec{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	return lo, hi
}

// SheetHole is a hole in a part's frame. Dx and Dy are its extents along
// the part's x and y: the diameter of a round hole; a slot's length along
// its long axis and its width across it.
type SheetHole struct {
	ID     string // the job's hole id, H1…
	Centre r2.Vec
	Dx, Dy float64
	Type   rules.HoleType
}

// Round reports whether the hole is drawn as a circle.
func (h SheetHole) Round() bool { return !h.Type.IsSlot() }

// Diameter is the hole's width: the diameter of a round hole, the width
// of a slot.
func (h SheetHole) Diameter() float64 { return min(h.Dx, h.Dy) }

// SlotOutline returns the closed outline of a slot as four vertices and
// the bulge of the segment leaving each: two straight sides and two
// half-circle ends (bulge 1, counter-clockwise).
func (h SheetHole) SlotOutline() ([]r2.Vec, []float64) {
	c := h.Centre
	r := h.Diameter() / 2
	if h.Dy >= h.Dx { // long axis along y
		a := h.Dy/2 - r
		return []r2.Vec{{X: c.X + r, Y: c.Y - a}, {X: c.X + r, Y: c.Y + a}, {X: c.X - r, Y: c.Y + a}, {X: c.X - r, Y: c.Y - a}},
			[]float64{0, 1, 0, 1}
	}
	a := h.Dx/2 - r
	return []r2.Vec{{X: c.X - a, Y: c.Y - r}, {X: c.X + a, Y: c.Y - r}, {X: c.X + a, Y: c.Y + r}, {X: c.X - a, Y: c.Y + r}},
		[]float64{0, 1, 0, 1}
}

// Part is one piece to cut: its closed outer contour and its holes, in the
// part's frame (datum at the origin). A CAM file holds exactly this.
type Part struct {
	Name      string // "member" or "plate": the CAM file is MARK-NAME.cam.dxf
	Contour   []r2.Vec
	Holes     []SheetHole
	Thickness float64
	Pieces    int // pieces of this part per assembly (2 for a double angle)
	// Label names the piece for a CAM file's mark layer (PaintMarked):
	// piece mark, quantity, grade and thickness, from the bill of
	// material; "" without one.
	Label string
}

// Bounds returns the corners of the part's contour.
func (p *Part) Bounds() (lo, hi r2.Vec) {
	lo = r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	hi = r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, q := range p.Contour {
		lo = r2.Vec{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = r2.Vec{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	return lo, hi
}

// Axis is what a dimension measures.
type Axis int

const (
	AlongX Axis = iota // horizontal dimension line
	AlongY             // vertical dimension line
)

// Dimension is a linear dimension between two feature points, drawn as
// extension lines, a dimension line at Offset (y for AlongX, x for
// AlongY), two arrowheads and the text.
type Dimension struct {
	A, B   r2.Vec
	Axis   Axis
	Offset float64
	Text   string
}

// View is a part placed on the cut sheet with its annotation. Everything
// in it is in the part's frame; Origin places that frame on the sheet.
type View struct {
	Part   Part
	Origin r2.Vec
	Lines  []Segment
	Dims   []Dimension
	Texts  []Text
	// Break, when not nil, leaves a stretch of the part out of the
	// drawing (member.go); nil draws the part whole.
	Break *Break
}

// Sheet is the cut sheet of one connection mark.
type Sheet struct {
	Mark  string
	Units units.System
	// NotForFabrication: every view is stamped so, and no CAM file is made.
	NotForFabrication bool
	TextHeight        float64 // of dimension text; arrowheads scale with it
	Views             []View
	// Schedule is the hole schedule as data: a header row, then one row
	// per part (part, count, hole, type, made by).
	Schedule [][]string
	// BillOfMaterial and BoltList are the two tables of bom.go as data (a
	// header row, then a row per piece or bolt set); nil without
	// member.length.
	BillOfMaterial, BoltList [][]string
	// Title is the title block as data: label and value, in order.
	Title [][2]string
	Lines []Segment // in the sheet's frame: the title block's rules
	Texts []Text    // in the sheet's frame: schedule, title block
	// Stamp is the job's run stamp (Job.Stamp), written as a comment into
	// every file drawn from the sheet; "" for none.
	Stamp string
}

// runText is the title block's MADE BY: the build and the input file's
// SHA-256 (its first 16 digits; the whole in the DXF's comment) of the
// job's run stamp, "" without one.
func runText(stamp string) string {
	tool, rest, ok := strings.Cut(stamp, "; ")
	if !ok {
		return ""
	}
	_, sha, _ := strings.Cut(rest, "input sha256 ")
	if len(sha) > 16 {
		sha = sha[:16]
	}
	return tool + ", input sha256 " + sha
}

// Stamp is written on every view of a sheet not for fabrication.
const Stamp = "NOT FOR FABRICATION"

// ErrRefused is returned for a failing connection unless the sheet is
// asked for not for fabrication.
var ErrRefused = errors.New("detail: the connection fails; a sheet for fabrication is refused")

// NewSheet lays out the cut sheet of a checked design: the whole member
// (member.length is required: an *InputError without it) and the plate. A
// connection that fails is refused (ErrRefused) unless notForFabrication,
// which stamps every view.
func NewSheet(r *detail.Report, notForFabrication bool) (*Sheet, error) {
	if err := RequireLength(r.Design.Job); err != nil {
		return nil, err
	}
	return newSheet(r, notForFabrication)
}

// NewDrawing is NewSheet for a drawing that is not the shop's (the
// calculation report's): without member.length its member view is the
// connection end alone, as far as the holes and ViewBeyond, broken off.
func NewDrawing(r *detail.Report, notForFabrication bool) (*Sheet, error) {
	return newSheet(r, notForFabrication)
}

func newSheet(r *detail.Report, notForFabrication bool) (*Sheet, error) {
	if !r.Pass && !notForFabrication {
		return nil, ErrRefused
	}
	d := r.Design
	sys := d.Job.Units
	s := &Sheet{Mark: d.Job.Mark, Units: sys, NotForFabrication: notForFabrication, TextHeight: textHeight(sys),
		Stamp: d.Job.Stamp}
	l := sheetLayout{sys: sys, h: s.TextHeight}

	member := l.member(r)
	views := []View{member}
	if d.Conn.Plate != nil {
		views = append(views, l.plateView(d))
	}
	if far := l.farPlateView(r); far != nil {
		views = append(views, *far)
	}
	// Side by side, bottoms of the parts level, a gap of 8 text heights
	// between one view's annotation and the next's.
	x := 0.0
	var bottom float64
	for i := range views {
		v := &views[i]
		if notForFabrication {
			// Above the view's title, clear of every hole and dimension.
			_, top := v.extents()
			_, phi := v.Part.Bounds()
			phi = v.Fold(phi)
			v.Texts = append(v.Texts, Text{At: r2.Vec{X: phi.X / 2, Y: top.Y + s.TextHeight}, Height: 2 * s.TextHeight,
				Align: AlignCenterBottom, Value: Stamp, Layer: LayerNotes})
		}
		lo, hi := v.extents()
		v.Origin = r2.Vec{X: x - lo.X, Y: 0}
		x += hi.X - lo.X + 8*s.TextHeight
		bottom = min(bottom, lo.Y)
	}
	s.Views = views
	top := bottom - 4*s.TextHeight
	top = l.schedule(s, r, top)
	top = l.billOfMaterial(s, r, top)
	l.titleBlock(s, r, top-3*s.TextHeight)
	for i := range s.Texts {
		s.Texts[i].Value = ascii(s.Texts[i].Value)
	}
	for i := range s.Views {
		v := &s.Views[i]
		for k := range v.Texts {
			v.Texts[k].Value = ascii(v.Texts[k].Value)
		}
		for k := range v.Dims {
			v.Dims[k].Text = ascii(v.Dims[k].Text)
		}
	}
	return s, nil
}

// textHeight is the height of dimension text: 1/4 in (6 mm), so that a
// sheet printed to fit a tabloid page still reads.
func textHeight(sys units.System) float64 {
	if sys == units.SI {
		return 6
	}
	return 0.25
}

// extents returns the corners of everything in the view, in its frame.
func (v *View) extents() (lo, hi r2.Vec) {
	lo, hi = v.Part.Bounds()
	lo, hi = v.Fold(lo), v.Fold(hi)
	grow := func(p r2.Vec) {
		p = v.Fold(p)
		lo = r2.Vec{X: min(lo.X, p.X), Y: min(lo.Y, p.Y)}
		hi = r2.Vec{X: max(hi.X, p.X), Y: max(hi.Y, p.Y)}
	}
	for _, s := range v.Lines {
		grow(s.A)
		grow(s.B)
	}
	for _, t := range v.Texts {
		a, b := t.Box()
		grow(a)
		grow(b)
	}
	for _, d := range v.Dims {
		grow(d.A)
		grow(d.B)
		for _, t := range DimensionText(d, 1) {
			a, b := t.Box()
			grow(a)
			grow(b)
		}
		if d.Axis == AlongX {
			grow(r2.Vec{X: d.A.X, Y: d.Offset})
		} else {
			grow(r2.Vec{X: d.Offset, Y: d.A.Y})
		}
	}
	return lo, hi
}

// DimensionGraphics is a dimension laid out for text height h, for a
// renderer to draw in this order: Lines (the extension lines, from just off
// the feature points to a little past the dimension line, then the
// dimension line), Arrows (closed triangles, inside the span or outside
// when it is short), Leaders (the short lines beyond outside arrows) and
// Texts.
type DimensionGraphics struct {
	Lines, Leaders []Segment
	Arrows         [][3]r2.Vec
	Texts          []Text
}

// Graphics lays the dimension out for text height h.
func (d Dimension) Graphics(h float64) DimensionGraphics {
	gap, over, n := h/4, h/2, 0.8*h
	var g DimensionGraphics
	seg := func(a, b r2.Vec) Segment { return Segment{A: a, B: b, Layer: LayerDimensions} }
	ext := func(f, to r2.Vec) {
		dx, dy := to.X-f.X, to.Y-f.Y
		l := math.Hypot(dx, dy)
		if l < gap {
			return
		}
		ux, uy := dx/l, dy/l
		g.Lines = append(g.Lines, seg(r2.Vec{X: f.X + ux*gap, Y: f.Y + uy*gap}, r2.Vec{X: to.X + ux*over, Y: to.Y + uy*over}))
	}
	// u is along the dimension line, from A to B.
	var a, b, u r2.Vec
	var span float64
	if d.Axis == AlongX {
		a, b = r2.Vec{X: d.A.X, Y: d.Offset}, r2.Vec{X: d.B.X, Y: d.Offset}
		span = b.X - a.X
		u = r2.Vec{X: math.Copysign(1, span)}
	} else {
		a, b = r2.Vec{X: d.Offset, Y: d.A.Y}, r2.Vec{X: d.Offset, Y: d.B.Y}
		span = b.Y - a.Y
		u = r2.Vec{Y: math.Copysign(1, span)}
	}
	ext(d.A, a)
	ext(d.B, b)
	g.Lines = append(g.Lines, seg(a, b))
	neg := r2.Vec{X: -u.X, Y: -u.Y}
	arrow := func(tip, dir r2.Vec) {
		back := r2.Vec{X: tip.X - dir.X*n, Y: tip.Y - dir.Y*n}
		side := r2.Vec{X: -dir.Y * n / 6, Y: dir.X * n / 6}
		g.Arrows = append(g.Arrows, [3]r2.Vec{tip, r2.Add(back, side), {X: back.X - side.X, Y: back.Y - side.Y}})
	}
	if math.Abs(span) >= 2.5*n {
		arrow(a, neg)
		arrow(b, u)
	} else {
		arrow(a, u)
		arrow(b, neg)
		g.Leaders = append(g.Leaders, seg(a, r2.Vec{X: a.X - u.X*2*n, Y: a.Y - u.Y*2*n}), seg(b, r2.Vec{X: b.X + u.X*2*n, Y: b.Y + u.Y*2*n}))
	}
	g.Texts = DimensionText(d, h)
	return g
}

// DimensionText returns the text of a dimension of text height h: centred
// on its dimension line, above a horizontal line and left of a vertical
// one (reading upward).
func DimensionText(d Dimension, h float64) []Text {
	if d.Axis == AlongX {
		return []Text{{At: r2.Vec{X: (d.A.X + d.B.X) / 2, Y: d.Offset + h/3}, Height: h, Align: AlignCenterBottom,
			Value: d.Text, Layer: LayerDimensions}}
	}
	return []Text{{At: r2.Vec{X: d.Offset - h/3, Y: (d.A.Y + d.B.Y) / 2}, Height: h, Rotation: 90, Align: AlignCenterBottom,
		Value: d.Text, Layer: LayerDimensions}}
}

type sheetLayout struct {
	sys units.System
	h   float64
}

// len converts an internal length to drawing units, rounded to 1e-9 so
// that lengths on the job's own grid are written as such (19.5, not
// 19.4999999999999964); far below any tolerance.
func (l sheetLayout) len(v units.Length) float64 {
	return math.Round(l.sys.ToJob(float64(v), units.DimLength)*1e9) / 1e9
}

// people writes a length as a detailer reads it.
func (l sheetLayout) people(v float64) string {
	return units.FormatLength(units.Length(l.sys.FromJob(v, units.DimLength)), l.sys, units.Shop)
}

// limit writes a length the shop compares with a limit (a thickness, the
// punch limit) as people does, with the exact value after it where the
// rounding to 1/16 in (1 mm) changed it: 7/8" (0.9 in).
func (l sheetLayout) limit(v float64) string {
	return units.FormatLength(units.Length(l.sys.FromJob(v, units.DimLength)), l.sys, units.Shop.WithExact())
}

func (l sheetLayout) rect(w, h float64) []r2.Vec {
	return []r2.Vec{{X: 0, Y: 0}, {X: w, Y: 0}, {X: w, Y: h}, {X: 0, Y: h}}
}

// patternX returns the least and greatest hole x of the connection.
func patternX(hs []engine.Hole) (lo, hi units.Length) {
	lo, hi = hs[0].X, hs[0].X
	for _, h := range hs {
		lo, hi = min(lo, h.X), max(hi, h.X)
	}
	return lo, hi
}

func (l sheetLayout) memberView(d *detail.Design) View {
	c := &d.Conn
	m := c.Member
	xlo, xhi := patternX(c.Holes)
	length := l.len(xhi + ViewBeyond(xhi-xlo, l.sys))
	width := l.len(m.Width)
	p := Part{Name: "member", Contour: l.rect(length, width), Thickness: l.len(m.T), Pieces: m.Pieces}
	for _, h := range c.Holes {
		p.Holes = append(p.Holes, SheetHole{ID: h.ID, Centre: r2.Vec{X: l.len(h.X), Y: l.len(h.Y)}, Dx: l.len(h.Dx), Dy: l.len(h.Dy), Type: h.Type})
	}
	v := View{Part: p}
	l.annotate(&v, false)
	h := l.h
	title := "MEMBER " + d.Info.Designation + " " + d.Info.Grade
	switch {
	case len(m.Junctions) > 0:
		title += " - " + ConnectedElement(&m) + ", CONNECTION END"
	case !m.Heel():
		title += " - CONNECTION END"
	default:
		title += " - CONNECTED LEG, CONNECTION END"
	}
	v.Texts = append(v.Texts, Text{At: r2.Vec{X: length / 2, Y: width + 2*h}, Height: 1.4 * h, Align: AlignCenterBottom, Value: title, Layer: LayerNotes})
	if m.Pieces == 2 {
		v.Texts = append(v.Texts, Text{At: r2.Vec{X: length / 2, Y: width + 0.8*h}, Height: h, Align: AlignCenterBottom,
			Value: PiecesNote(&m), Layer: LayerNotes})
	}
	if len(m.Junctions) > 0 {
		l.junctions(&v, &m, length, length+2.5*h)
	} else if m.Heel() {
		t := l.len(m.T)
		v.Lines = append(v.Lines, Segment{r2.Vec{X: 0, Y: t}, r2.Vec{X: length, Y: t}, LayerReference})
		v.Texts = append(v.Texts,
			Text{At: r2.Vec{X: length + 2.5*h, Y: 0}, Height: h, Align: AlignLeftBase, Value: "HEEL", Layer: LayerNotes},
			Text{At: r2.Vec{X: length + 2.5*h, Y: width - h}, Height: h, Align: AlignLeftBase, Value: "TOE", Layer: LayerNotes})
	}
	// Rotated a quarter turn, the text stands left of its anchor: clear of
	// the edge and of the gage lines' ends.
	v.Texts = append(v.Texts, Text{At: r2.Vec{X: length + 2*h, Y: width / 2}, Height: 0.8 * h, Rotation: 90, Align: AlignCenterBottom,
		Value: "BREAK", Layer: LayerNotes})
	return v
}

func (l sheetLayout) plateView(d *detail.Design) View {
	c := &d.Conn
	pl := c.Plate
	xlo, xhi := patternX(c.Holes)
	length := l.len(pl.FreeEdge - xlo + ViewBeyond(xhi-xlo, l.sys))
	splice := pl.Kind == engine.Splice
	if splice {
		length = l.len(detail.SpliceLength(pl))
	}
	width := l.len(pl.Width)
	fe, ymax := l.len(pl.FreeEdge), l.len(pl.YMax())
	// turn maps the member frame onto the plate frame (half a turn).
	turn := func(x, y float64) r2.Vec { return r2.Vec{X: fe - x, Y: ymax - y} }
	p := Part{Name: "plate", Contour: l.rect(length, width), Thickness: l.len(pl.T), Pieces: pl.Plates()}
	if pl.Outline != nil {
		return l.outlineView(d, p, turn)
	}
	holes := append(c.Holes[:len(c.Holes):len(c.Holes)], engine.SpliceHoles(c)...) // a splice plate: both groups
	for i := range holes {
		h := &holes[i]
		// The plate's own holes; a half turn keeps each hole's extents
		// along the part's x and y.
		hs := h.InPlate()
		p.Holes = append(p.Holes, SheetHole{ID: h.ID, Centre: turn(l.len(h.X), l.len(h.Y)), Dx: l.len(hs.Dx), Dy: l.len(hs.Dy), Type: hs.Type})
	}
	v := View{Part: p}
	l.annotate(&v, true)
	h := l.h

	// Whitmore section as the check takes it: 30° from the first bolt of
	// each outer gage line to the section through the bolt farthest from
	// the free edge, clipped to the plate.
	w := engine.WhitmoreSection(c)
	lo, hi := w.Low, w.High
	far := l.len(w.X)
	ymin := l.len(pl.YMin())
	for _, s := range []Segment{
		{r2.Vec{X: l.len(lo.X0), Y: l.len(lo.Y0)}, r2.Vec{X: l.len(lo.X1), Y: l.len(lo.Y1)}, LayerReference},
		{r2.Vec{X: l.len(hi.X0), Y: l.len(hi.Y0)}, r2.Vec{X: l.len(hi.X1), Y: l.len(hi.Y1)}, LayerReference},
		{r2.Vec{X: far, Y: l.len(lo.Y1)}, r2.Vec{X: far, Y: l.len(hi.Y1)}, LayerReference},
	} {
		if a, b, ok := clipY(s.A, s.B, ymin, ymax); ok && a != b {
			v.Lines = append(v.Lines, Segment{turn(a.X, a.Y), turn(b.X, b.Y), LayerReference})
		}
	}
	// The label goes past the section, where there are no holes, near the
	// top edge: holes keep at least an edge distance from it.
	sec := fe - far
	if splice { // past the joint: the section runs through A's last bolts
		sec = fe + l.len(pl.Gap)
	}
	v.Texts = append(v.Texts, Text{At: r2.Vec{X: sec + h/2, Y: width - 1.5*h}, Height: h, Align: AlignLeftBase,
		Value: "WHITMORE Lw = " + l.people(l.len(w.Lw)), Layer: LayerReference})

	title := fmt.Sprintf("PLATE %s x %s x %s %s %s - FREE EDGE AT LEFT", l.people(p.Thickness), l.people(width), l.people(length),
		d.Info.PlateGrade, strings.ToUpper(pl.Kind.String()))
	if splice {
		title = l.spliceJoint(&v, d, fe)
	}
	v.Texts = append(v.Texts,
		Text{At: r2.Vec{X: length / 2, Y: width + 2*h}, Height: 1.4 * h, Align: AlignCenterBottom, Value: title, Layer: LayerNotes})
	return v
}

// outlineView is the plate view of a plate with an outline (the job's, or
// the rectangle plate.length closes): its contour is the outline, turned
// into the plate's frame; the datum is the corner of the outline's
// extents at the free edge (x' = 0, y' = 0), from which the dimensions
// run; the Whitmore section is drawn clipped by the outline, and a job's
// own outline lists its corners from the datum.
func (l sheetLayout) outlineView(d *detail.Design, p Part, turn func(x, y float64) r2.Vec) View {
	c := &d.Conn
	pl := c.Plate
	p.Contour = nil
	for _, q := range pl.Outline {
		p.Contour = append(p.Contour, turn(l.len(units.Length(q.X)), l.len(units.Length(q.Y))))
	}
	for i := range c.Holes {
		h := &c.Holes[i]
		hs := h.InPlate()
		p.Holes = append(p.Holes, SheetHole{ID: h.ID, Centre: turn(l.len(h.X), l.len(h.Y)), Dx: l.len(hs.Dx), Dy: l.len(hs.Dy), Type: hs.Type})
	}
	v := View{Part: p}
	l.annotate(&v, true)
	h := l.h
	_, hi := p.Bounds()
	length, width := hi.X, hi.Y

	// Whitmore section as the check takes it, clipped by the outline.
	w := engine.WhitmoreSection(c)
	mm := func(x, y units.Length) r2.Vec { return r2.Vec{X: float64(x), Y: float64(y)} }
	for _, s := range [][2]r2.Vec{
		{mm(w.Low.X0, w.Low.Y0), mm(w.Low.X1, w.Low.Y1)},
		{mm(w.High.X0, w.High.Y0), mm(w.High.X1, w.High.Y1)},
		{mm(w.X, w.Low.Y1), mm(w.X, w.High.Y1)},
	} {
		for _, in := range pl.ClipToOutline(s[0], s[1]) {
			a, b := in[0], in[1]
			v.Lines = append(v.Lines, Segment{turn(l.len(units.Length(a.X)), l.len(units.Length(a.Y))),
				turn(l.len(units.Length(b.X)), l.len(units.Length(b.Y))), LayerReference})
		}
	}
	// As on the rectangle: past the section, near the top edge.
	sec := l.len(pl.FreeEdge) - l.len(w.X)
	v.Texts = append(v.Texts, Text{At: r2.Vec{X: sec + h/2, Y: width - 1.5*h}, Height: h, Align: AlignLeftBase,
		Value: "WHITMORE Lw = " + l.people(l.len(w.Lw)), Layer: LayerReference})

	shape := "OUTLINE"
	if ps := d.Job.Plate; ps == nil || ps.Outline == nil {
		shape = "RECTANGLE"
	} else {
		// The corners from the datum, for the shop to lay out and QA to
		// check: right of the view, top down.
		at := r2.Vec{X: length + 3*h, Y: width}
		v.Texts = append(v.Texts, Text{At: at, Height: h, Align: AlignLeftBase, Value: "CORNERS FROM DATUM (X', Y'):", Layer: LayerNotes})
		for i, q := range p.Contour {
			at.Y -= 1.6 * h
			v.Texts = append(v.Texts, Text{At: at, Height: h, Align: AlignLeftBase,
				Value: fmt.Sprintf("%d: %s, %s", i, l.people(q.X), l.people(q.Y)), Layer: LayerNotes})
		}
	}
	title := fmt.Sprintf("PLATE %s x %s x %s %s %s %s - FREE EDGE AT LEFT, DATUM AT LOWER LEFT", l.people(p.Thickness), l.people(width), l.people(length),
		d.Info.PlateGrade, strings.ToUpper(pl.Kind.String()), shape)
	v.Texts = append(v.Texts,
		Text{At: r2.Vec{X: length / 2, Y: width + 2*h}, Height: 1.4 * h, Align: AlignCenterBottom, Value: title, Layer: LayerNotes})
	return v
}

// clipY clips the segment a–b to lo ≤ y ≤ hi.
func clipY(a, b r2.Vec, lo, hi float64) (r2.Vec, r2.Vec, bool) {
	t0, t1 := 0.0, 1.0
	dy := b.Y - a.Y
	for _, e := range [][2]float64{{-dy, a.Y - lo}, {dy, hi - a.Y}} {
		p, q := e[0], e[1]
		if p == 0 {
			if q < 0 {
				return a, b, false
			}
			continue
		}
		r := q / p
		if p < 0 {
			t0 = max(t0, r)
		} else {
			t1 = min(t1, r)
		}
	}
	if t0 >= t1 {
		return a, b, false
	}
	at := func(t float64) r2.Vec { return r2.Vec{X: a.X + t*(b.X-a.X), Y: a.Y + t*dy} }
	return at(t0), at(t1), true
}

// distinct returns the sorted values, those within 1e-9 of the previous
// one dropped.
func distinct(vs []float64) []float64 {
	vs = slices.Clone(vs)
	slices.Sort(vs)
	var out []float64
	for _, v := range vs {
		if len(out) == 0 || v-out[len(out)-1] > 1e-9 {
			out = append(out, v)
		}
	}
	return out
}

// annotate adds the dimensions and gage lines of a view: below the part, a
// chain from the datum edge (x = 0) through every row of holes, then one
// baseline dimension per further row from the datum; left of the part,
// the chain from y = 0 through every gage line to the far edge, then the
// baselines. The plate also gets its overall length.
func (l sheetLayout) annotate(v *View, overallX bool) {
	h := l.h
	_, hi := v.Part.Bounds()
	var xs, ys []float64
	for _, hole := range v.Part.Holes {
		xs = append(xs, hole.Centre.X)
		ys = append(ys, hole.Centre.Y)
	}
	xs, ys = distinct(xs), distinct(ys)

	// Along x: the chain, then baselines row by row.
	row := -3 * h
	prev := 0.0
	for _, x := range xs {
		v.Dims = append(v.Dims, l.dimX(prev, x, row))
		prev = x
	}
	for _, x := range xs[1:] {
		row -= 2.5 * h
		v.Dims = append(v.Dims, l.dimX(0, x, row))
	}
	if overallX {
		row -= 2.5 * h
		v.Dims = append(v.Dims, l.dimX(0, hi.X, row))
	}

	// Along y: the chain to the far edge, then baselines column by column.
	col := -3 * h
	prev = 0
	for _, y := range append(ys, hi.Y) {
		v.Dims = append(v.Dims, l.dimY(prev, y, col))
		prev = y
	}
	for _, y := range append(ys[1:], hi.Y) {
		col -= 2.5 * h
		v.Dims = append(v.Dims, l.dimY(0, y, col))
	}

	// Gage lines, a little past the part each way.
	for _, y := range ys {
		v.Lines = append(v.Lines, Segment{r2.Vec{X: -h, Y: y}, r2.Vec{X: hi.X + h/2, Y: y}, LayerReference})
	}
}

func (l sheetLayout) dimX(a, b, at float64) Dimension {
	return Dimension{A: r2.Vec{X: a, Y: 0}, B: r2.Vec{X: b, Y: 0}, Axis: AlongX, Offset: at, Text: l.people(b - a)}
}

func (l sheetLayout) dimY(a, b, at float64) Dimension {
	return Dimension{A: r2.Vec{X: 0, Y: a}, B: r2.Vec{X: 0, Y: b}, Axis: AlongY, Offset: at, Text: l.people(b - a)}
}

// PunchLimit is the thickest material punched full size for a bolt of
// diameter d: d + 1/8 in (d + 3 mm). Common practice, no source; thicker
// material is drilled (or sub-punched and reamed).
func PunchLimit(d units.Length, sys units.System) units.Length {
	if sys == units.SI {
		return d + 3*units.Millimetre
	}
	return d + units.Inch/8
}

// HowMade is "PUNCH" or "DRILL" for holes through material t thick.
func HowMade(t, d units.Length, sys units.System) string {
	if t <= PunchLimit(d, sys)+eps {
		return "PUNCH"
	}
	return "DRILL"
}

// holeText names a hole's size: 13/16" DIA; 22 x 26 SLOT.
func (l sheetLayout) holeText(h engine.HoleShape) string {
	w := l.people(l.len(min(h.Dx, h.Dy)))
	if !h.Type.IsSlot() {
		return w + " DIA"
	}
	return w + " x " + l.people(l.len(max(h.Dx, h.Dy))) + " SLOT " + strings.ToUpper(h.Slot.String())
}

// ConnectedElement is what the member view shows of a rolled section:
// "FLANGE", "FLANGES" or "WEB".
func ConnectedElement(m *engine.Member) string { return strings.ToUpper(m.ConnectedElement()) }

// PiecesNote is the note over the view of a member of two pieces.
func PiecesNote(m *engine.Member) string {
	if engine.Apart(m.Shape) {
		return "BOTH " + strings.ToUpper(engine.PieceName(m.Shape)) + "S DRILLED ALIKE, SEEN FROM OUTSIDE"
	}
	return "2 " + strings.ToUpper(engine.PieceName(m.Shape)) + "S BACK TO BACK: MAKE 1 AS SHOWN AND 1 OPPOSITE HAND"
}

// junctions draws, for reference, the faces of the elements standing on
// the connected element (a stem, a web, a channel's flanges) and names
// each at x = label.
func (l sheetLayout) junctions(v *View, m *engine.Member, length, label float64) {
	h := l.h
	for _, j := range m.Junctions {
		faces := []units.Length{j.At - j.Face, j.At + j.Face}
		switch j.Side {
		case 1:
			faces = []units.Length{j.At + j.Face}
		case -1:
			faces = []units.Length{j.At - j.Face}
		}
		for _, y := range faces {
			v.Lines = append(v.Lines, Segment{r2.Vec{X: 0, Y: l.len(y)}, r2.Vec{X: length, Y: l.len(y)}, LayerReference})
		}
		y := l.len(j.At) - h/2
		switch j.Side {
		case 1:
			y = l.len(j.At)
		case -1:
			y = l.len(j.At) - h
		}
		v.Texts = append(v.Texts, Text{At: r2.Vec{X: label, Y: y}, Height: h, Align: AlignLeftBase, Value: strings.ToUpper(j.Name), Layer: LayerNotes})
	}
}

// schedule writes the hole schedule from the given top down and returns
// the y below it.
func (l sheetLayout) schedule(s *Sheet, r *detail.Report, top float64) float64 {
	d := r.Design
	c := &d.Conn
	hole, plate := c.Holes[0].HoleShape, c.Holes[0].InPlate() // each ply's holes are all alike in a design
	limit := l.limit(l.len(PunchLimit(c.Bolt.D, l.sys)))
	made := func(t units.Length) string {
		return fmt.Sprintf("%s (t %s, punch limit %s)", HowMade(t, c.Bolt.D, l.sys), l.limit(l.len(t)), limit)
	}
	part := "MEMBER"
	switch {
	case engine.Apart(c.Member.Shape):
		part = fmt.Sprintf("MEMBER (EACH %s)", strings.ToUpper(engine.PieceName(c.Member.Shape)))
	case c.Member.Pieces > 1:
		part = fmt.Sprintf("MEMBER (EACH OF %d)", c.Member.Pieces)
	}
	rows := [][]string{
		{"PART", "COUNT", "HOLE", "TYPE", "MADE BY"},
		{part, fmt.Sprint(len(c.Holes)), l.holeText(hole), strings.ToUpper(hole.Type.String()), made(c.Member.T)},
	}
	rows = append(rows[:1], l.memberScheduleRows(s, r, rows[1])...)
	if c.Plate != nil {
		rows = append(rows, l.plateRow(c, l.holeText(plate), strings.ToUpper(plate.Type.String()), made(c.Plate.T)))
	}
	rows = append(rows, l.farPlateRows(r)...)
	s.Schedule = rows
	return l.table(s, "HOLE SCHEDULE", rows, top, nil)
}

// titleBlock writes the title block from the given top down: a framed box
// of labelled fields and the caution line.
func (l sheetLayout) titleBlock(s *Sheet, r *detail.Report, top float64) {
	h := l.h
	d := r.Design
	c := &d.Conn
	j := d.Job
	g := r.GoverningEnd().GoverningResult()
	verdict := "PASS"
	switch {
	case !r.Pass && g.Pass: // a detailing rule fails, not the governing limit state
		verdict = "FAIL: " + strings.Join(r.Failing(), ", ")
	case !r.Pass:
		verdict = "FAIL"
	}
	if r.Far != nil {
		verdict += ", " + strings.ToUpper(r.GoverningEndName()) + " END GOVERNS"
	}
	unitName := "INCHES"
	if l.sys == units.SI {
		unitName = "MILLIMETRES"
	}
	pieces := ""
	if c.Member.Pieces > 1 && !engine.Apart(c.Member.Shape) {
		pieces = fmt.Sprintf(" (%d pieces each)", c.Member.Pieces)
	}
	fields := append(projectFields(s, j), [][2]string{
		{"MARK", j.Mark},
		{"QUANTITY", fmt.Sprintf("%d%s", j.Quantity, pieces)},
		{"MEMBER", d.Info.Designation},
		{"GRADE", "member " + d.Info.Grade},
		{"THICKNESS", "member " + l.limit(l.len(c.Member.T))},
	}...)
	at := len(fields) - 5 // the member's rows: MARK, QUANTITY, MEMBER, GRADE, THICKNESS
	if c.Plate != nil {
		fields[at+3][1] += ", plate " + d.Info.PlateGrade
		fields[at+4][1] += ", plate " + l.limit(l.len(c.Plate.T))
	}
	if b := c.MemberB; b != nil { // a splice's member beyond the joint, of its own section
		fields = slices.Insert(fields, at+3, [2]string{"MEMBER B", fmt.Sprintf("%s %s, %s thick, beyond the splice joint (its own piece)",
			d.InfoB.Designation, d.InfoB.Grade, l.limit(l.len(b.T)))})
	}
	bolts := len(c.Holes)
	if engine.Apart(c.Member.Shape) {
		bolts *= c.Member.Pieces // the holes are one flange's; each flange has them
	}
	fields = append(fields,
		[2]string{"BOLTS", fmt.Sprintf("(%d%s) %s %s, threads %s, %s joint, %s", bolts, boltsEnd(r),
			detail.BoltSize(c.Bolt.D, l.sys), c.Bolt.Grade.Name, c.Bolt.Threads, c.Bolt.Joint, detail.HoleKinds(c))},
	)
	fields = append(fields, farEndFields(r)...)
	if c.Compression > 0 {
		// both cases: a number on the sheet is of one or the other
		force := func(f units.Force) string { return units.Format(float64(f), units.DimForce, l.sys, units.People) }
		fields = append(fields, [2]string{"LOAD CASES", fmt.Sprintf("TENSION %s, COMPRESSION %s (%s)",
			force(c.Demand), force(c.Compression), strings.ToUpper(c.Method.String()))})
	}
	fields = append(fields,
		[2]string{"STANDARD", fmt.Sprintf("AISC %s %s", strings.TrimPrefix(c.Edition.Name(), "aisc"), strings.ToUpper(c.Method.String()))},
		[2]string{"GOVERNING", fmt.Sprintf("%s (%s) ratio %s - %s", g.ID, g.Clause, detail.RatioText(g.Ratio), verdict)},
		[2]string{"UNITS", unitName},
	)
	if s.NotForFabrication {
		fields = append(fields, [2]string{"STATUS", Stamp})
	}
	if run := runText(j.Stamp); run != "" {
		fields = append(fields, [2]string{"MADE BY", run})
	}
	for i := range fields {
		fields[i][1] = ascii(fields[i][1])
	}
	s.Title = fields
	width := 90 * h
	y := top
	var ruleYs []float64
	ruleYs = append(ruleYs, y)
	for _, f := range fields {
		y -= 1.8 * h
		s.Texts = append(s.Texts,
			Text{At: r2.Vec{X: h, Y: y + 0.5*h}, Height: h, Align: AlignLeftBase, Value: f[0], Layer: LayerTitle},
			Text{At: r2.Vec{X: 12 * h, Y: y + 0.5*h}, Height: h, Align: AlignLeftBase, Value: ascii(f[1]), Layer: LayerTitle})
		ruleYs = append(ruleYs, y)
	}
	for _, ln := range wrap(detail.Caution, 100) {
		y -= 1.4 * h
		s.Texts = append(s.Texts, Text{At: r2.Vec{X: h, Y: y + 0.4*h}, Height: 0.8 * h, Align: AlignLeftBase, Value: ascii(ln), Layer: LayerTitle})
	}
	y -= 0.6 * h
	ruleYs = append(ruleYs, y)
	for _, ry := range ruleYs {
		s.Lines = append(s.Lines, Segment{r2.Vec{X: 0, Y: ry}, r2.Vec{X: width, Y: ry}, LayerTitle})
	}
	s.Lines = append(s.Lines,
		Segment{r2.Vec{X: 0, Y: top}, r2.Vec{X: 0, Y: y}, LayerTitle},
		Segment{r2.Vec{X: width, Y: top}, r2.Vec{X: width, Y: y}, LayerTitle},
		Segment{r2.Vec{X: 11 * h, Y: top}, r2.Vec{X: 11 * h, Y: ruleYs[len(fields)]}, LayerTitle})
}

// wrap breaks s into lines of at most n bytes at spaces.
func wrap(s string, n int) []string {
	var out []string
	line := ""
	for _, w := range strings.Fields(s) {
		if line != "" && len(line)+1+len(w) > n {
			out = append(out, line)
			line = ""
		}
		if line != "" {
			line += " "
		}
		line += w
	}
	if line != "" {
		out = append(out, line)
	}
	return out
}

// ascii keeps a text to printable ASCII, the safe set of a DXF R2000 file
// in any code page: a few typographic characters are spelled out, others
// become '?'.
func ascii(s string) string {
	plain := true
	for i := 0; i < len(s) && plain; i++ {
		plain = s[i] >= 0x20 && s[i] < 0x7f
	}
	if plain { // most texts: nothing to spell out, no copy
		return s
	}
	var b strings.Builder
	b.Grow(len(s))
	for _, r := range s {
		switch {
		case r == '×':
			b.WriteByte('x')
		case r == '–' || r == '—' || r == '−':
			b.WriteByte('-')
		case r == '°':
			b.WriteString(" deg")
		case r == '·':
			b.WriteByte('.')
		case r >= 0x20 && r < 0x7f:
			b.WriteRune(r)
		default:
			b.WriteByte('?')
		}
	}
	return b.String()
}
