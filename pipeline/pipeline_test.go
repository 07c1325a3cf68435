package pipeline

import (
	"math"
	"testing"

	"framecheck/check"
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

// TestRepetitiveAt24InAnyAngle: five joists drawn 24 in on centre (609.6
// mm) in a plan in millimetres, turned 0 to 90 degrees in 5 degree steps,
// are repetitive members with Cr 1.15 at every angle (NDS 2018 4.3.9: not
// more than 24 in on centre). The points are the drawing's millimetres
// times 1/25.4, as dxfimport reads them, so the spacing measured carries
// the rounding a real drawing's does (24.000000000000014 in at 30
// degrees), which once took Cr off some of them, by angle.
func TestRepetitiveAt24InAnyAngle(t *testing.T) {
	const mm = 25.4
	toInch := 1 / mm
	for deg := 0; deg <= 90; deg += 5 {
		th := float64(deg) * math.Pi / 180
		u := dxfimport.Point{X: math.Cos(th), Y: math.Sin(th)} // along the joists
		n := dxfimport.Point{X: -u.Y, Y: u.X}                  // across them
		// a point given in inches along and across, drawn in whole
		// tenths of a millimetre as CAD stores it, read back in inches
		at := func(along, across float64) dxfimport.Point {
			x := math.Round((1000+along*u.X+across*n.X)*mm*10) / 10
			y := math.Round((2000+along*u.Y+across*n.Y)*mm*10) / 10
			return dxfimport.Point{X: x * toInch, Y: y * toInch}
		}
		d := &dxfimport.Drawing{File: "t.dxf", Units: "mm", ToInch: toInch}
		line := func(layer string, a, b dxfimport.Point) {
			d.Entities = append(d.Entities, dxfimport.Entity{Kind: dxfimport.KindLine,
				Pos: dxfimport.Pos{File: "t.dxf", Layer: layer}, Points: []dxfimport.Point{a, b}})
		}
		for _, y := range []float64{0, 144} {
			line("WALL", at(y, -20), at(y, 120))
		}
		for i := 0; i < 5; i++ {
			line("JOIST", at(0, float64(i)*24), at(144, float64(i)*24))
		}
		o := framing.DefaultOptions()
		o.DefaultZone = "FLOOR"
		p := framing.Group(d, o)
		if len(p.Members) != 5 {
			t.Fatalf("%d degrees: %d members, want 5", deg, len(p.Members))
		}
		over := 0
		for k := range p.Members {
			m := &p.Members[k]
			if m.SpacingIn > 24 {
				over++
			}
			if !repetitive(p, k) {
				t.Errorf("%d degrees: %s not repetitive (gaps %v)", deg, m.ID, m.NeighbourGapsIn)
			}
			if cr := check.RepetitiveMemberFactor(m.SpacingIn, true); cr != 1.15 {
				t.Errorf("%d degrees: %s spacing %.17g in (gaps %v): Cr %v, want 1.15", deg, m.ID, m.SpacingIn, m.NeighbourGapsIn, cr)
			}
		}
		if deg == 30 && over == 0 {
			t.Errorf("30 degrees: no spacing measured over 24 in: the test no longer has the rounding it is about")
		}
	}
}
