package check

import (
	"math"
	"strings"
	"testing"
)

// thirdPointRafter is upliftRafter with 40 psf wind suction: an 18 ft
// (216 in) simple span, 2x10 DF-L No.2 at 24 in, D 8 psf, Lr 20 psf, W up
// 40 psf. The loads are chosen for the test (common practice, no source).
func thirdPointRafter() Member {
	m := upliftRafter("2x10")
	m.Loads.WindUpPsf = 40
	return m
}

// TestDrawnThirdPointRow_OneRowAdded is issue 13's takeoff case: a row is
// drawn at a third point (72 in) of the 216 in span, the bottom edge still
// fails, and the solver adds one row, at the other third point, rather than
// two rows evenly spaced (one on top of the drawn row).
//
// Hand calculation (NDS 2018, ASD; statics written out):
//
//	section 2x10: b = 1.5 in, d = 9.25 in, S = b d^2/6 = 21.39 in^3
//	  (NDS 2018 Supplement Table 1B)
//	Fb = 900 psi, Emin = 580,000 psi, DF-L No.2 (NDS 2018 Supplement
//	  Table 4A); CF = 1.1 for a 2x10 (Table 4A size factors); Cr = 1.15
//	  (NDS 2018 4.3.9); CM = Ct = Ci = 1.
//	0.6D + 0.6W (ASCE 7-16 2.4.1 combination 7), W up, tributary 2 ft:
//	  w = 0.6(8)(2) - 0.6(40)(2) = 9.6 - 48 = -38.4 plf = -3.2 lb/in (up)
//	  CD = 1.6 (NDS 2018 Table 2.3.2, wind)
//	M at mid-span = w L^2 / 8 = 3.2(216)^2 / 8 = 18,662 lb-in, bottom edge
//	  in compression over the whole span; fb = M/S = 872.5 psi
//	Fb* = Fb CD CM Ct CF Ci Cr = 900(1.6)(1.1)(1.15) = 1,821.6 psi
//	  (NDS 2018 3.3.3.8)
//
//	Drawn row at 72 in only: longest unbraced stretch 72..216, lu = 144 in,
//	  holding mid-span (M = 18,662 lb-in)
//	  lu/d = 15.57 >= 7: le = 1.63 lu + 3 d = 234.72 + 27.75 = 262.47 in
//	  (NDS 2018 Table 3.3.3, single span, uniformly distributed load)
//	  RB = sqrt(le d / b^2) = sqrt(262.47(9.25)/2.25) = 32.85 (Eq. 3.3-5)
//	  FbE = 1.20 Emin' / RB^2 = 696,000 / 1,079.0 = 645.0 psi (3.3.3.8)
//	  FbE/Fb* = 0.3541; CL = (1.3541/1.9) - sqrt((1.3541/1.9)^2 -
//	  0.3541/0.95) = 0.7127 - 0.3677 = 0.3450 (Eq. 3.3-6)
//	  fb/Fb' = 872.5 / (1,821.6 x 0.3450) = 1.388 > 1: fails
//	One row added at 144 in (mid of the stretch 72..216): stretches of 72
//	  in each; the middle one holds mid-span, M = 18,662 lb-in
//	  lu/d = 7.78 >= 7: le = 1.63(72) + 3(9.25) = 145.11 in (Table 3.3.3)
//	  RB = sqrt(145.11(9.25)/2.25) = 24.42; FbE = 696,000/596.6 = 1,166.7
//	  psi; FbE/Fb* = 0.6405; CL = 0.8634 - sqrt(0.7455 - 0.6742) = 0.5964
//	  fb/Fb' = 872.5 / (1,821.6 x 0.5964) = 0.803 <= 1: passes
//
// So one added row suffices; rows evenly spaced would have put two rows
// in the span (72 and 144 in), the first on the drawn row.
func TestDrawnThirdPointRow_OneRowAdded(t *testing.T) {
	s := DefaultSettings()
	m := thirdPointRafter()
	m.BlockingAtIn = []float64{72}
	r := CheckMember(m, s)
	if r.Status != StatusPass {
		t.Fatalf("status %s, messages %v", r.Status, r.Messages)
	}
	if len(r.BlockingAtIn) != 1 || !near(r.BlockingAtIn[0], 144, 1e-9, 0) {
		t.Fatalf("rows added %v, want one at 144 in (hand calculation in the comment)", r.BlockingAtIn)
	}
	if len(r.BlockingRowsPerSpan) != 1 || r.BlockingRowsPerSpan[0] != 1 {
		t.Errorf("rows per span %v, want [1]", r.BlockingRowsPerSpan)
	}
	if len(r.DrawnBlockingAtIn) != 1 || r.DrawnBlockingAtIn[0] != 72 {
		t.Errorf("drawn rows reported %v, want [72]", r.DrawnBlockingAtIn)
	}
	// The solver's steps: drawn row alone, then with the row added.
	if len(r.BlockingSteps) != 2 {
		t.Fatalf("steps %+v, want 2", r.BlockingSteps)
	}
	st := r.BlockingSteps
	expectNear(t, "lu, drawn row only", st[0].LuIn, 144, 1e-9, 0, "hand calculation above")
	expectNear(t, "CL, drawn row only", st[0].CL, 0.3450, 0.0005, 0, "hand calculation above, NDS 2018 Eq. 3.3-6")
	expectNear(t, "ratio, drawn row only", st[0].Ratio, 1.388, 0.001, 0, "hand calculation above")
	expectNear(t, "lu, one row added", st[1].LuIn, 72, 1e-9, 0, "hand calculation above")
	expectNear(t, "CL, one row added", st[1].CL, 0.5964, 0.0005, 0, "hand calculation above, NDS 2018 Eq. 3.3-6")
	bot := find(t, r, KindBendingBottom)
	expectNear(t, "bottom-edge ratio", bot.Ratio, 0.803, 0.001, 0, "hand calculation above")
	expectNear(t, "fb", bot.Actual, 872.5, 0.1, 0, "statics: w L^2/8 over S")
	// The trace states the bracing: bearings, the drawn row, the row to add.
	var bracing string
	for _, it := range bot.Trace() {
		if it.Symbol == "bracing points" {
			bracing = it.Formula
			expectNear(t, "bracing points", it.Value, 4, 0, 0, "2 bearings + 1 drawn + 1 added row")
		}
	}
	for _, want := range []string{"bearings at 0, 216 in", "drawn rows at 72 in (existing)", "rows to add at 144 in"} {
		if !strings.Contains(bracing, want) {
			t.Errorf("bracing %q: want %q", bracing, want)
		}
	}
	// Without the drawn row the rule is as before: two rows evenly spaced.
	m.BlockingAtIn = nil
	if e := CheckMember(m, s); e.RowsPerSpan() != 2 || !near(e.BlockingAtIn[0], 72, 1e-9, 0) || !near(e.BlockingAtIn[1], 144, 1e-9, 0) {
		t.Errorf("no drawn row: rows %v at %v, want 2 per span at 72, 144 (DOMAIN.md third points)", e.BlockingRowsPerSpan, e.BlockingAtIn)
	}
}

