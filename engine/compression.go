package engine

import (
	"fmt"
	"math"
	"strings"

	"gaugeline/engine/working"
	"gaugeline/rules/units"
)

// ElasticBucklingStress is Fe = π²E/(Lc/r)².
//
// Clause: E3
func ElasticBucklingStress(E units.Stress, slenderness float64) units.Stress {
	return units.Stress(math.Pi * math.Pi * float64(E) / (slenderness * slenderness))
}

// CriticalStress is Fcr of flexural buckling for an elastic buckling
// stress Fe: 0.658^(Fy/Fe)·Fy when Fy/Fe ≤ 2.25 (Lc/r ≤ 4.71√(E/Fy)), else
// 0.877·Fe (Eqs. E3-2, E3-3; E4 takes them with its own Fe).
//
// Clause: E3
func CriticalStress(Fy, Fe units.Stress) units.Stress {
	if Fe <= 0 {
		return 0
	}
	if r := float64(Fy / Fe); r <= 2.25 {
		return units.Stress(math.Pow(0.658, r)) * Fy
	}
	return 0.877 * Fe
}

// AngleSlenderness is E5's effective slenderness Lc/r of a single angle
// loaded through one leg, L its length and ra its radius about the
// geometric axis parallel to the connected leg: E5(a), an individual
// member or a web member of a planar truss, 72 + 0.75·L/ra up to L/ra = 80,
// 32 + 1.25·L/ra beyond; E5(b), a web member of a box or space truss,
// 60 + 0.8·L/ra up to 75, 45 + L/ra beyond. An unequal angle connected by
// its shorter leg adds 4[(bl/bs)² − 1] (E5(b): 6[…]) and takes at least
// 0.95·L/rz (0.82·L/rz). The limit of 200 is the caller's.
//
// Clause: E5
func AngleSlenderness(L, ra, rz, connected, outstanding units.Length, space bool) float64 {
	lr := float64(L / ra)
	var lcr float64
	switch {
	case !space && lr <= 80:
		lcr = 72 + 0.75*lr
	case !space:
		lcr = 32 + 1.25*lr
	case lr <= 75:
		lcr = 60 + 0.8*lr
	default:
		lcr = 45 + lr
	}
	if connected < outstanding {
		ratio := float64(outstanding / connected)
		add, least := 4.0, 0.95
		if space {
			add, least = 6, 0.82
		}
		lcr = max(lcr+add*(ratio*ratio-1), least*float64(L/rz))
	}
	return lcr
}

// ModifiedSlenderness is (Lc/r)m of E6.1 for two pieces joined by
// connectors a apart, ri the least radius of one piece: snug-tight
// connectors √((Lc/r)o² + (a/ri)²); welded or pretensioned ones (Lc/r)o up
// to a/ri = 40, √((Lc/r)o² + (Ki·a/ri)²) beyond (from memory).
//
// Clause: E6.1
func ModifiedSlenderness(lcr0 float64, a, ri units.Length, Ki float64, snugTight bool) float64 {
	ar := float64(a / ri)
	switch {
	case snugTight:
		return math.Hypot(lcr0, ar)
	case ar <= 40:
		return lcr0
	}
	return math.Hypot(lcr0, Ki*ar)
}

// FlexuralTorsionalStress is Fe of E4 for a singly symmetric member, y
// its axis of symmetry: (Fey + Fez)/(2H)·[1 − √(1 − 4·Fey·Fez·H/(Fey +
// Fez)²)].
//
// Clause: E4
func FlexuralTorsionalStress(Fey, Fez units.Stress, H float64) units.Stress {
	s := float64(Fey + Fez)
	return units.Stress(s / (2 * H) * (1 - math.Sqrt(1-4*float64(Fey)*float64(Fez)*H/(s*s))))
}

// TorsionalStress is Fez of E4: (π²·E·Cw/Lcz² + G·J)/(Ag·r̄o²).
//
// Clause: E4
func TorsionalStress(E, G units.Stress, Cw, J float64, Lcz units.Length, Ag units.Area, ro2 float64) units.Stress {
	lz := float64(Lcz)
	return units.Stress((math.Pi*math.Pi*float64(E)*Cw/(lz*lz) + float64(G)*J) / (float64(Ag) * ro2))
}

