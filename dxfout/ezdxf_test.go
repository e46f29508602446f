package dxfout

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r2"
)

// python is Debian's interpreter, where python3-ezdxf installs; not
// whatever python3 is first on PATH.
const python = "/usr/bin/python3"

// readBack loads each file with ezdxf, audits it and reports what a reader
// independent of ours sees.
const readBack = `
import json, sys
import ezdxf
from ezdxf import bbox
out = []
for path in sys.argv[1:]:
    doc = ezdxf.readfile(path)
    auditor = doc.audit()
    msp = doc.modelspace()
    ents = []
    for e in msp:
        d = {"type": e.dxftype(), "layer": e.dxf.layer}
        if e.dxftype() == "CIRCLE":
            d["x"], d["y"], d["r"] = e.dxf.center.x, e.dxf.center.y, e.dxf.radius
        elif e.dxftype() == "LWPOLYLINE":
            d["closed"] = bool(e.closed)
            d["points"] = [[p[0], p[1], p[4]] for p in e.get_points("xyseb")]
        elif e.dxftype() == "POLYLINE":
            d["closed"] = bool(e.is_closed)
            d["points"] = [[v.dxf.location.x, v.dxf.location.y, v.dxf.bulge] for v in e.vertices]
        elif e.dxftype() == "TEXT":
            d["text"] = e.dxf.text
        ents.append(d)
    # Text extents depend on the font metrics ezdxf finds (matplotlib's, or
    # a rough fallback without it); everything else is exact geometry.
    box = bbox.extents(msp)
    geom = bbox.extents(e for e in msp if e.dxftype() not in ("TEXT", "MTEXT"))
    out.append({
        "path": path,
        "version": doc.dxfversion,
        "errors": [str(x.message) for x in auditor.errors],
        "fixes": [str(x.message) for x in auditor.fixes],
        "insunits": doc.header.get("$INSUNITS"),
        "measurement": doc.header.get("$MEASUREMENT"),
        "extmin": list(doc.header.get("$EXTMIN"))[:2],
        "extmax": list(doc.header.get("$EXTMAX"))[:2],
        "bbox": [box.extmin.x, box.extmin.y, box.extmax.x, box.extmax.y],
        "geometry": [geom.extmin.x, geom.extmin.y, geom.extmax.x, geom.extmax.y],
        "entities": ents,
    })
json.dump(out, sys.stdout)
`

type ezFile struct {
	Path        string     `json:"path"`
	Version     string     `json:"version"`
	Errors      []string   `json:"errors"`
	Fixes       []string   `json:"fixes"`
	Insunits    int        `json:"insunits"`
	Measurement int        `json:"measurement"`
	Extmin      [2]float64 `json:"extmin"`
	Extmax      [2]float64 `json:"extmax"`
	Bbox        [4]float64 `json:"bbox"`     // everything, text included
	Geometry    [4]float64 `json:"geometry"` // everything but TEXT and MTEXT
	Entities    []struct {
		Type   string       `json:"type"`
		Layer  string       `json:"layer"`
		X      float64      `json:"x"`
		Y      float64      `json:"y"`
		R      float64      `json:"r"`
		Closed bool         `json:"closed"`
		Points [][3]float64 `json:"points"`
		Text   string       `json:"text"`
	} `json:"entities"`
}

// matplotlibMissing says why python cannot import matplotlib and what to
// install, "" when it can. ezdxf draws with it and measures text with its
// font metrics; without it ezdxf 0.18 estimates text extents with a rough
// fallback font that disagrees with ours.
func matplotlibMissing() string {
	if err := exec.Command(python, "-c", "import matplotlib").Run(); err != nil {
		return fmt.Sprintf("%s cannot import matplotlib (%v); install Debian's python3-matplotlib "+
			"(apt-get install -y python3-matplotlib)", python, err)
	}
	return ""
}

func haveEzdxf(t *testing.T) {
	t.Helper()
	if err := exec.Command(python, "-c", "import ezdxf").Run(); err != nil {
		t.Skipf("skipping the independent read-back: %s cannot import ezdxf (%v); "+
			"install Debian's python3-ezdxf (apt-get install -y python3-ezdxf) to run it", python, err)
	}
}

