// Package calc writes the calculation report of one checked connection:
// a single self-contained HTML page (inline CSS and SVG, no script, no
// font or image fetched) that a reviewer reads and an engineer of record
// signs. It shows the job, the layout drawn from the cut-sheet model
// (detail.Sheet, the one the DXF is drawn from), every limit state with
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
	s, err := detail.NewSheet(r, !r.Pass)
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

// places is how many decimals a value of dimension d is printed with.
func (f fmtr) places(d units.Dim) int {
	switch d {
	case units.DimLength:
		if f.sys == units.US {
			return 3
		}
		return 1
	case units.DimArea:
		if f.sys == units.US {
			return 3
		}
		return 0
	case units.DimForce, units.DimStress:
		return 1
	case units.DimMoment:
		if f.sys == units.US {
			return 2
		}
		return 3
	case units.DimModulus:
		if f.sys == units.US {
			return 3
		}
		return 0
	}
	return 3
}

// num prints a value of dimension d in the job's units, without a unit.
func (f fmtr) num(v float64, d units.Dim) string {
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return "∞"
	}
	v = f.sys.ToJob(v, d)
	if d == units.Dimensionless && v == math.Trunc(v) && math.Abs(v) < 1e6 {
		return fmt.Sprintf("%d", int64(v))
	}
	s := fmt.Sprintf("%.*f", f.places(d), v)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// q prints a value with its unit.
func (f fmtr) q(v float64, d units.Dim) string {
	if u := f.unitLabel(d); u != "" {
		return f.num(v, d) + " " + u
	}
	return f.num(v, d)
}

func (f fmtr) force(x units.Force) string   { return f.q(float64(x), units.DimForce) }
func (f fmtr) length(x units.Length) string { return f.q(float64(x), units.DimLength) }

// people prints a measured or limiting value the way the shop reads it:
// lengths as the check prints them (detail.FormatLength: US in feet,
// inches and sixteenths, the exact value after them where they round it).
func (f fmtr) people(v float64, d units.Dim) string {
	switch d {
	case units.DimLength:
		return detail.FormatLength(units.Length(v), f.sys)
	case units.Dimensionless:
		if v == 0 {
			return "–"
		}
		return fmt.Sprintf("%.3g", v)
	}
	return f.q(v, d)
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
}

type summaryRow struct {
	Anchor, ID, Clause, Title  string
	Nominal, Available, Demand string
	Ratio, Bar                 string
	Pass, Governs              bool
}

type page struct {
	Mark, Subtitle, File string
	Stamp                string // Job.Stamp, in a <meta> element; "" for none
	Pass                 bool
	Verdict, Governing   string
	Failures             []string
	Caution              string
	Assumptions          []string
	Job, Load            []row
	Holes                table
	Schedule             table
	Drawing              template.HTML
	DrawingNote          string
	Summary              []summaryRow
	ForceUnit            string
	Limits               []limitSection
	Findings             table
	DemandSymbol         string
	AvailableSymbol      string
}

func newPage(r *detail.Report, s *detail.Sheet) page {
	d := r.Design
	c := &d.Conn
	f := fmtr{d.Job.Units}
	g := r.GoverningResult()
	lrfd := c.Method == rules.LRFD
	p := page{
		Mark:            d.Job.Mark,
		Subtitle:        fmt.Sprintf("Bolted tension connection · AISC %s · %s · %s units", strings.TrimPrefix(c.Edition.Name, "aisc"), strings.ToUpper(c.Method.String()), strings.ToUpper(d.Job.Units.String())),
		File:            filepath.Base(d.Job.File),
		Stamp:           d.Job.Stamp,
		Pass:            r.Pass,
		Caution:         detail.Caution,
		ForceUnit:       f.unitLabel(units.DimForce),
		DemandSymbol:    "Ru",
		AvailableSymbol: "φRn",
	}
	if !lrfd {
		p.DemandSymbol, p.AvailableSymbol = "Ra", "Rn/Ω"
	}
	p.Verdict = "PASSES"
	if !r.Pass {
		p.Verdict = "FAILS"
	}
	p.Governing = fmt.Sprintf("Governing limit state: %s (%s), %s / %s = %s / %s = %s",
		g.ID, g.Clause, p.DemandSymbol, p.AvailableSymbol, f.force(g.Demand), f.force(g.Available), ratioText(g.Ratio))
	for _, x := range r.Results {
		if !x.Pass {
			p.Failures = append(p.Failures, fmt.Sprintf("%s (%s): ratio %s", x.ID, x.Clause, ratioText(x.Ratio)))
		}
	}
	for _, fd := range r.Findings {
		if !fd.Pass && !fd.Advisory {
			line := fmt.Sprintf("%s (%s): %s", fd.ID, fd.Clause, fd.Where)
			if fd.Dim != units.Dimensionless || fd.Measured != 0 || fd.Limit != 0 {
				line += fmt.Sprintf(", measured %s, limit %s", f.people(fd.Measured, fd.Dim), f.people(fd.Limit, fd.Dim))
			}
			p.Failures = append(p.Failures, line)
		}
	}
	for i, cv := range r.Cautions {
		if i == 0 && cv == detail.Caution {
			continue
		}
		p.Assumptions = append(p.Assumptions, cv)
	}
	p.Assumptions = append(p.Assumptions,
		"Values are printed rounded in the job's units; the check runs at full precision, so a product written out may differ from the printed result in its last digit.",
		fmt.Sprintf("The available strength is %s with the φ and Ω of AISC %s; a limit state passes when the ratio %s / %s does not exceed 1.0.",
			p.AvailableSymbol, strings.TrimPrefix(c.Edition.Name, "aisc"), p.DemandSymbol, p.AvailableSymbol))

	p.Job, p.Load = jobRows(d, f)
	p.Holes = holeTable(c, f)
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
	if c.Member.Shape == engine.Flat {
		views = strings.Replace(views, "member's connected leg", "member", 1)
	}
	p.DrawingNote = fmt.Sprintf("Drawn from the cut-sheet model of %s.dxf: %s; dimensions in %s; %s. Not to scale on screen.", d.Job.Mark, views, unit, lines)
	if !r.Pass {
		p.DrawingNote += " The connection fails: the views are stamped " + detail.Stamp + "."
	}
	if wide {
		p.DrawingNote += " The drawing is long: scroll it sideways on screen; it prints scaled to the page."
	}

	byID := map[string]engine.Result{}
	for _, x := range r.Results {
		byID[x.ID] = x
	}
	for i, x := range r.Results {
		ls := limit(d, f, x, byID)
		ls.Num = fmt.Sprintf("5.%d", i+1)
		ls.Anchor = anchor(x.ID)
		ls.Governs = i == r.Governing
		p.Limits = append(p.Limits, ls)
		p.Summary = append(p.Summary, summaryRow{
			Anchor: ls.Anchor, ID: x.ID, Clause: x.Clause, Title: ls.Title,
			Nominal: f.num(float64(x.Nominal), units.DimForce), Available: f.num(float64(x.Available), units.DimForce),
			Demand: f.num(float64(x.Demand), units.DimForce), Ratio: ratioText(x.Ratio),
			Bar:  fmt.Sprintf("%.1f", 100*math.Min(math.Max(x.Ratio, 0), 1)),
			Pass: x.Pass, Governs: i == r.Governing,
		})
	}

	p.Findings.Head = []string{"check", "clause", "measured", "limit", "result", "where"}
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
		p.Findings.Rows = append(p.Findings.Rows, tableRow{Class: class, Cells: []string{
			fd.ID, fd.Clause, f.people(fd.Measured, fd.Dim), f.people(fd.Limit, fd.Dim), res, fd.Where}})
	}
	return p
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
		{"Standard", fmt.Sprintf("AISC %s (%s)", strings.TrimPrefix(c.Edition.Name, "aisc"), c.Edition.Name)},
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
	if m.Pieces > 1 {
		props = fmt.Sprintf("Ag = %s (both angles), t = %s each", f.q(float64(m.Ag), units.DimArea), f.length(m.T))
	}
	if m.Shape != engine.Flat {
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
	return job, load
}

