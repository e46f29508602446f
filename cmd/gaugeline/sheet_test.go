package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"gaugeline/fileset"
)

// insunits reads $INSUNITS from a DXF's header (group code pairs).
func insunits(t *testing.T, data []byte) string {
	t.Helper()
	lines := strings.Split(strings.ReplaceAll(string(data), "\r\n", "\n"), "\n")
	for i := 0; i+3 < len(lines); i += 2 {
		if strings.TrimSpace(lines[i]) == "9" && lines[i+1] == "$INSUNITS" {
			return strings.TrimSpace(lines[i+3])
		}
	}
	t.Fatal("no $INSUNITS")
	return ""
}

func dirNames(t *testing.T, dir string) []string {
	t.Helper()
	entries, err := os.ReadDir(dir)
	if err != nil {
		if os.IsNotExist(err) {
			return nil
		}
		t.Fatal(err)
	}
	var names []string
	for _, e := range entries {
		names = append(names, e.Name())
	}
	return names
}

// Passing jobs of both unit systems get the cut sheet and one CAM file per
// part, in a directory created for them; failing ones are refused with
// nothing written, or stamped and written alone with --not-for-fabrication.
func TestSheetCommand(t *testing.T) {
	for _, tt := range []struct {
		job   string
		code  int
		files []string // with --not-for-fabrication when code is 1
		units string
	}{
		{"jobs/si-double-angle.yaml", 0, []string{"TD-21.b-member.cam.dxf", "TD-21.b-plate.cam.dxf", "TD-21.b.parts.csv", "TD-21.b.dxf"}, "4"},
		{"jobs/si-slotted.yaml", 0, []string{"KB-40-member.cam.dxf", "KB-40-plate.cam.dxf", "KB-40.parts.csv", "KB-40.dxf"}, "4"},
		{"jobs/us-single-angle.yaml", 1, []string{"HB-7.dxf"}, "1"},
		{"jobs/us-staggered-flat.yaml", 1, []string{"FT_03.dxf"}, "1"},
		{"examples/aisc-d2.yaml", 1, []string{"AISC-D2.dxf"}, "1"}, // no plate
	} {
		t.Run(filepath.Base(tt.job), func(t *testing.T) {
			job, _ := filepath.Abs(filepath.Join(testdata, tt.job))
			out := filepath.Join(t.TempDir(), "new", "dir")
			r := gaugeline(t, ".", "sheet", job, "-o", out)
			if r.code != tt.code {
				t.Fatalf("exit %d, want %d; stderr %s", r.code, tt.code, r.stderr)
			}
			if tt.code == 1 {
				if !strings.HasPrefix(r.stderr, "gaugeline: error: ") || !strings.Contains(r.stderr, "no sheet written") {
					t.Errorf("refusal message %q", r.stderr)
				}
				if names := dirNames(t, out); len(names) != 0 {
					t.Fatalf("refused, yet wrote %v", names)
				}
				r = gaugeline(t, ".", "sheet", job, "-o", out, "--not-for-fabrication")
				if r.code != 1 {
					t.Fatalf("--not-for-fabrication: exit %d, want 1 (the connection still fails); stderr %s", r.code, r.stderr)
				}
			}
			mark := strings.TrimSuffix(tt.files[len(tt.files)-1], ".dxf")
			names := outFiles(t, out)
			if want := setOf(mark, tt.files...); !slices.Equal(names, want) {
				t.Fatalf("wrote %v, want %v", names, want)
			}
			for _, n := range names {
				if strings.HasSuffix(n, fileset.ManifestExt) || strings.HasSuffix(n, ".parts.csv") {
					continue // not DXF
				}
				data, err := os.ReadFile(filepath.Join(out, n))
				if err != nil {
					t.Fatal(err)
				}
				if got := insunits(t, data); got != tt.units {
					t.Errorf("%s: $INSUNITS %s, want %s", n, got, tt.units)
				}
				stamped := bytes.Contains(data, []byte("NOT FOR FABRICATION"))
				if stamped != (tt.code == 1) {
					t.Errorf("%s: stamped %v", n, stamped)
				}
				if !strings.Contains(r.stdout, n) {
					t.Errorf("stdout %q does not list %s", r.stdout, n)
				}
			}
		})
	}
}

// The same job written twice gives the same bytes.
func TestSheetTwiceIsByteIdentical(t *testing.T) {
	job, _ := filepath.Abs(filepath.Join(testdata, "jobs", "si-double-angle.yaml"))
	a, b := t.TempDir(), t.TempDir()
	for _, dir := range []string{a, b} {
		if r := gaugeline(t, ".", "sheet", job, "-o", dir); r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
	}
	for _, n := range outFiles(t, a) {
		x, _ := os.ReadFile(filepath.Join(a, n))
		y, _ := os.ReadFile(filepath.Join(b, n))
		if len(x) == 0 || !bytes.Equal(x, y) {
			t.Errorf("%s differs between two runs", n)
		}
	}
}

