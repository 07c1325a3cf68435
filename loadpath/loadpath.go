// Package loadpath follows the loads of a framing plan down to the
// foundation: joists to the beams they bear on, beams to girders, posts and
// walls (DOMAIN.md "The load path").
//
// It takes members already described for package check (geometry, size,
// their own loads) and, for each bearing, what carries it: another member
// at a position along it, a post, a wall, or a rigid support (a support
// that is not followed further). It orders the members so that each is
// solved after every member it carries (a cycle is an error naming its
// members), checks each one, passes its reactions by load type (D, L, Lr,
// S, W toward, W away, and the dead load relied on against uplift) to its
// carriers as point loads, checks the posts under their loads, and states
// the demand at every joint (down and up, ASD, with the combinations) and
// the loads reaching walls and posts by load type.
//
// Nothing is lost: the loads reaching posts, walls and rigid supports equal
// the loads put on the plan, load type by load type (Totals). It knows
// framing and check only through check's types; it reads no drawing and
// writes no file.
package loadpath

import (
	"encoding/binary"
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"framecheck/check"
	"framecheck/internal/par"
)

// CarrierKind says what carries a bearing.
type CarrierKind int

const (
	Rigid  CarrierKind = iota // a support not followed further (a wall line, a beam left rigid)
	Wall                      // a bearing wall: the load goes to the foundation along it
	Post                      // a post: its load goes down it to its base
	Member                    // another member: the reaction is a point load on it
)

func (k CarrierKind) String() string {
	return [...]string{"rigid", "wall", "post", "member"}[k]
}

// Carrier is what carries one bearing of a member.
type Carrier struct {
	Kind  CarrierKind
	Index int     // into Plan.Members, Plan.Posts or Plan.Walls; unused for Rigid
	AtIn  float64 // Member: position along the carrying member, from its start
	// Joint names the kind of connection for the connector schedule:
	// "hanger", "bearing", "post cap", "wall"; "" picks one from the kinds.
	Joint string
}

// MemberIn is one member of the plan with what carries each of its
// bearings (Carriers[j] carries Check.Bearings[j]).
type MemberIn struct {
	ID       string
	Beam     bool          // a beam or girder, not a joist: for the outputs
	Check    *check.Member // not nil; read, never changed by Solve
	Carriers []Carrier
	// Result and Reactions, when given, are the member's check and its
	// reactions by load type already found (a joist checked with its run's
	// blocking rows; identical joists share them); Solve then neither
	// checks nor analyses it again. Only a member that receives no load
	// from another may come with them.
	Result    *check.Result
	Reactions []check.LoadReactions
	// Candidates, when given, are the sizes to pick from (lightest first):
	// the member takes the first with which it passes, or the last when
	// none does. DensityPcf, when above 0, gives its own weight for each
	// size tried (Check.SelfWeightPlf = area x density).
	Candidates []string
	DensityPcf float64
}

// PostIn is a post; its loads come from the members it carries.
type PostIn struct {
	ID    string
	Check check.Post // size, species, grade, height; Loads are filled in
	// Checked: the post has a size and height to be checked as a column;
	// otherwise its load is only reported.
	Checked bool
	// SelfWeightLb is the post's own weight, added to the dead load it
	// takes down (0 when its size or height is not known)
	SelfWeightLb float64
}

// WallIn is a bearing wall line.
type WallIn struct {
	ID string
}

// Plan is the input of Solve.
type Plan struct {
	Members []MemberIn
	Posts   []PostIn
	Walls   []WallIn
}

// Loads are loads by type, lb (wind away from the member as a magnitude;
// UpliftDeadLb the dead load relied on against uplift).
type Loads = check.PostLoads

