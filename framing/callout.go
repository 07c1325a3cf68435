package framing

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"sort"
	"strings"

	"framecheck/dxfimport"
)

// calloutLikeRE matches text that tries to be a size callout: a nominal
// size such as "2x10" or "2 X 12", or an on-centre spacing. Label-layer
// text without one (a room name, a general note) is not warned about one
// by one.
var calloutLikeRE = regexp.MustCompile(`(?i)\d\s*[x×]\s*\d|\bo\.?\s*c\b|@`)

// unreadCallout is a label text that names a size but cannot be read.
type unreadCallout struct {
	text   string
	pos    dxfimport.Pos
	reason string
}

type callout struct {
	Callout
	text string
	pos  dxfimport.Pos
}

// assignLumber gives each member its by-layer or default lumber, then
// applies the size callouts.
//
// Finding the joists under each callout and applying the callouts to
// each member run in parallel (parallel.go); reading the texts, the
// warnings about them and the lists of callouts per member stay in text
// order, as they were drawn.
func (g *grouper) assignLumber() {
	p := g.plan
	g.layerLumber()
	if len(g.labelTexts) == 0 && len(g.bayRegions) == 0 {
		return
	}
	got := newMemberCallouts(len(p.Members))
	unread := make(map[int]unreadCallout) // members under a callout that cannot be read
	var other []textItem                  // texts that do not try to be callouts: room names, notes
	read, kind := g.readLabelTexts()
	ms := g.calloutsMembers(kind)
	for ti, t := range g.labelTexts {
		co, err := read[ti].co, read[ti].err
		switch kind[ti] {
		case textSkipped:
			continue
		case textOther:
			other = append(other, t)
			continue
		case textNoSize:
			g.warn(t.pos, CodeBadCallout, "label-layer text left out: %v", err)
			continue
		}
		text := flatText(t.text)
		ms := ms[ti]
		if err != nil {
			// It names a size but cannot be read: an error on the
			// members under it, never the default size.
			if len(ms) == 0 {
				g.warn(t.pos, CodeBadCallout, "callout cannot be read and reaches no joist: %v", err)
				continue
			}
			g.plan.Issues.Add(t.pos, CodeBadCallout, dxfimport.SevError,
				"%v; the %d joist(s) under it are in error, not checked at the project's size", err, len(ms))
			for _, k := range ms {
				if _, seen := unread[k]; !seen {
					reason := err.Error()
					if ce := (*CalloutError)(nil); errors.As(err, &ce) {
						reason = ce.Reason
					}
					unread[k] = unreadCallout{text, t.pos, reason}
				}
			}
			continue
		}
		c := callout{co, text, t.pos}
		if len(ms) == 0 {
			g.warn(t.pos, CodeCalloutUnused, "callout %q reaches no joist: no span line under it and no joist near it", c.text)
		}
		got.give(ms, c)
	}
	if len(other) > 0 {
		g.plan.Issues.Add(other[0].pos, CodeBadCallout, dxfimport.SevInfo,
			"%d label-layer text(s) with no size in them left out, such as %q (a callout reads like 2x10 @ 16\" o.c.)",
			len(other), strings.Join(strings.Fields(other[0].text), " "))
	}
	g.bayCallouts(got)
	// Each goroutine applies the callouts of its own range of members,
	// writing those members only (reading their neighbours' offsets);
	// its issues are appended after, in member order.
	spans := g.split(len(p.Members))
	issues := make(issueLists, len(spans))
	parallel(spans, func(w int, sp span) {
		var cs []callout
		for k := sp.lo; k < sp.hi; k++ {
			if cs = got.over(k, cs[:0]); len(cs) > 0 {
				g.applyCallouts(&issues[w], k, cs)
			}
		}
	})
	issues.appendTo(&p.Issues)
	for k, u := range unread {
		m := &p.Members[k]
		m.Error, m.Size = true, "" // no size: the project's is not assumed
		m.Messages = append(m.Messages, fmt.Sprintf("%s: the size callout %q (%s) cannot be read: %s; "+
			"the member is not checked", m.ID, u.text, u.pos, u.reason))
	}
}

