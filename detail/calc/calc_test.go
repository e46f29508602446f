package calc

import (
	"bytes"
	"fmt"
	"math"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"golang.org/x/net/html"
	"gonum.org/v1/gonum/spatial/r2"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
	"gaugeline/detail/sheet"
	"gaugeline/engine"
	"gaugeline/rules"
	"gaugeline/rules/units"
)

// jobs are every shape in both unit systems, with and without a plate,
// passing and failing: the testdata jobs (the laid-out pipe-rack brace
// among them) and the published example.
func jobs(t *testing.T) []string {
	t.Helper()
	var out []string
	for _, pat := range []string{"../../testdata/jobs/*.yaml", "../../testdata/examples/*.yaml"} {
		m, err := filepath.Glob(pat)
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, m...)
	}
	if len(out) < 5 {
		t.Fatalf("found only %d jobs", len(out))
	}
	for _, name := range []string{"long-splice-asd.yaml", "si-flat-alone.yaml", "filler-bearing.yaml", "si-filler-slip.yaml", "ply-long-slot.yaml"} {
		out = append(out, "inline:"+name)
	}
	return out
}

// inline are invented jobs for what the test data lacks: US ASD under
// 360-16, a double angle into a splice plate (the 0.85·Ag cap applies),
// slip-critical with oversized holes and a pattern long enough for the
// long-joint reduction, failing an edge distance only; an SI flat bar
// with no plate; a US bearing joint through 1/2 in of undeveloped fillers
// (J5.2(a) factor 0.90); an SI slip-critical joint under 360-16 through
// 20 mm of fillers (the 0.85 floor) with two fillers (hf 0.85); a US angle with long slots
// in the member and standard holes in the plate.
var inline = map[string]string{
	"ply-long-slot.yaml": `mark: PLY-1
units: us
load:
  required: 60 kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
  hole: long-slot
  slot: transverse
plate:
  thickness: 1/2 in
  grade: A36
  width: 12 in
  edge: 1-1/2 in
  hole: standard
bolts:
  diameter: 7/8 in
  grade: A325
  per_line: 4
  pitch: 3 in
  end: 1-1/2 in
  gage: 2-1/2 in
`,
	"filler-bearing.yaml": `mark: FL-1
units: us
standard: aisc360-22
method: lrfd
load:
  required: 60 kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
plate:
  thickness: 1/2 in
  grade: A572-50
  width: 12 in
  edge: 1-1/2 in
bolts:
  diameter: 3/4 in
  grade: A325
  fillers: 1
  filler_thickness: 1/2 in
  per_line: 4
  pitch: 3 in
  end: 1-1/2 in
  gage: 2-1/2 in
`,
	"si-filler-slip.yaml": `mark: FL-2
units: si
standard: aisc360-16
method: asd
load:
  required: 150 kN
member:
  shape: double-angle
  size: L100x100x10
  grade: A572-50
plate:
  thickness: 12 mm
  grade: A572-50
  width: 250 mm
  edge: 40 mm
bolts:
  diameter: M20
  grade: A325M
  joint: slip-critical
  surface: A
  fillers: 2+
  filler_thickness: 20 mm
  per_line: 3
  pitch: 70 mm
  end: 40 mm
  gage: 55 mm
`,
	"long-splice-asd.yaml": `mark: LONG-1
units: us
standard: aisc360-16
method: asd
load:
  required: 150 kip
member:
  shape: double-angle
  size: L6x4x1/2
  grade: A36
plate:
  kind: splice
  thickness: 3/4 in
  grade: A36
  width: 20 in
  edge: 2 in
bolts:
  diameter: 7/8 in
  grade: A325
  threads: excluded
  joint: slip-critical
  surface: A
  hole: oversized
  lines: 2
  per_line: 12
  pitch: 3-1/2 in
  end: 2 in
  gage: 2-1/2 in
  gage2: 2-1/2 in
`,
	"si-flat-alone.yaml": `mark: SF-2
units: si
standard: aisc360-22
method: lrfd
load:
  required: 400 kN
member:
  shape: flat
  width: 150 mm
  thickness: 12 mm
  grade: A572-50
bolts:
  diameter: M20
  grade: A325M
  lines: 2
  per_line: 3
  pitch: 70 mm
  end: 40 mm
  gage: 40 mm
  gage2: 70 mm
`,
}

func check(t *testing.T, path string) *detail.Report {
	t.Helper()
	var j *jobfile.Job
	var err error
	if name, ok := strings.CutPrefix(path, "inline:"); ok {
		j, err = jobfile.ParseJob(name, []byte(inline[name]))
	} else {
		j, err = jobfile.LoadJob(path)
	}
	if err != nil {
		t.Fatal(err)
	}
	r, err := detail.CheckJob(j) // both ends
	if err != nil {
		t.Fatal(err)
	}
	return r
}

func render(t *testing.T, r *detail.Report) (*html.Node, []byte) {
	t.Helper()
	b, err := HTML(r)
	if err != nil {
		t.Fatal(err)
	}
	doc, err := html.Parse(bytes.NewReader(b))
	if err != nil {
		t.Fatalf("the report does not parse as HTML: %v", err)
	}
	return doc, b
}

func attr(n *html.Node, key string) (string, bool) {
	for _, a := range n.Attr {
		if a.Key == key {
			return a.Val, true
		}
	}
	return "", false
}

// find returns every element for which keep is true, in document order.
func find(n *html.Node, keep func(*html.Node) bool) []*html.Node {
	var out []*html.Node
	var walk func(*html.Node)
	walk = func(n *html.Node) {
		if n.Type == html.ElementNode && keep(n) {
			out = append(out, n)
		}
		for c := n.FirstChild; c != nil; c = c.NextSibling {
			walk(c)
		}
	}
	walk(n)
	return out
}

func text(n *html.Node) string {
	var b strings.Builder
	var walk func(*html.Node)
	walk = func(n *html.Node) {
		if n.Type == html.TextNode {
			b.WriteString(n.Data)
		}
		for c := n.FirstChild; c != nil; c = c.NextSibling {
			walk(c)
		}
	}
	walk(n)
	return b.String()
}

