package rules

import (
	"strconv"
	"strings"
)

// clause maps a 360-16 label to the edition's. 360-22 inserted a new J3.1,
// so each 360-16 J3.x (x ≥ 1, any suffix) is J3.(x+1); everything else,
// table names included, keeps its label.
func (e *Edition) clause(label16 string) string {
	if !e.is22() {
		return label16
	}
	rest, ok := strings.CutPrefix(label16, "J3.")
	if !ok {
		return label16
	}
	n := 0
	for n < len(rest) && rest[n] >= '0' && rest[n] <= '9' {
		n++
	}
	x, err := strconv.Atoi(rest[:n])
	if err != nil || x < 1 {
		return label16
	}
	return "J3." + strconv.Itoa(x+1) + rest[n:]
}
