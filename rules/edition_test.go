package rules

import (
	"strings"
	"testing"

	"gaugeline/rules/units"
)

func TestLookup(t *testing.T) {
	tests := []struct {
		name string
		sys  units.System
		year int
	}{
		{"aisc360-22", units.US, 2022},
		{"aisc360-22", units.SI, 2022},
		{"aisc360-16", units.US, 2016},
		{"aisc360-16", units.SI, 2016},
	}
	for _, tt := range tests {
		ed, err := Lookup(tt.name, tt.sys)
		if err != nil {
			t.Fatalf("Lookup(%q, %v): %v", tt.name, tt.sys, err)
		}
		if ed.Name() != tt.name || ed.Year() != tt.year || ed.System() != tt.sys {
			t.Errorf("Lookup(%q, %v) = %+v", tt.name, tt.sys, *ed)
		}
	}
	if got := us22(t).String(); got != "aisc360-22 (us)" {
		t.Errorf("String() = %q", got)
	}
}

func TestLookupUnknown(t *testing.T) {
	_, err := Lookup("aisc360-10", units.US)
	if err == nil {
		t.Fatal("Lookup(aisc360-10) succeeded")
	}
	for _, n := range Names() {
		if !strings.Contains(err.Error(), n) {
			t.Errorf("error %q does not list %s", err, n)
		}
	}
	if _, err := Lookup("aisc360-22", units.System(7)); err == nil {
		t.Error("Lookup with an unknown unit system succeeded")
	}
}

// Two lookups of one edition are independent values: changing one, or a
// slice it returned, leaves the other alone.
func TestLookupsShareNoState(t *testing.T) {
	a, b := si22(t), si22(t)
	if a == b {
		t.Fatal("two Lookups returned the same *Edition")
	}
	ds := a.Diameters()
	ds[0] = mm(99)
	bg := a.BoltGrades()
	bg[0] = "X"
	sg := a.SteelGrades()
	sg[0] = "X"
	a.year = 2016
	if got := b.Diameters()[0]; got != mm(12) {
		t.Errorf("b.Diameters()[0] = %v after writing a's, want 12 mm", got)
	}
	if got := a.Diameters()[0]; got != mm(16) {
		t.Errorf("a.Diameters()[0] = %v after setting a.Year = 2016, want 16 mm", got)
	}
	if got := b.BoltGrades()[0]; got != "A307" {
		t.Errorf("b.BoltGrades()[0] = %q after writing a's", got)
	}
	if got := b.SteelGrades()[0]; got != "A36" {
		t.Errorf("b.SteelGrades()[0] = %q after writing a's", got)
	}
	if b.Year() != 2022 || b.Clause("J3.10") != "J3.11" {
		t.Errorf("b changed with a: Year %d, Clause(J3.10) %q", b.Year(), b.Clause("J3.10"))
	}
	if _, err := b.Hole(mm(12), Standard); err != nil {
		t.Errorf("b lost M12 after a was set to 2016: %v", err)
	}
}

func TestDiameters(t *testing.T) {
	tests := []struct {
		name string
		ed   *Edition
		want []units.Length
		src  string
	}{
		{"us 360-22", us22(t), []units.Length{in(1.0 / 2), in(5.0 / 8), in(3.0 / 4), in(7.0 / 8), in(1), in(1 + 1.0/8), in(1 + 1.0/4), in(1 + 3.0/8), in(1 + 1.0/2)}, "AISC 360-22 Table J3.1"},
		{"us 360-16", us16(t), []units.Length{in(1.0 / 2), in(5.0 / 8), in(3.0 / 4), in(7.0 / 8), in(1), in(1 + 1.0/8), in(1 + 1.0/4), in(1 + 3.0/8), in(1 + 1.0/2)}, "AISC 360-16 Table J3.1"},
		{"si 360-22 has M12", si22(t), []units.Length{mm(12), mm(16), mm(20), mm(22), mm(24), mm(27), mm(30), mm(36)}, "AISC 360-22 Table J3.1M"},
		{"si 360-16 starts at M16", si16(t), []units.Length{mm(16), mm(20), mm(22), mm(24), mm(27), mm(30), mm(36)}, "AISC 360-16 Table J3.1M"},
	}
	for _, tt := range tests {
		got := tt.ed.Diameters()
		if len(got) != len(tt.want) {
			t.Errorf("%s: Diameters() = %v, want %v (%s)", tt.name, got, tt.want, tt.src)
			continue
		}
		for i := range got {
			if !sameLength(got[i], tt.want[i]) {
				t.Errorf("%s: Diameters()[%d] = %v, want %v (%s)", tt.name, i, got[i], tt.want[i], tt.src)
			}
		}
	}
}

// A requested diameter matches a tabulated one within 1e-6 mm, e.g. a
// 3/4-in bolt read from a job file as 19.05 mm.
func TestDiameterTolerance(t *testing.T) {
	ed := us22(t)
	if _, err := ed.Hole(mm(19.05+5e-7), Standard); err != nil {
		t.Errorf("19.0500005 mm: %v, want the 3/4-in row", err)
	}
	_, err := ed.Hole(mm(19.05+2e-6), Standard)
	wantNotTabulated(t, err, "Table J3.3")
}

func TestNotTabulatedMessage(t *testing.T) {
	_, err := si22(t).Hole(mm(14), Standard)
	want := "aisc360-22 (si): Table J3.3M has no entry for M14"
	if err == nil || err.Error() != want {
		t.Errorf("error = %v, want %q", err, want)
	}
	_, err = us22(t).Hole(in(1.75), Standard)
	want = "aisc360-22 (us): Table J3.3 has no entry for d = 1-3/4 in"
	if err == nil || err.Error() != want {
		t.Errorf("error = %v, want %q", err, want)
	}
}

func TestSplicePlateCap(t *testing.T) {
	tests := []struct {
		name   string
		ed     *Edition
		cap    float64
		exists bool
		src    string
	}{
		{"360-16 caps An at 0.85 Ag", us16(t), 0.85, true, "AISC 360-16 J4.1(b)"},
		{"360-22 has no cap", us22(t), 0, false, "AISC 360-22 J4.1"},
	}
	for _, tt := range tests {
		c, ok := tt.ed.SplicePlateCap()
		if c != tt.cap || ok != tt.exists {
			t.Errorf("%s: SplicePlateCap() = %v, %v, want %v, %v (%s)", tt.name, c, ok, tt.cap, tt.exists, tt.src)
		}
	}
}

// TestUnconfirmedOnlyWhereNotRead: 360-22 (both systems) and 360-16 US
// were read in the printed text (Table J3.2, AISC 360-22; AISC 360-16
// Table J3.2 in ksi); only 360-16's SI bolt stresses were not, and the
// report must say so.
func TestUnconfirmedOnlyWhereNotRead(t *testing.T) {
	for _, tt := range []struct {
		e    *Edition
		want int
	}{{us22(t), 0}, {si22(t), 0}, {us16(t), 0}, {si16(t), 1}} {
		got := tt.e.Unconfirmed()
		if len(got) != tt.want {
			t.Errorf("%s: %d unconfirmed notes, want %d: %q", tt.e, len(got), tt.want, got)
		}
	}
	if n := si16(t).Unconfirmed(); len(n) == 1 && !strings.Contains(n[0], "Table J3.2") {
		t.Errorf("note does not name the table: %q", n[0])
	}
}
