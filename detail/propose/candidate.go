package propose

import (
	"cmp"
	"math"
	"slices"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// Candidates: one layout of a group, how it is built and checked, and
// the total order of SPEC §6 that ranks candidates.

// cand is one layout of a group: indexes into its ranges.
type cand struct {
	g       *group
	g2i     int
	g1      units.Length
	i, j, k int // pitch, end, edge
	lenNm   int64
	rep     *detail.Report
	ratioB  int64
	// notUsual is 0 at the member's usual gage lines, 1 elsewhere (and
	// everywhere when the order has no usual gage or the leg none).
	notUsual int
	// pitchOff is how far the pitch is from the usual pitch, in nm (0
	// with one bolt per line or a pitch the job fixes).
	pitchOff int64
}

// candKey identifies a candidate in the pruned search's cache: its group,
// gage2 index, first gage (in nm) and pitch, end and edge indexes.
type candKey struct {
	group, g2i int
	g1         int64
	i, j, k    int
}

// key is the candidate's cache key.
func (c *cand) key() candKey {
	return candKey{c.g.idx, c.g2i, int64(math.Round(float64(c.g1) * 1e6)), c.i, c.j, c.k}
}

// length is the connection length: end + pattern length + plate edge.
func (c *cand) length() units.Length {
	g := c.g
	return g.end[c.j] + units.Length(g.perLine-1)*g.pitch[c.i] + g.stag + g.edge[c.k]
}

func (p *problem) newCand(g *group, g2i int, g1 units.Length, i, j, k int) *cand {
	c := &cand{g: g, g2i: g2i, g1: g1, i: i, j: j, k: k}
	c.lenNm = int64(math.Round(float64(c.length()) * 1e6)) // nm: exact ties
	if !p.isUsual(g, g2i, g1) {
		c.notUsual = 1
	}
	if g.perLine > 1 && len(g.pitch) > 1 {
		c.pitchOff = int64(math.Round(math.Abs(float64(g.pitch[i]-p.usualPitch)) * 1e6))
	}
	return c
}

// design builds the candidate's Design from the group's template in the
// steps Build takes; false when a hole leaves the member or the plate.
func (p *problem) design(c *cand) (*detail.Design, bool) {
	g := c.g
	t := g.tmpl
	d := &detail.Design{Job: p.job, Conn: t.Conn, Info: t.Info, InfoB: t.InfoB, Combination: t.Combination}
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

// setReport keeps the candidate's check, nil when it could not be built,
// and its governing ratio bucketed.
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

// feasible reports whether the candidate was built and passes.
func (c *cand) feasible() bool { return c.rep != nil && c.rep.Pass }

// order is the lexicographic objective of the search: the keys the job
// ranks (stock.prefer, or usual gage and stock.objective), then smallest
// diameter, lowest governing ratio and the tie-breaks.
type order struct{ keys []jobfile.Preference }

// orderOf is the job's order. Without stock.prefer: usual gage, then
// fewest bolts and shortest connection in the order stock.objective
// gives. With it: the keys as listed, then fewest bolts and shortest
// connection where the list leaves them out; a usual gage or a thinner
// plate not listed is no key (the plate stays a tie-break after the
// ratio).
func orderOf(st jobfile.Stock) order {
	if st.Prefer == nil {
		if st.Objective == jobfile.ShortestLength {
			return order{[]jobfile.Preference{jobfile.PreferUsualGage, jobfile.PreferShort, jobfile.PreferFewestBolts}}
		}
		return order{[]jobfile.Preference{jobfile.PreferUsualGage, jobfile.PreferFewestBolts, jobfile.PreferShort}}
	}
	keys := slices.Clone(st.Prefer)
	for _, k := range []jobfile.Preference{jobfile.PreferFewestBolts, jobfile.PreferShort} {
		if !slices.Contains(keys, k) {
			keys = append(keys, k)
		}
	}
	return order{keys}
}

// other is the order with fewest bolts and shortest connection swapped:
// the alternatives always show the best under it.
func (o order) other() order {
	keys := slices.Clone(o.keys)
	for i, k := range keys {
		switch k {
		case jobfile.PreferFewestBolts:
			keys[i] = jobfile.PreferShort
		case jobfile.PreferShort:
			keys[i] = jobfile.PreferFewestBolts
		}
	}
	return order{keys}
}

// describe is the order for people: "usual gage, fewest bolts, then
// shortest".
// describe leaves the usual gage out when it ranks nothing (usual false).
func (o order) describe(usual bool) string {
	name := map[jobfile.Preference]string{jobfile.PreferUsualGage: "usual gage", jobfile.PreferFewestBolts: "fewest bolts",
		jobfile.PreferShort: "shortest", jobfile.PreferThinnestPlate: "thinnest plate"}
	var s []string
	for _, k := range o.keys {
		if k != jobfile.PreferUsualGage || usual {
			s = append(s, name[k])
		}
	}
	return strings.Join(s[:len(s)-1], ", ") + ", then " + s[len(s)-1]
}

// usualGage reports whether the usual gage is a key of the order.
func (o order) usualGage() bool { return slices.Contains(o.keys, jobfile.PreferUsualGage) }

// rank is what the order's keys and the diameter read of a layout (or,
// for a group, the least of its layouts: lenNm its shortest).
type rank struct {
	nT       int
	lenNm    int64
	d, tp    units.Length
	notUsual int // 0: at the usual gage lines
}

// rank is the candidate's rank.
func (c *cand) rank() rank { return rank{c.g.nT, c.lenNm, c.g.d, c.g.tp, c.notUsual} }

// lowRank is the least rank of the group's layouts (usual or not).
func (g *group) lowRank() rank { return rank{g.nT, g.lowerLen(), g.d, g.tp, 0} }

// cmpRank orders by the order's keys, then the diameter; the usual gage
// only when usual is true. Each key is monotone in its field, so a rank
// no smaller in every field never orders first: the bounds of the pruned
// search rest on that.
func (o order) cmpRank(a, b rank, usual bool) int {
	for _, k := range o.keys {
		c := 0
		switch k {
		case jobfile.PreferFewestBolts:
			c = cmp.Compare(a.nT, b.nT)
		case jobfile.PreferShort:
			c = cmp.Compare(a.lenNm, b.lenNm)
		case jobfile.PreferThinnestPlate:
			c = cmp.Compare(a.tp, b.tp)
		case jobfile.PreferUsualGage:
			if usual {
				c = cmp.Compare(a.notUsual, b.notUsual)
			}
		}
		if c != 0 {
			return c
		}
	}
	return cmp.Compare(a.d, b.d)
}

// cmpPrefix orders by the order's keys but the usual gage, and the
// diameter: the order within one part of the search (usual gage lines,
// or not), where the usual gage is the same for every layout.
func cmpPrefix(o order, a, b rank) int { return o.cmpRank(a, b, false) }

// compare is the total order of SPEC §6 with its deterministic tie-breaks.
func compare(o order, a, b *cand) int {
	return cmp.Or(
		o.cmpRank(a.rank(), b.rank(), true),
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
		cmp.Compare(a.pitchOff, b.pitchOff),
		cmp.Compare(ga.end[a.j], gb.end[b.j]),
		cmp.Compare(ga.pitch[a.i], gb.pitch[b.i]),
		cmp.Compare(ga.edge[a.k], gb.edge[b.k]),
		cmp.Compare(ga.idx, gb.idx),
	)
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
