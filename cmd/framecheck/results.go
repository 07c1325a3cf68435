package main

import (
	"fmt"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"sync"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/framing"
	"framecheck/internal/par"
	"framecheck/pipeline"
	"framecheck/project"
)

// exportResults maps an outcome onto export's results.json contract. With
// release, the members' results and the grouped members are dropped from
// o as soon as they are mapped (o.Results and o.Plan.Members nil on
// return), for a caller that reads neither afterwards: at a million
// joists the three at once were most of the run's peak (issue 18).
func exportResults(o *outcome, planName string, release bool) *export.Results {
	d, plan := o.drawing, o.Plan
	toInch := d.ToInch
	if toInch <= 0 {
		toInch = 1
	}
	units := d.Units
	if units == "" {
		units = "in" // read as inches, with a DXF issue saying so
	}
	r := &export.Results{Schema: export.Schema, Plan: filepath.Base(planName), DrawingUnits: units, Datum: export.DatumText,
		ToolVersion: toolVersion(), Project: exportInfo(o.Project.Info)}
	// The uplift list, the load path and the notes read the outcome only,
	// never what is built here: each is made beside the members' mapping
	// (a serial stretch each, while the cores had room). The members'
	// mapping reads the plan and the members' results only, which the load
	// path, when still being followed (outcome.startPath), reads too.
	var side, uplift sync.WaitGroup
	uplift.Go(func() { r.Uplift = exportUplift(plan, o.Results, o.Project.Design.UpliftReportLb, toInch) })
	side.Go(func() {
		o.waitPath() // when being followed meanwhile (startPath)
		r.LoadPath = exportLoadPath(o, toInch)
	})
	side.Go(func() {
		o.waitPath() // the notes read the findings, the load path's among them
		r.Assumptions = assumptions(o)
	})
	ids := make([]string, len(plan.Members))
	for k := range plan.Members {
		ids[k] = plan.Members[k].ID
	}
	// Members convert on every core, through one converter (identical
	// members share its slices); each range writes only its own members.
	// The results are mapped first and the grouped members second, so
	// that with release each goes as soon as it is mapped (below).
	r.Members = make([]export.Member, len(plan.Members))
	conv := newResultConverter()
	par.Ranges(len(plan.Members), func(lo, hi int) {
		for k := lo; k < hi; k++ {
			conv.fromResult(&r.Members[k], &o.Results[k])
		}
	})
	for k := range o.Results {
		switch o.Results[k].Status {
		case check.StatusPass:
			r.Summary.Pass++
		case check.StatusFail:
			r.Summary.Fail++
		default:
			r.Summary.Error++
		}
	}
	if release {
		// The uplift list and the notes read the results; nothing after
		// them does, and they go before the grouped members are mapped (a
		// million joists: 440 MB).
		uplift.Wait()
		side.Wait()
		o.Results = nil
	}
	par.Ranges(len(plan.Members), func(lo, hi int) {
		var rel relMemo
		for k := lo; k < hi; k++ {
			em := &r.Members[k]
			fromFraming(em, &plan.Members[k], toInch)
			placeMember(em, &plan.Members[k], &rel)
			for _, p := range o.PointLoads[k] { // a map read on every core: never written meanwhile
				ud := p.DeadLb
				if p.HasUpliftDead {
					ud = p.UpliftDeadLb
				}
				em.PointLoads = append(em.PointLoads, export.PointLoad{Name: p.Name, AtIn: p.AtIn, FromFaceIn: em.FromFace(p.AtIn),
					DeadLb: p.DeadLb, LiveLb: p.LiveLb, RoofLiveLb: p.RoofLiveLb, SnowLb: p.SnowLb,
					WindDownLb: p.WindDownLb, WindUpLb: p.WindUpLb, UpliftDeadLb: ud})
			}
			if len(em.Messages) > 0 {
				msgs := make([]string, len(em.Messages))
				for i, msg := range em.Messages {
					msgs[i] = planPointsFtIn(msg, toInch)
				}
				em.Messages = msgs
			}
			if ri := plan.Members[k].Run; ri >= 0 && ri < len(plan.Runs) {
				em.Run = plan.Runs[ri].ID
			}
		}
	})
	r.Summary.Members = len(plan.Members)
	r.Marks = exportMarks(r.Members)
	runs := pipeline.RunIndexes(plan)
	for _, row := range o.Rows {
		r.BlockingRows = append(r.BlockingRows, exportRow(plan, runs, row, ids, toInch))
	}
	r.Takeoff = exportTakeoff(o.Takeoff)
	if release {
		uplift.Wait()
		side.Wait()
		o.Plan.Members = nil
	}
	// the members' and uplift's numbers looked at for the outputs'
	// sanitizing now, while the load path may still be followed
	uplift.Wait()
	o.finite = export.NoteFinite(r)
	side.Wait()
	return r
}

