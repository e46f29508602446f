package engine

import (
	"fmt"
	"math"

	"gaugeline/rules/units"
)

// BearingRn is the nominal bearing and tearout strength of one bolt hole:
// rn = min(cb·d·t·Fu, ct·lc·t·Fu), with cb, ct from the edition (2.4 and
// 1.2 when deformation at service load is considered).
//
// Clause: J3.10 [J3.11]
func BearingRn(cb, ct float64, d, lc, t units.Length, Fu units.Stress) (bearing, tearout units.Force) {
	bearing = units.Force(cb) * Fu.Times(d.Mul(t))
	tearout = units.Force(ct) * Fu.Times(max(lc, 0).Mul(t))
	return bearing, tearout
}

// clearDistances returns lc for every hole: the clear distance, in the
// direction the part is pulled relative to the bolt (dir −1: toward −x; +1:
// toward +x), from the hole's edge to the edge of the next hole in its line
// of force or to the part's edge at x = edge. ply gives each hole's shape
// in the part (the member's or the plate's). A hole in the same row
// (within rowSlack along the load, as a measured hole a little off its row
// is) is beside the bolt, not ahead of it.
func clearDistances(holes []Hole, ply func(*Hole) HoleShape, dir float64, edge, rowSlack units.Length) []units.Length {
	lc := make([]units.Length, len(holes))
	for i := range holes {
		h, hs := &holes[i], ply(&holes[i])
		best := units.Length(dir*float64(edge-h.X)) - hs.Dx/2
		for j := range holes {
			if j == i {
				continue
			}
			o, osh := &holes[j], ply(&holes[j])
			ahead := units.Length(dir * float64(o.X-h.X))
			if ahead <= rowSlack || math.Abs(float64(o.Y-h.Y)) >= float64(max(hs.Dy, osh.Dy))/2 {
				continue
			}
			if d := ahead - (osh.Dx+hs.Dx)/2; d < best {
				best = d
			}
		}
		lc[i] = best
	}
	return lc
}

// memberPly and platePly give a hole's shape in the member and in the plate.
func memberPly(h *Hole) HoleShape { return h.HoleShape }
func platePly(h *Hole) HoleShape  { return h.InPlate() }

// bearingShares computes every hole's bearing and tearout in one part,
// each hole of the shape ply gives it in that part.
func bearingShares(c *Connection, ply func(*Hole) HoleShape, t units.Length, Fu units.Stress, dir float64, edge units.Length) []BoltShare {
	lcs := clearDistances(c.Holes, ply, dir, edge, LineSlack(c.Bolt.D))
	shares := make([]BoltShare, len(c.Holes))
	for i := range c.Holes {
		h := &c.Holes[i]
		hs := ply(h)
		cb, ct := c.Edition.BearingCoefficients(hs.Type, hs.Slot, c.Bolt.DeformationConsidered)
		b, tr := BearingRn(cb, ct, c.Bolt.D, lcs[i], t, Fu)
		s := BoltShare{Hole: h.ID, Lc: lcs[i], Bearing: b, Tearout: tr, Rn: b, Governed: "bearing"}
		if tr < b {
			s.Rn, s.Governed = tr, "tearout"
		}
		shares[i] = s
	}
	return shares
}

func bearingResult(c *Connection, id, part string, ply func(*Hole) HoleShape, t units.Length, Fu units.Stress, shares []BoltShare) Result {
	var Rn units.Force
	lcMin := units.Length(math.Inf(1))
	tear := 0
	for _, s := range shares {
		Rn += s.Rn
		lcMin = min(lcMin, s.Lc)
		if s.Governed == "tearout" {
			tear++
		}
	}
	cb, ct := 0.0, 0.0
	if len(c.Holes) > 0 {
		hs := ply(&c.Holes[0])
		cb, ct = c.Edition.BearingCoefficients(hs.Type, hs.Slot, c.Bolt.DeformationConsidered)
	}
	r := finish(c, id, "J3.10", Rn, c.Edition.BearingFactor(), []Value{
		{"d", float64(c.Bolt.D), units.DimLength},
		{"t", float64(t), units.DimLength},
		{"Fu", float64(Fu), units.DimStress},
		{"lc_min", float64(lcMin), units.DimLength},
		{"bearing_coefficient", cb, units.Dimensionless},
		{"tearout_coefficient", ct, units.Dimensionless},
		{"bolts", float64(len(shares)), units.Dimensionless},
	}, fmt.Sprintf("%s: sum over %d bolts of min(bearing, tearout); tearout governs %d", part, len(shares), tear))
	r.PerBolt = shares
	return r
}

// MemberBearing is bearing and tearout at the member's holes, lc measured
// toward the member end; both angles of a pair bear.
//
// Clause: J3.10 [J3.11]
func MemberBearing(c *Connection) Result {
	t := units.Length(c.Member.Pieces) * c.Member.T
	shares := bearingShares(c, memberPly, t, c.Member.Fu, -1, 0)
	return bearingResult(c, "member.bearing", "member, toward the member end", memberPly, t, c.Member.Fu, shares)
}

// PlateBearing is bearing and tearout at the plate's holes, lc measured
// toward the plate's free edge; coefficients and clear distances are the
// plate ply's holes' (Hole.InPlate).
//
// Clause: J3.10 [J3.11]
func PlateBearing(c *Connection) Result {
	p := c.Plate
	shares := bearingShares(c, platePly, p.T, p.Fu, 1, p.FreeEdge)
	return bearingResult(c, "plate.bearing", "plate, toward its free edge", platePly, p.T, p.Fu, shares)
}
