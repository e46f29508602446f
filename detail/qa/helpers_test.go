package qa

import (
	"gaugeline/detail"
	"gaugeline/detail/detailing"
	"gaugeline/engine"
	"gaugeline/rules/units"
	"os"
	"path/filepath"
	"syscall"
	"testing"
	"time"
)

// within runs load and fails the test when it blocks on the FIFO.
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

// findingOf is the finding id of the report.
func findingOf(r *detail.Report, id string) (detailing.Finding, bool) {
	for _, f := range r.Findings {
		if f.ID == id {
			return f, true
		}
	}
	return detailing.Finding{}, false
}

// lastX is the largest x of the holes.
func lastX(hs []engine.Hole) units.Length {
	var x units.Length
	for _, h := range hs {
		x = max(x, h.X)
	}
	return x
}