// exportUplift lists every bearing that a net uplift reaction pulls off its
// support under some combination, in member order then along each member,
// with the support line it bears on (check's bearings are framing's, in the
// same order), and flags those from reportLb up.
func exportUplift(plan *framing.Plan, results []check.Result, reportLb, toInch float64) export.UpliftReport {
	u := export.UpliftReport{ReportLb: reportLb}
	n := 0
	for k := range results {
		for _, re := range results[k].Reactions {
			if re.UpLb > 0 {
				n++
			}
		}
	}
	if n == 0 {
		return u
	}
	u.Bearings = make([]export.UpliftBearing, 0, n)
	// A plan has far fewer support lines than bearings: name each once.
	names := map[dxfimport.Pos]string{}
	for k := range plan.Members {
		m := &plan.Members[k]
		if k >= len(results) {
			break
		}
		for _, re := range results[k].Reactions {
			if re.UpLb <= 0 || re.Bearing >= len(m.Bearings) {
				continue
			}
			b := &m.Bearings[re.Bearing]
			p := m.Start
			if m.LengthIn > 0 {
				t := re.AtIn / m.LengthIn
				p = framing.Point{X: m.Start.X + t*(m.End.X-m.Start.X), Y: m.Start.Y + t*(m.End.Y-m.Start.Y)}
			}
			name, ok := names[b.Pos]
			if !ok {
				name = supportName(b.Pos)
				names[b.Pos] = name
			}
			u.Bearings = append(u.Bearings, export.UpliftBearing{
				Member: m.ID, Mark: m.Mark, Bearing: re.Bearing + 1,
				Support: name, SupportLayer: b.Pos.Layer, SupportHandle: b.Pos.Handle, SupportKind: b.Kind,
				AtIn: re.AtIn, FromFaceIn: re.AtIn - datumIn(m), Point: [2]float64{p.X / toInch, p.Y / toInch}, PointIn: [2]float64{p.X, p.Y},
				UpliftLb: re.UpLb, Combo: re.UpCombo, CD: re.UpCD, Flagged: re.UpLb >= reportLb,
			})
		}
	}
	return u
}

// supportName names a support line by its layer and handle ("WALL-EXT
// handle 2F1"), or its layer and DXF line when it has no handle; "" when
// nothing is known of it.
func supportName(p dxfimport.Pos) string {
	switch {
	case p.Handle != "":
		return strings.TrimSpace(p.Layer + " handle " + p.Handle)
	case p.Line > 0:
		return strings.TrimSpace(p.Layer + " line " + strconv.Itoa(p.Line))
	}
	return p.Layer
}

// resultConverter maps check results onto export's types. Members identical
// for design share one check.Result (its slices included), so their checks,
// factors and solver steps are converted once and shared too: results.json
// numbers its calculations by the slices members share. One converter
// serves every goroutine of exportResults.
type resultConverter struct {
	checks  sharedMemo[*check.CheckResult, []export.Check]
	factors sharedMemo[*check.TraceItem, []export.TraceItem]
	steps   sharedMemo[*check.BlockingStep, []export.BlockingStep]
}

