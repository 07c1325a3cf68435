package pipeline

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"runtime"
	"slices"
	"strings"
	"sync"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/internal/par"
	"framecheck/project"
)

// Outcome is everything one check run found, before it is written out.
type Outcome struct {
	Project  *project.Project
	Plan     *framing.Plan
	Settings check.Settings
	Results  []check.Result        // one per plan member, same order
	Sizing   []*check.SizingResult // per member with --size, else nil
	Rows     []framing.BlockingRow // rows to add, by run
	Takeoff  framing.Takeoff
	Issues   dxfimport.IssueList // drawing, framing and design findings
	PlanFile string              // the plan file's name, for findings about the whole plan
	Path     *PathOutcome        // beams, posts, walls and joints of the load path; nil without beams or posts

	Inputs []check.Member // each plan member's check input, same order
	// PointLoads are the point loads each member carries, by member
	// index, positions along it from its Start (the check inputs' own,
	// kept for the outputs when the inputs go)
	PointLoads map[int][]check.PointLoad
	Marks      map[string]string // every mark's name by its defining key, for marks.json
	// MarksFresh: marks.json named none of this plan's marks, so they
	// were named afresh
	MarksFresh bool

	// softBearings are the CHK313 warnings of beamBearings, reported
	// with the load path's findings
	softBearings dxfimport.IssueList
}

// Input is what runs the pipeline: the grouped plan, its project, the
// findings so far and whether to pick sizes.
type Input struct {
	Plan     *framing.Plan
	PlanFile string // the plan file's name as findings give it
	Project  *project.Project
	// Issues are the findings before the checks (reading, grouping,
	// doubts about the drawing), in the order they are reported; the
	// pipeline's own follow them.
	Issues dxfimport.IssueList
	Size   bool // pick sizes from [sizing] candidates (--size)
	// Marks are the names of an earlier run's marks by their defining
	// keys (OUTDIR's marks.json); nil: named afresh
	Marks map[string]string
}

// FramingOptions maps the project file onto framing's options.
func FramingOptions(p *project.Project) framing.Options {
	o := framing.DefaultOptions()
	o.SnapToleranceIn = p.Drawing.SnapToleranceIn
	o.MaxWallThicknessIn = p.Drawing.MaxWallThicknessIn
	o.EdgeDistanceIn = p.Drawing.EdgeDistanceIn
	o.JoistLayers = p.Layers.Joists
	o.BlockingLayers = p.Layers.Blocking
	o.ZoneLayers = p.Layers.Zones
	o.LabelLayers = p.Layers.Labels
	o.PostLayers = p.PostLayers()
	o.PointLoadLayers = p.Layers.PointLoads
	o.PointLoadNames = nil
	for _, l := range p.PointLoads {
		o.PointLoadNames = append(o.PointLoadNames, l.Name)
	}
	o.BayLayers = p.Layers.Bays
	o.Supports = nil
	for _, s := range p.Supports {
		o.Supports = append(o.Supports, framing.SupportSpec{Layers: s.Layers, Kind: s.Kind, BearingIn: s.BearingIn, Rigid: !s.Check})
	}
	o.Species, o.Grade, o.Size = p.Lumber.Species, p.Lumber.Grade, p.Lumber.Size
	o.ByLayer = nil
	for _, r := range p.Lumber.ByLayer {
		o.ByLayer = append(o.ByLayer, framing.LumberRule{Layers: r.Layers, Species: r.Species, Grade: r.Grade, Size: r.Size})
	}
	mats := p.Materials
	if mats == nil {
		mats = check.BuiltinMaterials()
	}
	o.MaterialCallout = mats.ReadSCLCallout // joist callouts in actual inches: structural composite lumber
	o.DefaultZone = p.Loads.DefaultZone
	if o.DefaultZone == "" && len(p.Zones) == 1 {
		o.DefaultZone = p.Zones[0].Name
	}
	return o
}

