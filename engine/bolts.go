package engine

import (
	"fmt"
	"math"

	"gaugeline/engine/working"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// BoltArea is the nominal unthreaded body area Ab = π·d²/4.
func BoltArea(d units.Length) units.Area { return units.Area(math.Pi / 4 * float64(d*d)) }

// patternLength is the extent of the bolt group along the load.
func patternLength(holes []Hole) units.Length {
	if len(holes) == 0 {
		return 0
	}
	xmin, xmax := holes[0].X, holes[0].X
	for _, h := range holes {
		xmin, xmax = min(xmin, h.X), max(xmax, h.X)
	}
	return xmax - xmin
}

// boltShearFnv returns Fnv with the long-joint reduction applied and that
// reduction (1 when none).
func boltShearFnv(c *Connection) (units.Stress, float64) {
	Fnv := c.Bolt.Grade.Fnv(c.Bolt.Threads)
	limit, f := c.Edition.LongJoint()
	if patternLength(c.Holes) > limit+eps {
		return Fnv * units.Stress(f), f
	}
	return Fnv, 1
}

// fillerFactor is the J5.2 multiplier of the bolts' shear strength and a
// note saying why: J5.2(a) for fillers over 1/4 in (6 mm) that are not
// developed, 1 for developed fillers (J5.2(b)), thin fillers or none. It
// applies in every joint type: a slip-critical joint is also designed for
// the limit states of bearing-type connections (J3.8 [J3.9]), and its slip
// resistance takes hf instead.
func fillerFactor(c *Connection) (float64, string) {
	b := c.Bolt
	t := units.FormatJob(b.FillerT, c.Edition.System())
	switch {
	case b.FillerT > 0 && b.FillerDeveloped:
		return 1, fmt.Sprintf("fillers %s, developed (J5.2(b)): no reduction", t)
	case b.FillerT > 0:
		k := c.Edition.FillerFactor(b.FillerT)
		if k == 1 {
			return 1, fmt.Sprintf("fillers %s: no reduction (J5.2)", t)
		}
		return k, fmt.Sprintf("fillers %s, not developed: shear × %.4g (J5.2(a))", t, k)
	case b.Fillers > 0:
		return 1, "filler thickness not given: no J5.2 reduction taken"
	}
	return 1, ""
}

// BoltShear is the shear rupture of the bolts: Rn = Fnv·Ab per shear
// plane, summed over the bolts; Fnv is reduced to 83.3 % when an
// end-loaded pattern is longer than 38 in (950 mm), and the strength is
// multiplied by the filler factor of J5.2(a) when the bolts pass through
// undeveloped fillers over 1/4 in (6 mm) thick.
//
// Clause: J3.6 [J3.7], J5.2
func BoltShear(c *Connection) Result {
	Fnv, f := boltShearFnv(c)
	ff, why := fillerFactor(c)
	Ab := BoltArea(c.Bolt.D)
	n, ns := len(c.Holes), c.ShearPlanes()
	Rn := Fnv.Times(Ab) * units.Force(float64(n*ns)*ff)
	note := fmt.Sprintf("%d bolts × %d shear plane(s), threads %s", n, ns, c.Bolt.Threads)
	planes := "shear planes per bolt"
	if Apart(c.Member.Shape) {
		// the holes are one piece's: a bolt in each piece at every hole,
		// each in single shear
		note = fmt.Sprintf("%d bolts in each of the %d %ss, 1 shear plane each, threads %s", n, c.Member.Pieces, PieceName(c.Member.Shape), c.Bolt.Threads)
		planes = "bolts at each hole position, one in each " + PieceName(c.Member.Shape) + ", single shear"
	}
	if why != "" {
		note += "; " + why
	}
	vs := newValues(8)
	pFnv := vs.add(Value{Name: "Fnv", V: float64(Fnv), Dim: units.DimStress, What: "nominal shear stress of the bolt"})
	pAb := vs.add(Value{Name: "Ab", V: float64(Ab), Dim: units.DimArea, What: "nominal unthreaded bolt area, π·d²/4"})
	pN := vs.add(valBolts(n))
	pPlanes := vs.add(Value{Name: "planes", V: float64(ns), What: planes})
	pLj := vs.add(Value{Name: "long_joint_factor", V: f, Sym: "long-joint factor", What: "long-joint reduction of Fnv (1 when none)"})
	pPl := vs.add(Value{Name: "pattern_length", V: float64(patternLength(c.Holes)), Dim: units.DimLength, Sym: "pattern length",
		What: "length of the pattern along the load"})
	none := ff == 1 && c.Bolt.FillerT == 0 // no fillers: nothing to show
	pFf := vs.add(valFillerFactor(ff))
	pFf.Omit = none
	vs.add(valFillerT(c.Bolt.FillerT)).Omit = none
	// the bolts shear alike whether the member pulls or pushes
	r := finishFor(c, max(c.Demand, c.Compression), "bolts.shear", "J3.6", Rn, c.Edition.BoltShearFactor(), vs.list, note)
	if ff < 1 {
		r.Clause += ", " + c.Edition.Clause("J5.2")
	}

	bolt, ed := c.Bolt, c.Edition
	r.explain = func() Working {
		fnv, ab, nv, planes, lj, pl, ffv := *pFnv, *pAb, *pN, *pPlanes, *pLj, *pPl, *pFf
		d := Value{Sym: "d", V: float64(bolt.D), Dim: units.DimLength}
		abStep := Step{Value: ab, Expr: working.Div(working.Mul(working.K(math.Pi, "π"), working.Sq(working.Of(d))), working.K(4, "4"))}
		fnvStep := Step{Value: fnv, Then: working.Phrase(working.Words(" for "), working.Words(bolt.Grade.Name), working.Words(", threads "), working.Words(bolt.Threads.String()))}
		if f != 0 && f < 1 {
			long, _ := ed.LongJoint()
			fnvStep.Expr = working.Mul(working.Of(Value{Sym: "Fnv", V: float64(bolt.Grade.Fnv(bolt.Threads)), Dim: units.DimStress}), working.Coef(lj, 3))
			fnvStep.Show = working.ShowValue
			fnvStep.Then.Args = append(fnvStep.Then.Args, working.Words(", reduced by the factor "), working.Coef(lj, 3), working.Words(": the pattern is "),
				working.Of(pl), working.Words(" long, over "), working.Of(Value{V: float64(long), Dim: units.DimLength}))
		}
		rnExpr := working.Mul(working.Of(fnv), working.Of(ab), working.Of(nv), working.Named("ns", working.Of(planes)))
		where := "n is the number of bolts and ns the shear planes of each"
		w := Working{Title: "Shear rupture of the bolts", Steps: []Step{abStep, fnvStep}}
		if ff < 1 {
			rnExpr.Args = append(rnExpr.Args, working.Coef(ffv, 3))
			formula, steps := fillerWorking(ed.System(), bolt.FillerT, ff)
			w.Formula = append(w.Formula, formula)
			w.Steps = append(w.Steps, steps...)
			limit := "1/4 in"
			if ed.System() == units.SI {
				limit = "6 mm"
			}
			where += "; ff is the filler factor for bolts through fillers over " + limit +
				" thick that are not developed, t the total thickness of the fillers (J5.2(a))"
		}
		rn := Step{Value: nominal(Rn), Expr: rnExpr}
		w.Formula = append([]Step{rn, abStep}, w.Formula...)
		w.Steps = append(w.Steps, rn)
		w.Where = where
		return w
	}
	return r
}

// fillerWorking is the J5.2(a) factor worked from the fillers' thickness,
// in the formula the edition prints for the job's system: its formula line
// and its steps (ff is the factor the bolts' shear strength takes, at
// least 0.85).
func fillerWorking(sys units.System, t units.Length, ff float64) (formula Step, steps []Step) {
	var raw Expr
	unit := "in."
	if sys == units.SI {
		raw = working.Sub(working.K(1, "1"), working.Mul(working.K(0.0154, "0.0154"), working.Sub(working.Coef(Value{Sym: "t", V: t.Mm()}, -4), working.K(6, "6"))))
		unit = "mm"
	} else {
		raw = working.Sub(working.K(1, "1"), working.Mul(working.K(0.4, "0.4"), working.Sub(working.Coef(Value{Sym: "t", V: t.In()}, -4), working.K(0.25, "0.25"))))
	}
	const floor = 0.85
	formula = Step{Value: Value{Sym: "ff"}, Expr: raw, Then: working.Words(" ≥ 0.85, t in " + unit)}
	// The formula's value before the floor: the edition applies the
	// floor inside FillerFactor, so the limit state has no variable of
	// its own for it. Where the floor does not bind, the step's value is
	// the edition's factor and the tests hold the formula to it; where it
	// binds, the second step is held to it.
	v, _ := raw.Eval()
	then := working.Phrase(working.Words(": fillers "), working.Of(valFillerT(t)), working.Words(" thick, not developed"))
	if v >= ff {
		return formula, []Step{{Value: Value{Sym: "ff", V: ff}, Expr: raw, Then: then}}
	}
	return formula, []Step{
		{Value: Value{Sym: "ff", V: v}, Expr: raw},
		{Value: Value{Sym: "ff", V: ff}, Expr: working.Max(working.Of(Value{V: v}), working.K(floor, "0.85")), Show: working.ShowValue,
			Join: ", not less than 0.85: ", Then: then},
	}
}

// valBolts is the number of bolts n.
func valBolts(n int) Value { return Value{Name: "n", V: float64(n), What: "number of bolts"} }

// valFillerFactor is the J5.2(a) factor; a report may leave it out at 1.
func valFillerFactor(ff float64) Value {
	return Value{Name: "filler_factor", V: ff, Sym: "ff", What: "filler factor ff of J5.2(a) on the bolts' shear strength (1 when none)", Omit: ff == 1}
}

// valFillerT is the fillers' thickness; a report may leave it out at 0.
func valFillerT(t units.Length) Value {
	return Value{Name: "filler_t", V: float64(t), Dim: units.DimLength, Sym: "t (fillers)",
		What: "total thickness of the fillers at a shear plane (0 when none given)", Omit: t == 0}
}

// BoltSlip is the slip resistance of a slip-critical joint:
// Rn = μ·Du·hf·Tb·ns per bolt, summed over the bolts; φ and Ω by hole
// type, the most severe hole type present in either ply governing (J3.8
// gives φ and Ω by hole type without naming a ply; a long slot in the
// plate lets the joint slip as one in the member does).
//
// Clause: J3.8 [J3.9]
func BoltSlip(c *Connection) (Result, error) {
	e := c.Edition
	Tb, err := e.Pretension(c.Bolt.Grade, c.Bolt.D)
	if err != nil {
		return Result{}, err
	}
	mu, Du, hf := e.Mu(c.Bolt.Surface), e.Du(), e.Hf(c.Bolt.Fillers)
	ns, n := c.ShearPlanes(), len(c.Holes)
	f := rules.Factor{Phi: math.Inf(1)}
	for i := range c.Holes {
		h := &c.Holes[i]
		for _, hs := range [...]HoleShape{h.HoleShape, h.InPlate()} {
			if hf := e.SlipFactor(hs.Type, hs.Slot); hf.Phi < f.Phi {
				f = hf
			}
		}
	}
	if n == 0 {
		f = e.SlipFactor(rules.Standard, rules.Transverse)
	}
	Rn := units.Force(mu*Du*hf*float64(ns)*float64(n)) * Tb
	vs := newValues(8)
	pMu := vs.add(Value{Name: "mu", V: mu, Sym: "μ", What: "mean slip coefficient μ"})
	pDu := vs.add(Value{Name: "Du", V: Du, What: "mean installed over minimum pretension"})
	pHf := vs.add(Value{Name: "hf", V: hf, What: "filler factor"})
	pTb := vs.add(Value{Name: "Tb", V: float64(Tb), Dim: units.DimForce, What: "minimum bolt pretension"})
	pNs := vs.add(Value{Name: "ns", V: float64(ns), What: "slip planes"})
	pN := vs.add(valBolts(n))
	vs.add(Value{Name: "phi", V: f.Phi, Sym: "φ", What: "resistance factor φ for slip, by hole type"})
	vs.add(Value{Name: "omega", V: f.Omega, Sym: "Ω", What: "safety factor Ω for slip, by hole type"})
	r := finishFor(c, max(c.Demand, c.Compression), "bolts.slip", "J3.8", Rn, f, vs.list, fmt.Sprintf("class %s surface, %d slip plane(s)", c.Bolt.Surface, ns))
	r.explain = func() Working {
		muv, duv, hfv, tb, nsv, nv := *pMu, *pDu, *pHf, *pTb, *pNs, *pN
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Coef(muv, 2), working.Coef(duv, 2), working.Coef(hfv, 2), working.Of(tb), working.Of(nsv), working.Of(nv))}
		return Working{
			Title:   "Slip resistance of the slip-critical joint",
			Formula: []Step{rn},
			Where:   "μ is the mean slip coefficient of the faying surface, Du the ratio of mean installed to minimum pretension, hf the filler factor, Tb the minimum pretension, ns the slip planes and n the bolts; φ and Ω go by hole type, the most severe hole in the joint governing",
			Steps:   []Step{rn},
		}
	}
	return r, nil
}

