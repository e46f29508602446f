package schedule

import (
	"bytes"
	"encoding/csv"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/xuri/excelize/v2"

	"gaugeline/detail/jobfile"
)

// The template: a passing US rack brace (testdata/batch/c-rack-brace.yaml).
const rackTemplate = "../../testdata/batch/c-rack-brace.yaml"

func writeCSV(t *testing.T, rows [][]string) string {
	t.Helper()
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	w.WriteAll(rows)
	path := filepath.Join(t.TempDir(), "schedule.csv")
	if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// writeXLSX writes each sheet's rows from row 1 (a nil row stays blank).
func writeXLSX(t *testing.T, sheets map[string][][]string, order []string) string {
	t.Helper()
	f := excelize.NewFile()
	defer f.Close()
	for i, name := range order {
		if i == 0 {
			f.SetSheetName("Sheet1", name)
		} else if _, err := f.NewSheet(name); err != nil {
			t.Fatal(err)
		}
		for r, row := range sheets[name] {
			for c, v := range row {
				cell, _ := excelize.CoordinatesToCellName(c+1, r+1)
				f.SetCellStr(name, cell, v)
			}
		}
	}
	path := filepath.Join(t.TempDir(), "schedule.xlsx")
	if err := f.SaveAs(path); err != nil {
		t.Fatal(err)
	}
	return path
}

var testHeader = []string{"Mark", "Size", "Pitch", "Per line", "bolts.diameter", "dead", "live", "# Remarks", "template"}

// Every bad row names the schedule, the sheet, the row as the spreadsheet
// numbers it and the column; the good rows read on.
func TestRowErrorsNameSheetRowColumn(t *testing.T) {
	rows := [][]string{
		testHeader[:7],
		{"BR-1", "L4x4x1/2", "3 in", "4"},
		nil, // a blank row: skipped, the numbering goes on
		{"BR-2", "L4x4x1/2", "-3", "4"},
		{"BR-3", "L4x4x9"},
		{"BR-4", "", "", "", "3 kip"},
		{"", "L4x4x1/2"},
		{"BR-6", "", "", "four"},
		{"BR-7", "", "", "", "", "10 kip", "20 kip"},
	}
	want := []struct {
		line int
		msg  string
	}{
		{2, ""},
		{4, `row 4, column "Pitch": bolts.pitch: must be greater than zero`},
		{5, ""}, // the catalog is read when the job is checked: Explain

		{6, `row 6, column "bolts.diameter": bolts.diameter:`},
		{7, `row 7, column "Mark": mark: the row has no mark`},
		{8, `row 8, column "Per line": bolts.per_line:`},
		{9, ""},
	}
	xlsx := writeXLSX(t, map[string][][]string{"Notes": {{"# nothing here"}}, "Braces": rows}, []string{"Braces"})
	for _, tc := range []struct{ path, prefix string }{{writeCSV(t, fix(rows)), "schedule.csv: "}, {xlsx, `schedule.xlsx: sheet "Braces", `}} {
		got, err := Read(tc.path, Options{Template: rackTemplate})
		if err != nil {
			t.Fatal(err)
		}
		if len(got) != len(want) {
			t.Fatalf("%s: %d rows, want %d", tc.path, len(got), len(want))
		}
		for i, w := range want {
			g := got[i]
			if g.Line != w.line {
				t.Errorf("%s: row %d read as line %d, want %d", tc.path, i, g.Line, w.line)
			}
			switch {
			case w.msg == "" && g.Err != nil:
				t.Errorf("%s row %d: %v", tc.path, w.line, g.Err)
			case w.msg != "" && (g.Err == nil || !strings.Contains(g.Err.Error(), tc.prefix+w.msg)):
				t.Errorf("%s row %d: error %v, want it to contain %q", tc.path, w.line, g.Err, tc.prefix+w.msg)
			}
		}
		// An error found when the job is built names the column, not a
		// line of the row's job text.
		late := got[2].Explain(&jobfile.InputError{File: got[2].at, Line: 14, Field: "member.size", Msg: `no angle "L4x4x9"`})
		if w := tc.prefix + `row 5, column "Size": member.size: no angle`; !strings.Contains(late.Error(), w) {
			t.Errorf("%s: a late error reads %q, want %q", tc.path, late, w)
		}
		// Row 9 gives its own service loads: the template's required
		// strength makes way for them.
		if j := got[6].Job; j == nil || !j.Load.Combined() {
			t.Errorf("%s: BR-7's loads are not the row's: %+v", tc.path, got[6].Job)
		}
		if j := got[0].Job; j == nil || j.Mark != "BR-1" || j.Bolts.PerLine != 4 {
			t.Errorf("%s: BR-1 is not the template with the row's values: %+v", tc.path, j)
		}
	}
}

// fix drops the nil rows a CSV cannot hold as blank lines the way a
// spreadsheet does: an empty record keeps the numbering.
func fix(rows [][]string) [][]string {
	out := make([][]string, len(rows))
	for i, r := range rows {
		if r == nil {
			r = []string{""}
		}
		out[i] = r
	}
	return out
}

// What stops a whole schedule: its header and its sheets.
func TestScheduleErrors(t *testing.T) {
	for _, tt := range []struct {
		name string
		path func(t *testing.T) string
		o    Options
		msg  string
	}{
		{"unknown column", func(t *testing.T) string { return writeCSV(t, [][]string{{"mark", "pich"}, {"A", "3"}}) }, Options{},
			`schedule.csv: row 1: column "pich" names no job-file field`},
		{"no mark", func(t *testing.T) string { return writeCSV(t, [][]string{{"size", "pitch"}, {"L4x4x1/2", "3"}}) }, Options{},
			`row 1: the header row has no "mark" column`},
		{"one field twice", func(t *testing.T) string { return writeCSV(t, [][]string{{"mark", "pitch", "bolts.pitch"}}) }, Options{},
			`columns "pitch" and "bolts.pitch" both set bolts.pitch`},
		{"no rows", func(t *testing.T) string { return writeCSV(t, [][]string{{"mark"}}) }, Options{}, "no connection rows"},
		{"sheet header", func(t *testing.T) string {
			return writeXLSX(t, map[string][][]string{"Braces": {{"mark"}, {"A"}}, "Notes": {nil, {"see drawing"}}}, []string{"Braces", "Notes"})
		}, Options{}, `sheet "Notes", row 2: column "see drawing" names no job-file field`},
		{"no such sheet", func(t *testing.T) string {
			return writeXLSX(t, map[string][][]string{"Braces": {{"mark"}}}, []string{"Braces"})
		},
			Options{Sheets: []string{"Ties"}}, `the workbook has no sheet "Ties"`},
		{"not a workbook", func(t *testing.T) string {
			p := filepath.Join(t.TempDir(), "s.xlsx")
			os.WriteFile(p, []byte("mark\nA\n"), 0o644)
			return p
		}, Options{}, "not a readable XLSX workbook"},
	} {
		_, err := Read(tt.path(t), tt.o)
		if err == nil || !strings.Contains(err.Error(), tt.msg) {
			t.Errorf("%s: error %v, want %q", tt.name, err, tt.msg)
		}
	}
}

// --sheet reads the sheets named, and a row's template column names its
// own template (relative to the schedule).
func TestSheetsAndTemplateColumn(t *testing.T) {
	tpl, _ := filepath.Abs(rackTemplate)
	path := writeXLSX(t, map[string][][]string{
		"Braces": {testHeader, {"BR-1", "", "", "", "", "", "", "", tpl}, {"BR-2", "", "", "", "", "", "", "", "no-such.yaml"}},
		"Notes":  {{"what"}, {"anything"}},
	}, []string{"Braces", "Notes"})
	got, err := Read(path, Options{Sheets: []string{"Braces"}})
	if err != nil {
		t.Fatal(err)
	}
	if len(got) != 2 || got[0].Err != nil || got[0].Job.Bolts.PerLine != 5 { // the template's per_line
		t.Fatalf("BR-1: %+v", got[0])
	}
	if got[1].Err == nil || !strings.Contains(got[1].Err.Error(), `sheet "Braces", row 3, column "template": cannot read the template`) {
		t.Errorf("BR-2: %v", got[1].Err)
	}
	if !bytes.HasPrefix(got[0].YAML, []byte(`# `)) || !strings.Contains(string(got[0].YAML), "mark: BR-1") {
		t.Errorf("BR-1's job text:\n%s", got[0].YAML)
	}
}
