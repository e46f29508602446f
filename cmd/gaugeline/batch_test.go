package main

import (
	"bytes"
	"context"
	"encoding/csv"
	"encoding/json"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"syscall"
	"testing"
	"time"

	"gaugeline/batch"
	"gaugeline/fileset"
)

// summaryRow is one row of summary.csv.
type summaryRow struct {
	file, mark, verdict, governing, ratio, bolts, set, input, message string
}

func readSummary(t *testing.T, out string) []summaryRow {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(out, "summary.csv"))
	if err != nil {
		t.Fatal(err)
	}
	recs, err := csv.NewReader(bytes.NewReader(data)).ReadAll()
	if err != nil {
		t.Fatalf("summary.csv: %v", err)
	}
	if len(recs) == 0 || !slices.Equal(recs[0], batch.Header) {
		t.Fatalf("summary.csv header %v, want %v", recs[0], batch.Header)
	}
	var rows []summaryRow
	for _, r := range recs[1:] {
		rows = append(rows, summaryRow{r[0], r[1], r[2], r[3], r[4], r[5], r[6], r[7], r[8]})
	}
	return rows
}

// wantRow is what a summary row must say; message holds substrings.
type wantRow struct {
	file, mark, verdict, governing, bolts string
	message                               []string
}

func checkRows(t *testing.T, got []summaryRow, want []wantRow) {
	t.Helper()
	if len(got) != len(want) {
		t.Fatalf("summary has %d rows, want %d: %+v", len(got), len(want), got)
	}
	for i, w := range want {
		g := got[i]
		if filepath.Base(g.file) != w.file || g.mark != w.mark || g.verdict != w.verdict ||
			g.governing != w.governing || g.bolts != w.bolts {
			t.Errorf("row %d: got %s %q %s %q bolts %q, want %s %q %s %q bolts %q", i+1,
				filepath.Base(g.file), g.mark, g.verdict, g.governing, g.bolts,
				w.file, w.mark, w.verdict, w.governing, w.bolts)
		}
		if (g.ratio == "") != (w.governing == "") {
			t.Errorf("row %d (%s): ratio %q with governing %q", i+1, w.file, g.ratio, w.governing)
		}
		for _, m := range w.message {
			if !strings.Contains(g.message, m) {
				t.Errorf("row %d (%s): message %q does not contain %q", i+1, w.file, g.message, m)
			}
		}
		if len(w.message) == 0 && g.message != "" {
			t.Errorf("row %d (%s): message %q, want none", i+1, w.file, g.message)
		}
	}
}

// noTemps fails when a temporary file was left in dir (the lock file a
// run takes stays, empty, by design).
func noTemps(t *testing.T, dir string) {
	t.Helper()
	for _, n := range dirNames(t, dir) {
		if n != fileset.LockName && (strings.HasSuffix(n, ".tmp") || strings.HasPrefix(n, ".")) {
			t.Errorf("left behind in %s: %s", dir, n)
		}
	}
}

// outFiles lists every file under an output folder as a slash path
// relative to it (MARK/MARK.json), sorted, without the lock file.
func outFiles(t *testing.T, dir string) []string {
	t.Helper()
	var names []string
	err := filepath.WalkDir(dir, func(p string, d os.DirEntry, err error) error {
		if err != nil || d.IsDir() {
			return err
		}
		rel, _ := filepath.Rel(dir, p)
		if rel != fileset.LockName {
			names = append(names, filepath.ToSlash(rel))
		}
		return nil
	})
	if err != nil && !os.IsNotExist(err) {
		t.Fatal(err)
	}
	slices.Sort(names)
	return names
}

// setOf is the files of a mark's set folder, its manifest included.
func setOf(mark string, names ...string) []string {
	out := []string{mark + "/" + mark + fileset.ManifestExt}
	for _, n := range names {
		out = append(out, mark+"/"+n)
	}
	slices.Sort(out)
	return out
}

