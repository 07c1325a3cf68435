package framing

import (
	"math"
	"slices"

	"framecheck/dxfimport"
)

// Point is the drawing's 2D point, world inches.
type Point = dxfimport.Point

func sub(a, b Point) Point             { return Point{X: a.X - b.X, Y: a.Y - b.Y} }
func add(a, b Point) Point             { return Point{X: a.X + b.X, Y: a.Y + b.Y} }
func scale(a Point, k float64) Point   { return Point{X: a.X * k, Y: a.Y * k} }
func dot(a, b Point) float64           { return a.X*b.X + a.Y*b.Y }
func cross(a, b Point) float64         { return a.X*b.Y - a.Y*b.X }
func norm(a Point) float64             { return math.Hypot(a.X, a.Y) }
func dist(a, b Point) float64          { return norm(sub(a, b)) }
func mid(a, b Point) Point             { return Point{X: (a.X + b.X) / 2, Y: (a.Y + b.Y) / 2} }
func rot90(a Point) Point              { return Point{X: -a.Y, Y: a.X} }
func lerp(a, u Point, t float64) Point { return add(a, scale(u, t)) }

// unit returns a/|a|, or the zero vector for a zero-length a.
func unit(a Point) Point {
	n := norm(a)
	if n == 0 {
		return Point{}
	}
	return scale(a, 1/n)
}

// distPointSeg returns the distance from p to the segment ab.
func distPointSeg(p, a, b Point) float64 {
	d := sub(b, a)
	l2 := dot(d, d)
	if l2 == 0 {
		return dist(p, a)
	}
	t := dot(sub(p, a), d) / l2
	t = math.Max(0, math.Min(1, t))
	return dist(p, lerp(a, d, t))
}

// segIndex is a uniform grid over segments: each segment is listed in
// every cell that its padded pieces touch, so a query walks only the cells
// near the query segment. Points outside the grid are clamped to the edge
// cells on insert and query alike, which keeps the search conservative.
type segIndex struct {
	x0, y0, cell float64
	nx, ny       int
	cells        [][]int32
	n            int       // ids are 0..n-1
	own          segCursor // query's
}

// segCursor is the state of a walk through a segIndex: which ids the
// current query has met. query uses the index's own; goroutines querying
// one index at once each use their own (newCursor).
type segCursor struct {
	stamp []uint32
	cur   uint32
}

// maxGridCells bounds the grid's memory; the cell grows to keep under it.
const maxGridCells = 1 << 21

// newSegIndex makes an empty grid over the box lo..hi for about n
// segments of typical length typLenIn.
func newSegIndex(lo, hi Point, n int, typLenIn float64) *segIndex {
	w, h := math.Max(hi.X-lo.X, 1), math.Max(hi.Y-lo.Y, 1)
	cell := math.Max(typLenIn/2, math.Sqrt(w*h/float64(max(n, 1))))
	cell = math.Max(cell, 12)
	for (w/cell+1)*(h/cell+1) > maxGridCells {
		cell *= 1.5
	}
	g := &segIndex{x0: lo.X, y0: lo.Y, cell: cell}
	g.nx = int(w/cell) + 1
	g.ny = int(h/cell) + 1
	g.cells = make([][]int32, g.nx*g.ny)
	g.n = n
	return g
}

// indexSegs makes a grid over segs, listing segment i under id i.
func indexSegs(segs []segItem) *segIndex {
	return indexEnds(len(segs), func(i int) (Point, Point) { return segs[i].a, segs[i].b }, nil)
}

// indexEnds makes a grid over n segments, seg giving the ends of each,
// sized as bounds would size it for them. With spans (a grouper's
// split), the segments' cells are found in parallel.
func indexEnds(n int, seg func(i int) (Point, Point), spans []span) *segIndex {
	lo := Point{X: math.Inf(1), Y: math.Inf(1)}
	hi := Point{X: math.Inf(-1), Y: math.Inf(-1)}
	meanLen := 0.0
	for i := 0; i < n; i++ {
		a, b := seg(i)
		for _, q := range [2]Point{a, b} {
			lo.X, lo.Y = math.Min(lo.X, q.X), math.Min(lo.Y, q.Y)
			hi.X, hi.Y = math.Max(hi.X, q.X), math.Max(hi.Y, q.Y)
		}
		meanLen += dist(a, b)
	}
	g := newSegIndex(lo, hi, n, meanLen/float64(max(n, 1)))
	if spans == nil {
		spans = []span{{0, n}}
	}
	g.fill(seg, spans)
	return g
}

