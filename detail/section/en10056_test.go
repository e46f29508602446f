package section

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"gaugeline/rules/units"
)

// The EN 10056-1 angles' published rows, as two section tables print them
// (cm, cm²), read in text copies kept in repository waynemaranga/steelsnakes
// (its docs/99-references.md names the SCI Blue Book for its UK section
// data and the ArcelorMittal Orange Book for its EU data):
//
//   - blueBook: the SCI / Steel for Life "Blue Book" angle tables, files
//     src/steelsnakes/data/sections/UK/L_UNEQUAL.json at commit
//     f9e5cd8edc4f0f568723de3a5be6418aa2459218 and
//     src/steelsnakes/UK/data/L_EQUAL.json at commit
//     0e3f31a6f1ebd4bc79f84b8966982c4af319e48b.
//   - arcelor: ArcelorMittal's angle tables, files
//     src/steelsnakes/EU/data/L_EQUAL.json at commit
//     b01d751c4facc34c679827dc0b3c1f097e267e0d and
//     src/steelsnakes/EU/data/L_UNEQUAL.json at commit
//     38bc16a3d9d38e592a237b2e000a4a032071c78a; used only for the sizes the
//     Blue Book does not list.
//
// Neither copy names the dimensional standard; that both tabulate
// EN 10056-1 angles is from memory (the standard's text was not read).
const (
	blueBook = "SCI Blue Book (steelsnakes UK L_EQUAL.json 0e3f31a6 / L_UNEQUAL.json f9e5cd8e)"
	arcelor  = "ArcelorMittal sections (steelsnakes EU L_EQUAL.json b01d751c / L_UNEQUAL.json 38bc16a3)"
)

// enRow is one published row: root and toe radii r1, r2 (mm), area A
// (cm²), the centroid's distances from the back of the long leg (ez of an
// unequal angle, e of an equal one) and from the back of the short leg (ey;
// e), and the least radius of gyration iv (cm), with the table it was read
// in.
type enRow struct {
	name   string
	r1, r2 float64
	A      float64
	ez, ey float64
	iv     float64
	src    string
}

// xcArcelor is a third copy, used only for two iv values the other two
// tables misprint: ArcelorMittal equal angles in repository xcfem/xc, file
// python_modules/materials/sections/structural_shapes/aux/arcelor_l_profiles.json
// at commit fc773b9da82730dd441de2d2595c4c7cdbe6fee8 (its aux/readme.md
// names the Arcelor "Orange Book" among its suppliers' handbooks).
const xcArcelor = "ArcelorMittal equal angles (xcfem/xc arcelor_l_profiles.json fc773b9d)"

