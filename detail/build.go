package detail

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"gaugeline/detail/detailing"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"

	"gonum.org/v1/gonum/spatial/r2"
)

// job is a job file seen by the model builder: the steps below are its
// methods, with the job's fields at hand.
type job struct{ *jobfile.Job }

// Build resolves the job into the engine's model: the section from the
// catalog (or explicit dimensions and overrides), the grades and hole sizes
// of the edition in force, the hole centres from the pattern (or the
// explicit list), the plate and the demand. Geometry that cannot be made —
// a hole outside the member or the plate, a bolt too big for the leg, two
// holes at one centre — is an *InputError naming the field; a layout that
// can be made but breaks a detailing rule is not (the checks report it).
func Build(jf *jobfile.Job) (*Design, error) {
	j := job{jf}
	ed, err := j.edition()
	if err != nil {
		return nil, err
	}
	d := j.newDesign(ed)
	if err := j.buildMember(ed, d); err != nil {
		return nil, err
	}
	if err := j.buildMemberB(ed, d); err != nil {
		return nil, err
	}
	if err := j.buildBolt(ed, &d.Conn); err != nil {
		return nil, err
	}
	if err := j.buildHoles(ed, d); err != nil {
		return nil, err
	}
	if err := j.buildPlate(ed, d); err != nil {
		return nil, err
	}
	j.setDemand(d)
	return d, nil
}

// The model is built in the same steps for every job, whichever way it
// comes: Build for a job file (check, sheet, report, reverify's design),
// propose for each candidate layout, reverify for the measured holes.
//
//   - the parts: newDesign, buildMember, buildBolt, plateParts, setDemand
//     (propose resolves them once per plate thickness and bolt);
//   - the holes: Design.PlaceHoles puts the centres into the model with
//     their ids and the hole shapes of both plies and tells the first one
//     that does not fit the member;
//   - the plate: Design.PlacePlate puts the plate's free edge and centre
//     line after the holes and tells the first hole off the plate;
//   - as built: Design.WithHoles is the design with other holes (the
//     measured ones), the plate as designed.
//
// Check (report.go) then checks whatever the steps made.

// A Builder makes the designs of one job under its edition step by step:
// what Build does once, for a caller that makes many (the layout search).
type Builder struct {
	j       job
	Edition *rules.Edition
}

// NewBuilder resolves the job's standard and checks its stock against it.
func NewBuilder(jf *jobfile.Job) (*Builder, error) {
	j := job{jf}
	ed, err := j.edition()
	if err != nil {
		return nil, err
	}
	return &Builder{j: j, Edition: ed}, nil
}

// Template resolves the member, the plate's steel and the demand for a
// plate thickness tp, as Build does: everything of a Design but the bolt
// and the holes.
func (b *Builder) Template(tp units.Length) (*Design, error) {
	ed := b.Edition
	jf := *b.j.Job
	if jf.Plate != nil {
		pl := *jf.Plate
		pl.Thickness, pl.AutoThickness = tp, false
		jf.Plate = &pl
	}
	jj := job{&jf}
	des := jj.newDesign(ed)
	if err := jj.buildMember(ed, des); err != nil {
		return nil, err
	}
	if err := jj.buildMemberB(ed, des); err != nil {
		return nil, err
	}
	if jj.Plate != nil {
		if err := jj.plateParts(ed, des); err != nil {
			return nil, err
		}
	}
	jj.setDemand(des)
	return des, nil
}

// PlyShapes is the hole shapes of the member's ply and, where it differs,
// the plate's (else nil) for a bolt of diameter d.
func (b *Builder) PlyShapes(d units.Length) (engine.HoleShape, *engine.HoleShape, error) {
	return b.j.plyShapes(b.Edition, d)
}

// WithBolt returns a copy of the template with the bolt of diameter d and
// grade resolved.
func (t *Design) WithBolt(ed *rules.Edition, d units.Length, grade string) (*Design, error) {
	jf := *t.Job
	jf.Bolts.Diameter, jf.Bolts.Grade = d, grade
	out := *t
	out.Job = &jf
	if err := (job{&jf}).buildBolt(ed, &out.Conn); err != nil {
		return nil, err
	}
	return &out, nil
}

// DiameterError is the bad input of a bolt diameter the edition's hole
// table does not list (err from rules.Edition.Hole).
func DiameterError(j *jobfile.Job, ed *rules.Edition, err error) *jobfile.InputError {
	return j.FieldError("bolts.diameter", tabulatedMsg(err), diametersHint(ed))
}

// edition resolves the job's standard and checks its stock against it.
func (j job) edition() (*rules.Edition, error) {
	ed, err := rules.Lookup(j.Standard, j.Units)
	if err != nil {
		return nil, j.FieldError("standard", err.Error(), "known standards: "+strings.Join(rules.Names(), ", "))
	}
	if err := j.CheckStock(ed); err != nil {
		return nil, err
	}
	return ed, nil
}

