package working

import (
	"strconv"
	"strings"

	"gaugeline/rules/units"
)

// Value is a named intermediate value of a limit state, with its dimension
// so that it can be printed in the job's units, and what a report says of
// it.
type Value struct {
	Name string  // stable key, e.g. "lc_min" (the JSON's values)
	V    float64 // internal units
	Dim  units.Dim
	Sym  string // printed symbol, e.g. "lc,min" ("": Name)
	What string // what it is, for a report's list of values
	// Omit: a report's list of values may leave it out (it says nothing
	// here, e.g. the filler factor of a joint without fillers); the JSON
	// keeps every value.
	Omit bool
}

// Symbol is the value's printed symbol.
func (v Value) Symbol() string {
	if v.Sym != "" {
		return v.Sym
	}
	return v.Name
}

// Working is what a report needs to show how a limit state got its result.
type Working struct {
	// Title says in plain words what is checked.
	Title string
	// Formula is the general formula, top-down, printed symbolically.
	Formula []Step
	// Where says what the formula's symbols mean ("" for nothing to add).
	Where string
	// Steps are the formula worked with this connection's values, printed
	// with the values substituted; the last step with a value gives the
	// nominal strength (an interaction: the ratio).
	Steps []Step
	// Table lists the limit state bolt by bolt, when it is taken bolt by
	// bolt (nil otherwise).
	Table *Table
	// Interaction is set for a limit state whose ratio is the value of an
	// interaction equation rather than the demand over a strength with one
	// factor (engine.Result.Factor is then zero).
	Interaction *Interaction
}

// Interaction describes the result of an interaction check.
type Interaction struct {
	Eq      string  // the equation that applies, e.g. "H1-1a (Pr/Pc ≥ 0.2)"
	Value   float64 // its value; the limit is 1.0
	Allowed string  // what Available is, e.g. "Force allowed at this e"
	Nominal string  // what Nominal is, e.g. "The same with Pn and Mn"
	With    string  // clauses used with the result's own, e.g. "D2 and F11"
}

// Table is a bolt-by-bolt table: Cells holds the rows one after another,
// len(Cols) cells each.
type Table struct {
	Title string
	Cols  []Column
	Cells []Cell
}

// Column is one column of a Table. A text column holds words; a quantity
// column values of Dim, with the unit after each value, or once in the
// heading when UnitInHead.
type Column struct {
	Label      string
	Text       bool
	Dim        units.Dim
	UnitInHead bool
}

// Cell is one cell of a Table: Text in a text column, V (internal units)
// in a quantity column.
type Cell struct {
	Text string
	V    float64
}

// Rows returns the table's rows.
func (t *Table) Rows() [][]Cell {
	n := len(t.Cols)
	if n == 0 {
		return nil
	}
	rows := make([][]Cell, 0, len(t.Cells)/n)
	for i := 0; i+n <= len(t.Cells); i += n {
		rows = append(rows, t.Cells[i:i+n:i+n])
	}
	return rows
}

// Show is how a step is printed.
type Show uint8

const (
	// ShowWorking prints "Sym = substitution = value".
	ShowWorking Show = iota
	// ShowForm prints "Sym = symbolic form = substitution = value".
	ShowForm
	// ShowValue prints "Sym = value": the expression is evaluated by the
	// tests but not written out (it is in the formula or the words around
	// the step say it).
	ShowValue
)

// Step is one line of a working (or one part of a line, see Join): the
// quantity it gives, how, and words around it.
type Step struct {
	// Value is what the step gives: Sym is printed, V is the value the
	// limit state used, Name is set when it is one of the result's values
	// (engine.Result.Values).
	Value
	// Places overrides the decimals the value is printed with (see
	// Format).
	Places int
	// Expr is how the value is computed; the zero Expr: the value is
	// stated (a table value, a lookup).
	Expr Expr
	// Say, when set, is printed instead of Expr's substitution, where the
	// values are too many to write out ("Σ rn over 4 bolts (table)") or
	// words read better ("the lesser"); Expr is still what is evaluated.
	Say Expr
	// Show is how much of the step is printed.
	Show Show
	// Join, when not empty, continues the previous line: the step is
	// printed after it with this separator (e.g. "; ").
	Join string
	// Then are words printed after the step (after its value). A step
	// with no Sym is a line of words: only Then is printed.
	Then Expr
}

