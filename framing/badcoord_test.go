package framing

import (
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// A joist drawn at 1e300 in cannot be checked: its FRM214 is an error, so
// the run is not reported clean; a support line there is only a warning.
func TestBadCoordinateSeverity(t *testing.T) {
	p := newPlan().walls(0, 64, 0, 144).joists(0, 144, 16, 32, 48)
	p.line("JOIST", 1e300, 0, 1e300, 144) // handle 106
	p.line("WALL", 1e300, 0, 1e300+64, 0) // handle 107
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 3 {
		t.Fatalf("%d members, want the 3 joists drawn near the origin", len(pl.Members))
	}
	want := map[string]dxfimport.Severity{"106": dxfimport.SevError, "107": dxfimport.SevWarning}
	for _, is := range pl.Issues {
		if is.Code != CodeBadCoordinate {
			continue
		}
		if sev, ok := want[is.Pos.Handle]; !ok || sev != is.Severity {
			t.Errorf("%v: severity %v", is, is.Severity)
		}
		delete(want, is.Pos.Handle)
	}
	if len(want) > 0 {
		t.Errorf("no FRM214 for handles %v", want)
	}
}

// In a file without handles, a joist drawn twice is named by its line.
func TestDuplicateNamedByLine(t *testing.T) {
	p := newPlan().walls(0, 64, 0, 144).joists(0, 144, 16, 32, 32)
	for i := range p.d.Entities {
		p.d.Entities[i].Pos.Handle = ""
	}
	pl := p.group(DefaultOptions())
	for _, is := range pl.Issues {
		if is.Code == CodeDuplicateJoist {
			// The joists are entities 4 and 5, at lines 40 and 50 (helpers_test.go).
			if !strings.Contains(is.Msg, "line 50 duplicates line 40") {
				t.Errorf("message %q", is.Msg)
			}
			return
		}
	}
	t.Error("no FRM203 for the joist drawn twice")
}
