package export

import "testing"

// TestDropCovered: in the short package a passing mark whose every check
// ratio is at or below a written-out mark of the same geometry is listed,
// not written out, and always names a mark that is written out (ratios
// compare transitively); a failing mark or one of other geometry is kept
// (common practice, no source: the rule is ours).
func TestDropCovered(t *testing.T) {
	mk := func(name string, ratio float64, status string, span float64) Mark {
		return Mark{Mark: name, Size: "2x10", Species: "DF", Grade: "No.2", Zone: "F", SpacingIn: 16, SpansIn: []float64{span}, MaxRatio: ratio, Status: status}
	}
	mb := func(id, mark string, r1, r2 float64) Member {
		return Member{ID: id, Mark: mark, MaxRatio: max(r1, r2), Checks: []Check{{Kind: "bending-top", Ratio: r1}, {Kind: "shear", Ratio: r2}}}
	}
	r := &Results{
		Marks: []Mark{mk("J1", 0.3, StatusPass, 144), mk("J2", 0.5, StatusPass, 144), mk("J3", 0.8, StatusPass, 144),
			mk("J4", 0.2, StatusPass, 120), mk("J5", 0.4, StatusPass, 144)},
		Members: []Member{mb("M1", "J1", 0.3, 0.1), mb("M2", "J2", 0.5, 0.2), mb("M3", "J3", 0.8, 0.3),
			mb("M4", "J4", 0.2, 0.1), mb("M5", "J5", 0.4, 0.35)},
	}
	var calcs []markCalc
	for _, m := range r.Marks {
		calcs = append(calcs, markCalc{Mark: m.Mark})
	}
	keep, covered := dropCovered(r, calcs)
	got := map[string]string{}
	for _, c := range covered {
		got[c.Mark] = c.By
	}
	// J1 and J2 below J3 (every ratio); J4 another span; J5's shear 0.35
	// is above J3's 0.3: kept.
	want := map[string]string{"J1": "J3", "J2": "J3"}
	if len(got) != len(want) || got["J1"] != "J3" || got["J2"] != "J3" {
		t.Errorf("covered %v, want %v", got, want)
	}
	if len(keep) != 3 {
		t.Errorf("kept %d marks, want 3 (J3, J4, J5)", len(keep))
	}
	r.Marks[0].Status = StatusFail
	if _, covered := dropCovered(r, calcs); len(covered) != 1 {
		t.Errorf("a failing mark is always written out: covered %+v", covered)
	}
}
