package qa

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/measured"
	"gaugeline/detail/qa/fit"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// The whole member (member.length given, --part member): its CAM file
// carries both ends' holes on a contour member.length long, so its design
// holes are both ends' (detail.Report.FarHoles: the near end's at x, a
// mirror far end's at length − x, a far end of its own where the job puts
// them), near end first, ids H… then F…. The measured holes are matched
// to all of them at once, in the member's frame (x from the near cut
// end); the as-built check runs per end: the near end's connection with
// the near-end holes as built, the far end's (the near end's connection
// for a mirror, its own else) with the far-end holes mirrored back into
// its own frame, x from the far cut end. A measured contour gives the cut
// length, reported against member.length with the position tolerance.
// The verdict covers the piece.

// Piece is the whole member measured.
type Piece struct {
	Length units.Length // member.length
	Kind   jobfile.FarEndKind
	// Holes are the piece's design holes in the member's frame: the near
	// end's (the first Near), then the far end's.
	Holes []engine.Hole
	Near  int
	// FarDesign is the far end's connection (the near end's design for a
	// mirror, its own else; nil for a plain far end), FarDesignReport its
	// check as designed and FarReport as built (nil where the far end has
	// no connection, or none of its holes was found).
	FarDesign                  *detail.Design
	FarDesignReport, FarReport *detail.Report
	// CutMeasured: the file has a contour, whose length along the member
	// is Cut (CutDev = Cut − Length; CutOut when past the tolerance).
	CutMeasured bool
	Cut, CutDev units.Length
	CutOut      bool
	// farEnd is where the far end's as-built check puts its cut end, in
	// the member's frame: the measured contour's far end (datum), else
	// member.length.
	farEnd units.Length
}

// Target is a part of a job made ready to be re-verified: its design
// built (and, for a whole member, both ends checked). Prepare it before
// reading the measured file, so that a bad job is reported first.
type Target struct {
	part   MeasuredPart
	design *detail.Design
	member *detail.Report // the whole member's CheckJob report; nil else
}

// Prepare builds the design of part p of job: the near end's (--part
// plate, splice-1, splice-2, near-end, or the member of a job without
// member.length, as it always was), the far end's own (far-plate, and
// far-end where the far end is a connection of its own; a mirror far end
// is the near end's design), or the whole member (member with
// member.length). A part the job does not have is an *InputError naming
// --part; so is every error of the job.
func Prepare(job *jobfile.Job, p MeasuredPart) (*Target, error) {
	if err := CheckPart(job, p); err != nil {
		return nil, err
	}
	p = resolvePart(job, p)
	t := &Target{part: p}
	var err error
	switch {
	case p == MeasuredFarPlate, p == MeasuredFarEnd && job.Member.FarEnd.Kind == jobfile.FarOwn:
		if t.design, err = detail.Build(job.Member.FarEnd.Job); err != nil {
			return nil, jobfile.FarEndError(err)
		}
	case p == MeasuredMember && job.Member.Length > 0:
		if t.member, err = detail.CheckJob(job); err != nil {
			return nil, err
		}
		t.design = t.member.Design
	default:
		if t.design, err = detail.Build(job); err != nil {
			return nil, err
		}
	}
	return t, nil
}

// Reverify re-verifies the target's part from the measured holes;
// opt.Part is the target's.
func (t *Target) Reverify(set *measured.Set, opt ReverifyOptions) (*AsBuilt, error) {
	opt.Part = t.part
	if t.member != nil {
		return ReverifyMember(t.member, set, opt)
	}
	if t.part.isSplicePlate() {
		return ReverifySplice(t.design, set, opt)
	}
	return Reverify(t.design, set, opt)
}

