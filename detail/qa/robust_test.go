package qa

import (
	"math"
	"path/filepath"
	"slices"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/measured"
	"gaugeline/detail/qa/fit"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
	"pgregory.net/rapid"
)

// The robust best fit. Tolerances: position 1/16 in radial (the jobs'
// default; common practice, no source, /work/shared/REFERENCE.md). The
// measured parts are geometric constructions: the design's holes in the
// measured part's frame, one hole moved by a known offset, then the whole
// part turned by θ and shifted. By construction the other holes lie
// exactly on R(θ)·p + t, so the fit on them must return θ and t, every one
// of them must read 0, and the moved hole must read its offset: that hole
// alone is out of tolerance.

const inch = float64(units.Inch) // mm

// mislocated builds the measured set of part p of design d: the design's
// holes in the part's frame, hole k moved by (ex, ey) mm, then the whole
// set turned by deg degrees about the part's origin and shifted (tx, ty)
// mm. Widths are the design's.
func mislocated(d *detail.Design, p MeasuredPart, k int, ex, ey, deg, tx, ty float64) *measured.Set {
	fr := newPartFrame(d, p)
	s := &measured.Set{File: "constructed", Format: "csv", Units: "mm"}
	for i, h := range d.Conn.Holes {
		q := fr.of(float64(h.X), float64(h.Y))
		if i == k {
			q.X, q.Y = q.X+ex, q.Y+ey
		}
		w := float64(min(h.Dx, h.Dy))
		s.Holes = append(s.Holes, measured.Hole{ID: h.ID, X: q.X, Y: q.Y, Width: w, Length: w, Line: i + 1})
	}
	rotateSet(s, deg*math.Pi/180, tx, ty)
	return s
}

// onlyOut checks that hole want alone is out of tolerance, reading the
// offset e (mm) it was moved by, every other hole reading 0, and that the
// fit returned the motion (deg, tx, ty) and names the holes it was taken on.
func onlyOut(t *testing.T, d *detail.Design, ab *AsBuilt, want string, e, deg, tx, ty float64) {
	t.Helper()
	for _, dv := range ab.Deviations {
		switch {
		case dv.ID == want:
			if dv.Status != HoleOutOfTolerance || math.Abs(float64(dv.Radial)-e) > 1e-6 {
				t.Errorf("%s: %s, radial %.6f mm, want out-of-tolerance at %.6f mm (its offset)", dv.ID, dv.Status, float64(dv.Radial), e)
			}
		case dv.Status != HoleOK || float64(dv.Radial) > 1e-6:
			t.Errorf("%s: %s, radial %.6f mm, want ok at 0 %q", dv.ID, dv.Status, float64(dv.Radial), dv.Why)
		}
	}
	a := ab.Alignment
	if got := a.Rotation * 180 / math.Pi; math.Abs(got-deg) > 1e-6 ||
		math.Abs(float64(a.Shift[0])-tx) > 1e-6 || math.Abs(float64(a.Shift[1])-ty) > 1e-6 {
		t.Errorf("fit: rotation %.9f°, shift (%.6f, %.6f) mm; want %g°, (%g, %g)", got, float64(a.Shift[0]), float64(a.Shift[1]), deg, tx, ty)
	}
	var others []string
	for _, h := range d.Conn.Holes {
		if h.ID != want {
			others = append(others, h.ID)
		}
	}
	if !slices.Equal(a.FitOn, others) || !slices.Equal(a.LeftOut, []string{want}) {
		t.Errorf("fit on %q, left out %q; want %q and %q", a.FitOn, a.LeftOut, others, want)
	}
}

