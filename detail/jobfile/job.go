package jobfile

import (
	"strings"

	"go.yaml.in/yaml/v3"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
	"gaugeline/rules/words"

	"gonum.org/v1/gonum/spatial/r2"
)

// Job is a parsed job file (SPEC §3). Quantities are in the internal units
// of package units; a zero quantity means "not given" unless a default is
// documented. Field paths in errors and in Raw, Given and Line are dotted
// with 0-based list indices: "bolts.pitch", "member.legs[1]", "holes[2]".
type Job struct {
	File     string // path as given
	Mark     string
	Units    units.System
	Standard string // "aisc360-22" or "aisc360-16"
	Method   rules.Method
	Quantity int
	// SeismicSystem is seismic_system: the seismic force-resisting system
	// the member belongs to ("" none); its provisions (AISC 341) are not
	// checked, and every output says so.
	SeismicSystem string

	Load   Load
	Member MemberSpec
	// MemberB is member_b: a splice's member beyond the joint where it
	// differs from the member (memberb.go); nil: the member mirrored.
	MemberB *MemberSpec
	Plate   *PlateSpec // nil: the member alone is checked
	Bolts   BoltSpec
	// Holes are explicit hole centres in the order given; nil when the
	// pattern in Bolts generates them.
	Holes     []HoleCentre
	Stock     Stock
	Tolerance Tolerance
	// Project is the title block's project data (project:), "" where not
	// given.
	Project Project

	// SHA256 is the hex SHA-256 of the job file's bytes.
	SHA256 string
	// Stamp names the run that writes this job's files (tool version,
	// mode, input hash); "" when nothing is stamped. The caller sets it;
	// the JSON, the HTML report and every DXF of a file set carry it.
	Stamp string
	// ConnectorsChosen says propose chose member.connectors (the job left
	// them to it): the written job gives them.
	ConnectorsChosen bool

	// Raw holds every scalar as written in the file, keyed by field path,
	// so that a rewritten job can re-emit the user's own spelling.
	Raw map[string]string

	lines map[string]int // field path → 1-based line
	// memberB marks a MemberBView: member B in the member's place.
	memberB bool
	root    *yaml.Node // the document node, kept for writing back
}

// Load is the tension demand: the required strength, or service loads the
// tool combines (ASCE 7 basic combinations).
type Load struct {
	// Required is the required tensile strength (factored for LRFD,
	// service for ASD); zero when service loads are given, or when the
	// member only pushes (Compression alone).
	Required units.Force
	// Compression is the required compressive strength, a magnitude
	// (load.compression); zero: none, or combined from the service loads.
	Compression units.Force
	// Service loads are signed: tension positive, compression negative.
	Service engine.ServiceLoads
	// Reverses says which service loads act in either direction
	// (load.reverses: [wind, seismic]).
	Reverses engine.Reverses
}

// Combined reports whether the demand is combined from service loads.
func (l Load) Combined() bool { return l.Required == 0 && l.Compression == 0 }

// SteelSpec names a catalog grade or gives Fy and Fu explicitly.
type SteelSpec struct {
	Grade  string // catalog name; "" when Fy and Fu are given
	Fy, Fu units.Stress
}

// MemberSpec is the tension member as the job describes it.
type MemberSpec struct {
	Shape engine.Shape
	// Size is the catalog designation as written ("" when explicit). A
	// size with the shorter leg first (L4x6x1/2) connects that leg.
	Size      string
	Legs      [2]units.Length // explicit angle legs, connected leg first
	Width     units.Length    // flats
	Thickness units.Length    // explicit angles and flats
	Steel     SteelSpec
	Length    units.Length // 0: not given
	// Overrides of computed properties of ONE angle; 0: computed.
	Area       units.Area
	Xbar, Rmin units.Length
	// Gap is the plate between double angles; 0: the plate thickness, or
	// 3/8 in (10 mm) without a plate.
	Gap units.Length
	// Eccentricity (flats only) says whether the design provides for a
	// bolt group off the bar's centre line (J1.7); default not provided.
	Eccentricity engine.EndEccentricity
	// Hole is the member's own hole type (member.hole, member.slot).
	Hole PlyHole
	// FarEnd is what the member's far end (x = Length) carries
	// (member.far_end); the zero value is the default, a mirror.
	FarEnd FarEndSpec
	// Buckling is how the member buckles when it pushes (compression.go).
	Buckling MemberBuckling
}

// PlateSpec is the gusset or splice plate the member bolts to.
type PlateSpec struct {
	Kind      engine.PlateKind
	Thickness units.Length // 0 when AutoThickness
	// AutoThickness: thickness "auto", chosen by propose from the stock.
	AutoThickness bool
	Steel         SteelSpec
	Width         units.Length // across the load
	Edge          units.Length // last bolt to the free edge; 0: not given (propose)
	// Length is plate.length: the rectangle's length along the load, from
	// its free edge back toward −x (past the member's end); 0: not given,
	// the rectangle is open that way (outline.go).
	Length units.Length
	// Outline is plate.outline with plate.clip applied: the plate's true
	// outline in the job frame (mm), in the job's order, closed by itself;
	// nil: the rectangle of Width, Edge and Length.
	Outline []r2.Vec
	// Hole is the plate's own hole type (plate.hole, plate.slot).
	Hole PlyHole
	// Count is plate.count: the number of splice plates, 2 (one each side
	// of the members) or 1 (the default, and every gusset's).
	Count int
	// Gap is plate.gap, a splice's gap between the member ends
	// (DefaultSpliceGap when not given); zero for a gusset.
	Gap units.Length
	// Buckling is plate.k and plate.buckling_length (compression.go).
	Buckling PlateBucklingSpec
}