// enPublished has a row for every catalog size except those in
// enUnpublished. Values as printed; an equal angle's one e is both ez and
// ey. Two iv are xcArcelor's (see enIvOverride).
var enPublished = []enRow{
	{"L40x40x4", 6, 3, 3.08, 1.12, 1.12, 0.777, blueBook},
	{"L40x40x5", 6, 3, 3.79, 1.16, 1.16, 0.773, blueBook},
	{"L45x45x4.5", 7, 3.5, 3.90, 1.25, 1.25, 0.870, blueBook},
	{"L50x50x4", 7, 3.5, 3.89, 1.36, 1.36, 0.979, blueBook},
	{"L50x50x5", 7, 3.5, 4.80, 1.40, 1.40, 0.973, blueBook},
	{"L50x50x6", 7, 3.5, 5.69, 1.45, 1.45, 0.968, blueBook},
	{"L60x60x5", 8, 4, 5.82, 1.64, 1.64, 1.17, blueBook},
	{"L60x60x6", 8, 4, 6.91, 1.69, 1.69, 1.17, blueBook},
	{"L60x60x8", 8, 4, 9.03, 1.77, 1.77, 1.16, blueBook},
	{"L65x65x7", 9, 4.5, 8.73, 1.85, 1.85, 1.26, blueBook},
	{"L70x70x6", 9, 4.5, 8.13, 1.93, 1.93, 1.37, blueBook},
	{"L70x70x7", 9, 4.5, 9.40, 1.97, 1.97, 1.36, blueBook},
	{"L75x75x6", 9, 4.5, 8.73, 2.05, 2.05, 1.47, blueBook},
	{"L75x75x8", 9, 4.5, 11.4, 2.14, 2.14, 1.46, blueBook},
	{"L80x80x8", 10, 5, 12.3, 2.26, 2.26, 1.56, blueBook},
	{"L80x80x10", 10, 5, 15.1, 2.34, 2.34, 1.55, blueBook},
	{"L90x90x7", 11, 5.5, 12.2, 2.45, 2.45, 1.77, blueBook},
	{"L90x90x8", 11, 5.5, 13.9, 2.50, 2.50, 1.76, blueBook},
	{"L90x90x9", 11, 5.5, 15.5, 2.54, 2.54, 1.76, arcelor},
	{"L90x90x10", 11, 5.5, 17.1, 2.58, 2.58, 1.75, blueBook},
	{"L100x100x8", 12, 6, 15.5, 2.74, 2.74, 1.96, blueBook},
	{"L100x100x10", 12, 6, 19.2, 2.82, 2.82, 1.95, blueBook},
	{"L100x100x12", 12, 6, 22.7, 2.90, 2.90, 1.94, blueBook},
	{"L120x120x10", 13, 6.5, 23.2, 3.31, 3.31, 2.36, blueBook},
	{"L120x120x12", 13, 6.5, 27.5, 3.40, 3.40, 2.35, blueBook},
	{"L130x130x12", 14, 7, 30.0, 3.64, 3.64, 2.54, arcelor},
	{"L150x150x10", 16, 8, 29.3, 4.03, 4.03, 2.97, blueBook},
	{"L150x150x12", 16, 8, 34.8, 4.12, 4.12, 2.95, blueBook},
	{"L150x150x14", 16, 8, 40.3, 4.21, 4.21, 2.93, arcelor},
	{"L150x150x15", 16, 8, 43.0, 4.25, 4.25, 2.93, blueBook},
	{"L150x150x18", 16, 8, 51.2, 4.38, 4.38, 2.93, blueBook},
	{"L160x160x15", 17, 8.5, 46.1, 4.49, 4.49, 3.14, arcelor},
	{"L160x160x17", 17, 8.5, 51.8, 4.57, 4.57, 3.12, arcelor},
	{"L180x180x16", 18, 9, 55.4, 5.02, 5.02, 3.50, arcelor},
	{"L180x180x18", 18, 9, 61.9, 5.10, 5.10, 3.52, arcelor},
	{"L200x200x16", 18, 9, 61.8, 5.52, 5.52, 3.94, blueBook},
	{"L200x200x18", 18, 9, 69.1, 5.60, 5.60, 3.90, blueBook},
	{"L200x200x20", 18, 9, 76.3, 5.68, 5.68, 3.92, blueBook},
	{"L200x200x24", 18, 9, 90.6, 5.84, 5.84, 3.90, blueBook},

	{"L60x40x5", 6, 3, 4.79, 0.972, 1.96, 0.860, blueBook},
	{"L60x40x6", 6, 3, 5.68, 1.01, 2.00, 0.855, blueBook},
	{"L65x50x5", 6, 3, 5.54, 1.25, 1.99, 1.07, blueBook},
	{"L70x50x6", 7, 3.5, 6.89, 1.25, 2.23, 1.07, blueBook},
	{"L75x50x6", 7, 3.5, 7.19, 1.21, 2.44, 1.08, blueBook},
	{"L75x50x8", 7, 3.5, 9.41, 1.29, 2.52, 1.07, blueBook},
	{"L80x40x6", 7, 3.5, 6.89, 0.884, 2.85, 0.845, blueBook},
	{"L80x40x8", 7, 3.5, 9.01, 0.963, 2.94, 0.838, blueBook},
	{"L80x60x7", 8, 4, 9.38, 1.52, 2.51, 1.28, blueBook},
	{"L100x50x6", 8, 4, 8.71, 1.05, 3.51, 1.07, blueBook},
	{"L100x50x8", 8, 4, 11.4, 1.13, 3.60, 1.06, blueBook},
	{"L100x65x7", 10, 5, 11.2, 1.51, 3.23, 1.40, blueBook},
	{"L100x65x8", 10, 5, 12.7, 1.55, 3.27, 1.40, blueBook},
	{"L100x65x10", 10, 5, 15.6, 1.63, 3.36, 1.39, blueBook},
	{"L100x75x8", 10, 5, 13.5, 1.87, 3.10, 1.60, blueBook},
	{"L100x75x10", 10, 5, 16.6, 1.95, 3.19, 1.59, blueBook},
	{"L100x75x12", 10, 5, 19.7, 2.03, 3.27, 1.59, blueBook},
	{"L120x80x8", 11, 5.5, 15.5, 1.87, 3.83, 1.74, arcelor},
	{"L120x80x10", 11, 5.5, 19.1, 1.95, 3.92, 1.72, arcelor},
	{"L120x80x12", 11, 5.5, 22.7, 2.03, 4.00, 1.71, arcelor},
	{"L125x75x8", 11, 5.5, 15.5, 1.68, 4.14, 1.63, blueBook},
	{"L125x75x10", 11, 5.5, 19.1, 1.76, 4.23, 1.61, blueBook},
	{"L125x75x12", 11, 5.5, 22.7, 1.84, 4.31, 1.61, blueBook},
	{"L150x75x10", 12, 6, 21.7, 1.61, 5.31, 1.60, blueBook},
	{"L150x75x12", 12, 6, 25.7, 1.69, 5.40, 1.59, blueBook},
	{"L150x75x15", 12, 6, 31.7, 1.81, 5.52, 1.58, blueBook},
	{"L150x90x10", 12, 6, 23.2, 2.04, 5.00, 1.95, blueBook},
	{"L150x90x12", 12, 6, 27.5, 2.12, 5.08, 1.94, blueBook},
	{"L150x90x15", 12, 6, 33.9, 2.23, 5.21, 1.93, blueBook},
	{"L150x100x10", 12, 6, 24.2, 2.34, 4.81, 2.17, arcelor},
	{"L150x100x12", 12, 6, 28.7, 2.42, 4.89, 2.16, arcelor},
	{"L200x100x10", 15, 7.5, 29.2, 2.01, 6.93, 2.15, blueBook},
	{"L200x100x12", 15, 7.5, 34.8, 2.10, 7.03, 2.14, blueBook},
	{"L200x100x15", 15, 7.5, 43.0, 2.22, 7.16, 2.12, blueBook},
	{"L200x150x12", 15, 7.5, 40.8, 3.61, 6.08, 3.25, blueBook},
	{"L200x150x15", 15, 7.5, 50.5, 3.73, 6.21, 3.23, blueBook},
}

