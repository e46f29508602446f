package dxfout

import (
	"testing"
)

// entityCount is the number of entities in the ENTITIES section of a DXF.
func entityCount(t *testing.T, data []byte) int {
	t.Helper()
	ps, err := pairs(data)
	if err != nil {
		t.Fatal(err)
	}
	n, in := 0, false
	for _, p := range ps {
		switch {
		case p.code == 2 && p.value == "ENTITIES":
			in = true
		case p.code == 0 && p.value == "ENDSEC":
			in = false
		case p.code == 0 && in:
			n++
		}
	}
	return n
}

// Drawing a sheet's files costs a few allocations an entity: the
// library's constructors (entity, its struct, its coordinate slices) and
// our share of the dimension layout. Issue 12 measured 56 an entity
// through the library's own formatter; 10 leaves room for the sheet
// model's own slices without letting that return.
func TestAllocationsPerEntity(t *testing.T) {
	if testing.Short() {
		t.Skip("counts allocations")
	}
	for _, p := range jobs {
		_, s := sheetOf(t, p)
		s.NotForFabrication = false
		fs, err := Files(s)
		if err != nil {
			t.Fatal(err)
		}
		n := 0
		for _, f := range fs {
			n += entityCount(t, f.Data)
		}
		allocs := testing.AllocsPerRun(20, func() {
			if _, err := Files(s); err != nil {
				t.Fatal(err)
			}
		})
		t.Logf("%s: %d files, %d entities, %.0f allocations, %.1f an entity", p, len(fs), n, allocs, allocs/float64(n))
		if per := allocs / float64(n); per > 10 {
			t.Errorf("%s: %.1f allocations an entity (%.0f for %d), want at most 10", p, per, allocs, n)
		}
	}
}
