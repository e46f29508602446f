package sheet

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r2"
)

// DS-12 (testdata/jobs/us-double-splice.yaml): two lines at y = 2 and 6 in
// of three bolts at x = 1-1/2, 4-1/2, 7-1/2 in, edge 1-1/2 in, gap 1/4 in,
// plates 8 in wide, two of them. Numbers from the job file: the splice
// plate is 2·(7-1/2 + 1-1/2) + 1/4 = 18-1/4 in long; member A's holes at
// x' = 9 − x (7-1/2, 4-1/2, 1-1/2), member B's mirrored at x' = 9 + 1/4 +
// x (10-3/4, 13-3/4, 16-3/4), y' = 8 − y; the member ends (joint lines)
// at x' = 9 and 9-1/4.
func TestSplicePlateCarriesBothGroups(t *testing.T) {
	_, s := sheetOf(t, "../../testdata/jobs/us-double-splice.yaml")
	if len(s.Views) != 2 {
		t.Fatalf("%d views, want the member and the splice plate", len(s.Views))
	}
	v := s.Views[1]
	p := v.Part
	if _, hi := p.Bounds(); !near(hi.X, 18.25) || !near(hi.Y, 8) {
		t.Errorf("splice plate %v × %v in, want 18-1/4 × 8", hi.X, hi.Y)
	}
	if p.Pieces != 2 {
		t.Errorf("pieces %d, want 2 (one each side)", p.Pieces)
	}
	var want []r2.Vec
	for _, y := range []float64{2, 6} {
		for _, x := range []float64{1.5, 4.5, 7.5} {
			want = append(want, r2.Vec{X: 9 - x, Y: 8 - y})
		}
	}
	for _, y := range []float64{2, 6} {
		for _, x := range []float64{1.5, 4.5, 7.5} {
			want = append(want, r2.Vec{X: 9.25 + x, Y: 8 - y})
		}
	}
	if len(p.Holes) != len(want) {
		t.Fatalf("%d holes, want both groups' %d", len(p.Holes), len(want))
	}
	for i, w := range want {
		if got := p.Holes[i].Centre; !near(got.X, w.X) || !near(got.Y, w.Y) {
			t.Errorf("hole %s at %v, want %v", p.Holes[i].ID, got, w)
		}
	}
	joint := map[float64]bool{}
	for _, l := range v.Lines {
		if l.Layer == LayerReference && near(l.A.X, l.B.X) && l.A.Y < 0 && l.B.Y > 8 {
			joint[l.A.X] = true
		}
	}
	if !joint[9] || !joint[9.25] {
		t.Errorf("member-end lines at %v, want x' = 9 and 9-1/4", joint)
	}
	if row := s.Schedule[2]; row[0] != "SPLICE PLATE (EACH OF 2)" || row[1] != "12" {
		t.Errorf("schedule row %q, want the splice plates with 12 holes each", row)
	}
}
