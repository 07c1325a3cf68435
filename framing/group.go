package framing

import (
	"fmt"
	"math"
	"slices"
	"strconv"

	"framecheck/dxfimport"
)

// Issue codes framing reports (FRM2xx, geometry). See doc.go.
const (
	CodeBentJoist       = "FRM201" // joist polyline bent or with arcs: skipped
	CodeZeroLength      = "FRM202" // zero-length joist: skipped
	CodeDuplicateJoist  = "FRM203" // joist drawn twice: kept once
	CodeNoSupport       = "FRM204" // an end reaches no support: error member
	CodeNoZone          = "FRM205" // member outside every zone, no default zone
	CodeZonePieces      = "FRM206" // member crosses zone edges: loaded zone by zone
	CodeZoneName        = "FRM207" // zone outline without a name, or with two
	CodeBadCallout      = "FRM208" // label text that is not a size callout
	CodeCalloutConflict = "FRM209" // two callouts disagree on one joist
	CodeCalloutSpacing  = "FRM210" // callout spacing differs from measured by > 1 in
	CodeCalloutUnused   = "FRM211" // callout that reaches no joist
	CodeNoNeighbour     = "FRM212" // joist with no parallel neighbour
	CodeEdgeSupport     = "FRM221" // edge joist beside a parallel support line: half the strip added to its tributary width
	CodeEdgeZone        = "FRM222" // load zone reaching past an edge joist with nothing drawn there: the strip is the joist's
	CodeEdgeBeam        = "FRM223" // a checked beam beside edge joists carries its half of the strip between them
	CodeArcSegment      = "FRM213" // arcs on support layers, arc segments of polylines: skipped, reported once
	CodeBadCoordinate   = "FRM214" // entity with a non-finite or out-of-range coordinate: skipped
	CodeCarriesBeam     = "FRM215" // flush beam ending on a joist between its bearings: error member
	CodeNotRectangle    = "FRM216" // joist outline that is not a rectangle: not checked
	CodeThickness       = "FRM217" // outline's drawn thickness differs from its size's b
	CodeBuiltUp         = "FRM218" // plies drawn side by side: one built-up member
)

// maxCoordIn bounds the coordinates framing accepts: 10^9 in is about
// 16,000 miles, far beyond any building, and keeps the grids finite.
const maxCoordIn = 1e9

type segItem struct {
	a, b Point
	spec int // SupportSpec index, supports only
	pos  dxfimport.Pos
}

type textItem struct {
	p        Point
	text     string
	heightIn float64
	pos      dxfimport.Pos
}

type polyItem struct {
	pts []Point
	pos dxfimport.Pos
}

// grouper holds the working state of one Group call.
type grouper struct {
	opt  Options
	plan *Plan

	workers  int // goroutines for the parallel parts (parallel.go)
	minChunk int // fewest items a goroutine is given

	joists     []segItem
	sups       []segItem
	blocking   []segItem
	labelLines []segItem
	labelTexts []textItem
	zoneTexts  []textItem
	zonePolys  []polyItem

	// bays (bays.go): set only when the plan has some
	bayPolys   []polyItem      // closed outlines on bay layers
	bayLoose   []dxfimport.Pos // other entities on bay layers, left out
	bayText    []bool          // per label text: the callout of a bay
	bayRegions []bayRegion     // the bays read
	genFrom    int             // joist items from here on are generated; -1 when none
	jIdx       *segIndex       // grid over the drawn joist items, built on first use

	// per member, parallel to plan.Members
	grp    []int
	a0, a1 []float64 // extent along the group direction
	bdirs  [][]Point // per bearing: unit direction of its support line (runs compare them)
	lo, hi []int     // neighbour at smaller / larger across offset, -1 when none
	// edgeOpen, per member: bit 0 (side below) and bit 1 (above) set where
	// it has neither a neighbouring joist nor a parallel support line
	// (setTrib), for edgeZoneStrips
	edgeOpen []uint8
	// edgeBeside lists, for each edge joist whose tributary width took
	// half the gap to a parallel support line (FRM221), the line and that
	// half: a beam among them carries the other half (edgeStripBeams)
	edgeBeside []edgeStrip
	byAcross   []int      // members by group, offset across, index (makeMembers)
	ends       [][2]Point // Start and End, packed close for passes over every member
	groups     []dirGroup

	supIdx *segIndex
	memIdx *segIndex
	lblIdx *segIndex

	inGroup []bool // per support line: inside a group of three or more, listed on the group's middle

	units  string  // the drawing's units ("mm"), for points in messages
	toInch float64 // drawing units to inches

	// outlines (outlines.go): set only when the plan has some
	ols       []outline
	jol       []int32   // per joist item: index into ols, -1 for a centre line
	rawJoists []segItem // the joist lines as drawn, before outlines became centre lines
	rawOf     []int32   // per joist item: its raw line, -1 for an outline's centre line
	rawBundle []int32   // per raw line: index into ols, -1 when none
	memOl     []int32   // per member: index into ols, -1
	segMem    []int32   // per joist item: its member, -1 when dropped
	pieces    []drawnPiece
	badPos    map[dxfimport.Pos]string // joist items standing for outlines that are not rectangles: why
	arcs      []dxfimport.Pos          // curved entities skipped on support, blocking and label layers
	bulged    int                      // of which polylines with arc segments

	lp loadPathState // posts, point loads and beams (loadpath.go)
}

