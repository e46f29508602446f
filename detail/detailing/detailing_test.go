package detailing

import (
	"math"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Table lookups are exact: values are compared in the job's units to 1e-9
// (only the inch/mm conversion rounds). Derived ratios quoted to four
// significant figures are compared to half a unit of the last digit.
const exact = 1e-9

func in(v float64) units.Length { return units.Length(v) * units.Inch }
func mm(v float64) units.Length { return units.Length(v) }

func edition(t *testing.T, name string, sys units.System) *rules.Edition {
	t.Helper()
	ed, err := rules.Lookup(name, sys)
	if err != nil {
		t.Fatalf("rules.Lookup(%q): %v", name, err)
	}
	return ed
}

// layout describes a bolt pattern: lines gage lines from y = gage, pitch
// apart along x from x = end, every hole of one type.
type layout struct {
	d          units.Length
	joint      rules.Joint
	hole       rules.HoleType
	slot       rules.SlotDir
	end, pitch units.Length
	perLine    int
	gages      []units.Length // y of each gage line
}

// holes returns the pattern's holes at their Table J3.3 nominal sizes.
func (l layout) holes(t *testing.T, ed *rules.Edition) []engine.Hole {
	t.Helper()
	size, err := ed.Hole(l.d, l.hole)
	if err != nil {
		t.Fatalf("Hole: %v", err)
	}
	dx, dy := size.Width, size.Width
	if l.hole.IsSlot() {
		if l.slot == rules.Longitudinal {
			dx = size.Length
		} else {
			dy = size.Length
		}
	}
	var hs []engine.Hole
	for _, y := range l.gages {
		for k := range l.perLine {
			hs = append(hs, engine.Hole{
				ID: "H" + strconv.Itoa(len(hs)+1),
				X:  l.end + units.Length(k)*l.pitch, Y: y,
				HoleShape: engine.HoleShape{Type: l.hole, Slot: l.slot, Dx: dx, Dy: dy},
			})
		}
	}
	return hs
}

// flat is a flat bar of width w and thickness t alone (no plate).
func flat(t *testing.T, ed *rules.Edition, w, th units.Length, l layout) *engine.Connection {
	return &engine.Connection{
		Edition: ed,
		Member:  engine.Member{Shape: engine.Flat, Width: w, T: th, Pieces: 1},
		Bolt:    engine.Bolt{D: l.d, Joint: l.joint},
		Holes:   l.holes(t, ed),
	}
}

// l4x4 is an L4x4x1/2 (AISC Manual Table 1-7) with its 4-in leg bolted.
func l4x4(t *testing.T, ed *rules.Edition, l layout) *engine.Connection {
	return &engine.Connection{
		Edition: ed,
		Member:  engine.Member{Shape: engine.Angle, Width: in(4), Outstanding: in(4), T: in(0.5), Pieces: 1},
		Bolt:    engine.Bolt{D: l.d, Joint: l.joint},
		Holes:   l.holes(t, ed),
	}
}

// withPlate adds a plate of thickness th and width w centred on the member
// width, its free edge e beyond the last bolt.
func withPlate(c *engine.Connection, th, w, e units.Length) *engine.Connection {
	last := units.Length(0)
	for _, h := range c.Holes {
		last = max(last, h.X)
	}
	c.Plate = &engine.Plate{Kind: engine.Gusset, T: th, Width: w, FreeEdge: last + e, YCentre: c.Member.Width / 2}
	return c
}

// splice makes the connection's plate a splice plate.
func splice(c *engine.Connection) *engine.Connection {
	c.Plate.Kind = engine.Splice
	return c
}

// want is one expected finding, found by id and where (a refusal's
// explanation may follow where after ": "); measured and limit in the
// job's units. absent: no finding with this id and where may exist.
type want struct {
	id, where       string
	measured, limit float64
	pass            bool
	advisory        bool
	absent          bool
	tol             float64 // 0: exact
}

func find(fs []Finding, id, where string) (Finding, bool) {
	for _, f := range fs {
		if f.ID == id && (f.Where == where || strings.HasPrefix(f.Where, where+": ")) {
			return f, true
		}
	}
	return Finding{}, false
}

func TestDetailing(t *testing.T) {
	us22 := edition(t, "aisc360-22", units.US)
	us16 := edition(t, "aisc360-16", units.US)
	si16 := edition(t, "aisc360-16", units.SI)

	// One line of 3/4-in bolts, 3-in pitch, 2 in from the edge of a 4-in flat.
	line := func(end units.Length) layout {
		return layout{d: in(0.75), joint: rules.Bearing, hole: rules.Standard,
			end: end, pitch: in(3), perLine: 2, gages: []units.Length{in(2)}}
	}
	oversized := line(in(1 + 1.0/16))
	oversized.hole, oversized.joint = rules.Oversized, rules.SlipCritical
	overBearing := oversized
	overBearing.joint = rules.Bearing
	pitched := func(p units.Length) layout { l := line(in(1.5)); l.pitch = p; return l }
	// L4x4x1/2 at the workable gage of a 4-in leg, 2-1/2 in (common practice,
	// from memory), with transverse short slots.
	slotted := func(g units.Length) layout {
		return layout{d: in(0.75), joint: rules.Bearing, hole: rules.ShortSlot, slot: rules.Transverse,
			end: in(1), pitch: in(3), perLine: 4, gages: []units.Length{g}}
	}
	// Two gage lines 2-1/2 in apart of transverse long slots, one bolt each.
	longSlots := layout{d: in(0.75), joint: rules.Bearing, hole: rules.LongSlot, slot: rules.Transverse,
		end: in(1.5), pitch: in(3), perLine: 1, gages: []units.Length{in(1.75), in(4.25)}}
	// One line of two 3/4-in bolts (M20 in SI) at y = g.
	centred := func(g units.Length) layout {
		return layout{d: in(0.75), joint: rules.Bearing, hole: rules.Standard,
			end: in(1.5), pitch: in(3), perLine: 2, gages: []units.Length{g}}
	}
	centredSI := func(g units.Length) layout {
		return layout{d: mm(20), joint: rules.Bearing, hole: rules.Standard,
			end: mm(40), pitch: mm(75), perLine: 2, gages: []units.Length{g}}
	}
	angle := func(g units.Length) layout {
		return layout{d: in(0.75), joint: rules.Bearing, hole: rules.Standard,
			end: in(1.5), pitch: in(3), perLine: 4, gages: []units.Length{g}}
	}

	tests := []struct {
		name string
		conn *engine.Connection
		info MemberInfo
		want []want
		src  string
	}{
		{
			name: "end 1 in passes for a 3/4-in bolt",
			conn: flat(t, us22, in(4), in(0.5), line(in(1))),
			want: []want{
				{id: "edge.min", where: "H1 to member end", measured: 1, limit: 1, pass: true},
				{id: "edge.min", where: "H1 to member edge (y = 0)", measured: 2, limit: 1, pass: true},
				{id: "edge.min", where: "H1 to member edge (y = width)", measured: 2, limit: 1, pass: true},
				{id: "hole.size", where: "H1 (largest standard hole)", measured: 13.0 / 16, limit: 13.0 / 16, pass: true},
				{id: "hole.type", where: "standard holes in a bearing joint", pass: true},
				{id: "gage.workable", where: "H1 to fillet (k)", absent: true},
			},
			src: "AISC 360-16 Table J3.4: 3/4-in bolt, min edge 1 in; AISC 360-22 Table J3.3: 3/4-in bolt, standard hole 13/16 in",
		},
		{
			name: "end 15/16 in fails for a 3/4-in bolt",
			conn: flat(t, us22, in(4), in(0.5), line(in(15.0/16))),
			want: []want{
				{id: "edge.min", where: "H1 to member end", measured: 15.0 / 16, limit: 1, pass: false},
			},
			src: "AISC 360-16 Table J3.4: 3/4-in bolt, min edge 1 in",
		},
		{
			name: "SI: M20 end 26 mm passes",
			conn: flat(t, si16, mm(100), mm(12), layout{d: mm(20), joint: rules.Bearing, hole: rules.Standard,
				end: mm(26), pitch: mm(75), perLine: 2, gages: []units.Length{mm(50)}}),
			want: []want{
				{id: "edge.min", where: "H1 to member end", measured: 26, limit: 26, pass: true},
				{id: "hole.size", where: "H1 (largest standard hole)", measured: 22, limit: 22, pass: true},
			},
			src: "AISC 360-16 Table J3.4M: M20, min edge 26 mm; Table J3.3M: M20 standard hole 22 mm",
		},
		{
			name: "oversized holes take C2 at every edge",
			conn: flat(t, us22, in(4), in(0.5), oversized),
			want: []want{
				{id: "edge.min", where: "H1 to member end", measured: 1 + 1.0/16, limit: 1 + 1.0/16, pass: true},
				{id: "edge.min", where: "H1 to member edge (y = 0)", measured: 2, limit: 1 + 1.0/16, pass: true},
				{id: "hole.type", where: "oversized holes in a slip-critical joint", pass: true},
				{id: "hole.size", where: "H1 (largest oversized hole)", measured: 15.0 / 16, limit: 15.0 / 16, pass: true},
			},
			src: "AISC 360-16 Table J3.4: 1 in; AISC 360-22 Table J3.5: C2 oversized 1/16 in (d ≤ 7/8); Table J3.3: oversized 15/16 in",
		},
		{
			name: "oversized holes rejected in a bearing joint",
			conn: flat(t, us22, in(4), in(0.5), overBearing),
			want: []want{
				{id: "hole.type", where: "oversized holes in a bearing joint", pass: false},
			},
			src: "AISC 360-22 J3.3: oversized holes only in slip-critical joints",
		},
		{
			name: "pitch 2 in meets 2-2/3·d",
			conn: flat(t, us22, in(4), in(0.5), pitched(in(2))),
			want: []want{
				{id: "spacing.min", where: "H1–H2", measured: 2, limit: 2, pass: true},
				// Clear distance between standard holes: 2 − 13/16 = 1-3/16 ≥ d.
				{id: "spacing.min", where: "H1–H2 (clear distance)", measured: 2 - 13.0/16, limit: 0.75, pass: true},
			},
			src: "AISC 360-22 J3.4: 2-2/3·(3/4) = 2.0 in, clear distance ≥ d; Table J3.3: 13/16-in hole",
		},
		{
			name: "pitch 1-15/16 in fails 2-2/3·d",
			conn: flat(t, us22, in(4), in(0.5), pitched(in(1+15.0/16))),
			want: []want{
				{id: "spacing.min", where: "H1–H2", measured: 1 + 15.0/16, limit: 2, pass: false},
			},
			src: "AISC 360-22 J3.4: 2-2/3·(3/4) = 2.0 in",
		},
		{
			name: "360-22 clear distance fires for long slots that pass 2-2/3·d",
			conn: flat(t, us22, in(6), in(0.5), longSlots),
			want: []want{
				{id: "spacing.min", where: "H1–H2", measured: 2.5, limit: 2, pass: true},
				// Slots 13/16 × 1-7/8 along y: 2.5 − (1-7/8 − 13/16) − 13/16 = 0.625.
				{id: "spacing.min", where: "H1–H2 (clear distance)", measured: 0.625, limit: 0.75, pass: false},
				{id: "hole.type", where: "transverse long-slot holes in a bearing joint", pass: true},
				{id: "hole.type", where: "long-slot holes", pass: true, advisory: true},
				{id: "hole.size", where: "H1 along the slot (largest long-slot hole)", measured: 1 + 7.0/8, limit: 1 + 7.0/8, pass: true},
				// Long slot ⊥ side edge: 1 + 0.75·(3/4) = 1.5625; ∥ end: 1.
				{id: "edge.min", where: "H1 to member edge (y = 0)", measured: 1.75, limit: 1.5625, pass: true},
				{id: "edge.min", where: "H1 to member end", measured: 1.5, limit: 1, pass: true},
			},
			src: "AISC 360-22 J3.4 (clear distance ≥ d), Table J3.3 (long slot 13/16 × 1-7/8), Table J3.5 (C2 = 0.75d)",
		},
		{
			name: "360-16 has no clear-distance rule",
			conn: flat(t, us16, in(6), in(0.5), longSlots),
			want: []want{
				{id: "spacing.min", where: "H1–H2", measured: 2.5, limit: 2, pass: true},
				{id: "spacing.min", where: "H1–H2 (clear distance)", absent: true},
			},
			src: "AISC 360-16 J3.3: 2-2/3·d only",
		},
		{
			name: "transverse short slot: C2 at the toe, none at the end",
			conn: l4x4(t, us22, slotted(in(2+15.0/16))),
			want: []want{
				{id: "edge.min", where: "H1 to member end", measured: 1, limit: 1, pass: true},
				{id: "edge.min", where: "H1 to member toe", measured: 1 + 1.0/16, limit: 1 + 1.0/8, pass: false},
			},
			src: "AISC 360-16 Table J3.4: 1 in; AISC 360-22 Table J3.5: short slot ⊥ edge, C2 = 1/8 in (d ≤ 7/8); slots ∥ edge C2 = 0",
		},
		{
			name: "max edge 12t = 6 in passes",
			conn: flat(t, us22, in(4), in(0.5), line(in(6))),
			want: []want{
				{id: "edge.max", where: "H1 to member end", measured: 6, limit: 6, pass: true},
				{id: "edge.max", where: "H1 to member edge (y = 0)", measured: 2, limit: 6, pass: true},
			},
			src: "AISC 360-22 J3.6: 12·(1/2) = 6 in",
		},
		{
			name: "max edge 6-1/16 in fails",
			conn: flat(t, us22, in(4), in(0.5), line(in(6+1.0/16))),
			want: []want{
				{id: "edge.max", where: "H1 to member end", measured: 6 + 1.0/16, limit: 6, pass: false},
			},
			src: "AISC 360-22 J3.6: 12·(1/2) = 6 in",
		},
		{
			name: "max edge capped at 6 in",
			conn: flat(t, us22, in(4), in(0.75), line(in(1.5))),
			want: []want{
				{id: "edge.max", where: "H1 to member end", measured: 1.5, limit: 6, pass: true},
			},
			src: "AISC 360-22 J3.6: 12·(3/4) = 9 in, not to exceed 6 in",
		},
		{
			name: "max spacing 24t of a 3/8 plate = 9 in passes",
			conn: withPlate(flat(t, us22, in(4), in(0.5), pitched(in(9))), in(0.375), in(12), in(1.5)),
			want: []want{
				{id: "spacing.max", where: "H1–H2 on gage line 1", measured: 9, limit: 9, pass: true},
				{id: "edge.max", where: "H2 to plate free edge", measured: 1.5, limit: 4.5, pass: true},
				{id: "edge.min", where: "H2 to plate free edge", measured: 1.5, limit: 1, pass: true},
				{id: "edge.min", where: "H1 to plate side edge (low y)", measured: 6, limit: 1, pass: true},
				{id: "edge.max", where: "H1 to plate side edge (low y)", absent: true},
			},
			src: "AISC 360-22 J3.6(a): 24·(3/8) = 9 in; J3.6: 12·(3/8) = 4.5 in; AISC 360-16 Table J3.4: 1 in",
		},
		{
			// One line on the centre of a 10 × 3/4 flat, a 3/8 × 10 splice
			// plate over it: plate and member sides 5 in from the holes.
			name: "splice plate sides 5 in from the holes fail 12t = 4-1/2 in",
			conn: splice(withPlate(flat(t, us22, in(10), in(0.75), centred(in(5))), in(0.375), in(10), in(1.5))),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (low y)", measured: 5, limit: 4.5, pass: false},
				{id: "edge.max", where: "H1 to plate side edge (high y)", measured: 5, limit: 4.5, pass: false},
				{id: "edge.max", where: "H1 to member edge (y = 0)", measured: 5, limit: 6, pass: true},
				{id: "edge.max", where: "H2 to plate free edge", measured: 1.5, limit: 4.5, pass: true},
			},
			src: "hand calculation per AISC 360-22 J3.6: plate 12·(3/8) = 4.5 in; member 12·(3/4) = 9 in, not over 6 in; 10/2 = 5 in",
		},
		{
			name: "360-16: splice plate 3/8 × 8 on an 8-in flat, sides 4 in from the holes, pass",
			conn: splice(withPlate(flat(t, us16, in(8), in(0.5), centred(in(4))), in(0.375), in(8), in(1.5))),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (low y)", measured: 4, limit: 4.5, pass: true},
				{id: "edge.max", where: "H1 to plate side edge (high y)", measured: 4, limit: 4.5, pass: true},
			},
			src: "hand calculation per AISC 360-16 J3.5: 12·(3/8) = 4.5 in ≤ 6 in; 8/2 = 4 in",
		},
		{
			name: "gusset no wider than the member: its sides are edges of the contact too",
			conn: withPlate(flat(t, us22, in(10), in(0.75), centred(in(5))), in(0.375), in(10), in(1.5)),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (low y)", measured: 5, limit: 4.5, pass: false},
			},
			src: "hand calculation per AISC 360-22 J3.6: 12·(3/8) = 4.5 in; 10/2 = 5 in",
		},
		{
			// The 12-in plate runs 4 in past each side of the 4-in flat:
			// the contact ends at the flat's edges, 2 in from the holes.
			name: "splice plate wider than the member: its sides are no edge of the contact",
			conn: splice(withPlate(flat(t, us22, in(4), in(0.5), line(in(1.5))), in(0.375), in(12), in(1.5))),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (low y)", absent: true},
				{id: "edge.max", where: "H1 to plate side edge (high y)", absent: true},
				{id: "edge.max", where: "H1 to member edge (y = 0)", measured: 2, limit: 6, pass: true},
				{id: "edge.min", where: "H1 to plate side edge (low y)", measured: 6, limit: 1, pass: true},
			},
			src: "AISC 360-22 J3.6: edges of parts in contact; 12·(1/2) = 6 in; Table J3.4 (360-16): 1 in",
		},
		{
			// L4x4x1/2 at a 2-1/2 in gage, a 3/8 × 4 plate from heel to toe.
			name: "angle: a plate as wide as the leg, sides at the heel and the toe",
			conn: splice(withPlate(l4x4(t, us22, angle(in(2.5))), in(0.375), in(4), in(1.5))),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (low y)", measured: 2.5, limit: 4.5, pass: true},
				{id: "edge.max", where: "H1 to plate side edge (high y)", measured: 1.5, limit: 4.5, pass: true},
			},
			src: "hand calculation per AISC 360-22 J3.6: 12·(3/8) = 4.5 in; 2.5 and 4 − 2.5 = 1.5 in",
		},
		{
			name: "SI: splice plate 10 × 300 on a 300-mm flat, sides 150 mm from the holes, fail 12t = 120 mm",
			conn: splice(withPlate(flat(t, si16, mm(300), mm(20), centredSI(mm(150))), mm(10), mm(300), mm(40))),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (low y)", measured: 150, limit: 120, pass: false},
				{id: "edge.max", where: "H1 to member edge (y = 0)", measured: 150, limit: 150, pass: true},
			},
			src: "hand calculation per AISC 360-16 J3.5: plate 12·10 = 120 mm; member 12·20 = 240 mm, not over 150 mm; 300/2 = 150 mm",
		},
		{
			name: "SI: splice plate 20 × 300, sides 150 mm from the holes, meet the 150 mm cap",
			conn: splice(withPlate(flat(t, si16, mm(300), mm(20), centredSI(mm(150))), mm(20), mm(300), mm(40))),
			want: []want{
				{id: "edge.max", where: "H1 to plate side edge (high y)", measured: 150, limit: 150, pass: true},
			},
			src: "hand calculation per AISC 360-16 J3.5: 12·20 = 240 mm, not to exceed 150 mm",
		},
		{
			name: "max spacing 9-1/4 in fails",
			conn: withPlate(flat(t, us22, in(4), in(0.5), pitched(in(9.25))), in(0.375), in(12), in(1.5)),
			want: []want{
				{id: "spacing.max", where: "H1–H2 on gage line 1", measured: 9.25, limit: 9, pass: false},
			},
			src: "AISC 360-22 J3.6(a): 24·(3/8) = 9 in",
		},
		{
			name: "weathering steel: 14t of a 3/8 plate = 5-1/4 in",
			conn: withPlate(flat(t, us22, in(4), in(0.5), pitched(in(5.5))), in(0.375), in(12), in(1.5)),
			info: MemberInfo{Weathering: true},
			want: []want{
				{id: "spacing.max", where: "H1–H2 on gage line 1", measured: 5.5, limit: 5.25, pass: false},
			},
			src: "AISC 360-22 J3.6(b): 14·(3/8) = 5.25 in ≤ 7 in",
		},
		{
			name: "L4x4x1/2 at a 2-1/2 in gage is workable",
			conn: l4x4(t, us22, angle(in(2.5))),
			info: MemberInfo{Designation: "L4x4x1/2", K: in(7.0 / 8), Length: in(144), Rmin: in(0.776)},
			want: []want{
				// 2.5 − 13/32 = 2.09375 ≥ k = 7/8 (AISC Manual Table 1-7; AISC Shapes Database v15.0, read).
				{id: "gage.workable", where: "H1 to fillet (k)", measured: 2.5 - 13.0/32, limit: 7.0 / 8, pass: true},
				// 2.5 − 1/2 = 2 ≥ C1 = 1-1/4 for a 3/4 in bolt (AISC Manual Table 8-4, LRFD-era).
				{id: "gage.workable", where: "H1 to outstanding leg (tightening clearance C1)", measured: 2, limit: 1.25, pass: true},
				{id: "edge.min", where: "H1 to member toe", measured: 1.5, limit: 1, pass: true},
				{id: "edge.max", where: "H1 to member toe", measured: 1.5, limit: 6, pass: true},
				// L/r = 144/0.776 = 185.6 (rz of L4x4x1/2, AISC Manual Table 1-7; AISC Shapes Database v15.0, read).
				{id: "slenderness", where: "L4x4x1/2 L/r", measured: 185.6, limit: 300, pass: true, advisory: true, tol: 0.05},
			},
			src: "common practice, no source (fillet); AISC Manual Table 8-4 (LRFD-era), C1; AISC 360-22 D1 User Note: L/r ≤ 300",
		},
		{
			name: "L4x4x1/2 at a 1-1/4 in gage is not workable",
			conn: l4x4(t, us22, angle(in(1.25))),
			info: MemberInfo{K: in(7.0 / 8)},
			want: []want{
				{id: "gage.workable", where: "H1 to fillet (k)", measured: 1.25 - 13.0/32, limit: 7.0 / 8, pass: false},
				{id: "gage.workable", where: "H1 to outstanding leg (tightening clearance C1)", measured: 0.75, limit: 1.25, pass: false},
				{id: "slenderness", where: "member L/r", absent: true},
			},
			src: "common practice, no source (fillet); C1 = 1-1/4 in for 3/4 in (AISC Manual Table 8-4, LRFD-era); k = 7/8 in for L4x4x1/2 (AISC Shapes Database v15.0, read)",
		},
		{
			// By hand from the table: t = 1/2, C1(3/4 in) = 1-1/4, so the
			// least workable gage is 1/2 + 1-1/4 = 1-3/4 in. At 1-11/16 in,
			// 1-3/16 < 1-1/4 fails, where the older rule, F/√3 + 3/16 =
			// 0.909 in, passed it.
			name: "L4x4x1/2, 3/4 in bolt: 1-3/4 in gage is the least the tightening clearance allows",
			conn: l4x4(t, us22, angle(in(1.75))),
			info: MemberInfo{K: in(7.0 / 8)},
			want: []want{
				{id: "gage.workable", where: "H1 to outstanding leg (tightening clearance C1)", measured: 1.25, limit: 1.25, pass: true},
			},
			src: "AISC Manual Table 8-4 (LRFD-era, not confirmed against current Tables 7-15/7-16): C1 = 1-1/4 in for a 3/4 in bolt",
		},
		{
			name: "L4x4x1/2, 3/4 in bolt: 1-11/16 in gage is short of the tightening clearance",
			conn: l4x4(t, us22, angle(in(1+11.0/16))),
			info: MemberInfo{K: in(7.0 / 8)},
			want: []want{
				{id: "gage.workable", where: "H1 to outstanding leg (tightening clearance C1)", measured: 1.1875, limit: 1.25, pass: false},
			},
			src: "AISC Manual Table 8-4 (LRFD-era): C1 = 1-1/4 in for a 3/4 in bolt; 1-11/16 − 1/2 = 1-3/16 in",
		},
		{
			// 1 in bolt at a 2 in gage: 2 − 1/2 = 1-1/2 ≥ C1 = 1-7/16.
			name: "L4x4x1/2, 1 in bolt: 2 in gage clears C1 = 1-7/16 in",
			conn: l4x4(t, us22, layout{d: in(1), joint: rules.Bearing, hole: rules.Standard,
				end: in(1.75), pitch: in(3), perLine: 3, gages: []units.Length{in(2)}}),
			info: MemberInfo{K: in(7.0 / 8)},
			want: []want{
				{id: "gage.workable", where: "H1 to outstanding leg (tightening clearance C1)", measured: 1.5, limit: 1 + 7.0/16, pass: true},
			},
			src: "AISC Manual Table 8-4 (LRFD-era): C1 = 1-7/16 in for a 1 in bolt",
		},
		{
			// The table starts at 5/8 in: a 1/2 in bolt keeps the common
			// practice rule, F/√3 + 3/16 with F = 1.5(1/2) + 1/8 = 7/8 in.
			name: "L4x4x1/2, 1/2 in bolt: no table row, the wrench clearance rule",
			conn: l4x4(t, us22, layout{d: in(0.5), joint: rules.Bearing, hole: rules.Standard,
				end: in(1), pitch: in(2), perLine: 3, gages: []units.Length{in(1.5)}}),
			info: MemberInfo{K: in(7.0 / 8)},
			want: []want{
				{id: "gage.workable", where: "H1 to outstanding leg (wrench clearance)", measured: 1, limit: 0.875/math.Sqrt(3) + 3.0/16, pass: true},
			},
			src: "common practice, no source (nut F = 1.5d + 1/8 in per ASME B18.2.6 from memory, socket wall 3/16 in)",
		},
		{
			name: "slenderness over 300 is advisory",
			conn: l4x4(t, us22, angle(in(2.5))),
			info: MemberInfo{K: in(7.0 / 8), Length: in(300), Rmin: in(0.776)},
			want: []want{
				// 300/0.776 = 386.6
				{id: "slenderness", where: "member L/r", measured: 386.6, limit: 300, pass: false, advisory: true, tol: 0.05},
			},
			src: "AISC 360-22 D1 User Note: L/r preferably ≤ 300 (a preference, not a requirement)",
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			fs := Check(tc.conn, tc.info)
			sys := tc.conn.Edition.System()
			for _, w := range tc.want {
				f, ok := find(fs, w.id, w.where)
				if w.absent {
					if ok {
						t.Errorf("%s %q: unexpected finding %+v", w.id, w.where, f)
					}
					continue
				}
				if !ok {
					t.Errorf("%s %q: missing; got:\n%s", w.id, w.where, dump(fs))
					continue
				}
				tol := w.tol
				if tol == 0 {
					tol = exact
				}
				m, l := sys.ToJob(f.Measured, f.Dim), sys.ToJob(f.Limit, f.Dim)
				if math.Abs(m-w.measured) > tol || math.Abs(l-w.limit) > tol {
					t.Errorf("%s %q: measured %.6g limit %.6g, want %.6g and %.6g (%s)", w.id, w.where, m, l, w.measured, w.limit, tc.src)
				}
				if f.Pass != w.pass || f.Advisory != w.advisory {
					t.Errorf("%s %q: pass %v advisory %v, want %v and %v (%s)", w.id, w.where, f.Pass, f.Advisory, w.pass, w.advisory, tc.src)
				}
			}
		})
	}
}

