package main

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"framecheck/export"
)

// TestMillimetrePlanEndToEnd runs check on a plan drawn the way a CAD user
// draws one: a second floor in millimetres ($INSUNITS 4) on layers of the
// user's own naming (S-JOIS, S-WALL-BRG, S-BEAM, A-ANNO), joists as
// 2-vertex LWPOLYLINEs (every other one drawn backwards), double-line
// bearing walls, a flush beam drawn as its centre-line, a stair opening
// with a header and doubled trimmers, a block of joists inserted rotated
// 90 degrees, an MTEXT callout with formatting codes and no load-zone
// outlines. testdata/mm_plan/gen_mm_plan.py (ezdxf) wrote mm_plan.dxf;
// mm_plan.toml is `framecheck init` edited for those layers and 15 psf
// dead / 40 psf live.
//
// Spans by hand, centre-to-centre of bearings (DOMAIN.md; common practice,
// no source), converted at 25.4 mm/in:
//
//	south wall y 0/139.7 mm -> centre 69.85; interior wall 3600/3688.9 ->
//	3644.45; flush beam line 3644.45; header 4500; north wall
//	7175.5/7315.2 -> 7245.35.
//	south span  (3644.45 - 69.85) / 25.4 = 3574.6 / 25.4 = 140.732 in
//	north span  (7245.35 - 3644.45) / 25.4 = 3600.9 / 25.4 = 141.768 in
//	tail to header (4500 - 3644.45) / 25.4 = 855.55 / 25.4 = 33.683 in
func TestMillimetrePlanEndToEnd(t *testing.T) {
	dir := t.TempDir()
	for _, name := range []string{"mm_plan.dxf", "mm_plan.toml"} {
		data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", name))
		require.NoError(t, err)
		require.NoError(t, os.WriteFile(filepath.Join(dir, name), data, 0o644))
	}
	out := filepath.Join(dir, "out")
	var stdout, stderr bytes.Buffer
	code := run([]string{"check", filepath.Join(dir, "mm_plan.dxf"), "-p", filepath.Join(dir, "mm_plan.toml"), "-o", out},
		&stdout, &stderr)
	require.NotEqual(t, exitUsage, code, "stdout:\n%s\nstderr:\n%s", stdout.String(), stderr.String())
	data, err := os.ReadFile(filepath.Join(out, resultsName))
	require.NoError(t, err)
	r, err := export.ParseJSON("results.json", data) // members complete (what marks share filled in)
	require.NoError(t, err)
	assert.Equal(t, r.Summary.Pass == len(r.Members), code == exitOK, "exit %d for %+v", code, r.Summary)
	assert.Equal(t, "mm", r.DrawingUnits)

	// 11 west-bay lines + 12 east-bay south joists in model space, 12 in
	// the rotated block (gen_mm_plan.py); each doubled trimmer, drawn as
	// two lines 38.1 mm (1.5 in) apart, is read as one member's outline
	// (issue 14: two parallel lines a lumber thickness apart are one
	// member on their centre line)
	require.Len(t, r.Members, 35)
	assert.Equal(t, 35, r.Summary.Pass+r.Summary.Fail+r.Summary.Error)
	assert.Zero(t, r.Summary.Fail, "2x10 DF-L No.2 at 16 in over 11'-9\" passes 55 psf")

	const south, north, tail = 3574.6 / 25.4, 3600.9 / 25.4, 855.55 / 25.4
	// trimmers (lines at x 831.85/869.95 and 2012.95/2051.05 mm, centre
	// lines 850.9 and 2032 mm) carry the header's point load, out of
	// scope: only the other joists are asserted here
	trimmer := map[float64]bool{850.9: true, 2032: true}
	x0, sp := 19.05, 406.4 // gen_mm_plan.py: joist k at x0 + sp k
	var west, tails, eastS, blockN int
	for i := range r.Members {
		m := &r.Members[i]
		x := math.Round(m.Start[0]*100) / 100
		y0, y1 := math.Min(m.Start[1], m.End[1]), math.Max(m.Start[1], m.End[1])
		if trimmer[x] {
			continue
		}
		var want []float64
		onGrid := (x - x0) / sp // joist k of the model-space grid
		switch {
		case y0 == 0 && y1 == 7315.2: // west bay, over the interior wall
			want, west = []float64{south, north}, west+1
		case y0 == 0 && y1 == 4500: // tail joists to the stair header
			want, tails = []float64{south, tail}, tails+1
		case y0 == 0 && math.Abs(y1-3644.45) < 1e-6: // east bay, wall to flush beam
			want, eastS = []float64{south}, eastS+1
		case math.Abs(y0-3644.45) < 1e-6 && y1 == 7315.2: // the rotated block
			want, blockN = []float64{north}, blockN+1
			onGrid = (9124.95 - x) / sp // block joists count from the east
		default:
			t.Errorf("%s at (%g, %g)-(%g, %g) mm is not a joist gen_mm_plan.py draws", m.ID, m.Start[0], m.Start[1], m.End[0], m.End[1])
			continue
		}
		if assert.Len(t, m.SpansIn, len(want), m.ID) {
			for j := range want {
				assert.InDelta(t, want[j], m.SpansIn[j], 0.01, "%s span %d", m.ID, j+1)
			}
		}
		assert.Equal(t, "pass", m.Status, "%s at x = %g mm: %v", m.ID, x, m.Messages)
		assert.InDelta(t, math.Round(onGrid), onGrid, 1e-6, "%s x = %g mm is off the 406.4 mm grid", m.ID, x)
	}
	assert.Equal(t, []int{7, 2, 12, 12}, []int{west, tails, eastS, blockN}, "west, tail, east-south, block joists")

	// the header ends on the trimmers (centre lines 850.9 and 2032 mm):
	// they carry its reaction, a point load out of scope, so they are in
	// error with a message saying so, not checked on the header as a bearing
	var trimmers int
	defer func() { assert.Equal(t, 2, trimmers, "trimmer members") }()
	for i := range r.Members {
		m := &r.Members[i]
		if x := math.Round(m.Start[0]*100) / 100; x == 850.9 || x == 2032 {
			trimmers++
			assert.Equal(t, "error", m.Status, "%s at x = %g mm", m.ID, x)
			assert.Contains(t, strings.Join(m.Messages, "\n"), "carries the end of a flush beam or header", m.ID)
		}
	}

	// hand check of an interior east-bay joist (x = 4895.85 mm), simple
	// span 140.732 in, trib 16 in (406.4 mm), D+L = 55 psf:
	//   w = 55 x 16 / 144 = 6.111 lb/in; M = w L^2 / 8 = 15129 lb-in
	//   fb = M / S = 15129 / 21.39 = 707.3 psi (S of 1.5 x 9.25 in,
	//   NDS 2018 Supplement Table 1B)
	//   Fb' = Fb CD CF Cr = 900 x 1.0 x 1.1 x 1.15 = 1138.5 psi (Fb and CF:
	//   NDS 2018 Supplement Table 4A; Cr NDS 4.3.9) -> ratio 0.621
	//   live deflection 5 w_L L^4 / 384 E I, w_L = 40 x 16 / 144 = 4.444
	//   lb/in, E 1.6e6 psi, I 98.93 in^4: 0.1434 in against L/360 = 0.391
	for i := range r.Members {
		m := &r.Members[i]
		if math.Abs(m.Start[0]-4895.85) > 0.01 {
			continue
		}
		assert.InDelta(t, 16, m.TribIn, 1e-6)
		for _, c := range m.Checks {
			switch c.Kind {
			case "bending-top":
				assert.InDelta(t, 707.3, c.Actual, 0.1, "fb")
				assert.InDelta(t, 1138.5, c.Allowable, 0.01, "Fb'")
			case "deflection-live":
				assert.InDelta(t, 0.1434, c.Actual, 0.0005, "live deflection")
				assert.InDelta(t, south/360, c.Allowable, 1e-6, "L/360")
			}
		}
	}

	// one hanger at each flush-beam end: 12 + 12 at the beam, 2 tail
	// joists at the header
	assert.Equal(t, 26, r.Takeoff.Totals.Hangers)
}

