package framing

import (
	"fmt"
	"testing"
)

func TestPlaceRows(t *testing.T) {
	// the joist at x=16 is drawn from y=-1: rows still line up at y=48, 96
	pl := newPlan().walls(-10, 100, 0, 144).
		joists(0, 144, 0).line("JOIST", 16, -1, 16, 144).joists(0, 144, 32, 48, 64).
		group(DefaultOptions())
	rows := pl.PlaceRows(0, []float64{48, 96})
	if len(rows) != 2 {
		t.Fatalf("rows = %d", len(rows))
	}
	for i, r := range rows {
		y := 48 * float64(i+1)
		if !near(r.From.X, 0, 1e-9) || !near(r.From.Y, y, 1e-9) || !near(r.To.X, 64, 1e-9) || !near(r.To.Y, y, 1e-9) {
			t.Errorf("row %s from %v to %v, want (0,%g)-(64,%g)", r.ID, r.From, r.To, y, y)
		}
		// 4 bays; clear = 16 - 1.5 (2x dressed thickness, NDS 2018
		// Supplement Table 1B)
		if r.Pieces != 4 || r.Size != "2x10" || r.Run != "R1" {
			t.Errorf("row %+v", r)
		}
		for _, c := range r.ClearIn {
			checkNear(t, "clear", c, 14.5, 1e-9)
		}
	}
	if rows[0].ID != "R1-B1" || rows[1].ID != "R1-B2" {
		t.Errorf("ids %s %s", rows[0].ID, rows[1].ID)
	}
	if pl.PlaceRows(5, []float64{1}) != nil {
		t.Error("PlaceRows on a missing run should return nil")
	}
	// Takeoff of the rows: 8 pieces of 14.5 in 2x10: 2*10*(14.5/12)/12 bf each
	to := BuildTakeoff(pl, rows)
	if to.BlockingPieces != 8 || len(to.Blocking) != 1 {
		t.Fatalf("blocking %+v", to.Blocking)
	}
	checkNear(t, "blocking bf", to.BlockingBoardFeet, 8*2*10*(14.5/12)/12, 1e-9)
}

func TestOrderLength(t *testing.T) {
	// DOMAIN.md "Takeoff": next even foot, 8 ft minimum
	cases := []struct {
		in   float64
		want int
	}{{60, 8}, {96, 8}, {97, 10}, {144, 12}, {155.5, 14}, {288, 24}, {300, 26}}
	for _, c := range cases {
		if got := OrderLengthFt(c.in); got != c.want {
			t.Errorf("OrderLengthFt(%g) = %d, want %d", c.in, got, c.want)
		}
	}
}

