package detail

import (
	"fmt"
	"math"
	"strings"
	"text/tabwriter"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/engine/polygon"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// The bill of material and the bolt list of a member (member.length
// given): the pieces the shop cuts, what they weigh, and the bolts that
// join them. Pieces is the one list of pieces derived from the design; the
// sheet's tables, the JSON and the reports all read it.
//
// Piece marks are ours: MARK-M the member (each angle of a pair is a
// piece), MARK-P the near end's plate, MARK-FP a far end's own plate. Each
// piece names its CAM file (MARK-member.cam.dxf, …), the same part names
// the sheet gives its parts.

// ViewBeyond is how far a drawn part runs past the row of holes farthest
// from its datum edge: the longer of the pattern's length along x and 6 in
// (150 mm) (our choice, common sense: room for the Whitmore spread and for
// a person to see where the part goes on). A plate without plate.length or
// plate.outline is cut that long past its pattern (Design.PlateOutline).
func ViewBeyond(pattern units.Length, sys units.System) units.Length {
	least := 6 * units.Inch
	if sys == units.SI {
		least = 150 * units.Millimetre
	}
	return max(pattern, least)
}

// PlateOutline is the plate's outline in the member frame (mm), as the
// plate CAM file cuts it: the job's outline (or the rectangle plate.length
// closes), else the rectangle from the free edge back through the pattern
// and ViewBeyond past it. Nil without a plate.
func (d *Design) PlateOutline() []r2.Vec {
	pl := d.Conn.Plate
	if pl == nil || len(d.Conn.Holes) == 0 {
		return nil
	}
	if pl.Outline != nil {
		return pl.Outline
	}
	xlo, xhi := d.Conn.Holes[0].X, d.Conn.Holes[0].X
	for _, h := range d.Conn.Holes {
		xlo, xhi = min(xlo, h.X), max(xhi, h.X)
	}
	back := pl.FreeEdge - (pl.FreeEdge - xlo + ViewBeyond(xhi-xlo, d.Job.Units))
	x0, x1, y0, y1 := float64(back), float64(pl.FreeEdge), float64(pl.YMin()), float64(pl.YMax())
	return []r2.Vec{{X: x0, Y: y0}, {X: x1, Y: y0}, {X: x1, Y: y1}, {X: x0, Y: y1}}
}

// Piece is one row of the bill of material.
type Piece struct {
	Mark string // BR-16-M
	Part string // the CAM file's part: member, plate, far-plate (CAM: MARK-PART.cam.dxf)
	Kind string // "member" or "plate"
	// Each is the count per assembly (one member as the job describes
	// it); Quantity is Each × the job's quantity.
	Each, Quantity int
	Size           string       // L4x4x1/2; PL 1/2 x 12 x 1'-6"
	Grade          string       // steel grade
	Length         units.Length // cut length: the member's, the plate's along the load
	Width          units.Length // plate: its extent across the load; member: 0
	T              units.Length // thickness of one piece
	// Area is what the weight is taken from: the cross-section of one
	// member piece (one angle of a pair), or the plate's outline area (its
	// plan, not its bounding box).
	Area   units.Area
	Weight float64 // of one piece, lb (us) or kg (si): rules.Weight
	Note   string  // e.g. "1 each end"
}

// TotalWeight is the weight of all pieces of the row.
func (p Piece) TotalWeight() float64 { return p.Weight * float64(p.Quantity) }

// CAMFile is the name of the piece's CAM file.
func (p Piece) CAMFile(mark string) string { return mark + "-" + p.Part + ".cam.dxf" }

// Pieces is the bill of material of the member (nil without
// member.length): the member (each angle of a pair a piece), the near
// end's plate (one each end where the far end mirrors it), and a far end's
// own plate. Quantities are per assembly and for the job's quantity.
func (r *Report) Pieces() []Piece {
	d := r.Design
	j := d.Job
	L := d.MemberLength()
	if L == 0 {
		return nil
	}
	sys := j.Units
	qty := max(j.Quantity, 1)
	m := d.Conn.Member
	pieces := max(m.Pieces, 1)
	area := m.Ag / units.Area(pieces)
	mem := Piece{Mark: j.Mark + "-M", Part: "member", Kind: "member", Each: pieces, Size: strings.TrimPrefix(d.Info.Designation, "2"),
		Grade: d.Info.Grade, Length: L, T: m.T, Area: area, Weight: rules.Weight(area, L, sys)}
	if pieces == 2 {
		mem.Note = "2 angles: 1 as shown, 1 opposite hand"
	}
	out := []Piece{mem}
	if p, ok := platePiece(d, j.Mark+"-P", "plate"); ok {
		if j.Member.FarEnd.Kind == jobfile.FarMirror {
			p.Each, p.Note = 2, "1 each end"
		} else {
			p.Note = "near end"
		}
		out = append(out, p)
	}
	if r.Far != nil {
		if p, ok := platePiece(r.Far.Design, j.Mark+"-FP", "far-plate"); ok {
			p.Note = "far end"
			out = append(out, p)
		}
	}
	for i := range out {
		out[i].Quantity = out[i].Each * qty
	}
	return out
}

// platePiece is the design's plate as a piece: its outline's extents give
// its length along the load and its width across, its outline's area
// times its thickness its weight.
func platePiece(d *Design, mark, part string) (Piece, bool) {
	pl := d.Conn.Plate
	out := d.PlateOutline()
	if out == nil {
		return Piece{}, false
	}
	lo := r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	hi := r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, q := range out {
		lo = r2.Vec{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = r2.Vec{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	sys := d.Job.Units
	length, width := units.Length(hi.X-lo.X), units.Length(hi.Y-lo.Y)
	area := units.Area(math.Abs(polygon.Area(out)))
	shop := func(l units.Length) string { return units.FormatLength(l, sys, units.Shop) }
	return Piece{Mark: mark, Part: part, Kind: "plate", Each: 1,
		Size:  fmt.Sprintf("PL %s x %s x %s", shop(pl.T), shop(width), shop(length)),
		Grade: d.Info.PlateGrade, Length: length, Width: width, T: pl.T, Area: area,
		Weight: rules.Weight(area, pl.T, sys)}, true
}

// BoltSet is one row of the bolt list: bolts alike in diameter, grade,
// length and the holes and washers they go through.
type BoltSet struct {
	End        string // "each end", "near end", "far end"
	D          units.Length
	Grade      string
	Each       int // per assembly
	Quantity   int // Each × the job's quantity
	Grip       units.Length
	Length     units.Length // 0: not known (no plate in the job: the grip is not known)
	Washers    int          // hardened flat washers (ASTM F436) per bolt, in the length
	PlateWash  units.Length // plate washers or bars per bolt, their thickness in the length
	MemberHole string       // the member ply's hole type: standard, oversized, long-slot transverse …
	PlateHole  string       // the plate ply's; "" without a plate
	WasherNote string
	Faying     string
	Joint      string
}

// BoltLengthSource names where the bolt length comes from, for the bolt
// list's note.
const BoltLengthSource = "bolt length = grip + add-to-grip for one heavy hex nut (RCSC Specification Table C-2.1, " +
	"as reproduced in a fastener maker's table) + 5/32 in (4 mm) per hardened washer and a plate washer's thickness, " +
	"rounded up to the next 1/4 in (5 mm); metric bolts take the inch row of nearest diameter"

// WasherSource names what the washers follow.
const WasherSource = "washers per RCSC Specification Section 6 (from memory): a long slot in an outer ply gets a 5/16 in (8 mm) " +
	"plate washer or bar; an oversized or short-slotted outer ply an F436 washer (asked of pretensioned and slip-critical joints; " +
	"we put it on snug-tightened joints too, our choice); pretensioned Group B bolts in steel of Fy below 40 ksi " +
	"an F436 washer under head and nut"

// BoltList is the bolt list of the member (nil without member.length):
// the near end's bolts, the far end's (the near end's again for a mirror,
// its own for a far end of its own, none for a plain one), rows alike
// merged.
func (r *Report) BoltList() []BoltSet {
	d := r.Design
	j := d.Job
	if d.MemberLength() == 0 || len(d.Conn.Holes) == 0 {
		return nil
	}
	qty := max(j.Quantity, 1)
	near := boltSet(d)
	var out []BoltSet
	switch {
	case j.Member.FarEnd.Kind == jobfile.FarMirror:
		near.End, near.Each = "each end", 2*near.Each
		out = []BoltSet{near}
	case r.Far != nil && len(r.Far.Design.Conn.Holes) > 0:
		far := boltSet(r.Far.Design)
		near.End, far.End = "near end", "far end"
		same := far
		same.End, same.Each = near.End, near.Each
		if same == near { // the far end's bolts are the near end's: one row
			near.End, near.Each = "both ends", near.Each+far.Each
			out = []BoltSet{near}
		} else {
			out = []BoltSet{near, far}
		}
	default:
		near.End = "near end"
		out = []BoltSet{near}
	}
	for i := range out {
		out[i].Quantity = out[i].Each * qty
	}
	return out
}

// boltSet is one end's bolts: the grip through the member's plies, the
// plate and the fillers, the washers its outer plies ask for (WasherSource)
// and the length (rules.BoltLength).
func boltSet(d *Design) BoltSet {
	c := &d.Conn
	sys := d.Job.Units
	b := c.Bolt
	h := &c.Holes[0] // each ply's holes are all alike in a design
	kind := func(s engine.HoleShape) string {
		if s.Type.IsSlot() {
			return s.Type.String() + " " + s.Slot.String()
		}
		return s.Type.String()
	}
	set := BoltSet{D: b.D, Grade: b.Grade.Name, Each: len(c.Holes), MemberHole: kind(h.HoleShape), Joint: b.Joint.String(),
		Faying: fayingNote(b)}
	pieces := max(c.Member.Pieces, 1)
	grip := c.Member.T * units.Length(pieces)
	if c.Plate == nil {
		set.Grip = grip
		set.WasherNote = "no plate in the job: the grip and length are not known"
		return set
	}
	set.PlateHole = kind(h.InPlate())
	grip += c.Plate.T + b.FillerT*units.Length(c.ShearPlanes())
	set.Grip = grip

	// The outer plies: both angles of a pair, else the member and the plate.
	type side struct {
		name string
		hole engine.HoleShape
	}
	sides := []side{{"member side", h.HoleShape}, {"plate side", h.InPlate()}}
	if pieces == 2 {
		sides = []side{{"each side", h.HoleShape}, {"", h.HoleShape}}
	}
	pretensioned := b.Joint != rules.Bearing
	weak := c.Member.Fy < 40*units.Ksi || c.Plate.Fy < 40*units.Ksi
	plateWasher := 5 * units.Inch / 16
	if sys == units.SI {
		plateWasher = 8 * units.Millimetre
	}
	var notes []string
	hardened := 0
	for _, s := range sides {
		switch {
		case s.hole.Type == rules.LongSlot:
			set.PlateWash += plateWasher
			if s.name != "" {
				notes = append(notes, fmt.Sprintf("%s plate washer or bar over the long slot (%s)",
					units.FormatLength(plateWasher, sys, units.Shop), s.name))
			}
			if pretensioned && b.Grade.Group == rules.GroupB && weak {
				hardened++
			}
		case s.hole.Type == rules.Oversized || s.hole.Type == rules.ShortSlot:
			hardened++
			if s.name != "" {
				notes = append(notes, fmt.Sprintf("F436 washer over the %s hole (%s)", kind(s.hole), s.name))
			}
		case pretensioned && b.Grade.Group == rules.GroupB && weak:
			hardened++
			if s.name != "" {
				notes = append(notes, fmt.Sprintf("F436 washer (%s): Group B bolt, steel Fy below 40 ksi", s.name))
			}
		}
	}
	set.Washers = hardened
	if len(notes) == 0 {
		notes = []string{"no washers required"}
		if pretensioned {
			notes[0] += "; an F436 washer under the turned element if pretensioned by calibrated wrench (not in the length)"
		}
	}
	set.WasherNote = strings.Join(notes, "; ")
	if l, err := rules.BoltLength(b.D, grip+set.PlateWash, hardened, sys); err == nil {
		set.Length = l
	} else {
		set.WasherNote += "; " + err.Error()
	}
	return set
}

// fayingNote is the faying surfaces' note: the slip class a slip-critical
// joint is checked with (AISC 360 J3.8 [J3.9]; the surfaces' description
// per the RCSC Specification Section 3.2.2, from memory), else none asked.
func fayingNote(b engine.Bolt) string {
	if b.Joint != rules.SlipCritical {
		return "no slip class (" + b.Joint.String() + " joint): surfaces free of loose scale, dirt and burrs"
	}
	if b.Surface == rules.ClassB {
		return "slip-critical, class B (mu 0.50): unpainted blast-cleaned, or blast-cleaned with a class B coating"
	}
	return "slip-critical, class A (mu 0.30): unpainted clean mill scale, or blast-cleaned with a class A coating"
}

// TotalWeight is the total of the pieces' weights.
func TotalWeight(ps []Piece) float64 {
	w := 0.0
	for _, p := range ps {
		w += p.TotalWeight()
	}
	return w
}

// WeightUnit is the weights' unit: lb (us) or kg (si).
func WeightUnit(sys units.System) string {
	if sys == units.SI {
		return "kg"
	}
	return "lb"
}

// WeightText writes a weight to 0.1 lb (kg).
func WeightText(w float64) string { return fmt.Sprintf("%.1f", w) }

// BoltText names a bolt for the list: 3/4" A325 x 2-1/4".
func (s BoltSet) BoltText(sys units.System) string {
	t := BoltSize(s.D, sys) + " " + s.Grade
	if s.Length > 0 {
		t += " x " + units.FormatLength(s.Length, sys, units.Shop)
	}
	return t
}

// HolesText names the holes per ply: "member standard, plate standard".
func (s BoltSet) HolesText() string {
	if s.PlateHole == "" {
		return "member " + s.MemberHole
	}
	return "member " + s.MemberHole + ", plate " + s.PlateHole
}

// WashersText counts the washers per bolt.
func (s BoltSet) WashersText(sys units.System) string {
	var parts []string
	if s.Washers > 0 {
		parts = append(parts, fmt.Sprintf("%d F436", s.Washers))
	}
	if s.PlateWash > 0 {
		parts = append(parts, "plate washers "+units.FormatLength(s.PlateWash, sys, units.Shop))
	}
	if len(parts) == 0 {
		return "none"
	}
	return strings.Join(parts, " + ")
}

// jsonBOM is the bill of material in the JSON (bill_of_material).
type jsonBOM struct {
	WeightUnit  string      `json:"weight_unit"`
	Density     JSONNum     `json:"density"` // lb/ft³ (us), kg/m³ (si)
	Pieces      []jsonPiece `json:"pieces"`
	TotalWeight JSONNum     `json:"total_weight"`
}

type jsonPiece struct {
	Mark        string  `json:"mark"`
	Piece       string  `json:"piece"` // member, plate
	CAMFile     string  `json:"cam_file"`
	Each        int     `json:"each"`
	Quantity    int     `json:"quantity"`
	Size        string  `json:"size"`
	Grade       string  `json:"grade"`
	Length      JSONNum `json:"length"`
	Width       JSONNum `json:"width,omitempty"`
	Thickness   JSONNum `json:"thickness"`
	Area        JSONNum `json:"area"`
	WeightEach  JSONNum `json:"weight_each"`
	WeightTotal JSONNum `json:"weight_total"`
	Note        string  `json:"note,omitempty"`
}

// jsonBoltList is the bolt list in the JSON (bolt_list).
type jsonBoltList struct {
	Sets         []jsonBoltSet `json:"sets"`
	LengthSource string        `json:"length_source"`
	WasherSource string        `json:"washer_source"`
}

type jsonBoltSet struct {
	End        string  `json:"end"`
	Diameter   JSONNum `json:"diameter"`
	Grade      string  `json:"grade"`
	Each       int     `json:"each"`
	Quantity   int     `json:"quantity"`
	Grip       JSONNum `json:"grip"`
	Length     JSONNum `json:"length,omitempty"`
	Washers    int     `json:"hardened_washers"`
	PlateWash  JSONNum `json:"plate_washers,omitempty"`
	MemberHole string  `json:"member_hole"`
	PlateHole  string  `json:"plate_hole,omitempty"`
	Joint      string  `json:"joint"`
	WasherNote string  `json:"washer_note"`
	Faying     string  `json:"faying_surfaces"`
}

// bomDocument is the check's JSON with the bill of material and the bolt
// list after it (member.length given).
type bomDocument struct {
	Document
	BillOfMaterial jsonBOM      `json:"bill_of_material"`
	BoltList       jsonBoltList `json:"bolt_list"`
}

// withBOM returns the document to encode: the document itself without
// member.length (the old JSON, byte for byte), else with the bill of
// material and the bolt list.
func (r *Report) withBOM(doc Document) any {
	ps := r.Pieces()
	if ps == nil {
		return doc
	}
	sys := r.Design.Job.Units
	length := func(l units.Length) JSONNum { return JSONNum(sys.ToJob(float64(l), units.DimLength)) }
	density := rules.DensityUS
	if sys == units.SI {
		density = rules.DensitySI
	}
	out := bomDocument{Document: doc, BillOfMaterial: jsonBOM{WeightUnit: WeightUnit(sys), Density: JSONNum(density),
		Pieces: []jsonPiece{}, TotalWeight: JSONNum(TotalWeight(ps))},
		BoltList: jsonBoltList{Sets: []jsonBoltSet{}, LengthSource: BoltLengthSource, WasherSource: WasherSource}}
	for _, p := range ps {
		out.BillOfMaterial.Pieces = append(out.BillOfMaterial.Pieces, jsonPiece{Mark: p.Mark, Piece: p.Kind,
			CAMFile: p.CAMFile(r.Design.Job.Mark), Each: p.Each, Quantity: p.Quantity, Size: p.Size, Grade: p.Grade,
			Length: length(p.Length), Width: length(p.Width), Thickness: length(p.T),
			Area: JSONNum(sys.ToJob(float64(p.Area), units.DimArea)), WeightEach: JSONNum(p.Weight),
			WeightTotal: JSONNum(p.TotalWeight()), Note: p.Note})
	}
	for _, b := range r.BoltList() {
		out.BoltList.Sets = append(out.BoltList.Sets, jsonBoltSet{End: b.End, Diameter: length(b.D), Grade: b.Grade,
			Each: b.Each, Quantity: b.Quantity, Grip: length(b.Grip), Length: length(b.Length), Washers: b.Washers,
			PlateWash: length(b.PlateWash), MemberHole: b.MemberHole, PlateHole: b.PlateHole, Joint: b.Joint,
			WasherNote: b.WasherNote, Faying: b.Faying})
	}
	return out
}

// bomText writes the bill of material and the bolt list as a short
// section of the text report (nothing without member.length).
func (r *Report) bomText(b *strings.Builder) {
	ps := r.Pieces()
	if ps == nil {
		return
	}
	sys := r.Design.Job.Units
	shop := func(l units.Length) string { return units.FormatLength(l, sys, units.Shop) }
	wu := WeightUnit(sys)
	fmt.Fprintf(b, "\n")
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	fmt.Fprintf(tw, "BILL OF MATERIAL\tQTY\tSIZE\tGRADE\tCUT LENGTH\tEACH %s\tTOTAL %s\tNOTE\n", wu, wu)
	for _, p := range ps {
		fmt.Fprintf(tw, "%s\t%d\t%s\t%s\t%s\t%s\t%s\t%s\n", p.Mark, p.Quantity, p.Size, p.Grade, shop(p.Length),
			WeightText(p.Weight), WeightText(p.TotalWeight()), p.Note)
	}
	fmt.Fprintf(tw, "total\t\t\t\t\t\t%s\t\n", WeightText(TotalWeight(ps)))
	tw.Flush()
	fmt.Fprintf(b, "\n")
	tw = tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	fmt.Fprintf(tw, "BOLT LIST\tQTY\tGRIP\tWHERE\tHOLES\tWASHERS\n")
	bs := r.BoltList()
	for _, s := range bs {
		fmt.Fprintf(tw, "%s\t%d\t%s\t%s\t%s\t%s\n", s.BoltText(sys), s.Quantity, shop(s.Grip), s.End, s.HolesText(), s.WashersText(sys))
	}
	tw.Flush()
	for _, s := range bs {
		fmt.Fprintf(b, "  %s: washers: %s; faying surfaces: %s\n", s.End, s.WasherNote, s.Faying)
	}
	fmt.Fprintf(b, "  %s\n", BoltLengthSource)
}

// bomMarkdown is bomText as Markdown sections.
func (r *Report) bomMarkdown(b *strings.Builder) {
	ps := r.Pieces()
	if ps == nil {
		return
	}
	sys := r.Design.Job.Units
	shop := func(l units.Length) string { return MarkdownEscape(units.FormatLength(l, sys, units.Shop)) }
	wu := WeightUnit(sys)
	fmt.Fprintf(b, "\n## Bill of material\n\n| mark | qty | size | grade | cut length | each (%s) | total (%s) | note |\n|---|---:|---|---|---:|---:|---:|---|\n", wu, wu)
	for _, p := range ps {
		fmt.Fprintf(b, "| %s | %d | %s | %s | %s | %s | %s | %s |\n", MarkdownEscape(p.Mark), p.Quantity, MarkdownEscape(p.Size),
			MarkdownEscape(p.Grade), shop(p.Length), WeightText(p.Weight), WeightText(p.TotalWeight()), MarkdownEscape(p.Note))
	}
	fmt.Fprintf(b, "| total | | | | | | %s | |\n", WeightText(TotalWeight(ps)))
	fmt.Fprintf(b, "\n## Bolt list\n\n| bolt | qty | grip | where | holes | washers | washer note | faying surfaces |\n|---|---:|---:|---|---|---|---|---|\n")
	for _, s := range r.BoltList() {
		fmt.Fprintf(b, "| %s | %d | %s | %s | %s | %s | %s | %s |\n", MarkdownEscape(s.BoltText(sys)), s.Quantity, shop(s.Grip), s.End,
			s.HolesText(), MarkdownEscape(s.WashersText(sys)), MarkdownEscape(s.WasherNote), MarkdownEscape(s.Faying))
	}
	fmt.Fprintf(b, "\n%s.\n", BoltLengthSource)
}
