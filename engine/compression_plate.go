package engine

import (
	"fmt"
	"math"

	"gaugeline/engine/working"
	"gaugeline/rules/units"
)

// PlateBuckling is how the plate's buckling length is taken (J4.4): K the
// effective length factor, Centre whether the length is the centre one of
// the three from the Whitmore section to the plate's support rather than
// their average (Thornton's method).
type PlateBuckling struct {
	K      float64
	Centre bool
}

// DefaultGussetK and DefaultSpliceK are the effective length factors taken
// when the job gives none: 0.50 for a gusset, as AISC Design Guide 29
// (Example 5.1) takes it after Gross's (1990) full-scale tests of bracing
// connections, which asks for the gusset supported on both edges; 0.65
// for a splice plate between two members' bolt groups (a fixed-fixed
// strip; from memory).
const (
	DefaultGussetK = 0.5
	DefaultSpliceK = 0.65
)

// BucklingLengths are the three lengths of Thornton's method: from the
// Whitmore section's two ends and its centre, along the load toward the
// plate's support, to the plate's edge (outline). A splice plate's is the
// clear length between the two members' bolt groups, the same three
// times. ok is false when the plate's back edge is not known (a gusset
// rectangle without plate.length).
func BucklingLengths(c *Connection) (l [3]units.Length, ok bool) {
	p := c.Plate
	w := WhitmoreSection(c)
	if p.Kind == Splice {
		g := 2*w.X + p.Gap // A's first row to B's
		return [3]units.Length{g, g, g}, true
	}
	if p.Outline == nil {
		return l, false
	}
	// the ends taken a hair inside: where the section is clipped its end
	// lies on the outline, and a ray along it would miss the back edge
	in := min(units.Length(0.01), (w.YHi-w.YLo)/4)
	ys := [3]units.Length{w.YLo + in, (w.YLo + w.YHi) / 2, w.YHi - in}
	for i, y := range ys {
		l[i] = w.X - p.EdgeAlong(w.X, y, false, -1)
	}
	for i := range l {
		if math.IsInf(float64(l[i]), 0) || math.IsNaN(float64(l[i])) {
			return l, false
		}
	}
	return l, true
}

// PlateCompression is the plate in compression over the Whitmore section
// (J4.4): with K·L/r ≤ 25, Pn = Fy·Ag; beyond, Pn = Fcr·Ag of Chapter E
// (E3), r = t/√12 and Ag = Lw·t. L is the average of the three lengths of
// BucklingLengths (or the centre one). Loaded by Connection.Compression.
//
// Clause: J4.4
func PlateCompression(c *Connection) Result {
	p := c.Plate
	w := WhitmoreSection(c)
	ls, known := BucklingLengths(c)
	L := (ls[0] + ls[1] + ls[2]) / 3
	if p.Buckling.Centre {
		L = ls[1]
	}
	K := p.Buckling.K
	t := p.TotalT()
	r := p.T / units.Length(math.Sqrt(12)) // each plate buckles on its own
	Ag := w.Lw.Mul(t)
	klr := K * float64(L/r)
	E := c.Edition.SteelModulus()
	Fe := ElasticBucklingStress(E, klr)
	Fcr := p.Fy
	how := "K·L/r ≤ 25: Fy·Ag (J4.4(a))"
	if klr > 25 {
		Fcr = CriticalStress(p.Fy, Fe)
		how = "K·L/r over 25: Fcr·Ag by Chapter E (J4.4(b))"
	}
	Rn := Fcr.Times(Ag)
	if !known { // the plate's back edge is not known (the job file asks for it)
		Rn, how = 0, "not checked: the plate's back edge is not known (plate.length or plate.outline)"
	}
	vs := newValues(12)
	for i, name := range []string{"l1", "l2", "l3"} {
		vs.add(Value{Name: name, V: float64(ls[i]), Dim: units.DimLength, What: []string{"from the Whitmore section's low end", "from its centre", "from its high end"}[i]})
	}
	pL := vs.add(Value{Name: "L", V: float64(L), Dim: units.DimLength, What: "buckling length (the average of l1, l2, l3, or l2)"})
	pK := vs.add(Value{Name: "K", V: K, What: "effective length factor"})
	pR := vs.add(Value{Name: "r", V: float64(r), Dim: units.DimLength, What: "radius of gyration of the plate, t/√12"})
	pKlr := vs.add(Value{Name: "KL_r", Sym: "KL/r", V: klr, What: "slenderness"})
	vs.add(Value{Name: "Lw", V: float64(w.Lw), Dim: units.DimLength, What: "Whitmore width"})
	pAg := vs.add(Value{Name: "Ag", V: float64(Ag), Dim: units.DimArea, What: "gross area of the Whitmore section, Lw·t"})
	pFy := vs.add(valFy(p.Fy))
	vs.add(Value{Name: "Fe", V: float64(Fe), Dim: units.DimStress, What: "elastic buckling stress"})
	pFcr := vs.add(Value{Name: "Fcr", V: float64(Fcr), Dim: units.DimStress, What: "critical stress (Fy when K·L/r ≤ 25)"})
	res := finishFor(c, c.Compression, "plate.compression", "J4.4", Rn, c.Edition.CompressionFactor(), vs.list,
		fmt.Sprintf("compression: Whitmore section of the plate, %s", how))
	res.Case = "compression"
	res.explain = func() Working {
		l, k, rv, klrv, ag, fy, fcr := *pL, *pK, *pR, *pKlr, *pAg, *pFy, *pFcr
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Of(fcr), working.Of(ag))}
		slender := Step{Value: klrv, Expr: working.Div(working.Mul(working.Coef(k, 2), working.Of(l)), working.Of(rv))}
		fcrStep := Step{Value: fcr, Then: working.Words(": " + how)}
		if klr <= 25 {
			fcrStep = Step{Value: fcr, Expr: working.Of(fy), Then: working.Words(": K·L/r ≤ 25 (J4.4(a))")}
		}
		return Working{
			Title:   "Compressive strength of the plate over its Whitmore section",
			Formula: []Step{rn, slender},
			Where:   "L is the buckling length from the Whitmore section toward the plate's support (l1, l2, l3 from its ends and centre; their average, Thornton's method, unless the job asks for the centre one), r = t/√12",
			Steps:   []Step{slender, fcrStep, rn},
		}
	}
	return res
}

