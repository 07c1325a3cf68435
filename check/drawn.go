package check

import (
	"fmt"
	"math"
	"sort"
)

// Blocking rows with rows already drawn (DOMAIN.md "Blocking rows", issue
// 13 item 4). The drawn rows are braces of both edges and are kept; the
// solver adds rows one at a time, each in the stretch of a span (between
// two braces that were there before it: bearings, drawn rows, rows the
// member's run already has) that holds the governing failing unbraced
// length of the bottom edge, the stretch's rows spaced evenly so that its
// longest unbraced length is as short as its number of rows allows. A row
// so placed is at least minBlockingLuIn (24 in) from every brace, a drawn
// row included, so it never lands on one. Over an interior support of a
// continuous member, where gravity load puts the bottom edge in
// compression, a single row at the governing case's inflection point is
// the other candidate (unless the inflection point already counts as a
// brace); the candidate with the lower ratio is taken. Rows evenly spaced
// in every span (solveBlocking) remain the rule when no row is drawn.

// spanPosTolIn is how far inside a span a drawn row must lie to count as
// drawn in the span rather than at its bearing.
const spanPosTolIn = 0.01

// maxSolverSteps bounds the rows the solver adds to one member; the 24 in
// limit stops it long before on any real joist.
const maxSolverSteps = 500

// drawnInSpans reports whether a drawn row lies inside a span of the
// member (not at a bearing, not on an overhang).
func (e *engine) drawnInSpans() bool { return e.m.HasDrawnRowsInSpans() }

// drawnInModel returns the drawn rows that brace the member (those within
// its length), sorted, in a new slice; nil when there are none.
func (e *engine) drawnInModel() []float64 {
	var out []float64
	for _, x := range e.m.BlockingAtIn {
		if xa := x - e.x0; xa > 0 && xa < e.bm.LengthIn {
			out = append(out, x)
		}
	}
	sort.Float64s(out)
	return out
}

// rowsPerSpan counts the rows (member positions) inside each span.
func (e *engine) rowsPerSpan(rows []float64) []int {
	out := make([]int, len(e.spanSegs))
	for _, x := range rows {
		xa := x - e.x0
		for i, k := range e.spanSegs {
			if sg := e.segs[k]; xa > sg.FromIn && xa < sg.ToIn {
				out[i]++
				break
			}
		}
	}
	return out
}

// keepRows returns the rows of atIn that brace the member and are not a
// drawn row: a row within d of a drawn row is that row (the dressed depth
// d: two rows closer than the member is deep hold the same point of the
// edge; common practice, no source). Sorted, in a new slice.
func (e *engine) keepRows(atIn []float64) ([]float64, error) {
	var out []float64
	for _, x := range atIn {
		if !finite(x) {
			return nil, fmt.Errorf("blocking row at %v in: want a finite position", x)
		}
		if xa := x - e.x0; xa <= 0 || xa >= e.bm.LengthIn || e.nearDrawn(x) {
			continue
		}
		out = append(out, x)
	}
	sort.Float64s(out)
	return out, nil
}

// nearDrawn reports whether member position x is within d of a drawn row.
func (e *engine) nearDrawn(x float64) bool {
	for _, y := range e.m.BlockingAtIn {
		if math.Abs(x-y) <= e.sec.DIn {
			return true
		}
	}
	return false
}

// stretch is a part of a span between two braces that were there before
// the solver (analysis coordinates), with the k rows it put there, evenly
// spaced.
type stretch struct {
	a, b float64
	k    int
}

// stretches cuts the spans at the drawn rows and the rows of fixed
// (member positions).
func (e *engine) stretches(fixed []float64) []stretch {
	var out []stretch
	var pts []float64
	for _, k := range e.spanSegs {
		sg := e.segs[k]
		pts = append(pts[:0], sg.FromIn, sg.ToIn)
		for _, set := range [2][]float64{e.m.BlockingAtIn, fixed} {
			for _, x := range set {
				if xa := x - e.x0; xa > sg.FromIn+spanPosTolIn && xa < sg.ToIn-spanPosTolIn {
					pts = append(pts, xa)
				}
			}
		}
		pts = sortedUnique(pts)
		for i := 0; i+1 < len(pts); i++ {
			out = append(out, stretch{a: pts[i], b: pts[i+1]})
		}
	}
	return out
}

// solverRows returns the rows added (member positions, sorted, a new
// slice): fixed, the inflection-point rows extra, and each stretch's rows.
func (e *engine) solverRows(fixed, extra []float64, st []stretch) []float64 {
	rows := append(append([]float64(nil), fixed...), extra...)
	for _, s := range st {
		step := (s.b - s.a) / float64(s.k+1)
		for j := 1; j <= s.k; j++ {
			rows = append(rows, s.a+float64(j)*step+e.x0)
		}
	}
	sort.Float64s(rows)
	return rows
}

// stretchOf returns the index of the stretch holding the unbraced
// interval iv, or -1 (an overhang, which rows in spans cannot shorten).
func stretchOf(st []stretch, iv interval) int {
	for j, s := range st {
		if iv.a >= s.a-spanPosTolIn && iv.b <= s.b+spanPosTolIn {
			return j
		}
	}
	return -1
}

