package dxfimport

import "framecheck/internal/cputime"

// cpuSeconds is the process's user+system CPU time. On a shared machine
// wall-clock MB/s drops with the load; MB per CPU-second (all threads,
// the garbage collector's included) does not.
func cpuSeconds() float64 { return cputime.Seconds() }
