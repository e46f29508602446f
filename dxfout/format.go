package dxfout

import (
	"io"
	"math"
	"math/bits"
	"strconv"

	"github.com/yofu/dxf/format"
)

// ascii is a format.Formatter that writes what the library's format.ASCII
// writes, byte for byte, appending straight to one buffer: where ASCII
// builds a format string per value and runs it through fmt.Sprintf (about
// 620 ns and 2 allocations a float), strconv appends the same digits in
// place. A group is its code, a line break, its value and a line break;
// handles in upper-case hex; reals in fixed point with prec decimals
// (fmt's %.*f, which is strconv's 'f' format).
type ascii struct {
	buf  []byte
	prec int
	pow5 uint64 // 5^prec, 0 when prec is past what appendFixed takes
}

var _ format.Formatter = (*ascii)(nil)

// newASCII returns a formatter with room for size bytes, at the 16
// decimals drawing.New sets on the library's own.
func newASCII(size int) *ascii {
	f := &ascii{buf: make([]byte, 0, size)}
	f.SetPrecision(16)
	return f
}

func (f *ascii) Reset() { f.buf = f.buf[:0] }

// WriteTo writes the buffer to w and empties it, as ASCII's does.
func (f *ascii) WriteTo(w io.Writer) (int64, error) {
	n, err := w.Write(f.buf)
	f.buf = f.buf[:0]
	return int64(n), err
}

// SetPrecision sets the decimals of reals; p ≥ 0.
func (f *ascii) SetPrecision(p int) {
	f.prec, f.pow5 = p, 0
	if p >= 0 && p <= maxFixed {
		f.pow5 = 1
		for range p {
			f.pow5 *= 5
		}
	}
}

// Output returns the buffer and empties it.
func (f *ascii) Output() string {
	s := string(f.buf)
	f.buf = f.buf[:0]
	return s
}

func (f *ascii) String(num int, val string) string { return string(appendString(nil, num, val)) }
func (f *ascii) Hex(num int, h int) string         { return string(appendHex(nil, num, h)) }
func (f *ascii) Int(num int, val int) string       { return string(appendInt(nil, num, val)) }
func (f *ascii) Float(num int, val float64) string {
	return string(appendFloat(nil, num, val, f.prec, f.pow5))
}

func (f *ascii) WriteString(num int, val string) { f.buf = appendString(f.buf, num, val) }
func (f *ascii) WriteHex(num int, h int)         { f.buf = appendHex(f.buf, num, h) }
func (f *ascii) WriteInt(num int, val int)       { f.buf = appendInt(f.buf, num, val) }
func (f *ascii) WriteFloat(num int, val float64) {
	f.buf = appendFloat(f.buf, num, val, f.prec, f.pow5)
}

func appendCode(b []byte, num int) []byte {
	b = strconv.AppendInt(b, int64(num), 10)
	return append(b, '\n')
}

func appendString(b []byte, num int, val string) []byte {
	b = appendCode(b, num)
	b = append(b, val...)
	return append(b, '\n')
}

func appendInt(b []byte, num, val int) []byte {
	b = appendCode(b, num)
	b = strconv.AppendInt(b, int64(val), 10)
	return append(b, '\n')
}

// appendHex writes h as %X does: upper-case digits, a minus sign before a
// negative one.
func appendHex(b []byte, num, h int) []byte {
	b = appendCode(b, num)
	u := uint64(h)
	if h < 0 {
		b = append(b, '-')
		u = -u
	}
	var digits [16]byte
	i := len(digits)
	for {
		i--
		digits[i] = "0123456789ABCDEF"[u&0xf]
		u >>= 4
		if u == 0 {
			break
		}
	}
	b = append(b, digits[i:]...)
	return append(b, '\n')
}

func appendFloat(b []byte, num int, val float64, prec int, pow5 uint64) []byte {
	b = appendCode(b, num)
	if out, ok := appendFixed(b, val, prec, pow5); ok {
		b = out
	} else {
		b = strconv.AppendFloat(b, val, 'f', prec, 64)
	}
	return append(b, '\n')
}

// maxFixed is the most decimals appendFixed takes: 5^20 < 2^47, so a
// significand (< 2^53) times 5^prec stays below 2^100.
const maxFixed = 20

