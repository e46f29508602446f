package qa

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/measured"
)

// TestReverifySpliceOnAGusset: a splice plate part of a design whose
// plate is a gusset is ErrNoSplice, not the gusset's holes.
func TestReverifySpliceOnAGusset(t *testing.T) {
	d := buildJob(t, "../../testdata/measured/hb-7-qa.yaml")
	set := &measured.Set{Holes: []measured.Hole{{X: 1, Y: 1, Width: 20, Length: 20}}}
	for _, p := range []MeasuredPart{MeasuredSplice1, MeasuredSplice2} {
		if _, err := Reverify(d, set, ReverifyOptions{Part: p}); !errors.Is(err, ErrNoSplice) {
			t.Errorf("%s on a gusset: %v, want ErrNoSplice", p, err)
		}
	}
}

// A splice whose member B has a section of its own (member_b): measured
// exactly as designed, each group is checked with its own member, and
// member B's group as built gives member B's design ratios (member_b.*)
// back, with no change.
func TestReverifySpliceMemberB(t *testing.T) {
	d := buildJob(t, "../../testdata/jobs/us-chord-splice.yaml")
	design, err := detail.Check(d)
	if err != nil {
		t.Fatal(err)
	}
	pl := d.Conn.Plate
	var set measured.Set
	for _, h := range d.Conn.Holes { // the plate's frame: x' = FreeEdge − x (A), FreeEdge + gap + x (B)
		y := float64(pl.YMax() - h.Y)
		for _, x := range []float64{float64(pl.FreeEdge - h.X), float64(pl.FreeEdge + pl.Gap + h.X)} {
			set.Holes = append(set.Holes, measured.Hole{X: x, Y: y, Width: float64(h.Dx), Length: float64(h.Dy)})
		}
	}
	ab, err := Reverify(d, &set, ReverifyOptions{Part: MeasuredSplice1})
	if err != nil {
		t.Fatal(err)
	}
	br := ab.Splice.BReport
	if br == nil || !br.Pass || !ab.Report.Pass {
		t.Fatalf("as built: B report %v", br)
	}
	want := map[string]float64{}
	for _, x := range design.Results {
		want[x.ID] = x.Ratio
	}
	names := 0
	for _, x := range br.Results {
		w, ok := want[x.ID]
		if !ok {
			t.Errorf("member B's group as built has %s, which the design has not", x.ID)
			continue
		}
		if math.Abs(w-x.Ratio) > 1e-9 {
			t.Errorf("%s: as built %v, design %v", x.ID, x.Ratio, w)
		}
		if strings.HasPrefix(x.ID, "member_b.") {
			names++
		}
	}
	for _, x := range ab.Report.Results {
		if strings.HasPrefix(x.ID, "member_b.") || strings.HasSuffix(x.ID, ".member_b") {
			t.Errorf("member A's group as built has %s", x.ID)
		}
	}
	if names != 4 {
		t.Errorf("%d member_b results in member B's group, want 4", names)
	}
}
