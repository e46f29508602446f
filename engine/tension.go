package engine

import (
	"fmt"
	"math"
	"sort"

	"gaugeline/engine/netsection"
	"gaugeline/engine/working"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// eps is the geometric tolerance in mm (netsection.Tolerance): holes
// closer than this in y are on one gage line, in x in one row.
const eps = netsection.Tolerance

// pathHoles returns one part's holes for the net-section search, each of
// the shape ply gives it in that part (memberPly or platePly).
func pathHoles(c *Connection, ply func(*Hole) HoleShape) []netsection.PathHole {
	allow := c.Edition.HoleAllowance()
	ph := make([]netsection.PathHole, len(c.Holes))
	for i := range c.Holes {
		h := &c.Holes[i]
		ph[i] = netsection.PathHole{X: h.X, U: h.Y, Dh: ply(h).Dy + allow}
	}
	return ph
}

// NetArea is An of the member over its worst path (B4.3b): Ag less the
// worst path's deduction times the thickness of every piece.
func NetArea(c *Connection) (An units.Area, deduction units.Length) {
	m := c.Member
	deduction, _ = netsection.NetWidthDeduction(pathHoles(c, memberPly))
	return m.Ag - units.Area(float64(m.Pieces)*float64(deduction)*float64(m.T)), deduction
}

// GageLines groups hole indexes into gage lines: lines sorted by y, the
// holes of a line by x. A hole within LineSlack in y of the previous one is
// on the same line: a designed layout's lines are at least 2-2/3·d apart,
// so the slack only matters for measured as-built holes, which never lie
// exactly on their line.
func GageLines(c *Connection) [][]int {
	slack := float64(LineSlack(c.Bolt.D))
	holes := c.Holes
	idx := make([]int, len(holes))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return holes[idx[a]].Y < holes[idx[b]].Y })
	var lines [][]int
	for k, i := range idx {
		if k == 0 || float64(holes[i].Y-holes[idx[k-1]].Y) > slack {
			lines = append(lines, nil)
		}
		lines[len(lines)-1] = append(lines[len(lines)-1], i)
	}
	for _, ln := range lines {
		sort.SliceStable(ln, func(a, b int) bool { return holes[ln[a]].X < holes[ln[b]].X })
	}
	return lines
}

// LineSlack is how far apart in y two holes of one gage line may be: a
// half the bolt diameter (never less than the geometric tolerance): a
// measured hole further off its line than that is a line of its own.
func LineSlack(d units.Length) units.Length { return max(d/2, eps) }

// ShearLag is the shear lag factor U of D3 with the cases that gave it.
type ShearLag struct {
	U     float64
	Case  string       // which case governs, e.g. "case 2", "case 8", "connected-element bound", "case 1"
	L     units.Length // length of connection l
	U2    float64      // case 2: 1 − x̄/l (0 when l = 0)
	U8    float64      // case 8 for angles (0 when it does not apply)
	U7    float64      // case 7 for W shapes and tees cut from them (0 when it does not apply)
	Ucon  float64      // lower bound for open sections: connected elements' area / Ag
	PerLn int          // bolts in the line with the most bolts
}

// ShearLagFactor is U of Table D3.1 for the member, over the cases its
// shape names (Shape.ShearLagCases): 1.0 for case 1 (a flat, every element
// connected); otherwise the largest of case 2
// (U = 1 − x̄/l, l out to out of the fasteners along the load), case 8
// (0.80 with four or more bolts per line, 0.60 with three) and the D3 bound
// for open sections (the connected elements' gross area over Ag).
func ShearLagFactor(c *Connection) ShearLag {
	m := c.Member
	cases := m.Shape.ShearLagCases()
	if cases.Has(D31Case1) {
		return ShearLag{U: 1, Case: "case 1"}
	}
	sl := ShearLag{L: patternLength(c.Holes)}
	for _, line := range GageLines(c) {
		sl.PerLn = max(sl.PerLn, len(line))
	}
	if sl.L > eps && cases.Has(D31Case2) {
		sl.U2 = 1 - float64(m.Xbar/sl.L)
	}
	switch {
	case !cases.Has(D31Case8):
	case sl.PerLn >= 4:
		sl.U8 = 0.80
	case sl.PerLn == 3:
		sl.U8 = 0.60
	}
	if cases.Has(D31Case7) {
		sl.U7 = ShearLagCase7(m.Width, m.Depth, sl.PerLn)
	}
	if cases.Has(D31Bound) {
		sl.Ucon = float64(m.Shape.ConnectedArea(&m)) / float64(m.Ag)
	}
	sl.U, sl.Case = sl.U2, "case 2"
	if sl.U8 > sl.U {
		sl.U, sl.Case = sl.U8, "case 8"
	}
	if sl.U7 > sl.U {
		sl.U, sl.Case = sl.U7, "case 7"
	}
	if sl.Ucon > sl.U {
		sl.U, sl.Case = sl.Ucon, "connected-element bound"
	}
	sl.U = math.Min(sl.U, 1)
	return sl
}