// Every sheet and CAM file passes ezdxf's audit with nothing to fix and reads
// back, through ezdxf, to the job's holes within 1e-6 with the right
// $INSUNITS; a CAM file holds only the contour and the holes; the header
// extents hold ezdxf's own bounding box of the geometry exactly and, where
// matplotlib gives ezdxf real font metrics, of the text within a text
// height.
func TestEzdxfReadsBack(t *testing.T) {
	haveEzdxf(t)
	dir := t.TempDir()
	type expect struct {
		cam     bool
		sys     int
		holes   []wantHole
		contour [][2]float64 // a plate outline's corners in the plate's frame (jobOutline), nil: not checked
	}
	want := map[string]expect{}
	var paths []string
	for _, job := range jobs {
		r, s := sheetOf(t, job)
		b, err := Sheet(s)
		if err != nil {
			t.Fatal(err)
		}
		ins, _ := wantUnits(s.Units)
		var sheetHoles []wantHole
		write := func(name string, data []byte, e expect) {
			p := filepath.Join(dir, name)
			if err := os.WriteFile(p, data, 0o644); err != nil {
				t.Fatal(err)
			}
			paths = append(paths, p)
			want[p] = e
		}
		for vi, v := range s.Views {
			cb, err := CAM(&v.Part, s.Units)
			if err != nil {
				t.Fatal(err)
			}
			hs := jobHoles(r, vi == 1)
			write(s.Mark+"-"+v.Part.Name+".cam.dxf", cb, expect{cam: true, sys: int(ins), holes: hs, contour: jobOutline(r, vi == 1)})
			for _, h := range hs {
				q := v.Fold(r2.Vec{X: h.x, Y: h.y}) // where a break puts it
				h.x, h.y = q.X+v.Origin.X, q.Y+v.Origin.Y
				sheetHoles = append(sheetHoles, h)
			}
		}
		write(s.Mark+".dxf", b, expect{sys: int(ins), holes: sheetHoles})
	}
	out, err := exec.Command(python, append([]string{"-c", readBack}, paths...)...).Output()
	if err != nil {
		if ee, ok := err.(*exec.ExitError); ok {
			t.Fatalf("ezdxf: %v\n%s", err, ee.Stderr)
		}
		t.Fatal(err)
	}
	var files []ezFile
	if err := json.Unmarshal(out, &files); err != nil {
		t.Fatal(err)
	}
	if len(files) != len(paths) {
		t.Fatalf("ezdxf read %d files of %d", len(files), len(paths))
	}
	for _, f := range files {
		w := want[f.Path]
		name := filepath.Base(f.Path)
		if len(f.Errors) > 0 || len(f.Fixes) > 0 {
			t.Errorf("%s: audit errors %q, fixes %q", name, f.Errors, f.Fixes)
		}
		if f.Insunits != w.sys || f.Measurement != map[int]int{1: 0, 4: 1}[w.sys] {
			t.Errorf("%s: $INSUNITS %d $MEASUREMENT %d", name, f.Insunits, f.Measurement)
		}
		// The geometry (contours, holes, dimension and reference lines,
		// arrowheads) lies inside the header extents, exactly.
		if outside(f.Geometry, f.Extmin, f.Extmax, 1e-6) {
			t.Errorf("%s: ezdxf's bounding box of the geometry %v lies outside $EXTMIN %v $EXTMAX %v", name, f.Geometry, f.Extmin, f.Extmax)
		}
		var holes []wantHole
		for _, e := range f.Entities {
			if w.cam && e.Layer != "contour" && e.Layer != "holes" {
				t.Errorf("%s: a %s on layer %q", name, e.Type, e.Layer)
			}
			if w.cam && e.Layer == "contour" && (e.Type != "LWPOLYLINE" || !e.Closed) {
				t.Errorf("%s: contour is a %s, closed %v", name, e.Type, e.Closed)
			}
			if w.cam && e.Layer == "contour" && w.contour != nil {
				// The plate's CAM contour is the job's outline, corner by corner.
				if len(e.Points) != len(w.contour) {
					t.Errorf("%s: contour of %d corners, the outline has %d", name, len(e.Points), len(w.contour))
				}
				for k := range min(len(e.Points), len(w.contour)) {
					if p, q := e.Points[k], w.contour[k]; math.Abs(p[0]-q[0]) > tol || math.Abs(p[1]-q[1]) > tol {
						t.Errorf("%s: contour corner %d at (%v, %v), the outline's at %v", name, k, p[0], p[1], q)
					}
				}
			}
			if e.Layer != "holes" {
				continue
			}
			h, err := ezHole(e.Type, e.X, e.Y, e.R, e.Points, e.Closed)
			if err != nil {
				t.Fatalf("%s: %v", name, err)
			}
			holes = append(holes, h)
		}
		sameHoles(t, name, holes, w.holes)
	}
	// Text: ezdxf measures it with matplotlib's font metrics; allow it a
	// text height's slack (1/4 in, 6 mm) past our estimate. A CAM file
	// has no text, so its whole box stays exact.
	t.Run("text extents", func(t *testing.T) {
		if why := matplotlibMissing(); why != "" {
			t.Skip("skipping the bounding box of text, which ezdxf measures with matplotlib's font metrics: " + why)
		}
		for _, f := range files {
			w := want[f.Path]
			slack := map[int]float64{1: 0.25, 4: 6}[w.sys]
			if w.cam {
				slack = 1e-6
			}
			if outside(f.Bbox, f.Extmin, f.Extmax, slack) {
				t.Errorf("%s: ezdxf's bounding box %v lies outside $EXTMIN %v $EXTMAX %v", filepath.Base(f.Path), f.Bbox, f.Extmin, f.Extmax)
			}
		}
	})
}

