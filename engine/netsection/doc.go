// Package netsection finds where a section through the bolt holes of one
// part runs: the worst straight or zig-zag path across the part (B4.3b)
// and the blocks that block shear could tear out (J4.3), with their gross
// and net areas. It is geometry only: the holes, the part's edges and
// thickness. The strengths, the clauses and the results are package
// engine's; a block's strength comes in as a function.
//
// Units: the internal units of package units (mm, N, MPa, mm²).
//
// Axes: those of package engine: x along the load, y across it. A block
// tears out toward a free edge across the load at x = Part.XEdge, which
// lies on the side Part.Toward gives (−1: toward −x, the member's cut
// end; +1: toward +x, the plate's free edge).
package netsection

// Tolerance is the geometric tolerance in mm: holes closer than this in y
// are on one gage line, in x in one row.
const Tolerance = 1e-6

// eps is Tolerance, by the short name the searches use.
const eps = Tolerance
