package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"slices"
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

// TestReverifyWholeMember re-verifies the 16-ft L4x4x1/2 of
// testdata/jobs/us-brace-16ft.yaml (far_end: mirror) from whole-member
// files written by ezdxf (testdata/measured/make_piece_fixtures.py): both
// ends' holes are the member's design holes, so none is extra; a far-end
// hole drilled 1/4 in off is that hole alone, in the far end; a member cut
// 1/2 in short is a cut-length finding, and its far end distance, 1 in,
// fails edge.min (1-1/8 in for a 7/8-in bolt, AISC 360-22 Table J3.4).
// And the far end's own plate of testdata/jobs/us-brace-two-ends.yaml.
func TestReverifyWholeMember(t *testing.T) {
	brace := filepath.Join(testdata, "jobs", "us-brace-16ft.yaml")
	twoEnds := filepath.Join(testdata, "jobs", "us-brace-two-ends.yaml")
	type dev struct{ id, status, end string }
	const in = 1.0 // the job is in inches
	for _, c := range []struct {
		job, file, part, align string
		code                   int
		verdict                string
		out                    []dev // the holes not ok, with their end
		cut, cutDev            float64
		cutOK                  bool
		src                    string
	}{
		{brace, "br-16-member-nominal-r2000.dxf", "member", "datum", 0, "accept", nil, 192 * in, 0, true, "8 holes where the job puts them, 16 ft = 192 in"},
		{brace, "br-16-member-nominal-r2000.dxf", "member", "best-fit", 0, "accept", nil, 192 * in, 0, true, "as above, fitted"},
		{brace, "br-16-member-nominal.csv", "member", "datum", 0, "accept", nil, 0, 0, false, "a CSV has no contour: no cut length"},
		{brace, "br-16-member-far-off-r2000.dxf", "member", "datum", 3, "review", []dev{{"F3", "out-of-tolerance", "far"}}, 192 * in, 0, true, "1/4 in > 1/16 in (common practice, no source)"},
		{brace, "br-16-member-far-off-r2000.dxf", "member", "best-fit", 3, "review", []dev{{"F3", "out-of-tolerance", "far"}}, 192 * in, 0, true, "the robust fit leaves F3 out"},
		{brace, "br-16-member-short-r2000.dxf", "member", "datum", 1, "reject", nil, 191.5 * in, -0.5 * in, false, "cut 1/2 in short; far end 1 in < 1-1/8 in, Table J3.4"},
		{twoEnds, "br-20-far-plate-r2000.dxf", "far-plate", "datum", 0, "accept", nil, 0, 0, false, "3 holes of the far end's plate in its own frame"},
		{twoEnds, "br-20-far-plate-r2000.dxf", "far-plate", "best-fit", 0, "accept", nil, 0, 0, false, "as above, fitted"},
	} {
		name := c.file + "/" + c.part + "/" + c.align
		r := gaugeline(t, ".", "reverify", c.job, "--measured", filepath.Join(measuredDir, c.file), "--part", c.part, "--align", c.align, "--format", "json")
		var doc struct {
			Verdict    string   `json:"verdict"`
			Part       string   `json:"part"`
			Reasons    []string `json:"reasons"`
			Deviations []struct {
				ID, Status, End string
			} `json:"deviations"`
			Piece *struct {
				Length          float64  `json:"length"`
				MeasuredLength  *float64 `json:"measured_length"`
				LengthDeviation *float64 `json:"length_deviation"`
				InTol           *bool    `json:"length_within_tolerance"`
				Far             *struct {
					AsBuilt string   `json:"as_built"`
					Failing []string `json:"failing"`
				} `json:"far"`
			} `json:"piece"`
		}
		if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
			t.Fatalf("%s: exit %d, not JSON: %v\n%s", name, r.code, err, r.stderr)
		}
		if r.code != c.code || doc.Verdict != c.verdict || doc.Part != c.part {
			t.Errorf("%s: exit %d verdict %s part %s, want %d %s %s (%s); reasons %q", name, r.code, doc.Verdict, doc.Part, c.code, c.verdict, c.part, c.src, doc.Reasons)
		}
		var bad []dev
		for _, d := range doc.Deviations {
			if d.Status != "ok" {
				bad = append(bad, dev{d.ID, d.Status, d.End})
			}
		}
		if !slices.Equal(bad, c.out) {
			t.Errorf("%s: holes not ok %v, want %v (%s)", name, bad, c.out, c.src)
		}
		if c.part != "member" {
			if doc.Piece != nil || len(doc.Deviations) != 3 {
				t.Errorf("%s: piece %v, %d holes; want no piece and the plate's 3 holes", name, doc.Piece, len(doc.Deviations))
			}
			continue
		}
		if doc.Piece == nil || math.Abs(doc.Piece.Length-192*in) > 1e-6 || len(doc.Deviations) != 8 {
			t.Fatalf("%s: piece %+v, %d holes; want 192 in and 8 holes (4 each end)", name, doc.Piece, len(doc.Deviations))
		}
		if c.cut == 0 {
			if doc.Piece.MeasuredLength != nil {
				t.Errorf("%s: measured length %v without a contour", name, *doc.Piece.MeasuredLength)
			}
			continue
		}
		p := doc.Piece
		if p.MeasuredLength == nil || math.Abs(*p.MeasuredLength-c.cut) > 1e-6 || math.Abs(*p.LengthDeviation-c.cutDev) > 1e-6 || *p.InTol != c.cutOK {
			t.Errorf("%s: cut %v dev %v within %v, want %g %g %v (%s)", name, p.MeasuredLength, p.LengthDeviation, p.InTol, c.cut, c.cutDev, c.cutOK, c.src)
		}
		if c.verdict == "reject" && (p.Far == nil || p.Far.AsBuilt != "fail" || !slices.Contains(p.Far.Failing, "edge.min")) {
			t.Errorf("%s: far end as built %+v, want edge.min failing (%s)", name, p.Far, c.src)
		}
		if !c.cutOK && !slices.ContainsFunc(doc.Reasons, func(s string) bool { return strings.HasPrefix(s, "cut length out of tolerance: 0.5000 in short") }) {
			t.Errorf("%s: reasons %q, want the cut-length finding", name, doc.Reasons)
		}
	}
}

