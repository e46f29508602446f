//go:build !unix

package fileset

// openNonBlock: the system has no O_NONBLOCK; the check before opening
// stands alone.
const openNonBlock = 0
