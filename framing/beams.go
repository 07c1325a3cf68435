package framing

import (
	"cmp"
	"fmt"
	"math"
	"regexp"
	"slices"
	"sort"
	"strings"

	"framecheck/dxfimport"
)

// beamGroup is a beam candidate: parallel support lines of one
// non-bearing-wall kind within MaxWallThicknessIn across that overlap
// along (a beam drawn as one line, its plies or its outline), with the
// end caps of an outline.
type beamGroup struct {
	lines, caps    []int // indices into grouper.sups
	spec           int
	u, n           Point   // direction (angle in (-90, 90] degrees) and normal
	a0, a1, c0, c1 float64 // extent along u and across n
	offsets        int     // distinct offsets across (lines drawn twice count once)
	callout        textItem
	hasCallout     bool
	calloutD       float64
}

func (b *beamGroup) start() Point { return add(scale(b.u, b.a0), scale(b.n, (b.c0+b.c1)/2)) }
func (b *beamGroup) end() Point   { return add(scale(b.u, b.a1), scale(b.n, (b.c0+b.c1)/2)) }

// orientAxis returns the unit direction of ab with its angle in (-90, 90]
// degrees, as members are oriented, and its normal (rot90).
func orientAxis(a, b Point) (u, n Point) {
	u = unit(sub(b, a))
	if u.X < -1e-12 || (math.Abs(u.X) <= 1e-12 && u.Y < 0) {
		u = scale(u, -1)
	}
	return u, rot90(u)
}

// beamCandidates groups the support lines of kinds other than
// bearing-wall (and not kept rigid by SupportSpec.Rigid) into beam
// candidates. Lines are one beam when parallel (within AngleTolDeg),
// of one kind, at most MaxWallThicknessIn apart across in all, and
// overlapping along by at least half the shorter; short lines whose ends
// meet two of the group's line ends are its end caps. Lines shorter than
// MaxWallThicknessIn + SnapToleranceIn left over are ticks, not beams.
func (g *grouper) beamCandidates() {
	var cand []int
	for i, s := range g.sups {
		sp := g.opt.Supports[s.spec]
		if sp.Kind != KindBearingWall && !sp.Rigid {
			cand = append(cand, i)
		}
	}
	if len(cand) == 0 {
		return
	}
	tol, wall := g.opt.SnapToleranceIn, g.opt.MaxWallThicknessIn
	sinTol := math.Sin(g.opt.AngleTolDeg*math.Pi/180) + 1e-12
	// longest first, so each group takes its direction from its longest line
	slices.SortStableFunc(cand, func(a, b int) int {
		return cmp.Compare(dist(g.sups[b].a, g.sups[b].b), dist(g.sups[a].a, g.sups[a].b))
	})
	segs := make([]segItem, len(cand))
	for k, i := range cand {
		segs[k] = g.sups[i]
	}
	lo, hi, typ := bounds(segs)
	idx := newSegIndex(lo, hi, len(segs), typ)
	for k, s := range segs {
		idx.insert(k, s.a, s.b, 0)
	}
	taken := make([]bool, len(cand))
	var groups []beamGroup
	for k, i := range cand {
		if taken[k] {
			continue
		}
		s := &g.sups[i]
		u, n := orientAxis(s.a, s.b)
		b := beamGroup{lines: []int{i}, spec: s.spec, u: u, n: n}
		b.a0, b.a1 = math.Min(dot(s.a, u), dot(s.b, u)), math.Max(dot(s.a, u), dot(s.b, u))
		b.c0, b.c1 = dot(s.a, n), dot(s.a, n)
		taken[k] = true
		var near []int
		idx.query(s.a, s.b, wall+tol, func(j int) { near = append(near, j) })
		sort.Ints(near)
		for _, j := range near {
			o := &g.sups[cand[j]]
			if taken[j] || g.opt.Supports[o.spec].Kind != g.opt.Supports[s.spec].Kind {
				continue
			}
			if math.Abs(cross(u, unit(sub(o.b, o.a)))) > sinTol {
				continue
			}
			c := dot(mid(o.a, o.b), n)
			oa0, oa1 := math.Min(dot(o.a, u), dot(o.b, u)), math.Max(dot(o.a, u), dot(o.b, u))
			overlap := math.Min(oa1, b.a1) - math.Max(oa0, b.a0)
			if math.Max(b.c1, c)-math.Min(b.c0, c) > wall+1e-9 || overlap < 0.5*math.Min(oa1-oa0, b.a1-b.a0) {
				continue
			}
			taken[j] = true
			b.lines = append(b.lines, cand[j])
			b.c0, b.c1 = math.Min(b.c0, c), math.Max(b.c1, c)
			b.a0, b.a1 = math.Min(b.a0, oa0), math.Max(b.a1, oa1)
		}
		groups = append(groups, b)
	}
	// end caps: a short group of one line joining two line ends of a wide group
	isCap := make([]bool, len(groups))
	for x := range groups {
		b := &groups[x]
		if b.c1-b.c0 < sameLineIn {
			continue
		}
		for y := range groups {
			c := &groups[y]
			if y == x || isCap[y] || len(c.lines) != 1 || c.a1-c.a0 > wall+2*tol {
				continue
			}
			cs := &g.sups[c.lines[0]]
			if g.meetsLineEnd(cs.a, b) && g.meetsLineEnd(cs.b, b) {
				isCap[y] = true
				b.caps = append(b.caps, c.lines[0])
			}
		}
	}
	for x := range groups {
		b := &groups[x]
		if isCap[x] || (b.a1-b.a0 < wall+tol) {
			continue
		}
		b.offsets = distinctOffsets(g, b)
		g.lp.beams = append(g.lp.beams, *b)
	}
}

