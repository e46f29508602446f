package detailing

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// tol is the slack of every detailing comparison, in mm: a layout exactly
// at a limit passes although the limit was converted from inches, and of
// the choice of the governing hole, so that ties go to the first hole.
const tol = 1e-6

// Clause labels of the checks that are not AISC 360 clauses.
const commonPractice = "common practice"

// Slenderness limit of the User Note to D1: L/r preferably ≤ 300.
const maxSlenderness = 300

// Check runs every detailing check of SPEC §5 on the connection and
// returns every finding, passing or not, in a fixed order: hole.size,
// hole.type, spacing.min, edge.min, edge.max, spacing.max, gage.workable,
// eccentricity, slenderness. Within a check, findings follow hole types, edges and gage
// lines in a fixed order, so the same connection always gives the same
// list. A bolt diameter the edition does not tabulate gives a failing
// finding naming the table, not an error.
// An as-built model (info.AsBuilt) allows info.DiameterTol over the
// nominal hole size.
func Check(c *engine.Connection, info MemberInfo) []Finding {
	if c == nil || c.Edition == nil {
		panic("detailing: Check needs a connection with an edition")
	}
	var fs []Finding
	fs = append(fs, holeSizeFindings(c)...)
	fs = append(fs, holeTypeFindings(c)...)
	fs = append(fs, minSpacingFindings(c)...)
	fs = append(fs, minEdgeFindings(c)...)
	fs = append(fs, maxEdgeFindings(c)...)
	fs = append(fs, maxSpacingFindings(c, info)...)
	fs = append(fs, gageFindings(c, info)...)
	fs = append(fs, eccentricityFindings(c, info)...)
	fs = append(fs, slendernessFindings(c, info)...)
	fs = append(fs, strutFindings(c, info)...)
	if info.AsBuilt {
		allowFabrication(fs, info.DiameterTol)
	}
	return fs
}

// allowFabrication lets the hole.size findings of an as-built model allow
// the fabrication tolerance fab over the nominal size.
func allowFabrication(fs []Finding, fab units.Length) {
	for i := range fs {
		f := &fs[i]
		if f.ID == "hole.size" && f.Dim == units.DimLength {
			f.Limit += float64(fab)
			f.Pass = f.Measured <= f.Limit+tol
			f.Where += ", nominal + fabrication tolerance"
		}
	}
}

// Passes reports whether every finding that is not advisory passes.
func Passes(fs []Finding) bool {
	for _, f := range fs {
		if !f.Pass && !f.Advisory {
			return false
		}
	}
	return true
}

// atLeast and atMost compare lengths with the tolerance tol.
func atLeast(measured, limit units.Length) bool { return measured >= limit-tol }
func atMost(measured, limit units.Length) bool  { return measured <= limit+tol }

// holeName is the hole's id, or its 1-based position when it has none.
func holeName(c *engine.Connection, i int) string {
	if id := c.Holes[i].ID; id != "" {
		return id
	}
	return fmt.Sprintf("H%d", i+1)
}

// table names a table of the edition in force: US tables as printed, SI
// tables with their M suffix (Table J3.3M).
func table(c *engine.Connection, name string) string {
	if c.Edition.System() == units.SI {
		return name + "M"
	}
	return name
}

// untabulated is the failing finding of a check whose limit the edition
// does not tabulate for this bolt.
func untabulated(id, clause string, err error) Finding {
	return Finding{ID: id, Clause: clause, Dim: units.Dimensionless, Where: err.Error()}
}

// lengthFinding builds a finding on a length.
func lengthFinding(id, clause string, measured, limit units.Length, pass bool, where string) Finding {
	return Finding{
		ID: id, Clause: clause,
		Measured: float64(measured), Limit: float64(limit), Dim: units.DimLength,
		Pass: pass, Where: where,
	}
}

// ply is one connected part as the detailing checks see its holes: the
// member's or the plate's shape of each hole.
type ply struct {
	name  string // "member" or "plate"
	shape func(*engine.Hole) engine.HoleShape
}

var (
	memberPly = ply{"member", func(h *engine.Hole) engine.HoleShape { return h.HoleShape }}
	platePly  = ply{"plate", func(h *engine.Hole) engine.HoleShape { return h.InPlate() }}
)

