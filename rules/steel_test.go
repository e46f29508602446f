package rules

import (
	"slices"
	"testing"

	"gaugeline/rules/units"
)

func TestSteel(t *testing.T) {
	type want struct {
		name       string
		Fy, Fu     float64 // ksi (us) or MPa (si)
		weathering bool
	}
	tests := []struct {
		name  string
		ed    *Edition
		grade string
		want  want
		src   string
	}{
		{"A36", us22(t), "A36", want{"A36", 36, 58, false}, "AISC Manual Table 2-3 (from memory)"},
		{"A572-50", us22(t), "A572-50", want{"A572-50", 50, 65, false}, "AISC Manual Table 2-3 (from memory)"},
		{"A992", us16(t), "A992", want{"A992", 50, 65, false}, "AISC Manual Table 2-3 (from memory)"},
		{"A588", us16(t), "A588", want{"A588", 50, 70, true}, "AISC Manual Table 2-3 (from memory)"},
		{"A529-50", us22(t), "A529-50", want{"A529-50", 50, 65, false}, "AISC Manual Table 2-3 (from memory)"},
		{"a572 Gr50", us22(t), "a572 Gr50", want{"A572-50", 50, 65, false}, "AISC Manual Table 2-3 (from memory)"},
		{"A572 GR.50", us22(t), "A572 GR.50", want{"A572-50", 50, 65, false}, "AISC Manual Table 2-3 (from memory)"},
		{"A529 Gr. 50", us22(t), "A529 Gr. 50", want{"A529-50", 50, 65, false}, "AISC Manual Table 2-3 (from memory)"},
		{"A36 si", si22(t), "A36", want{"A36", 250, 400, false}, "AISC Manual Table 2-3, ASTM A36 metric (from memory)"},
		{"A572-50 si", si22(t), "A572-50", want{"A572-50", 345, 450, false}, "AISC Manual Table 2-3, ASTM A572 metric (from memory)"},
		{"A992 si", si16(t), "A992", want{"A992", 345, 450, false}, "AISC Manual Table 2-3, ASTM A992 metric (from memory)"},
		{"A588 si", si16(t), "A588", want{"A588", 345, 485, true}, "AISC Manual Table 2-3, ASTM A588 metric (from memory)"},
		{"A529-50 si", si22(t), "A529-50", want{"A529-50", 345, 450, false}, "AISC Manual Table 2-3, ASTM A529 metric (from memory)"},
	}
	for _, tt := range tests {
		s, err := tt.ed.Steel(tt.grade)
		if err != nil {
			t.Errorf("%s: %v (%s)", tt.name, err, tt.src)
			continue
		}
		u := units.Ksi
		if tt.ed.System() == units.SI {
			u = units.Megapascal
		}
		w := tt.want
		if s.Name != w.name || s.Weathering != w.weathering ||
			!sameValue(float64(s.Fy), float64(units.Stress(w.Fy)*u)) || !sameValue(float64(s.Fu), float64(units.Stress(w.Fu)*u)) {
			t.Errorf("%s: Steel = %+v, want %+v in %s (%s)", tt.name, s, w, tt.ed.System(), tt.src)
		}
	}
}

func TestSteelGrades(t *testing.T) {
	want := []string{"A36", "A572-50", "A992", "A588", "A529-50"}
	ed := si22(t)
	if got := ed.SteelGrades(); !slices.Equal(got, want) {
		t.Errorf("SteelGrades() = %v, want %v", got, want)
	}
	for _, n := range ed.SteelGrades() {
		if _, err := ed.Steel(n); err != nil {
			t.Errorf("Steel(%q): %v", n, err)
		}
	}
}

func TestSteelNotTabulated(t *testing.T) {
	for _, name := range []string{"A999", "A572", "A572-42", ""} {
		_, err := us22(t).Steel(name)
		wantNotTabulated(t, err, "ASTM steel grades (AISC Manual Table 2-3)", "A36", "A572-50", "A992", "A588", "A529-50")
	}
	_, err := si16(t).Steel("A999")
	wantNotTabulated(t, err, "ASTM steel grades (AISC Manual Table 2-3)", "grade A999")
}
