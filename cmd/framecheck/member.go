package main

import (
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"framecheck/check"
	"framecheck/pipeline"
	"framecheck/project"
)

// memberArgs are the values of `framecheck member`'s flags.
type memberArgs struct {
	size, species, grade, use, ceiling, project string
	spans                                       spanFlag
	overhang, bearing, spacing                  lengthFlag
	loads                                       check.AreaLoads
	liveLimit, totalLimit                       float64
	bottomBraced, repetitive                    bool
	blocking                                    int
	points                                      pointFlag
	pitch                                       string
}

// runMember is `framecheck member`: one joist from flags, with its trace.
func runMember(args []string, stdout, stderr io.Writer) int {
	f := newFlags("member", "framecheck member --size 2x10 --span 14ft [flags]", `
Checks one joist described by flags and prints the calculation trace:
design values, adjustment factors, and for each check its governing load
combination, the formulas with the numbers put in, and the ratio.
Lengths carry their unit as the trade writes them: 14'-6", 14' 6", 14ft,
168in, 3 1/2", 4.2m, 350mm; a bare number is refused (14 in or 14 ft?).
Exit status 0 when the joist passes, 1 when it fails.`)
	var a memberArgs
	a.bearing.in, a.spacing.in = 3.5, 16
	f.StringVar(&a.size, "size", "", "nominal `size`, e.g. 2x10 (required)")
	f.StringVar(&a.species, "species", "Douglas Fir-Larch", "`species` group")
	f.StringVar(&a.grade, "grade", "No.2", "`grade`")
	f.Var(&a.spans, "span", "`span` centre to centre of bearings; repeat or give a comma list for a continuous joist (required)")
	f.Var(&a.overhang, "overhang", "cantilever `length` past the last bearing's centre-line (default none)")
	f.Var(&a.bearing, "bearing", "bearing `length` at each support")
	f.Var(&a.spacing, "spacing", "joist `spacing` on centre, taken as the tributary width")
	f.Float64Var(&a.loads.DeadPsf, "dead", 12, "dead load D, `psf`, self-weight included")
	f.Float64Var(&a.loads.LivePsf, "live", 0, "floor live load L, `psf` (default 40 for a floor, 0 for a roof)")
	f.Float64Var(&a.loads.RoofLivePsf, "roof-live", 0, "roof live load Lr, `psf` (default 0 for a floor, 20 for a roof)")
	f.Float64Var(&a.loads.SnowPsf, "snow", 0, "snow load S, `psf`")
	f.Float64Var(&a.loads.WindDownPsf, "wind-down", 0, "wind pressure toward the joist, strength level, `psf`")
	f.Float64Var(&a.loads.WindUpPsf, "wind-up", 0, "wind suction away from the joist (uplift), strength level, `psf`")
	f.StringVar(&a.use, "use", "floor", "member `use`: floor or roof")
	f.StringVar(&a.ceiling, "ceiling", "non-plaster", "`ceiling` below: plaster, non-plaster or none")
	f.Float64Var(&a.liveLimit, "live-limit", 0, "live deflection limit `n` of L/n; 0 = not checked (default from use and ceiling, IBC 2018 Table 1604.3)")
	f.Float64Var(&a.totalLimit, "total-limit", 0, "total deflection limit `n` of L/n; 0 = not checked (default from use and ceiling)")
	f.BoolVar(&a.bottomBraced, "bottom-braced", false, "a ceiling fastened to the joist braces its bottom edge")
	f.BoolVar(&a.repetitive, "repetitive", true, "repetitive member factor Cr applies (3 or more joists at 24 in or less, sheathed)")
	f.IntVar(&a.blocking, "blocking", 0, "blocking `rows` in each span (default: as many as the bottom edge needs)")
	f.Var(&a.points, "point", "point `load` POS,D=lb,L=lb,Lr=lb,S=lb,Wdown=lb,Wup=lb at POS from the first bearing, e.g. 7ft,D=400,L=300; repeatable")
	f.StringVar(&a.pitch, "pitch", "", "roof `slope`, rise in 12 (6, 6:12 or 26.57deg): a rafter on the horizontal projection; --dead is then per sloped area")
	f.StringVar(&a.project, "p", "", "project file `PROJECT.toml` whose [design] switches apply (default: the built-in defaults)")
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if len(pos) > 0 {
		return f.usageError(stderr, "unexpected argument %q", pos[0])
	}
	set := map[string]bool{}
	f.Visit(func(fl *flag.Flag) { set[fl.Name] = true })
	m, settings, msg := buildMember(&a, set)
	if msg != "" {
		return f.usageError(stderr, "%s", msg)
	}
	var r check.Result
	if set["blocking"] {
		r = check.CheckWithRows(m, settings, a.blocking)
	} else {
		r = check.CheckMember(m, settings)
	}
	printMember(stdout, m, r, useColour(stdout))
	if r.Status == check.StatusPass {
		return exitOK
	}
	return exitFail
}

