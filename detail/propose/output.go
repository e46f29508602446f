package propose

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/rules/units"
)

// Output: the layout for people, the job file with the layout written
// in, the proposal's JSON, text and Markdown.

// Describe writes the layout in one line for people.
func (l Layout) Describe(sys units.System) string {
	s := fmt.Sprintf("%d × %s %s", l.Bolts(), detail.BoltSize(l.Diameter, sys), l.Grade)
	if l.Lines > 1 {
		s += fmt.Sprintf(" in %d lines of %d, gage2 %s", l.Lines, l.PerLine, units.FormatJob(l.Gage2, sys))
	}
	if l.PerLine > 1 {
		s += ", pitch " + units.FormatJob(l.Pitch, sys)
	}
	s += ", end " + units.FormatJob(l.End, sys) + ", gage " + units.FormatJob(l.Gage, sys)
	switch {
	case l.Outline:
		s += fmt.Sprintf(", plate %s on its outline (last bolt %s from the free edge)", units.FormatJob(l.PlateThickness, sys), units.FormatJob(l.PlateEdge, sys))
	case l.PlateThickness > 0:
		s += fmt.Sprintf(", plate %s with edge %s", units.FormatJob(l.PlateThickness, sys), units.FormatJob(l.PlateEdge, sys))
	}
	return s
}

// WriteJob returns the job file with the layout filled in: the pattern keys
// of the bolts block, and the plate's thickness and edge. Values the job
// fixed keep the user's spelling, chosen values are written as the job file
// writes them (jobfile.LengthText; stock spellings for diameters and
// thicknesses); every other key and comment stays as it was.
func WriteJob(j *jobfile.Job, l Layout) ([]byte, error) {
	sys := j.Units
	f := func(v units.Length) string { return jobfile.LengthText(v, sys) }
	bolt := func(key, value, tag string) jobfile.Setting {
		return jobfile.Setting{Block: "bolts", Key: key, Value: value, Tag: tag, Free: true}
	}
	set := []jobfile.Setting{
		bolt("diameter", l.diameterValue(sys), "!!str"),
		bolt("grade", l.Grade, "!!str"),
		bolt("lines", strconv.Itoa(l.Lines), "!!int"),
		bolt("per_line", strconv.Itoa(l.PerLine), "!!int"),
	}
	if l.PerLine > 1 {
		set = append(set, bolt("pitch", f(l.Pitch), "!!str"))
	}
	set = append(set, bolt("end", f(l.End), "!!str"), bolt("gage", f(l.Gage), "!!str"))
	if l.Lines > 1 {
		set = append(set, bolt("gage2", f(l.Gage2), "!!str"))
	}
	if j.ConnectorsChosen {
		set = append(set, jobfile.Setting{Block: "member", Key: "connectors", Value: strconv.Itoa(j.Member.Buckling.Connectors), Tag: "!!int"})
	}
	if j.Plate != nil {
		if j.Plate.AutoThickness {
			set = append(set, jobfile.Setting{Block: "plate", Key: "thickness", Value: l.thicknessValue(sys), Tag: "!!str"})
		}
		if !l.Outline { // an outline has no edge key: its free edge is drawn
			set = append(set, jobfile.Setting{Block: "plate", Key: "edge", Value: f(l.PlateEdge), Tag: "!!str", Free: true})
		}
	}
	return j.Rewrite(set)
}

// diameterValue is the diameter as the job file writes it.
func (l Layout) diameterValue(sys units.System) string {
	if l.diameterText != "" {
		return l.diameterText
	}
	if sys == units.SI {
		return fmt.Sprintf("M%g", l.Diameter.Mm())
	}
	return units.FormatJob(l.Diameter, sys)
}

// thicknessValue is the plate thickness as the job file writes it.
func (l Layout) thicknessValue(sys units.System) string {
	if l.thicknessText != "" {
		return l.thicknessText
	}
	return units.FormatJob(l.PlateThickness, sys)
}

type jsonLayout struct {
	Diameter string `json:"diameter"`
	Grade    string `json:"grade"`
	Lines    int    `json:"lines"`
	PerLine  int    `json:"per_line"`
	Pitch    string `json:"pitch,omitempty"`
	End      string `json:"end"`
	Gage     string `json:"gage"`
	Gage2    string `json:"gage2,omitempty"`
	Stagger  string `json:"stagger,omitempty"`
}

type jsonPlateLayout struct {
	Thickness string `json:"thickness"`
	Edge      string `json:"edge"`
	// Outline: the plate is the job's outline, the edge measured on it.
	Outline bool `json:"outline,omitempty"`
}

