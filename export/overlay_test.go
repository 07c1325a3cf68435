package export

import (
	"math"
	"path/filepath"
	"strconv"
	"testing"
)

func TestWriteOverlay(t *testing.T) {
	m := fixtureMarkup(t, 1)
	for _, tc := range []struct {
		units string
		div   float64 // drawing units per inch: 1/UnitToInch
	}{{"in", 1}, {"ft", 12}, {"mm", 1 / 25.4}} {
		t.Run(tc.units, func(t *testing.T) {
			path := filepath.Join(t.TempDir(), "overlay.dxf")
			if err := WriteOverlay(path, m, tc.units); err != nil {
				t.Fatal(err)
			}
			d := parseDXF(t, path)
			if d.count("LINE", LayerFail) != 1 || d.count("LINE", LayerBlocking) != 1 || d.count("TEXT", LayerLabel) != 4 ||
				d.count("TEXT", LayerUplift) != 4 {
				t.Errorf("markup entities %d/%d/%d/%d, want 1/1/4/4", d.count("LINE", LayerFail),
					d.count("LINE", LayerBlocking), d.count("TEXT", LayerLabel), d.count("TEXT", LayerUplift))
			}
			if d.LayerCount != 5 || d.count("LAYER", "0") != 1 {
				t.Errorf("LAYER count %d, want layer 0 and our four", d.LayerCount)
			}
			if d.Seed != "" {
				t.Errorf("overlay has $HANDSEED %s; R12 without handles wanted", d.Seed)
			}
			// B1 runs from (72, 24) to (72, 56) in.
			for _, e := range d.Ents {
				if e.Layer != LayerBlocking || e.Kind != "LINE" {
					continue
				}
				x, _ := strconv.ParseFloat(e.Values[10][0], 64)
				y, _ := strconv.ParseFloat(e.Values[21][0], 64)
				if math.Abs(x-72/tc.div) > 1e-9*72/tc.div || math.Abs(y-56/tc.div) > 1e-9*56/tc.div {
					t.Errorf("blocking line at x=%v y2=%v, want %v %v", x, y, 72/tc.div, 56/tc.div)
				}
			}
		})
	}
	if err := WriteOverlay(filepath.Join(t.TempDir(), "o.dxf"), m, "yd"); err == nil {
		t.Error("unit yd accepted")
	}
}

func TestMarkupFromResults(t *testing.T) {
	r := loadFixture(t)
	m := MarkupFromResults(r, 1)
	if len(m.Highlights) != 1 || m.Highlights[0].Ref != "M4" {
		t.Errorf("highlights %+v, want M4 only", m.Highlights)
	}
	if len(m.BlockingAdds) != 1 || m.BlockingAdds[0].Ref != "B1" {
		t.Errorf("blocking adds %+v, want B1 only (B2 is drawn)", m.BlockingAdds)
	}
	wantText := []string{"J1 0.52", "J2 0.69", "J2 0.69", "J3 1.12"}
	for i, l := range m.Labels {
		if l.Text != wantText[i] {
			t.Errorf("label %d = %q, want %q", i, l.Text, wantText[i])
		}
	}
	// M1 runs (0,8)-(144,8): midpoint (72, 8), horizontal.
	if l := m.Labels[0]; l.At != [2]float64{72, 8} || l.AngleDeg != 0 {
		t.Errorf("label 0 at %v angle %v, want (72, 8) 0", l.At, l.AngleDeg)
	}
	// Uplift labels: the four flagged bearings of the fixture, M2's 0.8 lb
	// (below report_lb 50) listed in results.json but not labelled; the
	// reaction rounded up to the pound, along the member, moved into it
	// from the bearing by 0.45 h x 13 characters + 0.5 h = 6.35 h with h =
	// 1.2 in (the text height below): 7.62 in.
	off := 6.35 * 1.2
	wantUp := []struct {
		at   [2]float64
		text string
	}{{[2]float64{off, 40}, "uplift 213 lb"}, {[2]float64{144 - off, 40}, "uplift 213 lb"},
		{[2]float64{off, 56}, "uplift 161 lb"}, {[2]float64{144 - off, 56}, "uplift 161 lb"}}
	if len(m.Uplifts) != len(wantUp) {
		t.Fatalf("%d uplift labels %+v, want %d", len(m.Uplifts), m.Uplifts, len(wantUp))
	}
	for i, w := range wantUp {
		l := m.Uplifts[i]
		if math.Abs(l.At[0]-w.at[0]) > 1e-9 || l.At[1] != w.at[1] || l.Text != w.text || l.AngleDeg != 0 {
			t.Errorf("uplift label %d = %+v, want %q at %v, 0 deg", i, l, w.text, w.at)
		}
	}
	// Extent 144 in -> 144/120 = 1.2 in, under 0.6 x 12 in (smallest trib).
	if math.Abs(m.TextHeightIn-1.2) > 1e-12 {
		t.Errorf("text height %v, want 1.2", m.TextHeightIn)
	}

	// Drawing in feet: inch coordinates come from Start/End x 12; a member
	// drawn right to left gets a readable label angle; an error member says so.
	r2 := &Results{Members: []Member{
		{ID: "M1", Start: [2]float64{10, 0}, End: [2]float64{0, 0}, Status: StatusError, SpacingIn: 16},
		{ID: "M2", Mark: "J1", StartIn: [2]float64{1, 2}, EndIn: [2]float64{1, 50}, Status: StatusPass, MaxRatio: 0.5},
	}}
	m2 := MarkupFromResults(r2, 12)
	if m2.Highlights[0].A != [2]float64{120, 0} || m2.Labels[0].AngleDeg != 0 || m2.Labels[0].Text != "M1 ERROR" {
		t.Errorf("M1: %+v %+v", m2.Highlights[0], m2.Labels[0])
	}
	if m2.Labels[1].At != [2]float64{1, 26} || m2.Labels[1].AngleDeg != 90 {
		t.Errorf("M2 label %+v, want at (1, 26), 90 deg", m2.Labels[1])
	}
}

func TestLabelHeightIn(t *testing.T) {
	// extent/120 clamped to [1, 24] in (common practice, no source).
	for _, tc := range []struct{ extent, want float64 }{{0, 1}, {60, 1}, {480, 4}, {2400, 20}, {1e6, 24}} {
		if got := LabelHeightIn(tc.extent); got != tc.want {
			t.Errorf("LabelHeightIn(%v) = %v, want %v", tc.extent, got, tc.want)
		}
	}
}
