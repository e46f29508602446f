package main

import (
	"embed"
	"fmt"
	"io"
	"os"
	"path"
	"path/filepath"

	"github.com/spf13/cobra"

	"gaugeline/detail"
	"gaugeline/dxfout"
)

//go:embed demo/*.yaml
var demoJobs embed.FS

type demoOptions struct {
	dir string
}

func newDemoCmd(o *rootOptions) *cobra.Command {
	var do demoOptions
	cmd := &cobra.Command{
		Use:   "demo [-o DIR]",
		Short: "Run the built-in demo: check an invented pipe-rack brace and write its cut sheet",
		Args:  argsExactly(0, "no arguments"),
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runDemo(do, o.stdout)
		},
	}
	cmd.Flags().StringVarP(&do.dir, "output", "o", filepath.Join(os.TempDir(), "gaugeline-demo"),
		"directory for the demo's cut sheets and CAM files")
	return cmd
}

func runDemo(do demoOptions, out io.Writer) error {
	entries, err := demoJobs.ReadDir("demo")
	if err != nil {
		return err
	}
	fmt.Fprintf(out, "gaugeline demo: an invented pipe-rack brace, checked and drawn.\n\n")
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
		s, err := detail.NewSheet(r, !r.Pass)
		if err != nil {
			return err
		}
		files, err := dxfout.Files(s)
		if err != nil {
			return err
		}
		if err := writeAll(do.dir, files); err != nil {
			return err
		}
		fmt.Fprintf(out, "\n$ gaugeline sheet %s -o %s\n", name, do.dir)
		for _, f := range files {
			fmt.Fprintf(out, "wrote %s\n", filepath.Join(do.dir, f.Name))
		}
		fmt.Fprintln(out)
	}
	fmt.Fprintf(out, "Open the .dxf cut sheet in any CAD viewer; the .cam.dxf files hold only contours and holes for CAM.\n")
	fmt.Fprintf(out, "Try it on your own job: gaugeline check JOB.yaml (see README.md for the job file).\n")
	return nil
}
