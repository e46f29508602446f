package sheet

import (
	"math"
	"slices"
	"strings"
	"testing"

	"gaugeline/rules"

	"gonum.org/v1/gonum/spatial/r2"
)

// item is one call a recording painter received.
type item struct {
	kind   string // line, circle, polyline, text
	pts    []r2.Vec
	bulges []float64
	r      float64
	text   Text
	layer  Layer
}

// recorder is a Painter that keeps every call.
type recorder struct {
	layers [][]Layer
	items  []item
}

func (r *recorder) Layers(ls []Layer) {
	if len(r.items) > 0 {
		panic("Layers after drawing")
	}
	r.layers = append(r.layers, slices.Clone(ls))
}
func (r *recorder) Line(a, b r2.Vec, l Layer) {
	r.items = append(r.items, item{kind: "line", pts: []r2.Vec{a, b}, layer: l})
}
func (r *recorder) Circle(c r2.Vec, rad float64, l Layer) {
	r.items = append(r.items, item{kind: "circle", pts: []r2.Vec{c}, r: rad, layer: l})
}
func (r *recorder) ClosedPolyline(pts []r2.Vec, bulges []float64, l Layer) {
	r.items = append(r.items, item{kind: "polyline", pts: slices.Clone(pts), bulges: slices.Clone(bulges), layer: l})
}
func (r *recorder) Text(t Text) {
	r.items = append(r.items, item{kind: "text", text: t, layer: t.Layer})
}

// box is the box around what was drawn, found here from the drawn items
// themselves: a polyline's arcs by their centre and sweep (a bulge b
// spans 4·atan(b), SPEC §7's bulge convention, the DXF one), a text by
// Text.Box.
func (r *recorder) box() (lo, hi r2.Vec) {
	lo = r2.Vec{X: math.Inf(1), Y: math.Inf(1)}
	hi = r2.Vec{X: math.Inf(-1), Y: math.Inf(-1)}
	grow := func(q r2.Vec) {
		lo = r2.Vec{X: min(lo.X, q.X), Y: min(lo.Y, q.Y)}
		hi = r2.Vec{X: max(hi.X, q.X), Y: max(hi.Y, q.Y)}
	}
	for _, it := range r.items {
		switch it.kind {
		case "line":
			grow(it.pts[0])
			grow(it.pts[1])
		case "circle":
			c := it.pts[0]
			grow(r2.Vec{X: c.X - it.r, Y: c.Y - it.r})
			grow(r2.Vec{X: c.X + it.r, Y: c.Y + it.r})
		case "polyline":
			for i, p := range it.pts {
				grow(p)
				if it.bulges == nil || it.bulges[i] == 0 {
					continue
				}
				q := it.pts[(i+1)%len(it.pts)]
				theta := 4 * math.Atan(it.bulges[i])
				chord := math.Hypot(q.X-p.X, q.Y-p.Y)
				rad := chord / 2 / math.Sin(theta/2)
				// The centre is off the chord's midpoint, to the left of p→q
				// for a counter-clockwise arc.
				off := rad * math.Cos(theta/2)
				c := r2.Vec{X: (p.X+q.X)/2 - (q.Y-p.Y)/chord*off, Y: (p.Y+q.Y)/2 + (q.X-p.X)/chord*off}
				a0 := math.Atan2(p.Y-c.Y, p.X-c.X)
				for k := range 4 {
					phi := float64(k) * math.Pi / 2
					if math.Mod(phi-a0+4*math.Pi, 2*math.Pi) <= theta+1e-12 {
						grow(r2.Vec{X: c.X + math.Abs(rad)*math.Cos(phi), Y: c.Y + math.Abs(rad)*math.Sin(phi)})
					}
				}
			}
		case "text":
			a, b := it.text.Box()
			grow(a)
			grow(b)
		}
	}
	return lo, hi
}

func nearPoint(a, b r2.Vec) bool { return near(a.X, b.X) && near(a.Y, b.Y) }

