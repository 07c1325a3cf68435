//go:build unix

// Package cputime reads the process's CPU time, for the benchmarks: on a
// shared machine wall-clock time also counts the time other processes
// held the cores, CPU time does not.
package cputime

import "syscall"

// Seconds is the process's user+system CPU time, all threads (the garbage
// collector's included).
func Seconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	tv := func(t syscall.Timeval) float64 { return float64(t.Sec) + float64(t.Usec)/1e6 }
	return tv(ru.Utime) + tv(ru.Stime)
}
