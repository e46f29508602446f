package batch

import "testing"

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
