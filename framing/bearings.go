package framing

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"sort"

	"framecheck/dxfimport"
)

// minBearingAngleDeg: a support line within this angle of a joist's
// direction runs along the joist rather than under it and is not a bearing
// (common practice, no source).
const minBearingAngleDeg = 10

// minSupportFrac: a support line shorter than this fraction of a member's
// length (a tick, the end of a wall drawn across it) is not a bearing of
// that member, unless it is longer than the thickest wall plus the snap
// tolerance (a wall drawn in pieces between openings still bears a long
// continuous member) (common practice, no source).
const minSupportFrac = 0.1

// drawnTwiceIn: support lines met closer than this along a member are
// one line drawn twice or in pieces, whatever their kinds (sheathing
// drawn beside a plate is 3/8 in or more from it).
const drawnTwiceIn = 0.25

// sameLineIn: two support lines met closer than this along a joist are one
// line drawn twice or in pieces, not a double-line wall.
const sameLineIn = 0.5

type hit struct {
	t      float64 // along the member from Start
	sup    int
	sin    float64 // sine of the joist-support angle
	direct bool    // crossed, or reached within the snap tolerance
}

// findBearings finds each member's supports through a grid over the
// support lines, merges double-line walls and sets spans, overhangs,
// hangers and errors.
//
// The members are shared out among goroutines in contiguous ranges
// (parallel.go). Each goroutine reads the support lines, their grid
// (through a cursor of its own) and its members' geometry, and writes
// only its own members (bearings, overhangs, hangers, errors and
// messages), g.bdirs of those members, and its own scratch, slabs, issue
// list and merged groups. A bearing on a merged group names it, until
// Plan.Supports is built, by its place in its goroutine's list of
// groups (-2 - place). What is shared is done after: the merged pairs
// (a set), the lines inside groups of three or more (in member order:
// the first member to meet such a line decides the group it is listed
// on) and the issues, range after range, which is member order.
func (g *grouper) findBearings() {
	p := g.plan
	g.supportIndex()
	g.inGroup = make([]bool, len(g.sups))
	minSin := math.Sin(minBearingAngleDeg * math.Pi / 180)
	spans := g.split(len(p.Members))
	pairs := make([][][2]int, len(spans))       // per goroutine: its merged groups' outer lines, first met first
	middles := make([][]groupMerge, len(spans)) // per goroutine: its groups with lines inside, in member order
	issues := make(issueLists, len(spans))
	parallel(spans, func(w int, sp span) {
		var cur *segCursor
		if g.supIdx != nil {
			cur = g.supIdx.newCursor()
		}
		var sc bearingScratch
		var bslab slab[Bearing]
		var dslab slab[Point]
		var hits []hit
		pairAt := map[[2]int]int{} // place in pairs[w]
		for k := sp.lo; k < sp.hi; k++ {
			m := &p.Members[k]
			sc.carried = sc.carried[:0]
			hits = g.supportHits(cur, &sc, k, minSin, hits[:0])
			slices.SortFunc(sc.carried, func(a, b hit) int { return cmp.Compare(a.t, b.t) })
			g.carriedBeams(&issues[w], k, sc.carried)
			sc.out.reset()
			g.bearingsFrom(&sc, hits, m.LengthIn)
			m.Bearings, g.bdirs[k] = bslab.take(sc.out.bs), dslab.take(sc.out.dirs)
			for _, mg := range sc.out.merges {
				at, ok := pairAt[mg.key]
				if !ok {
					at = len(pairs[w])
					pairAt[mg.key] = at
					pairs[w] = append(pairs[w], mg.key)
				}
				m.Bearings[mg.bearing].Support = -2 - at
				if len(mg.middle) > 0 {
					mg.middle = slices.Clone(mg.middle) // out of the scratch
					middles[w] = append(middles[w], mg)
				}
			}
			if len(m.Bearings) < 2 {
				// the lines it does bear on are not "the nearest support"
				own := map[int]bool{}
				for _, h := range hits {
					if h.direct {
						own[h.sup] = true
					}
				}
				g.noSupport(cur, &issues[w], k, own)
				continue
			}
			g.finishBearings(k)
		}
	})
	merged := map[[2]int]bool{}
	for w := range spans {
		for _, key := range pairs[w] {
			merged[key] = true
		}
		for _, mg := range middles[w] {
			g.groupMiddle(mg)
		}
	}
	issues.appendTo(&p.Issues)
	g.buildSupports(merged)
	// Each goroutine sets the bearing supports of its own range of
	// members, reading Plan.Supports' bookkeeping, now complete.
	parallel(spans, func(w int, sp span) {
		for k := sp.lo; k < sp.hi; k++ {
			bs := p.Members[k].Bearings
			for i := range bs {
				if ref := bs[i].Support; ref <= -2 {
					bs[i].Support = g.pairSupport(pairs[w][-2-ref])
				} else {
					bs[i].Support = g.supportOf(ref)
				}
			}
		}
	})
}

