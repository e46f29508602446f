package qa

import (
	"fmt"
	"strings"

	"gaugeline/detail/jobfile"
)

// MeasuredPart is the piece a measured file is of: its holes are those of
// one piece (SPEC §8 measures a piece, not the joint).
type MeasuredPart int

const (
	MeasuredMember   MeasuredPart = iota // the member (both angles of a pair alike); the whole member with member.length
	MeasuredPlate                        // the near end's gusset or splice plate
	MeasuredFarPlate                     // the far end's own plate (member.far_end with a plate: block)
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

// parts is the part table. A splice's plates slot in here as rows of
// their own ("splice-1", "splice-2": plate.kind splice with count 2), each
// with the frame and the design holes of its plate.
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
}

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
