package propose

import (
	"cmp"
	"fmt"
	"math"
	"slices"

	"gaugeline/detail"
	"gaugeline/detail/detailing"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// Infeasible jobs: what blocks every candidate, and what would lift it.

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

// areaText writes an area for a blocker's message.
func areaText(a units.Area, sys units.System) string {
	return units.Format(float64(a), units.DimArea, sys, units.Report.Places(-3))
}

// forceText writes a force for a blocker's message.
func forceText(f units.Force, sys units.System) string {
	return units.Format(float64(f), units.DimForce, sys, units.Report)
}

// diagnose explains why nothing passes and, unless the search stopped at
// its limit, looks for what would make a layout pass (remedy).
func (p *problem) diagnose(out *Proposal) {
	p.explain(out)
	if !p.stopped {
		p.remedy(out)
	}
}

// explain says what blocks every candidate. It checks the strongest layout of
// every monotone run (largest pitch, end and edge, every gage), so a limit
// state that fails in all of them fails in every candidate; the numbers
// come from the layout that does best in it.
func (p *problem) explain(out *Proposal) {
	var corners []*cand
	var maxBolts int
	var allFail map[string]bool // nil: what fails in every corner
	if p.outline {
		corners, maxBolts, allFail = p.outlineCorners()
	} else {
		var ok bool
		if corners, maxBolts, ok = p.corners(); !ok {
			return
		}
	}
	if len(corners) == 0 {
		b := Blocker{ID: "fit", Text: "no candidate fits: every layout puts a hole off the member or the plate",
			Lift: "use a smaller bolt, a member with a wider connected leg, or a wider plate"}
		out.Blockers, out.Summary = []Blocker{b}, b.Text+": "+b.Lift
		return
	}
	out.Blockers = append(p.limitBlockers(corners, maxBolts), findingBlockers(corners, allFail)...)
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
	maxBolts = p.eachFittingGage(func(g *group, g2i int, g1 units.Length) bool {
		if p.stopped {
			return false
		}
		for _, seg := range g.segments {
			c := p.newCand(g, g2i, g1, seg[1], len(g.end)-1, len(g.edge)-1)
			if p.eval(c) {
				corners = append(corners, c)
			}
		}
		return true
	})
	if p.stopped {
		return nil, 0, false
	}
	return corners, maxBolts, true
}

// eachFittingGage calls f with every gage2 index and first gage of every
// group whose holes fit, in order, until f returns false; it returns the
// most bolts of any group.
func (p *problem) eachFittingGage(f func(g *group, g2i int, g1 units.Length) bool) (maxBolts int) {
	for _, g := range p.groups {
		maxBolts = max(maxBolts, g.nT)
	}
	for _, g := range p.groups {
		if !g.fits {
			continue
		}
		for g2i := range g.gage2 {
			for _, g1 := range p.gagesFor(g, g2i) {
				if !f(g, g2i, g1) {
					return maxBolts
				}
			}
		}
	}
	return maxBolts
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
// corner, by id, each with where it fails in the first corner; of those,
// only the ones in allFail when it is not nil (outlineCorners).
func findingBlockers(corners []*cand, allFail map[string]bool) []Blocker {
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
		if allFail == nil || allFail[id] {
			ids = append(ids, id)
		}
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
			if p.outline {
				lift = "choose a thicker plate or a stronger plate grade, or draw the outline wider across the Whitmore section"
			}
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

// findingLift words what would lift the detailing rule id.
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