// Settings maps the project file's [design] onto check's settings.
func Settings(p *project.Project) (check.Settings, error) {
	s := check.DefaultSettings()
	s.TopEdgeBraced = p.Design.TopEdgeBraced
	s.ShearAtD = p.Design.ShearAtD
	s.WetService = p.Design.WetService
	s.Incised = p.Design.Incised
	s.PatternLive = p.Design.PatternLiveLoads
	s.BraceAtInflection = p.Design.BraceAtInflection
	s.Temperature = p.Design.Temperature
	s.Kcr = p.Design.Kcr
	s.Seasoned = p.Design.Seasoned
	combos, err := p.Design.Combinations.Combos()
	if err != nil {
		return s, fmt.Errorf("%s: design.combinations: %v", p.File, err)
	}
	s.Combos = combos
	if p.Materials != nil {
		s.Materials = p.Materials
	}
	return s, nil
}

// Run checks every member of a grouped plan, decides blocking rows per
// run, names marks, counts the takeoff and follows the load path. A
// returned error means the project's design settings are unusable.
func Run(in Input) (*Outcome, error) {
	o, path, err := Start(in)
	if err != nil {
		return nil, err
	}
	path()
	return o, nil
}

// Start is Run but for the load path, which the returned path follows
// when called (o.Path and the load path's findings in o.Issues), so that
// a caller can map the members for its outputs meanwhile. Until path has
// returned, o.Path and o.Issues must not be read, and nothing in o or the
// plan may be changed: the load path reads the plan, the members' results
// and their check inputs.
func Start(in Input) (o *Outcome, path func(), err error) {
	o, beams, inputs, twins, usable, err := runMembers(in)
	if err != nil {
		return nil, nil, err
	}
	return o, func() { runLoadPath(in.Project, in.Plan, beams, inputs, twins, usable, o.Settings, o, in.Size) }, nil
}

// runMembers is Run but for the load path: the members' inputs and
// checks, sizing, blocking rows, marks and takeoff. It returns what the
// load path reads besides the outcome: each beam's check input
// (beamInputs), each member's check input, its group of identical
// members (checkAll's) and whether it could be checked.
func runMembers(in Input) (o *Outcome, beams []beamIn, inputs []check.Member, twins []int, usable []bool, err error) {
	p := in.Project
	settings, err := Settings(p)
	if err != nil {
		return nil, nil, nil, nil, nil, err
	}
	plan := in.Plan
	o = &Outcome{Project: p, Plan: plan, Settings: settings, Issues: in.Issues, PlanFile: in.PlanFile}

	inputs = make([]check.Member, len(plan.Members))
	shifts := make([]float64, len(plan.Members))
	usable = make([]bool, len(plan.Members))
	o.Results = make([]check.Result, len(plan.Members))
	inputMsgs := make([][]string, len(plan.Members))
	// checkInput reads the plan and the project and writes only index k
	par.Ranges(len(plan.Members), func(lo, hi int) {
		sups := supportMemo(p)
		for k := lo; k < hi; k++ {
			inputs[k], shifts[k], inputMsgs[k] = checkInput(p, plan, k, sups)
		}
	})
	badLoads := applyPointLoads(p, plan, inputs, shifts)
	o.Inputs = inputs
	for _, mk := range plan.PointLoads {
		if k := mk.Member; k >= 0 && o.PointLoads[k] == nil && len(inputs[k].PointLoads) > 0 {
			if o.PointLoads == nil {
				o.PointLoads = map[int][]check.PointLoad{}
			}
			pls := slices.Clone(inputs[k].PointLoads)
			for i := range pls {
				pls[i].AtIn -= shifts[k]
			}
			o.PointLoads[k] = pls
		}
	}
	for k := range plan.Members {
		m := &plan.Members[k]
		msgs := append(inputMsgs[k], badLoads[k]...)
		if m.Error || len(msgs) > 0 {
			o.Results[k] = errorResult(m, append(append([]string(nil), m.Messages...), msgs...))
			continue
		}
		usable[k] = true
	}
	if in.Size {
		o.Sizing = make([]*check.SizingResult, len(plan.Members))
	}
	beams = beamInputs(p, plan)
	beamBearings(p, plan, beams, inputs, usable, settings, in.Size, o)
	twins = checkAll(inputs, shifts, usable, settings, p, o)
	if in.Size {
		sizeRuns(sameDepthGroups(plan, p.Sizing.SameDepth), inputs, shifts, usable, settings, o)
	}

	decideRunRows(plan, inputs, shifts, usable, settings, o)

	// Final sizes, then marks (keyed without their size, so that --size
	// renames none; names kept from marks.json) and the takeoff.
	drawn := framing.MarkKeys(plan)
	for k := range plan.Members {
		if usable[k] && o.Results[k].Size != "" {
			plan.Members[k].Size = o.Results[k].Size
		}
		// a callout naming a material of one grade without it
		// ("1 3/4 x 11 7/8 LVL"): the grade the check took, for the
		// marks and the takeoff
		if usable[k] && plan.Members[k].Grade == "" && o.Results[k].Status != check.StatusError {
			plan.Members[k].Grade = o.Results[k].Grade
		}
	}
	// Rafters drawn in plan are ordered at their sloped length.
	for k := range plan.Members {
		if inputs[k].PitchRise12 > 0 {
			plan.Members[k].SlopeFactor = math.Hypot(12, inputs[k].PitchRise12) / 12
		}
	}
	o.Marks, o.MarksFresh = assignMarks(plan, drawn, in.Marks)
	runs := RunIndexes(plan)
	for i := range o.Rows {
		o.Rows[i].Size = plan.Members[plan.Runs[runs[o.Rows[i].Run]].Members[0]].Size
	}
	o.Takeoff = framing.BuildTakeoff(plan, o.Rows)
	return o, beams, inputs, twins, usable, nil
}