// TestReverifyPartTheJobHasNot: a part the job does not have is bad
// input naming --part (exit 2); an unknown part is a usage error.
func TestReverifyPartTheJobHasNot(t *testing.T) {
	brace := filepath.Join(testdata, "jobs", "us-brace-16ft.yaml")
	csv := filepath.Join(measuredDir, "br-16-member-nominal.csv")
	for _, c := range []struct{ part, want string }{
		{"far-plate", "--part: the job's far end has no plate of its own"},
		{"splice-1", "--part: the job has no splice plate to measure"},
		{"splice-2", "--part: the job has no second splice plate to measure"},
		{"splice-3", `--part: unknown part "splice-3" (want member, plate, far-plate, splice-1, splice-2, near-end or far-end)`},
	} {
		r := gaugeline(t, ".", "reverify", brace, "--measured", csv, "--part", c.part)
		if r.code != 2 || !strings.Contains(r.stderr, c.want) {
			t.Errorf("--part %s: exit %d %q, want 2 and %q", c.part, r.code, r.stderr, c.want)
		}
	}
	// FT_03 (testdata/jobs/us-staggered-flat.yaml) is a splice of one
	// plate (plate.count defaults to 1): it has splice-1 and no splice-2.
	ft := filepath.Join(testdata, "jobs", "us-staggered-flat.yaml")
	r := gaugeline(t, ".", "reverify", ft, "--measured", csv, "--part", "splice-2")
	if r.code != 2 || !strings.Contains(r.stderr, "--part: the job has no second splice plate") || !strings.Contains(r.stderr, "plate.count: 2") {
		t.Errorf("count-1 splice, --part splice-2: exit %d %q, want 2 naming --part and plate.count", r.code, r.stderr)
	}
	// A job without member.length is one connection end: no far end.
	hb := filepath.Join(measuredDir, "hb-7-qa.yaml")
	r = gaugeline(t, ".", "reverify", hb, "--measured", filepath.Join(measuredDir, "hb-7-qa-nominal.csv"), "--part", "far-end")
	if r.code != 2 || !strings.Contains(r.stderr, "--part: the job has no far end with holes to measure") {
		t.Errorf("no member.length, --part far-end: exit %d %q, want 2 naming --part", r.code, r.stderr)
	}
}

