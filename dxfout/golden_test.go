package dxfout

import (
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden DXF files under testdata/golden")

// goldenJobs: a US angle (failing: stamped sheet only), a US two-line flat
// with stagger (failing too), an SI double angle, an SI slotted angle, the
// demo (a passing US angle, so US CAM files too), a gusset whose outline
// has a clipped corner, a 16-ft brace with its title block, a brace whose
// far end has a connection of its own (its plate a CAM file of its own)
// and a double-plate splice of two flats (its splice plate's CAM file
// carries both groups). Each member is drawn whole, with a break.
var goldenJobs = []string{
	"../testdata/jobs/us-single-angle.yaml",
	"../testdata/jobs/us-staggered-flat.yaml",
	"../testdata/jobs/si-double-angle.yaml",
	"../testdata/jobs/si-slotted.yaml",
	"../testdata/jobs/us-pipe-rack-brace.yaml",
	"../testdata/jobs/us-clipped-gusset.yaml",
	"../testdata/jobs/us-brace-16ft.yaml",
	"../testdata/jobs/us-brace-two-ends.yaml",
	"../testdata/jobs/us-double-splice.yaml",
}

const goldenDir = "../testdata/golden"

// isFloatCode reports whether a group code carries a real number (DXF
// reference, group code value types).
func isFloatCode(c int) bool {
	return c >= 10 && c <= 59 || c >= 110 && c <= 149 || c >= 210 && c <= 239 || c >= 1010 && c <= 1059
}

// diffDXF compares two DXFs pair by pair: group codes exactly, reals
// within 1e-9 (absolute, in drawing units: far below the 1e-6 that
// matters, far above the last digit of the 16 written), anything else
// exactly. It returns the first difference, "" when there is none.
func diffDXF(got, want []byte) string {
	g, err := pairs(got)
	if err != nil {
		return "got: " + err.Error()
	}
	w, err := pairs(want)
	if err != nil {
		return "golden: " + err.Error()
	}
	entity := ""
	for i := range min(len(g), len(w)) {
		if w[i].code == 0 || w[i].code == 9 { // an entity or table entry; a header variable
			entity = w[i].value
		}
		if w[i].code == 5 && !strings.HasPrefix(entity, "$") {
			entity = strings.Fields(entity + " ")[0] + " #" + w[i].value
		}
		where := fmt.Sprintf("pair %d (in %s)", i, entity)
		if g[i].code != w[i].code {
			return fmt.Sprintf("%s: group code %d, golden %d", where, g[i].code, w[i].code)
		}
		if isFloatCode(w[i].code) {
			a, errA := strconv.ParseFloat(strings.TrimSpace(g[i].value), 64)
			b, errB := strconv.ParseFloat(strings.TrimSpace(w[i].value), 64)
			if errA == nil && errB == nil {
				if math.Abs(a-b) > 1e-9 {
					return fmt.Sprintf("%s: code %d value %v, golden %v", where, w[i].code, a, b)
				}
				continue
			}
		}
		if g[i].value != w[i].value {
			return fmt.Sprintf("%s: code %d value %q, golden %q", where, w[i].code, g[i].value, w[i].value)
		}
	}
	if len(g) != len(w) {
		return fmt.Sprintf("%d pairs, golden %d", len(g), len(w))
	}
	return ""
}

// The files drawn for each golden job match testdata/golden entity by
// entity; refresh with go test ./dxfout -update after a deliberate change,
// and look at the rendered sheets before committing them.
func TestGolden(t *testing.T) {
	for _, job := range goldenJobs {
		t.Run(filepath.Base(job), func(t *testing.T) {
			_, s := sheetOf(t, job)
			fs, err := Files(s)
			if err != nil {
				t.Fatal(err)
			}
			for _, f := range fs {
				path := filepath.Join(goldenDir, f.Name)
				if *update {
					if err := os.MkdirAll(goldenDir, 0o755); err != nil {
						t.Fatal(err)
					}
					if err := os.WriteFile(path, f.Data, 0o644); err != nil {
						t.Fatal(err)
					}
					continue
				}
				want, err := os.ReadFile(path)
				if err != nil {
					t.Fatalf("%v (run go test ./dxfout -update to create it)", err)
				}
				if d := diffDXF(f.Data, want); d != "" {
					t.Errorf("%s differs from the golden file: %s", f.Name, d)
				}
			}
		})
	}
}

func TestDiffDXF(t *testing.T) {
	a := []byte("0\nLINE\n5\n2A\n10\n1.0000000000\n0\nEOF\n")
	for _, tt := range []struct {
		name, b, want string
	}{
		{"same within tolerance", "0\nLINE\n5\n2A\n10\n1.0000000001\n0\nEOF\n", ""},
		{"float off", "0\nLINE\n5\n2A\n10\n1.001\n0\nEOF\n", "pair 2 (in LINE #2A): code 10 value 1, golden 1.001"},
		{"string off", "0\nCIRCLE\n5\n2A\n10\n1.0\n0\nEOF\n", `pair 0 (in CIRCLE): code 0 value "LINE", golden "CIRCLE"`},
		{"shorter", "0\nLINE\n5\n2A\n10\n1.0\n", "4 pairs, golden 3"},
	} {
		if got := diffDXF(a, []byte(tt.b)); got != tt.want {
			t.Errorf("%s: %q, want %q", tt.name, got, tt.want)
		}
	}
}
