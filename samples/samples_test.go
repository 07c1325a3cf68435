package samples

import (
	"bytes"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"reflect"
	"sort"
	"testing"

	"github.com/BurntSushi/toml"
)

// TestDemoPlanIsCurrent regenerates the plan with samples/demogen in a
// temporary folder and compares it byte for byte with the committed file
// and with the embedded copy.
func TestDemoPlanIsCurrent(t *testing.T) {
	goCmd, err := exec.LookPath("go")
	if err != nil {
		if root := os.Getenv("GOROOT"); root != "" {
			goCmd = filepath.Join(root, "bin", "go")
		}
	}
	if _, err := os.Stat(goCmd); goCmd == "" || err != nil {
		t.Skip("the go command is not on PATH; cannot regenerate the plan")
	}
	dir := t.TempDir()
	cmd := exec.Command(goCmd, "run", "./demogen", "-o", dir)
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go run ./demogen: %v\n%s", err, out)
	}
	got, err := os.ReadFile(filepath.Join(dir, DemoPlanName))
	if err != nil {
		t.Fatal(err)
	}
	committed, err := os.ReadFile(filepath.Join("demo", DemoPlanName))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, committed) {
		t.Errorf("demo/%s differs from what demogen writes now (%d vs %d bytes): run "+
			"`go run ./samples/demogen -o samples/demo` and commit it", DemoPlanName, len(committed), len(got))
	}
	if !bytes.Equal(DemoPlan, committed) {
		t.Errorf("embedded DemoPlan differs from demo/%s", DemoPlanName)
	}
}

// ezdxfCounts is the JSON written by demo/check_demo.py.
type ezdxfCounts struct {
	AcadVer          string                    `json:"acadver"`
	InsUnits         int                       `json:"insunits"`
	AuditErrors      int                       `json:"audit_errors"`
	AuditFixes       int                       `json:"audit_fixes"`
	HandlesUnique    bool                      `json:"handles_unique"`
	HandSeedAboveAll bool                      `json:"handseed_above_all_handles"`
	Layers           []string                  `json:"layers"`
	Entities         map[string]map[string]int `json:"entities"`
}

// TestDemoPlanAgainstEzdxf compares our own group-code scan of the plan
// with what ezdxf 0.18.1 (an independent DXF library) read from the same
// file, committed in demo/ezdxf_counts.json by demo/check_demo.py.
func TestDemoPlanAgainstEzdxf(t *testing.T) {
	raw, err := os.ReadFile(filepath.Join("demo", "ezdxf_counts.json"))
	if err != nil {
		t.Fatal(err)
	}
	var ez ezdxfCounts
	if err := json.Unmarshal(raw, &ez); err != nil {
		t.Fatalf("demo/ezdxf_counts.json: %v", err)
	}
	s, err := scanDXF(DemoPlan)
	if err != nil {
		t.Fatalf("%s: %v", DemoPlanName, err)
	}
	if ez.AuditErrors != 0 || ez.AuditFixes != 0 {
		t.Errorf("ezdxf audit: %d errors, %d fixes; want none", ez.AuditErrors, ez.AuditFixes)
	}
	if !ez.HandlesUnique || !ez.HandSeedAboveAll {
		t.Errorf("ezdxf: handles unique %v, $HANDSEED above all %v; want both", ez.HandlesUnique, ez.HandSeedAboveAll)
	}
	if s.acadVer != "AC1015" || ez.AcadVer != s.acadVer {
		t.Errorf("$ACADVER: scan %q, ezdxf %q; want AC1015", s.acadVer, ez.AcadVer)
	}
	if s.insUnits != 1 || ez.InsUnits != s.insUnits {
		t.Errorf("$INSUNITS: scan %d, ezdxf %d; want 1 (inches)", s.insUnits, ez.InsUnits)
	}
	if !reflect.DeepEqual(s.counts, ez.Entities) {
		t.Errorf("entities per layer and type:\n scan  %v\n ezdxf %v", s.counts, ez.Entities)
	}
	ezLayers := map[string]bool{}
	for _, l := range ez.Layers {
		ezLayers[l] = true
	}
	for _, l := range s.tableLayer {
		if !ezLayers[l] {
			t.Errorf("layer %q of the LAYER table is missing from ezdxf's layers", l)
		}
	}
}

