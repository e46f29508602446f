package units

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"
)

// Parse reads a quantity written by a person ("3/4 in", "1-1/2 in",
// `3'-6 1/2"`, "20 mm", "95 kip", "400 kN", "50 ksi", "345 MPa", "12 ft",
// "3.2 m", "3.75 in2") and returns its internal value (mm, N, MPa, mm²).
// A bare number is read in the default unit of sys for dimension want
// (us: in, kip, ksi, in²; si: mm, kN, MPa, mm²). A unit of another
// dimension, a missing number, NaN, Inf or trailing junk is an error.
//
// Numbers are decimals ("2.5", "1e3"), fractions ("3/4") or mixed numbers
// ("1-1/2", "1 1/2"); units are case-insensitive. A leading sign applies to
// the whole quantity, so "-3'-6\"" is -42 in. Parse does not judge sign.
// In feet-inches the feet are whole and the inches unsigned and less than
// 12, a lone fraction of an inch proper: 3'-99" and 3'-13/4" are errors.
func Parse(s string, want Dim, sys System) (float64, error) {
	if want < Dimensionless || want > DimArea {
		panic(fmt.Sprintf("units: Parse: unknown dimension %d", int(want)))
	}
	t := strings.TrimSpace(normalizeMarks(s))
	if t == "" {
		return 0, fmt.Errorf("empty value, want %s", withArticle(want))
	}
	sign, body := 1.0, t
	switch t[0] {
	case '-':
		sign, body = -1, t[1:]
	case '+':
		body = t[1:]
	}
	if w := leadingWord(body); w != "" {
		switch strings.ToLower(w) {
		case "nan":
			return 0, fmt.Errorf("%q: NaN is not a number", s)
		case "inf", "infinity":
			return 0, fmt.Errorf("%q: infinity is not a number", s)
		}
	}

	v, rest, err := scanNumber(body)
	if err != nil {
		return 0, numberError(s, err)
	}
	rest = strings.TrimLeftFunc(rest, unicode.IsSpace)

	var dim Dim
	var internal float64
	if after, ok := cutFeet(rest); ok {
		dim = DimLength
		in, given, err := inchesAfterFeet(after, v)
		if err != nil {
			return 0, numberError(s, err)
		}
		if given && v != math.Trunc(v) {
			return 0, numberError(s, errWholeFeet)
		}
		// Sum in inches first: on the 1/16 in grid the sum is exact, so
		// only the final conversion to mm rounds.
		internal = (v*12 + in) * float64(Inch)
	} else {
		var factor float64
		dim, factor, err = unitOf(rest, want, sys)
		if err != nil {
			return 0, unitError(s, rest, err)
		}
		internal = v * factor
	}
	if dim != want {
		return 0, fmt.Errorf("%q is %s, not %s", s, withArticle(dim), withArticle(want))
	}
	internal *= sign
	if !finite(internal) {
		return 0, fmt.Errorf("%q: number out of range", s)
	}
	return internal, nil
}

// ParseLength reads a length; see Parse.
func ParseLength(s string, sys System) (Length, error) {
	v, err := Parse(s, DimLength, sys)
	return Length(v), err
}

// ParseForce reads a force; see Parse.
func ParseForce(s string, sys System) (Force, error) {
	v, err := Parse(s, DimForce, sys)
	return Force(v), err
}

// ParseStress reads a stress; see Parse.
func ParseStress(s string, sys System) (Stress, error) {
	v, err := Parse(s, DimStress, sys)
	return Stress(v), err
}

// ParseArea reads an area; see Parse.
func ParseArea(s string, sys System) (Area, error) {
	v, err := Parse(s, DimArea, sys)
	return Area(v), err
}

// ParseBoltDiameter reads a bolt diameter: a length, or the metric
// designation "M20" (20 mm).
func ParseBoltDiameter(s string, sys System) (Length, error) {
	t := strings.TrimSpace(s)
	if len(t) < 2 || (t[0] != 'M' && t[0] != 'm') {
		return ParseLength(s, sys)
	}
	// "M" followed by a number is a metric designation whatever sys is;
	// anything else starting with m (e.g. "mm") is left to Parse.
	d := strings.TrimLeftFunc(t[1:], unicode.IsSpace)
	if d == "" || !isDigit(d[0]) {
		return ParseLength(s, sys)
	}
	end := spanDigits(d, 0)
	if end < len(d) && d[end] == '.' {
		if frac := spanDigits(d, end+1); frac > end+1 {
			end = frac
		}
	}
	if end != len(d) {
		return 0, fmt.Errorf("%q is not a bolt diameter (want e.g. M20 or 3/4 in)", s)
	}
	v, err := strconv.ParseFloat(d, 64)
	if err != nil || !finite(v) {
		return 0, fmt.Errorf("%q: number out of range", s)
	}
	return Length(v) * Millimetre, nil
}

// parseError is a problem with the number itself; Parse prefixes the input.
type parseError string

