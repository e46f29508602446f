package propose

import (
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/detailing"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
)

func mustBuild(t *testing.T, j *jobfile.Job) *detail.Design {
	t.Helper()
	d, err := detail.Build(j)
	if err != nil {
		t.Fatalf("Build: %v", err)
	}
	return d
}

// findingOf is the finding id of the report.
func findingOf(r *detail.Report, id string) (detailing.Finding, bool) {
	for _, f := range r.Findings {
		if f.ID == id {
			return f, true
		}
	}
	return detailing.Finding{}, false
}

// resultOf is the limit state id of the report.
func resultOf(r *detail.Report, id string) (engine.Result, bool) {
	for _, x := range r.Results {
		if x.ID == id {
			return x, true
		}
	}
	return engine.Result{}, false
}
