package rules

import (
	"fmt"
	"regexp"
	"strings"
)

// BoltSpelling is a bolt grade as the trade writes it, read into the grade
// and what its suffix says of the threads and the joint: "A325-N" is A325
// with the threads included in the shear planes, "A325-X" excluded,
// "A325-SC" in a slip-critical joint (the AISC Manual's designations,
// common practice, no source); "F3125 A325", "F3125 Grade A325", "ASTM
// A325" and "Grade A490" name the grade alone (ASTM F3125 took A325 and
// A490 in as grades in 2015, from memory); the metric grades read alike
// ("A325M-X", "F3125 A490M").
type BoltSpelling struct {
	Grade   string
	Threads *Threads // nil: the spelling says nothing of the threads
	Joint   *Joint   // nil: nothing of the joint
}

// spellingPrefix is what may stand before the grade: the standard that
// now holds it and the word "grade".
var spellingPrefix = regexp.MustCompile(`^(?:ASTM\s*)?(?:F3125(?:/F3125M)?M?\s*[-/]?\s*)?(?:GRADE\s*|GR\.?\s*)?`)

// ParseBoltSpelling reads a bolt grade as the trade writes it. A suffix it
// does not know, or two that contradict (A325-N-X), is an error.
func ParseBoltSpelling(s string) (BoltSpelling, error) {
	t := strings.ToUpper(strings.Join(strings.Fields(s), " "))
	t = spellingPrefix.ReplaceAllString(t, "")
	parts := strings.Split(strings.ReplaceAll(t, " ", "-"), "-")
	out := BoltSpelling{Grade: parts[0]}
	if out.Grade == "" {
		return out, fmt.Errorf("no bolt grade in %q", s)
	}
	for _, suffix := range parts[1:] {
		switch suffix {
		case "N", "X":
			th := ThreadsIncluded
			if suffix == "X" {
				th = ThreadsExcluded
			}
			if out.Threads != nil && *out.Threads != th {
				return out, fmt.Errorf("%q says the threads are both included (N) and excluded (X)", s)
			}
			out.Threads = &th
		case "SC":
			j := SlipCritical
			out.Joint = &j
		case "TC":
			// a twist-off (tension-control) bolt of the grade: F1852 or
			// F2280 name it; the grade's strengths are the same
		default:
			return out, fmt.Errorf("unknown suffix %q in bolt grade %q (want N, X or SC, e.g. A325-X)", suffix, s)
		}
	}
	return out, nil
}
