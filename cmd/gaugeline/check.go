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
	cmd := command("check JOB.yaml",
		"Check a layout: every detailing rule and tension limit state",
		"check reads a job file and checks the bolt layout in it against every detailing rule and every\n"+
			"tension limit state, on the member and on the plate. Exit 0 when everything passes, 1 when\n"+
			"anything fails, 2 on bad input.",
		argsExactly(1, "one job file"),
		func(ctx context.Context, args []string) error {
			return runCheck(ctx, o, co, args[0], o.stdout)
		})
	formatFlag(cmd, &co.format)
	return cmd
}

func runCheck(_ context.Context, _ *rootOptions, co checkOptions, path string, out io.Writer) error {
	if err := checkFormat(co.format); err != nil {
		return err
	}
	r, err := detail.CheckFile(path)
	if err != nil {
		return err
	}
	// the JSON names the build and the input it was made from
	r.Design.Job.Stamp = stampFor("check", r.Design.Job)
	if err := writeFormat(out, co.format, r.JSON, r.WriteMarkdown, r.WriteText); err != nil {
		return err
	}
	if !r.Pass {
		return exitError{exitFail}
	}
	return nil
}

// formatFlag adds --format, the output format of check, propose and
// reverify, to cmd.
func formatFlag(cmd *cobra.Command, format *string) {
	cmd.Flags().StringVar(format, "format", "text", "output format: text, json or markdown")
}

// checkFormat refuses a --format that is not text, json or markdown.
func checkFormat(format string) error {
	switch format {
	case "text", "json", "markdown":
		return nil
	}
	return usageError{fmt.Errorf("--format: unknown format %q (want text, json or markdown)", format)}
}

// writeFormat writes a result to out in the format checkFormat passed:
// the bytes of its JSON, its Markdown or its text.
func writeFormat(out io.Writer, format string, json func() ([]byte, error), markdown, text func(io.Writer) error) error {
	switch format {
	case "json":
		b, err := json()
		if err != nil {
			return err
		}
		_, err = out.Write(b)
		return err
	case "markdown":
		return markdown(out)
	}
	return text(out)
}
