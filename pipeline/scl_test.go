package pipeline

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/framing"
	"framecheck/project"
)

// sclProject loads a project whose BEAM-DROP support has the keys given
// and whose materials file has an LVL row of structural composite lumber
// in two grades (test input: common practice, no source).
func sclProject(t *testing.T, supportKeys string) *project.Project {
	t.Helper()
	dir := t.TempDir()
	csv := "species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source\n" +
		"LVL,2.0E,5.5,18,2600,1900,285,750,2500,2000000,1016000,SCL 0.136,test input\n" +
		"LVL,1.9E,5.5,18,2400,1800,285,750,2400,1900000,966000,SCL 0.136,test input\n"
	toml := "[[support]]\nlayers = [\"WALL*\"]\n\n[[support]]\nlayers = [\"BEAM-DROP*\"]\nkind = \"dropped-beam\"\n" + supportKeys +
		"\n[lumber]\nmaterials_file = \"m.csv\"\n"
	if err := os.WriteFile(filepath.Join(dir, "m.csv"), []byte(csv), 0o644); err != nil {
		t.Fatal(err)
	}
	pp := filepath.Join(dir, "p.toml")
	if err := os.WriteFile(pp, []byte(toml), 0o644); err != nil {
		t.Fatal(err)
	}
	p, err := project.LoadProject(pp)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// TestBeamInputSCL: how a beam's material is chosen. A callout's word
// after a size in actual inches names the material (its grade the words
// after it, else the [[support]] grade when the support names the same
// material); a [[support]] material with a size in the callout or the
// table; a word naming no user material, or a material of two grades
// with none chosen, is an error on the beam, never a default.
func TestBeamInputSCL(t *testing.T) {
	plan := &framing.Plan{}
	beam := func(callout string) *framing.Beam {
		return &framing.Beam{ID: "B1", Layer: "BEAM-DROP", Callout: callout, LengthIn: 144,
			Bearings: []framing.BeamBearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 3.5}}}
	}
	for _, tc := range []struct {
		name, keys, callout string
		size, species, gr   string
		msg                 string
	}{
		{"callout word and grade", "", "1 3/4 x 11 7/8 LVL 2.0E (2)", "(2) 1.75x11.875", "LVL", "2.0E", ""},
		{"callout word, support grade", "material = \"lvl\"\ngrade = \"1.9E\"\n", "3 1/2 x 11 7/8 LVL", "3.5x11.875", "LVL", "1.9E", ""},
		{"callout size, support material", "material = \"LVL\"\ngrade = \"2.0E\"\n", "3 1/2 x 14", "3.5x14", "LVL", "2.0E", ""},
		{"support size and material", "material = \"LVL\"\ngrade = \"2.0E\"\nsize = \"1.75x9.5\"\nplies = 3\n", "", "(3) 1.75x9.5", "LVL", "2.0E", ""},
		{"word naming nothing", "", "3 1/2 x 11 7/8 PSL", "", "", "", `the word "PSL": material "PSL" names no user material; the structural composite lumber known is LVL`},
		{"two grades, none chosen", "", "3 1/2 x 11 7/8 LVL", "3.5x11.875", "LVL", "", ""},
	} {
		p := sclProject(t, tc.keys)
		cm, _, msg := beamInput(p, plan, beam(tc.callout))
		if tc.msg != "" {
			if !strings.Contains(msg, tc.msg) {
				t.Errorf("%s: msg %q, want %q", tc.name, msg, tc.msg)
			}
			continue
		}
		if msg != "" || cm.Size != tc.size || cm.Species != tc.species || cm.Grade != tc.gr {
			t.Errorf("%s: %q %q %q msg %q; want %q %q %q", tc.name, cm.Size, cm.Species, cm.Grade, msg, tc.size, tc.species, tc.gr)
		}
		if tc.gr == "" {
			// the engine refuses it, naming the grades
			if _, err := p.Materials.Lookup(cm.Species, cm.Grade, cm.Size); err == nil || !strings.Contains(err.Error(), "2.0E, 1.9E") {
				t.Errorf("%s: lookup %v, want which grade", tc.name, err)
			}
		}
	}
}

// TestFramingOptionsReadSCLJoistCallouts: the framing options read a joist
// callout in actual inches with the project's materials file: the word
// names its structural composite lumber (case aside), the words after it
// the grade; a word naming none of it is an error naming the materials
// known (test input: sclProject's rows).
func TestFramingOptionsReadSCLJoistCallouts(t *testing.T) {
	o := FramingOptions(sclProject(t, ""))
	c, err := framing.ReadCalloutWith(`(2) 1 3/4 x 11 7/8 lvl 1.9E @ 16" o.c.`, o.MaterialCallout)
	want := framing.Callout{Size: "1.75x11.875", Plies: 2, SpacingIn: 16, Species: "LVL", Grade: "1.9E", Material: true}
	if err != nil || c != want {
		t.Errorf("got %+v, %v; want %+v", c, err, want)
	}
	if _, err := framing.ReadCalloutWith(`1 3/4 x 11 7/8 LSL @ 16`, o.MaterialCallout); err == nil ||
		!strings.Contains(err.Error(), `the word "LSL": material "LSL" names no user material; the structural composite lumber known is LVL`) {
		t.Errorf("LSL: %v", err)
	}
	o = FramingOptions(project.DefaultProject())
	if _, err := framing.ReadCalloutWith(`1 3/4 x 11 7/8 LVL @ 16`, o.MaterialCallout); err == nil ||
		!strings.Contains(err.Error(), `the structural composite lumber known is none: give structural composite lumber as rows of a [lumber] materials_file`) {
		t.Errorf("no materials file: %v", err)
	}
}