// RunIndexes maps each run's ID to its index in plan.Runs (a run not
// found reads as 0, the first).
func RunIndexes(plan *framing.Plan) map[string]int {
	m := make(map[string]int, len(plan.Runs))
	for i, r := range plan.Runs {
		if _, ok := m[r.ID]; !ok {
			m[r.ID] = i
		}
	}
	return m
}

func firstBearing(m *framing.Member) float64 {
	if len(m.Bearings) == 0 {
		return 0
	}
	return m.Bearings[0].AtIn
}

// sameDepthGroups returns the groups of members that --size frames in
// one depth, by [sizing] same_depth: each run of adjacent parallel joists
// ("run"), the members loaded by the same zones ("zone", in plan order),
// or none.
func sameDepthGroups(plan *framing.Plan, sameDepth string) [][]int {
	switch sameDepth {
	case "none":
		return nil
	case "zone":
		index := map[string]int{}
		var groups [][]int
		for k := range plan.Members {
			z := strings.Join(plan.Members[k].Zones, "+")
			gi, ok := index[z]
			if !ok {
				gi = len(groups)
				index[z] = gi
				groups = append(groups, nil)
			}
			groups[gi] = append(groups[gi], k)
		}
		return groups
	}
	groups := make([][]int, len(plan.Runs))
	for i, run := range plan.Runs {
		groups[i] = run.Members
	}
	return groups
}

// sizeRuns gives every member of each same-depth group (a run by default,
// see sameDepthGroups) the deepest size any of its members needs: a run is
// framed in one size (common practice, no source), so an edge joist that
// could be lighter takes its neighbours' size. Members that change size
// are checked again, blocking solver included.
func sizeRuns(groups [][]int, inputs []check.Member, shifts []float64, usable []bool, s check.Settings, o *Outcome) {
	cache := map[string]check.Result{}
	for _, members := range groups {
		best, bestSec := "", check.Section{}
		for _, k := range members {
			if !usable[k] || o.Results[k].Status == check.StatusError {
				continue
			}
			sec, err := check.ParseSize(o.Results[k].Size)
			if err != nil || sec.Plies > 1 || sec.Actual {
				continue // built-up members keep their plies, SCL its size in actual inches, and set no size for the run
			}
			if best == "" || sec.NominalDIn > bestSec.NominalDIn ||
				(sec.NominalDIn == bestSec.NominalDIn && sec.NominalBIn > bestSec.NominalBIn) {
				best, bestSec = o.Results[k].Size, sec
			}
		}
		if best == "" {
			continue
		}
		for _, k := range members {
			if !usable[k] || o.Results[k].Size == best {
				continue
			}
			if sec, err := check.ParseSize(inputs[k].Size); err == nil && (sec.Plies > 1 || sec.Actual) {
				continue
			}
			cm := inputs[k]
			cm.Size = best
			key := check.MemberKey(cm)
			r, ok := cache[key]
			if !ok {
				r = check.CheckMember(cm, s)
				cache[key] = r
			}
			r.ID = cm.ID
			o.Results[k] = unshift(r, shifts[k])
		}
	}
}

