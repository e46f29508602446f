package units

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Style is a way of writing a quantity for people or for a job file. Pick
// one of Job, Shop, People, Exact, Gauge and Report and refine it with its
// methods; the zero Style is Job.
type Style struct {
	spell   spelling
	places  int  // Report: decimals, or -places significant figures; 0 is Places(d, sys)
	bare    bool // without the unit
	exact   bool // the exact value beside where the spelling rounded it
	typeset bool // unit powers as superscripts: in², mm³
}

type spelling int

const (
	spellJob    spelling = iota // as a job file writes it
	spellShop                   // as a detailer reads a drawing
	spellFine                   // as a check's table prints a length
	spellExact                  // the job's unit to 1e-6
	spellReport                 // fixed decimals per dimension
	spellGauge                  // as measuring equipment reports a length
)

// The styles. Lengths are spelled as each says; a force, stress, area,
// moment or section modulus is written as Report in every style, and a
// plain number too, except that People writes it to 3 significant figures.
var (
	// Job writes a length the way a job file does, so that Parse reads
	// it back exactly when it lies on a 1/16 in (us) or 0.001 mm (si)
	// grid: "1-1/2 in", "3/4 in", "3 in", "20 mm", "22.5 mm"; off the
	// 1/16 in grid a decimal ("0.8 in").
	Job = Style{spell: spellJob}
	// Shop writes a length the way a detailer reads a drawing: US in
	// feet, inches and sixteenths rounded to the nearest 1/16 in (1'-3 1/2",
	// 3 1/4", 3/4"; 12 in and more carry feet), SI in whole millimetres
	// without the unit ("65").
	Shop = Style{spell: spellShop}
	// People writes a length the way a check's tables do: US as Shop, SI
	// to 0.1 mm with the unit, the exact value beside where that rounds it
	// (`7/8" (0.84375 in)`, `53.3 mm (53.333333 mm)`), so that a limit is
	// never printed as one the part meets while it fails it, nor a measured
	// value as one that meets its limit.
	People = Style{spell: spellFine, exact: true}
	// Exact writes a length in the job's unit with the digits it needs, to
	// 1e-6: "0.03125 in", "25.96 mm".
	Exact = Style{spell: spellExact}
	// Gauge writes a length the way measuring equipment reports it: to
	// 0.0001 in or 0.01 mm, with its unit ("0.8125 in", "21.97 mm"). A
	// negative value that rounds to zero keeps its sign.
	Gauge = Style{spell: spellGauge}
	// Report writes a quantity with the decimals of its dimension
	// (Places) and its unit: "1.500 in", "95.0 kip", "2.250 in2"; ∞ for
	// an infinite value and no sign on a zero.
	Report = Style{spell: spellReport}
)

// Places returns s writing n decimals, or -n significant figures when n is
// negative; Report.Places(0) is Report. An infinite value is "∞" without
// the unit.
func (s Style) Places(n int) Style { s.spell, s.places = spellReport, n; return s }

// Bare returns s without the unit: "3-1/2" for Job, "1.500" for Report
// (the other styles of a length keep theirs).
func (s Style) Bare() Style { s.bare = true; return s }

// WithExact returns s with the exact value (Exact) beside where the
// spelling rounded the length: Shop.WithExact() writes `7/8" (0.9 in)`.
func (s Style) WithExact() Style { s.exact = true; return s }

// Typeset returns s writing unit powers as superscripts (in², mm³), as a
// typeset page does.
func (s Style) Typeset() Style { s.typeset = true; return s }

// Places is how many decimals Report writes a value of dimension d in sys
// with: lengths to 0.001 in or 0.1 mm, forces and stresses to 0.1 of the
// unit, areas to 0.001 in² or 1 mm², moments to 0.01 kip-in or 0.001 kN-m,
// section moduli to 0.001 in³ or 1 mm³, numbers to 0.001.
func Places(d Dim, sys System) int {
	us := sys == US
	switch d {
	case DimLength:
		if us {
			return 3
		}
		return 1
	case DimArea, DimModulus:
		if us {
			return 3
		}
		return 0
	case DimForce, DimStress:
		return 1
	case DimMoment:
		if us {
			return 2
		}
		return 3
	}
	return 3
}

// Format writes the internal value v of dimension d in the unit of sys in
// style st.
func Format(v float64, d Dim, sys System, st Style) string {
	if d == DimLength && st.spell != spellReport {
		return formatLength(Length(v), sys, st)
	}
	if d == Dimensionless && st.spell == spellFine {
		return fmt.Sprintf("%.3g", v)
	}
	return formatReport(v, d, sys, st)
}

// FormatLength writes a length; see Format.
func FormatLength(l Length, sys System, st Style) string {
	return Format(float64(l), DimLength, sys, st)
}

// FormatJob writes a length as a job file does: FormatLength(l, sys, Job).
func FormatJob(l Length, sys System) string { return formatLength(l, sys, Job) }

