package detail

import (
	"strings"

	"gaugeline/detail/bom"
	"gaugeline/detail/jobfile"
)

// The bill of material and the bolt list of a member (package bom): the
// report hands bom its ends; the JSON, the text and the Markdown report
// carry them only with member.length.

// BOM is the member as package bom derives its lists from: the near end,
// and the far end's own connection (CheckJob's Far) or a mirror of the
// near one.
func (r *Report) BOM() bom.Member {
	d := r.Design
	j := d.Job
	m := bom.Member{Mark: j.Mark, Units: j.Units, Quantity: j.Quantity, Length: d.MemberLength(),
		Designation: d.Info.Designation, Grade: d.Info.Grade, Mirror: j.Member.FarEnd.Kind == jobfile.FarMirror,
		Near: bom.End{Conn: &d.Conn, PlateGrade: d.Info.PlateGrade}}
	if r.Far != nil {
		m.Far = &bom.End{Conn: &r.Far.Design.Conn, PlateGrade: r.Far.Design.Info.PlateGrade}
	}
	return m
}

// Pieces is the bill of material (bom.Pieces); nil without member.length.
func (r *Report) Pieces() []bom.Piece { return bom.Pieces(r.BOM()) }

// BoltList is the bolt list (bom.BoltList); nil without member.length.
func (r *Report) BoltList() []bom.BoltSet { return bom.BoltList(r.BOM()) }

// bomDocument is the check's JSON with the bill of material and the bolt
// list after it (member.length given).
type bomDocument struct {
	Document
	BillOfMaterial bom.JSONBOM      `json:"bill_of_material"`
	BoltList       bom.JSONBoltList `json:"bolt_list"`
}

// withBOM returns the document to encode: the document itself without
// member.length (the old JSON, byte for byte), else with the bill of
// material and the bolt list.
func (r *Report) withBOM(doc Document) any {
	m := r.BOM()
	if m.Length == 0 {
		return doc
	}
	out := bomDocument{Document: doc}
	out.BillOfMaterial, out.BoltList = bom.JSON(m)
	return out
}

func (r *Report) bomText(b *strings.Builder)     { bom.WriteText(b, r.BOM()) }
func (r *Report) bomMarkdown(b *strings.Builder) { bom.WriteMarkdown(b, r.BOM()) }
