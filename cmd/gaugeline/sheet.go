package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"path/filepath"

	"github.com/spf13/cobra"

	"gaugeline/batch"
	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/sheet"
	"gaugeline/dxfout"
	"gaugeline/fileset"
	"gaugeline/ncout"
)

type sheetOptions struct {
	dir               string
	notForFabrication bool
	dxf               string // --dxf: CAM file versions (dxfout.ParseCAMFormat)
	nc1               bool
}

func newSheetCmd(o *rootOptions) *cobra.Command {
	var so sheetOptions
	cmd := command("sheet JOB.yaml -o DIR",
		"Write the DXF cut sheet and CAM files of a layout that passes",
		"sheet checks the job and writes, into the folder DIR/MARK, the dimensioned cut sheet MARK.dxf (every\n"+
			"piece whole, the bill of material and the bolt list), one geometry-only CAM file per piece\n"+
			"(MARK-member.cam.dxf, the whole member with both ends' holes; MARK-plate.cam.dxf; MARK-far-plate.cam.dxf\n"+
			"where the far end has a plate of its own) and the manifest MARK.files. It needs member.length.\n"+
			"--dxf r12 writes beside each CAM file its R12 (AC1009) variant MARK-PART.cam.r12.dxf, labelled on layer mark.\n"+
			"The folder is replaced as a whole, never file by file. A failing connection is\n"+
			"refused (exit 1, nothing written) unless --not-for-fabrication, which writes the cut sheet alone,\n"+
			"stamped NOT FOR FABRICATION on every view (exit 1 still: the connection fails). Bad input exits 2.",
		argsExactly(1, "one job file"),
		func(ctx context.Context, args []string) error {
			return runSheet(ctx, o, so, args[0], o.stdout)
		})
	cmd.Flags().StringVarP(&so.dir, "output", "o", "", "directory to write the DXF files into (created if missing)")
	cmd.Flags().BoolVar(&so.notForFabrication, "not-for-fabrication", false,
		"write a stamped cut sheet (and no CAM file) even when the connection fails")
	cmd.Flags().StringVar(&so.dxf, "dxf", "2000", dxfFlagUsage)
	cmd.Flags().BoolVar(&so.nc1, "nc1", false, "also write a DSTV NC1 file of each piece (MARK-member.nc1, MARK-plate.nc1)")
	return cmd
}

func runSheet(_ context.Context, o *rootOptions, so sheetOptions, path string, out io.Writer) error {
	if so.dir == "" {
		return usageError{errors.New("-o DIR is required")}
	}
	cam, err := dxfout.ParseCAMFormat(so.dxf)
	if err != nil {
		return usageError{err}
	}
	r, err := detail.CheckFile(path)
	if err != nil {
		return err
	}
	job := r.Design.Job
	job.Stamp = stampFor("check", job) // before anything is drawn: every file carries it
	if !r.Pass && !so.notForFabrication {
		fmt.Fprintf(o.stderr, "gaugeline: error: %s: %s %s: no sheet written\n", path, r.Design.Job.Mark, r.VerdictReason())
		fmt.Fprintf(o.stderr, "gaugeline: hint: run 'gaugeline check %s' for every failing rule; --not-for-fabrication writes a stamped sheet\n", path)
		return exitError{exitFail}
	}
	s, err := sheet.NewSheet(r, so.notForFabrication)
	if err != nil {
		return err
	}
	files, err := dxfout.FilesAs(s, cam)
	if err != nil {
		return err
	}
	if so.nc1 {
		nc, err := ncout.Files(r, s)
		if err != nil {
			return err
		}
		files = append(files, nc...)
	}
	if !so.notForFabrication {
		// the parts list, as batch writes it into each set
		if parts := batch.PartsOf(r, s, files); parts != nil {
			data, err := batch.PartsCSV(parts)
			if err != nil {
				return err
			}
			files = append(files, fileset.Stamped(fileset.File{Name: job.Mark + batch.PartsExt, Data: data}, job.Stamp))
		}
	}
	unlock, err := lockOutput(so.dir, func(s string) { fmt.Fprintf(o.stderr, "gaugeline: note: %s\n", s) })
	if err != nil {
		return err
	}
	defer unlock()
	if err := fileset.Write(so.dir, fileset.Set{Name: job.Mark, Stamp: job.Stamp, Files: files}); err != nil {
		return &jobfile.InputError{File: so.dir, Msg: err.Error()}
	}
	for _, f := range files {
		fmt.Fprintln(out, filepath.Join(so.dir, job.Mark, f.Name))
	}
	if so.notForFabrication {
		fmt.Fprintf(o.stderr, "gaugeline: note: %s stamped %s; no CAM file written\n", files[0].Name, sheet.Stamp)
	}
	if !r.Pass {
		return exitError{exitFail}
	}
	return nil
}

// dxfFlagUsage is the --dxf flag's help, the same for sheet and batch.
const dxfFlagUsage = "CAM file versions: 2000 (AutoCAD 2000) or r12 (also an R12 file beside each, for older importers)"
