package export

import "testing"

// The engine names a case "D+0.75Lr+0.45W(down)"; the report writes
// "D + 0.75 Lr + 0.45 W down". CD must reach every case of the table
// (NDS 2018 Table 2.3.2: the shortest-duration load decides).
func TestComboLoadsCarryEngineCD(t *testing.T) {
	z := &Zone{DeadPsf: 8, RoofLivePsf: 20, WindDownPsf: 16, WindUpPsf: 75}
	cd := map[string]float64{
		caseKey("D"): 0.9, caseKey("D+Lr"): 1.25,
		caseKey("D+0.6W(down)"): 1.6, caseKey("D+0.6W(up)"): 1.6,
	}
	rows, problems := comboLoads([]string{"D", "D+(Lr or S)", "D+0.6W"}, z, 24, nil, cd)
	if len(problems) > 0 {
		t.Fatal(problems)
	}
	want := map[string]string{"D": "0.9", "D + Lr": "1.25", "D + 0.6 W down": "1.6", "D + 0.6 W up": "1.6"}
	for _, r := range rows {
		if w, ok := want[r.Case]; ok && r.CD != w {
			t.Errorf("case %q: CD %q, want %q", r.Case, r.CD, w)
		}
		delete(want, r.Case)
	}
	if len(want) > 0 {
		t.Errorf("cases missing from the table: %v", want)
	}
}
