package main

import (
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// sheet --nc1 writes a DSTV NC1 file of each piece into the same file
// set; the manifest lists them and audit finds every file stamped and
// whole.
func TestSheetNC1(t *testing.T) {
	for _, tt := range []struct {
		job   string
		files []string
	}{
		{"jobs/us-brace-16ft.yaml", []string{"BR-16.dxf", "BR-16-member.cam.dxf", "BR-16-plate.cam.dxf",
			"BR-16-member.nc1", "BR-16-plate.nc1", "BR-16.parts.csv"}},
		{"jobs/si-double-angle.yaml", []string{"TD-21.b.dxf", "TD-21.b-member.cam.dxf", "TD-21.b-plate.cam.dxf",
			"TD-21.b-member.nc1", "TD-21.b-plate.nc1", "TD-21.b.parts.csv"}}, // a mirror far end: the opposite hand is the same piece
	} {
		t.Run(filepath.Base(tt.job), func(t *testing.T) {
			job, _ := filepath.Abs(filepath.Join(testdata, tt.job))
			out := t.TempDir()
			r := gaugeline(t, ".", "sheet", job, "-o", out, "--nc1")
			if r.code != 0 {
				t.Fatalf("exit %d; stderr %s", r.code, r.stderr)
			}
			mark := strings.TrimSuffix(tt.files[0], ".dxf")
			if got, want := outFiles(t, out), setOf(mark, tt.files...); !slices.Equal(got, want) {
				t.Fatalf("wrote %v, want %v", got, want)
			}
			if a := gaugeline(t, ".", "audit", out); a.code != 0 || !strings.Contains(a.stdout, "0 problem(s)") {
				t.Errorf("audit: exit %d, %s %s", a.code, a.stdout, a.stderr)
			}
		})
	}
}
