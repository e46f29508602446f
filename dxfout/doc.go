// Package dxfout draws a cut sheet it is handed (a *detail.Sheet) as DXF
// (AutoCAD 2000 ASCII, written with github.com/yofu/dxf): the cut sheet
// for people and the geometry-only CAM file of each part. It knows nothing
// of limit states or of how the sheet was laid out.
//
// Units: drawing units are the sheet's (inches for us, $INSUNITS 1 and
// $MEASUREMENT 0; millimetres for si, $INSUNITS 4 and $MEASUREMENT 1),
// 1:1. Axes: x to the right, y up; angles counter-clockwise in degrees.
// $EXTMIN/$EXTMAX are computed here from what is drawn (text by a generous
// estimate of its box), not by the library.
//
// Layers are plain words of our own, one per operation: contour, holes,
// dimensions, reference, notes, title. A CAM file has entities on contour
// and holes only: the closed outer contour as an LWPOLYLINE, round holes
// as CIRCLEs, slots as closed LWPOLYLINEs with bulge arcs.
//
// The library keeps its default layer, line types and text style in
// package-level variables shared by every drawing, so every drawing is
// built and written under one mutex, and the text style's last height is
// pinned. Output is byte-identical for the same sheet: no timestamps, and
// handles follow drawing order.
package dxfout