// BoltGroup is the strength of the bolt group taken bolt by bolt: each
// bolt gives the least of its shear strength and the bearing or tearout
// strength of its hole in the member and in the plate, and the group is
// the sum. It is never weaker than the separate sums and governs only when
// a hole's tearout is below the bolt's shear strength while another's is
// above it.
//
// Clause: J3.6, J3.10 [J3.7, J3.11]
func BoltGroup(c *Connection, member, plate []BoltShare) Result {
	Fnv, _ := boltShearFnv(c)
	ff, _ := fillerFactor(c)
	Ab := BoltArea(c.Bolt.D)
	ns := c.ShearPlanes()
	shear := Fnv.Times(Ab) * units.Force(float64(ns)*ff)
	// least is the strength of bolt i and what governs it.
	least := func(i int) (units.Force, string) {
		rn, by := shear, "bolt shear"
		if member[i].Rn < rn {
			rn, by = member[i].Rn, "member "+member[i].Governed
		}
		if plate != nil && plate[i].Rn < rn {
			rn, by = plate[i].Rn, "plate "+plate[i].Governed
		}
		return rn, by
	}
	var Rn units.Force
	governs := map[string]int{}
	for i := range c.Holes {
		rn, by := least(i)
		governs[by]++
		Rn += rn
	}
	vs := newValues(3)
	pRnShear := vs.add(Value{Name: "rn_shear", V: float64(shear), Dim: units.DimForce, Sym: "rn,shear",
		What: "shear strength of one bolt, Fnv·Ab·ns (× ff with fillers)"})
	pN, pFf := vs.add(valBolts(len(c.Holes))), vs.add(valFillerFactor(ff))
	// bolt shear and bearing share φ = 0.75 and Ω = 2.00 (J3.6, J3.10)
	r := finish(c, "bolts.group", "J3.6", Rn, c.Edition.BoltShearFactor(), vs.list,
		fmt.Sprintf("per bolt the least of shear, member and plate bearing/tearout; %s", describeCounts(governs)))
	r.Clause = c.Edition.Clause("J3.6") + ", " + c.Edition.Clause("J3.10")
	if ff < 1 {
		r.Clause += ", " + c.Edition.Clause("J5.2")
	}

	n := len(c.Holes)
	r.explain = func() Working {
		rnShear, nv, ffv := *pRnShear, *pN, *pFf
		cols := []Column{{Label: "hole", Text: true}, {Label: "shear", Dim: units.DimForce, UnitInHead: true},
			{Label: "member", Dim: units.DimForce, UnitInHead: true}}
		if plate != nil {
			cols = append(cols, Column{Label: "plate", Dim: units.DimForce, UnitInHead: true})
		}
		cols = append(cols, Column{Label: "least", Dim: units.DimForce, UnitInHead: true}, Column{Label: "governed by", Text: true})
		table := &Table{Title: "Bolt by bolt", Cols: cols, Cells: make([]Cell, 0, len(cols)*n)}
		terms := make([]Expr, n)
		for i := range n {
			rn, by := least(i)
			table.Cells = append(table.Cells, Cell{Text: member[i].Hole}, Cell{V: float64(shear)}, Cell{V: float64(member[i].Rn)})
			if plate != nil {
				table.Cells = append(table.Cells, Cell{V: float64(plate[i].Rn)})
			}
			table.Cells = append(table.Cells, Cell{V: float64(rn)}, Cell{Text: by})
			terms[i] = working.Of(Value{Sym: "rn", V: float64(rn), Dim: units.DimForce})
		}
		perBolt := Step{Value: rnShear, Show: working.ShowValue,
			Expr: working.Mul(working.Of(Value{Sym: "Fnv", V: float64(Fnv), Dim: units.DimStress}), working.Of(Value{Sym: "Ab", V: float64(Ab), Dim: units.DimArea}),
				working.Of(Value{Sym: "ns", V: float64(ns)}), working.Of(Value{Sym: "ff", V: ff})),
			Then: working.Words(" per bolt")}
		where := "rn,shear = Fnv·Ab·ns is the shear strength of one bolt"
		if ff < 1 {
			perBolt.Then = working.Phrase(working.Words(" per bolt, with the filler factor ff = "), working.Coef(ffv, 3), working.Words(" (J5.2(a))"))
			where = "rn,shear = Fnv·Ab·ns·ff is the shear strength of one bolt, ff the filler factor of J5.2(a) (see bolts.shear)"
		}
		rn := Step{Value: nominal(Rn), Expr: working.Sum("min(rn,shear; rn,member; rn,plate)", terms),
			Say: working.Phrase(working.Words("Σ over "), working.Of(nv), working.Words(" bolts (table)"))}
		formula := rn
		formula.Then = working.Words(", over the bolts")
		return Working{
			Title:   "Strength of the bolt group, bolt by bolt",
			Formula: []Step{formula},
			Where:   where + "; rn,member and rn,plate are the bearing or tearout strengths of its holes, from the bearing checks",
			Steps:   []Step{perBolt, rn},
			Table:   table,
		}
	}
	return r
}

func describeCounts(m map[string]int) string {
	keys := []string{"bolt shear", "member bearing", "member tearout", "plate bearing", "plate tearout"}
	s := ""
	for _, k := range keys {
		if m[k] > 0 {
			if s != "" {
				s += ", "
			}
			s += fmt.Sprintf("%s governs %d", k, m[k])
		}
	}
	return s
}
