package engine

import (
	"fmt"
	"math"

	"gaugeline/engine/working"
	"gaugeline/rules/units"
)

// BlockShearRn is the nominal block shear strength of one block:
// Rn = 0.60·Fu·Anv + Ubs·Fu·Ant ≤ 0.60·Fy·Agv + Ubs·Fu·Ant.
//
// Clause: J4.3
func BlockShearRn(Fy, Fu units.Stress, Agv, Anv, Ant units.Area, Ubs float64) units.Force {
	rupture, yield := blockShearParts(Fy, Fu, Agv, Anv, Ant, Ubs)
	return min(rupture, yield)
}

// blockShearParts are the two sides of J4.3: shear rupture with tension
// rupture, and shear yielding with tension rupture.
func blockShearParts(Fy, Fu units.Stress, Agv, Anv, Ant units.Area, Ubs float64) (rupture, yield units.Force) {
	tension := units.Force(Ubs) * Fu.Times(Ant)
	return 0.6*Fu.Times(Anv) + tension, 0.6*Fy.Times(Agv) + tension
}

// block is one candidate block: its boundaries across the load are either a
// free edge or a gage line (a shear plane runs along every gage-line
// boundary); the tension plane runs between the boundaries through the
// innermost hole of every line it crosses. Bolts is the number of bolts
// whose holes the block tears out.
type block struct {
	desc          string
	Agv, Anv, Ant units.Area
	Rn            units.Force
	Bolts         int
}

// worseThan orders blocks by ratio at any demand: the bolts a block tears
// out (its share of the force) over its strength.
func (b block) worseThan(o block) bool {
	return float64(b.Bolts)*float64(o.Rn) > float64(o.Bolts)*float64(b.Rn)*(1+1e-12)
}

// blockPart describes one part for the block search.
type blockPart struct {
	t      units.Length // total thickness (both angles of a pair)
	Fy, Fu units.Stress
	// free edges across the load; hasLow/hasHigh say whether they exist
	low, high       units.Length
	hasLow, hasHigh bool
	// the block tears out toward xEdge: toward −x for the member (xEdge
	// = 0), toward +x for the plate (xEdge = its free edge).
	xEdge  units.Length
	toward float64 // −1 member, +1 plate
	name   string  // "member" or "plate"
	ply    func(*Hole) HoleShape
}

// HoleChord is the length along the load that a line parallel to the load,
// dy off the hole's centre, cuts through a hole a long (along the load)
// and b wide (across it): the whole length a on the centre line, less as
// the line moves off it, and zero once it clears the hole. Round holes and
// slots (stadiums) are exact.
func HoleChord(a, b, dy units.Length) units.Length {
	dy = units.Length(math.Abs(float64(dy)))
	if dy >= b/2 {
		return 0
	}
	if b >= a { // round, or a slot across the load: straight sides along x
		straight := (b - a) / 2
		if dy <= straight {
			return a
		}
		r, e := float64(a/2), float64(dy-straight)
		return units.Length(2 * math.Sqrt(max(r*r-e*e, 0)))
	}
	r := float64(b / 2) // a slot along the load: round ends of radius b/2
	return a - b + units.Length(2*math.Sqrt(max(r*r-float64(dy*dy), 0)))
}

