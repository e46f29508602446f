// Package batch runs many jobs on a pool of workers and writes each job's
// file set as it finishes, with a summary of the whole run. The command
// line (flags, signals, exit codes, messages) is cmd/gaugeline's.
package batch

import (
	"bytes"
	"context"
	"crypto/sha256"
	"encoding/csv"
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/propose"
	"gaugeline/detail/sheet"
	"gaugeline/dxfout"
	"gaugeline/fileset"
	"gaugeline/ncout"
)

// NotAListError: batch was given one job file, not a folder or a list.
type NotAListError struct{ Path string }

func (e *NotAListError) Error() string {
	return e.Path + " is a job, not a folder or a list of jobs (for one job, use 'gaugeline check')"
}

// The batch runner. Jobs run on a pool of workers; each job's files are
// written (atomically, all of them or none) as soon as it finishes, so the
// only thing a batch keeps is one summary row per job. Marks are claimed in
// input order through a gate, so that which of two jobs with the same mark
// is the duplicate never depends on scheduling.

// Verdict is the outcome of one job of a batch.
type Verdict int

const (
	VerdictPass   Verdict = iota
	VerdictFail           // a limit state or rule fails, or no layout passes
	VerdictError          // bad input: nothing written
	VerdictNotRun         // the batch was interrupted before the job started
)

func (v Verdict) String() string { return [...]string{"pass", "fail", "error", "not run"}[v] }

// Row is one job's line of the summary.
type Row struct {
	File      string
	Source    string // the row of a schedule: `sheet "Braces", row 14`; "" for a job file
	Mark      string // "" when the job could not be read
	Member    string // the member's designation: L4x4x1/2, 2L4x4x1/2; "" when none
	Verdict   Verdict
	Governing string  // limit state or rule id; "" when none
	Ratio     float64 // governing ratio; NaN when none
	Bolts     int     // 0 when none
	Message   string  // the error, or what fails
	Hint      string  // advice on an error
	JSON      int     // files written: JSON and DXF
	DXF       int
	Set       string   // the folder of the mark's file set; "" when none was written
	Files     []string // the set's files, manifest aside, in the order written
	Input     string   // SHA-256 of the job file, as in the set's stamp
	Parts     []Part   // the parts list of a set written with its sheets
	order     int      // input order, the tie-break of Sorted
}

// Config is what every job of a batch shares.
type Config struct {
	Out     string // output directory, existing and locked
	Propose bool
	Sheets  bool
	CAM     dxfout.CAMFormat // with Sheets: the CAM files' DXF versions
	NC1     bool             // with Sheets: a DSTV NC1 file per piece too (ncout)
	Workers int
	// Tool names the build in each set's stamp (fileset.Stamp).
	Tool string
	// MaxCandidates bounds each proposal's search (propose.ProposeOptions).
	MaxCandidates int
	// LimitError words a search stopped at MaxCandidates as the job's
	// error; nil: the *propose.SearchLimitError itself.
	LimitError func(*jobfile.Job, *propose.SearchLimitError) error
}

// markGate hands out set names (marks) in input order. Job i holds the
// gate once job i-1 has let go of it: a relay of channels, one made per
// job as it is dispatched, not a lock, and only the job holding the gate
// touches owners. That never deadlocks: jobs are dispatched in input
// order and each reaches the gate after reading its own file only, so the
// lowest job not yet through is always running.
type markGate struct {
	owners map[string]markOwner // lower-cased mark → who writes its set
}

type markOwner struct{ file, mark string }

// gateTurn is one job's place in the relay: it holds the gate when wait
// is closed and hands it on by closing next.
type gateTurn struct {
	wait, next chan struct{}
	passed     bool
}

func newMarkGate() *markGate { return &markGate{owners: map[string]markOwner{}} }

