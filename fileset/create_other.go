//go:build !unix

package fileset

import "os"

// createFile writes a new file at path.
func createFile(path string, data []byte) error { return os.WriteFile(path, data, 0o644) }
