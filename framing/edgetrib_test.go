package framing

import (
	"math"
	"strings"
	"testing"
)

// Edge joists: the strip outside the outermost joist of a run is loaded
// where the drawing shows it is. Expected values are closed-form
// tributary-area geometry (each line of support, joist or wall, carries
// half the sheathing span on each side of it; sheathing cantilevered past
// the last joist is carried by that joist): common practice, no source.

// edgePlan: four joists at x = 16, 32, 48, 64 spanning 144 in between
// walls at y = 0 and 144, and a double-line 2x6 wall parallel to them
// at x = 0 / 5.5 (mid-line 2.75 in, 13.25 in from the first joist).
func edgePlan() *plan {
	return newPlan().walls(-20, 100, 0, 144).
		line("WALL", 0, -10, 0, 154).line("WALL", 5.5, -10, 5.5, 154).
		joists(0, 144, 16, 32, 48, 64)
}

func zone(p *plan, name string, x0, y0, x1, y1 float64) *plan {
	p.poly("LOAD-ZONE", true, Point{X: x0, Y: y0}, Point{X: x1, Y: y0}, Point{X: x1, Y: y1}, Point{X: x0, Y: y1})
	return p.text("LOAD-ZONE", name, (x0+x1)/2, y0+20, 6)
}

func TestEdgeJoistBesideParallelWall(t *testing.T) {
	pl := edgePlan().group(DefaultOptions())
	first, last := member(t, pl, 16, 72), member(t, pl, 64, 72)
	// 8 in to the neighbour + half of the 13.25 in to the wall's mid-line
	checkNear(t, "x=16 trib", first.TribIn, 8+13.25/2, 1e-6)
	checkNear(t, "x=16 left (toward the wall)", first.TribLeftIn, 13.25/2, 1e-6)
	checkNear(t, "x=16 spacing", first.SpacingIn, 16, 1e-6) // spacing is the joists'
	checkNear(t, "x=64 trib (nothing beside it)", last.TribIn, 8, 1e-6)
	checkNear(t, "x=32 trib", member(t, pl, 32, 72).TribIn, 16, 1e-6)
	c := issueCodes(pl.Issues)
	if c[CodeEdgeSupport] != 1 || c[CodeEdgeZone] != 0 {
		t.Errorf("issues %v, want one FRM221", pl.Issues)
	}

	// A larger edge distance from the project wins over half the gap.
	opt := DefaultOptions()
	opt.EdgeDistanceIn = 10
	pl = edgePlan().group(opt)
	checkNear(t, "x=16 trib with edge distance 10", member(t, pl, 16, 72).TribIn, 18, 1e-6)
	checkNear(t, "x=64 trib with edge distance 10", member(t, pl, 64, 72).TribIn, 18, 1e-6)
	if c := issueCodes(pl.Issues); c[CodeEdgeSupport] != 0 {
		t.Errorf("FRM221 where the edge distance governs: %v", pl.Issues)
	}

	// A parallel wall 60 in away is beyond a strip of sheathing: not taken.
	pl = newPlan().walls(-80, 100, 0, 144).line("WALL", -44, -10, -44, 154).
		joists(0, 144, 16, 32, 48, 64).group(DefaultOptions())
	checkNear(t, "x=16 trib, wall 60 in away", member(t, pl, 16, 72).TribIn, 8, 1e-6)
}

func TestEdgeJoistZoneStrip(t *testing.T) {
	// The zone reaches 12 in past the last joist (x = 76): that strip is
	// cantilevered sheathing, the joist's: 8 + 12 = 20 in, a warning. On
	// the other side the wall is beside the joist: half the gap, not the
	// zone.
	pl := zone(edgePlan(), "FLOOR", -10, -10, 76, 154).group(DefaultOptions())
	checkNear(t, "x=64 trib", member(t, pl, 64, 72).TribIn, 20, 1e-6)
	checkNear(t, "x=16 trib", member(t, pl, 16, 72).TribIn, 8+13.25/2, 1e-6)
	var warned bool
	for _, is := range pl.Issues {
		if is.Code == CodeEdgeZone {
			warned = is.Severity.String() == "warning" && strings.Contains(is.Msg, "12.0 in past it") && strings.Contains(is.Msg, "20.00 in")
		}
	}
	if !warned {
		t.Errorf("no FRM222 warning naming the 12 in strip: %v", pl.Issues)
	}

	// Drawn to the joist's outer face (0.75 in past it): nothing added.
	pl = zone(edgePlan(), "FLOOR", -10, -10, 64.75, 154).group(DefaultOptions())
	checkNear(t, "x=64 trib, zone to its face", member(t, pl, 64, 72).TribIn, 8, 1e-6)
	if c := issueCodes(pl.Issues); c[CodeEdgeZone] != 0 {
		t.Errorf("FRM222 for a zone drawn to the joist's face: %v", pl.Issues)
	}

	// Reaching 66 in past it: more than a strip of sheathing; the load
	// there reaches no member drawn. A warning, and the joist keeps 8 in.
	pl = zone(edgePlan(), "FLOOR", -10, -10, 130, 154).group(DefaultOptions())
	checkNear(t, "x=64 trib, zone 66 in past it", member(t, pl, 64, 72).TribIn, 8, 1e-6)
	warned = false
	for _, is := range pl.Issues {
		if is.Code == CodeEdgeZone && strings.Contains(is.Msg, "reaches no member drawn") {
			warned = true
		}
	}
	if !warned {
		t.Errorf("no FRM222 warning for the 66 in strip: %v", pl.Issues)
	}
}

