package jobfile

import (
	"bytes"
	"crypto/sha256"
	"fmt"
	"io"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
	"gaugeline/fileset"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Job is a parsed job file (SPEC §3). Quantities are in the internal units
// of package units; a zero quantity means "not given" unless a default is
// documented. Field paths in errors and in Raw, Given and Line are dotted
// with 0-based list indices: "bolts.pitch", "member.legs[1]", "holes[2]".
type Job struct {
	File     string // path as given
	Mark     string
	Units    units.System
	Standard string // "aisc360-22" or "aisc360-16"
	Method   rules.Method
	Quantity int

	Load   Load
	Member MemberSpec
	Plate  *PlateSpec // nil: the member alone is checked
	Bolts  BoltSpec
	// Holes are explicit hole centres in the order given; nil when the
	// pattern in Bolts generates them.
	Holes     []HoleCentre
	Stock     Stock
	Tolerance Tolerance

	// SHA256 is the hex SHA-256 of the job file's bytes.
	SHA256 string
	// Stamp names the run that writes this job's files (tool version,
	// mode, input hash); "" when nothing is stamped. The caller sets it;
	// the JSON, the HTML report and every DXF of a file set carry it.
	Stamp string

	// Raw holds every scalar as written in the file, keyed by field path,
	// so that a rewritten job can re-emit the user's own spelling.
	Raw map[string]string

	lines map[string]int // field path → 1-based line
	root  *yaml.Node     // the document node, kept for writing back
}

// Load is the tension demand: the required strength, or service loads the
// tool combines (ASCE 7 basic combinations).
type Load struct {
	// Required is the required strength (factored for LRFD, service for
	// ASD); zero when service loads are given.
	Required units.Force
	Service  engine.ServiceLoads
}

// Combined reports whether the demand is combined from service loads.
func (l Load) Combined() bool { return l.Required == 0 }

// SteelSpec names a catalog grade or gives Fy and Fu explicitly.
type SteelSpec struct {
	Grade  string // catalog name; "" when Fy and Fu are given
	Fy, Fu units.Stress
}

// MemberSpec is the tension member as the job describes it.
type MemberSpec struct {
	Shape engine.Shape
	// Size is the catalog designation as written ("" when explicit). A
	// size with the shorter leg first (L4x6x1/2) connects that leg.
	Size      string
	Legs      [2]units.Length // explicit angle legs, connected leg first
	Width     units.Length    // flats
	Thickness units.Length    // explicit angles and flats
	Steel     SteelSpec
	Length    units.Length // 0: not given
	// Overrides of computed properties of ONE angle; 0: computed.
	Area       units.Area
	Xbar, Rmin units.Length
	// Gap is the plate between double angles; 0: the plate thickness, or
	// 3/8 in (10 mm) without a plate.
	Gap units.Length
	// Eccentricity (flats only) says whether the design provides for a
	// bolt group off the bar's centre line (J1.7); default not provided.
	Eccentricity engine.EndEccentricity
	// Hole is the member's own hole type (member.hole, member.slot).
	Hole PlyHole
}

// PlateSpec is the gusset or splice plate the member bolts to.
type PlateSpec struct {
	Kind      engine.PlateKind
	Thickness units.Length // 0 when AutoThickness
	// AutoThickness: thickness "auto", chosen by propose from the stock.
	AutoThickness bool
	Steel         SteelSpec
	Width         units.Length // across the load
	Edge          units.Length // last bolt to the free edge; 0: not given (propose)
	// Hole is the plate's own hole type (plate.hole, plate.slot).
	Hole PlyHole
}

// PlyHole is one ply's own hole type and slot direction, where the job
// gives them (member.hole and member.slot, plate.hole and plate.slot);
// what it leaves out follows bolts.hole and bolts.slot.
type PlyHole struct {
	Type             rules.HoleType
	Slot             rules.SlotDir
	HasType, HasSlot bool
}

// BoltSpec is the bolts block: the bolt and, unless explicit holes are
// given, the pattern. Diameter, Grade, PerLine, Pitch, End and Gage may be
// absent (zero) in a propose job; Build requires what it needs.
type BoltSpec struct {
	Diameter units.Length
	Grade    string
	Threads  rules.Threads
	Joint    rules.Joint
	Surface  rules.SlipClass
	Fillers  int // 2 means two or more
	// FillerThickness is the total thickness of the fillers at a shear
	// plane (0: none or not given); FillerDeveloped says they are welded or
	// extended and bolted to carry their share (J5.2(b)).
	FillerThickness       units.Length
	FillerDeveloped       bool
	Hole                  rules.HoleType
	Slot                  rules.SlotDir
	DeformationConsidered bool

	Lines   int // default 1
	PerLine int
	Pitch   units.Length
	End     units.Length
	Gage    units.Length
	Gage2   units.Length
	Stagger units.Length
}

// HoleCentre is an explicit hole centre: x from the member end, y from the
// heel (angles) or edge (flats).
type HoleCentre struct{ X, Y units.Length }

// Objective is what propose minimises first.
type Objective int

const (
	FewestBolts    Objective = iota // "bolts"
	ShortestLength                  // "length"
)

// Other is the other objective: the tie-break of this one.
func (o Objective) Other() Objective {
	if o == FewestBolts {
		return ShortestLength
	}
	return FewestBolts
}

// String returns the job-file spelling.
func (o Objective) String() string {
	if o == ShortestLength {
		return "length"
	}
	return "bolts"
}

// Stock is what the shop stocks and prefers (propose only).
type Stock struct {
	Diameters   []units.Length
	Grades      []string
	MaxLines    int          // 0: not given
	MaxPerLine  int          // 0: not given
	Step        units.Length // default 1/4 in (us), 5 mm (si)
	Thicknesses []units.Length
	Objective   Objective
}

// Tolerance is the fabrication tolerance reverify applies. Defaults are
// common practice, no source: ±1/16 in (2 mm) position, 1/32 in (1 mm)
// diameter.
type Tolerance struct {
	Position units.Length
	Diameter units.Length
}

// MemberHole returns the hole type and slot direction of the member's ply:
// member.hole and member.slot, else bolts.hole and bolts.slot. The slot
// direction of a round hole is Transverse.
func (j *Job) MemberHole() (rules.HoleType, rules.SlotDir) { return j.plyHole(j.Member.Hole) }

// PlateHole returns the hole type and slot direction of the plate's ply:
// plate.hole and plate.slot, else bolts.hole and bolts.slot (also without
// a plate block).
func (j *Job) PlateHole() (rules.HoleType, rules.SlotDir) {
	if j.Plate == nil {
		return j.plyHole(PlyHole{})
	}
	return j.plyHole(j.Plate.Hole)
}

func (j *Job) plyHole(h PlyHole) (rules.HoleType, rules.SlotDir) {
	t, dir := j.Bolts.Hole, j.Bolts.Slot
	if h.HasType {
		t = h.Type
	}
	if h.HasSlot {
		dir = h.Slot
	}
	if !t.IsSlot() {
		dir = rules.Transverse
	}
	return t, dir
}

// Given reports whether the job file wrote the scalar at path.
func (j *Job) Given(path string) bool {
	_, ok := j.Raw[path]
	return ok
}

// Line returns the line of path in the job file, or of its nearest
// enclosing field that is written; 0 when unknown.
func (j *Job) Line(path string) int {
	for p := path; ; p = parentPath(p) {
		if l, ok := j.lines[p]; ok {
			return l
		}
		if p == "" {
			return 0
		}
	}
}

// parentPath strips the last key or index of a field path.
func parentPath(p string) string {
	i := strings.LastIndexAny(p, ".[")
	if i < 0 {
		return ""
	}
	return p[:i]
}

// FieldError is an InputError at the field path, on the line the job
// recorded.
func (j *Job) FieldError(path, msg, hint string) *InputError {
	return &InputError{File: j.File, Line: j.Line(path), Field: path, Msg: msg, Hint: hint}
}

// MaxJobSize is the largest job file read.
const MaxJobSize = 1 << 20

// MaxHoles is the most holes a job may ask for: beyond it the input is a
// typo.
const MaxHoles = 1000

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

// LoadJob reads and parses a job file.
func LoadJob(path string) (*Job, error) {
	f, err := fileset.OpenRegular(path)
	if err != nil {
		return nil, &InputError{File: path, Msg: "cannot read the job: " + fileset.ErrText(err), Hint: fileset.NotRegularHint(err)}
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, MaxJobSize+1))
	if err != nil {
		return nil, &InputError{File: path, Msg: "cannot read the job: " + fileset.ErrText(err)}
	}
	return ParseJob(path, data)
}

