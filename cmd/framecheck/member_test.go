package main

import (
	"reflect"
	"strings"
	"testing"

	"framecheck/check"
)

// TestBuildMember checks the geometry made from the flags: bearings
// centred lb/2 in from the start, one per span end, overhang past the last
// centre-line.
func TestBuildMember(t *testing.T) {
	a := memberArgs{size: "2x10", species: "DF-L", grade: "No.2", use: "floor", ceiling: "non-plaster",
		repetitive: true}
	a.bearing.in, a.spacing.in = 3.5, 16
	a.loads.DeadPsf = 10
	for _, s := range []string{"12ft,10ft"} {
		if err := a.spans.Set(s); err != nil {
			t.Fatal(err)
		}
	}
	a.overhang.in = 24
	m, s, msg := buildMember(&a, map[string]bool{"dead": true})
	if msg != "" {
		t.Fatal(msg)
	}
	want := []check.Bearing{{AtIn: 1.75, LengthIn: 3.5}, {AtIn: 145.75, LengthIn: 3.5}, {AtIn: 265.75, LengthIn: 3.5}}
	if !reflect.DeepEqual(m.Bearings, want) || m.LengthIn != 289.75 || m.OverhangEndIn != 24 {
		t.Errorf("geometry: bearings %+v, length %v, overhang %v", m.Bearings, m.LengthIn, m.OverhangEndIn)
	}
	// Floor defaults of the project file; IBC 2018 Table 1604.3 floor limits.
	if m.Loads != (check.AreaLoads{DeadPsf: 10, LivePsf: 40}) || m.LiveLimit != 360 || m.TotalLimit != 240 ||
		m.TribIn != 16 || !m.Repetitive {
		t.Errorf("member %+v", m)
	}
	if !reflect.DeepEqual(s, check.DefaultSettings()) {
		t.Errorf("settings %+v", s)
	}
}

func TestMemberCommand(t *testing.T) {
	// DF-L No.2 2x10 at 16 in o.c., 14 ft span, D 10 + L 40 psf. By hand:
	// w = 50 psf x 16/12 ft = 66.67 plf, M = w L^2 / 8 = 19600 lb-in,
	// fb = M / S = 19600 / 21.39 = 916.3 psi (S from NDS 2018 Supplement
	// Table 1B); Fb' = 900 x CF 1.1 x Cr 1.15 = 1138.5 psi (Supplement
	// Table 4A, checked: docs/VERIFIED.md), ratio 0.805; live deflection
	// 5 wL L^4 / (384 E I) = 5(4.444)(168^4) / (384(1.6e6)(98.93)) = 0.291 in.
	code, out, errs := runCmd("member", "--size", "2x10", "--span", "14ft", "--dead", "10", "--live", "40")
	if code != 0 || errs != "" {
		t.Fatalf("exit %d, stderr %q\n%s", code, errs, out)
	}
	for _, want := range []string{
		"2x10 Douglas Fir-Larch No.2, floor joist at 16 in o.c.",
		"spans 168 in (14 ft)",
		"bending-top under D+L: 916.3 psi against 1138.5 psi, ratio 0.805 ok",
		"deflection-live under L, span 1: 0.291 in",
		"PASS: governing bending-top, ratio 0.805",
		// the trace's formulas whole, with the numbers put in (an audit
		// found them cut at 40 characters)
		"Fb CD CM Ct CF Ci Cr = 900(1)(1)(1)(1.1)(1)(1.15)  [NDS 2018 3.3.3.8, Table 4.3.1]",
	} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	// The same joist as a 2x6: fb = 19600 / 7.563 = 2592 psi against
	// Fb' = 900 x 1.3 x 1.15 = 1345.5 psi: it fails, exit 1.
	code, out, _ = runCmd("member", "--size", "2x6", "--span", "14ft", "--dead", "10", "--live", "40")
	if code != 1 || !strings.Contains(out, "FAIL") || !strings.Contains(out, "2592") {
		t.Errorf("2x6: exit %d\n%s", code, out)
	}
}

func TestMemberUsageErrors(t *testing.T) {
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"member", "--span", "14ft"}, "--size is required"},
		{[]string{"member", "--size", "2x10"}, "--span is required"},
		{[]string{"member", "--size", "2x10", "--span", "14yd"}, `--span 14yd: length "14yd"`},
		{[]string{"member", "--size", "2x10", "--span", "14"}, "--span 14: 14 in or 14 ft? write 14ft or 14in"},
		{[]string{"member", "--size", "2x10", "--span", "12ft,10"}, "--span 12ft,10: 10 in or 10 ft? write 10ft or 10in"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--spacing", "16"}, "--spacing 16: 16 in or 16 ft?"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--bearing", "3.5"}, "--bearing 3.5: 3.5 in or 3.5 ft?"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--overhang", "2"}, "--overhang 2: 2 in or 2 ft?"},
		{[]string{"member", "--size", "90x45", "--span", "14ft"}, "metric sawn section"},
		{[]string{"member", "--size", "(5) 2x10", "--span", "14ft"}, "built-up member not checked"},
		{[]string{"member", "--size", "2x10", "--span", "0"}, "must be greater than 0"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--use", "deck"}, `--use "deck"`},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--ceiling", "gyp"}, `--ceiling "gyp"`},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--species", "Balsa"}, `unknown species "Balsa"`},
		{[]string{"member", "--size", "2x11", "--span", "14ft"}, `size "2x11"`},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--live", "-5"}, "--live -5"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--live-limit", "0.5"}, "--live-limit 0.5"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "-p", "testdata/none.toml"}, "none.toml"},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "extra"}, `unexpected argument "extra"`},
		{[]string{"member", "--size", "2x10", "--span", "14ft", "--blocking", "-1"}, "--blocking -1"},
	} {
		code, out, errs := runCmd(c.args...)
		if code != 2 || out != "" || !strings.Contains(errs, c.want) || !strings.HasPrefix(errs, "framecheck: member: ") {
			t.Errorf("%q: exit %d, stderr %q; want 2 and %q", c.args, code, errs, c.want)
		}
	}
}

