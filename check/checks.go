package check

import (
	"math"

	"framecheck/check/beam"
)

// segAround returns the indices of the model segments left and right of
// support j (-1 where there is none).
func (e *engine) segAround(j int) (left, right int) {
	first := 0
	if len(e.segs) > 0 && e.segs[0].Cantilever {
		first = 1
	}
	left, right = first+j-1, first+j
	if right >= len(e.segs) {
		right = -1
	}
	return left, right
}

// shearCheck returns the shear check: fv = 1.5 V / A (NDS 2018 Eq. 3.4-2)
// with V the largest shear at a bearing centre-line, or at a distance d
// from the bearing face when Settings.ShearAtD (NDS 2018 3.4.3.1(a)), over
// every strength case; Fv' = Fv CD CM Ct Ci (NDS 2018 Table 4.3.1).
func (e *engine) shearCheck() CheckResult {
	best, bestV, bestCI, bestJ := -1.0, 0.0, 0, 0
	bestFv := 0.0
	d := e.sec.DIn
	for ci := range e.cases {
		c := &e.cases[ci]
		fvAdj := e.dv.FvPsi * c.cd * e.cm.Fv * e.ct.Fv * e.ci.Fv
		for j, x := range e.bm.SupportsAtIn {
			vl, vr := c.r.ShearEachSide(x)
			if e.s.ShearAtD {
				off := e.m.Bearings[j].LengthIn/2 + d
				l, r := e.segAround(j)
				if l >= 0 {
					vl += c.w[l] * math.Min(off, e.segs[l].ToIn-e.segs[l].FromIn)
				}
				if r >= 0 {
					vr -= c.w[r] * math.Min(off, e.segs[r].ToIn-e.segs[r].FromIn)
				}
			}
			v := math.Max(math.Abs(vl), math.Abs(vr))
			if ratio := 1.5 * v / e.sec.AreaIn2 / fvAdj; ratio > best {
				best, bestV, bestCI, bestJ, bestFv = ratio, v, ci, j, fvAdj
			}
		}
	}
	c := &e.cases[bestCI]
	fv := 1.5 * bestV / e.sec.AreaIn2
	e.rc.shear = shearRec{vLb: bestV, cd: c.cd, fvAdjPsi: bestFv, bearing: bestJ}
	return CheckResult{Kind: KindShear, Combo: e.caseLabel(c), Actual: fv, Allowable: bestFv, Unit: "psi", Ratio: fv / bestFv, calc: e.rc}
}

// bearingCheck returns the bearing check: fc_perp = R / (b lb) at each
// bearing against Fc_perp' = Fc_perp CM Ct Ci Cb (NDS 2018 3.10.2, Table
// 4.3.1; no CD), with the largest downward reaction of any strength case.
// It also returns each bearing's largest downward and largest net uplift
// reaction (Result.Reactions), found over the same cases. The reaction at an end
// that is part of its bearing includes the load on the piece past the
// centre-line.
func (e *engine) bearingCheck() (CheckResult, []Reaction) {
	reactions := make([]Reaction, 0, len(e.m.Bearings))
	best, bestJ, bestCI := -1.0, 0, 0
	var bestR, bestCb, bestFc float64
	last := len(e.m.Bearings) - 1
	for j, b := range e.m.Bearings {
		// An end that is part of its bearing (no overhang analysed) puts
		// the load on its piece past the centre-line straight into the
		// reaction (DOMAIN rule), carried as the next segment carries it.
		stub, seg := 0.0, 0
		if j == 0 && e.m.OverhangStartIn == 0 {
			stub = b.AtIn
		} else if j == last && e.m.OverhangEndIn == 0 {
			stub, seg = e.m.LengthIn-b.AtIn, len(e.segs)-1
		}
		stub = math.Max(stub, 0)
		rMax, rMin, ciMax, ciMin := 0.0, 0.0, 0, 0
		for ci := range e.cases {
			r := e.cases[ci].r.Reactions()[j] + e.cases[ci].w[seg]*stub
			if r > rMax {
				rMax, ciMax = r, ci
			}
			if r < rMin {
				rMin, ciMin = r, ci
			}
		}
		reactions = append(reactions, e.reaction(j, rMax, ciMax, rMin, ciMin))
		edge := math.Min(b.AtIn-b.LengthIn/2, e.m.LengthIn-(b.AtIn+b.LengthIn/2))
		cb := BearingAreaFactor(b.LengthIn, edge)
		fcAdj := e.dv.FcPerpPsi * e.cm.FcPerp * e.ct.FcPerp * e.ci.FcPerp * cb
		if ratio := rMax / (e.sec.BIn * b.LengthIn) / fcAdj; ratio > best {
			best, bestJ, bestCI, bestR, bestCb, bestFc = ratio, j, ciMax, rMax, cb, fcAdj
		}
	}
	b := e.m.Bearings[bestJ]
	fc := bestR / (e.sec.BIn * b.LengthIn)
	e.rc.bear = bearRec{rLb: bestR, lbIn: b.LengthIn, cb: bestCb, fcAdjPsi: bestFc, bearing: bestJ}
	return CheckResult{Kind: KindBearing, Combo: e.caseLabel(&e.cases[bestCI]), Actual: fc, Allowable: bestFc,
		Unit: "psi", Ratio: fc / bestFc, calc: e.rc}, reactions
}

