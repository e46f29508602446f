package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"runtime"
	"runtime/debug"
	"syscall"

	"gaugeline/batch"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/schedule"
	"gaugeline/dxfout"
	"gaugeline/fileset"
)

// batchExit is the batch's exit code: an interruption wins over bad input,
// bad input over a failing job.
func batchExit(c batch.Counts) int {
	switch {
	case c.NotRun > 0:
		return exitInterrupted
	case c.Errors > 0:
		return exitInput
	case c.Fail > 0:
		return exitFail
	}
	return exitOK
}

// batchGCPercent is the collector's target (GOGC) while a batch runs. A
// batch keeps little alive (a summary row per job and the jobs in hand,
// a few MiB) but allocates about 0.8 MiB a job, so at the runtime's
// default of 100 it collected every few jobs and the collector took about
// a third of the batch's CPU. Letting the heap grow to five times what is
// live between collections keeps memory flat (bounded by the live heap,
// not by the number of jobs) at a fraction of that cost; BenchmarkBatch's
// peak-heap-MiB and peak-rss-MiB show what it costs in memory. A GOGC the
// user sets wins. The setting is the process's: runs of runBatch that
// overlap in one process (tests) may leave either value, both harmless.
const batchGCPercent = 400

// maxErrorLines is how many job errors batch repeats on stderr; the
// summary has them all.
const maxErrorLines = 20

// showErrors repeats the first maxErrorLines job errors on stderr, then
// says how many more the summary holds.
func showErrors(stderr io.Writer, rows []batch.Row, c batch.Counts, dir string) {
	shown := 0
	for _, r := range rows {
		if r.Verdict == batch.VerdictError {
			if shown == maxErrorLines {
				fmt.Fprintf(stderr, "gaugeline: error: … and %d more; see %s\n", c.Errors-shown, filepath.Join(dir, "summary.csv"))
				break
			}
			fmt.Fprintf(stderr, "gaugeline: error: %s\n", r.Message)
			if r.Hint != "" {
				fmt.Fprintf(stderr, "gaugeline: hint: %s\n", r.Hint)
			}
			shown++
		}
	}
}

// batchInputs reads the jobs a batch runs: a schedule's rows, or the job
// files of a folder or list.
func batchInputs(bo batchOptions, arg string) ([]batch.Input, error) {
	if schedule.IsSchedule(arg) {
		return batch.ScheduleRows(arg, schedule.Options{Template: bo.template, Sheets: bo.sheetNames})
	}
	if bo.template != "" || len(bo.sheetNames) > 0 {
		return nil, usageError{errors.New("--template and --sheet are for a schedule (a .csv or .xlsx file), not a folder or list of jobs")}
	}
	files, err := batch.Inputs(arg)
	var nl *batch.NotAListError
	if errors.As(err, &nl) {
		return nil, usageError{err}
	}
	if err != nil {
		return nil, err
	}
	return batch.JobFiles(files), nil
}