func dump(fs []Finding) string {
	var b strings.Builder
	for _, f := range fs {
		b.WriteString("  " + f.ID + " [" + f.Where + "] " + f.Clause + "\n")
	}
	return b.String()
}

// TestDetailingClauses checks that every finding carries its clause in the
// edition in force.
func TestDetailingClauses(t *testing.T) {
	for _, tc := range []struct {
		name     string
		standard string
		want     map[string]string // id → clause prefix
		src      string
	}{
		{"360-16", "aisc360-16", map[string]string{
			"hole.size": "J3.2, Table J3.3", "hole.type": "J3.2", "spacing.min": "J3.3",
			"edge.min": "J3.4, Table J3.4", "edge.max": "J3.5", "spacing.max": "J3.5",
			"gage.workable": "common practice", "slenderness": "D1",
		}, "AISC 360-16 J3.2–J3.5, D1"},
		{"360-22", "aisc360-22", map[string]string{
			"hole.size": "J3.3, Table J3.3", "hole.type": "J3.3", "spacing.min": "J3.4",
			"edge.min": "J3.5, Table J3.4", "edge.max": "J3.6", "spacing.max": "J3.6",
			"gage.workable": "common practice", "slenderness": "D1",
		}, "AISC 360-22 J3.3–J3.6 (a new J3.1 was inserted), D1"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			ed := edition(t, tc.standard, units.US)
			l := layout{d: in(0.75), joint: rules.Bearing, hole: rules.Standard,
				end: in(1.5), pitch: in(3), perLine: 4, gages: []units.Length{in(2.5)}}
			c := withPlate(l4x4(t, ed, l), in(0.5), in(12), in(1.5))
			fs := Check(c, MemberInfo{K: in(7.0 / 8), Length: in(144), Rmin: in(0.776)})
			seen := map[string]bool{}
			for _, f := range fs {
				want, ok := tc.want[f.ID]
				if f.ID == "gage.workable" && strings.Contains(f.Where, "outstanding leg") {
					want = "AISC Manual Table 8-4" // the 3/4 in bolt has a row
				}
				if !ok {
					t.Errorf("unknown id %q", f.ID)
					continue
				}
				seen[f.ID] = true
				if !strings.HasPrefix(f.Clause, want) {
					t.Errorf("%s %q: clause %q, want %q (%s)", f.ID, f.Where, f.Clause, want, tc.src)
				}
			}
			for id := range tc.want {
				if !seen[id] {
					t.Errorf("no %s finding", id)
				}
			}
		})
	}
}

