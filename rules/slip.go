package rules

import "fmt"

// slipFactor is J3.8 [J3.9]: φ/Ω by hole type and slot direction relative
// to the load.
func slipFactor(t HoleType, dir SlotDir) Factor {
	switch t {
	case Standard:
		return Factor{1.00, 1.50}
	case ShortSlot:
		if dir == Transverse {
			return Factor{1.00, 1.50}
		}
		return Factor{0.85, 1.76}
	case Oversized:
		return Factor{0.85, 1.76}
	case LongSlot:
		return Factor{0.70, 2.14}
	}
	panic(fmt.Sprintf("rules: unknown hole type %d", int(t)))
}

// mu is J3.8 [J3.9]: the mean slip coefficient of a faying surface class.
func mu(c SlipClass) float64 {
	switch c {
	case ClassA:
		return 0.30
	case ClassB:
		return 0.50
	}
	panic(fmt.Sprintf("rules: unknown slip class %d", int(c)))
}

// hf is J3.8 [J3.9]: the filler factor.
func hf(fillers int) float64 {
	if fillers >= 2 {
		return 0.85
	}
	return 1.0
}
