package check

import (
	"fmt"
	"math"
)

// Why the shear at a bearing was or was not taken at d from its face.
const (
	atDOff     uint8 = iota // shear_at_d not set: V at the centre-line
	atDApplied              // NDS 2018 3.4.3.1(a) holds: loads within d left out
	atDUplift               // net uplift at the bearing: held by connectors
	atDHanger               // the member hangs from the support's face
)

// shearCheck returns the shear check: fv = 1.5 V / A (NDS 2018 Eq. 3.4-2)
// with V the largest shear at a bearing centre-line over every strength
// case; Fv' = Fv CD CM Ct Ci (NDS 2018 Table 4.3.1). With Settings.ShearAtD
// the loads within d of the bearing face are left out of V (NDS 2018
// 3.4.3.1(a)) only where that clause holds: the member rests on the
// support and the load acts on the opposite face. So never at a bearing
// with a net uplift reaction in that case (the connectors hold the member
// down; the load does not press it onto the support) and never where the
// member hangs from the support's face (Bearing.Hanger).
func (e *engine) shearCheck() CheckResult {
	best, bestV, bestCI, bestJ := -1.0, 0.0, 0, 0
	bestFv, bestWhy := 0.0, atDOff
	d := e.sec.DIn
	for ci := range e.cases {
		c := &e.cases[ci]
		fvAdj := e.dv.FvPsi * c.cd * e.cm.Fv * e.ct.Fv * e.ci.Fv
		for j, x := range e.bm.SupportsAtIn {
			vl, vr := c.r.ShearEachSide(x)
			why := atDOff
			if e.s.ShearAtD {
				switch {
				case e.m.Bearings[j].Hanger:
					why = atDHanger
				case c.r.Reactions()[j] <= 0:
					why = atDUplift
				default:
					why = atDApplied
					// d along a rafter is d cos on the projection the
					// model is laid out on (an audit found d taken on
					// the plan: more load left out, on the unsafe side)
					off := e.m.Bearings[j].LengthIn/2 + d*e.cosT
					// Only a downward load near the bearing is left out,
					// and never more than the shear it relieves.
					if ld := e.loadOn(c, x-off, x); ld > 0 && vl < 0 {
						vl = math.Min(vl+ld, 0)
					}
					if ld := e.loadOn(c, x, x+off); ld > 0 && vr > 0 {
						vr = math.Max(vr-ld, 0)
					}
				}
			}
			v := math.Max(math.Abs(vl), math.Abs(vr))
			if ratio := 1.5 * v / e.sec.AreaIn2 / fvAdj; ratio > best {
				best, bestV, bestCI, bestJ, bestFv, bestWhy = ratio, v, ci, j, fvAdj, why
			}
		}
	}
	c := &e.cases[bestCI]
	fv := 1.5 * bestV / e.sec.AreaIn2
	e.rc.shear = shearRec{vLb: bestV, cd: c.cd, fvAdjPsi: bestFv, bearing: bestJ, atD: bestWhy}
	return CheckResult{Kind: KindShear, Combo: e.caseLabel(c), Actual: fv, Allowable: bestFv, Unit: "psi", Ratio: fv / bestFv, calc: e.rc}
}

