package export

import (
	"framecheck/export/internal/fmtx"
	"html/template"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"
)

// labelEveryMemberUpTo is the largest plan whose members each get a mark
// label; larger plans label each mark once per run (where it first comes
// in the Results order, position order), which still names every run,
// failing members once per stretch of a run and mark (with the largest
// ratio) and erroring members always.
const labelEveryMemberUpTo = 2000

// planSVG writes the plan as one <svg> element, the members drawn by runs
// (report_runs.go), and the member details for the panel (memberData). It is written by hand into one
// buffer, not through the template, so that a plan of 100,000 members stays
// fast: every string is escaped by appendHTML or appendJSString.
//
// The drawing is in inches with y negated, so north (drawing +y) is up on
// the page while text stays upright.
func planSVG(r *Results, g *PlanGeometry) (template.HTML, template.JS) {
	toInch, ok := UnitToInch(r.DrawingUnits)
	if !ok {
		toInch = 1
	}
	type seg = memberSeg
	segs := make([]seg, len(r.Members))
	var bb bbox
	minGap := math.Inf(1)
	for i := range r.Members {
		m := &r.Members[i]
		a, b := inches(m.Start, m.End, m.StartIn, m.EndIn, toInch)
		segs[i] = seg{a, b}
		bb.add(a)
		bb.add(b)
		for _, gap := range [2]float64{m.SpacingIn, m.TribIn} {
			if finite(gap) && gap > 0 && gap < minGap {
				minGap = gap
			}
		}
	}
	for _, p := range g.Supports {
		for _, q := range p.Points {
			bb.add(q)
		}
	}
	for _, z := range g.Zones {
		for _, q := range z.Points {
			bb.add(q)
		}
	}
	var beams []seg
	if r.LoadPath != nil {
		beams = make([]seg, len(r.LoadPath.Beams))
		for i := range r.LoadPath.Beams {
			b := &r.LoadPath.Beams[i]
			beams[i].a, beams[i].b = inches(b.Start, b.End, b.StartIn, b.EndIn, toInch)
			bb.add(beams[i].a)
			bb.add(beams[i].b)
		}
	}
	rows := make([]seg, len(r.BlockingRows))
	for i := range r.BlockingRows {
		br := &r.BlockingRows[i]
		a, b := inches(br.Start, br.End, br.StartIn, br.EndIn, toInch)
		rows[i] = seg{a, b}
		bb.add(a)
		bb.add(b)
	}
	if bb.empty() {
		bb.add([2]float64{0, 0})
		bb.add([2]float64{120, 120})
	}
	w, h := bb.hi[0]-bb.lo[0], bb.hi[1]-bb.lo[1]
	ext := math.Max(w, h)
	if ext <= 0 {
		ext = 120
	}
	pad := 0.04 * ext
	textH := LabelHeightIn(ext)
	if !math.IsInf(minGap, 1) && textH > 0.6*minGap {
		textH = 0.6 * minGap
	}

	buf := make([]byte, 0, 4096+len(r.Members)*24)
	buf = append(buf, `<svg id="plan-svg" xmlns="http://www.w3.org/2000/svg" preserveAspectRatio="xMidYMid meet" role="img" aria-label="framing plan coloured by ratio" viewBox="`...)
	buf = appendCoord(buf, bb.lo[0]-pad)
	buf = append(buf, ' ')
	buf = appendCoord(buf, -bb.hi[1]-pad)
	buf = append(buf, ' ')
	buf = appendCoord(buf, w+2*pad)
	buf = append(buf, ' ')
	buf = appendCoord(buf, h+2*pad)
	buf = append(buf, `">`+"\n"...)

	// Zones: one path per zone name (its title), a subpath per outline,
	// then each outline's name at its centroid, the text's attributes
	// given once: a plan of many units draws thousands of outlines.
	buf = append(buf, `<g id="zones">`...)
	var zoneNames []string
	byZone := map[string][]int{}
	for i, z := range g.Zones {
		if len(z.Points) < 3 || !finitePoints(z.Points) {
			continue
		}
		if _, ok := byZone[z.Name]; !ok {
			zoneNames = append(zoneNames, z.Name)
		}
		byZone[z.Name] = append(byZone[z.Name], i)
	}
	for _, name := range zoneNames {
		buf = append(buf, `<path class="zone" d="`...)
		for _, i := range byZone[name] {
			buf = appendOutline(buf, g.Zones[i].Points)
		}
		buf = append(buf, `"><title>zone `...)
		buf = appendHTML(buf, name)
		buf = append(buf, "</title></path>\n"...)
	}
	if n := len(g.Zones); len(zoneNames) > 0 && n <= maxZoneLabels {
		buf = append(buf, `<g class="zone-name" text-anchor="middle" font-size="`...)
		buf = appendCoord(buf, 1.6*textH)
		buf = append(buf, `">`...)
		for _, name := range zoneNames {
			for _, i := range byZone[name] {
				c := centroid(g.Zones[i].Points)
				buf = append(buf, `<text x="`...)
				buf = appendCoord(buf, c[0])
				buf = append(buf, `" y="`...)
				buf = appendCoord(buf, -c[1])
				buf = append(buf, `">`...)
				buf = appendHTML(buf, name)
				buf = append(buf, "</text>"...)
			}
		}
		buf = append(buf, "</g>\n"...)
	}
	buf = append(buf, "</g>\n"+`<g id="supports">`...)
	// Supports: one path per layer (its name the path's title), a
	// subpath per support line: the page grows with the layers, not with
	// the lines.
	var layers []string
	byLayer := map[string][]byte{}
	for _, s := range g.Supports {
		if len(s.Points) < 2 || !finitePoints(s.Points) {
			continue
		}
		d, ok := byLayer[s.Layer]
		if !ok {
			layers = append(layers, s.Layer)
		}
		for k, q := range s.Points {
			if k == 0 {
				d = append(d, 'M')
			} else {
				d = append(d, 'L')
			}
			d = appendCoord(d, q[0])
			d = append(d, ' ')
			d = appendCoord(d, -q[1])
		}
		if s.Closed {
			d = append(d, 'Z')
		}
		byLayer[s.Layer] = d
	}
	for _, l := range layers {
		buf = append(buf, `<path class="support" d="`...)
		buf = append(buf, byLayer[l]...)
		buf = append(buf, `"><title>`...)
		buf = appendHTML(buf, l)
		buf = append(buf, "</title></path>\n"...)
	}

	// Beams of the load path over their support lines, coloured by their
	// largest ratio as the members are, with what they bear on and carry
	// in their title.
	buf = append(buf, "</g>\n"+`<g id="beams" font-size="`...)
	buf = appendCoord(buf, 1.2*textH)
	buf = append(buf, `">`...)
	buf = appendBeams(buf, r, beams, textH)

	// The members by runs (report_runs.go).
	buf = append(buf, "</g>\n"+`<g id="members">`+"\n"...)
	buf = appendMemberPaths(buf, r, segs)

	buf = append(buf, "</g>\n"+`<g id="blocking">`...)
	for i := range r.BlockingRows {
		br := &r.BlockingRows[i]
		s := rows[i]
		if !finite(s.a[0]) || !finite(s.a[1]) || !finite(s.b[0]) || !finite(s.b[1]) {
			continue
		}
		buf = append(buf, `<line id="b-`...)
		buf = appendHTML(buf, br.ID)
		if br.Existing {
			buf = append(buf, `" class="blk-existing" x1="`...)
		} else {
			buf = append(buf, `" class="blk-add" x1="`...)
		}
		buf = appendCoord(buf, s.a[0])
		buf = append(buf, `" y1="`...)
		buf = appendCoord(buf, -s.a[1])
		buf = append(buf, `" x2="`...)
		buf = appendCoord(buf, s.b[0])
		buf = append(buf, `" y2="`...)
		buf = appendCoord(buf, -s.b[1])
		buf = append(buf, `"><title>blocking row `...)
		buf = appendHTML(buf, br.ID)
		buf = append(buf, ", run "...)
		buf = appendHTML(buf, br.Run)
		buf = append(buf, ", "...)
		buf = strconv.AppendInt(buf, int64(br.Pieces), 10)
		buf = append(buf, " pieces "...)
		buf = appendHTML(buf, br.Size)
		if br.Existing {
			buf = append(buf, " (existing)"...)
		} else {
			buf = append(buf, " to add"...)
		}
		buf = append(buf, "</title></line>\n"...)
	}

	buf = append(buf, "</g>\n"+`<g id="labels" font-size="`...)
	buf = appendCoord(buf, textH)
	buf = append(buf, `">`+"\n"...)
	every := len(r.Members) <= labelEveryMemberUpTo
	type runMark struct{ run, mark string }
	labelled := map[runMark]bool{}
	for i := range r.Members {
		m := &r.Members[i]
		s := segs[i]
		if !finite(s.a[0]) || !finite(s.a[1]) || !finite(s.b[0]) || !finite(s.b[1]) {
			continue
		}
		newGroup := i == 0 || m.Mark != r.Members[i-1].Mark || m.Run != r.Members[i-1].Run
		class := "" // #labels text is styled as a plain label
		switch {
		case m.Status == StatusError:
			class = "lbl-err"
		case m.Status == StatusFail && (every || newGroup || r.Members[i-1].Status != StatusFail):
			// Large plans: one label per run and mark that fails, with
			// the largest ratio of the members that follow it alike.
			class = "lbl-fail"
			if !every {
				worst := *m
				for j := i + 1; j < len(r.Members) && r.Members[j].Mark == m.Mark && r.Members[j].Run == m.Run && r.Members[j].Status == StatusFail; j++ {
					if r.Members[j].MaxRatio > worst.MaxRatio {
						worst.MaxRatio = r.Members[j].MaxRatio
					}
				}
				buf = appendLabel(buf, &worst, class, s.a, s.b, textH)
				continue
			}
		case m.Status == StatusFail:
			continue
		case every:
		case newGroup && !labelled[runMark{m.Run, m.Mark}]:
			labelled[runMark{m.Run, m.Mark}] = true
		default:
			continue
		}
		buf = appendLabel(buf, m, class, s.a, s.b, textH)
	}
	buf = append(buf, "</g>\n"+`<g id="carried"></g>`+"\n"+`<line id="pick" x1="0" y1="0" x2="0" y2="0" style="visibility:hidden"/>`+"\n</svg>"...)

	return template.HTML(buf), memberData(r)
}

