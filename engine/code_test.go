package engine

import (
	"testing"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// otherCode is a standard that exists only in this test: AISC 360-16's
// tables with other resistance factors and another name, as a second
// standard's package would give them. It plugs in through Code alone.
type otherCode struct{ *rules.Edition }

func (otherCode) Name() string              { return "other-code" }
func (otherCode) YieldFactor() rules.Factor { return rules.Factor{Phi: 0.85, Omega: 1.76} }
func (otherCode) Clause(label string) string {
	return "OC " + label
}

// TestSecondCode: the limit states take their factors, clause labels and
// name from the Code they are handed, not from AISC 360 by name. On the D.2
// angle (AISC Design Examples v15.0, Example D.2, from memory: Pn = Fy·Ag =
// 36 ksi × 3.75 in² = 135 kips for yielding) the nominal strength stays
// 135 kips, the available one is the other code's φ times it (LRFD) or it
// over Ω (ASD), and the clause printed is the other code's.
func TestSecondCode(t *testing.T) {
	for _, m := range []rules.Method{rules.LRFD, rules.ASD} {
		c := designExampleD2(t, m)
		c.Edition = otherCode{edition(t, "aisc360-16", units.US)}
		c.Demand = kip(50)
		rs, err := Check(c)
		if err != nil {
			t.Fatal(err)
		}
		y := rs[0]
		if y.ID != "member.yield" {
			t.Fatalf("first result %s, want member.yield", y.ID)
		}
		near(t, "Rn", y.Nominal.Kip(), 135, pubTol, "AISC Design Examples v15.0, Example D.2 (from memory)")
		want := 0.85 * y.Nominal.Kip()
		if m == rules.ASD {
			want = y.Nominal.Kip() / 1.76
		}
		near(t, "available", y.Available.Kip(), want, 1e-12, "the other code's factor applied to Rn")
		if y.Clause != "OC D2(a)" || y.Factor != (rules.Factor{Phi: 0.85, Omega: 1.76}) {
			t.Errorf("clause %q, factor %+v: want the other code's", y.Clause, y.Factor)
		}
		if w := y.Working(); w.Title == "" {
			t.Errorf("no working under the other code")
		}
		if err := CheckWorking(y, m); err != nil {
			t.Errorf("working under the other code: %v", err)
		}
	}
}
