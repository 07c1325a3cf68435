package project

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/BurntSushi/toml"
)

// marked strips the '∑' marking the line where the error is expected and
// returns the text and that 1-based line (0 when unmarked).
func marked(s string) (string, int) {
	lines := strings.Split(s, "\n")
	want := 0
	for i, l := range lines {
		if strings.HasPrefix(l, "∑") {
			lines[i] = strings.TrimPrefix(l, "∑")
			want = i + 1
		}
	}
	return strings.Join(lines, "\n"), want
}

// TestProjectErrors feeds one mistake per case; the first error must name
// the marked line, the key and the words of the rule it breaks.
func TestProjectErrors(t *testing.T) {
	cases := []struct {
		name, in, key string
		msg           []string
	}{
		{"misspelled key", "[drawing]\nunits = \"in\"\n∑snap_tolerence_in = 2\n",
			"drawing.snap_tolerence_in", []string{"unknown key in [drawing]", "did you mean snap_tolerance_in?"}},
		{"unit suffix forgotten", "[drawing]\n∑snap_tolerance = 2\n",
			"drawing.snap_tolerance", []string{"did you mean snap_tolerance_in?"}},
		{"misspelled table", "[drawing]\n∑[zones]\nname = \"A\"\n",
			"zones", []string{"did you mean [[zone]]?"}},
		{"key in the wrong table", "[loads]\n∑kcr = 2.0\n",
			"loads.kcr", []string{"kcr is a key of [design]"}},
		{"nothing close", "[design]\n∑colour = \"red\"\n",
			"design.colour", []string{"valid keys in [design]:", "kcr", "combinations"}},
		{"unknown key in second zone",
			"[[zone]]\nname = \"A\"\ndead_psf = 10\nlive_psf = 40\n[[zone]]\nname = \"B\"\nallow_zero = true\n∑dead = 10\n[loads]\ndefault_zone = \"A\"\n",
			"zone.dead", []string{"unknown key in [[zone]]", "dead_psf"}},
		{"unknown key in by_layer", "[lumber]\n[[lumber.by_layer]]\nlayers = [\"R*\"]\n∑sise = \"2x12\"\nsize = \"2x8\"\n",
			"lumber.by_layer.sise", []string{"did you mean size?"}},
		{"after a multi-line array", "[sizing]\ncandidates = [\n  \"2x8\",\n  \"2x10\",\n]\n∑blocking_weight = 1\n",
			"sizing.blocking_weight", []string{"did you mean blocking_piece_weight_bf?"}},
		{"after a multi-line string", "[[zone]]\nallow_zero = true\nname = \"\"\"\nA\nuse = 3\n\"\"\"\n∑dead = 1\n",
			"zone.dead", []string{"did you mean dead_psf?"}},
		{"wrong type", "[drawing]\n∑snap_tolerance_in = true\n",
			"drawing.snap_tolerance_in", []string{"expected a number", "greater than 0", `got boolean true`}},
		{"length without a unit we know", "[drawing]\n∑snap_tolerance_in = \"1.5 yd\"\n",
			"drawing.snap_tolerance_in", []string{"expected a number of inches or a length with its unit", `length "1.5 yd"`}},
		{"length string in a psf key", "[[zone]]\nname = \"F\"\nuse = \"floor\"\n∑dead_psf = \"12\"\nlive_psf = 40\n",
			"zone.dead_psf", []string{"expected a number", `got string "12"`}},
		{"bool as string", "[design]\n∑wet_service = \"yes\"\n",
			"design.wet_service", []string{"expected true or false"}},
		{"table as value", "∑drawing = 5\n", "drawing", []string{"expected a table [drawing]", "integer 5"}},
		{"single support table", "∑[support]\nlayers = [\"W*\"]\n", "support", []string{"expected one or more [[support]] tables"}},
		{"list as string", "[layers]\n∑joists = \"JOIST*\"\n", "layers.joists", []string{"expected an array of strings"}},
		{"empty list", "[layers]\n∑joists = []\n", "layers.joists", []string{"at least one"}},
		{"zero snap", "[drawing]\n∑snap_tolerance_in = 0\n", "drawing.snap_tolerance_in", []string{"greater than 0", "got 0"}},
		{"nan snap", "[drawing]\n∑snap_tolerance_in = nan\n", "drawing.snap_tolerance_in", []string{"greater than 0"}},
		{"negative edge", "[drawing]\n∑edge_distance_in = -1\n", "drawing.edge_distance_in", []string{"from 0 to 48", "got -1"}},
		{"negative load", "[[zone]]\nname = \"A\"\ndead_psf = 10\nlive_psf = 40\n[[zone]]\nname = \"FLOOR\"\nlive_psf = 40\n∑dead_psf = -5\n",
			"zone.dead_psf", []string{"from 0 to 1000 (psf)"}},
		{"kcr below 1", "[design]\n∑kcr = 0.9\n", "design.kcr", []string{"from 1 to 3"}},
		{"negative uplift report", "[design]\n∑uplift_report_lb = -1\n", "design.uplift_report_lb", []string{"from 0 to 100000 (lb)"}},
		{"uplift report as text", "[design]\n∑uplift_report_lb = \"50 lb\"\n", "design.uplift_report_lb", []string{"expected a number"}},
		{"absurd load", "[[zone]]\nname = \"FLOOR\"\ndead_psf = 10\n∑live_psf = 1e300\n", "zone.live_psf", []string{"from 0 to 1000 (psf)", "got 1e+300"}},
		{"absurd snap tolerance", "[drawing]\n∑snap_tolerance_in = 1e300\n", "drawing.snap_tolerance_in", []string{"at most 24"}},
		{"limit between 0 and 1", "[[zone]]\nname = \"A\"\ndead_psf = 10\nlive_psf = 40\n∑live_deflection_limit = 0.5\n",
			"zone.live_deflection_limit", []string{"0 (not checked) or from 1 to 10000"}},
		{"zero bearing", "[[support]]\nlayers = [\"W*\"]\n∑bearing_in = 0\n", "support.bearing_in", []string{"greater than 0"}},
		{"bad unit", "[drawing]\n∑units = \"yd\"\n", "drawing.units", []string{`"in" | "ft" | "mm" | "cm" | "m"`, `"yd"`}},
		{"bad kind", "[[support]]\nlayers = [\"P*\"]\n∑kind = \"post\"\n", "support.kind", []string{`"bearing-wall" | "dropped-beam" | "flush-beam" | "ledger"`}},
		{"bad temperature", "[design]\n∑temperature = \"cold\"\n", "design.temperature", []string{`"normal" | "warm" | "hot"`}},
		{"bad ceiling", "[[zone]]\nname = \"A\"\ndead_psf = 10\nlive_psf = 40\n∑ceiling = \"gypsum\"\n", "zone.ceiling", []string{`"plaster" | "non-plaster" | "none"`}},
		{"bad use", "[[zone]]\nname = \"A\"\nallow_zero = true\n∑use = \"deck\"\n", "zone.use", []string{`"floor" | "roof"`}},
		{"bad size", "[lumber]\n∑size = \"2x11\"\n", "lumber.size", []string{"nominal size", `"2x11"`}},
		{"bad size in an override", "[lumber]\n[[lumber.by_layer]]\nlayers = [\"R*\"]\n∑size = \"2-12\"\n",
			"lumber.by_layer.size", []string{"nominal size"}},
		{"bad candidate", "[sizing]\n∑candidates = [\"2x6\", 8]\n", "sizing.candidates", []string{"entry 2", "integer 8"}},
		{"standard not known", "[design]\n∑combinations = \"ASCE 7-22\"\n", "design.combinations", []string{`"ASCE 7-16" or a list`}},
		{"bad combination", "[design]\n∑combinations = [\"D\", \"D+1.6Q\"]\n", "design.combinations", []string{`combination 2 "D+1.6Q"`, "D, L, Lr, S and W"}},
		{"unknown species", "[lumber]\n∑species = \"Balsa\"\n", "lumber.species", []string{`unknown species "Balsa"`, "Hem-Fir"}},
		{"unknown grade in an override", "[lumber]\n[[lumber.by_layer]]\nlayers = [\"R*\"]\n∑grade = \"No.4\"\n",
			"lumber.by_layer.grade", []string{`unknown grade of Douglas Fir-Larch "No.4"`}},
		{"combinations as number", "[design]\n∑combinations = 7\n", "design.combinations", []string{"array of strings"}},
		{"default zone unknown", "[loads]\n∑default_zone = \"ATTIC\"\n[[zone]]\nname = \"FLOOR\"\n[[zone]]\nname = \"ROOF\"\n",
			"loads.default_zone", []string{`no zone is named "ATTIC"`, `"FLOOR", "ROOF"`}},
		{"default zone unknown, built-in zone", "[loads]\n∑default_zone = \"ATTIC\"\n",
			"loads.default_zone", []string{`"FLOOR"`}},
		{"default zone needed", "∑[loads]\n[[zone]]\nname = \"A\"\n[[zone]]\nname = \"B\"\n",
			"loads.default_zone", []string{"missing", `"A", "B"`}},
		{"duplicate zone", "[[zone]]\nname = \"Floor\"\ndead_psf = 10\nlive_psf = 40\n[[zone]]\n∑name = \"FLOOR\"\ndead_psf = 10\nlive_psf = 40\n",
			"zone.name", []string{"already defined (line 2)"}},
		{"zone without name", "∑[[zone]]\ndead_psf = 10\nlive_psf = 40\n", "zone.name", []string{"missing", "[[zone]]"}},
		// issue 15 item 6: no silent zero loads
		{"zone with only a name", "∑[[zone]]\nname = \"A\"\n", `[[zone]] "A"`,
			[]string{"dead_psf left out", "live_psf left out", "allow_zero = true"}},
		{"floor live given as 0", "∑[[zone]]\nname = \"A\"\ndead_psf = 10\nlive_psf = 0\n", `[[zone]] "A"`,
			[]string{"live_psf = 0 (no floor live load)"}},
		{"roof without roof live or snow", "∑[[zone]]\nname = \"R\"\nuse = \"roof\"\ndead_psf = 10\nsnow_psf = 0\n", `[[zone]] "R"`,
			[]string{"roof_live_psf left out and snow_psf = 0"}},
		{"dead load 0", "∑[[zone]]\nname = \"R\"\nuse = \"roof\"\ndead_psf = 0.0\nroof_live_psf = 20\n", `[[zone]] "R"`,
			[]string{"dead_psf = 0 (no dead load)"}},
		{"support without layers", "∑[[support]]\nkind = \"ledger\"\n", "support.layers", []string{"missing"}},
		{"override without a value", "[lumber]\n∑[[lumber.by_layer]]\nlayers = [\"R*\"]\n", "lumber.by_layer", []string{"none of species, grade, size"}},
		{"pattern in two supports", "[[support]]\nlayers = [\"WALL*\"]\n[[support]]\n∑layers = [\"BM*\", \"wall*\"]\nkind = \"flush-beam\"\n",
			"support.layers", []string{`"wall*" is also in [[support]] 1 (bearing-wall) (line 2)`}},
		{"pattern in a role and a default support", "[layers]\n∑joists = [\"WALL*\"]\n",
			"layers.joists", []string{`"WALL*" is also in [[support]] 1 (bearing-wall) (a default)`}},
		{"inline table", "∑drawing = { snap_tolerance_in = -1 }\n", "drawing.snap_tolerance_in", []string{"greater than 0"}},
		{"dotted key", "∑drawing.edge_distance_in = -2\n", "drawing.edge_distance_in", []string{"from 0 to 48"}},
		{"quoted key", "[drawing]\n∑\"edge_distance_in\" = -2\n", "drawing.edge_distance_in", []string{"from 0 to 48"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			in, line := marked(c.in)
			_, err := ParseProject("p.toml", []byte(in))
			var list ProjectErrors
			if !errors.As(err, &list) || len(list) == 0 {
				t.Fatalf("want ProjectErrors, got %v", err)
			}
			e := list[0]
			if e.File != "p.toml" || e.Line != line || e.Key != c.key {
				t.Errorf("got %s:%d key %q, want p.toml:%d key %q (%v)", e.File, e.Line, e.Key, line, c.key, err)
			}
			for _, m := range c.msg {
				if !strings.Contains(e.Msg, m) {
					t.Errorf("message %q lacks %q", e.Msg, m)
				}
			}
		})
	}
}