// PlyHole is one ply's own hole type and slot direction, where the job
// gives them (member.hole and member.slot, plate.hole and plate.slot);
// what it leaves out follows bolts.hole and bolts.slot.
type PlyHole struct {
	Type             rules.HoleType
	Slot             rules.SlotDir
	HasType, HasSlot bool
}

// BoltSpec is the bolts block: the bolt and, unless explicit holes are
// given, the pattern. Diameter, Grade, PerLine, Pitch, End and Gage may be
// absent (zero) in a propose job; Build requires what it needs.
type BoltSpec struct {
	Diameter units.Length
	Grade    string
	Threads  rules.Threads
	Joint    rules.Joint
	Surface  rules.SlipClass
	Fillers  int // 2 means two or more
	// FillerThickness is the total thickness of the fillers at a shear
	// plane (0: none or not given); FillerDeveloped says they are welded or
	// extended and bolted to carry their share (J5.2(b)).
	FillerThickness       units.Length
	FillerDeveloped       bool
	Hole                  rules.HoleType
	Slot                  rules.SlotDir
	DeformationConsidered bool

	Lines   int // default 1
	PerLine int
	Pitch   units.Length
	End     units.Length
	Gage    units.Length
	Gage2   units.Length
	Stagger units.Length
}

// HoleCentre is an explicit hole centre: x from the member end, y from the
// heel (angles) or edge (flats).
type HoleCentre struct{ X, Y units.Length }

// Objective is what propose minimises first.
type Objective int

const (
	FewestBolts    Objective = iota // "bolts"
	ShortestLength                  // "length"
)

// Other is the other objective: the tie-break of this one.
func (o Objective) Other() Objective {
	if o == FewestBolts {
		return ShortestLength
	}
	return FewestBolts
}

var objectives = words.New[Objective]("objective", "bolts", "length")

// String returns the job-file spelling.
func (o Objective) String() string { return objectives.Name(o) }

// parseObjective reads the job-file spelling.
func parseObjective(s string) (Objective, error) { return objectives.Parse(s) }

// Preference is one key of propose's order (stock.prefer).
type Preference int

const (
	PreferUsualGage     Preference = iota // "usual-gage": the leg's usual gage lines
	PreferShort                           // "short-connection": least end + pattern + plate edge
	PreferFewestBolts                     // "fewest-bolts"
	PreferThinnestPlate                   // "thinnest-plate": thinner plate before the governing ratio
)

var preferences = words.New[Preference]("preference", "usual-gage", "short-connection", "fewest-bolts", "thinnest-plate")

// String returns the job-file spelling.
func (pr Preference) String() string { return preferences.Name(pr) }

// parsePreference reads the job-file spelling.
func parsePreference(s string) (Preference, error) { return preferences.Parse(s) }

// Stock is what the shop stocks and prefers (propose only).
type Stock struct {
	Diameters   []units.Length
	Grades      []string
	MaxLines    int          // 0: not given
	MaxPerLine  int          // 0: not given
	Step        units.Length // default 1/4 in (us), 5 mm (si)
	Thicknesses []units.Length
	Objective   Objective
	// Prefer is stock.prefer as written, each preference once; nil when
	// not given (propose's default order: usual gage, then the objective).
	Prefer []Preference
}

// Tolerance is the fabrication tolerance reverify applies. Defaults are
// common practice, no source: ±1/16 in (2 mm) position, 1/32 in (1 mm)
// diameter.
type Tolerance struct {
	Position units.Length
	Diameter units.Length
}

// MemberHole returns the hole type and slot direction of the member's ply:
// member.hole and member.slot, else bolts.hole and bolts.slot. The slot
// direction of a round hole is Transverse.
func (j *Job) MemberHole() (rules.HoleType, rules.SlotDir) { return j.plyHole(j.Member.Hole) }

// PlateHole returns the hole type and slot direction of the plate's ply:
// plate.hole and plate.slot, else bolts.hole and bolts.slot (also without
// a plate block).
func (j *Job) PlateHole() (rules.HoleType, rules.SlotDir) {
	if j.Plate == nil {
		return j.plyHole(PlyHole{})
	}
	return j.plyHole(j.Plate.Hole)
}

func (j *Job) plyHole(h PlyHole) (rules.HoleType, rules.SlotDir) {
	t, dir := j.Bolts.Hole, j.Bolts.Slot
	if h.HasType {
		t = h.Type
	}
	if h.HasSlot {
		dir = h.Slot
	}
	if !t.IsSlot() {
		dir = rules.Transverse
	}
	return t, dir
}

// Given reports whether the job file wrote the scalar at path.
func (j *Job) Given(path string) bool {
	_, ok := j.Raw[path]
	return ok
}

// Line returns the line of path in the job file, or of its nearest
// enclosing field that is written; 0 when unknown.
func (j *Job) Line(path string) int {
	for p := path; ; p = parentPath(p) {
		if l, ok := j.lines[p]; ok {
			return l
		}
		if p == "" {
			return 0
		}
	}
}

// parentPath strips the last key or index of a field path.
func parentPath(p string) string {
	i := strings.LastIndexAny(p, ".[")
	if i < 0 {
		return ""
	}
	return p[:i]
}

// FieldError is an InputError at the field path, on the line the job
// recorded.
func (j *Job) FieldError(path, msg, hint string) *InputError {
	return &InputError{File: j.File, Line: j.Line(path), Field: j.fieldName(path), Msg: msg, Hint: hint}
}

// MaxJobSize is the largest job file read.
const MaxJobSize = 1 << 20

// MaxHoles is the most holes a job may ask for: beyond it the input is a
// typo.
const MaxHoles = 1000
