package dxfout

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/spatial/r2"
	"pgregory.net/rapid"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/measured"
	"gaugeline/detail/qa"
	"gaugeline/detail/sheet"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Per-ply hole types survive the round trip job → sheet → CAM files →
// measured-DXF reader → reverify: each part's CAM file, read back and
// re-verified as that part, is accepted with every hole of the type the
// job gave that ply, and the other ply stays as designed.

// plyKind is a hole type and, for slots, its direction relative to the load.
type plyKind struct {
	t   rules.HoleType
	dir rules.SlotDir
}

func (k plyKind) keys() string {
	s := " hole: " + k.t.String()
	if k.t.IsSlot() {
		s += ", slot: " + k.dir.String()
	}
	return s
}

var plyKinds = []plyKind{
	{rules.Standard, rules.Transverse},
	{rules.Oversized, rules.Transverse},
	{rules.ShortSlot, rules.Transverse},
	{rules.ShortSlot, rules.Longitudinal},
	{rules.LongSlot, rules.Transverse},
	{rules.LongSlot, rules.Longitudinal},
}

// plyJobYAML is a slip-critical joint (where AISC 360-22 J3.3 permits
// every hole type in any direction) with the plies' own hole types: a US
// L5x5x1/2 at the 3-in gage on a 1/2-in gusset, or an SI double angle
// 2L100x75x8 either side of a 12-mm gusset. End and edge distances and the
// pitch leave room for the longest slots (Table J3.4 plus Table J3.5's
// 0.75d; 360-22 J3.4's clear distance ≥ d). Invented test jobs. The far end is
// plain, so the member's CAM file holds the one end's holes reverify matches.
func plyJobYAML(si bool, m, p plyKind, perLine int, pitch float64) string {
	if si {
		return fmt.Sprintf(`mark: RT-SI
units: si
load: {required: 100 kN}
member: {shape: double-angle, size: L100x75x8, grade: A572-50, length: 2.4 m, far_end: plain,%s}
plate: {thickness: 12 mm, grade: A36, width: 260 mm, edge: 45 mm,%s}
bolts: {diameter: M20, grade: A325M, joint: slip-critical, surface: B, per_line: %d, pitch: %g mm, end: 45 mm, gage: 55 mm}
`, m.keys(), p.keys(), perLine, pitch)
	}
	return fmt.Sprintf(`mark: RT-US
units: us
load: {required: 20 kip}
member: {shape: angle, size: L5x5x1/2, grade: A36, length: 8 ft, far_end: plain,%s}
plate: {thickness: 1/2 in, grade: A36, width: 12 in, edge: 2 in,%s}
bolts: {diameter: 3/4 in, grade: A325, joint: slip-critical, surface: B, per_line: %d, pitch: %g in, end: 2 in, gage: 3 in}
`, m.keys(), p.keys(), perLine, pitch)
}

// tb is what the helpers need of a *testing.T or a *rapid.T.
type tb interface {
	Helper()
	Fatal(args ...any)
	Fatalf(format string, args ...any)
	Errorf(format string, args ...any)
}

// camFiles checks the job, which must pass, and returns its design and the
// CAM files by part name.
func camFiles(t tb, src string) (*detail.Design, map[string][]byte) {
	t.Helper()
	j, err := jobfile.ParseJob("roundtrip.yaml", []byte(src))
	if err != nil {
		t.Fatalf("%v\n%s", err, src)
	}
	d, err := detail.Build(j)
	if err != nil {
		t.Fatalf("%v\n%s", err, src)
	}
	r, err := detail.Check(d)
	if err != nil {
		t.Fatal(err)
	}
	if !r.Pass {
		t.Fatalf("the test job fails %v:\n%s", r.Failing(), src)
	}
	s, err := sheet.NewSheet(r, false)
	if err != nil {
		t.Fatal(err)
	}
	fs, err := Files(s)
	if err != nil {
		t.Fatal(err)
	}
	out := map[string][]byte{}
	for _, f := range fs {
		if part, ok := strings.CutSuffix(strings.TrimPrefix(f.Name, s.Mark+"-"), ".cam.dxf"); ok {
			out[part] = f.Data
		}
	}
	if len(out) != 2 {
		t.Fatalf("CAM files %v, want member and plate", fs)
	}
	return d, out
}

