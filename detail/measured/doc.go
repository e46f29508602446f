// Package measured reads the holes of an as-fabricated part: a CSV of hole
// centres and diameters written by a person or a measuring program, or a
// DXF of the part written by a CAM system, a scanner or a CAD program.
//
// Units and axes: every length it returns is in millimetres (the internal
// unit of package units). Coordinates are those of the file, converted to
// millimetres and nothing else: x along the member from its cut end, y from
// the heel (angles) or an edge (flats) when the file follows the job's
// frame; aligning them to the design is the caller's business.
//
// Readers are tolerant of what they do not use and strict about what they
// do: a malformed row or group code is an *Error naming the file, the line
// and the field. Sizes and counts are capped (MaxFileSize, MaxHoles,
// MaxEntities) so that a huge or hostile file is refused with a clear
// message rather than read into memory.
package measured
