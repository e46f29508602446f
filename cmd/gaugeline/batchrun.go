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
	"syscall"

	"gaugeline/batch"
	"gaugeline/detail/jobfile"
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

// maxErrorLines is how many job errors batch repeats on stderr; the
// summary has them all.
const maxErrorLines = 20

func runBatch(ctx context.Context, o *rootOptions, bo batchOptions, arg string, out io.Writer) error {
	if bo.dir == "" {
		return usageError{errors.New("-o DIR is required")}
	}
	if bo.workers < 0 {
		return usageError{fmt.Errorf("--jobs: want 1 or more (0: one per CPU), not %d", bo.workers)}
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
	cfg := batch.Config{Out: bo.dir, Propose: bo.propose, Sheets: bo.sheets, Workers: bo.workers,
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

	shown := 0
	for _, r := range rows {
		if r.Verdict == batch.VerdictError {
			if shown == maxErrorLines {
				fmt.Fprintf(o.stderr, "gaugeline: error: … and %d more; see %s\n", c.Errors-shown, filepath.Join(bo.dir, "summary.csv"))
				break
			}
			fmt.Fprintf(o.stderr, "gaugeline: error: %s\n", r.Message)
			if r.Hint != "" {
				fmt.Fprintf(o.stderr, "gaugeline: hint: %s\n", r.Hint)
			}
			shown++
		}
	}
	fmt.Fprintf(out, "batch: %s\n", c)
	fmt.Fprintf(out, "wrote %d JSON and %d DXF files to %s, one folder per mark\n", c.JSON, c.DXF, bo.dir)
	fmt.Fprintf(out, "summary: %s, %s\n", filepath.Join(bo.dir, "summary.csv"), filepath.Join(bo.dir, "summary.md"))
	if code := batchExit(c); code != exitOK {
		return exitError{code}
	}
	return nil
}