// runMMPlan runs check on a copy of the millimetre plan with extra
// arguments and, when toml is not "", that text as its project file.
func runMMPlan(t *testing.T, toml string, args ...string) (int, string, string) {
	t.Helper()
	dir := t.TempDir()
	data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.dxf"))
	require.NoError(t, err)
	plan := filepath.Join(dir, "mm_plan.dxf")
	require.NoError(t, os.WriteFile(plan, data, 0o644))
	if toml == "" {
		b, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.toml"))
		require.NoError(t, err)
		toml = string(b)
	}
	proj := filepath.Join(dir, "mm_plan.toml")
	require.NoError(t, os.WriteFile(proj, []byte(toml), 0o644))
	var stdout, stderr bytes.Buffer
	code := run(append([]string{"check", plan, "-p", proj, "-o", filepath.Join(dir, "out")}, args...), &stdout, &stderr)
	return code, stdout.String(), stderr.String()
}

// A millimetre plan read as inches (or metres) has spans 25 (or 1000)
// times too long; the first finding says so and names where the units
// came from. Read right, there is no such warning.
func TestWrongUnitsAreQuestioned(t *testing.T) {
	for _, units := range []string{"in", "m"} {
		_, _, stderr := runMMPlan(t, "", "--units", units)
		first, _, _ := strings.Cut(stderr, "\n")
		assert.Contains(t, first, CodeUnitsDoubt, "--units %s: first finding", units)
		assert.Contains(t, first, `units "`+units+`" (from --units)`)
	}
	_, _, stderr := runMMPlan(t, "")
	assert.NotContains(t, stderr, CodeUnitsDoubt)
}