// sheetSet is a passing mark's set with sheets: JSON, cut sheet, CAM
// files, parts list.
func sheetSet(mark string) []string {
	return setOf(mark, mark+".json", mark+".dxf", mark+"-member.cam.dxf", mark+"-plate.cam.dxf", mark+".parts.csv")
}

// folderRows is what a check of testdata/batch says, job by job, in the
// summary's order: by mark, then the jobs without one. Ratios and
// governing limit states are those `gaugeline check` prints for the same
// files (see TestBatchAgreesWithCheck).
var folderRows = []wantRow{
	{"d-overloaded-brace.yaml", "HB-7", "fail", "bolts.shear", "4", []string{"fails: bolts.shear"}},
	{"b-slotted-tie.yaml", "KB-40", "pass", "bolts.slip", "4", nil},
	{"c-rack-brace.yaml", "RB-4", "pass", "bolts.shear", "5", nil},
	{"a-truss-diagonal.yaml", "TD-21.b", "pass", "plate.yield", "3", nil},
	{"i-same-mark.yaml", "TD-21.b", "error", "", "", []string{"duplicate mark TD-21.b, already used by", "a-truss-diagonal.yaml"}},
	{"e-tight-edge.yaml", "TE-9", "fail", "bolts.group", "4", []string{"fails: edge.min"}},
	{"f-typo-key.yaml", "", "error", "", "", []string{"f-typo-key.yaml:12: bolts.pich: unknown key", `did you mean "pitch"`}},
	{"g-wrong-dimension.yaml", "", "error", "", "", []string{"g-wrong-dimension.yaml:7: member.thickness:", "not a length"}},
	{"h-broken-yaml.yaml", "", "error", "", "", []string{"h-broken-yaml.yaml:6: not valid YAML"}},
}

// A folder of good, failing and malformed jobs: every job has its row, by
// mark; the passing ones their JSON, sheet and CAM files; the
// failing ones their JSON alone; the malformed and the duplicate nothing.
// Bad input wins the exit code.
func TestBatchFolder(t *testing.T) {
	src, _ := filepath.Abs(filepath.Join(testdata, "batch"))
	out := filepath.Join(t.TempDir(), "out")
	r := gaugeline(t, ".", "batch", src, "-o", out, "--sheets")
	if r.code != 2 {
		t.Fatalf("exit %d, want 2 (bad input wins); stderr:\n%s", r.code, r.stderr)
	}
	checkRows(t, readSummary(t, out), folderRows)

	want := slices.Concat([]string{"parts.csv", "summary.csv", "summary.md"}, setOf("HB-7", "HB-7.json"), setOf("TE-9", "TE-9.json"))
	for _, m := range []string{"KB-40", "RB-4", "TD-21.b"} {
		want = append(want, sheetSet(m)...)
	}
	slices.Sort(want)
	if got := outFiles(t, out); !slices.Equal(got, want) {
		t.Errorf("files in -o DIR:\n got %v\nwant %v", got, want)
	}
	noTemps(t, out)

	// The JSON is the check's: the same contract as `check --format json`.
	for mark, verdict := range map[string]string{"RB-4": "pass", "HB-7": "fail", "TD-21.b": "pass"} {
		var rep jsonReport
		data, err := os.ReadFile(filepath.Join(out, mark, mark+".json"))
		if err != nil {
			t.Fatal(err)
		}
		if err := json.Unmarshal(data, &rep); err != nil || rep.Mark != mark || rep.Verdict != verdict {
			t.Errorf("%s.json: mark %q verdict %q (%v), want %s", mark, rep.Mark, rep.Verdict, err, verdict)
		}
	}
	if !strings.Contains(r.stdout, "9 jobs: 3 pass, 2 fail, 4 error") || !strings.Contains(r.stdout, out) {
		t.Errorf("stdout does not give the counts and where the files went:\n%s", r.stdout)
	}
	// Piped stderr: the errors, no progress bar.
	for _, l := range strings.Split(strings.TrimSpace(r.stderr), "\n") {
		if !strings.HasPrefix(l, "gaugeline: error: ") && !strings.HasPrefix(l, "gaugeline: hint: ") {
			t.Errorf("stderr line %q", l)
		}
	}
	if n := strings.Count(r.stderr, "gaugeline: error: "); n != 4 {
		t.Errorf("stderr has %d errors, want 4:\n%s", n, r.stderr)
	}
	md, err := os.ReadFile(filepath.Join(out, "summary.md"))
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range folderRows {
		if !strings.Contains(string(md), "| "+filepath.Join(src, w.file)+" | "+w.mark+" | "+w.verdict+" |") {
			t.Errorf("summary.md has no row for %s", w.file)
		}
	}
}

