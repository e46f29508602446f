package ncout

import (
	"bytes"
	"strconv"
	"strings"

	"gaugeline/fileset"
)

// Face is one of the standard's face letters (as tluijken/dstv's
// src/part_face.rs reads them: v front, o top, u bottom, h behind).
type Face byte

const (
	FaceFront  Face = 'v' // an angle's height leg, a plate, a web
	FaceTop    Face = 'o' // the top flange
	FaceBottom Face = 'u' // the bottom flange (an angle's other leg)
	FaceBehind Face = 'h' // the face behind (not written today)
)

// Point is a point of a face, mm.
type Point struct{ X, Y float64 }

// Hole is one BO line: a round hole (Ex = Ey = 0) of diameter D centred
// at X, Y on Face, or a slot of width D whose length is D + Ex along x or
// D + Ey along y, centred there. mm.
type Hole struct {
	Face   Face
	X, Y   float64
	D      float64
	Ex, Ey float64
}

// Slot reports whether the hole is a slotted hole.
func (h Hole) Slot() bool { return h.Ex > 0 || h.Ey > 0 }

// Piece is one NC1 file: the header, the outer contour and the holes, in
// mm, kg/m and m²/m.
type Piece struct {
	Order, Drawing, Phase string
	Mark                  string // the piece mark: the job's mark and the part (BR-16-member)
	Grade                 string
	Quantity              int
	Profile               string // the designation, for people
	Code                  string // the profile code: L, B, U, I, T
	Length                float64
	Height, FlangeWidth   float64
	FlangeT, WebT, Radius float64
	Weight                float64 // kg/m
	Paint                 float64 // m²/m
	Texts                 [4]string
	// Contour is the AK block on face v (closed by Write); nil: none.
	Contour []Point
	Holes   []Hole
	// Comments are written after the stamp and the mark, one "**" line
	// each.
	Comments []string
}

// HeaderLines is the number of data lines of the ST block (both open
// readers read 24).
const HeaderLines = 24

// Comment starts a comment line (both open readers skip "**" lines).
const Comment = "**"

// StampComment starts the comment line that carries the run stamp: the
// second line of every file.
const StampComment = Comment + " " + fileset.StampPrefix

// Write returns the NC1 file of p, with the stamp in a comment ("" for
// none).
func Write(p *Piece, stamp string) []byte {
	var b bytes.Buffer
	b.WriteString("ST\n")
	if stamp != "" {
		b.WriteString(StampComment + oneLine(stamp) + "\n")
	}
	b.WriteString(Comment + " piece " + oneLine(p.Mark) + "\n")
	for _, c := range p.Comments {
		b.WriteString(Comment + " " + oneLine(c) + "\n")
	}
	for _, f := range p.header() {
		b.WriteString("  " + f + "\n")
	}
	if len(p.Contour) > 0 {
		b.WriteString("AK\n")
		pts := append(p.Contour[:len(p.Contour):len(p.Contour)], p.Contour[0])
		for _, q := range pts {
			b.WriteString("  v " + num(q.X) + " " + num(q.Y) + " " + num(0) + "\n")
		}
	}
	if len(p.Holes) > 0 {
		b.WriteString("BO\n")
		for _, h := range p.Holes {
			b.WriteString("  " + string(h.Face) + " " + num(h.X) + " " + num(h.Y) + " " + num(h.D))
			if h.Slot() {
				b.WriteString(" " + num(0) + "l " + num(h.Ex) + " " + num(h.Ey) + " " + num(0))
			}
			b.WriteString("\n")
		}
	}
	b.WriteString("EN\n")
	return b.Bytes()
}

// header is the ST block's 24 fields in order.
func (p *Piece) header() []string {
	h := []string{text(p.Order), text(p.Drawing), text(p.Phase), text(p.Mark), text(p.Grade),
		strconv.Itoa(max(p.Quantity, 1)), text(p.Profile), text(p.Code)}
	for _, v := range []float64{p.Length, p.Height, p.FlangeWidth, p.FlangeT, p.WebT, p.Radius, p.Weight, p.Paint, 0, 0, 0, 0} {
		h = append(h, strings.TrimSpace(num(v)))
	}
	for _, t := range p.Texts {
		h = append(h, text(t))
	}
	return h
}

// num writes a number of a contour or hole line: three decimals,
// right-aligned in 10 characters, never "-0.000" (the header's are not
// padded: its data lines start with two blanks).
func num(v float64) string {
	s := strconv.FormatFloat(v, 'f', 3, 64)
	if s == "-0.000" {
		s = "0.000"
	}
	if n := 10 - len(s); n > 0 {
		s = strings.Repeat(" ", n) + s
	}
	return s
}

// TextMax is the longest text field a reader takes: 80 characters
// (Baseflow/DSTV.Net's limit, "according to specification").
const TextMax = 80

// text is a text field: one line of printable ASCII, at most TextMax
// characters, "-" when empty.
func text(s string) string {
	var b strings.Builder
	for _, r := range oneLine(s) {
		if r < 0x20 || r > 0x7e {
			r = '?'
		}
		b.WriteRune(r)
	}
	t := strings.TrimSpace(b.String())
	if len(t) > TextMax {
		t = strings.TrimSpace(t[:TextMax])
	}
	if t != "" {
		return t
	}
	return "-"
}

func oneLine(s string) string { return strings.NewReplacer("\r", " ", "\n", " ").Replace(s) }
