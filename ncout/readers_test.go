package ncout_test

import (
	"fmt"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"
	"unicode"

	"gaugeline/ncout"
)

// Two open-source NC1 readers, read (not run: neither builds here) for
// what they take from a file:
//
//   - Baseflow/DSTV.Net (C#): DSTV.Net/Implementations/HeaderReader.cs,
//     BodyReader.cs, Extensions/TextReaderExtensions.cs, Data/DstvHole.cs,
//     Constants.cs.
//   - tluijken/dstv (Rust): src/dstv.rs, header.rs, hole.rs, slot.rs,
//     part_face.rs.
//
// Their tests carry files other programs exported (DSTV.Net's
// DSTV.Net.Test/Data/product2.NC1, tluijken/dstv's tests/data/P465.nc,
// P1565.nc, 0008-SE0004.nc1, data/P1.nc). What each reader demands is
// written below as a rule of our own; every NC1 file of every testdata job
// must pass both, and both must read back the same holes nc1check does.

// strictReader applies DSTV.Net's rules: the first line is ST; each of the
// header's first 20 fields sits on a line opened by exactly two blanks,
// "**" comment lines skipped before it; the last four are free text; a
// free text is at most 80 characters trimmed (Constants.FreeTextMaximumSize,
// "according to specification"); the quantity is an integer, the profile
// code one of the standard's, the length one or two comma-separated
// numbers, the rest numbers. In the body a block id is a line of exactly
// two upper-case letters or digits, "**" lines are skipped, EN ends the
// file; a BO line is a face letter then 4, 5 or 8 fields, numbers with an
// optional trailing letter.
func strictReader(data string) (head []string, holes [][3]float64, err error) {
	lines := strings.Split(data, "\n")
	if lines[0] != "ST" {
		return nil, nil, fmt.Errorf("line 1 %q is not ST", lines[0])
	}
	i := 1
	for f := 0; f < 24; f++ {
		for f < 20 && i < len(lines) && strings.HasPrefix(lines[i], "**") {
			i++
		}
		if i >= len(lines) {
			return nil, nil, fmt.Errorf("header ends at field %d", f+1)
		}
		ln := lines[i]
		if f < 20 {
			if !strings.HasPrefix(ln, "  ") {
				return nil, nil, fmt.Errorf("line %d %q: a header field must open with two blanks", i+1, ln)
			}
			ln = ln[2:]
		}
		v := strings.TrimSpace(ln)
		switch {
		case f == 5:
			if _, e := strconv.Atoi(v); e != nil {
				return nil, nil, fmt.Errorf("line %d: quantity %q is not an integer", i+1, v)
			}
		case f == 7:
			if !slices.Contains([]string{"I", "L", "U", "B", "RU", "RO", "M", "C", "T", "SO"}, v) {
				return nil, nil, fmt.Errorf("line %d: profile code %q", i+1, v)
			}
		case f == 8:
			for _, p := range strings.Split(v, ",") {
				if _, e := strconv.ParseFloat(strings.TrimSpace(p), 64); e != nil {
					return nil, nil, fmt.Errorf("line %d: length %q", i+1, v)
				}
			}
		case f > 8 && f < 20:
			if _, e := strconv.ParseFloat(v, 64); e != nil {
				return nil, nil, fmt.Errorf("line %d: number %q", i+1, v)
			}
		case len(v) > 80:
			return nil, nil, fmt.Errorf("line %d: free text of %d characters (at most 80)", i+1, len(v))
		}
		head = append(head, v)
		i++
	}
	block := regexp.MustCompile(`^[A-Z0-9]{2}$`)
	cur := ""
	for ; i < len(lines); i++ {
		ln := lines[i]
		switch {
		case ln == "EN":
			return head, holes, nil
		case strings.HasPrefix(ln, "**"):
		case block.MatchString(ln):
			cur = ln
		case cur == "BO":
			h, e := boLine(ln, []int{4, 5, 8})
			if e != nil {
				return nil, nil, fmt.Errorf("line %d: %v", i+1, e)
			}
			holes = append(holes, h)
		}
	}
	return nil, nil, fmt.Errorf("no EN line")
}

