package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestMaterialsCommand(t *testing.T) {
	code, out, errs := runCmd("materials", "DF-L")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	// NDS 2018 Supplement Table 4A, Douglas Fir-Larch No.2: Fb 900, Fv 180,
	// Fc_perp 625, E 1,600,000, Emin 580,000 psi (checked: docs/VERIFIED.md).
	for _, want := range []string{"Douglas Fir-Larch", "No.2", "900", "1600000", "580000", "NDS 2018 Supplement Table 4A"} {
		if !strings.Contains(out, want) {
			t.Errorf("materials DF-L lacks %q:\n%s", want, out)
		}
	}
	if strings.Contains(out, "Hem-Fir") {
		t.Error("materials DF-L lists Hem-Fir too")
	}
	code, _, errs = runCmd("materials", "Balsa")
	if code != exitUsage || !strings.Contains(errs, "Balsa") {
		t.Errorf("materials Balsa: exit %d, stderr %q; want 2 naming the species", code, errs)
	}
}

// A project's materials_file adds species that the materials command then
// knows.
func TestMaterialsCommandProjectFile(t *testing.T) {
	dir := t.TempDir()
	csv := "species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source\n" +
		"Ironbark Test,MSR 2100,2,0,2100,1575,180,625,1875,1800000,915000,none,made-up test values\n"
	if err := os.WriteFile(filepath.Join(dir, "mine.csv"), []byte(csv), 0o644); err != nil {
		t.Fatal(err)
	}
	good := "[lumber]\nspecies = \"Ironbark Test\"\ngrade = \"MSR 2100\"\nsize = \"2x10\"\nmaterials_file = \"mine.csv\"\n"
	gp := filepath.Join(dir, "good.toml")
	os.WriteFile(gp, []byte(good), 0o644)
	code, out, errs := runCmd("materials", "Ironbark Test", "-p", gp)
	if code != exitOK || !strings.Contains(out, "2100") || !strings.Contains(out, "made-up test values") {
		t.Errorf("materials with project: exit %d\n%s%s", code, out, errs)
	}
}