func (e parseError) Error() string { return string(e) }

const (
	errNoNumber     parseError = "no number"
	errFraction     parseError = "malformed fraction"
	errDivZero      parseError = "division by zero"
	errRange        parseError = "number out of range"
	errFeetInches   parseError = `want feet-inches like 3'-6 1/2"`
	errNoInches     parseError = `no inches after the feet: write 3'-0" or 3'`
	errInchSign     parseError = `the inches after the feet take no sign: a sign goes before the feet, -3'-6"`
	errInchFraction parseError = `the inches after the feet are a whole number and a proper fraction: 3'-1 3/4"`
	errWholeFeet    parseError = `the feet are a whole number when inches follow: 2'-6", or 2.5 ft alone`
	errUnknown      parseError = "unknown unit"
	errJunk         parseError = "malformed number"
)

func numberError(s string, err error) error {
	if err == errNoNumber {
		return fmt.Errorf("%q is not a quantity", s)
	}
	return fmt.Errorf("%q: %v", s, err)
}

func unitError(s, unit string, err error) error {
	if err == errUnknown {
		return fmt.Errorf("%q: unknown unit %q", s, strings.TrimSpace(unit))
	}
	return fmt.Errorf("%q: %v", s, err)
}

// marks maps typographic primes and quotes, and a doubled apostrophe, to
// the ASCII foot and inch marks. A Replacer is safe for concurrent use and
// never changes after it is built; building it once keeps Parse cheap.
var marks = strings.NewReplacer("′", "'", "’", "'", "″", `"`, "”", `"`, "''", `"`)

// normalizeMarks applies marks.
func normalizeMarks(s string) string { return marks.Replace(s) }

// scanNumber reads an unsigned decimal, fraction or mixed number at the
// start of s and returns its value and what follows it.
func scanNumber(s string) (float64, string, error) {
	i := spanDigits(s, 0)
	if i > 0 && i < len(s) && s[i] == '/' {
		num, den, end, err := scanFraction(s, 0)
		if err != nil {
			return 0, "", err
		}
		return num / den, s[end:], nil
	}
	if i > 0 {
		// A mixed number: whole, then "-" or spaces, then a proper fraction.
		j := i
		if j < len(s) && s[j] == '-' {
			j++
		} else {
			j = spanSpace(s, j)
		}
		if k := spanDigits(s, j); j > i && k > j && k < len(s) && s[k] == '/' {
			num, den, end, err := scanFraction(s, j)
			if err != nil {
				return 0, "", err
			}
			if num >= den {
				return 0, "", errFraction
			}
			whole, err := parseFloat(s[:i])
			if err != nil {
				return 0, "", err
			}
			return whole + num/den, s[end:], nil
		}
	}
	end := i
	if end < len(s) && s[end] == '.' {
		end = spanDigits(s, end+1)
	}
	if end == 0 || s[:end] == "." {
		return 0, "", errNoNumber
	}
	if end < len(s) && (s[end] == 'e' || s[end] == 'E') {
		j := end + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		if k := spanDigits(s, j); k > j {
			end = k
		}
	}
	v, err := parseFloat(s[:end])
	return v, s[end:], err
}

// scanFraction reads digits/digits starting at i.
func scanFraction(s string, i int) (num, den float64, end int, err error) {
	slash := spanDigits(s, i)
	end = spanDigits(s, slash+1)
	if end == slash+1 || (end < len(s) && (s[end] == '/' || s[end] == '.')) {
		return 0, 0, 0, errFraction
	}
	if num, err = parseFloat(s[i:slash]); err != nil {
		return 0, 0, 0, err
	}
	if den, err = parseFloat(s[slash+1 : end]); err != nil {
		return 0, 0, 0, err
	}
	if den == 0 {
		return 0, 0, 0, errDivZero
	}
	return num, den, end, nil
}

// parseFloat parses a string scanNumber has already checked.
func parseFloat(s string) (float64, error) {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil && !math.IsInf(v, 0) {
		// The scanner only passes well-formed digits; an underflow to 0 is fine.
		if ne, ok := err.(*strconv.NumError); !ok || ne.Err != strconv.ErrRange {
			panic("units: scanNumber passed a malformed number: " + s)
		}
	}
	if math.IsInf(v, 0) {
		return 0, errRange
	}
	return v, nil
}

// cutFeet reports whether rest starts with a foot mark or word, and returns
// what follows it.
func cutFeet(rest string) (string, bool) {
	if strings.HasPrefix(rest, "'") {
		return rest[1:], true
	}
	for _, w := range []string{"feet", "foot", "ft"} {
		if len(rest) >= len(w) && strings.EqualFold(rest[:len(w)], w) {
			after := rest[len(w):]
			if after == "" || unicode.IsSpace(rune(after[0])) || after[0] == '-' {
				return after, true
			}
		}
	}
	return "", false
}

