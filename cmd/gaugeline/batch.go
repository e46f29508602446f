package main

import (
	"context"

	"github.com/spf13/cobra"
)

type batchOptions struct {
	dir     string
	propose bool
	sheets  bool
	dxf     string // --dxf: CAM file versions (dxfout.ParseCAMFormat)
	workers int    // 0: one per CPU
}

func newBatchCmd(o *rootOptions) *cobra.Command {
	var bo batchOptions
	cmd := command("batch DIR_OR_LIST -o DIR",
		"Check (or propose) many jobs on every core, with a summary table",
		"batch runs every *.yaml job of a folder (sorted, not recursive), or every job listed in a text file\n"+
			"(one path per line, relative to the list file; '#' starts a comment), on every core. Each job's files\n"+
			"are one set in the folder DIR/MARK: MARK.json (the check, or with --propose the proposal) and, with\n"+
			"--sheets, the cut sheet MARK.dxf and the CAM files of a passing layout, plus the manifest MARK.files.\n"+
			"A set is replaced as a whole, never file by file, so a run that is stopped leaves each mark's old set\n"+
			"or its new one. A failing job's set holds its JSON alone; a job with bad input loses its old set; a\n"+
			"job whose mark a job earlier in the input already uses (in any case) gets nothing; either way the\n"+
			"others carry on. summary.csv and summary.md list every job in input order: mark, verdict, governing\n"+
			"limit state and ratio, bolts, set, input SHA-256, errors; until the run ends, summary.md says it is\n"+
			"not finished. Ctrl-C or SIGTERM stops taking jobs, lets the ones under way finish and writes the\n"+
			"summary. Exit 0 when every job passes, 1 when any fails (or, with --propose, has no passing\n"+
			"layout), 2 when any has bad input, 5 when the run was interrupted. 'gaugeline audit DIR' checks the\n"+
			"folder afterwards.",
		argsExactly(1, "one folder or list file of jobs"),
		func(ctx context.Context, args []string) error {
			return runBatch(ctx, o, bo, args[0], o.stdout)
		})
	cmd.Flags().StringVarP(&bo.dir, "output", "o", "", "directory to write the results into (created if missing)")
	cmd.Flags().BoolVar(&bo.propose, "propose", false, "propose a layout for each job instead of checking the one it gives")
	cmd.Flags().BoolVar(&bo.sheets, "sheets", false, "also write the DXF cut sheet and CAM files of each passing job")
	cmd.Flags().StringVar(&bo.dxf, "dxf", "2000", dxfFlagUsage+"; with --sheets")
	cmd.Flags().IntVarP(&bo.workers, "jobs", "j", 0, "jobs to run at once (default: one per CPU)")
	return cmd
}
