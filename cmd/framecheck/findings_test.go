package main

import (
	"strings"
	"testing"

	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/pipeline"
)

// TestDrawingFindingsLeaveMembersOwn: the notes list the warnings and
// errors about the drawing that belong to no member; a member's own (at
// its place) is in its messages already, and a finding on the same line
// of the file at another entity is the drawing's. Common practice, no
// source.
func TestDrawingFindingsLeaveMembersOwn(t *testing.T) {
	member := dxfimport.Pos{File: "plan.dxf", Line: 10, Handle: "2A", Layer: "JOISTS"}
	sameLine := dxfimport.Pos{File: "plan.dxf", Line: 10, Handle: "2B", Layer: "JOISTS"}
	other := dxfimport.Pos{File: "plan.dxf", Line: 20, Handle: "3C", Layer: "TEXT"}
	o := &outcome{Outcome: &pipeline.Outcome{
		Plan: &framing.Plan{Members: []framing.Member{{ID: "M1", Pos: member}}},
		Issues: dxfimport.IssueList{
			{Pos: member, Code: "FRM1", Severity: dxfimport.SevWarning, Msg: "member's own"},
			{Pos: sameLine, Code: "FRM2", Severity: dxfimport.SevWarning, Msg: "same line, another entity"},
			{Pos: other, Code: "FRM3", Severity: dxfimport.SevError, Msg: "another place"},
			{Pos: other, Code: "FRM4", Severity: dxfimport.SevInfo, Msg: "only information"},
		},
	}}
	got := strings.Join(drawingFindings(o), "\n")
	for _, want := range []string{"same line, another entity", "another place"} {
		if !strings.Contains(got, want) {
			t.Errorf("notes %q: %q missing", got, want)
		}
	}
	for _, not := range []string{"member's own", "only information"} {
		if strings.Contains(got, not) {
			t.Errorf("notes %q: %q listed", got, not)
		}
	}
}

// TestLocationText: a member's location names its file, handle (or line)
// and layer, then its ends in feet and inches, as its doc says. Common
// practice, no source.
func TestLocationText(t *testing.T) {
	for _, c := range []struct {
		p    dxfimport.Pos
		want string
	}{
		{dxfimport.Pos{File: "plan.dxf", Line: 9, Handle: "43", Layer: "JOIST-FLOOR"}, `plan.dxf handle 43 (layer JOIST-FLOOR), 49'-9 3/4", 2'-0" to 61'-11 1/4", 2'-0"`},
		{dxfimport.Pos{File: "plan.dxf", Line: 9}, `plan.dxf line 9, 49'-9 3/4", 2'-0" to 61'-11 1/4", 2'-0"`},
		{dxfimport.Pos{}, `49'-9 3/4", 2'-0" to 61'-11 1/4", 2'-0"`},
	} {
		if got := locationText(c.p, [2]float64{597.75, 24}, [2]float64{743.25, 24}); got != c.want {
			t.Errorf("%#v: %q, want %q", c.p, got, c.want)
		}
	}
}