// buildMember turns the flags into a check.Member and check.Settings, or a
// message saying which flag is wrong.
func buildMember(a *memberArgs, set map[string]bool) (check.Member, check.Settings, string) {
	var m check.Member
	switch {
	case a.size == "":
		return m, check.Settings{}, "--size is required"
	case len(a.spans.in) == 0:
		return m, check.Settings{}, "--span is required"
	case !project.Contains(project.UseValues, a.use):
		return m, check.Settings{}, fmt.Sprintf("--use %q: want floor or roof", a.use)
	case !project.Contains(project.CeilingValues, a.ceiling):
		return m, check.Settings{}, fmt.Sprintf("--ceiling %q: want plaster, non-plaster or none", a.ceiling)
	case a.bearing.in <= 0 || a.spacing.in <= 0:
		return m, check.Settings{}, "--bearing and --spacing must be greater than 0"
	case a.blocking < 0 || a.blocking > 50:
		return m, check.Settings{}, fmt.Sprintf("--blocking %d: want 0 to 50 rows per span", a.blocking)
	}
	for _, l := range []struct {
		name string
		v    float64
	}{{"dead", a.loads.DeadPsf}, {"live", a.loads.LivePsf}, {"roof-live", a.loads.RoofLivePsf},
		{"snow", a.loads.SnowPsf}, {"wind-down", a.loads.WindDownPsf}, {"wind-up", a.loads.WindUpPsf}} {
		if !(l.v >= 0) || math.IsInf(l.v, 1) {
			return m, check.Settings{}, fmt.Sprintf("--%s %s: want a load of 0 psf or more", l.name, project.FmtNum(l.v))
		}
	}
	for _, l := range []struct {
		name string
		v    float64
	}{{"live-limit", a.liveLimit}, {"total-limit", a.totalLimit}} {
		if set[l.name] && project.DeflectionLimit(l.v) != "" {
			return m, check.Settings{}, fmt.Sprintf("--%s %s: want 0 (not checked) or at least 1", l.name, project.FmtNum(l.v))
		}
	}
	if _, err := check.BuiltinMaterials().Lookup(a.species, a.grade, a.size); err != nil {
		return m, check.Settings{}, err.Error()
	}
	settings := check.DefaultSettings()
	if a.project != "" {
		p, err := project.LoadProject(a.project)
		if err == nil {
			settings, err = pipeline.Settings(p)
		}
		if err != nil {
			return m, check.Settings{}, err.Error()
		}
	}
	if !set["live"] && a.use == "floor" {
		a.loads.LivePsf = project.FloorLiveDefaultPsf
	}
	if !set["roof-live"] && a.use == "roof" {
		a.loads.RoofLivePsf = project.RoofLiveDefaultPsf
	}
	live, total := project.DeflectionLimits(a.use, a.ceiling)
	if set["live-limit"] {
		live = a.liveLimit
	}
	if set["total-limit"] {
		total = a.totalLimit
	}
	pitch := 0.0
	if a.pitch != "" {
		var msg string
		if pitch, msg = project.ParsePitch(a.pitch); msg != "" {
			return m, check.Settings{}, "--pitch: " + msg
		}
		if pitch > 0 && a.use != "roof" {
			return m, check.Settings{}, "--pitch is for a roof member: add --use roof"
		}
	}
	if pitch > 0 {
		// dead load per sloped area, on the plan (x 1/cos of the slope)
		a.loads.DeadPsf *= math.Hypot(12, pitch) / 12
	}
	lb := a.bearing.in
	at := lb / 2
	m = check.Member{
		ID: "M1", Size: a.size, Species: a.species, Grade: a.grade,
		SpacingIn: a.spacing.in, TribIn: a.spacing.in, Use: a.use, Loads: a.loads,
		LiveLimit: live, TotalLimit: total, BottomBracedContinuous: a.bottomBraced,
		Repetitive: a.repetitive, OverhangEndIn: a.overhang.in, PitchRise12: pitch,
	}
	for _, p := range a.points.loads {
		p.AtIn += at
		m.PointLoads = append(m.PointLoads, p)
	}
	m.Bearings = append(m.Bearings, check.Bearing{AtIn: at, LengthIn: lb})
	for _, s := range a.spans.in {
		at += s
		m.Bearings = append(m.Bearings, check.Bearing{AtIn: at, LengthIn: lb})
	}
	m.LengthIn = at + max(a.overhang.in, lb/2)
	for i, p := range m.PointLoads {
		if p.AtIn > m.LengthIn {
			return m, check.Settings{}, fmt.Sprintf("--point %d at %s from the first bearing lies past the member's end", i+1, fmtIn(p.AtIn-lb/2))
		}
	}
	return m, settings, ""
}