// The summary agrees with `gaugeline check` job by job.
func TestBatchAgreesWithCheck(t *testing.T) {
	out := t.TempDir()
	src := filepath.Join(testdata, "batch")
	gaugeline(t, ".", "batch", src, "-o", out)
	for _, row := range readSummary(t, out) {
		if row.verdict == "error" {
			continue
		}
		rep, _ := checkJSON(t, row.file)
		if rep.Verdict != row.verdict || rep.Governing != row.governing {
			t.Errorf("%s: check says %s %s, batch %s %s", row.file, rep.Verdict, rep.Governing, row.verdict, row.governing)
		}
	}
}

// copyJobs copies testdata jobs into a new folder under new names.
func copyJobs(t *testing.T, files map[string]string) string {
	t.Helper()
	dir := t.TempDir()
	for name, src := range files {
		data, err := os.ReadFile(filepath.Join(testdata, src))
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, name), data, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return dir
}

// 0 when every job passes, 1 when any fails, 2 when any is bad input.
func TestBatchExitCodes(t *testing.T) {
	for _, tt := range []struct {
		name  string
		files map[string]string
		code  int
	}{
		{"all pass", map[string]string{"1.yaml": "batch/a-truss-diagonal.yaml", "2.yaml": "batch/c-rack-brace.yaml"}, 0},
		{"one fails", map[string]string{"1.yaml": "batch/a-truss-diagonal.yaml", "2.yaml": "batch/e-tight-edge.yaml"}, 1},
		{"bad wins", map[string]string{"1.yaml": "batch/d-overloaded-brace.yaml", "2.yaml": "bad/nan.yaml"}, 2},
		{"only bad", map[string]string{"1.yaml": "bad/empty.yaml"}, 2},
	} {
		t.Run(tt.name, func(t *testing.T) {
			dir := copyJobs(t, tt.files)
			out := filepath.Join(dir, "out")
			r := gaugeline(t, ".", "batch", dir, "-o", out)
			if r.code != tt.code {
				t.Fatalf("exit %d, want %d; stdout %s; stderr %s", r.code, tt.code, r.stdout, r.stderr)
			}
			if rows := readSummary(t, out); len(rows) != len(tt.files) {
				t.Errorf("%d rows, want %d", len(rows), len(tt.files))
			}
			noTemps(t, out)
		})
	}
}

