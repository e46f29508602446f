package engine

import (
	"testing"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// AISC Steel Construction Manual (15th ed.) design aids, from memory. They
// tabulate φrn to three significant figures: 0.5 %.

func TestManualTable71BoltShear(t *testing.T) {
	e := edition(t, "aisc360-16", units.US)
	cases := []struct {
		name    string
		grade   string
		d       float64
		threads rules.Threads
		planes  int
		want    float64 // φrn per bolt, kips
	}{
		{"3/4 Group A-N single", "A325", 0.75, rules.ThreadsIncluded, 1, 17.9},
		{"3/4 Group A-N double", "A325", 0.75, rules.ThreadsIncluded, 2, 35.8},
		{"7/8 Group A-N single", "A325", 0.875, rules.ThreadsIncluded, 1, 24.3},
		{"1 Group A-X single", "A325", 1, rules.ThreadsExcluded, 1, 40.1},
		{"7/8 Group B-X single", "A490", 0.875, rules.ThreadsExcluded, 1, 37.9},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			g, err := e.Bolt(c.grade)
			if err != nil {
				t.Fatal(err)
			}
			conn := designExampleD2(t, rules.LRFD)
			conn.Bolt.D, conn.Bolt.Grade, conn.Bolt.Threads = in(c.d), g, c.threads
			conn.Holes = conn.Holes[:1]
			if c.planes == 2 {
				conn.Member.Shape, conn.Member.Pieces = DoubleAngle, 2
			}
			near(t, "φrn", BoltShear(conn).Available.Kip(), c.want, pubTol, "AISC Manual Table 7-1 (from memory)")
		})
	}
}

func TestManualTables74And75Bearing(t *testing.T) {
	// Per inch of thickness, Fu = 58 ksi, 3/4-in bolts in standard holes,
	// deformation considered.
	e := edition(t, "aisc360-16", units.US)
	cb, ct := e.BearingCoefficients(rules.Standard, rules.Transverse, true)
	hole := 13.0 / 16
	cases := []struct {
		name string
		lc   float64
		want float64
		src  string
	}{
		{"spacing 3 in", 3 - hole, 78.3, "AISC Manual Table 7-4 (from memory)"},
		{"edge 1-1/4 in", 1.25 - hole/2, 44.0, "AISC Manual Table 7-5 (from memory)"},
		{"edge 2 in", 2 - hole/2, 78.3, "AISC Manual Table 7-5 (from memory): bearing governs"},
	}
	for _, c := range cases {
		b, tr := BearingRn(cb, ct, in(0.75), in(c.lc), in(1), ksi(58))
		near(t, c.name, 0.75*min(b, tr).Kip(), c.want, pubTol, c.src)
	}
}