var yamlLine = regexp.MustCompile(`^yaml: line (\d+): (.*)$`)

// ParseJob parses the YAML job in data; file names it in errors. Every
// error is an *InputError.
func ParseJob(file string, data []byte) (*Job, error) {
	if len(data) > MaxJobSize {
		return nil, &InputError{File: file, Msg: fmt.Sprintf("job file is larger than %d KiB", MaxJobSize>>10),
			Hint: "a job file is a few dozen lines; is this the right file?"}
	}
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, &InputError{File: file, Msg: "job file is empty", Hint: "a job needs at least mark, load, member and bolts"}
	}
	dec := yaml.NewDecoder(bytes.NewReader(data))
	var doc yaml.Node
	if err := dec.Decode(&doc); err != nil {
		if err == io.EOF {
			return nil, &InputError{File: file, Msg: "job file is empty", Hint: "a job needs at least mark, load, member and bolts"}
		}
		return nil, yamlErr(file, err)
	}
	var next yaml.Node
	if err := dec.Decode(&next); err != io.EOF {
		if err != nil {
			return nil, yamlErr(file, err)
		}
		return nil, &InputError{File: file, Line: next.Line, Msg: "more than one YAML document", Hint: "one job per file; remove the '---' separator"}
	}
	if doc.Kind != yaml.DocumentNode || len(doc.Content) == 0 {
		return nil, &InputError{File: file, Msg: "job file is empty"}
	}
	root := doc.Content[0]
	if root.Kind != yaml.MappingNode {
		return nil, &InputError{File: file, Line: root.Line, Msg: "a job must be a mapping of keys (mark:, load:, member:, …)"}
	}
	p := &parser{job: &Job{
		File:   file,
		SHA256: fmt.Sprintf("%x", sha256.Sum256(data)),
		Raw:    map[string]string{},
		lines:  map[string]int{"": root.Line},
		root:   &doc,
	}}
	if err := p.noAliases(root, ""); err != nil {
		return nil, err
	}
	if err := p.parseRoot(root); err != nil {
		return nil, err
	}
	return p.job, nil
}

