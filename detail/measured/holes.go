package measured

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"
)

// chainTol is how close, in mm, two segment ends must be to join.
const chainTol = 0.01

// holes turns a parsed drawing into the set of measured holes: it scales
// the drawing to millimetres, takes the closed loop of the largest area as
// the part's contour, picks the holes among the circles and hole-shaped
// loops (on layer, inside the contour, or all of them), keeps the smallest
// of concentric ones and names them C1, C2, … in the order of the file.
func (d *drawing) holes(file string, def Unit, layer string) (*Set, error) {
	set := &Set{File: file, Format: "dxf"}
	u, err := d.unit(file, def, set)
	if err != nil {
		return nil, err
	}
	d.scale(u.MM)
	loops, layers := d.allLoops()
	contour, best := largestLoop(loops)
	set.Contour = contour
	cands, err := d.candidates(file, loops, layers, best)
	if err != nil {
		return nil, err
	}
	holes, err := pickHoles(file, set, cands, layer, best >= 0)
	if err != nil {
		return nil, err
	}
	kept, dup := dropConcentric(holes)
	if dup > 0 {
		set.Notes = append(set.Notes, fmt.Sprintf("%d concentric circle(s) dropped: the smallest at a centre is the hole", dup))
	}
	if len(kept) == 0 {
		hint := "holes are circles inside the part's largest closed contour; name their layer with --layer"
		if d.skipped["INSERT"] > 0 {
			hint = "the holes may be inside a block (INSERT), which is not read: explode the blocks and export again"
		}
		return nil, &Error{File: file, Msg: "no holes found in the DXF", Hint: hint}
	}
	if len(kept) > MaxHoles {
		return nil, &Error{File: file, Msg: fmt.Sprintf("%d holes, more than %d", len(kept), MaxHoles), Hint: "a measured file holds the holes of one part"}
	}
	for i := range kept {
		kept[i].ID = fmt.Sprintf("C%d", i+1)
	}
	set.Holes = kept
	set.Notes = append(set.Notes, d.skippedNote()...)
	return set, nil
}

// unit is the unit the drawing is in, $INSUNITS or else def (with a
// note); it names it in set.Units. An $INSUNITS code that is no length a
// part is drawn in is an error.
func (d *drawing) unit(file string, def Unit, set *Set) (Unit, error) {
	if d.insUnits <= 0 {
		set.Units = def.Name + " (no $INSUNITS: the job's units)"
		set.Notes = append(set.Notes, "the DXF does not set $INSUNITS: read in the job's units ("+def.Name+")")
		return def, nil
	}
	u, ok := insUnits[d.insUnits]
	if !ok {
		return def, &Error{File: file, Line: d.unitsLine, Field: "$INSUNITS", Msg: fmt.Sprintf("unit code %d is not a unit a part is drawn in", d.insUnits),
			Hint: "set $INSUNITS to 1 (inches) or 4 (millimetres)"}
	}
	set.Units = u.Name + " ($INSUNITS)"
	return u, nil
}

// scale multiplies every length of the drawing by k (millimetres per unit
// of the file).
func (d *drawing) scale(k float64) {
	sc := func(p r2.Vec) r2.Vec { return r2.Vec{X: p.X * k, Y: p.Y * k} }
	for i := range d.circles {
		d.circles[i].c, d.circles[i].r = sc(d.circles[i].c), d.circles[i].r*k
	}
	scaleSegs := func(ss []seg) {
		for i := range ss {
			ss[i].a, ss[i].b = sc(ss[i].a), sc(ss[i].b)
		}
	}
	for _, l := range d.loops {
		scaleSegs(l)
	}
	scaleSegs(d.segs)
}

// allLoops is every closed loop of the drawing with its layer: the closed
// polylines, then the loops chained from lines and arcs.
func (d *drawing) allLoops() ([][]seg, []string) {
	loops, layers := d.loops, d.loopLayers
	chained, chainedLayers := chain(d.segs, d.segLayers)
	return append(loops, chained...), append(layers, chainedLayers...)
}

// largestLoop is the contour of the part, the loop of the largest area, as
// a polygon, and its index in loops; -1 (and a nil polygon) when no loop
// encloses an area.
func largestLoop(loops [][]seg) ([]r2.Vec, int) {
	polys := make([][]r2.Vec, len(loops))
	best, bestArea := -1, 0.0
	for i, l := range loops {
		polys[i] = flatten(l)
		if a := math.Abs(area(polys[i])); a > bestArea {
			best, bestArea = i, a
		}
	}
	if best < 0 {
		return nil, -1
	}
	return polys[best], best
}

