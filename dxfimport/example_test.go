package dxfimport_test

import (
	"fmt"
	"strings"

	"framecheck/dxfimport"
)

// A plan in millimetres with one joist drawn as a LINE and one inside a
// block inserted on layer JOIST-2: both come back in inches, world
// coordinates, the block entity on layer "0" taking the INSERT's layer.
func ExampleRead() {
	plan := strings.Join([]string{
		"0", "SECTION", "2", "HEADER", "9", "$INSUNITS", "70", "4", "0", "ENDSEC",
		"0", "SECTION", "2", "BLOCKS",
		"0", "BLOCK", "2", "J", "10", "0", "20", "0",
		"0", "LINE", "8", "0", "10", "0", "20", "0", "11", "0", "21", "2540",
		"0", "ENDBLK",
		"0", "ENDSEC",
		"0", "SECTION", "2", "ENTITIES",
		"0", "LINE", "5", "2F", "8", "JOIST-1", "10", "0", "20", "0", "11", "0", "21", "3048",
		"0", "INSERT", "5", "30", "8", "JOIST-2", "2", "J", "10", "406.4", "20", "0",
		"0", "ENDSEC", "0", "EOF",
	}, "\n") + "\n"
	d, err := dxfimport.Read(strings.NewReader(plan), "plan.dxf", dxfimport.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, e := range d.Entities {
		fmt.Printf("%s %s %.2f\n", e.Kind, e.Pos, e.Points)
	}
	// Output:
	// LINE plan.dxf:43 (handle 2F, layer JOIST-1) [{0.00 0.00} {0.00 120.00}]
	// LINE plan.dxf:23 (layer JOIST-2) [{16.00 0.00} {16.00 100.00}]
}
