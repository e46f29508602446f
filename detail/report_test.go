package detail

import (
	"encoding/json"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// TestJSONContract pins the field names of SPEC §9: tests outside the
// project read them.
func TestJSONContract(t *testing.T) {
	for _, job := range []string{"us-single-angle.yaml", "si-double-angle.yaml"} {
		j, err := jobfile.LoadJob(filepath.Join("..", "testdata", "jobs", job))
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
		b, err := r.JSON()
		if err != nil {
			t.Fatal(err)
		}
		var doc map[string]any
		if err := json.Unmarshal(b, &doc); err != nil {
			t.Fatal(err)
		}
		has := func(m map[string]any, where string, keys ...string) {
			t.Helper()
			for _, k := range keys {
				if _, ok := m[k]; !ok {
					t.Errorf("%s: %s has no %q", job, where, k)
				}
			}
		}
		has(doc, "report", "mark", "standard", "method", "units", "unit_labels", "demand", "verdict", "governing",
			"limit_states", "detailing", "holes", "cautions")
		has(doc["unit_labels"].(map[string]any), "unit_labels", "length", "force", "stress", "area")
		for _, ls := range doc["limit_states"].([]any) {
			has(ls.(map[string]any), "limit state", "id", "clause", "nominal", "available", "demand", "ratio", "pass", "values")
		}
		for _, f := range doc["detailing"].([]any) {
			has(f.(map[string]any), "finding", "id", "clause", "measured", "limit", "pass", "advisory", "where")
		}
		for _, h := range doc["holes"].([]any) {
			has(h.(map[string]any), "hole", "id", "x", "y", "diameter", "type")
		}
		// values are in the job's units: a US job's member.yield Fy is 36 or
		// 50 ksi, never MPa; an SI job's lengths are mm.
		ls0 := doc["limit_states"].([]any)[0].(map[string]any)
		fy := ls0["values"].(map[string]any)["Fy"].(float64)
		if strings.HasPrefix(job, "us") && fy > 100 || strings.HasPrefix(job, "si") && fy < 200 {
			t.Errorf("%s: Fy = %v is not in the job's units", job, fy)
		}
		if !strings.Contains(doc["cautions"].([]any)[0].(string), "engineer of record") {
			t.Errorf("%s: first caution is %v", job, doc["cautions"])
		}
	}
}

// writeJob writes a job file into a fresh directory and returns its path.
func writeJob(t *testing.T, name, yaml string) string {
	t.Helper()
	p := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(p, []byte(yaml), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// verdictLine returns the line of s that starts with prefix.
func verdictLine(t *testing.T, s, prefix string) string {
	t.Helper()
	for _, l := range strings.Split(s, "\n") {
		if strings.HasPrefix(l, prefix) {
			return l
		}
	}
	t.Fatalf("no line starting %q in:\n%s", prefix, s)
	return ""
}

// When only a detailing rule fails, the verdict names it and does not
// pass off the governing limit state as the failure; the JSON keeps
// governing (the highest ratio) and lists what fails.
func TestVerdictNamesWhatFails(t *testing.T) {
	for _, tc := range []struct {
		job     string
		failing []string
		src     string
	}{
		// End distance 5/8 in < 1 in for a 3/4-in bolt, every limit state
		// passing at 20 kip.
		{"../testdata/batch/e-tight-edge.yaml", []string{"edge.min"}, "AISC 360-16 Table J3.4: 3/4-in bolt, 1 in"},
		// Bolt shear fails (and the group with it); nothing else.
		{"../testdata/jobs/us-single-angle.yaml", []string{"bolts.shear", "bolts.group"}, "AISC 360-22 J3.7, Table J3.2"},
		{"../testdata/jobs/si-double-angle.yaml", nil, "passes"},
	} {
		t.Run(filepath.Base(tc.job), func(t *testing.T) {
			r := checkedJob(t, tc.job)
			g := r.GoverningResult()
			for _, x := range r.Results {
				if x.Ratio > g.Ratio {
					t.Fatalf("governing %s (%.3f) is not the highest ratio: %s %.3f", g.ID, g.Ratio, x.ID, x.Ratio)
				}
			}
			var txt, md strings.Builder
			if err := r.WriteText(&txt); err != nil {
				t.Fatal(err)
			}
			if err := r.WriteMarkdown(&md); err != nil {
				t.Fatal(err)
			}
			lines := []string{verdictLine(t, txt.String(), "verdict: "), verdictLine(t, md.String(), "**Verdict: ")}
			for _, l := range lines {
				if len(tc.failing) == 0 {
					if !strings.Contains(l, "PASS") || strings.Contains(l, "fails") || !strings.Contains(l, "governing "+g.ID) {
						t.Errorf("%q: want a pass governed by %s", l, g.ID)
					}
					continue
				}
				if want := "fails " + strings.Join(tc.failing, ", "); !strings.Contains(l, want) {
					t.Errorf("%q does not say %q (%s)", l, want, tc.src)
				}
				// The governing limit state is shown for information; when it
				// passes, the line says so.
				if !strings.Contains(l, g.ID) || g.Pass != strings.Contains(l, g.ID+" ("+g.Clause+") passes") {
					t.Errorf("%q: governing %s (pass %v) misstated", l, g.ID, g.Pass)
				}
			}
			b, err := r.JSON()
			if err != nil {
				t.Fatal(err)
			}
			var doc struct {
				Governing string   `json:"governing"`
				Failing   []string `json:"failing"`
			}
			if err := json.Unmarshal(b, &doc); err != nil {
				t.Fatal(err)
			}
			if doc.Governing != g.ID || !slices.Equal(doc.Failing, tc.failing) || doc.Failing == nil {
				t.Errorf("JSON governing %q failing %q, want %q and %q (%s)", doc.Governing, doc.Failing, g.ID, tc.failing, tc.src)
			}
		})
	}
}

// A limit that rounds to 1/16 in is printed with its exact value, so that a
// failing finding never reads as if it met its limit: 7/8-in bolts at a
// 2-5/16 in pitch miss 2-2/3·d = 2.333 in, which rounds to 2-5/16 in.
func TestReportPrintsExactLimits(t *testing.T) {
	job := writeJob(t, "sp-7.yaml", `mark: SP-7
units: us
load:
  required: 20 kip
member:
  shape: flat
  width: 5 in
  thickness: 1/2 in
  grade: A36
bolts:
  diameter: 7/8 in
  grade: A325
  per_line: 2
  pitch: 2-5/16 in
  end: 1-1/2 in
  gage: 2-1/2 in
`)
	r := checkedJob(t, job)
	var txt, md strings.Builder
	if err := r.WriteText(&txt); err != nil {
		t.Fatal(err)
	}
	if err := r.WriteMarkdown(&md); err != nil {
		t.Fatal(err)
	}
	// AISC 360-22 J3.4: 2-2/3 · 7/8 = 2.333333 in (hand calculation).
	want := `2 5/16" (2.333333 in)`
	for name, out := range map[string]string{"text": txt.String(), "markdown": md.String()} {
		if !strings.Contains(out, want) {
			t.Errorf("%s report does not print the limit as %q:\n%s", name, want, out)
		}
	}
	// Every failing finding prints a measured value and a limit that differ.
	p := people{r.Design.Job.Units}
	n := 0
	for _, f := range r.Findings {
		if f.Pass || f.Dim != units.DimLength {
			continue
		}
		n++
		if m, l := p.value(f.Measured, f.Dim), p.value(f.Limit, f.Dim); m == l {
			t.Errorf("%s %s fails but prints measured %s and limit %s", f.ID, f.Where, m, l)
		}
	}
	if n == 0 {
		t.Fatal("spacing.min does not fail at 2-5/16 in (AISC 360-22 J3.4: 2.333 in)")
	}
}
