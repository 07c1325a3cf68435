package loadpath

import (
	"fmt"
	"math"
	"reflect"
	"runtime"
	"strings"
	"testing"

	"framecheck/check"
)

func near(t *testing.T, what string, got, want, tol float64, src string) {
	t.Helper()
	if math.Abs(got-want) > tol || math.IsNaN(got) {
		t.Errorf("%s = %.4f, want %.4f (tol %g) [%s]", what, got, want, tol, src)
	}
}

// twoLevelPlan: five 2x10 roof joists at 16 in, 144 in span, D 12, Lr 20,
// W up 30 psf, bearing on a wall at one end and hanging from a flush beam
// B1 at the other, at 16, 32, 48, 64 and 80 in along it. B1, a (2) 2x10
// 96 in long, bears on the wall at its start and on a girder G1 at 48 in
// along it at its end. G1, a (3) 2x12 120 in long, sits on posts P1 and P2.
func twoLevelPlan() *Plan { return pathPlan(5, 96) }

// pathPlan is twoLevelPlan with n joists at 16 in on a beam beamIn long.
func pathPlan(n int, beamIn float64) *Plan {
	p := &Plan{Walls: []WallIn{{ID: "W1"}}, Posts: []PostIn{
		{ID: "P1", Check: check.Post{Size: "4x4", Species: "Douglas Fir-Larch", Grade: "No.2", HeightIn: 96}, Checked: true},
		{ID: "P2", Check: check.Post{Size: "4x4", Species: "Douglas Fir-Larch", Grade: "No.2", HeightIn: 96}, Checked: true},
	}}
	for i := 1; i <= n; i++ {
		p.Members = append(p.Members, MemberIn{ID: fmt.Sprintf("J%d", i), Check: &check.Member{
			Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 144,
			Bearings:  []check.Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 1.5, Hanger: true}},
			SpacingIn: 16, TribIn: 16, Use: "roof", Repetitive: true, LiveLimit: 240, TotalLimit: 180,
			Loads: check.AreaLoads{DeadPsf: 12, RoofLivePsf: 20, WindUpPsf: 30},
		}, Carriers: []Carrier{{Kind: Wall, Index: 0}, {Kind: Member, Index: n, AtIn: 16 * float64(i), Joint: "hanger"}}})
	}
	var braces []float64
	for i := 1; i <= n; i++ {
		braces = append(braces, 16*float64(i))
	}
	p.Members = append(p.Members, MemberIn{ID: "B1", Beam: true, Check: &check.Member{
		Size: "(2) 2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: beamIn,
		Bearings: []check.Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: beamIn, LengthIn: 3}}, Use: "roof",
		LiveLimit: 240, TotalLimit: 180, TopBracedAtPoints: true, TopBracingAtIn: braces,
		SelfWeightPlf: 9.0,
	}, Carriers: []Carrier{{Kind: Wall, Index: 0}, {Kind: Member, Index: n + 1, AtIn: 48}}})
	p.Members = append(p.Members, MemberIn{ID: "G1", Beam: true, Check: &check.Member{
		Size: "(3) 2x12", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 120,
		Bearings: []check.Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 120, LengthIn: 3.5}}, Use: "roof",
		LiveLimit: 240, TotalLimit: 180, TopBracedAtPoints: true, TopBracingAtIn: []float64{48},
	}, Carriers: []Carrier{{Kind: Post, Index: 0}, {Kind: Post, Index: 1}}})
	return p
}