// newDesign is an empty design of the job under edition ed.
func (j job) newDesign(ed *rules.Edition) *Design {
	d := &Design{Job: j.Job}
	d.Conn.Edition, d.Conn.Method = ed, j.Method
	return d
}

// setDemand puts the job's demand into the model: as required, or the
// governing combination of the service loads.
func (j job) setDemand(d *Design) {
	if j.Load.Combined() {
		t, c := engine.Demands(j.Method, j.Load.Service, j.Load.Reverses)
		d.Conn.Demand, d.Combination = t.Force, t.Name
		d.Conn.Compression, d.CompressionCombination = c.Force, c.Name
	} else {
		d.Conn.Demand, d.Conn.Compression = j.Load.Required, j.Load.Compression
	}
}

// CheckStock checks the propose stock against the edition: every grade and
// diameter must be tabulated. A job without a stock block passes.
func (j job) CheckStock(ed *rules.Edition) error {
	for i, g := range j.Stock.Grades {
		if _, err := ed.Bolt(g); err != nil {
			path := fmt.Sprintf("stock.grades[%d]", i)
			return j.FieldError(path, fmt.Sprintf("unknown bolt grade %q in %s", g, ed), "known grades: "+strings.Join(ed.BoltGrades(), ", "))
		}
	}
	for i, dia := range j.Stock.Diameters {
		if _, err := ed.Hole(dia, j.Bolts.Hole); err != nil {
			path := fmt.Sprintf("stock.diameters[%d]", i)
			return j.FieldError(path, tabulatedMsg(err), diametersHint(ed))
		}
	}
	return nil
}

func tabulatedMsg(err error) string {
	var nt *rules.NotTabulatedError
	if errors.As(err, &nt) {
		return fmt.Sprintf("%s has no hole size for %s in %s", nt.Table, nt.Key, nt.Edition)
	}
	return err.Error()
}

func diametersHint(ed *rules.Edition) string {
	var ds []string
	for _, d := range ed.Diameters() {
		ds = append(ds, boltName(d, ed.System()))
	}
	return "tabulated diameters: " + strings.Join(ds, ", ")
}

// boltName writes a bolt diameter as a shop says it: "3/4 in", "M20".
func boltName(d units.Length, sys units.System) string {
	if _, metric := units.MetricBolt(d); sys == units.SI || metric {
		return fmt.Sprintf("M%g", d.Mm())
	}
	return units.FormatJob(d, units.US)
}

// steel resolves a catalog grade or explicit Fy/Fu of the block at path.
func (j job) steel(ed *rules.Edition, s jobfile.SteelSpec, path string) (rules.Steel, error) {
	if s.Grade == "" {
		lab := j.Units.Label(units.DimStress)
		name := fmt.Sprintf("Fy %g/Fu %g %s", j.Units.ToJob(float64(s.Fy), units.DimStress), j.Units.ToJob(float64(s.Fu), units.DimStress), lab)
		return rules.Steel{Name: name, Fy: s.Fy, Fu: s.Fu}, nil
	}
	st, err := ed.Steel(s.Grade)
	if err != nil {
		return st, j.FieldError(path+".grade", fmt.Sprintf("unknown steel grade %q", s.Grade),
			"known grades: "+strings.Join(ed.SteelGrades(), ", ")+"; or give fy and fu")
	}
	return st, nil
}

// compact writes a length the way a designation does: "1-1/2", "10".
func compact(l units.Length, sys units.System) string {
	s := units.FormatJob(l, sys)
	return strings.TrimSuffix(strings.TrimSuffix(s, " in"), " mm")
}

// lookupAngle finds a catalog angle; a size written short leg first
// (L4x6x1/2) connects the short leg of the catalog's L6x4x1/2.
func lookupAngle(size string, sys units.System) (section.Angle, string, error) {
	a, err := section.Lookup(size, sys)
	if err == nil {
		return a, a.Name, nil
	}
	var ua *section.UnknownAngleError
	if !errors.As(err, &ua) {
		return a, "", err
	}
	s := strings.ReplaceAll(strings.TrimSpace(size), "×", "x")
	parts := strings.FieldsFunc(s[min(1, len(s)):], func(r rune) bool { return r == 'x' || r == 'X' })
	if len(parts) == 3 {
		if b, err2 := section.Lookup("L"+parts[1]+"x"+parts[0]+"x"+parts[2], sys); err2 == nil {
			return b.Swapped(), swapName(b.Name), nil
		}
	}
	return a, "", err
}

