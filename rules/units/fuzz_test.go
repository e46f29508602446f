package units

import (
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// FuzzParseQuantity checks that no string makes Parse or
// ParseBoltDiameter panic, that what they accept is finite, and that what
// they refuse is an error quoting the value (or saying it is empty). Its
// seeds are the parse tests' tables and the files under
// testdata/fuzz/FuzzParseQuantity (inputs the fuzzer once found, one per
// file). Run it with
//
//	go test -run=^$ -fuzz=FuzzParseQuantity -fuzztime=60s ./rules/units
func FuzzParseQuantity(f *testing.F) {
	for _, c := range parseCases {
		f.Add(c.in, uint8(c.dim), c.sys == SI)
	}
	for _, c := range parseErrorCases {
		f.Add(c.in, uint8(c.dim), false)
	}
	for _, s := range []string{"M20", "m 22.5", "M", "M20x2", " 7/8 ", `3'-99"`, `3'-13/4"`, "1e-400 in"} {
		f.Add(s, uint8(DimLength), true)
	}
	files, _ := filepath.Glob(filepath.Join("..", "..", "testdata", "fuzz", "FuzzParseQuantity", "*"))
	for _, p := range files {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(strings.TrimSuffix(string(b), "\n"), uint8(DimLength), false)
		}
	}
	f.Fuzz(func(t *testing.T, s string, dim uint8, si bool) {
		sys := US
		if si {
			sys = SI
		}
		d := Dim(dim % uint8(DimArea+1))
		v, err := Parse(s, d, sys)
		check(t, "Parse", s, v, err)
		l, err := ParseBoltDiameter(s, sys)
		check(t, "ParseBoltDiameter", s, float64(l), err)
	})
}

func check(t *testing.T, fn, s string, v float64, err error) {
	t.Helper()
	if err == nil {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			t.Fatalf("%s(%q) = %v, not finite", fn, s, v)
		}
		return
	}
	msg := err.Error()
	if strings.TrimSpace(normalizeMarks(s)) == "" {
		if !strings.HasPrefix(msg, "empty value") {
			t.Fatalf("%s(%q): %q, want it to say the value is empty", fn, s, msg)
		}
		return
	}
	if !strings.Contains(msg, strconv.Quote(s)) {
		t.Fatalf("%s(%q): %q does not quote the value", fn, s, msg)
	}
}