// memberCallouts lists the callouts over each member, in the order they
// were given (drawing order, then bays).
type memberCallouts struct {
	cos []callout // each callout once
	of  [][]int32 // per member: indices into cos
	ids slab[int32]
}

func newMemberCallouts(n int) *memberCallouts { return &memberCallouts{of: make([][]int32, n)} }

// give lists callout c over each member of ms.
func (mc *memberCallouts) give(ms []int, c callout) {
	if len(ms) == 0 {
		return
	}
	ci := int32(len(mc.cos))
	mc.cos = append(mc.cos, c)
	for _, k := range ms {
		if len(mc.of[k]) == 0 {
			mc.of[k] = mc.ids.take([]int32{ci})
		} else {
			mc.of[k] = append(mc.of[k], ci)
		}
	}
}

// over appends the callouts over member k to dst.
func (mc *memberCallouts) over(k int, dst []callout) []callout {
	for _, ci := range mc.of[k] {
		dst = append(dst, mc.cos[ci])
	}
	return dst
}

// layerLumber gives each member its by-layer or default lumber. Each
// goroutine writes its own range of members, reading the options.
func (g *grouper) layerLumber() {
	p := g.plan
	parallel(g.split(len(p.Members)), func(_ int, sp span) {
		byLayer := map[string][3]string{} // a plan has few joist layers
		for k := sp.lo; k < sp.hi; k++ {
			m := &p.Members[k]
			l, ok := byLayer[m.Layer]
			if !ok {
				l[0], l[1], l[2] = g.opt.lumberFor(m.Layer)
				byLayer[m.Layer] = l
			}
			m.Species, m.Grade, m.Size = l[0], l[1], l[2]
		}
	})
}

// What a label text is to assignLumber.
const (
	textCallout = iota // a callout, read or not: applied to the joists under it
	textSkipped        // a bay's callout, read with its bay (bays.go)
	textOther          // no size in it (a room name, a note): counted in one finding
	textNoSize         // tries to be a callout, names no size: warned about
)

type reading struct {
	co  Callout
	err error
}

// readLabelTexts reads each label text as a callout (each distinct text
// once: a plan repeats its callouts run after run) and sorts the texts
// by what they are.
func (g *grouper) readLabelTexts() ([]reading, []int) {
	cache := map[string]reading{}
	read := make([]reading, len(g.labelTexts))
	kind := make([]int, len(g.labelTexts))
	for ti, t := range g.labelTexts {
		if g.bayText != nil && g.bayText[ti] {
			kind[ti] = textSkipped
			continue
		}
		r, ok := cache[t.text]
		if !ok {
			r.co, r.err = g.readCallout(t.text)
			cache[t.text] = r
		}
		read[ti] = r
		switch {
		case r.err != nil && !calloutLikeRE.MatchString(t.text):
			kind[ti] = textOther
		case r.err != nil && !anySizeRE.MatchString(normalizeCallout(t.text)):
			kind[ti] = textNoSize
		}
	}
	return read, kind
}

// calloutsMembers returns, per label text that is a callout, the joists
// it applies to (calloutMembers). Each goroutine takes a range of the
// texts, reads the label lines, the members and their grids (through
// cursors of its own) and writes the lists of its own texts only.
func (g *grouper) calloutsMembers(kind []int) [][]int {
	out := make([][]int, len(g.labelTexts))
	li, mi := g.labelIndex(), g.memberIndex() // built before the goroutines share them
	parallel(g.splitHeavy(len(g.labelTexts)), func(_ int, sp span) {
		var q calloutQuery
		if li != nil {
			q.label = li.newCursor()
		}
		if mi != nil {
			q.member = mi.newCursor()
		}
		for ti := sp.lo; ti < sp.hi; ti++ {
			if kind[ti] == textCallout {
				out[ti] = g.calloutMembers(&q, g.labelTexts[ti])
			}
		}
	})
	return out
}

// calloutQuery holds one goroutine's cursors through the label-line and
// member grids.
type calloutQuery struct{ label, member *segCursor }

