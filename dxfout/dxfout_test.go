package dxfout

import (
	"bytes"
	"fmt"
	"math"
	"path/filepath"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/sheet"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// jobs are the job files drawn: a US angle, a US two-line staggered flat,
// an SI double angle, an SI slotted angle, the demo, a gusset with a
// clipped outline, a double-plate splice of two flats, AISC Design Example
// D.2 (no plate) and the inline jobs below, so that every hole type and
// slot direction is drawn.
var jobs = []string{
	"../testdata/jobs/us-single-angle.yaml",
	"../testdata/jobs/us-staggered-flat.yaml",
	"../testdata/jobs/si-double-angle.yaml",
	"../testdata/jobs/si-slotted.yaml",
	"../testdata/jobs/us-pipe-rack-brace.yaml",
	"../testdata/jobs/us-clipped-gusset.yaml",
	"../testdata/jobs/us-double-splice.yaml",
	"../testdata/examples/aisc-d2.yaml",
	"inline:long-slot.yaml",
	"inline:oversized.yaml",
}

// inlineJobs are jobs of our own for the hole types the job files lack:
// long slots along the load in the member with standard holes in the plate
// (US; AISC 360-22 J3.3 permits long slots in one ply of a faying surface)
// and oversized holes in one row (SI).
var inlineJobs = map[string]string{
	"long-slot.yaml": `
mark: LS-1
units: us
load: {required: 40 kip}
member: {shape: angle, size: L4x4x1/2, grade: A36, length: 8 ft}
plate: {thickness: 1/2 in, grade: A36, width: 8 in, edge: 2 in, hole: standard}
bolts: {diameter: 3/4 in, grade: A325, joint: slip-critical, hole: long-slot, slot: longitudinal,
        per_line: 2, pitch: 4 in, end: 2 in, gage: 2-1/2 in}
`,
	"oversized.yaml": `
mark: OV-1
units: si
load: {required: 100 kN}
member: {shape: flat, width: 150 mm, thickness: 12 mm, grade: A36, length: 2.4 m}
plate: {thickness: 12 mm, grade: A36, width: 150 mm, edge: 40 mm}
bolts: {diameter: M20, grade: A325M, joint: slip-critical, hole: oversized,
        lines: 2, per_line: 1, end: 40 mm, gage: 40 mm, gage2: 70 mm}
`,
}

// loadJob reads a job file, or an inline job named "inline:NAME".
func loadJob(path string) (*jobfile.Job, error) {
	if name, ok := strings.CutPrefix(path, "inline:"); ok {
		return jobfile.ParseJob(name, []byte(inlineJobs[name]))
	}
	return jobfile.LoadJob(path)
}

// tol is SPEC §7's read-back tolerance, in the job's units.
const tol = 1e-6

func checked(t testing.TB, path string) *detail.Report {
	t.Helper()
	j, err := loadJob(path)
	if err != nil {
		t.Fatal(err)
	}
	r, err := detail.CheckJob(j) // both ends
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// sheetOf lays out the job's sheet, stamped when the connection fails.
func sheetOf(t testing.TB, path string) (*detail.Report, *sheet.Sheet) {
	t.Helper()
	r := checked(t, path)
	s, err := sheet.NewSheet(r, !r.Pass)
	if err != nil {
		t.Fatal(err)
	}
	return r, s
}

// wantHole is a hole as the job puts it, in the job's units.
type wantHole struct {
	x, y, width, length float64 // length: a slot's, along its long axis; 0 round
	alongY              bool
}

// jobHoles returns the design's holes in the job's units: the member's ply
// in the member's frame, or the plate's ply in the plate's frame (x' =
// FreeEdge − x, y' = YMax − y, see sheet.Sheet), computed here from the
// engine's model.
func jobHoles(r *detail.Report, plate bool) []wantHole {
	c := &r.Design.Conn
	sys := r.Design.Job.Units
	in := func(l units.Length) float64 { return sys.ToJob(float64(l), units.DimLength) }
	var out []wantHole
	for i := range c.Holes {
		h := &c.Holes[i]
		s := h.HoleShape
		if plate {
			s = h.InPlate()
		}
		w := wantHole{x: in(h.X), y: in(h.Y), width: in(min(s.Dx, s.Dy))}
		if s.Type.IsSlot() {
			w.length, w.alongY = in(max(s.Dx, s.Dy)), s.Dy > s.Dx
		}
		if plate {
			w.x, w.y = in(c.Plate.FreeEdge-h.X), in(c.Plate.YMax()-h.Y)
		}
		out = append(out, w)
	}
	// The member is whole: its far end's holes mirror these about
	// mid-length (x' = member.length − x; the jobs' far_end is mirror).
	if L := r.Design.Job.Member.Length; !plate && L > 0 {
		for _, w := range out[:len(c.Holes)] {
			w.x = in(L) - w.x
			out = append(out, w)
		}
	}
	if plate && c.Plate.Kind == engine.Splice {
		// A splice plate carries member B's group too: each hole mirrored
		// about the joint (x = −gap − x), so x' = FreeEdge + gap + x.
		for i := range c.Holes {
			w := out[i]
			w.x = in(c.Plate.FreeEdge + c.Plate.Gap + c.Holes[i].X)
			out = append(out, w)
		}
	}
	return out
}

// gotHole reads a hole back from a CIRCLE or a slot's LWPOLYLINE: the
// centre of its box, its width and length.
func gotHole(t *testing.T, e ent) wantHole {
	t.Helper()
	switch e.kind {
	case "CIRCLE":
		return wantHole{x: e.float(10), y: e.float(20), width: 2 * e.float(40)}
	case "LWPOLYLINE":
		pts, bulges := e.vertices()
		if len(pts) != 4 || e.float(70) != 1 {
			t.Fatalf("slot of %d vertices, flag %v", len(pts), e.float(70))
		}
		// Straight sides between vertices 0–1 and 2–3, half circles 1–2 and 3–0.
		if bulges[0] != 0 || bulges[1] != 1 || bulges[2] != 0 || bulges[3] != 1 {
			t.Fatalf("slot bulges %v", bulges)
		}
		cx := (pts[0][0] + pts[1][0] + pts[2][0] + pts[3][0]) / 4
		cy := (pts[0][1] + pts[1][1] + pts[2][1] + pts[3][1]) / 4
		side := math.Hypot(pts[1][0]-pts[0][0], pts[1][1]-pts[0][1])
		width := math.Hypot(pts[2][0]-pts[1][0], pts[2][1]-pts[1][1])
		alongY := pts[1][0] == pts[0][0]
		return wantHole{x: cx, y: cy, width: width, length: side + width, alongY: alongY}
	}
	t.Fatalf("a %s on the holes layer", e.kind)
	return wantHole{}
}

func sameHoles(t *testing.T, what string, got, want []wantHole) {
	t.Helper()
	if len(got) != len(want) {
		t.Fatalf("%s: %d holes, want %d", what, len(got), len(want))
	}
	for i := range want {
		g, w := got[i], want[i]
		if math.Abs(g.x-w.x) > tol || math.Abs(g.y-w.y) > tol || math.Abs(g.width-w.width) > tol ||
			math.Abs(g.length-w.length) > tol || g.alongY != w.alongY {
			t.Errorf("%s hole %d: %+v, want %+v", what, i+1, g, w)
		}
	}
}

func wantUnits(sys units.System) (insunits, measurement float64) {
	if sys == units.SI {
		return 4, 1
	}
	return 1, 0
}

// checkHeader checks $INSUNITS, $MEASUREMENT and that every point read
// lies within $EXTMIN/$EXTMAX, which are no larger than the drawing needs
// plus text.
func checkHeader(t *testing.T, f *dxfFile, sys units.System) {
	t.Helper()
	iu, _ := f.headerFloat("$INSUNITS", 70)
	m, _ := f.headerFloat("$MEASUREMENT", 70)
	if wi, wm := wantUnits(sys); iu != wi || m != wm {
		t.Errorf("$INSUNITS %v $MEASUREMENT %v, want %v %v", iu, m, wi, wm)
	}
	x0, _ := f.headerFloat("$EXTMIN", 10)
	y0, _ := f.headerFloat("$EXTMIN", 20)
	x1, _ := f.headerFloat("$EXTMAX", 10)
	y1, _ := f.headerFloat("$EXTMAX", 20)
	inside := func(x, y float64) bool { return x >= x0-tol && x <= x1+tol && y >= y0-tol && y <= y1+tol }
	for _, e := range f.entities {
		pts, _ := e.vertices()
		if e.kind == "CIRCLE" {
			r := e.float(40)
			pts = [][2]float64{{e.float(10) - r, e.float(20) - r}, {e.float(10) + r, e.float(20) + r}}
		}
		if e.kind == "LINE" {
			pts = append(pts, [2]float64{e.float(11), e.float(21)})
		}
		for _, p := range pts {
			if !inside(p[0], p[1]) {
				t.Errorf("%s on %s at %v outside the extents (%v,%v)-(%v,%v)", e.kind, e.layer, p, x0, y0, x1, y1)
			}
		}
	}
}

// jobOutline is the job's plate.outline (clips cut) in the plate's frame
// (x' = greatest x − x, y' = greatest y − y: the half turn about the
// corner of its extents), in the job's units; nil for the member or a
// rectangle.
func jobOutline(r *detail.Report, plate bool) [][2]float64 {
	j := r.Design.Job
	if pl := r.Design.Conn.Plate; plate && pl != nil && pl.Kind == engine.Splice {
		// The splice plate: the rectangle from its end past member A's group
		// to its end past B's, 2·(last bolt + edge) + gap long.
		l, w := j.Units.ToJob(float64(2*pl.FreeEdge+pl.Gap), units.DimLength), j.Units.ToJob(float64(pl.Width), units.DimLength)
		return [][2]float64{{0, 0}, {l, 0}, {l, w}, {0, w}}
	}
	if !plate || j.Plate == nil || j.Plate.Outline == nil {
		return nil
	}
	fe, ymax := math.Inf(-1), math.Inf(-1)
	for _, q := range j.Plate.Outline {
		fe, ymax = max(fe, q.X), max(ymax, q.Y)
	}
	var out [][2]float64
	for _, q := range j.Plate.Outline {
		out = append(out, [2]float64{j.Units.ToJob(fe-q.X, units.DimLength), j.Units.ToJob(ymax-q.Y, units.DimLength)})
	}
	return out
}

// The CAM file of each part reads back to the job's holes (centres,
// diameters, slot lengths within 1e-6), with a closed outline and nothing
// but the contour and the holes.
func TestCAMReadsBackToTheJob(t *testing.T) {
	for _, path := range jobs {
		t.Run(filepath.Base(path), func(t *testing.T) {
			r, s := sheetOf(t, path)
			for vi, v := range s.Views {
				b, err := CAM(&v.Part, s.Units)
				if err != nil {
					t.Fatal(err)
				}
				f, err := readDXF(b)
				if err != nil {
					t.Fatal(err)
				}
				checkHeader(t, f, s.Units)
				var holes []wantHole
				contours := 0
				for _, e := range f.entities {
					switch e.layer {
					case "contour":
						pts, bulges := e.vertices()
						want := jobOutline(r, vi == 1)
						if e.kind != "LWPOLYLINE" || e.float(70) != 1 || len(pts) != max(len(want), 4) {
							t.Errorf("contour: %s flag %v with %d vertices", e.kind, e.float(70), len(pts))
						}
						for k := range min(len(want), len(pts)) {
							if math.Abs(pts[k][0]-want[k][0]) > tol || math.Abs(pts[k][1]-want[k][1]) > tol {
								t.Errorf("contour vertex %d at %v, want the job's outline point %v", k, pts[k], want[k])
							}
						}
						for _, b := range bulges {
							if b != 0 {
								t.Errorf("contour bulge %v", b)
							}
						}
						contours++
					case "holes":
						holes = append(holes, gotHole(t, e))
					default:
						t.Errorf("a %s on layer %q in a CAM file", e.kind, e.layer)
					}
				}
				if contours != 1 {
					t.Errorf("%d contours", contours)
				}
				sameHoles(t, v.Part.Name, holes, jobHoles(r, vi == 1))
			}
		})
	}
}

// The cut sheet holds the same holes, each view moved to its place; text
// only in the alignments readers agree on.
func TestSheetReadsBack(t *testing.T) {
	for _, path := range jobs {
		t.Run(filepath.Base(path), func(t *testing.T) {
			r, s := sheetOf(t, path)
			b, err := Sheet(s)
			if err != nil {
				t.Fatal(err)
			}
			f, err := readDXF(b)
			if err != nil {
				t.Fatal(err)
			}
			checkHeader(t, f, s.Units)
			var holes []wantHole
			texts := map[string]bool{}
			for _, e := range f.entities {
				if e.layer == "holes" {
					holes = append(holes, gotHole(t, e))
				}
				if e.kind == "TEXT" {
					for _, c := range e.codes {
						if c.code == 1 {
							texts[c.value] = true
						}
					}
					h, v := e.float(72), e.float(73)
					if (h != 0 || v != 0) && (!e.has(11) || v == 0) {
						t.Errorf("TEXT %v with alignment %v/%v and no alignment point", e.codes, h, v)
					}
				}
			}
			var want []wantHole
			for vi, v := range s.Views {
				for _, w := range jobHoles(r, vi == 1) {
					q := v.Fold(r2.Vec{X: w.x, Y: w.y}) // where a break puts it
					w.x, w.y = q.X, q.Y
					w.x += v.Origin.X
					w.y += v.Origin.Y
					want = append(want, w)
				}
			}
			sameHoles(t, "sheet", holes, want)
			for _, w := range []string{r.Design.Job.Mark, sheet.Stamp, "HOLE SCHEDULE"} {
				if w == sheet.Stamp && r.Pass {
					continue
				}
				if !texts[w] {
					t.Errorf("no TEXT %q", w)
				}
			}
		})
	}
}

func TestFilesNames(t *testing.T) {
	_, s := sheetOf(t, "../testdata/jobs/us-pipe-rack-brace.yaml")
	fs, err := Files(s)
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for _, f := range fs {
		names = append(names, f.Name)
	}
	if want := []string{"PR-VB2.dxf", "PR-VB2-member.cam.dxf", "PR-VB2-plate.cam.dxf"}; !equal(names, want) {
		t.Errorf("files %v, want %v", names, want)
	}
	_, s = sheetOf(t, "../testdata/jobs/us-single-angle.yaml") // fails: stamped, no CAM
	fs, err = Files(s)
	if err != nil || len(fs) != 1 || fs[0].Name != "HB-7.dxf" {
		t.Errorf("stamped sheet: %v files, err %v", len(fs), err)
	}
}

func equal(a, b []string) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// allFiles draws every file of the job, the CAM files too for a failing
// job.
func allFiles(path string) ([]File, error) {
	j, err := loadJob(path)
	if err != nil {
		return nil, err
	}
	d, err := detail.Build(j)
	if err != nil {
		return nil, err
	}
	r, err := detail.Check(d)
	if err != nil {
		return nil, err
	}
	s, err := sheet.NewSheet(r, !r.Pass)
	if err != nil {
		return nil, err
	}
	fs, err := Files(s)
	if err != nil {
		return nil, err
	}
	for i := range s.Views {
		b, err := CAM(&s.Views[i].Part, s.Units)
		if err != nil {
			return nil, err
		}
		fs = append(fs, File{Name: s.Views[i].Part.Name, Data: b})
	}
	return fs, nil
}

// Same job, same bytes: and the same when drawn from several goroutines at
// once (run with -race: the library's shared state is behind our mutex).
func TestDeterministicAndConcurrent(t *testing.T) {
	want := map[string][]File{}
	for _, p := range jobs {
		fs, err := allFiles(p)
		if err != nil {
			t.Fatal(err)
		}
		want[p] = fs
	}
	var wg sync.WaitGroup
	errs := make(chan string, 64)
	for range 4 {
		for _, p := range jobs {
			wg.Add(1)
			go func() {
				defer wg.Done()
				got, err := allFiles(p)
				if err != nil || len(got) != len(want[p]) {
					errs <- fmt.Sprintf("%s: %d files, %v", p, len(got), err)
					return
				}
				for i := range got {
					if got[i].Name != want[p][i].Name || !bytes.Equal(got[i].Data, want[p][i].Data) {
						errs <- p + ": " + got[i].Name + " differs between runs"
						return
					}
				}
			}()
		}
	}
	wg.Wait()
	close(errs)
	for e := range errs {
		t.Error(e)
	}
}

// cpuTime is the process's user + system CPU time so far: what the
// machine's other load does not change, unlike the wall time of ns/op.
func cpuTime() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}

// BenchmarkFiles draws one sheet's files (the cut sheet and two CAM
// files of the SI double angle, 181 entities).
func BenchmarkFiles(b *testing.B) {
	_, s := sheetOf(b, "../testdata/jobs/si-double-angle.yaml")
	cpu0 := cpuTime()
	for b.Loop() {
		if _, err := Files(s); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64((cpuTime()-cpu0).Microseconds())/float64(b.N), "cpu-µs/op")
}

// BenchmarkFilesParallel draws the same on every core at once: with
// nothing shared between drawings, ns/op falls with the cores.
func BenchmarkFilesParallel(b *testing.B) {
	_, s := sheetOf(b, "../testdata/jobs/si-double-angle.yaml")
	cpu0 := cpuTime()
	b.RunParallel(func(pb *testing.PB) {
		for pb.Next() {
			if _, err := Files(s); err != nil {
				b.Error(err)
				return
			}
		}
	})
	b.ReportMetric(float64((cpuTime()-cpu0).Microseconds())/float64(b.N), "cpu-µs/op")
}