// pass lets the job through the gate and claims the set of its mark (""
// when the job could not be read). It returns why the set cannot be had,
// "" when it is the job's. Marks are compared without case: on Windows
// and macOS file systems BR-1 and br-1 are one folder. A turn passes
// once; a second pass (after a panic in the job) does nothing.
func (g *markGate) pass(t *gateTurn, file, mark string) string {
	if t.passed {
		return ""
	}
	t.passed = true
	<-t.wait
	defer close(t.next)
	if mark == "" {
		return ""
	}
	if err := fileset.CheckName(mark); err != nil {
		return err.Error()
	}
	if o, taken := g.owners[strings.ToLower(mark)]; taken {
		if o.mark == mark {
			return fmt.Sprintf("duplicate mark %s, already used by %s", mark, o.file)
		}
		return fmt.Sprintf("duplicate mark %s, already used as %s by %s (marks differing only in case name the same folder on Windows and macOS)", mark, o.mark, o.file)
	}
	g.owners[strings.ToLower(mark)] = markOwner{file, mark}
	return ""
}

// Run runs every job on cfg.Workers workers and returns the summary
// rows in input order. done is called (from this goroutine) as each job
// finishes. Jobs not started when ctx ends are recorded as errors.
func Run(ctx context.Context, cfg Config, files []Input, done func()) []Row {
	rows := make([]Row, len(files))
	gate := newMarkGate()
	type dispatched struct {
		i    int
		turn *gateTurn
	}
	next := make(chan dispatched)
	go func() {
		defer close(next)
		wait := make(chan struct{})
		close(wait) // the first job holds the gate at once
		for i := range files {
			t := &gateTurn{wait: wait, next: make(chan struct{})}
			select {
			case next <- dispatched{i, t}:
				wait = t.next
			case <-ctx.Done():
				return
			}
		}
	}()
	finished := make(chan int, cfg.Workers)
	var wg sync.WaitGroup
	for range cfg.Workers {
		wg.Go(func() {
			for d := range next {
				rows[d.i] = runJob(cfg, gate, d.turn, files[d.i])
				rows[d.i].order = d.i
				finished <- d.i
			}
		})
	}
	go func() {
		wg.Wait()
		close(finished)
	}()
	ran := make([]bool, len(files))
	for i := range finished {
		ran[i] = true
		done()
	}
	for i, ok := range ran {
		if !ok {
			rows[i] = Row{File: files[i].File, Source: files[i].Source, Verdict: VerdictNotRun, Ratio: math.NaN(),
				Message: files[i].Name() + ": not run: the batch was interrupted", order: i}
		}
	}
	return rows
}

// runJob runs one job of the batch and writes its files.
func runJob(cfg Config, gate *markGate, turn *gateTurn, in Input) (row Row) {
	path := in.Name()
	row = Row{File: in.File, Source: in.Source, Ratio: math.NaN()}
	defer func() {
		// A programmer's mistake in one job must not stop the others.
		if r := recover(); r != nil {
			row = Row{File: in.File, Source: in.Source, Mark: row.Mark, Verdict: VerdictError, Ratio: math.NaN(),
				Message: fmt.Sprintf("%s: internal error, please report it: %v", path, r),
				Hint:    "gaugeline check (or propose) on this job alone shows where it happens"}
		}
		gate.pass(turn, path, "") // hands the gate on if the job stopped before it
	}()
	job, err := in.Load()
	mark := ""
	if err == nil {
		mark = job.Mark
	}
	conflict := gate.pass(turn, path, mark)
	if err != nil {
		return errorRow(row, path, err)
	}
	row.Mark = mark
	if conflict != "" {
		row.Verdict, row.Message = VerdictError, path+": "+conflict
		return row // the names are another job's: touch nothing
	}
	row.Input = job.SHA256
	mode := "check"
	if cfg.Propose {
		mode = "propose"
	}
	job.Stamp = fileset.Stamp(cfg.Tool, mode, job.SHA256)
	files, err := jobFiles(cfg, job, &row)
	if err == nil && in.YAML != nil {
		files = append(files, fileset.Stamped(fileset.File{Name: mark + ".job.yaml", Data: in.YAML}, job.Stamp))
	}
	if err == nil {
		err = fileset.Write(cfg.Out, fileset.Set{Name: mark, Stamp: job.Stamp, Files: files})
	}
	if err != nil {
		if in.Explain != nil {
			err = in.Explain(err)
		}
		row = errorRow(row, path, err)
		fileset.Remove(cfg.Out, mark) // an old set must not outlive a job that no longer reads
		return row
	}
	row.Set = mark
	for _, f := range files {
		row.Files = append(row.Files, f.Name)
		if strings.HasSuffix(f.Name, ".json") {
			row.JSON++
		} else if strings.HasSuffix(f.Name, ".dxf") {
			row.DXF++
		}
	}
	return row
}

