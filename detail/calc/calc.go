// Package calc writes the calculation report of one checked connection:
// a single self-contained HTML page (inline CSS and SVG, no script, no
// font or image fetched) that a reviewer reads and an engineer of record
// signs. It shows the job, the layout drawn from the cut-sheet model
// (sheet.Sheet, the one the DXF is drawn from), every limit state with
// its formula, the values put into it, the result and the clause, the
// detailing findings, the verdict and the caution.
//
// Units: every value is printed in the job's units (in, kip, ksi, in² or
// mm, kN, MPa, mm²), converted from the engine's internal units only
// here. Values are rounded for reading; the check itself runs at full
// precision, so a product written out may differ from the printed result
// in its last digit.
//
// The page is a pure function of the report: the same job gives the same
// bytes (no time, no path, no map order).
package calc

import (
	"bytes"
	"fmt"
	"html/template"
	"math"
	"path/filepath"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/bom"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/sheet"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// HTML returns the calculation report of r as one HTML page. A failing
// connection gets its report too; its drawing is stamped not for
// fabrication, as its cut sheet would be.
func HTML(r *detail.Report) ([]byte, error) {
	if r == nil || r.Design == nil || len(r.Results) == 0 {
		panic("calc: a report needs a checked design")
	}
	s, err := sheet.NewDrawing(r, !r.Pass)
	if err != nil {
		return nil, fmt.Errorf("calc: %w", err)
	}
	p := newPage(r, s)
	var b bytes.Buffer
	if err := pageTemplate.Execute(&b, p); err != nil {
		return nil, fmt.Errorf("calc: %w", err)
	}
	return b.Bytes(), nil
}

// fmtr prints internal values in the job's units.
type fmtr struct{ sys units.System }

// unitLabel is the printed unit of a dimension, with superscripts.
func (f fmtr) unitLabel(d units.Dim) string {
	return strings.NewReplacer("2", "²", "3", "³").Replace(f.sys.Label(d))
}

// num prints a value of dimension d in the job's units, without a unit.
func (f fmtr) num(v float64, d units.Dim) string {
	return units.Format(v, d, f.sys, units.Report.Bare())
}

// q prints a value with its unit.
func (f fmtr) q(v float64, d units.Dim) string {
	return units.Format(v, d, f.sys, units.Report.Typeset())
}

func (f fmtr) force(x units.Force) string   { return f.q(float64(x), units.DimForce) }
func (f fmtr) length(x units.Length) string { return f.q(float64(x), units.DimLength) }

// people prints a measured or limiting value the way the shop reads it:
// lengths as the check prints them (units.People: US in feet, inches and
// sixteenths, the exact value after them where they round it).
func (f fmtr) people(v float64, d units.Dim) string {
	if d == units.Dimensionless && v == 0 {
		return "–"
	}
	return units.Format(v, d, f.sys, units.People.Typeset())
}

func ratioText(r float64) string {
	if r > 99.99 || math.IsNaN(r) {
		return ">99.99"
	}
	return fmt.Sprintf("%.3f", r)
}

// Page model: plain strings for the template, which escapes them.

type row struct{ Label, Value string }

type table struct {
	Head []string
	Rows []tableRow
}

type tableRow struct {
	Cells []string
	Class string // "fail", "note" or ""
}

type limitSection struct {
	Num, Anchor    string
	ID, Clause     string
	Title, Note    string
	Formula, Steps []string
	Where          string // what the symbols of the formula mean
	Result         []row
	Values         table
	PerBolt        *table
	PerBoltTitle   string
	Pass, Governs  bool
	Ratio          string
	End            string // "far" for the far end's sections; "" for the near end
}

type summaryRow struct {
	Anchor, ID, Clause, Title  string
	Nominal, Available, Demand string
	Ratio, Bar                 string
	Pass, Governs              bool
}

type page struct {
	Mark, Subtitle, File string
	// Running is the printed page's running header: the mark, the
	// drawing and revision where the job's project block gives them.
	Running            string
	Stamp              string // Job.Stamp, in a <meta> element; "" for none
	Pass               bool
	Verdict, Governing string
	Failures           []string
	Caution            string
	Assumptions        []string
	Job, Load          []row
	// Combos is every load combination worked for the service loads (none
	// when the job gives the required strengths).
	Combos          table
	Holes           table
	Schedule        table
	BOM, Bolts      table    // bill of material and bolt list (with member.length)
	BoltNotes       []string // the bolt list's washer and faying notes, and where its lengths come from
	Drawing         template.HTML
	DrawingNote     string
	Summary         []summaryRow
	ForceUnit       string
	Limits          []limitSection
	Findings        table
	DemandSymbol    string
	AvailableSymbol string
	// Far is the far end's part of the report where it has a connection of
	// its own (member.far_end with plate and bolts); nil else, and the
	// page reads as before.
	Far *endPart
}

// endPart is one end's own sections: its plate and bolts, its holes in
// its own frame (x from its cut end), its limit states and rules.
type endPart struct {
	Governs  bool // this end governs the member
	Job      []row
	Holes    table
	Summary  []summaryRow
	Limits   []limitSection
	Findings table
}

// running is the printed report's running header: "BR-12 · drawing S-501
// · revision B · calculation report".
func running(j *jobfile.Job) string {
	parts := []string{j.Mark}
	if pr := j.Project; pr.Drawing != "" {
		parts = append(parts, "drawing "+pr.Drawing)
	}
	if pr := j.Project; pr.Revision != "" {
		parts = append(parts, "revision "+pr.Revision)
	}
	return strings.Join(append(parts, "calculation report"), " · ")
}

func newPage(r *detail.Report, s *sheet.Sheet) page {
	d := r.Design
	c := &d.Conn
	f := fmtr{d.Job.Units}
	p := page{
		Mark:            d.Job.Mark,
		Running:         running(d.Job),
		Subtitle:        fmt.Sprintf("Bolted tension connection · AISC %s · %s · %s units", strings.TrimPrefix(c.Edition.Name(), "aisc"), strings.ToUpper(c.Method.String()), strings.ToUpper(d.Job.Units.String())),
		File:            filepath.Base(d.Job.File),
		Stamp:           d.Job.Stamp,
		Pass:            r.Pass,
		Caution:         detail.Caution,
		ForceUnit:       f.unitLabel(units.DimForce),
		DemandSymbol:    "Ru",
		AvailableSymbol: "φRn",
	}
	if c.Method != rules.LRFD {
		p.DemandSymbol, p.AvailableSymbol = "Ra", "Rn/Ω"
	}
	p.verdict(r, f)
	p.assumptions(r)
	p.Job, p.Load = jobRows(d, f)
	p.Combos = comboTable(d, f)
	p.Holes = holeTable(c, f)
	p.cutSheet(r, s)
	p.billOfMaterial(r)
	p.Limits, p.Summary = limits(r, f, "5.", "")
	p.Findings = findings(r, f)
	if r.Far != nil {
		p.Far = farPart(r, f)
		for i := range p.Job { // the rows above are the near end's
			if l := p.Job[i].Label; l == "Plate" || l == "Bolts" {
				p.Job[i].Label = l + ", near end"
			}
		}
	}
	return p
}

// farPart is the far end's sections, numbered 6 and anchored "far-".
func farPart(r *detail.Report, f fmtr) *endPart {
	far := r.Far
	e := &endPart{Governs: r.GoverningEnd() == far, Holes: holeTable(&far.Design.Conn, f), Findings: findings(far, f)}
	summary := map[string]string{}
	for _, rw := range far.Design.Summary() {
		summary[rw[0]] = rw[1]
	}
	e.Job = []row{{"Plate", summary["plate"]}, {"Bolts", summary["bolts"]}}
	if far.Design.Conn.Plate == nil {
		e.Job[0].Value = "none: the member's far end alone is checked"
	}
	e.Limits, e.Summary = limits(far, f, "6.", "far-")
	for i := range e.Limits {
		e.Limits[i].End = "far"
	}
	return e
}

// verdict sets the verdict, the governing limit state and every failing
// limit state and detailing rule; with a far end of its own, the
// governing end's limit state and both ends' failures, the far end's
// marked so.
func (p *page) verdict(r *detail.Report, f fmtr) {
	g, where := r.GoverningEnd().GoverningResult(), ""
	p.Verdict = "PASSES"
	if !r.Pass {
		p.Verdict = "FAILS"
	}
	if r.Far != nil {
		where = " at the " + r.GoverningEndName() + " end"
	}
	p.Governing = fmt.Sprintf("Governing limit state%s: %s (%s), %s / %s = %s / %s = %s",
		where, g.ID, g.Clause, p.DemandSymbol, p.AvailableSymbol, f.force(g.Demand), f.force(g.Available), ratioText(g.Ratio))
	p.Failures = failures(r, f, "")
	if r.Far != nil {
		p.Failures = append(p.Failures, failures(r.Far, f, "far end: ")...)
	}
}

// failures lists one end's failing limit states and detailing rules, each
// line after prefix.
func failures(r *detail.Report, f fmtr, prefix string) []string {
	var out []string
	for _, x := range r.Results {
		if !x.Pass {
			out = append(out, fmt.Sprintf("%s%s (%s): ratio %s", prefix, x.ID, x.Clause, ratioText(x.Ratio)))
		}
	}
	for _, fd := range r.Findings {
		if !fd.Pass && !fd.Advisory {
			line := fmt.Sprintf("%s%s (%s): %s", prefix, fd.ID, fd.Clause, fd.Where)
			if fd.Dim != units.Dimensionless || fd.Measured != 0 || fd.Limit != 0 {
				line += fmt.Sprintf(", measured %s, limit %s", f.people(fd.Measured, fd.Dim), f.people(fd.Limit, fd.Dim))
			}
			out = append(out, line)
		}
	}
	return out
}

// assumptions lists the report's cautions after the first (the page
// prints that one on its own), then how values are printed and judged.
func (p *page) assumptions(r *detail.Report) {
	for i, cv := range r.Cautions {
		if i == 0 && cv == detail.Caution {
			continue
		}
		p.Assumptions = append(p.Assumptions, cv)
	}
	p.Assumptions = append(p.Assumptions,
		"Values are printed rounded in the job's units; the check runs at full precision, so a product written out may differ from the printed result in its last digit.",
		fmt.Sprintf("The available strength is %s with the φ and Ω of AISC %s; a limit state passes when the ratio %s / %s does not exceed 1.0.",
			p.AvailableSymbol, strings.TrimPrefix(r.Design.Conn.Edition.Name(), "aisc"), p.DemandSymbol, p.AvailableSymbol))
}

// cutSheet sets the cut sheet's schedule, the drawing of its views and the
// note that says what the drawing shows.
func (p *page) cutSheet(r *detail.Report, s *sheet.Sheet) {
	d := r.Design
	c := &d.Conn
	if len(s.Schedule) > 0 {
		p.Schedule.Head = s.Schedule[0]
		for _, rw := range s.Schedule[1:] {
			p.Schedule.Rows = append(p.Schedule.Rows, tableRow{Cells: rw})
		}
	}
	unit := "inches"
	if d.Job.Units == units.SI {
		unit = "millimetres"
	}
	var wide bool
	p.Drawing, wide = drawing(s)
	views := "the member's connected leg from its end, then the plate from its free edge, each in its own frame"
	lines := "gage lines and the Whitmore section dash-dotted"
	if c.Plate == nil {
		views, lines = "the member's connected leg from its end", "gage lines dash-dotted"
	}
	switch {
	case len(c.Member.Junctions) > 0:
		views = strings.Replace(views, "member's connected leg", "member's "+strings.ToLower(sheet.ConnectedElement(&c.Member)), 1)
	case !c.Member.Heel():
		views = strings.Replace(views, "member's connected leg", "member", 1)
	}
	p.DrawingNote = fmt.Sprintf("Drawn from the cut-sheet model of %s.dxf: %s; dimensions in %s; %s. Not to scale on screen.", d.Job.Mark, views, unit, lines)
	if !r.Pass {
		p.DrawingNote += " The connection fails: the views are stamped " + sheet.Stamp + "."
	}
	if wide {
		p.DrawingNote += " The drawing is long: scroll it sideways on screen; it prints scaled to the page."
	}
}

// billOfMaterial sets the bill of material and the bolt list (the sheet's
// tables; none without member.length).
func (p *page) billOfMaterial(r *detail.Report) {
	ps := r.Pieces()
	if ps == nil {
		return
	}
	sys := r.Design.Job.Units
	shop := func(l units.Length) string { return units.FormatLength(l, sys, units.Shop) }
	wu := bom.WeightUnit(sys)
	p.BOM.Head = []string{"mark", "qty", "size", "grade", "cut length", "each " + wu, "total " + wu, "CAM file", "note"}
	for _, pc := range ps {
		p.BOM.Rows = append(p.BOM.Rows, tableRow{Cells: []string{pc.Mark, fmt.Sprint(pc.Quantity), pc.Size, pc.Grade, shop(pc.Length),
			bom.WeightText(pc.Weight), bom.WeightText(pc.TotalWeight()), pc.CAMFile(r.Design.Job.Mark), pc.Note}})
	}
	p.BOM.Rows = append(p.BOM.Rows, tableRow{Cells: []string{"total", "", "", "", "", "", bom.WeightText(bom.TotalWeight(ps)), "", ""}})
	p.Bolts.Head = []string{"bolt", "qty", "grip", "where", "holes", "washers"}
	for _, b := range r.BoltList() {
		p.Bolts.Rows = append(p.Bolts.Rows, tableRow{Cells: []string{b.BoltText(sys), fmt.Sprint(b.Quantity), shop(b.Grip), b.End, b.HolesText(), b.WashersText(sys)}})
		p.BoltNotes = append(p.BoltNotes, fmt.Sprintf("%s: washers: %s; faying surfaces: %s", b.End, b.WasherNote, b.Faying))
	}
	p.BoltNotes = append(p.BoltNotes, bom.BoltLengthSource, bom.WasherSource)
}

// limits is a section and a summary row for every limit state of one
// end, in the check's order, numbered after num and anchored after
// anchorPrefix.
func limits(r *detail.Report, f fmtr, num, anchorPrefix string) (ls []limitSection, summary []summaryRow) {
	c := &r.Design.Conn
	for i, x := range r.Results {
		l := limit(c, f, x)
		l.Num = fmt.Sprintf("%s%d", num, i+1)
		l.Anchor = anchorPrefix + anchor(x.ID)
		l.Governs = i == r.Governing
		ls = append(ls, l)
		summary = append(summary, summaryRow{
			Anchor: l.Anchor, ID: x.ID, Clause: x.Clause, Title: l.Title,
			Nominal: f.num(float64(x.Nominal), units.DimForce), Available: f.num(float64(x.Available), units.DimForce),
			Demand: f.num(float64(x.Demand), units.DimForce), Ratio: ratioText(x.Ratio),
			Bar:  fmt.Sprintf("%.1f", 100*math.Min(math.Max(x.Ratio, 0), 1)),
			Pass: x.Pass, Governs: i == r.Governing,
		})
	}
	return ls, summary
}

// findings is the table of every detailing finding of one end.
func findings(r *detail.Report, f fmtr) (t table) {
	t.Head = []string{"check", "clause", "measured", "limit", "result", "where"}
	for _, fd := range r.Findings {
		res, class := "ok", ""
		switch {
		case !fd.Pass && fd.Advisory:
			res, class = "note (advisory)", "note"
		case !fd.Pass:
			res, class = "FAILS", "fail"
		case fd.Advisory:
			res = "ok (advisory)"
		}
		t.Rows = append(t.Rows, tableRow{Class: class, Cells: []string{
			fd.ID, fd.Clause, f.people(fd.Measured, fd.Dim), f.people(fd.Limit, fd.Dim), res, fd.Where}})
	}
	return t
}

// anchor turns a limit state id into a fragment name.
func anchor(id string) string {
	return "ls-" + strings.Map(func(r rune) rune {
		if r >= 'a' && r <= 'z' || r >= '0' && r <= '9' || r == '-' {
			return r
		}
		return '-'
	}, strings.ToLower(id))
}

func jobRows(d *detail.Design, f fmtr) (job, load []row) {
	c := &d.Conn
	j := d.Job
	lb := j.Units.Labels()
	method := "LRFD: load and resistance factor design, available strength φRn"
	if c.Method == rules.ASD {
		method = "ASD: allowable strength design, available strength Rn/Ω"
	}
	sysName := "US customary"
	if j.Units == units.SI {
		sysName = "SI"
	}
	job = []row{
		{"Mark", j.Mark},
		{"Quantity", fmt.Sprintf("%d", j.Quantity)},
		{"Standard", fmt.Sprintf("AISC %s (%s)", strings.TrimPrefix(c.Edition.Name(), "aisc"), c.Edition.Name())},
		{"Method", method},
		{"Units", fmt.Sprintf("%s: %s, %s, %s, %s", sysName, lb.Length, lb.Force, lb.Stress, f.unitLabel(units.DimArea))},
	}
	summary := map[string]string{}
	for _, rw := range d.Summary() {
		summary[rw[0]] = rw[1]
	}
	job = append(job, row{"Member", summary["member"]})
	m := c.Member
	props := fmt.Sprintf("Ag = %s, t = %s", f.q(float64(m.Ag), units.DimArea), f.length(m.T))
	switch {
	case engine.Apart(m.Shape):
		props = fmt.Sprintf("Ag = %s (the whole section), t = %s of each %s", f.q(float64(m.Ag), units.DimArea), f.length(m.T), engine.PieceName(m.Shape))
	case m.Pieces > 1:
		props = fmt.Sprintf("Ag = %s (both %ss), t = %s each", f.q(float64(m.Ag), units.DimArea), engine.PieceName(m.Shape), f.length(m.T))
	}
	if m.Depth > 0 {
		props += ", bf = " + f.length(m.Width) + ", d = " + f.length(m.Depth) + " (case 7: of the W)"
	}
	if m.Shape.ShearLagCases().Has(engine.D31Case2) {
		props += ", x̄ = " + f.length(m.Xbar)
	}
	job = append(job, row{"Member properties", props})
	if c.Plate != nil {
		job = append(job, row{"Plate", summary["plate"]})
	} else {
		job = append(job, row{"Plate", "none: the member alone is checked"})
	}
	job = append(job, row{"Bolts", summary["bolts"]})

	sl := j.Load.Service
	if j.Load.Combined() {
		var parts []string
		for _, x := range []struct {
			name string
			v    units.Force
		}{{"D", sl.D}, {"L", sl.L}, {"Lr", sl.Lr}, {"S", sl.S}, {"R", sl.R}, {"W", sl.W}, {"E", sl.E}} {
			if x.v != 0 {
				parts = append(parts, x.name+" = "+f.force(x.v))
			}
		}
		load = append(load, row{"Service loads (tension)", strings.Join(parts, ", ")})
		load = append(load, row{"Governing combination", d.Combination})
	} else {
		load = append(load, row{"Required strength", "given in the job"})
	}
	sym := "Ru (factored)"
	if c.Method == rules.ASD {
		sym = "Ra (service)"
	}
	load = append(load, row{"Demand " + sym, f.force(c.Demand)})
	if c.Compression > 0 {
		load = append(load, row{"Demand in compression " + sym, f.force(c.Compression)})
		if d.CompressionCombination != "" {
			load = append(load, row{"Governing combination in compression", d.CompressionCombination})
		}
	}
	return job, load
}

// comboTable is every basic combination of ASCE 7 worked for the job's
// service loads, the tension and the compression each gives, the governing
// ones marked.
func comboTable(d *detail.Design, f fmtr) table {
	j := d.Job
	if !j.Load.Combined() {
		return table{}
	}
	t := table{Head: []string{"combination", "tension", "compression", "governs"}}
	for _, r := range engine.Combinations(j.Method, j.Load.Service, j.Load.Reverses) {
		name := "ASCE 7 " + j.Method.String() + ": " + r.Name
		gov := []string{}
		if d.Combination == name && r.Tension > 0 {
			gov = append(gov, "tension")
		}
		comp := f.force(r.Compression)
		if len(r.Reversed) > 0 && r.Compression > 0 {
			comp += " (" + strings.Join(r.Reversed, ", ") + " reversed)"
		}
		if d.CompressionCombination != "" && strings.HasPrefix(d.CompressionCombination, name) && r.Compression > 0 {
			gov = append(gov, "compression")
		}
		t.Rows = append(t.Rows, tableRow{Cells: []string{r.Name, f.force(r.Tension), comp, strings.Join(gov, ", ")}})
	}
	return t
}

func holeTable(c *engine.Connection, f fmtr) table {
	from := "y from heel"
	switch {
	case len(c.Member.Junctions) > 0 && c.Member.Heel():
		from = "y from flange back"
	case len(c.Member.Junctions) > 0:
		from = "y from flange tip"
	case !c.Member.Heel():
		from = "y from edge"
	}
	// A column for the plate's holes only when a ply differs, so that a
	// connection of one hole type reads as it always did.
	plies := false
	for i := range c.Holes {
		plies = plies || (c.Plate != nil && c.Holes[i].PliesDiffer())
	}
	t := table{Head: []string{"hole", "x from member end", from, "size (along × across the load)", "type"}}
	if plies {
		t.Head = []string{"hole", "x from member end", from, "member: size (along × across the load)", "member: type",
			"plate: size (along × across the load)", "plate: type"}
	}
	for i := range c.Holes {
		h := &c.Holes[i]
		cells := []string{h.ID, f.length(h.X), f.length(h.Y)}
		cells = append(cells, holeCells(h.HoleShape, f)...)
		if plies {
			cells = append(cells, holeCells(h.InPlate(), f)...)
		}
		t.Rows = append(t.Rows, tableRow{Cells: cells})
	}
	return t
}

// holeCells are a hole's size and type in one ply.
func holeCells(h engine.HoleShape, f fmtr) []string {
	typ := h.Type.String()
	if h.Type.IsSlot() {
		typ += ", " + h.Slot.String()
	}
	size := units.FormatJob(h.Dx, f.sys) + " diameter"
	if h.Type.IsSlot() {
		size = units.FormatLength(h.Dx, f.sys, units.Job.Bare()) + " × " + units.FormatJob(h.Dy, f.sys)
	}
	return []string{size, typ}
}

// Quantity prints a value of a working's step (engine.Format): the
// report's usual way for its dimension, or with the decimals or
// significant figures the step asks for.
func (f fmtr) Quantity(v float64, d units.Dim, places int) string {
	return units.Format(v, d, f.sys, units.Report.Places(places).Typeset())
}

// limit builds the section of one limit state from its working.
func limit(c *engine.Connection, f fmtr, x engine.Result) limitSection {
	w := x.Working()
	ls := limitSection{ID: x.ID, Clause: x.Clause, Note: x.Note, Pass: x.Pass, Ratio: ratioText(x.Ratio),
		Title: w.Title, Where: w.Where, Formula: w.FormulaLines(), Steps: w.StepLines(f)}
	if ls.Title == "" {
		ls.Title = x.ID
	}
	if w.Table != nil {
		ls.PerBolt, ls.PerBoltTitle = boltTable(w.Table, f), w.Table.Title
	}
	ls.Result = resultRows(c, f, x, w.Interaction)
	ls.Values = valuesTable(f, x)
	return ls
}

// boltTable prints a working's bolt-by-bolt table.
func boltTable(t *engine.Table, f fmtr) *table {
	tb := &table{}
	for _, col := range t.Cols {
		h := col.Label
		if col.UnitInHead {
			h += " " + f.unitLabel(col.Dim)
		}
		tb.Head = append(tb.Head, h)
	}
	for _, cells := range t.Rows() {
		rw := tableRow{}
		for i, cell := range cells {
			switch col := t.Cols[i]; {
			case col.Text:
				rw.Cells = append(rw.Cells, cell.Text)
			case col.UnitInHead:
				rw.Cells = append(rw.Cells, f.num(cell.V, col.Dim))
			default:
				rw.Cells = append(rw.Cells, f.q(cell.V, col.Dim))
			}
		}
		tb.Rows = append(tb.Rows, rw)
	}
	return tb
}

// resultRows are nominal, factor, available, demand, ratio, verdict and
// clause; an interaction says which equation applies and what its
// available strength is instead of a factor.
func resultRows(c *engine.Connection, f fmtr, x engine.Result, in *engine.Interaction) []row {
	asd := c.Method == rules.ASD
	ru, rc, of := "Ru", "φRn", "φRn"
	if asd {
		ru, rc, of = "Ra", "Rn/Ω", "(Rn/Ω)"
	}
	ratio := row{"Ratio " + ru + " / " + of, fmt.Sprintf("%s / %s = %s", f.num(float64(x.Demand), units.DimForce), f.num(float64(x.Available), units.DimForce), ratioText(x.Ratio))}
	clause := "AISC " + strings.TrimPrefix(c.Edition.Name(), "aisc") + " " + x.Clause
	var rows []row
	if in != nil {
		rows = []row{
			{"Interaction, Eq. " + in.Eq, fmt.Sprintf("%.3f (limit 1.0)", in.Value)},
			{in.Allowed + ", " + rc + " = Pr / ratio", fmt.Sprintf("%s / %s = %s", f.num(float64(x.Demand), units.DimForce), ratioText(x.Ratio), f.force(x.Available))},
			{in.Nominal + ", Rn", f.force(x.Nominal)},
			{"Required strength " + ru, f.force(x.Demand)},
			ratio,
		}
		clause += " with " + in.With
	} else {
		fac := x.Factor
		rows = []row{{"Nominal strength Rn", f.force(x.Nominal)}}
		if asd {
			rows = append(rows,
				row{"Safety factor Ω", fmt.Sprintf("%.2f", fac.Omega)},
				row{"Available strength Rn/Ω", fmt.Sprintf("%s / %.2f = %s", f.force(x.Nominal), fac.Omega, f.force(x.Available))})
		} else {
			rows = append(rows,
				row{"Resistance factor φ", fmt.Sprintf("%.2f", fac.Phi)},
				row{"Available strength φRn", fmt.Sprintf("(%.2f)(%s) = %s", fac.Phi, f.force(x.Nominal), f.force(x.Available))})
		}
		rows = append(rows, row{"Required strength " + ru, f.force(x.Demand)}, ratio)
	}
	verdict := "passes: ratio ≤ 1.0"
	if !x.Pass {
		verdict = "FAILS: ratio > 1.0"
	}
	return append(rows, row{"Result", verdict}, row{"Clause", clause})
}

// valuesTable lists a result's intermediate values with what each is.
func valuesTable(f fmtr, x engine.Result) table {
	t := table{Head: []string{"symbol", "value", "what it is"}}
	for _, val := range x.Values {
		if val.Omit {
			continue
		}
		t.Rows = append(t.Rows, tableRow{Cells: []string{val.Symbol(), f.q(val.V, val.Dim), val.What}})
	}
	return t
}

var pageTemplate = template.Must(template.Must(template.New("report").Parse(pageHTML)).Parse(partsHTML))

// partsHTML are the page's parts one end's sections repeat: a summary's
// rows, a table's rows, the limit-state sections.
const partsHTML = `{{define "summary"}}{{range .}}<tr class="{{if .Governs}}governs {{end}}{{if not .Pass}}fail{{end}}">
<td><a href="#{{.Anchor}}">{{.ID}}</a><br><span class="note">{{.Title}}</span></td><td>{{.Clause}}</td>
<td class="num">{{.Nominal}}</td><td class="num">{{.Available}}</td><td class="num">{{.Demand}}</td>
<td class="num"><span class="bar"><span style="width: {{.Bar}}%"></span></span>{{.Ratio}}</td>
<td class="nowrap">{{if .Pass}}<span class="ok">ok</span>{{else}}<span class="bad">FAILS</span>{{end}}{{if .Governs}} <span class="badge gov">governs</span>{{end}}</td></tr>
{{end}}{{end}}
{{define "rows"}}{{range .}}<tr class="{{.Class}}">{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}{{end}}
{{define "limits"}}{{range .}}<section class="limit{{if .Governs}} governs{{end}}{{if not .Pass}} fails{{end}}" id="{{.Anchor}}" data-id="{{.ID}}" data-clause="{{.Clause}}"{{with .End}} data-end="{{.}}"{{end}}>
<div class="lshead">
  <h3>{{.Num}} {{.Title}}</h3>
  <div>{{if .Governs}}<span class="badge gov">governs</span> {{end}}{{if .Pass}}<span class="badge pass">ratio {{.Ratio}} · ok</span>{{else}}<span class="badge fail">ratio {{.Ratio}} · FAILS</span>{{end}}</div>
</div>
<div class="id">{{.ID}} · clause {{.Clause}}</div>
<div class="cols">
<div>
  <div class="label">Formula</div>
  <div class="eqs">{{range .Formula}}<div class="eq formula">{{.}}</div>{{end}}{{if .Where}}<div class="where">where {{.Where}}.</div>{{end}}</div>
  <div class="label">With the values of this connection</div>
  <div class="eqs">{{range .Steps}}<div class="eq">{{.}}</div>{{end}}</div>
  {{if .Note}}<div class="note">Checked: {{.Note}}.</div>{{end}}
</div>
<div>
  <div class="label">Result</div>
  <table class="res">{{range .Result}}<tr><th>{{.Label}}</th><td>{{.Value}}</td></tr>{{end}}</table>
</div>
</div>
{{if .PerBolt}}<div class="label">{{.PerBoltTitle}}</div>
<table class="perbolt">
<tr>{{range .PerBolt.Head}}<th>{{.}}</th>{{end}}</tr>
{{range .PerBolt.Rows}}<tr>{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}</table>{{end}}
<details open><summary>Values used</summary>
<table class="values">
<tr>{{range .Values.Head}}<th>{{.}}</th>{{end}}</tr>
{{range .Values.Rows}}<tr>{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}</table>
</details>
</section>
{{end}}{{end}}
`

const pageHTML = `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
{{with .Stamp}}<meta name="gaugeline-stamp" content="{{.}}">
{{end}}<meta name="viewport" content="width=device-width, initial-scale=1">
<title>{{.Mark}} — calculation report</title>
<style>
:root {
  --ink: #1b1f24; --muted: #59636e; --rule: #d0d7de; --paper: #ffffff; --band: #f4f6f8;
  --accent: #1f5f8b; --pass: #1e7a3c; --fail: #b3261e; --gov: #fff3cd; --govline: #c99700;
}
* { box-sizing: border-box; }
html { background: #e9ecef; }
body {
  font: 15px/1.5 "DejaVu Sans", "Liberation Sans", "Helvetica Neue", Arial, sans-serif;
  color: var(--ink); background: var(--paper);
  max-width: 1080px; margin: 0 auto; padding: 28px 40px 48px;
}
header.top { border-bottom: 3px solid var(--ink); padding-bottom: 12px; margin-bottom: 18px; }
.kicker { text-transform: uppercase; letter-spacing: .12em; font-size: 12px; color: var(--muted); }
h1 { font-size: 28px; margin: 2px 0 4px; }
.sub { color: var(--muted); }
h2 { font-size: 19px; margin: 30px 0 10px; padding-bottom: 4px; border-bottom: 1px solid var(--rule); }
h3 { font-size: 16px; margin: 0; }
table { border-collapse: collapse; width: 100%; margin: 6px 0 10px; font-size: 14px; }
th, td { text-align: left; padding: 4px 8px; border-bottom: 1px solid var(--rule); vertical-align: top; }
th { background: var(--band); font-weight: 600; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
table.kv th { width: 230px; background: none; font-weight: 600; color: var(--muted); }
.verdict { display: flex; gap: 20px; align-items: flex-start; margin: 14px 0; }
.verdict-stamp { font-size: 30px; font-weight: 700; letter-spacing: .06em; padding: 10px 22px; border: 3px solid; border-radius: 6px; display: flex; align-items: center; }
.verdict-stamp.pass { color: var(--pass); } .verdict-stamp.fail { color: var(--fail); }
.verdict .why { flex: 1; }
.verdict ul { margin: 4px 0 0; padding-left: 20px; }
.caution { border: 2px solid var(--govline); background: var(--gov); padding: 10px 14px; border-radius: 6px; margin: 14px 0; font-weight: 600; }
.caution .kicker { color: #7a5b00; }
figure { margin: 8px 0; overflow-x: auto; }
figure svg { width: 100%; height: auto; display: block; margin: 0 auto; background: #fbfcfd; border: 1px solid var(--rule); }
figcaption { color: var(--muted); font-size: 13px; margin-top: 6px; }
svg text { font-family: "DejaVu Sans", "Liberation Sans", Arial, sans-serif; fill: var(--ink); stroke: none; }
svg .contour { fill: #eef1f4; stroke: var(--ink); stroke-width: 1.6px; vector-effect: non-scaling-stroke; }
svg .hole { fill: #ffffff; stroke: var(--fail); stroke-width: 1.4px; vector-effect: non-scaling-stroke; }
svg .slot-centre { fill: var(--fail); }
svg line.dimensions { stroke: #1f7a8c; stroke-width: .8px; vector-effect: non-scaling-stroke; }
svg .arrow { fill: #1f7a8c; stroke: none; }
svg text.dimensions { fill: #145866; }
svg line.reference { stroke: #6e7781; stroke-width: .9px; stroke-dasharray: 9 3 2 3; vector-effect: non-scaling-stroke; }
svg text.reference { fill: #4b535c; font-style: italic; }
svg text.notes { fill: var(--ink); font-weight: 600; }
svg text.stamp { fill: var(--fail); font-weight: 700; }
.bar { display: inline-block; width: 90px; height: 9px; background: var(--band); border: 1px solid var(--rule); vertical-align: middle; margin-right: 6px; }
.bar > span { display: block; height: 100%; background: var(--accent); }
tr.fail .bar > span { background: var(--fail); }
tr.governs td { background: var(--gov); font-weight: 600; }
tr.fail td.res, td.res.fail, tr.fail td { color: var(--fail); }
tr.note td { color: #7a5b00; }
.nowrap { white-space: nowrap; }
.ok { color: var(--pass); font-weight: 600; } .bad { color: var(--fail); font-weight: 700; }
section.limit { border: 1px solid var(--rule); border-radius: 6px; padding: 12px 16px; margin: 14px 0; break-inside: avoid; }
section.limit.governs { border: 2px solid var(--govline); box-shadow: inset 6px 0 0 var(--govline); }
section.limit.fails { border-color: var(--fail); }
.lshead { display: flex; justify-content: space-between; align-items: baseline; gap: 12px; margin-bottom: 6px; }
.limit .id { font-family: "DejaVu Sans Mono", "Liberation Mono", Consolas, monospace; font-size: 13px; color: var(--muted); }
.badge { display: inline-block; font-size: 12px; font-weight: 700; padding: 1px 8px; border-radius: 10px; border: 1px solid; white-space: nowrap; }
.badge.gov { color: #7a5b00; border-color: var(--govline); background: var(--gov); }
.badge.pass { color: var(--pass); } .badge.fail { color: var(--fail); }
.cols { display: grid; grid-template-columns: 1fr 400px; gap: 18px; }
.eqs { background: var(--band); border-radius: 4px; padding: 8px 12px; }
.eq { font-family: "DejaVu Sans Mono", "Liberation Mono", Consolas, monospace; font-size: 13.5px; margin: 2px 0; }
.eq.formula { font-weight: 700; }
.where { font-size: 13px; color: var(--muted); margin-top: 4px; }
.label { font-size: 12px; text-transform: uppercase; letter-spacing: .08em; color: var(--muted); margin: 8px 0 2px; }
.note { color: var(--muted); font-size: 13.5px; }
table.res th { background: none; color: var(--muted); font-weight: 400; white-space: nowrap; width: 1%; }
table.res td { font-variant-numeric: tabular-nums; }
details summary { cursor: pointer; color: var(--accent); font-size: 13.5px; margin-top: 6px; }
.signoff { display: grid; grid-template-columns: repeat(3, 1fr); gap: 24px; margin-top: 12px; }
.signoff div { border-top: 1px solid var(--ink); padding-top: 4px; font-size: 13px; color: var(--muted); height: 64px; }
footer { margin-top: 30px; font-size: 12px; color: var(--muted); border-top: 1px solid var(--rule); padding-top: 8px; }
@media print {
  html { background: none; } body { padding: 0; max-width: none; }
  figure svg { min-width: 0 !important; max-width: none !important; } figure { overflow: visible; }
  h2 { break-after: avoid; }
}
@page {
  margin: 16mm 14mm 18mm 14mm;
  @top-left { content: "{{.Running}}"; font: 8.5pt "DejaVu Sans", sans-serif; color: #59636e; }
  @top-right { content: "gaugeline"; font: 8.5pt "DejaVu Sans", sans-serif; color: #59636e; }
  @bottom-left { content: "Results must be checked against the governing code and approved by the engineer of record."; font: 7.5pt "DejaVu Sans", sans-serif; color: #59636e; }
  @bottom-right { content: "page " counter(page) " of " counter(pages); font: 8.5pt "DejaVu Sans", sans-serif; color: #1b1f24; }
}
@media print {
  /* a limit-state card may run onto the next page (holding each whole
     leaves pages half empty); its parts stay whole, its head with them */
  section.limit { break-inside: auto; }
  .eqs, table.res, figure, .verdict, .signoff, tr, .eq { break-inside: avoid; }
  h2, h3, .lshead, .limit .id, .label { break-after: avoid; }
  section.limit > .cols { break-before: avoid; }
}
</style>
</head>
<body>
<header class="top">
  <div class="kicker">Calculation report</div>
  <h1>{{.Mark}}</h1>
  <div class="sub">{{.Subtitle}}</div>
</header>

<div class="verdict">
  <div class="verdict-stamp {{if .Pass}}pass{{else}}fail{{end}}" id="verdict">{{.Verdict}}</div>
  <div class="why">
    <div><strong>{{.Governing}}</strong></div>
    {{if .Failures}}<div>Fails on:</div><ul>{{range .Failures}}<li>{{.}}</li>{{end}}</ul>
    {{else}}<div>Every limit state and every detailing rule is met.</div>{{end}}
  </div>
</div>

<div class="caution" id="caution"><div class="kicker">Caution</div>{{.Caution}}</div>

<h2>1. The connection</h2>
<table class="kv">
{{range .Job}}<tr><th>{{.Label}}</th><td>{{.Value}}</td></tr>
{{end}}</table>
<h3>Load</h3>
<table class="kv">
{{range .Load}}<tr><th>{{.Label}}</th><td>{{.Value}}</td></tr>
{{end}}</table>
{{if .Combos.Head}}<h3>Load combinations considered</h3>
<table id="combinations">
<tr>{{range .Combos.Head}}<th>{{.}}</th>{{end}}</tr>
{{template "rows" .Combos.Rows}}</table>{{end}}

<h2>2. Layout</h2>
<figure>
{{.Drawing}}
<figcaption>{{.DrawingNote}}</figcaption>
</figure>
<h3>Holes, in the member's frame</h3>
<table id="holes">
<tr>{{range .Holes.Head}}<th>{{.}}</th>{{end}}</tr>
{{range .Holes.Rows}}<tr>{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}</table>
{{if .Schedule.Head}}<h3>Hole schedule</h3>
<table>
<tr>{{range .Schedule.Head}}<th>{{.}}</th>{{end}}</tr>
{{range .Schedule.Rows}}<tr>{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}</table>{{end}}{{if .BOM.Head}}<h3>Bill of material</h3>
<table id="bom">
<tr>{{range .BOM.Head}}<th>{{.}}</th>{{end}}</tr>
{{template "rows" .BOM.Rows}}</table>
<h3>Bolt list</h3>
<table id="bolts">
<tr>{{range .Bolts.Head}}<th>{{.}}</th>{{end}}</tr>
{{template "rows" .Bolts.Rows}}</table>
<ul class="note">{{range .BoltNotes}}<li>{{.}}</li>{{end}}</ul>
{{end}}

<h2>3. Summary of limit states</h2>
<table id="summary">
<tr><th>limit state</th><th>clause</th><th class="num">Rn {{.ForceUnit}}</th><th class="num">{{.AvailableSymbol}} {{.ForceUnit}}</th><th class="num">{{.DemandSymbol}} {{.ForceUnit}}</th><th class="num">ratio</th><th></th></tr>
{{template "summary" .Summary}}</table>

<h2>4. Detailing</h2>
<table id="detailing">
<tr>{{range .Findings.Head}}<th>{{.}}</th>{{end}}</tr>
{{template "rows" .Findings.Rows}}</table>

<h2>5. Limit states</h2>
{{template "limits" .Limits}}

{{with .Far}}
<h2>6. The far end</h2>
<p class="note">The member's far end has a connection of its own{{if .Governs}}, and it governs the member{{end}}. Its holes are given in its own frame: x from the far cut end, y as at the near end.</p>
<table class="kv">
{{range .Job}}<tr><th>{{.Label}}</th><td>{{.Value}}</td></tr>
{{end}}</table>
<h3>Holes, in the far end's frame</h3>
<table id="far-holes">
<tr>{{range .Holes.Head}}<th>{{.}}</th>{{end}}</tr>
{{range .Holes.Rows}}<tr>{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}</table>
<h3>Summary of limit states at the far end</h3>
<table id="far-summary">
<tr><th>limit state</th><th>clause</th><th class="num">Rn {{$.ForceUnit}}</th><th class="num">{{$.AvailableSymbol}} {{$.ForceUnit}}</th><th class="num">{{$.DemandSymbol}} {{$.ForceUnit}}</th><th class="num">ratio</th><th></th></tr>
{{template "summary" .Summary}}</table>
<h3>Detailing at the far end</h3>
<table id="far-detailing">
<tr>{{range .Findings.Head}}<th>{{.}}</th>{{end}}</tr>
{{template "rows" .Findings.Rows}}</table>
{{template "limits" .Limits}}
{{end}}<h2>{{if .Far}}7{{else}}6{{end}}. Assumptions</h2>
<ul>
{{range .Assumptions}}<li>{{.}}</li>
{{end}}</ul>

<h2>{{if .Far}}8{{else}}7{{end}}. Review</h2>
<p class="note">For the engineer of record: this report is an aid to the design, not the design. Check it against the governing code and the project's own requirements before signing.</p>
<div class="signoff"><div>Prepared by, date</div><div>Checked by, date</div><div>Engineer of record, seal and date</div></div>

<footer>Produced by gaugeline from {{.File}}{{if .Stamp}} ({{.Stamp}}){{end}}. {{.Caution}}</footer>
</body>
</html>
`
