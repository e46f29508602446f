package detail

import (
	"errors"
	"math"
	"os"
	"strings"
	"testing"

	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// chordSplice is testdata/jobs/us-chord-splice.yaml: an L5x5x1/2 chord
// spliced to an L5x5x3/8 (member_b), one splice plate, four 7/8-in bolts
// at 3 in, 1-1/2 in ends, 75 kips.
func chordSplice(t *testing.T) string {
	t.Helper()
	src, err := os.ReadFile("../testdata/jobs/us-chord-splice.yaml")
	if err != nil {
		t.Fatal(err)
	}
	return string(src)
}

// Member B's own limit states, by hand from the AISC Shapes Database
// v15.0 (read) row L5X5X3/8: A = 3.65 in², x̄ = 1.37 in; A36 (Fy 36, Fu
// 58 ksi). Yielding (D2(a)): Pn = 36 · 3.65 = 131.4 kips. Rupture (D2(b)):
// An = 3.65 − (15/16 + 1/16) · 3/8 = 3.275 in²; U = max(1 − 1.37/9,
// 0.80 (Table D3.1 case 8, four bolts in the line)) = 0.8478; Pn = 58 ·
// 0.8478 · 3.275 = 161.0 kips.
func TestMemberBOwnSection(t *testing.T) {
	r := checkSrc(t, chordSplice(t))
	kip := float64(units.Kip)
	if got := float64(result(t, r, "member_b.yield").Nominal) / kip; math.Abs(got-131.4) > 0.005*131.4 {
		t.Errorf("member_b.yield Pn %.2f kips, want 131.4 (36 · 3.65)", got)
	}
	want := 58 * (1 - 1.37/9) * (3.65 - 0.375)
	if got := float64(result(t, r, "member_b.rupture").Nominal) / kip; math.Abs(got-want) > 0.005*want {
		t.Errorf("member_b.rupture Pn %.2f kips, want %.2f", got, want)
	}
	// The member's own are the heavier angle's: 36 · 4.79 = 172.4 kips
	// (L5X5X1/2, A = 4.79 in², same database).
	if got := float64(result(t, r, "member.yield").Nominal) / kip; math.Abs(got-172.4) > 0.005*172.4 {
		t.Errorf("member.yield Pn %.2f kips, want 172.4", got)
	}
	// Member B is thinner: its bearing and its bolt group are weaker.
	if b, a := result(t, r, "member_b.bearing"), result(t, r, "member.bearing"); b.Nominal >= a.Nominal {
		t.Errorf("member B bearing %v not below the member's %v", b.Nominal, a.Nominal)
	}
	result(t, r, "bolts.group.member_b")
	if !strings.Contains(strings.Join(r.Cautions, " "), "member B, beyond the joint, is L5x5x3/8") {
		t.Errorf("no caution names member B: %q", r.Cautions)
	}
	doc := r.Document()
	if doc.MemberB == nil || doc.MemberB.Designation != "L5x5x3/8" || math.Abs(float64(doc.MemberB.Area)-3.65) > 0.005 {
		t.Errorf("JSON member_b %+v", doc.MemberB)
	}
}

// A member_b of the member's own section changes nothing: each member_b.*
// result is its member.* twin, and the plain mirror (no member_b) has
// exactly the member's results.
func TestMemberBSameAsMember(t *testing.T) {
	src := strings.Replace(chordSplice(t), "size: L5x5x3/8", "size: L5x5x1/2", 1)
	r := checkSrc(t, src)
	twins := 0
	for _, x := range r.Results {
		base, ok := strings.CutPrefix(x.ID, "member_b.")
		id := "member." + base
		if !ok {
			if id, ok = strings.CutSuffix(x.ID, ".member_b"); !ok {
				continue
			}
		}
		if a := result(t, r, id); math.Abs(a.Ratio-x.Ratio) > 1e-12 || a.Nominal != x.Nominal {
			t.Errorf("%s ratio %v, %s %v", x.ID, x.Ratio, id, a.Ratio)
		}
		twins++
	}
	if twins != 5 {
		t.Errorf("%d member B results, want 5 (yield, rupture, block shear, bearing, bolt group)", twins)
	}
	for _, f := range r.Findings {
		if strings.HasPrefix(f.Where, "member B: ") {
			t.Errorf("member B's finding %s %s differs from the member's", f.ID, f.Where)
		}
	}
	i := strings.Index(src, "member_b:")
	plain := checkSrc(t, src[:i]+src[strings.Index(src, "plate:"):])
	if len(plain.Results) != len(r.Results)-twins {
		t.Errorf("without member_b %d results, with it %d", len(plain.Results), len(r.Results))
	}
}

// A member B that pushes buckles over its own length.
func TestMemberBCompression(t *testing.T) {
	src := strings.Replace(chordSplice(t), "required: 75 kip", "required: 75 kip\n  compression: 20 kip", 1)
	src = strings.Replace(src, "size: L5x5x3/8", "size: L5x5x3/8\n  length: 10 ft", 1)
	r := checkSrc(t, src)
	a, b := result(t, r, "member.compression"), result(t, r, "member_b.compression")
	// Member B is 10 ft of L5x5x3/8, the member 20 ft of L5x5x1/2: each
	// buckles over its own length with its own section.
	if a.Nominal == b.Nominal || b.Case != "compression" {
		t.Errorf("member B compression %v (case %q), the member's %v", b.Nominal, b.Case, a.Nominal)
	}
	result(t, r, "bolts.group.compression.member_b")
}

// What member B cannot be: off the bolt group, or of another thickness
// between two splice plates (fillers not modelled); an unknown size names
// member_b.size and its line.
func TestMemberBBadInput(t *testing.T) {
	base := chordSplice(t)
	for _, c := range []struct{ name, from, to, field, msg string }{
		{"off the leg", "size: L5x5x3/8", "size: L3x3x3/8", "bolts.gage", "member B"},
		{"two plates", "kind: splice", "kind: splice\n  count: 2", "member_b.size", "fillers"},
		{"unknown size", "size: L5x5x3/8", "size: L5x5x9/16", "member_b.size", "no angle"},
	} {
		if !strings.Contains(base, c.from) {
			t.Fatalf("%s: no %q", c.name, c.from)
		}
		j, err := jobfile.ParseJob("b.yaml", []byte(strings.Replace(base, c.from, c.to, 1)))
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		_, err = Build(j)
		var ie *jobfile.InputError
		if !errors.As(err, &ie) || ie.Field != c.field || !strings.Contains(ie.Msg, c.msg) || ie.Line <= 0 {
			t.Errorf("%s: %v, want %s with %q and a line", c.name, err, c.field, c.msg)
		}
	}
}
