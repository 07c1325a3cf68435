package framing

import (
	"runtime"
	"sync"

	"framecheck/dxfimport"
)

// Several steps of Group do the same independent work for every member
// (or every label text): find its supports, its neighbours, its zones.
// Those parts run on a few goroutines, each over one contiguous range of
// the members, and everything order-dependent stays sequential: each
// range's issues are kept apart and appended range after range, which is
// member order, and shared state (maps, union-find sets, numbering) is
// updated after the parallel part, in member order. The result is the
// same, bit for bit, whatever the number of goroutines
// (TestGroupWorkersSame compares whole plans).

// defaultMinChunk is the fewest items a goroutine is given: below it the
// goroutine costs more than it saves.
const defaultMinChunk = 2048

// span is a contiguous range [lo, hi) of items given to one goroutine.
type span struct{ lo, hi int }

// split cuts [0, n) into at most g.workers contiguous spans of about
// equal size, each of at least g.minChunk items (one span when n is
// small), in order.
func (g *grouper) split(n int) []span { return g.splitMin(n, g.minChunk) }

// splitHeavy is split for items that each take a grid query or more
// (label texts): goroutines are given fewer of them.
func (g *grouper) splitHeavy(n int) []span { return g.splitMin(n, g.minChunk/16) }

func (g *grouper) splitMin(n, minChunk int) []span {
	w := max(1, min(g.workers, n/max(minChunk, 1)))
	out := make([]span, w)
	for i := range out {
		out[i] = span{i * n / w, (i + 1) * n / w}
	}
	return out
}

// parallel runs fn(i, spans[i]) for every span, each on its own
// goroutine (the last on the caller's), and returns when all are done.
// A panic in fn is raised again in the caller, as if fn had run there.
func parallel(spans []span, fn func(i int, s span)) {
	if len(spans) == 1 {
		fn(0, spans[0])
		return
	}
	var wg sync.WaitGroup
	panics := make([]any, len(spans))
	run := func(i int) {
		defer func() {
			if p := recover(); p != nil {
				panics[i] = p
			}
		}()
		fn(i, spans[i])
	}
	for i := range spans[:len(spans)-1] {
		wg.Add(1)
		go func() {
			defer wg.Done()
			run(i)
		}()
	}
	run(len(spans) - 1)
	wg.Wait()
	for _, p := range panics {
		if p != nil {
			panic(p)
		}
	}
}

// defaultWorkers is the number of goroutines Group's parallel parts use.
func defaultWorkers() int { return runtime.GOMAXPROCS(0) }

// issueLists gathers the issues of each span of a parallel part apart.
type issueLists []dxfimport.IssueList

// appendTo appends the spans' issues to l, span after span.
func (ls issueLists) appendTo(l *dxfimport.IssueList) {
	for _, x := range ls {
		*l = append(*l, x...)
	}
}

// slab hands out short slices carved from larger blocks, so that a
// hundred thousand members' bearings or zones are a few allocations
// rather than one each. Each slice handed out is capped at its own
// length: appending to it copies, never writing into a neighbour's.
type slab[T any] struct{ buf []T }

const slabBlock = 4096

// take returns a copy of src in the slab (nil for an empty src).
func (s *slab[T]) take(src []T) []T {
	if len(src) == 0 {
		return nil
	}
	if cap(s.buf)-len(s.buf) < len(src) {
		s.buf = make([]T, 0, max(slabBlock, len(src)))
	}
	n := len(s.buf)
	s.buf = append(s.buf, src...)
	return s.buf[n:len(s.buf):len(s.buf)]
}
