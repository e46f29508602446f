package schedule

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/detail/jobfile"
)

// Options is how a schedule is read.
type Options struct {
	// Template is the job that supplies what a row leaves empty, for rows
	// whose template column is empty (or a schedule without one); "" for
	// none: such rows are whole jobs.
	Template string
	// Sheets are the workbook's sheets to read; none: every sheet.
	Sheets []string
}

// Row is one connection of the schedule: the job it became, or the error
// that stops it (an *jobfile.InputError naming the sheet, row and column).
type Row struct {
	File  string // the schedule
	Sheet string // the XLSX sheet; "" for CSV
	Line  int    // the row's number as the spreadsheet shows it (CSV: its line)
	Job   *jobfile.Job
	YAML  []byte // the job file the row became; nil when it could not be built
	Err   error

	at          string // the schedule and the row, as errors start
	cols, given []column
	tpl         *template
}

// Explain words an error found later in the row's job (a size the catalog
// lacks, a bolt that does not fit) as the row's: the column of the field
// it names, no line of the job text. Other errors pass as they are.
func (r Row) Explain(err error) error {
	var ie *jobfile.InputError
	if r.at == "" || !errors.As(err, &ie) || ie.File != r.at {
		return err
	}
	return rowError(r.at, err, r.cols, r.given, r.tpl)
}

// Where names the row: `sheet "Braces", row 14` or, in a CSV file, `row 14`.
func (r Row) Where() string { return where(r.Sheet, r.Line) }

func where(sheet string, line int) string {
	if sheet == "" {
		return fmt.Sprintf("row %d", line)
	}
	return fmt.Sprintf("sheet %q, row %d", sheet, line)
}

// Read reads every row of the schedule at path into a job. The error is
// the schedule's as a whole (unreadable, a bad header, a template that is
// not a job file's mapping); a row's own error is in the row, and the
// other rows carry on. Blank rows and sheets are skipped.
func Read(path string, o Options) ([]Row, error) {
	data, err := readFile(path)
	if err != nil {
		return nil, err
	}
	var tables []table
	if strings.EqualFold(filepath.Ext(path), ".xlsx") {
		tables, err = readXLSX(path, data, o.Sheets)
	} else {
		if len(o.Sheets) > 0 {
			return nil, &jobfile.InputError{File: path, Msg: "a CSV schedule has no sheets to choose", Hint: "--sheet is for XLSX workbooks"}
		}
		tables, err = readCSV(path, data)
	}
	if err != nil {
		return nil, err
	}
	b := builder{file: path, dir: filepath.Dir(path), flag: o.Template, templates: map[string]*template{}}
	var rows []Row
	for _, t := range tables {
		rs, err := b.table(t)
		if err != nil {
			return nil, err
		}
		rows = append(rows, rs...)
	}
	if len(rows) == 0 {
		return nil, &jobfile.InputError{File: path, Msg: "the schedule has no connection rows",
			Hint: "a schedule is a header row (mark, size, pitch, …) and one row per connection"}
	}
	return rows, nil
}

// builder turns a schedule's rows into jobs.
type builder struct {
	file, dir string
	flag      string               // Options.Template
	templates map[string]*template // by path
}

// template is a template job as a YAML tree; err when it cannot be read.
type template struct {
	path string
	root *yaml.Node // a mapping
	err  error
}

// table reads one sheet: its first non-blank row is the header.
func (b *builder) table(t table) ([]Row, error) {
	var cols []column
	var rows []Row
	for _, rec := range t.rows {
		if blank(rec.cells) {
			continue
		}
		if cols == nil {
			var err error
			if cols, err = header(rec.cells); err != nil {
				return nil, &jobfile.InputError{File: b.file, Msg: where(t.sheet, rec.line) + ": " + err.Error(), Hint: headerHint(t.sheet)}
			}
			continue
		}
		rows = append(rows, b.row(t.sheet, rec, cols))
	}
	return rows, nil
}

func headerHint(sheet string) string {
	h := "the first row of a schedule names its columns: mark, size, pitch … (README: batch, schedules)"
	if sheet != "" {
		h += "; --sheet NAME reads only the named sheets"
	}
	return h
}

// load reads a template job once.
func (b *builder) load(path string) *template {
	if t, ok := b.templates[path]; ok {
		return t
	}
	t := &template{path: path}
	b.templates[path] = t
	data, err := os.ReadFile(path)
	if err != nil {
		t.err = fmt.Errorf("cannot read the template %s: %v", path, errors.Unwrap(err))
		return t
	}
	var doc yaml.Node
	if err := yaml.Unmarshal(data, &doc); err != nil {
		t.err = fmt.Errorf("the template %s is not valid YAML: %v", path, err)
		return t
	}
	if len(doc.Content) == 0 {
		t.root = &yaml.Node{Kind: yaml.MappingNode, Tag: "!!map"}
		return t
	}
	if doc.Content[0].Kind != yaml.MappingNode {
		t.err = fmt.Errorf("the template %s is not a job file (a YAML mapping of keys)", path)
		return t
	}
	t.root = doc.Content[0]
	return t
}

