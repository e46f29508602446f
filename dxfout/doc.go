// Package dxfout draws a cut sheet it is handed (a *sheet.Sheet) as DXF
// (AutoCAD 2000 ASCII, written with github.com/yofu/dxf): the cut sheet
// for people and the geometry-only CAM file of each part. It knows nothing
// of limit states or of how the sheet was laid out, nor what a sheet
// holds: the walk over the model is detail's (Sheet.Paint, Part.Paint),
// and dxfout only implements sheet.Painter, one entity a call.
//
// Units: drawing units are the sheet's (inches for us, $INSUNITS 1 and
// $MEASUREMENT 0; millimetres for si, $INSUNITS 4 and $MEASUREMENT 1),
// 1:1. Axes: x to the right, y up; angles counter-clockwise in degrees.
// $EXTMIN/$EXTMAX are the extents the walk returns (text by a generous
// estimate of its box), not the library's.
//
// Layers are plain words of our own, one per operation: contour, holes,
// dimensions, reference, notes, title. A CAM file has entities on contour
// and holes only: the closed outer contour as an LWPOLYLINE, round holes
// as CIRCLEs, slots as closed LWPOLYLINEs with bulge arcs.
//
// With CAMWithR12 (--dxf r12) each CAM file also gets an R12 (AC1009)
// variant, MARK-PART.cam.r12.dxf, written by r12.go (the library writes
// nothing older than AutoCAD 2000): POLYLINE, VERTEX and SEQEND for closed
// outlines, the units in a 999 comment, the part's label on layer mark.
//
// Nothing is shared between drawings: the library's drawing.New hands
// every drawing its package-level layer "0", line types and text style
// and writes into them, so each pen builds that skeleton from the
// library's constructors itself, and writes it through a formatter of our
// own (the library's bytes, without its fmt.Sprintf per value). Output is
// byte-identical for the same sheet: no timestamps, and handles follow
// drawing order.
package dxfout
