package check

import "framecheck/internal/cputime"

// cpuNs returns the process's user+system CPU time in ns. The benchmarks
// report it per operation beside ns/op because on a shared machine the
// wall-clock ns/op also counts the time other processes held the core.
func cpuNs() int64 { return int64(cputime.Seconds() * 1e9) }
