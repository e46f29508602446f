package netsection

import (
	"math"

	"gaugeline/rules/units"
)

// Hole is a hole as one part has it: its centre and its nominal extents
// along the load (Dx) and across it (Dy), in that part's ply.
type Hole struct {
	X, Y, Dx, Dy units.Length
}

// Part is one part for the block search.
type Part struct {
	T units.Length // total thickness (both angles of a pair)
	// free edges across the load; HasLow and HasHigh say whether they exist
	Low, High       units.Length
	HasLow, HasHigh bool
	// the block tears out toward XEdge: toward −x for the member (XEdge
	// = 0, Toward = −1), toward +x for the plate (XEdge = its free edge,
	// Toward = +1).
	XEdge  units.Length
	Toward float64
	// A part whose edges are not straight (a plate's outline) says where
	// they are: EdgeAt is the x where the line along the load from (x, y)
	// toward the tear-out edge leaves the part, LowAt and HighAt the y
	// where the line across it from (x, y) reaches the low and high edges;
	// XEdge is then the farthest the tear-out edge lies, Low and High the
	// extremes. nil: the straight edges XEdge, Low and High.
	EdgeAt        func(x, y units.Length) units.Length
	LowAt, HighAt func(x, y units.Length) units.Length
}

// Block is one candidate block: its boundaries across the load are either
// a free edge or a gage line (a shear plane runs along every gage-line
// boundary); the tension plane runs between the boundaries through the
// innermost hole of every line it crosses. Bolts is the number of bolts
// whose holes the block tears out.
type Block struct {
	// Low and High are the block's boundaries: the indexes of gage lines,
	// −1 for the low free edge and len(lines) for the high one.
	Low, High     int
	Agv, Anv, Ant units.Area
	Rn            units.Force
	Bolts         int
}

// WorseThan orders blocks by ratio at any demand: the bolts a block tears
// out (its share of the force) over its strength.
func (b Block) WorseThan(o Block) bool {
	return float64(b.Bolts)*float64(o.Rn) > float64(o.Bolts)*float64(b.Rn)*(1+1e-12)
}

// Strength is the nominal strength of a block from its gross and net
// areas in shear and its net area in tension (J4.3, package engine).
type Strength func(Agv, Anv, Ant units.Area) units.Force

// HoleChord is the length along the load that a line parallel to the load,
// dy off the hole's centre, cuts through a hole a long (along the load)
// and b wide (across it): the whole length a on the centre line, less as
// the line moves off it, and zero once it clears the hole. Round holes and
// slots (stadiums) are exact.
func HoleChord(a, b, dy units.Length) units.Length {
	dy = units.Length(math.Abs(float64(dy)))
	if dy >= b/2 {
		return 0
	}
	if b >= a { // round, or a slot across the load: straight sides along x
		straight := (b - a) / 2
		if dy <= straight {
			return a
		}
		r, e := float64(a/2), float64(dy-straight)
		return units.Length(2 * math.Sqrt(max(r*r-e*e, 0)))
	}
	r := float64(b / 2) // a slot along the load: round ends of radius b/2
	return a - b + units.Length(2*math.Sqrt(max(r*r-float64(dy*dy), 0)))
}

// Blocks enumerates every block of the part, the worst plane of each pair
// of boundaries, in a fixed order: for each gage line in turn, the block
// from it to the low edge (when there is one), to the high edge (when
// there is one), then to each later line. The holes are the part's, lines
// their gage lines (indexes into holes, lines sorted across the load),
// allow the B4.3 allowance added to a hole's nominal size, rn the strength
// of a block.
func Blocks(p Part, holes []Hole, lines [][]int, allow units.Length, rn Strength) []Block {
	s := newSearch(p, holes, lines, allow, rn)
	nl := len(lines)
	var out []Block
	for a := 0; a < nl; a++ {
		if p.HasLow {
			out = append(out, s.worst(-1, a))
		}
		if p.HasHigh {
			out = append(out, s.worst(a, nl))
		}
		for b := a + 1; b < nl; b++ {
			out = append(out, s.worst(a, b))
		}
	}
	return out
}

// search holds what every block of one part is worked out from.
type search struct {
	p     Part
	holes []Hole
	nl    int   // the number of gage lines
	inner []int // innermost hole of each line: farthest from the tear-out edge
	allow units.Length
	rn    Strength
}

