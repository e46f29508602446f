package jobfile

import (
	"fmt"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

var memberKeys = append([]string{"shape", "size", "legs", "thickness", "width", "grade", "fy", "fu", "length", "area", "xbar", "rmin", "gap", "eccentricity", "hole", "slot", "far_end"}, memberBucklingKeys...)

func parseShape(s string) (engine.Shape, error) {
	for _, sh := range engine.Shapes() {
		if sh.String() == s {
			return sh, nil
		}
	}
	return engine.Angle, fmt.Errorf("unknown shape %q (want %s)", s, engine.ShapeNames())
}

func parseEccentricity(s string) (engine.EndEccentricity, error) {
	for _, e := range []engine.EndEccentricity{engine.EccentricityNotProvided, engine.EccentricityProvided} {
		if e.String() == s {
			return e, nil
		}
	}
	return engine.EccentricityNotProvided, fmt.Errorf("unknown eccentricity setting %q (want provided or not-provided)", s)
}

func (p *parser) parseMember(n *yaml.Node) error {
	b, err := p.mapping(n, "member", memberKeys)
	if err != nil {
		return err
	}
	m := &p.job.Member
	if !b.has("shape") {
		return p.missing(b, "member.shape", "is required", "shape: "+engine.ShapeNames())
	}
	if m.Shape, err = enum(p, b.vals["shape"], "member.shape", parseShape); err != nil {
		return err
	}
	if err := p.parseSection(b, m); err != nil {
		return err
	}
	if v := b.vals["eccentricity"]; v != nil {
		if !m.Shape.CentredGroup() {
			return p.errAt(v, "member.eccentricity", "eccentricity is for flat bars",
				"J1.7 does not require the bolt group of a single- or double-angle end to lie on the member's gravity axis; remove the key")
		}
		if m.Eccentricity, err = enum(p, v, "member.eccentricity", parseEccentricity); err != nil {
			return err
		}
	}
	if err := p.parseMemberRest(b, m); err != nil {
		return err
	}
	return p.parseFarEndKind(b.vals["far_end"])
}

// parseSection reads the section of member m from block b: a catalog
// size, legs and thickness, or a flat's width and thickness (m.Shape set).
func (p *parser) parseSection(b *block, m *MemberSpec) error {
	var err error
	if fam := RolledFamily(m.Shape); fam != "" {
		if err := p.parseRolledSection(b, m, fam); err != nil {
			return err
		}
	} else if low, _ := m.Shape.FreeEdges(); low { // a bar, given by width and thickness
		for _, k := range []string{"size", "legs", "area", "xbar", "rmin", "gap"} {
			if b.has(k) {
				hint := "a flat bar is given by width and thickness, e.g. width: 6 in, thickness: 1/2 in"
				if k == "gap" {
					hint = "gap is the plate between double angles"
				}
				return p.errAt(b.vals[k], b.sub(k), k+" does not apply to a flat bar", hint)
			}
		}
		for _, k := range []string{"width", "thickness"} {
			if !b.has(k) {
				return p.missing(b, b.sub(k), "is required for a flat bar", "a flat bar is given by width and thickness")
			}
		}
		if m.Width, err = p.length(b.vals["width"], b.sub("width"), positive); err != nil {
			return err
		}
		if m.Thickness, err = p.length(b.vals["thickness"], b.sub("thickness"), positive); err != nil {
			return err
		}
		return nil
	}
	return p.parseAngleSection(b, m)
}

// parseMemberRest reads what follows the section in block b: the steel,
// length, property overrides and buckling keys of member m.
func (p *parser) parseMemberRest(b *block, m *MemberSpec) error {
	return p.parseMemberRestSteel(b, m, true)
}

// parseMemberRestSteel is parseMemberRest, the steel read only when
// steel is set (else m keeps the steel it has).
func (p *parser) parseMemberRestSteel(b *block, m *MemberSpec, steel bool) error {
	var err error
	if steel {
		if m.Steel, err = p.parseSteel(b); err != nil {
			return err
		}
	}
	if b.has("length") {
		if m.Length, err = p.length(b.vals["length"], b.sub("length"), positive); err != nil {
			return err
		}
	}
	if b.has("area") {
		if m.Area, err = p.area(b.vals["area"], b.sub("area")); err != nil {
			return err
		}
	}
	for _, o := range []struct {
		k string
		v *units.Length
	}{{"xbar", &m.Xbar}, {"rmin", &m.Rmin}, {"gap", &m.Gap}} {
		if !b.has(o.k) {
			continue
		}
		if *o.v, err = p.length(b.vals[o.k], b.sub(o.k), positive); err != nil {
			return err
		}
	}
	if m.Hole, err = p.parsePlyHole(b); err != nil {
		return err
	}
	return p.parseMemberBuckling(b, m)
}

// parsePlyHole reads a ply's own hole and slot keys of block b.
func (p *parser) parsePlyHole(b *block) (PlyHole, error) {
	var h PlyHole
	var err error
	if b.has("hole") {
		if h.Type, err = enum(p, b.vals["hole"], b.sub("hole"), rules.ParseHoleType); err != nil {
			return h, err
		}
		h.HasType = true
	}
	if b.has("slot") {
		if h.Slot, err = enum(p, b.vals["slot"], b.sub("slot"), rules.ParseSlotDir); err != nil {
			return h, err
		}
		h.HasSlot = true
	}
	return h, nil
}

// checkPlyHoles rejects a ply's slot direction given for round holes: the
// ply's hole type (its own, else bolts.hole) must be a slot.
func (p *parser) checkPlyHoles() error {
	j := p.job
	check := func(ply string, h PlyHole, t rules.HoleType) error {
		if !h.HasSlot || t.IsSlot() {
			return nil
		}
		from := ply + ".hole"
		if !h.HasType {
			from = "bolts.hole"
		}
		return j.FieldError(ply+".slot", fmt.Sprintf("is for slotted holes, and the %s's holes are %s (%s)", ply, t, from),
			fmt.Sprintf("give %s.hole: short-slot or long-slot, or remove %s.slot", ply, ply))
	}
	mt, _ := j.MemberHole()
	if err := check("member", j.Member.Hole, mt); err != nil {
		return err
	}
	if j.Plate != nil {
		pt, _ := j.PlateHole()
		return check("plate", j.Plate.Hole, pt)
	}
	return nil
}

// RolledFamily is the catalog family whose designation member.size gives
// for a rolled shape other than an angle (engine.CatalogFamily); "" for
// angles and flat bars.
func RolledFamily(s engine.Shape) string {
	f, _ := engine.CatalogFamily(s)
	return f
}

// example is a designation of the shape's catalog family, for a hint.
func example(s engine.Shape) string {
	_, e := engine.CatalogFamily(s)
	return e
}

// parseRolledSection reads the size of a WT, channel or W shape: a
// catalog designation, nothing else describes the section.
func (p *parser) parseRolledSection(b *block, m *MemberSpec, fam string) error {
	for _, k := range []string{"legs", "thickness", "width", "area", "xbar", "rmin", "gap"} {
		if k == "gap" && m.Shape.Pieces() == 2 && !engine.Apart(m.Shape) {
			continue // the plate between the pieces, as for double angles
		}
		if b.has(k) {
			return p.errAt(b.vals[k], b.sub(k), k+" does not apply to a "+m.Shape.String()+" member",
				"a "+fam+" shape is given by its catalog designation, e.g. size: "+example(m.Shape))
		}
	}
	if !b.has("size") {
		return p.missing(b, b.sub("size"), "is required for a "+m.Shape.String()+" member", "size: "+example(m.Shape))
	}
	var err error
	m.Size, err = p.word(b.vals["size"], b.sub("size"))
	return err
}

// parseAngleSection reads size, or legs and thickness, of a single or
// double angle.
func (p *parser) parseAngleSection(b *block, m *MemberSpec) error {
	var err error
	if b.has("width") {
		return p.errAt(b.vals["width"], b.sub("width"), "width is for flat bars",
			"an angle is given by size (e.g. L4x4x1/2), or legs: [4 in, 4 in] and thickness")
	}
	if m.Shape.Pieces() == 1 && b.has("gap") {
		return p.errAt(b.vals["gap"], b.sub("gap"), "gap is for double angles only", "")
	}
	switch {
	case b.has("size") && b.has("legs"):
		return p.errAt(b.vals["legs"], b.sub("legs"), "give either size or legs, not both", "")
	case b.has("size"):
		if b.has("thickness") {
			return p.errAt(b.vals["thickness"], b.sub("thickness"), "the thickness is part of size", "remove thickness, or give legs instead of size")
		}
		if m.Size, err = p.word(b.vals["size"], b.sub("size")); err != nil {
			return err
		}
	case b.has("legs"):
		if !b.has("thickness") {
			return p.errAt(b.vals["legs"], b.sub("thickness"), "is required with legs", "thickness: 1/2 in")
		}
		n := b.vals["legs"]
		if n.Kind != yaml.SequenceNode || len(n.Content) != 2 {
			return p.errAt(n, b.sub("legs"), "want two legs, connected leg first, e.g. [4 in, 3 in]", "")
		}
		for i, c := range n.Content {
			if m.Legs[i], err = p.length(c, fmt.Sprintf("%s[%d]", b.sub("legs"), i), positive); err != nil {
				return err
			}
		}
		if m.Thickness, err = p.length(b.vals["thickness"], b.sub("thickness"), positive); err != nil {
			return err
		}
		if m.Thickness >= min(m.Legs[0], m.Legs[1]) {
			return p.errAt(b.vals["thickness"], b.sub("thickness"), "is not less than the shorter leg", "")
		}
	default:
		return p.missing(b, b.sub("size"), "an angle needs size, or legs and thickness",
			"size: L4x4x1/2 (us) or L100x100x10 (si)")
	}
	return nil
}

// parseSteel reads grade, or fy and fu, of the block b.
func (p *parser) parseSteel(b *block) (SteelSpec, error) {
	var s SteelSpec
	var err error
	hasFy, hasFu := b.has("fy"), b.has("fu")
	switch {
	case b.has("grade") && (hasFy || hasFu):
		k := "fy"
		if !hasFy {
			k = "fu"
		}
		return s, p.errAt(b.vals[k], b.sub(k), "give either grade or fy and fu, not both", "")
	case b.has("grade"):
		s.Grade, err = p.word(b.vals["grade"], b.sub("grade"))
		return s, err
	case hasFy != hasFu:
		given, missing := "fy", "fu"
		if hasFu {
			given, missing = "fu", "fy"
		}
		return s, p.errAt(b.vals[given], b.sub(missing), "is required with "+given, "give both fy and fu, or a catalog grade")
	case !hasFy:
		return s, p.missing(b, b.sub("grade"), "is required", "grade: A36, A572-50, … or fy and fu")
	}
	if s.Fy, err = p.stress(b.vals["fy"], b.sub("fy")); err != nil {
		return s, err
	}
	if s.Fu, err = p.stress(b.vals["fu"], b.sub("fu")); err != nil {
		return s, err
	}
	if s.Fu <= s.Fy {
		return s, p.errAt(b.vals["fu"], b.sub("fu"), "must be greater than fy", "fu is the tensile strength, fy the yield stress")
	}
	return s, nil
}
