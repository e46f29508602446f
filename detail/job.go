package detail

import (
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// Job is a parsed job file. (Skeleton: the parser fills in the rest.)
type Job struct {
	File     string // path as given
	Mark     string
	Units    units.System
	Standard string // "aisc360-22" or "aisc360-16"
	Method   rules.Method
	Quantity int
}
