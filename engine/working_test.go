package engine

import (
	"fmt"
	"math"
	"reflect"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"pgregory.net/rapid"

	"gaugeline/engine/working"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// plain prints a value in internal units, with its decimals or its
// significant figures, and no unit.
type plain struct{}

func (plain) Quantity(v float64, _ units.Dim, places int) string {
	switch {
	case places > 0:
		return strconv.FormatFloat(v, 'f', places, 64)
	case places < 0:
		return strconv.FormatFloat(v, 'g', -places, 64)
	}
	return strconv.FormatFloat(v, 'f', 3, 64)
}

// exact prints a value in internal units at full precision, so that the
// printed substitution can be read back and worked out.
type exact struct{}

func (exact) Quantity(v float64, _ units.Dim, _ int) string {
	return strconv.FormatFloat(v, 'g', -1, 64)
}

// The printer writes a formula the way the calculation report always has
// (the hand-written forms of detail/calc before the working moved here):
// symbols joined by ·, a leading constant against a bracket, values in
// brackets in a product, a constant divisor without spaces.
func TestWorkingPrinter(t *testing.T) {
	q := func(sym string, v float64) Expr { return working.Of(Value{Sym: sym, V: v}) }
	tests := []struct {
		name       string
		e          Expr
		sym, subst string
		want       float64 // the expression worked out by hand from the values
	}{
		{"product", working.Mul(q("Fy", 36), q("Ag", 3.75)), "Fy·Ag", "(36.000)(3.750)", 135},
		{"constant first", working.Add(working.Mul(working.K(0.6, "0.60"), q("Fu", 58), q("Anv", 2)), working.Mul(working.Coef(Value{Sym: "Ubs", V: 1}, 1), q("Fu", 58), q("Ant", 0.5))),
			"0.60·Fu·Anv + Ubs·Fu·Ant", "0.60(58.000)(2.000) + (1.0)(58.000)(0.500)", 0.6*58*2 + 58*0.5},
		{"against a bracket", working.Sub(working.K(1, "1"), working.Mul(working.K(0.4, "0.4"), working.Sub(working.Coef(Value{Sym: "t", V: 0.5}, -4), working.K(0.25, "0.25")))),
			"1 − 0.4(t − 0.25)", "1 − 0.4(0.5 − 0.25)", 0.9},
		{"square over a constant", working.Div(working.Mul(working.K(math.Pi, "π"), working.Sq(q("d", 2))), working.K(4, "4")), "π·d²/4", "π(2.000)²/4", math.Pi},
		{"quotient of values", working.Sub(working.K(1, "1"), working.Div(q("x̄", 1), q("l", 4))), "1 − x̄/l", "1 − 1.000 / 4.000", 0.75},
		{"compound symbol", working.Sub(q("Ag", 4), working.Mul(q("Σt", 0.5), q("Σdh − Σs²/4g", 1))), "Ag − Σt·(Σdh − Σs²/4g)", "4.000 − (0.500)(1.000)", 3.5},
		{"named count", working.Mul(working.Named("Σt", working.Times(q("n", 2), q("t", 0.5))), q("w", 3)), "Σt·w", "(2.000 × 0.500)(3.000)", 3},
		{"least", working.Min(working.Mul(q("Fy", 2), q("Z", 3)), working.Mul(working.K(1.5, "1.5"), q("Fy", 2), q("S", 2))), "min(Fy·Z, 1.5·Fy·S)", "min((2.000)(3.000), 1.5(2.000)(2.000))", 6},
		{"absolute", working.Abs(working.Sub(q("ȳ", 1), working.Div(q("d", 6), working.K(2, "2")))), "|ȳ − d/2|", "|1.000 − 6.000/2|", 2},
		{"sum", working.Sum("rn", []Expr{q("rn", 1), q("rn", 2)}), "Σ rn", "1.000 + 2.000", 3},
	}
	for _, tt := range tests {
		if got := tt.e.Symbolic(); got != tt.sym {
			t.Errorf("%s: symbolic %q, want %q", tt.name, got, tt.sym)
		}
		if got := tt.e.Substitute(plain{}); got != tt.subst {
			t.Errorf("%s: substituted %q, want %q", tt.name, got, tt.subst)
		}
		if v, ok := tt.e.Eval(); !ok || math.Abs(v-tt.want) > 1e-12*math.Abs(tt.want) {
			t.Errorf("%s: evaluates to %g (%v), want %g", tt.name, v, ok, tt.want)
		}
		if v, err := readBack(tt.e.Substitute(exact{})); err != nil || math.Abs(v-tt.want) > 1e-12*math.Abs(tt.want) {
			t.Errorf("%s: read back %g (%v), want %g", tt.name, v, err, tt.want)
		}
	}
	if _, ok := working.Phrase(working.Words("over "), q("n", 2)).Eval(); ok {
		t.Error("words evaluate")
	}
	s := []Step{
		{Value: Value{Sym: "Z", V: 9}, Expr: working.Mul(q("t", 1), q("d", 9))},
		{Value: Value{Sym: "Sx", V: 6}, Join: "; "},
		{Value: Value{Sym: "Rn", V: 3}, Expr: working.Min(q("a", 3), q("b", 4)), Say: working.Words("the lesser"), Then: working.Words(" (table)")},
		{Then: working.Words("a line of words")},
	}
	w := Working{Steps: s}
	want := []string{"Z = (1.000)(9.000) = 9.000; Sx = 6.000", "Rn = the lesser = 3.000 (table)", "a line of words"}
	if got := w.StepLines(plain{}); strings.Join(got, "\n") != strings.Join(want, "\n") {
		t.Errorf("steps %q, want %q", got, want)
	}
}

// CheckWorking lists what is wrong with the working of r, a result of a
// check by method m: every limit state has a title, a formula and steps;
// a strength has the factor that gives its available strength, an
// interaction none; every step that shows how it is computed evaluates to
// the value the limit state used, both from its expression and from its
// printed substitution read back; a quantity that names one of the
// result's values carries that value; and the last step gives the nominal
// strength (an interaction: the ratio). Exported for the test over the
// testdata jobs (package engine_test).
func CheckWorking(r Result, m rules.Method) []string {
	var bad []string
	fail := func(f string, a ...any) { bad = append(bad, r.ID+": "+fmt.Sprintf(f, a...)) }
	w := r.Working()
	if w.Title == "" || len(w.Formula) == 0 || len(w.Steps) == 0 {
		fail("title %q, %d formula lines, %d steps", w.Title, len(w.Formula), len(w.Steps))
	}
	if w.Interaction == nil {
		if r.Factor.Phi <= 0 || r.Factor.Omega <= 0 {
			fail("no factor: %+v", r.Factor)
		} else if got := r.Factor.Available(m, r.Nominal); got != r.Available {
			fail("the factor %+v gives %g, available %g", r.Factor, float64(got), float64(r.Available))
		}
	} else if r.Factor != (rules.Factor{}) {
		fail("an interaction with a factor %+v", r.Factor)
	}
	values := map[string]Value{}
	for _, v := range r.Values {
		values[v.Name] = v
	}
	named := func(where string, v Value) {
		if v.Name == "" {
			return
		}
		if u, ok := values[v.Name]; !ok || !same(u.V, v.V) || u.Dim != v.Dim {
			fail("%s: %s = %g (%s), the result's value %g (%s, %v)", where, v.Name, v.V, v.Dim, u.V, u.Dim, ok)
		}
	}
	var leaves func(where string, e Expr)
	leaves = func(where string, e Expr) {
		if e.Op == working.OpValue {
			named(where, e.Value)
		}
		for _, a := range e.Args {
			leaves(where, a)
		}
	}
	var last *Step
	evaluated := 0
	for i := range w.Steps {
		s := &w.Steps[i]
		where := fmt.Sprintf("step %d %q", i, s.Symbol())
		named(where, s.Value)
		for _, e := range []Expr{s.Expr, s.Say, s.Then} {
			leaves(where, e)
		}
		if s.Symbol() != "" {
			last = s
		} else if s.Then.IsZero() {
			fail("%s: neither a value nor words", where)
		}
		if !s.Say.IsZero() && s.Expr.IsZero() {
			fail("%s: says %q of no expression", where, s.Say.Substitute(plain{}))
		}
		if s.Expr.IsZero() {
			continue
		}
		v, ok := s.Expr.Eval()
		if !ok {
			fail("%s: %q does not evaluate", where, s.Expr.Symbolic())
			continue
		}
		evaluated++
		if !closeTo(v, s.V) {
			fail("%s: %s evaluates to %g, the limit state used %g", where, s.Expr.Substitute(plain{}), v, s.V)
		}
		if s.Show == working.ShowValue || !s.Say.IsZero() {
			continue // the substitution is not printed
		}
		text := s.Expr.Substitute(exact{})
		if back, err := readBack(text); err != nil {
			fail("%s: printed %q: %v", where, text, err)
		} else if !closeTo(back, s.V) {
			fail("%s: printed %q reads back as %g, the limit state used %g", where, text, back, s.V)
		}
	}
	if evaluated == 0 {
		fail("no step is worked out")
	}
	switch {
	case last == nil:
	case w.Interaction != nil && !same(last.V, r.Ratio):
		fail("the last step gives %g, the ratio is %g", last.V, r.Ratio)
	case w.Interaction == nil && (!same(last.V, float64(r.Nominal)) || last.Dim != units.DimForce):
		fail("the last step gives %g (%s), the nominal strength is %g", last.V, last.Dim, float64(r.Nominal))
	}
	for _, l := range append(w.FormulaLines(), w.StepLines(plain{})...) {
		if l == "" {
			fail("an empty line")
		}
	}
	if tb := w.Table; tb != nil && (len(tb.Cols) == 0 || len(tb.Cells)%len(tb.Cols) != 0) {
		fail("table of %d cells in %d columns", len(tb.Cells), len(tb.Cols))
	}
	return bad
}

// closeTo compares a step's value with the limit state's: relative 1e-9, the
// same arithmetic in another order (and in a value read back from 17
// significant digits).
func closeTo(got, want float64) bool {
	if same(got, want) {
		return true
	}
	return math.Abs(got-want) <= 1e-9*max(math.Abs(want), 1e-9)
}

func same(a, b float64) bool { return a == b || (math.IsNaN(a) && math.IsNaN(b)) }

// Every limit state of random connections (the generator of the property
// tests: shapes, editions, methods, hole types, slip, eccentricity) shows
// a working that adds up.
func TestPropertyWorkingAddsUp(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		c, rs := checkDrawn(t, rt)
		for _, r := range rs {
			for _, b := range CheckWorking(r, c.Method) {
				rt.Error(b)
			}
		}
	})
}

