package export

import (
	"framecheck/export/internal/fmtx"
	"math"
	"regexp"
	"strconv"
	"strings"
)

// markCalc is the written-out calculation of one mark, for its governing
// member (the member of the mark with the largest ratio).
type markCalc struct {
	Mark, Anchor, Member, Status, Band, Ratio string
	Count, MoreMembers                        int
	Members                                   []string
	Inputs                                    []keyValue
	DesignValues                              []DesignValue
	AreaLoads                                 []areaLoad
	PointLoads                                []string // each point load on the member, in words
	Combos                                    []comboLoad
	ComboProblems                             []string
	Factors                                   []traceLine
	Checks                                    []checkCalc
	Others                                    []checkCalc // PackageGoverning: the checks not written out
	FactorLine                                string      // PackageGoverning: the factors on one line
	Steps                                     []stepRow
	StepsDrawn                                bool     // rows drawn: the solver placed rows one at a time
	Bracing                                   []string // the bracing relied on, edge by edge
	Messages                                  []string
}

// keyValue is one input line.
type keyValue struct{ Key, Value string }

// areaLoad is one load of the zone: p (psf) and w = p x trib (plf).
type areaLoad struct{ Load, Psf, Subst, WPlf string }

// traceLine is one step as an engineer writes it: Name = Formula = Subst =
// Value Unit (Source). Note holds a formula given in words (no numbers to
// substitute), printed after the value.
type traceLine struct {
	Name, Formula, Subst, Value, Unit, Source, Note string
}

// checkCalc is one check of the governing member.
type checkCalc struct {
	Title, Kind, Combo, Clause                    string
	Lines                                         []traceLine
	Actual, Allowable, Unit, Ratio, Verdict, Band string
	After                                         []string // printed after the result: the NDS 4.4.1.2 comparison
	ratio                                         float64  // the ratio, for picking the governing check
}

// stepRow is one iteration of the blocking-row solver: rows per span, or
// with rows drawn the number of rows added and where (At).
type stepRow struct{ Rows, Lu, CL, Ratio, Verdict, At string }

// membersListed is how many member ids a mark's calculation names.
const membersListed = 40

// checkTitles names each check kind and the clause it follows.
var checkTitles = map[string][2]string{
	KindBendingTop:      {"Bending, top edge in compression", "NDS 2018 3.3, 4.3"},
	KindBendingBottom:   {"Bending, bottom edge in compression", "NDS 2018 3.3, 4.3"},
	KindShear:           {"Shear parallel to grain", "NDS 2018 3.4"},
	KindDeflectionLive:  {"Deflection, live-type load", "NDS 2018 3.5; IBC 2018 Table 1604.3"},
	KindDeflectionTotal: {"Deflection, total load with creep", "NDS 2018 3.5.2; IBC 2018 Table 1604.3"},
	KindBearing:         {"Bearing perpendicular to grain", "NDS 2018 3.10"},
}

func buildCalcs(r *Results) []markCalc {
	pos := make(map[string]int, len(r.Marks))
	calcs := make([]markCalc, len(r.Marks))
	gov := make([]int, len(r.Marks))
	for i, mk := range r.Marks {
		pos[mk.Mark] = i
		calcs[i] = markCalc{Mark: mk.Mark, Anchor: "mark-" + anchorSafe(mk.Mark), Status: mk.Status,
			Band: bandClass(mk.MaxRatio, mk.Status), Ratio: fmtx.Ratio(mk.MaxRatio)}
		gov[i] = -1
	}
	for i := range r.Members {
		m := &r.Members[i]
		k, ok := pos[m.Mark]
		if !ok {
			continue
		}
		c := &calcs[k]
		c.Count++
		if len(c.Members) < membersListed {
			c.Members = append(c.Members, m.ID)
		} else {
			c.MoreMembers++
		}
		if gov[k] < 0 || ratioKey(m.MaxRatio) > ratioKey(r.Members[gov[k]].MaxRatio) {
			gov[k] = i
		}
	}
	for k := range calcs {
		if gov[k] >= 0 {
			fillCalc(&calcs[k], r, &r.Members[gov[k]])
		}
	}
	return calcs
}

// pointLoadText describes point load i of a member: "P1 (hoist) at
// 8'-2 1/4\": D 400 lb, L 300 lb".
func pointLoadText(i int, p PointLoad) string {
	s := "P" + strconv.Itoa(i+1)
	if p.Name != "" {
		s += " (" + p.Name + ")"
	}
	s += " at " + FtIn(p.FromFaceIn) + ":"
	sep := " "
	for _, l := range []struct {
		name string
		lb   float64
	}{{"D", p.DeadLb}, {"L", p.LiveLb}, {"Lr", p.RoofLiveLb}, {"S", p.SnowLb}, {"W down", p.WindDownLb}, {"W up", p.WindUpLb}} {
		if l.lb != 0 {
			s += sep + l.name + " " + fmtNum(l.lb) + " lb"
			sep = ", "
		}
	}
	switch {
	case p.DeadLb != 0 && p.UpliftDeadLb == 0:
		s += "; its D is not relied on against uplift (0.6D + 0.6W takes none of it: it may be taken away)"
	case p.UpliftDeadLb != p.DeadLb:
		s += "; D relied on against uplift " + fmtNum(p.UpliftDeadLb) + " lb"
	case p.DeadLb != 0:
		s += "; its D is relied on against uplift (0.6D + 0.6W)"
	}
	return s
}

