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
func (g *grouper) assignLumber() {
	p := g.plan
	for k := range p.Members {
		m := &p.Members[k]
		m.Species, m.Grade, m.Size = g.opt.lumberFor(m.Layer)
	}
	if len(g.labelTexts) == 0 && len(g.bayRegions) == 0 {
		return
	}
	got := make(map[int][]callout)
	unread := make(map[int]unreadCallout) // members under a callout that cannot be read
	var other []textItem                  // texts that do not try to be callouts: room names, notes
	type reading struct {
		co  Callout
		err error
	}
	read := map[string]reading{} // a plan repeats its callouts run after run
	for ti, t := range g.labelTexts {
		if g.bayText != nil && g.bayText[ti] {
			continue // read with its bay (bays.go)
		}
		r, ok := read[t.text]
		if !ok {
			r.co, r.err = ReadCallout(t.text)
			read[t.text] = r
		}
		co, err := r.co, r.err
		if err != nil && !calloutLikeRE.MatchString(t.text) {
			other = append(other, t)
			continue
		}
		text := flatText(t.text)
		if err != nil && !anySizeRE.MatchString(normalizeCallout(t.text)) {
			g.warn(t.pos, CodeBadCallout, "label-layer text left out: %v", err)
			continue
		}
		ms := g.calloutMembers(t)
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
		for _, k := range ms {
			got[k] = append(got[k], c)
		}
	}
	if len(other) > 0 {
		g.plan.Issues.Add(other[0].pos, CodeBadCallout, dxfimport.SevInfo,
			"%d label-layer text(s) with no size in them left out, such as %q (a callout reads like 2x10 @ 16\" o.c.)",
			len(other), strings.Join(strings.Fields(other[0].text), " "))
	}
	g.bayCallouts(got)
	ks := make([]int, 0, len(got))
	for k := range got {
		ks = append(ks, k)
	}
	sort.Ints(ks)
	for _, k := range ks {
		g.applyCallouts(k, got[k])
	}
	for k, u := range unread {
		m := &p.Members[k]
		m.Error, m.Size = true, "" // no size: the project's is not assumed
		m.Messages = append(m.Messages, fmt.Sprintf("%s: the size callout %q (%s) cannot be read: %s; "+
			"the member is not checked", m.ID, u.text, u.pos, u.reason))
	}
}

// calloutReachIn is how far a callout text may sit from its span line:
// three text heights, at least 12 in (common practice, no source).
func calloutReachIn(t textItem) float64 { return math.Max(12, 3*t.heightIn) }

// calloutMembers returns the joists a callout applies to: those crossed by
// the nearest label line within reach, else the run of the joist the text
// lies over (within 24 in).
func (g *grouper) calloutMembers(t textItem) []int {
	best, bi := calloutReachIn(t), -1
	if li := g.labelIndex(); li != nil {
		var near []int
		li.query(t.p, t.p, best, func(i int) { near = append(near, i) })
		sort.Ints(near) // ties go to the last line, as in drawing order
		for _, i := range near {
			l := g.labelLines[i]
			if d := distPointSeg(t.p, l.a, l.b); d <= best {
				best, bi = d, i
			}
		}
	}
	idx := g.memberIndex()
	if idx == nil {
		return nil
	}
	p := g.plan
	var out []int
	if bi >= 0 {
		l := g.labelLines[bi]
		idx.query(l.a, l.b, g.opt.SnapToleranceIn, func(k int) {
			if _, ok := g.crossAt(k, l.a, l.b); ok {
				out = append(out, k)
			}
		})
		sort.Ints(out)
		return out
	}
	nearest, nk := 24.0, -1
	idx.query(t.p, t.p, nearest, func(k int) {
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
		segs := make([]segItem, len(p.Members))
		for k := range p.Members {
			segs[k] = segItem{a: p.Members[k].Start, b: p.Members[k].End}
		}
		g.memIdx = indexSegs(segs)
	}
	return g.memIdx
}

// applyCallouts gives member k the size, plies, spacing, species and
// grade of the callouts over it; callouts that disagree make it an error.
func (g *grouper) applyCallouts(k int, cs []callout) {
	m := &g.plan.Members[k]
	// a callout without a spacing (species, grade) agrees with one that
	// gives it
	c0 := cs[0]
	for _, c := range cs[1:] {
		err := c0.merge(c.Callout)
		if c.Designation() != c0.Designation() || err != nil {
			m.Error = true
			msg := fmt.Sprintf("%s has conflicting size callouts %q (%s) and %q (%s); resolve the drawing",
				m.ID, cs[0].text, cs[0].pos, c.text, c.pos)
			m.Messages = append(m.Messages, msg)
			g.plan.Issues.Add(m.Pos, CodeCalloutConflict, dxfimport.SevError, "%s", msg)
			return
		}
	}
	m.Size, m.CalloutSpacingIn = c0.Designation(), c0.SpacingIn
	if c0.Species != "" {
		m.Species = c0.Species
	}
	if c0.Grade != "" {
		m.Grade = c0.Grade
	}
	// a generated joist is at the callout's spacing but for the last gap
	// of its bay, which is the layout's, not the drawing's
	if sp := g.jointSpacing(k); !m.Generated && c0.SpacingIn > 0 && sp > 0 && math.Abs(sp-c0.SpacingIn) > 1 {
		msg := fmt.Sprintf("%s: callout %q says %g in o.c. but the drawing measures %.2f in",
			m.ID, c0.text, c0.SpacingIn, sp)
		m.Messages = append(m.Messages, msg)
		g.warn(m.Pos, CodeCalloutSpacing, "%s", msg)
	}
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
	// one bracing point per position (within the snap tolerance)
	for k := range p.Members {
		at := p.Members[k].ExistingBlockingAtIn
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
}
