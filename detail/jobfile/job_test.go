package jobfile

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Job parsing. Values checked here are the job's own inputs read back:
// the only source needed is the readBack unit definitions (1 in = 25.4 mm,
// 1 kip = 4.4482216152605 kN, 1 ksi = 6.894757293168361 MPa).

func mustParse(t *testing.T, src string) *Job {
	t.Helper()
	j, err := ParseJob("test.yaml", []byte(src))
	if err != nil {
		t.Fatalf("ParseJob: %v", err)
	}
	return j
}

func parseErr(t *testing.T, src string) *InputError {
	t.Helper()
	_, err := ParseJob("test.yaml", []byte(src))
	if err == nil {
		t.Fatalf("ParseJob succeeded, want an error")
	}
	var ie *InputError
	if !errors.As(err, &ie) {
		t.Fatalf("error %v (%T) is not an *InputError", err, err)
	}
	if ie.File != "test.yaml" {
		t.Errorf("File = %q, want test.yaml", ie.File)
	}
	return ie
}

// near compares with a relative tolerance.
func closeTo(got, want, rel float64) bool {
	if want == 0 {
		return math.Abs(got) <= rel
	}
	return math.Abs(got-want) <= rel*math.Abs(want)
}

// readBack is the tolerance for inputs read back: only float rounding.
const readBack = 1e-12

const fullJob = `mark: BR-12
units: us
standard: aisc360-16
method: asd
quantity: 4
load:
  dead: 20 kip
  live: 60 kip
  roof_live: 5 kip
  snow: 6 kip
  rain: 7 kip
  wind: 30 kip
  seismic: 8 kip
member:
  shape: double-angle
  size: L4x4x1/2
  grade: A36
  length: 12 ft
  area: 3.75 in2
  xbar: 1.18 in
  rmin: 0.776 in
  gap: 3/8 in
plate:
  kind: splice
  thickness: 1/2 in
  fy: 50 ksi
  fu: 65 ksi
  width: 12 in
  edge: 1-1/2 in
bolts:
  diameter: 7/8 in
  grade: A490
  threads: excluded
  joint: slip-critical
  surface: B
  fillers: 2+
  hole: long-slot
  slot: longitudinal
  deformation: not-considered
  lines: 2
  per_line: 5
  pitch: 3 in
  end: 1-1/2 in
  gage: 2 in
  gage2: 1-3/4 in
  stagger: 1 in
stock:
  diameters: [3/4 in, 7/8 in, M24]
  grades: [A325, A490]
  max_lines: 2
  max_per_line: 10
  step: 1/8 in
  thicknesses: [3/8 in, 1/2 in]
  objective: length
tolerance:
  position: 1/8 in
  diameter: 1/16 in
`

