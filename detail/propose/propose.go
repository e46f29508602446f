package propose

import (
	"bytes"
	"cmp"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"runtime"
	"slices"
	"strconv"
	"strings"
	"sync"
	"text/tabwriter"

	"gaugeline/detail"
	"gaugeline/detail/detailing"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules"
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
//     one, and the shortest passing layouts lie on its staircase.
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
}

func (e *SearchLimitError) Error() string {
	if e.Mode == Exhaustive {
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
	LayoutJob    []byte
	Length       units.Length
	Alternatives []Alternative

	Space     int // candidates in the space
	Evaluated int // candidates fully checked to find the choice
	// AltEvaluated and DiagEvaluated are further checks for the
	// alternatives and for explaining an infeasible job.
	AltEvaluated, DiagEvaluated int

	// Blockers explain why nothing passes (empty when a layout was found).
	Blockers []Blocker
	Summary  string // one line for an infeasible job
}

// Found reports whether a passing layout was found.
func (p *Proposal) Found() bool { return p.Report != nil }

// Propose searches the job's stock for the best passing layout (SPEC §6).
// Bad input (no diameters, an unknown grade, explicit holes) is an
// *InputError, a search larger than opt.MaxCandidates a
// *SearchLimitError; a job where nothing passes is a Proposal with
// Blockers.
func Propose(j *jobfile.Job, opt ProposeOptions) (*Proposal, error) {
	p, err := newProblem(j)
	if err != nil {
		return nil, err
	}
	out := &Proposal{Job: j, Space: p.space()}
	if opt.MaxCandidates > 0 && opt.Mode == Exhaustive && out.Space > opt.MaxCandidates {
		return nil, &SearchLimitError{File: j.File, Mode: Exhaustive, Space: out.Space, Limit: opt.MaxCandidates}
	}
	if opt.Mode == Pruned {
		// (the exhaustive search's diagnosis checks fewer than the space)
		p.limit = opt.MaxCandidates
	}
	if b := p.yieldBlocker(); b != nil {
		out.Blockers = []Blocker{*b}
		out.Summary = b.Text + ": " + b.Lift
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
	tops = p.bestPerGroup(p.obj, 1)
	out.Evaluated = p.evals
	if len(tops) > 0 && nAlt > 0 {
		tops = p.bestPerGroup(p.obj, 1+nAlt)
		if o := p.bestPerGroup(p.obj.Other(), 1); len(o) > 0 {
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
	d, err := detail.Build(lj)
	if err != nil {
		return nil, nil, fmt.Errorf("detail: propose wrote a job that does not build: %w", err)
	}
	r, err := detail.Check(d)
	if err != nil {
		return nil, nil, err
	}
	if !r.Pass {
		panic("detail: propose chose a layout that fails its check")
	}
	if got, want := r.GoverningResult().Ratio, best.rep.GoverningResult().Ratio; math.Abs(got-want) > 1e-9*max(1, want) {
		panic(fmt.Sprintf("detail: propose's model of the layout (ratio %v) differs from Build's (ratio %v)", want, got))
	}
	return r, data, nil
}

func firstN(cs []*cand, n int) []*cand {
	if len(cs) > n {
		return cs[:n]
	}
	return cs
}

// eps is the geometric tolerance of the search, in mm.
const eps = 1e-6

// ---------------------------------------------------------------------
// The problem: groups and their ranges.

type problem struct {
	job    *jobfile.Job
	build  *detail.Builder
	ed     *rules.Edition
	step   units.Length
	obj    jobfile.Objective
	groups []*group

	diams  []option[units.Length]
	grades []string
	thick  []option[units.Length]

	snapped map[int]units.Length      // grid index → value
	grids   map[[2]int][]units.Length // grid index range → values, shared by the groups

	evals int
	cache map[candKey]*detail.Report // pruned search only; nil: no cache

	// checks counts the candidates eval checked (not from the cache);
	// at limit (0: none) eval checks no more and sets stopped.
	checks, limit int
	stopped       bool
	progress      func(done, total int) // pruned search only
}

// group is one arrangement: diameter, grade, plate thickness, lines and
// bolts per line, with the ranges of the rest.
type group struct {
	idx            int
	di, gi, ti     int
	d              units.Length
	tp             units.Length
	lines, perLine int
	nT             int
	tmpl           *detail.Design    // member, bolt, plate steel, demand; no holes
	shape          engine.HoleShape  // the member's holes
	plate          *engine.HoleShape // the plate's, nil when the member's; shared, never changed
	dx, dy         units.Length      // the member's hole extents
	fits           bool              // the hole fits the leg or flat at all
	viable         bool              // not ruled out by the bounds

	pitch, end, edge, gage2 []units.Length
	stag                    units.Length // stagger applied (lines > 1)
	segments                [][2]int     // pitch index runs with monotone feasibility

	gages map[int][]units.Length // by gage2 index
}

type option[T any] struct {
	v    T
	text string // as written in the job
}

// newProblem reads the job's stock into the search's groups, one per
// diameter, grade, plate thickness, lines and bolts per line, each with
// its ranges and whether the bounds leave it viable.
func newProblem(j *jobfile.Job) (*problem, error) {
	bld, err := detail.NewBuilder(j)
	if err != nil {
		return nil, err
	}
	ed := bld.Edition
	if j.Holes != nil {
		return nil, j.FieldError("holes", "propose lays out the bolts itself; explicit holes leave nothing to choose",
			"remove the holes list, or run gaugeline check")
	}
	p := &problem{job: j, build: bld, ed: ed, step: j.Stock.Step, obj: j.Stock.Objective, snapped: map[int]units.Length{},
		grids: map[[2]int][]units.Length{}}
	diams, err := stockDiameters(j)
	if err != nil {
		return nil, err
	}
	grades, err := stockGrades(j, ed)
	if err != nil {
		return nil, err
	}
	thick, err := stockThicknesses(j)
	if err != nil {
		return nil, err
	}
	if err := p.addGroups(diams, grades, thick, lineCounts(j), perLineCounts(j)); err != nil {
		return nil, err
	}
	p.diams, p.thick, p.grades = diams, thick, grades
	return p, nil
}

// stockDiameters lists the bolt diameters to try: the job's fixed one, or
// the stock's, with their spellings.
func stockDiameters(j *jobfile.Job) ([]option[units.Length], error) {
	var diams []option[units.Length]
	switch {
	case j.Bolts.Diameter > 0:
		diams = append(diams, option[units.Length]{j.Bolts.Diameter, j.Raw["bolts.diameter"]})
	case len(j.Stock.Diameters) > 0:
		for i, d := range j.Stock.Diameters {
			diams = append(diams, option[units.Length]{d, j.Raw[fmt.Sprintf("stock.diameters[%d]", i)]})
		}
	default:
		return nil, j.FieldError("stock.diameters", "propose needs the bolt diameters to try",
			"give stock.diameters: [3/4 in, 7/8 in] (us) or [M20, M22] (si), or fix bolts.diameter")
	}
	return diams, nil
}

// stockGrades lists the bolt grades to try: the job's fixed one, which
// the edition must know, or the stock's.
func stockGrades(j *jobfile.Job, ed *rules.Edition) ([]string, error) {
	switch {
	case j.Bolts.Grade != "":
		if _, err := ed.Bolt(j.Bolts.Grade); err != nil {
			return nil, j.FieldError("bolts.grade", fmt.Sprintf("unknown bolt grade %q in %s", j.Bolts.Grade, ed), "known grades: "+strings.Join(ed.BoltGrades(), ", "))
		}
		return []string{j.Bolts.Grade}, nil
	case len(j.Stock.Grades) > 0:
		return j.Stock.Grades, nil
	}
	return nil, j.FieldError("stock.grades", "propose needs the bolt grades to try",
		"give stock.grades: [A325] (us) or [A325M] (si), or fix bolts.grade")
}

// stockThicknesses lists the plate thicknesses to try, with their
// spellings: the plate's own, the stock's when it is auto, or 0 without
// a plate.
func stockThicknesses(j *jobfile.Job) ([]option[units.Length], error) {
	pl := j.Plate
	switch {
	case pl == nil:
		return []option[units.Length]{{0, ""}}, nil
	case !pl.AutoThickness:
		return []option[units.Length]{{pl.Thickness, j.Raw["plate.thickness"]}}, nil
	case len(j.Stock.Thicknesses) > 0:
		var thick []option[units.Length]
		for i, t := range j.Stock.Thicknesses {
			thick = append(thick, option[units.Length]{t, j.Raw[fmt.Sprintf("stock.thicknesses[%d]", i)]})
		}
		return thick, nil
	}
	return nil, j.FieldError("stock.thicknesses", "plate.thickness is auto but the stock has no thicknesses",
		"give stock.thicknesses: [3/8 in, 1/2 in, 5/8 in], or a plate thickness")
}

// lineCounts lists the numbers of gage lines to try: the job's, or 1 to
// stock.max_lines.
func lineCounts(j *jobfile.Job) []int {
	if j.Given("bolts.lines") {
		return []int{j.Bolts.Lines}
	}
	var lines []int
	for l := 1; l <= max(j.Stock.MaxLines, 1); l++ {
		lines = append(lines, l)
	}
	return lines
}

// perLineCounts lists the numbers of bolts per line to try: the job's, or
// 1 to stock.max_per_line (DefaultMaxPerLine when not given).
func perLineCounts(j *jobfile.Job) []int {
	if j.Given("bolts.per_line") {
		return []int{j.Bolts.PerLine}
	}
	maxN := j.Stock.MaxPerLine
	if maxN == 0 {
		maxN = DefaultMaxPerLine
	}
	var perLine []int
	for n := 1; n <= maxN; n++ {
		perLine = append(perLine, n)
	}
	return perLine
}

// addGroups adds a group for every diameter × grade × thickness × lines ×
// bolts per line, in that order, after refusing a step too fine for the
// ranges and a diameter the edition has no hole for.
func (p *problem) addGroups(diams []option[units.Length], grades []string, thick []option[units.Length], lines, perLine []int) error {
	j, ed := p.job, p.ed
	// The member depends on the plate thickness only (the gap of a double
	// angle); the bolt on diameter and grade.
	members := make([]*detail.Design, len(thick))
	for ti, t := range thick {
		var err error
		if members[ti], err = p.build.Template(t.v); err != nil {
			return err
		}
	}
	if err := p.checkStep(diams, members); err != nil {
		return err
	}
	for di, d := range diams {
		if _, err := ed.Hole(d.v, j.Bolts.Hole); err != nil {
			return detail.DiameterError(j, ed, err)
		}
		for gi, gr := range grades {
			for ti, t := range thick {
				tmpl, err := members[ti].WithBolt(ed, d.v, gr)
				if err != nil {
					return err
				}
				b := p.perBolt(tmpl)
				for _, l := range lines {
					for _, n := range perLine {
						g := &group{idx: len(p.groups), di: di, gi: gi, ti: ti, d: d.v, tp: t.v,
							lines: l, perLine: n, nT: l * n, tmpl: tmpl}
						p.ranges(g)
						g.viable = g.fits && b.pass(n*l)
						p.groups = append(p.groups, g)
					}
				}
			}
		}
	}
	return nil
}

// maxGridValues bounds the values of one searched range: a finer step is
// a typo, and would list (and search) billions of lengths. 1000 is a
// step of 1/128 in across an 8 in leg.
const maxGridValues = 1000

// checkStep refuses a step that puts more than maxGridValues values on
// the widest range searched: 4·d of the largest bolt (pitch, end, edge,
// gage2) or the member's width (the gage).
func (p *problem) checkStep(diams []option[units.Length], members []*detail.Design) error {
	reach, what := units.Length(0), ""
	for _, d := range diams {
		if 4*d.v > reach {
			reach, what = 4*d.v, "4·d of the largest bolt"
		}
	}
	for _, m := range members {
		if w := m.Conn.Member.Width; w > reach {
			reach, what = w, "the member's width"
		}
	}
	n := float64(reach / p.step)
	if n <= maxGridValues { // false for NaN too
		return nil
	}
	sys := p.job.Units
	return p.job.FieldError("stock.step", fmt.Sprintf("is too fine: %s, %s, would hold %.3g steps, at most %d",
		what, units.FormatJob(reach, sys), n, maxGridValues),
		fmt.Sprintf("use a step of at least %s (a shop lays bolts out on 1/16 in or 1 mm or coarser)",
			units.FormatJob(reach/maxGridValues, sys)))
}

// gridUp and gridDown round a length up or down to the step grid.
func (p *problem) gridUp(l units.Length) int   { return int(math.Ceil(float64(l/p.step) - 1e-9)) }
func (p *problem) gridDown(l units.Length) int { return int(math.Floor(float64(l/p.step) + 1e-9)) }

// grid lists k·step for k from lo to max(lo, hi), at least 1. The list
// is shared: never change it.
func (p *problem) grid(lo, hi int) []units.Length {
	lo = max(lo, 1)
	hi = max(hi, lo)
	if out, ok := p.grids[[2]int{lo, hi}]; ok {
		return out
	}
	out := make([]units.Length, 0, hi-lo+1)
	for k := lo; k <= hi; k++ {
		v, ok := p.snapped[k]
		if !ok {
			v = p.snap(units.Length(k) * p.step)
			p.snapped[k] = v
		}
		out = append(out, v)
	}
	p.grids[[2]int{lo, hi}] = out
	return out
}

// gridLen is len(p.grid(lo, hi)), without listing it.
func gridLen(lo, hi int) int {
	lo = max(lo, 1)
	return max(hi, lo) - lo + 1
}

// snap replaces a grid value by what its job-file spelling reads back as
// when that is within 1 nm (6 × 1/3 in is 2 in), so that a written layout
// reads "2 in" and checks exactly as it was chosen.
func (p *problem) snap(v units.Length) units.Length {
	sys := p.job.Units
	if back, err := units.ParseLength(units.FormatJob(v, sys), sys); err == nil && math.Abs(float64(back-v)) < 1e-6 {
		return back
	}
	return v
}

// minEdgeTo is the Table J3.4 minimum plus C2 of Table J3.5 for a hole of
// shape hs at an edge running along x (a side or toe) or along y (an end).
func (p *problem) minEdgeTo(g *group, hs engine.HoleShape, alongX bool) units.Length {
	emin, err := p.ed.MinEdge(g.d)
	if err != nil {
		return 0
	}
	c2, err := p.ed.EdgeIncrement(g.d, detailing.IncrementType(hs, alongX))
	if err != nil {
		return emin
	}
	return emin + c2
}

// ranges fills the group's hole size and the pitch, end, edge and gage2
// ranges: from the rule minimum on the step grid up to the smaller of
// the rule maximum and 4·d (SPEC §6); values the job fixes stay fixed.
func (p *problem) ranges(g *group) {
	j, ed := p.job, p.ed
	c := &g.tmpl.Conn
	m := &c.Member
	g.shape, g.plate, _ = p.build.PlyShapes(g.d) // tabulated: checked by newProblem
	g.dx, g.dy = g.shape.Dx, g.shape.Dy
	// Clear distances (360-22) hold in both plies: the larger hole sets them.
	plate := g.shape
	if g.plate != nil {
		plate = *g.plate
	}
	dxMax, dyMax := max(g.dx, plate.Dx), max(g.dy, plate.Dy)
	g.fits = g.dy <= m.ClearWidth()+eps
	g.gages = map[int][]units.Length{}
	four := p.gridDown(4 * g.d)

	tThin := m.T
	if c.Plate != nil {
		tThin = min(tThin, c.Plate.T)
	}
	switch {
	case g.perLine == 1:
		g.pitch = []units.Length{0}
	case j.Given("bolts.pitch"):
		g.pitch = []units.Length{j.Bolts.Pitch}
	default:
		lo := ed.MinSpacing(g.d)
		if ed.ClearSpacingRule() {
			lo = max(lo, g.d+dxMax)
		}
		g.pitch = p.grid(p.gridUp(lo), min(p.gridDown(ed.MaxSpacing(tThin, g.tmpl.Info.Weathering)), four))
	}
	if j.Given("bolts.end") {
		g.end = []units.Length{j.Bolts.End}
	} else {
		g.end = p.grid(p.gridUp(p.minEdgeTo(g, g.shape, false)), min(p.gridDown(ed.MaxEdge(m.T)), four))
	}
	switch {
	case c.Plate == nil:
		g.edge = []units.Length{0}
	case j.Plate.Edge > 0:
		g.edge = []units.Length{j.Plate.Edge}
	default:
		g.edge = p.grid(p.gridUp(p.minEdgeTo(g, plate, false)), min(p.gridDown(ed.MaxEdge(c.Plate.T)), four))
	}
	lo2 := ed.MinSpacing(g.d)
	if ed.ClearSpacingRule() {
		lo2 = max(lo2, g.d+dyMax)
	}
	switch {
	case g.lines == 1:
		g.gage2 = []units.Length{0}
	case j.Given("bolts.gage2"):
		g.gage2 = []units.Length{j.Bolts.Gage2}
	case m.Shape.CentredGroup() && j.Given("bolts.gage"):
		// J1.7: the fixed first line and the last one equally far from
		// the bar's edges; unless that is closer than the spacing rule,
		// when the lines are searched and the group left off-centre.
		if g2 := p.snap((m.Width - 2*j.Bolts.Gage) / units.Length(g.lines-1)); g2 >= lo2-eps {
			g.gage2 = []units.Length{g2}
		} else {
			g.gage2 = p.grid(p.gridUp(lo2), four)
		}
	default:
		g.gage2 = p.grid(p.gridUp(lo2), four)
	}
	if g.lines > 1 {
		g.stag = j.Bolts.Stagger
	}
	g.segments = p.segments(g)
}

// gagesFor lists the first gage line's positions for gage2 index i. On
// angles: from the smallest on-grid value that passes the gage and edge
// rules (clear of the fillet, wrench clearance, toe within 12t) to the
// largest that keeps the toe distance. On flats: the one position that
// centres the group on the bar (J1.7), if the edge distances allow it.
// The lists are kept only for the exhaustive search (fillGages): the
// gage2 × gage lists of a fine step would take more memory than the
// pruned search ever looks at.
func (p *problem) gagesFor(g *group, i int) []units.Length {
	if gs, ok := g.gages[i]; ok {
		return gs
	}
	gs, lo, hi, onGrid := p.gageSpan(g, i)
	if onGrid {
		return p.grid(lo, hi)
	}
	return gs
}

// gageCount is len(p.gagesFor(g, i)), without listing the grid.
func (p *problem) gageCount(g *group, i int) int {
	if gs, ok := g.gages[i]; ok {
		return len(gs)
	}
	gs, lo, hi, onGrid := p.gageSpan(g, i)
	if onGrid {
		return gridLen(lo, hi)
	}
	return len(gs)
}

// gageSpan is what gagesFor lists: the grid from index lo to hi when
// onGrid, else gs.
func (p *problem) gageSpan(g *group, i int) (gs []units.Length, lo, hi int, onGrid bool) {
	if p.job.Given("bolts.gage") {
		return []units.Length{p.job.Bolts.Gage}, 0, 0, false
	}
	m := &g.tmpl.Conn.Member
	span := units.Length(g.lines-1) * g.gage2[i]
	side := p.minEdgeTo(g, g.shape, true)
	maxEdge := p.ed.MaxEdge(m.T)
	if m.Shape.CentredGroup() {
		// J1.7: the group centred on the bar, where the edge rules let
		// it be.
		lo := max(side, g.dy/2, m.Width-span-maxEdge)
		hi := min(maxEdge, m.Width-span-side)
		if g1 := p.snap((m.Width - span) / 2); g1 >= lo-eps && g1 <= hi+eps {
			return []units.Length{g1}, 0, 0, false
		}
		return nil, 0, 0, false
	}
	gLo := max(g.tmpl.Info.K+g.dy/2, m.T+detailing.WrenchClearance(g.d, p.ed.System), g.dy/2, m.Width-span-maxEdge)
	gHi := m.Width - span - side
	return nil, p.gridUp(gLo), p.gridDown(gHi), true
}

// fillGages lists every group's gages ahead of the exhaustive search,
// whose workers only read them.
func (p *problem) fillGages() {
	for _, g := range p.groups {
		for i := range g.gage2 {
			g.gages[i] = p.gagesFor(g, i)
		}
	}
}

// segments splits the pitch range into runs where feasibility is monotone
// in pitch: the long-joint reduction of Fnv starts past a pattern length,
// and a pitch smaller than the stagger brings staggered holes closer as
// it grows.
func (p *problem) segments(g *group) [][2]int {
	limit, _ := p.ed.LongJoint()
	class := func(i int) int {
		s := g.pitch[i]
		if g.stag > 0 && s < g.stag-1e-9 && g.perLine > 1 {
			return -1 - i // a run of its own
		}
		if units.Length(g.perLine-1)*s+g.stag > limit+1e-6 {
			return 1
		}
		return 0
	}
	var segs [][2]int
	for i := range g.pitch {
		if n := len(segs); n > 0 && class(i) >= 0 && class(i) == class(segs[n-1][1]) {
			segs[n-1][1] = i
			continue
		}
		segs = append(segs, [2]int{i, i})
	}
	return segs
}

// boltBounds are the most one bolt can carry whatever the layout: its
// shear strength without the long-joint reduction, its slip resistance,
// and the bearing cap of its hole in the member and in the plate.
type boltBounds struct {
	demand units.Force
	avail  []units.Force // available strength of one bolt, per limit state
}

// pass reports whether n bolts could reach the demand in every bound; a
// strict test (ratio clearly over 1) so that rounding never prunes a
// layout that passes.
func (b boltBounds) pass(n int) bool {
	for _, a := range b.avail {
		if float64(b.demand) > float64(a)*float64(n)*(1+1e-6) {
			return false
		}
	}
	return true
}

// perBolt computes the bounds with the engine's own formulas on one hole
// far from every edge.
func (p *problem) perBolt(t *detail.Design) boltBounds {
	c := t.Conn
	far := units.Length(1e7)
	shape, plate, _ := p.build.PlyShapes(c.Bolt.D) // tabulated: checked by newProblem
	c.Holes = []engine.Hole{{X: far, Y: shape.Dy, HoleShape: shape, Plate: plate}}
	b := boltBounds{demand: c.Demand}
	b.avail = append(b.avail, engine.BoltShear(&c).Available, engine.MemberBearing(&c).Available)
	if c.Bolt.Joint == rules.SlipCritical {
		if s, err := engine.BoltSlip(&c); err == nil {
			b.avail = append(b.avail, s.Available)
		}
	}
	if c.Plate != nil {
		pl := *c.Plate
		pl.FreeEdge = 2 * far
		c.Plate = &pl
		b.avail = append(b.avail, engine.PlateBearing(&c).Available)
	}
	return b
}

// yieldBlocker returns member.yield when it fails: no layout helps.
func (p *problem) yieldBlocker() *Blocker {
	if len(p.groups) == 0 {
		return nil
	}
	c := &p.groups[0].tmpl.Conn
	r := engine.MemberYield(c)
	if r.Pass {
		return nil
	}
	sys := p.job.Units
	need := c.Member.Ag * units.Area(r.Ratio)
	return &Blocker{ID: r.ID, Ratio: r.Ratio,
		Text: fmt.Sprintf("member.yield needs Ag ≥ %s (has %s)", areaText(need, sys), areaText(c.Member.Ag, sys)),
		Lift: "choose a larger member or a stronger grade; no bolt layout changes gross yielding",
	}
}

func areaText(a units.Area, sys units.System) string {
	return units.Format(float64(a), units.DimArea, sys, units.Report.Places(-3))
}

func forceText(f units.Force, sys units.System) string {
	return units.Format(float64(f), units.DimForce, sys, units.Report)
}

// space counts the candidates in the space, math.MaxInt when they are
// more than an int counts.
func (p *problem) space() int {
	n := 0
	for _, g := range p.groups {
		per := mulSat(mulSat(len(g.pitch), len(g.end)), len(g.edge))
		for i := range g.gage2 {
			n = addSat(n, mulSat(per, p.gageCount(g, i)))
		}
	}
	return n
}

// addSat and mulSat add and multiply counts (≥ 0), math.MaxInt when the
// result is larger.
func addSat(a, b int) int {
	if a > math.MaxInt-b {
		return math.MaxInt
	}
	return a + b
}

func mulSat(a, b int) int {
	if a != 0 && b > math.MaxInt/a {
		return math.MaxInt
	}
	return a * b
}

// ---------------------------------------------------------------------
// Candidates.

// cand is one layout of a group: indexes into its ranges.
type cand struct {
	g       *group
	g2i     int
	g1      units.Length
	i, j, k int // pitch, end, edge
	lenNm   int64
	rep     *detail.Report
	ratioB  int64
}

type candKey struct {
	group, g2i int
	g1         int64
	i, j, k    int
}

func (c *cand) key() candKey {
	return candKey{c.g.idx, c.g2i, int64(math.Round(float64(c.g1) * 1e6)), c.i, c.j, c.k}
}

func (c *cand) length() units.Length {
	g := c.g
	return g.end[c.j] + units.Length(g.perLine-1)*g.pitch[c.i] + g.stag + g.edge[c.k]
}

func (p *problem) newCand(g *group, g2i int, g1 units.Length, i, j, k int) *cand {
	c := &cand{g: g, g2i: g2i, g1: g1, i: i, j: j, k: k}
	c.lenNm = int64(math.Round(float64(c.length()) * 1e6)) // nm: exact ties
	return c
}

// design builds the candidate's Design from the group's template in the
// steps Build takes; false when a hole leaves the member or the plate.
func (p *problem) design(c *cand) (*detail.Design, bool) {
	g := c.g
	t := g.tmpl
	d := &detail.Design{Job: p.job, Conn: t.Conn, Info: t.Info, Combination: t.Combination}
	pat := detail.Pattern{Lines: g.lines, PerLine: g.perLine, Pitch: g.pitch[c.i], End: g.end[c.j],
		Gage: c.g1, Gage2: g.gage2[c.g2i], Stagger: g.stag}
	if !d.PlaceHoles(pat.Centres(make([]engine.Hole, 0, g.nT)), g.shape, g.plate).OK() {
		return nil, false
	}
	if t.Conn.Plate != nil && d.PlacePlate(g.edge[c.k]) >= 0 {
		return nil, false
	}
	return d, true
}

// eval checks the candidate, through the cache when there is one, and
// counts the check; false when its holes leave a part.
func (p *problem) eval(c *cand) bool {
	if c.rep != nil {
		return true
	}
	if p.cache != nil {
		if r, ok := p.cache[c.key()]; ok {
			c.setReport(r)
			return r != nil
		}
	}
	if p.limit > 0 && p.checks >= p.limit {
		p.stopped = true
		return false
	}
	p.checks++
	if p.progress != nil {
		p.progress(p.checks, -1)
	}
	ok := p.check(c)
	if ok {
		p.evals++
	}
	if p.cache != nil {
		p.cache[c.key()] = c.rep
	}
	return ok
}

// check builds and checks the candidate; false when its holes leave a
// part. It changes nothing but c, so workers may call it at once.
func (p *problem) check(c *cand) bool {
	d, ok := p.design(c)
	if !ok {
		return false
	}
	r, err := detail.Check(d)
	if err != nil {
		return false // a lookup the edition cannot answer: not a candidate
	}
	c.setReport(r)
	return true
}

func (c *cand) setReport(r *detail.Report) {
	c.rep = r
	if r != nil {
		c.ratioB = ratioBucket(r.GoverningResult().Ratio)
	}
}

// ratioBucket is a ratio to 6 decimals: ratios that close are a tie,
// which the tie-breaks settle, so that rounding noise in sums of grid
// values never decides.
func ratioBucket(ratio float64) int64 {
	if math.IsNaN(ratio) || ratio > 1e12 {
		return math.MaxInt64
	}
	return int64(math.Round(ratio * 1e6))
}

func (c *cand) feasible() bool { return c.rep != nil && c.rep.Pass }

// cmpPrefix orders by the objective's first three keys.
func cmpPrefix(obj jobfile.Objective, nA int, lenA int64, dA units.Length, nB int, lenB int64, dB units.Length) int {
	if obj == jobfile.ShortestLength {
		return cmp.Or(cmp.Compare(lenA, lenB), cmp.Compare(nA, nB), cmp.Compare(dA, dB))
	}
	return cmp.Or(cmp.Compare(nA, nB), cmp.Compare(lenA, lenB), cmp.Compare(dA, dB))
}

// compare is the total order of SPEC §6 with its deterministic tie-breaks.
func compare(obj jobfile.Objective, a, b *cand) int {
	ga, gb := a.g, b.g
	return cmp.Or(
		cmpPrefix(obj, ga.nT, a.lenNm, ga.d, gb.nT, b.lenNm, gb.d),
		cmp.Compare(a.ratioB, b.ratioB),
		tieBreak(a, b),
	)
}

// tieBreak orders layouts of equal bolts, length, diameter and ratio.
func tieBreak(a, b *cand) int {
	ga, gb := a.g, b.g
	return cmp.Or(
		cmp.Compare(ga.gi, gb.gi),
		cmp.Compare(ga.tp, gb.tp),
		cmp.Compare(ga.lines, gb.lines),
		cmp.Compare(ga.perLine, gb.perLine),
		cmp.Compare(a.g1, b.g1),
		cmp.Compare(ga.gage2[a.g2i], gb.gage2[b.g2i]),
		cmp.Compare(ga.end[a.j], gb.end[b.j]),
		cmp.Compare(ga.pitch[a.i], gb.pitch[b.i]),
		cmp.Compare(ga.edge[a.k], gb.edge[b.k]),
		cmp.Compare(ga.idx, gb.idx),
	)
}

// ---------------------------------------------------------------------
// Exhaustive enumeration: the reference.

// exhaustive checks every candidate and returns the best of each
// arrangement, best first, under the job's objective, and the best of
// each group under the other one. Groups are shared out among the cores;
// progress (nil: none) hears of every candidate of the space. A panic on
// a worker is raised again on the caller's goroutine, where it can be
// recovered.
func (p *problem) exhaustive(space int, progress func(done, total int)) (bests, others []*cand) {
	p.fillGages()
	type result struct {
		best  *cand
		evals int
	}
	res := make([]result, len(p.groups))
	var mu sync.Mutex // serialises progress, guards done and failure
	done := 0
	var failure any
	failed := false
	tick := func(n int) {
		if progress == nil {
			return
		}
		mu.Lock()
		defer mu.Unlock()
		done += n
		progress(done, space)
	}
	next := make(chan int)
	var wg sync.WaitGroup
	for range max(1, runtime.GOMAXPROCS(0)) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for gi := range next { // after a failure: drain, check nothing
				func() {
					defer func() {
						if v := recover(); v != nil {
							mu.Lock()
							if !failed {
								failure, failed = v, true
							}
							mu.Unlock()
						}
					}()
					mu.Lock()
					stop := failed
					mu.Unlock()
					if !stop {
						res[gi].best, res[gi].evals = p.exhaustGroup(p.groups[gi], tick)
					}
				}()
			}
		}()
	}
	for gi := range p.groups {
		next <- gi
	}
	close(next)
	wg.Wait()
	if failed {
		panic(failure)
	}
	for _, r := range res {
		p.evals += r.evals
		if r.best != nil {
			bests = append(bests, r.best)
		}
	}
	others = slices.Clone(bests)
	slices.SortFunc(bests, func(a, b *cand) int { return compare(p.obj, a, b) })
	slices.SortFunc(others, func(a, b *cand) int { return compare(p.obj.Other(), a, b) })
	return onePerArrangement(bests), others
}

// tickEvery is how many candidates an exhaustive worker checks between
// progress reports.
const tickEvery = 256

// exhaustGroup checks every candidate of one group and returns the best
// and the number checked; tick hears how many were gone through.
func (p *problem) exhaustGroup(g *group, tick func(n int)) (best *cand, evals int) {
	seen := 0
	for g2i := range g.gage2 {
		for _, g1 := range g.gages[g2i] {
			for i := range g.pitch {
				for j := range g.end {
					for k := range g.edge {
						if seen++; seen == tickEvery {
							tick(seen)
							seen = 0
						}
						c := p.newCand(g, g2i, g1, i, j, k)
						if !p.check(c) {
							continue
						}
						evals++
						if !c.feasible() {
							c.rep = nil // keep memory flat: only the best stay
							continue
						}
						if best == nil || compare(p.obj, c, best) < 0 {
							best = c
						}
					}
				}
			}
		}
	}
	if seen > 0 {
		tick(seen)
	}
	return best, evals
}

// arrangement is what alternatives are told apart by: diameter, grade,
// lines and bolts per line (not the plate thickness).
type arrangement struct{ di, gi, lines, perLine int }

func (g *group) arrangement() arrangement { return arrangement{g.di, g.gi, g.lines, g.perLine} }

// onePerArrangement keeps the first (best) layout of each arrangement of
// a sorted list.
func onePerArrangement(cs []*cand) []*cand {
	seen := map[arrangement]bool{}
	out := cs[:0:0]
	for _, c := range cs {
		if a := c.g.arrangement(); !seen[a] {
			seen[a] = true
			out = append(out, c)
		}
	}
	return out
}

// ---------------------------------------------------------------------
// Pruned search.

// lowerLen is the shortest layout of a group, in nm.
func (g *group) lowerLen() int64 {
	l := g.end[0] + units.Length(g.perLine-1)*g.pitch[0] + g.stag + g.edge[0]
	return int64(math.Round(float64(l) * 1e6))
}

// bestPerGroup returns the best layout of each of the k best arrangements
// under obj, best first, pruning groups and layouts that cannot enter the
// k best. (A group whose bound is the k-th best cannot improve on an
// arrangement already among them either: that one is better still.)
func (p *problem) bestPerGroup(obj jobfile.Objective, k int) []*cand {
	order := slices.Clone(p.groups)
	slices.SortStableFunc(order, func(a, b *group) int {
		return cmp.Or(cmpPrefix(obj, a.nT, a.lowerLen(), a.d, b.nT, b.lowerLen(), b.d), cmp.Compare(a.idx, b.idx))
	})
	var list []*cand
	for _, g := range order {
		if p.stopped {
			break
		}
		if !g.viable {
			continue
		}
		var bound *cand
		if len(list) >= k {
			bound = list[k-1]
			if cmpPrefix(obj, g.nT, g.lowerLen(), g.d, bound.g.nT, bound.lenNm, bound.g.d) > 0 {
				continue
			}
		}
		s := &searcher{p: p, obj: obj, bound: bound}
		s.group(g)
		if s.best == nil {
			continue
		}
		list = append(list, s.best)
		slices.SortFunc(list, func(a, b *cand) int { return compare(obj, a, b) })
		list = firstN(onePerArrangement(list), k)
	}
	return list
}

// searcher finds the best layout of one group that could beat bound.
type searcher struct {
	p     *problem
	obj   jobfile.Objective
	bound *cand // nil: none
	best  *cand // best in the group so far
	// lastDead: the last run searched had no passing layout.
	lastDead bool
	// across holds, per gage2 index, layouts (pitch, end, edge) that fail
	// for a reason that does not depend on where the gage lines sit across
	// the member: they fail at every gage.
	across map[int][]probe
	// lowRatio holds, per gage2 index and pitch, end and edge, a lower
	// bound of the governing ratio at any gage (bucketed as cand.ratioB):
	// the highest ratio among the limit states that do not depend on the
	// gage, from a layout checked at some gage.
	lowRatio map[[4]int]int64
}

// allowed reports whether the layout c, whose governing ratio is at
// least low (bucketed; -1: unknown), could still beat the bound and the
// group's best. The ratio only matters at the same bolts, length and
// diameter, the tie-breaks only at the same ratio.
func (s *searcher) allowed(c *cand, low int64) bool {
	// a layout at the same bolts, length and diameter as b whose ratio is
	// at least low loses to b
	loses := func(b *cand) bool { return low > b.ratioB || low == b.ratioB && tieBreak(c, b) > 0 }
	if b := s.best; b != nil && (c.lenNm > b.lenNm || c.lenNm == b.lenNm && loses(b)) {
		return false
	}
	if b := s.bound; b != nil {
		g := c.g
		p := cmpPrefix(s.obj, g.nT, c.lenNm, g.d, b.g.nT, b.lenNm, b.g.d)
		if p > 0 || p == 0 && loses(b) {
			return false
		}
	}
	return true
}

// lowRatioOf returns the lower bound of the ratio of a layout, or -1.
func (s *searcher) lowRatioOf(g2i, i, j, k int) int64 {
	if v, ok := s.lowRatio[[4]int{g2i, i, j, k}]; ok {
		return v
	}
	return -1
}

// noteRatio records the gage-independent part of a checked layout's
// ratio for every gage.
func (s *searcher) noteRatio(g2i, i, j, k int, r *detail.Report) {
	low := 0.0
	for _, x := range r.Results {
		if !gageDependent(x.ID) {
			low = max(low, x.Ratio)
		}
	}
	if s.lowRatio == nil {
		s.lowRatio = map[[4]int]int64{}
	}
	key := [4]int{g2i, i, j, k}
	if b := ratioBucket(low); b > s.lowRatio[key] {
		s.lowRatio[key] = b
	}
}

func (s *searcher) offer(c *cand) {
	if !c.feasible() {
		return
	}
	if s.bound != nil && compare(s.obj, c, s.bound) >= 0 {
		return
	}
	if s.best == nil || compare(s.obj, c, s.best) < 0 {
		s.best = c
	}
}

func (s *searcher) group(g *group) {
	monotone := g.tmpl.Conn.Member.Shape.MonotoneGage()
	for g2i := range g.gage2 {
		for _, g1 := range s.p.gagesFor(g, g2i) {
			if s.p.stopped {
				return
			}
			tried, gageOK := false, false
			for _, seg := range g.segments {
				t, ok := s.sub(g, g2i, g1, seg[0], seg[1])
				tried = tried || t
				gageOK = gageOK || ok
			}
			// Angles: the smallest gage that passes the gage rules
			// dominates; with nothing tried, the bound cut every
			// layout, whatever the gage.
			if monotone && (gageOK || !tried) {
				break
			}
		}
	}
}

// probe is a checked layout of a monotone run.
type probe struct {
	i, j, k int
	feas    bool
}

// sub searches pitch indexes ia…ib of one gage position, where
// feasibility is monotone in pitch, end and edge. It reports whether it
// tried any layout (false: the bound cut them all) and whether a built
// layout passes the gage rules.
func (s *searcher) sub(g *group, g2i int, g1 units.Length, ia, ib int) (tried, gageOK bool) {
	r := s.newRun(g, g2i, g1, ia, ib)
	if !r.ok(ia, 0, 0) {
		return false, false
	}
	s.lastDead = r.search()
	r.offerShortest()
	return r.tried, r.gageOK
}

// run is the search of one monotone run of pitches (ia…ib) at one gage
// position: the layouts it has made (by pitch, end and edge index), the
// feasibility it knows, and the shortest passing layouts found so far.
type run struct {
	s      *searcher
	p      *problem
	g      *group
	g2i    int
	g1     units.Length
	ia, ib int
	nE, nK int // ends and edges

	known  []probe
	cands  map[[3]int]*cand
	mins   [][3]int // the passing layouts of length minLen
	minLen int64

	tried, gageOK bool
}

// newRun starts the run's search knowing what the group's searcher
// already learnt at other gages: layouts of this run that fail at every
// gage.
func (s *searcher) newRun(g *group, g2i int, g1 units.Length, ia, ib int) *run {
	r := &run{s: s, p: s.p, g: g, g2i: g2i, g1: g1, ia: ia, ib: ib, nE: len(g.end), nK: len(g.edge),
		cands: map[[3]int]*cand{}, minLen: math.MaxInt64}
	for _, q := range s.across[g2i] {
		if q.i >= ia && q.i <= ib { // monotone within this run only
			r.known = append(r.known, q)
		}
	}
	return r
}

// get returns the run's candidate at pitch i, end j and edge k, made once.
func (r *run) get(i, j, k int) *cand {
	c, ok := r.cands[[3]int{i, j, k}]
	if !ok {
		c = r.p.newCand(r.g, r.g2i, r.g1, i, j, k)
		r.cands[[3]int{i, j, k}] = c
	}
	return c
}

// check evaluates c unless it has a report, noting what it teaches (the
// gage rules, the gage-independent ratio), and reports whether it passes.
func (r *run) check(c *cand) bool {
	if c.rep == nil {
		r.tried = true
		if r.p.eval(c) {
			r.gageOK = r.gageOK || gageRulesPass(c.rep)
			r.s.noteRatio(r.g2i, c.i, c.j, c.k, c.rep)
		}
	}
	return c.feasible()
}

// feasible reports whether layout (i, j, k) passes: from a known layout
// that dominates it, else by checking it. A failure that does not depend
// on the gage is kept for the searcher's other gages.
func (r *run) feasible(i, j, k int) bool {
	for _, q := range r.known {
		if q.feas && q.i <= i && q.j <= j && q.k <= k {
			return true
		}
		if !q.feas && q.i >= i && q.j >= j && q.k >= k {
			return false
		}
	}
	c := r.get(i, j, k)
	f := r.check(c)
	r.known = append(r.known, probe{i, j, k, f})
	if !f && c.rep != nil && failsAtEveryGage(c.rep) {
		s := r.s
		if s.across == nil {
			s.across = map[int][]probe{}
		}
		s.across[r.g2i] = append(s.across[r.g2i], probe{i, j, k, false})
	}
	return f
}

// found records the passing layout (i, j, k) among the shortest.
func (r *run) found(i, j, k int) {
	l := r.get(i, j, k).lenNm
	switch {
	case l < r.minLen:
		r.minLen, r.mins = l, [][3]int{{i, j, k}}
	case l == r.minLen:
		r.mins = append(r.mins, [3]int{i, j, k})
	}
}

// ok reports whether layout (i, j, k) is worth looking at: no longer than
// the shortest found, and able to beat the bound and the group's best.
func (r *run) ok(i, j, k int) bool {
	c := r.get(i, j, k)
	return c.lenNm <= r.minLen && r.s.allowed(c, r.s.lowRatioOf(r.g2i, i, j, k))
}

// search finds the run's shortest passing layouts and reports whether
// the run is dead (its strongest layout fails). It probes the shortest
// layout first (when it passes it is the answer) unless the last run was
// dead, then the strongest (when it fails, so does every other). Either
// order is exact; this one checks less.
func (r *run) search() (dead bool) {
	ia, ib, nE, nK := r.ia, r.ib, r.nE, r.nK
	if r.s.lastDead && !r.feasible(ib, nE-1, nK-1) {
		return true
	}
	if r.feasible(ia, 0, 0) {
		r.found(ia, 0, 0) // the only layout of least length
		return false
	}
	if !r.feasible(ib, nE-1, nK-1) {
		return true // the strongest layout fails: so does every other
	}
	r.staircase()
	return false
}

// staircase walks the boundary of the passing layouts: for each pitch,
// the least end that passes with the largest edge (binary search,
// monotone in end), then for each end the least passing edge, which
// never grows with end.
func (r *run) staircase() {
	jTop := r.nE - 1
	for i := r.ia; i <= r.ib && r.ok(i, 0, 0); i++ {
		jmax := jTop
		for jmax > 0 && !r.ok(i, jmax, 0) {
			jmax--
		}
		if !r.feasible(i, jmax, r.nK-1) {
			continue
		}
		j0 := leastPassing(jmax, func(j int) bool { return r.feasible(i, j, r.nK-1) })
		jTop = j0 // never more with more pitch
		r.edges(i, j0)
	}
}

// edges walks the ends from j0 up at pitch i: for each, the least edge
// that passes, which never grows with end, until it is the least edge.
func (r *run) edges(i, j0 int) {
	kUp := r.nK - 1
	for j := j0; j < r.nE && r.ok(i, j, 0); j++ {
		kmax := kUp
		for kmax >= 0 && !r.ok(i, j, kmax) {
			kmax--
		}
		if kmax < 0 || !r.feasible(i, j, kmax) {
			continue
		}
		k := leastPassing(kmax, func(k int) bool { return r.feasible(i, j, k) })
		r.found(i, j, k)
		kUp = k
		if k == 0 {
			break
		}
	}
}

// leastPassing is the least index in 0…hi that passes, by binary search,
// when passing is monotone in the index and hi passes.
func leastPassing(hi int, pass func(int) bool) int {
	lo := 0
	for lo < hi {
		mid := (lo + hi) / 2
		if pass(mid) {
			hi = mid
		} else {
			lo = mid + 1
		}
	}
	return hi
}

// offerShortest checks the run's shortest passing layouts (each one, for
// its report) and offers them to the searcher.
func (r *run) offerShortest() {
	for _, m := range r.mins {
		c := r.get(m[0], m[1], m[2])
		r.check(c)
		r.s.offer(c)
	}
}

// failsAtEveryGage reports whether a failing report fails only checks
// that do not depend on where the gage lines sit across the member, so
// that the same pitch, end and edge fail at every gage: everything but
// the gage-dependent limit states (gageDependent), the gage and
// eccentricity rules and the edge distances to the member's toe or sides. Plate
// checks see the plate centred on the bolt group; net sections, Whitmore
// sections, bearing and spacing see only distances between holes.
func failsAtEveryGage(r *detail.Report) bool {
	failing := false
	for _, x := range r.Results {
		if x.Pass {
			continue
		}
		if gageDependent(x.ID) {
			return false
		}
		failing = true
	}
	for _, f := range r.Findings {
		if f.Pass || f.Advisory {
			continue
		}
		if isGageFinding(f) {
			return false
		}
		failing = true
	}
	return failing
}

// gageDependent: a limit state whose ratio depends on where the gage
// lines sit across the member: member block shear (its blocks reach the
// member's edges) and a flat's combined check (its moment arm is the
// group's offset from the bar's centre line).
func gageDependent(id string) bool {
	return id == "member.block-shear" || id == "member.combined"
}

// isGageFinding: a detailing finding that depends on where the gage
// lines sit across the member.
func isGageFinding(f detailing.Finding) bool {
	return f.ID == "gage.workable" || f.ID == "eccentricity" || (f.ID == "edge.min" || f.ID == "edge.max") &&
		(strings.HasSuffix(f.Where, "member toe") || strings.Contains(f.Where, "member edge (y"))
}

// gageRulesPass reports whether the rules that depend on where the gage
// lines sit across an angle leg pass: gage.workable and the edge
// distances to the member toe.
func gageRulesPass(r *detail.Report) bool {
	for _, f := range r.Findings {
		if !f.Pass && !f.Advisory && isGageFinding(f) {
			return false
		}
	}
	return true
}

// ---------------------------------------------------------------------
// Results.

func (p *problem) layout(c *cand) Layout {
	g := c.g
	return Layout{
		Diameter: g.d, Grade: p.grades[g.gi], Lines: g.lines, PerLine: g.perLine,
		Pitch: g.pitch[c.i], End: g.end[c.j], Gage: c.g1, Gage2: g.gage2[c.g2i], Stagger: g.stag,
		PlateThickness: g.tp, PlateEdge: g.edge[c.k],
		diameterText: p.diams[g.di].text, thicknessText: p.thick[g.ti].text,
	}
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

// ---------------------------------------------------------------------
// Infeasible jobs.

// diagnose explains why nothing passes. It checks the strongest layout of
// every monotone run (largest pitch, end and edge, every gage), so a limit
// state that fails in all of them fails in every candidate; the numbers
// come from the layout that does best in it.
func (p *problem) diagnose(out *Proposal) {
	corners, maxBolts, ok := p.corners()
	if !ok {
		return
	}
	if len(corners) == 0 {
		b := Blocker{ID: "fit", Text: "no candidate fits: every layout puts a hole off the member or the plate",
			Lift: "use a smaller bolt, a member with a wider connected leg, or a wider plate"}
		out.Blockers, out.Summary = []Blocker{b}, b.Text+": "+b.Lift
		return
	}
	out.Blockers = append(p.limitBlockers(corners, maxBolts), findingBlockers(corners)...)
	if len(out.Blockers) == 0 {
		out.Summary = p.closestSummary(corners)
		return
	}
	b := out.Blockers[0]
	out.Summary = b.Text + ": " + b.Lift
}

// corners checks the strongest layout of every monotone run of every
// group whose holes fit, and returns those that could be built and the
// most bolts of any group; false when the search stopped at its limit.
func (p *problem) corners() (corners []*cand, maxBolts int, ok bool) {
	for _, g := range p.groups {
		maxBolts = max(maxBolts, g.nT)
		if !g.fits {
			continue
		}
		for g2i := range g.gage2 {
			for _, g1 := range p.gagesFor(g, g2i) {
				if p.stopped {
					return nil, 0, false
				}
				for _, seg := range g.segments {
					c := p.newCand(g, g2i, g1, seg[1], len(g.end)-1, len(g.edge)-1)
					if p.eval(c) {
						corners = append(corners, c)
					}
				}
			}
		}
	}
	return corners, maxBolts, true
}

// limitBlockers are the limit states that fail in every corner, each with
// the numbers of the corner that does best in it, highest ratio first
// (ties in the order the reports list them).
func (p *problem) limitBlockers(corners []*cand, maxBolts int) []Blocker {
	type best struct {
		x engine.Result
		c *cand
	}
	var ids []string
	bestOf := map[string]best{}
	failsAll := map[string]bool{}
	for _, c := range corners {
		for _, x := range c.rep.Results {
			b, seen := bestOf[x.ID]
			if !seen {
				ids = append(ids, x.ID)
				failsAll[x.ID] = true
			}
			if !seen || x.Ratio < b.x.Ratio {
				bestOf[x.ID] = best{x, c}
			}
			failsAll[x.ID] = failsAll[x.ID] && !x.Pass
		}
	}
	var out []Blocker
	for _, id := range ids {
		if !failsAll[id] {
			continue
		}
		b := bestOf[id]
		text, lift := p.lift(b.x, b.c, maxBolts)
		out = append(out, Blocker{ID: id, Ratio: b.x.Ratio, Text: text, Lift: lift})
	}
	slices.SortStableFunc(out, func(a, b Blocker) int { return cmp.Compare(b.Ratio, a.Ratio) })
	return out
}

// findingBlockers are the non-advisory detailing rules that fail in every
// corner, by id, each with where it fails in the first corner.
func findingBlockers(corners []*cand) []Blocker {
	var failsAll map[string]*detailing.Finding
	for n, c := range corners {
		failing := map[string]*detailing.Finding{}
		for i := range c.rep.Findings {
			f := &c.rep.Findings[i]
			if !f.Pass && !f.Advisory && failing[f.ID] == nil {
				failing[f.ID] = f
			}
		}
		if n == 0 {
			failsAll = failing
			continue
		}
		for id := range failsAll {
			if failing[id] == nil {
				delete(failsAll, id)
			}
		}
	}
	var ids []string
	for id := range failsAll {
		ids = append(ids, id)
	}
	slices.Sort(ids)
	var out []Blocker
	for _, id := range ids {
		f := failsAll[id]
		out = append(out, Blocker{ID: id,
			Text: fmt.Sprintf("%s (%s) fails in every candidate: %s", id, f.Clause, f.Where),
			Lift: findingLift(id)})
	}
	return out
}

// closestSummary is the summary when every corner fails, but no single
// check fails in all of them: the corner of least governing ratio.
func (p *problem) closestSummary(corners []*cand) string {
	closest := corners[0]
	for _, c := range corners[1:] {
		if c.rep.GoverningResult().Ratio < closest.rep.GoverningResult().Ratio {
			closest = c
		}
	}
	g := closest.rep.GoverningResult()
	return fmt.Sprintf("no candidate passes every check, but no single check fails in all of them; the closest, %s, fails %s (ratio %.3f)",
		p.layout(closest).Describe(p.job.Units), g.ID, g.Ratio)
}

// lift words what a failing limit state needs, with numbers from the
// layout c that does best in it.
func (p *problem) lift(x engine.Result, c *cand, maxBolts int) (text, lift string) {
	sys := p.job.Units
	val := func(name string) float64 {
		for _, v := range x.Values {
			if v.Name == name {
				return v.V
			}
		}
		return 0
	}
	text = fmt.Sprintf("%s fails in every candidate: at best %s available for %s (ratio %.3f)",
		x.ID, forceText(x.Available, sys), forceText(x.Demand, sys), x.Ratio)
	g := c.g
	switch x.ID {
	case "member.rupture":
		Ae := units.Area(val("Ae"))
		text = fmt.Sprintf("member.rupture needs Ae ≥ %s (best layout has %s; ratio %.3f)",
			areaText(Ae*units.Area(x.Ratio), sys), areaText(Ae, sys), x.Ratio)
		lift = "choose a larger member or a stronger grade"
	case "member.block-shear", "member.bearing":
		lift = fmt.Sprintf("choose a thicker member (about %s instead of %s) or a stronger grade",
			units.FormatJob(thicknessUp(g.tmpl.Conn.Member.T*units.Length(x.Ratio), sys), sys), units.FormatJob(g.tmpl.Conn.Member.T, sys))
	case "plate.yield", "plate.rupture", "plate.block-shear", "plate.bearing":
		// strength is proportional to the plate thickness
		need := thicknessUp(g.tp*units.Length(x.Ratio), sys)
		text = fmt.Sprintf("%s needs a plate at least %s thick (the best layout, with %s, reaches ratio %.3f)",
			x.ID, units.FormatJob(need, sys), units.FormatJob(g.tp, sys), x.Ratio)
		lift = "choose a thicker plate or a stronger plate grade"
		if x.ID == "plate.yield" || x.ID == "plate.rupture" {
			lift = "choose a thicker or wider plate, or a stronger plate grade"
		}
	case "bolts.shear", "bolts.slip":
		per := x.Available / units.Force(max(val("n"), 1))
		need := int(math.Ceil(float64(x.Demand/per) - 1e-9))
		text = fmt.Sprintf("%s needs at least %d bolts of %s %s (the stock allows %d; at best ratio %.3f)",
			x.ID, need, detail.BoltSize(g.d, sys), p.grades[g.gi], maxBolts, x.Ratio)
		lift = "allow more bolts (stock.max_per_line, stock.max_lines), a larger diameter or a stronger grade"
		if x.ID == "bolts.slip" {
			lift += ", or a class B faying surface"
		}
	case "bolts.group":
		lift = "allow more bolts, or thicker parts"
	default:
		lift = "change the member, the plate or the stock"
	}
	return text, lift
}

// thicknessUp rounds a thickness up to the next 1/16 in (us) or 1 mm (si).
func thicknessUp(t units.Length, sys units.System) units.Length {
	unit := units.Inch / 16
	if sys == units.SI {
		unit = units.Millimetre
	}
	return units.Length(math.Ceil(float64(t/unit)-1e-9)) * unit
}

func findingLift(id string) string {
	switch id {
	case "hole.type":
		return "use a hole type the joint permits"
	case "gage.workable", "edge.min":
		return "use a smaller bolt or a member with a longer connected leg"
	case "edge.max", "spacing.max":
		return "use thicker parts or a smaller step"
	case "eccentricity":
		return "let propose centre the group on the bar (leave bolts.gage and gage2 free), or provide for the eccentricity (member.eccentricity: provided)"
	}
	return "change the bolt size or the member"
}

// ---------------------------------------------------------------------
// Output.

// Describe writes the layout in one line for people.
func (l Layout) Describe(sys units.System) string {
	s := fmt.Sprintf("%d × %s %s", l.Bolts(), detail.BoltSize(l.Diameter, sys), l.Grade)
	if l.Lines > 1 {
		s += fmt.Sprintf(" in %d lines of %d, gage2 %s", l.Lines, l.PerLine, units.FormatJob(l.Gage2, sys))
	}
	if l.PerLine > 1 {
		s += ", pitch " + units.FormatJob(l.Pitch, sys)
	}
	s += ", end " + units.FormatJob(l.End, sys) + ", gage " + units.FormatJob(l.Gage, sys)
	if l.PlateThickness > 0 {
		s += fmt.Sprintf(", plate %s with edge %s", units.FormatJob(l.PlateThickness, sys), units.FormatJob(l.PlateEdge, sys))
	}
	return s
}

// WriteJob returns the job file with the layout filled in: the pattern keys
// of the bolts block, and the plate's thickness and edge. Values the job
// fixed keep the user's spelling, chosen values are written as the job file
// writes them (jobfile.LengthText; stock spellings for diameters and
// thicknesses); every other key and comment stays as it was.
func WriteJob(j *jobfile.Job, l Layout) ([]byte, error) {
	sys := j.Units
	f := func(v units.Length) string { return jobfile.LengthText(v, sys) }
	bolt := func(key, value, tag string) jobfile.Setting {
		return jobfile.Setting{Block: "bolts", Key: key, Value: value, Tag: tag, Free: true}
	}
	set := []jobfile.Setting{
		bolt("diameter", l.diameterValue(sys), "!!str"),
		bolt("grade", l.Grade, "!!str"),
		bolt("lines", strconv.Itoa(l.Lines), "!!int"),
		bolt("per_line", strconv.Itoa(l.PerLine), "!!int"),
	}
	if l.PerLine > 1 {
		set = append(set, bolt("pitch", f(l.Pitch), "!!str"))
	}
	set = append(set, bolt("end", f(l.End), "!!str"), bolt("gage", f(l.Gage), "!!str"))
	if l.Lines > 1 {
		set = append(set, bolt("gage2", f(l.Gage2), "!!str"))
	}
	if j.Plate != nil {
		if j.Plate.AutoThickness {
			set = append(set, jobfile.Setting{Block: "plate", Key: "thickness", Value: l.thicknessValue(sys), Tag: "!!str"})
		}
		set = append(set, jobfile.Setting{Block: "plate", Key: "edge", Value: f(l.PlateEdge), Tag: "!!str", Free: true})
	}
	return j.Rewrite(set)
}

// diameterValue is the diameter as the job file writes it.
func (l Layout) diameterValue(sys units.System) string {
	if l.diameterText != "" {
		return l.diameterText
	}
	if sys == units.SI {
		return fmt.Sprintf("M%g", l.Diameter.Mm())
	}
	return units.FormatJob(l.Diameter, sys)
}

func (l Layout) thicknessValue(sys units.System) string {
	if l.thicknessText != "" {
		return l.thicknessText
	}
	return units.FormatJob(l.PlateThickness, sys)
}

type jsonLayout struct {
	Diameter string `json:"diameter"`
	Grade    string `json:"grade"`
	Lines    int    `json:"lines"`
	PerLine  int    `json:"per_line"`
	Pitch    string `json:"pitch,omitempty"`
	End      string `json:"end"`
	Gage     string `json:"gage"`
	Gage2    string `json:"gage2,omitempty"`
	Stagger  string `json:"stagger,omitempty"`
}

type jsonPlateLayout struct {
	Thickness string `json:"thickness"`
	Edge      string `json:"edge"`
}

func (l Layout) json(sys units.System) (jsonLayout, *jsonPlateLayout) {
	f := func(v units.Length) string { return jobfile.LengthText(v, sys) }
	jl := jsonLayout{Diameter: l.diameterValue(sys), Grade: l.Grade, Lines: l.Lines, PerLine: l.PerLine,
		End: f(l.End), Gage: f(l.Gage)}
	if l.PerLine > 1 {
		jl.Pitch = f(l.Pitch)
	}
	if l.Lines > 1 {
		jl.Gage2 = f(l.Gage2)
		if l.Stagger > 0 {
			jl.Stagger = f(l.Stagger)
		}
	}
	if l.PlateThickness == 0 {
		return jl, nil
	}
	return jl, &jsonPlateLayout{Thickness: l.thicknessValue(sys), Edge: f(l.PlateEdge)}
}

// lengthJSON is a connection length in the job's units, rid of the
// rounding noise of summing grid values (they lie on a 1e-9 grid).
func lengthJSON(l units.Length, sys units.System) detail.JSONNum {
	return detail.JSONNum(math.Round(sys.ToJob(float64(l), units.DimLength)*1e9) / 1e9)
}

type jsonAlternative struct {
	Layout    jsonLayout       `json:"layout"`
	Plate     *jsonPlateLayout `json:"plate,omitempty"`
	Bolts     int              `json:"bolts"`
	Length    detail.JSONNum   `json:"length"`
	Governing string           `json:"governing"`
	Ratio     detail.JSONNum   `json:"ratio"`
}

type jsonSearch struct {
	Mode          string `json:"mode"`
	Objective     string `json:"objective"`
	Space         int    `json:"space"`
	Evaluated     int    `json:"evaluated"`
	AltEvaluated  int    `json:"evaluated_alternatives"`
	DiagEvaluated int    `json:"evaluated_diagnosis,omitempty"`
}

type jsonProposal struct {
	detail.Document
	Layout       jsonLayout        `json:"layout"`
	Plate        *jsonPlateLayout  `json:"plate,omitempty"`
	Bolts        int               `json:"bolts"`
	Length       detail.JSONNum    `json:"length"`
	Alternatives []jsonAlternative `json:"alternatives"`
	Search       jsonSearch        `json:"search"`
}

type jsonBlocker struct {
	ID    string         `json:"id"`
	Ratio detail.JSONNum `json:"ratio,omitempty"`
	What  string         `json:"what"`
	Lift  string         `json:"lift"`
}

type jsonInfeasible struct {
	Mark       string        `json:"mark"`
	Standard   string        `json:"standard"`
	Method     string        `json:"method"`
	Units      string        `json:"units"`
	UnitLabels units.Labels  `json:"unit_labels"`
	Verdict    string        `json:"verdict"`
	Message    string        `json:"message"`
	Blocking   []jsonBlocker `json:"blocking"`
	Search     jsonSearch    `json:"search"`
	Cautions   []string      `json:"cautions"`
	Stamp      string        `json:"stamp,omitempty"`
}

func (p *Proposal) search(mode SearchMode) jsonSearch {
	m := "pruned"
	if mode == Exhaustive {
		m = "exhaustive"
	}
	return jsonSearch{Mode: m, Objective: p.Job.Stock.Objective.String(), Space: p.Space, Evaluated: p.Evaluated,
		AltEvaluated: p.AltEvaluated, DiagEvaluated: p.DiagEvaluated}
}

// JSON returns the proposal as indented JSON: the check JSON of the chosen
// layout (SPEC §9) plus "layout", "plate", "alternatives" and "search";
// or, when nothing passes, the verdict "infeasible" with what blocks.
func (p *Proposal) JSON(mode SearchMode) ([]byte, error) {
	sys := p.Job.Units
	var doc any
	if p.Found() {
		jl, jp := p.Layout.json(sys)
		d := jsonProposal{Document: p.Report.Document(), Layout: jl, Plate: jp, Bolts: p.Layout.Bolts(),
			Length: lengthJSON(p.Length, sys), Alternatives: []jsonAlternative{},
			Search: p.search(mode)}
		for _, a := range p.Alternatives {
			al, ap := a.Layout.json(sys)
			d.Alternatives = append(d.Alternatives, jsonAlternative{Layout: al, Plate: ap, Bolts: a.Layout.Bolts(),
				Length: lengthJSON(a.Length, sys), Governing: a.Governing, Ratio: detail.JSONNum(a.Ratio)})
		}
		doc = d
	} else {
		d := jsonInfeasible{Mark: p.Job.Mark, Standard: p.Job.Standard, Method: p.Job.Method.String(), Units: sys.String(),
			UnitLabels: sys.Labels(), Verdict: "infeasible", Message: p.Summary, Blocking: []jsonBlocker{},
			Search: p.search(mode), Cautions: []string{detail.Caution}, Stamp: p.Job.Stamp}
		for _, b := range p.Blockers {
			d.Blocking = append(d.Blocking, jsonBlocker{ID: b.ID, Ratio: detail.JSONNum(b.Ratio), What: b.Text, Lift: b.Lift})
		}
		doc = d
	}
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetIndent("", "  ")
	if err := enc.Encode(doc); err != nil {
		return nil, fmt.Errorf("detail: encoding proposal: %w", err)
	}
	return b.Bytes(), nil
}

// writeHead writes the proposal's own part: the layout as a bolts block,
// the search and the alternatives.
func (p *Proposal) writeHead(b *strings.Builder, mode SearchMode, md bool) {
	sys := p.Job.Units
	s := p.search(mode)
	obj := "fewest bolts, then shortest"
	if p.Job.Stock.Objective == jobfile.ShortestLength {
		obj = "shortest, then fewest bolts"
	}
	if md {
		fmt.Fprintf(b, "# %s — proposed layout\n\n", p.Job.Mark)
	} else {
		fmt.Fprintf(b, "%s — proposed layout\n", p.Job.Mark)
	}
	fmt.Fprintf(b, "objective: %s; %s search checked %d of %d candidates\n", obj, s.Mode, p.Evaluated, p.Space)
	if !p.Found() {
		fmt.Fprintf(b, "\nno layout passes: %s\n", p.Summary)
		for _, bl := range p.Blockers[min(1, len(p.Blockers)):] {
			fmt.Fprintf(b, "  also: %s: %s\n", bl.Text, bl.Lift)
		}
		return
	}
	jl, jp := p.Layout.json(sys)
	fence := ""
	if md {
		fence = "```yaml\n"
		b.WriteString("\n" + fence)
	} else {
		b.WriteString("\n")
	}
	fmt.Fprintf(b, "bolts:\n  diameter: %s\n  grade: %s\n  lines: %d\n  per_line: %d\n", jl.Diameter, jl.Grade, jl.Lines, jl.PerLine)
	if jl.Pitch != "" {
		fmt.Fprintf(b, "  pitch: %s\n", jl.Pitch)
	}
	fmt.Fprintf(b, "  end: %s\n  gage: %s\n", jl.End, jl.Gage)
	if jl.Gage2 != "" {
		fmt.Fprintf(b, "  gage2: %s\n", jl.Gage2)
	}
	if jl.Stagger != "" {
		fmt.Fprintf(b, "  stagger: %s\n", jl.Stagger)
	}
	if jp != nil {
		fmt.Fprintf(b, "plate:\n  thickness: %s\n  edge: %s\n", jp.Thickness, jp.Edge)
	}
	if md {
		b.WriteString("```\n")
	}
	fmt.Fprintf(b, "\n%d bolts, connection length %s\n", p.Layout.Bolts(), units.FormatJob(p.Length, sys))
	if len(p.Alternatives) > 0 {
		if md {
			b.WriteString("\n## Alternatives\n\n| bolts | length | layout | governing | ratio |\n|---:|---:|---|---|---:|\n")
			for _, a := range p.Alternatives {
				fmt.Fprintf(b, "| %d | %s | %s | %s | %.3f |\n", a.Layout.Bolts(), units.FormatJob(a.Length, sys), a.Layout.Describe(sys), a.Governing, a.Ratio)
			}
		} else {
			b.WriteString("\nalternatives:\n")
			tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
			fmt.Fprintf(tw, "  BOLTS\tLENGTH\tLAYOUT\tGOVERNING\tRATIO\n")
			for _, a := range p.Alternatives {
				fmt.Fprintf(tw, "  %d\t%s\t%s\t%s\t%.3f\n", a.Layout.Bolts(), units.FormatJob(a.Length, sys), a.Layout.Describe(sys), a.Governing, a.Ratio)
			}
			tw.Flush()
		}
	}
	b.WriteString("\n")
}

// WriteText writes the proposal for a terminal: the layout, the
// alternatives and the full check of the layout.
func (p *Proposal) WriteText(w io.Writer, mode SearchMode) error {
	var b strings.Builder
	p.writeHead(&b, mode, false)
	if _, err := io.WriteString(w, b.String()); err != nil {
		return err
	}
	if p.Found() {
		return p.Report.WriteText(w)
	}
	_, err := fmt.Fprintf(w, "\nnote: %s\n", detail.Caution)
	return err
}

// WriteMarkdown writes the proposal as Markdown.
func (p *Proposal) WriteMarkdown(w io.Writer, mode SearchMode) error {
	var b strings.Builder
	p.writeHead(&b, mode, true)
	if _, err := io.WriteString(w, b.String()); err != nil {
		return err
	}
	if p.Found() {
		return p.Report.WriteMarkdown(w)
	}
	_, err := fmt.Fprintf(w, "\n> %s\n", detail.Caution)
	return err
}
