package qa

import (
	"errors"
	"fmt"
	"slices"
	"strings"

	"gaugeline/detail"
	"gaugeline/detail/measured"
	"gaugeline/engine"
	"gaugeline/rules/units"
)

// A splice plate (plate.kind splice, --part splice-1 or splice-2; --part
// plate on a splice job is splice-1) carries both members' hole groups:
// member A's (the job's holes, ids H…) and member B's, A's mirrored about
// the joint (engine.SpliceHoles: x = −gap − x, ids BH…). Its design holes
// are both groups in the splice plate's own frame, the frame of its CAM
// file (detail/sheet/splice.go: x' = FreeEdge − x, y' = YMax − y, so A's
// group is at x' = FreeEdge − x and B's at x' = FreeEdge + gap + x), and
// the measured holes are matched to all of them at once. The as-built
// check runs per member end: member A's connection with A's group as
// built in the plate ply, member B's (the same connection, mirrored) with
// B's group as built, mirrored back into A's frame. The members' plies
// keep their designed shape: a plate's holes never count against the
// member. The verdict covers the plate. With plate.count 2 the two plates
// are designed alike, so splice-1 and splice-2 differ only in their name.

// ErrNoSplice is returned when a splice plate is measured for a design
// without one.
var ErrNoSplice = errors.New("the job has no splice plate: a measured splice plate needs plate.kind: splice")

// SplicePlate is a splice plate measured.
type SplicePlate struct {
	// Holes are the plate's design holes in the job's frame: member A's
	// (the first NA), then member B's.
	Holes []engine.Hole
	NA    int
	Gap   units.Length // plate.gap, between the member ends
	Count int          // plate.count: the splice plates of the joint
	// BReport is member B's end as built (its group mirrored back into
	// A's frame); nil when none of B's holes was found.
	BReport *detail.Report
}

// ReverifySplice re-verifies a splice plate of design d (plate.kind
// splice) from its measured holes: both members' groups matched at once
// in the plate's frame, each member's end checked as built.
func ReverifySplice(d *detail.Design, set *measured.Set, opt ReverifyOptions) (*AsBuilt, error) {
	if !opt.Part.isSplicePlate() {
		panic("qa: ReverifySplice needs a splice plate part (--part splice-1 or splice-2)")
	}
	pl := d.Conn.Plate
	if pl == nil || pl.Kind != engine.Splice {
		return nil, ErrNoSplice
	}
	if set == nil || len(set.Holes) == 0 {
		panic("qa: ReverifySplice needs measured holes")
	}
	ab, err := newAsBuilt(d, set, opt)
	if err != nil {
		return nil, err
	}
	sp := &SplicePlate{NA: len(d.Conn.Holes), Gap: pl.Gap, Count: pl.Plates()}
	sp.Holes = append(slices.Clone(d.Conn.Holes), engine.SpliceHoles(&d.Conn)...)
	ab.Splice = sp
	if err := ab.run(opt.Align); err != nil {
		return nil, err
	}
	return ab, nil
}

// groupOf is the member group of design hole i of the splice plate, or
// (i < 0) of an extra hole at x' in the plate's frame: the side of the
// joint's middle (x' = FreeEdge + gap/2) it lies on. "" for no splice.
func (sp *SplicePlate) groupOf(i int, x units.Length, fe units.Length) string {
	switch {
	case sp == nil:
		return ""
	case i >= 0 && i < sp.NA, i < 0 && x < fe+sp.Gap/2:
		return "A"
	}
	return "B"
}

// checkSplice checks each member's end as built: A's group in A's
// connection, B's mirrored back about the joint into the same
// connection. An extra hole counts with the group on its side.
func (ab *AsBuilt) checkSplice() error {
	sp := ab.Splice
	holes := ab.designHoles()
	var a, b []engine.Hole
	for i, dv := range ab.Deviations {
		if dv.Status == HoleMissing {
			continue
		}
		var design *engine.Hole // deviations list the design holes first, in order
		if dv.Status != HoleExtra {
			design = &holes[i]
		}
		h := ab.asBuiltHole(dv, design, true)
		if dv.Group == "B" {
			h.X = -sp.Gap - h.X
			b = append(b, h)
			continue
		}
		a = append(a, h)
	}
	da, db := ab.Design, ab.Design
	if bs := ab.Design.Conn.MemberBSide(); bs != nil {
		// member_b: each group is checked with its own member in the
		// member's place, member B's results named as in the design's
		a, b := *ab.Design, *ab.Design
		a.Conn.MemberB, a.InfoB = nil, nil
		b.Conn, b.Info, b.InfoB = *bs, *ab.Design.InfoB, nil
		da, db = &a, &b
	}
	if len(a) == 0 {
		ab.Report = ab.unchecked("member A's holes")
	} else {
		r, err := ab.checkBuilt(da, a)
		if err != nil {
			return err
		}
		ab.Report = r
	}
	if len(b) == 0 {
		return nil
	}
	br, err := ab.checkBuilt(db, b)
	if err == nil && db != da {
		for i := range br.Results {
			br.Results[i].ID = engine.MemberBID(br.Results[i].ID)
		}
	}
	sp.BReport = br
	return err
}

