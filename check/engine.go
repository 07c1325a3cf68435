package check

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"

	"framecheck/check/beam"
)

// engine holds everything known about one member once its inputs are
// validated: section, design values, factors, the analysis model and the
// solved strength load cases. The blocking solver re-runs only the
// bottom-edge bending check on it, since bracing does not change the
// analysis.
type engine struct {
	m   Member
	s   Settings
	sec Section
	dv  DesignValues

	cf  SizeFactors
	cm  WetServiceFactors
	ct  TemperatureFactors
	ci  IncisingFactors
	cr  float64
	kcr float64

	supFc []DesignValues // per bearing: the support's design values (FcPerpPsi 0: none given)
	// supBeam, per bearing: the Fc_perp values of the beam it rests on
	// (Bearing.Beam; FcPerpPsi 0: none, or a hanger); nil when no bearing
	// has one.
	supBeam []BeamFcPerp

	fbNoCD float64 // Fb CM Ct CF Ci Cr: Fb* / CD
	// fbNegNoCD is fbNoCD for the bottom edge in compression (negative
	// moment): glulam's Fbx-; fbNoCD otherwise.
	fbNegNoCD float64
	// cv is glulam's volume factor CV (NDS 2018 5.3.6), applied instead of
	// CL when smaller; 1 for sawn lumber. cvSpanFt is the span it was
	// found for (the longest, ft), for the report.
	cv       float64
	cvSpanFt float64
	// sclCV is CV = (12/d)^n of structural composite lumber (NDS 2018
	// 8.3.6), 0 for other materials; where it exceeds 1 it is in fbNoCD
	// and cv is 1, else cv is it (see SCLBending).
	sclCV   float64
	eAdj    float64 // E'
	eminAdj float64 // Emin'

	x0       float64 // member position of the analysis origin (start of the beam model)
	bm       beam.Beam
	segs     []beam.Segment
	spanSegs []int                 // index in segs of each span between bearings
	mps      []memberPiece         // the member's stretches and their line loads
	lps      []loadPiece           // the model's load pieces: one per segment unless general
	pls      []pointLd             // point loads
	general  bool                  // load pieces or point loads: solved with beam.SolveLoads
	cosT     float64               // cosine of the rafter slope (1 flat)
	pres     [3][numLoadTypes]bool // load types present: wind none, toward, away (index dir+1)
	svc      strengthCase          // the service case deflectionChecks reuses

	cases []strengthCase
	mMax  float64     // largest |M| of any case, for "is this edge in compression" tolerances
	rc    *calcRecord // numbers of the traces of the Result being built

	comboCDs []comboCD       // every non-trivial combination case and its CD, for the report
	names    []caseNameEntry // caseName cache, kept across pooled uses

	wAll    []float64  // backing store of the cases' segment loads
	ivBuf   []interval // reused by intervals
	sup     []float64  // backing store of bm.SupportsAtIn
	ptsBuf  []float64  // reused by braces
	rowsBuf []float64  // reused by spanRows
	patBuf  []uint32   // reused by patterns

	// the cuts of the beam model for its load pieces and point loads at
	// the places cutPts (solve; haveCuts false: none yet)
	cuts     []float64
	cutPts   []float64
	haveCuts bool
	partBuf  []beam.PartialLoad // reused by solve
}

// strengthCase is one combination case (one alternative, one wind
// direction, one live-load pattern) with its solved response.
type strengthCase struct {
	name    string
	cd      float64
	f       factorSet
	dir     float64          // wind +1 toward the member, -1 away, 0 none
	pattern uint32           // segments carrying the patterned live-type loads; all ones = not patterned
	w       []float64        // line load on each load piece, lb/in
	pts     []beam.PointLoad // point loads (general members)
	r       beam.Response

	mPos, mNeg float64 // largest positive and most negative moment on the whole member
}

var defaultCombos = DefaultCombos()