// EffectiveArea is Ae of E7 at the critical stress Fcr: Ag less, for each
// slender element, (b − be)·t, be = b(1 − c1√(Fel/Fcr))√(Fel/Fcr) with Fel
// = (c2·λr/λ)²·Fy where λ > λr·√(Fy/Fcr); c1, c2 of Table E7.1 (0.18, 1.31
// stiffened; 0.22, 1.49 unstiffened). It names the elements it reduces.
//
// Clause: E7
func EffectiveArea(Ag units.Area, els []Element, E, Fy, Fcr units.Stress) (units.Area, []string) {
	Ae := Ag
	var slender []string
	for _, el := range els {
		lambda, lr := float64(el.B/el.T), el.slenderLimit(E, Fy)
		if Fcr <= 0 || lambda <= lr*math.Sqrt(float64(Fy/Fcr)) {
			continue
		}
		c1, c2 := 0.22, 1.49
		if el.Stiffened {
			c1, c2 = 0.18, 1.31
		}
		q := c2 * lr / lambda
		k := math.Sqrt(q * q * float64(Fy/Fcr)) // √(Fel/Fcr)
		be := el.B * units.Length((1-c1*k)*k)
		Ae -= units.Area(float64(el.Count) * float64(el.B-be) * float64(el.T))
		slender = append(slender, el.Name)
	}
	return Ae, slender
}

// buckling is how the member buckles: the governing slenderness, the
// elastic buckling stress and the mode, with the values that gave them.
type buckling struct {
	lcr    float64      // governing (effective, modified) slenderness
	Fe     units.Stress // governing elastic buckling stress
	mode   string
	clause string
	extra  []Value // the mode's own values (L/ra, Fey, Fez, H …)
	fails  string  // a condition of the clause not met: the member is not checked
}

// memberBuckling works out the buckling of the member's Strut.
func memberBuckling(c *Connection) buckling {
	m := &c.Member
	col := m.Strut
	E, G := c.Edition.SteelModulus(), c.Edition.ShearModulus()
	Lc := units.Length(col.K) * col.L
	lenV := func(name, sym, what string, v units.Length) Value {
		return Value{Name: name, Sym: sym, V: float64(v), Dim: units.DimLength, What: what}
	}
	switch col.Kind {
	case StrutAngle:
		b := buckling{mode: "E5 effective slenderness of an angle loaded through one leg", clause: "E5"}
		b.lcr = AngleSlenderness(col.L, col.Ra, col.Rz, col.Connected, col.Outstanding, col.Space)
		b.Fe = ElasticBucklingStress(E, b.lcr)
		b.extra = []Value{lenV("ra", "ra", "radius about the geometric axis parallel to the connected leg", col.Ra),
			{Name: "L_ra", Sym: "L/ra", V: float64(col.L / col.Ra), What: "L/ra"}}
		switch {
		case len(c.Holes) < 2:
			b.fails = "E5 asks for two or more bolts at each end; with one, the angle's eccentricity must be designed for (H2), which this tool does not check"
		case col.Connected < col.Outstanding && float64(col.Outstanding/col.Connected) >= 1.7:
			b.fails = "E5 covers an angle connected by its shorter leg only for bl/bs < 1.7"
		case b.lcr > 200:
			b.fails = fmt.Sprintf("E5's effective slenderness %.0f exceeds 200", b.lcr)
		}
		return b
	case StrutSinglySymmetric:
		return singlySymmetric(c, Lc, E, G)
	}
	lx, ly := float64(Lc/col.Rx), float64(Lc/col.Ry)
	b := buckling{mode: "flexural buckling", clause: "E3"}
	if col.BuiltUp {
		ly = ModifiedSlenderness(ly, col.ConnectorSpacing(), col.Ri, col.Ki, col.SnugTight)
		b.clause = "E3, E6"
		b.extra = append(b.extra, lenV("a", "a", "spacing of the connectors", col.ConnectorSpacing()))
	}
	b.lcr = max(lx, ly)
	b.Fe = ElasticBucklingStress(E, b.lcr)
	b.extra = append(b.extra, Value{Name: "Lc_rx", Sym: "Lc/rx", V: lx, What: "slenderness about x"},
		Value{Name: "Lc_ry", Sym: "Lc/ry", V: ly, What: "slenderness about y (E6-modified for two pieces)"})
	if col.J > 0 {
		// doubly symmetric (a W, or two channels back to back taken as
		// one section): torsional buckling about the shear centre, the
		// centroid (E4-4: r̄o² = rx² + ry², H = 1; ry unmodified by E6)
		ro2 := float64(col.Rx*col.Rx) + float64(col.Ry*col.Ry)
		Fez := TorsionalStress(E, G, col.Cw, col.J, Lc, m.Ag, ro2)
		b.extra = append(b.extra, Value{Name: "Fez", V: float64(Fez), Dim: units.DimStress, What: "torsional buckling stress (E4-4)"})
		if Fez < b.Fe {
			b.Fe, b.mode, b.clause = Fez, "torsional buckling", "E3, E4"
		}
	}
	return b
}