// TestDetailingStable checks that the same connection gives the same
// findings in the same order, whatever the order of its holes.
func TestDetailingStable(t *testing.T) {
	ed := edition(t, "aisc360-22", units.US)
	l := layout{d: in(0.75), joint: rules.Bearing, hole: rules.ShortSlot, slot: rules.Transverse,
		end: in(1.5), pitch: in(3), perLine: 3, gages: []units.Length{in(1.5), in(4)}}
	c := withPlate(flat(t, ed, in(6), in(0.5), l), in(0.5), in(12), in(1.5))
	info := MemberInfo{Length: in(120), Rmin: in(0.5)}
	first := Check(c, info)
	if len(first) == 0 {
		t.Fatal("no findings")
	}
	for range 3 {
		if again := Check(c, info); !reflect.DeepEqual(first, again) {
			t.Fatalf("findings differ between runs:\n%v\n%v", first, again)
		}
	}
	rev := *c
	rev.Holes = append([]engine.Hole(nil), c.Holes...)
	for i, j := 0, len(rev.Holes)-1; i < j; i, j = i+1, j-1 {
		rev.Holes[i], rev.Holes[j] = rev.Holes[j], rev.Holes[i]
	}
	got := Check(&rev, info)
	if len(got) != len(first) {
		t.Fatalf("%d findings with the holes reversed, want %d", len(got), len(first))
	}
	for i := range got {
		if got[i].ID != first[i].ID || got[i].Clause != first[i].Clause || got[i].Pass != first[i].Pass ||
			math.Abs(got[i].Measured-first[i].Measured) > 1e-9 || math.Abs(got[i].Limit-first[i].Limit) > 1e-9 {
			t.Errorf("finding %d: %+v with the holes reversed, want %+v", i, got[i], first[i])
		}
	}
}

