package main

import (
	"runtime/debug"
	"testing"
)

// TestScaleMemoryLimit: the soft limit grows with the drawing (30 bytes of
// heap per byte of drawing, past about 50 MB 1 GiB + 8 per byte, measured:
// README, Performance), never below
// 900 MiB, never above 60 % of the machine's memory, and not at all when
// the user set GOMEMLIMIT (common practice, no source: the numbers are
// ours).
func TestScaleMemoryLimit(t *testing.T) {
	old := debug.SetMemoryLimit(-1)
	defer debug.SetMemoryLimit(old)
	defer func(v bool) { limitTuned = v }(limitTuned)
	limitTuned = true
	scaleMemoryLimit(1<<20, 0)
	if got := debug.SetMemoryLimit(-1); got != memoryLimit {
		t.Errorf("1 MiB drawing: limit %d, want %d", got, memoryLimit)
	}
	scaleMemoryLimit(100<<20, 0)
	want := int64(1<<30 + 8*100<<20) // less than 30 x 100 MiB
	if total := machineMemory(); total > 0 && float64(want) > 0.6*float64(total) {
		want = max(int64(memoryLimit), int64(0.6*float64(total)))
	}
	if got := debug.SetMemoryLimit(-1); got != want {
		t.Errorf("100 MiB drawing: limit %d, want %d", got, want)
	}
	scaleMemoryLimit(45<<20, 0)
	want = int64(30 * 45 << 20) // less than 1 GiB + 8 x 45 MiB
	if total := machineMemory(); total > 0 && float64(want) > 0.6*float64(total) {
		want = max(int64(memoryLimit), int64(0.6*float64(total)))
	}
	if got := debug.SetMemoryLimit(-1); got != want {
		t.Errorf("45 MiB drawing: limit %d, want %d", got, want)
	}
	// a load path of 20,000 items adds 8 KiB each
	scaleMemoryLimit(40<<20, 20_000)
	want = int64(30*40<<20) + 20_000*8<<10
	if total := machineMemory(); total > 0 && float64(want) > 0.6*float64(total) {
		want = max(int64(memoryLimit), int64(0.6*float64(total)))
	}
	if got := debug.SetMemoryLimit(-1); got != want {
		t.Errorf("40 MiB drawing, 20,000 load-path items: limit %d, want %d", got, want)
	}
	limitTuned = false
	debug.SetMemoryLimit(123 << 20)
	scaleMemoryLimit(100<<20, 0)
	if got := debug.SetMemoryLimit(-1); got != 123<<20 {
		t.Errorf("GOMEMLIMIT set: limit changed to %d", got)
	}
}

// TestWritersGC: the writers' percentage is set only when framecheck chose
// the collector's settings, and put back afterwards (common practice, no
// source: the numbers are ours).
func TestWritersGC(t *testing.T) {
	defer func(v bool) { gcTuned = v }(gcTuned)
	old := debug.SetGCPercent(gcPercent)
	defer debug.SetGCPercent(old)
	gcTuned = true
	restore := writersGC()
	if got := debug.SetGCPercent(writersGCPercent); got != writersGCPercent {
		t.Errorf("during the writers: GOGC %d, want %d", got, writersGCPercent)
	}
	restore()
	if got := debug.SetGCPercent(gcPercent); got != gcPercent {
		t.Errorf("after the writers: GOGC %d, want %d", got, gcPercent)
	}
	gcTuned = false
	debug.SetGCPercent(123)
	writersGC()()
	if got := debug.SetGCPercent(gcPercent); got != 123 {
		t.Errorf("GOGC set by the user: changed to %d", got)
	}
}

// TestPathGC: with a load path the collector is off until the returned
// function puts the percentage back, even after the writers' own
// percentage came and went; without one, or with GOGC set by the user,
// nothing changes (common practice, no source: the numbers are ours).
func TestPathGC(t *testing.T) {
	defer func(v bool) { gcTuned = v }(gcTuned)
	old := debug.SetGCPercent(gcPercent)
	defer debug.SetGCPercent(old)
	gcTuned = true
	resume := pathGC(true)
	if got := debug.SetGCPercent(-1); got != -1 {
		t.Errorf("load path: GOGC %d, want off", got)
	}
	writersGC()()
	resume()
	if got := debug.SetGCPercent(gcPercent); got != gcPercent {
		t.Errorf("after: GOGC %d, want %d", got, gcPercent)
	}
	pathGC(false)()
	if got := debug.SetGCPercent(gcPercent); got != gcPercent {
		t.Errorf("no load path: GOGC %d, want %d", got, gcPercent)
	}
	gcTuned = false
	debug.SetGCPercent(123)
	pathGC(true)()
	if got := debug.SetGCPercent(gcPercent); got != 123 {
		t.Errorf("GOGC set by the user: changed to %d", got)
	}
}
