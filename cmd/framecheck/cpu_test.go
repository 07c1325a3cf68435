package main

import "framecheck/internal/cputime"

// cpuSeconds is the process's user+system CPU time, all threads.
func cpuSeconds() float64 { return cputime.Seconds() }
