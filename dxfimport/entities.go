package dxfimport

import "strings"

// local is an entity as read, in the coordinates of its container (a
// block definition or model space), drawing units, OCS already applied;
// or an INSERT (ins != nil) still to be expanded.
type local struct {
	e   Entity
	ins *insertRef
}

// insertRef is an INSERT or MINSERT as read.
type insertRef struct {
	name       string
	at         vec3 // insertion point, OCS
	sx, sy     float64
	rotDeg     float64
	cols, rows int
	dc, dr     float64 // column and row spacing, OCS, not scaled
	n          vec3    // extrusion
}

// common holds the pairs every entity may have.
type common struct {
	layer string
	paper bool
	n     vec3
}

// readCommon reads layer (8), paper-space flag (67) and extrusion
// (210/220/230) of g.
func (r *reader) readCommon(g *group) (common, error) {
	c := common{layer: "0", n: vec3{0, 0, 1}}
	for _, t := range g.tags {
		var err error
		switch t.code {
		case 8:
			c.layer = r.name(g.raw(t))
		case 67:
			var n int
			n, err = r.gInt(g, t)
			c.paper = n == 1
		case 210:
			c.n.X, err = r.gFloat(g, t)
		case 220:
			c.n.Y, err = r.gFloat(g, t)
		case 230:
			c.n.Z, err = r.gFloat(g, t)
		}
		if err != nil {
			return c, err
		}
	}
	return c, nil
}

// entity reads one entity group and sends it to the current block or to
// model space.
func (r *reader) entity(g *group) error {
	switch g.typ {
	case "VERTEX":
		if r.poly != nil {
			return r.vertex(g)
		}
		if !r.polySkip {
			r.d.Skipped["VERTEX"]++
		}
		return nil
	case "SEQEND":
		if r.poly != nil {
			r.closePoly()
		}
		r.polySkip = false
		return nil
	}
	r.endEntity()
	c, err := r.readCommon(g)
	if err != nil {
		return err
	}
	if c.paper && r.cur == nil {
		r.d.Skipped["paper space"]++
		r.polySkip = g.typ == "POLYLINE"
		return nil
	}
	if tilted(c.n) {
		r.warnOnce("tilted", Pos{File: r.d.File, Line: g.line, Handle: g.handle, Layer: c.layer}, "DXF110", SevWarning,
			"entities whose extrusion is not along Z (first: %s, %.4g,%.4g,%.4g) are projected onto the XY plane", g.typ, c.n.X, c.n.Y, c.n.Z)
	}
	l := local{e: Entity{Pos: Pos{File: r.d.File, Line: g.line, Handle: g.handle, Layer: c.layer}}}
	switch g.typ {
	case "LINE":
		var whole bool
		if whole, err = r.line(g, &l); err == nil && !whole {
			return nil
		}
	case "POINT":
		err = r.point(g, &l)
	case "CIRCLE", "ARC":
		err = r.circle(g, &l, c)
	case "TEXT":
		err = r.text(g, &l, c)
	case "MTEXT":
		err = r.mtext(g, &l, c)
	case "LWPOLYLINE":
		err = r.lwpolyline(g, &l, c)
	case "POLYLINE":
		return r.polyline(g, l, c)
	case "INSERT":
		err = r.insert(g, &l, c)
	default:
		r.d.Skipped[g.typ]++
		return nil
	}
	if err != nil {
		return err
	}
	r.emit(&l)
	return nil
}

// coord reads pair t into p when its code is base (X) or base+10 (Y),
// and into *z when it is base+20 and z != nil; it reports whether t was
// one of those.
func (r *reader) coord(g *group, t rtag, base int, p *Point, z *float64) (bool, error) {
	var err error
	switch t.code {
	case base:
		p.X, err = r.gFloat(g, t)
	case base + 10:
		p.Y, err = r.gFloat(g, t)
	case base + 20:
		if z != nil {
			*z, err = r.gFloat(g, t)
		}
	default:
		return false, nil
	}
	return true, err
}