// reaction is bearing j's Reaction from its largest downward reaction
// rMax (case ciMax) and its most negative reaction rMin (case ciMin);
// rMax <= 0 (rMin >= 0) means no case gives a reaction of that sign.
func (e *engine) reaction(j int, rMax float64, ciMax int, rMin float64, ciMin int) Reaction {
	r := Reaction{Bearing: j, AtIn: e.m.Bearings[j].AtIn}
	if rMax > 0 {
		r.DownLb, r.DownCombo = rMax, e.caseLabel(&e.cases[ciMax])
	}
	if rMin < 0 {
		r.UpLb, r.UpCombo, r.UpCD = -rMin, e.caseLabel(&e.cases[ciMin]), e.cases[ciMin].cd
	}
	return r
}

// deflWorst is the governing deflection of one service case.
type deflWorst struct {
	ratio, deflIn, allowIn, spanIn, limit float64
	seg                                   int
	live                                  string // live-type load, "" for dead load alone
	withD                                 bool   // Kcr D added (total deflection)
	pattern                               uint32
	cant                                  bool
}

// deflectionChecks returns the live and total deflection checks (IBC 2018
// Table 1604.3 with its footnotes). Live: each live-type load alone at 1.0
// (wind at 0.42 W, footnote f), pattern-loaded like the strength cases,
// against span/LiveLimit. Total: Kcr times the dead-load deflection (NDS
// 2018 3.5.2) plus each live-type case, against span/TotalLimit. Spans use
// the largest deflection between their bearings; a cantilever its tip
// deflection (back-span rotation included) against 2 x overhang / limit
// (footnote h). A limit of 0 skips that check. A member of one span is
// solved once under a unit load and scaled, every response being
// proportional to its one load.
func (e *engine) deflectionChecks() []CheckResult {
	type lt struct {
		name string
		w    float64
	}
	var livesBuf [5]lt
	lives := livesBuf[:0]
	for _, l := range [...]lt{{"L", e.wPli[LoadL]}, {"Lr", e.wPli[LoadLr]}, {"S", e.wPli[LoadS]},
		{"0.42W(down)", 0.42 * e.wPli[LoadW]}, {"0.42W(up)", -0.42 * e.wUpPli}} {
		if l.w != 0 {
			lives = append(lives, l)
		}
	}
	pats := e.patterns()
	var r beam.Response
	var wBuf [8]float64
	w := wBuf[:0]
	if len(e.segs) > len(wBuf) {
		w = make([]float64, 0, len(e.segs))
	}
	w = w[:len(e.segs)]
	liveW := deflWorst{ratio: -1}
	totW := deflWorst{ratio: -1}
	wD := e.kcr * e.wPli[LoadD]

	single := len(e.segs) == 1 && !e.segs[0].Cantilever
	unitY := 0.0
	if single {
		w[0] = 1
		if err := e.bm.SolveInto(&r, w); err != nil {
			return nil
		}
		unitY, _ = r.MaxDeflection(e.segs[0].FromIn, e.segs[0].ToIn)
	}
	eval := func(live string, withD bool, pat uint32, limit float64, worst *deflWorst) {
		if single {
			sg := e.segs[0]
			l := sg.ToIn - sg.FromIn
			y, allow := math.Abs(w[0]*unitY), l/limit
			if ratio := y / allow; ratio > worst.ratio {
				*worst = deflWorst{ratio: ratio, deflIn: y, allowIn: allow, spanIn: l, limit: limit, live: live, withD: withD, pattern: pat}
			}
			return
		}
		if err := e.bm.SolveInto(&r, w); err != nil {
			return
		}
		for k, sg := range e.segs {
			l := sg.ToIn - sg.FromIn
			var y, allow float64
			if sg.Cantilever {
				tip := sg.FromIn
				if k > 0 {
					tip = sg.ToIn
				}
				y, allow = r.Deflection(tip), 2*l/limit
			} else {
				y, _ = r.MaxDeflection(sg.FromIn, sg.ToIn)
				allow = l / limit
			}
			if ratio := math.Abs(y) / allow; ratio > worst.ratio {
				*worst = deflWorst{ratio: ratio, deflIn: math.Abs(y), allowIn: allow, spanIn: l, limit: limit,
					seg: k, live: live, withD: withD, pattern: pat, cant: sg.Cantilever}
			}
		}
	}
	for _, lv := range lives {
		for _, pat := range pats {
			if e.m.LiveLimit > 0 {
				for k := range w {
					w[k] = 0
					if pat&(1<<k) != 0 {
						w[k] = lv.w
					}
				}
				eval(lv.name, false, pat, e.m.LiveLimit, &liveW)
			}
			if e.m.TotalLimit > 0 && lv.w > 0 {
				for k := range w {
					w[k] = wD
					if pat&(1<<k) != 0 {
						w[k] += lv.w
					}
				}
				eval(lv.name, true, pat, e.m.TotalLimit, &totW)
			}
		}
	}
	// With no downward live-type load (none, or wind suction only) the
	// largest live-type deflection adds nothing: total = Kcr D alone.
	down := false
	for _, lv := range lives {
		down = down || lv.w > 0
	}
	if e.m.TotalLimit > 0 && !down && wD > 0 {
		for k := range w {
			w[k] = wD
		}
		eval("", true, pats[0], e.m.TotalLimit, &totW)
	}
	var out []CheckResult
	if liveW.ratio >= 0 {
		out = append(out, e.deflResult(KindDeflectionLive, liveW))
	}
	if totW.ratio >= 0 {
		out = append(out, e.deflResult(KindDeflectionTotal, totW))
	}
	return out
}

// deflName names a service case: "L", "1.5D+Lr (live-type loads on span 1)".
func (e *engine) deflName(d deflWorst) string {
	name := d.live
	if d.withD {
		if name == "" {
			name = num(e.kcr) + "D"
		} else {
			name = num(e.kcr) + "D+" + name
		}
	}
	if pl := e.patternLabel(d.pattern); pl != "" && d.live != "" {
		name += " (" + pl + ")"
	}
	return name
}

func (e *engine) deflResult(kind string, d deflWorst) CheckResult {
	where := e.segLabel(d.seg)
	slot := 0
	if kind == KindDeflectionTotal {
		slot = 1
	}
	e.rc.defl[slot] = deflRec{deflIn: d.deflIn, allowIn: d.allowIn, spanIn: d.spanIn, limit: d.limit, ratio: d.ratio,
		cant: d.cant, total: kind == KindDeflectionTotal, where: where}
	return CheckResult{Kind: kind, Combo: e.deflName(d) + ", " + where, Actual: d.deflIn, Allowable: d.allowIn, Unit: "in", Ratio: d.ratio, calc: e.rc}
}
