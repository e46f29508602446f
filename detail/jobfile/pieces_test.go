package jobfile

import (
	"errors"
	"strings"
	"testing"

	"gaugeline/rules/units"
)

const piecesBase = `mark: P-1
load: {required: 60 kip}
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
  length: 16 ft
FAREND
bolts: {diameter: 3/4 in, grade: A325, per_line: 4, pitch: 3 in, end: 1-1/2 in, gage: 2-1/2 in}
`

// member.far_end: mirror by default, mirror or plain as written, or a
// connection of its own read by the near end's readers.
func TestFarEndKinds(t *testing.T) {
	for _, tt := range []struct {
		farEnd string
		want   FarEndKind
		given  bool
	}{
		{"", FarMirror, false},
		{"  far_end: mirror", FarMirror, true},
		{"  far_end: plain", FarPlain, true},
		{"  far_end:\n    bolts: {diameter: 7/8 in, grade: A325, per_line: 3, pitch: 3 in, end: 1-1/2 in, gage: 2-1/2 in}", FarOwn, true},
	} {
		j := mustParse(t, strings.Replace(piecesBase, "FAREND", tt.farEnd, 1))
		fe := j.Member.FarEnd
		if fe.Kind != tt.want || fe.Given != tt.given {
			t.Errorf("%q: kind %v given %v, want %v %v", tt.farEnd, fe.Kind, fe.Given, tt.want, tt.given)
		}
		if tt.want != FarOwn {
			if fe.Job != nil {
				t.Errorf("%q: a far job", tt.farEnd)
			}
			continue
		}
		// The far job: the far end's bolts (7/8 in, 3 per line), the
		// member and load of the job, no plate.
		f := fe.Job
		if f == nil || f.Bolts.PerLine != 3 || f.Bolts.Diameter != 7*units.Inch/8 || f.Plate != nil ||
			f.Member.Size != "L4x4x1/2" || f.Load.Required != j.Load.Required || f.Member.FarEnd.Kind != FarMirror {
			t.Errorf("far job %+v", f)
		}
		if j.Bolts.PerLine != 4 {
			t.Errorf("the near end's bolts changed: %+v", j.Bolts)
		}
	}
}

func TestFarEndErrors(t *testing.T) {
	for _, tt := range []struct {
		farEnd, field string
		line          int
	}{
		{"  far_end: own", "member.far_end", 8},
		{"  far_end: [mirror]", "member.far_end", 8},
		{"  far_end:\n    plate: {thickness: 1/2 in, grade: A36, width: 12 in}", "member.far_end.bolts", 8},
		{"  far_end:\n    holes: [[1 in, 2 in]]\n    bolts: {per_line: 1}", "member.far_end.holes", 9},
		{"  far_end:\n    bolts: {per_line: 3, pich: 3 in}", "member.far_end.bolts.pich", 9},
	} {
		_, err := ParseJob("test.yaml", []byte(strings.Replace(piecesBase, "FAREND", tt.farEnd, 1)))
		var ie *InputError
		if !errors.As(err, &ie) || ie.Field != tt.field || ie.Line != tt.line || ie.File != "test.yaml" {
			t.Errorf("%q: %v, want %s at line %d", tt.farEnd, err, tt.field, tt.line)
		}
	}
}

// The project block is read as written; the date is the job's text.
func TestProject(t *testing.T) {
	src := strings.Replace(piecesBase, "FAREND", "", 1) + `project:
  name: Warehouse 2
  drawing: S-501
  revision: B
  date: 2026-03-14
  drafter: J. Ortiz
  checker: M. Lund
  scale: 1:10 when printed
`
	p := mustParse(t, src).Project
	if want := (Project{Name: "Warehouse 2", Drawing: "S-501", Revision: "B", Date: "2026-03-14", Drafter: "J. Ortiz",
		Checker: "M. Lund", Scale: "1:10 when printed"}); p != want {
		t.Errorf("project %+v, want %+v", p, want)
	}
	if p := mustParse(t, strings.Replace(piecesBase, "FAREND", "", 1)).Project; p != (Project{}) {
		t.Errorf("no project block: %+v", p)
	}
	_, err := ParseJob("test.yaml", []byte(strings.Replace(piecesBase, "FAREND", "", 1)+"project:\n  name: "+strings.Repeat("x", 81)+"\n"))
	var ie *InputError
	if !errors.As(err, &ie) || ie.Field != "project.name" || ie.Line != 11 {
		t.Errorf("an 81-character name: %v", err)
	}
}
