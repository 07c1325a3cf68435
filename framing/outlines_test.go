package framing

import (
	"fmt"
	"framecheck/dxfimport"
	"strings"
	"testing"
)

// rect draws a joist outline of four LINEs around the centre line x from
// y0 to y1, half-thickness h.
func (p *plan) rect(x, y0, y1, h float64) *plan {
	return p.line("JOIST", x-h, y0, x-h, y1).line("JOIST", x-h, y1, x+h, y1).
		line("JOIST", x+h, y1, x+h, y0).line("JOIST", x+h, y0, x-h, y0)
}

func issuesWith(pl *Plan, code string) []string {
	var out []string
	for _, i := range pl.Issues {
		if i.Code == code {
			out = append(out, i.Error())
		}
	}
	return out
}

func TestOutlineNotARectangleIsNamedAndTheRestRuns(t *testing.T) {
	// Joists at x = 0, 16, 32, 48 (outlines 1.5 in thick) over walls at
	// y = 0 and 144. The one at 16 is tapered (1.5 in at one end, 5.5 in
	// at the other: its long sides 1.6 degrees apart), the one at 32 has
	// a pointed end (5 lines), and a closed polyline at 64 is a
	// trapezoid. Each is an error naming its lines' handles; the joists
	// at 0 and 48 are still members with their spans.
	p := newPlan().walls(-10, 100, 0, 144).rect(0, 0, 144, 0.75)
	p.line("JOIST", 15.25, 0, 15.25, 144).line("JOIST", 15.25, 144, 20.75, 144).
		line("JOIST", 20.75, 144, 16.75, 0).line("JOIST", 16.75, 0, 15.25, 0)
	p.line("JOIST", 31.25, 0, 31.25, 138).line("JOIST", 31.25, 138, 32, 144).line("JOIST", 32, 144, 32.75, 138).
		line("JOIST", 32.75, 138, 32.75, 0).line("JOIST", 32.75, 0, 31.25, 0)
	p.rect(48, 0, 144, 0.75)
	p.poly("JOIST", true, Point{X: 63, Y: 0}, Point{X: 65, Y: 0}, Point{X: 64.5, Y: 144}, Point{X: 63.5, Y: 144})
	pl := p.group(DefaultOptions())
	bad := issuesWith(pl, CodeNotRectangle)
	if len(bad) != 3 {
		t.Fatalf("FRM216 findings %q, want 3 (tapered, pointed, trapezoid polyline)", bad)
	}
	all := strings.Join(bad, "\n")
	// handles: walls 101-102, the outline at 0 103-106, tapered 107-10A,
	// pointed 10B-10F, the outline at 48 110-113, the polyline 114
	for _, h := range []string{"handles 107, 108, 109, 10A", "handles 10B, 10C, 10D, 10E, 10F", "handle 114"} {
		if !strings.Contains(all, h) {
			t.Errorf("findings %q do not name %s", all, h)
		}
	}
	for _, x := range []float64{0, 48} {
		m := member(t, pl, x, 72)
		if m.Error || len(m.Spans()) != 1 || !near(m.Spans()[0], 144, 1e-9) {
			t.Errorf("x=%g: error %v spans %v, want a good member of 144 in", x, m.Error, m.Spans())
		}
	}
	// the three bad ones are members in error, on the centre of the strip
	// each fills, so that they stay their neighbours' neighbours
	if len(pl.Members) != 5 {
		t.Fatalf("members %d, want 5", len(pl.Members))
	}
	var bads int
	for _, m := range pl.Members {
		if m.Error {
			bads++
			if !strings.Contains(strings.Join(m.Messages, " "), "not a rectangle") {
				t.Errorf("%s: messages %q", m.ID, m.Messages)
			}
		}
	}
	if bads != 3 {
		t.Errorf("%d error members, want 3", bads)
	}
	// x=48 keeps its neighbours at 32 and 64, bad as they are: 16 + 16 / 2
	checkNear(t, "trib of x=48", member(t, pl, 48, 72).TribIn, 16, 1e-9)
}

