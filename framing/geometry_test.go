package framing

import (
	"math"
	"strings"
	"testing"
)

// Expected values in this file are closed-form geometry from the rules in
// DOMAIN.md "Members from a plan" (span = centre-to-centre of bearings,
// trib = half the gap to each neighbour): common practice, no source.
// Tolerances are floating-point rounding only (1e-6 in) unless noted.

func TestTrib16InSpacing(t *testing.T) {
	for _, edge := range []float64{0, 2} {
		opt := DefaultOptions()
		opt.EdgeDistanceIn = edge
		pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 32, 48, 64).group(opt)
		if len(pl.Members) != 5 {
			t.Fatalf("members = %d, want 5", len(pl.Members))
		}
		for i, m := range pl.Members {
			wantTrib := 16.0
			if i == 0 || i == 4 {
				wantTrib = 8 + edge
			}
			checkNear(t, m.ID+" trib", m.TribIn, wantTrib, 1e-6)
			checkNear(t, m.ID+" spacing", m.SpacingIn, 16, 1e-6)
			if s := m.Spans(); len(s) != 1 || !near(s[0], 144, 1e-6) {
				t.Errorf("%s spans = %v, want [144]", m.ID, s)
			}
			if m.Error || m.OverhangStartIn != 0 || m.OverhangEndIn != 0 {
				t.Errorf("%s error=%v overhangs %g %g, want a simple span", m.ID, m.Error, m.OverhangStartIn, m.OverhangEndIn)
			}
		}
		if len(pl.Runs) != 1 || len(pl.Runs[0].Members) != 5 {
			t.Errorf("runs = %+v, want one run of 5", pl.Runs)
		}
	}
}

func TestTribUneven(t *testing.T) {
	// joists at x = 0, 16, 40: gaps 16 and 24
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 40).group(DefaultOptions())
	want := []struct{ x, left, right, spacing float64 }{
		// vertical joists point up (+y): left is -x
		{0, 0, 8, 16},
		{16, 8, 12, 20},
		{40, 12, 0, 24},
	}
	for _, w := range want {
		m := member(t, pl, w.x, 72)
		checkNear(t, m.ID+" left", m.TribLeftIn, w.left, 1e-6)
		checkNear(t, m.ID+" right", m.TribRightIn, w.right, 1e-6)
		checkNear(t, m.ID+" spacing", m.SpacingIn, w.spacing, 1e-6)
	}
}

func TestTribOnlyOverlappingNeighbours(t *testing.T) {
	// a short joist at x=16 spans only the lower bay; the one at x=32
	// spans both bays, so its neighbour in the upper bay is at x=0.
	pl := newPlan().walls(-10, 100, 0, 144, 288).
		joists(0, 288, 0, 32).joists(0, 144, 16).group(DefaultOptions())
	m := member(t, pl, 32, 144)
	checkNear(t, "x=32 left trib", m.TribLeftIn, 8, 1e-6) // nearest overlapping neighbour: x=16
	m = member(t, pl, 16, 72)
	checkNear(t, "x=16 trib", m.TribIn, 16, 1e-6)
}

// axisPlan is a plan with a simple span, a double-line wall, a continuous
// member and a cantilever; rotated, it must give the same numbers.
func axisPlan() *plan {
	p := newPlan()
	p.walls(-20, 120, 0, 144, 149.5, 288) // 144/149.5: a 5.5 in double-line wall
	p.joists(0, 288, 0, 16, 32)           // continuous over 3 bearings
	p.joists(0, 168, 48)                  // cantilever 168 - 146.75 = 21.25 in past the double wall's mid-line
	p.joists(1, 149.5, 64)                // 1 in short at the start, ends on the far face of the double wall
	return p
}

