package pipeline

import (
	"fmt"
	"math"
	"regexp"
	"slices"
	"sort"
	"strings"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/internal/par"
	"framecheck/loadpath"
	"framecheck/project"
)

// Findings of the load path (design: CHK3xx).
const (
	CodeBeamNotChecked  = "CHK310" // a beam with its own supports that cannot be checked
	CodeLoadLost        = "CHK311" // a member in error bears on a beam: its load is not in the beam's check
	CodeLoadPath        = "CHK312" // the load path itself: a cycle, reactions not found
	CodeSoftBeamBearing = "CHK313" // joists rest on a beam whose Fc_perp' is not known when they are checked
)

// BeamOutcome is a beam of the plan as the load path checked it.
type BeamOutcome struct {
	Beam  *framing.Beam
	Input check.Member
	Shift float64 // how far the check's origin lies before the beam's Start
	Res   check.Result
	Mark  string
}

// PostOutcome is a post of the plan with the loads that reach it.
type PostOutcome struct {
	Post    *framing.Post
	Checked bool
	Out     loadpath.PostOut
	Size    string
	// HeightIn is the post's height (its unbraced length), 0 when not known.
	HeightIn float64
	// Unknown names the beams on the post that could not be checked: the
	// load they bring is not known, so the post is not passed on it.
	Unknown []string
}

// WallOutcome is a bearing-wall line with the loads that reach it.
type WallOutcome struct {
	Support  int // index into Plan.Supports
	Loads    loadpath.Loads
	LengthIn float64
}

// PathOutcome is what the load path found.
type PathOutcome struct {
	Beams  []BeamOutcome
	Posts  []PostOutcome
	Walls  []WallOutcome
	Joints []loadpath.Joint
	IDs    []string // loadpath member index -> member or beam id
	Solved *loadpath.Outcome
}

// applyPointLoads puts the point loads drawn on joists on their check
// inputs (positions shifted as the bearings are). A mark whose text cannot
// be read makes its joist an error: never a load left out silently.
func applyPointLoads(p *project.Project, plan *framing.Plan, inputs []check.Member, shifts []float64) map[int][]string {
	bad := map[int][]string{}
	for _, mk := range plan.PointLoads {
		if mk.Member < 0 {
			continue
		}
		if mk.Err != "" {
			bad[mk.Member] = append(bad[mk.Member], fmt.Sprintf("point load %s: %s", mk.Pos, mk.Err))
			continue
		}
		l, name := markLoads(p, mk)
		l.AtIn = mk.AtIn + shifts[mk.Member]
		l.Name = name
		inputs[mk.Member].PointLoads = append(inputs[mk.Member].PointLoads, l)
	}
	return bad
}

// markLoads returns a point-load mark's loads: those its text gives, or
// the [[point_load]] it names.
func markLoads(p *project.Project, mk framing.PointLoadMark) (check.PointLoad, string) {
	l := mk.Loads
	name := mk.Text
	if mk.Name != "" {
		if pl := p.PointLoad(mk.Name); pl != nil {
			l = framing.PointLoads{DeadLb: pl.DeadLb, LiveLb: pl.LiveLb, RoofLiveLb: pl.RoofLiveLb, SnowLb: pl.SnowLb,
				WindDownLb: pl.WindDownLb, WindUpLb: pl.WindUpLb}
			name = pl.Name
		}
	}
	// A point load's dead load is not relied on against uplift (0.6D +
	// 0.6W takes none of it): equipment or a load from above may be taken
	// away, and the project file cannot say it stays (common practice, no
	// source; conservative). It counts in full in every other case.
	return check.PointLoad{DeadLb: l.DeadLb, LiveLb: l.LiveLb, RoofLiveLb: l.RoofLiveLb, SnowLb: l.SnowLb,
		WindDownLb: l.WindDownLb, WindUpLb: l.WindUpLb, HasUpliftDead: true}, name
}

// beamDensityPcf is the unit weight taken for a beam's own weight, as for
// joists (woodDensityPcf; from memory: verify against NDS 2018 Supplement
// Table 1B, heading note).
const beamDensityPcf = woodDensityPcf

// HasLoadPath reports whether the plan has a load path to solve: a post,
// or a beam with supports of its own.
func HasLoadPath(plan *framing.Plan) bool {
	if len(plan.Posts) > 0 {
		return true
	}
	for i := range plan.Beams {
		if !plan.Beams[i].Rigid {
			return true
		}
	}
	return false
}

