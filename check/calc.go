package check

import (
	"math"
	"strconv"
	"strings"
)

// A check records the numbers of its governing case (calcRecord) while it
// runs and writes its trace only when asked (CheckResult.Trace): members
// are checked far more often than their traces are read (the blocking
// solver and the sizing loop evaluate many trials, and identical members
// share one written trace), so a check costs no trace building.

// calcCtx holds what every trace of one result reads: the section, the
// reference design values and the adjustment factors, copied from the
// engine so a Result shares no memory with it.
type calcCtx struct {
	bIn, dIn, sIn3, aIn2       float64
	fbPsi, fvPsi, fcPerpPsi    float64
	ePsi, eminPsi              float64
	cm                         WetServiceFactors
	ct                         TemperatureFactors
	cf                         SizeFactors
	ci                         IncisingFactors
	cr, eAdj, eminAdj, kcr, x0 float64
	shearAtD                   bool
	seasonedHalfD              bool
	cosT, pitch                float64 // slope of a rafter: cosine, rise in 12
	// sclN and sclCV: structural composite lumber's size factor (12/d)^n
	// and its value (NDS 2018 8.3.6); sclCV 0 for other materials.
	sclN, sclCV float64
	// glulam: structural glued laminated timber (NDS 2018 Table 5.3.1:
	// no CF, Ci or Cr; CV instead), its volume factor's exponent 1/x and
	// the span CV was found for, ft
	glulam        bool
	cvX, cvSpanFt float64
}

// bendRec is an edge's governing bending case.
type bendRec struct {
	mLbIn, cd, fbStar, cl float64
	iv                    interval
	fbRefPsi              float64 // the reference Fb used (glulam's Fbx- for the bottom edge)
	cv                    float64 // glulam's volume factor; 1 for sawn lumber
}

// shearRec is the governing shear case.
type shearRec struct {
	vLb, cd, fvAdjPsi float64
	bearing           int
	atD               uint8 // atDOff, atDApplied, atDUplift or atDHanger
}

// bearRec is the governing bearing case.
type bearRec struct {
	rLb, lbIn, cb, fcAdjPsi float64
	bearing                 int
	// support: the supporting plate or beam governs (its Fc_perp is lower)
	support                 bool
	supportName             string  // its species and grade
	fcPerpPsi, fcPerpSupPsi float64 // reference Fc_perp of the member and of the support
	// hanger: the member rests on a hanger's seat on a beam of known
	// material (Bearing.Beam). beam holds the beam's values when its
	// Fc_perp' was checked; memCb and memAdjPsi are then the member's own
	// Cb and Fc_perp'.
	hanger           bool
	beam             *beamBear
	memCb, memAdjPsi float64
}

// beamBear is the Fc_perp' of the beam under the governing bearing.
type beamBear struct {
	v                 BeamFcPerp
	cb, adjPsi, endIn float64
	governs           bool // the beam's Fc_perp' is the smaller
}

// deflRec is a governing deflection case.
type deflRec struct {
	deflIn, allowIn, spanIn, limit, ratio float64
	cant                                  bool
	kind                                  string
	dFactor                               float64 // factor on D in the governing case
	where                                 string
	up                                    bool // the deflection is upward (its size is checked)
}

// calcRecord holds the governing numbers of every check of one result, in
// one allocation. It is written once, while the result is built, and only
// read afterwards.
type calcRecord struct {
	ctx   calcCtx
	bend  [2]bendRec // top, bottom
	shear shearRec
	defl  [3]deflRec // live, total, long-term
	bear  bearRec
	col   colRec // posts
	brace braceRec
}

// newCalcRecord starts the record of the result e is building.
func (e *engine) newCalcRecord() *calcRecord {
	return &calcRecord{ctx: calcCtx{
		bIn: e.sec.BIn, dIn: e.sec.DIn, sIn3: e.sec.SIn3, aIn2: e.sec.AreaIn2,
		fbPsi: e.dv.FbPsi, fvPsi: e.dv.FvPsi, fcPerpPsi: e.dv.FcPerpPsi, ePsi: e.dv.EPsi, eminPsi: e.dv.EminPsi,
		cm: e.cm, ct: e.ct, cf: e.cf, ci: e.ci, cr: e.cr, eAdj: e.eAdj, eminAdj: e.eminAdj, kcr: e.kcr, x0: e.x0,
		shearAtD: e.s.ShearAtD, seasonedHalfD: e.s.Seasoned && !e.s.WetService, cosT: e.cosT, pitch: e.m.PitchRise12,
		sclN: e.dv.SCLExponent, sclCV: e.sclCV,
		glulam: e.dv.SizeFactor == SizeFactorGlulam, cvX: e.dv.VolumeFactorX, cvSpanFt: e.cvSpanFt,
	}}
}