// pliesOf lists the plies whose holes the checks that look at hole shapes
// take one by one: the member alone when every hole is alike in both plies
// (or there is no plate), so that a connection of one hole type gives the
// findings it always gave; both, named, when the plies differ anywhere.
func pliesOf(c *engine.Connection) (plies []ply, named bool) {
	if c.Plate != nil {
		for i := range c.Holes {
			if c.Holes[i].PliesDiffer() {
				return []ply{memberPly, platePly}, true
			}
		}
	}
	return []ply{memberPly}, false
}

// in names the ply in a finding's where, when the plies are named.
func (p ply) in(named bool) string {
	if !named {
		return ""
	}
	return " in the " + p.name
}

// alongAcross returns a hole's extent along its long axis and across it,
// as J3.3 tabulates slots (length × width); for a round hole both are its
// larger extent.
func alongAcross(h engine.HoleShape) (along, across units.Length) {
	if !h.Type.IsSlot() {
		d := max(h.Dx, h.Dy)
		return d, d
	}
	if h.Slot == rules.Longitudinal {
		return h.Dx, h.Dy
	}
	return h.Dy, h.Dx
}

// holeTypesPresent lists the hole types of one ply in enum order.
func holeTypesPresent(c *engine.Connection, p ply) []rules.HoleType {
	var ts []rules.HoleType
	for i := range c.Holes {
		if t := p.shape(&c.Holes[i]).Type; !slices.Contains(ts, t) {
			ts = append(ts, t)
		}
	}
	slices.Sort(ts)
	return ts
}

// holeSizeFindings is hole.size, J3.2 [J3.3] with Table J3.3 [J3.3M]: per
// ply (when the plies differ) and hole type present, the hole that most
// exceeds the nominal size (along or across a slot) against that size.
// Design holes equal the table; measured as-built holes may not.
func holeSizeFindings(c *engine.Connection) []Finding {
	var fs []Finding
	plies, named := pliesOf(c)
	for _, p := range plies {
		fs = append(fs, plyHoleSizeFindings(c, p, named)...)
	}
	return fs
}

func plyHoleSizeFindings(c *engine.Connection, p ply, named bool) []Finding {
	const id = "hole.size"
	clause := c.Edition.Clause("J3.2") + ", " + table(c, "Table J3.3")
	var fs []Finding
	for _, t := range holeTypesPresent(c, p) {
		nominal, err := c.Edition.Hole(c.Bolt.D, t)
		if err != nil {
			fs = append(fs, untabulated(id, clause, err))
			continue
		}
		best, bestExcess := Finding{}, units.Length(math.Inf(-1))
		for i := range c.Holes {
			h := p.shape(&c.Holes[i])
			if h.Type != t {
				continue
			}
			along, across := alongAcross(h)
			type extent struct {
				measured, limit units.Length
				dir             string
			}
			ext := []extent{{along, nominal.Width, ""}}
			if t.IsSlot() {
				ext = []extent{{along, nominal.Length, " along the slot"}, {across, nominal.Width, " across the slot"}}
			}
			for _, e := range ext {
				if excess := e.measured - e.limit; excess > bestExcess+tol {
					bestExcess = excess
					where := fmt.Sprintf("%s%s (largest %s hole%s)", holeName(c, i), e.dir, t, p.in(named))
					best = lengthFinding(id, clause, e.measured, e.limit, atMost(e.measured, e.limit), where)
				}
			}
		}
		fs = append(fs, best)
	}
	return fs
}

// holeTypeFindings is hole.type, J3.2 [J3.3]: per ply (when the plies
// differ) and distinct hole type and slot direction, whether the edition
// permits it in the joint; then long slots at the faying surfaces.
func holeTypeFindings(c *engine.Connection) []Finding {
	var fs []Finding
	plies, named := pliesOf(c)
	for _, p := range plies {
		fs = append(fs, plyHoleTypeFindings(c, p, named)...)
	}
	return append(fs, fayingSurfaceFindings(c)...)
}

