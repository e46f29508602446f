package propose

import (
	"fmt"
	"strings"
	"testing"

	"pgregory.net/rapid"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/rules/units"
)

// Usual gages in propose. The expected gages are section.WorkableGage's:
// US, the workable gages in angle legs of the AISC Steel Construction
// Manual, Table 1-7A (from memory, not read in the Manual's text); SI, the
// usual back marks of metric angle legs (from memory, no source checked).

// angleJob is a single angle on a gusset carrying a third of its design
// yield strength, with bolts of 1/2 to 7/8 in (M12 to M22) to choose from.
// extra is added to the bolts block; prefer, when set, is stock.prefer.
func angleJob(name string, sys units.System, extra, prefer string) string {
	a, _ := section.Lookup(name, sys)
	demand := 0.9 * 248 * float64(a.A) / 3 // N: φ·Fy·Ag/3 with Fy 248 MPa (36 ksi)
	load, diams, grade, u, tp, width := fmt.Sprintf("%.1f kip", demand/4448.2216), "[1/2 in, 5/8 in, 3/4 in, 7/8 in]", "A325", "us", "3/4 in", "24 in"
	if sys == units.SI {
		load, diams, grade, u, tp, width = fmt.Sprintf("%.1f kN", demand/1000), "[M12, M16, M20, M22]", "A325M", "si", "20 mm", "600 mm"
	}
	src := fmt.Sprintf(`mark: UG-1
units: %s
load:
  required: %s
member:
  shape: angle
  size: %s
  grade: A36
  length: 10 ft
plate:
  kind: gusset
  thickness: %s
  grade: A36
  width: %s
bolts:
  threads: included
  joint: bearing
%sstock:
  diameters: %s
  grades: [%s]
  max_lines: 2
  max_per_line: 5
`, u, load, name, tp, width, extra, diams, grade)
	if sys == units.SI {
		src = strings.Replace(src, "10 ft", "3 m", 1)
	}
	if prefer != "" {
		src += "  prefer: " + prefer + "\n"
	}
	return src
}

func proposeSrc(t interface {
	Helper()
	Fatalf(string, ...any)
}, src string) *Proposal {
	t.Helper()
	j, err := jobfile.ParseJob("ug.yaml", []byte(src))
	if err != nil {
		t.Fatalf("job: %v\n%s", err, src)
	}
	p, err := Propose(j, ProposeOptions{})
	if err != nil {
		t.Fatalf("propose: %v\n%s", err, src)
	}
	return p
}

// heelMargin is the least clearance the layout's holes keep beyond the
// gage.workable limits (fillet and wrench), in mm; false without a
// gage.workable finding.
func heelMargin(r *detail.Report) (float64, bool) {
	m, ok := 0.0, false
	for _, f := range r.Findings {
		if f.ID == "gage.workable" {
			if d := f.Measured - f.Limit; !ok || d < m {
				m, ok = d, true
			}
		}
	}
	return m, ok
}

// TestProposeUsualGageOnEveryAngle: on every angle of the US and SI
// catalogs, propose takes the usual gage lines whenever a layout at them
// passes with the margin propose keeps from the heel (the job's position
// tolerance); otherwise it says why it does not.
func TestProposeUsualGageOnEveryAngle(t *testing.T) {
	if testing.Short() {
		t.Skip("proposes every catalog angle")
	}
	usual := 0
	for _, sys := range []units.System{units.US, units.SI} {
		for _, name := range section.Names(sys) {
			a, _ := section.Lookup(name, sys)
			ug, ok := section.WorkableGage(a.A, sys)
			if !ok {
				continue
			}
			got := proposeSrc(t, angleJob(name, sys, "", ""))
			if !got.Found() {
				continue
			}
			tol := float64(got.Job.Tolerance.Position)
			f := func(v units.Length) string { return units.FormatJob(v, sys) }
			// The oracle: the same job with the usual gage lines fixed.
			atUsual := func(lines int, g, g2 units.Length) bool {
				extra := fmt.Sprintf("  lines: %d\n  gage: %s\n", lines, f(g))
				if lines == 2 {
					extra += "  gage2: " + f(g2) + "\n"
				}
				p := proposeSrc(t, angleJob(name, sys, extra, ""))
				if !p.Found() {
					return false
				}
				m, _ := heelMargin(p.Report)
				return m >= tol-1e-6
			}
			want := atUsual(1, ug.G, 0) || ug.G1 > 0 && atUsual(2, ug.G1, ug.G2)
			l := got.Layout
			isUsual := l.Lines == 1 && l.Gage == ug.G || l.Lines == 2 && l.Gage == ug.G1 && l.Gage2 == ug.G2
			if want != isUsual || want != (got.GageSource == GageUsual) {
				t.Errorf("%s: usual gage passes %v; chose %s (%s: %s)", name, want, l.Describe(sys), got.GageSource, got.GageNote)
			}
			if !want && got.GageSource != GageNotUsual {
				t.Errorf("%s: not at the usual gage but gage_source %q", name, got.GageSource)
			}
			if want {
				usual++
			}
		}
	}
	if usual < 50 {
		t.Errorf("only %d catalog angles took their usual gage: the test's loads and stock are not suitable", usual)
	}
	t.Logf("%d catalog angles at their usual gage", usual)
}

// TestPropertyProposedLayoutChecksWithMargin: on random catalog angles,
// loads and preference orders, the written job passes check, and holes
// drilled a whole position tolerance toward the heel still pass
// gage.workable (the fillet and the wrench's clearance, rules
// BoltClearances).
func TestPropertyProposedLayoutChecksWithMargin(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		sys := rapid.SampledFrom([]units.System{units.US, units.SI}).Draw(rt, "sys")
		name := rapid.SampledFrom(section.Names(sys)).Draw(rt, "size")
		prefer := ""
		if rapid.Bool().Draw(rt, "prefer") {
			all := []string{"usual-gage", "short-connection", "fewest-bolts", "thinnest-plate"}
			pr := rapid.Permutation(all).Draw(rt, "order")
			prefer = "[" + strings.Join(pr[:rapid.IntRange(1, 4).Draw(rt, "n")], ", ") + "]"
		}
		p := proposeSrc(rt, angleJob(name, sys, "", prefer))
		if !p.Found() {
			return
		}
		lj, err := jobfile.ParseJob("written.yaml", p.LayoutJob)
		if err != nil {
			rt.Fatalf("written job: %v", err)
		}
		r, err := detail.CheckJob(lj)
		if err != nil || !r.EndPass() {
			rt.Fatalf("%s: the proposed layout does not pass check (%v)\n%s", name, err, p.LayoutJob)
		}
		d, err := detail.Build(lj)
		if err != nil {
			rt.Fatal(err)
		}
		for i := range d.Conn.Holes {
			d.Conn.Holes[i].Y -= lj.Tolerance.Position
		}
		shifted, err := detail.Check(d)
		if err != nil {
			rt.Fatal(err)
		}
		for _, f := range shifted.Findings {
			if f.ID == "gage.workable" && !f.Pass {
				rt.Fatalf("%s: holes %s toward the heel fail %s (%s)", name,
					units.FormatJob(lj.Tolerance.Position, sys), f.ID, f.Where)
			}
		}
	})
}
