package dxfout

import (
	"bytes"
	"sync"
	"testing"

	"github.com/yofu/dxf/color"
	"github.com/yofu/dxf/drawing"
	"github.com/yofu/dxf/table"
)

// The library keeps its default layer "0", line types and text style in
// package variables that drawing.New hands to every drawing. Whatever
// another user of the library does to them must not reach our files:
// changed here, the files are still the bytes drawn before.
func TestIndependentOfLibraryDefaults(t *testing.T) {
	want := map[string][]File{}
	for _, p := range jobs {
		fs, err := allFiles(p)
		if err != nil {
			t.Fatal(err)
		}
		want[p] = fs
	}
	font, height, lyColor, ltDesc := table.ST_STANDARD.FontName, table.ST_STANDARD.LastHeightUsed, table.LY_0.Color, table.LT_CONTINUOUS.Description
	t.Cleanup(func() {
		table.ST_STANDARD.FontName, table.ST_STANDARD.LastHeightUsed = font, height
		table.LY_0.Color, table.LT_CONTINUOUS.Description = lyColor, ltDesc
	})
	table.ST_STANDARD.FontName, table.ST_STANDARD.LastHeightUsed = "other.ttf", 42
	table.LY_0.Color, table.LT_CONTINUOUS.Description = color.Red, "changed by another user"
	for _, p := range jobs {
		got, err := allFiles(p)
		if err != nil {
			t.Fatal(err)
		}
		for i := range got {
			if !bytes.Equal(got[i].Data, want[p][i].Data) {
				t.Errorf("%s: %s changes with the library's package defaults", p, got[i].Name)
			}
		}
	}
}

// Drawing from several goroutines while another user of the library draws
// with its defaults: run with -race, nothing is shared.
func TestConcurrentWithOtherLibraryUsers(t *testing.T) {
	var wg sync.WaitGroup
	stop := make(chan struct{})
	wg.Go(func() {
		for {
			select {
			case <-stop:
				return
			default:
			}
			d := drawing.New()
			d.Text("other", 0, 0, 0, 3)
			var b bytes.Buffer
			if _, err := d.WriteTo(&b); err != nil {
				t.Error(err)
				return
			}
		}
	})
	var draw sync.WaitGroup
	for range 2 {
		draw.Go(func() {
			for _, p := range jobs {
				if _, err := allFiles(p); err != nil {
					t.Error(err)
				}
			}
		})
	}
	draw.Wait()
	close(stop)
	wg.Wait()
}

// Files writes the stamp's comment as it draws: each file is the bare
// drawing with Comment's line before it, a stamp with line breaks on one
// line.
func TestFilesStampLikeComment(t *testing.T) {
	_, s := sheetOf(t, "../testdata/jobs/us-pipe-rack-brace.yaml")
	s.Stamp = "gaugeline v1 sheet\r\nsha256:0123"
	fs, err := Files(s)
	if err != nil {
		t.Fatal(err)
	}
	bare, err := Sheet(s)
	if err != nil {
		t.Fatal(err)
	}
	want := [][]byte{Comment(bare, s.Stamp)}
	for i := range s.Views {
		b, err := CAM(&s.Views[i].Part, s.Units)
		if err != nil {
			t.Fatal(err)
		}
		want = append(want, Comment(b, s.Stamp))
	}
	if len(fs) != len(want) {
		t.Fatalf("%d files, want %d", len(fs), len(want))
	}
	for i, f := range fs {
		if !bytes.Equal(f.Data, want[i]) {
			t.Errorf("%s differs from Comment over the bare drawing", f.Name)
		}
		if first := "999\n" + CommentPrefix + "gaugeline v1 sheet  sha256:0123\n0\nSECTION\n"; !bytes.HasPrefix(f.Data, []byte(first)) {
			t.Errorf("%s starts %q, want %q", f.Name, f.Data[:min(len(f.Data), len(first))], first)
		}
	}
}
