package project

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

const sclHeader = "species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source\n"

// writeSCLProject writes a materials file and a project file using it, and
// loads the project.
func writeSCLProject(t *testing.T, csv, toml string) (*Project, error) {
	t.Helper()
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "scl.csv"), []byte(csv), 0o644); err != nil {
		t.Fatal(err)
	}
	pp := filepath.Join(dir, "p.toml")
	if err := os.WriteFile(pp, []byte(toml), 0o644); err != nil {
		t.Fatal(err)
	}
	return LoadProject(pp)
}

// A [[support]] material names a structural composite lumber row of the
// materials file, in any case; its size must be one the row covers.
// Mistakes are errors at the key's line, and a bad row of the materials
// file is an error naming the file and its line (the numbers are test
// input: common practice, no source).
func TestProjectSCLMaterial(t *testing.T) {
	csv := sclHeader + "LVL,2.0E,5.5,18,2600,1900,285,750,2500,2000000,1016000,SCL 0.136,maker's sheet\n"
	support := "[[support]]\nlayers = [\"WALL*\"]\n\n[[support]]\nlayers = [\"BEAM*\"]\nkind = \"flush-beam\"\n"
	lumber := "\n[lumber]\nmaterials_file = \"scl.csv\"\n"
	p, err := writeSCLProject(t, csv, support+"size = \"1.75x11.875\"\nplies = 2\nmaterial = \"lvl\"\n"+lumber)
	if err != nil {
		t.Fatalf("good project: %v", err)
	}
	if p.Supports[1].Material != "lvl" {
		t.Errorf("material %q", p.Supports[1].Material)
	}
	for _, tc := range []struct{ keys, want string }{
		{"material = \"PSL\"\n", "p.toml:7: support.material: material \"PSL\" names no user material; the structural composite lumber known is LVL"},
		{"material = \"LVL\"\nsize = \"3.5x24\"\n", "p.toml:8: support.size: material LVL: LVL 2.0E: no design values for a depth of 24 in"},
		{"material = \"LVL\"\ngrade = \"1.9E\"\nsize = \"3.5x12\"\n", "p.toml:8: support.grade"},
	} {
		_, err := writeSCLProject(t, csv, support+tc.keys+lumber)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%q: err %v, want %q", tc.keys, err, tc.want)
		}
	}
	// A bad row: the exponent missing from size_factor.
	bad := sclHeader + "LVL,2.0E,5.5,18,2600,1900,285,750,2500,2000000,1016000,SCL,maker's sheet\n"
	_, err = writeSCLProject(t, bad, support+"material = \"LVL\"\n"+lumber)
	if err == nil || !strings.Contains(err.Error(), "scl.csv:2: column size_factor") {
		t.Errorf("bad row: err %v, want scl.csv:2: column size_factor", err)
	}
}
