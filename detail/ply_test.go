package detail

import (
	"strings"
	"testing"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// plyJob is usAngle (an L4x4x1/2 on a 1/2-in gusset, four 3/4-in A325 at
// 3 in) with bolts lines and per-ply keys added: bolts adds to the bolts
// block, member and plate to those blocks.
func plyJob(bolts, member, plate string) string {
	s := usAngle
	if member != "" {
		s = strings.Replace(s, "  length: 10 ft\n", "  length: 10 ft\n"+member, 1)
	}
	if plate != "" {
		s = strings.Replace(s, "  edge: 1-1/2 in\n", "  edge: 1-1/2 in\n"+plate, 1)
	}
	if bolts != "" {
		s = strings.Replace(s, "  grade: A325\n", "  grade: A325\n"+bolts, 1)
	}
	return s
}

func TestPlyHoleKeys(t *testing.T) {
	type ply struct {
		t   rules.HoleType
		dir rules.SlotDir
	}
	sc := "  joint: slip-critical\n"
	tests := []struct {
		name                 string
		bolts, member, plate string
		member2, plate2      ply
	}{
		{"bolts.hole serves both plies", sc + "  hole: long-slot\n  slot: longitudinal\n", "", "",
			ply{rules.LongSlot, rules.Longitudinal}, ply{rules.LongSlot, rules.Longitudinal}},
		{"member.hole overrides for the member", sc + "  hole: long-slot\n  slot: longitudinal\n", "  hole: standard\n", "",
			ply{rules.Standard, rules.Transverse}, ply{rules.LongSlot, rules.Longitudinal}},
		{"plate.hole overrides for the plate, bolts.slot its direction", sc + "  slot: longitudinal\n", "", "  hole: short-slot\n",
			ply{rules.Standard, rules.Transverse}, ply{rules.ShortSlot, rules.Longitudinal}},
		{"plate.slot overrides bolts.slot", sc + "  hole: long-slot\n  slot: longitudinal\n", "", "  slot: transverse\n",
			ply{rules.LongSlot, rules.Longitudinal}, ply{rules.LongSlot, rules.Transverse}},
		{"each ply its own", "", "  hole: long-slot\n  slot: transverse\n", "  hole: oversized\n",
			ply{rules.LongSlot, rules.Transverse}, ply{rules.Oversized, rules.Transverse}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			j := mustParse(t, plyJob(tt.bolts, tt.member, tt.plate))
			if mt, md := j.MemberHole(); (ply{mt, md}) != tt.member2 {
				t.Errorf("member ply %s %s, want %s %s", mt, md, tt.member2.t, tt.member2.dir)
			}
			if pt, pd := j.PlateHole(); (ply{pt, pd}) != tt.plate2 {
				t.Errorf("plate ply %s %s, want %s %s", pt, pd, tt.plate2.t, tt.plate2.dir)
			}
		})
	}
}

// TestBuildPlyShapes: each ply's holes get their own nominal size, AISC
// 360-22 Table J3.3 for a 3/4-in bolt (standard 13/16, oversized 15/16,
// long slot 13/16 × 1-7/8); plies alike leave Hole.Plate nil.
func TestBuildPlyShapes(t *testing.T) {
	in := func(v float64) units.Length { return units.Length(v) * units.Inch }
	std := engine.HoleShape{Type: rules.Standard, Dx: in(13.0 / 16), Dy: in(13.0 / 16)}
	longAlong := engine.HoleShape{Type: rules.LongSlot, Slot: rules.Longitudinal, Dx: in(1 + 7.0/8), Dy: in(13.0 / 16)}
	over := engine.HoleShape{Type: rules.Oversized, Dx: in(15.0 / 16), Dy: in(15.0 / 16)}
	tests := []struct {
		name                 string
		bolts, member, plate string
		m                    engine.HoleShape
		p                    *engine.HoleShape
	}{
		{"one type", "", "", "", std, nil},
		{"plate.hole equal to bolts.hole", "", "", "  hole: standard\n", std, nil},
		{"long slots along the load in the member", "  joint: slip-critical\n", "  hole: long-slot\n  slot: longitudinal\n", "", longAlong, &std},
		{"oversized in the plate", "  joint: slip-critical\n", "", "  hole: oversized\n", std, &over},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d := mustBuild(t, mustParse(t, plyJob(tt.bolts, tt.member, tt.plate)))
			for i, h := range d.Conn.Holes {
				if h.HoleShape != tt.m {
					t.Errorf("%s member ply %+v, want %+v", h.ID, h.HoleShape, tt.m)
				}
				switch {
				case tt.p == nil && h.Plate != nil:
					t.Errorf("%s plate ply %+v, want nil (as the member's)", h.ID, *h.Plate)
				case tt.p != nil && (h.Plate == nil || *h.Plate != *tt.p):
					t.Errorf("%s plate ply %+v, want %+v", h.ID, h.InPlate(), *tt.p)
				}
				if i > 0 && h.Plate != nil && h.Plate == d.Conn.Holes[i-1].Plate {
					t.Errorf("%s shares its plate ply with the hole before: a copy that changes one changes both", h.ID)
				}
			}
		})
	}
}

func TestPlyHoleKeyErrors(t *testing.T) {
	tests := []struct {
		name                 string
		bolts, member, plate string
		field, msg           string
	}{
		{"unknown hole type", "", "  hole: slotted\n", "", "member.hole", `unknown hole type "slotted"`},
		{"unknown slot direction", "", "", "  hole: long-slot\n  slot: along\n", "plate.slot", `unknown slot direction "along"`},
		{"slot for round holes", "", "", "  slot: longitudinal\n", "plate.slot", "is for slotted holes, and the plate's holes are standard (bolts.hole)"},
		{"slot for the ply's own round holes", "  hole: long-slot\n", "  hole: oversized\n  slot: transverse\n", "", "member.slot",
			"is for slotted holes, and the member's holes are oversized (member.hole)"},
		{"a list", "", "  hole: [standard]\n", "", "member.hole", "want a single value, not a list"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			ie := parseErr(t, plyJob(tt.bolts, tt.member, tt.plate))
			if ie.Field != tt.field || !strings.Contains(ie.Msg, tt.msg) || ie.Line == 0 {
				t.Errorf("%s:%d %q, want %s and %q", ie.Field, ie.Line, ie.Msg, tt.field, tt.msg)
			}
		})
	}
}
