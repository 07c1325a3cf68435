package check

import (
	"math"
	"sort"
)

// The inflection-point rule (Settings.BraceAtInflection; DOMAIN.md
// "Blocking rows", issue 13 item 4). Over an interior support of a
// continuous member under gravity load the bottom edge is in compression
// from the support to the inflection point on each side, where the moment
// changes sign. NDS 2018 3.3.3.4 takes lu between points of lateral
// support; it does not name the inflection point as one. Common practice
// (no source) lets the designer count it as a brace of the compression
// edge, the top edge being held by the sheathing; framecheck does so only
// when the project file says design.brace_at_inflection = true, and only
// for the load cases whose moment over that support is negative (the case
// whose inflection point it is). The trace says which rule was used.

// inflectionPoints appends to dst the inflection points (analysis
// coordinates) that case ci's bottom edge may count as braces: for each
// interior support where the case's moment is negative, the nearest sign
// change of the moment on each side within the adjacent spans. A side
// whose moment keeps its sign up to the next support (an unloaded span
// under pattern loading, say) has no inflection point and gives none.
func (e *engine) inflectionPoints(dst []float64, ci int) []float64 {
	sup := e.bm.SupportsAtIn
	if len(sup) < 3 {
		return dst
	}
	c := &e.cases[ci]
	tol := 1e-3*e.mMax + 1e-9
	var buf [16]float64
	changes := c.r.AppendMomentSignChanges(buf[:0])
	for i := 1; i+1 < len(sup); i++ {
		if c.r.Moment(sup[i]) >= -tol {
			continue
		}
		left, right := math.NaN(), math.NaN()
		for _, x := range changes {
			if x > sup[i-1] && x < sup[i] {
				left = x // the last one before the support
			}
			if x > sup[i] && x < sup[i+1] && math.IsNaN(right) {
				right = x
			}
		}
		for _, x := range [2]float64{left, right} {
			if !math.IsNaN(x) {
				dst = append(dst, x)
			}
		}
	}
	return dst
}

// inflectionRule reports whether the inflection-point rule is in force for
// the bottom edge of this member: switched on, the edge not held by a
// ceiling, and a continuous member (an interior support).
func (e *engine) inflectionRule() bool {
	return e.s.BraceAtInflection && !e.m.BottomBracedContinuous && len(e.bm.SupportsAtIn) >= 3
}

// bottomEval evaluates bottom-edge bending with the drawn rows, the added
// rows rowsIn (member positions) and, under the inflection-point rule,
// each case's own inflection points as braces. The second result is the
// governing case's inflection points when the rule placed any (analysis
// coordinates, a new slice), else nil.
func (e *engine) bottomEval(rowsIn []float64) (edgeEval, []float64) {
	if !e.inflectionRule() {
		return e.evalEdge(false, e.intervals(e.m.BottomBracedContinuous, e.braces(rowsIn))), nil
	}
	// Cases without inflection points are evaluated together on the
	// common bracing; each case with some, on its own.
	plain := make([]bool, len(e.cases))
	ips := make([][]float64, len(e.cases))
	anyPlain := false
	for ci := range e.cases {
		ips[ci] = e.inflectionPoints(nil, ci)
		plain[ci] = len(ips[ci]) == 0
		anyPlain = anyPlain || plain[ci]
	}
	var ev edgeEval
	ev.ci = -1
	var gov []float64
	if anyPlain {
		ev = e.evalEdgeSel(false, e.intervals(false, e.braces(rowsIn)), plain)
	}
	one := make([]bool, len(e.cases))
	for ci := range e.cases {
		if plain[ci] {
			continue
		}
		pts := append(append([]float64(nil), e.braces(rowsIn)...), ips[ci]...)
		pts = sortedUnique(pts)
		one[ci] = true
		evc := e.evalEdgeSel(false, e.intervals(false, pts), one)
		one[ci] = false
		if evc.found && (!ev.found || evc.ratio > ev.ratio) {
			ev.found, ev.ratio, ev.ci, ev.iv, ev.mLbIn, ev.fbStar, ev.cl = true, evc.ratio, evc.ci, evc.iv, evc.mLbIn, evc.fbStar, evc.cl
			gov = ips[ci]
		}
		if evc.maxRB > ev.maxRB {
			ev.maxRB, ev.maxRBInt = evc.maxRB, evc.maxRBInt
		}
	}
	if ev.found && plain[ev.ci] {
		gov = nil
	}
	return ev, gov
}

// sortedUnique sorts pts and drops points within 0.01 in of the one before.
func sortedUnique(pts []float64) []float64 {
	if len(pts) == 0 {
		return pts
	}
	sort.Float64s(pts)
	out := pts[:1]
	for _, p := range pts[1:] {
		if p-out[len(out)-1] > 0.01 {
			out = append(out, p)
		}
	}
	return out
}
