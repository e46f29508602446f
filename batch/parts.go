package batch

import (
	"math"
	"strconv"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/bom"
	"gaugeline/detail/sheet"
	"gaugeline/fileset"
	"gaugeline/rules/units"
)

// PartsExt ends a set's parts list: MARK.parts.csv.
const PartsExt = ".parts.csv"

// Part is one line of a parts list: a piece of the bill of material
// (detail's Pieces, read as it is, never recomputed), the holes of the
// part the sheet cuts it from and the files that cut it.
type Part struct {
	Mark  string // the job's mark: its set
	Piece bom.Piece
	Units units.System
	Holes int      // holes and slots in one piece
	Files []string // the set's files of the part: MARK-member.cam.dxf …
}

// PartsHeader is the parts list's header. Lengths are in the job's units
// (length_unit), weights in weight_unit; quantity is for the job's
// quantity, each per assembly.
var PartsHeader = []string{"mark", "piece", "kind", "quantity", "each", "profile", "grade", "thickness", "cut_length",
	"width", "length_unit", "weight_each", "weight_total", "weight_unit", "holes", "files", "note"}

// PartsOf is the parts list of a passing job's sheet and files: one part
// per piece of the bill of material (nil without member.length). A
// piece's holes are those of the sheet's part of the same name, its files
// the set's files named MARK-PART.*.
func PartsOf(r *detail.Report, s *sheet.Sheet, files []fileset.File) []Part {
	ps := r.Pieces()
	if ps == nil {
		return nil
	}
	mark := r.Design.Job.Mark
	out := make([]Part, 0, len(ps))
	for _, p := range ps {
		pt := Part{Mark: mark, Piece: p, Units: r.Design.Job.Units}
		for i := range s.Views {
			if v := &s.Views[i]; v.Part.Name == p.Part {
				pt.Holes = len(v.Part.Holes)
			}
		}
		for _, f := range files {
			if strings.HasPrefix(f.Name, mark+"-"+p.Part+".") {
				pt.Files = append(pt.Files, f.Name)
			}
		}
		out = append(out, pt)
	}
	return out
}

// fields is the part's line of the CSV.
func (p Part) fields() []string {
	length := func(l units.Length) string {
		if l == 0 {
			return ""
		}
		// to 1e-4 in (1e-4 mm): the unit conversion's last bits are noise
		return strconv.FormatFloat(math.Round(p.Units.ToJob(float64(l), units.DimLength)*1e4)/1e4, 'f', -1, 64)
	}
	lu := "in"
	if p.Units == units.SI {
		lu = "mm"
	}
	pc := p.Piece
	return []string{p.Mark, pc.Mark, pc.Kind, strconv.Itoa(pc.Quantity), strconv.Itoa(pc.Each), pc.Size, pc.Grade,
		length(pc.T), length(pc.Length), length(pc.Width), lu, bom.WeightText(pc.Weight), bom.WeightText(pc.TotalWeight()),
		bom.WeightUnit(p.Units), strconv.Itoa(p.Holes), strings.Join(p.Files, " "), pc.Note}
}

// PartsCSV is a parts list: the header, then one line per part.
func PartsCSV(parts []Part) ([]byte, error) {
	lines := make([][]string, len(parts))
	for i, p := range parts {
		lines[i] = p.fields()
	}
	return csvOf(PartsHeader, lines)
}

// AllParts is the batch's parts list: every set's parts, in the rows'
// order; nil when no set has any.
func AllParts(rows []Row) []Part {
	var out []Part
	for _, r := range rows {
		out = append(out, r.Parts...)
	}
	return out
}
