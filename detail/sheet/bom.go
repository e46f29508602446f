package sheet

import (
	"fmt"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail"
	"gaugeline/detail/bom"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// The bill of material and the bolt list on the sheet (member.length
// given): two tables below the hole schedule, as texts on the notes layer,
// their rows from detail's Pieces and BoltList.

// billOfMaterial writes the BILL OF MATERIAL and BOLT LIST tables from the
// given top down (nothing without member.length) and returns the y below
// them.
func (l sheetLayout) billOfMaterial(s *Sheet, r *detail.Report, top float64) float64 {
	ps := r.Pieces()
	if ps == nil {
		return top
	}
	sys := l.sys
	wu := bom.WeightUnit(sys)
	shop := func(v units.Length) string { return units.FormatLength(v, sys, units.Shop) }
	rows := [][]string{{"MARK", "QTY", "EACH", "SIZE", "GRADE", "CUT LENGTH", "WEIGHT EACH " + strings.ToUpper(wu),
		"WEIGHT " + strings.ToUpper(wu), "CAM FILE", "NOTE"}}
	for _, p := range ps {
		s.label(p, shop(p.T)+map[units.System]string{units.SI: " mm"}[sys])
		rows = append(rows, []string{p.Mark, fmt.Sprint(p.Quantity), fmt.Sprint(p.Each), p.Size, p.Grade, shop(p.Length),
			bom.WeightText(p.Weight), bom.WeightText(p.TotalWeight()), p.CAMFile(s.Mark), strings.ToUpper(p.Note)})
	}
	rows = append(rows, []string{"TOTAL", "", "", "", "", "", "", bom.WeightText(bom.TotalWeight(ps)), "", ""})
	s.BillOfMaterial = rows
	density := fmt.Sprintf("WEIGHTS FROM AREA x LENGTH x %g LB/FT3 (PLATES: OUTLINE AREA x THICKNESS); QTY FOR %d OFF, EACH PER MEMBER",
		density(sys), max(r.Design.Job.Quantity, 1))
	if sys == units.SI {
		density = strings.Replace(density, "LB/FT3", "KG/M3", 1)
	}
	y := l.table(s, "BILL OF MATERIAL", rows, top-2*l.h, []string{density})

	bs := r.BoltList()
	if bs == nil {
		return y
	}
	brows := [][]string{{"QTY", "EACH", "BOLT", "GRIP", "WHERE", "HOLES", "WASHERS PER BOLT", "JOINT"}}
	var notes []string
	for _, b := range bs {
		brows = append(brows, []string{fmt.Sprint(b.Quantity), fmt.Sprint(b.Each), b.BoltText(sys), shop(b.Grip),
			strings.ToUpper(b.End), strings.ToUpper(b.HolesText()), strings.ToUpper(b.WashersText(sys)), strings.ToUpper(b.Joint)})
		notes = appendNew(notes, "WASHERS, "+strings.ToUpper(b.End)+": "+strings.ToUpper(b.WasherNote))
		notes = appendNew(notes, "FAYING SURFACES, "+strings.ToUpper(b.End)+": "+strings.ToUpper(b.Faying))
	}
	s.BoltList = brows
	notes = append(notes, strings.ToUpper(bom.BoltLengthSource), strings.ToUpper(bom.WasherSource))
	var wrapped []string
	for _, n := range notes {
		wrapped = append(wrapped, wrap(n, 140)...)
	}
	return l.table(s, "BOLT LIST", brows, y-2*l.h, wrapped)
}

// label names piece p on the part its CAM file draws: mark, quantity
// (for the job's quantity), grade and thickness, in plain ASCII.
func (s *Sheet) label(p bom.Piece, thickness string) {
	for i := range s.Views {
		if part := &s.Views[i].Part; part.Name == p.Part {
			part.Label = ascii(fmt.Sprintf("%s QTY %d %s T %s", p.Mark, p.Quantity, p.Grade, thickness))
		}
	}
}

// density is the steel density of the weights, in the job's units
// (rules.DensityUS, rules.DensitySI).
func density(sys units.System) float64 {
	if sys == units.SI {
		return rules.DensitySI
	}
	return rules.DensityUS
}

// appendNew appends s unless it is there already.
func appendNew(list []string, s string) []string {
	for _, x := range list {
		if x == s {
			return list
		}
	}
	return append(list, s)
}

// table writes a titled table from top down (the hole schedule, the bill
// of material, the bolt list), each column as wide as its widest entry
// plus two text heights, then its notes in smaller text, and returns the
// y below it. Empty cells are left out.
func (l sheetLayout) table(s *Sheet, title string, rows [][]string, top float64, notes []string) float64 {
	h := l.h
	cols := make([]float64, len(rows[0]))
	for i := 1; i < len(cols); i++ {
		w := 0.0
		for _, r := range rows {
			lo, hi := Text{Height: h, Value: r[i-1]}.Box()
			w = max(w, hi.X-lo.X)
		}
		cols[i] = cols[i-1] + w + 2*h
	}
	y := top - 1.4*h
	s.Texts = append(s.Texts, Text{At: r2.Vec{X: 0, Y: y}, Height: 1.4 * h, Align: AlignLeftBase, Value: title, Layer: LayerNotes})
	y -= 0.4 * h
	for _, r := range rows {
		y -= 1.6 * h
		for i, val := range r {
			if val == "" {
				continue
			}
			s.Texts = append(s.Texts, Text{At: r2.Vec{X: cols[i], Y: y}, Height: h, Align: AlignLeftBase, Value: val, Layer: LayerNotes})
		}
	}
	for _, n := range notes {
		y -= 1.3 * h
		s.Texts = append(s.Texts, Text{At: r2.Vec{X: 0, Y: y}, Height: 0.8 * h, Align: AlignLeftBase, Value: n, Layer: LayerNotes})
	}
	return y - h
}