// Joint is the demand at one connection: a bearing of a member on its
// carrier, with the loads passed by type and the ASD extremes.
type Joint struct {
	Member    int // index into Plan.Members
	Bearing   int
	Carrier   Carrier
	Kind      string // hanger, bearing, post cap, wall
	Loads     Loads
	DownLb    float64
	DownCombo string
	UpLb      float64 // net uplift, magnitude
	UpCombo   string
	// own is the member's own check's reaction at this bearing, when it
	// has one: its largest down and up over every combination with the
	// live-type loads placed span by span, which Loads (each type over the
	// whole member) cannot give a continuous member
	own *check.Reaction
}

// MemberOut is a member's outcome. A member given with its check and
// reactions (MemberIn.Result and Reactions) that receives no load from
// another keeps them with the caller: its outcome holds only Order and
// Passed, and its MemberCheck is nil (a plan's joists are most of its
// members, and a full outcome each was most of the solve's memory).
type MemberOut struct {
	*MemberCheck
	Order  int // position in the solving order
	Passed []check.LoadReactions
}

// MemberCheck is a member as the load path checked it.
type MemberCheck struct {
	Input  check.Member // as checked: with the point loads it received
	Result check.Result // Status error with the reason when it could not be checked
}

// PostOut is a post's outcome.
type PostOut struct {
	Loads  Loads
	Result check.PostResult // when the post is checked
	Cases  []check.PostCase // every combination's load
}

// Outcome is what Solve found.
type Outcome struct {
	Members []MemberOut
	Posts   []PostOut
	Walls   []Loads // total loads reaching each wall
	Joints  []Joint
	// Applied is the total of the loads put on the plan (area loads on the
	// members, point loads other than passed reactions, self-weight), and
	// Delivered the total reaching walls, posts and rigid supports, by
	// load type: they are equal when nothing is lost.
	Applied, Delivered Loads
	// ToRigid is the part of Delivered reaching rigid supports (beams
	// left rigid, supports not followed): no wall line or post of the
	// plan, so no foundation line of its own
	ToRigid Loads
	Errors  []string
}

// Solve follows the loads of p down its load path under settings s.
func Solve(p *Plan, s check.Settings) *Outcome {
	o := &Outcome{Members: make([]MemberOut, len(p.Members)), Posts: make([]PostOut, len(p.Posts)),
		Walls: make([]Loads, len(p.Walls))}
	order, cyc := orderMembers(p)
	for _, k := range cyc {
		o.Members[k].MemberCheck = &MemberCheck{}
		o.Members[k].Result = errorResult(p.Members[k], "the load path runs in a circle through "+names(p, cyc)+
			": each of these members bears on another of them; draw which one carries which")
	}
	if len(cyc) > 0 {
		o.Errors = append(o.Errors, "load path cycle: "+names(p, cyc))
	}
	st := &solveState{p: p, s: s, o: o, order: order, incoming: make([][]check.PointLoad, len(p.Members)),
		solved: map[string]*solvedMember{}, fedIn: make([]int, len(p.Members))}
	o.Joints = make([]Joint, 0, countJoints(p))
	st.sizeIncoming()
	// The members in order, a batch at a time: a batch is a stretch of the
	// order where none passes a load to another, so that their inputs are
	// complete when it starts. Its inputs and its analyses run on every
	// core, each writing its own members; what adds up or appends (joints,
	// loads passed on, totals, errors) follows the order, one member after
	// the other, as if solved one by one.
	for lo, batch := 0, 1; lo < len(order); batch++ {
		hi := st.batchEnd(lo, batch)
		st.prepare(lo, hi)
		st.analyse(lo, hi)
		for i := lo; i < hi; i++ {
			st.pass(i, i-lo)
		}
		lo = hi
	}
	// Each joint's demand depends on its own loads only: both cores, each
	// range writing its own joints; the posts' checks likewise
	// (checkPosts).
	par.Ranges(len(o.Joints), func(lo, hi int) {
		demands(o.Joints[lo:hi], s)
	})
	// each post's own weight, on the foundation under it (and in the
	// totals put on and delivered)
	for i := range p.Posts {
		if w := p.Posts[i].SelfWeightLb; w > 0 {
			l := Loads{DeadLb: w, UpliftDeadLb: w, HasUpliftDead: true}
			addLoads(&o.Posts[i].Loads, l)
			addLoads(&o.Applied, l)
			addLoads(&o.Delivered, l)
		}
	}
	checkPosts(p.Posts, o.Posts, s)
	return o
}

