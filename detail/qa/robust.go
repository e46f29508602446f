package qa

import (
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r2"
)

// The robust best fit. Least squares over every matched hole spreads one
// mislocated hole over all of them: the bad hole reads smaller than it is
// (a line's end hole is largely absorbed by the rotation) and good holes
// read larger, so the wrong holes can come out of tolerance. robustFit
// looks for the largest set of holes that agree with one rigid motion
// within the position tolerance, fits on those alone, and leaves the
// others to show their error against that fit.

// robustFit takes the matching of a settled least-squares fit tf (match[i]
// is the measured point of design point i, or -1) and returns the fit to
// report and, per design point, whether the fit was taken on it. Each
// pair of matched holes seeds a rigid motion (the exact two-point fit);
// each seed is refined (the holes within tol of it, least squares on
// those, again until the set settles). The best refined set has the most
// holes, then the least squared deviation, then comes first (seeds in
// design order). When it holds every matched hole the fit is tf itself,
// unchanged; when it holds no more than half of them, or fewer than three,
// no hole can be told from the others and tf stands as well. changed
// reports whether holes were left out.
func robustFit(des, mea []r2.Vec, match []int, tol float64, tf abRigid) (out abRigid, in []bool, changed bool) {
	var idx []int // matched design points
	for i, k := range match {
		if k >= 0 {
			idx = append(idx, i)
		}
	}
	all := func() (abRigid, []bool, bool) {
		in := make([]bool, len(des))
		for _, i := range idx {
			in[i] = true
		}
		return tf, in, false
	}
	n := len(idx)
	if n < 4 {
		return all()
	}
	ps, qs := make([]r2.Vec, n), make([]r2.Vec, n)
	for j, i := range idx {
		ps[j], qs[j] = des[i], mea[match[i]]
	}
	var best *consensus
	for _, pr := range seedPairs(n) {
		a, b := pr[0], pr[1]
		seed := fitRigid([]r2.Vec{ps[a], ps[b]}, []r2.Vec{qs[a], qs[b]}, tf.theta)
		c := refine(ps, qs, tol, seed)
		if c != nil && (best == nil || c.betterThan(best)) {
			best = c
		}
	}
	if best == nil || best.count == n || 2*best.count <= n || best.count < 3 {
		return all()
	}
	in = make([]bool, len(des))
	for j, i := range idx {
		in[i] = best.in[j]
	}
	best.tf.theta = math.Remainder(best.tf.theta, 2*math.Pi)
	return best.tf, in, true
}

// seedPairs are the pairs of n matched holes that seed robustFit: every
// pair up to 60 holes; beyond, each hole with the holes a quarter, half
// and three quarters of the list on (3n seeds, not n²/2).
func seedPairs(n int) [][2]int {
	var out [][2]int
	if n <= 60 {
		for a := range n {
			for b := a + 1; b < n; b++ {
				out = append(out, [2]int{a, b})
			}
		}
		return out
	}
	for a := range n {
		for _, off := range []int{n / 4, n / 2, 3 * n / 4} {
			out = append(out, [2]int{a, (a + off) % n})
		}
	}
	return out
}

// consensus is a set of holes (in, by matched hole) and the least-squares
// fit on them, under which each of them, and no other, is within the
// tolerance; count holes, sse their squared deviation.
type consensus struct {
	tf    abRigid
	in    []bool
	count int
	sse   float64
}

// refine grows a consensus from the seed transform: the holes within tol
// of the current fit, then least squares on them, until the set no longer
// changes (at most 20 rounds). Nil when fewer than two holes agree or the
// set does not settle.
func refine(ps, qs []r2.Vec, tol float64, tf abRigid) *consensus {
	var prev []bool
	for range 20 {
		in, count := inliers(ps, qs, tol, tf)
		if count < 2 {
			return nil
		}
		if prev != nil && slices.Equal(in, prev) {
			c := &consensus{tf: tf, in: in, count: count}
			for j := range ps {
				if in[j] {
					q := tf.inverse(qs[j])
					c.sse += abSq(q.X-ps[j].X) + abSq(q.Y-ps[j].Y)
				}
			}
			return c
		}
		var sp, sq []r2.Vec
		for j := range ps {
			if in[j] {
				sp, sq = append(sp, ps[j]), append(sq, qs[j])
			}
		}
		tf, prev = fitRigid(sp, sq, tf.theta), in
	}
	return nil
}

// inliers marks the matched holes whose measured centre, brought back by
// tf, lies within tol of the design centre (the slack of the report's own
// comparison, so that a hole in the fit is never reported out of
// position).
func inliers(ps, qs []r2.Vec, tol float64, tf abRigid) ([]bool, int) {
	in := make([]bool, len(ps))
	count := 0
	for j := range ps {
		q := tf.inverse(qs[j])
		if math.Hypot(q.X-ps[j].X, q.Y-ps[j].Y) <= tol+tolSlack {
			in[j], count = true, count+1
		}
	}
	return in, count
}

// betterThan reports whether consensus c beats b: more holes, then a
// clearly smaller squared deviation.
func (c *consensus) betterThan(b *consensus) bool {
	if c.count != b.count {
		return c.count > b.count
	}
	return b.sse-c.sse > max(1e-9*(1+b.sse), 1e-6)
}

// robustAlignment runs robustFit on the settled best fit tf and its
// matching, matches the holes again under the fit it returns, and records
// the holes the fit was taken on (and those left out) in ab.Alignment.
func (ab *AsBuilt) robustAlignment(des, mea []r2.Vec, tf abRigid, match []int) (abRigid, []int) {
	tf, in, changed := robustFit(des, mea, match, float64(ab.Tolerance.Position), tf)
	if changed {
		match = assignHoles(des, tf.inverseAll(mea), float64(ab.Gate))
	}
	for i, h := range ab.designHoles() {
		switch {
		case in[i] && match[i] >= 0:
			ab.Alignment.FitOn = append(ab.Alignment.FitOn, h.ID)
		case match[i] >= 0:
			ab.Alignment.LeftOut = append(ab.Alignment.LeftOut, h.ID)
		}
	}
	if len(ab.Alignment.LeftOut) > 0 {
		ab.Alignment.Note = "rigid shift and rotation fitted by least squares over the largest set of holes that agree within the position tolerance;" +
			" the holes left out are measured against that fit"
	}
	return tf, match
}

// markLeftOut adds to the deviation of each hole left out of the fit why
// its deviation is taken against the fit on the others.
func (ab *AsBuilt) markLeftOut() {
	for i := range ab.Deviations {
		dv := &ab.Deviations[i]
		if dv.Status == HoleOutOfTolerance && slices.Contains(ab.Alignment.LeftOut, dv.ID) {
			dv.Why = append(dv.Why, "left out of the best fit: measured against the fit on the other holes")
		}
	}
}
