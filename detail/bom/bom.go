// Package bom is the bill of material and the bolt list of a member: the
// pieces the shop cuts, what they weigh, and the bolts that join them,
// derived from the checked connections of its ends (Member). Package detail
// hands it its report's ends; the sheet, the reports and the JSON print
// what it returns.
package bom

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/engine"
	"gaugeline/engine/polygon"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Pieces is the one list of pieces derived from the design; the sheet's
// tables, the JSON and the reports all read it.
//
// Piece marks are ours: MARK-M the member (each angle of a pair is a
// piece), MARK-P the near end's plate, MARK-FP a far end's own plate. Each
// piece names its CAM file (MARK-member.cam.dxf, …), the same part names
// the sheet gives its parts.

// ViewBeyond is how far a drawn part runs past the row of holes farthest
// from its datum edge: the longer of the pattern's length along x and 6 in
// (150 mm) (our choice, common sense: room for the Whitmore spread and for
// a person to see where the part goes on). A plate without plate.length or
// plate.outline is cut that long past its pattern (PlateOutline).
func ViewBeyond(pattern units.Length, sys units.System) units.Length {
	least := 6 * units.Inch
	if sys == units.SI {
		least = 150 * units.Millimetre
	}
	return max(pattern, least)
}

// End is one end's checked connection as the lists need it.
type End struct {
	Conn       *engine.Connection
	PlateGrade string // the plate's steel grade name
}

// Member is a member with its ends: what Pieces and BoltList derive from.
type Member struct {
	Mark        string
	Units       units.System
	Quantity    int          // the job's quantity (0 counts as 1)
	Length      units.Length // member.length; 0: no lists
	Designation string       // the member's: L4x4x1/2, 2L4x4x1/2, PL 6x1/2
	Grade       string       // the member's steel grade name
	// Mirror: the far end carries the near end's connection mirrored
	// (far_end: mirror); else Far is the far end's own connection, or nil
	// for a plain far end.
	Mirror bool
	Near   End
	Far    *End
}