// appendLabel writes the text at a member's midpoint, along the member and
// kept readable (angle in (-90, 90]): the mark, with the ratio for a
// failing member and "ERROR" for a member in error. Marks sit at 30% of the
// member's length, clear of mid-span blocking rows; failure and error
// labels at the midpoint.
func appendLabel(buf []byte, m *Member, class string, a, b [2]float64, textH float64) []byte {
	text := m.Mark
	if text == "" {
		text = m.ID
	}
	switch m.Status {
	case StatusFail:
		text += " " + fmtx.Ratio(m.MaxRatio)
	case StatusError:
		text = m.ID + " ERROR"
	}
	ang := math.Atan2(b[1]-a[1], b[0]-a[0]) * 180 / math.Pi
	for ang > 90 {
		ang -= 180
	}
	for ang <= -90 {
		ang += 180
	}
	// Lift the text off the line by a third of its height, perpendicular
	// to the member (drawing frame, +y north).
	rad := ang * math.Pi / 180
	off := 0.35 * textH
	t := 0.5
	if m.Status == StatusPass {
		t = 0.3
	}
	x := a[0] + t*(b[0]-a[0]) - math.Sin(rad)*off
	y := a[1] + t*(b[1]-a[1]) + math.Cos(rad)*off
	// The label's place as a translation (and its turn), the anchor in
	// the CSS: about half the bytes of x, y and rotate(a x y).
	buf = append(buf, `<text `...)
	if class != "" {
		buf = append(buf, `class="`...)
		buf = append(buf, class...)
		buf = append(buf, `" `...)
	}
	buf = append(buf, `transform="translate(`...)
	buf = appendCoord(buf, x)
	buf = append(buf, ' ')
	buf = appendCoord(buf, -y)
	buf = append(buf, ')')
	if ang != 0 {
		buf = append(buf, `rotate(`...)
		buf = appendCoord(buf, -ang)
		buf = append(buf, ')')
	}
	buf = append(buf, `">`...)
	buf = appendHTML(buf, text)
	return append(buf, "</text>\n"...)
}

