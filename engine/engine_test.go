package engine

import (
	"fmt"
	"math"
	"testing"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Published worked examples round to three significant figures, so they
// are compared within 0.5 %.
const pubTol = 0.005

func edition(t testing.TB, name string, sys units.System) *rules.Edition {
	t.Helper()
	e, err := rules.Lookup(name, sys)
	if err != nil {
		t.Fatal(err)
	}
	return e
}

func in(v float64) units.Length  { return units.Length(v) * units.Inch }
func in2(v float64) units.Area   { return units.Area(v) * units.SquareInch }
func ksi(v float64) units.Stress { return units.Stress(v) * units.Ksi }
func kip(v float64) units.Force  { return units.Force(v) * units.Kip }

// line makes n holes of size dx×dy on one gage line y, starting at x0.
func line(first int, n int, x0, pitch, y units.Length, dx, dy units.Length, t rules.HoleType) []Hole {
	hs := make([]Hole, n)
	for i := range hs {
		hs[i] = Hole{ID: fmt.Sprintf("H%d", first+i), X: x0 + units.Length(i)*pitch, Y: y, HoleShape: HoleShape{Type: t, Dx: dx, Dy: dy}}
	}
	return hs
}

// designExampleD2 is the single angle of AISC Design Examples v15.0,
// Example D.2 (from memory): L4x4x1/2 A36, one line of four 3/4-in Group A
// bolts in standard holes at 3 in, x̄ = 1.18 in, Ag = 3.75 in².
func designExampleD2(t testing.TB, m rules.Method) *Connection {
	e := edition(t, "aisc360-16", units.US)
	grade, err := e.Bolt("A325")
	if err != nil {
		t.Fatal(err)
	}
	return &Connection{
		Edition: e,
		Method:  m,
		Member: Member{Shape: Angle, Width: in(4), Outstanding: in(4), T: in(0.5), Ag: in2(3.75),
			Xbar: in(1.18), Pieces: 1, Fy: ksi(36), Fu: ksi(58)},
		Bolt:  Bolt{D: in(0.75), Grade: grade, DeformationConsidered: true},
		Holes: line(1, 4, in(1.5), in(3), in(2.5), in(13.0/16), in(13.0/16), rules.Standard),
	}
}

func near(t *testing.T, what string, got, want, tol float64, src string) {
	t.Helper()
	if math.Abs(got-want) > tol*math.Abs(want) {
		t.Errorf("%s = %.6g, want %.6g ±%.2g%% (%s)", what, got, want, tol*100, src)
	}
}

func value(t *testing.T, r Result, name string) float64 {
	t.Helper()
	for _, v := range r.Values {
		if v.Name == name {
			return v.V
		}
	}
	t.Fatalf("%s has no value %q", r.ID, name)
	return 0
}

func TestDesignExampleD2(t *testing.T) {
	const src = "AISC Design Examples v15.0, Example D.2 (from memory)"
	// The required strength from D = 20 kips, L = 60 kips (Pu = 120 kips,
	// Pa = 80 kips) is checked in package loads.

	lr := designExampleD2(t, rules.LRFD)
	y := MemberYield(lr)
	near(t, "LRFD yield φPn", y.Available.Kip(), 122, pubTol, src)
	r := MemberRupture(lr)
	near(t, "An", value(t, r, "An")/float64(units.SquareInch), 3.31, pubTol, src)
	near(t, "U", value(t, r, "U"), 0.869, pubTol, src)
	near(t, "Ae", value(t, r, "Ae")/float64(units.SquareInch), 2.88, pubTol, src)
	near(t, "LRFD rupture φPn", r.Available.Kip(), 125, pubTol, src)

	asd := designExampleD2(t, rules.ASD)
	near(t, "ASD yield Pn/Ω", MemberYield(asd).Available.Kip(), 80.8, pubTol, src)
	near(t, "ASD rupture Pn/Ω", MemberRupture(asd).Available.Kip(), 83.5, pubTol, src)
}

func TestShearLagCases(t *testing.T) {
	// L4x4x1/2 with x̄ = 1.18 in: U is the larger of case 2 (1 − x̄/l) and
	// case 8 (0.80 with four or more bolts per line, 0.60 with three).
	cases := []struct {
		name  string
		n     int
		pitch float64
		want  float64
		src   string
	}{
		{"3 bolts at 1 in: case 8", 3, 1, 0.60, "AISC 360-22 Table D3.1 case 8 (1 − 1.18/2 = 0.41 < 0.60); common practice, no source"},
		{"3 bolts at 3 in: case 2", 3, 3, 1 - 1.18/6, "AISC 360-22 Table D3.1 case 2, the larger value permitted; common practice, no source"},
		{"4 bolts at 3 in: case 2", 4, 3, 0.869, "AISC Design Examples v15.0, Example D.2 (from memory)"},
		{"4 bolts at 1.5 in: case 8", 4, 1.5, 0.80, "AISC 360-22 Table D3.1 case 8 (1 − 1.18/4.5 = 0.738 < 0.80)"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			conn := designExampleD2(t, rules.LRFD)
			conn.Holes = line(1, c.n, in(1.5), in(c.pitch), in(2.5), in(13.0/16), in(13.0/16), rules.Standard)
			near(t, "U", ShearLagFactor(conn).U, c.want, pubTol, c.src)
		})
	}
}

