package engine

import (
	"math"
	"strconv"

	"gaugeline/engine/netsection"
	"gaugeline/engine/working"
	"gaugeline/rules/units"
)

// Whitmore is the effective section of the plate: 30° lines spread from
// the first bolt of each gage line (the one nearest the plate's free edge)
// to the section through the bolt farthest from it; the section runs
// between the outermost of those lines and is clipped by the plate's side
// edges. For one row of bolts it is the row's spread (zero for one bolt:
// a single bolt has no Whitmore section).
type Whitmore struct {
	Lw     units.Length // effective width, clipped by the plate
	Spread units.Length // width before the clip
	X      units.Length // x of the section (the bolt farthest from the free edge)
	// Low and High are the two spread lines that bound the section: from
	// the first bolt of a gage line to the section's ends before the clip.
	Low, High SpreadLine
	// YLo and YHi are the section's ends after the clip.
	YLo, YHi units.Length
	Holes    int          // holes on the worst net path across the section
	Deducted units.Length // B4.3b deduction of that path (Σ dh − Σ s²/4g)
}

// SpreadLine is one 30° line of the Whitmore section: from the first
// bolt of a gage line (X0, Y0) to the section at (X1, Y1).
type SpreadLine struct {
	X0, Y0, X1, Y1 units.Length
}

// WhitmoreAngle is the spread of the Whitmore section on each side of the
// bolt group: 30°.
const WhitmoreAngle = math.Pi / 6

// WhitmoreSection computes the Whitmore section of the connection's plate.
func WhitmoreSection(c *Connection) Whitmore {
	if len(c.Holes) == 0 {
		return Whitmore{}
	}
	xs := c.Holes[0].X
	for _, h := range c.Holes {
		xs = min(xs, h.X)
	}
	w := Whitmore{X: xs}
	tan := units.Length(math.Tan(WhitmoreAngle))
	first := true
	for _, ln := range GageLines(c) {
		h := c.Holes[ln[len(ln)-1]] // the line's first bolt: nearest the free edge
		spread := (h.X - xs) * tan
		lo := SpreadLine{X0: h.X, Y0: h.Y, X1: xs, Y1: h.Y - spread}
		hi := SpreadLine{X0: h.X, Y0: h.Y, X1: xs, Y1: h.Y + spread}
		if first || lo.Y1 < w.Low.Y1 {
			w.Low = lo
		}
		if first || hi.Y1 > w.High.Y1 {
			w.High = hi
		}
		first = false
	}
	w.Spread = w.High.Y1 - w.Low.Y1
	// The section line x = xs between the spread lines, clipped by the
	// plate: by its side edges, or by its outline (the sum of the parts
	// inside it where it is not convex).
	w.Lw, w.YLo, w.YHi = c.Plate.SectionLength(xs, w.Low.Y1, w.High.Y1)
	if w.Lw == 0 && c.Plate.Outline != nil {
		w.YLo, w.YHi = w.Low.Y1, w.Low.Y1
	}
	ded, path := netsection.NetWidthDeduction(pathHoles(c, platePly))
	if c.Plate.Kind == Splice {
		// Across both groups (platePathHoles); for mirrored groups it is
		// the same path, so it replaces A's only when it is worse beyond the
		// tolerance: B's mirrored coordinates round differently.
		if d, p := netsection.NetWidthDeduction(platePathHoles(c)); d > ded+eps {
			ded, path = d, p
		}
	}
	w.Holes, w.Deducted = len(path), ded
	return w
}