// compressionCase is a tension-case result of the bearing kind made the
// compression case's: its id, the compression demand and the ratio at it.
func compressionCase(c *Connection, r Result, id string) Result {
	r.ID, r.Case = id, "compression"
	r.Demand = c.Compression
	if r.Available > 0 {
		r.Ratio = float64(r.Demand / r.Available)
	} else {
		r.Ratio = math.Inf(1)
	}
	r.Pass = r.Ratio <= 1+1e-9
	r.Note = "compression: " + r.Note
	return r
}

// MemberBearingCompression is bearing and tearout at the member's holes
// with the member pushing: each bolt bears toward the member's far end, lc
// to the next hole ahead of it or to the far end.
//
// Clause: J3.10 [J3.11]
func MemberBearingCompression(c *Connection) Result {
	t := units.Length(c.Member.Pieces) * c.Member.T
	far := c.Member.Strut.L
	shares := bearingShares(c, memberPly, t, c.Member.Fu, 1, func(*Hole) units.Length { return far })
	r := bearingResult(c, bearingPart{id: "member.bearing.compression", note: "member, toward the next hole (the member pushes)",
		title: "Bearing and tearout at the member's bolt holes, the member pushing", toward: "toward the next hole, away from the member end", member: true},
		memberPly, t, c.Member.Fu, shares)
	return compressionCase(c, r, "member.bearing.compression")
}

// PlateBearingCompression is bearing and tearout at the plate's holes
// with the member pushing: each bolt bears toward the plate's support, lc
// to the next hole behind it or to the plate's back edge (its outline); in
// a splice plate, to the other member's group.
//
// Clause: J3.10 [J3.11]
func PlateBearingCompression(c *Connection) Result {
	p := c.Plate
	back := func(h *Hole) units.Length { return p.EdgeAlong(h.X, h.Y, false, -1) }
	if p.Kind == Splice {
		w := WhitmoreSection(c)
		back = func(h *Hole) units.Length { return -p.Gap - w.X + h.InPlate().Dx/2 } // the near edge of member B's first hole
	}
	shares := bearingShares(c, platePly, p.TotalT(), p.Fu, -1, back)
	r := bearingResult(c, bearingPart{id: "plate.bearing.compression", note: "plate, toward its support (the member pushes)",
		title: "Bearing and tearout at the plate's bolt holes, the member pushing", toward: "toward the plate's support"},
		platePly, p.TotalT(), p.Fu, shares)
	return compressionCase(c, r, "plate.bearing.compression")
}

// compressionChecks are the limit states of the compression case, in
// report order: the member's buckling and bearing, the plate's buckling
// and bearing, the bolt group bolt by bolt.
func compressionChecks(c *Connection) []Result {
	mb := MemberBearingCompression(c)
	out := []Result{MemberCompression(c), mb}
	var plate []BoltShare
	if c.Plate != nil {
		pb := PlateBearingCompression(c)
		plate = pb.PerBolt
		out = append(out, PlateCompression(c), pb)
	}
	return append(out, compressionCase(c, BoltGroup(c, mb.PerBolt, plate), "bolts.group.compression"))
}
