package propose

import (
	"cmp"
	"errors"
	"fmt"
	"slices"
	"strconv"
	"strings"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// What would make it pass: when nothing in the job's stock passes, the
// same pruned search is run again on the job with one stock limit
// relaxed at a time, each relaxation a list of changes tried smallest
// first, and the first change of each relaxation that passes is a
// Remedy.
//
// The relaxations, in the order of how small a change they are (the
// order Remedies are listed in):
//
//  1. grade: a stronger bolt grade of the edition (Fnv above every grade
//     tried), weakest first: the same holes and layout, another bolt bought;
//  2. diameter: the next two standard diameters beyond the largest tried:
//     larger holes, bolts bought;
//  3. plate: the next three standard plate thicknesses beyond the
//     thickest tried (a plate in the job only): plate stock bought;
//  4. per-line: one, two or three bolts per line more than tried: a
//     longer connection, same parts;
//  5. lines: one gage line more than tried: a wider pattern on the same
//     connected leg;
//  6. member: a larger catalog angle, by area, with the same connected leg
//     first (at most six searched, sixty tried; catalog angles without
//     property overrides only): a change to the structure the engineer of record
//     has to approve.
//
// Each remedy's layout is chosen and checked exactly as Propose chooses
// and checks one (checkChoice), on the job file with the change written
// in. A change's search stops at remedyLimit checks, and the remedy
// search as a whole at remedyBudget (whatever the job's own limit, so
// that a proposal does not depend on it): a change whose search would go
// further is left out, so that the time spent stays bounded.

// RemedyKind is the stock limit a remedy relaxes.
type RemedyKind int

const (
	RemedyGrade    RemedyKind = iota // a stronger bolt grade
	RemedyDiameter                   // a larger bolt
	RemedyPlate                      // a thicker plate
	RemedyPerLine                    // more bolts per gage line
	RemedyLines                      // one more gage line
	RemedyMember                     // a larger member
)

var remedyKinds = [...]string{"grade", "diameter", "plate", "per-line", "lines", "member"}

// String is the kind's name in JSON: grade, diameter, plate, per-line,
// lines, member.
func (k RemedyKind) String() string { return remedyKinds[k] }

// Remedy is a change beyond the job's stock with which a layout passes.
type Remedy struct {
	Kind RemedyKind
	// Change says what changes, for people: "bolt grade A490 (stock: A325)".
	Change string
	// Value is the new value as the job file writes it: "A490", "1-1/8 in",
	// "5/8 in", "4", "L5x5x1/2".
	Value string
	// Member is the member's designation when the remedy changes it, "" when not.
	Member    string
	Layout    Layout
	Length    units.Length // end + pattern length + plate edge
	Governing string
	Ratio     float64
	// Job is the job file with the change and the layout written in.
	Job []byte
}

// remedyLimit bounds the checks of one change's search, remedyBudget
// those of all of them: counts, not times, so that the outcome never
// depends on the machine. The pruned search of every job under
// testdata/propose checks at most 133 candidates.
const (
	remedyLimit  = 20_000
	remedyBudget = 100_000
)

// change is one job file a relaxation tries: the settings that write it.
type change struct {
	set    []jobfile.Setting
	value  string // the new value, as the job file writes it
	text   string // what changes, for people
	member string // the new member's designation ("" unchanged)
}

// relaxation lists the changes of one kind, smallest first. searched,
// when not 0, bounds the changes tried that needed a search: those that
// fail before any layout is checked (gross yielding, the bolt-count
// bounds) cost next to nothing and are not counted.
type relaxation struct {
	kind     RemedyKind
	changes  func(p *problem) []change
	searched int
}

// relaxations are the stock limits a remedy may relax, in remedy order.
var relaxations = []relaxation{
	{RemedyGrade, strongerGrades, 0},
	{RemedyDiameter, largerDiameters, 0},
	{RemedyPlate, thickerPlates, 0},
	{RemedyPerLine, morePerLine, 0},
	{RemedyLines, moreLines, 0},
	{RemedyMember, largerMembers, maxMemberSearches},
}

// remedy fills out.Remedies: the first passing change of every
// relaxation, in remedy order, and the checks they took.
func (p *problem) remedy(out *Proposal) {
	budget := remedyBudget
	for _, r := range relaxations {
		searched := 0
		for _, c := range r.changes(p) {
			if r.searched > 0 && searched == r.searched || budget <= 0 {
				break
			}
			rem, checks, ok := p.tryChange(r.kind, c, min(remedyLimit, budget))
			out.RemedyEvaluated += checks
			budget -= checks
			if ok {
				out.Remedies = append(out.Remedies, rem)
				break
			}
			if checks > 0 {
				searched++
			}
		}
	}
}

// tryChange runs the pruned search on the job with change c written in,
// and returns the remedy when a layout passes, with the checks spent.
func (p *problem) tryChange(kind RemedyKind, c change, limit int) (Remedy, int, bool) {
	data, err := p.job.Rewrite(c.set)
	if err != nil {
		return Remedy{}, 0, false
	}
	j, err := jobfile.ParseJob(p.job.File, data)
	if err != nil {
		return Remedy{}, 0, false // a change the job file cannot hold (a grade for the joint, say)
	}
	j.Stamp = p.job.Stamp
	found, checks, err := bestInStock(j, limit)
	if err != nil || found == nil {
		return Remedy{}, checks, false
	}
	g := found.Report.GoverningResult()
	return Remedy{Kind: kind, Change: c.text, Value: c.value, Member: c.member, Layout: found.Layout,
		Length: found.Length, Governing: g.ID, Ratio: g.Ratio, Job: found.LayoutJob}, checks, true
}

// bestInStock is the pruned search of Propose without alternatives and
// without a diagnosis: the chosen layout, nil when nothing passes or the
// search reached limit checks; with the checks it took. An error is bad
// input, which a relaxed job may be (a bolt too large for the leg).
func bestInStock(j *jobfile.Job, limit int) (*Proposal, int, error) {
	p, err := newProblem(j)
	if err != nil {
		return nil, 0, err
	}
	out := &Proposal{Job: j, Space: p.space()}
	p.limit = limit
	if p.yieldBlocker() != nil {
		return nil, 0, nil
	}
	var tops []*cand
	switch {
	case p.outline && out.Space > limit:
		return nil, 0, nil
	case p.outline:
		tops, _ = p.exhaustive(out.Space, nil)
	default:
		tops, _ = p.prunedTops(out, 0, nil)
	}
	if p.stopped || len(tops) == 0 {
		return nil, p.evals, nil
	}
	best := tops[0]
	out.Layout, out.Length = p.layout(best), best.length()
	if out.Report, out.LayoutJob, err = p.checkChoice(best, out.Layout); err != nil {
		return nil, p.evals, err
	}
	return out, p.evals, nil
}

// boltSetting writes one key of the bolts block.
func boltSetting(key, value, tag string) jobfile.Setting {
	return jobfile.Setting{Block: "bolts", Key: key, Value: value, Tag: tag}
}

// strongerGrades are the edition's bolt grades of larger Fnv (for the
// job's threads) than every grade tried, weakest first, ties in the
// edition's order: a grade no stronger in shear changes nothing else
// either (pretension goes with the grade's group, and so with Fnv).
func strongerGrades(p *problem) []change {
	th := p.job.Bolts.Threads
	top := 0.0
	for _, name := range p.grades {
		if b, err := p.ed.Bolt(name); err == nil {
			top = max(top, float64(b.Fnv(th)))
		}
	}
	type grade struct {
		name string
		fnv  float64
	}
	var gs []grade
	for _, name := range p.ed.BoltGrades() {
		if b, err := p.ed.Bolt(name); err == nil && float64(b.Fnv(th)) > top {
			gs = append(gs, grade{name, float64(b.Fnv(th))})
		}
	}
	slices.SortStableFunc(gs, func(a, b grade) int { return cmp.Compare(a.fnv, b.fnv) })
	var out []change
	for _, g := range gs {
		out = append(out, change{set: []jobfile.Setting{boltSetting("grade", g.name, "!!str")}, value: g.name,
			text: fmt.Sprintf("bolt grade %s (tried: %s)", g.name, strings.Join(p.grades, ", "))})
	}
	return out
}

// largerDiameters are the next two diameters of the edition's tables
// beyond the largest tried, smaller first.
func largerDiameters(p *problem) []change {
	sys := p.job.Units
	var top units.Length
	for _, d := range p.diams {
		top = max(top, d.v)
	}
	var out []change
	for _, d := range p.ed.Diameters() {
		if d <= top+eps || len(out) == 2 {
			continue
		}
		v := Layout{Diameter: d}.diameterValue(sys)
		out = append(out, change{set: []jobfile.Setting{boltSetting("diameter", v, "!!str")}, value: v,
			text: fmt.Sprintf("%s bolts (tried up to %s)", v, Layout{Diameter: top}.diameterValue(sys))})
	}
	return out
}

// Plate thicknesses a shop buys (common practice, no source): US in
// sixteenths of an inch, SI in mm.
var (
	platesUS = []int{3, 4, 5, 6, 7, 8, 9, 10, 12, 14, 16, 18, 20, 22, 24, 28, 32, 36, 40, 48}
	platesSI = []int{5, 6, 8, 10, 12, 15, 16, 18, 20, 22, 25, 28, 30, 32, 35, 40, 45, 50, 60}
)

// plateThicknesses lists the standard plate thicknesses of sys.
func plateThicknesses(sys units.System) []units.Length {
	var out []units.Length
	if sys == units.SI {
		for _, t := range platesSI {
			out = append(out, units.Length(t)*units.Millimetre)
		}
		return out
	}
	for _, t := range platesUS {
		out = append(out, units.Length(t)*units.Inch/16)
	}
	return out
}

// thickerPlates are the next three standard plate thicknesses beyond the
// thickest tried, thinner first; none without a plate.
func thickerPlates(p *problem) []change {
	if p.job.Plate == nil {
		return nil
	}
	sys := p.job.Units
	var top units.Length
	for _, t := range p.thick {
		top = max(top, t.v)
	}
	var out []change
	for _, t := range plateThicknesses(sys) {
		if t <= top+eps || len(out) == 3 {
			continue
		}
		v := jobfile.LengthText(t, sys)
		out = append(out, change{set: []jobfile.Setting{{Block: "plate", Key: "thickness", Value: v, Tag: "!!str"}}, value: v,
			text: fmt.Sprintf("a %s plate (tried up to %s)", v, jobfile.LengthText(top, sys))})
	}
	return out
}

// morePerLine fixes bolts.per_line at one, two and three more than the
// most tried.
func morePerLine(p *problem) []change {
	most := 0
	for _, g := range p.groups {
		most = max(most, g.perLine)
	}
	var out []change
	for n := most + 1; n <= most+3; n++ {
		v := strconv.Itoa(n)
		out = append(out, change{set: []jobfile.Setting{boltSetting("per_line", v, "!!int")}, value: v,
			text: fmt.Sprintf("%d bolts per line (tried up to %d)", n, most)})
	}
	return out
}

// moreLines fixes bolts.lines at one more than the most tried.
func moreLines(p *problem) []change {
	most := 0
	for _, g := range p.groups {
		most = max(most, g.lines)
	}
	v := strconv.Itoa(most + 1)
	return []change{{set: []jobfile.Setting{boltSetting("lines", v, "!!int")}, value: v,
		text: fmt.Sprintf("%d gage lines (tried up to %d)", most+1, most)}}
}

// maxMemberSearches bounds the members tried with a search, and
// maxMemberTries the members listed.
const (
	maxMemberSearches = 6
	maxMemberTries    = 60
)

// largerMembers are catalog angles of larger area than the job's, and at
// least the area gross yielding needs, the same connected leg first, then by area and designation; at most
// maxMemberTries. Only for a catalog angle without property overrides
// (the overrides belong to the job's section).
func largerMembers(p *problem) []change {
	m := p.job.Member
	if jobfile.RolledFamily(m.Shape) != "" {
		return largerRolled(p)
	}
	if shape := m.Shape.String(); shape != "angle" && shape != "double-angle" {
		return nil
	}
	if m.Size == "" || m.Area > 0 || m.Xbar > 0 || m.Rmin > 0 || len(p.groups) == 0 {
		return nil
	}
	cur := p.groups[0].tmpl.Conn.Member
	sys := p.job.Units
	if cur.Width <= 0 || cur.Pieces < 1 {
		return nil
	}
	area := cur.Ag / units.Area(cur.Pieces)
	// Gross yielding is Fy·Ag: an angle of less area than it needs fails
	// whatever the layout, and is not listed.
	need := area * units.Area(max(1, engine.MemberYield(&p.groups[0].tmpl.Conn).Ratio))
	type cand struct {
		name    string
		area    units.Area
		sameLeg bool
	}
	var cs []cand
	for _, a := range connectedAngles(sys) {
		if ar := a.Properties().Area; ar > area*(1+1e-9) && ar >= need*(1-1e-9) {
			cs = append(cs, cand{a.Name, ar, abs(a.A-cur.Width) < eps})
		}
	}
	slices.SortStableFunc(cs, func(a, b cand) int {
		if a.sameLeg != b.sameLeg {
			if a.sameLeg {
				return -1
			}
			return 1
		}
		return cmp.Or(cmp.Compare(a.area, b.area), cmp.Compare(a.name, b.name))
	})
	var out []change
	for _, c := range cs[:min(len(cs), maxMemberTries)] {
		out = append(out, change{set: []jobfile.Setting{{Block: "member", Key: "size", Value: c.name, Tag: "!!str"}},
			value: c.name, member: c.name, text: fmt.Sprintf("member %s (job: %s)", c.name, m.Size)})
	}
	return out
}

// largerRolled is largerMembers for a WT, channel or W: the catalog's
// shapes of the job's family (C and MC together) of more area than the
// job's, and at least the area gross yielding needs, smallest first.
func largerRolled(p *problem) []change {
	m := p.job.Member
	if len(p.groups) == 0 {
		return nil
	}
	cur := p.groups[0].tmpl.Conn.Member
	need := cur.Ag * units.Area(max(1, engine.MemberYield(&p.groups[0].tmpl.Conn).Ratio))
	fam, _ := engine.CatalogFamily(m.Shape)
	type cand struct {
		name string
		area units.Area
	}
	var cs []cand
	for _, name := range section.ShapeNamesIn(fam) {
		sh, err := section.LookupIn(fam, name)
		if err != nil {
			continue
		}
		n := 1 // a W's area is of the whole shape; a pair's twice a channel's
		if !engine.Apart(m.Shape) {
			n = m.Shape.Pieces()
		}
		if ar := sh.Properties().Area * units.Area(n); ar > cur.Ag*(1+1e-9) && ar >= need*(1-1e-9) {
			cs = append(cs, cand{name, ar})
		}
	}
	slices.SortStableFunc(cs, func(a, b cand) int { return cmp.Or(cmp.Compare(a.area, b.area), cmp.Compare(a.name, b.name)) })
	var out []change
	for _, c := range cs[:min(len(cs), maxMemberTries)] {
		out = append(out, change{set: []jobfile.Setting{{Block: "member", Key: "size", Value: c.name, Tag: "!!str"}},
			value: c.name, member: c.name, text: fmt.Sprintf("member %s (job: %s)", c.name, m.Size)})
	}
	return out
}

// connectedAngles lists every catalog angle of sys both ways round:
// connected by its long leg as the catalog names it, and, for an unequal
// angle, by its short leg, named short leg first (L4x6x1/2), as a job
// writes it.
func connectedAngles(sys units.System) []section.Angle {
	var out []section.Angle
	for _, name := range section.Names(sys) {
		a, err := section.Lookup(name, sys)
		if err != nil {
			var ua *section.UnknownAngleError
			if errors.As(err, &ua) {
				continue
			}
			panic("propose: the catalog does not know its own " + name)
		}
		out = append(out, a)
		if a.A != a.B {
			s := a.Swapped()
			parts := strings.Split(strings.TrimPrefix(a.Name, "L"), "x")
			s.Name = "L" + parts[1] + "x" + parts[0] + "x" + parts[2]
			out = append(out, s)
		}
	}
	return out
}

// abs is the magnitude of a length.
func abs(l units.Length) units.Length { return max(l, -l) }
