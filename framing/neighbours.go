package framing

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"

	"framecheck/dxfimport"
)

// maxNeighbourGapIn: a parallel joist farther away than this is not a
// neighbour; the joist is an edge joist on that side (common practice, no
// source: no floor joists sit 10 ft apart).
const maxNeighbourGapIn = 120

// minNeighbourGapIn: parallel joists closer than this (pieces drawn on one
// line) are not each other's neighbours.
const minNeighbourGapIn = 0.5

// minOverlapFrac: a parallel joist is a neighbour only when the extents
// overlap by more than the snap tolerance and by at least this fraction of
// the shorter of the two, so joists lapped over a bearing (drawn 1.5 in
// apart, overlapping by the lap only) do not take each other as the
// neighbour (common practice, no source).
const minOverlapFrac = 0.5

// neighbours finds, per member, the nearest parallel joist on each side
// whose extent overlaps its own by more than the snap tolerance, and sets
// the tributary widths and spacing.
//
// Members are sorted by direction group, offset across and index, and cut
// into lines: runs of one group at the same offset (joists drawn end to
// end, or aligned bay after bay). A member's neighbour below is, in the
// nearest line at least minNeighbourGapIn and at most maxNeighbourGapIn
// below it that holds a member overlapping it, the overlapping member of
// highest index (above: of lowest index): the member a scan down (up) the
// sorted order meets first. Each line keeps its members sorted along the
// group direction, so the overlapping ones are found by a binary search
// rather than by looking at every joist of the line: a plan of 1,000 bays
// whose joists line up would otherwise cost a million comparisons a joist.
func (g *grouper) neighbours() {
	p := g.plan
	n := len(p.Members)
	order := g.byAcross // by group, offset across and index
	g.lo, g.hi = make([]int, n), make([]int, n)
	lines, lineOf := g.lines(order)
	// Each goroutine takes a range of the sorted order, reads the lines
	// and the members' offsets and extents, and writes lo and hi of its
	// own members only (order is a permutation).
	parallel(g.split(n), func(_ int, sp span) {
		for x := sp.lo; x < sp.hi; x++ {
			g.nearestBoth(order[x], lines, lineOf[x])
		}
	})
	// Each goroutine writes the tributary widths of its own range of
	// members (reading lo, hi and offsets, all set above) and keeps its
	// warnings apart, appended after in member order.
	spans := g.split(n)
	issues := make(issueLists, len(spans))
	strips := make([][]edgeStrip, len(spans))
	sups := g.supportLineIndex()
	g.edgeOpen = make([]uint8, n)
	parallel(spans, func(w int, sp span) {
		var cur *segCursor
		if sups != nil {
			cur = sups.newCursor()
		}
		for k := sp.lo; k < sp.hi; k++ {
			g.setTrib(&issues[w], &strips[w], k, sups, cur)
		}
	})
	issues.appendTo(&p.Issues)
	for _, l := range strips {
		g.edgeBeside = append(g.edgeBeside, l...)
	}
}

// edgeStrip is an edge joist beside a parallel support line: the joist,
// the line (index in Plan.Supports) and the width of the strip between
// them the support carries (halfIn: half the gap, or less where the edge
// distance gives the joist more), in.
type edgeStrip struct {
	member, support int
	halfIn          float64
	below           bool    // the strip's side of the member (toward smaller offsets across)
	nearIn          float64 // the offset of the support's nearest line
}

