package main

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestPointLoadInOutputs: the demo's hoist ("P: 400 D, 300 L", drawn at y =
// 500 on the canopy joist M76, which starts at y = 399.25 and bears on the
// 3.5 in wall at y = 400) is in results.json with the member, 100.75 in
// from its start and 98.25 in from the wall's face (500 - 399.25; 500 -
// 401.75: plan arithmetic), and the report's calculation of its mark lists
// it and adds it into the combinations, so that the governing moment can
// be followed by hand: D + 0.75L + 0.75S on the 144 in span, w = 20 +
// 0.75(50) = 57.5 plf and P = 400 + 0.75(300) = 625 lb at a = 100 in,
// M = w a b / 2 + P a b / L = 4.792(100)(44)/2 + 625(100)(44)/144 =
// 29,639 lb-in (statics, simple span).
func TestPointLoadInOutputs(t *testing.T) {
	dir := t.TempDir()
	_, _, _, r := runDemoTo(t, dir)
	m := memberByID(t, r, "M76")
	if len(m.PointLoads) != 1 {
		t.Fatalf("M76 point loads %+v, want the hoist", m.PointLoads)
	}
	p := m.PointLoads[0]
	if math.Abs(p.AtIn-100.75) > 1e-9 || math.Abs(p.FromFaceIn-98.25) > 1e-9 || p.DeadLb != 400 || p.LiveLb != 300 ||
		p.RoofLiveLb != 0 || p.SnowLb != 0 || p.WindDownLb != 0 || p.WindUpLb != 0 || p.UpliftDeadLb != 0 {
		t.Errorf("hoist %+v, want 400 D (none relied on against uplift) and 300 L at 100.75 in (98.25 from the face)", p)
	}
	for i := range r.Members {
		if o := &r.Members[i]; o.ID != "M76" && len(o.PointLoads) > 0 {
			t.Errorf("%s carries point loads %+v: only M76 is under the hoist", o.ID, o.PointLoads)
		}
	}
	want := 4.792*100*44/2 + 625.0*100*44/144
	bt := checkOf(t, m, "bending-top")
	if got := bt.Actual * 1.5 * 7.25 * 7.25 / 6; math.Abs(got-want) > 0.001*want || bt.Combo != "D+0.75L+0.75S" {
		t.Errorf("bending-top %s: M = %.0f lb-in, want %.0f under D+0.75L+0.75S", bt.Combo, got, want)
	}
	// Not relied on against uplift, the hoist leaves M76's net uplift at
	// each bearing what its neighbour M75's is: the same span, tributary
	// width and zone, and 0.6D + 0.6W holds no L (ASCE 7-16 2.4.1).
	up := map[string][]float64{}
	for _, b := range r.Uplift.Bearings {
		up[b.Member] = append(up[b.Member], b.UpliftLb)
	}
	if len(up["M76"]) != 2 || len(up["M75"]) != 2 || math.Abs(up["M76"][0]-up["M75"][0]) > 1e-6 || math.Abs(up["M76"][1]-up["M75"][1]) > 1e-6 {
		t.Errorf("uplift M76 %v, M75 %v: want the same", up["M76"], up["M75"])
	}
	raw, err := os.ReadFile(filepath.Join(dir, reportName))
	if err != nil {
		t.Fatal(err)
	}
	page := string(raw)
	for _, s := range []string{
		`<h4>Point loads</h4>`,
		// its dead load is not relied on against uplift, and the report says so
		`P1 (P: 400 D, 300 L) at 8&#39;-2 1/4&#34;: D 400 lb, L 300 lb; its D is not relied on against uplift (0.6D &#43; 0.6W takes none of it: it may be taken away)`,
		// html/template writes "+" as &#43;
		`<td>D &#43; 0.75 L &#43; 0.75 S</td><td>20 &#43; 0.75(50)</td><td class="n">57.5</td><td>400 &#43; 0.75(300)</td><td class="n">625</td><td class="n">1.15</td>`,
	} {
		if !strings.Contains(page, s) {
			t.Errorf("report.html has no %q", s)
		}
	}
}
