package framing

import (
	"fmt"
	"math"
	"slices"
)

// Members drawn as outlines (DOMAIN.md "Drawings as people draw them").
// The lumber limits are those of the issue that asked for outlines
// (0.75 to 5.5 in: a 1x board to a dressed 6x, NDS 2018 Supplement Table
// 1B); the tolerances are common practice, no source.
const (
	minThickIn   = 0.75               // thinnest piece an outline is read as
	maxThickIn   = 5.5                // thickest single piece
	thickTolIn   = 0.25               // drawn thickness against the size's b, and slack on the limits
	maxBuiltUpIn = 4*1.5 + thickTolIn // four 2x plies side by side
	minPlyIn     = 1.0                // a seam splits plies at least this thick (a line at the middle of a 2x is its centre line)
	taperTolIn   = 0.25               // an outline's width at one end against the other
	minEdgeIn    = 3.0                // an outline's sides are at least this long, and 4 times its width
)

// capMaxLenIn bounds an end cap: across the widest built-up member, cut
// at up to 60 degrees, plus the snap tolerance at each end.
func (g *grouper) capMaxLenIn() float64 { return 2*maxBuiltUpIn + 2*g.opt.SnapToleranceIn }

// outline is one member drawn as its outline: parallel lines a lumber
// thickness apart, with or without end caps.
type outline struct {
	widthIn float64  // between the outermost sides, in
	seams   int      // interior lines splitting it into plies
	lines   int      // lines drawn for it, caps included
	edges   [2]int32 // the outermost sides, as lines of rawJoists
	err     string   // why it is not a usable member, "" when it is
	code    string
}

