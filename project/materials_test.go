package project

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A project's materials_file adds species that members then know; a
// missing file is an error at its key's line.
func TestProjectMaterialsFile(t *testing.T) {
	dir := t.TempDir()
	csv := "species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source\n" +
		"Ironbark Test,MSR 2100,2,0,2100,1575,180,625,1875,1800000,915000,none,made-up test values\n"
	if err := os.WriteFile(filepath.Join(dir, "mine.csv"), []byte(csv), 0o644); err != nil {
		t.Fatal(err)
	}
	good := "[lumber]\nspecies = \"Ironbark Test\"\ngrade = \"MSR 2100\"\nsize = \"2x10\"\nmaterials_file = \"mine.csv\"\n"
	gp := filepath.Join(dir, "good.toml")
	os.WriteFile(gp, []byte(good), 0o644)
	p, err := LoadProject(gp)
	if err != nil {
		t.Fatalf("LoadProject: %v", err)
	}
	if p.Materials == nil {
		t.Fatal("no merged materials")
	}
	if _, err := p.Materials.Lookup("Ironbark Test", "MSR 2100", "2x10"); err != nil {
		t.Errorf("user species not found: %v", err)
	}
	bad := "[lumber]\nmaterials_file = \"missing.csv\"\n"
	bp := filepath.Join(dir, "bad.toml")
	os.WriteFile(bp, []byte(bad), 0o644)
	if _, err := LoadProject(bp); err == nil || !strings.Contains(err.Error(), "bad.toml:2") || !strings.Contains(err.Error(), "materials_file") {
		t.Errorf("missing materials file: err %v, want bad.toml:2 naming materials_file", err)
	}
}