type dirGroup struct {
	u, n Point // direction and across-normal (n.X > 0, or n.Y > 0 when n.X == 0)
}

// Group turns an imported drawing into members. It never fails: problems
// are in Plan.Issues and on the members (Error, Messages).
func Group(d *dxfimport.Drawing, opt Options) *Plan {
	return groupWith(d, opt, defaultWorkers(), defaultMinChunk)
}

// groupWith is Group with its parallel parts on at most workers
// goroutines, each given at least minChunk items (parallel.go).
func groupWith(d *dxfimport.Drawing, opt Options, workers, minChunk int) *Plan {
	g := newGrouper(opt, workers, minChunk)
	if d == nil {
		return g.plan
	}
	g.units, g.toInch = d.Units, d.ToInch
	g.classify(d)
	for _, s := range groupSteps {
		s.run(g)
	}
	return g.plan
}

// groupSteps are the steps of Group after classify, in order; each reads
// what the ones before it left in the grouper. They are named so that
// the benchmarks can time them one by one.
var groupSteps = []struct {
	name string
	run  func(*grouper)
}{
	{"outlines", (*grouper).outlines},
	{"brokenOutlines", (*grouper).brokenOutlines},
	{"joistBlocking", (*grouper).joistBlocking},
	{"bays", (*grouper).bays},
	{"makeMembers", (*grouper).makeMembers},
	{"findBearings", (*grouper).findBearings},
	{"neighbours", (*grouper).neighbours},
	{"makeRuns", (*grouper).makeRuns},
	{"assignZones", (*grouper).assignZones},
	{"claimBeamCallouts", (*grouper).claimBeamCallouts},
	{"assignLumber", (*grouper).assignLumber},
	{"finishOutlines", (*grouper).finishOutlines},
	{"drawnBlocking", (*grouper).drawnBlocking},
	{"existingBlocking", (*grouper).existingBlocking},
	{"loadPath", (*grouper).loadPath},
}

func newGrouper(opt Options, workers, minChunk int) *grouper {
	return &grouper{opt: opt, plan: &Plan{Ignored: map[string]int{}}, genFrom: -1, workers: workers, minChunk: minChunk}
}

// drawingPoint formats a point (inches inside framing) in the drawing's
// own units, so it can be found in CAD: "(16.00, 138.00)" in an inch
// drawing, "(4489.45, 0.00 mm)" in any other.
func (g *grouper) drawingPoint(p Point) string {
	if g.units == "" || g.units == "in" || g.toInch <= 0 {
		return fmt.Sprintf("(%.2f, %.2f)", p.X, p.Y)
	}
	return fmt.Sprintf("(%.2f, %.2f %s)", p.X/g.toInch, p.Y/g.toInch, g.units)
}

func (g *grouper) warn(pos dxfimport.Pos, code string, format string, args ...any) {
	g.plan.Issues.Add(pos, code, dxfimport.SevWarning, format, args...)
}

