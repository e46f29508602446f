package jobfile

import (
	"fmt"
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
	"gaugeline/rules/units"
)

// MemberBuckling is how the member buckles when it pushes (load
// compression): the job's member.k, member.truss, member.connectors and
// member.connector.
type MemberBuckling struct {
	// K is the effective length factor; 0: not given (1.0, pinned ends).
	K float64
	// Space: member.truss: space, a web member of a box or space truss
	// (E5(b)); planar (the default) is E5(a).
	Space bool
	// Connectors is the number of intermediate connectors between two
	// pieces back to back (E6), equally spaced; ConnectorTight says they
	// are welded or pretensioned (member.connector: welded | pretensioned)
	// rather than snug-tight (the default, the more conservative E6.1(a)).
	Connectors     int
	ConnectorTight bool
}

// DefaultMemberK is the effective length factor when member.k is not
// given: 1.0, both ends pinned (common practice, no source; the report
// says so).
const DefaultMemberK = 1.0

// PlateBucklingSpec is plate.k and plate.buckling_length.
type PlateBucklingSpec struct {
	K      float64 // 0: not given (engine.DefaultGussetK, DefaultSpliceK)
	Centre bool    // buckling_length: centre (average, Thornton's, is the default)
}

var memberBucklingKeys = []string{"k", "truss", "connectors", "connector"}

// parseMemberBuckling reads member.k, truss, connectors and connector.
func (p *parser) parseMemberBuckling(b *block, m *MemberSpec) (err error) {
	mb := &m.Buckling
	if b.has("k") {
		if mb.K, err = p.factor(b.vals["k"], b.sub("k")); err != nil {
			return err
		}
	}
	if v := b.vals["truss"]; v != nil {
		switch strings.TrimSpace(v.Value) {
		case "planar":
		case "space":
			mb.Space = true
		default:
			return p.errAt(v, b.sub("truss"), fmt.Sprintf("unknown truss %q (want planar or space)", v.Value),
				"planar: an individual member or a web member of a planar truss (E5(a)); space: of a box or space truss (E5(b))")
		}
	}
	pairs := m.Shape != nil && m.Shape.Pieces() == 2
	for _, k := range []string{"connectors", "connector"} {
		if b.has(k) && !pairs {
			return p.errAt(b.vals[k], b.sub(k), k+" is for two pieces back to back (double angles, double channels)", "remove it")
		}
	}
	if b.has("connectors") {
		if mb.Connectors, err = p.integer(b.vals["connectors"], b.sub("connectors"), 0, 50); err != nil {
			return err
		}
	}
	if v := b.vals["connector"]; v != nil {
		switch strings.TrimSpace(v.Value) {
		case "snug-tight":
		case "welded", "pretensioned":
			mb.ConnectorTight = true
		default:
			return p.errAt(v, b.sub("connector"), fmt.Sprintf("unknown connector %q (want snug-tight, pretensioned or welded)", v.Value), "")
		}
	}
	return nil
}

// parsePlateBuckling reads plate.k and plate.buckling_length.
func (p *parser) parsePlateBuckling(b *block, pl *PlateSpec) (err error) {
	if b.has("k") {
		if pl.Buckling.K, err = p.factor(b.vals["k"], "plate.k"); err != nil {
			return err
		}
	}
	if v := b.vals["buckling_length"]; v != nil {
		switch strings.TrimSpace(v.Value) {
		case "average":
		case "centre", "center":
			pl.Buckling.Centre = true
		default:
			return p.errAt(v, "plate.buckling_length", fmt.Sprintf("unknown buckling length %q (want average or centre)", v.Value),
				"average: the mean of the three lengths from the Whitmore section (Thornton's method); centre: the middle one")
		}
	}
	return nil
}

// factor reads an effective length factor: a plain number over 0 and at
// most 10.
func (p *parser) factor(n *yaml.Node, path string) (float64, error) {
	return p.bounded(n, path, units.Dimensionless,
		bound{func(v float64) bool { return v <= 0 }, "must be greater than zero", "an effective length factor, e.g. 1.0 (pinned ends) or 0.5"},
		bound{func(v float64) bool { return v > 10 }, "is absurdly large for an effective length factor", ""})
}

// parseSeismic reads seismic_system: the seismic force-resisting system
// the member belongs to (e.g. SCBF), whose own provisions (AISC 341) the
// tool does not check; the report says so.
func (p *parser) parseSeismic(n *yaml.Node) (err error) {
	p.job.SeismicSystem, err = p.word(n, "seismic_system")
	return err
}

// Pushes reports whether the job's loads compress the member: a required
// compression, or a combination of its service loads that pushes.
func (j *Job) Pushes() bool {
	if j.Load.Compression > 0 {
		return true
	}
	if !j.Load.Combined() {
		return false
	}
	_, c := engine.Demands(j.Method, j.Load.Service, j.Load.Reverses)
	return c.Force > 0
}

// checkCompression asks of a job whose member pushes what its buckling
// needs: the member's length, and a gusset's back edge (plate.length or
// plate.outline) for its buckling length.
func (p *parser) checkCompression() error {
	j := p.job
	if !j.Pushes() {
		return nil
	}
	if j.Member.Length == 0 {
		return &InputError{File: j.File, Line: j.Line("member"), Field: "member.length",
			Msg:  "is required when the member is in compression (load.compression, or a load combination that pushes): its buckling length",
			Hint: "give the member's length between the ends' work points, e.g. length: 12 ft; member.k sets the effective length factor (default 1.0)"}
	}
	if j.MemberB != nil && j.MemberB.Length == 0 {
		return &InputError{File: j.File, Line: j.Line("member_b"), Field: "member_b.length",
			Msg:  "is required when the members are in compression: member B buckles over its own length",
			Hint: "give member B's length between its work points, e.g. length: 12 ft"}
	}
	if pl := j.Plate; pl != nil && pl.Kind == engine.Gusset && pl.Outline == nil && pl.Length == 0 {
		return &InputError{File: j.File, Line: j.Line("plate"), Field: "plate.length",
			Msg:  "is required when the member is in compression: the gusset's buckling length runs from the Whitmore section back to its support",
			Hint: "give plate.length (the rectangle from its free edge back past the member's end) or plate.outline"}
	}
	return nil
}