// bearingCheck returns the bearing check: fc_perp = R / (b lb) at each
// bearing against Fc_perp' = Fc_perp CM Ct Ci Cb (NDS 2018 3.10.2, Table
// 4.3.1; no CD), with the largest downward reaction of any strength case.
// Where the bearing names the species and grade of the plate or beam under
// the member, that support's Fc_perp' is checked too and the smaller
// governs (NDS 2018 3.10.2 applies to both members in contact).
// It also returns each bearing's largest downward and largest net uplift
// reaction (Result.Reactions), found over the same cases. The reaction at an end
// that is part of its bearing includes the load on the piece past the
// centre-line.
func (e *engine) bearingCheck() (CheckResult, []Reaction) {
	reactions := make([]Reaction, 0, len(e.m.Bearings))
	best, bestJ, bestCI := -1.0, 0, 0
	var bestR, bestCb, bestFc float64
	bestSup := false
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
			c := &e.cases[ci]
			r := c.r.Reactions()[j]
			if stub > 0 {
				if j == 0 {
					r += e.stubLoad(c, 0, b.AtIn, seg)
				} else {
					r += e.stubLoad(c, b.AtIn, e.m.LengthIn, seg)
				}
			}
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
		// The plate or beam under the member: the same contact area, its
		// own Fc_perp, Cb = 1 (its bearing length is the member's width,
		// and its distance from the support's end is not known).
		onSupport := false
		if j < len(e.supFc) && e.supFc[j].FcPerpPsi > 0 {
			if sup := e.supFc[j].FcPerpPsi * e.cm.FcPerp * e.ct.FcPerp * e.ci.FcPerp; sup < fcAdj {
				fcAdj, cb, onSupport = sup, 1, true
			}
		}
		// The beam under the member, of known material: its own Fc_perp'
		// with its own factors and its Cb (SupportBeam); the smaller
		// governs.
		if j < len(e.supBeam) && e.supBeam[j].FcPerpPsi > 0 {
			if bv := e.supBeam[j].AdjNoCbPsi() * beamCb(e.sec.BIn, b.Beam.EndIn); bv < fcAdj {
				fcAdj, cb, onSupport = bv, 1, false
			}
		}
		if ratio := rMax / (e.sec.BIn * b.LengthIn) / fcAdj; ratio > best {
			best, bestJ, bestCI, bestR, bestCb, bestFc, bestSup = ratio, j, ciMax, rMax, cb, fcAdj, onSupport
		}
	}
	b := e.m.Bearings[bestJ]
	fc := bestR / (e.sec.BIn * b.LengthIn)
	e.rc.bear = bearRec{rLb: bestR, lbIn: b.LengthIn, cb: bestCb, fcAdjPsi: bestFc, bearing: bestJ, fcPerpPsi: e.dv.FcPerpPsi}
	if bestSup {
		sv := e.supFc[bestJ]
		e.rc.bear.support, e.rc.bear.fcPerpSupPsi, e.rc.bear.supportName = true, sv.FcPerpPsi, sv.Species+" "+sv.Grade
	}
	e.beamBearRec(bestJ)
	return CheckResult{Kind: KindBearing, Combo: e.caseLabel(&e.cases[bestCI]), Actual: fc, Allowable: bestFc,
		Unit: "psi", Ratio: fc / bestFc, calc: e.rc}, reactions
}

// beamBearRec records, for the trace, the beam under governing bearing
// j: the member's own Cb and Fc_perp', the beam's values and which
// governs; or the hanger the member rests on.
func (e *engine) beamBearRec(j int) {
	b := e.m.Bearings[j]
	if b.Beam.Species == "" {
		return
	}
	br := &e.rc.bear
	if b.Hanger {
		br.hanger = true
		return
	}
	v := e.supBeam[j]
	edge := math.Min(b.AtIn-b.LengthIn/2, e.m.LengthIn-(b.AtIn+b.LengthIn/2))
	br.memCb = BearingAreaFactor(b.LengthIn, edge)
	br.memAdjPsi = e.dv.FcPerpPsi * e.cm.FcPerp * e.ct.FcPerp * e.ci.FcPerp * br.memCb
	br.beam = &beamBear{v: v, cb: beamCb(e.sec.BIn, b.Beam.EndIn), endIn: b.Beam.EndIn}
	br.beam.adjPsi = v.AdjNoCbPsi() * br.beam.cb
	br.beam.governs = !br.support && br.beam.adjPsi == br.fcAdjPsi && br.beam.adjPsi < br.memAdjPsi
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
	live                                  string  // live-type load, "" for dead load alone
	dFactor                               float64 // factor on D in the case (0: none)
	pattern                               uint32
	cant                                  bool
	up                                    bool // the deflection is upward
}

// serviceLoad is one live-type load of a service case: its factor set
// (1.0, wind 0.42) and wind direction.
type serviceLoad struct {
	name string
	f    factorSet
	dir  float64
	down bool // acts downward
}

