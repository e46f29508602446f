package units_test

import (
	"fmt"

	"gaugeline/rules/units"
)

func ExampleParse() {
	for _, s := range []string{"3/4 in", "1-1/2", `3'-6 1/2"`, "20 mm"} {
		mm, err := units.Parse(s, units.DimLength, units.US)
		if err != nil {
			fmt.Println(err)
			continue
		}
		fmt.Printf("%-11s = %.2f mm\n", s, mm)
	}
	kN, _ := units.Parse("400 kN", units.DimForce, units.US)
	fmt.Printf("400 kN      = %.0f N\n", kN)

	_, err := units.Parse("3 kip", units.DimLength, units.US)
	fmt.Println(err)
	// Output:
	// 3/4 in      = 19.05 mm
	// 1-1/2       = 38.10 mm
	// 3'-6 1/2"   = 1079.50 mm
	// 20 mm       = 20.00 mm
	// 400 kN      = 400000 N
	// "3 kip" is a force, not a length
}

func ExampleFormatLength() {
	for _, in := range []float64{0.75, 3.5, 11.99, 42.5, -15.5} {
		fmt.Println(units.FormatLength(units.Length(in)*units.Inch, units.US, units.Shop))
	}
	fmt.Println(units.FormatLength(1000*units.Millimetre, units.US, units.Shop))
	// Output:
	// 3/4"
	// 3 1/2"
	// 1'-0"
	// 3'-6 1/2"
	// -1'-3 1/2"
	// 3'-3 3/8"
}

func ExampleFormatJob() {
	fmt.Println(units.FormatJob(1.5*units.Inch, units.US))
	fmt.Println(units.FormatJob(12.1875*units.Inch, units.US))
	fmt.Println(units.FormatJob(22.5*units.Millimetre, units.SI))
	// Output:
	// 1-1/2 in
	// 12-3/16 in
	// 22.5 mm
}

func ExampleFormat() {
	hole := float64(27 * units.Inch / 32) // 13/16 in plus 1/32 in
	fmt.Println(units.Format(hole, units.DimLength, units.US, units.Job))
	fmt.Println(units.Format(hole, units.DimLength, units.US, units.Shop))
	fmt.Println(units.Format(hole, units.DimLength, units.US, units.People))
	fmt.Println(units.Format(hole, units.DimLength, units.US, units.Report))
	fmt.Println(units.Format(float64(95*units.Kip), units.DimForce, units.US, units.Report))
	fmt.Println(units.Format(53.3333333, units.DimLength, units.SI, units.People))
	// Output:
	// 0.84375 in
	// 7/8"
	// 7/8" (0.84375 in)
	// 0.844 in
	// 95.0 kip
	// 53.3 mm (53.333333 mm)
}
