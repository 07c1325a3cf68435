//go:build unix

package check

import "syscall"

// cpuNs returns the process's user+system CPU time in ns. The benchmarks
// report it per operation beside ns/op because on a shared machine the
// wall-clock ns/op also counts the time other processes held the core.
func cpuNs() int64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return ru.Utime.Nano() + ru.Stime.Nano()
}
