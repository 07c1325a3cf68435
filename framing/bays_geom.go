package framing

import (
	"math"
	"sort"
)

// The geometry of bays (bays.go): span lines and their arrowheads, the
// supports at their ends, and the tests that tell a span line from a
// callout line across drawn joists or along a beam.

// nearestLabelLine returns the label line nearest text t within its
// reach (the line its callout is read on, as calloutMembers reads it), or
// -1.
func (g *grouper) nearestLabelLine(t textItem) int {
	li := g.labelIndex()
	if li == nil {
		return -1
	}
	reach := calloutReachIn(t)
	bi := -1
	var near []int
	li.query(t.p, t.p, reach, func(i int) { near = append(near, i) })
	sort.Ints(near)
	for _, i := range near {
		l := g.labelLines[i]
		if d := distPointSeg(t.p, l.a, l.b); d <= reach {
			reach, bi = d, i
		}
	}
	return bi
}

// spanLineOf returns label line bi, or when it is short (an arrowhead)
// the longest label line touching one of its ends.
func (g *grouper) spanLineOf(bi int) int {
	tol := g.opt.SnapToleranceIn
	l := g.labelLines[bi]
	best, out := dist(l.a, l.b), bi
	if best >= minSpanLineIn {
		return bi
	}
	li := g.labelIndex()
	for _, p := range []Point{l.a, l.b} {
		li.query(p, p, tol, func(i int) {
			o := g.labelLines[i]
			if L := dist(o.a, o.b); L > best && (dist(o.a, p) <= tol || dist(o.b, p) <= tol) {
				best, out = L, i
			}
		})
	}
	return out
}

// spanLine returns label line bi as a span line: taken through the
// collinear label pieces touching its ends (a polyline arrow), with the
// number of arrowheads (short label lines at an angle touching its ends)
// at a and at b.
func (g *grouper) spanLine(bi int) (a, b Point, arrows [2]int) {
	tol := g.opt.SnapToleranceIn
	li := g.labelIndex()
	a, b = g.labelLines[bi].a, g.labelLines[bi].b
	u := unit(sub(b, a))
	for grown := true; grown; {
		grown = false
		li.query(a, b, tol, func(i int) {
			o := g.labelLines[i]
			if math.Abs(cross(u, sub(o.a, a))) > tol || math.Abs(cross(u, sub(o.b, a))) > tol {
				return
			}
			for _, q := range []Point{o.a, o.b} {
				switch t := dot(sub(q, a), u); {
				case t < -1e-9 && (dist(o.a, a) <= tol || dist(o.b, a) <= tol):
					a, grown = q, true
				case t > dist(a, b)+1e-9 && (dist(o.a, b) <= tol || dist(o.b, b) <= tol):
					b, grown = q, true
				}
			}
		})
	}
	L := dist(a, b)
	for end, p := range []Point{a, b} {
		li.query(p, p, tol, func(i int) {
			o := g.labelLines[i]
			if dist(o.a, o.b) < L/2 && math.Abs(cross(u, unit(sub(o.b, o.a)))) > 0.1 &&
				(dist(o.a, p) <= tol || dist(o.b, p) <= tol) {
				arrows[end]++
			}
		})
	}
	return a, b, arrows
}

// alongSupport reports whether segment ab runs along a support line
// (parallel within minBearingAngleDeg, within 12 in of it, overlapping
// half of ab): the callout line of a beam or wall, not a span line
// (common practice, no source).
func (g *grouper) alongSupport(a, b Point) bool {
	u := unit(sub(b, a))
	L := dist(a, b)
	minSin := math.Sin(minBearingAngleDeg * math.Pi / 180)
	found := false
	idx := g.supportIndex()
	if idx == nil {
		return false
	}
	idx.query(a, b, 12, func(i int) {
		s := &g.sups[i]
		if math.Abs(cross(u, unit(sub(s.b, s.a)))) >= minSin || math.Abs(cross(u, sub(mid(s.a, s.b), a))) > 12 {
			return
		}
		t0, t1 := dot(sub(s.a, a), u), dot(sub(s.b, a), u)
		if math.Min(math.Max(t0, t1), L)-math.Max(math.Min(t0, t1), 0) >= L/2 {
			found = true
		}
	})
	return found
}

