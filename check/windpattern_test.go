package check

import (
	"strings"
	"testing"
)

// Wind is a live-type load (DOMAIN.md "Loads and combinations") and is
// patterned span by span on continuous members like L, Lr and S.
//
// Two equal 120 in spans, trib 12 in, D 1 psf, W up 60 psf, nothing else.
// Line loads: wD = 1/12 = 0.0833 lb/in, wW = 60/12 = 5 lb/in.
// Case 0.6D + 0.6W(up) with the wind on span 1 only:
//
//	w1 = 0.6(0.0833) - 0.6(5) = -2.95 lb/in, w2 = 0.6(0.0833) = 0.05 lb/in
//	support moment (three-moment equation, equal spans, each span loaded
//	alone gives -w L^2/16): Ms = -(w1 + w2) L^2 / 16 = 2.9(14400)/16 = 2610
//	R1 = w1 L/2 + Ms/L = -177 + 21.75 = -155.25 lb
//	largest span moment R1^2 / (2 w1) = 155.25^2 / (-5.9) = -4085.2 lb-in
//
// With the wind on both spans instead: R1 = -177 + 44.25 = -132.75 lb and
// M = -2986.9 lb-in, so patterning governs by 37%. (AISC Steel Construction
// Manual beam diagrams, continuous beam - two equal spans - uniform load on
// one span: support moment wl^2/16, checked against stored tables in
// docs/VERIFIED.md; the rest is statics written out above.)
func TestWindPatterned_TwoSpanUplift(t *testing.T) {
	m := Member{ID: "W1", Size: "2x8", Species: "DF-L", Grade: "No.2", LengthIn: 240,
		Bearings:  []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 120, LengthIn: 3.5}, {AtIn: 240, LengthIn: 3.5}},
		SpacingIn: 12, TribIn: 12, Use: "roof",
		Loads:      AreaLoads{DeadPsf: 1, WindUpPsf: 60},
		Repetitive: true}
	s := DefaultSettings()
	r := CheckMember(m, s)
	if r.Status == StatusError {
		t.Fatalf("error: %v", r.Messages)
	}
	bb := find(t, r, KindBendingBottom)
	if !strings.HasPrefix(bb.Combo, "0.6D+0.6W(up)") {
		t.Errorf("bottom edge governed by %q, want 0.6D+0.6W(up) with wind on one span", bb.Combo)
	}
	expectNear(t, "M bottom edge", traceValue(t, bb, "M"), 4085.2, 0, 0.001,
		"two-span statics with wind on one span (hand calculation in the comment)")
	s.PatternLive = false
	r = CheckWithRows(m, s, r.RowsPerSpan())
	bb = find(t, r, KindBendingBottom)
	expectNear(t, "M bottom edge, no patterns", traceValue(t, bb, "M"), 2986.9, 0, 0.001,
		"two-span statics with wind on both spans (hand calculation in the comment)")
}
