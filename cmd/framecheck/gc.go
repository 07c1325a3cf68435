package main

import (
	"os"
	"runtime/debug"
)

// gcPercent and memoryLimit tune the garbage collector for a run that
// builds its whole plan in memory and writes it out once: collecting when
// the heap has grown by 300% rather than 100% saves about a third of the
// collector's work on a 100,000-joist plan, and the soft limit makes it
// collect harder before the process passes 900 MiB, inside the 1 GiB a
// run of that size may take. Measured with /usr/bin/time -v on the
// samples/bigplan plans (README, Performance).
const (
	gcPercent   = 300
	memoryLimit = 900 << 20
)

// gcTuned is set when tuneGC chose the collector's percentage (GOGC was
// not set), so that pauseGC may change it.
var gcTuned bool

// tuneGC applies gcPercent and memoryLimit unless the user set GOGC or
// GOMEMLIMIT, which then win.
func tuneGC() {
	if os.Getenv("GOGC") == "" {
		debug.SetGCPercent(gcPercent)
		gcTuned = true
	}
	if os.Getenv("GOMEMLIMIT") == "" {
		debug.SetMemoryLimit(memoryLimit)
	}
}

// pauseGC turns the collector off until the returned function is called,
// for a stretch of work that only builds what stays live (reading the
// drawing, grouping it into members): collecting during it finds little
// to free and, with write barriers on, slowed reading a 100,000-joist plan
// from 0.15 s to 0.3 s. The soft memory limit still holds, so the
// collector runs anyway if the heap nears it. Without tuneGC (tests, or
// GOGC set by the user) it does nothing.
func pauseGC() (resume func()) {
	if !gcTuned {
		return func() {}
	}
	old := debug.SetGCPercent(-1)
	return func() { debug.SetGCPercent(old) }
}