// runLoadPath follows the loads of the checked joists down to the beams,
// posts and walls that carry them (issue 17). Beams framing found with two
// or more supports of their own are checked with the joists' reactions by
// load type; posts under what reaches them; walls and posts get the loads
// for the foundation.
//
// With sizing (--size), each beam takes the lightest of [sizing]
// beam_candidates with which it passes, its own weight following the size.
func runLoadPath(p *project.Project, plan *framing.Plan, ins []beamIn, inputs []check.Member, twins []int, usable []bool, s check.Settings, o *Outcome, sizing bool) {
	if !HasLoadPath(plan) {
		return // no beam with supports of its own, no post: every support is a rigid bearing
	}
	po := &PathOutcome{}
	lp := &loadpath.Plan{Members: make([]loadpath.MemberIn, 0, len(plan.Beams)+len(plan.Members))}
	// Walls: every bearing-wall support line.
	wallOf := map[int]int{}
	for i, sp := range plan.Supports {
		if sp.Kind == framing.KindBearingWall {
			wallOf[i] = len(lp.Walls)
			lp.Walls = append(lp.Walls, loadpath.WallIn{ID: fmt.Sprintf("W%d", len(lp.Walls)+1)})
			po.Walls = append(po.Walls, WallOutcome{Support: i, LengthIn: math.Hypot(sp.B.X-sp.A.X, sp.B.Y-sp.A.Y)})
		}
	}
	// Posts.
	lp.Posts = make([]loadpath.PostIn, 0, len(plan.Posts))
	po.Posts = make([]PostOutcome, 0, len(plan.Posts))
	for i := range plan.Posts {
		pt := &plan.Posts[i]
		pc, checked, size := postInput(p, pt)
		lp.Posts = append(lp.Posts, loadpath.PostIn{ID: pt.ID, Check: pc, Checked: checked, SelfWeightLb: postWeightLb(pc)})
		po.Posts = append(po.Posts, PostOutcome{Post: pt, Checked: checked, Size: size, HeightIn: pc.HeightIn})
	}
	// Beams: members of the path when they have their own supports.
	beamMember := make([]int, len(plan.Beams))
	outIndex := beamOutcomeIndexes(plan) // plan beam -> index into po.Beams
	po.Beams = make([]BeamOutcome, 0, len(plan.Beams))
	po.IDs = make([]string, 0, cap(lp.Members))
	for i := range plan.Beams {
		b := &plan.Beams[i]
		beamMember[i] = -1
		if b.Rigid {
			continue
		}
		cm, shift, msg := ins[i].cm, ins[i].shift, ins[i].msg
		bo := BeamOutcome{Beam: b, Input: cm, Shift: shift}
		if msg != "" {
			bo.Res = check.Result{ID: b.ID, Size: cm.Size, Status: check.StatusError, Messages: []string{msg}}
			o.Issues.Add(b.Lines[0], CodeBeamNotChecked, dxfimport.SevError, "%s: %s", b.ID, msg)
		} else {
			beamMember[i] = len(lp.Members)
			mi := loadpath.MemberIn{ID: b.ID, Beam: true, Check: &cm}
			// glulam and structural composite lumber keep their sizes: the
			// candidates are sawn sizes
			if beamSized(p, cm, sizing) {
				mi.Candidates, mi.DensityPcf = p.Sizing.BeamCandidates, beamDensityPcf
			}
			lp.Members = append(lp.Members, mi)
			po.IDs = append(po.IDs, b.ID)
		}
		po.Beams = append(po.Beams, bo)
		if msg != "" {
			// the posts under a beam that cannot be checked get a load
			// nobody knows
			for _, br := range b.Bearings {
				if br.Kind == framing.BeamOnPost {
					po.Posts[br.Index].Unknown = append(po.Posts[br.Index].Unknown, b.ID)
				}
			}
		}
	}
	// Each beam's carriers, now that every beam has its place.
	marksOn := beamMarks(plan)
	bi := 0
	for i := range plan.Beams {
		b := &plan.Beams[i]
		if b.Rigid {
			continue
		}
		k := beamMember[i]
		if k >= 0 {
			m := &lp.Members[k]
			for _, br := range b.Bearings {
				c := loadpath.Carrier{Kind: loadpath.Rigid}
				switch br.Kind {
				case framing.BeamOnPost:
					c = loadpath.Carrier{Kind: loadpath.Post, Index: br.Index, Joint: "post cap"}
				case framing.BeamOnWall:
					if w, ok := wallOf[br.Index]; ok {
						c = loadpath.Carrier{Kind: loadpath.Wall, Index: w, Joint: "beam on wall"}
					}
				case framing.BeamOnBeam:
					if cb := beamMember[br.Index]; cb >= 0 {
						at := along(&plan.Beams[br.Index], pointAlong(b, br.AtIn)) + po.Beams[outIndex[br.Index]].Shift
						c = loadpath.Carrier{Kind: loadpath.Member, Index: cb, AtIn: at, Joint: "beam to beam"}
					} else {
						o.Issues.Add(b.Lines[0], CodeLoadLost, dxfimport.SevWarning,
							"%s bears on %s, which is not checked: its load stops there and does not reach what carries %s",
							b.ID, plan.Beams[br.Index].ID, plan.Beams[br.Index].ID)
					}
				}
				m.Carriers = append(m.Carriers, c)
			}
			// point-load marks on the beam
			for _, mi := range marksOn[i] {
				if mk := plan.PointLoads[mi]; mk.Member < 0 && mk.Err == "" {
					l, name := markLoads(p, mk)
					l.AtIn, l.Name = mk.AtIn+po.Beams[bi].Shift, name
					m.Check.PointLoads = append(m.Check.PointLoads, l)
				}
			}
		}
		bi++
	}
	// Joists: their results and reactions as found, each bearing to its
	// beam, wall or rigid support. Identical joists share their reactions.
	carriedBy := newBearingCarriers(plan)
	for i := range plan.Beams {
		b := &plan.Beams[i]
		if beamMember[i] < 0 {
			continue
		}
		shift := po.Beams[outIndex[i]].Shift
		for _, c := range b.Carried {
			joint := "joist on beam"
			if b.Kind == framing.KindFlushBeam || b.Kind == framing.KindLedger {
				joint = "hanger"
			}
			carriedBy.set(c.Member, c.Bearing, loadpath.Carrier{Kind: loadpath.Member, Index: beamMember[i], AtIn: c.AtIn + shift, Joint: joint})
		}
	}
	softBeamBearings(o)
	// Which joists go on the path, in the plan's order, and their
	// reactions: one analysis per key, on every core; then their items,
	// on every core.
	// A member checked at its drawn size shares its reactions with the
	// members of its group (checkAll's twins); one that --size gave
	// another size, with those of its key at that size.
	groups := 0
	for _, t := range twins {
		groups = max(groups, t+1)
	}
	groupRep := make([]int, groups) // twin group -> index into reps, -1 none yet
	for g := range groupRep {
		groupRep[g] = -1
	}
	keyRep := map[string]int{}
	var reps []int                          // the first member of each
	keyOf := make([]int, len(plan.Members)) // index into reps, -1 off the path
	for k := range plan.Members {
		keyOf[k] = -1
		if !usable[k] || o.Results[k].Status == check.StatusError {
			if carriedBy.any(k) {
				o.Issues.Add(plan.Members[k].Pos, CodeLoadLost, dxfimport.SevWarning,
					"%s is in error: the load it would put on the beams under it is not in their checks", plan.Members[k].ID)
			}
			continue
		}
		var i int
		var ok bool
		if inputs[k].Size == o.Results[k].Size && twins[k] >= 0 {
			if i = groupRep[twins[k]]; i < 0 {
				i = len(reps)
				groupRep[twins[k]] = i
				reps = append(reps, k)
			}
		} else {
			cm := inputs[k]
			cm.Size = o.Results[k].Size
			key := check.MemberKey(cm)
			i, ok = keyRep[key]
			if !ok {
				i = len(reps)
				keyRep[key] = i
				reps = append(reps, k)
			}
		}
		keyOf[k] = i
	}
	keyRs := make([][]check.LoadReactions, len(reps))
	keyOK := make([]bool, len(reps))
	par.Each(len(reps), func(i int) {
		cm := inputs[reps[i]]
		cm.Size = o.Results[reps[i]].Size
		rs, err := check.ServiceReactions(cm, s)
		keyRs[i], keyOK[i] = rs, err == nil
	})
	onPath := make([]int, 0, len(plan.Members))
	rsOf := make([][]check.LoadReactions, len(plan.Members))
	// the x-th member on the path has carriers[offs[x]:offs[x+1]]
	offs := make([]int, 1, len(plan.Members)+1)
	for k, i := range keyOf {
		if i < 0 || !keyOK[i] {
			continue // a member whose reactions cannot be found stays off the path
		}
		rsOf[k] = keyRs[i]
		onPath = append(onPath, k)
		offs = append(offs, offs[len(offs)-1]+len(plan.Members[k].Bearings))
	}
	first := len(lp.Members)
	lp.Members = lp.Members[:first+len(onPath)]
	po.IDs = po.IDs[:first+len(onPath)]
	carriers := make([]loadpath.Carrier, offs[len(offs)-1])
	// each range writes only its own members' items and carriers
	par.Ranges(len(onPath), func(lo, hi int) {
		for x := lo; x < hi; x++ {
			k := onPath[x]
			cs := carriers[offs[x]:offs[x+1]:offs[x+1]]
			for j, b := range plan.Members[k].Bearings {
				c, ok := carriedBy.get(k, j)
				if !ok {
					// a support the path does not follow further: the
					// joint is named by the kind of support, so that its
					// demand (the hanger's on a flush beam) is stated too
					joint := "joist on support"
					switch b.Kind {
					case framing.KindFlushBeam, framing.KindLedger:
						joint = "hanger"
					case framing.KindBearingWall:
						joint = "joist on wall"
					}
					c = loadpath.Carrier{Kind: loadpath.Rigid, Joint: joint}
					if w, isWall := wallOf[b.Support]; isWall {
						c = loadpath.Carrier{Kind: loadpath.Wall, Index: w, Joint: joint}
					}
				}
				cs[j] = c
			}
			mi := &lp.Members[first+x]
			// the input as checked: shared with inputs (Solve reads it
			// only), a copy when the check took another size
			in := &inputs[k]
			if in.Size != o.Results[k].Size {
				c := *in
				c.Size = o.Results[k].Size
				in = &c
			}
			*mi = loadpath.MemberIn{ID: plan.Members[k].ID, Check: in, Result: &o.Results[k], Reactions: rsOf[k], Carriers: cs}
			po.IDs[first+x] = plan.Members[k].ID
		}
	})
	solved := loadpath.Solve(lp, s)
	po.Solved = solved
	for _, e := range solved.Errors {
		o.Issues.Add(dxfimport.Pos{File: o.PlanFile}, CodeLoadPath, dxfimport.SevError, "%s", e)
	}
	bi = 0
	for i := range plan.Beams {
		if plan.Beams[i].Rigid {
			continue
		}
		if k := beamMember[i]; k >= 0 {
			bo := &po.Beams[bi]
			bo.Input = solved.Members[k].Input
			bo.Res = unshift(solved.Members[k].Result, bo.Shift)
			bo.Res.ID = plan.Beams[i].ID
			// a member it carries that could not be checked brings a load
			// its check does not hold: never a pass on part of the load
			var missing []string
			for _, c := range plan.Beams[i].Carried {
				if !usable[c.Member] || o.Results[c.Member].Status == check.StatusError {
					missing = append(missing, plan.Members[c.Member].ID)
				}
			}
			if len(missing) > 0 {
				bo.Res.Messages = append(bo.Res.Messages, fmt.Sprintf("carries %s, in error: their loads are not in this check",
					strings.Join(missing, ", ")))
				if bo.Res.Status == check.StatusPass {
					bo.Res.Status = check.StatusError
				}
			}
		}
		bi++
	}
	for i := range po.Posts {
		po.Posts[i].Out = solved.Posts[i]
	}
	for i := range po.Walls {
		po.Walls[i].Loads = solved.Walls[i]
	}
	po.Joints = solved.Joints
	o.Path = po
}