// inflectionRow returns the candidate row at case ci's inflection point
// inside stretch s next to an interior support (member position), the one
// nearest that support, and whether there is one at least minBlockingLuIn
// from both ends of the stretch.
func (e *engine) inflectionRow(ci int, s stretch) (float64, bool) {
	sup := e.bm.SupportsAtIn
	interior := func(x float64) bool {
		for _, p := range sup[1 : len(sup)-1] {
			if math.Abs(p-x) <= spanPosTolIn {
				return true
			}
		}
		return false
	}
	if len(sup) < 3 || ci < 0 || (!interior(s.a) && !interior(s.b)) {
		return 0, false
	}
	dist := func(x float64) float64 {
		d := math.Inf(1)
		if interior(s.a) {
			d = x - s.a
		}
		if interior(s.b) {
			d = math.Min(d, s.b-x)
		}
		return d
	}
	best, found := 0.0, false
	for _, x := range e.inflectionPoints(nil, ci) {
		if x-s.a < minBlockingLuIn || s.b-x < minBlockingLuIn {
			continue
		}
		if !found || dist(x) < dist(best) {
			best, found = x, true
		}
	}
	return best + e.x0, found
}

// solveFrom adds rows to the drawn rows and the rows fixed (kept by
// keepRows) until the bottom edge passes, and returns the result with
// them. When no number of rows makes it pass, the result has only fixed
// and says the edge fails, as with rows evenly spaced.
func (e *engine) solveFrom(fixed []float64) Result {
	how := rowsSolved
	if len(fixed) > 0 {
		how = rowsFrom
	}
	rows := e.solverRows(fixed, nil, nil)
	ev0, _ := e.bottomEval(rows)
	if e.m.BottomBracedContinuous || ev0.passes() {
		return e.resultAt(rows, &ev0, how)
	}
	st := e.stretches(fixed)
	var extra []float64
	steps := []BlockingStep{e.step(rows, ev0)}
	// Rows cannot help when the edge fails even fully braced.
	if ev0.found && ev0.mLbIn/e.sec.SIn3 > e.cases[ev0.ci].cd*e.fbNegNoCD*e.cv*(1+ratioTol) {
		r := e.resultAt(rows, &ev0, how)
		r.BlockingSteps = steps
		return r
	}
	ev := ev0
	for len(steps) < maxSolverSteps {
		iv := ev.iv
		if !ev.found || ev.ratio <= 1+ratioTol {
			iv = ev.maxRBInt // RB > 50 fails: its longest stretch
		}
		j := stretchOf(st, iv)
		if j < 0 {
			break
		}
		s := st[j]
		// Candidates are compared on the stretch they change: another
		// stretch may govern the member as a whole.
		var best *edgeEval
		var bestSt []stretch
		var bestExtra []float64
		try := func(cst []stretch, cextra []float64) {
			c := e.localEval(e.solverRows(fixed, cextra, cst), s)
			if best == nil || (c.passes() && !best.passes()) || (c.passes() == best.passes() && c.ratio < best.ratio-ratioTol) {
				best, bestSt, bestExtra = &c, cst, cextra
			}
		}
		if (s.b-s.a)/float64(s.k+2) >= minBlockingLuIn {
			cst := append([]stretch(nil), st...)
			cst[j].k++
			try(cst, extra)
		}
		if s.k == 0 && !e.inflectionRule() {
			if p, ok := e.inflectionRow(ev.ci, s); ok {
				pa := p - e.x0
				cst := append(append(append([]stretch(nil), st[:j]...), stretch{a: s.a, b: pa}, stretch{a: pa, b: s.b}), st[j+1:]...)
				try(cst, append(append([]float64(nil), extra...), p))
			}
		}
		if best == nil {
			break // lu would fall below 24 in
		}
		st, extra = bestSt, bestExtra
		rows = e.solverRows(fixed, extra, st)
		ev, _ = e.bottomEval(rows)
		steps = append(steps, e.step(rows, ev))
		if ev.passes() {
			r := e.resultAt(rows, &ev, how)
			r.BlockingSteps = steps
			return r
		}
	}
	rows = e.solverRows(fixed, nil, nil)
	r := e.resultAt(rows, &ev0, how)
	r.BlockingSteps = steps
	return r
}

// localEval evaluates the bottom edge with rows over the unbraced
// stretches inside s only (without the inflection-point rule, under which
// no inflection-point row is tried).
func (e *engine) localEval(rows []float64, s stretch) edgeEval {
	ivs := e.intervals(e.m.BottomBracedContinuous, e.braces(rows))
	var sub []interval
	for _, iv := range ivs {
		if iv.a >= s.a-spanPosTolIn && iv.b <= s.b+spanPosTolIn {
			sub = append(sub, iv)
		}
	}
	if e.inflectionRule() {
		ev, _ := e.bottomEval(rows)
		return ev
	}
	return e.evalEdge(false, sub)
}

// step records one iteration of solveFrom: the rows added so far (a new
// slice) and the bottom edge's governing numbers.
func (e *engine) step(rows []float64, ev edgeEval) BlockingStep {
	at := append([]float64{}, rows...)
	return BlockingStep{AtIn: at, LuIn: ev.iv.luIn, CL: ev.cl, Ratio: ev.ratio}
}

// HasDrawnRowsInSpans reports whether a drawn row (m.BlockingAtIn) lies
// inside a span of m, away from its bearings: CheckMember then keeps the
// drawn rows and adds rows where the edge still fails, instead of n rows
// evenly spaced in every span.
func (m *Member) HasDrawnRowsInSpans() bool {
	for _, x := range m.BlockingAtIn {
		for i := 1; i < len(m.Bearings); i++ {
			if x > m.Bearings[i-1].AtIn+spanPosTolIn && x < m.Bearings[i].AtIn-spanPosTolIn {
				return true
			}
		}
	}
	return false
}