func yamlErr(file string, err error) *InputError {
	msg := err.Error()
	if m := yamlLine.FindStringSubmatch(msg); m != nil {
		line, _ := strconv.Atoi(m[1])
		return &InputError{File: file, Line: line, Msg: "not valid YAML: " + m[2]}
	}
	return &InputError{File: file, Msg: "not valid YAML: " + strings.TrimPrefix(msg, "yaml: ")}
}

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

// force reads a load at path: finite, ≥ 0, at most 1e6 kip.
func (p *parser) force(n *yaml.Node, path string) (units.Force, error) {
	v, err := p.quantity(n, path, units.DimForce)
	if err != nil {
		return 0, err
	}
	f := units.Force(v)
	switch {
	case f < 0:
		return 0, p.errAt(n, path, "must not be negative", "a tension member's load is given as a positive tension")
	case f > maxForce:
		return 0, p.errAt(n, path, "is absurdly large (over 1,000,000 kip)", "check the unit")
	}
	return f, nil
}

// stress reads a yield or tensile stress at path.
func (p *parser) stress(n *yaml.Node, path string) (units.Stress, error) {
	v, err := p.quantity(n, path, units.DimStress)
	if err != nil {
		return 0, err
	}
	s := units.Stress(v)
	switch {
	case s <= 0:
		return 0, p.errAt(n, path, "must be greater than zero", "")
	case s > maxStress:
		return 0, p.errAt(n, path, "is absurdly large for structural steel (over 2000 MPa)", "check the unit")
	}
	return s, nil
}

