package framing

import (
	"cmp"
	"math"
	"slices"
	"strconv"
	"strings"

	"framecheck/dxfimport"
)

// Issue codes of the load path (posts.go, pointloads.go, beams.go).
const (
	CodePostSkipped     = "FRM230" // entity on a posts layer that is no post: skipped
	CodePointLoadText   = "FRM231" // point-load mark with no text, or a text that cannot be read
	CodePointLoadOff    = "FRM232" // point-load mark on no joist or beam
	CodePointLoadAlone  = "FRM233" // point-load text with no mark near it, or a second text beside one: not applied
	CodeBeamUnsupported = "FRM234" // beam with fewer than two supports found: stays a rigid bearing
	CodeBeamCycle       = "FRM235" // beams that bear on each other in a cycle
)

// maxPostIn is the largest drawn outline read as a post: a 12x12 timber
// is 11.5 in (NDS 2018 Supplement Table 1B), so 12 in across (common
// practice, no source). maxPostCircleIn bounds a circle's diameter: a
// round post or a post symbol, not a column footing or a tree.
const (
	maxPostIn       = 12.0
	maxPostCircleIn = 24.0
)

// loadPathState holds the entities of the posts and point-load layers
// until Group has its members.
type loadPathState struct {
	postEnts, loadEnts   []dxfimport.Entity
	postTexts, loadTexts []textItem
	refs                 supportRefs
	beams                []beamGroup // beam candidates among the support lines (beams.go)
	beamIdx              *segIndex   // over Plan.Beams' centre lines
}

// add keeps an entity of a posts or point-load layer; it reports whether
// the role has a use for its kind.
func (s *loadPathState) add(e dxfimport.Entity, r role) bool {
	if isText(e) {
		t := textItem{e.Points[0], e.Text, e.HeightIn, e.Pos}
		if e.From != nil { // a text inside a block belongs to the block
			if r == rolePost {
				s.postEnts = append(s.postEnts, e)
			} else {
				s.loadEnts = append(s.loadEnts, e)
			}
			return true
		}
		if r == rolePost {
			s.postTexts = append(s.postTexts, t)
		} else {
			s.loadTexts = append(s.loadTexts, t)
		}
		return true
	}
	switch e.Kind {
	case dxfimport.KindCircle, dxfimport.KindLine, dxfimport.KindLWPolyline, dxfimport.KindPolyline, dxfimport.KindPoint:
	default:
		return e.From != nil && r == rolePost // an arc inside a post block
	}
	if r == rolePost {
		if e.Kind == dxfimport.KindPoint && e.From == nil {
			return false
		}
		s.postEnts = append(s.postEnts, e)
		return true
	}
	// Lines and polylines of a point-load layer: a post drawn above as a
	// small closed outline is a point load; the others (leaders, arrows)
	// are counted as ignored by loadOutlineMarks (pointloadoutlines.go).
	s.loadEnts = append(s.loadEnts, e)
	return true
}

// loadPath finds posts, beams and point loads once the members and their
// bearings are known.
func (g *grouper) loadPath() {
	g.findPosts()
	g.findBeams()
	g.findPointLoads()
	g.edgeStripBeams()
	g.zonePastBeams()
	g.beamsInRuns()
}

// blockGroups splits entities into those drawn in model space and those
// of each block insert (by Entity.From), inserts in drawing order.
func blockGroups(ents []dxfimport.Entity) (model []dxfimport.Entity, blocks [][]dxfimport.Entity) {
	if !slices.ContainsFunc(ents, func(e dxfimport.Entity) bool { return e.From != nil }) {
		return ents, nil // all in model space, as posts drawn as outlines or circles are
	}
	at := map[dxfimport.Pos]int{}
	for _, e := range ents {
		if e.From == nil {
			model = append(model, e)
			continue
		}
		i, ok := at[*e.From]
		if !ok {
			i = len(blocks)
			at[*e.From] = i
			blocks = append(blocks, nil)
		}
		blocks[i] = append(blocks[i], e)
	}
	return model, blocks
}

// box is an axis-aligned bounding box.
type box struct{ lo, hi Point }

func emptyBox() box {
	return box{Point{X: math.Inf(1), Y: math.Inf(1)}, Point{X: math.Inf(-1), Y: math.Inf(-1)}}
}

func (b *box) addPoint(p Point, r float64) {
	b.lo.X, b.lo.Y = math.Min(b.lo.X, p.X-r), math.Min(b.lo.Y, p.Y-r)
	b.hi.X, b.hi.Y = math.Max(b.hi.X, p.X+r), math.Max(b.hi.Y, p.Y+r)
}

func (b box) ok() bool      { return b.lo.X <= b.hi.X }
func (b box) centre() Point { return mid(b.lo, b.hi) }

