package qa

// One end of a member measured alone (an end stub; --part near-end,
// far-end): its holes are that end's connection's, in that end's own
// frame, x from its cut end and y as the job's (from the heel of an
// angle, from one edge of a flat); the far end is checked as the far
// end's connection (the near end's for far_end: mirror, its own else).
// near-end on a job without member.length is --part member.

// endRow is the report's part line for one end measured alone.
func endRow(p MeasuredPart, plate bool) string {
	s := p.String() + ": the " + p.words() + "'s holes alone (an end stub), reclassified from the measured sizes"
	if plate {
		s += ", the plate's as designed"
	}
	if p == MeasuredFarEnd {
		return s + "; coordinates in the far end's frame (x from the far cut end, y as the job's); checked as the far end's connection"
	}
	return s + "; coordinates in the job's frame (x from the near cut end)"
}

// endCaution is the as-built check's note on one end measured alone.
func endCaution(p MeasuredPart, plate bool) string {
	msg := "As built: the " + p.words() + " of the member was measured alone. Its holes take the measured sizes and the hole types they now are; "
	if !plate {
		return msg + "each bolt is at its measured centre."
	}
	return msg + "the plate's holes keep their designed type and size. Each bolt has one centre, the measured one, in both parts; " +
		"the plate is taken as designed (free edge and centre line)."
}
