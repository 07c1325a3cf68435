package check

import (
	"math"
	"sort"
)

// interval is a stretch of one edge between two bracing points (or a
// bracing point and a free cantilever end), with its NDS 2018 3.3.3
// stability quantities.
type interval struct {
	a, b      float64 // ends, analysis coordinates
	braced    bool    // held continuously: CL = 1
	kind      uint8   // index in leKinds
	luIn      float64
	leIn      float64
	leFormula uint8 // index in leFormulas
	rb        float64
	fbEPsi    float64
}

// Stretch kinds, indices in leKinds.
const (
	kindSimple uint8 = iota
	kindCantilever
	kindGeneral
)

var (
	leKinds    = [...]string{LeSimple, LeCantilever, LeGeneral}
	leRefs     = [...]string{"NDS 2018 Table 3.3.3 (single span)", "NDS 2018 Table 3.3.3 (cantilever)", "NDS 2018 Table 3.3.3 (general, continuous spans)"}
	leFormulas = [...]string{"2.06 lu", "1.63 lu + 3 d", "1.84 lu", "1.33 lu", "0.90 lu + 3 d"}
)

// formulaIndex returns the index of an EffectiveLength formula in leFormulas.
func formulaIndex(f string) uint8 {
	for i, g := range leFormulas {
		if g == f {
			return uint8(i)
		}
	}
	return 0
}

// edgeEval is an edge's governing bending result.
type edgeEval struct {
	found    bool    // the edge is in compression somewhere
	ratio    float64 // largest fb/Fb'
	ci       int     // governing case
	iv       interval
	mLbIn    float64
	fbStar   float64
	cl       float64
	maxRB    float64 // largest RB of any stretch of this edge in compression
	maxRBLu  float64
	maxRBInt interval
}

// braces returns the bracing points of an edge in analysis coordinates
// (in a buffer of the engine that the next call overwrites):
// the bearings plus the blocking rows (member positions) that fall inside
// the model, sorted and without duplicates.
func (e *engine) braces(rowsIn []float64) []float64 {
	pts := append(e.ptsBuf[:0], e.bm.SupportsAtIn...)
	defer func() { e.ptsBuf = pts[:0] }()
	for _, set := range [][]float64{e.m.BlockingAtIn, rowsIn} {
		for _, x := range set {
			if xa := x - e.x0; xa > 0 && xa < e.bm.LengthIn {
				pts = append(pts, xa)
			}
		}
	}
	return sortUnique(pts)
}

// sortUnique sorts pts in place and drops points within 0.01 in of the one
// before; it returns the shortened slice.
func sortUnique(pts []float64) []float64 {
	sort.Float64s(pts)
	out := pts[:1]
	for _, p := range pts[1:] {
		if p-out[len(out)-1] > 0.01 {
			out = append(out, p)
		}
	}
	return out
}

// topIntervals returns the top edge's stretches: braced continuously by
// the sheathing (Settings.TopEdgeBraced), or, on a member whose top edge
// is held only at points (Member.TopBracedAtPoints), between the bearings
// and those points; otherwise between the bracing points pts of both
// edges.
func (e *engine) topIntervals(pts []float64) []interval {
	if !e.m.TopBracedAtPoints {
		return e.intervals(e.s.TopEdgeBraced, pts)
	}
	own := append([]float64(nil), e.bm.SupportsAtIn...)
	for _, x := range e.m.TopBracingAtIn {
		if xa := x - e.x0; xa > 0 && xa < e.bm.LengthIn {
			own = append(own, xa)
		}
	}
	return e.intervals(false, sortUnique(own))
}

// intervals cuts the model into the unbraced stretches of an edge braced
// at pts (continuous true: one stretch held along its whole length).
func (e *engine) intervals(continuous bool, pts []float64) []interval {
	L := e.bm.LengthIn
	if continuous {
		return append(e.ivBuf[:0], interval{a: 0, b: L, braced: true})
	}
	d, bw := e.sec.DIn, e.sec.BIn
	mk := func(a, b float64, kind uint8) interval {
		iv := interval{a: a, b: b, kind: kind, luIn: (b - a) / e.cosT} // along a sloped rafter
		var f string
		iv.leIn, f = EffectiveLength(leKinds[kind], iv.luIn, d)
		iv.leFormula = formulaIndex(f)
		iv.rb = SlendernessRatio(iv.leIn, d, bw)
		iv.fbEPsi = CriticalBucklingValue(e.eminAdj, iv.rb)
		return iv
	}
	inner := kindSimple
	if len(e.spanSegs) > 1 {
		inner = kindGeneral
	}
	out := e.ivBuf[:0]
	defer func() { e.ivBuf = out[:0] }()
	if pts[0] > 0 {
		out = append(out, mk(0, pts[0], kindCantilever))
	}
	for i := 0; i+1 < len(pts); i++ {
		out = append(out, mk(pts[i], pts[i+1], inner))
	}
	if last := pts[len(pts)-1]; last < L {
		out = append(out, mk(last, L, kindCantilever))
	}
	return out
}

// evalEdge finds the governing bending ratio of the top edge (compression
// under positive moment) or the bottom edge (negative moment) over the
// stretches ivs, across every strength case. Fb' = Fb* CL Cfu with Fb* =
// Fb CD CM Ct CF Ci Cr (NDS 2018 Table 4.3.1; Cfu = 1, strong-axis bending)
// and CL from equation 3.3-6 for each stretch.
func (e *engine) evalEdge(top bool, ivs []interval) edgeEval {
	return e.evalEdgeSel(top, ivs, nil)
}

