package detail

import (
	"fmt"
	"slices"
	"strings"
	"text/tabwriter"

	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// The two ends of a member (member.far_end). The near end is the job's
// plate and bolts, x from the near cut end; the far end is at x = length:
//
//   - mirror (the default): the near end's connection mirrored about
//     mid-length, holes at x' = length − x, same y. Its checks are the near
//     end's, so the report is the near end's alone (Report.Far is nil).
//   - plain: no holes, nothing to check there (Far is nil).
//   - own: a connection of its own (member.far_end.plate and .bolts),
//     built and checked as a job of its own whose x run from the far cut
//     end; Report.Far is its report.
//
// The whole member passes when both ends do (Report.Pass); the governing
// end is the one that fails, else the one of the higher governing ratio,
// the near end on a tie (GoverningEnd).

// CheckJob builds and checks the job: its near end and, where the far end
// has a connection of its own, the far end (Report.Far). With
// member.length it refuses ends whose holes overlap. Every error is an
// *InputError, the far end's fields named under member.far_end.
func CheckJob(job *jobfile.Job) (*Report, error) {
	d, err := Build(job)
	if err != nil {
		return nil, err
	}
	r, err := Check(d)
	if err != nil {
		return nil, &jobfile.InputError{File: job.File, Msg: err.Error()}
	}
	if fe := job.Member.FarEnd; fe.Kind == jobfile.FarOwn {
		fd, err := Build(fe.Job)
		if err != nil {
			return nil, jobfile.FarEndError(err)
		}
		far, err := Check(fd)
		if err != nil {
			return nil, &jobfile.InputError{File: job.File, Field: "member.far_end", Msg: err.Error()}
		}
		r.Far, r.ownPass = far, r.Pass
		far.ownPass = far.Pass
		r.Pass = r.Pass && far.Pass
	}
	if err := r.checkEndsFit(); err != nil {
		return nil, err
	}
	return r, nil
}

// GoverningEnd is the report of the end that governs: the far end's when
// it fails and the near end passes, or both pass or both fail and its
// governing ratio is the higher; else the near end's (r itself).
func (r *Report) GoverningEnd() *Report {
	if r.Far == nil {
		return r
	}
	near, far := r.endPass(), r.Far.endPass()
	if near != far {
		if !far {
			return r.Far
		}
		return r
	}
	if r.Far.GoverningResult().Ratio > r.GoverningResult().Ratio {
		return r.Far
	}
	return r
}

// GoverningEndName is "near" or "far".
func (r *Report) GoverningEndName() string {
	if r.Far != nil && r.GoverningEnd() == r.Far {
		return "far"
	}
	return "near"
}

// EndPass is whether this end's own limit states and rules pass (the near
// end's alone, where the far end has a connection of its own; Pass is the
// whole member's).
func (r *Report) EndPass() bool { return r.endPass() }

// endPass is whether this end's own limit states and rules pass.
func (r *Report) endPass() bool {
	if r.Far != nil {
		return r.ownPass
	}
	return r.Pass
}

// MemberLength is the member's cut length (member.length); 0 when not
// given.
func (d *Design) MemberLength() units.Length { return d.Job.Member.Length }

// FarHoles returns the far end's holes in the member's frame (x from the
// near cut end): the near end's mirrored (x' = length − x) or the far
// end's own at length − x, each with its own hole shapes; nil for a plain
// far end or without member.length. Their ids are F1, F2, … in the far
// end's order. A far end of its own needs CheckJob's report (Far); without
// it FarHoles panics.
func (r *Report) FarHoles() []engine.Hole {
	job := r.Design.Job
	L := job.Member.Length
	if L == 0 || job.Member.FarEnd.Kind == jobfile.FarPlain {
		return nil
	}
	src := r.Design.Conn.Holes
	switch {
	case r.Far != nil:
		src = r.Far.Design.Conn.Holes
	case job.Member.FarEnd.Kind == jobfile.FarOwn:
		panic("detail: the far end of its own is not checked: the report is not CheckJob's")
	}
	out := make([]engine.Hole, len(src))
	for i, h := range src {
		out[i] = h
		if h.Plate != nil {
			p := *h.Plate
			out[i].Plate = &p
		}
		out[i].ID = fmt.Sprintf("F%d", i+1)
		out[i].X = L - h.X
	}
	return out
}

// checkEndsFit refuses a member too short for its ends: the near end's
// holes must lie within member.length and, where the far end has holes,
// end short of the far end's nearest hole.
func (r *Report) checkEndsFit() error {
	job := r.Design.Job
	L := job.Member.Length
	if L == 0 {
		return nil
	}
	var reach units.Length // farthest edge of a near-end hole from the near cut end
	for _, h := range r.Design.Conn.Holes {
		reach = max(reach, h.X+h.Dx/2)
	}
	lf := func(l units.Length) string { return units.FormatJob(l, job.Units) }
	if reach > L+eps {
		return job.FieldError("member.length", fmt.Sprintf("%s is shorter than the near end's holes, which reach %s from the near end", lf(L), lf(reach)),
			"member.length is the member's cut length, end to end")
	}
	far := r.FarHoles()
	if len(far) == 0 {
		return nil
	}
	from := L // nearest edge of a far-end hole, from the near cut end
	for _, h := range far {
		from = min(from, h.X-h.Dx/2)
	}
	if reach >= from-eps {
		need := reach + (L - from)
		return job.FieldError("member.length", fmt.Sprintf("%s is too short for both ends: the near end's holes reach %s from the near end and the far end's %s from the far end, so they overlap",
			lf(L), lf(reach), lf(L-from)),
			"the member must be longer than "+lf(need)+"; check member.length and far_end")
	}
	return nil
}

// farEndRow is the summary's line on the far end, where the job writes
// member.far_end ("" else: a job without it reads as before).
func (d *Design) farEndRow() string {
	fe := d.Job.Member.FarEnd
	if !fe.Given {
		return ""
	}
	switch fe.Kind {
	case jobfile.FarPlain:
		return "plain: no holes"
	case jobfile.FarOwn:
		return "a connection of its own (see the far end below)"
	}
	return "mirror of the near end (holes at x' = length - x, same y): the same checks"
}

// failingBoth lists the failing ids of the near end, then those of the far
// end not among them.
func (r *Report) failingBoth(ids []string) []string {
	if r.Far == nil {
		return ids
	}
	for _, id := range r.Far.Failing() {
		if !slices.Contains(ids, id) {
			ids = append(ids, id)
		}
	}
	return ids
}

// jsonEnd is one end's results in the JSON (ends[]): its fields mean what
// the document's top-level fields of the same names mean, for that end
// alone; its holes' x run from that end's own cut end.
type jsonEnd struct {
	End            string        `json:"end"` // "near" or "far"
	Verdict        string        `json:"verdict"`
	Governing      string        `json:"governing"`
	GoverningRatio JSONNum       `json:"governing_ratio"`
	Failing        []string      `json:"failing"`
	LimitStates    []jsonLimit   `json:"limit_states"`
	Detailing      []jsonFinding `json:"detailing"`
	Holes          []jsonHole    `json:"holes"`
}

// endsDocument fills the document's ends and governing_end where the far
// end has a connection of its own; else the document is left as it is.
func (r *Report) endsDocument(doc *Document) {
	if r.Far == nil {
		return
	}
	for _, e := range []struct {
		name string
		r    *Report
	}{{"near", r}, {"far", r.Far}} {
		d := e.r.endDocument()
		verdict := "fail"
		if e.r.endPass() {
			verdict = "pass"
		}
		failing := e.r.endFailing()
		if failing == nil {
			failing = []string{}
		}
		doc.Ends = append(doc.Ends, jsonEnd{End: e.name, Verdict: verdict, Governing: d.Governing, GoverningRatio: d.GoverningRatio,
			Failing: failing, LimitStates: d.LimitStates, Detailing: d.Detailing, Holes: d.Holes})
	}
	doc.GoverningEnd = r.GoverningEndName()
}

// farText writes the far end's section of the text report: its plate and
// bolts, then its tables.
func (r *Report) farText(b *strings.Builder) {
	fmt.Fprintf(b, "\nFAR END (x from the far cut end)\n")
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	for _, row := range r.Design.Summary() {
		if row[0] == "plate" || row[0] == "bolts" {
			fmt.Fprintf(tw, "  %s\t%s\n", row[0], row[1])
		}
	}
	tw.Flush()
	r.textTables(b)
}

// farMarkdown writes the far end's sections of the Markdown report.
func (r *Report) farMarkdown(b *strings.Builder) {
	fmt.Fprintf(b, "\n## Far end\n\nx from the far cut end.\n\n")
	for _, row := range r.Design.Summary() {
		if row[0] == "plate" || row[0] == "bolts" {
			fmt.Fprintf(b, "- **%s**: %s\n", row[0], row[1])
		}
	}
	r.markdownTables(b, "Far end")
}