func holeTable(c *engine.Connection, f fmtr) table {
	from := "y from heel"
	if c.Member.Shape == engine.Flat {
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
		size = strings.TrimSuffix(units.FormatJob(h.Dx, f.sys), " "+f.unitLabel(units.DimLength)) + " × " + units.FormatJob(h.Dy, f.sys)
	}
	return []string{size, typ}
}

// vals looks up a result's intermediate values by name.
type vals struct {
	m map[string]engine.Value
	f fmtr
}

func (v vals) has(n string) bool { _, ok := v.m[n]; return ok }

// raw is the value in internal units (0 when absent).
func (v vals) raw(n string) float64 { return v.m[n].V }

// q prints the value with its unit.
func (v vals) q(n string) string {
	x, ok := v.m[n]
	if !ok {
		return "?"
	}
	return v.f.q(x.V, x.Dim)
}

// meaning says what an intermediate value is. Keys "id:name" take
// precedence over "name".
var meaning = map[string]string{
	"Fy":                   "specified minimum yield stress",
	"Fu":                   "specified minimum tensile strength",
	"Ag":                   "gross area",
	"plate.yield:Ag":       "gross area of the Whitmore section, Aw = Lw·t",
	"plate.rupture:Ag":     "gross area of the Whitmore section, Lw·t",
	"An":                   "net area",
	"plate.rupture:An":     "net area of the Whitmore section",
	"U":                    "shear lag factor (Table D3.1)",
	"Ae":                   "effective net area, U·An",
	"deduction":            "width taken out by the worst path, Σdh − Σs²/4g",
	"xbar":                 "connection eccentricity x̄",
	"l":                    "length of connection, first to last row",
	"U_case2":              "Table D3.1 case 2: 1 − x̄/l",
	"U_case8":              "Table D3.1 case 8, angles (0 when it does not apply)",
	"U_min":                "connected elements' gross area over Ag (D3)",
	"Agv":                  "gross area in shear",
	"Anv":                  "net area in shear",
	"Ant":                  "net area in tension",
	"Ubs":                  "tension stress factor (uniform tension)",
	"t":                    "thickness",
	"member.bearing:t":     "thickness bearing (both angles of a pair)",
	"member.block-shear:t": "thickness (both angles of a pair)",
	"blocks":               "blocks examined",
	"d":                    "bolt diameter",
	"lc_min":               "least clear distance lc",
	"bearing_coefficient":  "bearing coefficient cb",
	"tearout_coefficient":  "tearout coefficient ct",
	"bolts":                "bolts",
	"Lw":                   "Whitmore width",
	"Whitmore_spread":      "30° spread before the clip by the plate",
	"holes":                "holes on the worst path across the section",
	"splice_cap_applied":   "An capped at 0.85·Ag (1 yes, 0 no)",
	"Fnv":                  "nominal shear stress of the bolt",
	"Ab":                   "nominal unthreaded bolt area, π·d²/4",
	"n":                    "number of bolts",
	"planes":               "shear planes per bolt",
	"long_joint_factor":    "long-joint reduction of Fnv (1 when none)",
	"pattern_length":       "length of the pattern along the load",
	"mu":                   "mean slip coefficient μ",
	"Du":                   "mean installed over minimum pretension",
	"hf":                   "filler factor",
	"Tb":                   "minimum bolt pretension",
	"ns":                   "slip planes",
	"phi":                  "resistance factor φ for slip, by hole type",
	"omega":                "safety factor Ω for slip, by hole type",
	"rn_shear":             "shear strength of one bolt, Fnv·Ab·ns (× ff with fillers)",
	"filler_factor":        "filler factor ff of J5.2(a) on the bolts' shear strength (1 when none)",
	"filler_t":             "total thickness of the fillers at a shear plane (0 when none given)",
	"member.combined:d":    "depth of the bar in the plane of bending (its width)",
	"member.combined:t":    "thickness of the bar",
	"Pr":                   "required axial strength (the demand)",
	"Pc":                   "available tensile strength, the lesser of yielding and rupture (D2)",
	"Pc_yield":             "available strength in tensile yielding, D2(a)",
	"Pc_rupture":           "available strength in tensile rupture, D2(b)",
	"Pn":                   "nominal tensile strength, min(Fy·Ag, Fu·Ae)",
	"e":                    "offset of the bolt group's centre of gravity from the bar's centre line",
	"ybar":                 "the bolt group's centre of gravity, from the edge y = 0",
	"Z":                    "plastic section modulus of the bar, t·d²/4",
	"S":                    "elastic section modulus of the bar, t·d²/6",
	"Mp_cap":               "k of F11.1: Mp ≤ k·Fy·Sx",
	"Mp":                   "plastic moment, F11.1",
	"Lb":                   "unbraced length within the connection",
	"LTB_lambda":           "Lb·d/t² of F11.2",
	"LTB_limit":            "0.08E/Fy: below it F11.2(a), no lateral-torsional buckling",
	"Mn":                   "nominal flexural strength, F11",
	"Mc":                   "available flexural strength",
	"Mr":                   "required flexural strength, Pr·e",
	"Pr_Pc":                "axial term",
	"Mr_Mc":                "flexural term",
	"H1_1a":                "Eq. H1-1a, Pr/Pc + (8/9)·Mr/Mc",
	"H1_1b":                "Eq. H1-1b, Pr/(2Pc) + Mr/Mc",
	"H1_eq":                "equation H1.2 selects: 1 for H1-1a (Pr/Pc ≥ 0.2), 2 for H1-1b",
	"H1_value":             "value of the selected equation",
}