// Op is the operation of an expression node.
type Op uint8

const (
	opNone   Op = iota // the zero Expr: nothing
	OpValue            // a quantity: Value, printed with Places
	OpConst            // a constant of the formula: V, written as Text
	OpMul              // product; printed a·b, with values (a)(b)
	OpTimes            // product of a count and a quantity, printed n × x
	OpDiv              // Args[0] over Args[1]
	OpAdd              // sum of Args
	OpSub              // Args[0] less Args[1]
	OpMin              // least of Args
	OpMax              // largest of Args
	OpAbs              // |Args[0]|
	OpSquare           // Args[0]²
	OpSum              // Σ of Args, written "Σ Text" (the terms are a column of a table)
	OpNamed            // Args[0], written symbolically as Text
	OpWords            // Text, not a number
	OpPhrase           // Args side by side: words and values, not a number
)

// Expr is an expression over quantities, as data.
type Expr struct {
	Op     Op
	Value  Value  // OpValue
	Places int    // OpValue: decimals (see Format)
	Text   string // OpConst, OpSum, OpNamed, OpWords
	Args   []Expr
}

// Format prints a value of dimension d (internal units) in a report's
// units, with its unit. places 0 asks for the report's usual decimals for
// d; places > 0 for that many decimals; places < 0 for −places significant
// figures.
type Format interface {
	Quantity(v float64, d units.Dim, places int) string
}

// Of is the quantity v in an expression, printed the report's usual way.
func Of(v Value) Expr { return Expr{Op: OpValue, Value: v} }

// Coef is the quantity v printed with places decimals (a coefficient the
// standard writes with that many, e.g. cb = 2.4, φ = 0.75, μ = 0.30).
func Coef(v Value, places int) Expr { return Expr{Op: OpValue, Value: v, Places: places} }

// K is a constant of the formula, k written as text ("0.60", "π", "(8/9)").
func K(k float64, text string) Expr {
	return Expr{Op: OpConst, Value: Value{V: k}, Text: text}
}

// Mul is the product of factors.
func Mul(factors ...Expr) Expr { return Expr{Op: OpMul, Args: factors} }

// Times is n × x: a count times a quantity.
func Times(n, x Expr) Expr { return Expr{Op: OpTimes, Args: []Expr{n, x}} }

// Div is a/b.
func Div(a, b Expr) Expr { return Expr{Op: OpDiv, Args: []Expr{a, b}} }

// Add is the sum of terms.
func Add(terms ...Expr) Expr { return Expr{Op: OpAdd, Args: terms} }

// Sub is a − b.
func Sub(a, b Expr) Expr { return Expr{Op: OpSub, Args: []Expr{a, b}} }

// Min is the least of its arguments.
func Min(args ...Expr) Expr { return Expr{Op: OpMin, Args: args} }

// Max is the largest of its arguments.
func Max(args ...Expr) Expr { return Expr{Op: OpMax, Args: args} }

// Abs is |a|.
func Abs(a Expr) Expr { return Expr{Op: OpAbs, Args: []Expr{a}} }

// Sq is a².
func Sq(a Expr) Expr { return Expr{Op: OpSquare, Args: []Expr{a}} }

// Sum is the sum of terms, written symbolically "Σ sym".
func Sum(sym string, terms []Expr) Expr { return Expr{Op: OpSum, Text: sym, Args: terms} }

// Named is e, written symbolically as sym ("Σt" for 2 × t).
func Named(sym string, e Expr) Expr { return Expr{Op: OpNamed, Text: sym, Args: []Expr{e}} }