// edgeStripBeams gives each beam checked as a member (not rigid) that runs
// beside edge joists the half of the strip between them that is its own
// (Beam.Strips), zone by zone along the joist, and says so (FRM223, info);
// an edge joist with no zone (an error member) leaves its strip off the
// beam with a warning.
func (g *grouper) edgeStripBeams() {
	if len(g.edgeBeside) == 0 || len(g.plan.Beams) == 0 {
		return
	}
	p := g.plan
	beamOf := map[int]int{} // support line -> beam
	for i := range p.Beams {
		if b := &p.Beams[i]; !b.Rigid {
			for _, s := range b.Supports {
				beamOf[s] = i
			}
		}
	}
	type beside struct {
		ids, lost []string
		width     float64
	}
	by := map[int]*beside{}
	var order []int
	sups := g.supportLineIndex()
	if sups == nil {
		return
	}
	var past []string // edge joists whose strip runs on past the supports beside them
	var pastPos dxfimport.Pos
	for _, es := range g.edgeBeside {
		m := &p.Members[es.member]
		// every line of the support beside the joist (pieces drawn end to
		// end, two beams in a line), and the stretches of the joist they
		// cover: each beam among them carries the strip over its own
		spans := map[int][][2]float64{} // beam -> stretches of the joist
		var cover [][2]float64
		g.besideLines(es.member, es.below, es.nearIn, sups, func(s int, from, to float64) {
			cover = append(cover, [2]float64{from, to})
			if i, ok := beamOf[s]; ok {
				spans[i] = append(spans[i], [2]float64{from, to})
			}
		})
		// between its outermost bearings: its ends run into the walls
		// across it, past where a support beside it stops
		if lo, hi := bearingRange(m); hi > lo && uncovered(clipSpans(cover, lo, hi), hi-lo) > g.opt.SnapToleranceIn {
			if len(past) == 0 {
				pastPos = m.Pos
			}
			past = append(past, m.ID)
		}
		beams := make([]int, 0, len(spans))
		for i := range spans {
			beams = append(beams, i)
		}
		slices.Sort(beams)
		for _, i := range beams {
			bs := by[i]
			if bs == nil {
				bs = &beside{}
				by[i] = bs
				order = append(order, i)
			}
			b := &p.Beams[i]
			if len(m.Zones) == 0 {
				bs.lost = append(bs.lost, m.ID)
				continue
			}
			bs.ids = append(bs.ids, m.ID)
			bs.width = math.Max(bs.width, es.halfIn)
			u := unit(sub(b.End, b.Start))
			t0, dir := dot(sub(m.Start, b.Start), u), dot(unit(sub(m.End, m.Start)), u)
			pieces := m.ZonePieces
			if len(pieces) == 0 {
				pieces = []ZonePiece{{FromIn: 0, ToIn: m.LengthIn, Zone: m.Zones[0]}}
			}
			for _, sp := range mergeSpans(spans[i]) {
				for _, zp := range pieces {
					f, t := math.Max(zp.FromIn, sp[0]), math.Min(zp.ToIn, sp[1])
					if t-f <= g.opt.SnapToleranceIn {
						continue
					}
					a, c := t0+dir*f, t0+dir*t
					a, c = math.Max(math.Min(a, c), 0), math.Min(math.Max(a, c), b.LengthIn)
					if c-a > g.opt.SnapToleranceIn {
						b.Strips = append(b.Strips, BeamStrip{FromIn: a, ToIn: c, WidthIn: es.halfIn, Zone: zp.Zone, Member: es.member})
					}
				}
			}
		}
	}
	if len(past) > 0 {
		if len(past) > 5 {
			past = append(past[:5:5], fmt.Sprintf("and %d more", len(past)-5))
		}
		g.warn(pastPos, CodeEdgeBeam, "edge joists %s run on past the ends of the wall or beam "+
			"beside them: there they carry half the strip between (FRM221) and the rest reaches no member drawn; draw the "+
			"support the rest bears on, or check that strip by hand", strings.Join(past, ", "))
	}
	slices.Sort(order)
	list := func(ids []string) string {
		if len(ids) > 5 {
			ids = append(ids[:5:5], fmt.Sprintf("and %d more", len(ids)-5))
		}
		return strings.Join(ids, ", ")
	}
	for _, i := range order {
		bs, b := by[i], &p.Beams[i]
		slices.SortFunc(b.Strips, func(x, y BeamStrip) int { return cmpFloat(x.FromIn, y.FromIn) })
		pos := dxfimport.Pos{}
		if len(b.Lines) > 0 {
			pos = b.Lines[0]
		}
		if len(bs.ids) > 0 {
			p.Issues.Add(pos, CodeEdgeBeam, dxfimport.SevInfo, "%s runs beside edge joists (%s): of the strip between "+
				"them the joists carry their part (FRM221) and the beam the rest, up to %.1f in wide, with the joists' zone loads", b.ID, list(bs.ids), bs.width)
		}
		if len(bs.lost) > 0 {
			g.warn(pos, CodeEdgeBeam, "%s runs beside edge joists with no load zone (%s): its half of the strip between "+
				"them is not put on it; add that strip's load to the beam by hand", b.ID, list(bs.lost))
		}
	}
}