// The few settings a project file left out are named in the summary, not
// only counted: mm_plan.toml is the starter file, whose units and
// deflection limits are commented out.
func TestSummaryNamesDefaultsUsed(t *testing.T) {
	_, stdout, _ := runMMPlan(t, "")
	assert.Contains(t, stdout, "4 settings left out of")
	assert.Contains(t, stdout, "  drawing.units: from the DXF header ($INSUNITS)")
	assert.Contains(t, stdout, "live_deflection_limit = 360")
	assert.NotContains(t, stdout, "Notes sheet")
}

// A joist pattern that matches no layer stops the run (exit 2); the hint
// names the layers command with the same project file, so its ROLE column
// shows the mapping that found nothing.
func TestNoJoistsHintKeepsProjectFile(t *testing.T) {
	b, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.toml"))
	require.NoError(t, err)
	toml := strings.Replace(string(b), `joists = ["S-JOIS"]`, `joists = ["S-JOIST"]`, 1)
	require.NotEqual(t, string(b), toml)
	code, _, stderr := runMMPlan(t, toml)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "no joists found on the joist layers S-JOIST")
	assert.Regexp(t, `run 'framecheck layers \S+mm_plan\.dxf -p \S+mm_plan\.toml'`, stderr)
}

// The summary gives each mark's tributary width beside its spacing, in
// inches: the east edge joist of the mm plan (x = 8959.85 mm) is at
// 406.4 mm = 16 in from its one neighbour and carries half of that,
// 8 in (DOMAIN.md: half the gap to the one neighbour; common practice,
// no source), so its row reads "16 in  8 in" where the interior joists
// of the same span read "16 in  16 in".
func TestSummaryShowsTribBesideSpacing(t *testing.T) {
	_, stdout, _ := runMMPlan(t, "")
	assert.Regexp(t, `(?m)^mark\s+count\s+size\s+grade\s+zone\s+spacing\s+trib\s+spans`, stdout)
	assert.Regexp(t, `(?m)^J\d+\s+11\s+2x10\s+DF-L No\.2\s+FLOOR\s+16 in\s+16 in\s+11'-8 3/4"\s`, stdout)
	assert.Regexp(t, `(?m)^J\d+\s+1\s+2x10\s+DF-L No\.2\s+FLOOR\s+16 in\s+8 in\s+11'-8 3/4"\s`, stdout)
}

// mmPlanOwnLayer writes mm_plan.dxf into dir with its joist layer S-JOIS
// (a National CAD Standard name, which the built-in patterns match)
// renamed FLR-JST, a name of the user's own, and returns its path.
func mmPlanOwnLayer(t *testing.T, dir string) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.dxf"))
	require.NoError(t, err)
	p := filepath.Join(dir, "mm_plan.dxf")
	require.NoError(t, os.WriteFile(p, bytes.ReplaceAll(data, []byte("S-JOIS"), []byte("FLR-JST")), 0o644))
	return p
}