// Words are words in a step, not a number.
func Words(s string) Expr { return Expr{Op: OpWords, Text: s} }

// Phrase is words and values side by side, not a number.
func Phrase(parts ...Expr) Expr { return Expr{Op: OpPhrase, Args: parts} }

// IsZero reports whether e is the zero Expr (nothing).
func (e Expr) IsZero() bool { return e.Op == opNone }

// Eval computes e from its quantities; ok is false when e holds words.
func (e Expr) Eval() (v float64, ok bool) {
	args := func() ([]float64, bool) {
		out := make([]float64, len(e.Args))
		for i, a := range e.Args {
			v, ok := a.Eval()
			if !ok {
				return nil, false
			}
			out[i] = v
		}
		return out, len(out) > 0
	}
	switch e.Op {
	case OpValue, OpConst:
		return e.Value.V, true
	case OpNamed:
		return e.Args[0].Eval()
	case opNone, OpWords, OpPhrase:
		return 0, false
	}
	xs, ok := args()
	if !ok {
		return 0, false
	}
	v = xs[0]
	switch e.Op {
	case OpMul, OpTimes:
		for _, x := range xs[1:] {
			v *= x
		}
	case OpDiv:
		v /= xs[1]
	case OpAdd, OpSum:
		for _, x := range xs[1:] {
			v += x
		}
	case OpSub:
		v -= xs[1]
	case OpMin:
		for _, x := range xs[1:] {
			v = min(v, x)
		}
	case OpMax:
		for _, x := range xs[1:] {
			v = max(v, x)
		}
	case OpAbs:
		v = max(v, -v)
	case OpSquare:
		v *= v
	default:
		panic("working: Eval of unknown op " + strconv.Itoa(int(e.Op)))
	}
	return v, true
}

// Symbolic writes e with symbols: "Fy·Ag", "1 − x̄/l", "min(a, b)".
func (e Expr) Symbolic() string { return e.write(nil) }

// Substitute writes e with its values put in: "(36.0 ksi)(3.750 in²)".
func (e Expr) Substitute(f Format) string {
	if f == nil {
		panic("working: Substitute needs a Format")
	}
	return e.write(f)
}

// write prints e symbolically (f nil) or with values (f set).
func (e Expr) write(f Format) string {
	sym := f == nil
	switch e.Op {
	case opNone:
		return ""
	case OpValue:
		if sym {
			return e.Value.Symbol()
		}
		return f.Quantity(e.Value.V, e.Value.Dim, e.Places)
	case OpConst, OpWords:
		return e.Text
	case OpNamed:
		if sym {
			return e.Text
		}
		return e.Args[0].write(f)
	case OpPhrase:
		var b strings.Builder
		for _, a := range e.Args {
			b.WriteString(a.write(f))
		}
		return b.String()
	case OpSum:
		if sym {
			return "Σ " + e.Text
		}
		return e.join(f, " + ")
	case OpMul:
		return e.product(f)
	case OpTimes:
		return e.join(f, " × ")
	case OpDiv:
		num, den := e.Args[0], e.Args[1]
		n, d := num.write(f), den.write(f)
		if num.additive() {
			n = "(" + n + ")"
		}
		if den.additive() || den.Op == OpMul || den.Op == OpDiv || den.Op == OpTimes {
			d = "(" + d + ")"
		}
		if sym || den.Op == OpConst {
			return n + "/" + d
		}
		return n + " / " + d
	case OpAdd:
		return e.join(f, " + ")
	case OpSub:
		b := e.Args[1].write(f)
		if e.Args[1].additive() {
			b = "(" + b + ")"
		}
		return e.Args[0].write(f) + " − " + b
	case OpMin, OpMax:
		name := "min("
		if e.Op == OpMax {
			name = "max("
		}
		return name + e.join(f, ", ") + ")"
	case OpAbs:
		return "|" + e.Args[0].write(f) + "|"
	case OpSquare:
		a := e.Args[0]
		s := a.write(f)
		if !sym || !a.atomic() {
			s = "(" + s + ")"
		}
		return s + "²"
	}
	panic("working: write of unknown op " + strconv.Itoa(int(e.Op)))
}

