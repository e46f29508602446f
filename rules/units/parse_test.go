package units

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"pgregory.net/rapid"
)

// Sources quoted by the tables below.
const (
	srcInch = "exact by definition of the inch, 1 in = 25.4 mm (NIST SP 811, App. B)"
	srcFoot = "exact: 1 ft = 12 in = 304.8 mm (NIST SP 811, App. B)"
	srcSI   = "exact by the SI prefixes (BIPM SI Brochure, 9th ed., Table 7)"
	srcLbf  = "exact: 1 lbf = 4.4482216152605 N (NIST SP 811, App. B.8); 1 kip = 1000 lbf"
	srcPsi  = "exact from the lbf and inch: 1 psi = 4.4482216152605 N / 645.16 mm² = 6.894757293168361e-3 MPa (NIST SP 811, App. B.8 lists 6.894757 kPa)"
	srcMPa  = "exact by definition: 1 MPa = 1 N/mm² (SI Brochure)"
	srcSqIn = "exact: 1 in² = 25.4² mm² = 645.16 mm² (NIST SP 811, App. B)"
	srcBare = "gaugeline convention: a bare number is in the default unit of the job's system (package doc)"
	srcShop = "shop convention: feet-inches to the nearest 1/16 in (common practice, no source)"
	srcJob  = "gaugeline job-file spelling, chosen so Parse reads it back (no external source)"
	srcM    = "ISO 261: the metric thread designation M20 is a 20 mm nominal diameter"
)

// relTol is the relative tolerance for parsed values: every conversion is
// exact by definition, so only the rounding of one or two float64
// operations (about 1.1e-16 relative each) separates the parsed value from
// the decimal written in the table.
const relTol = 1e-12

func assertClose(t *testing.T, want, got float64, msg string) {
	t.Helper()
	tol := relTol * math.Max(1, math.Abs(want))
	assert.InDelta(t, want, got, tol, msg)
}

