package jobfile

import (
	"strings"
	"testing"

	"gaugeline/rules/units"
)

const spliceJob = `mark: SP-1
load: {required: 100 kip}
member: {shape: flat, width: 8 in, thickness: 3/4 in, grade: A36}
plate:
  kind: splice
  thickness: 1/2 in
  grade: A36
  width: 8 in
  edge: 1-1/2 in
`

// plate.count and plate.gap: the defaults (one plate; a gap of 1/4 in,
// 6 mm: common practice, no source) and the job's own values.
func TestSpliceCountAndGap(t *testing.T) {
	j := mustParse(t, spliceJob)
	if j.Plate.Count != 1 || j.Plate.Gap != units.Inch/4 {
		t.Errorf("defaults: count %d, gap %v mm; want 1 and 1/4 in", j.Plate.Count, float64(j.Plate.Gap))
	}
	j = mustParse(t, spliceJob+"  count: 2\n  gap: 0\n")
	if j.Plate.Count != 2 || j.Plate.Gap != 0 {
		t.Errorf("count %d, gap %v; want 2 and 0", j.Plate.Count, j.Plate.Gap)
	}
	if got := DefaultSpliceGap(units.SI); got != 6*units.Millimetre {
		t.Errorf("SI default gap %v mm, want 6", float64(got))
	}
}

func TestSpliceBadInput(t *testing.T) {
	gusset := strings.Replace(spliceJob, "kind: splice", "kind: gusset", 1)
	double := strings.Replace(spliceJob, "{shape: flat, width: 8 in, thickness: 3/4 in, grade: A36}",
		"{shape: double-angle, size: L4x4x1/2, grade: A36}", 1)
	for _, c := range []struct{ name, src, field, msg string }{
		{"count 3", spliceJob + "  count: 3\n", "plate.count", "from 1 to 2"},
		{"count on a gusset", gusset + "  count: 2\n", "plate.count", "is for a splice"},
		{"gap on a gusset", gusset + "  gap: 1/4 in\n", "plate.gap", "is for a splice"},
		{"negative gap", spliceJob + "  gap: -1/4 in\n", "plate.gap", "negative"},
		{"two plates on a double angle", double + "  count: 2\n", "plate.count", "double angle"},
		{"length of a splice", spliceJob + "  length: 18 in\n", "plate.length", "follows from both members' groups"},
	} {
		ie := parseErr(t, c.src)
		if ie.Field != c.field || !strings.Contains(ie.Msg, c.msg) || ie.Line <= 0 {
			t.Errorf("%s: %v (field %q line %d), want field %q with %q", c.name, ie, ie.Field, ie.Line, c.field, c.msg)
		}
	}
}
