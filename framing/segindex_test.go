package framing

import (
	"math/rand/v2"
	"reflect"
	"testing"
)

// TestSegIndexFillMatchesInsert: filling a grid (in one span or several,
// as goroutines would) lists the same segments in the same order in every
// cell as inserting them one after another, for short segments, long
// diagonals crossing most of the grid and points. Common practice, no
// source: insert is the reference.
func TestSegIndexFillMatchesInsert(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for trial := 0; trial < 40; trial++ {
		n := 1 + r.IntN(400)
		segs := make([]segItem, n)
		for i := range segs {
			a := Point{X: r.Float64() * 5000, Y: r.Float64() * 3000}
			var b Point
			switch r.IntN(5) {
			case 0: // long, across the grid
				b = Point{X: r.Float64() * 5000, Y: r.Float64() * 3000}
			case 1: // a point
				b = a
			default:
				b = Point{X: a.X + (r.Float64()-0.5)*300, Y: a.Y + (r.Float64()-0.5)*300}
			}
			segs[i] = segItem{a: a, b: b}
		}
		lo, hi, typ := bounds(segs)
		want := newSegIndex(lo, hi, n, typ)
		for i, s := range segs {
			want.insert(i, s.a, s.b, 0)
		}
		for _, w := range []int{1, 2, 3, 8} {
			g := &grouper{workers: w, minChunk: 1}
			got := indexEnds(n, func(i int) (Point, Point) { return segs[i].a, segs[i].b }, g.split(n))
			for c := range want.cells {
				if len(want.cells[c]) == 0 && len(got.cells[c]) == 0 {
					continue
				}
				if !reflect.DeepEqual(want.cells[c], got.cells[c]) {
					t.Fatalf("trial %d, %d spans, cell %d: %v, want %v", trial, w, c, got.cells[c], want.cells[c])
				}
			}
		}
	}
}
