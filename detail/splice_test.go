package detail

import (
	"strings"
	"testing"

	"gaugeline/rules/units"
)

// DS-12 (testdata/jobs/us-double-splice.yaml): PL 8 x 3/4 between two
// 1/2 x 8 A36 splice plates, (6) 7/8-in A325-X in 15/16-in holes, two
// lines 4 in apart, 360-22. Hand calculations on the plates' true areas:
//   - plate.yield, J4.1(a): the Whitmore spread (4 + 2·6·tan 30° = 10.9 in)
//     is clipped to the 8-in plates, Rn = 36 · 8 · (2 × 1/2) = 288 kips;
//   - plate.rupture, J4.1(b): An = (8 − 2 × 1.0)(2 × 1/2) = 6.00 in²,
//     Rn = 58 · 6.00 = 348 kips (360-22: no 0.85·Ag cap);
//   - bolts.shear, J3.6: Fnv = 68 ksi (Table J3.2, Group A, threads
//     excluded), Rn = 6 bolts × 2 planes × 68 · π(7/8)²/4 = 490.7 kips;
//   - the splice plate is 2 × (7-1/2 + 1-1/2) + 1/4 = 18-1/4 in long.
func TestDoubleSpliceJob(t *testing.T) {
	r := checkedJob(t, "../testdata/jobs/us-double-splice.yaml")
	got := map[string]float64{}
	for _, res := range r.Results {
		got[res.ID] = res.Nominal.Kip()
	}
	for _, c := range []struct {
		id   string
		want float64
	}{{"plate.yield", 288}, {"plate.rupture", 348}, {"bolts.shear", 490.7}} {
		if !closeTo(got[c.id], c.want, 0.001) {
			t.Errorf("%s Rn = %.2f kips, want %.1f (hand calculation, see the comment)", c.id, got[c.id], c.want)
		}
	}
	pl := r.Design.Conn.Plate
	if l := SpliceLength(pl); !closeTo(float64(l), 18.25*float64(units.Inch), 1e-12) {
		t.Errorf("splice plate %v mm long, want 18-1/4 in", float64(l))
	}
	var text strings.Builder
	if err := r.WriteText(&text); err != nil {
		t.Fatal(err)
	}
	for _, res := range r.Results {
		for _, v := range res.Values {
			if strings.HasPrefix(res.ID, "plate.") && v.Name == "t" && v.What != "thickness of the 2 splice plates together (2 × 1/2 in)" {
				t.Errorf("%s: t is %q", res.ID, v.What)
			}
		}
	}
	for _, w := range []string{"2 × 1/2\" A36 splice plates, one each side",
		"the member's results (at its end) and the plate's bearing and block shear hold for both members"} {
		if !strings.Contains(strings.Join(strings.Fields(text.String()), " "), w) { // notes wrap at 100 columns
			t.Errorf("the report does not say %q", w)
		}
	}
}