func TestBuiltUpOutlinesAreOneMember(t *testing.T) {
	// A doubled joist drawn as two outlines touching (lines at x = 31.25,
	// 32.75, 32.75, 34.25) and a tripled one as three closed polylines,
	// between single outlines at 0 and 64 and 96: one member each, 2 and
	// 3 plies, sized "(2) 2x10" and "(3) 2x10" (checked as one member of
	// width n b), and the lumber takeoff counts every ply as a 2x10.
	p := newPlan().walls(-10, 140, 0, 144).rect(0, 0, 144, 0.75).rect(32, 0, 144, 0.75).rect(33.5, 0, 144, 0.75)
	for _, x := range []float64{62.5, 64, 65.5} {
		p.poly("JOIST", true, Point{X: x - 0.75, Y: 0}, Point{X: x + 0.75, Y: 0}, Point{X: x + 0.75, Y: 144}, Point{X: x - 0.75, Y: 144})
	}
	p.rect(96, 0, 144, 0.75)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 4 {
		t.Fatalf("members %d, want 4 (issues %v)", len(pl.Members), pl.Issues)
	}
	for _, w := range []struct {
		x     float64
		plies int
		thick float64
	}{{0, 1, 1.5}, {32.75, 2, 3}, {64, 3, 4.5}, {96, 1, 1.5}} {
		m := member(t, pl, w.x, 72)
		checkNear(t, "drawn thickness", m.DrawnThicknessIn, w.thick, 1e-9)
		wantSize := "2x10"
		if w.plies > 1 {
			wantSize = fmt.Sprintf("(%d) 2x10", w.plies)
		}
		if m.Plies != w.plies || m.Error || m.Size != wantSize {
			t.Errorf("x=%g: plies %d error %v size %q, want %d plies, %s", w.x, m.Plies, m.Error, m.Size, w.plies, wantSize)
		}
		if w.plies > 1 && !strings.Contains(strings.Join(m.Messages, " "), "built-up member of") {
			t.Errorf("x=%g: messages %q", w.x, m.Messages)
		}
	}
	if n := len(issuesWith(pl, CodeBuiltUp)); n != 2 {
		t.Errorf("FRM218 findings %d, want 2", n)
	}
	if n := len(issuesWith(pl, CodeThickness)); n != 0 {
		t.Errorf("thickness warnings %q, want none (plies of 1.5 in, NDS 2018 Supplement Table 1B)", issuesWith(pl, CodeThickness))
	}
	if to := BuildTakeoff(pl, nil); to.JoistCount != 1+2+3+1 || len(to.Joists) != 1 || to.Joists[0].Size != "2x10" {
		t.Errorf("takeoff joists %d in %+v, want 7 pieces of 2x10", to.JoistCount, to.Joists)
	}
}

func TestOutlineThicknessAgainstSize(t *testing.T) {
	// a 2x10 (dressed 1.5 in thick, NDS 2018 Supplement Table 1B) drawn
	// 3 in thick with no line between: one member, a warning naming both
	// thicknesses; the span and trib come from the centre line.
	pl := newPlan().walls(-10, 100, 0, 144).rect(0, 0, 144, 1.5).rect(16, 0, 144, 0.75).group(DefaultOptions())
	if len(pl.Members) != 2 {
		t.Fatalf("members %d", len(pl.Members))
	}
	w := issuesWith(pl, CodeThickness)
	if len(w) != 1 || !strings.Contains(w[0], "3.00 in thick") || !strings.Contains(w[0], "2x10 is 1.50 in thick") {
		t.Errorf("thickness warnings %q", w)
	}
	if m := member(t, pl, 0, 72); m.Error || !near(m.TribIn, 8, 1e-9) {
		t.Errorf("3 in outline: error %v trib %g, want a member with trib 8", m.Error, m.TribIn)
	}
}