func TestProjectSyntaxError(t *testing.T) {
	for _, in := range []string{
		"[drawing]\n∑units = \n",
		"[drawing]\nunits = \"in\"\n∑units = \"ft\"\n",
		"[drawing]\n∑units = \"in\n",
	} {
		in, line := marked(in)
		if line == 0 {
			line = 1
		}
		_, err := ParseProject("p.toml", []byte(in))
		var list ProjectErrors
		if !errors.As(err, &list) || len(list) != 1 || list[0].Line != line ||
			!strings.HasPrefix(list[0].Error(), "p.toml:") || !strings.Contains(list[0].Msg, "TOML syntax") {
			t.Errorf("%q: got %v, want one syntax error at line %d", in, err, line)
		}
	}
}

// TestProjectErrorsAll checks that every problem is reported, in line
// order, in the file:line: key: message form.
func TestProjectErrorsAll(t *testing.T) {
	in := "[design]\nkcr = 0\n[drawing]\nsnap = 1\nunits = \"yd\"\n"
	_, err := ParseProject("p.toml", []byte(in))
	want := "p.toml:2: design.kcr: must be from 1 to 3 (creep factor), got 0\n" +
		"p.toml:4: drawing.snap: unknown key in [drawing]; did you mean snap_tolerance_in?\n" +
		"p.toml:5: drawing.units: expected one of \"in\" | \"ft\" | \"mm\" | \"cm\" | \"m\", got string \"yd\""
	if err == nil || err.Error() != want {
		t.Errorf("got\n%v\nwant\n%s", err, want)
	}
}