// mergeSpans returns the union of stretches, sorted.
func mergeSpans(sp [][2]float64) [][2]float64 {
	slices.SortFunc(sp, func(a, b [2]float64) int { return cmpFloat(a[0], b[0]) })
	var out [][2]float64
	for _, x := range sp {
		if n := len(out); n > 0 && x[0] <= out[n-1][1] {
			out[n-1][1] = math.Max(out[n-1][1], x[1])
			continue
		}
		out = append(out, x)
	}
	return out
}

// bearingRange returns the stretch of m between its outermost bearings'
// centre-lines, within the member.
func bearingRange(m *Member) (lo, hi float64) {
	if len(m.Bearings) < 2 {
		return 0, m.LengthIn
	}
	lo, hi = m.Bearings[0].AtIn, m.Bearings[len(m.Bearings)-1].AtIn
	return math.Max(lo, 0), math.Min(hi, m.LengthIn)
}

// clipSpans returns the stretches within lo..hi, measured from lo.
func clipSpans(sp [][2]float64, lo, hi float64) [][2]float64 {
	var out [][2]float64
	for _, x := range sp {
		if a, b := math.Max(x[0], lo), math.Min(x[1], hi); b > a {
			out = append(out, [2]float64{a - lo, b - lo})
		}
	}
	return out
}

// uncovered is how much of 0..length the stretches leave out.
func uncovered(sp [][2]float64, length float64) float64 {
	covered := 0.0
	for _, x := range mergeSpans(sp) {
		covered += math.Min(x[1], length) - math.Max(x[0], 0)
	}
	return math.Max(length-covered, 0)
}