// area reads an area override at path.
func (p *parser) area(n *yaml.Node, path string) (units.Area, error) {
	v, err := p.quantity(n, path, units.DimArea)
	if err != nil {
		return 0, err
	}
	a := units.Area(v)
	switch {
	case a <= 0:
		return 0, p.errAt(n, path, "must be greater than zero", "")
	case a >= maxArea:
		return 0, p.errAt(n, path, "is absurdly large (10 m² or more)", "check the unit")
	case a < minArea:
		return 0, p.errAt(n, path, "is absurdly small (under 0.000001 mm²)", "check the unit and the exponent")
	}
	return a, nil
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

// markPattern: a mark names its output folder and files, so it never
// starts with '.' (a hidden file) or '-' (read as an option by shell tools).
var markPattern = regexp.MustCompile(`^[A-Za-z0-9_][A-Za-z0-9._-]{0,39}$`)

var rootKeys = []string{"mark", "units", "standard", "method", "quantity", "load", "member", "plate", "bolts", "holes", "stock", "tolerance"}

func (p *parser) parseRoot(root *yaml.Node) error {
	j := p.job
	b, err := p.mapping(root, "", rootKeys)
	if err != nil {
		return err
	}
	// Units first: bare numbers everywhere else are read in its defaults.
	j.Units = units.US
	if n := b.vals["units"]; n != nil {
		if j.Units, err = enum(p, n, "units", units.ParseSystem); err != nil {
			return err
		}
	}
	if n := b.vals["mark"]; n != nil {
		if j.Mark, err = p.scalar(n, "mark"); err != nil {
			return err
		}
		if !markPattern.MatchString(j.Mark) || j.Mark == "." || j.Mark == ".." {
			return p.errAt(n, "mark", fmt.Sprintf("%q is not a usable mark", j.Mark),
				"a mark is 1 to 40 letters, digits, '.', '_' or '-', not starting with '.' or '-' (it names the output files), e.g. BR-12")
		}
	} else {
		return p.missing(b, "mark", "is required", "add a piece mark, e.g. mark: BR-12")
	}
	j.Standard = rules.Names()[0]
	if n := b.vals["standard"]; n != nil {
		if j.Standard, err = p.word(n, "standard"); err != nil {
			return err
		}
		if !slices.Contains(rules.Names(), j.Standard) {
			return p.errAt(n, "standard", fmt.Sprintf("unknown standard %q", j.Standard),
				"known standards: "+strings.Join(rules.Names(), ", "))
		}
	}
	j.Method = rules.LRFD
	if n := b.vals["method"]; n != nil {
		if j.Method, err = enum(p, n, "method", rules.ParseMethod); err != nil {
			return err
		}
	}
	j.Quantity = 1
	if n := b.vals["quantity"]; n != nil {
		if j.Quantity, err = p.integer(n, "quantity", 1, maxQuantity); err != nil {
			return err
		}
	}
	if n := b.vals["load"]; n != nil {
		if err := p.parseLoad(n); err != nil {
			return err
		}
	} else {
		return p.missing(b, "load", "is required", "give load: required: …, or service loads such as dead: and live:")
	}
	if n := b.vals["member"]; n != nil {
		if err := p.parseMember(n); err != nil {
			return err
		}
	} else {
		return p.missing(b, "member", "is required", "describe the member: shape, size (or legs/width and thickness) and grade")
	}
	if n := b.vals["plate"]; n != nil {
		if err := p.parsePlate(n); err != nil {
			return err
		}
	}
	if err := p.parseBolts(b.vals["bolts"]); err != nil {
		return err
	}
	if err := p.checkPlyHoles(); err != nil {
		return err
	}
	if n := b.vals["holes"]; n != nil {
		if err := p.parseHoles(n); err != nil {
			return err
		}
	}
	if err := p.parseStock(b.vals["stock"]); err != nil {
		return err
	}
	return p.parseTolerance(b.vals["tolerance"])
}

var serviceKeys = []string{"dead", "live", "roof_live", "snow", "rain", "wind", "seismic"}

func (p *parser) parseLoad(n *yaml.Node) error {
	b, err := p.mapping(n, "load", append([]string{"required"}, serviceKeys...))
	if err != nil {
		return err
	}
	l := &p.job.Load
	if b.has("required") {
		for _, k := range serviceKeys {
			if b.has(k) {
				return p.errAt(b.vals["required"], "load.required", "give either the required strength or service loads ("+k+": …), not both",
					"required is the combined demand; service loads are combined by the tool")
			}
		}
		if l.Required, err = p.force(b.vals["required"], "load.required"); err != nil {
			return err
		}
		if l.Required == 0 {
			return p.errAt(b.vals["required"], "load.required", "must be greater than zero", "")
		}
		return nil
	}
	dst := []*units.Force{&l.Service.D, &l.Service.L, &l.Service.Lr, &l.Service.S, &l.Service.R, &l.Service.W, &l.Service.E}
	var any bool
	for i, k := range serviceKeys {
		if !b.has(k) {
			continue
		}
		if *dst[i], err = p.force(b.vals[k], b.sub(k)); err != nil {
			return err
		}
		any = any || *dst[i] > 0
	}
	if !any {
		return p.missing(b, "load", "has no load greater than zero", "give required: …, or at least one of "+strings.Join(serviceKeys, ", "))
	}
	return nil
}

var memberKeys = []string{"shape", "size", "legs", "thickness", "width", "grade", "fy", "fu", "length", "area", "xbar", "rmin", "gap", "eccentricity", "hole", "slot"}

func parseShape(s string) (engine.Shape, error) {
	for _, sh := range engine.Shapes() {
		if sh.String() == s {
			return sh, nil
		}
	}
	return engine.Angle, fmt.Errorf("unknown shape %q (want %s)", s, engine.ShapeNames())
}

func parseEccentricity(s string) (engine.EndEccentricity, error) {
	for _, e := range []engine.EndEccentricity{engine.EccentricityNotProvided, engine.EccentricityProvided} {
		if e.String() == s {
			return e, nil
		}
	}
	return engine.EccentricityNotProvided, fmt.Errorf("unknown eccentricity setting %q (want provided or not-provided)", s)
}

func (p *parser) parseMember(n *yaml.Node) error {
	b, err := p.mapping(n, "member", memberKeys)
	if err != nil {
		return err
	}
	m := &p.job.Member
	if !b.has("shape") {
		return p.missing(b, "member.shape", "is required", "shape: angle, double-angle or flat")
	}
	if m.Shape, err = enum(p, b.vals["shape"], "member.shape", parseShape); err != nil {
		return err
	}
	if low, _ := m.Shape.FreeEdges(); low { // a bar, given by width and thickness
		for _, k := range []string{"size", "legs", "area", "xbar", "rmin", "gap"} {
			if b.has(k) {
				hint := "a flat bar is given by width and thickness, e.g. width: 6 in, thickness: 1/2 in"
				if k == "gap" {
					hint = "gap is the plate between double angles"
				}
				return p.errAt(b.vals[k], b.sub(k), k+" does not apply to a flat bar", hint)
			}
		}
		for _, k := range []string{"width", "thickness"} {
			if !b.has(k) {
				return p.missing(b, b.sub(k), "is required for a flat bar", "a flat bar is given by width and thickness")
			}
		}
		if m.Width, err = p.length(b.vals["width"], "member.width", positive); err != nil {
			return err
		}
		if m.Thickness, err = p.length(b.vals["thickness"], "member.thickness", positive); err != nil {
			return err
		}
	} else {
		if err := p.parseAngleSection(b); err != nil {
			return err
		}
	}
	if v := b.vals["eccentricity"]; v != nil {
		if !m.Shape.CentredGroup() {
			return p.errAt(v, "member.eccentricity", "eccentricity is for flat bars",
				"J1.7 does not require the bolt group of a single- or double-angle end to lie on the member's gravity axis; remove the key")
		}
		if m.Eccentricity, err = enum(p, v, "member.eccentricity", parseEccentricity); err != nil {
			return err
		}
	}
	if m.Steel, err = p.parseSteel(b); err != nil {
		return err
	}
	if b.has("length") {
		if m.Length, err = p.length(b.vals["length"], "member.length", positive); err != nil {
			return err
		}
	}
	if b.has("area") {
		if m.Area, err = p.area(b.vals["area"], "member.area"); err != nil {
			return err
		}
	}
	for _, o := range []struct {
		k string
		v *units.Length
	}{{"xbar", &m.Xbar}, {"rmin", &m.Rmin}, {"gap", &m.Gap}} {
		if !b.has(o.k) {
			continue
		}
		if *o.v, err = p.length(b.vals[o.k], b.sub(o.k), positive); err != nil {
			return err
		}
	}
	m.Hole, err = p.parsePlyHole(b)
	return err
}

// parsePlyHole reads a ply's own hole and slot keys of block b.
func (p *parser) parsePlyHole(b *block) (PlyHole, error) {
	var h PlyHole
	var err error
	if b.has("hole") {
		if h.Type, err = enum(p, b.vals["hole"], b.sub("hole"), rules.ParseHoleType); err != nil {
			return h, err
		}
		h.HasType = true
	}
	if b.has("slot") {
		if h.Slot, err = enum(p, b.vals["slot"], b.sub("slot"), rules.ParseSlotDir); err != nil {
			return h, err
		}
		h.HasSlot = true
	}
	return h, nil
}

// checkPlyHoles rejects a ply's slot direction given for round holes: the
// ply's hole type (its own, else bolts.hole) must be a slot.
func (p *parser) checkPlyHoles() error {
	j := p.job
	check := func(ply string, h PlyHole, t rules.HoleType) error {
		if !h.HasSlot || t.IsSlot() {
			return nil
		}
		from := ply + ".hole"
		if !h.HasType {
			from = "bolts.hole"
		}
		return j.FieldError(ply+".slot", fmt.Sprintf("is for slotted holes, and the %s's holes are %s (%s)", ply, t, from),
			fmt.Sprintf("give %s.hole: short-slot or long-slot, or remove %s.slot", ply, ply))
	}
	mt, _ := j.MemberHole()
	if err := check("member", j.Member.Hole, mt); err != nil {
		return err
	}
	if j.Plate != nil {
		pt, _ := j.PlateHole()
		return check("plate", j.Plate.Hole, pt)
	}
	return nil
}

// parseAngleSection reads size, or legs and thickness, of a single or
// double angle.
func (p *parser) parseAngleSection(b *block) error {
	m := &p.job.Member
	var err error
	if b.has("width") {
		return p.errAt(b.vals["width"], "member.width", "width is for flat bars",
			"an angle is given by size (e.g. L4x4x1/2), or legs: [4 in, 4 in] and thickness")
	}
	if m.Shape.Pieces() == 1 && b.has("gap") {
		return p.errAt(b.vals["gap"], "member.gap", "gap is for double angles only", "")
	}
	switch {
	case b.has("size") && b.has("legs"):
		return p.errAt(b.vals["legs"], "member.legs", "give either size or legs, not both", "")
	case b.has("size"):
		if b.has("thickness") {
			return p.errAt(b.vals["thickness"], "member.thickness", "the thickness is part of size", "remove thickness, or give legs instead of size")
		}
		if m.Size, err = p.word(b.vals["size"], "member.size"); err != nil {
			return err
		}
	case b.has("legs"):
		if !b.has("thickness") {
			return p.errAt(b.vals["legs"], "member.thickness", "is required with legs", "thickness: 1/2 in")
		}
		n := b.vals["legs"]
		if n.Kind != yaml.SequenceNode || len(n.Content) != 2 {
			return p.errAt(n, "member.legs", "want two legs, connected leg first, e.g. [4 in, 3 in]", "")
		}
		for i, c := range n.Content {
			if m.Legs[i], err = p.length(c, fmt.Sprintf("member.legs[%d]", i), positive); err != nil {
				return err
			}
		}
		if m.Thickness, err = p.length(b.vals["thickness"], "member.thickness", positive); err != nil {
			return err
		}
		if m.Thickness >= min(m.Legs[0], m.Legs[1]) {
			return p.errAt(b.vals["thickness"], "member.thickness", "is not less than the shorter leg", "")
		}
	default:
		return p.missing(b, "member.size", "an angle needs size, or legs and thickness",
			"size: L4x4x1/2 (us) or L100x100x10 (si)")
	}
	return nil
}

// parseSteel reads grade, or fy and fu, of the block b.
func (p *parser) parseSteel(b *block) (SteelSpec, error) {
	var s SteelSpec
	var err error
	hasFy, hasFu := b.has("fy"), b.has("fu")
	switch {
	case b.has("grade") && (hasFy || hasFu):
		k := "fy"
		if !hasFy {
			k = "fu"
		}
		return s, p.errAt(b.vals[k], b.sub(k), "give either grade or fy and fu, not both", "")
	case b.has("grade"):
		s.Grade, err = p.word(b.vals["grade"], b.sub("grade"))
		return s, err
	case hasFy != hasFu:
		given, missing := "fy", "fu"
		if hasFu {
			given, missing = "fu", "fy"
		}
		return s, p.errAt(b.vals[given], b.sub(missing), "is required with "+given, "give both fy and fu, or a catalog grade")
	case !hasFy:
		return s, p.missing(b, b.sub("grade"), "is required", "grade: A36, A572-50, … or fy and fu")
	}
	if s.Fy, err = p.stress(b.vals["fy"], b.sub("fy")); err != nil {
		return s, err
	}
	if s.Fu, err = p.stress(b.vals["fu"], b.sub("fu")); err != nil {
		return s, err
	}
	if s.Fu <= s.Fy {
		return s, p.errAt(b.vals["fu"], b.sub("fu"), "must be greater than fy", "fu is the tensile strength, fy the yield stress")
	}
	return s, nil
}

var plateKeys = []string{"kind", "thickness", "grade", "fy", "fu", "width", "edge", "hole", "slot"}

func parsePlateKind(s string) (engine.PlateKind, error) {
	switch s {
	case "gusset":
		return engine.Gusset, nil
	case "splice":
		return engine.Splice, nil
	}
	return engine.Gusset, fmt.Errorf("unknown plate kind %q (want gusset or splice)", s)
}

func (p *parser) parsePlate(n *yaml.Node) error {
	b, err := p.mapping(n, "plate", plateKeys)
	if err != nil {
		return err
	}
	pl := &PlateSpec{}
	if b.has("kind") {
		if pl.Kind, err = enum(p, b.vals["kind"], "plate.kind", parsePlateKind); err != nil {
			return err
		}
	}
	if !b.has("thickness") {
		return p.missing(b, "plate.thickness", "is required", "thickness: 1/2 in, or auto to let propose choose")
	}
	if t := b.vals["thickness"]; t.Kind == yaml.ScalarNode && strings.TrimSpace(t.Value) == "auto" {
		p.job.Raw["plate.thickness"] = t.Value
		p.job.lines["plate.thickness"] = t.Line
		pl.AutoThickness = true
	} else if pl.Thickness, err = p.length(t, "plate.thickness", positive); err != nil {
		return err
	}
	if pl.Steel, err = p.parseSteel(b); err != nil {
		return err
	}
	if !b.has("width") {
		return p.missing(b, "plate.width", "is required", "the plate's width across the load, e.g. width: 12 in")
	}
	if pl.Width, err = p.length(b.vals["width"], "plate.width", positive); err != nil {
		return err
	}
	if b.has("edge") {
		if pl.Edge, err = p.length(b.vals["edge"], "plate.edge", positive); err != nil {
			return err
		}
	}
	if pl.Hole, err = p.parsePlyHole(b); err != nil {
		return err
	}
	p.job.Plate = pl
	return nil
}

var boltKeys = []string{"diameter", "grade", "threads", "joint", "surface", "fillers", "filler_thickness", "filler_developed",
	"hole", "slot", "deformation", "lines", "per_line", "pitch", "end", "gage", "gage2", "stagger"}

// patternKeys are the bolts keys that generate hole centres.
var patternKeys = []string{"lines", "per_line", "pitch", "end", "gage", "gage2", "stagger"}

func parseDeformation(s string) (bool, error) {
	switch s {
	case "considered":
		return true, nil
	case "not-considered":
		return false, nil
	}
	return true, fmt.Errorf("unknown deformation setting %q (want considered or not-considered)", s)
}

func (p *parser) parseBolts(n *yaml.Node) error {
	bs := &p.job.Bolts
	bs.DeformationConsidered = true
	bs.Lines = 1
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "bolts", boltKeys)
	if err != nil {
		return err
	}
	if b.has("diameter") {
		v := b.vals["diameter"]
		s, err := p.word(v, "bolts.diameter")
		if err != nil {
			return err
		}
		if bs.Diameter, err = units.ParseBoltDiameter(s, p.sys()); err != nil {
			return p.errAt(v, "bolts.diameter", err.Error(), `write a diameter such as "3/4 in", "20 mm" or "M20"`)
		}
		if !(bs.Diameter > 0) || bs.Diameter >= 10*units.Inch {
			return p.errAt(v, "bolts.diameter", "is not a bolt diameter", "bolt diameters run from 1/2 in (M12) to 1-1/2 in (M36)")
		}
	}
	if b.has("grade") {
		if bs.Grade, err = p.word(b.vals["grade"], "bolts.grade"); err != nil {
			return err
		}
	}
	if b.has("threads") {
		if bs.Threads, err = enum(p, b.vals["threads"], "bolts.threads", rules.ParseThreads); err != nil {
			return err
		}
	}
	if b.has("joint") {
		if bs.Joint, err = enum(p, b.vals["joint"], "bolts.joint", rules.ParseJoint); err != nil {
			return err
		}
	}
	if b.has("surface") {
		if bs.Surface, err = enum(p, b.vals["surface"], "bolts.surface", rules.ParseSlipClass); err != nil {
			return err
		}
	}
	if b.has("fillers") {
		v := b.vals["fillers"]
		if v.Kind == yaml.ScalarNode && strings.TrimSpace(v.Value) == "2+" {
			p.job.Raw["bolts.fillers"] = v.Value
			p.job.lines["bolts.fillers"] = v.Line
			bs.Fillers = 2
		} else if bs.Fillers, err = p.integer(v, "bolts.fillers", 0, maxFillers); err != nil {
			err.(*InputError).Hint = "fillers counts the fillers (0, 1 or 2+); give their thickness as filler_thickness"
			return err
		}
	}
	if err := p.parseFiller(b, bs); err != nil {
		return err
	}
	if b.has("hole") {
		if bs.Hole, err = enum(p, b.vals["hole"], "bolts.hole", rules.ParseHoleType); err != nil {
			return err
		}
	}
	if b.has("slot") {
		if bs.Slot, err = enum(p, b.vals["slot"], "bolts.slot", rules.ParseSlotDir); err != nil {
			return err
		}
	}
	if b.has("deformation") {
		if bs.DeformationConsidered, err = enum(p, b.vals["deformation"], "bolts.deformation", parseDeformation); err != nil {
			return err
		}
	}
	if b.has("lines") {
		if bs.Lines, err = p.integer(b.vals["lines"], "bolts.lines", 1, maxLines); err != nil {
			return err
		}
	}
	if b.has("per_line") {
		if bs.PerLine, err = p.integer(b.vals["per_line"], "bolts.per_line", 1, maxPerLine); err != nil {
			return err
		}
		if bs.Lines*bs.PerLine > MaxHoles {
			return p.errAt(b.vals["per_line"], "bolts.per_line", fmt.Sprintf("%d lines of %d make %d bolts (at most %d)",
				bs.Lines, bs.PerLine, bs.Lines*bs.PerLine, MaxHoles), "")
		}
	}
	for _, o := range []struct {
		k string
		v *units.Length
		r lengthRule
	}{
		{"pitch", &bs.Pitch, positive},
		{"end", &bs.End, positive},
		{"gage", &bs.Gage, positive},
		{"gage2", &bs.Gage2, positive},
		{"stagger", &bs.Stagger, nonNegative},
	} {
		if !b.has(o.k) {
			continue
		}
		if *o.v, err = p.length(b.vals[o.k], b.sub(o.k), o.r); err != nil {
			return err
		}
	}
	return nil
}

