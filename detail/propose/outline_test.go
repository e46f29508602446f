package propose

import (
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"slices"
	"strings"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// A gusset already drawn (testdata/propose/us-outline-gusset.yaml, its
// free edge at x = 12 in, a corner clipped): propose lays out the bolts
// inside it and writes a job that keeps the outline and has no edge key.
func TestProposeOutline(t *testing.T) {
	p := proposeFile(t, "us-outline-gusset.yaml", false)
	if !p.Found() || !p.Outline || !p.Layout.Outline {
		t.Fatalf("found %v, outline %v/%v: %s", p.Found(), p.Outline, p.Layout.Outline, p.Summary)
	}
	// Least bolts by hand: a 1-in A325-N bolt in single shear carries
	// φ·Fnv·Ab = 0.75 · 54 ksi · 0.785 in² = 31.8 kips (AISC 360-22 J3.7,
	// Table J3.2), so 95 kips needs at least ceil(95 / 31.8) = 3 bolts of
	// the largest diameter in stock.
	if p.Layout.Bolts() != 3 {
		t.Errorf("%d bolts, want 3 (the least bolt shear allows)", p.Layout.Bolts())
	}
	// The edge reported is measured: the outline's free edge at 12 in less
	// the last bolt, end + (n − 1)·pitch.
	l := p.Layout
	last := l.End + units.Length(l.PerLine-1)*l.Pitch
	if want := 12*units.Inch - last; math.Abs(float64(l.PlateEdge-want)) > 1e-9 {
		t.Errorf("plate edge %v, want 12 in − %v = %v", l.PlateEdge, last, want)
	}
	out := string(p.LayoutJob)
	if !strings.Contains(out, "outline:") || !strings.Contains(out, "clip:") {
		t.Errorf("the written job lost the outline:\n%s", out)
	}
	lj, err := jobfile.ParseJob("layout.yaml", p.LayoutJob)
	if err != nil {
		t.Fatalf("the written job does not read: %v\n%s", err, out)
	}
	if lj.Plate.Edge != 0 || lj.Plate.Width != 0 || !slices.Equal(lj.Plate.Outline, p.Job.Plate.Outline) {
		t.Errorf("written plate: edge %v, width %v, outline %v; want the job's outline %v alone",
			lj.Plate.Edge, lj.Plate.Width, lj.Plate.Outline, p.Job.Plate.Outline)
	}
	r, err := detail.CheckJob(lj)
	if err != nil || !r.Pass {
		t.Fatalf("the written job does not pass check: %v", err)
	}
	for _, a := range p.Alternatives {
		if !a.Layout.Outline {
			t.Errorf("alternative %s is not on the outline", a.Layout.Describe(units.US))
		}
	}
	js, err := p.JSON(Pruned)
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Plate  struct{ Outline bool }
		Search struct{ Mode string }
	}
	if err := json.Unmarshal(js, &doc); err != nil || !doc.Plate.Outline || doc.Search.Mode != "exhaustive" {
		t.Errorf("JSON plate.outline %v, search.mode %q (%v); want true, exhaustive", doc.Plate.Outline, doc.Search.Mode, err)
	}
}

// Why an outline is searched candidate by candidate: on a fixed outline a
// longer end can fail where a shorter one passes (the last bolt runs into
// the free edge), which the pruned search's monotonicity rules out.
func TestOutlineBreaksMonotonicity(t *testing.T) {
	job := loadProposeJob(t, "us-outline-gusset.yaml")
	check := func(end string) *detail.Report {
		t.Helper()
		data, err := job.Rewrite([]jobfile.Setting{
			{Block: "plate", Key: "thickness", Value: "1/2 in", Tag: "!!str"},
			boltSetting("diameter", "1 in", "!!str"), boltSetting("grade", "A325", "!!str"),
			boltSetting("lines", "1", "!!int"), boltSetting("per_line", "3", "!!int"),
			boltSetting("pitch", "3 in", "!!str"), boltSetting("end", end, "!!str"), boltSetting("gage", "2-1/2 in", "!!str"),
		})
		if err != nil {
			t.Fatal(err)
		}
		j, err := jobfile.ParseJob("m.yaml", data)
		if err != nil {
			t.Fatal(err)
		}
		r, err := detail.CheckJob(j)
		if err != nil {
			t.Fatal(err)
		}
		return r
	}
	short, long := check("3-1/2 in"), check("5 in")
	if !short.Pass {
		t.Fatalf("end 3-1/2 in: %s fails", short.GoverningResult().ID)
	}
	// end 5 in: the last bolt at 11 in, 1 in from the free edge, less than
	// the 1-1/4 in of AISC 360-22 Table J3.4 for a 1-in bolt.
	failing := false
	for _, f := range long.Findings {
		failing = failing || (f.ID == "edge.min" && !f.Pass)
	}
	if long.Pass || !failing {
		t.Errorf("end 5 in: pass %v, edge.min failing %v; want it to fail edge.min at the free edge", long.Pass, failing)
	}
}

