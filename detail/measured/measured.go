package measured

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/spatial/r2"
)

// Caps on what a measured file may hold: beyond them it is not the
// measurement of one bolted part.
const (
	MaxFileSize = 32 << 20 // bytes
	MaxHoles    = 2000     // holes (circles or slots) kept
	MaxEntities = 500000   // DXF entities and vertices read
	maxLineLen  = 4096     // bytes in one CSV line
	maxCoord    = 1e7      // mm: 10 km is not a part
)

// Hole is one measured hole. A round hole has Width = Length = its
// diameter; a slot has its width across and its length along its long
// axis, which makes the angle Axis (radians, from +x) with the x axis.
type Hole struct {
	ID     string // as written (CSV id column) or made up from the file ("C1", …)
	X, Y   float64
	Width  float64
	Length float64
	Axis   float64
	Slot   bool
	Line   int // line of the file where the hole is written
}

// Points (a contour's vertices) are r2.Vec, in millimetres.

// Set is what a measured file holds.
type Set struct {
	File   string
	Format string // "csv" or "dxf"
	// Units names the unit the file was read in ("in", "mm", …) and how it
	// was decided.
	Units string
	Holes []Hole
	// Contour is the part's outer contour (DXF only; nil when the file has
	// no closed contour), arcs flattened to short chords.
	Contour []r2.Vec
	// Notes are things a QA engineer should know about how the file was
	// read (skipped entities, assumed units).
	Notes []string
}

// Error is a measured file that cannot be read: it names the file, the
// 1-based line (0 when unknown) and the field or group code.
type Error struct {
	File  string
	Line  int
	Field string
	Msg   string
	Hint  string
}

func (e *Error) Error() string {
	loc := e.File
	if e.Line > 0 {
		loc = fmt.Sprintf("%s:%d", e.File, e.Line)
	}
	if e.Field != "" {
		return fmt.Sprintf("%s: %s: %s", loc, e.Field, e.Msg)
	}
	return fmt.Sprintf("%s: %s", loc, e.Msg)
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