// The sheet's walk declares every layer first, draws each view's part at
// its origin (one item per hole, a circle or a slot's outline), every
// dimension as Dimension.Graphics lays it out, every text, and returns the
// box around all of it.
func TestSheetPaint(t *testing.T) {
	for _, path := range sheetJobs {
		_, s := sheetOf(t, path)
		var r recorder
		lo, hi := s.Paint(&r)
		if len(r.layers) != 1 || !slices.Equal(r.layers[0], Layers()) {
			t.Fatalf("%s: layers %v, want %v once", path, r.layers, Layers())
		}
		var wantLines, wantTexts, wantArrows, wantContours int
		var holes []SheetHole // in the sheet's frame
		for _, v := range s.Views {
			wantLines += len(v.Lines)
			wantContours++
			if v.Break != nil { // two pieces; a line across the break drawn as two
				wantContours++
				for _, l := range v.Lines {
					if _, _, ok := splitAtBreak(l, v.Break); ok {
						wantLines++
					}
				}
			}
			wantTexts += len(v.Texts)
			for _, d := range v.Dims {
				g := d.Graphics(s.TextHeight)
				wantLines += len(g.Lines) + len(g.Leaders)
				wantArrows += len(g.Arrows)
				wantTexts += len(g.Texts)
			}
			for _, h := range v.Part.Holes {
				h.Centre = r2.Add(v.Fold(h.Centre), v.Origin)
				holes = append(holes, h)
			}
		}
		wantLines += len(s.Lines)
		wantTexts += len(s.Texts)
		count := map[string]int{}
		var drawnHoles []item
		for _, it := range r.items {
			count[it.kind]++
			if it.layer == LayerHoles {
				drawnHoles = append(drawnHoles, it)
			}
		}
		if count["line"] != wantLines || count["text"] != wantTexts || count["polyline"] != wantContours+wantArrows+len(holes)-count["circle"] {
			t.Errorf("%s: drew %v; want %d lines, %d texts, %d contours, %d arrows and %d holes", path, count,
				wantLines, wantTexts, wantContours, wantArrows, len(holes))
		}
		if len(drawnHoles) != len(holes) {
			t.Fatalf("%s: %d items on the holes layer, %d holes", path, len(drawnHoles), len(holes))
		}
		for i, h := range holes {
			it := drawnHoles[i]
			if h.Round() {
				if it.kind != "circle" || !nearPoint(it.pts[0], h.Centre) || !near(2*it.r, h.Diameter()) {
					t.Errorf("%s: hole %s drawn as %+v", path, h.ID, it)
				}
				continue
			}
			want, bulges := h.SlotOutline()
			if it.kind != "polyline" || len(it.pts) != len(want) || !slices.Equal(it.bulges, bulges) {
				t.Errorf("%s: slot %s drawn as %+v", path, h.ID, it)
				continue
			}
			for k := range want {
				if !nearPoint(it.pts[k], want[k]) {
					t.Errorf("%s: slot %s vertex %d at %v, want %v", path, h.ID, k, it.pts[k], want[k])
				}
			}
		}
		wlo, whi := r.box()
		if !nearPoint(lo, wlo) || !nearPoint(hi, whi) {
			t.Errorf("%s: extents %v–%v, box of what was drawn %v–%v", path, lo, hi, wlo, whi)
		}
	}
}

// A part alone is its contour and holes in its own frame, on the contour
// and holes layers only.
func TestPartPaint(t *testing.T) {
	for _, path := range sheetJobs {
		_, s := sheetOf(t, path)
		for _, v := range s.Views {
			p := v.Part
			var r recorder
			lo, hi := p.Paint(&r)
			if len(r.layers) != 1 || !slices.Equal(r.layers[0], []Layer{LayerContour, LayerHoles}) {
				t.Fatalf("%s %s: layers %v", path, p.Name, r.layers)
			}
			if len(r.items) != 1+len(p.Holes) {
				t.Fatalf("%s %s: %d items for a contour and %d holes", path, p.Name, len(r.items), len(p.Holes))
			}
			if c := r.items[0]; c.kind != "polyline" || c.layer != LayerContour || !slices.Equal(c.pts, p.Contour) || c.bulges != nil {
				t.Errorf("%s %s: contour drawn as %+v, want %v", path, p.Name, c, p.Contour)
			}
			for i, it := range r.items[1:] {
				h := p.Holes[i]
				if it.layer != LayerHoles || h.Round() && (it.kind != "circle" || it.pts[0] != h.Centre) {
					t.Errorf("%s %s: hole %s drawn as %+v", path, p.Name, h.ID, it)
				}
			}
			// The holes lie inside the contour: the extents are the part's.
			blo, bhi := p.Bounds()
			wlo, whi := r.box()
			if lo != blo || hi != bhi || !nearPoint(lo, wlo) || !nearPoint(hi, whi) {
				t.Errorf("%s %s: extents %v–%v, part %v–%v, drawn %v–%v", path, p.Name, lo, hi, blo, bhi, wlo, whi)
			}
		}
	}
}

