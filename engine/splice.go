package engine

import "gaugeline/engine/netsection"

// A splice joins two members end to end: member A is the connection's
// member, its end at x = 0 and its holes at x > 0; member B lies beyond
// the joint, its end at x = −Plate.Gap, and the splice plate carries both
// members' hole groups, B's mirrored about the joint. The job describes
// one member, so member B is the same section with the same group: every
// limit state of member A holds for member B, and the plate's bearing and
// block shear at B's group are those at A's (the mirror image). What the
// two groups share is the plate's net section, which the path search
// takes across both (platePathHoles).

// SpliceHoles returns member B's holes in the member frame: each of
// member A's mirrored about the joint, x_B = −Gap − x (B's end at −Gap),
// the same y, the same shape in each ply. IDs are A's prefixed with "B".
// It returns nil unless the plate is a splice.
func SpliceHoles(c *Connection) []Hole {
	p := c.Plate
	if p == nil || p.Kind != Splice {
		return nil
	}
	out := make([]Hole, len(c.Holes))
	for i, h := range c.Holes {
		h.ID = "B" + h.ID
		h.X = -p.Gap - h.X
		out[i] = h
	}
	return out
}

// platePathHoles are the holes the plate's net section may run through:
// the plate's ply of every hole, and for a splice member B's group too.
//
// For a splice the search across both groups gives one group's worst
// path: the path is a chain of holes in increasing y, and replacing each
// of its B holes by its mirror image in A keeps every gage g and never
// lengthens a stagger s (between an A hole at xa > 0 and a B hole at
// −gap − xb, s = xa + xb + gap ≥ |xa − xb|), so no chain through both
// groups deducts more than a chain through A's alone
// (TestSpliceNetPathIsOneGroups). Both are searched anyway: it costs
// little and stays true when member B's group is not A's mirror (a splice
// of two different members, left for later).
func platePathHoles(c *Connection) []netsection.PathHole {
	ph := pathHoles(c, platePly)
	if b := SpliceHoles(c); b != nil {
		ph = append(ph, pathHoles(&Connection{Edition: c.Edition, Holes: b}, platePly)...)
	}
	return ph
}
