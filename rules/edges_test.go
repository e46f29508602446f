package rules

import (
	"testing"

	"gaugeline/rules/units"
)

func TestMinEdge(t *testing.T) {
	tests := []struct {
		name string
		ed   *Edition
		d    units.Length
		want units.Length
		src  string
	}{
		{"1/2", us16(t), in(1.0 / 2), in(3.0 / 4), "AISC 360-16 Table J3.4"},
		{"5/8", us16(t), in(5.0 / 8), in(7.0 / 8), "AISC 360-16 Table J3.4"},
		{"3/4", us16(t), in(3.0 / 4), in(1), "AISC 360-16 Table J3.4"},
		{"7/8", us16(t), in(7.0 / 8), in(1 + 1.0/8), "AISC 360-16 Table J3.4"},
		{"1", us16(t), in(1), in(1 + 1.0/4), "AISC 360-16 Table J3.4"},
		{"1-1/8", us16(t), in(1 + 1.0/8), in(1 + 1.0/2), "AISC 360-16 Table J3.4"},
		{"1-1/4", us16(t), in(1 + 1.0/4), in(1 + 5.0/8), "AISC 360-16 Table J3.4"},
		{"1-3/8 (1.25d)", us16(t), in(1 + 3.0/8), in(1 + 23.0/32), "AISC 360-16 Table J3.4 (over 1-1/4 in)"},
		{"1-1/2 (1.25d)", us16(t), in(1 + 1.0/2), in(1 + 7.0/8), "AISC 360-16 Table J3.4 (over 1-1/4 in)"},
		{"M12", si22(t), mm(12), mm(18), "AISC 360-22 Table J3.4M"},
		{"M16", si16(t), mm(16), mm(22), "AISC 360-16 Table J3.4M"},
		{"M20", si16(t), mm(20), mm(26), "AISC 360-16 Table J3.4M"},
		{"M22", si16(t), mm(22), mm(28), "AISC 360-16 Table J3.4M"},
		{"M24", si16(t), mm(24), mm(30), "AISC 360-16 Table J3.4M"},
		{"M27", si16(t), mm(27), mm(34), "AISC 360-16 Table J3.4M"},
		{"M30", si16(t), mm(30), mm(38), "AISC 360-16 Table J3.4M"},
		{"M36", si16(t), mm(36), mm(46), "AISC 360-16 Table J3.4M"},
	}
	for _, tt := range tests {
		got, err := tt.ed.MinEdge(tt.d)
		if err != nil {
			t.Errorf("%s: %v (%s)", tt.name, err, tt.src)
			continue
		}
		if !sameLength(got, tt.want) {
			t.Errorf("%s: MinEdge = %v mm, want %v mm (%s)", tt.name, got.Mm(), tt.want.Mm(), tt.src)
		}
	}
}

// 360-22 keeps the 360-16 minimum edge distances (and adds M12).
func TestMinEdgeSameIn360_22(t *testing.T) {
	for _, pair := range [][2]*Edition{{us16(t), us22(t)}, {si16(t), si22(t)}} {
		for _, d := range pair[0].Diameters() {
			a, _ := pair[0].MinEdge(d)
			b, err := pair[1].MinEdge(d)
			if err != nil || a != b {
				t.Errorf("%v mm: 360-16 %v, 360-22 %v (%v)", d.Mm(), a.Mm(), b.Mm(), err)
			}
		}
	}
}

func TestMinEdgeNotTabulated(t *testing.T) {
	_, err := us22(t).MinEdge(in(0.8))
	wantNotTabulated(t, err, "Table J3.4", "0.8 in")
	_, err = si16(t).MinEdge(mm(12))
	wantNotTabulated(t, err, "Table J3.4M", "M12")
	_, err = si22(t).MinEdge(mm(14))
	wantNotTabulated(t, err, "Table J3.4M", "M14")
}

