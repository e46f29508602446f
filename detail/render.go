package detail

import (
	"fmt"
	"io"
	"math"
	"strings"

	"gaugeline/detail/detailing"
	"gaugeline/detail/texttab"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// people formats internal values for a table a person reads, in the job's
// units: forces to 0.1, US lengths in feet-inches-sixteenths, SI lengths to
// 0.1 mm, areas to 3 (us) or 0 (si) decimals.
type people struct{ sys units.System }

func (p people) force(f units.Force) string {
	return units.Format(float64(f), units.DimForce, p.sys, units.Report.Bare())
}

func (p people) length(l units.Length) string { return units.FormatLength(l, p.sys, units.People) }

func (p people) value(v float64, d units.Dim) string {
	switch d {
	case units.Dimensionless:
		if v == 0 {
			return "-"
		}
	case units.DimLength, units.DimArea, units.DimStress, units.DimForce:
		return units.Format(v, d, p.sys, units.People)
	}
	return fmt.Sprintf("%.3g", v)
}

// RatioText writes a demand-to-capacity ratio to three decimals, ">99.99"
// past that.
func RatioText(r float64) string {
	if r > 99.99 {
		return ">99.99"
	}
	return fmt.Sprintf("%.3f", r)
}

// PassMark is a result's mark in a table: ok, note (advisory) or FAIL.
func PassMark(pass, advisory bool) string {
	switch {
	case pass:
		return "ok"
	case advisory:
		return "note"
	}
	return "FAIL"
}

// Summary describes the connection in a few lines for people.
func (d *Design) Summary() [][2]string {
	p := people{d.Job.Units}
	c := d.Conn
	m := c.Member
	member := fmt.Sprintf("%s %s, %s (Fy %s, Fu %s)", m.Shape, d.Info.Designation, d.Info.Grade,
		p.value(float64(m.Fy), units.DimStress), p.value(float64(m.Fu), units.DimStress))
	if strings.HasPrefix(d.Info.Grade, "Fy") {
		member = fmt.Sprintf("%s %s, %s", m.Shape, d.Info.Designation, d.Info.Grade)
	}
	rows := [][2]string{{"member", member}}
	if b := c.MemberB; b != nil {
		rows = append(rows, [2]string{"member B", fmt.Sprintf("%s %s, %s (Fy %s, Fu %s), beyond the joint", b.Shape, d.InfoB.Designation, d.InfoB.Grade,
			p.value(float64(b.Fy), units.DimStress), p.value(float64(b.Fu), units.DimStress))})
	}
	if pl := c.Plate; pl != nil {
		rows = append(rows, [2]string{"plate", p.plateRow(d)})
	}
	b := c.Bolt
	count := fmt.Sprint(len(c.Holes))
	if engine.Apart(c.Member.Shape) {
		count = fmt.Sprintf("%d (%d in each %s)", len(c.Holes)*c.Member.Pieces, len(c.Holes), engine.PieceName(c.Member.Shape))
	}
	bolts := fmt.Sprintf("%s × %s %s, threads %s, %s joint, %s",
		count, BoltSize(b.D, d.Job.Units), b.Grade.Name, b.Threads, b.Joint, HoleKinds(&c))
	if b.FillerT > 0 {
		bolts += ", fillers " + p.length(b.FillerT)
		if b.FillerDeveloped {
			bolts += " (developed)"
		}
	}
	rows = append(rows, [2]string{"bolts", bolts})
	if fe := d.farEndRow(); fe != "" {
		rows = append(rows, [2]string{"far end", fe})
	}
	demand := fmt.Sprintf("%s %s (%s)", p.force(c.Demand), d.Job.Units.Labels().Force, c.Method)
	if d.Combination != "" {
		demand += ", " + d.Combination
	}
	if c.Demand == 0 && c.Compression > 0 {
		demand = "no tension: the member only pushes"
	}
	rows = append(rows, [2]string{"demand", demand})
	if c.Compression > 0 {
		comp := fmt.Sprintf("%s %s (%s)", p.force(c.Compression), d.Job.Units.Labels().Force, c.Method)
		if d.CompressionCombination != "" {
			comp += ", " + d.CompressionCombination
		}
		rows = append(rows, [2]string{"compression", comp})
	}
	return rows
}

// holeKinds names the holes of a design for people, by the first hole:
// "standard holes", "long-slot transverse holes"; when the plate's ply
// differs, "long-slot transverse holes in the member, standard in the
// plate".
func HoleKinds(c *engine.Connection) string {
	if len(c.Holes) == 0 {
		return "standard holes"
	}
	kind := func(s engine.HoleShape) string {
		if s.Type.IsSlot() {
			return s.Type.String() + " " + s.Slot.String()
		}
		return s.Type.String()
	}
	h := &c.Holes[0]
	if c.Plate == nil || !h.PliesDiffer() || kind(h.HoleShape) == kind(*h.Plate) {
		return kind(h.HoleShape) + " holes"
	}
	return kind(h.HoleShape) + " holes in the member, " + kind(*h.Plate) + " in the plate"
}

func lastX(hs []engine.Hole) units.Length {
	var x units.Length
	for _, h := range hs {
		x = max(x, h.X)
	}
	return x
}

// BoltSize names a bolt diameter: 3/4" or M20.
func BoltSize(d units.Length, sys units.System) string {
	if _, metric := units.MetricBolt(d); sys == units.SI || metric {
		return fmt.Sprintf("M%g", math.Round(float64(d)))
	}
	return units.FormatLength(d, units.US, units.Shop)
}

// VerdictReason says what decided the verdict, for the line after it: a
// pass names the governing limit state and its ratio; a fail names every
// failing limit state and rule (Failing), then the governing limit state
// for information, saying so when it passes (a detailing rule failed).
//
// With a far end of its own (Far) the governing limit state is the
// governing end's, and the reason says which end that is.
func (r *Report) VerdictReason() string {
	g := r.GoverningEnd().GoverningResult()
	gov := fmt.Sprintf("governing %s (%s), ratio %s", g.ID, g.Clause, RatioText(g.Ratio))
	if r.Far != nil {
		gov += " at the " + r.GoverningEndName() + " end"
	}
	if r.Pass {
		return gov
	}
	fails := "fails " + strings.Join(r.Failing(), ", ")
	if g.Pass {
		return fmt.Sprintf("%s; governing limit state %s (%s) passes, ratio %s", fails, g.ID, g.Clause, RatioText(g.Ratio))
	}
	return fails + "; " + gov
}

// WriteText writes the report as aligned tables for a terminal. With a
// far end of its own (Far) each end's tables follow under its heading.
func (r *Report) WriteText(w io.Writer) error {
	d := r.Design
	var b strings.Builder
	fmt.Fprintf(&b, "%s — %s, %s, %s units\n", d.Job.Mark, d.Conn.Edition.Name(), strings.ToUpper(d.Conn.Method.String()), d.Job.Units)
	var rows [][]string
	for _, row := range d.Summary() {
		rows = append(rows, []string{"  " + row[0], row[1]})
	}
	texttab.Table(&b, rows, texttab.Width)
	if r.Far != nil {
		fmt.Fprintf(&b, "\nNEAR END\n")
	}
	r.textTables(&b)
	if r.Far != nil {
		r.Far.farText(&b)
	}
	r.bomText(&b)
	fmt.Fprintf(&b, "\n")
	for k, line := range texttab.Wrap(fmt.Sprintf("verdict: %s — %s", strings.ToUpper(r.Verdict()), r.VerdictReason()), texttab.Width) {
		if k > 0 {
			b.WriteString("         ")
		}
		b.WriteString(line + "\n")
	}
	r.textFails(&b, "")
	if r.Far != nil {
		r.Far.textFails(&b, "far end: ")
	}
	fmt.Fprintf(&b, "\n")
	for _, c := range r.Cautions {
		for k, line := range texttab.Wrap(c, texttab.Width-6) {
			if k == 0 {
				fmt.Fprintf(&b, "note: %s\n", line)
			} else {
				fmt.Fprintf(&b, "      %s\n", line)
			}
		}
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// textTables writes this end's limit states and detailing findings.
func (r *Report) textTables(b *strings.Builder) {
	p := people{r.Design.Job.Units}
	lb := r.Design.Job.Units.Labels()
	fmt.Fprintf(b, "\n")
	rows := [][]string{{"LIMIT STATE", "CLAUSE", "NOMINAL " + lb.Force, "AVAILABLE " + lb.Force, "RATIO", "", "WHAT"}}
	for i, x := range r.Results {
		mark := PassMark(x.Pass, false)
		if i == r.Governing {
			mark += " <"
		}
		rows = append(rows, []string{x.ID, x.Clause, p.force(x.Nominal), p.force(x.Available), RatioText(x.Ratio), mark, x.Note})
	}
	texttab.Table(b, rows, texttab.Width)
	fmt.Fprintf(b, "\n")
	FindingsText(b, p.sys, "DETAILING", r.Findings)
}

// textFails writes a line per failing detailing rule of this end, each
// line's text after prefix.
func (r *Report) textFails(b *strings.Builder, prefix string) {
	p := people{r.Design.Job.Units}
	for _, f := range r.Findings {
		switch {
		case f.Pass || f.Advisory:
		case f.Dim == units.Dimensionless && f.Measured == 0 && f.Limit == 0:
			fmt.Fprintf(b, "  %sfails %s (%s): %s\n", prefix, f.ID, f.Clause, f.Where)
		default:
			fmt.Fprintf(b, "  %sfails %s (%s): %s, measured %s, limit %s\n", prefix, f.ID, f.Clause, f.Where, p.value(f.Measured, f.Dim), p.value(f.Limit, f.Dim))
		}
	}
}

// WriteMarkdown writes the report as Markdown tables for a calculation
// record. With a far end of its own (Far) each end's tables follow under
// its heading.
func (r *Report) WriteMarkdown(w io.Writer) error {
	d := r.Design
	var b strings.Builder
	fmt.Fprintf(&b, "# %s — tension connection check\n\n", d.Job.Mark)
	fmt.Fprintf(&b, "%s, %s, %s units.\n\n", d.Conn.Edition.Name(), strings.ToUpper(d.Conn.Method.String()), d.Job.Units)
	for _, row := range d.Summary() {
		fmt.Fprintf(&b, "- **%s**: %s\n", row[0], row[1])
	}
	end := ""
	if r.Far != nil {
		end = "Near end"
	}
	r.markdownTables(&b, end)
	if r.Far != nil {
		r.Far.farMarkdown(&b)
	}
	r.bomMarkdown(&b)
	fmt.Fprintf(&b, "\n**Verdict: %s** — %s.\n\n", strings.ToUpper(r.Verdict()), MarkdownEscape(r.VerdictReason()))
	for _, c := range r.Cautions {
		fmt.Fprintf(&b, "> %s\n>\n", c)
	}
	_, err := io.WriteString(w, strings.TrimSuffix(b.String(), ">\n"))
	return err
}

// markdownTables writes this end's limit states and detailing findings as
// sections, their headings after the end's name where it is given ("Near
// end: limit states").
func (r *Report) markdownTables(b *strings.Builder, end string) {
	p := people{r.Design.Job.Units}
	lb := r.Design.Job.Units.Labels()
	limits, detailing := "Limit states", "Detailing"
	if end != "" {
		limits, detailing = end+": limit states", end+": detailing"
	}
	fmt.Fprintf(b, "\n## %s\n\n| id | clause | nominal (%s) | available (%s) | demand (%s) | ratio | result | what |\n|---|---|---:|---:|---:|---:|---|---|\n", limits, lb.Force, lb.Force, lb.Force)
	for i, x := range r.Results {
		res := PassMark(x.Pass, false)
		id := x.ID
		if i == r.Governing {
			id = "**" + id + "**"
			res += " (governs)"
		}
		fmt.Fprintf(b, "| %s | %s | %s | %s | %s | %s | %s | %s |\n", id, x.Clause, p.force(x.Nominal), p.force(x.Available), p.force(x.Demand), RatioText(x.Ratio), res, MarkdownEscape(x.Note))
	}
	FindingsMarkdown(b, p.sys, detailing, r.Findings)
}

// FindingsText writes detailing findings as an aligned table under a
// title column heading, values in the units of sys.
func FindingsText(b *strings.Builder, sys units.System, title string, fs []detailing.Finding) {
	p := people{sys}
	rows := [][]string{{title, "CLAUSE", "MEASURED", "LIMIT", "", "WHERE"}}
	for _, f := range fs {
		rows = append(rows, []string{f.ID, f.Clause, p.value(f.Measured, f.Dim), p.value(f.Limit, f.Dim), PassMark(f.Pass, f.Advisory), f.Where})
	}
	texttab.Table(b, rows, texttab.Width)
}

// FindingsMarkdown writes detailing findings as a Markdown section, values
// in the units of sys.
func FindingsMarkdown(b *strings.Builder, sys units.System, title string, fs []detailing.Finding) {
	p := people{sys}
	fmt.Fprintf(b, "\n## %s\n\n| id | clause | measured | limit | result | where |\n|---|---|---:|---:|---|---|\n", title)
	for _, f := range fs {
		fmt.Fprintf(b, "| %s | %s | %s | %s | %s | %s |\n", f.ID, f.Clause, MarkdownEscape(p.value(f.Measured, f.Dim)), MarkdownEscape(p.value(f.Limit, f.Dim)), PassMark(f.Pass, f.Advisory), MarkdownEscape(f.Where))
	}
}

// MarkdownEscape escapes a table cell's pipes.
func MarkdownEscape(s string) string { return strings.ReplaceAll(s, "|", `\|`) }

// plateRow describes the plate: the rectangle by width and free edge (and
// length when the job gives it), an outline by its points and extents.
func (p people) plateRow(d *Design) string {
	c := &d.Conn
	pl := c.Plate
	head := fmt.Sprintf("%s %s %s", p.length(pl.T), d.Info.PlateGrade, pl.Kind)
	if engine.Apart(c.Member.Shape) {
		head = fmt.Sprintf("%d × %s %s %s plates, one at each %s", pl.Plates(), p.length(pl.T), d.Info.PlateGrade, pl.Kind, engine.PieceName(c.Member.Shape))
	}
	if ps := d.Job.Plate; ps != nil && ps.Outline != nil {
		xlo := pl.FreeEdge
		for _, q := range pl.Outline {
			xlo = min(xlo, units.Length(q.X))
		}
		return fmt.Sprintf("%s, outline of %d points, %s along the load × %s across, its free edge %s past the last bolt",
			head, len(pl.Outline), p.length(pl.FreeEdge-xlo), p.length(pl.Width), p.length(pl.FreeEdge-lastX(c.Holes)))
	}
	if pl.Kind == engine.Splice {
		return p.spliceRow(d)
	}
	row := fmt.Sprintf("%s, %s wide, free edge %s past the last bolt", head, p.length(pl.Width), p.length(pl.FreeEdge-lastX(c.Holes)))
	if ps := d.Job.Plate; ps != nil && ps.Length > 0 {
		row += fmt.Sprintf(", %s long", p.length(ps.Length))
	}
	return row
}

// spliceRow describes a splice plate (or the two of a double splice): its
// thickness (2 × t for two), width and length over both members' groups,
// the end past each member's last bolt and the gap between the member ends.
func (p people) spliceRow(d *Design) string {
	c := &d.Conn
	pl := c.Plate
	edge := pl.FreeEdge - lastX(c.Holes)
	what := fmt.Sprintf("%s %s splice plate", p.length(pl.T), d.Info.PlateGrade)
	if pl.Plates() == 2 {
		what = fmt.Sprintf("2 × %s %s splice plates, one each side", p.length(pl.T), d.Info.PlateGrade)
	}
	return fmt.Sprintf("%s, %s wide × %s long, carrying both members' groups, ends %s past each member's last bolt, gap %s between the member ends",
		what, p.length(pl.Width), p.length(SpliceLength(pl)), p.length(edge), p.length(pl.Gap))
}
