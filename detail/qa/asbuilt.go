package qa

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"slices"
	"strings"
	"text/tabwriter"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/measured"
	"gaugeline/detail/qa/fit"
	"gaugeline/engine"
	"gaugeline/fileset"
	"gaugeline/rules"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// Reverify (SPEC §8): measured holes matched to the design, per-hole
// deviations against the fabrication tolerance, enlarged holes reclassified
// to the hole type their size now is, and every detailing rule and limit
// state recomputed on the as-built geometry.

// AlignMode is how measured coordinates are brought into the design's frame.
type AlignMode int

const (
	// AlignDatum trusts the file's frame: x from the member end, y from
	// the heel or edge. A DXF contour's lower-left corner is the datum.
	AlignDatum AlignMode = iota
	// AlignBestFit finds the rigid shift and rotation that best matches the
	// measured holes to the design (least squares over the matched holes
	// that agree within the position tolerance: fit.Robust).
	AlignBestFit
)

// String returns the flag spelling.
func (a AlignMode) String() string {
	if a == AlignBestFit {
		return "best-fit"
	}
	return "datum"
}

// ParseAlign reads the --align flag.
func ParseAlign(s string) (AlignMode, error) {
	switch s {
	case "datum":
		return AlignDatum, nil
	case "best-fit", "bestfit":
		return AlignBestFit, nil
	}
	return AlignDatum, fmt.Errorf("unknown alignment %q (want datum or best-fit)", s)
}

// partFrame maps the job's frame to the measured part's own frame, the
// frame of its cut-sheet view and CAM file (see detail/sheet.go): the
// member's is the job's; the plate's is the job's turned half a turn about
// the plate's datum corner, x' = FreeEdge − x, y' = YMax − y. Both maps
// are their own inverse.
type partFrame struct {
	plate    bool
	fe, ymax float64 // mm
}

func newPartFrame(d *detail.Design, p MeasuredPart) partFrame {
	if !p.isPlate() {
		return partFrame{}
	}
	pl := d.Conn.Plate
	return partFrame{plate: true, fe: float64(pl.FreeEdge), ymax: float64(pl.YMax())}
}

// of maps a point from the job's frame to the part's, or back.
func (f partFrame) of(x, y float64) r2.Vec {
	if !f.plate {
		return r2.Vec{X: x, Y: y}
	}
	return r2.Vec{X: f.fe - x, Y: f.ymax - y}
}

// QAVerdict is the QA outcome of reverify.
type QAVerdict int

const (
	Accept QAVerdict = iota // within tolerance and passing: exit 0
	Review                  // out of tolerance, still passing as built: exit 3
	Reject                  // fails as built, or holes missing: exit 1
)

var verdictNames = [...]string{"accept", "review", "reject"}

// String returns the JSON spelling.
func (v QAVerdict) String() string { return verdictNames[v] }

// HoleStatus is one hole's outcome.
type HoleStatus int

const (
	HoleOK             HoleStatus = iota // matched, within tolerance
	HoleOutOfTolerance                   // matched, position or size out of tolerance
	HoleMissing                          // a design hole with no measured hole
	HoleExtra                            // a measured hole with no design hole
)

var holeStatusNames = [...]string{"ok", "out-of-tolerance", "missing", "extra"}

// String returns the JSON spelling.
func (s HoleStatus) String() string { return holeStatusNames[s] }

// Deviation is one design hole and the measured hole matched to it, or a
// missing or extra hole. Lengths are in mm, in the measured part's frame
// (the job's for the member; the plate's, as on its cut-sheet view and
// CAM file, for the plate).
type Deviation struct {
	ID         string // design hole id; for an extra hole "X1", "X2", …
	MeasuredID string // the hole's id in the measured file ("" when missing)
	Line       int    // line of the measured hole in its file
	Status     HoleStatus
	// Design is the design hole as the measured part has it: its centre in
	// the part's frame and its shape in that part's ply (Plate nil); zero
	// for an extra hole.
	Design engine.Hole
	// Measured centre in the design's frame, and the deviations from the
	// design centre (measured − design) and their resultant.
	X, Y           units.Length
	Dx, Dy, Radial units.Length
	// Measured width (diameter of a round hole) and length (= width for a
	// round hole), and the width's deviation from the design's nominal.
	Width, Length units.Length
	DDiameter     units.Length
	// AsBuilt is the measured part's hole as the as-built check sees it,
	// in the part's frame and ply: measured centre, type after
	// reclassification, extents max(measured, nominal). The other part's
	// hole stays as designed.
	AsBuilt      engine.Hole
	Reclassified bool
	Why          []string // what is out of tolerance, for people
	// End is the end of a whole member the hole belongs to, "near" or
	// "far" (an extra hole: the half of the member it lies in); "" when
	// the part measured is not a whole member.
	End string
	// Group is the member whose group a splice plate's hole belongs to,
	// "A" or "B" (an extra hole: the side of the joint it lies on); ""
	// when the part measured is not a splice plate.
	Group string
}

// Alignment is the transform found between the measured file's frame and
// the design's: a measured point q is the design point R(Rotation)·p + Shift.
type Alignment struct {
	Mode       AlignMode
	Shift      [2]units.Length
	Rotation   float64      // radians, counter-clockwise
	RMS        units.Length // root mean square of the matched holes' radial deviations
	Iterations int
	Note       string
	// FitOn are the design holes a best fit was taken on, in design
	// order: every matched hole, or (fit.Robust) those that agree with one
	// rigid motion within the position tolerance. LeftOut are the matched
	// holes left out of it, each reported against the fit on the others;
	// nil when none is (and for datum alignment, where FitOn is nil too).
	FitOn, LeftOut []string
}

// AsBuilt is the outcome of reverify.
type AsBuilt struct {
	Design       *detail.Design
	Part         MeasuredPart // the part measured
	frame        partFrame
	DesignReport *detail.Report
	Report       *detail.Report // the as-built check
	Measured     *measured.Set
	Tolerance    jobfile.Tolerance
	Gate         units.Length
	Alignment    Alignment
	Deviations   []Deviation // design holes in order, then extra holes
	Verdict      QAVerdict
	Reasons      []string
	// Piece is the whole member measured (member.length given, --part
	// member; piece.go); nil for one connection end or a plate.
	Piece *Piece
	// Splice is the splice plate measured (--part splice-1, splice-2;
	// splice.go); nil else.
	Splice *SplicePlate
}

