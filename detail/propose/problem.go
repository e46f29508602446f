package propose

import (
	"fmt"
	"maps"
	"math"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/detailing"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// The problem: the job's stock read into groups (diameter, grade, plate
// thickness, lines, bolts per line), each with its ranges on the step grid,
// and the bounds that rule groups out before any layout is checked.

// eps is the geometric tolerance of the search, in mm.
const eps = 1e-6

// problem is one job's search: the stock read into groups, the grids
// they share, and what the search has checked so far.
type problem struct {
	job    *jobfile.Job
	build  *detail.Builder
	ed     *rules.Edition
	step   units.Length
	obj    order
	groups []*group

	// usual is the connected leg's usual gage lines (zero: none, or the
	// job fixes the gage); usualPitch the usual pitch; part the part of
	// the space the pruned search walks (partAll unless the order has the
	// usual gage and the leg one).
	usual      section.UsualGages
	usualPitch units.Length
	part       part

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

	// outline: the plate is the job's plate.outline, fixed in the
	// member's frame. Its free edge does not move with the bolt group,
	// so more pitch or end brings the last bolt nearer to it: the pruned
	// search's monotonicity does not hold, and every candidate is checked
	// (outline.go).
	outline bool
	// splitEnds: more end can lower a strength (a splice plate in
	// compression buckles over 2·end + gap between the groups), so each
	// end distance is a group of its own (byEnd).
	splitEnds bool
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

	// usualG1, usualG2: the group's usual first gage and gage2 (0: the
	// group has no usual gage lines: more than two lines, or the leg none)
	usualG1, usualG2 units.Length
}

// option is a stock value to try, with its spelling in the job file.
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
	p := &problem{job: j, build: bld, ed: ed, step: j.Stock.Step, obj: orderOf(j.Stock), snapped: map[int]units.Length{},
		grids: map[[2]int][]units.Length{}, outline: j.Plate != nil && j.Plate.Outline != nil}
	p.splitEnds = j.Plate != nil && j.Plate.Kind == engine.Splice && j.Pushes()
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
	p.usualPitch = usualPitchOf(j.Units)
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
	p.usual = usualOf(j, members[0].Conn.Member.Width)
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
						p.setUsual(g)
						p.ranges(g)
						g.viable = g.fits && b.pass(n*l)
						p.groups = append(p.groups, p.byEnd(g)...)
					}
				}
			}
		}
	}
	return nil
}

// byEnd is group g, or where more end can lower a strength (a splice
// plate in compression: splitEnds) one group per end distance, each
// monotone in pitch and edge alone; the search and the enumeration then
// see the same groups.
func (p *problem) byEnd(g *group) []*group {
	if !p.splitEnds || len(g.end) < 2 {
		return []*group{g}
	}
	out := make([]*group, len(g.end))
	for j, e := range g.end {
		c := *g
		c.idx = len(p.groups) + j
		c.end = []units.Length{e}
		c.gages = maps.Clone(g.gages)
		out[j] = &c
	}
	return out
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
	case c.Plate == nil, p.outline: // an outline's free edge is where the job draws it
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
		if g.usualG2 >= lo2-eps { // the usual gage2 is always tried (may be past 4·d)
			g.gage2 = withValue(g.gage2, g.usualG2)
		}
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
		lo, hi := g.dy/2, m.Width-span-g.dy/2
		// the edge rules hold only toward free edges: a channel's web
		// ends in its flanges
		if low, high := m.Shape.FreeEdges(); low || high {
			lo = max(side, g.dy/2, m.Width-span-maxEdge)
			hi = min(maxEdge, m.Width-span-side)
		}
		if g1 := p.snap((m.Width - span) / 2); g1 >= lo-eps && g1 <= hi+eps && p.junctionsClear(g, g1, g.gage2[i]) {
			return []units.Length{g1}, 0, 0, false
		}
		return nil, 0, 0, false
	}
	gLo, gHi := p.gageLimits(g, span, side, maxEdge)
	lo, hi = p.gridUp(gLo), p.gridDown(gHi)
	if u := g.usualG1; u > 0 && u >= gLo-eps && u <= gHi+eps {
		// the usual gage is always tried, on the step grid or off it
		if gs := withValue(p.grid(lo, hi), u); len(gs) != gridLen(lo, hi) || lo > hi {
			return gs, 0, 0, false
		}
	}
	return nil, lo, hi, true
}

// gageLimits are the least and largest first gage of an angle leg: clear
// of the fillet (k) and with the wrench's clearance from the outstanding
// leg, each with a margin of the job's position tolerance so that a hole
// drilled that much toward the heel still passes gage.workable when
// reverified (propose only; check holds the rule itself), and no farther
// than the edge rules allow from the toe.
func (p *problem) gageLimits(g *group, span, side, maxEdge units.Length) (lo, hi units.Length) {
	m := &g.tmpl.Conn.Member
	tol := p.job.Tolerance.Position
	clear := max(g.tmpl.Info.K+g.dy/2, m.T+detailing.WrenchClearance(g.d, p.ed.System())) + tol
	return max(clear, g.dy/2, m.Width-span-maxEdge), m.Width - span - side
}

// junctionsClear reports whether the group's lines, the first at g1 and
// the others gage2 apart, keep clear of the member's junctions (a stem, a
// web, a channel's flanges) by the fillet and the wrench clearance of
// gage.workable, and by tolerance.position more (propose only, as
// gageLimits keeps it for angles): a hole drilled that far off still
// passes.
func (p *problem) junctionsClear(g *group, g1, gage2 units.Length) bool {
	m := &g.tmpl.Conn.Member
	tol := p.job.Tolerance.Position
	wrench := detailing.WrenchClearance(g.d, p.ed.System())
	for k := 0; k < g.lines; k++ {
		y := g1 + units.Length(k)*gage2
		for _, j := range m.Junctions {
			for _, side := range j.Sides() {
				off := j.Offset(y, side)
				if off < -eps {
					continue // on the other side
				}
				if off-g.dy/2 < j.Toe+tol-eps || off-j.Face < wrench+tol-eps {
					return false
				}
			}
			if j.Side == 0 && math.Abs(float64(y-j.At)) <= eps {
				return false
			}
		}
	}
	return true
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
