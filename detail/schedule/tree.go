package schedule

import (
	"errors"
	"fmt"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/detail/jobfile"
)

// cloneNode copies a YAML tree deeply.
func cloneNode(n *yaml.Node) *yaml.Node {
	c := *n
	c.Content = make([]*yaml.Node, len(n.Content))
	for i, k := range n.Content {
		c.Content[i] = cloneNode(k)
	}
	return &c
}

// value is the node under key in mapping m; nil when there is none.
func value(m *yaml.Node, key string) *yaml.Node {
	for i := 0; i+1 < len(m.Content); i += 2 {
		if m.Content[i].Value == key {
			return m.Content[i+1]
		}
	}
	return nil
}

func deleteKey(m *yaml.Node, key string) {
	for i := 0; i+1 < len(m.Content); i += 2 {
		if m.Content[i].Value == key {
			m.Content = append(m.Content[:i], m.Content[i+2:]...)
			return
		}
	}
}

// setPath sets the dotted path in the mapping root to the plain scalar v
// (read as if typed in the job file), making the sections it needs.
func setPath(root *yaml.Node, path, v string) error {
	keys := strings.Split(path, ".")
	m := root
	for i, k := range keys {
		n := value(m, k)
		last := i == len(keys)-1
		if n == nil {
			n = &yaml.Node{Kind: yaml.MappingNode, Tag: "!!map"}
			if last {
				n = &yaml.Node{Kind: yaml.ScalarNode}
			}
			m.Content = append(m.Content, &yaml.Node{Kind: yaml.ScalarNode, Tag: "!!str", Value: k}, n)
		}
		for n.Kind == yaml.AliasNode && n.Alias != nil {
			n = n.Alias
		}
		sofar := strings.Join(keys[:i+1], ".")
		switch {
		case last && n.Kind != yaml.ScalarNode:
			return fmt.Errorf("the template gives %s as a list or a section; a cell gives one value", sofar)
		case last:
			n.Value, n.Tag, n.Style = v, "", 0
		case n.Kind != yaml.MappingNode:
			return fmt.Errorf("the template gives %s as a value, not a section of keys", sofar)
		}
		m = n
	}
	return nil
}

// rowError words the job file's error for the row: the column whose value
// it is about, or the template that gave the value.
func rowError(at string, err error, cols, given []column, tpl *template) error {
	var ie *jobfile.InputError
	if !errors.As(err, &ie) {
		return &jobfile.InputError{File: at, Msg: err.Error()}
	}
	out := &jobfile.InputError{File: at, Field: ie.Field, Msg: ie.Msg, Hint: ie.Hint}
	if c, ok := columnOf(ie.Field, cols, given); ok {
		out.File = fmt.Sprintf("%s, column %q", at, c.header)
		return out
	}
	if tpl != nil && ie.Field != "" {
		out.Field = ie.Field + " (from the template " + tpl.path + ")"
	}
	return out
}

// columnOf is the column a field's error is about: the column of the
// field itself (given or empty), else a given column inside the field
// (an error about load as a whole and a row's dead column), else a given
// column the field lies in.
func columnOf(field string, cols, given []column) (column, bool) {
	if field == "" {
		return column{}, false
	}
	for _, c := range cols {
		if c.path == field {
			return c, true
		}
	}
	for _, c := range given {
		if strings.HasPrefix(c.path, field+".") {
			return c, true
		}
	}
	for _, c := range given {
		if strings.HasPrefix(field, c.path+".") || strings.HasPrefix(field, c.path+"[") {
			return c, true
		}
	}
	return column{}, false
}
