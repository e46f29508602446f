package detail

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"gaugeline/detail/detailing"
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

// fayingFinding returns the hole.type finding on long slots at the faying
// surfaces, and whether there is one.
func fayingFinding(r *Report) (detailing.Finding, bool) {
	for _, f := range r.Findings {
		if f.ID == "hole.type" && strings.Contains(f.Where, "faying surface") {
			return f, true
		}
	}
	return detailing.Finding{}, false
}

// TestLongSlotsOneFayingSurface: AISC 360-22 J3.3 (360-16 J3.2) permits
// long-slotted holes in only one of the connected parts at an individual
// faying surface (REFERENCE.md, hole-type permissions, verified).
func TestLongSlotsOneFayingSurface(t *testing.T) {
	longAcross := "  hole: long-slot\n  slot: transverse\n"
	noPlate := func(s string) string {
		i, k := strings.Index(s, "plate:\n"), strings.Index(s, "bolts:\n")
		return s[:i] + s[k:]
	}
	tests := []struct {
		name     string
		job      string
		clause   string
		pass     bool
		advisory bool
		where    string // in the finding
	}{
		{"360-22, bolts.hole long-slot: both plies", plyJob(longAcross, "", ""), "J3.3", false, false, "long slots in both the member (H1, H2, H3, H4) and the plate (H1, H2, H3, H4)"},
		{"360-16, bolts.hole long-slot: both plies", "standard: aisc360-16\n" + plyJob(longAcross, "", ""), "J3.2", false, false, "long slots in both the member"},
		{"360-22, member.hole and plate.hole long-slot", plyJob("", longAcross, longAcross), "J3.3", false, false, "long slots in both the member"},
		{"double angle, both plies", strings.Replace(plyJob(longAcross, "", ""), "shape: angle", "shape: double-angle", 1), "J3.3", false, false, "long slots in both the member"},
		{"long slots in the member, standard holes in the plate", plyJob("", longAcross, "  hole: standard\n"), "J3.3", true, false, "long slots in the member only"},
		{"long slots in the plate, standard holes in the member", plyJob(longAcross, "  hole: standard\n", ""), "J3.3", true, false, "long slots in the plate only"},
		{"no plate: the other ply unknown", noPlate(plyJob(longAcross, "", "")), "J3.3", true, true, "only one connected part at each faying surface"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r, err := Check(mustBuild(t, mustParse(t, tt.job)))
			if err != nil {
				t.Fatal(err)
			}
			f, ok := fayingFinding(r)
			if !ok {
				t.Fatalf("no faying-surface finding in %+v", r.Findings)
			}
			if f.Clause != tt.clause || f.Pass != tt.pass || f.Advisory != tt.advisory || !strings.Contains(f.Where, tt.where) {
				t.Errorf("finding %+v; want clause %s, pass %v, advisory %v, where containing %q", f, tt.clause, tt.pass, tt.advisory, tt.where)
			}
			failsOnIt := false
			for _, id := range r.Failing() {
				failsOnIt = failsOnIt || id == "hole.type"
			}
			if failsOnIt == tt.pass || (!tt.pass && r.Pass) {
				t.Errorf("hole.type among the failures: %v, report passes %v; want the job to fail on it: %v", failsOnIt, r.Pass, !tt.pass)
			}
		})
	}
}

