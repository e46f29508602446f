package jobfile

import (
	"strings"
	"testing"

	"gaugeline/rules/units"
)

// plate.outline and plate.clip read back: the points are the job's own, in
// inches (1 in = 25.4 mm); the clipped corners are worked by hand.
const outlineJob = `mark: OL-1
load: {required: 40 kip}
member: {shape: angle, size: L4x4x1/2, grade: A36}
plate:
  thickness: 1/2 in
  grade: A36
  outline: [[-6 in, -3.5 in], [12 in, -3.5 in], [12 in, 8.5 in], [-6 in, 8.5 in], [-6 in, -3.5 in]]
`

func TestOutlineReadsBack(t *testing.T) {
	j := mustParse(t, outlineJob)
	in := float64(units.Inch)
	want := [][2]float64{{-6, -3.5}, {12, -3.5}, {12, 8.5}, {-6, 8.5}} // the closing point given again is dropped
	if got := j.Plate.Outline; len(got) != len(want) {
		t.Fatalf("%d points, want %d: %v", len(got), len(want), got)
	}
	for i, w := range want {
		if p := j.Plate.Outline[i]; p.X != w[0]*in || p.Y != w[1]*in {
			t.Errorf("point %d = %v mm, want %v in", i, p, w)
		}
	}
}

// Corner 3 (−6, 8.5) clipped 12 in toward the previous point (12, 8.5)
// and 6 in toward the next (−6, −3.5): (6, 8.5) then (−6, 2.5). Corner 1
// (12, −3.5) clipped 1 in both ways: (11, −3.5) then (12, −2.5).
func TestClipCutsTheCorners(t *testing.T) {
	j := mustParse(t, outlineJob+"  clip:\n    - {corner: 3, size: [12 in, 6 in]}\n    - {corner: 1, size: 1 in}\n")
	in := float64(units.Inch)
	want := [][2]float64{{-6, -3.5}, {11, -3.5}, {12, -2.5}, {12, 8.5}, {6, 8.5}, {-6, 2.5}}
	got := j.Plate.Outline
	if len(got) != len(want) {
		t.Fatalf("%d points, want %d: %v", len(got), len(want), got)
	}
	for i, w := range want {
		if d := max(abs(got[i].X-w[0]*in), abs(got[i].Y-w[1]*in)); d > 1e-9 {
			t.Errorf("point %d = (%.6f, %.6f) in, want %v", i, got[i].X/in, got[i].Y/in, w)
		}
	}
}

func abs(v float64) float64 { return max(v, -v) }

func TestOutlineErrors(t *testing.T) {
	notch := "  outline: [[0 in, 0 in], [10 in, 0 in], [10 in, 10 in], [7 in, 10 in], [7 in, 3 in], [3 in, 3 in], [3 in, 10 in], [0 in, 10 in]]\n"
	base := strings.Replace(outlineJob, "  outline: [[-6 in, -3.5 in], [12 in, -3.5 in], [12 in, 8.5 in], [-6 in, 8.5 in], [-6 in, -3.5 in]]\n", "", 1)
	for _, c := range []struct {
		name, src, field, msg string
	}{
		{"a point is a pair", base + "  outline: [[0 in, 0 in], [1 in], [0 in, 1 in]]\n", "plate.outline[1]", "want a point"},
		{"a repeated point", base + "  outline: [[0 in, 0 in], [1 in, 0 in], [1 in, 0 in], [0 in, 1 in]]\n", "plate.outline[2]", "repeats point 1"},
		{"clip without outline", base + "  width: 8 in\n  clip: [{corner: 0, size: 1 in}]\n", "plate.clip", "not given"},
		{"clip of a missing corner", outlineJob + "  clip: [{corner: 4, size: 1 in}]\n", "plate.clip[0].corner", ""},
		{"clip twice", outlineJob + "  clip: [{corner: 1, size: 1 in}, {corner: 1, size: 2 in}]\n", "plate.clip[1].corner", "clipped twice"},
		{"clip into the plate", base + notch + "  clip: [{corner: 4, size: 1 in}]\n", "plate.clip[0].corner", "points into the plate"},
		{"length beside outline", outlineJob + "  length: 18 in\n", "plate.length", "cannot be used with plate.outline"},
	} {
		ie := parseErr(t, c.src)
		if ie.Field != c.field || !strings.Contains(ie.Msg, c.msg) || ie.Line <= 0 {
			t.Errorf("%s: %v (field %q line %d), want field %q with %q", c.name, ie, ie.Field, ie.Line, c.field, c.msg)
		}
	}
}
