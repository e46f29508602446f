package main

import (
	"bytes"
	"context"
	"crypto/sha256"
	"encoding/csv"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"github.com/spf13/cobra"

	"gaugeline/detail"
)

func newAuditCmd(o *rootOptions) *cobra.Command {
	return &cobra.Command{
		Use:   "audit DIR",
		Short: "Check that every mark's file set in an output folder is whole and of one run",
		Long: "audit reads an output folder of sheet, batch or demo and checks each mark's folder: its manifest\n" +
			"MARK.files is there, every file it lists is there unchanged (SHA-256), every file carries the\n" +
			"set's stamp (tool version, mode, input SHA-256), and nothing else is in it. It also reports files\n" +
			"that belong to no set, a summary of a batch that did not finish, and summary rows that do not\n" +
			"describe the set beside them. Leftovers of an interrupted run are noted (the next run removes\n" +
			"them). Exit 0 when every set is whole, 1 when any problem is found, 2 when DIR cannot be read.",
		Args: argsExactly(1, "one output folder"),
		RunE: func(cmd *cobra.Command, args []string) error {
			return runAudit(cmd.Context(), o, args[0], o.stdout)
		},
	}
}

// auditKind is what is wrong with (or notable about) a file.
type auditKind string

const (
	auditMixed      auditKind = "mixed"      // a file's stamp is not its set's
	auditAltered    auditKind = "altered"    // a file differs from what its set wrote
	auditMissing    auditKind = "missing"    // a file or set the manifest or summary names is not there
	auditOrphaned   auditKind = "orphaned"   // a file or folder that belongs to no set
	auditUnstamped  auditKind = "unstamped"  // a file that should carry a stamp carries none
	auditStale      auditKind = "stale"      // the summary does not describe what is in the folder
	auditUnfinished auditKind = "unfinished" // the last batch did not write its summary
	auditLeftover   auditKind = "leftover"   // temporary files of an interrupted run (not a problem)
)

// auditFinding is one thing audit found.
type auditFinding struct {
	Path string // relative to the folder
	Kind auditKind
	Msg  string
}

// problem reports whether the finding makes the folder untrustworthy.
func (f auditFinding) problem() bool { return f.Kind != auditLeftover }

// auditReport is what audit found in one folder.
type auditReport struct {
	Sets     map[string]string // set name → stamp, for the sets that read
	Whole    int               // sets with no problem
	Findings []auditFinding
}

func (a *auditReport) add(path string, kind auditKind, format string, args ...any) {
	a.Findings = append(a.Findings, auditFinding{path, kind, fmt.Sprintf(format, args...)})
}

// problems counts the findings that are problems.
func (a *auditReport) problems() int {
	n := 0
	for _, f := range a.Findings {
		if f.problem() {
			n++
		}
	}
	return n
}

// auditFolder checks every set in dir and what lies beside them.
func auditFolder(dir string) (*auditReport, error) {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil, &detail.InputError{File: dir, Msg: "cannot read the folder: " + errText(err)}
	}
	a := &auditReport{Sets: map[string]string{}}
	for _, e := range entries {
		name := e.Name()
		switch {
		case name == lockName:
		case isLeftover(name):
			a.add(name, auditLeftover, "left by an interrupted run; the next run into this folder removes it")
		case slices.Contains(batchFiles, name):
		case e.IsDir():
			before := a.problems()
			a.auditSet(dir, name)
			if _, ok := a.Sets[name]; ok && a.problems() == before {
				a.Whole++
			}
		default:
			a.add(name, auditOrphaned, "belongs to no file set (gaugeline writes one folder per mark)")
		}
	}
	a.auditSummary(dir)
	return a, nil
}

