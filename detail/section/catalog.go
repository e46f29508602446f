package section

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"gaugeline/rules/units"
)

// usFamily is one leg pair of AISC Manual Table 1-7, dimensions in
// sixteenths of an inch.
type usFamily struct {
	a, b int   // legs, long leg first
	t    []int // thicknesses, in table order
}

// usFamilies are the common AISC angles, in table order: the sizes and
// thicknesses of AISC Manual Table 1-7 as the AISC Shapes Database v15.0
// lists them (read; L12, L10, L2-1/2x2, L2-1/2x1-1/2 and L2x2x1/8 are
// not carried). Each has a row of usTable (kdet and the properties).
var usFamilies = []usFamily{
	{128, 128, []int{18, 16, 14, 12, 10, 9, 8}},
	{128, 96, []int{16, 14, 12, 10, 9, 8, 7}},
	{128, 64, []int{16, 14, 12, 10, 9, 8, 7}},
	{112, 64, []int{12, 10, 8, 7, 6}},
	{96, 96, []int{16, 14, 12, 10, 9, 8, 7, 6, 5}},
	{96, 64, []int{14, 12, 10, 9, 8, 7, 6, 5}},
	{96, 56, []int{8, 6, 5}},
	{80, 80, []int{14, 12, 10, 8, 7, 6, 5}},
	{80, 56, []int{12, 10, 8, 6, 5, 4}},
	{80, 48, []int{8, 7, 6, 5, 4}},
	{64, 64, []int{12, 10, 8, 7, 6, 5, 4}},
	{64, 56, []int{8, 6, 5, 4}},
	{64, 48, []int{10, 8, 6, 5, 4}},
	{56, 56, []int{8, 7, 6, 5, 4}},
	{56, 48, []int{8, 7, 6, 5, 4}},
	{56, 40, []int{8, 6, 5, 4}},
	{48, 48, []int{8, 7, 6, 5, 4, 3}},
	{48, 40, []int{8, 7, 6, 5, 4, 3}},
	{48, 32, []int{8, 6, 5, 4, 3}},
	{40, 40, []int{8, 6, 5, 4, 3}},
	{32, 32, []int{6, 5, 4, 3, 2}},
}

// siFamily is one leg pair of EN 10056-1, dimensions in millimetres.
type siFamily struct {
	a, b   float64 // legs, long leg first
	r1, r2 float64 // root and toe radii
	t      []float64
}

// siFamilies are the EN 10056-1 equal and unequal angles, in the order of
// the tables read (equal, then unequal; small sizes first). Legs,
// thicknesses and the radii r1, r2 are read from two section tables of
// BS EN 10056-1 angles, the SCI "Blue Book" and ArcelorMittal's sections
// catalogue (docs/sources/shapes.md, "EN 10056-1 angles"; every row is
// checked against them in en10056_test.go), except where a row says
// otherwise. The standard's own text was not read.
var siFamilies = []siFamily{
	{40, 40, 6, 3, []float64{4, 5}},
	{45, 45, 7, 3.5, []float64{4.5}},
	{50, 50, 7, 3.5, []float64{4, 5, 6}},
	{60, 60, 8, 4, []float64{5, 6, 8}},
	{65, 65, 9, 4.5, []float64{7}},
	{70, 70, 9, 4.5, []float64{6, 7}},
	{75, 75, 9, 4.5, []float64{6, 8}},
	{80, 80, 10, 5, []float64{8, 10}},
	{90, 90, 11, 5.5, []float64{7, 8, 9, 10}},
	{100, 100, 12, 6, []float64{8, 10, 12}},
	{120, 120, 13, 6.5, []float64{10, 12}},
	{130, 130, 14, 7, []float64{12}},
	{150, 150, 16, 8, []float64{10, 12, 14, 15, 18}},
	{160, 160, 17, 8.5, []float64{15, 17}},
	{180, 180, 18, 9, []float64{16, 18}},
	{200, 200, 18, 9, []float64{16, 18, 20, 24}},

	{60, 40, 6, 3, []float64{5, 6}},
	{65, 50, 6, 3, []float64{5}},
	{70, 50, 7, 3.5, []float64{6}}, // r1 7, r2 3.5 (Blue Book); 6, 3 before
	{75, 50, 7, 3.5, []float64{6, 8}},
	{80, 40, 7, 3.5, []float64{6, 8}},
	{80, 60, 8, 4, []float64{7}},
	{100, 50, 8, 4, []float64{6, 8}}, // r1 8, r2 4 (Blue Book); 9, 4.5 before
	{100, 65, 10, 5, []float64{7, 8, 10}},
	{100, 75, 10, 5, []float64{8, 10, 12}},
	{120, 80, 11, 5.5, []float64{8, 10, 12}},
	{125, 75, 11, 5.5, []float64{8, 10, 12}},
	{135, 65, 11, 5.5, []float64{8, 10}},       // not in either table read: size and radii from memory
	{150, 75, 12, 6, []float64{9, 10, 12, 15}}, // r1 12, r2 6 (Blue Book; 11, 5.5 before); t = 9 not in the tables read, from memory
	{150, 90, 12, 6, []float64{10, 12, 15}},
	{150, 100, 12, 6, []float64{10, 12}},
	{200, 100, 15, 7.5, []float64{10, 12, 15}},
	{200, 150, 15, 7.5, []float64{12, 15}},
}

