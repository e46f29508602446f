//go:build unix

package fileset

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"time"
)

// OpenRegular refuses, without blocking, a FIFO, a directory and a
// device; it opens a regular file and a link to one.
func TestOpenRegular(t *testing.T) {
	dir := t.TempDir()
	fifo := filepath.Join(dir, "holes.csv")
	if err := syscall.Mkfifo(fifo, 0o600); err != nil {
		t.Skipf("mkfifo: %v", err)
	}
	for _, c := range []struct{ path, kind string }{
		{fifo, "a named pipe (FIFO)"},
		{dir, "a directory"},
		{os.DevNull, "a device"},
	} {
		done := make(chan error, 1)
		go func() {
			f, err := OpenRegular(c.path)
			if err == nil {
				f.Close()
			}
			done <- err
		}()
		var err error
		select {
		case err = <-done:
		case <-time.After(5 * time.Second):
			if w, werr := os.OpenFile(fifo, os.O_WRONLY, 0); werr == nil {
				w.Close()
			}
			t.Fatalf("OpenRegular(%s) blocked for 5 s", c.path)
		}
		var nr *NotRegularError
		if !errors.As(err, &nr) || nr.Path != c.path || nr.Kind() != c.kind || !strings.Contains(err.Error(), "not a regular file") {
			t.Errorf("OpenRegular(%s) = %v, want a *NotRegularError: %s", c.path, err, c.kind)
		}
	}
	file := filepath.Join(dir, "holes-ok.csv")
	if err := os.WriteFile(file, []byte("1,2,0.8\n"), 0o600); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "link.csv")
	if err := os.Symlink(file, link); err != nil {
		t.Fatal(err)
	}
	for _, p := range []string{file, link} {
		f, err := OpenRegular(p)
		if err != nil {
			t.Fatalf("OpenRegular(%s): %v", p, err)
		}
		data, err := io.ReadAll(f)
		f.Close()
		if err != nil || string(data) != "1,2,0.8\n" {
			t.Errorf("%s: %q, %v", p, data, err)
		}
	}
	if _, err := OpenRegular(filepath.Join(dir, "missing.csv")); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("missing file: %v", err)
	}
}

// ErrText names the failure without the path the message's line already
// gives: os.Open's *fs.PathError loses its path, a special file says what
// it is.
func TestErrText(t *testing.T) {
	dir := t.TempDir()
	_, err := os.Open(filepath.Join(dir, "missing.yaml"))
	if got := ErrText(err); got != "no such file or directory" {
		t.Errorf("missing file: %q", got)
	}
	_, err = OpenRegular(dir)
	if got := ErrText(err); got != "it is a directory, not a regular file" {
		t.Errorf("directory: %q", got)
	}
	if NotRegularHint(err) == "" || NotRegularHint(os.ErrNotExist) != "" {
		t.Errorf("the hint is for special files only")
	}
	if got := ErrText(errors.New("plain")); got != "plain" {
		t.Errorf("other error: %q", got)
	}
}