// bearingScratch is one goroutine's buffers for supportHits and
// bearingsFrom.
type bearingScratch struct {
	direct, outer, grp []hit
	carried            []hit // flush beams framing into the current member
	out                bearingsOut
}

// bearingsOut is what bearingsFrom finds on one member or beam.
type bearingsOut struct {
	bs     []Bearing
	dirs   []Point // per bearing: unit direction of its support line
	merges []groupMerge
	middle []int // the lines inside the groups of merges
}

func (o *bearingsOut) reset() {
	o.bs, o.dirs, o.merges, o.middle = o.bs[:0], o.dirs[:0], o.merges[:0], o.middle[:0]
}

// groupMerge is a bearing on a group of parallel lines merged into one
// (a double-line wall): its outer lines and the lines between.
type groupMerge struct {
	bearing int    // index into bearingsOut.bs
	key     [2]int // the outer lines, smaller first
	middle  []int  // the lines between, along the member
}

// applyMerge records a merged group met by a beam: its pair in merged,
// its middle lines, and returns the provisional Bearing.Support of its
// bearing (pairRef).
func (g *grouper) applyMerge(mg groupMerge, merged map[[2]int]bool) int {
	merged[mg.key] = true
	g.groupMiddle(mg)
	return g.pairRef(mg.key)
}

// groupMiddle records the lines inside a merged group of three or more:
// each is listed on the first group recorded for it.
func (g *grouper) groupMiddle(mg groupMerge) {
	for _, s := range mg.middle {
		g.inGroup[s] = true
		g.lp.middle(s, mg.key)
	}
}

// supportIndex builds the grid over the support lines, once (bays may
// need it before findBearings).
func (g *grouper) supportIndex() *segIndex {
	if g.supIdx == nil && len(g.sups) > 0 {
		g.supIdx = indexSegs(g.sups)
	}
	return g.supIdx
}

// bounds returns the bounding box and mean length of segments.
func bounds(segs []segItem) (lo, hi Point, meanLen float64) {
	lo = Point{X: math.Inf(1), Y: math.Inf(1)}
	hi = Point{X: math.Inf(-1), Y: math.Inf(-1)}
	for _, s := range segs {
		for _, q := range []Point{s.a, s.b} {
			lo.X, lo.Y = math.Min(lo.X, q.X), math.Min(lo.Y, q.Y)
			hi.X, hi.Y = math.Max(hi.X, q.X), math.Max(hi.Y, q.Y)
		}
		meanLen += dist(s.a, s.b)
	}
	return lo, hi, meanLen / float64(max(len(segs), 1))
}

// supportHits lists the support lines member k crosses or reaches, plus
// the "outer" lines just past an end that may be the far face of a
// double-line wall the end stops inside.
func (g *grouper) supportHits(cur *segCursor, sc *bearingScratch, k int, minSin float64, hits []hit) []hit {
	if g.supIdx == nil {
		return hits
	}
	m := &g.plan.Members[k]
	u := g.plan.dirs[k]
	tol, wall := g.opt.SnapToleranceIn, g.opt.MaxWallThicknessIn
	L := m.LengthIn
	minLen := math.Min(minSupportFrac*L, wall+tol)
	g.supIdx.queryWith(cur, m.Start, m.End, tol+wall, func(s int) {
		sg := &g.sups[s]
		t, _, sin, ok := segParams(m.Start, u, sg.a, sg.b)
		if !ok || sin < minSin || dist(sg.a, sg.b) < minLen {
			return
		}
		if distPointSeg(lerp(m.Start, u, t), sg.a, sg.b) > tol {
			return // passes beyond the support's drawn end
		}
		de := endGap(t, L, m.Start, m.End, sg.a, sg.b)
		if de > tol+wall {
			return
		}
		if g.framesInto(sg, t, L, lerp(m.Start, u, t)) {
			sc.carried = append(sc.carried, hit{t: t, sup: s, sin: sin})
			return
		}
		hits = append(hits, hit{t: t, sup: s, sin: sin, direct: de <= tol})
	})
	slices.SortFunc(hits, func(a, b hit) int {
		if c := cmp.Compare(a.t, b.t); c != 0 {
			return c
		}
		return a.sup - b.sup
	})
	return hits
}

