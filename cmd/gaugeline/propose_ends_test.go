package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// propose lays out the near end; a far end of its own is checked as the
// job gives it. One 7/8-in A325 bolt (threads included) at the far end
// carries φrn = 0.75 × 54 ksi × 0.601 in² = 24.3 kip (AISC 360-22 Table
// J3.2, Fnv 54 ksi for Group A, threads included), short of the 60 kip
// demand: the near end's layout is found and the member still fails,
// exit 1, naming the far end.
func TestProposeChecksTheFarEnd(t *testing.T) {
	src, err := os.ReadFile(filepath.Join("..", "..", "testdata", "jobs", "us-brace-two-ends.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	s := string(src)
	i := strings.Index(s, "bolts:\n  diameter: 3/4 in")
	s = s[:i] + "bolts:\n  threads: included\n  joint: bearing\nstock:\n  diameters: [3/4 in, 7/8 in]\n  grades: [A325]\n  max_lines: 1\n  max_per_line: 6\n"
	job := filepath.Join(t.TempDir(), "br-20.yaml")
	weak := strings.Replace(s, "      per_line: 3\n", "      per_line: 1\n", 1)
	for _, tc := range []struct {
		name, src string
		code      int
	}{{"far end as given passes", s, 0}, {"far end of one bolt fails", weak, 1}} {
		if err := os.WriteFile(job, []byte(tc.src), 0o644); err != nil {
			t.Fatal(err)
		}
		r := gaugeline(t, ".", "propose", job)
		if r.code != tc.code || !strings.Contains(r.stdout, "FAR END") {
			t.Errorf("%s: exit %d, want %d\n%s%s", tc.name, r.code, tc.code, r.stdout, r.stderr)
		}
		if tc.code == 1 && !strings.Contains(r.stderr, "far end fails") {
			t.Errorf("%s: stderr does not name the far end: %s", tc.name, r.stderr)
		}
	}
}
