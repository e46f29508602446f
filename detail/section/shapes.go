package section

import (
	"fmt"
	"math"
	"strings"

	"gaugeline/rules/units"
)

// Family is the kind of a rolled shape other than an angle.
type Family int

// The rolled-shape families of the catalog.
const (
	FamilyW  Family = iota + 1 // wide-flange W shape
	FamilyWT                   // tee cut from a W shape
	FamilyC                    // American Standard channel (inner flange slope 16-2/3 %)
	FamilyMC                   // miscellaneous channel
)

func (f Family) String() string {
	switch f {
	case FamilyW:
		return "W"
	case FamilyWT:
		return "WT"
	case FamilyC:
		return "C"
	case FamilyMC:
		return "MC"
	}
	return fmt.Sprintf("Family(%d)", int(f))
}

// CSlope is the inner flange slope of C shapes, 2 in 12 (16-2/3 %): the
// American Standard channel dimensions of 1896, as a steel service
// centre's stock list restates them (fayindustries.com, "Structural
// Shapes"). MC shapes have no single slope.
const CSlope = 1.0 / 6

// Shape is a rolled W, WT, C or MC shape by its nominal dimensions. For a
// WT, D is the depth of the tee (flange face to stem tip). Tf of a channel
// is the average flange thickness (AISC's convention), the thickness
// halfway along the flange's inner face.
type Shape struct {
	Name string // canonical designation: "W8x21", "WT4x10.5", "C8x11.5", "MC10x22"
	// Metric is the same shape's metric designation, nominal depth in mm
	// by mass in kg/m ("W200x31.3"; the mass is the US weight × 1.488,
	// rounded as the metric tables print it, from memory).
	Metric string
	Family Family
	D      units.Length // depth
	Bf     units.Length // flange width
	Tw     units.Length // web (stem) thickness
	Tf     units.Length // flange thickness (channels: average)
	K      units.Length // kdes, flange outer face to the end of the fillet on the web
	// K1 is the detailing dimension k1 of a W or WT: the web's (stem's)
	// centre line to the toe of the web-to-flange fillet across the
	// flange, the AISC Shapes Database v15.0 column k1 (in sixteenths).
	// The database leaves it blank on its WT rows; a WT carries the k1 of
	// the W it is cut from (same flange, web and fillet). Zero for
	// channels, which have none.
	K1    units.Length
	Slope float64 // inner flange slope, rise over run (0: parallel faces)

	// Tabulated values carried instead of the geometry's, where the
	// geometry of the package comment misses the table (zero: computed).
	XbarTab units.Length
	RyTab   units.Length

	// G is the workable gage g across a W's or WT's flange, the usual
	// distance between the two gage lines astride the web (the AISC Shapes
	// Database v15.0 column WGi, the Manual's Tables 1-1 and 1-8); zero for
	// channels, whose tabulated gage is the flange's, not the web's.
	G units.Length
}

// ShapeProps are the section properties of a Shape; see the package
// comment for the axes.
type ShapeProps struct {
	Area   units.Area
	Xbar   units.Length // channels: centroid from the back of the web (x̄); W, WT: bf/2
	Ybar   units.Length // WT: centroid from the flange's outer face (ȳ); W, C, MC: d/2
	Ix, Iy float64      // mm⁴, about the centroidal axes parallel to the flanges (x) and the web (y)
	Rx, Ry units.Length
	// Carried names the properties taken from the table instead of the
	// geometry ("xbar", "ry"); Iy then is Area·Ry².
	Carried []string
}

// usShape is one catalog row, dimensions in inches as the AISC Shapes
// Database v15.0 prints them (file aisc-shapes-database-v15.0.csv in
// repository jonsadka/steel-explorer; d, bf, tw, tf, kdes and k1 also
// read in its text copy v15.0/Shapes-US.csv in repository
// ambaker1/aisc-csv).
type usShape struct {
	name             string
	fam              Family
	d, bf, tw, tf, k float64 // in; k is kdes
	k1               float64 // in, detailing k1 of W and WT (0: none, channels)
	xbarTab, ryTab   float64 // in, carried tabulated values (0: none)
	g                float64 // in, workable flange gage of W and WT (WGi; 0: none)
	si               string  // the metric designation: depth in mm × mass in kg/m
}