// ReverifyOptions are the choices of the command line; a zero tolerance
// field takes the job's (which defaults to common practice).
type ReverifyOptions struct {
	Align     AlignMode
	Tolerance jobfile.Tolerance
	Part      MeasuredPart // the part the measured file is of (default the member)
}

// ErrNoPlate is returned when a plate is measured for a job without one.
var ErrNoPlate = errors.New("the job has no plate: a measured plate needs the job's plate block")

// LoadMeasured reads a measured CSV or DXF (by its extension, or its
// content when the extension says neither), in the job's units unless the
// file says otherwise. Every error is an *InputError.
func LoadMeasured(path string, job *jobfile.Job, layer string) (*measured.Set, error) {
	f, err := fileset.OpenRegular(path)
	if err != nil {
		return nil, &jobfile.InputError{File: path, Field: "--measured", Msg: "cannot read the measured file: " + fileset.ErrText(err), Hint: fileset.NotRegularHint(err)}
	}
	defer f.Close()
	def := measured.Inches
	if job.Units == units.SI {
		def = measured.Millimetres
	}
	var set *measured.Set
	switch ext := strings.ToLower(filepath.Ext(path)); ext {
	case ".dxf":
		set, err = measured.ReadDXF(f, path, def, layer)
	case ".csv", ".txt":
		if layer != "" {
			return nil, &jobfile.InputError{File: path, Field: "--layer", Msg: "--layer is for DXF files", Hint: "a CSV lists the holes themselves"}
		}
		set, err = measured.ReadCSV(f, path, def)
	default:
		return nil, &jobfile.InputError{File: path, Field: "--measured", Msg: fmt.Sprintf("unknown measured file type %q", ext),
			Hint: "measured holes come as .csv (x,y,diameter[,id]) or .dxf"}
	}
	if err != nil {
		var me *measured.Error
		if errors.As(err, &me) {
			return nil, &jobfile.InputError{File: me.File, Line: me.Line, Field: me.Field, Msg: me.Msg, Hint: me.Hint}
		}
		return nil, &jobfile.InputError{File: path, Msg: err.Error()}
	}
	return set, nil
}

// Reverify matches the measured holes to the design, reports deviations,
// and checks the as-built geometry.
func Reverify(d *detail.Design, set *measured.Set, opt ReverifyOptions) (*AsBuilt, error) {
	if d == nil || set == nil || len(set.Holes) == 0 {
		panic("detail: Reverify needs a design and measured holes")
	}
	if opt.Part.isPlate() && d.Conn.Plate == nil {
		return nil, ErrNoPlate
	}
	if opt.Part.isSplicePlate() {
		return ReverifySplice(d, set, opt)
	}
	ab, err := newAsBuilt(d, set, opt)
	if err != nil {
		return nil, err
	}
	if err := ab.run(opt.Align); err != nil {
		return nil, err
	}
	return ab, nil
}

// newAsBuilt is the outcome of reverify before the matching: the design
// checked, the tolerances in force.
func newAsBuilt(d *detail.Design, set *measured.Set, opt ReverifyOptions) (*AsBuilt, error) {
	dr, err := detail.Check(d)
	if err != nil {
		return nil, err
	}
	ab := &AsBuilt{Design: d, DesignReport: dr, Measured: set, Tolerance: d.Job.Tolerance,
		Part: opt.Part, frame: newPartFrame(d, opt.Part)}
	if opt.Tolerance.Position > 0 {
		ab.Tolerance.Position = opt.Tolerance.Position
	}
	if opt.Tolerance.Diameter > 0 {
		ab.Tolerance.Diameter = opt.Tolerance.Diameter
	}
	return ab, nil
}

// designHoles are the design holes the measured part carries: the
// connection's, or the whole member's (both ends') for a piece.
func (ab *AsBuilt) designHoles() []engine.Hole {
	if ab.Piece != nil {
		return ab.Piece.Holes
	}
	if ab.Splice != nil {
		return ab.Splice.Holes
	}
	return ab.Design.Conn.Holes
}

// run aligns and matches the measured holes, finds the deviations,
// checks the as-built geometry and decides.
func (ab *AsBuilt) run(mode AlignMode) error {
	set := ab.Measured
	holes := ab.designHoles()
	ab.Gate = matchGate(ab.boltD(), holes, ab.Tolerance)

	// The design's holes in the measured part's frame: the file's frame
	// for datum alignment, the start of a best fit.
	des := make([]r2.Vec, len(holes))
	for i, h := range holes {
		des[i] = ab.frame.of(float64(h.X), float64(h.Y))
	}
	mea := make([]r2.Vec, len(set.Holes))
	for i, h := range set.Holes {
		mea[i] = r2.Vec{X: h.X, Y: h.Y}
	}
	var tf fit.Rigid
	var match []int
	switch mode {
	case AlignBestFit:
		tf, match, ab.Alignment.Iterations = fit.BestFit(des, mea, float64(ab.Gate), set.Contour)
		ab.Alignment.Note = "rigid shift and rotation fitted by least squares over the matched holes"
		tf, match = ab.robustAlignment(des, mea, tf, match)
	default:
		if len(set.Contour) > 0 {
			lo := fit.ContourMin(set.Contour)
			tf.T = lo
			if lo != (r2.Vec{}) {
				ab.Alignment.Note = "datum: the lower-left corner of the part's contour (member end, heel)"
				if ab.frame.plate {
					ab.Alignment.Note = "datum: the lower-left corner of the plate's contour (free edge, the side its CAM file puts at y = 0)"
				}
			}
		}
		match = fit.Assign(des, tf.InverseAll(mea), float64(ab.Gate))
	}
	ab.Alignment.Mode = mode
	ab.Alignment.Shift = [2]units.Length{units.Length(tf.T.X), units.Length(tf.T.Y)}
	ab.Alignment.Rotation = tf.Theta
	if ab.Alignment.Note == "" {
		ab.Alignment.Note = "datum: the file's frame as measured"
	}
	aligned := tf.InverseAll(mea)
	ab.Piece.measureCut(set.Contour, tf, mode, ab.Tolerance)
	if err := ab.deviations(aligned, match); err != nil {
		return err
	}
	ab.markLeftOut()
	var sum float64
	n := 0
	for _, dv := range ab.Deviations {
		if dv.Status == HoleOK || dv.Status == HoleOutOfTolerance {
			sum += float64(dv.Radial * dv.Radial)
			n++
		}
	}
	if n > 0 {
		ab.Alignment.RMS = units.Length(math.Sqrt(sum / float64(n)))
	}
	if err := ab.check(); err != nil {
		return err
	}
	ab.decide()
	return nil
}

