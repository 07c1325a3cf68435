package framing

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"framecheck/dxfimport"
)

// CodeZonePastBeam: a load zone reaches on past a beam checked as a
// member, on its side with no joists: a strip the beam may carry that is
// not put on it. CodeBeamInRun: a beam checked as a member runs between
// two joists of a run, parallel to them.
const (
	CodeZonePastBeam = "FRM224"
	CodeBeamInRun    = "FRM225"
)

// beamsInRuns warns (FRM225) for each beam checked as a member that runs
// parallel between two neighbouring joists: they take each other as
// neighbours across it, so the floor or roof over the beam is on their
// tributary widths (on the safe side for them) and not on the beam's
// check, which takes the reactions of the joists it carries and its own
// weight only.
func (g *grouper) beamsInRuns() {
	p := g.plan
	if len(p.Beams) == 0 || g.lo == nil {
		return
	}
	// the lines of the beams checked as members, in a grid of their own:
	// a plan's joists are many, its beams few
	var lines []int
	beamOf := map[int]int{} // index in lines -> beam
	for i := range p.Beams {
		if b := &p.Beams[i]; !b.Rigid {
			for _, s := range b.Supports {
				beamOf[len(lines)] = i
				lines = append(lines, s)
			}
		}
	}
	if len(lines) == 0 {
		return
	}
	idx := indexEnds(len(lines), func(i int) (Point, Point) { return p.Supports[lines[i]].A, p.Supports[lines[i]].B }, nil)
	between := map[int][]string{}
	var order []int
	for k := range p.Members {
		j := g.hi[k]
		if j < 0 {
			continue
		}
		gr := &g.groups[g.grp[k]]
		m := &p.Members[k]
		gap := p.across[j] - p.across[k]
		i := -1
		idx.query(m.Start, m.End, math.Min(gap, edgeSupportReachIn), func(x int) {
			sl := &p.Supports[lines[x]]
			d := sub(sl.B, sl.A)
			l := math.Hypot(d.X, d.Y)
			if i >= 0 || l == 0 || math.Abs(cross(d, gr.u))/l > maxParallelSin {
				return
			}
			off := dot(mid(sl.A, sl.B), gr.n) - p.across[k]
			a, b := dot(sl.A, gr.u), dot(sl.B, gr.u)
			ov := math.Min(g.a1[k], math.Max(a, b)) - math.Max(g.a0[k], math.Min(a, b))
			if off > minNeighbourGapIn && off < gap-minNeighbourGapIn && ov >= minOverlapFrac*(g.a1[k]-g.a0[k]) {
				i = beamOf[x]
			}
		})
		if i < 0 {
			continue
		}
		if between[i] == nil {
			order = append(order, i)
		}
		between[i] = append(between[i], p.Members[k].ID+"/"+p.Members[j].ID)
	}
	slices.Sort(order)
	for _, i := range order {
		b := &p.Beams[i]
		pos := dxfimport.Pos{}
		if len(b.Lines) > 0 {
			pos = b.Lines[0]
		}
		pairs := between[i]
		if len(pairs) > 3 {
			pairs = append(pairs[:3:3], fmt.Sprintf("and %d more", len(pairs)-3))
		}
		g.warn(pos, CodeBeamInRun, "%s runs parallel between neighbouring joists (%s): they take each other as neighbours "+
			"across it, so the floor or roof over the beam is on their tributary widths, not in the beam's check; add it to "+
			"the beam by hand", b.ID, strings.Join(pairs, ", "))
	}
}

// zonePastBeams warns (FRM224) for each beam checked as a member that
// carries joists on one side only while the load zone reaches on past it
// on the other, by more than edgeStripTolIn, with no joist there: if the
// deck or roof runs on past the beam (cantilevered sheathing, an eave),
// the beam carries that strip, and the load path puts only the joists'
// reactions and its own weight on it. The zone is the innermost outline
// holding a point just past the beam's midpoint; the strip is measured
// square to the beam from there, up to edgeSupportReachIn.
func (g *grouper) zonePastBeams() {
	p := g.plan
	if len(p.Zones) == 0 || len(p.Beams) == 0 {
		return
	}
	zs := make([]zoneGeom, len(p.Zones))
	for i, z := range p.Zones {
		zs[i] = zoneGeom{ZoneOutline: z}
		zs[i].lo, zs[i].hi = polyBox(z.Points)
	}
	q := newZoneIndex(zs).newQuery()
	for i := range p.Beams {
		b := &p.Beams[i]
		if b.Rigid || len(b.Carried) == 0 || b.LengthIn <= 0 {
			continue
		}
		u := unit(sub(b.End, b.Start))
		n := rot90(u)
		var sides [2]bool // joists on the -n side, on the +n side
		tol := g.opt.SnapToleranceIn + b.WidthIn/2
		for _, c := range b.Carried {
			// a joist continuous over the beam lies on both sides of it
			m := &p.Members[c.Member]
			a0, a1 := dot(sub(m.Start, b.Start), n), dot(sub(m.End, b.Start), n)
			sides[0] = sides[0] || math.Min(a0, a1) < -tol
			sides[1] = sides[1] || math.Max(a0, a1) > tol
		}
		// the strips beside edge joists running along the beam (FRM223)
		// are on its check already
		for _, st := range b.Strips {
			m := &p.Members[st.Member]
			if dot(sub(mid(m.Start, m.End), b.Start), n) < 0 {
				sides[0] = true
			} else {
				sides[1] = true
			}
		}
		if sides[0] == sides[1] {
			continue // joists (or strips) on both sides, or none
		}
		away := n // the side with no joists
		if sides[1] {
			away = scale(n, -1)
		}
		half := math.Max(b.WidthIn/2, 0)
		c := add(mid(b.Start, b.End), scale(away, half+0.5))
		z := innermostZone(q, zs, c)
		if z < 0 {
			continue
		}
		t := rayExit(c, away, zs[z].Points) + 0.5 // from the beam's face
		if math.IsInf(t, 0) || t <= edgeStripTolIn {
			continue
		}
		pos := dxfimport.Pos{}
		if len(b.Lines) > 0 {
			pos = b.Lines[0]
		}
		g.warn(pos, CodeZonePastBeam, "%s carries joists on one side only, and load zone %s reaches %.1f in past it on the "+
			"other with no joist there: if the deck or roof runs on past the beam, that strip's load is on the beam but not "+
			"in its check (which takes the joists' reactions and its own weight); draw the zone outline to the beam, or add "+
			"that load by hand", b.ID, zs[z].Name, math.Min(t, 1e6))
	}
}
