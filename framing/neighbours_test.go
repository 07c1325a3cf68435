package framing

import (
	"math"
	"math/rand"
	"slices"
	"sort"
	"testing"
)

// neighboursReference is the plain search neighbours replaced: sort by
// group, offset across and index, then from each member scan down and up
// the order, skipping members closer than minNeighbourGapIn, stopping past
// maxNeighbourGapIn or at another group, taking the first that overlaps.
// It looks at every member of a line, so it is slow when many joists line
// up, and it is the reference the faster search must agree with.
func neighboursReference(g *grouper) (lo, hi []int) {
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
	lo, hi = make([]int, n), make([]int, n)
	for x, k := range order {
		lo[k], hi[k] = -1, -1
		for y := x - 1; y >= 0; y-- {
			j := order[y]
			gap := p.across[k] - p.across[j]
			if g.grp[j] != g.grp[k] || gap > maxNeighbourGapIn {
				break
			}
			if gap >= minNeighbourGapIn && g.overlaps(k, j) {
				lo[k] = j
				break
			}
		}
		for y := x + 1; y < n; y++ {
			j := order[y]
			gap := p.across[j] - p.across[k]
			if g.grp[j] != g.grp[k] || gap > maxNeighbourGapIn {
				break
			}
			if gap >= minNeighbourGapIn && g.overlaps(k, j) {
				hi[k] = j
				break
			}
		}
	}
	return lo, hi
}

// groupedForNeighbours runs Group's stages up to the neighbour search.
func groupedForNeighbours(t *testing.T, p *plan) *grouper {
	t.Helper()
	g := &grouper{opt: DefaultOptions(), plan: &Plan{Ignored: map[string]int{}}}
	g.units, g.toInch = p.d.Units, p.d.ToInch
	g.classify(&p.d)
	g.makeMembers()
	g.findBearings()
	return g
}

// TestNeighboursMatchReference: on random plans (bays of joists lined up
// end to end, joists of mixed lengths and offsets, lapped joists, doubled
// plies, offsets a hair apart, skewed groups) the line search finds
// exactly the neighbours of the plain scan. Common practice, no source.
func TestNeighboursMatchReference(t *testing.T) {
	rng := rand.New(rand.NewSource(8))
	for trial := 0; trial < 60; trial++ {
		p := newPlan()
		bays, per := 1+rng.Intn(12), 1+rng.Intn(25)
		angle := 0.0
		if trial%5 == 4 {
			angle = rng.Float64() * math.Pi
		}
		c, s := math.Cos(angle), math.Sin(angle)
		at := func(u, v float64) (float64, float64) { return u*c - v*s, u*s + v*c }
		for b := 0; b < bays; b++ {
			u0 := float64(b) * 150
			for i := 0; i < per; i++ {
				v := float64(i) * 16
				switch rng.Intn(6) {
				case 0:
					v += 1.5 // a ply beside
				case 1:
					v += rng.Float64() * 0.4 // a hair off the line
				case 2:
					v += rng.Float64() * 40
				}
				l := 144.0
				if rng.Intn(4) == 0 {
					l = 20 + rng.Float64()*200
				}
				u := u0 + (rng.Float64()-0.5)*rng.Float64()*30
				x0, y0 := at(u, v)
				x1, y1 := at(u+l, v)
				p.line("JOIST", x0, y0, x1, y1)
			}
		}
		g := groupedForNeighbours(t, p)
		wantLo, wantHi := neighboursReference(g)
		g.neighbours()
		for k := range g.plan.Members {
			if g.lo[k] != wantLo[k] || g.hi[k] != wantHi[k] {
				t.Fatalf("trial %d, member %d: neighbours %d/%d, reference %d/%d", trial, k, g.lo[k], g.hi[k], wantLo[k], wantHi[k])
			}
		}
	}
}

// BenchmarkNeighboursAligned: 100,000 joists in 1,000 bays whose joists
// line up from bay to bay (the plain scan looked at every joist of a line
// for each joist: 1.5 s).
func BenchmarkNeighboursAligned(b *testing.B) {
	const rows, cols = 1000, 100
	p := newPlan()
	for r := 0; r <= rows; r++ {
		p.line("WALL", 0, float64(r)*144, cols*16+16, float64(r)*144)
	}
	for r := 0; r < rows; r++ {
		for c := 0; c < cols; c++ {
			x := 8 + float64(c)*16
			p.line("JOIST", x, float64(r)*144, x, float64(r+1)*144)
		}
	}
	opt := DefaultOptions()
	for b.Loop() {
		if pl := Group(&p.d, opt); len(pl.Members) != rows*cols {
			b.Fatalf("%d members", len(pl.Members))
		}
	}
}