// framesInto reports whether support line sg, met at t along a member of
// length L at point q, is a flush beam framing into the member (a header
// hung from a trimmer): the beam ends on the member, and the member runs
// on more than a wall thickness plus the snap tolerance past it both ways.
// A flush beam sits in the joists' plane, so a member it ends on carries
// it rather than bearing on it.
func (g *grouper) framesInto(sg *segItem, t, L float64, q Point) bool {
	if g.opt.Supports[sg.spec].Kind != KindFlushBeam {
		return false
	}
	tol := g.opt.SnapToleranceIn
	far := g.opt.MaxWallThicknessIn + tol
	if t <= far || t >= L-far {
		return false
	}
	return dist(q, sg.a) <= tol || dist(q, sg.b) <= tol
}

// carriedBeams makes member k an error when a flush beam frames into it
// (carried, sorted along it): the beam's reaction is a point load,
// outside the checks' scope (DOMAIN.md "Cautions"). A double-line beam is
// named once. The issues go to iss.
func (g *grouper) carriedBeams(iss *dxfimport.IssueList, k int, carried []hit) {
	m := &g.plan.Members[k]
	last := math.Inf(-1)
	for _, h := range carried {
		if h.t-last <= g.opt.MaxWallThicknessIn {
			continue
		}
		last = h.t
		m.Error = true
		msg := fmt.Sprintf("%s carries the end of a flush beam or header (%s) %.1f in from its start: "+
			"a point load, which the checks do not cover; design this member by hand", m.ID, g.sups[h.sup].pos, h.t)
		m.Messages = append(m.Messages, msg)
		iss.Add(m.Pos, CodeCarriesBeam, dxfimport.SevError, "%s", msg)
	}
}

func (g *grouper) parallelSupports(a, b int) bool {
	sa, sb := &g.sups[a], &g.sups[b]
	if g.opt.Supports[sa.spec].Kind != g.opt.Supports[sb.spec].Kind {
		return false
	}
	c := math.Abs(cross(unit(sub(sa.b, sa.a)), unit(sub(sb.b, sb.a))))
	return c <= math.Sin(g.opt.AngleTolDeg*math.Pi/180)+1e-12
}

// bearingsFrom turns sorted hits into bearings, each with its support
// direction for run matching, in sc.out. Parallel support lines of one
// kind that the member meets within MaxWallThicknessIn of the first of
// them (plates, plies, sheathing: any number) are one bearing at the
// middle of the group, as long as the group is wide; where the member's
// end stops inside the group, the lines just past that end belong to it
// too, and the bearing length stops at the end. L is the member's length.
// Such a bearing's Support is left to the caller, with its groupMerge in
// sc.out.merges. It reads only the support lines and options.
func (g *grouper) bearingsFrom(sc *bearingScratch, hits []hit, L float64) {
	direct, outer := sc.direct[:0], sc.outer[:0]
	defer func() { sc.direct, sc.outer = direct, outer }() // keep the buffers
	for _, h := range hits {
		if h.direct {
			if n := len(direct); n > 0 && (h.t-direct[n-1].t)*h.sin < drawnTwiceIn {
				continue // same line drawn twice or in pieces
			}
			direct = append(direct, h)
		} else {
			outer = append(outer, h)
		}
	}
	if len(direct) == 0 {
		return
	}
	wall := g.opt.MaxWallThicknessIn
	fits := func(a, b hit) bool { // b is in the group whose far line is a
		return math.Abs(b.t-a.t)*a.sin <= wall+1e-9 && g.parallelSupports(a.sup, b.sup)
	}
	for i := 0; i < len(direct); {
		j := i + 1
		for j < len(direct) && fits(direct[i], direct[j]) {
			j++
		}
		grp := append(sc.grp[:0], direct[i:j]...)
		if i == 0 { // lines before the start, nearest first
			for x := len(outer) - 1; x >= 0; x-- {
				if h := outer[x]; h.t < 0 && h.t < grp[0].t {
					if !fits(grp[len(grp)-1], h) || !g.parallelSupports(grp[0].sup, h.sup) {
						break
					}
					grp = slices.Insert(grp, 0, h)
				}
			}
		}
		if j == len(direct) { // lines past the end, nearest first
			for _, h := range outer {
				if h.t > L && h.t > grp[len(grp)-1].t {
					if !fits(grp[0], h) || !g.parallelSupports(grp[0].sup, h.sup) {
						break
					}
					grp = append(grp, h)
				}
			}
		}
		sc.grp = grp
		g.groupBearing(&sc.out, grp, L)
		i = j
	}
}

