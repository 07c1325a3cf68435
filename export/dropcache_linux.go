//go:build linux && (amd64 || arm64 || riscv64 || loong64 || ppc64le)

package export

import (
	"os"
	"syscall"
)

// fadvDontNeed is POSIX_FADV_DONTNEED on Linux.
const fadvDontNeed = 4

// dropCached asks the kernel to let go of the page cache holding f's n
// bytes from off (posix_fadvise POSIX_FADV_DONTNEED; on these 64-bit
// platforms fadvise64 takes the offset and length whole). Pages still
// dirty are kept, so it is only advice: a failure changes nothing
// written and is ignored.
func dropCached(f *os.File, off, n int64) {
	rc, err := f.SyscallConn()
	if err != nil {
		return
	}
	_ = rc.Control(func(fd uintptr) {
		_, _, _ = syscall.Syscall6(syscall.SYS_FADVISE64, fd, uintptr(off), uintptr(n), fadvDontNeed, 0, 0)
	})
}
