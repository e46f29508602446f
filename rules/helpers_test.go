package rules

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gaugeline/rules/units"
)

// Table lookups are compared exactly, up to the rounding of converting
// inches to mm: 1e-9 mm.
const lengthTol = 1e-9

func lookup(t *testing.T, name string, sys units.System) *Edition {
	t.Helper()
	ed, err := Lookup(name, sys)
	if err != nil {
		t.Fatalf("Lookup(%q, %v): %v", name, sys, err)
	}
	return ed
}

func us22(t *testing.T) *Edition { return lookup(t, "aisc360-22", units.US) }
func us16(t *testing.T) *Edition { return lookup(t, "aisc360-16", units.US) }
func si22(t *testing.T) *Edition { return lookup(t, "aisc360-22", units.SI) }
func si16(t *testing.T) *Edition { return lookup(t, "aisc360-16", units.SI) }

func in(x float64) units.Length { return units.Length(x) * units.Inch }
func mm(x float64) units.Length { return units.Length(x) * units.Millimetre }

func sameLength(a, b units.Length) bool { return math.Abs(float64(a-b)) <= lengthTol }

// sameValue compares converted stresses and forces to 1e-12 relative: the
// table value times an exact conversion factor, rounded once either way.
func sameValue(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Max(math.Abs(a), math.Abs(b)) }

// wantNotTabulated checks err is a *NotTabulatedError for table whose Key
// contains every one of keys.
func wantNotTabulated(t *testing.T, err error, table string, keys ...string) {
	t.Helper()
	var nt *NotTabulatedError
	if !errors.As(err, &nt) {
		t.Fatalf("error = %v, want *NotTabulatedError", err)
	}
	if nt.Table != table {
		t.Errorf("Table = %q, want %q", nt.Table, table)
	}
	for _, k := range keys {
		if !strings.Contains(nt.Key, k) {
			t.Errorf("Key = %q, want it to mention %q", nt.Key, k)
		}
	}
}