// parseCases are the quantities Parse reads (also FuzzParseQuantity's
// seeds).
var parseCases = []struct {
	name string
	in   string
	dim  Dim
	sys  System
	want float64 // internal units: mm, N, MPa, mm²
	src  string
}{
	// Lengths.
	{"fraction in", "3/4 in", DimLength, US, 19.05, srcInch},
	{"mixed in with dash", "1-1/2 in", DimLength, US, 38.1, srcInch},
	{"mixed in with space", "1 1/2 in", DimLength, US, 38.1, srcInch},
	{"decimal in", "2.5 in", DimLength, US, 63.5, srcInch},
	{"whole in", "3 in", DimLength, US, 76.2, srcInch},
	{"inch mark", `1.5"`, DimLength, US, 38.1, srcInch},
	{"feet-inches mixed", `3'-6 1/2"`, DimLength, US, 1079.5, srcInch + "; 3'-6 1/2\" = 42.5 in"},
	{"feet-inches whole", `3'-6"`, DimLength, US, 1066.8, srcInch + "; 3'-6\" = 42 in"},
	{"feet space inches dash", `3' 6-1/2"`, DimLength, US, 1079.5, srcInch + "; 42.5 in"},
	{"feet no separator", `3'6"`, DimLength, US, 1066.8, srcInch + "; 42 in"},
	{"feet only", `3'`, DimLength, US, 914.4, srcFoot},
	{"ft", "12 ft", DimLength, US, 3657.6, srcFoot},
	{"decimal ft", "1.5 ft", DimLength, US, 457.2, srcFoot},
	{"feet word", "2 feet", DimLength, US, 609.6, srcFoot},
	{"foot word", "1 foot", DimLength, US, 304.8, srcFoot},
	{"ft and in words", "3 ft 6 in", DimLength, US, 1066.8, srcInch + "; 42 in"},
	{"ft and in glued", "3ft-6in", DimLength, US, 1066.8, srcInch + "; 42 in"},
	{"feet-inches largest inch part", `3'-11 15/16"`, DimLength, US, 1217.6125, srcInch + "; 47 15/16 in"},
	{"feet-inches fraction only", `3'-3/4"`, DimLength, US, 933.45, srcInch + "; 36.75 in"},
	{"feet-inches decimal inches", `3'-11.5"`, DimLength, US, 1206.5, srcInch + "; 47.5 in"},
	{"feet-inches zero inches", `3'-0"`, DimLength, US, 914.4, srcFoot},
	{"feet-inches zero feet", `0'-6"`, DimLength, US, 152.4, srcInch},
	{"feet-inches spaced dash", `3' - 6"`, DimLength, US, 1066.8, srcInch + "; 42 in"},
	{"decimal feet alone", `2.5'`, DimLength, US, 762, srcFoot},
	{"inch word", "1 inch", DimLength, US, 25.4, srcInch},
	{"inches word", "2 inches", DimLength, US, 50.8, srcInch},
	{"mm", "20 mm", DimLength, US, 20, srcSI},
	{"m", "3.2 m", DimLength, US, 3200, srcSI},
	{"cm", "2.5 cm", DimLength, SI, 25, srcSI},
	{"millimetres word", "12 millimetres", DimLength, SI, 12, srcSI},
	{"upper case unit", "3/4 IN", DimLength, US, 19.05, srcInch},
	{"whitespace", "  3/4\tin  ", DimLength, US, 19.05, srcInch},
	{"no space before unit", "20mm", DimLength, US, 20, srcSI},
	{"typographic primes", "3′-6″", DimLength, US, 1066.8, srcInch + "; 42 in"},
	{"doubled apostrophe as inch", "6''", DimLength, US, 152.4, srcInch},
	{"leading point", ".5 in", DimLength, US, 12.7, srcInch},
	{"exponent", "1e3 mm", DimLength, SI, 1000, srcSI},
	{"plus sign", "+2 in", DimLength, US, 50.8, srcInch},
	{"negative in", "-3 in", DimLength, US, -76.2, srcInch + "; Parse leaves sign to callers"},
	{"negative mixed", "-1-1/2 in", DimLength, US, -38.1, srcInch + "; sign applies to the whole number"},
	{"negative feet-inches", `-3'-6"`, DimLength, US, -1066.8, srcInch + "; sign applies to the whole quantity"},
	{"zero", "0", DimLength, US, 0, srcBare},
	{"bare decimal us", "1.5", DimLength, US, 38.1, srcBare + "; " + srcInch},
	{"bare fraction us", "3/4", DimLength, US, 19.05, srcBare + "; " + srcInch},
	{"bare mixed us", "1-1/2", DimLength, US, 38.1, srcBare + "; " + srcInch},
	{"bare decimal si", "1.5", DimLength, SI, 1.5, srcBare},
	{"bare whole si", "20", DimLength, SI, 20, srcBare},
	{"improper fraction", "5/4 in", DimLength, US, 31.75, srcInch},

	// Forces.
	{"kip", "95 kip", DimForce, US, 422581.0534497475, srcLbf},
	{"kips", "95 kips", DimForce, SI, 422581.0534497475, srcLbf},
	{"kN", "400 kN", DimForce, US, 400000, srcSI},
	{"kN lower", "400 kn", DimForce, US, 400000, srcSI},
	{"N", "1500 N", DimForce, US, 1500, srcSI},
	{"lb", "95000 lb", DimForce, US, 422581.0534497475, srcLbf},
	{"lbf", "95000 lbf", DimForce, US, 422581.0534497475, srcLbf},
	{"bare kip", "95", DimForce, US, 422581.0534497475, srcBare + "; " + srcLbf},
	{"bare kN", "400", DimForce, SI, 400000, srcBare + "; " + srcSI},

	// Stresses.
	{"ksi", "50 ksi", DimStress, US, 344.73786465841805, srcPsi},
	{"MPa", "345 MPa", DimStress, US, 345, srcMPa},
	{"N/mm2", "345 N/mm2", DimStress, US, 345, srcMPa},
	{"N/mm^2", "345 N/mm^2", DimStress, US, 345, srcMPa},
	{"N/mm²", "345 N/mm²", DimStress, US, 345, srcMPa},
	{"psi", "36000 psi", DimStress, SI, 248.211262554061, srcPsi},
	{"bare ksi", "50", DimStress, US, 344.73786465841805, srcBare + "; " + srcPsi},
	{"bare MPa", "345", DimStress, SI, 345, srcBare},

	// Areas.
	{"in2", "3.75 in2", DimArea, US, 2419.35, srcSqIn},
	{"in^2", "3.75 in^2", DimArea, US, 2419.35, srcSqIn},
	{"in²", "3.75 in²", DimArea, US, 2419.35, srcSqIn},
	{"sq in", "3.75 sq in", DimArea, US, 2419.35, srcSqIn},
	{"mm2", "1920 mm2", DimArea, US, 1920, srcSI},
	{"cm2", "19.2 cm2", DimArea, US, 1920, srcSI},
	{"bare in2", "3.75", DimArea, US, 2419.35, srcBare + "; " + srcSqIn},
	{"bare mm2", "1920", DimArea, SI, 1920, srcBare},

	// Numbers.
	{"number decimal", "1.5", Dimensionless, US, 1.5, srcBare},
	{"number fraction", "3/4", Dimensionless, SI, 0.75, srcBare},
	{"number mixed", "1-1/2", Dimensionless, US, 1.5, srcBare},
}