// calloutReachIn is how far a callout text may sit from its span line:
// three text heights, at least 12 in (common practice, no source).
func calloutReachIn(t textItem) float64 { return math.Max(12, 3*t.heightIn) }

// calloutMembers returns the joists a callout applies to: those crossed by
// the nearest label line within reach, else the run of the joist the text
// lies over (within 24 in).
func (g *grouper) calloutMembers(q *calloutQuery, t textItem) []int {
	best, bi := calloutReachIn(t), -1
	if li := g.lblIdx; li != nil {
		var near []int
		li.queryWith(q.label, t.p, t.p, best, func(i int) { near = append(near, i) })
		sort.Ints(near) // ties go to the last line, as in drawing order
		for _, i := range near {
			l := g.labelLines[i]
			if d := distPointSeg(t.p, l.a, l.b); d <= best {
				best, bi = d, i
			}
		}
	}
	idx := g.memIdx
	if idx == nil {
		return nil
	}
	p := g.plan
	var out []int
	if bi >= 0 {
		l := g.labelLines[bi]
		idx.queryWith(q.member, l.a, l.b, g.opt.SnapToleranceIn, func(k int) {
			if _, ok := g.crossAt(k, l.a, l.b); ok {
				out = append(out, k)
			}
		})
		sort.Ints(out)
		return out
	}
	nearest, nk := 24.0, -1
	idx.queryWith(q.member, t.p, t.p, nearest, func(k int) {
		m := &p.Members[k]
		if d := distPointSeg(t.p, m.Start, m.End); d <= nearest {
			nearest, nk = d, k
		}
	})
	if nk < 0 {
		return nil
	}
	return append(out, p.Runs[p.Members[nk].Run].Members...)
}

// crossAt returns where segment ab crosses member k, along the member from
// Start, when it does (within the snap tolerance of either's ends and at
// least minBearingAngleDeg from parallel).
func (g *grouper) crossAt(k int, a, b Point) (float64, bool) {
	m := &g.plan.Members[k]
	u := g.plan.dirs[k]
	t, _, sin, ok := segParams(m.Start, u, a, b)
	tol := g.opt.SnapToleranceIn
	if !ok || sin < math.Sin(minBearingAngleDeg*math.Pi/180) || t < -tol || t > m.LengthIn+tol {
		return 0, false
	}
	if distPointSeg(lerp(m.Start, u, t), a, b) > tol {
		return 0, false
	}
	return t, true
}

// labelIndex is a grid over the label lines, built on first use.
func (g *grouper) labelIndex() *segIndex {
	if g.lblIdx == nil && len(g.labelLines) > 0 {
		g.lblIdx = indexSegs(g.labelLines)
	}
	return g.lblIdx
}

func (g *grouper) memberIndex() *segIndex {
	p := g.plan
	if g.memIdx == nil && len(p.Members) > 0 {
		n := len(p.Members)
		g.memIdx = indexEnds(n, func(k int) (Point, Point) { return g.ends[k][0], g.ends[k][1] }, g.split(n))
	}
	return g.memIdx
}