// A new user's first steps on their own drawing: layers without a
// project file points at the layer that looks like the joists, and a
// project file that does not exist yet is met with how to write one.
func TestFirstStepsOnOwnLayers(t *testing.T) {
	plan := mmPlanOwnLayer(t, t.TempDir())
	var stdout, stderr bytes.Buffer
	require.Equal(t, exitOK, run([]string{"layers", plan}, &stdout, &stderr), stderr.String())
	assert.Contains(t, stdout.String(), "the joists may be on FLR-JST:")
	assert.NotContains(t, stdout.String(), "FLR-JST, ", "only FLR-JST looks like a joist layer")

	stdout.Reset()
	require.Equal(t, exitOK, run([]string{"layers", filepath.Join("testdata", "mm_plan", "mm_plan.dxf"), "-p", filepath.Join("testdata", "mm_plan", "mm_plan.toml")}, &stdout, &stderr))
	assert.NotContains(t, stdout.String(), "the joists may be on")

	missing := filepath.Join(t.TempDir(), "framecheck.toml")
	for _, args := range [][]string{{"layers", plan}, {"check", plan, "-o", t.TempDir()}} {
		stderr.Reset()
		assert.Equal(t, exitUsage, run(append(args, "-p", missing), &stdout, &stderr), args[0])
		assert.Contains(t, stderr.String(), "project file "+missing+" not found; 'framecheck init -o "+missing+"' writes a starter one", args[0])
	}
}

// check without -p beside the framecheck.toml that init wrote (the usual
// slip after editing it) says the file was not read and how to pass it.
func TestCheckWithoutProjectFlagNamesTheFileBeside(t *testing.T) {
	dir := t.TempDir()
	mmPlanOwnLayer(t, dir)
	data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.toml"))
	require.NoError(t, err)
	data = bytes.ReplaceAll(data, []byte("S-JOIS"), []byte("FLR-JST"))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "framecheck.toml"), data, 0o644))
	var stdout, stderr bytes.Buffer
	code := run([]string{"check", filepath.Join(dir, "mm_plan.dxf"), "-o", filepath.Join(dir, "out")}, &stdout, &stderr)
	assert.Equal(t, exitUsage, code, "the built-in patterns find nothing on FLR-JST")
	want := filepath.Join(dir, "framecheck.toml")
	assert.Contains(t, stderr.String(), "to use "+want+", add -p "+want)
	assert.Contains(t, stderr.String(), "the joists may be on FLR-JST:")
	assert.Contains(t, stderr.String(), "or pass --joists FLR-JST")

	require.NoError(t, os.Remove(want))
	stderr.Reset()
	run([]string{"check", filepath.Join(dir, "mm_plan.dxf"), "-o", filepath.Join(dir, "out")}, &stdout, &stderr)
	assert.NotContains(t, stderr.String(), "add -p")
}

// check --size says what it did: the line names the candidates and
// accounts for every checked member (which size each member gets is the
// engine's result and is not pinned here). The plan's project file sets no
// [sizing] same_depth: each member is sized on its own (PROJECT-FILE.md).
func TestSizeSummaryLine(t *testing.T) {
	_, stdout, _ := runMMPlan(t, "", "--size")
	line := regexp.MustCompile(`(?m)^sizes picked by --size from \[sizing\] candidates 2x6, 2x8, 2x10, 2x12, 2x14, each member its own: (.*) members$`).
		FindStringSubmatch(stdout)
	require.NotNil(t, line, stdout)
	total := 0
	for _, part := range strings.Split(line[1], ", ") {
		var size string
		var n int
		_, err := fmt.Sscanf(part, "%s for %d", &size, &n)
		require.NoError(t, err, part)
		total += n
	}
	m := regexp.MustCompile(`(\d+) pass, (\d+) fail, (\d+) error`).FindStringSubmatch(stdout)
	require.NotNil(t, m)
	pass, _ := strconv.Atoi(m[1])
	fail, _ := strconv.Atoi(m[2])
	assert.Equal(t, pass+fail, total, "every checked member has a size in the line")
	_, stdout, _ = runMMPlan(t, "")
	assert.NotContains(t, stdout, "sizes picked by --size")
}

