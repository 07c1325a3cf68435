package framing

import (
	"cmp"
	"fmt"
	"math"
	"regexp"
	"slices"
	"sort"
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
	idx := indexSegs(segs)
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
// lumber callouts, which ReadCallout does not read (a joist callout in
// actual inches has a spacing).
var beamMaterialRE = regexp.MustCompile(`(?i)\b(GLB|GLULAM|GL|LVL|PSL|LSL|SCL)\b|\d+F-\d`)

// claimBeamCallouts finds the beam candidates and takes from the label
// texts the size callouts of beams, before the joists' callouts are read:
// a text naming a size with no spacing ("(3) 2x12", "4x12") or a glulam
// or SCL callout with no spacing ("5 1/8 x 12 GLB 24F-1.8E", "3 1/2 x
// 11 7/8 LVL"; "1 3/4 x 9 1/2 LVL @ 16" is the joists') whose
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
	idx := indexSegs(segs)
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
		co, err := readCallout(t.text) // a size in actual inches read as written: its spacing counts
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
	bySupport := make([]int, len(p.Supports)) // Plan.Supports index -> beam, -1 for none
	for i := range bySupport {
		bySupport[i] = -1
	}
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
				if bySupport[si] < 0 {
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