// blocks enumerates every block of the part and returns them all.
func (p blockPart) blocks(c *Connection) []block {
	// every hole as this part has it (the member's ply or the plate's)
	holes := make([]Hole, len(c.Holes))
	for i := range c.Holes {
		holes[i] = c.Holes[i]
		holes[i].HoleShape, holes[i].Plate = p.ply(&c.Holes[i]), nil
	}
	allow := c.Edition.HoleAllowance()
	lines := GageLines(c)
	nl := len(lines)
	// dist is a hole's distance from the tear-out edge along the load.
	dist := func(h Hole) units.Length { return units.Length(p.toward) * (p.xEdge - h.X) }
	// innermost hole of each line: farthest from the tear-out edge
	inner := make([]int, nl)
	for i, ln := range lines {
		inner[i] = ln[0]
		for _, h := range ln {
			if dist(holes[h]) > dist(holes[inner[i]]) {
				inner[i] = h
			}
		}
	}
	// shearTo is the shear plane along y from the edge to the distance D:
	// it takes out the part between the edge and D of every hole it cuts
	// (B4.3 width along the load): half of one centred where it ends. As-
	// built holes a little off the line are cut over their chord, not over
	// their whole length.
	shearTo := func(y, D units.Length) (Agv, Anv units.Area) {
		net := D
		for _, h := range holes {
			cut := HoleChord(h.Dx+allow, h.Dy+allow, h.Y-y)
			d := dist(h)
			if lo, hi := max(d-cut/2, 0), min(d+cut/2, D); hi > lo {
				net -= hi - lo
			}
		}
		return D.Mul(p.t), net.Mul(p.t)
	}
	// inside reports whether the hole of h reaches inside a block whose
	// tension plane is at the distance D where h lies across the load: its
	// bolt is then torn out with the block (a bolt whose hole the plane
	// cuts counts, which is the larger share).
	inside := func(h Hole, D units.Length) bool { return dist(h) < D+h.Dx/2-eps }
	// torn counts the bolts a block between y0 and y1 tears out, its
	// tension plane at the distance at(y).
	torn := func(y0, y1 units.Length, at func(units.Length) units.Length) int {
		n := 0
		for _, h := range holes {
			if h.Y+h.Dy/2 > y0-eps && h.Y-h.Dy/2 < y1+eps && inside(h, at(h.Y)) {
				n++
			}
		}
		return n
	}
	// shear is the shear plane along line i to its innermost hole.
	shear := func(i int) (Agv, Anv units.Area) {
		hi := holes[inner[i]]
		return shearTo(hi.Y, dist(hi))
	}
	// across is a tension plane square to the load at the distance D from
	// y0 to y1: it takes out the part between y0 and y1 of every hole it
	// cuts (B4.3 width across the load).
	across := func(y0, y1, D units.Length) units.Area {
		net := y1 - y0
		for _, h := range holes {
			w := HoleChord(h.Dy+allow, h.Dx+allow, dist(h)-D)
			lo, hi := max(h.Y-w/2, y0), min(h.Y+w/2, y1)
			if hi > lo {
				net -= hi - lo
			}
		}
		return max(net, 0).Mul(p.t)
	}
	// plane is one tension plane from boundary a to boundary b (line
	// indexes; -1 is the low free edge, nl the high free edge): it ends at
	// the boundaries' innermost holes (taking half of each) and, between
	// them, passes through the innermost hole of each line in the mask
	// (the whole hole, plus s²/4g for each diagonal, B4.3b) and past the
	// others. It returns Ant and the bolts the block tears out: every hole
	// between the boundaries (or cut by a boundary's shear plane) on the
	// edge side of the plane.
	plane := func(a, b int, y0, y1 units.Length, between []int, mask int) (units.Area, int) {
		var stops []Hole
		net := y1 - y0
		half := func(i int) {
			h := holes[inner[i]]
			stops = append(stops, h)
			net -= (h.Dy + allow) / 2
		}
		if a >= 0 {
			half(a)
		}
		for k, i := range between {
			if mask&(1<<k) != 0 {
				h := holes[inner[i]]
				stops = append(stops, h)
				net -= h.Dy + allow
			}
		}
		if b < nl {
			half(b)
		}
		for k := 1; k < len(stops); k++ {
			g, s := stops[k].Y-stops[k-1].Y, stops[k].X-stops[k-1].X
			if g > eps {
				net += units.Length(float64(s*s) / float64(4*g))
			}
		}
		// the plane's distance from the edge at y: straight between its
		// stops, square to the load beyond the first and the last
		at := func(y units.Length) units.Length {
			if y <= stops[0].Y {
				return dist(stops[0])
			}
			for k := 1; k < len(stops); k++ {
				if y <= stops[k].Y {
					f := (y - stops[k-1].Y) / max(stops[k].Y-stops[k-1].Y, eps)
					return dist(stops[k-1]) + f*(dist(stops[k])-dist(stops[k-1]))
				}
			}
			return dist(stops[len(stops)-1])
		}
		return net.Mul(p.t), torn(y0, y1, at)
	}
	// most is how many lines in between are tried every way; beyond it
	// the plane goes through all of them or through none.
	const most = 8
	var out []block
	add := func(a, b int, desc string) {
		var Agv, Anv units.Area
		for _, i := range []int{a, b} {
			if i >= 0 && i < nl {
				g, n := shear(i)
				Agv, Anv = Agv+g, Anv+n
			}
		}
		Agv, Anv = max(Agv, 0), max(Anv, 0)
		y0, y1 := p.low, p.high
		if a >= 0 {
			y0 = holes[inner[a]].Y
		}
		if b < nl {
			y1 = holes[inner[b]].Y
		}
		var between []int
		for i := a + 1; i < b; i++ {
			if i >= 0 && i < nl {
				between = append(between, i)
			}
		}
		masks := []int{1<<len(between) - 1, 0}
		if len(between) <= most {
			masks = masks[:0]
			for m := 1<<len(between) - 1; m >= 0; m-- {
				masks = append(masks, m)
			}
		}
		// the plane that makes the block worst
		var worst block
		first := true
		consider := func(bl block) {
			if first || bl.worseThan(worst) {
				worst, first = bl, false
			}
		}
		for _, m := range masks {
			Ant, bolts := plane(a, b, y0, y1, between, m)
			Ant = max(Ant, 0)
			consider(block{desc, Agv, Anv, Ant, BlockShearRn(p.Fy, p.Fu, Agv, Anv, Ant, 1), bolts})
		}
		// square blocks: the shear planes along the boundaries run to the
		// distance D of a hole between them and the tension plane goes
		// straight across there, past the boundaries' own last holes when
		// they end nearer the edge (a measured hole off its line makes a
		// line of its own that ends early)
		for _, h := range holes {
			if h.Y+h.Dy/2 <= y0+eps || h.Y-h.Dy/2 >= y1-eps {
				continue
			}
			D := dist(h)
			var gv, nv units.Area
			if a >= 0 {
				gv, nv = shearTo(y0, D)
			}
			if b < nl {
				g, n := shearTo(y1, D)
				gv, nv = gv+g, nv+n
			}
			nt := across(y0, y1, D)
			bolts := torn(y0, y1, func(units.Length) units.Length { return D })
			gv, nv = max(gv, 0), max(nv, 0)
			consider(block{desc, gv, nv, nt, BlockShearRn(p.Fy, p.Fu, gv, nv, nt, 1), bolts})
		}
		out = append(out, worst)
	}
	for a := 0; a < nl; a++ {
		if p.hasLow {
			add(-1, a, fmt.Sprintf("%s: line %d to the %s", p.name, a+1, p.edgeName(false)))
		}
		if p.hasHigh {
			add(a, nl, fmt.Sprintf("%s: line %d to the %s", p.name, a+1, p.edgeName(true)))
		}
		for b := a + 1; b < nl; b++ {
			add(a, b, fmt.Sprintf("%s: between lines %d and %d", p.name, a+1, b+1))
		}
	}
	return out
}