func newSearch(p Part, holes []Hole, lines [][]int, allow units.Length, rn Strength) *search {
	s := &search{p: p, holes: holes, nl: len(lines), inner: make([]int, len(lines)), allow: allow, rn: rn}
	for i, ln := range lines {
		s.inner[i] = ln[0]
		for _, h := range ln {
			if s.dist(holes[h]) > s.dist(holes[s.inner[i]]) {
				s.inner[i] = h
			}
		}
	}
	return s
}

// dist is a hole's distance from the tear-out edge along the load.
func (s *search) dist(h Hole) units.Length { return units.Length(s.p.Toward) * (s.p.XEdge - h.X) }

// shearTo is the shear plane along y from the edge to the distance D: it
// takes out the part between the edge and D of every hole it cuts (B4.3
// width along the load): half of one centred where it ends. As-built holes
// a little off the line are cut over their chord, not over their whole
// length.
//
// Where the edge is not straight the plane starts where the part's edge
// crosses the line y (a corner clip shortens it): at the distance start
// from XEdge.
func (s *search) shearTo(y, D units.Length) (Agv, Anv units.Area) {
	var start units.Length
	if s.p.EdgeAt != nil {
		start = max(units.Length(s.p.Toward)*(s.p.XEdge-s.p.EdgeAt(s.p.XEdge-units.Length(s.p.Toward)*D, y)), 0)
	}
	gross := D - start
	net := gross
	for _, h := range s.holes {
		cut := HoleChord(h.Dx+s.allow, h.Dy+s.allow, h.Y-y)
		d := s.dist(h)
		if lo, hi := max(d-cut/2, start), min(d+cut/2, D); hi > lo {
			net -= hi - lo
		}
	}
	return gross.Mul(s.p.T), net.Mul(s.p.T)
}

// sides are the block's ends across the load, y0 and y1, where a boundary
// is a free edge that is not straight: reached from the tension plane's
// ends, (lo) and (hi).
func (s *search) sides(a, b int, y0, y1 units.Length, lo, hi Hole) (units.Length, units.Length) {
	if a < 0 && s.p.LowAt != nil {
		y0 = s.p.LowAt(lo.X, lo.Y)
	}
	if b >= s.nl && s.p.HighAt != nil {
		y1 = s.p.HighAt(hi.X, hi.Y)
	}
	return y0, y1
}

// shear is the shear plane along line i to its innermost hole.
func (s *search) shear(i int) (Agv, Anv units.Area) {
	hi := s.holes[s.inner[i]]
	return s.shearTo(hi.Y, s.dist(hi))
}

// inside reports whether the hole of h reaches inside a block whose
// tension plane is at the distance D where h lies across the load: its
// bolt is then torn out with the block (a bolt whose hole the plane cuts
// counts, which is the larger share).
func (s *search) inside(h Hole, D units.Length) bool { return s.dist(h) < D+h.Dx/2-eps }

// torn counts the bolts a block between y0 and y1 tears out, its tension
// plane at the distance at(y).
func (s *search) torn(y0, y1 units.Length, at func(units.Length) units.Length) int {
	n := 0
	for _, h := range s.holes {
		if h.Y+h.Dy/2 > y0-eps && h.Y-h.Dy/2 < y1+eps && s.inside(h, at(h.Y)) {
			n++
		}
	}
	return n
}

// across is a tension plane square to the load at the distance D from y0
// to y1: it takes out the part between y0 and y1 of every hole it cuts
// (B4.3 width across the load).
func (s *search) across(y0, y1, D units.Length) units.Area {
	net := y1 - y0
	for _, h := range s.holes {
		w := HoleChord(h.Dy+s.allow, h.Dx+s.allow, s.dist(h)-D)
		lo, hi := max(h.Y-w/2, y0), min(h.Y+w/2, y1)
		if hi > lo {
			net -= hi - lo
		}
	}
	return max(net, 0).Mul(s.p.T)
}

