package pipeline

import (
	"fmt"
	"math/rand/v2"
	"runtime"
	"slices"
	"testing"

	"framecheck/check"
	"framecheck/internal/par"
)

// TestGroupAlikeAsByKey: groupAlike numbers the groups of identical
// members as one map of check.MemberKey over the whole plan, in plan order,
// would (each member's group, each group's first member), on one core and
// on several, with members alike in far-apart ranges and unusable members
// mixed in (common practice, no source).
func TestGroupAlikeAsByKey(t *testing.T) {
	rng := rand.New(rand.NewPCG(8, 3))
	n := 4*par.MinPerWorker + 123
	inputs := make([]check.Member, n)
	usable := make([]bool, n)
	for k := range inputs {
		v := rng.IntN(37)
		if k > n/2 && rng.IntN(3) == 0 {
			v += 37 // keys first met in the later ranges
		}
		inputs[k] = check.Member{ID: fmt.Sprintf("M%d", k+1), Size: "2x10", LengthIn: 120 + float64(v),
			Bearings: []check.Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 120 + float64(v), LengthIn: 3.5}}}
		usable[k] = rng.IntN(20) > 0
	}
	wantTwin, wantFirst := make([]int, n), []int(nil)
	byKey := map[string]int{}
	for k := range inputs {
		wantTwin[k] = -1
		if !usable[k] {
			continue
		}
		key := check.MemberKey(inputs[k])
		g, ok := byKey[key]
		if !ok {
			g = len(wantFirst)
			byKey[key] = g
			wantFirst = append(wantFirst, k)
		}
		wantTwin[k] = g
	}
	for _, procs := range []int{1, 2, 3, 8} {
		old := runtime.GOMAXPROCS(procs)
		twin, first := groupAlike(inputs, usable)
		runtime.GOMAXPROCS(old)
		if !slices.Equal(twin, wantTwin) || !slices.Equal(first, wantFirst) {
			t.Errorf("%d cores: %d groups, first %v...; want %d groups, first %v...", procs, len(first), first[:min(5, len(first))],
				len(wantFirst), wantFirst[:min(5, len(wantFirst))])
		}
	}
}
