package dxfout

import (
	"bytes"
	"fmt"
	"slices"
	"strings"
	"sync"

	"github.com/yofu/dxf/block"
	"github.com/yofu/dxf/color"
	"github.com/yofu/dxf/drawing"
	"github.com/yofu/dxf/entity"
	"github.com/yofu/dxf/format"
	"github.com/yofu/dxf/object"
	"github.com/yofu/dxf/table"

	"gaugeline/detail"
	"gaugeline/rules/units"
)

// mu serialises every use of github.com/yofu/dxf: its default layer, line
// types and text style are package-level and get handles and heights
// written into them while a drawing is built and written.
var mu sync.Mutex

// File is one DXF file to write: its name (no directory) and content.
type File struct {
	Name string
	Data []byte
}

// Files draws the cut sheet MARK.dxf and, unless the sheet is not for
// fabrication, the CAM file MARK-PART.cam.dxf of each part, in that order.
func Files(s *detail.Sheet) ([]File, error) {
	b, err := Sheet(s)
	if err != nil {
		return nil, err
	}
	out := []File{{s.Mark + ".dxf", Comment(b, s.Stamp)}}
	if s.NotForFabrication {
		return out, nil
	}
	for i := range s.Views {
		p := &s.Views[i].Part
		b, err := CAM(p, s.Units)
		if err != nil {
			return nil, err
		}
		out = append(out, File{s.Mark + "-" + p.Name + ".cam.dxf", Comment(b, s.Stamp)})
	}
	return out, nil
}

// CommentPrefix starts the DXF comment (group 999) that carries a run
// stamp at the top of every file of a file set.
const CommentPrefix = "gaugeline stamp: "

// Comment puts the stamp in a DXF comment (group code 999, which readers
// skip) before the first section of data; an empty stamp leaves data as
// it is. A stamp is one line: line breaks in it are replaced by blanks.
func Comment(data []byte, stamp string) []byte {
	if stamp == "" {
		return data
	}
	stamp = strings.NewReplacer("\r", " ", "\n", " ").Replace(stamp)
	out := make([]byte, 0, len(data)+len(stamp)+32)
	out = append(out, "999\n"+CommentPrefix+stamp+"\n"...)
	return append(out, data...)
}

// layerColors are the ACI colours of the layers: parts in the foreground
// colour, holes red, dimensions cyan, reference lines grey.
var layerColors = map[detail.Layer]color.ColorNumber{
	detail.LayerContour:    color.White,
	detail.LayerHoles:      color.Red,
	detail.LayerDimensions: color.Cyan,
	detail.LayerReference:  color.Grey128,
	detail.LayerNotes:      color.White,
	detail.LayerTitle:      color.White,
}

// pen draws on a drawing and keeps the extents of what it drew.
type pen struct {
	d      *drawing.Drawing
	at     detail.Point // origin of the current frame on the drawing
	lo, hi detail.Point
	empty  bool
}

func newPen(layers []detail.Layer) (*pen, error) {
	d := drawing.New()
	tidy(d)
	for _, l := range layers {
		if _, err := d.AddLayer(l.String(), layerColors[l], table.LT_CONTINUOUS, false); err != nil {
			return nil, fmt.Errorf("dxfout: %w", err)
		}
	}
	return &pen{d: d, empty: true}, nil
}

func (p *pen) grow(q detail.Point) {
	if p.empty {
		p.lo, p.hi, p.empty = q, q, false
		return
	}
	p.lo = detail.Point{X: min(p.lo.X, q.X), Y: min(p.lo.Y, q.Y)}
	p.hi = detail.Point{X: max(p.hi.X, q.X), Y: max(p.hi.Y, q.Y)}
}

func (p *pen) layer(l detail.Layer) {
	if err := p.d.ChangeLayer(l.String()); err != nil {
		panic("dxfout: " + err.Error()) // every layer is added by newPen
	}
}

func (p *pen) line(a, b detail.Point, l detail.Layer) {
	a, b = a.Add(p.at), b.Add(p.at)
	p.layer(l)
	p.d.Line(a.X, a.Y, 0, b.X, b.Y, 0)
	p.grow(a)
	p.grow(b)
}

