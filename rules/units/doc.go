// Package units holds gaugeline's typed quantities and the parsing and
// formatting of quantities written by people.
//
// Internally every quantity is stored in one system: lengths in millimetres,
// forces in newtons, stresses in megapascals (N/mm²) and areas in square
// millimetres. US customary values are converted exactly when a job is read
// (1 in = 25.4 mm, 1 kip = 4448.2216152605 N) and converted back only when a
// result is printed, so a US job prints the inches it was given.
package units
