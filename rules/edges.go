package rules

import (
	"fmt"
	"math"

	"gaugeline/rules/units"
)

// edgeRow is one row of Table J3.4 [J3.4M], minimum edge distance from the
// centre of a standard hole to any edge, in the table's unit.
type edgeRow struct{ d, min float64 }

// minEdgeUS is Table J3.4; over 1-1/4 in the minimum is 1.25d.
var minEdgeUS = [...]edgeRow{
	{1.0 / 2, 3.0 / 4},
	{5.0 / 8, 7.0 / 8},
	{3.0 / 4, 1},
	{7.0 / 8, 1 + 1.0/8},
	{1, 1 + 1.0/4},
	{1 + 1.0/8, 1 + 1.0/2},
	{1 + 1.0/4, 1 + 5.0/8},
}

// minEdgeSI is Table J3.4M (M12 is 360-22's); over M36 the minimum is 1.25d.
var minEdgeSI = [...]edgeRow{
	{12, 18}, {16, 22}, {20, 26}, {22, 28}, {24, 30}, {27, 34}, {30, 38}, {36, 46},
}

// minEdge is Table J3.4 [J3.4M].
func (e *Edition) minEdge(d units.Length) (units.Length, error) {
	D, err := e.tabulated(d, "Table J3.4")
	if err != nil {
		return 0, err
	}
	rows := minEdgeUS[:]
	if e.si() {
		rows = minEdgeSI[:]
	}
	emin := 1.25 * D // "over 1-1/4 in" / "over M36"
	for _, r := range rows {
		if r.d == D {
			emin = r.min
		}
	}
	return units.Length(emin) * e.unit(), nil
}

// c2Row is one row of Table J3.5 [J3.5M]: C2 for bolt diameters up to and
// including upTo, in the table's unit. Long slots take 0.75d throughout.
type c2Row struct{ upTo, oversized, shortSlot float64 }

var c2US = [...]c2Row{
	{7.0 / 8, 1.0 / 16, 1.0 / 8},
	{1, 1.0 / 8, 1.0 / 8},
	{math.Inf(1), 1.0 / 8, 3.0 / 16},
}

var c2SI = [...]c2Row{
	{22, 2, 3},
	{24, 3, 3},
	{math.Inf(1), 3, 5},
}

// edgeIncrement is C2 of Table J3.5 [J3.5M] for a hole whose long axis is
// perpendicular to the edge.
func (e *Edition) edgeIncrement(d units.Length, t HoleType) (units.Length, error) {
	D, err := e.tabulated(d, "Table J3.5")
	if err != nil {
		return 0, err
	}
	rows := c2US[:]
	if e.si() {
		rows = c2SI[:]
	}
	var r c2Row
	for _, r = range rows {
		if D <= r.upTo {
			break
		}
	}
	var c2 float64
	switch t {
	case Standard:
		c2 = 0
	case Oversized:
		c2 = r.oversized
	case ShortSlot:
		c2 = r.shortSlot
	case LongSlot:
		c2 = 0.75 * D
	default:
		panic(fmt.Sprintf("rules: unknown hole type %d", int(t)))
	}
	return units.Length(c2) * e.unit(), nil
}

// minSpacing is J3.3 [J3.4]: 2-2/3·d between centres.
func minSpacing(d units.Length) units.Length { return d * 8 / 3 }

// maxEdge is J3.5 [J3.6]: 12t, at most 6 in (150 mm).
func (e *Edition) maxEdge(t units.Length) units.Length {
	limit := 6 * units.Inch
	if e.si() {
		limit = 150 * units.Millimetre
	}
	return min(12*t, limit)
}

// maxSpacing is J3.5 [J3.6]: 24t ≤ 12 in (300 mm); unpainted weathering
// steel 14t ≤ 7 in (180 mm). Both editions print 300 mm (360-16 J3.5(a)
// read in its text, page 16.1-131; 360-05 printed 305 mm).
func (e *Edition) maxSpacing(t units.Length, weathering bool) units.Length {
	if weathering {
		limit := 7 * units.Inch
		if e.si() {
			limit = 180 * units.Millimetre
		}
		return min(14*t, limit)
	}
	limit := 12 * units.Inch
	if e.si() {
		limit = 300 * units.Millimetre
	}
	return min(24*t, limit)
}