// swapName exchanges the legs of a designation: L6x4x1/2 → L4x6x1/2.
func swapName(name string) string {
	p := strings.Split(strings.TrimPrefix(name, "L"), "x")
	if len(p) != 3 {
		return name
	}
	return "L" + p[1] + "x" + p[0] + "x" + p[2]
}

// buildMember resolves the member section and steel into d.Conn.Member
// and d.Info.
func (j job) buildMember(ed *rules.Edition, d *Design) error {
	m := j.Member
	mem := &d.Conn.Member
	info := &d.Info
	mem.Shape = m.Shape
	mem.Pieces = m.Shape.Pieces()
	mem.Eccentricity = m.Eccentricity
	info.Length = m.Length
	info.PositionTol = j.positionTolerance()

	switch low, _ := m.Shape.FreeEdges(); {
	case jobfile.RolledFamily(m.Shape) != "":
		if err := j.buildRolled(mem, info); err != nil {
			return err
		}
	case low: // a bar, given by width and thickness
		j.buildFlat(mem, info)
	default:
		if err := j.buildAngle(mem, info); err != nil {
			return err
		}
	}

	st, err := j.steel(ed, m.Steel, "member")
	if err != nil {
		return err
	}
	mem.Fy, mem.Fu = st.Fy, st.Fu
	info.Grade = st.Name
	info.Weathering = st.Weathering
	return nil
}

// buildMemberB resolves a splice's member_b (its own section) into
// d.Conn.MemberB and d.InfoB, as buildMember does the member's; nothing
// without member_b.
func (j job) buildMemberB(ed *rules.Edition, d *Design) error {
	v := j.MemberBView()
	if v == nil {
		return nil
	}
	b := &Design{Job: v}
	if err := (job{v}).buildMember(ed, b); err != nil {
		return err
	}
	a, mb := &d.Conn.Member, b.Conn.Member
	if pl := j.Plate; pl != nil && pl.Count == 2 && math.Abs(float64(mb.T-a.T)) > eps {
		field := "member.size"
		if v.Given("member.thickness") {
			field = "member.thickness"
		}
		return v.FieldError(field, fmt.Sprintf("member B's connected part is %s thick and the member's %s: between two splice plates the thinner needs fillers, which are not modelled",
			units.FormatJob(mb.T, j.Units), units.FormatJob(a.T, j.Units)),
			"splice members of one thickness between two plates, or use one splice plate (plate.count: 1)")
	}
	d.Conn.MemberB, d.InfoB = &mb, &b.Info
	return nil
}

// buildFlat sets the section of a flat bar from its width and thickness.
func (j job) buildFlat(mem *engine.Member, info *detailing.MemberInfo) {
	m := j.Member
	mem.Width, mem.T = m.Width, m.Thickness
	mem.Ag = m.Width.Mul(m.Thickness)
	mem.Strut = j.flatStrut(m.Width, m.Thickness)
	info.Designation = "PL " + compact(m.Width, j.Units) + "x" + compact(m.Thickness, j.Units)
	info.Rmin = units.Length(float64(min(m.Width, m.Thickness)) / math.Sqrt(12))
}

// buildRolled sets the section of a rolled shape from the catalog
// (section.LookupIn its engine.CatalogFamily) by its entry in
// rolledSections.
func (j job) buildRolled(mem *engine.Member, info *detailing.MemberInfo) error {
	m := j.Member
	fam, _ := engine.CatalogFamily(m.Shape)
	sh, err := section.LookupIn(fam, m.Size)
	if err != nil {
		hint := ""
		var us *section.UnknownShapeError
		if errors.As(err, &us) {
			hint = us.Hint()
		}
		return j.FieldError("member.size", fmt.Sprintf("no %s shape %q in the catalog", fam, m.Size), hint)
	}
	props := sh.Properties()
	info.Designation = sh.Name
	if j.Units == units.SI {
		info.Designation = sh.Metric
	}
	info.Rmin = min(props.Rx, props.Ry)
	mem.Ag = props.Area
	place, ok := rolledSections[m.Shape]
	if !ok {
		panic("detail: no rolledSections entry for shape " + m.Shape.String())
	}
	place(j, sh, props, mem, info)
	mem.Strut = j.rolledStrut(sh, props)
	return nil
}

// buildAngle sets the section of a single or double angle, from the
// catalog or from legs and thickness, with the job's overrides of one
// angle's properties.
func (j job) buildAngle(mem *engine.Member, info *detailing.MemberInfo) error {
	m := j.Member
	a, err := j.angle(mem, info)
	if err != nil {
		return err
	}
	if err := j.checkOverrides(a, info.Designation); err != nil {
		return err
	}
	props := a.Properties()
	mem.Width, mem.Outstanding, mem.T = a.A, a.B, a.T
	area := props.Area
	if m.Area > 0 {
		area = m.Area
	}
	mem.Xbar = props.Xbar
	if m.Xbar > 0 {
		mem.Xbar = m.Xbar
	}
	info.Rmin = props.Rmin
	if mem.Pieces == 2 {
		info.Designation = "2" + info.Designation
		info.Rmin = a.Double(j.gap()).Rmin
	}
	// An rmin override is of one angle: for a pair it is a lower bound
	// on the pair's least r, so using it is conservative.
	if m.Rmin > 0 {
		info.Rmin = m.Rmin
	}
	mem.Ag = area * units.Area(mem.Pieces)
	mem.Strut = j.angleStrut(a, props, mem.Pieces)
	return nil
}