func byID(doc *html.Node, id string) *html.Node {
	ns := find(doc, func(n *html.Node) bool { v, _ := attr(n, "id"); return v == id })
	if len(ns) != 1 {
		return nil
	}
	return ns[0]
}

// Every limit state of the check has its own section, which names its id
// and clause and shows its formula, steps and result; the governing one is
// marked; the caution is on the page, prominently and in the footer.
func TestReportHasEveryLimitState(t *testing.T) {
	for _, path := range jobs(t) {
		t.Run(filepath.Base(path), func(t *testing.T) {
			r := check(t, path)
			doc, _ := render(t, r)
			all := text(doc)
			sections := find(doc, func(n *html.Node) bool {
				_, ok := attr(n, "data-id")
				_, far := attr(n, "data-end")
				return n.Data == "section" && ok && !far
			})
			if len(sections) != len(r.Results) {
				t.Fatalf("%d limit-state sections, want %d", len(sections), len(r.Results))
			}
			for i, x := range r.Results {
				s := sections[i]
				id, _ := attr(s, "data-id")
				clause, _ := attr(s, "data-clause")
				if id != x.ID || clause != x.Clause {
					t.Errorf("section %d is %s (%s), want %s (%s)", i, id, clause, x.ID, x.Clause)
				}
				st := text(s)
				for _, want := range []string{x.ID, x.Clause, "Formula", "Rn"} {
					if !strings.Contains(st, want) {
						t.Errorf("%s: section does not say %q", x.ID, want)
					}
				}
				class, _ := attr(s, "class")
				if gov := strings.Contains(class, "governs"); gov != (i == r.Governing) {
					t.Errorf("%s: class %q, governing is %d", x.ID, class, r.Governing)
				}
				if x.PerBolt != nil {
					tb := find(s, func(n *html.Node) bool { c, _ := attr(n, "class"); return n.Data == "table" && c == "perbolt" })
					if len(tb) != 1 || !strings.Contains(text(tb[0]), x.PerBolt[0].Hole) {
						t.Errorf("%s: no per-bolt table", x.ID)
					}
				}
			}
			for _, f := range r.Findings {
				if !strings.Contains(all, f.ID) || !strings.Contains(all, f.Clause) {
					t.Errorf("finding %s (%s) is not on the page", f.ID, f.Clause)
				}
			}
			c := byID(doc, "caution")
			if c == nil || !strings.Contains(text(c), detail.Caution) {
				t.Error("the caution is not in its box")
			}
			v := byID(doc, "verdict")
			if v == nil || (text(v) == "PASSES") != r.Pass {
				t.Errorf("verdict box %q, pass %v", text(v), r.Pass)
			}
			g, where := r.GoverningEnd().GoverningResult(), ""
			if r.Far != nil {
				where = " at the " + r.GoverningEndName() + " end"
			}
			if !strings.Contains(all, "Governing limit state"+where+": "+g.ID+" ("+g.Clause+")") {
				t.Error("the governing limit state is not stated")
			}
			far := find(doc, func(n *html.Node) bool { v, _ := attr(n, "data-end"); return n.Data == "section" && v == "far" })
			want := 0
			if r.Far != nil {
				want = len(r.Far.Results)
			}
			if len(far) != want {
				t.Fatalf("%d far-end sections, want %d", len(far), want)
			}
			for i, s := range far {
				if id, _ := attr(s, "data-id"); id != r.Far.Results[i].ID {
					t.Errorf("far-end section %d is %s, want %s", i, id, r.Far.Results[i].ID)
				}
			}
		})
	}
}

var translate = regexp.MustCompile(`^translate\(([-0-9.e]+) ([-0-9.e]+)\)$`)

func num(t *testing.T, n *html.Node, key string) float64 {
	t.Helper()
	s, ok := attr(n, key)
	if !ok {
		t.Fatalf("<%s> has no %s", n.Data, key)
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("%s=%q: %v", key, s, err)
	}
	return v
}

