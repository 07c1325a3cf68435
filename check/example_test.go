package check_test

import (
	"fmt"

	"framecheck/check"
)

// A DF-L No.2 2x10 floor joist at 16 in on centre, 14 ft centre to centre
// of 3.5 in bearings, 10 psf dead and 40 psf live.
func ExampleCheckMember() {
	m := check.Member{
		ID: "J1", Size: "2x10", Species: "DF-L", Grade: "No.2",
		LengthIn:  14*12 + 3.5,
		Bearings:  []check.Bearing{{AtIn: 1.75, LengthIn: 3.5}, {AtIn: 14*12 + 1.75, LengthIn: 3.5}},
		SpacingIn: 16, TribIn: 16, Use: "floor",
		Loads:     check.AreaLoads{DeadPsf: 10, LivePsf: 40},
		LiveLimit: 360, TotalLimit: 240, Repetitive: true,
	}
	r := check.CheckMember(m, check.DefaultSettings())
	fmt.Println(r.ID, r.Size, r.Species, r.Grade, r.Status)
	for _, c := range r.Checks {
		fmt.Printf("%-16s %-14s %8.3f %8.3f %-3s %.3f\n", c.Kind, c.Combo, c.Actual, c.Allowable, c.Unit, c.Ratio)
	}
	fmt.Printf("governing %s %.3f\n", r.Governing, r.MaxRatio)
	// Output:
	// J1 2x10 Douglas Fir-Larch No.2 pass
	// bending-top      D+L             916.289 1138.500 psi 0.805
	// shear            D+L              50.450  180.000 psi 0.280
	// deflection-live  L, span 1         0.291    0.467 in  0.624
	// deflection-total 0.5D+L, span 1    0.328    0.700 in  0.468
	// bearing          D+L              90.741  625.000 psi 0.145
	// governing bending-top 0.805
}

// Sizing a roof joist under wind uplift: the deeper joist needs fewer
// blocking rows, and the blocking weight decides which is economical.
func ExampleSize() {
	m := check.Member{
		ID: "R1", Species: "DF-L", Grade: "No.2", LengthIn: 216,
		Bearings:  []check.Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 216, LengthIn: 1.5}},
		SpacingIn: 24, TribIn: 24, Use: "roof",
		Loads:     check.AreaLoads{DeadPsf: 8, RoofLivePsf: 20, WindUpPsf: 50},
		LiveLimit: 180, TotalLimit: 120, Repetitive: true,
	}
	sz := check.Size(m, check.DefaultSettings(), []string{"2x8", "2x10", "2x12"}, 2.0)
	for _, a := range sz.Alternatives {
		fmt.Printf("%-5s rows/span %d  max ratio %.3f  %.2f bf/ft  cost %.1f bf  pass %v\n",
			a.Size, a.RowsPerSpan, a.MaxRatio, a.BoardFeetPerFt, a.Cost, a.Pass)
	}
	fmt.Println("chosen", sz.Chosen.Size, sz.Chosen.BlockingAtIn)
	// Output:
	// 2x8   rows/span 6  max ratio 1.334  1.33 bf/ft  cost 36.0 bf  pass false
	// 2x10  rows/span 3  max ratio 0.894  1.67 bf/ft  cost 36.0 bf  pass true
	// 2x12  rows/span 2  max ratio 0.872  2.00 bf/ft  cost 40.0 bf  pass true
	// chosen 2x10 [54 108 162]
}
