package jobfile

import (
	"bytes"
	"fmt"
	"strconv"

	"go.yaml.in/yaml/v3"

	"gaugeline/rules/units"
)

// A Setting is one value a rewritten job file takes: Key in the top-level
// block Block ("bolts", "plate"), written as Value with the YAML tag Tag
// ("!!str", "!!int"). Free leaves a value the job gives as the user wrote
// it.
type Setting struct {
	Block, Key, Value, Tag string
	Free                   bool
}

// blockBefore is where a block the job lacks is added: before the first of
// these keys of the document (at the end when none is there).
var blockBefore = map[string][]string{
	"bolts": {"holes", "stock", "tolerance"},
	"plate": {"bolts"},
}

// Rewrite returns the job file with the settings made, in order; every
// other key and comment stays as it was.
func (j *Job) Rewrite(settings []Setting) ([]byte, error) {
	if j.root == nil || len(j.root.Content) == 0 {
		return nil, fmt.Errorf("detail: job %s was not parsed from a file", j.File)
	}
	doc := cloneNode(j.root)
	root := doc.Content[0]
	for _, st := range settings {
		m := childMapping(root, st.Block, blockBefore[st.Block]...)
		if st.Free && j.Given(st.Block+"."+st.Key) {
			continue
		}
		setScalar(m, st.Key, st.Value, st.Tag)
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

// LengthText writes a length the way a job file does (units.FormatJob)
// when that reads back to exactly the same value, else in millimetres
// with every digit needed, so that a written layout checks exactly as it
// was chosen.
func LengthText(v units.Length, sys units.System) string {
	s := units.FormatJob(v, sys)
	if back, err := units.ParseLength(s, sys); err == nil && back == v {
		return s
	}
	return strconv.FormatFloat(v.Mm(), 'g', -1, 64) + " mm"
}
