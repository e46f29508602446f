package qa

import (
	"gaugeline/detail/qa/fit"
	"slices"

	"gonum.org/v1/gonum/spatial/r2"
)

// robustAlignment runs fit.Robust on the settled best fit tf and its
// matching, matches the holes again under the fit it returns, and records
// the holes the fit was taken on (and those left out) in ab.Alignment.
func (ab *AsBuilt) robustAlignment(des, mea []r2.Vec, tf fit.Rigid, match []int) (fit.Rigid, []int) {
	tf, in, changed := fit.Robust(des, mea, match, float64(ab.Tolerance.Position), tf)
	if changed {
		match = fit.Assign(des, tf.InverseAll(mea), float64(ab.Gate))
	}
	for i, h := range ab.designHoles() {
		switch {
		case in[i] && match[i] >= 0:
			ab.Alignment.FitOn = append(ab.Alignment.FitOn, h.ID)
		case match[i] >= 0:
			ab.Alignment.LeftOut = append(ab.Alignment.LeftOut, h.ID)
		}
	}
	if len(ab.Alignment.LeftOut) > 0 {
		ab.Alignment.Note = "rigid shift and rotation fitted by least squares over the largest set of holes that agree within the position tolerance;" +
			" the holes left out are measured against that fit"
	}
	return tf, match
}

// markLeftOut adds to the deviation of each hole left out of the fit why
// its deviation is taken against the fit on the others.
func (ab *AsBuilt) markLeftOut() {
	for i := range ab.Deviations {
		dv := &ab.Deviations[i]
		if dv.Status == HoleOutOfTolerance && slices.Contains(ab.Alignment.LeftOut, dv.ID) {
			dv.Why = append(dv.Why, "left out of the best fit: measured against the fit on the other holes")
		}
	}
}
