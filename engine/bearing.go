package engine

import (
	"fmt"
	"math"

	"gaugeline/engine/working"
	"gaugeline/rules/units"
)

// BearingRn is the nominal bearing and tearout strength of one bolt hole:
// rn = min(cb·d·t·Fu, ct·lc·t·Fu), with cb, ct from the edition (2.4 and
// 1.2 when deformation at service load is considered).
//
// Clause: J3.10 [J3.11]
func BearingRn(cb, ct float64, d, lc, t units.Length, Fu units.Stress) (bearing, tearout units.Force) {
	bearing = units.Force(cb) * Fu.Times(d.Mul(t))
	tearout = units.Force(ct) * Fu.Times(max(lc, 0).Mul(t))
	return bearing, tearout
}

// clearDistances returns lc for every hole: the clear distance, in the
// direction the part is pulled relative to the bolt (dir −1: toward −x; +1:
// toward +x), from the hole's edge to the edge of the next hole in its line
// of force or to the part's edge ahead of it, at x = edge(hole), along the
// hole's centre line. ply gives each hole's shape
// in the part (the member's or the plate's). A hole in the same row
// (within rowSlack along the load, as a measured hole a little off its row
// is) is beside the bolt, not ahead of it.
func clearDistances(holes []Hole, ply func(*Hole) HoleShape, dir float64, edge func(*Hole) units.Length, rowSlack units.Length) []units.Length {
	lc := make([]units.Length, len(holes))
	for i := range holes {
		h, hs := &holes[i], ply(&holes[i])
		best := units.Length(dir*float64(edge(h)-h.X)) - hs.Dx/2
		for j := range holes {
			if j == i {
				continue
			}
			o, osh := &holes[j], ply(&holes[j])
			ahead := units.Length(dir * float64(o.X-h.X))
			if ahead <= rowSlack || math.Abs(float64(o.Y-h.Y)) >= float64(max(hs.Dy, osh.Dy))/2 {
				continue
			}
			if d := ahead - (osh.Dx+hs.Dx)/2; d < best {
				best = d
			}
		}
		lc[i] = best
	}
	return lc
}

// memberPly and platePly give a hole's shape in the member and in the plate.
func memberPly(h *Hole) HoleShape { return h.HoleShape }
func platePly(h *Hole) HoleShape  { return h.InPlate() }

// bearingShares computes every hole's bearing and tearout in one part,
// each hole of the shape ply gives it in that part.
func bearingShares(c *Connection, ply func(*Hole) HoleShape, t units.Length, Fu units.Stress, dir float64, edge func(*Hole) units.Length) []BoltShare {
	lcs := clearDistances(c.Holes, ply, dir, edge, LineSlack(c.Bolt.D))
	shares := make([]BoltShare, len(c.Holes))
	for i := range c.Holes {
		h := &c.Holes[i]
		hs := ply(h)
		cb, ct := c.Edition.BearingCoefficients(hs.Type, hs.Slot, c.Bolt.DeformationConsidered)
		b, tr := BearingRn(cb, ct, c.Bolt.D, lcs[i], t, Fu)
		s := BoltShare{Hole: h.ID, Lc: lcs[i], Bearing: b, Tearout: tr, Rn: b, Governed: "bearing"}
		if tr < b {
			s.Rn, s.Governed = tr, "tearout"
		}
		shares[i] = s
	}
	return shares
}

// bearingPart is what the bearing result of a part says of it.
type bearingPart struct {
	id, note, title, toward string // toward: where lc is measured, for the table
	member                  bool
}

