package bom

import (
	"fmt"
	"strings"

	"gaugeline/detail/texttab"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// JSONBOM is the bill of material in the JSON (bill_of_material).
type JSONBOM struct {
	WeightUnit  string      `json:"weight_unit"`
	Density     float64     `json:"density"` // lb/ft³ (us), kg/m³ (si)
	Pieces      []jsonPiece `json:"pieces"`
	TotalWeight float64     `json:"total_weight"`
}

type jsonPiece struct {
	Mark        string  `json:"mark"`
	Piece       string  `json:"piece"` // member, plate
	CAMFile     string  `json:"cam_file"`
	Each        int     `json:"each"`
	Quantity    int     `json:"quantity"`
	Size        string  `json:"size"`
	Grade       string  `json:"grade"`
	Length      float64 `json:"length"`
	Width       float64 `json:"width,omitempty"`
	Thickness   float64 `json:"thickness"`
	Area        float64 `json:"area"`
	WeightEach  float64 `json:"weight_each"`
	WeightTotal float64 `json:"weight_total"`
	Note        string  `json:"note,omitempty"`
}

// JSONBoltList is the bolt list in the JSON (bolt_list).
type JSONBoltList struct {
	Sets         []jsonBoltSet `json:"sets"`
	LengthSource string        `json:"length_source"`
	WasherSource string        `json:"washer_source"`
}

type jsonBoltSet struct {
	End        string  `json:"end"`
	Diameter   float64 `json:"diameter"`
	Grade      string  `json:"grade"`
	Each       int     `json:"each"`
	Quantity   int     `json:"quantity"`
	Grip       float64 `json:"grip"`
	Length     float64 `json:"length,omitempty"`
	Washers    int     `json:"hardened_washers"`
	PlateWash  float64 `json:"plate_washers,omitempty"`
	MemberHole string  `json:"member_hole"`
	PlateHole  string  `json:"plate_hole,omitempty"`
	Joint      string  `json:"joint"`
	WasherNote string  `json:"washer_note"`
	Faying     string  `json:"faying_surfaces"`
}

// JSON is the two lists as the JSON carries them, in the member's units.
func JSON(mb Member) (JSONBOM, JSONBoltList) {
	ps := Pieces(mb)
	sys := mb.Units
	length := func(l units.Length) float64 { return sys.ToJob(float64(l), units.DimLength) }
	density := rules.DensityUS
	if sys == units.SI {
		density = rules.DensitySI
	}
	bm := JSONBOM{WeightUnit: WeightUnit(sys), Density: density, Pieces: []jsonPiece{}, TotalWeight: TotalWeight(ps)}
	bl := JSONBoltList{Sets: []jsonBoltSet{}, LengthSource: BoltLengthSource, WasherSource: WasherSource}
	for _, p := range ps {
		bm.Pieces = append(bm.Pieces, jsonPiece{Mark: p.Mark, Piece: p.Kind,
			CAMFile: p.CAMFile(mb.Mark), Each: p.Each, Quantity: p.Quantity, Size: p.Size, Grade: p.Grade,
			Length: length(p.Length), Width: length(p.Width), Thickness: length(p.T),
			Area: sys.ToJob(float64(p.Area), units.DimArea), WeightEach: p.Weight,
			WeightTotal: p.TotalWeight(), Note: p.Note})
	}
	for _, b := range BoltList(mb) {
		bl.Sets = append(bl.Sets, jsonBoltSet{End: b.End, Diameter: length(b.D), Grade: b.Grade,
			Each: b.Each, Quantity: b.Quantity, Grip: length(b.Grip), Length: length(b.Length), Washers: b.Washers,
			PlateWash: length(b.PlateWash), MemberHole: b.MemberHole, PlateHole: b.PlateHole, Joint: b.Joint,
			WasherNote: b.WasherNote, Faying: b.Faying})
	}
	return bm, bl
}

// WriteText writes the bill of material and the bolt list as a short
// section of the text report (nothing without member.length).
func WriteText(b *strings.Builder, mb Member) {
	ps := Pieces(mb)
	if ps == nil {
		return
	}
	sys := mb.Units
	shop := func(l units.Length) string { return units.FormatLength(l, sys, units.Shop) }
	wu := WeightUnit(sys)
	fmt.Fprintf(b, "\n")
	rows := [][]string{{"BILL OF MATERIAL", "QTY", "SIZE", "GRADE", "CUT LENGTH", "EACH " + wu, "TOTAL " + wu, "NOTE"}}
	for _, p := range ps {
		rows = append(rows, []string{p.Mark, fmt.Sprint(p.Quantity), p.Size, p.Grade, shop(p.Length),
			WeightText(p.Weight), WeightText(p.TotalWeight()), p.Note})
	}
	rows = append(rows, []string{"total", "", "", "", "", "", WeightText(TotalWeight(ps)), ""})
	texttab.Table(b, rows, texttab.Width)
	fmt.Fprintf(b, "\n")
	rows = [][]string{{"BOLT LIST", "QTY", "GRIP", "WHERE", "HOLES", "WASHERS"}}
	bs := BoltList(mb)
	for _, s := range bs {
		rows = append(rows, []string{s.BoltText(sys), fmt.Sprint(s.Quantity), shop(s.Grip), s.End, s.HolesText(), s.WashersText(sys)})
	}
	texttab.Table(b, rows, texttab.Width)
	note := func(s string) {
		for _, line := range texttab.Wrap(s, texttab.Width-4) {
			fmt.Fprintf(b, "  %s\n", line)
		}
	}
	for _, s := range bs {
		note(fmt.Sprintf("%s: washers: %s; faying surfaces: %s", s.End, s.WasherNote, s.Faying))
	}
	note(BoltLengthSource)
}

// WriteMarkdown is WriteText as Markdown sections.
func WriteMarkdown(b *strings.Builder, mb Member) {
	ps := Pieces(mb)
	if ps == nil {
		return
	}
	sys := mb.Units
	shop := func(l units.Length) string { return mdEscape(units.FormatLength(l, sys, units.Shop)) }
	wu := WeightUnit(sys)
	fmt.Fprintf(b, "\n## Bill of material\n\n| mark | qty | size | grade | cut length | each (%s) | total (%s) | note |\n|---|---:|---|---|---:|---:|---:|---|\n", wu, wu)
	for _, p := range ps {
		fmt.Fprintf(b, "| %s | %d | %s | %s | %s | %s | %s | %s |\n", mdEscape(p.Mark), p.Quantity, mdEscape(p.Size),
			mdEscape(p.Grade), shop(p.Length), WeightText(p.Weight), WeightText(p.TotalWeight()), mdEscape(p.Note))
	}
	fmt.Fprintf(b, "| total | | | | | | %s | |\n", WeightText(TotalWeight(ps)))
	fmt.Fprintf(b, "\n## Bolt list\n\n| bolt | qty | grip | where | holes | washers | washer note | faying surfaces |\n|---|---:|---:|---|---|---|---|---|\n")
	for _, s := range BoltList(mb) {
		fmt.Fprintf(b, "| %s | %d | %s | %s | %s | %s | %s | %s |\n", mdEscape(s.BoltText(sys)), s.Quantity, shop(s.Grip), s.End,
			s.HolesText(), mdEscape(s.WashersText(sys)), mdEscape(s.WasherNote), mdEscape(s.Faying))
	}
	fmt.Fprintf(b, "\n%s.\n", BoltLengthSource)
}

// mdEscape escapes a Markdown table cell's pipes.
func mdEscape(s string) string { return strings.ReplaceAll(s, "|", `\|`) }
