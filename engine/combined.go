package engine

import (
	"fmt"
	"math"
	"strconv"

	"gaugeline/rules"

	"gaugeline/engine/working"
	"gaugeline/rules/units"
)

// Combined axial force and in-plane bending of a flat bar whose bolt group
// lies off the bar's centre line (J1.7: "unless provision is made for the
// eccentricity").
//
// The model, for a reviewer:
//
//   - The axial force enters through the bolt group's centre of gravity,
//     e = |ȳ − w/2| off the bar's gravity axis (ȳ the mean y of the holes:
//     every bolt of a job is the same bolt, so each carries an equal share
//     whatever its hole), so the bar carries Pr with Mr = Pr·e, bending
//     about its strong axis, in the plane of the plate.
//   - The bar is a doubly symmetric member bent about a geometric axis, so
//     H1.2 governs (Eqs. H1-1a and H1-1b with Pr in tension). Pc is the
//     available tensile strength of Chapter D, the lesser of yielding on
//     the gross section and rupture on the net section (D2), so the holes
//     enter through the axial term. Mc is the available flexural strength
//     of F11 for a rectangular bar: Mn = Mp = Fy·Z on the gross bar (as H4
//     takes Mp without the holes where flexural rupture does not apply).
//     H2 (elastic stresses at a point) is permitted instead but drops the
//     plastic reserve F11 grants the bar; it is not used.
//   - Lateral-torsional buckling (F11.2): within the connection the bar is
//     bolted to the plate row after row and bears on it over the whole lap,
//     so its compression edge is braced against lateral displacement and
//     twist throughout: Lb = 0, F11.2(a), LTB does not apply. The bending
//     of the free length beyond the connection is the member's design.

// EndEccentricity says whether the design provides for the eccentricity
// of the bolt group at a flat bar's end (J1.7).
type EndEccentricity int

const (
	EccentricityNotProvided EndEccentricity = iota // the group must be centred
	EccentricityProvided                           // the member is checked for Pr with Mr = Pr·e
)

// String returns the job-file spelling.
func (e EndEccentricity) String() string {
	if e == EccentricityProvided {
		return "provided"
	}
	return "not-provided"
}

// GroupEccentricity is the distance e between the bolt group's centre of
// gravity and the member's centre line y = Width/2, with the group's
// centroid ȳ (the mean y of the holes). Zero without holes.
func GroupEccentricity(c *Connection) (e, ybar units.Length) {
	if len(c.Holes) == 0 {
		return 0, c.Member.Width / 2
	}
	var sum float64
	for _, h := range c.Holes {
		sum += float64(h.Y)
	}
	ybar = units.Length(sum / float64(len(c.Holes)))
	return units.Length(math.Abs(float64(ybar - c.Member.Width/2))), ybar
}

// BarPlasticModulus is Z of a solid rectangle d deep (in the plane of
// bending) and t thick: Z = t·d²/4.
//
// Clause: F11.1
func BarPlasticModulus(d, t units.Length) units.Modulus {
	return units.Modulus(float64(t) * float64(d) * float64(d) / 4)
}

// BarElasticModulus is Sx of a solid rectangle d deep and t thick:
// Sx = t·d²/6.
//
// Clause: F11.1
func BarElasticModulus(d, t units.Length) units.Modulus {
	return units.Modulus(float64(t) * float64(d) * float64(d) / 6)
}

// BarPlasticMoment is the yielding limit of a rectangular bar:
// Mn = Mp = Fy·Z ≤ k·Fy·Sx, k = 1.5 in 360-22, 1.6 in 360-16
// (rules.Edition.BarPlasticCap).
//
// Clause: F11.1
func BarPlasticMoment(Fy units.Stress, Z, Sx units.Modulus, k float64) units.Moment {
	return min(Fy.Over(Z), units.Moment(k)*Fy.Over(Sx))
}