func TestSkewedPlanMatchesAxisAligned(t *testing.T) {
	opt := DefaultOptions()
	a := axisPlan().group(opt)
	th := 30 * math.Pi / 180
	rot := func(q Point) Point {
		return Point{X: 1000 + q.X*math.Cos(th) - q.Y*math.Sin(th), Y: -500 + q.X*math.Sin(th) + q.Y*math.Cos(th)}
	}
	s := axisPlan().transform(rot).group(opt)
	if len(a.Members) != len(s.Members) || len(a.Members) != 5 {
		t.Fatalf("members: axis %d, skew %d, want 5", len(a.Members), len(s.Members))
	}
	for i := range a.Members {
		ma := &a.Members[i]
		c := rot(mid(ma.Start, ma.End))
		ms := member(t, s, c.X, c.Y)
		sa, ss := ma.Spans(), ms.Spans()
		ohS, ohE := ms.OverhangStartIn, ms.OverhangEndIn
		// the rotation may reverse the member's orientation (Start is
		// the end lower along the group direction): compare reversed
		if dot(sub(rot(ma.End), rot(ma.Start)), sub(ms.End, ms.Start)) < 0 {
			for i, j := 0, len(ss)-1; i < j; i, j = i+1, j-1 {
				ss[i], ss[j] = ss[j], ss[i]
			}
			ohS, ohE = ohE, ohS
		}
		if len(sa) != len(ss) {
			t.Errorf("%s: spans %v vs skewed %v", ma.ID, sa, ss)
			continue
		}
		for j := range sa {
			checkNear(t, ma.ID+" span", ss[j], sa[j], 1e-6)
		}
		checkNear(t, ma.ID+" trib", ms.TribIn, ma.TribIn, 1e-6)
		checkNear(t, ma.ID+" overhang end", ohE, ma.OverhangEndIn, 1e-6)
		checkNear(t, ma.ID+" overhang start", ohS, ma.OverhangStartIn, 1e-6)
		if ma.Error != ms.Error {
			t.Errorf("%s: error %v vs skewed %v", ma.ID, ma.Error, ms.Error)
		}
	}
	// and the axis-aligned numbers themselves
	m := member(t, a, 0, 144)
	if sp := m.Spans(); len(sp) != 2 || !near(sp[0], 146.75, 1e-6) || !near(sp[1], 141.25, 1e-6) {
		t.Errorf("continuous spans = %v, want [146.75 141.25] (double wall mid-line at 146.75)", sp)
	}
	m = member(t, a, 48, 84)
	checkNear(t, "cantilever overhang", m.OverhangEndIn, 168-146.75, 1e-6)
}

func TestDoubleLineWallMidLine(t *testing.T) {
	// 2x6 walls drawn as two lines 5.5 in apart at y=0/5.5 and 150/155.5
	p := newPlan().walls(-10, 100, 0, 5.5, 150, 155.5)
	p.joists(0, 155.5, 0) // crosses all four lines
	p.joists(2, 153, 16)  // ends stop inside both walls
	p.joists(-1, 156, 32) // small overshoot past both outer faces
	pl := p.group(DefaultOptions())
	for _, x := range []float64{0, 16, 32} {
		m := member(t, pl, x, 77.75)
		if len(m.Bearings) != 2 || m.Error {
			t.Fatalf("x=%g: bearings %+v error %v %v", x, m.Bearings, m.Error, m.Messages)
		}
		checkNear(t, "span (mid-line 2.75 to 152.75)", m.Spans()[0], 150, 1e-6)
		// the bearing is the wall's thickness, cut short where the end
		// stops inside the wall: x=16 bears from y=2 to 5.5 and from 150
		// to 153 (issue 14: "capped by the member's own end")
		lb0, lb1 := 5.5, 5.5
		if x == 16 {
			lb0, lb1 = 3.5, 3.0
		}
		checkNear(t, "bearing length = wall thickness", m.Bearings[0].LengthIn, lb0, 1e-6)
		checkNear(t, "bearing length = wall thickness", m.Bearings[1].LengthIn, lb1, 1e-6)
		if m.OverhangStartIn != 0 || m.OverhangEndIn != 0 {
			t.Errorf("x=%g: overhangs %g %g, want 0 (ends inside the wall)", x, m.OverhangStartIn, m.OverhangEndIn)
		}
	}
	var doubles int
	for _, s := range pl.Supports {
		if s.Double {
			doubles++
			checkNear(t, "merged thickness", s.ThicknessIn, 5.5, 1e-6)
			if !near(s.A.Y, 2.75, 1e-6) && !near(s.A.Y, 152.75, 1e-6) {
				t.Errorf("merged support at y=%g, want a mid-line", s.A.Y)
			}
		}
	}
	if doubles != 2 || len(pl.Supports) != 2 {
		t.Errorf("supports = %+v, want 2 merged double walls", pl.Supports)
	}
}