func plyHoleTypeFindings(c *engine.Connection, p ply, named bool) []Finding {
	const id = "hole.type"
	clause := c.Edition.Clause("J3.2")
	type kind struct {
		t   rules.HoleType
		dir rules.SlotDir
	}
	var kinds []kind
	for i := range c.Holes {
		h := p.shape(&c.Holes[i])
		k := kind{h.Type, h.Slot}
		if !h.Type.IsSlot() {
			k.dir = rules.Transverse // direction means nothing for a round hole
		}
		if !slices.Contains(kinds, k) {
			kinds = append(kinds, k)
		}
	}
	slices.SortFunc(kinds, func(a, b kind) int {
		return cmp.Or(cmp.Compare(a.t, b.t), cmp.Compare(a.dir, b.dir))
	})
	prefix := ""
	if named {
		prefix = p.name + ": "
	}
	var fs []Finding
	for _, k := range kinds {
		ok, why := c.Edition.HolePermitted(k.t, k.dir, c.Bolt.Joint)
		what := k.t.String() + " holes"
		if k.t.IsSlot() {
			what = k.dir.String() + " " + what
		}
		where := fmt.Sprintf("%s%s in a %s joint", prefix, what, c.Bolt.Joint) // bearing, pretensioned, slip-critical
		if !ok && why != "" {
			where += ": " + why
		}
		fs = append(fs, Finding{ID: id, Clause: clause, Dim: units.Dimensionless, Pass: ok, Where: where})
	}
	return fs
}

// fayingSurfaceFindings is the rest of hole.type, J3.2 [J3.3]: long-slotted
// holes are permitted in only one of the connected parts at an individual
// faying surface. With a plate, long slots in both the member and the plate
// fail (every faying surface of the joint, both of a double angle's, lies
// between the member and the plate); long slots in one ply pass. Without a
// plate the other part is unknown: an advisory.
func fayingSurfaceFindings(c *engine.Connection) []Finding {
	const id = "hole.type"
	clause := c.Edition.Clause("J3.2")
	var inMember, inPlate []string
	for i := range c.Holes {
		h := &c.Holes[i]
		if h.Type == rules.LongSlot {
			inMember = append(inMember, holeName(c, i))
		}
		if c.Plate != nil && h.InPlate().Type == rules.LongSlot {
			inPlate = append(inPlate, holeName(c, i))
		}
	}
	rule := clause + " permits long slots in only one connected part at each faying surface"
	f := Finding{ID: id, Clause: clause, Dim: units.Dimensionless, Pass: true}
	switch {
	case len(inMember) == 0 && len(inPlate) == 0:
		return nil
	case c.Plate == nil:
		f.Advisory = true
		f.Where = "long-slot holes: " + rule + "; make the other ply standard holes"
	case len(inMember) > 0 && len(inPlate) > 0:
		f.Pass = false
		f.Where = fmt.Sprintf("long slots in both the member (%s) and the plate (%s) at one faying surface: %s; make one ply standard holes",
			holeList(inMember), holeList(inPlate), rule)
	default:
		in, other, ply := "member", "plate", platePly
		if len(inPlate) > 0 {
			in, other, ply = "plate", "member", memberPly
		}
		var types []string
		for _, t := range holeTypesPresent(c, ply) {
			types = append(types, t.String())
		}
		f.Where = fmt.Sprintf("long slots in the %s only, %s holes in the %s: %s", in, strings.Join(types, " and "), other, rule)
	}
	return []Finding{f}
}

// holeList names holes for a finding: every id up to six, else the first
// and the last with the count.
func holeList(ids []string) string {
	if len(ids) <= 6 {
		return strings.Join(ids, ", ")
	}
	return fmt.Sprintf("%s … %s, %d holes", ids[0], ids[len(ids)-1], len(ids))
}

// minSpacingFindings is spacing.min, J3.3 [J3.4]: the least centre-to-centre
// distance against 2-2/3·d and, under 360-22, per ply (when the plies
// differ) the least clear distance between hole outlines against d.
func minSpacingFindings(c *engine.Connection) []Finding {
	const id = "spacing.min"
	if len(c.Holes) < 2 {
		return nil
	}
	clause := c.Edition.Clause("J3.3")
	d := c.Bolt.D
	centre := math.Inf(1)
	var ci, cj int
	for i := range c.Holes {
		for j := i + 1; j < len(c.Holes); j++ {
			a, b := &c.Holes[i], &c.Holes[j]
			if s := math.Hypot(float64(a.X-b.X), float64(a.Y-b.Y)); s < centre-tol {
				centre, ci, cj = s, i, j
			}
		}
	}
	limit := c.Edition.MinSpacing(d)
	fs := []Finding{lengthFinding(id, clause, units.Length(centre), limit,
		atLeast(units.Length(centre), limit), holeName(c, ci)+"–"+holeName(c, cj))}
	if !c.Edition.ClearSpacingRule() {
		return fs
	}
	plies, named := pliesOf(c)
	for _, p := range plies {
		clear := math.Inf(1)
		var ki, kj int
		for i := range c.Holes {
			for j := i + 1; j < len(c.Holes); j++ {
				if s := clearDistanceIn(&c.Holes[i], &c.Holes[j], p); s < clear-tol {
					clear, ki, kj = s, i, j
				}
			}
		}
		fs = append(fs, lengthFinding(id, clause, units.Length(clear), d,
			atLeast(units.Length(clear), d), holeName(c, ki)+"–"+holeName(c, kj)+" (clear distance"+p.in(named)+")"))
	}
	return fs
}

