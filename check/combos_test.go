package check

import (
	"strings"
	"testing"
)

func TestDefaultCombos_ASCE7_16_241(t *testing.T) {
	var names []string
	for _, c := range DefaultCombos() {
		for _, f := range c.Cases {
			names = append(names, caseName(f, 1, [numLoadTypes]bool{true, true, true, true, true}))
		}
	}
	// ASCE 7-16 2.4.1 combinations 1 to 7 for D, L, Lr, S and W.
	want := "D|D+L|D+Lr|D+S|D+0.75L+0.75Lr|D+0.75L+0.75S|D+0.6W(down)|D+0.75L+0.75Lr+0.45W(down)|D+0.75L+0.75S+0.45W(down)|0.6D+0.6W(down)"
	if got := strings.Join(names, "|"); got != want {
		t.Errorf("cases:\n got %s\nwant %s", got, want)
	}
}

func TestParseCombos(t *testing.T) {
	c, err := ParseCombos([]string{"D + 0.75L + 0.75(Lr or S)", "0.6D+0.6W", "1.0D+1.0LR"})
	if err != nil {
		t.Fatal(err)
	}
	if len(c) != 3 || len(c[0].Cases) != 2 || c[0].Cases[1][LoadS] != 0.75 || c[0].Cases[1][LoadL] != 0.75 {
		t.Errorf("parsed %+v", c)
	}
	if c[1].Cases[0][LoadD] != 0.6 || c[1].Cases[0][LoadW] != 0.6 || c[2].Cases[0][LoadLr] != 1 {
		t.Errorf("parsed %+v", c)
	}
	for _, bad := range []string{"D+X", "D+(L", "", "D+", "D+0L", "D++L"} {
		if _, err := ParseCombos([]string{bad}); err == nil {
			t.Errorf("ParseCombos(%q): want an error", bad)
		}
	}
}

func TestComboDurationFactor_NDS2018_232(t *testing.T) {
	all := [numLoadTypes]bool{true, true, true, true, true}
	c, _ := ParseCombos([]string{"D", "D+L", "D+0.75L+0.75S", "D+0.75L+0.75Lr", "0.6D+0.6W"})
	want := []float64{0.9, 1.0, 1.15, 1.25, 1.6} // NDS 2018 2.3.2: shortest-duration load governs
	for i, cd := range want {
		expectNear(t, c[i].Name+" CD", ComboDurationFactor(c[i].Cases[0], all), cd, 0, 0, "NDS 2018 Table 2.3.2")
	}
	noSnow := all
	noSnow[LoadS] = false
	expectNear(t, "D+0.75L+0.75S with S = 0: CD", ComboDurationFactor(c[2].Cases[0], noSnow), 1.0, 0, 0, "NDS 2018 2.3.2")
}

func TestDeflectionLimits_IBC2018Table16043(t *testing.T) {
	rows := []struct {
		use, ceiling string
		live, total  float64
	}{
		{"floor", "", 360, 240},
		{"roof", "plaster", 360, 240},
		{"roof", "non-plaster", 240, 180},
		{"roof", "none", 180, 120},
	}
	for _, r := range rows {
		l, tot, err := DeflectionLimits(r.use, r.ceiling)
		if err != nil || l != r.live || tot != r.total {
			t.Errorf("%s/%s: L/%v, L/%v, %v; want L/%v, L/%v (IBC 2018 Table 1604.3)", r.use, r.ceiling, l, tot, err, r.live, r.total)
		}
	}
	if _, _, err := DeflectionLimits("wall", ""); err == nil {
		t.Error("use wall: want an error")
	}
}
