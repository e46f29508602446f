package measured

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/spatial/r2"
)

// DXF reading: a small group-code reader that takes what reverify needs
// and skips everything else. It reads ASCII DXF of any release from R12
// on: the HEADER's $INSUNITS and, in the ENTITIES section only, CIRCLE,
// ARC, LINE, LWPOLYLINE (bulges belong to the vertex they follow) and
// POLYLINE/VERTEX/SEQEND. Block definitions, INSERTs, text, dimensions,
// hatches and every other entity are skipped, as are entities in paper
// space. Entities drawn with the extrusion (0, 0, −1) — mirrored by many
// CAD programs — are mapped to world coordinates; other extrusions are
// skipped with a note. A file must end with its 0/EOF record: a file cut
// short is an error, not a part with holes missing. $INSUNITS outside the
// DXF's codes 0 to 24 is an error; 0 (unitless) reads the job's units.

// maxInsUnits is the largest $INSUNITS code: 0 is unitless, 24 the US
// survey mile (DXF Reference, HEADER section variables; from memory).
const maxInsUnits = 24

// insUnits maps $INSUNITS codes that are lengths of a part to millimetres.
var insUnits = map[int]Unit{
	1: Inches, 2: {"ft", 304.8}, 4: Millimetres, 5: {"cm", 10}, 6: {"m", 1000},
	8: {"µin", 25.4e-6}, 9: {"mil", 0.0254}, 10: {"yd", 914.4}, 13: {"µm", 1e-3}, 14: {"dm", 100},
}

// maxGroups caps the groups of one entity (an LWPOLYLINE of 100,000
// vertices has about 300,000).
const maxGroups = 1 << 20

// wanted are the entities whose groups are kept; others are skipped.
var wanted = map[string]bool{"CIRCLE": true, "ARC": true, "LINE": true, "LWPOLYLINE": true, "POLYLINE": true, "VERTEX": true, "SEQEND": true}

// pair is one group: a code and its value, with the line of the code.
type pair struct {
	code int
	val  string
	line int
}

// dxfScanner yields the groups of an ASCII DXF.
type dxfScanner struct {
	file string
	data []byte
	pos  int
	line int
}

func (s *dxfScanner) readLine() (string, bool) {
	if s.pos >= len(s.data) {
		return "", false
	}
	rest := s.data[s.pos:]
	i := bytes.IndexByte(rest, '\n')
	var l []byte
	if i < 0 {
		l, s.pos = rest, len(s.data)
	} else {
		l, s.pos = rest[:i], s.pos+i+1
	}
	s.line++
	return strings.TrimSpace(string(bytes.TrimSuffix(l, []byte{'\r'}))), true
}

// next returns the next group; ok is false at the end of the data.
func (s *dxfScanner) next() (p pair, ok bool, err error) {
	c, ok := s.readLine()
	for ok && c == "" && s.line <= 1 {
		c, ok = s.readLine() // tolerate a leading blank line
	}
	if !ok {
		return p, false, nil
	}
	p.line = s.line
	code, cerr := strconv.Atoi(c)
	if cerr != nil || code < 0 || code > 1071 {
		return p, false, &Error{File: s.file, Line: s.line, Msg: fmt.Sprintf("group code %q is not a DXF group code", clip(c)),
			Hint: "is this an ASCII DXF file?"}
	}
	p.code = code
	v, ok := s.readLine()
	if !ok {
		return p, false, &Error{File: s.file, Line: p.line, Field: fmt.Sprintf("group %d", code), Msg: "the file ends before the group's value"}
	}
	p.val = v
	return p, true, nil
}

func clip(s string) string {
	if len(s) > 40 {
		return s[:40] + "…"
	}
	return s
}

// entity is one entity's groups.
type entity struct {
	kind  string
	line  int
	pairs []pair
}