// matchGate is the farthest a measured hole may lie from a design hole and
// still be that hole: the bolt diameter, or half the least design spacing
// when that is less, but never under twice the position tolerance. A hole
// beyond it is an extra hole (and the design hole missing).
func matchGate(D units.Length, holes []engine.Hole, tol jobfile.Tolerance) units.Length {
	g := D
	for i := range holes {
		for j := i + 1; j < len(holes); j++ {
			s := units.Length(math.Hypot(float64(holes[i].X-holes[j].X), float64(holes[i].Y-holes[j].Y)))
			g = min(g, s/2)
		}
	}
	return max(g, 2*tol.Position)
}

// deviations fills ab.Deviations from the matching (match[i] is the
// measured hole of design hole i, or -1): each design hole in order, then
// the measured holes no design hole took.
func (ab *AsBuilt) deviations(aligned []r2.Vec, match []int) error {
	holes := ab.designHoles()
	used := make([]bool, len(ab.Measured.Holes))
	for i := range holes {
		h := ab.designInPart(&holes[i])
		k := match[i]
		if k < 0 {
			ab.Deviations = append(ab.Deviations, Deviation{ID: h.ID, Design: h, Status: HoleMissing, Why: []string{"missing"}, End: ab.Piece.endOf(i, 0),
				Group: ab.Splice.groupOf(i, 0, 0)})
			continue
		}
		used[k] = true
		dv, err := ab.matchedDeviation(h, ab.Measured.Holes[k], aligned[k])
		if err != nil {
			return err
		}
		dv.End = ab.Piece.endOf(i, 0)
		dv.Group = ab.Splice.groupOf(i, 0, 0)
		ab.Deviations = append(ab.Deviations, dv)
	}
	return ab.extraDeviations(aligned, used)
}

// matchedDeviation is the deviation of design hole h (in the part's
// frame) from the measured hole m matched to it, at its aligned centre
// at: the offsets, the size, the as-built hole and what is out of
// tolerance.
func (ab *AsBuilt) matchedDeviation(h engine.Hole, m measured.Hole, at r2.Vec) (Deviation, error) {
	dv := Deviation{ID: h.ID, Design: h, MeasuredID: m.ID, Line: m.Line}
	dv.X, dv.Y = units.Length(at.X), units.Length(at.Y)
	dv.Dx, dv.Dy = dv.X-h.X, dv.Y-h.Y
	dv.Radial = units.Length(math.Hypot(float64(dv.Dx), float64(dv.Dy)))
	dv.Width, dv.Length = units.Length(m.Width), units.Length(m.Length)
	dv.DDiameter = dv.Width - min(h.Dx, h.Dy)
	hb, err := ab.classify(h, m, dv.X, dv.Y)
	if err != nil {
		return Deviation{}, err
	}
	hb.ID = h.ID
	dv.AsBuilt = hb
	dv.Reclassified = hb.Type != h.Type || (hb.Type.IsSlot() && hb.Slot != h.Slot)
	dv.Why = ab.outOfTolerance(dv, h, m)
	dv.Status = HoleOK
	if len(dv.Why) > 0 {
		dv.Status = HoleOutOfTolerance
	}
	return dv, nil
}

// outOfTolerance words what is wrong with the matched hole of deviation
// dv (design hole h, measured hole m): its position, its size, a slot's
// length, and its new hole type; nil when nothing is.
func (ab *AsBuilt) outOfTolerance(dv Deviation, h engine.Hole, m measured.Hole) []string {
	tol := ab.Tolerance
	sys := ab.Design.Job.Units
	ql := func(l units.Length) string { return units.FormatLength(l, sys, units.Gauge) }
	qt := func(l units.Length) string { return units.FormatLength(l, sys, units.Exact) }
	var why []string
	if dv.Radial > tol.Position+tolSlack {
		why = append(why, fmt.Sprintf("position off by %s (tolerance %s)", ql(dv.Radial), qt(tol.Position)))
	}
	switch {
	case dv.DDiameter > tol.Diameter+tolSlack:
		why = append(why, fmt.Sprintf("%s over size (tolerance +%s)", ql(dv.DDiameter), qt(tol.Diameter)))
	case dv.DDiameter < -tol.Diameter-tolSlack:
		why = append(why, fmt.Sprintf("%s under size: ream to size (tolerance %s)", ql(-dv.DDiameter), qt(tol.Diameter)))
	}
	if h.Type.IsSlot() || m.Slot {
		if dl := dv.Length - max(h.Dx, h.Dy); math.Abs(float64(dl)) > float64(tol.Diameter+tolSlack) {
			why = append(why, fmt.Sprintf("length off by %s (tolerance %s)", ql(dl), qt(tol.Diameter)))
		}
	}
	if dv.Reclassified {
		why = append(why, "now "+holeTypeWithArticle(dv.AsBuilt)+" hole")
	}
	return why
}

// holeTypeWithArticle names the hole type of h with its article: "an
// oversized", "a transverse short-slot" …
func holeTypeWithArticle(h engine.Hole) string {
	what := h.Type.String()
	if h.Type.IsSlot() {
		what = h.Slot.String() + " " + what
	}
	if strings.ContainsRune("aeiou", rune(what[0])) {
		return "an " + what
	}
	return "a " + what
}

