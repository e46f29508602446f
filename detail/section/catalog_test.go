package section

import (
	"errors"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

func TestLookupSpellings(t *testing.T) {
	tests := []struct {
		in   string
		sys  units.System
		want string
	}{
		{"L4x4x1/2", units.US, "L4x4x1/2"},
		{"l4X4X1/2", units.US, "L4x4x1/2"},
		{" L 4 x 4 x 1/2 ", units.US, "L4x4x1/2"},
		{"L4×4×1/2", units.US, "L4x4x1/2"},
		{"L4x4x.5", units.US, "L4x4x1/2"},
		{"L 3-1/2x3-1/2x3/8", units.US, "L3-1/2x3-1/2x3/8"},
		{"L3 1/2 x 3 1/2 x 3/8", units.US, "L3-1/2x3-1/2x3/8"},
		{"L3.5x3.5x0.375", units.US, "L3-1/2x3-1/2x3/8"},
		{"L3-1/2x2-1/2x1/4", units.US, "L3-1/2x2-1/2x1/4"},
		{"L8x8x1-1/8", units.US, "L8x8x1-1/8"},
		{"L8x8x1.125", units.US, "L8x8x1-1/8"},
		{"L6x4x1/2", units.US, "L6x4x1/2"},
		{"L100x100x10", units.SI, "L100x100x10"},
		{"L100X100X10", units.SI, "L100x100x10"},
		{"l 150 × 90 × 10", units.SI, "L150x90x10"},
		{"L45x45x4.5", units.SI, "L45x45x4.5"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			a, err := Lookup(tc.in, tc.sys)
			require.NoError(t, err)
			assert.Equal(t, tc.want, a.Name)
			assert.Equal(t, tc.sys, a.System)
		})
	}
}

// Dimensions come out exact: US tables are stored in sixteenths of an inch
// and the SI radii are the published ones, K = t + r1.
func TestLookupDimensions(t *testing.T) {
	a, err := Lookup("L4x4x1/2", units.US)
	require.NoError(t, err)
	a.tab = tabulated{}
	assert.Equal(t, Angle{Name: "L4x4x1/2", System: units.US, A: 4 * units.Inch, B: 4 * units.Inch,
		T: units.Inch / 2, K: 7 * units.Inch / 8}, a, "kdet 7/8 in: "+aiscAngles)

	a, err = Lookup("L100x100x10", units.SI)
	require.NoError(t, err)
	assert.Equal(t, Angle{Name: "L100x100x10", System: units.SI, A: 100, B: 100, T: 10,
		R1: 12, R2: 6, K: 22}, a, "r1 12, r2 6: "+blueBook)
}

func TestLookupUnknown(t *testing.T) {
	tests := []struct {
		name     string
		in       string
		sys      units.System
		contains []string
	}{
		{"thickness not rolled", "L4x4x9/16", units.US,
			[]string{`"L4x4x9/16"`, "us catalog", "L4x4x3/4", "L4x4x1/4"}},
		{"short leg first", "L4x6x1/2", units.US,
			[]string{`"L4x6x1/2"`, "long leg first: L6x4x1/2"}},
		{"metric size in a US job", "L100x100x10", units.US,
			[]string{"L100x100x10 is in the si catalog"}},
		{"legs not in the catalog", "L110x110x10", units.SI,
			[]string{`"L110x110x10"`, "si catalog", "L100x100x10", "L120x120x12"}},
		{"legs between sizes", "L7x7x1/2", units.US,
			[]string{"L6x6x1/2", "L8x8x1/2"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Lookup(tc.in, tc.sys)
			require.Error(t, err)
			var ue *UnknownAngleError
			require.True(t, errors.As(err, &ue), "want *UnknownAngleError, got %T", err)
			assert.Equal(t, tc.in, ue.Designation)
			for _, s := range tc.contains {
				assert.Contains(t, err.Error(), s)
			}
		})
	}
}

func TestLookupMalformed(t *testing.T) {
	for _, in := range []string{"", "4x4x1/2", "L4x4", "L4x4x1/2x1", "Lx4x1/2", "L4x4x0", "L4x4x-1/2", "L4x4x1/0", "W8x31", "L4x4xinf"} {
		t.Run(in, func(t *testing.T) {
			_, err := Lookup(in, units.US)
			require.Error(t, err)
			assert.Contains(t, err.Error(), "cannot read angle designation")
			assert.Contains(t, err.Error(), `"`+in+`"`)
		})
	}
}

func TestNames(t *testing.T) {
	us := Names(units.US)
	si := Names(units.SI)
	// Catalog order: AISC Table 1-7 starts with the largest, thickest angle;
	// EN 10056-1 with the smallest.
	assert.Equal(t, "L8x8x1-1/8", us[0])
	assert.Equal(t, "L2x2x1/8", us[len(us)-1])
	assert.Equal(t, "L40x40x4", si[0])
	assert.Contains(t, si, "L200x200x24")
	assert.Contains(t, si, "L200x150x15")
	assert.Contains(t, us, "L4x4x1/4")
	assert.Contains(t, us, "L3-1/2x2-1/2x1/4")
	for _, names := range [][]string{us, si} {
		seen := map[string]bool{}
		for _, n := range names {
			assert.False(t, seen[n], "duplicate %s", n)
			seen[n] = true
		}
	}
	us[0] = "changed"
	assert.Equal(t, "L8x8x1-1/8", Names(units.US)[0], "Names returns a copy")
}

func TestCustom(t *testing.T) {
	a, err := Custom(150, 90, 10)
	require.NoError(t, err)
	assert.Equal(t, Angle{Name: "custom L150x90x10 mm", A: 150, B: 90, T: 10, K: 10}, a)

	tests := []struct {
		name     string
		a, b, t  units.Length
		contains string
	}{
		{"zero leg", 0, 90, 10, "connected leg"},
		{"negative outstanding leg", 150, -90, 10, "outstanding leg"},
		{"zero thickness", 150, 90, 0, "thickness"},
		{"thickness equals short leg", 150, 90, 90, "less than the shorter leg"},
		{"thickness exceeds short leg", 50, 150, 60, "less than the shorter leg"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Custom(tc.a, tc.b, tc.t)
			require.Error(t, err)
			assert.Contains(t, err.Error(), tc.contains)
		})
	}
}

// A custom angle without radii has the plain section of the US catalog.
func TestCustomMatchesPlainCatalog(t *testing.T) {
	cat, err := Lookup("L6x4x1/2", units.US)
	require.NoError(t, err)
	c, err := Custom(6*units.Inch, 4*units.Inch, units.Inch/2)
	require.NoError(t, err)
	assert.InDelta(t, float64(cat.Geometric().Xbar), float64(c.Properties().Xbar), 1e-9)
}