// candidate is a circle, or a loop shaped as a hole, with its layer.
type candidate struct {
	Hole
	layer string
}

// candidates are the drawing's circles and its loops shaped as holes
// (roundOrSlot), the contour loops[contour] apart, in the order of their
// lines in the file. More than 20·MaxHoles circles is an error.
func (d *drawing) candidates(file string, loops [][]seg, layers []string, contour int) ([]candidate, error) {
	var cands []candidate
	if len(d.circles) > 20*MaxHoles {
		return nil, &Error{File: file, Msg: fmt.Sprintf("%d circles, more than %d", len(d.circles), 20*MaxHoles), Hint: "export only the part: its contour and holes"}
	}
	for _, c := range d.circles {
		cands = append(cands, candidate{Hole{X: c.c.X, Y: c.c.Y, Width: 2 * c.r, Length: 2 * c.r, Line: c.line}, c.layer})
	}
	for i, l := range loops {
		if i == contour {
			continue
		}
		if h, ok := roundOrSlot(l); ok {
			cands = append(cands, candidate{h, layers[i]})
		}
	}
	slices.SortStableFunc(cands, func(a, b candidate) int { return cmp.Compare(a.Line, b.Line) })
	return cands, nil
}

// pickHoles chooses the holes among the candidates: those on layer when
// one is named, else those inside set.Contour when the drawing has one,
// else all of them; how they were chosen is noted in set.
func pickHoles(file string, set *Set, cands []candidate, layer string, hasContour bool) ([]Hole, error) {
	switch {
	case layer != "":
		return holesOnLayer(file, cands, layer)
	case hasContour:
		return holesInside(file, set, cands)
	}
	var holes []Hole
	for _, c := range cands {
		holes = append(holes, c.Hole)
	}
	if len(holes) > 0 {
		set.Notes = append(set.Notes, "the DXF has no closed contour: every circle taken as a hole")
	}
	return holes, nil
}

// holesOnLayer are the candidates on layer (case-insensitive); none is an
// error whose hint names the layers that have circles.
func holesOnLayer(file string, cands []candidate, layer string) ([]Hole, error) {
	var holes []Hole
	var onLayer []string
	for _, c := range cands {
		if strings.EqualFold(c.layer, layer) {
			holes = append(holes, c.Hole)
		} else if !slices.Contains(onLayer, c.layer) {
			onLayer = append(onLayer, c.layer)
		}
	}
	if len(holes) == 0 {
		hint := "the file has no circles"
		if len(onLayer) > 0 {
			hint = "layers with circles: " + strings.Join(onLayer, ", ")
		}
		return nil, &Error{File: file, Field: "--layer", Msg: fmt.Sprintf("no circles on layer %q", layer), Hint: hint}
	}
	return holes, nil
}

// holesInside are the candidates inside set.Contour; those outside are
// counted in a note. Too many candidates and contour points to test is an
// error.
func holesInside(file string, set *Set, cands []candidate) ([]Hole, error) {
	if len(cands)*len(set.Contour) > 2e8 {
		return nil, &Error{File: file, Msg: fmt.Sprintf("%d circles and a contour of %d points are too many to sort out", len(cands), len(set.Contour)),
			Hint: "name the holes' layer with --layer, or export only the part"}
	}
	var holes []Hole
	outside := 0
	for _, c := range cands {
		if inside(r2.Vec{X: c.X, Y: c.Y}, set.Contour) {
			holes = append(holes, c.Hole)
		} else {
			outside++
		}
	}
	if outside > 0 {
		set.Notes = append(set.Notes, fmt.Sprintf("%d circle(s) outside the part's contour ignored", outside))
	}
	return holes, nil
}

// dropConcentric keeps one hole per centre (rounded to 1e-6 mm), the
// smallest, with the line of the first drawn there; dup counts
// those dropped. Concentric circles are a hole drawn twice, or with a
// chamfer ring or a bolt head.
func dropConcentric(holes []Hole) (kept []Hole, dup int) {
	at := map[[2]float64]int{} // centre rounded to 1e-6 mm → index in kept
	for _, h := range holes {
		k := [2]float64{math.Round(h.X * 1e6), math.Round(h.Y * 1e6)}
		j, seen := at[k]
		if !seen {
			at[k] = len(kept)
			kept = append(kept, h)
			continue
		}
		dup++
		if h.Width < kept[j].Width {
			line := kept[j].Line
			kept[j] = h
			kept[j].Line = line
		}
	}
	return kept, dup
}