// bbox is a bounding box of finite points.
type bbox struct {
	lo, hi [2]float64
	n      int
}

func (bb *bbox) add(p [2]float64) {
	if !finite(p[0]) || !finite(p[1]) {
		return
	}
	if bb.n == 0 {
		bb.lo, bb.hi = p, p
	} else {
		bb.lo = [2]float64{math.Min(bb.lo[0], p[0]), math.Min(bb.lo[1], p[1])}
		bb.hi = [2]float64{math.Max(bb.hi[0], p[0]), math.Max(bb.hi[1], p[1])}
	}
	bb.n++
}

func (bb *bbox) empty() bool { return bb.n == 0 }

func finitePoints(ps [][2]float64) bool {
	for _, p := range ps {
		if !finite(p[0]) || !finite(p[1]) {
			return false
		}
	}
	return true
}

// maxZoneLabels: a plan with more zone outlines than this names them on
// hover only (each zone's path has its name as title), not with a text on
// each: thousands of names cannot be read on the plan, and they made a
// large plan's report a quarter of a megabyte larger.
const maxZoneLabels = 1000

// centroid returns the mean of the outline's points: enough to place a
// zone's name inside a rectangle or a convex outline.
func centroid(ps [][2]float64) [2]float64 {
	var c [2]float64
	for _, p := range ps {
		c[0] += p[0]
		c[1] += p[1]
	}
	n := float64(len(ps))
	return [2]float64{c[0] / n, c[1] / n}
}

