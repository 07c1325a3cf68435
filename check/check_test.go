package check

import (
	"fmt"
	"math"
	"strings"
	"testing"
)

// floorJoist is a DF-L No.2 floor joist on two bearings with the loads of
// IRC 2018 Table R502.3.1(2): 40 psf live, 10 psf dead, L/360.
func floorJoist(size string, spanIn, spacingIn float64) Member {
	return Member{ID: "J1", Size: size, Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: spanIn,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: spanIn, LengthIn: 1.5}}, SpacingIn: spacingIn, TribIn: spacingIn, Use: "floor",
		Loads: AreaLoads{DeadPsf: 10, LivePsf: 40}, LiveLimit: 360, Repetitive: true}
}

func find(t *testing.T, r Result, kind string) CheckResult {
	t.Helper()
	for _, c := range r.Checks {
		if c.Kind == kind {
			return c
		}
	}
	t.Fatalf("%s: no %s check in %+v (messages %v)", r.ID, kind, r.Checks, r.Messages)
	return CheckResult{}
}

func traceValue(t *testing.T, c CheckResult, sym string) float64 {
	t.Helper()
	for _, ti := range c.Trace() {
		if ti.Symbol == sym {
			return ti.Value
		}
	}
	t.Fatalf("%s: no %s in the trace", c.Kind, sym)
	return 0
}

// TestSimpleSpan_ClosedForm checks the simple-span formulas of any
// mechanics-of-materials text: M = w L^2 / 8, V = R = w L / 2 and
// deflection 5 w L^4 / (384 E I).
func TestSimpleSpan_ClosedForm(t *testing.T) {
	m := floorJoist("2x10", 168, 16)
	m.TotalLimit = 240
	r := CheckMember(m, DefaultSettings())
	if r.Status != StatusPass {
		t.Fatalf("status %s: %v", r.Status, r.Messages)
	}
	wL, wT := 40*16/144.0, 50*16/144.0
	L := 168.0
	expectNear(t, "M", traceValue(t, find(t, r, KindBendingTop), "M"), wT*L*L/8, 1e-6, 0, "w L^2 / 8")
	expectNear(t, "V", traceValue(t, find(t, r, KindShear), "V"), wT*L/2, 1e-6, 0, "w L / 2")
	expectNear(t, "R", traceValue(t, find(t, r, KindBearing), "R"), wT*L/2, 1e-6, 0, "w L / 2")
	ei := 1.6e6 * 1.5 * 9.25 * 9.25 * 9.25 / 12
	expectNear(t, "live deflection", find(t, r, KindDeflectionLive).Actual, 5*wL*math.Pow(L, 4)/(384*ei), 1e-9, 1e-9, "5 w L^4 / 384 E I")
	// Total (IBC 2018 Table 1604.3, D + L column): L + 0.5D for seasoned
	// lumber in dry service (footnote d; DefaultSettings is seasoned).
	expectNear(t, "total deflection", find(t, r, KindDeflectionTotal).Actual, 5*(0.5*10*16/144.0+wL)*math.Pow(L, 4)/(384*ei), 1e-9, 1e-9, "IBC 2018 Table 1604.3 note d; 5 w L^4 / 384 E I")
	// Unseasoned (or wet service): L + D.
	s := DefaultSettings()
	s.Seasoned = false
	r2 := CheckMember(m, s)
	expectNear(t, "total deflection, unseasoned", find(t, r2, KindDeflectionTotal).Actual, 5*(10*16/144.0+wL)*math.Pow(L, 4)/(384*ei), 1e-9, 1e-9, "IBC 2018 Table 1604.3; 5 w L^4 / 384 E I")
	// Long-term (NDS 2018 3.5.2): Kcr x D deflection + L deflection,
	// reported (no limit given), not checked.
	long := 5 * (1.5*10*16/144.0 + wL) * math.Pow(L, 4) / (384 * ei)
	if !strings.Contains(strings.Join(r.Info, "\n"), "long-term deflection (NDS 2018 3.5.2, Kcr = 1.5) "+fmt.Sprintf("%.3f", long)) {
		t.Errorf("info %q: want the long-term deflection %.3f in reported (NDS 2018 3.5.2)", r.Info, long)
	}
	m.LongTermLimit = 240
	r3 := CheckMember(m, DefaultSettings())
	expectNear(t, "long-term deflection", find(t, r3, KindDeflectionLongTerm).Actual, long, 1e-9, 1e-9, "NDS 2018 3.5.2, Kcr 1.5; 5 w L^4 / 384 E I")
	expectNear(t, "long-term allowed", find(t, r3, KindDeflectionLongTerm).Allowable, L/240, 1e-12, 0, "L/240 as given")
	// fb = M/S against Fb' = Fb CD CF Cr = 900 (1.0)(1.1)(1.15), NDS 2018 Table 4.3.1.
	expectNear(t, "Fb'", find(t, r, KindBendingTop).Allowable, 900*1.1*1.15, 1e-9, 0, "NDS 2018 Table 4.3.1")
}

