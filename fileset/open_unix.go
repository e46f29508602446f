//go:build unix

package fileset

import "syscall"

// openNonBlock opens a named pipe without waiting for a writer; on a
// regular file it changes nothing.
const openNonBlock = syscall.O_NONBLOCK