// errorRow records err as the job's error, keeping file and mark.
func errorRow(row Row, path string, err error) Row {
	row.Verdict, row.Governing, row.Ratio, row.Bolts, row.Hint = VerdictError, "", math.NaN(), 0, ""
	var ie *jobfile.InputError
	if errors.As(err, &ie) {
		row.Message, row.Hint = ie.Error(), ie.Hint
		return row
	}
	row.Message = path + ": " + err.Error()
	return row
}

// jobFiles checks (or proposes) the job, fills in its summary row and
// returns the files to write: the JSON, then the sheet and CAM files of a
// passing layout when asked.
func jobFiles(cfg Config, job *jobfile.Job, row *Row) ([]fileset.File, error) {
	var r *detail.Report
	var data []byte
	if cfg.Propose {
		p, err := propose.Propose(job, propose.ProposeOptions{Mode: propose.Pruned, MaxCandidates: cfg.MaxCandidates})
		var le *propose.SearchLimitError
		if errors.As(err, &le) && cfg.LimitError != nil {
			return nil, cfg.LimitError(job, le)
		}
		if err != nil {
			return nil, err
		}
		if data, err = p.JSON(propose.Pruned); err != nil {
			return nil, err
		}
		if !p.Found() {
			row.Verdict, row.Message = VerdictFail, "no layout passes: "+p.Summary
			if len(p.Blockers) > 0 {
				row.Governing = p.Blockers[0].ID
				if p.Blockers[0].Ratio > 0 {
					row.Ratio = p.Blockers[0].Ratio
				}
			}
			return []fileset.File{{Name: job.Mark + ".json", Data: data}}, nil
		}
		r = p.Report
	} else {
		var err error
		if r, err = detail.CheckJob(job); err != nil {
			return nil, err
		}
		if data, err = r.JSON(); err != nil {
			return nil, err
		}
	}
	g := r.GoverningEnd().GoverningResult()
	row.Governing, row.Ratio, row.Bolts = g.ID, g.Ratio, len(r.Design.Conn.Holes)
	row.Member = r.Design.Info.Designation
	files := []fileset.File{{Name: job.Mark + ".json", Data: data}}
	if !r.Pass {
		row.Verdict, row.Message = VerdictFail, "fails: "+strings.Join(r.Failing(), ", ")
		return files, nil
	}
	row.Verdict = VerdictPass
	if !cfg.Sheets {
		return files, nil
	}
	s, err := sheet.NewSheet(r, false)
	if err != nil {
		return nil, err
	}
	dxf, err := dxfout.FilesAs(s, cfg.CAM)
	if err != nil {
		return nil, err
	}
	files = append(files, dxf...)
	if cfg.NC1 {
		nc, err := ncout.Files(r, s)
		if err != nil {
			return nil, err
		}
		files = append(files, nc...)
	}
	if row.Parts = PartsOf(r, s, files); row.Parts != nil {
		data, err := PartsCSV(row.Parts)
		if err != nil {
			return nil, err
		}
		files = append(files, fileset.Stamped(fileset.File{Name: job.Mark + PartsExt, Data: data}, job.Stamp))
	}
	return files, nil
}

// Counts tallies the rows.
type Counts struct{ Jobs, Pass, Fail, Errors, NotRun, JSON, DXF int }

func Count(rows []Row) Counts {
	c := Counts{Jobs: len(rows)}
	for _, r := range rows {
		switch r.Verdict {
		case VerdictPass:
			c.Pass++
		case VerdictFail:
			c.Fail++
		case VerdictNotRun:
			c.NotRun++
		default:
			c.Errors++
		}
		c.JSON += r.JSON
		c.DXF += r.DXF
	}
	return c
}

