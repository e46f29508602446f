package rules

import (
	"strings"
	"testing"

	"gaugeline/rules/units"
)

// holeCase is one row of Table J3.3 [J3.3M]: the four hole types for one
// bolt diameter, in the table's unit.
type holeCase struct {
	name           string
	d              float64
	standard, over float64
	shortW, shortL float64
	longW, longL   float64
	src            string
}

// Rows at and above 1-1/8 in and M36 are the tables' formulas worked out by
// hand (d + 1/8, d + 5/16, d + 3/8, 2.5d; d + 3, d + 8, d + 10, 2.5d).
var holeCasesUS = []holeCase{
	{"1/2", 1.0 / 2, 9.0 / 16, 5.0 / 8, 9.0 / 16, 11.0 / 16, 9.0 / 16, 1 + 1.0/4, "AISC 360-22 Table J3.3"},
	{"5/8", 5.0 / 8, 11.0 / 16, 13.0 / 16, 11.0 / 16, 7.0 / 8, 11.0 / 16, 1 + 9.0/16, "AISC 360-22 Table J3.3"},
	{"3/4", 3.0 / 4, 13.0 / 16, 15.0 / 16, 13.0 / 16, 1, 13.0 / 16, 1 + 7.0/8, "AISC 360-22 Table J3.3"},
	{"7/8", 7.0 / 8, 15.0 / 16, 1 + 1.0/16, 15.0 / 16, 1 + 1.0/8, 15.0 / 16, 2 + 3.0/16, "AISC 360-22 Table J3.3"},
	{"1", 1, 1 + 1.0/8, 1 + 1.0/4, 1 + 1.0/8, 1 + 5.0/16, 1 + 1.0/8, 2 + 1.0/2, "AISC 360-22 Table J3.3"},
	{"1-1/8", 1 + 1.0/8, 1 + 1.0/4, 1 + 7.0/16, 1 + 1.0/4, 1 + 1.0/2, 1 + 1.0/4, 2 + 13.0/16, "AISC 360-22 Table J3.3 (≥ 1-1/8 in row)"},
	{"1-1/4", 1 + 1.0/4, 1 + 3.0/8, 1 + 9.0/16, 1 + 3.0/8, 1 + 5.0/8, 1 + 3.0/8, 3 + 1.0/8, "AISC 360-22 Table J3.3 (≥ 1-1/8 in row)"},
	{"1-3/8", 1 + 3.0/8, 1 + 1.0/2, 1 + 11.0/16, 1 + 1.0/2, 1 + 3.0/4, 1 + 1.0/2, 3 + 7.0/16, "AISC 360-22 Table J3.3 (≥ 1-1/8 in row)"},
	{"1-1/2", 1 + 1.0/2, 1 + 5.0/8, 1 + 13.0/16, 1 + 5.0/8, 1 + 7.0/8, 1 + 5.0/8, 3 + 3.0/4, "AISC 360-22 Table J3.3 (≥ 1-1/8 in row)"},
}

var holeCasesSI = []holeCase{
	{"M12", 12, 14, 16, 14, 18, 14, 30, "AISC 360-22 Table J3.3M"},
	{"M16", 16, 18, 20, 18, 22, 18, 40, "AISC 360-22 Table J3.3M"},
	{"M20", 20, 22, 24, 22, 26, 22, 50, "AISC 360-22 Table J3.3M"},
	{"M22", 22, 24, 28, 24, 30, 24, 55, "AISC 360-22 Table J3.3M"},
	{"M24", 24, 27, 30, 27, 32, 27, 60, "AISC 360-22 Table J3.3M"},
	{"M27", 27, 30, 35, 30, 37, 30, 67, "AISC 360-22 Table J3.3M"},
	{"M30", 30, 33, 38, 33, 40, 33, 75, "AISC 360-22 Table J3.3M"},
	{"M36", 36, 39, 44, 39, 46, 39, 90, "AISC 360-22 Table J3.3M (≥ M36 row)"},
}

func checkHoles(t *testing.T, ed *Edition, cases []holeCase, u units.Length) {
	t.Helper()
	for _, tt := range cases {
		want := map[HoleType]HoleSize{
			Standard:  {units.Length(tt.standard) * u, units.Length(tt.standard) * u},
			Oversized: {units.Length(tt.over) * u, units.Length(tt.over) * u},
			ShortSlot: {units.Length(tt.shortW) * u, units.Length(tt.shortL) * u},
			LongSlot:  {units.Length(tt.longW) * u, units.Length(tt.longL) * u},
		}
		for _, ht := range []HoleType{Standard, Oversized, ShortSlot, LongSlot} {
			got, err := ed.Hole(units.Length(tt.d)*u, ht)
			if err != nil {
				t.Errorf("%s %s %v: %v (%s)", ed, tt.name, ht, err, tt.src)
				continue
			}
			w := want[ht]
			if !sameLength(got.Width, w.Width) || !sameLength(got.Length, w.Length) {
				t.Errorf("%s %s %v: Hole = %v × %v mm, want %v × %v mm (%s)",
					ed, tt.name, ht, got.Width.Mm(), got.Length.Mm(), w.Width.Mm(), w.Length.Mm(), tt.src)
			}
		}
	}
}

func TestHoleUS(t *testing.T) { checkHoles(t, us22(t), holeCasesUS, units.Inch) }
func TestHoleSI(t *testing.T) { checkHoles(t, si22(t), holeCasesSI, units.Millimetre) }