// extraDeviations appends a deviation for every measured hole no design
// hole took (used[k] false), numbered X1, X2 … in the file's order, each
// classified as if it were a standard hole.
func (ab *AsBuilt) extraDeviations(aligned []r2.Vec, used []bool) error {
	n := 0
	for k, m := range ab.Measured.Holes {
		if used[k] {
			continue
		}
		n++
		dv := Deviation{ID: fmt.Sprintf("X%d", n), MeasuredID: m.ID, Line: m.Line, Status: HoleExtra,
			X: units.Length(aligned[k].X), Y: units.Length(aligned[k].Y),
			Width: units.Length(m.Width), Length: units.Length(m.Length), Why: []string{"not in the design"},
			End: ab.Piece.endOf(-1, units.Length(aligned[k].X)), Group: ab.Splice.groupOf(-1, units.Length(aligned[k].X), units.Length(ab.frame.fe))}
		hb, err := ab.classify(engine.Hole{HoleShape: engine.HoleShape{Type: rules.Standard}}, m, dv.X, dv.Y)
		if err != nil {
			return err
		}
		hb.ID = dv.ID
		dv.AsBuilt = hb
		ab.Deviations = append(ab.Deviations, dv)
	}
	return nil
}

// designInPart is design hole h as the measured part has it: its centre in
// the part's frame and its shape in the part's ply.
func (ab *AsBuilt) designInPart(h *engine.Hole) engine.Hole {
	p := ab.frame.of(float64(h.X), float64(h.Y))
	out := engine.Hole{ID: h.ID, X: units.Length(p.X), Y: units.Length(p.Y), HoleShape: h.HoleShape}
	if ab.Part.isPlate() {
		out.HoleShape = h.InPlate() // a half turn keeps extents along x and y
	}
	return out
}

// asBuiltHole is the hole through both plies that the as-built check
// takes for deviation dv of design hole design (nil for an extra hole):
// the measured centre, back in the job's frame, through both plies (one
// bolt, one centre); the measured part's ply as measured, the other as
// designed. An extra hole is taken as measured in both plies.
func (ab *AsBuilt) asBuiltHole(dv Deviation, design *engine.Hole, plate bool) engine.Hole {
	p := ab.frame.of(float64(dv.X), float64(dv.Y))
	h := engine.Hole{ID: dv.AsBuilt.ID, X: units.Length(p.X), Y: units.Length(p.Y), HoleShape: dv.AsBuilt.HoleShape}
	if design == nil || !plate {
		return h
	}
	other := design.InPlate()
	if ab.Part.isPlate() {
		other = design.HoleShape
		h.HoleShape = design.HoleShape
	}
	if other == dv.AsBuilt.HoleShape {
		return h
	}
	if ab.Part.isPlate() {
		plate := dv.AsBuilt.HoleShape
		h.Plate = &plate
	} else {
		h.Plate = &other
	}
	return h
}

// tolSlack is the slack of tolerance comparisons, in mm: a deviation exactly
// at the tolerance is within it although the tolerance was converted.
const tolSlack = 1e-6

// classify returns the as-built hole of a measured hole matched to design
// hole h (an extra hole passes a standard h): a hole no larger than its
// design type's nominal size plus the diameter tolerance keeps that type;
// a larger one is the smallest type (standard, oversized; short, long
// slot) whose nominal size plus tolerance holds it, or the largest when
// none does (hole.size then fails). Its extents are the measured ones, but
// never less than the type's nominal: an undersize hole is reamed to size.
func (ab *AsBuilt) classify(h engine.Hole, m measured.Hole, x, y units.Length) (engine.Hole, error) {
	c := &ab.Design.Conn
	ed, D, tol := c.Edition, c.Bolt.D, ab.Tolerance.Diameter
	w, l := units.Length(m.Width), units.Length(m.Length)
	out := engine.Hole{X: x, Y: y}
	if !m.Slot {
		types := []rules.HoleType{rules.Standard, rules.Oversized}
		start := 0
		if h.Type == rules.Oversized {
			start = 1
		}
		out.Type = types[len(types)-1]
		for _, t := range types[start:] {
			hs, err := ed.Hole(D, t)
			if err != nil {
				return out, err
			}
			if w <= hs.Width+tol+tolSlack {
				out.Type = t
				break
			}
		}
		hs, err := ed.Hole(D, out.Type)
		if err != nil {
			return out, err
		}
		out.Slot = rules.Transverse
		out.Dx = max(w, hs.Width)
		out.Dy = out.Dx
		return out, nil
	}
	// A slot: its direction from its axis in the design frame (the
	// alignment's rotation is already out of the axis).
	axis := m.Axis - ab.Alignment.Rotation
	out.Slot = rules.Transverse
	if math.Abs(math.Cos(axis)) >= math.Abs(math.Sin(axis)) {
		out.Slot = rules.Longitudinal
	}
	out.Type = rules.LongSlot
	short, err := ed.Hole(D, rules.ShortSlot)
	if err != nil {
		return out, err
	}
	if h.Type != rules.LongSlot && l <= short.Length+tol+tolSlack {
		out.Type = rules.ShortSlot
	}
	hs, err := ed.Hole(D, out.Type)
	if err != nil {
		return out, err
	}
	along, across := max(l, hs.Length), max(w, hs.Width)
	out.Dx, out.Dy = across, along
	if out.Slot == rules.Longitudinal {
		out.Dx, out.Dy = along, across
	}
	return out, nil
}

// check builds the as-built design and checks it: every limit state and
// detailing rule on the measured hole centres and sizes, with hole.size
// allowing the fabrication tolerance. A whole member is checked at each
// end (checkPiece).
func (ab *AsBuilt) check() error {
	if ab.Piece != nil {
		return ab.checkPiece()
	}
	if ab.Splice != nil {
		return ab.checkSplice()
	}
	d := ab.Design
	var holes []engine.Hole
	for i, dv := range ab.Deviations {
		if dv.Status == HoleMissing {
			continue
		}
		var design *engine.Hole // deviations list the design holes first, in order
		if dv.Status != HoleExtra {
			design = &d.Conn.Holes[i]
		}
		holes = append(holes, ab.asBuiltHole(dv, design, d.Conn.Plate != nil))
	}
	r, err := ab.checkBuilt(d, holes)
	if err != nil {
		return err
	}
	ab.Report = r
	return nil
}