// checkAll checks the usable members on every core. Members identical for
// design (same check input but for the ID: check.MemberKey) are checked
// once. It returns, for each usable member, the index of its group of
// identical members (0, 1, ... in the order of each group's first
// member), -1 for the others.
func checkAll(inputs []check.Member, shifts []float64, usable []bool, s check.Settings, p *project.Project, o *Outcome) (twin []int) {
	twin, order := groupAlike(inputs, usable)
	checked := make([]check.Result, len(order))
	var sized []*check.SizingResult
	if o.Sizing != nil {
		sized = make([]*check.SizingResult, len(order))
	}
	workers := runtime.GOMAXPROCS(0)
	var wg sync.WaitGroup
	next := make(chan int)
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				k := order[i]
				if sec, err := check.ParseSize(inputs[k].Size); o.Sizing != nil && err == nil && (sec.Plies > 1 || sec.Actual) {
					// a built-up member keeps its plies, and one sized in
					// actual inches (structural composite lumber) its size:
					// the candidates are single sawn sizes, so it is checked
					// as drawn
					checked[i] = check.CheckMember(inputs[k], s)
				} else if o.Sizing != nil {
					sr := check.Size(inputs[k], s, p.Sizing.Candidates, p.Sizing.BlockingPieceWeightBf)
					sized[i] = &sr
					checked[i] = sr.Chosen
				} else {
					checked[i] = check.CheckMember(inputs[k], s)
				}
			}
		}()
	}
	for i := range order {
		next <- i
	}
	close(next)
	wg.Wait()
	// Each member takes its first twin's result, with its own ID and
	// positions: each range writes only its own members.
	par.Ranges(len(inputs), func(lo, hi int) {
		for k := lo; k < hi; k++ {
			if !usable[k] {
				continue
			}
			r := checked[twin[k]]
			r.ID = inputs[k].ID
			o.Results[k] = unshift(r, shifts[k])
			if sized != nil {
				o.Sizing[k] = sized[twin[k]]
			}
		}
	})
	return twin
}

// groupAlike returns the group of each usable member of inputs among the
// members identical to it for design (check.MemberKey), -1 for the others,
// groups numbered in the order of their first member, and each group's
// first member. The keys are found on every core, each range naming its
// own keys once (a plan repeats a few hundred inputs a hundred thousand
// times); only the ranges' distinct keys are then joined, in order.
func groupAlike(inputs []check.Member, usable []bool) (twin, first []int) {
	twin = make([]int, len(inputs)) // the range's own key numbers, then the groups
	type rangeKeys struct {
		lo    int
		keys  []string // the range's distinct keys, in the order met
		first []int    // the first member of each
	}
	var mu sync.Mutex
	var ranges []rangeKeys
	par.Ranges(len(inputs), func(lo, hi int) {
		var buf []byte
		seen := map[string]int{}
		rk := rangeKeys{lo: lo}
		for k := lo; k < hi; k++ {
			if !usable[k] {
				twin[k] = -1
				continue
			}
			buf = check.AppendMemberKey(buf[:0], &inputs[k])
			i, ok := seen[string(buf)]
			if !ok {
				i = len(rk.keys)
				key := string(buf)
				seen[key] = i
				rk.keys = append(rk.keys, key)
				rk.first = append(rk.first, k)
			}
			twin[k] = i
		}
		mu.Lock()
		ranges = append(ranges, rk)
		mu.Unlock()
	})
	slices.SortFunc(ranges, func(a, b rangeKeys) int { return cmp.Compare(a.lo, b.lo) })
	group := map[string]int{}
	for r := range ranges {
		rk := &ranges[r]
		hi := len(inputs)
		if r+1 < len(ranges) {
			hi = ranges[r+1].lo
		}
		// the range's key numbers become the groups', in the range
		ids := make([]int, len(rk.keys))
		for i, key := range rk.keys {
			g, ok := group[key]
			if !ok {
				g = len(first)
				group[key] = g
				first = append(first, rk.first[i])
			}
			ids[i] = g
		}
		for k := rk.lo; k < hi; k++ {
			if twin[k] >= 0 {
				twin[k] = ids[twin[k]]
			}
		}
	}
	return twin, first
}

