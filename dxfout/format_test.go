package dxfout

import (
	"bytes"
	"math"
	"math/rand/v2"
	"strconv"
	"testing"

	"github.com/yofu/dxf/format"
)

// Our formatter writes what the library's own (format.ASCII, the one
// drawing.New uses, at its 16 decimals) writes, for every kind of group
// and every sort of value: the reference is the library, not us.
func TestFormatterMatchesLibrary(t *testing.T) {
	floats := []float64{0, math.Copysign(0, -1), 1, -1, 0.1, 1.0 / 3, -2.5, 19.5, 19.4999999999999964, 1e-9, 5e-17,
		-5e-17, 123456789.123456789, 1e21, -1e300, math.MaxFloat64, math.SmallestNonzeroFloat64,
		math.Inf(1), math.Inf(-1), math.NaN()}
	rng := rand.New(rand.NewPCG(12, 34))
	for range 2000 {
		floats = append(floats, (rng.Float64()-0.5)*math.Pow(10, float64(rng.IntN(24)-8)))
	}
	ints := []int{0, 1, -1, 9, 10, 15, 16, 255, 0x1F2E, 1 << 40, -0xABC, math.MaxInt, math.MinInt}
	strs := []string{"", "SECTION", "gaugeline stamp: v1 check 3f2a", "a%sb%%d"}
	for _, prec := range []int{16, 6, 0, 1, 17} {
		lib := format.NewASCII()
		lib.SetPrecision(prec)
		ours := newASCII(0)
		ours.SetPrecision(prec)
		for i, v := range floats {
			if a, b := ours.Float(10+i%3, v), lib.Float(10+i%3, v); a != b {
				t.Errorf("prec %d: Float(%v) = %q, library %q", prec, v, a, b)
			}
			ours.WriteFloat(40, v)
			lib.WriteFloat(40, v)
		}
		for _, v := range ints {
			if a, b := ours.Int(70, v), lib.Int(70, v); a != b {
				t.Errorf("Int(%d) = %q, library %q", v, a, b)
			}
			if a, b := ours.Hex(5, v), lib.Hex(5, v); a != b {
				t.Errorf("Hex(%d) = %q, library %q", v, a, b)
			}
			ours.WriteInt(90, v)
			lib.WriteInt(90, v)
			ours.WriteHex(330, v)
			lib.WriteHex(330, v)
		}
		for _, s := range strs {
			if a, b := ours.String(999, s), lib.String(999, s); a != b {
				t.Errorf("String(%q) = %q, library %q", s, a, b)
			}
			ours.WriteString(1, s)
			lib.WriteString(1, s)
		}
		var a, b bytes.Buffer
		if _, err := ours.WriteTo(&a); err != nil {
			t.Fatal(err)
		}
		if _, err := lib.WriteTo(&b); err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(a.Bytes(), b.Bytes()) {
			t.Errorf("prec %d: the written streams differ", prec)
		}
		ours.WriteString(0, "EOF")
		lib.WriteString(0, "EOF")
		if a, b := ours.Output(), lib.Output(); a != b || a != "0\nEOF\n" {
			t.Errorf("Output after WriteTo: %q, library %q", a, b)
		}
		if ours.Output() != "" || lib.Output() != "" {
			t.Error("Output does not empty the buffer")
		}
	}
}

func BenchmarkWriteFloat(b *testing.B) {
	for _, bb := range []struct {
		name string
		f    format.Formatter
	}{{"library", format.NewASCII()}, {"ours", newASCII(1 << 16)}} {
		b.Run(bb.name, func(b *testing.B) {
			bb.f.SetPrecision(16)
			v := 12.3456789
			for i := 0; b.Loop(); i++ {
				if i%1000 == 0 {
					bb.f.Reset()
				}
				bb.f.WriteFloat(10, v)
			}
		})
	}
}

// The fixed-point path gives strconv's digits (fmt's %.*f, what the
// library writes) for values of every magnitude it takes, halfway cases
// (odd multiples of 2^-(prec+1), exact ties at prec decimals: round half
// to even) and the edges of its range, and declines the rest.
func TestAppendFixedMatchesStrconv(t *testing.T) {
	rng := rand.New(rand.NewPCG(56, 78))
	var vs []float64
	for range 20000 {
		vs = append(vs, (rng.Float64()-0.5)*math.Pow(10, float64(rng.IntN(36)-20)))
		vs = append(vs, math.Float64frombits(rng.Uint64()))
		vs = append(vs, float64(rng.IntN(1<<20))/float64(int(1)<<rng.IntN(40)))
	}
	for _, e := range []float64{1 << 40, 1 << 44, 1 << 46, 1 << 47, 1e13, 1.2676506002282294e14, 1.2676506002282295e14, 1e15, 1e20} {
		for _, v := range []float64{e, math.Nextafter(e, 0), math.Nextafter(e, math.Inf(1))} {
			vs = append(vs, v, -v, 1/v, -1/v)
		}
	}
	vs = append(vs, 0, math.Copysign(0, -1), math.SmallestNonzeroFloat64, -math.SmallestNonzeroFloat64, math.MaxFloat64,
		math.Inf(1), math.Inf(-1), math.NaN(), -1e-20, 5e-17, 0.5, 1.5, 2.5, -2.5)
	for prec := 0; prec <= maxFixed+1; prec++ {
		f := newASCII(0)
		f.SetPrecision(prec)
		fast := 0
		ties := vs
		for j := 1; j < 2000; j += 2 {
			ties = append(ties, float64(j)/math.Ldexp(1, prec+1), -float64(j)/math.Ldexp(1, prec+1))
		}
		for _, v := range ties {
			want := strconv.AppendFloat(nil, v, 'f', prec, 64)
			got, ok := appendFixed(nil, v, prec, f.pow5)
			if !ok {
				if len(got) != 0 {
					t.Fatalf("prec %d: declined %v but appended %q", prec, v, got)
				}
				continue
			}
			fast++
			if !bytes.Equal(got, want) {
				t.Fatalf("prec %d: %v written %s, strconv %s", prec, v, got, want)
			}
		}
		// Everything finite below 2^100/10^prec takes the quick path.
		if prec <= maxFixed && fast < len(ties)/3 {
			t.Errorf("prec %d: only %d of %d values took the quick path", prec, fast, len(ties))
		}
		if prec > maxFixed && fast != 0 {
			t.Errorf("prec %d: past maxFixed but %d values took the quick path", prec, fast)
		}
	}
}
