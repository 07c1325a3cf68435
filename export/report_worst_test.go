package export

import (
	"cmp"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
	"time"
)

// The worst members' list (one line per mark, its worst member, failing
// first, then by ratio, then in plan order) against the list found by
// putting every member in that order and taking each mark's first
// (common practice, no source: the rule the report states).
func TestWorstRowsAsByFullOrder(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	for trial := 0; trial < 200; trial++ {
		n := 1 + rng.IntN(300)
		r := &Results{Plan: "p.dxf"}
		for i := 0; i < n; i++ {
			m := Member{ID: fmt.Sprintf("M%d", i+1), Status: StatusPass}
			if rng.IntN(5) > 0 {
				m.Mark = fmt.Sprintf("J%d", 1+rng.IntN(12))
			}
			m.MaxRatio = float64(rng.IntN(8)) / 4 // ties are common
			switch rng.IntN(10) {
			case 0:
				m.Status = StatusFail
			case 1:
				m.Status = StatusError
			case 2:
				m.MaxRatio = math.NaN()
			}
			r.Members = append(r.Members, m)
		}
		got := buildReport(r, &PlanGeometry{}, time.Time{}).Worst
		want := worstByFullOrder(r)
		if len(got) != len(want) {
			t.Fatalf("trial %d: %d rows, want %d", trial, len(got), len(want))
		}
		for i := range got {
			if got[i].ID != want[i].ID || got[i].Count != want[i].Count {
				t.Fatalf("trial %d row %d: %s (%d), want %s (%d)", trial, i, got[i].ID, got[i].Count, want[i].ID, want[i].Count)
			}
		}
	}
}

// worstByFullOrder is the list as the report made it before: every
// checked member sorted, each mark's first taken.
func worstByFullOrder(r *Results) []worstRow {
	var idx []int
	for i := range r.Members {
		if r.Members[i].Status != StatusError {
			idx = append(idx, i)
		}
	}
	slices.SortFunc(idx, func(a, b int) int {
		ma, mb := &r.Members[a], &r.Members[b]
		return cmp.Or(cmp.Compare(failRank(mb.Status), failRank(ma.Status)),
			cmp.Compare(ratioKey(mb.MaxRatio), ratioKey(ma.MaxRatio)), cmp.Compare(a, b))
	})
	key := func(m *Member) string {
		if m.Mark != "" {
			return "mark " + m.Mark
		}
		return "member " + m.ID
	}
	count := map[string]int{}
	for _, i := range idx {
		count[key(&r.Members[i])]++
	}
	var out []worstRow
	shown := map[string]bool{}
	for _, i := range idx {
		m := &r.Members[i]
		if k := key(m); !shown[k] && len(out) < worstShown {
			shown[k] = true
			w := newWorstRow(m)
			w.Count = count[k]
			out = append(out, w)
		}
	}
	return out
}