// TestEdgeJoistBesideBeam: a dropped beam parallel to the joists, 16 in
// past the last one and bearing on both walls, is checked as a member; the
// edge joist takes half the 16 in (FRM221) and the beam carries the other
// half, 8 in wide, over the joist's length (2 to 146 in along the beam,
// which starts at y = -2), in the joist's zone (FRM223, info). With no zone
// the strip is left off the beam with a warning.
func TestEdgeJoistBesideBeam(t *testing.T) {
	draw := func() *plan {
		return newPlan().walls(-20, 120, 0, 144).joists(0, 144, 16, 32, 48, 64).line("BEAM-DROP", 80, -2, 80, 146)
	}
	pl := draw().group(loadPathOptions()) // DefaultZone FLOOR
	checkNear(t, "x=64 trib", member(t, pl, 64, 72).TribIn, 16, 1e-6)
	if len(pl.Beams) != 1 || pl.Beams[0].Rigid {
		t.Fatalf("beams %+v, want one beam on the two walls", pl.Beams)
	}
	b := &pl.Beams[0]
	if len(b.Strips) != 1 {
		t.Fatalf("strips %+v, want one", b.Strips)
	}
	st := b.Strips[0]
	checkNear(t, "strip from", st.FromIn, 2, 1e-6)
	checkNear(t, "strip to", st.ToIn, 146, 1e-6)
	checkNear(t, "strip width", st.WidthIn, 8, 1e-6)
	if st.Zone != "FLOOR" || pl.Members[st.Member].ID != member(t, pl, 64, 72).ID {
		t.Errorf("strip %+v: want zone FLOOR and the joist at x = 64", st)
	}
	if c := issueCodes(pl.Issues); c[CodeEdgeBeam] != 1 || pl.Issues.Err() != nil {
		t.Errorf("issues %v, want one FRM223", pl.Issues)
	}

	opt := loadPathOptions()
	opt.DefaultZone = "" // no zone
	pl = draw().group(opt)
	if len(pl.Beams) != 1 || len(pl.Beams[0].Strips) != 0 {
		t.Fatalf("beams %+v, want one with no strip", pl.Beams)
	}
	var warned bool
	for _, is := range pl.Issues {
		warned = warned || (is.Code == CodeEdgeBeam && is.Severity.String() == "warning" && strings.Contains(is.Msg, "not put on it"))
	}
	if !warned {
		t.Errorf("no FRM223 warning for joists with no zone: %v", pl.Issues)
	}
	// beside a wall (a rigid support), nothing to say
	if c := issueCodes(edgePlan().group(DefaultOptions()).Issues); c[CodeEdgeBeam] != 0 {
		t.Errorf("FRM223 beside a wall")
	}
}

// TestZonePastBeam: a dropped beam on two posts carries four joists from
// the south; the FLOOR outline runs 26 in past it to the north, where no
// joist is: a warning that the strip there is not in the beam's check
// (FRM224). Drawn to the beam, no warning.
func TestZonePastBeam(t *testing.T) {
	draw := func(zoneTop float64) *Plan {
		p := newPlan().walls(-20, 120, 0).joists(0, 144, 16, 32, 48, 64).line("BEAM-DROP", 0, 144, 80, 144)
		p.circle("POST", 0, 144, 2.75).circle("POST", 80, 144, 2.75)
		return zone(p, "FLOOR", 8, -10, 72, zoneTop).group(loadPathOptions())
	}
	pl := draw(170)
	if len(pl.Beams) != 1 || pl.Beams[0].Rigid || len(pl.Beams[0].Carried) != 4 {
		t.Fatalf("beams %+v, want one carrying the four joists", pl.Beams)
	}
	var warned bool
	for _, is := range pl.Issues {
		warned = warned || (is.Code == CodeZonePastBeam && strings.Contains(is.Msg, "reaches 26.0 in past it"))
	}
	if !warned {
		t.Errorf("no FRM224 warning: %v", pl.Issues)
	}
	if c := issueCodes(draw(144).Issues); c[CodeZonePastBeam] != 0 {
		t.Errorf("FRM224 with the zone drawn to the beam")
	}
}

