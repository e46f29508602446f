package batch

import (
	"fmt"
	"testing"
	"time"
)

// A list line keeps what comes before a comment; a '#' inside a name is
// part of it (common practice, no source: shell-like comments).
func TestBatchInputs(t *testing.T) {
	for _, tt := range []struct{ line, want string }{
		{"a.yaml", "a.yaml"},
		{"a.yaml # note", "a.yaml "},
		{"# all comment", ""},
		{"b#1.yaml", "b#1.yaml"},
		{"\tc.yaml\t# tab", "\tc.yaml\t"},
	} {
		got := tt.line
		if i := commentStart(got); i >= 0 {
			got = got[:i]
		}
		if got != tt.want {
			t.Errorf("commentStart(%q): kept %q, want %q", tt.line, got, tt.want)
		}
	}
}

// The mark gate's relay: whichever order the jobs reach it, the earlier
// job in the input owns a mark and the later one is the duplicate
// (DEVELOPERS.md, Batch: "a duplicate is always the later job"), with
// case ignored; a job that stops before the gate (an unreadable file, a
// panic: mark "") still hands it on, so the jobs after it are not stuck.
func TestMarkGateInputOrder(t *testing.T) {
	marks := []string{"BR-1", "", "br-1", "BR-2", "BR-1"}
	g := newMarkGate()
	turns := make([]*gateTurn, len(marks))
	wait := make(chan struct{})
	close(wait)
	for i := range turns {
		turns[i] = &gateTurn{wait: wait, next: make(chan struct{})}
		wait = turns[i].next
	}
	got := make([]string, len(marks))
	done := make(chan int)
	// The last job reaches the gate first: each job starts a little after
	// the one behind it (the pause only makes a broken gate fail surely;
	// a working one passes whatever the timing).
	for i := len(marks) - 1; i >= 0; i-- {
		go func() {
			got[i] = g.pass(turns[i], fmt.Sprintf("job%d", i), marks[i])
			g.pass(turns[i], "again", "BR-9") // a second pass does nothing
			done <- i
		}()
		time.Sleep(5 * time.Millisecond)
	}
	for range marks {
		<-done
	}
	want := []string{
		"",
		"",
		"duplicate mark br-1, already used as BR-1 by job0 (marks differing only in case name the same folder on Windows and macOS)",
		"",
		"duplicate mark BR-1, already used by job0",
	}
	for i := range want {
		if got[i] != want[i] {
			t.Errorf("job %d (%q): %q, want %q", i, marks[i], got[i], want[i])
		}
	}
	if _, taken := g.owners["br-9"]; taken {
		t.Error("a second pass of a turn claimed a mark")
	}
}
