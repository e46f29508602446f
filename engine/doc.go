// Package engine computes the tension limit states of AISC 360 for a bolted
// connection: pure functions of the geometry, the materials and a rule
// edition. It knows nothing of job files or drawings.
//
// Units: the internal units of package units (mm, N, MPa, mm²).
//
// Axes: x runs along the member axis from the member's cut end (x = 0) into
// the member; y runs across the connected leg from the heel (angles) or
// across the width from one edge (flats). The member is pulled toward +x, so
// its bolts bear toward the member end (−x). The plate's free edge lies at
// x = last bolt + plate edge distance and the plate is pulled toward −x, so
// its bolts bear toward that free edge (+x). A plate with an outline
// (Plate.Outline, a polygon in this frame in mm) has its edges where the
// outline puts them; FreeEdge is then its greatest x (outline.go).
//
// Holes: each Hole is one bolt with one centre and its hole's shape (type,
// slot direction, extents) in each ply: the member's (Hole.HoleShape) and
// the plate's (Hole.InPlate), which may differ. A limit state of a part uses
// that part's ply.
//
// Every limit state returns a Result carrying its id, the clause of the
// edition in force, nominal and available strength, the factor applied,
// the demand, the ratio and the intermediate values used, so that reports
// can quote them, and its working (Result.Working): its formula and its
// steps as expressions over those values, which any report prints without
// knowing the limit state (package engine/working). A failing limit state
// is a result, not an error.
//
// Four packages below this one hold what is not a limit state: the
// working's expressions and printer (engine/working), the geometry of net
// sections and block-shear blocks (engine/netsection), the ASCE 7 load
// combinations (engine/loads) and a plate outline's geometry
// (engine/polygon). They import none of each other nor this
// package; the aliases here (Working, Value, ServiceLoads …) keep callers
// on package engine alone.
package engine
