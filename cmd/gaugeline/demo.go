package main

import (
	"bytes"
	"context"
	"embed"
	"fmt"
	"io"
	"os"
	"path"
	"path/filepath"
	"strings"

	"github.com/spf13/cobra"

	"gaugeline/batch"
	"gaugeline/detail"
	"gaugeline/detail/calc"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/measured"
	"gaugeline/detail/propose"
	"gaugeline/detail/qa"
	"gaugeline/detail/sheet"
	"gaugeline/detail/texttab"
	"gaugeline/dxfout"
	"gaugeline/fileset"
	"gaugeline/ncout"
	"gaugeline/rules/units"
)

// The demo is a scenario of our own invention: five tension connections
// of a small pipe rack: three proposed, two whose layout the job fixes (a
// brace with a connection of its own at each end, one gusset with a
// clipped corner; a flat tie spliced between two plates) checked as
// given; each drawn, and one part re-verified from a measured file the
// demo makes up.
//
//go:embed demo/*.yaml
var demoJobs embed.FS

// demoQAMark is the part the demo re-verifies as fabricated.
const demoQAMark = "PR-VB2"

type demoOptions struct {
	dir string
}

func newDemoCmd(o *rootOptions) *cobra.Command {
	var do demoOptions
	cmd := command("demo [-o DIR]",
		"Run the built-in tour: propose, check, draw and re-verify an invented pipe rack's bracing",
		"demo walks the whole loop on five invented connections of a small pipe rack: it proposes a\n"+
			"bolt layout for three and checks the two whose layout is fixed (a brace with a different\n"+
			"connection at each end and a gusset with a clipped corner; a tie spliced between two plates),\n"+
			"writes each job, the check as JSON, the DXF cut sheet, the CAM files of every piece and the HTML\n"+
			"calculation report, then re-verifies one fabricated part from an invented measured file and\n"+
			"prints the QA verdict.",
		argsExactly(0, "no arguments"),
		func(_ context.Context, _ []string) error {
			return runDemo(do, o.stdout)
		})
	cmd.Flags().StringVarP(&do.dir, "output", "o", filepath.Join(os.TempDir(), "gaugeline-demo"),
		"directory for everything the demo writes")
	return cmd
}

func runDemo(do demoOptions, out io.Writer) error {
	entries, err := demoJobs.ReadDir("demo")
	if err != nil {
		return err
	}
	fmt.Fprintf(out, "gaugeline demo: pipe rack PR-3 (an invented scenario), %d bolted tension connections.\n", len(entries))
	fmt.Fprintf(out, "Everything is written to %s, one folder per mark\n\n", do.dir)
	unlock, err := lockOutput(do.dir, func(s string) { fmt.Fprintf(out, "note: %s\n", s) })
	if err != nil {
		return err
	}
	defer unlock()
	var qaJob *propose.Proposal
	for _, e := range entries {
		name := path.Join("demo", e.Name())
		job, data, err := demoJob(name)
		if err != nil {
			return err
		}
		if job.Bolts.Diameter != 0 && job.Bolts.PerLine != 0 { // a layout the job fixes: checked, not proposed
			if err := demoCheck(job, data, do.dir, out); err != nil {
				return err
			}
			continue
		}
		p, err := demoPropose(job)
		if err != nil {
			return err
		}
		if p.Job.Mark == demoQAMark {
			qaJob = p
		}
		line := fmt.Sprintf("propose  %s (checked %d of %d candidates)", p.Layout.Describe(p.Job.Units), p.Evaluated, p.Space)
		if err := demoWrite(p.Report, p.LayoutJob, line, do.dir, out); err != nil {
			return err
		}
	}
	if err := demoReverify(qaJob, do.dir, out); err != nil {
		return err
	}
	fmt.Fprintf(out, "\nNext: open the .html reports in a browser and the .dxf sheets in a CAD viewer; run\n")
	fmt.Fprintf(out, "'gaugeline check %s' to see a full check table. The README walks through each step.\n",
		filepath.Join(do.dir, qaJob.Job.Mark, qaJob.Job.Mark+".yaml"))
	fmt.Fprintf(out, "\n%s\n", detail.Caution)
	return nil
}

// demoJob reads one of the demo's jobs.
func demoJob(name string) (*jobfile.Job, []byte, error) {
	data, err := demoJobs.ReadFile(name)
	if err != nil {
		return nil, nil, err
	}
	job, err := jobfile.ParseJob(name, data)
	return job, data, err
}

// demoCheck checks a job whose layout is fixed (both ends) and writes its
// set as demoWrite does, the job as given.
func demoCheck(job *jobfile.Job, data []byte, dir string, out io.Writer) error {
	job.Stamp = stampFor("check", job)
	r, err := detail.CheckJob(job)
	if err != nil {
		return err
	}
	return demoWrite(r, data, "layout   fixed by the job (the shop's standard detail): checked as given", dir, out)
}

func demoPropose(job *jobfile.Job) (*propose.Proposal, error) {
	job.Stamp = stampFor("propose", job)
	p, err := propose.Propose(job, propose.ProposeOptions{})
	if err != nil {
		return nil, err
	}
	if !p.Found() {
		return nil, fmt.Errorf("demo: no layout for %s", job.Mark)
	}
	return p, nil
}

