package measured

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"regexp"
	"strconv"
	"strings"
	"unicode/utf8"

	"gaugeline/rules/units"
)

// Unit is a length unit a measured file may be written in.
type Unit struct {
	Name string  // "in", "mm", …
	MM   float64 // millimetres per unit
}

// Units a job is written in.
var (
	Inches      = Unit{"in", 25.4}
	Millimetres = Unit{"mm", 1}
)

// csvUnits are the unit suffixes a CSV header may carry (x_mm, x (in), …).
var csvUnits = map[string]Unit{
	"mm": Millimetres, "cm": {"cm", 10}, "m": {"m", 1000},
	"in": Inches, "inch": Inches, "inches": Inches, `"`: Inches,
	"ft": {"ft", 304.8}, "feet": {"ft", 304.8},
}

// csvColumn names the columns a CSV may have and their aliases.
var csvColumn = map[string]string{
	"x": "x", "y": "y",
	"diameter": "diameter", "dia": "diameter", "diam": "diameter", "d": "diameter", "size": "diameter",
	"id": "id", "hole": "id", "name": "id", "label": "id", "mark": "id", "holeid": "id", "hole_id": "id", "hole id": "id",
	"feature": "id", "point": "id", // a measuring machine names its features
	"radius": "radius", "rad": "radius", "r": "radius",
}

// headerCell splits "x_mm", "x (mm)", "x[mm]", "x mm" into name and unit.
var headerCell = regexp.MustCompile(`^([a-z]+)(?:\s*[_\s]\s*([a-z"]+)|\s*[\(\[]\s*([a-z"]+)\s*[\)\]])?$`)

// ReadCSV reads measured holes from a CSV: rows x,y,diameter with an
// optional fourth column id, in the unit def (the job's) unless a header
// row names the columns with units (x_mm, y_mm, diameter_mm, …). A header
// may name the columns in any order, give radius instead of diameter, and
// carry columns it does not use (z, …), which are ignored. The
// delimiter is a comma, a semicolon or a tab (with either of the last two
// a comma in a number is a decimal comma); a cell may be quoted, and a
// quote left open is an error. Blank lines and lines starting with # are
// skipped. Every row must be well formed: the first
// bad one is an *Error naming its line and column.
func ReadCSV(r io.Reader, file string, def Unit) (*Set, error) {
	data, err := readCapped(r, file)
	if err != nil {
		return nil, err
	}
	rd := &csvReader{file: file, def: def, ids: map[string]int{},
		set: &Set{File: file, Format: "csv", Units: def.Name + " (the job's units)"}}
	sc := bufio.NewScanner(bytes.NewReader(data))
	sc.Buffer(make([]byte, 0, 1024), maxLineLen)
	lineNo := 0
	for sc.Scan() {
		lineNo++
		if err := rd.line(lineNo, sc.Text()); err != nil {
			return nil, err
		}
	}
	if err := sc.Err(); err != nil {
		return nil, scanError(file, lineNo, err)
	}
	if len(rd.set.Holes) == 0 {
		return nil, &Error{File: file, Msg: "no holes in the file", Hint: "each row is x,y,diameter[,id]"}
	}
	return rd.set, nil
}

// csvCol is what a CSV column holds: a column name of csvColumn ("" for a
// column not used) and the unit its numbers are in.
type csvCol struct {
	name string
	unit Unit
}

// csvReader is the state of ReadCSV between lines.
type csvReader struct {
	file  string
	def   Unit
	set   *Set
	cols  []csvCol // nil until the first row decides
	delim string   // "" until the first row decides
	ids   map[string]int
	// preamble counts the header-block lines before the table.
	preamble int
}

