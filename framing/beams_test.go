package framing

import (
	"slices"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// Beams found among the support lines (issue 17). Expected values are the
// drawn geometry written out (positions along a beam from its Start, the
// centre line between its outermost lines; common practice, no source).

// loadPathPlan draws the load-path scenario that
// testdata/gen_loadpath.py also writes with ezdxf (keep the two alike):
//
//   - a single-line bearing wall on y = 0 and on y = 288 (x -20..300) and
//     one on x = 0 (y -20..300);
//   - 8 joists at x = 16..128 (16 in o.c.) from the south wall to the
//     flush beam's centre line y = 144, and 8 from there to the north
//     wall;
//   - the flush beam FB: 4 lines (3 plies of 2x, 4.5 in) at y = 141.75,
//     143.25, 144.75, 146.25 from x = 0 to 198.25 (the girder's face),
//     callout "(3) 2x12";
//   - the girder G: 2 lines at x = 198.25 and 201.75 (3.5 in) from
//     y = 72 to 216 with end caps, callout "5 1/8 x 12 GLB 24F-1.8E", on
//     two circle posts at (200, 72) and (200, 216);
//   - the header H: one line on y = 400 from x = 0 to 72, callout
//     "4x12" under it, on two 3.5 in square posts of 4 lines centred at x = 1.75
//     and 70.25, carrying 4 joists from y = 400 to a wall at y = 500;
//   - a dropped beam on y = 600 from x = 0 to 100 with nothing under it;
//   - point loads: "P: 1200 D, 800 L" on the joist at x = 64, y = 72;
//     "RTU-1" on the joist at x = 96, y = 216; "P: 500 D" at (250, 600),
//     on nothing; "P: lots D" on the joist at x = 32, y = 100.
func loadPathPlan() *plan {
	p := newPlan()
	p.line("WALL", -20, 0, 300, 0).line("WALL", -20, 288, 300, 288).line("WALL", 0, -20, 0, 300)
	for x := 16.0; x <= 128; x += 16 {
		p.line("JOIST", x, 0, x, 144).line("JOIST", x, 144, x, 288)
	}
	for _, y := range []float64{141.75, 143.25, 144.75, 146.25} {
		p.line("BEAM-FLUSH", 0, y, 198.25, y)
	}
	p.text("FRAMING-NOTE", "(3) 2x12", 150, 150, 4)
	p.line("BEAM-DROP", 198.25, 72, 198.25, 216).line("BEAM-DROP", 201.75, 72, 201.75, 216)
	p.line("BEAM-DROP", 198.25, 72, 201.75, 72).line("BEAM-DROP", 198.25, 216, 201.75, 216)
	p.text("FRAMING-NOTE", "5 1/8 x 12 GLB 24F-1.8E", 206, 150, 4)
	p.circle("POST", 200, 72, 2.75).circle("POST", 200, 216, 2.75)
	p.line("BEAM-DROP", 0, 400, 72, 400)
	p.text("FRAMING-NOTE", "4x12", 40, 396, 4)
	p.box4("POST", 0, 398.25, 3.5, 3.5).box4("POST", 68.5, 398.25, 3.5, 3.5)
	p.line("WALL", -20, 500, 100, 500)
	for x := 16.0; x <= 64; x += 16 {
		p.line("JOIST", x, 400, x, 500)
	}
	p.line("BEAM-DROP", 0, 600, 100, 600)
	p.point("POINT-LOAD", 64, 72).text("POINT-LOAD", "P: 1200 D, 800 L", 66, 73, 3)
	p.circle("POINT-LOAD", 96, 216, 1).text("POINT-LOAD", "RTU-1", 98, 217, 3)
	p.point("POINT-LOAD", 250, 600).text("POINT-LOAD", "P: 500 D", 252, 601, 3)
	p.point("POINT-LOAD", 32, 100).text("POINT-LOAD", "P: lots D", 34, 101, 3)
	return p
}

func TestBeamsOfTheLoadPath(t *testing.T) {
	pl := loadPathPlan().group(loadPathOptions())
	checkLoadPathPlan(t, pl, "test.dxf")
}

// checkLoadPathPlan checks the grouping of the load-path scenario (see
// loadPathPlan), drawn by our writer or by ezdxf.
func checkLoadPathPlan(t *testing.T, pl *Plan, file string) {
	t.Helper()
	if len(pl.Beams) != 4 {
		for _, b := range pl.Beams {
			t.Logf("%s %s %v %v", b.ID, b.Kind, b.Start, b.End)
		}
		t.Fatalf("beams %d, want 4", len(pl.Beams))
	}
	fb, g, h, loose := &pl.Beams[0], &pl.Beams[1], &pl.Beams[2], &pl.Beams[3]
	// B1: the flush beam, its centre line y = (141.75 + 146.25) / 2 = 144
	if fb.ID != "B1" || fb.Kind != KindFlushBeam || fb.Plies != 3 || len(fb.Lines) != 4 || fb.Rigid {
		t.Errorf("B1 %s %s plies %d lines %d rigid %v", fb.ID, fb.Kind, fb.Plies, len(fb.Lines), fb.Rigid)
	}
	checkNear(t, "B1 width", fb.WidthIn, 4.5, 1e-9)
	checkNear(t, "B1 length", fb.LengthIn, 198.25, 1e-9)
	checkNear(t, "B1 start y", fb.Start.Y, 144, 1e-9)
	if fb.Callout != "(3) 2x12" || fb.Size != "(3) 2x12" {
		t.Errorf("B1 callout %q size %q", fb.Callout, fb.Size)
	}
	if len(fb.Bearings) != 2 {
		t.Fatalf("B1 bearings %+v, want the west wall and the girder", fb.Bearings)
	}
	w, onG := fb.Bearings[0], fb.Bearings[1]
	if w.Kind != BeamOnWall || w.Index < 0 || pl.Supports[w.Index].Kind != KindBearingWall || !near(pl.Supports[w.Index].A.X, 0, 1e-9) {
		t.Errorf("B1 west bearing %+v", w)
	}
	checkNear(t, "B1 on the wall", w.AtIn, 0, 1e-9)
	if onG.Kind != BeamOnBeam || onG.Index != 1 {
		t.Errorf("B1 east bearing %+v, want on B2", onG)
	}
	checkNear(t, "B1 on the girder", onG.AtIn, 198.25, 1e-9)
	checkNear(t, "B1 bearing length on the girder", onG.LengthIn, 3.5, 1e-9)
	// 16 joists hang from B1, 8 from each side, at x = 16..128 along it
	if len(fb.Carried) != 16 {
		t.Fatalf("B1 carries %d joist bearings, want 16", len(fb.Carried))
	}
	for i, c := range fb.Carried {
		checkNear(t, "B1 carried at", c.AtIn, float64(16*(1+i/2)), 1e-9)
		m := &pl.Members[c.Member]
		if b := m.Bearings[c.Bearing]; b.Kind != KindFlushBeam || !slices.Contains(fb.Supports, b.Support) {
			t.Errorf("carried %+v: member %s bearing %+v not on B1's supports %v", c, m.ID, b, fb.Supports)
		}
	}
	// B2: the girder, on its two posts at its ends; B1 bears on it at y = 144
	if g.Kind != KindDroppedBeam || g.Callout != "5 1/8 x 12 GLB 24F-1.8E" || g.Size != "" || len(g.Lines) != 4 {
		t.Errorf("B2 %s callout %q size %q lines %d", g.Kind, g.Callout, g.Size, len(g.Lines))
	}
	checkNear(t, "B2 width", g.WidthIn, 3.5, 1e-9)
	if len(g.Bearings) != 2 || g.Bearings[0].Kind != BeamOnPost || g.Bearings[1].Kind != BeamOnPost {
		t.Fatalf("B2 bearings %+v, want two posts", g.Bearings)
	}
	checkNear(t, "B2 on P", g.Bearings[0].AtIn, 0, 1e-9)
	checkNear(t, "B2 on P", g.Bearings[1].AtIn, 144, 1e-9)
	if pl.Posts[g.Bearings[0].Index].At != (Point{X: 200, Y: 72}) || !slices.Equal(g.CarriedBeams, []int{0}) || len(g.Carried) != 0 {
		t.Errorf("B2 post %+v, carried beams %v, joists %d", pl.Posts[g.Bearings[0].Index], g.CarriedBeams, len(g.Carried))
	}
	// B3: the header on two posts drawn as 4-line squares, carrying 4 joists
	if h.Size != "4x12" || len(h.Bearings) != 2 || h.Bearings[0].Kind != BeamOnPost || len(h.Carried) != 4 {
		t.Errorf("B3 size %q bearings %+v carried %d", h.Size, h.Bearings, len(h.Carried))
	}
	if len(h.Bearings) == 2 {
		checkNear(t, "B3 on its west post", h.Bearings[0].AtIn, 1.75, 1e-9)
		checkNear(t, "B3 on its east post", h.Bearings[1].AtIn, 70.25, 1e-9)
		checkNear(t, "B3 post drawn size", h.Bearings[0].LengthIn, 3.5, 1e-9)
	}
	// B4: nothing under it: a rigid bearing with a warning naming it
	if !loose.Rigid || len(loose.Bearings) != 0 {
		t.Errorf("B4 rigid %v bearings %+v", loose.Rigid, loose.Bearings)
	}
	var warned []dxfimport.Issue
	for _, is := range pl.Issues {
		if is.Code == CodeBeamUnsupported {
			warned = append(warned, is)
		}
	}
	if len(warned) != 1 || warned[0].Severity != dxfimport.SevWarning || !strings.Contains(warned[0].Msg, "B4") ||
		warned[0].Pos != loose.Lines[0] || warned[0].Pos.File != file {
		t.Errorf("FRM234 findings %v, want one warning naming B4 at its line", warned)
	}
	// the joists are as before: 20, none in error, two bearings each
	if len(pl.Members) != 20 {
		t.Errorf("members %d, want 20", len(pl.Members))
	}
	// ... and the beams' callouts are not read as the joists' (2x10 is
	// the project default)
	for _, m := range pl.Members {
		if m.Error || len(m.Bearings) != 2 || m.Size != "2x10" {
			t.Errorf("member %s error %v bearings %d size %q: %q", m.ID, m.Error, len(m.Bearings), m.Size, m.Messages)
		}
	}
	// posts: 2 circles and 2 squares
	if len(pl.Posts) != 4 {
		t.Errorf("posts %+v", pl.Posts)
	}
	// point loads
	byText := map[string]PointLoadMark{}
	for _, m := range pl.PointLoads {
		byText[m.Text] = m
	}
	if m := byText["P: 1200 D, 800 L"]; m.Err != "" || m.Member < 0 || m.Loads != (PointLoads{DeadLb: 1200, LiveLb: 800}) ||
		!near(pl.Members[max(m.Member, 0)].Start.X, 64, 1e-9) {
		t.Errorf("P: 1200 D, 800 L: %+v", m)
	}
	if m := byText["RTU-1"]; m.Err != "" || m.Name != "RTU-1" || m.Member < 0 || !near(m.AtIn, 72, 1e-9) {
		t.Errorf("RTU-1: %+v (want 72 in along the north joist from y = 144)", m)
	}
	if m := byText["P: 500 D"]; m.Member >= 0 || m.Beam >= 0 || !strings.Contains(m.Err, "handle "+m.Pos.Handle) {
		t.Errorf("P: 500 D: %+v, want on nothing, naming its handle", m)
	}
	if m := byText["P: lots D"]; m.Err == "" || !strings.Contains(m.Err, "handle "+m.Pos.Handle) || m.Member < 0 {
		t.Errorf("P: lots D: %+v, want an error naming its handle", m)
	}
	codes := issueCodes(pl.Issues)
	if codes[CodePointLoadOff] != 1 || codes[CodePointLoadText] != 1 || codes[CodeBeamCycle] != 0 {
		t.Errorf("findings %v", pl.Issues)
	}
}

func TestBeamCycle(t *testing.T) {
	// a pinwheel of four beams round a square, each ending on the next
	// one's middle and on a post at its other end: A on B, B on C, C on
	// D, D on A, a cycle with no beam to solve first
	p := newPlan()
	p.line("BEAM-DROP", -20, 0, 80, 0)   // A: east end on B
	p.line("BEAM-DROP", 80, -20, 80, 80) // B: north end on C
	p.line("BEAM-DROP", 100, 80, 0, 80)  // C: west end on D
	p.line("BEAM-DROP", 0, 100, 0, 0)    // D: south end on A
	p.circle("POST", -20, 0, 2).circle("POST", 80, -20, 2).circle("POST", 100, 80, 2).circle("POST", 0, 100, 2)
	pl := p.group(loadPathOptions())
	if len(pl.Beams) != 4 {
		t.Fatalf("beams %d", len(pl.Beams))
	}
	for _, b := range pl.Beams {
		if len(b.Bearings) != 2 || b.Rigid {
			t.Errorf("%s bearings %+v", b.ID, b.Bearings)
		}
	}
	var cyc []dxfimport.Issue
	for _, is := range pl.Issues {
		if is.Code == CodeBeamCycle {
			cyc = append(cyc, is)
		}
	}
	if len(cyc) != 1 || cyc[0].Severity != dxfimport.SevError {
		t.Fatalf("cycle findings %v, want one error", cyc)
	}
	for _, id := range []string{"B1", "B2", "B3", "B4"} {
		if !strings.Contains(cyc[0].Msg, id) {
			t.Errorf("cycle finding %q does not name %s", cyc[0].Msg, id)
		}
	}
}

func TestBeamKeptRigid(t *testing.T) {
	// check = false in the project: the flush beam's lines are no beam
	o := loadPathOptions()
	o.Supports[1].Rigid = true
	pl := loadPathPlan().group(o)
	for _, b := range pl.Beams {
		if b.Kind == KindFlushBeam {
			t.Errorf("beam %s of a rigid support table", b.ID)
		}
	}
	if len(pl.Beams) != 3 {
		t.Errorf("beams %d, want 3", len(pl.Beams))
	}
}

// TestLoadPathFixture reads testdata/loadpath.dxf, the same scenario
// written by ezdxf (gen_loadpath.py), through the DXF reader: the
// block-insert post, the closed-polyline post, MTEXT and POINT entities
// come from another writer than ours.
func TestLoadPathFixture(t *testing.T) {
	d, err := dxfimport.ReadFile("testdata/loadpath.dxf", dxfimport.Options{})
	if err != nil {
		t.Fatal(err)
	}
	pl := Group(d, loadPathOptions())
	checkLoadPathPlan(t, pl, "testdata/loadpath.dxf")
	as := map[string]string{}
	for _, q := range pl.Posts {
		as[q.DrawnAs] += q.ID + " "
		switch q.At {
		case Point{X: 200, Y: 72}:
			if q.DrawnAs != "circle" || q.Text != "6x6" {
				t.Errorf("post at (200, 72): %+v, want a circle with its text 6x6", q)
			}
		case Point{X: 200, Y: 216}:
			if q.DrawnAs != "block" || q.Pos.Handle == "" || q.Pos.Layer != "POST" {
				t.Errorf("post at (200, 216): %+v, want the block insert", q)
			}
		}
	}
	if len(as["circle"]) == 0 || len(as["block"]) == 0 || len(strings.Fields(as["outline"])) != 2 {
		t.Errorf("posts drawn as %v", as)
	}
}
