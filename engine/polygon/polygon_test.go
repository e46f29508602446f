package polygon

import (
	"testing"

	"gonum.org/v1/gonum/spatial/r2"
)

// Points that make no outline, each with the point the problem is named
// at; the shapes are drawn by hand (no source needed: plane geometry).
func TestOutlineProblems(t *testing.T) {
	for _, c := range []struct {
		name string
		pts  []r2.Vec
		at   int
	}{
		{"fine", []r2.Vec{{X: 0, Y: 0}, {X: 10, Y: 0}, {X: 10, Y: 10}, {X: 7, Y: 10}, {X: 7, Y: 3}, {X: 3, Y: 3}, {X: 3, Y: 10}, {X: 0, Y: 10}}, -1},
		{"two points", []r2.Vec{{X: 0, Y: 0}, {X: 1, Y: 1}}, 1},
		{"repeat", []r2.Vec{{X: 0, Y: 0}, {X: 1, Y: 0}, {X: 1, Y: 0}, {X: 0, Y: 1}}, 2},
		{"on one line", []r2.Vec{{X: 0, Y: 0}, {X: 1, Y: 0}, {X: 2, Y: 0}}, 2},
		{"bow tie", []r2.Vec{{X: 0, Y: 0}, {X: 1, Y: 0}, {X: 0, Y: 1}, {X: 1, Y: 1}}, 3},
		{"turns back", []r2.Vec{{X: 0, Y: 0}, {X: 2, Y: 0}, {X: 1, Y: 0}, {X: 1, Y: 1}}, 2},
	} {
		if at, msg := Problem(c.pts, 1e-3); at != c.at || (c.at >= 0) != (msg != "") {
			t.Errorf("%s: point %d %q, want point %d", c.name, at, msg, c.at)
		}
	}
}