// drawing is what the reader keeps of a DXF, in the file's units.
type drawing struct {
	insUnits    int // -1: not given
	unitsLine   int // line of the $INSUNITS value
	measurement int // -1: not given
	circles     []circle
	loops       [][]seg // closed polylines
	segs        []seg   // LINEs and ARCs, for chaining into loops
	segLayers   []string
	loopLayers  []string
	skipped     map[string]int
	oddExtruded int
}

type circle struct {
	c     r2.Vec
	r     float64
	layer string
	line  int
}

// seg is a straight or arc segment from a to b: bulge is tan(θ/4), θ the
// included angle, positive counter-clockwise (0: straight).
type seg struct {
	a, b  r2.Vec
	bulge float64
	line  int
}

// ReadDXF reads the holes of a part from an ASCII DXF. layer, when not
// empty, takes every circle on that layer (case-insensitive, as DXF layer
// names are); otherwise every circle inside the largest closed contour is a
// hole, or every circle when there is no closed contour. Closed loops
// (polylines, or lines and arcs end to end) inside the contour (or on the
// layer) are holes too when they are shaped as one: a stadium is a slotted
// hole; two half circles, or a polygon of eight or more sides with its
// corners on a circle, a round hole. Lengths are converted to millimetres
// by $INSUNITS; without it the file is read in def, the job's unit.
func ReadDXF(r io.Reader, file string, def Unit, layer string) (*Set, error) {
	data, err := readCapped(r, file)
	if err != nil {
		return nil, err
	}
	if bytes.HasPrefix(data, []byte("AutoCAD Binary DXF")) {
		return nil, &Error{File: file, Line: 1, Msg: "binary DXF is not supported", Hint: "save the drawing as ASCII DXF"}
	}
	d, err := parseDXF(file, data)
	if err != nil {
		return nil, err
	}
	return d.holes(file, def, layer)
}

// parseDXF reads the groups reverify needs: a record (group 0) opens a
// section or an entity, and the groups after it belong to the HEADER
// variable or the ENTITIES entity it opened. The file must end with 0/EOF.
func parseDXF(file string, data []byte) (*drawing, error) {
	ps := &dxfParser{file: file, s: &dxfScanner{file: file, data: data},
		d: &drawing{insUnits: -1, measurement: -1, skipped: map[string]int{}}}
	for {
		p, ok, err := ps.s.next()
		if err != nil {
			return nil, err
		}
		if !ok {
			return nil, ps.endsEarly()
		}
		if p.code != 0 {
			if err := ps.group(p); err != nil {
				return nil, err
			}
			continue
		}
		eof, err := ps.record(p)
		if err != nil {
			return nil, err
		}
		if eof {
			break
		}
	}
	if err := ps.flush(); err != nil {
		return nil, err
	}
	if err := ps.endPolyline(); err != nil {
		return nil, err
	}
	if !ps.sawSection {
		return nil, &Error{File: file, Msg: "no DXF sections", Hint: "is this an ASCII DXF file?"}
	}
	return ps.d, nil
}

// dxfParser is the state of parseDXF between groups.
type dxfParser struct {
	file       string
	s          *dxfScanner
	d          *drawing
	section    string  // the open section's name, upper case ("" between sections)
	cur        *entity // the entity whose groups are being read
	poly       *entity // an open R12 POLYLINE collecting VERTEX entities
	verts      []entity
	count      int // entities and LWPOLYLINE vertices read
	sawSection bool
	headerVar  string // the HEADER variable whose groups are being read
}

// endsEarly is the error of a file whose data ends before its 0/EOF record.
func (ps *dxfParser) endsEarly() error {
	if !ps.sawSection {
		return &Error{File: ps.file, Msg: "no DXF sections", Hint: "is this an ASCII DXF file?"}
	}
	// Judging the holes of a cut-off file would report the holes
	// it lost as missing.
	return &Error{File: ps.file, Line: ps.s.line, Msg: "the file ends before EOF: truncated transfer?",
		Hint: "a DXF ends with the record 0/EOF; copy or export the file again"}
}

