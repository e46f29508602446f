package measured

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// The fuzz targets check that no input makes a reader panic, that every
// refusal is an *Error naming the file, and that what is accepted is a
// bounded set of finite holes. Run them with, e.g.,
//
//	go test -fuzz FuzzReadDXF -fuzztime 2m ./detail/measured/
//
// A plain `go test` runs the seed corpus only.

func checkSet(t *testing.T, s *Set, err error) {
	t.Helper()
	if err != nil {
		var e *Error
		if !errors.As(err, &e) || e.File != "fuzz" || e.Msg == "" {
			t.Fatalf("error %v is not an *Error naming the file", err)
		}
		return
	}
	if len(s.Holes) == 0 || len(s.Holes) > MaxHoles {
		t.Fatalf("%d holes accepted", len(s.Holes))
	}
	for _, h := range s.Holes {
		for _, v := range []float64{h.X, h.Y, h.Width, h.Length, h.Axis} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("hole %+v is not finite", h)
			}
		}
		if !(h.Width > 0) || h.Length < h.Width-1e-9 || h.ID == "" {
			t.Fatalf("hole %+v", h)
		}
	}
}

func fixtures(f *testing.F, ext string) {
	files, _ := filepath.Glob(filepath.Join("..", "..", "testdata", "measured", "*"+ext))
	for _, p := range files {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b, "")
		}
	}
}

func FuzzReadCSV(f *testing.F) {
	fixtures(f, ".csv")
	for _, s := range []string{
		"1.5,2.5,0.8125\n4.5,2.5,0.8125,B\n",
		"x_mm;y_mm;diameter_mm;id\n40;55;22;A\n",
		"# c\n\nid\tx (in)\ty [in]\tdia\nH1\t1-1/2\t2.5\t13/16\n",
		"x,y,diameter\n1,2,3,4\n",
		"\ufeffx,y,d\r\n1e308,1e308,1e308\r\n",
		"x,y,diameter\n\"1\",'2',3\n,,\n",
	} {
		f.Add([]byte(s), "")
	}
	f.Fuzz(func(t *testing.T, data []byte, _ string) {
		s, err := ReadCSV(strings.NewReader(string(data)), "fuzz", Inches)
		checkSet(t, s, err)
	})
}

func FuzzReadDXF(f *testing.F) {
	fixtures(f, ".dxf")
	slot := "0\nLWPOLYLINE\n8\nholes\n90\n4\n70\n1\n10\n51\n20\n63\n10\n51\n20\n67\n42\n1.0\n10\n29\n20\n67\n10\n29\n20\n63\n42\n1.0\n"
	for _, s := range []string{
		dxf(1, "", rect("8", "4"), circleE("holes", "1.5", "2.5", "0.40625")),
		dxf(4, "", rect("300", "120"), slot),
		dxf(noUnits, "", "0\nPOLYLINE\n70\n1\n0\nVERTEX\n10\n0\n20\n0\n42\n0.4\n0\nVERTEX\n10\n9\n20\n0\n0\nVERTEX\n10\n9\n20\n9\n0\nSEQEND\n",
			circleE("0", "3", "3", "1"), "0\nCIRCLE\n10\n-5\n20\n5\n40\n1\n230\n-1\n"),
		dxf(4, "", "0\nLINE\n10\n0\n20\n0\n11\n5\n21\n0\n0\nARC\n10\n5\n20\n5\n40\n5\n50\n270\n51\n180\n0\nLINE\n10\n0\n20\n5\n11\n0\n21\n0\n",
			circleE("0", "2", "2", "0.5")),
		"0\nSECTION\n2\nENTITIES\n0\nLWPOLYLINE\n20\n1\n0\nEOF\n",
		"AutoCAD Binary DXF\r\n\x1a\x00",
	} {
		f.Add([]byte(s), "")
	}
	f.Add([]byte(dxf(1, "", circleE("HOLES", "1", "1", "1"))), "holes")
	f.Fuzz(func(t *testing.T, data []byte, layer string) {
		s, err := ReadDXF(strings.NewReader(string(data)), "fuzz", Millimetres, layer)
		checkSet(t, s, err)
	})
}