// decideSplice adds member B's end as built to the verdict (member A's
// is the as-built report's; the design is one for both).
func (ab *AsBuilt) decideSplice() {
	if br := ab.Splice.BReport; br != nil && !br.Pass {
		ab.Verdict = Reject
		ab.Reasons = append(ab.Reasons, "member B's group fails as built: "+strings.Join(br.Failing(), ", "))
	}
}

// partRow is the report's part line for a splice plate.
func (sp *SplicePlate) partRow(p MeasuredPart) string {
	which := "the splice plate"
	if sp.Count == 2 {
		which = fmt.Sprintf("splice plate %s of 2 (one each side, designed alike)", strings.TrimPrefix(p.String(), "splice-"))
	}
	return p.String() + ": " + which + ", both members' groups (H… member A, BH… member B, A's mirrored about the joint), " +
		"reclassified from the measured sizes, the members' as designed; coordinates in the splice plate's frame " +
		"(x from its end past member A's group, y from the side its CAM file puts at y = 0); each member's end checked as built"
}

// caution is the as-built check's note on a splice plate.
func (sp *SplicePlate) caution() string {
	return "As built: a splice plate was measured. Its holes take the measured sizes and the hole types they now are; " +
		"the members' holes keep their designed type and size. Member A's group (H…) is checked as member A's end; member B's (BH…), " +
		"mirrored back about the joint (x = −gap − x), as member B's, the same connection. Each bolt has one centre, the measured one, in both parts; " +
		"the plate's end and centre line are where the file's frame puts them, the members' ends and edges as designed."
}

// spliceText writes member B's as-built tables of the text report.
func (ab *AsBuilt) spliceText(b *strings.Builder) {
	if sp := ab.Splice; sp != nil && sp.BReport != nil {
		ab.secondCheck(ab.DesignReport, sp.BReport, "MEMBER B'S GROUP", "mirrored about the joint").text(b)
	}
}

// spliceMarkdown writes member B's as-built sections of the Markdown
// report.
func (ab *AsBuilt) spliceMarkdown(b *strings.Builder) {
	if sp := ab.Splice; sp != nil && sp.BReport != nil {
		ab.secondCheck(ab.DesignReport, sp.BReport, "Member B's group", "Mirrored about the joint into member A's frame.").markdown(b)
	}
}

// jsonSplice is the splice plate in the reverify JSON (splice): the
// joint, and member B's group as built (its fields mean what piece.far's
// do, for member B's end; absent when none of B's holes was found).
type jsonSplice struct {
	Plates  int            `json:"plates"`
	Gap     detail.JSONNum `json:"gap"`
	MemberB *jsonFarEnd    `json:"member_b,omitempty"`
}

// spliceDocument is the JSON's splice; nil for no splice plate.
func (ab *AsBuilt) spliceDocument() *jsonSplice {
	sp := ab.Splice
	if sp == nil {
		return nil
	}
	sys := ab.Design.Job.Units
	j := &jsonSplice{Plates: sp.Count, Gap: detail.JSONNum(sys.ToJob(float64(sp.Gap), units.DimLength))}
	if br := sp.BReport; br != nil {
		doc := br.Document()
		j.MemberB = &jsonFarEnd{AsBuilt: br.Verdict(), DesignVerdict: ab.DesignReport.Verdict(), Governing: doc.Governing,
			GoverningRatio: doc.GoverningRatio, Failing: doc.Failing, DesignFailing: append([]string{}, ab.DesignReport.Failing()...),
			LimitStates: doc.LimitStates, Detailing: doc.Detailing}
		j.MemberB.DesignRatios, j.MemberB.RatioChange = ratioMaps(ab.DesignReport, br)
	}
	return j
}
