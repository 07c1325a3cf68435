package framing

import (
	"fmt"
	"testing"

	"framecheck/dxfimport"
)

// genPlan makes a plan of nJoists joists at 16 in o.c. spanning 144 in
// between rows of wall lines: 20 rows of 100 wall segments each (2,000
// support lines), every joist bearing on two of them.
func genPlan(nJoists int) *dxfimport.Drawing {
	const rows, cols, span, oc = 20, 100, 144.0, 16.0
	perCell := (nJoists + (rows-1)*cols - 1) / ((rows - 1) * cols)
	segLen := float64(perCell) * oc
	p := newPlan()
	for r := 0; r < rows; r++ {
		for c := 0; c < cols; c++ {
			x0 := float64(c) * segLen
			p.line("WALL", x0, float64(r)*span, x0+segLen, float64(r)*span)
		}
	}
	n := 0
	for r := 0; r < rows-1 && n < nJoists; r++ {
		for c := 0; c < cols && n < nJoists; c++ {
			for i := 0; i < perCell && n < nJoists; i++ {
				x := float64(c)*segLen + oc/2 + float64(i)*oc
				p.line("JOIST", x, float64(r)*span, x, float64(r+1)*span)
				n++
			}
		}
	}
	return &p.d
}

func BenchmarkGroup(b *testing.B) {
	for _, n := range []int{10_000, 100_000} {
		d := genPlan(n)
		opt := DefaultOptions()
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			for b.Loop() {
				pl := Group(d, opt)
				if len(pl.Members) != n {
					b.Fatalf("members = %d, want %d", len(pl.Members), n)
				}
			}
		})
	}
}

func TestGeneratedPlan(t *testing.T) {
	// the benchmark's plan must be what it claims: every joist a simple
	// 144 in span at 16 in (edge joists at the ends of each row: 8 in)
	pl := Group(genPlan(3000), DefaultOptions())
	if len(pl.Members) != 3000 || pl.Issues.Err() != nil {
		t.Fatalf("members %d, issues %v", len(pl.Members), pl.Issues.Err())
	}
	for _, m := range pl.Members {
		if s := m.Spans(); len(s) != 1 || !near(s[0], 144, 1e-9) || !(near(m.TribIn, 16, 1e-9) || near(m.TribIn, 8, 1e-9)) {
			t.Fatalf("%s spans %v trib %g", m.ID, s, m.TribIn)
		}
	}
}
