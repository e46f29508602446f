package propose

import (
	"fmt"
	"math"
	"slices"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// Usual gages and the shop's preferences: where the order ranks the usual
// gage (stock.prefer, or by default first), the space is searched in two
// parts, the layouts at the connected leg's usual gage lines and the
// rest. The usual gage is the same for every layout of a part, so each
// part's pruned search is exact under the other keys, and the better of
// the two parts' answers under the whole order is the answer: what the
// exhaustive enumeration, which ranks every layout by the whole order,
// returns.

// part is a part of the space the pruned search walks.
type part int

const (
	partAll   part = iota // every layout
	partUsual             // layouts at the usual gage lines only
	partOther             // layouts anywhere else
)

// usualPitchOf is the pitch a shop lays out when nothing asks for another:
// 3 in, 75 mm (common practice, no source). It only breaks ties: the
// order's keys (a shorter connection) come first.
func usualPitchOf(sys units.System) units.Length {
	if sys == units.SI {
		return 75 * units.Millimetre
	}
	return 3 * units.Inch
}

// usualOf is the usual gage lines of the job's connected angle leg
// (section.WorkableGage); zero for a flat, a leg the table does not list,
// or a job whose bolts block fixes the gage.
func usualOf(j *jobfile.Job, leg units.Length) section.UsualGages {
	if j.Given("bolts.gage") {
		return section.UsualGages{}
	}
	switch j.Member.Shape.(type) {
	case engine.SingleAngle, engine.AnglePair:
	default:
		if fam, _ := engine.CatalogFamily(j.Member.Shape); fam != "" {
			return flangeGage(j, leg) // none where the catalog has no g (channels)
		}
		return section.UsualGages{}
	}
	u, _ := section.WorkableGage(leg, j.Units)
	return u
}

// flangeGage is the usual pair of gage lines astride the web of a WT's or
// W's flange of width bf: the workable gage g between them (section.Shape.G),
// the first (bf − g)/2 from the flange tip. There is no usual single line
// (it would stand on the web).
func flangeGage(j *jobfile.Job, bf units.Length) section.UsualGages {
	fam, _ := engine.CatalogFamily(j.Member.Shape)
	sh, err := section.LookupIn(fam, j.Member.Size)
	if err != nil || sh.G <= 0 || sh.G >= bf {
		return section.UsualGages{}
	}
	g1 := (bf - sh.G) / 2
	return section.UsualGages{G: g1, G1: g1, G2: sh.G}
}

// setUsual puts the usual gage lines of a group of one or two lines.
func (p *problem) setUsual(g *group) {
	switch {
	case g.lines == 1 && g.tmpl.Conn.Member.Shape.CentredGroup():
		// a centred single line: no usual gage (a flange's would be on the web)
	case g.lines == 1:
		g.usualG1 = p.usual.G
	case g.lines == 2 && p.usual.G1 > 0:
		g.usualG1, g.usualG2 = p.usual.G1, p.usual.G2
	}
}

// partitioned reports whether the search runs in two parts.
func (p *problem) partitioned() bool { return p.obj.usualGage() && p.usual.G > 0 }

// isUsual reports whether the layout's gage lines are the usual ones;
// false whenever the search does not rank the usual gage.
func (p *problem) isUsual(g *group, g2i int, g1 units.Length) bool {
	if !p.partitioned() || g.usualG1 == 0 || math.Abs(float64(g1-g.usualG1)) > eps {
		return false
	}
	return g.lines == 1 || math.Abs(float64(g.gage2[g2i]-g.usualG2)) <= eps
}

// inPart reports whether the layout belongs to the part being searched.
func (p *problem) inPart(g *group, g2i int, g1 units.Length) bool {
	switch p.part {
	case partUsual:
		return p.isUsual(g, g2i, g1)
	case partOther:
		return !p.isUsual(g, g2i, g1)
	}
	return true
}

// bestOfParts is bestPerGroup over the whole space: over each part in
// turn when the search is partitioned, merged under the whole order. The
// k best arrangements of the space are among the k best of some part
// (an arrangement's best lies in one part, and what beats it there beats
// it in the space).
func (p *problem) bestOfParts(o order, k int) []*cand {
	if !p.partitioned() {
		return p.bestPerGroup(o, k)
	}
	defer func() { p.part = partAll }()
	p.part = partUsual
	list := p.bestPerGroup(o, k)
	p.part = partOther
	list = append(list, p.bestPerGroup(o, k)...)
	slices.SortFunc(list, func(a, b *cand) int { return compare(o, a, b) })
	return firstN(onePerArrangement(list), k)
}

// withValue is the sorted list vs with v added (a new list; vs may be
// shared), or vs when it holds v already.
func withValue(vs []units.Length, v units.Length) []units.Length {
	i, found := slices.BinarySearchFunc(vs, v, func(a, b units.Length) int {
		if math.Abs(float64(a-b)) <= eps {
			return 0
		}
		if a < b {
			return -1
		}
		return 1
	})
	if found {
		return vs
	}
	return slices.Insert(slices.Clone(vs), i, v)
}

// Where the chosen gage comes from (Proposal.GageSource).
const (
	GageUsual     = "usual"         // the connected leg's usual gage lines
	GageNotUsual  = "not-usual"     // the usual ones were ranked, but lost (GageNote says why)
	GageJob       = "job"           // bolts.gage fixes it
	GageCentred   = "centred"       // a flat: the group centred on the bar (J1.7)
	GageSearched  = "searched"      // stock.prefer does not rank the usual gage
	GageNoneKnown = "not-tabulated" // the leg (or the number of lines) has no usual gage
)

// usualSource names the table the usual gages come from.
func usualSource(sys units.System, s engine.Shape) string {
	if fam, _ := engine.CatalogFamily(s); fam != "" {
		return "workable flange gage g: AISC Shapes Database v15.0, the Manual's Tables 1-1 and 1-8"
	}
	if sys == units.SI {
		return "usual back marks of metric angle legs"
	}
	return "workable gages in angle legs, AISC Manual Table 1-7A"
}

// gageSource says where the chosen layout's gage comes from, and why
// when it is not the usual one. It may search the usual part of the
// space (outside the counts of the proposal).
func (p *problem) gageSource(best *cand) (src, note string) {
	j, g := p.job, best.g
	sys := j.Units
	f := func(v units.Length) string { return units.FormatJob(v, sys) }
	m := &g.tmpl.Conn.Member
	leg := f(m.Width) + " leg"
	if jobfile.RolledFamily(m.Shape) != "" {
		leg = j.Member.Size + " flange"
	}
	switch {
	case j.Given("bolts.gage"):
		return GageJob, "gage " + f(best.g1) + " as bolts.gage fixes it"
	case m.Shape.CentredGroup() && (p.usual.G == 0 || g.usualG1 == 0):
		if len(m.Junctions) > 0 {
			return GageCentred, "gage " + f(best.g1) + " centres the bolt group on the section's centre line"
		}
		return GageCentred, "gage " + f(best.g1) + " centres the bolt group on the bar (J1.7)"
	case p.usual.G == 0:
		return GageNoneKnown, "no usual gage is tabulated for the " + leg + " (" + usualSource(sys, m.Shape) + "); the least workable gage is used"
	case g.usualG1 == 0:
		return GageNoneKnown, fmt.Sprintf("no usual gages for %d gage lines in the %s (%s)", g.lines, leg, usualSource(sys, m.Shape))
	case !p.obj.usualGage():
		return GageSearched, "stock.prefer does not list usual-gage: the gage is searched (usual gage of the " + leg + ": " + f(g.usualG1) + ")"
	}
	usual := "the usual gage " + f(g.usualG1)
	if g.lines == 2 {
		usual = "the usual gage lines " + f(g.usualG1) + " + " + f(g.usualG2)
	}
	if len(m.Junctions) > 0 {
		usual = "the usual gage " + f(g.usualG2) + " across the web, the lines " + f(g.usualG1) + " from the flange tips"
	}
	usual += " of the " + leg + " (" + usualSource(sys, m.Shape) + ")"
	if best.notUsual == 0 {
		return GageUsual, "gage: " + usual
	}
	saveLimit := p.limit
	p.limit, p.part = 0, partUsual
	alt := p.bestPerGroup(p.obj, 1)
	p.limit, p.part = saveLimit, partAll
	switch {
	case len(alt) > 0:
		a := alt[0]
		return GageNotUsual, fmt.Sprintf("%s passes only in a layout stock.prefer ranks lower (%d bolts, length %s)",
			usual, a.g.nT, f(a.length()))
	case !slices.ContainsFunc(p.gagesFor(g, best.g2i), func(v units.Length) bool { return math.Abs(float64(v-g.usualG1)) <= eps }):
		return GageNotUsual, fmt.Sprintf("%s is not workable with %s bolts (fillet, wrench clearance and a margin of tolerance.position %s): a tighter gage is used",
			usual, f(g.d), f(j.Tolerance.Position))
	}
	return GageNotUsual, usual + ": no layout in stock passes at it; a tighter gage is the only one that passes"
}