// enIvOverride: iv where the Blue Book and ArcelorMittal copies print a
// value off the run of their neighbours (and of the geometry, by 0.75 to
// 1 %): L180x180x16 3.50 (Iv 679 cm⁴; 15 mm: 3.53, 17 mm: 3.52) and
// L200x200x18 3.90 (Iv 1050 cm⁴; 16 mm: 3.94, 20 mm: 3.92). xcArcelor
// prints 3.53 (Iv 689 cm⁴) and 3.92 (Iv 1064 cm⁴).
var enIvOverride = map[string]float64{"L180x180x16": 3.53, "L200x200x18": 3.92}

// enUnpublished are the catalog sizes neither table read lists (kept from
// memory; see catalog.go).
var enUnpublished = []string{"L135x65x8", "L135x65x10", "L150x75x9"}

// enTol is the relative tolerance of the catalog's geometry (nominal legs,
// thickness and radii, the corners exact) against the published rows. The
// tables print 3 significant figures, up to 0.5 % for a value such as
// 1.07; measured after the radii were corrected: A within 0.41 %, ez and
// ey within 0.59 % (L45x45x4.5), iv within 0.41 %. 0.7 % still catches a
// wrong leg or thickness (several per cent) and, with the radii checked
// exactly, a wrong fillet.
const enTol = 0.007

// Every SI catalog row against its published row: the radii as printed,
// the area, both centroid distances and iv within enTol. A row the tables
// do not list must be named in enUnpublished, and every published row must
// be a catalog row, so neither list goes stale.
func TestSIPublishedRowsMatchGeometry(t *testing.T) {
	rows := map[string]enRow{}
	for _, r := range enPublished {
		require.NotContains(t, rows, r.name, "duplicate published row")
		rows[r.name] = r
	}
	unpublished := map[string]bool{}
	for _, n := range enUnpublished {
		unpublished[n] = true
		assert.NotContains(t, rows, n, "%s is published: drop it from enUnpublished", n)
	}
	names := Names(units.SI)
	require.Len(t, names, len(rows)+len(unpublished), "a published row or an enUnpublished entry per catalog size")
	for _, name := range names {
		r, ok := rows[name]
		if !ok {
			assert.True(t, unpublished[name], "%s: no published row", name)
			continue
		}
		t.Run(name, func(t *testing.T) {
			a, err := Lookup(name, units.SI)
			require.NoError(t, err)
			assert.Equal(t, r.r1, a.R1.Mm(), "r1 (src: %s)", r.src)
			assert.Equal(t, r.r2, a.R2.Mm(), "r2 (src: %s)", r.src)
			assert.Equal(t, units.Length(r.r1)+a.T, a.K, "K = t + r1")
			g := a.Geometric()
			iv, ivSrc := r.iv, r.src
			if v, ok := enIvOverride[name]; ok {
				iv, ivSrc = v, xcArcelor
			}
			assertRel(t, r.A, float64(g.Area)/100, enTol, "A", r.src)
			assertRel(t, r.ez, g.Xbar.Mm()/10, enTol, "ez (from the long leg's back)", r.src)
			assertRel(t, r.ey, g.Ybar.Mm()/10, enTol, "ey (from the short leg's back)", r.src)
			assertRel(t, iv, g.Rmin.Mm()/10, enTol, "iv", ivSrc)
		})
	}
}

// The two misprinted iv are what the geometry says they are not: the test
// above would fail on them, which is why they are overridden.
func TestEnIvOverrideIsNeeded(t *testing.T) {
	for _, r := range enPublished {
		if _, ok := enIvOverride[r.name]; !ok {
			continue
		}
		a, err := Lookup(r.name, units.SI)
		require.NoError(t, err)
		got := a.Geometric().Rmin.Mm() / 10
		assert.Greater(t, math.Abs(got-r.iv)/r.iv, enTol, "%s: printed iv %g now agrees; drop the override", r.name, r.iv)
	}
}
