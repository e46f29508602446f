package ncout

import (
	"fmt"
	"math"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/section"
	"gaugeline/detail/sheet"
	"gaugeline/engine"
	"gaugeline/fileset"
	"gaugeline/rules/units"
)

// File is one file written (a file of a set, see package fileset).
type File = fileset.File

// Ext ends every NC1 file's name: MARK-member.nc1.
const Ext = ".nc1"

// density is the steel's, kg/m³ (common practice, no source: 7850 kg/m³
// is the density every steel weight table is computed with).
const density = 7850

// plateWeight is the weight field of a piece of profile code B (a plate
// or a flat bar) of thickness t mm: kg per square metre, as the NC1 files
// other programs export write it (doc.go).
func plateWeight(t float64) float64 { return t * 1e-3 * density }

// Files writes the NC1 file of each piece of the sheet: the member
// (MARK-member.nc1, and MARK-member-opp.nc1 for a pair's opposite hand
// where it differs), then each plate (MARK-plate.nc1, MARK-far-plate.nc1),
// each stamped with the sheet's stamp. A sheet not for fabrication has
// none. r is the report the sheet was laid out from.
func Files(r *detail.Report, s *sheet.Sheet) ([]File, error) {
	if s.NotForFabrication {
		return nil, nil
	}
	ps, err := Pieces(r, s)
	if err != nil {
		return nil, err
	}
	out := make([]File, 0, len(ps))
	for i := range ps {
		out = append(out, File{Name: ps[i].Mark + Ext, Data: Write(&ps[i], s.Stamp)})
	}
	return out, nil
}

// Pieces is the NC1 model of each piece of the sheet, in the order Files
// writes them.
func Pieces(r *detail.Report, s *sheet.Sheet) ([]Piece, error) {
	var out []Piece
	for i := range s.Views {
		p := &s.Views[i].Part
		if p.Name == "member" {
			ps, err := memberPieces(r, s, p)
			if err != nil {
				return nil, err
			}
			out = append(out, ps...)
			continue
		}
		grade := r.Design.Info.PlateGrade
		if p.Name == "far-plate" && r.Far != nil {
			grade = r.Far.Design.Info.PlateGrade
		}
		out = append(out, platePiece(r, s, p, grade))
	}
	return out, nil
}

// mmPer is how many mm one unit of the sheet is.
func mmPer(sys units.System) float64 {
	if sys == units.SI {
		return 1
	}
	return float64(units.Inch)
}

// common fills the header fields every piece shares.
func common(r *detail.Report, s *sheet.Sheet, part string, quantity int) Piece {
	j := r.Design.Job
	return Piece{Order: j.Project.Name, Drawing: j.Project.Drawing, Phase: "", Mark: s.Mark + "-" + part,
		Quantity: quantity * max(j.Quantity, 1),
		Texts:    [4]string{"gaugeline " + j.Mark, part, revision(j.Project.Revision), ""}}
}

func revision(r string) string {
	if r == "" {
		return ""
	}
	return "revision " + r
}

// platePiece is a plate: profile code B, its contour on face v, its
// holes in the plate frame.
func platePiece(r *detail.Report, s *sheet.Sheet, p *sheet.Part, grade string) Piece {
	k := mmPer(s.Units)
	lo, hi := p.Bounds()
	pc := common(r, s, p.Name, max(p.Pieces, 1))
	t, w := p.Thickness*k, (hi.Y-lo.Y)*k
	pc.Grade = grade
	pc.Profile = "PL" + mmText(t) + "x" + mmText(w)
	pc.Code = "B"
	pc.Length = (hi.X - lo.X) * k
	pc.Height, pc.FlangeWidth, pc.FlangeT, pc.WebT = w, t, t, t
	pc.Weight = plateWeight(t)
	pc.Paint = 2 * (w + t) / 1000
	for _, q := range p.Contour {
		pc.Contour = append(pc.Contour, Point{X: (q.X - lo.X) * k, Y: (q.Y - lo.Y) * k})
	}
	for _, h := range p.Holes {
		pc.Holes = append(pc.Holes, hole(FaceFront, h, (h.Centre.X-lo.X)*k, (h.Centre.Y-lo.Y)*k, k))
	}
	pc.Comments = []string{fmt.Sprintf("plate %s, %d per assembly", pc.Profile, max(p.Pieces, 1))}
	return pc
}