// row builds one row's job.
func (b *builder) row(sheet string, rec record, cols []column) Row {
	r := Row{File: b.file, Sheet: sheet, Line: rec.line, cols: cols}
	at := b.file + ": " + r.Where()
	r.at = at
	cell := func(i int) string {
		if i < len(rec.cells) {
			return strings.TrimSpace(rec.cells[i])
		}
		return ""
	}
	for i := len(cols); i < len(rec.cells); i++ {
		if cell(i) != "" {
			r.Err = &jobfile.InputError{File: at, Msg: fmt.Sprintf("a value (%q) in column %d, past the last named column", cell(i), i+1),
				Hint: "every value needs a column name in the header row"}
			return r
		}
	}
	tpl, err := b.rowTemplate(cols, cell)
	if err != nil {
		r.Err = &jobfile.InputError{File: at + templateColumn(cols, cell), Msg: err.Error()}
		return r
	}
	root := &yaml.Node{Kind: yaml.MappingNode, Tag: "!!map"}
	if tpl != nil {
		root = cloneNode(tpl.root)
	}
	var given []column
	for i, c := range cols {
		v := cell(i)
		switch {
		case v == "" || c.template:
			continue
		case c.ignored && c.header == "":
			r.Err = &jobfile.InputError{File: fmt.Sprintf("%s, column %d", at, i+1), Msg: fmt.Sprintf("a value (%q) under no column name", v),
				Hint: "every value needs a column name in the header row"}
			return r
		case c.ignored:
			continue
		}
		given = append(given, c)
	}
	r.given, r.tpl = given, tpl
	if err := needMark(cols, cell); err != nil {
		r.Err = &jobfile.InputError{File: fmt.Sprintf("%s, column %q", at, err.Error()), Field: "mark",
			Msg: "the row has no mark", Hint: "every connection of a schedule names its own mark (a template's mark is never used)"}
		return r
	}
	dropLoad(root, given)
	for i, c := range cols {
		if v := cell(i); v != "" && c.path != "" {
			if err := setPath(root, c.path, v); err != nil {
				r.Err = &jobfile.InputError{File: fmt.Sprintf("%s, column %q", at, c.header), Msg: err.Error()}
				return r
			}
		}
	}
	r.YAML, err = encode(root)
	if err == nil {
		src := "# " + at
		if tpl != nil {
			src += ", template " + tpl.path
		}
		r.YAML = append([]byte(src+"\n"), r.YAML...)
	}
	if err != nil {
		r.Err = &jobfile.InputError{File: at, Msg: err.Error()}
		return r
	}
	r.Job, err = jobfile.ParseJob(at, r.YAML)
	if err != nil {
		r.Job, r.Err = nil, rowError(at, err, cols, given, tpl)
	}
	return r
}

// rowTemplate is the row's template: its template column's, else the
// Options' one; nil for none.
func (b *builder) rowTemplate(cols []column, cell func(int) string) (*template, error) {
	path := b.flag
	for i, c := range cols {
		if c.template && cell(i) != "" {
			path = cell(i)
			if !filepath.IsAbs(path) {
				path = filepath.Join(b.dir, path)
			}
		}
	}
	if path == "" {
		return nil, nil
	}
	t := b.load(path)
	return t, t.err
}

// needMark is the mark column's header when the row leaves it empty.
func needMark(cols []column, cell func(int) string) error {
	for i, c := range cols {
		if c.path == "mark" && cell(i) == "" {
			return errors.New(c.header)
		}
	}
	return nil
}

// templateColumn names the row's template column when it names the
// template: ", column \"Template\"".
func templateColumn(cols []column, cell func(int) string) string {
	for i, c := range cols {
		if c.template && cell(i) != "" {
			return fmt.Sprintf(", column %q", c.header)
		}
	}
	return ""
}

// dropLoad removes the template's load when the row gives any load of
// its own: the row's loads are the connection's, never added to the
// template's (required and dead/live cannot be mixed).
func dropLoad(root *yaml.Node, given []column) {
	for _, c := range given {
		if strings.HasPrefix(c.path, "load.") {
			deleteKey(root, "load")
			return
		}
	}
}

func encode(root *yaml.Node) ([]byte, error) {
	var buf bytes.Buffer
	enc := yaml.NewEncoder(&buf)
	enc.SetIndent(2)
	if err := enc.Encode(&yaml.Node{Kind: yaml.DocumentNode, Content: []*yaml.Node{root}}); err != nil {
		return nil, fmt.Errorf("the row cannot be written as a job: %v", err)
	}
	if err := enc.Close(); err != nil {
		return nil, fmt.Errorf("the row cannot be written as a job: %v", err)
	}
	return buf.Bytes(), nil
}
