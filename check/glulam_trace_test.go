package check

import (
	"math"
	"strings"
	"testing"
)

// glulamBeam is a 5-1/8 x 12 24F-1.8E glulam beam on a simple span of
// spanIn, bearing on 6 in at each end, under a floor's dead and live load.
func glulamBeam(id string, spanIn float64) Member {
	return Member{ID: id, Size: "5.125x12", Species: "Glulam", Grade: "24F-1.8E", LengthIn: spanIn,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 6}, {AtIn: spanIn, LengthIn: 6}}, TribIn: 48, Use: "floor",
		Loads: AreaLoads{DeadPsf: 15, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240}
}

// TestGlulamTraceFactors: the written-out calculation of a glulam member
// follows NDS 2018 Table 5.3.1 (from memory: verify), not the sawn
// lumber's Table 4.3.1: no size factor CF, incising factor Ci or
// repetitive member factor Cr appears in any formula, and its volume
// factor CV is shown in the bending calculation even where it comes out
// at its cap of 1.0 (NDS 2018 5.3.6: CV <= 1.0; 20 ft, 12 in deep, 5-1/8
// in wide: (21/20)^(1/10) = 1.0049, so 1.0 — hand calculation), so that a
// checker sees it weighed against CL. Sawn lumber keeps Table 4.3.1 with
// its Ci.
func TestGlulamTraceFactors(t *testing.T) {
	r := CheckMember(glulamBeam("G1", 240), DefaultSettings())
	if r.Status == StatusError {
		t.Fatalf("error: %v", r.Messages)
	}
	for _, c := range r.Checks {
		for _, ti := range c.Trace() {
			for _, sawn := range []string{" Ci", " CF", " Cr", "Table 4.3.1"} {
				if strings.Contains(" "+ti.Formula, sawn) || strings.Contains(ti.Ref, sawn) {
					t.Errorf("%s: %s: %q / %q names %q, a sawn lumber factor or table", c.Kind, ti.Symbol, ti.Formula, ti.Ref, strings.TrimSpace(sawn))
				}
			}
		}
	}
	top := find(t, r, KindBendingTop)
	if cv := traceValue(t, top, "CV"); cv != 1 {
		t.Errorf("CV %v, want 1 (capped; NDS 2018 5.3.6)", cv)
	}
	for _, ti := range top.Trace() {
		switch ti.Symbol {
		case "CV":
			if !strings.Contains(ti.Formula, "capped at 1.0") || !strings.Contains(ti.Subst.Text(), "21/20") {
				t.Errorf("CV formula %q, subst %q: want the cap said and L = 20 ft substituted", ti.Formula, ti.Subst.Text())
			}
		case "Fb'", "Fb*":
			if !strings.Contains(ti.Ref, "Table 5.3.1") {
				t.Errorf("%s cites %q, want NDS 2018 Table 5.3.1", ti.Symbol, ti.Ref)
			}
		}
	}
	for _, kind := range []string{KindShear, KindDeflectionLive, KindBearing} {
		c := find(t, r, kind)
		found := false
		for _, ti := range c.Trace() {
			if strings.HasSuffix(ti.Symbol, "'") && strings.Contains(ti.Ref, "Table 5.3.1") {
				found = true
			}
		}
		if !found {
			t.Errorf("%s: no adjusted value citing NDS 2018 Table 5.3.1 in %+v", kind, c.Trace())
		}
	}
	for _, f := range r.Factors {
		if strings.HasPrefix(f.Symbol, "CF") || strings.HasPrefix(f.Symbol, "Ci") || f.Symbol == "Cr" || strings.Contains(f.Ref, "Table 4A") {
			t.Errorf("glulam factor list holds %s (%s)", f.Symbol, f.Ref)
		}
	}

	// The factor list shows the member's own CV: a 40 ft beam's is
	// (21/40)^(1/10) = 0.9377 (hand calculation), not the 20 ft beam's.
	long := CheckMember(glulamBeam("G2", 480), DefaultSettings())
	want := math.Pow(21.0/40, 0.1)
	got := -1.0
	for _, f := range long.Factors {
		if f.Symbol == "CV" {
			got = f.Value
		}
	}
	expectNear(t, "CV of the 40 ft beam in its factor list", got, want, 1e-12, 0, "NDS 2018 Eq. 5.3-1, hand calculation")

	// Sawn lumber: Table 4.3.1, Ci in the formulas.
	saw := CheckMember(Member{ID: "S1", Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 144,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3}, {AtIn: 144, LengthIn: 3}}, SpacingIn: 16, TribIn: 16, Repetitive: true,
		Use: "floor", Loads: AreaLoads{DeadPsf: 10, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240}, DefaultSettings())
	sh := find(t, saw, KindShear)
	for _, ti := range sh.Trace() {
		if ti.Symbol == "Fv'" && (ti.Formula != "Fv CD CM Ct Ci" || ti.Ref != "NDS 2018 Table 4.3.1") {
			t.Errorf("sawn Fv': %q %q", ti.Formula, ti.Ref)
		}
	}
}
