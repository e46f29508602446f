package main

import (
	"crypto/sha256"
	"fmt"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"

	"gaugeline/batch"
	"gaugeline/fileset"
)

// killJobs writes n passing angle jobs K-0…K-(n-1) into a new folder, with
// the given pitch, and returns the folder and each mark's input SHA-256.
func killJobs(t *testing.T, n int, pitch string) (string, map[string]string) {
	t.Helper()
	dir := t.TempDir()
	sums := map[string]string{}
	for i := range n {
		job := strings.Replace(benchCheckJob(2*i), fmt.Sprintf("mark: UC-%d", 2*i), fmt.Sprintf("mark: K-%d", i), 1)
		job = strings.Replace(job, "pitch: 3 in", "pitch: "+pitch, 1)
		if err := os.WriteFile(filepath.Join(dir, fmt.Sprintf("k%02d.yaml", i)), []byte(job), 0o644); err != nil {
			t.Fatal(err)
		}
		sums[fmt.Sprintf("K-%d", i)] = fmt.Sprintf("%x", sha256.Sum256([]byte(job)))
	}
	return dir, sums
}

// auditProblems runs the folder check and returns its problems.
func auditProblems(t *testing.T, out string) (*fileset.Report, []fileset.Finding) {
	t.Helper()
	a, err := fileset.Audit(out)
	if err != nil {
		t.Fatal(err)
	}
	var p []fileset.Finding
	for _, f := range a.Findings {
		if f.Problem() {
			p = append(p, f)
		}
	}
	return a, p
}

// Issue 11: re-run a changed batch over the folder of another run and kill
// it (SIGKILL, no chance to clean up) at random moments, 50 times. After
// every kill each mark's set is entirely one run's (whole, its files of one
// stamp, nothing orphaned) or absent; the summary never passes for the
// killed run's. The next full run leaves a clean folder.
func TestKilledBatchLeavesWholeSets(t *testing.T) {
	if testing.Short() {
		t.Skip("kills 50 batches")
	}
	const n = 30
	dirA, sumA := killJobs(t, n, "3 in")
	dirB, sumB := killJobs(t, n, "3-1/2 in")
	out := filepath.Join(t.TempDir(), "out")

	start := time.Now()
	if r := gaugeline(t, ".", "batch", dirA, "-o", out, "--sheets"); r.code != 0 {
		t.Fatalf("first run: exit %d %s", r.code, r.stderr)
	}
	full := time.Since(start)
	rng := rand.New(rand.NewPCG(11, 2026))
	mixedFolders := 0
	for k := range 50 {
		src := dirB
		if k%2 == 1 {
			src = dirA
		}
		cmd := exec.Command(bin, "batch", src, "-o", out, "--sheets", "-j", "2")
		if err := cmd.Start(); err != nil {
			t.Fatal(err)
		}
		time.Sleep(time.Duration(rng.Int64N(int64(full) * 6 / 5)))
		cmd.Process.Signal(syscall.SIGKILL)
		cmd.Wait()

		a, problems := auditProblems(t, out)
		for _, p := range problems {
			if p.Kind != fileset.Unfinished { // a killed run's summary says so: expected
				t.Errorf("kill %d: %s: %s: %s", k, p.Path, p.Kind, p.Msg)
			}
		}
		runs := map[string]bool{}
		for mark, stamp := range a.Sets {
			in := stamp[strings.LastIndex(stamp, " ")+1:]
			switch in {
			case sumA[mark]:
				runs["A"] = true
			case sumB[mark]:
				runs["B"] = true
			default:
				t.Errorf("kill %d: %s has the stamp of neither run: %s", k, mark, stamp)
			}
			if got := outFiles(t, filepath.Join(out, mark)); len(got) != 6 {
				t.Errorf("kill %d: %s holds %v, want the whole set of 6 files", k, mark, got)
			}
		}
		if runs["A"] && runs["B"] {
			mixedFolders++
		}
		if t.Failed() {
			t.FailNow()
		}
	}
	// The kills must have landed inside runs, or this proves nothing.
	t.Logf("%d of 50 kills stopped a run part way (sets of both runs in the folder); full run %v", mixedFolders, full)
	if mixedFolders < 5 {
		t.Errorf("only %d of 50 kills landed part way through a run", mixedFolders)
	}

	if r := gaugeline(t, ".", "batch", dirB, "-o", out, "--sheets"); r.code != 0 {
		t.Fatalf("last run: exit %d %s", r.code, r.stderr)
	}
	a, problems := auditProblems(t, out)
	if len(problems) != 0 || len(a.Findings) != 0 || a.Whole != n {
		t.Errorf("after a full run: %d whole of %d, findings %v", a.Whole, n, a.Findings)
	}
	noTemps(t, out)
}