// ezHole is the hole an entity of ezdxf's on layer holes draws: a CIRCLE
// (centre x, y, radius r), or a slot as a closed polyline (LWPOLYLINE,
// or R12's POLYLINE) of four points, two straight sides and two ends.
func ezHole(kind string, x, y, r float64, p [][3]float64, closed bool) (wantHole, error) {
	switch kind {
	case "CIRCLE":
		return wantHole{x: x, y: y, width: 2 * r}, nil
	case "LWPOLYLINE", "POLYLINE":
		if len(p) != 4 || !closed {
			return wantHole{}, fmt.Errorf("slot of %d points, closed %v", len(p), closed)
		}
		side := math.Hypot(p[1][0]-p[0][0], p[1][1]-p[0][1])
		width := math.Hypot(p[2][0]-p[1][0], p[2][1]-p[1][1])
		return wantHole{x: (p[0][0] + p[2][0]) / 2, y: (p[0][1] + p[2][1]) / 2,
			width: width, length: side + width, alongY: p[1][0] == p[0][0]}, nil
	}
	return wantHole{}, fmt.Errorf("a %s on the holes layer", kind)
}

// outside reports whether box (xmin, ymin, xmax, ymax) reaches more than
// slack past the extents.
func outside(box [4]float64, extmin, extmax [2]float64, slack float64) bool {
	return box[0] < extmin[0]-slack || box[1] < extmin[1]-slack || box[2] > extmax[0]+slack || box[3] > extmax[1]+slack
}

// ezdxf's renderer draws a sheet without complaint (it fails on malformed
// TEXT): a smoke test, skipped without python3-matplotlib.
func TestEzdxfDraws(t *testing.T) {
	haveEzdxf(t)
	if why := matplotlibMissing(); why != "" {
		t.Skip("skipping the render: " + why)
	}
	_, s := sheetOf(t, "../testdata/jobs/si-slotted.yaml")
	b, err := Sheet(s)
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	in, out := filepath.Join(dir, "KB-40.dxf"), filepath.Join(dir, "KB-40.png")
	if err := os.WriteFile(in, b, 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(python, "-m", "ezdxf", "draw", in, "-o", out, "--dpi", "50")
	cmd.Env = append(os.Environ(), "MPLBACKEND=Agg", "MPLCONFIGDIR="+dir)
	if msg, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("ezdxf draw: %v\n%s", err, lastLines(string(msg), 10))
	}
	if st, err := os.Stat(out); err != nil || st.Size() == 0 {
		t.Fatalf("no PNG: %v", err)
	}
}

func lastLines(s string, n int) string {
	lines := strings.Split(strings.TrimSpace(s), "\n")
	return strings.Join(lines[max(0, len(lines)-n):], "\n")
}
