package fileset

import (
	"os"
	"path/filepath"
	"slices"
	"testing"
)

// Issue 11: names of different marks cannot collide; marks starting with
// '.' or '-' and the summary's own names are refused (common practice, no
// source: hidden files and option-like names).
func TestCheckName(t *testing.T) {
	for _, mark := range []string{"BR-12", "TD-21.b", "a_b", "A-member.cam"} {
		if err := CheckName(mark); err != nil {
			t.Errorf("CheckName(%q): %v", mark, err)
		}
	}
	for _, mark := range []string{"", "../x", "a/b", `a\b`, "C:x", ".x", "-rf", "summary.csv", "SUMMARY.md"} {
		if err := CheckName(mark); err == nil {
			t.Errorf("CheckName(%q) accepted it", mark)
		}
	}
}

// Every format that takes a comment gives back the stamp it was given;
// JSON, DXF and HTML are stamped by their writers in the same forms.
func TestStampRoundTrip(t *testing.T) {
	st := Stamp("gaugeline v1, go1.26", "check", "ab12")
	if StampInput(st) != "ab12" {
		t.Errorf("StampInput(%q) = %q", st, StampInput(st))
	}
	for _, f := range []File{
		Stamped(File{Name: "a.yaml", Data: []byte("mark: A\n")}, st),
		Stamped(File{Name: "a.csv", Data: []byte("x,y\n")}, st),
		Stamped(File{Name: "a.md", Data: []byte("# A\n")}, st),
		{Name: "a.json", Data: []byte(`{"mark": "A", "stamp": "` + st + `"}`)},
		{Name: "a.dxf", Data: []byte("999\n" + StampPrefix + st + "\n0\nSECTION\n")},
		{Name: "a.html", Data: []byte(`<meta name="gaugeline-stamp" content="` + st + `">`)},
		{Name: "a.nc1", Data: []byte("ST\n** " + StampPrefix + st + "\n  -\n")},
	} {
		if got, ok := FileStamp(f.Name, f.Data); !ok || got != st {
			t.Errorf("%s: stamp %q (%v), want %q", f.Name, got, ok, st)
		}
	}
	if _, ok := FileStamp("b.dxf", []byte("0\nSECTION\n")); ok {
		t.Error("an unstamped DXF reads as stamped")
	}
}

// Write replaces a set whole: no file of the old set survives, the
// manifest lists the new one, no staging folder is left; Remove takes it
// away; a folder that is not a set is refused and kept.
func TestWriteReplacesWhole(t *testing.T) {
	out := t.TempDir()
	write := func(files ...string) {
		t.Helper()
		s := Set{Name: "M1", Stamp: Stamp("t", "check", "00")}
		for _, n := range files {
			s.Files = append(s.Files, File{Name: n, Data: []byte(n)})
		}
		if err := Write(out, s); err != nil {
			t.Fatal(err)
		}
	}
	names := func(dir string) []string {
		entries, _ := os.ReadDir(dir)
		var n []string
		for _, e := range entries {
			n = append(n, e.Name())
		}
		return n
	}
	write("M1.json", "M1.dxf", "M1-plate.cam.dxf")
	write("M1.json")
	if got := names(filepath.Join(out, "M1")); !slices.Equal(got, []string{"M1.files", "M1.json"}) {
		t.Errorf("after the second write: %v", got)
	}
	if got := names(out); !slices.Equal(got, []string{"M1"}) {
		t.Errorf("output folder holds %v", got)
	}
	Remove(out, "M1")
	if got := names(out); len(got) != 0 {
		t.Errorf("after Remove: %v", got)
	}
	os.MkdirAll(filepath.Join(out, "M1"), 0o755)
	os.WriteFile(filepath.Join(out, "M1", "mine.pdf"), []byte("x"), 0o644)
	if err := Write(out, Set{Name: "M1", Files: []File{{Name: "M1.json"}}}); err == nil {
		t.Error("a folder that is not a set was replaced")
	}
	Remove(out, "M1")
	if got := names(filepath.Join(out, "M1")); !slices.Equal(got, []string{"mine.pdf"}) {
		t.Errorf("a folder that is not a set was touched: %v", got)
	}
}

// Only what gaugeline's writers name (staging folders and temporary files)
// is a leftover to clean; other hidden files are somebody's.
func TestIsLeftover(t *testing.T) {
	for name, want := range map[string]bool{
		".BR-7.new-123456": true, ".BR-7.old-99": true, ".summary.csv.4711.tmp": true,
		".A.new-1.new-2": true,
		LockName:         false, ".new-ideas": false, ".notes": false, ".x.tmp": false, "BR-7.new-1": false,
		".BR-7.new-": false, "..x.new-1": false,
	} {
		if got := IsLeftover(name); got != want {
			t.Errorf("IsLeftover(%q) = %v, want %v", name, got, want)
		}
	}
}
