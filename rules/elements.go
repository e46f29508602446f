package rules

// splicePlateCap is J4.1(b): 360-16 limits An to 0.85·Ag for bolted splice
// plates; 360-22 has no such limit.
func (e *Edition) splicePlateCap() (float64, bool) {
	if e.is22() {
		return 0, false
	}
	return 0.85, true
}
