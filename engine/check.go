package engine

import "gaugeline/rules"

// Check computes every limit state of the connection, in a stable order:
// the member's (member.combined last, for a flat bar whose eccentric bolt
// group is provided for), the plate's (when there is one), then the
// bolts', the compression case's, and a splice's member B's where it has
// one of its own (member_b.*). A
// failing limit state is a result; the error reports a lookup the edition
// cannot answer (e.g. the pretension of a bolt grade that has none).
func Check(c *Connection) ([]Result, error) {
	out := make([]Result, 0, 12) // every limit state a connection can have
	out, mb := memberChecks(c, out)
	var plateShares []BoltShare
	if c.Plate != nil {
		pb := PlateBearing(c)
		plateShares = pb.PerBolt
		out = append(out, PlateYield(c), PlateRupture(c), PlateBlockShear(c), pb)
	}
	out = append(out, BoltShear(c))
	if c.Bolt.Joint == rules.SlipCritical {
		s, err := BoltSlip(c)
		if err != nil {
			return nil, err
		}
		out = append(out, s)
	}
	out = append(out, BoltGroup(c, mb.PerBolt, plateShares))
	if c.Compression > 0 && c.Member.Strut != nil {
		out = append(out, compressionChecks(c)...)
	}
	out = append(out, memberBChecks(c, plateShares)...)
	return out, nil
}

// memberChecks appends the member's own limit states to out: yielding,
// rupture, block shear, bearing (returned too, for the bolt group) and a
// flat's combined check where it applies.
func memberChecks(c *Connection, out []Result) ([]Result, Result) {
	mb := MemberBearing(c)
	out = append(out, MemberYield(c), MemberRupture(c), MemberBlockShear(c), mb)
	if needsCombined(c) {
		out = append(out, MemberCombined(c))
	}
	return out, mb
}

// Governing returns the index of the result with the highest ratio; ties
// go to the earlier result, so the bolt-group check governs only when it
// is strictly stricter than the separate checks. It returns -1 for none.
func Governing(rs []Result) int {
	g := -1
	for i, r := range rs {
		if g < 0 || r.Ratio > rs[g].Ratio*(1+1e-9) {
			g = i
		}
	}
	return g
}