func (p blockPart) edgeName(high bool) string {
	switch {
	case p.name == "member" && p.hasLow:
		if high {
			return "far edge"
		}
		return "near edge"
	case p.name == "member":
		return "toe"
	case high:
		return "upper side"
	}
	return "lower side"
}

// blockResult picks the block with the highest ratio. A block that tears
// out k of the n bolts is loaded by k/n of the force (the bolts share the
// force equally, as the bolt checks take it): the bolts outside it still
// carry their own share through the rest of the part.
func blockResult(c *Connection, id string, blocks []block, p blockPart) Result {
	n := len(c.Holes)
	w := 0
	for i, b := range blocks {
		if b.worseThan(blocks[w]) {
			w = i
		}
	}
	b := blocks[w]
	k := float64(b.Bolts) / float64(max(n, 1))
	const Ubs = 1.0
	what, title := "thickness", "Block shear of the plate, tearing out toward its free edge"
	if p.name == "member" {
		what, title = "thickness (both angles of a pair)", "Block shear of the member, tearing out toward the member end"
	}
	vs := newValues(11)
	pAgv := vs.add(Value{Name: "Agv", V: float64(b.Agv), Dim: units.DimArea, What: "gross area in shear"})
	pAnv := vs.add(Value{Name: "Anv", V: float64(b.Anv), Dim: units.DimArea, What: "net area in shear"})
	pAnt := vs.add(Value{Name: "Ant", V: float64(b.Ant), Dim: units.DimArea, What: "net area in tension"})
	pUbs := vs.add(Value{Name: "Ubs", V: Ubs, What: "tension stress factor (uniform tension)"})
	pFy, pFu := vs.add(valFy(p.Fy)), vs.add(valFu(p.Fu))
	vs.add(valT(c, p.t, p.name == "member", what))
	vs.add(Value{Name: "blocks", V: float64(len(blocks)), What: "blocks examined"})
	vs.add(Value{Name: "bolts_in_block", V: float64(b.Bolts)})
	vs.add(Value{Name: "bolts", V: float64(n), What: "bolts"})
	vs.add(Value{Name: "share", V: k})
	r := finishFor(c, units.Force(k)*c.Demand, id, "J4.3", b.Rn, c.Edition.BlockShearFactor(), vs.list,
		fmt.Sprintf("worst of %d blocks: %s, tearing out %d of %d bolts and carrying that share of the force (Ubs = 1, uniform tension)",
			len(blocks), b.desc, b.Bolts, n))

	Fy, Fu, Agv, Anv, Ant, Rn := p.Fy, p.Fu, b.Agv, b.Anv, b.Ant, b.Rn
	r.explain = func() Working {
		agv, anv, ant, ubs, fy, fu := *pAgv, *pAnv, *pAnt, *pUbs, *pFy, *pFu
		rupture, yield := blockShearParts(Fy, Fu, Agv, Anv, Ant, Ubs)
		tension := working.Mul(working.Coef(ubs, 1), working.Of(fu), working.Of(ant))
		rup := Step{Value: Value{Sym: "shear rupture + tension", V: float64(rupture), Dim: units.DimForce},
			Expr: working.Add(working.Mul(working.K(0.6, "0.60"), working.Of(fu), working.Of(anv)), tension)}
		yld := Step{Value: Value{Sym: "shear yielding + tension", V: float64(yield), Dim: units.DimForce},
			Expr: working.Add(working.Mul(working.K(0.6, "0.60"), working.Of(fy), working.Of(agv)), tension)}
		return Working{
			Title:   title,
			Formula: []Step{{Value: Value{Sym: "Rn"}, Expr: rup.Expr, Then: working.Phrase(working.Words(" ≤ "), yld.Expr)}},
			Where:   "Agv and Anv are the gross and net areas in shear, Ant the net area in tension, of one block; every plausible block is examined and the weakest governs",
			Steps: []Step{rup, yld,
				{Value: nominal(Rn), Expr: working.Min(working.Of(rup.Value), working.Of(yld.Value)), Say: working.Words("the lesser")}},
		}
	}
	return r
}