// pointTotals adds up a member's point loads by load type, as
// comboLoads takes them (W up negative, as a line load away from the
// member is); nil when it has none.
func pointTotals(pls []PointLoad) map[string]float64 {
	if len(pls) == 0 {
		return nil
	}
	t := map[string]float64{}
	for _, p := range pls {
		t[loadD] += p.DeadLb
		t[loadL] += p.LiveLb
		t[loadLr] += p.RoofLiveLb
		t[loadS] += p.SnowLb
		t["W down"] += p.WindDownLb
		t["W up"] -= p.WindUpLb
	}
	return t
}

// zoneAreaLoads returns w = p x trib for each load of zone z, the load
// names followed by where (a zone's stretch of the member, or "").
func zoneAreaLoads(z *Zone, tribIn float64, where string) []areaLoad {
	var out []areaLoad
	for _, l := range []struct {
		name string
		psf  float64
	}{{"D", z.DeadPsf}, {"L", z.LivePsf}, {"Lr", z.RoofLivePsf}, {"S", z.SnowPsf}, {"W down", z.WindDownPsf}, {"W up", z.WindUpPsf}} {
		if l.psf == 0 {
			continue
		}
		if l.name == "D" && z.DeadOnSlope && z.PitchRise12 > 0 {
			// dead load per sloped area, on the plan: x 1/cos of the slope
			k := math.Hypot(12, z.PitchRise12) / 12
			out = append(out, areaLoad{Load: l.name + where + ", on slope, to plan / cos", Psf: fmtNum(l.psf * k),
				Subst: fmtNum(l.psf) + "(" + fmtNum(k) + ")(" + fmtNum(tribIn) + " / 12)", WPlf: fmtNum(l.psf * k * tribIn / 12)})
			continue
		}
		out = append(out, areaLoad{Load: l.name + where, Psf: fmtNum(l.psf),
			Subst: fmtNum(l.psf) + "(" + fmtNum(tribIn) + " / 12)", WPlf: fmtNum(l.psf * tribIn / 12)})
	}
	return out
}

