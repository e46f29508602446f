package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gaugeline/detail"
)

// measuredDir holds the QA jobs and the measured files written by
// testdata/measured/make_fixtures.py with ezdxf, an independent program.
var measuredDir = filepath.Join(testdata, "measured")

type reverifyDoc struct {
	Verdict      string             `json:"verdict"`
	AsBuilt      string             `json:"as_built"`
	Part         string             `json:"part"`
	DesignRatios map[string]float64 `json:"design_ratios"`
	Alignment    struct {
		Mode        string  `json:"mode"`
		ShiftX      float64 `json:"shift_x"`
		ShiftY      float64 `json:"shift_y"`
		RotationDeg float64 `json:"rotation_deg"`
	} `json:"alignment"`
	Deviations []struct {
		ID     string  `json:"id"`
		Status string  `json:"status"`
		Dx     float64 `json:"dx"`
		Type   string  `json:"type"`
	} `json:"deviations"`
	LimitStates []struct {
		ID    string  `json:"id"`
		Ratio float64 `json:"ratio"`
	} `json:"limit_states"`
	Detailing []struct {
		ID   string `json:"id"`
		Pass bool   `json:"pass"`
	} `json:"detailing"`
	Cautions []string `json:"cautions"`
}

func TestReverifyThroughTheBinary(t *testing.T) {
	us := filepath.Join(measuredDir, "hb-7-qa.yaml")
	// The td-21 files are of one connection end: the job without
	// member.length, whose member is the near end alone.
	si := endOnly(t, filepath.Join(testdata, "jobs", "si-double-angle.yaml"))
	siSC := filepath.Join(measuredDir, "td-21-sc.yaml")
	tests := []struct {
		job, file string
		args      []string
		code      int
		verdict   string
		src       string
	}{
		{us, "hb-7-qa-nominal-r12.dxf", nil, 0, "accept", "nominal holes, Table J3.3 sizes"},
		{us, "hb-7-qa-nominal-mm-r2000.dxf", nil, 0, "accept", "as above, drawn in mm ($INSUNITS 4)"},
		{us, "hb-7-qa-nominal.csv", nil, 0, "accept", "as above"},
		{us, "hb-7-qa-shifted-r2018.dxf", nil, 3, "review", "0.1 in > 1/16 in (common practice, no source), passing"},
		{us, "hb-7-qa-shifted-r2018.dxf", []string{"--position", "1/8 in"}, 0, "accept", "0.1 in ≤ 1/8 in given on the command line"},
		{us, "hb-7-qa-end-short-r2000.dxf", nil, 1, "reject", "0.9 in < 1 in, AISC 360-22 Table J3.4"},
		{us, "hb-7-qa-missing-r12.dxf", nil, 1, "reject", "a hole missing, SPEC §8"},
		{us, "hb-7-qa-enlarged-r2018.dxf", nil, 1, "reject", "oversized in a bearing joint, AISC 360-22 J3.3"},
		{si, "td-21-nominal-r2018.dxf", nil, 0, "accept", "nominal, Table J3.3M"},
		{si, "td-21-nominal-r12.dxf", []string{"--layer", "HOLES"}, 0, "accept", "the layer named in any case"},
		{si, "td-21-scanned-r2018.dxf", []string{"--align", "best-fit"}, 0, "accept", "a rigid motion taken out by the fit"},
		{siSC, "td-21-sc-enlarged-r2000.dxf", nil, 3, "review", "oversized permitted slip-critical, AISC 360-16 J3.2"},
	}
	for _, tt := range tests {
		t.Run(tt.file+strings.Join(tt.args, ""), func(t *testing.T) {
			args := append([]string{"reverify", tt.job, "--measured", filepath.Join(measuredDir, tt.file), "--format", "json"}, tt.args...)
			r := gaugeline(t, ".", args...)
			var doc reverifyDoc
			if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
				t.Fatalf("exit %d, not JSON: %v\n%s%s", r.code, err, r.stdout, r.stderr)
			}
			if r.code != tt.code || doc.Verdict != tt.verdict {
				t.Errorf("exit %d verdict %s, want %d %s (%s); stderr %q", r.code, doc.Verdict, tt.code, tt.verdict, tt.src, r.stderr)
			}
			if len(doc.LimitStates) == 0 || len(doc.Detailing) == 0 || len(doc.DesignRatios) == 0 || len(doc.Deviations) == 0 || len(doc.Cautions) == 0 {
				t.Errorf("JSON lacks a section: %+v", doc)
			}
			if doc.Cautions[0] != detail.Caution {
				t.Errorf("first caution %q", doc.Cautions[0])
			}
		})
	}
	// The scan: rotation and shift as the script applied them (inputs).
	r := gaugeline(t, ".", "reverify", si, "--measured", filepath.Join(measuredDir, "td-21-scanned-r2018.dxf"), "--align", "best-fit", "--format", "json")
	var doc reverifyDoc
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatal(err)
	}
	if a := doc.Alignment; a.Mode != "best-fit" || abs(a.RotationDeg-2.5) > 1e-6 || abs(a.ShiftX-123.4) > 1e-6 || abs(a.ShiftY+56.7) > 1e-6 {
		t.Errorf("alignment %+v, want 2.5° and (123.4, -56.7) mm", a)
	}
}