// 360-16 has the same hole table except that Table J3.3M starts at M16.
func TestHole360_16(t *testing.T) {
	us := make([]holeCase, len(holeCasesUS))
	for i, c := range holeCasesUS {
		c.src = strings.Replace(c.src, "360-22", "360-16", 1)
		us[i] = c
	}
	checkHoles(t, us16(t), us, units.Inch)
	si := make([]holeCase, 0, len(holeCasesSI))
	for _, c := range holeCasesSI[1:] {
		c.src = strings.Replace(c.src, "360-22", "360-16", 1)
		si = append(si, c)
	}
	checkHoles(t, si16(t), si, units.Millimetre)
}

func TestHoleNotTabulated(t *testing.T) {
	tests := []struct {
		name  string
		ed    *Edition
		d     units.Length
		table string
		key   string
		src   string
	}{
		{"0.8 in bolt", us22(t), in(0.8), "Table J3.3", "d = 0.8 in", "AISC 360-22 Table J3.3"},
		{"1-3/4 in bolt", us16(t), in(1.75), "Table J3.3", "d = 1-3/4 in", "AISC 360-16 Table J3.3"},
		{"M14", si22(t), mm(14), "Table J3.3M", "M14", "AISC 360-22 Table J3.3M"},
		{"M12 under 360-16", si16(t), mm(12), "Table J3.3M", "M12", "AISC 360-16 Table J3.3M"},
		{"M42 (only M36 is listed)", si22(t), mm(42), "Table J3.3M", "M42", "AISC 360-22 Table J3.3M"},
		{"an SI bolt in a US job: named M20 (issue 16), not 0.787402 in", us22(t), mm(20), "Table J3.3", "M20", "AISC 360-22 Table J3.3"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := tt.ed.Hole(tt.d, Standard)
			wantNotTabulated(t, err, tt.table, tt.key)
		})
	}
}

func TestHoleAllowance(t *testing.T) {
	tests := []struct {
		name string
		ed   *Edition
		want units.Length
		src  string
	}{
		{"us", us22(t), in(1.0 / 16), "AISC 360-22 B4.3"},
		{"si", si16(t), mm(2), "AISC 360-16 B4.3"},
	}
	for _, tt := range tests {
		if got := tt.ed.HoleAllowance(); !sameLength(got, tt.want) {
			t.Errorf("%s: HoleAllowance() = %v mm, want %v mm (%s)", tt.name, got.Mm(), tt.want.Mm(), tt.src)
		}
	}
}

func TestHolePermitted(t *testing.T) {
	type use struct {
		t   HoleType
		dir SlotDir
		j   Joint
	}
	tests := []struct {
		name  string
		input use
		want  bool
		why   string // part of the refusal
		src   string
	}{
		{"standard, bearing", use{Standard, Transverse, Bearing}, true, "", "AISC 360-22 J3.3"},
		{"standard, pretensioned", use{Standard, Longitudinal, Pretensioned}, true, "", "AISC 360-22 J3.3"},
		{"standard, slip-critical", use{Standard, Transverse, SlipCritical}, true, "", "AISC 360-22 J3.3"},
		{"oversized, bearing", use{Oversized, Transverse, Bearing}, false, "oversized holes are not permitted in bearing-type joints", "AISC 360-22 J3.3"},
		{"oversized, pretensioned", use{Oversized, Transverse, Pretensioned}, false, "oversized holes are not permitted in bearing-type joints", "AISC 360-22 J3.3"},
		{"oversized, slip-critical", use{Oversized, Transverse, SlipCritical}, true, "", "AISC 360-22 J3.3"},
		{"short slot across, bearing", use{ShortSlot, Transverse, Bearing}, true, "", "AISC 360-22 J3.3"},
		{"short slot along, bearing", use{ShortSlot, Longitudinal, Bearing}, false, "must be transverse to the load", "AISC 360-22 J3.3"},
		{"short slot along, pretensioned", use{ShortSlot, Longitudinal, Pretensioned}, false, "must be transverse to the load", "AISC 360-22 J3.3"},
		{"short slot along, slip-critical", use{ShortSlot, Longitudinal, SlipCritical}, true, "", "AISC 360-22 J3.3"},
		{"long slot across, bearing", use{LongSlot, Transverse, Bearing}, true, "", "AISC 360-22 J3.3"},
		{"long slot along, bearing", use{LongSlot, Longitudinal, Bearing}, false, "long slots", "AISC 360-22 J3.3"},
		{"long slot along, slip-critical", use{LongSlot, Longitudinal, SlipCritical}, true, "", "AISC 360-22 J3.3"},
		{"long slot across, slip-critical", use{LongSlot, Transverse, SlipCritical}, true, "", "AISC 360-22 J3.3"},
	}
	for _, tt := range tests {
		for _, ed := range []*Edition{us22(t), si16(t)} {
			ok, why := ed.HolePermitted(tt.input.t, tt.input.dir, tt.input.j)
			if ok != tt.want {
				t.Errorf("%s %s: HolePermitted = %v (%q), want %v (%s)", ed, tt.name, ok, why, tt.want, tt.src)
			}
			if ok && why != "" {
				t.Errorf("%s %s: why = %q on success, want empty", ed, tt.name, why)
			}
			if !ok && !strings.Contains(why, tt.why) {
				t.Errorf("%s %s: why = %q, want it to contain %q", ed, tt.name, why, tt.why)
			}
		}
	}
	// The refusal quotes the clause of the edition in force.
	if _, why := us16(t).HolePermitted(Oversized, Transverse, Bearing); !strings.Contains(why, "(J3.2)") {
		t.Errorf("360-16 why = %q, want it to cite J3.2", why)
	}
	if _, why := us22(t).HolePermitted(Oversized, Transverse, Bearing); !strings.Contains(why, "(J3.3)") {
		t.Errorf("360-22 why = %q, want it to cite J3.3", why)
	}
}
