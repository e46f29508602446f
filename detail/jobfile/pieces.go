package jobfile

import (
	"errors"
	"fmt"
	"maps"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/rules/words"
)

// FarEndKind is what the member's far end carries (member.far_end).
type FarEndKind int

const (
	// FarMirror: the near end's connection, mirrored about mid-length
	// (holes at x' = length − x, same y). The default.
	FarMirror FarEndKind = iota
	// FarPlain: no holes.
	FarPlain
	// FarOwn: a connection of its own (member.far_end.plate and .bolts).
	FarOwn
)

var farEndKinds = words.New[FarEndKind]("far end", "mirror", "plain", "own")

// String returns the job-file spelling ("own" is the mapping form).
func (k FarEndKind) String() string { return farEndKinds.Name(k) }

// FarEndSpec is member.far_end.
type FarEndSpec struct {
	Kind  FarEndKind
	Given bool // member.far_end is written in the job
	// Job is the far end's connection as a job of its own (FarOwn only):
	// the job with the far end's plate and bolts in place of the near
	// end's and no explicit holes. Its x run from the far cut end, as the
	// near end's run from the near one; its field paths are "plate.…" and
	// "bolts.…" (FarEndError names them under member.far_end).
	Job *Job

	node *yaml.Node
}

// Project is the project: block, printed in the title block; "" where not
// given. Date is the job's own text, never the clock.
type Project struct {
	Name, Drawing, Revision, Date, Drafter, Checker, Scale string
}

var projectKeys = []string{"name", "drawing", "revision", "date", "drafter", "checker", "scale"}

// maxTitleText is the longest text of a title-block field (our choice: a
// line of the title block).
const maxTitleText = 80

// parseProject reads the project block: each key a line of text.
func (p *parser) parseProject(n *yaml.Node) error {
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "project", projectKeys)
	if err != nil {
		return err
	}
	pr := &p.job.Project
	dst := []*string{&pr.Name, &pr.Drawing, &pr.Revision, &pr.Date, &pr.Drafter, &pr.Checker, &pr.Scale}
	for i, k := range projectKeys {
		v := b.vals[k]
		if v == nil {
			continue
		}
		if *dst[i], err = p.word(v, b.sub(k)); err != nil {
			return err
		}
		if len(*dst[i]) > maxTitleText {
			return p.errAt(v, b.sub(k), fmt.Sprintf("is longer than %d characters", maxTitleText), "a title-block field is one line")
		}
	}
	return nil
}

// parseFarEndKind reads member.far_end: mirror or plain, or a mapping (the
// far end's own connection, read by parseFarEnd once the near end's blocks
// are read).
func (p *parser) parseFarEndKind(n *yaml.Node) error {
	fe := &p.job.Member.FarEnd
	if n == nil {
		return nil
	}
	fe.Given = true
	if n.Kind == yaml.MappingNode {
		fe.Kind, fe.node = FarOwn, n
		return nil
	}
	w, err := p.word(n, "member.far_end")
	switch {
	case err != nil:
		return err
	case w == FarMirror.String():
		fe.Kind = FarMirror
	case w == FarPlain.String():
		fe.Kind = FarPlain
	default:
		return p.errAt(n, "member.far_end", fmt.Sprintf("unknown far end %q (want mirror, plain, or the far end's own plate: and bolts: blocks)", w),
			"mirror: the near end's connection mirrored about mid-length; plain: no holes")
	}
	return nil
}

// farEndKeys are the blocks of the far end's own connection.
var farEndKeys = []string{"plate", "bolts"}

// parseFarEnd reads the far end's own connection into a job of its own:
// a copy of the job with that plate and those bolts, read by the near
// end's readers, so the keys and their rules are the same.
func (p *parser) parseFarEnd() error {
	fe := &p.job.Member.FarEnd
	if fe.Kind != FarOwn {
		return nil
	}
	b, err := p.mapping(fe.node, "member.far_end", farEndKeys)
	if err != nil {
		return err
	}
	if !b.has("bolts") {
		return p.missing(b, "member.far_end.bolts", "is required for a far end of its own",
			"give the far end's bolts: block (the near end's keys), or far_end: mirror or plain")
	}
	far := *p.job
	far.Plate, far.Bolts, far.Holes, far.root = nil, BoltSpec{}, nil, nil
	far.Member.FarEnd = FarEndSpec{}
	near := func(k string) bool {
		for _, b := range []string{"plate", "bolts", "holes"} {
			if k == b || strings.HasPrefix(k, b+".") || strings.HasPrefix(k, b+"[") {
				return true
			}
		}
		return false
	}
	far.Raw, far.lines = maps.Clone(p.job.Raw), maps.Clone(p.job.lines)
	maps.DeleteFunc(far.Raw, func(k, _ string) bool { return near(k) })
	maps.DeleteFunc(far.lines, func(k string, _ int) bool { return near(k) })
	for _, k := range farEndKeys {
		if l, ok := p.job.lines["member.far_end."+k]; ok {
			far.lines[k] = l
		}
	}
	sub := &parser{job: &far}
	if n := b.vals["plate"]; n != nil {
		if err := sub.parsePlate(n); err != nil {
			return FarEndError(err)
		}
	}
	if err := sub.parseBolts(b.vals["bolts"]); err != nil {
		return FarEndError(err)
	}
	if err := sub.checkPlyHoles(); err != nil {
		return FarEndError(err)
	}
	fe.Job = &far
	return nil
}

// FarEndError names an error of the far end's own job under
// member.far_end: its plate and bolts fields are member.far_end.plate.… and
// member.far_end.bolts.…; other errors are returned as they are.
func FarEndError(err error) error {
	var ie *InputError
	if !errors.As(err, &ie) {
		return err
	}
	for _, b := range farEndKeys {
		if ie.Field == b || strings.HasPrefix(ie.Field, b+".") {
			out := *ie
			out.Field = "member.far_end." + ie.Field
			return &out
		}
	}
	return err
}
