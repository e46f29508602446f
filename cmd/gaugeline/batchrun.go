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

func runBatch(ctx context.Context, o *rootOptions, bo batchOptions, arg string, out io.Writer) error {
	if bo.dir == "" {
		return usageError{errors.New("-o DIR is required")}
	}
	if bo.workers < 0 {
		return usageError{fmt.Errorf("--jobs: want 1 or more (0: one per CPU), not %d", bo.workers)}
	}
	cam, err := dxfout.ParseCAMFormat(bo.dxf)
	if err != nil {
		return usageError{err}
	}
	if cam != dxfout.CAM2000 && !bo.sheets {
		return usageError{fmt.Errorf("--dxf %s: CAM files are written with --sheets only", bo.dxf)}
	}
	files, err := batch.Inputs(arg)
	var nl *batch.NotAListError
	if errors.As(err, &nl) {
		return usageError{err}
	}
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
	cfg := batch.Config{Out: bo.dir, Propose: bo.propose, Sheets: bo.sheets, CAM: cam, Workers: bo.workers,
		Tool: toolVersion(), MaxCandidates: defaultMaxCandidates, LimitError: limitError}
	if cfg.Workers == 0 {
		cfg.Workers = runtime.NumCPU()
	}
	cfg.Workers = min(cfg.Workers, len(files))
	run := batch.RunLine(cfg, files)
	os.Remove(filepath.Join(bo.dir, "summary.csv"))
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
	rows := batch.Run(ctx, cfg, files, func() { finished++; report(finished, len(files)) })
	finish()

	c := batch.Count(rows)
	csvData, err := batch.SummaryCSV(rows)
	if err != nil {
		return err
	}
	// summary.md last: until it is replaced it says the run is not finished.
	if err := fileset.WriteFile(filepath.Join(bo.dir, fileset.SummaryCSV), csvData); err != nil {
		return &jobfile.InputError{File: bo.dir, Msg: err.Error()}
	}
	if err := fileset.WriteFile(filepath.Join(bo.dir, fileset.SummaryMD), batch.SummaryMarkdown(rows, run)); err != nil {
		return &jobfile.InputError{File: bo.dir, Msg: err.Error()}
	}

	showErrors(o.stderr, rows, c, bo.dir)
	fmt.Fprintf(out, "batch: %s\n", c)
	fmt.Fprintf(out, "wrote %d JSON and %d DXF files to %s, one folder per mark\n", c.JSON, c.DXF, bo.dir)
	fmt.Fprintf(out, "summary: %s, %s\n", filepath.Join(bo.dir, "summary.csv"), filepath.Join(bo.dir, "summary.md"))
	if code := batchExit(c); code != exitOK {
		return exitError{code}
	}
	return nil
}