// PlateYield is tensile yielding of the plate on the Whitmore section:
// Rn = Fy·Aw.
//
// Clause: J4.1(a)
func PlateYield(c *Connection) Result {
	p := c.Plate
	w := WhitmoreSection(c)
	Aw := w.Lw.Mul(p.TotalT())
	Rn := p.Fy.Times(Aw)
	vs := newValues(5)
	pFy, pLw := vs.add(valFy(p.Fy)), vs.add(valLw(w.Lw))
	pSpread := vs.add(Value{Name: "Whitmore_spread", V: float64(w.Spread), Dim: units.DimLength, Sym: "spread",
		What: "30° spread before the clip by the plate"})
	pT := vs.add(valT(c, p.TotalT(), false, "thickness"))
	pAg := vs.add(Value{Name: "Ag", V: float64(Aw), Dim: units.DimArea, What: "gross area of the Whitmore section, Aw = Lw·t"})
	clip := "the plate"
	if p.Outline != nil {
		clip = "the plate's outline"
	}
	r := finish(c, "plate.yield", "J4.1(a)", Rn, c.Edition.YieldFactor(), vs.list,
		whitmoreNote(w, "Whitmore section: 30° from the first bolt of each gage line, clipped by "+clip))
	lo, hi, ymin, ymax, width := w.Low.Y1, w.High.Y1, p.YMin(), p.YMax(), p.Width
	var section [][2]units.Length // the outline's parts of the section line that meet the spread
	if p.Outline != nil {
		for _, iv := range p.SectionAt(w.X) {
			if min(iv[1], hi) > max(iv[0], lo) {
				section = append(section, iv)
			}
		}
	}
	outline, xs := p.Outline != nil, w.X
	r.explain = func() Working {
		Fy, lw, spread, t, ag := *pFy, *pLw, *pSpread, *pT, *pAg
		aw := ag
		aw.Sym = "Aw"
		length := func(sym string, l units.Length) Expr {
			return working.Of(Value{Sym: sym, V: float64(l), Dim: units.DimLength})
		}
		lwStep := Step{Value: lw,
			// the spread's ends clipped by the plate's side edges
			Expr: working.Max(working.Sub(working.Min(length("y1", hi), length("ymax", ymax)), working.Max(length("y0", lo), length("ymin", ymin))), working.K(0, "0")),
			Say:  working.Phrase(working.Of(spread), working.Words(" spread, clipped by the "), length("width", width), working.Words(" plate"))}
		clipLine := "the spread, clipped by the plate's side edges"
		if outline {
			lwStep = whitmoreOutlineStep(lw, spread, lo, hi, xs, section)
			clipLine = "the spread, clipped by the plate's outline: the length of the section line inside it between the spread lines"
		}
		awStep := Step{Value: aw, Expr: working.Mul(working.Of(lw), working.Of(t))}
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Of(Fy), working.Of(aw))}
		return Working{
			Title: "Tensile yielding of the plate on the Whitmore section",
			Formula: []Step{rn, awStep,
				{Value: Value{Sym: "Lw"}, Expr: working.Words(clipLine)}},
			Where: "the spread is the width between 30° lines drawn from the first bolt of each gage line (the one nearest the free edge) to the section through the bolt farthest from it (the Whitmore section); one row of bolts spreads over the row's width only, and a single bolt has no Whitmore section",
			Steps: []Step{lwStep, awStep, rn},
		}
	}
	return r
}