// classify sorts the entities by the role of their layer.
func (g *grouper) classify(d *dxfimport.Drawing) {
	roles := map[string][2]int{}
	var lastLayer string
	var last [2]int
	have := false
	roleOf := func(layer string) (role, int) {
		if !have || layer != lastLayer {
			rs, ok := roles[layer]
			if !ok {
				r, spec := g.opt.layerRole(layer)
				rs = [2]int{int(r), spec}
				roles[layer] = rs
			}
			lastLayer, last, have = layer, rs, true
		}
		return role(last[0]), last[1]
	}
	// room for the joists and support lines, counted first: growing
	// lists of a hundred thousand would copy them over and over
	nj, ns, np, nl := 0, 0, 0, 0
	for i := range d.Entities {
		switch r, _ := roleOf(d.Entities[i].Pos.Layer); r {
		case roleJoist:
			nj++
		case roleSupport:
			ns += max(1, len(d.Entities[i].Points))
		case rolePost:
			np++
		case rolePointLoad:
			nl++
		}
	}
	g.joists = make([]segItem, 0, nj)
	g.sups = make([]segItem, 0, ns)
	// the posts' and point loads' entities (at most: texts outside a
	// block are kept apart)
	g.lp.postEnts = make([]dxfimport.Entity, 0, np)
	g.lp.loadEnts = make([]dxfimport.Entity, 0, nl)
	for _, e := range d.Entities {
		layer := e.Pos.Layer
		r, spec := roleOf(layer)
		if r != roleNone && !finitePoints(e.Points) {
			// A joist left out is a joist not checked: an error, so that
			// the run does not report a clean plan.
			sev := dxfimport.SevWarning
			if r == roleJoist {
				sev = dxfimport.SevError
			}
			g.plan.Issues.Add(e.Pos, CodeBadCoordinate, sev,
				"%s has a coordinate that is not a finite number within %g in; skipped", e.Kind, maxCoordIn)
			continue
		}
		used := true
		switch r {
		case roleNone:
			g.plan.Ignored[layer]++
			continue
		case roleJoist:
			used = g.addJoist(e)
		case roleSupport:
			used = g.addSegments(e, spec, &g.sups)
			if e.Kind == dxfimport.KindArc || e.Kind == dxfimport.KindCircle {
				g.arcs = append(g.arcs, e.Pos)
			}
		case roleBlocking:
			used = g.addSegments(e, -1, &g.blocking)
		case roleLabel:
			if isText(e) {
				g.labelTexts = append(g.labelTexts, textItem{e.Points[0], e.Text, e.HeightIn, e.Pos})
			} else {
				used = g.addSegments(e, -1, &g.labelLines)
			}
		case roleZone:
			used = g.addZone(e)
		case rolePost, rolePointLoad:
			used = g.lp.add(e, r)
		case roleBay:
			used = g.addBay(e)
		}
		if !used {
			g.plan.Ignored[fmt.Sprintf("%s (%s)", layer, e.Kind)]++
		}
	}
	g.reportArcs()
}

// reportArcs reports the curved entities left out of supports (arcs and
// circles on support layers: door swings, or a curved wall) and the arc
// segments of support, blocking and label polylines, once for all of
// them, with a count and the first three. A member that bears on one is
// an error member of its own (an end reaching no support). Arc segments
// of polylines make it a warning; arcs and circles alone, an info.
func (g *grouper) reportArcs() {
	if len(g.arcs) == 0 {
		return
	}
	sev := dxfimport.SevInfo
	if g.bulged > 0 {
		sev = dxfimport.SevWarning
	}
	g.plan.Issues.Add(g.arcs[0], CodeArcSegment, sev,
		"%d curved entities on support, blocking or label layers left out (%d arcs or circles, %d polylines with arc segments; %s): "+
			"only straight lines are supports; a member bearing on a curve is reported as reaching no support",
		len(g.arcs), len(g.arcs)-g.bulged, g.bulged, handles(g.arcs, 3))
}

func finitePoints(pts []Point) bool {
	for _, q := range pts {
		if !(math.Abs(q.X) <= maxCoordIn && math.Abs(q.Y) <= maxCoordIn) { // false for NaN too
			return false
		}
	}
	return true
}

func isText(e dxfimport.Entity) bool {
	return (e.Kind == dxfimport.KindText || e.Kind == dxfimport.KindMText) && len(e.Points) > 0
}

func isPoly(e dxfimport.Entity) bool {
	return e.Kind == dxfimport.KindLWPolyline || e.Kind == dxfimport.KindPolyline
}

