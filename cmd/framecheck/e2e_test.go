package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"framecheck/export"
)

// runDemoTo runs `framecheck demo -o dir` and returns the exit code,
// stdout, stderr and the results it wrote.
func runDemoTo(t *testing.T, dir string) (int, string, string, *export.Results) {
	t.Helper()
	var out, errb bytes.Buffer
	code := run([]string{"demo", "-o", dir}, &out, &errb)
	r, err := export.ReadJSON(filepath.Join(dir, resultsName))
	require.NoError(t, err, "demo wrote no readable results.json (exit %d); stderr:\n%s", code, errb.String())
	return code, out.String(), errb.String(), r
}

func memberByID(t *testing.T, r *export.Results, id string) *export.Member {
	t.Helper()
	for i := range r.Members {
		if r.Members[i].ID == id {
			return &r.Members[i]
		}
	}
	t.Fatalf("no member %s", id)
	return nil
}

func checkOf(t *testing.T, m *export.Member, kind string) export.Check {
	t.Helper()
	for _, c := range m.Checks {
		if c.Kind == kind {
			return c
		}
	}
	t.Fatalf("%s has no %s check", m.ID, kind)
	return export.Check{}
}

func near(got, want, relTol float64) bool {
	return math.Abs(got-want) <= relTol*math.Abs(want)
}