func TestDefaultProject(t *testing.T) {
	p := DefaultProject()
	// Values as the project file reference (PROJECT-FILE.md) shows them.
	if p.Drawing != (DrawingSettings{SnapToleranceIn: 1.5, MaxWallThicknessIn: 12}) {
		t.Errorf("drawing %+v", p.Drawing)
	}
	// S-WALL, S-BEAM: US National CAD Standard structural layers, from memory: verify
	wantSup := []Support{{Layers: []string{"WALL*", "S-WALL*"}, Kind: "bearing-wall", BearingIn: 3.5, Check: true},
		{Layers: []string{"BEAM-FLUSH*", "S-BEAM*"}, Kind: "flush-beam", BearingIn: 1.5, Check: true}}
	if !reflect.DeepEqual(p.Supports, wantSup) {
		t.Errorf("supports %+v", p.Supports)
	}
	// IBC 2018 Table 1604.3, floor members: L/360 live, L/240 total.
	wantZone := Zone{Name: "FLOOR", Use: "floor", DeadPsf: 12, LivePsf: 40, Ceiling: "non-plaster",
		LiveDeflectionLimit: 360, TotalDeflectionLimit: 240, DeadOnSlope: true}
	if len(p.Zones) != 1 || p.Zones[0] != wantZone || p.Loads.DefaultZone != "FLOOR" {
		t.Errorf("zones %+v, default %q", p.Zones, p.Loads.DefaultZone)
	}
	d := p.Design
	if !d.TopEdgeBraced || d.ShearAtD || d.WetService || d.Temperature != "normal" || d.Incised || d.Kcr != 1.5 ||
		d.AddSelfWeight || d.Combinations.Standard != StandardASCE716 || d.Combinations.List != nil || !d.PatternLiveLoads ||
		d.BraceAtInflection {
		t.Errorf("design %+v", d)
	}
	if p.Lumber.Species != "Douglas Fir-Larch" || p.Lumber.Grade != "No.2" || p.Lumber.Size != "2x10" || p.Lumber.ByLayer != nil {
		t.Errorf("lumber %+v", p.Lumber)
	}
	if !reflect.DeepEqual(p.Sizing, Sizing{[]string{"2x6", "2x8", "2x10", "2x12", "2x14"}, 2,
		[]string{"(2) 2x10", "(3) 2x10", "(2) 2x12", "(3) 2x12", "4x12"}, "none"}) {
		t.Errorf("sizing %+v", p.Sizing)
	}
	used := strings.Join(p.DefaultsUsed(), "\n")
	for _, s := range []string{
		"drawing.units: from the DXF header ($INSUNITS)",
		"drawing.snap_tolerance_in = 1.5",
		"layers.joists = [\"JOIST*\", \"S-JOIS*\"]",
		"layers.labels = [\"FRAMING-NOTE*\", \"S-ANNO-NOTE*\", \"S-ANNO-TEXT*\"]",
		"[[support]]: none given; [\"WALL*\", \"S-WALL*\"] bearing-wall (bearing 3.5 in); [\"BEAM-FLUSH*\", \"S-BEAM*\"] flush-beam (bearing 1.5 in)",
		"design.combinations = \"ASCE 7-16\"",
		"[[zone]]: none given; one zone FLOOR: floor, D 12 psf, L 40 psf, ceiling non-plaster, L/360 live, L/240 total",
		"loads.default_zone = \"FLOOR\" (the only zone)",
		"sizing.blocking_piece_weight_bf = 2",
	} {
		if !strings.Contains(used, s) {
			t.Errorf("DefaultsUsed lacks %q:\n%s", s, used)
		}
	}
}

