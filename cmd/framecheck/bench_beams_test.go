package main

// The speed clause of issue 17: a plan with its beams checked as members
// (posts under every beam, synth.Options.Beams) against the same joists on
// rigid supports. BenchmarkCheckRunRigid and BenchmarkCheckRunBeams run the
// whole `framecheck check` on each at 10,000 and 100,000 joists; the issue
// asks for the beams run within 1.3 times the rigid one. README "##
// Performance" has the figures. TestBeamPlanLikeForLike holds the two plans
// to what the comparison needs, at 2,000 joists.

import (
	"bytes"
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"testing"

	"framecheck/samples/bigplan/synth"
)

// beamBenchSizes are the plan sizes of the rigid and beams benchmarks.
var beamBenchSizes = []int{10_000, 100_000}

// writeBeamPlan writes the plan o describes and the project file that goes
// with it (synth.ProjectFor: with o.Beams, the beams' and posts' sizes).
func writeBeamPlan(tb testing.TB, dir string, o synth.Options) bigPlan {
	tb.Helper()
	p := writeBigPlanOpts(tb, dir, o)
	if err := os.WriteFile(p.toml, []byte(synth.ProjectFor(o)), 0o644); err != nil {
		tb.Fatal(err)
	}
	return p
}

// BenchmarkCheckRunRigid is the whole `framecheck check` on the synthetic
// plan whose beams have no posts: every beam a rigid bearing (FRM234).
func BenchmarkCheckRunRigid(b *testing.B) { benchCheckRunBeams(b, false) }

// BenchmarkCheckRunBeams is BenchmarkCheckRunRigid on the same joists with
// posts under every beam and the beams and posts sized: each beam checked
// with the joists' reactions, each post as a column, connections and
// foundation loads reported.
func BenchmarkCheckRunBeams(b *testing.B) { benchCheckRunBeams(b, true) }

func benchCheckRunBeams(b *testing.B, beams bool) {
	defer commandGC()()
	for _, n := range beamBenchSizes {
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			dir := b.TempDir()
			p := writeBeamPlan(b, dir, synth.Options{Joists: n, Beams: beams})
			checkLoop(b, p, dir)
			perJoist(b, n)
			if beams {
				b.ReportMetric(float64(p.stats.Beams), "beams")
				b.ReportMetric(float64(p.stats.Posts), "posts")
			}
		})
	}
}

// beamPlanResults is the part of results.json the comparison reads.
type beamPlanResults struct {
	Members []struct {
		ID       string    `json:"id"`
		Status   string    `json:"status"`
		MaxRatio float64   `json:"max_ratio"`
		SpansIn  []float64 `json:"spans_in"`
	} `json:"members"`
	LoadPath *struct {
		Beams []struct {
			ID       string   `json:"id"`
			Status   string   `json:"status"`
			Supports []string `json:"supports"`
			Carries  []string `json:"carries"`
		} `json:"beams"`
		Posts []struct {
			ID      string `json:"id"`
			Checked bool   `json:"checked"`
		} `json:"posts"`
	} `json:"load_path"`
}

var warningsRE = regexp.MustCompile(`members: .*, (\d+) warnings`)

