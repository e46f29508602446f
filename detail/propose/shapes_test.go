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

// rolledJob is a propose job for a catalog WT, channel or W loaded to a
// third of its design yield strength (invented load; the property below
// asserts only what check says of the chosen layout).
func rolledJob(shape, size string, tp string) string {
	return fmt.Sprintf(`mark: RS-1
load:
  required: %s
member:
  shape: %s
  size: %s
  grade: A992
  length: 12 ft
plate:
  thickness: %s
  grade: A572-50
  width: 24 in
bolts:
  grade: A325
stock:
  diameters: [5/8 in, 3/4 in, 7/8 in, 1 in]
  max_lines: 4
  max_per_line: 6
`, "60 kip", shape, size, tp)
}

// The layout propose chooses for a rolled shape passes check, and moved a
// tolerance.position across the load either way, its holes still pass
// gage.workable (the fillets and the wrench beside the stem, the web or
// the channel's flanges): propose keeps that margin (common practice, no
// source: a hole is drilled within the tolerance of where it is drawn).
func TestPropertyRolledShapeLayoutChecksWithMargin(t *testing.T) {
	fams := map[string][]section.Family{"wt": {section.FamilyWT}, "channel": {section.FamilyC, section.FamilyMC}, "double-channel": {section.FamilyC, section.FamilyMC}, "w": {section.FamilyW}}
	found := 0
	rapid.Check(t, func(rt *rapid.T) {
		shape := rapid.SampledFrom([]string{"wt", "channel", "double-channel", "w"}).Draw(rt, "shape")
		var sizes []string
		for _, f := range fams[shape] {
			sizes = append(sizes, section.ShapeNames(f)...)
		}
		size := rapid.SampledFrom(sizes).Draw(rt, "size")
		tp := rapid.SampledFrom([]string{"3/8 in", "1/2 in", "3/4 in"}).Draw(rt, "tp")
		p := proposeSrc(rt, rolledJob(shape, size, tp))
		if !p.Found() {
			return
		}
		found++
		lj, err := jobfile.ParseJob("written.yaml", p.LayoutJob)
		if err != nil {
			rt.Fatalf("written job: %v", err)
		}
		r, err := detail.CheckJob(lj)
		if err != nil || !r.EndPass() {
			rt.Fatalf("%s %s: the proposed layout does not pass check (%v)\n%s", shape, size, err, p.LayoutJob)
		}
		for _, dy := range []units.Length{-lj.Tolerance.Position, lj.Tolerance.Position} {
			d, err := detail.Build(lj)
			if err != nil {
				rt.Fatal(err)
			}
			for i := range d.Conn.Holes {
				d.Conn.Holes[i].Y += dy
			}
			moved, err := detail.Check(d)
			if err != nil {
				rt.Fatal(err)
			}
			for _, f := range moved.Findings {
				if f.ID == "gage.workable" && !f.Pass {
					rt.Fatalf("%s %s: holes moved %s across fail %s (%s)\n%s", shape, size, units.FormatJob(dy, lj.Units), f.ID, f.Where, p.LayoutJob)
				}
			}
		}
	})
	if found < 20 {
		t.Errorf("only %d rolled-shape jobs got a layout: the property says little", found)
	}
	t.Logf("%d rolled-shape jobs got a layout", found)
}

// propose picks the usual flange gage of a WT or W where it is workable
// with the margin: WT8x25 with 3/4 in bolts, g = 3-1/2 in (AISC Shapes
// Database v15.0, WGi).
func TestProposeUsualFlangeGage(t *testing.T) {
	p := proposeSrc(t, rolledJob("wt", "WT8x25", "1/2 in"))
	if !p.Found() {
		t.Fatal("no layout")
	}
	if p.GageSource != GageUsual || p.Layout.Lines != 2 {
		t.Fatalf("gage source %q (%s), %d lines; want the usual gage, 2 lines", p.GageSource, p.GageNote, p.Layout.Lines)
	}
	g2 := p.Layout.Gage2
	if d := float64(g2 - 3.5*units.Inch); d > 1e-6 || d < -1e-6 {
		t.Errorf("gage2 %s, want 3-1/2 in (AISC Shapes Database v15.0, WT8x25 WGi)", units.FormatJob(g2, units.US))
	}
}

// When a channel is too small for gross yielding, the remedy is the
// lightest catalog channel that carries it: 200 kip LRFD in A36 needs
// Ag ≥ 200/(0.9·36) = 6.17 in² (D2(a), hand calculation), so C10x15.3
// (4.48 in², AISC Shapes Database v15.0) gives way to MC10x22 (6.45 in²,
// the same database), the smallest channel of the catalog above 6.17.
func TestRemedyLargerChannel(t *testing.T) {
	src := strings.Replace(rolledJob("channel", "C10x15.3", "3/4 in"), "60 kip", "200 kip", 1)
	src = strings.Replace(src, "grade: A992", "grade: A36", 1)
	p := proposeSrc(t, src)
	if p.Found() {
		t.Fatal("C10x15.3 carries 200 kip: it should fail gross yielding")
	}
	var member *Remedy
	for i := range p.Remedies {
		if p.Remedies[i].Kind == RemedyMember {
			member = &p.Remedies[i]
		}
	}
	if member == nil || member.Member != "MC10x22" {
		t.Fatalf("remedies %+v, want member MC10x22", p.Remedies)
	}
	j, err := jobfile.ParseJob("remedy.yaml", member.Job)
	if err != nil {
		t.Fatal(err)
	}
	if r, err := detail.CheckJob(j); err != nil || !r.EndPass() {
		t.Fatalf("the remedy's job does not pass check (%v)", err)
	}
}

// Two angles back to back that push, their connectors left to propose:
// it lays out the fewest intermediate connectors that keep each angle's
// a/ri within 3/4 of the pair's governing Lc/r (AISC 360-16 E6.2), writes
// them into the job (member.connectors), and that job passes check; one
// connector fewer fails connectors.spacing.
func TestProposeChoosesConnectors(t *testing.T) {
	j, err := jobfile.LoadJob("../../testdata/propose/us-double-angle-strut-connectors.yaml")
	if err != nil {
		t.Fatal(err)
	}
	p, err := Propose(j, ProposeOptions{})
	if err != nil || !p.Found() {
		t.Fatalf("propose: %v, found %v", err, p != nil && p.Found())
	}
	n := p.Job.Member.Buckling.Connectors
	if !p.Job.ConnectorsChosen || n < 1 {
		t.Fatalf("connectors chosen %v, %d: want at least one", p.Job.ConnectorsChosen, n)
	}
	lj, err := jobfile.ParseJob("written.yaml", p.LayoutJob)
	if err != nil {
		t.Fatal(err)
	}
	if lj.Member.Buckling.Connectors != n {
		t.Errorf("written job has %d connectors, propose chose %d", lj.Member.Buckling.Connectors, n)
	}
	r, err := detail.CheckJob(lj)
	if err != nil || !r.Pass {
		t.Fatalf("the written job does not pass check (%v)", err)
	}
	lj.Member.Buckling.Connectors = n - 1
	d, err := detail.Build(lj)
	if err != nil {
		t.Fatal(err)
	}
	fewer, err := detail.Check(d)
	if err != nil {
		t.Fatal(err)
	}
	failed := false
	for _, f := range fewer.Findings {
		failed = failed || (f.ID == "connectors.spacing" && !f.Pass)
	}
	if !failed {
		t.Errorf("with %d connectors E6.2 still passes: propose did not choose the fewest", n-1)
	}
}