// line reads line lineNo of the file: a blank or comment line is skipped,
// the first row decides the delimiter and the columns (a header names
// them), and every other row is a hole.
func (rd *csvReader) line(lineNo int, line string) error {
	if lineNo == 1 {
		line = strings.TrimPrefix(line, "\ufeff")
	}
	line = strings.TrimSpace(line)
	if line == "" || strings.HasPrefix(line, "#") {
		return nil
	}
	delim := rd.delim
	if delim == "" {
		delim = pickDelimiter(line)
	}
	cells, serr := splitCells(line, delim)
	if serr != nil {
		serr.File, serr.Line = rd.file, lineNo
		return serr
	}
	if rd.cols == nil {
		if isHeader(cells) && !namesColumns(cells) {
			// a line of a measuring machine's header block before the
			// table (part, program, date, operator …): not data
			rd.preamble++
			return nil
		}
		rd.delim = delim
		if isHeader(cells) {
			return rd.header(lineNo, cells)
		}
		rd.cols = []csvCol{{"x", rd.def}, {"y", rd.def}, {"diameter", rd.def}, {"id", rd.def}}
		if len(cells) > 4 {
			return &Error{File: rd.file, Line: lineNo, Msg: fmt.Sprintf("%d columns, want x,y,diameter and optionally id", len(cells)),
				Hint: "add a header row naming the columns to use more"}
		}
	}
	h, err := rd.hole(lineNo, cells)
	if err != nil {
		return err
	}
	return rd.add(lineNo, cells, h)
}

// header takes the columns from a header row: each cell names a column
// (with an optional unit) or is a column not used. A column named twice,
// an unknown unit, both diameter and radius, or a header without x, y and
// diameter (or radius) is an error. A unit on a length column names the
// set's units.
func (rd *csvReader) header(lineNo int, cells []string) error {
	seen := map[string]bool{}
	units := ""
	for i, c := range cells {
		name, us, ok := headerName(c)
		if !ok {
			rd.cols = append(rd.cols, csvCol{}) // an unused column: ignored
			continue
		}
		if seen[name] {
			return &Error{File: rd.file, Line: lineNo, Field: fmt.Sprintf("column %d", i+1),
				Msg: fmt.Sprintf("column %q given twice", name)}
		}
		seen[name] = true
		u := rd.def
		if us != "" {
			if u, ok = csvUnits[us]; !ok {
				return &Error{File: rd.file, Line: lineNo, Field: c, Msg: fmt.Sprintf("unknown unit %q", us),
					Hint: "write the unit as x_mm or x_in (mm, cm, m, in, ft)"}
			}
			if name != "id" {
				units = u.Name + " (from the header)"
			}
		}
		rd.cols = append(rd.cols, csvCol{name, u})
	}
	if err := rd.headerComplete(lineNo, seen); err != nil {
		return err
	}
	if units != "" {
		rd.set.Units = units
	}
	return nil
}

// namesColumns reports whether any cell of a row names a column of
// csvColumn: a header row does, a measuring machine's header-block line
// ("Part: BR-1", "Date;2026-12-03") does not.
func namesColumns(cells []string) bool {
	for _, c := range cells {
		if _, _, ok := headerName(c); ok {
			return true
		}
	}
	return false
}

// headerName reads a header cell ("x_mm", "Dia", "y (in)"): the column of
// csvColumn it names and the unit it carries ("" for none). ok is false
// for a cell that names no column of csvColumn.
func headerName(cell string) (name, unit string, ok bool) {
	lc := strings.ToLower(cell)
	if name, ok := csvColumn[lc]; ok {
		return name, "", true
	}
	m := headerCell.FindStringSubmatch(lc)
	if m == nil {
		return "", "", false
	}
	name, ok = csvColumn[m[1]]
	return name, m[2] + m[3], ok
}

// headerComplete checks that a header with the columns seen gives x, y
// and one of diameter or radius.
func (rd *csvReader) headerComplete(lineNo int, seen map[string]bool) error {
	if seen["radius"] && seen["diameter"] {
		return &Error{File: rd.file, Line: lineNo, Field: "radius", Msg: "give diameter or radius, not both"}
	}
	if seen["radius"] {
		seen["diameter"] = true
	}
	for _, need := range []string{"x", "y", "diameter"} {
		if !seen[need] {
			return &Error{File: rd.file, Line: lineNo, Field: need, Msg: "the header has no " + need + " column",
				Hint: "a measured CSV has columns x, y, diameter and optionally id, e.g. x_mm,y_mm,diameter_mm,id"}
		}
	}
	return nil
}