// fill inserts the segments of spans (seg gives each one's ends; the
// spans cover 0..n-1 in order) with no pad, as insert would one after
// another, but with the cells' lists carved from one array. Each span's
// segments are walked on a goroutine of its own, which lists the cells of
// each (as insert: each cell once a segment) and writes only its own
// list; then the lists are counted and the segments listed in their
// cells, in order.
func (g *segIndex) fill(seg func(i int) (Point, Point), spans []span) {
	type walk struct {
		cells []int32 // the cells of the span's first segment, then of its next, ...
		ends  []int   // segment lo+i's cells end at cells[ends[i]]
	}
	walks := make([]walk, len(spans))
	parallel(spans, func(w int, sp span) {
		wk := &walks[w]
		wk.ends = make([]int, 0, sp.hi-sp.lo)
		var last []int32 // per cell: 1 + the last segment listed in it; made for the first long segment
		for id := sp.lo; id < sp.hi; id++ {
			a, b := seg(id)
			from := len(wk.cells)
			g.visit(a, b, 0, func(c int) {
				mine := wk.cells[from:]
				switch {
				case len(mine) < 32: // most segments cross a few cells
					if slices.Contains(mine, int32(c)) {
						return
					}
				default:
					if last == nil {
						last = make([]int32, len(g.cells))
					}
					if last[mine[0]] != int32(id)+1 { // first look at this segment's cells this way
						for _, m := range mine {
							last[m] = int32(id) + 1
						}
					}
					if last[c] == int32(id)+1 {
						return
					}
					last[c] = int32(id) + 1
				}
				wk.cells = append(wk.cells, int32(c))
			})
			wk.ends = append(wk.ends, len(wk.cells))
		}
	})
	count := make([]int32, len(g.cells))
	total := 0
	for _, wk := range walks {
		for _, c := range wk.cells {
			count[c]++
		}
		total += len(wk.cells)
	}
	flat := make([]int32, total)
	off := 0
	for c, k := range count {
		if k > 0 {
			g.cells[c] = flat[off : off : off+int(k)]
			off += int(k)
		}
	}
	for w, sp := range spans {
		from := 0
		for i, end := range walks[w].ends {
			for _, c := range walks[w].cells[from:end] {
				g.cells[c] = append(g.cells[c], int32(sp.lo+i))
			}
			from = end
		}
	}
}

// newCursor returns a cursor for queries through g on another goroutine.
func (g *segIndex) newCursor() *segCursor { return &segCursor{stamp: make([]uint32, g.n)} }

func (g *segIndex) cellRange(a, b Point, pad float64) (i0, j0, i1, j1 int) {
	clampI := func(v float64, n int) int {
		i := int(math.Floor(v / g.cell))
		return max(0, min(n-1, i))
	}
	i0 = clampI(math.Min(a.X, b.X)-pad-g.x0, g.nx)
	i1 = clampI(math.Max(a.X, b.X)+pad-g.x0, g.nx)
	j0 = clampI(math.Min(a.Y, b.Y)-pad-g.y0, g.ny)
	j1 = clampI(math.Max(a.Y, b.Y)+pad-g.y0, g.ny)
	return
}

// visit calls fn for each cell near segment ab (padded by pad), cutting
// the segment into pieces no longer than one cell so a long diagonal
// touches O(length/cell) cells rather than its whole bounding box.
func (g *segIndex) visit(a, b Point, pad float64, fn func(c int)) {
	// a piece longer than a cell is still covered by its bounding box, so
	// capping the count only widens boxes for segments longer than the grid
	n := min(int(dist(a, b)/g.cell)+1, 2*(g.nx+g.ny)+2)
	d := scale(sub(b, a), 1/float64(n))
	for k := 0; k < n; k++ {
		p := lerp(a, d, float64(k))
		q := add(p, d)
		i0, j0, i1, j1 := g.cellRange(p, q, pad)
		for j := j0; j <= j1; j++ {
			for i := i0; i <= i1; i++ {
				fn(j*g.nx + i)
			}
		}
	}
}

// insert lists segment id under every cell near ab.
func (g *segIndex) insert(id int, a, b Point, pad float64) {
	last := -1
	g.visit(a, b, pad, func(c int) {
		if c == last {
			return
		}
		if l := g.cells[c]; len(l) > 0 && l[len(l)-1] == int32(id) {
			return
		}
		last = c
		g.cells[c] = append(g.cells[c], int32(id))
	})
}

// query calls fn once for every segment listed near ab (padded by pad),
// in the order the cells list them.
func (g *segIndex) query(a, b Point, pad float64, fn func(id int)) {
	if g.own.stamp == nil {
		g.own.stamp = make([]uint32, g.n)
	}
	g.queryWith(&g.own, a, b, pad, fn)
}

// queryWith is query with cursor c: with one cursor each, goroutines may
// query one index at once (the index is only read).
func (g *segIndex) queryWith(c *segCursor, a, b Point, pad float64, fn func(id int)) {
	c.cur++
	if c.cur == 0 { // wrapped: clear the stamps
		clear(c.stamp)
		c.cur = 1
	}
	g.visit(a, b, pad, func(cell int) {
		for _, id := range g.cells[cell] {
			if c.stamp[id] != c.cur {
				c.stamp[id] = c.cur
				fn(int(id))
			}
		}
	})
}

// pointInPolygon reports whether p lies inside the closed polygon pts
// (even-odd rule; points on an edge may go either way).
func pointInPolygon(p Point, pts []Point) bool {
	in := false
	for i, j := 0, len(pts)-1; i < len(pts); j, i = i, i+1 {
		a, b := pts[i], pts[j]
		if (a.Y > p.Y) != (b.Y > p.Y) {
			x := a.X + (p.Y-a.Y)*(b.X-a.X)/(b.Y-a.Y)
			if p.X < x {
				in = !in
			}
		}
	}
	return in
}

// polygonArea returns the unsigned area of pts (shoelace formula).
func polygonArea(pts []Point) float64 {
	var s float64
	for i, j := 0, len(pts)-1; i < len(pts); j, i = i, i+1 {
		s += cross(pts[j], pts[i])
	}
	return math.Abs(s) / 2
}

// segParams intersects line a+t·u (u a unit vector) with segment pq and
// returns t, the fraction s along pq, and the sine of the angle between
// them; ok is false when they are parallel.
func segParams(a, u, p, q Point) (t, s, sin float64, ok bool) {
	d := sub(q, p)
	den := cross(u, d)
	ld := norm(d)
	if ld == 0 || math.Abs(den)/ld < 1e-9 {
		return 0, 0, 0, false
	}
	w := sub(p, a)
	t = cross(w, d) / den
	s = cross(w, u) / den
	return t, s, math.Abs(den) / ld, true
}