// meetsLineEnd reports whether p is within the snap tolerance of an end
// of one of b's lines.
func (g *grouper) meetsLineEnd(p Point, b *beamGroup) bool {
	for _, i := range b.lines {
		s := &g.sups[i]
		if dist(p, s.a) <= g.opt.SnapToleranceIn || dist(p, s.b) <= g.opt.SnapToleranceIn {
			return true
		}
	}
	return false
}

// distinctOffsets counts b's lines at different offsets across (closer
// than sameLineIn: one line drawn twice or in pieces).
func distinctOffsets(g *grouper, b *beamGroup) int {
	cs := make([]float64, len(b.lines))
	for k, i := range b.lines {
		cs[k] = dot(mid(g.sups[i].a, g.sups[i].b), b.n)
	}
	slices.Sort(cs)
	n := 1
	for k := 1; k < len(cs); k++ {
		if cs[k]-cs[k-1] >= sameLineIn {
			n++
		}
	}
	return n
}

// beamMaterialRE matches the words of glulam and structural composite
// lumber callouts, which ReadCallout does not read.
var beamMaterialRE = regexp.MustCompile(`(?i)\b(GLB|GLULAM|GL|LVL|PSL|LSL|SCL)\b|\d+F-\d`)

// claimBeamCallouts finds the beam candidates and takes from the label
// texts the size callouts of beams, before the joists' callouts are read:
// a text naming a size with no spacing ("(3) 2x12", "4x12") or a glulam
// or SCL callout ("5 1/8 x 12 GLB 24F-1.8E", "3 1/2 x 11 7/8 LVL") whose
// nearest beam is within its reach (max(12 in, 3 text heights), from the
// beam's edge) and nearer than every joist and label line. Each beam keeps
// its nearest such text; the others stay label texts.
func (g *grouper) claimBeamCallouts() {
	g.beamCandidates()
	bs := g.lp.beams
	if len(bs) == 0 || len(g.labelTexts) == 0 {
		return
	}
	segs := make([]segItem, len(bs))
	for k := range bs {
		segs[k] = segItem{a: bs[k].start(), b: bs[k].end()}
	}
	lo, hi, typ := bounds(segs)
	idx := newSegIndex(lo, hi, len(segs), typ)
	for k, sg := range segs {
		idx.insert(k, sg.a, sg.b, 0)
	}
	claimedBy := make([]int, len(g.labelTexts))
	for ti, t := range g.labelTexts {
		claimedBy[ti] = -1
		reach := calloutReachIn(t)
		bk, bd := -1, reach
		idx.query(t.p, t.p, reach+maxWallPad(g), func(k int) {
			b := &bs[k]
			d := math.Max(0, distPointSeg(t.p, b.start(), b.end())-(b.c1-b.c0)/2)
			if d < bd || d == bd && k > bk {
				bk, bd = k, d
			}
		})
		if bk < 0 {
			continue
		}
		co, err := ReadCallout(t.text)
		switch {
		case err == nil && co.SpacingIn > 0: // a joist callout
			continue
		case err != nil && !beamMaterialRE.MatchString(t.text) && !anySizeRE.MatchString(normalizeCallout(t.text)):
			continue
		}
		if bk < 0 || g.nearerThanBeam(t.p, bd) {
			continue
		}
		if b := &bs[bk]; !b.hasCallout || bd < b.calloutD {
			b.callout, b.hasCallout, b.calloutD = t, true, bd
		}
		claimedBy[ti] = bk
	}
	keep := g.labelTexts[:0]
	for ti, t := range g.labelTexts {
		if k := claimedBy[ti]; k >= 0 && bs[k].callout.pos == t.pos {
			continue
		}
		keep = append(keep, t)
	}
	g.labelTexts = keep
}

