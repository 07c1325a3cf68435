package framing

import (
	"fmt"
	"math"

	"framecheck/dxfimport"
)

// CodePointLoadSkipped: a closed outline on a point-load layer too large
// to be a post symbol; not read as a point load.
const CodePointLoadSkipped = "FRM236"

// A post drawn above a beam, from the floor above, is a point load on it
// (issue 17 item 3). On a point-load layer it is drawn as posts are: a
// small closed outline (a closed LWPOLYLINE or POLYLINE, or LINEs meeting
// end to end in a square or rectangle), with its text beside it. Such an
// outline is a mark at its centre, read exactly as a point, circle or
// block is: its text gives the load or names a [[point_load]]; without a
// readable text it is an error naming its handle, never a load of zero.
// Other lines on the layer (leaders, arrows) are not read.

// loadOutlineMarks splits the model-space entities of the point-load
// layers: points and circles are returned as marks at their centres, as
// are closed outlines no more than maxPostIn across (the largest post,
// see posts.go); lines that close no outline are counted as ignored.
func (g *grouper) loadOutlineMarks(model []dxfimport.Entity) []PointLoadMark {
	var marks []PointLoadMark
	var lines []segItem
	tol := g.opt.SnapToleranceIn
	for _, e := range model {
		switch {
		case e.Kind == dxfimport.KindPoint || e.Kind == dxfimport.KindCircle:
			marks = append(marks, PointLoadMark{At: e.Points[0], Pos: e.Pos})
		case isPoly(e) && len(e.Points) > 2 && (e.Closed || dist(e.Points[0], e.Points[len(e.Points)-1]) <= tol):
			if at, ok := g.loadOutline(e.Points, []dxfimport.Pos{e.Pos}); ok {
				marks = append(marks, PointLoadMark{At: at, Pos: e.Pos})
			}
		default:
			if !g.addSegments(e, -1, &lines) {
				g.ignore(e)
			}
		}
	}
	for _, fig := range closedFigures(lines, tol) {
		if !fig.closed {
			for _, i := range fig.lines {
				g.ignoreKey(lines[i].pos.Layer, dxfimport.KindLine)
			}
			continue
		}
		var pts []Point
		var pos []dxfimport.Pos
		for _, i := range fig.lines {
			pts = append(pts, lines[i].a, lines[i].b)
			if len(pos) == 0 || pos[len(pos)-1] != lines[i].pos {
				pos = append(pos, lines[i].pos)
			}
		}
		if at, ok := g.loadOutline(pts, pos); ok {
			marks = append(marks, PointLoadMark{At: at, Pos: pos[0]})
		}
	}
	return marks
}

// ignore counts an entity the point-load role has no use for.
func (g *grouper) ignore(e dxfimport.Entity) { g.ignoreKey(e.Pos.Layer, e.Kind) }

// ignoreKey counts one entity of kind on layer as ignored (Plan.Ignored).
func (g *grouper) ignoreKey(layer string, kind any) {
	if g.plan.Ignored == nil {
		g.plan.Ignored = map[string]int{}
	}
	g.plan.Ignored[fmt.Sprintf("%s (%s)", layer, kind)]++
}

// loadOutline returns the centre of a closed outline of points pts drawn
// by the entities pos, or warns (naming their handles) and returns false
// when it is larger than a post.
func (g *grouper) loadOutline(pts []Point, pos []dxfimport.Pos) (Point, bool) {
	var u Point
	for i := 1; i < len(pts) && u == (Point{}); i++ {
		u = unit(sub(pts[i], pts[i-1]))
	}
	if u == (Point{}) {
		return Point{}, false
	}
	a, b, c := outlineSides(pts, u)
	if b > maxPostIn+g.opt.SnapToleranceIn {
		g.warn(pos[0], CodePointLoadSkipped, "outline %.1f x %.1f in on a point-load layer (%s) is larger than a post symbol "+
			"(%g in across): not read as a point load; draw a post above as a point, circle, block or small outline with its load beside it",
			a, b, handles(pos, 3), maxPostIn)
		return Point{}, false
	}
	return c, true
}

// figure is a set of lines joined end to end; closed when every end
// meets another line's end.
type figure struct {
	lines  []int
	closed bool
}

// closedFigures groups lines whose ends meet within tol into figures (posts
// drawn as lines, point-load outlines), in the order of their first line;
// a figure of three or more lines whose every end meets another is closed
// (a square of 4 lines, with or without its diagonals).
func closedFigures(lines []segItem, tol float64) []figure {
	n := len(lines)
	if n == 0 {
		return nil
	}
	sets := newDisjointSets(n)
	end := func(e int) Point {
		if e%2 == 0 {
			return lines[e/2].a
		}
		return lines[e/2].b
	}
	// ends on a grid of cells one tolerance wide
	type cell struct{ x, y int64 }
	cellOf := func(p Point) cell { return cell{int64(math.Floor(p.X / tol)), int64(math.Floor(p.Y / tol))} }
	grid := map[cell][]int{}
	met := make([]bool, 2*n)
	for e := 0; e < 2*n; e++ {
		c := cellOf(end(e))
		for dx := int64(-1); dx <= 1; dx++ {
			for dy := int64(-1); dy <= 1; dy++ {
				for _, f := range grid[cell{c.x + dx, c.y + dy}] {
					if f/2 != e/2 && dist(end(e), end(f)) <= tol {
						met[e], met[f] = true, true
						sets.union(e/2, f/2)
					}
				}
			}
		}
		grid[c] = append(grid[c], e)
	}
	at := map[int]int{}
	var out []figure
	for i := range lines {
		r := sets.find(i)
		k, ok := at[r]
		if !ok {
			k = len(out)
			at[r] = k
			out = append(out, figure{closed: true})
		}
		out[k].lines = append(out[k].lines, i)
		out[k].closed = out[k].closed && met[2*i] && met[2*i+1]
	}
	for k := range out {
		out[k].closed = out[k].closed && len(out[k].lines) >= 3
	}
	return out
}
