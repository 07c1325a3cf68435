package beam

import "testing"

// benchCases are the member shapes package check solves most: a simple
// span, two spans with a cantilever, four spans.
var benchCases = []struct {
	name string
	b    Beam
	w    []float64
}{
	{"1span", Beam{LengthIn: 168, SupportsAtIn: []float64{0, 168}, EILbIn2: 1.6e6 * 98.93}, []float64{4.2}},
	{"2span+cant", Beam{LengthIn: 330, SupportsAtIn: []float64{0, 144, 300}, EILbIn2: 1.6e6 * 98.93}, []float64{4.2, 3.1, 4.2}},
	{"4span", Beam{LengthIn: 480, SupportsAtIn: []float64{0, 120, 240, 360, 480}, EILbIn2: 1.6e6 * 98.93}, []float64{4.2, -1, 4.2, 2}},
}

var sink float64

// BenchmarkSolve measures Solve, which allocates one Response.
func BenchmarkSolve(b *testing.B) {
	for _, c := range benchCases {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				r, err := c.b.Solve(c.w)
				if err != nil {
					b.Fatal(err)
				}
				sink += r.reactions[0]
			}
		})
	}
}

// BenchmarkSolveInto measures SolveInto reusing one Response (no
// allocation).
func BenchmarkSolveInto(b *testing.B) {
	for _, c := range benchCases {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			var r Response
			for b.Loop() {
				if err := c.b.SolveInto(&r, c.w); err != nil {
					b.Fatal(err)
				}
				sink += r.reactions[0]
			}
		})
	}
}

// BenchmarkQueries measures the queries a member check makes after a
// solve: moment extremes, sign changes, largest deflection.
func BenchmarkQueries(b *testing.B) {
	for _, c := range benchCases {
		r, err := c.b.Solve(c.w)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				mp, _, mn, _ := r.MomentExtremes(0, c.b.LengthIn)
				d, _ := r.MaxDeflection(0, c.b.LengthIn)
				sink += mp + mn + d + float64(len(r.MomentSignChanges()))
			}
		})
	}
}
