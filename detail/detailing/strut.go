package detailing

import (
	"fmt"
	"math"

	"gaugeline/engine"
	"gaugeline/rules/units"
)

// maxCompressionSlenderness is the User Note of E2: Lc/r preferably not
// over 200.
const maxCompressionSlenderness = 200

// strutFindings are the findings of a member that pushes
// (Connection.Compression): slenderness.compression (the User Note of E2,
// advisory) and, for two pieces back to back, connectors.spacing (E6.2:
// each piece's slenderness between the connectors, a/ri, at most 3/4 of
// the built-up member's governing slenderness; the effective length
// factor of a piece between connectors taken as 1.0). A member in tension
// only gets connectors.tension for two pieces: D4's preferred limit of 300
// on a piece's slenderness between connectors (advisory).
func strutFindings(c *engine.Connection, info MemberInfo) []Finding {
	lcr, a, ri, ok := engine.StrutSlenderness(c)
	if !ok {
		return nil
	}
	var fs []Finding
	if c.Compression > 0 {
		fs = append(fs, Finding{ID: "slenderness.compression", Clause: c.Edition.Clause("E2"), Measured: lcr,
			Limit: maxCompressionSlenderness, Dim: units.Dimensionless, Pass: lcr <= maxCompressionSlenderness,
			Advisory: true, Where: info.Designation + " Lc/r in compression (preferably ≤ 200)"})
	}
	if ri <= 0 {
		return fs
	}
	col := c.Member.Strut
	ar := float64(a / ri)
	if c.Compression > 0 {
		limit := 0.75 * lcr
		f := Finding{ID: "connectors.spacing", Clause: c.Edition.Clause("E6.2"), Measured: ar, Limit: limit,
			Dim: units.Dimensionless, Pass: ar <= limit+1e-9,
			Where: connectorWhere(col, a, c.Edition.System(), "a/ri of each piece between connectors, at most 3/4 of the member's Lc/r", need(col, ri, limit))}
		fs = append(fs, f)
		return fs
	}
	f := Finding{ID: "connectors.tension", Clause: c.Edition.Clause("D4"), Measured: ar, Limit: maxSlenderness,
		Dim: units.Dimensionless, Pass: ar <= maxSlenderness, Advisory: true,
		Where: connectorWhere(col, a, c.Edition.System(), "a/ri of each piece between connectors (preferably ≤ 300)", need(col, ri, maxSlenderness))}
	return append(fs, f)
}

// need is the fewest intermediate connectors that keep a/ri at most limit.
func need(col *engine.Strut, ri units.Length, limit float64) int {
	return max(0, int(math.Ceil(float64(col.L)/(limit*float64(ri))-1e-9))-1)
}

// connectorWhere says what the connectors finding measured and what would
// meet it.
func connectorWhere(col *engine.Strut, a units.Length, sys units.System, what string, n int) string {
	s := fmt.Sprintf("%s; %d intermediate connectors (member.connectors), a = %s", what, col.Connectors, units.FormatJob(a, sys))
	if n > col.Connectors {
		s += fmt.Sprintf("; %d would do", n)
	}
	return s
}