// stadium returns the outline of a hole of shape s centred at (x, y) as a
// segment along its long axis, of length |Dx − Dy|, swept by a circle of
// radius min(Dx, Dy)/2: a round hole is a degenerate segment, a slot a
// stadium.
func stadium(x, y units.Length, s engine.HoleShape) (a, b r2.Vec, r float64) {
	cx, cy := float64(x), float64(y)
	dx, dy := float64(s.Dx), float64(s.Dy)
	if dx >= dy {
		half := (dx - dy) / 2
		return r2.Vec{X: cx - half, Y: cy}, r2.Vec{X: cx + half, Y: cy}, dy / 2
	}
	half := (dy - dx) / 2
	return r2.Vec{X: cx, Y: cy - half}, r2.Vec{X: cx, Y: cy + half}, dx / 2
}

// clearDistance is the least distance between the outlines of two holes in
// the member's ply (negative when they overlap).
func clearDistance(h1, h2 *engine.Hole) float64 { return clearDistanceIn(h1, h2, memberPly) }

// clearDistanceIn is the least distance between the outlines of two holes
// in ply p.
func clearDistanceIn(h1, h2 *engine.Hole, p ply) float64 {
	a1, b1, r1 := stadium(h1.X, h1.Y, p.shape(h1))
	a2, b2, r2 := stadium(h2.X, h2.Y, p.shape(h2))
	return segmentDistance(a1, b1, a2, b2) - r1 - r2
}

// segmentDistance is the least distance between segments ab and cd.
func segmentDistance(a, b, c, d r2.Vec) float64 {
	if segmentsCross(a, b, c, d) {
		return 0
	}
	return min(pointSegment(a, c, d), pointSegment(b, c, d), pointSegment(c, a, b), pointSegment(d, a, b))
}

// cross is the z component of (a − o) × (b − o).
func cross(o, a, b r2.Vec) float64 { return (a.X-o.X)*(b.Y-o.Y) - (a.Y-o.Y)*(b.X-o.X) }

// segmentsCross reports a proper crossing of ab and cd; touching and
// collinear overlaps put an end point on the other segment, which
// pointSegment already measures as zero.
func segmentsCross(a, b, c, d r2.Vec) bool {
	d1, d2 := cross(c, d, a), cross(c, d, b)
	d3, d4 := cross(a, b, c), cross(a, b, d)
	return d1*d2 < 0 && d3*d4 < 0
}

// pointSegment is the distance from p to segment ab.
func pointSegment(p, a, b r2.Vec) float64 {
	vx, vy := b.X-a.X, b.Y-a.Y
	l2 := vx*vx + vy*vy
	if l2 == 0 {
		return math.Hypot(p.X-a.X, p.Y-a.Y)
	}
	s := ((p.X-a.X)*vx + (p.Y-a.Y)*vy) / l2
	s = max(0, min(1, s))
	return math.Hypot(p.X-(a.X+s*vx), p.Y-(a.Y+s*vy))
}

// edge is one edge of a part in contact, as seen from the holes.
type edge struct {
	name string // "member end", "plate free edge", …
	// alongX: the edge runs along x (a side or toe), so a slot transverse
	// to the load (long axis along y) points at it; otherwise it runs
	// along y (an end) and longitudinal slots point at it.
	alongX bool
	dist   func(h *engine.Hole) units.Length
	t      units.Length // thickness of the part, for the maximum
	max    bool         // J3.5 [J3.6] maximum edge distance applies
	ply    ply          // the part's holes
}

