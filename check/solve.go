package check

import (
	"fmt"
	"math"
	"sync"
)

// CheckMember checks m under s, adding blocking rows where the bottom
// edge needs them. With no rows drawn inside its spans, when bottom-edge
// bending fails with the bracing present (bearings, ceiling switch), it
// tries n = 1, 2, 3, ... rows evenly spaced in every span (the same n in
// each) until that check passes or the row spacing would fall below 24
// in. With rows drawn (m.BlockingAtIn), it keeps them and adds rows one at
// a time where the edge still fails (see solveFrom). Then the member
// passes or fails on every check with those rows; Result.BlockingAtIn
// holds only the rows to add. Bad input gives Status "error" with a
// message, never a panic.
func CheckMember(m Member, s Settings) Result {
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		return errorResult(m, e, err)
	}
	if e.drawnInSpans() {
		return e.solveFrom(nil)
	}
	n, steps, bot := e.solveBlocking()
	r := e.result(n, bot)
	r.BlockingSteps = steps
	return r
}

// CheckWithRows checks m under s with rowsPerSpan blocking rows added in
// every span (evenly spaced, on top of m.BlockingAtIn): the rows its run
// gets.
func CheckWithRows(m Member, s Settings, rowsPerSpan int) Result {
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		return errorResult(m, e, err)
	}
	if rowsPerSpan < 0 {
		return errorResult(m, e, fmt.Errorf("rows per span %d: want >= 0", rowsPerSpan))
	}
	return e.result(rowsPerSpan, nil)
}

// CheckWithRowsAt checks m under s with blocking rows added at atIn
// (positions along the member from its start, on top of the drawn rows
// m.BlockingAtIn): the rows its run gets when rows are drawn. A row within
// d (the member's dressed depth) of a drawn row is that drawn row and is
// not added; rows outside the member brace nothing and are left out.
func CheckWithRowsAt(m Member, s Settings, atIn []float64) Result {
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		return errorResult(m, e, err)
	}
	rows, err := e.keepRows(atIn)
	if err != nil {
		return errorResult(m, e, err)
	}
	return e.resultAt(rows, nil, rowsGiven)
}

// CheckMemberFrom checks m under s starting from the drawn rows and rows
// already added at atIn (its run's rows, kept as CheckWithRowsAt keeps
// them), adding more, as CheckMember does from drawn rows, where the
// bottom edge still fails. Result.BlockingAtIn holds the rows of atIn kept
// and those added.
func CheckMemberFrom(m Member, s Settings, atIn []float64) Result {
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		return errorResult(m, e, err)
	}
	rows, err := e.keepRows(atIn)
	if err != nil {
		return errorResult(m, e, err)
	}
	return e.solveFrom(rows)
}

// bottomEdge evaluates bottom-edge bending with n added rows per span.
func (e *engine) bottomEdge(n int) (edgeEval, float64) {
	rows, luRows := e.spanRows(n)
	ev, _ := e.bottomEval(rows)
	return ev, luRows
}

// solveBlocking returns the rows per span the bottom edge needs, the
// solver's steps (nil when no rows were needed) and the bottom edge's
// evaluation with those rows (nil when not evaluated).
func (e *engine) solveBlocking() (int, []BlockingStep, *edgeEval) {
	if e.m.BottomBracedContinuous {
		return 0, nil, nil
	}
	ev0, _ := e.bottomEdge(0)
	if ev0.passes() {
		return 0, nil, &ev0
	}
	ev := ev0
	steps := []BlockingStep{{RowsPerSpan: 0, LuIn: ev.iv.luIn, CL: ev.cl, Ratio: ev.ratio}}
	// Rows cannot help when the edge fails even fully braced.
	if ev.mLbIn/e.sec.SIn3 > e.cases[ev.ci].cd*e.fbNegNoCD*e.cv*(1+ratioTol) {
		return 0, steps, &ev0
	}
	maxSpan := 0.0
	for _, k := range e.spanSegs {
		maxSpan = math.Max(maxSpan, (e.segs[k].ToIn-e.segs[k].FromIn)/e.cosT)
	}
	for n := 1; maxSpan/float64(n+1) >= minBlockingLuIn; n++ {
		ev, _ = e.bottomEdge(n)
		steps = append(steps, BlockingStep{RowsPerSpan: n, LuIn: ev.iv.luIn, CL: ev.cl, Ratio: ev.ratio})
		if ev.passes() {
			return n, steps, &ev
		}
	}
	return 0, steps, &ev0
}