// TestZoneDefaults checks the defaults that depend on use and ceiling.
func TestZoneDefaults(t *testing.T) {
	in := `
[design]
wet_service = true
[loads]
default_zone = "F"
[[zone]]
name = "F"
dead_psf = 10
live_psf = 40
[[zone]]
name = "R1"
use = "roof"
ceiling = "plaster"
dead_psf = 10
snow_psf = 25
[[zone]]
name = "R2"
use = "roof"
dead_psf = 10
roof_live_psf = 20
[[zone]]
name = "R3"
use = "roof"
ceiling = "none"
total_deflection_limit = 0
dead_psf = 10
snow_psf = 30
`
	p, err := ParseProject("z.toml", []byte(in))
	if err != nil {
		t.Fatal(err)
	}
	// IBC 2018 Table 1604.3: floor 360/240; roof with plaster ceiling
	// 360/240, non-plaster 240/180, no ceiling 180/120 (total set to 0 here).
	want := []struct{ live, total, l, lr float64 }{{360, 240, 40, 0}, {360, 240, 0, 20}, {240, 180, 0, 20}, {180, 0, 0, 20}}
	for i, w := range want {
		z := p.Zones[i]
		if z.LiveDeflectionLimit != w.live || z.TotalDeflectionLimit != w.total || z.LivePsf != w.l || z.RoofLivePsf != w.lr {
			t.Errorf("zone %s: %+v, want %+v", z.Name, z, w)
		}
	}
	// NDS 2018 §3.5.2: Kcr = 2.0 for wet service conditions.
	if p.Design.Kcr != 2.0 {
		t.Errorf("kcr %v with wet service, want 2.0", p.Design.Kcr)
	}
	if !p.Given("zone[3].total_deflection_limit") || p.Given("zone[3].live_deflection_limit") {
		t.Error("Given does not track zone[3] limits")
	}
	used := strings.Join(p.DefaultsUsed(), "\n")
	for _, s := range []string{
		"[[zone]] R2: live_deflection_limit = 240 (IBC 2018 Table 1604.3, roof, ceiling non-plaster)",
		"[[zone]] F: total_deflection_limit = 240 (IBC 2018 Table 1604.3, floor)",
		"[[zone]] R3: roof_live_psf = 20",
		"design.kcr = 2 (wet service, NDS 2018 §3.5.2)",
	} {
		if !strings.Contains(used, s) {
			t.Errorf("DefaultsUsed lacks %q:\n%s", s, used)
		}
	}
	if strings.Contains(used, "R3: total_deflection_limit") {
		t.Error("a given limit is listed as a default")
	}
}