// usShapes is the catalog; after kdes comes k1 (the database's column k1
// for a W; for a WT, which the database leaves blank, that of the W it is
// cut from: WT4x10.5 W8x21, WT6x20 W12x40, WT6x25 W12x50, WT6x36 W12x72,
// WT8x25 W16x50), then the workable flange gage (WGi) of the database and
// the metric designation (from memory: the nominal depth in mm and the
// mass per metre).
// W12x72 is the shape of the AISC wf-truss
// teaching model (aisc-org/aisc-model-viewer, src/wf-truss/calculations.md:
// d 12.3, bf 12.0, tw 0.430, tf 0.670, gage 5-1/2 in); the database's
// W12X72 row prints the same, with kdes 1.27 (that of WT6x36, the tee cut
// from it). The MC rows carry the tabulated x̄ and ry: modelled with
// parallel flanges (their slope is not published in a source read) the
// geometry puts both 4 to 6 % high.
var usShapes = []usShape{
	{"W8x21", FamilyW, 8.28, 5.27, 0.250, 0.400, 0.700, 0.5625, 0, 0, 2.75, "W200x31.3"},
	{"W8x24", FamilyW, 7.93, 6.50, 0.245, 0.400, 0.794, 0.5625, 0, 0, 4, "W200x35.9"},
	{"W10x33", FamilyW, 9.73, 7.96, 0.290, 0.435, 0.935, 0.75, 0, 0, 5.5, "W250x49.1"},
	{"W12x40", FamilyW, 11.9, 8.01, 0.295, 0.515, 1.02, 0.875, 0, 0, 5.5, "W310x60"},
	{"W12x72", FamilyW, 12.3, 12.0, 0.430, 0.670, 1.27, 1.0625, 0, 0, 5.5, "W310x107"},
	{"WT4x10.5", FamilyWT, 4.14, 5.27, 0.250, 0.400, 0.700, 0.5625, 0, 0, 2.75, "WT100x15.5"},
	{"WT6x20", FamilyWT, 5.97, 8.01, 0.295, 0.515, 1.02, 0.875, 0, 0, 5.5, "WT155x30"},
	{"WT6x25", FamilyWT, 6.10, 8.08, 0.370, 0.640, 1.14, 0.9375, 0, 0, 5.5, "WT155x37"},
	{"WT6x36", FamilyWT, 6.13, 12.0, 0.430, 0.670, 1.27, 1.0625, 0, 0, 5.5, "WT155x53.5"},
	{"WT8x25", FamilyWT, 8.13, 7.07, 0.380, 0.630, 1.03, 0.8125, 0, 0, 3.5, "WT205x37"},
	{"C8x11.5", FamilyC, 8.00, 2.26, 0.220, 0.390, 0.938, 0, 0, 0, 0, "C200x17.1"},
	{"C9x20", FamilyC, 9.00, 2.65, 0.448, 0.413, 1.00, 0, 0, 0, 0, "C230x30"},
	{"C10x15.3", FamilyC, 10.0, 2.60, 0.240, 0.436, 1.00, 0, 0, 0, 0, "C250x22.8"},
	{"C12x25", FamilyC, 12.0, 3.05, 0.387, 0.501, 1.13, 0, 0, 0, 0, "C310x37"},
	{"MC6x12", FamilyMC, 6.00, 2.50, 0.310, 0.375, 0.875, 0, 0.704, 0.724, 0, "MC150x17.9"},
	{"MC8x18.7", FamilyMC, 8.00, 2.98, 0.353, 0.500, 1.13, 0, 0.849, 0.868, 0, "MC200x27.8"},
	{"MC10x22", FamilyMC, 10.0, 3.32, 0.290, 0.575, 1.31, 0, 0.990, 0.997, 0, "MC250x33"},
}

// shape builds the Shape of a catalog row.
func (s usShape) shape() Shape {
	in := func(v float64) units.Length { return units.Length(v) * units.Inch }
	sh := Shape{
		Name: s.name, Metric: s.si, Family: s.fam,
		D: in(s.d), Bf: in(s.bf), Tw: in(s.tw), Tf: in(s.tf), K: in(s.k), K1: in(s.k1),
		XbarTab: in(s.xbarTab), RyTab: in(s.ryTab), G: in(s.g),
	}
	if s.fam == FamilyC {
		sh.Slope = CSlope
	}
	return sh
}

// ShapeNames lists the designations of family f in catalog order.
func ShapeNames(f Family) []string {
	var names []string
	for _, s := range usShapes {
		if s.fam == f {
			names = append(names, s.name)
		}
	}
	return names
}

// UnknownShapeError is the answer to a designation not in the catalog.
type UnknownShapeError struct {
	Designation string   // as asked
	Families    []Family // families searched
	Known       []string // the catalog's sizes of those families
}

func (e *UnknownShapeError) Error() string {
	return fmt.Sprintf("section: no shape %q in the catalog; %s", e.Designation, e.Hint())
}

// Hint is the advice part of the message, for a "hint:" line.
func (e *UnknownShapeError) Hint() string {
	return "sizes in the catalog: " + strings.Join(e.Known, ", ")
}

// LookupW finds a W shape: "W8x21", "w8X21", "W 8 × 21".
func LookupW(designation string) (Shape, error) { return lookupShape(designation, FamilyW) }

// LookupWT finds a WT shape: "WT6x20", "WT4x10.5".
func LookupWT(designation string) (Shape, error) { return lookupShape(designation, FamilyWT) }

// LookupC finds a channel, C or MC: "C8x11.5", "MC10x22".
func LookupC(designation string) (Shape, error) {
	return lookupShape(designation, FamilyC, FamilyMC)
}

