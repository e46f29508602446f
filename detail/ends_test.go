package detail

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"strings"
	"testing"

	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// A job of our own, an L4x4x1/2 10 ft long into a gusset at each end;
// farEnd is spliced in as member.far_end. Numbers in these tests are the
// job's or follow from it.
func endsJob(farEnd string) string {
	return `mark: E-1
load: {required: 60 kip}
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
  length: 10 ft
` + farEnd + `plate: {kind: gusset, thickness: 1/2 in, grade: A572-50, width: 12 in, edge: 1-1/2 in}
bolts: {diameter: 3/4 in, grade: A325, threads: included, per_line: 4, pitch: 3 in, end: 1-1/2 in, gage: 2-1/2 in}
`
}

const ownFarEnd = `  far_end:
    plate: {kind: gusset, thickness: 3/8 in, grade: A572-50, width: 10 in, edge: 1-1/2 in}
    bolts: {diameter: 7/8 in, grade: A325, threads: included, per_line: 3, pitch: 3 in, end: 1-1/2 in, gage: 2-1/2 in}
`

// The far end of its own is checked as that connection would be at a near
// end: the same limit states, ratio for ratio, as the job with the far
// end's plate and bolts in place of the near end's.
func TestFarEndOwnIsCheckedAsItsConnection(t *testing.T) {
	r, err := CheckJob(mustParse(t, endsJob(ownFarEnd)))
	if err != nil {
		t.Fatal(err)
	}
	if r.Far == nil {
		t.Fatal("no far end report")
	}
	alone := `mark: E-1
load: {required: 60 kip}
member: {shape: angle, size: L4x4x1/2, grade: A36, length: 10 ft}
plate: {kind: gusset, thickness: 3/8 in, grade: A572-50, width: 10 in, edge: 1-1/2 in}
bolts: {diameter: 7/8 in, grade: A325, threads: included, per_line: 3, pitch: 3 in, end: 1-1/2 in, gage: 2-1/2 in}
`
	want, err := CheckJob(mustParse(t, alone))
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Far.Results) != len(want.Results) {
		t.Fatalf("far end: %d limit states, want %d", len(r.Far.Results), len(want.Results))
	}
	for i, x := range r.Far.Results {
		if w := want.Results[i]; x.ID != w.ID || x.Ratio != w.Ratio {
			t.Errorf("far end %s ratio %v, want %s %v", x.ID, x.Ratio, w.ID, w.Ratio)
		}
	}
	// The far end's holes in the member frame: 120 in − (1-1/2, 4-1/2, 7-1/2).
	far := r.FarHoles()
	for i, x := range []float64{118.5, 115.5, 112.5} {
		if got := units.US.ToJob(float64(far[i].X), units.DimLength); math.Abs(got-x) > 1e-9 {
			t.Errorf("far hole %d at x = %v in, want %v", i+1, got, x)
		}
	}
}

// The governing end is the one that fails, else the one of the higher
// governing ratio; the JSON's top-level results are its, verdict and
// failing the whole member's, and ends gives each end's.
func TestGoverningEnd(t *testing.T) {
	r, err := CheckJob(mustParse(t, endsJob(ownFarEnd)))
	if err != nil {
		t.Fatal(err)
	}
	g := r.GoverningEnd()
	other := r
	if g == r {
		other = r.Far
	}
	if g.endPass() == other.endPass() && g.GoverningResult().Ratio < other.GoverningResult().Ratio {
		t.Errorf("governing end's ratio %v below the other's %v", g.GoverningResult().Ratio, other.GoverningResult().Ratio)
	}
	if r.Pass != (r.endPass() && r.Far.endPass()) {
		t.Errorf("pass %v, near %v, far %v", r.Pass, r.endPass(), r.Far.endPass())
	}
	b, err := r.JSON()
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Verdict, Governing string
		GoverningEnd       string  `json:"governing_end"`
		GoverningRatio     float64 `json:"governing_ratio"`
		Ends               []struct {
			End, Verdict, Governing string
			GoverningRatio          float64 `json:"governing_ratio"`
			Holes                   []any
		}
	}
	if err := json.Unmarshal(b, &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Ends) != 2 || doc.Ends[0].End != "near" || doc.Ends[1].End != "far" {
		t.Fatalf("ends %+v", doc.Ends)
	}
	if len(doc.Ends[0].Holes) != 4 || len(doc.Ends[1].Holes) != 3 {
		t.Errorf("ends' holes %d and %d, want 4 and 3 (the job's)", len(doc.Ends[0].Holes), len(doc.Ends[1].Holes))
	}
	i := 0
	if doc.GoverningEnd == "far" {
		i = 1
	}
	if doc.GoverningEnd != r.GoverningEndName() || doc.Governing != doc.Ends[i].Governing || doc.GoverningRatio != doc.Ends[i].GoverningRatio {
		t.Errorf("governing %s %v at %s; ends %+v", doc.Governing, doc.GoverningRatio, doc.GoverningEnd, doc.Ends)
	}
	if doc.Verdict != r.Verdict() {
		t.Errorf("verdict %s, want %s", doc.Verdict, r.Verdict())
	}
	// A far end that fails governs though its ratio is lower: the far
	// end's bolts are made too few for the load (one 3/4-in A325 bolt,
	// φrn = 0.75·54 ksi·0.442 in² = 17.9 kip, Table J3.2, under 60 kip).
	weak := strings.Replace(ownFarEnd, "diameter: 7/8 in, grade: A325, threads: included, per_line: 3", "diameter: 3/4 in, grade: A325, threads: included, per_line: 1", 1)
	r, err = CheckJob(mustParse(t, endsJob(weak)))
	if err != nil {
		t.Fatal(err)
	}
	if r.Pass || r.Far.endPass() || r.GoverningEndName() != "far" {
		t.Errorf("weak far end: pass %v, far passes %v, governing end %s", r.Pass, r.Far.endPass(), r.GoverningEndName())
	}
}

