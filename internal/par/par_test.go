package par

import (
	"runtime"
	"sync/atomic"
	"testing"
)

// TestRangesCoverOnce: every index in [0, n) is visited exactly once, the
// ranges are contiguous, for sizes around the one-worker limit and on one
// and on several cores (common practice, no source).
func TestRangesCoverOnce(t *testing.T) {
	for _, procs := range []int{1, 2, 3, 8} {
		old := runtime.GOMAXPROCS(procs)
		for _, n := range []int{0, 1, MinPerWorker - 1, MinPerWorker, 2*MinPerWorker + 1, 100_003} {
			seen := make([]int32, n)
			Ranges(n, func(lo, hi int) {
				if lo > hi || lo < 0 || hi > n {
					t.Errorf("procs %d n %d: range [%d, %d)", procs, n, lo, hi)
					return
				}
				for i := lo; i < hi; i++ {
					seen[i]++
				}
			})
			for i, c := range seen {
				if c != 1 {
					t.Fatalf("procs %d n %d: index %d visited %d times", procs, n, i, c)
				}
			}
		}
		runtime.GOMAXPROCS(old)
	}
}

// TestEachCoversOnce: Each calls fn once for every index in [0, n), on one
// and on several cores (common practice, no source).
func TestEachCoversOnce(t *testing.T) {
	for _, procs := range []int{1, 2, 3, 8} {
		old := runtime.GOMAXPROCS(procs)
		for _, n := range []int{0, 1, 2, 7, 1000} {
			seen := make([]atomic.Int32, n)
			Each(n, func(i int) {
				if i < 0 || i >= n {
					t.Errorf("procs %d n %d: index %d", procs, n, i)
					return
				}
				seen[i].Add(1)
			})
			for i := range seen {
				if c := seen[i].Load(); c != 1 {
					t.Fatalf("procs %d n %d: index %d called %d times", procs, n, i, c)
				}
			}
		}
		runtime.GOMAXPROCS(old)
	}
}