// The drawing's holes are where the job puts them: in the member view at
// the job's (x, y), in the plate view at (free edge − x, YMax − y) (the
// plate frame of the sheet model), both in the job's units. Circles are
// mapped back through the view's translate and the y flip; every hole also
// carries its position as data. Tolerance 1e-6 of a drawing unit: the SVG
// writes coordinates rounded to 1e-7.
func TestDrawingHolesMatchTheJob(t *testing.T) {
	const tol = 1e-6
	for _, path := range jobs(t) {
		t.Run(filepath.Base(path), func(t *testing.T) {
			r := check(t, path)
			doc, _ := render(t, r)
			c := &r.Design.Conn
			sys := r.Design.Job.Units
			job := func(l units.Length) float64 { return sys.ToJob(float64(l), units.DimLength) }
			// Each view's holes: centre and width, in its part's frame.
			want := map[string]map[string][3]float64{"member": {}}
			width := func(s engine.HoleShape) float64 { return job(min(s.Dx, s.Dy)) }
			for _, h := range c.Holes {
				want["member"][h.ID] = [3]float64{job(h.X), job(h.Y), width(h.HoleShape)}
			}
			// With member.length the member is whole: the far end's holes
			// F1, F2, … at x' = length − x, x of the far end's own holes
			// (far_end with bolts) or the job's (mirror), from that end.
			far := c
			if r.Far != nil {
				far = &r.Far.Design.Conn
			}
			if L := r.Design.Job.Member.Length; L > 0 {
				for i, h := range far.Holes {
					want["member"][fmt.Sprintf("F%d", i+1)] = [3]float64{job(L) - job(h.X), job(h.Y), width(h.HoleShape)}
				}
			}
			plates := map[string]*engine.Connection{"plate": c}
			if r.Far != nil {
				plates["far-plate"] = far
			}
			for name, pc := range plates {
				if pl := pc.Plate; pl != nil {
					want[name] = map[string][3]float64{}
					for _, h := range pc.Holes {
						want[name][h.ID] = [3]float64{job(pl.FreeEdge) - job(h.X), job(pl.YMax()) - job(h.Y), width(h.InPlate())}
					}
					if pl.Kind == engine.Splice {
						// member B's group, mirrored about the joint (x = −gap − x)
						for _, h := range pc.Holes {
							want[name]["B"+h.ID] = [3]float64{job(pl.FreeEdge) + job(pl.Gap) + job(h.X), job(pl.YMax()) - job(h.Y), width(h.InPlate())}
						}
					}
				}
			}
			// Where the member view has a break, a hole is drawn where the
			// view folds its part-frame centre.
			s, err := sheet.NewDrawing(r, !r.Pass)
			if err != nil {
				t.Fatal(err)
			}
			drawn := func(part string, w [3]float64) [2]float64 {
				q := s.Views[0].Fold(r2.Vec{X: w[0], Y: w[1]})
				if part != "member" {
					q = r2.Vec{X: w[0], Y: w[1]}
				}
				return [2]float64{q.X, q.Y}
			}
			svgs := find(doc, func(n *html.Node) bool { return n.Data == "svg" })
			if len(svgs) != 1 {
				t.Fatalf("%d svg elements, want 1", len(svgs))
			}
			vb, _ := attr(svgs[0], "viewBox")
			box := strings.Fields(vb)
			if len(box) != 4 || box[0] != "0" || box[1] != "0" {
				t.Fatalf("viewBox %q", vb)
			}
			vw, _ := strconv.ParseFloat(box[2], 64)
			vh, _ := strconv.ParseFloat(box[3], 64)
			views := find(svgs[0], func(n *html.Node) bool { c, _ := attr(n, "class"); return n.Data == "g" && c == "view" })
			if len(views) != len(want) {
				t.Fatalf("%d views, want %d", len(views), len(want))
			}
			for _, v := range views {
				part, _ := attr(v, "data-part")
				tr, _ := attr(v, "transform")
				m := translate.FindStringSubmatch(tr)
				if m == nil {
					t.Fatalf("view %s: transform %q", part, tr)
				}
				tx, _ := strconv.ParseFloat(m[1], 64)
				ty, _ := strconv.ParseFloat(m[2], 64)
				holes := find(v, func(n *html.Node) bool { _, ok := attr(n, "data-hole"); return ok })
				shape := c.Holes[0].HoleShape // each view draws its own part's holes
				switch part {
				case "plate":
					shape = c.Holes[0].InPlate()
				case "far-plate":
					shape = far.Holes[0].InPlate()
				}
				if len(holes) != len(want[part]) {
					t.Fatalf("view %s: %d holes drawn, want %d", part, len(holes), len(want[part]))
				}
				circles := 0
				for _, h := range holes {
					id, _ := attr(h, "data-hole")
					w, ok := want[part][id]
					if !ok {
						t.Fatalf("view %s: unexpected hole %s", part, id)
					}
					if x, y := num(t, h, "data-x"), num(t, h, "data-y"); math.Abs(x-w[0]) > tol || math.Abs(y-w[1]) > tol {
						t.Errorf("%s %s: data (%g, %g), want (%g, %g)", part, id, x, y, w[0], w[1])
					}
					if h.Data == "circle" {
						circles++
						// The view's group holds the part's frame flipped:
						// (cx, cy) = (x, −y). Its translate puts the
						// point on the page, which must show it.
						cx, cy := num(t, h, "cx"), num(t, h, "cy")
						if x, y, d := cx, -cy, drawn(part, w); math.Abs(x-d[0]) > tol || math.Abs(y-d[1]) > tol {
							t.Errorf("%s %s: circle at (%g, %g), want (%g, %g)", part, id, x, y, d[0], d[1])
						}
						if px, py := cx+tx, cy+ty; px < 0 || px > vw || py < 0 || py > vh {
							t.Errorf("%s %s: at (%g, %g) on the page, outside the viewBox %g × %g", part, id, px, py, vw, vh)
						}
						if d := 2 * num(t, h, "r"); math.Abs(d-w[2]) > tol {
							t.Errorf("%s %s: diameter %g", part, id, d)
						}
					}
				}
				if shape.Type.IsSlot() == (circles > 0) {
					t.Errorf("view %s: %d circles for %s holes", part, circles, shape.Type)
				}
			}
		})
	}
}

// pathStep is one command of a slot's path: M, L or A to (x, y), an arc
// of radius r.
type pathStep struct {
	cmd  byte
	r    float64
	x, y float64
}

var pathCmd = regexp.MustCompile(`([MLA])((?:[-0-9.e]+,[-0-9.e]+ 0 [01] [01] )?)([-0-9.e]+),([-0-9.e]+)|Z`)

func slotPath(t *testing.T, d string) []pathStep {
	t.Helper()
	var out []pathStep
	for _, m := range pathCmd.FindAllStringSubmatch(d, -1) {
		if m[0] == "Z" {
			break
		}
		st := pathStep{cmd: m[1][0]}
		if st.cmd == 'A' {
			rs := strings.SplitN(m[2], ",", 2)[0]
			st.r, _ = strconv.ParseFloat(rs, 64)
		}
		st.x, _ = strconv.ParseFloat(m[3], 64)
		st.y, _ = strconv.ParseFloat(m[4], 64)
		out = append(out, st)
	}
	return out
}

