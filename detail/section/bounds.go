package section

import (
	"math"

	"gaugeline/rules/units"
)

// Bounds are the ranges the properties of one angle can take whatever its
// root fillet and toe radii: every angle of legs A, B and thickness T that
// Properties accepts has its Area, Xbar and Rmin inside them. A value
// outside them belongs to no angle of that size, so a job's override that
// lies outside is a typo or the wrong unit.
//
//   - Area: the two rectangles, (A + B − t)·t, less two toe pieces of the
//     largest toe radius, t (each (1 − π/4)·t²), up to plus the largest
//     root fillet that fits, of radius min(A, B) − t.
//   - Xbar: above t/2, the centroid of leg A alone, and below B/2, the
//     middle of leg B: every other part of the section lies beyond leg A's
//     centre line, and the section leans toward the heel.
//   - Rmin: at least t/√12, the least radius of gyration of a leg alone
//     (I of the whole is at least the sum of its legs' own, each at least
//     its area times t²/12), and at most min(A, B)/2, since every point of
//     the section lies within each leg's length across the other axis.
//
// Each range is widened by Slack for the rounding of published values.
type Bounds struct {
	AreaMin, AreaMax units.Area
	XbarMin, XbarMax units.Length
	RminMin, RminMax units.Length
}

// Slack widens Bounds each way: published tables give properties to three
// significant figures (0.5 %), doubled.
const Slack = 0.01

// Bounds returns the ranges of the properties of any angle of a's legs and
// thickness; see Bounds. It panics on an angle Properties would refuse.
func (a Angle) Bounds() Bounds {
	if err := a.check(); err != nil {
		panic("section: " + err.Error())
	}
	A, B, t := float64(a.A), float64(a.B), float64(a.T)
	c := 1 - math.Pi/4
	plain := (A + B - t) * t
	fillet := min(A, B) - t
	lo, hi := 1-Slack, 1+Slack
	return Bounds{
		AreaMin: units.Area(lo * (plain - 2*c*t*t)),
		AreaMax: units.Area(hi * (plain + c*fillet*fillet)),
		XbarMin: units.Length(lo * t / 2),
		XbarMax: units.Length(hi * B / 2),
		RminMin: units.Length(lo * t / math.Sqrt(12)),
		RminMax: units.Length(hi * min(A, B) / 2),
	}
}
