package engine

import (
	"fmt"
	"sort"

	"gaugeline/engine/netsection"
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

// block is one candidate block of the search (netsection.Block) and how
// a report names it.
type block struct {
	netsection.Block
	desc string
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
	// edges, when set, is the part's outline (a plate's): where its edges
	// lie seen from a point (netsection.Part.EdgeAt, LowAt, HighAt).
	edges *Plate
}

// blocks enumerates every block of the part (netsection.Blocks) and
// names each.
func (p blockPart) blocks(c *Connection) []block {
	// every hole as this part has it (the member's ply or the plate's)
	holes := make([]netsection.Hole, len(c.Holes))
	for i := range c.Holes {
		h := &c.Holes[i]
		s := p.ply(h)
		holes[i] = netsection.Hole{X: h.X, Y: h.Y, Dx: s.Dx, Dy: s.Dy}
	}
	part := netsection.Part{T: p.t, Low: p.low, High: p.high, HasLow: p.hasLow, HasHigh: p.hasHigh, XEdge: p.xEdge, Toward: p.toward}
	if pl := p.edges; pl != nil {
		part.EdgeAt = func(x, y units.Length) units.Length { return pl.EdgeAlong(x, y, false, p.toward) }
		part.LowAt = func(x, y units.Length) units.Length { return pl.EdgeAlong(x, y, true, -1) }
		part.HighAt = func(x, y units.Length) units.Length { return pl.EdgeAlong(x, y, true, 1) }
	}
	rn := func(Agv, Anv, Ant units.Area) units.Force { return BlockShearRn(p.Fy, p.Fu, Agv, Anv, Ant, 1) }
	lines := GageLines(c)
	found := netsection.Blocks(part, holes, lines, c.Edition.HoleAllowance(), rn)
	out := make([]block, len(found))
	for i, b := range found {
		out[i] = block{b, p.describe(b, len(lines))}
	}
	return out
}

// describe names a block by its boundaries.
func (p blockPart) describe(b netsection.Block, lines int) string {
	switch {
	case b.Low < 0:
		return fmt.Sprintf("%s: line %d to the %s", p.name, b.High+1, p.edgeName(false))
	case b.High >= lines:
		return fmt.Sprintf("%s: line %d to the %s", p.name, b.Low+1, p.edgeName(true))
	}
	return fmt.Sprintf("%s: between lines %d and %d", p.name, b.Low+1, b.High+1)
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
		if b.WorseThan(blocks[w].Block) {
			w = i
		}
	}
	b := blocks[w]
	k := float64(b.Bolts) / float64(max(n, 1))
	const Ubs = 1.0
	what, title := "thickness", "Block shear of the plate, tearing out toward its free edge"
	if p.name == "member" {
		what, title = "thickness of the member", "Block shear of the member, tearing out toward the member end"
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
	blocks, p := memberBlocks(c)
	return blockResult(c, "member.block-shear", blocks, p)
}

// BlockCase is one block a block-shear check examined: how a report names
// it, its areas, its nominal strength and the bolts it tears out.
type BlockCase struct {
	Desc          string
	Agv, Anv, Ant units.Area
	Rn            units.Force
	Bolts         int
}

// MemberBlocks lists every block MemberBlockShear examines, in its order.
func MemberBlocks(c *Connection) []BlockCase {
	blocks, _ := memberBlocks(c)
	out := make([]BlockCase, len(blocks))
	for i, b := range blocks {
		out[i] = BlockCase{Desc: b.desc, Agv: b.Agv, Anv: b.Anv, Ant: b.Ant, Rn: b.Rn, Bolts: b.Bolts}
	}
	return out
}

// memberBlocks is every block of the member and the part they belong to.
func memberBlocks(c *Connection) ([]block, blockPart) {
	m := c.Member
	low, high := m.Shape.FreeEdges()
	p := blockPart{
		t: units.Length(m.Pieces) * m.T, Fy: m.Fy, Fu: m.Fu,
		high: m.Width, hasHigh: high,
		hasLow: low,
		xEdge:  0, toward: -1, name: "member", ply: memberPly,
	}
	blocks := p.blocks(c)
	if len(m.Junctions) > 0 {
		blocks = spanJunctions(c, blocks, p)
	}
	if m.TearOff != nil {
		blocks = append(blocks, tearOffBlocks(c, p)...)
	}
	return blocks, p
}

// spanJunctions strengthens the blocks whose tension plane runs across a
// junction in the middle of the connected element (a tee's stem, a W's
// web): the element standing there tears in tension too, so its area, the
// section less its connected elements (Ag − ConnectedArea), joins Ant (the
// AISC teaching model's "block shear 3" of a WT,
// aisc-org/aisc-model-viewer src/wt-plate/calculations.md).
func spanJunctions(c *Connection, blocks []block, p blockPart) []block {
	m := &c.Member
	lines := GageLines(c)
	extra := m.Ag - m.Shape.ConnectedArea(m)
	for i := range blocks {
		b := &blocks[i]
		y0, y1 := units.Length(0), m.Width
		if b.Low >= 0 {
			y0 = c.Holes[lines[b.Low][0]].Y
		}
		if b.High < len(lines) {
			y1 = c.Holes[lines[b.High][0]].Y
		}
		for _, j := range m.Junctions {
			if j.Side == 0 && j.At > y0 && j.At < y1 {
				b.Ant += extra
				b.Rn = BlockShearRn(p.Fy, p.Fu, b.Agv, b.Anv, b.Ant, 1)
				b.desc += ", the " + j.Name + " torn across"
				break
			}
		}
	}
	return blocks
}

// tearOffBlocks are the blocks of Member.TearOff, one per row of bolts:
// the tension plane across the connected element(s) through that row,
// the shear planes along the rest of the section from the member end to
// it, tearing out the bolts of that row and every row nearer the end.
//
// Clause: J4.3
func tearOffBlocks(c *Connection, p blockPart) []block {
	m := &c.Member
	to := m.TearOff
	allow := c.Edition.HoleAllowance()
	xs := make([]units.Length, 0, len(c.Holes))
	for i := range c.Holes {
		xs = append(xs, c.Holes[i].X)
	}
	sort.Slice(xs, func(a, b int) bool { return xs[a] < xs[b] })
	slack := LineSlack(c.Bolt.D)
	var out []block
	for k, x := range xs {
		if k+1 < len(xs) && xs[k+1]-x <= slack {
			continue // the row's last hole along x stands for it
		}
		var holes units.Length
		bolts := 0
		for i := range c.Holes {
			h := &c.Holes[i]
			if h.X <= x+eps {
				bolts++
			}
			if h.X >= x-slack && h.X <= x+eps {
				holes += h.Dy + allow
			}
		}
		Agv := units.Area(float64(to.Planes) * float64(to.T) * float64(x))
		Ant := max(to.At-units.Area(float64(m.Pieces)*float64(holes)*float64(m.T)), 0)
		rn := BlockShearRn(p.Fy, p.Fu, Agv, Agv, Ant, 1)
		out = append(out, block{netsection.Block{Low: -1, High: -1, Agv: Agv, Anv: Agv, Ant: Ant, Rn: rn, Bolts: bolts},
			fmt.Sprintf("member: across the %s at the row %s from the end, the %s sheared", connectedName(m), units.FormatJob(x, c.Edition.System()), to.What)})
	}
	return out
}

// connectedName is what a report calls the member's connected element.
func connectedName(m *Member) string {
	if m.Pieces > 1 {
		return PieceName(m.Shape) + "s"
	}
	return m.ConnectedElement()
}

// PlateBlockShear is block shear of the plate, the weakest of the L-shaped
// blocks (one gage line to a side edge) and the U-shaped blocks (between
// two gage lines) tearing out toward the plate's free edge. A plate with an
// outline has its planes end where the outline is: a shear plane runs
// from the outline along its line to the hole, a tension plane from the
// hole across to the outline.
//
// Clause: J4.3
func PlateBlockShear(c *Connection) Result {
	pl := c.Plate
	p := blockPart{
		t: pl.TotalT(), Fy: pl.Fy, Fu: pl.Fu,
		low: pl.YMin(), high: pl.YMax(), hasLow: true, hasHigh: true,
		xEdge: pl.FreeEdge, toward: 1, name: "plate", ply: platePly,
	}
	if pl.Outline != nil {
		p.edges = pl
	}
	return blockResult(c, "plate.block-shear", p.blocks(c), p)
}
