// Package sheet is the cut-sheet model: the views of a checked connection
// (member and plate, flattened, with holes, dimensions and reference
// lines), the hole schedule and the title block, in drawing units; and
// the one walk over it (Sheet.Paint, Part.Paint) that every drawing back
// end implements Painter for. It decides what is drawn; a back end
// (package dxfout) decides only how to write it.
package sheet