// ReverifyMember re-verifies the whole member of r (detail.CheckJob's
// report) from its measured holes: both ends' holes matched, each end
// checked as built. Without member.length it is Reverify of the near end.
func ReverifyMember(r *detail.Report, set *measured.Set, opt ReverifyOptions) (*AsBuilt, error) {
	d := r.Design
	if d.MemberLength() == 0 {
		return Reverify(d, set, opt)
	}
	if set == nil || len(set.Holes) == 0 {
		panic("qa: ReverifyMember needs measured holes")
	}
	opt.Part = MeasuredMember
	ab, err := newAsBuilt(d, set, opt)
	if err != nil {
		return nil, err
	}
	job := d.Job
	pc := &Piece{Length: job.Member.Length, Kind: job.Member.FarEnd.Kind, Near: len(d.Conn.Holes), farEnd: job.Member.Length}
	pc.Holes = append(slices.Clone(d.Conn.Holes), r.FarHoles()...)
	switch pc.Kind {
	case jobfile.FarMirror:
		pc.FarDesign, pc.FarDesignReport = d, ab.DesignReport
	case jobfile.FarOwn:
		pc.FarDesign = r.Far.Design
		if pc.FarDesignReport, err = detail.Check(pc.FarDesign); err != nil {
			return nil, err
		}
	}
	ab.Piece = pc
	if err := ab.run(opt.Align); err != nil {
		return nil, err
	}
	return ab, nil
}

// boltD is the diameter the match gate starts from: the bolt's, the
// smaller of the two ends' for a whole member.
func (ab *AsBuilt) boltD() units.Length {
	D := ab.Design.Conn.Bolt.D
	if pc := ab.Piece; pc != nil && pc.FarDesign != nil {
		D = min(D, pc.FarDesign.Conn.Bolt.D)
	}
	return D
}

// endOf is the end of design hole i of the piece, or (i < 0) of an extra
// hole at x: the half of the member it lies in. "" for no piece.
func (pc *Piece) endOf(i int, x units.Length) string {
	switch {
	case pc == nil:
		return ""
	case i >= 0 && i < pc.Near, i < 0 && x <= pc.Length/2:
		return "near"
	}
	return "far"
}

