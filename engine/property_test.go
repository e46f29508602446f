package engine

import (
	"fmt"
	"math"
	"testing"

	"pgregory.net/rapid"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// genConnection draws a connection whose pattern stays inside the member and
// shorter than the long-joint limit, so that every strength is a
// monotone function of end distance and pitch.
type genParams struct {
	shape                      Shape
	lines, perLine             int
	pitch, end, gage, g2, stag float64 // inches
	d                          float64
	t, tp                      float64
	edition                    string
	method                     rules.Method
	hole                       rules.HoleType
	slot                       rules.SlotDir
	slip                       bool
	ecc                        bool // flats: eccentricity provided for (member.combined)
}

func drawParams(t *rapid.T) genParams {
	p := genParams{
		shape:   Shape(rapid.IntRange(0, 2).Draw(t, "shape")),
		lines:   rapid.IntRange(1, 3).Draw(t, "lines"),
		perLine: rapid.IntRange(1, 6).Draw(t, "perLine"),
		d:       rapid.SampledFrom([]float64{0.5, 0.625, 0.75, 0.875, 1}).Draw(t, "d"),
		t:       rapid.SampledFrom([]float64{0.25, 0.375, 0.5, 0.625}).Draw(t, "t"),
		tp:      rapid.SampledFrom([]float64{0.375, 0.5, 0.75}).Draw(t, "tp"),
		edition: rapid.SampledFrom(rules.Names()).Draw(t, "edition"),
		method:  rules.Method(rapid.IntRange(0, 1).Draw(t, "method")),
		hole:    rules.HoleType(rapid.IntRange(0, 3).Draw(t, "hole")),
		slot:    rules.SlotDir(rapid.IntRange(0, 1).Draw(t, "slot")),
		slip:    rapid.Bool().Draw(t, "slip"),
		ecc:     rapid.Bool().Draw(t, "ecc"),
	}
	p.pitch = float64(rapid.IntRange(8, 20).Draw(t, "pitch8")) / 4 // 2 … 5 in: 5 pitches + stagger + growth stay under 38 in
	p.end = float64(rapid.IntRange(4, 12).Draw(t, "end8")) / 4     // 1 … 3 in
	p.gage = float64(rapid.IntRange(5, 12).Draw(t, "gage8")) / 4   // 1.25 … 3 in
	p.g2 = float64(rapid.IntRange(8, 14).Draw(t, "g2")) / 4        // 2 … 3.5 in
	if rapid.Bool().Draw(t, "staggered") {
		p.stag = p.pitch / 2
	}
	return p
}

func (p genParams) build(tb testing.TB) *Connection {
	e := edition(tb, p.edition, units.US)
	grade, err := e.Bolt("A325")
	if err != nil {
		tb.Fatal(err)
	}
	hs, err := e.Hole(in(p.d), p.hole)
	if err != nil {
		tb.Fatal(err)
	}
	dx, dy := hs.Width, hs.Width
	if p.hole.IsSlot() {
		if p.slot == rules.Transverse {
			dy = hs.Length
		} else {
			dx = hs.Length
		}
	}
	var holes []Hole
	for i := 0; i < p.lines; i++ {
		x0 := in(p.end)
		if i%2 == 1 {
			x0 += in(p.stag)
		}
		holes = append(holes, line(len(holes)+1, p.perLine, x0, in(p.pitch), in(p.gage+float64(i)*p.g2), dx, dy, p.hole)...)
	}
	for i := range holes {
		holes[i].Slot = p.slot
	}
	width := in(p.gage+float64(p.lines-1)*p.g2) + dy/2 + in(2)
	m := Member{Shape: p.shape, Width: width, T: in(p.t), Pieces: 1, Fy: ksi(36), Fu: ksi(58)}
	switch p.shape {
	case Flat:
		m.Ag = width.Mul(m.T)
		if p.ecc {
			m.Eccentricity = EccentricityProvided
		}
	default:
		m.Outstanding = in(4)
		m.Ag = (width + in(4) - m.T).Mul(m.T)
		m.Xbar = in(1.2)
		if p.shape == DoubleAngle {
			m.Pieces, m.Ag = 2, 2*m.Ag
		}
	}
	var maxX, sumY units.Length
	for _, h := range holes {
		maxX = max(maxX, h.X)
		sumY += h.Y
	}
	joint := rules.Bearing
	if p.slip {
		joint = rules.SlipCritical
	}
	return &Connection{
		Edition: e, Method: p.method, Member: m,
		Plate: &Plate{T: in(p.tp), Width: width + in(4), YCentre: sumY / units.Length(len(holes)),
			FreeEdge: maxX + in(1.5), Fy: ksi(50), Fu: ksi(65)},
		Bolt:   Bolt{D: in(p.d), Grade: grade, Joint: joint, DeformationConsidered: true},
		Holes:  holes,
		Demand: kip(50),
	}
}

func TestPropertyNetAreaAndU(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		c := drawParams(rt).build(t)
		An, _ := NetArea(c)
		if An > c.Member.Ag {
			rt.Fatalf("An %v > Ag %v", An, c.Member.Ag)
		}
		if u := ShearLagFactor(c).U; !(u > 0 && u <= 1) {
			rt.Fatalf("U = %v outside (0, 1]", u)
		}
	})
}