func TestConnectedElementBound(t *testing.T) {
	// D3: U of an open section need not be less than the connected
	// element's gross area over Ag: a single bolt has no case 2 or case 8
	// value, so U = 4·(1/2)/3.75 = 0.533 (AISC 360-22 D3, hand calculation).
	conn := designExampleD2(t, rules.LRFD)
	conn.Holes = conn.Holes[:1]
	sl := ShearLagFactor(conn)
	near(t, "U", sl.U, 2.0/3.75, 1e-9, "AISC 360-22 D3 lower bound, hand calculation")
}

func TestQuimbyExample41(t *testing.T) {
	// T. B. Quimby, A Beginner's Guide to the Steel Construction Manual,
	// Example 4.1: lap splice, (11) 3/4-in A325-X pretensioned bolts in
	// standard holes, class A, one slip plane. Under 360-16 and 360-22
	// (μ = 0.30, Fnv = 68 ksi): slip Rn ≈ 104.4 kips, shear φRn ≈ 247.8 kips.
	const src = "Quimby, A Beginner's Guide to the SCM, Example 4.1, re-evaluated under 360-16/-22 (REFERENCE)"
	for _, ed := range []string{"aisc360-16", "aisc360-22"} {
		t.Run(ed, func(t *testing.T) {
			e := edition(t, ed, units.US)
			grade, err := e.Bolt("A325")
			if err != nil {
				t.Fatal(err)
			}
			// The plates are inputs only (a flat lap): slip and shear do not
			// depend on them.
			holes := append(line(1, 6, in(1.5), in(3), in(1.5), in(13.0/16), in(13.0/16), rules.Standard),
				line(7, 5, in(1.5), in(3), in(4.5), in(13.0/16), in(13.0/16), rules.Standard)...)
			c := &Connection{
				Edition: e, Method: rules.LRFD,
				Member: Member{Shape: Flat, Width: in(6), T: in(0.75), Ag: in2(4.5), Pieces: 1, Fy: ksi(36), Fu: ksi(58)},
				Bolt: Bolt{D: in(0.75), Grade: grade, Threads: rules.ThreadsExcluded, Joint: rules.SlipCritical,
					Surface: rules.ClassA, DeformationConsidered: true},
				Holes: holes,
			}
			s, err := BoltSlip(c)
			if err != nil {
				t.Fatal(err)
			}
			near(t, "slip Rn", s.Nominal.Kip(), 104.4, pubTol, src)
			near(t, "slip φRn (φ = 1.00, standard holes)", s.Available.Kip(), 104.4, pubTol, src)
			near(t, "shear φRn", BoltShear(c).Available.Kip(), 247.8, pubTol, src)
		})
	}
}

func TestTamboliSplice(t *testing.T) {
	const src = "Tamboli (ed.), Handbook of Structural Steel Connection Design and Details, 2nd ed., ch. 2, flange splice"
	// Outer PL 1/2 A36, 7/8-in bolt, tearout with lc = 1.031 in: φ·1.2·lc·t·Fu = 26.9 kips.
	e := edition(t, "aisc360-16", units.US)
	cb, ct := e.BearingCoefficients(rules.Standard, rules.Transverse, true)
	_, tear := BearingRn(cb, ct, in(7.0/8), in(1.031), in(0.5), ksi(58))
	near(t, "tearout φrn", 0.75*tear.Kip(), 26.9, pubTol, src)

	// Inner PL 3/4 x 4 A36 splice, one 15/16-in hole across the section:
	// An = (4 − 1.0)(0.75) = 2.25 in² ≤ 0.85·Ag = 2.55, φRn = 97.9 kips.
	for _, ed := range []string{"aisc360-16", "aisc360-22"} {
		e := edition(t, ed, units.US)
		grade, _ := e.Bolt("A325")
		c := &Connection{
			Edition: e, Method: rules.LRFD,
			Member: Member{Shape: Flat, Width: in(4), T: in(0.75), Ag: in2(3), Pieces: 1, Fy: ksi(36), Fu: ksi(58)},
			Plate:  &Plate{Kind: Splice, T: in(0.75), Width: in(4), YCentre: in(2), Fy: ksi(36), Fu: ksi(58)},
			Bolt:   Bolt{D: in(7.0 / 8), Grade: grade, DeformationConsidered: true},
			// three rows at 3 in spread the Whitmore width past the 4-in plate
			Holes: line(1, 3, in(1.5), in(3), in(2), in(15.0/16), in(15.0/16), rules.Standard),
		}
		c.Plate.FreeEdge = in(7.5 + 1.5)
		r := PlateRupture(c)
		near(t, ed+" An", value(t, r, "An")/float64(units.SquareInch), 2.25, pubTol, src)
		near(t, ed+" φRn", r.Available.Kip(), 97.9, pubTol, src)
	}
}