// checkPosts states the cases of each post of ps under the loads found
// (outs[i].Loads) and checks those to be checked. A post's cases depend
// on its loads only, its check on the post but for its ID: posts alike
// (the same check but for the ID, the same loads; a plan repeats its
// posts beam line after beam line) are worked out once and share the
// result's lists, each keeping its own ID (the post's when its check names
// none). Which posts are alike is found in order, so that the first of
// each is worked out and the same posts share on any number of cores; the
// distinct ones are worked out on every core.
func checkPosts(ps []PostIn, outs []PostOut, s check.Settings) {
	caseOf, postOf := make([]int, len(ps)), make([]int, len(ps))
	caseIdx, postIdx := map[Loads]int{}, map[check.Post]int{}
	var caseKeys []Loads
	var postKeys []check.Post
	for i := range ps {
		po := &outs[i]
		po.Loads.HasUpliftDead = true
		c, ok := caseIdx[po.Loads]
		if !ok {
			c = len(caseKeys)
			caseIdx[po.Loads] = c
			caseKeys = append(caseKeys, po.Loads)
		}
		caseOf[i], postOf[i] = c, -1
		if !ps[i].Checked {
			continue
		}
		pc := ps[i].Check
		pc.Loads, pc.ID = po.Loads, ""
		k, ok := postIdx[pc]
		if !ok {
			k = len(postKeys)
			postIdx[pc] = k
			postKeys = append(postKeys, pc)
		}
		postOf[i] = k
	}
	cases := make([][]check.PostCase, len(caseKeys))
	results := make([]check.PostResult, len(postKeys))
	par.Each(len(caseKeys)+len(postKeys), func(t int) {
		if t < len(caseKeys) {
			cases[t] = check.LoadCases(caseKeys[t], s)
		} else {
			results[t-len(caseKeys)] = check.CheckPost(postKeys[t-len(caseKeys)], s)
		}
	})
	for i := range ps {
		po := &outs[i]
		po.Cases = cases[caseOf[i]]
		if postOf[i] < 0 {
			continue
		}
		r := results[postOf[i]]
		r.ID = ps[i].Check.ID
		if r.ID == "" {
			r.ID = ps[i].ID
		}
		po.Result = r
	}
}

// countJoints returns how many joints Solve states at most: a beam's
// bearings, and a joist's bearings on a member or a post.
func countJoints(p *Plan) int {
	n := 0
	for i := range p.Members {
		n += len(p.Members[i].Carriers) // every bearing is a joint
	}
	return n
}

// solvedMember is one analysis of a member, shared by the members alike
// for design (appendSolveKey).
type solvedMember struct {
	rep       int          // the member analysed: the first of them in the order
	input     check.Member // as analysed: the size picked, its weight
	result    check.Result
	reactions []check.LoadReactions
	err       error
}

// solveState is Solve's work in progress.
type solveState struct {
	p        *Plan
	s        check.Settings
	o        *Outcome
	order    []int
	incoming [][]check.PointLoad      // the reactions passed to each member so far
	solved   map[string]*solvedMember // by appendSolveKey
	fedIn    []int                    // the batch that passes a load to each member (0: none yet)
	// for the members of the batch, by position in the order from its
	// start: how each is solved and, when analysed, its analysis
	how  []solveHow
	keys []string
	sv   []*solvedMember
	todo []*solvedMember // the analyses the batch has to make
}

// solveHow says how a member of a batch is solved.
type solveHow uint8

const (
	howMismatch solveHow = iota // its carriers and bearings differ in number: an error
	howGiven                    // its check and reactions came with it
	howAnalyse                  // analysed (or alike to a member analysed)
)