// checkBuilt checks design d with the as-built holes (in d's frame) and
// adds the cautions of an as-built check.
func (ab *AsBuilt) checkBuilt(d *detail.Design, holes []engine.Hole) (*detail.Report, error) {
	// The engine groups holes into gage lines and rows with a slack of a
	// quarter diameter, so the measured centres go in as they are.
	built := d.WithHoles(holes)
	built.Info.PositionTol = ab.Tolerance.Position // J1.7's limit: the tolerance reverify applies
	built.Info.AsBuilt, built.Info.DiameterTol = true, ab.Tolerance.Diameter
	r, err := detail.Check(built)
	if err != nil {
		return nil, err
	}
	r.Cautions = append(r.Cautions, ab.partCaution(),
		"As built: holes within a quarter of the bolt diameter of one another across (along) the load are taken as one gage line (row).")
	if ab.Alignment.Mode == AlignBestFit {
		r.Cautions = append(r.Cautions, "Best-fit alignment places the hole group on the design: edge distances are checked as designed plus the holes' deviations within the group, not measured from the part's own edges; use --align datum to check them.")
	}
	return r, nil
}

// partCaution says which part was measured and what the check takes of the
// other.
func (ab *AsBuilt) partCaution() string {
	if ab.Piece != nil {
		return ab.Piece.caution()
	}
	if ab.Splice != nil {
		return ab.Splice.caution()
	}
	if ab.Part == MeasuredNearEnd || ab.Part == MeasuredFarEnd {
		return endCaution(ab.Part, ab.Design.Conn.Plate != nil)
	}
	if ab.Part.isPlate() {
		return "As built: the " + ab.Part.words() + " was measured. Its holes take the measured sizes and the hole types they now are; " +
			"the member's holes keep their designed type and size. Each bolt has one centre, the measured one, in both parts; " +
			"the plate's free edge and centre line are where the file's frame puts them, the member's end and edges as designed."
	}
	msg := "As built: the member was measured. Its holes take the measured sizes and the hole types they now are; "
	if ab.Design.Conn.Plate == nil {
		return msg + "each bolt is at its measured centre."
	}
	return msg + "the plate's holes keep their designed type and size. Each bolt has one centre, the measured one, in both parts; " +
		"the plate is taken as designed (free edge and centre line)."
}

// decide sets the verdict and its reasons.
func (ab *AsBuilt) decide() {
	var missing, extra, out []string
	for _, dv := range ab.Deviations {
		switch dv.Status {
		case HoleMissing:
			missing = append(missing, holeName(dv, dv.ID))
		case HoleExtra:
			extra = append(extra, holeName(dv, dv.MeasuredID))
		case HoleOutOfTolerance:
			out = append(out, holeName(dv, dv.ID))
		}
	}
	r := ab.Report
	ab.Verdict = Accept
	if len(out) > 0 || len(extra) > 0 {
		ab.Verdict = Review
	}
	if len(out) > 0 {
		ab.Reasons = append(ab.Reasons, "out of tolerance: "+strings.Join(out, ", "))
	}
	if len(extra) > 0 {
		ab.Reasons = append(ab.Reasons, "holes not in the design: "+strings.Join(extra, ", "))
	}
	if len(missing) > 0 {
		ab.Verdict = Reject
		ab.Reasons = append(ab.Reasons, "missing holes: "+strings.Join(missing, ", "))
	}
	if !r.Pass {
		ab.Verdict = Reject
		end := ""
		if ab.Piece != nil {
			end = "near end "
		}
		if ab.Splice != nil {
			end = "member A's group "
		}
		ab.Reasons = append(ab.Reasons, end+"fails as built: "+strings.Join(r.Failing(), ", "))
		if !ab.DesignReport.Pass {
			ab.Reasons = append(ab.Reasons, "the design itself fails: "+strings.Join(ab.DesignReport.Failing(), ", "))
		}
	}
	if ab.Piece != nil {
		ab.decidePiece()
	}
	if ab.Splice != nil {
		ab.decideSplice()
	}
	if ab.Verdict == Review {
		ab.Reasons = append(ab.Reasons, "every detailing rule and limit state passes as built: send to the engineer of record")
	}
}

// Exit returns the exit code of the verdict (SPEC §2).
func (ab *AsBuilt) Exit() int { return [...]int{0, 3, 1}[ab.Verdict] }

// JSON document of reverify (SPEC §9): the check document of the as-built
// geometry, its verdict replaced by accept, review or reject.

type jsonDeviation struct {
	ID           string          `json:"id"`
	MeasuredID   string          `json:"measured_id,omitempty"`
	Line         int             `json:"line,omitempty"`
	Status       string          `json:"status"`
	DesignX      *detail.JSONNum `json:"design_x,omitempty"`
	DesignY      *detail.JSONNum `json:"design_y,omitempty"`
	X            *detail.JSONNum `json:"x,omitempty"`
	Y            *detail.JSONNum `json:"y,omitempty"`
	Dx           *detail.JSONNum `json:"dx,omitempty"`
	Dy           *detail.JSONNum `json:"dy,omitempty"`
	Radial       *detail.JSONNum `json:"radial,omitempty"`
	TruePosition *detail.JSONNum `json:"true_position,omitempty"` // GD&T: the diameter of the zone, 2 × radial
	Diameter     *detail.JSONNum `json:"diameter,omitempty"`
	Length       *detail.JSONNum `json:"length,omitempty"`
	DesignDia    *detail.JSONNum `json:"design_diameter,omitempty"`
	DDiameter    *detail.JSONNum `json:"diameter_deviation,omitempty"`
	DesignType   string          `json:"design_type,omitempty"`
	Type         string          `json:"type,omitempty"`
	Slot         string          `json:"slot,omitempty"`
	Reclassified bool            `json:"reclassified"`
	InTolerance  bool            `json:"within_tolerance"`
	Why          []string        `json:"why,omitempty"`
	End          string          `json:"end,omitempty"`   // a whole member: "near" or "far"
	Group        string          `json:"group,omitempty"` // a splice plate: member "A" or "B"
}

