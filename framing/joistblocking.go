package framing

import (
	"math"

	"framecheck/dxfimport"
)

// maxBlockPieceIn: a joist-layer line this long or shorter may be a
// blocking piece: the clear space between joists at 24 in o.c. is 22.5 in,
// and 30 in leaves room for wider spacings of doubled members (common
// practice, no source).
const maxBlockPieceIn = 30

// DrawnBlock is a piece of blocking drawn on a joist layer: a short line
// between two adjacent parallel members, across them. It braces both at
// its position (Member.ExistingBlockingAtIn) and is counted in the
// takeoff as existing blocking.
type DrawnBlock struct {
	Pos      dxfimport.Pos
	From, To Point  // where it meets the two members' centre lines
	Members  [2]int // indices into Plan.Members; -1 for a member dropped as drawn twice
}

type drawnPiece struct {
	DrawnBlock
	segs [2]int // joist items it joins
}

// joistBlocking takes the blocking pieces out of the joist lines: a line
// no longer than maxBlockPieceIn, more than 45 degrees to two longer
// parallel joist lines, each of its ends within the snap tolerance (plus
// half the member's drawn thickness) of one of them. Each piece becomes a
// drawn blocking line from centre line to centre line.
func (g *grouper) joistBlocking() {
	js := g.joists
	var cand []int
	for i := range js {
		if dist(js[i].a, js[i].b) <= maxBlockPieceIn {
			cand = append(cand, i)
		}
	}
	if len(cand) == 0 || len(js) < 3 {
		return
	}
	idx := indexSegs(js)
	tol := g.opt.SnapToleranceIn
	sin45 := math.Sqrt2 / 2
	parSin := math.Sin(g.opt.AngleTolDeg*math.Pi/180) + 1e-12
	drop := make([]bool, len(js))
	var touch [2][]int
	for _, i := range cand {
		s := js[i]
		L := dist(s.a, s.b)
		us := unit(sub(s.b, s.a))
		touch[0], touch[1] = touch[0][:0], touch[1][:0]
		idx.query(s.a, s.b, tol+maxBuiltUpIn/2, func(j int) {
			o := &js[j]
			if j == i || drop[j] || dist(o.a, o.b) <= L {
				return
			}
			if math.Abs(cross(us, unit(sub(o.b, o.a)))) <= sin45 {
				return
			}
			reach := tol + g.halfWidthIn(j)
			if distPointSeg(s.a, o.a, o.b) <= reach {
				touch[0] = append(touch[0], j)
			}
			if distPointSeg(s.b, o.a, o.b) <= reach {
				touch[1] = append(touch[1], j)
			}
		})
		j0, j1 := -1, -1
		for _, a := range touch[0] {
			for _, b := range touch[1] {
				ua, ub := unit(sub(js[a].b, js[a].a)), unit(sub(js[b].b, js[b].a))
				if a != b && math.Abs(cross(ua, ub)) <= parSin && (j0 < 0 || a+b < j0+j1) {
					j0, j1 = a, b
				}
			}
		}
		if j0 < 0 {
			continue
		}
		drop[i] = true
		g.pieces = append(g.pieces, drawnPiece{
			DrawnBlock: DrawnBlock{Pos: s.pos, From: footOnLine(s.a, js[j0]), To: footOnLine(s.b, js[j1])},
			segs:       [2]int{j0, j1},
		})
	}
	if len(g.pieces) == 0 {
		return
	}
	remap := g.dropJoists(drop)
	for k := range g.pieces {
		for e := range g.pieces[k].segs {
			g.pieces[k].segs[e] = int(remap[g.pieces[k].segs[e]])
		}
	}
}

// footOnLine returns the point of the line through s nearest p.
func footOnLine(p Point, s segItem) Point {
	u := unit(sub(s.b, s.a))
	return lerp(s.a, u, dot(sub(p, s.a), u))
}

// dropJoists removes the joist items marked in drop (keeping jol and rawOf
// in step) and returns each old item's new index, -1 for those removed.
func (g *grouper) dropJoists(drop []bool) []int32 {
	remap := make([]int32, len(g.joists))
	n := 0
	for i := range g.joists {
		if drop[i] {
			remap[i] = -1
			continue
		}
		remap[i] = int32(n)
		g.joists[n] = g.joists[i]
		if g.jol != nil {
			g.jol[n] = g.jol[i]
		}
		if g.rawOf != nil {
			g.rawOf[n] = g.rawOf[i]
		}
		n++
	}
	g.joists = g.joists[:n]
	if g.jol != nil {
		g.jol = g.jol[:n]
	}
	if g.rawOf != nil {
		g.rawOf = g.rawOf[:n]
	}
	return remap
}

// drawnBlocking lists the drawn pieces on the plan, with the members they
// join, and adds each to the drawn blocking lines, which brace the members
// they cross (existingBlocking).
func (g *grouper) drawnBlocking() {
	for _, pc := range g.pieces {
		d := pc.DrawnBlock
		for e, s := range pc.segs {
			d.Members[e] = -1
			if s >= 0 && g.segMem != nil {
				d.Members[e] = int(g.segMem[s])
			}
		}
		g.plan.DrawnBlocking = append(g.plan.DrawnBlocking, d)
		g.blocking = append(g.blocking, segItem{a: d.From, b: d.To, spec: -1, pos: d.Pos})
	}
}