func cmpFloat(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

// edgeSupportReachIn: a support line parallel to an edge joist, on its side
// with no neighbouring joist, at most this far away shares the strip
// between them with the joist (the sheathing spans from one to the
// other); farther, the strip is not one span of sheathing (wood structural
// panels span at most 48 in between supports: common practice, no source).
const edgeSupportReachIn = 48

// maxParallelSin: a support line is parallel to a joist when the sine of
// the angle between them is at most this (about 2 degrees; common
// practice, no source).
const maxParallelSin = 0.035

// supportLineIndex returns a grid over the plan's support lines (walls as
// their mid-lines), or nil when there are none.
func (g *grouper) supportLineIndex() *segIndex {
	sups := g.plan.Supports
	if len(sups) == 0 {
		return nil
	}
	return indexEnds(len(sups), func(i int) (Point, Point) { return sups[i].A, sups[i].B }, nil)
}

// edgeSupport returns the distance from member k to the nearest support
// line parallel to it on one side (below: toward smaller offsets across
// its direction group) that overlaps at least minOverlapFrac of its length,
// at least minNeighbourGapIn and at most edgeSupportReachIn away, and that
// line's index in Plan.Supports; 0 and -1 when there is none. A second
// such line less than MaxWallThicknessIn beyond it is the other face of a
// wall (or beam) drawn with two lines that no joist crosses, so not merged
// into one: the distance is then to their mid-line.
func (g *grouper) edgeSupport(k int, below bool, sups *segIndex, cur *segCursor) (gap float64, sup int, near float64) {
	if sups == nil {
		return 0, -1, 0
	}
	p := g.plan
	gr := &g.groups[g.grp[k]]
	m := &p.Members[k]
	sup = -1
	var gaps [8]float64 // the lines found: a few beside one joist
	found := gaps[:0]
	sups.queryWith(cur, m.Start, m.End, edgeSupportReachIn, func(s int) {
		sl := &p.Supports[s]
		d := sub(sl.B, sl.A)
		l := math.Hypot(d.X, d.Y)
		if l == 0 || math.Abs(cross(d, gr.u))/l > maxParallelSin {
			return
		}
		tA, tB := dot(sl.A, gr.u), dot(sl.B, gr.u)
		lo, hi := math.Max(g.a0[k], math.Min(tA, tB)), math.Min(g.a1[k], math.Max(tA, tB))
		if ov := hi - lo; ov <= g.opt.SnapToleranceIn || ov < minOverlapFrac*(g.a1[k]-g.a0[k]) {
			return
		}
		// the line's offset across at the middle of the overlap
		at := add(sl.A, scale(d, ((lo+hi)/2-tA)/(tB-tA)))
		off := dot(at, gr.n) - p.across[k]
		if below {
			off = -off
		}
		if off < minNeighbourGapIn || off > edgeSupportReachIn {
			return
		}
		found = append(found, off)
		if sup < 0 || off < gap {
			gap, sup = off, s
		}
	})
	if sup < 0 {
		return 0, -1, 0
	}
	far := gap // the other face, when the nearest line has one
	for _, off := range found {
		if off > far && off-gap >= minNeighbourGapIn && off-gap <= g.opt.MaxWallThicknessIn {
			far = off
		}
	}
	return (gap + far) / 2, sup, gap
}

// besideLines calls fn with each support line parallel to member k on one
// side (below: toward smaller offsets across) at offset near (the nearest
// line's, edgeSupport) up to MaxWallThicknessIn beyond it, and the stretch
// of the member, from its Start, that the line runs beside: the lines of
// the support the member's edge strip lies against, pieces drawn end to
// end included.
func (g *grouper) besideLines(k int, below bool, near float64, sups *segIndex, fn func(s int, from, to float64)) {
	p := g.plan
	gr := &g.groups[g.grp[k]]
	m := &p.Members[k]
	tol := g.opt.SnapToleranceIn
	u := unit(sub(m.End, m.Start))
	sups.query(m.Start, m.End, near+g.opt.MaxWallThicknessIn+tol, func(s int) {
		sl := &p.Supports[s]
		d := sub(sl.B, sl.A)
		l := math.Hypot(d.X, d.Y)
		if l == 0 || math.Abs(cross(d, gr.u))/l > maxParallelSin {
			return
		}
		off := dot(mid(sl.A, sl.B), gr.n) - p.across[k]
		if below {
			off = -off
		}
		if off < near-tol || off > near+g.opt.MaxWallThicknessIn+tol {
			return
		}
		a, b := dot(sub(sl.A, m.Start), u), dot(sub(sl.B, m.Start), u)
		from, to := math.Max(math.Min(a, b), 0), math.Min(math.Max(a, b), m.LengthIn)
		if to-from > tol {
			fn(s, from, to)
		}
	})
}

// nearestBoth sets lo[k] and hi[k], the neighbours of member k (in line
// lk of lines) below and above it.
func (g *grouper) nearestBoth(k int, lines []line, lk int) {
	p := g.plan
	g.lo[k], g.hi[k] = -1, -1
	for li := lk - 1; li >= 0; li-- {
		j0 := lines[li].members[0]
		gap := p.across[k] - p.across[j0]
		if g.grp[j0] != g.grp[k] || gap > maxNeighbourGapIn {
			break
		}
		if gap < minNeighbourGapIn {
			continue
		}
		if j := g.overlapping(&lines[li], k, true); j >= 0 {
			g.lo[k] = j
			break
		}
	}
	for li := lk + 1; li < len(lines); li++ {
		j0 := lines[li].members[0]
		gap := p.across[j0] - p.across[k]
		if g.grp[j0] != g.grp[k] || gap > maxNeighbourGapIn {
			break
		}
		if gap < minNeighbourGapIn {
			continue
		}
		if j := g.overlapping(&lines[li], k, false); j >= 0 {
			g.hi[k] = j
			break
		}
	}
}

// line is a run of members of one direction group at one offset across,
// sorted by where they start along the group direction (a0), with the
// largest end (a1) of each prefix of that order.
type line struct {
	members []int
	a0      []float64 // per member: its a0, for the binary search
	maxA1   []float64
}

// lines cuts the sorted members into lines and returns them with each
// sorted position's line.
func (g *grouper) lines(order []int) ([]line, []int) {
	p := g.plan
	var out []line
	lineOf := make([]int, len(order))
	for x := 0; x < len(order); {
		y := x + 1
		for y < len(order) && g.grp[order[y]] == g.grp[order[x]] && p.across[order[y]] == p.across[order[x]] {
			y++
		}
		l := line{members: order[x:y:y]}
		if y-x > 1 {
			l.members = slices.Clone(l.members)
			slices.SortFunc(l.members, func(a, b int) int {
				if c := cmp.Compare(g.a0[a], g.a0[b]); c != 0 {
					return c
				}
				return cmp.Compare(a, b)
			})
			l.maxA1 = make([]float64, len(l.members))
			l.a0 = make([]float64, len(l.members))
			m := math.Inf(-1)
			for i, k := range l.members {
				m = math.Max(m, g.a1[k])
				l.maxA1[i] = m
				l.a0[i] = g.a0[k]
			}
		}
		for z := x; z < y; z++ {
			lineOf[z] = len(out)
		}
		out = append(out, l)
		x = y
	}
	return out, lineOf
}

// overlaps reports whether the extents of members a and b overlap by more
// than the snap tolerance and by at least minOverlapFrac of the shorter.
func (g *grouper) overlaps(a, b int) bool {
	ov := math.Min(g.a1[a], g.a1[b]) - math.Max(g.a0[a], g.a0[b])
	shorter := math.Min(g.a1[a]-g.a0[a], g.a1[b]-g.a0[b])
	return ov > g.opt.SnapToleranceIn && ov >= minOverlapFrac*shorter
}

// overlapping returns the member of line l overlapping member k with the
// highest index (highest true) or the lowest, or -1. A member overlapping
// k starts before k ends and ends after k starts (an overlap greater than
// the tolerance needs both), so only the members starting before k ends
// are looked at, from the last, while some member up to there ends after
// k starts.
func (g *grouper) overlapping(l *line, k int, highest bool) int {
	if len(l.members) == 1 {
		if j := l.members[0]; g.overlaps(k, j) {
			return j
		}
		return -1
	}
	end, _ := slices.BinarySearch(l.a0, g.a1[k]) // the first starting at or after k's end
	best := -1
	for y := end - 1; y >= 0 && l.maxA1[y] > g.a0[k]; y-- {
		j := l.members[y]
		if g.a1[j] > g.a0[k] && g.overlaps(k, j) && (best < 0 || (highest && j > best) || (!highest && j < best)) {
			best = j
		}
	}
	return best
}

// setTrib sets member k's tributary widths, spacing and neighbours from
// lo and hi; a member with no neighbour is warned about in iss. On a side
// with no neighbouring joist the tributary width is the project's edge
// distance or, when a support line runs parallel on that side within
// edgeSupportReachIn (an edge joist beside a wall or beam), half the gap to
// it if that is more: the sheathing between them bears on both, so the
// joist carries half the strip (said in iss as an info finding).
func (g *grouper) setTrib(iss *dxfimport.IssueList, strips *[]edgeStrip, k int, sups *segIndex, cur *segCursor) {
	p := g.plan
	m := &p.Members[k]
	edge := g.opt.EdgeDistanceIn
	loT, hiT := edge, edge
	var gaps [2]float64
	ng := 0
	m.Neighbours = [2]int{g.lo[k], g.hi[k]}
	m.NeighbourGapsIn = [2]float64{}
	if j := g.lo[k]; j >= 0 {
		m.NeighbourGapsIn[0] = p.across[k] - p.across[j]
	}
	if j := g.hi[k]; j >= 0 {
		m.NeighbourGapsIn[1] = p.across[j] - p.across[k]
	}
	if j := g.lo[k]; j >= 0 {
		gap := p.across[k] - p.across[j]
		loT = gap / 2
		gaps[ng], ng = gap, ng+1
	}
	if j := g.hi[k]; j >= 0 {
		gap := p.across[j] - p.across[k]
		hiT = gap / 2
		gaps[ng], ng = gap, ng+1
	}
	var beside []string
	for side, t := range [2]*float64{&loT, &hiT} {
		if [2]int{g.lo[k], g.hi[k]}[side] >= 0 {
			continue
		}
		gap, s, near := g.edgeSupport(k, side == 0, sups, cur)
		if s < 0 {
			g.edgeOpen[k] |= 1 << side
			continue
		}
		if gap/2 > *t {
			*t = gap / 2
			beside = append(beside, fmt.Sprintf("%s %.1f in away (%s)", p.Supports[s].Kind, gap, p.Supports[s].Pos))
		}
		// the rest of the gap is the support's: half, or less where the
		// project's edge distance gives the joist more
		if rest := gap - *t; rest > 0 {
			*strips = append(*strips, edgeStrip{member: k, support: s, halfIn: rest, below: side == 0, nearIn: near})
		}
	}
	// the larger-across side is the member's left when the group normal
	// is its left normal
	if dot(g.groups[g.grp[k]].n, rot90(p.dirs[k])) > 0 {
		m.TribLeftIn, m.TribRightIn = hiT, loT
	} else {
		m.TribLeftIn, m.TribRightIn = loT, hiT
	}
	m.TribIn = m.TribLeftIn + m.TribRightIn
	if len(beside) > 0 {
		iss.Add(m.Pos, CodeEdgeSupport, dxfimport.SevInfo, "%s is an edge joist beside a parallel support line, %s: "+
			"it carries half the strip between them, tributary width %.2f in", m.ID, strings.Join(beside, " and "), m.TribIn)
	}
	switch ng {
	case 2:
		m.SpacingIn = (gaps[0] + gaps[1]) / 2
	case 1:
		m.SpacingIn = gaps[0]
	default:
		msg := fmt.Sprintf("%s has no parallel neighbour within %.0f in: tributary width is the edge distance on both sides (%.2f in)",
			m.ID, float64(maxNeighbourGapIn), m.TribIn)
		m.Messages = append(m.Messages, msg)
		iss.Add(m.Pos, CodeNoNeighbour, dxfimport.SevWarning, "%s", msg)
	}
}

// makeRuns joins each member to its neighbours when both are usable and
// bear on the same support lines (same count and kinds, each bearing
// centre on the other's support line within the snap tolerance), then
// orders each run across and numbers the runs by their first member.
func (g *grouper) makeRuns() {
	p := g.plan
	n := len(p.Members)
	// Which neighbours bear alike, in parallel: each goroutine reads the
	// members' bearings and writes same[k] of its own range of k only.
	same := make([]uint8, n) // bit 0: lo[k], bit 1: hi[k]
	parallel(g.split(n), func(_ int, sp span) {
		for k := sp.lo; k < sp.hi; k++ {
			for b, j := range [2]int{g.lo[k], g.hi[k]} {
				if j >= 0 && g.sameBearings(k, j) {
					same[k] |= 1 << b
				}
			}
		}
	})
	sets := newDisjointSets(n)
	for k := 0; k < n; k++ {
		for b, j := range [2]int{g.lo[k], g.hi[k]} {
			if same[k]&(1<<b) != 0 {
				sets.union(k, j)
			}
		}
	}
	runOf := make([]int, n) // per root: its run
	var size []int
	for k := 0; k < n; k++ { // k ascending: runs numbered by first member
		r := sets.find(k)
		if r == k {
			runOf[r] = len(size)
			size = append(size, 0)
		}
		ri := runOf[r]
		size[ri]++
		p.Members[k].Run = ri
	}
	if len(size) > 0 {
		p.Runs = make([]Run, len(size))
	}
	flat := make([]int, n)
	for ri := range p.Runs {
		p.Runs[ri] = Run{ID: "R" + strconv.Itoa(ri+1), Members: flat[:0:size[ri]]}
		flat = flat[size[ri]:]
	}
	for k := 0; k < n; k++ {
		r := &p.Runs[p.Members[k].Run]
		r.Members = append(r.Members, k)
	}
	// each goroutine orders its own range of runs, reading the offsets
	parallel(g.split(len(p.Runs)), func(_ int, sp span) {
		for i := sp.lo; i < sp.hi; i++ {
			ms := p.Runs[i].Members
			sort.SliceStable(ms, func(x, y int) bool { return p.across[ms[x]] < p.across[ms[y]] })
		}
	})
}

func (g *grouper) sameBearings(k, j int) bool {
	mk, mj := &g.plan.Members[k], &g.plan.Members[j]
	if mk.Error || mj.Error || len(mk.Bearings) != len(mj.Bearings) || len(mk.Bearings) == 0 {
		return false
	}
	tol := g.opt.SnapToleranceIn
	for i := range mk.Bearings {
		bk, bj := &mk.Bearings[i], &mj.Bearings[i]
		if bk.Kind != bj.Kind {
			return false
		}
		pk := lerp(mk.Start, g.plan.dirs[k], bk.AtIn)
		pj := lerp(mj.Start, g.plan.dirs[j], bj.AtIn)
		if math.Abs(cross(g.bdirs[k][i], sub(pj, pk))) > tol {
			return false
		}
	}
	return true
}
