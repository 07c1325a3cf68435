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

func TestRowPiecesSkipDoubledJoistPlies(t *testing.T) {
	// a run x = 0, 16, 17.5, 33.5 (a doubled joist at 16/17.5): a row
	// crosses the bays 0-16 and 17.5-33.5, clear 16 - 1.5 = 14.5 in each
	// (2x dressed thickness 1.5 in, NDS 2018 Supplement Table 1B); the
	// plies face to face have no bay between them, so 2 pieces, not 3.
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 17.5, 33.5).group(DefaultOptions())
	if len(pl.Runs) != 1 {
		t.Fatalf("runs %+v, want one", pl.Runs)
	}
	rows := pl.PlaceRows(0, []float64{72})
	if len(rows) != 1 || rows[0].Pieces != 2 || len(rows[0].ClearIn) != 2 {
		t.Fatalf("rows %+v, want one row of 2 pieces", rows)
	}
	for _, c := range rows[0].ClearIn {
		checkNear(t, "clear", c, 14.5, 1e-9)
	}
	if to := BuildTakeoff(pl, rows); to.BlockingPieces != 2 {
		t.Errorf("takeoff blocking pieces %d, want 2", to.BlockingPieces)
	}
}
