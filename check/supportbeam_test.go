package check

import (
	"strings"
	"testing"
)

// lowLVLCSV is a user's structural composite lumber of low Fc_perp, as a
// materials file gives it (the numbers are the test's input: common
// practice, no source): Fc_perp 400 psi, depths 5.5 to 18 in.
const lowLVLCSV = `species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source
SOFTLVL,1.5E,5.5,18,2000,1400,220,400,2000,1500000,762000,SCL 0.136,maker's sheet (test input)
`

// joistOnBeam is a 2x10 DF-L No.2 floor joist, 144 in between bearing
// centre-lines at its ends: a wall at 0 (lb 3.5 in) and a beam at 144
// (lb 3 in), 10 psf dead and 40 psf live at 16 in.
func joistOnBeam(beam SupportBeam) Member {
	m := floorJoist("2x10", 144, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 3, Beam: beam}}
	return m
}

// TestBearingOnBeam_HandCalculation: a 2x10 Douglas Fir-Larch No.2 joist
// resting on the top of a beam, its bearing checked against its own
// Fc_perp' and the beam's, the smaller governing (NDS 2018 3.10.2).
//
//	R        = w L / 2 = (10 + 40)(16/144)(144)/2 = 400 lb under D + L (statics)
//	lb       = 3 in on the beam (the joist's bearing length)
//	fc_perp  = R / (b lb) = 400 / (1.5 (3)) = 88.889 psi            NDS 2018 3.10.2
//	joist    Fc_perp' = Fc_perp CM Ct Ci Cb = 625 (1)(1)(1)(1) = 625 psi:
//	         625 psi from NDS 2018 Supplement Table 4A (DF-L No.2); Table 4.3.1;
//	         Cb = 1, the bearing at the joist's end (NDS 2018 3.10.4)
//	beam Cb  = (1.5 + 0.375) / 1.5 = 1.25: NDS 2018 3.10.4, lb measured parallel
//	         to the beam's grain = the joist's width b = 1.5 in, 3 in or more
//	         from the beam's end
//
// On a 5 1/8 x 12 glulam 24F-1.8E: Fc_perp' = Fc_perp CM Ct Cb = 650 (1)(1)(1.25)
// = 812.5 psi (Fc_perp 650 psi from NDS 2018 Supplement Table 5A, from memory:
// verify; Table 5.3.1, from memory: verify): the joist's 625 governs, ratio
// 88.889 / 625 = 0.14222.
//
// On a 3 1/2 x 11 7/8 SCL of Fc_perp 400 psi (the materials file's row):
// Fc_perp' = 400 (1)(1)(1.25) = 500 psi (NDS 2018 Table 8.3.1, from memory:
// verify): the beam governs, ratio 88.889 / 500 = 0.17778.
func TestBearingOnBeam_HandCalculation(t *testing.T) {
	s := DefaultSettings()
	u, err := LoadMaterialsCSV(strings.NewReader(lowLVLCSV), "low.csv")
	if err != nil {
		t.Fatal(err)
	}
	s.Materials = BuiltinMaterials().Merge(u)
	R := 50 * 16 / 144.0 * 144 / 2 // statics, lb
	fc := R / (1.5 * 3)            // NDS 2018 3.10.2

	glb := joistOnBeam(SupportBeam{Species: GlulamSpecies, Grade: "24F-1.8E", Size: "5 1/8 x 12", EndIn: 6})
	r := CheckMember(glb, s)
	b := find(t, r, KindBearing)
	expectNear(t, "fc_perp on the glulam", b.Actual, fc, 1e-9, 1e-9, "R / (b lb), statics and NDS 2018 3.10.2")
	expectNear(t, "Fc_perp' (the joist's governs)", b.Allowable, 625, 1e-9, 0, "NDS 2018 Supplement Table 4A, DF-L No.2; Table 4.3.1")
	expectNear(t, "ratio", b.Ratio, fc/625, 1e-9, 1e-9, "88.889 / 625 = 0.14222, hand calculation")
	expectNear(t, "Cb_beam", traceValue(t, b, "Cb_beam"), 1.25, 1e-12, 0, "NDS 2018 3.10.4, lb = b = 1.5 in")
	expectNear(t, "glulam Fc_perp'", traceValue(t, b, "Fc_perp_beam'"), 650*1.25, 1e-9, 0,
		"NDS 2018 Supplement Table 5A 24F-1.8E 650 psi (from memory: verify), Table 5.3.1, 3.10.4")
	expectNear(t, "the joist's own Fc_perp'", traceValue(t, b, "Fc_perp'"), 625, 1e-9, 0, "NDS 2018 Supplement Table 4A")
	expectTrace(t, b, "Fc_perp_beam'", "of the beam under bearing 2 (Glulam 24F-1.8E): the member's governs")

	scl := joistOnBeam(SupportBeam{Species: "SOFTLVL", Grade: "1.5E", Size: "3.5x11.875", EndIn: 6})
	r = CheckMember(scl, s)
	b = find(t, r, KindBearing)
	expectNear(t, "Fc_perp' (the SCL beam's governs)", b.Allowable, 400*1.25, 1e-9, 0, "materials file Fc_perp 400 psi; NDS 2018 Table 8.3.1 (from memory: verify), 3.10.4")
	expectNear(t, "ratio", b.Ratio, fc/500, 1e-9, 1e-9, "88.889 / 500 = 0.17778, hand calculation")
	expectNear(t, "the joist's own Fc_perp'", traceValue(t, b, "Fc_perp'"), 625, 1e-9, 0, "NDS 2018 Supplement Table 4A")
	expectNear(t, "fc_perp / Fc_perp_beam'", traceValue(t, b, "fc_perp/Fc_perp_beam'"), fc/500, 1e-9, 1e-9, "hand calculation")
	expectTrace(t, b, "Fc_perp_beam'", "of the beam under bearing 2 (SOFTLVL 1.5E): it governs")

	// The joist 2 in from the beam's end: its edge is 2 - 0.75 = 1.25 in
	// from it, under 3 in: Cb = 1 (NDS 2018 3.10.4), Fc_perp' = 400 psi.
	scl.Bearings[1].Beam.EndIn = 2
	r = CheckMember(scl, s)
	expectNear(t, "Fc_perp' near the beam's end", find(t, r, KindBearing).Allowable, 400, 1e-9, 0, "NDS 2018 3.10.4: Cb = 1 within 3 in of the end")
	// 3.75 in: the edge exactly 3 in from the end, Cb applies.
	scl.Bearings[1].Beam.EndIn = 3.75
	r = CheckMember(scl, s)
	expectNear(t, "Fc_perp' 3 in from the end", find(t, r, KindBearing).Allowable, 500, 1e-9, 0, "NDS 2018 3.10.4: not nearer than 3 in")

	// A Hem-Fir No.2 sawn beam (Fc_perp 405 psi, NDS 2018 Supplement
	// Table 4A) in wet service: CM = 0.67 on both (Supplement Table 4A
	// notes): the joist's 625 (0.67) = 418.75, the beam's 405 (0.67)(1.25)
	// = 339.19 psi governs.
	hf := joistOnBeam(SupportBeam{Species: "Hem-Fir", Grade: "No.2", Size: "(3) 2x12", EndIn: 6})
	ws := s
	ws.WetService = true
	r = CheckMember(hf, ws)
	expectNear(t, "Fc_perp' on a wet Hem-Fir beam", find(t, r, KindBearing).Allowable, 405*0.67*1.25, 1e-9, 0,
		"NDS 2018 Supplement Table 4A (Fc_perp 405, CM 0.67), Table 4.3.1, 3.10.4")

	// In a hanger the joist rests on the seat: its own Fc_perp' only, and
	// the trace says the hanger's bearing on the beam is the connector's.
	scl.Bearings[1].Beam.EndIn = 6
	scl.Bearings[1].Hanger = true
	r = CheckMember(scl, s)
	b = find(t, r, KindBearing)
	expectNear(t, "Fc_perp' in a hanger", b.Allowable, 625, 1e-9, 0, "NDS 2018 Supplement Table 4A: the joist's own")
	expectTrace(t, b, "lb", "the hanger's bearing on the beam is the connector's")

	// Askew (EndIn 0): Cb = 1 on the beam.
	scl.Bearings[1].Hanger = false
	scl.Bearings[1].Beam.EndIn = 0
	r = CheckMember(scl, s)
	expectNear(t, "Fc_perp' askew", find(t, r, KindBearing).Allowable, 400, 1e-9, 0, "NDS 2018 3.10.4 not taken: Cb = 1")

	// Wet-service glulam is refused, as the beam's own check refuses it:
	// never a value guessed.
	if r := CheckMember(glb, ws); r.Status != StatusError || !strings.Contains(strings.Join(r.Messages, " "), "bearing 2: the beam under it: glulam in wet service") {
		t.Errorf("wet-service glulam beam: status %s, messages %v; want an error naming the beam", r.Status, r.Messages)
	}
}

