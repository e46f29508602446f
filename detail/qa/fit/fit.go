package fit

import (
	"cmp"
	"math"
	"slices"

	"gonum.org/v1/gonum/spatial/r2"
)

// Rigid maps a design point p to the measured frame: R(theta)·p + t.
type Rigid struct {
	Theta float64
	T     r2.Vec
}

func (r Rigid) Apply(p r2.Vec) r2.Vec {
	c, s := math.Cos(r.Theta), math.Sin(r.Theta)
	return r2.Vec{X: c*p.X - s*p.Y + r.T.X, Y: s*p.X + c*p.Y + r.T.Y}
}

// Inverse maps a measured point q to the design frame: Rᵀ·(q − t).
func (r Rigid) Inverse(q r2.Vec) r2.Vec {
	c, s := math.Cos(r.Theta), math.Sin(r.Theta)
	x, y := q.X-r.T.X, q.Y-r.T.Y
	return r2.Vec{X: c*x + s*y, Y: -s*x + c*y}
}

func (r Rigid) InverseAll(qs []r2.Vec) []r2.Vec {
	out := make([]r2.Vec, len(qs))
	for i, q := range qs {
		out[i] = r.Inverse(q)
	}
	return out
}

// FitRigid is the least-squares rigid transform taking ps onto qs (the
// 2-D Kabsch/Procrustes solution): θ = atan2(Σ p′×q′, Σ p′·q′) over the
// centred points, t = q̄ − R·p̄. One pair fixes only the shift.
func FitRigid(ps, qs []r2.Vec, keep float64) Rigid {
	n := float64(len(ps))
	var pc, qc r2.Vec
	for i := range ps {
		pc.X, pc.Y = pc.X+ps[i].X/n, pc.Y+ps[i].Y/n
		qc.X, qc.Y = qc.X+qs[i].X/n, qc.Y+qs[i].Y/n
	}
	var sc, ss float64
	for i := range ps {
		px, py := ps[i].X-pc.X, ps[i].Y-pc.Y
		qx, qy := qs[i].X-qc.X, qs[i].Y-qc.Y
		sc += px*qx + py*qy
		ss += px*qy - py*qx
	}
	th := keep
	if len(ps) > 1 && math.Hypot(sc, ss) > 1e-12 {
		th = math.Atan2(ss, sc)
	}
	r := Rigid{Theta: th}
	rp := r.Apply(pc)
	r.T = r2.Vec{X: qc.X - rp.X, Y: qc.Y - rp.Y}
	return r
}

// BestFit aligns the measured holes to the design: from several starts
// (fitStarts) it alternates optimal matching and the least-squares fit
// until the matching settles (settleFit). The best start matches the most
// holes, then has the least squared deviation; among fits as good as each
// other (a symmetric pattern), the part's contour decides (the start whose
// contour lies from the datum into +x and +y) where its corners differ by
// more than the gate, then the smallest rotation (fit.betterThan): a part
// whose contour is as symmetric as its holes (a splice plate, member B's
// group A's mirror image) keeps the file's way round, and a mislocated
// hole, which pulls the least-squares contour a little, cannot turn it. It returns the transform, the matching (as
// Assign) and the iterations the best start took.
func BestFit(des, mea []r2.Vec, gate float64, contour []r2.Vec) (Rigid, []int, int) {
	var best *fit
	for _, tf := range fitStarts(des, mea, gate) {
		f := scoreFit(des, mea, contour, settleFit(des, mea, gate, tf))
		if best == nil || f.betterThan(best, len(contour) > 0, gate) {
			best = f
		}
	}
	return best.tf, best.match, best.iters
}

