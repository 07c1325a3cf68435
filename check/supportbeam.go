package check

import (
	"fmt"
	"strings"
)

// BeamFcPerp is the part of a supporting beam's Fc_perp' that does not
// depend on the member bearing on it: its reference Fc_perp and its own
// factors on it (see SupportBeam). Cb, which depends on the member's
// width and place, is applied by the member's check.
type BeamFcPerp struct {
	Name       string  // its material, "Glulam 24F-1.8E", "Douglas Fir-Larch No.2", "LVL 2.0E"
	FcPerpPsi  float64 // reference Fc_perp
	CM, Ct, Ci float64 // its wet service, temperature and incising factors on Fc_perp
	// Ref is the table of its adjustment factors: NDS 2018 Table 4.3.1
	// (sawn), 5.3.1 (glulam) or 8.3.1 (structural composite lumber).
	Ref string
}

// AdjNoCbPsi returns Fc_perp CM Ct Ci: the beam's Fc_perp' before Cb.
func (v BeamFcPerp) AdjNoCbPsi() float64 { return v.FcPerpPsi * v.CM * v.Ct * v.Ci }

// SupportBeamValues returns the Fc_perp of a beam of the given material
// and size and its factors under settings s (NDS 2018 Table 4.3.1 for
// sawn lumber and timbers: CM from the Supplement's table notes, Ct from
// Table 2.3.3, Ci from Table 4.3.8; Table 5.3.1 for glulam and Table 8.3.1
// for structural composite lumber: CM and Ct, no Ci; from memory: verify
// for Tables 5.3.1 and 8.3.1). It refuses what the beam's own check
// refuses: an unknown material or size, and wet service of timbers, glulam
// and SCL, whose wet-service factors framecheck does not apply.
//
// Glulam takes its stress class's one Fc_perp x (glulam.go) for the face
// the joists bear on, the top (compression) face under gravity; NDS 2018
// Supplement Table 5A gives a tension-face and a compression-face value,
// the same for the E-rated classes framecheck holds (from memory: verify).
func SupportBeamValues(species, grade, size string, s Settings) (BeamFcPerp, error) {
	sec, err := ParseSize(size)
	if err != nil {
		return BeamFcPerp{}, err
	}
	mats := s.Materials
	if mats == nil {
		mats = BuiltinMaterials()
	}
	dv, err := mats.Lookup(species, grade, size)
	if err != nil {
		return BeamFcPerp{}, err
	}
	ct, err := TemperatureFactor(s.Temperature, s.WetService)
	if err != nil {
		return BeamFcPerp{}, err
	}
	v := BeamFcPerp{Name: strings.TrimSpace(dv.Species + " " + dv.Grade), FcPerpPsi: dv.FcPerpPsi, CM: 1, Ct: ct.FcPerp, Ci: 1}
	switch dv.SizeFactor {
	case SizeFactorGlulam:
		if s.WetService {
			return v, fmt.Errorf("glulam in wet service: the wet-service factors of NDS 2018 Supplement Table 5A are not applied by framecheck")
		}
		if !sec.Actual {
			return v, fmt.Errorf("size %s: glulam is sized by its actual inches (such as 5.125x12 or 5 1/8 x 12)", size)
		}
		v.Ref = "NDS 2018 Table 5.3.1 (from memory: verify)"
	case SizeFactorSCL:
		if s.WetService {
			return v, fmt.Errorf("%s in wet service: structural composite lumber takes its wet-service factors from the manufacturer "+
				"(NDS 2018 8.3.3, from memory: verify), which framecheck does not apply", dv.Species)
		}
		v.Ref = "NDS 2018 Table 8.3.1 (from memory: verify)"
	default:
		if dv.SizeFactor == SizeFactor4D && s.WetService {
			return v, fmt.Errorf("size %s: timbers in wet service: the wet-service factors of NDS 2018 Supplement Table 4D are not applied by framecheck", size)
		}
		if sec.Actual {
			return v, fmt.Errorf("size %s: sawn lumber of %s is sized by its nominal size (such as 2x10 or 4x12), not by actual inches", size, dv.Species)
		}
		cf := SizeFactor(dv, sec)
		v.CM = WetServiceFactor(s.WetService, dv, cf.Fb, cf.Fc).FcPerp
		v.Ci = IncisingFactor(s.Incised).FcPerp
		v.Ref = "NDS 2018 Table 4.3.1"
	}
	return v, nil
}

// beamCb returns Cb of a supporting beam (NDS 2018 3.10.4) under a member
// bIn wide whose centre-line lies endIn from the beam's nearer end
// (SupportBeam.EndIn): the bearing length along the beam's grain is b,
// its edge endIn - b/2 from the end.
func beamCb(bIn, endIn float64) float64 {
	if endIn <= 0 {
		return 1
	}
	return BearingAreaFactor(bIn, endIn-bIn/2)
}
