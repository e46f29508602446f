package main

import (
	"bytes"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"gaugeline/fileset"
)

// r12Names are a mark's files with --dxf r12: the default set and, after
// each CAM file, its R12 variant.
func r12Names(mark string, parts ...string) []string {
	names := []string{mark + ".dxf"}
	for _, p := range parts {
		names = append(names, mark+"-"+p+".cam.dxf", mark+"-"+p+".cam.r12.dxf")
	}
	return names
}

// sheet --dxf r12 writes beside each CAM file its R12 variant, stamped
// like the rest of the set and listed in its manifest, so that audit
// finds the set whole; every other file is the bytes of a run without the
// flag. A --dxf value gaugeline does not write is bad input, nothing
// written.
func TestSheetDXFR12(t *testing.T) {
	job, _ := filepath.Abs(filepath.Join(testdata, "jobs", "si-slotted.yaml"))
	plain, r12 := t.TempDir(), t.TempDir()
	if r := gaugeline(t, ".", "sheet", job, "-o", plain); r.code != 0 {
		t.Fatalf("exit %d: %s", r.code, r.stderr)
	}
	r := gaugeline(t, ".", "sheet", job, "-o", r12, "--dxf", "r12")
	if r.code != 0 {
		t.Fatalf("--dxf r12: exit %d: %s", r.code, r.stderr)
	}
	names := r12Names("KB-40", "member", "plate")
	if got, want := outFiles(t, r12), setOf("KB-40", append(names, "KB-40.parts.csv")...); !slices.Equal(got, want) {
		t.Fatalf("wrote %v, want %v", got, want)
	}
	manifest, err := os.ReadFile(filepath.Join(r12, "KB-40", "KB-40"+fileset.ManifestExt))
	if err != nil {
		t.Fatal(err)
	}
	for _, n := range names {
		data, err := os.ReadFile(filepath.Join(r12, "KB-40", n))
		if err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(string(manifest), "  "+n+"\n") || !strings.Contains(r.stdout, n) {
			t.Errorf("%s: not in the manifest or on stdout", n)
		}
		if strings.HasSuffix(n, ".r12.dxf") {
			if !bytes.HasPrefix(data, []byte("999\n"+fileset.StampPrefix)) || !bytes.Contains(data, []byte("$ACADVER\n  1\nAC1009\n")) {
				t.Errorf("%s: not a stamped R12 file: %q", n, data[:min(len(data), 200)])
			}
			continue
		}
		old, _ := os.ReadFile(filepath.Join(plain, "KB-40", n))
		if !bytes.Equal(data, old) {
			t.Errorf("%s differs from the run without --dxf", n)
		}
	}
	if a := gaugeline(t, ".", "audit", r12); a.code != 0 {
		t.Errorf("audit: exit %d\n%s%s", a.code, a.stdout, a.stderr)
	}

	bad := filepath.Join(t.TempDir(), "bad")
	if r := gaugeline(t, ".", "sheet", job, "-o", bad, "--dxf", "r14"); r.code != 2 || !strings.Contains(r.stderr, `--dxf "r14"`) {
		t.Errorf("--dxf r14: exit %d, stderr %q", r.code, r.stderr)
	}
	if names := dirNames(t, bad); len(names) != 0 {
		t.Errorf("--dxf r14 wrote %v", names)
	}
}

// batch --sheets --dxf r12 gives every passing set its R12 files and the
// folder still audits whole; --dxf r12 without --sheets is bad input.
func TestBatchDXFR12(t *testing.T) {
	src, _ := filepath.Abs(filepath.Join(testdata, "batch"))
	out := filepath.Join(t.TempDir(), "out")
	if r := gaugeline(t, ".", "batch", src, "-o", out, "--sheets", "--dxf", "r12"); r.code != 2 {
		t.Fatalf("exit %d, want 2 (the folder has bad input); stderr:\n%s", r.code, r.stderr)
	}
	got := outFiles(t, out)
	for _, m := range []string{"KB-40", "RB-4", "TD-21.b"} {
		for _, n := range r12Names(m, "member", "plate") {
			if !slices.Contains(got, m+"/"+n) {
				t.Errorf("%s/%s missing from %v", m, n, got)
			}
		}
	}
	if a := gaugeline(t, ".", "audit", out); a.code != 0 {
		t.Errorf("audit: exit %d\n%s%s", a.code, a.stdout, a.stderr)
	}
	if r := gaugeline(t, ".", "batch", src, "-o", filepath.Join(t.TempDir(), "o"), "--dxf", "r12"); r.code != 2 ||
		!strings.Contains(r.stderr, "--sheets") {
		t.Errorf("--dxf r12 without --sheets: exit %d, stderr %q", r.code, r.stderr)
	}
}