// symbols are printed names of values whose names are spelled out.
var symbols = map[string]string{
	"xbar": "x̄", "lc_min": "lc,min", "mu": "μ", "phi": "φ", "omega": "Ω",
	"U_case2": "U (case 2)", "U_case8": "U (case 8)", "U_min": "U (bound)",
	"bearing_coefficient": "cb", "tearout_coefficient": "ct", "rn_shear": "rn,shear",
	"Whitmore_spread": "spread", "long_joint_factor": "long-joint factor",
	"pattern_length": "pattern length", "splice_cap_applied": "cap applied",
	"deduction": "Σdh − Σs²/4g", "filler_factor": "ff", "filler_t": "t (fillers)",
	"Pc_yield": "Pc,yield", "Pc_rupture": "Pc,rupture", "ybar": "ȳ", "Mp_cap": "k",
	"LTB_lambda": "Lb·d/t²", "LTB_limit": "0.08E/Fy", "Pr_Pc": "Pr/Pc", "Mr_Mc": "Mr/Mc",
	"H1_1a": "H1-1a", "H1_1b": "H1-1b", "H1_eq": "equation", "H1_value": "H1 value",
}

// fillerFormula is J5.2(a) as the edition prints it for the job's system.
func fillerFormula(sys units.System) string {
	if sys == units.SI {
		return "ff = 1 − 0.0154(t − 6) ≥ 0.85, t in mm"
	}
	return "ff = 1 − 0.4(t − 0.25) ≥ 0.85, t in in."
}

// fillerLimit is the filler thickness J5.2 lets through without reduction.
func fillerLimit(sys units.System) string {
	if sys == units.SI {
		return "6 mm"
	}
	return "1/4 in"
}

// fillerStep works the filler factor from the filler thickness.
func fillerStep(f fmtr, v vals) string {
	t := units.Length(v.raw("filler_t"))
	var raw float64
	var expr string
	if f.sys == units.SI {
		raw = 1 - 0.0154*(t.Mm()-6)
		expr = fmt.Sprintf("1 − 0.0154(%.4g − 6)", t.Mm())
	} else {
		raw = 1 - 0.4*(t.In()-0.25)
		expr = fmt.Sprintf("1 − 0.4(%.4g − 0.25)", t.In())
	}
	ff := v.raw("filler_factor")
	s := fmt.Sprintf("ff = %s = %.3f", expr, raw)
	if raw < ff {
		s += fmt.Sprintf(", not less than 0.85: ff = %.3f", ff)
	}
	return s + fmt.Sprintf(": fillers %s thick, not developed", v.q("filler_t"))
}

// factorOf is the φ and Ω of a limit state.
func factorOf(ed *rules.Edition, x engine.Result, v vals) rules.Factor {
	switch {
	case x.ID == "bolts.slip" && v.has("phi") && v.has("omega"):
		return rules.Factor{Phi: v.raw("phi"), Omega: v.raw("omega")}
	case strings.HasSuffix(x.ID, ".yield"):
		return ed.YieldFactor()
	case strings.HasSuffix(x.ID, ".rupture"):
		return ed.RuptureFactor()
	case strings.HasSuffix(x.ID, ".block-shear"):
		return ed.BlockShearFactor()
	case strings.HasSuffix(x.ID, ".bearing"):
		return ed.BearingFactor()
	case x.ID == "bolts.shear" || x.ID == "bolts.group":
		return ed.BoltShearFactor()
	}
	// Unknown to this report: read the factor off the result.
	if x.Nominal > 0 && x.Available > 0 {
		k := float64(x.Available / x.Nominal)
		return rules.Factor{Phi: k, Omega: 1 / k}
	}
	return rules.Factor{}
}

