package check

import (
	"fmt"
	"math"
)

// SizeFactor4D marks timbers of NDS 2018 Supplement Table 4D: the size
// factor CF = (12/d)^(1/9) on Fb when d exceeds 12 in (NDS 2018 4.3.6.2),
// no repetitive member factor.
const SizeFactor4D = "4D"

// timberRow is one row of NDS 2018 Supplement Table 4D for Douglas
// Fir-Larch, psi: Fb, Ft, Fv, Fc_perp, Fc, E, Emin. All 42 values agree
// with StructuralTools/StructuralTools
// src/structuraltools/awc/resources/SawnLumber.csv @ 406ad958 (rows
// "Beam|Douglas Fir|..." and "Post|Douglas Fir|..."; that library names its
// species after the 2024 NDS Supplement), and the No.1 rows with the No.1
// DF-L timber values behind web.mst.edu/jthomas/classes/5260/problem/04/017
// (see docs/VERIFIED.md). A copy of the 2018 Supplement itself was not
// found.
type timberRow struct {
	grade                        string
	beams                        bool // beams and stringers; else posts and timbers
	fb, ft, fv, fcPerp, fc, e, m float64
}

var table4DDouglasFir = []timberRow{
	{"Select Structural", true, 1600, 950, 170, 625, 1100, 1.6e6, 580000},   // Table 4D, per SawnLumber.csv (docs/VERIFIED.md)
	{"No.1", true, 1350, 675, 170, 625, 925, 1.6e6, 580000},                 // Table 4D, per SawnLumber.csv (docs/VERIFIED.md)
	{"No.2", true, 875, 425, 170, 625, 600, 1.3e6, 470000},                  // Table 4D, per SawnLumber.csv (docs/VERIFIED.md)
	{"Select Structural", false, 1500, 1000, 170, 625, 1150, 1.6e6, 580000}, // Table 4D, per SawnLumber.csv (docs/VERIFIED.md)
	{"No.1", false, 1200, 825, 170, 625, 1000, 1.6e6, 580000},               // Table 4D, per SawnLumber.csv (docs/VERIFIED.md)
	{"No.2", false, 750, 475, 170, 625, 700, 1.3e6, 470000},                 // Table 4D, per SawnLumber.csv (docs/VERIFIED.md)
}

// timberValues returns the Table 4D values of a Douglas Fir-Larch timber of
// section sec: beams and stringers when d > b + 2 (nominal), posts and
// timbers otherwise (NDS 2018 Supplement Table 4D, size classification).
func timberValues(species, grade string, sec Section) (DesignValues, error) {
	if nameKey(species) != nameKey("Douglas Fir-Larch") && speciesAliases[nameKey(species)] != "Douglas Fir-Larch" {
		return DesignValues{}, fmt.Errorf("%s %s: timbers 5 in and thicker are built in for Douglas Fir-Larch only (NDS 2018 "+
			"Supplement Table 4D); give other species' timber values as a user material", species, sec.Name)
	}
	beams := sec.NominalDIn > sec.NominalBIn+2
	g := gradeKey(grade)
	for _, r := range table4DDouglasFir {
		if r.beams == beams && gradeKey(r.grade) == g {
			class := "posts and timbers"
			if beams {
				class = "beams and stringers"
			}
			return DesignValues{Species: "Douglas Fir-Larch", Grade: r.grade, FbPsi: r.fb, FtPsi: r.ft, FvPsi: r.fv,
				FcPerpPsi: r.fcPerp, FcPsi: r.fc, EPsi: r.e, EminPsi: r.m, SizeFactor: SizeFactor4D,
				Source: "NDS 2018 Supplement Table 4D, " + class}, nil
		}
	}
	return DesignValues{}, fmt.Errorf("Douglas Fir-Larch timber grade %q: want Select Structural, No.1 or No.2 (NDS 2018 Supplement Table 4D)", grade)
}

// timberSizeFactor is CF of a timber (NDS 2018 4.3.6.2): (12/d)^(1/9) on
// Fb when d > 12 in, else 1.0.
func timberSizeFactor(dIn float64) float64 {
	if dIn <= 12 {
		return 1
	}
	return math.Pow(12/dIn, 1.0/9)
}