// angle returns one angle of the member, looked up by member.size or made
// from member.legs and thickness, and sets its designation and k.
func (j job) angle(mem *engine.Member, info *detailing.MemberInfo) (section.Angle, error) {
	m := j.Member
	if m.Size == "" {
		a, err := section.Custom(m.Legs[0], m.Legs[1], m.Thickness)
		if err != nil {
			return a, j.FieldError("member.legs", strings.TrimPrefix(err.Error(), "section: "), "")
		}
		info.Designation = "L" + compact(m.Legs[0], j.Units) + "x" + compact(m.Legs[1], j.Units) + "x" + compact(m.Thickness, j.Units)
		info.K = a.T
		return a, nil
	}
	size := strings.TrimSpace(m.Size)
	if mem.Pieces == 2 {
		size = strings.TrimPrefix(size, "2")
	}
	a, designation, err := lookupAngle(size, j.Units)
	info.Designation = designation
	if err != nil {
		hint := "sizes are catalog designations such as L4x4x1/2 (us) or L100x100x10 (si); or give legs and thickness"
		var ua *section.UnknownAngleError
		msg := err.Error()
		if errors.As(err, &ua) {
			msg = fmt.Sprintf("no angle %q in the %s catalog", m.Size, j.Units)
			if h := ua.Hint(); h != "" {
				hint = h
			}
		} else {
			msg = strings.TrimPrefix(msg, "section: ")
		}
		return a, j.FieldError("member.size", msg, hint)
	}
	info.K = a.K
	return a, nil
}

// checkOverrides refuses a section override (member.area, xbar, rmin, all
// of one angle) that no angle of a's legs and thickness can have, whatever
// its radii (section.Bounds): a typo, the wrong unit or the pair's value.
// An area below the angle's own is allowed down to half of it.
func (j job) checkOverrides(a section.Angle, name string) error {
	m, b := j.Member, a.Bounds()
	// three significant figures, whole numbers from 100 on
	num := func(v float64, d units.Dim) string {
		v = j.Units.ToJob(v, d)
		s := strconv.FormatFloat(v, 'g', 3, 64)
		if math.Abs(v) >= 100 {
			s = strconv.FormatFloat(math.Round(v), 'f', 0, 64)
		}
		return s + " " + j.Units.Label(d)
	}
	length := func(l units.Length) string { return num(float64(l), units.DimLength) }
	area := func(x units.Area) string { return num(float64(x), units.DimArea) }
	outside := func(v, lo, hi float64) bool { return v > 0 && (v < lo || v > hi) }
	t, leg := a.T, min(a.A, a.B)
	plain := a.A.Mul(t) + (a.B - t).Mul(t) // the two rectangles
	switch {
	case m.Area > b.AreaMax:
		return j.FieldError("member.area", fmt.Sprintf("%s is more than one %s can have: its legs make %s, and with the largest root fillet it is at most %s",
			j.Raw["member.area"], name, area(plain), area(b.AreaMax)),
			"the area is of one angle, also in a pair; leave it out to have it computed")
	case m.Area > 0 && m.Area < plain/2:
		// Less than the angle's own area is a section loss the engineer
		// may model (an existing, corroded member); under half the legs'
		// area it is taken for the wrong unit.
		return j.FieldError("member.area", fmt.Sprintf("%s is under half the area of one %s: its legs make %s",
			j.Raw["member.area"], name, area(plain)),
			"the area is of one angle, also in a pair; check the unit, or leave it out to have it computed")
	case outside(float64(m.Xbar), float64(b.XbarMin), float64(b.XbarMax)):
		return j.FieldError("member.xbar", fmt.Sprintf("%s is not the x̄ of an %s: it lies between %s (half the thickness) and %s (half the outstanding leg)",
			j.Raw["member.xbar"], name, length(t/2), length(a.B/2)),
			"x̄ is of one angle, from the back of the connected leg to the centroid; leave it out to have it computed")
	case outside(float64(m.Rmin), float64(b.RminMin), float64(b.RminMax)):
		return j.FieldError("member.rmin", fmt.Sprintf("%s is not the least radius of gyration of an %s: it lies between %s (t/√12) and %s (half the shorter leg)",
			j.Raw["member.rmin"], name, length(units.Length(float64(t)/math.Sqrt(12))), length(leg/2)),
			"rmin is of one angle (rz), also in a pair; leave it out to have it computed")
	}
	return nil
}

