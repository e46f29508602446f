package engine

import (
	"sort"

	"gaugeline/rules/units"
	"gaugeline/rules/words"
)

// Shape is the cross-section of the tension member, told by what the
// limit states, the detailing rules and the layout search ask of it. The
// connected element is the rectangle the holes lie in: Width across the
// load (y from 0 to Width) by T. A new shape is one file that implements
// Shape, plus its entry in Shapes (DEVELOPERS.md, "Adding a shape").
type Shape interface {
	// String returns the job-file spelling.
	String() string
	// Pieces is how many of the section lie back to back with the plate
	// between them, each bolted through: one shear plane per piece.
	Pieces() int
	// FreeEdges reports whether the connected element's long edges at
	// y = 0 and y = Width are free edges (edge distance, block shear to
	// the edge). An edge at y = 0 that is not free is a heel: there the
	// connected element joins the rest of the section, of thickness T,
	// which the holes stay clear of.
	FreeEdges() (low, high bool)
	// ConnectedArea is the gross area of the whole member's connected
	// elements, the numerator of the D3 bound for open sections.
	ConnectedArea(m *Member) units.Area
	// ShearLagCases are the cases of Table D3.1 that apply; U is the
	// largest of them (x̄ is Member.Xbar, used by case 2).
	ShearLagCases() D31
	// CentredGroup reports whether J1.7 asks for the bolt group on the
	// member's gravity axis: a flat bar; single and double angles "and
	// similar members" are exempt.
	CentredGroup() bool
	// MonotoneGage reports whether, on one gage2, the smallest first gage
	// that passes the gage rules dominates every larger one, so the layout
	// search may stop there (propose's pruning).
	MonotoneGage() bool
}

// D31 is a set of the cases of Table D3.1 a shape may use.
type D31 uint8

const (
	D31Case1 D31 = 1 << iota // every element connected: U = 1.0
	D31Case2                 // U = 1 − x̄/l
	D31Case8                 // angles: 0.80 with four or more bolts per line, 0.60 with three
	D31Bound                 // D3: the connected elements' gross area over Ag
	D31Case7                 // W shapes and tees cut from them, by the flanges: 0.90 with bf ≥ 2/3·d, else 0.85, 3 or more bolts per line
)

// Has reports whether every case of c is in d.
func (d D31) Has(c D31) bool { return d&c == c }

// Shapes lists every shape a job may name, in the order its hint names
// them.
func Shapes() []Shape { return []Shape{Angle, DoubleAngle, Flat, Tee, Channel, DoubleChannel, Wide} }

// ShapeNames is the job-file spellings of Shapes for a hint: "a, b or c".
func ShapeNames() string {
	var names []string
	for _, s := range Shapes() {
		names = append(names, s.String())
	}
	return words.Alternatives(names)
}

// Heel reports whether the connected element's y = 0 edge is a heel, not
// a free edge (Shape.FreeEdges).
func (m *Member) Heel() bool {
	low, _ := m.Shape.FreeEdges()
	return !low
}

// ClearWidth is the room across the connected element a hole may take:
// Width, less T past a heel; with junctions, the widest strip between
// their faces and the element's edges.
func (m *Member) ClearWidth() units.Length {
	if len(m.Junctions) == 0 {
		if m.Heel() {
			return m.Width - m.T
		}
		return m.Width
	}
	type span struct{ lo, hi units.Length }
	var taken []span
	for _, j := range m.Junctions {
		lo, hi := j.At-j.Face, j.At+j.Face
		switch j.Side {
		case 1:
			lo = j.At
		case -1:
			hi = j.At
		}
		taken = append(taken, span{lo, hi})
	}
	sort.Slice(taken, func(a, b int) bool { return taken[a].lo < taken[b].lo })
	widest, from := units.Length(0), units.Length(0)
	for _, t := range taken {
		widest = max(widest, t.lo-from)
		from = max(from, t.hi)
	}
	return max(widest, m.Width-from)
}

// Apart reports whether the shape's pieces are not back to back but each
// bolted to a plate of its own by bolts of its own (a W's two flanges): a
// shape says so by a method Apart() bool. The pieces of such a shape are
// its connected elements; the holes are one element's, the same in each.
func Apart(s Shape) bool {
	a, ok := s.(interface{ Apart() bool })
	return ok && a.Apart()
}

// CatalogFamily is the catalog family whose designation a rolled shape's
// job gives as member.size ("WT", "C or MC", "W"; section.LookupIn reads
// it) and an example designation for a hint: a shape says so by a method
// Catalog() (family, example string). "" for angles and flat bars, which
// are given otherwise.
func CatalogFamily(s Shape) (family, example string) {
	if c, ok := s.(interface{ Catalog() (string, string) }); ok {
		return c.Catalog()
	}
	return "", ""
}

// PieceName is what a report calls one piece of the member ("angle",
// "flange"): a shape says so by a method PieceName() string; "angle"
// otherwise (the pieces of a double angle).
func PieceName(s Shape) string {
	if n, ok := s.(interface{ PieceName() string }); ok {
		return n.PieceName()
	}
	return "angle"
}