func newResultConverter() *resultConverter {
	return &resultConverter{checks: newSharedMemo[*check.CheckResult, []export.Check](),
		factors: newSharedMemo[*check.TraceItem, []export.TraceItem](), steps: newSharedMemo[*check.BlockingStep, []export.BlockingStep]()}
}

// sharedMemo remembers one value per key for several goroutines: the
// first value stored for a key is the one every caller gets, so values
// are shared whichever goroutine made them.
type sharedMemo[K comparable, V any] struct {
	mu *sync.Mutex
	m  map[K]V
}

func newSharedMemo[K comparable, V any]() sharedMemo[K, V] {
	return sharedMemo[K, V]{mu: &sync.Mutex{}, m: map[K]V{}}
}

// get returns the value kept for k, making it with mk (outside the lock)
// when there is none yet.
func (s sharedMemo[K, V]) get(k K, mk func() V) V {
	s.mu.Lock()
	v, ok := s.m[k]
	s.mu.Unlock()
	if ok {
		return v
	}
	v = mk()
	s.mu.Lock()
	if old, ok := s.m[k]; ok {
		v = old
	} else {
		s.m[k] = v
	}
	s.mu.Unlock()
	return v
}

// fromResult fills em with what a member's result gives: its size as
// checked, checks, blocking and status, its result's messages.
func (cv *resultConverter) fromResult(em *export.Member, res *check.Result) {
	*em = export.Member{
		Size: res.Size, Species: res.Species, Grade: res.Grade,
		Governing:           res.Governing,
		MaxRatio:            res.MaxRatio,
		BlockingRowsPerSpan: res.BlockingRowsPerSpan,
		BlockingAtIn:        res.BlockingAtIn,
		DrawnBlockingAtIn:   res.DrawnBlockingAtIn,
		Status:              res.Status,
		Messages:            res.Messages,
	}
	if len(res.Checks) > 0 {
		em.Checks = cv.checks.get(&res.Checks[0], func() []export.Check {
			var cs []export.Check
			for _, c := range res.Checks {
				cs = append(cs, export.Check{Kind: c.Kind, Combo: c.Combo, Actual: c.Actual,
					Allowable: c.Allowable, Unit: c.Unit, Ratio: c.Ratio, Trace: exportTrace(c.Trace())})
			}
			return cs
		})
	}
	if len(res.BlockingSteps) > 0 {
		em.BlockingSteps = cv.steps.get(&res.BlockingSteps[0], func() []export.BlockingStep {
			var ss []export.BlockingStep
			for _, s := range res.BlockingSteps {
				ss = append(ss, export.BlockingStep{RowsPerSpan: s.RowsPerSpan, AtIn: s.AtIn, LuIn: s.LuIn, CL: s.CL, Ratio: s.Ratio})
			}
			return ss
		})
	}
	if len(res.Factors) > 0 {
		em.Factors = cv.factors.get(&res.Factors[0], func() []export.TraceItem { return exportTrace(res.Factors) })
	}
	em.Info = res.Info
}

// fromFraming adds to em (filled by fromResult) what the grouped member m
// gives: its names, place, spans, tributary width and zones, the size it
// is drawn with when its result names none, and its findings ahead of its
// result's messages (each once).
func fromFraming(em *export.Member, m *framing.Member, toInch float64) {
	em.ID, em.Mark, em.Layer, em.Handle, em.Source, em.Generated = m.ID, m.Mark, m.Layer, m.Pos.Handle, m.Pos.String(), m.Generated
	em.Start = [2]float64{m.Start.X / toInch, m.Start.Y / toInch}
	em.End = [2]float64{m.End.X / toInch, m.End.Y / toInch}
	em.StartIn, em.EndIn = [2]float64{m.Start.X, m.Start.Y}, [2]float64{m.End.X, m.End.Y}
	em.LengthIn = m.LengthIn
	em.SpansIn = m.Spans()
	em.OverhangsIn = [2]float64{m.OverhangStartIn, m.OverhangEndIn}
	em.TribIn, em.SpacingIn = m.TribIn, m.SpacingIn
	em.Zone = strings.Join(m.Zones, "+")
	if em.Size == "" {
		em.Size, em.Species, em.Grade = m.Size, m.Species, m.Grade
	}
	for _, b := range m.Bearings {
		em.BearingsAtIn = append(em.BearingsAtIn, b.AtIn)
	}
	for _, z := range m.ZonePieces {
		em.ZonePieces = append(em.ZonePieces, export.ZonePiece{Zone: z.Zone, FromIn: z.FromIn, ToIn: z.ToIn})
	}
	resMsgs := em.Messages
	em.Messages = nil
	seen := map[string]bool{}
	for _, group := range [][]string{m.Messages, resMsgs} {
		for _, msg := range group {
			if !seen[msg] {
				seen[msg] = true
				em.Messages = append(em.Messages, msg)
			}
		}
	}
}

