package framing

import (
	"math"

	"framecheck/dxfimport"
)

// CodeZonePastBeam: a load zone reaches on past a beam checked as a
// member, on its side with no joists: a strip the beam may carry that is
// not put on it.
const CodeZonePastBeam = "FRM224"

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
