package propose

import (
	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// maxConnectors bounds the intermediate connectors propose lays out.
const maxConnectors = 20

// withConnectors is the job with the intermediate connectors of two
// pieces back to back chosen, when the job leaves them to propose (a pair,
// member.length given, member.connectors not): the fewest that keep each
// piece's slenderness between connectors, a/ri, within E6.2's 3/4 of the
// member's governing Lc/r when it pushes, or D4's preferred 300 when it
// only pulls. The search then checks every layout with them, and the
// written job gives them (WriteJob). The job itself is returned unchanged
// otherwise.
func withConnectors(j *jobfile.Job) *jobfile.Job {
	m := j.Member
	if m.Shape == nil || m.Shape.Pieces() != 2 || engine.Apart(m.Shape) || m.Length == 0 || j.Given("member.connectors") {
		return j
	}
	tp := units.Length(0)
	if j.Plate != nil && j.Plate.AutoThickness && len(j.Stock.Thicknesses) > 0 {
		tp = j.Stock.Thicknesses[0] // the gap between the pieces is the plate's
	} else if j.Plate != nil {
		tp = j.Plate.Thickness
	}
	for n := 0; n <= maxConnectors; n++ {
		jj := *j
		jj.Member.Buckling.Connectors = n
		b2, err := detail.NewBuilder(&jj)
		if err != nil {
			return j
		}
		d, err := b2.Template(tp)
		if err != nil {
			return j
		}
		lcr, a, ri, ok := engine.StrutSlenderness(&d.Conn)
		if !ok || ri <= 0 {
			return j
		}
		limit := 300.0 // D4, preferably
		if d.Conn.Compression > 0 {
			limit = 0.75 * lcr // E6.2
		}
		if float64(a/ri) <= limit+1e-9 {
			if n == 0 {
				return j
			}
			out := jj
			out.ConnectorsChosen = true
			return &out
		}
	}
	return j
}