func exportTrace(t []check.TraceItem) []export.TraceItem {
	var out []export.TraceItem
	for _, it := range t {
		out = append(out, export.TraceItem{Name: it.Symbol, Value: it.Value, Unit: it.Unit,
			Source: it.Ref, Formula: it.Formula, Subst: it.Subst.Text()})
	}
	return out
}

// exportMarks builds the framing schedule: one line per mark, in mark
// order (J1, J2, ... J10), with its member count and worst ratio.
func exportMarks(members []export.Member) []export.Mark {
	byMark := map[string]*export.Mark{}
	var names []string
	for i := range members {
		m := &members[i]
		if m.Mark == "" {
			continue
		}
		mk := byMark[m.Mark]
		if mk == nil {
			mk = &export.Mark{Mark: m.Mark, Size: m.Size, Species: m.Species, Grade: m.Grade,
				Zone: m.Zone, SpacingIn: m.SpacingIn, SpansIn: m.SpansIn, OverhangsIn: m.OverhangsIn,
				BlockingRowsPerSpan: m.BlockingRowsPerSpan, Status: m.Status}
			byMark[m.Mark] = mk
			names = append(names, m.Mark)
		}
		mk.Count++
		if m.MaxRatio > mk.MaxRatio {
			mk.MaxRatio = m.MaxRatio
		}
		if statusRank(m.Status) > statusRank(mk.Status) {
			mk.Status = m.Status
		}
	}
	sort.Slice(names, func(i, j int) bool { return markLess(names[i], names[j]) })
	out := make([]export.Mark, 0, len(names))
	for _, n := range names {
		out = append(out, *byMark[n])
	}
	return out
}

func statusRank(s string) int {
	switch s {
	case check.StatusPass:
		return 0
	case check.StatusFail:
		return 1
	}
	return 2
}

// markLess orders J2 before J10.
func markLess(a, b string) bool {
	if len(a) != len(b) {
		return len(a) < len(b)
	}
	return a < b
}

func exportRow(plan *framing.Plan, runs map[string]int, row framing.BlockingRow, ids []string, toInch float64) export.BlockingRow {
	er := export.BlockingRow{ID: row.ID, Run: row.Run, Pieces: row.Pieces, ClearIn: row.ClearIn, Size: row.Size,
		Start:   [2]float64{row.From.X / toInch, row.From.Y / toInch},
		End:     [2]float64{row.To.X / toInch, row.To.Y / toInch},
		StartIn: [2]float64{row.From.X, row.From.Y}, EndIn: [2]float64{row.To.X, row.To.Y},
		PositionIn: row.AtIn,
	}
	run := plan.Runs[runs[row.Run]]
	for _, k := range run.Members {
		er.Members = append(er.Members, ids[k])
	}
	// Which span of the run's first member the row falls in, and where
	// along that span from its first bearing.
	first := &plan.Members[run.Members[0]]
	er.FromFaceIn = row.AtIn - datumIn(first)
	for i := 1; i < len(first.Bearings); i++ {
		if row.AtIn <= first.Bearings[i].AtIn || i == len(first.Bearings)-1 {
			er.SpanIndex = i - 1
			er.PositionIn = row.AtIn - first.Bearings[i-1].AtIn
			break
		}
	}
	return er
}