// supportMemo is p.SupportOf remembering each layer's answer: a plan has
// a few support layers and hundreds of thousands of bearings on them. One
// memo per goroutine.
func supportMemo(p *project.Project) func(layer string) *project.Support {
	memo := map[string]*project.Support{}
	return func(layer string) *project.Support {
		sup, ok := memo[layer]
		if !ok {
			sup = p.SupportOf(layer)
			memo[layer] = sup
		}
		return sup
	}
}

// checkInput builds check's input for plan member k. Bearings that lie a
// little outside the drawn joist (an end stopping short of a single-line
// support) are kept where they are and the member is lengthened to reach
// them: shift is how far the start moved back, to be taken off the
// positions check returns. msgs are reasons the member cannot be checked.
func checkInput(p *project.Project, plan *framing.Plan, k int, supportOf func(layer string) *project.Support) (cm check.Member, shift float64, msgs []string) {
	m := &plan.Members[k]
	cm = check.Member{
		ID: m.ID, Size: m.Size, Species: m.Species, Grade: m.Grade,
		LengthIn:        m.LengthIn,
		OverhangStartIn: m.OverhangStartIn, OverhangEndIn: m.OverhangEndIn,
		SpacingIn: m.SpacingIn, TribIn: m.TribIn,
	}
	if cm.SpacingIn == 0 {
		cm.SpacingIn = m.CalloutSpacingIn
	}
	if len(m.Bearings) > 0 && m.Bearings[0].AtIn < 0 {
		shift = -m.Bearings[0].AtIn
	}
	for _, b := range m.Bearings {
		cb := check.Bearing{AtIn: b.AtIn + shift, LengthIn: b.LengthIn,
			// a joist in a hanger, or on a ledger, hangs from the support's
			// face: NDS 2018 3.4.3.1(a) does not hold there
			Hanger: b.Kind == framing.KindFlushBeam || b.Kind == framing.KindLedger}
		if sup := supportOf(b.Pos.Layer); sup != nil {
			cb.SupportSpecies, cb.SupportGrade = sup.Species, sup.Grade
		}
		cm.Bearings = append(cm.Bearings, cb)
	}
	cm.LengthIn += shift
	if n := len(cm.Bearings); n > 0 && cm.Bearings[n-1].AtIn > cm.LengthIn {
		cm.LengthIn = cm.Bearings[n-1].AtIn
	}
	for _, x := range m.ExistingBlockingAtIn {
		cm.BlockingAtIn = append(cm.BlockingAtIn, x+shift)
	}
	cm.Repetitive = repetitive(plan, k)
	canonicalLengths(&cm)
	// A built-up member ("(2) 2x10" from a callout) is an error until the
	// engine checks built-up members, with or without --size: never one
	// ply, nor a single joist picked in its place.
	if _, err := check.ParseSize(m.Size); errors.Is(err, check.ErrBuiltUp) {
		msgs = append(msgs, err.Error())
	}
	zs, zmsgs := memberZones(p, m.Zones)
	msgs = append(msgs, zmsgs...)
	if zs == nil {
		return cm, shift, msgs
	}
	sw := 0.0
	if p.Design.AddSelfWeight {
		sw = selfWeightPsf(m.Size, cm.TribIn)
	}
	for _, z := range zs[1:] {
		if z.PitchRise12 != zs[0].PitchRise12 {
			msgs = append(msgs, fmt.Sprintf("the member crosses zones %s and %s, which have different pitches (%s and %s in 12): "+
				"a rafter has one slope; draw the zone edge at the ridge or the member's end", zs[0].Name, z.Name,
				project.FmtNum(zs[0].PitchRise12), project.FmtNum(z.PitchRise12)))
			return cm, shift, msgs
		}
	}
	cm.PitchRise12 = zs[0].PitchRise12
	cm.Loads = zoneLoads(zs[0], sw)
	if len(m.ZonePieces) > 1 {
		// Each zone loads the member where it acts (DOMAIN.md "Loads"),
		// never the envelope: in 0.6D + 0.6W a zone's dead load resists
		// only its own uplift.
		for i, zp := range m.ZonePieces {
			from, to := zp.FromIn+shift, zp.ToIn+shift
			if i == 0 {
				from = 0
			}
			if i == len(m.ZonePieces)-1 {
				to = cm.LengthIn
			}
			cm.LoadPieces = append(cm.LoadPieces, check.LoadPiece{FromIn: from, ToIn: to, Zone: zp.Zone, Loads: zoneLoads(p.Zone(zp.Zone), sw)})
		}
	}
	// Use, deflection limits and bottom bracing are properties of the
	// whole member: the strictest of its zones.
	z := zs[0]
	cm.Use = z.Use
	cm.LiveLimit, cm.TotalLimit, cm.LongTermLimit = z.LiveDeflectionLimit, z.TotalDeflectionLimit, z.LongTermDeflectionLimit
	cm.BottomBracedContinuous = z.CeilingBracesBottom
	for _, z := range zs[1:] {
		if z.Use == "floor" {
			cm.Use = "floor" // floor limits are the stricter
		}
		cm.LiveLimit = math.Max(cm.LiveLimit, z.LiveDeflectionLimit)
		cm.TotalLimit = math.Max(cm.TotalLimit, z.TotalDeflectionLimit)
		cm.LongTermLimit = math.Max(cm.LongTermLimit, z.LongTermDeflectionLimit)
		cm.BottomBracedContinuous = cm.BottomBracedContinuous && z.CeilingBracesBottom
	}
	return cm, shift, msgs
}

