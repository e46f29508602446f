package sheet

import (
	"fmt"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// The whole member (member.length given): the part is the connected leg
// (or the flat) from the near cut end, x = 0, to the far one, x = length,
// with both ends' holes (detail.Report.FarHoles); its CAM file is that
// contour and those holes. The view draws it to scale; where the stretch
// between the ends' patterns is longer than the drawing needs, that
// stretch is left out (Break) and drawn as two break lines a gap apart.
// Dimensions are of the part, so across the break they still read true:
// the overall one gives the cut length.

// Break is the stretch X0 < x < X1 of a part (in its frame) that its view
// leaves out; Gap is the width drawn in its place, between two break
// lines. Everything at x ≥ X1 is drawn X1 − X0 − Gap to the left.
type Break struct {
	X0, X1, Gap float64
}

// Fold maps a point of the view's part frame to where the view draws it
// (relative to its origin): unchanged without a break, else the stretch
// of the break squeezed into its gap.
func (v *View) Fold(q r2.Vec) r2.Vec {
	b := v.Break
	switch {
	case b == nil || q.X <= b.X0:
		return q
	case q.X >= b.X1:
		return r2.Vec{X: q.X - (b.X1 - b.X0) + b.Gap, Y: q.Y}
	}
	return r2.Vec{X: b.X0 + (q.X-b.X0)/(b.X1-b.X0)*b.Gap, Y: q.Y}
}

// unfold is the inverse of Fold along x: where a drawing x lies in the
// part's frame.
func (v *View) unfold(x float64) float64 {
	b := v.Break
	switch {
	case b == nil || x <= b.X0:
		return x
	case x >= b.X0+b.Gap:
		return x + (b.X1 - b.X0) - b.Gap
	}
	return b.X0 + (x-b.X0)/b.Gap*(b.X1-b.X0)
}

// breakLines returns the closed outlines the view draws for a part of
// rectangular contour lo–hi broken by b: the piece left of the break and
// the piece right of it, each closed on its break side by a break line
// (straight, one zig-zag at mid-height, straight), in the drawing's frame.
func breakLines(lo, hi r2.Vec, b *Break, fold func(r2.Vec) r2.Vec) (left, right []r2.Vec) {
	a := b.Gap / 4
	zig := func(x float64, up bool) []r2.Vec {
		ys := []float64{0.4, 0.45, 0.55, 0.6}
		dx := []float64{0, a, -a, 0}
		pts := make([]r2.Vec, 4)
		for i := range ys {
			k := i
			if !up {
				k = 3 - i
			}
			pts[i] = r2.Vec{X: x + dx[k], Y: lo.Y + ys[k]*(hi.Y-lo.Y)}
		}
		return pts
	}
	x0, x1 := b.X0, fold(r2.Vec{X: b.X1}).X
	left = append([]r2.Vec{lo, {X: x0, Y: lo.Y}}, zig(x0, true)...)
	left = append(left, r2.Vec{X: x0, Y: hi.Y}, r2.Vec{X: lo.X, Y: hi.Y})
	end := fold(hi).X
	right = append([]r2.Vec{{X: x1, Y: hi.Y}}, zig(x1, false)...)
	right = append(right, r2.Vec{X: x1, Y: lo.Y}, r2.Vec{X: end, Y: lo.Y}, r2.Vec{X: end, Y: hi.Y})
	return left, right
}

// RequireLength refuses a job without member.length: the cut sheet and
// the CAM files are of the whole member.
func RequireLength(j *jobfile.Job) error {
	if j.Member.Length > 0 {
		return nil
	}
	return &jobfile.InputError{File: j.File, Line: j.Line("member"), Field: "member.length",
		Msg:  "is required for the cut sheet and the CAM files (they are of the whole member)",
		Hint: `give the member's cut length, end to end, e.g. length: 16 ft (us) or length: 4.8 m (si)`}
}

// member is the member's view: whole when the job gives its length, else
// the connection end alone (memberView).
func (l sheetLayout) member(r *detail.Report) View {
	if r.Design.MemberLength() == 0 {
		return l.memberView(r.Design)
	}
	return l.wholeMember(r)
}

// wholeMember is the view of the whole member, both ends' holes in its
// frame, broken where the middle is long.
func (l sheetLayout) wholeMember(r *detail.Report) View {
	d := r.Design
	m := d.Conn.Member
	length, width := l.len(d.MemberLength()), l.len(m.Width)
	p := Part{Name: "member", Contour: l.rect(length, width), Thickness: l.len(m.T), Pieces: m.Pieces}
	near, far := d.Conn.Holes, r.FarHoles()
	for _, hs := range [][]engine.Hole{near, far} {
		for _, h := range hs {
			p.Holes = append(p.Holes, SheetHole{ID: h.ID, Centre: r2.Vec{X: l.len(h.X), Y: l.len(h.Y)}, Dx: l.len(h.Dx), Dy: l.len(h.Dy), Type: h.Type})
		}
	}
	v := View{Part: p, Break: l.memberBreak(near, far, length)}
	nearHoles, farHoles := p.Holes[:len(near)], p.Holes[len(near):]
	l.annotateMember(&v, nearHoles, farHoles)

	h := l.h
	mid := v.Fold(r2.Vec{X: length}).X / 2
	title := fmt.Sprintf("MEMBER %s %s x %s", d.Info.Designation, d.Info.Grade, l.people(length))
	switch {
	case len(m.Junctions) > 0:
		title += " - " + ConnectedElement(&m)
	case m.Heel():
		title += " - CONNECTED LEG"
	}
	v.Texts = append(v.Texts, Text{At: r2.Vec{X: mid, Y: width + 2*h}, Height: 1.4 * h, Align: AlignCenterBottom, Value: title, Layer: LayerNotes})
	if m.Pieces == 2 {
		v.Texts = append(v.Texts, Text{At: r2.Vec{X: mid, Y: width + 0.8*h}, Height: h, Align: AlignCenterBottom,
			Value: PiecesNote(&m), Layer: LayerNotes})
	}
	// The titles are placed in the drawing's frame; unfold puts them back
	// into the part's, which the view keeps.
	for i := range v.Texts {
		v.Texts[i].At.X = v.unfold(v.Texts[i].At.X)
	}
	// HEEL and TOE stand right of the far cut end, past the far end's
	// dimensions across the leg where it has them.
	right := v.Fold(r2.Vec{X: length}).X + 2.5*h
	for _, dm := range v.Dims {
		if dm.Axis == AlongY && dm.Offset > length {
			right = max(right, v.Fold(r2.Vec{X: dm.Offset}).X+1.5*h)
		}
	}
	right = v.unfold(right)
	if len(m.Junctions) > 0 {
		l.junctions(&v, &m, length, right)
	} else if m.Heel() {
		t := l.len(m.T)
		v.Lines = append(v.Lines, Segment{r2.Vec{X: 0, Y: t}, r2.Vec{X: length, Y: t}, LayerReference})
		v.Texts = append(v.Texts,
			Text{At: r2.Vec{X: right, Y: 0}, Height: h, Align: AlignLeftBase, Value: "HEEL", Layer: LayerNotes},
			Text{At: r2.Vec{X: right, Y: width - h}, Height: h, Align: AlignLeftBase, Value: "TOE", Layer: LayerNotes})
	}
	if b := v.Break; b != nil {
		v.Texts = append(v.Texts, Text{At: r2.Vec{X: (b.X0 + b.X1) / 2, Y: -1.5 * h}, Height: 0.8 * h, Align: AlignCenterTop,
			Value: "BREAK", Layer: LayerNotes})
	}
	return v
}

// breakGap is the width a break is drawn: 1 in (25 mm) (our choice: two
// break lines that read as such).
func (l sheetLayout) breakGap() float64 {
	if l.sys == units.SI {
		return 25
	}
	return 1
}

// memberBreak is the break of a member of the given length (drawing
// units) whose ends carry the near and far holes: each end is drawn as
// far as ViewBeyond past its pattern (from the cut end where it has no
// holes); the stretch between is left out when it is longer than the gap.
func (l sheetLayout) memberBreak(near, far []engine.Hole, length float64) *Break {
	reach := func(hs []engine.Hole, fromFar bool) float64 {
		if len(hs) == 0 {
			return l.len(ViewBeyond(0, l.sys))
		}
		lo, hi := patternX(hs)
		if fromFar {
			return length - l.len(lo) + l.len(ViewBeyond(hi-lo, l.sys))
		}
		return l.len(hi + ViewBeyond(hi-lo, l.sys))
	}
	x0, x1 := reach(near, false), length-reach(far, true)
	if x1-x0 <= 2*l.breakGap() {
		return nil
	}
	return &Break{X0: x0, X1: x1, Gap: l.breakGap()}
}

// annotateMember adds the whole member's dimensions and gage lines: below
// it, the near end's chain from x = 0 and its baselines, the far end's
// from x = length, then the overall length; left of it the near end's
// chain across the leg and its baselines, right of it the far end's where
// its gage lines differ.
func (l sheetLayout) annotateMember(v *View, near, far []SheetHole) {
	h := l.h
	_, hi := v.Part.Bounds()
	length := hi.X
	cols := func(hs []SheetHole) (xs, ys []float64) {
		for _, s := range hs {
			xs = append(xs, s.Centre.X)
			ys = append(ys, s.Centre.Y)
		}
		return distinct(xs), distinct(ys)
	}
	nx, ny := cols(near)
	fx, fy := cols(far)

	row := -3 * h
	chain := func(from float64, xs []float64) {
		prev := from
		for _, x := range xs {
			v.Dims = append(v.Dims, l.dimX(min(prev, x), max(prev, x), row))
			prev = x
		}
	}
	chain(0, nx)
	for i := len(fx) - 1; i >= 0; i-- { // the far end's chain, from its cut end
		if i == len(fx)-1 {
			v.Dims = append(v.Dims, l.dimX(fx[i], length, row))
			continue
		}
		v.Dims = append(v.Dims, l.dimX(fx[i], fx[i+1], row))
	}
	for k := 1; k < max(len(nx), len(fx)); k++ {
		row -= 2.5 * h
		if k < len(nx) {
			v.Dims = append(v.Dims, l.dimX(0, nx[k], row))
		}
		if i := len(fx) - 1 - k; i >= 0 {
			v.Dims = append(v.Dims, l.dimX(fx[i], length, row))
		}
	}
	row -= 2.5 * h
	v.Dims = append(v.Dims, l.dimX(0, length, row))

	across := func(ys []float64, col, step float64) {
		prev := 0.0
		for _, y := range append(ys, hi.Y) {
			v.Dims = append(v.Dims, l.dimY(prev, y, col))
			prev = y
		}
		for _, y := range append(ys[1:], hi.Y) {
			col += step
			v.Dims = append(v.Dims, l.dimY(0, y, col))
		}
	}
	sameY := len(far) == 0 || equalFloats(ny, fy)
	across(ny, -3*h, -2.5*h)
	if !sameY {
		// dimY measures at x = 0; the far end's column stands right of
		// the part, its extension lines from the far cut end.
		start := len(v.Dims)
		across(fy, length+3*h, 2.5*h)
		for i := start; i < len(v.Dims); i++ {
			v.Dims[i].A.X, v.Dims[i].B.X = length, length
		}
	}

	l.memberGageLines(v, ny, fy, sameY)
}

// memberGageLines draws the gage lines the length of the member where both
// ends share them, else each end's to the middle (of the break).
func (l sheetLayout) memberGageLines(v *View, ny, fy []float64, sameY bool) {
	h := l.h
	_, hi := v.Part.Bounds()
	length := hi.X
	split := length / 2
	if b := v.Break; b != nil {
		split = (b.X0 + b.X1) / 2
	}
	if sameY {
		for _, y := range ny {
			v.Lines = append(v.Lines, Segment{r2.Vec{X: -h, Y: y}, r2.Vec{X: length + h/2, Y: y}, LayerReference})
		}
		return
	}
	for _, y := range ny {
		v.Lines = append(v.Lines, Segment{r2.Vec{X: -h, Y: y}, r2.Vec{X: split, Y: y}, LayerReference})
	}
	for _, y := range fy {
		v.Lines = append(v.Lines, Segment{r2.Vec{X: split, Y: y}, r2.Vec{X: length + h/2, Y: y}, LayerReference})
	}
}

// equalFloats reports whether a and b hold the same values within 1e-9.
func equalFloats(a, b []float64) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if d := a[i] - b[i]; d > 1e-9 || d < -1e-9 {
			return false
		}
	}
	return true
}