// TestTwoEqualSpans_ClosedForm checks the two-span continuous beam under
// uniform load (beam diagrams of any steel or wood design manual):
// interior reaction 1.25 w L, support moment w L^2 / 8 (bottom edge in
// compression over the interior bearing).
func TestTwoEqualSpans_ClosedForm(t *testing.T) {
	L := 144.0
	m := floorJoist("2x10", 2*L, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: L, LengthIn: 1.5}, {AtIn: 2 * L, LengthIn: 1.5}}
	m.Loads = AreaLoads{DeadPsf: 30} // dead only: one case, nothing patterned
	r := CheckMember(m, DefaultSettings())
	w := 30 * 16 / 144.0
	bot := find(t, r, KindBendingBottom)
	expectNear(t, "support moment", traceValue(t, bot, "M"), w*L*L/8, 1e-6, 1e-9, "w L^2 / 8")
	expectNear(t, "interior reaction", traceValue(t, find(t, r, KindBearing), "R"), 1.25*w*L, 1e-6, 1e-9, "1.25 w L")
	// The bottom edge between the interior bearing and the inflection
	// points is braced only at the bearings: lu = L, general row of Table 3.3.3.
	expectNear(t, "lu", traceValue(t, bot, "lu"), L, 1e-9, 0, "bracing at bearings only")
	if len(r.SpansIn) != 2 || r.SpansIn[0] != L {
		t.Errorf("spans %v", r.SpansIn)
	}
}

// TestOverhang_ClosedForm checks the cantilever moment w a^2 / 2 at the
// bearing of an overhang (statics).
func TestOverhang_ClosedForm(t *testing.T) {
	a := 36.0
	m := floorJoist("2x10", 120+a, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 120, LengthIn: 3.5}}
	m.OverhangEndIn = a
	m.Loads = AreaLoads{DeadPsf: 30}
	r := CheckMember(m, DefaultSettings())
	w := 30 * 16 / 144.0
	expectNear(t, "cantilever moment", traceValue(t, find(t, r, KindBendingBottom), "M"), w*a*a/2, 1e-6, 1e-9, "w a^2 / 2")
	if r.OverhangsIn != [2]float64{0, a} {
		t.Errorf("overhangs %v", r.OverhangsIn)
	}
}

// TestSpanTable_IRC2018_R502_3_1_2 finds the longest span that passes for
// DF-L No.2 floor joists, 40 psf live, 10 psf dead, L/360, and compares it
// with IRC 2018 Table R502.3.1(2). Span values from memory: verify against
// IRC 2018 Table R502.3.1(2). Those values match Fb = 875 psi for DF-L
// No.2 (the earlier Supplement value the span tables were computed with,
// from memory: verify), so the test runs the engine with a user material
// holding that Fb; with the NDS 2018 value (900 psi) the bending-governed
// spans grow by sqrt(900/875) = 1.4%, up to 3.5 in, which the second loop
// checks. The 2018 ceiling joist table, read from a stored copy of the
// code (TestSpanTable_IRC2018_R802_5_1_2), fits Fb = 900 psi, not 875: the
// recalled floor spans may be an earlier edition's, another reason their
// mark stays.
func TestSpanTable_IRC2018_R502_3_1_2(t *testing.T) {
	ft := func(f, in float64) float64 { return 12*f + in }
	rows := []struct {
		size    string
		spacing float64
		spanIn  float64
	}{
		{"2x8", 12, ft(14, 2)}, {"2x8", 16, ft(12, 7)}, {"2x8", 24, ft(10, 3)},
		{"2x10", 12, ft(17, 9)}, {"2x10", 16, ft(15, 5)}, {"2x10", 24, ft(12, 7)},
		{"2x12", 12, ft(20, 7)}, {"2x12", 16, ft(17, 10)}, {"2x12", 24, ft(14, 7)},
	}
	old, err := LoadMaterialsCSV(strings.NewReader(
		strings.Join(materialColumns, ",")+"\nDouglas Fir-Larch,No.2,2,0,875,575,180,625,1350,1600000,580000,4A,span-table basis\n"), "fb875.csv")
	if err != nil {
		t.Fatal(err)
	}
	s875 := DefaultSettings()
	s875.Materials = BuiltinMaterials().Merge(old)
	for _, r := range rows {
		got := maxSpan(r.size, r.spacing, s875)
		if math.Abs(got-r.spanIn) > 2 {
			t.Errorf("%s @ %v in, Fb 875: longest span %.1f in, table %.0f in: more than 2 in apart (IRC 2018 Table R502.3.1(2), from memory: verify)",
				r.size, r.spacing, got, r.spanIn)
		}
		got900 := maxSpan(r.size, r.spacing, DefaultSettings())
		if got900 < r.spanIn-2 || got900 > r.spanIn*math.Sqrt(900.0/875)+2 {
			t.Errorf("%s @ %v in, NDS 2018 values: longest span %.1f in, table %.0f in (IRC 2018 Table R502.3.1(2), from memory: verify)",
				r.size, r.spacing, got900, r.spanIn)
		}
	}
}

