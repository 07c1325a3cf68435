package framing

import (
	"strings"
	"testing"
)

// Supports of several lines (issue 14 item 2). Expected values are
// closed-form geometry (DOMAIN.md "Members from a plan": span centre to
// centre of bearings; common practice, no source).

func TestSupportGroupsAndShortLines(t *testing.T) {
	// A joist x=0 from y=0 to 400, continuous over:
	//   a wall at y = 0..5.5 drawn as 3 lines (0, 0.5 sheathing, 5.5),
	//   a window wall at y = 200..205.5 drawn as 6 lines, the interior
	//     ones (sill, stool) 30 in long, under the joist,
	//   a beam at y = 394.5..400 drawn as two lines;
	// plus on the wall layer a 4 in tick crossing the joist at y = 100
	// at 45 degrees and a 12 in piece across it at y = 300 (both shorter
	// than a tenth of the joist and than 12 + 1.5 in: not supports).
	// Bearings: 2.75 (5.5 long), 202.75 (5.5), 397.25 (5.5); spans 200,
	// 194.5.
	p := newPlan()
	p.walls(-20, 20, 0, 0.5, 5.5)
	for _, y := range []float64{200, 201, 202.5, 203, 204.5, 205.5} {
		x0, x1 := -20.0, 20.0
		if y != 200 && y != 205.5 {
			x0, x1 = -15, 15
		}
		p.line("WALL", x0, y, x1, y)
	}
	p.walls(-20, 20, 394.5, 400)
	p.line("WALL", -2, 98, 2, 102)
	p.line("WALL", -6, 300, 6, 300)
	p.joists(0, 400, 0)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 1 {
		t.Fatalf("members %d", len(pl.Members))
	}
	m := &pl.Members[0]
	if len(m.Bearings) != 3 {
		t.Fatalf("bearings %+v, want 3", m.Bearings)
	}
	for i, w := range []struct{ at, lb float64 }{{2.75, 5.5}, {202.75, 5.5}, {397.25, 5.5}} {
		checkNear(t, "bearing centre", m.Bearings[i].AtIn, w.at, 1e-9)
		checkNear(t, "bearing length", m.Bearings[i].LengthIn, w.lb, 1e-9)
	}
	// a wall drawn in 36 in pieces still bears a 400 in member: the
	// pieces are longer than the thickest wall plus the snap tolerance
	p = newPlan().walls(-20, 20, 0, 400)
	p.line("WALL", -18, 200, 18, 200)
	p.joists(0, 400, 0)
	pl = p.group(DefaultOptions())
	if sp := pl.Members[0].Spans(); len(sp) != 2 || !near(sp[0], 200, 1e-9) {
		t.Errorf("spans %v, want [200 200]", sp)
	}
}

func TestBulgedSupportPolylinesReportedOnce(t *testing.T) {
	// three wall polylines, each with an arc segment, and a door swing:
	// one warning (an arc segment may be a curved wall) counting 4 and
	// naming three handles; the straight segments still bear the joist
	p := newPlan().joists(0, 144, 0)
	for i, y := range []float64{0, 144, 300} {
		p.poly("WALL", false, Point{X: -20, Y: y}, Point{X: 20, Y: y}, Point{X: 40, Y: y + 20})
		p.d.Entities[len(p.d.Entities)-1].Bulges = []float64{0, 0.5 + float64(i), 0}
	}
	p.d.Entities = append(p.d.Entities, arcEntity(p, 0))
	pl := p.group(DefaultOptions())
	f := issuesWith(pl, CodeArcSegment)
	if len(f) != 1 {
		t.Fatalf("findings %q", f)
	}
	for _, want := range []string{"warning FRM213", "4 curved entities", "1 arcs or circles, 3 polylines", "handles 102, 103, 104"} {
		if !strings.Contains(f[0], want) {
			t.Errorf("finding %q lacks %q", f[0], want)
		}
	}
	if sp := pl.Members[0].Spans(); len(sp) != 1 || !near(sp[0], 144, 1e-9) {
		t.Errorf("spans %v", sp)
	}
}