func TestJobParseEveryField(t *testing.T) {
	j := mustParse(t, fullJob)
	inch, kip, ksi := float64(units.Inch), float64(units.Kip), float64(units.Ksi)
	lengths := []struct {
		name string
		got  units.Length
		want float64 // inches
	}{
		{"member.length", j.Member.Length, 144},
		{"member.xbar", j.Member.Xbar, 1.18},
		{"member.rmin", j.Member.Rmin, 0.776},
		{"member.gap", j.Member.Gap, 0.375},
		{"plate.thickness", j.Plate.Thickness, 0.5},
		{"plate.width", j.Plate.Width, 12},
		{"plate.edge", j.Plate.Edge, 1.5},
		{"bolts.diameter", j.Bolts.Diameter, 0.875},
		{"bolts.pitch", j.Bolts.Pitch, 3},
		{"bolts.end", j.Bolts.End, 1.5},
		{"bolts.gage", j.Bolts.Gage, 2},
		{"bolts.gage2", j.Bolts.Gage2, 1.75},
		{"bolts.stagger", j.Bolts.Stagger, 1},
		{"stock.step", j.Stock.Step, 0.125},
		{"tolerance.position", j.Tolerance.Position, 0.125},
		{"tolerance.diameter", j.Tolerance.Diameter, 0.0625},
	}
	for _, c := range lengths {
		if !closeTo(float64(c.got), c.want*inch, readBack) {
			t.Errorf("%s = %g mm, want %g in", c.name, float64(c.got), c.want)
		}
	}
	forces := []struct {
		name string
		got  units.Force
		want float64 // kip
	}{
		{"dead", j.Load.Service.D, 20}, {"live", j.Load.Service.L, 60}, {"roof_live", j.Load.Service.Lr, 5},
		{"snow", j.Load.Service.S, 6}, {"rain", j.Load.Service.R, 7}, {"wind", j.Load.Service.W, 30},
		{"seismic", j.Load.Service.E, 8},
	}
	for _, c := range forces {
		if !closeTo(float64(c.got), c.want*kip, readBack) {
			t.Errorf("load.%s = %g N, want %g kip", c.name, float64(c.got), c.want)
		}
	}
	if j.Mark != "BR-12" || j.Units != units.US || j.Standard != "aisc360-16" || j.Method != rules.ASD || j.Quantity != 4 {
		t.Errorf("header = %q %v %q %v %d", j.Mark, j.Units, j.Standard, j.Method, j.Quantity)
	}
	if !j.Load.Combined() || j.Load.Required != 0 {
		t.Errorf("load: Combined %v, Required %g", j.Load.Combined(), float64(j.Load.Required))
	}
	m := j.Member
	if m.Shape != engine.DoubleAngle || m.Size != "L4x4x1/2" || m.Steel.Grade != "A36" {
		t.Errorf("member = %v %q %q", m.Shape, m.Size, m.Steel.Grade)
	}
	if !closeTo(float64(m.Area), 3.75*float64(units.SquareInch), readBack) {
		t.Errorf("member.area = %g mm²", float64(m.Area))
	}
	p := j.Plate
	if p.Kind != engine.Splice || p.AutoThickness || p.Steel.Grade != "" ||
		!closeTo(float64(p.Steel.Fy), 50*ksi, readBack) || !closeTo(float64(p.Steel.Fu), 65*ksi, readBack) {
		t.Errorf("plate = %+v", *p)
	}
	b := j.Bolts
	if b.Grade != "A490" || b.Threads != rules.ThreadsExcluded || b.Joint != rules.SlipCritical ||
		b.Surface != rules.ClassB || b.Fillers != 2 || b.Hole != rules.LongSlot || b.Slot != rules.Longitudinal ||
		b.DeformationConsidered || b.Lines != 2 || b.PerLine != 5 {
		t.Errorf("bolts = %+v", b)
	}
	s := j.Stock
	wantD := []float64{0.75 * inch, 0.875 * inch, 24}
	if len(s.Diameters) != 3 {
		t.Fatalf("stock.diameters = %v", s.Diameters)
	}
	for i, d := range s.Diameters {
		if !closeTo(float64(d), wantD[i], readBack) {
			t.Errorf("stock.diameters[%d] = %g mm, want %g", i, float64(d), wantD[i])
		}
	}
	if strings.Join(s.Grades, ",") != "A325,A490" || s.MaxLines != 2 || s.MaxPerLine != 10 ||
		len(s.Thicknesses) != 2 || !closeTo(float64(s.Thicknesses[1]), 0.5*inch, readBack) || s.Objective != ShortestLength {
		t.Errorf("stock = %+v", s)
	}
	// Raw strings and lines, for writing the job back.
	if j.Raw["bolts.end"] != "1-1/2 in" || j.Raw["bolts.fillers"] != "2+" || j.Raw["stock.diameters[2]"] != "M24" {
		t.Errorf("Raw: end %q, fillers %q, stock.diameters[2] %q", j.Raw["bolts.end"], j.Raw["bolts.fillers"], j.Raw["stock.diameters[2]"])
	}
	if j.Line("bolts.pitch") != 42 || j.Line("member") != 14 || j.Line("stock.grades[1]") != 49 || j.Line("") != 1 {
		t.Errorf("lines: bolts.pitch %d, member %d, stock.grades[1] %d, root %d",
			j.Line("bolts.pitch"), j.Line("member"), j.Line("stock.grades[1]"), j.Line(""))
	}
	if !j.Given("bolts.gage2") || j.Given("holes") || j.root == nil {
		t.Errorf("Given/root wrong")
	}
}

