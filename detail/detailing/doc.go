// Package detailing holds the detailing rules of AISC 360 J3 (hole sizes
// and types, spacing, edge distances, workable gage, J1.7 eccentricity,
// D1 slenderness) as checks of the engine's model: Check returns one
// Finding per rule and place, passing or not.
package detailing
