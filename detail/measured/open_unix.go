//go:build unix

package measured

import "syscall"

// openNonBlock opens a named pipe without waiting for a writer; on a
// regular file it changes nothing.
const openNonBlock = syscall.O_NONBLOCK