func TestShortOfWall(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0, 144).
		line("JOIST", 0, 1, 0, 143).   // 1 in short at both ends: within the 1.5 in snap
		line("JOIST", 16, 0, 16, 138). // 6 in short at the end
		group(DefaultOptions())
	m := member(t, pl, 0, 72)
	if m.Error || len(m.Bearings) != 2 {
		t.Fatalf("1 in short: error=%v bearings=%+v %v", m.Error, m.Bearings, m.Messages)
	}
	checkNear(t, "span", m.Spans()[0], 144, 1e-6)
	checkNear(t, "first bearing AtIn", m.Bearings[0].AtIn, -1, 1e-6)
	if m.OverhangStartIn != 0 || m.OverhangEndIn != 0 {
		t.Errorf("overhangs %g %g, want 0", m.OverhangStartIn, m.OverhangEndIn)
	}
	m = member(t, pl, 16, 69)
	if !m.Error || len(m.Messages) == 0 {
		t.Fatalf("6 in short: error=%v, want an error member", m.Error)
	}
	msg := m.Messages[0]
	if !strings.Contains(msg, " end (16.00, 138.00) reaches no support") || !strings.Contains(msg, "6.0 in away") {
		t.Errorf("message %q: want the end named and the 6.0 in to the nearest support", msg)
	}
	if issueCodes(pl.Issues)[CodeNoSupport] != 1 || pl.Issues.Err() == nil {
		t.Errorf("issues %v: want one %s error", pl.Issues, CodeNoSupport)
	}
	// the error member still counts as a neighbour
	checkNear(t, "trib beside the error member", member(t, pl, 0, 72).TribRightIn, 8, 1e-6)
}

func TestContinuousOverThreeWalls(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0, 120, 288).joists(0, 288, 0, 16).group(DefaultOptions())
	m := member(t, pl, 0, 144)
	if sp := m.Spans(); len(sp) != 2 || !near(sp[0], 120, 1e-6) || !near(sp[1], 168, 1e-6) {
		t.Errorf("spans = %v, want [120 168]", sp)
	}
	if len(m.Bearings) != 3 {
		t.Errorf("bearings = %d, want 3", len(m.Bearings))
	}
}

func TestCantileverOverhang(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0, 144).
		joists(0, 168, 0).    // 24 in past the wall: cantilever
		joists(0, 146, 16).   // 2 in past: within lb/2 + snap = 1.75 + 1.5 = 3.25 in
		joists(-30, 144, 32). // cantilever at the start
		group(DefaultOptions())
	checkNear(t, "overhang end", member(t, pl, 0, 84).OverhangEndIn, 24, 1e-6)
	m := member(t, pl, 16, 73)
	if m.OverhangEndIn != 0 || m.OverhangStartIn != 0 {
		t.Errorf("2 in overshoot: overhangs %g %g, want 0", m.OverhangStartIn, m.OverhangEndIn)
	}
	m = member(t, pl, 32, 57)
	checkNear(t, "overhang start", m.OverhangStartIn, 30, 1e-6)
	checkNear(t, "span", m.Spans()[0], 144, 1e-6)
}

func TestJoistShapes(t *testing.T) {
	p := newPlan().walls(-10, 200, 0, 144)
	p.poly("JOIST", false, Point{X: 0, Y: 0}, Point{X: 0, Y: 70}, Point{X: 0, Y: 144})    // collinear: kept
	p.poly("JOIST", false, Point{X: 16, Y: 0}, Point{X: 20, Y: 70}, Point{X: 16, Y: 144}) // bent: skipped
	p.line("JOIST", 32, 0, 32, 144).line("JOIST", 32.5, 144, 32, 0.5)                     // drawn twice
	p.line("JOIST", 48, 50, 48, 50)                                                       // zero length
	p.text("JOIST", "note", 5, 5, 3)                                                      // wrong kind
	p.line("A-DOOR", 0, 0, 5, 5)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 2 {
		t.Fatalf("members = %d, want 2 (collinear polyline and one of the pair)", len(pl.Members))
	}
	c := issueCodes(pl.Issues)
	if c[CodeBentJoist] != 1 || c[CodeDuplicateJoist] != 1 || c[CodeZeroLength] != 1 {
		t.Errorf("issue codes %v", c)
	}
	if pl.Ignored["A-DOOR"] != 1 || pl.Ignored["JOIST (TEXT)"] != 1 {
		t.Errorf("ignored %v", pl.Ignored)
	}
	for _, i := range pl.Issues {
		if i.Code == CodeDuplicateJoist && !(strings.Contains(i.Msg, "handle 105") && strings.Contains(i.Msg, "handle 106")) {
			t.Errorf("duplicate message %q should name both handles", i.Msg)
		}
	}
}