// A slot is drawn as its shape in the job: two straight sides and two half
// circles of the slot's width (an arc's ends a width apart), its outline
// reaching the slot's length along its long axis and its width across,
// about the centre the hole's data gives; a mark follows it at that
// centre. Geometry of a slot (straight sides, semicircular ends), no other
// source; tolerance 1e-6 of a drawing unit as for the circles.
func TestDrawingSlotsMatchTheJob(t *testing.T) {
	const tol = 1e-6
	seen := 0
	for _, path := range jobs(t) {
		r := check(t, path)
		doc, _ := render(t, r)
		c := &r.Design.Conn
		sys := r.Design.Job.Units
		job := func(l units.Length) float64 { return sys.ToJob(float64(l), units.DimLength) }
		s, err := sheet.NewDrawing(r, !r.Pass)
		if err != nil {
			t.Fatal(err)
		}
		for _, n := range find(doc, func(n *html.Node) bool { c, _ := attr(n, "class"); return n.Data == "path" && c == "hole slot" }) {
			seen++
			part, _ := attr(n, "data-part")
			id, _ := attr(n, "data-hole")
			shape := c.Holes[0].HoleShape
			if part == "plate" {
				shape = c.Holes[0].InPlate()
			}
			if !shape.Type.IsSlot() {
				t.Errorf("%s %s %s: drawn as a slot, a %s hole in the job", filepath.Base(path), part, id, shape.Type)
				continue
			}
			dx, dy := job(shape.Dx), job(shape.Dy)
			rad := min(dx, dy) / 2
			cx, cy := num(t, n, "data-x"), num(t, n, "data-y")
			if part == "member" { // drawn where the view folds it (a break)
				q := s.Views[0].Fold(r2.Vec{X: cx, Y: cy})
				cx, cy = q.X, q.Y
			}
			d, _ := attr(n, "d")
			steps := slotPath(t, d)
			if len(steps) != 5 || steps[0].cmd != 'M' {
				t.Fatalf("%s %s %s: path %q", filepath.Base(path), part, id, d)
			}
			arcs := 0
			lo := [2]float64{math.Inf(1), math.Inf(1)}
			hi := [2]float64{math.Inf(-1), math.Inf(-1)}
			for k, st := range steps {
				x, y := st.x, -st.y // back to the part's frame, y up
				lo = [2]float64{min(lo[0], x), min(lo[1], y)}
				hi = [2]float64{max(hi[0], x), max(hi[1], y)}
				if st.cmd != 'A' {
					continue
				}
				arcs++
				prev := steps[k-1]
				if math.Abs(st.r-rad) > tol || math.Abs(math.Hypot(st.x-prev.x, st.y-prev.y)-2*rad) > tol {
					t.Errorf("%s %s %s: arc of radius %g over a chord of %g, want half circles of radius %g", filepath.Base(path), part, id,
						st.r, math.Hypot(st.x-prev.x, st.y-prev.y), rad)
				}
			}
			if arcs != 2 {
				t.Errorf("%s %s %s: %d arcs, want 2", filepath.Base(path), part, id, arcs)
			}
			// The half circles reach r past the vertices along the long axis.
			if dx > dy {
				lo[0], hi[0] = lo[0]-rad, hi[0]+rad
			} else {
				lo[1], hi[1] = lo[1]-rad, hi[1]+rad
			}
			for k, w := range [][2]float64{{lo[0], cx - dx/2}, {hi[0], cx + dx/2}, {lo[1], cy - dy/2}, {hi[1], cy + dy/2}} {
				if math.Abs(w[0]-w[1]) > tol {
					t.Errorf("%s %s %s: outline edge %d at %g, want %g", filepath.Base(path), part, id, k, w[0], w[1])
				}
			}
			mark := n.NextSibling
			for mark != nil && mark.Type != html.ElementNode {
				mark = mark.NextSibling
			}
			if c, _ := attr(mark, "class"); mark == nil || c != "slot-centre" ||
				math.Abs(num(t, mark, "cx")-cx) > tol || math.Abs(-num(t, mark, "cy")-cy) > tol {
				t.Errorf("%s %s %s: no centre mark at (%g, %g) after the slot", filepath.Base(path), part, id, cx, cy)
			}
		}
	}
	if seen == 0 {
		t.Fatal("no job draws a slot")
	}
}

// The page is a pure function of the job: checked twice, rendered twice,
// the same bytes.
func TestReportIsDeterministic(t *testing.T) {
	for _, path := range jobs(t) {
		_, a := render(t, check(t, path))
		_, b := render(t, check(t, path))
		if !bytes.Equal(a, b) {
			t.Errorf("%s: two renderings differ", filepath.Base(path))
		}
	}
}

// Self-contained: nothing is fetched, nothing runs.
func TestReportIsSelfContained(t *testing.T) {
	for _, path := range jobs(t) {
		doc, b := render(t, check(t, path))
		for _, tag := range []string{"script", "link", "img", "iframe", "object", "embed", "base"} {
			if n := find(doc, func(n *html.Node) bool { return n.Data == tag }); len(n) > 0 {
				t.Errorf("%s: has <%s>", filepath.Base(path), tag)
			}
		}
		s := strings.ReplaceAll(string(b), `xmlns="http://www.w3.org/2000/svg"`, "")
		for _, bad := range []string{"http:", "https:", "url(", "@import", "@font-face"} {
			if strings.Contains(s, bad) {
				t.Errorf("%s: contains %q", filepath.Base(path), bad)
			}
		}
	}
}

