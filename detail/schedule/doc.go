// Package schedule reads a connection schedule, a CSV file or an XLSX
// workbook with one row per connection, into jobs. Each column names a
// job-file field (Columns: a short name such as "pitch" or a dotted path
// such as "bolts.pitch"); a template job supplies every value a row
// leaves empty. A row becomes YAML text that jobfile.ParseJob reads, so
// every rule of the job file holds for it, and its errors name the
// schedule, the sheet (XLSX), the row and the column.
//
// Values are the job file's: a quantity with its unit ("3/4 in", "95 kip")
// or a bare number in the job's units, read exactly as if typed after the
// key in a YAML job file.
package schedule