func TestSplicePlateCapEdition(t *testing.T) {
	// AISC 360-16 J4.1(b) caps An at 0.85·Ag for bolted splice plates;
	// 360-22 J4.1 has no cap. A 3/4 x 8 plate with one 15/16-in hole:
	// An = (8 − 1)(0.75) = 5.25 in² > 0.85·6 = 5.10 in² (hand calculation).
	for _, c := range []struct {
		ed   string
		want float64
		src  string
	}{
		{"aisc360-16", 5.10, "AISC 360-16 J4.1(b): 0.85·Ag"},
		{"aisc360-22", 5.25, "AISC 360-22 J4.1(b): no cap"},
	} {
		e := edition(t, c.ed, units.US)
		grade, _ := e.Bolt("A325")
		conn := &Connection{
			Edition: e, Method: rules.LRFD,
			Member: Member{Shape: Flat, Width: in(8), T: in(0.75), Ag: in2(6), Pieces: 1, Fy: ksi(36), Fu: ksi(58)},
			Plate:  &Plate{Kind: Splice, T: in(0.75), Width: in(8), YCentre: in(4), FreeEdge: in(30), Fy: ksi(36), Fu: ksi(58)},
			Bolt:   Bolt{D: in(7.0 / 8), Grade: grade, DeformationConsidered: true},
			Holes:  line(1, 8, in(1.5), in(3), in(4), in(15.0/16), in(15.0/16), rules.Standard),
		}
		near(t, c.ed+" An", value(t, PlateRupture(conn), "An")/float64(units.SquareInch), c.want, 1e-9, c.src)
	}
}

func TestPlateNetSectionStaggered(t *testing.T) {
	// The plate of Segui's Example 3.6 (from memory; see the test above)
	// used as a 16 x 3/4 in splice plate under AISC 360-22 (no 0.85·Ag cap):
	// two rows of each line, 6 in apart, the middle line staggered 3 in,
	// holes 1-1/16 in (1-1/8 in with the B4.3 allowance, as Segui takes
	// them). The Whitmore spread, 10 + 2·6·tan 30° = 16.93 in, is clipped to
	// the 16-in plate, and the plate's net section must be found by the same
	// worst-path search as the member's: path a-b-c-d-e, wn = 13.52 in, An =
	// 10.14 in². The section through the first row alone would give
	// wn = 16 − 2(1.125) = 13.75 in.
	const src = "Segui, Steel Design, Example 3.6 (from memory)"
	e := edition(t, "aisc360-22", units.US)
	grade, _ := e.Bolt("A325")
	h := in(1.0625)
	holes := append(line(1, 2, in(1.5), in(6), in(3), h, h, rules.Standard),
		line(3, 2, in(4.5), in(6), in(8), h, h, rules.Standard)...)
	holes = append(holes, line(5, 2, in(1.5), in(6), in(13), h, h, rules.Standard)...)
	c := &Connection{
		Edition: e, Method: rules.LRFD,
		Member: Member{Shape: Flat, Width: in(16), T: in(0.75), Ag: in2(12), Pieces: 1, Fy: ksi(36), Fu: ksi(58)},
		Plate:  &Plate{Kind: Splice, T: in(0.75), Width: in(16), YCentre: in(8), FreeEdge: in(12), Fy: ksi(36), Fu: ksi(58)},
		Bolt:   Bolt{D: in(1), Grade: grade, DeformationConsidered: true},
		Holes:  holes,
	}
	r := PlateRupture(c)
	near(t, "Lw", value(t, r, "Lw")/float64(units.Inch), 16, 1e-12, src)
	near(t, "plate An", value(t, r, "An")/float64(units.SquareInch), 10.14, pubTol, src)
	// one search serves both parts: the member's An over the same holes
	An, _ := NetArea(c)
	near(t, "member An", An.In2(), value(t, r, "An")/float64(units.SquareInch), 1e-12, src)
}