const minimalUS = `mark: M1
load:
  required: 95 kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
`

func TestJobDefaults(t *testing.T) {
	for _, c := range []struct {
		name        string
		src         string
		step, pos   units.Length
		diaTol      units.Length
		wantSystem  units.System
		src2Comment string
	}{
		// Step: SPEC §3 (si 5 mm); us 1/4 in and tolerances: common practice, no source.
		{"us", minimalUS, units.Inch / 4, units.Inch / 16, units.Inch / 32, units.US, ""},
		{"si", minimalUS + "units: si\n", 5, 2, 1, units.SI, ""},
	} {
		t.Run(c.name, func(t *testing.T) {
			j := mustParse(t, c.src)
			if j.Units != c.wantSystem || j.Standard != "aisc360-22" || j.Method != rules.LRFD || j.Quantity != 1 {
				t.Errorf("header defaults: %v %q %v %d", j.Units, j.Standard, j.Method, j.Quantity)
			}
			b := j.Bolts
			if b.Lines != 1 || b.Threads != rules.ThreadsIncluded || b.Joint != rules.Bearing || b.Surface != rules.ClassA ||
				b.Fillers != 0 || b.Hole != rules.Standard || b.Slot != rules.Transverse || !b.DeformationConsidered ||
				b.Stagger != 0 || b.Diameter != 0 || b.Grade != "" {
				t.Errorf("bolts defaults = %+v", b)
			}
			if j.Given("bolts.lines") {
				t.Errorf("defaulted lines reported as given")
			}
			if j.Plate != nil || j.Holes != nil {
				t.Errorf("plate %v, holes %v: want none", j.Plate, j.Holes)
			}
			if j.Stock.Step != c.step || j.Stock.Objective != FewestBolts || j.Stock.Diameters != nil {
				t.Errorf("stock defaults = %+v", j.Stock)
			}
			if j.Tolerance.Position != c.pos || j.Tolerance.Diameter != c.diaTol {
				t.Errorf("tolerance defaults = %+v", j.Tolerance)
			}
			if j.Member.Gap != 0 || j.Member.Area != 0 || j.Member.Length != 0 {
				t.Errorf("member defaults = %+v", j.Member)
			}
		})
	}
}

func TestJobBareNumbers(t *testing.T) {
	// units is written last: it is still read first.
	const tmpl = `mark: N1
load:
  required: 95
member:
  shape: flat
  width: 6
  thickness: 0.5
  fy: 50
  fu: 65
plate:
  thickness: 12
  grade: A36
  width: 200
bolts:
  pitch: 75
units: `
	for _, c := range []struct {
		sys                  string
		length, force, stres float64 // internal units of one bare unit
	}{
		{"us", float64(units.Inch), float64(units.Kip), float64(units.Ksi)},
		{"si", 1, float64(units.Kilonewton), 1},
	} {
		t.Run(c.sys, func(t *testing.T) {
			j := mustParse(t, tmpl+c.sys+"\n")
			checks := []struct {
				name      string
				got, want float64
			}{
				{"load.required", float64(j.Load.Required), 95 * c.force},
				{"member.width", float64(j.Member.Width), 6 * c.length},
				{"member.thickness", float64(j.Member.Thickness), 0.5 * c.length},
				{"member.fy", float64(j.Member.Steel.Fy), 50 * c.stres},
				{"member.fu", float64(j.Member.Steel.Fu), 65 * c.stres},
				{"plate.thickness", float64(j.Plate.Thickness), 12 * c.length},
				{"bolts.pitch", float64(j.Bolts.Pitch), 75 * c.length},
			}
			for _, k := range checks {
				if !closeTo(k.got, k.want, readBack) {
					t.Errorf("%s = %g, want %g", k.name, k.got, k.want)
				}
			}
		})
	}
}

