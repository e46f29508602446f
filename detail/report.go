package detail

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"slices"
	"strings"

	"gaugeline/detail/detailing"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// Caution is printed on every report, sheet and README.
const Caution = "Results must be checked against the governing code and approved by the engineer of record; " +
	"local codes and licensed practice prevail. gaugeline is an aid, not a substitute for licensed practice."

// Report is the outcome of checking one design: every limit state, every
// detailing finding and the verdict.
type Report struct {
	Design    *Design
	Results   []engine.Result
	Findings  []detailing.Finding
	Governing int // index of the governing limit state in Results
	// Pass: every limit state and rule passes, at both ends where the far
	// end is checked (Far).
	Pass     bool
	Cautions []string
	// Far is the far end's report where member.far_end is a connection of
	// its own (see ends.go); nil for a mirror or plain far end.
	Far     *Report
	ownPass bool // with Far: this end's own Pass
}

// Check runs every limit state and every detailing check of the design.
func Check(d *Design) (*Report, error) {
	rs, err := engine.Check(&d.Conn)
	if err != nil {
		return nil, err
	}
	r := &Report{Design: d, Results: rs, Findings: findings(d), Governing: engine.Governing(rs)}
	r.Pass = detailing.Passes(r.Findings)
	for _, x := range rs {
		r.Pass = r.Pass && x.Pass
	}
	r.Cautions = cautions(d)
	return r, nil
}

// findings are the design's detailing findings: the member's and the
// plate's, then a splice's member B's (its own section) where they differ
// from the member's, each where-text led by "member B: ".
func findings(d *Design) []detailing.Finding {
	fs := detailing.Check(&d.Conn, d.Info)
	b := d.Conn.MemberBSide()
	if b == nil || d.InfoB == nil {
		return fs
	}
	own := len(fs)
	for _, f := range detailing.Check(b, *d.InfoB) {
		if !slices.Contains(fs[:own], f) {
			f.Where = "member B: " + f.Where
			fs = append(fs, f)
		}
	}
	return fs
}

// CheckFile loads a job file, builds it and checks it (CheckJob, both
// ends): what `check`, `sheet` and `report` all start with. Every error is
// an *InputError.
func CheckFile(path string) (*Report, error) {
	job, err := jobfile.LoadJob(path)
	if err != nil {
		return nil, err
	}
	return CheckJob(job)
}

// GoverningResult returns the limit state with the highest ratio.
func (r *Report) GoverningResult() engine.Result { return r.Results[r.Governing] }

// Failing names every limit state and non-advisory detailing rule that
// fails, each once: limit states first, in the report's order; then the
// far end's (Far) not named yet.
func (r *Report) Failing() []string { return r.failingBoth(r.endFailing()) }

// endFailing is Failing of this end alone.
func (r *Report) endFailing() []string {
	var ids []string
	for _, x := range r.Results {
		if !x.Pass && !slices.Contains(ids, x.ID) {
			ids = append(ids, x.ID)
		}
	}
	for _, f := range r.Findings {
		if !f.Pass && !f.Advisory && !slices.Contains(ids, f.ID) {
			ids = append(ids, f.ID)
		}
	}
	return ids
}

// Verdict is "pass" or "fail".
func (r *Report) Verdict() string {
	if r.Pass {
		return "pass"
	}
	return "fail"
}