// PlateOutline is the plate's outline in the member frame (mm), as the
// plate CAM file cuts it: the job's outline (or the rectangle plate.length
// closes), else the rectangle from the free edge back through the pattern
// and ViewBeyond past it. Nil without a plate.
func PlateOutline(c *engine.Connection, sys units.System) []r2.Vec {
	pl := c.Plate
	if pl == nil || len(c.Holes) == 0 {
		return nil
	}
	if pl.Outline != nil {
		return pl.Outline
	}
	if pl.Kind == engine.Splice { // both groups: from A's plate end across the joint to B's
		x0, x1, y0, y1 := float64(-pl.Gap-pl.FreeEdge), float64(pl.FreeEdge), float64(pl.YMin()), float64(pl.YMax())
		return []r2.Vec{{X: x0, Y: y0}, {X: x1, Y: y0}, {X: x1, Y: y1}, {X: x0, Y: y1}}
	}
	xlo, xhi := c.Holes[0].X, c.Holes[0].X
	for _, h := range c.Holes {
		xlo, xhi = min(xlo, h.X), max(xhi, h.X)
	}
	back := pl.FreeEdge - (pl.FreeEdge - xlo + ViewBeyond(xhi-xlo, sys))
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
func Pieces(mb Member) []Piece {
	L := mb.Length
	if L == 0 {
		return nil
	}
	sys := mb.Units
	qty := max(mb.Quantity, 1)
	m := mb.Near.Conn.Member
	pieces := max(m.Pieces, 1)
	apart := engine.Apart(m.Shape) // a W's flanges: one member, a plate at each
	if apart {
		pieces = 1
	}
	area := m.Ag / units.Area(pieces)
	mem := Piece{Mark: mb.Mark + "-M", Part: "member", Kind: "member", Each: pieces, Size: strings.TrimPrefix(mb.Designation, "2"),
		Grade: mb.Grade, Length: L, T: m.T, Area: area, Weight: rules.Weight(area, L, sys)}
	if pieces == 2 {
		mem.Note = "2 " + engine.PieceName(m.Shape) + "s: 1 as shown, 1 opposite hand"
	}
	out := []Piece{mem}
	if p, ok := platePiece(mb.Near, sys, mb.Mark+"-P", "plate"); ok {
		pl := mb.Near.Conn.Plate
		switch {
		case pl.Kind == engine.Splice:
			// A splice joint joins two members: its plates are listed once,
			// with the member whose near end it is.
			p.Mark, p.Each, p.Note = mb.Mark+"-S", pl.Plates(), "splice plates of the near end's joint"
			if pl.Plates() == 2 {
				p.Note = "splice plates of the near end's joint, one each side"
			}
			if mb.Mirror {
				p.Note += "; the far end's joint is the next member's near end"
			}
		case mb.Mirror:
			p.Each, p.Note = 2, "1 each end"
		default:
			p.Note = "near end"
		}
		if apart && pl.Kind != engine.Splice {
			p.Each *= pl.Plates()
			p.Note = fmt.Sprintf("%d at each end, one at each %s", pl.Plates(), engine.PieceName(m.Shape))
			if !mb.Mirror {
				p.Note = fmt.Sprintf("near end, one at each %s", engine.PieceName(m.Shape))
			}
		}
		if apart && pl.Kind == engine.Splice {
			p.Note = strings.Replace(p.Note, "one each side", "one at each "+engine.PieceName(m.Shape), 1)
		}
		out = append(out, p)
	}
	if mb.Far != nil {
		if p, ok := platePiece(*mb.Far, sys, mb.Mark+"-FP", "far-plate"); ok {
			p.Note = "far end"
			if apart {
				p.Each = mb.Far.Conn.Plate.Plates()
				p.Note = "far end, one at each " + engine.PieceName(m.Shape)
			}
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
func platePiece(e End, sys units.System, mark, part string) (Piece, bool) {
	pl := e.Conn.Plate
	out := PlateOutline(e.Conn, sys)
	if out == nil {
		return Piece{}, false
	}
	lo := r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	hi := r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, q := range out {
		lo = r2.Vec{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = r2.Vec{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	length, width := units.Length(hi.X-lo.X), units.Length(hi.Y-lo.Y)
	area := units.Area(math.Abs(polygon.Area(out)))
	shop := func(l units.Length) string { return units.FormatLength(l, sys, units.Shop) }
	return Piece{Mark: mark, Part: part, Kind: "plate", Each: 1,
		Size:  fmt.Sprintf("PL %s x %s x %s", shop(pl.T), shop(width), shop(length)),
		Grade: e.PlateGrade, Length: length, Width: width, T: pl.T, Area: area,
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
func BoltList(mb Member) []BoltSet {
	if mb.Length == 0 || len(mb.Near.Conn.Holes) == 0 {
		return nil
	}
	qty := max(mb.Quantity, 1)
	near := boltSet(mb.Near.Conn, mb.Units)
	var out []BoltSet
	switch {
	case splice(mb.Near.Conn):
		// the near end's joint, both members' groups; a mirrored far end's
		// joint is the next member's near end (as the splice plates)
		near.End = "near end's joint (both members)"
		out = []BoltSet{near}
		if b := mb.Near.Conn.MemberBSide(); b != nil {
			// member_b: its group's grip is its own
			nb := boltSet(b, mb.Units)
			if nb.End = near.End; nb != near {
				near.Each, nb.Each = near.Each/2, nb.Each/2
				near.End, nb.End = "near end's joint, the member's group", "near end's joint, member B's group"
				out = []BoltSet{near, nb}
			}
		}
	case mb.Mirror:
		near.End, near.Each = "each end", 2*near.Each
		out = []BoltSet{near}
	case mb.Far != nil && len(mb.Far.Conn.Holes) > 0:
		far := boltSet(mb.Far.Conn, mb.Units)
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

// splice reports whether the connection is a splice (its plates carry both
// members' groups).
func splice(c *engine.Connection) bool { return c.Plate != nil && c.Plate.Kind == engine.Splice }

// boltSet is one end's bolts: the grip through the member's plies, the
// plate and the fillers, the washers its outer plies ask for (WasherSource)
// and the length (rules.BoltLength).
func boltSet(c *engine.Connection, sys units.System) BoltSet {
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
	if engine.Apart(c.Member.Shape) {
		// a bolt through each flange and its own plate: single plies
		set.Each *= pieces
		pieces = 1
	}
	grip := c.Member.T * units.Length(pieces)
	if c.Plate == nil {
		set.Grip = grip
		set.WasherNote = "no plate in the job: the grip and length are not known"
		return set
	}
	set.PlateHole = kind(h.InPlate())
	plies, fillers := c.Plate.TotalT(), c.ShearPlanes()
	if engine.Apart(c.Member.Shape) {
		plies, fillers = c.Plate.T, 1 // each bolt passes one flange, its filler and its plate
	}
	grip += plies + b.FillerT*units.Length(fillers)
	if splice(c) {
		set.Each *= 2 // a splice plate carries both members' groups
	}
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

// BoltText names a bolt for the list: 3/4" A325 x 2-1/4", M20 A325M x 55.
func (s BoltSet) BoltText(sys units.System) string {
	size := units.FormatLength(s.D, units.US, units.Shop)
	if _, metric := units.MetricBolt(s.D); sys == units.SI || metric {
		size = fmt.Sprintf("M%g", math.Round(float64(s.D)))
	}
	t := size + " " + s.Grade
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
