package framing

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"

	"framecheck/dxfimport"
)

// ErrBadPointLoad is the cause of every ReadPointLoad error.
var ErrBadPointLoad = errors.New("point-load text not read")

// pointLoadPrefixRE matches the "P:" or "P =" that may open a point-load
// text.
var pointLoadPrefixRE = regexp.MustCompile(`(?i)^\s*P\s*[:=]\s*`)

// pointLoadSepRE splits a point-load text into its terms.
var pointLoadSepRE = regexp.MustCompile(`[,;+&\n]`)

// Terms of a point-load text: a number of pounds (or kips with K or KIP)
// and a load type, either way round: "1200 D", "1200# D", "1.2K L",
// "D = 1200", "LR 300 LB".
var (
	numRE       = `(\d+(?:\.\d*)?|\.\d+)\s*(LBS?|#|KIPS?|K)?`
	typeRE      = `(DL|LL|LR|WD|WU|D|L|S|W)`
	termNumType = regexp.MustCompile(`(?i)^` + numRE + `\s*` + typeRE + `$`)
	termTypeNum = regexp.MustCompile(`(?i)^` + typeRE + `\s*[:=]?\s*` + numRE + `$`)
)

// numOnlyRE matches a bare number, a load without its type.
var numOnlyRE = regexp.MustCompile(`^[-+]?(\d+(\.\d*)?|\.\d+)`)

// ReadPointLoad reads the text of a point-load mark. A text that is, or
// after "P:" is, one of names (case-insensitive) names that [[point_load]]
// and gives name as names spells it. Otherwise it gives the loads, lb,
// terms separated by commas, semicolons, "+" or "&":
//
//	P: 1200 D, 800 L      P = 1.2K D + 0.8K L      D 450; S 120; WU 300 LB
//
// Load types: D (or DL), L (or LL), LR, S, WD (wind toward the member),
// WU (wind away from it); a bare W is refused, as it does not say which
// way. A type given twice, a negative or missing number, or any other
// word is an error wrapping ErrBadPointLoad: a text is read whole or not
// at all, never as a smaller load.
func ReadPointLoad(text string, names []string) (name string, loads PointLoads, err error) {
	flat := strings.TrimSpace(strings.Join(strings.Fields(strings.ReplaceAll(text, "\n", ", ")), " "))
	rest := pointLoadPrefixRE.ReplaceAllString(flat, "")
	for _, n := range names {
		if strings.EqualFold(n, flat) || strings.EqualFold(n, rest) {
			return n, PointLoads{}, nil
		}
	}
	bad := func(format string, args ...any) error {
		return fmt.Errorf("%w: %q: %s; expected the name of a [[point_load]] or loads in lb such as \"P: 1200 D, 800 L\"",
			ErrBadPointLoad, flat, fmt.Sprintf(format, args...))
	}
	if rest == "" {
		return "", PointLoads{}, bad("no load given")
	}
	seen := map[string]bool{}
	terms := pointLoadSepRE.Split(rest, -1)
	for _, term := range terms {
		term = strings.TrimSpace(term)
		if term == "" {
			continue
		}
		var num, unit, typ string
		if m := termNumType.FindStringSubmatch(term); m != nil {
			num, unit, typ = m[1], m[2], m[3]
		} else if m := termTypeNum.FindStringSubmatch(term); m != nil {
			typ, num, unit = m[1], m[2], m[3]
		} else {
			one := len(terms) == 1 && !strings.Contains(term, " ") && !numOnlyRE.MatchString(term)
			if one && len(names) > 0 {
				return "", PointLoads{}, bad("%q is no [[point_load]] of the project (%s) and no load", term, strings.Join(names, ", "))
			} else if one {
				return "", PointLoads{}, bad("%q is no load, and the project defines no [[point_load]]", term)
			}
			return "", PointLoads{}, bad("%q is not a number of lb with a load type (D, L, LR, S, WD, WU)", term)
		}
		v, perr := strconv.ParseFloat(num, 64)
		if perr != nil || math.IsInf(v, 0) {
			return "", PointLoads{}, bad("%q is not a number", num)
		}
		if u := strings.ToUpper(unit); strings.HasPrefix(u, "K") {
			v *= 1000
		}
		typ = strings.ToUpper(typ)
		switch typ {
		case "DL":
			typ = "D"
		case "LL":
			typ = "L"
		case "W":
			return "", PointLoads{}, bad("W does not say which way: write WD (toward the member) or WU (uplift)")
		}
		if seen[typ] {
			return "", PointLoads{}, bad("load type %s is given twice", typ)
		}
		seen[typ] = true
		switch typ {
		case "D":
			loads.DeadLb = v
		case "L":
			loads.LiveLb = v
		case "LR":
			loads.RoofLiveLb = v
		case "S":
			loads.SnowLb = v
		case "WD":
			loads.WindDownLb = v
		case "WU":
			loads.WindUpLb = v
		}
	}
	if len(seen) == 0 {
		return "", PointLoads{}, bad("no load given")
	}
	return "", loads, nil
}

// pointLoadReachIn is how far a point-load text may sit from its mark:
// four text heights, at least 12 in (common practice, no source).
func pointLoadReachIn(t textItem) float64 { return math.Max(12, 4*t.heightIn) }

