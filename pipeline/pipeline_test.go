package pipeline

import (
	"testing"

	"framecheck/dxfimport"
	"framecheck/framing"
)

// plan builds joists (vertical lines x = xs[i], from y0[i] to y1[i]) over
// walls at y = 0, 144 and 200 (single lines on WALL) and groups them.
func repetitivePlan(xs, y0, y1 []float64) *framing.Plan {
	d := &dxfimport.Drawing{File: "t.dxf", Units: "in", ToInch: 1}
	line := func(layer string, a, b dxfimport.Point) {
		d.Entities = append(d.Entities, dxfimport.Entity{Kind: dxfimport.KindLine,
			Pos: dxfimport.Pos{File: "t.dxf", Layer: layer}, Points: []dxfimport.Point{a, b}})
	}
	for _, y := range []float64{0, 144, 200} {
		line("WALL", dxfimport.Point{X: -20, Y: y}, dxfimport.Point{X: 200, Y: y})
	}
	for i, x := range xs {
		line("JOIST", dxfimport.Point{X: x, Y: y0[i]}, dxfimport.Point{X: x, Y: y1[i]})
	}
	o := framing.DefaultOptions()
	o.DefaultZone = "FLOOR"
	return framing.Group(d, o)
}

// NDS 2018 4.3.9: Cr applies to joists "not less than 3 in number", "not
// more than 24 in on centers", joined by a load-distributing element.
func TestRepetitive_NDS2018_4_3_9(t *testing.T) {
	all := func(p *framing.Plan) (out []bool) {
		for k := range p.Members {
			out = append(out, repetitive(p, k))
		}
		return out
	}
	eq := func(a, b []bool) bool {
		if len(a) != len(b) {
			return false
		}
		for i := range a {
			if a[i] != b[i] {
				return false
			}
		}
		return true
	}
	cases := []struct {
		name       string
		xs, y0, y1 []float64
		want       []bool
	}{
		{"two joists", []float64{0, 16}, []float64{0, 0}, []float64{144, 144}, []bool{false, false}},
		{"three at 16", []float64{0, 16, 32}, []float64{0, 0, 0}, []float64{144, 144, 144}, []bool{true, true, true}},
		{"three at 30", []float64{0, 30, 60}, []float64{0, 0, 0}, []float64{144, 144, 144}, []bool{false, false, false}},
		// The middle joist runs on to the third wall: its run differs from
		// its neighbours', but the three still share the sheathing.
		{"neighbours with other bearings", []float64{0, 16, 32}, []float64{0, 0, 0}, []float64{144, 200, 144}, []bool{true, true, true}},
	}
	for _, c := range cases {
		p := repetitivePlan(c.xs, c.y0, c.y1)
		if got := all(p); !eq(got, c.want) {
			t.Errorf("%s: repetitive %v, want %v", c.name, got, c.want)
		}
	}
}