// enginePool recycles engines, whose solved load cases are the bulk of a
// check's memory. An engine goes back to the pool once its Result is
// built; a Result shares no memory with its engine.
var enginePool = sync.Pool{New: func() any { return new(engine) }}

// release returns e to the pool.
func (e *engine) release() {
	if e != nil {
		e.m, e.s = Member{}, Settings{}
		enginePool.Put(e)
	}
}

// newEngine validates m and s, looks up the material and builds the
// analysis. On error the returned engine holds what was found so far.
func newEngine(m Member, s Settings) (*engine, error) {
	e := enginePool.Get().(*engine)
	*e = engine{m: m, s: s, cases: e.cases[:0], spanSegs: e.spanSegs[:0], mps: e.mps[:0], lps: e.lps[:0], pls: e.pls[:0], wAll: e.wAll[:0], sup: e.sup[:0], ivBuf: e.ivBuf[:0], ptsBuf: e.ptsBuf[:0], rowsBuf: e.rowsBuf[:0], patBuf: e.patBuf[:0], comboCDs: e.comboCDs[:0], names: e.names, svc: strengthCase{w: e.svc.w[:0], pts: e.svc.pts[:0], r: e.svc.r},
		cuts: e.cuts[:0], cutPts: e.cutPts[:0], partBuf: e.partBuf[:0]}
	if err := s.validate(); err != nil {
		return e, err
	}
	sec, err := ParseSize(m.Size)
	if err != nil {
		return e, err
	}
	e.sec = sec
	mats := s.Materials
	if mats == nil {
		mats = BuiltinMaterials()
	}
	dv, err := mats.Lookup(m.Species, m.Grade, m.Size)
	if err != nil {
		return e, err
	}
	e.dv = dv
	if sec.Actual && (dv.SizeFactor == SizeFactor4A || dv.SizeFactor == SizeFactor4B) {
		return e, fmt.Errorf("size %s: sawn lumber of %s is sized by its nominal size (such as 2x10 or 4x12), not by actual inches", m.Size, dv.Species)
	}
	if dv.SizeFactor == SizeFactor4D && s.WetService {
		return e, fmt.Errorf("size %s: timbers in wet service: the wet-service factors of NDS 2018 Supplement Table 4D are not applied by framecheck; check this member by hand", m.Size)
	}
	if dv.SizeFactor == SizeFactorSCL && s.WetService {
		return e, fmt.Errorf("%s in wet service: structural composite lumber takes its wet-service factors from the "+
			"manufacturer (NDS 2018 8.3.3, from memory: verify), which framecheck does not apply; check this member by hand", dv.Species)
	}
	if sec.Plies > 1 && sec.Actual && dv.SizeFactor != SizeFactorSCL {
		return e, fmt.Errorf("size %s: built-up members sized in actual inches are checked for structural composite lumber "+
			"only, not for %s %s", m.Size, dv.Species, dv.Grade)
	}
	if dv.SizeFactor == SizeFactorGlulam && !sec.Actual {
		return e, fmt.Errorf("size %s: glulam is sized by its actual inches (such as 5.125x12 or 5 1/8 x 12)", m.Size)
	}
	if err := e.m.validate(); err != nil {
		return e, err
	}
	e.supFc = nil
	for j, b := range m.Bearings {
		if b.SupportSpecies == "" && b.SupportGrade == "" {
			continue
		}
		sp, gr := b.SupportSpecies, b.SupportGrade
		if sp == "" {
			sp = m.Species
		}
		if gr == "" {
			gr = m.Grade
		}
		sdv, err := mats.Lookup(sp, gr, m.Size)
		if err != nil {
			return e, fmt.Errorf("bearing %d: the support's material: %v", j+1, err)
		}
		if e.supFc == nil {
			e.supFc = make([]DesignValues, len(m.Bearings))
		}
		e.supFc[j] = sdv
	}
	e.supBeam = nil
	for j, b := range m.Bearings {
		if b.Beam.Species == "" || b.Hanger {
			continue // none, or the member rests on a hanger's seat, not on the beam
		}
		v, err := SupportBeamValues(b.Beam.Species, b.Beam.Grade, b.Beam.Size, s)
		if err != nil {
			return e, fmt.Errorf("bearing %d: the beam under it: %v", j+1, err)
		}
		if e.supBeam == nil {
			e.supBeam = make([]BeamFcPerp, len(m.Bearings))
		}
		e.supBeam[j] = v
	}
	e.factors()
	e.model()
	if e.dv.SizeFactor == SizeFactorGlulam {
		if e.s.WetService {
			return e, fmt.Errorf("glulam in wet service: the wet-service factors of NDS 2018 Supplement Table 5A are not applied " +
				"by framecheck; check this member by hand")
		}
		longest := 0.0
		for _, k := range e.spanSegs {
			longest = math.Max(longest, e.segs[k].ToIn-e.segs[k].FromIn)
		}
		e.cvSpanFt = longest / 12
		e.cv = VolumeFactor(e.cvSpanFt, e.sec.DIn, e.sec.BIn, e.dv.VolumeFactorX)
	}
	if err := e.solveStrength(); err != nil {
		return e, err
	}
	return e, nil
}