// A slot past the contour's edge stretches the extents to its half-circle
// ends, a circle to its radius: a 22 × 26 slot along x centred on the
// right edge of a 100 × 50 part reaches 13 past it; a 20 round hole on the
// top edge reaches 10 above (the sizes of TestSlotOutline).
func TestPaintExtentsReachHoles(t *testing.T) {
	p := Part{Contour: []r2.Vec{{X: 0, Y: 0}, {X: 100, Y: 0}, {X: 100, Y: 50}, {X: 0, Y: 50}}, Holes: []SheetHole{
		{ID: "H1", Centre: r2.Vec{X: 100, Y: 25}, Dx: 26, Dy: 22, Type: rules.ShortSlot},
		{ID: "H2", Centre: r2.Vec{X: 40, Y: 50}, Dx: 20, Dy: 20, Type: rules.Standard},
	}}
	var r recorder
	lo, hi := p.Paint(&r)
	if want := (r2.Vec{X: 113, Y: 60}); lo != (r2.Vec{X: 0, Y: 0}) || hi != want {
		t.Errorf("extents %v–%v, want (0,0)–%v", lo, hi, want)
	}
	if wlo, whi := r.box(); !nearPoint(lo, wlo) || !nearPoint(hi, whi) {
		t.Errorf("extents %v–%v, box of what was drawn %v–%v", lo, hi, wlo, whi)
	}
}

// marker is a recorder that is also a HoleMarker: it keeps each
// BeginHole with the number of items drawn before it.
type marker struct {
	recorder
	begun []begun
}

type begun struct {
	part   string
	h      SheetHole
	at     r2.Vec
	before int // items drawn before the call
}

func (m *marker) BeginHole(part string, h SheetHole, at r2.Vec) {
	m.begun = append(m.begun, begun{part: part, h: h, at: at, before: len(m.items)})
}

// Paint draws each view as PaintView draws it at the view's origin, one
// after the other, and then the sheet's own lines and texts; PaintView at
// another point draws the same items moved by the difference, and returns
// the box around them.
func TestPaintDrawsEachViewAsPaintView(t *testing.T) {
	for _, path := range sheetJobs {
		_, s := sheetOf(t, path)
		var whole recorder
		s.Paint(&whole)
		var views []item
		for i, v := range s.Views {
			var r recorder
			s.PaintView(&r, i, v.Origin)
			if len(r.layers) != 1 || !slices.Equal(r.layers[0], Layers()) {
				t.Fatalf("%s view %d: layers %v, want %v once", path, i, r.layers, Layers())
			}
			views = append(views, r.items...)

			var at recorder
			lo, hi := s.PaintView(&at, i, r2.Vec{})
			if len(at.items) != len(r.items) {
				t.Fatalf("%s view %d: %d items at the origin, %d at the view's origin", path, i, len(at.items), len(r.items))
			}
			for k, it := range at.items {
				want := r.items[k]
				moved := it.kind == want.kind && it.layer == want.layer && len(it.pts) == len(want.pts) && near(it.r, want.r) &&
					slices.Equal(it.bulges, want.bulges)
				for j := range it.pts {
					moved = moved && nearPoint(r2.Add(it.pts[j], v.Origin), want.pts[j])
				}
				if it.kind == "text" {
					tt := it.text
					tt.At = r2.Add(tt.At, v.Origin)
					moved = moved && nearPoint(tt.At, want.text.At) && tt.Value == want.text.Value
				}
				if !moved {
					t.Errorf("%s view %d item %d: %+v at the origin, %+v at %v", path, i, k, it, want, v.Origin)
				}
			}
			if wlo, whi := at.box(); !nearPoint(lo, wlo) || !nearPoint(hi, whi) {
				t.Errorf("%s view %d: extents %v–%v, box of what was drawn %v–%v", path, i, lo, hi, wlo, whi)
			}
		}
		if len(whole.items) != len(views)+len(s.Lines)+len(s.Texts) {
			t.Fatalf("%s: Paint drew %d items; the views %d, the sheet's lines and texts %d", path,
				len(whole.items), len(views), len(s.Lines)+len(s.Texts))
		}
		for k, it := range views {
			w := whole.items[k]
			if it.kind != w.kind || it.layer != w.layer || !slices.Equal(it.pts, w.pts) || it.text != w.text {
				t.Errorf("%s item %d: Paint drew %+v, PaintView %+v", path, k, w, it)
			}
		}
	}
}