// deflectionChecks returns the deflection checks and, when the long-term
// deflection is reported but not checked, an information line.
//
//   - deflection-live (IBC 2018 Table 1604.3): each live-type load alone at
//     1.0 (wind at 0.42 W, footnote f), pattern-loaded like the strength
//     cases, against span/LiveLimit.
//   - deflection-total (IBC 2018 Table 1604.3, the D + L column): the dead
//     load plus each downward live-type case, or 0.5 D plus it for
//     seasoned lumber in dry service (footnote d), against span/TotalLimit.
//   - deflection-long-term (NDS 2018 3.5.2): Kcr times the deflection from
//     the long-term load (the dead load) plus the deflection from the
//     short-term load (each downward live-type case), against
//     span/LongTermLimit; with no limit it is reported, not checked.
//
// Spans use the largest deflection between their bearings; a cantilever
// its tip deflection (back-span rotation included) against 2 x overhang /
// limit (footnote h). A limit of 0 skips that check. A uniformly loaded
// member of one span is solved once under a unit load and scaled, every
// response being proportional to its one load.
func (e *engine) deflectionChecks() ([]CheckResult, string) {
	var livesBuf [5]serviceLoad
	lives := livesBuf[:0]
	pNone := e.present(0)
	for _, t := range [...]LoadType{LoadL, LoadLr, LoadS} {
		if pNone[t] {
			var f factorSet
			f[t] = 1
			lives = append(lives, serviceLoad{name: t.String(), f: f, down: true})
		}
	}
	var fw factorSet
	fw[LoadW] = 0.42
	if e.hasWind(1) {
		lives = append(lives, serviceLoad{name: "0.42W(down)", f: fw, dir: 1, down: true})
	}
	if e.hasWind(-1) {
		lives = append(lives, serviceLoad{name: "0.42W(up)", f: fw, dir: -1})
	}
	totalD := 1.0
	if e.s.Seasoned && !e.s.WetService {
		totalD = 0.5
	}
	pats := e.patterns()
	c := &e.svc // carries the loads of one service case
	if cap(c.w) < len(e.lps) {
		c.w = make([]float64, len(e.lps))
	}
	c.w = c.w[:len(e.lps)]
	liveW := deflWorst{ratio: -1}
	totW := deflWorst{ratio: -1}
	longW := deflWorst{ratio: -1}
	longLimit := e.m.LongTermLimit
	reportLong := longLimit == 0
	if reportLong {
		// Reported, not checked: measured against L/1 so that the worst
		// case is the largest deflection relative to its span.
		longLimit = 1
	}

	single := len(e.segs) == 1 && !e.segs[0].Cantilever && !e.general
	unitY := 0.0
	if single {
		c.w[0] = 1
		if err := e.solve(&c.r, c.w, nil); err != nil {
			return nil, ""
		}
		unitY, _ = c.r.MaxDeflection(e.segs[0].FromIn, e.segs[0].ToIn)
	}
	// On a sloped rafter the deflection perpendicular to it is the
	// projection's over cos^2, against the sloped length / limit (statics).
	ys, ls := 1/(e.cosT*e.cosT), 1/e.cosT
	eval := func(live string, dF float64, pat uint32, limit float64, worst *deflWorst) {
		if single {
			sg := e.segs[0]
			l := (sg.ToIn - sg.FromIn) * ls
			y, allow := math.Abs(c.w[0]*unitY)*ys, l/limit
			if ratio := y / allow; ratio > worst.ratio {
				*worst = deflWorst{ratio: ratio, deflIn: y, allowIn: allow, spanIn: l, limit: limit, live: live, dFactor: dF, pattern: pat,
					up: c.w[0]*unitY < 0}
			}
			return
		}
		if err := e.solve(&c.r, c.w, c.pts); err != nil {
			return
		}
		for k, sg := range e.segs {
			l := (sg.ToIn - sg.FromIn) * ls
			var y, allow float64
			if sg.Cantilever {
				tip := sg.FromIn
				if k > 0 {
					tip = sg.ToIn
				}
				y, allow = c.r.Deflection(tip)*ys, 2*l/limit
			} else {
				y, _ = c.r.MaxDeflection(sg.FromIn, sg.ToIn)
				y *= ys
				allow = l / limit
			}
			if ratio := math.Abs(y) / allow; ratio > worst.ratio {
				*worst = deflWorst{ratio: ratio, deflIn: math.Abs(y), allowIn: allow, spanIn: l, limit: limit,
					seg: k, live: live, dFactor: dF, pattern: pat, cant: sg.Cantilever, up: y < 0}
			}
		}
	}
	// set fills c with the service case: dF x D plus the live-type load
	// lv (if any) on the segments of pat.
	set := func(lv *serviceLoad, dF float64, pat uint32) {
		var f factorSet
		dir := 0.0
		if lv != nil {
			f, dir = lv.f, lv.dir
		}
		f[LoadD] = dF
		c.f, c.dir, c.pattern = f, dir, pat
		e.fillCase(c)
	}
	down := false
	for i := range lives {
		lv := &lives[i]
		down = down || lv.down
		for _, pat := range pats {
			if e.m.LiveLimit > 0 {
				set(lv, 0, pat)
				eval(lv.name, 0, pat, e.m.LiveLimit, &liveW)
			}
			if !lv.down {
				continue
			}
			if e.m.TotalLimit > 0 {
				set(lv, totalD, pat)
				eval(lv.name, totalD, pat, e.m.TotalLimit, &totW)
			}
			set(lv, e.kcr, pat)
			eval(lv.name, e.kcr, pat, longLimit, &longW)
		}
	}
	// With no downward live-type load (none, or wind suction only) the
	// dead load acts alone.
	if !down && pNone[LoadD] {
		if e.m.TotalLimit > 0 {
			set(nil, totalD, pats[0])
			eval("", totalD, pats[0], e.m.TotalLimit, &totW)
		}
		set(nil, e.kcr, pats[0])
		eval("", e.kcr, pats[0], longLimit, &longW)
	}
	var out []CheckResult
	if liveW.ratio >= 0 {
		out = append(out, e.deflResult(KindDeflectionLive, liveW))
	}
	if totW.ratio >= 0 {
		out = append(out, e.deflResult(KindDeflectionTotal, totW))
	}
	info := ""
	if longW.ratio >= 0 {
		if reportLong {
			info = fmt.Sprintf("long-term deflection (NDS 2018 3.5.2, Kcr = %s) %.3f in under %s, %s: span/%.0f; reported, not checked (no long_term_deflection_limit)",
				num(e.kcr), longW.deflIn, e.deflName(longW), e.segLabel(longW.seg), longW.spanIn/math.Max(longW.deflIn, 1e-9))
		} else {
			out = append(out, e.deflResult(KindDeflectionLongTerm, longW))
		}
	}
	return out, info
}

// deflName names a service case: "L", "0.5D+Lr (live-type loads on span
// 1)", "1.5D+L".
func (e *engine) deflName(d deflWorst) string {
	name := d.live
	if d.dFactor > 0 {
		dn := "D"
		if d.dFactor != 1 {
			dn = num(d.dFactor) + "D"
		}
		if name == "" {
			name = dn
		} else {
			name = dn + "+" + name
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
	switch kind {
	case KindDeflectionTotal:
		slot = 1
	case KindDeflectionLongTerm:
		slot = 2
	}
	e.rc.defl[slot] = deflRec{deflIn: d.deflIn, allowIn: d.allowIn, spanIn: d.spanIn, limit: d.limit, ratio: d.ratio,
		cant: d.cant, kind: kind, dFactor: d.dFactor, where: where, up: d.up}
	return CheckResult{Kind: kind, Combo: e.deflName(d) + ", " + where, Actual: d.deflIn, Allowable: d.allowIn, Unit: "in", Ratio: d.ratio, calc: e.rc}
}
