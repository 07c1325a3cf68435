package synth

import (
	"fmt"
	"math"
)

// wall draws a double-line wall of thickness tIn centred on y = yc from
// x1 to x2.
func wall(w drawer, layer string, x1, x2, yc, tIn float64) {
	w.Line(layer, x1, yc-tIn/2, x2, yc-tIn/2)
	w.Line(layer, x1, yc+tIn/2, x2, yc+tIn/2)
}

// drawer is the part of dxfw.Writer the drawing uses.
type drawer interface {
	Line(layer string, x1, y1, x2, y2 float64)
	ClosedPolyline(layer string, pts [][2]float64)
	Text(layer string, x, y, heightIn, rotDeg float64, s string)
}

// drawRun draws one run: its joists, supports, drawn blocking and
// callout. Joist ends stop 0.5 in inside a wall's outer face, 0.5 in from
// a flush beam's line and 0.75 in short of a dropped beam's line.
//
// With o.Outlines, each joist is drawn as a rectangle of four LINEs 1.5 in
// wide (a 2x) around that centre line. With o.Beams, each beam line gets
// its posts (beamPosts). It returns the beam lines and posts drawn.
func drawRun(w drawer, r *run, o Options) (beams, posts int) {
	const ext = extWallIn / 2
	x1, x2 := r.x0-8, r.x0+r.widthIn()+8
	y0, s := r.y0, r.spanIn
	var from, to float64 // joist ends, relative to y0
	layer := lyJoistFloor
	switch r.kind {
	case kindSimple:
		wall(w, lyWallExt, x1, x2, y0, extWallIn)
		wall(w, lyWallExt, x1, x2, y0+s, extWallIn)
		from, to = -ext+0.5, s+ext-0.5
	case kindFlush, kindStorage:
		w.Line(lyBeamFlush, x1, y0, x2, y0)
		beams, posts = 1, drawPosts(w, o.Beams, x1, x2, y0)
		wall(w, lyWallExt, x1, x2, y0+s, extWallIn)
		from, to = 0.5, s+ext-0.5
	case kindContinuous:
		wall(w, lyWallExt, x1, x2, y0, extWallIn)
		wall(w, lyWallInt, x1, x2, y0+s, intWallIn)
		wall(w, lyWallExt, x1, x2, y0+2*s, extWallIn)
		w.Line(lyBlocking, x1+2, y0+s/2, x2-2, y0+s/2)
		w.Line(lyBlocking, x1+2, y0+1.5*s, x2-2, y0+1.5*s)
		from, to = -ext+0.5, 2*s+ext-0.5
	case kindCantilever:
		wall(w, lyWallExt, x1, x2, y0, extWallIn)
		wall(w, lyWallExt, x1, x2, y0+s, extWallIn)
		from, to = -ext+0.5, s+r.cantIn
	case kindRoof:
		w.Line(lyBeamDropped, x1, y0, x2, y0)
		w.Line(lyBeamDropped, x1, y0+s, x2, y0+s)
		beams, posts = 2, drawPosts(w, o.Beams, x1, x2, y0)+drawPosts(w, o.Beams, x1, x2, y0+s)
		from, to = 0.75, s-0.75
		layer = lyJoistRoof
	}
	for i := 0; i < r.count; i++ {
		x := r.x0 + float64(i)*r.ocIn
		a := from
		if i == r.short {
			a += shortByIn
		}
		if !o.Outlines {
			w.Line(layer, x, y0+a, x, y0+to)
			continue
		}
		const h = 0.75 // half a 2x's dressed thickness (NDS 2018 Supplement Table 1B)
		w.Line(layer, x-h, y0+a, x-h, y0+to)
		w.Line(layer, x-h, y0+to, x+h, y0+to)
		w.Line(layer, x+h, y0+to, x+h, y0+a)
		w.Line(layer, x+h, y0+a, x-h, y0+a)
	}
	if r.callout != "" {
		ly := y0 + 0.4*s
		w.Line(lyNote, x1+4, ly, x2-4, ly)
		w.Text(lyNote, r.x0+8, ly+3, 6, 0, r.callout)
	}
	if !o.Beams {
		return 0, 0 // the beam lines are rigid bearings: not counted
	}
	return beams, posts
}

// Posts under the beams (Options.Beams).
const (
	// postIn is a 6x6 post's dressed size, 5.5 in (NDS 2018 Supplement
	// Table 1B), drawn as a square outline.
	postIn = 5.5
	// maxBeamSpanIn is the longest beam span between posts: 16 ft, about
	// the longest span between posts of a sawn or timber beam carrying a
	// floor (common practice, no source).
	maxBeamSpanIn = 192.0
)

// beamPosts returns the x of the post centres under a beam drawn from x1
// to x2: one under each end, its outer face flush with the beam's end,
// and as few between, equally spaced, as keep every span (centre to
// centre) within maxBeamSpanIn.
func beamPosts(x1, x2 float64) []float64 {
	a, b := x1+postIn/2, x2-postIn/2
	n := max(1, int(math.Ceil((b-a)/maxBeamSpanIn-1e-9)))
	xs := make([]float64, n+1)
	for i := range xs {
		xs[i] = a + (b-a)*float64(i)/float64(n)
	}
	return xs
}

// drawPosts draws, when on, the posts of the beam from x1 to x2 on y =
// yc as closed square outlines on the posts layer; it returns how many.
func drawPosts(w drawer, on bool, x1, x2, yc float64) int {
	if !on {
		return 0
	}
	xs := beamPosts(x1, x2)
	const h = postIn / 2
	for _, x := range xs {
		w.ClosedPolyline(lyPost, [][2]float64{{x - h, yc - h}, {x + h, yc - h}, {x + h, yc + h}, {x - h, yc + h}})
	}
	return len(xs)
}

// drawZone outlines each of a unit's runs as its zone, drawn to the outer
// faces of the run's edge joists across and from its first support line
// to its last (or its cantilever's tip) along: a zone reaching on past the
// framing is a strip whose load no member drawn carries (FRM222, FRM224);
// it writes the zone name inside each and a note naming the unit.
func drawZone(w drawer, u int, runs []run) {
	lo, hi := runs[0].x0-zoneMarginIn, 0.0
	top := 0.0
	for i := range runs {
		hi = max(hi, runs[i].x0+runs[i].widthIn()+zoneMarginIn)
		top = max(top, runs[i].extentIn())
	}
	y0 := runs[0].y0
	t := y0 + top + zoneMarginIn
	layer := lyZoneFloor
	if runs[0].kind == kindRoof {
		layer = lyZoneRoof
	}
	for i := range runs {
		r := &runs[i]
		l, h := r.x0-zoneFaceIn, r.x0+r.widthIn()+zoneFaceIn
		zb, zt := r.y0, r.y0+r.zoneTopIn()
		w.ClosedPolyline(layer, [][2]float64{{l, zb}, {h, zb}, {h, zt}, {l, zt}})
		w.Text(layer, (l+h)/2, zb+10, 8, 0, r.zone)
	}
	w.Text(lyNotes, lo+10, t-20, 8, 0, fmt.Sprintf("UNIT %d", u+1))
	w.Line(lyGrid, lo, t+20, hi, t+20)
}
