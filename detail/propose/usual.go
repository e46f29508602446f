package propose

import (
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
	switch j.Member.Shape.(type) {
	case engine.SingleAngle, engine.AnglePair:
	default:
		return section.UsualGages{}
	}
	if j.Given("bolts.gage") {
		return section.UsualGages{}
	}
	u, _ := section.WorkableGage(leg, j.Units)
	return u
}

// setUsual puts the usual gage lines of a group of one or two lines.
func (p *problem) setUsual(g *group) {
	switch {
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
