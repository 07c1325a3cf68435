package framing

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"framecheck/dxfimport"
)

type zoneGeom struct {
	ZoneOutline
	lo, hi Point
}

// assignZones names the zone outlines by the text inside each (the
// smallest outline holding the text's insertion point) and gives every
// member its zone or zones.
func (g *grouper) assignZones() {
	p := g.plan
	names := make([][]textItem, len(g.zonePolys))
	areas := make([]float64, len(g.zonePolys))
	// Every outline's box in a grid, so that each name text is tried only
	// against the outlines whose box holds it (not against all of them).
	boxes := make([]zoneGeom, len(g.zonePolys))
	for i, z := range g.zonePolys {
		areas[i] = polygonArea(z.pts)
		boxes[i].lo, boxes[i].hi = polyBox(z.pts)
	}
	boxIdx := newZoneIndex(boxes)
	for _, t := range g.zoneTexts {
		best := -1
		for _, i := range boxIdx.candidates(boxes, t.p, t.p) {
			if pointInPolygon(t.p, g.zonePolys[i].pts) && (best < 0 || areas[i] < areas[best]) {
				best = i
			}
		}
		name := zoneName(t.text)
		if best < 0 {
			g.warn(t.pos, CodeZoneName, "zone name %q is outside every zone outline; ignored", name)
			continue
		}
		names[best] = append(names[best], textItem{p: t.p, text: name, pos: t.pos})
	}
	var zs []zoneGeom
	for i, z := range g.zonePolys {
		if len(names[i]) == 0 {
			g.warn(z.pos, CodeZoneName, "zone outline has no name text inside; ignored")
			continue
		}
		for _, o := range names[i][1:] {
			if o.text != names[i][0].text {
				g.warn(o.pos, CodeZoneName, "zone outline holds two names, %q and %q; using %q",
					names[i][0].text, o.text, names[i][0].text)
			}
		}
		zg := zoneGeom{ZoneOutline: ZoneOutline{Name: names[i][0].text, Points: z.pts, AreaIn2: areas[i], Pos: z.pos}}
		zg.lo, zg.hi = boxes[i].lo, boxes[i].hi
		zs = append(zs, zg)
		p.Zones = append(p.Zones, zg.ZoneOutline)
	}
	if len(zs) == 0 && g.opt.DefaultZone != "" {
		all := make([]string, len(p.Members)) // one allocation, no aliasing
		for k := range p.Members {
			all[k] = g.opt.DefaultZone
			p.Members[k].Zones = all[k : k+1 : k+1]
		}
		return
	}
	idx := newZoneIndex(zs)
	// Each goroutine reads the zones and their grid (through a cursor of
	// its own) and writes the zones, pieces, errors and messages of its
	// own range of members; its issues are appended after, in member
	// order.
	spans := g.split(len(p.Members))
	issues := make(issueLists, len(spans))
	parallel(spans, func(w int, sp span) {
		q := idx.newQuery()
		var sc zoneScratch
		for k := sp.lo; k < sp.hi; k++ {
			g.memberZones(q, &sc, &issues[w], k, zs)
			g.edgeZoneStrip(q, &issues[w], k, zs)
		}
	})
	issues.appendTo(&p.Issues)
}

// edgeStripTolIn: a load zone reaching this little past an edge joist's
// own width is drawn to the joist (common practice, no source: the
// thickness of a 2x, 1.5 in).
const edgeStripTolIn = 1.5