// evalEdgeSel is evalEdge over the cases ci with sel[ci] (every case when
// sel is nil).
func (e *engine) evalEdgeSel(top bool, ivs []interval, sel []bool) edgeEval {
	ev := edgeEval{ci: -1}
	// Moments below 0.1% of the largest on the member do not count as
	// compressing an edge (an overhang of a few inches, say): their stress
	// is negligible and their stretch would otherwise set RB.
	tol := 1e-3*e.mMax + 1e-9
	for i := range ivs {
		iv := &ivs[i]
		inCompression := false
		whole := iv.a <= 0 && iv.b >= e.bm.LengthIn
		for ci := range e.cases {
			if sel != nil && !sel[ci] {
				continue
			}
			c := &e.cases[ci]
			// A case with no moment of this sign anywhere cannot load this edge.
			mWhole := c.mPos
			if !top {
				mWhole = -c.mNeg
			}
			if mWhole <= tol {
				continue
			}
			fbStar := e.fbNoCD * c.cd
			if !top {
				fbStar = e.fbNegNoCD * c.cd
			}
			cl := 1.0
			if !iv.braced {
				cl = BeamStabilityFactor(iv.fbEPsi, fbStar)
			}
			// glulam: CV or CL, whichever is smaller (NDS 2018 5.3.6)
			capLbIn := e.sec.SIn3 * fbStar * math.Min(cl, e.cv)
			// Nor can one whose largest moment anywhere would not beat the
			// ratio found so far, once this stretch's RB is accounted for.
			if pruneCases && ev.found && mWhole/capLbIn <= ev.ratio && (inCompression || iv.braced || iv.rb <= ev.maxRB) {
				continue
			}
			m := mWhole
			if !whole {
				pos, _, neg, _ := c.r.MomentExtremes(iv.a, iv.b)
				m = pos
				if !top {
					m = -neg
				}
			}
			if m <= tol {
				continue
			}
			inCompression = true
			ratio := m / capLbIn
			if !ev.found || ratio > ev.ratio {
				ev.found, ev.ratio, ev.ci, ev.iv, ev.mLbIn, ev.fbStar, ev.cl = true, ratio, ci, *iv, m, fbStar, cl
			}
		}
		if inCompression && !iv.braced && iv.rb > ev.maxRB {
			ev.maxRB, ev.maxRBInt = iv.rb, *iv
		}
	}
	return ev
}

// passes reports whether an edge result is within NDS limits: ratio at most
// 1 and RB at most 50 (NDS 2018 3.3.3.7).
func (ev edgeEval) passes() bool {
	return !ev.found || (ev.ratio <= 1+ratioTol && ev.maxRB <= 50)
}

// ratioTol absorbs rounding in "ratio <= 1.000".
const ratioTol = 1e-9

// bendingResult writes an edge's governing result as a CheckResult,
// recording its numbers for the trace.
func (e *engine) bendingResult(kind string, ev edgeEval) CheckResult {
	c := &e.cases[ev.ci]
	fb := ev.mLbIn / e.sec.SIn3
	fbAdj := ev.fbStar * math.Min(ev.cl, e.cv)
	slot := 0
	fbRef := e.dv.FbPsi
	if kind == KindBendingBottom {
		slot = 1
		if e.dv.FbNegPsi > 0 {
			fbRef = e.dv.FbNegPsi
		}
	}
	e.rc.bend[slot] = bendRec{mLbIn: ev.mLbIn, cd: c.cd, fbStar: ev.fbStar, cl: ev.cl, iv: ev.iv, fbRefPsi: fbRef, cv: e.cv}
	return CheckResult{Kind: kind, Combo: e.caseLabel(c), Actual: fb, Allowable: fbAdj, Unit: "psi", Ratio: fb / fbAdj, calc: e.rc}
}

// bendingTraceLen is the number of trace items of a bending check whose
// governing stretch is iv.
func bendingTraceLen(iv interval) int {
	if iv.braced {
		return 7
	}
	return 14
}

// leSubst writes the numbers into an effective-length formula.
func leSubst(t *tracer, formula string, lu, d float64) Subst {
	switch formula {
	case "2.06 lu":
		return t.f("2.06(%s)", lu)
	case "1.33 lu":
		return t.f("1.33(%s)", lu)
	case "1.84 lu":
		return t.f("1.84(%s)", lu)
	case "1.63 lu + 3 d":
		return t.f("1.63(%s) + 3(%s)", lu, d)
	case "0.90 lu + 3 d":
		return t.f("0.90(%s) + 3(%s)", lu, d)
	}
	return Subst{}
}

// spanRows returns the positions (member coordinates) of n evenly spaced
// blocking rows in every span, and the largest row spacing. The slice is
// the engine's and is overwritten by the next call: copy it to keep it.
func (e *engine) spanRows(n int) (rows []float64, maxLuIn float64) {
	if n <= 0 {
		return nil, 0
	}
	rows = e.rowsBuf[:0]
	defer func() { e.rowsBuf = rows[:0] }()
	for _, k := range e.spanSegs {
		sg := e.segs[k]
		l := sg.ToIn - sg.FromIn
		step := l / float64(n+1)
		maxLuIn = math.Max(maxLuIn, step)
		for j := 1; j <= n; j++ {
			rows = append(rows, sg.FromIn+float64(j)*step+e.x0)
		}
	}
	return rows, maxLuIn
}