// The folder check finds what is wrong, by kind: a file of another run in a
// set, a file changed after it was written, one missing, one added, a
// folder that is no set, a stray file, a summary row of another run, and
// the summary of a run that did not finish.
func TestAuditFindsMixedSets(t *testing.T) {
	dirA, _ := killJobs(t, 3, "3 in")
	dirB, _ := killJobs(t, 3, "3-1/2 in")
	out := filepath.Join(t.TempDir(), "out")
	other := filepath.Join(t.TempDir(), "other")
	for _, r := range []ran{
		gaugeline(t, ".", "batch", dirA, "-o", out, "--sheets"),
		gaugeline(t, ".", "batch", dirB, "-o", other, "--sheets"),
	} {
		if r.code != 0 {
			t.Fatalf("exit %d %s", r.code, r.stderr)
		}
	}
	if r := gaugeline(t, ".", "audit", out); r.code != 0 || !strings.Contains(r.stdout, "3 file sets, 3 whole; 0 problem(s)") {
		t.Fatalf("a clean folder: exit %d\n%s%s", r.code, r.stdout, r.stderr)
	}
	cp := func(from, to string) {
		t.Helper()
		b, err := os.ReadFile(from)
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(to, b, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	// K-0: the plate CAM file of the other run (pitch 3-1/2 in).
	cp(filepath.Join(other, "K-0", "K-0-plate.cam.dxf"), filepath.Join(out, "K-0", "K-0-plate.cam.dxf"))
	// K-1: its cut sheet edited, its member CAM file gone, a stray file in.
	b, _ := os.ReadFile(filepath.Join(out, "K-1", "K-1.dxf"))
	os.WriteFile(filepath.Join(out, "K-1", "K-1.dxf"), append(b, "\n"...), 0o644)
	os.Remove(filepath.Join(out, "K-1", "K-1-member.cam.dxf"))
	os.WriteFile(filepath.Join(out, "K-1", "old-K-1.dxf"), []byte("x"), 0o644)
	// K-2: the whole set of the other run, under this run's summary.
	os.RemoveAll(filepath.Join(out, "K-2"))
	os.Rename(filepath.Join(other, "K-2"), filepath.Join(out, "K-2"))
	// Beside the sets: a flat file, a folder of somebody's, a leftover.
	os.WriteFile(filepath.Join(out, "K-3.dxf"), []byte("x"), 0o644)
	os.Mkdir(filepath.Join(out, "drawings"), 0o755)
	os.Mkdir(filepath.Join(out, ".K-0.new-123"), 0o755)

	r := gaugeline(t, ".", "audit", out)
	if r.code != 1 {
		t.Fatalf("exit %d, want 1\n%s", r.code, r.stdout)
	}
	for _, want := range []string{
		"K-0/K-0-plate.cam.dxf: mixed:",
		"K-0/K-0-plate.cam.dxf: altered:",
		"K-1/K-1.dxf: altered:",
		"K-1/K-1-member.cam.dxf: missing:",
		"K-1/old-K-1.dxf: orphaned:",
		"K-3.dxf: orphaned:",
		"drawings: orphaned:",
		"summary.csv: stale: row 4 describes K-2",
		"note: " + filepath.Join(out, ".K-0.new-123") + ": leftover:",
		"3 file sets, 1 whole; 8 problem(s)",
	} {
		if !strings.Contains(r.stdout, want) {
			t.Errorf("audit does not report %q:\n%s", want, r.stdout)
		}
	}

	// A run that did not finish: its summary says so, and audit reports it.
	os.WriteFile(filepath.Join(out, "summary.md"), batch.SummaryRunning("test"), 0o644)
	if r := gaugeline(t, ".", "audit", out); !strings.Contains(r.stdout, "summary.md: unfinished:") {
		t.Errorf("audit does not report the unfinished run:\n%s", r.stdout)
	}
	if r := gaugeline(t, ".", "audit", filepath.Join(out, "nothing")); r.code != 2 {
		t.Errorf("audit of a missing folder: exit %d, want 2", r.code)
	}
}

// Every file of a set carries the set's stamp, in its own format's way,
// and the stamp names the tool, the mode and the input's SHA-256.
func TestSetFilesCarryOneStamp(t *testing.T) {
	out := t.TempDir()
	r := gaugeline(t, ".", "demo", "-o", out)
	if r.code != 0 {
		t.Fatalf("demo: exit %d %s", r.code, r.stderr)
	}
	a, problems := auditProblems(t, out)
	if len(problems) != 0 || a.Whole != 9 { // eight connections and the QA set
		t.Fatalf("demo folder: %d whole, problems %v", a.Whole, problems)
	}
	var data []byte
	entries, _ := demoJobs.ReadDir("demo")
	for _, e := range entries {
		if b, _ := demoJobs.ReadFile("demo/" + e.Name()); strings.Contains(string(b), "mark: "+demoQAMark) {
			data = b
		}
	}
	want := fmt.Sprintf("%s; propose; input sha256 %x", toolVersion(), sha256.Sum256(data))
	for _, f := range outFiles(t, filepath.Join(out, "PR-VB2")) {
		if strings.HasSuffix(f, fileset.ManifestExt) {
			continue
		}
		b, _ := os.ReadFile(filepath.Join(out, "PR-VB2", f))
		if got, ok := fileset.FileStamp(f, b); !ok || got != want {
			t.Errorf("%s: stamp %q (%v), want %q", f, got, ok, want)
		}
	}
}

// A stamped CAM file still reads as a measured file: the 999 comment that
// carries the stamp is skipped, and the part re-verifies as accepted
// (measured = designed). The member's CAM file is the whole member, and
// reverify matches one end's holes, so the job's far end is plain here.
func TestStampedCAMReverifies(t *testing.T) {
	src, err := os.ReadFile(filepath.Join(testdata, "jobs", "si-double-angle.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	plain := strings.Replace(string(src), "  length: 3.2 m\n", "  length: 3.2 m\n  far_end: plain\n", 1)
	if plain == string(src) {
		t.Fatal("si-double-angle.yaml has no length: 3.2 m line")
	}
	job := filepath.Join(t.TempDir(), "si-double-angle.yaml")
	if err := os.WriteFile(job, []byte(plain), 0o644); err != nil {
		t.Fatal(err)
	}
	out := t.TempDir()
	if r := gaugeline(t, ".", "sheet", job, "-o", out); r.code != 0 {
		t.Fatalf("sheet: exit %d %s", r.code, r.stderr)
	}
	for _, part := range []string{"member", "plate"} {
		cam := filepath.Join(out, "TD-21.b", "TD-21.b-"+part+".cam.dxf")
		b, _ := os.ReadFile(cam)
		if !strings.HasPrefix(string(b), "999\n"+"gaugeline stamp: ") {
			t.Fatalf("%s is not stamped", cam)
		}
		r := gaugeline(t, ".", "reverify", job, "--measured", cam, "--part", part)
		if r.code != 0 || !strings.Contains(strings.ToLower(r.stdout), "accept") {
			t.Errorf("%s: exit %d, want 0 (accept)\n%s%s", part, r.code, r.stdout, r.stderr)
		}
	}
}