// fitStarts are the transforms BestFit starts from: the centroids matched
// at the patterns' principal axes and at every 15° (every quarter turn
// for large patterns), then the design's longest pairs of holes set on
// each measured pair as far apart.
func fitStarts(des, mea []r2.Vec, gate float64) []Rigid {
	dc, mc := abCentroid(des), abCentroid(mea)
	var starts []Rigid
	centred := func(th float64) Rigid {
		tf := Rigid{Theta: th}
		p := tf.Apply(dc)
		tf.T = r2.Vec{X: mc.X - p.X, Y: mc.Y - p.Y}
		return tf
	}
	// Centroids matched, at the principal axes and at every 15°.
	if a, ok := principalAxis(des); ok {
		if b, ok := principalAxis(mea); ok {
			starts = append(starts, centred(b-a), centred(b-a+math.Pi))
		}
	}
	step := math.Pi / 2
	if len(des) <= 60 {
		step = math.Pi / 12
	}
	for th := 0.0; th < 2*math.Pi-1e-9; th += step {
		starts = append(starts, centred(math.Remainder(th, 2*math.Pi)))
	}
	return append(starts, pairStarts(des, mea, gate)...)
}

// pairStarts sets the design's four longest pairs of holes on every
// measured pair as far apart (within the gate), both ways round, at most
// 400 starts: robust to missing and extra holes, which pull the centroids
// apart. None for patterns of one hole, or too many to pair.
func pairStarts(des, mea []r2.Vec, gate float64) []Rigid {
	n, m := len(des), len(mea)
	if n < 2 || n > 40 || m < 2 || m > 200 {
		return nil
	}
	type pair struct {
		i, j int
		d    float64
	}
	var dp []pair
	for i := range des {
		for j := i + 1; j < n; j++ {
			dp = append(dp, pair{i, j, math.Hypot(des[j].X-des[i].X, des[j].Y-des[i].Y)})
		}
	}
	slices.SortStableFunc(dp, func(a, b pair) int { return cmp.Compare(b.d, a.d) })
	var starts []Rigid
	for _, pr := range dp[:min(4, len(dp))] {
		p, q := des[pr.i], des[pr.j]
		for a := range mea {
			for b := range mea {
				if a == b || len(starts) >= 400 {
					continue
				}
				ma, mb := mea[a], mea[b]
				if math.Abs(math.Hypot(mb.X-ma.X, mb.Y-ma.Y)-pr.d) > gate {
					continue
				}
				th := math.Atan2(mb.Y-ma.Y, mb.X-ma.X) - math.Atan2(q.Y-p.Y, q.X-p.X)
				tf := Rigid{Theta: math.Remainder(th, 2*math.Pi)}
				rp := tf.Apply(p)
				tf.T = r2.Vec{X: ma.X - rp.X, Y: ma.Y - rp.Y}
				starts = append(starts, tf)
			}
		}
	}
	return starts
}

// fit is one start's outcome: its transform and matching, the holes
// matched and their squared deviation, how far its contour's lower-left
// corner lies from the datum, and the iterations it took.
type fit struct {
	tf      Rigid
	match   []int
	matched int
	sse     float64
	datum   float64
	iters   int
}

// settleFit alternates optimal matching and the least-squares fit from
// tf until the matching and the transform settle (or no hole matches), at
// most 50 times. The fit's tf, match and iters are set; tf is not yet
// reduced to within ±π.
func settleFit(des, mea []r2.Vec, gate float64, tf Rigid) *fit {
	var match []int
	iters := 0
	for iters < 50 {
		iters++
		m := Assign(des, tf.InverseAll(mea), gate)
		var ps, qs []r2.Vec
		for i, k := range m {
			if k >= 0 {
				ps, qs = append(ps, des[i]), append(qs, mea[k])
			}
		}
		if len(ps) == 0 {
			match = m
			break
		}
		next := FitRigid(ps, qs, tf.Theta)
		settled := slices.Equal(m, match) && math.Abs(next.Theta-tf.Theta) < 1e-14 &&
			math.Abs(next.T.X-tf.T.X) < 1e-10 && math.Abs(next.T.Y-tf.T.Y) < 1e-10
		tf, match = next, m
		if settled {
			break
		}
	}
	return &fit{tf: tf, match: match, iters: iters}
}

