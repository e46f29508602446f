package batch

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/schedule"
	"gaugeline/fileset"
)

// Input is one job of a batch: a job file, or a row of a schedule.
type Input struct {
	File   string // the job file, or the schedule
	Source string // the schedule's row: `sheet "Braces", row 14`; "" for a job file
	// Load reads the job; its errors are *jobfile.InputError naming the
	// file (and the schedule's sheet, row and column).
	Load func() (*jobfile.Job, error)
	// YAML is the job file a schedule's row became, written into its set
	// as MARK.job.yaml; nil for a job file.
	YAML []byte
	// Explain words an error found in checking the job as the schedule
	// row's (schedule.Row.Explain); nil for a job file.
	Explain func(error) error
}

// Name is how messages name the input: the job file, or the schedule and
// its row.
func (in Input) Name() string {
	if in.Source == "" {
		return in.File
	}
	return in.File + ": " + in.Source
}

// key is what RunLine hashes: the job file, or the row with its job.
func (in Input) key() string {
	if in.YAML == nil {
		return in.Name()
	}
	return fmt.Sprintf("%s %x", in.Name(), sha256Sum(in.YAML))
}

// JobFiles is the job files as inputs, in the order given.
func JobFiles(files []string) []Input {
	out := make([]Input, len(files))
	for i, f := range files {
		out[i] = Input{File: f, Load: func() (*jobfile.Job, error) { return jobfile.LoadJob(f) }}
	}
	return out
}

// ScheduleRows reads a schedule (package schedule) as inputs, one per
// row in the schedule's order; a row that does not make a job is an input
// whose Load returns its error, so the other rows carry on.
func ScheduleRows(path string, o schedule.Options) ([]Input, error) {
	rows, err := schedule.Read(path, o)
	if err != nil {
		return nil, err
	}
	out := make([]Input, len(rows))
	for i, r := range rows {
		out[i] = Input{File: path, Source: r.Where(), YAML: r.YAML, Explain: r.Explain,
			Load: func() (*jobfile.Job, error) { return r.Job, r.Err }}
	}
	return out, nil
}

// maxListSize bounds a list file: 10,000 jobs take well under 1 MiB.
const maxListSize = 16 << 20

// Inputs returns the job files of a folder (every *.yaml and *.yml,
// sorted naturally by name (BR-2 before BR-10), not recursive) or of a list file (one path per line, relative to
// the list file; '#' starts a comment), in input order.
func Inputs(arg string) ([]string, error) {
	fi, err := os.Stat(arg)
	if err != nil {
		return nil, &jobfile.InputError{File: arg, Msg: "cannot read the jobs: " + fileset.ErrText(err)}
	}
	if fi.IsDir() {
		entries, err := os.ReadDir(arg)
		if err != nil {
			return nil, &jobfile.InputError{File: arg, Msg: "cannot read the folder: " + fileset.ErrText(err)}
		}
		var files []string
		for _, e := range entries {
			if !e.IsDir() && (strings.HasSuffix(e.Name(), ".yaml") || strings.HasSuffix(e.Name(), ".yml")) {
				files = append(files, filepath.Join(arg, e.Name()))
			}
		}
		if len(files) == 0 {
			return nil, &jobfile.InputError{File: arg, Msg: "no *.yaml or *.yml job in the folder",
				Hint: "batch reads the *.yaml and *.yml files of the folder itself, not of its subfolders"}
		}
		slices.SortStableFunc(files, func(a, b string) int { return NaturalCompare(filepath.Base(a), filepath.Base(b)) })
		return files, nil
	}
	if !fi.Mode().IsRegular() {
		return nil, &jobfile.InputError{File: arg, Msg: "not a folder or a regular list file (" + fi.Mode().Type().String() + ")",
			Hint: "batch reads a folder of jobs or a text file listing them"}
	}
	if ext := filepath.Ext(arg); ext == ".yaml" || ext == ".yml" {
		return nil, &NotAListError{Path: arg}
	}
	f, err := fileset.OpenRegular(arg) // never blocks on a FIFO swapped in after the Stat
	if err != nil {
		return nil, &jobfile.InputError{File: arg, Msg: "cannot read the list: " + fileset.ErrText(err)}
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, maxListSize+1))
	if err != nil {
		return nil, &jobfile.InputError{File: arg, Msg: "cannot read the list: " + fileset.ErrText(err)}
	}
	if len(data) > maxListSize {
		return nil, &jobfile.InputError{File: arg, Msg: fmt.Sprintf("the list is larger than %d MiB", maxListSize>>20),
			Hint: "a list holds one job path per line"}
	}
	base := filepath.Dir(arg)
	var files []string
	sc := bufio.NewScanner(bytes.NewReader(data))
	sc.Buffer(nil, maxListSize)
	for line := 1; sc.Scan(); line++ {
		s := sc.Text()
		if i := commentStart(s); i >= 0 {
			s = s[:i]
		}
		s = strings.TrimSpace(s)
		if s == "" {
			continue
		}
		if strings.ContainsRune(s, 0) {
			return nil, &jobfile.InputError{File: arg, Line: line, Msg: "not a list of job paths (binary data)"}
		}
		if !filepath.IsAbs(s) {
			s = filepath.Join(base, s)
		}
		files = append(files, s)
	}
	if err := sc.Err(); err != nil {
		return nil, &jobfile.InputError{File: arg, Msg: "cannot read the list: " + err.Error()}
	}
	if len(files) == 0 {
		return nil, &jobfile.InputError{File: arg, Msg: "the list names no job",
			Hint: "a list holds one job path per line, relative to the list; '#' starts a comment"}
	}
	return files, nil
}

// commentStart is the index of a '#' at the start of s or after a blank,
// -1 when there is none: a path may contain '#' inside a name.
func commentStart(s string) int {
	for i := 0; i < len(s); i++ {
		if s[i] == '#' && (i == 0 || s[i-1] == ' ' || s[i-1] == '\t') {
			return i
		}
	}
	return -1
}