// dropDuplicatesReference is the plain scan dropDuplicates replaced: in
// order of group, offset across and index, each joist kept drops every
// later one less than minNeighbourGapIn across whose ends are both within
// the snap tolerance of its own. It returns what it keeps and the handles
// it reports, in order.
func dropDuplicatesReference(g *grouper, js []segItem, grpOf []int) ([]bool, []string) {
	tol := g.opt.SnapToleranceIn
	keep := make([]bool, len(js))
	type key struct {
		i int
		c float64
	}
	ks := make([]key, len(js))
	for i, j := range js {
		ks[i] = key{i, dot(mid(j.a, j.b), g.groups[grpOf[i]].n)}
		keep[i] = true
	}
	sort.Slice(ks, func(x, y int) bool {
		if grpOf[ks[x].i] != grpOf[ks[y].i] {
			return grpOf[ks[x].i] < grpOf[ks[y].i]
		}
		if ks[x].c != ks[y].c {
			return ks[x].c < ks[y].c
		}
		return ks[x].i < ks[y].i
	})
	var dropped []string
	for x := range ks {
		i := ks[x].i
		if !keep[i] {
			continue
		}
		for y := x + 1; y < len(ks) && grpOf[ks[y].i] == grpOf[i] && ks[y].c-ks[x].c < minNeighbourGapIn; y++ {
			j := ks[y].i
			if keep[j] && dist(js[i].a, js[j].a) <= tol && dist(js[i].b, js[j].b) <= tol {
				keep[j] = false
				dropped = append(dropped, js[j].pos.Handle)
			}
		}
	}
	return keep, dropped
}

// TestDropDuplicatesMatchReference: on random plans with joists drawn two
// and three times (exactly, a hair off, just past the tolerance, in bays
// lined up: one plan in three with 30 to 59 bays, so that lines are long
// enough for the grid search), dropDuplicates keeps and reports exactly
// what the plain scan does, in the same order. Common practice, no source.
func TestDropDuplicatesMatchReference(t *testing.T) {
	rng := rand.New(rand.NewSource(11))
	for trial := 0; trial < 60; trial++ {
		p := newPlan()
		bays, per := 1+rng.Intn(10), 1+rng.Intn(20)
		if trial%3 == 2 { // lines long enough for the grid search
			bays = 30 + rng.Intn(30)
		}
		jitter := []float64{0, 0.3, 1.4, 1.6, 0.49, 0.51}
		for b := 0; b < bays; b++ {
			for i := 0; i < per; i++ {
				x, y := float64(b)*150, float64(i)*16
				copies := 1 + rng.Intn(3)
				for c := 0; c < copies; c++ {
					dx := jitter[rng.Intn(len(jitter))] * float64(rng.Intn(3)-1)
					dy := jitter[rng.Intn(len(jitter))] * float64(rng.Intn(3)-1)
					p.line("JOIST", x+dx, y+dy, x+144+dx*rng.Float64(), y+dy)
				}
			}
		}
		g := &grouper{opt: DefaultOptions(), plan: &Plan{Ignored: map[string]int{}}}
		g.units, g.toInch = "in", 1
		g.classify(&p.d)
		grpOf, groups := directionGroups(g.joists, g.opt.AngleTolDeg, nil)
		g.groups = groups
		wantKeep, wantDropped := dropDuplicatesReference(g, g.joists, grpOf)
		gotKeep, _ := g.dropDuplicates(g.joists, grpOf)
		var gotDropped []string
		for _, is := range g.plan.Issues {
			if is.Code == CodeDuplicateJoist {
				gotDropped = append(gotDropped, is.Pos.Handle)
			}
		}
		if !slices.Equal(gotKeep, wantKeep) || !slices.Equal(gotDropped, wantDropped) {
			t.Fatalf("trial %d: dropped %v, reference %v", trial, gotDropped, wantDropped)
		}
		if trial == 0 && len(wantDropped) == 0 {
			t.Fatal("the first random plan has no duplicate: the test would prove nothing")
		}
	}
}
