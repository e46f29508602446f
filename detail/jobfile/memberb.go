package jobfile

import (
	"fmt"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
)

// A splice joins two members. By default the member beyond the joint,
// member B, is the job's member mirrored about the joint; member_b gives
// it a section (and steel, length, buckling keys) of its own: a chord
// whose section changes at the splice. Its shape is the member's and its
// bolt group is the member's mirrored; its hole type is the member's.

var memberBKeys = append([]string{"shape", "size", "legs", "thickness", "width", "grade", "fy", "fu", "length", "area", "xbar", "rmin"},
	memberBucklingKeys...)

// parseMemberB reads member_b (after member and plate).
func (p *parser) parseMemberB(n *yaml.Node) error {
	b, err := p.mapping(n, "member_b", memberBKeys)
	if err != nil {
		return err
	}
	j := p.job
	if j.Plate == nil || j.Plate.Kind != engine.Splice {
		return &InputError{File: j.File, Line: j.Line("member_b"), Field: "member_b", Msg: "is for a splice: the member beyond the joint",
			Hint: "give plate.kind: splice, or remove member_b"}
	}
	m := &MemberSpec{Shape: j.Member.Shape}
	if v := b.vals["shape"]; v != nil {
		sh, err := enum(p, v, "member_b.shape", parseShape)
		if err != nil {
			return err
		}
		if sh != m.Shape {
			return p.errAt(v, "member_b.shape", fmt.Sprintf("is %s, and the member is %s: a splice joins two members of one shape", sh, m.Shape),
				"remove member_b.shape (member B takes the member's), or make it "+m.Shape.String())
		}
	}
	if err := p.parseSection(b, m); err != nil {
		return err
	}
	ownSteel := b.has("grade") || b.has("fy") || b.has("fu")
	if !ownSteel {
		m.Steel = j.Member.Steel // member B's steel is the member's unless given
	}
	if err := p.parseMemberRestSteel(b, m, ownSteel); err != nil {
		return err
	}
	j.MemberB = m
	return nil
}

// MemberBView is the job as member B's builder sees it: member B in the
// member's place, its fields (Raw, lines) under member.*, and errors named
// member_b.*. Nil when the job has no member_b.
func (j *Job) MemberBView() *Job {
	if j.MemberB == nil {
		return nil
	}
	v := *j
	v.Member = *j.MemberB
	// what member B shares with the member: the plate between a pair's
	// pieces, the hole type, a flat's eccentricity setting
	v.Member.Gap, v.Member.Hole, v.Member.Eccentricity = j.Member.Gap, j.Member.Hole, j.Member.Eccentricity
	v.Raw = rekey(j.Raw)
	v.lines = rekey(j.lines)
	v.memberB = true
	return &v
}

// rekey is m with member_b's keys under member and the member's dropped.
func rekey[V any](m map[string]V) map[string]V {
	out := make(map[string]V, len(m))
	for k, v := range m {
		if k == "member" || strings.HasPrefix(k, "member.") || strings.HasPrefix(k, "member[") {
			continue
		}
		out[k] = v
	}
	for k, v := range m {
		if k == "member_b" || strings.HasPrefix(k, "member_b.") || strings.HasPrefix(k, "member_b[") {
			out["member"+strings.TrimPrefix(k, "member_b")] = v
		}
	}
	return out
}

// fieldName is path as the job file spells it: in a MemberBView the
// member's fields are member_b's.
func (j *Job) fieldName(path string) string {
	if j.memberB && (path == "member" || strings.HasPrefix(path, "member.") || strings.HasPrefix(path, "member[")) {
		return "member_b" + strings.TrimPrefix(path, "member")
	}
	return path
}