func (e Expr) join(f Format, sep string) string {
	parts := make([]string, len(e.Args))
	for i, a := range e.Args {
		parts[i] = a.write(f)
	}
	return strings.Join(parts, sep)
}

// product writes a product: symbolically Fu·Ae, 0.4(t − 0.25) (a leading
// constant is written against a bracket); with values (58.0 ksi)(2.877 in²),
// 0.60(58.0 ksi)(3.719 in²) (a leading constant bare, every other factor
// in brackets).
func (e Expr) product(f Format) string {
	if len(e.Args) == 0 {
		panic("working: a product of nothing")
	}
	var b strings.Builder
	leadK := e.Args[0].Op == OpConst
	for i, a := range e.Args {
		s := a.write(f)
		switch {
		case f == nil:
			bracket := a.additive() || a.Op == OpTimes || (a.Op == OpValue && compound(s))
			if bracket {
				s = "(" + s + ")"
			}
			if i > 0 && !(bracket && i == 1 && leadK) {
				b.WriteString("·")
			}
		case i == 0 && leadK, strings.HasPrefix(s, "("):
		default:
			s = "(" + s + ")"
		}
		b.WriteString(s)
	}
	return b.String()
}

// additive reports whether e is a sum or difference (bracketed inside a
// product, a quotient or after a minus).
func (e Expr) additive() bool {
	if e.Op == OpNamed {
		return false
	}
	return e.Op == OpAdd || e.Op == OpSub || e.Op == OpSum
}

// atomic reports whether e prints as one symbol.
func (e Expr) atomic() bool {
	return e.Op == OpValue || e.Op == OpConst || e.Op == OpNamed
}

// compound reports whether a symbol is itself a sum or difference, such as
// "Σdh − Σs²/4g", so that a product brackets it.
func compound(sym string) bool { return strings.Contains(sym, " − ") || strings.Contains(sym, " + ") }

// Symbolic writes the step as a line of a formula: "Rn = Fy·Ag", and its
// Then words; a step with no Sym writes only its words.
func (s Step) Symbolic() string {
	line := ""
	if sym := s.Symbol(); sym != "" {
		line = sym + " = " + s.Expr.Symbolic()
	}
	return line + s.Then.Symbolic()
}

// Substitute writes the step with its values: "Rn = (Fy)(Ag) = Rn" in the
// report's units, as its Show says, and its Then words.
func (s Step) Substitute(f Format) string {
	line := ""
	if sym := s.Symbol(); sym != "" {
		line = sym + " = "
		if s.Show == ShowForm {
			line += s.Expr.Symbolic() + " = "
		}
		switch {
		case s.Show == ShowValue:
		case !s.Say.IsZero():
			line += s.Say.Substitute(f) + " = "
		case !s.Expr.IsZero():
			line += s.Expr.Substitute(f) + " = "
		}
		line += f.Quantity(s.V, s.Dim, s.Places)
	}
	if !s.Then.IsZero() {
		line += s.Then.Substitute(f)
	}
	return line
}

// FormulaLines writes the formula, a line per step (steps with Join
// continue the line before).
func (w *Working) FormulaLines() []string {
	return lines(w.Formula, func(s Step) string { return s.Symbolic() })
}

// StepLines writes the steps with the values put in.
func (w *Working) StepLines(f Format) []string {
	return lines(w.Steps, func(s Step) string { return s.Substitute(f) })
}

func lines(steps []Step, write func(Step) string) []string {
	var out []string
	for _, s := range steps {
		if s.Join != "" && len(out) > 0 {
			out[len(out)-1] += s.Join + write(s)
			continue
		}
		out = append(out, write(s))
	}
	return out
}