func TestFullProject(t *testing.T) {
	p, err := LoadProject("testdata/full.toml")
	if err != nil {
		t.Fatal(err)
	}
	if len(p.DefaultsUsed()) != 2 { // bearing_in of the dropped-beam and ledger tables
		t.Errorf("defaults used in a full file: %q", p.DefaultsUsed())
	}
	if !p.Design.BraceAtInflection {
		t.Error("design.brace_at_inflection = true not read")
	}
	if p.Sizing.SameDepth != "zone" {
		t.Errorf("sizing.same_depth = %q, want zone", p.Sizing.SameDepth)
	}
	if p.Supports[1].BearingIn != 3.5 || p.Supports[3].BearingIn != 1.5 {
		t.Errorf("bearing by kind: %+v", p.Supports)
	}
	if p.Loads.DefaultZone != "storage" || p.Zone(p.Loads.DefaultZone).Name != "STORAGE" {
		t.Errorf("default zone %q", p.Loads.DefaultZone)
	}
	c, err := p.Design.Combinations.Combos()
	if err != nil || len(c) != 5 || c[2].Name != "D+0.75L+0.75S" || c[4].Name != "D+0.75L+0.75(LrorS)" || len(c[4].Cases) != 2 {
		t.Errorf("combinations %+v, %v", c, err)
	}
	if p.Design.UpliftReportLb != 75 {
		t.Errorf("uplift_report_lb %v, want 75 as the file gives", p.Design.UpliftReportLb)
	}
	if d := DefaultProject().Design.UpliftReportLb; d != 50 {
		t.Errorf("default uplift_report_lb %v, want 50 (PROJECT-FILE.md)", d)
	}
	if p.Lumber.ByLayer[0].Size != "2x12" || p.Sizing.Candidates[1] != "2x10" {
		t.Errorf("sizes not in canonical form: %+v %+v", p.Lumber.ByLayer, p.Sizing)
	}
	roles := map[string]string{"j-deck-2": RoleJoists, "Rafter": RoleJoists, "BLK1": RoleBlocking,
		"zones": RoleZones, "NOTES": RoleLabels, "joist-bays": RoleBays, "wall-int-3": "support:bearing-wall",
		"BM-FLUSH": "support:flush-beam", "LEDGER": "support:ledger", "TEXT": ""}
	for layer, want := range roles {
		if got := p.LayerRole(layer); got != want {
			t.Errorf("LayerRole(%q) = %q, want %q", layer, got, want)
		}
	}
	for layer, want := range map[string][3]string{
		"RAFTER-1": {"Hem-Fir", "Select Structural", "2x12"},
		"J-DECK":   {"Southern Pine", "No.1", "2x8"},
		"J-2":      {"Hem-Fir", "No.1", "2x8"},
	} {
		if s, g, z := p.LumberFor(layer); [3]string{s, g, z} != want {
			t.Errorf("LumberFor(%q) = %q %q %q, want %v", layer, s, g, z, want)
		}
	}
}