// Nothing passes on the outline: the diagnosis, over every candidate,
// says what blocks. Only 3/4-in bolts, at most two lines of two: a 3/4-in
// A325-N bolt in single shear carries 0.75 · 54 ksi · 0.442 in² = 17.9
// kips (AISC 360-22 J3.7, Table J3.2), so 95 kips needs ceil(95 / 17.9) =
// 6 bolts, more than the 4 the stock allows. With the full stock but 120
// kips, no one check fails everywhere, and the closest layout is named
// on its outline.
func TestProposeOutlineInfeasible(t *testing.T) {
	src, err := os.ReadFile(filepath.Join("../..", "testdata", "propose", "us-outline-gusset.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	run := func(from, to []string) *Proposal {
		t.Helper()
		s := string(src)
		for i := range from {
			if !strings.Contains(s, from[i]) {
				t.Fatalf("the job has no %q", from[i])
			}
			s = strings.Replace(s, from[i], to[i], 1)
		}
		j, err := jobfile.ParseJob("tight.yaml", []byte(s))
		if err != nil {
			t.Fatal(err)
		}
		p, err := Propose(j, ProposeOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if p.Found() {
			t.Fatalf("found %s", p.Layout.Describe(units.US))
		}
		return p
	}
	p := run([]string{"diameters: [3/4 in, 7/8 in, 1 in]", "max_per_line: 8"}, []string{"diameters: [3/4 in]", "max_per_line: 2"})
	if len(p.Blockers) == 0 || p.Blockers[0].ID != "bolts.shear" || !strings.Contains(p.Summary, "needs at least 6 bolts") {
		t.Errorf("blockers %+v, summary %q; want bolt shear needing 6 bolts", p.Blockers, p.Summary)
	}
	p = run([]string{"required: 95 kip"}, []string{"required: 120 kip"})
	if !strings.Contains(p.Summary, "on its outline") {
		t.Errorf("summary %q does not name the closest layout on the outline", p.Summary)
	}
}

// The limit on candidates names the outline as the reason the search is
// exhaustive.
func TestProposeOutlineLimit(t *testing.T) {
	job := loadProposeJob(t, "us-outline-gusset.yaml")
	_, err := Propose(job, ProposeOptions{MaxCandidates: 100})
	var le *SearchLimitError
	if !errors.As(err, &le) || !le.Outline || !strings.Contains(err.Error(), "plate outline") {
		t.Fatalf("error %v, want a search limit naming the outline", err)
	}
}

// A splice plate in compression buckles over the clear length between the
// two groups, 2·end + gap (engine.BucklingLengths), so a longer end lowers
// plate.compression: the pruned search's monotonicity in the end fails. (Found by
// TestProposeFastEqualsExhaustive: the pruned search missed a shorter
// passing layout of this splice.) The search takes one group per end
// distance, each monotone in pitch and edge (problem.byEnd).
func TestSpliceCompressionBreaksMonotonicity(t *testing.T) {
	const src = `mark: SC-1
load: {required: 10 kip, compression: 33 kip}
member: {shape: angle, length: 72 in, size: L6x6x7/8, grade: A588}
plate: {kind: splice, thickness: 3/8 in, grade: A36, width: 12 in, edge: 1 in}
bolts: {diameter: 3/4 in, grade: A490, threads: included, joint: pretensioned, deformation: not-considered,
  per_line: 2, pitch: 2-1/2 in, end: END, gage: 3-1/2 in}
`
	ratio := func(end string) float64 {
		t.Helper()
		j, err := jobfile.ParseJob("sc.yaml", []byte(strings.Replace(src, "END", end, 1)))
		if err != nil {
			t.Fatal(err)
		}
		r, err := detail.CheckJob(j)
		if err != nil {
			t.Fatal(err)
		}
		x, ok := resultOf(r, "plate.compression")
		if !ok {
			t.Fatal("no plate.compression")
		}
		return x.Ratio
	}
	if short, long := ratio("1 in"), ratio("2 in"); long <= short {
		t.Errorf("plate.compression ratio %.4f at end 1 in, %.4f at 2 in; want it to grow with the end", short, long)
	}
	j, err := jobfile.ParseJob("sc.yaml", []byte(strings.Replace(strings.Replace(src, "end: END, ", "", 1),
		"diameter: 3/4 in, grade: A490,", "", 1)+"stock: {diameters: [3/4 in], grades: [A490], max_lines: 1, max_per_line: 3, step: 1/2 in}\n"))
	if err != nil {
		t.Fatal(err)
	}
	// With a group per end distance the pruned search is exact again.
	fast, err := Propose(j, ProposeOptions{Alternatives: 3})
	if err != nil {
		t.Fatal(err)
	}
	ex, err := Propose(j, ProposeOptions{Mode: Exhaustive, Alternatives: 3})
	if err != nil {
		t.Fatal(err)
	}
	if !fast.Found() || !reflect.DeepEqual(fast.Layout, ex.Layout) || !reflect.DeepEqual(fast.Alternatives, ex.Alternatives) {
		t.Errorf("pruned %s, exhaustive %s", fast.Layout.Describe(units.US), ex.Layout.Describe(units.US))
	}
	if fast.Evaluated >= ex.Evaluated {
		t.Errorf("pruned checked %d, exhaustive %d: nothing pruned", fast.Evaluated, ex.Evaluated)
	}
}
