package main

import (
	"github.com/spf13/cobra"
)

type batchOptions struct {
	dir     string
	propose bool
	sheets  bool
	workers int // 0: one per CPU
}

func newBatchCmd(o *rootOptions) *cobra.Command {
	var bo batchOptions
	cmd := &cobra.Command{
		Use:   "batch DIR_OR_LIST -o DIR",
		Short: "Check (or propose) many jobs on every core, with a summary table",
		Long: "batch runs every *.yaml job of a folder (sorted, not recursive), or every job listed in a text file\n" +
			"(one path per line, relative to the list file; '#' starts a comment), on every core. For each job it\n" +
			"writes MARK.json (the check, or with --propose the proposal) and, with --sheets, the cut sheet MARK.dxf\n" +
			"and the CAM files of a passing layout (with --propose: of the proposed layout). A failing job gets its\n" +
			"JSON alone; a job with bad input, or whose mark a job earlier in the input already uses, gets nothing;\n" +
			"either way the others carry on. A job that does not pass (a duplicate aside) also loses whatever files\n" +
			"of its mark an earlier run left in DIR, so that no old cut sheet sits next to a part that now fails.\n" +
			"summary.csv and summary.md list every job in input order: mark, verdict, governing limit state and\n" +
			"ratio, bolts, errors. Exit 0 when every job passes, 1 when any fails (or, with --propose, has no\n" +
			"passing layout), 2 when any has bad input.",
		Args: argsExactly(1, "one folder or list file of jobs"),
		RunE: func(cmd *cobra.Command, args []string) error {
			return runBatch(cmd.Context(), o, bo, args[0], o.stdout)
		},
	}
	cmd.Flags().StringVarP(&bo.dir, "output", "o", "", "directory to write the results into (created if missing)")
	cmd.Flags().BoolVar(&bo.propose, "propose", false, "propose a layout for each job instead of checking the one it gives")
	cmd.Flags().BoolVar(&bo.sheets, "sheets", false, "also write the DXF cut sheet and CAM files of each passing job")
	cmd.Flags().IntVarP(&bo.workers, "jobs", "j", 0, "jobs to run at once (default: one per CPU)")
	return cmd
}