// TestDetailingCollectsEverything checks that a layout breaking several
// rules reports each of them, not just the first.
func TestDetailingCollectsEverything(t *testing.T) {
	ed := edition(t, "aisc360-22", units.US)
	// 3/4-in oversized holes in a bearing joint (J3.3), end 7/8 in < 1 in
	// (Table J3.4), pitch 1-3/4 in < 2 in (J3.4), pitch 9-1/2 in > 24·(3/8)
	// (J3.6(a)).
	c := withPlate(flat(t, ed, in(4), in(0.5), layout{d: in(0.75), joint: rules.Bearing, hole: rules.Oversized,
		end: in(7.0 / 8), pitch: in(1.75), perLine: 2, gages: []units.Length{in(2)}}), in(0.375), in(12), in(1.5))
	c.Holes = append(c.Holes, engine.Hole{ID: "H3", X: c.Holes[1].X + in(9.5), Y: in(2),
		HoleShape: engine.HoleShape{Type: rules.Oversized, Dx: in(15.0 / 16), Dy: in(15.0 / 16)}})
	c.Plate.FreeEdge = c.Holes[2].X + in(1.5)
	fs := Check(c, MemberInfo{})
	failed := map[string]bool{}
	for _, f := range fs {
		if !f.Pass {
			failed[f.ID] = true
		}
	}
	for _, id := range []string{"hole.type", "edge.min", "spacing.min", "spacing.max"} {
		if !failed[id] {
			t.Errorf("%s: no failing finding; got:\n%s", id, dump(fs))
		}
	}
	if Passes(fs) {
		t.Error("Passes = true for a failing layout")
	}
}