// record reads a group-0 record p: it ends the entity before it, and opens
// or closes a section, opens an entity (in ENTITIES), or ends the file
// (eof).
func (ps *dxfParser) record(p pair) (eof bool, err error) {
	if err := ps.flush(); err != nil {
		return false, err
	}
	switch p.val {
	case "SECTION":
		ps.sawSection = true
		n, ok, err := ps.s.next()
		if err != nil {
			return false, err
		}
		if !ok || n.code != 2 {
			return false, &Error{File: ps.file, Line: p.line, Msg: "SECTION without its name (group 2)"}
		}
		ps.section = strings.ToUpper(n.val)
		return false, nil
	case "ENDSEC":
		ps.section = ""
		return false, ps.endPolyline()
	case "EOF":
		return true, nil
	}
	if ps.section == "ENTITIES" {
		ps.count++
		if ps.count > MaxEntities {
			return false, &Error{File: ps.file, Line: p.line, Msg: fmt.Sprintf("more than %d entities", MaxEntities),
				Hint: "export only the part: its contour and holes"}
		}
		ps.cur = &entity{kind: strings.ToUpper(p.val), line: p.line}
	}
	return false, nil
}

// group reads a group other than 0 in the open section.
func (ps *dxfParser) group(p pair) error {
	switch ps.section {
	case "HEADER":
		return ps.headerGroup(p)
	case "ENTITIES":
		return ps.entityGroup(p)
	}
	return nil
}

// headerGroup reads a HEADER group: group 9 names a variable, and group 70
// of $INSUNITS or $MEASUREMENT is its integer value ($INSUNITS a code
// from 0 to maxInsUnits).
func (ps *dxfParser) headerGroup(p pair) error {
	if p.code == 9 {
		ps.headerVar = strings.ToUpper(p.val)
		return nil
	}
	if p.code != 70 || (ps.headerVar != "$INSUNITS" && ps.headerVar != "$MEASUREMENT") {
		return nil
	}
	v, err := strconv.Atoi(p.val)
	if err != nil {
		return &Error{File: ps.file, Line: p.line, Field: ps.headerVar, Msg: fmt.Sprintf("%q is not an integer", clip(p.val))}
	}
	if ps.headerVar != "$INSUNITS" {
		ps.d.measurement = v
		return nil
	}
	if v < 0 || v > maxInsUnits {
		return &Error{File: ps.file, Line: p.line, Field: ps.headerVar, Msg: fmt.Sprintf("%d is not a $INSUNITS code (0 to %d)", v, maxInsUnits),
			Hint: "set $INSUNITS to 1 (inches) or 4 (millimetres)"}
	}
	ps.d.insUnits, ps.d.unitsLine = v, p.line
	return nil
}

// entityGroup keeps a group of the open entity when it is a wanted kind,
// at most maxGroups of them; an LWPOLYLINE's vertices count toward
// MaxEntities.
func (ps *dxfParser) entityGroup(p pair) error {
	cur := ps.cur
	if cur != nil && wanted[cur.kind] {
		if len(cur.pairs) >= maxGroups {
			return &Error{File: ps.file, Line: cur.line, Field: cur.kind, Msg: fmt.Sprintf("more than %d groups in one entity", maxGroups)}
		}
		cur.pairs = append(cur.pairs, p)
	}
	if cur != nil && cur.kind == "LWPOLYLINE" && p.code == 10 {
		ps.count++ // vertices count toward the cap
		if ps.count > MaxEntities {
			return &Error{File: ps.file, Line: p.line, Msg: fmt.Sprintf("more than %d entities and vertices", MaxEntities)}
		}
	}
	return nil
}

