// Package qa re-verifies a fabricated part: it matches the holes measured
// on it (package detail/measured) to the design's, aligned by the file's
// datum or a best fit, reports each hole's deviation against the
// fabrication tolerance, and checks the as-built model with detail.Check
// (Reverify). The verdict is accept, review (engineer of record) or
// reject.
package qa