// cautions lists the caution line and the assumptions the check made.
func cautions(d *Design) []string {
	c := []string{Caution}
	c = append(c, d.Conn.Edition.Unconfirmed()...)
	switch ps := d.Job.Plate; {
	case d.Conn.Plate == nil:
	case ps != nil && ps.Outline != nil:
		c = append(c, "The plate is the job's outline: the Whitmore section is clipped by it, block shear's planes and "+
			"the edge distances end at its edges, and tearout is measured along each hole's line to it.")
	case ps != nil && ps.Length > 0:
		c = append(c, "The plate is taken as a rectangle of the given width and length centred on the bolt group; "+
			"its side edges are free edges for block shear.")
	default:
		c = append(c, "The plate is taken as a rectangle of the given width centred on the bolt group; "+
			"its side edges are free edges for block shear.")
	}
	if pl := d.Conn.Plate; pl != nil && pl.Kind == engine.Splice {
		c = append(c, spliceCaution(pl, d))
	}
	c = append(c, "Block shear uses Ubs = 1.0 (uniform tension stress); a block that tears out k of the n bolts "+
		"is compared with k/n of the force, the bolts sharing it equally.")
	if cases := d.Conn.Member.Shape.ShearLagCases(); !cases.Has(engine.D31Case1) {
		c = append(c, shearLagCaution(cases))
	}
	c = append(c, compressionCautions(d)...)
	if d.Conn.Member.Shape.CentredGroup() && d.Conn.Member.Eccentricity == engine.EccentricityProvided {
		ed := d.Conn.Edition
		c = append(c, "Eccentric bolt group ("+ed.Clause("J1.7")+", provided for): member.combined checks the bar by "+ed.Clause("H1.2")+
			" for Pr with Mr = Pr·e, e the offset of the group's centre of gravity from the bar's centre line; "+
			"Pc is the lesser of D2 yielding and rupture, Mc = φb·Mp (or Mp/Ωb) of F11 on the gross bar bent in its plane, "+
			"with no lateral-torsional buckling in the connection, where the bolts and the plate brace the bar (Lb = 0); "+
			"the ratio is Pr over the largest force Eqs. H1-1a and H1-1b allow at that e. "+
			"Bending of the member beyond the connection is the member's design.")
	}
	return c
}

// shearLagCaution names the cases of Table D3.1 U is the largest of.
func shearLagCaution(cases engine.D31) string {
	names := []string{"case 2"}
	if cases.Has(engine.D31Case8) {
		names = append(names, "case 8")
	}
	if cases.Has(engine.D31Case7) {
		names = append(names, "case 7 (d of the W; for a tee, of the W it is cut from)")
	}
	return "Shear lag: U is the largest of Table D3.1 " + strings.Join(names, ", ") + " and the D3 bound for open sections."
}

// JSONNum is a float that encodes non-finite values as null.
type JSONNum float64

func (n JSONNum) MarshalJSON() ([]byte, error) {
	if math.IsNaN(float64(n)) || math.IsInf(float64(n), 0) {
		return []byte("null"), nil
	}
	return json.Marshal(float64(n))
}

type jsonLimit struct {
	ID        string             `json:"id"`
	Clause    string             `json:"clause"`
	Nominal   JSONNum            `json:"nominal"`
	Available JSONNum            `json:"available"`
	Demand    JSONNum            `json:"demand"`
	Ratio     JSONNum            `json:"ratio"`
	Pass      bool               `json:"pass"`
	Values    map[string]JSONNum `json:"values"`
	Note      string             `json:"note,omitempty"`
	PerBolt   []jsonBolt         `json:"per_bolt,omitempty"`
	// Case is "compression" for the compression case's limit states.
	Case string `json:"case,omitempty"`
}

type jsonBolt struct {
	Hole     string  `json:"hole"`
	Lc       JSONNum `json:"lc"`
	Bearing  JSONNum `json:"bearing"`
	Tearout  JSONNum `json:"tearout"`
	Rn       JSONNum `json:"rn"`
	Governed string  `json:"governs"`
}

type jsonFinding struct {
	ID       string  `json:"id"`
	Clause   string  `json:"clause"`
	Measured JSONNum `json:"measured"`
	Limit    JSONNum `json:"limit"`
	Unit     string  `json:"unit"`
	Pass     bool    `json:"pass"`
	Advisory bool    `json:"advisory"`
	Where    string  `json:"where"`
}

