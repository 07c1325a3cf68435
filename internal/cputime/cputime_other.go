//go:build !unix

// Package cputime reads the process's CPU time, for the benchmarks: on a
// shared machine wall-clock time also counts the time other processes
// held the cores, CPU time does not.
package cputime

// Seconds is 0 where the process's CPU time is not read (the benchmarks
// then report no CPU figure).
func Seconds() float64 { return 0 }
