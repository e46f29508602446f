package detail

import (
	"bytes"
	"fmt"
	"strconv"

	"go.yaml.in/yaml/v3"

	"gaugeline/rules/units"
)

// WithLayout returns the job file with the layout filled in: the pattern
// keys of the bolts block, and the plate's thickness and edge. Values the
// job fixed keep the user's spelling, chosen values are written as the
// job file writes them (units.FormatJob; stock spellings for diameters and
// thicknesses); every other key and comment stays as it was.
func (j *Job) WithLayout(l Layout) ([]byte, error) {
	if j.root == nil || len(j.root.Content) == 0 {
		return nil, fmt.Errorf("detail: job %s was not parsed from a file", j.File)
	}
	sys := j.Units
	doc := cloneNode(j.root)
	root := doc.Content[0]
	f := func(v units.Length) string { return jobLength(v, sys) }

	bolts := childMapping(root, "bolts", "holes", "stock", "tolerance")
	setIfFree := func(m *yaml.Node, path, key, value, tag string) {
		if !j.Given(path + "." + key) {
			setScalar(m, key, value, tag)
		}
	}
	setIfFree(bolts, "bolts", "diameter", l.diameterValue(sys), "!!str")
	setIfFree(bolts, "bolts", "grade", l.Grade, "!!str")
	setIfFree(bolts, "bolts", "lines", strconv.Itoa(l.Lines), "!!int")
	setIfFree(bolts, "bolts", "per_line", strconv.Itoa(l.PerLine), "!!int")
	if l.PerLine > 1 {
		setIfFree(bolts, "bolts", "pitch", f(l.Pitch), "!!str")
	}
	setIfFree(bolts, "bolts", "end", f(l.End), "!!str")
	setIfFree(bolts, "bolts", "gage", f(l.Gage), "!!str")
	if l.Lines > 1 {
		setIfFree(bolts, "bolts", "gage2", f(l.Gage2), "!!str")
	}
	if j.Plate != nil {
		plate := childMapping(root, "plate", "bolts")
		if j.Plate.AutoThickness {
			setScalar(plate, "thickness", l.thicknessValue(sys), "!!str")
		}
		setIfFree(plate, "plate", "edge", f(l.PlateEdge), "!!str")
	}

	var b bytes.Buffer
	enc := yaml.NewEncoder(&b)
	enc.SetIndent(2)
	if err := enc.Encode(doc); err != nil {
		return nil, fmt.Errorf("detail: writing job %s: %w", j.File, err)
	}
	if err := enc.Close(); err != nil {
		return nil, fmt.Errorf("detail: writing job %s: %w", j.File, err)
	}
	return b.Bytes(), nil
}

// cloneNode copies a YAML tree deeply.
func cloneNode(n *yaml.Node) *yaml.Node {
	c := *n
	c.Content = make([]*yaml.Node, len(n.Content))
	for i, k := range n.Content {
		c.Content[i] = cloneNode(k)
	}
	return &c
}

// childMapping returns the mapping under key in m, adding an empty one
// before the first of the keys before (or at the end) when absent.
func childMapping(m *yaml.Node, key string, before ...string) *yaml.Node {
	for i := 0; i+1 < len(m.Content); i += 2 {
		if m.Content[i].Value == key {
			v := m.Content[i+1]
			if v.Kind != yaml.MappingNode { // "bolts:" with no value
				*v = yaml.Node{Kind: yaml.MappingNode, Tag: "!!map"}
			}
			return v
		}
	}
	k := &yaml.Node{Kind: yaml.ScalarNode, Tag: "!!str", Value: key}
	v := &yaml.Node{Kind: yaml.MappingNode, Tag: "!!map"}
	at := len(m.Content)
	for i := 0; i+1 < len(m.Content); i += 2 {
		for _, b := range before {
			if m.Content[i].Value == b && i < at {
				at = i
			}
		}
	}
	m.Content = append(m.Content[:at], append([]*yaml.Node{k, v}, m.Content[at:]...)...)
	return v
}

// setScalar sets key in mapping m to a plain scalar, keeping the key's
// comments when it exists.
func setScalar(m *yaml.Node, key, value, tag string) {
	for i := 0; i+1 < len(m.Content); i += 2 {
		if m.Content[i].Value == key {
			v := m.Content[i+1]
			comment := v.LineComment
			*v = yaml.Node{Kind: yaml.ScalarNode, Tag: tag, Value: value, LineComment: comment}
			return
		}
	}
	m.Content = append(m.Content,
		&yaml.Node{Kind: yaml.ScalarNode, Tag: "!!str", Value: key},
		&yaml.Node{Kind: yaml.ScalarNode, Tag: tag, Value: value})
}

// jobLength writes a length the way a job file does (units.FormatJob)
// when that reads back to exactly the same value, else in millimetres
// with every digit needed, so that a written layout checks exactly as it
// was chosen.
func jobLength(v units.Length, sys units.System) string {
	s := units.FormatJob(v, sys)
	if back, err := units.ParseLength(s, sys); err == nil && back == v {
		return s
	}
	return strconv.FormatFloat(v.Mm(), 'g', -1, 64) + " mm"
}
