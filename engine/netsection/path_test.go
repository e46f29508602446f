package netsection

import (
	"math"
	"testing"

	"gaugeline/rules/units"
)

// Published worked examples round to three significant figures, so they
// are compared within 0.5 %.
const pubTol = 0.005

func in(v float64) units.Length { return units.Length(v) * units.Inch }

func near(t *testing.T, what string, got, want, tol float64, src string) {
	t.Helper()
	if math.Abs(got-want) > tol*math.Abs(want) {
		t.Errorf("%s = %.6g, want %.6g ±%.2g%% (%s)", what, got, want, tol*100, src)
	}
}

func TestNetWidthStaggered(t *testing.T) {
	// B4.3b: a chain crossing from one gage line to the next adds s²/4g.
	// Two lines 3 in apart, holes 1 in wide (with the allowance), stagger
	// 1.5 in: the zig-zag deduction is 1 + 1 − 1.5²/(4·3) = 1.8125 in, more
	// than the straight 1 in (hand calculation per AISC 360-22 B4.3b).
	holes := []PathHole{{X: 0, U: in(1.5), Dh: in(1)}, {X: in(1.5), U: in(4.5), Dh: in(1)}}
	d, path := NetWidthDeduction(holes)
	near(t, "deduction", d.In(), 2-1.5*1.5/12, 1e-12, "AISC 360-22 B4.3b, hand calculation")
	if len(path) != 2 {
		t.Errorf("path %v, want both holes", path)
	}
	// With a 4-in stagger the straight path governs: 2 − 16/12 < 1.
	holes[1].X = in(4)
	d, path = NetWidthDeduction(holes)
	near(t, "deduction", d.In(), 1, 1e-12, "AISC 360-22 B4.3b, hand calculation")
	if len(path) != 1 {
		t.Errorf("path %v, want one hole", path)
	}
}

func TestSeguiStaggeredPlate(t *testing.T) {
	// W. T. Segui, Steel Design, Example 3.6 (from memory): a 16 x 3/4 in
	// plate, 1-in bolts, holes taken as 1-1/8 in, gage lines 5 in apart,
	// the middle line staggered 3 in. Path abde: wn = 16 − 2(1.125) =
	// 13.75 in; path abcde: wn = 16 − 3(1.125) + 2(3²)/(4·5) = 13.52 in,
	// which governs: An = 0.75(13.52) = 10.14 in².
	const src = "Segui, Steel Design, Example 3.6 (from memory)"
	holes := []PathHole{
		{X: 0, U: in(3), Dh: in(1.125)},
		{X: in(3), U: in(8), Dh: in(1.125)},
		{X: 0, U: in(13), Dh: in(1.125)},
	}
	d, path := NetWidthDeduction(holes)
	near(t, "wn", (in(16) - d).In(), 13.52, pubTol, src)
	near(t, "An", (in(16)-d).In()*0.75, 10.14, pubTol, src)
	if len(path) != 3 {
		t.Errorf("worst path %v, want a-b-c-d-e through all three holes", path)
	}
}