// nearerThanBeam reports whether a joist or a label line passes nearer
// to p than d.
func (g *grouper) nearerThanBeam(p Point, d float64) bool {
	found := false
	if idx := g.memberIndex(); idx != nil {
		idx.query(p, p, d, func(k int) {
			m := &g.plan.Members[k]
			found = found || distPointSeg(p, m.Start, m.End) < d
		})
	}
	if li := g.labelIndex(); li != nil && !found {
		li.query(p, p, d, func(i int) {
			l := &g.labelLines[i]
			found = found || distPointSeg(p, l.a, l.b) < d
		})
	}
	return found
}

// findBeams makes Plan.Beams of the beam candidates, once bearings and
// posts are known: their own supports (posts, bearing walls, beams they
// frame into), the joists they carry and their callouts.
func (g *grouper) findBeams() {
	bs := g.lp.beams
	if len(bs) == 0 {
		return
	}
	p := g.plan
	rnd := func(v float64) float64 { return math.Round(v*1000) / 1000 }
	slices.SortStableFunc(bs, func(a, b beamGroup) int {
		ma, mb := mid(a.start(), a.end()), mid(b.start(), b.end())
		if c := cmp.Compare(rnd(ma.Y), rnd(mb.Y)); c != 0 {
			return c
		}
		return cmp.Compare(rnd(ma.X), rnd(mb.X))
	})
	p.Beams = make([]Beam, len(bs))
	bySupport := map[int]int{} // Plan.Supports index -> beam
	for k := range bs {
		b := &bs[k]
		s0 := &g.sups[b.lines[0]]
		bm := Beam{ID: fmt.Sprintf("B%d", k+1), Kind: g.opt.Supports[b.spec].Kind, Layer: s0.pos.Layer,
			Start: b.start(), End: b.end(), LengthIn: b.a1 - b.a0, WidthIn: b.c1 - b.c0, Plies: max(1, b.offsets-1)}
		if b.offsets == 1 {
			bm.WidthIn = 0
		}
		for _, i := range append(append([]int(nil), b.lines...), b.caps...) {
			if !slices.Contains(bm.Lines, g.sups[i].pos) { // a polyline's sides are one entity
				bm.Lines = append(bm.Lines, g.sups[i].pos)
			}
			if si := g.supportOf(i); si >= 0 && !slices.Contains(bm.Supports, si) {
				bm.Supports = append(bm.Supports, si)
				if _, ok := bySupport[si]; !ok {
					bySupport[si] = k
				}
			}
		}
		slices.Sort(bm.Supports)
		if b.hasCallout {
			bm.Callout, bm.CalloutPos = flatText(b.callout.text), b.callout.pos
			if co, err := ReadCallout(b.callout.text); err == nil && co.SpacingIn == 0 {
				bm.Size = co.Designation()
			}
		}
		p.Beams[k] = bm
	}
	g.beamOnPosts()
	g.beamOnWalls()
	g.beamOnBeams()
	g.carriedJoists(bySupport)
	for k := range p.Beams {
		bm := &p.Beams[k]
		slices.SortStableFunc(bm.Bearings, func(a, b BeamBearing) int { return cmp.Compare(a.AtIn, b.AtIn) })
		if len(bm.Bearings) < 2 {
			bm.Rigid = true
			msg := fmt.Sprintf("%s (%s, %.0f in long) has %d support(s) of its own found (posts, bearing walls, beams it frames into): "+
				"it stays a rigid bearing and is not checked; draw its posts on a posts layer, or set check = false in its [[support]] table",
				bm.ID, bm.Kind, bm.LengthIn, len(bm.Bearings))
			bm.Messages = append(bm.Messages, msg)
			g.warn(bm.Lines[0], CodeBeamUnsupported, "%s", msg)
		}
	}
	g.beamCycles()
}