func (d *drawing) skippedNote() []string {
	var kinds []string
	for k := range d.skipped {
		kinds = append(kinds, k)
	}
	slices.Sort(kinds)
	var parts []string
	for _, k := range kinds {
		parts = append(parts, fmt.Sprintf("%d %s", d.skipped[k], k))
	}
	var notes []string
	if len(parts) > 0 {
		notes = append(notes, "not used: "+strings.Join(parts, ", "))
	}
	if d.oddExtruded > 0 {
		notes = append(notes, fmt.Sprintf("%d entities drawn out of the XY plane skipped", d.oddExtruded))
	}
	return notes
}

// roundOrSlot recognises a closed loop drawn as a circle (two half-circle
// arcs) or a stadium (two half circles joined by straight sides).
func roundOrSlot(l []seg) (Hole, bool) {
	var ss []seg
	for _, s := range l {
		if dist(s.a, s.b) > 1e-9 {
			ss = append(ss, s)
		}
	}
	half := func(s seg) bool { return math.Abs(math.Abs(s.bulge)-1) < 1e-3 }
	straight := func(s seg) bool { return math.Abs(s.bulge) < 1e-9 }
	mid := func(s seg) r2.Vec { return r2.Vec{X: (s.a.X + s.b.X) / 2, Y: (s.a.Y + s.b.Y) / 2} }
	switch len(ss) {
	case 2:
		if half(ss[0]) && half(ss[1]) && ss[0].bulge*ss[1].bulge > 0 && math.Abs(dist(ss[0].a, ss[0].b)-dist(ss[1].a, ss[1].b)) < 1e-6*(1+dist(ss[0].a, ss[0].b)) {
			c, dia := mid(ss[0]), dist(ss[0].a, ss[0].b)
			return Hole{X: c.X, Y: c.Y, Width: dia, Length: dia, Line: ss[0].line}, true
		}
	case 0, 1, 3:
	case 4:
		for off := 0; off < 2; off++ {
			a1, s1, a2, s2 := ss[off], ss[off+1], ss[off+2], ss[(off+3)%4]
			if !half(a1) || !half(a2) || !straight(s1) || !straight(s2) || a1.bulge*a2.bulge <= 0 {
				continue
			}
			c1, c2 := mid(a1), mid(a2)
			w1, w2 := dist(a1.a, a1.b), dist(a2.a, a2.b)
			span := dist(c1, c2)
			tol := 1e-6 * (1 + w1 + span)
			if math.Abs(w1-w2) > tol || math.Abs(dist(s1.a, s1.b)-span) > tol || math.Abs(dist(s2.a, s2.b)-span) > tol {
				continue
			}
			c := r2.Vec{X: (c1.X + c2.X) / 2, Y: (c1.Y + c2.Y) / 2}
			axis := math.Atan2(c2.Y-c1.Y, c2.X-c1.X) // an axis has no sense: in [0, π)
			if axis < 0 {
				axis += math.Pi
			}
			if axis >= math.Pi {
				axis -= math.Pi
			}
			return Hole{X: c.X, Y: c.Y, Width: w1, Length: span + w1, Axis: axis, Slot: true, Line: a1.line}, true
		}
	}
	if len(ss) >= 8 {
		return regularPolygon(ss)
	}
	return Hole{}, false
}

// regularPolygon recognises a hole drawn as a closed polygon of eight or
// more straight sides whose corners lie on one circle (within 0.5 % of its
// radius), as scanners and some CAM exports write them: a round hole of
// the circle's diameter.
func regularPolygon(ss []seg) (Hole, bool) {
	var c r2.Vec
	for _, s := range ss {
		if s.bulge != 0 {
			return Hole{}, false
		}
		c.X += s.a.X / float64(len(ss))
		c.Y += s.a.Y / float64(len(ss))
	}
	var r float64
	for _, s := range ss {
		r += dist(c, s.a) / float64(len(ss))
	}
	if !(r > 0) {
		return Hole{}, false
	}
	for _, s := range ss {
		if math.Abs(dist(c, s.a)-r) > 0.005*r {
			return Hole{}, false
		}
	}
	return Hole{X: c.X, Y: c.Y, Width: 2 * r, Length: 2 * r, Line: ss[0].line}, true
}

