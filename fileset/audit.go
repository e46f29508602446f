package fileset

import (
	"bytes"
	"crypto/sha256"
	"encoding/csv"
	"fmt"
	"os"
	"path/filepath"
	"slices"
)

// The audit: what is wrong with an output folder, file by file, every
// finding with a stable kind (it never stops at the first).

// Kind is what is wrong with (or notable about) a file.
type Kind string

const (
	Mixed      Kind = "mixed"      // a file's stamp is not its set's
	Altered    Kind = "altered"    // a file differs from what its set wrote
	Missing    Kind = "missing"    // a file or set the manifest or summary names is not there
	Orphaned   Kind = "orphaned"   // a file or folder that belongs to no set
	Unstamped  Kind = "unstamped"  // a file that should carry a stamp carries none
	Stale      Kind = "stale"      // the summary does not describe what is in the folder
	Unfinished Kind = "unfinished" // the last batch did not write its summary
	Leftover   Kind = "leftover"   // temporary files of an interrupted run (not a problem)
)

// Finding is one thing audit found.
type Finding struct {
	Path string // relative to the folder
	Kind Kind
	Msg  string
}

// problem reports whether the finding makes the folder untrustworthy.
func (f Finding) Problem() bool { return f.Kind != Leftover }

// Report is what audit found in one folder.
type Report struct {
	Sets     map[string]string // set name → stamp, for the sets that read
	Whole    int               // sets with no problem
	Findings []Finding
}

func (a *Report) add(path string, kind Kind, format string, args ...any) {
	a.Findings = append(a.Findings, Finding{path, kind, fmt.Sprintf(format, args...)})
}

// problems counts the findings that are problems.
func (a *Report) Problems() int {
	n := 0
	for _, f := range a.Findings {
		if f.Problem() {
			n++
		}
	}
	return n
}

// Audit checks every set in dir and what lies beside them.
func Audit(dir string) (*Report, error) {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil, fmt.Errorf("cannot read the folder: %s", ErrText(err))
	}
	a := &Report{Sets: map[string]string{}}
	for _, e := range entries {
		name := e.Name()
		switch {
		case name == LockName:
		case IsLeftover(name):
			a.add(name, Leftover, "left by an interrupted run; the next run into this folder removes it")
		case slices.Contains(indexFiles, name):
		case e.IsDir():
			before := a.Problems()
			a.set(dir, name)
			if _, ok := a.Sets[name]; ok && a.Problems() == before {
				a.Whole++
			}
		default:
			a.add(name, Orphaned, "belongs to no file set (gaugeline writes one folder per mark)")
		}
	}
	a.summary(dir)
	return a, nil
}

// set checks one set folder against its manifest.
func (a *Report) set(dir, name string) {
	setDir := filepath.Join(dir, name)
	man := name + ManifestExt
	data, err := os.ReadFile(filepath.Join(setDir, man))
	if err != nil {
		a.add(name+"/", Orphaned, "not a gaugeline file set: it has no %s", man)
		return
	}
	stamp, entries, err := ReadManifest(data)
	if err != nil {
		a.add(name+"/"+man, Altered, "the manifest cannot be read: %v", err)
		return
	}
	a.Sets[name] = stamp
	listed := map[string]bool{man: true}
	for _, m := range entries {
		listed[m.name] = true
		path := name + "/" + m.name
		b, err := os.ReadFile(filepath.Join(setDir, m.name))
		if err != nil {
			a.add(path, Missing, "the set's manifest lists it, but it cannot be read: %s", ErrText(err))
			continue
		}
		if fmt.Sprintf("%x", sha256.Sum256(b)) != m.sum {
			a.add(path, Altered, "its content is not what was written with the set (SHA-256 differs)")
		}
		switch s, ok := FileStamp(m.name, b); {
		case !ok:
			a.add(path, Unstamped, "carries no stamp; the set's is %q", stamp)
		case s != stamp:
			a.add(path, Mixed, "carries the stamp %q, the set's is %q", s, stamp)
		}
	}
	files, err := os.ReadDir(setDir)
	if err != nil {
		a.add(name+"/", Missing, "cannot be read: %s", ErrText(err))
		return
	}
	for _, f := range files {
		if !listed[f.Name()] {
			a.add(name+"/"+f.Name(), Orphaned, "is in the set's folder but not in its manifest")
		}
	}
}

// summary checks the batch summary, when there is one, against the
// sets: an unfinished run, and rows whose set is not the one in the folder.
func (a *Report) summary(dir string) {
	md, err := os.ReadFile(filepath.Join(dir, SummaryMD))
	if err == nil && bytes.HasPrefix(md, []byte(UnfinishedTitle)) {
		a.add("summary.md", Unfinished, "the last batch into this folder did not finish: the summary is not of the sets here")
	}
	data, err := os.ReadFile(filepath.Join(dir, SummaryCSV))
	if err != nil {
		return
	}
	rows, err := csv.NewReader(bytes.NewReader(data)).ReadAll()
	if err != nil || len(rows) == 0 {
		a.add("summary.csv", Stale, "cannot be read as the batch's summary")
		return
	}
	col := map[string]int{}
	for i, h := range rows[0] {
		col[h] = i
	}
	si, ok1 := col["set"]
	hi, ok2 := col["input_sha256"]
	if !ok1 || !ok2 {
		a.add("summary.csv", Stale, "written by an older gaugeline: it names no sets")
		return
	}
	for n, r := range rows[1:] {
		if si >= len(r) || hi >= len(r) || r[si] == "" {
			continue
		}
		stamp, ok := a.Sets[r[si]]
		switch {
		case !ok:
			a.add("summary.csv", Missing, "row %d names the set %s, which is not in the folder", n+2, r[si])
		case StampInput(stamp) != r[hi]:
			a.add("summary.csv", Stale, "row %d describes %s from input %s, the folder holds the set of %q", n+2, r[si], short(r[hi]), stamp)
		}
	}
}

// short is the start of a hash, enough to tell two apart on screen.
func short(h string) string { return h[:min(len(h), 12)] }