// result runs every check with n added rows per span; bot, when not nil,
// is the bottom edge already evaluated with those rows.
func (e *engine) result(n int, bot *edgeEval) Result {
	rows, _ := e.spanRows(n)
	return e.resultAt(rows, bot, rowsEven)
}

// resultAt runs every check with blocking rows added at rows (member
// positions, sorted; on top of the drawn rows); bot, when not nil, is the
// bottom edge already evaluated with those rows. how says how the rows
// were placed, for the trace.
func (e *engine) resultAt(rows []float64, bot *edgeEval, how rowsHow) Result {
	r := e.baseResult()
	r.Checks = make([]CheckResult, 0, 6)
	if len(rows) > 0 {
		r.BlockingAtIn = append([]float64(nil), rows...)
		r.BlockingRowsPerSpan = e.rowsPerSpan(rows)
	}
	r.DrawnBlockingAtIn = e.drawnInModel()
	pts := e.braces(rows)
	nTop := len(pts)
	top := e.evalEdge(true, e.topIntervals(pts))
	var ips []float64
	if bot == nil || e.inflectionRule() {
		b, g := e.bottomEval(rows)
		bot, ips = &b, g
	}
	e.rc = e.newCalcRecord()
	defer func() { e.rc = nil }()
	e.rc.brace = e.braceRecord(&r, nTop, ips, how)
	if len(e.cases) == 0 || e.mMax == 0 {
		r.Info = append(r.Info, "no load on the member: nothing to check")
	}
	if top.found {
		r.Checks = append(r.Checks, e.bendingResult(KindBendingTop, top))
	}
	if bot.found {
		r.Checks = append(r.Checks, e.bendingResult(KindBendingBottom, *bot))
	} else if len(e.cases) > 0 {
		r.Info = append(r.Info, "bottom edge is not in compression under any combination")
	}
	if len(e.cases) > 0 {
		r.Checks = append(r.Checks, e.shearCheck())
	}
	defl, longInfo := e.deflectionChecks()
	r.Checks = append(r.Checks, defl...)
	if longInfo != "" {
		r.Info = append(r.Info, longInfo)
	}
	if len(e.cases) > 0 {
		b, reactions := e.bearingCheck()
		r.Checks = append(r.Checks, b)
		r.Reactions = reactions
	}
	r.RB = math.Max(top.maxRB, bot.maxRB)
	r.MaxRatio, r.Governing, r.Status, r.Messages = verdict(r.Checks, r.Messages)
	if r.RB > 50 {
		r.Status = StatusFail
		r.Messages = append(r.Messages, fmt.Sprintf("RB = %.1f > 50: not permitted (NDS 2018 3.3.3.7)", r.RB))
	}
	if !bot.passes() && !e.m.BottomBracedContinuous {
		r.Messages = append(r.Messages, "bottom edge fails with the rows tried; size up or brace the bottom edge")
	}
	r.Info = append(r.Info, e.lateralSupportRule())
	return r
}

// baseResult fills what is known before the checks.
func (e *engine) baseResult() Result {
	dv := e.dv
	r := Result{ID: e.m.ID, Size: e.sec.Name, Species: dv.Species, Grade: dv.Grade, Values: &dv}
	for _, k := range e.spanSegs {
		r.SpansIn = append(r.SpansIn, e.segs[k].ToIn-e.segs[k].FromIn)
	}
	r.OverhangsIn = [2]float64{e.m.OverhangStartIn, e.m.OverhangEndIn}
	r.Factors = e.factorTrace()
	if e.dv.Note != "" {
		r.Info = append(r.Info, e.dv.Note)
	}
	if e.s.Incised {
		switch e.dv.SizeFactor {
		case SizeFactorGlulam:
			r.Info = append(r.Info, "design.incised = true does not apply to glulam: no incising factor Ci (NDS 2018 Table 5.3.1)")
		case SizeFactorSCL:
			r.Info = append(r.Info, "design.incised = true does not apply to structural composite lumber: no incising factor Ci (NDS 2018 Table 8.3.1)")
		}
	}
	return r
}

// factorTrace lists the adjustment factors used. Members of one size,
// grade and load set share the list, so it is built once and handed out
// again (see factorCache); callers must not modify it.
func (e *engine) factorTrace() []TraceItem {
	key := factorKey{cm: e.cm, ct: e.ct, cf: e.cf, ci: e.ci, cr: e.cr,
		sec: e.sec.Name, rule: e.dv.SizeFactor, temp: tempName(e.s.Temperature), pitch: e.m.PitchRise12, scln: e.dv.SCLExponent, cv: e.cv}
	if items, ok := factorCache.lookup(key, e.comboCDs); ok {
		return items
	}
	items := e.buildFactorTrace()
	factorCache.store(key, e.comboCDs, items)
	return items
}