// hole is the BO hole of a sheet hole at x, y (mm) on face f.
func hole(f Face, h sheet.SheetHole, x, y, k float64) Hole {
	d := h.Diameter() * k
	out := Hole{Face: f, X: x, Y: y, D: d}
	if !h.Round() {
		out.Ex, out.Ey = max(h.Dx*k-d, 0), max(h.Dy*k-d, 0)
	}
	return out
}

// mmText writes a dimension in mm for a designation: "10", "12.7".
func mmText(v float64) string {
	return strings.TrimSuffix(strings.TrimRight(fmt.Sprintf("%.2f", v), "0"), ".")
}

// profile is a member's profile data, mm.
type profile struct {
	code, name                     string
	height, width, tf, tw, r, area float64
	paint                          float64 // m²/m
	faces                          []Face  // the faces its connected elements are
}

// memberProfile reads the member's profile from the design: the catalog
// shape for rolled sections, the angle's legs, the flat's width.
func memberProfile(d *detail.Design) (profile, error) {
	m := &d.Conn.Member
	name := strings.TrimPrefix(d.Info.Designation, "2")
	area := float64(m.Ag) / float64(max(m.Pieces, 1))
	switch m.Shape {
	case engine.Angle, engine.DoubleAngle:
		a, b, t := float64(m.Width), float64(m.Outstanding), float64(m.T)
		return profile{code: "L", name: name, height: a, width: b, tf: t, tw: t, r: angleRadius(name, d.Job.Units),
			area: area, paint: 2 * (a + b) / 1000, faces: []Face{FaceFront}}, nil
	case engine.Flat:
		w, t := float64(m.Width), float64(m.T)
		return profile{code: "B", name: name, height: w, width: t, tf: t, tw: t, area: w * t,
			paint: 2 * (w + t) / 1000, faces: []Face{FaceFront}}, nil
	}
	fam, _ := engine.CatalogFamily(m.Shape)
	sh, err := section.LookupIn(fam, d.Job.Member.Size)
	if err != nil {
		return profile{}, fmt.Errorf("ncout: member %q: %w", d.Job.Member.Size, err)
	}
	p := profile{name: name, height: float64(sh.D), width: float64(sh.Bf), tf: float64(sh.Tf), tw: float64(sh.Tw),
		r: float64(sh.K - sh.Tf), area: float64(sh.Properties().Area)}
	// The perimeter, fillets and toes taken square (our choice).
	switch m.Shape {
	case engine.Tee:
		p.code, p.faces, p.paint = "T", []Face{FaceTop}, 2*(p.width+p.height)/1000
	case engine.Wide:
		p.code, p.faces, p.paint = "I", []Face{FaceTop, FaceBottom}, (2*p.height+4*p.width-2*p.tw)/1000
	default: // channels
		p.code, p.faces, p.paint = "U", []Face{FaceFront}, (2*p.height+4*p.width-2*p.tw)/1000
	}
	return p, nil
}

// angleRadius is the root radius of a catalog angle (either leg order):
// r1 where the catalog gives it (EN 10056-1), else k − t (the US
// catalog's detailing k less the thickness, our approximation of the
// fillet); 0 for an angle of the job's own legs.
func angleRadius(name string, sys units.System) float64 {
	a, err := section.Lookup(name, sys)
	if p := strings.Split(strings.TrimPrefix(name, "L"), "x"); err != nil && len(p) == 3 {
		a, err = section.Lookup("L"+p[1]+"x"+p[0]+"x"+p[2], sys)
	}
	switch {
	case err != nil:
		return 0
	case a.R1 > 0:
		return float64(a.R1)
	}
	return float64(max(a.K-a.T, 0))
}