// TestReverifySplicePlate re-verifies a splice plate of DS-12
// (testdata/jobs/us-double-splice.yaml, two plates, gap 1/4 in) from
// fixtures written by ezdxf (testdata/measured/make_splice_fixtures.py;
// the hole positions there are worked by hand from the job, 12 holes on an
// 18.25 x 8 in plate), and from our own CAM file of the plate. Nominal:
// accept, all 12 holes matched (none extra), 6 in each member's group.
// Member B's second hole drilled 1/4 in off with the whole plate 1/2 in
// along x: under best fit exactly BH2 is out of tolerance (1/4 in >
// 1/16 in, common practice, no source), in member B's group, the fit
// shifted 1/2 in without rotation; under datum the contour's corner takes
// the shift the same way.
func TestReverifySplicePlate(t *testing.T) {
	ds := filepath.Join(testdata, "jobs", "us-double-splice.yaml")
	cam := t.TempDir()
	if r := gaugeline(t, ".", "sheet", ds, "-o", cam); r.code != 0 {
		t.Fatalf("sheet DS-12: exit %d %s", r.code, r.stderr)
	}
	type dev struct{ id, status, group string }
	for _, c := range []struct {
		file, part, align string
		code              int
		verdict, asPart   string
		out               []dev
		shiftX            float64
	}{
		{filepath.Join(measuredDir, "ds-12-splice-nominal-r2000.dxf"), "splice-1", "datum", 0, "accept", "splice-1", nil, 0},
		{filepath.Join(measuredDir, "ds-12-splice-nominal-r2000.dxf"), "splice-2", "best-fit", 0, "accept", "splice-2", nil, 0},
		{filepath.Join(measuredDir, "ds-12-splice-nominal-r2000.dxf"), "plate", "datum", 0, "accept", "splice-1", nil, 0},
		{filepath.Join(cam, "DS-12", "DS-12-plate.cam.dxf"), "splice-1", "datum", 0, "accept", "splice-1", nil, 0},
		{filepath.Join(cam, "DS-12", "DS-12-plate.cam.dxf"), "splice-2", "best-fit", 0, "accept", "splice-2", nil, 0},
		{filepath.Join(measuredDir, "ds-12-splice-b-off-shifted-r2000.dxf"), "splice-1", "best-fit", 3, "review", "splice-1", []dev{{"BH2", "out-of-tolerance", "B"}}, 0.5},
		{filepath.Join(measuredDir, "ds-12-splice-b-off-shifted-r2000.dxf"), "splice-2", "datum", 3, "review", "splice-2", []dev{{"BH2", "out-of-tolerance", "B"}}, 0.5},
	} {
		name := filepath.Base(c.file) + "/" + c.part + "/" + c.align
		r := gaugeline(t, ".", "reverify", ds, "--measured", c.file, "--part", c.part, "--align", c.align, "--format", "json")
		var doc struct {
			Verdict, Part string
			Reasons       []string
			Alignment     struct {
				ShiftX      float64 `json:"shift_x"`
				ShiftY      float64 `json:"shift_y"`
				RotationDeg float64 `json:"rotation_deg"`
			}
			Deviations []struct {
				ID, Status, Group string
				Radial            float64
			}
			Splice *struct {
				Plates  int
				Gap     float64
				MemberB *struct {
					AsBuilt string `json:"as_built"`
				} `json:"member_b"`
			}
		}
		if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
			t.Fatalf("%s: exit %d, not JSON: %v\n%s", name, r.code, err, r.stderr)
		}
		if r.code != c.code || doc.Verdict != c.verdict || doc.Part != c.asPart {
			t.Errorf("%s: exit %d verdict %s part %s, want %d %s %s; reasons %q", name, r.code, doc.Verdict, doc.Part, c.code, c.verdict, c.asPart, doc.Reasons)
		}
		if len(doc.Deviations) != 12 {
			t.Fatalf("%s: %d deviations, want the plate's 12 holes and no extra", name, len(doc.Deviations))
		}
		groups := map[string]int{}
		var bad []dev
		for _, d := range doc.Deviations {
			groups[d.Group]++
			if d.Status != "ok" {
				bad = append(bad, dev{d.ID, d.Status, d.Group})
				if math.Abs(d.Radial-0.25) > 1e-9 {
					t.Errorf("%s: %s off by %g in, want 1/4 in", name, d.ID, d.Radial)
				}
			}
		}
		if groups["A"] != 6 || groups["B"] != 6 {
			t.Errorf("%s: groups %v, want 6 holes of member A and 6 of member B", name, groups)
		}
		if !slices.Equal(bad, c.out) {
			t.Errorf("%s: holes not ok %v, want %v", name, bad, c.out)
		}
		if c.out != nil && (len(doc.Reasons) == 0 || doc.Reasons[0] != "out of tolerance: BH2 (member B)") {
			t.Errorf("%s: reasons %q, want BH2 in member B first", name, doc.Reasons)
		}
		a := doc.Alignment
		if math.Abs(a.ShiftX-c.shiftX) > 1e-9 || math.Abs(a.ShiftY) > 1e-9 || math.Abs(a.RotationDeg) > 1e-9 {
			t.Errorf("%s: alignment %+v, want shift x %g in, no rotation", name, a, c.shiftX)
		}
		if doc.Splice == nil || doc.Splice.Plates != 2 || math.Abs(doc.Splice.Gap-0.25) > 1e-9 || doc.Splice.MemberB == nil || doc.Splice.MemberB.AsBuilt != "pass" {
			t.Errorf("%s: splice %+v, want 2 plates, gap 1/4 in, member B passing as built", name, doc.Splice)
		}
	}
}

