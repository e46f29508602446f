package engine

import (
	"gaugeline/rules"
	"gaugeline/rules/units"
	"gaugeline/rules/words"

	"gonum.org/v1/gonum/spatial/r2"
)

// Member is the tension member at its connected end.
type Member struct {
	Shape Shape
	// Width is the connected leg of an angle (heel to toe) or the width of
	// a flat: the part the holes lie in, y from 0 to Width.
	Width units.Length
	// Outstanding is the other leg of an angle (zero for flats).
	Outstanding units.Length
	// T is the thickness of one piece.
	T units.Length
	// Ag is the gross area of the whole member (both angles of a pair).
	Ag units.Area
	// Xbar is the connection eccentricity x̄ of one piece, measured from the
	// faying face (zero for flats).
	Xbar units.Length
	// Pieces is 2 for a double angle, otherwise 1.
	Pieces int
	Fy, Fu units.Stress
	// Eccentricity says whether the design provides for a flat bar's bolt
	// group lying off the bar's centre line (J1.7); when it does, Check
	// adds member.combined.
	Eccentricity EndEccentricity
	// Junctions are where the rest of the section stands on the connected
	// element (junction.go); nil for a flat bar. An angle's heel is one
	// (At 0, Face T, Toe k): set by the builder, read by gage.workable, the
	// hole's room (ClearWidth) and the sheet.
	Junctions []Junction
	// Depth is d of Table D3.1 case 7: the depth of the W shape, or of the
	// W a tee is cut from (zero where case 7 does not apply).
	Depth units.Length
	// TearOff is the rolled section's block out of the connected element's
	// plane (nil: none).
	TearOff *TearOff
	// Strut is what Chapter E asks of the member in compression (nil:
	// not described, and no compression case may be checked).
	Strut *Strut
}

// PlateKind is the role of the connecting plate.
type PlateKind int

const (
	Gusset PlateKind = iota
	Splice
)

var plateKinds = words.New[PlateKind]("plate kind", "gusset", "splice")

// String returns the job-file spelling.
func (k PlateKind) String() string { return plateKinds.Name(k) }

// ParsePlateKind reads the job-file spelling.
func ParsePlateKind(s string) (PlateKind, error) { return plateKinds.Parse(s) }

// Plate is the gusset or splice plate the member bolts to: a rectangle
// Width across the load, centred in y on the bolt group, ending at its
// free edge x = FreeEdge and open toward −x; or, when Outline is set, that
// polygon (outline.go), whose bounding box FreeEdge (its greatest x),
// YCentre and Width then are.
type Plate struct {
	Kind     PlateKind
	T        units.Length
	Width    units.Length
	FreeEdge units.Length // x of the plate's free edge
	YCentre  units.Length // y of the plate's centre line
	Fy, Fu   units.Stress
	// Outline is the plate's true outline in the member frame (mm), in the
	// job's order, closed by itself; nil: the rectangle above.
	Outline []r2.Vec
	// Count is the number of splice plates: 2 is one each side of the
	// members (two shear planes, the plates sharing the load); 0 or 1 is
	// one plate. Only a splice has two (splice.go).
	Count int
	// Gap is a splice's gap between the two members' ends: member B's end
	// is at x = −Gap (splice.go); zero for a gusset.
	Gap units.Length
	// Buckling is how the plate's buckling length is taken when the member
	// pushes (J4.4, compression_plate.go).
	Buckling PlateBuckling
}

// Plates is the number of plates: Count, at least 1.
func (p *Plate) Plates() int { return max(p.Count, 1) }

// TotalT is the thickness of the plates together, Plates·T: what the
// plate's limit states take, as a double angle's take both angles.
func (p *Plate) TotalT() units.Length { return units.Length(p.Plates()) * p.T }

// YMin and YMax are the plate's side edges in the member frame.
func (p *Plate) YMin() units.Length { return p.YCentre - p.Width/2 }
func (p *Plate) YMax() units.Length { return p.YCentre + p.Width/2 }

// Bolt is the bolt specification shared by every hole.
type Bolt struct {
	D       units.Length
	Grade   rules.BoltGrade
	Threads rules.Threads
	Joint   rules.Joint
	Surface rules.SlipClass
	Fillers int // fillers between the connected parts, for hf (2 means two or more)
	// FillerT is the total thickness of the fillers a bolt passes through at
	// each shear plane (0: none or not given); FillerDeveloped says the
	// fillers are welded or extended and bolted to carry their share of the
	// force (J5.2(b)), so the bolts' shear strength is not reduced.
	FillerT         units.Length
	FillerDeveloped bool
	// DeformationConsidered: deformation at the bolt hole at service load is
	// a design consideration (J3.10(a) [J3.11(a)]).
	DeformationConsidered bool
}

// HoleShape is a hole's type and nominal extents in one ply. Dx and Dy are
// the extents along x and y: the diameter for a round hole; for a slot, its
// length along its long axis and its width across it. Slot means nothing
// for a round hole (Transverse by convention).
type HoleShape struct {
	Type   rules.HoleType
	Slot   rules.SlotDir
	Dx, Dy units.Length
}

// Hole is one bolt through the member and the plate: one centre, and the
// hole's shape in each ply (J3.2 [J3.3] lets the plies differ, e.g. a long
// slot in one part and standard holes in the other). The embedded shape
// is the member's ply, so h.Type, h.Dx and h.Dy are the member's.
type Hole struct {
	ID        string
	X, Y      units.Length
	HoleShape            // the member's ply
	Plate     *HoleShape // the plate's ply; nil: the same as the member's
}

// InPlate returns the hole's shape in the plate's ply.
func (h *Hole) InPlate() HoleShape {
	if h.Plate != nil {
		return *h.Plate
	}
	return h.HoleShape
}

// PliesDiffer reports whether the plate's ply has a hole of another type,
// direction or size than the member's.
func (h *Hole) PliesDiffer() bool { return h.Plate != nil && *h.Plate != h.HoleShape }

// Connection is everything the limit states need.
type Connection struct {
	Edition Code // the standard and edition checked to
	Method  rules.Method
	Member  Member
	// MemberB is a splice's member beyond the joint where it differs from
	// Member (splice.go); nil: Member mirrored about the joint.
	MemberB *Member
	Plate   *Plate // nil: the member alone is checked
	Bolt    Bolt
	Holes   []Hole
	// Demand is the required strength: factored (LRFD) or service (ASD).
	Demand units.Force
	// Compression is the required compressive strength, a magnitude (zero:
	// the member only pulls): the compression limit states (compression.go)
	// are checked when it is set, and the bolts' shear takes the larger.
	Compression units.Force
}

// ShearPlanes is the number of bolt shear planes (and slip planes): one
// per piece of the member, the plate between them (two for a double
// angle); two for a member between two splice plates; otherwise one.
func (c *Connection) ShearPlanes() int {
	if c.Plate != nil && c.Plate.Plates() == 2 {
		return 2
	}
	return c.Member.Shape.Pieces()
}
