package check

import (
	"strings"
	"testing"
)

// twoSpanFloor is a 2x8 DF-L No.2 floor joist continuous over two equal
// spans of 144 in, 16 in on centre, D 10 psf + L 40 psf, live load not
// patterned so that the hand calculation is closed-form. The loads are
// chosen for the test (common practice, no source).
func twoSpanFloor() (Member, Settings) {
	m := Member{ID: "C1", Size: "2x8", Species: "DF-L", Grade: "No.2", LengthIn: 288,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 3.5}, {AtIn: 288, LengthIn: 3.5}}, SpacingIn: 16, TribIn: 16, Use: "floor",
		Loads: AreaLoads{DeadPsf: 10, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240, Repetitive: true}
	s := DefaultSettings()
	s.PatternLive = false
	return m, s
}

// TestBraceAtInflection_TwoSpans checks the bottom edge over the interior
// support of twoSpanFloor under D + L with and without the inflection
// point counted as a brace.
//
// Hand calculation (two equal spans under uniform load; statics, written
// out):
//
//	w = (10 + 40)(16/144) = 5.556 lb/in; end reaction 3wL/8, so
//	M(x) = 3wLx/8 - wx^2/2 is zero at x = 3L/4 = 108 in: the inflection
//	points are 36 in either side of the interior support (108, 180 in)
//	M over the support = -wL^2/8 = -5.556(144)^2/8 = -14,400 lb-in
//	S = 13.14 in^3 (2x8, NDS 2018 Supplement Table 1B): fb = 1,095.9 psi
//	Fb* = 900(1.0)(1.2)(1.15) = 1,242 psi (Table 4A Fb, CF 2x8, Cr 4.3.9)
//
//	Inflection points counted: lu = 36 in, lu/d = 4.97 < 7:
//	  le = 2.06 lu = 74.16 in (NDS 2018 Table 3.3.3, general row)
//	  RB = sqrt(74.16(7.25)/1.5^2) = 15.46 (Eq. 3.3-5)
//	  FbE = 1.20(580,000)/238.96 = 2,912.6 psi; FbE/Fb* = 2.3451
//	  CL = 1.76058 - sqrt(1.76058^2 - 2.3451/0.95) = 0.9662 (Eq. 3.3-6)
//	  fb/Fb' = 1,095.9 / (1,242 x 0.9662) = 0.913
//	Not counted: lu = 144 in (bearing to bearing), lu/d = 19.9 > 14.3:
//	  le = 1.84 lu = 264.96 in; RB = 29.22; FbE = 815.2 psi;
//	  FbE/Fb* = 0.65637; CL = 0.87177 - sqrt(0.75999 - 0.69092) = 0.6090
//	  fb/Fb' = 1,095.9 / (1,242 x 0.6090) = 1.449
func TestBraceAtInflection_TwoSpans(t *testing.T) {
	m, s := twoSpanFloor()
	off := CheckWithRows(m, s, 0)
	expectNear(t, "bottom-edge ratio, inflection points not counted", find(t, off, KindBendingBottom).Ratio, 1.449, 0.002, 0, "hand calculation above")
	if !strings.Contains(bracingText(off), "inflection points not counted as braces (design.brace_at_inflection = false)") {
		t.Errorf("rule off: bracing %q does not say so", bracingText(off))
	}
	if r := CheckMember(m, s); r.RowsPerSpan() == 0 {
		t.Errorf("rule off: no rows added, ratio %.3f", find(t, r, KindBendingBottom).Ratio)
	}
	s.BraceAtInflection = true
	on := CheckMember(m, s)
	bot := find(t, on, KindBendingBottom)
	expectNear(t, "bottom-edge ratio, inflection points counted", bot.Ratio, 0.913, 0.002, 0, "hand calculation above")
	if on.RowsPerSpan() != 0 || on.Status != StatusPass {
		t.Errorf("rule on: rows %v, status %s; want no rows, pass", on.BlockingAtIn, on.Status)
	}
	for _, it := range bot.Trace() {
		if it.Symbol == "lu" {
			expectNear(t, "lu", it.Value, 36, 1e-6, 0, "3L/4 from the end support, statics")
		}
	}
	if b := bracingText(on); !strings.Contains(b, "inflection points counted as braces (design.brace_at_inflection = true) at 108, 180 in") {
		t.Errorf("rule on: bracing %q", b)
	}
	// Under net uplift the inflection points of the gravity cases do not
	// brace the bottom edge: a simple span is unaffected by the switch.
	u := upliftRafter("2x10")
	a := CheckMember(u, DefaultSettings())
	ss := DefaultSettings()
	ss.BraceAtInflection = true
	if b := CheckMember(u, ss); b.MaxRatio != a.MaxRatio || b.RowsPerSpan() != a.RowsPerSpan() {
		t.Errorf("simple span: the switch changed the result")
	}
}

// bracingText returns the bottom-edge trace's statement of its bracing.
func bracingText(r Result) string {
	for _, c := range r.Checks {
		if c.Kind != KindBendingBottom {
			continue
		}
		for _, it := range c.Trace() {
			if it.Symbol == "bracing points" {
				return it.Formula
			}
		}
	}
	return ""
}

// TestInflectionRowCandidate: with a row drawn (so rows are placed one at
// a time), a row at the inflection point is the candidate that shortens
// the bottom edge's compression stretch over the interior support most:
// 36 in (support to inflection point) against 72 in for a row at
// mid-stretch (hand calculation of TestBraceAtInflection_TwoSpans: the
// inflection points are at 108 and 180 in).
func TestInflectionRowCandidate(t *testing.T) {
	m, s := twoSpanFloor()
	m.BlockingAtIn = []float64{40}
	r := CheckMember(m, s)
	if r.Status != StatusPass {
		t.Fatalf("status %s %v", r.Status, r.Messages)
	}
	if len(r.BlockingAtIn) != 2 || !near(r.BlockingAtIn[0], 108, 1e-6, 0) || !near(r.BlockingAtIn[1], 180, 1e-6, 0) {
		t.Errorf("rows added %v, want the inflection points 108, 180 in", r.BlockingAtIn)
	}
	expectNear(t, "bottom-edge ratio", find(t, r, KindBendingBottom).Ratio, 0.913, 0.002, 0, "hand calculation of TestBraceAtInflection_TwoSpans, lu = 36 in")
}
