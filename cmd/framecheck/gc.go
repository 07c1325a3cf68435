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

// tuneGC applies gcPercent and memoryLimit unless the user set GOGC or
// GOMEMLIMIT, which then win.
func tuneGC() {
	if os.Getenv("GOGC") == "" {
		debug.SetGCPercent(gcPercent)
	}
	if os.Getenv("GOMEMLIMIT") == "" {
		debug.SetMemoryLimit(memoryLimit)
	}
}
