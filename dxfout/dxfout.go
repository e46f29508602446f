package dxfout

import (
	"fmt"
	"strings"

	"github.com/yofu/dxf/block"
	"github.com/yofu/dxf/class"
	"github.com/yofu/dxf/color"
	"github.com/yofu/dxf/entity"
	"github.com/yofu/dxf/format"
	"github.com/yofu/dxf/object"
	"github.com/yofu/dxf/table"
	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail/sheet"
	"gaugeline/fileset"
	"gaugeline/rules/units"
)

// File is one file drawn: its name and bytes (a file of a set, see
// package fileset).
type File = fileset.File

// Files draws the cut sheet MARK.dxf and, unless the sheet is not for
// fabrication, the CAM file MARK-PART.cam.dxf of each part, in that order,
// each starting with the sheet's stamp (see Comment): FilesAs with CAM2000.
func Files(s *sheet.Sheet) ([]File, error) { return FilesAs(s, CAM2000) }

// CAMFormat is which DXF versions of each CAM file are written.
type CAMFormat int

const (
	// CAM2000 is the AutoCAD 2000 (AC1015) file MARK-PART.cam.dxf alone.
	CAM2000 CAMFormat = iota
	// CAMWithR12 adds, after each, its R12 (AC1009) variant
	// MARK-PART.cam.r12.dxf, which also carries the part's label on layer
	// mark (see CAMR12).
	CAMWithR12
)

// ParseCAMFormat reads a --dxf value: "2000" (the default) or "r12".
func ParseCAMFormat(v string) (CAMFormat, error) {
	switch strings.ToLower(v) {
	case "", "2000":
		return CAM2000, nil
	case "r12":
		return CAMWithR12, nil
	}
	return 0, fmt.Errorf("--dxf %q: the CAM files are written as 2000 (AutoCAD 2000, the default) or r12 (AutoCAD 2000 and R12 beside it)", v)
}

// FilesAs draws the cut sheet MARK.dxf and, unless the sheet is not for
// fabrication, each part's CAM files in format f, in that order, each
// starting with the sheet's stamp. Drawing cannot fail today; the error is
// there for a writer that can.
func FilesAs(s *sheet.Sheet, f CAMFormat) ([]File, error) {
	out := []File{{Name: s.Mark + ".dxf", Data: drawSheet(s, s.Stamp)}}
	if s.NotForFabrication {
		return out, nil
	}
	for i := range s.Views {
		p := &s.Views[i].Part
		name := s.Mark + "-" + p.Name
		out = append(out, File{Name: name + ".cam.dxf", Data: drawCAM(p, s.Units, s.Stamp)})
		if f == CAMWithR12 {
			out = append(out, File{Name: name + R12Ext, Data: drawR12(p, s.Units, s.TextHeight, s.Stamp)})
		}
	}
	return out, nil
}

// Sheet draws the cut sheet, without a stamp. The error is always nil.
func Sheet(s *sheet.Sheet) ([]byte, error) { return drawSheet(s, ""), nil }

// CAM draws one part alone in its own frame: the closed contour and the
// holes, nothing else; without a stamp. The error is always nil.
func CAM(part *sheet.Part, sys units.System) ([]byte, error) { return drawCAM(part, sys, ""), nil }

func drawSheet(s *sheet.Sheet, stamp string) []byte {
	p := newPen(256)
	lo, hi := s.Paint(p)
	return p.write(s.Units, s.TextHeight, lo, hi, stamp)
}

func drawCAM(part *sheet.Part, sys units.System, stamp string) []byte {
	p := newPen(1 + len(part.Holes))
	lo, hi := part.Paint(p)
	return p.write(sys, 1, lo, hi, stamp)
}

// CommentPrefix starts the DXF comment (group 999) that carries a run
// stamp at the top of every file of a file set.
const CommentPrefix = fileset.StampPrefix

// Comment puts the stamp in a DXF comment (group code 999, which readers
// skip) before the first section of data; an empty stamp leaves data as
// it is. A stamp is one line: line breaks in it are replaced by blanks.
// Files writes the same comment as it draws.
func Comment(data []byte, stamp string) []byte {
	if stamp == "" {
		return data
	}
	c := appendString(nil, 999, CommentPrefix+oneLine(stamp))
	return append(c, data...)
}

func oneLine(s string) string { return lineBreaks.Replace(s) }