type jsonHole struct {
	ID       string  `json:"id"`
	X        JSONNum `json:"x"`
	Y        JSONNum `json:"y"`
	Diameter JSONNum `json:"diameter"`
	Length   JSONNum `json:"length,omitempty"`
	Type     string  `json:"type"`
	Slot     string  `json:"slot,omitempty"`
	// Plate is the hole in the plate's ply where it differs from the
	// member's (the fields above).
	Plate *jsonPlyHole `json:"plate,omitempty"`
}

type jsonPlyHole struct {
	Diameter JSONNum `json:"diameter"`
	Length   JSONNum `json:"length,omitempty"`
	Type     string  `json:"type"`
	Slot     string  `json:"slot,omitempty"`
}

// Document is the check report as JSON (SPEC §9): the reverify and
// propose documents embed it.
type Document struct {
	Mark        string       `json:"mark"`
	Standard    string       `json:"standard"`
	Method      string       `json:"method"`
	Units       string       `json:"units"`
	UnitLabels  units.Labels `json:"unit_labels"`
	Demand      JSONNum      `json:"demand"`
	Combination string       `json:"combination,omitempty"`
	// Compression is the required compressive strength where the member
	// pushes too, and the combination that gives it.
	Compression            *JSONNum      `json:"compression,omitempty"`
	CompressionCombination string        `json:"compression_combination,omitempty"`
	Verdict                string        `json:"verdict"`
	Governing              string        `json:"governing"`
	GoverningRatio         JSONNum       `json:"governing_ratio"`
	Failing                []string      `json:"failing"` // Report.Failing; [] when it passes
	LimitStates            []jsonLimit   `json:"limit_states"`
	Detailing              []jsonFinding `json:"detailing"`
	Holes                  []jsonHole    `json:"holes"`
	// MemberB is a splice's member beyond the joint where member_b gives
	// it a section of its own (its limit states are member_b.*).
	MemberB *jsonMemberB `json:"member_b,omitempty"`
	// Ends and GoverningEnd are there where the far end is a connection of
	// its own (ends.go): each end's results; the fields above are the
	// governing end's, verdict and failing the whole member's.
	Ends         []jsonEnd `json:"ends,omitempty"`
	GoverningEnd string    `json:"governing_end,omitempty"`
	Cautions     []string  `json:"cautions"`
	Stamp        string    `json:"stamp,omitempty"` // Job.Stamp: the run that wrote the file set
}

// jsonMemberB is member B's section and steel.
type jsonMemberB struct {
	Designation string  `json:"designation"`
	Grade       string  `json:"grade"`
	Area        JSONNum `json:"area"`
}

// Document converts the report to the JSON contract of SPEC §9, every
// value in the job's units. With a far end of its own the results are the
// governing end's, the verdict and failing list the whole member's, and
// ends lists each end's.
func (r *Report) Document() Document {
	doc := r.GoverningEnd().endDocument()
	doc.Mark, doc.Stamp, doc.Cautions = r.Design.Job.Mark, r.Design.Job.Stamp, r.Cautions
	doc.Verdict, doc.Failing = r.Verdict(), r.Failing()
	if doc.Failing == nil {
		doc.Failing = []string{}
	}
	r.endsDocument(&doc)
	return doc
}