// TestSchemaMatchesLoader keeps the schema used for advice equal to the
// keys the loader reads.
func TestSchemaMatchesLoader(t *testing.T) {
	data, err := os.ReadFile("testdata/full.toml")
	if err != nil {
		t.Fatal(err)
	}
	var raw map[string]any
	if _, err := toml.Decode(string(data), &raw); err != nil {
		t.Fatal(err)
	}
	ld := &loader{file: "full.toml", lines: keyLines(string(data)), p: &Project{given: map[string]bool{}}}
	ld.project(ld.table(raw, "", "the top level", ""))
	got := map[string][]string{}
	for _, tb := range ld.tables {
		if _, seen := got[tb.show]; seen {
			continue
		}
		for _, k := range tb.known {
			got[tb.show] = append(got[tb.show], k.name)
		}
	}
	for _, s := range schema {
		if !reflect.DeepEqual(got[s.show], s.keys) {
			t.Errorf("%s: loader reads %q, schema says %q", s.show, got[s.show], s.keys)
		}
	}
	if len(got) != len(schema) {
		t.Errorf("loader tables %d, schema %d", len(got), len(schema))
	}
}

func TestKeyLines(t *testing.T) {
	in := "a = 1\n[t]\nb.c = 2\n[[arr]]\nx = 1\n[[arr]]\nx = 2\n[arr.sub]\ny = 3\n[[arr.list]]\nz = 4\n"
	want := map[string]int{"a": 1, "t": 2, "t.b": 3, "t.b.c": 3, "arr[0]": 4, "arr[0].x": 5, "arr[1]": 6,
		"arr[1].x": 7, "arr[1].sub": 8, "arr[1].sub.y": 9, "arr[1].list[0]": 10, "arr[1].list[0].z": 11}
	if got := keyLines(in); !reflect.DeepEqual(got, want) {
		t.Errorf("got %v\nwant %v", got, want)
	}
}