// demoWrite writes everything the loop makes of one checked job (jobYAML:
// the job file, with the proposed layout where it was proposed) and says
// so, how the layout was come by on the line after the member's.
func demoWrite(r *detail.Report, jobYAML []byte, how, dir string, out io.Writer) error {
	d := r.Design
	mark := d.Job.Mark
	js, err := r.JSON()
	if err != nil {
		return err
	}
	html, err := calc.HTML(r)
	if err != nil {
		return err
	}
	s, err := sheet.NewSheet(r, !r.Pass)
	if err != nil {
		return err
	}
	// the shop-floor files too: R12 beside each CAM file, DSTV NC1 and the
	// parts list, as sheet --dxf r12 --nc1 writes them
	dxfs, err := dxfout.FilesAs(s, dxfout.CAMWithR12)
	if err != nil {
		return err
	}
	if r.Pass {
		nc, err := ncout.Files(r, s)
		if err != nil {
			return err
		}
		dxfs = append(dxfs, nc...)
		if parts := batch.PartsOf(r, s, dxfs); parts != nil {
			data, err := batch.PartsCSV(parts)
			if err != nil {
				return err
			}
			dxfs = append(dxfs, fileset.Stamped(fileset.File{Name: mark + batch.PartsExt, Data: data}, d.Job.Stamp))
		}
	}
	files := append([]fileset.File{
		fileset.Stamped(fileset.File{Name: mark + ".yaml", Data: jobYAML}, d.Job.Stamp),
		{Name: mark + ".json", Data: js},
		{Name: mark + ".html", Data: html},
	}, dxfs...)
	if err := fileset.Write(dir, fileset.Set{Name: mark, Stamp: d.Job.Stamp, Files: files}); err != nil {
		return err
	}
	demand := fmt.Sprintf("demand %.1f %s", d.Job.Units.ToJob(float64(d.Conn.Demand), units.DimForce), d.Job.Units.Labels().Force)
	if c := d.Conn.Compression; c > 0 {
		demand += fmt.Sprintf(" tension, %.1f %s compression", d.Job.Units.ToJob(float64(c), units.DimForce), d.Job.Units.Labels().Force)
	}
	member := d.Info.Designation
	if d.InfoB != nil {
		member += " spliced to " + d.InfoB.Designation
	}
	fmt.Fprintf(out, "%s  %s %s, %s\n", mark, d.Conn.Member.Shape, member, demand)
	fmt.Fprintf(out, "  %s\n", how)
	fmt.Fprintf(out, "  check    %s, %s\n", strings.ToUpper(r.Verdict()), r.VerdictReason())
	names := make([]string, len(files))
	for i, f := range files {
		names[i] = f.Name
	}
	for k, line := range texttab.Wrap(fmt.Sprintf("%s/: %s", mark, strings.Join(names, ", ")), texttab.Width-11) {
		lead := "           "
		if k == 0 {
			lead = "  wrote    "
		}
		fmt.Fprintf(out, "%s%s\n", lead, line)
	}
	fmt.Fprintln(out)
	return nil
}

// demoMeasured invents what a QA inspector measured on the first part:
// every hole a little off, one of them past the 1/16 in position
// tolerance, one drilled a little large but within tolerance. The holes
// are off along the gage line (+x, away from the member end) and on it in
// y: the proposed layout can sit exactly at gage.workable's clearance
// (toward the heel) and at a block shear ratio near 1 (toward the toe), and
// a hole off across the line would then fail as built instead of showing
// a REVIEW.
func demoMeasured(d *detail.Design) []byte {
	var b strings.Builder
	b.WriteString("# Invented measurements of a fabricated part (demo), inches from the member end and heel.\n")
	b.WriteString("id,x,y,diameter\n")
	for i, h := range d.Conn.Holes {
		dx, dy, dd := 0.01, 0.0, 0.0
		switch i {
		case 1:
			dx = 0.09 // past the 1/16 in position tolerance
		case 2:
			dd = 0.02 // drilled large, within +1/32 in
		}
		fmt.Fprintf(&b, "M%d,%.4f,%.4f,%.4f\n", i+1, h.X.In()+dx, h.Y.In()+dy, h.Dx.In()+dd)
	}
	return []byte(b.String())
}

func demoReverify(p *propose.Proposal, dir string, out io.Writer) error {
	d := p.Report.Design
	mark := d.Job.Mark
	// The QA records are a set of their own: the inspection is not the
	// fabrication drawing, and is made at another time.
	qaSet := mark + "-QA"
	stamp := p.Job.Stamp
	meas := fileset.Stamped(fileset.File{Name: mark + "-measured.csv", Data: demoMeasured(d)}, stamp)
	csv := filepath.Join(dir, qaSet, meas.Name)
	unit := measured.Inches
	if d.Job.Units == units.SI {
		unit = measured.Millimetres
	}
	set, err := measured.ReadCSV(bytes.NewReader(meas.Data), csv, unit)
	if err != nil {
		return err
	}
	ab, err := qa.Reverify(d, set, qa.ReverifyOptions{})
	if err != nil {
		return err
	}
	var md strings.Builder
	if err := ab.WriteMarkdown(&md); err != nil {
		return err
	}
	report := fileset.Stamped(fileset.File{Name: mark + "-qa.md", Data: []byte(md.String())}, stamp)
	if err := fileset.Write(dir, fileset.Set{Name: qaSet, Stamp: stamp, Files: []fileset.File{meas, report}}); err != nil {
		return err
	}
	fmt.Fprintf(out, "QA  %s as fabricated, measured holes in %s\n", mark, csv)
	fmt.Fprintf(out, "  reverify  verdict %s", strings.ToUpper(ab.Verdict.String()))
	switch ab.Verdict {
	case qa.Accept:
		fmt.Fprintf(out, ": every hole within tolerance and everything passes\n")
	case qa.Review:
		fmt.Fprintf(out, ": a hole is out of tolerance but every rule and limit state passes as built;\n")
		fmt.Fprintf(out, "            send it to the engineer of record (the command exits 3)\n")
	default:
		fmt.Fprintf(out, ": the part fails as built (the command exits 1)\n")
	}
	fmt.Fprintf(out, "  wrote     %s/: %s, %s\n", qaSet, meas.Name, report.Name)
	return nil
}