func parseFlag(s string) (bool, error) {
	switch s {
	case "true":
		return true, nil
	case "false":
		return false, nil
	}
	return false, fmt.Errorf("want true or false, not %q", s)
}

// parseFiller reads filler_thickness, the total thickness of the fillers
// at a shear plane (J5.2), and filler_developed (J5.2(b)).
func (p *parser) parseFiller(b *block, bs *BoltSpec) error {
	var err error
	if v := b.vals["filler_thickness"]; v != nil {
		if bs.FillerThickness, err = p.length(v, "bolts.filler_thickness", nonNegative); err != nil {
			return err
		}
		if bs.FillerThickness >= maxFillerThickness {
			return p.errAt(v, "bolts.filler_thickness", "is absurdly thick for a filler (6 in, 150 mm, or more)",
				"the total thickness of the fillers at one shear plane, e.g. 1/2 in; check the unit")
		}
		if bs.FillerThickness > 0 && b.has("fillers") && bs.Fillers == 0 {
			return p.errAt(v, "bolts.filler_thickness", "is given but bolts.fillers is 0",
				"give fillers: 1 (or 2+), or remove filler_thickness")
		}
	}
	if v := b.vals["filler_developed"]; v != nil {
		if bs.FillerDeveloped, err = enum(p, v, "bolts.filler_developed", parseFlag); err != nil {
			return err
		}
		if bs.FillerDeveloped && bs.FillerThickness == 0 {
			return p.errAt(v, "bolts.filler_developed", "says the fillers are developed but bolts.filler_thickness gives none",
				"give filler_thickness, the total thickness of the fillers at one shear plane")
		}
	}
	return nil
}