// TestMemberRoof: roof defaults (Lr 20 psf, no floor live) and the
// IBC 2018 Table 1604.3 roof limits for a non-plaster ceiling, L/240 and
// L/180.
func TestMemberRoof(t *testing.T) {
	code, out, _ := runCmd("member", "--size", "2x8", "--span", "12ft", "--use", "roof", "--wind-up", "30")
	if code > 1 || !strings.Contains(out, "loads D 12, L 0, Lr 20, S 0, W down 0, W up 30 psf") ||
		!strings.Contains(out, "deflection limits: live L/240, total L/180") {
		t.Errorf("exit %d\n%s", code, out)
	}
	if !strings.Contains(out, "bending-bottom") {
		t.Errorf("uplift 0.6D+0.6W = 0.6(30) - 0.6(12) > 0 should load the bottom edge:\n%s", out)
	}
	// a 4:12 rafter's dead load per sloped area on the projection: 15 /
	// cos = 15 sqrt(160) / 12 = 15.81 psf (statics), printed to 0.01
	_, out, _ = runCmd("member", "--size", "2x10", "--span", "11ft", "--spacing", "24in", "--dead", "15", "--pitch", "4:12", "--use", "roof")
	if !strings.Contains(out, "loads D 15.81, L 0, Lr 20,") {
		t.Errorf("4:12 rafter:\n%s", out)
	}
}

func TestFmtVal(t *testing.T) {
	for x, want := range map[float64]string{1600000: "1600000", 1138.5: "1138.5", 916.289: "916.3", 0.805: "0.805",
		0.28: "0.28", 1: "1", 0: "0", 0.00123: "0.00123", -2.5: "-2.5"} {
		if got := fmtVal(x); got != want {
			t.Errorf("fmtVal(%v) = %q, want %q", x, got, want)
		}
	}
}

// TestMemberPointAndPitch: --point and --pitch.
//
// The joist of TestMemberCommand with 400 lb D + 300 lb L at mid-span
// (7 ft from the first bearing): M = w L^2 / 8 + P L / 4 = 19,600 +
// 700 (168) / 4 = 49,000 lb-in, fb = 49,000 / 21.39 = 2,290.7 psi (AISC Beam
// Diagrams and Formulas, simple beam cases 1 and 7, superposed).
//
// A 2x8 rafter at 6 in 12 on a 12 ft plan span, 24 in o.c., D 10 psf on
// slope (11.18 psf on plan, x sqrt(12^2 + 6^2) / 12), Lr 20 psf on plan:
// D + Lr on the plan, w = 31.18 psf x 2 ft = 62.36 plf = 5.197 lb/in,
// M = 5.197 (144^2) / 8 = 13,470 lb-in, fb = 13,470 / 13.14 = 1,025 psi
// (statics; S from NDS 2018 Supplement Table 1B).
func TestMemberPointAndPitch(t *testing.T) {
	code, out, errs := runCmd("member", "--size", "2x10", "--span", "14ft", "--dead", "10", "--live", "40", "--point", "7ft,D=400,L=300")
	if code != 1 || errs != "" {
		t.Fatalf("exit %d, stderr %q\n%s", code, errs, out)
	}
	for _, want := range []string{"point load at 84 in", "bending-top under D+L: 2290.7 psi", "M       =  49000 lb-in"} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	code, out, errs = runCmd("member", "--size", "2x8", "--span", "12ft", "--spacing", "24in", "--use", "roof", "--dead", "10", "--pitch", "6:12")
	if errs != "" || code > 1 {
		t.Fatalf("exit %d, stderr %q\n%s", code, errs, out)
	}
	for _, want := range []string{"rafter at 6 in 12", "loads D 11.18", "bending-top under D+Lr: 1025"} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	for _, bad := range [][]string{
		{"--point", "7,D=400"}, {"--point", "7ft"}, {"--point", "7ft,X=3"}, {"--point", "7ft,D=-4"}, {"--point", "30ft,D=4"},
		{"--pitch", "steep"}, {"--pitch", "6:12", "--use", "floor"},
	} {
		args := append([]string{"member", "--size", "2x10", "--span", "14ft"}, bad...)
		if code, _, errs := runCmd(args...); code != 2 || errs == "" {
			t.Errorf("%v: exit %d, stderr %q; want a usage error", bad, code, errs)
		}
	}
}