// Trace returns every intermediate value of the check, in the order a
// report prints the calculation: factors, demand, capacity, ratio. Each
// call builds a new slice, which the caller owns.
func (c CheckResult) Trace() []TraceItem {
	if c.calc == nil {
		return nil
	}
	r := c.calc
	switch c.Kind {
	case KindBendingTop:
		return r.bendingTrace(&r.bend[0], true)
	case KindBendingBottom:
		return r.bendingTrace(&r.bend[1], false)
	case KindShear:
		return r.shearTrace()
	case KindDeflectionLive:
		return r.deflTrace(&r.defl[0])
	case KindDeflectionTotal:
		return r.deflTrace(&r.defl[1])
	case KindDeflectionLongTerm:
		return r.deflTrace(&r.defl[2])
	case KindCompression, KindBearingParallel:
		return r.columnTrace(c.Kind)
	case KindBearing:
		return r.bearingTrace()
	}
	return nil
}

// newTracer returns a tracer with room for n items and their numbers.
func newTracer(n int) tracer {
	var a traceArena
	a.reserve(n, 4*n)
	return a.tracer(n)
}

// adjRef is the table of adjustment factors the member's values follow:
// NDS 2018 Table 8.3.1 for structural composite lumber (its Ci is 1),
// Table 5.3.1 for glulam, Table 4.3.1 otherwise.
func (x *calcCtx) adjRef() string {
	switch {
	case x.sclCV > 0:
		return "NDS 2018 Table 8.3.1 (from memory: verify)"
	case x.glulam:
		return glulamAdjRef
	}
	return "NDS 2018 Table 4.3.1"
}

// glulamAdjRef is the table of glulam's adjustment factors.
const glulamAdjRef = "NDS 2018 Table 5.3.1 (from memory: verify)"

// cmCtCi writes a value times its CM, Ct and, but for glulam, Ci (the
// incising factor is sawn lumber's: NDS 2018 Table 4.3.1 has it, Table
// 5.3.1 not): the formula "<name> CM Ct[ Ci]<extra>" and its numbers.
func (x *calcCtx) cmCtCi(t *tracer, name string, ref, cm, ct, ci float64, extra string, more ...float64) (string, Subst) {
	if x.glulam {
		args := append([]float64{ref, cm, ct}, more...)
		return name + " CM Ct" + extra, t.f(substPattern(len(args)), args...)
	}
	args := append([]float64{ref, cm, ct, ci}, more...)
	return name + " CM Ct Ci" + extra, t.f(substPattern(len(args)), args...)
}

// substPattern is "%s(%s)...(%s)" for n numbers.
func substPattern(n int) string {
	return "%s" + strings.Repeat("(%s)", n-1)
}

// sclCVRef is the source of structural composite lumber's CV.
const sclCVRef = "NDS 2018 8.3.6 (from memory: verify): the manufacturer's volume factor, exponent from the user's materials file"