// beamIn is a plan beam's check input as beamInput builds it: the input,
// the shift of its positions, and why it cannot be checked ("" when it
// can).
type beamIn struct {
	cm    check.Member
	shift float64
	msg   string
}

// beamInputs returns the check input of each plan beam that is not a
// rigid bearing, on every core (beamInput reads the plan and the project
// only: each range writes its own beams' inputs). The joists' bearings on
// the beams (beamBearings) and the load path read them.
func beamInputs(p *project.Project, plan *framing.Plan) []beamIn {
	ins := make([]beamIn, len(plan.Beams))
	par.Ranges(len(plan.Beams), func(lo, hi int) {
		for i := lo; i < hi; i++ {
			if !plan.Beams[i].Rigid {
				ins[i].cm, ins[i].shift, ins[i].msg = beamInput(p, plan, &plan.Beams[i])
			}
		}
	})
	return ins
}

// beamOutcomeIndexes returns, for each plan beam, its index into
// PathOutcome.Beams (rigid beams are left out of it; theirs is the next
// beam's).
func beamOutcomeIndexes(plan *framing.Plan) []int {
	idx := make([]int, len(plan.Beams))
	n := 0
	for i := range plan.Beams {
		idx[i] = n
		if !plan.Beams[i].Rigid {
			n++
		}
	}
	return idx
}

