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
	// L6x4x1/2: A = 4.75 in2, rz = 0.870 in
	// 6-in leg bolted: x̄ = 0.987 in
	// 4-in leg bolted: x̄ = 1.987 in
	// section: no angle "L4x4x9/16" in the us catalog; nearby sizes: L4x4x3/4, L4x4x5/8, L4x4x1/2, L4x4x7/16, L4x4x3/8, L4x4x5/16, L4x4x1/4
}
