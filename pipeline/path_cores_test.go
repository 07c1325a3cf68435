package pipeline

import (
	"bytes"
	"reflect"
	"runtime"
	"strings"
	"testing"

	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
	"framecheck/samples/bigplan/synth"
)

// TestLoadPathSameOnAnyCoreCount runs the 10,000-joist synthetic plan with
// its beams on posts (synth.Options.Beams: 431 beams, 1,638 posts, 9,953
// joints: enough for the joists' items, their batch and the joints to
// split; loadpath's TestSolveSameOnAnyCoreCount splits the posts) with
// one core and with two, each time sized (--size, with beam candidates,
// so that beams are picked from them on either core): the load path, the findings and the
// members' results must be the same, in the same order (issue 8: output
// order does not depend on scheduling). The plan is built by
// samples/bigplan/synth; the comparison is with itself (common practice,
// no source).
func TestLoadPathSameOnAnyCoreCount(t *testing.T) {
	if testing.Short() {
		t.Skip("-short: runs a 10,000-joist plan twice")
	}
	so := synth.Options{Joists: 10_000, Beams: true}
	data, _ := synth.Build(so)
	// beams sized too, from [sizing] beam_candidates
	text := strings.Replace(synth.ProjectFor(so), "[sizing]\n", "[sizing]\nbeam_candidates = [\"4x10\", \"6x10\", \"6x12\", \"6x14\", \"6x16\"]\n", 1)
	proj, err := project.ParseProject("beams.toml", []byte(text))
	if err != nil {
		t.Fatal(err)
	}
	var outs [2]*Outcome
	for i, procs := range []int{1, 2} {
		d, err := dxfimport.Read(bytes.NewReader(data), "beams.dxf", dxfimport.Options{Units: proj.Drawing.Units})
		if err != nil {
			t.Fatal(err)
		}
		plan := framing.Group(d, FramingOptions(proj))
		old := runtime.GOMAXPROCS(procs)
		outs[i], err = Run(Input{Plan: plan, PlanFile: "beams.dxf", Project: proj, Size: true})
		runtime.GOMAXPROCS(old)
		if err != nil {
			t.Fatal(err)
		}
	}
	a, b := outs[0], outs[1]
	if a.Path == nil || len(a.Path.Beams) < 100 || len(a.Path.Joints) < 4096 {
		t.Fatalf("load path too small to split: %d beams, %d posts, %d joints", len(a.Path.Beams), len(a.Path.Posts), len(a.Path.Joints))
	}
	sizes := map[string]bool{}
	for _, bo := range a.Path.Beams {
		sizes[bo.Res.Size] = true
	}
	if len(sizes) < 3 {
		t.Errorf("beam sizes picked: %v, want several", sizes)
	}
	if !reflect.DeepEqual(a.Path, b.Path) {
		t.Error("the load path differs between one core and two")
	}
	if !reflect.DeepEqual(a.Issues, b.Issues) || !reflect.DeepEqual(a.Results, b.Results) {
		t.Error("findings or results differ between one core and two")
	}
}

// TestStartAsRun: the members checked by Start, the load path followed
// when its path is called, give the outcome Run gives, load path, findings
// and results alike, on the 2,000-joist synthetic plan with its beams on
// posts (common practice, no source: the comparison is with itself).
func TestStartAsRun(t *testing.T) {
	so := synth.Options{Joists: 2_000, Beams: true}
	data, _ := synth.Build(so)
	proj, err := project.ParseProject("beams.toml", []byte(synth.ProjectFor(so)))
	if err != nil {
		t.Fatal(err)
	}
	in := func() Input {
		d, err := dxfimport.Read(bytes.NewReader(data), "beams.dxf", dxfimport.Options{Units: proj.Drawing.Units})
		if err != nil {
			t.Fatal(err)
		}
		return Input{Plan: framing.Group(d, FramingOptions(proj)), PlanFile: "beams.dxf", Project: proj}
	}
	a, err := Run(in())
	if err != nil {
		t.Fatal(err)
	}
	b, path, err := Start(in())
	if err != nil {
		t.Fatal(err)
	}
	if b.Path != nil {
		t.Fatal("Start followed the load path before its path was called")
	}
	path()
	if a.Path == nil || len(a.Path.Beams) == 0 || len(a.Path.Posts) == 0 {
		t.Fatal("no load path to compare")
	}
	if !reflect.DeepEqual(a.Path, b.Path) || !reflect.DeepEqual(a.Issues, b.Issues) || !reflect.DeepEqual(a.Results, b.Results) {
		t.Error("Start then path differs from Run")
	}
}