// BarLTB is the lateral-torsional buckling limit of a rectangular bar bent
// about its major axis, with λ = Lb·d/t²:
// (a) λ ≤ 0.08E/Fy: does not apply, Mn = Mp;
// (b) λ ≤ 1.9E/Fy: Mn = Cb·[1.52 − 0.274·λ·Fy/E]·My ≤ Mp, My = Fy·Sx;
// (c) otherwise: Mn = Fcr·Sx ≤ Mp, Fcr = 1.9E·Cb/λ.
// It returns Mn, λ and the case, "a", "b" or "c".
//
// Clause: F11.2
func BarLTB(Lb, d, t units.Length, Fy, E units.Stress, Cb float64, Mp units.Moment, Sx units.Modulus) (Mn units.Moment, lambda float64, kase string) {
	lambda = float64(Lb) * float64(d) / (float64(t) * float64(t))
	ey := float64(E / Fy)
	switch {
	case lambda <= 0.08*ey:
		return Mp, lambda, "a"
	case lambda <= 1.9*ey:
		My := Fy.Over(Sx)
		return min(units.Moment(Cb*(1.52-0.274*lambda/ey))*My, Mp), lambda, "b"
	}
	Fcr := units.Stress(1.9 * float64(E) * Cb / lambda)
	return min(Fcr.Over(Sx), Mp), lambda, "c"
}

// InteractionH1 is the interaction of axial force and flexure about one
// axis: with p = Pr/Pc and m = Mr/Mc, p + (8/9)·m when p ≥ 0.2 (Eq.
// H1-1a), p/2 + m otherwise (Eq. H1-1b). It returns the value, which must
// not exceed 1.0, and the equation used.
//
// Clause: H1.1
func InteractionH1(p, m float64) (value float64, eq string) {
	if p >= 0.2 {
		return H1a(p, m), "H1-1a"
	}
	return H1b(p, m), "H1-1b"
}

// H1a is Eq. H1-1a, p + (8/9)·m, whatever p is.
//
// Clause: H1.1
func H1a(p, m float64) float64 { return p + 8.0/9.0*m }

// H1b is Eq. H1-1b, p/2 + m, whatever p is.
//
// Clause: H1.1
func H1b(p, m float64) float64 { return p/2 + m }

// RadialH1 is the larger of Eqs. H1-1a and H1-1b for p = Pr/Pc and
// m = Mr/Mc. The two lines meet at (0.2, 0.9) and bound one convex region,
// so the equation H1 selects passes exactly when both do: RadialH1 ≤ 1.0
// is the H1 check. Both are proportional to the force when Mr = Pr·e, so
// Pr / RadialH1 is the largest axial force the interaction allows at that
// eccentricity, and RadialH1 is Pr over it: a ratio in the sense of every
// other limit state. It is never less than the selected equation's value
// and equals it whenever the check passes with Pr/Pc ≥ 0.2; below 0.2 with
// little moment H1-1b halves the axial term, which is no ratio of forces.
//
// Clause: H1.1
func RadialH1(p, m float64) float64 { return max(H1a(p, m), H1b(p, m)) }