// lineBreaks turns line breaks into blanks. A Replacer never changes
// once built and is safe for concurrent use; one built per file cost
// about 0.5 kB of garbage a file (BenchmarkBatch's memory profile).
var lineBreaks = strings.NewReplacer("\r", " ", "\n", " ")

// layerColor is the ACI colour of a layer: parts in the foreground
// colour, holes red, dimensions cyan, reference lines grey.
func layerColor(l sheet.Layer) color.ColorNumber {
	switch l {
	case sheet.LayerHoles:
		return color.Red
	case sheet.LayerDimensions:
		return color.Cyan
	case sheet.LayerReference:
		return color.Grey128
	case sheet.LayerMark:
		return color.Green
	}
	return color.White
}

// anchor maps our alignments onto the library's; all of them write the
// alignment point.
func anchor(a sheet.Align) int {
	switch a {
	case sheet.AlignCenterBottom:
		return entity.CENTER_BOTTOM
	case sheet.AlignCenterMiddle:
		return entity.CENTER_CENTER
	case sheet.AlignCenterTop:
		return entity.CENTER_TOP
	case sheet.AlignRightBottom:
		return entity.RIGHT_BOTTOM
	case sheet.AlignRightMiddle:
		return entity.RIGHT_CENTER
	case sheet.AlignRightTop:
		return entity.RIGHT_TOP
	}
	return entity.LEFT_BASE
}

// pen is one DXF file being drawn: a sheet.Painter that turns each item
// into the library's entity. It builds the file's skeleton itself rather
// than through drawing.New, which hands every drawing the library's
// package-level layer "0", line types and text style and writes handles,
// owners, plot styles and text heights into them: sharing nothing, pens
// draw in parallel.
type pen struct {
	continuous *table.LineType
	layer0     *table.Layer
	layers     []*table.Layer // by sheet.Layer; nil where not declared
	style      *table.Style
	tables     table.Tables
	blocks     block.Blocks
	entities   entity.Entities
	objects    object.Objects
}

// newPen lays out the skeleton drawing.New makes (sections, tables, the
// two blocks of model and paper space, the dictionaries), less what an
// independent audit (ezdxf) would repair in the library's: a second paper
// space block (*Paper_Space0) with no layout, and dictionaries without
// their owner (the root's is handle 0, the group dictionary's the root).
// It makes room for about n entities.
func newPen(n int) *pen {
	p := &pen{continuous: table.NewLineType("Continuous", "Solid Line"), style: table.NewStyle("Standard")}
	root := object.NewDictionary()
	plotStyles, normal := object.NewAcDbDictionaryWDFLT(root)
	root.AddItem("ACAD_PLOTSTYLENAME", plotStyles)
	groups := object.NewDictionary()
	root.AddItem("ACAD_GROUP", groups)
	p.objects = object.Objects{owned{root, nil}, plotStyles, normal, owned{groups, root}}

	p.layer0 = table.NewLayer("0", color.White, p.continuous)
	p.layer0.SetPlotStyle(normal)
	p.tables = table.Tables{
		table.NewTable("VPORT"), table.NewTable("LTYPE"), table.NewTable("LAYER"), table.NewTable("STYLE"),
		table.NewTable("VIEW"), table.NewTable("UCS"), table.NewTable("APPID"), table.NewTable("DIMSTYLE"),
		table.NewTable("BLOCK_RECORD"),
	}
	lt := p.tables[table.LTYPE]
	lt.Add(table.NewLineType("ByLayer", ""))
	lt.Add(table.NewLineType("ByBlock", ""))
	lt.Add(p.continuous)
	lt.Add(table.NewLineType("HIDDEN", "Hidden __ __ __ __ __ __ __ __ __ __ __ __ __ _", 0.25, -0.125))
	lt.Add(table.NewLineType("DASHDOT", "Dash dot __ . __ . __ . __ . __ . __ . __ . __", 0.5, -0.25, 0.0, -0.25))
	p.tables[table.LAYER].Add(p.layer0)
	p.tables[table.STYLE].Add(p.style)
	p.tables[table.APPID].Add(table.NewAppID("ACAD"))
	p.tables[table.BLOCK_RECORD].Add(table.NewBlockRecord("*Model_Space"))
	p.tables[table.BLOCK_RECORD].Add(table.NewBlockRecord("*Paper_Space"))
	p.blocks = block.Blocks{block.NewBlock("*Model_Space", ""), block.NewBlock("*Paper_Space", "")}
	for _, b := range p.blocks {
		b.SetLayer(p.layer0)
	}
	p.entities = make(entity.Entities, 0, n)
	return p
}