// limit builds the section of one limit state.
func limit(d *detail.Design, f fmtr, x engine.Result, byID map[string]engine.Result) limitSection {
	c := &d.Conn
	v := vals{m: map[string]engine.Value{}, f: f}
	for _, val := range x.Values {
		v.m[val.Name] = val
	}
	ls := limitSection{ID: x.ID, Clause: x.Clause, Note: x.Note, Pass: x.Pass, Ratio: ratioText(x.Ratio)}
	force := func(n float64) string { return f.force(units.Force(n)) }
	var where []string
	switch x.ID {
	case "member.yield":
		ls.Title = "Tensile yielding in the gross section of the member"
		ls.Formula = []string{"Rn = Fy·Ag"}
		ls.Steps = []string{fmt.Sprintf("Rn = (%s)(%s) = %s", v.q("Fy"), v.q("Ag"), f.force(x.Nominal))}

	case "member.rupture":
		ls.Title = "Tensile rupture in the net section of the member"
		ls.Formula = []string{"Rn = Fu·Ae", "Ae = U·An", "An = Ag − Σt·(Σdh − Σs²/4g)"}
		where = []string{"the path is the worst straight or zig-zag path across the section (B4.3); s and g are the spacing and gage between consecutive holes of the path; dh = nominal hole + " + units.FormatJob(c.Edition.HoleAllowance(), f.sys)}
		m := c.Member
		tsum := units.Length(m.Pieces) * m.T
		tText := f.length(tsum)
		if m.Pieces > 1 {
			tText = fmt.Sprintf("%d × %s", m.Pieces, f.length(m.T))
		}
		ls.Steps = append(ls.Steps, fmt.Sprintf("An = %s − (%s)(%s) = %s", v.q("Ag"), tText, v.q("deduction"), v.q("An")))
		if m.Shape == engine.Flat {
			ls.Formula = append(ls.Formula, "U = 1.0")
			where = append(where, "U = 1.0 by Table D3.1 case 1: every part of the section is connected")
			ls.Steps = append(ls.Steps, "U = "+v.q("U"))
		} else {
			ls.Formula = append(ls.Formula, "U = max(1 − x̄/l, U case 8, U bound)")
			where = append(where, "1 − x̄/l is Table D3.1 case 2; case 8 for angles is 0.80 with 4 or more bolts in a line, 0.60 with 3; the bound is the connected elements' area over Ag (D3)")
			if v.raw("l") > 0 {
				ls.Steps = append(ls.Steps, fmt.Sprintf("U (case 2) = 1 − x̄/l = 1 − %s / %s = %s", v.q("xbar"), v.q("l"), v.q("U_case2")))
			} else {
				ls.Steps = append(ls.Steps, "U (case 2): one row of bolts, no length of connection")
			}
			if v.raw("U_case8") > 0 {
				ls.Steps = append(ls.Steps, "U (case 8) = "+v.q("U_case8"))
			} else {
				ls.Steps = append(ls.Steps, "U (case 8) does not apply: fewer than 3 bolts in a line")
			}
			ls.Steps = append(ls.Steps, "U (bound) = connected elements' area / Ag = "+v.q("U_min"),
				fmt.Sprintf("U = max(%s, %s, %s) = %s", v.q("U_case2"), v.q("U_case8"), v.q("U_min"), v.q("U")))
		}
		ls.Steps = append(ls.Steps,
			fmt.Sprintf("Ae = (%s)(%s) = %s", v.q("U"), v.q("An"), v.q("Ae")),
			fmt.Sprintf("Rn = (%s)(%s) = %s", v.q("Fu"), v.q("Ae"), f.force(x.Nominal)))

	case "member.block-shear", "plate.block-shear":
		if x.ID == "member.block-shear" {
			ls.Title = "Block shear of the member, tearing out toward the member end"
		} else {
			ls.Title = "Block shear of the plate, tearing out toward its free edge"
		}
		ls.Formula = []string{"Rn = 0.60·Fu·Anv + Ubs·Fu·Ant ≤ 0.60·Fy·Agv + Ubs·Fu·Ant"}
		where = []string{"Agv and Anv are the gross and net areas in shear, Ant the net area in tension, of one block; every plausible block is examined and the weakest governs"}
		Fu, Fy, Ubs := v.raw("Fu"), v.raw("Fy"), v.raw("Ubs")
		tension := Ubs * Fu * v.raw("Ant")
		rup := 0.6*Fu*v.raw("Anv") + tension
		yld := 0.6*Fy*v.raw("Agv") + tension
		ls.Steps = []string{
			fmt.Sprintf("shear rupture + tension = 0.60(%s)(%s) + (%.1f)(%s)(%s) = %s", v.q("Fu"), v.q("Anv"), Ubs, v.q("Fu"), v.q("Ant"), force(rup)),
			fmt.Sprintf("shear yielding + tension = 0.60(%s)(%s) + (%.1f)(%s)(%s) = %s", v.q("Fy"), v.q("Agv"), Ubs, v.q("Fu"), v.q("Ant"), force(yld)),
			fmt.Sprintf("Rn = the lesser = %s", f.force(x.Nominal)),
		}

	case "member.bearing", "plate.bearing":
		if x.ID == "member.bearing" {
			ls.Title = "Bearing and tearout at the member's bolt holes"
			ls.PerBoltTitle = "Bolt by bolt, lc measured toward the member end"
		} else {
			ls.Title = "Bearing and tearout at the plate's bolt holes"
			ls.PerBoltTitle = "Bolt by bolt, lc measured toward the plate's free edge"
		}
		ls.Formula = []string{"rn = min(cb·d·t·Fu, ct·lc·t·Fu), for each bolt", "Rn = Σ rn"}
		where = []string{"lc is the clear distance, in the direction of the force, from the edge of the hole to the edge of the next hole or of the part"}
		why := "deformation at the bolt hole at service load is a design consideration"
		if !c.Bolt.DeformationConsidered {
			why = "deformation at the bolt hole at service load is not a design consideration"
		}
		cb, ct := v.raw("bearing_coefficient"), v.raw("tearout_coefficient")
		Fu, d, t := v.raw("Fu"), v.raw("d"), v.raw("t")
		ls.Steps = []string{
			fmt.Sprintf("cb = %s, ct = %s: %s", fmt.Sprintf("%.1f", cb), fmt.Sprintf("%.1f", ct), why),
			fmt.Sprintf("bearing, each bolt = (%.1f)(%s)(%s)(%s) = %s", cb, v.q("d"), v.q("t"), v.q("Fu"), force(cb*d*t*Fu)),
			fmt.Sprintf("tearout, bolt with the least lc = (%.1f)(%s)(%s)(%s) = %s", ct, v.q("lc_min"), v.q("t"), v.q("Fu"), force(ct*max(v.raw("lc_min"), 0)*t*Fu)),
			fmt.Sprintf("Rn = Σ rn over %s bolts (table) = %s", v.q("bolts"), f.force(x.Nominal)),
		}
		tb := &table{Head: []string{"hole", "lc", "bearing " + f.unitLabel(units.DimForce), "tearout " + f.unitLabel(units.DimForce), "rn " + f.unitLabel(units.DimForce), "governs"}}
		for _, b := range x.PerBolt {
			tb.Rows = append(tb.Rows, tableRow{Cells: []string{b.Hole, f.length(b.Lc),
				f.num(float64(b.Bearing), units.DimForce), f.num(float64(b.Tearout), units.DimForce),
				f.num(float64(b.Rn), units.DimForce), b.Governed}})
		}
		ls.PerBolt = tb

	case "plate.yield":
		ls.Title = "Tensile yielding of the plate on the Whitmore section"
		ls.Formula = []string{"Rn = Fy·Aw", "Aw = Lw·t", "Lw = the spread, clipped by the plate's side edges"}
		where = []string{"the spread is the width between 30° lines drawn from the first bolt of each gage line (the one nearest the free edge) to the section through the bolt farthest from it (the Whitmore section); one row of bolts spreads over the row's width only, and a single bolt has no Whitmore section"}
		pw := "?"
		if c.Plate != nil {
			pw = f.length(c.Plate.Width)
		}
		ls.Steps = []string{
			fmt.Sprintf("Lw = %s spread, clipped by the %s plate = %s", v.q("Whitmore_spread"), pw, v.q("Lw")),
			fmt.Sprintf("Aw = (%s)(%s) = %s", v.q("Lw"), v.q("t"), v.q("Ag")),
			fmt.Sprintf("Rn = (%s)(%s) = %s", v.q("Fy"), v.q("Ag"), f.force(x.Nominal)),
		}

	case "plate.rupture":
		ls.Title = "Tensile rupture of the plate on the Whitmore section"
		ls.Formula = []string{"Rn = Fu·An", "An = (Lw − Σdh + Σs²/4g)·t"}
		where = []string{"the holes are those of the worst straight or zig-zag path across the plate (B4.3b, the same search as the member's); dh = nominal hole + " + units.FormatJob(c.Edition.HoleAllowance(), f.sys)}
		if _, ok := c.Edition.SplicePlateCap(); ok {
			ls.Formula = append(ls.Formula, "An ≤ 0.85·Ag (splice plates)")
		}
		ls.Steps = []string{
			fmt.Sprintf("Ag = (%s)(%s) = %s", v.q("Lw"), v.q("t"), v.q("Ag")),
			fmt.Sprintf("worst path: %s hole(s), Σdh − Σs²/4g = %s", v.q("holes"), v.q("deduction")),
		}
		if v.raw("splice_cap_applied") != 0 {
			ls.Steps = append(ls.Steps, fmt.Sprintf("An = 0.85·Ag = %s (the splice-plate cap governs)", v.q("An")))
		} else if v.raw("An") > 0 {
			ls.Steps = append(ls.Steps, fmt.Sprintf("An = (%s − %s)(%s) = %s", v.q("Lw"), v.q("deduction"), v.q("t"), v.q("An")))
		} else {
			ls.Steps = append(ls.Steps, fmt.Sprintf("An = (%s − %s)(%s) ≤ 0: no net section, An = %s", v.q("Lw"), v.q("deduction"), v.q("t"), v.q("An")))
		}
		ls.Steps = append(ls.Steps, fmt.Sprintf("Rn = (%s)(%s) = %s", v.q("Fu"), v.q("An"), f.force(x.Nominal)))

	case "bolts.shear":
		ls.Title = "Shear rupture of the bolts"
		ls.Formula = []string{"Rn = Fnv·Ab·n·ns", "Ab = π·d²/4"}
		where = []string{"n is the number of bolts and ns the shear planes of each"}
		lj := ""
		if k := v.raw("long_joint_factor"); k != 0 && k < 1 {
			long, _ := c.Edition.LongJoint()
			lj = fmt.Sprintf(", reduced by the factor %.3f: the pattern is %s long, over %s", k, v.q("pattern_length"), f.length(long))
		}
		ls.Steps = []string{
			fmt.Sprintf("Ab = π(%s)²/4 = %s", f.length(c.Bolt.D), v.q("Ab")),
			fmt.Sprintf("Fnv = %s for %s, threads %s%s", v.q("Fnv"), c.Bolt.Grade.Name, c.Bolt.Threads, lj),
		}
		if ff := v.raw("filler_factor"); v.has("filler_factor") && ff < 1 {
			ls.Formula = []string{"Rn = Fnv·Ab·n·ns·ff", "Ab = π·d²/4", fillerFormula(f.sys)}
			where = append(where, "ff is the filler factor for bolts through fillers over "+fillerLimit(f.sys)+
				" thick that are not developed, t the total thickness of the fillers (J5.2(a))")
			ls.Steps = append(ls.Steps, fillerStep(f, v),
				fmt.Sprintf("Rn = (%s)(%s)(%s)(%s)(%.3f) = %s", v.q("Fnv"), v.q("Ab"), v.q("n"), v.q("planes"), ff, f.force(x.Nominal)))
		} else {
			ls.Steps = append(ls.Steps, fmt.Sprintf("Rn = (%s)(%s)(%s)(%s) = %s", v.q("Fnv"), v.q("Ab"), v.q("n"), v.q("planes"), f.force(x.Nominal)))
		}

	case "bolts.slip":
		ls.Title = "Slip resistance of the slip-critical joint"
		ls.Formula = []string{"Rn = μ·Du·hf·Tb·ns·n"}
		where = []string{"μ is the mean slip coefficient of the faying surface, Du the ratio of mean installed to minimum pretension, hf the filler factor, Tb the minimum pretension, ns the slip planes and n the bolts; φ and Ω go by hole type, the most severe hole in the joint governing"}
		ls.Steps = []string{
			fmt.Sprintf("Rn = (%.2f)(%.2f)(%.2f)(%s)(%s)(%s) = %s", v.raw("mu"), v.raw("Du"), v.raw("hf"), v.q("Tb"), v.q("ns"), v.q("n"), f.force(x.Nominal)),
		}

	case "bolts.group":
		ls.Title = "Strength of the bolt group, bolt by bolt"
		ls.Formula = []string{"Rn = Σ min(rn,shear; rn,member; rn,plate), over the bolts"}
		where = []string{"rn,shear = Fnv·Ab·ns is the shear strength of one bolt; rn,member and rn,plate are the bearing or tearout strengths of its holes, from the bearing checks"}
		ls.Steps = []string{
			"rn,shear = " + v.q("rn_shear") + " per bolt",
			fmt.Sprintf("Rn = Σ over %s bolts (table) = %s", v.q("n"), f.force(x.Nominal)),
		}
		if ff := v.raw("filler_factor"); v.has("filler_factor") && ff < 1 {
			where[0] = "rn,shear = Fnv·Ab·ns·ff is the shear strength of one bolt, ff the filler factor of J5.2(a) (see bolts.shear)" +
				strings.TrimPrefix(where[0], "rn,shear = Fnv·Ab·ns is the shear strength of one bolt")
			ls.Steps[0] = fmt.Sprintf("rn,shear = %s per bolt, with the filler factor ff = %.3f (J5.2(a))", v.q("rn_shear"), ff)
		}
		mb, hasM := byID["member.bearing"]
		pb, hasP := byID["plate.bearing"]
		if hasM && len(mb.PerBolt) == len(c.Holes) {
			fu := f.unitLabel(units.DimForce)
			tb := &table{Head: []string{"hole", "shear " + fu, "member " + fu}}
			if hasP {
				tb.Head = append(tb.Head, "plate "+fu)
			}
			tb.Head = append(tb.Head, "least "+fu, "governed by")
			shear := units.Force(v.raw("rn_shear"))
			for i, h := range c.Holes {
				rn, by := shear, "bolt shear"
				cells := []string{h.ID, f.num(float64(shear), units.DimForce), f.num(float64(mb.PerBolt[i].Rn), units.DimForce)}
				if mb.PerBolt[i].Rn < rn {
					rn, by = mb.PerBolt[i].Rn, "member "+mb.PerBolt[i].Governed
				}
				if hasP && len(pb.PerBolt) == len(c.Holes) {
					cells = append(cells, f.num(float64(pb.PerBolt[i].Rn), units.DimForce))
					if pb.PerBolt[i].Rn < rn {
						rn, by = pb.PerBolt[i].Rn, "plate "+pb.PerBolt[i].Governed
					}
				}
				cells = append(cells, f.num(float64(rn), units.DimForce), by)
				tb.Rows = append(tb.Rows, tableRow{Cells: cells})
			}
			ls.PerBolt = tb
			ls.PerBoltTitle = "Bolt by bolt"
		}

	case "member.combined":
		combinedSection(c, f, x, v, &ls)
		return ls

	default:
		ls.Title = x.ID
		ls.Steps = []string{"this report has no formula on file for " + x.ID + ": the values it used are listed below"}
	}

	ls.Where = strings.Join(where, "; ")

	// Nominal, factor, available, demand, ratio.
	fac := factorOf(c.Edition, x, v)
	ls.Result = []row{{"Nominal strength Rn", f.force(x.Nominal)}}
	if c.Method == rules.ASD {
		ls.Result = append(ls.Result,
			row{"Safety factor Ω", fmt.Sprintf("%.2f", fac.Omega)},
			row{"Available strength Rn/Ω", fmt.Sprintf("%s / %.2f = %s", f.force(x.Nominal), fac.Omega, f.force(x.Available))},
			row{"Required strength Ra", f.force(x.Demand)},
			row{"Ratio Ra / (Rn/Ω)", fmt.Sprintf("%s / %s = %s", f.num(float64(x.Demand), units.DimForce), f.num(float64(x.Available), units.DimForce), ratioText(x.Ratio))})
	} else {
		ls.Result = append(ls.Result,
			row{"Resistance factor φ", fmt.Sprintf("%.2f", fac.Phi)},
			row{"Available strength φRn", fmt.Sprintf("(%.2f)(%s) = %s", fac.Phi, f.force(x.Nominal), f.force(x.Available))},
			row{"Required strength Ru", f.force(x.Demand)},
			row{"Ratio Ru / φRn", fmt.Sprintf("%s / %s = %s", f.num(float64(x.Demand), units.DimForce), f.num(float64(x.Available), units.DimForce), ratioText(x.Ratio))})
	}
	verdict := "passes: ratio ≤ 1.0"
	if !x.Pass {
		verdict = "FAILS: ratio > 1.0"
	}
	ls.Result = append(ls.Result, row{"Result", verdict}, row{"Clause", "AISC " + strings.TrimPrefix(c.Edition.Name, "aisc") + " " + x.Clause})

	ls.Values = valuesTable(c, f, x)
	return ls
}

