package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/export"
	"framecheck/framing"
)

// mmPlanRenamed writes testdata/mm_plan/mm_plan.dxf into a temporary
// folder with its layers renamed by pairs (old, new) and returns the path.
func mmPlanRenamed(t *testing.T, pairs ...string) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("testdata", "mm_plan", "mm_plan.dxf"))
	if err != nil {
		t.Fatal(err)
	}
	for i := 0; i+1 < len(pairs); i += 2 {
		data = bytes.ReplaceAll(data, []byte(pairs[i]), []byte(pairs[i+1]))
	}
	p := filepath.Join(t.TempDir(), "mm_plan.dxf")
	if err := os.WriteFile(p, data, 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// checkMM runs check on plan with args and returns the exit code, stderr
// and the results (nil when none were written).
func checkMM(t *testing.T, plan string, args ...string) (int, string, *export.Results) {
	t.Helper()
	out := filepath.Join(filepath.Dir(plan), "out")
	var stdout, stderr bytes.Buffer
	code := run(append([]string{"check", plan, "-o", out}, args...), &stdout, &stderr)
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	if err != nil {
		r = nil
	}
	return code, stderr.String(), r
}

// wantMMFramed: all 35 joists of mm_plan found, every end on a support
// (no FRM204), and the south span as TestMillimetrePlanEndToEnd writes
// it out: (3644.45 - 69.85) / 25.4 = 140.732 in, centre to centre of the
// double-line south wall and the interior wall.
func wantMMFramed(t *testing.T, label string, code int, stderr string, r *export.Results) {
	t.Helper()
	if r == nil {
		t.Fatalf("%s: exit %d, no results:\n%s", label, code, stderr)
	}
	if r.Summary.Members != 35 || strings.Contains(stderr, framing.CodeNoSupport) {
		t.Errorf("%s: %d members, want 35, every end on a support:\n%s", label, r.Summary.Members, stderr)
	}
	found := false
	for _, m := range r.Members {
		found = found || len(m.SpansIn) > 0 && math.Abs(m.SpansIn[0]-140.732) < 0.01
	}
	if !found {
		t.Errorf("%s: no member spans 140.732 in (written out above)", label)
	}
}

// The built-in layer patterns also match the structural layer names of
// the US National CAD Standard (from memory: verify): joists on S-JOIS,
// bearing walls on S-WALL..., beams on S-BEAM..., notes on S-ANNO-NOTE or
// S-ANNO-TEXT. mm_plan is drawn on S-JOIS, S-WALL-BRG and S-BEAM: it is
// checked with no project file.
func TestNationalCADStandardLayers(t *testing.T) {
	plan := mmPlanRenamed(t)
	code, stderr, r := checkMM(t, plan)
	wantMMFramed(t, "no -p", code, stderr, r)
	for _, name := range []string{"S-ANNO-NOTE", "S-ANNO-TEXT"} {
		p := mmPlanRenamed(t, "A-ANNO", name)
		var stdout, stderr bytes.Buffer
		if code := run([]string{"layers", p}, &stdout, &stderr); code != exitOK {
			t.Fatalf("layers: exit %d %s", code, stderr.String())
		}
		found := false
		for _, line := range strings.Split(stdout.String(), "\n") {
			f := strings.Fields(line)
			found = found || len(f) > 1 && f[0] == name && f[len(f)-1] == "labels"
		}
		if !found {
			t.Errorf("%s is not a labels layer by default:\n%s", name, stdout.String())
		}
	}
	// the same drawing on names of the user's own: nothing is found
	code, stderr, _ = checkMM(t, mmPlanRenamed(t, "S-JOIS", "FLR-JST"))
	if code != exitUsage || !strings.Contains(stderr, "no joists found") {
		t.Errorf("FLR-JST without flags: exit %d, want 2 and no joists found:\n%s", code, stderr)
	}
}

// check --joists and --supports map the layers of a drawing with names of
// its own, without a project file: the same plan checks as on the
// standard names.
func TestJoistsSupportsFlags(t *testing.T) {
	plan := mmPlanRenamed(t, "S-JOIS", "FLR-JST", "S-WALL-BRG", "BRG-W", "S-BEAM", "HDR")
	code, stderr, r := checkMM(t, plan, "--joists", "FLR-*,NONE-SUCH", "--supports", "BRG-W, flush-beam=HDR")
	wantMMFramed(t, "flags", code, stderr, r)
	hangers := r.Takeoff.Totals.Hangers
	// HDR as a bearing wall: the joists framing into it bear on top, no
	// hangers (the beam is a flush beam only when the flag says so)
	code, stderr, r = checkMM(t, plan, "--joists", "FLR-*", "--supports", "BRG-W,HDR")
	wantMMFramed(t, "HDR as wall", code, stderr, r)
	if hangers == 0 || r.Takeoff.Totals.Hangers != 0 {
		t.Errorf("hangers %d with flush-beam=HDR, %d with HDR a wall: want some, then none", hangers, r.Takeoff.Totals.Hangers)
	}
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"--supports", "beam=HDR"}, `kind "beam": want one of bearing-wall, dropped-beam, flush-beam, ledger`},
		{[]string{"--supports", "ledger="}, "no layer pattern after ledger="},
		{[]string{"--joists", " , "}, "want one or more layer patterns"},
		{[]string{"--joists", "FLR-*", "--supports", "flr-*"}, `"flr-*" is given to joists and to support 1 (bearing-wall)`},
	} {
		code, stderr, _ := checkMM(t, plan, c.args...)
		if code != exitUsage || !strings.Contains(stderr, c.want) {
			t.Errorf("%v: exit %d, want 2 and %q:\n%s", c.args, code, c.want, stderr)
		}
	}
}

// parseSupportsFlag groups the patterns by kind, with each kind's
// default bearing (common practice, no source: 3.5 in plate, 1.5 in
// hanger seat, as defaultBearingIn says).
func TestParseSupportsFlag(t *testing.T) {
	s, err := parseSupportsFlag("W1, Flush-Beam=B*, W2,ledger=L")
	if err != nil {
		t.Fatal(err)
	}
	if len(s) != 3 || s[0].Kind != "bearing-wall" || strings.Join(s[0].Layers, ",") != "W1,W2" || s[0].BearingIn != 3.5 ||
		s[1].Kind != "flush-beam" || s[1].Layers[0] != "B*" || s[1].BearingIn != 1.5 || s[2].Kind != "ledger" || !s[2].Check {
		t.Errorf("supports %+v", s)
	}
}