// The demo job passes and gets its three files; no temporary file is left.
func TestSheetOfDemoJob(t *testing.T) {
	job, _ := filepath.Abs(filepath.Join(testdata, "jobs", "us-pipe-rack-brace.yaml"))
	dir := t.TempDir()
	if r := gaugeline(t, ".", "sheet", job, "-o", dir); r.code != 0 {
		t.Fatalf("exit %d: %s", r.code, r.stderr)
	}
	if want := setOf("PR-VB2", "PR-VB2-member.cam.dxf", "PR-VB2-plate.cam.dxf", "PR-VB2.parts.csv", "PR-VB2.dxf"); !slices.Equal(outFiles(t, dir), want) {
		t.Errorf("wrote %v, want %v", outFiles(t, dir), want)
	}
	// Asked not for fabrication, a passing job gets the stamped sheet alone.
	dir = t.TempDir()
	if r := gaugeline(t, ".", "sheet", job, "-o", dir, "--not-for-fabrication"); r.code != 0 || !strings.Contains(r.stderr, "no CAM file") {
		t.Fatalf("exit %d: %s", r.code, r.stderr)
	}
	data, _ := os.ReadFile(filepath.Join(dir, "PR-VB2", "PR-VB2.dxf"))
	if names := outFiles(t, dir); !slices.Equal(names, setOf("PR-VB2", "PR-VB2.dxf")) || !bytes.Contains(data, []byte("NOT FOR FABRICATION")) {
		t.Errorf("wrote %v, stamped %v", names, bytes.Contains(data, []byte("NOT FOR FABRICATION")))
	}
}

// Bad input and bad usage exit 2 and write nothing, not even the directory.
func TestSheetBadInputWritesNothing(t *testing.T) {
	files, err := filepath.Glob(filepath.Join(testdata, "bad", "*.yaml"))
	if err != nil || len(files) == 0 {
		t.Fatal("no bad jobs")
	}
	good, _ := filepath.Abs(filepath.Join(testdata, "jobs", "si-slotted.yaml"))
	type call struct {
		name string
		args []string
	}
	var calls []call
	for _, f := range files {
		abs, _ := filepath.Abs(f)
		calls = append(calls, call{filepath.Base(f), []string{"sheet", abs}})
	}
	calls = append(calls,
		call{"no job", []string{"sheet"}},
		call{"no such job", []string{"sheet", "no-such-file.yaml"}},
		call{"unknown flag", []string{"sheet", good, "--scale", "2"}},
	)
	for _, c := range calls {
		t.Run(c.name, func(t *testing.T) {
			out := filepath.Join(t.TempDir(), "out")
			r := gaugeline(t, ".", append(c.args, "-o", out)...)
			if r.code != 2 || !strings.HasPrefix(r.stderr, "gaugeline: error: ") {
				t.Errorf("exit %d, stderr %q; want 2 and a gaugeline: error: line", r.code, r.stderr)
			}
			if _, err := os.Stat(out); !os.IsNotExist(err) {
				t.Errorf("bad input created %s", out)
			}
		})
	}
	// -o naming a file, not a directory: an error, and the file untouched.
	file := filepath.Join(t.TempDir(), "file")
	os.WriteFile(file, []byte("x"), 0o644)
	if r := gaugeline(t, ".", "sheet", good, "-o", file); r.code != 2 || !strings.HasPrefix(r.stderr, "gaugeline: error: ") {
		t.Errorf("-o FILE: exit %d, stderr %q", r.code, r.stderr)
	}
	if data, _ := os.ReadFile(file); string(data) != "x" {
		t.Errorf("-o FILE changed the file")
	}
	// Without -o: a usage error.
	if r := gaugeline(t, t.TempDir(), "sheet", good); r.code != 2 || !strings.Contains(r.stderr, "-o DIR") {
		t.Errorf("no -o: exit %d, stderr %q", r.code, r.stderr)
	}
}

// A refused sheet names what fails: TE-9 breaks only the end distance of
// AISC 360-16 Table J3.4 (5/8 in < 1 in for a 3/4-in bolt), while its
// governing limit state passes and is named as such.
func TestSheetRefusalNamesWhatFails(t *testing.T) {
	job, _ := filepath.Abs(filepath.Join(testdata, "batch", "e-tight-edge.yaml"))
	r := gaugeline(t, ".", "sheet", job, "-o", t.TempDir())
	if r.code != 1 || !strings.Contains(r.stderr, "TE-9 fails edge.min;") ||
		!strings.Contains(r.stderr, "governing limit state bolts.group (J3.7, J3.11) passes") {
		t.Errorf("exit %d, stderr %q: want exit 1 naming edge.min as the failure", r.code, r.stderr)
	}
}

// The cut sheet and CAM files are of the whole member: without
// member.length, sheet is bad input (exit 2) that names the field, the
// file and the line of the member block, and writes nothing; check still
// runs.
func TestSheetNeedsMemberLength(t *testing.T) {
	src, err := os.ReadFile(filepath.Join(testdata, "jobs", "us-pipe-rack-brace.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	var kept []string
	memberLine := 0
	for _, l := range strings.Split(string(src), "\n") {
		if strings.HasPrefix(l, "  length:") {
			continue
		}
		if l == "member:" {
			memberLine = len(kept) + 1
		}
		kept = append(kept, l)
	}
	dir := t.TempDir()
	job := filepath.Join(dir, "no-length.yaml")
	if err := os.WriteFile(job, []byte(strings.Join(kept, "\n")), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "out")
	r := gaugeline(t, dir, "sheet", job, "-o", out)
	first := strings.SplitN(r.stderr, "\n", 2)[0]
	if want := fmt.Sprintf("gaugeline: error: %s:%d: member.length: ", job, memberLine); r.code != 2 || !strings.HasPrefix(first, want) {
		t.Errorf("exit %d, %q; want 2 and %q…", r.code, first, want)
	}
	if _, err := os.Stat(out); !os.IsNotExist(err) {
		t.Errorf("sheet wrote %s: %v", out, err)
	}
	if r := gaugeline(t, dir, "check", job); r.code != 0 {
		t.Errorf("check without member.length: exit %d %s", r.code, r.stderr)
	}
}