// edges lists the edges the holes must clear, in a fixed order: member end,
// member toe (angles; the heel is not an edge) or both sides (flats), plate
// free edge, plate sides.
//
// The maximum of J3.5 [J3.6] runs from a bolt "to the nearest edge of parts
// in contact", 12 times the thickness of the part under consideration: it
// keeps the plies closed where their contact ends. Every member edge takes
// it with the member's t, and the plate's free edge with the plate's (the
// member laps the plate up to it). A plate no wider than the member (a
// splice plate cut to the member, or narrower) lies on the member, so its
// sides are edges of the parts in contact and take it too. A plate wider
// than the member (a gusset as a rule, or a wide splice plate) runs on
// past the member's edges: the contact ends at those edges, checked with
// the member's t, and the plate's far sides are no edge of it, so they
// take the minimum only. The plate is centred on the bolt group, so the
// choice does not depend on where the gage lines sit (propose relies on
// that); a narrow plate whose side passes the member's edge on an
// off-centre group is checked at its own side, farther from the holes
// than the contact's edge: conservative.
func edges(c *engine.Connection) []edge {
	m := &c.Member
	es := []edge{{name: "member end", dist: func(h *engine.Hole) units.Length { return h.X }, t: m.T, max: true, ply: memberPly}}
	low, high := m.Shape.FreeEdges()
	if low {
		es = append(es, edge{name: "member edge (y = 0)", alongX: true, t: m.T, max: true, ply: memberPly,
			dist: func(h *engine.Hole) units.Length { return h.Y }})
	}
	if high {
		name := "member edge (y = width)"
		if !low {
			name = "member toe" // across from the heel
		}
		es = append(es, edge{name: name, alongX: true, t: m.T, max: true, ply: memberPly,
			dist: func(h *engine.Hole) units.Length { return m.Width - h.Y }})
	}
	if p := c.Plate; p != nil && p.Outline != nil {
		es = append(es, outlineEdges(p, m)...)
	} else if p != nil {
		es = append(es, edge{name: "plate free edge", t: p.T, max: true, ply: platePly,
			dist: func(h *engine.Hole) units.Length { return p.FreeEdge - h.X }})
		if p.Width > 0 {
			onMember := p.Width <= m.Width+tol
			es = append(es,
				edge{name: "plate side edge (low y)", alongX: true, t: p.T, ply: platePly, max: onMember,
					dist: func(h *engine.Hole) units.Length { return h.Y - p.YMin() }},
				edge{name: "plate side edge (high y)", alongX: true, t: p.T, ply: platePly, max: onMember,
					dist: func(h *engine.Hole) units.Length { return p.YMax() - h.Y }})
		}
	}
	return es
}

// outlineEdges are the edges of a plate's outline, each measured from a
// hole perpendicular to it (to its nearer end where the foot falls off
// it), in the outline's order. Which of today's edges each stands for
// follows from the way it faces: toward +x it is a free edge (the member
// laps it: the maximum applies), along the load a side (the maximum where
// the plate is no wider than the member, as for the rectangle), toward −x
// a back edge, which the member does not reach (the minimum only).
func outlineEdges(p *engine.Plate, m *engine.Member) []edge {
	onMember := p.Width <= m.Width+tol
	pts := len(p.Outline)
	var es []edge
	for _, e := range p.Edges() {
		what, limited := "back edge", false
		switch {
		case e.Free():
			what, limited = "free edge", true
		case e.Side() && e.Normal.Y < 0:
			what, limited = "low side", onMember
		case e.Side():
			what, limited = "high side", onMember
		}
		if math.Abs(e.Normal.X) > 1e-9 && math.Abs(e.Normal.Y) > 1e-9 {
			what += ", oblique"
		}
		es = append(es, edge{name: fmt.Sprintf("plate edge %d–%d (%s)", e.I, (e.I+1)%pts, what), alongX: e.Side(), t: p.T, ply: platePly, max: limited,
			dist: func(h *engine.Hole) units.Length { return e.DistanceTo(h.X, h.Y) }})
	}
	return es
}

// IncrementType is the hole type whose C2 (Table J3.5) applies at an edge
// to a hole of shape h in that edge's part (alongX: the edge runs along x,
// a side or toe; else along y, an end): oversized holes at every edge,
// slots whose long axis is perpendicular to the edge, otherwise none
// (Standard). The reduction of C2 for slots shorter than the maximum is
// not taken (conservative).
func IncrementType(h engine.HoleShape, alongX bool) rules.HoleType {
	switch {
	case h.Type == rules.Oversized:
		return h.Type
	case h.Type.IsSlot() && (h.Slot == rules.Transverse) == alongX:
		return h.Type
	}
	return rules.Standard
}

