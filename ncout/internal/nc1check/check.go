// Package nc1check reads a DSTV NC1 file back and checks it against the
// standard's layout as package ncout writes it (doc.go there: what of it
// two open-source readers confirm, what is still from memory): the blocks
// ST, AK, BO, EN in that order, each at most once, ST first and EN last; comments
// ("**") only inside blocks; every data line indented two blanks; the ST
// block's 24 fields with their kinds (text, a whole quantity, a profile
// code, twelve numbers, four texts); each AK line a face and three
// numbers, the contour closed; each BO line a face and three numbers, or
// a slot's seven fields with the slotted-hole letter. Numbers are written
// with a decimal point and three places. It stops at the first line that
// breaks the layout and names it.
package nc1check

import (
	"fmt"
	"regexp"
	"strconv"
	"strings"
)

// File is an NC1 file read back.
type File struct {
	Comments []string
	Header   []string // the ST block's 24 fields, as written
	Contour  []Point  // the AK block's points (the last repeats the first)
	Holes    []Hole
}

// Point is one AK line.
type Point struct {
	Face         byte
	X, Y, Radius float64
}

// Hole is one BO line.
type Hole struct {
	Face                 byte
	X, Y, D              float64
	Slot                 bool
	Depth, Ex, Ey, Angle float64
}

// Codes are the profile codes of the standard, as tluijken/dstv's
// src/header.rs and Baseflow/DSTV.Net's Enums/CodeProfile.cs list them:
// I, L, U, B (plate or flat), RU (round bar), RO (tube), M (rectangular tube), C
// (cold-formed C), T, SO (special).
var Codes = []string{"I", "L", "U", "B", "RU", "RO", "M", "C", "T", "SO"}

var (
	number = regexp.MustCompile(`^-?[0-9]+\.[0-9]{3}$`)
	whole  = regexp.MustCompile(`^[1-9][0-9]*$`)
	blocks = []string{"ST", "AK", "BO", "EN"}
)

// Field kinds of the ST block, in order.
const (
	kindText = iota
	kindQuantity
	kindCode
	kindNumber
)

var headerKinds = func() []int {
	k := []int{kindText, kindText, kindText, kindText, kindText, kindQuantity, kindText, kindCode}
	for range 12 {
		k = append(k, kindNumber)
	}
	return append(k, kindText, kindText, kindText, kindText)
}()

// Parse reads data; the error names the line (from 1) that breaks the
// layout.
func Parse(data []byte) (*File, error) {
	s := string(data)
	if !strings.HasSuffix(s, "\n") {
		return nil, fmt.Errorf("the file does not end with a line break")
	}
	lines := strings.Split(strings.TrimSuffix(s, "\n"), "\n")
	f := &File{}
	block, last := "", -1
	for i, ln := range lines {
		n := i + 1
		if err := plain(ln); err != nil {
			return nil, fmt.Errorf("line %d: %v", n, err)
		}
		switch {
		case isID(ln):
			k := index(blocks, ln)
			if k < 0 {
				return nil, fmt.Errorf("line %d: block %q is not one of %v", n, ln, blocks)
			}
			if k <= last || (last < 0 && ln != "ST") {
				return nil, fmt.Errorf("line %d: block %s out of order (want %v, each once)", n, ln, blocks)
			}
			if block == "ST" && len(f.Header) != len(headerKinds) {
				return nil, fmt.Errorf("line %d: the ST block has %d fields, want %d", n, len(f.Header), len(headerKinds))
			}
			block, last = ln, k
			if ln == "EN" && n != len(lines) {
				return nil, fmt.Errorf("line %d: lines after EN", n+1)
			}
		case block == "" || block == "EN":
			return nil, fmt.Errorf("line %d: %q outside a block", n, ln)
		case strings.HasPrefix(ln, "**"):
			f.Comments = append(f.Comments, strings.TrimSpace(strings.TrimPrefix(ln, "**")))
		case !strings.HasPrefix(ln, "  ") || strings.TrimSpace(ln) == "" || ln[2] == ' ':
			return nil, fmt.Errorf("line %d: a data line starts with exactly two blanks: %q", n, ln)
		default:
			if err := f.data(block, ln[2:]); err != nil {
				return nil, fmt.Errorf("line %d: %s: %v", n, block, err)
			}
		}
	}
	if block != "EN" {
		return nil, fmt.Errorf("the file does not end with EN")
	}
	if c := f.Contour; len(c) > 0 && (len(c) < 4 || c[0] != c[len(c)-1]) {
		return nil, fmt.Errorf("AK: the contour is not closed (%d points, first %v, last %v)", len(c), c[0], c[len(c)-1])
	}
	return f, nil
}

