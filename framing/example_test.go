package framing_test

import (
	"fmt"

	"framecheck/dxfimport"
	"framecheck/framing"
)

func line(layer string, x0, y0, x1, y1 float64) dxfimport.Entity {
	return dxfimport.Entity{Kind: dxfimport.KindLine, Pos: dxfimport.Pos{Layer: layer},
		Points: []dxfimport.Point{{X: x0, Y: y0}, {X: x1, Y: y1}}}
}

// Three joists at 16 in o.c. over two walls 144 in apart, the last one
// running 24 in past the far wall.
func ExampleGroup() {
	d := &dxfimport.Drawing{File: "plan.dxf", Entities: []dxfimport.Entity{
		line("WALL", -12, 0, 60, 0),
		line("WALL", -12, 144, 60, 144),
		line("JOIST", 0, 0, 0, 144),
		line("JOIST", 16, 0, 16, 144),
		line("JOIST", 32, 0, 32, 168),
	}}
	p := framing.Group(d, framing.DefaultOptions())
	for _, m := range p.Members {
		fmt.Printf("%s spans %v overhang %g in, trib %g in, %s, zone %v, run %s\n",
			m.ID, m.Spans(), m.OverhangEndIn, m.TribIn, m.Size, m.Zones, p.Runs[m.Run].ID)
	}
	// Output:
	// M1 spans [144] overhang 0 in, trib 8 in, 2x10, zone [FLOOR], run R1
	// M2 spans [144] overhang 0 in, trib 16 in, 2x10, zone [FLOOR], run R1
	// M3 spans [144] overhang 24 in, trib 8 in, 2x10, zone [FLOOR], run R1
}