func TestArcsOnSupportLayersReportedOnce(t *testing.T) {
	// 80 door swings on the wall layer: one finding with the count and
	// three handles, not 80
	p := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16)
	for i := 0; i < 80; i++ {
		p.d.Entities = append(p.d.Entities, arcEntity(p, float64(i)))
	}
	pl := p.group(DefaultOptions())
	f := issuesWith(pl, CodeArcSegment)
	if len(f) != 1 || !strings.Contains(f[0], "80 curved entities") || strings.Count(f[0], ",") < 2 {
		t.Errorf("findings %q, want one naming 80 and three handles", f)
	}
	if len(pl.Members) != 2 || pl.Members[0].Error {
		t.Errorf("members %+v", pl.Members)
	}
}

func arcEntity(p *plan, x float64) dxfimport.Entity {
	return dxfimport.Entity{Kind: dxfimport.KindArc, Pos: p.pos("WALL"), Points: []Point{{X: x, Y: 0}}, RadiusIn: 30, StartDeg: 0, EndDeg: 90}
}

func TestBlockingDrawnAsOutlinesBetweenOutlines(t *testing.T) {
	// Joists drawn as outlines at x = 0, 16, 32, 48 between walls at
	// y = 0 and 144; blocking drawn as small rectangles (1.5 x 14.5 in)
	// between them at y = 71.25..72.75, and as single lines staggered at
	// y = 100 / 103. No blocking piece is a member; each member is braced
	// at 72 and at the staggered pieces it touches; 3 + 3 pieces drawn,
	// each 16 - 1.5 = 14.5 in clear (NDS 2018 Supplement Table 1B).
	p := newPlan().walls(-10, 100, 0, 144)
	for _, x := range []float64{0, 16, 32, 48} {
		p.rect(x, 0, 144, 0.75)
	}
	for i, x := range []float64{0, 16, 32} {
		p.line("JOIST", x+0.75, 71.25, x+15.25, 71.25).line("JOIST", x+15.25, 71.25, x+15.25, 72.75).
			line("JOIST", x+15.25, 72.75, x+0.75, 72.75).line("JOIST", x+0.75, 72.75, x+0.75, 71.25)
		y := 100 + 3*float64(i%2)
		p.line("JOIST", x+0.75, y, x+15.25, y)
	}
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 4 || len(pl.DrawnBlocking) != 6 {
		t.Fatalf("members %d, drawn blocking %d; want 4 and 6 (issues %v)", len(pl.Members), len(pl.DrawnBlocking), pl.Issues)
	}
	if c := issueCodes(pl.Issues); c[CodeThickness] != 0 || c[CodeNotRectangle] != 0 {
		t.Errorf("issues %v", pl.Issues)
	}
	for _, w := range []struct {
		x  float64
		at []float64
	}{{0, []float64{72, 100}}, {16, []float64{72, 100, 103}}, {32, []float64{72, 100, 103}}, {48, []float64{72, 100}}} {
		m := member(t, pl, w.x, 72)
		if len(m.ExistingBlockingAtIn) != len(w.at) {
			t.Errorf("x=%g: blocking at %v, want %v", w.x, m.ExistingBlockingAtIn, w.at)
			continue
		}
		for i := range w.at {
			checkNear(t, "blocking position", m.ExistingBlockingAtIn[i], w.at[i], 1e-9)
		}
	}
	to := BuildTakeoff(pl, nil)
	if to.ExistingBlockingPieces != 6 || len(to.ExistingBlocking) != 1 || !near(to.ExistingBlocking[0].TotalLengthIn, 6*14.5, 1e-9) {
		t.Errorf("takeoff existing blocking %+v", to.ExistingBlocking)
	}
	if to.JoistCount != 4 {
		t.Errorf("takeoff joists %d, want 4", to.JoistCount)
	}
}
