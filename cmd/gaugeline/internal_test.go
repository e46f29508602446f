package main

import (
	"bytes"
	"context"
	"debug/buildinfo"
	"regexp"
	"runtime/debug"
	"strings"
	"testing"

	"github.com/spf13/cobra"
)

// TestPanicIsInternalError: a panic anywhere under the root command is an
// internal error with exit code 4, its value and what to report, not a
// stack trace under the bad-input code 2. The panics come from a command
// only this test adds to the real root command, run by the same execute
// that run uses.
func TestPanicIsInternalError(t *testing.T) {
	for _, c := range []struct {
		name  string
		crash func(args []string)
		value string // the panic's value as printed
	}{
		// a runtime error, as a real bug raises
		{"index", func(args []string) { _ = args[len(args)+1] }, "runtime error: index out of range [2] with length 1"},
		// a programmer's mistake caught by a package (STYLE.md)
		{"package", func([]string) { panic("detail: propose chose a layout that fails its check") }, "detail: propose chose a layout that fails its check"},
	} {
		t.Run(c.name, func(t *testing.T) {
			var stdout, stderr bytes.Buffer
			o := &rootOptions{stdout: &stdout, stderr: &stderr}
			root := newRootCmd(o)
			root.AddCommand(&cobra.Command{Use: "crash", RunE: func(_ *cobra.Command, args []string) error {
				c.crash(args)
				return nil
			}})
			code := execute(context.Background(), root, []string{"crash", "my job.yaml"}, &stdout, &stderr)
			if code != exitInternal || exitInternal != 4 {
				t.Errorf("exit %d, want exitInternal = 4", code)
			}
			lines := strings.Split(strings.TrimSuffix(stderr.String(), "\n"), "\n")
			if len(lines) != 2 || lines[0] != "gaugeline: internal error: "+c.value {
				t.Fatalf("stderr:\n%s\nwant two lines, the first %q", stderr.String(), "gaugeline: internal error: "+c.value)
			}
			hint := lines[1]
			for _, w := range []string{"gaugeline: hint: ", `gaugeline crash "my job.yaml"`, "job file", "gaugeline version " + version()} {
				if !strings.Contains(hint, w) {
					t.Errorf("hint %q does not say %q", hint, w)
				}
			}
			// no stack trace: no goroutine header, no file:line frames
			if s := stderr.String(); strings.Contains(s, "goroutine ") || regexp.MustCompile(`\.go:\d+`).MatchString(s) {
				t.Errorf("stderr shows a stack trace:\n%s", s)
			}
		})
	}
}

// TestVersion: the version in the hint and in `gaugeline --version`
// comes from the build information the Go tool embeds
// (runtime/debug.ReadBuildInfo): module version, commit, whether the
// checkout was modified, Go version.
func TestVersion(t *testing.T) {
	bi := &debug.BuildInfo{GoVersion: "go1.26.0", Main: debug.Module{Version: "v1.2.0"},
		Settings: []debug.BuildSetting{{Key: "vcs", Value: "git"}, {Key: "vcs.revision", Value: "0123abcd"}, {Key: "vcs.modified", Value: "true"}}}
	if got, want := versionOf(bi), "v1.2.0 commit 0123abcd (modified), go1.26.0"; got != want {
		t.Errorf("versionOf = %q, want %q", got, want)
	}
	bi.Settings[2].Value = "false"
	if got, want := versionOf(bi), "v1.2.0 commit 0123abcd, go1.26.0"; got != want {
		t.Errorf("versionOf = %q, want %q", got, want)
	}
	if got, want := versionOf(&debug.BuildInfo{GoVersion: "go1.26.0"}), "(devel), go1.26.0"; got != want {
		t.Errorf("versionOf = %q, want %q", got, want)
	}
	// The real binary prints what its own build information says (with
	// a commit only when built with -buildvcs in a checkout).
	own, err := buildinfo.ReadFile(bin)
	if err != nil {
		t.Fatal(err)
	}
	r := gaugeline(t, ".", "--version")
	if want := "gaugeline version " + versionOf(own) + "\n"; r.code != 0 || r.stdout != want {
		t.Errorf("--version: exit %d, %q; want %q", r.code, r.stdout, want)
	}
}
