package check

import (
	"math"
	"testing"
)

// TestPost_NDS2018_3_7_1: a 4x4 DF-L No.2 post, 96 in high, Ke = 1, under
// 2,000 lb D + 3,000 lb L. Hand calculation (NDS 2018 3.7.1; Fc 1350 psi,
// Emin 580,000 psi, NDS 2018 Supplement Table 4A; CF(Fc) 1.15 for a 4 in
// width, Table 4A size factors):
//
//	A = 3.5 (3.5) = 12.25 in^2; le/d = 96 / 3.5 = 27.43
//	FcE = 0.822 (580,000) / 27.43^2 = 633.7 psi
//	D + L, CD = 1.0: Fc* = 1350 (1.0)(1.15) = 1552.5 psi; a = 0.4082
//	CP = 1.4082/1.6 - sqrt((1.4082/1.6)^2 - 0.4082/0.8) = 0.8801 - 0.5141 = 0.3660
//	Fc' = 568.2 psi; fc = 5,000 / 12.25 = 408.2 psi; ratio 0.718
func TestPost_NDS2018_3_7_1(t *testing.T) {
	p := Post{ID: "P1", Size: "4x4", Species: "Douglas Fir-Larch", Grade: "No.2", HeightIn: 96,
		Loads: PostLoads{DeadLb: 2000, LiveLb: 3000}}
	r := CheckPost(p, DefaultSettings())
	if r.Status != StatusPass {
		t.Fatalf("status %s: %v", r.Status, r.Messages)
	}
	var comp *CheckResult
	for i := range r.Checks {
		if r.Checks[i].Kind == KindCompression {
			comp = &r.Checks[i]
		}
	}
	if comp == nil {
		t.Fatalf("no compression check: %+v", r.Checks)
	}
	src := "NDS 2018 3.7.1, hand calculation in the comment"
	expectNear(t, "le/d", r.LeOverD, 96/3.5, 1e-12, 0, src)
	fcE := 0.822 * 580000 / math.Pow(96/3.5, 2)
	expectNear(t, "FcE", fcE, 633.7, 0.1, 0, src)
	fcStar := 1350 * 1.15
	a := fcE / fcStar
	cp := (1+a)/1.6 - math.Sqrt(math.Pow((1+a)/1.6, 2)-a/0.8)
	expectNear(t, "CP by hand", cp, 0.3660, 5e-4, 0, src)
	expectNear(t, "Fc'", comp.Allowable, fcStar*cp, 1e-9, 1e-9, src)
	expectNear(t, "fc", comp.Actual, 5000/12.25, 1e-9, 1e-9, "P / A")
	expectNear(t, "ratio", comp.Ratio, 0.718, 1e-3, 0, src)
	if comp.Combo != "D+L" {
		t.Errorf("governing %q, want D+L", comp.Combo)
	}
	if tr := comp.Trace(); len(tr) == 0 {
		t.Errorf("no trace")
	}
	// Uplift: 500 lb D, 2,000 lb W up: 0.6D + 0.6W = 300 - 1200 = -900 lb
	// (ASCE 7-16 2.4.1), net uplift for the base connector.
	p.Loads = PostLoads{DeadLb: 500, WindUpLb: 2000}
	r = CheckPost(p, DefaultSettings())
	expectNear(t, "net uplift", r.UpLb, 900, 1e-9, 0, "ASCE 7-16 2.4.1, 0.6D + 0.6W")
	// Too slender: le/d = 200 / 3.5 > 50 (NDS 2018 3.7.1.4).
	p.HeightIn, p.Loads = 200, PostLoads{DeadLb: 100}
	if r := CheckPost(p, DefaultSettings()); r.Status != StatusFail {
		t.Errorf("le/d 57: status %s, want fail", r.Status)
	}
	p.Size = "banana"
	if r := CheckPost(p, DefaultSettings()); r.Status != StatusError {
		t.Errorf("bad size: status %s, want error", r.Status)
	}
}

// TestLoadExtremes: the largest downward load and net uplift of the
// ASCE 7-16 2.4.1 ASD combinations on a support under D 1,000, L 800,
// Lr 300, S 500 lb, wind 400 lb toward and 900 lb away, 600 lb of dead
// load relied on against uplift. Hand calculation:
//
//	D+0.75L+0.75(0.6W)+0.75S, W toward: 1000 + 600 + 180 + 375 = 2,155 lb (largest down)
//	0.6D+0.6W, W away: 0.6(600) - 0.6(900) = -180 lb (the only net uplift)
//
// and, for these and other loads, what a scan of LoadCases finds (first
// case on a tie).
func TestLoadExtremes(t *testing.T) {
	l := PostLoads{DeadLb: 1000, LiveLb: 800, RoofLiveLb: 300, SnowLb: 500, WindDownLb: 400, WindUpLb: 900,
		UpliftDeadLb: 600, HasUpliftDead: true}
	down, downCombo, up, upCombo := LoadExtremes(l, Settings{})
	if math.Abs(down-2155) > 1e-9 || downCombo != "D+0.75L+0.75S+0.45W(down)" || math.Abs(up-180) > 1e-9 || upCombo != "0.6D+0.6W(up)" {
		t.Errorf("extremes %v %q, %v %q; want 2155 D+0.75L+0.75S+0.45W(down), 180 0.6D+0.6W(up) (hand calculation, ASCE 7-16 2.4.1)",
			down, downCombo, up, upCombo)
	}
	custom, err := ParseCombos([]string{"D+L", "D+(Lr or S)", "D+L", "0.6D+W"})
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range []Settings{{}, {Combos: custom}} {
		for _, l := range []PostLoads{l, {}, {DeadLb: 500}, {DeadLb: 300, WindUpLb: 900}, {DeadLb: 300, WindUpLb: 900, HasUpliftDead: true},
			{DeadLb: 200, LiveLb: 200, SnowLb: 200, RoofLiveLb: 200}, {DeadLb: -100, WindDownLb: 50}} {
			var want PostCase
			var wantUp PostCase
			for _, pc := range LoadCases(l, s) {
				if pc.PLb > want.PLb {
					want = pc
				}
				if -pc.PLb > -wantUp.PLb {
					wantUp = pc
				}
			}
			down, downCombo, up, upCombo := LoadExtremes(l, s)
			if down != want.PLb || downCombo != want.Name || up != -wantUp.PLb || upCombo != wantUp.Name {
				t.Errorf("%+v: extremes %v %q, %v %q; LoadCases gives %v %q, %v %q", l, down, downCombo, up, upCombo,
					want.PLb, want.Name, -wantUp.PLb, wantUp.Name)
			}
		}
	}
}