// blockShape returns the centre of a block's drawn entities (texts left
// out) and its texts, joined; ok is false when it draws nothing.
func blockShape(es []dxfimport.Entity) (at Point, text string, textPos dxfimport.Pos, ok bool) {
	bx := emptyBox()
	var texts []string
	for _, e := range es {
		if isText(e) {
			if len(texts) == 0 {
				textPos = e.Pos
			}
			texts = append(texts, strings.Join(strings.Fields(e.Text), " "))
			continue
		}
		for _, p := range e.Points {
			bx.addPoint(p, e.RadiusIn)
		}
	}
	if !bx.ok() {
		return Point{}, "", textPos, false
	}
	return bx.centre(), strings.Join(texts, " "), textPos, true
}

// findPosts reads the posts: circles, closed outlines and block inserts
// on posts layers, then the size texts beside them.
func (g *grouper) findPosts() {
	s := &g.lp
	if len(s.postEnts) == 0 {
		return
	}
	model, blocks := blockGroups(s.postEnts)
	posts := make([]Post, 0, len(model)+len(blocks))
	for _, es := range blocks {
		if at, text, tp, ok := blockShape(es); ok {
			posts = append(posts, Post{At: at, DrawnAs: "block", Pos: *es[0].From, Text: text, TextPos: tp})
		}
	}
	var lines []segItem
	for _, e := range model {
		switch {
		case e.Kind == dxfimport.KindCircle:
			if d := 2 * e.RadiusIn; d > maxPostCircleIn || d <= 0 {
				g.warn(e.Pos, CodePostSkipped, "circle of %.1f in diameter on a posts layer is not read as a post "+
					"(a post is at most %g in across); skipped", d, maxPostCircleIn)
				continue
			}
			posts = append(posts, Post{At: e.Points[0], DrawnAs: "circle", Pos: e.Pos})
		case isPoly(e) && (e.Closed || len(e.Points) > 2 && dist(e.Points[0], e.Points[len(e.Points)-1]) <= g.opt.SnapToleranceIn):
			if p, ok := g.outlinePost(e.Points, e.Pos); ok {
				posts = append(posts, p)
			}
		default:
			g.addSegments(e, -1, &lines)
		}
	}
	posts = append(posts, g.linePosts(lines)...)
	byPlace := func(a, b Post) int {
		rnd := func(v float64) float64 { return math.Round(v*1000) / 1000 }
		if c := cmp.Compare(rnd(a.At.Y), rnd(b.At.Y)); c != 0 {
			return c
		}
		return cmp.Compare(rnd(a.At.X), rnd(b.At.X))
	}
	if !slices.IsSortedFunc(posts, byPlace) { // a drawing's posts are often drawn in order
		slices.SortStableFunc(posts, byPlace)
	}
	for i := range posts {
		posts[i].ID = "P" + strconv.Itoa(i+1)
	}
	g.plan.Posts = posts
	g.postTexts()
}

// outlineSides returns the sides of the box of pts in the frame of the
// direction u, smaller first, and the box's centre.
func outlineSides(pts []Point, u Point) (a, b float64, c Point) {
	n := rot90(u)
	lo, hi := [2]float64{math.Inf(1), math.Inf(1)}, [2]float64{math.Inf(-1), math.Inf(-1)}
	for _, p := range pts {
		x, y := dot(p, u), dot(p, n)
		lo[0], hi[0] = math.Min(lo[0], x), math.Max(hi[0], x)
		lo[1], hi[1] = math.Min(lo[1], y), math.Max(hi[1], y)
	}
	c = add(scale(u, (lo[0]+hi[0])/2), scale(n, (lo[1]+hi[1])/2))
	a, b = hi[0]-lo[0], hi[1]-lo[1]
	if a > b {
		a, b = b, a
	}
	return a, b, c
}

// outlinePost makes a post of a closed outline no more than maxPostIn
// across, or warns and skips it.
func (g *grouper) outlinePost(pts []Point, pos dxfimport.Pos) (Post, bool) {
	var u Point
	for i := 1; i < len(pts) && u == (Point{}); i++ {
		u = unit(sub(pts[i], pts[i-1]))
	}
	if u == (Point{}) {
		return Post{}, false
	}
	a, b, c := outlineSides(pts, u)
	if b > maxPostIn+g.opt.SnapToleranceIn {
		g.warn(pos, CodePostSkipped, "outline %.1f x %.1f in on a posts layer is larger than a post (%g in across); skipped", a, b, maxPostIn)
		return Post{}, false
	}
	return Post{At: c, DrawnAs: "outline", SizeIn: a, DepthIn: b, Pos: pos}, true
}

