package detail

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"gaugeline/rules/units"
)

func checkSrc(t *testing.T, src string) *Report {
	t.Helper()
	r, err := CheckJob(mustParse(t, src))
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// angleJob is a job of our own: one catalog angle, its length, into a
// gusset at each end.
func angleJob(units, size, length string) string {
	plate, bolts := `plate: {kind: gusset, thickness: 1/2 in, grade: A572-50, width: 12 in, edge: 1-1/2 in}
bolts: {diameter: 3/4 in, grade: A325, threads: included, per_line: 4, pitch: 3 in, end: 1-1/2 in, gage: 2-1/2 in}
`, "load: {required: 20 kip}\n"
	if units == "si" {
		plate = `plate: {kind: gusset, thickness: 12 mm, grade: A36, width: 260 mm, edge: 40 mm}
bolts: {diameter: M20, grade: A325M, threads: included, per_line: 3, pitch: 70 mm, end: 40 mm, gage: 55 mm}
`
		bolts = "load: {required: 100 kN}\n"
	}
	return "mark: W-1\nunits: " + units + "\n" + bolts + "member: {shape: angle, size: " + size + ", grade: A36, length: " + length + "}\n" + plate
}

// A catalog angle's weight per foot is its area × 490 lb/ft³ and matches
// the AISC Manual's Table 1-7 nominal weight to its rounding (0.1 lb/ft);
// an EN 10056-1 angle's mass per metre, area × 7850 kg/m³, the tables'
// 0.1 kg/m.
func TestAngleWeightsAgainstTheTables(t *testing.T) {
	for _, tc := range []struct {
		sys, size string
		perUnit   float64 // lb/ft or kg/m
		source    string
	}{
		{"us", "L4x4x1/2", 12.8, "AISC Manual Table 1-7 (AISC Shapes Database v15.0, read)"},
		{"us", "L6x6x1/2", 19.6, "AISC Manual Table 1-7 (AISC Shapes Database v15.0, read)"},
		{"us", "L3-1/2x3-1/2x3/8", 8.5, "AISC Manual Table 1-7 (AISC Shapes Database v15.0, read)"},
		{"si", "L100x100x10", 15.0, "EN 10056-1 tables (e.g. the Blue Book), from memory"},
	} {
		length, per := "10 ft", 10.0
		if tc.sys == "si" {
			length, per = "3 m", 3.0
		}
		r := checkSrc(t, angleJob(tc.sys, tc.size, length))
		m := r.Pieces()[0]
		got := m.Weight / per
		if math.Abs(got-tc.perUnit) > 0.05+1e-9 {
			t.Errorf("%s: %.3f per unit length, want %.1f (%s)", tc.size, got, tc.perUnit, tc.source)
		}
		if m.Mark != "W-1-M" || m.Size != tc.size || m.Each != 1 || m.Quantity != 1 || m.Part != "member" {
			t.Errorf("%s: member piece %+v", tc.size, m)
		}
	}
}

// Plates by hand: the rectangle 1/2 × 12 × 19-1/2 in (the sheet's plate of
// the 4-bolt pattern: free edge 1-1/2 in, 9 in of pattern, 9 in beyond it)
// weighs 117 in³ × 490/1728 = 33.18 lb; the clipped gusset of
// testdata/jobs/us-clipped-gusset.yaml, an 18 × 12 in outline less a
// 12 × 6 in corner triangle (36 in²), 180 in² × 1/2 in × 490/1728 = 25.52 lb,
// not its bounding box's 30.63 lb.
func TestPlateWeightsByHand(t *testing.T) {
	r := checkSrc(t, endsJob(""))
	ps := r.Pieces()
	if len(ps) != 2 {
		t.Fatalf("pieces %+v", ps)
	}
	p := ps[1]
	if p.Mark != "E-1-P" || p.Part != "plate" || p.Size != `PL 1/2" x 1'-0" x 1'-7 1/2"` || p.Each != 2 {
		t.Errorf("plate piece %+v", p)
	}
	if want := 117.0 * 490 / 1728; math.Abs(p.Weight-want) > 1e-9 {
		t.Errorf("plate weight %v lb, want %v (by hand)", p.Weight, want)
	}
	g := checkedJobs(t, "../testdata/jobs/us-clipped-gusset.yaml").Pieces()[1]
	if want := 180 * 0.5 * 490.0 / 1728; math.Abs(g.Weight-want) > 1e-9 {
		t.Errorf("clipped gusset %v lb, want %v (by hand: outline area, not the bounding box)", g.Weight, want)
	}
	if g.Length.In() < 18-1e-9 || g.Length.In() > 18+1e-9 || math.Abs(g.Width.In()-12) > 1e-9 {
		t.Errorf("clipped gusset extents %v × %v in, want 18 × 12", g.Length.In(), g.Width.In())
	}
	// The job's quantity 2: each piece twice, the plate (one each end) 4.
	if g.Quantity != 4 {
		t.Errorf("clipped gusset quantity %d, want 4 (2 off, one each end)", g.Quantity)
	}
}

func checkedJobs(t *testing.T, path string) *Report {
	t.Helper()
	r, err := CheckFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// Bolt lengths through the list: grip + the RCSC Table C-2.1 add-to-grip
// (as reproduced: 3/4 in adds 1, 7/8 adds 1-1/8), 5/32 in a hardened
// washer, next 1/4 in.
func TestBoltListLengths(t *testing.T) {
	in := func(l units.Length) float64 { return l.In() }
	// 3/4 through L4x4x1/2 + 1/2 in gusset: 1 + 1 = 2 in; a mirror far end:
	// 8 bolts each end... 4 a connection, 8 a member.
	bs := checkSrc(t, endsJob("")).BoltList()
	if len(bs) != 1 || bs[0].Each != 8 || in(bs[0].Grip) != 1 || math.Abs(in(bs[0].Length)-2) > 1e-9 || bs[0].End != "each end" || bs[0].Washers != 0 {
		t.Errorf("mirror: %+v", bs)
	}
	// A far end of its own: 7/8 through 1/2 + 3/8: 0.875 + 1.125 = 2 in.
	bs = checkSrc(t, endsJob(ownFarEnd)).BoltList()
	if len(bs) != 2 || bs[1].End != "far end" || bs[1].Each != 3 || math.Abs(in(bs[1].Length)-2) > 1e-9 || bs[0].Each != 4 {
		t.Errorf("own far end: %+v", bs)
	}
	// Plain: the near end's only.
	bs = checkSrc(t, endsJob("  far_end: plain\n")).BoltList()
	if len(bs) != 1 || bs[0].Each != 4 || bs[0].End != "near end" {
		t.Errorf("plain: %+v", bs)
	}
	// Fillers (testdata us-filler-gusset: 5/8 in): 1/2 + 5/8 + 1/2 = 1-5/8,
	// + 1 = 2-5/8 → 2-3/4 in.
	bs = checkedJobs(t, "../testdata/jobs/us-filler-gusset.yaml").BoltList()
	if math.Abs(in(bs[0].Grip)-1.625) > 1e-9 || math.Abs(in(bs[0].Length)-2.75) > 1e-9 {
		t.Errorf("fillers: grip %v, length %v in; want 1-5/8, 2-3/4", in(bs[0].Grip), in(bs[0].Length))
	}
	// A double angle: 2t + plate, SI: 2 × 8 + 12 = 28 mm, + 25.4 (the 3/4-in
	// row for M20) = 53.4 → 55 mm; each angle a piece.
	r := checkedJobs(t, "../testdata/jobs/si-double-angle.yaml")
	bs = r.BoltList()
	if bs[0].Grip != 28 || bs[0].Length != 55 {
		t.Errorf("double angle: grip %v, length %v mm; want 28, 55", bs[0].Grip, bs[0].Length)
	}
	if m := r.Pieces()[0]; m.Each != 2 || m.Size != "L100x75x8" {
		t.Errorf("double angle member piece %+v", m)
	}
}

// Washers (RCSC Section 6, from memory): an oversized hole in an outer ply
// gets an F436 washer over it (+5/32 in), a long slot a 5/16-in plate
// washer, Group B bolts pretensioned in steel of Fy under 40 ksi washers
// under head and nut. The faying note gives the slip class.
func TestBoltListWashers(t *testing.T) {
	job := func(bolts string) string {
		return strings.Replace(endsJob(""), "per_line: 4,", bolts+" per_line: 4,", 1)
	}
	// Oversized in both plies, slip-critical class A: 1 + 1 + 2(5/32) =
	// 2.3125 → 2-1/2 in.
	bs := checkSrc(t, job("joint: slip-critical, surface: A, hole: oversized,")).BoltList()
	if bs[0].Washers != 2 || math.Abs(bs[0].Length.In()-2.5) > 1e-9 || !strings.Contains(bs[0].Faying, "class A") ||
		!strings.Contains(bs[0].WasherNote, "oversized hole (member side)") {
		t.Errorf("oversized: %+v", bs[0])
	}
	// Long slots, transverse, slip-critical: a 5/16 plate washer each side:
	// 1 + 5/8 + 1 = 2.625 → 2-3/4 in.
	bs = checkSrc(t, job("joint: slip-critical, surface: B, hole: long-slot, slot: transverse,")).BoltList()
	if bs[0].Washers != 0 || math.Abs(bs[0].PlateWash.In()-0.625) > 1e-9 || math.Abs(bs[0].Length.In()-2.75) > 1e-9 ||
		!strings.Contains(bs[0].Faying, "class B") {
		t.Errorf("long slot: %+v", bs[0])
	}
	// A490 pretensioned, member A36 (Fy 36 < 40 ksi): washers under head and
	// nut: 1 + 1 + 5/16 = 2.3125 → 2-1/2 in. Bearing: none, no slip class.
	bs = checkSrc(t, strings.Replace(job("joint: pretensioned,"), "grade: A325", "grade: A490", 1)).BoltList()
	if bs[0].Washers != 2 || math.Abs(bs[0].Length.In()-2.5) > 1e-9 {
		t.Errorf("A490 in A36: %+v", bs[0])
	}
	bs = checkSrc(t, endsJob("")).BoltList()
	if !strings.HasPrefix(bs[0].Faying, "no slip class") || bs[0].WasherNote != "no washers required" {
		t.Errorf("bearing: %+v", bs[0])
	}
}

// Without member.length the JSON is the old one byte for byte (no bill of
// material); with it, bill_of_material and bolt_list follow the document.
func TestBOMOnlyWithLength(t *testing.T) {
	src := strings.Replace(endsJob(""), "  length: 10 ft\n", "", 1)
	r := checkSrc(t, src)
	if r.Pieces() != nil || r.BoltList() != nil {
		t.Fatal("pieces without member.length")
	}
	var want bytes.Buffer
	enc := json.NewEncoder(&want)
	enc.SetIndent("", "  ")
	if err := enc.Encode(r.Document()); err != nil {
		t.Fatal(err)
	}
	got := mustJSON(t, r)
	if !bytes.Equal(got, want.Bytes()) || bytes.Contains(got, []byte("bill_of_material")) {
		t.Error("JSON without member.length is not the document alone")
	}
	var text, md strings.Builder
	if err := r.WriteText(&text); err != nil {
		t.Fatal(err)
	}
	if err := r.WriteMarkdown(&md); err != nil {
		t.Fatal(err)
	}
	if strings.Contains(text.String(), "BILL OF MATERIAL") || strings.Contains(md.String(), "Bill of material") {
		t.Error("a report without member.length has a bill of material")
	}

	r = checkSrc(t, endsJob(ownFarEnd))
	var doc struct {
		BOM struct {
			Unit   string `json:"weight_unit"`
			Pieces []struct {
				Mark, CAM string
				Weight    float64 `json:"weight_each"`
			} `json:"pieces"`
			Total float64 `json:"total_weight"`
		} `json:"bill_of_material"`
		Bolts struct {
			Sets []struct {
				Length float64 `json:"length"`
			} `json:"sets"`
		} `json:"bolt_list"`
	}
	if err := json.Unmarshal(mustJSON(t, r), &doc); err != nil {
		t.Fatal(err)
	}
	ps := r.Pieces()
	if doc.BOM.Unit != "lb" || len(doc.BOM.Pieces) != 3 || len(doc.Bolts.Sets) != 2 || doc.Bolts.Sets[1].Length != 2 {
		t.Errorf("JSON bill of material %+v, bolts %+v", doc.BOM, doc.Bolts)
	}
	sum := 0.0
	for i, p := range ps {
		sum += p.TotalWeight()
		if doc.BOM.Pieces[i].Weight != p.Weight {
			t.Errorf("piece %d: JSON weight %v, want %v", i, doc.BOM.Pieces[i].Weight, p.Weight)
		}
	}
	if ps[2].Mark != "E-1-FP" || ps[2].Part != "far-plate" || ps[2].CAMFile("E-1") != "E-1-far-plate.cam.dxf" {
		t.Errorf("far plate piece %+v", ps[2])
	}
	if math.Abs(doc.BOM.Total-sum) > 1e-9 {
		t.Errorf("total %v, want %v", doc.BOM.Total, sum)
	}
	var text2 strings.Builder
	_ = r.WriteText(&text2)
	if !strings.Contains(text2.String(), "BILL OF MATERIAL") || !strings.Contains(text2.String(), `7/8" A325 x 2"`) {
		t.Errorf("text report lacks the bill of material or the far bolts:\n%s", text2.String())
	}
}

// A double splice (DS-12: PL 8x3/4 between two PL 1/2 x 8, 7/8-in bolts, two
// lines of 3 each side, plate ends 1-1/2 in past the last bolts, gap 1/4 in):
// the two splice plates of the joint, each both groups long, 2·(1-1/2 + 6
// + 1-1/2) + 1/4 = 18-1/4 in, weighing 0.5 × 8 × 18.25 in³ × 490/1728 lb/in³
// = 20.70 lb (by hand, 490 lb/ft³); 12 bolts through the joint (both
// groups) with a grip of 3/4 + 2 × 1/2 = 1-3/4 in, length 1-3/4 + 1-1/8 =
// 2-7/8 → 3 in (RCSC Table C-2.1 as reproduced: 7/8 in adds 1-1/8).
func TestBOMOfASplice(t *testing.T) {
	r := checkedJobs(t, "../testdata/jobs/us-double-splice.yaml")
	ps := r.Pieces()
	if len(ps) != 2 {
		t.Fatalf("%d pieces, want the member and the splice plates", len(ps))
	}
	s := ps[1]
	if s.Mark != "DS-12-S" || s.Each != 2 || math.Abs(s.Length.In()-18.25) > 1e-9 || math.Abs(s.Weight-0.5*8*18.25*490/1728) > 1e-9 {
		t.Errorf("splice plates: %+v, want 2 × PL 1/2 x 8 x 18-1/4 of 20.70 lb", s)
	}
	bs := r.BoltList()
	if len(bs) != 1 || bs[0].Each != 12 || math.Abs(bs[0].Grip.In()-1.75) > 1e-9 || math.Abs(bs[0].Length.In()-3) > 1e-9 {
		t.Errorf("bolt list %+v, want 12 bolts, grip 1-3/4 in, length 3 in", bs)
	}
}
