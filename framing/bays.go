package framing

import (
	"fmt"
	"math"

	"framecheck/dxfimport"
)

// Bays shown by a span symbol (DOMAIN.md "Drawings as people draw them").
//
// Most framing plans do not draw every joist: a bay is outlined (a closed
// polyline on a bay layer) or a span line is drawn across it on the label
// layer (with arrowheads, half-arrows, or none), and a size callout such
// as `2x10 @ 16" o.c.` says what fills it. framing lays the joists out
// before it groups members, so every rule that applies to a drawn joist
// (bearings, tributary widths, zones, marks, blocking rows, takeoff)
// applies to them; each is marked Member.Generated.
//
// The conventions read, and the choices made where drawings are silent:
//
//   - The joists run parallel to the span line. A bay outline without a
//     span line inside it spans between the pair of its opposite edges
//     that lie on support lines.
//   - A span line is a label-layer line at least 24 in long with a callout
//     whose nearest label line it is, that crosses no drawn joist, does not
//     run along a support line (a beam's callout), and whose ends both reach
//     support lines crossing it at 45 degrees or more (within the thickest
//     wall plus the snap tolerance). Arrowheads and half-arrows (short lines
//     at its ends) and collinear pieces at its ends (a polyline arrow with
//     width) belong to it; SOLID arrowheads are not read by the importer at
//     all. With arrowheads at both ends it is a span symbol even when an end
//     reaches no support, which is then an error; a line with an arrowhead
//     at one end at most and a support at one end at most is a leader, read
//     as before (a callout that reaches no joist).
//   - Across, a span line's bay is the stretch where both its end supports
//     are drawn, cut at the nearest support line parallel to it on each
//     side (a side wall or beam); an outline's bay is its own width.
//   - The first joist is at the bay's edge of smaller offset across (the
//     left edge, the bottom edge for joists running left to right), then
//     one every callout spacing; a last joist is added at the far edge when
//     the remaining gap is more than the snap tolerance.
//   - Each joist runs from support to support: at each end it stops on the
//     outermost line of the support met there (a double-line wall is borne
//     over its full thickness), as a drawn joist would.
//   - A bay with joists drawn in it (parallel to its span, midpoints inside)
//     is not laid out again: its callout applies to the drawn joists.
//
// The choices are common practice, no source.

// Issue codes of bays (FRM2xx, geometry).
const (
	CodeBay      = "FRM219" // bay or span symbol that cannot be laid out: error, nothing generated
	CodeBayDrawn = "FRM220" // bay whose joists are drawn: its callout applies to them, none generated
)

// minSpanLineIn: a label line shorter than this is not a span line (an
// arrowhead, a leader tick) (common practice, no source).
const minSpanLineIn = 24

// spanSupportSin: a span line's end support crosses it at 45 degrees or
// more (common practice, no source).
var spanSupportSin = math.Sqrt2 / 2

// bayRegion is one bay: its frame, extent and callout.
type bayRegion struct {
	pos    dxfimport.Pos // the outline or span line
	what   string        // "bay outline" or "span line", for messages
	u, n   Point         // span direction; across normal (n.X > 0, or n.Y > 0)
	c0, c1 float64       // extent across, in
	a0, a1 float64       // extent along, as drawn, in
	co     callout
	ok     bool // its callout applies to the members inside it
}

// bays reads the bay outlines and span symbols and appends their joists
// to g.joists. It runs only when the drawing has bay outlines, or label
// lines and texts and supports (a span line needs all three).
func (g *grouper) bays() {
	if len(g.bayLoose) > 0 {
		g.warn(g.bayLoose[0], CodeBay, "%d entities on bay layers left out (%s): a bay is read from a closed polyline",
			len(g.bayLoose), handles(g.bayLoose, 3))
	}
	if len(g.bayPolys) == 0 && (len(g.labelLines) == 0 || len(g.labelTexts) == 0 || len(g.sups) == 0) {
		return
	}
	g.bayText = make([]bool, len(g.labelTexts))
	var regions []bayRegion
	for _, bp := range g.bayPolys {
		if r, ok := g.outlineBay(bp); ok {
			regions = append(regions, r)
		}
	}
	if len(g.labelLines) > 0 && len(g.sups) > 0 {
		// the callout texts of each label line, in drawing order (a
		// callout may be written as several texts on one line)
		var lines []int
		texts := map[int][]int{}
		for ti, t := range g.labelTexts {
			if g.bayText[ti] || !calloutLikeRE.MatchString(t.text) {
				continue
			}
			bi := g.nearestLabelLine(t)
			if bi < 0 {
				continue
			}
			bi = g.spanLineOf(bi)
			if texts[bi] == nil {
				lines = append(lines, bi)
			}
			texts[bi] = append(texts[bi], ti)
		}
		for _, bi := range lines {
			if r, ok := g.spanLineBay(bi, texts[bi]); ok {
				regions = append(regions, r)
			}
		}
	}
	if len(regions) == 0 {
		return
	}
	g.genFrom = len(g.joists)
	for i := range regions {
		g.layOut(&regions[i])
	}
	g.bayRegions = regions
	if g.jol != nil || g.rawOf != nil {
		for i := g.genFrom; i < len(g.joists); i++ {
			if g.jol != nil {
				g.jol = append(g.jol, -1)
			}
			if g.rawOf != nil {
				g.rawOf = append(g.rawOf, -1)
			}
		}
	}
}