// plane is one tension plane from boundary a to boundary b (line indexes;
// -1 is the low free edge, nl the high free edge): it ends at the
// boundaries' innermost holes (taking half of each) and, between them,
// passes through the innermost hole of each line in the mask (the whole
// hole, plus s²/4g for each diagonal, B4.3b) and past the others. It
// returns Ant and the bolts the block tears out: every hole between the
// boundaries (or cut by a boundary's shear plane) on the edge side of the
// plane.
func (s *search) plane(a, b int, y0, y1 units.Length, between []int, mask int) (units.Area, int) {
	var stops []Hole
	var cuts []units.Length // what each stop takes out, in order
	half := func(i int) {
		h := s.holes[s.inner[i]]
		stops = append(stops, h)
		cuts = append(cuts, (h.Dy+s.allow)/2)
	}
	if a >= 0 {
		half(a)
	}
	for k, i := range between {
		if mask&(1<<k) != 0 {
			h := s.holes[s.inner[i]]
			stops = append(stops, h)
			cuts = append(cuts, h.Dy+s.allow)
		}
	}
	if b < s.nl {
		half(b)
	}
	if len(stops) > 0 {
		y0, y1 = s.sides(a, b, y0, y1, stops[0], stops[len(stops)-1])
	}
	net := y1 - y0
	for _, c := range cuts {
		net -= c
	}
	for k := 1; k < len(stops); k++ {
		g, sp := stops[k].Y-stops[k-1].Y, stops[k].X-stops[k-1].X
		if g > eps {
			net += units.Length(float64(sp*sp) / float64(4*g))
		}
	}
	return net.Mul(s.p.T), s.torn(y0, y1, s.planeAt(stops))
}

// planeAt is the distance from the edge at y of a tension plane through
// stops: straight between its stops, square to the load beyond the first
// and the last.
func (s *search) planeAt(stops []Hole) func(units.Length) units.Length {
	return func(y units.Length) units.Length {
		if y <= stops[0].Y {
			return s.dist(stops[0])
		}
		for k := 1; k < len(stops); k++ {
			if y <= stops[k].Y {
				f := (y - stops[k-1].Y) / max(stops[k].Y-stops[k-1].Y, eps)
				return s.dist(stops[k-1]) + f*(s.dist(stops[k])-s.dist(stops[k-1]))
			}
		}
		return s.dist(stops[len(stops)-1])
	}
}

// most is how many lines in between are tried every way; beyond it the
// plane goes through all of them or through none.
const most = 8

// worst is the block between boundaries a and b (line indexes; -1 the low
// free edge, nl the high one) whose tension plane makes it worst: each
// way through the lines in between, and each square block.
func (s *search) worst(a, b int) Block {
	var Agv, Anv units.Area
	for _, i := range []int{a, b} {
		if i >= 0 && i < s.nl {
			g, n := s.shear(i)
			Agv, Anv = Agv+g, Anv+n
		}
	}
	Agv, Anv = max(Agv, 0), max(Anv, 0)
	y0, y1 := s.p.Low, s.p.High
	if a >= 0 {
		y0 = s.holes[s.inner[a]].Y
	}
	if b < s.nl {
		y1 = s.holes[s.inner[b]].Y
	}
	var between []int
	for i := a + 1; i < b; i++ {
		if i >= 0 && i < s.nl {
			between = append(between, i)
		}
	}
	masks := []int{1<<len(between) - 1, 0}
	if len(between) <= most {
		masks = masks[:0]
		for m := 1<<len(between) - 1; m >= 0; m-- {
			masks = append(masks, m)
		}
	}
	var worst Block
	first := true
	consider := func(bl Block) {
		if first || bl.WorseThan(worst) {
			worst, first = bl, false
		}
	}
	for _, m := range masks {
		Ant, bolts := s.plane(a, b, y0, y1, between, m)
		Ant = max(Ant, 0)
		consider(Block{a, b, Agv, Anv, Ant, s.rn(Agv, Anv, Ant), bolts})
	}
	for _, h := range s.holes {
		if bl, ok := s.square(a, b, y0, y1, h); ok {
			consider(bl)
		}
	}
	return worst
}

// square is the square block between boundaries a and b (y0 to y1) at
// the hole h between them: the shear planes along the boundaries run to
// the distance D of h and the tension plane goes straight across there,
// past the boundaries' own last holes when they end nearer the edge (a
// measured hole off its line makes a line of its own that ends early).
// ok is false when h does not lie between the boundaries.
func (s *search) square(a, b int, y0, y1 units.Length, h Hole) (bl Block, ok bool) {
	y0, y1 = s.sides(a, b, y0, y1, h, h)
	if h.Y+h.Dy/2 <= y0+eps || h.Y-h.Dy/2 >= y1-eps {
		return Block{}, false
	}
	D := s.dist(h)
	var gv, nv units.Area
	if a >= 0 {
		gv, nv = s.shearTo(y0, D)
	}
	if b < s.nl {
		g, n := s.shearTo(y1, D)
		gv, nv = gv+g, nv+n
	}
	nt := s.across(y0, y1, D)
	bolts := s.torn(y0, y1, func(units.Length) units.Length { return D })
	gv, nv = max(gv, 0), max(nv, 0)
	return Block{a, b, gv, nv, nt, s.rn(gv, nv, nt), bolts}, true
}
