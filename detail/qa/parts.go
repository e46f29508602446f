package qa

import (
	"fmt"
	"strings"

	"gaugeline/detail/jobfile"
	"gaugeline/engine"
)

// MeasuredPart is the piece a measured file is of: its holes are those of
// one piece (SPEC §8 measures a piece, not the joint).
type MeasuredPart int

const (
	MeasuredMember   MeasuredPart = iota // the member (both angles of a pair alike); the whole member with member.length
	MeasuredPlate                        // the near end's gusset or splice plate
	MeasuredFarPlate                     // the far end's own plate (member.far_end with a plate: block)
	MeasuredSplice1                      // the (first) splice plate: both members' groups (splice.go)
	MeasuredSplice2                      // the second splice plate of plate.count 2, designed as the first
	MeasuredNearEnd                      // the near end alone (an end stub): its holes, x from the near cut end
	MeasuredFarEnd                       // the far end alone: its holes, x from the far cut end
)

// partSpec is one row of the part table: the --part spelling, the words
// reports use, and whether (and why not) a job has the piece. A part is
// measured in a plate's frame (partFrame) when plate is set.
type partSpec struct {
	part  MeasuredPart
	name  string // the word of its CAM file, MARK-NAME.cam.dxf
	words string // for people: "the plate was measured"
	plate bool
	has   func(*jobfile.Job) bool
	none  string // the error where the job has no such piece
	hint  string
}

// parts is the part table. A splice's plates are splice-1 and splice-2
// (plate.count 2: one each side, designed alike); --part plate on a
// splice job is splice-1 (resolvePart): the one CAM file of the splice
// plates is MARK-plate.cam.dxf. near-end and far-end are one end of a
// member measured alone, each in its own end's frame.
var parts = []partSpec{
	{part: MeasuredMember, name: "member", words: "member", has: func(*jobfile.Job) bool { return true }},
	{part: MeasuredPlate, name: "plate", words: "plate", plate: true,
		has:  func(j *jobfile.Job) bool { return j.Plate != nil },
		none: "the job has no plate to measure", hint: "--part plate needs the job's plate block; a measured member is --part member"},
	{part: MeasuredFarPlate, name: "far-plate", words: "far end's plate", plate: true,
		has: func(j *jobfile.Job) bool {
			fe := j.Member.FarEnd
			return fe.Kind == jobfile.FarOwn && fe.Job != nil && fe.Job.Plate != nil
		},
		none: "the job's far end has no plate of its own to measure",
		hint: "--part far-plate needs member.far_end with a plate: block; the near end's plate is --part plate"},
	{part: MeasuredSplice1, name: "splice-1", words: "splice plate", plate: true,
		has:  isSplice,
		none: "the job has no splice plate to measure", hint: "--part splice-1 needs plate.kind: splice; a gusset is --part plate"},
	{part: MeasuredSplice2, name: "splice-2", words: "second splice plate", plate: true,
		has:  func(j *jobfile.Job) bool { return isSplice(j) && j.Plate.Count == 2 },
		none: "the job has no second splice plate to measure",
		hint: "--part splice-2 needs plate.kind: splice with plate.count: 2; a splice of one plate is --part splice-1"},
	{part: MeasuredNearEnd, name: "near-end", words: "near end", has: func(*jobfile.Job) bool { return true }},
	{part: MeasuredFarEnd, name: "far-end", words: "far end",
		has:  func(j *jobfile.Job) bool { return j.Member.Length > 0 && j.Member.FarEnd.Kind != jobfile.FarPlain },
		none: "the job has no far end with holes to measure",
		hint: "--part far-end needs member.length and a far end that is not plain; a job without member.length is one connection end: --part member"},
}

// isSplice is whether the job's plate is a splice plate.
func isSplice(j *jobfile.Job) bool { return j.Plate != nil && j.Plate.Kind == engine.Splice }

// resolvePart is the part p means on job: --part plate on a splice job
// is splice-1.
func resolvePart(job *jobfile.Job, p MeasuredPart) MeasuredPart {
	if p == MeasuredPlate && isSplice(job) {
		return MeasuredSplice1
	}
	return p
}

// isSplicePlate is whether the part is a splice plate.
func (p MeasuredPart) isSplicePlate() bool { return p == MeasuredSplice1 || p == MeasuredSplice2 }

func (p MeasuredPart) spec() partSpec {
	for _, s := range parts {
		if s.part == p {
			return s
		}
	}
	panic(fmt.Sprintf("qa: part %d is not in the part table", int(p)))
}

// String returns the flag spelling.
func (p MeasuredPart) String() string { return p.spec().name }

// isPlate is whether the part is measured in a plate's frame.
func (p MeasuredPart) isPlate() bool { return p.spec().plate }

// words names the part for people.
func (p MeasuredPart) words() string { return p.spec().words }

// ParsePart reads the --part flag.
func ParsePart(s string) (MeasuredPart, error) {
	names := make([]string, len(parts))
	for i, p := range parts {
		if p.name == s {
			return p.part, nil
		}
		names[i] = p.name
	}
	want := strings.Join(names[:len(names)-1], ", ") + " or " + names[len(names)-1]
	return MeasuredMember, fmt.Errorf("unknown part %q (want %s)", s, want)
}

// CheckPart refuses a part the job does not have: an *InputError naming
// --part.
func CheckPart(job *jobfile.Job, p MeasuredPart) error {
	s := p.spec()
	if s.has(job) {
		return nil
	}
	return &jobfile.InputError{File: job.File, Field: "--part", Msg: s.none, Hint: s.hint}
}
