package dxfout

import (
	"encoding/json"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// readTexts lists every TEXT of a drawing with its layer and insertion
// point, as ezdxf reads them.
const readTexts = `
import json, sys
import ezdxf
doc = ezdxf.readfile(sys.argv[1])
json.dump([{"layer": e.dxf.layer, "text": e.dxf.text, "x": e.dxf.insert.x, "y": e.dxf.insert.y}
           for e in doc.modelspace().query("TEXT")], sys.stdout)
`

// BR-20 (testdata/jobs/us-brace-two-ends.yaml, quantity 2): read by ezdxf,
// the cut sheet carries a BILL OF MATERIAL and a BOLT LIST on the notes
// layer, row by row. The member row: L4x4x1/2 14'-3" (171 in), 3.75 in²
// (AISC Manual Table 1-7, from memory) × 171 in × 490 lb/ft³ / 1728 =
// 181.8 lb each, 363.7 lb for 2. The near plate 1/2 × 12 × 19-1/2 in:
// 117 in³ × 490/1728 = 33.2 lb. Bolts: 3/4 in through 1/2 + 1/2 in: 1 + 1
// (RCSC Table C-2.1 as reproduced) = 2 in, 4 × 2 = 8; 7/8 in through 1/2 +
// 3/8: 7/8 + 1-1/8 = 2 in, 3 × 2 = 6.
func TestEzdxfBillOfMaterial(t *testing.T) {
	haveEzdxf(t)
	_, s := sheetOf(t, "../testdata/jobs/us-brace-two-ends.yaml")
	fs, err := Files(s)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), fs[0].Name)
	if fs[0].Name != "BR-20.dxf" {
		t.Fatalf("first file %s, want the sheet", fs[0].Name)
	}
	if err := os.WriteFile(path, fs[0].Data, 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command(python, "-c", readTexts, path).Output()
	if err != nil {
		t.Fatalf("ezdxf: %v", err)
	}
	var texts []struct {
		Layer, Text string
		X, Y        float64
	}
	if err := json.Unmarshal(out, &texts); err != nil {
		t.Fatal(err)
	}
	// Rows: the notes layer's texts on one baseline, left to right.
	rows := map[float64][]string{}
	var ys []float64
	xs := map[float64][]float64{}
	for _, x := range texts {
		if x.Layer != "notes" {
			continue
		}
		y := math.Round(x.Y*1e6) / 1e6
		if _, ok := rows[y]; !ok {
			ys = append(ys, y)
		}
		i, _ := slices.BinarySearch(xs[y], x.X)
		xs[y] = slices.Insert(xs[y], i, x.X)
		rows[y] = slices.Insert(rows[y], i, x.Text)
	}
	has := func(want ...string) bool {
		for _, y := range ys {
			if slices.Equal(rows[y], want) {
				return true
			}
		}
		return false
	}
	for _, want := range [][]string{
		{"BILL OF MATERIAL"},
		{"MARK", "QTY", "EACH", "SIZE", "GRADE", "CUT LENGTH", "WEIGHT EACH LB", "WEIGHT LB", "CAM FILE", "NOTE"},
		{"BR-20-M", "2", "1", "L4x4x1/2", "A36", `14'-3"`, "181.8", "363.7", "BR-20-member.cam.dxf"},
		{"BR-20-P", "2", "1", `PL 1/2" x 1'-0" x 1'-7 1/2"`, "A572-50", `1'-7 1/2"`, "33.2", "66.4", "BR-20-plate.cam.dxf", "NEAR END"},
		{"BOLT LIST"},
		{"8", "4", `3/4" A325 x 2"`, `1"`, "NEAR END", "MEMBER STANDARD, PLATE STANDARD", "NONE", "BEARING"},
		{"6", "3", `7/8" A325 x 2"`, `7/8"`, "FAR END", "MEMBER STANDARD, PLATE STANDARD", "NONE", "BEARING"},
	} {
		if !has(want...) {
			t.Errorf("no row %q on the notes layer", want)
		}
	}
	// The tables are the sheet's model, row for row.
	if len(s.BillOfMaterial) != 5 || len(s.BoltList) != 3 {
		t.Errorf("tables of %d and %d rows, want 5 (header, 3 pieces, total) and 3", len(s.BillOfMaterial), len(s.BoltList))
	}
	var notes string
	for _, x := range texts {
		notes += x.Text + "\n"
	}
	if !strings.Contains(notes, "RCSC SPECIFICATION TABLE C-2.1") {
		t.Error("the bolt list does not name the source of its length allowance")
	}
}