// A painter that is a HoleMarker is told of every hole, in the part's
// frame, just before the one item that draws it, with its centre on the
// drawing; Paint, PaintView and Part.Paint all tell it.
func TestHoleMarker(t *testing.T) {
	for _, path := range sheetJobs {
		_, s := sheetOf(t, path)
		type drawing struct {
			name  string
			paint func(*marker)
			views []View // the views drawn, with the origin each is drawn at
		}
		var ds []drawing
		ds = append(ds, drawing{"sheet", func(m *marker) { s.Paint(m) }, s.Views})
		for i, v := range s.Views {
			at := r2.Vec{X: 1.5, Y: -2}
			moved := v
			moved.Origin = at
			ds = append(ds, drawing{"view " + v.Part.Name, func(m *marker) { s.PaintView(m, i, at) }, []View{moved}})
			alone := v
			alone.Origin, alone.Break = r2.Vec{}, nil // a part alone is whole
			ds = append(ds, drawing{"part " + v.Part.Name, func(m *marker) { v.Part.Paint(m) }, []View{alone}})
		}
		for _, d := range ds {
			var m marker
			d.paint(&m)
			var want []begun
			for _, v := range d.views {
				for _, h := range v.Part.Holes {
					want = append(want, begun{part: v.Part.Name, h: h, at: r2.Add(v.Fold(h.Centre), v.Origin)})
				}
			}
			if len(m.begun) != len(want) {
				t.Fatalf("%s %s: %d holes begun, want %d", path, d.name, len(m.begun), len(want))
			}
			for k, b := range m.begun {
				w := want[k]
				if b.part != w.part || b.h != w.h || !nearPoint(b.at, w.at) {
					t.Errorf("%s %s: hole %d begun as %s %+v at %v, want %s %+v at %v", path, d.name, k, b.part, b.h, b.at, w.part, w.h, w.at)
				}
				if b.before >= len(m.items) {
					t.Fatalf("%s %s: hole %s begun after the last item", path, d.name, b.h.ID)
				}
				it := m.items[b.before]
				if it.layer != LayerHoles || b.h.Round() && (it.kind != "circle" || !nearPoint(it.pts[0], b.at)) ||
					!b.h.Round() && it.kind != "polyline" {
					t.Errorf("%s %s: hole %s drawn as %+v", path, d.name, b.h.ID, it)
				}
			}
			// Every item on the holes layer is one that a BeginHole announced.
			announced := map[int]bool{}
			for _, b := range m.begun {
				announced[b.before] = true
			}
			for k, it := range m.items {
				if it.layer == LayerHoles && !announced[k] {
					t.Errorf("%s %s: item %d on the holes layer without BeginHole", path, d.name, k)
				}
			}
		}
	}
}

// PaintMarked draws what Paint draws, then the part's label on LayerMark
// alone, left-aligned one text height above the contour's top left
// corner, inside the extents it returns; without a label, what Paint
// draws. The 100 × 50 part of TestPaintExtentsReachHoles.
func TestPaintMarkedAddsTheLabel(t *testing.T) {
	p := Part{Contour: []r2.Vec{{X: 0, Y: 0}, {X: 100, Y: 0}, {X: 100, Y: 50}, {X: 0, Y: 50}}, Holes: []SheetHole{
		{ID: "H1", Centre: r2.Vec{X: 40, Y: 25}, Dx: 20, Dy: 20, Type: rules.Standard}}}
	var plain, bare, marked recorder
	p.Paint(&plain)
	p.PaintMarked(&bare, 5)
	if !slices.Equal(bare.layers[0], []Layer{LayerContour, LayerHoles, LayerMark}) || len(bare.items) != len(plain.items) {
		t.Errorf("without a label: layers %v, %d items; Paint drew %d", bare.layers, len(bare.items), len(plain.items))
	}
	p.Label = "X-1-P QTY 2 A36 T 1/2\""
	_, hi := p.PaintMarked(&marked, 5)
	if len(marked.items) != len(plain.items)+1 {
		t.Fatalf("%d items, want Paint's %d and the label", len(marked.items), len(plain.items))
	}
	got := marked.items[len(marked.items)-1]
	want := Text{At: r2.Vec{X: 0, Y: 55}, Height: 5, Align: AlignLeftBase, Value: p.Label, Layer: LayerMark}
	if got.kind != "text" || got.text != want {
		t.Errorf("last item %+v, want the text %+v", got, want)
	}
	if _, thi := want.Box(); hi != (r2.Vec{X: max(100, thi.X), Y: thi.Y}) {
		t.Errorf("extents reach %v, the label's box %v", hi, thi)
	}
}

// Each CAM part's label is its bill-of-material row: mark, quantity,
// grade and thickness (the size's, which ends in it: L4x4x1/2, PL 1/2 x
// …), with mm in si.
func TestPartLabelFromBillOfMaterial(t *testing.T) {
	for _, path := range sheetJobs {
		_, s := sheetOf(t, path)
		for _, v := range s.Views {
			var row []string
			for _, r := range s.BillOfMaterial {
				if r[8] == s.Mark+"-"+v.Part.Name+".cam.dxf" {
					row = r
				}
			}
			if row == nil {
				t.Fatalf("%s: no bill-of-material row for %s", path, v.Part.Name)
			}
			want := row[0] + " QTY " + row[1] + " " + row[4] + " T "
			thickness, ok := strings.CutPrefix(v.Part.Label, want)
			if !ok {
				t.Fatalf("%s %s: label %q, want it to start %q", path, v.Part.Name, v.Part.Label, want)
			}
			if bare := strings.TrimSuffix(strings.TrimSuffix(thickness, `"`), " mm"); !strings.Contains(row[3], bare) {
				t.Errorf("%s %s: thickness %q is not in the size %q", path, v.Part.Name, thickness, row[3])
			}
		}
	}
}