// combinedSection fills the section of member.combined: the bar under its
// tension and the moment of an eccentric bolt group, H1.2 with F11 and D2.
// Its result is an interaction, not a strength with one φ, so it prints
// its own result rows.
func combinedSection(c *engine.Connection, f fmtr, x engine.Result, v vals, ls *limitSection) {
	lrfd := c.Method == rules.LRFD
	fb := c.Edition.FlexureFactor()
	ls.Title = "Tension with the moment of the eccentric bolt group (flat bar)"
	mc := fmt.Sprintf("Mc = φb·Mn, φb = %.2f", fb.Phi)
	pc := "Pc = min(φt·Fy·Ag, φt·Fu·Ae)"
	ru, rc := "Ru", "φRn"
	if !lrfd {
		mc = fmt.Sprintf("Mc = Mn/Ωb, Ωb = %.2f", fb.Omega)
		pc = "Pc = min(Fy·Ag/Ωt, Fu·Ae/Ωt)"
		ru, rc = "Ra", "Rn/Ω"
	}
	ls.Formula = []string{
		"Mr = Pr·e, e = |ȳ − d/2|",
		pc,
		"Mn = Mp = Fy·Z ≤ k·Fy·Sx, Z = t·d²/4, Sx = t·d²/6",
		mc,
		"Eq. H1-1a, Pr/Pc ≥ 0.2: Pr/Pc + (8/9)·Mr/Mc ≤ 1.0",
		"Eq. H1-1b, Pr/Pc < 0.2: Pr/(2Pc) + Mr/Mc ≤ 1.0",
		"ratio = max(H1-1a, H1-1b) = Pr / (largest force allowed at e)",
	}
	ls.Where = "ȳ is the mean y of the holes (every bolt the same, each an equal share); d the bar's width, the depth in the plane of bending; " +
		"the two equations bound one region, so the larger passes exactly when the one H1.2 selects does, and Pr over it is the force the interaction allows; " +
		"within the connection the bolts and the plate brace the bar, Lb = 0, F11.2(a): no lateral-torsional buckling"
	eq := "H1-1a (Pr/Pc ≥ 0.2)"
	if v.raw("H1_eq") == 2 {
		eq = "H1-1b (Pr/Pc < 0.2)"
	}
	pr, mr := v.raw("Pr_Pc"), v.raw("Mr_Mc")
	ls.Steps = []string{
		fmt.Sprintf("e = |%s − %s/2| = %s", v.q("ybar"), v.q("d"), v.q("e")),
		fmt.Sprintf("Mr = (%s)(%s) = %s", v.q("Pr"), v.q("e"), v.q("Mr")),
		fmt.Sprintf("Pc = min(%s, %s) = %s", v.q("Pc_yield"), v.q("Pc_rupture"), v.q("Pc")),
		fmt.Sprintf("Z = (%s)(%s)²/4 = %s; Sx = (%s)(%s)²/6 = %s", v.q("t"), v.q("d"), v.q("Z"), v.q("t"), v.q("d"), v.q("S")),
		fmt.Sprintf("Mp = min((%s)(%s), %.1f(%s)(%s)) = %s", v.q("Fy"), v.q("Z"), v.raw("Mp_cap"), v.q("Fy"), v.q("S"), v.q("Mp")),
	}
	if v.raw("LTB_lambda") <= v.raw("LTB_limit") {
		ls.Steps = append(ls.Steps, fmt.Sprintf("Lb = %s: Lb·d/t² = %.1f ≤ 0.08E/Fy = %.1f, F11.2(a): Mn = Mp = %s",
			v.q("Lb"), v.raw("LTB_lambda"), v.raw("LTB_limit"), v.q("Mn")))
	} else {
		ls.Steps = append(ls.Steps, fmt.Sprintf("Lb = %s: Lb·d/t² = %.1f > 0.08E/Fy = %.1f, F11.2: Mn = %s",
			v.q("Lb"), v.raw("LTB_lambda"), v.raw("LTB_limit"), v.q("Mn")))
	}
	if lrfd {
		ls.Steps = append(ls.Steps, fmt.Sprintf("Mc = (%.2f)(%s) = %s", fb.Phi, v.q("Mn"), v.q("Mc")))
	} else {
		ls.Steps = append(ls.Steps, fmt.Sprintf("Mc = %s / %.2f = %s", v.q("Mn"), fb.Omega, v.q("Mc")))
	}
	ls.Steps = append(ls.Steps,
		fmt.Sprintf("Pr/Pc = %s / %s = %.3f; Mr/Mc = %s / %s = %.3f", v.q("Pr"), v.q("Pc"), pr, v.q("Mr"), v.q("Mc"), mr),
		fmt.Sprintf("H1-1a: %.3f + (8/9)(%.3f) = %.3f", pr, mr, v.raw("H1_1a")),
		fmt.Sprintf("H1-1b: %.3f/2 + %.3f = %.3f", pr, mr, v.raw("H1_1b")),
		fmt.Sprintf("H1.2 selects Eq. %s: %.3f", eq, v.raw("H1_value")),
		fmt.Sprintf("ratio = max(%.3f, %.3f) = %s", v.raw("H1_1a"), v.raw("H1_1b"), ratioText(x.Ratio)),
	)
	verdict := "passes: ratio ≤ 1.0"
	if !x.Pass {
		verdict = "FAILS: ratio > 1.0"
	}
	ls.Result = []row{
		{"Interaction, Eq. " + eq, fmt.Sprintf("%.3f (limit 1.0)", v.raw("H1_value"))},
		{"Force allowed at this e, " + rc + " = Pr / ratio", fmt.Sprintf("%s / %s = %s", f.num(float64(x.Demand), units.DimForce), ratioText(x.Ratio), f.force(x.Available))},
		{"The same with Pn and Mn, Rn", f.force(x.Nominal)},
		{"Required strength " + ru, f.force(x.Demand)},
		{"Ratio " + ru + " / " + rc, fmt.Sprintf("%s / %s = %s", f.num(float64(x.Demand), units.DimForce), f.num(float64(x.Available), units.DimForce), ratioText(x.Ratio))},
		{"Result", verdict},
		{"Clause", "AISC " + strings.TrimPrefix(c.Edition.Name, "aisc") + " " + x.Clause + " with D2 and F11"},
	}
	ls.Values = valuesTable(c, f, x)
}