// TestSpanTable_IRC2018_R802_5_1_2 finds the longest span that passes for
// ceiling joists of uninhabitable attics with limited storage (20 psf
// live, 10 psf dead, L/240) and compares it with IRC 2018 Table
// R802.5.1(2), read from the stored copy of the 2018 IRC at
// online.flipbuilder.com/mewf/mima/files/basic-html/page430.html (code
// page 405): the 19.2 and 24 in rows, 2x4 to 2x10, for Douglas fir-larch
// SS, #1, #2, Hem-fir SS, #1, #2, Southern pine SS, #2 and
// Spruce-pine-fir #1 and #2 (one grade in Table 4A, one row). The engine
// runs with its own NDS 2018 Supplement values (Table 4A with CF; Table 4B
// by width for Southern Pine), Cr 1.15 and CD 1.0 for the storage live
// load. Bending governs most rows, deflection the stiff SS rows; all 72
// spans come within 0.6 in of the table's (which rounds to the inch), a
// check of the tables' Fb and E as much as of the engine.
func TestSpanTable_IRC2018_R802_5_1_2(t *testing.T) {
	sizes := []string{"2x4", "2x6", "2x8", "2x10"}
	rows := []struct {
		species, grade string
		spacing        float64
		spans          string // 2x4 2x6 2x8 2x10, feet-inches
	}{
		{"Douglas Fir-Larch", "Select Structural", 19.2, "8-11 14-0 18-5 23-7"},
		{"Douglas Fir-Larch", "No.1", 19.2, "8-7 12-6 15-10 19-5"},
		{"Douglas Fir-Larch", "No.2", 19.2, "8-2 11-11 15-1 18-5"},
		{"Hem-Fir", "Select Structural", 19.2, "8-5 13-3 17-5 22-3"},
		{"Hem-Fir", "No.1", 19.2, "8-3 12-4 15-8 19-2"},
		{"Hem-Fir", "No.2", 19.2, "7-10 11-7 14-8 17-10"},
		{"Southern Pine", "Select Structural", 19.2, "8-9 13-9 18-2 23-1"},
		{"Southern Pine", "No.2", 19.2, "7-4 11-0 13-11 16-6"},
		{"Spruce-Pine-Fir", "No.1/No.2", 19.2, "8-0 11-9 14-10 18-2"},
		{"Douglas Fir-Larch", "Select Structural", 24, "8-3 13-0 17-2 21-3"},
		{"Douglas Fir-Larch", "No.1", 24, "7-8 11-2 14-2 17-4"},
		{"Douglas Fir-Larch", "No.2", 24, "7-3 10-8 13-6 16-5"},
		{"Hem-Fir", "Select Structural", 24, "7-10 12-3 16-2 20-6"},
		{"Hem-Fir", "No.1", 24, "7-7 11-1 14-0 17-1"},
		{"Hem-Fir", "No.2", 24, "7-1 10-4 13-1 16-0"},
		{"Southern Pine", "Select Structural", 24, "8-1 12-9 16-10 21-6"},
		{"Southern Pine", "No.2", 24, "6-7 9-10 12-6 14-9"},
		{"Spruce-Pine-Fir", "No.1/No.2", 24, "7-2 10-6 13-3 16-3"},
	}
	for _, r := range rows {
		for k, cell := range strings.Fields(r.spans) {
			var f, in float64
			if _, err := fmt.Sscanf(cell, "%g-%g", &f, &in); err != nil {
				t.Fatalf("table cell %q: %v", cell, err)
			}
			want := 12*f + in
			ceiling := func(size string, spanIn, spacingIn float64) Member {
				m := floorJoist(size, spanIn, spacingIn)
				m.Species, m.Grade = r.species, r.grade
				m.Loads = AreaLoads{DeadPsf: 10, LivePsf: 20}
				m.LiveLimit, m.TotalLimit = 240, 0
				return m
			}
			got := maxSpanOf(ceiling, sizes[k], r.spacing, DefaultSettings())
			if math.Abs(got-want) > 0.6 {
				t.Errorf("%s %s %s @ %v in: longest span %.1f in, IRC 2018 Table R802.5.1(2) %.0f in",
					r.species, r.grade, sizes[k], r.spacing, got, want)
			}
		}
	}
}