// ShearLagCase7 is U of Table D3.1 case 7 for a W shape (or a tee cut
// from one) connected by its flanges with perLine bolts in each line:
// 0.90 when bf ≥ 2/3·d, else 0.85, with 3 or more bolts per line; 0 (does
// not apply) with fewer. d is the W's depth (for a tee, the W it is cut
// from: the case compares the parent shape's proportions; from memory).
//
// Clause: D3
func ShearLagCase7(bf, d units.Length, perLine int) float64 {
	switch {
	case perLine < 3 || d <= 0:
		return 0
	case float64(bf) >= 2.0/3.0*float64(d)-1e-9:
		return 0.90
	}
	return 0.85
}

// MemberYield is tensile yielding in the gross section: Pn = Fy·Ag.
//
// Clause: D2(a)
func MemberYield(c *Connection) Result {
	m := c.Member
	Rn := m.Fy.Times(m.Ag)
	vs := newValues(2)
	pFy, pAg := vs.add(valFy(m.Fy)), vs.add(valAg(m.Ag))
	r := finish(c, "member.yield", "D2(a)", Rn, c.Edition.YieldFactor(), vs.list, "gross section of the member")
	r.explain = func() Working {
		Fy, Ag := *pFy, *pAg
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Of(Fy), working.Of(Ag))}
		return Working{
			Title:   "Tensile yielding in the gross section of the member",
			Formula: []Step{rn},
			Steps:   []Step{rn},
		}
	}
	return r
}

