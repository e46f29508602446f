package rules

import (
	"fmt"
	"math"

	"gaugeline/rules/units"
)

// ClearanceSource names the table behind BoltClearances, as the research
// notes (docs/sources/shapes.md, item 3C) give it.
const ClearanceSource = "AISC Manual Table 8-4 (LRFD-era edition), not confirmed against the current Manual Tables 7-15/7-16"

// ClearanceTable is the short name of that table, for a report's clause column.
const ClearanceTable = "AISC Manual Table 8-4"

// Entering and tightening clearances of conventional A325 and A490 bolts:
// AISC Manual Table 8-4 "Entering and Tightening Clearances, in.", page
// "BOLTED CONSTRUCTION 8-13", of an LRFD-era Manual (edition not shown),
// read in two stored copies that agree. Not confirmed against the current
// Manual's Tables 7-15 and 7-16. Exact inches, as printed.
//
// C1 is the tightening clearance (bolt centre to an obstruction's face, room
// for the socket on the nut), C2 the entering clearance (bolt centre to an
// obstruction, room to enter the bolt). The table starts at 5/8 in: a 1/2 in
// bolt has no row.
var clearancesUS = [...]struct{ d, c1, c2 float64 }{ // inches
	{5.0 / 8, 1, 11.0 / 16},
	{3.0 / 4, 1 + 1.0/4, 3.0 / 4},
	{7.0 / 8, 1 + 3.0/8, 7.0 / 8},
	{1, 1 + 7.0/16, 15.0 / 16},
	{1 + 1.0/8, 1 + 9.0/16, 1 + 1.0/16},
	{1 + 1.0/4, 1 + 11.0/16, 1 + 1.0/8},
	{1 + 3.0/8, 1 + 3.0/4, 1 + 1.0/4},
	{1 + 1.0/2, 1 + 15.0/16, 1 + 5.0/16},
}

// BoltClearance is one row of the clearance table, in internal units.
type BoltClearance struct {
	D          units.Length // nominal bolt diameter
	Tightening units.Length // C1
	Entering   units.Length // C2
}

// BoltClearances is the row of AISC Manual Table 8-4 (see ClearanceSource)
// for an inch bolt of diameter d. A *NotTabulatedError for a diameter the
// table does not list: 1/2 in, and every metric bolt (no metric table was
// read; callers keep their own rule for those and say so).
func BoltClearances(d units.Length) (BoltClearance, error) {
	for _, r := range clearancesUS {
		if math.Abs(r.d-d.In()) < 1e-6 {
			return BoltClearance{
				D:          units.Length(r.d) * units.Inch,
				Tightening: units.Length(r.c1) * units.Inch,
				Entering:   units.Length(r.c2) * units.Inch,
			}, nil
		}
	}
	return BoltClearance{}, &NotTabulatedError{
		Edition: "AISC Manual", Table: "Table 8-4",
		Key: fmt.Sprintf("a %g in (%g mm) bolt", round6(d.In()), round6(d.Mm())),
	}
}

// round6 rounds v to six decimals, for a message.
func round6(v float64) float64 { return math.Round(v*1e6) / 1e6 }
