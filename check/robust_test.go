package check

import (
	"fmt"
	"math"
	"math/rand"
	"strings"
	"testing"
)

// TestRandomMembers_NeverPanic runs random (often absurd) members through
// CheckMember and Size: no panic, a known status, and every number in the
// result finite (the results go to JSON). Common practice, no source.
func TestRandomMembers_NeverPanic(t *testing.T) {
	rng := rand.New(rand.NewSource(1))
	pick := func(vals ...float64) float64 { return vals[rng.Intn(len(vals))] }
	sizes := []string{"2x4", "2x6", "2x8", "2x10", "2x12", "2x14", "3x10", "4x12", "2x9", ""}
	species := []string{"DF-L", "HF", "SPF", "SYP", "Oak"}
	grades := []string{"No.2", "#1", "SS", "Stud", "No.3", "bad"}
	weird := []float64{0, -1, math.NaN(), math.Inf(1), 1e9}
	for i := 0; i < 600; i++ {
		n := 2 + rng.Intn(5)
		var bs []Bearing
		x := rng.Float64() * 20
		for j := 0; j < n; j++ {
			bs = append(bs, Bearing{AtIn: x, LengthIn: pick(1.5, 3.5, 5.5)})
			x += 12 + rng.Float64()*200
		}
		m := Member{ID: "X", Size: sizes[rng.Intn(len(sizes))], Species: species[rng.Intn(len(species))],
			Grade: grades[rng.Intn(len(grades))], LengthIn: x + rng.Float64()*40, Bearings: bs,
			OverhangStartIn: pick(0, bs[0].AtIn), SpacingIn: pick(12, 16, 24, 32), TribIn: pick(12, 16, 24),
			Use: []string{"floor", "roof"}[rng.Intn(2)],
			Loads: AreaLoads{DeadPsf: pick(0, 10, 15), LivePsf: pick(0, 40), RoofLivePsf: pick(0, 20), SnowPsf: pick(0, 30),
				WindDownPsf: pick(0, 20), WindUpPsf: pick(0, 30, 60)},
			LiveLimit: pick(0, 360, 240), TotalLimit: pick(0, 240, 180), Repetitive: rng.Intn(2) == 0,
			BottomBracedContinuous: rng.Intn(4) == 0, BlockingAtIn: []float64{pick(0, 50, 100)},
		}
		if last := bs[len(bs)-1].AtIn; m.LengthIn > last {
			m.OverhangEndIn = pick(0, m.LengthIn-last)
		}
		if rng.Intn(8) == 0 {
			m.Loads.LivePsf = weird[rng.Intn(len(weird))]
		}
		if rng.Intn(8) == 0 {
			m.Bearings[rng.Intn(n)].AtIn = weird[rng.Intn(len(weird))]
		}
		s := DefaultSettings()
		s.TopEdgeBraced = rng.Intn(3) != 0
		s.PatternLive = rng.Intn(2) == 0
		s.ShearAtD = rng.Intn(2) == 0
		s.WetService = rng.Intn(3) == 0
		s.Temperature = []string{"normal", "warm", "hot"}[rng.Intn(3)]
		r := CheckMember(m, s)
		checkFinite(t, i, r)
		if i%20 == 0 {
			sz := Size(m, s, nil, 2)
			checkFinite(t, i, sz.Chosen)
			for _, a := range sz.Alternatives {
				if !finite(a.Cost) || !finite(a.MaxRatio) {
					t.Errorf("case %d: alternative %+v not finite", i, a)
				}
			}
		}
	}
}

func checkFinite(t *testing.T, i int, r Result) {
	t.Helper()
	switch r.Status {
	case StatusPass, StatusFail, StatusError:
	default:
		t.Fatalf("case %d: status %q", i, r.Status)
	}
	if r.Status == StatusError && len(r.Messages) == 0 {
		t.Errorf("case %d: error without a message", i)
	}
	nums := []float64{r.MaxRatio, r.RB, r.OverhangsIn[0], r.OverhangsIn[1]}
	nums = append(nums, r.SpansIn...)
	nums = append(nums, r.BlockingAtIn...)
	for _, c := range r.Checks {
		nums = append(nums, c.Actual, c.Allowable, c.Ratio)
		for _, ti := range c.Trace() {
			nums = append(nums, ti.Value)
		}
	}
	for _, f := range r.Factors {
		nums = append(nums, f.Value)
	}
	for _, st := range r.BlockingSteps {
		nums = append(nums, st.LuIn, st.CL, st.Ratio)
	}
	for _, v := range nums {
		if !finite(v) {
			t.Errorf("case %d: non-finite number in result %+v", i, r)
			return
		}
	}
}

// TestConcurrentChecks runs members from several goroutines (the engine
// pool and the caches are shared) and expects the sequential results.
// Common practice, no source.
func TestConcurrentChecks(t *testing.T) {
	members := []Member{upliftRafter("2x10"), upliftRafter("2x12"), floorJoist("2x10", 168, 16), floorJoist("2x8", 150, 24)}
	want := make([]Result, len(members))
	for i, m := range members {
		want[i] = CheckMember(m, DefaultSettings())
	}
	done := make(chan string, 8)
	for g := 0; g < 8; g++ {
		go func(g int) {
			msg := ""
			for k := 0; k < 50 && msg == ""; k++ {
				i := (g + k) % len(members)
				r := CheckMember(members[i], DefaultSettings())
				if r.MaxRatio != want[i].MaxRatio || r.Governing != want[i].Governing || len(r.Checks) != len(want[i].Checks) ||
					traceText(r) != traceText(want[i]) || r.Checks[0].Combo != want[i].Checks[0].Combo {
					msg = "goroutine result differs for " + members[i].Size
				}
			}
			done <- msg
		}(g)
	}
	for g := 0; g < 8; g++ {
		if msg := <-done; msg != "" {
			t.Error(msg)
		}
	}
}

// traceText writes every trace item of r out, one per line.
func traceText(r Result) string {
	var b strings.Builder
	for _, c := range r.Checks {
		for _, it := range c.Trace() {
			fmt.Fprintf(&b, "%s %s %v %s %s = %s [%s]\n", c.Kind, it.Symbol, it.Value, it.Unit, it.Formula, it.Subst.Text(), it.Ref)
		}
	}
	return b.String()
}

// TestTraceOutlivesEngine takes a result's trace again after the engine
// that built it has checked other members: the trace is written from the
// result's own record, never from pooled memory. Common practice, no
// source.
func TestTraceOutlivesEngine(t *testing.T) {
	r := CheckMember(upliftRafter("2x10"), DefaultSettings())
	first := traceText(r)
	if !strings.Contains(first, "bending-bottom le ") || !strings.Contains(first, "= 2.06(") {
		t.Fatalf("trace lacks the bottom edge's effective length:\n%s", first)
	}
	for i := 0; i < 20; i++ {
		CheckMember(floorJoist("2x8", 150+float64(i), 24), DefaultSettings())
	}
	if again := traceText(r); again != first {
		t.Errorf("trace changed after other checks:\n%s\nwas\n%s", again, first)
	}
}