func TestTakeoffJoists(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0, 144, 300).
		joists(0, 144, 0, 16, 32).joists(0, 300, 48).
		line("BEAM-FLUSH", -10, 400, 100, 400).joists(300, 400, 0, 16).
		group(DefaultOptions())
	to := BuildTakeoff(pl, nil)
	// 3 x 12 ft, 1 x 26 ft (special), 2 x 100 in -> 10 ft; 2x10:
	// bf = 2*10*L/12 (DOMAIN.md "Takeoff")
	want := []JoistLine{
		{Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", OrderLengthFt: 10, Count: 2, BoardFeet: 2 * 20 * 10 / 12.0},
		{Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", OrderLengthFt: 12, Count: 3, BoardFeet: 3 * 20},
		{Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", OrderLengthFt: 26, Count: 1, BoardFeet: 20 * 26 / 12.0, SpecialOrder: true},
	}
	if len(to.Joists) != len(want) {
		t.Fatalf("joists %+v", to.Joists)
	}
	for i, w := range want {
		g := to.Joists[i]
		if g.OrderLengthFt != w.OrderLengthFt || g.Count != w.Count || g.SpecialOrder != w.SpecialOrder || !near(g.BoardFeet, w.BoardFeet, 1e-9) {
			t.Errorf("line %d = %+v, want %+v", i, g, w)
		}
	}
	if to.HangerCount != 2 || len(to.Hangers) != 1 || to.Hangers[0].Size != "2x10" {
		t.Errorf("hangers %+v", to.Hangers)
	}
	checkNear(t, "total bf", to.TotalBoardFeet, 20*(2*10+3*12+26)/12.0, 1e-9)
}

func TestAssignMarks(t *testing.T) {
	pl := newPlan().walls(-10, 200, 0, 144).joists(0, 144, 0, 16, 32, 48).
		walls(-10, 200, 300).joists(144, 300, 100, 116, 132).
		group(DefaultOptions())
	AssignMarks(pl)
	got := ""
	for _, m := range pl.Members {
		got += fmt.Sprintf("%s=%s ", m.ID, m.Mark)
	}
	// edge joists (trib 8) differ from interior ones (trib 16); the
	// 156 in bay differs from the 144 in bay
	want := "M1=J1 M2=J2 M3=J2 M4=J1 M5=J3 M6=J4 M7=J3 "
	if got != want {
		t.Errorf("marks %s, want %s", got, want)
	}
	AssignMarks(pl)
	again := ""
	for _, m := range pl.Members {
		again += fmt.Sprintf("%s=%s ", m.ID, m.Mark)
	}
	if again != got {
		t.Errorf("marks not reproducible: %s then %s", got, again)
	}
	// Resizing M2 splits J2 by size: the first member's size keeps the
	// name, the other size is numbered after every mark, and no other
	// mark moves (marks are named without their size, issue 16).
	pl.Members[1].Size = "2x12"
	AssignMarks(pl)
	if pl.Members[1].Mark != "J2" || pl.Members[2].Mark != "J5" || pl.Members[4].Mark != "J3" || pl.Members[5].Mark != "J4" {
		t.Errorf("after resizing M2: M2 %s M3 %s M5 %s M6 %s, want J2 J5 J3 J4",
			pl.Members[1].Mark, pl.Members[2].Mark, pl.Members[4].Mark, pl.Members[5].Mark)
	}
}

func TestPlaceRowsOnHandBuiltPlan(t *testing.T) {
	// a Plan not made by Group (as another package's test might build it)
	p := &Plan{Runs: []Run{{ID: "R1", Members: []int{0, 1, 2}}}}
	for _, x := range []float64{0, 24, 48} {
		p.Members = append(p.Members, Member{Start: Point{X: x}, End: Point{X: x, Y: 120}, LengthIn: 120, Size: "2x8",
			Bearings: []Bearing{{AtIn: 0}, {AtIn: 120}}})
	}
	rows := p.PlaceRows(0, []float64{60})
	if len(rows) != 1 || rows[0].Pieces != 2 || !near(rows[0].ClearIn[0], 22.5, 1e-9) || !near(rows[0].To.Y, 60, 1e-9) {
		t.Errorf("rows %+v, want 2 pieces of 24 - 1.5 = 22.5 in at y=60", rows)
	}
}

// TestPlaceRows_DrawnBaysNotCounted: a bay whose two joists both carry a
// drawn row within d of the row to add is blocked already and gets no
// piece; a row blocked across every bay is not laid (the takeoff counts
// only pieces to add; issue 13). 2x10: d = 9.25 in (NDS 2018 Supplement
// Table 1B).
func TestPlaceRows_DrawnBaysNotCounted(t *testing.T) {
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 32, 48, 64).group(DefaultOptions())
	// drawn blocking at 72 across the first three joists (two bays), and
	// at 100 across all five
	for k := range pl.Members {
		if x := pl.Members[k].Start.X; x <= 16.5 {
			pl.Members[k].ExistingBlockingAtIn = []float64{72, 100}
		} else if x <= 32.5 {
			pl.Members[k].ExistingBlockingAtIn = []float64{72, 100}
		} else {
			pl.Members[k].ExistingBlockingAtIn = []float64{100}
		}
	}
	rows := pl.PlaceRows(0, []float64{76, 40, 108})
	if len(rows) != 2 {
		t.Fatalf("rows %+v, want 2 (the one at 108 is on the drawn row at 100)", rows)
	}
	if rows[0].Pieces != 2 || rows[1].Pieces != 4 {
		t.Errorf("pieces %d, %d; want 2 (two bays drawn at 72) and 4", rows[0].Pieces, rows[1].Pieces)
	}
	if rows[0].ID != "R1-B1" || rows[1].ID != "R1-B2" {
		t.Errorf("ids %s %s", rows[0].ID, rows[1].ID)
	}
	if to := BuildTakeoff(pl, rows); to.BlockingPieces != 6 {
		t.Errorf("takeoff: %d pieces, want 6", to.BlockingPieces)
	}
}

// TestTakeoffTidy: sums of board feet carry binary rounding (a demo's
// 2,156 bf summed to 2155.9999999999991), which the spreadsheet showed
// as 2155.99999999999; they are rounded to 1e-9 (common practice, no
// source).
func TestTakeoffTidy(t *testing.T) {
	to := Takeoff{JoistBoardFeet: 2155.9999999999991, TotalBoardFeet: 519.9999999999991,
		Joists:   []JoistLine{{BoardFeet: 33.333333333333336}},
		Blocking: []BlockingLine{{BoardFeet: 2249.7499999999991, TotalLengthIn: 674.9999999999999}}}
	to.tidy()
	if to.JoistBoardFeet != 2156 || to.TotalBoardFeet != 520 || to.Blocking[0].BoardFeet != 2249.75 || to.Blocking[0].TotalLengthIn != 675 {
		t.Errorf("tidied %+v", to)
	}
	if !near(to.Joists[0].BoardFeet, 100.0/3, 1e-9) {
		t.Errorf("a third of 100 bf: %v", to.Joists[0].BoardFeet)
	}
}
