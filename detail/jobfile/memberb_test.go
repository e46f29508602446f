package jobfile

import (
	"strings"
	"testing"
)

const memberBJob = `mark: SP-2
load: {required: 60 kip}
member: {shape: angle, size: L5x5x1/2, grade: A572-50, length: 20 ft}
plate: {kind: splice, thickness: 1/2 in, grade: A36, width: 5 in, edge: 1-1/2 in}
member_b:
  size: L5x5x3/8
`

// member_b reads into its own MemberSpec: the member's shape, its own
// size, the member's steel unless it gives one; the view puts it in the
// member's place and names its fields member_b.*.
func TestMemberBReads(t *testing.T) {
	j := mustParse(t, memberBJob)
	b := j.MemberB
	if b == nil || b.Size != "L5x5x3/8" || b.Shape != j.Member.Shape || b.Steel != j.Member.Steel {
		t.Fatalf("member_b %+v", b)
	}
	v := j.MemberBView()
	if v.Member.Size != "L5x5x3/8" || !v.Given("member.size") || v.Given("member.grade") || v.Given("member.length") {
		t.Errorf("view: size %q, given size %v grade %v length %v", v.Member.Size, v.Given("member.size"), v.Given("member.grade"), v.Given("member.length"))
	}
	if ie := v.FieldError("member.size", "x", ""); ie.Field != "member_b.size" || ie.Line != 6 {
		t.Errorf("view error at %s line %d, want member_b.size line 6", ie.Field, ie.Line)
	}
	if j.MemberBView().Member.Gap != j.Member.Gap || mustParse(t, spliceJob).MemberBView() != nil {
		t.Error("view: gap not the member's, or a view without member_b")
	}
	own := mustParse(t, memberBJob+"  grade: A36\n")
	if own.MemberB.Steel.Grade != "A36" || own.Member.Steel.Grade != "A572-50" {
		t.Errorf("own grade %q, member %q", own.MemberB.Steel.Grade, own.Member.Steel.Grade)
	}
}

func TestMemberBBadInput(t *testing.T) {
	gusset := strings.Replace(memberBJob, "kind: splice", "kind: gusset", 1)
	pushes := strings.Replace(memberBJob, "{required: 60 kip}", "{required: 60 kip, compression: 40 kip}", 1)
	for _, c := range []struct{ name, src, field, msg string }{
		{"on a gusset", gusset, "member_b", "is for a splice"},
		{"another shape", memberBJob + "  shape: flat\n", "member_b.shape", "one shape"},
		{"a far end", memberBJob + "  far_end: plain\n", "member_b.far_end", ""},
		{"size and legs", memberBJob + "  legs: [5 in, 5 in]\n", "member_b.legs", "either size or legs"},
		{"pushes without length", pushes, "member_b.length", "member B buckles"},
	} {
		ie := parseErr(t, c.src)
		if ie.Field != c.field || !strings.Contains(ie.Msg, c.msg) || ie.Line <= 0 {
			t.Errorf("%s: %v (field %q line %d), want field %q with %q", c.name, ie, ie.Field, ie.Line, c.field, c.msg)
		}
	}
}