// Layers adds the layers to the layer table, after layer 0.
func (p *pen) Layers(ls []sheet.Layer) {
	for _, l := range ls {
		ly := table.NewLayer(l.String(), layerColor(l), p.continuous)
		ly.SetPlotStyle(p.layer0.PlotStyle)
		p.tables[table.LAYER].Add(ly)
		for int(l) >= len(p.layers) {
			p.layers = append(p.layers, nil)
		}
		p.layers[l] = ly
	}
}

func (p *pen) layer(l sheet.Layer) *table.Layer {
	if int(l) >= len(p.layers) || p.layers[l] == nil {
		panic("dxfout: layer " + l.String() + " not declared by the painter's Layers")
	}
	return p.layers[l]
}

func (p *pen) Line(a, b r2.Vec, l sheet.Layer) {
	e := entity.NewLine()
	e.Start[0], e.Start[1] = a.X, a.Y
	e.End[0], e.End[1] = b.X, b.Y
	e.SetLayer(p.layer(l))
	p.entities = append(p.entities, e)
}

func (p *pen) Circle(c r2.Vec, r float64, l sheet.Layer) {
	e := entity.NewCircle()
	e.Center[0], e.Center[1] = c.X, c.Y
	e.Radius = r
	e.SetLayer(p.layer(l))
	p.entities = append(p.entities, e)
}

// ClosedPolyline draws a closed LWPOLYLINE; bulges may be nil.
func (p *pen) ClosedPolyline(pts []r2.Vec, bulges []float64, l sheet.Layer) {
	e := entity.NewLwPolyline(len(pts))
	for i, q := range pts {
		e.Vertices[i][0], e.Vertices[i][1] = q.X, q.Y
	}
	copy(e.Bulges, bulges)
	e.Close()
	e.SetLayer(p.layer(l))
	p.entities = append(p.entities, e)
}

// Text draws a TEXT in the one text style.
func (p *pen) Text(t sheet.Text) {
	e := entity.NewText()
	e.Coord1[0], e.Coord1[1] = t.At.X, t.At.Y
	e.Height = t.Height
	e.Value = t.Value
	e.SetLayer(p.layer(t.Layer))
	e.Style = p.style
	e.WidthFactor, e.ObliqueAngle = p.style.WidthFactor, p.style.ObliqueAngle
	e.Rotation = t.Rotation
	e.Anchor(anchor(t.Align))
	p.entities = append(p.entities, e)
}

// section is what the library's drawing writes a section through.
type section interface {
	Format(format.Formatter)
	SetHandle(*int)
}

// write numbers the handles as the library's drawing does (every section
// after the header in order, then the header, which records the next free
// one) and writes the file: the stamp's comment, the sections, EOF.
// textHeight is recorded as the text style's last height used.
func (p *pen) write(sys units.System, textHeight float64, lo, hi r2.Vec, stamp string) []byte {
	p.style.LastHeightUsed = textHeight
	h := &header{insunits: 1, measurement: 0, extmin: lo, extmax: hi}
	if sys == units.SI {
		h.insunits, h.measurement = 4, 1
	}
	sections := [...]section{h, class.New(), p.tables, p.blocks, p.entities, p.objects}
	next := 1
	for _, s := range sections[1:] {
		s.SetHandle(&next)
	}
	h.SetHandle(&next)
	// About 4.5 kB of skeleton and at most 320 bytes an entity (a TEXT).
	f := newASCII(5120 + 320*len(p.entities))
	if stamp != "" {
		f.WriteString(999, CommentPrefix+oneLine(stamp))
	}
	for _, s := range sections {
		s.Format(f)
	}
	f.WriteString(0, "EOF")
	return f.buf
}

// header is the HEADER section: the library's lacks $MEASUREMENT, so we
// write our own.
type header struct {
	insunits, measurement int
	extmin, extmax        r2.Vec
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

// owned writes a dictionary with its owner group (330) right after its
// handle (5), which the library's object.Dictionary leaves out; a nil
// owner is handle 0.
type owned struct {
	object.Object
	owner object.Object
}

func (o owned) Format(f format.Formatter) {
	h := 0
	if o.owner != nil {
		h = o.owner.Handle()
	}
	o.Object.Format(&ownerAfterHandle{Formatter: f, owner: h})
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