// sixteenths converts a whole number of sixteenths of an inch to a length.
func sixteenths(n int) units.Length { return units.Length(n) * units.Inch / 16 }

// inches prints sixteenths of an inch the way designations do: "3-1/2",
// "1/2", "1-1/8", "4".
func inches(n int) string { return units.FormatLength(sixteenths(n), units.US, units.Job.Bare()) }

// family is one leg pair of a catalog: its "L4x4" prefix and its angles.
type family struct {
	legs   string
	a, b   units.Length
	angles []Angle
}

// catalog builds the families of sys. It is rebuilt on each call so that
// no caller can change it for another.
func catalog(sys units.System) []family {
	var fs []family
	switch sys {
	case units.US:
		for _, f := range usFamilies {
			legs := "L" + inches(f.a) + "x" + inches(f.b)
			fam := family{legs: legs, a: sixteenths(f.a), b: sixteenths(f.b)}
			for _, t := range f.t {
				name := legs + "x" + inches(t)
				tab, ok := usTable[strings.ToUpper(name)]
				if !ok {
					panic("section: no published properties for " + name)
				}
				fam.angles = append(fam.angles, Angle{
					Name: name, System: units.US,
					A: fam.a, B: fam.b, T: sixteenths(t),
					K:   units.Length(tab.kdet) * units.Inch,
					tab: tab,
				})
			}
			fs = append(fs, fam)
		}
	case units.SI:
		for _, f := range siFamilies {
			legs := "L" + mm(units.Length(f.a)) + "x" + mm(units.Length(f.b))
			fam := family{legs: legs, a: units.Length(f.a), b: units.Length(f.b)}
			for _, t := range f.t {
				fam.angles = append(fam.angles, Angle{
					Name: legs + "x" + mm(units.Length(t)), System: units.SI,
					A: fam.a, B: fam.b, T: units.Length(t),
					R1: units.Length(f.r1), R2: units.Length(f.r2),
					K: units.Length(t + f.r1),
				})
			}
			fs = append(fs, fam)
		}
	default:
		panic(fmt.Sprintf("section: unknown unit system %d", int(sys)))
	}
	return fs
}

// Names lists the designations of the catalog of sys in catalog order.
func Names(sys units.System) []string {
	var names []string
	for _, f := range catalog(sys) {
		for _, a := range f.angles {
			names = append(names, a.Name)
		}
	}
	return names
}

// UnknownAngleError is Lookup's answer to a well-formed designation that is
// not in the catalog.
type UnknownAngleError struct {
	Designation string       // as asked
	System      units.System // catalog searched
	Nearby      []string     // same legs, other thicknesses; else the nearest legs
	Note        string       // further advice, e.g. "long leg first: L6x4x1/2"
}

func (e *UnknownAngleError) Error() string {
	return fmt.Sprintf("section: no angle %q in the %s catalog; %s", e.Designation, e.System, e.Hint())
}

// Hint is the advice part of the message, for a "hint:" line.
func (e *UnknownAngleError) Hint() string {
	var h []string
	if e.Note != "" {
		h = append(h, e.Note)
	}
	if len(e.Nearby) > 0 {
		h = append(h, "nearby sizes: "+strings.Join(e.Nearby, ", "))
	}
	return strings.Join(h, "; ")
}