// minEdgeFindings is edge.min, J3.4 [J3.5] with Tables J3.4 and J3.5: per
// edge, the hole with the least margin over its minimum, Table J3.4 plus
// C2 where the hole's long axis is perpendicular to the edge; the member's
// edges take the member's holes, the plate's the plate's.
func minEdgeFindings(c *engine.Connection) []Finding {
	const id = "edge.min"
	clause := c.Edition.Clause("J3.4") + ", " + table(c, "Table J3.4")
	if len(c.Holes) == 0 {
		return nil
	}
	emin, err := c.Edition.MinEdge(c.Bolt.D)
	if err != nil {
		return []Finding{untabulated(id, clause, err)}
	}
	var fs []Finding
	for _, e := range edges(c) {
		var best Finding
		margin := units.Length(math.Inf(1))
		for i := range c.Holes {
			h := &c.Holes[i]
			c2, err := c.Edition.EdgeIncrement(c.Bolt.D, IncrementType(e.ply.shape(h), e.alongX))
			if err != nil {
				return append(fs, untabulated(id, clause, err))
			}
			limit, measured := emin+c2, e.dist(h)
			if measured-limit < margin-tol {
				margin = measured - limit
				cl := clause
				if c2 > 0 {
					cl += ", " + table(c, "Table J3.5")
				}
				best = lengthFinding(id, cl, measured, limit, atLeast(measured, limit), holeName(c, i)+" to "+e.name)
			}
		}
		fs = append(fs, best)
	}
	return fs
}

// maxEdgeFindings is edge.max, J3.5 [J3.6]: per edge of a part in contact
// (see edges), the hole nearest it against 12t ≤ 6 in (150 mm), t of that
// part.
func maxEdgeFindings(c *engine.Connection) []Finding {
	const id = "edge.max"
	if len(c.Holes) == 0 {
		return nil
	}
	clause := c.Edition.Clause("J3.5")
	var fs []Finding
	for _, e := range edges(c) {
		if !e.max {
			continue
		}
		near, nearest := 0, units.Length(math.Inf(1))
		for i := range c.Holes {
			if d := e.dist(&c.Holes[i]); d < nearest-tol {
				near, nearest = i, d
			}
		}
		limit := c.Edition.MaxEdge(e.t)
		fs = append(fs, lengthFinding(id, clause, nearest, limit, atMost(nearest, limit), holeName(c, near)+" to "+e.name))
	}
	return fs
}

// maxSpacingFindings is spacing.max, J3.5 [J3.6]: per gage line of two or
// more holes, the largest pitch against 24t ≤ 12 in (14t ≤ 7 in for
// unpainted weathering steel), t the thinner part in contact.
func maxSpacingFindings(c *engine.Connection, info MemberInfo) []Finding {
	const id = "spacing.max"
	clause := c.Edition.Clause("J3.5")
	t := c.Member.T
	if c.Plate != nil {
		t = min(t, c.Plate.T)
	}
	limit := c.Edition.MaxSpacing(t, info.Weathering)
	var fs []Finding
	for n, line := range engine.GageLines(c) {
		if len(line) < 2 {
			continue
		}
		pitch, at := units.Length(math.Inf(-1)), 0
		for k := 1; k < len(line); k++ {
			if s := c.Holes[line[k]].X - c.Holes[line[k-1]].X; s > pitch+tol {
				pitch, at = s, k
			}
		}
		where := fmt.Sprintf("%s–%s on gage line %d", holeName(c, line[at-1]), holeName(c, line[at]), n+1)
		fs = append(fs, lengthFinding(id, clause, pitch, limit, atMost(pitch, limit), where))
	}
	return fs
}

// nutAcrossFlats is F, the width across flats of the heavy hex nut (and
// heavy hex bolt head) of a structural bolt of diameter d. Common practice,
// not AISC 360.
//
// US: F = 1.5·d + 1/8 in (ASME B18.2.6 heavy hex, from memory).
// SI: the larger of ASME B18.2.4.6M heavy hex (A563M nuts on A325M/A490M
// bolts) and EN 14399-4 HV, from memory: M12 22, M16 27, M20 34, M22 36,
// M24 41, M27 46, M30 50, M36 60 mm; other sizes 1.5·d + 6 mm, which gives
// M36 and runs at or above the table.
func nutAcrossFlats(d units.Length, sys units.System) units.Length {
	if sys == units.US {
		return 1.5*d + units.Inch/8
	}
	table := [...]struct{ d, f units.Length }{
		{12, 22}, {16, 27}, {20, 34}, {22, 36}, {24, 41}, {27, 46}, {30, 50}, {36, 60},
	}
	for _, r := range table {
		if math.Abs(float64(d-r.d)) < tol {
			return r.f
		}
	}
	return 1.5*d + 6
}