func formatLength(l Length, sys System, st Style) string {
	var text string
	steps := 0.0 // the grid the spelling rounds to, in the job's unit
	switch st.spell {
	case spellJob:
		text = jobLength(l, sys)
		if st.bare {
			text = strings.TrimSuffix(text, " "+sys.Label(DimLength))
		}
	case spellShop:
		text, steps = shopLength(l, sys), 16
		if sys == SI {
			steps = 1
		}
	case spellFine:
		text, steps = feetInches(l), 16
		if sys == SI {
			text, steps = fmt.Sprintf("%.1f mm", float64(l)), 10
		}
	case spellExact:
		return exactLength(l, sys)
	case spellGauge:
		if sys == US {
			return fmt.Sprintf("%.4f in", l.In())
		}
		return fmt.Sprintf("%.2f mm", l.Mm())
	}
	if !st.exact || steps == 0 {
		return text
	}
	v := l.Mm()
	if sys == US {
		v = l.In()
	}
	if exact, grid := math.Round(v*1e6)/1e6, math.Round(v*steps)/steps; math.Abs(exact-grid) < 1e-9 || !finite(v) {
		return text
	}
	return text + " (" + exactLength(l, sys) + ")"
}

// formatReport writes v with a fixed number of decimals and the unit.
func formatReport(v float64, d Dim, sys System, st Style) string {
	var s string
	if st.places != 0 {
		if math.IsInf(v, 0) || math.IsNaN(v) {
			return "∞"
		}
		x := sys.ToJob(v, d)
		s = fmt.Sprintf("%.*f", st.places, x)
		if st.places < 0 {
			s = fmt.Sprintf("%.*g", -st.places, x)
		}
	} else {
		s = reportNumber(v, d, sys)
	}
	if u := sys.Label(d); u != "" && !st.bare {
		if st.typeset {
			u = superscripts.Replace(u)
		}
		s += " " + u
	}
	return s
}

var superscripts = strings.NewReplacer("2", "²", "3", "³")

// reportNumber writes v in the unit of sys with Places(d, sys) decimals:
// whole numbers as integers, ∞ for an infinite value, no sign on a zero.
func reportNumber(v float64, d Dim, sys System) string {
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return "∞"
	}
	v = sys.ToJob(v, d)
	if d == Dimensionless && v == math.Trunc(v) && math.Abs(v) < 1e6 {
		return fmt.Sprintf("%d", int64(v))
	}
	s := fmt.Sprintf("%.*f", Places(d, sys), v)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// feetInches writes a length in feet, inches and sixteenths, rounded to
// the nearest 1/16 in: 1'-3 1/2", 3 1/4", 0'-0 3/4" is written 3/4".
// Lengths of 12 in and more carry feet.
func feetInches(l Length) string {
	in := l.In()
	if !finite(in) {
		return strconv.FormatFloat(in, 'g', -1, 64)
	}
	n := math.Round(math.Abs(in) * 16) // sixteenths
	if n == 0 {
		return `0"`
	}
	sign := ""
	if in < 0 {
		sign = "-"
	}
	rem := math.Mod(n, 12*16) // exact, and an integer in [0, 192)
	feet := (n - rem) / (12 * 16)
	whole, frac := int(rem)/16, int(rem)%16
	if feet == 0 {
		return sign + formatMixed(whole, frac, " ") + `"`
	}
	inches := formatMixed(whole, frac, " ")
	if whole == 0 && frac != 0 {
		inches = "0 " + inches // 1'-0 1/2", not 1'-1/2"
	}
	return sign + strconv.FormatFloat(feet, 'f', 0, 64) + "'-" + inches + `"`
}

// jobLength writes a length in Job style.
func jobLength(l Length, sys System) string {
	if sys == SI {
		return trimDecimal(strconv.FormatFloat(l.Mm(), 'f', 3, 64)) + " mm"
	}
	in := l.In()
	n := math.Round(in * 16)
	if !finite(in) || math.Abs(in-n/16) > 1e-9 {
		return trimDecimal(strconv.FormatFloat(in, 'f', 6, 64)) + " in"
	}
	if n == 0 {
		return "0 in"
	}
	sign := ""
	if n < 0 {
		sign, n = "-", -n
	}
	rem := math.Mod(n, 16)
	whole := strconv.FormatFloat((n-rem)/16, 'f', 0, 64)
	if rem == 0 {
		return sign + whole + " in"
	}
	frac := formatMixed(0, int(rem), "")
	if whole == "0" {
		return sign + frac + " in"
	}
	return sign + whole + "-" + frac + " in"
}

// shopLength writes a length in Shop style.
func shopLength(l Length, sys System) string {
	if sys == SI {
		return trimDecimal(strconv.FormatFloat(math.Round(l.Mm()), 'f', 0, 64))
	}
	return feetInches(l)
}

// exactLength writes a length in Exact style.
func exactLength(l Length, sys System) string {
	v, unit := l.Mm(), "mm"
	if sys == US {
		v, unit = l.In(), "in"
	}
	return strconv.FormatFloat(math.Round(v*1e6)/1e6, 'f', -1, 64) + " " + unit
}

// formatMixed writes whole and sixteenths as "3", "3/4", "3 1/2" (sep " ")
// or "1-1/2" (sep "-"); sixteenths are reduced.
func formatMixed(whole, sixteenths int, sep string) string {
	w := strconv.Itoa(whole)
	if sixteenths == 0 {
		return w
	}
	den := 16
	for sixteenths%2 == 0 {
		sixteenths, den = sixteenths/2, den/2
	}
	frac := strconv.Itoa(sixteenths) + "/" + strconv.Itoa(den)
	if whole == 0 {
		return frac
	}
	return w + sep + frac
}

// trimDecimal drops trailing zeros and a trailing point, and a minus on zero.
func trimDecimal(s string) string {
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	if s == "-0" {
		return "0"
	}
	return s
}
