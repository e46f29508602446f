package jobfile

import (
	"fmt"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
	"gaugeline/rules/units"
)

var plateKeys = []string{"kind", "thickness", "grade", "fy", "fu", "width", "edge", "length", "outline", "clip", "hole", "slot", "count", "gap", "k", "buckling_length"}

func (p *parser) parsePlate(n *yaml.Node) error {
	b, err := p.mapping(n, "plate", plateKeys)
	if err != nil {
		return err
	}
	pl := &PlateSpec{}
	if b.has("kind") {
		if pl.Kind, err = enum(p, b.vals["kind"], "plate.kind", engine.ParsePlateKind); err != nil {
			return err
		}
	}
	if !b.has("thickness") {
		return p.missing(b, "plate.thickness", "is required", "thickness: 1/2 in, or auto to let propose choose")
	}
	if t := b.vals["thickness"]; t.Kind == yaml.ScalarNode && strings.TrimSpace(t.Value) == "auto" {
		p.job.Raw["plate.thickness"] = t.Value
		p.job.lines["plate.thickness"] = t.Line
		pl.AutoThickness = true
	} else if pl.Thickness, err = p.length(t, "plate.thickness", positive); err != nil {
		return err
	}
	if pl.Steel, err = p.parseSteel(b); err != nil {
		return err
	}
	if b.has("outline") {
		if err := p.parsePlateOutline(b, pl); err != nil {
			return err
		}
	} else if err := p.parsePlateRectangle(b, pl); err != nil {
		return err
	}
	if pl.Hole, err = p.parsePlyHole(b); err != nil {
		return err
	}
	if err := p.parseSplice(b, pl); err != nil {
		return err
	}
	if err := p.parsePlateBuckling(b, pl); err != nil {
		return err
	}
	p.job.Plate = pl
	return nil
}

// DefaultSpliceGap is a splice's gap between the member ends when
// plate.gap is not given: 1/4 in (6 mm). Common practice, no source.
func DefaultSpliceGap(sys units.System) units.Length {
	if sys == units.SI {
		return 6 * units.Millimetre
	}
	return units.Inch / 4
}

// parseSplice reads plate.count and plate.gap, which only a splice has:
// two plates (one each side of the members) or one, and the gap between
// the member ends. A splice plate is the rectangle the two groups, the
// edges and the gap give, so plate.length and plate.outline are refused.
func (p *parser) parseSplice(b *block, pl *PlateSpec) (err error) {
	pl.Count = 1
	if sh := p.job.Member.Shape; sh != nil && engine.Apart(sh) {
		pl.Count = sh.Pieces() // a plate at each piece (a W's flanges)
	}
	if pl.Kind != engine.Splice {
		for _, k := range []string{"count", "gap"} {
			if b.has(k) {
				return p.errAt(b.vals[k], "plate."+k, "is for a splice (plate.kind: splice); this plate is a "+pl.Kind.String(),
					"remove plate."+k+", or set plate.kind: splice")
			}
		}
		return nil
	}
	for _, k := range []string{"length", "outline"} {
		if b.has(k) {
			return p.errAt(b.vals[k], "plate."+k, "cannot be used with plate.kind: splice: the splice plate's length follows from both members' groups, plate.edge and plate.gap",
				"remove plate."+k+"; the splice plate runs plate.edge past each member's last bolt")
		}
	}
	if b.has("count") {
		if pl.Count, err = p.integer(b.vals["count"], "plate.count", 1, 2); err != nil {
			return err
		}
		if sh := p.job.Member.Shape; sh != nil && engine.Apart(sh) && pl.Count != sh.Pieces() {
			return p.errAt(b.vals["count"], "plate.count", fmt.Sprintf("a %s member bolts through each of its %d %ss to a plate of its own: the plate block describes each of the %d plates", sh, sh.Pieces(), engine.PieceName(sh), sh.Pieces()),
				fmt.Sprintf("remove plate.count, or give plate.count: %d", sh.Pieces()))
		}
		if pl.Count == 2 && p.job.Member.Shape != nil && p.job.Member.Shape.Pieces() == 2 && !engine.Apart(p.job.Member.Shape) {
			return p.errAt(b.vals["count"], "plate.count", "a double angle already bolts to one plate between its angles in two shear planes; two splice plates do not fit it",
				"use plate.count: 1 with a double angle, or a flat between two splice plates")
		}
	}
	pl.Gap = DefaultSpliceGap(p.job.Units)
	if b.has("gap") {
		pl.Gap, err = p.length(b.vals["gap"], "plate.gap", nonNegative)
	}
	return err
}

// parsePlateRectangle reads the rectangle: plate.width (required), edge
// and length.
func (p *parser) parsePlateRectangle(b *block, pl *PlateSpec) (err error) {
	if b.has("clip") {
		return p.errAt(b.vals["clip"], "plate.clip", "clips the corners of plate.outline, which is not given",
			"give the plate's outline as plate.outline, its corners clipped by plate.clip")
	}
	if !b.has("width") {
		return p.missing(b, "plate.width", "is required", "the plate's width across the load, e.g. width: 12 in")
	}
	if pl.Width, err = p.length(b.vals["width"], "plate.width", positive); err != nil {
		return err
	}
	if b.has("edge") {
		if pl.Edge, err = p.length(b.vals["edge"], "plate.edge", positive); err != nil {
			return err
		}
	}
	if b.has("length") {
		if pl.Length, err = p.length(b.vals["length"], "plate.length", positive); err != nil {
			return err
		}
	}
	return nil
}

// parsePlateOutline reads plate.outline and plate.clip; the rectangle's
// keys have no meaning beside them.
func (p *parser) parsePlateOutline(b *block, pl *PlateSpec) (err error) {
	for _, k := range []string{"width", "edge", "length"} {
		if b.has(k) {
			return p.errAt(b.vals[k], "plate."+k, "cannot be used with plate.outline: the outline gives the plate's shape",
				"remove plate."+k+", or remove plate.outline to use the rectangle")
		}
	}
	if pl.Outline, err = p.parseOutline(b.vals["outline"]); err != nil {
		return err
	}
	if b.has("clip") {
		pl.Outline, err = p.parseClips(b.vals["clip"], pl.Outline)
	}
	return err
}