// TestReverifySpliceMemberBFails: member B's group is checked as built on
// its own. DS-12's BH3 drilled 1/2 in toward the splice plate's far end
// (x' = 17.25 in on an 18.25-in plate, testdata/measured/
// make_splice_fixtures.py) is 1 in from that end, under the 1-1/8 in of
// AISC 360-22 Table J3.4 for a 7/8-in bolt: member B's group fails
// edge.min while member A's passes, and the verdict (reject) covers the
// plate. A hole between B's gage lines, not in the design, is extra and
// counted in member B's group.
func TestReverifySpliceMemberBFails(t *testing.T) {
	ds := filepath.Join(testdata, "jobs", "us-double-splice.yaml")
	file := filepath.Join(measuredDir, "ds-12-splice-b-end-r2000.dxf")
	r := gaugeline(t, ".", "reverify", ds, "--measured", file, "--part", "splice-1", "--format", "json")
	var doc struct {
		Verdict    string
		AsBuilt    string `json:"as_built"`
		Reasons    []string
		Deviations []struct{ ID, Status, Group string }
		Splice     struct {
			MemberB struct {
				AsBuilt string `json:"as_built"`
				Failing []string
			} `json:"member_b"`
		}
	}
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatalf("exit %d, not JSON: %v\n%s", r.code, err, r.stderr)
	}
	if r.code != 1 || doc.Verdict != "reject" || doc.AsBuilt != "pass" || doc.Splice.MemberB.AsBuilt != "fail" ||
		!slices.Equal(doc.Splice.MemberB.Failing, []string{"edge.min"}) {
		t.Errorf("exit %d verdict %s, member A as built %s, member B %+v; want 1 reject, A pass, B failing edge.min", r.code, doc.Verdict, doc.AsBuilt, doc.Splice.MemberB)
	}
	if !slices.Contains(doc.Reasons, "member B's group fails as built: edge.min") || !slices.Contains(doc.Reasons, "out of tolerance: BH3 (member B)") {
		t.Errorf("reasons %q, want BH3 in member B and member B's group failing edge.min", doc.Reasons)
	}
	if n := len(doc.Deviations); n != 13 || doc.Deviations[n-1].Status != "extra" || doc.Deviations[n-1].Group != "B" {
		t.Errorf("deviations %+v, want 12 design holes and one extra in member B's group", doc.Deviations)
	}
	text := gaugeline(t, ".", "reverify", ds, "--measured", file, "--part", "splice-1")
	if !strings.Contains(text.stdout, "DETAILING (MEMBER B'S GROUP, AS BUILT)") || !strings.Contains(text.stdout, "BH3 to plate free edge") {
		t.Errorf("the text report has no member B section naming BH3:\n%s", text.stdout)
	}
	md := gaugeline(t, ".", "reverify", ds, "--measured", file, "--part", "splice-1", "--format", "markdown")
	if !strings.Contains(md.stdout, "## Member B's group: limit states as built") || !strings.Contains(md.stdout, "| hole | member |") {
		t.Errorf("the Markdown report has no member column or member B section:\n%s", md.stdout)
	}
}