// TestDetailingPasses checks that advisory findings never fail a job.
func TestDetailingPasses(t *testing.T) {
	for _, tc := range []struct {
		name string
		fs   []Finding
		want bool
	}{
		{"none", nil, true},
		{"all pass", []Finding{{ID: "edge.min", Pass: true}, {ID: "slenderness", Pass: true, Advisory: true}}, true},
		{"advisory fails", []Finding{{ID: "edge.min", Pass: true}, {ID: "slenderness", Advisory: true}}, true},
		{"rule fails", []Finding{{ID: "edge.min"}, {ID: "slenderness", Pass: true, Advisory: true}}, false},
	} {
		if got := Passes(tc.fs); got != tc.want {
			t.Errorf("%s: Passes = %v, want %v", tc.name, got, tc.want)
		}
	}
	// A real connection whose only failure is the D1 slenderness preference.
	ed := edition(t, "aisc360-22", units.US)
	c := l4x4(t, ed, layout{d: in(0.75), joint: rules.Bearing, hole: rules.Standard,
		end: in(1.5), pitch: in(3), perLine: 4, gages: []units.Length{in(2.5)}})
	fs := Check(c, MemberInfo{K: in(7.0 / 8), Length: in(360), Rmin: in(0.776)}) // L/r 464
	if f, ok := find(fs, "slenderness", "member L/r"); !ok || f.Pass {
		t.Fatalf("slenderness finding %+v (found %v), want a failing advisory", f, ok)
	}
	if !Passes(fs) {
		t.Errorf("Passes = false; only the advisory should fail:\n%s", dump(fs))
	}
}