// sizeIncoming gives each member room for the reactions passed to it, one
// per bearing of another member on it, in one array: passing them on
// appends without growing.
func (st *solveState) sizeIncoming() {
	n := make([]int, len(st.p.Members))
	total := 0
	for i := range st.p.Members {
		for _, c := range st.p.Members[i].Carriers {
			if c.Kind == Member && c.Index >= 0 && c.Index < len(n) {
				n[c.Index]++
				total++
			}
		}
	}
	all := make([]check.PointLoad, total)
	off := 0
	for k, c := range n {
		if c > 0 {
			st.incoming[k] = all[off : off : off+c]
			off += c
		}
	}
}

// batchEnd returns where the batch starting at order[lo] ends: before the
// first member that a member of the batch passes a load to.
func (st *solveState) batchEnd(lo, batch int) int {
	hi := lo
	for ; hi < len(st.order); hi++ {
		k := st.order[hi]
		if hi > lo && st.fedIn[k] == batch {
			break
		}
		for _, c := range st.p.Members[k].Carriers {
			if c.Kind == Member && c.Index >= 0 && c.Index < len(st.fedIn) {
				st.fedIn[c.Index] = batch
			}
		}
	}
	return hi
}

// prepare writes the input of each member of the batch order[lo:hi] (its
// own point loads, then those passed to it), how it is solved and, when
// its check came with it, its result and reactions, on every core.
func (st *solveState) prepare(lo, hi int) {
	n := hi - lo
	st.how = slices.Grow(st.how[:0], n)[:n]
	st.keys = slices.Grow(st.keys[:0], n)[:n]
	st.sv = slices.Grow(st.sv[:0], n)[:n]
	par.Ranges(n, func(a, b int) {
		var key []byte
		for x := a; x < b; x++ {
			i := lo + x
			k := st.order[i]
			mi := &st.p.Members[k]
			out := &st.o.Members[k]
			out.Order = i
			in := st.incoming[k]
			st.keys[x], st.sv[x] = "", nil
			if mi.Result != nil && mi.Reactions != nil && len(in) == 0 && len(mi.Carriers) == len(mi.Check.Bearings) {
				// checked already and nothing added: its input and
				// result are the caller's (MemberOut says so), only its
				// reactions are passed on
				st.how[x] = howGiven
				out.Passed = mi.Reactions
				continue
			}
			out.MemberCheck = &MemberCheck{Input: *mi.Check}
			out.Input.PointLoads = nil // none: nil, as the copy of none
			if n := len(mi.Check.PointLoads) + len(in); n > 0 {
				out.Input.PointLoads = append(append(make([]check.PointLoad, 0, n), mi.Check.PointLoads...), in...)
			}
			switch {
			case len(mi.Carriers) != len(mi.Check.Bearings):
				st.how[x] = howMismatch
			default:
				st.how[x] = howAnalyse
				key = appendSolveKey(key[:0], &out.Input, mi)
				st.keys[x] = string(key)
			}
		}
	})
}

// analyse makes the analyses of the batch order[lo:hi]: members alike
// for design (the same input but for the ID and the names of the loads
// they carry, the same candidates) are analysed once, as the first of them
// in the order (a plan repeats its beams run after run); the analyses run
// on every core.
func (st *solveState) analyse(lo, hi int) {
	st.todo = st.todo[:0]
	for x := range hi - lo {
		if st.how[x] != howAnalyse {
			continue
		}
		sv, ok := st.solved[st.keys[x]]
		if !ok {
			sv = &solvedMember{rep: st.order[lo+x]}
			st.solved[st.keys[x]] = sv
			st.todo = append(st.todo, sv)
		}
		st.sv[x] = sv
	}
	par.Each(len(st.todo), func(t int) {
		sv := st.todo[t]
		mi := &st.p.Members[sv.rep]
		cm := st.o.Members[sv.rep].Input
		if len(mi.Candidates) > 0 {
			cm = pickSize(cm, mi, st.s)
		}
		sv.input = cm
		sv.result, sv.reactions, sv.err = check.CheckMemberReactions(cm, st.s)
	})
}

