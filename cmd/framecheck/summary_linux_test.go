//go:build linux

package main

import (
	"bytes"
	"os"
	"path/filepath"
	"reflect"
	"regexp"
	"strings"
	"testing"

	"framecheck/check"
	"framecheck/export"
	"framecheck/project"
)

// demoTo runs `framecheck demo` with stdout going to out (read back by
// read) and returns stdout and stderr.
func demoTo(t *testing.T, out *os.File, read func() string, extra ...string) (string, string) {
	t.Helper()
	var stderr bytes.Buffer
	args := append([]string{"demo", "-o", filepath.Join(t.TempDir(), "demo")}, extra...)
	if code := run(args, out, &stderr); code != exitFail {
		t.Fatalf("exit %d, want %d (the demo has failing members): %s", code, exitFail, stderr.String())
	}
	return read(), stderr.String()
}

// The demo's 14 failing J7 joists (the storage bay) are one line of the summary, with the
// worst member, the governing check, the ratio and the lightest candidate
// that passes; each member is listed only with -v. On a terminal the
// status is coloured (ECMA-48 SGR 31 red, 33 yellow); piped, or with
// NO_COLOR, it is not.
func TestSummaryGroupsByMark(t *testing.T) {
	// J7 row: mark, count, size, worst, governing, ratio, alternative, status.
	row := regexp.MustCompile(`(?m)^J7 +14 +2x10 +M54 +bending-top +1\.62 +2x14 \(ratio 0\.9[67]\) +(\x1b\[31m)?FAIL`)
	t.Run("terminal", func(t *testing.T) {
		t.Setenv("NO_COLOR", "")
		m, s := openPty(t)
		defer m.Close()
		out, stderr := demoTo(t, s, reader(m, s))
		out = strings.ReplaceAll(out, "\r\n", "\n") // the pty's output processing
		if g := row.FindStringSubmatch(out); g == nil || g[1] == "" {
			t.Errorf("no red J7 group line:\n%s", out)
		}
		if !strings.Contains(out, "\x1b[33mERROR\x1b[0m") {
			t.Errorf("no yellow ERROR for the member without bearing:\n%q", out)
		}
		if strings.Contains(out, "M55") {
			t.Errorf("members listed one by one without -v:\n%s", out)
		}
		if strings.Contains(stderr, "info FRM206") || !strings.Contains(stderr, "16 info findings not shown (FRM221 9, FRM206 7)") {
			t.Errorf("info findings printed without -v:\n%s", stderr)
		}
	})
	t.Run("pipe", func(t *testing.T) {
		t.Setenv("NO_COLOR", "")
		r, w, err := os.Pipe()
		if err != nil {
			t.Fatal(err)
		}
		defer r.Close()
		out, _ := demoTo(t, w, reader(r, w))
		if strings.Contains(out, "\x1b[") {
			t.Errorf("escape codes through a pipe:\n%q", out)
		}
		if !row.MatchString(out) || strings.Contains(out, "M55") {
			t.Errorf("want the J7 group line and no member lines:\n%s", out)
		}
	})
	t.Run("NO_COLOR -v", func(t *testing.T) {
		t.Setenv("NO_COLOR", "1")
		m, s := openPty(t)
		defer m.Close()
		out, stderr := demoTo(t, s, reader(m, s), "-v")
		if strings.Contains(out, "\x1b[") {
			t.Errorf("NO_COLOR: escape codes:\n%q", out)
		}
		for _, id := range []string{"M14", "M54", "M55", "M66"} {
			if !regexp.MustCompile(`(?m)^` + id + ` `).MatchString(out) {
				t.Errorf("-v: no line for %s:\n%s", id, out)
			}
		}
		if n := strings.Count(stderr, "info FRM206"); n != 7 {
			t.Errorf("-v: %d FRM206 findings on stderr, want the 7 crossing members:\n%s", n, stderr)
		}
	})
}

