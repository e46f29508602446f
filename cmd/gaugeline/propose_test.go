package main

import (
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

type proposeJSON struct {
	jsonReport
	Layout struct {
		Diameter string `json:"diameter"`
		Grade    string `json:"grade"`
		Lines    int    `json:"lines"`
		PerLine  int    `json:"per_line"`
		Pitch    string `json:"pitch"`
		End      string `json:"end"`
		Gage     string `json:"gage"`
	} `json:"layout"`
	Bolts        int `json:"bolts"`
	Alternatives []struct {
		Bolts     int     `json:"bolts"`
		Length    float64 `json:"length"`
		Governing string  `json:"governing"`
		Ratio     float64 `json:"ratio"`
	} `json:"alternatives"`
	Search struct {
		Space     int `json:"space"`
		Evaluated int `json:"evaluated"`
	} `json:"search"`
	Message string `json:"message"`
}

func proposeDoc(t *testing.T, r ran) proposeJSON {
	t.Helper()
	var doc proposeJSON
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatalf("exit %d, output is not JSON: %v\n%s%s", r.code, err, r.stdout, r.stderr)
	}
	return doc
}

// TestProposeWriteThenCheck: every layout propose writes is a job that
// check passes (exit 0), in both unit systems.
func TestProposeWriteThenCheck(t *testing.T) {
	for _, name := range []string{"us-angle-brace.yaml", "si-slotted-length.yaml", "us-staggered-flat.yaml", "si-double-angle-asd.yaml"} {
		t.Run(name, func(t *testing.T) {
			dir := t.TempDir()
			job, _ := filepath.Abs(filepath.Join(testdata, "propose", name))
			r := gaugeline(t, dir, "propose", job, "--format", "json", "--write", "out.yaml")
			if r.code != 0 {
				t.Fatalf("propose: exit %d\n%s", r.code, r.stderr)
			}
			doc := proposeDoc(t, r)
			if doc.Verdict != "pass" || doc.Bolts != doc.Layout.Lines*doc.Layout.PerLine || doc.Layout.Diameter == "" {
				t.Errorf("verdict %s, %d bolts, layout %+v", doc.Verdict, doc.Bolts, doc.Layout)
			}
			if doc.Search.Space == 0 || doc.Search.Evaluated == 0 || doc.Search.Evaluated > doc.Search.Space {
				t.Errorf("search %+v", doc.Search)
			}
			entries, _ := os.ReadDir(dir)
			if len(entries) != 1 || entries[0].Name() != "out.yaml" {
				t.Errorf("files left: %v (want out.yaml alone: the write is a rename)", entries)
			}
			c := gaugeline(t, dir, "check", "out.yaml", "--format", "json")
			if c.code != 0 {
				t.Fatalf("check of the written job: exit %d\n%s%s", c.code, c.stdout, c.stderr)
			}
			var chk jsonReport
			if err := json.Unmarshal([]byte(c.stdout), &chk); err != nil {
				t.Fatal(err)
			}
			// check reads back the layout propose checked: same holes.
			if len(chk.Holes) != len(doc.Holes) || chk.Governing != doc.Governing {
				t.Errorf("check: %d holes governed by %s; propose: %d holes governed by %s", len(chk.Holes), chk.Governing, len(doc.Holes), doc.Governing)
			}
			text := gaugeline(t, dir, "propose", job)
			if text.code != 0 || !strings.Contains(text.stdout, "bolts:\n  diameter: "+doc.Layout.Diameter) || !strings.Contains(text.stdout, "engineer of record") {
				t.Errorf("text: exit %d\n%s", text.code, text.stdout)
			}
		})
	}
}

func TestProposeExhaustiveAgrees(t *testing.T) {
	// us-flat-shear: 6 bolts by hand (0.75 · 54 ksi · 0.4418 in² = 17.9
	// kips per bolt, AISC 360-22 Table J3.2; 100 kips / 17.9 → 6).
	job := filepath.Join(testdata, "propose", "us-flat-shear.yaml")
	fast := proposeDoc(t, gaugeline(t, ".", "propose", job, "--format", "json", "--alternatives", "2"))
	ex := proposeDoc(t, gaugeline(t, ".", "propose", job, "--format", "json", "--alternatives", "2", "--exhaustive"))
	if fast.Layout != ex.Layout || fast.Bolts != 6 {
		t.Errorf("pruned %+v (%d bolts), exhaustive %+v; want equal, 6 bolts (hand calculation)", fast.Layout, fast.Bolts, ex.Layout)
	}
	if len(fast.Alternatives) != len(ex.Alternatives) {
		t.Errorf("%d alternatives vs %d", len(fast.Alternatives), len(ex.Alternatives))
	}
	if fast.Search.Space != ex.Search.Space || 20*fast.Search.Evaluated > ex.Search.Evaluated {
		t.Errorf("pruned %+v, exhaustive %+v: want the same space and at most 1/20 checked", fast.Search, ex.Search)
	}
}