// poly draws a closed LWPOLYLINE; bulges may be nil. lo and hi bound it.
func (p *pen) poly(pts []detail.Point, bulges []float64, l detail.Layer, lo, hi detail.Point) {
	p.layer(l)
	vs := make([][]float64, len(pts))
	for i, q := range pts {
		q = q.Add(p.at)
		vs[i] = []float64{q.X, q.Y}
	}
	e, _ := p.d.LwPolyline(true, vs...)
	copy(e.Bulges, bulges)
	p.grow(lo.Add(p.at))
	p.grow(hi.Add(p.at))
}

func (p *pen) contour(pts []detail.Point) {
	lo, hi := bounds(pts)
	p.poly(pts, nil, detail.LayerContour, lo, hi)
}

func (p *pen) hole(h detail.SheetHole) {
	if h.Round() {
		c := h.Centre.Add(p.at)
		r := h.Diameter() / 2
		p.layer(detail.LayerHoles)
		p.d.Circle(c.X, c.Y, 0, r)
		p.grow(detail.Point{X: c.X - r, Y: c.Y - r})
		p.grow(detail.Point{X: c.X + r, Y: c.Y + r})
		return
	}
	pts, bulges := h.SlotOutline()
	half := detail.Point{X: h.Dx / 2, Y: h.Dy / 2}
	p.poly(pts, bulges, detail.LayerHoles, detail.Point{X: h.Centre.X - half.X, Y: h.Centre.Y - half.Y}, h.Centre.Add(half))
}

// aligns maps our alignments onto the library's; all of them write the
// alignment point.
var aligns = map[detail.Align]int{
	detail.AlignLeftBase:     entity.LEFT_BASE,
	detail.AlignCenterBottom: entity.CENTER_BOTTOM,
	detail.AlignCenterMiddle: entity.CENTER_CENTER,
	detail.AlignCenterTop:    entity.CENTER_TOP,
	detail.AlignRightBottom:  entity.RIGHT_BOTTOM,
	detail.AlignRightMiddle:  entity.RIGHT_CENTER,
	detail.AlignRightTop:     entity.RIGHT_TOP,
}

func (p *pen) text(t detail.Text) {
	t.At = t.At.Add(p.at)
	p.layer(t.Layer)
	e, _ := p.d.Text(t.Value, t.At.X, t.At.Y, 0, t.Height)
	e.Rotation = t.Rotation
	e.Anchor(aligns[t.Align])
	lo, hi := t.Box()
	p.grow(lo)
	p.grow(hi)
}

// dimension draws a dimension as the sheet model lays it out.
func (p *pen) dimension(d detail.Dimension, h float64) {
	g := d.Graphics(h)
	for _, l := range g.Lines {
		p.line(l.A, l.B, l.Layer)
	}
	for _, tri := range g.Arrows {
		pts := tri[:]
		lo, hi := bounds(pts)
		p.poly(pts, nil, detail.LayerDimensions, lo, hi)
	}
	for _, l := range g.Leaders {
		p.line(l.A, l.B, l.Layer)
	}
	for _, t := range g.Texts {
		p.text(t)
	}
}

// finish sets the header and writes the drawing.
func (p *pen) finish(sys units.System, textHeight float64) ([]byte, error) {
	h := &header{insunits: 1, measurement: 0}
	if sys == units.SI {
		h.insunits, h.measurement = 4, 1
	}
	h.extmin, h.extmax = p.lo, p.hi
	p.d.Sections[drawing.HEADER] = h
	// The library's default style is shared: pin the height it records.
	table.ST_STANDARD.LastHeightUsed = textHeight
	var buf bytes.Buffer
	if _, err := p.d.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("dxfout: %w", err)
	}
	return buf.Bytes(), nil
}

// Sheet draws the cut sheet: every view at its origin, then the sheet's
// own lines and text.
func Sheet(s *detail.Sheet) ([]byte, error) {
	mu.Lock()
	defer mu.Unlock()
	p, err := newPen(detail.Layers())
	if err != nil {
		return nil, err
	}
	h := s.TextHeight
	for i := range s.Views {
		v := &s.Views[i]
		p.at = v.Origin
		p.contour(v.Part.Contour)
		for _, hole := range v.Part.Holes {
			p.hole(hole)
		}
		for _, l := range v.Lines {
			p.line(l.A, l.B, l.Layer)
		}
		for _, d := range v.Dims {
			p.dimension(d, h)
		}
		for _, t := range v.Texts {
			p.text(t)
		}
	}
	p.at = detail.Point{}
	for _, l := range s.Lines {
		p.line(l.A, l.B, l.Layer)
	}
	for _, t := range s.Texts {
		p.text(t)
	}
	return p.finish(s.Units, h)
}