// edgeZoneStrip widens member k's tributary width on each side where it
// has neither a neighbouring joist nor a parallel support line
// (edgeOpen) but its load zone reaches on past it: the strip between the
// joist and the zone's edge is loaded and nothing else drawn carries it
// (sheathing cantilevered past the edge joist), so the joist carries all
// of it, up to edgeSupportReachIn (a warning: the load comes from how the
// outline is drawn). A zone reaching farther is a strip whose load
// reaches no member drawn: a warning too, and the joist keeps the edge
// distance. The strip is measured square to the member from five places
// along it, in the innermost outline holding each: the widest is taken.
func (g *grouper) edgeZoneStrip(q *zoneQuery, iss *dxfimport.IssueList, k int, zs []zoneGeom) {
	if g.edgeOpen == nil || g.edgeOpen[k] == 0 {
		return
	}
	p := g.plan
	m := &p.Members[k]
	// the zone is looked at along the joist, at a tenth, three tenths, ...
	// of its length: the strip it reaches past the joist is the widest of
	// them (a zone notched or bumped out along the joist: its widest part,
	// on the safe side)
	var at [len(zoneSamples)]Point
	var zat [len(zoneSamples)]int
	found := false
	for i, f := range zoneSamples {
		at[i] = lerp(m.Start, unit(sub(m.End, m.Start)), f*m.LengthIn)
		zat[i] = innermostZone(q, zs, at[i])
		found = found || zat[i] >= 0
	}
	if !found {
		return
	}
	n := g.groups[g.grp[k]].n
	// the member's left side is the larger-across one when the group
	// normal is its left normal (setTrib)
	hiIsLeft := dot(n, rot90(p.dirs[k])) > 0
	for side := 0; side < 2; side++ {
		if g.edgeOpen[k]&(1<<side) == 0 {
			continue
		}
		v := n
		if side == 0 {
			v = scale(n, -1)
		}
		t, z := math.Inf(-1), -1
		for i := range at {
			if zat[i] < 0 {
				continue
			}
			if ti := rayExit(at[i], v, zs[zat[i]].Points); !math.IsInf(ti, 0) && ti > t {
				t, z = ti, zat[i]
			}
		}
		if z < 0 {
			continue
		}
		trib := &m.TribRightIn
		if (side == 1) == hiIsLeft {
			trib = &m.TribLeftIn
		}
		if t <= *trib+edgeStripTolIn {
			continue
		}
		if t > edgeSupportReachIn {
			iss.Add(m.Pos, CodeEdgeZone, dxfimport.SevWarning, "%s is an edge joist, and its load zone %s reaches %.1f in past it "+
				"with no joist or support line drawn within %.0f in on that side: the load of that strip reaches no member drawn; "+
				"the joist takes only the edge distance (%.2f in) there: draw the framing beyond it, or check that strip by hand",
				m.ID, zs[z].Name, t, float64(edgeSupportReachIn), *trib)
			continue
		}
		*trib = t
		m.TribIn = m.TribLeftIn + m.TribRightIn
		iss.Add(m.Pos, CodeEdgeZone, dxfimport.SevWarning, "%s is an edge joist, and its load zone %s reaches %.1f in past it "+
			"with no joist or support line there (sheathing cantilevered past it): it carries that whole strip, tributary width %.2f in "+
			"(if the zone outline reaches past the framing only as drawn, draw it to the edge of the deck)",
			m.ID, zs[z].Name, t, m.TribIn)
	}
}

// zoneSamples are the places along an edge joist, as fractions of its
// length, where edgeZoneStrip measures how far its zone reaches past it.
var zoneSamples = [...]float64{0.1, 0.3, 0.5, 0.7, 0.9}

// innermostZone returns the index in zs of the smallest outline holding
// c, looked up through q, or -1.
func innermostZone(q *zoneQuery, zs []zoneGeom, c Point) int {
	z := -1
	for _, i := range q.candidates(zs, c, c) {
		if pointInPolygon(c, zs[i].Points) && (z < 0 || zs[i].AreaIn2 < zs[z].AreaIn2) {
			z = i
		}
	}
	return z
}

// rayExit returns how far from c, along the unit vector v, the ray first
// meets the edge of polygon pts (c inside it), or +Inf.
func rayExit(c, v Point, pts []Point) float64 {
	best := math.Inf(1)
	for i, j := 0, len(pts)-1; i < len(pts); j, i = i, i+1 {
		a, b := pts[j], pts[i]
		e := sub(b, a)
		den := cross(v, e)
		if den == 0 {
			continue
		}
		w := sub(a, c)
		t := cross(w, e) / den // along the ray
		s := cross(w, v) / den // along the edge, 0..1
		if t > 0 && s >= 0 && s <= 1 && t < best {
			best = t
		}
	}
	return best
}

// zoneScratch is one goroutine's buffers for memberZones.
type zoneScratch struct {
	ts     []float64
	pieces []ZonePiece
	names  []string
	slab   slab[string] // the members' Zones
}