// TestDemoEndToEnd runs the README's demo command and checks the files
// it writes and a few members against hand calculations.
func TestDemoEndToEnd(t *testing.T) {
	dir := t.TempDir()
	code, stdout, stderr, r := runDemoTo(t, dir)
	assert.Equal(t, exitFail, code, "the demo has failing members by design; stderr:\n%s", stderr)
	for _, name := range []string{resultsName, scheduleName, reportName, "plan-checked.dxf"} {
		st, err := os.Stat(filepath.Join(dir, name))
		if assert.NoError(t, err, name) {
			assert.NotZero(t, st.Size(), "%s is empty", name)
		}
	}
	assert.Equal(t, export.Schema, r.Schema)
	assert.Equal(t, "in", r.DrawingUnits)
	if r.Summary.Members != len(r.Members) || r.Summary.Pass+r.Summary.Fail+r.Summary.Error != len(r.Members) {
		t.Errorf("summary %+v does not add up to %d members", r.Summary, len(r.Members))
	}
	if r.Summary.Fail == 0 || r.Summary.Error == 0 || r.Summary.Pass == 0 {
		t.Errorf("summary %+v: the demo should have passing, failing and error members", r.Summary)
	}
	// The balcony joists run 42 in past the south wall (samples/demogen,
	// F3): their mark lists the cantilever with the span, in results.json
	// and in the printed schedule.
	for _, mk := range r.Marks {
		if strings.Contains(mk.Zone, "BALCONY") && mk.OverhangsIn != [2]float64{42, 0} {
			t.Errorf("mark %s (%s): overhangs %v, want [42 0]", mk.Mark, mk.Zone, mk.OverhangsIn)
		}
	}
	for _, want := range []string{"mark", "blocking rows to add", "takeoff:", "licensed professional", `3'-6" cantilever + 12'-0"`} {
		if !strings.Contains(stdout, want) {
			t.Errorf("summary lacks %q:\n%s", want, stdout)
		}
	}

	// Storage-zone joist, 2x10 DF-L No.2 at 16 in on a 144 in simple span,
	// D 12 psf + L 125 psf. Hand calculation:
	//   w = (12 + 125) psf x 16/12 ft = 182.67 plf = 15.222 lb/in
	//   M = w L^2 / 8 = 15.222 x 144^2 / 8 = 39,456 lb-in
	//   S = 1.5 x 9.25^2 / 6 = 21.39 in^3 (NDS 2018 Supplement Table 1B)
	//   fb = M / S = 1,844.5 psi
	//   Fb' = Fb CD CF Cr = 900 x 1.0 x 1.1 x 1.15 = 1,138.5 psi
	//     (Fb 900 and CF 1.1: NDS 2018 Supplement Table 4A, DF-L No.2, 2x10;
	//      Cr 1.15: NDS 2018 4.3.9; CD 1.0 for D+L: NDS 2018 Table 2.3.2)
	//   ratio = 1.620
	var storage *export.Member
	for i := range r.Members {
		m := &r.Members[i]
		if m.Zone == "STORAGE" && m.Status == export.StatusFail {
			storage = m
			break
		}
	}
	if storage == nil {
		t.Fatal("no failing STORAGE member in the demo")
	}
	b := checkOf(t, storage, export.KindBendingTop)
	if !near(b.Actual, 1844.5, 0.003) || !near(b.Allowable, 1138.5, 0.001) || !near(b.Ratio, 1.620, 0.003) {
		t.Errorf("%s bending-top fb %.1f Fb' %.1f ratio %.3f, want 1844.5, 1138.5, 1.620 (hand calculation)",
			storage.ID, b.Actual, b.Allowable, b.Ratio)
	}
	// Live-load deflection 5 wL L^4 / (384 E I), wL = 125 x 16/12 plf,
	// E = 1,600,000 psi (NDS 2018 Supplement Table 4A), I = 1.5 x 9.25^3/12
	// (Table 1B); limit L/360 (IBC 2018 Table 1604.3, floor).
	wL := 125.0 * 16 / 12 / 12
	iIn4 := 1.5 * math.Pow(9.25, 3) / 12
	defl := 5 * wL * math.Pow(144, 4) / (384 * 1.6e6 * iIn4)
	dl := checkOf(t, storage, export.KindDeflectionLive)
	if !near(dl.Actual, defl, 0.003) || !near(dl.Allowable, 144.0/360, 0.001) {
		t.Errorf("%s live deflection %.4f allowed %.4f, want %.4f and %.4f", storage.ID, dl.Actual, dl.Allowable, defl, 144.0/360)
	}
	// Shear at the bearing centre-line: V = wL/2 = 1,096 lb, fv = 1.5 V / A
	// = 1.5 x 1096 / 13.875 = 118.5 psi (NDS 2018 3.4.2); Fv = 180 psi
	// (NDS 2018 Supplement Table 4A, DF-L No.2), CD 1.0.
	sh := checkOf(t, storage, export.KindShear)
	if !near(sh.Actual, 1.5*(15.2222*144/2)/13.875, 0.005) || !near(sh.Allowable, 180, 0.001) {
		t.Errorf("%s shear fv %.1f Fv' %.1f, want 118.5 and 180", storage.ID, sh.Actual, sh.Allowable)
	}

	// The joist drawn 6 in short of its flush beam is an error member that
	// says why, and every other member still ran.
	var errs []*export.Member
	for i := range r.Members {
		if r.Members[i].Status == export.StatusError {
			errs = append(errs, &r.Members[i])
		}
	}
	if len(errs) != 1 || len(errs[0].Messages) == 0 || !strings.Contains(errs[0].Messages[0], "reaches no support") {
		t.Errorf("want one error member saying it reaches no support, got %d: %+v", len(errs), errs)
	}

	// Roof edge zone: net uplift needs blocking, and every member of a run
	// is checked with the run's rows, one row at mid-span for the 12 ft
	// spans (DOMAIN.md "Blocking rows": n = 1 is mid-span).
	rowsSeen := 0
	for i := range r.Members {
		m := &r.Members[i]
		if m.Zone != "ROOF-EDGE" || len(m.SpansIn) != 1 || !near(m.SpansIn[0], 144, 0.02) {
			continue
		}
		if len(m.BlockingRowsPerSpan) != 1 || m.BlockingRowsPerSpan[0] != 1 || len(m.BlockingAtIn) != 1 {
			t.Errorf("%s: rows %v at %v, want one row", m.ID, m.BlockingRowsPerSpan, m.BlockingAtIn)
			continue
		}
		mid := (m.BearingsAtIn[0] + m.BearingsAtIn[1]) / 2
		if math.Abs(m.BlockingAtIn[0]-mid) > 0.5 {
			t.Errorf("%s: row at %.2f in, want mid-span %.2f", m.ID, m.BlockingAtIn[0], mid)
		}
		if m.Status != export.StatusPass {
			t.Errorf("%s: status %s with its row, want pass", m.ID, m.Status)
		}
		rowsSeen++
	}
	if rowsSeen == 0 {
		t.Error("no 12 ft ROOF-EDGE member found")
	}
	if len(r.BlockingRows) == 0 || r.Takeoff.Totals.BlockingPieces == 0 {
		t.Errorf("no blocking rows or pieces in the takeoff: %d rows, %+v", len(r.BlockingRows), r.Takeoff.Totals)
	}
	if r.Takeoff.Totals.JoistCount != len(r.Members) {
		t.Errorf("takeoff counts %d joists, plan has %d members", r.Takeoff.Totals.JoistCount, len(r.Members))
	}
}

