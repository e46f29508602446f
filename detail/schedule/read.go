package schedule

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"path/filepath"
	"slices"
	"strings"

	"github.com/xuri/excelize/v2"

	"gaugeline/detail/jobfile"
	"gaugeline/fileset"
)

// MaxSize bounds a schedule file: 10,000 connections take about 1 MiB.
const MaxSize = 32 << 20

// IsSchedule reports whether path names a schedule by its extension:
// .csv or .xlsx (either case).
func IsSchedule(path string) bool {
	switch strings.ToLower(filepath.Ext(path)) {
	case ".csv", ".xlsx":
		return true
	}
	return false
}

// record is one row of a sheet: its number as the spreadsheet shows it
// (CSV: the line it starts on) and its cells.
type record struct {
	line  int
	cells []string
}

// table is one sheet of a schedule; a CSV file is one table without a
// name.
type table struct {
	sheet string
	rows  []record
}

// readFile reads the schedule's bytes, bounded by MaxSize.
func readFile(path string) ([]byte, error) {
	f, err := fileset.OpenRegular(path)
	if err != nil {
		return nil, &jobfile.InputError{File: path, Msg: "cannot read the schedule: " + fileset.ErrText(err), Hint: fileset.NotRegularHint(err)}
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, MaxSize+1))
	if err != nil {
		return nil, &jobfile.InputError{File: path, Msg: "cannot read the schedule: " + fileset.ErrText(err)}
	}
	if len(data) > MaxSize {
		return nil, &jobfile.InputError{File: path, Msg: fmt.Sprintf("the schedule is larger than %d MiB", MaxSize>>20),
			Hint: "split it into several schedules"}
	}
	return data, nil
}

// readCSV reads a CSV schedule (a UTF-8 byte-order mark, as spreadsheet
// programs write, is skipped). Rows may have fewer cells than the header.
func readCSV(path string, data []byte) ([]table, error) {
	data = bytes.TrimPrefix(data, []byte("\xef\xbb\xbf"))
	r := csv.NewReader(bytes.NewReader(data))
	r.FieldsPerRecord = -1
	t := table{}
	for {
		cells, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			if pe, ok := err.(*csv.ParseError); ok {
				return nil, &jobfile.InputError{File: path, Line: pe.Line, Msg: "not a readable CSV schedule: " + pe.Err.Error()}
			}
			return nil, &jobfile.InputError{File: path, Msg: "not a readable CSV schedule: " + err.Error()}
		}
		line, _ := r.FieldPos(0)
		t.rows = append(t.rows, record{line: line, cells: slices.Clone(cells)})
	}
	return []table{t}, nil
}

// readXLSX reads the named sheets of a workbook (every sheet when names
// is empty), in the workbook's order. Cells read as the spreadsheet shows
// them (their number format applied).
func readXLSX(path string, data []byte, names []string) ([]table, error) {
	f, err := excelize.OpenReader(bytes.NewReader(data))
	if err != nil {
		return nil, &jobfile.InputError{File: path, Msg: "not a readable XLSX workbook: " + err.Error(),
			Hint: "save the schedule as an Excel workbook (.xlsx) or as CSV"}
	}
	defer f.Close()
	list := f.GetSheetList()
	for _, n := range names {
		if !slices.Contains(list, n) {
			return nil, &jobfile.InputError{File: path, Msg: fmt.Sprintf("the workbook has no sheet %q", n),
				Hint: "its sheets: " + quoteAll(list)}
		}
	}
	var out []table
	for _, name := range list {
		if len(names) > 0 && !slices.Contains(names, name) {
			continue
		}
		rows, err := f.GetRows(name)
		if err != nil {
			return nil, &jobfile.InputError{File: path, Msg: fmt.Sprintf("sheet %q cannot be read: %v", name, err)}
		}
		t := table{sheet: name}
		for i, cells := range rows {
			t.rows = append(t.rows, record{line: i + 1, cells: cells})
		}
		out = append(out, t)
	}
	return out, nil
}

func quoteAll(ss []string) string {
	q := make([]string, len(ss))
	for i, s := range ss {
		q[i] = fmt.Sprintf("%q", s)
	}
	return strings.Join(q, ", ")
}

// blank reports whether every cell of a row is empty.
func blank(cells []string) bool {
	for _, c := range cells {
		if strings.TrimSpace(c) != "" {
			return false
		}
	}
	return true
}