// TestDetailingWrenchClearance checks the nut sizes behind gage.workable.
func TestDetailingWrenchClearance(t *testing.T) {
	for _, tc := range []struct {
		name string
		d    units.Length
		sys  units.System
		want units.Length
		src  string
	}{
		{"3/4 in", in(0.75), units.US, in(1.25), "ASME B18.2.6 heavy hex nut, 1-1/4 in across flats (from memory)"},
		{"7/8 in", in(0.875), units.US, in(1 + 7.0/16), "ASME B18.2.6 heavy hex nut, 1-7/16 in (from memory)"},
		{"1 in", in(1), units.US, in(1 + 5.0/8), "ASME B18.2.6 heavy hex nut, 1-5/8 in (from memory)"},
		{"M20", mm(20), units.SI, mm(34), "ASME B18.2.4.6M heavy hex nut, 34 mm (from memory)"},
		{"M24", mm(24), units.SI, mm(41), "ASME B18.2.4.6M / EN 14399-4, 41 mm (from memory)"},
	} {
		if got := nutAcrossFlats(tc.d, tc.sys); math.Abs(float64(got-tc.want)) > 1e-9 {
			t.Errorf("%s: F = %v mm, want %v mm (%s)", tc.name, got, tc.want, tc.src)
		}
	} // What the layout search keeps the gage above: C1 of the table for an
	// inch bolt it lists; the F/√3 + w rule for a metric bolt (no metric
	// table was read) and a 1/2 in bolt (the table starts at 5/8).
	for _, tc := range []struct {
		name string
		d    units.Length
		sys  units.System
		want units.Length
		src  string
	}{
		{"3/4 in", in(0.75), units.US, in(1.25), "AISC Manual Table 8-4 (LRFD-era), C1"},
		{"1-1/2 in", in(1.5), units.US, in(1 + 15.0/16), "AISC Manual Table 8-4 (LRFD-era), C1"},
		{"1/2 in", in(0.5), units.US, in(0.875)/units.Length(math.Sqrt(3)) + in(3.0/16), "common practice, F = 7/8 in from memory"},
		{"M20", mm(20), units.SI, mm(34)/units.Length(math.Sqrt(3)) + mm(5), "common practice, F = 34 mm from memory"},
	} {
		if got := WrenchClearance(tc.d, tc.sys); math.Abs(float64(got-tc.want)) > 1e-9 {
			t.Errorf("%s: clearance %v mm, want %v mm (%s)", tc.name, got, tc.want, tc.src)
		}
	}
}