func bearingResult(c *Connection, bp bearingPart, ply func(*Hole) HoleShape, t units.Length, Fu units.Stress, shares []BoltShare) Result {
	var Rn units.Force
	lcMin := units.Length(math.Inf(1))
	tear := 0
	for _, s := range shares {
		Rn += s.Rn
		lcMin = min(lcMin, s.Lc)
		if s.Governed == "tearout" {
			tear++
		}
	}
	cb, ct := 0.0, 0.0
	if len(c.Holes) > 0 {
		hs := ply(&c.Holes[0])
		cb, ct = c.Edition.BearingCoefficients(hs.Type, hs.Slot, c.Bolt.DeformationConsidered)
	}
	what := "thickness"
	if bp.member {
		what = "thickness of the member bearing"
	}
	vs := newValues(7)
	pD := vs.add(Value{Name: "d", V: float64(c.Bolt.D), Dim: units.DimLength, What: "bolt diameter"})
	pT, pFu := vs.add(valT(c, t, bp.member, what)), vs.add(valFu(Fu))
	pLc := vs.add(Value{Name: "lc_min", V: float64(lcMin), Dim: units.DimLength, Sym: "lc,min", What: "least clear distance lc"})
	pCb := vs.add(Value{Name: "bearing_coefficient", V: cb, Sym: "cb", What: "bearing coefficient cb"})
	pCt := vs.add(Value{Name: "tearout_coefficient", V: ct, Sym: "ct", What: "tearout coefficient ct"})
	pBolts := vs.add(Value{Name: "bolts", V: float64(len(shares)), What: "bolts"})
	r := finish(c, bp.id, "J3.10", Rn, c.Edition.BearingFactor(), vs.list,
		fmt.Sprintf("%s: sum over %d bolts of min(bearing, tearout); tearout governs %d", bp.note, len(shares), tear))
	r.PerBolt = shares

	deformation, D := c.Bolt.DeformationConsidered, c.Bolt.D
	r.explain = func() Working {
		d, tv, fu, lc, cbv, ctv, bolts := *pD, *pT, *pFu, *pLc, *pCb, *pCt, *pBolts
		why := "deformation at the bolt hole at service load is a design consideration"
		if !deformation {
			why = "deformation at the bolt hole at service load is not a design consideration"
		}
		bearing, tearout := BearingRn(cb, ct, D, lcMin, t, Fu)
		lcUsed := working.Of(lc)
		if lcMin < 0 { // holes that overlap: no tearout strength
			lcUsed = working.Max(lcUsed, working.K(0, "0"))
		}
		terms := make([]Expr, len(shares))
		table := &Table{Title: "Bolt by bolt, lc measured " + bp.toward, Cols: []Column{
			{Label: "hole", Text: true}, {Label: "lc", Dim: units.DimLength},
			{Label: "bearing", Dim: units.DimForce, UnitInHead: true}, {Label: "tearout", Dim: units.DimForce, UnitInHead: true},
			{Label: "rn", Dim: units.DimForce, UnitInHead: true}, {Label: "governs", Text: true},
		}, Cells: make([]Cell, 0, 6*len(shares))}
		for i, s := range shares {
			terms[i] = working.Of(Value{Sym: "rn", V: float64(s.Rn), Dim: units.DimForce})
			table.Cells = append(table.Cells, Cell{Text: s.Hole}, Cell{V: float64(s.Lc)}, Cell{V: float64(s.Bearing)},
				Cell{V: float64(s.Tearout)}, Cell{V: float64(s.Rn)}, Cell{Text: s.Governed})
		}
		rn := Step{Value: nominal(Rn), Expr: working.Sum("rn", terms),
			Say: working.Phrase(working.Words("Σ rn over "), working.Of(bolts), working.Words(" bolts (table)"))}
		each := func(v Value) Expr { return working.Of(Value{Sym: v.Symbol()}) }
		return Working{
			Title: bp.title,
			Formula: []Step{
				{Value: Value{Sym: "rn"}, Expr: working.Min(working.Mul(each(cbv), each(d), each(tv), each(fu)),
					working.Mul(each(ctv), working.Of(Value{Sym: "lc"}), each(tv), each(fu))), Then: working.Words(", for each bolt")},
				rn,
			},
			Where: "lc is the clear distance, in the direction of the force, from the edge of the hole to the edge of the next hole or of the part",
			Steps: []Step{
				{Value: cbv, Places: 1},
				{Value: ctv, Places: 1, Join: ", ", Then: working.Words(": " + why)},
				{Value: Value{Sym: "bearing, each bolt", V: float64(bearing), Dim: units.DimForce},
					Expr: working.Mul(working.Coef(cbv, 1), working.Of(d), working.Of(tv), working.Of(fu))},
				{Value: Value{Sym: "tearout, bolt with the least lc", V: float64(tearout), Dim: units.DimForce},
					Expr: working.Mul(working.Coef(ctv, 1), lcUsed, working.Of(tv), working.Of(fu))},
				rn,
			},
			Table: table,
		}
	}
	return r
}

// MemberBearing is bearing and tearout at the member's holes, lc measured
// toward the member end; both angles of a pair bear.
//
// Clause: J3.10 [J3.11]
func MemberBearing(c *Connection) Result {
	t := units.Length(c.Member.Pieces) * c.Member.T
	shares := bearingShares(c, memberPly, t, c.Member.Fu, -1, func(*Hole) units.Length { return 0 })
	return bearingResult(c, bearingPart{id: "member.bearing", note: "member, toward the member end",
		title: "Bearing and tearout at the member's bolt holes", toward: "toward the member end", member: true},
		memberPly, t, c.Member.Fu, shares)
}

// PlateBearing is bearing and tearout at the plate's holes, lc measured
// toward the plate's free edge; coefficients and clear distances are the
// plate ply's holes' (Hole.InPlate).
//
// Clause: J3.10 [J3.11]
func PlateBearing(c *Connection) Result {
	p := c.Plate
	// the edge ahead of each hole: the free edge, or where the outline is
	// crossed along the hole's line toward +x (a corner clip comes nearer)
	shares := bearingShares(c, platePly, p.TotalT(), p.Fu, 1, func(h *Hole) units.Length { return p.EdgeAlong(h.X, h.Y, false, 1) })
	return bearingResult(c, bearingPart{id: "plate.bearing", note: "plate, toward its free edge",
		title: "Bearing and tearout at the plate's bolt holes", toward: "toward the plate's free edge"},
		platePly, p.TotalT(), p.Fu, shares)
}