// TestReverifyReadsOurCAMFiles feeds the CAM files that `gaugeline sheet`
// wrote (testdata/golden) back as measured parts, the plate's in its own
// frame (--part plate), by datum and by best fit: the holes are the
// design's, so each is accepted. The member's CAM file is the whole
// member, both ends' holes, and so is the member reverify matches.
func TestReverifyReadsOurCAMFiles(t *testing.T) {
	for _, c := range []struct{ job, cam, part string }{
		{"si-double-angle.yaml", "TD-21.b-member.cam.dxf", "member"},
		{"si-slotted.yaml", "KB-40-member.cam.dxf", "member"},
		{"si-double-angle.yaml", "TD-21.b-plate.cam.dxf", "plate"},
		{"si-slotted.yaml", "KB-40-plate.cam.dxf", "plate"},
		{"us-pipe-rack-brace.yaml", "PR-VB2-plate.cam.dxf", "plate"},
	} {
		cam := filepath.Join(testdata, "golden", c.cam)
		job := filepath.Join(testdata, "jobs", c.job)
		if _, err := os.Stat(cam); err != nil {
			t.Skipf("no %s: %v", cam, err)
		}
		for _, align := range []string{"datum", "best-fit"} {
			r := gaugeline(t, ".", "reverify", job, "--measured", cam, "--part", c.part, "--align", align, "--format", "json")
			var doc reverifyDoc
			if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
				t.Fatalf("%s: exit %d: %v\n%s", c.cam, r.code, err, r.stderr)
			}
			if r.code != 0 || doc.Verdict != "accept" || doc.Part != c.part || abs(doc.Alignment.RotationDeg) > 1e-6 {
				t.Errorf("%s --part %s --align %s: exit %d, verdict %s, part %q, rotation %g°", c.cam, c.part, align, r.code, doc.Verdict, doc.Part, doc.Alignment.RotationDeg)
			}
		}
	}
}

// endOnly writes the job without member.length into a new folder and
// returns it: its member is the near end alone, as a measured file of one
// connection end has it.
func endOnly(t *testing.T, job string) string {
	t.Helper()
	src, err := os.ReadFile(job)
	if err != nil {
		t.Fatal(err)
	}
	var keep []string
	for _, l := range strings.Split(string(src), "\n") {
		if !strings.HasPrefix(l, "  length:") {
			keep = append(keep, l)
		}
	}
	out := filepath.Join(t.TempDir(), filepath.Base(job))
	if err := os.WriteFile(out, []byte(strings.Join(keep, "\n")), 0o644); err != nil {
		t.Fatal(err)
	}
	return out
}

func abs(v float64) float64 {
	if v < 0 {
		return -v
	}
	return v
}