type jsonAlignment struct {
	Mode        string         `json:"mode"`
	ShiftX      detail.JSONNum `json:"shift_x"`
	ShiftY      detail.JSONNum `json:"shift_y"`
	RotationDeg detail.JSONNum `json:"rotation_deg"`
	RMS         detail.JSONNum `json:"rms"`
	Iterations  int            `json:"iterations,omitempty"`
	Note        string         `json:"note"`
	// Present only when a best fit left holes out (Alignment.LeftOut):
	// absent, the fit was taken on every matched hole.
	FitOn   []string `json:"fit_on,omitempty"`
	LeftOut []string `json:"left_out_of_fit,omitempty"`
}

type jsonMeasured struct {
	File   string   `json:"file"`
	Format string   `json:"format"`
	Units  string   `json:"units"`
	Holes  int      `json:"holes"`
	Notes  []string `json:"notes,omitempty"`
}

type jsonReverify struct {
	detail.Document
	Verdict         string                    `json:"verdict"`
	AsBuilt         string                    `json:"as_built"`
	Part            string                    `json:"part"`
	DesignVerdict   string                    `json:"design_verdict"`
	Reasons         []string                  `json:"reasons"`
	Measured        jsonMeasured              `json:"measured"`
	Tolerance       map[string]detail.JSONNum `json:"tolerance"`
	Gate            detail.JSONNum            `json:"match_gate"`
	Alignment       jsonAlignment             `json:"alignment"`
	Deviations      []jsonDeviation           `json:"deviations"`
	DesignGoverning string                    `json:"design_governing"`
	DesignFailing   []string                  `json:"design_failing"` // [] when the design passes
	DesignRatios    map[string]detail.JSONNum `json:"design_ratios"`
	RatioChange     map[string]detail.JSONNum `json:"ratio_change"`
	// Piece is the whole member (member.length, --part member): its cut
	// length and the far end as built; absent else.
	Piece *jsonPiece `json:"piece,omitempty"`
	// Splice is the splice plate (--part splice-1, splice-2): the joint
	// and member B's group as built; absent else.
	Splice *jsonSplice `json:"splice,omitempty"`
}

func (ab *AsBuilt) document() jsonReverify {
	sys := ab.Design.Job.Units
	length := func(l units.Length) *detail.JSONNum {
		v := detail.JSONNum(sys.ToJob(float64(l), units.DimLength))
		return &v
	}
	doc := jsonReverify{
		Document: ab.Report.Document(), Verdict: ab.Verdict.String(), AsBuilt: ab.Report.Verdict(), Part: ab.Part.String(),
		DesignVerdict: ab.DesignReport.Verdict(), Reasons: ab.Reasons,
		Measured: jsonMeasured{File: ab.Measured.File, Format: ab.Measured.Format, Units: ab.Measured.Units,
			Holes: len(ab.Measured.Holes), Notes: ab.Measured.Notes},
		Tolerance: map[string]detail.JSONNum{"position": *length(ab.Tolerance.Position), "diameter": *length(ab.Tolerance.Diameter)},
		Gate:      *length(ab.Gate),
		Alignment: jsonAlignment{Mode: ab.Alignment.Mode.String(), ShiftX: *length(ab.Alignment.Shift[0]), ShiftY: *length(ab.Alignment.Shift[1]),
			RotationDeg: detail.JSONNum(ab.Alignment.Rotation * 180 / math.Pi), RMS: *length(ab.Alignment.RMS),
			Iterations: ab.Alignment.Iterations, Note: ab.Alignment.Note},
		Deviations:      []jsonDeviation{},
		DesignGoverning: ab.DesignReport.GoverningResult().ID,
		DesignFailing:   append([]string{}, ab.DesignReport.Failing()...),
		Piece:           ab.pieceDocument(),
		Splice:          ab.spliceDocument(),
	}
	doc.DesignRatios, doc.RatioChange = ratioMaps(ab.DesignReport, ab.Report)
	if doc.Reasons == nil {
		doc.Reasons = []string{}
	}
	if len(ab.Alignment.LeftOut) > 0 {
		doc.Alignment.FitOn, doc.Alignment.LeftOut = ab.Alignment.FitOn, ab.Alignment.LeftOut
	}
	for _, dv := range ab.Deviations {
		j := jsonDeviation{ID: dv.ID, MeasuredID: dv.MeasuredID, Line: dv.Line, Status: dv.Status.String(),
			Reclassified: dv.Reclassified, InTolerance: dv.Status == HoleOK, Why: dv.Why, End: dv.End, Group: dv.Group}
		if dv.Status != HoleExtra {
			j.DesignX, j.DesignY = length(dv.Design.X), length(dv.Design.Y)
			j.DesignDia = length(min(dv.Design.Dx, dv.Design.Dy))
			j.DesignType = dv.Design.Type.String()
		}
		if dv.Status != HoleMissing {
			j.X, j.Y, j.Diameter = length(dv.X), length(dv.Y), length(dv.Width)
			if dv.Length != dv.Width {
				j.Length = length(dv.Length)
			}
			j.Type = dv.AsBuilt.Type.String()
			if dv.AsBuilt.Type.IsSlot() {
				j.Slot = dv.AsBuilt.Slot.String()
			}
		}
		if dv.Status == HoleOK || dv.Status == HoleOutOfTolerance {
			j.Dx, j.Dy, j.Radial, j.DDiameter = length(dv.Dx), length(dv.Dy), length(dv.Radial), length(dv.DDiameter)
			j.TruePosition = length(2 * dv.Radial)
		}
		doc.Deviations = append(doc.Deviations, j)
	}
	return doc
}