// TestTwoLevelPath_Statics: the loads put on the plan reach the wall and
// the posts, load type by load type, to 0.1 lb (statics: every member's
// reactions add up to its loads). By hand, each joist passes w L / 2 to
// the beam: D = 12 (16/144)(144)/2 = 96 lb, Lr = 160 lb, a pull of 240 lb
// under W up; the beam carries five of them plus its own weight, 9 plf x 8
// ft = 72 lb; its reaction on G1 is the moment of those loads about its
// start over 96 in: D (96 (16 + 32 + 48 + 64 + 80) + 72 (48)) / 96 = 276 lb;
// G1 sits at 48 of 120 in, so P1 takes 276 (72/120) = 165.6 lb of D and P2
// 110.4 lb.
func TestTwoLevelPath_Statics(t *testing.T) {
	p := twoLevelPlan()
	o := Solve(p, check.DefaultSettings())
	if len(o.Errors) > 0 {
		t.Fatalf("errors: %v", o.Errors)
	}
	src := "statics, written out in the test comment"
	a, d := o.Applied, o.Delivered
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"D", d.DeadLb, a.DeadLb}, {"Lr", d.RoofLiveLb, a.RoofLiveLb}, {"W up", d.WindUpLb, a.WindUpLb}, {"uplift D", d.UpliftDeadLb, a.UpliftDeadLb}} {
		near(t, c.name+" delivered", c.got, c.want, 0.1, "statics: nothing lost")
	}
	near(t, "D applied", a.DeadLb, 5*12*16/144.0*144+72, 1e-6, src)
	// per joist: 96 lb D at each end
	j1 := o.Members[0].Passed
	near(t, "joist D to the beam", j1[1].DeadLb, 96, 1e-6, src)
	near(t, "joist Lr to the beam", j1[1].RoofLiveLb, 160, 1e-6, src)
	near(t, "joist W up pull", j1[1].WindUpLb, 240, 1e-6, src)
	b1 := o.Members[5].Passed
	near(t, "beam D to the girder", b1[1].DeadLb, (96*(16+32+48+64+80)+72*48)/96.0, 1e-6, src)
	near(t, "post P1 D", o.Posts[0].Loads.DeadLb, 276*72/120.0, 1e-6, src)
	near(t, "post P2 D", o.Posts[1].Loads.DeadLb, 276*48/120.0, 1e-6, src)
	// the order follows the path: joists, then B1, then G1
	if !(o.Members[0].Order < o.Members[5].Order && o.Members[5].Order < o.Members[6].Order) {
		t.Errorf("order joist %d, beam %d, girder %d", o.Members[0].Order, o.Members[5].Order, o.Members[6].Order)
	}
	// the beam is checked with the joists' point loads, per load type
	if n := len(o.Members[5].Input.PointLoads); n != 5 {
		t.Errorf("beam point loads %d, want 5", n)
	}
	if o.Members[5].Result.Status == check.StatusError {
		t.Errorf("beam: %v", o.Members[5].Result.Messages)
	}
	if o.Posts[0].Result.Status != check.StatusPass {
		t.Errorf("post P1: %s %v", o.Posts[0].Result.Status, o.Posts[0].Result.Messages)
	}
	// joints: every bearing, each joist's hanger on the beam and its end
	// on the wall, and every bearing of the beams; the hangers under net
	// uplift 0.6D + 0.6W: 0.6 (96) - 0.6 (240) = -86.4 lb (ASCE 7-16
	// 2.4.1)
	if len(o.Joints) != 5+5+2+2 {
		t.Errorf("joints %d, want 14", len(o.Joints))
	}
	for _, jt := range o.Joints {
		if jt.Kind == "hanger" {
			near(t, "hanger uplift", jt.UpLb, 86.4, 1e-6, "ASCE 7-16 2.4.1, 0.6D + 0.6W, statics")
			if !strings.Contains(jt.UpCombo, "0.6W(up)") {
				t.Errorf("hanger uplift combination %q", jt.UpCombo)
			}
			near(t, "hanger down", jt.DownLb, 96+160, 1e-6, "ASCE 7-16 2.4.1, D + Lr")
		}
	}
}

// TestEquivalentLineLoad: a beam 192 in long carrying eleven joists at 16
// in as point loads (their reactions by load type) agrees within 1 % with
// the same beam under the equivalent line load, each reaction spread over
// the 16 in around it (from 8 to 184 in). By statics, with P a joist's
// reaction, M at mid-span is 5.5 P (96) - P (80 + 64 + 48 + 32 + 16) =
// 288 P against 5.5 P (96) - (P/16)(88)(44) = 286 P: 0.7 %.
func TestEquivalentLineLoad(t *testing.T) {
	p := pathPlan(11, 192)
	o := Solve(p, check.DefaultSettings())
	beam := o.Members[11]
	line := *p.Members[11].Check
	line.TribIn = 12
	line.LoadPieces = []check.LoadPiece{{FromIn: 0, ToIn: 8},
		{FromIn: 8, ToIn: 184, Loads: check.AreaLoads{DeadPsf: 96 / 16.0 * 12, RoofLivePsf: 160 / 16.0 * 12, WindUpPsf: 240 / 16.0 * 12}},
		{FromIn: 184, ToIn: 192}}
	rl := check.CheckMember(line, check.DefaultSettings())
	if len(beam.Result.Checks) != len(rl.Checks) {
		t.Fatalf("%d checks against %d", len(beam.Result.Checks), len(rl.Checks))
	}
	for i, c := range beam.Result.Checks {
		if c.Kind != rl.Checks[i].Kind {
			t.Fatalf("checks differ: %s vs %s", c.Kind, rl.Checks[i].Kind)
		}
		if math.Abs(c.Actual-rl.Checks[i].Actual) > 0.01*math.Abs(rl.Checks[i].Actual) {
			t.Errorf("%s: %.4g with the joists' reactions, %.4g with the line load: want within 1 %%", c.Kind, c.Actual, rl.Checks[i].Actual)
		}
	}
}

