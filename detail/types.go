package detail

import (
	"gaugeline/detail/detailing"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
)

// Design is a job resolved into the engine's model: ready to check.
type Design struct {
	Job  *jobfile.Job
	Conn engine.Connection
	Info detailing.MemberInfo
	// InfoB is member B's, where a splice's member_b gives it a section of
	// its own (Conn.MemberB); nil otherwise.
	InfoB *detailing.MemberInfo
	// Combination names the governing load combination when the demand was
	// combined from service loads ("" when given as required);
	// CompressionCombination the one of the compression (Conn.Compression).
	Combination            string
	CompressionCombination string
}