func TestJobParseForms(t *testing.T) {
	t.Run("explicit legs and feet-inches", func(t *testing.T) {
		j := mustParse(t, `mark: L1
load: {required: 50 kip}
member:
  shape: angle
  legs: [5 in, 3-1/2 in]
  thickness: 3/8 in
  grade: A36
  length: 3'-6 1/2"
`)
		m := j.Member
		if !closeTo(m.Legs[0].In(), 5, readBack) || !closeTo(m.Legs[1].In(), 3.5, readBack) || !closeTo(m.Thickness.In(), 0.375, readBack) ||
			!closeTo(m.Length.In(), 42.5, readBack) || m.Size != "" {
			t.Errorf("member = %+v", m)
		}
	})
	t.Run("explicit holes", func(t *testing.T) {
		j := mustParse(t, minimalUS+"bolts: {diameter: M20, grade: A325}\nholes:\n  - [1.5 in, 2.5 in]\n  - [40 mm, 2]\n")
		want := []HoleCentre{{1.5 * units.Inch, 2.5 * units.Inch}, {40, 2 * units.Inch}}
		if len(j.Holes) != 2 {
			t.Fatalf("holes = %v", j.Holes)
		}
		for i, h := range j.Holes {
			if !closeTo(float64(h.X), float64(want[i].X), readBack) || !closeTo(float64(h.Y), float64(want[i].Y), readBack) {
				t.Errorf("holes[%d] = %v, want %v", i, h, want[i])
			}
		}
		if !closeTo(float64(j.Bolts.Diameter), 20, readBack) || j.Line("holes[1]") != 11 {
			t.Errorf("diameter %g, holes[1] line %d", float64(j.Bolts.Diameter), j.Line("holes[1]"))
		}
	})
	t.Run("plate thickness auto", func(t *testing.T) {
		j := mustParse(t, minimalUS+"plate: {thickness: auto, grade: A36, width: 10 in}\n")
		if !j.Plate.AutoThickness || j.Plate.Thickness != 0 || j.Raw["plate.thickness"] != "auto" {
			t.Errorf("plate = %+v", *j.Plate)
		}
	})
	t.Run("filler thickness and development", func(t *testing.T) {
		j := mustParse(t, minimalUS+"bolts:\n  fillers: 1\n  filler_thickness: 1/2 in\n  filler_developed: true\n")
		b := j.Bolts
		if !closeTo(b.FillerThickness.In(), 0.5, readBack) || !b.FillerDeveloped || b.Fillers != 1 ||
			j.Raw["bolts.filler_thickness"] != "1/2 in" || j.Line("bolts.filler_developed") != 11 {
			t.Errorf("bolts = %+v, raw %q", b, j.Raw["bolts.filler_thickness"])
		}
		j = mustParse(t, minimalUS+"units: si\nbolts: {filler_thickness: 12, filler_developed: false}\n")
		if !closeTo(float64(j.Bolts.FillerThickness), 12, readBack) || j.Bolts.FillerDeveloped {
			t.Errorf("si bolts = %+v", j.Bolts)
		}
	})
	t.Run("fillers as a number, stagger zero", func(t *testing.T) {
		j := mustParse(t, minimalUS+"bolts: {fillers: 1, stagger: 0 in}\n")
		if j.Bolts.Fillers != 1 || j.Bolts.Stagger != 0 || !j.Given("bolts.stagger") {
			t.Errorf("bolts = %+v", j.Bolts)
		}
	})
}