// scoreFit counts the settled fit f's matched holes and their squared
// deviation, measures its contour's datum (when there is a contour), and
// then reduces its rotation to within ±π.
func scoreFit(des, mea []r2.Vec, contour []r2.Vec, f *fit) *fit {
	tf := f.tf
	al := tf.InverseAll(mea)
	for i, k := range f.match {
		if k >= 0 {
			f.matched++
			f.sse += abSq(al[k].X-des[i].X) + abSq(al[k].Y-des[i].Y)
		}
	}
	f.tf.Theta = math.Remainder(f.tf.Theta, 2*math.Pi)
	if len(contour) > 0 {
		cs := make([]r2.Vec, len(contour))
		for i, p := range contour {
			cs[i] = tf.Inverse(r2.Vec{X: p.X, Y: p.Y})
		}
		lo := pointsMin(cs)
		f.datum = math.Hypot(lo.X, lo.Y)
	}
	return f
}

// betterThan reports whether fit f beats fit b: more holes matched, then
// a clearly smaller squared deviation, then (byContour) a contour nearer
// the datum by more than datumTie (mm), then a clearly smaller rotation.
func (f *fit) betterThan(b *fit, byContour bool, datumTie float64) bool {
	scale := 1e-9 * (1 + b.sse)
	switch {
	case f.matched != b.matched:
		return f.matched > b.matched
	case math.Abs(f.sse-b.sse) > max(scale, 1e-6):
		return f.sse < b.sse
	case byContour && math.Abs(f.datum-b.datum) > max(datumTie, 1e-3):
		return f.datum < b.datum
	}
	return math.Abs(f.tf.Theta) < math.Abs(b.tf.Theta)-1e-9
}

func abSq(v float64) float64 { return v * v }

func abCentroid(ps []r2.Vec) r2.Vec {
	var c r2.Vec
	for _, p := range ps {
		c.X += p.X / float64(len(ps))
		c.Y += p.Y / float64(len(ps))
	}
	return c
}

// principalAxis is the direction of the points' major axis of inertia; ok
// is false when the points have none (one point, or a round cloud).
func principalAxis(ps []r2.Vec) (float64, bool) {
	c := abCentroid(ps)
	var sxx, syy, sxy float64
	for _, p := range ps {
		x, y := p.X-c.X, p.Y-c.Y
		sxx, syy, sxy = sxx+x*x, syy+y*y, sxy+x*y
	}
	if math.Hypot(sxx-syy, 2*sxy) < 1e-9*(sxx+syy+1e-300) {
		return 0, false
	}
	return 0.5 * math.Atan2(2*sxy, sxx-syy), true
}

func ContourMin(ps []r2.Vec) r2.Vec {
	lo := r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	for _, p := range ps {
		lo.X, lo.Y = min(lo.X, p.X), min(lo.Y, p.Y)
	}
	return lo
}

func pointsMin(ps []r2.Vec) r2.Vec {
	lo := r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	for _, p := range ps {
		lo.X, lo.Y = min(lo.X, p.X), min(lo.Y, p.Y)
	}
	return lo
}

// Assign matches design points to measured points by the optimal
// assignment (least total squared distance, Hungarian method) with a gate:
// a pair farther apart than gate is never matched, so a far-off hole is an
// extra hole and its design hole missing. It returns, per design point,
// the index of its measured point or -1.
func Assign(des, mea []r2.Vec, gate float64) []int {
	out := make([]int, len(des))
	for i := range out {
		out[i] = -1
	}
	// Only measured points within the gate of some design point take part.
	var cand []int
	for k, q := range mea {
		for _, p := range des {
			if math.Hypot(q.X-p.X, q.Y-p.Y) <= gate {
				cand = append(cand, k)
				break
			}
		}
	}
	if len(cand) == 0 || len(des) == 0 {
		return out
	}
	n, m := len(des), len(cand)
	g2 := gate * gate
	const never = 1e18
	// Columns: the candidates, then one "missing" column per design point.
	cost := make([][]float64, n)
	for i, p := range des {
		row := make([]float64, m+n)
		for j, k := range cand {
			q := mea[k]
			d2 := abSq(q.X-p.X) + abSq(q.Y-p.Y)
			row[j] = never
			if d2 <= g2 {
				row[j] = d2
			}
		}
		for j := range n {
			row[m+j] = never
		}
		row[m+i] = g2
		cost[i] = row
	}
	col := hungarian(cost)
	for i, j := range col {
		if j < m && cost[i][j] < never {
			out[i] = cand[j]
		}
	}
	return out
}

