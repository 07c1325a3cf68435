package main

import (
	"bufio"
	"os"
	"runtime"
	"runtime/debug"
	"runtime/metrics"
	"strconv"
	"strings"

	"framecheck/framing"
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

// memoryPerPlanByte is the soft limit per byte of drawing, and memoryShare
// the most of the machine's memory the limit may reach. A fixed 900 MiB
// made the collector run almost constantly past about 150,000 joists
// (issue 18). Measured on a 300,000-joist bigplan drawing (53 MB) on this
// project's 2-vCPU machine, load average about 4: the fixed limit took
// 17-17.4 s of user CPU and 1.2 GB; 40 bytes per byte 7.8-8.0 s and
// 2.0 GB; 30 bytes per byte 8.7-9.3 s and 1.57 GB, which is kept.
//
// Past about 50 MB of drawing (250,000 joists) the limit grows by
// memoryLargeBase and memoryPerPlanByteLarge instead, whichever is less:
// the live heap there is about 11 bytes per byte of drawing at its peak
// (1,000,000 joists: 2.15 GiB, with the members' results and grouped
// members dropped as they are mapped and the drawing's bytes once read),
// and the 5.8 GB that 30 bytes per byte allowed a 194 MB drawing only
// left garbage for the system to page in. Measured on the 1,000,000-joist
// bigplan on this project's 2-vCPU machine (load about 1.3): with 30
// bytes per byte, 18.1-21.3 s and 3.69-4.00 GB peak; with the limit at
// 2.5 GiB, 16.5-18.1 s and 2.57 GB. At 300,000 joists (57.6 MB) the
// limit is 1.54 GB against 1.73.
const (
	memoryPerPlanByte      = 30
	memoryLargeBase        = 1 << 30
	memoryPerPlanByteLarge = 8
	memoryShare            = 0.6
)

// memoryPerPathItem is the soft limit added per beam, post and joint of
// the load path: their checks, reactions and the rows the outputs write
// of each (Beams, Posts, Connections, results.json). Measured on the
// 100,000-joist bigplan with -beams (4,338 beams, 16,475 posts, about
// 116,000 joints) on this project's 2-vCPU machine: the fixed limit kept
// the collector running, 9.8-10.1 s of user CPU and 1.2 GB; a limit 900
// MiB higher (8 KiB per item), 6.2 s and 1.6 GB.
const memoryPerPathItem = 8 << 10

// scaleMemoryLimit raises the soft memory limit for a drawing of planBytes
// whose load path has pathItems beams, posts and joints, when tuneGC set
// it: to memoryPerPlanByte x planBytes (or memoryLargeBase +
// memoryPerPlanByteLarge x planBytes when less) + memoryPerPathItem x pathItems,
// at least memoryLimit and at most memoryShare of the machine's memory
// (when /proc/meminfo tells it).
func scaleMemoryLimit(planBytes int64, pathItems int) {
	if !limitTuned {
		return
	}
	perPlan := min(memoryPerPlanByte*planBytes, memoryLargeBase+memoryPerPlanByteLarge*planBytes)
	want := max(int64(memoryLimit), perPlan+memoryPerPathItem*int64(pathItems))
	if total := machineMemory(); total > 0 {
		want = min(want, max(int64(memoryLimit), int64(memoryShare*float64(total))))
	}
	debug.SetMemoryLimit(want)
}

// pathItems is about how many beams, posts and joints the plan's load
// path has (its beams that are not rigid bearings, their bearings and the
// joists they carry, its posts), counted on the plan before the path is
// followed.
func pathItems(plan *framing.Plan) int {
	n := len(plan.Posts)
	for i := range plan.Beams {
		if b := &plan.Beams[i]; !b.Rigid {
			n += 1 + len(b.Bearings) + len(b.Carried)
		}
	}
	return n
}

// machineMemory returns MemTotal from /proc/meminfo in bytes, or 0.
func machineMemory() int64 {
	f, err := os.Open("/proc/meminfo")
	if err != nil {
		return 0
	}
	defer f.Close()
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		if rest, ok := strings.CutPrefix(sc.Text(), "MemTotal:"); ok {
			kb, err := strconv.ParseInt(strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(rest), "kB")), 10, 64)
			if err == nil {
				return kb << 10
			}
		}
	}
	return 0
}