// valuesTable lists a result's intermediate values with what each is.
func valuesTable(c *engine.Connection, f fmtr, x engine.Result) table {
	t := table{Head: []string{"symbol", "value", "what it is"}}
	ff, ft := 1.0, 0.0
	for _, val := range x.Values {
		switch val.Name {
		case "filler_factor":
			ff = val.V
		case "filler_t":
			ft = val.V
		}
	}
	noFiller := ff == 1 && ft == 0
	for _, val := range x.Values {
		if noFiller && (val.Name == "filler_factor" || val.Name == "filler_t") {
			continue // no fillers: nothing to show
		}
		sym := val.Name
		if s, ok := symbols[val.Name]; ok {
			sym = s
		}
		what := meaning[x.ID+":"+val.Name]
		if val.Name == "t" && strings.HasPrefix(x.ID, "member.") && c.Member.Pieces > 1 {
			what = fmt.Sprintf("thickness of the %d angles together", c.Member.Pieces)
		}
		if what == "" {
			what = meaning[val.Name]
		}
		t.Rows = append(t.Rows, tableRow{Cells: []string{sym, f.q(val.V, val.Dim), what}})
	}
	return t
}

var pageTemplate = template.Must(template.New("report").Parse(pageHTML))

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
@page { margin: 14mm; }
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
{{end}}</table>{{end}}