// collinearTolIn is how far a polyline vertex may sit off the line through
// its extreme vertices and still count as straight (drafting noise).
const collinearTolIn = 0.1

func (g *grouper) addJoist(e dxfimport.Entity) bool {
	var a, b Point
	switch {
	case e.Kind == dxfimport.KindLine && len(e.Points) == 2:
		a, b = e.Points[0], e.Points[1]
	case isPoly(e) && len(e.Points) >= 2:
		for _, bu := range e.Bulges {
			if bu != 0 {
				g.warn(e.Pos, CodeBentJoist, "joist polyline has an arc segment; skipped")
				return true
			}
		}
		if c, closed := closedCorners(e.Points, e.Closed, g.opt.SnapToleranceIn); closed {
			g.addOutlinePolyline(e, c)
			return true
		}
		var ok bool
		a, b, ok = straightPolyline(e.Points, e.Closed)
		if !ok {
			g.warn(e.Pos, CodeBentJoist, "joist polyline with %d vertices is not straight; skipped", len(e.Points))
			return true
		}
	default:
		return false
	}
	if dist(a, b) < 1e-6 {
		g.warn(e.Pos, CodeZeroLength, "zero-length joist at %s; skipped", g.drawingPoint(a))
		return true
	}
	g.joists = append(g.joists, segItem{a: a, b: b, pos: e.Pos})
	return true
}

// straightPolyline returns the extreme vertices of a polyline whose
// vertices all lie on one line, going one way; ok is false otherwise.
func straightPolyline(pts []Point, closed bool) (a, b Point, ok bool) {
	a = pts[0]
	far := 0.0
	for _, p := range pts {
		if d := dist(a, p); d > far {
			far, b = d, p
		}
	}
	if far == 0 {
		return a, a, true
	}
	u := unit(sub(b, a))
	last := -1.0
	for _, p := range pts {
		w := sub(p, a)
		if math.Abs(cross(u, w)) > collinearTolIn {
			return a, b, false
		}
		t := dot(u, w)
		if t < last-collinearTolIn { // doubles back
			return a, b, false
		}
		last = t
	}
	if closed && len(pts) > 2 {
		return a, b, false
	}
	return a, b, true
}

// addSegments appends the straight segments of a LINE or polyline.
func (g *grouper) addSegments(e dxfimport.Entity, spec int, dst *[]segItem) bool {
	switch {
	case e.Kind == dxfimport.KindLine && len(e.Points) == 2:
		*dst = append(*dst, segItem{e.Points[0], e.Points[1], spec, e.Pos})
	case isPoly(e) && len(e.Points) >= 2:
		n := len(e.Points)
		segs := n - 1
		if e.Closed {
			segs = n
		}
		for i := 0; i < segs; i++ {
			a, b := e.Points[i], e.Points[(i+1)%n]
			if i < len(e.Bulges) && e.Bulges[i] != 0 {
				if n := len(g.arcs); n == 0 || g.arcs[n-1] != e.Pos {
					g.arcs = append(g.arcs, e.Pos)
					g.bulged++
				}
				continue
			}
			if dist(a, b) > 1e-6 {
				*dst = append(*dst, segItem{a, b, spec, e.Pos})
			}
		}
	default:
		return false
	}
	return true
}

func (g *grouper) addZone(e dxfimport.Entity) bool {
	switch {
	case isText(e):
		g.zoneTexts = append(g.zoneTexts, textItem{e.Points[0], e.Text, e.HeightIn, e.Pos})
	case isPoly(e) && len(e.Points) >= 3:
		pts := append([]Point(nil), e.Points...)
		if !e.Closed {
			if dist(pts[0], pts[len(pts)-1]) > g.opt.SnapToleranceIn {
				g.warn(e.Pos, CodeZoneName, "zone polyline is not closed; skipped")
				return true
			}
		}
		if dist(pts[0], pts[len(pts)-1]) < 1e-6 {
			pts = pts[:len(pts)-1]
		}
		g.zonePolys = append(g.zonePolys, polyItem{pts, e.Pos})
	default:
		return false
	}
	return true
}