// TestDemoPlanStructure checks, from the group codes alone, what the
// brief asks of the file: unique handles below $HANDSEED, every entity on
// a layer of the LAYER table, every point inside $EXTMIN/$EXTMAX, and the
// roles of the demo present (common practice, no source).
func TestDemoPlanStructure(t *testing.T) {
	s, err := scanDXF(DemoPlan)
	if err != nil {
		t.Fatal(err)
	}
	seen := map[uint64]bool{}
	for _, h := range s.handles {
		if seen[h] {
			t.Errorf("handle %X used twice", h)
		}
		seen[h] = true
		if h == 0 || h >= s.handSeed {
			t.Errorf("handle %X not in 1..$HANDSEED-1 (%X)", h, s.handSeed)
		}
	}
	inTable := map[string]bool{}
	for _, l := range s.tableLayer {
		inTable[l] = true
	}
	for l := range s.counts {
		if !inTable[l] {
			t.Errorf("entities on layer %q, which the LAYER table lacks", l)
		}
	}
	for _, p := range s.points {
		if p[0] < s.extMin[0] || p[1] < s.extMin[1] || p[0] > s.extMax[0] || p[1] > s.extMax[1] {
			t.Errorf("point %v outside $EXTMIN %v / $EXTMAX %v", p, s.extMin, s.extMax)
		}
	}
	// Member counts of the scenario (samples.go): floor 12 + 7 + 7 + 14,
	// roof 3 x 11.
	if got := s.counts["JOIST-FLOOR"]["LINE"]; got != 40 {
		t.Errorf("JOIST-FLOOR lines = %d, want 40", got)
	}
	if got := s.counts["JOIST-ROOF"]["LINE"]; got != 33 {
		t.Errorf("JOIST-ROOF lines = %d, want 33", got)
	}
	callouts := s.texts["FRAMING-NOTE"]
	sort.Strings(callouts)
	// the loft's three joist callouts, the canopy's joists and its girder
	want := []string{`2x10 @ 16" o.c.`, `2x10 @ 16" o.c.`, `2x12 @ 16" o.c.`, `2x8 @ 24" o.c.`, "5 1/8 x 12 GLB 24F-1.8E"}
	if !reflect.DeepEqual(callouts, want) {
		t.Errorf("callouts = %q, want %q", callouts, want)
	}
}

// TestDemoProjectMatchesPlan reads DemoProject as TOML and checks that it
// and the plan agree: every zone name drawn inside an outline has a
// [[zone]], every [[zone]] is drawn, and the default zone exists.
func TestDemoProjectMatchesPlan(t *testing.T) {
	var proj struct {
		Loads struct {
			DefaultZone string `toml:"default_zone"`
		} `toml:"loads"`
		Zone []struct {
			Name string `toml:"name"`
		} `toml:"zone"`
	}
	if _, err := toml.Decode(string(DemoProject), &proj); err != nil {
		t.Fatalf("framecheck.toml: %v", err)
	}
	defined := map[string]bool{}
	for _, z := range proj.Zone {
		defined[z.Name] = true
	}
	if !defined[proj.Loads.DefaultZone] {
		t.Errorf("default_zone %q has no [[zone]]", proj.Loads.DefaultZone)
	}
	s, err := scanDXF(DemoPlan)
	if err != nil {
		t.Fatal(err)
	}
	drawn := map[string]bool{}
	for _, layer := range []string{"LOAD-ZONE-FLOOR", "LOAD-ZONE-ROOF"} {
		for _, name := range s.texts[layer] {
			drawn[name] = true
			if !defined[name] {
				t.Errorf("zone %q drawn on %s has no [[zone]] in framecheck.toml", name, layer)
			}
		}
		if s.counts[layer]["LWPOLYLINE"] != len(s.texts[layer]) {
			t.Errorf("%s: %d outlines but %d names", layer, s.counts[layer]["LWPOLYLINE"], len(s.texts[layer]))
		}
	}
	for name := range defined {
		if !drawn[name] {
			t.Errorf("[[zone]] %q is not drawn in the plan", name)
		}
	}
}
