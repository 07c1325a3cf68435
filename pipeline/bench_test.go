package pipeline

import (
	"bytes"
	"fmt"
	"testing"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
	"framecheck/samples/bigplan/synth"
)

// benchPlan groups an n-joist synthetic plan with its project.
func benchPlan(b *testing.B, n int) (*framing.Plan, *project.Project) {
	b.Helper()
	data, _ := synth.Build(synth.Options{Joists: n})
	proj, err := project.ParseProject("big.toml", []byte(synth.Project))
	if err != nil {
		b.Fatal(err)
	}
	d, err := dxfimport.Read(bytes.NewReader(data), "big.dxf", dxfimport.Options{Units: proj.Drawing.Units})
	if err != nil {
		b.Fatal(err)
	}
	return framing.Group(d, FramingOptions(proj)), proj
}

// BenchmarkRun is Run on a grouped synthetic plan: check inputs, checks,
// blocking rows, marks, takeoff and load path, without reading or
// grouping the drawing.
func BenchmarkRun(b *testing.B) {
	for _, n := range []int{1_000, 10_000, 100_000} {
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			plan, proj := benchPlan(b, n)
			b.ReportAllocs()
			b.ResetTimer()
			for b.Loop() {
				if _, err := Run(Input{Plan: plan, PlanFile: "big.dxf", Project: proj}); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(n)*float64(b.N)/b.Elapsed().Seconds(), "joists/s")
		})
	}
}

// BenchmarkStageChecks is the check stage as Run runs it (checkAll:
// identical members checked once, on every core), on the synthetic plans
// of samples/bigplan/synth. The whole command's benchmarks are in
// cmd/framecheck (README "Performance").
func BenchmarkStageChecks(b *testing.B) {
	for _, n := range []int{1_000, 10_000, 100_000} {
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			plan, proj := benchPlan(b, n)
			settings, err := Settings(proj)
			if err != nil {
				b.Fatal(err)
			}
			inputs := make([]check.Member, len(plan.Members))
			shifts := make([]float64, len(plan.Members))
			usable := make([]bool, len(plan.Members))
			for k := range plan.Members {
				var msgs []string
				inputs[k], shifts[k], msgs = checkInput(proj, plan, k, supportMemo(proj))
				usable[k] = !plan.Members[k].Error && len(msgs) == 0
			}
			o := &Outcome{Results: make([]check.Result, len(plan.Members))}
			b.ReportAllocs()
			b.ResetTimer()
			for b.Loop() {
				checkAll(inputs, shifts, usable, settings, proj, o)
			}
			b.ReportMetric(float64(n)*float64(b.N)/b.Elapsed().Seconds(), "joists/s")
		})
	}
}

// BenchmarkStageLoadPath is the load-path stage as Run runs it
// (runLoadPath: beams checked with the joists' reactions, posts, joints,
// walls) on the synthetic plan with its beams on posts
// (synth.Options.Beams), after the members' checks, which it does not
// time.
func BenchmarkStageLoadPath(b *testing.B) {
	for _, n := range []int{10_000, 100_000} {
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			o := synth.Options{Joists: n, Beams: true}
			data, _ := synth.Build(o)
			proj, err := project.ParseProject("beams.toml", []byte(synth.ProjectFor(o)))
			if err != nil {
				b.Fatal(err)
			}
			d, err := dxfimport.Read(bytes.NewReader(data), "beams.dxf", dxfimport.Options{Units: proj.Drawing.Units})
			if err != nil {
				b.Fatal(err)
			}
			plan := framing.Group(d, FramingOptions(proj))
			out, beams, inputs, twins, usable, err := runMembers(Input{Plan: plan, PlanFile: "beams.dxf", Project: proj})
			if err != nil {
				b.Fatal(err)
			}
			issues := out.Issues
			b.ReportAllocs()
			b.ResetTimer()
			for b.Loop() {
				out.Issues, out.Path = issues, nil
				runLoadPath(proj, plan, beams, inputs, twins, usable, out.Settings, out, false)
			}
			if out.Path == nil || len(out.Path.Beams) == 0 {
				b.Fatal("no load path")
			}
			b.ReportMetric(float64(n)*float64(b.N)/b.Elapsed().Seconds(), "joists/s")
		})
	}
}
