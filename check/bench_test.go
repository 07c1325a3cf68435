package check

import "testing"

// BenchmarkCheckMember is one complete member check with the blocking
// solver: a roof joist under net uplift whose bottom edge needs three rows
// (each iteration runs the analysis, every check and the solver's four
// bottom-edge evaluations, and builds every trace).
func BenchmarkCheckMember(b *testing.B) {
	m := upliftRafter("2x10")
	s := DefaultSettings()
	b.ReportAllocs()
	for b.Loop() {
		if r := CheckMember(m, s); r.Status != StatusPass {
			b.Fatal(r.Messages)
		}
	}
}

// BenchmarkCheckMemberFloor is a simple-span floor joist (no rows needed).
func BenchmarkCheckMemberFloor(b *testing.B) {
	m := floorJoist("2x10", 168, 16)
	m.TotalLimit = 240
	s := DefaultSettings()
	b.ReportAllocs()
	for b.Loop() {
		CheckMember(m, s)
	}
}

// BenchmarkCheckMemberContinuous is a three-span floor joist with a
// cantilever, pattern-loaded (15 live-load patterns).
func BenchmarkCheckMemberContinuous(b *testing.B) {
	m := floorJoist("2x10", 3*144+24, 16)
	m.Bearings = []Bearing{{0, 1.5}, {144, 3.5}, {288, 3.5}, {432, 1.5}}
	m.OverhangEndIn = 24
	s := DefaultSettings()
	b.ReportAllocs()
	for b.Loop() {
		CheckMember(m, s)
	}
}
