package propose

import (
	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"path/filepath"
	"reflect"
	"testing"
)

// TestProposeModelIsBuilds: the model propose checks for its chosen
// layout is, field for field, the one Build makes from the job file
// propose writes for it (the same steps: parts, placeHoles, placePlate).
// The fixtures are the repository's own propose jobs; the expectation is
// the identity of two paths, no outside value.
func TestProposeModelIsBuilds(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/propose/*.yaml")
	more, _ := filepath.Glob("../../testdata/jobs/*.yaml")
	files = append(files, more...)
	compared := 0
	for _, f := range files {
		j, err := jobfile.LoadJob(f)
		if err != nil {
			continue
		}
		p, err := newProblem(j)
		if err != nil || p.yieldBlocker() != nil {
			continue
		}
		p.cache = map[candKey]*detail.Report{}
		tops := p.bestPerGroup(p.obj, 1)
		if len(tops) == 0 {
			continue
		}
		cd, ok := p.design(tops[0])
		if !ok {
			t.Fatalf("%s: the chosen candidate does not build", f)
		}
		data, err := WriteJob(j, p.layout(tops[0]))
		if err != nil {
			t.Fatal(err)
		}
		lj, err := jobfile.ParseJob(f, data)
		if err != nil {
			t.Fatal(err)
		}
		bd := mustBuild(t, lj)
		if !reflect.DeepEqual(cd.Conn, bd.Conn) {
			t.Errorf("%s: propose's model\n%+v\nBuild's\n%+v", f, cd.Conn, bd.Conn)
		}
		if cd.Info != bd.Info || cd.Combination != bd.Combination {
			t.Errorf("%s: propose's info %+v %q, Build's %+v %q", f, cd.Info, cd.Combination, bd.Info, bd.Combination)
		}
		compared++
	}
	if compared < 5 {
		t.Fatalf("compared %d jobs, want at least 5", compared)
	}
}
