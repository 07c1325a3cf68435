package framing

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"framecheck/dxfimport"
)

// What a beam bears on (posts, bearing walls, other beams), the joists it
// carries, and cycles of beams; beams.go finds the beams.

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
		g.lp.beamIdx = indexSegs(segs)
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
	var sc bearingScratch
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
			de := endGap(t, L, b.Start, b.End, sg.a, sg.b)
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
		ws := g.bearingsNow(&sc, hits, scratch, L)
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
// the beam's end. A beam so in line with a wall is a header over an
// opening: it bears on the jack stud at the opening's side, so the
// bearing is headerBearingIn long (the wall's bearing_in when shorter),
// not the wall's: a longer one would understate the stress on it.
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
		b.Bearings = append(b.Bearings, BeamBearing{AtIn: end, LengthIn: math.Min(g.opt.Supports[sg.spec].BearingIn, headerBearingIn),
			Kind: BeamOnWall, Index: g.supportOf(first), Pos: sg.pos})
	}
}

// headerBearingIn is the bearing of a header on the jack stud at the side
// of its opening: one 2x, 1.5 in (common practice, no source; two jacks
// would give 3 in, so this errs on the safe side).
const headerBearingIn = 1.5

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
			a.Bearings = append(a.Bearings, BeamBearing{AtIn: g.along(k, e), LengthIn: beamSeatIn(p, o), Kind: BeamOnBeam, Index: bk, Pos: o.Lines[0]})
			o.CarriedBeams = append(o.CarriedBeams, k)
		}
	}
}

// beamSeatIn is the bearing length of a beam whose end lands on beam o: in
// a hanger on the side of a flush beam or ledger, the hanger's seat, the
// bearing_in of o's [[support]] table (1.5 in by default); on top of a
// dropped beam, o's width as drawn, or that bearing_in for a single line
// (3.5 in by default). An audit found a beam in a hanger on a girder
// checked on 3.5 in where its seat was 1.5 in.
func beamSeatIn(p *Plan, o *Beam) float64 {
	table := 0.0
	if len(o.Supports) > 0 && o.Supports[0] >= 0 && o.Supports[0] < len(p.Supports) {
		table = p.Supports[o.Supports[0]].BearingIn
	}
	if o.Kind == KindFlushBeam || o.Kind == KindLedger || o.WidthIn <= 0 {
		return table
	}
	return o.WidthIn
}

// maxWallPad is the widest a beam's half width can be.
func maxWallPad(g *grouper) float64 { return g.opt.MaxWallThicknessIn / 2 }

// carriedJoists lists on each beam the joist bearings on its lines.
//
// The members' bearings are read on member ranges in parallel, each
// goroutine listing what it finds (reading the members and beams); the
// lists are added to the beams after, range after range: member order.
func (g *grouper) carriedJoists(bySupport []int) {
	p := g.plan
	type onBeam struct {
		beam int
		c    Carried
	}
	spans := g.split(len(p.Members))
	found := make([][]onBeam, len(spans))
	parallel(spans, func(w int, sp span) {
		for m := sp.lo; m < sp.hi; m++ {
			mb := &p.Members[m]
			for j, br := range mb.Bearings {
				if br.Support < 0 || br.Support >= len(bySupport) || bySupport[br.Support] < 0 {
					continue
				}
				k := bySupport[br.Support]
				q := lerp(mb.Start, p.dirs[m], br.AtIn)
				found[w] = append(found[w], onBeam{k, Carried{Member: m, Bearing: j, AtIn: g.along(k, q)}})
			}
		}
	})
	for _, f := range found {
		for _, o := range f {
			p.Beams[o.beam].Carried = append(p.Beams[o.beam].Carried, o.c)
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