func TestParse(t *testing.T) {
	for _, tt := range parseCases {
		t.Run(tt.name, func(t *testing.T) {
			got, err := Parse(tt.in, tt.dim, tt.sys)
			require.NoError(t, err)
			assertClose(t, tt.want, got, tt.src)
		})
	}
}

// parseErrorCases are the strings Parse refuses (also FuzzParseQuantity's
// seeds).
var parseErrorCases = []struct {
	name string
	in   string
	dim  Dim
	want string // a fragment of the message
	src  string
}{
	{"force as length", "3 kip", DimLength, `"3 kip" is a force, not a length`, "dimension mismatch"},
	{"length as force", "3 in", DimForce, `"3 in" is a length, not a force`, "dimension mismatch"},
	{"feet-inches as stress", `3'-6"`, DimStress, "is a length, not a stress", "dimension mismatch"},
	{"feet as force", "12 ft", DimForce, "is a length, not a force", "dimension mismatch"},
	{"area as length", "3 in2", DimLength, "is an area, not a length", "dimension mismatch"},
	{"stress as area", "50 ksi", DimArea, "is a stress, not an area", "dimension mismatch"},
	{"mm as stress", "20 mm", DimStress, "is a length, not a stress", "dimension mismatch"},
	{"unit on a number", "3 in", Dimensionless, "is a length, not a number", "numbers take no unit"},
	{"feet on a number", `3'`, Dimensionless, "is a length, not a number", "numbers take no unit"},
	{"not a quantity", "abc", DimLength, `"abc" is not a quantity`, "no number"},
	{"unit only", "in", DimLength, "is not a quantity", "no number"},
	{"point only", ". in", DimLength, "is not a quantity", "no number"},
	{"empty", "", DimLength, "empty value", "no number"},
	{"blank", " \t ", DimForce, "empty value", "no number"},
	{"unknown unit", "3 furlongs", DimLength, `unknown unit "furlongs"`, "unknown unit"},
	{"unknown unit m20", "M20", DimLength, "is not a quantity", "Parse does not read bolt designations"},
	{"NaN", "NaN", DimLength, "NaN is not a number", "not finite"},
	{"NaN in", "NaN in", DimLength, "NaN is not a number", "not finite"},
	{"nan mm", "nan mm", DimLength, "NaN is not a number", "not finite"},
	{"inf mm", "inf mm", DimLength, "infinity is not a number", "not finite"},
	{"-Inf in", "-Inf in", DimLength, "infinity is not a number", "not finite"},
	{"Infinity", "Infinity", DimForce, "infinity is not a number", "not finite"},
	{"overflow", "1e999 in", DimLength, "out of range", "not finite"},
	{"negative overflow", "-1e999 mm", DimLength, "out of range", "not finite"},
	{"overflow after conversion", "1e308 ft", DimLength, "out of range", "not finite"},
	{"overflow kip", "1e308 kip", DimForce, "out of range", "not finite"},
	{"division by zero", "1/0 in", DimLength, `"1/0 in": division by zero`, "malformed fraction"},
	{"mixed division by zero", "1-1/0 in", DimLength, "division by zero", "malformed fraction"},
	{"bare division by zero", "0/0", Dimensionless, "division by zero", "malformed fraction"},
	{"no denominator", "1/ in", DimLength, "malformed fraction", "malformed fraction"},
	{"no numerator", "/2 in", DimLength, "is not a quantity", "malformed fraction"},
	{"double slash", "1//2 in", DimLength, "malformed fraction", "malformed fraction"},
	{"two slashes", "1/2/3 in", DimLength, "malformed fraction", "malformed fraction"},
	{"decimal denominator", "1/2.5 in", DimLength, "malformed fraction", "malformed fraction"},
	{"improper mixed", "1-3/2 in", DimLength, "malformed fraction", "malformed fraction"},
	{"mixed denominator missing", "1 1/ in", DimLength, "malformed fraction", "malformed fraction"},
	{"trailing word", "3 in foo", DimLength, "unknown unit", "trailing junk"},
	{"trailing semicolon", "3 in;", DimLength, "unknown unit", "trailing junk"},
	{"trailing junk bare", "3 x", DimLength, "unknown unit", "trailing junk"},
	{"two numbers", "1 2 in", DimLength, "malformed number", "trailing junk"},
	{"two points", "1.2.3 in", DimLength, "malformed number", "trailing junk"},
	{"decimal numerator", "1.5/2 in", DimLength, "malformed number", "trailing junk"},
	{"double sign", "--3 in", DimLength, "is not a quantity", "trailing junk"},
	{"spaced sign", "- 3 in", DimLength, "is not a quantity", "trailing junk"},
	{"inches without mark", `3'-6`, DimLength, "want feet-inches", "malformed feet-inches"},
	{"inch mark without number", `3'-"`, DimLength, "no inches after the feet", "malformed feet-inches"},
	{"junk after inches", `3'-6" x`, DimLength, "want feet-inches", "malformed feet-inches"},
	{"mm after feet", `3'-6 mm`, DimLength, "want feet-inches", "malformed feet-inches"},
	{"feet twice", "3 ft 6 ft", DimLength, "want feet-inches", "malformed feet-inches"},
	{"dangling dash", `3'-`, DimLength, "no inches after the feet", "malformed feet-inches"},
	{"blank inch part", `3' "`, DimLength, "no inches after the feet", "malformed feet-inches"},
	{"inch part 99", `3'-99"`, DimLength, `inches after the feet must be less than 12: 3 ft 99 in is 11'-3"`, srcShop + "; 12 in = 1 ft"},
	{"inch part 12", `3'-12"`, DimLength, "must be less than 12", srcShop + "; 12 in = 1 ft"},
	{"inch part 12 words", "3 ft 12 in", DimLength, "must be less than 12", srcShop + "; 12 in = 1 ft"},
	{"inch part 12.5", `3'-12.5"`, DimLength, "must be less than 12", srcShop + "; 12 in = 1 ft"},
	{"inch part by exponent", `3'-1e3"`, DimLength, "must be less than 12", srcShop + "; 12 in = 1 ft"},
	{"improper inch fraction", `3'-13/4"`, DimLength, "proper fraction", srcShop + "; 3'-1 3/4\" is written so"},
	{"whole inch fraction", `3'-4/4"`, DimLength, "proper fraction", srcShop},
	{"negative inch part", `3'--6"`, DimLength, "no sign", "the sign goes before the feet: -3'-6\""},
	{"negative spaced inch part", `3'- -6"`, DimLength, "no sign", "the sign goes before the feet"},
	{"plus inch part", `3'-+6"`, DimLength, "no sign", "the sign goes before the feet"},
	{"decimal feet with inches", `2.5'-6"`, DimLength, "the feet are a whole number when inches follow", srcShop},
	{"mixed feet with inches", `1-1/2'-6"`, DimLength, "the feet are a whole number when inches follow", srcShop},
	{"hex", "0x10 in", DimLength, "unknown unit", "only decimal numbers"},
}

