package engine

import (
	"math"

	"gaugeline/rules/units"
)

// Whitmore is the effective section of the plate: the bolt group's width
// spread at 30° on each side from the row nearest the plate's free edge to
// the row farthest from it, capped by the plate width, taken at that
// farthest row (holes within LineSlack of it along the load are on it).
type Whitmore struct {
	Lw       units.Length // effective width
	Spread   units.Length // width before the cap
	X        units.Length // x of the section (the row farthest from the free edge)
	Holes    int          // holes cut by the section
	Deducted units.Length // their total width with the B4.3 allowance
	// SingleRow: every hole is in one row, so the section is the plate's
	// whole width at that row.
	SingleRow bool
}

// WhitmoreAngle is the spread of the Whitmore section on each side of the
// bolt group: 30°.
const WhitmoreAngle = math.Pi / 6

// WhitmoreSection computes the Whitmore section of the connection.
func WhitmoreSection(c *Connection) Whitmore {
	if len(c.Holes) == 0 {
		return Whitmore{}
	}
	xmin, xmax := math.Inf(1), math.Inf(-1)
	ymin, ymax := math.Inf(1), math.Inf(-1)
	for _, h := range c.Holes {
		xmin, xmax = math.Min(xmin, float64(h.X)), math.Max(xmax, float64(h.X))
		ymin, ymax = math.Min(ymin, float64(h.Y)), math.Max(ymax, float64(h.Y))
	}
	w := Whitmore{X: units.Length(xmin)}
	slack := float64(LineSlack(c.Bolt.D))
	w.Spread = units.Length(ymax - ymin + 2*(xmax-xmin)*math.Tan(WhitmoreAngle))
	if xmax-xmin <= slack {
		// One row: there is no length to spread over, and the section at
		// the row runs across the whole plate (as for a splice plate).
		w.SingleRow, w.Spread = true, c.Plate.Width
	}
	w.Lw = min(w.Spread, c.Plate.Width)
	allow := c.Edition.HoleAllowance()
	for _, h := range c.Holes {
		if float64(h.X)-xmin <= slack {
			w.Holes++
			w.Deducted += h.Dy + allow
		}
	}
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
	}, whitmoreNote(w, "Whitmore section (30° spread), capped by the plate width"))
}

// PlateRupture is tensile rupture of the plate on the Whitmore section,
// less the holes it cuts: Rn = Fu·An; under 360-16 a splice plate's An is
// capped at 0.85·Ag.
//
// Clause: J4.1(b)
func PlateRupture(c *Connection) Result {
	p := c.Plate
	w := WhitmoreSection(c)
	Ag := w.Lw.Mul(p.T)
	An := max((w.Lw - w.Deducted).Mul(p.T), 0)
	note := whitmoreNote(w, "net Whitmore section at the row farthest from the free edge")
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
		{"splice_cap_applied", capped, units.Dimensionless},
	}, note)
}

func whitmoreNote(w Whitmore, note string) string {
	if w.SingleRow {
		return "one row of bolts: the section across the whole plate width at the row"
	}
	return note
}
