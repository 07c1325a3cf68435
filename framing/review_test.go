package framing

import (
	"testing"
)

// Plans drawn the way framers draw them. Expected values are closed-form
// geometry from DOMAIN.md "Members from a plan" (span centre-to-centre,
// trib = half the gap to each neighbour): common practice, no source.

func TestDoubledJoistIsNotADuplicate(t *testing.T) {
	// a doubled joist (two plies face to face) is drawn as two lines
	// 1.5 in apart: two members, not one line drawn twice. Plies at
	// x = 16 and 17.5 between joists at 0 and 33.5:
	//   x=0:    edge, trib 16/2 = 8
	//   x=16:   8 + 1.5/2 = 8.75
	//   x=17.5: 0.75 + 16/2 = 8.75
	//   x=33.5: 8
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 17.5, 33.5).group(DefaultOptions())
	if len(pl.Members) != 4 {
		t.Fatalf("members = %d, want 4 (issues %v)", len(pl.Members), pl.Issues)
	}
	if c := issueCodes(pl.Issues); c[CodeDuplicateJoist] != 0 {
		t.Errorf("issues %v: a doubled joist is not a duplicate", pl.Issues)
	}
	for _, w := range []struct{ x, trib float64 }{{0, 8}, {16, 8.75}, {17.5, 8.75}, {33.5, 8}} {
		checkNear(t, "trib", member(t, pl, w.x, 72).TribIn, w.trib, 1e-9)
	}
}