// ratioMaps are the JSON's design_ratios and ratio_change of the design's
// report and the as-built one.
func ratioMaps(designed, built *detail.Report) (ratios, change map[string]detail.JSONNum) {
	ratios, change = map[string]detail.JSONNum{}, map[string]detail.JSONNum{}
	design := map[string]float64{}
	for _, x := range designed.Results {
		ratios[x.ID] = detail.JSONNum(x.Ratio)
		design[x.ID] = x.Ratio
	}
	for _, x := range built.Results {
		if dr, ok := design[x.ID]; ok {
			change[x.ID] = detail.JSONNum(x.Ratio - dr)
		}
	}
	return ratios, change
}

// JSON returns the reverify document as indented JSON, ending in a newline.
func (ab *AsBuilt) JSON() ([]byte, error) {
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetIndent("", "  ")
	if err := enc.Encode(ab.document()); err != nil {
		return nil, fmt.Errorf("detail: encoding reverify report: %w", err)
	}
	return b.Bytes(), nil
}

// qaSigned writes a deviation as Gauge does, with its sign; no sign on a zero.
func qaSigned(l units.Length, sys units.System) string {
	s := units.FormatLength(l, sys, units.Gauge)
	if s[0] != '-' {
		s = "+" + s
	}
	if strings.Trim(s, "+-0. inm") == "" {
		s = strings.TrimLeft(s, "+-") // no sign on a zero
	}
	return s
}

// holeRow is one deviation as table cells for people.
func (ab *AsBuilt) holeRow(dv Deviation) []string {
	sys := ab.Design.Job.Units
	l := func(v units.Length) string { return units.FormatLength(v, sys, units.Gauge) }
	sg := func(v units.Length) string { return qaSigned(v, sys) }
	dash := "-"
	row := []string{dv.ID, dv.MeasuredID, dash, dash, dash, dash, dash, dash, dash, dash, dv.Status.String()}
	if dv.MeasuredID == "" {
		row[1] = dash
	}
	if dv.Status != HoleMissing {
		row[2], row[3] = l(dv.X), l(dv.Y)
		row[7] = l(dv.Width)
		if dv.Length != dv.Width {
			row[7] += " x " + l(dv.Length)
		}
		row[9] = dv.AsBuilt.Type.String()
		if dv.AsBuilt.Type.IsSlot() {
			row[9] = dv.AsBuilt.Slot.String() + " " + row[9]
		}
	}
	if dv.Status == HoleOK || dv.Status == HoleOutOfTolerance {
		row[4], row[5], row[6], row[8] = sg(dv.Dx), sg(dv.Dy), l(dv.Radial), sg(dv.DDiameter)
	}
	if dv.Status == HoleMissing {
		row[2], row[3] = l(dv.Design.X), l(dv.Design.Y)
		row[9] = dv.Design.Type.String()
	}
	if ab.Piece != nil {
		row = slices.Insert(row, 1, dv.End)
	}
	if ab.Splice != nil {
		row = slices.Insert(row, 1, dv.Group)
	}
	return row
}

var holeHeader = []string{"HOLE", "MEASURED", "X", "Y", "DX", "DY", "RADIAL", "SIZE", "SIZE DEV", "TYPE", "STATUS"}

// holeHeader is the hole table's header: with an END column after the
// hole for a whole member.
func (ab *AsBuilt) holeHeader() []string {
	switch {
	case ab.Piece != nil:
		return slices.Insert(slices.Clone(holeHeader), 1, "END")
	case ab.Splice != nil:
		return slices.Insert(slices.Clone(holeHeader), 1, "MEMBER")
	}
	return holeHeader
}

// header lines shared by the text and Markdown reports.
func (ab *AsBuilt) preamble() [][2]string {
	sys := ab.Design.Job.Units
	a := ab.Alignment
	align := fmt.Sprintf("%s: shift x %s, y %s; rotation %.6f deg; rms %s (%s)", a.Mode, qaSigned(a.Shift[0], sys), qaSigned(a.Shift[1], sys),
		a.Rotation*180/math.Pi, units.FormatLength(a.RMS, sys, units.Gauge), a.Note)
	m := ab.Measured
	part := "member: its holes reclassified from the measured sizes, the plate's as designed; coordinates in the job's frame"
	switch {
	case ab.Piece != nil:
		part = ab.Piece.partRow(ab.Design.Conn.Plate != nil)
	case ab.Splice != nil:
		part = ab.Splice.partRow(ab.Part)
	case ab.Part == MeasuredNearEnd || ab.Part == MeasuredFarEnd:
		part = endRow(ab.Part, ab.Design.Conn.Plate != nil)
	case ab.Part == MeasuredFarPlate:
		part = "far-plate: the far end's own plate; its holes reclassified from the measured sizes, the member's as designed; coordinates in the plate's frame " +
			"(x from the free edge, y from the side its CAM file puts at y = 0); the far end's x run from the far cut end"
	case ab.Part.isPlate():
		part = "plate: its holes reclassified from the measured sizes, the member's as designed; coordinates in the plate's frame " +
			"(x from the free edge, y from the side its CAM file puts at y = 0)"
	case ab.Design.Conn.Plate == nil:
		part = "member: its holes reclassified from the measured sizes; coordinates in the job's frame"
	}
	rows := [][2]string{
		{"measured", fmt.Sprintf("%s (%s, %s, %d holes)", m.File, m.Format, m.Units, len(m.Holes))},
		{"part", part},
		{"tolerance", fmt.Sprintf("position %s radial, size +%s over nominal; holes farther than %s from a design hole are extra",
			units.FormatLength(ab.Tolerance.Position, sys, units.Exact), units.FormatLength(ab.Tolerance.Diameter, sys, units.Exact), units.FormatLength(ab.Gate, sys, units.Exact))},
		{"alignment", align},
	}
	if row, ok := ab.Piece.cutRow(sys, ab.Tolerance); ok {
		rows = append(rows, [2]string{"cut length", row})
	}
	if len(a.LeftOut) > 0 {
		rows = append(rows, [2]string{"fit", fmt.Sprintf("taken on %s; left out %s (off by more than the position tolerance from the fit on the others)",
			strings.Join(a.FitOn, ", "), strings.Join(a.LeftOut, ", "))})
	}
	return rows
}