func runBatch(ctx context.Context, o *rootOptions, bo batchOptions, arg string, out io.Writer) error {
	if bo.dir == "" {
		return usageError{errors.New("-o DIR is required")}
	}
	if bo.workers < 0 {
		return usageError{fmt.Errorf("--jobs: want 1 or more (0: one per CPU), not %d", bo.workers)}
	}
	if bo.format != "text" && bo.format != "json" {
		return usageError{fmt.Errorf("--format: unknown format %q (want text or json)", bo.format)}
	}
	cam, err := dxfout.ParseCAMFormat(bo.dxf)
	if err != nil {
		return usageError{err}
	}
	if bo.nc1 && !bo.sheets {
		return usageError{errors.New("--nc1: NC1 files are written with --sheets only")}
	}
	if cam != dxfout.CAM2000 && !bo.sheets {
		return usageError{fmt.Errorf("--dxf %s: CAM files are written with --sheets only", bo.dxf)}
	}
	inputs, err := batchInputs(bo, arg)
	if err != nil {
		return err
	}
	unlock, err := lockOutput(bo.dir, func(s string) { fmt.Fprintf(o.stderr, "gaugeline: note: %s\n", s) })
	if err != nil {
		return err
	}
	defer unlock()
	if _, set := os.LookupEnv("GOGC"); !set {
		defer debug.SetGCPercent(debug.SetGCPercent(batchGCPercent))
	}
	cfg := batch.Config{Out: bo.dir, Propose: bo.propose, Sheets: bo.sheets, CAM: cam, NC1: bo.nc1, Workers: bo.workers,
		Tool: toolVersion(), MaxCandidates: defaultMaxCandidates, LimitError: limitError}
	if cfg.Workers == 0 {
		cfg.Workers = runtime.NumCPU()
	}
	cfg.Workers = min(cfg.Workers, len(inputs))
	run := batch.RunLine(cfg, inputs)
	os.Remove(filepath.Join(bo.dir, fileset.SummaryCSV))
	os.Remove(filepath.Join(bo.dir, fileset.PartsCSV))
	if err := fileset.WriteFile(filepath.Join(bo.dir, fileset.SummaryMD), batch.SummaryRunning(run)); err != nil {
		return &jobfile.InputError{File: bo.dir, Msg: err.Error()}
	}

	// Ctrl-C stops the batch between jobs: the jobs running finish, the
	// summary records the others as not run; a second Ctrl-C kills.
	ctx, stop := signal.NotifyContext(ctx, os.Interrupt, syscall.SIGTERM)
	defer stop()
	context.AfterFunc(ctx, stop)

	report, finish := progressBar(o.stderr, "batch", "jobs")
	finished := 0
	rows := batch.Run(ctx, cfg, inputs, func() { finished++; report(finished, len(inputs)) })
	finish()

	rows = batch.Sorted(rows)
	c := batch.Count(rows)
	if err := writeSummaries(bo.dir, rows, run); err != nil {
		return err
	}
	showErrors(o.stderr, rows, c, bo.dir)
	if err := batchOutput(out, bo, rows, c, run); err != nil {
		return err
	}
	if code := batchExit(c); code != exitOK {
		return exitError{code}
	}
	return nil
}

// writeSummaries writes summary.csv, parts.csv (when any set has parts)
// and, last, summary.md: until it is replaced it says the run is not
// finished.
func writeSummaries(dir string, rows []batch.Row, run string) error {
	csvData, err := batch.SummaryCSV(rows)
	if err != nil {
		return err
	}
	if err := fileset.WriteFile(filepath.Join(dir, fileset.SummaryCSV), csvData); err != nil {
		return &jobfile.InputError{File: dir, Msg: err.Error()}
	}
	if parts := batch.AllParts(rows); parts != nil {
		data, err := batch.PartsCSV(parts)
		if err != nil {
			return err
		}
		if err := fileset.WriteFile(filepath.Join(dir, fileset.PartsCSV), data); err != nil {
			return &jobfile.InputError{File: dir, Msg: err.Error()}
		}
	}
	if err := fileset.WriteFile(filepath.Join(dir, fileset.SummaryMD), batch.SummaryMarkdown(rows, run)); err != nil {
		return &jobfile.InputError{File: dir, Msg: err.Error()}
	}
	return nil
}

// batchOutput writes what the batch did on stdout: the counts and where
// the files went, or with --format json the whole summary.
func batchOutput(out io.Writer, bo batchOptions, rows []batch.Row, c batch.Counts, run string) error {
	if bo.format == "json" {
		data, err := batch.SummaryJSON(rows, run)
		if err != nil {
			return err
		}
		_, err = out.Write(data)
		return err
	}
	fmt.Fprintf(out, "batch: %s\n", c)
	fmt.Fprintf(out, "wrote %d JSON and %d DXF files to %s, one folder per mark\n", c.JSON, c.DXF, bo.dir)
	if parts := batch.AllParts(rows); parts != nil {
		fmt.Fprintf(out, "parts list: %s (%d parts)\n", filepath.Join(bo.dir, fileset.PartsCSV), len(parts))
	}
	fmt.Fprintf(out, "summary: %s, %s\n", filepath.Join(bo.dir, fileset.SummaryCSV), filepath.Join(bo.dir, fileset.SummaryMD))
	return nil
}