// checkDrawn checks a connection drawn by the property tests' generator.
func checkDrawn(t *testing.T, rt *rapid.T) (*Connection, []Result) {
	c := drawParams(rt).build(t)
	rs, err := Check(c)
	if err != nil {
		rt.Fatal(err)
	}
	return c, rs
}

// The fillers' steps: 1/2 in of undeveloped fillers (ff 0.90) and 1 in
// (1 − 0.4(0.75) = 0.70, below the 0.85 floor) on the D.2 angle, hand
// calculation per AISC 360-22 J5.2(a).
func TestWorkingFillers(t *testing.T) {
	for _, tt := range []struct {
		t    float64 // in
		line string
	}{
		{0.5, "ff = 1 − 0.4(0.5 − 0.25) = 0.900: fillers"},
		{1, "ff = 1 − 0.4(1 − 0.25) = 0.700, not less than 0.85: ff = 0.850: fillers"},
	} {
		c := designExampleD2(t, rules.LRFD)
		c.Bolt.FillerT = in(tt.t)
		c.Bolt.Fillers = 1
		for _, r := range []Result{BoltShear(c), BoltGroup(c, MemberBearing(c).PerBolt, nil)} {
			for _, b := range CheckWorking(r, c.Method) {
				t.Error(b)
			}
		}
		r := BoltShear(c)
		w := r.Working()
		if lines := strings.Join(w.StepLines(plain{}), "\n"); !strings.Contains(lines, tt.line) {
			t.Errorf("t = %g in: steps\n%s\nlack %q", tt.t, lines, tt.line)
		}
	}
}