// The same mark twice: the job later in the input is the error, whatever
// finishes first, and writes nothing; marks that differ only in case
// collide too (one file on Windows and macOS).
func TestBatchDuplicateMarks(t *testing.T) {
	rack, err := os.ReadFile(filepath.Join(testdata, "batch", "c-rack-brace.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	// 10 is heavier (fails) and sorts before the lighter duplicates.
	heavy := strings.Replace(string(rack), "required: 60 kip", "required: 95 kip", 1)
	write := func(name, s string) {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(s), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	write("10-first.yaml", heavy)
	write("20-again.yaml", string(rack))
	write("30-lower.yaml", strings.Replace(string(rack), "mark: RB-4", "mark: rb-4", 1))
	write("40-other.yaml", strings.Replace(string(rack), "mark: RB-4", "mark: RB-5", 1))
	out := filepath.Join(dir, "out")
	r := gaugeline(t, ".", "batch", dir, "-o", out, "--sheets", "-j", "4")
	if r.code != 2 {
		t.Fatalf("exit %d, want 2; stderr %s", r.code, r.stderr)
	}
	checkRows(t, readSummary(t, out), []wantRow{
		{"10-first.yaml", "RB-4", "fail", "bolts.shear", "5", []string{"fails: bolts.shear"}},
		{"20-again.yaml", "RB-4", "error", "", "", []string{"20-again.yaml: duplicate mark RB-4, already used by " + filepath.Join(dir, "10-first.yaml")}},
		{"30-lower.yaml", "rb-4", "error", "", "", []string{"duplicate mark rb-4, already used as RB-4 by", "10-first.yaml"}},
		{"40-other.yaml", "RB-5", "pass", "bolts.shear", "5", nil},
	})
	// RB-4 fails: its JSON only, the first job's.
	data, err := os.ReadFile(filepath.Join(out, "RB-4", "RB-4.json"))
	if err != nil || !bytes.Contains(data, []byte(`"verdict": "fail"`)) {
		t.Errorf("RB-4.json is not the first job's: %v", err)
	}
	want := slices.Concat(setOf("RB-4", "RB-4.json"), sheetSet("RB-5"), []string{"parts.csv", "summary.csv", "summary.md"})
	slices.Sort(want)
	if got := outFiles(t, out); !slices.Equal(got, want) {
		t.Errorf("files:\n got %v\nwant %v", got, want)
	}
}

// A list file: paths relative to the list, comments, blank lines; a
// missing job is an error for its line only; a job listed twice is a
// duplicate.
func TestBatchList(t *testing.T) {
	out := t.TempDir()
	list := filepath.Join(testdata, "batch", "jobs.list")
	r := gaugeline(t, ".", "batch", list, "-o", out)
	if r.code != 2 {
		t.Fatalf("exit %d, want 2; stderr %s", r.code, r.stderr)
	}
	checkRows(t, readSummary(t, out), []wantRow{ // by mark, then the job without one
		{"si-double-angle-asd.yaml", "DA-3", "error", "", "", []string{"si-double-angle-asd.yaml", "bolts.diameter: is required"}},
		{"d-overloaded-brace.yaml", "HB-7", "fail", "bolts.shear", "4", []string{"fails: bolts.shear"}},
		{"c-rack-brace.yaml", "RB-4", "pass", "bolts.shear", "5", nil},
		{"c-rack-brace.yaml", "RB-4", "error", "", "", []string{"duplicate mark RB-4"}},
		{"no-such-job.yaml", "", "error", "", "", []string{"no-such-job.yaml: cannot read the job"}},
	})
	if got := readSummary(t, out)[4].file; got != filepath.Join(testdata, "batch", "no-such-job.yaml") {
		t.Errorf("list paths are not relative to the list: %s", got)
	}
}

// --propose: the proposal's JSON, and with --sheets the sheet of the
// proposed layout; a job where nothing passes is a failure with what
// blocks it.
func TestBatchPropose(t *testing.T) {
	out := t.TempDir()
	r := gaugeline(t, ".", "batch", filepath.Join(testdata, "batch", "propose"), "-o", out, "--propose", "--sheets")
	if r.code != 2 {
		t.Fatalf("exit %d, want 2; stderr %s", r.code, r.stderr)
	}
	checkRows(t, readSummary(t, out), []wantRow{ // by mark
		{"zz-unknown-size.yaml", "BAD-1", "error", "", "", []string{"zz-unknown-size.yaml:6: member.size:"}},
		// 3 bolts at the usual gage of the 4 in leg, 2-1/2 in (propose's
		// default order ranks the usual gage first); bolt shear governs.
		{"us-angle-brace.yaml", "BR-12", "pass", "bolts.shear", "3", nil},
		// 4 bolts: the hand calculation in detail/propose_test.go.
		{"si-double-angle-asd.yaml", "DA-3", "pass", "bolts.group", "4", nil},
		// Bolt shear: 50 kip against 2 × 17.9 kip (testdata/propose).
		{"infeasible-bolts.yaml", "IB-2", "fail", "bolts.shear", "", []string{"no layout passes: bolts.shear needs at least 3 bolts"}},
	})
	var p struct {
		Verdict string `json:"verdict"`
		Layout  any    `json:"layout"`
	}
	data, _ := os.ReadFile(filepath.Join(out, "DA-3", "DA-3.json"))
	if err := json.Unmarshal(data, &p); err != nil || p.Verdict != "pass" || p.Layout == nil {
		t.Errorf("DA-3.json is not a proposal: %v %+v", err, p)
	}
	for _, f := range []string{"DA-3/DA-3.dxf", "DA-3/DA-3-member.cam.dxf", "BR-12/BR-12.dxf", "IB-2/IB-2.json"} {
		if _, err := os.Stat(filepath.Join(out, f)); err != nil {
			t.Error(err)
		}
	}
	if _, err := os.Stat(filepath.Join(out, "IB-2", "IB-2.dxf")); err == nil {
		t.Error("an infeasible job got a sheet")
	}
}

// A job that now fails loses the cut sheet and CAM files an earlier run
// left for its mark (its set is replaced whole); files and folders that
// are not its set are left alone, and a folder of its name that is not a
// set gaugeline wrote is never touched.
func TestBatchRemovesStaleSheets(t *testing.T) {
	dir := copyJobs(t, map[string]string{"d.yaml": "batch/d-overloaded-brace.yaml"})
	out := filepath.Join(dir, "out")
	write := func(name, s string) {
		t.Helper()
		if err := os.MkdirAll(filepath.Dir(filepath.Join(out, name)), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(out, name), []byte(s), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	// An earlier run's whole set of HB-7, passing then: a manifest and sheets.
	for _, f := range []string{"HB-7.dxf", "HB-7-member.cam.dxf", "HB-7-plate.cam.dxf", "HB-7.json"} {
		write("HB-7/"+f, "old")
	}
	write("HB-7/HB-7.files", "stamp: old\n")
	write("notes.txt", "mine")
	write("HB-70/HB-70.dxf", "someone else's")
	if r := gaugeline(t, ".", "batch", dir, "-o", out, "--sheets"); r.code != 1 {
		t.Fatalf("exit %d, want 1: %s", r.code, r.stderr)
	}
	want := slices.Concat(setOf("HB-7", "HB-7.json"), []string{"HB-70/HB-70.dxf", "notes.txt", "summary.csv", "summary.md"})
	slices.Sort(want)
	if got := outFiles(t, out); !slices.Equal(got, want) {
		t.Errorf("files:\n got %v\nwant %v", got, want)
	}

	// A folder HB-7 that is not a set: the job is refused, the folder kept.
	if err := os.RemoveAll(filepath.Join(out, "HB-7")); err != nil {
		t.Fatal(err)
	}
	write("HB-7/drawings.pdf", "not ours")
	r := gaugeline(t, ".", "batch", dir, "-o", out, "--sheets")
	if r.code != 2 || !strings.Contains(r.stderr, "is not a gaugeline file set") {
		t.Errorf("exit %d, stderr %q; want 2 and the folder refused", r.code, r.stderr)
	}
	if b, err := os.ReadFile(filepath.Join(out, "HB-7", "drawings.pdf")); err != nil || string(b) != "not ours" {
		t.Errorf("a folder that is not a set was touched: %v", err)
	}
}

func TestBatchUsage(t *testing.T) {
	empty := t.TempDir()
	out := t.TempDir()
	for _, tt := range []struct {
		args []string
		msg  string
	}{
		{[]string{"batch", filepath.Join(testdata, "batch")}, "-o DIR is required"},
		{[]string{"batch", filepath.Join(testdata, "batch", "c-rack-brace.yaml"), "-o", out}, "is a job, not a folder"},
		{[]string{"batch", empty, "-o", out}, "no *.yaml or *.yml job in the folder"},
		{[]string{"batch", filepath.Join(empty, "nothing"), "-o", out}, "cannot read the jobs"},
		{[]string{"batch", filepath.Join(testdata, "batch", "notes.txt"), "-o", out}, "cannot read the job"},
		{[]string{"batch", filepath.Join(testdata, "batch"), "-o", out, "-j", "-1"}, "--jobs"},
		{[]string{"batch"}, "want one folder, list file or schedule"},
	} {
		r := gaugeline(t, ".", tt.args...)
		if r.code != 2 || !strings.Contains(r.stderr, "gaugeline: error: ") || !strings.Contains(r.stderr, tt.msg) {
			t.Errorf("%v: exit %d, stderr %q; want 2 and %q", tt.args, r.code, r.stderr, tt.msg)
		}
	}
}

// In-process, for the race detector (go test -race -run Batch): many
// workers, more jobs than workers, duplicates spread through the input.
// Job i carries mark M(i mod 7), so the first seven jobs own the marks and
// every later one is a duplicate of the job i mod 7.
func TestBatchInProcessRace(t *testing.T) {
	rack, err := os.ReadFile(filepath.Join(testdata, "batch", "c-rack-brace.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	const n = 40
	for i := range n {
		job := strings.Replace(string(rack), "mark: RB-4", fmt.Sprintf("mark: M%d", i%7), 1)
		if i%5 == 4 {
			job = strings.Replace(job, "pitch: 3 in", "pich: 3 in", 1) // bad input: no mark claimed
		}
		if err := os.WriteFile(filepath.Join(dir, fmt.Sprintf("%03d.yaml", i)), []byte(job), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	out := filepath.Join(dir, "out")
	var stdout, stderr bytes.Buffer
	code := run(context.Background(), []string{"batch", dir, "-o", out, "--sheets", "-j", "8"}, &stdout, &stderr)
	if code != 2 {
		t.Fatalf("exit %d, want 2; %s", code, stderr.String())
	}
	owner := map[string]int{}
	rows := readSummary(t, out)
	slices.SortStableFunc(rows, func(a, b summaryRow) int { return strings.Compare(a.file, b.file) }) // input order
	for i, row := range rows {
		mark := fmt.Sprintf("M%d", i%7)
		switch {
		case i%5 == 4:
			if row.verdict != "error" || !strings.Contains(row.message, "bolts.pich") {
				t.Errorf("job %d: %s %q, want the bad-input error", i, row.verdict, row.message)
			}
		case owner[mark] == 0:
			owner[mark] = i + 1
			if row.verdict != "pass" {
				t.Errorf("job %d: %s %q, want pass (first with %s)", i, row.verdict, row.message, mark)
			}
		default:
			want := fmt.Sprintf("duplicate mark %s, already used by %s", mark, filepath.Join(dir, fmt.Sprintf("%03d.yaml", owner[mark]-1)))
			if row.verdict != "error" || !strings.Contains(row.message, want) {
				t.Errorf("job %d: %s %q, want %q", i, row.verdict, row.message, want)
			}
		}
	}
	noTemps(t, out)

	// Propose and its sheets on every worker at once.
	stdout.Reset()
	stderr.Reset()
	out = filepath.Join(dir, "propose")
	code = run(context.Background(), []string{"batch", filepath.Join(testdata, "batch", "propose"), "-o", out,
		"--propose", "--sheets", "-j", "4"}, &stdout, &stderr)
	if code != 2 || !strings.Contains(stdout.String(), "4 jobs: 2 pass, 1 fail, 1 error") {
		t.Errorf("propose: exit %d, want 2; %s%s", code, stdout.String(), stderr.String())
	}
	noTemps(t, out)
}

// Ctrl-C or SIGTERM: the running job finishes, the rest are recorded as
// not run, the summary says the run was interrupted, the exit code is the
// interruption's own, and every set in the folder is whole.
func TestBatchInterrupt(t *testing.T) {
	dir := t.TempDir()
	const n = 400
	for i := range n {
		if err := os.WriteFile(filepath.Join(dir, fmt.Sprintf("%03d.yaml", i)), []byte(benchCheckJob(i)), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	for _, sig := range []os.Signal{os.Interrupt, syscall.SIGTERM} {
		t.Run(sig.String(), func(t *testing.T) {
			out := filepath.Join(t.TempDir(), "out")
			cmd := exec.Command(bin, "batch", dir, "-o", out, "--sheets", "-j", "1")
			var stdout bytes.Buffer
			cmd.Stdout = &stdout
			if err := cmd.Start(); err != nil {
				t.Fatal(err)
			}
			for deadline := time.Now().Add(30 * time.Second); ; time.Sleep(2 * time.Millisecond) {
				if _, err := os.Stat(filepath.Join(out, "UC-0", "UC-0.json")); err == nil {
					break
				}
				if time.Now().After(deadline) {
					cmd.Process.Kill()
					t.Fatal("no job finished in 30 s")
				}
			}
			if err := cmd.Process.Signal(sig); err != nil {
				t.Fatal(err)
			}
			err := cmd.Wait()
			rows := readSummary(t, out)
			if len(rows) != n {
				t.Fatalf("%d rows, want %d", len(rows), n)
			}
			notRun := 0
			for _, r := range rows {
				if r.verdict == "not run" && strings.Contains(r.message, "not run: the batch was interrupted") {
					notRun++
				}
			}
			if notRun == 0 {
				t.Skip("the batch finished before the signal reached it")
			}
			var ee *exec.ExitError
			if !errors.As(err, &ee) || ee.ExitCode() != exitInterrupted {
				t.Errorf("exit %v, want %d (interrupted) with %d jobs not run", err, exitInterrupted, notRun)
			}
			if rows[0].verdict != "pass" || notRun == n {
				t.Errorf("the first job did not run to the end: %+v", rows[0])
			}
			md, _ := os.ReadFile(filepath.Join(out, "summary.md"))
			if !bytes.HasPrefix(md, []byte("# Batch summary: INTERRUPTED")) {
				t.Errorf("summary.md does not say the run was interrupted:\n%.200s", md)
			}
			if _, problems := auditProblems(t, out); len(problems) != 0 {
				t.Errorf("after the signal: %v", problems)
			}
			noTemps(t, out)
		})
	}
}

// Issue 11: a FIFO (or any file that is not a regular file) among the jobs
// is that job's bad input: it is refused without being opened, the other
// jobs carry on, and the batch ends. A FIFO given as the list itself is
// refused at once.
func TestBatchRefusesSpecialFiles(t *testing.T) {
	dir := copyJobs(t, map[string]string{"a.yaml": "batch/a-truss-diagonal.yaml", "c.yaml": "batch/c-rack-brace.yaml"})
	if err := syscall.Mkfifo(filepath.Join(dir, "b.yaml"), 0o644); err != nil {
		t.Skip("no FIFOs here:", err)
	}
	list := filepath.Join(t.TempDir(), "jobs.list")
	if err := syscall.Mkfifo(list, 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(t.TempDir(), "out")
	done := make(chan ran, 2)
	go func() { done <- gaugeline(t, ".", "batch", dir, "-o", out) }()
	go func() { done <- gaugeline(t, ".", "batch", list, "-o", out) }()
	for range 2 {
		select {
		case r := <-done:
			if r.code != 2 || !strings.Contains(r.stderr, "b.yaml") && !strings.Contains(r.stderr, "jobs.list") {
				t.Errorf("exit %d, want 2 naming the special file; stderr %s", r.code, r.stderr)
			}
		case <-time.After(20 * time.Second):
			t.Fatal("batch blocked on a FIFO")
		}
	}
	rows := readSummary(t, out)
	if len(rows) != 3 || rows[0].verdict != "pass" || rows[1].verdict != "pass" || rows[2].verdict != "error" {
		t.Errorf("rows %+v, want pass, pass, error (the FIFO: no mark, last)", rows)
	}
}