// makeMembers clusters joists by direction, orients them, drops
// duplicates and numbers the rest by midpoint (y, then x).
func (g *grouper) makeMembers() {
	js := g.joists
	grpOf, groups := directionGroups(js, g.opt.AngleTolDeg, g.split(len(js)))
	g.groups = groups
	for i := range js {
		if dot(sub(js[i].b, js[i].a), groups[grpOf[i]].u) < 0 {
			js[i].a, js[i].b = js[i].b, js[i].a
		}
	}
	keep, byAcross := g.dropDuplicates(js, grpOf)

	// by midpoint rounded to 0.001 in, y then x, then drawing order;
	// rounded values order as the whole thousandths they are rounded to
	// (coordinates are within maxCoordIn: at most 10^12 thousandths,
	// exact in a float64, and a thousandth apart is far more than one
	// rounding step), which are sorted as integers
	kept := make([]int, 0, len(js))
	yk, xk := make([]uint64, 0, len(js)), make([]uint64, 0, len(js))
	milli := func(v float64) uint64 { return intKey(int64(math.Round(v * 1000))) }
	for i := range js {
		if keep[i] {
			m := mid(js[i].a, js[i].b)
			kept = append(kept, i)
			yk, xk = append(yk, milli(m.Y)), append(xk, milli(m.X))
		}
	}
	order := orderByKeys(len(kept), yk, xk)
	memberOf := make([]int32, len(js))
	for k, x := range order {
		order[k] = kept[x]
		memberOf[kept[x]] = int32(k)
	}
	n := len(order)
	p := g.plan
	p.Members = make([]Member, n)
	p.across = make([]float64, n)
	p.dirs = make([]Point, n)
	g.grp = make([]int, n)
	g.a0 = make([]float64, n)
	g.a1 = make([]float64, n)
	g.bdirs = make([][]Point, n)
	g.ends = make([][2]Point, n)
	if g.jol != nil {
		g.memOl = make([]int32, n)
	}
	if len(g.pieces) > 0 {
		g.segMem = make([]int32, len(js))
		for i := range g.segMem {
			g.segMem[i] = -1
		}
	}
	// Each goroutine reads the joists and their groups and writes the
	// members of its range of k (and segMem of their joists: order is a
	// permutation, so no two members write one joist's).
	parallel(g.split(n), func(_ int, sp span) {
		ids, at := memberIDs(sp)
		for k := sp.lo; k < sp.hi; k++ {
			i := order[k]
			j := &js[i]
			gr := groups[grpOf[i]]
			if g.memOl != nil {
				g.memOl[k] = g.jol[i]
			}
			if g.segMem != nil {
				g.segMem[i] = int32(k)
			}
			m := &p.Members[k] // zero: set field by field rather than copy a whole Member in
			m.ID, m.Pos, m.Layer = ids[at[k-sp.lo]:at[k-sp.lo+1]], j.pos, j.pos.Layer
			m.Start, m.End, m.LengthIn = j.a, j.b, dist(j.a, j.b)
			m.Generated = g.genFrom >= 0 && i >= g.genFrom
			g.ends[k] = [2]Point{j.a, j.b}
			p.dirs[k] = unit(sub(j.b, j.a))
			p.across[k] = dot(mid(j.a, j.b), gr.n)
			g.grp[k] = grpOf[i]
			g.a0[k], g.a1[k] = dot(j.a, gr.u), dot(j.b, gr.u)
		}
	})
	g.byAcross = g.membersAcross(byAcross, keep, memberOf)
}

// memberIDs returns the IDs of members sp.lo..sp.hi-1 ("M1", "M2", ...)
// written one after another in one string, and where each starts (the
// last entry is the end): one allocation for the range, not one an ID.
func memberIDs(sp span) (string, []int) {
	buf := make([]byte, 0, 8*(sp.hi-sp.lo))
	at := make([]int, 0, sp.hi-sp.lo+1)
	for k := sp.lo; k < sp.hi; k++ {
		at = append(at, len(buf))
		buf = append(buf, 'M')
		buf = strconv.AppendInt(buf, int64(k+1), 10)
	}
	return string(buf), append(at, len(buf))
}

