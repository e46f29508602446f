// Package rules holds the steel specification as data: the editions of
// AISC 360 (aisc360-22, aisc360-16), each in US customary and SI units, and
// the small lookups the engine and the detailing checks make of them.
//
// An Edition is a value passed down to whoever needs it; nothing here is
// global or mutable. Tables are stored the way the standard prints them (US
// tables in exact inches, SI tables in millimetres) and converted to the
// internal units of package units on lookup. A lookup the standard does not
// tabulate returns a *NotTabulatedError naming what was asked.
//
// Clause labels: 360-22 inserted a new J3.1, so each 360-16 J3.x is
// J3.(x+1) in 360-22. Callers ask for a clause by its 360-16 label and get
// the label of the edition in force.
package rules