func TestBestFitFindsTheMislocatedHole(t *testing.T) {
	const (
		oneLine   = "measured/hb-7-qa.yaml"       // 4 holes, one gage line, 3 in pitch
		twoLines  = "jobs/us-eccentric-flat.yaml" // 2 lines of 3, 3 in pitch
		staggered = "jobs/us-staggered-flat.yaml" // 2 staggered lines of 3
		fiveLine  = "measured/qa-5-offline.yaml"  // 5 holes, one gage line
		q         = inch / 4                      // the done-when offset, 1/4 in
		half      = inch / 2                      // the done-when shift, 1/2 in
		across    = 0.0                           // offset direction (degrees in the part's frame)
		along     = 90.0                          // …
		slant     = 135.0                         // …
	)
	tests := []struct {
		name   string
		job    string
		part   MeasuredPart
		hole   int     // index of the moved hole
		dir    float64 // direction of its 1/4 in offset, degrees from +y
		deg    float64 // the part's rotation
		tx, ty float64 // and shift, mm
	}{
		{"one line, plate, end hole across, shift only", oneLine, MeasuredPlate, 0, across, 0, half, 0},
		{"one line, plate, end hole across, turned 3°", oneLine, MeasuredPlate, 3, across, 3, half, half},
		{"one line, plate, inner hole along, turned −12°", oneLine, MeasuredPlate, 1, along, -12, half, -half},
		{"one line, member, end hole across, turned 5°", oneLine, MeasuredMember, 3, across, 5, half, half},
		{"one line, member, inner hole slant, shift only", oneLine, MeasuredMember, 2, slant, 0, 0, half},
		{"five in a line, member, middle hole across, turned 30°", fiveLine, MeasuredMember, 2, across, 30, -half, half},
		{"two lines, plate, corner hole slant, turned 7°", twoLines, MeasuredPlate, 0, slant, 7, half, half},
		{"two lines, member, inner hole along, turned −20°", twoLines, MeasuredMember, 4, along, -20, half, 0},
		{"staggered, plate, end hole across, turned 2°", staggered, MeasuredPlate, 5, across, 2, -half, half},
		{"staggered, member, inner hole slant, turned −45°", staggered, MeasuredMember, 1, slant, -45, half, half},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d := buildJob(t, filepath.Join("../../testdata", tt.job))
			r := tt.dir * math.Pi / 180
			set := mislocated(d, tt.part, tt.hole, q*math.Sin(r), q*math.Cos(r), tt.deg, tt.tx, tt.ty)
			ab, err := Reverify(d, set, ReverifyOptions{Align: AlignBestFit, Part: tt.part})
			if err != nil {
				t.Fatal(err)
			}
			onlyOut(t, d, ab, d.Conn.Holes[tt.hole].ID, q, tt.deg, tt.tx, tt.ty)
			if ab.Verdict == Accept {
				t.Errorf("verdict accept with a hole 1/4 in off")
			}
		})
	}
}

// TestLeastSquaresWouldHideIt shows what the robust fit is for: on the
// one-line plate with its end hole 1/4 in off across the line, the
// least-squares fit over all four holes (fit.FitRigid) turns the line to
// meet the bad hole. Linearised, the end hole's across-line leverage is
// 1/4 + 1.5²/5 = 0.7 (x = −1.5, −0.5, 0.5, 1.5 pitches), so it reads only
// 0.3 × 1/4 in = 0.075 in, and the far end hole reads 0.2 × 1/4 in
// (from the hat matrix of a straight-line fit, derived by hand).
func TestLeastSquaresWouldHideIt(t *testing.T) {
	d := buildJob(t, "../../testdata/measured/hb-7-qa.yaml")
	set := mislocated(d, MeasuredPlate, 0, 0, inch/4, 0, 0, 0)
	fr := newPartFrame(d, MeasuredPlate)
	var ps, qs []r2.Vec
	for i, h := range d.Conn.Holes {
		ps = append(ps, fr.of(float64(h.X), float64(h.Y)))
		qs = append(qs, r2.Vec{X: set.Holes[i].X, Y: set.Holes[i].Y})
	}
	ls := fit.FitRigid(ps, qs, 0)
	res := func(i int) float64 { q := ls.Inverse(qs[i]); return math.Hypot(q.X-ps[i].X, q.Y-ps[i].Y) }
	// 1 % : the linearisation drops terms in (1/4 in / 9 in)², about 0.1 %.
	if got := res(0) / inch; math.Abs(got-0.075) > 0.075*0.01 {
		t.Errorf("least squares: the bad hole reads %.5f in, want 0.075 in", got)
	}
	if got := res(3) / inch; math.Abs(got-0.05) > 0.05*0.01 {
		t.Errorf("least squares: the far end hole reads %.5f in, want 0.05 in", got)
	}
	ab, err := Reverify(d, set, ReverifyOptions{Align: AlignBestFit, Part: MeasuredPlate})
	if err != nil {
		t.Fatal(err)
	}
	onlyOut(t, d, ab, d.Conn.Holes[0].ID, inch/4, 0, 0, 0)
}