// endDocument is the document of this end alone.
func (r *Report) endDocument() Document {
	d := r.Design
	sys := d.Job.Units
	force := func(f units.Force) JSONNum { return JSONNum(sys.ToJob(float64(f), units.DimForce)) }
	length := func(l units.Length) JSONNum { return JSONNum(sys.ToJob(float64(l), units.DimLength)) }
	g := r.GoverningResult()
	doc := Document{
		Mark: d.Job.Mark, Standard: d.Conn.Edition.Name(), Method: d.Conn.Method.String(), Units: sys.String(),
		UnitLabels: sys.Labels(), Demand: force(d.Conn.Demand), Combination: d.Combination,
		Verdict: r.Verdict(), Governing: g.ID, GoverningRatio: JSONNum(g.Ratio), Failing: r.endFailing(),
		LimitStates: []jsonLimit{}, Detailing: []jsonFinding{}, Holes: []jsonHole{}, Cautions: r.Cautions,
		Stamp: d.Job.Stamp,
	}
	if doc.Failing == nil {
		doc.Failing = []string{}
	}
	if d.Conn.Compression > 0 {
		c := force(d.Conn.Compression)
		doc.Compression, doc.CompressionCombination = &c, d.CompressionCombination
	}
	if b := d.Conn.MemberB; b != nil {
		doc.MemberB = &jsonMemberB{Designation: d.InfoB.Designation, Grade: d.InfoB.Grade,
			Area: JSONNum(sys.ToJob(float64(b.Ag), units.DimArea))}
	}
	for _, x := range r.Results {
		l := jsonLimit{ID: x.ID, Clause: x.Clause, Nominal: force(x.Nominal), Available: force(x.Available),
			Demand: force(x.Demand), Ratio: JSONNum(x.Ratio), Pass: x.Pass, Values: map[string]JSONNum{}, Note: x.Note, Case: x.Case}
		for _, v := range x.Values {
			l.Values[v.Name] = JSONNum(sys.ToJob(v.V, v.Dim))
		}
		for _, b := range x.PerBolt {
			l.PerBolt = append(l.PerBolt, jsonBolt{Hole: b.Hole, Lc: length(b.Lc), Bearing: force(b.Bearing),
				Tearout: force(b.Tearout), Rn: force(b.Rn), Governed: b.Governed})
		}
		doc.LimitStates = append(doc.LimitStates, l)
	}
	for _, f := range r.Findings {
		doc.Detailing = append(doc.Detailing, jsonFinding{ID: f.ID, Clause: f.Clause,
			Measured: JSONNum(sys.ToJob(f.Measured, f.Dim)), Limit: JSONNum(sys.ToJob(f.Limit, f.Dim)),
			Unit: sys.Label(f.Dim), Pass: f.Pass, Advisory: f.Advisory, Where: f.Where})
	}
	ply := func(s engine.HoleShape) jsonPlyHole {
		j := jsonPlyHole{Diameter: length(min(s.Dx, s.Dy)), Type: s.Type.String()}
		if s.Type.IsSlot() {
			j.Length = length(max(s.Dx, s.Dy))
			j.Slot = s.Slot.String()
		}
		return j
	}
	for i := range d.Conn.Holes {
		h := &d.Conn.Holes[i]
		m := ply(h.HoleShape)
		jh := jsonHole{ID: h.ID, X: length(h.X), Y: length(h.Y), Diameter: m.Diameter, Length: m.Length, Type: m.Type, Slot: m.Slot}
		if d.Conn.Plate != nil && h.PliesDiffer() {
			p := ply(*h.Plate)
			jh.Plate = &p
		}
		doc.Holes = append(doc.Holes, jh)
	}
	return doc
}

// JSON returns the report as indented JSON (SPEC §9), ending in a newline.
func (r *Report) JSON() ([]byte, error) {
	var b bytes.Buffer
	enc := json.NewEncoder(&b)
	enc.SetIndent("", "  ")
	if err := enc.Encode(r.withBOM(r.Document())); err != nil {
		return nil, fmt.Errorf("detail: encoding report: %w", err)
	}
	return b.Bytes(), nil
}