// positionTolerance is the job's tolerance.position, or where a job was
// not read from a file the common-practice default, ±1/16 in (2 mm)
// (common practice, no source; REFERENCE.md, fabrication).
func (j job) positionTolerance() units.Length {
	switch {
	case j.Tolerance.Position > 0:
		return j.Tolerance.Position
	case j.Units == units.SI:
		return 2 * units.Millimetre
	}
	return units.Inch / 16
}

// gap is the space between double angles: as given, else the plate's
// thickness, else 3/8 in (10 mm) (common practice, no source).
func (j job) gap() units.Length {
	switch {
	case j.Member.Gap > 0:
		return j.Member.Gap
	case j.Plate != nil && j.Plate.Thickness > 0:
		return j.Plate.Thickness
	case j.Units == units.SI:
		return 10 * units.Millimetre
	}
	return units.Inch * 3 / 8
}

func (j job) buildBolt(ed *rules.Edition, c *engine.Connection) error {
	b := j.Bolts
	if b.Diameter == 0 {
		return j.FieldError("bolts.diameter", "is required", `diameter: 3/4 in (us) or M20 (si)`)
	}
	if b.Grade == "" {
		return j.FieldError("bolts.grade", "is required", "known grades: "+strings.Join(ed.BoltGrades(), ", "))
	}
	g, err := ed.Bolt(b.Grade)
	if err != nil {
		return j.FieldError("bolts.grade", fmt.Sprintf("unknown bolt grade %q in %s", b.Grade, ed), "known grades: "+strings.Join(ed.BoltGrades(), ", "))
	}
	if b.Joint != rules.Bearing {
		// pretensioned and slip-critical joints need a tabulated pretension
		if _, err := ed.Pretension(g, b.Diameter); err != nil {
			return j.FieldError("bolts.grade", fmt.Sprintf("%s bolts cannot be used in a %s joint: %v", g.Name, b.Joint, err),
				"use a high-strength grade (Group A or B) or a bearing joint")
		}
	}
	c.Bolt = engine.Bolt{
		D: b.Diameter, Grade: g, Threads: b.Threads, Joint: b.Joint, Surface: b.Surface,
		Fillers: b.Fillers, FillerT: b.FillerThickness, FillerDeveloped: b.FillerDeveloped,
		DeformationConsidered: b.DeformationConsidered,
	}
	return nil
}

// holeExtent returns a hole's extents along x and y for its type and slot.
func holeExtent(hs rules.HoleSize, t rules.HoleType, dir rules.SlotDir) (dx, dy units.Length) {
	switch {
	case !t.IsSlot():
		return hs.Width, hs.Width
	case dir == rules.Longitudinal:
		return hs.Length, hs.Width
	}
	return hs.Width, hs.Length
}

// plyShape is the nominal hole of type t and slot direction dir for a bolt
// of diameter d (Table J3.3 [J3.3M]).
func plyShape(ed *rules.Edition, d units.Length, t rules.HoleType, dir rules.SlotDir) (engine.HoleShape, error) {
	size, err := ed.Hole(d, t)
	if err != nil {
		return engine.HoleShape{}, err
	}
	if !t.IsSlot() {
		dir = rules.Transverse
	}
	dx, dy := holeExtent(size, t, dir)
	return engine.HoleShape{Type: t, Slot: dir, Dx: dx, Dy: dy}, nil
}

// plyShapes returns the member's and the plate's hole shape for bolt
// diameter d; the plate's is nil when it is the member's (or there is no
// plate).
func (j job) plyShapes(ed *rules.Edition, d units.Length) (engine.HoleShape, *engine.HoleShape, error) {
	mt, mdir := j.MemberHole()
	ms, err := plyShape(ed, d, mt, mdir)
	if err != nil || j.Plate == nil {
		return ms, nil, err
	}
	pt, pdir := j.PlateHole()
	ps, err := plyShape(ed, d, pt, pdir)
	if err != nil || ps == ms {
		return ms, nil, err
	}
	return ms, &ps, nil
}

// eps is the geometric tolerance of the fit checks, in mm.
const eps = 1e-6

