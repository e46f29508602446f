package engine

import (
	"strings"

	"gaugeline/engine/netsection"
)

// A splice joins two members end to end: member A is the connection's
// member, its end at x = 0 and its holes at x > 0; member B lies beyond
// the joint, its end at x = −Plate.Gap, and the splice plate carries both
// members' hole groups, B's mirrored about the joint. B's group is A's
// mirrored, so the plate's bearing and block shear at B's group are those
// at A's (the mirror image). Member B is Member again unless
// Connection.MemberB gives it a section of its own (a chord whose section
// changes at the splice): then member B's own limit states are checked on
// that section with the same group in its own frame (memberBChecks),
// named member_b.*. What the two groups share is the plate's net section,
// which the path search takes across both (platePathHoles).

// MemberBSide is the connection as member B sees it: member B in the
// member's place, in its own frame (its end at x = 0: by the mirror its
// holes are the member's), with no member B of its own. Nil unless the
// connection has a MemberB.
func (c *Connection) MemberBSide() *Connection {
	if c.MemberB == nil {
		return nil
	}
	b := *c
	b.Member, b.MemberB = *c.MemberB, nil
	return &b
}

// MemberBID is the id of a limit state of member B's side of a splice
// where member_b gives it a section of its own: member.* becomes
// member_b.*, bolts.group* gets ".member_b"; any other (the plate's, the
// bolts' shear) is the same as the member's side.
func MemberBID(id string) string {
	if rest, ok := strings.CutPrefix(id, "member."); ok {
		return "member_b." + rest
	}
	if strings.HasPrefix(id, "bolts.group") {
		return id + ".member_b"
	}
	return id
}

// memberBChecks are member B's own limit states, where it has a section of
// its own: the member's (yielding, rupture, block shear, bearing, a flat's
// combined check), the bolt group with B's bearing and the plate's at B's
// group (plateShares: the mirror of A's), and, when the members push, B's
// buckling, bearing and bolt group in compression. IDs member.* become
// member_b.*, bolts.* get ".member_b"; each note starts "member B: ".
func memberBChecks(c *Connection, plateShares []BoltShare) []Result {
	b := c.MemberBSide()
	if b == nil {
		return nil
	}
	out, mb := memberChecks(b, nil)
	out = append(out, BoltGroup(b, mb.PerBolt, plateShares))
	if b.Compression > 0 && b.Member.Strut != nil {
		var plate []BoltShare
		if b.Plate != nil {
			plate = PlateBearingCompression(b).PerBolt
		}
		mbc := MemberBearingCompression(b)
		out = append(out, MemberCompression(b), mbc, compressionCase(b, BoltGroup(b, mbc.PerBolt, plate), "bolts.group.compression"))
	}
	for i := range out {
		r := &out[i]
		r.ID = MemberBID(r.ID)
		r.Note = "member B: " + r.Note
		if ex := r.explain; ex != nil {
			r.explain = func() Working {
				w := ex()
				w.Title = "Member B (beyond the joint): " + w.Title
				return w
			}
		}
	}
	return out
}

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
