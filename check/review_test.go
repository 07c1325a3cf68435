package check

import (
	"math"
	"testing"

	"framecheck/check/beam"
)

// TestTotalDeflection_UpliftOnlyRoof: a roof joist whose only live-type
// load is wind suction still has its total deflection checked. Total =
// Kcr x (deflection from D) + the largest live-type deflection (NDS 2018
// 3.5.2; DOMAIN rule), and 0.42 W up deflects the joist upward, so the
// largest downward live-type deflection is 0 and total = 1.5 x 5 wD L^4 /
// (384 E I) against L/180 (IBC 2018 Table 1604.3, roof, non-plaster
// ceiling). Hand calculation: wD = 10 psf x 16 in / 144 = 1.1111 lb/in,
// I = 1.5 (7.25)^3 / 12 = 47.635 in^4, 5 wD L^4 / (384 E I) with L = 168 in,
// E = 1,600,000 psi = 0.15121 in; x 1.5 = 0.2268 in; allowed 168/180 =
// 0.9333 in.
func TestTotalDeflection_UpliftOnlyRoof(t *testing.T) {
	L := 168.0
	m := Member{ID: "R1", Size: "2x8", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: L,
		Bearings: []Bearing{{0, 1.5}, {L, 1.5}}, SpacingIn: 16, TribIn: 16, Use: "roof",
		Loads: AreaLoads{DeadPsf: 10, WindUpPsf: 30}, LiveLimit: 240, TotalLimit: 180, Repetitive: true}
	r := CheckMember(m, DefaultSettings())
	var tot *CheckResult
	for i := range r.Checks {
		if r.Checks[i].Kind == KindDeflectionTotal {
			tot = &r.Checks[i]
		}
	}
	if tot == nil {
		t.Fatalf("no total deflection check with D and wind suction only (%d checks, messages %v)", len(r.Checks), r.Messages)
	}
	ei := 1.6e6 * 1.5 * 7.25 * 7.25 * 7.25 / 12
	wD := 10 * 16 / 144.0
	expectNear(t, "total deflection", tot.Actual, 1.5*5*wD*math.Pow(L, 4)/(384*ei), 1e-9, 1e-9, "NDS 2018 3.5.2 Kcr 1.5; 5 w L^4 / 384 E I")
	expectNear(t, "allowed", tot.Allowable, L/180, 1e-12, 0, "IBC 2018 Table 1604.3 (roof, non-plaster ceiling)")
}

// TestPatternLive_SixSpans_WorstSupportMoment: ASCE 7-16 4.3.3 (partial
// loading) asks for the most unfavourable arrangement of live load. On a
// continuous beam the largest negative moment over a support, and the
// largest reaction, come from loading the two spans next to it and every
// second span beyond (Mueller-Breslau: the influence line of a support
// moment alternates in sign span by span). The expected values are the
// worst over all 2^6 - 1 arrangements of live load on six equal spans,
// each solved by the three-moment equation (check/beam, verified against
// AISC Manual Table 3-23); the engine must find the same worst case.
func TestPatternLive_SixSpans_WorstSupportMoment(t *testing.T) {
	const n = 6
	L := 120.0
	m := floorJoist("2x12", n*L, 16)
	m.Bearings = nil
	sup := make([]float64, 0, n+1)
	for i := 0; i <= n; i++ {
		m.Bearings = append(m.Bearings, Bearing{float64(i) * L, 3.5})
		sup = append(sup, float64(i)*L)
	}
	m.Loads = AreaLoads{LivePsf: 40}
	m.BottomBracedContinuous = true // CL = 1: the governing M is the largest negative moment
	m.LiveLimit = 0
	r := CheckMember(m, DefaultSettings())
	w := 40 * 16 / 144.0
	b := beam.Beam{LengthIn: n * L, SupportsAtIn: sup, EILbIn2: 1e9}
	worstM, worstR := 0.0, 0.0
	for p := 1; p < 1<<n; p++ {
		ws := make([]float64, n)
		for k := range ws {
			if p&(1<<k) != 0 {
				ws[k] = w
			}
		}
		resp, err := b.Solve(ws)
		if err != nil {
			t.Fatal(err)
		}
		_, _, neg, _ := resp.MomentExtremes(0, n*L)
		worstM = math.Max(worstM, -neg)
		for _, rx := range resp.Reactions() {
			worstR = math.Max(worstR, rx)
		}
	}
	expectNear(t, "largest support moment", traceValue(t, find(t, r, KindBendingBottom), "M"), worstM, 1e-6, 1e-9,
		"ASCE 7-16 4.3.3, worst of all 63 live-load arrangements")
	expectNear(t, "largest reaction", traceValue(t, find(t, r, KindBearing), "R"), worstR, 1e-6, 1e-9,
		"ASCE 7-16 4.3.3, worst of all 63 live-load arrangements")
}

// TestBearing_EndPastCentreLineLoadsTheReaction: an end that stops inside
// its bearing is part of the bearing and its load goes to the reaction
// (DOMAIN rule on overhangs). A 2x10 floor joist, 168 in centre to centre
// of 3.5 in bearings, ends flush with the outer faces: member 171.5 in,
// 1.75 in past each centre-line. Hand calculation: w = (10 + 40) psf x
// 16 in / 144 = 5.5556 lb/in; R = w (168/2 + 1.75) = 476.39 lb (statics);
// fc_perp = R / (b lb) = 476.39 / (1.5 x 3.5) = 90.74 psi (NDS 2018
// 3.10.2). Shear at the centre-line stays w L / 2 = 466.67 lb.
func TestBearing_EndPastCentreLineLoadsTheReaction(t *testing.T) {
	m := floorJoist("2x10", 171.5, 16)
	m.Bearings = []Bearing{{1.75, 3.5}, {169.75, 3.5}}
	r := CheckMember(m, DefaultSettings())
	w := 50 * 16 / 144.0
	b := find(t, r, KindBearing)
	expectNear(t, "R", traceValue(t, b, "R"), w*(84+1.75), 1e-9, 1e-9, "statics: w (L/2 + 1.75 in)")
	expectNear(t, "fc_perp", b.Actual, w*(84+1.75)/(1.5*3.5), 1e-9, 1e-9, "NDS 2018 3.10.2")
	expectNear(t, "V", traceValue(t, find(t, r, KindShear), "V"), w*84, 1e-9, 1e-9, "statics: w L / 2")
}