// bendingTrace writes an edge's bending calculation (NDS 2018 3.3), top
// or bottom, with the bracing it relied on.
func (r *calcRecord) bendingTrace(b *bendRec, top bool) []TraceItem {
	x := &r.ctx
	fb := b.mLbIn / x.sIn3
	cv := b.cv
	if cv == 0 {
		cv = 1
	}
	fbAdj := b.fbStar * math.Min(b.cl, cv)
	fbRef := b.fbRefPsi
	if fbRef == 0 {
		fbRef = x.fbPsi
	}
	t := newTracer(bendingTraceLen(b.iv))
	t.add("M", b.mLbIn, "lb-in", "largest moment compressing this edge, governing case", Subst{}, refAnalysis)
	t.add("S", x.sIn3, "in^3", "b d^2 / 6", t.f("%s(%s)^2 / 6", x.bIn, x.dIn), "NDS 2018 Supplement Table 1B")
	t.add("fb", fb, "psi", "M / S", t.f("%s / %s", b.mLbIn, x.sIn3), "NDS 2018 3.3.2")
	switch {
	case x.sclCV > 1:
		t.add("CV", x.sclCV, "", "(12/d)^n, the manufacturer's size factor; above 1.0 it applies with CL, in Fb*",
			t.f("(12 / %s)^%s", x.dIn, x.sclN), sclCVRef)
		t.add("Fb*", b.fbStar, "psi", "Fb CD CM Ct CV", t.f("%s(%s)(%s)(%s)(%s)", fbRef, b.cd, x.cm.Fb, x.ct.Fb, x.sclCV),
			"NDS 2018 3.3.3.8, Table 8.3.1 (from memory: verify)")
	case x.sclCV > 0:
		t.add("Fb*", b.fbStar, "psi", "Fb CD CM Ct", t.f("%s(%s)(%s)(%s)", fbRef, b.cd, x.cm.Fb, x.ct.Fb),
			"NDS 2018 3.3.3.8, Table 8.3.1 (from memory: verify)")
	case x.glulam:
		t.add("Fb*", b.fbStar, "psi", "Fb CD CM Ct", t.f("%s(%s)(%s)(%s)", fbRef, b.cd, x.cm.Fb, x.ct.Fb),
			"NDS 2018 3.3.3.8, Table 5.3.1 (from memory: verify)")
	default:
		t.add("Fb*", b.fbStar, "psi", "Fb CD CM Ct CF Ci Cr",
			t.f("%s(%s)(%s)(%s)(%s)(%s)(%s)", fbRef, b.cd, x.cm.Fb, x.ct.Fb, x.cf.Fb, x.ci.Fb, x.cr), "NDS 2018 3.3.3.8, Table 4.3.1")
	}
	if iv := b.iv; iv.braced {
		t.add("CL", 1, "", r.brace.heldText(top), Subst{}, "NDS 2018 3.3.3.3")
	} else {
		n := int(r.brace.nPts)
		if !top {
			n += len(r.brace.ips)
		}
		t.add("bracing points", float64(n), "", r.brace.pointsText(top), Subst{}, "NDS 2018 3.3.3.4: lu between points of lateral support")
		if x.cosT < 1 {
			t.add("lu", iv.luIn, "in", "distance between bracing points along the rafter, plan distance / cos(slope)",
				t.f("(%s - %s) / %s", iv.b+x.x0, iv.a+x.x0, x.cosT), "NDS 2018 3.3.3.4")
		} else {
			t.add("lu", iv.luIn, "in", "distance between bracing points", t.f("%s - %s", iv.b+x.x0, iv.a+x.x0), "NDS 2018 3.3.3.4")
		}
		t.add("lu/d", iv.luIn/x.dIn, "", "lu / d", t.f("%s / %s", iv.luIn, x.dIn), "NDS 2018 Table 3.3.3")
		f := leFormulas[iv.leFormula]
		t.add("le", iv.leIn, "in", f, leSubst(&t, f, iv.luIn, x.dIn), leRefs[iv.kind])
		t.add("RB", iv.rb, "", "sqrt(le d / b^2)", t.f("sqrt(%s(%s) / %s^2)", iv.leIn, x.dIn, x.bIn), "NDS 2018 Eq. 3.3-5")
		f, sub := x.cmCtCi(&t, "Emin", x.eminPsi, x.cm.E, x.ct.E, x.ci.E, "")
		t.add("Emin'", x.eminAdj, "psi", f, sub, x.adjRef())
		t.add("FbE", iv.fbEPsi, "psi", "1.20 Emin' / RB^2", t.f("1.20(%s) / %s^2", x.eminAdj, iv.rb), "NDS 2018 3.3.3.8")
		a := iv.fbEPsi / b.fbStar
		t.add("CL", b.cl, "", "(1 + FbE/Fb*)/1.9 - sqrt(((1 + FbE/Fb*)/1.9)^2 - (FbE/Fb*)/0.95)",
			t.f("(1 + %s)/1.9 - sqrt(((1 + %s)/1.9)^2 - %s/0.95)", a, a, a), "NDS 2018 Eq. 3.3-6")
	}
	switch {
	case x.sclCV > 0 && x.sclCV <= 1:
		t.add("CV", cv, "", "(12/d)^n, the manufacturer's size factor; at most 1.0 it is not combined with CL: the smaller applies",
			t.f("(12 / %s)^%s", x.dIn, x.sclN), sclCVRef)
		t.add("Fb'", fbAdj, "psi", "Fb* min(CL, CV)", t.f("%s(%s)", b.fbStar, math.Min(b.cl, cv)), "NDS 2018 8.3.6, Table 8.3.1 (from memory: verify)")
	case x.sclCV > 1:
		t.add("Fb'", fbAdj, "psi", "Fb* CL", t.f("%s(%s)", b.fbStar, b.cl), "NDS 2018 8.3.6, Table 8.3.1 (from memory: verify)")
	case x.glulam || cv < 1:
		// glulam: CV is shown even where it comes out at its cap of 1.0,
		// so that a reader sees it was weighed against CL
		how := "the smaller of CL and CV applies"
		if cv >= 1 {
			how = "capped at 1.0; " + how
		}
		xs := fmtG(x.cvX)
		sub := Subst{}
		if x.cvSpanFt > 0 && x.cvX > 0 {
			sub = t.f("(21/%s)^(1/%s) (12/%s)^(1/%s) (5.125/%s)^(1/%s)", x.cvSpanFt, x.cvX, x.dIn, x.cvX, x.bIn, x.cvX)
		}
		t.add("CV", cv, "", "(21/L)^(1/"+xs+") (12/d)^(1/"+xs+") (5.125/b)^(1/"+xs+") <= 1.0, L the longest span in ft; "+how,
			sub, "NDS 2018 5.3.6, Eq. 5.3-1")
		t.add("Fb'", fbAdj, "psi", "Fb* min(CL, CV)", t.f("%s(%s)", b.fbStar, math.Min(b.cl, cv)), glulamAdjRef)
	default:
		t.add("Fb'", fbAdj, "psi", "Fb* CL Cfu", t.f("%s(%s)(1.0)", b.fbStar, b.cl), "NDS 2018 Table 4.3.1")
	}
	t.add("fb/Fb'", fb/fbAdj, "", "fb / Fb'", t.f("%s / %s", fb, fbAdj), "NDS 2018 3.3.1")
	return t.items
}