// maxSpan bisects for the longest passing span of a floor joist to 0.05 in.
func maxSpan(size string, spacing float64, s Settings) float64 {
	return maxSpanOf(floorJoist, size, spacing, s)
}

// maxSpanOf bisects for the longest passing span of the members member
// builds, to 0.05 in.
func maxSpanOf(member func(size string, spanIn, spacingIn float64) Member, size string, spacing float64, s Settings) float64 {
	lo, hi := 48.0, 480.0
	for hi-lo > 0.05 {
		mid := (lo + hi) / 2
		if CheckMember(member(size, mid, spacing), s).Status == StatusPass {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo
}

// upliftRafter is a roof joist on two bearings, 18 ft span at 24 in, with
// 8 psf dead, 20 psf roof live and 50 psf wind suction, so that 0.6D +
// 0.6W is a net uplift and puts the bottom edge in compression (ASCE 7-16
// 2.4.1 combination 7). Common practice, no source: the loads are chosen
// for the test.
func upliftRafter(size string) Member {
	return Member{ID: "R1", Size: size, Species: "DF-L", Grade: "No.2", LengthIn: 216,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 216, LengthIn: 1.5}}, SpacingIn: 24, TribIn: 24, Use: "roof",
		Loads: AreaLoads{DeadPsf: 8, RoofLivePsf: 20, WindUpPsf: 50}, LiveLimit: 180, TotalLimit: 120, Repetitive: true}
}

func TestUplift_BlockingRows(t *testing.T) {
	s := DefaultSettings()
	m := upliftRafter("2x10")
	if r := CheckWithRows(m, s, 0); r.Status != StatusFail || find(t, r, KindBendingBottom).Ratio <= 1 {
		t.Fatalf("2x10 with the bottom edge unbraced: status %s, want a bottom-edge failure", r.Status)
	}
	r := CheckMember(m, s)
	n := r.RowsPerSpan()
	if r.Status != StatusPass || n < 1 {
		t.Fatalf("2x10 with the solver's rows: status %s, rows %d; messages %v", r.Status, n, r.Messages)
	}
	if len(r.BlockingAtIn) != n || !near(r.BlockingAtIn[0], 216/float64(n+1), 1e-9, 0) {
		t.Errorf("row positions %v for %d rows in a 216 in span; want evenly spaced", r.BlockingAtIn, n)
	}
	// Fewest: one row fewer fails the bottom edge.
	if f := CheckWithRows(m, s, n-1); find(t, f, KindBendingBottom).Ratio <= 1 {
		t.Errorf("%d rows also pass the bottom edge; the solver should return the fewest", n-1)
	}
	if len(r.BlockingSteps) != n+1 || r.BlockingSteps[n].Ratio > 1 || r.BlockingSteps[n-1].Ratio <= 1 {
		t.Errorf("steps %+v", r.BlockingSteps)
	}
	up := CheckMember(upliftRafter("2x12"), s)
	if up.Status != StatusPass || up.RowsPerSpan() >= n {
		t.Errorf("2x12: status %s, %d rows; want a pass with fewer rows than the 2x10's %d", up.Status, up.RowsPerSpan(), n)
	}
	// A ceiling fastened to the joists braces the bottom edge: no rows.
	m.BottomBracedContinuous = true
	if c := CheckMember(m, s); c.RowsPerSpan() != 0 || find(t, c, KindBendingBottom).Ratio > 1 {
		t.Errorf("ceiling-braced: rows %d", c.RowsPerSpan())
	}
	// Rows drawn in the plan count: drawn at the solver's positions, no more are added.
	m.BottomBracedContinuous = false
	m.BlockingAtIn = r.BlockingAtIn
	if c := CheckMember(m, s); c.RowsPerSpan() != 0 || c.Status != StatusPass {
		t.Errorf("with the rows drawn: %d rows added, status %s", c.RowsPerSpan(), c.Status)
	}
}