// linePosts makes posts of lines (and open polylines) on posts layers
// that meet end to end in closed figures no more than maxPostIn across
// (a square of 4 lines, with or without its diagonals); other lines are
// reported and skipped.
func (g *grouper) linePosts(lines []segItem) []Post {
	tol := g.opt.SnapToleranceIn
	var out []Post
	for _, fig := range closedFigures(lines, tol) {
		ls := fig.lines
		var pts []Point
		var pos []dxfimport.Pos
		for _, i := range ls {
			pts = append(pts, lines[i].a, lines[i].b)
			if len(pos) == 0 || pos[len(pos)-1] != lines[i].pos {
				pos = append(pos, lines[i].pos)
			}
		}
		if !fig.closed {
			g.warn(pos[0], CodePostSkipped, "%d line(s) on a posts layer (%s) do not close an outline; not a post, skipped",
				len(ls), handles(pos, 3))
			continue
		}
		a, b, c := outlineSides(pts, unit(sub(pts[1], pts[0])))
		if b > maxPostIn+tol {
			g.warn(pos[0], CodePostSkipped, "outline %.1f x %.1f in on a posts layer (%s) is larger than a post (%g in across); skipped",
				a, b, handles(pos, 3), maxPostIn)
			continue
		}
		out = append(out, Post{At: c, DrawnAs: "outline", SizeIn: a, DepthIn: b, Pos: pos[0]})
	}
	return out
}

// postTextReachIn is how far a size text may sit from a post's centre:
// three text heights, at least 12 in, as for callouts (common practice,
// no source).
func postTextReachIn(t textItem) float64 { return math.Max(12, 3*t.heightIn) }

// postTexts gives each post without a text of its own the nearest text
// within reach on a posts layer, else the nearest label text naming a
// size; a text goes to its nearest post only.
func (g *grouper) postTexts() {
	assignPostTexts(g.plan.Posts, g.lp.postTexts, func(textItem) bool { return true })
	assignPostTexts(g.plan.Posts, g.labelTexts, func(t textItem) bool {
		if !anySizeRE.MatchString(normalizeCallout(t.text)) {
			return false
		}
		co, err := readCallout(t.text)
		return err != nil || co.SpacingIn == 0 // "2x10 @ 16" o.c.", "1 3/4 x 9 1/2 LVL @ 16" are the joists'
	})
}

// pointGrid finds the nearest of a set of points within a reach through
// cells as wide as the longest reach, instead of looking at every point.
type pointGrid struct {
	cell  float64
	at    func(i int) Point
	cells map[[2]int][]int
}

// newPointGrid indexes the points 0 to n-1 that point takes (ok), in
// cells cell wide (the longest reach asked later; above 0).
func newPointGrid(cell float64, n int, point func(i int) (Point, bool)) *pointGrid {
	g := &pointGrid{cell: cell, cells: map[[2]int][]int{}}
	pts := make([]Point, n)
	for i := 0; i < n; i++ {
		p, ok := point(i)
		pts[i] = p
		if ok {
			c := g.key(p)
			g.cells[c] = append(g.cells[c], i)
		}
	}
	g.at = func(i int) Point { return pts[i] }
	return g
}

func (g *pointGrid) key(p Point) [2]int {
	return [2]int{int(math.Floor(p.X / g.cell)), int(math.Floor(p.Y / g.cell))}
}

// nearest returns the point nearest p within reach and its distance, -1
// when there is none; of points as near, the last (as a scan of every
// point keeping each one at least as near would).
func (g *pointGrid) nearest(p Point, reach float64) (int, float64) {
	best, bd := -1, reach
	lo, hi := g.key(Point{X: p.X - reach, Y: p.Y - reach}), g.key(Point{X: p.X + reach, Y: p.Y + reach})
	for cx := lo[0]; cx <= hi[0]; cx++ {
		for cy := lo[1]; cy <= hi[1]; cy++ {
			for _, i := range g.cells[[2]int{cx, cy}] {
				if d := dist(g.at(i), p); d < bd || (d == bd && i > best) {
					best, bd = i, d
				}
			}
		}
	}
	return best, bd
}

// assignPostTexts gives each post without a text the nearest of the texts
// accept takes within its reach (postTextReachIn), a text going to its
// nearest post only (of posts as near, the last; of texts as near a post,
// the first).
func assignPostTexts(posts []Post, texts []textItem, accept func(textItem) bool) {
	// the texts taken, and the posts still without a text in a grid
	// of cells as wide as the longest reach: a text looks at the
	// cells its reach touches, not at every post (a plan with its
	// posts labelled has as many texts as posts)
	reach := make([]float64, len(texts))
	cell := 0.0
	for ti, t := range texts {
		if accept(t) {
			reach[ti] = postTextReachIn(t)
			cell = math.Max(cell, reach[ti])
		}
	}
	if cell == 0 {
		return
	}
	grid := newPointGrid(cell, len(posts), func(k int) (Point, bool) { return posts[k].At, posts[k].Text == "" })
	best := map[int]int{} // post -> text
	bestD := map[int]float64{}
	for ti, t := range texts {
		if reach[ti] == 0 {
			continue
		}
		pk, pd := grid.nearest(t.p, reach[ti])
		if pk < 0 {
			continue
		}
		if d, ok := bestD[pk]; !ok || pd < d {
			best[pk], bestD[pk] = ti, pd
		}
	}
	for k, ti := range best {
		posts[k].Text = strings.Join(strings.Fields(texts[ti].text), " ")
		posts[k].TextPos = texts[ti].pos
	}
}