// MemberRupture is tensile rupture in the net section: Pn = Fu·Ae with
// Ae = U·An, An over the worst straight or zig-zag path.
//
// Clause: D2(b)
func MemberRupture(c *Connection) Result {
	m := c.Member
	An, ded := NetArea(c)
	sl := ShearLagFactor(c)
	Ae := units.Area(sl.U) * An
	Rn := m.Fu.Times(Ae)
	vs := newValues(11)
	pFu, pAg := vs.add(valFu(m.Fu)), vs.add(valAg(m.Ag))
	pAn := vs.add(Value{Name: "An", V: float64(An), Dim: units.DimArea, What: "net area"})
	pU := vs.add(Value{Name: "U", V: sl.U, What: "shear lag factor (Table D3.1)"})
	pAe := vs.add(Value{Name: "Ae", V: float64(Ae), Dim: units.DimArea, What: "effective net area, U·An"})
	pDd := vs.add(valDeduction(ded))
	var pXbar, pL, pU2, pU8, pU7, pUcon *Value // Table D3.1 cases 2, 8 (angles) and 7 (W, WT), the D3 bound
	if !m.Shape.ShearLagCases().Has(D31Case1) {
		pXbar = vs.add(Value{Name: "xbar", V: float64(m.Xbar), Dim: units.DimLength, Sym: "x̄", What: "connection eccentricity x̄"})
		pL = vs.add(Value{Name: "l", V: float64(sl.L), Dim: units.DimLength, What: "length of connection, first to last row"})
		pU2 = vs.add(Value{Name: "U_case2", V: sl.U2, Sym: "U (case 2)", What: "Table D3.1 case 2: 1 − x̄/l"})
		if m.Shape.ShearLagCases().Has(D31Case8) {
			pU8 = vs.add(Value{Name: "U_case8", V: sl.U8, Sym: "U (case 8)", What: "Table D3.1 case 8, angles (0 when it does not apply)"})
		}
		if m.Shape.ShearLagCases().Has(D31Case7) {
			pU7 = vs.add(Value{Name: "U_case7", V: sl.U7, Sym: "U (case 7)", What: "Table D3.1 case 7, W and WT by the flanges (0 when it does not apply)"})
		}
		pUcon = vs.add(Value{Name: "U_min", V: sl.Ucon, Sym: "U (bound)", What: "connected elements' gross area over Ag (D3)"})
	}
	r := finish(c, "member.rupture", "D2(b)", Rn, c.Edition.RuptureFactor(), vs.list,
		"net section, worst path; U from Table D3.1 "+sl.Case)

	ed := c.Edition
	r.explain = func() Working {
		Fu, Ag, an, u, ae, dd := *pFu, *pAg, *pAn, *pU, *pAe, *pDd
		// An = Ag − Σt·deduction, Σt the thickness of every piece
		tsum := Value{Sym: "Σt", V: float64(m.Pieces) * float64(m.T), Dim: units.DimLength}
		t := working.Of(tsum)
		if m.Pieces > 1 {
			t = working.Named("Σt", working.Times(working.Of(Value{Sym: "n", V: float64(m.Pieces)}), working.Of(Value{Sym: "t", V: float64(m.T), Dim: units.DimLength})))
		}
		anStep := Step{Value: an, Expr: working.Sub(working.Of(Ag), working.Mul(t, working.Of(dd)))}
		aeStep := Step{Value: ae, Expr: working.Mul(working.Of(u), working.Of(an))}
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Of(Fu), working.Of(ae))}
		where := "the path is the worst straight or zig-zag path across the section (B4.3); s and g are the spacing and gage between consecutive holes of the path; dh = nominal hole + " +
			units.FormatJob(ed.HoleAllowance(), ed.System())
		w := Working{
			Title:   "Tensile rupture in the net section of the member",
			Formula: []Step{rn, aeStep, anStep},
			Steps:   []Step{anStep},
		}
		if m.Shape.ShearLagCases().Has(D31Case1) {
			w.Formula = append(w.Formula, Step{Value: Value{Sym: "U"}, Expr: working.K(1, "1.0")})
			where += "; U = 1.0 by Table D3.1 case 1: every part of the section is connected"
			w.Steps = append(w.Steps, Step{Value: u})
		} else {
			steps, formula, words := shearLagWorking(m, ed.System(), Ag, u, sl, *pXbar, *pL, *pU2, pU8, pU7, *pUcon)
			w.Formula = append(w.Formula, formula)
			where += words
			w.Steps = append(w.Steps, steps...)
		}
		w.Where = where
		w.Steps = append(w.Steps, aeStep, rn)
		return w
	}
	return r
}

// shearLagWorking is the part of the rupture working that gives U: the
// formula line, what its terms are and the steps, case by case over the
// cases the shape names (u8, u7 nil where they do not apply).
func shearLagWorking(m Member, sys units.System, Ag, u Value, sl ShearLag, xbar, l, u2 Value, u8, u7 *Value, ucon Value) (steps []Step, formula Step, where string) {
	terms := []working.Expr{working.Sub(working.K(1, "1"), working.Div(working.Of(xbar), working.Of(l)))}
	values := []working.Expr{working.Of(u2)}
	where = "; 1 − x̄/l is Table D3.1 case 2"
	if sl.L > eps {
		steps = append(steps, Step{Value: u2, Expr: working.Sub(working.K(1, "1"), working.Div(working.Of(xbar), working.Of(l))), Show: working.ShowForm})
	} else {
		steps = append(steps, Step{Then: working.Words("U (case 2): one row of bolts, no length of connection")})
	}
	// the fixed-value cases the shape names: 8 (angles), 7 (W and WT)
	for _, c := range []struct {
		v            *Value
		u            float64
		sym, words   string
		then, notApp string
	}{
		{u8, sl.U8, "U case 8", "; case 8 for angles is 0.80 with 4 or more bolts in a line, 0.60 with 3", "",
			"U (case 8) does not apply: fewer than 3 bolts in a line"},
		{u7, sl.U7, "U case 7", "; case 7 for W shapes and the tees cut from them, by the flanges with 3 or more bolts in a line, is 0.90 with bf ≥ 2/3·d (d of the W), else 0.85",
			case7Words(m, sys), "U (case 7) does not apply: fewer than 3 bolts in a line"},
	} {
		if c.v == nil {
			continue
		}
		terms = append(terms, working.Of(Value{Sym: c.sym, V: c.u}))
		values = append(values, working.Of(*c.v))
		where += c.words
		switch {
		case c.u > 0 && c.then != "":
			steps = append(steps, Step{Value: *c.v, Then: working.Words(c.then)})
		case c.u > 0:
			steps = append(steps, Step{Value: *c.v})
		default:
			steps = append(steps, Step{Then: working.Words(c.notApp)})
		}
	}
	terms = append(terms, working.Of(Value{Sym: "U bound", V: sl.Ucon}))
	values = append(values, working.Of(ucon))
	where += "; the bound is the connected elements' area over Ag (D3)"
	connected := working.Mul(working.Of(Value{Sym: "n", V: float64(m.Pieces)}), working.Of(Value{Sym: "b", V: float64(m.Width), Dim: units.DimLength}),
		working.Of(Value{Sym: "t", V: float64(m.T), Dim: units.DimLength}))
	steps = append(steps,
		Step{Value: ucon, Expr: working.Div(connected, working.Of(Ag)), Say: working.Words("connected elements' area / Ag")},
		Step{Value: u, Expr: working.Max(values...)})
	return steps, Step{Value: Value{Sym: "U"}, Expr: working.Max(terms...)}, where
}