// CAM draws one part alone in its own frame: the closed contour and the
// holes, nothing else.
func CAM(part *detail.Part, sys units.System) ([]byte, error) {
	mu.Lock()
	defer mu.Unlock()
	p, err := newPen([]detail.Layer{detail.LayerContour, detail.LayerHoles})
	if err != nil {
		return nil, err
	}
	p.contour(part.Contour)
	for _, hole := range part.Holes {
		p.hole(hole)
	}
	return p.finish(sys, 1)
}

func bounds(pts []detail.Point) (lo, hi detail.Point) {
	lo, hi = pts[0], pts[0]
	for _, q := range pts {
		lo = detail.Point{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = detail.Point{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	return lo, hi
}

// header is the HEADER section: the library's lacks $MEASUREMENT, so we
// write our own.
type header struct {
	insunits, measurement int
	extmin, extmax        detail.Point
	handseed              int
}

func (h *header) SetHandle(v *int) { h.handseed = *v }

func (h *header) Format(f format.Formatter) {
	f.WriteString(0, "SECTION")
	f.WriteString(2, "HEADER")
	f.WriteString(9, "$ACADVER")
	f.WriteString(1, "AC1015")
	f.WriteString(9, "$INSBASE")
	for i := range 3 {
		f.WriteFloat((i+1)*10, 0)
	}
	f.WriteString(9, "$INSUNITS")
	f.WriteInt(70, h.insunits)
	f.WriteString(9, "$MEASUREMENT")
	f.WriteInt(70, h.measurement)
	f.WriteString(9, "$LUNITS")
	f.WriteInt(70, 2) // decimal
	f.WriteString(9, "$EXTMIN")
	f.WriteFloat(10, h.extmin.X)
	f.WriteFloat(20, h.extmin.Y)
	f.WriteFloat(30, 0)
	f.WriteString(9, "$EXTMAX")
	f.WriteFloat(10, h.extmax.X)
	f.WriteFloat(20, h.extmax.Y)
	f.WriteFloat(30, 0)
	f.WriteString(9, "$LTSCALE")
	f.WriteFloat(40, 1)
	f.WriteString(9, "$HANDSEED")
	f.WriteHex(5, h.handseed)
	f.WriteString(0, "ENDSEC")
}

// tidy removes what an independent audit (ezdxf) would repair in the
// library's skeleton: a second paper space block (*Paper_Space0) with no
// layout, and dictionaries without their owner (the root's is handle 0,
// the group dictionary's the root).
func tidy(d *drawing.Drawing) {
	blocks := d.Sections[drawing.BLOCKS].(block.Blocks)
	d.Sections[drawing.BLOCKS] = slices.DeleteFunc(blocks, func(b *block.Block) bool { return b.Name == "*Paper_Space0" })
	records := d.Sections[drawing.TABLES].(table.Tables)[table.BLOCK_RECORD]
	records.Clear()
	records.Add(table.NewBlockRecord("*Model_Space"))
	records.Add(table.NewBlockRecord("*Paper_Space"))
	objects := d.Sections[drawing.OBJECTS].(object.Objects)
	root := objects[0]
	for i, o := range objects {
		if _, ok := o.(*object.Dictionary); !ok {
			continue
		}
		owner := func() int { return root.Handle() }
		if i == 0 {
			owner = func() int { return 0 }
		}
		objects[i] = owned{o, owner}
	}
}

// owned writes an object with its owner group (330) right after its
// handle (5).
type owned struct {
	object.Object
	owner func() int
}

func (o owned) Format(f format.Formatter) {
	o.Object.Format(&ownerAfterHandle{Formatter: f, owner: o.owner()})
}

type ownerAfterHandle struct {
	format.Formatter
	owner int
	done  bool
}

func (o *ownerAfterHandle) WriteHex(code, h int) {
	o.Formatter.WriteHex(code, h)
	if code == 5 && !o.done {
		o.Formatter.WriteHex(330, o.owner)
		o.done = true
	}
}
