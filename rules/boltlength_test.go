package rules

import (
	"math"
	"testing"

	"gaugeline/rules/units"
)

// Bolt lengths from the RCSC Specification's add-to-grip table (Table
// C-2.1, read in a fastener maker's reproduction, "ASTM A325 & A490 Bolts &
// Nuts"): 3/4 in adds 1 in, 7/8 adds 1-1/8, 1 adds 1-1/4; 5/32 in per
// hardened washer; the sum rounded up to the next 1/4 in.
func TestBoltLength(t *testing.T) {
	in := func(v float64) units.Length { return units.Length(v) * units.Inch }
	for _, tc := range []struct {
		name    string
		d, grip units.Length
		washers int
		want    float64 // in
	}{
		{"3/4 through 1 in, no washer: 1 + 1 = 2", in(0.75), in(1), 0, 2},
		{"3/4 through 1 in, one washer: 2 + 5/32 → 2-1/4", in(0.75), in(1), 1, 2.25},
		{"7/8 through 1-1/8 in, one washer: 1-1/8 + 1-1/8 + 5/32 = 2.406 → 2-1/2", in(0.875), in(1.125), 1, 2.5},
		{"1 through 1-1/2 in, two washers: 1.5 + 1.25 + 0.3125 = 3.0625 → 3-1/4", in(1), in(1.5), 2, 3.25},
		{"5/8 through 3/8 + 3/8, no washer: 0.75 + 0.875 = 1.625 → 1-3/4", in(0.625), in(0.75), 0, 1.75},
	} {
		got, err := BoltLength(tc.d, tc.grip, tc.washers, units.US)
		if err != nil || math.Abs(got.In()-tc.want) > 1e-9 {
			t.Errorf("%s: %v in, %v; want %v in (RCSC Table C-2.1)", tc.name, got.In(), err, tc.want)
		}
	}
	if _, err := BoltLength(in(0.8), in(1), 0, units.US); err == nil {
		t.Error("a 0.8-in bolt has no table row: want an error")
	}
	// SI: M20 takes the 3/4-in allowance (25.4 mm), 4 mm per washer (CISC
	// bolt length aid), rounded up to 5 mm (EN 14399-4 length steps):
	// 2 × 10 mm plies + 25.4 + 4 = 49.4 → 50 mm.
	if got, err := BoltLength(20, 20, 1, units.SI); err != nil || got != 50 {
		t.Errorf("M20 through 20 mm, one washer: %v mm, %v; want 50", got, err)
	}
}

// Weights: 490 lb/ft³ (Iowa DOT IM 569) and 7850 kg/m³ (SteelforLife Blue
// Book, explanatory notes §2.1). An L4x4x1/2 (A = 3.75 in², AISC Manual
// Table 1-7, 12.8 lb/ft printed; AISC Shapes Database v15.0, read) 16 ft long: 3.75 × 192 / 1728
// × 490 = 204.2 lb, 12.76 lb/ft against the table's 12.8 (the table uses
// the rounded-corner area).
func TestWeight(t *testing.T) {
	w := Weight(units.Area(3.75)*units.SquareInch, 16*units.Foot, units.US)
	if math.Abs(w-3.75*192/1728*490) > 1e-9 || math.Abs(w/16-12.8) > 0.05 {
		t.Errorf("L4x4x1/2 × 16 ft: %v lb (%v lb/ft), want 204.2 (12.8 lb/ft, AISC Table 1-7)", w, w/16)
	}
	// 100 × 10 mm flat, 1 m: 1000 mm² × 1 m × 7850 kg/m³ = 7.85 kg.
	if w := Weight(1000, 1000, units.SI); math.Abs(w-7.85) > 1e-12 {
		t.Errorf("100 × 10 flat, 1 m: %v kg, want 7.85", w)
	}
}
