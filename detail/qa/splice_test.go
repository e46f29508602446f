package qa

import (
	"errors"
	"testing"

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