// MemberCombined is the flat bar under its tension with the moment of an
// eccentric bolt group, Mr = Pr·e, by H1.2 (see the model above). Its
// Ratio is RadialH1 of Pr/Pc and Mr/Mc, Available the axial force the
// interaction allows at this eccentricity (Pr over the ratio) and Nominal
// the same with the nominal strengths, Pn = min(Fy·Ag, Fu·Ae) and Mn. The
// value of the equation H1.2 selects is among the values.
//
// Clause: H1.2
func MemberCombined(c *Connection) Result {
	m := c.Member
	ed := c.Edition
	y, r := MemberYield(c), MemberRupture(c)
	Pc, axial := y.Available, "yielding"
	if r.Available < Pc {
		Pc, axial = r.Available, "rupture"
	}
	Pn := min(y.Nominal, r.Nominal)
	e, ybar := GroupEccentricity(c)
	d, t := m.Width, m.T
	Z, Sx := BarPlasticModulus(d, t), BarElasticModulus(d, t)
	k := ed.BarPlasticCap()
	Mp := BarPlasticMoment(m.Fy, Z, Sx, k)
	const Lb, Cb = units.Length(0), 1.0 // braced by the plate: see the model
	Mn, lambda, ltb := BarLTB(Lb, d, t, m.Fy, ed.SteelModulus(), Cb, Mp, Sx)
	Mc := ed.FlexureFactor().AvailableMoment(c.Method, Mn)

	Pr := c.Demand
	Mr := Pr.At(e)
	pRatio, mRatio := float64(Pr/Pc), float64(Mr/Mc)
	selected, eq := InteractionH1(pRatio, mRatio)
	ratio := RadialH1(pRatio, mRatio)
	ratioN := RadialH1(float64(Pr/Pn), float64(Mr/Mn))
	eqNum := 1 + b2f(eq == "H1-1b")

	vs := newValues(26)
	val := vs.named
	// the values in the order of Result.Values
	v := combinedParts{
		Pr:     val("Pr", float64(Pr), units.DimForce, "", "required axial strength (the demand)"),
		Pc:     val("Pc", float64(Pc), units.DimForce, "", "available tensile strength, the lesser of yielding and rupture (D2)"),
		PcY:    val("Pc_yield", float64(y.Available), units.DimForce, "Pc,yield", "available strength in tensile yielding, D2(a)"),
		PcR:    val("Pc_rupture", float64(r.Available), units.DimForce, "Pc,rupture", "available strength in tensile rupture, D2(b)"),
		Pn:     val("Pn", float64(Pn), units.DimForce, "", "nominal tensile strength, min(Fy·Ag, Fu·Ae)"),
		e:      val("e", float64(e), units.DimLength, "", "offset of the bolt group's centre of gravity from the bar's centre line"),
		ybar:   val("ybar", float64(ybar), units.DimLength, "ȳ", "the bolt group's centre of gravity, from the edge y = 0"),
		d:      val("d", float64(d), units.DimLength, "", "depth of the bar in the plane of bending (its width)"),
		t:      val("t", float64(t), units.DimLength, "", "thickness of the bar"),
		Fy:     vs.add(valFy(m.Fy)),
		Z:      val("Z", float64(Z), units.DimModulus, "", "plastic section modulus of the bar, t·d²/4"),
		S:      val("S", float64(Sx), units.DimModulus, "", "elastic section modulus of the bar, t·d²/6"),
		k:      val("Mp_cap", k, units.Dimensionless, "k", "k of F11.1: Mp ≤ k·Fy·Sx"),
		Mp:     val("Mp", float64(Mp), units.DimMoment, "", "plastic moment, F11.1"),
		Lb:     val("Lb", float64(Lb), units.DimLength, "", "unbraced length within the connection"),
		lambda: val("LTB_lambda", lambda, units.Dimensionless, "Lb·d/t²", "Lb·d/t² of F11.2"),
		limit: val("LTB_limit", 0.08*float64(ed.SteelModulus()/m.Fy), units.Dimensionless, "0.08E/Fy",
			"0.08E/Fy: below it F11.2(a), no lateral-torsional buckling"),
		Mn:  val("Mn", float64(Mn), units.DimMoment, "", "nominal flexural strength, F11"),
		Mc:  val("Mc", float64(Mc), units.DimMoment, "", "available flexural strength"),
		Mr:  val("Mr", float64(Mr), units.DimMoment, "", "required flexural strength, Pr·e"),
		p:   val("Pr_Pc", pRatio, units.Dimensionless, "Pr/Pc", "axial term"),
		m:   val("Mr_Mc", mRatio, units.Dimensionless, "Mr/Mc", "flexural term"),
		a:   val("H1_1a", H1a(pRatio, mRatio), units.Dimensionless, "H1-1a", "Eq. H1-1a, Pr/Pc + (8/9)·Mr/Mc"),
		b:   val("H1_1b", H1b(pRatio, mRatio), units.Dimensionless, "H1-1b", "Eq. H1-1b, Pr/(2Pc) + Mr/Mc"),
		eq:  val("H1_eq", eqNum, units.Dimensionless, "equation", "equation H1.2 selects: 1 for H1-1a (Pr/Pc ≥ 0.2), 2 for H1-1b"),
		sel: val("H1_value", selected, units.Dimensionless, "H1 value", "value of the selected equation"),
	}

	res := Result{
		ID:        "member.combined",
		Clause:    ed.Clause("H1.2"),
		Nominal:   Pn,
		Available: Pc,
		Demand:    Pr,
		Ratio:     ratio,
		Values:    vs.list,
		Note:      combinedNote(eq, selected, axial, ltb),
	}
	if ratio > 0 {
		res.Available = Pr / units.Force(ratio)
		res.Nominal = Pr / units.Force(ratioN)
	}
	res.Pass = ratio <= 1+1e-9
	method := c.Method
	res.explain = func() Working { return combinedWorking(ed, method, ratio, &v, eq) }
	return res
}