// along returns the position of q along beam k from its Start.
func (g *grouper) along(k int, q Point) float64 {
	b := &g.plan.Beams[k]
	return dot(sub(q, b.Start), unit(sub(b.End, b.Start)))
}

// beamOnPosts adds the posts whose centre lies under a beam: within half
// its drawn width plus the snap tolerance of its centre line.
func (g *grouper) beamOnPosts() {
	p := g.plan
	tol := g.opt.SnapToleranceIn
	idx := g.beamIndex()
	for i := range p.Posts {
		q := &p.Posts[i]
		idx.query(q.At, q.At, tol+maxWallPad(g), func(k int) {
			b := &p.Beams[k]
			if distPointSeg(q.At, b.Start, b.End) > b.WidthIn/2+tol {
				return
			}
			b.Bearings = append(b.Bearings, BeamBearing{AtIn: g.along(k, q.At), LengthIn: q.SizeIn, Kind: BeamOnPost, Index: i, Pos: q.Pos})
		})
	}
}

// beamIndex is a grid over the beams' centre lines, built on first use
// after Plan.Beams is made.
func (g *grouper) beamIndex() *segIndex {
	p := g.plan
	if g.lp.beamIdx == nil && len(p.Beams) > 0 {
		segs := make([]segItem, len(p.Beams))
		for k, b := range p.Beams {
			segs[k] = segItem{a: b.Start, b: b.End}
		}
		lo, hi, typ := bounds(segs)
		g.lp.beamIdx = newSegIndex(lo, hi, len(segs), typ)
		for k, s := range segs {
			g.lp.beamIdx.insert(k, s.a, s.b, 0)
		}
	}
	return g.lp.beamIdx
}

