package engine

import (
	"math"

	"gaugeline/rules/units"
)

// Strut is what Chapter E asks of the member in compression, set by the
// builder from the section's geometry. The axes: x is the axis the member
// buckles about in flexure alone; y the other, about which a singly
// symmetric section buckles flexural-torsionally (E4: y its axis of
// symmetry) and about which two pieces back to back deform against their
// connectors (E6). A single angle's buckling is E5's effective slenderness
// instead.
type Strut struct {
	L units.Length // between the ends' work points: member.length
	K float64      // effective length factor (member.k)
	// Rx and Ry are the radii of gyration of the whole member about x and
	// y (y unmodified by E6).
	Rx, Ry units.Length
	Kind   StrutKind

	// Single angles (E5): ra about the geometric axis parallel to the
	// connected leg, rz the least; the legs, connected first.
	Ra, Rz                 units.Length
	Connected, Outstanding units.Length
	// Space is E5(b): a web member of a box or space truss, not E5(a) (an
	// individual member, or a web member of a planar truss with the
	// adjacent web members on the same side of the gusset). E5 also asks
	// for two or more bolts at the end (the connection's holes).
	Space bool

	// Singly symmetric sections (E4): the torsional constant J (mm⁴), the
	// warping constant Cw (mm⁶) and the shear centre's distance from the
	// centroid along the axis of symmetry Yo.
	J, Cw float64
	Yo    units.Length

	// Two pieces back to back (E6): the intermediate connectors between
	// the ends, equally spaced, the least radius of one piece ri, the
	// factor Ki (0.50 for angles, 0.75 for channels) and whether the
	// connectors are only snug-tight (E6.1(a)) rather than welded or
	// pretensioned (E6.1(b)).
	BuiltUp    bool
	Connectors int
	Ri         units.Length
	Ki         float64
	SnugTight  bool

	// Elements are the section's plate elements for local buckling (Table
	// B4.1a, E7).
	Elements []Element
}

// StrutKind is which sections of Chapter E the member's buckling takes.
type StrutKind int

const (
	// StrutFlexural: E3 about x and y (a flat bar, a W shape, two channels).
	StrutFlexural StrutKind = iota
	// StrutAngle: E5's effective slenderness, then E3.
	StrutAngle
	// StrutSinglySymmetric: E3 about x, E4 about y (a tee, two angles, a
	// channel).
	StrutSinglySymmetric
)

// Element is one plate element of the section for Table B4.1a: its width
// b and thickness t, how many of it the member has, the λr coefficient
// of its case (λr = Lr·√(E/Fy)) and whether it is stiffened (E7's c1, c2).
type Element struct {
	Name      string
	B, T      units.Length
	Count     int
	Lr        float64
	Stiffened bool
}

// ConnectorSpacing is a, the distance between the connectors of two
// pieces back to back: the length over the intermediate connectors plus
// one.
func (col *Strut) ConnectorSpacing() units.Length {
	return col.L / units.Length(col.Connectors+1)
}

// slenderLimit is λr = Lr·√(E/Fy) of an element.
func (el Element) slenderLimit(E, Fy units.Stress) float64 {
	return el.Lr * math.Sqrt(float64(E/Fy))
}
