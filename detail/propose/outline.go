package propose

import (
	"math"

	"gaugeline/detail"
	"gaugeline/rules/units"
)

// A plate outline (plate.outline) is fixed in the member's frame: its
// free edge stays where the job draws it while the search moves the bolt
// group, so more pitch or end brings the last bolt nearer to that edge
// and can lower the plate's tearout and block shear. The pruned search's
// monotonicity (propose.go) fails there, and an outline job is searched
// candidate by candidate (the exhaustive enumeration, whatever the mode;
// the plate edge is not a dimension of the space). The same holds for
// the diagnosis of a job where nothing passes: every candidate is
// checked, and only those that carry an answer are kept.

// outlineEdge is the distance from the last bolt to the outline's free
// edge (its greatest x), for people: the job file has no such key.
func outlineEdge(d *detail.Design) units.Length {
	last := math.Inf(-1)
	for _, h := range d.Conn.Holes {
		last = max(last, float64(h.X))
	}
	return d.Conn.Plate.FreeEdge - units.Length(last)
}

// outlineCorners checks every candidate of every group whose holes fit
// and keeps what explain needs from them: the first candidate built, the
// best candidate in each limit state, the candidate of least governing
// ratio, and the non-advisory detailing rules that fail in every one
// (allFail). limitBlockers and closestSummary give over the kept ones
// what they would over all: a limit state passes somewhere exactly when
// it passes in its best candidate. findingBlockers must be told allFail.
func (p *problem) outlineCorners() (kept []*cand, maxBolts int, allFail map[string]bool) {
	best := map[string]*cand{}
	bestRatio := map[string]float64{}
	var ids []string // limit states in the order first seen
	var first, closest *cand
	maxBolts = p.eachFittingGage(func(g *group, g2i int, g1 units.Length) bool {
		for i := range g.pitch {
			for j := range g.end {
				c := p.newCand(g, g2i, g1, i, j, 0)
				if !p.eval(c) {
					continue
				}
				failing := map[string]bool{}
				for _, f := range c.rep.Findings {
					if !f.Pass && !f.Advisory {
						failing[f.ID] = true
					}
				}
				if first == nil {
					first, allFail = c, failing
				}
				for id := range allFail {
					if !failing[id] {
						delete(allFail, id)
					}
				}
				for _, x := range c.rep.Results {
					r, seen := bestRatio[x.ID]
					if !seen {
						ids = append(ids, x.ID)
					}
					if !seen || x.Ratio < r {
						best[x.ID], bestRatio[x.ID] = c, x.Ratio
					}
				}
				if closest == nil || c.rep.GoverningResult().Ratio < closest.rep.GoverningResult().Ratio {
					closest = c
				}
			}
		}
		return true
	})
	if first == nil {
		return nil, maxBolts, nil
	}
	seen := map[*cand]bool{}
	all := []*cand{first, closest}
	for _, id := range ids {
		all = append(all, best[id])
	}
	for _, c := range all {
		if !seen[c] {
			seen[c] = true
			kept = append(kept, c)
		}
	}
	return kept, maxBolts, allFail
}