// beamOnWalls adds the bearing walls a beam crosses or ends on, found as
// a joist's bearings are (bearingsFrom): a double-line wall is one
// bearing at its middle, as long as it is thick.
func (g *grouper) beamOnWalls() {
	if g.supIdx == nil {
		return
	}
	p := g.plan
	tol, wall := g.opt.SnapToleranceIn, g.opt.MaxWallThicknessIn
	minSin := math.Sin(minBearingAngleDeg * math.Pi / 180)
	scratch := map[[2]int]bool{}
	var hits []hit
	for k := range p.Beams {
		b := &p.Beams[k]
		u := unit(sub(b.End, b.Start))
		L := b.LengthIn
		minLen := math.Min(minSupportFrac*L, wall+tol)
		hits = hits[:0]
		g.supIdx.query(b.Start, b.End, tol+wall, func(s int) {
			sg := &g.sups[s]
			if g.opt.Supports[sg.spec].Kind != KindBearingWall {
				return
			}
			t, _, sin, ok := segParams(b.Start, u, sg.a, sg.b)
			if !ok || sin < minSin || dist(sg.a, sg.b) < minLen || distPointSeg(lerp(b.Start, u, t), sg.a, sg.b) > tol {
				return
			}
			de := 0.0
			switch {
			case t < 0:
				de = distPointSeg(b.Start, sg.a, sg.b)
			case t > L:
				de = distPointSeg(b.End, sg.a, sg.b)
			}
			if de > tol+wall {
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
		ws, _ := g.bearingsFrom(hits, scratch, L)
		for _, w := range ws {
			// a beam drawn to the face of a wall bears on the wall, not
			// on nothing: its bearing is the wall's
			si := g.resolveRef(w.Support)
			if w.LengthIn < sameLineIn && si >= 0 {
				w.LengthIn = p.Supports[si].BearingIn
			}
			b.Bearings = append(b.Bearings, BeamBearing{AtIn: w.AtIn, LengthIn: w.LengthIn, Kind: BeamOnWall, Index: si, Pos: w.Pos})
		}
		g.beamOnWallEnds(k)
	}
}

// beamOnWallEnds adds the bearing wall a beam ends on in line with it: a
// wall line parallel to the beam, no farther across than half the
// thickest wall plus the snap tolerance, whose end meets the beam's end
// (within the snap tolerance along) and which runs on away from the beam
// (it lies under the beam for no more than the thickest wall plus the
// snap tolerance). The lines of a double-line wall are one bearing, at
// the beam's end, with the wall's bearing_in as its length.
func (g *grouper) beamOnWallEnds(k int) {
	p := g.plan
	b := &p.Beams[k]
	tol, wall := g.opt.SnapToleranceIn, g.opt.MaxWallThicknessIn
	u := unit(sub(b.End, b.Start))
	n := rot90(u)
	sinTol := math.Sin(g.opt.AngleTolDeg*math.Pi/180) + 1e-12
	for _, end := range []float64{0, b.LengthIn} {
		e := lerp(b.Start, u, end)
		first := -1
		g.supIdx.query(e, e, wall/2+tol, func(s int) {
			sg := &g.sups[s]
			if g.opt.Supports[sg.spec].Kind != KindBearingWall || math.Abs(cross(u, unit(sub(sg.b, sg.a)))) > sinTol {
				return
			}
			if math.Abs(dot(sub(sg.a, b.Start), n)) > wall/2+tol {
				return
			}
			t0, t1 := dot(sub(sg.a, b.Start), u), dot(sub(sg.b, b.Start), u)
			t0, t1 = math.Min(t0, t1), math.Max(t0, t1)
			under := math.Min(t1, b.LengthIn) - math.Max(t0, 0)
			if end < t0-tol || end > t1+tol || under > wall+tol {
				return
			}
			if first < 0 || s < first {
				first = s
			}
		})
		if first < 0 {
			continue
		}
		sg := &g.sups[first]
		b.Bearings = append(b.Bearings, BeamBearing{AtIn: end, LengthIn: g.opt.Supports[sg.spec].BearingIn, Kind: BeamOnWall,
			Index: g.supportOf(first), Pos: sg.pos})
	}
}

// beamOnBeams adds, at each end of a beam, the beam it frames into: one
// at an angle of at least minBearingAngleDeg whose centre line passes
// within its half width plus the snap tolerance of the end, the end
// landing more than the snap tolerance inside it (beams meeting end to
// end at a corner both bear on what is under the corner).
func (g *grouper) beamOnBeams() {
	p := g.plan
	tol := g.opt.SnapToleranceIn
	minSin := math.Sin(minBearingAngleDeg * math.Pi / 180)
	idx := g.beamIndex()
	for k := range p.Beams {
		a := &p.Beams[k]
		ua := unit(sub(a.End, a.Start))
		for _, e := range []Point{a.Start, a.End} {
			best, bk := math.Inf(1), -1
			idx.query(e, e, tol+maxWallPad(g), func(j int) {
				if j == k {
					return
				}
				o := &p.Beams[j]
				uo := unit(sub(o.End, o.Start))
				if math.Abs(cross(ua, uo)) < minSin {
					return
				}
				d := distPointSeg(e, o.Start, o.End)
				t := dot(sub(e, o.Start), uo)
				if d <= o.WidthIn/2+tol && t > tol && t < o.LengthIn-tol && d < best {
					best, bk = d, j
				}
			})
			if bk < 0 {
				continue
			}
			o := &p.Beams[bk]
			a.Bearings = append(a.Bearings, BeamBearing{AtIn: g.along(k, e), LengthIn: o.WidthIn, Kind: BeamOnBeam, Index: bk, Pos: o.Lines[0]})
			o.CarriedBeams = append(o.CarriedBeams, k)
		}
	}
}

// maxWallPad is the widest a beam's half width can be.
func maxWallPad(g *grouper) float64 { return g.opt.MaxWallThicknessIn / 2 }

// carriedJoists lists on each beam the joist bearings on its lines.
func (g *grouper) carriedJoists(bySupport map[int]int) {
	p := g.plan
	for m := range p.Members {
		mb := &p.Members[m]
		for j, br := range mb.Bearings {
			k, ok := bySupport[br.Support]
			if br.Support < 0 || !ok {
				continue
			}
			q := lerp(mb.Start, p.dirs[m], br.AtIn)
			p.Beams[k].Carried = append(p.Beams[k].Carried, Carried{Member: m, Bearing: j, AtIn: g.along(k, q)})
		}
	}
	for k := range p.Beams {
		c := p.Beams[k].Carried
		slices.SortStableFunc(c, func(a, b Carried) int { return cmp.Compare(a.AtIn, b.AtIn) })
	}
}

// beamCycles reports beams that bear on each other in a cycle (B1 on B2,
// B2 on B1): no order of solving them exists. Each cycle is one error
// finding naming its beams, and a message on each.
func (g *grouper) beamCycles() {
	p := g.plan
	state := make([]int, len(p.Beams)) // 0 new, 1 on the stack, 2 done
	var stack []int
	var visit func(k int)
	visit = func(k int) {
		state[k] = 1
		stack = append(stack, k)
		for _, br := range p.Beams[k].Bearings {
			if br.Kind != BeamOnBeam {
				continue
			}
			switch state[br.Index] {
			case 0:
				visit(br.Index)
			case 1:
				at := slices.Index(stack, br.Index)
				var ids []string
				for _, c := range stack[at:] {
					ids = append(ids, p.Beams[c].ID)
				}
				msg := fmt.Sprintf("beams %s bear on each other in a cycle (%s -> %s): no order carries their loads down; "+
					"draw a post or wall under one of them", strings.Join(ids, ", "), strings.Join(ids, " -> "), ids[0])
				for _, c := range stack[at:] {
					p.Beams[c].Messages = append(p.Beams[c].Messages, msg)
				}
				g.plan.Issues.Add(p.Beams[br.Index].Lines[0], CodeBeamCycle, dxfimport.SevError, "%s", msg)
			}
		}
		stack = stack[:len(stack)-1]
		state[k] = 2
	}
	for k := range p.Beams {
		if state[k] == 0 {
			visit(k)
		}
	}
}