// pass states the outcome of the member at order[i], the x-th of its
// batch, and passes its reactions on: to the members that carry it as
// point loads, to posts, walls and rigid supports as loads, and to the
// joints.
func (st *solveState) pass(i, x int) {
	p, o := st.p, st.o
	k := st.order[i]
	mi := &p.Members[k]
	out := &o.Members[k]
	var rs []check.LoadReactions
	var err error
	switch st.how[x] {
	case howMismatch:
		out.Result = errorResult(*mi, fmt.Sprintf("%d carriers for %d bearings", len(mi.Carriers), len(out.Input.Bearings)))
		o.Errors = append(o.Errors, mi.ID+": "+out.Result.Messages[0])
		return
	case howGiven:
		rs = out.Passed // and its Result, set by prepare
	default:
		sv := st.sv[x]
		out.Input.Size, out.Input.SelfWeightPlf = sv.input.Size, sv.input.SelfWeightPlf
		out.Result, rs, err = sv.result, sv.reactions, sv.err
		out.Result.ID = out.Input.ID
	}
	// its own loads, as checked (the size picked sets its weight)
	if st.how[x] == howGiven {
		addApplied(&o.Applied, mi.Check, mi.Check.PointLoads)
	} else {
		addApplied(&o.Applied, &out.Input, mi.Check.PointLoads)
	}
	if err != nil {
		// nothing passes on from a member that cannot be analysed: its
		// carriers are short of its load, which the outcome says
		o.Errors = append(o.Errors, mi.ID+": its reactions could not be found ("+err.Error()+"); the members under it miss its load")
		return
	}
	out.Passed = rs
	// the member's own check, whose reactions pattern the live-type loads
	var res *check.Result
	switch {
	case st.how[x] == howGiven:
		res = mi.Result
	case out.MemberCheck != nil:
		res = &out.Result
	}
	for j, r := range rs {
		c := mi.Carriers[j]
		l := loadsOf(r)
		// every joint's demand is stated (DOMAIN.md "The load path"): a
		// joist's on a wall or a support not followed further too (the
		// hanger on a flush beam kept rigid, the tie at a wall)
		jt := joint(k, j, c, l)
		jt.own = ownReaction(res, j)
		o.Joints = append(o.Joints, jt)
		switch c.Kind {
		case Member:
			st.incoming[c.Index] = append(st.incoming[c.Index], r.PointLoad(c.AtIn, mi.ID))
		case Post:
			addLoads(&o.Posts[c.Index].Loads, l)
			addLoads(&o.Delivered, l)
		case Wall:
			addLoads(&o.Walls[c.Index], l)
			addLoads(&o.Delivered, l)
		default:
			addLoads(&o.Delivered, l)
			addLoads(&o.ToRigid, l)
		}
	}
}

// appendSolveKey appends to b what makes two members alike for Solve: the
// check input but for the ID and the names of the point loads (which
// member put them there: the analysis does not read them), with the
// candidate sizes and the density that weighs them.
func appendSolveKey(b []byte, cm *check.Member, mi *MemberIn) []byte {
	b = check.AppendMemberKeyUnnamed(b, cm)
	b = binary.AppendUvarint(b, uint64(len(mi.Candidates)))
	for _, c := range mi.Candidates {
		b = binary.AppendUvarint(b, uint64(len(c)))
		b = append(b, c...)
	}
	return binary.LittleEndian.AppendUint64(b, math.Float64bits(mi.DensityPcf))
}

// pickSize returns cm with the first of mi's candidate sizes with which it
// passes, or the last candidate when none does; sizes that cannot be read
// are passed over.
func pickSize(cm check.Member, mi *MemberIn, s check.Settings) check.Member {
	var last check.Member
	tried := false
	for _, size := range mi.Candidates {
		sec, err := check.ParseSize(size)
		if err != nil {
			continue
		}
		c := cm
		c.Size = size
		if mi.DensityPcf > 0 {
			c.SelfWeightPlf = sec.AreaIn2 / 144 * mi.DensityPcf
		}
		last, tried = c, true
		if check.CheckMember(c, s).Status == check.StatusPass {
			return c
		}
	}
	if !tried {
		return cm
	}
	return last
}