// TestCheckBadInputs: unusable input exits 2 with a message naming the file,
// and leaves no output folder behind.
func TestCheckBadInputs(t *testing.T) {
	dir := t.TempDir()
	var out, errb bytes.Buffer
	if code := run([]string{"demo", "-o", dir}, &out, &errb); code == exitUsage {
		t.Fatalf("demo: exit 2: %s", errb.String())
	}
	plan := filepath.Join(dir, "plan.dxf")
	badToml := filepath.Join(dir, "bad.toml")
	if err := os.WriteFile(badToml, []byte("[design]\nkcrr = 1.5\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		name string
		args []string
		want []string
	}{
		{"misspelled key", []string{"check", plan, "-p", badToml}, []string{"bad.toml:2", "kcrr"}},
		{"missing plan", []string{"check", filepath.Join(dir, "nope.dxf")}, []string{"nope.dxf"}},
		{"bad units", []string{"check", plan, "--units", "yd"}, []string{"--units"}},
		{"no arguments", []string{"check"}, []string{"usage"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			outDir := filepath.Join(t.TempDir(), "out")
			var out, errb bytes.Buffer
			code := run(append(c.args, "-o", outDir), &out, &errb)
			if code != exitUsage {
				t.Errorf("exit %d, want 2; stderr: %s", code, errb.String())
			}
			for _, w := range c.want {
				if !strings.Contains(errb.String(), w) {
					t.Errorf("stderr lacks %q: %s", w, errb.String())
				}
			}
			if _, err := os.Stat(outDir); err == nil {
				t.Errorf("output folder %s was created for a failed run", outDir)
			}
		})
	}
}

// TestCheckSizePicksOneSizePerRun runs `check --size` on the demo plan: the
// overloaded storage run needs 2x14, and every run comes out in one size.
func TestCheckSizePicksOneSizePerRun(t *testing.T) {
	dir := t.TempDir()
	var out, errb bytes.Buffer
	require.NotEqual(t, exitUsage, run([]string{"demo", "-o", dir}, &out, &errb), errb.String())
	outDir := filepath.Join(dir, "sized")
	out.Reset()
	errb.Reset()
	code := run([]string{"check", filepath.Join(dir, "plan.dxf"), "-p", filepath.Join(dir, "framecheck.toml"), "-o", outDir, "--size"}, &out, &errb)
	// The joist drawn short of its beam stays an error member: exit 1.
	assert.Equal(t, exitFail, code, errb.String())
	r, err := export.ReadJSON(filepath.Join(outDir, resultsName))
	require.NoError(t, err)
	assert.Zero(t, r.Summary.Fail, "sizing leaves no failing member")
	sizeOfRun := map[string]string{}
	for _, row := range r.BlockingRows {
		for _, id := range row.Members {
			m := memberByID(t, r, id)
			if s, ok := sizeOfRun[row.Run]; ok && s != m.Size {
				t.Errorf("run %s framed in %s and %s", row.Run, s, m.Size)
			}
			sizeOfRun[row.Run] = m.Size
		}
	}
	// Storage bay, 144 in span, D 12 + L 125 psf at 16 in: M = 39,456 lb-in
	// (see TestDemoEndToEnd). 2x12: S = 31.64 in^3, Fb' = 900(1.0)(1.15) =
	// 1,035 psi, fb = 1,247 psi: fails. 2x14: S = 1.5(13.25)^2/6 = 43.89 in^3
	// (NDS 2018 Supplement Table 1B), CF = 0.9 (Table 4A), Fb' = 900(0.9)(1.15)
	// = 931.5 psi, fb = 899 psi, ratio 0.965: the lightest that passes.
	for _, m := range r.Members {
		if m.Zone != "STORAGE" || m.Status == export.StatusError {
			continue
		}
		assert.Equal(t, "2x14", m.Size, "%s", m.ID)
		if m.TribIn > 15 { // interior joists carry the full 16 in
			assert.InDelta(t, 0.965, checkOf(t, &m, export.KindBendingTop).Ratio, 0.003, "%s", m.ID)
		}
	}
}
