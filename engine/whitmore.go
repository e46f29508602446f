package engine

import (
	"math"

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
	w.YLo, w.YHi = max(w.Low.Y1, c.Plate.YMin()), min(w.High.Y1, c.Plate.YMax())
	w.Lw = max(w.YHi-w.YLo, 0)
	ded, path := NetWidthDeduction(pathHoles(c, platePly))
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
	Aw := w.Lw.Mul(p.T)
	return finish(c, "plate.yield", "J4.1(a)", p.Fy.Times(Aw), c.Edition.YieldFactor(), []Value{
		{"Fy", float64(p.Fy), units.DimStress},
		{"Lw", float64(w.Lw), units.DimLength},
		{"Whitmore_spread", float64(w.Spread), units.DimLength},
		{"t", float64(p.T), units.DimLength},
		{"Ag", float64(Aw), units.DimArea},
	}, whitmoreNote(w, "Whitmore section: 30° from the first bolt of each gage line, clipped by the plate"))
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
	Ag := w.Lw.Mul(p.T)
	An := max((w.Lw - w.Deducted).Mul(p.T), 0)
	note := whitmoreNote(w, "net Whitmore section, worst straight or zig-zag path of holes")
	capped := 0.0
	if cap, ok := c.Edition.SplicePlateCap(); ok && p.Kind == Splice && An > units.Area(cap)*Ag {
		An = units.Area(cap) * Ag
		capped = 1
		note += "; An capped at 0.85·Ag for a splice plate"
	}
	return finish(c, "plate.rupture", "J4.1(b)", p.Fu.Times(An), c.Edition.RuptureFactor(), []Value{
		{"Fu", float64(p.Fu), units.DimStress},
		{"Lw", float64(w.Lw), units.DimLength},
		{"t", float64(p.T), units.DimLength},
		{"Ag", float64(Ag), units.DimArea},
		{"An", float64(An), units.DimArea},
		{"holes", float64(w.Holes), units.Dimensionless},
		{"deduction", float64(w.Deducted), units.DimLength},
		{"splice_cap_applied", capped, units.Dimensionless},
	}, note)
}

func whitmoreNote(w Whitmore, note string) string {
	if w.Spread <= eps {
		return "a single bolt has no Whitmore section: use two or more bolts"
	}
	return note
}