// checkRoundTrip re-verifies set as part and checks the verdict and both
// plies of every as-built hole.
func checkRoundTrip(t tb, d *detail.Design, set *measured.Set, part qa.MeasuredPart, align qa.AlignMode, m, p plyKind) {
	t.Helper()
	ab, err := qa.Reverify(d, set, qa.ReverifyOptions{Part: part, Align: align})
	if err != nil {
		t.Fatal(err)
	}
	if ab.Verdict != qa.Accept || ab.Part != part {
		t.Fatalf("%s (%s): verdict %s, reasons %q", part, align, ab.Verdict, ab.Reasons)
	}
	measuredKind, other := m, p
	if part == qa.MeasuredPlate {
		measuredKind, other = p, m
	}
	for _, dv := range ab.Deviations {
		got := plyKind{dv.AsBuilt.Type, dv.AsBuilt.Slot}
		if !got.t.IsSlot() {
			got.dir = rules.Transverse
		}
		if dv.Status != qa.HoleOK || dv.Reclassified || got != measuredKind {
			t.Errorf("%s %s: %s, %s %s (reclassified %v), want ok and %s %s; %q", part, dv.ID, dv.Status, got.t, got.dir,
				dv.Reclassified, measuredKind.t, measuredKind.dir, dv.Why)
		}
	}
	for i := range ab.Report.Design.Conn.Holes {
		h := &ab.Report.Design.Conn.Holes[i]
		des := &d.Conn.Holes[i]
		otherShape, want := h.InPlate(), des.InPlate()
		if part == qa.MeasuredPlate {
			otherShape, want = h.HoleShape, des.HoleShape
		}
		if otherShape != want || (plyKind{otherShape.Type, otherShape.Slot}) != other {
			t.Errorf("%s measured, %s: the other ply is %+v as built, want as designed %+v", part, h.ID, otherShape, want)
		}
	}
}

// TestPerPlyRoundTrip: generated per-ply combinations (not long slots in
// both plies, which J3.3 forbids), pattern and alignment; each CAM file
// read back by the project's measured-DXF reader.
func TestPerPlyRoundTrip(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		si := rapid.Bool().Draw(rt, "si")
		m := rapid.SampledFrom(plyKinds).Draw(rt, "member")
		p := rapid.SampledFrom(plyKinds).Draw(rt, "plate")
		if m.t == rules.LongSlot && p.t == rules.LongSlot {
			p = plyKinds[rapid.IntRange(0, 3).Draw(rt, "plateNotLong")]
		}
		perLine := rapid.IntRange(2, 4).Draw(rt, "perLine")
		pitch := rapid.SampledFrom([]float64{3, 3.5, 4}).Draw(rt, "pitchIn")
		if si {
			pitch = rapid.SampledFrom([]float64{75, 90, 100}).Draw(rt, "pitchMm")
		}
		d, cams := camFiles(rt, plyJobYAML(si, m, p, perLine, pitch))
		def := measured.Inches
		if si {
			def = measured.Millimetres
		}
		for _, part := range []qa.MeasuredPart{qa.MeasuredMember, qa.MeasuredPlate} {
			set, err := measured.ReadDXF(bytes.NewReader(cams[part.String()]), part.String()+".cam.dxf", def, "")
			if err != nil {
				rt.Fatal(err)
			}
			align := qa.AlignDatum
			if rapid.Bool().Draw(rt, "bestFit") {
				// A part lying anywhere on the scanner's table.
				align = qa.AlignBestFit
				moveSet(set, rapid.Float64Range(-math.Pi, math.Pi).Draw(rt, "turn"),
					rapid.Float64Range(-500, 500).Draw(rt, "tx"), rapid.Float64Range(-500, 500).Draw(rt, "ty"))
			}
			checkRoundTrip(rt, d, set, part, align, m, p)
		}
	})
}

// moveSet moves a measured set by the rigid motion q = R(θ)·p + t (mm).
func moveSet(s *measured.Set, theta, tx, ty float64) {
	c, sn := math.Cos(theta), math.Sin(theta)
	mv := func(x, y float64) (float64, float64) { return c*x - sn*y + tx, sn*x + c*y + ty }
	for i := range s.Holes {
		h := &s.Holes[i]
		h.X, h.Y = mv(h.X, h.Y)
		h.Axis += theta
	}
	for i := range s.Contour {
		s.Contour[i].X, s.Contour[i].Y = mv(s.Contour[i].X, s.Contour[i].Y)
	}
}