// TestDrawnRows_NeverOnTopOfADrawnRow: over drawn rows at many positions
// and loads, every added row is at least 24 in (the solver's shortest
// unbraced length, DOMAIN.md) from every drawn row and bearing, so never
// within d of one; and rows given to CheckWithRowsAt within d of a drawn
// row are that row, not added.
func TestDrawnRows_NeverOnTopOfADrawnRow(t *testing.T) {
	s := DefaultSettings()
	for _, wu := range []float64{30, 40, 50, 60, 80} {
		for _, drawn := range [][]float64{{72}, {54}, {108}, {30, 150}, {20, 100, 190}, {0, 216}, {-10, 72}} {
			m := thirdPointRafter()
			m.Loads.WindUpPsf = wu
			m.BlockingAtIn = drawn
			r := CheckMember(m, s)
			for _, x := range r.BlockingAtIn {
				for _, y := range append(append([]float64(nil), drawn...), 0, 216) {
					if math.Abs(x-y) < minBlockingLuIn-1e-9 {
						t.Errorf("W up %v, drawn %v: added row at %v is %.2f in from %v", wu, drawn, x, math.Abs(x-y), y)
					}
				}
			}
			if r.Status == StatusPass && len(r.BlockingSteps) > 0 && r.BlockingSteps[len(r.BlockingSteps)-1].Ratio > 1 {
				t.Errorf("W up %v, drawn %v: passes but the last step fails: %+v", wu, drawn, r.BlockingSteps)
			}
		}
	}
	m := thirdPointRafter()
	m.BlockingAtIn = []float64{72}
	r := CheckWithRowsAt(m, s, []float64{72 + 9, 144})
	if len(r.BlockingAtIn) != 1 || r.BlockingAtIn[0] != 144 {
		t.Errorf("rows 81, 144 given with a drawn row at 72: added %v, want [144] (81 is within d = 9.25 in)", r.BlockingAtIn)
	}
	if r := CheckWithRowsAt(m, s, []float64{math.NaN()}); r.Status != StatusError {
		t.Errorf("NaN row: status %s, want error", r.Status)
	}
}

