package detail

import (
	"math"

	"gaugeline/detail/detailing"
	"gaugeline/detail/section"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// rolledPlace puts a catalog section into the model: the connected
// element (Width, T), x̄ for Table D3.1 case 2, the junctions of the rest
// of the section with it, d for case 7, the tear-off block and, where it
// differs, the area and the least radius of gyration. Ag, the designation
// and rmin of the single section are set before it is called.
type rolledPlace func(j job, sh section.Shape, props section.ShapeProps, mem *engine.Member, info *detailing.MemberInfo)

// rolledSections is, for each rolled member shape (engine.CatalogFamily),
// how its catalog section becomes the model: adding a rolled shape is its
// engine file, its catalog rows (detail/section) and one entry here.
var rolledSections = map[engine.Shape]rolledPlace{
	engine.Tee:           placeTee,
	engine.Channel:       placeChannels,
	engine.DoubleChannel: placeChannels,
	engine.Wide:          placeWide,
}

// k1 is the web's centre line to the toe of the fillet across a flange:
// the catalog's published k1 (AISC Shapes Database v15.0, Shape.K1). A
// shape without one falls back on the fillet of the catalog's geometry,
// tw/2 + (kdes − tf), which runs short of the published toe (W8x21: 0.425
// against 0.5625 in) and so is unconservative for gage.workable; every W
// and WT row of the catalog has its k1, so the fallback is for a row
// added without it.
func k1(sh section.Shape) units.Length {
	if sh.K1 > 0 {
		return sh.K1
	}
	return sh.Tw/2 + sh.K - sh.Tf
}

// placeTee: the flange connected, ȳ from its outer face, the stem on its
// centre line, case 7 with the depth of the W the tee is cut from.
func placeTee(_ job, sh section.Shape, props section.ShapeProps, mem *engine.Member, _ *detailing.MemberInfo) {
	mem.Width, mem.T, mem.Xbar = sh.Bf, sh.Tf, props.Ybar
	mem.Depth = 2 * sh.D // the W the tee is cut from (case 7)
	mem.Junctions = []engine.Junction{{Name: "stem", Fillet: "k1", At: sh.Bf / 2, Face: sh.Tw / 2, Toe: k1(sh)}}
	mem.TearOff = &engine.TearOff{Planes: 1, T: sh.Tw, At: mem.Ag - sh.Tw.Mul(sh.D-sh.K), What: "stem at the toe of its fillet"}
}

// placeChannels: one channel's web, or a pair's back to back (member.gap
// between them), connected; x̄ from the web's back, a flange at each edge.
func placeChannels(j job, sh section.Shape, props section.ShapeProps, mem *engine.Member, info *detailing.MemberInfo) {
	n := j.Member.Shape.Pieces()
	mem.Width, mem.T, mem.Xbar = sh.D, sh.Tw, props.Xbar
	mem.Ag = props.Area * units.Area(n)
	mem.Junctions = []engine.Junction{
		{Name: "flange", Fillet: "k", At: 0, Face: sh.Tf, Toe: sh.K, Side: 1},
		{Name: "flange", Fillet: "k", At: sh.D, Face: sh.Tf, Toe: sh.K, Side: -1},
	}
	mem.TearOff = &engine.TearOff{Planes: 2 * n, T: sh.Tw, At: sh.Tw.Mul(sh.D-2*sh.K) * units.Area(n), What: "web at the toes of its fillets"}
	if n == 2 {
		info.Designation = "2" + info.Designation
		// the pair about the axis along the webs, the plate (member.gap)
		// between their backs: r² = ry² + (x̄ + gap/2)²
		off := float64(props.Xbar + j.gap()/2)
		info.Rmin = min(props.Rx, units.Length(math.Sqrt(float64(props.Ry*props.Ry)+off*off)))
	}
}

// placeWide: both flanges connected, x̄ the ȳ of the half-section tee,
// the web on each flange's centre line, case 7 with the W's depth.
func placeWide(_ job, sh section.Shape, _ section.ShapeProps, mem *engine.Member, _ *detailing.MemberInfo) {
	half := sh
	half.Family, half.D = section.FamilyWT, sh.D/2
	mem.Width, mem.T, mem.Xbar = sh.Bf, sh.Tf, half.Properties().Ybar
	mem.Depth = sh.D
	mem.Junctions = []engine.Junction{{Name: "web", Fillet: "k1", At: sh.Bf / 2, Face: sh.Tw / 2, Toe: k1(sh)}}
	mem.TearOff = &engine.TearOff{Planes: 2, T: sh.Tw, At: mem.Ag - sh.Tw.Mul(sh.D-2*sh.K), What: "web at the toes of its fillets"}
}