// canonicalLengths rounds the lengths of a check input to 1e-9 in: a plan
// turned or drawn in millimetres measures 144 in as 144.00000000000003,
// and members alike but for that were checked apart (groupAlike keys the
// inputs exactly), each with its own calculation, and printed positions
// whose last digit flipped with the plan's angle. 1e-9 in is far below
// anything drawn.
func canonicalLengths(cm *check.Member) {
	r := func(v *float64) { *v = math.Round(*v*1e9) / 1e9 }
	for _, v := range []*float64{&cm.LengthIn, &cm.OverhangStartIn, &cm.OverhangEndIn, &cm.SpacingIn, &cm.TribIn} {
		r(v)
	}
	for i := range cm.Bearings {
		r(&cm.Bearings[i].AtIn)
		r(&cm.Bearings[i].LengthIn)
	}
	for i := range cm.BlockingAtIn {
		r(&cm.BlockingAtIn[i])
	}
}

// zoneLoads returns the area loads of zone z on the horizontal projection,
// with selfPsf (the joist's own weight spread over its tributary width, or
// 0) added to the dead load and to the dead load relied on against uplift.
// On a sloped roof a dead load given per sloped area (dead_on_slope) and
// the member's own weight, which lies along the slope, are divided by cos
// of the slope (statics: the sloped length over the plan length). Roof
// live and snow loads are on the horizontal projection already (ASCE 7-16
// 4.8, 7.1); wind stays normal to the roof and check converts it.
func zoneLoads(z *project.Zone, selfPsf float64) check.AreaLoads {
	k := 1.0
	if z.PitchRise12 > 0 {
		k = math.Hypot(12, z.PitchRise12) / 12
	}
	d, ud := z.DeadPsf, z.UpliftDeadPsf
	if z.DeadOnSlope {
		d, ud = d*k, ud*k
	}
	return check.AreaLoads{DeadPsf: d + selfPsf*k, LivePsf: z.LivePsf, RoofLivePsf: z.RoofLivePsf,
		SnowPsf: z.SnowPsf, WindDownPsf: z.WindDownPsf, WindUpPsf: z.WindUpPsf,
		UpliftDeadPsf: ud + selfPsf*k, HasUpliftDead: z.HasUpliftDead}
}

