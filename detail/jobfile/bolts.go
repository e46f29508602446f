package jobfile

import (
	"fmt"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

var boltKeys = []string{"diameter", "grade", "threads", "joint", "surface", "fillers", "filler_thickness", "filler_developed",
	"hole", "slot", "deformation", "lines", "per_line", "pitch", "end", "gage", "gage2", "stagger"}

// patternKeys are the bolts keys that generate hole centres.
var patternKeys = []string{"lines", "per_line", "pitch", "end", "gage", "gage2", "stagger"}

func parseDeformation(s string) (bool, error) {
	switch s {
	case "considered":
		return true, nil
	case "not-considered":
		return false, nil
	}
	return true, fmt.Errorf("unknown deformation setting %q (want considered or not-considered)", s)
}

// parseBolts reads the bolts block: the bolt, its fillers, the hole type
// and the pattern, in that order. Without the block only the defaults are
// set.
func (p *parser) parseBolts(n *yaml.Node) error {
	bs := &p.job.Bolts
	bs.DeformationConsidered = true
	bs.Lines = 1
	if n == nil {
		return nil
	}
	b, err := p.mapping(n, "bolts", boltKeys)
	if err != nil {
		return err
	}
	if err := p.parseBolt(b, bs); err != nil {
		return err
	}
	if err := p.parseFiller(b, bs); err != nil {
		return err
	}
	if err := p.parseBoltHole(b, bs); err != nil {
		return err
	}
	return p.parsePattern(b, bs)
}

// parseBolt reads the bolt itself: diameter, grade, threads, joint,
// faying surface and the count of fillers.
func (p *parser) parseBolt(b *block, bs *BoltSpec) error {
	var err error
	if b.has("diameter") {
		v := b.vals["diameter"]
		s, err := p.word(v, "bolts.diameter")
		if err != nil {
			return err
		}
		if bs.Diameter, err = units.ParseBoltDiameter(s, p.sys()); err != nil {
			return p.errAt(v, "bolts.diameter", err.Error(), `write a diameter such as "3/4 in", "20 mm" or "M20"`)
		}
		if !(bs.Diameter > 0) || bs.Diameter >= 10*units.Inch {
			return p.errAt(v, "bolts.diameter", "is not a bolt diameter", "bolt diameters run from 1/2 in (M12) to 1-1/2 in (M36)")
		}
	}
	var sp rules.BoltSpelling
	if b.has("grade") {
		if bs.Grade, err = p.word(b.vals["grade"], "bolts.grade"); err != nil {
			return err
		}
		if sp, err = rules.ParseBoltSpelling(bs.Grade); err != nil {
			return p.errAt(b.vals["grade"], "bolts.grade", err.Error(), "e.g. A325, A325-N, A325-X, A325-SC, F3125 A490, A325M")
		}
		bs.Grade = sp.Grade
	}
	if b.has("threads") {
		if bs.Threads, err = enum(p, b.vals["threads"], "bolts.threads", rules.ParseThreads); err != nil {
			return err
		}
	}
	if b.has("joint") {
		if bs.Joint, err = enum(p, b.vals["joint"], "bolts.joint", rules.ParseJoint); err != nil {
			return err
		}
	}
	if err := p.impliedByGrade(b, bs, sp); err != nil {
		return err
	}
	if b.has("surface") {
		if bs.Surface, err = enum(p, b.vals["surface"], "bolts.surface", rules.ParseSlipClass); err != nil {
			return err
		}
	}
	if b.has("fillers") {
		v := b.vals["fillers"]
		if v.Kind == yaml.ScalarNode && strings.TrimSpace(v.Value) == "2+" {
			p.job.Raw["bolts.fillers"] = v.Value
			p.job.lines["bolts.fillers"] = v.Line
			bs.Fillers = 2
		} else if bs.Fillers, err = p.integer(v, "bolts.fillers", 0, maxFillers); err != nil {
			err.(*InputError).Hint = "fillers counts the fillers (0, 1 or 2+); give their thickness as filler_thickness"
			return err
		}
	}
	return nil
}

// impliedByGrade fills in the threads and the joint a grade's suffix
// implies (A325-X: threads excluded; A325-SC: slip-critical) and refuses
// a bolts.threads or bolts.joint that says otherwise.
func (p *parser) impliedByGrade(b *block, bs *BoltSpec, sp rules.BoltSpelling) error {
	g := b.vals["grade"]
	if sp.Threads != nil {
		if b.has("threads") && bs.Threads != *sp.Threads {
			return p.errAt(g, "bolts.grade", fmt.Sprintf("%q says the threads are %s, and bolts.threads says %s", g.Value, *sp.Threads, bs.Threads),
				"give the grade without its suffix, or make bolts.threads agree")
		}
		bs.Threads = *sp.Threads
	}
	if sp.Joint != nil {
		if b.has("joint") && bs.Joint != *sp.Joint {
			return p.errAt(g, "bolts.grade", fmt.Sprintf("%q says the joint is %s, and bolts.joint says %s", g.Value, *sp.Joint, bs.Joint),
				"give the grade without its suffix, or make bolts.joint agree")
		}
		bs.Joint = *sp.Joint
	}
	return nil
}

// parseBoltHole reads the hole type and slot direction both plies take
// unless they give their own, and whether deformation at the bolt holes
// is a design consideration.
func (p *parser) parseBoltHole(b *block, bs *BoltSpec) error {
	var err error
	if b.has("hole") {
		if bs.Hole, err = enum(p, b.vals["hole"], "bolts.hole", rules.ParseHoleType); err != nil {
			return err
		}
	}
	if b.has("slot") {
		if bs.Slot, err = enum(p, b.vals["slot"], "bolts.slot", rules.ParseSlotDir); err != nil {
			return err
		}
	}
	if b.has("deformation") {
		if bs.DeformationConsidered, err = enum(p, b.vals["deformation"], "bolts.deformation", parseDeformation); err != nil {
			return err
		}
	}
	return nil
}

// parsePattern reads the pattern keys: lines, bolts per line, and the
// pitch, end, gage and stagger distances.
func (p *parser) parsePattern(b *block, bs *BoltSpec) error {
	var err error
	if b.has("lines") {
		if bs.Lines, err = p.integer(b.vals["lines"], "bolts.lines", 1, maxLines); err != nil {
			return err
		}
	}
	if b.has("per_line") {
		if bs.PerLine, err = p.integer(b.vals["per_line"], "bolts.per_line", 1, maxPerLine); err != nil {
			return err
		}
		if bs.Lines*bs.PerLine > MaxHoles {
			return p.errAt(b.vals["per_line"], "bolts.per_line", fmt.Sprintf("%d lines of %d make %d bolts (at most %d)",
				bs.Lines, bs.PerLine, bs.Lines*bs.PerLine, MaxHoles), "")
		}
	}
	for _, o := range []struct {
		k string
		v *units.Length
		r lengthRule
	}{
		{"pitch", &bs.Pitch, positive},
		{"end", &bs.End, positive},
		{"gage", &bs.Gage, positive},
		{"gage2", &bs.Gage2, positive},
		{"stagger", &bs.Stagger, nonNegative},
	} {
		if !b.has(o.k) {
			continue
		}
		if *o.v, err = p.length(b.vals[o.k], b.sub(o.k), o.r); err != nil {
			return err
		}
	}
	return nil
}

func parseFlag(s string) (bool, error) {
	switch s {
	case "true":
		return true, nil
	case "false":
		return false, nil
	}
	return false, fmt.Errorf("want true or false, not %q", s)
}

// parseFiller reads filler_thickness, the total thickness of the fillers
// at a shear plane (J5.2), and filler_developed (J5.2(b)).
func (p *parser) parseFiller(b *block, bs *BoltSpec) error {
	var err error
	if v := b.vals["filler_thickness"]; v != nil {
		if bs.FillerThickness, err = p.length(v, "bolts.filler_thickness", nonNegative); err != nil {
			return err
		}
		if bs.FillerThickness >= maxFillerThickness {
			return p.errAt(v, "bolts.filler_thickness", "is absurdly thick for a filler (6 in, 150 mm, or more)",
				"the total thickness of the fillers at one shear plane, e.g. 1/2 in; check the unit")
		}
		if bs.FillerThickness > 0 && b.has("fillers") && bs.Fillers == 0 {
			return p.errAt(v, "bolts.filler_thickness", "is given but bolts.fillers is 0",
				"give fillers: 1 (or 2+), or remove filler_thickness")
		}
	}
	if v := b.vals["filler_developed"]; v != nil {
		if bs.FillerDeveloped, err = enum(p, v, "bolts.filler_developed", parseFlag); err != nil {
			return err
		}
		if bs.FillerDeveloped && bs.FillerThickness == 0 {
			return p.errAt(v, "bolts.filler_developed", "says the fillers are developed but bolts.filler_thickness gives none",
				"give filler_thickness, the total thickness of the fillers at one shear plane")
		}
	}
	return nil
}

func (p *parser) parseHoles(n *yaml.Node) error {
	items, err := p.list(n, "holes", "[[1.5 in, 2.5 in], [4.5 in, 2.5 in]]", MaxHoles)
	if err != nil {
		return err
	}
	// Explicit holes replace the pattern: a pattern key alongside is a
	// contradiction, not a default.
	for _, k := range patternKeys {
		if path := "bolts." + k; p.job.Given(path) {
			return &InputError{File: p.job.File, Line: p.job.Line(path), Field: path,
				Msg:  k + " cannot be used with explicit holes",
				Hint: "remove bolts." + k + ", or remove the holes list to use the pattern"}
		}
	}
	p.job.Holes = make([]HoleCentre, len(items))
	for i, it := range items {
		path := fmt.Sprintf("holes[%d]", i)
		p.job.lines[path] = it.Line
		if it.Kind != yaml.SequenceNode || len(it.Content) != 2 {
			return p.errAt(it, path, "want a hole centre [x, y]", "e.g. - [1.5 in, 2.5 in]: x from the member end, y from the heel or edge")
		}
		var xy [2]units.Length
		for c, name := range []string{"x", "y"} {
			v, err := p.length(it.Content[c], fmt.Sprintf("%s[%d]", path, c), anySign)
			if err != nil {
				e := err.(*InputError)
				e.Field, e.Msg = path, name+" "+e.Msg
				return e
			}
			xy[c] = v
		}
		p.job.Holes[i] = HoleCentre{X: xy[0], Y: xy[1]}
	}
	return nil
}
