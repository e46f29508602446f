package jobfile

import (
	"bytes"
	"crypto/sha256"
	"fmt"
	"io"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/fileset"
	"gaugeline/rules"
	"gaugeline/rules/units"
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

// markPattern: a mark names its output folder and files, so it never
// starts with '.' (a hidden file) or '-' (read as an option by shell tools).
var markPattern = regexp.MustCompile(`^[A-Za-z0-9_][A-Za-z0-9._-]{0,39}$`)

var rootKeys = []string{"mark", "units", "standard", "method", "quantity", "seismic_system", "load", "member", "member_b", "plate", "bolts", "holes", "stock", "tolerance", "project"}

// parseRoot reads the job's root mapping: its scalars, then its blocks.
func (p *parser) parseRoot(root *yaml.Node) error {
	b, err := p.mapping(root, "", rootKeys)
	if err != nil {
		return err
	}
	if err := p.parseHeader(b); err != nil {
		return err
	}
	return p.parseBlocks(b)
}

// parseHeader reads the scalars of the root: units, mark, standard,
// method and quantity, each with its default.
func (p *parser) parseHeader(b *block) error {
	j := p.job
	var err error
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
	if n := b.vals["seismic_system"]; n != nil {
		return p.parseSeismic(n)
	}
	return nil
}

// parseBlocks reads the root's blocks in the order their checks depend on:
// load, member, plate, bolts (then the plies' hole types), holes, stock
// and tolerance.
func (p *parser) parseBlocks(b *block) error {
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
	if n := b.vals["member_b"]; n != nil {
		if err := p.parseMemberB(n); err != nil {
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
	if err := p.parseTolerance(b.vals["tolerance"]); err != nil {
		return err
	}
	if err := p.parseProject(b.vals["project"]); err != nil {
		return err
	}
	if err := p.parseFarEnd(); err != nil {
		return err
	}
	return p.checkCompression()
}

var serviceKeys = []string{"dead", "live", "roof_live", "snow", "rain", "wind", "seismic"}

func (p *parser) parseLoad(n *yaml.Node) error {
	b, err := p.mapping(n, "load", append([]string{"required", "compression", "reverses"}, serviceKeys...))
	if err != nil {
		return err
	}
	l := &p.job.Load
	if b.has("required") || b.has("compression") {
		return p.parseRequired(b)
	}
	dst := []*units.Force{&l.Service.D, &l.Service.L, &l.Service.Lr, &l.Service.S, &l.Service.R, &l.Service.W, &l.Service.E}
	var any bool
	for i, k := range serviceKeys {
		if !b.has(k) {
			continue
		}
		if *dst[i], err = p.signedForce(b.vals[k], b.sub(k)); err != nil {
			return err
		}
		any = any || *dst[i] != 0
	}
	if !any {
		return p.missing(b, "load", "has no load other than zero", "give required: …, or at least one of "+strings.Join(serviceKeys, ", "))
	}
	if v := b.vals["reverses"]; v != nil {
		return p.parseReverses(v)
	}
	return nil
}

// parseRequired reads the required strengths: tension (load.required)
// and compression (load.compression), instead of service loads.
func (p *parser) parseRequired(b *block) (err error) {
	l := &p.job.Load
	at, path := b.vals["required"], "load.required"
	if at == nil {
		at, path = b.vals["compression"], "load.compression"
	}
	for _, k := range append(slices.Clone(serviceKeys), "reverses") {
		if b.has(k) {
			return p.errAt(at, path, "give either the required strength or service loads ("+k+": …), not both",
				"required (and compression) are the combined demands; service loads are combined by the tool")
		}
	}
	if b.has("required") {
		if l.Required, err = p.force(b.vals["required"], "load.required"); err != nil {
			return err
		}
	}
	if b.has("compression") {
		if l.Compression, err = p.force(b.vals["compression"], "load.compression"); err != nil {
			return err
		}
	}
	if l.Required == 0 && l.Compression == 0 {
		return p.errAt(at, path, "must be greater than zero", "")
	}
	return nil
}

// parseReverses reads load.reverses: the service loads that act in
// either direction, wind and seismic.
func (p *parser) parseReverses(n *yaml.Node) error {
	if n.Kind != yaml.SequenceNode {
		return p.errAt(n, "load.reverses", "want a list, e.g. [wind] or [wind, seismic]", "")
	}
	r := &p.job.Load.Reverses
	for i, c := range n.Content {
		path := fmt.Sprintf("load.reverses[%d]", i)
		switch c.Value {
		case "wind":
			r.W = true
		case "seismic":
			r.E = true
		default:
			return p.errAt(c, path, fmt.Sprintf("unknown load %q (want wind or seismic)", c.Value),
				"only wind and seismic forces change sign with their direction; give a load that compresses the member as a negative value")
		}
	}
	return nil
}