// appendOutline writes a closed outline as an SVG subpath: "Mx,-y"
// then, edge by edge, "Hx" or "Vy" where the edge runs along an axis
// (most outlines are rectangles drawn square to the plan) and "Lx,-y"
// otherwise, then "Z".
func appendOutline(b []byte, ps [][2]float64) []byte {
	b = append(b, 'M')
	b = appendCoord(b, ps[0][0])
	b = append(b, ',')
	b = appendCoord(b, -ps[0][1])
	for i := 1; i < len(ps); i++ {
		p, q := ps[i-1], ps[i]
		switch {
		case q[1] == p[1]:
			b = append(b, 'H')
			b = appendCoord(b, q[0])
		case q[0] == p[0]:
			b = append(b, 'V')
			b = appendCoord(b, -q[1])
		default:
			b = append(b, 'L')
			b = appendCoord(b, q[0])
			b = append(b, ',')
			b = appendCoord(b, -q[1])
		}
	}
	return append(b, 'Z')
}

// appendCoord writes v to 0.01 with trailing zeros dropped; -0 as 0.
func appendCoord(b []byte, v float64) []byte {
	v = math.Round(v*100) / 100
	if v == 0 {
		return append(b, '0')
	}
	n := len(b)
	b = strconv.AppendFloat(b, v, 'f', 2, 64)
	for b[len(b)-1] == '0' {
		b = b[:len(b)-1]
	}
	if b[len(b)-1] == '.' {
		b = b[:len(b)-1]
	}
	if len(b) == n {
		b = append(b, '0')
	}
	return b
}

// appendHTML appends s escaped for HTML text and quoted attribute values.
func appendHTML(b []byte, s string) []byte {
	for i := 0; i < len(s); i++ {
		switch c := s[i]; c {
		case '&':
			b = append(b, "&amp;"...)
		case '<':
			b = append(b, "&lt;"...)
		case '>':
			b = append(b, "&gt;"...)
		case '"':
			b = append(b, "&#34;"...)
		case '\'':
			b = append(b, "&#39;"...)
		case 0:
			b = append(b, "\uFFFD"...)
		default:
			b = append(b, c)
		}
	}
	return b
}

