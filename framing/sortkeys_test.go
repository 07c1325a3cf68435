package framing

import (
	"cmp"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// TestOrderByKeysMatchesSort: the radix order is the comparison sort's on
// (group, value, value, whole number, index) for values with ties,
// negatives, -0 and infinities. Common practice, no source: slices.SortFunc is the
// reference.
func TestOrderByKeysMatchesSort(t *testing.T) {
	r := rand.New(rand.NewPCG(5, 6))
	special := []float64{0, math.Copysign(0, -1), math.Inf(1), math.Inf(-1), 1e-300, -1e-300, 1e300, -1e300, 0.5, -0.5}
	val := func() float64 {
		switch r.IntN(4) {
		case 0:
			return special[r.IntN(len(special))]
		case 1:
			return float64(r.IntN(5) - 2) // many ties
		default:
			return (r.Float64() - 0.5) * math.Pow(10, float64(r.IntN(20)-10))
		}
	}
	for trial := 0; trial < 50; trial++ {
		n := r.IntN(3000)
		type row struct {
			g    int
			a, b float64
			m    int64
			i    int
		}
		rows := make([]row, n)
		g, a, b, m := make([]uint64, n), make([]uint64, n), make([]uint64, n), make([]uint64, n)
		for i := range rows {
			rows[i] = row{r.IntN(3), val(), val(), r.Int64N(1e13) - 5e12, i}
			if r.IntN(3) == 0 {
				rows[i].m = int64(r.IntN(5) - 2) // ties
			}
			g[i], a[i], b[i], m[i] = uint64(rows[i].g), floatKey(rows[i].a), floatKey(rows[i].b), intKey(rows[i].m)
		}
		want := slices.Clone(rows)
		slices.SortFunc(want, func(x, y row) int {
			if c := cmp.Compare(x.g, y.g); c != 0 {
				return c
			}
			if c := cmp.Compare(x.a, y.a); c != 0 {
				return c
			}
			if c := cmp.Compare(x.b, y.b); c != 0 {
				return c
			}
			if c := cmp.Compare(x.m, y.m); c != 0 {
				return c
			}
			return cmp.Compare(x.i, y.i)
		})
		got := orderByKeys(n, g, a, b, m)
		for x := range want {
			if got[x] != want[x].i {
				t.Fatalf("trial %d, place %d: index %d, want %d", trial, x, got[x], want[x].i)
			}
		}
	}
}
