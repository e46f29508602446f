package rules

import (
	"fmt"
	"math"
	"strconv"

	"gaugeline/rules/units"
)

// Bolt diameters tabulated in Tables J3.1, J3.3 and J3.4, in inches.
var diametersUS = [...]float64{
	1.0 / 2, 5.0 / 8, 3.0 / 4, 7.0 / 8, 1,
	1 + 1.0/8, 1 + 1.0/4, 1 + 3.0/8, 1 + 1.0/2,
}

// Bolt diameters tabulated in Tables J3.1M, J3.3M and J3.4M, in mm. M12 is
// tabulated by 360-22 only.
var diametersSI = [...]float64{12, 16, 20, 22, 24, 27, 30, 36}

// diameterTol is how close a requested diameter must be to a tabulated one.
const diameterTol = 1e-6 * units.Millimetre

// unit is the length of one table unit: an inch (us) or a millimetre (si).
func (e *Edition) unit() units.Length {
	if e.system == units.SI {
		return units.Millimetre
	}
	return units.Inch
}

// si reports whether the edition's tables are read in SI units.
func (e *Edition) si() bool { return e.system == units.SI }

// is22 reports whether the edition is 360-22.
func (e *Edition) is22() bool { return e.year >= 2022 }

// tableDiameters are the tabulated diameters in the table's unit. The
// result aliases package data and must not be written.
func (e *Edition) tableDiameters() []float64 {
	if !e.si() {
		return diametersUS[:]
	}
	if e.is22() {
		return diametersSI[:]
	}
	return diametersSI[1:]
}

// table names a table of this system: "Table J3.3" or "Table J3.3M".
func (e *Edition) table(name string) string {
	if e.si() {
		return name + "M"
	}
	return name
}

// tabulated returns the tabulated diameter, in the table's unit, that d
// matches, or a *NotTabulatedError naming the table asked.
func (e *Edition) tabulated(d units.Length, table string) (float64, error) {
	u := e.unit()
	for _, D := range e.tableDiameters() {
		if math.Abs(float64(units.Length(D)*u-d)) <= float64(diameterTol) {
			return D, nil
		}
	}
	return 0, &NotTabulatedError{Edition: e.String(), Table: e.table(table), Key: e.diameterKey(d)}
}

// diameterKey names a bolt diameter the way the tables do: "M14" (in
// either system), "d = 14.5 mm", "d = 1-3/4 in", "d = 0.8 in".
func (e *Edition) diameterKey(d units.Length) string {
	if n, ok := units.MetricBolt(d); ok {
		return "M" + strconv.Itoa(n) // a metric bolt keeps its name in a US job too
	}
	if e.si() {
		return fmt.Sprintf("d = %g mm", d.Mm())
	}
	return "d = " + units.FormatJob(d, units.US)
}
