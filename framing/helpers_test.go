package framing

import (
	"fmt"
	"math"
	"testing"

	"framecheck/dxfimport"
)

// plan builds a Drawing in Go: each helper appends one entity with a new
// handle, in world inches.
type plan struct {
	d      dxfimport.Drawing
	handle int
}

func newPlan() *plan { return &plan{d: dxfimport.Drawing{File: "test.dxf", Units: "in", ToInch: 1}} }

func (p *plan) pos(layer string) dxfimport.Pos {
	p.handle++
	return dxfimport.Pos{File: "test.dxf", Line: 10 * p.handle, Handle: fmt.Sprintf("%X", 0x100+p.handle), Layer: layer}
}

func (p *plan) line(layer string, x0, y0, x1, y1 float64) *plan {
	p.d.Entities = append(p.d.Entities, dxfimport.Entity{Kind: dxfimport.KindLine, Pos: p.pos(layer),
		Points: []Point{{X: x0, Y: y0}, {X: x1, Y: y1}}})
	return p
}

func (p *plan) poly(layer string, closed bool, pts ...Point) *plan {
	p.d.Entities = append(p.d.Entities, dxfimport.Entity{Kind: dxfimport.KindLWPolyline, Pos: p.pos(layer),
		Points: pts, Closed: closed})
	return p
}

func (p *plan) text(layer, s string, x, y, h float64) *plan {
	p.d.Entities = append(p.d.Entities, dxfimport.Entity{Kind: dxfimport.KindText, Pos: p.pos(layer),
		Points: []Point{{X: x, Y: y}}, Text: s, HeightIn: h})
	return p
}

// joists draws vertical joists at each x from y0 to y1.
func (p *plan) joists(y0, y1 float64, xs ...float64) *plan {
	for _, x := range xs {
		p.line("JOIST", x, y0, x, y1)
	}
	return p
}

// walls draws horizontal single-line walls at each y from x0 to x1.
func (p *plan) walls(x0, x1 float64, ys ...float64) *plan {
	for _, y := range ys {
		p.line("WALL", x0, y, x1, y)
	}
	return p
}

// transform maps every point of the drawing through f.
func (p *plan) transform(f func(Point) Point) *plan {
	for i := range p.d.Entities {
		for j, q := range p.d.Entities[i].Points {
			p.d.Entities[i].Points[j] = f(q)
		}
	}
	return p
}

func (p *plan) group(opt Options) *Plan { return Group(&p.d, opt) }

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

func checkNear(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if !near(got, want, tol) {
		t.Errorf("%s = %.4f, want %.4f (tol %g)", what, got, want, tol)
	}
}

// member returns the member whose midpoint is nearest (x, y).
func member(t *testing.T, pl *Plan, x, y float64) *Member {
	t.Helper()
	best, bi := math.Inf(1), -1
	for i := range pl.Members {
		m := &pl.Members[i]
		if d := dist(mid(m.Start, m.End), Point{X: x, Y: y}); d < best {
			best, bi = d, i
		}
	}
	if bi < 0 || best > 1 {
		t.Fatalf("no member with midpoint near (%g, %g)", x, y)
	}
	return &pl.Members[bi]
}

func issueCodes(l dxfimport.IssueList) map[string]int {
	c := map[string]int{}
	for _, i := range l {
		c[i.Code]++
	}
	return c
}