// ratioRows pairs each as-built limit state of built with the ratio of
// the design's report.
func ratioRows(designed, built *detail.Report) [][]string {
	design := map[string]float64{}
	for _, x := range designed.Results {
		design[x.ID] = x.Ratio
	}
	var rows [][]string
	for i, x := range built.Results {
		dr, change := "-", "-"
		if v, ok := design[x.ID]; ok {
			dr, change = detail.RatioText(v), fmt.Sprintf("%+.3f", x.Ratio-v)
			if math.Abs(x.Ratio-v) < 5e-4 {
				change = "0.000"
			}
		}
		mark := detail.PassMark(x.Pass, false)
		if i == built.Governing {
			mark += " <"
		}
		rows = append(rows, []string{x.ID, x.Clause, dr, detail.RatioText(x.Ratio), change, mark})
	}
	return rows
}

// writeRatioTable writes the as-built limit states beside the design's
// under title.
func writeRatioTable(b *strings.Builder, title string, rows [][]string) {
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, title+"\tCLAUSE\tDESIGN RATIO\tAS-BUILT RATIO\tCHANGE\t")
	for _, row := range rows {
		fmt.Fprintln(tw, strings.Join(row, "\t"))
	}
	tw.Flush()
}

// WriteText writes the reverify report as aligned tables for a terminal.
func (ab *AsBuilt) WriteText(w io.Writer) error {
	d := ab.Design
	sys := d.Job.Units
	var b strings.Builder
	fmt.Fprintf(&b, "%s — as-built re-verification, %s, %s, %s units\n", d.Job.Mark, d.Conn.Edition.Name(), strings.ToUpper(d.Conn.Method.String()), d.Job.Units)
	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	for _, row := range append(d.Summary(), ab.preamble()...) {
		fmt.Fprintf(tw, "  %s\t%s\n", row[0], row[1])
	}
	tw.Flush()
	for _, n := range ab.Measured.Notes {
		fmt.Fprintf(&b, "  file: %s\n", n)
	}
	b.WriteString("\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, strings.Join(ab.holeHeader(), "\t")+"\tWHY")
	for _, dv := range ab.Deviations {
		fmt.Fprintln(tw, strings.Join(ab.holeRow(dv), "\t")+"\t"+strings.Join(dv.Why, "; "))
	}
	tw.Flush()
	b.WriteString("\n")
	title, dtitle := "LIMIT STATE (AS BUILT)", "DETAILING (AS BUILT)"
	if ab.Piece != nil {
		title, dtitle = "LIMIT STATE (NEAR END, AS BUILT)", "DETAILING (NEAR END, AS BUILT)"
	}
	if ab.Splice != nil {
		title, dtitle = "LIMIT STATE (MEMBER A'S GROUP, AS BUILT)", "DETAILING (MEMBER A'S GROUP, AS BUILT)"
	}
	writeRatioTable(&b, title, ratioRows(ab.DesignReport, ab.Report))
	b.WriteString("\n")
	detail.FindingsText(&b, sys, dtitle, ab.Report.Findings)
	ab.farText(&b)
	ab.spliceText(&b)
	fmt.Fprintf(&b, "\nverdict: %s\n", strings.ToUpper(ab.Verdict.String()))
	for _, r := range ab.Reasons {
		fmt.Fprintf(&b, "  %s\n", r)
	}
	b.WriteString("\n")
	for _, c := range ab.Report.Cautions {
		fmt.Fprintf(&b, "note: %s\n", c)
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// WriteMarkdown writes the reverify report for the QA record.
func (ab *AsBuilt) WriteMarkdown(w io.Writer) error {
	d := ab.Design
	sys := d.Job.Units
	var b strings.Builder
	fmt.Fprintf(&b, "# %s — as-built re-verification\n\n", d.Job.Mark)
	fmt.Fprintf(&b, "%s, %s, %s units.\n\n", d.Conn.Edition.Name(), strings.ToUpper(d.Conn.Method.String()), d.Job.Units)
	for _, row := range append(d.Summary(), ab.preamble()...) {
		fmt.Fprintf(&b, "- **%s**: %s\n", row[0], detail.MarkdownEscape(row[1]))
	}
	for _, n := range ab.Measured.Notes {
		fmt.Fprintf(&b, "- file: %s\n", detail.MarkdownEscape(n))
	}
	fmt.Fprintf(&b, "\n**Verdict: %s**\n\n", strings.ToUpper(ab.Verdict.String()))
	for _, r := range ab.Reasons {
		fmt.Fprintf(&b, "- %s\n", detail.MarkdownEscape(r))
	}
	hdr := ab.holeHeader()
	b.WriteString("\n## Holes\n\n| " + strings.ToLower(strings.Join(hdr, " | ")) + " | why |\n|" + strings.Repeat("---|", len(hdr)+1) + "\n")
	for _, dv := range ab.Deviations {
		row := ab.holeRow(dv)
		for i := range row {
			row[i] = detail.MarkdownEscape(row[i])
		}
		fmt.Fprintf(&b, "| %s | %s |\n", strings.Join(row, " | "), detail.MarkdownEscape(strings.Join(dv.Why, "; ")))
	}
	lsTitle, dTitle := "Limit states as built", "Detailing as built"
	if ab.Piece != nil {
		lsTitle, dTitle = "Near end: limit states as built", "Near end: detailing as built"
	}
	if ab.Splice != nil {
		lsTitle, dTitle = "Member A's group: limit states as built", "Member A's group: detailing as built"
	}
	b.WriteString("\n## " + lsTitle + "\n\n| id | clause | design ratio | as-built ratio | change | result |\n|---|---|---:|---:|---:|---|\n")
	for _, row := range ratioRows(ab.DesignReport, ab.Report) {
		fmt.Fprintf(&b, "| %s |\n", strings.Join(row, " | "))
	}
	detail.FindingsMarkdown(&b, sys, dTitle, ab.Report.Findings)
	ab.farMarkdown(&b)
	ab.spliceMarkdown(&b)
	b.WriteString("\n")
	for _, c := range ab.Report.Cautions {
		fmt.Fprintf(&b, "> %s\n>\n", c)
	}
	_, err := io.WriteString(w, strings.TrimSuffix(b.String(), ">\n"))
	return err
}
