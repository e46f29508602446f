package jobfile

import "fmt"

// InputError is bad input: it names the file, the field path and, for
// YAML, the line. The command line maps it to exit code 2.
type InputError struct {
	File  string // path of the job or measured file
	Line  int    // 1-based; 0 when unknown
	Field string // dotted field path, e.g. "bolts.pitch" or "holes[2]"
	Msg   string
	Hint  string // optional advice printed as a hint line
}

func (e *InputError) Error() string {
	loc := e.File
	if e.Line > 0 {
		loc = fmt.Sprintf("%s:%d", e.File, e.Line)
	}
	if e.Field != "" {
		return fmt.Sprintf("%s: %s: %s", loc, e.Field, e.Msg)
	}
	return fmt.Sprintf("%s: %s", loc, e.Msg)
}