// families is what a catalog family's name (engine.CatalogFamily) covers.
var families = map[string][]Family{"W": {FamilyW}, "WT": {FamilyWT}, "C or MC": {FamilyC, FamilyMC}}

// LookupIn finds a designation in the families a catalog family's name
// covers ("W", "WT", "C or MC"); a leading "2" (a pair: "2C8x11.5") is
// not part of it.
func LookupIn(family, designation string) (Shape, error) {
	fs, ok := families[family]
	if !ok {
		return Shape{}, fmt.Errorf("section: no catalog family %q", family)
	}
	return lookupShape(strings.TrimPrefix(strings.TrimSpace(designation), "2"), fs...)
}

// ShapeNamesIn lists the designations of a catalog family's name in
// catalog order.
func ShapeNamesIn(family string) []string {
	var names []string
	for _, f := range families[family] {
		names = append(names, ShapeNames(f)...)
	}
	return names
}

// lookupShape finds designation among the families fs. Case, spaces and
// the spelling of the separator ("x", "X", "×") do not matter.
func lookupShape(designation string, fs ...Family) (Shape, error) {
	norm := func(s string) string {
		s = strings.ToUpper(strings.ReplaceAll(s, "×", "x"))
		return strings.Join(strings.Fields(s), "")
	}
	want := norm(designation)
	e := &UnknownShapeError{Designation: designation, Families: fs}
	for _, s := range usShapes {
		for _, f := range fs {
			if s.fam != f {
				continue
			}
			if norm(s.name) == want || norm(s.si) == want {
				return s.shape(), nil
			}
			e.Known = append(e.Known, s.name+" ("+s.si+")")
		}
	}
	return Shape{}, e
}

// Properties computes the section properties from the geometry (see the
// package comment), except those the catalog carries from the table
// (ShapeProps.Carried). It panics on a shape that is not a valid one (a
// programmer's mistake: catalog shapes are valid).
func (s Shape) Properties() ShapeProps {
	p := s.Geometry()
	if s.XbarTab > 0 {
		p.Xbar = s.XbarTab
		p.Carried = append(p.Carried, "xbar")
	}
	if s.RyTab > 0 {
		p.Ry = s.RyTab
		p.Iy = float64(p.Area) * float64(s.RyTab) * float64(s.RyTab)
		p.Carried = append(p.Carried, "ry")
	}
	return p
}

// Geometry is the section properties from the geometry alone, ignoring
// the tabulated values the catalog carries. It panics as Properties does.
func (s Shape) Geometry() ShapeProps {
	if err := s.check(); err != nil {
		panic("section: " + err.Error())
	}
	d, bf, tw, tf := float64(s.D), float64(s.Bf), float64(s.Tw), float64(s.Tf)
	r := float64(s.K - s.Tf)
	var p part
	switch s.Family {
	case FamilyW:
		p = iShape(d, bf, tw, tf, r)
		p.cx += bf / 2 // measure x from a flange toe
	case FamilyWT:
		p = teeShape(d, bf, tw, tf, r)
		p.cx += bf / 2
	case FamilyC, FamilyMC:
		p = channelShape(d, bf, tw, tf, s.Slope)
	}
	return ShapeProps{
		Area: units.Area(p.a),
		Xbar: units.Length(p.cx), Ybar: units.Length(p.cy),
		Ix: p.ixx, Iy: p.iyy,
		Rx: units.Length(math.Sqrt(p.ixx / p.a)),
		Ry: units.Length(math.Sqrt(p.iyy / p.a)),
	}
}

// check reports why s is not a drawable shape.
func (s Shape) check() error {
	for _, v := range []units.Length{s.D, s.Bf, s.Tw, s.Tf} {
		if math.IsNaN(float64(v)) || math.IsInf(float64(v), 0) || v <= 0 {
			return fmt.Errorf("shape %q has a zero, negative or non-finite dimension", s.Name)
		}
	}
	flanges := s.Tf
	if s.Family == FamilyW || s.Family == FamilyC || s.Family == FamilyMC {
		flanges = 2 * s.Tf
	}
	switch {
	case s.Family < FamilyW || s.Family > FamilyMC:
		return fmt.Errorf("shape %q: unknown family %d", s.Name, int(s.Family))
	case s.Tw >= s.Bf || flanges >= s.D:
		return fmt.Errorf("shape %q: web or flanges as thick as the shape", s.Name)
	case (s.Family == FamilyW || s.Family == FamilyWT) && !(s.K >= s.Tf && 2*(s.K-s.Tf) <= s.Bf-s.Tw && s.K-s.Tf+flanges <= s.D):
		return fmt.Errorf("shape %q: kdes %g mm below tf or a fillet that does not fit", s.Name, float64(s.K))
	case !(s.Slope >= 0) || float64(s.Tf)-s.Slope*float64(s.Bf-s.Tw)/2 <= 0:
		return fmt.Errorf("shape %q: flange slope %g leaves no flange at the toe", s.Name, s.Slope)
	}
	return nil
}