// PlateRupture is tensile rupture of the plate on the Whitmore section,
// less the worst straight or zig-zag path of holes across it (B4.3b, the
// same path search as the member's): Rn = Fu·An; under 360-16 a splice
// plate's An is capped at 0.85·Ag.
//
// Clause: J4.1(b)
func PlateRupture(c *Connection) Result {
	p := c.Plate
	w := WhitmoreSection(c)
	// Both splice plates together: An and Ag scale alike, so the cap of
	// 0.85·Ag per splice plate is the cap on the two together.
	Ag := w.Lw.Mul(p.TotalT())
	An := max((w.Lw - w.Deducted).Mul(p.TotalT()), 0)
	note := whitmoreNote(w, "net Whitmore section, worst straight or zig-zag path of holes")
	capped := 0.0
	cap, hasCap := c.Edition.SplicePlateCap()
	if hasCap && p.Kind == Splice && An > units.Area(cap)*Ag {
		An = units.Area(cap) * Ag
		capped = 1
		note += "; An capped at 0.85·Ag for a splice plate"
	}
	Rn := p.Fu.Times(An)
	vs := newValues(8)
	pFu, pLw, pT := vs.add(valFu(p.Fu)), vs.add(valLw(w.Lw)), vs.add(valT(c, p.TotalT(), false, "thickness"))
	pAg := vs.add(Value{Name: "Ag", V: float64(Ag), Dim: units.DimArea, What: "gross area of the Whitmore section, Lw·t"})
	pAn := vs.add(Value{Name: "An", V: float64(An), Dim: units.DimArea, What: "net area of the Whitmore section"})
	pHoles := vs.add(Value{Name: "holes", V: float64(w.Holes), What: "holes on the worst path across the section"})
	pDd := vs.add(valDeduction(w.Deducted))
	vs.add(Value{Name: "splice_cap_applied", V: capped, Sym: "cap applied", What: "An capped at 0.85·Ag (1 yes, 0 no)"})
	r := finish(c, "plate.rupture", "J4.1(b)", Rn, c.Edition.RuptureFactor(), vs.list, note)

	ed, net := c.Edition, w.Lw-w.Deducted
	r.explain = func() Working {
		Fu, lw, t, ag, an, holes, dd := *pFu, *pLw, *pT, *pAg, *pAn, *pHoles, *pDd
		rn := Step{Value: nominal(Rn), Expr: working.Mul(working.Of(Fu), working.Of(an))}
		worked := working.Mul(working.Sub(working.Of(lw), working.Of(dd)), working.Of(t))
		var anStep Step
		switch {
		case capped != 0:
			anStep = Step{Value: an, Expr: working.Mul(working.K(cap, strconv.FormatFloat(cap, 'f', -1, 64)), working.Of(ag)), Show: working.ShowForm, Then: working.Words(" (the splice-plate cap governs)")}
		case net > 0:
			anStep = Step{Value: an, Expr: worked}
		default:
			anStep = Step{Value: an, Expr: working.Max(worked, working.K(0, "0")), Then: working.Words(": no net section")}
		}
		wk := Working{
			Title:   "Tensile rupture of the plate on the Whitmore section",
			Formula: []Step{rn, {Value: Value{Sym: "An"}, Expr: working.Mul(working.Add(working.Sub(working.Of(lw), working.Of(Value{Sym: "Σdh"})), working.Of(Value{Sym: "Σs²/4g"})), working.Of(t))}},
			Where: "the holes are those of the worst straight or zig-zag path across the plate (B4.3b, the same search as the member's); dh = nominal hole + " +
				units.FormatJob(ed.HoleAllowance(), ed.System()),
			Steps: []Step{
				{Value: ag, Expr: working.Mul(working.Of(lw), working.Of(t))},
				{Then: working.Phrase(working.Words("worst path: "), working.Of(holes), working.Words(" hole(s), Σdh − Σs²/4g = "), working.Of(dd))},
				anStep, rn,
			},
		}
		if hasCap {
			wk.Formula = append(wk.Formula, Step{Then: working.Words("An ≤ 0.85·Ag (splice plates)")})
		}
		return wk
	}
	return r
}

// valLw is the width of the Whitmore section.
func valLw(Lw units.Length) Value {
	return Value{Name: "Lw", V: float64(Lw), Dim: units.DimLength, What: "Whitmore width"}
}

func whitmoreNote(w Whitmore, note string) string {
	if w.Spread <= eps {
		return "a single bolt has no Whitmore section: use two or more bolts"
	}
	return note
}

// whitmoreOutlineStep is the step that clips the spread (y0 to y1 at the
// section x = xs) by the outline: one term per part [ya, yb] of the
// section line inside the outline that meets the spread, summed (one part
// for a convex outline).
func whitmoreOutlineStep(lw, spread Value, lo, hi, xs units.Length, section [][2]units.Length) Step {
	length := func(sym string, l units.Length) Expr {
		return working.Of(Value{Sym: sym, V: float64(l), Dim: units.DimLength})
	}
	terms := make([]Expr, 0, len(section))
	for k, iv := range section {
		a, b := "ya", "yb"
		if len(section) > 1 {
			a, b = "ya"+strconv.Itoa(k+1), "yb"+strconv.Itoa(k+1)
		}
		terms = append(terms, working.Sub(working.Min(length("y1", hi), length(b, iv[1])), working.Max(length("y0", lo), length(a, iv[0]))))
	}
	var e Expr
	switch len(terms) {
	case 0:
		e = working.K(0, "0")
	case 1:
		e = terms[0]
	default:
		e = working.Add(terms...)
	}
	// The substitution is printed (the ends a QA engineer checks on the
	// drawing), then what it is.
	return Step{Value: lw, Expr: e,
		Then: working.Phrase(working.Words(": the "), working.Of(spread), working.Words(" spread, clipped by the plate's outline along x = "), length("xs", xs))}
}
