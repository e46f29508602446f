package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"golang.org/x/net/html"

	"gaugeline/detail"
)

// Every test job gets its report, passing (exit 0) or failing (exit 1):
// the file is written, parses as HTML, names the mark and carries the
// caution; stdout is the path written.
func TestReportCommand(t *testing.T) {
	for _, tt := range []struct {
		job  string
		code int
		mark string
	}{
		{"jobs/si-double-angle.yaml", 0, "TD-21.b"},
		{"jobs/si-slotted.yaml", 0, "KB-40"},
		{"jobs/us-single-angle.yaml", 1, "HB-7"},
		{"jobs/us-staggered-flat.yaml", 1, "FT_03"},
		{"examples/aisc-d2.yaml", 1, "AISC-D2"}, // no plate
	} {
		t.Run(filepath.Base(tt.job), func(t *testing.T) {
			job, _ := filepath.Abs(filepath.Join(testdata, tt.job))
			out := filepath.Join(t.TempDir(), "new", "dir", tt.mark+".html")
			r := gaugeline(t, ".", "report", job, "-o", out)
			if r.code != tt.code {
				t.Fatalf("exit %d, want %d; stderr: %s", r.code, tt.code, r.stderr)
			}
			if strings.TrimSpace(r.stdout) != out {
				t.Errorf("stdout %q, want the path written", r.stdout)
			}
			if tt.code == 1 && !strings.Contains(r.stderr, "fails") {
				t.Errorf("a failing connection is not told on stderr: %q", r.stderr)
			}
			b, err := os.ReadFile(out)
			if err != nil {
				t.Fatal(err)
			}
			doc, err := html.Parse(bytes.NewReader(b))
			if err != nil {
				t.Fatalf("not HTML: %v", err)
			}
			if doc.FirstChild == nil || doc.FirstChild.Type != html.DoctypeNode {
				t.Error("no doctype")
			}
			for _, want := range []string{tt.mark, detail.Caution, "<svg"} {
				if !bytes.Contains(b, []byte(want)) {
					t.Errorf("the report has no %q", want)
				}
			}
			if names := dirNames(t, filepath.Dir(out)); len(names) != 1 {
				t.Errorf("the output directory holds %v, want the report alone", names)
			}
		})
	}
}

// The same job gives the same bytes, whichever directory it is read from.
func TestReportIsTheSameTwice(t *testing.T) {
	src, _ := filepath.Abs(filepath.Join(testdata, "jobs", "si-double-angle.yaml"))
	data, err := os.ReadFile(src)
	if err != nil {
		t.Fatal(err)
	}
	var pages [][]byte
	for range 2 {
		dir := t.TempDir()
		job := filepath.Join(dir, "si-double-angle.yaml")
		if err := os.WriteFile(job, data, 0o644); err != nil {
			t.Fatal(err)
		}
		out := filepath.Join(dir, "out.html")
		if r := gaugeline(t, dir, "report", job, "-o", out); r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		b, err := os.ReadFile(out)
		if err != nil {
			t.Fatal(err)
		}
		pages = append(pages, b)
	}
	if !bytes.Equal(pages[0], pages[1]) {
		t.Error("two reports of one job differ")
	}
}

// Bad input exits 2 and writes nothing, not even a temporary file; so
// does a missing -o.
func TestReportBadInput(t *testing.T) {
	bad, err := filepath.Glob(filepath.Join(testdata, "bad", "*.yaml"))
	if err != nil || len(bad) == 0 {
		t.Fatalf("no bad jobs (%v)", err)
	}
	for _, f := range bad {
		t.Run(filepath.Base(f), func(t *testing.T) {
			dir := t.TempDir()
			abs, _ := filepath.Abs(f)
			r := gaugeline(t, dir, "report", abs, "-o", filepath.Join(dir, "r.html"))
			if r.code != 2 {
				t.Fatalf("exit %d, want 2; stderr: %s", r.code, r.stderr)
			}
			if !strings.HasPrefix(r.stderr, "gaugeline: error: ") || !strings.Contains(r.stderr, filepath.Base(f)) {
				t.Errorf("message does not name the file: %q", r.stderr)
			}
			if r.stdout != "" {
				t.Errorf("stdout %q", r.stdout)
			}
			if names := dirNames(t, dir); len(names) != 0 {
				t.Errorf("bad input left %v behind", names)
			}
		})
	}
	job, _ := filepath.Abs(filepath.Join(testdata, "jobs", "si-slotted.yaml"))
	dir := t.TempDir()
	for _, args := range [][]string{
		{"report", job},
		{"report", "-o", filepath.Join(dir, "r.html")},
		{"report", filepath.Join(dir, "no-such-job.yaml"), "-o", filepath.Join(dir, "r.html")},
	} {
		r := gaugeline(t, dir, args...)
		if r.code != 2 || !strings.HasPrefix(r.stderr, "gaugeline: error: ") {
			t.Errorf("%v: exit %d, stderr %q; want 2 and a gaugeline: error: line", args, r.code, r.stderr)
		}
	}
	if names := dirNames(t, dir); len(names) != 0 {
		t.Errorf("usage errors left %v behind", names)
	}
}
