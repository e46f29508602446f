// Package jobfile reads and writes job files (SPEC §3). ParseJob walks the
// YAML nodes by hand so that every error is an *InputError naming the
// file, the field path and the line; Rewrite writes a job back with some
// values set, every other key, spelling and comment as the user wrote it.
// Quantities are converted to the internal units of package units when
// read.
package jobfile