// combinedNote says what member.combined checked: the equation H1.2
// selects and its value, the axial limit state that gives Pc (axial) and
// the case of F11.2 (ltb).
func combinedNote(eq string, selected float64, axial, ltb string) string {
	return fmt.Sprintf("H1.2 selects Eq. %s (%.3f); Pr with Mr = Pr·e, e the bolt group's offset from the bar's centre line; "+
		"Pc = D2 %s, the lesser of yielding and rupture; Mc from F11 on the gross bar bent in its plane, "+
		"Lb = 0 (the bar is bolted to and bears on the plate over the connection), F11.2(%s); "+
		"ratio = Pr over the largest force the interaction allows at this e", eq, selected, axial, ltb)
}

// combinedParts are the values of member.combined, in its values list.
type combinedParts struct {
	Pr, Pc, PcY, PcR, Pn, e, ybar, d, t, Fy, Z, S, k, Mp, Lb, lambda, limit, Mn, Mc, Mr, p, m, a, b, eq, sel *Value
}

// combinedWorking is the working of member.combined: H1.2 with F11 and
// D2; its result is an interaction, not a strength with one φ.
func combinedWorking(ed Code, method rules.Method, ratioV float64, v *combinedParts, eq string) Working {
	lrfd := method == rules.LRFD
	fb := ed.FlexureFactor()
	sym := func(s string) Expr { return working.Of(Value{Sym: s}) }
	two := working.K(2, "2")

	eStep := Step{Value: *v.e, Expr: working.Abs(working.Sub(working.Of(*v.ybar), working.Div(working.Of(*v.d), two)))}
	mr := Step{Value: *v.Mr, Expr: working.Mul(working.Of(*v.Pr), working.Of(*v.e))}
	pc := Step{Value: *v.Pc, Expr: working.Min(working.Of(*v.PcY), working.Of(*v.PcR))}
	sx := *v.S
	sx.Sym = "Sx"
	z := Step{Value: *v.Z, Expr: working.Div(working.Mul(working.Of(*v.t), working.Sq(working.Of(*v.d))), working.K(4, "4"))}
	s := Step{Value: sx, Expr: working.Div(working.Mul(working.Of(*v.t), working.Sq(working.Of(*v.d))), working.K(6, "6")), Join: "; "}
	mp := Step{Value: *v.Mp, Expr: working.Min(working.Mul(working.Of(*v.Fy), working.Of(*v.Z)), working.Mul(working.K(v.k.V, strconv.FormatFloat(v.k.V, 'f', 1, 64)), working.Of(*v.Fy), working.Of(sx)))}
	E := Value{Sym: "E", V: float64(ed.SteelModulus()), Dim: units.DimStress}
	lb := []Step{
		{Value: *v.Lb},
		{Value: *v.lambda, Places: 1, Expr: working.Div(working.Mul(working.Of(*v.Lb), working.Of(*v.d)), working.Sq(working.Of(*v.t))), Show: working.ShowValue, Join: ": "},
	}
	if v.lambda.V <= v.limit.V {
		lb = append(lb,
			Step{Value: *v.limit, Places: 1, Expr: working.Div(working.Mul(working.K(0.08, "0.08"), working.Of(E)), working.Of(*v.Fy)), Show: working.ShowValue, Join: " ≤ "},
			Step{Value: *v.Mn, Expr: working.Of(*v.Mp), Say: working.Words("Mp"), Join: ", F11.2(a): "})
	} else {
		lb = append(lb,
			Step{Value: *v.limit, Places: 1, Expr: working.Div(working.Mul(working.K(0.08, "0.08"), working.Of(E)), working.Of(*v.Fy)), Show: working.ShowValue, Join: " > "},
			Step{Value: *v.Mn, Join: ", F11.2: "})
	}
	phi, omega := Value{Sym: "φb", V: fb.Phi}, Value{Sym: "Ωb", V: fb.Omega}
	mc := Step{Value: *v.Mc, Expr: working.Mul(working.Coef(phi, 2), working.Of(*v.Mn))}
	mcText := ", φb = " + strconv.FormatFloat(fb.Phi, 'f', 2, 64)
	pcForm := Step{Value: Value{Sym: "Pc"}, Expr: working.Min(working.Mul(sym("φt"), sym("Fy"), sym("Ag")), working.Mul(sym("φt"), sym("Fu"), sym("Ae")))}
	if !lrfd {
		mc.Expr = working.Div(working.Of(*v.Mn), working.Coef(omega, 2))
		mcText = ", Ωb = " + strconv.FormatFloat(fb.Omega, 'f', 2, 64)
		pcForm.Expr = working.Min(working.Div(working.Mul(sym("Fy"), sym("Ag")), sym("Ωt")), working.Div(working.Mul(sym("Fu"), sym("Ae")), sym("Ωt")))
	}
	p, m := Step{Value: *v.p, Places: 3, Expr: working.Div(working.Of(*v.Pr), working.Of(*v.Pc))}, Step{Value: *v.m, Places: 3, Expr: working.Div(working.Of(*v.Mr), working.Of(*v.Mc)), Join: "; "}
	h1a := Step{Value: *v.a, Places: 3, Expr: working.Add(working.Coef(*v.p, 3), working.Mul(working.K(8.0/9.0, "(8/9)"), working.Coef(*v.m, 3)))}
	h1b := Step{Value: *v.b, Places: 3, Expr: working.Add(working.Div(working.Coef(*v.p, 3), two), working.Coef(*v.m, 3))}
	ratio := Step{Value: Value{Sym: "ratio", V: ratioV}, Places: 3, Expr: working.Max(working.Coef(*v.a, 3), working.Coef(*v.b, 3))}
	eqText := "H1-1a (Pr/Pc ≥ 0.2)"
	if eq == "H1-1b" {
		eqText = "H1-1b (Pr/Pc < 0.2)"
	}
	steps := []Step{eStep, mr, pc, z, s, mp}
	steps = append(steps, lb...)
	steps = append(steps, mc, p, m, h1a, h1b,
		Step{Then: working.Phrase(working.Words("H1.2 selects Eq. "+eqText+": "), working.Coef(*v.sel, 3))},
		ratio)

	mrForm, eForm := mr, eStep
	eForm.Join = ", "
	mcForm := mc
	mcForm.Then = working.Words(mcText)
	ratioForm := ratio
	ratioForm.Then = working.Words(" = Pr / (largest force allowed at e)")
	return Working{
		Title: "Tension with the moment of the eccentric bolt group (flat bar)",
		Formula: []Step{
			mrForm, eForm,
			pcForm,
			{Value: Value{Sym: "Mn"}, Expr: working.Words("Mp"), Then: working.Phrase(working.Words(" = "), working.Mul(working.Of(*v.Fy), working.Of(*v.Z)), working.Words(" ≤ "), working.Mul(sym("k"), working.Of(*v.Fy), working.Of(sx)))},
			{Value: z.Value, Expr: z.Expr, Join: ", "}, {Value: sx, Expr: s.Expr, Join: ", "},
			mcForm,
			{Then: working.Phrase(working.Words("Eq. H1-1a, Pr/Pc ≥ 0.2: "), h1a.Expr, working.Words(" ≤ 1.0"))},
			{Then: working.Words("Eq. H1-1b, Pr/Pc < 0.2: Pr/(2Pc) + Mr/Mc ≤ 1.0")},
			ratioForm,
		},
		Where: "ȳ is the mean y of the holes (every bolt the same, each an equal share); d the bar's width, the depth in the plane of bending; " +
			"the two equations bound one region, so the larger passes exactly when the one H1.2 selects does, and Pr over it is the force the interaction allows; " +
			"within the connection the bolts and the plate brace the bar, Lb = 0, F11.2(a): no lateral-torsional buckling",
		Steps: steps,
		Interaction: &Interaction{Eq: eqText, Value: v.sel.V, Allowed: "Force allowed at this e", Nominal: "The same with Pn and Mn",
			With: "D2 and F11"},
	}
}

func b2f(b bool) float64 {
	if b {
		return 1
	}
	return 0
}

// needsCombined reports whether Check adds member.combined: a flat bar
// whose job provides for the eccentricity of its bolt group.
func needsCombined(c *Connection) bool {
	return c.Member.Shape.CentredGroup() && c.Member.Eccentricity == EccentricityProvided
}