// looseReader applies tluijken/dstv's rules: lines whose trimmed text
// starts with '*' are dropped; every other line is classed by its first
// two characters (a block id, else data of the block before); the ST block
// needs at least 24 data lines, read trimmed: the quantity an integer, the
// length one or two comma-separated numbers, fields 10 to 20 numbers. A
// BO line is split on white space: a face letter (v, o, u, h), then x, y,
// diameter and an optional depth, or a slot's eight fields.
func looseReader(data string) (head []string, holes [][3]float64, err error) {
	ids := map[string]bool{"ST": true, "EN": true, "BO": true, "SI": true, "AK": true, "IK": true,
		"PU": true, "KO": true, "SC": true, "TO": true, "UE": true, "PR": true, "KA": true}
	cur := ""
	for n, ln := range strings.Split(data, "\n") {
		switch {
		case strings.HasPrefix(strings.TrimSpace(ln), "*"), ln == "":
		case len(ln) >= 2 && ids[ln[:2]]:
			cur = ln[:2]
		case cur == "ST":
			head = append(head, strings.TrimSpace(ln))
		case cur == "BO":
			h, e := boLine(ln, []int{4, 5, 8})
			if e != nil {
				return nil, nil, fmt.Errorf("line %d: %v", n+1, e)
			}
			holes = append(holes, h)
		case cur == "":
			return nil, nil, fmt.Errorf("line %d %q before any block", n+1, ln)
		}
	}
	if len(head) < 24 {
		return nil, nil, fmt.Errorf("ST block has %d lines, want 24", len(head))
	}
	if _, e := strconv.Atoi(head[5]); e != nil {
		return nil, nil, fmt.Errorf("quantity %q", head[5])
	}
	for _, p := range strings.Split(head[8], ",") {
		if _, e := strconv.ParseFloat(strings.TrimSpace(p), 64); e != nil {
			return nil, nil, fmt.Errorf("length %q", head[8])
		}
	}
	for _, v := range head[9:20] {
		if _, e := strconv.ParseFloat(v, 64); e != nil {
			return nil, nil, fmt.Errorf("number %q", v)
		}
	}
	return head, holes, nil
}

// boLine reads x, y and the diameter of a BO line of one of the field
// counts allowed (face included).
func boLine(ln string, counts []int) ([3]float64, error) {
	f := strings.Fields(ln)
	if len(f) == 0 || !slices.Contains([]string{"v", "o", "u", "h"}, f[0]) {
		return [3]float64{}, fmt.Errorf("BO line %q: no face letter", ln)
	}
	if !slices.Contains(counts, len(f)) {
		return [3]float64{}, fmt.Errorf("BO line %q: %d fields", ln, len(f))
	}
	var out [3]float64
	for k := 1; k < len(f); k++ {
		v, err := strconv.ParseFloat(strings.TrimRightFunc(f[k], unicode.IsLetter), 64)
		if err != nil {
			return [3]float64{}, fmt.Errorf("BO line %q: field %d %q", ln, k+1, f[k])
		}
		if k <= 3 {
			out[k-1] = v
		}
	}
	return out, nil
}

func TestOpenReadersTakeEveryFile(t *testing.T) {
	n := 0
	for _, w := range everyJob(t) {
		for _, f := range w.files {
			nc := parse(t, f)
			for name, read := range map[string]func(string) ([]string, [][3]float64, error){
				"DSTV.Net rules": strictReader, "tluijken/dstv rules": looseReader} {
				head, holes, err := read(string(f.Data))
				if err != nil {
					t.Errorf("%s (%s): %v", f.Name, name, err)
					continue
				}
				if !slices.Equal(head, nc.Header) {
					t.Errorf("%s (%s): header %q, nc1check read %q", f.Name, name, head, nc.Header)
				}
				if len(holes) != len(nc.Holes) {
					t.Errorf("%s (%s): %d holes, nc1check read %d", f.Name, name, len(holes), len(nc.Holes))
					continue
				}
				for k, h := range holes {
					g := nc.Holes[k]
					if math.Abs(h[0]-g.X) > 1e-9 || math.Abs(h[1]-g.Y) > 1e-9 || math.Abs(h[2]-g.D) > 1e-9 {
						t.Errorf("%s (%s): hole %d %v, nc1check read %v", f.Name, name, k+1, h, g)
					}
				}
			}
			n++
		}
	}
	if n < 10 {
		t.Fatalf("only %d NC1 files checked", n)
	}
}