// repetitive reports whether plan member k qualifies for Cr (NDS 2018
// 4.3.9): it is one of at least three joists side by side, no more than
// 24 in on centre, joined by the sheathing. Neighbours count whatever their
// bearings (a trimmer or a lapped joist beside it still shares the load
// through the sheathing), which a run, made of joists with the same
// bearings, would not.
func repetitive(plan *framing.Plan, k int) bool {
	const maxOnCentreIn = check.RepetitiveMaxSpacingIn + check.SpacingToleranceIn
	count := 1
	for side := 0; side < 2; side++ {
		j := k
		for step := 0; step < 2 && count < 3; step++ {
			m := &plan.Members[j]
			next, gap := m.Neighbours[side], m.NeighbourGapsIn[side]
			if next < 0 || gap > maxOnCentreIn {
				break
			}
			count++
			j = next
		}
	}
	return count >= 3
}

// woodDensityPcf is the unit weight NDS 2018 Supplement Table 1B uses for
// its weights per foot of sawn lumber, 35 lb/ft3 (from memory: verify
// against NDS 2018 Supplement Table 1B, heading note).
const woodDensityPcf = 35.0

// selfWeightPsf spreads the joist's own weight over its tributary width.
func selfWeightPsf(size string, tribIn float64) float64 {
	sec, err := check.ParseSize(size)
	if err != nil || tribIn <= 0 {
		return 0
	}
	plf := sec.AreaIn2 / 144 * woodDensityPcf
	return plf / (tribIn / 12)
}

// memberZones returns the project zones of the names a member lies in, or
// nil with the reason when it has none or one the project does not define.
func memberZones(p *project.Project, names []string) ([]*project.Zone, []string) {
	if len(names) == 0 {
		return nil, []string{"no load zone: the member lies outside every zone outline and the project has no default_zone"}
	}
	zs := make([]*project.Zone, 0, len(names))
	for _, n := range names {
		z := p.Zone(n)
		if z == nil {
			return nil, []string{fmt.Sprintf("load zone %q is drawn but the project file has no [[zone]] named so", n)}
		}
		zs = append(zs, z)
	}
	return zs, nil
}

// unshift moves positions check returned back to the drawn member.
func unshift(r check.Result, shift float64) check.Result {
	if shift == 0 {
		return r
	}
	move := func(xs []float64) []float64 {
		if xs == nil {
			return nil
		}
		at := make([]float64, len(xs))
		for i, x := range xs {
			at[i] = x - shift
		}
		return at
	}
	r.BlockingAtIn = move(r.BlockingAtIn)
	r.DrawnBlockingAtIn = move(r.DrawnBlockingAtIn)
	if len(r.BlockingSteps) > 0 && r.BlockingSteps[0].AtIn != nil {
		steps := append([]check.BlockingStep(nil), r.BlockingSteps...)
		for i := range steps {
			steps[i].AtIn = move(steps[i].AtIn)
		}
		r.BlockingSteps = steps
	}
	if len(r.Reactions) > 0 {
		re := make([]check.Reaction, len(r.Reactions))
		for i, x := range r.Reactions {
			x.AtIn -= shift
			re[i] = x
		}
		r.Reactions = re
	}
	return r
}

// errorResult is the result of a member that cannot be checked.
func errorResult(m *framing.Member, msgs []string) check.Result {
	return check.Result{ID: m.ID, Size: m.Size, Species: m.Species, Grade: m.Grade,
		SpansIn: m.Spans(), OverhangsIn: [2]float64{m.OverhangStartIn, m.OverhangEndIn},
		Status: check.StatusError, Messages: msgs}
}
