package check

import (
	"fmt"
	"math"
)

// KindCompression is the column check of a post: fc = P / A against
// Fc' = Fc* CP (NDS 2018 3.6.3, 3.7.1). KindBearingParallel is the bearing
// of the member above on the post's end grain: fc = P / A against Fc*
// (NDS 2018 3.10.1).
const (
	KindCompression     = "compression"
	KindBearingParallel = "bearing-end-grain"
)

// PostLoads are the axial loads on a post by load type, lb, downward
// positive; WindUpLb is the magnitude of the wind load away from the post
// (uplift), UpliftDeadLb the dead load relied on against it (used when
// HasUpliftDead).
type PostLoads struct {
	DeadLb, LiveLb, RoofLiveLb, SnowLb, WindDownLb, WindUpLb float64
	UpliftDeadLb                                             float64
	HasUpliftDead                                            bool
}

// Post is a solid sawn post (a column) with its loads: axial only, braced
// at both ends, buckling about its weaker axis over KeHeight.
type Post struct {
	ID, Size, Species, Grade string
	HeightIn                 float64 // unbraced length l
	Ke                       float64 // buckling length coefficient, NDS 2018 Appendix G (1.0 pinned-pinned); 0 = 1.0
	Loads                    PostLoads
}

// PostCase is one combination's axial load on a post.
type PostCase struct {
	Name string
	CD   float64
	PLb  float64 // downward positive; negative is net uplift (tension)
}

// PostResult is the outcome of checking one post.
type PostResult struct {
	ID         string
	Checks     []CheckResult // compression, bearing on the end grain
	Cases      []PostCase    // every combination's load, for the connectors and the foundation
	DownLb     float64       // largest downward load and its case
	DownCombo  string
	UpLb       float64 // largest net uplift (magnitude), 0 when none
	UpCombo    string
	LeOverD    float64 // slenderness le/d about the weaker axis
	Status     string
	Messages   []string
	MaxRatio   float64
	Governing  string
	DesignVals DesignValues
}

