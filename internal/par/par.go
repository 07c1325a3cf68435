// Package par runs loops over the machine's cores.
package par

import (
	"runtime"
	"sync"
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
