package schedule

import (
	"fmt"
	"regexp"
	"slices"
	"strings"
)

// Short column names and the job-file field each stands for. Any field
// may also be named by its dotted path (bolts.pitch, plate.thickness,
// project.drawing); these are the ones a schedule most often has.
var shortNames = map[string]string{
	"shape": "member.shape", "size": "member.size", "grade": "member.grade", "length": "member.length",
	"gap": "member.gap", "fy": "member.fy", "fu": "member.fu",
	"required": "load.required", "compression": "load.compression",
	"dead": "load.dead", "live": "load.live", "roof_live": "load.roof_live", "snow": "load.snow",
	"rain": "load.rain", "wind": "load.wind", "seismic": "load.seismic",
	"diameter": "bolts.diameter", "bolt_grade": "bolts.grade", "threads": "bolts.threads", "joint": "bolts.joint",
	"lines": "bolts.lines", "per_line": "bolts.per_line", "pitch": "bolts.pitch", "end": "bolts.end",
	"gage": "bolts.gage", "gage2": "bolts.gage2", "stagger": "bolts.stagger",
	"edge": "plate.edge",
}

// topScalars are the job file's top-level values; topBlocks its sections
// a dotted column may reach into (holes, a list, is not one).
var (
	topScalars = []string{"mark", "units", "standard", "method", "quantity", "seismic_system"}
	topBlocks  = []string{"load", "member", "plate", "bolts", "stock", "tolerance", "project"}
)

// TemplateColumn names a row's own template job, relative to the schedule.
const TemplateColumn = "template"

// Columns lists the short column names and the fields they stand for,
// sorted, for the help text and the README.
func Columns() [][2]string {
	var out [][2]string
	for k, v := range shortNames {
		out = append(out, [2]string{k, v})
	}
	slices.SortFunc(out, func(a, b [2]string) int { return strings.Compare(a[0], b[0]) })
	return out
}

var dotted = regexp.MustCompile(`^[a-z][a-z0-9_]*(\.[a-z][a-z0-9_]*)+$`)

// normalName is a header cell as a column name: trimmed, lower case,
// blanks and hyphens as underscores ("Per line" → per_line).
func normalName(h string) string {
	h = strings.ToLower(strings.TrimSpace(h))
	h = strings.Join(strings.Fields(h), "_")
	return strings.ReplaceAll(h, "-", "_")
}

// column is one column of a schedule: its header as written, and the
// job-file field it sets ("" for the template column and comments).
type column struct {
	header   string
	path     string
	template bool
	ignored  bool // a comment column: its header starts with '#'
}

// fieldOf is the job-file field a header names, or an error.
func fieldOf(header string) (column, error) {
	c := column{header: strings.TrimSpace(header)}
	name := normalName(header)
	switch {
	case strings.HasPrefix(c.header, "#"):
		c.ignored = true
	case name == "":
		c.ignored = true // a column with no name: its cells must be empty (row checks)
	case name == TemplateColumn:
		c.template = true
	case shortNames[name] != "":
		c.path = shortNames[name]
	case slices.Contains(topScalars, name):
		c.path = name
	case dotted.MatchString(name) && slices.Contains(topBlocks, strings.SplitN(name, ".", 2)[0]):
		c.path = name
	default:
		return c, fmt.Errorf("column %q names no job-file field", c.header)
	}
	return c, nil
}

// header reads a schedule's header row into its columns: every field
// named once, a mark column among them.
func header(cells []string) ([]column, error) {
	cols := make([]column, len(cells))
	seen := map[string]string{}
	hasMark := false
	for i, h := range cells {
		c, err := fieldOf(h)
		if err != nil {
			return nil, err
		}
		key := c.path
		if c.template {
			key = TemplateColumn
		}
		if key != "" {
			if prev, dup := seen[key]; dup {
				return nil, fmt.Errorf("columns %q and %q both set %s", prev, c.header, key)
			}
			seen[key] = c.header
		}
		hasMark = hasMark || c.path == "mark"
		cols[i] = c
	}
	if !hasMark {
		return nil, fmt.Errorf("the header row has no %q column", "mark")
	}
	return cols, nil
}
