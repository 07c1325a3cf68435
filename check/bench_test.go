package check

import (
	"testing"
)

func benchCheck(b *testing.B, m Member, s Settings, want string) {
	b.ReportAllocs()
	c0 := cpuNs()
	n := 0
	for b.Loop() {
		if r := CheckMember(m, s); want != "" && r.Status != want {
			b.Fatal(r.Status, r.Messages)
		}
		n++
	}
	if c := cpuNs() - c0; c > 0 && n > 0 {
		b.ReportMetric(float64(c)/float64(n), "cpu-ns/op")
		b.ReportMetric(1e9*float64(n)/float64(c), "checks/cpu-s")
	}
}

// BenchmarkCheckMember is one complete member check with the blocking
// solver: a roof joist under net uplift whose bottom edge needs three rows
// (each iteration runs the analysis, every check and the solver's four
// bottom-edge evaluations, and records each check's governing numbers, from
// which CheckResult.Trace writes the trace when asked).
func BenchmarkCheckMember(b *testing.B) {
	benchCheck(b, upliftRafter("2x10"), DefaultSettings(), StatusPass)
}

// BenchmarkCheckMemberTraced is BenchmarkCheckMember plus writing every
// trace out as text, as a writer does once per distinct result.
func BenchmarkCheckMemberTraced(b *testing.B) {
	m, s := upliftRafter("2x10"), DefaultSettings()
	b.ReportAllocs()
	c0 := cpuNs()
	n, chars := 0, 0
	var buf []byte
	for b.Loop() {
		r := CheckMember(m, s)
		for _, c := range r.Checks {
			for _, it := range c.Trace() {
				buf = it.Subst.Append(buf[:0])
				chars += len(it.Symbol) + len(it.Formula) + len(it.Ref) + len(buf)
			}
		}
		n++
	}
	if chars == 0 {
		b.Fatal("no trace text")
	}
	if c := cpuNs() - c0; c > 0 && n > 0 {
		b.ReportMetric(1e9*float64(n)/float64(c), "checks/cpu-s")
	}
}

// BenchmarkCheckMemberFloor is a simple-span floor joist (no rows needed).
func BenchmarkCheckMemberFloor(b *testing.B) {
	m := floorJoist("2x10", 168, 16)
	m.TotalLimit = 240
	benchCheck(b, m, DefaultSettings(), StatusPass)
}

// BenchmarkCheckMemberContinuous is a three-span floor joist with a
// cantilever, pattern-loaded (15 live-load patterns), whose bottom edge
// over the interior bearings takes the blocking solver several steps.
func BenchmarkCheckMemberContinuous(b *testing.B) {
	m := floorJoist("2x10", 3*144+24, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 144, LengthIn: 3.5}, {AtIn: 288, LengthIn: 3.5}, {AtIn: 432, LengthIn: 1.5}}
	m.OverhangEndIn = 24
	benchCheck(b, m, DefaultSettings(), "")
}