// shearTrace writes the shear calculation (NDS 2018 3.4).
func (r *calcRecord) shearTrace() []TraceItem {
	x, s := &r.ctx, &r.shear
	fv := 1.5 * s.vLb / x.aIn2
	bn := strconv.Itoa(s.bearing + 1)
	where := "at the centre-line of bearing " + bn
	note := ""
	switch s.atD {
	case atDApplied:
		where = "at d from the face of bearing " + bn
		note = "loads within d of the bearing face left out: the member rests on the support and the load acts on the opposite face"
		if x.cosT < 1 {
			note += " (d along the rafter: d cos on the plan)"
		}
	case atDUplift:
		note = "shear_at_d not applied at bearing " + bn + ": net uplift there, the member is held down by connectors, so the load does not act on the face opposite the bearing"
	case atDHanger:
		note = "shear_at_d not applied at bearing " + bn + ": the member hangs from the support's face (hanger or ledger), not resting on it"
	}
	t := newTracer(5)
	ref := refAnalysis
	if note != "" {
		where += "; " + note
		ref += "; NDS 2018 3.4.3.1(a)"
	}
	t.add("V", s.vLb, "lb", "largest shear "+where, Subst{}, ref)
	t.add("A", x.aIn2, "in^2", "b d", t.f("%s(%s)", x.bIn, x.dIn), "NDS 2018 Supplement Table 1B")
	t.add("fv", fv, "psi", "1.5 V / A", t.f("1.5(%s) / %s", s.vLb, x.aIn2), "NDS 2018 Eq. 3.4-2")
	if x.glulam {
		// Cvr = 1: a prismatic member, neither notched nor under impact or
		// cyclic load (NDS 2018 5.3.10, from memory: verify)
		t.add("Fv'", s.fvAdjPsi, "psi", "Fv CD CM Ct Cvr, Cvr = 1 (prismatic member)",
			t.f("%s(%s)(%s)(%s)(1)", x.fvPsi, s.cd, x.cm.Fv, x.ct.Fv), x.adjRef())
	} else {
		t.add("Fv'", s.fvAdjPsi, "psi", "Fv CD CM Ct Ci", t.f("%s(%s)(%s)(%s)(%s)", x.fvPsi, s.cd, x.cm.Fv, x.ct.Fv, x.ci.Fv), x.adjRef())
	}
	t.add("fv/Fv'", fv/s.fvAdjPsi, "", "fv / Fv'", t.f("%s / %s", fv, s.fvAdjPsi), "NDS 2018 3.4.1")
	return t.items
}