// TestDetailingClearDistance checks the outline distance of holes and
// slots against hand geometry (common practice, no source).
func TestDetailingClearDistance(t *testing.T) {
	round := func(x, y, d float64) engine.Hole {
		return engine.Hole{X: in(x), Y: in(y), HoleShape: engine.HoleShape{Dx: in(d), Dy: in(d)}}
	}
	slot := func(x, y, dx, dy float64) engine.Hole {
		return engine.Hole{X: in(x), Y: in(y), HoleShape: engine.HoleShape{Dx: in(dx), Dy: in(dy), Type: rules.ShortSlot}}
	}
	for _, tc := range []struct {
		name string
		a, b engine.Hole
		want float64 // in
	}{
		{"round holes in line", round(0, 0, 0.8125), round(2, 0, 0.8125), 2 - 0.8125},
		{"round holes diagonal", round(0, 0, 1), round(3, 4, 1), 4},
		{"slots end to end", slot(0, 0, 1.875, 0.8125), slot(2.25, 0, 1.875, 0.8125), 2.25 - 1.875},
		{"slots side by side", slot(0, 0, 0.8125, 1.875), slot(2.25, 0, 0.8125, 1.875), 2.25 - 0.8125},
		{"crossed slots overlap", slot(0, 0, 2, 0.5), slot(0, 0, 0.5, 2), -0.5},
	} {
		got := clearDistance(&tc.a, &tc.b) / float64(units.Inch)
		if math.Abs(got-tc.want) > exact {
			t.Errorf("%s: clear %.6g in, want %.6g in", tc.name, got, tc.want)
		}
	}
}