// orderMembers returns the members in an order where each comes after
// every member it carries (Kahn's algorithm), and the members left in or
// behind a cycle.
func orderMembers(p *Plan) (order, cyc []int) {
	n := len(p.Members)
	waiting := make([]int, n) // members still to pass loads to k
	// the members carrying k are carrying[start[k]:start[k+1]], in the
	// order of k's carriers
	start := make([]int, n+1)
	carries := func(k int, c Carrier) bool {
		return c.Kind == Member && c.Index >= 0 && c.Index < n && c.Index != k
	}
	for k := range p.Members {
		for _, c := range p.Members[k].Carriers {
			if carries(k, c) {
				waiting[c.Index]++
				start[k+1]++
			}
		}
	}
	for k := 0; k < n; k++ {
		start[k+1] += start[k]
	}
	carrying := make([]int, start[n])
	for k := range p.Members {
		at := start[k]
		for _, c := range p.Members[k].Carriers {
			if carries(k, c) {
				carrying[at] = c.Index
				at++
			}
		}
	}
	order = make([]int, 0, n)
	for k := range p.Members {
		if waiting[k] == 0 {
			order = append(order, k)
		}
	}
	// order is also the queue: the members ready, in the order they became so
	for next := 0; next < len(order); next++ {
		k := order[next]
		for _, c := range carrying[start[k]:start[k+1]] {
			if waiting[c]--; waiting[c] == 0 {
				order = append(order, c)
			}
		}
	}
	for k := range p.Members {
		if waiting[k] > 0 {
			cyc = append(cyc, k)
		}
	}
	return order, cyc
}

func names(p *Plan, ks []int) string {
	var s []string
	for _, k := range ks {
		s = append(s, p.Members[k].ID)
	}
	sort.Strings(s)
	return strings.Join(s, ", ")
}

func errorResult(m MemberIn, msg string) check.Result {
	return check.Result{ID: m.ID, Size: m.Check.Size, Species: m.Check.Species, Grade: m.Check.Grade,
		Status: check.StatusError, Messages: []string{msg}}
}

func loadsOf(r check.LoadReactions) Loads {
	return Loads{DeadLb: r.DeadLb, LiveLb: r.LiveLb, RoofLiveLb: r.RoofLiveLb, SnowLb: r.SnowLb,
		WindDownLb: r.WindDownLb, WindUpLb: r.WindUpLb, UpliftDeadLb: r.UpliftDeadLb, HasUpliftDead: true}
}

func addLoads(dst *Loads, l Loads) {
	dst.DeadLb += l.DeadLb
	dst.LiveLb += l.LiveLb
	dst.RoofLiveLb += l.RoofLiveLb
	dst.SnowLb += l.SnowLb
	dst.WindDownLb += l.WindDownLb
	dst.WindUpLb += l.WindUpLb
	dst.UpliftDeadLb += l.UpliftDeadLb
	dst.HasUpliftDead = true
}