// membersAcross returns the members in the order neighbours wants them:
// by direction group, offset across, then index. byAcross is the joists
// in that order by their own index (dropDuplicates): a member's offset
// is its joist's, computed alike, so only members at one offset need
// sorting again, by member index.
func (g *grouper) membersAcross(byAcross []int, keep []bool, memberOf []int32) []int {
	p := g.plan
	out := make([]int, 0, len(p.Members))
	for _, i := range byAcross {
		if keep[i] {
			out = append(out, int(memberOf[i]))
		}
	}
	for x := 0; x < len(out); {
		y := x + 1
		for y < len(out) && g.grp[out[y]] == g.grp[out[x]] && p.across[out[y]] == p.across[out[x]] {
			y++
		}
		if y-x > 1 {
			slices.Sort(out[x:y])
		}
		x = y
	}
	return out
}

// directionGroups clusters joists whose directions (mod 180 degrees) chain
// within tolDeg, and returns each joist's group and the groups.
//
// The angles and their cosines and sines are worked out on the spans
// (nil: one) in parallel, each goroutine writing its own joists' entries;
// the sums that give each group's direction are added up in joist order
// after, so that they come out the same to the last bit.
func directionGroups(js []segItem, tolDeg float64, spans []span) ([]int, []dirGroup) {
	n := len(js)
	if spans == nil {
		spans = []span{{0, n}}
	}
	type angle struct {
		deg float64
		i   int
	}
	ang := make([]angle, n)
	cs := make([][2]float64, n) // cosine and sine of the doubled angle
	parallel(spans, func(_ int, sp span) {
		for i := sp.lo; i < sp.hi; i++ {
			j := &js[i]
			d := sub(j.b, j.a)
			a := math.Atan2(d.Y, d.X) * 180 / math.Pi
			a = math.Mod(a+360, 180)
			if a >= 180-1e-9 {
				a = 0
			}
			r := 2 * a * math.Pi / 180
			ang[i] = angle{a, i}
			cs[i] = [2]float64{math.Cos(r), math.Sin(r)}
		}
	})
	// by angle (equal angles fall in one group whatever their order: the
	// index only makes the order definite)
	keys := make([]uint64, n)
	for i := range ang {
		keys[i] = floatKey(ang[i].deg)
	}
	byAng := make([]angle, n)
	for x, i := range orderByKeys(n, keys) {
		byAng[x] = ang[i]
	}
	grp := make([]int, n)
	ng := 0
	for k, x := range byAng {
		if k > 0 && x.deg-byAng[k-1].deg > tolDeg {
			ng++
		}
		grp[x.i] = ng
	}
	if n > 0 {
		ng++
		// wrap: directions near 180 join those near 0
		if ng > 1 && byAng[0].deg+180-byAng[n-1].deg <= tolDeg {
			last := grp[byAng[n-1].i]
			for i := range grp {
				if grp[i] == last {
					grp[i] = 0
				}
			}
			ng--
		}
	}
	// mean direction per group on doubled angles (mod-180 safe)
	sc := make([][2]float64, ng)
	for i := range js {
		sc[grp[i]][0] += cs[i][0]
		sc[grp[i]][1] += cs[i][1]
	}
	groups := make([]dirGroup, ng)
	for k := range groups {
		th := math.Atan2(sc[k][1], sc[k][0]) / 2 * 180 / math.Pi // (-90, 90]
		if th <= -90+1e-9 {
			th += 180
		}
		r := th * math.Pi / 180
		u := Point{X: math.Cos(r), Y: math.Sin(r)}
		switch { // exact axes keep across offsets free of rounding
		case math.Abs(th) < 1e-9:
			u = Point{X: 1}
		case math.Abs(th-90) < 1e-9:
			u = Point{Y: 1}
		}
		nn := rot90(u)
		if nn.X < -1e-12 || (math.Abs(nn.X) <= 1e-12 && nn.Y < 0) {
			nn = scale(nn, -1)
		}
		groups[k] = dirGroup{u: u, n: nn}
	}
	return grp, groups
}

