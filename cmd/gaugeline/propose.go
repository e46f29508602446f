package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/propose"
	"gaugeline/fileset"
)

// maxAlternatives bounds --alternatives: a longer list is no longer read
// (each is the best of its own arrangement).
const maxAlternatives = 100

// defaultMaxCandidates is the default of --max-candidates. BenchmarkPropose-
// Rate (detail; 3 runs on a shared 2-core AMD EPYC) measured 42,000 to
// 76,000 candidates/s for the exhaustive search and 6,000 to 23,000
// checks/s for the pruned one, which keeps about 2.4 KB per check: at
// this bound the exhaustive search takes 13 to 24 s there, the pruned one
// (which gets this far only on an absurd stock) at most about 3 min and
// 2.4 GB. Every job under testdata/propose has a space of at most 509,562.
const defaultMaxCandidates = 1_000_000

type proposeOptions struct {
	format       string
	alternatives int
	exhaustive   bool
	write        string
	maxCand      int
}

func newProposeCmd(o *rootOptions) *cobra.Command {
	var po proposeOptions
	cmd := command("propose JOB.yaml",
		"Find the best passing bolt layout within the job's stock",
		"propose searches the job's stock (diameters, grades, plate thicknesses, lines and bolts per line,\n"+
			"pitch, end, gage and edge distances on the step grid) for the layout with the fewest bolts (or the\n"+
			"shortest, with stock.objective: length) that passes every detailing rule and limit state, and prints\n"+
			"its full check. Exit 0 when a layout is found, 1 when nothing in the stock passes (the message says\n"+
			"what blocks and what would lift it), 2 on bad input.",
		argsExactly(1, "one job file"),
		func(ctx context.Context, args []string) error {
			return runPropose(ctx, o, po, args[0], o.stdout)
		})
	formatFlag(cmd, &po.format)
	cmd.Flags().IntVar(&po.alternatives, "alternatives", 3, fmt.Sprintf("how many other layouts to list (0 to %d)", maxAlternatives))
	cmd.Flags().BoolVar(&po.exhaustive, "exhaustive", false, "check every candidate (reference mode; slow)")
	cmd.Flags().IntVar(&po.maxCand, "max-candidates", defaultMaxCandidates,
		"the most candidates to check: --exhaustive refuses a larger space before it starts, the pruned search stops there (1 or more)")
	cmd.Flags().StringVar(&po.write, "write", "", "write the job with the chosen layout filled in to `FILE`")
	return cmd
}

func runPropose(_ context.Context, o *rootOptions, po proposeOptions, path string, out io.Writer) error {
	if err := checkFormat(po.format); err != nil {
		return err
	}
	if po.alternatives < 0 || po.alternatives > maxAlternatives {
		return usageError{fmt.Errorf("--alternatives: want 0 to %d, not %d", maxAlternatives, po.alternatives)}
	}
	if po.maxCand < 1 {
		return usageError{fmt.Errorf("--max-candidates: want 1 or more, not %d", po.maxCand)}
	}
	job, err := jobfile.LoadJob(path)
	if err != nil {
		return err
	}
	mode, desc := propose.Pruned, "propose"
	if po.exhaustive {
		mode, desc = propose.Exhaustive, "propose --exhaustive"
	}
	report, finish := progressBar(o.stderr, desc, "candidates")
	p, err := propose.Propose(job, propose.ProposeOptions{Mode: mode, Alternatives: po.alternatives,
		MaxCandidates: po.maxCand, Progress: report})
	finish()
	var le *propose.SearchLimitError
	if errors.As(err, &le) {
		return limitError(job, le)
	}
	if err != nil {
		return err
	}
	if p.Found() && po.write != "" {
		if err := writeAtomic(po.write, p.LayoutJob); err != nil {
			return err
		}
	}
	err = writeFormat(out, po.format, func() ([]byte, error) { return p.JSON(mode) },
		func(w io.Writer) error { return p.WriteMarkdown(w, mode) }, func(w io.Writer) error { return p.WriteText(w, mode) })
	if err != nil {
		return err
	}
	if !p.Found() {
		fmt.Fprintf(o.stderr, "gaugeline: no layout passes: %s\n", p.Summary)
		return exitError{exitFail}
	}
	if !p.Report.Pass { // the near end passes; the far end of its own, as the job gives it, does not
		fmt.Fprintf(o.stderr, "gaugeline: the proposed near end passes, but the far end fails as the job gives it: %s\n",
			strings.Join(p.Report.Far.Failing(), ", "))
		return exitError{exitFail}
	}
	return nil
}

// limitError words a search refused or stopped at --max-candidates as
// bad input at the job's stock, which is what makes the search that large.
func limitError(job *jobfile.Job, le *propose.SearchLimitError) error {
	hint := "narrow the stock (fewer diameters, grades or thicknesses, a smaller max_lines or max_per_line, a coarser step, " +
		"or fix what you know in the bolts block), or raise --max-candidates"
	msg := fmt.Sprintf("the search reached --max-candidates (%d candidates checked) before finishing; the space has %d candidates", le.Limit, le.Space)
	if le.Mode == propose.Exhaustive {
		msg = fmt.Sprintf("the exhaustive search would check all %d candidates of the space, more than --max-candidates %d", le.Space, le.Limit)
		hint += "; the search without --exhaustive returns the same layout"
	}
	return &jobfile.InputError{File: job.File, Line: job.Line("stock"), Field: "stock", Msg: msg, Hint: hint}
}

// writeAtomic writes data to path through a temporary file in the same
// directory and a rename (fileset.WriteFile), so path is never half-written.
func writeAtomic(path string, data []byte) error {
	if err := fileset.WriteFile(path, data); err != nil {
		return &jobfile.InputError{File: path, Msg: "cannot write the job: " + err.Error()}
	}
	return nil
}