// readBack works out a printed substitution: numbers, π, + − · × /, ²,
// brackets, |…|, min(…) and max(…), and factors written side by side.
func readBack(s string) (float64, error) {
	p := &reader{s: s}
	v, err := p.expr()
	p.skip()
	if err == nil && p.i < len(p.s) {
		err = fmt.Errorf("%q left over", p.s[p.i:])
	}
	return v, err
}

type reader struct {
	s string
	i int
}

func (p *reader) skip() {
	for p.i < len(p.s) && p.s[p.i] == ' ' {
		p.i++
	}
}

// next reports whether s comes next (after spaces) and takes it if so.
func (p *reader) next(s string) bool {
	p.skip()
	if strings.HasPrefix(p.s[p.i:], s) {
		p.i += len(s)
		return true
	}
	return false
}

func (p *reader) expr() (float64, error) {
	v, err := p.term()
	for err == nil {
		switch {
		case p.next("+"):
			var w float64
			w, err = p.term()
			v += w
		case p.next("−"):
			var w float64
			w, err = p.term()
			v -= w
		default:
			return v, nil
		}
	}
	return v, err
}

func (p *reader) term() (float64, error) {
	v, err := p.factor()
	for err == nil {
		var w float64
		switch {
		case p.next("/"):
			w, err = p.factor()
			v /= w
		case p.next("·"), p.next("×"):
			w, err = p.factor()
			v *= w
		case p.startsFactor():
			w, err = p.factor()
			v *= w
		default:
			return v, nil
		}
	}
	return v, err
}

