package framing

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"

	"framecheck/dxfimport"
)

// calloutRE matches a size callout: nominal size, then optionally "@" or
// "at", a spacing, an inch mark and "o.c." in any of the usual spellings.
var calloutRE = regexp.MustCompile(`(?i)^(\d+)\s*[x×]\s*(\d+)(?:\s*(?:joists?|rafters?))?` +
	`(?:\s*(?:@|at)\s*(\d+(?:\.\d+)?|\.\d+)\s*(?:"|''|in\.?|inch(?:es)?)?\s*(?:o\.?\s*c\.?)?)?$`)

// calloutLikeRE matches text that tries to be a size callout: a nominal
// size such as "2x10" or "2 X 12", or an on-centre spacing. Label-layer
// text without one (a room name, a general note) is not warned about one
// by one.
var calloutLikeRE = regexp.MustCompile(`(?i)\d\s*[x×]\s*\d|\bo\.?\s*c\b|@`)

// ErrBadCallout is the cause of every ParseCallout error.
var ErrBadCallout = errors.New("not a size callout")

// ParseCallout reads a size callout such as `2x10 @ 16" o.c.`, `2X12@12`
// or `2x8 at 19.2 in. oc` and returns the nominal size ("2x10") and the
// spacing in inches (0 when the callout gives only a size). Nominal
// thickness must be 2, 3 or 4 in and depth 2 to 16 in, no less than the
// thickness; spacing must be above 0 and at most 48 in.
//
// A text of several lines (an MTEXT with paragraph breaks, such as
// "2x10 @ 16\" O.C." over "DF-L No.2 U.N.O.") is a callout when one of its
// lines is; lines giving different sizes or spacings are an error.
func ParseCallout(s string) (size string, spacingIn float64, err error) {
	size, spacingIn, err = parseCalloutLine(s)
	lines := strings.Split(strings.ReplaceAll(s, "\r", "\n"), "\n")
	if err == nil || len(lines) < 2 {
		return size, spacingIn, err
	}
	found := ""
	for _, l := range lines {
		if strings.TrimSpace(l) == "" {
			continue
		}
		sz, sp, lerr := parseCalloutLine(l)
		if lerr != nil {
			continue
		}
		if found != "" && (sz != size || sp != spacingIn) {
			return "", 0, fmt.Errorf("%w: %q: lines %q and %q disagree", ErrBadCallout, s, found, strings.TrimSpace(l))
		}
		if found == "" {
			found, size, spacingIn = strings.TrimSpace(l), sz, sp
		}
	}
	if found == "" {
		return "", 0, err
	}
	return size, spacingIn, nil
}

// parseCalloutLine reads one callout line; see ParseCallout.
func parseCalloutLine(s string) (size string, spacingIn float64, err error) {
	t := strings.Join(strings.Fields(s), " ")
	t = strings.NewReplacer("”", `"`, "″", `"`, "“", `"`, "\u00a0", " ").Replace(t)
	sm := calloutRE.FindStringSubmatch(t)
	if sm == nil {
		return "", 0, fmt.Errorf("%w: %q (want a form like 2x10 @ 16\" o.c.)", ErrBadCallout, s)
	}
	b, _ := strconv.Atoi(sm[1])
	d, _ := strconv.Atoi(sm[2])
	if b < 2 || b > 4 || d < 2 || d > 16 || d < b {
		return "", 0, fmt.Errorf("%w: %q: nominal size %dx%d is not dimension lumber (2-4 x 2-16 in)", ErrBadCallout, s, b, d)
	}
	if sm[3] != "" {
		spacingIn, _ = strconv.ParseFloat(sm[3], 64)
		if spacingIn <= 0 || spacingIn > 48 {
			return "", 0, fmt.Errorf("%w: %q: spacing %g in is outside 0-48 in", ErrBadCallout, s, spacingIn)
		}
	}
	return fmt.Sprintf("%dx%d", b, d), spacingIn, nil
}

type callout struct {
	size      string
	spacingIn float64
	text      string
	pos       dxfimport.Pos
}

// assignLumber gives each member its by-layer or default lumber, then
// applies the size callouts.
func (g *grouper) assignLumber() {
	p := g.plan
	for k := range p.Members {
		m := &p.Members[k]
		m.Species, m.Grade, m.Size = g.opt.lumberFor(m.Layer)
	}
	if len(g.labelTexts) == 0 {
		return
	}
	got := make(map[int][]callout)
	var other []textItem // texts that do not try to be callouts: room names, notes
	for _, t := range g.labelTexts {
		size, sp, err := ParseCallout(t.text)
		if err != nil && !calloutLikeRE.MatchString(t.text) {
			other = append(other, t)
			continue
		}
		if err != nil {
			g.warn(t.pos, CodeBadCallout, "label-layer text left out: %v", err)
			continue
		}
		c := callout{size, sp, strings.TrimSpace(t.text), t.pos}
		ms := g.calloutMembers(t)
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
	ks := make([]int, 0, len(got))
	for k := range got {
		ks = append(ks, k)
	}
	sort.Ints(ks)
	for _, k := range ks {
		g.applyCallouts(k, got[k])
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
		lo, hi, typ := bounds(g.labelLines)
		g.lblIdx = newSegIndex(lo, hi, len(g.labelLines), typ)
		for i, l := range g.labelLines {
			g.lblIdx.insert(i, l.a, l.b, 0)
		}
	}
	return g.lblIdx
}

func (g *grouper) memberIndex() *segIndex {
	p := g.plan
	if g.memIdx == nil && len(p.Members) > 0 {
		segs := make([]segItem, len(p.Members))
		for k, m := range p.Members {
			segs[k] = segItem{a: m.Start, b: m.End}
		}
		lo, hi, typ := bounds(segs)
		g.memIdx = newSegIndex(lo, hi, len(segs), typ)
		for k, s := range segs {
			g.memIdx.insert(k, s.a, s.b, 0)
		}
	}
	return g.memIdx
}

func (g *grouper) applyCallouts(k int, cs []callout) {
	m := &g.plan.Members[k]
	// a callout without a spacing agrees with one that gives it
	c0 := cs[0]
	for _, c := range cs[1:] {
		if c0.spacingIn == 0 {
			c0.spacingIn = c.spacingIn
		}
	}
	for _, c := range cs[1:] {
		if c.size != c0.size || (c.spacingIn != 0 && c.spacingIn != c0.spacingIn) {
			m.Error = true
			msg := fmt.Sprintf("%s has conflicting size callouts %q (%s) and %q (%s); resolve the drawing",
				m.ID, c0.text, c0.pos, c.text, c.pos)
			m.Messages = append(m.Messages, msg)
			g.plan.Issues.Add(m.Pos, CodeCalloutConflict, dxfimport.SevError, "%s", msg)
			return
		}
	}
	m.Size, m.CalloutSpacingIn = c0.size, c0.spacingIn
	if sp := g.jointSpacing(k); c0.spacingIn > 0 && sp > 0 && math.Abs(sp-c0.spacingIn) > 1 {
		msg := fmt.Sprintf("%s: callout %q says %g in o.c. but the drawing measures %.2f in",
			m.ID, c0.text, c0.spacingIn, sp)
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