func TestBadInput_IsAnError(t *testing.T) {
	good := floorJoist("2x10", 168, 16)
	nan := math.NaN()
	rows := []struct {
		name string
		edit func(m *Member)
		want string
	}{
		{"species", func(m *Member) { m.Species = "Oak-ish" }, "unknown species"},
		{"grade", func(m *Member) { m.Grade = "No.9" }, "unknown grade"},
		{"size", func(m *Member) { m.Size = "2x9" }, "size"},
		{"zero span", func(m *Member) { m.Bearings[1].AtIn = 0 }, "span"},
		{"negative length", func(m *Member) { m.LengthIn = -5 }, "length"},
		{"one bearing", func(m *Member) { m.Bearings = m.Bearings[:1] }, "at least 2"},
		{"NaN load", func(m *Member) { m.Loads.LivePsf = nan }, "live load"},
		{"negative load", func(m *Member) { m.Loads.DeadPsf = -10 }, "dead load"},
		{"NaN trib", func(m *Member) { m.TribIn = nan }, "tributary"},
		{"use", func(m *Member) { m.Use = "deck" }, "use"},
		{"overhang", func(m *Member) { m.OverhangEndIn = 50 }, "end overhang"},
		{"bearing length", func(m *Member) { m.Bearings[0].LengthIn = 0 }, "bearing length"},
	}
	for _, r := range rows {
		m := good
		m.Bearings = append([]Bearing(nil), good.Bearings...)
		r.edit(&m)
		res := CheckMember(m, DefaultSettings())
		if res.Status != StatusError || len(res.Messages) == 0 || !strings.Contains(res.Messages[0], r.want) {
			t.Errorf("%s: status %s, messages %v; want an error containing %q", r.name, res.Status, res.Messages, r.want)
		}
		if res.ID != "J1" {
			t.Errorf("%s: error result lost the member ID", r.name)
		}
	}
	s := DefaultSettings()
	s.Temperature = "boiling"
	if res := CheckMember(good, s); res.Status != StatusError {
		t.Errorf("bad temperature: status %s", res.Status)
	}
	if res := CheckWithRows(good, DefaultSettings(), -1); res.Status != StatusError {
		t.Errorf("negative rows: status %s", res.Status)
	}
}

func TestRBOver50_Fails(t *testing.T) {
	// A 2x14 with an unbraced top edge over a 24 ft span: le = 1.63(288) +
	// 3(13.25) = 509 in, RB = sqrt(509 (13.25) / 1.5^2) = 54.8 > 50 (NDS
	// 2018 3.3.3.7: not permitted).
	m := floorJoist("2x14", 288, 16)
	m.Loads = AreaLoads{DeadPsf: 1, LivePsf: 1}
	s := DefaultSettings()
	s.TopEdgeBraced = false
	r := CheckMember(m, s)
	expectNear(t, "RB", r.RB, 54.8, 0.05, 0, "hand calculation in the comment")
	if r.Status != StatusFail || !strings.Contains(strings.Join(r.Messages, ";"), "RB") {
		t.Errorf("status %s, messages %v; want a failure naming RB", r.Status, r.Messages)
	}
}

// TestPatternLive_TwoSpansOneLoaded checks pattern loading against the
// beam diagram "continuous beam, two equal spans, uniform load on one
// span" (AISC Steel Construction Manual, Table 3-23, case 30): largest
// positive moment 49/512 w L^2 = 0.0957 w L^2 (0.0703 w L^2 with both
// spans loaded) and largest deflection 0.0092 w L^4 / E I (0.0054 both
// loaded). The 0.0092 coefficient is printed to two significant figures,
// so its tolerance is 1%.
func TestPatternLive_TwoSpansOneLoaded(t *testing.T) {
	L := 144.0
	m := floorJoist("2x10", 2*L, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: L, LengthIn: 1.5}, {AtIn: 2 * L, LengthIn: 1.5}}
	m.Loads = AreaLoads{LivePsf: 40}
	w := 40 * 16 / 144.0
	ei := 1.6e6 * 1.5 * 9.25 * 9.25 * 9.25 / 12
	r := CheckMember(m, DefaultSettings())
	top := find(t, r, KindBendingTop)
	expectNear(t, "M+ one span loaded", traceValue(t, top, "M"), 49.0/512*w*L*L, 1e-6, 1e-9, "AISC Manual Table 3-23 case 30")
	if !strings.Contains(top.Combo, "span 1") && !strings.Contains(top.Combo, "span 2") {
		t.Errorf("governing combo %q should name the loaded span", top.Combo)
	}
	expectNear(t, "deflection one span loaded", find(t, r, KindDeflectionLive).Actual, 0.0092*w*L*L*L*L/ei, 0, 0.01, "AISC Manual Table 3-23 case 30")
	s := DefaultSettings()
	s.PatternLive = false
	full := CheckMember(m, s)
	expectNear(t, "M+ both spans loaded", traceValue(t, find(t, full, KindBendingTop), "M"), 9.0/128*w*L*L, 1e-6, 1e-9, "AISC Manual Table 3-23 case 29 (0.0703 w L^2)")
}