func TestParseErrors(t *testing.T) {
	for _, tt := range parseErrorCases {
		t.Run(tt.name, func(t *testing.T) {
			for _, sys := range []System{US, SI} {
				got, err := Parse(tt.in, tt.dim, sys)
				require.Errorf(t, err, "%s: Parse(%q) = %v, want an error (%s)", sys, tt.in, got, tt.src)
				assert.Contains(t, err.Error(), tt.want, tt.src)
			}
		})
	}
}

func TestParseUnknownDimPanics(t *testing.T) {
	assert.PanicsWithValue(t, "units: Parse: unknown dimension 99", func() {
		_, _ = Parse("3", Dim(99), US)
	}, "a programmer's mistake panics with the package name (STYLE.md)")
}

func TestTypedParsers(t *testing.T) {
	l, err := ParseLength("3/4 in", US)
	require.NoError(t, err)
	assertClose(t, 19.05, float64(l), srcInch)

	f, err := ParseForce("95 kip", SI)
	require.NoError(t, err)
	assertClose(t, 95, f.Kip(), srcLbf)

	s, err := ParseStress("50", US)
	require.NoError(t, err)
	assertClose(t, 50, s.Ksi(), srcPsi)

	a, err := ParseArea("19.2 cm2", SI)
	require.NoError(t, err)
	assertClose(t, 1920, float64(a), srcSI)

	_, err = ParseForce("3 in", US)
	assert.EqualError(t, err, `"3 in" is a length, not a force`)
}