// memberPieces is the whole member: its profile, its holes on the faces
// of its connected elements (doc.go's table); a pair's opposite hand a
// piece of its own where it differs.
func memberPieces(r *detail.Report, s *sheet.Sheet, p *sheet.Part) ([]Piece, error) {
	d := r.Design
	prof, err := memberProfile(d)
	if err != nil {
		return nil, err
	}
	k := mmPer(s.Units)
	_, hi := p.Bounds()
	length := hi.X * k
	pair := d.Conn.Member.Pieces == 2 && !engine.Apart(d.Conn.Member.Shape)
	pc := common(r, s, p.Name, 1)
	pc.Grade, pc.Profile, pc.Code = d.Info.Grade, prof.name, prof.code
	pc.Length, pc.Height, pc.FlangeWidth = length, prof.height, prof.width
	pc.FlangeT, pc.WebT, pc.Radius = prof.tf, prof.tw, prof.r
	pc.Weight, pc.Paint = prof.area*1e-6*density, prof.paint
	if prof.code == "B" { // a flat bar: its contour too, its weight per m² like a plate's
		pc.Weight = plateWeight(prof.tf)
		pc.Contour = []Point{{0, 0}, {length, 0}, {length, prof.height}, {0, prof.height}}
	}
	for _, f := range prof.faces {
		for _, h := range p.Holes {
			x, y := h.Centre.X*k, h.Centre.Y*k
			if f == FaceBottom { // seen from below: y the other way
				y = prof.width - y
			}
			pc.Holes = append(pc.Holes, hole(f, h, x, y, k))
		}
	}
	pc.Comments = []string{fmt.Sprintf("member %s %s, %s", d.Info.Designation, d.Info.Grade, connected(prof))}
	if !pair {
		return []Piece{pc}, nil
	}
	opp := pc
	opp.Mark += "-opp"
	opp.Texts[1] += " opposite hand"
	opp.Holes = make([]Hole, len(pc.Holes))
	for i, h := range pc.Holes {
		h.X = length - h.X
		opp.Holes[i] = h
	}
	opp.Comments = append(pc.Comments[:1:1], "opposite hand of "+pc.Mark+": turned end for end")
	if sameHoles(pc.Holes, opp.Holes) {
		pc.Quantity *= 2
		pc.Comments = append(pc.Comments, "2 per assembly: the opposite hand has the same holes")
		return []Piece{pc}, nil
	}
	pc.Comments = append(pc.Comments, "1 per assembly as shown; the opposite hand is "+opp.Mark)
	return []Piece{pc, opp}, nil
}

// connected says where the holes are, for the comment.
func connected(p profile) string {
	switch p.code {
	case "L":
		return "holes in the connected leg (face v)"
	case "U":
		return "holes in the web (face v)"
	case "T":
		return "holes in the flange (face o)"
	case "I":
		return "holes in both flanges (faces o and u), drilled alike seen from outside"
	}
	return "holes on face v"
}

// sameHoles reports whether a and b are the same holes in any order,
// within 1e-6 mm.
func sameHoles(a, b []Hole) bool {
	if len(a) != len(b) {
		return false
	}
	used := make([]bool, len(b))
	for _, h := range a {
		found := false
		for i, g := range b {
			if !used[i] && h.Face == g.Face && near(h.X, g.X) && near(h.Y, g.Y) && near(h.D, g.D) && near(h.Ex, g.Ex) && near(h.Ey, g.Ey) {
				used[i], found = true, true
				break
			}
		}
		if !found {
			return false
		}
	}
	return true
}

func near(a, b float64) bool { return math.Abs(a-b) <= 1e-6 }