func exportTakeoff(t framing.Takeoff) export.Takeoff {
	var e export.Takeoff
	for _, l := range t.Joists {
		tl := export.TakeoffLine{Size: l.Size + " " + l.Species + " " + l.Grade, OrderLengthFt: float64(l.OrderLengthFt),
			Count: l.Count, BoardFeet: l.BoardFeet}
		if l.SpecialOrder {
			tl.Note = "special order or spliced length (over 24 ft)"
		}
		e.Joists = append(e.Joists, tl)
	}
	for _, l := range t.Blocking {
		e.Blocking = append(e.Blocking, export.TakeoffLine{Size: l.Size, Count: l.Pieces, BoardFeet: l.BoardFeet,
			Note: fmt.Sprintf("full-depth blocking, %s of clear length in all", export.FtIn(l.TotalLengthIn))})
	}
	for _, l := range t.Hangers {
		e.Hangers = append(e.Hangers, export.TakeoffLine{Size: l.Size, Count: l.Count, Note: "face-mount joist hanger at a flush beam"})
	}
	e.Totals = export.TakeoffTotals{JoistCount: t.JoistCount, JoistBoardFeet: t.JoistBoardFeet,
		BlockingPieces: t.BlockingPieces, BlockingBoardFeet: t.BlockingBoardFeet,
		Hangers: t.HangerCount, BoardFeet: t.TotalBoardFeet}
	return e
}