// The rules above can fail: a header field opened by one blank, a free
// text of 81 characters, a BO line of six fields and a missing EN are each
// refused by the reader that demands it.
func TestOpenReaderRulesRefuse(t *testing.T) {
	w := jobFiles(t, "us-brace-16ft.yaml")
	good := string(w.files[0].Data)
	if _, _, err := strictReader(good); err != nil {
		t.Fatalf("the unbroken file: %v", err)
	}
	lines := strings.Split(good, "\n")
	at := slices.IndexFunc(lines, func(s string) bool { return !strings.HasPrefix(s, "**") && s != "ST" })
	oneBlank := strings.Join(slices.Concat(lines[:at], []string{" " + strings.TrimSpace(lines[at])}, lines[at+1:]), "\n")
	long := strings.Replace(good, "\n  "+lines[at+23][2:]+"\n", "\n  "+strings.Repeat("x", 81)+"\n", 1)
	bo := slices.Index(lines, "BO")
	sixFields := strings.Replace(good, lines[bo+1]+"\n", lines[bo+1]+" 0.000 1.000\n", 1)
	noEnd := strings.TrimSuffix(good, "EN\n")
	for name, c := range map[string]struct {
		data string
		read func(string) ([]string, [][3]float64, error)
	}{
		"one blank": {oneBlank, strictReader}, "81 characters": {long, strictReader},
		"six fields (DSTV.Net)": {sixFields, strictReader}, "six fields (tluijken)": {sixFields, looseReader},
		"no EN": {noEnd, strictReader},
	} {
		if c.data == good {
			t.Fatalf("%s: the file was not broken", name)
		}
		if _, _, err := c.read(c.data); err == nil {
			t.Errorf("%s: accepted", name)
		}
	}
}

// A plate's header as programs that export NC1 write it (sample files in
// the readers' tests): DSTV.Net.Test/Data/product2.NC1, "B300*20", 320
// long: profile height 300 (the width); flange width, flange thickness
// and web thickness 20 (the thickness); weight 156.60, which is per
// square metre (7.83 kg/m² a mm of thickness; per metre it would be 47.1);
// tluijken/dstv tests/data/P465.nc, "STRIP10*110": 110, 10, 10, 10,
// weight 80.000, and P1565.nc, "PL20*233.7": 233, 20, 20, 20, weight
// 160.000 (8.0 kg/m² a mm). Ours follows them for every plate and flat
// bar: the weight over the thickness lies within 7.8 to 8.0 kg/m² a mm.
func TestPlateHeaderAsExported(t *testing.T) {
	checked := 0
	for _, w := range everyJob(t) {
		for _, f := range w.files {
			nc := parse(t, f)
			if nc.Header[7] != "B" {
				continue
			}
			width, thick := nc.Number(9), nc.Number(10)
			if width <= thick || nc.Number(11) != thick || nc.Number(12) != thick {
				t.Errorf("%s: height %s, flange width %s, flange t %s, web t %s; want width, then the thickness three times",
					f.Name, nc.Header[9], nc.Header[10], nc.Header[11], nc.Header[12])
			}
			if perMm := nc.Number(14) / thick; perMm < 7.8 || perMm > 8.0 {
				t.Errorf("%s: weight %s for %s mm, %.3f kg/m² a mm; the exported files give 7.83 to 8.0",
					f.Name, nc.Header[14], nc.Header[10], perMm)
			}
			checked++
		}
	}
	if checked < 5 {
		t.Fatalf("only %d plate files", checked)
	}
}

// Free texts longer than the 80 characters a reader takes are cut there.
func TestLongTextCut(t *testing.T) {
	p := &ncout.Piece{Order: strings.Repeat("o", 120), Mark: "M1", Code: "B", Quantity: 1, Length: 100, Height: 50, FlangeWidth: 10}
	p.Texts[0] = strings.Repeat("t", 90)
	head, _, err := strictReader(string(ncout.Write(p, "")))
	if err != nil {
		t.Fatal(err)
	}
	if head[0] != strings.Repeat("o", 80) || head[20] != strings.Repeat("t", 80) {
		t.Errorf("order %q, text %q; want each cut at 80 characters", head[0], head[20])
	}
}