// The φ and Ω the page prints are the ones the check used: φRn or Rn/Ω of
// the factor read off the page gives the available strength. Exact to
// rounding: AISC 360 prints every φ and Ω with two decimals, as the page
// does.
func TestPrintedFactorsGiveTheAvailableStrength(t *testing.T) {
	for _, path := range jobs(t) {
		r := check(t, path)
		c := &r.Design.Conn
		doc, _ := render(t, r)
		label := "Resistance factor φ"
		if c.Method == rules.ASD {
			label = "Safety factor Ω"
		}
		for _, x := range r.Results {
			if x.ID == "member.combined" {
				continue // an interaction, no single φ: its own rows, checked in TestFormulasOnThePage…
			}
			s := find(doc, func(n *html.Node) bool {
				v, _ := attr(n, "data-id")
				_, far := attr(n, "data-end")
				return n.Data == "section" && v == x.ID && !far
			})
			if len(s) != 1 {
				t.Fatalf("%s: %d sections for %s", filepath.Base(path), len(s), x.ID)
			}
			var printed []float64
			for _, tr := range find(s[0], func(n *html.Node) bool { return n.Data == "tr" }) {
				cells := find(tr, func(n *html.Node) bool { return n.Data == "th" || n.Data == "td" })
				if len(cells) == 2 && text(cells[0]) == label {
					v, err := strconv.ParseFloat(text(cells[1]), 64)
					if err != nil {
						t.Fatalf("%s %s: factor %q: %v", filepath.Base(path), x.ID, text(cells[1]), err)
					}
					printed = append(printed, v)
				}
			}
			if len(printed) != 1 {
				t.Errorf("%s %s: %d rows %q", filepath.Base(path), x.ID, len(printed), label)
				continue
			}
			f := rules.Factor{Phi: printed[0], Omega: printed[0]}
			got := f.Available(c.Method, x.Nominal)
			if math.Abs(float64(got-x.Available)) > 1e-9*math.Max(1, math.Abs(float64(x.Available))) {
				t.Errorf("%s %s: printed factor gives %g, the check %g", filepath.Base(path), x.ID, got, x.Available)
			}
		}
	}
}

// Both methods: ASD pages print Ω and Rn/Ω, LRFD pages φ and φRn.
func TestMethodWording(t *testing.T) {
	for _, path := range jobs(t) {
		r := check(t, path)
		doc, _ := render(t, r)
		s := text(doc)
		asd := r.Design.Conn.Method == rules.ASD
		if strings.Contains(s, "Safety factor Ω") != asd || strings.Contains(s, "Resistance factor φ") == asd {
			t.Errorf("%s: wrong factor wording for %s", filepath.Base(path), r.Design.Conn.Method)
		}
	}
}

// Whatever a job's text holds, it reaches the page as text, not markup:
// the mark is written into the HTML and, through the sheet model, into
// the SVG.
func TestTextIsEscaped(t *testing.T) {
	r := check(t, "../../testdata/jobs/si-double-angle.yaml")
	r.Design.Job.Mark = `<script>alert("x")</script>&`
	doc, b := render(t, r)
	if bytes.Contains(b, []byte("<script>")) {
		t.Fatal("the mark was written as markup")
	}
	if find(doc, func(n *html.Node) bool { return n.Data == "script" }) != nil {
		t.Fatal("a script element reached the page")
	}
	if h1 := find(doc, func(n *html.Node) bool { return n.Data == "h1" }); len(h1) != 1 || text(h1[0]) != r.Design.Job.Mark {
		t.Error("the mark is not shown as text")
	}
}

// A failing connection gets its report, its drawing stamped as its sheet
// would be; a passing one is not stamped.
func TestFailingConnectionIsStamped(t *testing.T) {
	for _, path := range jobs(t) {
		r := check(t, path)
		doc, _ := render(t, r)
		stamps := find(doc, func(n *html.Node) bool {
			c, _ := attr(n, "class")
			return n.Data == "text" && strings.Contains(c, "stamp")
		})
		if (len(stamps) > 0) == r.Pass {
			t.Errorf("%s: pass %v, %d stamps", filepath.Base(path), r.Pass, len(stamps))
		}
	}
}