// json is the layout's JSON: the bolts block and the plate (nil without
// one).
func (l Layout) json(sys units.System) (jsonLayout, *jsonPlateLayout) {
	f := func(v units.Length) string { return jobfile.LengthText(v, sys) }
	jl := jsonLayout{Diameter: l.diameterValue(sys), Grade: l.Grade, Lines: l.Lines, PerLine: l.PerLine,
		End: f(l.End), Gage: f(l.Gage)}
	if l.PerLine > 1 {
		jl.Pitch = f(l.Pitch)
	}
	if l.Lines > 1 {
		jl.Gage2 = f(l.Gage2)
		if l.Stagger > 0 {
			jl.Stagger = f(l.Stagger)
		}
	}
	if l.PlateThickness == 0 {
		return jl, nil
	}
	if l.Outline { // measured, not a job key: for people
		return jl, &jsonPlateLayout{Thickness: l.thicknessValue(sys), Edge: units.FormatJob(l.PlateEdge, sys), Outline: true}
	}
	return jl, &jsonPlateLayout{Thickness: l.thicknessValue(sys), Edge: f(l.PlateEdge)}
}

// lengthJSON is a connection length in the job's units, rid of the
// rounding noise of summing grid values (they lie on a 1e-9 grid).
func lengthJSON(l units.Length, sys units.System) detail.JSONNum {
	return detail.JSONNum(math.Round(sys.ToJob(float64(l), units.DimLength)*1e9) / 1e9)
}

type jsonAlternative struct {
	Layout    jsonLayout       `json:"layout"`
	Plate     *jsonPlateLayout `json:"plate,omitempty"`
	Bolts     int              `json:"bolts"`
	Length    detail.JSONNum   `json:"length"`
	Governing string           `json:"governing"`
	Ratio     detail.JSONNum   `json:"ratio"`
}

type jsonSearch struct {
	Mode          string   `json:"mode"`
	Objective     string   `json:"objective"`
	Prefer        []string `json:"prefer"`
	Space         int      `json:"space"`
	Evaluated     int      `json:"evaluated"`
	AltEvaluated  int      `json:"evaluated_alternatives"`
	DiagEvaluated int      `json:"evaluated_diagnosis,omitempty"`
	RemEvaluated  int      `json:"evaluated_remedies,omitempty"`
}

type jsonProposal struct {
	detail.Document
	Layout     jsonLayout       `json:"layout"`
	Plate      *jsonPlateLayout `json:"plate,omitempty"`
	Bolts      int              `json:"bolts"`
	Length     detail.JSONNum   `json:"length"`
	GageSource string           `json:"gage_source"`
	GageNote   string           `json:"gage_note"`
	// Connectors is member.connectors where propose chose them (two
	// pieces back to back), else absent.
	Connectors   *int              `json:"connectors,omitempty"`
	Alternatives []jsonAlternative `json:"alternatives"`
	Search       jsonSearch        `json:"search"`
}

type jsonBlocker struct {
	ID    string         `json:"id"`
	Ratio detail.JSONNum `json:"ratio,omitempty"`
	What  string         `json:"what"`
	Lift  string         `json:"lift"`
}

type jsonRemedy struct {
	Kind   string `json:"kind"`
	Change string `json:"change"`
	Value  string `json:"value"`
	Member string `json:"member,omitempty"`
	jsonAlternative
}

type jsonInfeasible struct {
	Mark       string        `json:"mark"`
	Standard   string        `json:"standard"`
	Method     string        `json:"method"`
	Units      string        `json:"units"`
	UnitLabels units.Labels  `json:"unit_labels"`
	Verdict    string        `json:"verdict"`
	Message    string        `json:"message"`
	Blocking   []jsonBlocker `json:"blocking"`
	Remedies   []jsonRemedy  `json:"remedies"`
	Search     jsonSearch    `json:"search"`
	Cautions   []string      `json:"cautions"`
	Stamp      string        `json:"stamp,omitempty"`
}

// search is the JSON of how the search went.
func (p *Proposal) search(mode SearchMode) jsonSearch {
	m := "pruned"
	if mode == Exhaustive || p.Outline {
		m = "exhaustive"
	}
	var prefer []string
	for _, k := range orderOf(p.Job.Stock).keys {
		prefer = append(prefer, k.String())
	}
	return jsonSearch{Mode: m, Objective: p.Job.Stock.Objective.String(), Prefer: prefer, Space: p.Space, Evaluated: p.Evaluated,
		AltEvaluated: p.AltEvaluated, DiagEvaluated: p.DiagEvaluated, RemEvaluated: p.RemedyEvaluated}
}

