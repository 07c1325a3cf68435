package framing

import (
	"fmt"
	"math"
	"sort"
)

// maxNeighbourGapIn: a parallel joist farther away than this is not a
// neighbour; the joist is an edge joist on that side (common practice, no
// source: no floor joists sit 10 ft apart).
const maxNeighbourGapIn = 120

// minNeighbourGapIn: parallel joists closer than this (pieces drawn on one
// line) are not each other's neighbours.
const minNeighbourGapIn = 0.5

// minOverlapFrac: a parallel joist is a neighbour only when the extents
// overlap by more than the snap tolerance and by at least this fraction of
// the shorter of the two, so joists lapped over a bearing (drawn 1.5 in
// apart, overlapping by the lap only) do not take each other as the
// neighbour (common practice, no source).
const minOverlapFrac = 0.5

// neighbours finds, per member, the nearest parallel joist on each side
// whose extent overlaps its own by more than the snap tolerance, with one
// sort per direction group and a short scan, and sets the tributary widths
// and spacing.
func (g *grouper) neighbours() {
	p := g.plan
	n := len(p.Members)
	order := make([]int, n)
	for i := range order {
		order[i] = i
	}
	sort.Slice(order, func(x, y int) bool {
		a, b := order[x], order[y]
		if g.grp[a] != g.grp[b] {
			return g.grp[a] < g.grp[b]
		}
		if p.across[a] != p.across[b] {
			return p.across[a] < p.across[b]
		}
		return a < b
	})
	g.lo, g.hi = make([]int, n), make([]int, n)
	tol := g.opt.SnapToleranceIn
	overlaps := func(a, b int) bool {
		ov := math.Min(g.a1[a], g.a1[b]) - math.Max(g.a0[a], g.a0[b])
		shorter := math.Min(g.a1[a]-g.a0[a], g.a1[b]-g.a0[b])
		return ov > tol && ov >= minOverlapFrac*shorter
	}
	for x, k := range order {
		g.lo[k], g.hi[k] = -1, -1
		for y := x - 1; y >= 0; y-- {
			j := order[y]
			gap := p.across[k] - p.across[j]
			if g.grp[j] != g.grp[k] || gap > maxNeighbourGapIn {
				break
			}
			if gap >= minNeighbourGapIn && overlaps(k, j) {
				g.lo[k] = j
				break
			}
		}
		for y := x + 1; y < n; y++ {
			j := order[y]
			gap := p.across[j] - p.across[k]
			if g.grp[j] != g.grp[k] || gap > maxNeighbourGapIn {
				break
			}
			if gap >= minNeighbourGapIn && overlaps(k, j) {
				g.hi[k] = j
				break
			}
		}
	}
	for k := range p.Members {
		g.setTrib(k)
	}
}

func (g *grouper) setTrib(k int) {
	p := g.plan
	m := &p.Members[k]
	edge := g.opt.EdgeDistanceIn
	loT, hiT := edge, edge
	var gaps []float64
	m.Neighbours = [2]int{g.lo[k], g.hi[k]}
	m.NeighbourGapsIn = [2]float64{}
	if j := g.lo[k]; j >= 0 {
		m.NeighbourGapsIn[0] = p.across[k] - p.across[j]
	}
	if j := g.hi[k]; j >= 0 {
		m.NeighbourGapsIn[1] = p.across[j] - p.across[k]
	}
	if j := g.lo[k]; j >= 0 {
		gap := p.across[k] - p.across[j]
		loT = gap / 2
		gaps = append(gaps, gap)
	}
	if j := g.hi[k]; j >= 0 {
		gap := p.across[j] - p.across[k]
		hiT = gap / 2
		gaps = append(gaps, gap)
	}
	// the larger-across side is the member's left when the group normal
	// is its left normal
	if dot(g.groups[g.grp[k]].n, rot90(p.dirs[k])) > 0 {
		m.TribLeftIn, m.TribRightIn = hiT, loT
	} else {
		m.TribLeftIn, m.TribRightIn = loT, hiT
	}
	m.TribIn = m.TribLeftIn + m.TribRightIn
	switch len(gaps) {
	case 2:
		m.SpacingIn = (gaps[0] + gaps[1]) / 2
	case 1:
		m.SpacingIn = gaps[0]
	default:
		msg := fmt.Sprintf("%s has no parallel neighbour within %.0f in: tributary width is the edge distance on both sides (%.2f in)",
			m.ID, float64(maxNeighbourGapIn), m.TribIn)
		m.Messages = append(m.Messages, msg)
		g.warn(m.Pos, CodeNoNeighbour, "%s", msg)
	}
}

// makeRuns joins each member to its neighbours when both are usable and
// bear on the same support lines (same count and kinds, each bearing
// centre on the other's support line within the snap tolerance), then
// orders each run across and numbers the runs by their first member.
func (g *grouper) makeRuns() {
	p := g.plan
	n := len(p.Members)
	parent := make([]int, n)
	for i := range parent {
		parent[i] = i
	}
	var find func(int) int
	find = func(i int) int {
		for parent[i] != i {
			parent[i] = parent[parent[i]]
			i = parent[i]
		}
		return i
	}
	for k := 0; k < n; k++ {
		for _, j := range []int{g.lo[k], g.hi[k]} {
			if j >= 0 && g.sameBearings(k, j) {
				a, b := find(k), find(j)
				if a != b {
					parent[max(a, b)] = min(a, b)
				}
			}
		}
	}
	byRoot := map[int]int{}
	for k := 0; k < n; k++ { // k ascending: runs numbered by first member
		r := find(k)
		ri, ok := byRoot[r]
		if !ok {
			ri = len(p.Runs)
			byRoot[r] = ri
			p.Runs = append(p.Runs, Run{ID: fmt.Sprintf("R%d", ri+1)})
		}
		p.Runs[ri].Members = append(p.Runs[ri].Members, k)
		p.Members[k].Run = ri
	}
	for i := range p.Runs {
		ms := p.Runs[i].Members
		sort.SliceStable(ms, func(x, y int) bool { return p.across[ms[x]] < p.across[ms[y]] })
	}
}

func (g *grouper) sameBearings(k, j int) bool {
	mk, mj := &g.plan.Members[k], &g.plan.Members[j]
	if mk.Error || mj.Error || len(mk.Bearings) != len(mj.Bearings) || len(mk.Bearings) == 0 {
		return false
	}
	tol := g.opt.SnapToleranceIn
	for i := range mk.Bearings {
		bk, bj := mk.Bearings[i], mj.Bearings[i]
		if bk.Kind != bj.Kind {
			return false
		}
		pk := lerp(mk.Start, g.plan.dirs[k], bk.AtIn)
		pj := lerp(mj.Start, g.plan.dirs[j], bj.AtIn)
		if math.Abs(cross(g.bdirs[k][i], sub(pj, pk))) > tol {
			return false
		}
	}
	return true
}