// valList prints positions as "72, 144".
func valList(xs []float64) string {
	at := make([]string, len(xs))
	for i, x := range xs {
		at[i] = fmtVal(x)
	}
	return strings.Join(at, ", ")
}

// printMember writes the member, its design values and factors, each
// check with its trace, the blocking rows and the verdict.
func printMember(w io.Writer, m check.Member, r check.Result, colour bool) {
	spans := make([]string, len(r.SpansIn))
	for i, s := range r.SpansIn {
		spans[i] = fmtIn(s)
	}
	fmt.Fprintf(w, "%s %s %s, %s joist at %s in o.c.\n", r.Size, termText(r.Species), termText(r.Grade), m.Use, project.FmtNum(m.SpacingIn))
	fmt.Fprintf(w, "  spans %s", strings.Join(spans, ", "))
	if r.OverhangsIn[0] > 0 || r.OverhangsIn[1] > 0 {
		fmt.Fprintf(w, "; overhangs %s, %s", fmtIn(r.OverhangsIn[0]), fmtIn(r.OverhangsIn[1]))
	}
	fmt.Fprintf(w, "; bearings %s long; member %s\n", fmtIn(m.Bearings[0].LengthIn), fmtIn(m.LengthIn))
	l := m.Loads
	// loads to 0.01 psf: a rafter's dead load converted from the slope is
	// 15.811388300841898 psf to the bit
	psf := func(v float64) string { return project.FmtNum(math.Round(v*100) / 100) }
	fmt.Fprintf(w, "  loads D %s, L %s, Lr %s, S %s, W down %s, W up %s psf\n", psf(l.DeadPsf), psf(l.LivePsf),
		psf(l.RoofLivePsf), psf(l.SnowPsf), psf(l.WindDownPsf), psf(l.WindUpPsf))
	for _, p := range m.PointLoads {
		fmt.Fprintf(w, "  point load at %s from the first bearing: D %s, L %s, Lr %s, S %s, W down %s, W up %s lb\n",
			fmtIn(p.AtIn-m.Bearings[0].AtIn), project.FmtNum(p.DeadLb), project.FmtNum(p.LiveLb), project.FmtNum(p.RoofLiveLb), project.FmtNum(p.SnowLb),
			project.FmtNum(p.WindDownLb), project.FmtNum(p.WindUpLb))
	}
	if m.PitchRise12 > 0 {
		fmt.Fprintf(w, "  rafter at %s in 12, drawn in plan: spans and loads on the horizontal projection (D converted from the slope)\n", project.FmtNum(m.PitchRise12))
	}
	fmt.Fprintf(w, "  deflection limits: live %s, total %s\n", limitText(m.LiveLimit), limitText(m.TotalLimit))
	if m.BottomBracedContinuous {
		fmt.Fprintln(w, "  bottom edge braced by the ceiling")
	}
	if v := r.Values; v != nil && v.Source != "" {
		fmt.Fprintf(w, "\nreference design values (%s):\n", termText(v.Source))
		fmt.Fprintf(w, "  Fb %s  Ft %s  Fv %s  Fc_perp %s  Fc %s  E %s  Emin %s psi\n", fmtVal(v.FbPsi), fmtVal(v.FtPsi),
			fmtVal(v.FvPsi), fmtVal(v.FcPerpPsi), fmtVal(v.FcPsi), fmtVal(v.EPsi), fmtVal(v.EminPsi))
		if v.Note != "" {
			fmt.Fprintf(w, "  %s\n", termText(v.Note))
		}
	}
	if len(r.Factors) > 0 {
		fmt.Fprintln(w, "\nadjustment factors:")
		printTrace(w, r.Factors)
	}
	for _, c := range r.Checks {
		verdict := paint(colour, colourGreen, "ok")
		if c.Ratio > 1 {
			verdict = paint(colour, colourRed, "FAILS")
		}
		fmt.Fprintf(w, "\n%s under %s: %s %s against %s %s, ratio %.3f %s\n", c.Kind, c.Combo,
			fmtVal(c.Actual), c.Unit, fmtVal(c.Allowable), c.Unit, c.Ratio, verdict)
		printTrace(w, c.Trace())
	}
	if len(r.BlockingSteps) > 0 {
		fmt.Fprintln(w, "\nblocking rows for the bottom edge:")
		for _, s := range r.BlockingSteps {
			if s.AtIn != nil {
				fmt.Fprintf(w, "  %d added (at %s in): lu %s in, CL %.3f, ratio %.3f\n", len(s.AtIn), valList(s.AtIn), fmtVal(s.LuIn), s.CL, s.Ratio)
				continue
			}
			fmt.Fprintf(w, "  %d per span: lu %s in, CL %.3f, ratio %.3f\n", s.RowsPerSpan, fmtVal(s.LuIn), s.CL, s.Ratio)
		}
	}
	if len(r.DrawnBlockingAtIn) > 0 {
		fmt.Fprintf(w, "\nblocking drawn (existing): at %s in from the start\n", valList(r.DrawnBlockingAtIn))
	}
	if len(r.BlockingAtIn) > 0 {
		if len(r.DrawnBlockingAtIn) == 0 {
			fmt.Fprintf(w, "\nblocking: %d row(s) per span, at %s in from the start\n", r.RowsPerSpan(), valList(r.BlockingAtIn))
		} else {
			fmt.Fprintf(w, "blocking to add: %d row(s), at %s in from the start\n", len(r.BlockingAtIn), valList(r.BlockingAtIn))
		}
	}
	if len(r.Reactions) > 0 {
		fmt.Fprintln(w, "\nreactions at the bearings (ASD, connector demand):")
		for _, re := range r.Reactions {
			fmt.Fprintf(w, "  bearing %d at %s in: down %s lb", re.Bearing+1, fmtVal(re.AtIn), fmtVal(re.DownLb))
			if re.DownCombo != "" {
				fmt.Fprintf(w, " (%s)", re.DownCombo)
			}
			if re.UpLb > 0 {
				fmt.Fprintf(w, "; net uplift %s lb (%s, CD = %s)", fmtVal(re.UpLb), re.UpCombo, project.FmtNum(re.UpCD))
			}
			fmt.Fprintln(w)
		}
	}
	if len(r.Info) > 0 {
		fmt.Fprintln(w, "\nnotes:")
		for _, s := range r.Info {
			fmt.Fprintf(w, "  %s\n", s)
		}
	}
	fmt.Fprintln(w)
	for _, s := range r.Messages {
		fmt.Fprintf(w, "%s\n", s)
	}
	status := strings.ToUpper(r.Status)
	if r.Status == check.StatusPass {
		status = paint(colour, colourGreen, status)
	} else {
		status = paint(colour, colourRed, status)
	}
	if r.Governing != "" {
		fmt.Fprintf(w, "%s: governing %s, ratio %.3f", status, r.Governing, r.MaxRatio)
	} else {
		fmt.Fprint(w, status)
	}
	if r.RB > 0 {
		fmt.Fprintf(w, "; largest RB %.2f (NDS 2018 3.3.3.7 limit 50)", r.RB)
	}
	fmt.Fprintln(w)
}