func TestEdgeIncrement(t *testing.T) {
	type want struct{ standard, over, short, long units.Length }
	tests := []struct {
		name string
		ed   *Edition
		d    units.Length
		want want
		src  string
	}{
		{"1/2", us16(t), in(1.0 / 2), want{0, in(1.0 / 16), in(1.0 / 8), in(3.0 / 8)}, "AISC 360-16 Table J3.5"},
		{"3/4", us16(t), in(3.0 / 4), want{0, in(1.0 / 16), in(1.0 / 8), in(9.0 / 16)}, "AISC 360-16 Table J3.5"},
		{"7/8", us16(t), in(7.0 / 8), want{0, in(1.0 / 16), in(1.0 / 8), in(21.0 / 32)}, "AISC 360-16 Table J3.5"},
		{"1", us16(t), in(1), want{0, in(1.0 / 8), in(1.0 / 8), in(3.0 / 4)}, "AISC 360-16 Table J3.5"},
		{"1-1/8", us16(t), in(1 + 1.0/8), want{0, in(1.0 / 8), in(3.0 / 16), in(27.0 / 32)}, "AISC 360-16 Table J3.5"},
		{"1-1/2", us22(t), in(1 + 1.0/2), want{0, in(1.0 / 8), in(3.0 / 16), in(1 + 1.0/8)}, "AISC 360-22 Table J3.5"},
		{"M12", si22(t), mm(12), want{0, mm(2), mm(3), mm(9)}, "AISC 360-22 Table J3.5M"},
		{"M16", si16(t), mm(16), want{0, mm(2), mm(3), mm(12)}, "AISC 360-16 Table J3.5M"},
		{"M22", si16(t), mm(22), want{0, mm(2), mm(3), mm(16.5)}, "AISC 360-16 Table J3.5M"},
		{"M24", si16(t), mm(24), want{0, mm(3), mm(3), mm(18)}, "AISC 360-16 Table J3.5M"},
		{"M27", si16(t), mm(27), want{0, mm(3), mm(5), mm(20.25)}, "AISC 360-16 Table J3.5M"},
		{"M36", si22(t), mm(36), want{0, mm(3), mm(5), mm(27)}, "AISC 360-22 Table J3.5M"},
	}
	for _, tt := range tests {
		for ht, w := range map[HoleType]units.Length{Standard: tt.want.standard, Oversized: tt.want.over, ShortSlot: tt.want.short, LongSlot: tt.want.long} {
			got, err := tt.ed.EdgeIncrement(tt.d, ht)
			if err != nil {
				t.Errorf("%s %v: %v (%s)", tt.name, ht, err, tt.src)
				continue
			}
			if !sameLength(got, w) {
				t.Errorf("%s %v: C2 = %v mm, want %v mm (%s)", tt.name, ht, got.Mm(), w.Mm(), tt.src)
			}
		}
	}
	_, err := si22(t).EdgeIncrement(mm(14), Oversized)
	wantNotTabulated(t, err, "Table J3.5M", "M14")
}

func TestSpacingAndEdgeLimits(t *testing.T) {
	tests := []struct {
		name string
		got  units.Length
		want units.Length
		src  string
	}{
		{"min spacing 3/4 in = 2 in", us16(t).MinSpacing(in(3.0 / 4)), in(2), "AISC 360-16 J3.3"},
		{"min spacing M24 = 64 mm", si22(t).MinSpacing(mm(24)), mm(64), "AISC 360-22 J3.4"},
		{"max edge 12t", us22(t).MaxEdge(in(1.0 / 4)), in(3), "AISC 360-22 J3.6"},
		{"max edge capped at 6 in", us22(t).MaxEdge(in(1)), in(6), "AISC 360-22 J3.6"},
		{"max edge 12t si", si16(t).MaxEdge(mm(10)), mm(120), "AISC 360-16 J3.5"},
		{"max edge capped at 150 mm", si16(t).MaxEdge(mm(20)), mm(150), "AISC 360-16 J3.5"},
		{"max spacing 24t", us16(t).MaxSpacing(in(3.0/8), false), in(9), "AISC 360-16 J3.5(a)"},
		{"max spacing capped at 12 in", us22(t).MaxSpacing(in(1), false), in(12), "AISC 360-22 J3.6(a)"},
		{"max spacing 24t si", si22(t).MaxSpacing(mm(10), false), mm(240), "AISC 360-22 J3.6(a)"},
		{"max spacing 300 mm in 360-16", si16(t).MaxSpacing(mm(20), false), mm(300), "AISC 360-16 J3.5(a), \"12 in. (300 mm)\", read in the printed text"},
		{"max spacing 300 mm in 360-22", si22(t).MaxSpacing(mm(20), false), mm(300), "AISC 360-22 J3.6(a)"},
		{"weathering 14t", us16(t).MaxSpacing(in(1.0/4), true), in(3.5), "AISC 360-16 J3.5(b)"},
		{"weathering capped at 7 in", us22(t).MaxSpacing(in(1), true), in(7), "AISC 360-22 J3.6(b)"},
		{"weathering 14t si", si22(t).MaxSpacing(mm(10), true), mm(140), "AISC 360-22 J3.6(b)"},
		{"weathering capped at 180 mm", si16(t).MaxSpacing(mm(20), true), mm(180), "AISC 360-16 J3.5(b)"},
	}
	for _, tt := range tests {
		if !sameLength(tt.got, tt.want) {
			t.Errorf("%s: got %v mm, want %v mm (%s)", tt.name, tt.got.Mm(), tt.want.Mm(), tt.src)
		}
	}
}

func TestClearSpacingRule(t *testing.T) {
	tests := []struct {
		name string
		ed   *Edition
		want bool
		src  string
	}{
		{"360-22 adds clear distance ≥ d", us22(t), true, "AISC 360-22 J3.4"},
		{"360-16 has only 2-2/3 d", si16(t), false, "AISC 360-16 J3.3"},
	}
	for _, tt := range tests {
		if got := tt.ed.ClearSpacingRule(); got != tt.want {
			t.Errorf("%s: ClearSpacingRule() = %v (%s)", tt.name, got, tt.src)
		}
	}
}