func (j job) buildHoles(ed *rules.Edition, d *Design) error {
	b := j.Bolts
	shape, plate, err := j.plyShapes(ed, b.Diameter)
	if err != nil {
		return DiameterError(j.Job, ed, err)
	}
	dx, dy := shape.Dx, shape.Dy
	m := &d.Conn.Member
	w := m.Width
	room, part := m.ClearWidth(), "flat"
	switch {
	case len(m.Junctions) > 0:
		part = "section's " + strings.TrimSuffix(m.ConnectedElement(), "s") + " between its junctions"
	case m.Heel():
		part = "leg"
	}
	if dy > room+eps {
		clear := " clear of the thickness"
		if part == "flat" {
			clear = " wide"
		}
		return j.FieldError("bolts.diameter", fmt.Sprintf("the hole of a %s bolt (%s across) does not fit the %s (%s%s)",
			boltName(b.Diameter, j.Units), units.FormatJob(dy, j.Units), part, units.FormatJob(room, j.Units), clear),
			"use a smaller bolt or a wider "+part)
	}

	var holes []engine.Hole
	// fields name the input that put hole i there, along x and y.
	var fields func(i int) (x, y string)
	if j.Holes != nil {
		holes = make([]engine.Hole, len(j.Holes))
		for i, h := range j.Holes {
			holes[i].X, holes[i].Y = h.X, h.Y
		}
		fields = func(i int) (string, string) {
			f := fmt.Sprintf("holes[%d]", i)
			return f, f
		}
	} else {
		if err := j.checkPattern(); err != nil {
			return err
		}
		pat := j.pattern()
		holes = pat.Centres(make([]engine.Hole, 0, pat.Lines*pat.PerLine))
		fields = func(i int) (string, string) {
			x, y := "bolts.end", "bolts.gage"
			if i%pat.PerLine > 0 {
				x = "bolts.pitch" // the pitch put it there
			}
			if i/pat.PerLine > 0 {
				y = "bolts.gage2"
			}
			return x, y
		}
	}

	f := d.PlaceHoles(holes, shape, plate)
	if f.how == fitOK {
		return nil
	}
	h := &d.Conn.Holes[f.hole]
	xField, yField := fields(f.hole)
	switch f.how {
	case fitPastEnd:
		return j.FieldError(xField, fmt.Sprintf("hole %s at x = %s runs past the member end", h.ID, units.FormatJob(h.X, j.Units)),
			"the hole's edge must be inside the member: x ≥ "+units.FormatJob(dx/2, j.Units))
	case fitOffLow:
		return j.FieldError(yField, fmt.Sprintf("hole %s at y = %s runs off the %s", h.ID, units.FormatJob(h.Y, j.Units), part),
			"y is measured from the heel (angles) or one edge (flats)")
	case fitOffHigh:
		return j.FieldError(yField, fmt.Sprintf("hole %s at y = %s runs off the %s, which is %s wide",
			h.ID, units.FormatJob(h.Y, j.Units), part, units.FormatJob(w, j.Units)),
			"y is measured from the heel (angles) or one edge (flats)")
	case fitOffB:
		return j.FieldError(yField, fmt.Sprintf("hole %s at y = %s runs off member B's %s, which is %s wide",
			h.ID, units.FormatJob(h.Y, j.Units), part, units.FormatJob(d.Conn.MemberB.Width, j.Units)),
			"member B takes the member's bolt group, mirrored about the joint: its connected part must hold it")
	}
	return j.FieldError(xField, fmt.Sprintf("hole %s has the same centre as %s", h.ID, d.Conn.Holes[f.other].ID), "")
}

// checkPattern refuses a bolts block that does not lay out a pattern.
func (j job) checkPattern() error {
	b := j.Bolts
	switch {
	case b.PerLine == 0:
		return j.FieldError("bolts.per_line", "is required", "per_line: the number of bolts in each gage line")
	case b.PerLine > 1 && b.Pitch == 0:
		return j.FieldError("bolts.pitch", "is required with more than one bolt per line", "pitch: 3 in")
	case b.End == 0:
		return j.FieldError("bolts.end", "is required", "end: the first bolt to the member's end, e.g. 1-1/2 in")
	case b.Gage == 0:
		return j.FieldError("bolts.gage", "is required", "gage: the first gage line from the heel or edge, e.g. 2-1/2 in")
	case b.Lines > 1 && b.Gage2 == 0:
		return j.FieldError("bolts.gage2", "is required with more than one gage line", "gage2: spacing between gage lines")
	case b.Lines*b.PerLine > jobfile.MaxHoles:
		return j.FieldError("bolts.per_line", fmt.Sprintf("%d lines of %d make too many bolts (at most %d)", b.Lines, b.PerLine, jobfile.MaxHoles), "")
	}
	return nil
}

// Pattern is a bolt pattern: Lines of PerLine bolts, the first at End
// from the member's end on the gage line at Gage, the next lines Gage2
// apart, every other line moved Stagger along x.
type Pattern struct {
	Lines, PerLine                   int
	Pitch, End, Gage, Gage2, Stagger units.Length
}

// pattern is the bolts block's pattern.
func (j job) pattern() Pattern {
	b := j.Bolts
	return Pattern{Lines: b.Lines, PerLine: b.PerLine, Pitch: b.Pitch, End: b.End, Gage: b.Gage, Gage2: b.Gage2, Stagger: b.Stagger}
}