func TestReverifyTextAndMarkdown(t *testing.T) {
	job := filepath.Join(measuredDir, "hb-7-qa.yaml")
	m := filepath.Join(measuredDir, "hb-7-qa-enlarged-r2018.dxf")
	r := gaugeline(t, ".", "reverify", job, "--measured", m)
	if r.code != 1 || !strings.Contains(r.stdout, "verdict: REJECT") || !strings.Contains(r.stdout, "now an oversized hole") {
		t.Errorf("text: exit %d\n%s", r.code, r.stdout)
	}
	r = gaugeline(t, ".", "reverify", job, "--measured", m, "--format", "markdown")
	if r.code != 1 || !strings.Contains(r.stdout, "**Verdict: REJECT**") || !strings.Contains(r.stdout, detail.Caution) {
		t.Errorf("markdown: exit %d\n%s", r.code, r.stdout)
	}
}

func TestReverifyBadInputExits2(t *testing.T) {
	dir := t.TempDir()
	write := func(name, body string) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	md, err := filepath.Abs(measuredDir)
	if err != nil {
		t.Fatal(err)
	}
	job := filepath.Join(md, "hb-7-qa.yaml")
	tests := []struct {
		name string
		args []string
		want string // in the first stderr line
	}{
		{"bad row", []string{"--measured", write("bad.csv", "x,y,diameter\n1.5,2.5,0.8125\n4.5,two,0.8125\n")}, "bad.csv:3: y: \"two\" is not a number"},
		{"empty csv", []string{"--measured", write("empty.csv", "")}, "empty.csv: the file is empty"},
		{"huge csv", []string{"--measured", write("rows.csv", strings.Repeat("1,2,0.8\n", 2001))}, "rows.csv:2001: more than 2000 holes"},
		{"truncated dxf", []string{"--measured", write("cut.dxf", "0\nSECTION\n2\nENTITIES\n0\nCIRCLE\n10\n")}, "cut.dxf:7: group 10: the file ends before the group's value"},
		{"dxf bad number", []string{"--measured", write("num.dxf", "0\nSECTION\n2\nENTITIES\n0\nCIRCLE\n10\n1,5\n20\n1\n40\n1\n0\nENDSEC\n0\nEOF\n")}, "num.dxf:7: group 10: \"1,5\" is not a number"},
		{"dxf without holes", []string{"--measured", write("none.dxf", "0\nSECTION\n2\nENTITIES\n0\nENDSEC\n0\nEOF\n")}, "none.dxf: no holes found"},
		{"unknown type", []string{"--measured", write("holes.xlsx", "x")}, "holes.xlsx: --measured: unknown measured file type"},
		{"no such file", []string{"--measured", filepath.Join(dir, "nope.csv")}, "nope.csv: --measured: cannot read"},
		{"layer on csv", []string{"--measured", filepath.Join(md, "hb-7-qa-nominal.csv"), "--layer", "holes"}, "--layer is for DXF files"},
		{"no --measured", nil, "--measured is required"},
		{"bad --align", []string{"--measured", filepath.Join(md, "hb-7-qa-nominal.csv"), "--align", "sideways"}, "--align"},
		{"bad --position", []string{"--measured", filepath.Join(md, "hb-7-qa-nominal.csv"), "--position", "3 kip"}, "--position"},
		{"bad --format", []string{"--measured", filepath.Join(md, "hb-7-qa-nominal.csv"), "--format", "xml"}, "--format"},
		{"bad --part", []string{"--measured", filepath.Join(md, "hb-7-qa-nominal.csv"), "--part", "gusset"}, `--part: unknown part "gusset"`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r := gaugeline(t, dir, append([]string{"reverify", job}, tt.args...)...)
			first := strings.SplitN(r.stderr, "\n", 2)[0]
			if r.code != 2 || !strings.HasPrefix(first, "gaugeline: error: ") || !strings.Contains(first, tt.want) {
				t.Errorf("exit %d, stderr %q; want 2 and %q", r.code, r.stderr, tt.want)
			}
			if r.stdout != "" {
				t.Errorf("bad input wrote to stdout: %q", r.stdout)
			}
		})
	}
}

