//go:build unix

package fileset

import (
	"errors"
	"os"
	"syscall"
)

// lockFile takes an exclusive lock on path (created if missing), calling
// wait once if another process holds it, then blocking until it is free.
func lockFile(path string, wait func()) (unlock func(), err error) {
	f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE, 0o644)
	if err != nil {
		return nil, err
	}
	err = syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB)
	if errors.Is(err, syscall.EWOULDBLOCK) {
		wait()
		err = syscall.Flock(int(f.Fd()), syscall.LOCK_EX)
	}
	if err != nil {
		f.Close()
		return nil, err
	}
	return func() { f.Close() }, nil
}
