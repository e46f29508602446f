//go:build linux

package main

import (
	"bytes"
	"context"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"syscall"
	"testing"
	"unsafe"
)

// openPTY opens a pseudo-terminal pair (Linux /dev/ptmx): what propose
// writes to tty appears on master.
func openPTY(t *testing.T) (master, tty *os.File) {
	t.Helper()
	m, err := os.OpenFile("/dev/ptmx", os.O_RDWR|syscall.O_NOCTTY, 0)
	if err != nil {
		t.Skip("no pseudo-terminal:", err)
	}
	var unlock int32
	var n uint32
	for _, c := range []struct {
		req uintptr
		arg unsafe.Pointer
	}{{syscall.TIOCSPTLCK, unsafe.Pointer(&unlock)}, {syscall.TIOCGPTN, unsafe.Pointer(&n)}} {
		if _, _, e := syscall.Syscall(syscall.SYS_IOCTL, m.Fd(), c.req, uintptr(c.arg)); e != 0 {
			m.Close()
			t.Skip("no pseudo-terminal:", e)
		}
	}
	s, err := os.OpenFile(fmt.Sprintf("/dev/pts/%d", n), os.O_RDWR|syscall.O_NOCTTY, 0)
	if err != nil {
		m.Close()
		t.Skip("no pseudo-terminal:", err)
	}
	return m, s
}

// TestProposeProgressOnTerminal: with stderr a terminal, propose shows a
// bar (the exhaustive search: out of the space; the pruned one: a count)
// and clears it when done; stdout is what it is without a terminal.
func TestProposeProgressOnTerminal(t *testing.T) {
	job, _ := filepath.Abs(filepath.Join(testdata, "propose", "us-flat-shear.yaml"))
	space := proposeDoc(t, gaugeline(t, ".", "propose", job, "--format", "json")).Search.Space
	for _, c := range []struct {
		args []string
		want string // on the terminal
	}{
		{[]string{"--exhaustive"}, "propose --exhaustive"},
		{nil, "propose"},
	} {
		args := append([]string{"propose", job, "--format", "json"}, c.args...)
		master, tty := openPTY(t)
		got := make(chan string)
		go func() {
			var b bytes.Buffer
			io.Copy(&b, master) // ends with EIO once tty is closed
			got <- b.String()
		}()
		var stdout bytes.Buffer
		code := run(context.Background(), args, &stdout, tty)
		tty.Close()
		screen := <-got
		master.Close()

		want := gaugeline(t, ".", args...)
		if code != 0 || stdout.String() != want.stdout {
			t.Errorf("%v: exit %d; stdout equal to a piped run's: %v", c.args, code, stdout.String() == want.stdout)
		}
		if !strings.Contains(screen, c.want) || !strings.Contains(screen, "candidates") {
			t.Errorf("%v: the terminal shows %q, want a bar with %q", c.args, screen, c.want)
		}
		if c.args != nil && !strings.Contains(screen, fmt.Sprintf("/%d,", space)) {
			t.Errorf("%v: the bar %q does not count out of the space %d", c.args, screen, space)
		}
		// cleared: the last write blanks the line and returns to its start
		if !regexpCleared.MatchString(screen) {
			t.Errorf("%v: the bar is not cleared at the end: %q", c.args, screen)
		}
	}
}

var regexpCleared = regexp.MustCompile(`\r +\r$`)