// TestEdgeTribSkewed: the edge rules do not depend on how the plan is
// turned: the edge plan beside its parallel double wall, with a zone
// reaching 12 in past the other edge joist, turned 30 and 135 degrees,
// gives each joist the tributary width it has drawn square (geometry:
// the rules measure square to the joists; common practice, no source).
func TestEdgeTribSkewed(t *testing.T) {
	draw := func() *plan { return zone(edgePlan(), "FLOOR", -10, -10, 76, 154) }
	a := draw().group(DefaultOptions())
	for _, deg := range []float64{30, 135} {
		th := deg * math.Pi / 180
		rot := func(q Point) Point {
			return Point{X: 1000 + q.X*math.Cos(th) - q.Y*math.Sin(th), Y: -500 + q.X*math.Sin(th) + q.Y*math.Cos(th)}
		}
		s := draw().transform(rot).group(DefaultOptions())
		if len(s.Members) != len(a.Members) {
			t.Fatalf("%v deg: %d members, want %d", deg, len(s.Members), len(a.Members))
		}
		for i := range a.Members {
			ma := &a.Members[i]
			c := rot(mid(ma.Start, ma.End))
			ms := member(t, s, c.X, c.Y)
			checkNear(t, ma.ID+" trib turned", ms.TribIn, ma.TribIn, 1e-6)
		}
		if ca, cs := issueCodes(a.Issues), issueCodes(s.Issues); ca[CodeEdgeSupport] != cs[CodeEdgeSupport] || ca[CodeEdgeZone] != cs[CodeEdgeZone] {
			t.Errorf("%v deg: findings %v, drawn square %v", deg, cs, ca)
		}
	}
	checkNear(t, "x=16 trib", member(t, a, 16, 72).TribIn, 8+13.25/2, 1e-6)
	checkNear(t, "x=64 trib", member(t, a, 64, 72).TribIn, 20, 1e-6)
}

// Edge strips found by a review (tributary-area statics, common practice,
// no source).
func TestEdgeStripReviewCases(t *testing.T) {
	// Two beams end to end beside a 288 in joist over three walls: each
	// carries the 8 in strip over its own 144 in.
	p := newPlan().walls(-20, 120, 0, 144, 288).joists(0, 288, 16, 32, 48, 64)
	p.line("BEAM-DROP", 80, 0, 80, 144).line("BEAM-DROP", 80, 144, 80, 288)
	p.circle("POST", 80, 0, 2.75).circle("POST", 80, 144, 2.75).circle("POST", 80, 288, 2.75)
	pl := p.group(loadPathOptions())
	area := 0.0
	for _, b := range pl.Beams {
		for _, s := range b.Strips {
			area += (s.ToIn - s.FromIn) * s.WidthIn
		}
	}
	checkNear(t, "strip area on the two beams", area, 8*288, 1)

	// A beam beside 100 of the joist's 144 in: the strip past its end is
	// on no member, and a warning says so.
	p = newPlan().walls(-20, 120, 0, 144).joists(0, 144, 16, 32, 48, 64)
	p.line("BEAM-DROP", 80, 0, 80, 100).circle("POST", 80, 0, 2.75).circle("POST", 80, 100, 2.75)
	said := false
	for _, is := range p.group(loadPathOptions()).Issues {
		said = said || (is.Code == CodeEdgeBeam && is.Severity.String() == "warning" && strings.Contains(is.Msg, "run on past the ends"))
	}
	if !said {
		t.Errorf("no warning for the strip past the beam's end")
	}

	// An edge distance of 10 in beside a beam 16 in away: the joist takes
	// 10, the beam the other 6.
	opt := loadPathOptions()
	opt.EdgeDistanceIn = 10
	pl = newPlan().walls(-20, 120, 0, 144).joists(0, 144, 16, 32, 48, 64).line("BEAM-DROP", 80, -2, 80, 146).group(opt)
	if len(pl.Beams) != 1 || len(pl.Beams[0].Strips) != 1 {
		t.Fatalf("beams %+v", pl.Beams)
	}
	checkNear(t, "joist side + beam strip", member(t, pl, 64, 72).TribIn-8+pl.Beams[0].Strips[0].WidthIn, 16, 1e-6)

	// A zone notched to the joist's face at mid-length, 24 in past it
	// elsewhere: the widest part is taken (8 + 24 in), with FRM222.
	p = newPlan().walls(-20, 100, 0, 144).joists(0, 144, 16, 32, 48, 64)
	p.poly("LOAD-ZONE", true, Point{X: 8, Y: -10}, Point{X: 88, Y: -10}, Point{X: 88, Y: 60}, Point{X: 64.75, Y: 60},
		Point{X: 64.75, Y: 84}, Point{X: 88, Y: 84}, Point{X: 88, Y: 154}, Point{X: 8, Y: 154})
	p.text("LOAD-ZONE", "FLOOR", 30, 10, 6)
	checkNear(t, "notched zone: edge joist trib", member(t, p.group(DefaultOptions()), 64, 72).TribIn, 32, 1e-6)

	// FRM224 is not said of a girder the joists run on over, nor of a beam
	// whose other side's strip it carries already (FRM223).
	p = newPlan().walls(-20, 120, 0, 288).joists(0, 288, 16, 32, 48, 64)
	p.line("BEAM-DROP", 0, 100, 80, 100).circle("POST", 0, 100, 2.75).circle("POST", 80, 100, 2.75)
	if c := issueCodes(zone(p, "FLOOR", 8, -10, 72, 298).group(loadPathOptions()).Issues); c[CodeZonePastBeam] != 0 {
		t.Errorf("FRM224 on a girder with joists continuous over it")
	}
	p = newPlan().walls(-20, 80, 0, 144).joists(0, 144, 16, 32, 48, 64)
	p.line("BEAM-DROP", 80, 0, 80, 144).circle("POST", 80, 0, 2.75).circle("POST", 80, 144, 2.75)
	p.line("WALL", 224, -20, 224, 164)
	for y := 16.0; y <= 128; y += 16 {
		p.line("JOIST", 80, y, 224, y)
	}
	if c := issueCodes(zone(p, "FLOOR", 8, -10, 230, 154).group(loadPathOptions()).Issues); c[CodeZonePastBeam] != 0 {
		t.Errorf("FRM224 on a beam whose other side's strip it carries")
	}
}