// appendJSString appends s as a double-quoted JavaScript (and JSON) string
// that is safe inside a <script> element: <, >, & and the line separators
// are written as \u escapes, invalid UTF-8 as U+FFFD.
func appendJSString(b []byte, s string) []byte {
	const hex = "0123456789abcdef"
	b = append(b, '"')
	for i := 0; i < len(s); {
		c := s[i]
		if c < utf8.RuneSelf {
			switch {
			case c == '"' || c == '\\':
				b = append(b, '\\', c)
			case c < 0x20 || c == '<' || c == '>' || c == '&' || c == 0x7f:
				b = append(b, '\\', 'u', '0', '0', hex[c>>4], hex[c&15])
			default:
				b = append(b, c)
			}
			i++
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && size == 1:
			b = append(b, `\ufffd`...)
		case r == '\u2028' || r == '\u2029':
			b = append(b, `\u202`...)
			b = append(b, hex[r&15])
		default:
			b = append(b, s[i:i+size]...)
		}
		i += size
	}
	return append(b, '"')
}

// appendBeams writes each beam of the load path as a line coloured by its
// largest ratio (grey in error), titled with its id, mark, size, ratio,
// status, what it bears on and the members it carries, and labelled with
// its id and ratio at mid-length.
func appendBeams(buf []byte, r *Results, segs []memberSeg, textH float64) []byte {
	if r.LoadPath == nil {
		return buf
	}
	for i := range r.LoadPath.Beams {
		b := &r.LoadPath.Beams[i]
		s := segs[i]
		if !finite(s.a[0]) || !finite(s.a[1]) || !finite(s.b[0]) || !finite(s.b[1]) {
			continue
		}
		class := "beam " + bandClass(b.MaxRatio, b.Status)
		buf = append(buf, `<line class="`...)
		buf = append(buf, class...)
		buf = append(buf, `" stroke="`...)
		if b.Status == StatusError {
			buf = append(buf, errorColour...)
		} else {
			buf = appendColour(buf, b.MaxRatio)
		}
		buf = append(buf, `" data-beam="`...)
		buf = appendHTML(buf, b.ID)
		buf = append(buf, `" data-carries="`...)
		buf = appendHTML(buf, strings.Join(b.Carries, " "))
		buf = append(buf, `" x1="`...)
		buf = appendCoord(buf, s.a[0])
		buf = append(buf, `" y1="`...)
		buf = appendCoord(buf, -s.a[1])
		buf = append(buf, `" x2="`...)
		buf = appendCoord(buf, s.b[0])
		buf = append(buf, `" y2="`...)
		buf = appendCoord(buf, -s.b[1])
		buf = append(buf, `"><title>beam `...)
		buf = appendHTML(buf, b.ID)
		if b.Mark != "" && b.Mark != b.ID {
			buf = append(buf, " ("...)
			buf = appendHTML(buf, b.Mark)
			buf = append(buf, ')')
		}
		buf = append(buf, ' ')
		buf = appendHTML(buf, b.Size)
		text := b.ID
		if b.Status == StatusError {
			buf = append(buf, ": error"...)
			text += " ERROR"
		} else {
			buf = append(buf, ": "...)
			buf = appendHTML(buf, b.Governing)
			buf = append(buf, ' ')
			buf = append(buf, fmtx.Ratio(b.MaxRatio)...)
			buf = append(buf, ", "...)
			buf = appendHTML(buf, b.Status)
			text += " " + fmtx.Ratio(b.MaxRatio)
		}
		if len(b.Supports) > 0 {
			buf = append(buf, "; bears on "...)
			buf = appendHTML(buf, strings.Join(b.Supports, ", "))
		}
		if len(b.Carries) > 0 {
			buf = append(buf, "; carries "...)
			buf = appendHTML(buf, strings.Join(b.Carries, ", "))
		}
		buf = append(buf, "</title></line>\n"...)
		class = "lbl-beam"
		if b.Status == StatusFail {
			class += " lbl-fail"
		}
		buf = appendLabel(buf, &Member{Mark: text}, class, s.a, s.b, 1.2*textH)
	}
	return buf
}