// assumptions lists the code editions, combinations, switches, zones and
// design values of the run, for the Inputs and Notes sheets.
func assumptions(o *outcome) export.Assumptions {
	p := o.Project
	a := export.Assumptions{
		CodeEditions: []string{
			"ANSI/AWC NDS 2018, allowable stress design (ASD), with the NDS 2018 Supplement design values",
			"ASCE 7-16 section 2.4.1 ASD load combinations",
			"IBC 2018 Table 1604.3 deflection limits",
		},
	}
	for _, c := range o.Settings.Combos {
		a.Combinations = append(a.Combinations, c.Name)
	}
	if len(a.Combinations) == 0 {
		for _, c := range check.DefaultCombos() {
			a.Combinations = append(a.Combinations, c.Name)
		}
	}
	src := func(key string) string {
		if p.Given(key) {
			return "project file"
		}
		return "default"
	}
	set := func(key, value, unit string) {
		a.Switches = append(a.Switches, export.Setting{Name: key, Value: value, Unit: unit, Source: src(key)})
	}
	// the drawing's units come from --units, the project file, the
	// drawing's own $INSUNITS, or inches assumed, in that order
	unitsFrom := src("drawing.units")
	switch {
	case o.unitsFlag != "":
		unitsFrom = "command line (--units)"
	case p.Given("drawing.units"):
	case o.drawing.UnitsFromHeader():
		unitsFrom = "drawing ($INSUNITS)"
	}
	a.Switches = append(a.Switches, export.Setting{Name: "drawing.units", Value: o.drawing.Units, Source: unitsFrom})
	set("drawing.snap_tolerance_in", fmt.Sprint(p.Drawing.SnapToleranceIn), "in")
	set("drawing.max_wall_thickness_in", fmt.Sprint(p.Drawing.MaxWallThicknessIn), "in")
	set("drawing.edge_distance_in", fmt.Sprint(p.Drawing.EdgeDistanceIn), "in")
	set("lumber.species", p.Lumber.Species, "")
	set("lumber.grade", p.Lumber.Grade, "")
	set("lumber.size", p.Lumber.Size, "")
	set("design.top_edge_braced", fmt.Sprint(p.Design.TopEdgeBraced), "")
	set("design.shear_at_d", fmt.Sprint(p.Design.ShearAtD), "")
	set("design.wet_service", fmt.Sprint(p.Design.WetService), "")
	set("design.temperature", p.Design.Temperature, "")
	set("design.incised", fmt.Sprint(p.Design.Incised), "")
	set("design.kcr", fmt.Sprint(p.Design.Kcr), "")
	set("design.combinations", p.Design.Combinations.String(), "")
	set("design.pattern_live_loads", fmt.Sprint(p.Design.PatternLiveLoads), "")
	set("design.seasoned", fmt.Sprint(p.Design.Seasoned), "")
	set("design.uplift_report_lb", fmt.Sprint(p.Design.UpliftReportLb), "lb")
	set("design.brace_at_inflection", fmt.Sprint(p.Design.BraceAtInflection), "")
	set("loads.default_zone", p.Loads.DefaultZone, "")
	for _, z := range p.Zones {
		a.Zones = append(a.Zones, export.Zone{Name: z.Name, Use: z.Use, DeadPsf: z.DeadPsf, LivePsf: z.LivePsf,
			RoofLivePsf: z.RoofLivePsf, SnowPsf: z.SnowPsf, WindDownPsf: z.WindDownPsf, WindUpPsf: z.WindUpPsf,
			Ceiling: z.Ceiling, LiveDeflectionLimit: z.LiveDeflectionLimit, TotalDeflectionLimit: z.TotalDeflectionLimit,
			LongTermDeflectionLimit: z.LongTermDeflectionLimit, PitchRise12: z.PitchRise12, DeadOnSlope: z.DeadOnSlope && z.PitchRise12 > 0})
		if z.HasUpliftDead {
			v := z.UpliftDeadPsf
			a.Zones[len(a.Zones)-1].UpliftDeadPsf = &v
		}
	}
	type dvKey struct{ species, grade, size string }
	seen := map[dvKey]bool{}
	var last dvKey
	addValues := func(v *check.DesignValues, size string) {
		if v == nil || v.Species == "" {
			return
		}
		key := dvKey{v.Species, v.Grade, size}
		if key == last || seen[key] {
			return // members alike follow one another
		}
		seen[key], last = true, key
		vals := []struct {
			name string
			val  float64
		}{{"Fb", v.FbPsi}, {"Ft", v.FtPsi}, {"Fv", v.FvPsi}, {"Fc_perp", v.FcPerpPsi}, {"Fc", v.FcPsi}, {"E", v.EPsi}, {"Emin", v.EminPsi}}
		if v.FbNegPsi > 0 && v.FbNegPsi != v.FbPsi {
			vals = append(vals[:1], append([]struct {
				name string
				val  float64
			}{{"Fb-", v.FbNegPsi}}, vals[1:]...)...) // glulam: Fbx- beside Fbx+
		}
		for _, dv := range vals {
			if dv.val == 0 {
				continue // not given for this material (glulam's Ft and Fc): never a 0 that reads as a value
			}
			a.DesignValues = append(a.DesignValues, export.DesignValue{Species: v.Species, Grade: v.Grade, Size: size,
				Name: dv.name, Value: dv.val, Unit: "psi", Source: v.Source})
		}
	}
	for k := range o.Results {
		addValues(o.Results[k].Values, o.Results[k].Size)
	}
	// the load path's beams and posts: their values are used too
	if o.Path != nil {
		for i := range o.Path.Beams {
			addValues(o.Path.Beams[i].Res.Values, o.Path.Beams[i].Res.Size)
		}
		for i := range o.Path.Posts {
			if pt := &o.Path.Posts[i]; pt.Checked {
				addValues(&pt.Out.Result.DesignVals, pt.Size)
			}
		}
	}
	sort.SliceStable(a.DesignValues, func(i, j int) bool {
		x, y := a.DesignValues[i], a.DesignValues[j]
		if x.Species+x.Grade != y.Species+y.Grade {
			return x.Species+x.Grade < y.Species+y.Grade
		}
		return x.Size < y.Size
	})
	a.Notes = append(a.Notes,
		"Members are joists loaded by their load zones on their tributary width and by the point loads marked on them (point_loads); spans are centre-to-centre of bearings. "+
			"A joist's tributary width is half the gap to its neighbouring joist on each side; on an edge joist's outer side, half the gap to a parallel wall or beam within 48 in (FRM221), "+
			"else the strip to its load zone's edge, up to 48 in (FRM222, a warning), else drawing.edge_distance_in, whichever the drawing shows is more.",
		"Members crossing load-zone edges are loaded zone by zone where each zone acts (each load combination with each zone's own loads); they take the stricter deflection limits of their zones.",
	)
	a.Notes = append(a.Notes, fmt.Sprintf("Net uplift at a bearing is the joist's ASD reaction under the combination that gives the most "+
		"(ASCE 7-16 2.4.1; 0.6D+0.6W with wind suction), by statics of the member as analysed. Every such bearing is listed "+
		"(results.json \"uplift\", Uplift sheet); from design.uplift_report_lb = %s lb up it is flagged (layer %s) as the load "+
		"a connector's allowable load for that load duration (CD = 1.6 for wind, NDS 2018 Table 2.3.2) must meet. "+
		"No connector is named: the designer picks the part.", project.FmtNum(p.Design.UpliftReportLb), export.LayerUplift))
	a.Notes = append(a.Notes, bracingNotes(p)...)
	if n := generatedCount(o.Plan); n > 0 {
		a.Notes = append(a.Notes, fmt.Sprintf("%d joists are not drawn but laid out in bays shown by a span symbol "+
			"and a size callout (marked generated; layer %s): parallel to the span line, from support to support, "+
			"the first at the bay's left edge (its bottom edge for joists running left to right), one every callout "+
			"spacing, a last one on the far edge.", n, export.LayerGenerated))
	}
	if p.Design.AddSelfWeight {
		a.Notes = append(a.Notes, "Joist self-weight is added to D at 35 lb/ft3 (NDS 2018 Supplement Table 1B basis).")
	}
	if o.Path != nil && (len(o.Path.Beams) > 0 || len(o.Path.Posts) > 0) {
		a.Notes = append(a.Notes, "Load path: a beam carries the reactions of the joists and beams on it by load type, "+
			"the strips beside edge joists that run along it (FRM223) and its own weight at 35 lb/ft3 (from memory: verify "+
			"against NDS 2018 Supplement Table 1B); it is checked with the floor limits L/360 live and L/240 total, or L/240 "+
			"and L/180 when it carries only roof joists (IBC 2018 Table 1604.3), its top edge braced where joists frame in. "+
			"A beam ending in line with a wall (a header over an opening) bears on one jack stud, 1.5 in, at each end. "+
			"A point load's dead load is not relied on against uplift. A post's own weight (35 lb/ft3) is added to the dead load it "+
			"takes down to the foundation. Loads reaching supports the load path does not follow are one foundation line, \"rigid supports\".")
	}
	for _, used := range p.DefaultsUsed() {
		a.Notes = append(a.Notes, "Default used: "+used)
	}
	a.Notes = append(a.Notes, drawingFindings(o)...)
	return a
}

