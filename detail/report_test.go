package detail

import (
	"encoding/json"
	"path/filepath"
	"strings"
	"testing"
)

// TestJSONContract pins the field names of SPEC §9: tests outside the
// project read them.
func TestJSONContract(t *testing.T) {
	for _, job := range []string{"us-single-angle.yaml", "si-double-angle.yaml"} {
		j, err := LoadJob(filepath.Join("..", "testdata", "jobs", job))
		if err != nil {
			t.Fatal(err)
		}
		d, err := j.Build()
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
