package check

import "testing"

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
	if got := posText(-0.001); got != "0" {
		t.Errorf("posText(-0.001) = %q, want 0", got)
	}
}
