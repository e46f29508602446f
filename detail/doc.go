// Package detail is the model builder and the check: it turns a parsed job
// (package detail/jobfile) into the geometric model the engine checks
// (Build, or a Builder step by step for the layout search), runs every
// limit state (package engine) and every detailing rule (package
// detail/detailing) on it (Check), and writes the check report as text,
// Markdown or the JSON of SPEC §9.
//
// The rooms around it, each for one job of the tool:
//
//	detail/jobfile    the job file: YAML in (every error with field and line) and out (Rewrite)
//	detail/section    member shapes' catalogs and section properties
//	detail/detailing  the detailing rules of AISC 360 J3 as findings
//	detail/propose    the layout search (propose)
//	detail/qa         measured holes matched to the design, the as-built check (reverify)
//	detail/sheet      the cut-sheet model and the one walk every drawing back end is painted by
//	detail/measured   readers of measured holes (CSV, DXF)
//	detail/calc       the HTML calculation report
//
// Units and axes are those of package engine: internal mm, N, MPa; x from
// the member end along the member, y from the heel (angles) or edge
// (flats). Values are converted to the job's units only when a report is
// written.
package detail
