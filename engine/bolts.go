package engine

import (
	"fmt"
	"math"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// BoltArea is the nominal unthreaded body area Ab = π·d²/4.
func BoltArea(d units.Length) units.Area { return units.Area(math.Pi / 4 * float64(d*d)) }

// patternLength is the extent of the bolt group along the load.
func patternLength(holes []Hole) units.Length {
	if len(holes) == 0 {
		return 0
	}
	xmin, xmax := holes[0].X, holes[0].X
	for _, h := range holes {
		xmin, xmax = min(xmin, h.X), max(xmax, h.X)
	}
	return xmax - xmin
}

// boltShearFnv returns Fnv with the long-joint reduction applied and that
// reduction (1 when none).
func boltShearFnv(c *Connection) (units.Stress, float64) {
	Fnv := c.Bolt.Grade.Fnv(c.Bolt.Threads)
	limit, f := c.Edition.LongJoint()
	if patternLength(c.Holes) > limit+eps {
		return Fnv * units.Stress(f), f
	}
	return Fnv, 1
}

// fillerFactor is the J5.2 multiplier of the bolts' shear strength and a
// note saying why: J5.2(a) for fillers over 1/4 in (6 mm) that are not
// developed, 1 for developed fillers (J5.2(b)), thin fillers or none. It
// applies in every joint type: a slip-critical joint is also designed for
// the limit states of bearing-type connections (J3.8 [J3.9]), and its slip
// resistance takes hf instead.
func fillerFactor(c *Connection) (float64, string) {
	b := c.Bolt
	t := units.FormatJob(b.FillerT, c.Edition.System)
	switch {
	case b.FillerT > 0 && b.FillerDeveloped:
		return 1, fmt.Sprintf("fillers %s, developed (J5.2(b)): no reduction", t)
	case b.FillerT > 0:
		k := c.Edition.FillerFactor(b.FillerT)
		if k == 1 {
			return 1, fmt.Sprintf("fillers %s: no reduction (J5.2)", t)
		}
		return k, fmt.Sprintf("fillers %s, not developed: shear × %.4g (J5.2(a))", t, k)
	case b.Fillers > 0:
		return 1, "filler thickness not given: no J5.2 reduction taken"
	}
	return 1, ""
}

// BoltShear is the shear rupture of the bolts: Rn = Fnv·Ab per shear
// plane, summed over the bolts; Fnv is reduced to 83.3 % when an
// end-loaded pattern is longer than 38 in (950 mm), and the strength is
// multiplied by the filler factor of J5.2(a) when the bolts pass through
// undeveloped fillers over 1/4 in (6 mm) thick.
//
// Clause: J3.6 [J3.7], J5.2
func BoltShear(c *Connection) Result {
	Fnv, f := boltShearFnv(c)
	ff, why := fillerFactor(c)
	Ab := BoltArea(c.Bolt.D)
	n, ns := len(c.Holes), c.ShearPlanes()
	Rn := Fnv.Times(Ab) * units.Force(float64(n*ns)*ff)
	note := fmt.Sprintf("%d bolts × %d shear plane(s), threads %s", n, ns, c.Bolt.Threads)
	if why != "" {
		note += "; " + why
	}
	r := finish(c, "bolts.shear", "J3.6", Rn, c.Edition.BoltShearFactor(), []Value{
		{"Fnv", float64(Fnv), units.DimStress},
		{"Ab", float64(Ab), units.DimArea},
		{"n", float64(n), units.Dimensionless},
		{"planes", float64(ns), units.Dimensionless},
		{"long_joint_factor", f, units.Dimensionless},
		{"pattern_length", float64(patternLength(c.Holes)), units.DimLength},
		{"filler_factor", ff, units.Dimensionless},
		{"filler_t", float64(c.Bolt.FillerT), units.DimLength},
	}, note)
	if ff < 1 {
		r.Clause += ", " + c.Edition.Clause("J5.2")
	}
	return r
}

// BoltSlip is the slip resistance of a slip-critical joint:
// Rn = μ·Du·hf·Tb·ns per bolt, summed over the bolts; φ and Ω by hole
// type, the most severe hole type present in either ply governing (J3.8
// gives φ and Ω by hole type without naming a ply; a long slot in the
// plate lets the joint slip as one in the member does).
//
// Clause: J3.8 [J3.9]
func BoltSlip(c *Connection) (Result, error) {
	e := c.Edition
	Tb, err := e.Pretension(c.Bolt.Grade, c.Bolt.D)
	if err != nil {
		return Result{}, err
	}
	mu, Du, hf := e.Mu(c.Bolt.Surface), e.Du(), e.Hf(c.Bolt.Fillers)
	ns, n := c.ShearPlanes(), len(c.Holes)
	f := rules.Factor{Phi: math.Inf(1)}
	for i := range c.Holes {
		h := &c.Holes[i]
		for _, hs := range [...]HoleShape{h.HoleShape, h.InPlate()} {
			if hf := e.SlipFactor(hs.Type, hs.Slot); hf.Phi < f.Phi {
				f = hf
			}
		}
	}
	if n == 0 {
		f = e.SlipFactor(rules.Standard, rules.Transverse)
	}
	Rn := units.Force(mu*Du*hf*float64(ns)*float64(n)) * Tb
	return finish(c, "bolts.slip", "J3.8", Rn, f, []Value{
		{"mu", mu, units.Dimensionless},
		{"Du", Du, units.Dimensionless},
		{"hf", hf, units.Dimensionless},
		{"Tb", float64(Tb), units.DimForce},
		{"ns", float64(ns), units.Dimensionless},
		{"n", float64(n), units.Dimensionless},
		{"phi", f.Phi, units.Dimensionless},
		{"omega", f.Omega, units.Dimensionless},
	}, fmt.Sprintf("class %s surface, %d slip plane(s)", c.Bolt.Surface, ns)), nil
}

// BoltGroup is the strength of the bolt group taken bolt by bolt: each
// bolt gives the least of its shear strength and the bearing or tearout
// strength of its hole in the member and in the plate, and the group is
// the sum. It is never weaker than the separate sums and governs only when
// a hole's tearout is below the bolt's shear strength while another's is
// above it.
//
// Clause: J3.6, J3.10 [J3.7, J3.11]
func BoltGroup(c *Connection, member, plate []BoltShare) Result {
	Fnv, _ := boltShearFnv(c)
	ff, _ := fillerFactor(c)
	shear := Fnv.Times(BoltArea(c.Bolt.D)) * units.Force(float64(c.ShearPlanes())*ff)
	var Rn units.Force
	governs := map[string]int{}
	for i := range c.Holes {
		rn, by := shear, "bolt shear"
		if member[i].Rn < rn {
			rn, by = member[i].Rn, "member "+member[i].Governed
		}
		if plate != nil && plate[i].Rn < rn {
			rn, by = plate[i].Rn, "plate "+plate[i].Governed
		}
		governs[by]++
		Rn += rn
	}
	// bolt shear and bearing share φ = 0.75 and Ω = 2.00 (J3.6, J3.10)
	r := finish(c, "bolts.group", "J3.6", Rn, c.Edition.BoltShearFactor(), []Value{
		{"rn_shear", float64(shear), units.DimForce},
		{"n", float64(len(c.Holes)), units.Dimensionless},
		{"filler_factor", ff, units.Dimensionless},
	}, fmt.Sprintf("per bolt the least of shear, member and plate bearing/tearout; %s", describeCounts(governs)))
	r.Clause = c.Edition.Clause("J3.6") + ", " + c.Edition.Clause("J3.10")
	if ff < 1 {
		r.Clause += ", " + c.Edition.Clause("J5.2")
	}
	return r
}

func describeCounts(m map[string]int) string {
	keys := []string{"bolt shear", "member bearing", "member tearout", "plate bearing", "plate tearout"}
	s := ""
	for _, k := range keys {
		if m[k] > 0 {
			if s != "" {
				s += ", "
			}
			s += fmt.Sprintf("%s governs %d", k, m[k])
		}
	}
	return s
}