// bearingTrace writes the bearing calculation (NDS 2018 3.10).
func (r *calcRecord) bearingTrace() []TraceItem {
	x, b := &r.ctx, &r.bear
	fc := b.rLb / (x.bIn * b.lbIn)
	t := newTracer(9)
	t.add("R", b.rLb, "lb", "largest reaction, at bearing "+strconv.Itoa(b.bearing+1), Subst{}, refAnalysis)
	if b.hanger {
		t.add("lb", b.lbIn, "in", "bearing length on the seat of the hanger at bearing "+strconv.Itoa(b.bearing+1)+
			": the member rests on the hanger, so its bearing is checked with its own Fc_perp; the hanger's bearing on the beam "+
			"is the connector's (its demand is with the load path's connections)", Subst{}, "common practice, no source")
	} else {
		t.add("lb", b.lbIn, "in", "bearing length", Subst{}, "")
	}
	t.add("fc_perp", fc, "psi", "R / (b lb)", t.f("%s / (%s(%s))", b.rLb, x.bIn, b.lbIn), "NDS 2018 3.10.2")
	if b.beam != nil && !b.support {
		return r.beamBearingTrace(t, fc)
	}
	if b.support {
		t.add("Fc_perp", b.fcPerpSupPsi, "psi", "the support ("+b.supportName+") governs: its Fc_perp is below the member's "+
			fmtG(b.fcPerpPsi)+" psi; Cb = 1 (its bearing length is the member's width)", Subst{}, "NDS 2018 3.10.2")
		t.add("Fc_perp'", b.fcAdjPsi, "psi", "Fc_perp CM Ct Ci",
			t.f("%s(%s)(%s)(%s)", b.fcPerpSupPsi, x.cm.FcPerp, x.ct.FcPerp, x.ci.FcPerp), "NDS 2018 Table 4.3.1")
	} else {
		cbTrace(&t, b.cb, b.lbIn)
		f, sub := x.cmCtCi(&t, "Fc_perp", x.fcPerpPsi, x.cm.FcPerp, x.ct.FcPerp, x.ci.FcPerp, " Cb", b.cb)
		t.add("Fc_perp'", b.fcAdjPsi, "psi", f, sub, x.adjRef())
	}
	t.add("fc_perp/Fc_perp'", fc/b.fcAdjPsi, "", "fc_perp / Fc_perp'", t.f("%s / %s", fc, b.fcAdjPsi), "NDS 2018 3.10.2")
	return t.items
}

// cbTrace adds the bearing area factor Cb of a bearing lbIn long (NDS
// 2018 3.10.4).
func cbTrace(t *tracer, cb, lbIn float64) {
	if cb != 1 {
		t.add("Cb", cb, "", "(lb + 0.375) / lb", t.f("(%s + 0.375) / %s", lbIn, lbIn), "NDS 2018 3.10.4")
	} else {
		t.add("Cb", 1, "", "bearing at a member end, or lb >= 6 in", Subst{}, "NDS 2018 3.10.4")
	}
}