// The page substitutes each limit state's values into its formula and
// prints the check's nominal strength as the result: the formula on the
// page, worked from those values, must give that strength. Relative
// tolerance 1e-9: the same arithmetic in another order.
func TestFormulasOnThePageGiveTheNominalStrength(t *testing.T) {
	seen := 0 // jobs whose filler factor reduces the shear
	combined := 0
	defer func() {
		if combined == 0 {
			t.Error("no job checks member.combined: testdata/jobs/us-eccentric-flat.yaml is missing")
		}
	}()
	for _, path := range jobs(t) {
		r := check(t, path)
		c := &r.Design.Conn
		byID := map[string]engine.Result{}
		for _, x := range r.Results {
			byID[x.ID] = x
		}
		for _, x := range r.Results {
			v := map[string]float64{}
			for _, val := range x.Values {
				v[val.Name] = val.V
			}
			var want float64
			// a splice's member B (member_b.*, *.member_b): the same
			// formulas on member B's side of the joint
			id, c, byID := x.ID, c, byID
			if rest, ok := strings.CutPrefix(id, "member_b."); ok {
				id, c = "member."+rest, c.MemberBSide()
			} else if base, ok := strings.CutSuffix(id, ".member_b"); ok {
				id, c = base, c.MemberBSide()
			}
			if id != x.ID {
				byID = map[string]engine.Result{}
				for _, y := range r.Results {
					byID[y.ID] = y
				}
				for _, y := range r.Results { // member B's own in the member's place
					if rest, ok := strings.CutPrefix(y.ID, "member_b."); ok {
						byID["member."+rest] = y
					}
				}
			}
			switch id {
			case "member.yield", "plate.yield":
				want = v["Fy"] * v["Ag"]
			case "member.rupture":
				tsum := float64(c.Member.Pieces) * float64(c.Member.T)
				if An := v["Ag"] - tsum*v["deduction"]; math.Abs(An-v["An"]) > 1e-9*v["Ag"] {
					t.Errorf("%s: An = Ag − Σt·deduction gives %g, the check %g", x.ID, An, v["An"])
				}
				if c.Member.Shape != engine.Flat {
					if U := min(1, max(v["U_case2"], v["U_case8"], v["U_case7"], v["U_min"])); U != v["U"] {
						t.Errorf("%s: U = max(...) gives %g, the check %g", x.ID, U, v["U"])
					}
				}
				want = v["Fu"] * v["U"] * v["An"]
			case "member.block-shear", "plate.block-shear":
				tension := v["Ubs"] * v["Fu"] * v["Ant"]
				want = min(0.6*v["Fu"]*v["Anv"]+tension, 0.6*v["Fy"]*v["Agv"]+tension)
			case "plate.rupture":
				// The page writes An = (Lw − deduction)·t: it must give the
				// check's An unless the splice-plate cap or a zero net
				// section governs.
				if v["splice_cap_applied"] == 0 && v["An"] > 0 {
					if An := (v["Lw"] - v["deduction"]) * v["t"]; math.Abs(An-v["An"]) > 1e-9*v["An"] {
						t.Errorf("%s %s: (Lw − deduction)·t gives %g, the check %g", filepath.Base(path), x.ID, An, v["An"])
					}
				}
				want = v["Fu"] * v["An"]
			case "bolts.shear":
				ff := fillerFactor(t, c, v)
				want = v["Fnv"] * v["Ab"] * v["n"] * v["planes"] * ff
			case "bolts.slip":
				want = v["mu"] * v["Du"] * v["hf"] * v["Tb"] * v["ns"] * v["n"]
			case "member.bearing", "plate.bearing", "member.bearing.compression", "plate.bearing.compression":
				for _, b := range x.PerBolt {
					bearing := v["bearing_coefficient"] * v["d"] * v["t"] * v["Fu"]
					tearout := v["tearout_coefficient"] * max(float64(b.Lc), 0) * v["t"] * v["Fu"]
					if math.Abs(bearing-float64(b.Bearing)) > 1e-9*bearing || math.Abs(tearout-float64(b.Tearout)) > 1e-9*max(tearout, 1) {
						t.Errorf("%s %s %s: cb·d·t·Fu, ct·lc·t·Fu give %g, %g; the check %g, %g",
							filepath.Base(path), x.ID, b.Hole, bearing, tearout, float64(b.Bearing), float64(b.Tearout))
					}
					want += float64(b.Rn)
				}
			case "member.compression":
				// Fcr of E3-2 / E3-3 from Fy and Fe, Rn = Fcr·Ae (AISC
				// 360-16 E3, E7); a flexural mode's Fe = π²E/(Lc/r)²
				fcr := 0.877 * v["Fe"]
				if v["Fy"]/v["Fe"] <= 2.25 {
					fcr = math.Pow(0.658, v["Fy"]/v["Fe"]) * v["Fy"]
				}
				if math.Abs(fcr-v["Fcr"]) > 1e-9*fcr {
					t.Errorf("%s %s: Fcr from Fy and Fe %g, the check %g", filepath.Base(path), x.ID, fcr, v["Fcr"])
				}
				if !strings.Contains(x.Note, "torsional") {
					if fe := math.Pi * math.Pi * v["E"] / (v["Lc_r"] * v["Lc_r"]); math.Abs(fe-v["Fe"]) > 1e-9*fe {
						t.Errorf("%s %s: π²E/(Lc/r)² %g, the check's Fe %g", filepath.Base(path), x.ID, fe, v["Fe"])
					}
				}
				want = v["Fcr"] * v["Ae"]
			case "plate.compression":
				// J4.4: Fy·Ag up to KL/r = 25, else Fcr of E3
				if klr := v["K"] * v["L"] / v["r"]; math.Abs(klr-v["KL_r"]) > 1e-9*klr {
					t.Errorf("%s %s: K·L/r %g, the check %g", filepath.Base(path), x.ID, klr, v["KL_r"])
				}
				want = v["Fcr"] * v["Ag"]
				if v["KL_r"] <= 25 {
					want = v["Fy"] * v["Ag"]
				}
			case "bolts.group.compression":
				mb, pb := byID["member.bearing.compression"], byID["plate.bearing.compression"]
				rnShear := v["rn_shear"]
				for i := range c.Holes {
					rn := min(rnShear, float64(mb.PerBolt[i].Rn))
					if pb.PerBolt != nil {
						rn = min(rn, float64(pb.PerBolt[i].Rn))
					}
					want += rn
				}
			case "bolts.group":
				// rn,shear is the shear check's Fnv·Ab·ns·ff for one bolt.
				vs := map[string]float64{}
				for _, val := range byID["bolts.shear"].Values {
					vs[val.Name] = val.V
				}
				ff := fillerFactor(t, c, vs)
				if v["filler_factor"] != ff {
					t.Errorf("%s: filler factor %g, bolts.shear's %g", x.ID, v["filler_factor"], ff)
				}
				if rn := vs["Fnv"] * vs["Ab"] * vs["planes"] * ff; math.Abs(rn-v["rn_shear"]) > 1e-9*rn {
					t.Errorf("%s: rn,shear = Fnv·Ab·ns·ff gives %g, the check %g", x.ID, rn, v["rn_shear"])
				}
				mb, pb := byID["member.bearing"], byID["plate.bearing"]
				for i := range c.Holes {
					rn := min(v["rn_shear"], float64(mb.PerBolt[i].Rn))
					if pb.PerBolt != nil {
						rn = min(rn, float64(pb.PerBolt[i].Rn))
					}
					want += rn
				}
			case "member.combined":
				combined++
				// Each printed step, worked from the printed values: e =
				// |ȳ − d/2|, Mr = Pr·e, Pc = min, Z = t·d²/4, Sx = t·d²/6,
				// Mp = min(Fy·Z, k·Fy·Sx), Mn = Mp (Lb = 0, F11.2(a)),
				// Mc = φb·Mn or Mn/Ωb, H1-1a and H1-1b, the ratio their
				// larger (AISC 360 H1.1, H1.2, F11.1, D2).
				rel := func(name string, got, want float64) {
					if math.Abs(got-want) > 1e-9*max(math.Abs(want), 1e-9) {
						t.Errorf("%s %s: %s from the printed values %g, the check %g", filepath.Base(path), x.ID, name, want, got)
					}
				}
				rel("e", v["e"], math.Abs(v["ybar"]-v["d"]/2))
				rel("Mr", v["Mr"], v["Pr"]*v["e"])
				rel("Pc", v["Pc"], min(v["Pc_yield"], v["Pc_rupture"]))
				rel("Z", v["Z"], v["t"]*v["d"]*v["d"]/4)
				rel("S", v["S"], v["t"]*v["d"]*v["d"]/6)
				rel("Mp", v["Mp"], min(v["Fy"]*v["Z"], v["Mp_cap"]*v["Fy"]*v["S"]))
				rel("Lb·d/t²", v["LTB_lambda"], v["Lb"]*v["d"]/(v["t"]*v["t"]))
				if v["LTB_lambda"] <= v["LTB_limit"] {
					rel("Mn", v["Mn"], v["Mp"])
				}
				fb := c.Edition.FlexureFactor()
				Mc := fb.Phi * v["Mn"]
				if c.Method == rules.ASD {
					Mc = v["Mn"] / fb.Omega
				}
				rel("Mc", v["Mc"], Mc)
				p, m := v["Pr"]/v["Pc"], v["Mr"]/v["Mc"]
				rel("H1-1a", v["H1_1a"], p+8.0/9.0*m)
				rel("H1-1b", v["H1_1b"], p/2+m)
				sel, eq := v["H1_1a"], 1.0
				if p < 0.2 {
					sel, eq = v["H1_1b"], 2
				}
				rel("selected equation", v["H1_eq"], eq)
				rel("H1 value", v["H1_value"], sel)
				rel("ratio", x.Ratio, max(v["H1_1a"], v["H1_1b"]))
				rel("available", float64(x.Available), v["Pr"]/x.Ratio)
				// Rn: the same interaction with Pn and Mn.
				want = v["Pr"] / max(v["Pr"]/v["Pn"]+8.0/9.0*v["Mr"]/v["Mn"], v["Pr"]/(2*v["Pn"])+v["Mr"]/v["Mn"])
			default:
				t.Errorf("%s: the page has no formula for %s", filepath.Base(path), x.ID)
				continue
			}
			if got := float64(x.Nominal); math.Abs(got-want) > 1e-9*math.Abs(want) {
				t.Errorf("%s %s: the formula gives %g, the check %g", filepath.Base(path), x.ID, want, got)
			}
			if x.ID == "bolts.shear" && v["filler_factor"] < 1 {
				seen++
			}
		}
	}
	if seen < 2 {
		t.Errorf("%d jobs reduce the bolt shear for fillers, want the two inline ones", seen)
	}
}