// projectFields are the title block's first rows, from the job's project:
// block (each where given) and the scale: project.scale, else 1:1 on a
// sheet of the whole member (its model is drawn in the job's units), with
// a word on the break where the member view has one.
func projectFields(s *Sheet, j *jobfile.Job) [][2]string {
	pr := j.Project
	var out [][2]string
	for _, f := range [][2]string{
		{"PROJECT", pr.Name}, {"DRAWING", pr.Drawing}, {"REVISION", pr.Revision}, {"DATE", pr.Date},
		{"DRAWN BY", pr.Drafter}, {"CHECKED BY", pr.Checker},
	} {
		if f[1] != "" {
			out = append(out, f)
		}
	}
	scale := pr.Scale
	if scale == "" && j.Member.Length > 0 {
		scale = "1:1"
	}
	if len(s.Views) > 0 && s.Views[0].Break != nil {
		scale += "; MEMBER SHOWN WITH A BREAK, DIMENSIONS TRUE"
	}
	if scale != "" {
		out = append(out, [2]string{"SCALE", strings.TrimPrefix(scale, "; ")})
	}
	return out
}

// farEndFields are the title block's rows on a far end of its own: its
// bolts (the GOVERNING row names the end).
func farEndFields(r *detail.Report) [][2]string {
	far := r.Far
	if far == nil {
		return nil
	}
	c, sys := &far.Design.Conn, far.Design.Job.Units
	return [][2]string{
		{"FAR BOLTS", fmt.Sprintf("(%d) %s %s, threads %s, %s joint, %s", len(c.Holes),
			detail.BoltSize(c.Bolt.D, sys), c.Bolt.Grade.Name, c.Bolt.Threads, c.Bolt.Joint, detail.HoleKinds(c))},
	}
}