// appendFixed appends v in fixed point with prec decimals as
// strconv.AppendFloat(b, v, 'f', prec, 64) does, where that is quick to do
// exactly: v·10^prec rounded half to even, in 128-bit integers. strconv
// takes its arbitrary-precision path for every 'f' with a precision, at
// several times the cost. ok is false, and nothing appended, for NaN, the
// infinities and values of 10^prec·|v| ≥ 2^100 (|v| beyond about
// 1.3·10^14 at 16 decimals); pow5 is 5^prec.
func appendFixed(b []byte, v float64, prec int, pow5 uint64) (_ []byte, ok bool) {
	if pow5 == 0 {
		return b, false
	}
	bits64 := math.Float64bits(v)
	neg := bits64>>63 != 0
	exp := int(bits64>>52) & 0x7ff
	mant := bits64 & (1<<52 - 1)
	switch exp {
	case 0x7ff: // NaN, ±Inf
		return b, false
	case 0: // zero, subnormal
		exp = -1074
	default:
		mant |= 1 << 52
		exp -= 1075
	}
	// v = ±mant·2^exp, so v·10^prec = ±mant·5^prec·2^(exp+prec).
	hi, lo := bits.Mul64(mant, pow5)
	switch s := exp + prec; {
	case s < 0:
		hi, lo = roundShr128(hi, lo, uint(-s))
	case mant == 0:
	case len128(hi, lo)+s > 100:
		return b, false
	default:
		hi, lo = shl128(hi, lo, uint(s))
	}
	// The integer n = hi·2^64 + lo < 2^100 in decimal, at least prec+1
	// digits.
	var d [40]byte
	i := len(d)
	if hi != 0 {
		q, r := bits.Div64(hi, lo, 1e19) // hi < 2^36 < 10^19
		i = putDigits(&d, i, r, 19)
		lo = q
	}
	i = putDigits(&d, i, lo, prec+1-(len(d)-i))
	if neg {
		b = append(b, '-')
	}
	point := len(d) - prec
	b = append(b, d[i:point]...)
	if prec > 0 {
		b = append(b, '.')
		b = append(b, d[point:]...)
	}
	return b, true
}

// digitPairs is 00, 01, … 99.
const digitPairs = "00010203040506070809101112131415161718192021222324252627282930313233343536373839" +
	"40414243444546474849505152535455565758596061626364656667686970717273747576777879" +
	"8081828384858687888990919293949596979899"

// putDigits writes v in decimal into d, ending before d[i], in no fewer
// than least digits (zeros in front) and at least one, and returns where
// the digits start.
func putDigits(d *[40]byte, i int, v uint64, least int) int {
	end := i
	for v >= 10 {
		q := v / 100
		r := 2 * (v - 100*q)
		i -= 2
		d[i], d[i+1] = digitPairs[r], digitPairs[r+1]
		v = q
	}
	if v > 0 {
		i--
		d[i] = byte('0' + v)
	}
	for end-i < least || i == end {
		i--
		d[i] = '0'
	}
	return i
}

// len128 is the bit length of hi·2^64 + lo.
func len128(hi, lo uint64) int {
	if hi != 0 {
		return 64 + bits.Len64(hi)
	}
	return bits.Len64(lo)
}

// shl128 returns (hi, lo) << s for s < 128.
func shl128(hi, lo uint64, s uint) (uint64, uint64) {
	if s >= 64 {
		return lo << (s - 64), 0
	}
	if s == 0 {
		return hi, lo
	}
	return hi<<s | lo>>(64-s), lo << s
}

// roundShr128 returns (hi, lo) / 2^s rounded half to even, for s > 0 and
// (hi, lo) < 2^100.
func roundShr128(hi, lo uint64, s uint) (uint64, uint64) {
	if s > 100 {
		return 0, 0 // below 1/2
	}
	var qhi, qlo, rhi, rlo uint64 // quotient and remainder
	switch {
	case s >= 64:
		qhi, qlo = 0, hi>>(s-64)
		rhi, rlo = hi&(1<<(s-64)-1), lo
	default:
		qhi, qlo = hi>>s, hi<<(64-s)|lo>>s
		rhi, rlo = 0, lo&(1<<s-1)
	}
	// half = 2^(s-1)
	var hhi, hlo uint64
	if s-1 >= 64 {
		hhi = 1 << (s - 1 - 64)
	} else {
		hlo = 1 << (s - 1)
	}
	if rhi > hhi || rhi == hhi && rlo > hlo || rhi == hhi && rlo == hlo && qlo&1 == 1 {
		var c uint64
		qlo, c = bits.Add64(qlo, 1, 0)
		qhi += c
	}
	return qhi, qlo
}
