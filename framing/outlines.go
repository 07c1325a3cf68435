package framing

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"framecheck/dxfimport"
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
	grpOf, groups := directionGroups(js, g.opt.AngleTolDeg)
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
	parent := make([]int32, n)
	for i := range parent {
		parent[i] = int32(i)
	}
	find := func(i int32) int32 {
		for parent[i] != i {
			parent[i] = parent[parent[i]]
			i = parent[i]
		}
		return i
	}
	paired := false
	for x := range idx.keys {
		i := int(idx.keys[x].id)
		fi := fr[i]
		li := fi.a1 - fi.a0
		// the shorter's midpoint lies inside the longer's extent when they
		// overlap by half the shorter: the longer finds it
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
				a, b := find(int32(i)), find(int32(j))
				if a != b {
					parent[max(a, b)] = min(a, b)
					paired = true
				}
			}
		}
	}
	if !paired {
		return
	}
	// lines of each bundle, flat, by bundle root then index
	count := make([]int32, n+1)
	for i := range js {
		count[find(int32(i))+1]++
	}
	for i := 1; i <= n; i++ {
		count[i] += count[i-1]
	}
	flat := make([]int32, n)
	fill := slices.Clone(count[:n])
	for i := range js {
		r := find(int32(i))
		flat[fill[r]] = int32(i)
		fill[r]++
	}
	bundleOf := make([]int32, n) // outline index, or -1
	for i := range bundleOf {
		bundleOf[i] = -1
	}
	type bundle struct {
		root       int32
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
		bundles = append(bundles, bundle{root: r, c: (fr[lmin].c + fr[lmax].c) / 2, a0: A0, a1: A1,
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

// finishOutlines compares each outline member's drawn thickness with its
// size's b, makes built-up members (plies drawn side by side) errors, as
// check has no built-up section yet, and reports outlines that are not
// rectangles. It runs after the lumber is assigned.
func (g *grouper) finishOutlines() {
	p := g.plan
	if g.badPos != nil {
		for k := range p.Members {
			m := &p.Members[k]
			if msg, ok := g.badPos[m.Pos]; ok {
				g.memberError(m, CodeNotRectangle, "%s: %s; not checked: draw it as a rectangle or as its centre line", m.ID, msg)
			}
		}
	}
	if g.memOl == nil {
		return
	}
	for k := range p.Members {
		o := g.memOl[k]
		if o < 0 {
			continue
		}
		m := &p.Members[k]
		ol := &g.ols[o]
		m.DrawnThicknessIn = ol.widthIn
		m.Plies = 1
		e0, e1 := g.rawJoists[ol.edges[0]].pos, g.rawJoists[ol.edges[1]].pos
		drawn := entityRef(e0)
		if e1 != e0 {
			drawn += " and " + entityRef(e1)
		}
		if ol.err != "" {
			g.memberError(m, ol.code, "%s: %s; not checked: draw it as a rectangle or as its centre line", m.ID, ol.err)
			continue
		}
		bIn, _, err := DressedSize(m.Size)
		plies := ol.seams + 1
		if plies > 1 {
			m.Plies = plies
			g.memberError(m, CodeBuiltUp, "%s is a built-up member of %d plies drawn side by side (%s, %.2f in in all): "+
				"the checks do not cover built-up members yet, and one ply alone is not the member; design it by hand",
				m.ID, plies, drawn, ol.widthIn)
		}
		if err != nil {
			continue // a size without a nominal thickness: nothing to compare
		}
		if want := float64(plies) * bIn; math.Abs(ol.widthIn-want) > thickTolIn {
			what := m.Size
			if plies > 1 {
				what = fmt.Sprintf("%d plies of %s", plies, m.Size)
			}
			msg := fmt.Sprintf("%s is drawn %.2f in thick (%s) but %s is %.2f in thick", m.ID, ol.widthIn, drawn, what, want)
			m.Messages = append(m.Messages, msg)
			g.warn(m.Pos, CodeThickness, "%s", msg)
		}
	}
}

// memberError marks member m unusable with a message and an error issue.
func (g *grouper) memberError(m *Member, code, format string, args ...any) {
	m.Error = true
	msg := fmt.Sprintf(format, args...)
	m.Messages = append(m.Messages, msg)
	g.plan.Issues.Add(m.Pos, code, dxfimport.SevError, "%s", msg)
}

// handles names up to max entities, "handles 2F, 30, 31 and 2 more".
func handles(ps []dxfimport.Pos, max int) string {
	var parts []string
	for i, p := range ps {
		if i == max {
			parts = append(parts, fmt.Sprintf("%d more", len(ps)-max))
			break
		}
		if p.Handle != "" {
			parts = append(parts, p.Handle)
		} else {
			parts = append(parts, fmt.Sprintf("line %d", p.Line))
		}
	}
	return "handles " + strings.Join(parts, ", ")
}

// rightAngleSin: the corners of a rectangle are square within about 2
// degrees (drafting noise; common practice, no source).
const rightAngleSin = 0.035

// closedCorners returns the corners of a polyline that closes (the closed
// flag, or a last vertex within tol of the first), with repeated and
// collinear vertices left out; closed is false for an open polyline and
// for one that folds back onto a line (fewer than 3 corners).
func closedCorners(pts []Point, closedFlag bool, tol float64) (corners []Point, closed bool) {
	if len(pts) < 3 {
		return nil, false
	}
	ps := pts
	if !closedFlag {
		if len(pts) < 4 || dist(pts[0], pts[len(pts)-1]) > tol {
			return nil, false
		}
		ps = pts[:len(pts)-1]
	}
	var c []Point
	for _, p := range ps {
		if len(c) == 0 || dist(p, c[len(c)-1]) > 1e-6 {
			c = append(c, p)
		}
	}
	for len(c) > 1 && dist(c[0], c[len(c)-1]) <= 1e-6 {
		c = c[:len(c)-1]
	}
	// drop vertices where the outline goes straight on
	for changed := true; changed && len(c) >= 3; {
		changed = false
		for i := 0; i < len(c); i++ {
			prev, next := c[(i+len(c)-1)%len(c)], c[(i+1)%len(c)]
			d1, d2 := unit(sub(c[i], prev)), unit(sub(next, c[i]))
			if math.Abs(cross(d1, d2)) < 1e-3 && dot(d1, d2) > 0 {
				c = slices.Delete(c, i, i+1)
				changed = true
				break
			}
		}
	}
	if len(c) < 3 {
		return nil, false
	}
	return c, true
}

// isRectangle reports whether 4 corners make a rectangle.
func isRectangle(c []Point) bool {
	if len(c) != 4 {
		return false
	}
	for i := range c {
		d1 := unit(sub(c[(i+1)%4], c[i]))
		d2 := unit(sub(c[(i+2)%4], c[(i+1)%4]))
		if math.Abs(dot(d1, d2)) > rightAngleSin {
			return false
		}
	}
	return true
}

// addOutlinePolyline adds the four sides of a closed rectangular joist
// polyline as joist lines (outlines turns them into one member), or
// reports a closed polyline that is not a rectangle.
func (g *grouper) addOutlinePolyline(e dxfimport.Entity, c []Point) {
	if !isRectangle(c) {
		what := fmt.Sprintf("%d corners", len(c))
		if len(c) == 4 {
			what = "4 corners that are not all square"
		}
		msg := fmt.Sprintf("its outline (%s) is a closed polyline of %s, not a rectangle", entityRef(e.Pos), what)
		if !g.addBadOutline(c, e.Pos, msg) {
			g.plan.Issues.Add(e.Pos, CodeNotRectangle, dxfimport.SevError,
				"joist outline (%s) is a closed polyline of %s, not a rectangle and wider than a member; not checked: draw the member as a rectangle or as its centre line",
				entityRef(e.Pos), what)
		}
		return
	}
	for i := range c {
		g.joists = append(g.joists, segItem{a: c[i], b: c[(i+1)%4], pos: e.Pos})
	}
}

// addBadOutline adds an outline that is not a rectangle as an error
// member on the centre line of the strip it fills along its longest side,
// so that it still counts as its neighbours' neighbour (DOMAIN.md: the
// geometry is there even if the member is in error). It returns false,
// adding nothing, when the strip is wider than a built-up member: that
// is no joist outline.
func (g *grouper) addBadOutline(pts []Point, pos dxfimport.Pos, msg string) bool {
	var u Point
	long := -1.0
	for i := range pts {
		if d := dist(pts[i], pts[(i+1)%len(pts)]); d > long {
			long, u = d, unit(sub(pts[(i+1)%len(pts)], pts[i]))
		}
	}
	n := rot90(u)
	a0, a1, c0, c1 := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for _, p := range pts {
		a0, a1 = math.Min(a0, dot(p, u)), math.Max(a1, dot(p, u))
		c0, c1 = math.Min(c0, dot(p, n)), math.Max(c1, dot(p, n))
	}
	if c1-c0 > maxBuiltUpIn+g.opt.SnapToleranceIn || a1-a0 < 1e-6 {
		return false
	}
	c := (c0 + c1) / 2
	if g.badPos == nil {
		g.badPos = map[dxfimport.Pos]string{}
	}
	g.badPos[pos] = msg
	g.joists = append(g.joists, segItem{a: add(scale(u, a0), scale(n, c)), b: add(scale(u, a1), scale(n, c)), pos: pos})
	if g.jol != nil {
		g.jol = append(g.jol, -1)
	}
	if g.rawOf != nil {
		g.rawOf = append(g.rawOf, -1)
	}
	return true
}