// hungarian solves the rectangular assignment problem (rows ≤ columns):
// the column of each row that minimises the total cost. O(n²·m), the
// potentials form of the Hungarian method.
func hungarian(cost [][]float64) []int {
	n := len(cost)
	m := len(cost[0])
	u, v := make([]float64, n+1), make([]float64, m+1)
	p, way := make([]int, m+1), make([]int, m+1)
	minv := make([]float64, m+1)
	used := make([]bool, m+1)
	for i := 1; i <= n; i++ {
		p[0] = i
		j0 := 0
		for j := range minv {
			minv[j], used[j] = math.Inf(1), false
		}
		for {
			used[j0] = true
			i0, delta, j1 := p[j0], math.Inf(1), 0
			for j := 1; j <= m; j++ {
				if used[j] {
					continue
				}
				if cur := cost[i0-1][j-1] - u[i0] - v[j]; cur < minv[j] {
					minv[j], way[j] = cur, j0
				}
				if minv[j] < delta {
					delta, j1 = minv[j], j
				}
			}
			for j := 0; j <= m; j++ {
				if used[j] {
					u[p[j]] += delta
					v[j] -= delta
				} else {
					minv[j] -= delta
				}
			}
			j0 = j1
			if p[j0] == 0 {
				break
			}
		}
		for j0 != 0 {
			j1 := way[j0]
			p[j0] = p[j1]
			j0 = j1
		}
	}
	col := make([]int, n)
	for j := 1; j <= m; j++ {
		if p[j] != 0 {
			col[p[j]-1] = j - 1
		}
	}
	return col
}

// The robust best fit. Least squares over every matched hole spreads one
// mislocated hole over all of them: the bad hole reads smaller than it is
// (a line's end hole is largely absorbed by the rotation) and good holes
// read larger, so the wrong holes can come out of tolerance. Robust
// looks for the largest set of holes that agree with one rigid motion
// within the position tolerance, fits on those alone, and leaves the
// others to show their error against that fit.

// Robust takes the matching of a settled least-squares fit tf (match[i]
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
func Robust(des, mea []r2.Vec, match []int, tol float64, tf Rigid) (out Rigid, in []bool, changed bool) {
	var idx []int // matched design points
	for i, k := range match {
		if k >= 0 {
			idx = append(idx, i)
		}
	}
	all := func() (Rigid, []bool, bool) {
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
		seed := FitRigid([]r2.Vec{ps[a], ps[b]}, []r2.Vec{qs[a], qs[b]}, tf.Theta)
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
	best.tf.Theta = math.Remainder(best.tf.Theta, 2*math.Pi)
	return best.tf, in, true
}

// seedPairs are the pairs of n matched holes that seed Robust: every
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
	tf    Rigid
	in    []bool
	count int
	sse   float64
}

// refine grows a consensus from the seed transform: the holes within tol
// of the current fit, then least squares on them, until the set no longer
// changes (at most 20 rounds). Nil when fewer than two holes agree or the
// set does not settle.
func refine(ps, qs []r2.Vec, tol float64, tf Rigid) *consensus {
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
					q := tf.Inverse(qs[j])
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
		tf, prev = FitRigid(sp, sq, tf.Theta), in
	}
	return nil
}

// inliers marks the matched holes whose measured centre, brought back by
// tf, lies within tol of the design centre (the slack of the report's own
// comparison, so that a hole in the fit is never reported out of
// position).
func inliers(ps, qs []r2.Vec, tol float64, tf Rigid) ([]bool, int) {
	in := make([]bool, len(ps))
	count := 0
	for j := range ps {
		q := tf.Inverse(qs[j])
		if math.Hypot(q.X-ps[j].X, q.Y-ps[j].Y) <= tol+slack {
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

// slack is the slack of the robust fit's tolerance comparison, in mm: a
// hole exactly at the tolerance agrees with the fit although the tolerance
// was converted (the same slack as package qa's comparisons).
const slack = 1e-6
