package measured

import (
	"bytes"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// TestFixturesAreWhatTheScriptWrites regenerates the measured fixtures
// with testdata/measured/make_fixtures.py (Debian's python3-ezdxf, an
// independent DXF writer) and checks that the committed files read to the
// same holes and contour (the DXFs differ in their timestamps only) and
// that the CSVs are byte for byte the same. It skips when python3-ezdxf
// is absent (apt-get install python3-ezdxf).
func TestFixturesAreWhatTheScriptWrites(t *testing.T) {
	const python = "/usr/bin/python3"
	if out, err := exec.Command(python, "-c", "import ezdxf").CombinedOutput(); err != nil {
		t.Skipf("python3-ezdxf is not installed (%v: %s): install it with apt-get install python3-ezdxf", err, strings.TrimSpace(string(out)))
	}
	dir := filepath.Join("..", "..", "testdata", "measured")
	tmp := t.TempDir()
	if out, err := exec.Command(python, filepath.Join(dir, "make_fixtures.py"), "--out", tmp).CombinedOutput(); err != nil {
		t.Fatalf("make_fixtures.py: %v\n%s", err, out)
	}
	made, _ := filepath.Glob(filepath.Join(tmp, "*"))
	if len(made) < 15 {
		t.Fatalf("the script wrote %d files", len(made))
	}
	for _, p := range made {
		name := filepath.Base(p)
		fresh, err := os.ReadFile(p)
		if err != nil {
			t.Fatal(err)
		}
		committed, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil {
			t.Errorf("%s is written by the script but not committed: %v", name, err)
			continue
		}
		if strings.HasSuffix(name, ".csv") {
			if !bytes.Equal(fresh, committed) {
				t.Errorf("%s differs from what the script writes", name)
			}
			continue
		}
		a, errA := ReadDXF(bytes.NewReader(fresh), name, Millimetres, "")
		b, errB := ReadDXF(bytes.NewReader(committed), name, Millimetres, "")
		if errA != nil || errB != nil {
			t.Errorf("%s: %v / %v", name, errA, errB)
			continue
		}
		if len(a.Holes) != len(b.Holes) || len(a.Contour) != len(b.Contour) {
			t.Errorf("%s: %d holes / %d contour points, committed %d / %d", name, len(a.Holes), len(a.Contour), len(b.Holes), len(b.Contour))
			continue
		}
		for i := range a.Holes {
			ha, hb := a.Holes[i], b.Holes[i]
			if math.Abs(ha.X-hb.X) > 1e-9 || math.Abs(ha.Y-hb.Y) > 1e-9 || math.Abs(ha.Width-hb.Width) > 1e-9 || ha.Slot != hb.Slot {
				t.Errorf("%s hole %d: %+v, committed %+v", name, i, ha, hb)
			}
		}
	}
}