func (p *parser) parseHoles(n *yaml.Node) error {
	items, err := p.list(n, "holes", "[[1.5 in, 2.5 in], [4.5 in, 2.5 in]]", MaxHoles)
	if err != nil {
		return err
	}
	// Explicit holes replace the pattern: a pattern key alongside is a
	// contradiction, not a default.
	for _, k := range patternKeys {
		if path := "bolts." + k; p.job.Given(path) {
			return &InputError{File: p.job.File, Line: p.job.Line(path), Field: path,
				Msg:  k + " cannot be used with explicit holes",
				Hint: "remove bolts." + k + ", or remove the holes list to use the pattern"}
		}
	}
	p.job.Holes = make([]HoleCentre, len(items))
	for i, it := range items {
		path := fmt.Sprintf("holes[%d]", i)
		p.job.lines[path] = it.Line
		if it.Kind != yaml.SequenceNode || len(it.Content) != 2 {
			return p.errAt(it, path, "want a hole centre [x, y]", "e.g. - [1.5 in, 2.5 in]: x from the member end, y from the heel or edge")
		}
		var xy [2]units.Length
		for c, name := range []string{"x", "y"} {
			v, err := p.length(it.Content[c], fmt.Sprintf("%s[%d]", path, c), anySign)
			if err != nil {
				e := err.(*InputError)
				e.Field, e.Msg = path, name+" "+e.Msg
				return e
			}
			xy[c] = v
		}
		p.job.Holes[i] = HoleCentre{X: xy[0], Y: xy[1]}
	}
	return nil
}