// generatedCount is the number of members framing laid out in bays.
func generatedCount(pl *framing.Plan) int {
	n := 0
	for i := range pl.Members {
		if pl.Members[i].Generated {
			n++
		}
	}
	return n
}

// bracingNotes states once, for the whole run, the lateral bracing the
// bending checks rely on (issue 13 item 6; DOMAIN.md "Bracing relied
// on"); each mark's calculation lists the braces of its own member.
func bracingNotes(p *project.Project) []string {
	notes := []string{"Bracing, bearings: every bearing, interior bearings included, is taken as a brace of both edges of the joist (CL, NDS 2018 3.3.3); this assumes full-depth blocking, a rim board or joist hangers at each bearing."}
	if p.Design.TopEdgeBraced {
		notes = append(notes, "Bracing, top edge: held continuously by the sheathing fastened to it (design.top_edge_braced = true), so CL = 1 for the top edge.")
	} else {
		notes = append(notes, "Bracing, top edge: not held by the sheathing (design.top_edge_braced = false); braced only at bearings and blocking rows.")
	}
	var ceiling []string
	for _, z := range p.Zones {
		if z.CeilingBracesBottom {
			ceiling = append(ceiling, z.Name)
		}
	}
	if len(ceiling) > 0 {
		notes = append(notes, fmt.Sprintf("Bracing, bottom edge: held continuously by a ceiling fastened directly to the joists in zone(s) %s (ceiling_braces_bottom = true); elsewhere braced only at bearings, blocking rows and, where enabled, inflection points.", strings.Join(ceiling, ", ")))
	} else {
		notes = append(notes, "Bracing, bottom edge: no zone has a ceiling fastened directly to the joists (ceiling_braces_bottom); the bottom edge is braced only at bearings, blocking rows and, where enabled, inflection points.")
	}
	notes = append(notes,
		fmt.Sprintf("Bracing, drawn rows: blocking drawn on the plan (layers %s) is existing bracing of both edges at its position; it is kept and not counted in the takeoff.", strings.Join(p.Layers.Blocking, ", ")),
		"Bracing, rows to add: where the bottom edge still fails, rows are added: with no row drawn in the spans, n rows evenly spaced in every span (the same n in each) until it passes or lu would fall below 24 in; with rows drawn, one row at a time in the stretch where the edge still fails, spaced to shorten its longest unbraced length, never within the joist depth d of a drawn row. Rows are decided per run: every member of a run is braced by, and checked with, the run's rows. Only rows to add are in the takeoff.")
	if p.Design.BraceAtInflection {
		notes = append(notes, "Bracing, inflection points: over interior supports of continuous joists, the inflection point on each side is counted as a brace of the bottom edge for the load cases whose moment there is negative (design.brace_at_inflection = true, common practice).")
	} else {
		notes = append(notes, "Bracing, inflection points: not counted as braces (design.brace_at_inflection = false); over interior supports the bottom edge is braced at bearings and blocking rows only.")
	}
	notes = append(notes, "CL is calculated per NDS 2018 3.3.3 with this bracing; the alternative rule of NDS 2018 4.4.1.2 (lateral support by nominal d/b) is shown after each CL result for comparison only, never as a requirement.")
	return notes
}

