package main

import (
	"os"
	"path/filepath"
	"reflect"
	"testing"

	"framecheck/project"
)

// TestExportReleaseSame maps the same 2,000-joist synthetic plan twice,
// once keeping the outcome's results and grouped members and once
// dropping each as soon as it is mapped (what check does without a load
// path): the results must be equal member for member, and the released
// outcome must hold neither array afterwards (issue 18: a million joists
// held both beside their export records). The plan's absolute path also
// takes the members' locations through relMemo. Common practice, no
// source: the reference is the mapping as it was.
func TestExportReleaseSame(t *testing.T) {
	dir := t.TempDir()
	bp := writeBigPlan(t, dir, 2000, false)
	proj, err := project.LoadProject(bp.toml)
	if err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(bp.dxf)
	if err != nil {
		t.Fatal(err)
	}
	if !filepath.IsAbs(bp.dxf) {
		t.Fatalf("%s: want an absolute path", bp.dxf)
	}
	mapped := func(release bool) (*outcome, any) {
		o, err := runPipeline(pipelineInput{planPath: bp.dxf, planData: data, project: proj})
		if err != nil {
			t.Fatal(err)
		}
		r := exportResults(o, bp.dxf, release)
		return o, r
	}
	kept, want := mapped(false)
	if kept.Results == nil || len(kept.Plan.Members) == 0 {
		t.Fatal("kept outcome lost its results or members")
	}
	dropped, got := mapped(true)
	if dropped.Results != nil || dropped.Plan.Members != nil {
		t.Errorf("released outcome still holds %d results and %d members", len(dropped.Results), len(dropped.Plan.Members))
	}
	if !reflect.DeepEqual(got, want) {
		t.Error("results mapped with release differ from those mapped without")
	}
}