// beamBearingTrace ends the bearing calculation of a member resting on
// a beam of known material (SupportBeam): the member's own Fc_perp', the
// beam's, and the ratio to the smaller (NDS 2018 3.10.2, 3.10.4).
func (r *calcRecord) beamBearingTrace(t tracer, fc float64) []TraceItem {
	x, b, bb := &r.ctx, &r.bear, r.bear.beam
	cbTrace(&t, b.memCb, b.lbIn)
	f, own := x.cmCtCi(&t, "Fc_perp", x.fcPerpPsi, x.cm.FcPerp, x.ct.FcPerp, x.ci.FcPerp, " Cb: the member's own", b.memCb)
	t.add("Fc_perp'", b.memAdjPsi, "psi", f, own, x.adjRef())
	beam := "the beam under bearing " + strconv.Itoa(b.bearing+1)
	switch {
	case bb.endIn <= 0:
		t.add("Cb_beam", 1, "", "the member crosses "+beam+" askew: its length along the beam's grain is not b", Subst{}, "NDS 2018 3.10.4")
	case bb.cb != 1:
		t.add("Cb_beam", bb.cb, "", "(b + 0.375) / b: on "+beam+" the bearing length along its grain is the member's width b, "+
			"3 in or more from its end", t.f("(%s + 0.375) / %s", x.bIn, x.bIn), "NDS 2018 3.10.4")
	default:
		t.add("Cb_beam", 1, "", "the bearing is within 3 in of the end of "+beam, Subst{}, "NDS 2018 3.10.4")
	}
	who := "the member's governs"
	if bb.governs {
		who = "it governs"
	}
	desc := "Fc_perp CM Ct Ci Cb_beam of " + beam + " (" + bb.v.Name + "): " + who
	sub := t.f("%s(%s)(%s)(%s)(%s)", bb.v.FcPerpPsi, bb.v.CM, bb.v.Ct, bb.v.Ci, bb.cb)
	if bb.v.Ref != "NDS 2018 Table 4.3.1" {
		desc = "Fc_perp CM Ct Cb_beam of " + beam + " (" + bb.v.Name + "): " + who
		sub = t.f("%s(%s)(%s)(%s)", bb.v.FcPerpPsi, bb.v.CM, bb.v.Ct, bb.cb)
	}
	t.add("Fc_perp_beam'", bb.adjPsi, "psi", desc, sub, "NDS 2018 3.10.2; "+bb.v.Ref)
	if bb.governs {
		t.add("fc_perp/Fc_perp_beam'", fc/b.fcAdjPsi, "", "fc_perp / Fc_perp_beam', the smaller", t.f("%s / %s", fc, b.fcAdjPsi), "NDS 2018 3.10.2")
	} else {
		t.add("fc_perp/Fc_perp'", fc/b.fcAdjPsi, "", "fc_perp / Fc_perp', the smaller", t.f("%s / %s", fc, b.fcAdjPsi), "NDS 2018 3.10.2")
	}
	return t.items
}

func fmtG(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }

// deflTrace writes a deflection calculation (IBC 2018 Table 1604.3, NDS
// 2018 3.5.2).
func (r *calcRecord) deflTrace(d *deflRec) []TraceItem {
	x := &r.ctx
	t := newTracer(6)
	dir := ""
	if d.up {
		dir = ", upward (its size checked)"
	}
	switch d.kind {
	case KindDeflectionTotal:
		if d.dFactor == 0.5 {
			t.add("delta", d.deflIn, "in", "largest deflection of "+d.where+dir+" under L + 0.5D (seasoned lumber, dry service)", Subst{}, "IBC 2018 Table 1604.3 note d; "+refAnalysis)
		} else {
			t.add("delta", d.deflIn, "in", "largest deflection of "+d.where+dir+" under L + D", Subst{}, "IBC 2018 Table 1604.3; "+refAnalysis)
		}
	case KindDeflectionLongTerm:
		t.add("delta", d.deflIn, "in", "largest deflection of "+d.where+dir+": Kcr x dead-load deflection + live-type deflection", Subst{}, "NDS 2018 3.5.2; "+refAnalysis)
		t.add("Kcr", x.kcr, "", "creep factor on the long-term (dead) load", Subst{}, "NDS 2018 3.5.2")
	default:
		t.add("delta", d.deflIn, "in", "largest deflection of "+d.where+dir, Subst{}, refAnalysis)
	}
	f, sub := x.cmCtCi(&t, "E", x.ePsi, x.cm.E, x.ct.E, x.ci.E, "")
	t.add("E'", x.eAdj, "psi", f, sub, x.adjRef())
	if x.cosT < 1 {
		t.add("cos", x.cosT, "", "rafter at "+fmtG(x.pitch)+" in 12: cos = 12 / sqrt(12^2 + rise^2); delta is perpendicular to the rafter "+
			"(projection's / cos^2) and the span is the sloped length (plan span / cos)", t.f("12 / sqrt(144 + %s^2)", x.pitch), "statics")
	}
	ref := "IBC 2018 Table 1604.3"
	if d.kind == KindDeflectionLongTerm {
		ref = "NDS 2018 3.5.2; limit from the project file"
	}
	if d.cant {
		t.add("delta_allow", d.allowIn, "in", "2 Lc / limit", t.f("2(%s) / %s", d.spanIn, d.limit), ref+" note h")
	} else {
		t.add("delta_allow", d.allowIn, "in", "L / limit", t.f("%s / %s", d.spanIn, d.limit), ref)
	}
	t.add("ratio", d.ratio, "", "delta / delta_allow", t.f("%s / %s", d.deflIn, d.allowIn), "")
	return t.items
}