// outlines finds the members drawn as outlines among the joist lines
// and replaces each by its centre line; end caps are dropped with their
// outline. Lines are parallel sides of one outline when they are in one
// direction group, at most maxThickIn (+ tolerance) apart across, overlap
// along by at least half the shorter, and the shorter is at least
// minEdgeIn and 4 times the gap long (so a short piece lying beside a
// member is not a side of it). Sides chain: two outlines touching are one
// bundle, a built-up member. A bundle less than minThickIn wide is a line
// drawn twice (left to dropDuplicates), one wider than maxBuiltUpIn is not
// an outline (its lines stay members).
func (g *grouper) outlines() {
	js := g.joists
	n := len(js)
	if n < 2 {
		return
	}
	grpOf, groups := directionGroups(js, g.opt.AngleTolDeg, g.split(len(js)))
	type frame struct{ c, a0, a1 float64 }
	fr := make([]frame, n)
	keys := make([]bandKey, n)
	for i := range js {
		gr := groups[grpOf[i]]
		a0, a1 := dot(js[i].a, gr.u), dot(js[i].b, gr.u)
		if a0 > a1 {
			a0, a1 = a1, a0
		}
		c := dot(mid(js[i].a, js[i].b), gr.n)
		fr[i] = frame{c, a0, a1}
		keys[i] = bandKey{grp: int32(grpOf[i]), a: (a0 + a1) / 2, c: c, id: int32(i)}
	}
	maxGap := maxThickIn + thickTolIn
	idx := newBandIndex(maxGap, keys)
	// The pairs of sides are found on ranges of the index in parallel,
	// each goroutine reading the index and frames and writing its own
	// list; they are joined after. The sets do not depend on the order
	// of the joins (a set's root is its smallest index).
	spans := g.split(len(idx.keys))
	pairs := make([][][2]int32, len(spans))
	parallel(spans, func(w int, sp span) {
		for x := sp.lo; x < sp.hi; x++ {
			i := int(idx.keys[x].id)
			fi := fr[i]
			li := fi.a1 - fi.a0
			// the shorter's midpoint lies inside the longer's extent when
			// they overlap by half the shorter: the longer finds it
			for _, r := range idx.nearRuns(x) {
				if r < 0 {
					continue
				}
				for y, end := idx.from(r, fi.a0), int(idx.runs[r+1]); y < end && idx.keys[y].a <= fi.a1; y++ {
					j := int(idx.keys[y].id)
					if j == i {
						continue
					}
					fj := fr[j]
					gap := math.Abs(fj.c - fi.c)
					shorter := math.Min(li, fj.a1-fj.a0)
					ov := math.Min(fi.a1, fj.a1) - math.Max(fi.a0, fj.a0)
					if gap > maxGap || ov <= 0 || ov < 0.5*shorter || shorter < math.Max(minEdgeIn, 4*gap) {
						continue
					}
					pairs[w] = append(pairs[w], [2]int32{int32(i), int32(j)})
				}
			}
		}
	})
	sets := newDisjointSets(n)
	paired := false
	for _, ps := range pairs {
		for _, pr := range ps {
			if sets.union(int(pr[0]), int(pr[1])) {
				paired = true
			}
		}
	}
	if !paired {
		return
	}
	// lines of each bundle, flat, by bundle root then index
	count := make([]int32, n+1)
	for i := range js {
		count[sets.find(i)+1]++
	}
	for i := 1; i <= n; i++ {
		count[i] += count[i-1]
	}
	flat := make([]int32, n)
	fill := slices.Clone(count[:n])
	for i := range js {
		r := sets.find(i)
		flat[fill[r]] = int32(i)
		fill[r]++
	}
	bundleOf := make([]int32, n) // outline index, or -1
	for i := range bundleOf {
		bundleOf[i] = -1
	}
	type bundle struct {
		c          float64 // centre across
		a0, a1     float64
		grp        int32
		halfWidth  float64
		start, end int32 // range of flat
	}
	nb := 0
	for r := 0; r < n; r++ {
		if count[r+1]-count[r] >= 2 {
			nb++
		}
	}
	bundles := make([]bundle, 0, nb)
	g.ols = slices.Grow(g.ols, nb)
	var cs []float64
	tol := g.opt.SnapToleranceIn
	for r := int32(0); r < int32(n); r++ {
		lines := flat[count[r]:count[r+1]]
		if len(lines) < 2 {
			continue
		}
		lmin, lmax := lines[0], lines[0]
		A0, A1 := math.Inf(1), math.Inf(-1)
		for _, l := range lines {
			if fr[l].c < fr[lmin].c {
				lmin = l
			}
			if fr[l].c > fr[lmax].c {
				lmax = l
			}
			A0, A1 = math.Min(A0, fr[l].a0), math.Max(A1, fr[l].a1)
		}
		W := fr[lmax].c - fr[lmin].c
		if W < minThickIn-thickTolIn || W > maxBuiltUpIn {
			continue
		}
		gr := groups[grpOf[r]]
		o := outline{widthIn: W, lines: len(lines), edges: [2]int32{lmin, lmax}}
		// sides not parallel: the width at one end against the other
		acrossAt := func(l int32, a float64) float64 {
			p, q := js[l].a, js[l].b
			ap, aq := dot(p, gr.u), dot(q, gr.u)
			cp, cq := dot(p, gr.n), dot(q, gr.n)
			if aq == ap {
				return cp
			}
			return cp + (cq-cp)*(a-ap)/(aq-ap)
		}
		w0 := acrossAt(lmax, A0) - acrossAt(lmin, A0)
		w1 := acrossAt(lmax, A1) - acrossAt(lmin, A1)
		if math.Abs(w0-w1) > taperTolIn {
			o.code = CodeNotRectangle
			sides := entityRef(js[lmin].pos)
			if js[lmax].pos != js[lmin].pos {
				sides += ", " + entityRef(js[lmax].pos)
			}
			o.err = fmt.Sprintf("its outline is not a rectangle: the sides (%s) are not parallel, %.2f in apart at one end and %.2f in at the other",
				sides, w0, w1)
		}
		// seams: interior lines leaving plies at least minPlyIn each side
		cs = cs[:0]
		for _, l := range lines {
			if c := fr[l].c; c-fr[lmin].c >= minPlyIn-thickTolIn && fr[lmax].c-c >= minPlyIn-thickTolIn {
				cs = append(cs, c)
			}
		}
		slices.Sort(cs)
		for i, c := range cs {
			if i == 0 || c-cs[i-1] >= minPlyIn-thickTolIn {
				o.seams++
			}
		}
		oi := int32(len(g.ols))
		g.ols = append(g.ols, o)
		for _, l := range lines {
			bundleOf[l] = oi
		}
		bundles = append(bundles, bundle{c: (fr[lmin].c + fr[lmax].c) / 2, a0: A0, a1: A1,
			grp: int32(grpOf[r]), halfWidth: W / 2, start: count[r], end: count[r+1]})
	}
	if len(bundles) == 0 {
		return
	}
	// end caps: a short line whose ends touch the corners of one outline
	// at one of its ends, going across it. Bundle ends and candidate caps
	// (in the frame of each group with bundles) go in one index; each cap
	// looks at the ends near it.
	hasGrp := map[int32]bool{}
	for _, bu := range bundles {
		hasGrp[bu.grp] = true
	}
	grps := make([]int32, 0, len(hasGrp))
	for gi := range hasGrp {
		grps = append(grps, gi)
	}
	slices.Sort(grps)
	capMax := g.capMaxLenIn()
	ck := make([]bandKey, 0, 2*len(bundles)+n/2)
	for b, bu := range bundles {
		ck = append(ck, bandKey{grp: bu.grp, a: bu.a0, c: bu.c, id: int32(b)},
			bandKey{grp: bu.grp, a: bu.a1, c: bu.c, id: int32(b)})
	}
	for i := range js {
		if bundleOf[i] >= 0 || dist(js[i].a, js[i].b) > capMax {
			continue
		}
		m := mid(js[i].a, js[i].b)
		us := unit(sub(js[i].b, js[i].a))
		for _, gi := range grps {
			if gr := groups[gi]; math.Abs(cross(us, gr.u)) >= 0.5 { // across the sides, within 60 degrees of square
				ck = append(ck, bandKey{grp: gi, a: dot(m, gr.u), c: dot(m, gr.n), id: -int32(i) - 1})
			}
		}
	}
	isCap := make([]bool, n)
	corner := func(p Point, lines []int32) int32 { // the line with the nearest corner within tol
		best, bl := tol, int32(-1)
		for _, l := range lines {
			if d := math.Min(dist(p, js[l].a), dist(p, js[l].b)); d <= best {
				best, bl = d, l
			}
		}
		return bl
	}
	cidx := newBandIndex(maxGap, ck)
	for x := range cidx.keys {
		k := cidx.keys[x]
		if k.id >= 0 || isCap[-k.id-1] {
			continue
		}
		i := int(-k.id - 1)
		reach := dist(js[i].a, js[i].b)/2 + tol
		nr := groups[k.grp].n
	runs:
		for _, r := range cidx.nearRuns(x) {
			if r < 0 {
				continue
			}
			for y, end := cidx.from(r, k.a-reach), int(cidx.runs[r+1]); y < end && cidx.keys[y].a <= k.a+reach; y++ {
				b := cidx.keys[y].id
				if b < 0 {
					continue
				}
				bu := &bundles[b]
				lines := flat[bu.start:bu.end]
				la, lb := corner(js[i].a, lines), corner(js[i].b, lines)
				if la < 0 || lb < 0 || la == lb || math.Abs(dot(sub(js[i].b, js[i].a), nr)) < 0.5*minThickIn {
					continue
				}
				isCap[i] = true
				g.ols[bundleOf[flat[bu.start]]].lines++
				break runs
			}
		}
	}
	// the new joist list: each bundle's centre line where its first line
	// was, the other lines as they were, caps left out
	out := make([]segItem, 0, n-len(bundles))
	jol := make([]int32, 0, cap(out))
	g.rawJoists = js
	g.rawOf = make([]int32, 0, cap(out))
	g.rawBundle = bundleOf
	first := make([]int32, len(bundles))
	for b, bu := range bundles {
		first[b] = slices.Min(flat[bu.start:bu.end])
	}
	bi := 0
	byFirst := make([]int32, len(bundles))
	for b := range byFirst {
		byFirst[b] = int32(b)
	}
	slices.SortFunc(byFirst, func(x, y int32) int { return int(first[x] - first[y]) })
	for i := range js {
		if isCap[i] {
			continue
		}
		if o := bundleOf[i]; o >= 0 {
			if bi < len(byFirst) && first[byFirst[bi]] == int32(i) {
				bu := &bundles[byFirst[bi]]
				gr := groups[bu.grp]
				a := add(scale(gr.u, bu.a0), scale(gr.n, bu.c))
				b := add(scale(gr.u, bu.a1), scale(gr.n, bu.c))
				out = append(out, segItem{a: a, b: b, pos: js[i].pos})
				jol = append(jol, o)
				g.rawOf = append(g.rawOf, -1)
				bi++
			}
			continue
		}
		out = append(out, js[i])
		jol = append(jol, -1)
		g.rawOf = append(g.rawOf, int32(i))
	}
	g.joists, g.jol = out, jol
}

// halfWidthIn is half the drawn thickness of joist item i (0 for a line
// drawn as a centre line).
func (g *grouper) halfWidthIn(i int) float64 {
	if g.jol == nil || g.jol[i] < 0 {
		return 0
	}
	return g.ols[g.jol[i]].widthIn / 2
}