// beamMarks returns the indexes into plan.PointLoads of the marks on each
// plan beam, in the plan's order.
func beamMarks(plan *framing.Plan) [][]int {
	on := make([][]int, len(plan.Beams))
	for i, mk := range plan.PointLoads {
		if mk.Beam >= 0 && mk.Beam < len(on) {
			on[mk.Beam] = append(on[mk.Beam], i)
		}
	}
	return on
}

// bearingCarriers holds what carries each bearing of each plan member,
// when a beam does: member k's bearing j is item off[k]+j.
type bearingCarriers struct {
	off []int
	c   []loadpath.Carrier
	ok  []bool
}

func newBearingCarriers(plan *framing.Plan) *bearingCarriers {
	bc := &bearingCarriers{off: make([]int, len(plan.Members)+1)}
	for k := range plan.Members {
		bc.off[k+1] = bc.off[k] + len(plan.Members[k].Bearings)
	}
	n := bc.off[len(plan.Members)]
	bc.c, bc.ok = make([]loadpath.Carrier, n), make([]bool, n)
	return bc
}

// set records c as the carrier of member k's bearing j (the last one set
// stands); a member or bearing the plan does not have is never asked for.
func (bc *bearingCarriers) set(k, j int, c loadpath.Carrier) {
	if k < 0 || k >= len(bc.off)-1 || j < 0 || j >= bc.off[k+1]-bc.off[k] {
		return
	}
	bc.c[bc.off[k]+j], bc.ok[bc.off[k]+j] = c, true
}