// mostFindings caps the drawing findings listed in the notes.
const mostFindings = 50

// drawingFindings lists the warnings and errors about the drawing that
// belong to no member (lines left out, blocks not expanded, entities past
// the limit), so that results.json and the Notes sheet show what was not
// checked. A member's own findings are already in its messages.
func drawingFindings(o *outcome) []string {
	// the findings' places that are a member's: a plan has far fewer
	// findings than members, so the set is of the findings' places
	own := map[dxfimport.Pos]bool{}
	lines := map[int]bool{} // the places' lines: most members' are none of them
	for _, is := range o.Issues {
		if is.Severity >= dxfimport.SevWarning {
			own[is.Pos] = false
			lines[is.Pos.Line] = true
		}
	}
	if len(own) > 0 {
		for k := range o.Plan.Members {
			if p := o.Plan.Members[k].Pos; lines[p.Line] {
				if _, ok := own[p]; ok {
					own[p] = true
				}
			}
		}
	}
	var notes []string
	n := 0
	for _, is := range o.Issues {
		if is.Severity < dxfimport.SevWarning || own[is.Pos] {
			continue
		}
		if n++; n <= mostFindings {
			notes = append(notes, "Drawing finding: "+is.Error())
		}
	}
	if n > mostFindings {
		notes = append(notes, fmt.Sprintf("Drawing findings: %d more not listed", n-mostFindings))
	}
	return notes
}

// exportInfo maps the [project] table onto export's.
func exportInfo(pi project.ProjectInfo) export.ProjectInfo {
	return export.ProjectInfo{Name: pi.Name, Number: pi.Number, Address: pi.Address, Designer: pi.Designer,
		Checker: pi.Checker, Revision: pi.Revision, Date: pi.Date}
}