// hole reads the hole of a data row from its cells, column by column; a
// missing x, y or diameter is an error, a missing id is left empty.
func (rd *csvReader) hole(lineNo int, cells []string) (Hole, error) {
	h := Hole{Line: lineNo}
	for i, c := range rd.cols {
		if c.name == "" {
			continue
		}
		if i >= len(cells) || cells[i] == "" {
			if c.name == "id" {
				continue
			}
			return h, &Error{File: rd.file, Line: lineNo, Field: c.name, Msg: "is missing",
				Hint: "each row is x,y,diameter[,id]"}
		}
		if c.name == "id" {
			h.ID = cells[i]
			continue
		}
		if err := rd.setLength(&h, lineNo, c, cells[i]); err != nil {
			return h, err
		}
	}
	return h, nil
}

// setLength reads cell, a length in column c, into h: x, y, or the
// diameter (a radius doubled), which must be a hole's size (above 0, at
// most 500 mm).
func (rd *csvReader) setLength(h *Hole, lineNo int, c csvCol, cell string) error {
	num := cell
	if rd.delim != "," {
		num = strings.ReplaceAll(num, ",", ".")
	}
	v, err := csvLength(num, c.unit)
	if err != nil {
		return &Error{File: rd.file, Line: lineNo, Field: c.name, Msg: err.Error()}
	}
	switch c.name {
	case "x":
		h.X = v
	case "y":
		h.Y = v
	case "diameter", "radius":
		if c.name == "radius" {
			v *= 2
		}
		if !(v > 0) || v > 500 {
			return &Error{File: rd.file, Line: lineNo, Field: c.name, Msg: fmt.Sprintf("%q is not a hole %s", cell, c.name)}
		}
		h.Width, h.Length = v, v
	}
	return nil
}

// add adds hole h, read from a row of cells, to the set: the row may have
// no more columns than the first, the set no more than MaxHoles holes, and
// an id (given, or made up as M1, M2, …) is used once.
func (rd *csvReader) add(lineNo int, cells []string, h Hole) error {
	set := rd.set
	if len(cells) > len(rd.cols) {
		return &Error{File: rd.file, Line: lineNo, Msg: fmt.Sprintf("%d columns, the first row has %d", len(cells), len(rd.cols))}
	}
	if len(set.Holes) >= MaxHoles {
		return &Error{File: rd.file, Line: lineNo, Msg: fmt.Sprintf("more than %d holes", MaxHoles),
			Hint: "a measured file holds the holes of one part"}
	}
	if h.ID == "" {
		h.ID = fmt.Sprintf("M%d", len(set.Holes)+1)
	}
	if first, dup := rd.ids[h.ID]; dup {
		return &Error{File: rd.file, Line: lineNo, Field: "id", Msg: fmt.Sprintf("id %q already used on line %d", h.ID, first)}
	}
	rd.ids[h.ID] = lineNo
	set.Holes = append(set.Holes, h)
	return nil
}

// scanError is the error of a scanner stopped after line lineNo: a line
// too long, or a read that failed.
func scanError(file string, lineNo int, err error) error {
	msg := err.Error()
	if err == bufio.ErrTooLong {
		msg = fmt.Sprintf("a line is longer than %d bytes", maxLineLen)
	}
	return &Error{File: file, Line: lineNo + 1, Msg: msg, Hint: "is this a CSV of hole centres?"}
}

// readCapped reads all of r, refusing more than MaxFileSize bytes.
func readCapped(r io.Reader, file string) ([]byte, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxFileSize+1))
	if err != nil {
		return nil, &Error{File: file, Msg: "cannot read: " + err.Error()}
	}
	if len(data) > MaxFileSize {
		return nil, &Error{File: file, Msg: fmt.Sprintf("larger than %d MiB", MaxFileSize>>20), Hint: "a measured file holds the holes of one part"}
	}
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, &Error{File: file, Msg: "the file is empty"}
	}
	return data, nil
}

// splitCells splits a line at delim with encoding/csv (RFC 4180): a
// quoted cell may hold the delimiter ("B,3" is one id) and a doubled
// quote inside it is one quote. A quote not closed on its line, or text
// after a closing quote, is an error (a cut-off cell or a row broken
// across lines is not data). A quote inside an unquoted cell is kept: it
// is an inch or foot mark (1-1/2").
func splitCells(line, delim string) ([]string, *Error) {
	read := func(lazy bool) ([]string, error) {
		r := csv.NewReader(strings.NewReader(line))
		r.Comma, _ = utf8.DecodeRuneInString(delim)
		r.FieldsPerRecord, r.LazyQuotes, r.TrimLeadingSpace = -1, lazy, true
		return r.Read()
	}
	if singleQuoted(line, delim) {
		return splitQuoted(line, delim) // not RFC 4180: our own reader takes it
	}
	cells, err := read(false)
	if errors.Is(err, csv.ErrBareQuote) {
		cells, err = read(true)
	}
	if err != nil {
		// not strict RFC 4180 (a space after a closing quote, a quote
		// left open): our own reader takes it, or says which cell is wrong
		return splitQuoted(line, delim)
	}
	for i := range cells {
		cells[i] = strings.TrimSpace(cells[i])
	}
	return cells, nil
}

