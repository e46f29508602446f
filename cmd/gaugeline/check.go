package main

import (
	"context"
	"fmt"
	"io"

	"github.com/spf13/cobra"

	"gaugeline/detail"
)

type checkOptions struct {
	format string
}

func newCheckCmd(o *rootOptions) *cobra.Command {
	var co checkOptions
	cmd := &cobra.Command{
		Use:   "check JOB.yaml",
		Short: "Check a layout: every detailing rule and tension limit state",
		Long: "check reads a job file and checks the bolt layout in it against every detailing rule and every\n" +
			"tension limit state, on the member and on the plate. Exit 0 when everything passes, 1 when\n" +
			"anything fails, 2 on bad input.",
		Args: argsExactly(1, "one job file"),
		RunE: func(cmd *cobra.Command, args []string) error {
			return runCheck(cmd.Context(), o, co, args[0], o.stdout)
		},
	}
	cmd.Flags().StringVar(&co.format, "format", "text", "output format: text, json or markdown")
	return cmd
}

func runCheck(_ context.Context, _ *rootOptions, co checkOptions, path string, out io.Writer) error {
	write, err := reportWriter(co.format)
	if err != nil {
		return err
	}
	r, err := detail.CheckFile(path)
	if err != nil {
		return err
	}
	if err := write(r, out); err != nil {
		return err
	}
	if !r.Pass {
		return exitError{exitFail}
	}
	return nil
}

// reportWriter picks the writer for --format.
func reportWriter(format string) (func(*detail.Report, io.Writer) error, error) {
	switch format {
	case "text":
		return (*detail.Report).WriteText, nil
	case "markdown":
		return (*detail.Report).WriteMarkdown, nil
	case "json":
		return func(r *detail.Report, w io.Writer) error {
			b, err := r.JSON()
			if err != nil {
				return err
			}
			_, err = w.Write(b)
			return err
		}, nil
	}
	return nil, usageError{fmt.Errorf("--format: unknown format %q (want text, json or markdown)", format)}
}