// fillerFactor is the J5.2 factor the page prints, checked against the
// filler thickness it prints: 1 − 0.4(t − 0.25) with t in inches (SI
// 1 − 0.0154(t − 6), t in mm), not less than 0.85, 1 for 1/4 in (6 mm) or
// less and for developed fillers (AISC 360-22 J5.2, hand formula).
func fillerFactor(t *testing.T, c *engine.Connection, v map[string]float64) float64 {
	t.Helper()
	ff, ok := v["filler_factor"]
	if !ok {
		t.Errorf("no filler_factor in the values")
		return 1
	}
	want := 1.0
	switch tf := units.Length(v["filler_t"]); {
	case c.Bolt.FillerDeveloped:
	case c.Edition.System() == units.SI && tf.Mm() > 6:
		want = max(0.85, 1-0.0154*(tf.Mm()-6))
	case c.Edition.System() == units.US && tf.In() > 0.25:
		want = max(0.85, 1-0.4*(tf.In()-0.25))
	}
	if math.Abs(ff-want) > 1e-12 {
		t.Errorf("filler factor %g, J5.2 gives %g for t = %g mm", ff, want, v["filler_t"])
	}
	return ff
}

// Where the fillers reduce the bolts' shear strength, the page says so:
// the J5.2 formula, the factor worked from the thickness and the factor in
// the product, in both bolt sections. Where they do not, it says nothing
// of fillers beyond what the job gave.
func TestFillerFactorOnThePage(t *testing.T) {
	tests := []struct {
		job   string
		steps []string // in the bolts.shear section
		src   string
	}{
		{"inline:filler-bearing.yaml", []string{"1 − 0.4(t − 0.25)", "1 − 0.4(0.5 − 0.25) = 0.900", "(0.900)"},
			"hand calculation per AISC 360-22 J5.2(a): 0.90"},
		{"inline:si-filler-slip.yaml", []string{"1 − 0.0154(t − 6)", "1 − 0.0154(20 − 6) = 0.784", "0.85", "(0.850)"},
			"hand calculation per AISC 360-16 J5.2(a) (S.I.), not less than 0.85"},
	}
	for _, tt := range tests {
		r := check(t, tt.job)
		doc, _ := render(t, r)
		for _, id := range []string{"bolts.shear", "bolts.group"} {
			s := find(doc, func(n *html.Node) bool {
				v, _ := attr(n, "data-id")
				_, far := attr(n, "data-end")
				return n.Data == "section" && v == id && !far
			})
			if len(s) != 1 {
				t.Fatalf("%s: no %s section", tt.job, id)
			}
			st := text(s[0])
			if !strings.Contains(st, "J5.2") {
				t.Errorf("%s %s: the section does not name J5.2", tt.job, id)
			}
			if id != "bolts.shear" {
				continue
			}
			for _, w := range tt.steps {
				if !strings.Contains(st, w) {
					t.Errorf("%s %s: the section does not say %q (%s)\n%s", tt.job, id, w, tt.src, st)
				}
			}
		}
	}
	r := check(t, "../../testdata/examples/aisc-d2.yaml")
	doc, _ := render(t, r)
	for _, n := range find(doc, func(n *html.Node) bool {
		v, _ := attr(n, "data-id")
		_, far := attr(n, "data-end")
		return n.Data == "section" && v == "bolts.shear" && !far
	}) {
		if st := text(n); strings.Contains(st, "J5.2") || strings.Contains(st, "0.4(t") {
			t.Errorf("a job without fillers shows the filler factor:\n%s", st)
		}
	}
}