// TestPruneDominated_ChangesNothing compares every check with and without
// the dominated-case pruning of single-span members and the bound that
// skips cases in the bending checks (common practice, no source: both are
// optimisations and must not change results).
func TestPruneDominated_ChangesNothing(t *testing.T) {
	members := []Member{upliftRafter("2x10"), upliftRafter("2x8"), floorJoist("2x10", 168, 16)}
	snow := upliftRafter("2x12")
	snow.Loads = AreaLoads{DeadPsf: 12, RoofLivePsf: 20, SnowPsf: 25, WindDownPsf: 15, WindUpPsf: 10}
	cont := floorJoist("2x10", 3*144+24, 16)
	cont.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 144, LengthIn: 3.5}, {AtIn: 288, LengthIn: 3.5}, {AtIn: 432, LengthIn: 1.5}}
	cont.OverhangEndIn = 24
	contRoof := upliftRafter("2x10")
	contRoof.LengthIn = 2*216 + 30
	contRoof.Bearings = []Bearing{{AtIn: 30, LengthIn: 3.5}, {AtIn: 246, LengthIn: 3.5}, {AtIn: 462, LengthIn: 3.5}}
	contRoof.OverhangStartIn = 30
	members = append(members, snow, cont, contRoof)
	for _, m := range members {
		a := CheckMember(m, DefaultSettings())
		pruneCases = false
		b := CheckMember(m, DefaultSettings())
		pruneCases = true
		if len(a.Checks) != len(b.Checks) || a.Status != b.Status || a.RowsPerSpan() != b.RowsPerSpan() ||
			a.RB != b.RB || len(a.BlockingSteps) != len(b.BlockingSteps) {
			t.Fatalf("%s %s: pruned %s/%d checks/%d rows, full %s/%d/%d", m.ID, m.Size, a.Status, len(a.Checks), a.RowsPerSpan(), b.Status, len(b.Checks), b.RowsPerSpan())
		}
		for i := range a.Checks {
			ca, cb := a.Checks[i], b.Checks[i]
			if ca.Kind != cb.Kind || ca.Combo != cb.Combo || !near(ca.Ratio, cb.Ratio, 1e-12, 1e-12) {
				t.Errorf("%s %s: pruned %s %s %.6f, full %s %s %.6f", m.ID, m.Size, ca.Kind, ca.Combo, ca.Ratio, cb.Kind, cb.Combo, cb.Ratio)
			}
		}
	}
}

// TestShearAtD_ClosedForm: with loads within d of the bearing face left
// out (NDS 2018 3.4.3.1(a)), V on a uniformly loaded simple span is
// w (L/2 - lb/2 - d) (statics).
func TestShearAtD_ClosedForm(t *testing.T) {
	m := floorJoist("2x10", 168, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 168, LengthIn: 3.5}}
	s := DefaultSettings()
	s.ShearAtD = true
	r := CheckMember(m, s)
	w := 50 * 16 / 144.0
	expectNear(t, "V at d", traceValue(t, find(t, r, KindShear), "V"), w*(168.0/2-3.5/2-9.25), 1e-6, 1e-9, "w (L/2 - lb/2 - d)")
}

// TestBearingAreaFactor_InteriorBearing: the interior bearing of a
// two-span joist, 1.5 in long and far from the member ends, takes Cb =
// (1.5 + 0.375)/1.5 = 1.25 (NDS 2018 3.10.4): Fc_perp' = 625 (1.25).
func TestBearingAreaFactor_InteriorBearing(t *testing.T) {
	L := 144.0
	m := floorJoist("2x10", 2*L, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: L, LengthIn: 1.5}, {AtIn: 2 * L, LengthIn: 1.5}}
	b := find(t, CheckMember(m, DefaultSettings()), KindBearing)
	expectNear(t, "Fc_perp'", b.Allowable, 625*1.25, 1e-9, 0, "NDS 2018 3.10.4 with Supplement Table 4A Fc_perp 625 psi (checked against stored tabulations, docs/VERIFIED.md)")
	expectNear(t, "Cb", traceValue(t, b, "Cb"), 1.25, 1e-12, 0, "NDS 2018 3.10.4")
}