// splitQuoted splits a line at delim by hand. A cell that starts with a double or
// single quote is quoted (RFC 4180): it runs to the matching quote, may
// hold the delimiter, and a doubled quote inside it is one quote. A quote
// not closed on its line is an error, as is text after a closing quote
// (a cut-off cell or a row broken across lines is not data). A quote
// inside an unquoted cell is kept: it is an inch or foot mark.
func splitQuoted(line, delim string) ([]string, *Error) {
	var cells []string
	for col := 1; ; col++ {
		rest := strings.TrimLeft(line, " \t")
		if rest == "" || (rest[0] != '"' && rest[0] != '\'') {
			cell, after, more := strings.Cut(line, delim)
			cells = append(cells, strings.TrimSpace(cell))
			if !more {
				return cells, nil
			}
			line = after
			continue
		}
		q := rest[0]
		var b strings.Builder
		i := 1
		for {
			k := strings.IndexByte(rest[i:], q)
			if k < 0 {
				return nil, &Error{Field: fmt.Sprintf("column %d", col), Msg: fmt.Sprintf("unclosed quote %c", q),
					Hint: "a quoted cell ends with its quote on the same line: is the file cut short?"}
			}
			b.WriteString(rest[i : i+k])
			i += k + 1
			if i < len(rest) && rest[i] == q {
				b.WriteByte(q) // a doubled quote
				i++
				continue
			}
			break
		}
		after := strings.TrimLeft(rest[i:], " \t")
		cells = append(cells, strings.TrimSpace(b.String()))
		if after == "" {
			return cells, nil
		}
		if !strings.HasPrefix(after, delim) {
			return nil, &Error{Field: fmt.Sprintf("column %d", col), Msg: fmt.Sprintf("text %q after the closing quote", clip(after)),
				Hint: "quote the whole cell, or none of it"}
		}
		line = after[len(delim):]
	}
}

// singleQuoted reports whether a cell of the line starts with a single
// quote, which some exports quote with.
func singleQuoted(line, delim string) bool {
	for _, c := range strings.Split(line, delim) {
		if strings.HasPrefix(strings.TrimLeft(c, " \t"), "'") {
			return true
		}
	}
	return false
}

// pickDelimiter: a semicolon or a tab where there is one (the comma is
// then a decimal comma, as European spreadsheets write), else a comma.
func pickDelimiter(line string) string {
	for _, d := range []string{";", "\t", ","} {
		if strings.Contains(line, d) {
			return d
		}
	}
	return ","
}

// isHeader: a row is a header when its first cell is not a number.
func isHeader(cells []string) bool {
	if len(cells) == 0 {
		return false
	}
	c := cells[0]
	if _, err := strconv.ParseFloat(c, 64); err == nil {
		return false
	}
	return c != "" && (c[0] < '0' || c[0] > '9') && c[0] != '-' && c[0] != '+' && c[0] != '.'
}

// csvLength reads a number in unit u, or a length with its own unit
// ("1-1/2 in", "38 mm").
func csvLength(s string, u Unit) (float64, error) {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		sys := units.SI
		if u == Inches {
			sys = units.US
		}
		l, perr := units.ParseLength(s, sys)
		if perr != nil {
			return 0, fmt.Errorf("%q is not a number", s)
		}
		v = float64(l)
		if !strings.ContainsAny(s, "abcdefghijklmnopqrstuvwxyz\"'") {
			v = v / float64(sys.FromJob(1, units.DimLength)) * u.MM // a bare fraction: the column's unit
		}
	} else {
		v *= u.MM
	}
	if !finite(v) || v > maxCoord || v < -maxCoord {
		return 0, fmt.Errorf("%q is out of range", s)
	}
	return v, nil
}