func (bc *bearingCarriers) get(k, j int) (loadpath.Carrier, bool) {
	if k < 0 || k >= len(bc.off)-1 || j < 0 || j >= bc.off[k+1]-bc.off[k] {
		return loadpath.Carrier{}, false
	}
	return bc.c[bc.off[k]+j], bc.ok[bc.off[k]+j]
}

// any says whether a beam carries any bearing of member k.
func (bc *bearingCarriers) any(k int) bool {
	for j := bc.off[k]; j < bc.off[k+1]; j++ {
		if bc.ok[j] {
			return true
		}
	}
	return false
}

// pointAlong returns the point at distance t along beam b from its Start.
func pointAlong(b *framing.Beam, t float64) framing.Point {
	dx, dy := b.End.X-b.Start.X, b.End.Y-b.Start.Y
	l := math.Hypot(dx, dy)
	if l == 0 {
		return b.Start
	}
	return framing.Point{X: b.Start.X + dx/l*t, Y: b.Start.Y + dy/l*t}
}

// along returns the distance along beam b from its Start of the
// projection of q on its centre line.
func along(b *framing.Beam, q framing.Point) float64 {
	dx, dy := b.End.X-b.Start.X, b.End.Y-b.Start.Y
	l := math.Hypot(dx, dy)
	if l == 0 {
		return 0
	}
	return ((q.X-b.Start.X)*dx + (q.Y-b.Start.Y)*dy) / l
}

// glulamStressClass finds a glulam stress class such as 24F-1.8E.
var glulamStressClass = regexp.MustCompile(`(?i)\b(\d{2}F-\d\.\dE)\b`)

