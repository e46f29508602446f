package section

import (
	"fmt"
	"math"
	"strconv"

	"gaugeline/rules/units"
)

// Angle is an angle section as it is connected: leg A bolted, leg B
// outstanding.
type Angle struct {
	Name   string       // canonical designation: "L4x4x1/2", "L3-1/2x2-1/2x1/4", "L100x100x10"
	System units.System // catalog it came from (zero, US, for Custom angles)
	A, B   units.Length // legs: A is the connected leg (catalog order: long leg first)
	T      units.Length // thickness
	R1     units.Length // root fillet radius
	R2     units.Length // toe radius
	K      units.Length // detailing k: heel to the end of the fillet on the leg's inner face

	tab tabulated // the published properties, for a US catalog angle (zero otherwise)
}

// Props are the section properties of one angle; see the package comment
// for the axes.
type Props struct {
	Area units.Area
	Xbar units.Length // centroid from the outer face of leg A, along leg B: x̄ when leg A is bolted
	Ybar units.Length // centroid from the outer face of leg B, along leg A
	Iaa  float64      // mm⁴, about the centroidal axis parallel to leg A
	Ibb  float64      // mm⁴, about the centroidal axis parallel to leg B
	Imin float64      // mm⁴, minor principal
	Rmin units.Length // least radius of gyration, √(Imin/Area) (rz, iv)
}

// DoubleProps are the properties of two angles back to back.
type DoubleProps struct {
	Area units.Area   // both angles
	Rx   units.Length // about the centroidal axis parallel to leg B, perpendicular to the plate
	Ry   units.Length // about the axis in the plate's mid-plane: grows with the gap
	Rmin units.Length // the smaller of Rx and Ry
}

// Custom is an angle of explicit legs and thickness, as a job may give it:
// a connected, b outstanding, thickness t; no radii, and K = t. Its Name is
// the millimetre designation prefixed "custom".
func Custom(a, b, t units.Length) (Angle, error) {
	for _, f := range []struct {
		name string
		v    units.Length
	}{{"connected leg", a}, {"outstanding leg", b}, {"thickness", t}} {
		if math.IsNaN(float64(f.v)) || math.IsInf(float64(f.v), 0) || f.v <= 0 {
			return Angle{}, fmt.Errorf("section: custom angle %s must be a positive length, got %g mm", f.name, float64(f.v))
		}
	}
	if t >= min(a, b) {
		return Angle{}, fmt.Errorf("section: custom angle thickness %g mm must be less than the shorter leg, %g mm", float64(t), float64(min(a, b)))
	}
	return Angle{
		Name: "custom L" + mm(a) + "x" + mm(b) + "x" + mm(t) + " mm",
		A:    a, B: b, T: t, K: t,
	}, nil
}

// mm prints a length in millimetres to the micrometre, without trailing zeros.
func mm(l units.Length) string {
	return strconv.FormatFloat(math.Round(float64(l)*1000)/1000, 'f', -1, 64)
}

// Swapped is the same angle with its legs exchanged, for connecting the
// other leg (usually the short one). Name and the radii are unchanged.
func (a Angle) Swapped() Angle {
	a.A, a.B = a.B, a.A
	a.tab.xbar, a.tab.ybar = a.tab.ybar, a.tab.xbar
	a.tab.rx, a.tab.ry = a.tab.ry, a.tab.rx
	return a
}

// Tabulated reports whether Properties are the published ones (a US
// catalog angle: AISC Shapes Database v15.0) rather than the geometry's.
func (a Angle) Tabulated() bool { return a.tab.area > 0 }

// Properties are the section properties: the published ones for a US
// catalog angle (see angle_table.go; Iaa, Ibb and Imin are the area times
// the radius squared), else the geometry's (Geometric). It panics on an
// angle that is not a valid shape (a programmer's mistake: catalog and
// Custom angles are valid).
func (a Angle) Properties() Props {
	if !a.Tabulated() {
		return a.Geometric()
	}
	if err := a.check(); err != nil {
		panic("section: " + err.Error())
	}
	in := float64(units.Inch)
	t := a.tab
	area := t.area * in * in
	return Props{
		Area: units.Area(area),
		Xbar: units.Length(t.xbar * in),
		Ybar: units.Length(t.ybar * in),
		// leg A is the database's vertical leg: the axis parallel to it
		// is y (ry), the one parallel to leg B is x (rx)
		Iaa:  area * t.ry * t.ry * in * in,
		Ibb:  area * t.rx * t.rx * in * in,
		Imin: area * t.rz * t.rz * in * in,
		Rmin: units.Length(t.rz * in),
	}
}

// Geometric computes the section properties from the geometry; see the
// package comment. It panics on an angle that is not a valid shape.
func (a Angle) Geometric() Props {
	if err := a.check(); err != nil {
		panic("section: " + err.Error())
	}
	p := angleShape(float64(a.A), float64(a.B), float64(a.T), float64(a.R1), float64(a.R2))
	imin := p.principalMin()
	return Props{
		Area: units.Area(p.a),
		Xbar: units.Length(p.cx),
		Ybar: units.Length(p.cy),
		Iaa:  p.iyy,
		Ibb:  p.ixx,
		Imin: imin,
		Rmin: units.Length(math.Sqrt(imin / p.a)),
	}
}

// check reports why a is not a drawable angle.
func (a Angle) check() error {
	for _, v := range []units.Length{a.A, a.B, a.T, a.R1, a.R2} {
		if math.IsNaN(float64(v)) || math.IsInf(float64(v), 0) || v < 0 {
			return fmt.Errorf("angle %q has a negative or non-finite dimension", a.Name)
		}
	}
	switch {
	case a.T <= 0 || a.T >= min(a.A, a.B):
		return fmt.Errorf("angle %q: thickness %g mm not in (0, shorter leg)", a.Name, float64(a.T))
	case a.R2 > a.T:
		return fmt.Errorf("angle %q: toe radius %g mm exceeds the thickness", a.Name, float64(a.R2))
	case a.T+a.R1+a.R2 > min(a.A, a.B):
		return fmt.Errorf("angle %q: fillet and toe radii overlap on the shorter leg", a.Name)
	}
	return nil
}

// Double gives the properties of two of a, back to back with legs A against
// a plate of thickness gap (AISC Manual Table 1-15 axes): Ry about the axis
// in the plate's mid-plane, Ry² = Iaa/A + (x̄ + gap/2)², and Rx about the
// axis perpendicular to it, the single angle's √(Ibb/A). It panics on a
// negative gap.
func (a Angle) Double(gap units.Length) DoubleProps {
	if !(gap >= 0) || math.IsInf(float64(gap), 0) {
		panic(fmt.Sprintf("section: Double: gap %g mm must be a finite length ≥ 0", float64(gap)))
	}
	p := a.Properties()
	area := float64(p.Area)
	d := float64(p.Xbar + gap/2)
	rx := units.Length(math.Sqrt(p.Ibb / area))
	ry := units.Length(math.Sqrt(p.Iaa/area + d*d))
	return DoubleProps{Area: 2 * p.Area, Rx: rx, Ry: ry, Rmin: min(rx, ry)}
}