// TestCycle: two beams each bearing on the other are an error naming
// both; the rest of the plan is solved.
func TestCycle(t *testing.T) {
	p := twoLevelPlan()
	p.Members[6].Carriers[1] = Carrier{Kind: Member, Index: 5, AtIn: 90}
	o := Solve(p, check.DefaultSettings())
	if len(o.Errors) == 0 || !strings.Contains(o.Errors[0], "B1, G1") {
		t.Fatalf("errors %v, want a cycle naming B1 and G1", o.Errors)
	}
	for _, k := range []int{5, 6} {
		if o.Members[k].Result.Status != check.StatusError {
			t.Errorf("%s: %s, want error", p.Members[k].ID, o.Members[k].Result.Status)
		}
	}
	if o.Members[0].Result.Status == check.StatusError {
		t.Errorf("joist J1 in error: %v", o.Members[0].Result.Messages)
	}
}

// TestBeamSizing: with candidates the beam takes the lightest size with
// which it passes; the girder under it then carries that beam's own weight
// (9.57 plf per 2x12 ply... recomputed from the size: area x 35 pcf,
// from memory: verify), and its reaction changes accordingly (statics).
func TestBeamSizing(t *testing.T) {
	p := pathPlan(11, 192)
	p.Members[11].Check.Size = "2x6" // far too small
	p.Members[11].Candidates = []string{"2x6", "(2) 2x8", "(2) 2x10", "(3) 2x12", "(4) 2x12"}
	p.Members[11].DensityPcf = 35
	o := Solve(p, check.DefaultSettings())
	b := o.Members[11]
	if b.Result.Status != check.StatusPass {
		t.Fatalf("beam %s: %s %v", b.Input.Size, b.Result.Status, b.Result.Messages)
	}
	// the size before it fails: the pick is the lightest that passes
	for i, c := range p.Members[11].Candidates {
		if c == b.Input.Size && i > 0 {
			prev := *p.Members[11].Check
			prev.Size = p.Members[11].Candidates[i-1]
			sec, _ := check.ParseSize(prev.Size)
			prev.SelfWeightPlf = sec.AreaIn2 / 144 * 35
			prev.PointLoads = b.Input.PointLoads
			if r := check.CheckMember(prev, check.DefaultSettings()); r.Status == check.StatusPass {
				t.Errorf("%s passes too, yet %s was picked", prev.Size, b.Input.Size)
			}
		}
	}
	sec, _ := check.ParseSize(b.Input.Size)
	near(t, "self-weight of the size picked", b.Input.SelfWeightPlf, sec.AreaIn2/144*35, 1e-9, "area x 35 pcf")
	near(t, "D delivered", o.Delivered.DeadLb, o.Applied.DeadLb, 0.1, "statics: nothing lost")
}

// manyPaths is n copies of pathPlan side by side (beams of five lengths,
// so that some are alike and some not), for the parts of Solve that run
// on every core.
func manyPaths(n int) *Plan {
	all := &Plan{}
	for c := 0; c < n; c++ {
		p := pathPlan(5, 84+12*float64(c%5))
		mOff, pOff, wOff := len(all.Members), len(all.Posts), len(all.Walls)
		for _, m := range p.Members {
			m.ID = fmt.Sprintf("%s-%d", m.ID, c)
			cs := append([]Carrier(nil), m.Carriers...)
			for j := range cs {
				switch cs[j].Kind {
				case Member:
					cs[j].Index += mOff
				case Post:
					cs[j].Index += pOff
				case Wall:
					cs[j].Index += wOff
				}
			}
			m.Carriers = cs
			all.Members = append(all.Members, m)
		}
		for _, pt := range p.Posts {
			pt.ID = fmt.Sprintf("%s-%d", pt.ID, c)
			pt.Check.ID = pt.ID
			all.Posts = append(all.Posts, pt)
		}
		for _, w := range p.Walls {
			w.ID = fmt.Sprintf("%s-%d", w.ID, c)
			all.Walls = append(all.Walls, w)
		}
	}
	return all
}