// socketWall is w, the wall of an impact socket beyond the nut's corners:
// 3/16 in (5 mm). Common practice, not AISC 360.
func socketWall(sys units.System) units.Length {
	if sys == units.US {
		return 3 * units.Inch / 16
	}
	return 5
}

// wrenchRule is the common-practice wrench clearance, F/√3 + w: the nut's
// corner radius plus the socket wall. It serves where the clearance table
// has no row: 1/2 in bolts and every metric bolt (no metric table was read,
// and a metric nut is not the inch nut of nearest size, so SI stays on this
// rule).
func wrenchRule(d units.Length, sys units.System) units.Length {
	return nutAcrossFlats(d, sys)/units.Length(math.Sqrt(3)) + socketWall(sys)
}

// legClearance is the least distance from the bolt centre to the face of
// the outstanding leg that lets the bolt be entered and its nut turned,
// with the clause it comes from and what it is. For an inch bolt of 5/8 to
// 1-1/2 in, the larger of the tightening clearance C1 and the entering
// clearance C2 of rules.BoltClearances (AISC Manual Table 8-4,
// rules.ClearanceSource): the job does not say on which side the nut is
// turned, so the socket is allowed for beside the leg. C1 exceeds C2 in
// every row, so the tightening clearance is the limit there; the entering
// clearance is named only where it is the larger. Otherwise the common
// practice wrench clearance, wrenchRule.
func legClearance(d units.Length, sys units.System) (limit units.Length, clause, what string) {
	if sys == units.US {
		if r, err := rules.BoltClearances(d); err == nil {
			if r.Entering > r.Tightening {
				return r.Entering, rules.ClearanceTable, "entering clearance C2"
			}
			return r.Tightening, rules.ClearanceTable, "tightening clearance C1"
		}
	}
	return wrenchRule(d, sys), commonPractice, "wrench clearance"
}

// WrenchClearance is the least distance from the bolt centre to the face
// of the outstanding leg, as gage.workable checks it (legClearance): what
// the layout search keeps the gage above.
func WrenchClearance(d units.Length, sys units.System) units.Length {
	limit, _, _ := legClearance(d, sys)
	return limit
}

// gageFindings is gage.workable (angles only): the hole nearest the heel
// must clear the fillet, y − Dy/2 ≥ k (common practice), and leave room to
// enter the bolt and turn its nut beside the outstanding leg, y − t ≥ the
// clearance of legClearance (AISC Manual Table 8-4 where it has the bolt,
// else F/√3 + w, common practice).
func gageFindings(c *engine.Connection, info MemberInfo) []Finding {
	const id = "gage.workable"
	if len(c.Member.Junctions) > 0 {
		return junctionFindings(c)
	}
	if len(c.Holes) == 0 || !c.Member.Heel() {
		return nil
	}
	near := 0
	for i := range c.Holes {
		if c.Holes[i].Y < c.Holes[near].Y-tol {
			near = i
		}
	}
	h, name := &c.Holes[near], holeName(c, near)
	fillet := h.Y - h.Dy/2
	leg := h.Y - c.Member.T
	wrench, clause, what := legClearance(c.Bolt.D, c.Edition.System())
	return []Finding{
		lengthFinding(id, commonPractice, fillet, info.K, atLeast(fillet, info.K), name+" to fillet (k)"),
		lengthFinding(id, clause, leg, wrench, atLeast(leg, wrench), name+" to outstanding leg ("+what+")"),
	}
}