// TestCheckMemberFrom_KeepsRunRows: rows the run already has are kept and
// counted; rows are added only where the edge still fails.
func TestCheckMemberFrom_KeepsRunRows(t *testing.T) {
	s := DefaultSettings()
	m := thirdPointRafter()
	m.BlockingAtIn = []float64{72}
	// The run's row at 144 suffices (hand calculation above): nothing more.
	if r := CheckMemberFrom(m, s, []float64{144}); len(r.BlockingAtIn) != 1 || r.Status != StatusPass {
		t.Errorf("from [144]: added %v, status %s", r.BlockingAtIn, r.Status)
	}
	// A run row at 36 leaves 72..216 unbraced (ratio 1.388 above): one more row, at 144.
	r := CheckMemberFrom(m, s, []float64{36})
	if r.Status != StatusPass || len(r.BlockingAtIn) != 2 || r.BlockingAtIn[0] != 36 || !near(r.BlockingAtIn[1], 144, 1e-9, 0) {
		t.Errorf("from [36]: added %v, status %s; want [36 144]", r.BlockingAtIn, r.Status)
	}
}

// TestDrawnRowAtBearing_RulesUnchanged: a drawn row at a bearing (blocking
// over the wall) is not in a span: rows evenly spaced, as without it.
func TestDrawnRowAtBearing_RulesUnchanged(t *testing.T) {
	s := DefaultSettings()
	m := thirdPointRafter()
	a := CheckMember(m, s)
	m.BlockingAtIn = []float64{0, 216}
	b := CheckMember(m, s)
	if a.RowsPerSpan() != b.RowsPerSpan() || len(b.BlockingSteps) != len(a.BlockingSteps) || b.MaxRatio != a.MaxRatio {
		t.Errorf("drawn rows at the bearings changed the result: %v -> %v", a.BlockingAtIn, b.BlockingAtIn)
	}
}

// TestDrawnRows_Properties runs the solver on random continuous members
// with random drawn rows, with and without the inflection-point rule: it
// never panics, added rows are sorted, inside spans and at least 24 in
// from every bearing and drawn row (DOMAIN.md "Blocking rows"), and a
// member that passes has its bottom edge within 1.000. Common practice, no
// source.
func TestDrawnRows_Properties(t *testing.T) {
	rnd := uint64(7)
	next := func() float64 { // xorshift, reproducible
		rnd ^= rnd << 13
		rnd ^= rnd >> 7
		rnd ^= rnd << 17
		return float64(rnd%1_000_000) / 1_000_000
	}
	exercised, withIP := 0, 0
	for i := 0; i < 300; i++ {
		nSpans := 1 + int(next()*3)
		var bs []Bearing
		at := 0.0
		for k := 0; k <= nSpans; k++ {
			bs = append(bs, Bearing{AtIn: at, LengthIn: 3.5})
			at += 96 + math.Round(next()*120)
		}
		last := bs[len(bs)-1].AtIn
		over := 0.0
		if next() < 0.3 {
			over = math.Round(next() * 30)
		}
		m := Member{ID: "P", Size: []string{"2x8", "2x10", "2x12"}[int(next()*3)], Species: "DF-L", Grade: "No.2",
			LengthIn: last + over, Bearings: bs, OverhangEndIn: over, SpacingIn: 16, TribIn: 16, Use: "roof",
			Loads:     AreaLoads{DeadPsf: 5 + 10*next(), RoofLivePsf: 20, WindUpPsf: 80 * next()},
			LiveLimit: 180, TotalLimit: 120, Repetitive: true}
		for j := int(next() * 3); j > 0; j-- {
			m.BlockingAtIn = append(m.BlockingAtIn, math.Round(next()*m.LengthIn))
		}
		s := DefaultSettings()
		s.BraceAtInflection = next() < 0.5
		r := CheckMember(m, s)
		if r.Status == StatusError {
			t.Fatalf("case %d: %v", i, r.Messages)
		}
		if m.HasDrawnRowsInSpans() && len(r.BlockingAtIn) > 0 {
			exercised++
			if nSpans > 1 && !s.BraceAtInflection {
				withIP++
			}
		}
		for j, x := range r.BlockingAtIn {
			if j > 0 && x < r.BlockingAtIn[j-1] {
				t.Errorf("case %d: rows not sorted %v", i, r.BlockingAtIn)
			}
			if x <= 0 || x >= last {
				t.Errorf("case %d: row at %v outside the spans (0..%v)", i, x, last)
			}
			others := append([]float64(nil), m.BlockingAtIn...)
			for _, b := range bs {
				others = append(others, b.AtIn)
			}
			for _, y := range others {
				if math.Abs(x-y) < minBlockingLuIn-1e-6 {
					t.Errorf("case %d: row at %v is %.2f in from a brace at %v (drawn %v)", i, x, math.Abs(x-y), y, m.BlockingAtIn)
				}
			}
		}
		if r.Status == StatusPass {
			for _, c := range r.Checks {
				if c.Kind == KindBendingBottom && c.Ratio > 1+1e-9 {
					t.Errorf("case %d: passes with bottom-edge ratio %.3f", i, c.Ratio)
				}
			}
		}
	}
	if exercised < 30 || withIP < 10 {
		t.Errorf("only %d cases added rows to drawn ones (%d continuous, inflection-point candidates on)", exercised, withIP)
	}
}