// FuzzLoadProject: ParseProject never panics; it returns either a usable
// project or ProjectErrors with lines inside the file.
func FuzzLoadProject(f *testing.F) {
	f.Add(StarterProject)
	if data, err := os.ReadFile("testdata/full.toml"); err == nil {
		f.Add(string(data))
	}
	f.Add("[[zone]]\nname = \"A\"\n[[zone]]\nname = \"a\"\n")
	f.Add("drawing = { units = \"m\" }\n[design]\ncombinations = [\"D+L\"]\n")
	f.Fuzz(func(t *testing.T, in string) {
		p, err := ParseProject("f.toml", []byte(in))
		if err != nil {
			var list ProjectErrors
			if !errors.As(err, &list) || len(list) == 0 {
				t.Fatalf("error of type %T: %v", err, err)
			}
			n := strings.Count(in, "\n") + 1
			for _, e := range list {
				if e.Line < 0 || e.Line > n {
					t.Fatalf("line %d outside 1..%d: %v", e.Line, n, e)
				}
			}
			return
		}
		if len(p.Zones) == 0 || p.Zone(p.Loads.DefaultZone) == nil || len(p.Supports) == 0 {
			t.Fatalf("accepted project without a usable zone or support: %+v", p)
		}
	})
}

// TestDemoProject loads the demo's project file: the key names are an
// interface, and the demo uses most of them.
func TestDemoProject(t *testing.T) {
	p, err := LoadProject("../samples/demo/framecheck.toml")
	if err != nil {
		t.Fatal(err)
	}
	edge := p.Zone("roof-edge")
	// IBC 2018 Table 1604.3, roof member with no ceiling: L/180, L/120.
	if edge == nil || edge.WindUpPsf != 75 || edge.LivePsf != 0 || edge.LiveDeflectionLimit != 180 || edge.TotalDeflectionLimit != 120 {
		t.Errorf("ROOF-EDGE zone %+v", edge)
	}
	if len(p.Supports) != 5 || p.LayerRole("BEAM-DROPPED") != "support:dropped-beam" || p.LayerRole("POST") != "posts" {
		t.Errorf("supports %+v", p.Supports)
	}
}

func BenchmarkParseProject(b *testing.B) {
	data, err := os.ReadFile("testdata/full.toml")
	if err != nil {
		b.Fatal(err)
	}
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		if _, err := ParseProject("full.toml", data); err != nil {
			b.Fatal(err)
		}
	}
}

// TestZonePitch reads a roof pitch in the forms the trade writes it: a rise
// in 12, "6:12", "6/12", or degrees (26.565 deg is 6 in 12: tan^-1(6/12),
// trigonometry); anything else, or a pitch on a floor zone, is an error.
func TestZonePitch(t *testing.T) {
	for _, c := range []struct {
		val  string
		want float64
		err  string
	}{
		{`6`, 6, ""}, {`"6:12"`, 6, ""}, {`"6/12"`, 6, ""}, {`"26.565deg"`, 6, ""}, {`0`, 0, ""},
		{`"6:10"`, 0, "rise in 12"}, {`"steep"`, 0, "rise in 12"}, {`30`, 0, "rise in 12"}, {`-1`, 0, "rise in 12"},
	} {
		in := "[[zone]]\nname = \"R\"\nuse = \"roof\"\ndead_psf = 10\npitch = " + c.val + "\nroof_live_psf = 20\n"
		p, err := ParseProject("p.toml", []byte(in))
		if c.err != "" {
			if err == nil || !strings.Contains(err.Error(), c.err) || !strings.Contains(err.Error(), "p.toml:5") {
				t.Errorf("pitch = %s: error %v, want one at p.toml:5 saying %q", c.val, err, c.err)
			}
			continue
		}
		if err != nil {
			t.Errorf("pitch = %s: %v", c.val, err)
			continue
		}
		if math.Abs(p.Zones[0].PitchRise12-c.want) > 1e-3 {
			t.Errorf("pitch = %s: %g in 12, want %g", c.val, p.Zones[0].PitchRise12, c.want)
		}
	}
	if _, err := ParseProject("p.toml", []byte("[[zone]]\nname = \"F\"\nuse = \"floor\"\npitch = 4\n")); err == nil || !strings.Contains(err.Error(), "roof zone") {
		t.Errorf("pitch on a floor zone: error %v, want one", err)
	}
}