// The alternative offered for J7, the storage joists (2x10, bending ratio 1.62 in the
// STORAGE zone) is the lightest candidate that passes. Written out with
// the section moduli of NDS 2018 Supplement Table 1B (2x10 Sx 21.39 in3,
// 2x12 31.64, 2x14 43.89) and the size factors of Table 4A (CF 1.1, 1.0,
// 0.9 for No.2 at 10, 12 and 14 in), bending scales as
// 1.62 x 21.39 x 1.1 / (Sx CF): 2x12 gives 1.20 (fails), 2x14 0.965.
func TestLightestPassingAlternative(t *testing.T) {
	dir := t.TempDir()
	var stdout, stderr bytes.Buffer
	if code := run([]string{"demo", "-o", dir}, &stdout, &stderr); code != exitFail {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	proj, err := project.LoadProject(filepath.Join(dir, "framecheck.toml"))
	if err != nil {
		t.Fatal(err)
	}
	o, err := runPipeline(pipelineInput{planPath: "plan.dxf", planData: mustRead(t, filepath.Join(dir, "plan.dxf")), project: proj})
	if err != nil {
		t.Fatal(err)
	}
	res := exportResults(o, "plan.dxf", false)
	var storage *badGroup
	groups := badGroups(o, res, proj)
	// the same with only the failing members' inputs kept, as check
	// keeps them before the mapping (failingInputs)
	all := o.Inputs
	o.Inputs = failingInputs(all, o.Results)
	if len(o.Inputs) == 0 || len(o.Inputs) >= len(all) {
		t.Fatalf("%d of %d inputs kept as failing", len(o.Inputs), len(all))
	}
	if kept := badGroups(o, res, proj); !reflect.DeepEqual(kept, groups) {
		t.Errorf("with the failing inputs only: %+v, want %+v", kept, groups)
	}
	o.Inputs = all
	for i := range groups {
		if groups[i].Mark == "J7" {
			storage = &groups[i]
		}
	}
	if storage == nil || storage.Alternative != "2x14" {
		t.Fatalf("J7 group %+v, want 2x14 as the lightest passing size", storage)
	}
	if want := 1.62 * 21.39 * 1.1 / (43.89 * 0.9); storage.AlternativeRatio < want-0.02 || storage.AlternativeRatio > want+0.02 {
		t.Errorf("2x14 ratio %.3f, want about %.3f (written out above)", storage.AlternativeRatio, want)
	}
	// and the engine agrees that the 2x12 fails for that member
	for k := range o.Plan.Members {
		if o.Plan.Members[k].ID == storage.Worst {
			cm := o.Inputs[k]
			cm.Size = "2x12"
			if r := check.CheckMember(cm, o.Settings); r.Status != check.StatusFail {
				t.Errorf("2x12: %s %.2f, want fail (about 1.20, written out above)", r.Status, r.MaxRatio)
			}
		}
	}
	for _, g := range groups {
		if g.Status == export.StatusError && g.Alternative != "" {
			t.Errorf("error group %+v offered an alternative", g)
		}
	}
}

// When no candidate passes, the summary says so instead of offering one.
func TestNoCandidatePasses(t *testing.T) {
	g := badGroup{Mark: "J1", Status: export.StatusFail, Tried: true}
	if got := g.alternativeText(); got != "no [sizing] candidate passes" {
		t.Errorf("alternativeText = %q", got)
	}
}

// TestPassesWithIsSizePick: the summary's "passes with (--size)" names
// the size --size picks, the most economical that passes, not the
// lightest section: an 18 ft roof rafter at 24 in under 50 psf of uplift
// passes as a 2x10 with more blocking rows than a 2x12 needs, and with
// each blocking piece weighted as 10 board feet the 2x12 is the pick
// (common practice, no source: the cost rule is framecheck's own,
// check.Size).
func TestPassesWithIsSizePick(t *testing.T) {
	m := check.Member{ID: "R1", Size: "2x8", Species: "DF-L", Grade: "No.2", LengthIn: 216,
		Bearings: []check.Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 216, LengthIn: 1.5}}, SpacingIn: 24, TribIn: 24, Use: "roof",
		Loads: check.AreaLoads{DeadPsf: 8, RoofLivePsf: 20, WindUpPsf: 50}, LiveLimit: 180, TotalLimit: 120, Repetitive: true}
	s := check.DefaultSettings()
	sz := project.Sizing{Candidates: []string{"2x8", "2x10", "2x12"}, BlockingPieceWeightBf: 10}
	pick := check.Size(m, s, sz.Candidates, sz.BlockingPieceWeightBf)
	if pick.Chosen.Size != "2x12" || pick.Chosen.Status != check.StatusPass || !pick.Alternatives[1].Pass {
		t.Fatalf("--size picks %s (%s), alternatives %+v: the case needs a passing 2x10 and a 2x12 pick", pick.Chosen.Size, pick.Chosen.Status, pick.Alternatives)
	}
	if size, ratio := lightestPassing(m, s, sz); size != "2x12" || ratio != pick.Chosen.MaxRatio {
		t.Errorf("passes with %s (ratio %.3f), want 2x12 (ratio %.3f) as --size picks", size, ratio, pick.Chosen.MaxRatio)
	}
}