// ezdxfHoles reads holes and the largest closed contour of each DXF with
// ezdxf: CIRCLEs, and closed LWPOLYLINEs of four vertices with bulges
// 0, 1, 0, 1 (two straight sides, two half circles: a slot), in the
// drawing's units.
const ezdxfHoles = `
import json, math, sys
import ezdxf
out = []
for path in sys.argv[1:]:
    doc = ezdxf.readfile(path)
    holes, contour, best = [], [], 0.0
    for e in doc.modelspace():
        if e.dxftype() == "CIRCLE":
            holes.append({"x": e.dxf.center.x, "y": e.dxf.center.y, "width": 2 * e.dxf.radius, "length": 2 * e.dxf.radius})
        elif e.dxftype() == "LWPOLYLINE" and e.closed:
            pts = [(p[0], p[1], p[4]) for p in e.get_points("xyseb")]
            if len(pts) == 4 and [b for _, _, b in pts] == [0, 1, 0, 1]:
                (x0, y0, _), (x1, y1, _), (x2, y2, _), _ = pts
                w = math.hypot(x2 - x1, y2 - y1)
                holes.append({"x": sum(p[0] for p in pts) / 4, "y": sum(p[1] for p in pts) / 4, "width": w,
                              "length": math.hypot(x1 - x0, y1 - y0) + w, "axis": math.atan2(y1 - y0, x1 - x0), "slot": True})
            elif all(b == 0 for _, _, b in pts):
                a = abs(sum(pts[i][0] * pts[i - 1][1] - pts[i - 1][0] * pts[i][1] for i in range(len(pts)))) / 2
                if a > best:
                    best, contour = a, [[x, y] for x, y, _ in pts]
    out.append({"insunits": doc.header.get("$INSUNITS"), "holes": holes, "contour": contour})
json.dump(out, sys.stdout)
`

// TestPerPlyRoundTripEzdxf: every per-ply combination J3.3 permits in both
// unit systems, the CAM files read back by Debian's python3-ezdxf, an
// independent reader, and re-verified as each part.
func TestPerPlyRoundTripEzdxf(t *testing.T) {
	haveEzdxf(t)
	dir := t.TempDir()
	type file struct {
		d    *detail.Design
		part qa.MeasuredPart
		m, p plyKind
		path string
	}
	var files []file
	for _, si := range []bool{false, true} {
		for _, m := range plyKinds {
			for _, p := range plyKinds {
				if m.t == rules.LongSlot && p.t == rules.LongSlot {
					continue
				}
				d, cams := camFiles(t, plyJobYAML(si, m, p, 3, map[bool]float64{false: 3.5, true: 90}[si]))
				for _, part := range []qa.MeasuredPart{qa.MeasuredMember, qa.MeasuredPlate} {
					path := filepath.Join(dir, fmt.Sprintf("%d-%s.cam.dxf", len(files), part))
					if err := os.WriteFile(path, cams[part.String()], 0o644); err != nil {
						t.Fatal(err)
					}
					files = append(files, file{d, part, m, p, path})
				}
			}
		}
	}
	args := []string{"-c", ezdxfHoles}
	for _, f := range files {
		args = append(args, f.path)
	}
	cmd := exec.Command(python, args...)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	b, err := cmd.Output()
	if err != nil {
		t.Fatalf("ezdxf: %v\n%s", err, stderr.String())
	}
	var read []struct {
		Insunits int `json:"insunits"`
		Holes    []struct {
			X, Y, Width, Length, Axis float64
			Slot                      bool
		} `json:"holes"`
		Contour [][2]float64 `json:"contour"`
	}
	if err := json.Unmarshal(b, &read); err != nil || len(read) != len(files) {
		t.Fatalf("ezdxf output: %v (%d files, want %d)", err, len(read), len(files))
	}
	for i, f := range files {
		r := read[i]
		// $INSUNITS 1 inches, 4 millimetres (DXF reference); 1 in = 25.4 mm.
		k := map[int]float64{1: 25.4, 4: 1}[r.Insunits]
		sys := f.d.Job.Units
		if k == 0 || (k == 1) != (sys == units.SI) {
			t.Fatalf("%s: $INSUNITS %d for a %s job", f.path, r.Insunits, sys)
		}
		set := &measured.Set{File: filepath.Base(f.path), Format: "dxf", Units: "read by ezdxf"}
		for n, h := range r.Holes {
			set.Holes = append(set.Holes, measured.Hole{ID: fmt.Sprintf("E%d", n+1), X: h.X * k, Y: h.Y * k,
				Width: h.Width * k, Length: h.Length * k, Axis: h.Axis, Slot: h.Slot})
		}
		for _, q := range r.Contour {
			set.Contour = append(set.Contour, r2.Vec{X: q[0] * k, Y: q[1] * k})
		}
		if len(set.Holes) != len(f.d.Conn.Holes) || len(set.Contour) == 0 {
			t.Fatalf("%s: ezdxf read %d holes and a contour of %d points, want %d holes", f.path, len(set.Holes), len(set.Contour), len(f.d.Conn.Holes))
		}
		t.Run(fmt.Sprintf("%s %s member %s %s plate %s %s", sys, f.part, f.m.t, f.m.dir, f.p.t, f.p.dir), func(t *testing.T) {
			checkRoundTrip(t, f.d, set, f.part, qa.AlignDatum, f.m, f.p)
		})
	}
}
