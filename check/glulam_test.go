package check

import (
	"math"
	"strings"
	"testing"
)

// TestGlulamVolumeFactor: a 6-3/4 x 24 24F-1.8E glulam beam on a 30 ft
// simple span, top edge braced: Fb' = Fbx+ CD min(CL, CV) with CL = 1 and
// CV = (21/30)^0.1 (12/24)^0.1 (5.125/6.75)^0.1 = 0.9650 (0.9330)(0.9728)
// = 0.8759 (NDS 2018 5.3.6, Eq. 5.3-1, hand calculation); Fbx+ = 2400 psi
// (NDS 2018 Supplement Table 5A, from memory: verify), so under D + L
// (CD = 1.0) Fb' = 2102 psi. No CF and no Cr apply to glulam (NDS 2018
// Table 5.3.1).
func TestGlulamVolumeFactor(t *testing.T) {
	cv := VolumeFactor(30, 24, 6.75, 10)
	expectNear(t, "CV", cv, 0.8759, 5e-4, 0, "NDS 2018 Eq. 5.3-1, hand calculation")
	expectNear(t, "CV small beam", VolumeFactor(20, 12, 5.125, 10), 1, 0, 0, "CV <= 1.0 (NDS 2018 5.3.6)")
	m := Member{ID: "G1", Size: "6 3/4 x 24", Species: "Glulam", Grade: "24F-1.8E", LengthIn: 360,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 6}, {AtIn: 360, LengthIn: 6}}, TribIn: 96, Use: "floor",
		Loads: AreaLoads{DeadPsf: 20, LivePsf: 80}, LiveLimit: 360, TotalLimit: 240}
	r := CheckMember(m, DefaultSettings())
	if r.Status == StatusError {
		t.Fatalf("error: %v", r.Messages)
	}
	top := find(t, r, KindBendingTop)
	expectNear(t, "Fb'", top.Allowable, 2400*cv, 1e-9, 1e-9, "NDS 2018 Table 5.3.1 and 5.3.6 (Table 5A value from memory: verify)")
	// M = w L^2 / 8 with w = 100 psf x 8 ft = 800 plf = 66.67 lb/in:
	// 66.67 (360^2) / 8 = 1,080,000 lb-in; S = 6.75 (24^2) / 6 = 648 in^3
	expectNear(t, "fb", top.Actual, 1080000/648.0, 1e-6, 1e-9, "statics, w L^2 / 8 over S")
	if traceValue(t, top, "CV") != cv {
		t.Errorf("trace CV %v, want %v", traceValue(t, top, "CV"), cv)
	}
	// Sized in nominal inches, glulam is refused; wet service too.
	m.Size = "4x12"
	if r := CheckMember(m, DefaultSettings()); r.Status != StatusError || !strings.Contains(strings.Join(r.Messages, " "), "actual inches") {
		t.Errorf("nominal glulam size: %s %v", r.Status, r.Messages)
	}
	m.Size = "6.75x24"
	s := DefaultSettings()
	s.WetService = true
	if r := CheckMember(m, s); r.Status != StatusError {
		t.Errorf("wet glulam: %s, want error", r.Status)
	}
	m.Grade = "99F-9.9E"
	if r := CheckMember(m, DefaultSettings()); r.Status != StatusError || !strings.Contains(strings.Join(r.Messages, " "), "24F-1.8E") {
		t.Errorf("unknown stress class: %s %v", r.Status, r.Messages)
	}
}

// TestGlulamNegativeMoment: over the interior support of a two-span
// glulam beam the bottom edge is in compression and the compression zone
// is stressed in tension: Fbx- = 1450 psi applies (NDS 2018 Supplement
// Table 5A, from memory: verify), not Fbx+.
func TestGlulamNegativeMoment(t *testing.T) {
	m := Member{ID: "G2", Size: "5.125x18", Species: "Glulam", Grade: "24F-1.8E", LengthIn: 480,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 6}, {AtIn: 240, LengthIn: 6}, {AtIn: 480, LengthIn: 6}}, TribIn: 96, Use: "floor",
		Loads: AreaLoads{DeadPsf: 20, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240}
	r := CheckWithRows(m, DefaultSettings(), 0)
	bot := find(t, r, KindBendingBottom)
	for _, ti := range bot.Trace() {
		if ti.Symbol == "Fb*" && !strings.HasPrefix(ti.Subst.Text(), "1450(") {
			t.Errorf("bottom edge Fb* = %s, want Fbx- 1450 psi", ti.Subst.Text())
		}
	}
	top := find(t, r, KindBendingTop)
	if cd := traceValue(t, top, "Fb*"); math.Abs(cd-2400*1.0) > 1e-6 && math.Abs(cd-2400*0.9) > 1e-6 && math.Abs(cd-2400*1.25) > 1e-6 {
		t.Errorf("top edge Fb* %v, want Fbx+ 2400 psi times CD", cd)
	}
}

// TestTimberBeam: a 6x14 Douglas Fir-Larch No.1 beam (beams and
// stringers: d = 14 > b + 2 = 8, NDS 2018 Supplement Table 4D), dressed
// 5.5 x 13.5 in (Table 1A, timbers: 1/2 in off each way), Fb = 1350 psi
// (Table 4D, per StructuralTools SawnLumber.csv; docs/VERIFIED.md) with
// CF = (12/13.5)^(1/9) = 0.9870 (NDS 2018 4.3.6.2), top edge braced:
// under D + L (CD = 1.0) Fb' = 1332 psi;
// S = 5.5 (13.5^2) / 6 = 167.06 in^3 (hand calculation). A 6x6 is a post
// and timber (No.1 Fb 1200 psi).
func TestTimberBeam(t *testing.T) {
	sec, err := ParseSize("6x14")
	if err != nil || !sec.Timber {
		t.Fatalf("6x14: %+v %v", sec, err)
	}
	expectNear(t, "S", sec.SIn3, 5.5*13.5*13.5/6, 1e-9, 0, "b d^2 / 6, dressed 5.5 x 13.5")
	m := Member{ID: "T1", Size: "6x14", Species: "DF-L", Grade: "No.1", LengthIn: 240,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 5.5}, {AtIn: 240, LengthIn: 5.5}}, TribIn: 96, Use: "floor",
		Loads: AreaLoads{DeadPsf: 15, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240}
	r := CheckMember(m, DefaultSettings())
	if r.Status == StatusError {
		t.Fatalf("error: %v", r.Messages)
	}
	cf := math.Pow(12/13.5, 1.0/9)
	expectNear(t, "CF", cf, 0.9870, 5e-4, 0, "NDS 2018 4.3.6.2, hand calculation")
	expectNear(t, "Fb'", find(t, r, KindBendingTop).Allowable, 1350*cf, 1e-9, 1e-9, "NDS 2018 Supplement Table 4D (per StructuralTools SawnLumber.csv), 4.3.6.2")
	dv, err := BuiltinMaterials().Lookup("Douglas Fir-Larch", "No.1", "6x6")
	if err != nil || dv.FbPsi != 1200 {
		t.Errorf("6x6 No.1: %+v %v, want posts and timbers Fb 1200 (Table 4D, per StructuralTools SawnLumber.csv)", dv, err)
	}
	if _, err := BuiltinMaterials().Lookup("Hem-Fir", "No.1", "6x14"); err == nil {
		t.Errorf("Hem-Fir timber: want an error (not built in)")
	}
}