// TestSolveSameOnAnyCoreCount: Solve on 2,100 copies of the two-level
// plan (14,700 members, 4,200 posts, 18,900 joints: enough for the
// parallel parts to split) gives the same outcome, in the same order, on
// one core and on two; each post the result of checking it alone, with
// its own ID (posts alike are checked once and share their lists, on any
// number of cores); and each copy's
// girder the same as the plan alone (common practice, no source: copies
// side by side do not interact).
func TestSolveSameOnAnyCoreCount(t *testing.T) {
	if testing.Short() {
		t.Skip("-short: solves 14,700 members twice")
	}
	p := manyPaths(2100)
	var outs [2]*Outcome
	for i, procs := range []int{1, 2} {
		old := runtime.GOMAXPROCS(procs)
		outs[i] = Solve(p, check.Settings{})
		runtime.GOMAXPROCS(old)
	}
	if !reflect.DeepEqual(outs[0], outs[1]) {
		t.Fatal("the outcome differs between one core and two")
	}
	o := outs[1]
	if len(o.Joints) != 2100*14 || len(o.Errors) != 0 {
		t.Fatalf("%d joints, want %d; errors %v", len(o.Joints), 2100*14, o.Errors)
	}
	// posts alike are checked once: each has the result of its own check,
	// its own ID and its own lists
	for _, i := range []int{0, 1, 10, 11, 4199} {
		pc := p.Posts[i].Check
		pc.Loads = o.Posts[i].Loads
		if want := check.CheckPost(pc, check.Settings{}); !reflect.DeepEqual(o.Posts[i].Result, want) || want.ID != pc.ID {
			t.Errorf("post %d: %+v, checked alone %+v", i, o.Posts[i].Result, want)
		}
	}
	// posts alike share their lists however many cores worked them out:
	// the outputs write a shared list once
	for _, out := range outs {
		a, b := out.Posts[0], out.Posts[2*2095] // copies 0 and 2095, beams alike
		if len(a.Result.Checks) == 0 || &a.Result.Checks[0] != &b.Result.Checks[0] || &a.Cases[0] != &b.Cases[0] {
			t.Error("posts alike far apart in the plan do not share their lists")
		}
	}
	for c := 0; c < 5; c++ {
		alone := Solve(pathPlan(5, 84+12*float64(c)), check.Settings{})
		g := o.Members[c*7+6]
		if g.Result.MaxRatio != alone.Members[6].Result.MaxRatio || g.Result.MaxRatio == 0 ||
			!reflect.DeepEqual(o.Posts[c*2].Cases, alone.Posts[0].Cases) {
			t.Errorf("copy %d: girder ratio %v, alone %v; post cases %v, alone %v", c, g.Result.MaxRatio,
				alone.Members[6].Result.MaxRatio, o.Posts[c*2].Cases, alone.Posts[0].Cases)
		}
	}
}

// TestPostsAlikeCheckedOnce: two posts of the same size, lumber and height
// under the same loads (the girder's load at its mid-length, statics)
// share one check, each keeping its own ID, and that check is what
// check.CheckPost gives each post alone (common practice, no source).
func TestPostsAlikeCheckedOnce(t *testing.T) {
	p := twoLevelPlan()
	p.Members[5].Carriers[1].AtIn = 60 // B1 on G1 at mid-length
	s := check.DefaultSettings()
	o := Solve(p, s)
	if len(o.Errors) > 0 {
		t.Fatalf("errors: %v", o.Errors)
	}
	a, b := o.Posts[0], o.Posts[1]
	if a.Loads != b.Loads {
		t.Fatalf("posts' loads %+v and %+v, want equal (statics: the load at mid-length)", a.Loads, b.Loads)
	}
	if a.Result.ID != "P1" || b.Result.ID != "P2" {
		t.Errorf("post ids %q, %q", a.Result.ID, b.Result.ID)
	}
	if len(a.Result.Checks) == 0 || &a.Result.Checks[0] != &b.Result.Checks[0] {
		t.Errorf("the two posts alike were checked apart")
	}
	for i, po := range o.Posts {
		pc := p.Posts[i].Check
		pc.ID, pc.Loads = p.Posts[i].ID, po.Loads
		want := check.CheckPost(pc, s)
		got := po.Result
		if len(got.Checks) != len(want.Checks) {
			t.Fatalf("post %s: %d checks, want %d", pc.ID, len(got.Checks), len(want.Checks))
		}
		for k := range want.Checks {
			g, w := got.Checks[k], want.Checks[k]
			if g.Kind != w.Kind || g.Combo != w.Combo || g.Actual != w.Actual || g.Allowable != w.Allowable || g.Ratio != w.Ratio ||
				!reflect.DeepEqual(g.Trace(), w.Trace()) {
				t.Errorf("post %s check %d: %+v, want %+v", pc.ID, k, g, w)
			}
		}
		got.Checks, want.Checks = nil, nil
		if !reflect.DeepEqual(got, want) {
			t.Errorf("post %s: %+v, want %+v", pc.ID, got, want)
		}
	}
}

