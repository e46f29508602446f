package measured

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"regexp"
	"strconv"
	"strings"

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
	set := &Set{File: file, Format: "csv", Units: def.Name + " (the job's units)"}
	sc := bufio.NewScanner(bytes.NewReader(data))
	sc.Buffer(make([]byte, 0, 1024), maxLineLen)
	type col struct {
		name string
		unit Unit
	}
	var cols []col // nil until the first row decides
	var delim string
	lineNo := 0
	ids := map[string]int{}
	for sc.Scan() {
		lineNo++
		line := sc.Text()
		if lineNo == 1 {
			line = strings.TrimPrefix(line, "\ufeff")
		}
		line = strings.TrimSpace(line)
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		if delim == "" {
			delim = pickDelimiter(line)
		}
		cells, err := splitCells(line, delim)
		if err != nil {
			err.File, err.Line = file, lineNo
			return nil, err
		}
		if cols == nil {
			if isHeader(cells) {
				seen := map[string]bool{}
				units := ""
				for i, c := range cells {
					lc := strings.ToLower(c)
					m := headerCell.FindStringSubmatch(lc)
					name, ok := csvColumn[lc]
					switch {
					case ok:
						m = []string{lc, lc, "", ""}
					case m != nil:
						name, ok = csvColumn[m[1]]
					}
					if !ok {
						cols = append(cols, col{}) // an unused column: ignored
						continue
					}
					if seen[name] {
						return nil, &Error{File: file, Line: lineNo, Field: fmt.Sprintf("column %d", i+1),
							Msg: fmt.Sprintf("column %q given twice", name)}
					}
					seen[name] = true
					u := def
					if us := m[2] + m[3]; us != "" {
						if u, ok = csvUnits[us]; !ok {
							return nil, &Error{File: file, Line: lineNo, Field: c, Msg: fmt.Sprintf("unknown unit %q", us),
								Hint: "write the unit as x_mm or x_in (mm, cm, m, in, ft)"}
						}
						if name != "id" {
							units = u.Name + " (from the header)"
						}
					}
					cols = append(cols, col{name, u})
				}
				if seen["radius"] && seen["diameter"] {
					return nil, &Error{File: file, Line: lineNo, Field: "radius", Msg: "give diameter or radius, not both"}
				}
				if seen["radius"] {
					seen["diameter"] = true
				}
				for _, need := range []string{"x", "y", "diameter"} {
					if !seen[need] {
						return nil, &Error{File: file, Line: lineNo, Field: need, Msg: "the header has no " + need + " column",
							Hint: "a measured CSV has columns x, y, diameter and optionally id, e.g. x_mm,y_mm,diameter_mm,id"}
					}
				}
				if units != "" {
					set.Units = units
				}
				continue
			}
			cols = []col{{"x", def}, {"y", def}, {"diameter", def}, {"id", def}}
			if len(cells) > 4 {
				return nil, &Error{File: file, Line: lineNo, Msg: fmt.Sprintf("%d columns, want x,y,diameter and optionally id", len(cells)),
					Hint: "add a header row naming the columns to use more"}
			}
		}
		h := Hole{Line: lineNo}
		for i, c := range cols {
			if c.name == "" {
				continue
			}
			if i >= len(cells) || cells[i] == "" {
				if c.name == "id" {
					continue
				}
				return nil, &Error{File: file, Line: lineNo, Field: c.name, Msg: "is missing",
					Hint: "each row is x,y,diameter[,id]"}
			}
			if c.name == "id" {
				h.ID = cells[i]
				continue
			}
			cell := cells[i]
			if delim != "," {
				cell = strings.ReplaceAll(cell, ",", ".")
			}
			v, err := csvLength(cell, c.unit)
			if err != nil {
				return nil, &Error{File: file, Line: lineNo, Field: c.name, Msg: err.Error()}
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
					return nil, &Error{File: file, Line: lineNo, Field: c.name, Msg: fmt.Sprintf("%q is not a hole %s", cells[i], c.name)}
				}
				h.Width, h.Length = v, v
			}
		}
		if len(cells) > len(cols) {
			return nil, &Error{File: file, Line: lineNo, Msg: fmt.Sprintf("%d columns, the first row has %d", len(cells), len(cols))}
		}
		if len(set.Holes) >= MaxHoles {
			return nil, &Error{File: file, Line: lineNo, Msg: fmt.Sprintf("more than %d holes", MaxHoles),
				Hint: "a measured file holds the holes of one part"}
		}
		if h.ID == "" {
			h.ID = fmt.Sprintf("M%d", len(set.Holes)+1)
		}
		if first, dup := ids[h.ID]; dup {
			return nil, &Error{File: file, Line: lineNo, Field: "id", Msg: fmt.Sprintf("id %q already used on line %d", h.ID, first)}
		}
		ids[h.ID] = lineNo
		set.Holes = append(set.Holes, h)
	}
	if err := sc.Err(); err != nil {
		msg := err.Error()
		if err == bufio.ErrTooLong {
			msg = fmt.Sprintf("a line is longer than %d bytes", maxLineLen)
		}
		return nil, &Error{File: file, Line: lineNo + 1, Msg: msg, Hint: "is this a CSV of hole centres?"}
	}
	if len(set.Holes) == 0 {
		return nil, &Error{File: file, Msg: "no holes in the file", Hint: "each row is x,y,diameter[,id]"}
	}
	return set, nil
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

// splitCells splits a line at delim. A cell that starts with a double or
// single quote is quoted (RFC 4180): it runs to the matching quote, may
// hold the delimiter, and a doubled quote inside it is one quote. A quote
// not closed on its line is an error, as is text after a closing quote
// (a cut-off cell or a row broken across lines is not data). A quote
// inside an unquoted cell is kept: it is an inch or foot mark.
func splitCells(line, delim string) ([]string, *Error) {
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