// singlySymmetric is E3 about x and E4 about y, the axis of symmetry
// (with E6's modified slenderness for two pieces back to back).
func singlySymmetric(c *Connection, Lc units.Length, E, G units.Stress) buckling {
	m := &c.Member
	col := m.Strut
	lx, ly := float64(Lc/col.Rx), float64(Lc/col.Ry)
	clause := "E3, E4"
	if col.BuiltUp {
		ly = ModifiedSlenderness(ly, col.ConnectorSpacing(), col.Ri, col.Ki, col.SnugTight)
		clause = "E3, E4, E6"
	}
	Fex, Fey := ElasticBucklingStress(E, lx), ElasticBucklingStress(E, ly)
	yo := float64(col.Yo)
	ro2 := yo*yo + float64(col.Rx*col.Rx) + float64(col.Ry*col.Ry)
	H := 1 - yo*yo/ro2
	Fez := TorsionalStress(E, G, col.Cw, col.J, Lc, m.Ag, ro2)
	Fft := FlexuralTorsionalStress(Fey, Fez, H)
	stress := func(name, sym, what string, v units.Stress) Value {
		return Value{Name: name, Sym: sym, V: float64(v), Dim: units.DimStress, What: what}
	}
	b := buckling{clause: clause, extra: []Value{
		{Name: "Lc_rx", Sym: "Lc/rx", V: lx, What: "slenderness about x"},
		{Name: "Lc_ry", Sym: "Lc/ry", V: ly, What: "slenderness about y, the axis of symmetry (E6-modified for two pieces)"},
		stress("Fex", "Fex", "flexural buckling stress about x", Fex),
		stress("Fey", "Fey", "flexural buckling stress about y", Fey),
		stress("Fez", "Fez", "torsional buckling stress", Fez),
		{Name: "H", V: H, What: "flexural constant H = 1 − yo²/r̄o²"},
	}}
	if Fex <= Fft {
		b.lcr, b.Fe, b.mode = lx, Fex, "flexural buckling about x"
	} else {
		b.lcr, b.Fe, b.mode = ly, Fft, "flexural-torsional buckling about y"
	}
	return b
}