// A plate measured for a job that has none is bad input naming --part.
func TestReverifyPlateWithoutPlate(t *testing.T) {
	job := filepath.Join(testdata, "examples", "aisc-d2.yaml")
	r := gaugeline(t, ".", "reverify", job, "--measured", filepath.Join(measuredDir, "hb-7-qa-nominal.csv"), "--part", "plate")
	first := strings.SplitN(r.stderr, "\n", 2)[0]
	if r.code != 2 || !strings.Contains(first, "aisc-d2.yaml: --part: the job has no plate to measure") || r.stdout != "" {
		t.Errorf("exit %d, stderr %q, stdout %q", r.code, r.stderr, r.stdout)
	}
}

// TestReverifyBestFitFindsTheMislocatedHole: the plate of hb-7-qa measured
// with the whole plate shifted 1/2 in in x and y and hole H2 a further
// 1/4 in across the line (a construction: the design's holes in the
// plate's frame, at x' = 10.5, 7.5, 4.5, 1.5 in, y' = 6 in, moved by hand).
// The best fit must recover the 1/2 in shift from H1, H3, H4 and report
// H2 alone out of tolerance, 1/4 in off; the tolerance, 1/16 in, is the
// job's default (common practice, no source).
func TestReverifyBestFitFindsTheMislocatedHole(t *testing.T) {
	dir := t.TempDir()
	csv := filepath.Join(dir, "plate.csv")
	body := "x,y,diameter,id\n11.0,6.5,0.8125,P1\n8.0,6.75,0.8125,P2\n5.0,6.5,0.8125,P3\n2.0,6.5,0.8125,P4\n"
	if err := os.WriteFile(csv, []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
	job, _ := filepath.Abs(filepath.Join(measuredDir, "hb-7-qa.yaml"))
	r := gaugeline(t, dir, "reverify", job, "--measured", csv, "--part", "plate", "--align", "best-fit", "--format", "json")
	if r.code != 3 {
		t.Fatalf("exit %d, want 3 (review: out of tolerance, passing); stderr %s", r.code, r.stderr)
	}
	var doc struct {
		Alignment struct {
			ShiftX      float64  `json:"shift_x"`
			RotationDeg float64  `json:"rotation_deg"`
			FitOn       []string `json:"fit_on"`
			LeftOut     []string `json:"left_out_of_fit"`
		} `json:"alignment"`
		Deviations []struct {
			ID     string  `json:"id"`
			Status string  `json:"status"`
			Radial float64 `json:"radial"`
		} `json:"deviations"`
		Reasons []string `json:"reasons"`
	}
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatal(err)
	}
	a := doc.Alignment
	if math.Abs(a.ShiftX-0.5) > 1e-9 || math.Abs(a.RotationDeg) > 1e-9 ||
		strings.Join(a.FitOn, ",") != "H1,H3,H4" || strings.Join(a.LeftOut, ",") != "H2" {
		t.Errorf("alignment %+v; want shift x 1/2 in, no rotation, fit on H1, H3, H4, H2 left out", a)
	}
	for _, dv := range doc.Deviations {
		want, radial := "ok", 0.0
		if dv.ID == "H2" {
			want, radial = "out-of-tolerance", 0.25
		}
		if dv.Status != want || math.Abs(dv.Radial-radial) > 1e-9 {
			t.Errorf("%s: %s at %g in, want %s at %g in", dv.ID, dv.Status, dv.Radial, want, radial)
		}
	}
	if len(doc.Reasons) == 0 || doc.Reasons[0] != "out of tolerance: H2" {
		t.Errorf("reasons %q", doc.Reasons)
	}
	text := gaugeline(t, dir, "reverify", job, "--measured", csv, "--part", "plate", "--align", "best-fit")
	if !strings.Contains(text.stdout, "fit        taken on H1, H3, H4; left out H2") {
		t.Errorf("the text report does not say which holes the fit was taken on:\n%s", text.stdout)
	}
}