// TestAllowZero: a zone that sets allow_zero = true may leave its dead and
// live loads out; they are then 0, not the defaults (issue 15 item 6).
func TestAllowZero(t *testing.T) {
	in := "[[zone]]\nname = \"TEST\"\nallow_zero = true\n[[zone]]\nname = \"R\"\nuse = \"roof\"\nallow_zero = true\nsnow_psf = 30\n[loads]\ndefault_zone = \"TEST\"\n"
	p, err := ParseProject("z.toml", []byte(in))
	if err != nil {
		t.Fatal(err)
	}
	z := p.Zones[0]
	if z.DeadPsf != 0 || z.LivePsf != 0 || !z.AllowZero {
		t.Errorf("allow_zero zone: %+v, want D = L = 0", z)
	}
	if r := p.Zones[1]; r.RoofLivePsf != 0 || r.SnowPsf != 30 {
		t.Errorf("allow_zero roof: %+v, want Lr 0 (left out), S 30", r)
	}
	if _, err := ParseProject("z.toml", []byte("[[zone]]\nname = \"A\"\nallow_zero = \"yes\"\n")); err == nil ||
		!strings.Contains(err.Error(), "zone.allow_zero: expected true or false") {
		t.Errorf("allow_zero as a string: %v", err)
	}
}

// TestProjectInfoTable: [project] is free text printed on the outputs; a
// TOML date is kept as written, a number where text is wanted is an
// error naming the key and its line.
func TestProjectInfoTable(t *testing.T) {
	p, err := ParseProject("p.toml", []byte("[project]\nname = \"Garage loft\"\nnumber = \"2026-041\"\nrevision = \"B\"\ndate = 2026-12-04\n"))
	if err != nil {
		t.Fatal(err)
	}
	want := ProjectInfo{Name: "Garage loft", Number: "2026-041", Revision: "B", Date: "2026-12-04"}
	if p.Info != want {
		t.Errorf("info %+v, want %+v", p.Info, want)
	}
	_, err = ParseProject("p.toml", []byte("[project]\nnumber = 41\n"))
	if err == nil || !strings.Contains(err.Error(), "p.toml:2: project.number: expected a string") {
		t.Errorf("number = 41: %v", err)
	}
	if p := DefaultProject(); p.Info != (ProjectInfo{}) {
		t.Errorf("default project info %+v, want empty", p.Info)
	}
}

// TestStarterRoundTrip writes the starter file `framecheck init` writes and
// loads it back: it must give exactly the built-in defaults.
func TestStarterRoundTrip(t *testing.T) {
	path := filepath.Join(t.TempDir(), "framecheck.toml")
	if err := os.WriteFile(path, []byte(StarterProject), 0o644); err != nil {
		t.Fatal(err)
	}
	p, err := LoadProject(path)
	if err != nil {
		t.Fatal(err)
	}
	def := DefaultProject()
	p.File, p.given, p.defaults, p.sha256, p.size = "", nil, nil, "", 0
	def.given, def.defaults = nil, nil
	if !reflect.DeepEqual(p, def) {
		t.Errorf("starter file loads as\n%+v\nwant the defaults\n%+v", p, def)
	}
}

// TestSameDepthDefault: a project file without [sizing] same_depth takes
// "none", the value the project file's interface shows
// (shared/PROJECT-FILE.md: every plain key left out takes the value shown).
func TestSameDepthDefault(t *testing.T) {
	p, err := ParseProject("p.toml", []byte("[sizing]\ncandidates = [\"2x8\", \"2x10\"]\n"))
	if err != nil {
		t.Fatal(err)
	}
	if p.Sizing.SameDepth != "none" {
		t.Errorf("same_depth left out: %q, want none", p.Sizing.SameDepth)
	}
	if p = DefaultProject(); p.Sizing.SameDepth != "none" {
		t.Errorf("built-in defaults: same_depth %q, want none", p.Sizing.SameDepth)
	}
}
