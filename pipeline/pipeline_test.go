package pipeline

import (
	"cmp"
	"math"
	"slices"
	"strings"
	"testing"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
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
	for deg := 0; deg <= 90; deg += 5 {
		p := turnedPlan(float64(deg), []float64{0, 144}, 5)
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

// turnedPlan draws n joists 24 in on centre over walls at walls (inches
// along the joists) in a plan in millimetres turned deg degrees, each
// point read back in inches as dxfimport reads it (times 1/25.4), and
// groups it.
func turnedPlan(deg float64, walls []float64, n int) *framing.Plan {
	const mm = 25.4
	toInch := 1 / mm
	th := deg * math.Pi / 180
	u := dxfimport.Point{X: math.Cos(th), Y: math.Sin(th)} // along the joists
	v := dxfimport.Point{X: -u.Y, Y: u.X}                  // across them
	at := func(along, across float64) dxfimport.Point {
		x := (1000 + along*u.X + across*v.X) * mm
		y := (2000 + along*u.Y + across*v.Y) * mm
		return dxfimport.Point{X: x * toInch, Y: y * toInch}
	}
	d := &dxfimport.Drawing{File: "t.dxf", Units: "mm", ToInch: toInch}
	line := func(layer string, a, b dxfimport.Point) {
		d.Entities = append(d.Entities, dxfimport.Entity{Kind: dxfimport.KindLine,
			Pos: dxfimport.Pos{File: "t.dxf", Layer: layer}, Points: []dxfimport.Point{a, b}})
	}
	for _, y := range walls {
		line("WALL", at(y, -20), at(y, float64(n)*24))
	}
	for i := 0; i < n; i++ {
		line("JOIST", at(walls[0], float64(i)*24), at(walls[len(walls)-1], float64(i)*24))
	}
	o := framing.DefaultOptions()
	o.DefaultZone = "FLOOR"
	return framing.Group(d, o)
}

// TestTurnedPlanSameResults: the same joists drawn in millimetres and
// turned 0 to 90 degrees give the same results to the last bit, joist by
// joist (a single and a continuous span; blocking positions, measured from
// the drawn start, to 1e-9 in), and the interior joists, alike
// for design, are checked as one: their lengths measured with rounding
// (144.00000000000003 in) once made each its own calculation, with
// printed positions whose last digit moved with the angle. Common
// practice, no source: the drawing's angle and units are not engineering
// inputs.
func TestTurnedPlanSameResults(t *testing.T) {
	for _, walls := range [][]float64{{0, 168}, {0, 120, 264}} {
		var ref []check.Result
		for deg := 0; deg <= 90; deg += 15 {
			p := turnedPlan(float64(deg), walls, 6)
			o, err := Run(Input{Plan: p, Project: project.DefaultProject()})
			if err != nil {
				t.Fatal(err)
			}
			// joist by joist, in the order drawn (IDs follow the plan's
			// sorting, which the angle changes)
			got := make([]check.Result, len(o.Results))
			for k := range p.Members {
				got[k] = o.Results[k]
			}
			slices.SortFunc(got, func(a, b check.Result) int {
				return cmp.Compare(len(a.ID), len(b.ID))*2 + strings.Compare(a.ID, b.ID)
			})
			checks := map[*check.CheckResult]bool{}
			for _, r := range o.Results {
				if len(r.Checks) > 0 {
					checks[&r.Checks[0]] = true
				}
			}
			if len(checks) > 3 {
				t.Errorf("walls %v, %d degrees: %d distinct checks for 6 joists (edge, interior, edge), want at most 3", walls, deg, len(checks))
			}
			if ref == nil {
				ref = got
				continue
			}
			for i := range ref {
				a, b := ref[i], got[i]
				// positions along the member are measured from its drawn
				// start, whose place carries the rounding: to 1e-9 in
				rowsAlike := len(a.BlockingAtIn) == len(b.BlockingAtIn)
				for j := 0; rowsAlike && j < len(a.BlockingAtIn); j++ {
					rowsAlike = math.Abs(a.BlockingAtIn[j]-b.BlockingAtIn[j]) < 1e-9
				}
				if a.MaxRatio != b.MaxRatio || a.Governing != b.Governing || !slices.Equal(a.SpansIn, b.SpansIn) ||
					!rowsAlike || a.Status != b.Status {
					t.Errorf("walls %v, %d degrees, %s: %s %.17g spans %v rows %v; at 0 degrees %s %s %.17g spans %v rows %v",
						walls, deg, b.ID, b.Governing, b.MaxRatio, b.SpansIn, b.BlockingAtIn, a.ID, a.Governing, a.MaxRatio, a.SpansIn, a.BlockingAtIn)
				}
			}
		}
	}
}
