package jobfile

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/rules/units"
)

// Bounds on what a job may ask for: beyond them the input is a typo.
const (
	maxLength = 100 * units.Metre
	// minLength: nothing in a bolted part is given to less than a
	// micrometre; a smaller length is a unit or exponent typed wrong.
	minLength   = units.Millimetre / 1000
	minArea     = units.Area(1e-6) // mm²
	maxForce    = 1e6 * units.Kip
	maxStress   = 2000 * units.Megapascal
	maxArea     = units.Area(1e7) // mm², 10 m²
	maxQuantity = 100000
	maxLines    = 20
	maxPerLine  = 200
	maxFillers  = 100
	// A stack of fillers 150 mm (6 in) thick is no filler: a unit typed
	// wrong (common practice, no source).
	maxFillerThickness = 150 * units.Millimetre
)

// parser walks the YAML tree of one job.
type parser struct {
	job *Job
}

func (p *parser) sys() units.System { return p.job.Units }

// missing reports a required key absent from block b, on the line of the
// block's own key.
func (p *parser) missing(b *block, path, msg, hint string) *InputError {
	return &InputError{File: p.job.File, Line: p.job.Line(b.path), Field: path, Msg: msg, Hint: hint}
}

func (p *parser) errAt(n *yaml.Node, path, msg, hint string) *InputError {
	line := 0
	if n != nil {
		line = n.Line
	}
	return &InputError{File: p.job.File, Line: line, Field: path, Msg: msg, Hint: hint}
}

// noAliases rejects anchors and aliases anywhere in the tree: a job is
// small enough to write out, and aliases make field paths ambiguous.
func (p *parser) noAliases(n *yaml.Node, path string) error {
	if n.Kind == yaml.AliasNode || n.Anchor != "" {
		return p.errAt(n, path, "YAML anchors and aliases are not supported", "write the value out in full")
	}
	switch n.Kind {
	case yaml.MappingNode:
		for i := 0; i+1 < len(n.Content); i += 2 {
			k := n.Content[i]
			if err := p.noAliases(k, path); err != nil {
				return err
			}
			if err := p.noAliases(n.Content[i+1], joinPath(path, k.Value)); err != nil {
				return err
			}
		}
	case yaml.SequenceNode:
		for i, c := range n.Content {
			if err := p.noAliases(c, fmt.Sprintf("%s[%d]", path, i)); err != nil {
				return err
			}
		}
	}
	return nil
}

func joinPath(parent, key string) string {
	if parent == "" {
		return key
	}
	return parent + "." + key
}

// block is one YAML mapping of the job with its keys checked.
type block struct {
	path string
	node *yaml.Node
	vals map[string]*yaml.Node
}

func (b *block) has(k string) bool { return b.vals[k] != nil }

// sub returns the field path of key k.
func (b *block) sub(k string) string { return joinPath(b.path, k) }

// mapping checks that n is a mapping whose keys are all known and
// distinct, and records their lines.
func (p *parser) mapping(n *yaml.Node, path string, known []string) (*block, error) {
	if n.Kind != yaml.MappingNode {
		return nil, p.errAt(n, path, "want a mapping of keys ("+strings.Join(known[:min(3, len(known))], ":, ")+":, …)", "")
	}
	b := &block{path: path, node: n, vals: map[string]*yaml.Node{}}
	first := map[string]int{}
	for i := 0; i+1 < len(n.Content); i += 2 {
		k, v := n.Content[i], n.Content[i+1]
		if k.Kind != yaml.ScalarNode {
			return nil, p.errAt(k, path, "a key must be a plain word", "")
		}
		kp := joinPath(path, k.Value)
		if l, dup := first[k.Value]; dup {
			return nil, p.errAt(k, kp, fmt.Sprintf("duplicate key (first at line %d)", l), "remove one of them")
		}
		if !slices.Contains(known, k.Value) {
			where := "the job"
			if path != "" {
				where = path
			}
			return nil, p.errAt(k, kp, fmt.Sprintf("unknown key %q in %s", k.Value, where), nearestKey(k.Value, known))
		}
		first[k.Value] = k.Line
		b.vals[k.Value] = v
		p.job.lines[kp] = k.Line
	}
	return b, nil
}

