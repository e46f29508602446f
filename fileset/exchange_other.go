//go:build !linux

package fileset

import "errors"

// exchange is not available here: swapIn moves the old set aside first.
func exchange(string, string) error { return errors.New("no atomic exchange on this system") }