func TestParseBoltDiameter(t *testing.T) {
	tests := []struct {
		name string
		in   string
		sys  System
		want Length
		src  string
	}{
		{"M20 us", "M20", US, 20, srcM},
		{"M20 si", "M20", SI, 20, srcM},
		{"lower case", "m20", US, 20, srcM},
		{"space", "M 20", US, 20, srcM},
		{"M22", " M22 ", SI, 22, srcM},
		{"M36", "M36", US, 36, srcM},
		{"inches", "3/4 in", SI, 19.05, srcInch},
		{"bare us", "7/8", US, 22.225, srcBare + "; " + srcInch},
		{"bare si", "20", SI, 20, srcBare},
		{"mm", "24 mm", US, 24, srcSI},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := ParseBoltDiameter(tt.in, tt.sys)
			require.NoError(t, err)
			assertClose(t, float64(tt.want), float64(got), tt.src)
		})
	}

	for _, in := range []string{"M", "M20x2.5", "M20 mm", "M-20", "Mabc", "mm", "M20.", "3 kip", ""} {
		_, err := ParseBoltDiameter(in, US)
		assert.Errorf(t, err, "ParseBoltDiameter(%q) must fail", in)
	}
}

func TestFormatLengthShopUS(t *testing.T) {
	tests := []struct {
		name string
		in   float64 // inches
		want string
		src  string
	}{
		{"zero", 0, `0"`, srcShop},
		{"sixteenth", 1.0 / 16, `1/16"`, srcShop},
		{"half reduces", 0.5, `1/2"`, srcShop + "; 8/16 reduces to 1/2"},
		{"three quarters", 0.75, `3/4"`, srcShop},
		{"whole", 3, `3"`, srcShop},
		{"mixed", 3.5, `3 1/2"`, srcShop},
		{"largest under a foot", 11.9375, `11 15/16"`, srcShop},
		{"one foot", 12, `1'-0"`, srcShop},
		{"foot and sixteenth", 12.0625, `1'-0 1/16"`, srcShop},
		{"foot and mixed", 15.5, `1'-3 1/2"`, srcShop},
		{"feet and mixed", 42.5, `3'-6 1/2"`, srcShop},
		{"two feet", 24, `2'-0"`, srcShop},
		{"rounding carries to feet", 11.99, `1'-0"`, srcShop + "; 11.99 in is 191.84/16, rounds to 192/16"},
		{"rounds down", 1.03, `1"`, srcShop + "; 1.03 in is 16.48/16"},
		{"rounds up", 2.72, `2 3/4"`, srcShop + "; 2.72 in is 43.52/16"},
		{"tiny rounds to zero", 0.01, `0"`, srcShop},
		{"tiny negative is not -0", -0.01, `0"`, srcShop},
		{"negative inches", -3.5, `-3 1/2"`, srcShop},
		{"negative feet", -42.5, `-3'-6 1/2"`, srcShop},
		{"many feet", 1200.25, `100'-0 1/4"`, srcShop},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, FormatLength(Length(tt.in)*Inch, US, Shop), tt.src)
		})
	}
}

