package beam_test

import (
	"fmt"

	"framecheck/check/beam"
)

// A joist continuous over two 12 ft spans with a 2 ft overhang at the
// right end, 40 plf (3.333 lb/in) on every segment.
func Example() {
	b := beam.Beam{
		LengthIn:     312,                    // 26 ft
		SupportsAtIn: []float64{0, 144, 288}, // bearings at 0, 12 and 24 ft
		EILbIn2:      1.6e6 * 98.93,          // 2x10, E = 1,600,000 psi
	}
	w := 40.0 / 12 // 40 plf in lb/in
	r, err := b.Solve([]float64{w, w, w})
	if err != nil {
		fmt.Println(err)
		return
	}
	for i, R := range r.Reactions() {
		fmt.Printf("R%d = %.1f lb\n", i+1, R)
	}
	mPos, xPos, mNeg, xNeg := r.MomentExtremes(0, b.LengthIn)
	fmt.Printf("M+ = %.0f lb-in at %.1f in; M- = %.0f lb-in at %.1f in\n", mPos, xPos, mNeg, xNeg)
	fmt.Printf("moment changes sign at %.1f in\n", r.MomentSignChanges())
	d, x := r.MaxDeflection(0, 144)
	fmt.Printf("span 1 deflection %.3f in at %.1f in; tip %.4f in\n", d, x, r.Deflection(b.LengthIn))
	// Checked by hand (three-moment equation): M over the overhang
	// bearing -w 24^2/2 = -960; 2 M2 (144+144) + 144 (-960) = -w 2 144^3/4
	// gives M2 = -8400 lb-in; R1 = 240 - 8400/144 = 181.7 lb, M+ = R1^2/2w
	// at R1/w, zero moment at 2 R1/w = 109 in.

	// Output:
	// R1 = 181.7 lb
	// R2 = 590.0 lb
	// R3 = 268.3 lb
	// M+ = 4950 lb-in at 54.5 in; M- = -8400 lb-in at 144.0 in
	// moment changes sign at [109.0 180.4 282.6] in
	// span 1 deflection 0.051 in at 61.3 in; tip -0.0245 in
}