// line reads a LINE. One without both coordinates of both ends (codes 10,
// 20, 11, 21) is left out with an error finding (DXF113) rather than read
// with the DXF default of 0 for what is missing: a joist drawn to the
// origin by a damaged file would be checked as a member it is not. It
// reports whether the line is whole.
func (r *reader) line(g *group, l *local) (bool, error) {
	l.e.Kind = KindLine
	l.e.Points = r.newPoints(2)
	var seen [4]bool // 10, 20, 11, 21
	for _, t := range g.tags {
		switch t.code {
		case 10, 20, 11, 21:
			seen[(t.code%10)*2+t.code/10-1] = true
		}
		if _, err := r.coord(g, t, 10, &l.e.Points[0], nil); err != nil {
			return false, err
		}
		if _, err := r.coord(g, t, 11, &l.e.Points[1], nil); err != nil {
			return false, err
		}
	}
	var missing []string
	for i, code := range [4]string{"10", "20", "11", "21"} {
		if !seen[i] {
			missing = append(missing, code)
		}
	}
	if len(missing) > 0 {
		what := "start point"
		if seen[0] && seen[1] {
			what = "end point"
		} else if !seen[2] || !seen[3] {
			what = "start and end points"
		}
		r.d.Issues.Add(l.e.Pos, "DXF113", SevError, "LINE without its %s (group code %s missing): left out",
			what, strings.Join(missing, ", "))
		return false, nil
	}
	return true, nil
}

func (r *reader) point(g *group, l *local) error {
	l.e.Kind = KindPoint
	l.e.Points = r.newPoints(1)
	for _, t := range g.tags {
		if _, err := r.coord(g, t, 10, &l.e.Points[0], nil); err != nil {
			return err
		}
	}
	return nil
}

func (r *reader) circle(g *group, l *local, c common) error {
	l.e.Kind = KindCircle
	if g.typ == "ARC" {
		l.e.Kind = KindArc
	}
	l.e.Points = r.newPoints(1)
	var z float64
	for _, t := range g.tags {
		ok, err := r.coord(g, t, 10, &l.e.Points[0], &z)
		if ok || err != nil {
			if err != nil {
				return err
			}
			continue
		}
		switch t.code {
		case 40:
			l.e.RadiusIn, err = r.gFloat(g, t)
		case 50:
			l.e.StartDeg, err = r.gFloat(g, t)
		case 51:
			l.e.EndDeg, err = r.gFloat(g, t)
		}
		if err != nil {
			return err
		}
	}
	r.placeWarn(&l.e, &l.e, ocsMap(c.n, z))
	return nil
}

func (r *reader) text(g *group, l *local, c common) error {
	l.e.Kind = KindText
	l.e.Points = r.newPoints(1)
	var z float64
	for _, t := range g.tags {
		ok, err := r.coord(g, t, 10, &l.e.Points[0], &z)
		if ok || err != nil {
			if err != nil {
				return err
			}
			continue
		}
		switch t.code {
		case 1:
			l.e.Text = plainText(r.str(g.raw(t)))
		case 40:
			l.e.HeightIn, err = r.gFloat(g, t)
		case 50:
			l.e.RotationDeg, err = r.gFloat(g, t)
		}
		if err != nil {
			return err
		}
	}
	r.placeWarn(&l.e, &l.e, ocsMap(c.n, z))
	return nil
}

// mtext reads an MTEXT: insertion point and direction are world
// coordinates (DXF Reference, MTEXT group codes 10 and 11); the text is
// the 3 chunks followed by the 1 pair.
func (r *reader) mtext(g *group, l *local, c common) error {
	l.e.Kind = KindMText
	l.e.Points = r.newPoints(1)
	var dir Point
	hasDir := false
	var text []byte
	var last []byte
	for _, t := range g.tags {
		ok, err := r.coord(g, t, 10, &l.e.Points[0], nil)
		if ok || err != nil {
			if err != nil {
				return err
			}
			continue
		}
		ok, err = r.coord(g, t, 11, &dir, nil)
		if ok || err != nil {
			if err != nil {
				return err
			}
			hasDir = true
			continue
		}
		switch t.code {
		case 1:
			last = g.raw(t)
		case 3:
			text = append(text, g.raw(t)...)
		case 40:
			l.e.HeightIn, err = r.gFloat(g, t)
		case 50:
			l.e.RotationDeg, err = r.gFloat(g, t)
		}
		if err != nil {
			return err
		}
	}
	text = append(text, last...)
	l.e.Text = plainMText(r.str(text))
	if hasDir && (dir.X != 0 || dir.Y != 0) {
		l.e.RotationDeg = identity.angleDeg(atan2Deg(dir.Y, dir.X))
	} else if c.n.Z < 0 || tilted(c.n) {
		l.e.RotationDeg = ocsMap(c.n, 0).angleDeg(l.e.RotationDeg)
	}
	return nil
}

