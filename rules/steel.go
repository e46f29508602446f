package rules

import (
	"fmt"
	"strings"

	"gaugeline/rules/units"
)

// steelTable is where the grade values come from.
const steelTable = "ASTM steel grades (AISC Manual Table 2-3)"

// steelRow is a structural steel grade: Fy and Fu in ksi and in MPa (the
// ASTM metric designations).
type steelRow struct {
	name         string
	fyKsi, fuKsi float64
	fyMPa, fuMPa float64
	weathering   bool
}

var steels = [...]steelRow{
	{"A36", 36, 58, 250, 400, false},
	{"A572-50", 50, 65, 345, 450, false},
	{"A992", 50, 65, 345, 450, false},
	{"A588", 50, 70, 345, 485, true},
	{"A529-50", 50, 65, 345, 450, false},
}

// steelKey folds the spellings of a grade together: "a572 Gr.50",
// "A572-GR50" and "A572-50" all read "A57250".
func steelKey(name string) string {
	return steelFold.Replace(strings.ToUpper(name))
}

// steelFold is steelKey's replacer, built once (a Replacer is safe for
// concurrent use and never changes).
var steelFold = strings.NewReplacer(" ", "", "-", "", ".", "", "_", "", "GR", "")

// steelGrades lists the canonical names.
func steelGrades() []string {
	names := make([]string, len(steels))
	for i, s := range steels {
		names[i] = s.name
	}
	return names
}

// steel looks up a grade by name in the edition's system.
func (e *Edition) steel(name string) (Steel, error) {
	want := steelKey(name)
	for _, s := range steels {
		if steelKey(s.name) != want {
			continue
		}
		if e.si() {
			return Steel{s.name, units.Stress(s.fyMPa) * units.Megapascal, units.Stress(s.fuMPa) * units.Megapascal, s.weathering}, nil
		}
		return Steel{s.name, units.Stress(s.fyKsi) * units.Ksi, units.Stress(s.fuKsi) * units.Ksi, s.weathering}, nil
	}
	return Steel{}, &NotTabulatedError{
		Edition: e.String(), Table: steelTable,
		Key: fmt.Sprintf("grade %s (known: %s)", strings.TrimSpace(name), strings.Join(steelGrades(), ", ")),
	}
}