// factors sets the adjustment factors that do not depend on the load
// case (NDS 2018 Table 4.3.1).
func (e *engine) factors() {
	e.cf = SizeFactor(e.dv, e.sec)
	cfFb, cfFc := e.cf.Fb, e.cf.Fc
	if e.dv.SizeFactor == SizeFactor4B {
		cfFb, cfFc = 1, 1 // Table 4B values already include the size effect
	}
	e.cm = WetServiceFactor(e.s.WetService, e.dv, cfFb, cfFc)
	e.ct, _ = TemperatureFactor(e.s.Temperature, e.s.WetService)
	e.ci = IncisingFactor(e.s.Incised)
	e.cr = RepetitiveMemberFactor(e.m.SpacingIn, e.m.Repetitive)
	e.cv = 1
	if e.dv.SizeFactor == SizeFactorGlulam {
		// glulam: no size factor, no repetitive member factor, no incising
		// factor (NDS 2018 Table 5.3.1); CV instead of CF
		e.cf, e.cr, e.ci = SizeFactors{1, 1, 1}, 1, IncisingFactors{1, 1, 1, 1}
	}
	e.sclCV = 0
	inFbStar := 1.0
	if e.dv.SizeFactor == SizeFactorSCL {
		// SCL: no size factor CF, no incising factor, Cr not taken (NDS
		// 2018 Table 8.3.1 and 8.3.7; see scl.go); CV = (12/d)^n of the
		// manufacturer, in Fb* when above 1, else the lesser of CL and CV
		// (NDS 2018 8.3.6)
		e.cf, e.cr, e.ci = SizeFactors{1, 1, 1}, 1, IncisingFactors{1, 1, 1, 1}
		e.sclCV = SCLVolumeFactor(e.sec.DIn, e.dv.SCLExponent)
		inFbStar, e.cv = SCLBending(e.sclCV)
	}
	e.fbNoCD = e.dv.FbPsi * e.cm.Fb * e.ct.Fb * e.cf.Fb * e.ci.Fb * e.cr * inFbStar
	e.fbNegNoCD = e.fbNoCD
	if e.dv.FbNegPsi > 0 {
		e.fbNegNoCD = e.dv.FbNegPsi * e.cm.Fb * e.ct.Fb * e.cf.Fb * e.ci.Fb * e.cr * inFbStar
	}
	e.eAdj = e.dv.EPsi * e.cm.E * e.ct.E * e.ci.E
	e.eminAdj = e.dv.EminPsi * e.cm.E * e.ct.E * e.ci.E
	e.kcr = e.s.Kcr
	if e.kcr == 0 {
		e.kcr = 1.5 // NDS 2018 3.5.2: seasoned lumber, dry service
		if e.s.WetService {
			e.kcr = 2.0
		}
	}
}

