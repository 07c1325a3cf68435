package framing

import (
	"fmt"
	"math"
	"slices"
	"strings"

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
	idx := indexSegs(raw)
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
		sizePlies, ply := splitPlies(m.Size)
		bIn, _, err := DressedSize(ply)
		plies := ol.seams + 1
		if plies > 1 {
			m.Plies = plies
			switch {
			case sizePlies <= 1 && err == nil:
				// one member of plies x the ply, checked as such
				m.Size = fmt.Sprintf("(%d) %s", plies, ply)
			case sizePlies != plies:
				g.memberError(m, CodeBuiltUp, "%s is drawn as %d plies side by side (%s) but its size says %s", m.ID, plies, drawn, m.Size)
				continue
			}
			msg := fmt.Sprintf("%s is a built-up member of %d plies drawn side by side (%s, %.2f in in all): checked as one member %s",
				m.ID, plies, drawn, ol.widthIn, m.Size)
			m.Messages = append(m.Messages, msg)
			g.plan.Issues.Add(m.Pos, CodeBuiltUp, dxfimport.SevInfo, "%s", msg)
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