func (c Counts) String() string {
	s := fmt.Sprintf("%d jobs: %d pass, %d fail, %d error", c.Jobs, c.Pass, c.Fail, c.Errors)
	if c.NotRun > 0 {
		s += fmt.Sprintf(", %d not run (interrupted)", c.NotRun)
	}
	return s
}

// Header is summary.csv's header. The columns after message came later
// (schedules, the parts list): a reader that takes columns by place
// still finds the first nine where they were.
var Header = []string{"file", "mark", "verdict", "governing", "ratio", "bolts", "set", "input_sha256", "message", "row", "member", "files"}

func (r Row) fields() []string {
	ratio, bolts := "", ""
	if !math.IsNaN(r.Ratio) {
		ratio = strconv.FormatFloat(r.Ratio, 'f', 3, 64)
	}
	if r.Bolts > 0 {
		bolts = strconv.Itoa(r.Bolts)
	}
	msg := r.Message
	if r.Hint != "" {
		msg += " (hint: " + r.Hint + ")"
	}
	return []string{r.File, r.Mark, r.Verdict.String(), r.Governing, ratio, bolts, r.Set, r.Input, msg,
		r.Source, r.Member, strings.Join(r.Files, " ")}
}

// SummaryCSV is summary.csv: a header, then one row per job.
func SummaryCSV(rows []Row) ([]byte, error) {
	lines := make([][]string, len(rows))
	for i, r := range rows {
		lines[i] = r.fields()
	}
	return csvOf(Header, lines)
}

// csvOf is a CSV file: the header line, then the lines.
func csvOf(header []string, lines [][]string) ([]byte, error) {
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	w.Write(header)
	w.WriteAll(lines) // flushes
	return b.Bytes(), w.Error()
}

// RunLine names the run a summary describes: the tool, what it did and
// the SHA-256 of its list of job files, so that two summaries of different
// runs never read alike.
func RunLine(cfg Config, inputs []Input) string {
	mode := "check"
	if cfg.Propose {
		mode = "propose"
	}
	if cfg.Sheets {
		mode += " with cut sheets"
	}
	keys := make([]string, len(inputs))
	for i, in := range inputs {
		keys[i] = in.key()
	}
	return fmt.Sprintf("%s; %s; %d jobs, list sha256 %x", cfg.Tool, mode, len(inputs),
		sha256Sum([]byte(strings.Join(keys, "\n"))))
}

// SummaryRunning is summary.md while a run is under way: it replaces the
// last run's summary before any set is touched, so a run that is killed
// leaves this, never a summary of an earlier run.
func SummaryRunning(run string) []byte {
	return []byte(fileset.UnfinishedTitle + "\n\nRun: " + run + "\n\n" +
		"This run started and has not written its summary: it is still running, or it was stopped before\n" +
		"the end. Each mark's folder holds a whole file set, of this run or an earlier one; run\n" +
		"'gaugeline audit' on this folder to see which, or run the batch again.\n\n> " + detail.Caution + "\n")
}

// SummaryMarkdown is summary.md: the run, the counts, then one table row
// per job.
func SummaryMarkdown(rows []Row, run string) []byte {
	var b bytes.Buffer
	c := Count(rows)
	title := "Batch summary"
	if c.NotRun > 0 {
		title += ": INTERRUPTED"
	}
	fmt.Fprintf(&b, "# %s\n\nRun: %s\n\n%s.\n\n| ", title, run, c)
	b.WriteString(strings.Join(Header, " | ") + " |\n|")
	b.WriteString(strings.Repeat("---|", len(Header)) + "\n")
	for _, r := range rows {
		f := r.fields()
		for i := range f {
			f[i] = mdCell(f[i])
		}
		b.WriteString("| " + strings.Join(f, " | ") + " |\n")
	}
	b.WriteString("\n> " + detail.Caution + "\n")
	return b.Bytes()
}

func sha256Sum(b []byte) [32]byte { return sha256.Sum256(b) }

// mdCell keeps a value inside its table cell.
func mdCell(s string) string {
	s = strings.ReplaceAll(s, `\`, `\\`)
	s = strings.ReplaceAll(s, "|", `\|`)
	return strings.Join(strings.Fields(s), " ")
}
