package check

import (
	"math"
	"testing"

	"framecheck/check/beam"
)

// TestTotalDeflection_UpliftOnlyRoof: a roof joist whose only live-type
// load is wind suction still has its total deflection checked. The IBC
// total check takes the deflection from L + D, or L + 0.5D for seasoned
// lumber in dry service (IBC 2018 Table 1604.3 footnote d), with L the
// largest live-type deflection; 0.42 W up deflects the joist upward, so the
// largest downward live-type deflection is 0 and total = 0.5 x 5 wD L^4 /
// (384 E I) against L/180 (IBC 2018 Table 1604.3, roof, non-plaster
// ceiling). Hand calculation: wD = 10 psf x 16 in / 144 = 1.1111 lb/in,
// I = 1.5 (7.25)^3 / 12 = 47.635 in^4, 5 wD L^4 / (384 E I) with L = 168 in,
// E = 1,600,000 psi = 0.15121 in; x 0.5 = 0.0756 in; allowed 168/180 =
// 0.9333 in.
func TestTotalDeflection_UpliftOnlyRoof(t *testing.T) {
	L := 168.0
	m := Member{ID: "R1", Size: "2x8", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: L,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: L, LengthIn: 1.5}}, SpacingIn: 16, TribIn: 16, Use: "roof",
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
	expectNear(t, "total deflection", tot.Actual, 0.5*5*wD*math.Pow(L, 4)/(384*ei), 1e-9, 1e-9, "IBC 2018 Table 1604.3 note d (0.5D, seasoned); 5 w L^4 / 384 E I")
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
		m.Bearings = append(m.Bearings, Bearing{AtIn: float64(i) * L, LengthIn: 3.5})
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
	m.Bearings = []Bearing{{AtIn: 1.75, LengthIn: 3.5}, {AtIn: 169.75, LengthIn: 3.5}}
	r := CheckMember(m, DefaultSettings())
	w := 50 * 16 / 144.0
	b := find(t, r, KindBearing)
	expectNear(t, "R", traceValue(t, b, "R"), w*(84+1.75), 1e-9, 1e-9, "statics: w (L/2 + 1.75 in)")
	expectNear(t, "fc_perp", b.Actual, w*(84+1.75)/(1.5*3.5), 1e-9, 1e-9, "NDS 2018 3.10.2")
	expectNear(t, "V", traceValue(t, find(t, r, KindShear), "V"), w*84, 1e-9, 1e-9, "statics: w L / 2")
}

// TestBottomEdge_UpliftSimpleSpan_HandCalculation: a 2x8 DF-L No.2 roof
// joist, 168 in simple span at 16 in, D 10 psf, W up 30 psf: 0.6D + 0.6W
// is a net uplift of 12 psf (ASCE 7-16 2.4.1 combination 7) that puts the
// bottom edge, braced only at the bearings, in compression. By hand:
// w = 12 x 16 / 144 = 1.3333 lb/in, M = w L^2 / 8 = 4704 lb-in;
// Fb* = Fb CD CF Cr = 900 (1.6)(1.2)(1.15) = 1987.2 psi (NDS 2018 Table
// 2.3.2 CD for W; Supplement Table 4A CF; 4.3.9 Cr); lu = 168 in, lu/d =
// 23.2 >= 7, simple span: le = 1.63 lu + 3 d = 295.59 in (NDS 2018 Table
// 3.3.3); RB = sqrt(le d / b^2) = 30.862; FbE = 1.20 Emin / RB^2 =
// 1.20 (580,000) / 952.46 = 730.74 psi; FbE/Fb* = 0.36772, CL = 1.36772/1.9
// - sqrt((1.36772/1.9)^2 - 0.36772/0.95) = 0.35776 (NDS 2018 Eq. 3.3-6);
// Fb' = 710.94 psi.
func TestBottomEdge_UpliftSimpleSpan_HandCalculation(t *testing.T) {
	L := 168.0
	m := Member{ID: "R1", Size: "2x8", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: L,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: L, LengthIn: 1.5}}, SpacingIn: 16, TribIn: 16, Use: "roof",
		Loads: AreaLoads{DeadPsf: 10, WindUpPsf: 30}, LiveLimit: 240, TotalLimit: 180, Repetitive: true}
	b := find(t, CheckWithRows(m, DefaultSettings(), 0), KindBendingBottom)
	src := "hand calculation in the comment (NDS 2018 3.3.3, Table 3.3.3, Eq. 3.3-6)"
	expectNear(t, "M", traceValue(t, b, "M"), 4704, 1e-6, 0, src)
	expectNear(t, "Fb*", traceValue(t, b, "Fb*"), 1987.2, 1e-9, 1e-12, src)
	expectNear(t, "le", traceValue(t, b, "le"), 295.59, 1e-9, 1e-12, src)
	expectNear(t, "RB", traceValue(t, b, "RB"), 30.862, 0.0005, 0, src)
	expectNear(t, "FbE", traceValue(t, b, "FbE"), 730.74, 0.005, 0, src)
	expectNear(t, "CL", traceValue(t, b, "CL"), 0.35776, 0.00001, 0, src)
	expectNear(t, "Fb'", b.Allowable, 710.94, 0.01, 0, src)
}

// TestBottomEdge_TwoSpans_GeneralRow_HandCalculation: a 2x8 DF-L No.2
// floor joist over two 144 in spans at 16 in, D 12 + L 40 psf, no rows:
// the bottom edge over the interior bearing is braced only at the
// bearings. By hand: w = 52 x 16 / 144 = 5.7778 lb/in, M = w L^2 / 8 =
// 14,976 lb-in (two equal spans, AISC Manual Table 3-23 case 29); lu =
// 144 in, lu/d = 19.86 > 14.3: general row le = 1.84 lu = 264.96 in (NDS
// 2018 Table 3.3.3 note 1); RB = sqrt(264.96 (7.25)) / 1.5 = 29.219; FbE
// = 1.20 (580,000) / 853.76 = 815.22 psi; Fb* = 900 (1.0)(1.2)(1.15) =
// 1242 psi; FbE/Fb* = 0.65637, CL = 0.60896 (Eq. 3.3-6); fb = M / S =
// 14,976 / 13.1406 = 1139.7 psi; ratio = 1139.7 / (1242 x 0.60897) = 1.5068.
func TestBottomEdge_TwoSpans_GeneralRow_HandCalculation(t *testing.T) {
	L := 144.0
	m := floorJoist("2x8", 2*L, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: L, LengthIn: 3.5}, {AtIn: 2 * L, LengthIn: 3.5}}
	m.Loads = AreaLoads{DeadPsf: 12, LivePsf: 40}
	b := find(t, CheckWithRows(m, DefaultSettings(), 0), KindBendingBottom)
	src := "hand calculation in the comment (NDS 2018 3.3.3, Table 3.3.3, Eq. 3.3-6)"
	expectNear(t, "M", traceValue(t, b, "M"), 14976, 1e-6, 0, src)
	expectNear(t, "le", traceValue(t, b, "le"), 264.96, 1e-9, 1e-12, src)
	expectNear(t, "RB", traceValue(t, b, "RB"), 29.219, 0.0005, 0, src)
	expectNear(t, "CL", traceValue(t, b, "CL"), 0.60896, 0.00001, 0, src)
	expectNear(t, "ratio", b.Ratio, 1.5068, 0.0001, 0, src)
}