// TestBestFitUnchangedWhenEveryHoleFits: within tolerance everywhere, the
// robust fit is today's least-squares fit, with nothing left out and the
// note of a plain fit.
func TestBestFitUnchangedWhenEveryHoleFits(t *testing.T) {
	d := buildJob(t, "../../testdata/jobs/us-staggered-flat.yaml")
	// Every hole 1/32 in off in its own direction (inputs), under 1/16 in.
	set := synthetic(d)
	for i := range set.Holes {
		r := float64(i) * 1.1
		set.Holes[i].X += inch / 32 * math.Cos(r)
		set.Holes[i].Y += inch / 32 * math.Sin(r)
	}
	rotateSet(set, 0.2, 30, -40)
	ab, err := Reverify(d, set, ReverifyOptions{Align: AlignBestFit})
	if err != nil {
		t.Fatal(err)
	}
	des := make([]r2.Vec, len(d.Conn.Holes))
	mea := make([]r2.Vec, len(set.Holes))
	for i, h := range d.Conn.Holes {
		des[i], mea[i] = r2.Vec{X: float64(h.X), Y: float64(h.Y)}, r2.Vec{X: set.Holes[i].X, Y: set.Holes[i].Y}
	}
	ls := fit.FitRigid(des, mea, 0) // least squares over all six, the pairs in order
	a := ab.Alignment
	if a.Rotation != ls.Theta || float64(a.Shift[0]) != ls.T.X || float64(a.Shift[1]) != ls.T.Y {
		t.Errorf("fit %.12f rad (%.9f, %.9f), want least squares %.12f (%.9f, %.9f)", a.Rotation, float64(a.Shift[0]), float64(a.Shift[1]), ls.Theta, ls.T.X, ls.T.Y)
	}
	if len(a.LeftOut) != 0 || len(a.FitOn) != 6 || a.Note != "rigid shift and rotation fitted by least squares over the matched holes" {
		t.Errorf("fit on %q, left out %q, note %q", a.FitOn, a.LeftOut, a.Note)
	}
	for _, dv := range ab.Deviations {
		if dv.Status != HoleOK {
			t.Errorf("%s: %s", dv.ID, dv.Status)
		}
	}
}

// TestRobustFitFindsAnyOneOutlier: for any rigid motion (turns up to 80°
// either way, so that the least turn is the true one on patterns
// symmetric under a half turn; shifts up to 2 m) and one hole moved in any
// direction by three position tolerances or more, but within 9/10 of the
// match gate (beyond it the hole is extra and its design hole missing),
// among 4 to 6 holes, on the member or the plate, exactly that hole is out
// of tolerance, reading its offset, and the others read 0.
func TestRobustFitFindsAnyOneOutlier(t *testing.T) {
	jobs := []string{"measured/hb-7-qa.yaml", "measured/qa-5-offline.yaml", "jobs/us-eccentric-flat.yaml", "jobs/us-staggered-flat.yaml"}
	designs := make([]*detail.Design, len(jobs))
	for i, j := range jobs {
		designs[i] = buildJob(t, filepath.Join("../../testdata", j))
	}
	rapid.Check(t, func(rt *rapid.T) {
		d := designs[rapid.IntRange(0, len(jobs)-1).Draw(rt, "job")]
		part := MeasuredPart(rapid.IntRange(0, 1).Draw(rt, "part"))
		k := rapid.IntRange(0, len(d.Conn.Holes)-1).Draw(rt, "hole")
		tol := float64(d.Job.Tolerance.Position)
		gate := float64(matchGate(d.Conn.Bolt.D, d.Conn.Holes, d.Job.Tolerance))
		e := rapid.Float64Range(3*tol, 0.9*gate).Draw(rt, "offset")
		dir := rapid.Float64Range(-math.Pi, math.Pi).Draw(rt, "direction")
		deg := rapid.Float64Range(-80, 80).Draw(rt, "turn")
		tx := rapid.Float64Range(-2000, 2000).Draw(rt, "tx")
		ty := rapid.Float64Range(-2000, 2000).Draw(rt, "ty")
		set := mislocated(d, part, k, e*math.Cos(dir), e*math.Sin(dir), deg, tx, ty)
		ab, err := Reverify(d, set, ReverifyOptions{Align: AlignBestFit, Part: part})
		if err != nil {
			rt.Fatal(err)
		}
		var out []string
		for _, dv := range ab.Deviations {
			if dv.Status != HoleOK {
				out = append(out, dv.ID+":"+dv.Status.String())
			}
			if dv.ID == d.Conn.Holes[k].ID && math.Abs(float64(dv.Radial)-e) > 1e-6 {
				rt.Errorf("%s reads %.6f mm, moved %.6f mm", dv.ID, float64(dv.Radial), e)
			}
			if dv.ID != d.Conn.Holes[k].ID && float64(dv.Radial) > 1e-6 {
				rt.Errorf("%s reads %.6f mm, not moved", dv.ID, float64(dv.Radial))
			}
		}
		if want := []string{d.Conn.Holes[k].ID + ":out-of-tolerance"}; !slices.Equal(out, want) {
			rt.Errorf("not ok: %q, want %q", out, want)
		}
	})
}
