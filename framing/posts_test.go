package framing

import (
	"errors"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// Posts and point-load marks (issue 17). Expected positions and sizes are
// the drawn geometry written out (common practice, no source).

func (p *plan) circle(layer string, x, y, r float64) *plan {
	p.d.Entities = append(p.d.Entities, dxfimport.Entity{Kind: dxfimport.KindCircle, Pos: p.pos(layer),
		Points: []Point{{X: x, Y: y}}, RadiusIn: r})
	return p
}

func (p *plan) point(layer string, x, y float64) *plan {
	p.d.Entities = append(p.d.Entities, dxfimport.Entity{Kind: dxfimport.KindPoint, Pos: p.pos(layer),
		Points: []Point{{X: x, Y: y}}})
	return p
}

// insert adds the entities of one block insert: they share From, the
// INSERT's position, as dxfimport gives an expanded insert.
func (p *plan) insert(layer string, ents ...dxfimport.Entity) *plan {
	from := p.pos(layer)
	for _, e := range ents {
		e.Pos = p.pos(layer)
		e.From = &from
		p.d.Entities = append(p.d.Entities, e)
	}
	return p
}

// rect draws a rectangle of 4 lines with lower-left corner (x, y).
func (p *plan) box4(layer string, x, y, w, h float64) *plan {
	return p.line(layer, x, y, x+w, y).line(layer, x+w, y, x+w, y+h).line(layer, x+w, y+h, x, y+h).line(layer, x, y+h, x, y)
}

func loadPathOptions() Options {
	o := DefaultOptions()
	o.Supports = append(o.Supports, SupportSpec{Layers: []string{"BEAM-DROP*"}, Kind: KindDroppedBeam, BearingIn: 3.5})
	o.PointLoadNames = []string{"RTU-1"}
	return o
}

func TestPostsDrawnFourWays(t *testing.T) {
	p := newPlan()
	p.circle("POST", 100, 50, 2.75)                                                                          // P2: a circle
	p.poly("POST", true, Point{X: 0, Y: 0}, Point{X: 5.5, Y: 0}, Point{X: 5.5, Y: 3.5}, Point{X: 0, Y: 3.5}) // P1: 4x6 drawn 3.5 x 5.5
	p.box4("POST", 197.25, 47.25, 5.5, 5.5)                                                                  // P3: 6x6 of 4 lines
	p.line("POST", 197.25, 47.25, 202.75, 52.75)                                                             // its diagonal
	p.insert("POST",
		dxfimport.Entity{Kind: dxfimport.KindCircle, Points: []Point{{X: 300, Y: 50}}, RadiusIn: 3},
		dxfimport.Entity{Kind: dxfimport.KindLine, Points: []Point{{X: 297, Y: 50}, {X: 303, Y: 50}}},
		dxfimport.Entity{Kind: dxfimport.KindText, Points: []Point{{X: 304, Y: 50}}, Text: "6x6 DF #1", HeightIn: 4}) // P4
	p.text("POST", "4x4", 106, 50, 4)      // beside P2
	p.circle("POST", 500, 50, 30)          // too big: warning
	p.line("POST", 600, 0, 600, 40)        // a stray line: warning
	p.text("FRAMING-NOTE", "4x6", 8, 1, 3) // beside P1, on the label layer
	pl := p.group(loadPathOptions())
	if len(pl.Posts) != 4 {
		t.Fatalf("posts %+v, want 4", pl.Posts)
	}
	want := []struct {
		id, as    string
		x, y      float64
		size, dep float64
		text      string
	}{
		{"P1", "outline", 2.75, 1.75, 3.5, 5.5, "4x6"},
		{"P2", "circle", 100, 50, 0, 0, "4x4"},
		{"P3", "outline", 200, 50, 5.5, 5.5, ""},
		{"P4", "block", 300, 50, 0, 0, "6x6 DF #1"},
	}
	for i, w := range want {
		q := pl.Posts[i]
		if q.ID != w.id || q.DrawnAs != w.as || q.Text != w.text {
			t.Errorf("post %d: %s %s %q, want %s %s %q", i, q.ID, q.DrawnAs, q.Text, w.id, w.as, w.text)
		}
		checkNear(t, w.id+" x", q.At.X, w.x, 1e-9)
		checkNear(t, w.id+" y", q.At.Y, w.y, 1e-9)
		checkNear(t, w.id+" size", q.SizeIn, w.size, 1e-9)
		checkNear(t, w.id+" depth", q.DepthIn, w.dep, 1e-9)
	}
	if pl.Posts[3].Pos.Handle == "" || pl.Posts[3].Pos != *p.d.Entities[len(p.d.Entities)-7].From {
		t.Errorf("block post's Pos %v, want the INSERT's", pl.Posts[3].Pos)
	}
	if c := issueCodes(pl.Issues)[CodePostSkipped]; c != 2 {
		t.Errorf("FRM230 findings %d, want 2 (big circle, stray line): %v", c, pl.Issues)
	}
}

func TestReadPointLoad(t *testing.T) {
	names := []string{"RTU-1", "Tank"}
	for _, c := range []struct {
		in    string
		name  string
		loads PointLoads
		err   string
	}{
		{in: "P: 1200 D, 800 L", loads: PointLoads{DeadLb: 1200, LiveLb: 800}},
		{in: "P = 1.2K D + 0.8 kips L", loads: PointLoads{DeadLb: 1200, LiveLb: 800}},
		{in: "D 450; S 120.5; WU 300 LB; wd 80#", loads: PointLoads{DeadLb: 450, SnowLb: 120.5, WindUpLb: 300, WindDownLb: 80}},
		{in: "DL=500\nLL=250 & 100 LR", loads: PointLoads{DeadLb: 500, LiveLb: 250, RoofLiveLb: 100}},
		{in: "rtu-1", name: "RTU-1"},
		{in: "P: TANK", name: "Tank"},
		{in: "P: 1,200 D", err: `"1" is not a number of lb with a load type`},
		{in: "P: 1200 D, 800 W", err: "W does not say which way"},
		{in: "P: 1200 D, 300 D", err: "load type D is given twice"},
		{in: "P: -1200 D", err: "not a number of lb"},
		{in: "P:", err: "no load given"},
		{in: "AHU-2", err: `"AHU-2" is no [[point_load]] of the project (RTU-1, Tank)`},
		{in: "1200", err: "not a number of lb with a load type"},
		{in: "P: 1200 D, 800 L TYP", err: `"800 L TYP"`},
	} {
		name, loads, err := ReadPointLoad(c.in, names)
		if c.err != "" {
			if !errors.Is(err, ErrBadPointLoad) || !strings.Contains(err.Error(), c.err) {
				t.Errorf("%q: error %v, want one saying %q", c.in, err, c.err)
			}
			continue
		}
		if err != nil || name != c.name || loads != c.loads {
			t.Errorf("%q: %q %+v %v, want %q %+v", c.in, name, loads, err, c.name, c.loads)
		}
	}
}

func TestPointLoadMarks(t *testing.T) {
	// joists at x = 0, 16, 32 from y = 0 to 144 on walls; marks:
	//   A: a POINT on the joist at x = 16, y = 72, "P: 1200 D, 800 L"
	//   B: a circle on the joist at x = 32, y = 100, naming RTU-1
	//   C: a POINT at (200, 72), on no member: error naming its handle
	//   D: a POINT on the joist at x = 0, y = 30, text "HEAVY": error
	//   E: a block (circle + text inside) on the joist at x = 16, y = 20
	//   a text with no mark: warning
	p := newPlan().walls(-10, 50, 0, 144).joists(0, 144, 0, 16, 32)
	p.point("POINT-LOAD", 16, 72).text("POINT-LOAD", "P: 1200 D, 800 L", 18, 73, 3)
	p.circle("POINT-LOAD", 32, 100, 1).text("POINT-LOAD", "RTU-1", 34, 101, 3)
	p.point("POINT-LOAD", 200, 72).text("POINT-LOAD", "P: 500 D", 202, 73, 3)
	p.point("POINT-LOAD", 0.5, 30).text("POINT-LOAD", "HEAVY", 2, 31, 3)
	p.insert("POINT-LOAD",
		dxfimport.Entity{Kind: dxfimport.KindCircle, Points: []Point{{X: 16, Y: 20}}, RadiusIn: 1},
		dxfimport.Entity{Kind: dxfimport.KindText, Points: []Point{{X: 18, Y: 21}}, Text: "P: 300 S", HeightIn: 3})
	p.text("POINT-LOAD", "P: 99 D", 400, 400, 3)
	pl := p.group(loadPathOptions())
	if len(pl.PointLoads) != 5 {
		t.Fatalf("marks %+v", pl.PointLoads)
	}
	byText := map[string]PointLoadMark{}
	for _, m := range pl.PointLoads {
		byText[m.Text] = m
	}
	mid := func(x float64) int { return memberIndex(t, pl, x, 72) }
	a := byText["P: 1200 D, 800 L"]
	if a.Err != "" || a.Loads != (PointLoads{DeadLb: 1200, LiveLb: 800}) || a.Member != mid(16) || a.Beam != -1 {
		t.Errorf("A %+v", a)
	}
	checkNear(t, "A along its joist", a.AtIn, 72, 1e-9) // joist from y = 0
	b := byText["RTU-1"]
	if b.Err != "" || b.Name != "RTU-1" || b.Member != mid(32) {
		t.Errorf("B %+v", b)
	}
	checkNear(t, "B along its joist", b.AtIn, 100, 1e-9)
	c := byText["P: 500 D"]
	if c.Member != -1 || c.Beam != -1 || !strings.Contains(c.Err, "on no joist or beam") || !strings.Contains(c.Err, "handle "+c.Pos.Handle) {
		t.Errorf("C %+v", c)
	}
	d := byText["HEAVY"]
	if d.Member != mid(0) || !strings.Contains(d.Err, "no [[point_load]]") || !strings.Contains(d.Err, "handle "+d.Pos.Handle) {
		t.Errorf("D %+v", d)
	}
	e := byText["P: 300 S"]
	if e.Err != "" || e.Loads.SnowLb != 300 || e.Member != mid(16) {
		t.Errorf("E %+v", e)
	}
	codes := issueCodes(pl.Issues)
	if codes[CodePointLoadOff] != 1 || codes[CodePointLoadText] != 1 || codes[CodePointLoadAlone] != 1 {
		t.Errorf("findings %v: want one each of FRM231, FRM232, FRM233", pl.Issues)
	}
	for _, is := range pl.Issues {
		if is.Code == CodePointLoadOff && (is.Severity != dxfimport.SevError || is.Pos != c.Pos) {
			t.Errorf("off-member finding %v, want an error at the mark", is)
		}
	}
	// the joists are checked as before: three members, two bearings each
	for _, m := range pl.Members {
		if m.Error || len(m.Bearings) != 2 {
			t.Errorf("member %s: error %v, bearings %d", m.ID, m.Error, len(m.Bearings))
		}
	}
}

// memberIndex returns the index of the member nearest (x, y).
func memberIndex(t *testing.T, pl *Plan, x, y float64) int {
	t.Helper()
	m := member(t, pl, x, y)
	for i := range pl.Members {
		if &pl.Members[i] == m {
			return i
		}
	}
	return -1
}

func TestBearingSupportIndex(t *testing.T) {
	// joists x = 0, 16 from y = 0 to 200 on a double-line wall (y = 0 and
	// 5.5) and a single-line wall at y = 200; a joist callout beside a
	// post is not the post's text
	p := newPlan().walls(-20, 40, 0, 5.5, 200).joists(0, 200, 0, 16)
	p.circle("POST", 100, 100, 2).text("FRAMING-NOTE", "2x10 @ 16\" o.c.", 103, 100, 3)
	pl := p.group(DefaultOptions())
	for _, m := range pl.Members {
		if len(m.Bearings) != 2 {
			t.Fatalf("%s bearings %+v", m.ID, m.Bearings)
		}
		s0, s1 := m.Bearings[0].Support, m.Bearings[1].Support
		if s0 < 0 || s1 < 0 || !pl.Supports[s0].Double || !near(pl.Supports[s0].ThicknessIn, 5.5, 1e-9) ||
			pl.Supports[s1].Double || !near(pl.Supports[s1].A.Y, 200, 1e-9) {
			t.Errorf("%s bearings on supports %d, %d of %+v", m.ID, s0, s1, pl.Supports)
		}
	}
	if len(pl.Posts) != 1 || pl.Posts[0].Text != "" {
		t.Errorf("posts %+v, want one without text", pl.Posts)
	}
}

func TestPointLoadTwoTextsOneMark(t *testing.T) {
	// two texts beside one mark: the nearer is its text, the other is
	// reported as left out (never added to the load)
	p := newPlan().walls(-10, 50, 0, 144).joists(0, 144, 16)
	p.point("POINT-LOAD", 16, 72).text("POINT-LOAD", "P: 900 D", 20, 72, 3).text("POINT-LOAD", "P: 400 L", 18, 73, 3)
	pl := p.group(loadPathOptions())
	if len(pl.PointLoads) != 1 || pl.PointLoads[0].Text != "P: 400 L" || pl.PointLoads[0].Loads != (PointLoads{LiveLb: 400}) {
		t.Fatalf("marks %+v", pl.PointLoads)
	}
	if c := issueCodes(pl.Issues)[CodePointLoadAlone]; c != 1 {
		t.Errorf("FRM233 findings %d, want 1: %v", c, pl.Issues)
	}
}
