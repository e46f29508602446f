package jobfile

import (
	"strings"
	"testing"

	"gaugeline/rules"
)

// Bolt grades as the trade writes them read as the grade and what its
// suffix implies (the AISC Manual's designations N, X, SC; ASTM F3125's
// grade names; common practice, no source), and a suffix that
// contradicts the job's threads or joint is bad input naming the field.
func TestBoltGradeSpellings(t *testing.T) {
	for _, c := range []struct {
		grade, extra string
		want         string
		threads      rules.Threads
		joint        rules.Joint
	}{
		{"A325", "", "A325", rules.ThreadsIncluded, rules.Bearing},
		{"A325-N", "", "A325", rules.ThreadsIncluded, rules.Bearing},
		{"A325-X", "", "A325", rules.ThreadsExcluded, rules.Bearing},
		{"A490-SC", "", "A490", rules.ThreadsIncluded, rules.SlipCritical},
		{"A325-X-SC", "", "A325", rules.ThreadsExcluded, rules.SlipCritical},
		{"F3125 A325", "", "A325", rules.ThreadsIncluded, rules.Bearing},
		{"F3125 Grade A490", "", "A490", rules.ThreadsIncluded, rules.Bearing},
		{"ASTM F3125 A490-X", "", "A490", rules.ThreadsExcluded, rules.Bearing},
		{"Grade A490", "", "A490", rules.ThreadsIncluded, rules.Bearing},
		{"a325-x", "  threads: excluded\n", "A325", rules.ThreadsExcluded, rules.Bearing},
		{"A325M-X", "", "A325M", rules.ThreadsExcluded, rules.Bearing},
	} {
		src := minimalUS + "bolts:\n  grade: " + c.grade + "\n" + c.extra
		j := mustParse(t, src)
		b := j.Bolts
		if b.Grade != c.want || b.Threads != c.threads || b.Joint != c.joint {
			t.Errorf("%q: grade %q, threads %v, joint %v; want %q, %v, %v", c.grade, b.Grade, b.Threads, b.Joint, c.want, c.threads, c.joint)
		}
	}
	for _, c := range []struct{ grade, extra, msg string }{
		{"A325-X", "  threads: included\n", "threads are excluded"},
		{"A325-SC", "  joint: bearing\n", "joint is slip-critical"},
		{"A325-N-X", "", "both included (N) and excluded (X)"},
		{"A325-Q", "", `unknown suffix "Q"`},
	} {
		_, err := ParseJob("test.yaml", []byte(minimalUS+"bolts:\n  grade: "+c.grade+"\n"+c.extra))
		ie, ok := err.(*InputError)
		if !ok || ie.Field != "bolts.grade" || ie.Line != 9 || !strings.Contains(ie.Msg, c.msg) {
			t.Errorf("%q with %q: %v, want bolts.grade at line 9 saying %q", c.grade, c.extra, err, c.msg)
		}
	}
	if _, err := ParseJob("test.yaml", []byte(minimalUS+"stock:\n  grades: [A325, F3125 A490]\n")); err != nil {
		t.Errorf("stock grades as written: %v", err)
	}
}
