package export

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// groupRows against the plain rule it implements (common practice, no
// source): items with equal keys share a row, in the order of their first
// item, at most most a row (then a new row for the next ones), an item
// whose key is not ok alone; NaN keys never equal.
func TestGroupRowsAsByMap(t *testing.T) {
	rng := rand.New(rand.NewPCG(9, 2))
	for trial := 0; trial < 300; trial++ {
		n := rng.IntN(200)
		most := 1 + rng.IntN(6)
		keys := make([]float64, n)
		oks := make([]bool, n)
		for i := range keys {
			switch {
			case i > 0 && rng.IntN(3) > 0:
				keys[i] = keys[i-1] // runs of alike items
			case rng.IntN(20) == 0:
				keys[i] = math.NaN()
			default:
				keys[i] = float64(rng.IntN(5))
			}
			oks[i] = rng.IntN(15) > 0
		}
		got := groupRows(n, most, func(i int) (float64, bool) { return keys[i], oks[i] })
		want := groupRowsByMap(n, most, keys, oks)
		if len(got) != len(want) {
			t.Fatalf("trial %d: %d rows, want %d", trial, len(got), len(want))
		}
		for i := range got {
			if !slices.Equal(got[i].items, want[i]) {
				t.Fatalf("trial %d row %d: %v, want %v", trial, i, got[i].items, want[i])
			}
		}
	}
}

func groupRowsByMap(n, most int, keys []float64, oks []bool) [][]int {
	var rows [][]int
	open := map[float64]int{}
	for i := 0; i < n; i++ {
		if !oks[i] {
			rows = append(rows, []int{i})
			continue
		}
		if g, ok := open[keys[i]]; ok && len(rows[g]) < most {
			rows[g] = append(rows[g], i)
			continue
		}
		open[keys[i]] = len(rows)
		rows = append(rows, []int{i})
	}
	return rows
}
