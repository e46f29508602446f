package propose

import (
	"cmp"
	"math"
	"slices"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/detailing"
	"gaugeline/rules/units"
)

// The pruned search: groups in order of their bounds, and within a group
// the staircase of each monotone run of pitches (see propose.go).

// lowerLen is the shortest layout of a group, in nm.
func (g *group) lowerLen() int64 {
	l := g.end[0] + units.Length(g.perLine-1)*g.pitch[0] + g.stag + g.edge[0]
	return int64(math.Round(float64(l) * 1e6))
}

// bestPerGroup returns the best layout of each of the k best arrangements
// under obj, best first, pruning groups and layouts that cannot enter the
// k best. (A group whose bound is the k-th best cannot improve on an
// arrangement already among them either: that one is better still.)
func (p *problem) bestPerGroup(obj order, k int) []*cand {
	order := slices.Clone(p.groups)
	slices.SortStableFunc(order, func(a, b *group) int {
		return cmp.Or(cmpPrefix(obj, a.lowRank(), b.lowRank()), cmp.Compare(a.idx, b.idx))
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
			if cmpPrefix(obj, g.lowRank(), bound.rank()) > 0 {
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
	obj   order
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
		p := cmpPrefix(s.obj, c.rank(), b.rank())
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

// offer makes a checked layout the group's best when it passes, beats
// the bound and beats the best so far.
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

// group searches every gage position of g, run by run. Where the shape's
// smallest passing gage dominates (angles), it stops, for each gage2, at
// the first gage that passes the gage rules or whose layouts the bound
// cut.
func (s *searcher) group(g *group) {
	monotone := g.tmpl.Conn.Member.Shape.MonotoneGage()
	for g2i := range g.gage2 {
		for _, g1 := range s.p.gagesFor(g, g2i) {
			if s.p.stopped {
				return
			}
			if !s.p.inPart(g, g2i, g1) {
				continue
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
// group's offset from the bar's centre line); a splice's member B's too.
func gageDependent(id string) bool {
	switch id {
	case "member.block-shear", "member.combined", "member_b.block-shear", "member_b.combined":
		return true
	}
	return false
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