// nearestKey suggests the known key closest to k by edit distance.
func nearestKey(k string, known []string) string {
	best, bestD := "", math.MaxInt
	for _, c := range known {
		if d := editDistance(strings.ToLower(k), c); d < bestD {
			best, bestD = c, d
		}
	}
	if bestD <= max(2, len(k)/3) {
		return fmt.Sprintf("did you mean %q?", best)
	}
	return "known keys: " + strings.Join(known, ", ")
}

// editDistance is the Levenshtein distance between a and b.
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}

// scalar returns the text of a scalar value and records it under path.
func (p *parser) scalar(n *yaml.Node, path string) (string, error) {
	switch {
	case n.Kind == yaml.MappingNode:
		return "", p.errAt(n, path, "want a single value, not a mapping", "")
	case n.Kind == yaml.SequenceNode:
		return "", p.errAt(n, path, "want a single value, not a list", "")
	case n.Kind != yaml.ScalarNode:
		return "", p.errAt(n, path, "want a single value", "")
	case n.Tag == "!!null":
		return "", p.errAt(n, path, "has no value", "")
	}
	p.job.Raw[path] = n.Value
	p.job.lines[path] = n.Line
	return n.Value, nil
}

// quantity reads a quantity of dimension d at path.
func (p *parser) quantity(n *yaml.Node, path string, d units.Dim) (float64, error) {
	s, err := p.scalar(n, path)
	if err != nil {
		return 0, err
	}
	if n.Tag == "!!float" {
		switch strings.ToLower(strings.TrimLeft(s, "+-")) {
		case ".nan":
			return 0, p.errAt(n, path, "is not a number (NaN)", "")
		case ".inf":
			return 0, p.errAt(n, path, "is infinite", "")
		}
	}
	v, err := units.Parse(s, d, p.sys())
	if err != nil {
		return 0, p.errAt(n, path, err.Error(), quantityHint(d, p.sys()))
	}
	if math.IsNaN(v) {
		return 0, p.errAt(n, path, "is not a number (NaN)", "")
	}
	if math.IsInf(v, 0) {
		return 0, p.errAt(n, path, "is infinite", "")
	}
	return v, nil
}

func quantityHint(d units.Dim, sys units.System) string {
	ex := map[units.Dim]string{
		units.DimLength: `"3/4 in", "1-1/2 in", "20 mm"`,
		units.DimForce:  `"95 kip", "400 kN"`,
		units.DimStress: `"50 ksi", "345 MPa"`,
		units.DimArea:   `"3.75 in2", "2420 mm2"`,
	}[d]
	article := "a"
	if d == units.DimArea {
		article = "an"
	}
	return fmt.Sprintf("write %s %s such as %s, or a bare number in %s", article, d, ex, sys.Label(d))
}

// lengthRule says which lengths a field accepts.
type lengthRule int

const (
	positive    lengthRule = iota // > 0
	nonNegative                   // ≥ 0
	anySign                       // an offset
)

// length reads a length at path under rule r: when not zero, at least
// 0.001 mm and below 100 m in size.
func (p *parser) length(n *yaml.Node, path string, r lengthRule) (units.Length, error) {
	v, err := p.quantity(n, path, units.DimLength)
	if err != nil {
		return 0, err
	}
	l := units.Length(v)
	switch size := math.Abs(float64(l)); {
	case r == positive && l <= 0:
		return 0, p.errAt(n, path, "must be greater than zero", "")
	case r == nonNegative && l < 0:
		return 0, p.errAt(n, path, "must not be negative", "")
	case size >= float64(maxLength):
		return 0, p.errAt(n, path, "is absurdly large (100 m or more)", "check the unit")
	case size > 0 && size < float64(minLength):
		return 0, p.errAt(n, path, "is absurdly small (under 0.001 mm)", "check the unit and the exponent")
	}
	return l, nil
}

// bound is one limit a quantity must keep: out says the value breaks it,
// msg and hint are the error that says so.
type bound struct {
	out       func(v float64) bool
	msg, hint string
}