// flush ends the entity being read: a POLYLINE opens a polyline, a VERTEX
// joins the open one, a SEQEND ends it, and any other entity ends an open
// polyline (one without its SEQEND) and is added to the drawing.
func (ps *dxfParser) flush() error {
	if ps.cur == nil {
		return nil
	}
	e := ps.cur
	ps.cur = nil
	switch e.kind {
	case "POLYLINE":
		ps.poly, ps.verts = e, nil
		return nil
	case "VERTEX":
		if ps.poly != nil {
			ps.verts = append(ps.verts, *e)
		}
		return nil
	case "SEQEND":
		return ps.endPolyline()
	}
	if err := ps.endPolyline(); err != nil { // a POLYLINE without its SEQEND
		return err
	}
	return ps.d.addEntity(ps.file, e)
}

// endPolyline adds the open R12 POLYLINE, if any, with its vertices.
func (ps *dxfParser) endPolyline() error {
	if ps.poly == nil {
		return nil
	}
	err := ps.d.addPolyline(ps.file, ps.poly, ps.verts)
	ps.poly, ps.verts = nil, nil
	return err
}

// common holds the groups every entity shares.
type common struct {
	layer      string
	mirror     bool // extrusion (0, 0, −1): OCS x is −WCS x
	oddExtrude bool
	paper      bool
}

func commonOf(e *entity) common {
	c := common{layer: "0"}
	var n [3]float64
	n[2] = 1
	for _, p := range e.pairs {
		switch p.code {
		case 8:
			c.layer = p.val
		case 67:
			c.paper = strings.TrimSpace(p.val) == "1"
		case 210, 220, 230:
			if v, err := strconv.ParseFloat(p.val, 64); err == nil && finite(v) {
				n[(p.code-210)/10] = v
			}
		}
	}
	const e6 = 1e-9
	switch {
	case math.Abs(n[0]) < e6 && math.Abs(n[1]) < e6 && n[2] > 0:
	case math.Abs(n[0]) < e6 && math.Abs(n[1]) < e6 && n[2] < 0:
		c.mirror = true
	default:
		c.oddExtrude = true
	}
	return c
}

// num reads a float group value of entity e.
func num(file string, p pair) (float64, error) {
	v, err := strconv.ParseFloat(p.val, 64)
	if err != nil || !finite(v) || math.Abs(v) > 1e12 {
		return 0, &Error{File: file, Line: p.line, Field: fmt.Sprintf("group %d", p.code), Msg: fmt.Sprintf("%q is not a number", clip(p.val))}
	}
	return v, nil
}

// fields reads the float groups named in codes (first occurrence each).
func fields(file string, e *entity, codes ...int) (map[int]float64, error) {
	out := map[int]float64{}
	for _, p := range e.pairs {
		for _, c := range codes {
			if p.code == c {
				if _, seen := out[c]; seen {
					break
				}
				v, err := num(file, p)
				if err != nil {
					return nil, err
				}
				out[c] = v
			}
		}
	}
	return out, nil
}

func missing(file string, e *entity, code int) error {
	return &Error{File: file, Line: e.line, Field: fmt.Sprintf("%s group %d", e.kind, code), Msg: "is missing"}
}

func (d *drawing) skip(kind string) { d.skipped[kind]++ }

// addEntity adds a CIRCLE, ARC, LINE or LWPOLYLINE of model space to the
// drawing. Other kinds and entities in paper space are counted as skipped;
// entities drawn out of the XY plane are counted apart, except a LINE,
// whose points are world coordinates whatever its extrusion.
func (d *drawing) addEntity(file string, e *entity) error {
	switch e.kind {
	case "CIRCLE", "ARC", "LINE", "LWPOLYLINE":
	default:
		d.skip(e.kind)
		return nil
	}
	c := commonOf(e)
	if c.paper {
		d.skip(e.kind + " (paper space)")
		return nil
	}
	if c.oddExtrude && e.kind != "LINE" {
		d.oddExtruded++
		return nil
	}
	switch e.kind {
	case "CIRCLE", "ARC":
		return d.addCircleOrArc(file, e, c)
	case "LINE":
		return d.addLine(file, e, c)
	default:
		return d.addLWPolyline(file, e, c)
	}
}