// far_end: mirror (written or not) and far_end: plain leave the check and
// its JSON as they were: the ends are the same, or the far end carries
// nothing to check. (The bill of material after it differs for plain: one
// plate and one end's bolts; bom_test.go.)
func TestMirrorAndPlainLeaveTheReport(t *testing.T) {
	base, err := CheckJob(mustParse(t, endsJob("")))
	if err != nil {
		t.Fatal(err)
	}
	check := func(r *Report) []byte {
		b, err := json.Marshal(r.Document())
		if err != nil {
			t.Fatal(err)
		}
		return b
	}
	want, wantAll := check(base), mustJSON(t, base)
	for _, fe := range []string{"  far_end: mirror\n", "  far_end: plain\n"} {
		r, err := CheckJob(mustParse(t, endsJob(fe)))
		if err != nil {
			t.Fatal(err)
		}
		got := check(r)
		if fe == "  far_end: mirror\n" && !bytes.Equal(mustJSON(t, r), wantAll) {
			t.Errorf("mirror written: JSON (with its bill of material) differs from the job without far_end")
		}
		if r.Far != nil || !bytes.Equal(got, want) {
			t.Errorf("%q: far %v; JSON differs from the job without far_end", fe, r.Far)
		}
	}
	plain, _ := CheckJob(mustParse(t, endsJob("  far_end: plain\n")))
	if h := plain.FarHoles(); h != nil {
		t.Errorf("plain far end has holes %v", h)
	}
}

// Holes of the two ends must not overlap: member.length names the bad
// input. The near end's holes reach 10-1/2 + 13/32 = 10-29/32 in (Table
// J3.3: 13/16-in hole for a 3/4-in bolt); mirrored, 21-13/16 in in all.
func TestEndsOverlap(t *testing.T) {
	for _, tt := range []struct {
		length string
		bad    bool
	}{{"21 in", true}, {"21-13/16 in", true}, {"22 in", false}} {
		src := strings.Replace(endsJob(""), "length: 10 ft", "length: "+tt.length, 1)
		_, err := CheckJob(mustParse(t, src))
		var ie *jobfile.InputError
		switch {
		case tt.bad && (!errors.As(err, &ie) || ie.Field != "member.length" || ie.Line != 7):
			t.Errorf("%s: err %v, want member.length at line 7", tt.length, err)
		case !tt.bad && err != nil:
			t.Errorf("%s: %v", tt.length, err)
		}
	}
}

// An error of the far end's own connection names its field under
// member.far_end, on its line.
func TestFarEndErrorNamesItsField(t *testing.T) {
	src := endsJob(strings.Replace(ownFarEnd, "grade: A325, threads", "grade: A999, threads", 1))
	_, err := CheckJob(mustParse(t, src))
	var ie *jobfile.InputError
	if !errors.As(err, &ie) || ie.Field != "member.far_end.bolts.grade" || ie.Line != 10 {
		t.Errorf("err %v (%+v), want member.far_end.bolts.grade at line 10", err, ie)
	}
}

func mustJSON(t *testing.T, r *Report) []byte {
	t.Helper()
	b, err := r.JSON()
	if err != nil {
		t.Fatal(err)
	}
	return b
}