// polyBox returns the bounding box of pts.
func polyBox(pts []Point) (lo, hi Point) {
	lo, hi = Point{X: math.Inf(1), Y: math.Inf(1)}, Point{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, q := range pts {
		lo.X, lo.Y = math.Min(lo.X, q.X), math.Min(lo.Y, q.Y)
		hi.X, hi.Y = math.Max(hi.X, q.X), math.Max(hi.Y, q.Y)
	}
	return lo, hi
}

// zoneIndex finds the zones whose bounding box a member's may overlap: a
// grid over the zones' boxes, each zone listed in every cell its box
// touches. With many units, each in its own zone, this keeps zone lookup
// from growing with members x zones.
type zoneIndex struct {
	grid *segIndex
	own  *zoneQuery // candidates'
}

// zoneQuery is the state of one goroutine's lookups in a zoneIndex.
type zoneQuery struct {
	x    *zoneIndex
	cur  *segCursor
	cand []int
}

// newQuery returns a lookup for one goroutine: several may look up one
// index at once, each with its own.
func (x *zoneIndex) newQuery() *zoneQuery {
	q := &zoneQuery{x: x}
	if x.grid != nil {
		q.cur = x.grid.newCursor()
	}
	return q
}

func newZoneIndex(zs []zoneGeom) *zoneIndex {
	if len(zs) == 0 {
		return &zoneIndex{}
	}
	lo, hi := zs[0].lo, zs[0].hi
	typ := 0.0
	for i := range zs {
		lo.X, lo.Y = math.Min(lo.X, zs[i].lo.X), math.Min(lo.Y, zs[i].lo.Y)
		hi.X, hi.Y = math.Max(hi.X, zs[i].hi.X), math.Max(hi.Y, zs[i].hi.Y)
		typ += math.Max(zs[i].hi.X-zs[i].lo.X, zs[i].hi.Y-zs[i].lo.Y)
	}
	g := newSegIndex(lo, hi, len(zs), typ/float64(len(zs)))
	for id := range zs {
		i0, j0, i1, j1 := g.cellRange(zs[id].lo, zs[id].hi, 1)
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				g.cells[j*g.nx+i] = append(g.cells[j*g.nx+i], int32(id))
			}
		}
	}
	return &zoneIndex{grid: g}
}

// candidates returns, in increasing order, the zones whose bounding box
// overlaps that of segment ab. The slice is reused by the next call.
func (x *zoneIndex) candidates(zs []zoneGeom, a, b Point) []int {
	if x.own == nil {
		x.own = x.newQuery()
	}
	return x.own.candidates(zs, a, b)
}

// candidates is zoneIndex.candidates through q. The slice is reused by
// q's next call.
func (q *zoneQuery) candidates(zs []zoneGeom, a, b Point) []int {
	q.cand = q.cand[:0]
	if q.x.grid == nil {
		return q.cand
	}
	q.x.grid.queryWith(q.cur, a, b, 1, func(i int) {
		z := &zs[i]
		if math.Max(a.X, b.X) >= z.lo.X && math.Min(a.X, b.X) <= z.hi.X &&
			math.Max(a.Y, b.Y) >= z.lo.Y && math.Min(a.Y, b.Y) <= z.hi.Y {
			q.cand = append(q.cand, i)
		}
	})
	sort.Ints(q.cand)
	return q.cand
}