func TestFormatJob(t *testing.T) {
	tests := []struct {
		name string
		in   Length
		sys  System
		want string
		src  string
	}{
		{"whole in", 3 * Inch, US, "3 in", srcJob},
		{"fraction", 0.75 * Inch, US, "3/4 in", srcJob},
		{"mixed", 1.5 * Inch, US, "1-1/2 in", srcJob},
		{"sixteenths", 12.1875 * Inch, US, "12-3/16 in", srcJob},
		{"zero us", 0, US, "0 in", srcJob},
		{"negative mixed", -1.5 * Inch, US, "-1-1/2 in", srcJob},
		{"negative fraction", -0.75 * Inch, US, "-3/4 in", srcJob},
		{"off grid", 2.123456789 * Inch, US, "2.123457 in", srcJob + "; 6 decimals"},
		{"off grid short", 0.1 * Inch, US, "0.1 in", srcJob + "; trailing zeros trimmed"},
		{"just off grid", (0.75 + 1e-6) * Inch, US, "0.750001 in", srcJob + "; 1e-6 in is beyond the 1e-9 in snap"},
		{"within snap", (0.75 + 5e-10) * Inch, US, "3/4 in", srcJob + "; within 1e-9 in of 3/4"},
		{"from mm", 20 * Millimetre, US, "0.787402 in", srcJob + "; 20/25.4 = 0.78740157…"},
		{"whole mm", 20, SI, "20 mm", srcJob},
		{"half mm", 22.5, SI, "22.5 mm", srcJob},
		{"three decimals", 1234.5678, SI, "1234.568 mm", srcJob + "; 3 decimals"},
		{"third", 1.0 / 3, SI, "0.333 mm", srcJob + "; 3 decimals"},
		{"below resolution", 0.0004, SI, "0 mm", srcJob},
		{"negative below resolution", -0.0004, SI, "0 mm", srcJob + "; no -0"},
		{"negative mm", -2.5, SI, "-2.5 mm", srcJob},
		{"inch in mm", Inch, SI, "25.4 mm", srcInch},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, FormatJob(tt.in, tt.sys), tt.src)
		})
	}
}

func TestFormatLengthShop(t *testing.T) {
	tests := []struct {
		name string
		in   Length
		sys  System
		want string
		src  string
	}{
		{"us feet-inches", 42.5 * Inch, US, `3'-6 1/2"`, srcShop},
		{"us inches", 0.75 * Inch, US, `3/4"`, srcShop},
		{"si rounds down", 65.4, SI, "65", "whole millimetres (common practice, no source)"},
		{"si rounds up", 64.6, SI, "65", "whole millimetres (common practice, no source)"},
		{"si zero", 0, SI, "0", "whole millimetres (common practice, no source)"},
		{"si small negative is not -0", -0.3, SI, "0", "whole millimetres (common practice, no source)"},
		{"si negative", -12.7, SI, "-13", "whole millimetres (common practice, no source)"},
		{"si large", 3657.6, SI, "3658", "whole millimetres (common practice, no source)"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, FormatLength(tt.in, tt.sys, Shop), tt.src)
		})
	}
}

// sixteenths returns k/16 in, computed the way a job's exact inches are.
func sixteenths(k int64) Length { return Length(float64(k)/16) * Inch }

// Every 1/16 in from -48 in to 48 in survives FormatJob → Parse exactly,
// and FormatLength(…, US, Shop) → Parse too.
func TestRoundTripUSGrid(t *testing.T) {
	for k := int64(-48 * 16); k <= 48*16; k++ {
		x := sixteenths(k)
		s := FormatJob(x, US)
		got, err := ParseLength(s, US)
		require.NoError(t, err, s)
		require.Equalf(t, x, got, "FormatJob(%d/16 in) = %q", k, s)

		p := FormatLength(x, US, Shop)
		got, err = ParseLength(p, US)
		require.NoError(t, err, p)
		require.Equalf(t, x, got, "FormatLength(%d/16 in, US, Shop) = %q", k, p)
	}
}

// Every 0.001 mm from -100 mm to 100 mm, and some larger values, survive
// FormatJob → Parse exactly.
func TestRoundTripSIGrid(t *testing.T) {
	check := func(x Length) {
		s := FormatJob(x, SI)
		got, err := ParseLength(s, SI)
		require.NoError(t, err, s)
		require.Equalf(t, x, got, "FormatJob(%v mm) = %q", float64(x), s)
	}
	for k := int64(-100_000); k <= 100_000; k++ {
		check(Length(float64(k) / 1000))
	}
	for _, x := range []Length{20, 22.5, 1e6 + 0.001, 12345.678, -9876.543} {
		check(x)
	}
}