// auditSet checks one set folder against its manifest.
func (a *auditReport) auditSet(dir, name string) {
	setDir := filepath.Join(dir, name)
	man := name + manifestExt
	data, err := os.ReadFile(filepath.Join(setDir, man))
	if err != nil {
		a.add(name+"/", auditOrphaned, "not a gaugeline file set: it has no %s", man)
		return
	}
	stamp, entries, err := readManifest(data)
	if err != nil {
		a.add(name+"/"+man, auditAltered, "the manifest cannot be read: %v", err)
		return
	}
	a.Sets[name] = stamp
	listed := map[string]bool{man: true}
	for _, m := range entries {
		listed[m.name] = true
		path := name + "/" + m.name
		b, err := os.ReadFile(filepath.Join(setDir, m.name))
		if err != nil {
			a.add(path, auditMissing, "the set's manifest lists it, but it cannot be read: %s", errText(err))
			continue
		}
		if fmt.Sprintf("%x", sha256.Sum256(b)) != m.sum {
			a.add(path, auditAltered, "its content is not what was written with the set (SHA-256 differs)")
		}
		switch s, ok := fileStamp(m.name, b); {
		case !ok:
			a.add(path, auditUnstamped, "carries no stamp; the set's is %q", stamp)
		case s != stamp:
			a.add(path, auditMixed, "carries the stamp %q, the set's is %q", s, stamp)
		}
	}
	files, err := os.ReadDir(setDir)
	if err != nil {
		a.add(name+"/", auditMissing, "cannot be read: %s", errText(err))
		return
	}
	for _, f := range files {
		if !listed[f.Name()] {
			a.add(name+"/"+f.Name(), auditOrphaned, "is in the set's folder but not in its manifest")
		}
	}
}

// auditSummary checks the batch summary, when there is one, against the
// sets: an unfinished run, and rows whose set is not the one in the folder.
func (a *auditReport) auditSummary(dir string) {
	md, err := os.ReadFile(filepath.Join(dir, "summary.md"))
	if err == nil && bytes.HasPrefix(md, []byte("# Batch summary: RUN NOT FINISHED")) {
		a.add("summary.md", auditUnfinished, "the last batch into this folder did not finish: the summary is not of the sets here")
	}
	data, err := os.ReadFile(filepath.Join(dir, "summary.csv"))
	if err != nil {
		return
	}
	rows, err := csv.NewReader(bytes.NewReader(data)).ReadAll()
	if err != nil || len(rows) == 0 {
		a.add("summary.csv", auditStale, "cannot be read as the batch's summary")
		return
	}
	col := map[string]int{}
	for i, h := range rows[0] {
		col[h] = i
	}
	si, ok1 := col["set"]
	hi, ok2 := col["input_sha256"]
	if !ok1 || !ok2 {
		a.add("summary.csv", auditStale, "written by an older gaugeline: it names no sets")
		return
	}
	for n, r := range rows[1:] {
		if si >= len(r) || hi >= len(r) || r[si] == "" {
			continue
		}
		stamp, ok := a.Sets[r[si]]
		switch {
		case !ok:
			a.add("summary.csv", auditMissing, "row %d names the set %s, which is not in the folder", n+2, r[si])
		case !strings.HasSuffix(stamp, "input sha256 "+r[hi]):
			a.add("summary.csv", auditStale, "row %d describes %s from input %s, the folder holds the set of %q", n+2, r[si], short(r[hi]), stamp)
		}
	}
}

// short is the start of a hash, enough to tell two apart on screen.
func short(h string) string { return h[:min(len(h), 12)] }

func runAudit(_ context.Context, o *rootOptions, dir string, out io.Writer) error {
	a, err := auditFolder(dir)
	if err != nil {
		return err
	}
	for _, f := range a.Findings {
		label := "problem"
		if !f.problem() {
			label = "note"
		}
		fmt.Fprintf(out, "%s: %s: %s: %s\n", label, filepath.Join(dir, f.Path), f.Kind, f.Msg)
	}
	p := a.problems()
	fmt.Fprintf(out, "audit: %s: %d file sets, %d whole; %d problem(s)\n", dir, len(a.Sets), a.Whole, p)
	if p > 0 {
		fmt.Fprintf(o.stderr, "gaugeline: hint: run the job again (sheet, batch or demo) to write whole sets; do not cut from a set with problems\n")
		return exitError{exitFail}
	}
	return nil
}