// addApplied adds the loads member m itself puts on the plan: its area
// loads on its tributary width over each stretch, its own weight and its
// point loads pls (reactions passed by other members are added by them).
func addApplied(dst *Loads, m *check.Member, pls []check.PointLoad) {
	t := m.TribIn / 144 // psf x in / 144 = lb/in
	add := func(l check.AreaLoads, lenIn float64) {
		ud := l.DeadPsf
		if l.HasUpliftDead {
			ud = l.UpliftDeadPsf
		}
		addLoads(dst, Loads{DeadLb: l.DeadPsf * t * lenIn, LiveLb: l.LivePsf * t * lenIn, RoofLiveLb: l.RoofLivePsf * t * lenIn,
			SnowLb: l.SnowPsf * t * lenIn, WindDownLb: l.WindDownPsf * t * lenIn / cos2(m), WindUpLb: l.WindUpPsf * t * lenIn / cos2(m),
			UpliftDeadLb: ud * t * lenIn})
	}
	if len(m.LoadPieces) == 0 {
		add(m.Loads, m.LengthIn)
	} else {
		for _, p := range m.LoadPieces {
			add(p.Loads, p.ToIn-p.FromIn)
		}
	}
	sw := m.SelfWeightPlf / 12 * m.LengthIn
	addLoads(dst, Loads{DeadLb: sw, UpliftDeadLb: sw})
	for _, p := range pls {
		ud := p.DeadLb
		if p.HasUpliftDead {
			ud = p.UpliftDeadLb
		}
		addLoads(dst, Loads{DeadLb: p.DeadLb, LiveLb: p.LiveLb, RoofLiveLb: p.RoofLiveLb, SnowLb: p.SnowLb,
			WindDownLb: p.WindDownLb, WindUpLb: p.WindUpLb, UpliftDeadLb: ud})
	}
}

// cos2 is the factor check applies to wind on a sloped rafter (wind
// normal to the roof, per sloped area, on the horizontal projection:
// 1 / cos^2 of the slope; statics).
func cos2(m *check.Member) float64 {
	if m.PitchRise12 <= 0 {
		return 1
	}
	return 144 / (144 + m.PitchRise12*m.PitchRise12)
}

// joint is the joint at bearing j of member k on carrier c passing loads
// l; its demand is found by demands.
func joint(k, j int, c Carrier, l Loads) Joint {
	jt := Joint{Member: k, Bearing: j, Carrier: c, Kind: c.Joint, Loads: l}
	if jt.Kind == "" {
		jt.Kind = defaultJointKind[c.Kind]
	}
	return jt
}

// defaultJointKind names a joint whose carrier names none, by the kind of
// carrier.
var defaultJointKind = map[CarrierKind]string{Member: "bearing on a member", Post: "post cap", Wall: "wall", Rigid: "bearing"}

// ownReaction returns the reaction of res at bearing j, or nil.
func ownReaction(res *check.Result, j int) *check.Reaction {
	if res == nil {
		return nil
	}
	for i := range res.Reactions {
		if res.Reactions[i].Bearing == j {
			return &res.Reactions[i]
		}
	}
	return nil
}

// demands states the demand of each joint of js under settings s: the
// largest downward load and net uplift of its combinations
// (check.LoadExtremes), or of the member's own check where that is more
// (Joint.own: a continuous joist with snow on one span presses harder on
// an end wall, and lifts harder off it under wind on one span, than with
// every load over both; an audit found a wall joint's uplift 31 % low).
// Joints passing the same loads (the joists alike) have the same demand
// from their loads, found once.
func demands(js []Joint, s check.Settings) {
	type demand struct {
		down, up           float64
		downCombo, upCombo string
	}
	seen := map[Loads]demand{}
	var d demand
	for i := range js {
		jt := &js[i]
		// joints alike mostly follow one another: one passing the loads
		// of the joint before takes its demand without a look-up (a NaN
		// is never equal: looked up, and worked out again, as before)
		if i == 0 || jt.Loads != js[i-1].Loads {
			var ok bool
			if d, ok = seen[jt.Loads]; !ok {
				d.down, d.downCombo, d.up, d.upCombo = check.LoadExtremes(jt.Loads, s)
				seen[jt.Loads] = d
			}
		}
		jt.DownLb, jt.DownCombo, jt.UpLb, jt.UpCombo = d.down, d.downCombo, d.up, d.upCombo
		if r := jt.own; r != nil {
			if r.DownLb > jt.DownLb {
				jt.DownLb, jt.DownCombo = r.DownLb, r.DownCombo
			}
			if r.UpLb > jt.UpLb {
				jt.UpLb, jt.UpCombo = r.UpLb, r.UpCombo
			}
			jt.own = nil // read: the joint holds no member's result
		}
	}
}