// model builds the beam: from the start overhang's tip to the end
// overhang's tip, supports at the bearing centre-lines.
func (e *engine) model() {
	bs := e.m.Bearings
	// An overhang under 0.01 in is no cantilever: it would only make a
	// degenerate segment.
	if e.m.OverhangStartIn < 0.01 {
		e.m.OverhangStartIn = 0
	}
	if e.m.OverhangEndIn < 0.01 {
		e.m.OverhangEndIn = 0
	}
	e.x0 = bs[0].AtIn - e.m.OverhangStartIn
	sup := e.sup[:0]
	for _, b := range bs {
		sup = append(sup, b.AtIn-e.x0)
	}
	e.sup = sup
	length := bs[len(bs)-1].AtIn + e.m.OverhangEndIn - e.x0
	e.bm = beam.Beam{LengthIn: length, SupportsAtIn: sup, EILbIn2: e.eAdj * e.sec.IIn4}
	e.segs = e.bm.Segments()
	for i, sg := range e.segs {
		if !sg.Cantilever {
			e.spanSegs = append(e.spanSegs, i)
		}
	}
	e.cosT = 12 / math.Hypot(12, e.m.PitchRise12)
	e.buildLoads()
}

// patterns returns the masks of segments loaded by the live-type loads:
// all segments, and, when patterning applies (PatternLive and more than
// one segment), every non-empty subset for up to 5 segments, else each
// single segment, alternate segments, adjacent pairs, and each adjacent
// pair with every second segment beyond it (the arrangement that gives
// the largest negative moment and reaction at the support between the
// pair: the influence line of a support moment alternates in sign span by
// span, Mueller-Breslau; ASCE 7-16 4.3.3 asks for the most unfavourable
// arrangement).
func (e *engine) patterns() []uint32 {
	n := len(e.segs)
	all := uint32(1)<<n - 1
	if !e.s.PatternLive || n == 1 {
		e.patBuf = append(e.patBuf[:0], all)
		return e.patBuf
	}
	if n <= 5 {
		out := append(e.patBuf[:0], all)
		defer func() { e.patBuf = out }()
		for p := uint32(1); p < all; p++ {
			out = append(out, p)
		}
		return out
	}
	out := append(e.patBuf[:0], all)
	defer func() { e.patBuf = out }()
	var odd, even uint32
	for k := 0; k < n; k++ {
		out = append(out, 1<<k)
		if k+1 < n {
			out = append(out, 3<<k)
		}
		if k%2 == 0 {
			even |= 1 << k
		} else {
			odd |= 1 << k
		}
	}
	out = append(out, even, odd)
	for k := 0; k+1 < n; k++ {
		p := uint32(3) << k
		for j := k - 2; j >= 0; j -= 2 {
			p |= 1 << j
		}
		for j := k + 3; j < n; j += 2 {
			p |= 1 << j
		}
		if p != 3<<k && p != all {
			out = append(out, p)
		}
	}
	return out
}

// comboCD is a combination case's name and load duration factor.
type comboCD struct {
	name string
	cd   float64
}

// caseSpec is one combination case before patterning: the load on every
// segment (full) and the live-type load added on patterned segments.
type caseSpec struct {
	name            string
	cd              float64
	f               factorSet
	dir             float64
	full, patterned float64 // the one uniform load's parts (not general members)
	live            bool    // live-type loads act in the case: pattern it
}

