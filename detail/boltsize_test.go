package detail

import (
	"path/filepath"
	"strings"
	"testing"
	"unicode/utf8"

	"gaugeline/rules/units"
)

// A metric bolt keeps its metric name in a US job, and an inch bolt its
// inch size (ASME B18.2.6 / ISO designations; common practice, no source).
func TestBoltSizeNames(t *testing.T) {
	for _, c := range []struct {
		d    units.Length
		sys  units.System
		want string
	}{
		{20, units.US, "M20"},
		{22, units.SI, "M22"},
		{units.Inch * 3 / 4, units.US, `3/4"`},
		{units.Inch, units.US, `1"`},
	} {
		if got := BoltSize(c.d, c.sys); got != c.want {
			t.Errorf("BoltSize(%g mm, %v) = %q, want %q", float64(c.d), c.sys, got, c.want)
		}
	}
}

// The text report of every testdata job fits 100 columns (a terminal's
// or a printed page's line; common practice, no source).
func TestTextReportFits100Columns(t *testing.T) {
	files, _ := filepath.Glob("../testdata/jobs/*.yaml")
	more, _ := filepath.Glob("../testdata/examples/*.yaml")
	for _, f := range append(files, more...) {
		r, err := CheckFile(f)
		if err != nil {
			t.Fatal(err)
		}
		var b strings.Builder
		if err := r.WriteText(&b); err != nil {
			t.Fatal(err)
		}
		for i, l := range strings.Split(b.String(), "\n") {
			if n := utf8.RuneCountInString(l); n > 100 {
				t.Errorf("%s line %d is %d columns: %q", filepath.Base(f), i+1, n, l)
			}
		}
	}
}