var stockKeys = []string{"diameters", "grades", "max_lines", "max_per_line", "step", "thicknesses", "objective"}

func parseObjective(s string) (Objective, error) {
	switch s {
	case "bolts":
		return FewestBolts, nil
	case "length":
		return ShortestLength, nil
	}
	return FewestBolts, fmt.Errorf("unknown objective %q (want bolts or length)", s)
}

func (p *parser) parseStock(n *yaml.Node) error {
	st := &p.job.Stock
	st.Step = units.Inch / 4 // common practice, no source
	if p.sys() == units.SI {
		st.Step = 5 * units.Millimetre // SPEC §3
	}
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "stock", stockKeys)
	if err != nil {
		return err
	}
	if v := b.vals["diameters"]; v != nil {
		items, err := p.list(v, "stock.diameters", "[3/4 in, 7/8 in]", 50)
		if err != nil {
			return err
		}
		for i, it := range items {
			path := fmt.Sprintf("stock.diameters[%d]", i)
			s, err := p.word(it, path)
			if err != nil {
				return err
			}
			d, err := units.ParseBoltDiameter(s, p.sys())
			if err != nil {
				return p.errAt(it, path, err.Error(), `write a diameter such as "3/4 in", "20 mm" or "M20"`)
			}
			if !(d > 0) || d >= 10*units.Inch {
				return p.errAt(it, path, "is not a bolt diameter", "")
			}
			st.Diameters = append(st.Diameters, d)
		}
	}
	if v := b.vals["grades"]; v != nil {
		items, err := p.list(v, "stock.grades", "[A325, A490]", 50)
		if err != nil {
			return err
		}
		for i, it := range items {
			g, err := p.word(it, fmt.Sprintf("stock.grades[%d]", i))
			if err != nil {
				return err
			}
			st.Grades = append(st.Grades, g)
		}
	}
	if v := b.vals["max_lines"]; v != nil {
		if st.MaxLines, err = p.integer(v, "stock.max_lines", 1, maxLines); err != nil {
			return err
		}
	}
	if v := b.vals["max_per_line"]; v != nil {
		if st.MaxPerLine, err = p.integer(v, "stock.max_per_line", 1, maxPerLine); err != nil {
			return err
		}
	}
	if v := b.vals["step"]; v != nil {
		if st.Step, err = p.length(v, "stock.step", positive); err != nil {
			return err
		}
	}
	if v := b.vals["thicknesses"]; v != nil {
		items, err := p.list(v, "stock.thicknesses", "[3/8 in, 1/2 in]", 50)
		if err != nil {
			return err
		}
		for i, it := range items {
			t, err := p.length(it, fmt.Sprintf("stock.thicknesses[%d]", i), positive)
			if err != nil {
				return err
			}
			st.Thicknesses = append(st.Thicknesses, t)
		}
	}
	if v := b.vals["objective"]; v != nil {
		if st.Objective, err = enum(p, v, "stock.objective", parseObjective); err != nil {
			return err
		}
	}
	return nil
}

func (p *parser) parseTolerance(n *yaml.Node) error {
	t := &p.job.Tolerance
	// Common practice, no source (REFERENCE.md, fabrication).
	t.Position, t.Diameter = units.Inch/16, units.Inch/32
	if p.sys() == units.SI {
		t.Position, t.Diameter = 2*units.Millimetre, 1*units.Millimetre
	}
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "tolerance", []string{"position", "diameter"})
	if err != nil {
		return err
	}
	if v := b.vals["position"]; v != nil {
		if t.Position, err = p.length(v, "tolerance.position", positive); err != nil {
			return err
		}
	}
	if v := b.vals["diameter"]; v != nil {
		if t.Diameter, err = p.length(v, "tolerance.diameter", positive); err != nil {
			return err
		}
	}
	return nil
}