func TestMemberIDsSortedByMidpoint(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0, 144, 288).
		joists(144, 288, 16, 0).joists(0, 144, 16, 0).group(DefaultOptions())
	want := []Point{{X: 0, Y: 72}, {X: 16, Y: 72}, {X: 0, Y: 216}, {X: 16, Y: 216}}
	for i, w := range want {
		m := pl.Members[i]
		if c := mid(m.Start, m.End); !near(c.X, w.X, 1e-9) || !near(c.Y, w.Y, 1e-9) || m.ID != "M"+string(rune('1'+i)) {
			t.Errorf("member %d = %s at %v, want M%d at %v", i, m.ID, c, i+1, w)
		}
	}
	if len(pl.Runs) != 2 || pl.Runs[0].ID != "R1" || len(pl.Runs[0].Members) != 2 {
		t.Errorf("runs %+v, want two runs of two", pl.Runs)
	}
}

func TestFlushBeamHangers(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0).line("BEAM-FLUSH", -10, 144, 100, 144).
		joists(0, 144, 0, 16).group(DefaultOptions())
	m := &pl.Members[0]
	if m.HangersStart || !m.HangersEnd {
		t.Errorf("hangers start=%v end=%v, want end only", m.HangersStart, m.HangersEnd)
	}
	checkNear(t, "flush-beam bearing length", m.Bearings[1].LengthIn, 1.5, 0)
}

func TestWallDrawnAsRectangle(t *testing.T) {
	// a 2x4 wall drawn as a closed outline 3.5 in wide: its long sides are
	// one double-line wall, its short ends run along the joists
	p := newPlan().poly("WALL", true, rect(-10, -3.5, 100, 0)...).walls(-10, 100, 144)
	p.joists(-3.5, 144, 0, 16)
	p.joists(-3.5, 144, 120) // beyond the wall's drawn end (x = 100): no bearing there
	pl := p.group(DefaultOptions())
	m := member(t, pl, 0, 70.25)
	if len(m.Bearings) != 2 || m.Error {
		t.Fatalf("bearings %+v %v", m.Bearings, m.Messages)
	}
	checkNear(t, "span from the wall mid-line y=-1.75", m.Spans()[0], 145.75, 1e-9)
	checkNear(t, "bearing length", m.Bearings[0].LengthIn, 3.5, 1e-9)
	if m := member(t, pl, 120, 70.25); !m.Error {
		t.Errorf("joist past the wall's end: error = false, bearings %+v", m.Bearings)
	}
	if Group(nil, DefaultOptions()) == nil {
		t.Error("Group(nil) = nil, want an empty plan")
	}
}

func TestPerimeterPolylineNearestSupport(t *testing.T) {
	// the whole perimeter wall is one closed polyline: the joist bears on
	// its south side and stops 6 in short of its north side, which is the
	// nearest support to name even though it is the same entity
	pl := newPlan().poly("WALL", true, rect(-10, 0, 100, 144)...).
		joists(0, 138, 16).group(DefaultOptions())
	m := &pl.Members[0]
	if !m.Error || !strings.Contains(m.Messages[0], "end (16.00, 138.00) reaches no support; nearest support is 6.0 in away") {
		t.Errorf("error %v messages %q", m.Error, m.Messages)
	}
}

func TestLappedJoistsAreNotNeighbours(t *testing.T) {
	// joists lapped 24 in over the middle wall, the upper piece drawn
	// 1.5 in to the side; the next pair 16 in over
	p := newPlan().walls(-10, 100, 0, 144, 288)
	for _, x := range []float64{0, 16, 32} {
		p.line("JOIST", x, 0, x, 156).line("JOIST", x+1.5, 132, x+1.5, 288)
	}
	pl := p.group(DefaultOptions())
	m := member(t, pl, 16, 78)
	checkNear(t, "lower piece trib", m.TribIn, 16, 1e-9)
	m = member(t, pl, 17.5, 210)
	checkNear(t, "upper piece trib", m.TribIn, 16, 1e-9)
	// the lap reaches 12 in past the wall centre-line, more than
	// lb/2 + snap = 3.25 in: by DOMAIN.md's rule it is a short cantilever
	if sp := m.Spans(); len(sp) != 1 || !near(sp[0], 144, 1e-9) || !near(m.OverhangStartIn, 12, 1e-9) {
		t.Errorf("upper piece spans %v overhang %g, want [144] and 12", sp, m.OverhangStartIn)
	}
}
