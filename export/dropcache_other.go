//go:build !(linux && (amd64 || arm64 || riscv64 || loong64 || ppc64le))

package export

import "os"

// dropCached does nothing here: the outputs stay in the page cache as
// the system sees fit (dropcache_linux.go says why it is let go of on
// Linux).
func dropCached(f *os.File, off, n int64) {}