// bounded reads a quantity of dimension d at path and refuses it at the
// first bound it breaks, in the order given.
func (p *parser) bounded(n *yaml.Node, path string, d units.Dim, bounds ...bound) (float64, error) {
	v, err := p.quantity(n, path, d)
	if err != nil {
		return 0, err
	}
	for _, b := range bounds {
		if b.out(v) {
			return 0, p.errAt(n, path, b.msg, b.hint)
		}
	}
	return v, nil
}

// force reads a load at path: finite, ≥ 0, at most 1e6 kip.
func (p *parser) force(n *yaml.Node, path string) (units.Force, error) {
	v, err := p.bounded(n, path, units.DimForce,
		bound{func(v float64) bool { return v < 0 }, "must not be negative", "a tension member's load is given as a positive tension"},
		bound{func(v float64) bool { return v > float64(maxForce) }, "is absurdly large (over 1,000,000 kip)", "check the unit"})
	return units.Force(v), err
}

// signedForce reads a service load at path: tension positive, compression
// negative.
func (p *parser) signedForce(n *yaml.Node, path string) (units.Force, error) {
	v, err := p.bounded(n, path, units.DimForce,
		bound{func(v float64) bool { return math.Abs(v) > float64(maxForce) }, "is absurdly large (over 1,000,000 kip)", "check the unit"})
	return units.Force(v), err
}

// stress reads a yield or tensile stress at path.
func (p *parser) stress(n *yaml.Node, path string) (units.Stress, error) {
	v, err := p.bounded(n, path, units.DimStress,
		bound{func(v float64) bool { return v <= 0 }, "must be greater than zero", ""},
		bound{func(v float64) bool { return v > float64(maxStress) }, "is absurdly large for structural steel (over 2000 MPa)", "check the unit"})
	return units.Stress(v), err
}

// area reads an area override at path.
func (p *parser) area(n *yaml.Node, path string) (units.Area, error) {
	v, err := p.bounded(n, path, units.DimArea,
		bound{func(v float64) bool { return v <= 0 }, "must be greater than zero", ""},
		bound{func(v float64) bool { return v >= float64(maxArea) }, "is absurdly large (10 m² or more)", "check the unit"},
		bound{func(v float64) bool { return v < float64(minArea) }, "is absurdly small (under 0.000001 mm²)", "check the unit and the exponent"})
	return units.Area(v), err
}

// integer reads a whole number in [lo, hi] at path.
func (p *parser) integer(n *yaml.Node, path string, lo, hi int) (int, error) {
	s, err := p.scalar(n, path)
	if err != nil {
		return 0, err
	}
	v, err := strconv.Atoi(strings.TrimSpace(s))
	if err != nil || v < lo || v > hi {
		return 0, p.errAt(n, path, fmt.Sprintf("want a whole number from %d to %d, not %q", lo, hi, s), "")
	}
	return v, nil
}

// word reads a non-empty string at path.
func (p *parser) word(n *yaml.Node, path string) (string, error) {
	s, err := p.scalar(n, path)
	if err != nil {
		return "", err
	}
	s = strings.TrimSpace(s)
	if s == "" {
		return "", p.errAt(n, path, "has no value", "")
	}
	return s, nil
}

// enum reads a word and converts it with parse (one of the rules.Parse*).
func enum[T any](p *parser, n *yaml.Node, path string, parse func(string) (T, error)) (T, error) {
	var zero T
	s, err := p.word(n, path)
	if err != nil {
		return zero, err
	}
	v, err := parse(s)
	if err != nil {
		return zero, p.errAt(n, path, err.Error(), "")
	}
	return v, nil
}

// list checks that n is a non-empty sequence of at most maxN items.
func (p *parser) list(n *yaml.Node, path, example string, maxN int) ([]*yaml.Node, error) {
	if n.Kind != yaml.SequenceNode {
		return nil, p.errAt(n, path, "want a list such as "+example, "")
	}
	if len(n.Content) == 0 {
		return nil, p.errAt(n, path, "is empty", "give at least one item, e.g. "+example)
	}
	if len(n.Content) > maxN {
		return nil, p.errAt(n, path, fmt.Sprintf("has %d items (at most %d)", len(n.Content), maxN), "")
	}
	return n.Content, nil
}
