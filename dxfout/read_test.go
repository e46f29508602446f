package dxfout

import (
	"bufio"
	"bytes"
	"fmt"
	"strconv"
	"strings"
)

// A tiny DXF reader for the tests, independent of the writer: it splits
// an ASCII DXF into group-code pairs and collects the header variables and
// the entities of the ENTITIES section.

type pair struct {
	code  int
	value string
}

func pairs(data []byte) ([]pair, error) {
	var out []pair
	sc := bufio.NewScanner(bytes.NewReader(data))
	sc.Buffer(make([]byte, 1<<20), 1<<20)
	for sc.Scan() {
		c := strings.TrimSpace(sc.Text())
		code, err := strconv.Atoi(c)
		if err != nil {
			return nil, fmt.Errorf("line %d: group code %q", len(out)*2+1, c)
		}
		if !sc.Scan() {
			return nil, fmt.Errorf("group code %d without a value", code)
		}
		out = append(out, pair{code, strings.TrimRight(sc.Text(), "\r")})
	}
	return out, sc.Err()
}

type ent struct {
	kind  string
	layer string
	codes []pair // every pair after the type
}

func (e ent) float(code int) float64 {
	for _, p := range e.codes {
		if p.code == code {
			v, _ := strconv.ParseFloat(strings.TrimSpace(p.value), 64)
			return v
		}
	}
	return 0
}

func (e ent) has(code int) bool {
	for _, p := range e.codes {
		if p.code == code {
			return true
		}
	}
	return false
}

// vertices returns an LWPOLYLINE's vertices and bulges.
func (e ent) vertices() (pts [][2]float64, bulges []float64) {
	for _, p := range e.codes {
		v, _ := strconv.ParseFloat(strings.TrimSpace(p.value), 64)
		switch p.code {
		case 10:
			pts = append(pts, [2]float64{v, 0})
			bulges = append(bulges, 0)
		case 20:
			pts[len(pts)-1][1] = v
		case 42:
			bulges[len(bulges)-1] = v
		}
	}
	return pts, bulges
}

type dxfFile struct {
	header   map[string][]pair
	entities []ent
}

func readDXF(data []byte) (*dxfFile, error) {
	ps, err := pairs(data)
	if err != nil {
		return nil, err
	}
	f := &dxfFile{header: map[string][]pair{}}
	section := ""
	var cur *ent
	var hvar string
	for i := 0; i < len(ps); i++ {
		p := ps[i]
		if p.code == 0 && p.value == "SECTION" && i+1 < len(ps) {
			section = ps[i+1].value
			i++
			continue
		}
		if p.code == 0 && p.value == "ENDSEC" {
			section, cur = "", nil
			continue
		}
		switch section {
		case "HEADER":
			if p.code == 9 {
				hvar = p.value
			} else if hvar != "" {
				f.header[hvar] = append(f.header[hvar], p)
			}
		case "ENTITIES":
			if p.code == 0 {
				f.entities = append(f.entities, ent{kind: p.value})
				cur = &f.entities[len(f.entities)-1]
				continue
			}
			if cur == nil {
				return nil, fmt.Errorf("pair %d before any entity", p.code)
			}
			if p.code == 8 {
				cur.layer = p.value
			}
			cur.codes = append(cur.codes, p)
		}
	}
	if len(ps) == 0 || ps[len(ps)-1] != (pair{0, "EOF"}) {
		return nil, fmt.Errorf("no EOF")
	}
	return f, nil
}

func (f *dxfFile) headerFloat(name string, code int) (float64, bool) {
	for _, p := range f.header[name] {
		if p.code == code {
			v, err := strconv.ParseFloat(strings.TrimSpace(p.value), 64)
			return v, err == nil
		}
	}
	return 0, false
}