// Centres appends the pattern's hole centres to holes, line by line.
func (pat Pattern) Centres(holes []engine.Hole) []engine.Hole {
	for i := range pat.Lines {
		y := pat.Gage + units.Length(i)*pat.Gage2
		for k := range pat.PerLine {
			x := pat.End + units.Length(k)*pat.Pitch
			if i%2 == 1 {
				x += pat.Stagger
			}
			holes = append(holes, engine.Hole{X: x, Y: y})
		}
	}
	return holes
}

// fitHow is how a hole fails to fit its part.
type fitHow int

const (
	fitOK      fitHow = iota
	fitPastEnd        // past the member's end
	fitOffLow         // off the leg or flat at y = 0
	fitOffHigh        // off the leg or flat at its width
	fitOffB           // off a splice's member B (its own section) at its width
	fitSame           // at the centre of an earlier hole
)

// HoleFit is the first hole that does not fit, and the earlier hole it
// coincides with (fitSame).
type HoleFit struct {
	how         fitHow
	hole, other int
}

// OK reports whether every hole fits.
func (f HoleFit) OK() bool { return f.how == fitOK }

// PlaceHoles makes holes, of which the centres are set, the model's holes:
// ids H1, H2, …, the member's hole shape and, where the plate's differs,
// each hole its own copy of that (as-built copies may change one). It
// returns the first hole that runs off the member or has the centre of an
// earlier hole, hole by hole in that order.
func (d *Design) PlaceHoles(holes []engine.Hole, shape engine.HoleShape, plate *engine.HoleShape) HoleFit {
	var plates []engine.HoleShape
	if plate != nil {
		plates = make([]engine.HoleShape, len(holes))
	}
	w := d.Conn.Member.Width
	dx, dy := shape.Dx, shape.Dy
	for i := range holes {
		h := &holes[i]
		h.ID = holeID(i)
		h.HoleShape = shape
		if plate != nil {
			plates[i] = *plate
			h.Plate = &plates[i]
		}
	}
	d.Conn.Holes = holes
	for i := range holes {
		h := &holes[i]
		switch {
		case h.X-dx/2 < -eps:
			return HoleFit{how: fitPastEnd, hole: i}
		case h.Y-dy/2 < -eps:
			return HoleFit{how: fitOffLow, hole: i}
		case h.Y+dy/2 > w+eps:
			return HoleFit{how: fitOffHigh, hole: i}
		case d.Conn.MemberB != nil && h.Y+dy/2 > d.Conn.MemberB.Width+eps:
			return HoleFit{how: fitOffB, hole: i}
		}
		for k := range i {
			o := &holes[k]
			if math.Abs(float64(o.X-h.X)) < eps && math.Abs(float64(o.Y-h.Y)) < eps {
				return HoleFit{how: fitSame, hole: i, other: k}
			}
		}
	}
	return HoleFit{}
}

var holeIDs = func() []string {
	ids := make([]string, jobfile.MaxHoles)
	for i := range ids {
		ids[i] = fmt.Sprintf("H%d", i+1)
	}
	return ids
}()

// holeID is the id of the i-th hole: H1, H2, …
func holeID(i int) string {
	if i < len(holeIDs) {
		return holeIDs[i]
	}
	return fmt.Sprintf("H%d", i+1)
}

func (j job) buildPlate(ed *rules.Edition, d *Design) error {
	ps := j.Plate
	if ps == nil {
		return nil
	}
	if ps.AutoThickness {
		return j.FieldError("plate.thickness", "auto is for propose", "give the plate thickness to check, or run gaugeline propose")
	}
	if ps.Edge == 0 && ps.Outline == nil {
		return j.FieldError("plate.edge", "is required", "edge: the last bolt to the plate's free edge, e.g. 1-1/2 in")
	}
	if err := j.plateParts(ed, d); err != nil {
		return err
	}
	i := d.PlacePlate(ps.Edge)
	if i < 0 {
		return nil
	}
	h := &d.Conn.Holes[i]
	switch pl := d.Conn.Plate; {
	case ps.Outline != nil:
		return j.FieldError("plate.outline", fmt.Sprintf("hole %s at (%s, %s) runs off the plate: it is not inside the outline", h.ID,
			units.FormatJob(h.X, j.Units), units.FormatJob(h.Y, j.Units)),
			"the outline's points are in the member's frame (x from the member end, y from the heel or edge), as the holes are")
	case h.Y-h.InPlate().Dy/2 >= pl.YMin()-eps && h.Y+h.InPlate().Dy/2 <= pl.YMax()+eps:
		return j.FieldError("plate.length", fmt.Sprintf("hole %s runs off the plate's back edge: the plate is %s long from its free edge", h.ID, units.FormatJob(ps.Length, j.Units)),
			"the plate must run back past the bolt group plus the hole")
	}
	return j.FieldError("plate.width", fmt.Sprintf("hole %s runs off the plate: the plate is %s wide", h.ID, units.FormatJob(ps.Width, j.Units)),
		"the plate must be wider than the bolt group plus the hole")
}