// TestCantileverDeflection_BackSpanRotation: live load on the back span
// only lifts the tip of the overhang by w L^3 a / (24 E I) (AISC Steel
// Construction Manual Table 3-23, case 24, "beam overhanging one support,
// uniform load between supports"), more than the overhang's own load
// pushes it down here (w a^3 (4L + 3a) / (24 E I), case 25); the check
// compares it with 2a/360 (IBC 2018 Table 1604.3 note h).
func TestCantileverDeflection_BackSpanRotation(t *testing.T) {
	a, L := 36.0, 120.0
	m := floorJoist("2x10", L+a, 16)
	m.Bearings = []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: L, LengthIn: 3.5}}
	m.OverhangEndIn = a
	m.Loads = AreaLoads{DeadPsf: 10, LivePsf: 40}
	r := CheckMember(m, DefaultSettings())
	d := find(t, r, KindDeflectionLive)
	w := 40 * 16 / 144.0
	ei := 1.6e6 * 1.5 * 9.25 * 9.25 * 9.25 / 12
	if !strings.Contains(d.Combo, "end overhang") {
		t.Fatalf("governing live deflection %q, want the end overhang", d.Combo)
	}
	expectNear(t, "tip deflection", d.Actual, w*L*L*L*a/(24*ei), 1e-9, 1e-9, "AISC Manual Table 3-23 case 24")
	expectNear(t, "allowed", d.Allowable, 2*a/360, 1e-12, 0, "IBC 2018 Table 1604.3 note h")
}

// TestSpanTable_IBC2018_2308_7_2_2 finds the longest span that passes for
// DF-L No.2 rafters (20 psf roof live, 10 or 20 psf dead, ceiling attached,
// L/240 under live load) and compares it with IBC 2018 Table 2308.7.2(2),
// read from a stored copy of the 2018 code at
// online.flipbuilder.com/mewf/msoi/files/basic-html/page568.html: the 12
// and 16 in rows of Douglas Fir-Larch #2, 2x4 to 2x12 (cells "Note b", past
// 26 ft, left out). Spans are horizontal projections and the loads are on
// that projection (the table's basis; footnotes not on the stored page:
// from memory: verify). The engine runs as for any roof joist: CD 1.25 for
// roof live load (NDS 2018 Table 2.3.2), Cr 1.15, CF by width (Supplement
// Table 4A). Where live-load deflection governs (2x4 to 2x8 at 10 psf
// dead) the spans come within 1 in of the table with the NDS 2018 values.
// Where bending governs the table fits Fb = 875 psi, as the floor table
// above does (the earlier Supplement value, from memory: verify), not the
// 2018 value of 900: so the test runs the engine with a user material of
// Fb 875 and holds every cell within 1 in, and with the 2018 values holds
// each span between the table's and sqrt(900/875) of it (plus 1 in). A
// flat member and one at 6 in 12 with the same loads on the projection
// give the same spans without the deflection limit (bending on the
// projection is the same); deflection, taken perpendicular to the sloped
// member against its sloped length, is 1/cos of the slope larger as a
// ratio, so sloped spans governed by it are shorter than the table's.
func TestSpanTable_IBC2018_2308_7_2_2(t *testing.T) {
	sizes := []string{"2x4", "2x6", "2x8", "2x10", "2x12"}
	rows := []struct {
		spacing, dead float64
		spans         string // 2x4 .. 2x12, feet-inches; "-" = Note b
	}{
		{12, 10, "9-10 15-6 20-5 25-8 -"},
		{12, 20, "9-10 14-4 18-2 22-3 25-9"},
		{16, 10, "8-11 14-1 18-2 22-3 25-9"},
		{16, 20, "8-6 12-5 15-9 19-3 22-4"},
	}
	old, err := LoadMaterialsCSV(strings.NewReader(
		strings.Join(materialColumns, ",")+"\nDouglas Fir-Larch,No.2,2,0,875,575,180,625,1350,1600000,580000,4A,span-table basis\n"), "fb875.csv")
	if err != nil {
		t.Fatal(err)
	}
	s875 := DefaultSettings()
	s875.Materials = BuiltinMaterials().Merge(old)
	for _, r := range rows {
		for k, cell := range strings.Fields(r.spans) {
			if cell == "-" {
				continue
			}
			var f, in float64
			if _, err := fmt.Sscanf(cell, "%g-%g", &f, &in); err != nil {
				t.Fatalf("table cell %q: %v", cell, err)
			}
			want := 12*f + in
			rafter := func(pitch float64) func(size string, spanIn, spacingIn float64) Member {
				return func(size string, spanIn, spacingIn float64) Member {
					m := floorJoist(size, spanIn, spacingIn)
					m.Use = "roof"
					m.Loads = AreaLoads{DeadPsf: r.dead, RoofLivePsf: 20}
					m.LiveLimit, m.TotalLimit = 240, 0
					m.PitchRise12 = pitch
					return m
				}
			}
			got := maxSpanOf(rafter(0), sizes[k], r.spacing, s875)
			if math.Abs(got-want) > 1 {
				t.Errorf("%s @ %v in, %v psf dead, Fb 875: longest span %.1f in, IBC 2018 Table 2308.7.2(2) %.0f in",
					sizes[k], r.spacing, r.dead, got, want)
			}
			got900 := maxSpanOf(rafter(0), sizes[k], r.spacing, DefaultSettings())
			if got900 < want-1 || got900 > want*math.Sqrt(900.0/875)+1 {
				t.Errorf("%s @ %v in, %v psf dead, NDS 2018 values: longest span %.1f in, IBC 2018 Table 2308.7.2(2) %.0f in",
					sizes[k], r.spacing, r.dead, got900, want)
			}
			// Without the deflection limit (bending, shear and bearing
			// govern) the slope changes nothing: the loads and spans are on
			// the projection.
			noDefl := func(pitch float64) func(size string, spanIn, spacingIn float64) Member {
				return func(size string, spanIn, spacingIn float64) Member {
					m := rafter(pitch)(size, spanIn, spacingIn)
					m.LiveLimit = 0
					return m
				}
			}
			{
				flat := maxSpanOf(noDefl(0), sizes[k], r.spacing, s875)
				sloped := maxSpanOf(noDefl(6), sizes[k], r.spacing, s875)
				if math.Abs(sloped-flat) > 0.1 {
					t.Errorf("%s @ %v in, %v psf dead: span without the deflection limit %.1f in flat, %.1f in at 6 in 12 (loads on the projection)",
						sizes[k], r.spacing, r.dead, flat, sloped)
				}
			}
		}
	}
}