// glulamCallout reads a glulam beam's callout, "5 1/8 x 12 GLB 24F-1.8E"
// or "5.125x12 glulam 24F-1.8E": its size in actual inches and its stress
// class (NDS 2018 Supplement Table 5A).
func glulamCallout(text string) (size, class string, ok bool) {
	up := strings.ToUpper(text)
	i := strings.Index(up, "GLB")
	if j := strings.Index(up, "GLULAM"); i < 0 || (j >= 0 && j < i) {
		i = j
	}
	m := glulamStressClass.FindStringSubmatch(text)
	if i <= 0 || m == nil {
		return "", "", false
	}
	sec, err := check.ParseSize(strings.TrimSpace(text[:i]))
	if err != nil || !sec.Actual {
		return "", "", false
	}
	return sec.Name, strings.ToUpper(m[1]), true
}

// materialCallout reads a beam callout that ReadCallout did not size:
// glulam ("5 1/8 x 12 GLB 24F-1.8E"), a size in actual inches followed by
// a user material's word ("3 1/2 x 11 7/8 LVL", "1 3/4 x 11 7/8 LVL (2)",
// the word matched to the materials file's species case-insensitively,
// any words after it its grade), or a size in actual inches alone when
// the [[support]] names the material. species is "" when the callout
// gives only the size. msg says why the callout cannot be used: a word
// naming no user material is such an error, naming the word and the
// materials known, never a default.
func materialCallout(mats *check.Materials, callout, spMaterial, spGrade string) (size, species, grade, msg string) {
	if sz, class, ok := glulamCallout(callout); ok {
		return sz, check.GlulamSpecies, class, ""
	}
	mc, ok, err := check.ParseMaterialCallout(callout)
	switch {
	case ok && err != nil:
		return "", "", "", fmt.Sprintf("its callout: %v: check this beam by hand or correct the callout", err)
	case ok:
		gr := mc.Grade
		if sp, isSCL := mats.IsSCL(mc.Material); gr == "" && isSCL && spMaterial != "" {
			if same, _ := mats.IsSCL(spMaterial); same == sp {
				gr = spGrade
			}
		}
		sp, gr, err := mats.BeamMaterial(mc.Material, gr)
		if err != nil {
			return "", "", "", fmt.Sprintf("its callout %q: the word %q: %v", callout, mc.Material, err)
		}
		return mc.Size, sp, gr, ""
	}
	if sec, err := check.ParseSize(callout); err == nil && sec.Actual && spMaterial != "" {
		return sec.Name, "", "", ""
	}
	return "", "", "", fmt.Sprintf("its callout %q is not a size framecheck checks (sawn lumber such as (3) 2x12 or 4x12, "+
		"glulam such as 5 1/8 x 12 GLB 24F-1.8E, or structural composite lumber of the materials file by its name, such as "+
		"3 1/2 x 11 7/8 LVL): check this beam by hand", callout)
}