func fillCalc(c *markCalc, r *Results, m *Member) {
	c.Member = m.ID
	c.Messages = m.Messages
	var zone *Zone
	for i := range r.Assumptions.Zones {
		if r.Assumptions.Zones[i].Name == m.Zone {
			zone = &r.Assumptions.Zones[i]
		}
	}
	c.Inputs = []keyValue{
		{"Member", m.ID + sourceSuffix(placeOf(m))},
		{"Size", strings.TrimSpace(m.Size + " " + m.Species + " " + m.Grade)},
		{"Length", FtIn(m.LengthIn) + " (" + fmtNum(m.LengthIn) + " in)"},
		{"Positions along the member", "from the face of its first bearing (the side toward the span)"},
		{"Bearing centre-lines at", ftInList(m.fromFaceList(m.BearingsAtIn))},
		{"Spans, centre to centre of bearings", ftInList(m.SpansIn) + " (" + numList(m.SpansIn) + " in)"},
		{"Overhangs (start, end)", fmtNum(m.OverhangsIn[0]) + " in, " + fmtNum(m.OverhangsIn[1]) + " in"},
		{"Spacing", inOrNA(m.SpacingIn)},
		{"Tributary width", inOrNA(m.TribIn)},
		{"Load zone", m.Zone},
	}
	if zone != nil {
		c.Inputs = append(c.Inputs,
			keyValue{"Use, ceiling", zone.Use + ", " + zone.Ceiling},
			keyValue{"Deflection limits (live, total)", limitText(zone.LiveDeflectionLimit) + ", " + limitText(zone.TotalDeflectionLimit)})
	}
	if len(m.DrawnBlockingAtIn) > 0 {
		c.Inputs = append(c.Inputs, keyValue{"Blocking rows drawn, existing, at", ftInList(m.fromFaceList(m.DrawnBlockingAtIn))})
	}
	rows := intList(m.BlockingRowsPerSpan)
	if rows == "" {
		rows = "none added"
	}
	c.Inputs = append(c.Inputs, keyValue{"Blocking rows to add, per span", rows})
	if len(m.BlockingAtIn) > 0 {
		c.Inputs = append(c.Inputs, keyValue{"Blocking rows to add at", ftInList(m.fromFaceList(m.BlockingAtIn))})
	}
	for _, dv := range r.Assumptions.DesignValues {
		if dv.Species == m.Species && dv.Grade == m.Grade && (dv.Size == "" || dv.Size == m.Size || !strings.Contains(dv.Size, "x")) {
			c.DesignValues = append(c.DesignValues, dv)
		}
	}
	cd := map[string]float64{}
	for _, f := range m.Factors {
		if f.Name == "CD" && f.Formula != "" {
			cd[caseKey(f.Formula)] = f.Value
			continue
		}
		c.Factors = append(c.Factors, newTraceLine(f))
	}
	// A member crossing zone edges: each zone's loads where it acts.
	for _, zp := range m.ZonePieces {
		for i := range r.Assumptions.Zones {
			if z := &r.Assumptions.Zones[i]; z.Name == zp.Zone {
				c.AreaLoads = append(c.AreaLoads, zoneAreaLoads(z, m.TribIn,
					" ("+z.Name+", "+FtIn(m.FromFace(zp.FromIn))+" to "+FtIn(m.FromFace(zp.ToIn))+")")...)
			}
		}
	}
	if zone != nil {
		c.AreaLoads = append(c.AreaLoads, zoneAreaLoads(zone, m.TribIn, "")...)
		combos := r.Assumptions.Combinations
		if len(combos) == 0 {
			combos = defaultCombos
		}
		c.Combos, c.ComboProblems = comboLoads(combos, zone, m.TribIn, pointTotals(m.PointLoads), cd)
	}
	for i, p := range m.PointLoads {
		c.PointLoads = append(c.PointLoads, pointLoadText(i, p))
	}
	for _, ch := range m.Checks {
		t := checkTitles[ch.Kind]
		if t[0] == "" {
			t = [2]string{ch.Kind, ""}
		}
		cc := checkCalc{Title: t[0], Kind: ch.Kind, Combo: ch.Combo, Clause: t[1],
			Actual: fmtx.Value(ch.Actual, ch.Unit), Allowable: fmtx.Value(ch.Allowable, ch.Unit), Unit: ch.Unit, Ratio: fmtx.RatioTrace(ch.Ratio),
			Band: bandClass(ch.Ratio, ""), ratio: ch.Ratio}
		switch {
		case !finite(ch.Ratio):
			cc.Verdict = "not evaluated"
		case ch.Ratio <= 1:
			cc.Verdict = "OK"
		default:
			cc.Verdict = "NOT OK"
		}
		for _, it := range ch.Trace {
			l := newTraceLine(it)
			l.Note = refaceText(l.Note, m)
			cc.Lines = append(cc.Lines, l)
		}
		c.Checks = append(c.Checks, cc)
	}
	c.Bracing = bracingLines(m)
	// The NDS 2018 4.4.1.2 comparison goes after the last CL result.
	for i := len(c.Checks) - 1; i >= 0; i-- {
		if k := c.Checks[i].Kind; k == KindBendingTop || k == KindBendingBottom {
			for _, s := range m.Info {
				if strings.Contains(s, "4.4.1.2") {
					c.Checks[i].After = append(c.Checks[i].After, s)
				}
			}
			break
		}
	}
	for _, s := range m.BlockingSteps {
		v := "passes"
		if !finite(s.Ratio) || s.Ratio > 1 {
			v = "fails"
		}
		row := stepRow{Rows: strconv.Itoa(s.RowsPerSpan), Lu: fmtx.In(s.LuIn), CL: fmtx.Factor(s.CL), Ratio: fmtx.RatioTrace(s.Ratio), Verdict: v}
		if s.AtIn != nil {
			c.StepsDrawn = true
			row.Rows, row.At = strconv.Itoa(len(s.AtIn)), ftInList(m.fromFaceList(s.AtIn))
		}
		c.Steps = append(c.Steps, row)
	}
}

// bracingLines states, edge by edge, the bracing the member's bending
// checks relied on, from their traces: the "bracing points" step, or CL = 1
// for an edge held continuously (check's bracing.go writes both).
func bracingLines(m *Member) []string {
	var out []string
	bottom := false
	for _, ch := range m.Checks {
		edge := "Top edge: "
		switch ch.Kind {
		case KindBendingTop:
		case KindBendingBottom:
			edge, bottom = "Bottom edge: ", true
		default:
			continue
		}
		for _, it := range ch.Trace {
			if it.Name == "bracing points" || (it.Name == "CL" && it.Subst == "" && strings.Contains(it.Formula, "held continuously")) {
				out = append(out, edge+refaceText(it.Formula, m))
				break
			}
		}
	}
	if len(out) > 0 && !bottom {
		out = append(out, "Bottom edge: not in compression under any combination")
	}
	return out
}

