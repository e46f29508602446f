// Package fit aligns a measured part's holes to the design's: the
// least-squares rigid motion (FitRigid), the optimal assignment of holes
// with a gate (Assign, the Hungarian method), a best fit from many starts
// that settles matching and motion together (BestFit), and a robust fit
// that leaves a mislocated hole out (Robust). Geometry only, in mm, on
// gonum's r2.Vec; package qa decides what a deviation means.
package fit