func TestRapidRoundTripUS(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		k := rapid.Int64Range(-1<<40, 1<<40).Draw(t, "sixteenths")
		x := sixteenths(k)
		s := FormatJob(x, US)
		got, err := ParseLength(s, US)
		if err != nil {
			t.Fatalf("Parse(FormatJob(%d/16 in) = %q): %v", k, s, err)
		}
		if got != x || math.Abs(float64(got-x)) > 1e-9 {
			t.Fatalf("Parse(FormatJob(%d/16 in) = %q) = %v mm, want %v mm", k, s, float64(got), float64(x))
		}
	})
}

func TestRapidRoundTripSI(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		k := rapid.Int64Range(-1e12, 1e12).Draw(t, "micrometres")
		x := Length(float64(k) / 1000)
		s := FormatJob(x, SI)
		got, err := ParseLength(s, SI)
		if err != nil {
			t.Fatalf("Parse(FormatJob(%v mm) = %q): %v", float64(x), s, err)
		}
		if got != x {
			t.Fatalf("Parse(FormatJob(%v mm) = %q) = %v mm", float64(x), s, float64(got))
		}
	})
}

// Any finite length formats, and Parse reads FormatJob back to within the
// printed resolution: 5e-7 in (6 decimals) for us, 5e-4 mm for si, plus a
// few float64 ulps for the conversion.
func TestRapidFormatJobAnyLength(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		x := rapid.Float64().Draw(t, "mm")
		for _, c := range []struct {
			sys System
			res float64 // mm
		}{{US, 5e-7 * 25.4}, {SI, 5e-4}} {
			s := FormatJob(Length(x), c.sys)
			got, err := Parse(s, DimLength, c.sys)
			if err != nil {
				t.Fatalf("Parse(FormatJob(%v mm, %s) = %q): %v", x, c.sys, s, err)
			}
			if d := math.Abs(got - x); d > c.res+1e-15*math.Abs(x) {
				t.Fatalf("Parse(FormatJob(%v mm, %s) = %q) = %v, off by %v mm", x, c.sys, s, got, d)
			}
		}
	})
}

// FormatLength(…, US, Shop) never panics on a finite length, and for lengths a shop
// could meet Parse reads it back to within half a sixteenth.
func TestRapidFormatLengthShopUS(t *testing.T) {
	rapid.Check(t, func(t *rapid.T) {
		x := rapid.Float64().Draw(t, "mm")
		s := FormatLength(Length(x), US, Shop)
		if len(s) < 2 || s[len(s)-1] != '"' {
			t.Fatalf("FormatLength(%v mm, US, Shop) = %q, want a length in inches", x, s)
		}
		if math.Abs(x) > 1e9 {
			return
		}
		got, err := Parse(s, DimLength, US)
		if err != nil {
			t.Fatalf("Parse(FormatLength(%v mm, US, Shop) = %q): %v", x, s, err)
		}
		if d := math.Abs(got - x); d > 25.4/32+1e-9 {
			t.Fatalf("Parse(FormatLength(%v mm, US, Shop) = %q) = %v, off by %v mm", x, s, got, d)
		}
	})
}

// Parse never panics, and a value it accepts is finite.
func TestRapidParseAnyString(t *testing.T) {
	alphabet := []rune("0123456789./-+ '\"eEinftmkNMPasqlbpx^²′″nfINF")
	rapid.Check(t, func(t *rapid.T) {
		s := rapid.OneOf(rapid.String(), rapid.StringOf(rapid.SampledFrom(alphabet))).Draw(t, "s")
		for _, d := range []Dim{Dimensionless, DimLength, DimForce, DimStress, DimArea} {
			for _, sys := range []System{US, SI} {
				v, err := Parse(s, d, sys)
				if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
					t.Fatalf("Parse(%q, %s, %s) = %v without an error", s, d, sys, v)
				}
			}
		}
		_, _ = ParseBoltDiameter(s, US)
	})
}

func TestFormatNonFinite(t *testing.T) {
	// Not finite is a programmer's mistake upstream; the formatters still
	// return something Parse refuses rather than a plausible length.
	for _, x := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		for _, s := range []string{FormatLength(Length(x), US, Shop), FormatJob(Length(x), US), FormatJob(Length(x), SI)} {
			_, err := ParseLength(s, US)
			assert.Errorf(t, err, "Parse(%q) must fail", s)
		}
	}
}
