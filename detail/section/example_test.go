package section_test

import (
	"fmt"

	"gaugeline/detail/section"
	"gaugeline/rules/units"
)

// The shear-lag eccentricity x̄ of an unequal angle depends on which leg is
// bolted.
func ExampleLookup() {
	a, err := section.Lookup("L6x4x1/2", units.US)
	if err != nil {
		fmt.Println(err)
		return
	}
	long := a.Properties()
	short := a.Swapped().Properties()
	fmt.Printf("%s: A = %.2f in2, rz = %.3f in\n", a.Name, float64(long.Area/units.SquareInch), long.Rmin.In())
	fmt.Printf("6-in leg bolted: x̄ = %.3f in\n", long.Xbar.In())
	fmt.Printf("4-in leg bolted: x̄ = %.3f in\n", short.Xbar.In())

	_, err = section.Lookup("L4x4x9/16", units.US)
	fmt.Println(err)
	// Output:
	// L6x4x1/2: A = 4.75 in2, rz = 0.864 in
	// 6-in leg bolted: x̄ = 0.981 in
	// 4-in leg bolted: x̄ = 1.980 in
	// section: no angle "L4x4x9/16" in the us catalog; nearby sizes: L4x4x3/4, L4x4x5/8, L4x4x1/2, L4x4x7/16, L4x4x3/8, L4x4x5/16, L4x4x1/4
}

// A channel's x̄, from the back of its web, is the shear-lag eccentricity
// when the web is bolted.
func ExampleLookupC() {
	c, err := section.LookupC("C10x15.3")
	if err != nil {
		fmt.Println(err)
		return
	}
	p := c.Properties()
	fmt.Printf("%s: A = %.2f in2, x̄ = %.3f in, rx = %.2f in, ry = %.3f in\n",
		c.Name, float64(p.Area/units.SquareInch), p.Xbar.In(), p.Rx.In(), p.Ry.In())
	wt, _ := section.LookupWT("WT6x20")
	fmt.Printf("%s: ȳ = %.3f in\n", wt.Name, wt.Properties().Ybar.In())
	_, err = section.LookupW("W8x22")
	fmt.Println(err)
	// Output:
	// C10x15.3: A = 4.46 in2, x̄ = 0.638 in, rx = 3.87 in, ry = 0.718 in
	// WT6x20: ȳ = 1.086 in
	// section: no shape "W8x22" in the catalog; sizes in the catalog: W8x21 (W200x31.3), W8x24 (W200x35.9), W10x33 (W250x49.1), W12x40 (W310x60), W12x72 (W310x107)
}