// chain joins open segments end to end into closed loops; segments left
// open are dropped.
func chain(segs []seg, layers []string) ([][]seg, []string) {
	type end struct {
		i     int
		start bool
	}
	type key struct{ x, y int64 }
	keyOf := func(p r2.Vec) key { return key{int64(math.Floor(p.X / chainTol)), int64(math.Floor(p.Y / chainTol))} }
	grid := map[key][]end{}
	for i, s := range segs {
		grid[keyOf(s.a)] = append(grid[keyOf(s.a)], end{i, true})
		grid[keyOf(s.b)] = append(grid[keyOf(s.b)], end{i, false})
	}
	used := make([]bool, len(segs))
	// budget bounds the work of a hostile file (many ends in one place):
	// past it, chaining stops and what is chained so far is kept.
	budget := 64 * (len(segs) + 1000)
	find := func(p r2.Vec) (end, bool) {
		k := keyOf(p)
		for dx := int64(-1); dx <= 1; dx++ {
			for dy := int64(-1); dy <= 1; dy++ {
				kk := key{k.x + dx, k.y + dy}
				cell := grid[kk]
				for n := 0; n < len(cell) && budget > 0; {
					budget--
					e := cell[n]
					if used[e.i] { // drop it: each end is dropped once
						cell[n] = cell[len(cell)-1]
						cell = cell[:len(cell)-1]
						continue
					}
					q := segs[e.i].b
					if e.start {
						q = segs[e.i].a
					}
					if dist(p, q) <= chainTol {
						grid[kk] = cell
						return e, true
					}
					n++
				}
				grid[kk] = cell
			}
		}
		return end{}, false
	}
	var loops [][]seg
	var ls []string
	for i := range segs {
		if used[i] {
			continue
		}
		used[i] = true
		loop := []seg{segs[i]}
		start := segs[i].a
		for len(loop) <= len(segs) {
			tail := loop[len(loop)-1].b
			if len(loop) > 1 && dist(tail, start) <= chainTol {
				loops, ls = append(loops, loop), append(ls, layers[i])
				break
			}
			e, ok := find(tail)
			if !ok {
				break
			}
			used[e.i] = true
			s := segs[e.i]
			if !e.start {
				s = seg{a: s.b, b: s.a, bulge: -s.bulge, line: s.line}
			}
			loop = append(loop, s)
		}
	}
	return loops, ls
}

// flatten returns the loop as a polygon, arcs cut into chords of at most
// 10°.
func flatten(l []seg) []r2.Vec {
	var pts []r2.Vec
	for _, s := range l {
		pts = append(pts, s.a)
		if s.bulge == 0 {
			continue
		}
		L := dist(s.a, s.b)
		if L == 0 {
			continue
		}
		theta := 4 * math.Atan(s.bulge)
		off := L * (1 - s.bulge*s.bulge) / (4 * s.bulge)
		nx, ny := -(s.b.Y-s.a.Y)/L, (s.b.X-s.a.X)/L
		c := r2.Vec{X: (s.a.X+s.b.X)/2 + off*nx, Y: (s.a.Y+s.b.Y)/2 + off*ny}
		r := dist(c, s.a)
		a0 := math.Atan2(s.a.Y-c.Y, s.a.X-c.X)
		n := min(36, int(math.Ceil(math.Abs(theta)/(math.Pi/18))))
		for k := 1; k < n; k++ {
			a := a0 + theta*float64(k)/float64(n)
			pts = append(pts, r2.Vec{X: c.X + r*math.Cos(a), Y: c.Y + r*math.Sin(a)})
		}
	}
	return pts
}

// area is the signed shoelace area of a polygon.
func area(p []r2.Vec) float64 {
	var s float64
	for i := range p {
		j := (i + 1) % len(p)
		s += p[i].X*p[j].Y - p[j].X*p[i].Y
	}
	return s / 2
}

// inside is the even-odd test of p against polygon poly.
func inside(p r2.Vec, poly []r2.Vec) bool {
	in := false
	for i, j := 0, len(poly)-1; i < len(poly); j, i = i, i+1 {
		a, b := poly[i], poly[j]
		if (a.Y > p.Y) != (b.Y > p.Y) && p.X < (b.X-a.X)*(p.Y-a.Y)/(b.Y-a.Y)+a.X {
			in = !in
		}
	}
	return in
}