func TestProposeExitCodes(t *testing.T) {
	// L3x3x1/4 A36, Ag = 1.44 in²; 60 kips needs 60 / (0.9 · 36) = 1.85 in²
	// (AISC 360-22 D2(a)): exit 1 naming member.yield and the area.
	dir := t.TempDir()
	job, _ := filepath.Abs(filepath.Join(testdata, "propose", "infeasible-yield.yaml"))
	r := gaugeline(t, dir, "propose", job, "--write", "out.yaml")
	if r.code != 1 || !strings.Contains(r.stderr, "member.yield needs Ag ≥ 1.85 in2") || !strings.Contains(r.stdout, "larger member") {
		t.Errorf("infeasible: exit %d\nstdout %s\nstderr %s", r.code, r.stdout, r.stderr)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 0 {
		t.Errorf("an infeasible job wrote %v", entries)
	}
	j := gaugeline(t, dir, "propose", job, "--format", "json")
	if doc := proposeDoc(t, j); j.code != 1 || doc.Verdict != "infeasible" || !strings.Contains(doc.Message, "member.yield") {
		t.Errorf("infeasible JSON: exit %d, verdict %s, message %q", j.code, doc.Verdict, doc.Message)
	}

	bad := filepath.Join(dir, "bad.yaml")
	os.WriteFile(bad, []byte("mark: X\nload: {required: 10 kip}\nmember: {shape: flat, width: 6 in, thickness: 1/2 in, grade: A36}\nstock: {grades: [A325]}\n"), 0o644)
	r = gaugeline(t, dir, "propose", bad)
	if r.code != 2 || !strings.HasPrefix(r.stderr, "gaugeline: error: ") || !strings.Contains(r.stderr, "stock.diameters") {
		t.Errorf("no diameters: exit %d, stderr %q; want 2 naming stock.diameters", r.code, r.stderr)
	}
	for _, args := range [][]string{{"propose"}, {"propose", bad, "--format", "xml"}, {"propose", bad, "--alternatives", "-1"}} {
		if r := gaugeline(t, dir, args...); r.code != 2 {
			t.Errorf("%v: exit %d, want 2", args, r.code)
		}
	}
}

// TestNumericFlagsInRange: every numeric flag out of its range is bad
// input (exit 2) with one message naming the flag and the range, never a
// panic. --alternatives 2⁶³−1 overflowed 1 + N and panicked with a stack
// trace.
func TestNumericFlagsInRange(t *testing.T) {
	job, _ := filepath.Abs(filepath.Join(testdata, "propose", "us-flat-shear.yaml"))
	out := t.TempDir()
	qa, _ := filepath.Abs(filepath.Join(testdata, "measured", "hb-7-qa.yaml"))
	csv, _ := filepath.Abs(filepath.Join(testdata, "measured", "hb-7-qa-nominal.csv"))
	for _, c := range []struct {
		args []string
		want string // in the error line: the flag and its range
	}{
		{[]string{"propose", job, "--alternatives", "9223372036854775807"}, "--alternatives: want 0 to 100"},
		{[]string{"propose", job, "--alternatives", "101"}, "--alternatives: want 0 to 100"},
		{[]string{"propose", job, "--alternatives", "-1"}, "--alternatives: want 0 to 100"},
		{[]string{"propose", job, "--alternatives", "99999999999999999999"}, "--alternatives"},
		{[]string{"propose", job, "--max-candidates", "0"}, "--max-candidates: want 1 or more"},
		{[]string{"propose", job, "--max-candidates", "-5", "--exhaustive"}, "--max-candidates: want 1 or more"},
		{[]string{"propose", job, "--max-candidates", "99999999999999999999"}, "--max-candidates"},
		{[]string{"batch", filepath.Join(testdata, "batch"), "-o", out, "-j", "-1"}, "--jobs: want 1 or more"},
		// reverify's tolerances are lengths: above 0, at most 100 mm
		{[]string{"reverify", qa, "--measured", csv, "--position", "0 in"}, "--position: want a length above 0 and at most"},
		{[]string{"reverify", qa, "--measured", csv, "--position", "5 in"}, "--position: want a length above 0 and at most"},
		{[]string{"reverify", qa, "--measured", csv, "--diameter", "-1/32 in"}, "--diameter: want a length above 0 and at most"},
		{[]string{"batch", filepath.Join(testdata, "batch"), "-o", out, "--jobs", "99999999999999999999"}, "--jobs"},
	} {
		r := gaugeline(t, ".", c.args...)
		first := strings.SplitN(r.stderr, "\n", 2)[0]
		if r.code != 2 || !strings.HasPrefix(first, "gaugeline: error: ") || !strings.Contains(first, c.want) ||
			strings.Contains(r.stderr, "goroutine ") || strings.Contains(r.stderr, "panic") || r.stdout != "" {
			t.Errorf("%v: exit %d, stderr %q; want 2 and one message with %q", c.args, r.code, r.stderr, c.want)
		}
	}
	// In range, the largest count lists what there is.
	if r := gaugeline(t, ".", "propose", job, "--alternatives", "100"); r.code != 0 {
		t.Errorf("--alternatives 100: exit %d\n%s", r.code, r.stderr)
	}
}

// TestProposeMaxCandidates: a space larger than --max-candidates is bad
// input before the exhaustive search starts (exit 2, the space, the limit
// and what to do; nothing written); the pruned search stops at the limit
// the same way; within the limit the output is what it is without one.
func TestProposeMaxCandidates(t *testing.T) {
	dir := t.TempDir()
	brace, _ := filepath.Abs(filepath.Join(testdata, "propose", "us-angle-brace.yaml"))
	space := proposeDoc(t, gaugeline(t, dir, "propose", brace, "--format", "json")).Search.Space // as the search counts it
	for _, c := range []struct {
		args []string
		want []string
	}{
		{[]string{"--exhaustive", "--max-candidates", "1000"},
			[]string{fmt.Sprintf("us-angle-brace.yaml:20: stock: the exhaustive search would check all %d candidates", space), "more than --max-candidates 1000"}},
		{[]string{"--max-candidates", "10"},
			[]string{"us-angle-brace.yaml:20: stock: the search reached --max-candidates (10 candidates checked) before finishing", fmt.Sprintf("the space has %d", space)}},
	} {
		r := gaugeline(t, dir, append([]string{"propose", brace, "--write", "out.yaml"}, c.args...)...)
		lines := strings.Split(strings.TrimSuffix(r.stderr, "\n"), "\n")
		if r.code != 2 || len(lines) != 2 || r.stdout != "" {
			t.Fatalf("%v: exit %d, stdout %q, stderr %q; want 2, an error and a hint", c.args, r.code, r.stdout, r.stderr)
		}
		for _, w := range c.want {
			if !strings.Contains(lines[0], w) {
				t.Errorf("%v: %q does not say %q", c.args, lines[0], w)
			}
		}
		if !strings.HasPrefix(lines[1], "gaugeline: hint: narrow the stock") || !strings.Contains(lines[1], "raise --max-candidates") {
			t.Errorf("%v: hint %q", c.args, lines[1])
		}
		if entries, _ := os.ReadDir(dir); len(entries) != 0 {
			t.Errorf("%v: wrote %v", c.args, entries)
		}
	}

	// Within the limit, byte for byte the same as without one (and so as
	// before the limit existed: the default is above this space).
	flat, _ := filepath.Abs(filepath.Join(testdata, "propose", "us-flat-shear.yaml"))
	n := proposeDoc(t, gaugeline(t, dir, "propose", flat, "--format", "json")).Search.Space
	for _, mode := range [][]string{{"--exhaustive"}, {}} {
		want := gaugeline(t, dir, append([]string{"propose", flat, "--format", "json", "--alternatives", "5"}, mode...)...)
		got := gaugeline(t, dir, append([]string{"propose", flat, "--format", "json", "--alternatives", "5", "--max-candidates", strconv.Itoa(n)}, mode...)...)
		if want.code != 0 || got.code != 0 || got.stdout != want.stdout || got.stderr != "" {
			t.Errorf("%v --max-candidates %d (the space): exit %d, stderr %q; output equal: %v", mode, n, got.code, got.stderr, got.stdout == want.stdout)
		}
	}
}

// TestProposeRemedies: a job in which nothing in stock passes still exits
// 1, and says what would pass: four 3/4-in A325-N carry 4 · 17.9 = 71.6 <
// 80 kips, four A490-N 4 · 22.5 = 90.1 (AISC Manual Table 7-1, from
// memory), so a stronger grade comes first, in the text and the JSON.
func TestProposeRemedies(t *testing.T) {
	dir := t.TempDir()
	job, _ := filepath.Abs(filepath.Join(testdata, "propose", "infeasible-grade.yaml"))
	r := gaugeline(t, dir, "propose", job)
	if r.code != 1 || !strings.Contains(r.stdout, "what would pass, beyond the stock:\n  bolt grade A490") {
		t.Errorf("text: exit %d\n%s", r.code, r.stdout)
	}
	j := gaugeline(t, dir, "propose", job, "--format", "json")
	var doc struct {
		Verdict  string `json:"verdict"`
		Remedies []struct {
			Kind, Change, Value, Governing string
			Layout                         struct{ Grade string }
			Bolts                          int
			Ratio                          float64
		} `json:"remedies"`
	}
	if err := json.Unmarshal([]byte(j.stdout), &doc); err != nil {
		t.Fatal(err)
	}
	if j.code != 1 || doc.Verdict != "infeasible" || len(doc.Remedies) == 0 {
		t.Fatalf("JSON: exit %d, %+v", j.code, doc)
	}
	if m := doc.Remedies[0]; m.Kind != "grade" || m.Value != "A490" || m.Layout.Grade != "A490" || m.Bolts != 4 ||
		m.Ratio <= 0 || m.Ratio > 1 || m.Governing == "" {
		t.Errorf("first remedy %+v, want four A490 bolts passing", m)
	}
}