// TestBeamInRun: a beam on two walls drawn where a joist would be, between
// the joists at x = 48 and 80 of a run: they take each other as neighbours
// across it (24 in each, on the safe side for them) and the beam's check
// lacks the floor over it: a warning says so (FRM225).
func TestBeamInRun(t *testing.T) {
	p := newPlan().walls(-20, 200, 0, 144).joists(0, 144, 16, 32, 48, 80, 96, 112)
	pl := p.line("BEAM-DROP", 64, -2, 64, 146).group(loadPathOptions())
	if len(pl.Beams) != 1 || pl.Beams[0].Rigid {
		t.Fatalf("beams %+v", pl.Beams)
	}
	said := false
	for _, is := range pl.Issues {
		said = said || (is.Code == CodeBeamInRun && strings.Contains(is.Msg, "B1 runs parallel between neighbouring joists"))
	}
	if !said {
		t.Errorf("no FRM225: %v", pl.Issues)
	}
	if c := issueCodes(newPlan().walls(-20, 200, 0, 144).joists(0, 144, 16, 32, 48, 80, 96, 112).group(loadPathOptions()).Issues); c[CodeBeamInRun] != 0 {
		t.Errorf("FRM225 with no beam")
	}
}

// TestBeamSeat: a beam whose end lands on another bears on a hanger's seat
// when that one is a flush beam or a ledger (its [[support]] bearing_in),
// on the other's width when it sits on a dropped beam drawn with two
// lines, and on that bearing_in on a single-line dropped beam (common
// practice, no source: NDS 3.10 bearing on the length that bears).
func TestBeamSeat(t *testing.T) {
	p := &Plan{Supports: []Support{{Kind: KindFlushBeam, BearingIn: 1.5}, {Kind: KindDroppedBeam, BearingIn: 3.5}}}
	for _, tc := range []struct {
		b    Beam
		want float64
	}{
		{Beam{Kind: KindFlushBeam, Supports: []int{0}, WidthIn: 4.5}, 1.5},
		{Beam{Kind: KindDroppedBeam, Supports: []int{1}, WidthIn: 5.25}, 5.25},
		{Beam{Kind: KindDroppedBeam, Supports: []int{1}}, 3.5},
	} {
		if got := beamSeatIn(p, &tc.b); got != tc.want {
			t.Errorf("%s %.2f in wide: seat %.2f in, want %.2f", tc.b.Kind, tc.b.WidthIn, got, tc.want)
		}
	}
}
