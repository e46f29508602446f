package propose

import (
	"fmt"
	"math"
	"slices"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// The layout search of SPEC §6.
//
// The space is stock diameters × grades × plate thicknesses × lines ×
// bolts per line (a "group") × gage2 × gage × pitch × end × plate edge,
// each length on the stock step grid. Alternatives are the best layouts
// of other arrangements (diameter, grade, lines, bolts per line).
// A candidate is feasible when its holes fit the parts and every limit
// state and non-advisory detailing rule passes.
//
// Order (objective bolts): fewest bolts, shortest connection length
// (end + pattern length + plate edge), smallest diameter, lowest governing
// ratio (to 6 decimals), then grade in stock order, thinner plate, fewer
// lines, smaller gage, gage2, end, pitch, edge. Objective length swaps the
// first two.
//
// The pruned search returns exactly what the exhaustive enumeration
// returns. It rests on three facts, each tested against the enumeration:
//
//   - Bounds: member yielding needs no layout; bolt shear (without the
//     long-joint reduction), slip and the bearing cap of every bolt bound
//     the bolt count from below; a group whose shortest layout is longer
//     than the best found cannot win.
//   - Monotonicity: with diameter, grade, plate, counts and gages fixed,
//     more pitch, end or plate edge never lowers a strength (engine
//     property test) and never breaks a detailing rule inside the searched
//     ranges, as long as the pattern stays on one side of the long-joint
//     limit and the stagger is not larger than the pitch. Feasibility is
//     then an up-set of the (pitch, end, edge) grid: one failing layout
//     rules out every smaller one, one passing layout admits every larger
//     one, and the shortest passing layouts lie on its staircase. Two
//     kinds of job break it: a fixed plate outline, searched candidate by
//     candidate (outline.go), and a splice plate in compression, whose
//     buckling length between the groups grows with the end distance,
//     searched with a group per end distance (problem.byEnd).
//   - Gage: where the gage lines sit across the member matters only to
//     member block shear (its blocks reach the toe or the bar's edges),
//     to a flat's eccentricity (J1.7: the eccentricity rule and
//     member.combined) and to the gage and member-edge rules; the plate
//     is centred on the bolt group and every other check sees distances
//     between holes. So a pitch, end and edge that fail on another check
//     fail at every gage, and the other checks' ratios bound the ratio at
//     every gage from below. On angles moving the lines toward the toe
//     only shrinks the toe block's tension area and the gage rules pass
//     on an interval, so the smallest gage that passes them dominates
//     every larger one.
//
// Flats are not searched across: J1.7 wants the bolt group on the bar's
// centre line, so the first gage line is derived, (width − (lines − 1)·
// gage2)/2, on the grid or off it; when the job fixes the gage (and not
// gage2) of a flat with several lines, gage2 is derived instead,
// (width − 2·gage)/(lines − 1). What the job fixes is held: a fixed gage
// that cannot be centred stays, and the eccentricity rule then fails
// (or, provided for, member.combined checks it).
//
// Ratios are compared to 6 decimals (closer ones are a tie, settled by
// the tie-breaks), so that rounding in sums of grid values never decides.
// The plate thickness is not in the objective before the ratio: at equal
// bolts, length and diameter a thicker plate that lowers the governing
// ratio wins, and a thinner one only on a tie.

// SearchMode chooses how propose walks the space.
type SearchMode int

const (
	// Pruned prunes with bounds and monotonicity (the default).
	Pruned SearchMode = iota
	// Exhaustive checks every candidate: the reference the pruned search
	// must agree with.
	Exhaustive
)

// ProposeOptions configure Propose.
type ProposeOptions struct {
	Mode SearchMode
	// Alternatives is how many layouts besides the chosen one to report.
	Alternatives int
	// MaxCandidates bounds the work; 0: no bound. The exhaustive search
	// is refused before it starts when the space holds more candidates;
	// the pruned one, whose count is not known ahead, stops when it has
	// checked that many. Either way Propose returns a *SearchLimitError.
	// A count, not a time, so that the outcome never depends on the
	// machine.
	MaxCandidates int
	// Progress, when set, is told how far the search is: done candidates
	// of total (the space, for the exhaustive search), or done checked of
	// an unknown total, -1 (the pruned search). The calls come one at a
	// time, with done never decreasing, from any goroutine.
	Progress func(done, total int)
}

// SearchLimitError is a search refused, or stopped, at
// ProposeOptions.MaxCandidates. It is bad input: the stock is what makes
// the search that large.
type SearchLimitError struct {
	File  string
	Mode  SearchMode
	Space int // candidates in the space (math.MaxInt: more than an int counts)
	// Checked is what the pruned search had checked when it stopped; 0
	// for the exhaustive search, refused before it starts.
	Checked int
	Limit   int
	// Outline: the job's plate.outline made the search exhaustive.
	Outline bool
}

func (e *SearchLimitError) Error() string {
	switch {
	case e.Outline:
		return fmt.Sprintf("%s: a plate outline is searched candidate by candidate, and this one has %d candidates, more than the limit of %d", e.File, e.Space, e.Limit)
	case e.Mode == Exhaustive:
		return fmt.Sprintf("%s: the exhaustive search has %d candidates, more than the limit of %d", e.File, e.Space, e.Limit)
	}
	return fmt.Sprintf("%s: the pruned search stopped at the limit of %d candidates checked, unfinished (the space has %d)", e.File, e.Limit, e.Space)
}

// DefaultMaxPerLine is the most bolts per gage line propose tries when
// stock.max_per_line is not given (common practice, no source).
const DefaultMaxPerLine = 10

// Layout is what propose chooses: the pattern keys of the bolts block and
// the plate's thickness and edge.
type Layout struct {
	Diameter       units.Length
	Grade          string
	Lines, PerLine int
	Pitch          units.Length // 0 with one bolt per line
	End, Gage      units.Length
	Gage2          units.Length // 0 with one line
	Stagger        units.Length // as the job fixes it; 0 otherwise
	PlateThickness units.Length // 0 without a plate
	PlateEdge      units.Length // 0 without a plate
	// Outline: the plate is the job's plate.outline; PlateEdge is then
	// measured, the last bolt to the outline's free edge (greatest x),
	// and not written into the job.
	Outline bool

	// spellings from the job file for the values chosen from the stock
	diameterText, thicknessText string
}

// Bolts is the number of bolts of the layout.
func (l Layout) Bolts() int { return l.Lines * l.PerLine }

// Alternative is another passing layout, the best of its arrangement
// (diameter, grade, lines and bolts per line).
type Alternative struct {
	Layout    Layout
	Length    units.Length // end + pattern length + plate edge
	Governing string
	Ratio     float64
}

// Blocker is a limit state or detailing rule that fails in every
// candidate, with what would lift it.
type Blocker struct {
	ID    string
	Ratio float64 // least ratio over the strongest layouts (0 for detailing)
	Text  string  // "member.yield needs Ag ≥ 2.9 in2 (has 2.48 in2)"
	Lift  string  // "choose a larger member"
}

// Proposal is the outcome of Propose.
type Proposal struct {
	Job    *jobfile.Job
	Layout Layout
	// Report is the check of the chosen layout (nil when nothing passes),
	// built from LayoutJob exactly as `gaugeline check` builds it.
	Report *detail.Report
	// LayoutJob is the job file with the layout filled in (nil when
	// nothing passes).
	LayoutJob []byte
	Length    units.Length
	// GageSource says where the gage comes from (GageUsual, GageNotUsual,
	// …), GageNote the same for people (why, when it is not the usual).
	GageSource, GageNote string
	Alternatives         []Alternative

	// Outline: the plate is the job's plate.outline, and the search
	// checked every candidate (outline.go).
	Outline bool

	Space     int // candidates in the space
	Evaluated int // candidates fully checked to find the choice
	// AltEvaluated and DiagEvaluated are further checks for the
	// alternatives and for explaining an infeasible job.
	AltEvaluated, DiagEvaluated int

	// Blockers explain why nothing passes (empty when a layout was found).
	Blockers []Blocker
	Summary  string // one line for an infeasible job
	// Remedies are the smallest changes beyond the stock with which a
	// layout passes, in remedy order (remedy.go); RemedyEvaluated the
	// checks their searches took. Empty when a layout was found.
	Remedies        []Remedy
	RemedyEvaluated int
}

// Found reports whether a passing layout was found.
func (p *Proposal) Found() bool { return p.Report != nil }

// Propose searches the job's stock for the best passing layout (SPEC §6).
// Bad input (no diameters, an unknown grade, explicit holes) is an
// *InputError, a search larger than opt.MaxCandidates a
// *SearchLimitError; a job where nothing passes is a Proposal with
// Blockers.
func Propose(j *jobfile.Job, opt ProposeOptions) (*Proposal, error) {
	j = withConnectors(j)
	p, err := newProblem(j)
	if err != nil {
		return nil, err
	}
	out := &Proposal{Job: j, Space: p.space(), Outline: p.outline}
	if p.outline {
		opt.Mode = Exhaustive // outline.go
	}
	if opt.MaxCandidates > 0 && opt.Mode == Exhaustive && out.Space > opt.MaxCandidates {
		return nil, &SearchLimitError{File: j.File, Mode: Exhaustive, Space: out.Space, Limit: opt.MaxCandidates, Outline: p.outline}
	}
	if opt.Mode == Pruned {
		// (the exhaustive search's diagnosis checks fewer than the space)
		p.limit = opt.MaxCandidates
	}
	if b := p.yieldBlocker(); b != nil {
		out.Blockers = []Blocker{*b}
		out.Summary = b.Text + ": " + b.Lift
		p.remedy(out)
		return out, nil
	}
	// There are never more alternatives than arrangements: the bound
	// keeps 1 + Alternatives from overflowing.
	nAlt := min(max(opt.Alternatives, 0), len(p.groups))
	var tops []*cand
	var other *cand
	if opt.Mode == Exhaustive {
		tops, other = p.exhaustiveTops(out, 1+nAlt, opt.Progress)
	} else {
		tops, other = p.prunedTops(out, nAlt, opt.Progress)
	}
	if err := p.limitError(out); err != nil {
		return nil, err
	}
	if len(tops) == 0 {
		return p.infeasible(out)
	}
	best := tops[0]
	out.GageSource, out.GageNote = p.gageSource(best)
	out.Layout = p.layout(best)
	out.Length = best.length()
	if nAlt > 0 {
		out.Alternatives = p.alternatives(tops, other, nAlt)
	}
	if out.Report, out.LayoutJob, err = p.checkChoice(best, out.Layout); err != nil {
		return nil, err
	}
	return out, nil
}

// exhaustiveTops runs the exhaustive search: the best layouts of the k
// best arrangements under the job's objective, best first, and the best
// under the other objective (nil: none).
func (p *problem) exhaustiveTops(out *Proposal, k int, progress func(done, total int)) (tops []*cand, other *cand) {
	bests, others := p.exhaustive(out.Space, progress)
	out.Evaluated = p.evals
	if len(others) > 0 {
		other = others[0]
	}
	return firstN(bests, k), other
}

// prunedTops runs the pruned search: the best layout first, then, when
// there is one and nAlt alternatives are asked for, the best of the
// 1 + nAlt best arrangements and the best under the other objective
// (nil: none), counting those checks apart.
func (p *problem) prunedTops(out *Proposal, nAlt int, progress func(done, total int)) (tops []*cand, other *cand) {
	p.cache = map[candKey]*detail.Report{}
	p.progress = progress
	tops = p.bestOfParts(p.obj, 1)
	out.Evaluated = p.evals
	if len(tops) > 0 && nAlt > 0 {
		tops = p.bestOfParts(p.obj, 1+nAlt)
		if o := p.bestOfParts(p.obj.other(), 1); len(o) > 0 {
			other = o[0]
		}
		out.AltEvaluated = p.evals - out.Evaluated
	}
	return tops, other
}

// limitError is the *SearchLimitError of a pruned search stopped at its
// limit, nil when it was not.
func (p *problem) limitError(out *Proposal) error {
	if !p.stopped {
		return nil
	}
	return &SearchLimitError{File: p.job.File, Mode: Pruned, Space: out.Space, Checked: p.checks, Limit: p.limit}
}

// infeasible finishes the proposal of a job where nothing passes: what
// blocks, and the checks spent finding out.
func (p *problem) infeasible(out *Proposal) (*Proposal, error) {
	before := p.evals
	p.diagnose(out)
	if err := p.limitError(out); err != nil {
		return nil, err
	}
	out.DiagEvaluated = p.evals - before
	return out, nil
}

// checkChoice writes the chosen layout l of candidate best into the job
// file and checks that job exactly as `gaugeline check` would, returning
// the report and the file. It panics when the check disagrees with the
// search's own model of the layout.
func (p *problem) checkChoice(best *cand, l Layout) (*detail.Report, []byte, error) {
	j := p.job
	data, err := WriteJob(j, l)
	if err != nil {
		return nil, nil, err
	}
	lj, err := jobfile.ParseJob(j.File, data)
	if err != nil {
		return nil, nil, fmt.Errorf("detail: propose wrote a job it cannot read: %w", err)
	}
	lj.Stamp = j.Stamp // the layout's files belong to the run that proposed it
	// Both ends, as check sees the written job: the far end of its own is
	// the job's as given (propose lays out the near end), and the member
	// must be long enough for both.
	r, err := detail.CheckJob(lj)
	if err != nil {
		return nil, nil, fmt.Errorf("detail: propose wrote a job that does not check: %w", err)
	}
	if !r.EndPass() {
		panic("detail: propose chose a layout that fails its check")
	}
	if got, want := r.GoverningResult().Ratio, best.rep.GoverningResult().Ratio; math.Abs(got-want) > 1e-9*max(1, want) {
		panic(fmt.Sprintf("detail: propose's model of the layout (ratio %v) differs from Build's (ratio %v)", want, got))
	}
	return r, data, nil
}

// firstN is the first n candidates of cs (all when fewer).
func firstN(cs []*cand, n int) []*cand {
	if len(cs) > n {
		return cs[:n]
	}
	return cs
}

// layout is candidate c as a Layout, with the job's spellings.
func (p *problem) layout(c *cand) Layout {
	g := c.g
	l := Layout{
		Diameter: g.d, Grade: p.grades[g.gi], Lines: g.lines, PerLine: g.perLine,
		Pitch: g.pitch[c.i], End: g.end[c.j], Gage: c.g1, Gage2: g.gage2[c.g2i], Stagger: g.stag,
		PlateThickness: g.tp, PlateEdge: g.edge[c.k],
		diameterText: p.diams[g.di].text, thicknessText: p.thick[g.ti].text,
	}
	if p.outline && c.rep != nil {
		l.Outline, l.PlateEdge = true, outlineEdge(c.rep.Design)
	}
	return l
}

// alternatives picks n layouts besides the choice tops[0]: the best of
// the next best arrangements, with the best under the other objective
// always among them when its arrangement differs.
func (p *problem) alternatives(tops []*cand, other *cand, n int) []Alternative {
	rest := slices.Clone(tops[1:])
	same := func(c *cand) bool { return c.g.arrangement() == other.g.arrangement() }
	if other != nil && !same(tops[0]) && !slices.ContainsFunc(rest, same) {
		if len(rest) >= n {
			rest = rest[:n-1]
		}
		rest = append(rest, other)
		slices.SortFunc(rest, func(a, b *cand) int { return compare(p.obj, a, b) })
	}
	var out []Alternative
	for _, c := range firstN(rest, n) {
		g := c.rep.GoverningResult()
		out = append(out, Alternative{Layout: p.layout(c), Length: c.length(), Governing: g.ID, Ratio: g.Ratio})
	}
	return out
}