// TestPropertyWorstPathNotExceeded checks the path search against paths
// enumerated by hand: every straight path across one row, and every chain
// through one hole per gage line picked at random, removes no more than the
// worst path the search found.
func TestPropertyWorstPathNotExceeded(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		c := drawParams(rt).build(t)
		ph := pathHoles(c)
		worst, _ := NetWidthDeduction(ph)
		lines := GageLines(c)
		// one hole from each of a run of consecutive lines
		from := rapid.IntRange(0, len(lines)-1).Draw(rt, "from")
		to := rapid.IntRange(from, len(lines)-1).Draw(rt, "to")
		var chain units.Length
		var last *PathHole
		for i := from; i <= to; i++ {
			k := lines[i][rapid.IntRange(0, len(lines[i])-1).Draw(rt, fmt.Sprintf("re%d", i))]
			h := ph[k]
			chain += h.Dh
			if last != nil {
				s, g := float64(h.X-last.X), float64(h.U-last.U)
				chain -= units.Length(s * s / (4 * g))
			}
			last = &ph[k]
		}
		if chain > worst+1e-9 {
			rt.Fatalf("a hand-built chain removes %v mm, more than the worst path %v mm", chain, worst)
		}
		// any single hole is a straight path
		for _, h := range ph {
			if h.Dh > worst+1e-9 {
				rt.Fatalf("one hole removes %v > worst %v", h.Dh, worst)
			}
		}
	})
}

// TestPropertyMonotone: more end distance or more pitch never lowers any
// strength (within the long-joint limit).
func TestPropertyMonotone(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		p := drawParams(rt)
		grow := rapid.SampledFrom([]string{"end", "pitch"}).Draw(rt, "grow")
		q := p
		step := float64(rapid.IntRange(1, 8).Draw(rt, "step")) / 8
		if grow == "end" {
			q.end += step
		} else {
			q.pitch += step
			if q.stag > 0 {
				q.stag = q.pitch / 2
			}
		}
		a, err := Check(p.build(t))
		if err != nil {
			rt.Fatal(err)
		}
		b, err := Check(q.build(t))
		if err != nil {
			rt.Fatal(err)
		}
		for i := range a {
			if b[i].Nominal < a[i].Nominal*(1-1e-12)-1e-6 { // 1 µN absorbs rounding where holes touch
				rt.Fatalf("%s: more %s lowered Rn from %v to %v", a[i].ID, grow, a[i].Nominal, b[i].Nominal)
			}
			if math.IsNaN(float64(a[i].Nominal)) || a[i].Nominal < 0 {
				rt.Fatalf("%s: Rn = %v", a[i].ID, a[i].Nominal)
			}
		}
	})
}
