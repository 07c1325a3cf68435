package check

import (
	"math"
	"sort"

	"framecheck/check/beam"
)

// lineLoads are the line loads of one stretch of a member, lb/in, by load
// type; w[LoadW] is the wind toward the member, wUp the magnitude of the
// suction, wDUp the dead load relied on against uplift.
type lineLoads struct {
	w         [numLoadTypes]float64
	wUp, wDUp float64
}

// memberPiece is a stretch of the member (member coordinates) with its
// line loads; the pieces cover the member.
type memberPiece struct {
	from, to float64
	zone     string
	lw       lineLoads
}

// loadPiece is a stretch of the analysis model (analysis coordinates)
// inside one model segment, with its line loads.
type loadPiece struct {
	a, b float64
	seg  int
	lw   lineLoads
}

// pointLd is a point load in analysis coordinates, lb by load type.
type pointLd struct {
	at  float64
	seg int
	lw  lineLoads // lb, not lb/in
}

// lineLoadsOf converts area loads on the tributary width to line loads:
// psf x in / (144 in^2/ft^2) = lb/in.
func lineLoadsOf(l AreaLoads, tribIn float64) lineLoads {
	t := tribIn / 144
	return lineLoads{
		w:    [numLoadTypes]float64{l.DeadPsf * t, l.LivePsf * t, l.RoofLivePsf * t, l.SnowPsf * t, l.WindDownPsf * t},
		wUp:  l.WindUpPsf * t,
		wDUp: l.upliftDead() * t,
	}
}

// pointLoadsOf converts a PointLoad to lb by load type.
func pointLoadsOf(p PointLoad) lineLoads {
	d := p.DeadLb
	if p.HasUpliftDead {
		d = p.UpliftDeadLb
	}
	return lineLoads{w: [numLoadTypes]float64{p.DeadLb, p.LiveLb, p.RoofLiveLb, p.SnowLb, p.WindDownLb}, wUp: p.WindUpLb, wDUp: d}
}

// factored returns the load of one stretch under factor set f with the
// wind acting dir (+1 toward the member, -1 away, 0 none); the live-type
// loads count only when patterned is true. In a case with the wind away
// from the member the dead load is the one relied on against uplift. The
// sums are formed in a fixed order so that a member loaded uniformly gets
// bit for bit the loads it had before load pieces existed.
func (lw *lineLoads) factored(f factorSet, dir float64, patterned bool) float64 {
	d, wW := lw.w[LoadD], 0.0
	if dir > 0 {
		wW = lw.w[LoadW]
	} else if dir < 0 {
		wW, d = -lw.wUp, lw.wDUp
	}
	full := f[LoadD] * d
	if !patterned {
		return full
	}
	return full + (f[LoadL]*lw.w[LoadL] + f[LoadLr]*lw.w[LoadLr] + f[LoadS]*lw.w[LoadS] + f[LoadW]*wW)
}

// present reports which load types act anywhere on the member (wind: in
// direction dir), as buildLoads found them.
func (e *engine) present(dir float64) [numLoadTypes]bool {
	switch {
	case dir > 0:
		return e.pres[2]
	case dir < 0:
		return e.pres[0]
	}
	return e.pres[1]
}

// findPresent scans the member's loads for present.
func (e *engine) findPresent(dir float64) [numLoadTypes]bool {
	var p [numLoadTypes]bool
	add := func(lw *lineLoads) {
		for t := LoadType(0); t < numLoadTypes; t++ {
			mag := lw.w[t]
			if t == LoadW {
				mag = 0
				if dir > 0 {
					mag = lw.w[LoadW]
				} else if dir < 0 {
					mag = lw.wUp
				}
			}
			p[t] = p[t] || mag > 0
		}
	}
	for i := range e.mps {
		add(&e.mps[i].lw)
	}
	for i := range e.pls {
		add(&e.pls[i].lw)
	}
	return p
}

// hasWind reports whether wind toward (dir > 0) or away from (dir < 0) the
// member acts anywhere on it.
func (e *engine) hasWind(dir float64) bool {
	return e.present(dir)[LoadW]
}

// buildLoads sets the member pieces, the model's load pieces (the member
// pieces inside the model, cut at the supports) and the point loads. The
// model must be built. general is set when the member cannot be solved
// with one uniform load per segment.
func (e *engine) buildLoads() {
	m := &e.m
	e.mps = e.mps[:0]
	if len(m.LoadPieces) == 0 {
		e.mps = append(e.mps, memberPiece{from: 0, to: m.LengthIn, lw: e.slopeWind(lineLoadsOf(m.Loads, m.TribIn))})
	} else {
		for _, p := range m.LoadPieces {
			e.mps = append(e.mps, memberPiece{from: p.FromIn, to: p.ToIn, zone: p.Zone, lw: e.slopeWind(lineLoadsOf(p.Loads, m.TribIn))})
		}
		// the first and last pieces reach the member ends exactly
		e.mps[0].from = math.Min(e.mps[0].from, 0)
		e.mps[len(e.mps)-1].to = math.Max(e.mps[len(e.mps)-1].to, m.LengthIn)
	}
	if m.SelfWeightPlf > 0 {
		for i := range e.mps {
			e.mps[i].lw.w[LoadD] += m.SelfWeightPlf / 12
			e.mps[i].lw.wDUp += m.SelfWeightPlf / 12
		}
	}
	e.pls = e.pls[:0]
	for _, p := range m.PointLoads {
		at := p.AtIn - e.x0
		e.pls = append(e.pls, pointLd{at: math.Min(math.Max(at, 0), e.bm.LengthIn), seg: e.segAt(at), lw: pointLoadsOf(p)})
	}
	e.general = len(e.mps) > 1 || len(e.pls) > 0
	e.pres = [3][numLoadTypes]bool{e.findPresent(-1), e.findPresent(0), e.findPresent(1)}
	e.lps = e.lps[:0]
	if !e.general {
		for k, sg := range e.segs {
			e.lps = append(e.lps, loadPiece{a: sg.FromIn, b: sg.ToIn, seg: k, lw: e.mps[0].lw})
		}
		return
	}
	L := e.bm.LengthIn
	for k, sg := range e.segs {
		for _, mp := range e.mps {
			a := math.Max(mp.from-e.x0, sg.FromIn)
			b := math.Min(mp.to-e.x0, sg.ToIn)
			if k == 0 {
				a = math.Max(mp.from-e.x0, 0)
			}
			if k == len(e.segs)-1 {
				b = math.Min(mp.to-e.x0, L)
			}
			if b-a > 1e-9*L {
				e.lps = append(e.lps, loadPiece{a: a, b: b, seg: k, lw: mp.lw})
			}
		}
	}
}