// plateParts puts the job's plate into the model, all but where it lies
// (placePlate): its kind, thickness, width and steel.
func (j job) plateParts(ed *rules.Edition, d *Design) error {
	ps := j.Plate
	st, err := j.steel(ed, ps.Steel, "plate")
	if err != nil {
		return err
	}
	d.Conn.Plate = &engine.Plate{Kind: ps.Kind, T: ps.Thickness, Width: ps.Width, Fy: st.Fy, Fu: st.Fu, Count: ps.Count, Gap: ps.Gap,
		Buckling: engine.PlateBuckling{K: ps.Buckling.K, Centre: ps.Buckling.Centre}}
	if ps.Buckling.K == 0 {
		d.Conn.Plate.Buckling.K = engine.DefaultGussetK
		if ps.Kind == engine.Splice {
			d.Conn.Plate.Buckling.K = engine.DefaultSpliceK
		}
	}
	d.Info.PlateGrade = st.Name
	d.Info.Weathering = d.Info.Weathering || st.Weathering
	return nil
}

// PlacePlate gives the model its own copy of the plate, with the free
// edge the distance edge past the last hole and the centre line on the
// bolt group's; it returns the first hole that runs off the plate's
// width, or -1. A job's plate.outline is the plate instead (placeOutline),
// and its plate.length closes the rectangle behind the holes.
func (d *Design) PlacePlate(edge units.Length) int {
	c := &d.Conn
	pl := *c.Plate
	if d.Job != nil && d.Job.Plate != nil && d.Job.Plate.Outline != nil {
		ps := d.Job.Plate
		return d.placeOutline(&pl, ps.Outline)
	}
	var xmax, ysum units.Length
	for i, h := range c.Holes {
		if i == 0 || h.X > xmax {
			xmax = h.X
		}
		ysum += h.Y
	}
	pl.FreeEdge = xmax + edge
	pl.YCentre = ysum / units.Length(len(c.Holes))
	c.Plate = &pl
	length := units.Length(0)
	if d.Job != nil && d.Job.Plate != nil {
		length = d.Job.Plate.Length
	}
	if length > 0 {
		back, lo, hi := float64(pl.FreeEdge-length), float64(pl.YMin()), float64(pl.YMax())
		fe := float64(pl.FreeEdge)
		pl.Outline = []r2.Vec{{X: back, Y: lo}, {X: fe, Y: lo}, {X: fe, Y: hi}, {X: back, Y: hi}}
	}
	for i, h := range c.Holes {
		if dy := h.InPlate().Dy; h.Y-dy/2 < pl.YMin()-eps || h.Y+dy/2 > pl.YMax()+eps {
			return i
		}
		if length > 0 && h.X-h.InPlate().Dx/2 < pl.FreeEdge-length-eps {
			return i
		}
	}
	return -1
}

// placeOutline puts the job's outline into the plate: FreeEdge, YCentre
// and Width become its bounding box (the plate's frame on the sheet is
// the half turn about its corner at the greatest x and y). It returns the
// first hole not inside it (its centre outside, or an edge nearer than
// half the hole), or -1.
func (d *Design) placeOutline(pl *engine.Plate, outline []r2.Vec) int {
	c := &d.Conn
	pl.Outline = outline
	xmax, ylo, yhi := math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, q := range outline {
		xmax, ylo, yhi = max(xmax, q.X), min(ylo, q.Y), max(yhi, q.Y)
	}
	pl.FreeEdge = units.Length(xmax)
	pl.YCentre, pl.Width = units.Length((ylo+yhi)/2), units.Length(yhi-ylo)
	c.Plate = pl
	edges := pl.Edges()
	for i, h := range c.Holes {
		if !pl.Inside(h.X, h.Y) {
			return i
		}
		hs := h.InPlate()
		for _, e := range edges {
			if e.DistanceTo(h.X, h.Y) < max(hs.Dx, hs.Dy)/2-eps {
				return i
			}
		}
	}
	return -1
}

// WithHoles is the design with other holes in place of its own (the
// measured ones, each set in full): the parts, the plate's free edge and
// centre line as designed.
func (d *Design) WithHoles(holes []engine.Hole) *Design {
	out := *d
	out.Conn.Holes = holes
	if d.Conn.Plate != nil {
		pl := *d.Conn.Plate
		out.Conn.Plate = &pl
	}
	return &out
}
