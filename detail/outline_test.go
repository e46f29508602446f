package detail

import (
	"math"
	"os"
	"strings"
	"testing"

	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// The gusset of testdata/jobs/us-clipped-gusset.yaml (GK-4, a scenario of
// our own) in four forms: as the job gives it (outline, corner 3 clipped),
// the same outline unclipped, the rectangle of plate.width/edge/length,
// and today's open rectangle (width and edge). Everything below is a hand
// calculation on that job's geometry with AISC 360-22 J4.1 (the Whitmore
// section: 30° each side, Manual Part 9's definition as the engine takes
// it) and J4.3; no outside tool.
//
// Geometry (in): holes x = 1.5, 4.5, 7.5, 10.5 at y = 2.5 (end 1-1/2,
// pitch 3, gage 2-1/2); 7/8 in bolts, dh = 15/16 + 1/16 = 1.0 in; plate
// t = 1/2 in, A572-50 (Fy 50, Fu 65 ksi); rectangle x −6 … 12, y −3.5 … 8.5.
// Whitmore: from the bolt at x = 10.5 to the section x = 1.5, 9 in at
// 30°: 9·tan 30° = 5.196152 each side, y −2.696152 … 7.696152, inside the
// rectangle: Lw = 10.392305 in.
// The clip of corner 3 (−6, 8.5) takes 12 in along the top edge and 6 in
// down the back edge: the cut runs from (6, 8.5) to (−6, 2.5), slope 1/2;
// at x = 1.5 it is at y = 2.5 + 7.5/2 = 6.25, so it takes 7.696152 − 6.25
// = 1.446152 in off the top of the Whitmore section.
const (
	handLwRect    = 10.392304845413264 // 18·tan 30° in
	handClipped   = 1.446152422706632  // 2.5 + 9·tan 30° − 6.25 in
	handT, handFy = 0.5, 50.0          // in, ksi
	handFu        = 65.0               // ksi
)

func gusset(t *testing.T, form string) *Report {
	t.Helper()
	b, err := os.ReadFile("../testdata/jobs/us-clipped-gusset.yaml")
	if err != nil {
		t.Fatal(err)
	}
	src := string(b)
	clip := "  clip:\n    - {corner: 3, size: [12 in, 6 in]}\n"
	outline := "  outline:\n    - [-6 in, -3.5 in]\n    - [12 in, -3.5 in]\n    - [12 in, 8.5 in]\n    - [-6 in, 8.5 in]\n"
	if !strings.Contains(src, clip) || !strings.Contains(src, outline) {
		t.Fatal("us-clipped-gusset.yaml no longer has the outline and clip this test derives from")
	}
	switch form {
	case "outline":
		src = strings.Replace(src, clip, "", 1)
	case "length":
		src = strings.Replace(strings.Replace(src, clip, "", 1), outline, "  width: 12 in\n  edge: 1-1/2 in\n  length: 18 in\n", 1)
	case "open":
		src = strings.Replace(strings.Replace(src, clip, "", 1), outline, "  width: 12 in\n  edge: 1-1/2 in\n", 1)
	}
	j, err := jobfile.ParseJob(form+".yaml", []byte(src))
	if err != nil {
		t.Fatal(err)
	}
	d, err := Build(j)
	if err != nil {
		t.Fatal(err)
	}
	r, err := Check(d)
	if err != nil {
		t.Fatal(err)
	}
	return r
}

func result(t *testing.T, r *Report, id string) engine.Result {
	t.Helper()
	for _, x := range r.Results {
		if x.ID == id {
			return x
		}
	}
	t.Fatalf("no %s", id)
	return engine.Result{}
}

func value(t *testing.T, x engine.Result, name string) float64 {
	t.Helper()
	for _, v := range x.Values {
		if v.Name == name {
			return v.V
		}
	}
	t.Fatalf("%s has no value %s", x.ID, name)
	return 0
}

func inches(mm float64) float64 { return mm / float64(units.Inch) }
func kips(n float64) float64    { return n / float64(units.Kip) }

// near is a relative tolerance of 1e-9: the hand values are exact to the
// digits written, and the engine does the same arithmetic.
func near(got, want float64) bool { return math.Abs(got-want) <= 1e-9*math.Max(1, math.Abs(want)) }

func TestClippedCornerWeakensTheWhitmoreSection(t *testing.T) {
	clipped, rect := gusset(t, "clipped"), gusset(t, "outline")
	for _, r := range []*Report{rect, gusset(t, "length"), gusset(t, "open")} {
		lw := inches(value(t, result(t, r, "plate.yield"), "Lw"))
		if !near(lw, handLwRect) {
			t.Errorf("%s: rectangle Lw = %.9f in, want %.9f (hand: 18·tan 30°)", r.Design.Job.File, lw, handLwRect)
		}
	}
	lw := inches(value(t, result(t, clipped, "plate.yield"), "Lw"))
	if !near(lw, handLwRect-handClipped) {
		t.Errorf("clipped Lw = %.9f in, want %.9f (hand: less the clipped 1.446152 in)", lw, handLwRect-handClipped)
	}
	// Yield: Rn = Fy·Lw·t, so the clip costs clipped·t·Fy.
	dy := kips(float64(result(t, rect, "plate.yield").Nominal - result(t, clipped, "plate.yield").Nominal))
	if want := handClipped * handT * handFy; !near(dy, want) {
		t.Errorf("plate.yield drops %.6f kip, want %.6f (clipped × t × Fy)", dy, want)
	}
	// Rupture: Rn = Fu·(Lw − Σdh)·t, the same one hole on the path either
	// way, so the clip costs clipped·t·Fu.
	dr := kips(float64(result(t, rect, "plate.rupture").Nominal - result(t, clipped, "plate.rupture").Nominal))
	if want := handClipped * handT * handFu; !near(dr, want) {
		t.Errorf("plate.rupture drops %.6f kip, want %.6f (clipped × t × Fu)", dr, want)
	}
	if !(result(t, clipped, "plate.yield").Ratio > result(t, rect, "plate.yield").Ratio) {
		t.Error("the clipped gusset is not weaker in plate.yield")
	}
}

// Closing the rectangle behind the holes (plate.length, or the same
// rectangle as an outline) changes nothing toward the free edge: block
// shear and bearing are today's open rectangle's.
func TestClosedRectangleIsTheOpenOne(t *testing.T) {
	open := gusset(t, "open")
	for _, form := range []string{"length", "outline"} {
		r := gusset(t, form)
		for _, id := range []string{"plate.yield", "plate.rupture", "plate.block-shear", "plate.bearing"} {
			if got, want := result(t, r, id).Nominal, result(t, open, id).Nominal; !near(float64(got), float64(want)) {
				t.Errorf("%s: %s Rn %v, open rectangle %v", form, id, got, want)
			}
		}
	}
}

// Block shear of the clipped gusset: the L-shaped block from the gage line
// to the high side ends at the clip. By hand (J4.3, Ubs = 1): tension
// plane from H1 (1.5, 2.5) up to the clip at y = 6.25, Ant = (3.75 − 1.0/2)
// · 0.5 = 1.625 in²; shear plane from the free edge x = 12 to H1, Agv =
// 10.5·0.5 = 5.25 in², Anv = (10.5 − 3.5·1.0)·0.5 = 3.5 in²; Rn =
// min(0.6·65·3.5, 0.6·50·5.25) + 65·1.625 = 136.5 + 105.625 = 242.125 kip.
func TestClippedGussetBlockShear(t *testing.T) {
	bs := result(t, gusset(t, "clipped"), "plate.block-shear")
	for _, c := range []struct {
		name string
		want float64 // in²
	}{{"Ant", 1.625}, {"Agv", 5.25}, {"Anv", 3.5}} {
		if got := value(t, bs, c.name) / float64(units.Inch*units.Inch); !near(got, c.want) {
			t.Errorf("%s = %.9f in², want %.9f (hand)", c.name, got, c.want)
		}
	}
	if got := kips(float64(bs.Nominal)); !near(got, 242.125) {
		t.Errorf("Rn = %.6f kip, want 242.125 (hand)", got)
	}
}

// The edge distance to the clip is measured square to it: H1 (1.5, 2.5)
// to the line through (6, 8.5) and (−6, 2.5) is |(7.5, 0)·(−6, 12)|/√180 =
// 45/√180 = 3.354102 in (by hand; the foot (0, 5.5) lies on the clip), not
// the 6 in straight up to the top edge the rectangle has.
func TestEdgeDistanceToAClipIsSquareToIt(t *testing.T) {
	r := gusset(t, "clipped")
	want := 45 / math.Sqrt(180)
	found := false
	for _, f := range r.Findings {
		if f.ID == "edge.min" && strings.Contains(f.Where, "plate edge 3–4") {
			found = true
			if got := inches(f.Measured); !near(got, want) || !strings.HasPrefix(f.Where, "H1 ") {
				t.Errorf("%s: %.9f in, want H1 at %.9f in", f.Where, got, want)
			}
		}
	}
	if !found {
		t.Error("no edge.min finding for the clip (plate edge 3–4)")
	}
}