// TestBeamPlanLikeForLike checks, at 2,000 joists, that the two plans the
// beam benchmarks compare are what they claim: the same joists with the
// same results; on the rigid plan every beam a rigid bearing (one FRM234
// each, no load path); on the beams plan every beam drawn a member in
// results.json on two or more posts, carrying joists, every post checked,
// and no FRM234. The counts come from synth.Stats (by construction).
func TestBeamPlanLikeForLike(t *testing.T) {
	read := func(beams bool) (beamPlanResults, []byte, int, synth.Stats) {
		dir := t.TempDir()
		p := writeBeamPlan(t, dir, synth.Options{Joists: 2000, Beams: beams})
		out := filepath.Join(dir, "out")
		var stdout, stderr bytes.Buffer
		if code := run([]string{"check", p.dxf, "-p", p.toml, "-o", out}, &stdout, &stderr); code != 1 {
			// 1: the storage bays fail and the short joists are errors by design
			t.Fatalf("beams %v: check exit %d, want 1; stderr:\n%s", beams, code, stderr.String())
		}
		raw, err := os.ReadFile(filepath.Join(out, "results.json"))
		if err != nil {
			t.Fatal(err)
		}
		var r beamPlanResults
		if err := json.Unmarshal(raw, &r); err != nil {
			t.Fatal(err)
		}
		// the summary line: "framecheck big2000.dxf: 2000 members: ..., 83 warnings"
		m := warningsRE.FindSubmatch(stdout.Bytes())
		if m == nil || !bytes.Contains(stderr.Bytes(), []byte("FRM234")) != beams {
			t.Fatalf("beams %v: no warning count, or FRM234 findings where not expected; stdout:\n%s\nstderr:\n%s",
				beams, stdout.String(), stderr.String())
		}
		warnings, _ := strconv.Atoi(string(m[1]))
		return r, raw, warnings, p.stats
	}
	rigid, _, rigidWarnings, rst := read(false)
	beams, beamsRaw, beamsWarnings, bst := read(true)

	// the rigid plan's only warnings are its beams' FRM234, one each
	if rigidWarnings != bst.Beams || bst.Beams == 0 || beamsWarnings != 0 {
		t.Errorf("warnings: rigid plan %d, want one FRM234 per beam line (%d); beams plan %d, want 0",
			rigidWarnings, bst.Beams, beamsWarnings)
	}
	if rigid.LoadPath != nil && len(rigid.LoadPath.Beams)+len(rigid.LoadPath.Posts) > 0 {
		t.Errorf("rigid plan: %d beams and %d posts in the load path, want none", len(rigid.LoadPath.Beams), len(rigid.LoadPath.Posts))
	}
	if rst.Beams != 0 || rst.Posts != 0 {
		t.Errorf("rigid plan: stats say %d beams, %d posts drawn", rst.Beams, rst.Posts)
	}
	if bytes.Contains(beamsRaw, []byte("FRM234")) {
		t.Error("beams plan: a beam without supports of its own (FRM234)")
	}

	if len(rigid.Members) != 2000 || len(beams.Members) != len(rigid.Members) {
		t.Fatalf("members: rigid %d, beams %d, want 2000 each", len(rigid.Members), len(beams.Members))
	}
	for k := range rigid.Members {
		a, b := rigid.Members[k], beams.Members[k]
		if a.ID != b.ID || a.Status != b.Status || a.MaxRatio != b.MaxRatio || fmt.Sprint(a.SpansIn) != fmt.Sprint(b.SpansIn) {
			t.Fatalf("member %d differs: rigid %+v, beams %+v", k, a, b)
		}
	}

	lp := beams.LoadPath
	if lp == nil || len(lp.Beams) != bst.Beams || len(lp.Posts) != bst.Posts {
		t.Fatalf("beams plan: load path %v, want %d beams and %d posts", lp != nil, bst.Beams, bst.Posts)
	}
	onPost := map[string]int{}
	pass := 0
	for _, b := range lp.Beams {
		if len(b.Supports) < 2 || len(b.Carries) == 0 {
			t.Errorf("%s: supports %v, carries %d joists; want two or more posts and some joists", b.ID, b.Supports, len(b.Carries))
		}
		for _, s := range b.Supports {
			onPost[s]++
		}
		if b.Status == "pass" {
			pass++
		}
	}
	for _, p := range lp.Posts {
		if !p.Checked || onPost[p.ID] != 1 {
			t.Errorf("%s: checked %v, under %d beams; want checked, under one", p.ID, p.Checked, onPost[p.ID])
		}
	}
	// the beams are sized to pass but for the heaviest storage bays
	// (synth.ProjectBeams)
	if pass < len(lp.Beams)*9/10 {
		t.Errorf("%d of %d beams pass, want at least 90%%", pass, len(lp.Beams))
	}
}