// printTrace writes trace items with symbols and values aligned:
// "  le = 113 in  1.63 lu + 3 d = 1.63(56.0) + 3(7.25)  [NDS 2018 Table 3.3.3]".
func printTrace(w io.Writer, items []check.TraceItem) {
	rows := make([][]string, 0, len(items))
	for _, t := range items {
		value := strings.TrimSpace(fmtVal(t.Value) + " " + t.Unit)
		how := t.Formula
		if s := t.Subst.Text(); s != "" && s != t.Formula {
			how = strings.TrimSpace(how + " = " + s)
			how = strings.TrimPrefix(how, "= ")
		}
		if t.Ref != "" {
			how = strings.TrimSpace(how + "  [" + t.Ref + "]")
		}
		rows = append(rows, []string{"  " + t.Symbol, "=", value, how})
	}
	writeTable(w, rows, []bool{false, false, true})
}

// fmtVal formats a computed value for the trace: whole numbers from 10000
// up, one decimal from 100, three below, trailing zeros dropped.
func fmtVal(x float64) string {
	var s string
	switch a := math.Abs(x); {
	case a >= 10000:
		s = strconv.FormatFloat(x, 'f', 0, 64)
	case a >= 100:
		s = strconv.FormatFloat(x, 'f', 1, 64)
	case a >= 0.01 || a == 0:
		s = strconv.FormatFloat(x, 'f', 3, 64)
	default:
		s = strconv.FormatFloat(x, 'g', 3, 64)
	}
	if strings.Contains(s, ".") && !strings.ContainsAny(s, "e") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	if s == "-0" {
		s = "0"
	}
	return s
}

func limitText(n float64) string {
	if n == 0 {
		return "not checked"
	}
	return "L/" + project.FmtNum(n)
}