// spliceCaution says what a splice's check assumes: member B is member A
// again, mirrored, so one set of results holds for both; or member_b's own
// section, checked apart.
func spliceCaution(pl *engine.Plate, d *Design) string {
	s := "Splice: the job describes one member; the member beyond the joint is taken as the same section with the same bolt group, " +
		"mirrored about the joint, so the member's results (at its end) and the plate's bearing and block shear hold for both members. " +
		"The splice plate's net section is the worst path across both groups."
	if d.Conn.MemberB != nil {
		s = "Splice: member B, beyond the joint, is " + d.InfoB.Designation + " (member_b) with the member's bolt group mirrored about the joint; " +
			"its own limit states (member_b.*, and the bolt group with its bearing) and its detailing where it differs from the member's are checked " +
			"on its section; the plate's bearing and block shear at its group are those at the member's (the mirror image). " +
			"The splice plate's net section is the worst path across both groups."
	}
	if pl.Plates() == 2 {
		s += " Two splice plates, one each side: the bolts act in two shear planes and the plates' limit states take both plates together (2·t)."
	}
	return s
}

// SpliceLength is a splice plate's length along the load: from its end
// past member A's group (FreeEdge) to its end past member B's, which is
// the mirror of A's about the joint (engine.SpliceHoles): both groups'
// extents, both end distances and the gap.
func SpliceLength(pl *engine.Plate) units.Length { return 2*pl.FreeEdge + pl.Gap }

// compressionCautions say what the compression case assumed, and that a
// seismic system's own provisions are not checked.
func compressionCautions(d *Design) []string {
	var c []string
	if sys := d.Job.SeismicSystem; sys != "" {
		c = append(c, "Seismic: the job declares the member part of a seismic force-resisting system ("+sys+"). "+
			"The seismic provisions (AISC 341: required strengths from the expected strength Ry·Fy of the brace, "+
			"compactness, connection rotation and the gusset's clearance for a hinge) govern it and are outside this tool's checks.")
	}
	conn := &d.Conn
	st := conn.Member.Strut
	if conn.Compression <= 0 || st == nil {
		return c
	}
	ed := conn.Edition
	m := fmt.Sprintf("Compression: the member is checked for the required %s by Chapter E over its length L = member.length with K = %.2f",
		units.Format(float64(conn.Compression), units.DimForce, ed.System(), units.Job), st.K)
	if d.Job.Member.Buckling.K == 0 {
		m += " (member.k not given: 1.0, both ends pinned)"
	}
	switch {
	case st.Kind == engine.StrutAngle:
		m += "; a single angle by " + ed.Clause("E5") + "'s effective slenderness (ends loaded through the same leg, two or more bolts, no load between the ends), which replaces K·L/r"
	case st.BuiltUp:
		m += fmt.Sprintf("; the two pieces by %s's modified slenderness with %d intermediate connectors (%s)", ed.Clause("E6"), st.Connectors, connectorKind(st))
	}
	if st.Kind == engine.StrutFlexural && st.BuiltUp {
		m += "; the doubly symmetric pair's torsional buckling (" + ed.Clause("E4") + ") takes the two pieces as one section (J of both, Cw = Iy·ho²/4 with the pair's Iy), which their connectors must make them"
	}
	c = append(c, m+".")
	if pl := conn.Plate; pl != nil {
		p := fmt.Sprintf("Compression: the plate is checked by %s over its Whitmore section with K = %.2f and the ", ed.Clause("J4.4"), pl.Buckling.K)
		if pl.Buckling.Centre {
			p += "centre length from the Whitmore section to its support"
		} else {
			p += "average of the three lengths from the Whitmore section's ends and centre to its support (Thornton's method)"
		}
		if d.Job.Plate != nil && d.Job.Plate.Buckling.K == 0 {
			p += "; plate.k not given: " + fmt.Sprintf("%.2f", pl.Buckling.K) + " (a gusset: AISC Design Guide 29 after Gross's 1990 tests, for a gusset supported on both edges; a splice plate between two groups: 0.65, from memory)"
		}
		c = append(c, p+". The bolts bear toward the other bolts and the plate's support, not toward the member end.")
	}
	return c
}

// connectorKind says how the pieces' connectors are made, for a caution.
func connectorKind(st *engine.Strut) string {
	if st.SnugTight {
		return "snug-tight (member.connector)"
	}
	return "welded or pretensioned"
}