// MemberBlockShear is block shear of the member, the weakest of every
// block that tears out toward the member end: for angles each gage line's
// strip to the toe and the blocks between gage lines; for flats also the
// strips to either edge.
//
// Clause: J4.3
func MemberBlockShear(c *Connection) Result {
	m := c.Member
	low, high := m.Shape.FreeEdges()
	p := blockPart{
		t: units.Length(m.Pieces) * m.T, Fy: m.Fy, Fu: m.Fu,
		high: m.Width, hasHigh: high,
		hasLow: low,
		xEdge:  0, toward: -1, name: "member", ply: memberPly,
	}
	return blockResult(c, "member.block-shear", p.blocks(c), p)
}

// PlateBlockShear is block shear of the plate, the weakest of the L-shaped
// blocks (one gage line to a side edge) and the U-shaped blocks (between
// two gage lines) tearing out toward the plate's free edge.
//
// Clause: J4.3
func PlateBlockShear(c *Connection) Result {
	pl := c.Plate
	p := blockPart{
		t: pl.T, Fy: pl.Fy, Fu: pl.Fu,
		low: pl.YMin(), high: pl.YMax(), hasLow: true, hasHigh: true,
		xEdge: pl.FreeEdge, toward: 1, name: "plate", ply: platePly,
	}
	return blockResult(c, "plate.block-shear", p.blocks(c), p)
}