// slopeWind converts the wind on a sloped rafter to the horizontal
// projection the model uses: a pressure p normal to the roof, per sloped
// area, bends the rafter as p L_s^2 / 8 = p L_h^2 / (8 cos^2); on the
// projection it is p / cos^2 (statics; gravity loads on the projection
// bend it as w L_h^2 / 8 already).
func (e *engine) slopeWind(lw lineLoads) lineLoads {
	if e.cosT < 1 {
		k := 1 / (e.cosT * e.cosT)
		lw.w[LoadW] *= k
		lw.wUp *= k
	}
	return lw
}

// segAt returns the model segment holding analysis position x (the left
// one at a support).
func (e *engine) segAt(x float64) int {
	k := sort.Search(len(e.segs), func(i int) bool { return e.segs[i].ToIn >= x })
	if k >= len(e.segs) {
		k = len(e.segs) - 1
	}
	return k
}

// fillCase sets the loads of case c: one value per load piece (w, lb/in)
// and, on a general member, the point loads.
func (e *engine) fillCase(c *strengthCase) {
	for k := range e.lps {
		lp := &e.lps[k]
		c.w[k] = lp.lw.factored(c.f, c.dir, c.pattern&(1<<lp.seg) != 0)
	}
	c.pts = c.pts[:0]
	for i := range e.pls {
		p := &e.pls[i]
		c.pts = append(c.pts, beam.PointLoad{AtIn: p.at, PLb: p.lw.factored(c.f, c.dir, c.pattern&(1<<p.seg) != 0)})
	}
}

// solve analyses the model under the loads w (one per load piece) and pts
// into r.
func (e *engine) solve(r *beam.Response, w []float64, pts []beam.PointLoad) error {
	if !e.general {
		return e.bm.SolveInto(r, w)
	}
	e.partBuf = e.partBuf[:0]
	for k, lp := range e.lps {
		e.partBuf = append(e.partBuf, beam.PartialLoad{FromIn: lp.a, ToIn: lp.b, WPli: w[k]})
	}
	l := beam.Loads{Partial: e.partBuf, Points: pts}
	// Every case of the member loads the same stretches and points (the
	// model's load pieces and point loads): the beam is cut at them once.
	if !e.cutsFor(pts) {
		cuts, err := e.bm.Cuts(l)
		if err != nil {
			return e.bm.SolveLoadsInto(r, l) // which says why
		}
		e.cuts = append(e.cuts[:0], cuts...)
		e.cutPts = e.cutPts[:0]
		for _, p := range pts {
			e.cutPts = append(e.cutPts, p.AtIn)
		}
		e.haveCuts = true
	}
	return e.bm.SolveLoadsCutInto(r, l, e.cuts)
}

// cutsFor reports whether e.cuts are the cuts of a load set of the
// model's load pieces and point loads at the places of pts.
func (e *engine) cutsFor(pts []beam.PointLoad) bool {
	if !e.haveCuts || len(pts) != len(e.cutPts) {
		return false
	}
	for i, p := range pts {
		if p.AtIn != e.cutPts[i] {
			return false
		}
	}
	return true
}

// loadOn returns the total downward load of case c on the model between
// analysis positions from and to (from < to), point loads strictly inside
// included.
func (e *engine) loadOn(c *strengthCase, from, to float64) float64 {
	sum := 0.0
	for k, lp := range e.lps {
		a, b := math.Max(lp.a, from), math.Min(lp.b, to)
		if b > a {
			sum += c.w[k] * (b - a)
		}
	}
	for _, p := range c.pts {
		if p.AtIn > from && p.AtIn < to {
			sum += p.PLb
		}
	}
	return sum
}

// stubLoad returns the load of case c on the member between member
// positions from and to, outside the model (an end that is part of its
// bearing), patterned as model segment seg.
func (e *engine) stubLoad(c *strengthCase, from, to float64, seg int) float64 {
	sum := 0.0
	for i := range e.mps {
		mp := &e.mps[i]
		a, b := math.Max(mp.from, from), math.Min(mp.to, to)
		if b > a {
			sum += mp.lw.factored(c.f, c.dir, c.pattern&(1<<seg) != 0) * (b - a)
		}
	}
	return sum
}