// TestReverifyNoHoleOfAnEnd: a measured file with none of one end's (one
// group's) holes is rejected for the missing holes, not an internal
// error: BR-16's far holes alone (x = 192 - 1.5, - 4.5, - 7.5, - 10.5 in,
// y = 2.5 in, testdata/jobs/us-brace-16ft.yaml) as the whole member, and
// the slotted holes of KB-40 on DS-12's splice plate (none of them near
// member A's group).
func TestReverifyNoHoleOfAnEnd(t *testing.T) {
	far := filepath.Join(t.TempDir(), "far-only.csv")
	if err := os.WriteFile(far, []byte("x,y,diameter\n181.5,2.5,0.9375\n184.5,2.5,0.9375\n187.5,2.5,0.9375\n190.5,2.5,0.9375\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct{ job, file, part, missing string }{
		{filepath.Join(testdata, "jobs", "us-brace-16ft.yaml"), far, "member", "missing holes: H1 (near end), H2 (near end), H3 (near end), H4 (near end)"},
		{filepath.Join(testdata, "jobs", "us-double-splice.yaml"), filepath.Join(measuredDir, "kb-40-slots-r12.dxf"), "splice-1", "missing holes: H1 (member A)"},
	} {
		r := gaugeline(t, ".", "reverify", c.job, "--measured", c.file, "--part", c.part)
		if r.code != 1 || !strings.Contains(r.stdout, c.missing) || !strings.Contains(r.stdout, "nothing there is checked as built") {
			t.Errorf("%s on %s: exit %d, want 1 with %q and the caution\n%s%s", filepath.Base(c.file), filepath.Base(c.job), r.code, c.missing, r.stdout, r.stderr)
		}
	}
}

// TestReverifyEndStub: one end of BR-16 (testdata/jobs/us-brace-16ft.yaml,
// 16 ft, far_end mirror) measured alone, 4 holes at x = 1.5 4.5 7.5
// 10.5 in, y = 2.5 in from that end's cut end and the heel (the job's
// pattern): near-end and far-end both accept it with 4 holes and none
// missing, where --part member (the whole member) finds the other end's
// 4 holes missing.
func TestReverifyEndStub(t *testing.T) {
	brace := filepath.Join(testdata, "jobs", "us-brace-16ft.yaml")
	stub := filepath.Join(measuredDir, "br-16-end-stub.csv")
	for _, c := range []struct {
		part, align, verdict string
		code, holes          int
	}{
		{"near-end", "datum", "accept", 0, 4},
		{"near-end", "best-fit", "accept", 0, 4},
		{"far-end", "datum", "accept", 0, 4},
		{"far-end", "best-fit", "accept", 0, 4},
		{"member", "datum", "reject", 1, 8},
	} {
		r := gaugeline(t, ".", "reverify", brace, "--measured", stub, "--part", c.part, "--align", c.align, "--format", "json")
		var doc struct {
			Verdict, Part string
			Deviations    []struct{ ID, Status string }
		}
		if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
			t.Fatalf("%s/%s: exit %d, not JSON: %v\n%s", c.part, c.align, r.code, err, r.stderr)
		}
		missing := 0
		for _, d := range doc.Deviations {
			if d.Status == "missing" {
				missing++
			}
		}
		if r.code != c.code || doc.Verdict != c.verdict || doc.Part != c.part || len(doc.Deviations) != c.holes || missing != c.holes-4 {
			t.Errorf("%s/%s: exit %d verdict %s part %s, %d holes (%d missing); want %d %s, %d holes (%d missing)",
				c.part, c.align, r.code, doc.Verdict, doc.Part, len(doc.Deviations), missing, c.code, c.verdict, c.holes, c.holes-4)
		}
	}
	// The far end of testdata/jobs/us-brace-two-ends.yaml is a connection
	// of its own, 3 bolts (x = 1.5 4.5 7.5 in): far-end takes its design,
	// so the stub's 4th hole is extra, and it lies past that plate's free
	// edge (7.5 + 1.5 = 9 in < 10.5 in): edge.min fails, reject.
	twoEnds := filepath.Join(testdata, "jobs", "us-brace-two-ends.yaml")
	r := gaugeline(t, ".", "reverify", twoEnds, "--measured", stub, "--part", "far-end", "--format", "json")
	var own struct {
		Verdict    string
		Failing    []string
		Deviations []struct{ ID, Status string }
	}
	if err := json.Unmarshal([]byte(r.stdout), &own); err != nil {
		t.Fatalf("two ends, far-end: exit %d, not JSON: %v\n%s", r.code, err, r.stderr)
	}
	var got []string
	for _, d := range own.Deviations {
		got = append(got, d.ID+" "+d.Status)
	}
	if r.code != 1 || own.Verdict != "reject" || !slices.Contains(own.Failing, "edge.min") ||
		!slices.Equal(got, []string{"H1 ok", "H2 ok", "H3 ok", "X1 extra"}) {
		t.Errorf("two ends, far-end: exit %d verdict %s failing %v holes %v; want 1 reject, edge.min, H1-H3 ok and X1 extra", r.code, own.Verdict, own.Failing, got)
	}
	text := gaugeline(t, ".", "reverify", brace, "--measured", stub, "--part", "far-end")
	if !strings.Contains(text.stdout, "far-end: the far end's holes alone (an end stub)") || !strings.Contains(text.stdout, "x from the far cut end") {
		t.Errorf("the far-end report does not say which part and frame:\n%s", text.stdout)
	}
}
