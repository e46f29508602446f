package detail

import (
	"errors"
	"math"
	"testing"

	"gaugeline/detail/jobfile"
)

func mustParse(t *testing.T, src string) *jobfile.Job {
	t.Helper()
	j, err := jobfile.ParseJob("test.yaml", []byte(src))
	if err != nil {
		t.Fatalf("ParseJob: %v", err)
	}
	return j
}

func parseErr(t *testing.T, src string) *jobfile.InputError {
	t.Helper()
	_, err := jobfile.ParseJob("test.yaml", []byte(src))
	if err == nil {
		t.Fatalf("ParseJob succeeded, want an error")
	}
	var ie *jobfile.InputError
	if !errors.As(err, &ie) {
		t.Fatalf("error %v (%T) is not an *InputError", err, err)
	}
	if ie.File != "test.yaml" {
		t.Errorf("File = %q, want test.yaml", ie.File)
	}
	return ie
}

// near compares with a relative tolerance.
func closeTo(got, want, rel float64) bool {
	if want == 0 {
		return math.Abs(got) <= rel
	}
	return math.Abs(got-want) <= rel*math.Abs(want)
}

// readBack is the tolerance for inputs read back: only float rounding.
const readBack = 1e-12

const minimalUS = `mark: M1
load:
  required: 95 kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
`

// checkedJob checks the job file at path.
func checkedJob(t *testing.T, path string) *Report {
	t.Helper()
	j, err := jobfile.LoadJob(path)
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
	return r
}
