package dxfout

import (
	"strconv"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail/sheet"
	"gaugeline/rules/units"
)

// This file is the R12 (AC1009) writer of CAM files, for the nesting and
// punch importers that read nothing newer; github.com/yofu/dxf writes
// AutoCAD 2000 and later only. It writes what Part.PaintMarked hands it:
// the contour and slots as closed POLYLINEs of VERTEXes (bulges on the
// slots' ends) and SEQEND, round holes as CIRCLEs, the label as one TEXT
// on layer mark; a LINE for a Painter's line, though a part has none.
//
// The file holds the HEADER ($ACADVER AC1009, $INSBASE, $EXTMIN, $EXTMAX,
// $LUNITS, $LTSCALE), TABLES with LTYPE (CONTINUOUS), LAYER (0, then
// ours) and STYLE (STANDARD), an empty BLOCKS and the ENTITIES. R12 has
// no handles and no units header ($INSUNITS and $MEASUREMENT came later):
// the units are said in a comment (group 999) after the stamp's. Group
// codes are right-aligned in three columns as AutoCAD wrote them, for
// importers that read by column; reals in fixed point with 16 decimals,
// the R2000 file's numbers.

// R12Ext ends an R12 CAM file's name: MARK-PART.cam.r12.dxf, beside the
// AutoCAD 2000 file MARK-PART.cam.dxf.
const R12Ext = ".cam.r12.dxf"

// CAMR12 draws one part as its R12 CAM file holds it, without a stamp: the
// contour, the holes and the part's label (sheet.Part.Label) at text
// height h on layer mark. The error is always nil.
func CAMR12(part *sheet.Part, sys units.System, h float64) ([]byte, error) {
	return drawR12(part, sys, h, ""), nil
}

func drawR12(part *sheet.Part, sys units.System, h float64, stamp string) []byte {
	p := &r12Pen{}
	lo, hi := part.PaintMarked(p, h)
	return p.write(sys, lo, hi, stamp)
}

// r12Pen is one R12 file being drawn: a sheet.Painter that writes each
// entity as it comes into ents; write puts the file round it.
type r12Pen struct {
	layers []sheet.Layer
	ents   r12Buf
}

// unitsComment says the drawing units, which R12 has no header for.
func unitsComment(sys units.System) string {
	if sys == units.SI {
		return "units: millimetres, 1:1 (R12 has no units header)"
	}
	return "units: inches, 1:1 (R12 has no units header)"
}

func (p *r12Pen) Layers(ls []sheet.Layer) { p.layers = append(p.layers[:0], ls...) }

func (p *r12Pen) layer(l sheet.Layer) string {
	for _, d := range p.layers {
		if d == l {
			return l.String()
		}
	}
	panic("dxfout: layer " + l.String() + " not declared by the painter's Layers")
}

func (p *r12Pen) Line(a, b r2.Vec, l sheet.Layer) {
	e := &p.ents
	e.str(0, "LINE")
	e.str(8, p.layer(l))
	e.point(10, a)
	e.point(11, b)
}

func (p *r12Pen) Circle(c r2.Vec, r float64, l sheet.Layer) {
	e := &p.ents
	e.str(0, "CIRCLE")
	e.str(8, p.layer(l))
	e.point(10, c)
	e.float(40, r)
}

// ClosedPolyline writes a closed 2D POLYLINE (flag 1), its VERTEXes with
// the bulge of the side leaving each where it is not 0, and SEQEND.
func (p *r12Pen) ClosedPolyline(pts []r2.Vec, bulges []float64, l sheet.Layer) {
	e := &p.ents
	name := p.layer(l)
	e.str(0, "POLYLINE")
	e.str(8, name)
	e.int(66, 1) // vertices follow
	e.point(10, r2.Vec{})
	e.int(70, 1) // closed
	for i, q := range pts {
		e.str(0, "VERTEX")
		e.str(8, name)
		e.point(10, q)
		if i < len(bulges) && bulges[i] != 0 {
			e.float(42, bulges[i])
		}
		e.int(70, 0)
	}
	e.str(0, "SEQEND")
	e.str(8, name)
}

// Text writes a TEXT in style STANDARD; an alignment other than left and
// base line puts the alignment point (11, 21) and the flags 72 and 73
// (73 is R12's own).
func (p *r12Pen) Text(t sheet.Text) {
	e := &p.ents
	e.str(0, "TEXT")
	e.str(8, p.layer(t.Layer))
	e.point(10, t.At)
	e.float(40, t.Height)
	e.str(1, t.Value)
	if t.Rotation != 0 {
		e.float(50, t.Rotation)
	}
	e.str(7, "STANDARD")
	if h, v := textFlags(t.Align); h != 0 || v != 0 {
		e.int(72, h)
		e.point(11, t.At)
		e.int(73, v)
	}
}