// Lookup finds an angle by designation in the catalog of sys. Case, spaces
// and the spelling of the separator ("x", "X", "×") do not matter, and
// dimensions may be fractions or decimals: "L4x4x1/2", "l 4 X 4 X 1/2",
// "L3.5x3.5x0.375", "L 3-1/2x3-1/2x3/8"; "L100x100x10". The long leg comes
// first, as in the catalogs; use Swapped to connect the short leg. A size
// not in the catalog gives an *UnknownAngleError naming nearby sizes.
func Lookup(designation string, sys units.System) (Angle, error) {
	dims, err := parseDesignation(designation)
	if err != nil {
		return Angle{}, err
	}
	fs := catalog(sys)
	if a, ok := find(fs, dims, sys); ok {
		return a, nil
	}
	e := &UnknownAngleError{Designation: designation, System: sys}
	if a, ok := find(fs, [3]float64{dims[1], dims[0], dims[2]}, sys); ok {
		e.Note = "designations give the long leg first: " + a.Name
		return Angle{}, e
	}
	other := units.SI
	if sys == units.SI {
		other = units.US
	}
	if a, ok := find(catalog(other), dims, other); ok {
		e.Note = fmt.Sprintf("%s is in the %s catalog: check the job's units", a.Name, other)
		return Angle{}, e
	}
	e.Nearby = nearby(fs, dims, sys)
	return Angle{}, e
}

// find looks up exact dimensions (inches for US, mm for SI).
func find(fs []family, dims [3]float64, sys units.System) (Angle, bool) {
	for _, f := range fs {
		for _, a := range f.angles {
			if same(a.A, dims[0], sys) && same(a.B, dims[1], sys) && same(a.T, dims[2], sys) {
				return a, true
			}
		}
	}
	return Angle{}, false
}

// same compares a catalog length with a designation number of sys.
func same(l units.Length, v float64, sys units.System) bool {
	if sys == units.US {
		return math.Abs(l.In()-v) < 1e-6
	}
	return math.Abs(l.Mm()-v) < 1e-6
}

// nearby lists the family with the same legs or, failing that, the
// families whose legs are closest.
func nearby(fs []family, dims [3]float64, sys units.System) []string {
	dist := func(f family) float64 {
		a, b := f.a.Mm(), f.b.Mm()
		if sys == units.US {
			a, b = f.a.In(), f.b.In()
		}
		return math.Abs(a-dims[0]) + math.Abs(b-dims[1])
	}
	best := math.Inf(1)
	for _, f := range fs {
		best = math.Min(best, dist(f))
	}
	var names []string
	for _, f := range fs {
		if dist(f)-best < 1e-9 {
			for _, a := range f.angles {
				names = append(names, a.Name)
			}
		}
	}
	return names
}

// parseDesignation reads "L<leg>x<leg>x<thickness>" into numbers in the
// designation's own unit.
func parseDesignation(s string) ([3]float64, error) {
	var dims [3]float64
	bad := func() ([3]float64, error) {
		return dims, fmt.Errorf("section: cannot read angle designation %q: want L<leg>x<leg>x<thickness>, e.g. L4x4x1/2 or L100x100x10", s)
	}
	d := strings.ToLower(strings.TrimSpace(s))
	d = strings.ReplaceAll(d, "×", "x")
	rest, ok := strings.CutPrefix(d, "l")
	if !ok {
		return bad()
	}
	parts := strings.Split(rest, "x")
	if len(parts) != 3 {
		return bad()
	}
	for i, p := range parts {
		v, ok := parseDim(p)
		if !ok {
			return bad()
		}
		dims[i] = v
	}
	return dims, nil
}

// parseDim reads a positive dimension: "4", "3.5", "1/2", "3-1/2", "3 1/2".
func parseDim(s string) (float64, bool) {
	f := strings.Fields(s)
	if w, fr, ok := strings.Cut(strings.TrimSpace(s), "-"); ok {
		f = []string{strings.TrimSpace(w), strings.TrimSpace(fr)}
	}
	switch len(f) {
	case 1:
		if strings.Contains(f[0], "/") {
			return parseFraction(f[0])
		}
		return parseDecimal(f[0])
	case 2:
		w, err := strconv.Atoi(f[0])
		fr, ok := parseFraction(f[1])
		if err != nil || w < 0 || !ok || fr >= 1 {
			return 0, false
		}
		return float64(w) + fr, true
	}
	return 0, false
}

// parseDecimal reads digits with at most one point, greater than zero.
func parseDecimal(s string) (float64, bool) {
	if s == "" || strings.Trim(s, "0123456789.") != "" {
		return 0, false
	}
	v, err := strconv.ParseFloat(s, 64)
	return v, err == nil && v > 0
}

// parseFraction reads "n/d" with positive whole n and d.
func parseFraction(s string) (float64, bool) {
	n, d, ok := strings.Cut(s, "/")
	if !ok {
		return 0, false
	}
	ni, err1 := strconv.Atoi(n)
	di, err2 := strconv.Atoi(d)
	if err1 != nil || err2 != nil || ni <= 0 || di <= 0 {
		return 0, false
	}
	return float64(ni) / float64(di), true
}