// buildFactorTrace writes the factor list out; its items own their memory
// (not the engine's arena), since the list is shared between results.
func (e *engine) buildFactorTrace() []TraceItem {
	t := tracer{items: make([]TraceItem, 0, 12+len(e.comboCDs))}
	for _, c := range e.comboCDs {
		t.add("CD", c.cd, "", c.name, Subst{}, "NDS 2018 2.3.2, Table 2.3.2: shortest-duration load of the combination")
	}
	if e.dv.SizeFactor == SizeFactorSCL {
		e.sclFactorTrace(&t)
		return t.items
	}
	if e.dv.SizeFactor == SizeFactorGlulam {
		e.glulamFactorTrace(&t)
		return t.items
	}
	t.add("CM(Fb)", e.cm.Fb, "", "wet service", Subst{}, "NDS 2018 Supplement Table 4A/4B")
	t.add("CM(Fv)", e.cm.Fv, "", "wet service", Subst{}, "NDS 2018 Supplement Table 4A/4B")
	t.add("CM(Fc_perp)", e.cm.FcPerp, "", "wet service", Subst{}, "NDS 2018 Supplement Table 4A/4B")
	t.add("CM(E)", e.cm.E, "", "wet service", Subst{}, "NDS 2018 Supplement Table 4A/4B")
	t.add("Ct(Fb, Fv, Fc_perp)", e.ct.Fb, "", "temperature", lit(tempName(e.s.Temperature)), "NDS 2018 Table 2.3.3")
	t.add("Ct(E)", e.ct.E, "", "temperature", lit(tempName(e.s.Temperature)), "NDS 2018 Table 2.3.3")
	t.add("CF(Fb)", e.cf.Fb, "", "size factor", lit(e.sec.Name), sizeFactorRef(e.dv.SizeFactor))
	t.add("Cfu", 1, "", "bending about the strong axis", Subst{}, "NDS 2018 4.3.7")
	t.add("Ci(Fb, Fv)", e.ci.Fb, "", "incising", Subst{}, "NDS 2018 Table 4.3.8")
	t.add("Ci(E)", e.ci.E, "", "incising", Subst{}, "NDS 2018 Table 4.3.8")
	t.add("Cr", e.cr, "", "repetitive member", Subst{}, "NDS 2018 4.3.9")
	if e.cosT < 1 {
		t.add("cos(slope)", e.cosT, "", "rafter at "+fmtG(e.m.PitchRise12)+" in 12, drawn in plan: spans, dead, live and snow "+
			"loads on the horizontal projection; wind normal to the roof x 1/cos^2; unbraced lengths and deflection "+
			"limits on the sloped length (plan / cos); deflection perpendicular to the rafter (plan / cos^2)",
			t.f("12 / sqrt(144 + %s^2)", e.m.PitchRise12), "statics")
	}
	return t.items
}

// glulamFactorTrace lists the adjustment factors of a glulam member after
// its CD (NDS 2018 Table 5.3.1, from memory: verify): dry service only
// (glulam in wet service is refused), Ct, Cfu; no size factor CF, incising
// factor Ci or repetitive member factor Cr; its volume factor CV depends on
// the span and is in each bending calculation.
func (e *engine) glulamFactorTrace(t *tracer) {
	t.add("CM", 1, "", "dry service: the wet-service factors of NDS 2018 Supplement Table 5A are not applied (glulam in wet service is refused)",
		Subst{}, glulamAdjRef)
	t.add("Ct(Fb, Fv, Fc_perp)", e.ct.Fb, "", "temperature", lit(tempName(e.s.Temperature)), "NDS 2018 Table 2.3.3")
	t.add("Ct(E)", e.ct.E, "", "temperature", lit(tempName(e.s.Temperature)), "NDS 2018 Table 2.3.3")
	t.add("Cfu", 1, "", "bending about the strong axis (x-x)", Subst{}, glulamAdjRef)
	t.add("CV", e.cv, "", "volume factor instead of a size factor; the smaller of CL and CV applies (see each bending calculation); "+
		"CF, Ci and Cr do not apply to glulam", Subst{}, "NDS 2018 5.3.6, "+glulamAdjRef)
}

