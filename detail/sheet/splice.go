package sheet

import (
	"fmt"

	"gaugeline/detail"
	"gaugeline/engine"

	"gonum.org/v1/gonum/spatial/r2"
)

// A splice plate's frame is the gusset's half turn, x' = FreeEdge − x,
// y' = YMax − y: the datum is the plate's end past member A's group (its
// lower left corner on the sheet), member A's end (the joint, x = 0) is at
// x' = FreeEdge, member B's end (x = −gap) at x' = FreeEdge + gap, and B's
// group, A's mirrored about the joint (engine.SpliceHoles), lies beyond it
// to the plate's other end at x' = 2·FreeEdge + gap (detail.SpliceLength).
// The two splice plates of a double splice are the same piece: one view,
// one CAM file, the count in its title and the hole schedule.

// spliceJoint draws the member ends, x' = fe and fe + gap, as reference
// lines across the splice plate with the gap written beside them, and
// returns the plate view's title.
func (l sheetLayout) spliceJoint(v *View, d *detail.Design, fe float64) string {
	h := l.h
	pl := d.Conn.Plate
	gap := l.len(pl.Gap)
	_, hi := v.Part.Bounds()
	for _, x := range []float64{fe, fe + gap} {
		v.Lines = append(v.Lines, Segment{r2.Vec{X: x, Y: -h / 2}, r2.Vec{X: x, Y: hi.Y + h/4}, LayerReference})
	}
	// Rotated a quarter turn, the text stands left of its anchor, between
	// the gage lines (at least 3·d apart, J3.3).
	v.Texts = append(v.Texts, Text{At: r2.Vec{X: fe - h/4, Y: hi.Y / 2}, Height: 0.8 * h, Rotation: 90, Align: AlignCenterBottom,
		Value: "JOINT, GAP " + l.people(gap), Layer: LayerReference})
	req := "1 REQUIRED"
	if pl.Plates() == 2 {
		req = "2 REQUIRED, ONE EACH SIDE"
	}
	return fmt.Sprintf("SPLICE PLATE %s x %s x %s %s - %s, DATUM AT LOWER LEFT", l.people(l.len(pl.T)), l.people(hi.Y), l.people(hi.X),
		d.Info.PlateGrade, req)
}

// plateRow is the plate's row of the hole schedule: a splice plate has
// both members' groups (twice the holes), and two splice plates are
// counted as a double angle's two pieces are.
func (l sheetLayout) plateRow(c *engine.Connection, hole, kind, made string) []string {
	part, n := "PLATE", len(c.Holes)
	if c.Plate.Kind == engine.Splice {
		part, n = "SPLICE PLATE", 2*n
		if c.Plate.Plates() == 2 {
			part = "SPLICE PLATE (EACH OF 2)"
		}
	}
	return []string{part, fmt.Sprint(n), hole, kind, made}
}
