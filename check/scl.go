package check

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"
)

// Structural composite lumber (SCL: laminated veneer lumber LVL, parallel
// strand lumber PSL, laminated strand lumber LSL) has no reference design
// values in the NDS or its Supplement: NDS 2018 Chapter 8 takes them from
// the manufacturer's literature or code evaluation report (NDS 2018 8.2,
// from memory: verify). framecheck therefore builds in no SCL product: the
// user gives each one as a row of a materials file ([lumber]
// materials_file) whose size_factor column reads "SCL n", n being the
// exponent of the manufacturer's size (volume) factor on depth.
//
// The adjustment factors framecheck applies to an SCL member in ASD (NDS
// 2018 Table 8.3.1, from memory: verify):
//
//	Fb'       = Fb CD CM Ct CL CV   (CV per 8.3.6, see below)
//	Fv'       = Fv CD CM Ct
//	Fc_perp'  = Fc_perp CM Ct Cb
//	E', Emin' = E CM Ct, Emin CM Ct
//
// CM = 1: the user's values are for dry service, and wet service is
// refused (the manufacturer gives any wet-service factors; NDS 2018 8.3.3,
// from memory: verify). Ct from NDS 2018 Table 2.3.3 (8.3.4). The
// repetitive member factor of NDS 2018 8.3.7 (1.04 for SCL, per
// wikiengineer.com/Structural/RepetitiveMemberFactor; the limit "3 1/2 in
// and thinner used as joists" is from memory: verify) is NOT applied:
// Cr = 1.0, on the safe side. There is no incising factor and no flat-use factor.
//
// Widths and depths are the member's actual inches: an SCL member is sized
// "1.75x11.875" or "1 3/4 x 11 7/8", never nominal, and is not dressed.
// The row's min_width_in and max_width_in bound the member's actual depth
// (0 = no limit), so a manufacturer's range of depths is kept.

// SizeFactorSCL marks a user material that is structural composite
// lumber: actual sizes, CV = (12/d)^n on Fb (DesignValues.SCLExponent),
// Cr = 1, no Ci, dry service only.
const SizeFactorSCL = "SCL"

// maxSCLExponent bounds the exponent n of an SCL row: the exponents
// manufacturers publish for depth are between about 0.1 and 0.2 (common
// practice, no source); 0.5 would halve Fb between 12 and 48 in, so a
// larger n is taken for a typing slip (1/n written as n, say).
const maxSCLExponent = 0.5

// parseSCLSizeFactor reads the size_factor column of an SCL row: "SCL n",
// "SCL:n" or "SCL(n)", n a decimal (0.136) or a fraction (1/9); "SCL 0"
// means the manufacturer gives no size factor. ok is false when s does
// not start with SCL (another rule).
func parseSCLSizeFactor(s string) (n float64, ok bool, err error) {
	t := strings.TrimSpace(s)
	if len(t) < 3 || !strings.EqualFold(t[:3], "scl") {
		return 0, false, nil
	}
	arg := strings.TrimSpace(t[3:])
	arg = strings.TrimPrefix(arg, ":")
	if strings.HasPrefix(arg, "(") && strings.HasSuffix(arg, ")") {
		arg = arg[1 : len(arg)-1]
	}
	arg = strings.TrimSpace(arg)
	bad := fmt.Errorf("column size_factor: want \"SCL n\" with n the exponent of the manufacturer's size factor "+
		"(12/d)^n, from 0 to %g, such as \"SCL 0.136\" or \"SCL 1/9\"; got %q", maxSCLExponent, s)
	if arg == "" {
		return 0, true, bad
	}
	if num, den, frac := strings.Cut(arg, "/"); frac {
		a, e1 := strconv.ParseFloat(strings.TrimSpace(num), 64)
		b, e2 := strconv.ParseFloat(strings.TrimSpace(den), 64)
		if e1 != nil || e2 != nil || b <= 0 {
			return 0, true, bad
		}
		n = a / b
	} else {
		v, err := strconv.ParseFloat(arg, 64)
		if err != nil {
			return 0, true, bad
		}
		n = v
	}
	if math.IsNaN(n) || n < 0 || n > maxSCLExponent {
		return 0, true, bad
	}
	return n, true, nil
}

// SCLVolumeFactor returns CV of structural composite lumber as its
// manufacturer states it, (12/d)^n with d the actual depth in inches and
// n the manufacturer's exponent (NDS 2018 8.3.6: the volume factor of SCL
// is obtained from the manufacturer's literature or code evaluation
// report; from memory: verify). It is not limited to 1.0: a member
// shallower than 12 in gets CV > 1, as the manufacturers' formulas give;
// the row's depth range (min_width_in) is where the user keeps the
// manufacturer's smallest depth.
func SCLVolumeFactor(dIn, n float64) float64 {
	if dIn <= 0 || n <= 0 {
		return 1
	}
	return math.Pow(12/dIn, n)
}

// SCLBending returns the factors by which CV enters Fb' for SCL (NDS 2018
// 8.3.6; from memory: verify): when CV <= 1.0 it is not applied together
// with CL, the lesser of the two applies (cvWithCL = CV, inFbStar = 1);
// when CV > 1.0 both apply, and CV is part of Fb*, the fully braced value
// from which CL is computed (cvWithCL = 1, inFbStar = CV), as AWC's answer
// on the beam stability factor of SCL says
// (awc.org/helpoutreach/faq/faqFiles/beam_stability.html: "Where CV > 1,
// it is intended to be applied to Fb* prior to calculation of the beam
// stability factor, CL").
func SCLBending(cv float64) (inFbStar, cvWithCL float64) {
	if cv > 1 {
		return cv, 1
	}
	return 1, cv
}