// The hole table gives each ply's holes when they differ (PLY-1: long
// slots across the load in the member, 15/16 × 2-3/16, standard 15/16
// holes in the plate, AISC 360-22 Table J3.3 for a 7/8-in bolt), and keeps
// its one-ply columns otherwise.
func TestHoleTablePerPly(t *testing.T) {
	_, b := render(t, check(t, "inline:ply-long-slot.yaml"))
	for _, s := range []string{"member: type", "plate: type", "long-slot, transverse", "15/16 in diameter", "15/16 × 2-3/16 in"} {
		if !bytes.Contains(b, []byte(s)) {
			t.Errorf("the report lacks %q", s)
		}
	}
	_, b = render(t, check(t, "../../testdata/jobs/us-single-angle.yaml"))
	if bytes.Contains(b, []byte("plate: type")) {
		t.Error("a job of one hole type gets per-ply columns")
	}
}

// The page knows no limit state by its id: every section is drawn from the
// result's own working, so a result whose id the page has never seen
// (here every id renamed) gets the same section, word for word. A new
// limit state needs nothing in this package (DEVELOPERS.md, "Adding a
// limit state").
func TestSectionsDoNotDependOnTheID(t *testing.T) {
	for _, path := range jobs(t) {
		r := check(t, path)
		doc, _ := render(t, r)
		before := find(doc, func(n *html.Node) bool {
			_, ok := attr(n, "data-id")
			_, far := attr(n, "data-end")
			return n.Data == "section" && ok && !far
		})
		ids := make([]string, len(r.Results))
		for i := range r.Results {
			ids[i] = r.Results[i].ID
			r.Results[i].ID = fmt.Sprintf("hypothetical.limit-%d", i)
		}
		doc, _ = render(t, r)
		after := find(doc, func(n *html.Node) bool {
			_, ok := attr(n, "data-id")
			_, far := attr(n, "data-end")
			return n.Data == "section" && ok && !far
		})
		if len(after) != len(before) {
			t.Fatalf("%s: %d sections, then %d", filepath.Base(path), len(before), len(after))
		}
		for i := range before {
			want := strings.ReplaceAll(text(before[i]), ids[i], r.Results[i].ID)
			if got := text(after[i]); got != want {
				t.Errorf("%s %s: renamed, the section reads\n%s\nwant\n%s", filepath.Base(path), ids[i], got, want)
			}
		}
	}
}

// The page carries the sheet's bill of material and bolt list where the
// job gives member.length (their values are tested in package detail,
// TestBOMOfASplice and the weight tests: 490 lb/ft³, RCSC Table C-2.1),
// one row a piece plus the total, one a bolt set; none without it.
func TestReportHasTheBillOfMaterial(t *testing.T) {
	for _, path := range jobs(t) {
		t.Run(filepath.Base(path), func(t *testing.T) {
			r := check(t, path)
			doc, _ := render(t, r)
			ps, bs := r.Pieces(), r.BoltList()
			bomT, boltsT := byID(doc, "bom"), byID(doc, "bolts")
			if ps == nil {
				if bomT != nil || boltsT != nil {
					t.Error("a bill of material without member.length")
				}
				return
			}
			if bomT == nil || boltsT == nil {
				t.Fatal("no bill of material or bolt list")
			}
			rows := find(bomT, func(n *html.Node) bool { return n.Data == "tr" })
			if len(rows) != len(ps)+2 { // the head and the total
				t.Errorf("%d bill-of-material rows, want %d pieces + head + total", len(rows), len(ps))
			}
			for i, p := range ps {
				if got := text(rows[i+1]); !strings.Contains(got, p.Mark) || !strings.Contains(got, p.CAMFile(r.Design.Job.Mark)) {
					t.Errorf("row %d %q does not name %s and its CAM file", i, got, p.Mark)
				}
			}
			if n := len(find(boltsT, func(n *html.Node) bool { return n.Data == "tr" })); n != len(bs)+1 {
				t.Errorf("%d bolt-list rows, want %d + head", n, len(bs))
			}
		})
	}
}

// The printed report numbers its pages and runs a header with the mark
// (and the project block's drawing and revision where the job gives
// them), in CSS page margin boxes (CSS Paged Media, @page margin boxes;
// common practice, no source); a limit-state card may break between its
// parts, its head kept with them.
func TestPrintedPagesAreNumbered(t *testing.T) {
	r := check(t, "../../testdata/jobs/us-brace-reversal.yaml")
	r.Design.Job.Project.Drawing, r.Design.Job.Project.Revision = "S-501", "B"
	_, page := render(t, r)
	css := string(page)
	for _, want := range []string{
		`counter(page) " of " counter(pages)`,
		"@top-left",
		"BR-C1 · drawing S-501 · revision B · calculation report",
		"engineer of record",
		"section.limit > .cols { break-before: avoid; }",
	} {
		if !strings.Contains(css, want) {
			t.Errorf("the page's print rules lack %q", want)
		}
	}
}

// The report lists every load combination considered, not only the
// governing ones: the seven of ASCE/SEI 7-16 2.3.1 and 2.3.6 for an LRFD
// job of service loads, each with its tension and compression, the
// governing one of each sign marked (ASCE/SEI 7-16 2.3.1; the brace's
// wind reverses).
func TestReportListsEveryCombination(t *testing.T) {
	r := check(t, "../../testdata/jobs/us-brace-reversal.yaml")
	_, page := render(t, r)
	s := string(page)
	i := strings.Index(s, `id="combinations"`)
	if i < 0 {
		t.Fatal("no table of load combinations")
	}
	tab := s[i : i+strings.Index(s[i:], "</table>")]
	for _, name := range []string{"1.4D", "1.2D + 1.6L + 0.5(Lr or S or R)", "1.2D + 1.6(Lr or S or R) + (L or 0.5W)",
		"1.2D + 1.0W + L + 0.5(Lr or S or R)", "1.2D + 1.0E + L + 0.2S", "0.9D + 1.0W", "0.9D + 1.0E"} {
		if !strings.Contains(tab, ">"+strings.ReplaceAll(html.EscapeString(name), "+", "&#43;")+"<") {
			t.Errorf("combination %q not listed", name)
		}
	}
	if strings.Count(tab, ">tension</td>") != 1 || strings.Count(tab, ">compression</td>") != 1 {
		t.Errorf("want one governing combination of each sign marked:\n%s", tab)
	}
}