// bayError reports a bay that cannot be laid out; nothing is generated
// in it and the rest of the plan runs.
func (g *grouper) bayError(r *bayRegion, format string, args ...any) {
	g.plan.Issues.Add(r.pos, CodeBay, dxfimport.SevError, "%s (%s): %s; no joists laid out in it",
		r.what, entityRef(r.pos), fmt.Sprintf(format, args...))
}

// frame sets r.u (oriented as given) and r.n, with exact axes kept exact.
func (r *bayRegion) frame(u Point) {
	switch {
	case math.Abs(u.Y) < 1e-12:
		u = Point{X: math.Copysign(1, u.X)}
	case math.Abs(u.X) < 1e-12:
		u = Point{Y: math.Copysign(1, u.Y)}
	}
	r.u = u
	n := rot90(u)
	if n.X < -1e-12 || (math.Abs(n.X) <= 1e-12 && n.Y < 0) {
		n = scale(n, -1)
	}
	r.n = n
}

// readBayCallout reads the callout of a bay from the label texts given;
// false (with an error reported) when there is none it can use.
func (g *grouper) readBayCallout(r *bayRegion, texts []int) bool {
	var got []callout
	for _, ti := range texts {
		t := g.labelTexts[ti]
		co, err := g.readCallout(t.text)
		if err != nil {
			if !anySizeRE.MatchString(normalizeCallout(t.text)) {
				continue // a room name or a note
			}
			g.bayError(r, "its callout %q (%s) cannot be read: %v", flatText(t.text), entityRef(t.pos), err)
			return false
		}
		got = append(got, callout{co, flatText(t.text), t.pos})
	}
	if len(got) == 0 {
		g.bayError(r, "no size callout (such as 2x10 @ 16\" o.c.) on a label layer inside it or beside its span line")
		return false
	}
	c := got[0]
	for _, o := range got[1:] {
		if err := c.merge(o.Callout); err != nil || o.Designation() != c.Designation() {
			g.bayError(r, "callouts %q (%s) and %q (%s) disagree", c.text, entityRef(c.pos), o.text, entityRef(o.pos))
			return false
		}
	}
	if c.SpacingIn <= 0 {
		g.bayError(r, "its callout %q (%s) gives no spacing (such as @ 16\" o.c.), so the joists cannot be laid out", c.text, entityRef(c.pos))
		return false
	}
	r.co = c
	return true
}

// outlineBay reads a closed outline on a bay layer.
func (g *grouper) outlineBay(bp polyItem) (bayRegion, bool) {
	r := bayRegion{pos: bp.pos, what: "bay outline"}
	var texts []int
	for ti, t := range g.labelTexts {
		if !g.bayText[ti] && pointInPolygon(t.p, bp.pts) {
			texts = append(texts, ti)
			g.bayText[ti] = true
		}
	}
	// the span line: the longest label line with its midpoint inside;
	// a callout written beside it outside the outline is the bay's too
	best, sl := 0.0, -1
	var u Point
	for i, l := range g.labelLines {
		if L := dist(l.a, l.b); L >= minSpanLineIn && L > best && pointInPolygon(mid(l.a, l.b), bp.pts) {
			best, sl, u = L, i, unit(sub(l.b, l.a))
		}
	}
	if sl >= 0 {
		for ti, t := range g.labelTexts {
			if !g.bayText[ti] && calloutLikeRE.MatchString(t.text) && g.nearestLabelLine(t) == sl {
				texts = append(texts, ti)
				g.bayText[ti] = true
			}
		}
	}
	if best == 0 {
		var ok bool
		if u, ok = g.outlineSpanDir(bp.pts); !ok {
			g.bayError(&r, "cannot tell which way it spans: no span line inside it, and not exactly one pair of its opposite edges lies on support lines")
			return r, false
		}
	}
	r.frame(u)
	r.c0, r.c1, r.a0, r.a1 = math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, q := range bp.pts {
		c, a := dot(q, r.n), dot(q, r.u)
		r.c0, r.c1 = math.Min(r.c0, c), math.Max(r.c1, c)
		r.a0, r.a1 = math.Min(r.a0, a), math.Max(r.a1, a)
	}
	return r, g.readBayCallout(&r, texts)
}