// limitTuned is set when tuneGC set the soft memory limit (GOMEMLIMIT was
// not set), so that scaleMemoryLimit may raise it.
var limitTuned bool

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
		limitTuned = true
	}
}

// writersGCPercent is the collector's percentage while the outputs are
// written: the writers build their files from results the run keeps and
// drop what they make as they go, so a tighter target than gcPercent
// costs little. Measured on the 100,000-joist bigplan on this project's
// 2-vCPU machine (load about 1, three alternated runs each): with
// gcPercent throughout, 1.68-1.74 s wall and 643-647 MB peak RSS; with a
// collection before the writers and 100 % during them, 1.74-1.80 s and
// 518-547 MB (issue 18: memory that follows the plan).
const writersGCPercent = 100

// writersGC collects what the checks left behind once the results are
// mapped for export and sets writersGCPercent for the writers, when tuneGC
// chose the collector's percentage (not when the user set GOGC); the
// returned function puts the percentage back (a process that checks
// several plans, the benchmarks). With the collector paused for the load
// path (pathGC) the collection is made all the same, and the percentage
// put back is the pause's, which pathGC's own function then lifts.
func writersGC() (restore func()) {
	if !gcTuned {
		return func() {}
	}
	runtime.GC()
	old := debug.SetGCPercent(writersGCPercent)
	return func() { debug.SetGCPercent(old) }
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

// pathGC turns the collector off (pauseGC) when the plan has a load path,
// from the members checked until the returned function is called (after
// the writers; writersGC collects before them): following the load path
// and mapping the members for the outputs (the two at once) build what
// the writers read, and a collection during them, or one before them of
// what checking the members left, cost more than it saved. The drawing's
// entities go before the collection that ends the grouping
// (runPipeline), so that the pause starts from the plan as grouped and
// checked. The soft memory limit, raised for the load path
// (scaleMemoryLimit), still holds. Measured on the 100,000-joist bigplan
// with -beams on this project's 2-vCPU machine (eight alternated runs,
// load about 1): with a collection before the load path, 1.93-2.03 s
// wall, 3.32 s CPU, 556 MiB peak; paused, 1.91-2.02 s, 3.25 s, 598 MiB;
// five collections in the run against four. Earlier, without the
// collection before the path, the collector ran during it and the run
// took 2.05-2.14 s. A great deal left by the checks (a million joists) is
// still collected before the pause (mappingGC), as for a plan without a
// load path. Does nothing when the user set GOGC.
func pathGC(hasPath bool) (resume func()) {
	if !hasPath {
		return func() {}
	}
	return pauseGC()
}

// mappingBytesPerMember is about what mapping one checked member for the
// outputs allocates (its export record, location and source texts, uplift
// lines): measured at 100,000 joists, 0.85 KB a member, rounded up.
const mappingBytesPerMember = 1200

// mappingGCMin is the least garbage, and the least the mapping must be
// about to allocate, for mappingGC to collect.
const mappingGCMin = 1 << 30

// mappingGC collects before the checked members are mapped for the
// outputs when the checks left at least mappingGCMin of garbage and the
// mapping is about to allocate at least half as much: it then reuses the
// freed memory instead of taking fresh pages from the system, which on
// this project's machine kind costs more than the collection. Measured
// on the bigplan drawings (2-vCPU VM): at 1,000,000 joists (1.5 GB of
// garbage, 1.2 GB to map) peak 4.08 GiB and 19.6-22.7 s (system time
// 8.4-13.2 s) without, 3.37-3.39 GiB and 17.3-22.0 s (5.3-10.5 s) with;
// at 300,000 joists (0.45 GB of garbage) a collection there cost 0.2 s
// for 210 MB, and at 100,000 none is made. Does nothing when the user set
// GOGC.
func mappingGC(members int) {
	if !gcTuned {
		return
	}
	sample := []metrics.Sample{{Name: "/memory/classes/heap/objects:bytes"}, {Name: "/gc/heap/live:bytes"}}
	metrics.Read(sample)
	if sample[0].Value.Kind() != metrics.KindUint64 || sample[1].Value.Kind() != metrics.KindUint64 {
		return
	}
	objects, live := sample[0].Value.Uint64(), sample[1].Value.Uint64()
	if objects > live && objects-live >= mappingGCMin && uint64(members)*mappingBytesPerMember >= mappingGCMin/2 {
		runtime.GC()
	}
}
