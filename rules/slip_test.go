package rules

import "testing"

func TestSlipFactor(t *testing.T) {
	tests := []struct {
		name string
		t    HoleType
		dir  SlotDir
		want Factor
		src  string
	}{
		{"standard", Standard, Transverse, Factor{1.00, 1.50}, "AISC 360-22 J3.9"},
		{"short slot across the load", ShortSlot, Transverse, Factor{1.00, 1.50}, "AISC 360-22 J3.9"},
		{"oversized", Oversized, Transverse, Factor{0.85, 1.76}, "AISC 360-22 J3.9"},
		{"short slot along the load", ShortSlot, Longitudinal, Factor{0.85, 1.76}, "AISC 360-22 J3.9"},
		{"long slot across", LongSlot, Transverse, Factor{0.70, 2.14}, "AISC 360-22 J3.9"},
		{"long slot along", LongSlot, Longitudinal, Factor{0.70, 2.14}, "AISC 360-22 J3.9"},
	}
	for _, tt := range tests {
		for _, ed := range []*Edition{us22(t), si16(t)} {
			if got := ed.SlipFactor(tt.t, tt.dir); got != tt.want {
				t.Errorf("%s %s: SlipFactor = %+v, want %+v (%s)", ed, tt.name, got, tt.want, tt.src)
			}
		}
	}
}

func TestSlipCoefficients(t *testing.T) {
	ed := us22(t)
	tests := []struct {
		name string
		got  float64
		want float64
		src  string
	}{
		{"mu class A", ed.Mu(ClassA), 0.30, "AISC 360-22 J3.9"},
		{"mu class B", ed.Mu(ClassB), 0.50, "AISC 360-22 J3.9"},
		{"Du", ed.Du(), 1.13, "AISC 360-22 J3.9"},
		{"hf no filler", ed.Hf(0), 1.0, "AISC 360-22 J3.9"},
		{"hf one filler", ed.Hf(1), 1.0, "AISC 360-22 J3.9"},
		{"hf two fillers", ed.Hf(2), 0.85, "AISC 360-22 J3.9"},
		{"hf three fillers", ed.Hf(3), 0.85, "AISC 360-22 J3.9"},
	}
	for _, tt := range tests {
		if tt.got != tt.want {
			t.Errorf("%s = %v, want %v (%s)", tt.name, tt.got, tt.want, tt.src)
		}
	}
}