// CheckPost checks post p under the combinations of s (ASCE 7-16 2.4.1 by
// default) as a solid sawn column (NDS 2018 3.7.1):
//
//	Fc* = Fc CD CM Ct CF Ci
//	FcE = 0.822 Emin' / (le/d)^2, le = Ke l, d the smaller dimension
//	CP  = (1 + FcE/Fc*)/(2c) - sqrt([(1 + FcE/Fc*)/(2c)]^2 - (FcE/Fc*)/c), c = 0.8
//	fc = P / A <= Fc' = Fc* CP, with le/d <= 50 (NDS 2018 3.7.1.4)
//
// and the bearing of the member above on its end grain, fc = P / A <= Fc*
// (NDS 2018 3.10.1). A post whose size or material is unknown is an error.
func CheckPost(p Post, s Settings) PostResult {
	r := PostResult{ID: p.ID, Status: StatusError}
	sec, err := ParseSize(p.Size)
	if err != nil {
		r.Messages = append(r.Messages, err.Error())
		return r
	}
	mats := s.Materials
	if mats == nil {
		mats = BuiltinMaterials()
	}
	dv, err := mats.Lookup(p.Species, p.Grade, p.Size)
	if err != nil {
		r.Messages = append(r.Messages, err.Error())
		return r
	}
	r.DesignVals = dv
	// A value the material lacks would make Fc* 0 and CP NaN, and a case
	// with a NaN ratio is never the governing one: the post would pass
	// with no check at all. Glulam's table holds the bending values of
	// its stress classes (Supplement Table 5A), not the axial ones.
	if !(dv.FcPsi > 0) || math.IsInf(dv.FcPsi, 0) || !(dv.EminPsi > 0) || math.IsInf(dv.EminPsi, 0) {
		what := "no compression parallel to grain value Fc or no Emin"
		if dv.SizeFactor == SizeFactorGlulam {
			what = "no axial values: framecheck holds glulam's bending stress classes (NDS 2018 Supplement Table 5A), not the axially loaded combinations a glulam column is graded by"
		}
		r.Messages = append(r.Messages, fmt.Sprintf("%s %s as a post: %s (Fc %v psi, Emin %v psi); the post is not checked: "+
			"check it by hand, or give a material with Fc and Emin in the materials file", dv.Species, dv.Grade, what, dv.FcPsi, dv.EminPsi))
		return r
	}
	if !(p.HeightIn > 0) || math.IsInf(p.HeightIn, 0) {
		r.Messages = append(r.Messages, fmt.Sprintf("height %v in: want a finite height > 0", p.HeightIn))
		return r
	}
	ke := p.Ke
	if ke == 0 {
		ke = 1
	}
	if !(ke > 0) || ke > 10 {
		r.Messages = append(r.Messages, fmt.Sprintf("Ke %v: want a buckling length coefficient above 0 (NDS 2018 Appendix G)", ke))
		return r
	}
	cf := SizeFactor(dv, sec)
	cfFc := cf.Fc
	if dv.SizeFactor == SizeFactor4B {
		cfFc = 1
	}
	cm := WetServiceFactor(s.WetService, dv, cf.Fb, cfFc)
	ct, _ := TemperatureFactor(s.Temperature, s.WetService)
	ci := IncisingFactor(s.Incised) // Ci of Fc is that of Fb, 0.80 (NDS 2018 Table 4.3.8)
	if dv.SizeFactor == SizeFactorSCL {
		// structural composite lumber: no CF or Ci, dry service only (see
		// scl.go); c stays 0.8 below, under the 0.9 that NDS 2018 3.7.1.5
		// gives SCL (0.9 for glulam, SCL and CLT per xcfem/xc
		// AWCNDS_materials.py @ 007d96f3, LSL.get37_1c), so CP errs low
		if s.WetService {
			r.Messages = append(r.Messages, fmt.Sprintf("%s in wet service: structural composite lumber takes its wet-service "+
				"factors from the manufacturer (NDS 2018 8.3.3, from memory: verify), which framecheck does not apply; check this post by hand", dv.Species))
			return r
		}
		ci = IncisingFactors{1, 1, 1, 1}
	}
	d := math.Min(sec.BIn, sec.DIn)
	area := sec.BIn * sec.DIn
	le := ke * p.HeightIn
	r.LeOverD = le / d
	// CM, Ct and Ci for Fc and for E: NDS 2018 Table 4.3.1. Ct of Fc is the
	// one of Fb, Fv and Fc_perp in Table 2.3.3 (all but E and Emin).
	eminAdj := dv.EminPsi * cm.E * ct.E * ci.E
	fcE := 0.822 * eminAdj / (r.LeOverD * r.LeOverD)
	const c = 0.8 // sawn lumber, NDS 2018 3.7.1.5

	r.Cases = LoadCases(p.Loads, s)
	area2 := area
	best := -1.0
	var bestComp, bestBear CheckResult
	var bestRec colRec // the governing case's numbers, kept once at the end
	for _, pc := range r.Cases {
		P, cd, name := pc.PLb, pc.CD, pc.Name
		if P > r.DownLb {
			r.DownLb, r.DownCombo = P, name
		}
		if -P > r.UpLb {
			r.UpLb, r.UpCombo = -P, name
		}
		if P <= 0 {
			continue
		}
		fcStar := dv.FcPsi * cd * cm.Fc * ct.Fb * cfFc * ci.Fb
		a := fcE / fcStar
		k := (1 + a) / (2 * c)
		cp := k - math.Sqrt(k*k-a/c)
		fc := P / area2
		ratio := fc / (fcStar * cp)
		if ratio > best {
			best = ratio
			bestComp = CheckResult{Kind: KindCompression, Combo: name, Actual: fc, Allowable: fcStar * cp, Unit: "psi", Ratio: ratio}
			bestRec = colRec{pLb: P, aIn2: area, leIn: le, dIn: d, ke: ke, hIn: p.HeightIn, cd: cd,
				fcPsi: dv.FcPsi, cm: cm.Fc, ct: ct.Fb, cf: cfFc, ci: ci.Fb, fcStar: fcStar, eminPsi: dv.EminPsi,
				eminAdj: eminAdj, fcE: fcE, cp: cp, c: c}
			bestBear = CheckResult{Kind: KindBearingParallel, Combo: name, Actual: fc, Allowable: fcStar, Unit: "psi", Ratio: fc / fcStar}
		}
	}
	if best >= 0 {
		rec := &calcRecord{col: bestRec}
		bestComp.calc, bestBear.calc = rec, rec
		r.Checks = []CheckResult{bestComp, bestBear}
	} else if r.DownLb > 0 {
		// a case presses the post down but none gave a ratio (a NaN from
		// values out of range): never a pass without a check
		r.Messages = append(r.Messages, fmt.Sprintf("the post carries %.0f lb (%s) but its compression could not be checked "+
			"(Fc* %v psi, FcE %v psi); check it by hand", r.DownLb, r.DownCombo, dv.FcPsi*cm.Fc*ct.Fb*cfFc*ci.Fb, fcE))
		return r
	}
	r.MaxRatio, r.Governing, r.Status, r.Messages = verdict(r.Checks, r.Messages)
	if r.LeOverD > 50 {
		r.Status = StatusFail
		r.Messages = append(r.Messages, fmt.Sprintf("le/d = %.1f > 50: not permitted (NDS 2018 3.7.1.4)", r.LeOverD))
	}
	return r
}