// beamInput builds check's input for beam b: its size from its callout or
// its [[support]] table, its lumber, its bearings, its own weight, its top
// edge braced where joists bear on it or hang from it, and the deflection
// limits of the strictest joists it carries (IBC 2018 Table 1604.3; a beam
// carrying none takes the floor limits). msg says why it cannot be
// checked.
func beamInput(p *project.Project, plan *framing.Plan, b *framing.Beam) (check.Member, float64, string) {
	sp := p.SupportOf(b.Layer)
	size := b.Size
	species, grade := p.Lumber.Species, p.Lumber.Grade
	mats := p.Materials
	if mats == nil {
		mats = check.BuiltinMaterials()
	}
	spMaterial, spGrade := "", ""
	if sp != nil {
		spMaterial, spGrade = sp.Material, sp.Grade
	}
	named := false // the material is named (glulam class or a user material), not [[support]] species and grade
	if size == "" && b.Callout != "" {
		sz, sp2, gr2, msg := materialCallout(mats, b.Callout, spMaterial, spGrade)
		if msg != "" {
			return check.Member{ID: b.ID}, 0, msg
		}
		size, named = sz, sp2 != ""
		if named {
			species, grade = sp2, gr2
		}
	}
	if size == "" && sp != nil && sp.Size != "" {
		size = sp.Size
		if sp.Plies > 1 {
			size = fmt.Sprintf("(%d) %s", sp.Plies, sp.Size)
		}
	}
	if size == "" {
		return check.Member{ID: b.ID}, 0, "no size: write its size beside it on a label layer (such as (3) 2x12) or give [[support]] size"
	}
	if !named && spMaterial != "" {
		sp2, gr2, err := mats.BeamMaterial(spMaterial, spGrade)
		if err != nil {
			return check.Member{ID: b.ID, Size: size}, 0, "[[support]] " + err.Error()
		}
		species, grade, named = sp2, gr2, true
	}
	if sp != nil && !named {
		if sp.Species != "" {
			species = sp.Species
		}
		if sp.Grade != "" {
			grade = sp.Grade
		}
	}
	sec, err := check.ParseSize(size)
	if err != nil {
		return check.Member{ID: b.ID, Size: size}, 0, err.Error()
	}
	cm := check.Member{ID: b.ID, Size: size, Species: species, Grade: grade, LengthIn: b.LengthIn, Use: "floor",
		SelfWeightPlf: sec.AreaIn2 / 144 * beamDensityPcf, TopBracedAtPoints: true}
	bs := append([]framing.BeamBearing(nil), b.Bearings...)
	sort.Slice(bs, func(i, j int) bool { return bs[i].AtIn < bs[j].AtIn })
	shift := 0.0
	if len(bs) > 0 && bs[0].AtIn < 0 {
		shift = -bs[0].AtIn
	}
	for _, br := range bs {
		lb := br.LengthIn
		if lb <= 0 {
			lb = 3.5 // a post of unknown size: a 4x post's 3.5 in (common practice, no source)
		}
		cm.Bearings = append(cm.Bearings, check.Bearing{AtIn: br.AtIn + shift, LengthIn: lb})
	}
	cm.LengthIn += shift
	if n := len(cm.Bearings); n > 0 && cm.Bearings[n-1].AtIn > cm.LengthIn {
		cm.LengthIn = cm.Bearings[n-1].AtIn
	}
	cm.OverhangStartIn = 0
	cm.OverhangEndIn = 0
	if msg := beamStrips(p, b, shift, &cm); msg != "" {
		return cm, shift, msg
	}
	live, total := project.DeflectionLimits("floor", "non-plaster")
	roof := true
	// a beam framing into it holds its top edge where it lands, as a
	// joist in a hanger does
	for _, k := range b.CarriedBeams {
		if k < 0 || k >= len(plan.Beams) {
			continue
		}
		o := &plan.Beams[k]
		for _, br := range o.Bearings {
			if br.Kind != framing.BeamOnBeam || br.Index < 0 || br.Index >= len(plan.Beams) || &plan.Beams[br.Index] != b {
				continue
			}
			ou := unitVec(o.Start, o.End)
			at := framing.Point{X: o.Start.X + ou.X*br.AtIn, Y: o.Start.Y + ou.Y*br.AtIn}
			bu := unitVec(b.Start, b.End)
			cm.TopBracingAtIn = append(cm.TopBracingAtIn, (at.X-b.Start.X)*bu.X+(at.Y-b.Start.Y)*bu.Y+shift)
		}
	}
	for _, c := range b.Carried {
		cm.TopBracingAtIn = append(cm.TopBracingAtIn, c.AtIn+shift)
		m := &plan.Members[c.Member]
		for _, zn := range m.Zones {
			if z := p.Zone(zn); z != nil && z.Use != "roof" {
				roof = false
			}
		}
	}
	if roof && len(b.Carried) > 0 {
		cm.Use = "roof"
		live, total = project.DeflectionLimits("roof", "non-plaster")
	}
	// never less strict than the zones of what it carries: a roof over a
	// plaster ceiling, a floor with a zone's own stricter limits (an audit
	// found beams held to the non-plaster limits whatever their zones)
	long := 0.0
	stricter := func(zn string) {
		if z := p.Zone(zn); z != nil {
			live, total = math.Max(live, z.LiveDeflectionLimit), math.Max(total, z.TotalDeflectionLimit)
			long = math.Max(long, z.LongTermDeflectionLimit)
		}
	}
	for _, c := range b.Carried {
		for _, zn := range plan.Members[c.Member].Zones {
			stricter(zn)
		}
	}
	for _, st := range b.Strips {
		stricter(st.Zone)
	}
	cm.LiveLimit, cm.TotalLimit, cm.LongTermLimit = live, total, long
	return cm, shift, ""
}

// unitVec is the unit vector from a to b (zero when they coincide).
func unitVec(a, b framing.Point) framing.Point {
	dx, dy := b.X-a.X, b.Y-a.Y
	l := math.Hypot(dx, dy)
	if l == 0 {
		return framing.Point{}
	}
	return framing.Point{X: dx / l, Y: dy / l}
}