func (r *reader) lwpolyline(g *group, l *local, c common) error {
	l.e.Kind = KindLWPolyline
	var elev float64
	var bulges []float64
	anyBulge := false
	for _, t := range g.tags {
		var err error
		n := len(l.e.Points)
		switch t.code {
		case 10:
			var x float64
			x, err = r.gFloat(g, t)
			l.e.Points = append(l.e.Points, Point{X: x})
			bulges = append(bulges, 0)
		case 20:
			if n == 0 {
				return r.gErr(g, t, ErrStructure, "code 20 before the first vertex (code 10)")
			}
			l.e.Points[n-1].Y, err = r.gFloat(g, t)
		case 42:
			if n == 0 {
				return r.gErr(g, t, ErrStructure, "bulge (code 42) before the first vertex (code 10)")
			}
			var b float64
			b, err = r.gFloat(g, t)
			if b != 0 {
				bulges[n-1], anyBulge = b, true
			}
		case 38:
			elev, err = r.gFloat(g, t)
		case 70:
			var f int
			f, err = r.gInt(g, t)
			l.e.Closed = f&1 != 0
		}
		if err != nil {
			return err
		}
	}
	if anyBulge {
		l.e.Bulges = bulges
	}
	r.placeWarn(&l.e, &l.e, ocsMap(c.n, elev))
	return nil
}

// polyline starts an old-style POLYLINE; its VERTEX entities follow up to
// SEQEND. Polygon meshes and polyface meshes are skipped.
func (r *reader) polyline(g *group, l local, c common) error {
	flags := 0
	var elev float64
	for _, t := range g.tags {
		var err error
		switch t.code {
		case 70:
			flags, err = r.gInt(g, t)
		case 30:
			elev, err = r.gFloat(g, t)
		}
		if err != nil {
			return err
		}
	}
	if flags&(16|64) != 0 {
		r.d.Skipped["POLYLINE mesh"]++
		r.polySkip = true
		return nil
	}
	l.e.Kind = KindPolyline
	l.e.Closed = flags&1 != 0
	r.polyN, r.polyElev = c.n, elev // the OCS, applied at SEQEND
	if flags&8 != 0 {
		r.polyN = vec3{0, 0, 1} // 3D polyline: vertices are world coordinates
	}
	r.poly = &l
	return nil
}

// vertex adds a VERTEX to the open POLYLINE. Spline frame control points
// (flag 16) are not on the curve and are left out.
func (r *reader) vertex(g *group) error {
	var p Point
	var bulge float64
	flags := 0
	for _, t := range g.tags {
		ok, err := r.coord(g, t, 10, &p, nil)
		if ok || err != nil {
			if err != nil {
				return err
			}
			continue
		}
		switch t.code {
		case 42:
			bulge, err = r.gFloat(g, t)
		case 70:
			flags, err = r.gInt(g, t)
		}
		if err != nil {
			return err
		}
	}
	if bulge == 0 {
		bulge = 0 // no negative zero
	}
	if flags&16 != 0 {
		return nil
	}
	e := &r.poly.e
	e.Points = append(e.Points, p)
	if bulge != 0 && e.Bulges == nil {
		e.Bulges = make([]float64, len(e.Points)-1, cap(e.Points))
	}
	if e.Bulges != nil {
		e.Bulges = append(e.Bulges, bulge)
	}
	return nil
}

// closePoly finishes the open POLYLINE.
func (r *reader) closePoly() {
	l := *r.poly
	r.poly = nil
	r.placeWarn(&l.e, &l.e, ocsMap(r.polyN, r.polyElev))
	r.emit(&l)
}

// endEntity closes a POLYLINE left open by a missing SEQEND.
func (r *reader) endEntity() {
	if r.poly != nil {
		p := r.poly.e.Pos
		r.warnOnce("seqend", p, "DXF111", SevWarning, "POLYLINE without SEQEND; ended at the next entity")
		r.closePoly()
	}
	r.polySkip = false
}

func (r *reader) insert(g *group, l *local, c common) error {
	ins := &insertRef{sx: 1, sy: 1, cols: 1, rows: 1, n: c.n}
	for _, t := range g.tags {
		var err error
		switch t.code {
		case 2:
			ins.name = r.name(g.raw(t))
		case 10:
			ins.at.X, err = r.gFloat(g, t)
		case 20:
			ins.at.Y, err = r.gFloat(g, t)
		case 30:
			ins.at.Z, err = r.gFloat(g, t)
		case 41:
			ins.sx, err = r.gFloat(g, t)
		case 42:
			ins.sy, err = r.gFloat(g, t)
		case 50:
			ins.rotDeg, err = r.gFloat(g, t)
		case 70:
			ins.cols, err = r.gInt(g, t)
		case 71:
			ins.rows, err = r.gInt(g, t)
		case 44:
			ins.dc, err = r.gFloat(g, t)
		case 45:
			ins.dr, err = r.gFloat(g, t)
		}
		if err != nil {
			return err
		}
	}
	l.ins = ins
	return nil
}