// outlineSpanDir returns the span direction of a bay outline without a
// span line: across the edges that lie on support lines (parallel within
// 5 degrees, within the thickest wall plus the snap tolerance, overlapping
// half the edge), when those edges all run one way.
func (g *grouper) outlineSpanDir(pts []Point) (Point, bool) {
	reach := g.opt.MaxWallThicknessIn + g.opt.SnapToleranceIn
	parSin := math.Sin(5 * math.Pi / 180)
	var dir Point
	found := false
	for i := range pts {
		a, b := pts[i], pts[(i+1)%len(pts)]
		L := dist(a, b)
		if L < minEdgeIn {
			continue
		}
		e := unit(sub(b, a))
		on := false
		for _, s := range g.sups {
			su := unit(sub(s.b, s.a))
			if math.Abs(cross(e, su)) > parSin || math.Abs(cross(e, sub(s.a, a))) > reach {
				continue
			}
			t0, t1 := dot(sub(s.a, a), e), dot(sub(s.b, a), e)
			if t0 > t1 {
				t0, t1 = t1, t0
			}
			if math.Min(t1, L)-math.Max(t0, 0) >= L/2 {
				on = true
				break
			}
		}
		if !on {
			continue
		}
		if found && math.Abs(cross(dir, e)) > parSin {
			return Point{}, false // edges on supports both ways
		}
		dir, found = e, true
	}
	if !found {
		return Point{}, false
	}
	return rot90(dir), true
}

// spanLineBay reads label line bi, with the callout texts ti that lie
// nearest it, as a span symbol when it is one (see the top of this file).
func (g *grouper) spanLineBay(bi int, ti []int) (bayRegion, bool) {
	a, b, arrows := g.spanLine(bi)
	L := dist(a, b)
	if L < minSpanLineIn {
		return bayRegion{}, false
	}
	u := unit(sub(b, a))
	t0, _, ok0 := g.endSupport(a, u, 0, -1)
	t1, _, ok1 := g.endSupport(a, u, L, +1)
	if !(ok0 && ok1) && !(arrows[0] > 0 && arrows[1] > 0) {
		// a leader (an arrowhead at one end at most), a note: left to
		// assignLumber, as before bays were read
		return bayRegion{}, false
	}
	if g.alongSupport(a, b) {
		return bayRegion{}, false // the callout of a beam or wall, drawn along it
	}
	if g.crossesDrawnJoist(a, b) {
		return bayRegion{}, false // a callout line across drawn joists
	}
	r := bayRegion{pos: g.labelLines[bi].pos, what: "span line"}
	r.frame(u)
	for _, i := range ti {
		g.bayText[i] = true
	}
	if !ok0 || !ok1 {
		side := "its start"
		p := a
		if !ok1 {
			side, p = "its end", b
		}
		if !ok0 && !ok1 {
			side = "either end"
		}
		g.bayError(&r, "no support at %s near %s: a span line runs from support to support, each a support line across it within %.4g in of its end",
			side, g.drawingPoint(p), g.opt.MaxWallThicknessIn+g.opt.SnapToleranceIn)
		return r, false
	}
	if !g.readBayCallout(&r, ti) {
		return r, false
	}
	// across: where both end supports are drawn, cut at parallel supports
	c := dot(a, r.n)
	r.a0, r.a1 = dot(a, r.u)+math.Min(t0, 0), dot(a, r.u)+math.Max(t1, L)
	r.c0, r.c1 = math.Inf(-1), math.Inf(1)
	for _, end := range []float64{t0, t1} {
		lo, hi := g.supportExtent(lerp(a, u, end), r.n)
		r.c0, r.c1 = math.Max(r.c0, lo), math.Min(r.c1, hi)
	}
	minSin := math.Sin(minBearingAngleDeg * math.Pi / 180)
	for _, s := range g.sups {
		if math.Abs(cross(unit(sub(s.b, s.a)), r.u)) >= minSin {
			continue
		}
		sa, sb := dot(s.a, r.u), dot(s.b, r.u)
		if math.Min(math.Max(sa, sb), r.a1)-math.Max(math.Min(sa, sb), r.a0) < (r.a1-r.a0)/2 {
			continue
		}
		sc := dot(mid(s.a, s.b), r.n)
		switch {
		case sc < c-g.opt.SnapToleranceIn:
			r.c0 = math.Max(r.c0, sc)
		case sc > c+g.opt.SnapToleranceIn:
			r.c1 = math.Min(r.c1, sc)
		}
	}
	return r, true
}