// JSON returns the proposal as indented JSON: the check JSON of the chosen
// layout (SPEC §9) plus "layout", "plate", "alternatives" and "search";
// or, when nothing passes, the verdict "infeasible" with what blocks.
func (p *Proposal) JSON(mode SearchMode) ([]byte, error) {
	sys := p.Job.Units
	var doc any
	if p.Found() {
		jl, jp := p.Layout.json(sys)
		d := jsonProposal{Document: p.Report.Document(), Layout: jl, Plate: jp, Bolts: p.Layout.Bolts(),
			Length: lengthJSON(p.Length, sys), GageSource: p.GageSource, GageNote: p.GageNote, Alternatives: []jsonAlternative{},
			Search: p.search(mode)}
		if p.Job.ConnectorsChosen {
			n := p.Job.Member.Buckling.Connectors
			d.Connectors = &n
		}
		for _, a := range p.Alternatives {
			al, ap := a.Layout.json(sys)
			d.Alternatives = append(d.Alternatives, jsonAlternative{Layout: al, Plate: ap, Bolts: a.Layout.Bolts(),
				Length: lengthJSON(a.Length, sys), Governing: a.Governing, Ratio: detail.JSONNum(a.Ratio)})
		}
		doc = d
	} else {
		d := jsonInfeasible{Mark: p.Job.Mark, Standard: p.Job.Standard, Method: p.Job.Method.String(), Units: sys.String(),
			UnitLabels: sys.Labels(), Verdict: "infeasible", Message: p.Summary, Blocking: []jsonBlocker{},
			Remedies: []jsonRemedy{}, Search: p.search(mode), Cautions: []string{detail.Caution}, Stamp: p.Job.Stamp}
		for _, b := range p.Blockers {
			d.Blocking = append(d.Blocking, jsonBlocker{ID: b.ID, Ratio: detail.JSONNum(b.Ratio), What: b.Text, Lift: b.Lift})
		}
		for _, r := range p.Remedies {
			rl, rp := r.Layout.json(sys)
			d.Remedies = append(d.Remedies, jsonRemedy{Kind: r.Kind.String(), Change: r.Change, Value: r.Value, Member: r.Member,
				jsonAlternative: jsonAlternative{Layout: rl, Plate: rp, Bolts: r.Layout.Bolts(), Length: lengthJSON(r.Length, sys),
					Governing: r.Governing, Ratio: detail.JSONNum(r.Ratio)}})
		}
		doc = d
	}
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetIndent("", "  ")
	if err := enc.Encode(doc); err != nil {
		return nil, fmt.Errorf("detail: encoding proposal: %w", err)
	}
	return b.Bytes(), nil
}