// memberScheduleRows are the member's rows of the hole schedule: the near
// end's row (given) counting the whole member's holes where they are all
// alike, else a row per end (the far end's own hole type).
func (l sheetLayout) memberScheduleRows(s *Sheet, r *detail.Report, near []string) [][]string {
	d := r.Design
	if len(s.Views) == 0 || len(s.Views[0].Part.Holes) == len(d.Conn.Holes) {
		return [][]string{near}
	}
	holes := s.Views[0].Part.Holes
	first, far := holes[0], holes[len(d.Conn.Holes):]
	if same := far[0].Type == first.Type && near2(far[0].Dx, first.Dx) && near2(far[0].Dy, first.Dy); same {
		near[1] = fmt.Sprint(len(holes))
		return [][]string{near}
	}
	h := far[0]
	text := l.people(min(h.Dx, h.Dy)) + " DIA"
	if !h.Round() {
		text = l.people(min(h.Dx, h.Dy)) + " x " + l.people(max(h.Dx, h.Dy)) + " SLOT"
	}
	made := near[4]
	if r.Far != nil { // the far end's own bolt: its punch limit
		fc := &r.Far.Design.Conn
		made = fmt.Sprintf("%s (t %s, punch limit %s)", HowMade(fc.Member.T, fc.Bolt.D, l.sys), l.limit(l.len(fc.Member.T)),
			l.limit(l.len(PunchLimit(fc.Bolt.D, l.sys))))
	}
	farRow := []string{near[0] + ", FAR END", fmt.Sprint(len(far)), text, strings.ToUpper(h.Type.String()), made}
	near[0] += ", NEAR END"
	return [][]string{near, farRow}
}

