package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"gaugeline/detail"
	"gaugeline/detail/calc"
	"gaugeline/fileset"
)

type reportOptions struct {
	out string
}

func newReportCmd(o *rootOptions) *cobra.Command {
	var ro reportOptions
	cmd := command("report JOB.yaml -o FILE.html",
		"Write the calculation report of a job as one self-contained HTML page",
		"report checks the job and writes its calculation report to FILE.html: the connection, a drawing\n"+
			"of the layout from the cut-sheet model, every limit state with its formula, the values put into it,\n"+
			"the result and the clause, the detailing findings, the verdict and the caution. The page needs no\n"+
			"network. A failing connection gets its report too, then exits 1; bad input exits 2 and writes nothing.",
		argsExactly(1, "one job file"),
		func(ctx context.Context, args []string) error {
			return runReport(ctx, o, ro, args[0], o.stdout)
		})
	cmd.Flags().StringVarP(&ro.out, "output", "o", "", "the HTML file to write (its directory is created if missing)")
	return cmd
}

func runReport(_ context.Context, o *rootOptions, ro reportOptions, path string, out io.Writer) error {
	if ro.out == "" {
		return usageError{errors.New("-o FILE.html is required")}
	}
	r, err := detail.CheckFile(path)
	if err != nil {
		return err
	}
	r.Design.Job.Stamp = stampFor("check", r.Design.Job) // the page names the build and the input
	page, err := calc.HTML(r)
	if err != nil {
		return err
	}
	if err := fileset.WriteFile(ro.out, page); err != nil {
		return err
	}
	fmt.Fprintln(out, ro.out)
	if !r.Pass {
		fmt.Fprintf(o.stderr, "gaugeline: note: %s fails %s; the report shows why\n", r.Design.Job.Mark, strings.Join(r.Failing(), ", "))
		return exitError{exitFail}
	}
	return nil
}
