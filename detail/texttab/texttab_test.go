package texttab

import (
	"strings"
	"testing"
	"unicode/utf8"
)

// Wrap keeps every line within the width and loses no word (a property
// of the wrapping, no outside source).
func TestWrap(t *testing.T) {
	s := "worst of 8 blocks: member: across the flange at the row 8 in from the end, the stem at the toe of its fillet sheared"
	for _, w := range []int{20, 36, 60, 100} {
		lines := Wrap(s, w)
		for _, l := range lines {
			if utf8.RuneCountInString(l) > w {
				t.Errorf("width %d: line %q is %d long", w, l, utf8.RuneCountInString(l))
			}
		}
		if got := strings.Join(lines, " "); got != s {
			t.Errorf("width %d: words lost or moved: %q", w, got)
		}
	}
	if got := Wrap("", 10); len(got) != 1 || got[0] != "" {
		t.Errorf("Wrap of nothing = %q, want one empty line", got)
	}
}

// Table pads the columns and wraps the last beside its row, or puts it
// under the row where the others leave it too little room.
func TestTable(t *testing.T) {
	var b strings.Builder
	Table(&b, [][]string{{"ID", "WHERE"}, {"a", "one two three four five six seven eight nine ten eleven"}}, 40)
	want := "ID  WHERE\na   one two three four five six seven\n    eight nine ten eleven\n"
	if b.String() != want {
		t.Errorf("beside:\n%s\nwant:\n%s", b.String(), want)
	}
	b.Reset()
	Table(&b, [][]string{{"LIMIT STATE", "RATIO", "WHAT"}, {"member.rupture", "0.821", "net section, worst path; U from Table D3.1 case 7"}}, 40)
	want = "LIMIT STATE     RATIO  WHAT\nmember.rupture  0.821\n    net section, worst path; U from\n    Table D3.1 case 7\n"
	if b.String() != want {
		t.Errorf("under:\n%s\nwant:\n%s", b.String(), want)
	}
}
