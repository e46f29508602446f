package propose

import (
	"math"
	"path/filepath"
	"slices"
	"strconv"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// Bolt shear per bolt, AISC Manual Table 7-1 (single shear, threads
// included, LRFD φrn), from memory; the table rounds to 3 significant
// figures: 0.5 %.
const (
	table71A34  = 17.9 // 3/4 in Group A-N (A325-N)
	table71B34  = 22.5 // 3/4 in Group B-N (A490-N)
	table71A78  = 24.3 // 7/8 in Group A-N
	table71A100 = 31.8 // 1 in Group A-N
	tableTol    = 0.005
)

// remedyCase is a job in which nothing in stock passes and what would.
type remedyCase struct {
	file  string
	kinds []RemedyKind // the remedies found, in order
	value string       // the first remedy's new value
	// The available strength of limit state id in the first remedy's
	// layout (kips, per bolt when perBolt; 0: not asserted), with its
	// source.
	id      string
	avail   float64
	perBolt bool
	src     string
}

var remedyCases = []remedyCase{
	// 4 · 17.9 = 71.6 < 80 kips in stock; four A490-N: 4 · 22.5 = 90.1.
	{"infeasible-grade.yaml", []RemedyKind{RemedyGrade, RemedyDiameter, RemedyPerLine}, "A490", "bolts.shear", table71B34, true,
		"AISC Manual Table 7-1, 3/4 in Group B-N (from memory)"},
	// Two bolts at most against 50 kips: A490-N 2 · 22.5 = 45.1 and
	// 7/8 in 2 · 24.3 = 48.7 fall short (Table 7-1), 1 in A325-N carries
	// 2 · 31.8 = 63.6.
	{"infeasible-bolts.yaml", []RemedyKind{RemedyDiameter, RemedyPerLine, RemedyLines}, "1 in", "bolts.shear", table71A100, true,
		"AISC Manual Table 7-1, 1 in Group A-N (from memory)"},
	// The Whitmore width is capped by the 6 in plate: φRn = 0.9 · 36 · 6 ·
	// t whatever the layout, 48.6 kips at 1/4 in against 60; the next
	// plate, 5/16 in, gives 0.9 · 36 · 6 · 5/16 = 60.75 kips (AISC 360-22
	// J4.1(a), hand calculation). More bolts or lines widen nothing.
	{"infeasible-plate.yaml", []RemedyKind{RemedyPlate}, "5/16 in", "plate.yield", 60.75, false,
		"AISC 360-22 J4.1(a), hand calculation"},
	// Gross yielding needs Ag ≥ 60 / (0.9 · 36) = 1.85 in² (D2(a), hand
	// calculation): only a larger member helps.
	{"infeasible-yield.yaml", []RemedyKind{RemedyMember}, "", "", 0, false, ""},
}

func loadPropose(t testing.TB, name string) *jobfile.Job {
	t.Helper()
	job, err := jobfile.LoadJob(filepath.Join("../..", "testdata", "propose", name))
	if err != nil {
		t.Fatal(err)
	}
	return job
}

// TestRemedies: the remedies of each infeasible job, in remedy order,
// each a job file that check passes at the ratio reported, with the
// change written in.
func TestRemedies(t *testing.T) {
	for _, c := range remedyCases {
		t.Run(c.file, func(t *testing.T) {
			p, err := Propose(loadPropose(t, c.file), ProposeOptions{})
			if err != nil {
				t.Fatal(err)
			}
			if p.Found() {
				t.Fatal("a layout passes in stock")
			}
			var kinds []RemedyKind
			for _, r := range p.Remedies {
				kinds = append(kinds, r.Kind)
				recheck(t, p.Job, r)
			}
			if !slices.Equal(kinds, c.kinds) {
				t.Fatalf("remedies %v, want %v", kinds, c.kinds)
			}
			if c.value != "" && p.Remedies[0].Value != c.value {
				t.Errorf("first remedy %q, want %q", p.Remedies[0].Value, c.value)
			}
			if c.avail > 0 {
				r := checkRemedy(t, p.Remedies[0])
				x, _ := resultOf(r, c.id)
				got := x.Available.Kip()
				if c.perBolt {
					got /= float64(p.Remedies[0].Layout.Bolts())
				}
				if math.Abs(got-c.avail) > tableTol*c.avail {
					t.Errorf("%s: available %.2f kips, want %.2f (%s)", c.id, got, c.avail, c.src)
				}
			}
		})
	}
}

// checkRemedy checks the remedy's job file as `gaugeline check` would.
func checkRemedy(t *testing.T, r Remedy) *detail.Report {
	t.Helper()
	j, err := jobfile.ParseJob("remedy.yaml", r.Job)
	if err != nil {
		t.Fatalf("%s: the remedy's job does not parse: %v\n%s", r.Change, err, r.Job)
	}
	rep, err := detail.CheckJob(j)
	if err != nil {
		t.Fatalf("%s: %v", r.Change, err)
	}
	return rep
}

// recheck: the remedy's job passes check with the reported governing
// limit state and ratio, and carries the change.
func recheck(t *testing.T, job *jobfile.Job, r Remedy) {
	t.Helper()
	rep := checkRemedy(t, r)
	g := rep.GoverningResult()
	if !rep.Pass || g.ID != r.Governing || math.Abs(g.Ratio-r.Ratio) > 1e-9 {
		t.Errorf("%s: check gives pass %v, %s %.6f; the remedy says %s %.6f", r.Change, rep.Pass, g.ID, g.Ratio, r.Governing, r.Ratio)
	}
	j, _ := jobfile.ParseJob("remedy.yaml", r.Job)
	l := r.Layout
	sys := job.Units
	var has bool
	switch r.Kind {
	case RemedyGrade:
		has = j.Bolts.Grade == r.Value && l.Grade == r.Value
	case RemedyDiameter:
		d, err := units.ParseBoltDiameter(r.Value, sys)
		has = err == nil && j.Bolts.Diameter == d && l.Diameter == d
	case RemedyPlate:
		has = j.Plate != nil && jobfile.LengthText(j.Plate.Thickness, sys) == r.Value
	case RemedyPerLine:
		has = j.Bolts.PerLine == l.PerLine && r.Value == strconv.Itoa(l.PerLine)
	case RemedyLines:
		has = j.Bolts.Lines == l.Lines && r.Value == strconv.Itoa(l.Lines)
	case RemedyMember:
		has = j.Member.Size == r.Value && r.Member == r.Value && r.Value != job.Member.Size
	}
	if !has {
		t.Errorf("%s: the remedy's job or layout lacks the change %q:\n%s", r.Change, r.Value, r.Job)
	}
}

// TestRemedyIsSmallest: every change listed before a remedy, in its own
// relaxation, fails; and a relaxation without a remedy has no change
// that passes. So no smaller change in the remedy order passes.
func TestRemedyIsSmallest(t *testing.T) {
	for _, c := range remedyCases {
		t.Run(c.file, func(t *testing.T) {
			job := loadPropose(t, c.file)
			prop, err := Propose(job, ProposeOptions{})
			if err != nil {
				t.Fatal(err)
			}
			p, err := newProblem(job)
			if err != nil {
				t.Fatal(err)
			}
			for _, rx := range relaxations {
				at := slices.IndexFunc(prop.Remedies, func(r Remedy) bool { return r.Kind == rx.kind })
				for _, ch := range rx.changes(p) {
					_, _, ok := p.tryChange(rx.kind, ch, remedyLimit)
					if at >= 0 && ch.value == prop.Remedies[at].Value {
						if !ok {
							t.Errorf("%s: the remedy does not pass when tried alone", ch.text)
						}
						break
					}
					if ok {
						t.Errorf("%v: %s passes, yet the remedy is %v", rx.kind, ch.text, prop.Remedies)
						break
					}
				}
			}
		})
	}
}

// TestRemedyMember: the member remedy of the yield-blocked job has the
// area gross yielding needs, and every smaller area the catalog lists
// with that leg connected was passed over.
func TestRemedyMember(t *testing.T) {
	p, err := Propose(loadPropose(t, "infeasible-yield.yaml"), ProposeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(p.Remedies) != 1 {
		t.Fatalf("remedies %+v", p.Remedies)
	}
	r := checkRemedy(t, p.Remedies[0])
	y, _ := resultOf(r, "member.yield")
	// Ag ≥ 60 / (0.9 · 36) = 1.852 in² (AISC 360-22 D2(a), hand calculation)
	if ag := r.Design.Conn.Member.Ag.In2(); ag < 60/(0.9*36) || !y.Pass {
		t.Errorf("%s: Ag %.3f in2, yield pass %v; want Ag ≥ 1.852 in2", p.Remedies[0].Member, ag, y.Pass)
	}
}

// TestNoRemediesWhenFound: a job that passes in stock lists none.
func TestNoRemediesWhenFound(t *testing.T) {
	p, err := Propose(loadPropose(t, "us-angle-brace.yaml"), ProposeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if !p.Found() || len(p.Remedies) != 0 || p.RemedyEvaluated != 0 {
		t.Errorf("found %v, remedies %+v (%d checks)", p.Found(), p.Remedies, p.RemedyEvaluated)
	}
}

// BenchmarkProposeRemedies is the pruned search of the infeasible jobs,
// with their diagnosis and remedies.
func BenchmarkProposeRemedies(b *testing.B) {
	for _, c := range remedyCases {
		job := loadPropose(b, c.file)
		b.Run(c.file, func(b *testing.B) {
			var p *Proposal
			var err error
			for b.Loop() {
				if p, err = Propose(job, ProposeOptions{}); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(p.RemedyEvaluated), "remedy-checks/op")
		})
	}
}