// A support pattern that names no layer ("S-WALL" for S-WALL-BRG) leaves
// the joists bearing on nothing: the first finding names the pattern, and
// each joist's "reaches no support" point is in the drawing's own units,
// so it can be found in CAD (joist k = 11 starts at (19.05 + 406.4 x 11,
// 0) = (4489.45, 0) mm, gen_mm_plan.py).
func TestUnmatchedSupportPatternIsNamed(t *testing.T) {
	b, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.toml"))
	require.NoError(t, err)
	toml := strings.Replace(string(b), `layers = ["S-WALL-BRG"]`, `layers = ["S-WALL"]`, 1)
	require.NotEqual(t, string(b), toml)
	out := t.TempDir()
	code, stdout, stderr := runMMPlan(t, toml, "-o", out)
	assert.Equal(t, exitFail, code)
	first, _, _ := strings.Cut(stderr, "\n")
	assert.Contains(t, first, CodeUnmatchedSupport)
	// and the notes of the outputs carry it too
	res, err := export.ReadJSON(filepath.Join(out, "results.json"))
	require.NoError(t, err)
	assert.True(t, slices.ContainsFunc(res.Assumptions.Notes, func(n string) bool { return strings.Contains(n, CodeUnmatchedSupport) }),
		"notes: %q", res.Assumptions.Notes)
	assert.Contains(t, first, `[[support]] 1 (bearing-wall): "S-WALL"`)
	assert.NotContains(t, first, "S-BEAM", "the flush-beam pattern matches its layer")
	assert.Contains(t, stderr, "start (4489.45, 0.00 mm) reaches no support")
	// error members were not checked: the summary's one line for them
	// (no mark) shows no governing check, no ratio and no alternative
	assert.Regexp(t, `(?m)^-\s+35\s+2x10\s+M1\s+-\s+-\s+not checked: .*ERROR$`, stdout)

	_, _, stderr = runMMPlan(t, "")
	assert.NotContains(t, stderr, CodeUnmatchedSupport)
}

// A millimetre plan saved with $INSUNITS 0 (unitless, common in CAD
// exports) is read as inches: the units doubt says that was a guess.
func TestUnitlessPlanUnitsDoubtSaysGuess(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.dxf"))
	require.NoError(t, err)
	// $INSUNITS is group 70 after the header variable name (gen_mm_plan.py sets 4)
	txt := strings.Replace(string(data), "$INSUNITS\n 70\n4\n", "$INSUNITS\n 70\n0\n", 1)
	require.NotEqual(t, string(data), txt, "no $INSUNITS 4 in the fixture")
	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	require.NoError(t, os.WriteFile(plan, []byte(txt), 0o644))
	var stdout, stderr bytes.Buffer
	run([]string{"check", plan, "-p", filepath.Join("testdata", "mm_plan", "mm_plan.toml"), "-o", filepath.Join(dir, "out")}, &stdout, &stderr)
	first, _, _ := strings.Cut(stderr.String(), "\n")
	assert.Contains(t, first, CodeUnitsDoubt)
	assert.Contains(t, first, `units "in" (a guess: the drawing's $INSUNITS gives no units)`)
}

// TestUnitsSource: results.json says where the drawing's units came from:
// the millimetre plan's $INSUNITS when nothing overrides it, --units when
// given (common practice, no source: a reviewer must see why the plan was
// read in millimetres).
func TestUnitsSource(t *testing.T) {
	dir := t.TempDir()
	for _, f := range []string{"mm_plan.dxf", "mm_plan.toml"} {
		data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", f))
		require.NoError(t, err)
		require.NoError(t, os.WriteFile(filepath.Join(dir, f), data, 0o644))
	}
	for _, tc := range []struct {
		args []string
		want string
	}{{nil, "drawing ($INSUNITS)"}, {[]string{"--units", "mm"}, "command line (--units)"}} {
		out := filepath.Join(dir, "out")
		var stdout, stderr bytes.Buffer
		run(append([]string{"check", filepath.Join(dir, "mm_plan.dxf"), "-p", filepath.Join(dir, "mm_plan.toml"), "-o", out}, tc.args...), &stdout, &stderr)
		r, err := export.ReadJSON(filepath.Join(out, "results.json"))
		require.NoError(t, err, stderr.String())
		found := false
		for _, s := range r.Assumptions.Switches {
			if s.Name == "drawing.units" {
				found = true
				assert.Equal(t, "mm", s.Value, "%v", tc.args)
				assert.Equal(t, tc.want, s.Source, "%v", tc.args)
			}
		}
		assert.True(t, found, "no drawing.units switch (%v)", tc.args)
	}
}