// textFlags are DXF's horizontal (72) and vertical (73) justification of
// an alignment.
func textFlags(a sheet.Align) (h, v int) {
	switch a {
	case sheet.AlignCenterBottom:
		return 1, 1
	case sheet.AlignCenterMiddle:
		return 1, 2
	case sheet.AlignCenterTop:
		return 1, 3
	case sheet.AlignRightBottom:
		return 2, 1
	case sheet.AlignRightMiddle:
		return 2, 2
	case sheet.AlignRightTop:
		return 2, 3
	}
	return 0, 0
}

// write puts the file round the entities: the stamp's and the units'
// comments, HEADER, TABLES, BLOCKS, ENTITIES, EOF.
func (p *r12Pen) write(sys units.System, lo, hi r2.Vec, stamp string) []byte {
	f := &r12Buf{b: make([]byte, 0, 2048+len(p.ents.b))}
	if stamp != "" {
		f.str(999, CommentPrefix+oneLine(stamp))
	}
	f.str(999, unitsComment(sys))
	f.section("HEADER")
	f.str(9, "$ACADVER")
	f.str(1, "AC1009")
	f.str(9, "$INSBASE")
	f.point(10, r2.Vec{})
	f.str(9, "$EXTMIN")
	f.point(10, lo)
	f.str(9, "$EXTMAX")
	f.point(10, hi)
	f.str(9, "$LUNITS")
	f.int(70, 2) // decimal
	f.str(9, "$LTSCALE")
	f.float(40, 1)
	f.str(0, "ENDSEC")
	f.section("TABLES")
	p.tables(f)
	f.str(0, "ENDSEC")
	f.section("BLOCKS")
	f.str(0, "ENDSEC")
	f.section("ENTITIES")
	f.b = append(f.b, p.ents.b...)
	f.str(0, "ENDSEC")
	f.str(0, "EOF")
	return f.b
}

// tables writes LTYPE, LAYER and STYLE, each with its count of entries.
func (p *r12Pen) tables(f *r12Buf) {
	f.table("LTYPE", 1)
	f.str(0, "LTYPE")
	f.str(2, "CONTINUOUS")
	f.int(70, 0)
	f.str(3, "Solid line")
	f.int(72, 65) // alignment 'A'
	f.int(73, 0)  // no dashes
	f.float(40, 0)
	f.str(0, "ENDTAB")

	f.table("LAYER", 1+len(p.layers))
	f.layer("0", 7)
	for _, l := range p.layers {
		f.layer(l.String(), int(layerColor(l)))
	}
	f.str(0, "ENDTAB")

	f.table("STYLE", 1)
	f.str(0, "STYLE")
	f.str(2, "STANDARD")
	f.int(70, 0)
	f.float(40, 0) // height not fixed
	f.float(41, 1) // width factor
	f.float(50, 0) // oblique angle
	f.int(71, 0)
	f.float(42, 1) // last height used
	f.str(3, "txt")
	f.str(4, "")
	f.str(0, "ENDTAB")
}

// r12Buf is R12 ASCII being written: a group is its code right-aligned
// in three columns, a line break, its value and a line break.
type r12Buf struct{ b []byte }

func (f *r12Buf) code(c int) {
	switch {
	case c < 10:
		f.b = append(f.b, "  "...)
	case c < 100:
		f.b = append(f.b, ' ')
	}
	f.b = strconv.AppendInt(f.b, int64(c), 10)
	f.b = append(f.b, '\n')
}

func (f *r12Buf) str(c int, v string) {
	f.code(c)
	f.b = append(f.b, v...)
	f.b = append(f.b, '\n')
}

func (f *r12Buf) int(c, v int) {
	f.code(c)
	f.b = strconv.AppendInt(f.b, int64(v), 10)
	f.b = append(f.b, '\n')
}

// float writes v in fixed point with 16 decimals, as the AutoCAD 2000
// files do (appendFloat without its code).
func (f *r12Buf) float(c int, v float64) {
	f.code(c)
	f.b = appendReal(f.b, v)
	f.b = append(f.b, '\n')
}

// point writes a 2D point as codes c, c+10 and its z (0), c+20.
func (f *r12Buf) point(c int, q r2.Vec) {
	f.float(c, q.X)
	f.float(c+10, q.Y)
	f.float(c+20, 0)
}

func (f *r12Buf) section(name string) {
	f.str(0, "SECTION")
	f.str(2, name)
}

func (f *r12Buf) table(name string, n int) {
	f.str(0, "TABLE")
	f.str(2, name)
	f.int(70, n)
}

func (f *r12Buf) layer(name string, colour int) {
	f.str(0, "LAYER")
	f.str(2, name)
	f.int(70, 0)
	f.int(62, colour)
	f.str(6, "CONTINUOUS")
}

// r12Prec is the decimals of an R12 file's reals, and r12Pow5 5^r12Prec.
const (
	r12Prec = 16
	r12Pow5 = 152587890625 // 5^16
)

func appendReal(b []byte, v float64) []byte {
	if out, ok := appendFixed(b, v, r12Prec, r12Pow5); ok {
		return out
	}
	return strconv.AppendFloat(b, v, 'f', r12Prec, 64)
}
