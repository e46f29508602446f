package propose

import (
	"runtime"
	"slices"
	"sync"
)

// Exhaustive enumeration: the reference the pruned search must agree with.

// exhaustive checks every candidate and returns the best of each
// arrangement, best first, under the job's objective, and the best of
// each group under the other one. Groups are shared out among the cores;
// progress (nil: none) hears of every candidate of the space. A panic on
// a worker is raised again on the caller's goroutine, where it can be
// recovered.
func (p *problem) exhaustive(space int, progress func(done, total int)) (bests, others []*cand) {
	p.fillGages()
	type result struct {
		best  *cand
		evals int
	}
	res := make([]result, len(p.groups))
	var mu sync.Mutex // serialises progress, guards done and failure
	done := 0
	var failure any
	failed := false
	tick := func(n int) {
		if progress == nil {
			return
		}
		mu.Lock()
		defer mu.Unlock()
		done += n
		progress(done, space)
	}
	next := make(chan int)
	var wg sync.WaitGroup
	for range max(1, runtime.GOMAXPROCS(0)) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for gi := range next { // after a failure: drain, check nothing
				func() {
					defer func() {
						if v := recover(); v != nil {
							mu.Lock()
							if !failed {
								failure, failed = v, true
							}
							mu.Unlock()
						}
					}()
					mu.Lock()
					stop := failed
					mu.Unlock()
					if !stop {
						res[gi].best, res[gi].evals = p.exhaustGroup(p.groups[gi], tick)
					}
				}()
			}
		}()
	}
	for gi := range p.groups {
		next <- gi
	}
	close(next)
	wg.Wait()
	if failed {
		panic(failure)
	}
	for _, r := range res {
		p.evals += r.evals
		if r.best != nil {
			bests = append(bests, r.best)
		}
	}
	others = slices.Clone(bests)
	slices.SortFunc(bests, func(a, b *cand) int { return compare(p.obj, a, b) })
	slices.SortFunc(others, func(a, b *cand) int { return compare(p.obj.other(), a, b) })
	return onePerArrangement(bests), others
}

// tickEvery is how many candidates an exhaustive worker checks between
// progress reports.
const tickEvery = 256

// exhaustGroup checks every candidate of one group and returns the best
// and the number checked; tick hears how many were gone through.
func (p *problem) exhaustGroup(g *group, tick func(n int)) (best *cand, evals int) {
	seen := 0
	for g2i := range g.gage2 {
		for _, g1 := range g.gages[g2i] {
			for i := range g.pitch {
				for j := range g.end {
					for k := range g.edge {
						if seen++; seen == tickEvery {
							tick(seen)
							seen = 0
						}
						c := p.newCand(g, g2i, g1, i, j, k)
						if !p.check(c) {
							continue
						}
						evals++
						if !c.feasible() {
							c.rep = nil // keep memory flat: only the best stay
							continue
						}
						if best == nil || compare(p.obj, c, best) < 0 {
							best = c
						}
					}
				}
			}
		}
	}
	if seen > 0 {
		tick(seen)
	}
	return best, evals
}