// toWorld maps a point of an entity's object coordinates to world
// coordinates: with the extrusion (0, 0, −1) x changes sign.
func (c common) toWorld(p r2.Vec) r2.Vec {
	if c.mirror {
		p.X = -p.X
	}
	return p
}

// addCircleOrArc adds a CIRCLE, or an ARC: a segment, or a circle when it
// sweeps the full turn. Centre (10, 20) and radius (40, positive) must be
// given; an ARC runs counter-clockwise from angle 50 to angle 51 (degrees).
func (d *drawing) addCircleOrArc(file string, e *entity, c common) error {
	f, err := fields(file, e, 10, 20, 40, 50, 51)
	if err != nil {
		return err
	}
	for _, k := range []int{10, 20, 40} {
		if _, ok := f[k]; !ok {
			return missing(file, e, k)
		}
	}
	if !(f[40] > 0) {
		return &Error{File: file, Line: e.line, Field: e.kind + " group 40", Msg: "radius is not positive"}
	}
	ctr, r := r2.Vec{X: f[10], Y: f[20]}, f[40]
	if e.kind == "CIRCLE" {
		d.circles = append(d.circles, circle{c.toWorld(ctr), r, c.layer, e.line})
		return nil
	}
	a0, a1 := f[50]*math.Pi/180, f[51]*math.Pi/180
	sweep := math.Mod(a1-a0, 2*math.Pi)
	if sweep <= 0 {
		sweep += 2 * math.Pi
	}
	if sweep >= 2*math.Pi-1e-12 {
		// a full-circle arc is a circle
		d.circles = append(d.circles, circle{c.toWorld(ctr), r, c.layer, e.line})
		return nil
	}
	s := seg{
		a:     c.toWorld(r2.Vec{X: ctr.X + r*math.Cos(a0), Y: ctr.Y + r*math.Sin(a0)}),
		b:     c.toWorld(r2.Vec{X: ctr.X + r*math.Cos(a0+sweep), Y: ctr.Y + r*math.Sin(a0+sweep)}),
		bulge: math.Tan(sweep / 4), line: e.line,
	}
	if c.mirror {
		s.bulge = -s.bulge
	}
	d.segs = append(d.segs, s)
	d.segLayers = append(d.segLayers, c.layer)
	return nil
}

// addLine adds a LINE from (10, 20) to (11, 21), world coordinates, as a
// segment.
func (d *drawing) addLine(file string, e *entity, c common) error {
	f, err := fields(file, e, 10, 20, 11, 21)
	if err != nil {
		return err
	}
	for _, k := range []int{10, 20, 11, 21} {
		if _, ok := f[k]; !ok {
			return missing(file, e, k)
		}
	}
	d.segs = append(d.segs, seg{a: r2.Vec{X: f[10], Y: f[20]}, b: r2.Vec{X: f[11], Y: f[21]}, line: e.line})
	d.segLayers = append(d.segLayers, c.layer)
	return nil
}

// lwVertex is a vertex of an LWPOLYLINE as read: its point, the bulge of
// the segment it starts, and whether its y was given.
type lwVertex struct {
	p     r2.Vec
	bulge float64
	hasY  bool
}

// addLWPolyline adds an LWPOLYLINE as a loop (closed: flag 1 of group 70,
// or its last vertex on its first) or as segments. Every vertex must have
// its y.
func (d *drawing) addLWPolyline(file string, e *entity, c common) error {
	vs, flags, err := lwVertices(file, e)
	if err != nil {
		return err
	}
	pts := make([]r2.Vec, len(vs))
	bul := make([]float64, len(vs))
	for i, v := range vs {
		if !v.hasY {
			return &Error{File: file, Line: e.line, Field: "LWPOLYLINE group 20", Msg: fmt.Sprintf("vertex %d has no y", i+1)}
		}
		pts[i], bul[i] = c.toWorld(v.p), v.bulge
		if c.mirror {
			bul[i] = -bul[i]
		}
	}
	d.addVertices(pts, bul, flags&1 == 1, c.layer, e.line)
	return nil
}

