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
	"fmt"
	"sort"
	"strconv"
	"strings"

	"framecheck/check"
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
	Beam     bool // a beam or girder, not a joist: for the outputs
	Check    check.Member
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
}

// MemberOut is a member's outcome.
type MemberOut struct {
	Input  check.Member // as checked: with the point loads it received
	Result check.Result // Status error with the reason when it could not be checked
	Order  int          // position in the solving order
	Passed []check.LoadReactions
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
	Errors             []string
}

// Solve follows the loads of p down its load path under settings s.
func Solve(p *Plan, s check.Settings) *Outcome {
	o := &Outcome{Members: make([]MemberOut, len(p.Members)), Posts: make([]PostOut, len(p.Posts)),
		Walls: make([]Loads, len(p.Walls))}
	order, cyc := orderMembers(p)
	for _, k := range cyc {
		o.Members[k].Result = errorResult(p.Members[k], "the load path runs in a circle through "+names(p, cyc)+
			": each of these members bears on another of them; draw which one carries which")
	}
	if len(cyc) > 0 {
		o.Errors = append(o.Errors, "load path cycle: "+names(p, cyc))
	}
	incoming := make([][]check.PointLoad, len(p.Members))
	solved := map[string]solvedMember{}
	for i, k := range order {
		mi := &p.Members[k]
		cm := mi.Check
		cm.PointLoads = append(append([]check.PointLoad(nil), cm.PointLoads...), incoming[k]...)
		out := &o.Members[k]
		out.Order, out.Input = i, cm
		if len(mi.Carriers) != len(cm.Bearings) {
			out.Result = errorResult(*mi, fmt.Sprintf("%d carriers for %d bearings", len(mi.Carriers), len(cm.Bearings)))
			o.Errors = append(o.Errors, mi.ID+": "+out.Result.Messages[0])
			continue
		}
		var rs []check.LoadReactions
		var err error
		if mi.Result != nil && mi.Reactions != nil && len(incoming[k]) == 0 {
			out.Result, rs = *mi.Result, mi.Reactions
		} else {
			// Members alike for design (the same input but for the ID and
			// the names of the loads they carry, the same candidates) are
			// analysed once: a plan repeats its beams run after run.
			key := solveKey(cm, mi)
			sv, ok := solved[key]
			if !ok {
				if len(mi.Candidates) > 0 {
					cm = pickSize(cm, mi, s)
				}
				sv.input = cm
				sv.result, sv.reactions, sv.err = check.CheckMemberReactions(cm, s)
				solved[key] = sv
			}
			cm.Size, cm.SelfWeightPlf = sv.input.Size, sv.input.SelfWeightPlf
			out.Input = cm
			out.Result, rs, err = sv.result, sv.reactions, sv.err
			out.Result.ID = cm.ID
		}
		own := cm // its own loads, as checked (the size picked sets its weight)
		own.PointLoads = mi.Check.PointLoads
		addApplied(&o.Applied, own)
		if err != nil {
			// nothing passes on from a member that cannot be analysed: its
			// carriers are short of its load, which the outcome says
			o.Errors = append(o.Errors, mi.ID+": its reactions could not be found ("+err.Error()+"); the members under it miss its load")
			continue
		}
		out.Passed = rs
		for j, r := range rs {
			c := mi.Carriers[j]
			l := loadsOf(r)
			// the joints to state: a beam's, and a joist's on a beam or a post
			if mi.Beam || c.Kind == Member || c.Kind == Post {
				o.Joints = append(o.Joints, joint(k, j, c, l, s))
			}
			switch c.Kind {
			case Member:
				incoming[c.Index] = append(incoming[c.Index], r.PointLoad(c.AtIn, mi.ID))
			case Post:
				addLoads(&o.Posts[c.Index].Loads, l)
				addLoads(&o.Delivered, l)
			case Wall:
				addLoads(&o.Walls[c.Index], l)
				addLoads(&o.Delivered, l)
			default:
				addLoads(&o.Delivered, l)
			}
		}
	}
	// Posts alike (the same check but for the ID, the same loads) are
	// checked once and share the result's lists: a plan repeats its posts
	// beam line after beam line.
	cases := map[Loads][]check.PostCase{}
	posts := map[check.Post]check.PostResult{}
	for i := range p.Posts {
		po := &o.Posts[i]
		po.Loads.HasUpliftDead = true
		cs, ok := cases[po.Loads]
		if !ok {
			cs = check.LoadCases(po.Loads, s)
			cases[po.Loads] = cs
		}
		po.Cases = cs
		if p.Posts[i].Checked {
			pc := p.Posts[i].Check
			pc.Loads = po.Loads
			id := pc.ID
			if id == "" {
				id = p.Posts[i].ID
			}
			pc.ID = ""
			r, ok := posts[pc]
			if !ok {
				r = check.CheckPost(pc, s)
				posts[pc] = r
			}
			r.ID = id
			po.Result = r
		}
	}
	return o
}

// solvedMember is one analysis of a member, shared by the members alike
// for design (solveKey).
type solvedMember struct {
	input     check.Member // as analysed: the size picked, its weight
	result    check.Result
	reactions []check.LoadReactions
	err       error
}

// solveKey is what makes two members alike for Solve: the check input but
// for the ID and the names of the point loads (which member put them
// there: the analysis does not read them), with the candidate sizes.
func solveKey(cm check.Member, mi *MemberIn) string {
	if len(cm.PointLoads) > 0 {
		pls := make([]check.PointLoad, len(cm.PointLoads))
		copy(pls, cm.PointLoads)
		for i := range pls {
			pls[i].Name = ""
		}
		cm.PointLoads = pls
	}
	return check.MemberKey(cm) + "|" + strings.Join(mi.Candidates, "|") + "|" + strconv.FormatFloat(mi.DensityPcf, 'g', -1, 64)
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
	carriedBy := make([][]int, n)
	for k, m := range p.Members {
		for _, c := range m.Carriers {
			if c.Kind == Member && c.Index >= 0 && c.Index < n && c.Index != k {
				waiting[c.Index]++
				carriedBy[k] = append(carriedBy[k], c.Index)
			}
		}
	}
	var ready []int
	for k := range p.Members {
		if waiting[k] == 0 {
			ready = append(ready, k)
		}
	}
	for len(ready) > 0 {
		k := ready[0]
		ready = ready[1:]
		order = append(order, k)
		for _, c := range carriedBy[k] {
			if waiting[c]--; waiting[c] == 0 {
				ready = append(ready, c)
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
// point loads (reactions passed by other members are added by them).
func addApplied(dst *Loads, m check.Member) {
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
	for _, p := range m.PointLoads {
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
func cos2(m check.Member) float64 {
	if m.PitchRise12 <= 0 {
		return 1
	}
	return 144 / (144 + m.PitchRise12*m.PitchRise12)
}

// joint states the demand at bearing j of member k on carrier c.
func joint(k, j int, c Carrier, l Loads, s check.Settings) Joint {
	jt := Joint{Member: k, Bearing: j, Carrier: c, Kind: c.Joint, Loads: l}
	if jt.Kind == "" {
		jt.Kind = map[CarrierKind]string{Member: "bearing on a member", Post: "post cap", Wall: "wall", Rigid: "bearing"}[c.Kind]
	}
	for _, pc := range check.LoadCases(l, s) {
		if pc.PLb > jt.DownLb {
			jt.DownLb, jt.DownCombo = pc.PLb, pc.Name
		}
		if -pc.PLb > jt.UpLb {
			jt.UpLb, jt.UpCombo = -pc.PLb, pc.Name
		}
	}
	return jt
}
