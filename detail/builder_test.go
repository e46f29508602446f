package detail

import (
	"bytes"
	"gaugeline/detail/jobfile"
	"path/filepath"
	"reflect"
	"slices"
	"testing"
)

// TestProposeModelIsBuilds: the model propose checks for its chosen
// layout is, field for field, the one Build makes from the job file
// propose writes for it (the same steps: parts, placeHoles, placePlate).
// The fixtures are the repository's own propose jobs; the expectation is
// the identity of two paths, no outside value.
func TestProposeModelIsBuilds(t *testing.T) {
	files, _ := filepath.Glob("../testdata/propose/*.yaml")
	more, _ := filepath.Glob("../testdata/jobs/*.yaml")
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
		p.cache = map[candKey]*Report{}
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

// TestAsBuiltReportIsCheck: reverify's as-built report is Check of its
// as-built model, plus reverify's own cautions; in particular hole.size
// allows the fabrication tolerance through Check (MemberInfo.AsBuilt),
// not through a check of reverify's own. Fixtures: the measured files of
// testdata/measured (make_fixtures.py, ezdxf) with their jobs.
func TestAsBuiltReportIsCheck(t *testing.T) {
	us := filepath.Join(measuredDir, "hb-7-qa.yaml")
	sc := filepath.Join(measuredDir, "td-21-sc.yaml")
	for _, tc := range []struct {
		job, file string
		align     AlignMode
	}{
		{us, "hb-7-qa-enlarged-r2018.dxf", AlignDatum},
		{us, "hb-7-qa-shifted.csv", AlignBestFit},
		{us, "hb-7-qa-missing-r12.dxf", AlignDatum},
		{sc, "td-21-sc-enlarged-r2000.dxf", AlignDatum},
	} {
		ab := reverifyFile(t, tc.job, filepath.Join(measuredDir, tc.file), tc.align)
		r, err := Check(ab.Report.Design)
		if err != nil {
			t.Fatal(err)
		}
		if !reflect.DeepEqual(r.Findings, ab.Report.Findings) || r.Pass != ab.Report.Pass || r.Governing != ab.Report.Governing {
			t.Errorf("%s: Check of the as-built model differs from the as-built report:\n%+v\n%+v", tc.file, r.Findings, ab.Report.Findings)
		}
		if n := len(r.Cautions); n >= len(ab.Report.Cautions) || !slices.Equal(r.Cautions, ab.Report.Cautions[:n]) {
			t.Errorf("%s: the as-built cautions %q do not extend Check's %q", tc.file, ab.Report.Cautions, r.Cautions)
		}
		// Results hold functions (their working), which DeepEqual cannot
		// compare: the JSON of the two reports, cautions aside, holds
		// every number.
		r.Cautions = ab.Report.Cautions
		got, err1 := r.JSON()
		want, err2 := ab.Report.JSON()
		if err1 != nil || err2 != nil || !bytes.Equal(got, want) {
			t.Errorf("%s: the JSON of Check of the as-built model differs from the as-built report's (%v, %v)", tc.file, err1, err2)
		}
		sized := 0
		for _, f := range r.Findings {
			if f.ID == "hole.size" {
				sized++
			}
		}
		if sized == 0 {
			t.Errorf("%s: no hole.size finding to allow the tolerance on", tc.file)
		}
	}
}
