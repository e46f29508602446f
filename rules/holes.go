package rules

import (
	"fmt"

	"gaugeline/rules/units"
)

// holeRow is one row of Table J3.3 [J3.3M], nominal hole dimensions, in the
// table's unit. Slots are given width × length.
type holeRow struct {
	d              float64
	standard, over float64
	shortW, shortL float64
	longW, longL   float64
}

// holesUS is Table J3.3 up to 1 in; larger bolts follow holeFormulaUS.
var holesUS = [...]holeRow{
	{1.0 / 2, 9.0 / 16, 5.0 / 8, 9.0 / 16, 11.0 / 16, 9.0 / 16, 1 + 1.0/4},
	{5.0 / 8, 11.0 / 16, 13.0 / 16, 11.0 / 16, 7.0 / 8, 11.0 / 16, 1 + 9.0/16},
	{3.0 / 4, 13.0 / 16, 15.0 / 16, 13.0 / 16, 1, 13.0 / 16, 1 + 7.0/8},
	{7.0 / 8, 15.0 / 16, 1 + 1.0/16, 15.0 / 16, 1 + 1.0/8, 15.0 / 16, 2 + 3.0/16},
	{1, 1 + 1.0/8, 1 + 1.0/4, 1 + 1.0/8, 1 + 5.0/16, 1 + 1.0/8, 2 + 1.0/2},
}

// holeFormulaUS is the last row of Table J3.3, d ≥ 1-1/8 in.
func holeFormulaUS(d float64) holeRow {
	return holeRow{d, d + 1.0/8, d + 5.0/16, d + 1.0/8, d + 3.0/8, d + 1.0/8, 2.5 * d}
}

// holesSI is Table J3.3M up to M30; larger bolts follow holeFormulaSI. The
// M12 row is 360-22's; tableDiameters keeps it from 360-16.
var holesSI = [...]holeRow{
	{12, 14, 16, 14, 18, 14, 30},
	{16, 18, 20, 18, 22, 18, 40},
	{20, 22, 24, 22, 26, 22, 50},
	{22, 24, 28, 24, 30, 24, 55},
	{24, 27, 30, 27, 32, 27, 60},
	{27, 30, 35, 30, 37, 30, 67},
	{30, 33, 38, 33, 40, 33, 75},
}

// holeFormulaSI is the last row of Table J3.3M, d ≥ M36.
func holeFormulaSI(d float64) holeRow {
	return holeRow{d, d + 3, d + 8, d + 3, d + 10, d + 3, 2.5 * d}
}

// holeRowFor returns the row of Table J3.3 [J3.3M] for a tabulated diameter
// D in the table's unit.
func (e *Edition) holeRowFor(D float64) holeRow {
	rows, formula, from := holesUS[:], holeFormulaUS, 1+1.0/8
	if e.si() {
		rows, formula, from = holesSI[:], holeFormulaSI, 36
	}
	for _, r := range rows {
		if r.d == D {
			return r
		}
	}
	if D >= from {
		return formula(D)
	}
	panic(fmt.Sprintf("rules: no Table J3.3 row for tabulated diameter %g", D))
}

// hole is Table J3.3 [J3.3M]: the nominal hole for bolt diameter d.
func (e *Edition) hole(d units.Length, t HoleType) (HoleSize, error) {
	D, err := e.tabulated(d, "Table J3.3")
	if err != nil {
		return HoleSize{}, err
	}
	r := e.holeRowFor(D)
	var w, l float64
	switch t {
	case Standard:
		w, l = r.standard, r.standard
	case Oversized:
		w, l = r.over, r.over
	case ShortSlot:
		w, l = r.shortW, r.shortL
	case LongSlot:
		w, l = r.longW, r.longL
	default:
		panic(fmt.Sprintf("rules: unknown hole type %d", int(t)))
	}
	u := e.unit()
	return HoleSize{Width: units.Length(w) * u, Length: units.Length(l) * u}, nil
}

// holeAllowance is B4.3's addition to the nominal hole width for net area.
func (e *Edition) holeAllowance() units.Length {
	if e.si() {
		return 2 * units.Millimetre
	}
	return units.Inch / 16
}

// holePermitted is J3.2 [J3.3]: oversized holes only in slip-critical
// joints; slots in any direction when slip-critical, otherwise transverse
// to the load. (The one-ply-per-faying-surface limit on long slots is
// checked where the plies are known.)
func (e *Edition) holePermitted(t HoleType, dir SlotDir, j Joint) (bool, string) {
	if j < Bearing || j > SlipCritical {
		panic(fmt.Sprintf("rules: unknown joint type %d", int(j)))
	}
	clause := e.Clause("J3.2")
	switch t {
	case Standard:
		return true, ""
	case Oversized:
		if j == SlipCritical {
			return true, ""
		}
		return false, fmt.Sprintf("oversized holes are not permitted in bearing-type joints (%s joint); only in slip-critical joints (%s)", j, clause)
	case ShortSlot, LongSlot:
		if j == SlipCritical || dir == Transverse {
			return true, ""
		}
		kind := "short"
		if t == LongSlot {
			kind = "long"
		}
		return false, fmt.Sprintf("%s slots in bearing-type joints (%s joint) must be transverse to the load; longitudinal slots only in slip-critical joints (%s)", kind, j, clause)
	}
	panic(fmt.Sprintf("rules: unknown hole type %d", int(t)))
}