// memberZones cuts member k where it crosses zone edges and takes the
// innermost zone of each piece; an end piece no longer than
// MaxWallThicknessIn (an end running into the wall on a zone edge) joins
// the piece beside it. Pieces outside every outline belong to
// DefaultZone. A member in several zones keeps its pieces (ZonePieces):
// each zone loads it where it acts. It looks zones up through q, works in
// sc and adds its issues to iss.
func (g *grouper) memberZones(q *zoneQuery, sc *zoneScratch, iss *dxfimport.IssueList, k int, zs []zoneGeom) {
	m := &g.plan.Members[k]
	a, b := m.Start, m.End
	cand := q.candidates(zs, a, b)
	ts := append(sc.ts[:0], 0, 1)
	defer func() { sc.ts = ts }() // keep the buffer
	d := sub(b, a)
	for _, i := range cand {
		pts := zs[i].Points
		for e := range pts {
			q0, q1 := pts[e], pts[(e+1)%len(pts)]
			t, s, _, ok := segParams(a, d, q0, q1)
			if ok && t > 0 && t < 1 && s >= 0 && s <= 1 {
				ts = append(ts, t)
			}
		}
	}
	sort.Float64s(ts)
	innermost := func(q Point) string {
		best := -1
		for _, i := range cand {
			if pointInPolygon(q, zs[i].Points) && (best < 0 || zs[i].AreaIn2 < zs[best].AreaIn2) {
				best = i
			}
		}
		if best < 0 {
			return ""
		}
		return zs[best].Name
	}
	// Stretches between crossings, each in its innermost zone ("" outside
	// every outline), neighbours in the same zone merged.
	pieces := sc.pieces[:0]
	defer func() { sc.pieces = pieces[:0] }()
	for i := 1; i < len(ts); i++ {
		if ts[i]-ts[i-1] <= 0 {
			continue
		}
		z := innermost(lerp(a, d, (ts[i]+ts[i-1])/2))
		from, to := ts[i-1]*m.LengthIn, ts[i]*m.LengthIn
		if n := len(pieces); n > 0 && pieces[n-1].Zone == z {
			pieces[n-1].ToIn = to
			continue
		}
		pieces = append(pieces, ZonePiece{FromIn: from, ToIn: to, Zone: z})
	}
	// An end stretch no longer than MaxWallThicknessIn (the end running
	// into the wall on a zone edge) belongs to the stretch beside it.
	for len(pieces) > 1 && pieces[0].ToIn-pieces[0].FromIn <= g.opt.MaxWallThicknessIn {
		pieces[1].FromIn = pieces[0].FromIn
		pieces = pieces[1:]
	}
	for n := len(pieces); n > 1 && pieces[n-1].ToIn-pieces[n-1].FromIn <= g.opt.MaxWallThicknessIn; n = len(pieces) {
		pieces[n-2].ToIn = pieces[n-1].ToIn
		pieces = pieces[:n-1]
	}
	if len(pieces) == 0 {
		pieces = append(pieces, ZonePiece{FromIn: 0, ToIn: m.LengthIn, Zone: innermost(mid(a, b))})
	}
	outside := false
	for i := range pieces {
		if pieces[i].Zone == "" {
			outside = true
			pieces[i].Zone = g.opt.DefaultZone
		}
	}
	// merge again: a stretch outside every outline may have taken the
	// default zone of its neighbour
	merged := pieces[:1]
	for _, p := range pieces[1:] {
		if last := &merged[len(merged)-1]; last.Zone == p.Zone {
			last.ToIn = p.ToIn
		} else {
			merged = append(merged, p)
		}
	}
	pieces = merged
	out := sc.names[:0]
	for _, p := range pieces {
		if p.Zone != "" && !slices.Contains(out, p.Zone) {
			out = append(out, p.Zone)
		}
	}
	sort.Strings(out)
	m.Zones = sc.slab.take(out)
	sc.names = out
	if outside && g.opt.DefaultZone == "" {
		m.Error = true
		msg := fmt.Sprintf("%s lies (partly) outside every load-zone outline and there is no default zone", m.ID)
		m.Messages = append(m.Messages, msg)
		iss.Add(m.Pos, CodeNoZone, dxfimport.SevError, "%s", msg)
	}
	if len(pieces) > 1 {
		m.ZonePieces = slices.Clone(pieces)
		parts := make([]string, len(pieces))
		for i, p := range pieces {
			parts[i] = fmt.Sprintf("%s from %.1f to %.1f in (%.1f in)", p.Zone, p.FromIn, p.ToIn, p.ToIn-p.FromIn)
		}
		msg := fmt.Sprintf("%s crosses zone edges: each zone loads it where it acts: %s", m.ID, strings.Join(parts, ", "))
		m.Messages = append(m.Messages, msg)
		iss.Add(m.Pos, CodeZonePieces, dxfimport.SevInfo, "%s", msg)
	}
}

// zoneName is the first non-blank line of a zone's name text, trimmed: an
// MTEXT may carry the loads on the lines below the name.
func zoneName(text string) string {
	for _, l := range strings.Split(text, "\n") {
		if l = strings.TrimSpace(l); l != "" {
			return l
		}
	}
	return ""
}
