package main

import (
	"context"

	"github.com/spf13/cobra"
)

type batchOptions struct {
	dir        string
	propose    bool
	sheets     bool
	dxf        string // --dxf: CAM file versions (dxfout.ParseCAMFormat)
	nc1        bool   // --nc1: DSTV NC1 files too
	workers    int    // 0: one per CPU
	template   string
	sheetNames []string
	format     string
}

func newBatchCmd(o *rootOptions) *cobra.Command {
	var bo batchOptions
	cmd := command("batch DIR_OR_LIST_OR_SCHEDULE -o DIR",
		"Check (or propose) many jobs on every core, with a summary table",
		"batch runs every *.yaml and *.yml job of a folder (sorted naturally: BR-2 before BR-10; not\n"+
			"recursive), every job listed in a text file (one path per line, relative to the list file; '#' starts\n"+
			"a comment), or every row of a connection schedule (a .csv or .xlsx file: a header row naming job-file\n"+
			"fields, mark, size, pitch, bolts.grade …, then one row per connection; --template JOB.yaml, or the\n"+
			"row's template column, supplies what a row leaves empty; see the README), on every core. Each job's\n"+
			"files are one set in the folder DIR/MARK: MARK.json (the check, or with --propose the proposal), a\n"+
			"schedule row's job as MARK.job.yaml, and with --sheets the cut sheet MARK.dxf, the CAM files and the\n"+
			"parts list MARK.parts.csv of a passing layout, plus the manifest MARK.files. A set is replaced as a\n"+
			"whole, never file by file, so a run that is stopped leaves each mark's old set or its new one. A\n"+
			"failing job's set holds its JSON alone; a job with bad input loses its old set; a job whose mark a\n"+
			"job earlier in the input already uses (in any case) gets nothing; either way the others carry on.\n"+
			"summary.csv and summary.md list every job sorted naturally by mark: verdict, governing limit state\n"+
			"and ratio, bolts, set, input SHA-256, errors, schedule row, member, files; parts.csv lists the parts\n"+
			"of every set; until the run ends, summary.md says it is not finished. --format json prints the\n"+
			"summary on stdout. Ctrl-C or SIGTERM stops taking jobs, lets the ones under way finish and writes\n"+
			"the summary. Exit 0 when every job passes, 1 when any fails (or, with --propose, has no passing\n"+
			"layout), 2 when any has bad input, 5 when the run was interrupted. 'gaugeline audit DIR' checks the\n"+
			"folder afterwards.",
		argsExactly(1, "one folder, list file or schedule of jobs"),
		func(ctx context.Context, args []string) error {
			return runBatch(ctx, o, bo, args[0], o.stdout)
		})
	cmd.Flags().StringVarP(&bo.dir, "output", "o", "", "directory to write the results into (created if missing)")
	cmd.Flags().BoolVar(&bo.propose, "propose", false, "propose a layout for each job instead of checking the one it gives")
	cmd.Flags().BoolVar(&bo.sheets, "sheets", false, "also write the DXF cut sheet, CAM files and parts list of each passing job")
	cmd.Flags().StringVar(&bo.dxf, "dxf", "2000", dxfFlagUsage+"; with --sheets")
	cmd.Flags().BoolVar(&bo.nc1, "nc1", false, "with --sheets, also a DSTV NC1 file of each piece")
	cmd.Flags().IntVarP(&bo.workers, "jobs", "j", 0, "jobs to run at once (default: one per CPU)")
	cmd.Flags().StringVar(&bo.template, "template", "", "schedule: the job file that supplies what a row leaves empty")
	cmd.Flags().StringArrayVar(&bo.sheetNames, "sheet", nil, "XLSX schedule: read only this sheet (repeatable; default: every sheet)")
	cmd.Flags().StringVar(&bo.format, "format", "text", "what to print on stdout: text (counts) or json (the whole summary)")
	return cmd
}
