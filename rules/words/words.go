// Package words maps the values of a small enum (an integer type whose
// values run 0, 1, 2, …) to the words a job file or a flag spells them
// with, and back. One table gives String and Parse, so the two cannot
// disagree, and every Parse error reads the same way:
// `unknown hole type "round" (want standard, oversized, short-slot or long-slot)`.
package words

import (
	"fmt"
	"strings"
)

// Table is the spellings of the values of T, in value order.
type Table[T ~int] struct {
	what  string // what a value is, for errors: "hole type"
	names []string
}

// New returns the table of T's spellings: names[i] is the spelling of
// T(i). what names the kind of value in errors.
func New[T ~int](what string, names ...string) Table[T] {
	return Table[T]{what: what, names: names}
}

// Name returns the spelling of v. A value outside the table is a
// programmer's mistake: it panics.
func (t Table[T]) Name(v T) string {
	if int(v) < 0 || int(v) >= len(t.names) {
		panic(fmt.Sprintf("words: %s %d has no spelling", t.what, int(v)))
	}
	return t.names[v]
}

// Parse returns the value spelled s; else the first value and an error
// that names every spelling.
func (t Table[T]) Parse(s string) (T, error) {
	for i, n := range t.names {
		if n == s {
			return T(i), nil
		}
	}
	return 0, fmt.Errorf("unknown %s %q (want %s)", t.what, s, Alternatives(t.names))
}

// Alternatives lists words for a message: "a", "a or b", "a, b or c".
func Alternatives(words []string) string {
	if len(words) < 2 {
		return strings.Join(words, "")
	}
	return strings.Join(words[:len(words)-1], ", ") + " or " + words[len(words)-1]
}
