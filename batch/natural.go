package batch

import (
	"slices"
	"strings"
)

// NaturalCompare orders names as people read them: runs of digits by
// their value, so BR-2 comes before BR-10; the rest without regard to
// case, then with it, so the order never depends on anything but the
// names. It returns -1, 0 or +1.
func NaturalCompare(a, b string) int {
	if c := naturalFold(a, b, true); c != 0 {
		return c
	}
	if c := naturalFold(a, b, false); c != 0 {
		return c
	}
	return strings.Compare(a, b)
}

func isDigit(c byte) bool { return '0' <= c && c <= '9' }

// naturalFold compares a and b chunk by chunk: digit runs by value (then
// fewer leading zeros first), other bytes one by one, folded to lower
// case when fold.
func naturalFold(a, b string, fold bool) int {
	i, j := 0, 0
	for i < len(a) && j < len(b) {
		if isDigit(a[i]) && isDigit(b[j]) {
			si, sj := i, j
			for i < len(a) && isDigit(a[i]) {
				i++
			}
			for j < len(b) && isDigit(b[j]) {
				j++
			}
			if c := compareDigits(a[si:i], b[sj:j]); c != 0 {
				return c
			}
			continue
		}
		ca, cb := a[i], b[j]
		if fold {
			ca, cb = lower(ca), lower(cb)
		}
		if ca != cb {
			if ca < cb {
				return -1
			}
			return 1
		}
		i++
		j++
	}
	switch {
	case len(a)-i < len(b)-j:
		return -1
	case len(a)-i > len(b)-j:
		return 1
	}
	return 0
}

// compareDigits compares two runs of digits by value, then by length
// (007 after 7).
func compareDigits(x, y string) int {
	tx, ty := strings.TrimLeft(x, "0"), strings.TrimLeft(y, "0")
	switch {
	case len(tx) != len(ty):
		return sign(len(tx) - len(ty))
	case tx != ty:
		return strings.Compare(tx, ty)
	}
	return sign(len(x) - len(y))
}

func sign(n int) int {
	switch {
	case n < 0:
		return -1
	case n > 0:
		return 1
	}
	return 0
}

func lower(c byte) byte {
	if 'A' <= c && c <= 'Z' {
		return c + 'a' - 'A'
	}
	return c
}

// Sorted returns the rows sorted naturally by mark (BR-2 before BR-10);
// rows without a mark (the job could not be read) after them; rows of one
// mark (a duplicate) and rows without one in input order.
func Sorted(rows []Row) []Row {
	out := slices.Clone(rows)
	slices.SortStableFunc(out, func(a, b Row) int {
		switch {
		case a.Mark == "" && b.Mark != "":
			return 1
		case a.Mark != "" && b.Mark == "":
			return -1
		case a.Mark != b.Mark:
			return NaturalCompare(a.Mark, b.Mark)
		}
		return a.order - b.order
	})
	return out
}
