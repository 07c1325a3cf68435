package framing

import (
	"math"

	"framecheck/dxfimport"
)

// bayParSin: a drawn joist within this angle of a bay's span is one of
// its joists (twice the parallel tolerance of DefaultOptions, for joists
// drawn a little askew) (common practice, no source).
var bayParSin = math.Sin(2 * math.Pi / 180)

// maxBayJoists bounds the joists of one bay (a bay between supports miles
// long is a drawing mistake, and would exhaust memory).
const maxBayJoists = 100000

// layOut appends the joists of bay r to g.joists (see bays.go), or
// reports why it cannot.
func (g *grouper) layOut(r *bayRegion) {
	tol := g.opt.SnapToleranceIn
	if drawn := g.drawnInBay(r); drawn > 0 {
		g.plan.Issues.Add(r.pos, CodeBayDrawn, dxfimport.SevInfo,
			"%s (%s): %d joists are drawn in it; they are checked as drawn, with its callout %q, and none is laid out",
			r.what, entityRef(r.pos), drawn, r.co.text)
		r.ok = true
		return
	}
	if !(r.c1-r.c0 >= 0) {
		g.bayError(r, "its two end supports are not drawn side by side anywhere across it")
		return
	}
	cm := (r.c0 + r.c1) / 2
	base := scale(r.n, cm)
	_, _, ok0 := g.endSupport(base, r.u, r.a0, -1)
	_, _, ok1 := g.endSupport(base, r.u, r.a1, +1)
	if !ok0 || !ok1 {
		side, at := "start", r.a0
		if !ok1 {
			side, at = "end", r.a1
		}
		if !ok0 && !ok1 {
			side = "either"
		}
		g.bayError(r, "no support on its %s side near %s: each end of a bay is a support line across its span within %.4g in",
			side, g.drawingPoint(lerp(base, r.u, at)), g.opt.MaxWallThicknessIn+tol)
		return
	}
	s := r.co.SpacingIn
	if n := (r.c1 - r.c0) / s; n > maxBayJoists {
		g.bayError(r, "it is %.0f in wide: %.0f joists at %g in, more than the %d one bay may hold", r.c1-r.c0, n, s, maxBayJoists)
		return
	}
	var cs []float64
	for i := 0; ; i++ {
		c := r.c0 + float64(i)*s
		if c > r.c1+1e-6 {
			break
		}
		cs = append(cs, c)
	}
	if r.c1-cs[len(cs)-1] > tol {
		cs = append(cs, r.c1)
	}
	missed := 0
	for _, c := range cs {
		base := scale(r.n, c)
		t0, _, ok0 := g.endSupport(base, r.u, r.a0, -1)
		t1, _, ok1 := g.endSupport(base, r.u, r.a1, +1)
		if !ok0 || !ok1 || t1-t0 < 1 {
			missed++
			continue
		}
		g.joists = append(g.joists, segItem{a: lerp(base, r.u, t0), b: lerp(base, r.u, t1), pos: r.pos})
	}
	if missed > 0 {
		g.warn(r.pos, CodeBay, "%s (%s): %d of %d joist positions across it reach no support at one end and are left out",
			r.what, entityRef(r.pos), missed, len(cs))
	}
	r.ok = true
}

// inBay reports whether a line from a to b lies in bay r: parallel to its
// span, its midpoint inside the bay's extent (across within the snap
// tolerance).
func (g *grouper) inBay(r *bayRegion, a, b Point) bool {
	if math.Abs(cross(unit(sub(b, a)), r.u)) > bayParSin {
		return false
	}
	m := mid(a, b)
	c, at := dot(m, r.n), dot(m, r.u)
	tol := g.opt.SnapToleranceIn
	return c >= r.c0-tol && c <= r.c1+tol && at >= r.a0 && at <= r.a1
}

// drawnInBay counts the drawn joists lying in bay r.
func (g *grouper) drawnInBay(r *bayRegion) int {
	n := 0
	for i := 0; i < g.genFrom; i++ {
		if g.inBay(r, g.joists[i].a, g.joists[i].b) {
			n++
		}
	}
	return n
}

// bayCallouts adds the callout of each bay to the members in it (its
// generated joists, or the drawn ones of a bay whose joists are drawn).
func (g *grouper) bayCallouts(got *memberCallouts) {
	if len(g.bayRegions) == 0 {
		return
	}
	idx := g.memberIndex()
	if idx == nil {
		return
	}
	p := g.plan
	for i := range g.bayRegions {
		r := &g.bayRegions[i]
		if !r.ok {
			continue
		}
		am := (r.a0 + r.a1) / 2
		q0, q1 := add(scale(r.n, r.c0), scale(r.u, am)), add(scale(r.n, r.c1), scale(r.u, am))
		var ms []int
		idx.query(q0, q1, (r.a1-r.a0)/2+g.opt.SnapToleranceIn, func(k int) {
			m := &p.Members[k]
			if (m.Generated && m.Pos == r.pos) || (!m.Generated && g.inBay(r, m.Start, m.End)) {
				ms = append(ms, k)
			}
		})
		got.give(ms, r.co)
	}
}

// addBay keeps a closed polyline on a bay layer as a bay outline, and a
// text there as a label text (a bay's callout may sit on its own layer).
// Anything else is listed for one warning (a bay drawn as loose lines is
// not read).
func (g *grouper) addBay(e dxfimport.Entity) bool {
	switch {
	case isText(e):
		g.labelTexts = append(g.labelTexts, textItem{e.Points[0], e.Text, e.HeightIn, e.Pos})
	case isPoly(e) && len(e.Points) >= 3 && (e.Closed || dist(e.Points[0], e.Points[len(e.Points)-1]) <= g.opt.SnapToleranceIn):
		pts := append([]Point(nil), e.Points...)
		if dist(pts[0], pts[len(pts)-1]) < 1e-6 {
			pts = pts[:len(pts)-1]
		}
		g.bayPolys = append(g.bayPolys, polyItem{pts, e.Pos})
	default:
		g.bayLoose = append(g.bayLoose, e.Pos)
	}
	return true
}