// verdict returns the largest ratio of checks and its kind, and pass or
// fail with a message added to msgs for each ratio over 1.000.
func verdict(checks []CheckResult, msgs []string) (maxRatio float64, governing, status string, out []string) {
	status, out = StatusPass, msgs
	for _, c := range checks {
		if c.Ratio > maxRatio || governing == "" {
			maxRatio, governing = c.Ratio, c.Kind
		}
		if c.Ratio > 1+ratioTol {
			status = StatusFail
			out = append(out, fmt.Sprintf("%s: ratio %.3f > 1.000 (%s)", c.Kind, c.Ratio, c.Combo))
		}
	}
	return maxRatio, governing, status, out
}

func sizeFactorRef(rule string) string {
	switch rule {
	case SizeFactor4A:
		return "NDS 2018 Supplement Table 4A, size factors"
	case SizeFactor4B:
		return "NDS 2018 Supplement Table 4B, footnote on size factors"
	}
	return "user design values: CF = 1.0"
}

func tempName(s string) string {
	if s == "" {
		return "normal"
	}
	return s
}

// lateralSupportRule states what the NDS 2018 4.4.1.2 rule would ask for
// at the member's nominal depth-to-thickness ratio, reported after the
// calculated CL as "the alternative rule of 4.4.1.2 would ask for ...",
// never as a requirement (NDS 2018 4.4.1.1 lets it replace the
// calculation; framecheck calculates CL, issue 13 item 6). The d/b
// limits 2, 4, 5, 6, 7 and the kind of support each asks for (none; ends;
// compression edge; blocking or bridging; both edges) agree with
// getRequiredRestraint in xcfem/xc python_modules/materials/awc_nds/
// AWCNDS_materials.py (NDS 2018 4.4.1.2 (a) to (e)); the wording, and the
// 8 ft blocking interval, are paraphrased from memory: verify against NDS
// 2018 4.4.1.2.
func (e *engine) lateralSupportRule() string {
	k := [2]float64{e.sec.NominalDIn, e.sec.MemberNominalBIn()}
	if v, ok := lateralRules.Load(k); ok {
		return v.(string)
	}
	v := lateralSupportRule(e.sec.NominalDIn / e.sec.MemberNominalBIn())
	lateralRules.Store(k, v)
	return v
}

// lateralRules caches lateralSupportRule by nominal depth and thickness.
var lateralRules sync.Map

func lateralSupportRule(r float64) string {
	var rule string
	switch {
	case r <= 2:
		rule = "no lateral support"
	case r <= 4:
		rule = "the ends held in position (full-depth blocking, bridging, hangers, nailing or bolting)"
	case r <= 5:
		rule = "the ends held in position and the compression edge held in line for its entire length"
	case r <= 6:
		rule = "bridging, full-depth blocking or diagonal cross bracing at intervals of at most 8 ft, the compression edge held in line and the ends held in position"
	case r <= 7:
		rule = "both edges held in line for their entire length and the ends held in position"
	default:
		return fmt.Sprintf("CL above is calculated per NDS 2018 3.3.3; the alternative rule of NDS 2018 4.4.1.2 does not cover nominal d/b = %s (over 7)", num(r))
	}
	return fmt.Sprintf("CL above is calculated per NDS 2018 3.3.3 with the bracing stated; the alternative rule of NDS 2018 4.4.1.2 (nominal d/b = %s) would ask for %s: for comparison only, not a requirement here", num(r), rule)
}

// errorResult is the Result of a member that could not be checked, with
// what was found before the error.
func errorResult(m Member, e *engine, err error) Result {
	r := Result{ID: m.ID, Size: m.Size, Species: m.Species, Grade: m.Grade, Status: StatusError}
	if e != nil && e.sec.Name != "" {
		r.Size = e.sec.Name
	}
	if e != nil && e.dv.Species != "" {
		dv := e.dv
		r.Species, r.Grade, r.Values = dv.Species, dv.Grade, &dv
	}
	// Only finite numbers: results go to JSON.
	for i := 1; i < len(m.Bearings); i++ {
		if sp := m.Bearings[i].AtIn - m.Bearings[i-1].AtIn; finite(sp) {
			r.SpansIn = append(r.SpansIn, sp)
		} else {
			r.SpansIn = append(r.SpansIn, 0)
		}
	}
	for i, o := range []float64{m.OverhangStartIn, m.OverhangEndIn} {
		if finite(o) {
			r.OverhangsIn[i] = o
		}
	}
	id := m.ID
	if id == "" {
		id = "member"
	}
	r.Messages = []string{id + ": " + err.Error()}
	return r
}
