package engine

import (
	"fmt"
	"math"

	"gaugeline/rules/units"
)

// BlockShearRn is the nominal block shear strength of one block:
// Rn = 0.60·Fu·Anv + Ubs·Fu·Ant ≤ 0.60·Fy·Agv + Ubs·Fu·Ant.
//
// Clause: J4.3
func BlockShearRn(Fy, Fu units.Stress, Agv, Anv, Ant units.Area, Ubs float64) units.Force {
	tension := units.Force(Ubs) * Fu.Times(Ant)
	rupture := 0.6*Fu.Times(Anv) + tension
	yield := 0.6*Fy.Times(Agv) + tension
	return min(rupture, yield)
}

// block is one candidate block: its boundaries across the load are either a
// free edge or a gage line (a shear plane runs along every gage-line
// boundary); the tension plane runs between the boundaries through the
// innermost hole of every line it crosses.
type block struct {
	desc          string
	Agv, Anv, Ant units.Area
	Rn            units.Force
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
}

// blocks enumerates every block of the part and returns them all.
func (p blockPart) blocks(c *Connection) []block {
	allow := c.Edition.HoleAllowance()
	lines := GageLines(c)
	nl := len(lines)
	// innermost hole of each line: farthest from the tear-out edge
	inner := make([]int, nl)
	for i, ln := range lines {
		inner[i] = ln[0]
		for _, h := range ln {
			if p.toward*float64(c.Holes[h].X-c.Holes[inner[i]].X) < 0 {
				inner[i] = h
			}
		}
	}
	shear := func(i int) (Agv, Anv units.Area) {
		h := c.Holes[inner[i]]
		lgv := units.Length(math.Abs(float64(p.xEdge - h.X)))
		dh := h.Dx + allow
		ln := units.Length(len(lines[i])) - 0.5
		return lgv.Mul(p.t), (lgv - ln*dh).Mul(p.t)
	}
	// tension plane from boundary a to boundary b (line indexes; -1 is the
	// low free edge, nl the high free edge)
	tension := func(a, b int) units.Area {
		var y0, y1 units.Length
		if a < 0 {
			y0 = p.low
		} else {
			y0 = c.Holes[inner[a]].Y
		}
		if b >= nl {
			y1 = p.high
		} else {
			y1 = c.Holes[inner[b]].Y
		}
		net := y1 - y0
		from, to := max(a, 0), min(b, nl-1)
		for i := from; i <= to; i++ {
			h := c.Holes[inner[i]]
			w := h.Dy + allow
			if i == a || i == b {
				w /= 2
			}
			net -= w
			if i > from {
				g := h.Y - c.Holes[inner[i-1]].Y
				s := h.X - c.Holes[inner[i-1]].X
				net += units.Length(float64(s*s) / float64(4*g))
			}
		}
		return net.Mul(p.t)
	}
	var out []block
	add := func(a, b int, desc string) {
		var Agv, Anv units.Area
		for _, i := range []int{a, b} {
			if i >= 0 && i < nl {
				g, n := shear(i)
				Agv, Anv = Agv+g, Anv+n
			}
		}
		Ant := tension(a, b)
		Agv, Anv, Ant = max(Agv, 0), max(Anv, 0), max(Ant, 0)
		out = append(out, block{desc, Agv, Anv, Ant, BlockShearRn(p.Fy, p.Fu, Agv, Anv, Ant, 1)})
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

func blockResult(c *Connection, id string, blocks []block, p blockPart) Result {
	w := 0
	for i, b := range blocks {
		if b.Rn < blocks[w].Rn {
			w = i
		}
	}
	b := blocks[w]
	return finish(c, id, "J4.3", b.Rn, c.Edition.BlockShearFactor(), []Value{
		{"Agv", float64(b.Agv), units.DimArea},
		{"Anv", float64(b.Anv), units.DimArea},
		{"Ant", float64(b.Ant), units.DimArea},
		{"Ubs", 1, units.Dimensionless},
		{"Fy", float64(p.Fy), units.DimStress},
		{"Fu", float64(p.Fu), units.DimStress},
		{"t", float64(p.t), units.DimLength},
		{"blocks", float64(len(blocks)), units.Dimensionless},
	}, fmt.Sprintf("weakest of %d blocks: %s (Ubs = 1, uniform tension)", len(blocks), b.desc))
}

// MemberBlockShear is block shear of the member, the weakest of every
// block that tears out toward the member end: for angles each gage line's
// strip to the toe and the blocks between gage lines; for flats also the
// strips to either edge.
//
// Clause: J4.3
func MemberBlockShear(c *Connection) Result {
	m := c.Member
	p := blockPart{
		t: units.Length(m.Pieces) * m.T, Fy: m.Fy, Fu: m.Fu,
		high: m.Width, hasHigh: true,
		hasLow: m.Shape == Flat,
		xEdge:  0, toward: -1, name: "member",
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
		xEdge: pl.FreeEdge, toward: 1, name: "plate",
	}
	return blockResult(c, "plate.block-shear", p.blocks(c), p)
}