// TestShearAtDOnRafter: with shear_at_d, the loads within d of the bearing
// face are left out of V (NDS 2018 3.4.3.1(a)), d measured along the
// member: on a 12:12 rafter, whose loads are laid out on the horizontal
// projection, that is d cos 45 = 6.54 in of plan beyond the face, not 9.25
// (an audit found d taken on the plan). A 2x10 at 24 in, 144 in plan span,
// D 20 psf on the projection: w = 40 plf = 3.333 lb/in, R = w L / 2 = 240
// lb; V = 240 - 3.333 (1.75 + 9.25 cos 45) = 212.4 lb; fv = 1.5 V / A
// (NDS 2018 Eq. 3.4-2), A = 13.875 in2 (Supplement Table 1B).
func TestShearAtDOnRafter(t *testing.T) {
	m := Member{ID: "R1", Size: "2x10", Species: "DF-L", Grade: "No.2", LengthIn: 144,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 3.5}}, SpacingIn: 24, TribIn: 24, Use: "roof",
		Loads: AreaLoads{DeadPsf: 20}, PitchRise12: 12, LiveLimit: 180, TotalLimit: 120, Repetitive: true}
	s := DefaultSettings()
	s.ShearAtD = true
	r := CheckMember(m, s)
	w := 20.0 * 24 / 144
	v := w*144/2 - w*(1.75+9.25*math.Cos(math.Pi/4))
	expectNear(t, "fv at d on a 12:12 rafter", find(t, r, KindShear).Actual, 1.5*v/13.875, 1e-6, 0, "NDS 2018 3.4.3.1(a), Eq. 3.4-2; statics")
}

// TestUpwardTipDeflectionSaid: a joist with a 30 in overhang past a 120
// in back-span, live load on the back-span only (pattern loading): the tip
// rises, w L^3 a / (24 E I), against 2 a / 360 (IBC 2018 Table 1604.3
// note h), more than the span's w L^4 5 / (384 E I) against L / 360
// (statics: 1.25 / 0.167 against 1.5625 / 0.333 in units of w L^3 / E I):
// the governing live deflection is the tip's, and its trace says it is
// upward (an audit found it unsaid).
func TestUpwardTipDeflectionSaid(t *testing.T) {
	m := Member{ID: "J1", Size: "2x10", Species: "DF-L", Grade: "No.2", LengthIn: 150,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 120, LengthIn: 3.5}}, OverhangEndIn: 30, SpacingIn: 16, TribIn: 16, Use: "floor",
		Loads: AreaLoads{DeadPsf: 10, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240, Repetitive: true}
	r := CheckMember(m, DefaultSettings())
	li := find(t, r, KindDeflectionLive)
	if !strings.Contains(li.Combo, "overhang") {
		t.Fatalf("governing live deflection %s: the case needs the overhang's tip", li.Combo)
	}
	found := false
	for _, it := range li.Trace() {
		if it.Symbol == "delta" {
			found = true
			if !strings.Contains(it.Formula, "upward") {
				t.Errorf("tip deflection trace %q: want it said upward (combo %s)", it.Formula, li.Combo)
			}
		}
	}
	if !found {
		t.Fatal("no delta in the live deflection's trace")
	}
}