// bearingsNow is bearingsFrom for one caller alone (a beam's walls):
// merged groups are applied at once, in order.
func (g *grouper) bearingsNow(sc *bearingScratch, hits []hit, merged map[[2]int]bool, L float64) []Bearing {
	sc.out.reset()
	g.bearingsFrom(sc, hits, L)
	for _, mg := range sc.out.merges {
		sc.out.bs[mg.bearing].Support = g.applyMerge(mg, merged)
	}
	return sc.out.bs
}

// groupBearing adds to out the bearing of a group of parallel support
// lines met by a member of length L, sorted along it.
func (g *grouper) groupBearing(out *bearingsOut, grp []hit, L float64) {
	first, last := grp[0], grp[len(grp)-1]
	s0 := &g.sups[first.sup]
	sp := g.opt.Supports[s0.spec]
	dir := unit(sub(s0.b, s0.a))
	width := (last.t - first.t) * first.sin
	if len(grp) == 1 || width < sameLineIn {
		out.bs = append(out.bs, Bearing{AtIn: first.t, LengthIn: sp.BearingIn, Kind: sp.Kind, Pos: s0.pos, Support: first.sup})
		out.dirs = append(out.dirs, dir)
		return
	}
	lb := width
	if first.t < 0 { // the start stops inside the group
		lb = math.Min(lb, last.t*first.sin)
	}
	if last.t > L {
		lb = math.Min(lb, (L-first.t)*first.sin)
	}
	key := [2]int{min(first.sup, last.sup), max(first.sup, last.sup)}
	m0 := len(out.middle)
	for _, h := range grp[1 : len(grp)-1] {
		out.middle = append(out.middle, h.sup)
	}
	out.merges = append(out.merges, groupMerge{bearing: len(out.bs), key: key, middle: out.middle[m0:len(out.middle):len(out.middle)]})
	out.bs = append(out.bs, Bearing{AtIn: (first.t + last.t) / 2, LengthIn: lb, Kind: sp.Kind, Pos: s0.pos, Support: -1,
		WidthIn: last.t - first.t})
	out.dirs = append(out.dirs, dir)
}

// finishBearings sets the overhangs and hangers of a member with at least
// two bearings. An end is part of its bearing when it stops within
// lb/2 + snap tolerance of the centre-line, measured square to the
// support as the snap tolerance is: along a joist meeting the support at
// an angle a that is (lb/2 + snap) / sin a.
func (g *grouper) finishBearings(k int) {
	m := &g.plan.Members[k]
	tol := g.opt.SnapToleranceIn
	bs := m.Bearings
	first, last := bs[0], bs[len(bs)-1]
	reach := func(i int) float64 {
		sin := math.Abs(cross(g.plan.dirs[k], g.bdirs[k][i]))
		return (bs[i].LengthIn/2 + tol) / math.Max(sin, 1e-9)
	}
	if first.AtIn > reach(0) {
		m.OverhangStartIn = first.AtIn
	} else if first.Kind == KindFlushBeam {
		m.HangersStart = true
	}
	if rest := m.LengthIn - last.AtIn; rest > reach(len(bs)-1) {
		m.OverhangEndIn = rest
	} else if last.Kind == KindFlushBeam {
		m.HangersEnd = true
	}
}

