package check

import (
	"strings"
	"testing"
)

// TestBracingPositionsText: the bracing record prints positions to 0.01
// in (146.25, not the 146.3 of four significant digits), so that the
// report's feet-inches to 1/16 in are exact; -0 prints as 0.
func TestBracingPositionsText(t *testing.T) {
	b := braceRec{spansIn: []float64{144}, firstIn: 2.25, added: []float64{74.25, 1234.5678}}
	want := "bearings at 2.25, 146.25 in, each bracing both edges (assumes blocking, a rim board or hangers there); " +
		"rows to add at 74.25, 1234.57 in (placed where the edge still failed, clear of the drawn rows)" +
		"; top edge not held by the sheathing (design.top_edge_braced = false)"
	if got := b.pointsText(true); got != want {
		t.Errorf("pointsText:\n got %s\nwant %s", got, want)
	}
	// a beam's top edge, held where joists bear on it: said so, not
	// blamed on design.top_edge_braced (an audit found that text on beams
	// of a project with top_edge_braced = true)
	b.topAtPoints, b.topAt = true, []float64{16, 32}
	if got := b.pointsText(true); !strings.HasSuffix(got, "; top edge also held where members bear on it, at 16, 32 in (a beam: not by the sheathing)") {
		t.Errorf("beam pointsText: %s", got)
	}
	if got := posText(-0.001); got != "0" {
		t.Errorf("posText(-0.001) = %q, want 0", got)
	}
}