// applyCallouts gives member k the size, plies, spacing, species and
// grade of the callouts over it; callouts that disagree make it an error.
// The issues go to iss.
func (g *grouper) applyCallouts(iss *dxfimport.IssueList, k int, cs []callout) {
	m := &g.plan.Members[k]
	c0 := cs[0]
	if len(cs) > 1 {
		var bad int
		if c0, bad = mergeCallouts(cs); bad >= 0 {
			c := cs[bad]
			m.Error = true
			msg := fmt.Sprintf("%s has conflicting size callouts %q (%s) and %q (%s); resolve the drawing",
				m.ID, cs[0].text, cs[0].pos, c.text, c.pos)
			m.Messages = append(m.Messages, msg)
			iss.Add(m.Pos, CodeCalloutConflict, dxfimport.SevError, "%s", msg)
			return
		}
	}
	m.Size, m.CalloutSpacingIn = c0.Designation(), c0.SpacingIn
	switch {
	case c0.Material:
		// a material named by the callout (structural composite lumber):
		// its grade is the callout's, else the layer's [lumber] grade
		// when the layer names the same material, else none (the
		// material's only grade; the check names the grades when it has
		// several); never a sawn grade of the layer
		if c0.Grade != "" || !strings.EqualFold(m.Species, c0.Species) {
			m.Grade = c0.Grade
		}
		m.Species = c0.Species
	default:
		if c0.Species != "" {
			m.Species = c0.Species
		}
		if c0.Grade != "" {
			m.Grade = c0.Grade
		}
	}
	// a generated joist is at the callout's spacing but for the last gap
	// of its bay, which is the layout's, not the drawing's
	if sp := g.jointSpacing(k); !m.Generated && c0.SpacingIn > 0 && sp > 0 && math.Abs(sp-c0.SpacingIn) > 1 {
		msg := fmt.Sprintf("%s: callout %q says %g in o.c. but the drawing measures %.2f in",
			m.ID, c0.text, c0.SpacingIn, sp)
		m.Messages = append(m.Messages, msg)
		iss.Add(m.Pos, CodeCalloutSpacing, dxfimport.SevWarning, "%s", msg)
	}
}

// readCallout reads a label text as ReadCallout does, and a size in
// actual inches with the project's materials (Options.MaterialCallout).
func (g *grouper) readCallout(s string) (Callout, error) {
	return ReadCalloutWith(s, g.opt.MaterialCallout)
}

// mergeCallouts merges the callouts over one member into the first: a
// callout without a spacing (species, grade) agrees with one that gives
// it. bad is the first that disagrees (another size, or another value
// given), -1 when none does.
func mergeCallouts(cs []callout) (c0 callout, bad int) {
	c0 = cs[0]
	for i, c := range cs[1:] {
		err := c0.merge(c.Callout)
		if c.Designation() != c0.Designation() || err != nil {
			return c0, i + 1
		}
	}
	return c0, -1
}

// plyGapIn: parallel joists this close are plies of one built-up member
// (a doubled joist, 1.5 in apart), not joists spaced on centre (common
// practice, no source).
const plyGapIn = 4

// jointSpacing is member k's spacing to compare with a callout: the mean
// of its gaps to its neighbours, leaving out gaps to a ply of the same
// built-up member; 0 when no gap is left.
func (g *grouper) jointSpacing(k int) float64 {
	var sum float64
	var n int
	for _, j := range []int{g.lo[k], g.hi[k]} {
		if j < 0 {
			continue
		}
		if gap := math.Abs(g.plan.across[j] - g.plan.across[k]); gap > plyGapIn {
			sum += gap
			n++
		}
	}
	if n == 0 {
		return 0
	}
	return sum / float64(n)
}

// existingBlocking records where drawn blocking lines cross each member.
func (g *grouper) existingBlocking() {
	if len(g.blocking) == 0 {
		return
	}
	idx := g.memberIndex()
	if idx == nil {
		return
	}
	p := g.plan
	for _, b := range g.blocking {
		idx.query(b.a, b.b, g.opt.SnapToleranceIn, func(k int) {
			if t, ok := g.crossAt(k, b.a, b.b); ok {
				p.Members[k].ExistingBlockingAtIn = append(p.Members[k].ExistingBlockingAtIn, t)
			}
		})
	}
	// blocking drawn piece by piece touches each joist from both sides:
	// one bracing point per position (within the snap tolerance). Each
	// goroutine tidies its own range of members.
	parallel(g.split(len(p.Members)), func(_ int, sp span) {
		for k := sp.lo; k < sp.hi; k++ {
			at := p.Members[k].ExistingBlockingAtIn
			if at == nil {
				continue
			}
			sort.Float64s(at)
			n := 0
			for _, x := range at {
				if n > 0 && x-at[n-1] <= g.opt.SnapToleranceIn {
					continue
				}
				at[n] = x
				n++
			}
			p.Members[k].ExistingBlockingAtIn = at[:n]
		}
	})
}