// TestSupportBeamEndIn: the distance to the beam's nearer end, capped at
// 6 in (for every lb under 6 in the bearing's edge is then 3 in or more
// from the end, NDS 2018 3.10.4), 0 askew; joists alike but for their
// place along the beam's middle are then alike for the check.
func TestSupportBeamEndIn(t *testing.T) {
	for _, tc := range []struct {
		at, l  float64
		square bool
		want   float64
	}{
		{2, 144, true, 2}, {140, 144, true, 4}, {50, 144, true, 6}, {100, 144, true, 6}, {50, 144, false, 0}, {-1, 144, true, 0},
	} {
		if got := SupportBeamEndIn(tc.at, tc.l, tc.square); got != tc.want {
			t.Errorf("SupportBeamEndIn(%g, %g, %v) = %g, want %g (NDS 2018 3.10.4; common practice, no source, for the cap)", tc.at, tc.l, tc.square, got, tc.want)
		}
	}
	a := joistOnBeam(SupportBeam{Species: GlulamSpecies, Grade: "24F-1.8E", Size: "5.125x12", EndIn: SupportBeamEndIn(50, 144, true)})
	b := a
	b.Bearings = append([]Bearing(nil), a.Bearings...)
	b.Bearings[1].Beam.EndIn = SupportBeamEndIn(90, 144, true)
	if MemberKey(a) != MemberKey(b) {
		t.Error("joists alike but for their place along the beam's middle have different keys")
	}
}

// expectTrace fails unless the trace item sym's formula contains want.
func expectTrace(t *testing.T, c CheckResult, sym, want string) {
	t.Helper()
	for _, ti := range c.Trace() {
		if ti.Symbol == sym {
			if !strings.Contains(ti.Formula, want) {
				t.Errorf("%s: %s formula %q, want it to contain %q", c.Kind, sym, ti.Formula, want)
			}
			return
		}
	}
	t.Errorf("%s: no %s in the trace", c.Kind, sym)
}
