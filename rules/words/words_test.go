package words

import (
	"strings"
	"testing"
)

type hole int

// The spellings and messages are the job file's own (SPEC §3; the error
// texts testdata/bad's files were written against), no outside source.
var holes = New[hole]("hole type", "standard", "oversized", "short-slot", "long-slot")

func TestRoundTrip(t *testing.T) {
	for i, want := range []string{"standard", "oversized", "short-slot", "long-slot"} {
		if got := holes.Name(hole(i)); got != want {
			t.Errorf("Name(%d) = %q, want %q", i, got, want)
		}
		v, err := holes.Parse(want)
		if err != nil || v != hole(i) {
			t.Errorf("Parse(%q) = %d, %v; want %d", want, v, err, i)
		}
	}
}

func TestParseUnknown(t *testing.T) {
	v, err := holes.Parse("round")
	const want = `unknown hole type "round" (want standard, oversized, short-slot or long-slot)`
	if err == nil || err.Error() != want || v != 0 {
		t.Fatalf("Parse(round) = %d, %v; want 0, %s", v, err, want)
	}
	two := New[hole]("slip class", "A", "B")
	if _, err := two.Parse("C"); err == nil || err.Error() != `unknown slip class "C" (want A or B)` {
		t.Errorf("two names: %v", err)
	}
	if _, err := holes.Parse("Standard"); err == nil {
		t.Error("Parse is case-sensitive, as the job file is")
	}
}

func TestAlternatives(t *testing.T) {
	for _, c := range []struct {
		in   []string
		want string
	}{{nil, ""}, {[]string{"a"}, "a"}, {[]string{"a", "b"}, "a or b"}, {[]string{"a", "b", "c"}, "a, b or c"}} {
		if got := Alternatives(c.in); got != c.want {
			t.Errorf("Alternatives(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

func TestNameOutsideTablePanics(t *testing.T) {
	defer func() {
		if v := recover(); v == nil || !strings.HasPrefix(v.(string), "words: ") {
			t.Errorf("recover() = %v, want a panic naming the package", v)
		}
	}()
	holes.Name(4)
}