// LoadCases returns the load of every combination of s (ASCE 7-16 2.4.1
// by default) on a support or connector carrying loads l, downward
// positive, with its load duration factor (NDS 2018 Table 2.3.2);
// combinations whose variable loads are all absent are left out, and a
// combination with wind is taken with the wind each way that acts. In a
// case with the wind away from the member the dead load is the one relied
// on against uplift (l.UpliftDeadLb when HasUpliftDead).
func LoadCases(l PostLoads, s Settings) []PostCase {
	combos := s.Combos
	if combos == nil {
		combos = defaultCombos
	}
	n := 0 // at most one case per alternative and wind direction
	for _, cb := range combos {
		for _, f := range cb.Cases {
			if f[LoadW] > 0 {
				n += 2
			} else {
				n++
			}
		}
	}
	out := make([]PostCase, 0, n)
	eachLoadCase(l, combos, func(f factorSet, dir float64, pr [numLoadTypes]bool, P float64) {
		name := caseName(f, dir, pr)
		for _, pc := range out {
			if pc.Name == name && pc.PLb == P {
				return // the same case again
			}
		}
		out = append(out, PostCase{Name: name, CD: ComboDurationFactor(f, pr), PLb: P})
	})
	return out
}

// LoadExtremes returns the largest downward load of LoadCases(l, s) and
// the first case giving it, and the largest net uplift (a magnitude) and
// the first case giving it; 0 and "" when no case presses down, or none
// pulls up. It is what a scan of LoadCases finds, without the list.
func LoadExtremes(l PostLoads, s Settings) (downLb float64, downCombo string, upLb float64, upCombo string) {
	combos := s.Combos
	if combos == nil {
		combos = defaultCombos
	}
	eachLoadCase(l, combos, func(f factorSet, dir float64, pr [numLoadTypes]bool, P float64) {
		// a case LoadCases leaves out as a repeat equals an earlier one:
		// it is never strictly larger, so it changes neither extreme
		if P > downLb {
			downLb, downCombo = P, caseName(f, dir, pr)
		}
		if -P > upLb {
			upLb, upCombo = -P, caseName(f, dir, pr)
		}
	})
	return downLb, downCombo, upLb, upCombo
}

