package netsection

import (
	"sort"

	"gaugeline/rules/units"
)

// PathHole is a hole as a net-section path sees it: its position along the
// load (X), its position across the section (U: y in a flat part, or the
// unfolded coordinate of an angle) and the width it removes (Dh: nominal
// hole across the load plus the B4.3 allowance).
type PathHole struct {
	X, U, Dh units.Length
}

// NetWidthDeduction finds the worst straight or zig-zag path across the
// section (B4.3b): the chain of holes, in increasing U, that maximises
// Σ Dh − Σ s²/4g, where s is the spacing along the load and g the gage
// between consecutive holes of the chain. It returns that deduction and
// the indexes of the holes on the path. Holes on one gage line (g ≈ 0)
// are never on one path.
func NetWidthDeduction(holes []PathHole) (units.Length, []int) {
	n := len(holes)
	if n == 0 {
		return 0, nil
	}
	order := make([]int, n)
	for i := range order {
		order[i] = i
	}
	sort.SliceStable(order, func(a, b int) bool { return holes[order[a]].U < holes[order[b]].U })
	best := make([]float64, n) // best deduction of a chain ending at order[k]
	prev := make([]int, n)
	for k := 0; k < n; k++ {
		hk := holes[order[k]]
		best[k], prev[k] = float64(hk.Dh), -1
		for j := 0; j < k; j++ {
			hj := holes[order[j]]
			g := float64(hk.U - hj.U)
			if g <= eps {
				continue
			}
			s := float64(hk.X - hj.X)
			if d := best[j] - s*s/(4*g) + float64(hk.Dh); d > best[k] {
				best[k], prev[k] = d, j
			}
		}
	}
	end := 0
	for k := 1; k < n; k++ {
		if best[k] > best[end] {
			end = k
		}
	}
	var path []int
	for k := end; k >= 0; k = prev[k] {
		path = append(path, order[k])
	}
	for i, j := 0, len(path)-1; i < j; i, j = i+1, j-1 {
		path[i], path[j] = path[j], path[i]
	}
	return units.Length(best[end]), path
}
