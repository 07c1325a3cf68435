//go:build unix

package dxfimport

import "syscall"

// cpuSeconds is the process's user+system CPU time. On a shared machine
// wall-clock MB/s drops with the load; MB per CPU-second (all threads,
// the garbage collector's included) does not.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	tv := func(t syscall.Timeval) float64 { return float64(t.Sec) + float64(t.Usec)/1e6 }
	return tv(ru.Utime) + tv(ru.Stime)
}