// measureCut takes the cut length from the measured contour, in the
// design's frame under tf: its extent along the member.
func (pc *Piece) measureCut(contour []r2.Vec, tf fit.Rigid, mode AlignMode, tol jobfile.Tolerance) {
	if pc == nil || len(contour) == 0 {
		return
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, p := range contour {
		q := tf.Inverse(r2.Vec{X: p.X, Y: p.Y})
		lo, hi = min(lo, q.X), max(hi, q.X)
	}
	pc.CutMeasured = true
	pc.Cut = units.Length(hi - lo)
	pc.CutDev = pc.Cut - pc.Length
	pc.CutOut = math.Abs(float64(pc.CutDev)) > float64(tol.Position+tolSlack)
	if mode == AlignDatum {
		pc.farEnd = units.Length(hi) // the datum is the near cut end
	}
}

// cutRow is the report's line on the cut length; ok false for no piece.
func (pc *Piece) cutRow(sys units.System, tol jobfile.Tolerance) (string, bool) {
	if pc == nil {
		return "", false
	}
	want := units.FormatLength(pc.Length, sys, units.Exact)
	if !pc.CutMeasured {
		return fmt.Sprintf("member.length %s; not measured (the file has no contour)", want), true
	}
	s := fmt.Sprintf("%s measured, member.length %s: %s (tolerance %s)", units.FormatLength(pc.Cut, sys, units.Gauge), want,
		qaSigned(pc.CutDev, sys), units.FormatLength(tol.Position, sys, units.Exact))
	if pc.CutOut {
		s += ": out of tolerance"
	}
	return s, true
}

// cutReason is the verdict's reason for a cut length out of tolerance.
func (pc *Piece) cutReason(sys units.System) string {
	what := "long"
	if pc.CutDev < 0 {
		what = "short"
	}
	return fmt.Sprintf("cut length out of tolerance: %s %s (%s measured, member.length %s)",
		units.FormatLength(units.Length(math.Abs(float64(pc.CutDev))), sys, units.Gauge), what,
		units.FormatLength(pc.Cut, sys, units.Gauge), units.FormatLength(pc.Length, sys, units.Exact))
}

// partRow is the report's part line for the whole member.
func (pc *Piece) partRow(plate bool) string {
	s := "member, whole: both ends' holes (H… near end, F… far end), reclassified from the measured sizes"
	if plate {
		s += ", the plates' as designed"
	}
	s += "; coordinates in the job's frame (x from the near cut end); each end checked as built, the far end's x from the far cut end"
	if pc.Kind == jobfile.FarPlain {
		s += " (the far end is plain: no holes there)"
	}
	return s
}

// caution is the as-built check's note on the whole member.
func (pc *Piece) caution() string {
	far := "the far end's holes (F…), mirrored into its own frame (x' = far cut end − x), are checked as the far end's connection"
	if pc.Kind == jobfile.FarPlain {
		far = "the far end is plain: nothing is checked there"
	}
	return "As built: the whole member was measured. Its holes take the measured sizes and the hole types they now are; " +
		"the plates' holes keep their designed type and size. The near end's holes (H…) are checked as the near end's connection; " +
		far + ", its cut end where the measured contour ends (datum alignment) or at member.length. Each bolt has one centre, the measured one, in both parts."
}

// checkPiece checks each end of the whole member as built: the near
// end's holes in the near end's connection, the far end's mirrored into
// the far end's. An extra hole counts at the end of the half it lies in.
func (ab *AsBuilt) checkPiece() error {
	pc := ab.Piece
	holes := ab.designHoles()
	var near, far []engine.Hole
	for i, dv := range ab.Deviations {
		if dv.Status == HoleMissing {
			continue
		}
		var design *engine.Hole // deviations list the design holes first, in order
		if dv.Status != HoleExtra {
			design = &holes[i]
		}
		if dv.End != "far" {
			near = append(near, ab.asBuiltHole(dv, design, ab.Design.Conn.Plate != nil))
			continue
		}
		if pc.FarDesign == nil {
			continue // a plain far end: no connection to check
		}
		h := ab.asBuiltHole(dv, design, pc.FarDesign.Conn.Plate != nil)
		h.X = pc.farEnd - h.X
		far = append(far, h)
	}
	if len(near) == 0 {
		ab.Report = ab.unchecked("the near end's holes")
	} else {
		r, err := ab.checkBuilt(ab.Design, near)
		if err != nil {
			return err
		}
		ab.Report = r
	}
	if pc.FarDesign == nil || len(far) == 0 {
		return nil
	}
	var err error
	pc.FarReport, err = ab.checkBuilt(pc.FarDesign, far)
	return err
}

// unchecked stands for the as-built check of the near end (of a whole
// member) or member A's group (of a splice plate) when none of its holes
// was found, and no measured hole lies there: nothing can be checked
// there as built (a connection of no holes is not one), so the report is
// the design's, with a caution saying so. The missing holes reject the
// part. what names the holes: "the near end's holes".
func (ab *AsBuilt) unchecked(what string) *detail.Report {
	r := *ab.DesignReport
	r.Cautions = append(slices.Clone(r.Cautions), ab.partCaution(),
		"As built: none of "+what+" was found, so nothing there is checked as built: the ratios shown there are the design's.")
	return &r
}

// holeName is a hole's id in the verdict's reasons: with its end for a
// whole member, "F3 (far end)"; with its member for a splice plate,
// "BH2 (member B)".
func holeName(dv Deviation, id string) string {
	switch {
	case dv.Group != "":
		return id + " (member " + dv.Group + ")"
	case dv.End == "":
		return id
	}
	return id + " (" + dv.End + " end)"
}

// decidePiece adds the whole member's own reasons: the cut length, and
// the far end as built.
func (ab *AsBuilt) decidePiece() {
	pc := ab.Piece
	if pc.CutOut {
		if ab.Verdict == Accept {
			ab.Verdict = Review
		}
		ab.Reasons = append(ab.Reasons, pc.cutReason(ab.Design.Job.Units))
	}
	if fr := pc.FarReport; fr != nil && !fr.Pass {
		ab.Verdict = Reject
		ab.Reasons = append(ab.Reasons, "far end fails as built: "+strings.Join(fr.Failing(), ", "))
		if !pc.FarDesignReport.Pass {
			ab.Reasons = append(ab.Reasons, "the far end's design itself fails: "+strings.Join(pc.FarDesignReport.Failing(), ", "))
		}
	}
}

// farText writes the far end's as-built tables of the text report.
func (ab *AsBuilt) farText(b *strings.Builder) {
	if pc := ab.Piece; pc != nil && pc.FarReport != nil {
		ab.secondCheck(pc.FarDesignReport, pc.FarReport, "FAR END", "x from the far cut end").text(b)
	}
}

// farMarkdown writes the far end's as-built sections of the Markdown
// report.
func (ab *AsBuilt) farMarkdown(b *strings.Builder) {
	if pc := ab.Piece; pc != nil && pc.FarReport != nil {
		ab.secondCheck(pc.FarDesignReport, pc.FarReport, "Far end", "x from the far cut end.").markdown(b)
	}
}

// secondCheck is an as-built check a reverify report shows after the
// first one's tables: a whole member's far end, a splice plate's member B.
type secondCheck struct {
	sys              units.System
	design, asBuilt  *detail.Report
	label, frameNote string // "FAR END" (text) or "Far end" (Markdown); how its x run
}

func (ab *AsBuilt) secondCheck(design, asBuilt *detail.Report, label, frameNote string) secondCheck {
	return secondCheck{sys: ab.Design.Job.Units, design: design, asBuilt: asBuilt, label: label, frameNote: frameNote}
}

// text writes its limit states (design and as-built ratios) and its
// detailing as the text report's tables.
func (c secondCheck) text(b *strings.Builder) {
	b.WriteString("\n")
	writeRatioTable(b, "LIMIT STATE ("+c.label+", AS BUILT; "+c.frameNote+")", ratioRows(c.design, c.asBuilt))
	b.WriteString("\n")
	detail.FindingsText(b, c.sys, "DETAILING ("+c.label+", AS BUILT)", c.asBuilt.Findings)
}

// markdown writes the same as Markdown sections.
func (c secondCheck) markdown(b *strings.Builder) {
	fmt.Fprintf(b, "\n## %s: limit states as built\n\n%s\n\n| id | clause | design ratio | as-built ratio | change | result |\n|---|---|---:|---:|---:|---|\n", c.label, c.frameNote)
	for _, row := range ratioRows(c.design, c.asBuilt) {
		fmt.Fprintf(b, "| %s |\n", strings.Join(row, " | "))
	}
	detail.FindingsMarkdown(b, c.sys, c.label+": detailing as built", c.asBuilt.Findings)
}

// jsonPiece is the whole member in the reverify JSON (piece): its cut
// length as designed and measured, and the far end as built.
type jsonPiece struct {
	Length          detail.JSONNum  `json:"length"`
	FarEnd          string          `json:"far_end"` // mirror | plain | own
	MeasuredLength  *detail.JSONNum `json:"measured_length,omitempty"`
	LengthDeviation *detail.JSONNum `json:"length_deviation,omitempty"`
	LengthInTol     *bool           `json:"length_within_tolerance,omitempty"`
	Far             *jsonFarEnd     `json:"far,omitempty"`
}

// jsonFarEnd is the far end as built: its fields mean what the reverify
// document's top-level fields of the same names mean, for the far end.
type jsonFarEnd struct {
	AsBuilt        string                    `json:"as_built"`
	DesignVerdict  string                    `json:"design_verdict"`
	Governing      string                    `json:"governing"`
	GoverningRatio detail.JSONNum            `json:"governing_ratio"`
	Failing        []string                  `json:"failing"`
	DesignFailing  []string                  `json:"design_failing"`
	LimitStates    any                       `json:"limit_states"`
	Detailing      any                       `json:"detailing"`
	DesignRatios   map[string]detail.JSONNum `json:"design_ratios"`
	RatioChange    map[string]detail.JSONNum `json:"ratio_change"`
}

// pieceDocument is the JSON's piece; nil for no piece.
func (ab *AsBuilt) pieceDocument() *jsonPiece {
	pc := ab.Piece
	if pc == nil {
		return nil
	}
	sys := ab.Design.Job.Units
	length := func(l units.Length) *detail.JSONNum {
		v := detail.JSONNum(sys.ToJob(float64(l), units.DimLength))
		return &v
	}
	j := &jsonPiece{Length: *length(pc.Length), FarEnd: pc.Kind.String()}
	if pc.CutMeasured {
		in := !pc.CutOut
		j.MeasuredLength, j.LengthDeviation, j.LengthInTol = length(pc.Cut), length(pc.CutDev), &in
	}
	if fr := pc.FarReport; fr != nil {
		doc := fr.Document()
		j.Far = &jsonFarEnd{AsBuilt: fr.Verdict(), DesignVerdict: pc.FarDesignReport.Verdict(), Governing: doc.Governing,
			GoverningRatio: doc.GoverningRatio, Failing: doc.Failing, DesignFailing: append([]string{}, pc.FarDesignReport.Failing()...),
			LimitStates: doc.LimitStates, Detailing: doc.Detailing}
		j.Far.DesignRatios, j.Far.RatioChange = ratioMaps(pc.FarDesignReport, fr)
	}
	return j
}
