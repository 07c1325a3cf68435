//go:build !unix

package check

// cpuNs is 0 where the process's CPU time is not read (the benchmarks
// then report no CPU figure).
func cpuNs() int64 { return 0 }