// junctionFindings is gage.workable for a rolled section's junctions
// (engine.Junction: a tee's stem, a channel's flanges, a W's web): on each
// side of each junction that holes lie on, the hole nearest it must clear
// the fillet, |y − At| − Dy/2 ≥ the toe distance (k or k1; common
// practice), and leave the room legClearance gives between its centre and
// the element's face, |y − At| − Face (AISC Manual Table 8-4 where it has
// the bolt).
func junctionFindings(c *engine.Connection) []Finding {
	const id = "gage.workable"
	var fs []Finding
	wrench, clause, what := legClearance(c.Bolt.D, c.Edition.System())
	for _, j := range c.Member.Junctions {
		for _, side := range j.Sides() {
			near := -1
			for i := range c.Holes {
				off := j.Offset(c.Holes[i].Y, side)
				if off > 0 && (near < 0 || off < j.Offset(c.Holes[near].Y, side)-tol) {
					near = i
				}
			}
			if near < 0 {
				continue
			}
			h, name := &c.Holes[near], holeName(c, near)
			off := j.Offset(h.Y, side)
			fillet, face := off-h.Dy/2, off-j.Face
			fs = append(fs,
				lengthFinding(id, commonPractice, fillet, j.Toe, atLeast(fillet, j.Toe), fmt.Sprintf("%s to the %s's fillet (%s)", name, j.Name, j.Fillet)),
				lengthFinding(id, clause, face, wrench, atLeast(face, wrench), fmt.Sprintf("%s to the %s (%s)", name, j.Name, what)))
		}
	}
	// a hole on a stem's or web's line, which neither side sees
	for i := range c.Holes {
		for _, j := range c.Member.Junctions {
			if off := j.Offset(c.Holes[i].Y, 1); j.Side == 0 && math.Abs(float64(off)) <= tol {
				fs = append(fs, lengthFinding(id, commonPractice, -c.Holes[i].Dy/2, j.Toe, false,
					fmt.Sprintf("%s on the %s's line: the hole is in the %s", holeName(c, i), j.Name, j.Name)))
			}
		}
	}
	return fs
}

// eccentricityFindings is eccentricity, J1.7 (flat bars only): the bolt
// group's centre of gravity (the mean y of its holes; every bolt is the
// same bolt and carries an equal share, so hole sizes do not weight it)
// against the bar's gravity axis, y = width/2. The limit is the job's
// hole position tolerance (tolerance.position, ±1/16 in or 2 mm by
// default, common practice): the mean of holes each within it lies within
// it too, so an as-built group is never failed for the shop's own
// accuracy. Where the job provides for the eccentricity
// (member.eccentricity: provided) the finding is advisory and the engine
// checks the bar for Pr with Mr = Pr·e instead (member.combined, H1.2).
//
// J1.7 exempts single-angle, double-angle "and similar members": open
// sections connected through one element, whose centroid the group
// cannot reach (tees, channels by a leg or flange). A flat bar is
// connected across its whole section and can always be centred, so it is
// not one of them; angles get no finding.
func eccentricityFindings(c *engine.Connection, info MemberInfo) []Finding {
	const id = "eccentricity"
	if !c.Member.Shape.CentredGroup() || len(c.Holes) == 0 {
		return nil
	}
	e, _ := engine.GroupEccentricity(c)
	limit := info.PositionTol
	where := "bolt group's centre of gravity to the bar's centre line (y = width/2)"
	if len(c.Member.Junctions) > 0 {
		where = "bolt group's centre of gravity to the section's centre line across the connected element (y = width/2)"
	}
	provided := c.Member.Eccentricity == engine.EccentricityProvided
	pass := atMost(e, limit)
	switch {
	case provided:
		where += "; the eccentricity is provided for: member.combined checks the bar for Pr with Mr = Pr·e (" + c.Edition.Clause("H1.2") + ")"
	case !pass:
		where += "; centre the group, or provide for the eccentricity (member.eccentricity: provided)"
	}
	f := lengthFinding(id, c.Edition.Clause("J1.7"), e, limit, pass, where)
	f.Advisory = provided
	return []Finding{f}
}

// slendernessFindings is slenderness, the User Note to D1: L/r preferably
// ≤ 300. Advisory: it never fails a job.
func slendernessFindings(c *engine.Connection, info MemberInfo) []Finding {
	if info.Length <= 0 || info.Rmin <= 0 {
		return nil
	}
	lr := float64(info.Length / info.Rmin)
	where := "member L/r"
	if info.Designation != "" {
		where = info.Designation + " L/r"
	}
	return []Finding{{
		ID: "slenderness", Clause: c.Edition.Clause("D1"),
		Measured: lr, Limit: maxSlenderness, Dim: units.Dimensionless,
		Pass: lr <= maxSlenderness, Advisory: true, Where: where,
	}}
}
