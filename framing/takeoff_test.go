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