<h2>3. Summary of limit states</h2>
<table id="summary">
<tr><th>limit state</th><th>clause</th><th class="num">Rn {{.ForceUnit}}</th><th class="num">{{.AvailableSymbol}} {{.ForceUnit}}</th><th class="num">{{.DemandSymbol}} {{.ForceUnit}}</th><th class="num">ratio</th><th></th></tr>
{{range .Summary}}<tr class="{{if .Governs}}governs {{end}}{{if not .Pass}}fail{{end}}">
<td><a href="#{{.Anchor}}">{{.ID}}</a><br><span class="note">{{.Title}}</span></td><td>{{.Clause}}</td>
<td class="num">{{.Nominal}}</td><td class="num">{{.Available}}</td><td class="num">{{.Demand}}</td>
<td class="num"><span class="bar"><span style="width: {{.Bar}}%"></span></span>{{.Ratio}}</td>
<td class="nowrap">{{if .Pass}}<span class="ok">ok</span>{{else}}<span class="bad">FAILS</span>{{end}}{{if .Governs}} <span class="badge gov">governs</span>{{end}}</td></tr>
{{end}}</table>

<h2>4. Detailing</h2>
<table id="detailing">
<tr>{{range .Findings.Head}}<th>{{.}}</th>{{end}}</tr>
{{range .Findings.Rows}}<tr class="{{.Class}}">{{range .Cells}}<td>{{.}}</td>{{end}}</tr>
{{end}}</table>

<h2>5. Limit states</h2>
{{range .Limits}}<section class="limit{{if .Governs}} governs{{end}}{{if not .Pass}} fails{{end}}" id="{{.Anchor}}" data-id="{{.ID}}" data-clause="{{.Clause}}">
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
{{end}}

<h2>6. Assumptions</h2>
<ul>
{{range .Assumptions}}<li>{{.}}</li>
{{end}}</ul>

<h2>7. Review</h2>
<p class="note">For the engineer of record: this report is an aid to the design, not the design. Check it against the governing code and the project's own requirements before signing.</p>
<div class="signoff"><div>Prepared by, date</div><div>Checked by, date</div><div>Engineer of record, seal and date</div></div>

<footer>Produced by gaugeline from {{.File}}. {{.Caution}}</footer>
</body>
</html>
`
