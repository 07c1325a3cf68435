package check

import (
	"fmt"
	"math"
	"strings"
)

// SizeFactorGlulam marks structural glued laminated timber: no size
// factor, no repetitive member factor; the volume factor CV of NDS 2018
// 5.3.6 instead, not combined with CL (the smaller governs, NDS 2018
// Table 5.3.1 footnote 1).
const SizeFactorGlulam = "5A"

// GlulamSpecies is the species name glulam stress classes are looked up
// under ("Glulam 24F-1.8E": species Glulam, grade 24F-1.8E).
const GlulamSpecies = "Glulam"

// glulamRow is one stress class of NDS 2018 Supplement Table 5A (softwood,
// bending members loaded perpendicular to the wide faces of the
// laminations): Fbx+ (tension zone stressed in tension: positive moment),
// Fbx- (compression zone stressed in tension: negative moment), Fc_perp x,
// Fvx, Ex and Ex,min, psi. Every value is from memory: verify against NDS
// 2018 Supplement Table 5A before relying on it.
type glulamRow struct {
	class                                 string
	fbPos, fbNeg, fcPerp, fv, e, eMin, ft float64
}

var glulamTable5A = []glulamRow{
	{"16F-1.3E", 1600, 925, 315, 195, 1.3e6, 0.69e6, 0},  // from memory: verify against NDS 2018 Supplement Table 5A
	{"20F-1.5E", 2000, 1100, 425, 210, 1.5e6, 0.79e6, 0}, // from memory: verify against NDS 2018 Supplement Table 5A
	{"24F-1.7E", 2400, 1450, 500, 210, 1.7e6, 0.88e6, 0}, // from memory: verify against NDS 2018 Supplement Table 5A
	{"24F-1.8E", 2400, 1450, 650, 265, 1.8e6, 0.95e6, 0}, // from memory: verify against NDS 2018 Supplement Table 5A
	{"26F-1.9E", 2600, 1950, 650, 265, 1.9e6, 1.00e6, 0}, // from memory: verify against NDS 2018 Supplement Table 5A
}

// glulamValues returns the design values of a glulam stress class, or an
// error naming the classes known.
func glulamValues(class string) (DesignValues, error) {
	k := strings.ToUpper(strings.ReplaceAll(strings.TrimSpace(class), " ", ""))
	var names []string
	for _, r := range glulamTable5A {
		names = append(names, r.class)
		if r.class == k {
			return DesignValues{Species: GlulamSpecies, Grade: r.class, FbPsi: r.fbPos, FbNegPsi: r.fbNeg, FvPsi: r.fv,
				FcPerpPsi: r.fcPerp, EPsi: r.e, EminPsi: r.eMin, FtPsi: r.ft, SizeFactor: SizeFactorGlulam,
				VolumeFactorX: 10,
				Source:        "NDS 2018 Supplement Table 5A (from memory: verify)"}, nil
		}
	}
	return DesignValues{}, fmt.Errorf("glulam stress class %q: not known; the classes known are %s (or give the beam's "+
		"published values as a user material)", class, strings.Join(names, ", "))
}

// VolumeFactor returns CV of glulam (NDS 2018 5.3.6, Eq. 5.3-1):
//
//	CV = (21/L)^(1/x) (12/d)^(1/x) (5.125/b)^(1/x) <= 1.0
//
// with L the length between points of zero moment in ft (the span of a
// simple beam; the longest span is taken for a continuous one, which errs
// low), d and b in inches, x = 20 for Southern Pine and 10 otherwise.
func VolumeFactor(lFt, dIn, bIn, x float64) float64 {
	if lFt <= 0 || dIn <= 0 || bIn <= 0 || x <= 0 {
		return 1
	}
	cv := math.Pow(21/lFt, 1/x) * math.Pow(12/dIn, 1/x) * math.Pow(5.125/bIn, 1/x)
	return math.Min(cv, 1)
}