func TestJobParseErrors(t *testing.T) {
	const bolts = "bolts:\n  diameter: 3/4 in\n  grade: A325\n" // lines 8-10 after minimalUS
	cases := []struct {
		name  string
		src   string
		field string
		line  int
		msg   string // substring of Msg
		hint  string // substring of Hint
	}{
		{"typo suggests the key", minimalUS + bolts + "  pich: 3 in\n", "bolts.pich", 11, "unknown key", `did you mean "pitch"?`},
		{"typo at the top", "mark: A\nbolt: {}\n", "bolt", 2, "unknown key", `did you mean "bolts"?`},
		{"far key lists the keys", minimalUS + "zzzzzzzzzz: 1\n", "zzzzzzzzzz", 8, "unknown key", "known keys: mark, units"},
		{"duplicate key", minimalUS + bolts + "  grade: A490\n", "bolts.grade", 11, "duplicate key (first at line 10)", ""},
		{"mapping for a quantity", minimalUS + bolts + "  pitch: {a: 1}\n", "bolts.pitch", 11, "not a mapping", ""},
		{"empty value", minimalUS + bolts + "  pitch:\n", "bolts.pitch", 11, "has no value", ""},
		{"null value", minimalUS + bolts + "  pitch: ~\n", "bolts.pitch", 11, "has no value", ""},
		{"wrong dimension", minimalUS + bolts + "  pitch: 3 kip\n", "bolts.pitch", 11, "", "write a length"},
		{"no unit no number", minimalUS + bolts + "  pitch: three\n", "bolts.pitch", 11, "", ""},
		{"NaN", minimalUS + bolts + "  end: .nan\n", "bolts.end", 11, "NaN", ""},
		{"NaN word", minimalUS + bolts + "  end: NaN in\n", "bolts.end", 11, "", ""},
		{"infinite", minimalUS + bolts + "  end: .inf\n", "bolts.end", 11, "infinite", ""},
		{"zero", minimalUS + bolts + "  gage: 0 in\n", "bolts.gage", 11, "greater than zero", ""},
		{"negative stagger", minimalUS + bolts + "  stagger: -1 in\n", "bolts.stagger", 11, "negative", ""},
		{"absurd length", minimalUS + bolts + "  end: 200 m\n", "bolts.end", 11, "absurdly large", ""},
		{"diameter wrong dimension", minimalUS + "bolts:\n  diameter: 3 kip\n", "bolts.diameter", 9, "", "M20"},
		{"lines out of range", minimalUS + bolts + "  lines: 21\n", "bolts.lines", 11, "from 1 to 20", ""},
		{"lines not whole", minimalUS + bolts + "  lines: 1.5\n", "bolts.lines", 11, "whole number", ""},
		{"too many bolts", minimalUS + bolts + "  lines: 20\n  per_line: 60\n", "bolts.per_line", 12, "1200 bolts", ""},
		{"fillers", minimalUS + bolts + "  fillers: 3.5\n", "bolts.fillers", 11, "whole number", ""},
		{"fillers as a thickness", minimalUS + bolts + "  fillers: 1/2 in\n", "bolts.fillers", 11, "whole number", "filler_thickness"},
		{"filler negative", minimalUS + bolts + "  filler_thickness: -1/2 in\n", "bolts.filler_thickness", 11, "negative", ""},
		{"filler absurd", minimalUS + bolts + "  filler_thickness: 12 in\n", "bolts.filler_thickness", 11, "absurdly thick", "check the unit"},
		{"filler a force", minimalUS + bolts + "  filler_thickness: 1/2 kip\n", "bolts.filler_thickness", 11, "", "write a length"},
		{"filler and no fillers", minimalUS + bolts + "  fillers: 0\n  filler_thickness: 1/2 in\n", "bolts.filler_thickness", 12, "bolts.fillers is 0", ""},
		{"developed not a flag", minimalUS + bolts + "  filler_thickness: 1/2 in\n  filler_developed: maybe\n", "bolts.filler_developed", 12, "true or false", ""},
		{"developed without thickness", minimalUS + bolts + "  filler_developed: true\n", "bolts.filler_developed", 11, "filler_thickness", ""},
		{"joint", minimalUS + bolts + "  joint: friction\n", "bolts.joint", 11, "unknown joint", ""},
		{"threads", minimalUS + bolts + "  threads: partial\n", "bolts.threads", 11, "", ""},
		{"hole type", minimalUS + bolts + "  hole: round\n", "bolts.hole", 11, "unknown hole type", ""},
		{"units", "units: metric\n" + minimalUS, "units", 1, "unknown unit system", ""},
		{"method", minimalUS + "method: lsd\n", "method", 8, "unknown method", ""},
		{"standard", "standard: aisc360-10\n" + minimalUS, "standard", 1, "unknown standard", "aisc360-22"},
		{"quantity", minimalUS + "quantity: 100001\n", "quantity", 8, "from 1 to 100000", ""},
		{"mark missing", "load: {required: 1 kip}\n", "mark", 1, "is required", ""},
		{"mark too long", strings.Replace(minimalUS, "mark: M1", "mark: "+strings.Repeat("A", 41), 1), "mark", 1, "not a usable mark", "1 to 40"},
		{"mark dot", strings.Replace(minimalUS, "mark: M1", "mark: '.'", 1), "mark", 1, "not a usable mark", ""},
		{"mark slash", strings.Replace(minimalUS, "mark: M1", "mark: a/b", 1), "mark", 1, "not a usable mark", ""},
		// Issue 11: a mark names its folder and files; '.' hides them and '-' reads as an option.
		{"mark hidden", strings.Replace(minimalUS, "mark: M1", "mark: .BR-1", 1), "mark", 1, "not a usable mark", "not starting with '.' or '-'"},
		{"mark option", strings.Replace(minimalUS, "mark: M1", "mark: -rf", 1), "mark", 1, "not a usable mark", "not starting with '.' or '-'"},
		{"load missing", "mark: A\nmember: {shape: flat}\n", "load", 1, "is required", ""},
		{"load required zero", strings.Replace(minimalUS, "95 kip", "0 kip", 1), "load.required", 3, "greater than zero", ""},
		{"load all zero", strings.Replace(minimalUS, "required: 95 kip", "dead: 0 kip", 1), "load", 2, "no load other than zero", ""},
		{"load negative", strings.Replace(minimalUS, "required: 95 kip", "required: -5 kip", 1), "load.required", 3, "negative", ""},
		{"compression negative", strings.Replace(minimalUS, "required: 95 kip", "required: 95 kip\n  compression: -5 kip", 1), "load.compression", 4, "negative", ""},
		{"reverses unknown", strings.Replace(minimalUS, "required: 95 kip", "dead: 5 kip\n  live: 10 kip\n  reverses: [live]", 1), "load.reverses[0]", 5, "unknown load", ""},
		{"reverses with required", strings.Replace(minimalUS, "required: 95 kip", "required: 95 kip\n  reverses: [wind]", 1), "load.required", 3, "not both", ""},
		{"load absurd", strings.Replace(minimalUS, "95 kip", "2000000 kip", 1), "load.required", 3, "absurdly large", ""},
		{"load both", strings.Replace(minimalUS, "required: 95 kip", "required: 95 kip\n  wind: 3 kip", 1), "load.required", 3, "not both", ""},
		{"load stress", strings.Replace(minimalUS, "95 kip", "95 ksi", 1), "load.required", 3, "", "write a force"},
		{"member missing", "mark: A\nload: {required: 1 kip}\n", "member", 1, "is required", ""},
		{"shape missing", strings.Replace(minimalUS, "  shape: angle\n", "", 1), "member.shape", 4, "is required", ""},
		{"shape unknown", strings.Replace(minimalUS, "shape: angle", "shape: tube", 1), "member.shape", 5, "unknown shape", ""},
		{"angle without size", strings.Replace(minimalUS, "  size: L4x4x1/2\n", "", 1), "member.size", 4, "size, or legs and thickness", ""},
		{"size and legs", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  legs: [4, 4]", 1), "member.legs", 8, "not both", ""},
		{"size and thickness", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  thickness: 1/2", 1), "member.thickness", 8, "part of size", ""},
		{"legs count", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: angle\n  legs: [4 in]\n  thickness: 1/2 in\n  grade: A36\n", "member.legs", 5, "two legs", ""},
		{"legs dimension", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: angle\n  legs: [4 in, 3 ksi]\n  thickness: 1/2 in\n  grade: A36\n", "member.legs[1]", 5, "", ""},
		{"legs without thickness", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: angle\n  legs: [4 in, 4 in]\n  grade: A36\n", "member.thickness", 5, "is required", ""},
		{"legs thicker than leg", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: angle\n  legs: [4 in, 2 in]\n  thickness: 2 in\n  grade: A36\n", "member.thickness", 6, "shorter leg", ""},
		{"angle with width", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  width: 4 in", 1), "member.width", 8, "flat bars", ""},
		{"single angle with gap", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  gap: 3/8 in", 1), "member.gap", 8, "double angles", ""},
		{"flat with size", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: flat\n  size: L4x4x1/2\n  grade: A36\n", "member.size", 5, "flat bar", "width and thickness"},
		{"flat with xbar", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: flat\n  width: 6 in\n  thickness: 1/2 in\n  xbar: 1 in\n  grade: A36\n", "member.xbar", 7, "flat bar", ""},
		{"eccentricity on an angle", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  eccentricity: provided", 1), "member.eccentricity", 8, "flat bars", "J1.7"},
		{"eccentricity unknown", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: flat\n  width: 6 in\n  thickness: 1/2 in\n  eccentricity: maybe\n  grade: A36\n", "member.eccentricity", 7, "unknown eccentricity setting", ""},
		{"flat without width", "mark: A\nload: {required: 1 kip}\nmember:\n  shape: flat\n  thickness: 1/2 in\n  grade: A36\n", "member.width", 3, "is required", ""},
		{"grade missing", strings.Replace(minimalUS, "  grade: A36\n", "", 1), "member.grade", 4, "is required", ""},
		{"grade and fy", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  fy: 36 ksi", 1), "member.fy", 8, "not both", ""},
		{"fy alone", strings.Replace(minimalUS, "  grade: A36", "  fy: 36 ksi", 1), "member.fu", 7, "is required with fy", ""},
		{"fu below fy", strings.Replace(minimalUS, "  grade: A36", "  fy: 50 ksi\n  fu: 50 ksi", 1), "member.fu", 8, "greater than fy", ""},
		{"fy absurd", strings.Replace(minimalUS, "  grade: A36", "  fy: 5000 ksi\n  fu: 6000 ksi", 1), "member.fy", 7, "absurdly large", ""},
		{"area zero", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  area: 0 in2", 1), "member.area", 8, "greater than zero", ""},
		{"area as a length", strings.Replace(minimalUS, "  grade: A36", "  grade: A36\n  area: 3 in", 1), "member.area", 8, "", "write an area"},
		{"plate without width", minimalUS + "plate:\n  thickness: 1/2 in\n  grade: A36\n", "plate.width", 8, "is required", ""},
		{"plate kind", minimalUS + "plate:\n  kind: lap\n  thickness: 1/2 in\n  grade: A36\n  width: 9 in\n", "plate.kind", 9, "unknown plate kind", ""},
		{"plate thickness negative", minimalUS + "plate:\n  thickness: -1/2 in\n  grade: A36\n  width: 9 in\n", "plate.thickness", 9, "greater than zero", ""},
		{"holes not a list", minimalUS + "holes: 3\n", "holes", 8, "want a list", ""},
		{"holes empty", minimalUS + "holes: []\n", "holes", 8, "is empty", ""},
		{"hole not a pair", minimalUS + "holes:\n  - [1 in, 2 in]\n  - [1 in, 2 in, 3 in]\n", "holes[1]", 10, "[x, y]", ""},
		{"hole NaN", minimalUS + "holes:\n  - [1 in, 2 in]\n  - [1 in, .nan]\n", "holes[1]", 10, "y is not a number", ""},
		{"holes with end", minimalUS + bolts + "  end: 1 in\nholes:\n  - [1 in, 2 in]\n", "bolts.end", 11, "explicit holes", "remove bolts.end"},
		{"holes with stagger", minimalUS + bolts + "  stagger: 0 in\nholes:\n  - [1 in, 2 in]\n", "bolts.stagger", 11, "explicit holes", ""},
		{"stock diameter", minimalUS + "stock:\n  diameters: [3/4 in, 3 kip]\n", "stock.diameters[1]", 9, "", ""},
		{"stock diameters scalar", minimalUS + "stock:\n  diameters: 3/4 in\n", "stock.diameters", 9, "want a list", ""},
		{"stock objective", minimalUS + "stock:\n  objective: weight\n", "stock.objective", 9, "unknown objective", ""},
		{"stock prefer word", minimalUS + "stock:\n  prefer: [fewest-bolts, cheapest]\n", "stock.prefer[1]", 9, `unknown preference "cheapest" (want usual-gage, short-connection, fewest-bolts or thinnest-plate)`, ""},
		{"stock prefer twice", minimalUS + "stock:\n  prefer:\n    - usual-gage\n    - usual-gage\n", "stock.prefer[1]", 11, "lists usual-gage twice", ""},
		{"stock prefer and objective", minimalUS + "stock:\n  objective: bolts\n  prefer: [usual-gage]\n", "stock.prefer", 10, "also orders", ""},
		{"stock max_lines", minimalUS + "stock:\n  max_lines: 0\n", "stock.max_lines", 9, "from 1 to 20", ""},
		{"stock step", minimalUS + "stock:\n  step: 0 in\n", "stock.step", 9, "greater than zero", ""},
		{"tolerance", minimalUS + "tolerance:\n  position: 0 in\n", "tolerance.position", 9, "greater than zero", ""},
		{"tolerance typo", minimalUS + "tolerance:\n  positon: 1/16 in\n", "tolerance.positon", 9, "unknown key", `"position"`},
		{"anchor", minimalUS + "bolts:\n  pitch: &p 3 in\n  end: *p\n", "bolts.pitch", 9, "anchors and aliases", ""},
		{"not a mapping", "- a\n- b\n", "", 1, "must be a mapping", ""},
		{"scalar document", "just words\n", "", 1, "must be a mapping", ""},
		{"broken YAML", "mark: A\nload:\n  required: 1 kip\n   live: 2 kip\n", "", 4, "not valid YAML", ""},
		{"tab indent", "mark: A\nload:\n\trequired: 1 kip\n", "", 3, "not valid YAML", ""},
		{"two documents", minimalUS + "---\nmark: B\n", "", 8, "more than one YAML document", ""},
		{"empty", "", "", 0, "empty", ""},
		{"only comments", "# a job\n\n", "", 0, "empty", ""},
		{"key is a list", "[a]: 1\n", "", 1, "plain word", ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			e := parseErr(t, c.src)
			if e.Field != c.field || e.Line != c.line {
				t.Errorf("got %s:%d %q (%v), want field %q line %d", e.Field, e.Line, e.Msg, e, c.field, c.line)
			}
			if !strings.Contains(e.Msg, c.msg) {
				t.Errorf("Msg %q does not contain %q", e.Msg, c.msg)
			}
			if !strings.Contains(e.Hint, c.hint) {
				t.Errorf("Hint %q does not contain %q", e.Hint, c.hint)
			}
		})
	}
}

func TestJobSizeCap(t *testing.T) {
	big := minimalUS + "# " + strings.Repeat("x", MaxJobSize) + "\n"
	e := parseErr(t, big)
	if e.Field != "" || !strings.Contains(e.Msg, "larger than") {
		t.Errorf("got %v", e)
	}
}

func TestLoadJobMissingFile(t *testing.T) {
	_, err := LoadJob("testdata/no-such-job.yaml")
	var ie *InputError
	if !errors.As(err, &ie) || ie.File != "testdata/no-such-job.yaml" || !strings.Contains(ie.Msg, "cannot read") {
		t.Fatalf("LoadJob: %v", err)
	}
}

func TestJobNearestKey(t *testing.T) {
	// Levenshtein distances, worked by hand.
	for _, c := range []struct {
		a, b string
		want int
	}{{"pich", "pitch", 1}, {"gage", "gage2", 1}, {"kitten", "sitting", 3}, {"", "abc", 3}, {"per-line", "per_line", 1}} {
		if got := editDistance(c.a, c.b); got != c.want {
			t.Errorf("editDistance(%q, %q) = %d, want %d", c.a, c.b, got, c.want)
		}
	}
	if h := nearestKey("per-line", boltKeys); h != `did you mean "per_line"?` {
		t.Errorf("hint %q", h)
	}
}