// sclLookup returns the values of SCL species sp (already resolved) for
// grade in section sec: sec in actual inches, its depth within a row's
// depth range. An empty grade takes the species' only grade.
func (m *Materials) sclLookup(sp, grade string, sec Section) (DesignValues, error) {
	if !sec.Actual {
		return DesignValues{}, fmt.Errorf("%s is structural composite lumber: give its size in actual inches, such as "+
			"1.75x11.875 or 1 3/4 x 11 7/8 (with a decimal point or a fraction), not the nominal %s", sp, sec.Name)
	}
	grades := m.gradeNames(sp)
	gr := ""
	switch {
	case strings.TrimSpace(grade) == "" && len(grades) == 1:
		gr = grades[0]
	case strings.TrimSpace(grade) == "":
		return DesignValues{}, fmt.Errorf("%s: which grade? the materials file gives %s; name one (the word after the material in the callout, "+
			"the [[support]] grade of a beam, or the [lumber] grade of the joists' layer)", sp, strings.Join(grades, ", "))
	default:
		for _, g := range grades {
			if nameKey(g) == nameKey(grade) {
				gr = g
			}
		}
		if gr == "" {
			return DesignValues{}, unknownName("grade of "+sp, grade, grades)
		}
	}
	var ranges []string
	for _, r := range m.rows {
		if r.Species != sp || r.Grade != gr {
			continue
		}
		if sec.DIn >= r.minDIn-1e-9 && (r.maxDIn == 0 || sec.DIn <= r.maxDIn+1e-9) {
			return r.DesignValues, nil
		}
		hi := "no limit"
		if r.maxDIn > 0 {
			hi = fmtG(r.maxDIn) + " in"
		}
		ranges = append(ranges, fmtG(r.minDIn)+" in to "+hi)
	}
	return DesignValues{}, fmt.Errorf("%s %s: no design values for a depth of %s in (the materials file gives depths %s)",
		sp, gr, fmtG(sec.DIn), strings.Join(ranges, "; "))
}

// IsSCL reports whether name (matched as Lookup matches species, case and
// punctuation aside) is a user material of structural composite lumber,
// and returns its name as the materials file spells it.
func (m *Materials) IsSCL(name string) (string, bool) {
	if m == nil || strings.TrimSpace(name) == "" {
		return "", false
	}
	k := nameKey(name)
	for _, r := range m.rows {
		if r.SizeFactor == SizeFactorSCL && nameKey(r.Species) == k {
			return r.Species, true
		}
	}
	return "", false
}

// SCLNames lists the SCL user materials of m, sorted, for messages.
func (m *Materials) SCLNames() []string {
	if m == nil {
		return nil
	}
	var out []string
	seen := map[string]bool{}
	for _, r := range m.rows {
		if r.SizeFactor == SizeFactorSCL && !seen[r.Species] {
			seen[r.Species] = true
			out = append(out, r.Species)
		}
	}
	sort.Strings(out)
	return out
}

// checkSCLRows checks the rows of one file: a species is SCL in every row
// or in none (a material cannot be sized both ways).
func checkSCLRows(rows []materialRow, lines []int, name string) error {
	first := map[string]int{}
	for i, r := range rows {
		k := nameKey(r.Species)
		j, ok := first[k]
		if !ok {
			first[k] = i
			continue
		}
		if (rows[j].SizeFactor == SizeFactorSCL) != (r.SizeFactor == SizeFactorSCL) {
			return fmt.Errorf("%s:%d: column size_factor: %s is structural composite lumber (SCL) on line %d and not here; "+
				"give every row of a material the same kind", name, lines[i], r.Species, lines[j])
		}
	}
	return nil
}

// sclFactorTrace lists the adjustment factors of a structural composite
// lumber member after its CD (NDS 2018 Table 8.3.1; see the notes at the
// top of this file).
func (e *engine) sclFactorTrace(t *tracer) {
	t.add("CM", 1, "", "dry service: the user's values from the manufacturer; wet service is refused", Subst{},
		"NDS 2018 8.3.3 (from memory: verify)")
	t.add("Ct(Fb, Fv, Fc_perp)", e.ct.Fb, "", "temperature", lit(tempName(e.s.Temperature)), "NDS 2018 8.3.4, Table 2.3.3")
	t.add("Ct(E)", e.ct.E, "", "temperature", lit(tempName(e.s.Temperature)), "NDS 2018 8.3.4, Table 2.3.3")
	how := "at most 1.0: the smaller of CL and CV applies"
	if e.sclCV > 1 {
		how = "above 1.0: applied with CL, in Fb*"
	}
	t.add("CV", e.sclCV, "", "(12/d)^n, n = "+fmtG(e.dv.SCLExponent)+" from "+e.dv.Source+"; "+how,
		t.f("(12 / %s)^%s", e.sec.DIn, e.dv.SCLExponent), sclCVRef)
	t.add("Cr", 1, "", "repetitive member factor of SCL not taken (on the safe side)", Subst{}, "NDS 2018 8.3.7 (from memory: verify)")
}
