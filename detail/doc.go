// Package detail turns a job file into the geometric model the engine
// checks: parts, holes and patterns, the detailing checks of AISC 360 J3,
// and the check report with its verdict. Later it will hold the layout
// search, the sheet model and as-built matching.
//
// Units and axes are those of package engine: internal mm, N, MPa; x from
// the member end along the member, y from the heel (angles) or edge
// (flats). Values are converted to the job's units only when a report is
// written.
package detail
