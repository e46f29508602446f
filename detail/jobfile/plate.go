package jobfile

import (
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
)

var plateKeys = []string{"kind", "thickness", "grade", "fy", "fu", "width", "edge", "hole", "slot"}

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
	if pl.Hole, err = p.parsePlyHole(b); err != nil {
		return err
	}
	p.job.Plate = pl
	return nil
}
