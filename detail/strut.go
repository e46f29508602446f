package detail

import (
	"math"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// The member as a strut (engine.Strut): what Chapter E asks of it when the
// job's loads push it, from the section's geometry. Table B4.1a's cases
// for the elements' λr = Lr·√(E/Fy): case 1 (flanges of rolled I shapes,
// channels and tees) 0.56, case 3 (legs of single angles and of double
// angles with separators) 0.45, case 4 (stems of tees) 0.75, case 5 (webs
// of I shapes and channels, stiffened) 1.49.
const (
	lrFlange = 0.56
	lrLeg    = 0.45
	lrStem   = 0.75
	lrWeb    = 1.49
)

// strutBase is the strut's length and effective length factor.
func (j job) strutBase() engine.Strut {
	k := j.Member.Buckling.K
	if k == 0 {
		k = jobfile.DefaultMemberK
	}
	return engine.Strut{L: j.Member.Length, K: k}
}

// flatStrut: a bar buckles about its weak axis (r = t/√12) or in its
// plane (w/√12); no element of Table B4.1a.
func (j job) flatStrut(w, t units.Length) *engine.Strut {
	s := j.strutBase()
	s.Kind = engine.StrutFlexural
	s.Rx, s.Ry = w/units.Length(math.Sqrt(12)), t/units.Length(math.Sqrt(12))
	return &s
}

// angleStrut: a single angle by E5 (ra about the geometric axis parallel
// to the connected leg, rz the least), or two back to back, singly
// symmetric about the axis in the plate's mid-plane (E4), E6 between the
// connectors; the shear centre at the outstanding legs' mid-thickness, J
// of the legs' centre lines, Cw taken as 0 (tees and double angles).
func (j job) angleStrut(a section.Angle, props section.Props, pieces int) *engine.Strut {
	s := j.strutBase()
	area := float64(props.Area)
	legs := []engine.Element{
		{Name: "connected leg", B: a.A, T: a.T, Count: pieces, Lr: lrLeg},
		{Name: "outstanding leg", B: a.B, T: a.T, Count: pieces, Lr: lrLeg},
	}
	s.Elements = legs
	if pieces == 1 {
		s.Kind = engine.StrutAngle
		s.Ra, s.Rz = units.Length(math.Sqrt(props.Iaa/area)), props.Rmin
		s.Connected, s.Outstanding = a.A, a.B
		s.Rx, s.Ry = units.Length(math.Sqrt(props.Ibb/area)), s.Ra
		s.Space = j.Member.Buckling.Space
		return &s
	}
	dp := a.Double(j.gap())
	s.Kind = engine.StrutSinglySymmetric
	s.Rx, s.Ry = dp.Rx, dp.Ry
	s.Yo = props.Ybar - a.T/2
	t := float64(a.T)
	s.J = float64(pieces) * float64(a.A+a.B-a.T) * t * t * t / 3
	s.BuiltUp, s.Connectors, s.Ri, s.Ki = true, j.Member.Buckling.Connectors, props.Rmin, 0.50
	s.SnugTight = !j.Member.Buckling.ConnectorTight
	return &s
}

// rolledStrut is the strut of a rolled section, by its shape.
func (j job) rolledStrut(sh section.Shape, props section.ShapeProps) *engine.Strut {
	s := j.strutBase()
	flanges := func(n int, b units.Length) engine.Element {
		return engine.Element{Name: "flange", B: b, T: sh.Tf, Count: n, Lr: lrFlange}
	}
	web := engine.Element{Name: "web", B: sh.D - 2*sh.K, T: sh.Tw, Count: 1, Lr: lrWeb, Stiffened: true}
	tf, tw := float64(sh.Tf), float64(sh.Tw)
	switch j.Member.Shape {
	case engine.Tee:
		// singly symmetric about the stem's axis y; shear centre at the
		// flange's mid-thickness; Cw taken as 0
		s.Kind = engine.StrutSinglySymmetric
		s.Rx, s.Ry = props.Rx, props.Ry
		s.Yo = props.Ybar - sh.Tf/2
		s.J = (float64(sh.Bf)*tf*tf*tf + float64(sh.D-sh.Tf)*tw*tw*tw) / 3
		s.Elements = []engine.Element{flanges(2, sh.Bf/2), {Name: "stem", B: sh.D, T: sh.Tw, Count: 1, Lr: lrStem}}
	case engine.Channel:
		// singly symmetric about its strong axis (y here), the shear centre
		// eo past the web's centre line: eo, Cw and J of the thin-walled
		// section (b' = bf − tw/2, h' = d − tf)
		b, h := float64(sh.Bf-sh.Tw/2), float64(sh.D-sh.Tf)
		ix := float64(props.Area) * float64(props.Rx*props.Rx)
		eo := b * b * h * h * tf / (4 * ix)
		s.Kind = engine.StrutSinglySymmetric
		s.Rx, s.Ry = props.Ry, props.Rx
		s.Yo = props.Xbar - sh.Tw/2 + units.Length(eo)
		s.Cw = tf * b * b * b * h * h / 12 * (3*b*tf + 2*h*tw) / (6*b*tf + h*tw)
		s.J = (2*float64(sh.Bf)*tf*tf*tf + h*tw*tw*tw) / 3
		s.Elements = []engine.Element{flanges(2, sh.Bf), web}
	case engine.DoubleChannel:
		// two channels back to back: flexural about the strong axis, and
		// about the axis in the plate's mid-plane with E6 between the
		// connectors; and the doubly symmetric pair's torsional buckling
		// (E4-4), the pair taken as one section by its connectors: J of
		// both channels, Cw = Iy·ho²/4 with the pair's Iy about the plate's
		// mid-plane, as for a W (the flanges of both channels on each side
		// forming one flange; the webs, on the axis, add little)
		off := float64(props.Xbar + j.gap()/2)
		s.Kind = engine.StrutFlexural
		s.Rx, s.Ry = props.Rx, units.Length(math.Sqrt(float64(props.Ry*props.Ry)+off*off))
		ho := float64(sh.D - sh.Tf)
		s.Cw = 2 * float64(props.Area) * float64(s.Ry*s.Ry) * ho * ho / 4
		s.J = 2 * (2*float64(sh.Bf)*tf*tf*tf + ho*tw*tw*tw) / 3 // each channel's, as above
		s.BuiltUp, s.Connectors, s.Ri, s.Ki = true, j.Member.Buckling.Connectors, props.Ry, 0.75
		s.SnugTight = !j.Member.Buckling.ConnectorTight
		web.Count = 2
		s.Elements = []engine.Element{flanges(4, sh.Bf), web}
	default: // W: flexural about both axes, torsional (E4-4) with Cw = Iy·ho²/4
		s.Kind = engine.StrutFlexural
		s.Rx, s.Ry = props.Rx, props.Ry
		ho := float64(sh.D - sh.Tf)
		iy := float64(props.Area) * float64(props.Ry*props.Ry)
		s.Cw = iy * ho * ho / 4
		s.J = (2*float64(sh.Bf)*tf*tf*tf + float64(sh.D-2*sh.Tf)*tw*tw*tw) / 3
		s.Elements = []engine.Element{flanges(4, sh.Bf/2), web}
	}
	return &s
}