func near2(a, b float64) bool { return a-b < 1e-9 && b-a < 1e-9 }

// farPlateView is the view of the far end's own plate (far_end with a
// plate: block), as the near end's plate is drawn, in its own frame; its
// CAM file is MARK-far-plate.cam.dxf. Nil where the far end has none.
func (l sheetLayout) farPlateView(r *detail.Report) *View {
	if r.Far == nil || r.Far.Design.Conn.Plate == nil {
		return nil
	}
	v := l.plateView(r.Far.Design)
	v.Part.Name = "far-plate"
	for i := range v.Texts {
		if t := &v.Texts[i]; t.Layer == LayerNotes && strings.HasPrefix(t.Value, "PLATE ") {
			t.Value = "FAR END " + t.Value
		}
	}
	return &v
}

// farPlateRows is the hole schedule's row of the far end's own plate.
func (l sheetLayout) farPlateRows(r *detail.Report) [][]string {
	if r.Far == nil || r.Far.Design.Conn.Plate == nil {
		return nil
	}
	c := &r.Far.Design.Conn
	hs := c.Holes[0].InPlate()
	made := fmt.Sprintf("%s (t %s, punch limit %s)", HowMade(c.Plate.T, c.Bolt.D, l.sys), l.limit(l.len(c.Plate.T)),
		l.limit(l.len(PunchLimit(c.Bolt.D, l.sys))))
	return [][]string{{"PLATE, FAR END", fmt.Sprint(len(c.Holes)), l.holeText(hs), strings.ToUpper(hs.Type.String()), made}}
}

// boltsEnd says which end the title block's BOLTS count is of, on a sheet
// of the whole member: "(4 EACH END)" (a mirror far end), "(4 NEAR END)"
// (a far end of its own: FAR BOLTS follows) or "(4 NEAR END ONLY)" (plain).
func boltsEnd(r *detail.Report) string {
	j := r.Design.Job
	if j.Member.Length == 0 {
		return ""
	}
	switch j.Member.FarEnd.Kind {
	case jobfile.FarPlain:
		return " NEAR END ONLY"
	case jobfile.FarOwn:
		return " NEAR END"
	}
	return " EACH END"
}
