package framing

import (
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// A post drawn above a beam on a point-load layer, as posts are drawn (a
// closed polyline or 4 lines), is a point load at its centre with its
// text beside it; one with no readable text is an error naming its
// handle, never a load of zero. Expected positions are the drawn geometry
// written out (common practice, no source).
func TestPointLoadPostOutlines(t *testing.T) {
	p := loadPathPlan()
	// on the girder (x = 200, y = 72..216, its Start at y = 72):
	//   A: a closed 3.5 x 3.5 LWPOLYLINE centred at (200, 108), "P: 1200 D, 800 L"
	//   B: 4 LINEs 5.5 x 5.5 centred at (200, 180), "P: 2000 D" beside it
	//   C: a closed polyline centred at (200, 144) with no text: error
	//   D: a closed outline 40 x 40 at (200, 150): too big, a warning, no mark
	//   a leader line on the layer: not read
	p.poly("POINT-LOAD", true, Point{X: 198.25, Y: 106.25}, Point{X: 201.75, Y: 106.25}, Point{X: 201.75, Y: 109.75}, Point{X: 198.25, Y: 109.75})
	p.text("POINT-LOAD", "P: 1200 D, 800 L", 204, 108, 3)
	p.box4("POINT-LOAD", 197.25, 177.25, 5.5, 5.5).text("POINT-LOAD", "P: 2000 D", 205, 181, 3)
	p.poly("POINT-LOAD", true, Point{X: 198.25, Y: 142.25}, Point{X: 201.75, Y: 142.25}, Point{X: 201.75, Y: 145.75}, Point{X: 198.25, Y: 145.75})
	p.poly("POINT-LOAD", true, Point{X: 230, Y: 230}, Point{X: 270, Y: 230}, Point{X: 270, Y: 270}, Point{X: 230, Y: 270})
	p.line("POINT-LOAD", 210, 120, 240, 140)
	pl := p.group(loadPathOptions())
	g := -1
	for k := range pl.Beams {
		if strings.Contains(pl.Beams[k].Callout, "GLB") {
			g = k
		}
	}
	if g < 0 {
		t.Fatalf("girder not found: %+v", pl.Beams)
	}
	byAt := map[[2]float64]PointLoadMark{}
	for _, m := range pl.PointLoads {
		byAt[[2]float64{m.At.X, m.At.Y}] = m
	}
	a, ok := byAt[[2]float64{200, 108}]
	if !ok || a.Err != "" || a.Beam != g || a.Member != -1 || a.Loads != (PointLoads{DeadLb: 1200, LiveLb: 800}) {
		t.Errorf("A (polyline post above): %+v", a)
	}
	checkNear(t, "A along the girder", a.AtIn, 36, 1e-9)
	b, ok := byAt[[2]float64{200, 180}]
	if !ok || b.Err != "" || b.Beam != g || b.Loads != (PointLoads{DeadLb: 2000}) {
		t.Errorf("B (4-line post above): %+v", b)
	}
	checkNear(t, "B along the girder", b.AtIn, 108, 1e-9)
	c, ok := byAt[[2]float64{200, 144}]
	if !ok || c.Beam != g || !strings.Contains(c.Err, "no text beside it") || !strings.Contains(c.Err, "handle "+c.Pos.Handle) ||
		c.Loads != (PointLoads{}) {
		t.Errorf("C (no text): %+v", c)
	}
	if _, ok := byAt[[2]float64{250, 250}]; ok {
		t.Errorf("D (40 in outline) read as a mark")
	}
	found := false
	for _, is := range pl.Issues {
		if is.Code == CodePointLoadText && is.Pos == c.Pos && is.Severity == dxfimport.SevError {
			found = true
		}
	}
	if !found {
		t.Errorf("no FRM231 error at C's handle: %v", pl.Issues)
	}
	codes := issueCodes(pl.Issues)
	if codes[CodePointLoadSkipped] != 1 {
		t.Errorf("FRM236 findings %d, want 1 (the 40 in outline): %v", codes[CodePointLoadSkipped], pl.Issues)
	}
	if n := pl.Ignored["POINT-LOAD (LINE)"]; n != 1 {
		t.Errorf("ignored leader lines %d, want 1 (%v)", n, pl.Ignored)
	}
}
