// Package loads combines a member's service loads by load type into its
// required strength with the basic load combinations of ASCE/SEI 7: the
// demand that the limit states of package engine are checked against.
// Forces are in the internal units of package units (N), tension positive.
package loads

import (
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// ServiceLoads are nominal (service-level) axial tensions by load type,
// combined by Combine with the basic combinations of ASCE 7.
type ServiceLoads struct {
	D, L, Lr, S, R, W, E units.Force
}

// Load types, the indexes of a combination's terms.
const (
	loadD = iota
	loadL
	loadLr
	loadS
	loadR
	loadW
	loadE
	nLoads
)

// loadNames are the load types' symbols, for a combination's name.
var loadNames = [nLoads]string{"D", "L", "Lr", "S", "R", "W", "E"}

// term is one load type times its factor.
type term struct {
	load int
	f    float64
}

// combination is one basic load combination: its name as ASCE 7 prints
// it and its slots, the first the dead load's (always present), each of
// the others a variable load or a choice among some ("Lr or S or R"), of
// which one acts, or none: ASCE 7-16 2.3.1 and 2.4.1 ask for the effects
// of one or more loads not acting to be investigated.
type combination struct {
	name  string
	slots [][]term
}

func t1(load int, f float64) []term { return []term{{load, f}} }

// roofOf is a choice of roof live, snow or rain load at factor f.
func roofOf(f float64) []term { return []term{{loadLr, f}, {loadS, f}, {loadR, f}} }

// lrfdCombinations are ASCE/SEI 7-16 2.3.1 (and 2.3.6 for seismic).
var lrfdCombinations = []combination{
	{"1.4D", [][]term{t1(loadD, 1.4)}},
	{"1.2D + 1.6L + 0.5(Lr or S or R)", [][]term{t1(loadD, 1.2), t1(loadL, 1.6), roofOf(0.5)}},
	{"1.2D + 1.6(Lr or S or R) + (L or 0.5W)", [][]term{t1(loadD, 1.2), roofOf(1.6), {{loadL, 1}, {loadW, 0.5}}}},
	{"1.2D + 1.0W + L + 0.5(Lr or S or R)", [][]term{t1(loadD, 1.2), t1(loadW, 1), t1(loadL, 1), roofOf(0.5)}},
	{"1.2D + 1.0E + L + 0.2S", [][]term{t1(loadD, 1.2), t1(loadE, 1), t1(loadL, 1), t1(loadS, 0.2)}},
	{"0.9D + 1.0W", [][]term{t1(loadD, 0.9), t1(loadW, 1)}},
	{"0.9D + 1.0E", [][]term{t1(loadD, 0.9), t1(loadE, 1)}},
}

// asdCombinations are ASCE/SEI 7-16 2.4.1.
var asdCombinations = []combination{
	{"D", [][]term{t1(loadD, 1)}},
	{"D + L", [][]term{t1(loadD, 1), t1(loadL, 1)}},
	{"D + (Lr or S or R)", [][]term{t1(loadD, 1), roofOf(1)}},
	{"D + 0.75L + 0.75(Lr or S or R)", [][]term{t1(loadD, 1), t1(loadL, 0.75), roofOf(0.75)}},
	{"D + (0.6W or 0.7E)", [][]term{t1(loadD, 1), {{loadW, 0.6}, {loadE, 0.7}}}},
	{"D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)", [][]term{t1(loadD, 1), t1(loadL, 0.75), t1(loadW, 0.75*0.6), roofOf(0.75)}},
	{"D + 0.75L + 0.75(0.7E) + 0.75S", [][]term{t1(loadD, 1), t1(loadL, 0.75), t1(loadE, 0.75*0.7), t1(loadS, 0.75)}},
	{"0.6D + 0.6W", [][]term{t1(loadD, 0.6), t1(loadW, 0.6)}},
	{"0.6D + 0.7E", [][]term{t1(loadD, 0.6), t1(loadE, 0.7)}},
}

// values are the service loads by load type.
func (l ServiceLoads) values() [nLoads]units.Force {
	return [nLoads]units.Force{l.D, l.L, l.Lr, l.S, l.R, l.W, l.E}
}

// effect is the combination's largest effect in the direction sign (+1
// tension, −1 compression): the dead load as it is, each variable slot
// at its most unfavourable choice or left out, a reversible load (wind,
// seismic, where reverses says so) taken in either direction. reversed
// reports whether a reversible load acts against its given sign.
func (c combination) effect(v [nLoads]units.Force, sign float64, reverses [nLoads]bool) (e units.Force, reversed []string) {
	for i, slot := range c.slots {
		if i == 0 { // the dead load acts always
			e += units.Force(sign*slot[0].f) * v[slot[0].load]
			continue
		}
		var best units.Force
		var rev string
		for _, t := range slot {
			x, r := units.Force(sign*t.f)*v[t.load], ""
			if reverses[t.load] && x < 0 {
				x, r = -x, loadNames[t.load]
			}
			if x > best {
				best, rev = x, r
			}
		}
		if best > 0 && rev != "" {
			reversed = append(reversed, rev)
		}
		e += best
	}
	return e, reversed
}

// Combine returns the governing required strength of the basic load
// combinations of ASCE/SEI 7 (2.3.1 strength design for LRFD, 2.4.1
// allowable stress design for ASD) and the combination that governs. All
// loads are tensions of the member; the first combination reaching the
// largest value is named.
func Combine(m rules.Method, l ServiceLoads) (units.Force, string) {
	t, _ := Demands(m, l, Reverses{})
	return t.Force, t.Name
}

// Reverses says which loads act in either direction (wind and seismic
// forces on a brace change sign with the direction of the wind or the
// ground motion).
type Reverses struct{ W, E bool }

// Demand is the governing required strength of one sign and the
// combination that gives it ("" and zero when no combination does).
type Demand struct {
	Force units.Force
	Name  string
}

// Demands returns the governing required tension and compression of the
// basic load combinations of ASCE/SEI 7 (2.3.1 for LRFD, 2.4.1 for ASD)
// for service loads of either sign (tension positive) and the loads that
// reverse: each combination with every variable load at its most
// unfavourable choice, acting or not. The first combination reaching the
// largest value is named, with the reversed loads it takes ("W reversed").
func Demands(m rules.Method, l ServiceLoads, r Reverses) (tension, compression Demand) {
	combos, rev := setup(m, r)
	v := l.values()
	prefix := "ASCE 7 " + m.String() + ": "
	pick := func(sign float64) Demand {
		d := Demand{}
		for _, c := range combos {
			e, reversed := c.effect(v, sign, rev)
			if e > d.Force {
				d.Force, d.Name = e, prefix+c.name
				for _, x := range reversed {
					d.Name += ", " + x + " reversed"
				}
			}
		}
		return d
	}
	tension, compression = pick(1), pick(-1)
	if tension.Name == "" {
		tension.Name = prefix + combos[0].name
	}
	return tension, compression
}

// Row is one basic combination's effect on the member: its name, the
// largest tension and the largest compression it gives (zero: none) and
// the reversible loads it takes reversed for the compression.
type Row struct {
	Name                 string
	Tension, Compression units.Force
	Reversed             []string
}

// Table is every basic combination of ASCE/SEI 7 the method takes (2.3.1
// for LRFD, 2.4.1 for ASD) worked for the service loads, in the
// standard's order: what Demands picks the governing ones from.
func Table(m rules.Method, l ServiceLoads, r Reverses) []Row {
	combos, rev := setup(m, r)
	v := l.values()
	rows := make([]Row, len(combos))
	for i, c := range combos {
		t, _ := c.effect(v, 1, rev)
		cp, reversed := c.effect(v, -1, rev)
		rows[i] = Row{Name: c.name, Tension: max(t, 0), Compression: max(cp, 0), Reversed: reversed}
	}
	return rows
}

// setup is the method's combinations and which load types reverse.
func setup(m rules.Method, r Reverses) ([]combination, [nLoads]bool) {
	combos := lrfdCombinations
	if m == rules.ASD {
		combos = asdCombinations
	}
	var rev [nLoads]bool
	rev[loadW], rev[loadE] = r.W, r.E
	return combos, rev
}
