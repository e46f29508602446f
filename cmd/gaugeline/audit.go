package main

import (
	"context"
	"fmt"
	"io"
	"path/filepath"

	"github.com/spf13/cobra"

	"gaugeline/detail/jobfile"
	"gaugeline/fileset"
)

func newAuditCmd(o *rootOptions) *cobra.Command {
	return command("audit DIR",
		"Check that every mark's file set in an output folder is whole and of one run",
		"audit reads an output folder of sheet, batch or demo and checks each mark's folder: its manifest\n"+
			"MARK.files is there, every file it lists is there unchanged (SHA-256), every file carries the\n"+
			"set's stamp (tool version, mode, input SHA-256), and nothing else is in it. It also reports files\n"+
			"that belong to no set, a summary of a batch that did not finish, and summary rows that do not\n"+
			"describe the set beside them. Leftovers of an interrupted run are noted (the next run removes\n"+
			"them). Exit 0 when every set is whole, 1 when any problem is found, 2 when DIR cannot be read.",
		argsExactly(1, "one output folder"),
		func(ctx context.Context, args []string) error {
			return runAudit(ctx, o, args[0], o.stdout)
		})
}

func runAudit(_ context.Context, o *rootOptions, dir string, out io.Writer) error {
	a, err := fileset.Audit(dir)
	if err != nil {
		return &jobfile.InputError{File: dir, Msg: err.Error()}
	}
	for _, f := range a.Findings {
		label := "problem"
		if !f.Problem() {
			label = "note"
		}
		fmt.Fprintf(out, "%s: %s: %s: %s\n", label, filepath.Join(dir, f.Path), f.Kind, f.Msg)
	}
	p := a.Problems()
	fmt.Fprintf(out, "audit: %s: %d file sets, %d whole; %d problem(s)\n", dir, len(a.Sets), a.Whole, p)
	if p > 0 {
		fmt.Fprintf(o.stderr, "gaugeline: hint: run the job again (sheet, batch or demo) to write whole sets; do not cut from a set with problems\n")
		return exitError{exitFail}
	}
	return nil
}