// dropDuplicates keeps one of each set of joists drawn over each other
// (midpoints less than minNeighbourGapIn apart across, both ends within
// the snap tolerance) and warns naming both handles. A doubled joist, its
// plies drawn 1.5 in apart, is two members, not a duplicate.
//
// Joists are taken in order of group, offset across and index; each one
// kept drops the later ones that duplicate it, among the joists of its
// window (the next ones less than minNeighbourGapIn across). A long window
// (joists lined up bay after bay) is searched through a band index, bands
// minNeighbourGapIn across, sorted along (a duplicate's start is within
// the tolerance along), not joist by joist.
//
// It returns which joists to keep, and all the joists by group, offset
// across and index (membersAcross).
func (g *grouper) dropDuplicates(js []segItem, grpOf []int) ([]bool, []int) {
	tol := g.opt.SnapToleranceIn
	keep := make([]bool, len(js))
	type key struct {
		grp, i int
		c, a   float64
	}
	unsorted := make([]key, len(js))
	gk, ck := make([]uint64, len(js)), make([]uint64, len(js))
	for i, j := range js {
		gr := g.groups[grpOf[i]]
		unsorted[i] = key{grpOf[i], i, dot(mid(j.a, j.b), gr.n), dot(j.a, gr.u)}
		gk[i], ck[i] = uint64(grpOf[i]), floatKey(unsorted[i].c)
		keep[i] = true
	}
	// by group, offset across, index
	ks := make([]key, len(js))
	for x, i := range orderByKeys(len(js), gk, ck) {
		ks[x] = unsorted[i]
	}
	// Long windows are searched through a bandIndex over the positions
	// (built on first need): across bands of minNeighbourGapIn, so that
	// a window lies in a position's band and the next; along, a
	// duplicate's start lies within the snap tolerance (searched with a
	// margin for rounding: a candidate more is only compared).
	reach := 2 * math.Max(tol, 1)
	var bx *bandIndex
	var keyAt []int32 // per position: its key in bx
	buildIndex := func() {
		bk := make([]bandKey, 0, len(ks))
		for x, k := range ks {
			if finiteKey(k.c, k.a) {
				bk = append(bk, bandKey{grp: int32(k.grp), a: k.a, c: k.c, id: int32(x)})
			}
		}
		bx = newBandIndex(minNeighbourGapIn, bk)
		keyAt = make([]int32, len(ks))
		for z := range bx.keys {
			keyAt[bx.keys[z].id] = int32(z)
		}
	}
	// end is the first position past x's window (same group, less than
	// minNeighbourGapIn across); windows of up to shortWindow joists are
	// scanned as they are, longer ones (joists lined up bay after bay)
	// through the index.
	const shortWindow = 32
	end := 0
	var cand []int
	for x, kx := range ks {
		i := kx.i
		end = max(end, x+1)
		for end < len(ks) && ks[end].grp == kx.grp && ks[end].c-kx.c < minNeighbourGapIn {
			end++
		}
		if !keep[i] {
			continue
		}
		cand = cand[:0]
		switch {
		case end-x-1 <= shortWindow:
			for y := x + 1; y < end; y++ {
				cand = append(cand, y)
			}
		case finiteKey(kx.c, kx.a):
			if bx == nil {
				buildIndex()
			}
			for _, r := range bx.nearRuns(int(keyAt[x])) {
				if r < 0 {
					continue
				}
				for z, e := bx.from(r, kx.a-reach), int(bx.runs[r+1]); z < e && bx.keys[z].a <= kx.a+reach; z++ {
					if y := int(bx.keys[z].id); y > x && y < end {
						cand = append(cand, y)
					}
				}
			}
			slices.Sort(cand)
		}
		for _, y := range cand {
			j := ks[y].i
			if math.Abs(ks[y].a-kx.a) > reach {
				continue // starts too far apart along (a cheap look before the distances)
			}
			if keep[j] && dist(js[i].a, js[j].a) <= tol && dist(js[i].b, js[j].b) <= tol {
				keep[j] = false
				g.warn(js[j].pos, CodeDuplicateJoist, "joist drawn twice: %s duplicates %s; kept once",
					entityRef(js[j].pos), entityRef(js[i].pos))
			}
		}
	}
	byAcross := make([]int, len(ks))
	for x := range ks {
		byAcross[x] = ks[x].i
	}
	return keep, byAcross
}

// finiteKey reports whether both numbers are finite, so that they have a
// grid cell (joists with other coordinates are left out before this).
func finiteKey(c, a float64) bool {
	return !math.IsNaN(c) && !math.IsInf(c, 0) && !math.IsNaN(a) && !math.IsInf(a, 0)
}

// entityRef names a drawn entity in a message: "handle 2F", or "line 120"
// in a file without handles.
func entityRef(p dxfimport.Pos) string {
	if p.Handle != "" {
		return "handle " + p.Handle
	}
	return fmt.Sprintf("line %d", p.Line)
}
