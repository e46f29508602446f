package sheet

import (
	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/rules"
	"strings"
	"testing"
)

// TestSheetPerPly: the plate view (so the plate's CAM file), the hole
// schedule and the title block show each ply's own holes. Member: long
// slots across the load, 13/16 × 1-7/8; plate: standard 13/16 (AISC 360-22 Table J3.3, 3/4-in bolt).
func TestSheetPerPly(t *testing.T) {
	job := plyJob("", "  hole: long-slot\n  slot: transverse\n", "  hole: standard\n")
	r := checkedSource(t, job)
	s, err := NewSheet(r, true)
	if err != nil {
		t.Fatal(err)
	}
	parts := map[string]Part{}
	for _, v := range s.Views {
		parts[v.Part.Name] = v.Part
	}
	for _, h := range parts["member"].Holes {
		if h.Type != rules.LongSlot || !near(h.Dx, 13.0/16) || !near(h.Dy, 1+7.0/8) {
			t.Errorf("member %s: %s %g × %g, want a long slot 13/16 along x × 1-7/8 along y", h.ID, h.Type, h.Dx, h.Dy)
		}
	}
	for _, h := range parts["plate"].Holes {
		if h.Type != rules.Standard || !h.Round() || !near(h.Dx, 13.0/16) || !near(h.Dy, 13.0/16) {
			t.Errorf("plate %s: %s %g × %g, want a standard 13/16 hole", h.ID, h.Type, h.Dx, h.Dy)
		}
	}
	if len(s.Schedule) != 3 || s.Schedule[1][3] != "LONG-SLOT" || !strings.Contains(s.Schedule[1][2], "SLOT TRANSVERSE") ||
		s.Schedule[2][3] != "STANDARD" || !strings.HasSuffix(s.Schedule[2][2], "DIA") {
		t.Errorf("schedule %q", s.Schedule)
	}
	want := "long-slot transverse holes in the member, standard in the plate"
	var bolts string
	for _, f := range s.Title {
		if f[0] == "BOLTS" {
			bolts = f[1]
		}
	}
	if !strings.HasSuffix(bolts, want) {
		t.Errorf("title block BOLTS %q, want it to end %q", bolts, want)
	}
}

// plyJob is an L4x4x1/2 to a 1/2-in gusset, four 3/4-in A325 bolts, with
// the hole keys given added to the bolts, member and plate blocks.
func plyJob(bolts, member, plate string) string {
	s := `mark: D2
load:
  dead: 20 kip
  live: 60 kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
  length: 10 ft
plate:
  thickness: 1/2 in
  grade: A572-50
  width: 12 in
  edge: 1-1/2 in
bolts:
  diameter: 3/4 in
  grade: A325
  per_line: 4
  pitch: 3 in
  end: 1-1/2 in
  gage: 2-1/2 in
`
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

// checkedSource checks the job given as YAML text.
func checkedSource(t *testing.T, src string) *detail.Report {
	t.Helper()
	j, err := jobfile.ParseJob("test.yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	d, err := detail.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	r, err := detail.Check(d)
	if err != nil {
		t.Fatal(err)
	}
	return r
}