// TestJointDemandPatterned: a 2x10 roof joist continuous over three walls
// (spans 144 and 120 in, 16 in tributary width, D 15, S 30, W up 40 psf)
// presses hardest on its end wall, and lifts hardest off it, with the
// live-type load on its own span only. By hand (three-moment equation, a
// two-span beam with w on span 1 only, EI constant): M_B = -w L1^3 / (8
// (L1 + L2)); the end reaction R_A = w L1 / 2 + M_B / L1. With every load
// over both spans, R_A = w L1 / 2 - (w (L1^3 + L2^3) / (8 (L1 + L2))) / L1.
// The wall joint's demand is the larger of the two (an audit found it the
// smaller): down D + S and up 0.6D + 0.6W(up) with S and W on span 1
// (ASCE 7-16 2.4.1, statics; the check's own reactions).
func TestJointDemandPatterned(t *testing.T) {
	trib := 16.0
	w := func(psf float64) float64 { return psf * trib / 144 } // lb/in
	l1, l2 := 144.0, 120.0
	p := &Plan{Walls: []WallIn{{ID: "W1"}, {ID: "W2"}, {ID: "W3"}}}
	p.Members = append(p.Members, MemberIn{ID: "J1", Check: &check.Member{
		Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: l1 + l2,
		Bearings:  []check.Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: l1, LengthIn: 3.5}, {AtIn: l1 + l2, LengthIn: 3.5}},
		SpacingIn: 16, TribIn: trib, Use: "roof", Repetitive: true, LiveLimit: 240, TotalLimit: 180,
		Loads: check.AreaLoads{DeadPsf: 15, SnowPsf: 30, WindUpPsf: 40},
	}, Carriers: []Carrier{{Kind: Wall, Index: 0}, {Kind: Wall, Index: 1}, {Kind: Wall, Index: 2}}})
	s := check.DefaultSettings()
	o := Solve(p, s)
	if len(o.Errors) > 0 {
		t.Fatalf("errors: %v", o.Errors)
	}
	rFull := func(q float64) float64 { return q*l1/2 - q*(l1*l1*l1+l2*l2*l2)/(8*(l1+l2))/l1 }
	rOne := func(q float64) float64 { return q*l1/2 - q*l1*l1*l1/(8*(l1+l2))/l1 }
	wantDown := rFull(w(15)) + rOne(w(30))       // D over both spans, S on span 1
	wantUp := rOne(0.6*w(40)) - 0.6*rFull(w(15)) // 0.6W(up) on span 1 against 0.6D over both
	if rOne(w(30)) <= rFull(w(30)) {
		t.Fatalf("the case needs a larger end reaction with span 1 loaded alone")
	}
	var found bool
	for _, jt := range o.Joints {
		if jt.Member != 0 || jt.Bearing != 0 {
			continue
		}
		found = true
		near(t, "end wall down", jt.DownLb, wantDown, 0.5, "three-moment equation, ASCE 7-16 2.4.1 D + S, S on span 1")
		near(t, "end wall up", jt.UpLb, wantUp, 0.5, "three-moment equation, ASCE 7-16 2.4.1 0.6D + 0.6W, W on span 1")
		if !strings.Contains(jt.DownCombo, "span 1") || !strings.Contains(jt.UpCombo, "span 1") {
			t.Errorf("combinations %q, %q: want the live-type loads on span 1 named", jt.DownCombo, jt.UpCombo)
		}
	}
	if !found {
		t.Fatal("no joint at the end wall")
	}
}