// crossesDrawnJoist reports whether segment ab crosses a drawn joist at
// minBearingAngleDeg or more.
func (g *grouper) crossesDrawnJoist(a, b Point) bool {
	if len(g.joists) == 0 {
		return false
	}
	if g.jIdx == nil {
		g.jIdx = indexSegs(g.joists)
	}
	u := unit(sub(b, a))
	L := dist(a, b)
	minSin := math.Sin(minBearingAngleDeg * math.Pi / 180)
	found := false
	g.jIdx.query(a, b, 0, func(i int) {
		j := g.joists[i]
		t, s, sin, ok := segParams(a, u, j.a, j.b)
		if ok && sin >= minSin && t >= 0 && t <= L && s >= 0 && s <= 1 {
			found = true
		}
	})
	return found
}

// endSupport finds the support met at one end of a line from base along
// u, near t = at: the support line crossing it at spanSupportSin or more
// nearest to at, within the thickest wall plus the snap tolerance, and the
// outermost line (toward dir) within the thickest wall of that one. It
// returns the outermost line's t and its index.
func (g *grouper) endSupport(base, u Point, at, dir float64) (float64, int, bool) {
	reach := g.opt.MaxWallThicknessIn + g.opt.SnapToleranceIn
	tol := g.opt.SnapToleranceIn
	type cand struct {
		t float64
		s int
	}
	var cs []cand
	idx := g.supportIndex()
	if idx == nil {
		return 0, -1, false
	}
	p0, p1 := lerp(base, u, at-reach), lerp(base, u, at+reach)
	idx.query(p0, p1, tol, func(s int) {
		sg := &g.sups[s]
		t, _, sin, ok := segParams(base, u, sg.a, sg.b)
		if !ok || sin < spanSupportSin || math.Abs(t-at) > reach {
			return
		}
		if distPointSeg(lerp(base, u, t), sg.a, sg.b) > tol {
			return // the line passes beyond the support's drawn end
		}
		cs = append(cs, cand{t, s})
	})
	sort.Slice(cs, func(i, j int) bool { return cs[i].s < cs[j].s }) // drawing order, whatever the grid's
	if len(cs) == 0 {
		return 0, -1, false
	}
	near := cs[0]
	for _, c := range cs[1:] {
		if math.Abs(c.t-at) < math.Abs(near.t-at) {
			near = c
		}
	}
	out := near
	for _, c := range cs {
		if dir*(c.t-out.t) > 0 && math.Abs(c.t-near.t) <= g.opt.MaxWallThicknessIn {
			out = c
		}
	}
	return out.t, out.s, true
}

// supportExtent returns the extent across (along n) of the support lines
// through p, with the collinear lines joined end to end to them.
func (g *grouper) supportExtent(p, n Point) (lo, hi float64) {
	tol := g.opt.SnapToleranceIn
	lo, hi = math.Inf(1), math.Inf(-1)
	var on []int
	for s, sg := range g.sups {
		if distPointSeg(p, sg.a, sg.b) <= tol {
			on = append(on, s)
		}
	}
	for grown := true; grown; {
		grown = false
		for s, sg := range g.sups {
			c0, c1 := dot(sg.a, n), dot(sg.b, n)
			if c0 > c1 {
				c0, c1 = c1, c0
			}
			use := false
			for _, o := range on {
				if o == s {
					use = true
					break
				}
			}
			if !use {
				// collinear with one on the list, touching the extent so far
				for _, o := range on {
					og := g.sups[o]
					ou := unit(sub(og.b, og.a))
					if math.Abs(cross(ou, sub(sg.a, og.a))) <= tol && math.Abs(cross(ou, sub(sg.b, og.a))) <= tol &&
						c0 <= hi+tol && c1 >= lo-tol {
						on, grown, use = append(on, s), true, true
						break
					}
				}
			}
			if use && (c0 < lo || c1 > hi) {
				lo, hi = math.Min(lo, c0), math.Max(hi, c1)
				grown = true
			}
		}
		if len(on) == 0 {
			break
		}
	}
	return lo, hi
}