// startsFactor: a factor written against the one before, "0.60(…)", "(…)(…)".
func (p *reader) startsFactor() bool {
	return p.i < len(p.s) && (p.s[p.i] == '(' || strings.HasPrefix(p.s[p.i:], "π"))
}

func (p *reader) factor() (float64, error) {
	v, err := p.primary()
	if err == nil && p.next("²") {
		v *= v
	}
	return v, err
}

func (p *reader) primary() (float64, error) {
	p.skip()
	switch {
	case p.next("π"):
		return math.Pi, nil
	case p.next("("):
		v, err := p.expr()
		if err == nil && !p.next(")") {
			err = fmt.Errorf("no ) at %d", p.i)
		}
		return v, err
	case p.next("|"):
		v, err := p.expr()
		if err == nil && !p.next("|") {
			err = fmt.Errorf("no closing | at %d", p.i)
		}
		return math.Abs(v), err
	case p.next("min("), p.next("max("):
		isMin := strings.HasSuffix(p.s[:p.i], "min(")
		v, err := p.expr()
		for err == nil && p.next(",") {
			var w float64
			w, err = p.expr()
			if isMin {
				v = min(v, w)
			} else {
				v = max(v, w)
			}
		}
		if err == nil && !p.next(")") {
			err = fmt.Errorf("no ) at %d", p.i)
		}
		return v, err
	}
	j := p.i
	for j < len(p.s) {
		r, n := utf8.DecodeRuneInString(p.s[j:])
		if !(r >= '0' && r <= '9' || r == '.' || r == 'e' || r == 'I' || r == 'n' || r == 'f' ||
			(r == '-' || r == '+') && (j == p.i || p.s[j-1] == 'e')) {
			break
		}
		j += n
	}
	v, err := strconv.ParseFloat(p.s[p.i:j], 64)
	if err != nil {
		return 0, fmt.Errorf("at %d: %v", p.i, err)
	}
	p.i = j
	return v, nil
}

// A result's working is built on demand, from what the limit state used
// when it was computed: changing the connection afterwards (as the layout
// search does with its candidates) changes nothing in it.
func TestPropertyWorkingIsFixedAtTheCheck(t *testing.T) {
	rapid.Check(t, func(rt *rapid.T) {
		c, rs := checkDrawn(t, rt)
		before := make([]Working, len(rs))
		for i := range rs {
			before[i] = rs[i].Working()
		}
		c.Demand *= 3
		c.Method = 1 - c.Method
		c.Member.Fy, c.Member.Fu, c.Member.T, c.Member.Width, c.Member.Ag = 2*c.Member.Fy, 2*c.Member.Fu, 2*c.Member.T, 2*c.Member.Width, 2*c.Member.Ag
		c.Member.Pieces = 3 - c.Member.Pieces
		c.Bolt.D, c.Bolt.FillerT, c.Bolt.Fillers = 2*c.Bolt.D, c.Bolt.FillerT+in(1), c.Bolt.Fillers+1
		c.Bolt.DeformationConsidered = !c.Bolt.DeformationConsidered
		if c.Plate != nil {
			c.Plate.T, c.Plate.Width, c.Plate.Fy, c.Plate.FreeEdge = 2*c.Plate.T, 2*c.Plate.Width, 2*c.Plate.Fy, 2*c.Plate.FreeEdge
		}
		for i := range c.Holes {
			c.Holes[i].X, c.Holes[i].Y, c.Holes[i].Dx, c.Holes[i].ID = c.Holes[i].X+in(1), c.Holes[i].Y+in(1), 2*c.Holes[i].Dx, "moved"
		}
		c.Edition = edition(t, "aisc360-16", units.SI)
		for i := range rs {
			if after := rs[i].Working(); !reflect.DeepEqual(after, before[i]) {
				rt.Errorf("%s: the working changed with the connection:\n%q\n%q", rs[i].ID,
					before[i].StepLines(plain{}), after.StepLines(plain{}))
			}
		}
	})
}
