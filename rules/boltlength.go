package rules

import (
	"fmt"
	"math"

	"gaugeline/rules/units"
)

// Bolt length: what a bolt list orders for a grip. Not a clause of AISC 360:
// the RCSC Specification's commentary table (Table C-2.1, "add to grip"),
// read in a fastener maker's reproduction, not in the RCSC text itself:
// the length to add to the grip for one heavy hex nut, 5/32 in more for
// each hardened flat washer, the sum rounded up to the next 1/4 in.
var addToGrip = []struct{ d, add float64 }{ // inches
	{0.5, 11.0 / 16}, {0.625, 7.0 / 8}, {0.75, 1}, {0.875, 1 + 1.0/8}, {1, 1 + 1.0/4},
	{1.125, 1 + 1.0/2}, {1.25, 1 + 5.0/8}, {1.375, 1 + 3.0/4}, {1.5, 1 + 7.0/8},
}

// washerAdd is the thickness added per hardened flat washer (ASTM F436),
// 5/32 in: the RCSC table's note (US); 4 mm in metric work (the CISC bolt
// length aid).
const washerAddIn, washerAddMm = 5.0 / 32, 4.0

// metricAddToGrip is the add-to-grip of a metric bolt: the RCSC value of
// the inch bolt of nearest diameter, in mm (an approximation: no metric
// table was read; say so on the bolt list).
func metricAddToGrip(d units.Length) (units.Length, bool) {
	best, bestGap := -1, math.Inf(1)
	for i, r := range addToGrip {
		if gap := math.Abs(r.d*float64(units.Inch) - float64(d)); gap < bestGap {
			best, bestGap = i, gap
		}
	}
	if bestGap > 2 { // more than 2 mm from every tabulated diameter
		return 0, false
	}
	return units.Length(addToGrip[best].add) * units.Inch, true
}

// BoltLength is the length of a bolt of diameter d through grip (the
// plies' thicknesses) with washers hardened flat washers: grip + the
// table's add-to-grip + each washer, rounded up to the next 1/4 in (US) or
// the next 5 mm (SI: EN 14399-4 lists lengths in 5 mm steps). An error for
// a diameter the table does not list.
func BoltLength(d, grip units.Length, washers int, sys units.System) (units.Length, error) {
	if sys == units.SI {
		add, ok := metricAddToGrip(d)
		if !ok {
			return 0, fmt.Errorf("no add-to-grip for a %g mm bolt", d.Mm())
		}
		l := float64(grip+add) + float64(washers)*washerAddMm
		return units.Length(math.Ceil(l/5-1e-9) * 5), nil
	}
	for _, r := range addToGrip {
		if math.Abs(r.d-d.In()) < 1e-6 {
			l := grip.In() + r.add + float64(washers)*washerAddIn
			return units.Length(math.Ceil(l*4-1e-9)/4) * units.Inch, nil
		}
	}
	return 0, fmt.Errorf("no add-to-grip for a %s bolt", units.FormatJob(d, units.US))
}

// Steel densities for piece weights: 490 lb/ft³ (Iowa DOT IM 569,
// "Computing structural steel weight") and 7850 kg/m³ (the SteelforLife
// Blue Book's explanatory notes, §2.1). 490 lb/ft³ is 7849 kg/m³.
const (
	DensityUS = 490.0  // lb/ft³
	DensitySI = 7850.0 // kg/m³
)

// Weight is the weight of a piece of cross-section area a and length l:
// in lb (US) or kg (SI).
func Weight(a units.Area, l units.Length, sys units.System) float64 {
	if sys == units.SI {
		return float64(a) * float64(l) * 1e-9 * DensitySI // mm³ → m³
	}
	ft3 := a.In2() * l.In() / (12 * 12 * 12)
	return ft3 * DensityUS
}