// writeHead writes the proposal's own part: the layout as a bolts block,
// the search and the alternatives.
func (p *Proposal) writeHead(b *strings.Builder, mode SearchMode, md bool) {
	sys := p.Job.Units
	s := p.search(mode)
	obj := orderOf(p.Job.Stock).describe(p.GageSource == GageUsual || p.GageSource == GageNotUsual || !p.Found())
	if md {
		fmt.Fprintf(b, "# %s — proposed layout\n\n", p.Job.Mark)
	} else {
		fmt.Fprintf(b, "%s — proposed layout\n", p.Job.Mark)
	}
	how := s.Mode + " search checked"
	if p.Outline {
		how = "the plate is the job's outline, so every candidate was checked:"
	}
	fmt.Fprintf(b, "objective: %s; %s %d of %d candidates\n", obj, how, p.Evaluated, p.Space)
	if !p.Found() {
		fmt.Fprintf(b, "\nno layout passes: %s\n", p.Summary)
		for _, bl := range p.Blockers[min(1, len(p.Blockers)):] {
			fmt.Fprintf(b, "  also: %s: %s\n", bl.Text, bl.Lift)
		}
		p.writeRemedies(b, md)
		return
	}
	jl, jp := p.Layout.json(sys)
	fence := ""
	if md {
		fence = "```yaml\n"
		b.WriteString("\n" + fence)
	} else {
		b.WriteString("\n")
	}
	fmt.Fprintf(b, "bolts:\n  diameter: %s\n  grade: %s\n  lines: %d\n  per_line: %d\n", jl.Diameter, jl.Grade, jl.Lines, jl.PerLine)
	if jl.Pitch != "" {
		fmt.Fprintf(b, "  pitch: %s\n", jl.Pitch)
	}
	fmt.Fprintf(b, "  end: %s\n  gage: %s\n", jl.End, jl.Gage)
	if jl.Gage2 != "" {
		fmt.Fprintf(b, "  gage2: %s\n", jl.Gage2)
	}
	if jl.Stagger != "" {
		fmt.Fprintf(b, "  stagger: %s\n", jl.Stagger)
	}
	switch {
	case jp != nil && jp.Outline:
		fmt.Fprintf(b, "plate:\n  thickness: %s   # on the job's outline: the last bolt %s from its free edge\n", jp.Thickness, jp.Edge)
	case jp != nil:
		fmt.Fprintf(b, "plate:\n  thickness: %s\n  edge: %s\n", jp.Thickness, jp.Edge)
	}
	if p.Job.ConnectorsChosen {
		fmt.Fprintf(b, "member:\n  connectors: %d   # intermediate connectors between the two pieces (%s)\n",
			p.Job.Member.Buckling.Connectors, connectorRule(p))
	}
	if md {
		b.WriteString("```\n")
	}
	fmt.Fprintf(b, "\n%d bolts, connection length %s\n", p.Layout.Bolts(), units.FormatJob(p.Length, sys))
	if p.GageNote != "" {
		lead := "note: "
		if md {
			lead = "> "
		}
		if p.GageSource == GageNotUsual {
			lead += "caution: "
		}
		fmt.Fprintf(b, "%s%s\n", lead, p.GageNote)
	}
	if len(p.Alternatives) > 0 {
		if md {
			b.WriteString("\n## Alternatives\n\n| bolts | length | layout | governing | ratio |\n|---:|---:|---|---|---:|\n")
			for _, a := range p.Alternatives {
				fmt.Fprintf(b, "| %d | %s | %s | %s | %.3f |\n", a.Layout.Bolts(), units.FormatJob(a.Length, sys), a.Layout.Describe(sys), a.Governing, a.Ratio)
			}
		} else {
			b.WriteString("\nalternatives:\n")
			tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
			fmt.Fprintf(tw, "  BOLTS\tLENGTH\tLAYOUT\tGOVERNING\tRATIO\n")
			for _, a := range p.Alternatives {
				fmt.Fprintf(tw, "  %d\t%s\t%s\t%s\t%.3f\n", a.Layout.Bolts(), units.FormatJob(a.Length, sys), a.Layout.Describe(sys), a.Governing, a.Ratio)
			}
			tw.Flush()
		}
	}
	b.WriteString("\n")
}

// shownRemedies is how many remedies text and Markdown show (JSON has
// them all).
const shownRemedies = 2

// writeRemedies writes the first shownRemedies remedies of an infeasible
// proposal, or that none was found.
func (p *Proposal) writeRemedies(b *strings.Builder, md bool) {
	sys := p.Job.Units
	if md {
		b.WriteString("\n## What would pass\n\n")
	} else {
		b.WriteString("\nwhat would pass, beyond the stock:\n")
	}
	if len(p.Remedies) == 0 {
		b.WriteString(bullet(md) + "no single change tried passes (remedy order: bolt grade, diameter, plate, bolts per line, lines, member)\n")
		return
	}
	for _, r := range p.Remedies[:min(len(p.Remedies), shownRemedies)] {
		fmt.Fprintf(b, "%s%s: %s; %s governs, ratio %.3f\n", bullet(md), r.Change, r.Layout.Describe(sys), r.Governing, r.Ratio)
	}
	if n := len(p.Remedies) - shownRemedies; n > 0 {
		fmt.Fprintf(b, "%s(%d more in --format json)\n", bullet(md), n)
	}
}

// bullet starts a list item.
func bullet(md bool) string {
	if md {
		return "- "
	}
	return "  "
}

// WriteText writes the proposal for a terminal: the layout, the
// alternatives and the full check of the layout.
func (p *Proposal) WriteText(w io.Writer, mode SearchMode) error {
	var b strings.Builder
	p.writeHead(&b, mode, false)
	if _, err := io.WriteString(w, b.String()); err != nil {
		return err
	}
	if p.Found() {
		return p.Report.WriteText(w)
	}
	_, err := fmt.Fprintf(w, "\nnote: %s\n", detail.Caution)
	return err
}

// WriteMarkdown writes the proposal as Markdown.
func (p *Proposal) WriteMarkdown(w io.Writer, mode SearchMode) error {
	var b strings.Builder
	p.writeHead(&b, mode, true)
	if _, err := io.WriteString(w, b.String()); err != nil {
		return err
	}
	if p.Found() {
		return p.Report.WriteMarkdown(w)
	}
	_, err := fmt.Fprintf(w, "\n> %s\n", detail.Caution)
	return err
}

// connectorRule names the rule the chosen connectors meet.
func connectorRule(p *Proposal) string {
	if p.Report != nil && p.Report.Design.Conn.Compression > 0 {
		return "E6.2: a/ri at most 3/4 of the member's Lc/r"
	}
	return "D4: a/ri preferably at most 300"
}
