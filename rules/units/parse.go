package units

// Parse reads a quantity written by a person ("3/4 in", "1-1/2 in",
// `3'-6 1/2"`, "20 mm", "95 kip", "400 kN", "50 ksi", "345 MPa", "12 ft",
// "3.2 m", "3.75 in2") and returns its internal value (mm, N, MPa, mm²).
// A bare number is read in the default unit of sys for dimension want
// (us: in, kip, ksi, in²; si: mm, kN, MPa, mm²). A unit of another
// dimension, a missing number, NaN, Inf or trailing junk is an error.
func Parse(s string, want Dim, sys System) (float64, error) {
	panic("units: Parse not implemented")
}

// ParseLength reads a length; see Parse.
func ParseLength(s string, sys System) (Length, error) {
	v, err := Parse(s, DimLength, sys)
	return Length(v), err
}

// ParseForce reads a force; see Parse.
func ParseForce(s string, sys System) (Force, error) {
	v, err := Parse(s, DimForce, sys)
	return Force(v), err
}

// ParseStress reads a stress; see Parse.
func ParseStress(s string, sys System) (Stress, error) {
	v, err := Parse(s, DimStress, sys)
	return Stress(v), err
}

// ParseArea reads an area; see Parse.
func ParseArea(s string, sys System) (Area, error) {
	v, err := Parse(s, DimArea, sys)
	return Area(v), err
}

// ParseBoltDiameter reads a bolt diameter: a length, or the metric
// designation "M20" (20 mm).
func ParseBoltDiameter(s string, sys System) (Length, error) {
	panic("units: ParseBoltDiameter not implemented")
}

// FormatFeetInches formats a length for people in feet, inches and
// sixteenths, rounded to the nearest 1/16 in: 1'-3 1/2", 3 1/4", 0'-0 3/4"
// is written 3/4". Lengths of 12 in and more carry feet.
func FormatFeetInches(l Length) string {
	panic("units: FormatFeetInches not implemented")
}

// FormatJob formats a length the way a job file writes it, so that Parse
// reads it back exactly when it lies on a 1/16 in (us) or 0.001 mm (si)
// grid: "1-1/2 in", "3/4 in", "3 in", "20 mm", "22.5 mm".
func FormatJob(l Length, sys System) string {
	panic("units: FormatJob not implemented")
}

// FormatForPeople formats a length for a sheet or table: US as
// FormatFeetInches, SI in whole millimetres ("65").
func FormatForPeople(l Length, sys System) string {
	panic("units: FormatForPeople not implemented")
}
