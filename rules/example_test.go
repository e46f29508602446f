package rules_test

import (
	"fmt"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

// A 3/4-in bolt in a long slot (AISC 360-22 Table J3.3: 13/16 × 1-7/8 in).
func ExampleEdition_Hole() {
	ed, err := rules.Lookup("aisc360-22", units.US)
	if err != nil {
		panic(err)
	}
	h, err := ed.Hole(3*units.Inch/4, rules.LongSlot)
	if err != nil {
		panic(err)
	}
	fmt.Printf("%.4f x %.4f in (%s)\n", h.Width.In(), h.Length.In(), ed.Clause("J3.3"))
	// Output: 0.8125 x 1.8750 in (J3.4)
}

// Under 360-16 the metric tables start at M16.
func ExampleNotTabulatedError() {
	ed, _ := rules.Lookup("aisc360-16", units.SI)
	_, err := ed.Hole(12*units.Millimetre, rules.Standard)
	fmt.Println(err)
	// Output: aisc360-16 (si): Table J3.3M has no entry for M12
}
