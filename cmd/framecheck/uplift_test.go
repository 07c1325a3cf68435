package main

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/export"
)

// upliftPlan is three roof joists at 16 in on centre, 10 ft long, each end
// on the centre-line of a single-line wall (x = 0, handle 101; x = 120 in,
// handle 102): simple spans of L = 120 in with no piece past a bearing.
// Tributary widths: 16 in for the middle joist, 8 in for the two edge
// joists (half the gap to their one neighbour). The first joist starts at
// x = x0 (0, or a little short of the wall).
func upliftPlan(x0 float64) string {
	var d dxfText
	d.header("AC1009", 1)
	d.section("ENTITIES")
	d.line("WALL", 0, 0, 0, 64)
	d.line("WALL", 120, 0, 120, 64)
	d.line("JOIST", x0, 16, 120, 16)
	for _, y := range []float64{32, 48} {
		d.line("JOIST", 0, y, 120, y)
	}
	d.endsec()
	d.eof()
	return d.String()
}

// runUpliftPlan checks upliftPlan under one roof zone with dead load
// deadPsf and wind suction upPsf, and returns the results it wrote.
func runUpliftPlan(t *testing.T, deadPsf, upPsf float64, extra string, x0 float64) *export.Results {
	t.Helper()
	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	proj := filepath.Join(dir, "framecheck.toml")
	toml := fmt.Sprintf("[drawing]\nunits = \"in\"\n%s\n[[zone]]\nname = \"ROOF\"\nuse = \"roof\"\ndead_psf = %v\nroof_live_psf = 20\nwind_up_psf = %v\n", extra, deadPsf, upPsf)
	if err := os.WriteFile(plan, []byte(upliftPlan(x0)), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(proj, []byte(toml), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "out")
	var so, se bytes.Buffer
	if code := run([]string{"check", plan, "-p", proj, "-o", out}, &so, &se); code == exitUsage {
		t.Fatalf("exit %d: %s", code, se.String())
	}
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	if err != nil {
		t.Fatal(err)
	}
	if len(r.Members) != 3 {
		t.Fatalf("%d members, want 3:\n%s", len(r.Members), so.String())
	}
	return r
}

// upliftOf returns the uplift entries of member id, by bearing.
func upliftOf(r *export.Results, id string) map[int]export.UpliftBearing {
	out := map[int]export.UpliftBearing{}
	for _, b := range r.Uplift.Bearings {
		if b.Member == id {
			out[b.Bearing] = b
		}
	}
	return out
}

// TestUplift_SmallIsListedNotFlagged: a net uplift of 0.8 lb is listed in
// results.json and not flagged. Hand calculation, statics, written out:
// D = 10 psf, W up = 10.2 psf; 0.6D + 0.6W (ASCE 7-16 2.4.1) = 0.6(10) -
// 0.6(10.2) = -0.12 psf; middle joist w = 0.12 psf x 16/12 ft = 0.16 plf;
// R = w L / 2 = 0.16 x 10 / 2 = 0.8 lb at each end; edge joists (8 in)
// 0.4 lb.
func TestUplift_SmallIsListedNotFlagged(t *testing.T) {
	r := runUpliftPlan(t, 10, 10.2, "", 0)
	if r.Uplift.ReportLb != 50 {
		t.Errorf("report_lb %v, want the default 50 lb", r.Uplift.ReportLb)
	}
	if len(r.Uplift.Bearings) != 6 {
		t.Fatalf("%d uplift bearings, want all 6 listed: %+v", len(r.Uplift.Bearings), r.Uplift.Bearings)
	}
	mid := upliftOf(r, "M2")
	for j, x := range map[int]float64{1: 0, 2: 120} {
		b, ok := mid[j]
		if !ok {
			t.Fatalf("M2 bearing %d not listed", j)
		}
		if math.Abs(b.UpliftLb-0.8) > 1e-9 || b.Flagged || b.Combo != "0.6D+0.6W(up)" || b.CD != 1.6 {
			t.Errorf("M2 bearing %d: %+v, want 0.8 lb under 0.6D+0.6W(up), CD 1.6, not flagged (statics, written out)", j, b)
		}
		if b.AtIn != x || b.Point != [2]float64{x, 32} || b.SupportLayer != "WALL" || b.SupportKind != "bearing-wall" {
			t.Errorf("M2 bearing %d: at %v in, point %v, support %q %q", j, b.AtIn, b.Point, b.SupportLayer, b.SupportKind)
		}
	}
	if mid[1].Support != "WALL handle 101" || mid[2].Support != "WALL handle 102" {
		t.Errorf("support lines %q and %q, want WALL handle 101 and 102", mid[1].Support, mid[2].Support)
	}
	for _, m := range r.Members {
		for _, s := range append(m.Info, m.Messages...) {
			if strings.Contains(strings.ToLower(s), "hold it down") {
				t.Errorf("%s: %q", m.ID, s)
			}
		}
	}
	// Lowering the threshold flags it (design.uplift_report_lb).
	r = runUpliftPlan(t, 10, 10.2, "[design]\nuplift_report_lb = 0.5", 0)
	if b := upliftOf(r, "M2")[1]; !b.Flagged || r.Uplift.ReportLb != 0.5 {
		t.Errorf("with uplift_report_lb = 0.5: %+v", b)
	}
	if b := upliftOf(r, "M1")[1]; b.Flagged || math.Abs(b.UpliftLb-0.4) > 1e-9 {
		t.Errorf("edge joist, 0.4 lb, below 0.5: %+v", b)
	}
}

// TestUplift_RoofJoistHandCalc: a roof joist under net uplift gives the
// reaction of a hand calculation, statics, written out: D = 10 psf, W up
// = 60 psf; 0.6D + 0.6W (ASCE 7-16 2.4.1, combination 7) = 0.6(10) -
// 0.6(60) = -30 psf; middle joist w = 30 x 16/12 = 40 plf; R = w L / 2 =
// 40 x 10 / 2 = 200 lb (flagged, over 50 lb); edge joists (8 in trib)
// 100 lb. Per wall line: 3 bearings, largest 200 lb, total 400 lb.
func TestUplift_RoofJoistHandCalc(t *testing.T) {
	r := runUpliftPlan(t, 10, 60, "", 0)
	for id, want := range map[string]float64{"M1": 100, "M2": 200, "M3": 100} {
		bs := upliftOf(r, id)
		for j := 1; j <= 2; j++ {
			b := bs[j]
			if math.Abs(b.UpliftLb-want) > 5e-6*want || // results.json: loads to 6 significant digits
				!b.Flagged || b.Combo != "0.6D+0.6W(up)" {
				t.Errorf("%s bearing %d: %+v, want %v lb flagged (statics, written out)", id, j, b, want)
			}
		}
	}
	lines := export.UpliftLines(r.Uplift.Bearings)
	if len(lines) != 2 {
		t.Fatalf("support lines %+v, want the two walls", lines)
	}
	for _, l := range lines {
		if l.Count != 3 || l.Flagged != 3 || math.Abs(l.MaxLb-200) > 1e-9 || math.Abs(l.TotalLb-400) > 1e-9 {
			t.Errorf("line %s: %+v, want 3 bearings, largest 200, total 400 lb", l.Support, l)
		}
	}
}

// TestUplift_PositionOnDrawnMember: a joist drawn 1 in short of its wall
// bears on it (within the snap tolerance) at -1 in from its drawn start;
// the check runs on a member lengthened to reach the bearing, and the
// uplift is reported at the drawn member's position, as BlockingAtIn is:
// at_in -1 in, at the wall line x = 0. The span is still 120 in, so R =
// 100 lb as in TestUplift_RoofJoistHandCalc (statics, written out).
func TestUplift_PositionOnDrawnMember(t *testing.T) {
	r := runUpliftPlan(t, 10, 60, "", 1)
	b := upliftOf(r, "M1")[1]
	if math.Abs(b.AtIn+1) > 1e-9 || math.Abs(b.Point[0]) > 1e-9 || b.Point[1] != 16 || b.Support != "WALL handle 101" {
		t.Errorf("M1 bearing 1 at %v in, point %v on %q; want -1 in, (0, 16) on WALL handle 101", b.AtIn, b.Point, b.Support)
	}
	if math.Abs(b.UpliftLb-100) > 1e-9 {
		t.Errorf("M1 bearing 1: %v lb, want 100", b.UpliftLb)
	}
	if e := upliftOf(r, "M1")[2]; math.Abs(e.AtIn-119) > 1e-9 || math.Abs(e.Point[0]-120) > 1e-9 {
		t.Errorf("M1 bearing 2 at %v in, point %v; want 119 in, x = 120", e.AtIn, e.Point)
	}
}

// TestUplift_DemoRoofBays: in the demo, the roof bays are under net uplift
// and every bearing of theirs is listed with the reaction of statics,
// written out: net suction q = 0.6 W - 0.6 D (ASCE 7-16 2.4.1, 0.6D+0.6W),
// ROOF-EDGE 0.6(75) - 0.6(8) = 40.2 psf, ROOF-FIELD 0.6(40) - 0.6(8) =
// 19.2 psf (samples/demo/framecheck.toml); w = q x trib / 144 lb/in; a
// simple span L carries R = w (L/2 + e) at a bearing whose joist end runs
// e past its centre-line (the piece inside the wall); 0 for an end short
// of it. No floor member has uplift. (The canopy's roof, with its hoist
// and its girder, is the load path's: its bearings are not compared here.)
func TestUplift_DemoRoofBays(t *testing.T) {
	_, _, _, r := runDemoTo(t, t.TempDir())
	netPsf := map[string]float64{"ROOF-EDGE": 0.6*75 - 0.6*8, "ROOF-FIELD": 0.6*40 - 0.6*8}
	byID := map[string]*export.Member{}
	for i := range r.Members {
		byID[r.Members[i].ID] = &r.Members[i]
	}
	seen := map[string]int{}
	compared := 0
	for _, b := range r.Uplift.Bearings {
		m := byID[b.Member]
		if m.Zone == "CANOPY" {
			continue
		}
		q, roof := netPsf[m.Zone]
		if !roof {
			t.Errorf("%s (zone %s) listed with uplift %v lb", m.ID, m.Zone, b.UpliftLb)
			continue
		}
		seen[m.Zone]++
		if len(m.SpansIn) != 1 || m.OverhangsIn != [2]float64{} {
			continue // the demo's roof members are simple spans; nothing else to compare
		}
		e := b.AtIn // start: the piece before the first bearing
		if b.Bearing == 2 {
			e = m.LengthIn - b.AtIn
		}
		e = math.Max(e, 0)
		want := q * m.TribIn / 144 * (m.SpansIn[0]/2 + e)
		compared++
		if math.Abs(b.UpliftLb-want) > 5e-6*want || // results.json: loads to 6 significant digits
			b.Combo != "0.6D+0.6W(up)" || b.CD != 1.6 || b.Flagged != (want >= 50) {
			t.Errorf("%s bearing %d: %v lb (%s, CD %v, flagged %v), want %.4f lb under 0.6D+0.6W(up) (statics, written out)",
				m.ID, b.Bearing, b.UpliftLb, b.Combo, b.CD, b.Flagged, want)
		}
	}
	if seen["ROOF-EDGE"] == 0 || seen["ROOF-FIELD"] == 0 || compared == 0 {
		t.Errorf("uplift bearings by zone %v, %d compared: want both roof zones", seen, compared)
	}
}
