package framing

import (
	"fmt"
	"math"

	"framecheck/dxfimport"
)

// maxFigureLines bounds the closed figures brokenOutlines looks for.
const maxFigureLines = 12

// brokenOutlines finds joist outlines drawn with LINEs that are not
// rectangles: a short line left over (neither a side nor an end cap of
// an outline) that is part of a closed, thin figure of joist lines meeting
// end to end within the snap tolerance (a tapered outline, one with a
// pointed or broken end). The figure's member is an error naming the
// lines; lines of the figure that are not sides of an outline are taken
// out of the joists. Open chains (joists drawn end to end) and wide
// figures (joists and blocking around a bay) are left alone.
func (g *grouper) brokenOutlines() {
	raw := g.rawJoists
	if raw == nil {
		raw = g.joists
	}
	rawIdx := func(i int) int {
		if g.rawOf == nil {
			return i
		}
		return int(g.rawOf[i])
	}
	capMax := g.capMaxLenIn()
	var cands []int
	for i := range g.joists {
		if r := rawIdx(i); r >= 0 && dist(raw[r].a, raw[r].b) <= capMax {
			cands = append(cands, r)
		}
	}
	if len(cands) == 0 {
		return
	}
	tol := g.opt.SnapToleranceIn
	lo, hi, typ := bounds(raw)
	idx := newSegIndex(lo, hi, len(raw), typ)
	for i, s := range raw {
		idx.insert(i, s.a, s.b, 0)
	}
	done := map[int]bool{}
	dropRaw := map[int]bool{}
	type figure struct {
		pts []Point
		pos dxfimport.Pos
		msg string
	}
	var figures []figure
	for _, r := range cands {
		if done[r] {
			continue
		}
		comp := []int{r}
		in := map[int]bool{r: true}
		closed := true
		for q := 0; q < len(comp) && len(comp) <= maxFigureLines; q++ {
			l := comp[q]
			for _, p := range [2]Point{raw[l].a, raw[l].b} {
				touched := false
				idx.query(p, p, tol, func(j int) {
					if j == l || (dist(p, raw[j].a) > tol && dist(p, raw[j].b) > tol) {
						return
					}
					touched = true
					if !in[j] {
						in[j] = true
						comp = append(comp, j)
					}
				})
				closed = closed && touched
			}
		}
		for _, l := range comp {
			done[l] = true
		}
		if !closed || len(comp) < 3 || len(comp) > maxFigureLines || !g.thinFigure(raw, comp) {
			continue
		}
		pos := make([]dxfimport.Pos, len(comp))
		for i, l := range comp {
			pos[i] = raw[l].pos
		}
		sortPos(pos)
		bundle := int32(-1)
		for _, l := range comp {
			if g.rawBundle != nil && g.rawBundle[l] >= 0 {
				bundle = g.rawBundle[l]
			}
		}
		what := fmt.Sprintf("its outline of %d lines (%s) is not a rectangle", len(comp), handles(pos, 8))
		if bundle >= 0 && g.ols[bundle].err == "" {
			g.ols[bundle].err, g.ols[bundle].code = what, CodeNotRectangle
		}
		for _, l := range comp {
			if g.rawBundle == nil || g.rawBundle[l] < 0 {
				dropRaw[l] = true
			}
		}
		if bundle < 0 { // one error member on the figure's strip
			var pts []Point
			for _, l := range comp {
				pts = append(pts, raw[l].a, raw[l].b)
			}
			figures = append(figures, figure{pts, pos[0], what})
		}
	}
	if len(dropRaw) == 0 {
		return
	}
	defer func() {
		for _, f := range figures {
			if !g.addBadOutline(f.pts, f.pos, f.msg) {
				g.plan.Issues.Add(f.pos, CodeNotRectangle, dxfimport.SevError,
					"joist outline: %s; not checked: draw the member as a rectangle or as its centre line", f.msg)
			}
		}
	}()
	drop := make([]bool, len(g.joists))
	for i := range g.joists {
		if r := rawIdx(i); r >= 0 && dropRaw[r] {
			drop[i] = true
		}
	}
	g.dropJoists(drop)
}

// thinFigure reports whether lines comp fit in a strip no wider than the
// widest built-up member (plus the snap tolerance) along the longest one.
func (g *grouper) thinFigure(raw []segItem, comp []int) bool {
	long := comp[0]
	for _, l := range comp {
		if dist(raw[l].a, raw[l].b) > dist(raw[long].a, raw[long].b) {
			long = l
		}
	}
	n := rot90(unit(sub(raw[long].b, raw[long].a)))
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, l := range comp {
		for _, p := range [2]Point{raw[l].a, raw[l].b} {
			c := dot(p, n)
			lo, hi = math.Min(lo, c), math.Max(hi, c)
		}
	}
	return hi-lo <= maxBuiltUpIn+g.opt.SnapToleranceIn
}

// sortPos orders positions by line, then handle.
func sortPos(ps []dxfimport.Pos) {
	for i := 1; i < len(ps); i++ {
		for j := i; j > 0 && (ps[j].Line < ps[j-1].Line || (ps[j].Line == ps[j-1].Line && ps[j].Handle < ps[j-1].Handle)); j-- {
			ps[j], ps[j-1] = ps[j-1], ps[j]
		}
	}
}
