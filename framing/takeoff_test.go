package framing

import (
	"math"
	"testing"
)

// TestTakeoffTotalsDeterministic: the board-feet totals are summed in the
// order the lines are listed, so every run of the same plan gives the same
// bits (summed in map order, the last digits changed from run to run;
// common practice, no source).
func TestTakeoffTotalsDeterministic(t *testing.T) {
	p := &Plan{}
	for i := 0; i < 60; i++ {
		size := []string{"2x6", "2x8", "2x10", "2x12"}[i%4]
		// lengths from 8 to 40 ft: many lines, board feet like 20 x 14 / 12
		p.Members = append(p.Members, Member{Size: size, Species: "Douglas Fir-Larch", Grade: "No.2",
			LengthIn: float64(90 + 6*i)})
	}
	first := BuildTakeoff(p, nil)
	sum := 0.0
	for _, l := range first.Joists {
		sum += l.BoardFeet
	}
	if math.Float64bits(sum) != math.Float64bits(first.JoistBoardFeet) {
		t.Errorf("total %v is not the sum of the listed lines %v", first.JoistBoardFeet, sum)
	}
	for run := 0; run < 30; run++ {
		if got := BuildTakeoff(p, nil); math.Float64bits(got.JoistBoardFeet) != math.Float64bits(first.JoistBoardFeet) ||
			math.Float64bits(got.TotalBoardFeet) != math.Float64bits(first.TotalBoardFeet) {
			t.Fatalf("run %d: totals %v / %v, first run %v / %v", run, got.JoistBoardFeet, got.TotalBoardFeet,
				first.JoistBoardFeet, first.TotalBoardFeet)
		}
	}
}

// TestBoardFeetActualSizes: a size in actual inches (structural composite
// lumber, glulam) counts its actual b x d; a nominal size its nominal
// b x d (DOMAIN.md "Takeoff"; board foot = 144 in^3, common practice, no
// source).
func TestBoardFeetActualSizes(t *testing.T) {
	cases := []struct {
		size string
		ft   float64
		want float64
	}{
		{"2x10", 12, 20},                 // 2 x 10 x 12 / 12
		{"(3) 2x12", 16, 96},             // 6 x 12 x 16 / 12
		{"1.75x14", 12, 24.5},            // 1.75 x 14 x 12 / 12
		{"(2) 1.75x11.875", 12, 41.5625}, // 3.5 x 11.875 x 12 / 12
		{"5.125x12", 20, 102.5},          // 5.125 x 12 x 20 / 12
		{"LVL", 12, 0},
		{"2xNaN", 12, 0},
	}
	for _, c := range cases {
		if got := boardFeet(c.size, c.ft); math.Abs(got-c.want) > 1e-9 {
			t.Errorf("boardFeet(%q, %g) = %g, want %g", c.size, c.ft, got, c.want)
		}
	}
}
