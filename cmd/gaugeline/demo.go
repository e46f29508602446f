package main

import (
	"embed"
	"fmt"
	"io"
	"path"

	"github.com/spf13/cobra"

	"gaugeline/detail"
)

//go:embed demo/*.yaml
var demoJobs embed.FS

func newDemoCmd(o *rootOptions) *cobra.Command {
	return &cobra.Command{
		Use:   "demo",
		Short: "Run the built-in demo: check an embedded job of our own invention",
		Args:  argsExactly(0, "no arguments"),
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runDemo(o.stdout)
		},
	}
}

func runDemo(out io.Writer) error {
	entries, err := demoJobs.ReadDir("demo")
	if err != nil {
		return err
	}
	fmt.Fprintf(out, "gaugeline demo: checking the embedded job(s) — an invented pipe-rack brace.\n\n")
	for _, e := range entries {
		name := path.Join("demo", e.Name())
		data, err := demoJobs.ReadFile(name)
		if err != nil {
			return err
		}
		job, err := detail.ParseJob(name, data)
		if err != nil {
			return err
		}
		d, err := job.Build()
		if err != nil {
			return err
		}
		r, err := detail.Check(d)
		if err != nil {
			return err
		}
		fmt.Fprintf(out, "$ gaugeline check %s\n", name)
		if err := r.WriteText(out); err != nil {
			return err
		}
		fmt.Fprintln(out)
	}
	fmt.Fprintf(out, "Try it on your own job: gaugeline check JOB.yaml (see README.md for the job file).\n")
	return nil
}