// solveStrength expands the combinations into load cases and solves each.
func (e *engine) solveStrength() error {
	combos := e.s.Combos
	if combos == nil {
		combos = defaultCombos
	}
	pats := e.patterns()
	var specBuf [16]caseSpec
	specs := specBuf[:0]
	for _, c := range combos {
		for _, f := range c.Cases {
			dirs := [2]float64{0, 0}
			nd := 1
			if f[LoadW] > 0 {
				nd = 0
				if e.hasWind(1) {
					dirs[nd], nd = 1, nd+1
				}
				if e.hasWind(-1) {
					dirs[nd], nd = -1, nd+1
				}
			}
			for _, dir := range dirs[:nd] {
				if sp, ok := e.caseSpec(f, dir); ok && !hasSpec(specs, sp) {
					specs = append(specs, sp)
				}
			}
		}
	}
	e.comboCDs = e.comboCDs[:0]
	for _, sp := range specs {
		e.comboCDs = append(e.comboCDs, comboCD{sp.name, sp.cd})
	}
	if len(e.segs) == 1 && !e.general && pruneCases {
		specs = pruneDominated(specs)
	}
	n := 0
	for _, sp := range specs {
		if !sp.live {
			n++
		} else {
			n += len(pats)
		}
	}
	if cap(e.cases) >= n {
		e.cases = e.cases[:n]
	} else {
		e.cases = make([]strengthCase, n)
	}
	np := len(e.lps)
	if cap(e.wAll) >= n*np {
		e.wAll = e.wAll[:n*np]
	} else {
		e.wAll = make([]float64, n*np)
	}
	wAll := e.wAll
	i := 0
	for _, sp := range specs {
		ps := pats
		if !sp.live {
			ps = pats[:1]
		}
		for _, p := range ps {
			c := &e.cases[i]
			c.name, c.cd, c.pattern, c.f, c.dir = sp.name, sp.cd, p, sp.f, sp.dir
			c.w = wAll[i*np : (i+1)*np]
			e.fillCase(c)
			if err := e.solve(&c.r, c.w, c.pts); err != nil {
				return err
			}
			c.mPos, _, c.mNeg, _ = c.r.MomentExtremes(0, e.bm.LengthIn)
			e.mMax = math.Max(e.mMax, math.Max(c.mPos, -c.mNeg))
			i++
		}
	}
	return nil
}

// hasSpec reports whether specs already holds a case with the loads and
// CD of sp (two alternatives that reduce to the same case when a load is
// zero, such as D+0.75L+0.75(Lr or S) without roof live or snow).
func hasSpec(specs []caseSpec, sp caseSpec) bool {
	for _, s := range specs {
		if s.full == sp.full && s.patterned == sp.patterned && s.cd == sp.cd && s.name == sp.name && s.dir == sp.dir {
			return true
		}
	}
	return false
}

// pruneCases switches on pruneDominated and the bound that lets evalEdge
// skip cases; tests switch it off to show they change no result.
var pruneCases = true

// pruneDominated drops, on a member of one segment, every case that
// another case dominates: a load of the same sign at least as large, with
// a load duration factor no larger. Every response of such a member is the
// one load times a fixed shape, and Fb* CL, Fv' grow with CD, so the
// dominated case can never govern (ties keep the first case).
func pruneDominated(specs []caseSpec) []caseSpec {
	var dropBuf [16]bool
	drop := dropBuf[:0]
	if len(specs) > len(dropBuf) {
		drop = make([]bool, 0, len(specs))
	}
	for i, a := range specs {
		wa := a.full + a.patterned
		dominated := false
		for j, b := range specs {
			if i == j {
				continue
			}
			wb := b.full + b.patterned
			if (wa >= 0) == (wb >= 0) && math.Abs(wb) >= math.Abs(wa) && b.cd <= a.cd &&
				(math.Abs(wb) > math.Abs(wa) || b.cd < a.cd || j < i) {
				dominated = true
				break
			}
		}
		drop = append(drop, dominated)
	}
	out := specs[:0]
	for i, sp := range specs {
		if !drop[i] {
			out = append(out, sp)
		}
	}
	return out
}