// inchesAfterFeet reads the optional inch part of a feet-inches length
// after feet ft: "", `-6"`, ` 6-1/2"`, "-6 1/2 in"; given reports that
// there was one. The inch part is unsigned and less than 12, and a lone
// fraction is proper (shop convention: 3'-1 3/4", not 3'-13/4"): anything
// else is a typo, not a length.
func inchesAfterFeet(s string, ft float64) (in float64, given bool, err error) {
	s = strings.TrimSpace(s)
	if s == "" {
		return 0, false, nil
	}
	if s[0] == '-' {
		s = strings.TrimLeftFunc(s[1:], unicode.IsSpace)
	}
	if s == "" || s[0] == '"' || normalizeUnit(s) == "in" {
		return 0, true, errNoInches
	}
	if s[0] == '-' || s[0] == '+' {
		return 0, true, errInchSign
	}
	v, rest, err := scanNumber(s)
	if err == errNoNumber {
		return 0, true, errFeetInches
	}
	if err != nil {
		return 0, true, err
	}
	rest = strings.TrimSpace(rest)
	if rest != `"` {
		switch normalizeUnit(rest) {
		case "in", "inch", "inches":
		default:
			return 0, true, errFeetInches
		}
	}
	if i := spanDigits(s, 0); i > 0 && i < len(s) && s[i] == '/' && v >= 1 {
		return 0, true, errInchFraction
	}
	if v >= 12 {
		msg := "inches after the feet must be less than 12"
		if total := ft*12 + v; finite(total) && total*16 == math.Trunc(total*16) && total < 1e9 {
			msg += fmt.Sprintf(": %s ft %s in is %s", strconv.FormatFloat(ft, 'f', -1, 64),
				strconv.FormatFloat(v, 'f', -1, 64), feetInches(Length(total)*Inch))
		}
		return 0, true, parseError(msg)
	}
	return v, true, nil
}

// unitOf returns the dimension of the unit written after a number and the
// internal value of one of it. No unit means the default unit of sys.
func unitOf(rest string, want Dim, sys System) (Dim, float64, error) {
	if rest == "" {
		return want, sys.scale(want), nil
	}
	switch c := rest[0]; {
	case isDigit(c) || c == '.' || c == '/' || c == '-' || c == '+':
		return 0, 0, errJunk
	}
	switch normalizeUnit(rest) {
	case "mm", "millimeter", "millimeters", "millimetre", "millimetres":
		return DimLength, float64(Millimetre), nil
	case "cm", "centimeter", "centimeters", "centimetre", "centimetres":
		return DimLength, float64(10 * Millimetre), nil
	case "m", "meter", "meters", "metre", "metres":
		return DimLength, float64(Metre), nil
	case `"`, "in", "inch", "inches":
		return DimLength, float64(Inch), nil

	case "n", "newton", "newtons":
		return DimForce, float64(Newton), nil
	case "kn", "kilonewton", "kilonewtons":
		return DimForce, float64(Kilonewton), nil
	case "kip", "kips":
		return DimForce, float64(Kip), nil
	case "lb", "lbs", "lbf":
		return DimForce, float64(Kip / 1000), nil

	case "mpa", "n/mm2":
		return DimStress, float64(Megapascal), nil
	case "ksi":
		return DimStress, float64(Ksi), nil
	case "psi":
		return DimStress, float64(Ksi / 1000), nil

	case "mm2", "sq mm":
		return DimArea, float64(SquareMillimetre), nil
	case "cm2", "sq cm":
		return DimArea, float64(100 * SquareMillimetre), nil
	case "in2", "sq in":
		return DimArea, float64(SquareInch), nil
	}
	return 0, 0, errUnknown
}

// normalizeUnit lowercases a unit and spells powers one way:
// "in^2", "in²", "IN2" → "in2"; "sq  in" → "sq in".
func normalizeUnit(u string) string {
	u = strings.ToLower(strings.TrimSpace(u))
	u = powerFold.Replace(u)
	return strings.Join(strings.Fields(u), " ")
}

// powerFold is normalizeUnit's replacer, built once (safe for concurrent
// use, never changed).
var powerFold = strings.NewReplacer("^", "", "²", "2")

// leadingWord returns the ASCII letters at the start of s.
func leadingWord(s string) string {
	i := 0
	for i < len(s) && (s[i] >= 'a' && s[i] <= 'z' || s[i] >= 'A' && s[i] <= 'Z') {
		i++
	}
	return s[:i]
}

// withArticle names a dimension for an error message: "a length", "an area".
func withArticle(d Dim) string {
	if d == DimArea {
		return "an " + d.String()
	}
	return "a " + d.String()
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func spanDigits(s string, i int) int {
	for i < len(s) && isDigit(s[i]) {
		i++
	}
	return i
}

func spanSpace(s string, i int) int {
	for i < len(s) && (s[i] == ' ' || s[i] == '\t') {
		i++
	}
	return i
}
