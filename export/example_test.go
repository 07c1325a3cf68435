package export_test

import (
	"fmt"

	"framecheck/export"
)

func ExampleFtIn() {
	fmt.Println(export.FtIn(150.5), export.FtIn(144), export.FtIn(14.5))
	// Output: 12'-6 1/2" 12'-0" 1'-2 1/2"
}

func ExampleMarkupFromResults() {
	r := &export.Results{Members: []export.Member{
		{ID: "M1", Mark: "J1", Start: [2]float64{0, 0}, End: [2]float64{12, 0}, Status: export.StatusFail, MaxRatio: 1.07, SpacingIn: 16,
			Size: "2x10", Governing: export.KindBendingTop},
	}}
	m := export.MarkupFromResults(r, 12) // drawing in feet
	fmt.Println(len(m.Highlights), m.Labels[0].Text, m.Labels[0].At, m.TextHeightIn)
	// Output: 1 J1 2x10@16 BENDING 1.07 [72 -8] 1.2
}
