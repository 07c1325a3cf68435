package check

import "testing"

func TestRows_ListsTheTables(t *testing.T) {
	m := BuiltinMaterials()
	rows, err := m.Rows("DF-L")
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for _, r := range rows {
		if r.Species != "Douglas Fir-Larch" {
			t.Fatalf("Rows(DF-L) returned %s", r.Species)
		}
		// NDS 2018 Supplement Table 4A, Douglas Fir-Larch No.2: Fb 900 psi,
		// E 1,600,000 psi (checked: docs/VERIFIED.md, as the table itself).
		if r.Grade == "No.2" {
			found = true
			if r.FbPsi != 900 || r.EPsi != 1.6e6 {
				t.Errorf("DF-L No.2 Fb %v E %v, want 900 and 1,600,000", r.FbPsi, r.EPsi)
			}
		}
	}
	if !found {
		t.Error("no DF-L No.2 row")
	}
	all, _ := m.Rows("")
	if len(all) <= len(rows) {
		t.Errorf("all rows %d, DF-L alone %d", len(all), len(rows))
	}
	if _, err := m.Rows("Balsa"); err == nil {
		t.Error("Rows(Balsa): want an error")
	}
	if sp := m.Species(); len(sp) < 4 {
		t.Errorf("Species() = %v, want at least the four of Tables 4A and 4B", sp)
	}
}