// beamStrips loads beam b's check input cm with the strips beside edge
// joists that are the beam's (framing's Beam.Strips): load pieces from its
// start to its end, each the sum of the strips over it of their zone's area
// loads times their widths. cm.TribIn is 12 in, so a piece's loads, psf
// by name, are its line loads in plf (what the engine and the load path's
// totals take: w = psf x trib / 12). A strip's zone the project does not
// define is an error of the beam.
func beamStrips(p *project.Project, b *framing.Beam, shift float64, cm *check.Member) string {
	if len(b.Strips) == 0 {
		return ""
	}
	cuts := []float64{0, cm.LengthIn}
	for _, st := range b.Strips {
		cuts = append(cuts, st.FromIn+shift, st.ToIn+shift)
	}
	slices.Sort(cuts)
	cm.TribIn = 12
	for i := 0; i+1 < len(cuts); i++ {
		a, c := math.Max(cuts[i], 0), math.Min(cuts[i+1], cm.LengthIn)
		if c-a <= 0.01 {
			continue
		}
		var sum check.AreaLoads
		var zones []string
		for _, st := range b.Strips {
			if st.FromIn+shift > a+1e-9 || st.ToIn+shift < c-1e-9 {
				continue
			}
			z := p.Zone(st.Zone)
			if z == nil {
				return fmt.Sprintf("load zone %q of the strip beside it is drawn but the project file has no [[zone]] named so", st.Zone)
			}
			l, k := zoneLoads(z, 0), st.WidthIn/12
			ud := l.DeadPsf
			if l.HasUpliftDead {
				ud = l.UpliftDeadPsf
			}
			sum.DeadPsf += l.DeadPsf * k
			sum.LivePsf += l.LivePsf * k
			sum.RoofLivePsf += l.RoofLivePsf * k
			sum.SnowPsf += l.SnowPsf * k
			sum.WindDownPsf += l.WindDownPsf * k
			sum.WindUpPsf += l.WindUpPsf * k
			sum.UpliftDeadPsf += ud * k
			sum.HasUpliftDead = true
			if !slices.Contains(zones, st.Zone) {
				zones = append(zones, st.Zone)
			}
		}
		if n := len(cm.LoadPieces); n > 0 && cm.LoadPieces[n-1].Loads == sum {
			cm.LoadPieces[n-1].ToIn = c // the same loads go on
			continue
		}
		cm.LoadPieces = append(cm.LoadPieces, check.LoadPiece{FromIn: a, ToIn: c, Zone: strings.Join(zones, "+"), Loads: sum})
	}
	if n := len(cm.LoadPieces); n > 0 {
		cm.LoadPieces[0].FromIn, cm.LoadPieces[n-1].ToIn = 0, cm.LengthIn
	}
	return ""
}

// postWeightLb is post pc's own weight, lb, at beamDensityPcf; 0 when
// its size or height is not known.
func postWeightLb(pc check.Post) float64 {
	sec, err := check.ParseSize(pc.Size)
	if err != nil || !(pc.HeightIn > 0) {
		return 0
	}
	return sec.AreaIn2 / 144 * pc.HeightIn / 12 * beamDensityPcf
}

// postInput builds check's input for post pt from its [[post]] table and
// the size beside it; checked is false when its size or height is not
// known (its load is then only reported).
func postInput(p *project.Project, pt *framing.Post) (check.Post, bool, string) {
	pc := check.Post{ID: pt.ID, Species: p.Lumber.Species, Grade: p.Lumber.Grade}
	if t := p.PostFor(pt.Pos.Layer); t != nil {
		pc.Size, pc.HeightIn, pc.Ke = t.Size, t.HeightIn, t.Ke
		if t.Species != "" {
			pc.Species = t.Species
		}
		if t.Grade != "" {
			pc.Grade = t.Grade
		}
	}
	if pt.Text != "" {
		if c, err := framing.ReadCallout(pt.Text); err == nil && c.Size != "" {
			pc.Size = c.Designation()
			if c.Species != "" {
				pc.Species = c.Species
			}
			if c.Grade != "" {
				pc.Grade = c.Grade
			}
		}
	}
	return pc, pc.Size != "" && pc.HeightIn > 0, pc.Size
}
