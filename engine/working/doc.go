// Package working is how a limit state shows its working, as data: the
// formula as the standard writes it and the steps with one connection's
// values. Each step is an expression over quantities (Expr), so one
// generic printer writes it symbolically ("Rn = Fy·Ag") and with the
// values put in ("Rn = (36.0 ksi)(3.750 in²) = 135.0 kip"), and a test
// evaluates it back to the value the limit state used. A report renders a
// Working without knowing which limit state it belongs to.
//
// The package knows no limit state: package engine builds a Working where
// each limit state computes its value (engine.Result.Working). Values are
// in the internal units of package units; a Format prints them in a
// report's units.
package working