// noSupport marks member k as an error, naming the end with no support
// and how far the nearest other support line (not one in own) is from it.
// It queries the support grid through cur; the issues go to iss.
func (g *grouper) noSupport(cur *segCursor, iss *dxfimport.IssueList, k int, own map[int]bool) {
	m := &g.plan.Members[k]
	m.Error = true
	var ends []string
	switch {
	case len(m.Bearings) == 0:
		ends = []string{"start", "end"}
	case m.Bearings[0].AtIn > m.LengthIn/2:
		ends = []string{"start"}
	default:
		ends = []string{"end"}
	}
	for _, e := range ends {
		p := m.Start
		if e == "end" {
			p = m.End
		}
		msg := fmt.Sprintf("%s %s %s reaches no support", m.ID, e, g.drawingPoint(p))
		if d, s, ok := g.nearestSupport(cur, p, own); ok {
			msg += fmt.Sprintf("; nearest support is %.1f in away (%s)", d, s.pos)
		} else {
			msg += fmt.Sprintf("; no support within %.0f ft", nearestSearchIn/12)
		}
		m.Messages = append(m.Messages, msg)
		iss.Add(m.Pos, CodeNoSupport, dxfimport.SevError, "%s", msg)
	}
}

// nearestSearchIn bounds the search for the nearest support in messages.
const nearestSearchIn = 1536.0

func (g *grouper) nearestSupport(cur *segCursor, p Point, skip map[int]bool) (float64, *segItem, bool) {
	if g.supIdx == nil {
		return 0, nil, false
	}
	for r := 24.0; r <= nearestSearchIn; r *= 4 {
		best, bi := math.Inf(1), -1
		g.supIdx.queryWith(cur, p, p, r, func(s int) {
			sg := &g.sups[s]
			if skip[s] {
				return
			}
			if d := distPointSeg(p, sg.a, sg.b); d < best {
				best, bi = d, s
			}
		})
		if bi >= 0 && best <= r {
			return best, &g.sups[bi], true
		}
	}
	return 0, nil, false
}

// buildSupports lists the support lines for the outputs: each merged pair
// once on its mid-line over the length both lines share, every other line
// as drawn.
func (g *grouper) buildSupports(merged map[[2]int]bool) {
	used := make([]bool, len(g.sups))
	pairs := make([][2]int, 0, len(merged))
	for pr := range merged {
		pairs = append(pairs, pr)
		used[pr[0]], used[pr[1]] = true, true
	}
	for i, in := range g.inGroup {
		used[i] = used[i] || in
	}
	sort.Slice(pairs, func(i, j int) bool {
		if pairs[i][0] != pairs[j][0] {
			return pairs[i][0] < pairs[j][0]
		}
		return pairs[i][1] < pairs[j][1]
	})
	p := g.plan
	free := 0
	for _, u := range used {
		if !u {
			free++
		}
	}
	if n := free + len(pairs); n > 0 && p.Supports == nil {
		p.Supports = make([]Support, 0, n)
	}
	for i, s := range g.sups {
		if used[i] {
			continue
		}
		sp := g.opt.Supports[s.spec]
		g.supportOut(i, -1, len(p.Supports))
		p.Supports = append(p.Supports, Support{Kind: sp.Kind, A: s.a, B: s.b, BearingIn: sp.BearingIn, Pos: s.pos})
	}
	for _, pr := range pairs {
		s1, s2 := g.sups[pr[0]], g.sups[pr[1]]
		u := unit(sub(s1.b, s1.a))
		nrm := rot90(u)
		off := dot(sub(s2.a, s1.a), nrm)
		base := add(s1.a, scale(nrm, off/2))
		t1, t2 := dot(sub(s2.a, s1.a), u), dot(sub(s2.b, s1.a), u)
		lo, hi := math.Max(0, math.Min(t1, t2)), math.Min(dist(s1.a, s1.b), math.Max(t1, t2))
		if lo > hi {
			lo, hi = math.Min(0, math.Min(t1, t2)), math.Max(dist(s1.a, s1.b), math.Max(t1, t2))
		}
		th := math.Abs(off)
		g.supportOut(pr[0], pr[1], len(p.Supports))
		p.Supports = append(p.Supports, Support{
			Kind: g.opt.Supports[s1.spec].Kind, A: lerp(base, u, lo), B: lerp(base, u, hi),
			BearingIn: th, Double: true, ThicknessIn: th, Pos: s1.pos, PosB: s2.pos,
		})
	}
}

// endGap is how far a member from start to end (length L) stops short of
// the support segment a-b that its line meets at t along it: 0 when t lies
// on the member, else the distance from the nearer end to the segment.
func endGap(t, L float64, start, end, a, b Point) float64 {
	switch {
	case t < 0:
		return distPointSeg(start, a, b)
	case t > L:
		return distPointSeg(end, a, b)
	}
	return 0
}
