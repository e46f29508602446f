package engine_test

import (
	"path/filepath"
	"testing"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/propose"
	"gaugeline/engine"
)

// Every limit state of every testdata job shows a working that adds up
// (see engine.CheckWorking): the jobs, the published examples and the
// batch folder as they are, and the propose jobs (which give stock, not a
// layout) with the layout propose chooses. Jobs that are bad input on
// purpose are skipped.
func TestWorkingOfEveryTestdataJob(t *testing.T) {
	var paths []string
	for _, pat := range []string{"jobs", "examples", "batch", "batch/propose", "propose"} {
		m, err := filepath.Glob(filepath.Join("..", "testdata", pat, "*.yaml"))
		if err != nil {
			t.Fatal(err)
		}
		paths = append(paths, m...)
	}
	checked := 0
	for _, path := range paths {
		j, err := jobfile.LoadJob(path)
		if err != nil {
			continue // bad on purpose (the batch folder's typo, dimension, YAML)
		}
		var d *detail.Design
		if d, err = detail.Build(j); err != nil {
			p, perr := propose.Propose(j, propose.ProposeOptions{})
			if perr != nil || !p.Found() {
				continue // an unknown size, or stock in which nothing passes
			}
			d = p.Report.Design
		}
		rs, err := engine.Check(&d.Conn)
		if err != nil {
			t.Fatalf("%s: %v", path, err)
		}
		for _, r := range rs {
			for _, b := range engine.CheckWorking(r, d.Conn.Method) {
				t.Errorf("%s: %s", filepath.Base(path), b)
			}
		}
		checked++
	}
	t.Logf("%d jobs checked", checked)
	if checked < 20 {
		t.Errorf("only %d jobs checked", checked)
	}
}
