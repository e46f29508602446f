package batch

import (
	"math"
	"slices"
	"testing"
)

// Marks sort as people read them (common practice, no source: the order a
// detailer lists BR-2 before BR-10 in); the order never depends on the
// input's.
func TestNaturalCompare(t *testing.T) {
	want := []string{"BR-1", "br-1", "BR-2", "BR-2a", "BR-02", "BR-10", "BR-10.1", "BR-10.2", "BR-10.10", "BR-100", "BRX", "K-3", "TD-21.b"}
	for _, seed := range [][]int{{12, 0, 5, 3, 7, 1, 9, 2, 11, 4, 6, 10, 8}, {8, 10, 6, 4, 11, 2, 9, 1, 7, 3, 5, 0, 12}} {
		got := make([]string, len(seed))
		for i, k := range seed {
			got[i] = want[k]
		}
		slices.SortFunc(got, NaturalCompare)
		if !slices.Equal(got, want) {
			t.Errorf("sorted %v,\n want %v", got, want)
		}
	}
	for _, tt := range []struct {
		a, b string
		want int
	}{{"BR-2", "BR-10", -1}, {"BR-10", "BR-2", 1}, {"a", "a", 0}, {"A-9", "A-09", -1}, {"x", "x1", -1}} {
		if got := NaturalCompare(tt.a, tt.b); got != tt.want {
			t.Errorf("NaturalCompare(%q, %q) = %d, want %d", tt.a, tt.b, got, tt.want)
		}
	}
}

// The summary: by mark, naturally; a duplicate after the job it
// duplicates; jobs without a mark last, in input order.
func TestSorted(t *testing.T) {
	in := []Row{{Mark: "BR-10"}, {File: "x.yaml"}, {Mark: "BR-2", File: "first"}, {File: "a.yaml"}, {Mark: "BR-2", File: "dup"}, {Mark: "BR-1"}}
	for i := range in {
		in[i].order, in[i].Ratio = i, math.NaN()
	}
	var got []string
	for _, r := range Sorted(in) {
		got = append(got, r.Mark+"/"+r.File)
	}
	want := []string{"BR-1/", "BR-2/first", "BR-2/dup", "BR-10/", "/x.yaml", "/a.yaml"}
	if !slices.Equal(got, want) {
		t.Errorf("Sorted: %v, want %v", got, want)
	}
}
