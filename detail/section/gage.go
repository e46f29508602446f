package section

import (
	"math"

	"gaugeline/rules/units"
)

// UsualGages are the usual gage lines in an angle leg, measured from the
// heel: G for a single line; G1 to the first of two lines and G2 from it to
// the second (G1 = G2 = 0 when the leg is too short for two lines).
type UsualGages struct {
	G, G1, G2 units.Length
}

// usGage is one row of the workable-gage table, in sixteenths of an inch.
type usGage struct{ leg, g, g1, g2 int }

// usGages are the workable gages in angle legs of US common practice: AISC
// Steel Construction Manual, Table 1-7A "Workable Gages in Angle Legs".
// Values from memory: no stored text of the table was found to read them
// against (a search of the stored pages and docs found only pages that
// name the table and its g, g1, g2 columns, e.g. "Steel Angles with Equal
// Legs", https://www.amesweb.info/SectionalPropertiesTabs/Steel-Angles-Equal-Legs-L-Shapes.aspx,
// without the values).
var usGages = []usGage{
	{128, 72, 48, 48}, // 8: 4-1/2; 3 + 3
	{112, 64, 40, 48}, // 7: 4; 2-1/2 + 3
	{96, 56, 36, 40},  // 6: 3-1/2; 2-1/4 + 2-1/2
	{80, 48, 32, 28},  // 5: 3; 2 + 1-3/4
	{64, 40, 0, 0},    // 4: 2-1/2
	{56, 32, 0, 0},    // 3-1/2: 2
	{48, 28, 0, 0},    // 3: 1-3/4
	{40, 22, 0, 0},    // 2-1/2: 1-3/8
	{32, 18, 0, 0},    // 2: 1-1/8
}

// siGage is one row of usual back marks, in millimetres.
type siGage struct{ leg, g, g1, g2 float64 }

// siGages are the usual back marks in metric angle legs (European and UK
// practice, from memory; no source checked). Legs of 120 mm and more are
// listed in practice with two lines only; their single line is taken at the
// first mark, G = G1. Legs of 130, 135, 160 and 180 mm are not listed.
var siGages = []siGage{
	{40, 22, 0, 0},
	{45, 25, 0, 0},
	{50, 28, 0, 0},
	{60, 35, 0, 0},
	{65, 35, 0, 0},
	{70, 40, 0, 0},
	{75, 45, 0, 0},
	{80, 45, 0, 0},
	{90, 50, 0, 0},
	{100, 55, 0, 0},
	{120, 45, 45, 50},
	{125, 45, 45, 50},
	{150, 55, 55, 55},
	{200, 75, 75, 75},
}

// WorkableGage gives the usual gage lines for a leg of length leg in the
// practice of sys; false when the table has no such leg. US: the workable
// gages of common practice for legs of 2 to 8 in; SI: usual back marks for
// legs of 40 to 200 mm (both from memory, no source checked).
func WorkableGage(leg units.Length, sys units.System) (UsualGages, bool) {
	const tol = 0.01 // mm: the legs are exact; this only absorbs rounding
	switch sys {
	case units.US:
		for _, r := range usGages {
			if math.Abs(float64(leg-sixteenths(r.leg))) < tol {
				return UsualGages{G: sixteenths(r.g), G1: sixteenths(r.g1), G2: sixteenths(r.g2)}, true
			}
		}
	case units.SI:
		for _, r := range siGages {
			if math.Abs(leg.Mm()-r.leg) < tol {
				return UsualGages{G: units.Length(r.g), G1: units.Length(r.g1), G2: units.Length(r.g2)}, true
			}
		}
	}
	return UsualGages{}, false
}