// rePositions finds a list of positions along a member in the words of
// the engine's bracing record ("bearings at 2.25, 146.25 in", "rows to add
// at 74.25 in", "... = true) at 60 in"), measured along the member as the
// check took it: from its Start, or from as far before it as its first
// bearing lies (checkShiftIn).
var rePositions = regexp.MustCompile(`(bearings at|drawn rows at|rows to add at|\) at) (-?[0-9.]+(?:, -?[0-9.]+)*) in\b`)

// checkShiftIn is how far before m's Start the check's positions are
// measured from: a member whose drawn end stops short of its first
// support is checked from that bearing's centre-line (pipeline
// checkInput), and members checked alike share one calculation whatever
// their drawn starts.
func checkShiftIn(m *Member) float64 {
	if len(m.BearingsAtIn) > 0 && m.BearingsAtIn[0] < 0 {
		return -m.BearingsAtIn[0]
	}
	return 0
}

// refaceText rewrites such lists from the datum of m (the face of its
// first bearing), in feet-inches, so the calculation gives positions as
// every other output does.
func refaceText(s string, m *Member) string {
	if s == "" || !strings.Contains(s, " at ") {
		return s
	}
	shift := checkShiftIn(m)
	return rePositions.ReplaceAllStringFunc(s, func(match string) string {
		g := rePositions.FindStringSubmatch(match)
		var vs []float64
		for _, p := range strings.Split(g[2], ", ") {
			v, err := strconv.ParseFloat(p, 64)
			if err != nil {
				return match
			}
			vs = append(vs, m.FromFace(v-shift))
		}
		parts := make([]string, len(vs))
		for i, v := range vs {
			parts[i] = FtIn(v)
		}
		return g[1] + " " + strings.Join(parts, ", ")
	})
}

func newTraceLine(t TraceItem) traceLine {
	l := traceLine{Name: t.Name, Formula: t.Formula, Subst: fmtx.GroupDigits(t.Subst), Value: fmtx.Value(t.Value, t.Unit), Unit: t.Unit, Source: t.Source}
	if t.Subst == "" && wordy(t.Formula) {
		l.Note, l.Formula = t.Formula, ""
	}
	return l
}

// wordy reports whether a formula is written in words ("largest moment
// compressing this edge") rather than symbols ("b d^2 / 6"): it holds a
// run of four or more letters that is not a function name.
func wordy(s string) bool {
	run := 0
	start := 0
	for i := 0; i <= len(s); i++ {
		if i < len(s) && (s[i] >= 'a' && s[i] <= 'z' || s[i] >= 'A' && s[i] <= 'Z') {
			if run == 0 {
				start = i
			}
			run++
			continue
		}
		if run >= 4 && s[start:i] != "sqrt" {
			return true
		}
		run = 0
	}
	return false
}

func sourceSuffix(src string) string {
	if src == "" {
		return ""
	}
	return ", " + src
}

// limitText prints a deflection limit as L/360, or "not checked" for 0.
func limitText(n float64) string {
	if !finite(n) || n <= 0 {
		return "not checked"
	}
	return "L/" + fmtNum(n)
}

// anchorSafe keeps letters, digits, '-' and '_' of a mark for an HTML id.
func anchorSafe(s string) string {
	return strings.Map(func(r rune) rune {
		if r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '-' || r == '_' {
			return r
		}
		return '_'
	}, s)
}

// fmtNum prints a number with about four significant figures: whole
// numbers from 1,000 up (with thousands separators), then at most 1, 2 or 3
// decimals, trailing zeros dropped; "n/a" for NaN or Inf.
func fmtNum(v float64) string {
	if !finite(v) {
		return "n/a"
	}
	a := math.Abs(v)
	prec := 3
	switch {
	case a >= 1000:
		prec = 0
	case a >= 100:
		prec = 1
	case a >= 10:
		prec = 2
	}
	s := strconv.FormatFloat(v, 'f', prec, 64)
	if prec > 0 {
		s = strings.TrimRight(s, "0")
		s = strings.TrimSuffix(s, ".")
	}
	if s == "-0" {
		s = "0"
	}
	if prec == 0 && a >= 1000 {
		neg := strings.HasPrefix(s, "-")
		digits := strings.TrimPrefix(s, "-")
		var b strings.Builder
		for i, d := range digits {
			if i > 0 && (len(digits)-i)%3 == 0 {
				b.WriteByte(',')
			}
			b.WriteRune(d)
		}
		s = b.String()
		if neg {
			s = "-" + s
		}
	}
	return s
}

// placeOf is where the outputs say member m is: its Location (plan
// coordinates in feet-inches, handle, file relative to the current
// folder), else its Source.
func placeOf(m *Member) string {
	if m.Location != "" {
		return m.Location
	}
	return m.Source
}