// caseSpec builds the case of one factor set and wind direction (+1
// toward the member, -1 away, 0 none); ok is false for a case whose
// variable loads are all zero, unless it is a dead-load-only combination.
func (e *engine) caseSpec(f factorSet, dir float64) (caseSpec, bool) {
	present := e.present(dir)
	hasVar, varPresent := false, false
	for t := LoadL; t < numLoadTypes; t++ {
		if f[t] > 0 {
			hasVar = true
			varPresent = varPresent || present[t]
		}
	}
	present[LoadD] = true
	if hasVar && !varPresent {
		return caseSpec{}, false
	}
	sp := caseSpec{name: e.caseName(f, dir, present), cd: ComboDurationFactor(f, present), f: f, dir: dir}
	if !e.general {
		lw := &e.mps[0].lw
		sp.full = lw.factored(f, dir, false)
		sp.patterned = lw.factored(f, dir, true) - sp.full
		sp.live = sp.patterned != 0
	} else {
		for t := LoadL; t < numLoadTypes; t++ {
			sp.live = sp.live || (f[t] > 0 && present[t])
		}
	}
	return sp, true
}

type caseNameKey struct {
	f       factorSet
	dir     float64
	present [numLoadTypes]bool
}

type caseNameEntry struct {
	key  caseNameKey
	name string
}

// caseName writes a factor set as "D+0.75L+0.75S" or "0.6D+0.6W(up)",
// leaving out loads that are zero. The names are kept (caseNames): a plan
// with a load path names the same few cases at every one of its posts
// and joints. At most a few thousand keys exist (combinations x wind
// directions x the loads present).
func caseName(f factorSet, dir float64, present [numLoadTypes]bool) string {
	k := caseNameKey{f, dir, present}
	if s, ok := caseNames.Load(k); ok {
		return s.(string)
	}
	s := formatCaseName(f, dir, present)
	caseNames.Store(k, s)
	return s
}

// caseNames holds caseName's names by key, for every goroutine.
var caseNames sync.Map

// caseName is caseName with a small cache kept by the pooled engine: a run
// meets the same few cases again and again.
func (e *engine) caseName(f factorSet, dir float64, present [numLoadTypes]bool) string {
	k := caseNameKey{f, dir, present}
	for i := range e.names {
		if e.names[i].key == k {
			return e.names[i].name
		}
	}
	s := formatCaseName(f, dir, present)
	if len(e.names) < 64 {
		e.names = append(e.names, caseNameEntry{k, s})
	}
	return s
}

func formatCaseName(f factorSet, dir float64, present [numLoadTypes]bool) string {
	var b strings.Builder
	for t := LoadType(0); t < numLoadTypes; t++ {
		if f[t] == 0 || !present[t] {
			continue
		}
		if b.Len() > 0 {
			b.WriteByte('+')
		}
		if f[t] != 1 {
			b.WriteString(num(f[t]))
		}
		b.WriteString(t.String())
		if t == LoadW {
			if dir < 0 {
				b.WriteString("(up)")
			} else {
				b.WriteString("(down)")
			}
		}
	}
	return b.String()
}

// segLabel names segment k of the model for messages: "span 2", "start
// overhang", "end overhang".
func (e *engine) segLabel(k int) string {
	if e.segs[k].Cantilever {
		if k == 0 {
			return "start overhang"
		}
		return "end overhang"
	}
	for i, s := range e.spanSegs {
		if s == k {
			return "span " + strconv.Itoa(i+1)
		}
	}
	return fmt.Sprintf("segment %d", k+1)
}

// patternLabel describes a live-load pattern, "" when every segment is
// loaded.
func (e *engine) patternLabel(p uint32) string {
	all := uint32(1)<<len(e.segs) - 1
	if p == all {
		return ""
	}
	var parts []string
	for k := range e.segs {
		if p&(1<<k) != 0 {
			parts = append(parts, e.segLabel(k))
		}
	}
	return "live-type loads on " + strings.Join(parts, ", ")
}

// caseLabel is a case's name with its pattern, for CheckResult.Combo.
func (e *engine) caseLabel(c *strengthCase) string {
	if l := e.patternLabel(c.pattern); l != "" {
		return c.name + " (" + l + ")"
	}
	return c.name
}