// findPointLoads reads the point-load marks, their texts and the member
// or beam each sits on. Every mark that cannot be used is an error
// finding naming its handle; the rest of the plan is not affected.
func (g *grouper) findPointLoads() {
	s := &g.lp
	if len(s.loadEnts) == 0 && len(s.loadTexts) == 0 {
		return
	}
	model, blocks := blockGroups(s.loadEnts)
	var marks []PointLoadMark
	for _, es := range blocks {
		if at, text, tp, ok := blockShape(es); ok {
			marks = append(marks, PointLoadMark{At: at, Pos: *es[0].From, Text: text, TextPos: tp})
		}
	}
	ownText := make([]bool, len(marks), len(marks)+len(model)) // a block's own text is its text
	for i := range marks {
		ownText[i] = marks[i].Text != ""
	}
	for _, m := range g.loadOutlineMarks(model) {
		marks = append(marks, m)
		ownText = append(ownText, false)
	}
	// each text goes to its nearest mark within reach; a mark takes the
	// nearest of the texts that chose it
	bestD := make([]float64, len(marks))
	for i := range bestD {
		bestD[i] = math.Inf(1)
	}
	// the marks without a text of their own in a grid: a text looks at
	// the cells its reach touches, not at every mark
	cell := 0.0
	for _, t := range s.loadTexts {
		cell = math.Max(cell, pointLoadReachIn(t))
	}
	var grid *pointGrid
	if cell > 0 {
		grid = newPointGrid(cell, len(marks), func(i int) (Point, bool) { return marks[i].At, !ownText[i] })
	}
	for _, t := range s.loadTexts {
		mk, md := grid.nearest(t.p, pointLoadReachIn(t))
		if mk < 0 {
			g.loadTextErr(t.pos, "point-load text %q has no point, circle, block or post outline within %.0f in",
				flatText(t.text), pointLoadReachIn(t))
			continue
		}
		if md < bestD[mk] {
			if bestD[mk] < math.Inf(1) {
				g.loadTextErr(marks[mk].TextPos, "point-load text %q is beside a mark that has a nearer text", marks[mk].Text)
			}
			bestD[mk] = md
			marks[mk].Text, marks[mk].TextPos = flatText(t.text), t.pos
		} else {
			g.loadTextErr(t.pos, "point-load text %q is beside a mark that has a nearer text", flatText(t.text))
		}
	}
	for i := range marks {
		m := &marks[i]
		m.Member, m.Beam = -1, -1
		switch name, loads, err := ReadPointLoad(m.Text, g.opt.PointLoadNames); {
		case m.Text == "":
			m.Err = fmt.Sprintf("point-load mark at %s (%s) has no text beside it: give its loads such as \"P: 1200 D, 800 L\" "+
				"or the name of a [[point_load]]", g.drawingPoint(m.At), entityRef(m.Pos))
		case err != nil:
			m.Err = fmt.Sprintf("point-load mark at %s (%s): %v", g.drawingPoint(m.At), entityRef(m.Pos), err)
		default:
			m.Name, m.Loads = name, loads
		}
		if m.Err != "" {
			g.plan.Issues.Add(m.Pos, CodePointLoadText, dxfimport.SevError, "%s; the load is not applied", m.Err)
		}
		g.placePointLoad(m)
	}
	g.plan.PointLoads = marks
}

// loadTextErr reports a text on a point-load layer that loads nothing:
// an error, as the load it gives is not applied anywhere.
func (g *grouper) loadTextErr(pos dxfimport.Pos, format string, args ...any) {
	g.plan.Issues.Add(pos, CodePointLoadAlone, dxfimport.SevError,
		"%s; its load is not applied: put one text beside each point, circle, block or post outline", fmt.Sprintf(format, args...))
}

// placePointLoad finds the joist or beam a mark sits on: the nearest
// whose centre line passes within half its drawn width plus the snap
// tolerance; a beam wins a tie (a load at a joist's bearing goes into
// the beam). A mark on none is an error.
func (g *grouper) placePointLoad(m *PointLoadMark) {
	p := g.plan
	tol := g.opt.SnapToleranceIn
	best := math.Inf(1)
	if idx := g.beamIndex(); idx != nil {
		idx.query(m.At, m.At, tol+maxWallPad(g), func(k int) {
			b := &p.Beams[k]
			if d := distPointSeg(m.At, b.Start, b.End); d <= b.WidthIn/2+tol && (d < best || d == best && k < m.Beam) {
				best, m.Beam = d, k
				m.AtIn = g.along(k, m.At)
			}
		})
	}
	if idx := g.memberIndex(); idx != nil {
		idx.query(m.At, m.At, tol+maxBuiltUpIn, func(k int) {
			mb := &p.Members[k]
			if d := distPointSeg(m.At, mb.Start, mb.End); d <= mb.DrawnThicknessIn/2+tol && d < best {
				best, m.Beam, m.Member = d, -1, k
				m.AtIn = dot(sub(m.At, mb.Start), p.dirs[k])
			}
		})
	}
	if m.Beam >= 0 || m.Member >= 0 {
		return
	}
	msg := fmt.Sprintf("point-load mark at %s (%s) is on no joist or beam (none within the snap tolerance of %g in)",
		g.drawingPoint(m.At), entityRef(m.Pos), tol)
	if m.Err == "" {
		m.Err = msg
	} else {
		m.Err += "; " + msg
	}
	g.plan.Issues.Add(m.Pos, CodePointLoadOff, dxfimport.SevError, "%s; the load is not applied", msg)
}