// TestDetailingPerPly: each part's edges, hole sizes and clear distances
// take that part's holes. Member: long slots along the load (13/16 ×
// 1-7/8, AISC 360-22 Table J3.3), slip-critical; plate: standard 13/16.
func TestDetailingPerPly(t *testing.T) {
	job := plyJob("  joint: slip-critical\n", "  hole: long-slot\n  slot: longitudinal\n", "  hole: standard\n")
	r, err := Check(mustBuild(t, mustParse(t, job)))
	if err != nil {
		t.Fatal(err)
	}
	find := func(id, where string) (detailing.Finding, bool) {
		for _, f := range r.Findings {
			if f.ID == id && f.Where == where {
				return f, true
			}
		}
		return detailing.Finding{}, false
	}
	in := float64(units.Inch)
	for _, w := range []struct {
		id, where       string
		measured, limit float64 // in
		src             string
	}{
		// Table J3.4: 1 in for a 3/4-in bolt; Table J3.5: C2 = 0.75d =
		// 0.5625 in for a long slot whose axis is perpendicular to the edge.
		{"edge.min", "H1 to member end", 1.5, 1.5625, "AISC 360-22 Table J3.4 1 in + Table J3.5 0.75d (long slot ⊥ end)"},
		{"edge.min", "H4 to plate free edge", 1.5, 1, "AISC 360-22 Table J3.4, standard hole: no C2"},
		{"hole.size", "H1 along the slot (largest long-slot hole in the member)", 1 + 7.0/8, 1 + 7.0/8, "AISC 360-22 Table J3.3 long slot length"},
		{"hole.size", "H1 (largest standard hole in the plate)", 13.0 / 16, 13.0 / 16, "AISC 360-22 Table J3.3 standard"},
		// Clear distance at 3-in pitch: 3 − 1-7/8 = 1.125 in between the
		// member's slots, 3 − 13/16 = 2.1875 in between the plate's holes
		// (hand geometry); limit d, AISC 360-22 J3.4.
		{"spacing.min", "H1–H2 (clear distance in the member)", 1.125, 0.75, "AISC 360-22 J3.4, hand geometry"},
		{"spacing.min", "H1–H2 (clear distance in the plate)", 2.1875, 0.75, "AISC 360-22 J3.4, hand geometry"},
	} {
		f, ok := find(w.id, w.where)
		if !ok {
			t.Errorf("no %s finding %q", w.id, w.where)
			continue
		}
		if math.Abs(f.Measured/in-w.measured) > 1e-9 || math.Abs(f.Limit/in-w.limit) > 1e-9 {
			t.Errorf("%s %q: measured %g, limit %g in; want %g, %g (%s)", w.id, w.where, f.Measured/in, f.Limit/in, w.measured, w.limit, w.src)
		}
	}
	for _, where := range []string{"member: longitudinal long-slot holes in a slip-critical joint", "plate: standard holes in a slip-critical joint"} {
		if f, ok := find("hole.type", where); !ok || !f.Pass {
			t.Errorf("hole.type %q: %+v (found %v), want a passing finding (AISC 360-22 J3.3)", where, f, ok)
		}
	}
}

// TestReportPerPly: the summary and the JSON holes show each ply's own
// holes (the sheet's views: detail/sheet TestSheetPerPly). Member: long slots across the load, 13/16 × 1-7/8;
// plate: standard 13/16 (AISC 360-22 Table J3.3, 3/4-in bolt).
func TestReportPerPly(t *testing.T) {
	job := plyJob("", "  hole: long-slot\n  slot: transverse\n", "  hole: standard\n")
	r, err := Check(mustBuild(t, mustParse(t, job)))
	if err != nil {
		t.Fatal(err)
	}
	want := "long-slot transverse holes in the member, standard in the plate"
	if row := r.Design.Summary(); !strings.HasSuffix(row[2][1], want) {
		t.Errorf("summary %q", row[2][1])
	}
	b, err := r.JSON()
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Holes []struct {
			Type  string `json:"type"`
			Slot  string `json:"slot"`
			Plate *struct {
				Type     string  `json:"type"`
				Diameter float64 `json:"diameter"`
			} `json:"plate"`
		} `json:"holes"`
	}
	if err := json.Unmarshal(b, &doc); err != nil {
		t.Fatal(err)
	}
	for i, h := range doc.Holes {
		if h.Type != "long-slot" || h.Slot != "transverse" || h.Plate == nil || h.Plate.Type != "standard" || h.Plate.Diameter != 13.0/16 {
			t.Errorf("JSON hole %d: %+v", i, h)
		}
	}
	// One hole type: no plate entry, as before.
	r1, err := Check(mustBuild(t, mustParse(t, usAngle)))
	if err != nil {
		t.Fatal(err)
	}
	if b, _ := r1.JSON(); strings.Contains(string(b), `"plate": {`) {
		t.Errorf("a job of one hole type writes plate holes:\n%s", b)
	}
}