// lwVertices reads the flags (group 70) and the vertices of an
// LWPOLYLINE: a group 10 starts a vertex, the 20 after it is its y, and a
// 42 is the bulge of the vertex it follows.
func lwVertices(file string, e *entity) (vs []lwVertex, flags int, err error) {
	for _, p := range e.pairs {
		switch p.code {
		case 70:
			v, err := strconv.Atoi(p.val)
			if err != nil {
				return nil, 0, &Error{File: file, Line: p.line, Field: "LWPOLYLINE group 70", Msg: fmt.Sprintf("%q is not an integer", clip(p.val))}
			}
			flags = v
		case 10, 20, 42:
			v, err := num(file, p)
			if err != nil {
				return nil, 0, err
			}
			switch p.code {
			case 10:
				vs = append(vs, lwVertex{p: r2.Vec{X: v}})
			case 20:
				if len(vs) == 0 || vs[len(vs)-1].hasY {
					return nil, 0, &Error{File: file, Line: p.line, Field: "LWPOLYLINE group 20", Msg: "y without its x (group 10)"}
				}
				vs[len(vs)-1].p.Y, vs[len(vs)-1].hasY = v, true
			case 42:
				// the bulge belongs to the vertex it follows: the
				// segment from that vertex to the next
				if len(vs) > 0 {
					vs[len(vs)-1].bulge = v
				}
			}
		}
	}
	return vs, flags, nil
}

// addPolyline turns an R12 POLYLINE and its VERTEX entities into a loop
// (closed) or segments (open).
func (d *drawing) addPolyline(file string, pl *entity, verts []entity) error {
	c := commonOf(pl)
	flags := 0
	for _, p := range pl.pairs {
		if p.code == 70 {
			v, err := strconv.Atoi(p.val)
			if err != nil {
				return &Error{File: file, Line: p.line, Field: "POLYLINE group 70", Msg: fmt.Sprintf("%q is not an integer", clip(p.val))}
			}
			flags = v
		}
	}
	if c.paper || flags&(8|16|64) != 0 || c.oddExtrude {
		d.skip("POLYLINE (3D, mesh or paper space)")
		return nil
	}
	var pts []r2.Vec
	var bul []float64
	for i := range verts {
		v := &verts[i]
		f, err := fields(file, v, 10, 20, 42, 70)
		if err != nil {
			return err
		}
		if int(f[70])&(16|128) != 0 {
			continue // spline frame or face record
		}
		if _, ok := f[10]; !ok {
			return missing(file, v, 10)
		}
		if _, ok := f[20]; !ok {
			return missing(file, v, 20)
		}
		p, b := r2.Vec{X: f[10], Y: f[20]}, f[42]
		if c.mirror {
			p.X, b = -p.X, -b
		}
		pts, bul = append(pts, p), append(bul, b)
	}
	d.addVertices(pts, bul, flags&1 == 1, c.layer, pl.line)
	return nil
}

func (d *drawing) addVertices(pts []r2.Vec, bul []float64, closed bool, layer string, line int) {
	n := len(pts)
	if n < 2 {
		return
	}
	var loop []seg
	for i := 0; i+1 < n; i++ {
		loop = append(loop, seg{pts[i], pts[i+1], bul[i], line})
	}
	// A polyline whose last vertex repeats the first is closed too.
	if closed || dist(pts[0], pts[n-1]) < 1e-9*(1+math.Abs(pts[0].X)+math.Abs(pts[0].Y)) {
		if dist(pts[0], pts[n-1]) > 0 {
			loop = append(loop, seg{pts[n-1], pts[0], bul[n-1], line})
		}
		d.loops = append(d.loops, loop)
		d.loopLayers = append(d.loopLayers, layer)
		return
	}
	for _, s := range loop {
		d.segs = append(d.segs, s)
		d.segLayers = append(d.segLayers, layer)
	}
}

func dist(a, b r2.Vec) float64 { return math.Hypot(a.X-b.X, a.Y-b.Y) }