// case7Words says which branch of case 7 applies.
func case7Words(m Member, sys units.System) string {
	cmp := "≥"
	if ShearLagCase7(m.Width, m.Depth, 3) < 0.9 {
		cmp = "<"
	}
	return fmt.Sprintf(": bf = %s %s 2/3·d = %s (d of the W)", units.FormatJob(m.Width, sys), cmp, units.FormatJob(m.Depth*2/3, sys))
}

// nominal is the nominal strength Rn as the value of a step.
func nominal(Rn units.Force) Value { return Value{Sym: "Rn", V: float64(Rn), Dim: units.DimForce} }

// Values that several limit states share, with what a report says of them.
func valFy(Fy units.Stress) Value {
	return Value{Name: "Fy", V: float64(Fy), Dim: units.DimStress, What: "specified minimum yield stress"}
}

func valFu(Fu units.Stress) Value {
	return Value{Name: "Fu", V: float64(Fu), Dim: units.DimStress, What: "specified minimum tensile strength"}
}

func valAg(Ag units.Area) Value {
	return Value{Name: "Ag", V: float64(Ag), Dim: units.DimArea, What: "gross area"}
}

// valDeduction is the width a worst path takes out (B4.3b).
func valDeduction(d units.Length) Value {
	return Value{Name: "deduction", V: float64(d), Dim: units.DimLength, Sym: "Σdh − Σs²/4g",
		What: "width taken out by the worst path, Σdh − Σs²/4g"}
}

// valT is the thickness t of a part: for the member both angles of a pair
// (what says so for one angle); a report says which.
func valT(c *Connection, t units.Length, member bool, what string) Value {
	if member && c.Member.Pieces == 2 {
		what = "thickness of the 2 " + PieceName(c.Member.Shape) + "s together"
	}
	switch {
	case !member && c.Plate != nil && c.Plate.Plates() == 2 && Apart(c.Member.Shape):
		what = "thickness of the 2 plates together, one at each " + PieceName(c.Member.Shape) + " (2 × " + units.FormatJob(c.Plate.T, c.Edition.System()) + ")"
	case !member && c.Plate != nil && c.Plate.Plates() == 2:
		what = "thickness of the 2 splice plates together (2 × " + units.FormatJob(c.Plate.T, c.Edition.System()) + ")"
	}
	return Value{Name: "t", V: float64(t), Dim: units.DimLength, What: what}
}

// finish fills the common fields of a result loaded by the whole demand.
func finish(c *Connection, id, clause16 string, Rn units.Force, f rules.Factor, vals []Value, note string) Result {
	return finishFor(c, c.Demand, id, clause16, Rn, f, vals, note)
}

// finishFor fills the common fields of a result loaded by demand, a part
// of the connection's demand (e.g. the share of one block).
func finishFor(c *Connection, demand units.Force, id, clause16 string, Rn units.Force, f rules.Factor, vals []Value, note string) Result {
	avail := f.Available(c.Method, Rn)
	r := Result{
		ID:        id,
		Clause:    c.Edition.Clause(clause16),
		Nominal:   Rn,
		Available: avail,
		Demand:    demand,
		Factor:    f,
		Values:    vals,
		Note:      note,
	}
	if avail > 0 {
		r.Ratio = float64(demand / avail)
	} else {
		r.Ratio = math.Inf(1)
	}
	r.Pass = r.Ratio <= 1+1e-9
	return r
}
