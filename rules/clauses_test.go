package rules

import "testing"

func TestClause(t *testing.T) {
	tests := []struct {
		name  string
		input string
		want  string // under 360-22; 360-16 returns the input
		src   string
	}{
		{"bearing and tearout", "J3.10", "J3.11", "AISC 360-22 J3.11 (360-16 J3.10)"},
		{"bolt strength", "J3.6", "J3.7", "AISC 360-22 J3.7 (360-16 J3.6)"},
		{"slip", "J3.8", "J3.9", "AISC 360-22 J3.9 (360-16 J3.8)"},
		{"hole types", "J3.2", "J3.3", "AISC 360-22 J3.3 (360-16 J3.2)"},
		{"hole sizes and spacing", "J3.3", "J3.4", "AISC 360-22 J3.4 (360-16 J3.3)"},
		{"edge distance", "J3.4", "J3.5", "AISC 360-22 J3.5 (360-16 J3.4)"},
		{"max spacing with suffix", "J3.5(b)", "J3.6(b)", "AISC 360-22 J3.6(b) (360-16 J3.5(b))"},
		{"bolt strength with suffix", "J3.6(b)", "J3.7(b)", "AISC 360-22 J3.7(b) (360-16 J3.6(b))"},
		{"first clause", "J3.1", "J3.2", "AISC 360-22 J3.2 (360-16 J3.1)"},
		{"tension member yielding", "D2(a)", "D2(a)", "AISC 360-22 D2(a)"},
		{"block shear", "J4.3", "J4.3", "AISC 360-22 J4.3"},
		{"net area", "B4.3", "B4.3", "AISC 360-22 B4.3"},
		{"connecting elements", "J4.1(b)", "J4.1(b)", "AISC 360-22 J4.1(b)"},
		{"table names keep their numbers", "Table J3.3", "Table J3.3", "AISC 360-22 Table J3.3"},
		{"metric table", "Table J3.4M", "Table J3.4M", "AISC 360-22 Table J3.4M"},
		{"J3 without a number", "J3", "J3", "AISC 360-22 J3"},
		{"J3.0 is not a clause", "J3.0", "J3.0", "AISC 360-22 J3"},
	}
	for _, tt := range tests {
		if got := us22(t).Clause(tt.input); got != tt.want {
			t.Errorf("%s: 360-22 Clause(%q) = %q, want %q (%s)", tt.name, tt.input, got, tt.want, tt.src)
		}
		if got := si16(t).Clause(tt.input); got != tt.input {
			t.Errorf("%s: 360-16 Clause(%q) = %q, want it unchanged", tt.name, tt.input, got)
		}
	}
}
