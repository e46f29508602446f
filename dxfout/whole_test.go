package dxfout

import (
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"testing"
)

// BR-16 (testdata/jobs/us-brace-16ft.yaml): an L4x4x1/2 16 ft long,
// far_end: mirror, (4) 7/8-in bolts at 3-in pitch, end 1-1/2 in, gage
// 2-1/2 in. Read by ezdxf, a reader independent of ours, the member's CAM
// file is one closed contour 192 in long (16 ft × 12 in/ft) by the 4-in
// leg, with the near end's holes at x = 1-1/2, 4-1/2, 7-1/2, 10-1/2 and the
// far end's at 192 − x = 190-1/2, 187-1/2, 184-1/2, 181-1/2, all on the
// gage line y = 2-1/2, each 15/16 in across (AISC 360-22 Table J3.3,
// standard hole for a 7/8-in bolt). Every number is the job file's or
// follows from it by the arithmetic shown.
func TestEzdxfWholeMember(t *testing.T) {
	haveEzdxf(t)
	_, s := sheetOf(t, "../testdata/jobs/us-brace-16ft.yaml")
	fs, err := Files(s)
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	var cam string
	for _, f := range fs {
		if f.Name == "BR-16-member.cam.dxf" {
			cam = filepath.Join(dir, f.Name)
			if err := os.WriteFile(cam, f.Data, 0o644); err != nil {
				t.Fatal(err)
			}
		}
	}
	if cam == "" {
		t.Fatalf("no BR-16-member.cam.dxf among %d files", len(fs))
	}
	out, err := exec.Command(python, "-c", readBack, cam).Output()
	if err != nil {
		t.Fatalf("ezdxf: %v", err)
	}
	var files []ezFile
	if err := json.Unmarshal(out, &files); err != nil || len(files) != 1 {
		t.Fatalf("ezdxf output: %v (%d files)", err, len(files))
	}
	f := files[0]
	if len(f.Errors) > 0 || len(f.Fixes) > 0 {
		t.Errorf("audit errors %q, fixes %q", f.Errors, f.Fixes)
	}
	var contours int
	var xs []float64
	for _, e := range f.Entities {
		switch {
		case e.Layer == "contour":
			contours++
			if e.Type != "LWPOLYLINE" || !e.Closed {
				t.Fatalf("contour is a %s, closed %v", e.Type, e.Closed)
			}
			lo, hi := [2]float64{math.Inf(1), math.Inf(1)}, [2]float64{math.Inf(-1), math.Inf(-1)}
			for _, p := range e.Points {
				lo = [2]float64{min(lo[0], p[0]), min(lo[1], p[1])}
				hi = [2]float64{max(hi[0], p[0]), max(hi[1], p[1])}
			}
			if math.Abs(lo[0]) > tol || math.Abs(hi[0]-192) > tol || math.Abs(lo[1]) > tol || math.Abs(hi[1]-4) > tol {
				t.Errorf("contour spans (%g, %g)–(%g, %g), want (0, 0)–(192, 4)", lo[0], lo[1], hi[0], hi[1])
			}
		case e.Layer == "holes":
			if e.Type != "CIRCLE" {
				t.Fatalf("a %s on the holes layer", e.Type)
			}
			if math.Abs(e.Y-2.5) > tol || math.Abs(2*e.R-15.0/16) > tol {
				t.Errorf("hole at (%g, %g) of diameter %g, want y = 2.5 and 15/16", e.X, e.Y, 2*e.R)
			}
			xs = append(xs, e.X)
		default:
			t.Errorf("a %s on layer %q", e.Type, e.Layer)
		}
	}
	if contours != 1 {
		t.Errorf("%d contours, want 1", contours)
	}
	slices.Sort(xs)
	want := []float64{1.5, 4.5, 7.5, 10.5, 181.5, 184.5, 187.5, 190.5}
	if len(xs) != len(want) {
		t.Fatalf("holes at x %v, want %v", xs, want)
	}
	for i := range want {
		if math.Abs(xs[i]-want[i]) > tol {
			t.Errorf("holes at x %v, want %v", xs, want)
			break
		}
	}
}