// MemberCompression is the compressive strength of the member: Pn =
// Fcr·Ae, Fcr of flexural (E3), flexural-torsional (E4) or, for a single
// angle loaded through one leg, E5's effective slenderness; two pieces
// back to back with E6's modified slenderness; Ae of E7 where an element
// is slender. Loaded by Connection.Compression.
//
// Clause: E1
func MemberCompression(c *Connection) Result {
	m := &c.Member
	col := m.Strut
	E := c.Edition.SteelModulus()
	b := memberBuckling(c)
	Fcr := CriticalStress(m.Fy, b.Fe)
	Ae, slender := EffectiveArea(m.Ag, col.Elements, E, m.Fy, Fcr)
	Rn := Fcr.Times(Ae)
	if b.fails != "" {
		Rn = 0
	}
	vs := newValues(10 + len(b.extra))
	vs.add(Value{Name: "L", V: float64(col.L), Dim: units.DimLength, What: "length of the member (member.length)"})
	vs.add(Value{Name: "K", V: col.K, What: "effective length factor (member.k)"})
	for _, v := range b.extra {
		vs.add(v)
	}
	pLcr := vs.add(Value{Name: "Lc_r", Sym: "Lc/r", V: b.lcr, What: "governing slenderness"})
	pE := vs.add(Value{Name: "E", V: float64(E), Dim: units.DimStress, What: "modulus of elasticity"})
	pFe := vs.add(Value{Name: "Fe", V: float64(b.Fe), Dim: units.DimStress, What: "elastic buckling stress"})
	pFy := vs.add(valFy(m.Fy))
	pFcr := vs.add(Value{Name: "Fcr", V: float64(Fcr), Dim: units.DimStress, What: "critical stress (E3-2 or E3-3)"})
	vs.add(valAg(m.Ag))
	pAe := vs.add(Value{Name: "Ae", V: float64(Ae), Dim: units.DimArea, What: "effective area (E7; Ag when no element is slender)"})
	note := b.mode
	if len(slender) > 0 {
		note += fmt.Sprintf("; slender %v (E7)", slender)
	}
	if b.fails != "" {
		note = "not checked: " + b.fails
	}
	clause := b.clause
	if len(slender) > 0 {
		clause += ", E7"
	}
	r := finishFor(c, c.Compression, "member.compression", clause, Rn, c.Edition.CompressionFactor(), vs.list, "compression: "+note)
	r.Case = "compression"
	mode, fails := b.mode, b.fails
	torsional := strings.Contains(mode, "torsional")
	r.explain = func() Working {
		lcr, e, fe, fy, fcr, ae := *pLcr, *pE, *pFe, *pFy, *pFcr, *pAe
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Of(fcr), working.Of(ae))}
		paren := Value{Sym: "(" + lcr.Symbol() + ")", V: lcr.V} // π²E/(Lc/r)², not π²E/Lc/r²
		feStep := Step{Value: fe, Expr: working.Div(working.Mul(working.K(math.Pi*math.Pi, "π²"), working.Of(e)), working.Sq(working.Of(paren)))}
		formula := []Step{rn, {Value: Value{Sym: "Fe"}, Expr: feStep.Expr}}
		if torsional {
			feStep = Step{Value: fe, Then: working.Words(": Fe of E4, (Fey + Fez)/(2H)·[1 − √(1 − 4·Fey·Fez·H/(Fey + Fez)²)]")}
			formula = formula[:1]
		}
		fcrWords := fmt.Sprintf(": 0.658^(Fy/Fe)·Fy, Fy/Fe = %.3f (E3-2)", float64(fy.V/fe.V))
		if fy.V/fe.V > 2.25 {
			fcrWords = ": 0.877·Fe, Fy/Fe over 2.25 (E3-3)"
		}
		w := Working{
			Title:   "Compressive strength of the member: " + mode,
			Formula: formula,
			Where:   "Lc/r is the governing slenderness (" + mode + "); Fcr is E3-2 or E3-3 with Fe; Ae is E7's effective area",
			Steps:   []Step{{Value: lcr}, feStep, {Value: fcr, Then: working.Words(fcrWords)}, {Value: ae}, rn},
		}
		if fails != "" {
			w.Where += "; " + fails
			w.Steps[len(w.Steps)-1] = Step{Value: nominal(0), Say: working.Words("not checked"), Expr: working.K(0, "0")}
		}
		return w
	}
	return r
}

// StrutSlenderness is the member's governing slenderness in compression
// (E5's effective one for a single angle, E6's modified one for two pieces)
// and, for two pieces back to back, the connectors' spacing a and the
// least radius of one piece ri; ok is false without a Strut.
func StrutSlenderness(c *Connection) (lcr float64, a, ri units.Length, ok bool) {
	col := c.Member.Strut
	if col == nil || col.L <= 0 {
		return 0, 0, 0, false
	}
	b := memberBuckling(c)
	if col.BuiltUp {
		a, ri = col.ConnectorSpacing(), col.Ri
	}
	return b.lcr, a, ri, true
}
