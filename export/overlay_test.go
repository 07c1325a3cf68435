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
			// One label per run and mark (J1, J2, J3), the ids of the four
			// members, one blocking note, the key: a title, the stamp, the datum and
			// a sample line and text for each of our six other layers.
			if d.count("LINE", LayerFail) != 1 || d.count("LINE", LayerBlocking) != 1 || d.count("TEXT", LayerLabel) != 3 ||
				d.count("TEXT", LayerUplift) != 4 || d.count("TEXT", LayerID) != 4 || d.count("TEXT", LayerBlocking) != 1 ||
				d.count("TEXT", LayerKey) != 9 || d.count("LINE", LayerKey) != 6 {
				t.Errorf("markup entities %d/%d/%d/%d/%d/%d/%d/%d, want 1/1/3/4/4/1/9/6", d.count("LINE", LayerFail),
					d.count("LINE", LayerBlocking), d.count("TEXT", LayerLabel), d.count("TEXT", LayerUplift),
					d.count("TEXT", LayerID), d.count("TEXT", LayerBlocking), d.count("TEXT", LayerKey), d.count("LINE", LayerKey))
			}
			if d.LayerCount != 8 || d.count("LAYER", "0") != 1 {
				t.Errorf("LAYER count %d, want layer 0 and our seven", d.LayerCount)
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
				// to 1e-6 of the drawing unit (dxfDecimals)
				if math.Abs(x-72/tc.div) > 5e-7 || math.Abs(y-56/tc.div) > 5e-7 {
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
	// One label per run and mark, from the fixture's checks (mark, size
	// @ spacing, governing check, ratio to 0.01), each midway between two
	// joists: J1 (M1 alone at y = 8, spacing 16) half a spacing below it;
	// J2 (M2 at y = 24, M3 at y = 40) between them; J3 (M4 alone, y = 56)
	// half a spacing below it (statics of the layout, written out).
	wantLabels := []Label{
		{At: [2]float64{72, 0}, Text: "J1 2x8@16 DEFL TOTAL 0.52"},
		{At: [2]float64{72, 32}, Text: "J2 2x8@16 DEFL TOTAL 0.69"},
		{At: [2]float64{72, 48}, Text: "J3 2x8@16 BENDING (BOTTOM) 1.12"},
	}
	if len(m.Labels) != len(wantLabels) {
		t.Fatalf("labels %+v, want %d", m.Labels, len(wantLabels))
	}
	for i, w := range wantLabels {
		if l := m.Labels[i]; l.Text != w.Text || math.Abs(l.At[0]-w.At[0]) > 1e-9 || math.Abs(l.At[1]-w.At[1]) > 1e-9 || l.AngleDeg != 0 {
			t.Errorf("label %d = %+v, want %q at %v", i, l, w.Text, w.At)
		}
	}
	// Ids at each midpoint, 1.1 id heights (0.5 x 1.2 in) off the line,
	// on the side away from the group's label.
	wantID := []float64{8 + 0.66, 24 - 0.66, 40 + 0.66, 56 + 0.66}
	for i, l := range m.IDs {
		if math.Abs(l.At[1]-wantID[i]) > 1e-9 || l.At[0] != 72 || l.HeightIn != 0.6 {
			t.Errorf("id %d = %+v, want y %v, height 0.6", i, l, wantID[i])
		}
	}
	if len(m.BlockingNotes) != 1 || m.BlockingNotes[0].Text != "ADD BLOCKING 1 ROW @ MIDSPAN" {
		t.Errorf("blocking notes %+v, want one: ADD BLOCKING 1 ROW @ MIDSPAN (B1 at 72 of 144 in)", m.BlockingNotes)
	}
	// Uplift labels: the four flagged bearings of the fixture, M2's 0.8 lb
	// (below report_lb 50) listed in results.json but not labelled; the
	// reaction rounded up to the pound, along the member, moved into it
	// from the bearing by 0.45 h x 13 characters + 0.5 h = 6.35 h with h =
	// 1.2 in (the text height below): 7.62 in, and off its line by 0.65 h
	// = 0.78 in.
	off := 6.35 * 1.2
	wantUp := []struct {
		at   [2]float64
		text string
	}{{[2]float64{off, 40.78}, "uplift 213 lb"}, {[2]float64{144 - off, 40.78}, "uplift 213 lb"},
		{[2]float64{off, 56.78}, "uplift 161 lb"}, {[2]float64{144 - off, 56.78}, "uplift 161 lb"}}
	if len(m.Uplifts) != len(wantUp) {
		t.Fatalf("%d uplift labels %+v, want %d", len(m.Uplifts), m.Uplifts, len(wantUp))
	}
	for i, w := range wantUp {
		l := m.Uplifts[i]
		if math.Abs(l.At[0]-w.at[0]) > 1e-9 || math.Abs(l.At[1]-w.at[1]) > 1e-9 || l.Text != w.text || l.AngleDeg != 0 {
			t.Errorf("uplift label %d = %+v, want %q at %v, 0 deg", i, l, w.text, w.at)
		}
	}
	// Extent 144 in -> 144/120 = 1.2 in, under 0.6 x 12 in (smallest trib).
	if math.Abs(m.TextHeightIn-1.2) > 1e-12 {
		t.Errorf("text height %v, want 1.2", m.TextHeightIn)
	}

	// Drawing in feet: inch coordinates come from Start/End x 12; a member
	// drawn right to left is highlighted on the error layer with its reason;
	// a vertical member alone gets its label 1.2 text heights to its left.
	r2 := &Results{Members: []Member{
		{ID: "M1", Start: [2]float64{10, 0}, End: [2]float64{0, 0}, Status: StatusError, SpacingIn: 16},
		{ID: "M2", Mark: "J1", StartIn: [2]float64{1, 2}, EndIn: [2]float64{1, 50}, Status: StatusPass, MaxRatio: 0.5},
	}}
	m2 := MarkupFromResults(r2, 12)
	if len(m2.Highlights) != 0 || len(m2.Errors) != 1 || m2.Errors[0].A != [2]float64{120, 0} ||
		len(m2.Reasons) != 1 || m2.Reasons[0].AngleDeg != 0 || m2.Reasons[0].Text != "M1 ERROR: NOT CHECKED" {
		t.Errorf("M1: %+v %+v %+v", m2.Highlights, m2.Errors, m2.Reasons)
	}
	if len(m2.Labels) != 1 || math.Abs(m2.Labels[0].At[0]-2.2) > 1e-9 || m2.Labels[0].At[1] != 26 || m2.Labels[0].AngleDeg != 90 {
		t.Errorf("M2 label %+v, want at (2.2, 26), 90 deg", m2.Labels)
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
