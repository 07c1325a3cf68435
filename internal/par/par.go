// Package par runs loops over the machine's cores.
package par

import (
	"runtime"
	"sync"
	"sync/atomic"
)

// MinPerWorker is the fewest items a worker of Ranges takes: below it a
// goroutine costs more than it saves.
const MinPerWorker = 2048

// Ranges calls fn over [0, n) cut into one contiguous range per core
// (runtime.GOMAXPROCS), at once, and returns when all are done. fn must
// write only to the indexes of its own range, and whatever it reads must
// not change meanwhile. Small n runs in the caller's goroutine.
func Ranges(n int, fn func(lo, hi int)) {
	workers := min(runtime.GOMAXPROCS(0), n/MinPerWorker)
	if workers <= 1 {
		fn(0, n)
		return
	}
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		lo, hi := n*w/workers, n*(w+1)/workers
		wg.Add(1)
		go func() {
			defer wg.Done()
			fn(lo, hi)
		}()
	}
	wg.Wait()
}

// Each calls fn(i) for every i in [0, n) on every core, handing the
// indexes out one at a time, for items that differ in cost (analyses:
// a beam sized from candidates is checked once per size tried), and
// returns when all are done. fn must write only what belongs to index i.
func Each(n int, fn func(i int)) {
	workers := min(runtime.GOMAXPROCS(0), n)
	if workers <= 1 {
		for i := 0; i < n; i++ {
			fn(i)
		}
		return
	}
	var next atomic.Int64
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := int(next.Add(1)) - 1; i < n; i = int(next.Add(1)) - 1 {
				fn(i)
			}
		}()
	}
	wg.Wait()
}