// data reads one data line of block b (the two blanks taken off).
func (f *File) data(b, v string) error {
	switch b {
	case "ST":
		return f.headerField(v)
	case "AK":
		face, nums, err := faceNumbers(v, 3)
		if err != nil {
			return err
		}
		f.Contour = append(f.Contour, Point{Face: face, X: nums[0], Y: nums[1], Radius: nums[2]})
		return nil
	}
	return f.hole(v)
}

func (f *File) headerField(v string) error {
	i := len(f.Header)
	if i >= len(headerKinds) {
		return fmt.Errorf("more than %d fields", len(headerKinds))
	}
	switch headerKinds[i] {
	case kindQuantity:
		if !whole.MatchString(v) {
			return fmt.Errorf("field %d (quantity) %q is not a whole number of pieces", i+1, v)
		}
	case kindCode:
		if index(Codes, v) < 0 {
			return fmt.Errorf("field %d (profile code) %q is not one of %v", i+1, v, Codes)
		}
	case kindNumber:
		if !number.MatchString(strings.TrimSpace(v)) {
			return fmt.Errorf("field %d %q is not a number with three decimals", i+1, v)
		}
	default:
		if strings.TrimSpace(v) != v {
			return fmt.Errorf("field %d %q has blanks around it", i+1, v)
		}
	}
	f.Header = append(f.Header, v)
	return nil
}

// hole reads a BO line: face x y d, or face x y d depth"l" ex ey angle.
func (f *File) hole(v string) error {
	fs := strings.Fields(v)
	switch len(fs) {
	case 4:
		face, nums, err := faceNumbers(v, 3)
		if err != nil {
			return err
		}
		f.Holes = append(f.Holes, Hole{Face: face, X: nums[0], Y: nums[1], D: nums[2]})
		return nil
	case 8:
		depth, ok := strings.CutSuffix(fs[4], "l")
		if !ok {
			return fmt.Errorf("a hole of 8 fields is a slot: its depth %q wants the letter l", fs[4])
		}
		fs[4] = depth
		face, nums, err := faceNumbers(strings.Join(fs, " "), 7)
		if err != nil {
			return err
		}
		h := Hole{Face: face, X: nums[0], Y: nums[1], D: nums[2], Slot: true, Depth: nums[3], Ex: nums[4], Ey: nums[5], Angle: nums[6]}
		f.Holes = append(f.Holes, h)
		return nil
	}
	return fmt.Errorf("a hole has 4 fields (round) or 8 (slot), not %d: %q", len(fs), v)
}

// faceNumbers reads a face letter and n numbers.
func faceNumbers(v string, n int) (byte, []float64, error) {
	fs := strings.Fields(v)
	if len(fs) != n+1 {
		return 0, nil, fmt.Errorf("%d fields, want %d: %q", len(fs), n+1, v)
	}
	if len(fs[0]) != 1 || !strings.Contains("vouh", fs[0]) {
		return 0, nil, fmt.Errorf("face %q is not v, o, u or h", fs[0])
	}
	out := make([]float64, n)
	for i, s := range fs[1:] {
		if !number.MatchString(s) {
			return 0, nil, fmt.Errorf("field %d %q is not a number with three decimals", i+2, s)
		}
		out[i], _ = strconv.ParseFloat(s, 64)
	}
	return fs[0][0], out, nil
}

// plain refuses what no NC1 line holds: carriage returns, tabs, other
// than printable ASCII.
func plain(ln string) error {
	for _, r := range ln {
		if r < 0x20 || r > 0x7e {
			return fmt.Errorf("character %q is not printable ASCII", r)
		}
	}
	return nil
}

func isID(ln string) bool {
	return len(ln) == 2 && ln[0] >= 'A' && ln[0] <= 'Z' && ln[1] >= 'A' && ln[1] <= 'Z'
}

func index(xs []string, s string) int {
	for i, x := range xs {
		if x == s {
			return i
		}
	}
	return -1
}

// Number reads header field i (from 0) as a number.
func (f *File) Number(i int) float64 {
	v, _ := strconv.ParseFloat(strings.TrimSpace(f.Header[i]), 64)
	return v
}
