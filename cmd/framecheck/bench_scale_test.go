package main

// Benchmarks of issue 18: grouping per joist from 10,000 to 1,000,000
// joists, and 50 plans of 2,000 joists checked in one process against 50
// processes. They run only with -bench; README "Performance" has the
// figures.

import (
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"testing"
)

// groupSizes are the plans BenchmarkGroupPerJoist groups; the largest
// needs about 3 GB and a minute to write and read.
var groupSizes = []int{10_000, 100_000, 300_000, 1_000_000}

// BenchmarkGroupPerJoist groups bigplan drawings of 10k to 1M joists
// (framing.Group, the drawing read beforehand) and reports the time per
// joist: flat when grouping is linear in the plan.
func BenchmarkGroupPerJoist(b *testing.B) {
	for _, n := range groupSizes {
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			d, opt := readForGrouping(b, writeBigPlan(b, b.TempDir(), n, false))
			runtime.GC()
			groupLoop(b, d, opt, n)
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(n), "ns/joist")
		})
	}
}

// fiftyPlans is how many plans of fiftyPlanJoists the batch benchmarks
// check.
const (
	fiftyPlans      = 50
	fiftyPlanJoists = 2_000
)

// BenchmarkFiftyPlansInProcess checks 50 plans of 2,000 joists one after
// another in this process (the command's run, all four outputs each).
func BenchmarkFiftyPlansInProcess(b *testing.B) {
	dir := b.TempDir()
	p := writeBigPlan(b, dir, fiftyPlanJoists, false)
	b.ResetTimer()
	i := 0
	for b.Loop() {
		for k := 0; k < fiftyPlans; k++ {
			i++
			out := filepath.Join(dir, fmt.Sprintf("out%d", i))
			if code := run([]string{"check", p.dxf, "-p", p.toml, "-o", out}, io.Discard, io.Discard); code == exitUsage {
				b.Fatalf("check exit %d", code)
			}
		}
	}
	b.ReportMetric(float64(b.Elapsed().Milliseconds())/float64(b.N)/fiftyPlans, "ms/plan")
}

// BenchmarkFiftyPlansProcesses checks the same 50 plans as 50 runs of the
// framecheck binary (built once, outside the timing), one after another.
func BenchmarkFiftyPlansProcesses(b *testing.B) {
	dir := b.TempDir()
	p := writeBigPlan(b, dir, fiftyPlanJoists, false)
	bin := filepath.Join(dir, "framecheck")
	if out, err := exec.Command("go", "build", "-o", bin, ".").CombinedOutput(); err != nil {
		b.Fatalf("go build: %v\n%s", err, out)
	}
	b.ResetTimer()
	i := 0
	for b.Loop() {
		for k := 0; k < fiftyPlans; k++ {
			i++
			cmd := exec.Command(bin, "check", p.dxf, "-p", p.toml, "-o", filepath.Join(dir, fmt.Sprintf("out%d", i)))
			cmd.Stdout, cmd.Stderr = io.Discard, io.Discard
			cmd.Env = os.Environ()
			if err := cmd.Run(); err != nil {
				if ee, ok := err.(*exec.ExitError); !ok || ee.ExitCode() == exitUsage {
					b.Fatalf("framecheck: %v", err)
				}
			}
		}
	}
	b.ReportMetric(float64(b.Elapsed().Milliseconds())/float64(b.N)/fiftyPlans, "ms/plan")
}
