package jobfile

import (
	"fmt"
	"slices"

	"go.yaml.in/yaml/v3"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

var stockKeys = []string{"diameters", "grades", "max_lines", "max_per_line", "step", "thicknesses", "objective", "prefer"}

// parseStock reads the stock block (propose), with the default step of
// the job's unit system.
func (p *parser) parseStock(n *yaml.Node) error {
	st := &p.job.Stock
	st.Step = units.Inch / 4 // common practice, no source
	if p.sys() == units.SI {
		st.Step = 5 * units.Millimetre // SPEC §3
	}
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "stock", stockKeys)
	if err != nil {
		return err
	}
	if v := b.vals["diameters"]; v != nil {
		if st.Diameters, err = p.stockDiameters(v); err != nil {
			return err
		}
	}
	if v := b.vals["grades"]; v != nil {
		if st.Grades, err = p.stockGrades(v); err != nil {
			return err
		}
	}
	if v := b.vals["max_lines"]; v != nil {
		if st.MaxLines, err = p.integer(v, "stock.max_lines", 1, maxLines); err != nil {
			return err
		}
	}
	if v := b.vals["max_per_line"]; v != nil {
		if st.MaxPerLine, err = p.integer(v, "stock.max_per_line", 1, maxPerLine); err != nil {
			return err
		}
	}
	if v := b.vals["step"]; v != nil {
		if st.Step, err = p.length(v, "stock.step", positive); err != nil {
			return err
		}
	}
	if v := b.vals["thicknesses"]; v != nil {
		if st.Thicknesses, err = p.stockThicknesses(v); err != nil {
			return err
		}
	}
	if v := b.vals["objective"]; v != nil {
		if st.Objective, err = enum(p, v, "stock.objective", parseObjective); err != nil {
			return err
		}
	}
	if v := b.vals["prefer"]; v != nil {
		if b.vals["objective"] != nil {
			return p.errAt(v, "stock.prefer", "orders the search that stock.objective also orders",
				"give one of them: stock.prefer lists fewest-bolts and short-connection in the order wanted")
		}
		if st.Prefer, err = p.stockPrefer(v); err != nil {
			return err
		}
	}
	return nil
}

// stockPrefer reads stock.prefer, a list of distinct preferences.
func (p *parser) stockPrefer(v *yaml.Node) ([]Preference, error) {
	items, err := p.list(v, "stock.prefer", "[usual-gage, fewest-bolts, short-connection]", 4)
	if err != nil {
		return nil, err
	}
	var prs []Preference
	for i, it := range items {
		path := fmt.Sprintf("stock.prefer[%d]", i)
		pr, err := enum(p, it, path, parsePreference)
		if err != nil {
			return nil, err
		}
		if slices.Contains(prs, pr) {
			return nil, p.errAt(it, path, fmt.Sprintf("lists %s twice", pr), "name each preference once")
		}
		prs = append(prs, pr)
	}
	return prs, nil
}

// stockDiameters reads stock.diameters, a list of bolt diameters.
func (p *parser) stockDiameters(v *yaml.Node) ([]units.Length, error) {
	items, err := p.list(v, "stock.diameters", "[3/4 in, 7/8 in]", 50)
	if err != nil {
		return nil, err
	}
	var ds []units.Length
	for i, it := range items {
		path := fmt.Sprintf("stock.diameters[%d]", i)
		s, err := p.word(it, path)
		if err != nil {
			return nil, err
		}
		d, err := units.ParseBoltDiameter(s, p.sys())
		if err != nil {
			return nil, p.errAt(it, path, err.Error(), `write a diameter such as "3/4 in", "20 mm" or "M20"`)
		}
		if !(d > 0) || d >= 10*units.Inch {
			return nil, p.errAt(it, path, "is not a bolt diameter", "")
		}
		ds = append(ds, d)
	}
	return ds, nil
}

// stockGrades reads stock.grades, a list of bolt grades.
func (p *parser) stockGrades(v *yaml.Node) ([]string, error) {
	items, err := p.list(v, "stock.grades", "[A325, A490]", 50)
	if err != nil {
		return nil, err
	}
	var gs []string
	for i, it := range items {
		path := fmt.Sprintf("stock.grades[%d]", i)
		g, err := p.word(it, path)
		if err != nil {
			return nil, err
		}
		// the grade as the trade writes it; a suffix (N, X, SC) says
		// what bolts.threads and bolts.joint say for every grade tried
		sp, err := rules.ParseBoltSpelling(g)
		if err != nil {
			return nil, p.errAt(it, path, err.Error(), "e.g. A325, F3125 A490, A325M")
		}
		if sp.Threads != nil || sp.Joint != nil {
			return nil, p.errAt(it, path, fmt.Sprintf("%q carries a suffix: the stock lists grades", g),
				"list the grade alone (A325) and give bolts.threads or bolts.joint")
		}
		gs = append(gs, sp.Grade)
	}
	return gs, nil
}

// stockThicknesses reads stock.thicknesses, a list of plate thicknesses.
func (p *parser) stockThicknesses(v *yaml.Node) ([]units.Length, error) {
	items, err := p.list(v, "stock.thicknesses", "[3/8 in, 1/2 in]", 50)
	if err != nil {
		return nil, err
	}
	var ts []units.Length
	for i, it := range items {
		t, err := p.length(it, fmt.Sprintf("stock.thicknesses[%d]", i), positive)
		if err != nil {
			return nil, err
		}
		ts = append(ts, t)
	}
	return ts, nil
}

func (p *parser) parseTolerance(n *yaml.Node) error {
	t := &p.job.Tolerance
	// Common practice, no source (REFERENCE.md, fabrication).
	t.Position, t.Diameter = units.Inch/16, units.Inch/32
	if p.sys() == units.SI {
		t.Position, t.Diameter = 2*units.Millimetre, 1*units.Millimetre
	}
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "tolerance", []string{"position", "diameter"})
	if err != nil {
		return err
	}
	if v := b.vals["position"]; v != nil {
		if t.Position, err = p.length(v, "tolerance.position", positive); err != nil {
			return err
		}
	}
	if v := b.vals["diameter"]; v != nil {
		if t.Diameter, err = p.length(v, "tolerance.diameter", positive); err != nil {
			return err
		}
	}
	return nil
}