// eachLoadCase calls fn with each case of combos on loads l, in the order
// LoadCases lists them (repeats included): its factors, the wind's
// direction (1 toward, -1 away, 0 none), the loads present and the load P.
func eachLoadCase(l PostLoads, combos []Combo, fn func(f factorSet, dir float64, pr [numLoadTypes]bool, P float64)) {
	loads := [numLoadTypes]float64{l.DeadLb, l.LiveLb, l.RoofLiveLb, l.SnowLb, l.WindDownLb}
	var present [numLoadTypes]bool
	for t := range loads {
		present[t] = loads[t] > 0
	}
	present[LoadD] = true
	var dirBuf [2]float64
	for _, cb := range combos {
		for _, f := range cb.Cases {
			dirs := append(dirBuf[:0], 0)
			if f[LoadW] > 0 {
				dirs = dirs[:0]
				if l.WindDownLb > 0 {
					dirs = append(dirs, 1)
				}
				if l.WindUpLb > 0 {
					dirs = append(dirs, -1)
				}
			}
			for _, dir := range dirs {
				pr := present
				pr[LoadW] = dir != 0
				hasVar, varPresent := false, false
				for t := LoadL; t < numLoadTypes; t++ {
					if f[t] > 0 {
						hasVar = true
						varPresent = varPresent || pr[t]
					}
				}
				if hasVar && !varPresent {
					continue
				}
				dead, w := l.DeadLb, 0.0
				if dir > 0 {
					w = l.WindDownLb
				} else if dir < 0 {
					w = -l.WindUpLb
					if l.HasUpliftDead {
						dead = l.UpliftDeadLb
					}
				}
				P := f[LoadD]*dead + f[LoadL]*l.LiveLb + f[LoadLr]*l.RoofLiveLb + f[LoadS]*l.SnowLb + f[LoadW]*w
				fn(f, dir, pr, P)
			}
		}
	}
}

// colRec holds the numbers of a post's governing compression case.
type colRec struct {
	pLb, aIn2, leIn, dIn, ke, hIn, cd float64
	fcPsi, cm, ct, cf, ci, fcStar     float64
	eminPsi, eminAdj, fcE, cp, c      float64
}

// columnTrace writes a post's compression calculation (NDS 2018 3.7.1).
func (r *calcRecord) columnTrace(kind string) []TraceItem {
	x := &r.col
	t := newTracer(10)
	fc := x.pLb / x.aIn2
	t.add("P", x.pLb, "lb", "axial load, governing case", Subst{}, "statics: the reactions of the members above")
	t.add("A", x.aIn2, "in^2", "b d", Subst{}, "NDS 2018 Supplement Table 1B")
	t.add("fc", fc, "psi", "P / A", t.f("%s / %s", x.pLb, x.aIn2), "NDS 2018 3.6.3")
	t.add("Fc*", x.fcStar, "psi", "Fc CD CM Ct CF Ci", t.f("%s(%s)(%s)(%s)(%s)(%s)", x.fcPsi, x.cd, x.cm, x.ct, x.cf, x.ci), "NDS 2018 Table 4.3.1")
	if kind == KindBearingParallel {
		t.add("fc/Fc*", fc/x.fcStar, "", "bearing on the end grain", t.f("%s / %s", fc, x.fcStar), "NDS 2018 3.10.1")
		return t.items
	}
	t.add("le", x.leIn, "in", "Ke l", t.f("%s(%s)", x.ke, x.hIn), "NDS 2018 3.7.1.2, Appendix G")
	t.add("le/d", x.leIn/x.dIn, "", "le / d, weaker axis (at most 50)", t.f("%s / %s", x.leIn, x.dIn), "NDS 2018 3.7.1.4")
	t.add("FcE", x.fcE, "psi", "0.822 Emin' / (le/d)^2", t.f("0.822(%s) / %s^2", x.eminAdj, x.leIn/x.dIn), "NDS 2018 3.7.1.5")
	t.add("CP", x.cp, "", "(1 + a)/(2c) - sqrt(((1 + a)/(2c))^2 - a/c), a = FcE/Fc*, c = 0.8",
		t.f("a = %s / %s", x.fcE, x.fcStar), "NDS 2018 Eq. 3.7-1")
	t.add("Fc'", x.fcStar*x.cp, "psi", "Fc* CP", t.f("%s(%s)", x.fcStar, x.cp), "NDS 2018 3.7.1")
	t.add("fc/Fc'", fc/(x.fcStar*x.cp), "", "fc / Fc'", t.f("%s / %s", fc, x.fcStar*x.cp), "NDS 2018 3.6.3")
	return t.items
}
