//go:build unix

package jobfile

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// within runs load and fails the test, instead of hanging, when it has not
// returned after 5 s; a reader blocked on a FIFO is then let go by opening
// the FIFO's other end.
func within(t *testing.T, fifo string, load func() error) error {
	t.Helper()
	done := make(chan error, 1)
	go func() { done <- load() }()
	select {
	case err := <-done:
		return err
	case <-time.After(5 * time.Second):
		if w, err := os.OpenFile(fifo, os.O_WRONLY, 0); err == nil {
			w.Close()
		}
		<-done
		t.Fatalf("reading %s blocked for 5 s", fifo)
		return nil
	}
}

func mkfifo(t *testing.T, name string) string {
	t.Helper()
	p := filepath.Join(t.TempDir(), name)
	if err := syscall.Mkfifo(p, 0o600); err != nil {
		t.Skipf("mkfifo: %v", err)
	}
	return p
}

// A FIFO, a directory or a device given as a job is bad input naming the
// file, refused at once: a FIFO once blocked its reader forever.
func TestLoadJobRefusesSpecialFiles(t *testing.T) {
	fifo := mkfifo(t, "job.yaml")
	for _, c := range []struct{ path, kind string }{
		{fifo, "named pipe"},
		{t.TempDir(), "directory"},
		{os.DevNull, "device"},
	} {
		t.Run(c.kind, func(t *testing.T) {
			err := within(t, fifo, func() error { _, err := LoadJob(c.path); return err })
			var ie *InputError
			if !errors.As(err, &ie) || ie.File != c.path || !strings.Contains(ie.Msg, c.kind) || !strings.Contains(ie.Msg, "not a regular file") {
				t.Errorf("LoadJob(%s): %v, want an *InputError naming the file, saying it is a %s", c.path, err, c.kind)
			}
		})
	}
}
