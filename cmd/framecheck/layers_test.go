package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/dxfimport"
	"framecheck/project"
)

// The demo plan and ezdxf's own count of its entities per layer
// (samples/demo/check_demo.py, ezdxf 0.18.1).
const (
	demoPlan    = "../../samples/demo/plan.dxf"
	demoProject = "../../samples/demo/framecheck.toml"
	demoCounts  = "../../samples/demo/ezdxf_counts.json"
)

// TestLayerRowsAgainstEzdxf compares the per-layer counts with ezdxf's.
func TestLayerRowsAgainstEzdxf(t *testing.T) {
	data, err := os.ReadFile(demoCounts)
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Entities map[string]map[string]int `json:"entities"`
	}
	if err := json.Unmarshal(data, &ref); err != nil {
		t.Fatal(err)
	}
	d, err := dxfimport.ReadFile(demoPlan, dxfimport.Options{})
	if err != nil {
		t.Fatal(err)
	}
	p, err := project.LoadProject(demoProject)
	if err != nil {
		t.Fatal(err)
	}
	got := map[string]map[string]int{}
	for _, r := range layerRows(d, p) {
		for k, n := range r.Counts {
			if got[r.Name] == nil {
				got[r.Name] = map[string]int{}
			}
			got[r.Name][k.String()] = n
		}
	}
	if len(got) != len(ref.Entities) {
		t.Errorf("%d layers with entities, ezdxf counts %d", len(got), len(ref.Entities))
	}
	for layer, want := range ref.Entities {
		for kind, n := range want {
			if got[layer][kind] != n {
				t.Errorf("%s %s: %d, ezdxf %d", layer, kind, got[layer][kind], n)
			}
		}
	}
}

func TestLayersCommand(t *testing.T) {
	code, out, errs := runCmd("layers", demoPlan, "-p", demoProject)
	if code != 0 || errs != "" {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	for _, want := range []string{
		"DXF R2000 (AC1015), units in ($INSUNITS 1)",
		"roles from " + demoProject,
		"LAYER            LINE  LWPOLYLINE  TEXT  CIRCLE  ROLE",
		"JOIST-FLOOR        40           -     -       -  joists",
		"BEAM-DROPPED        2           -     -       -  support: dropped-beam",
		"LOAD-ZONE-ROOF      -           4     4       -  zones",
		"GRID                8           -     8       -  -",
		"POST                -           -     -       2  posts",
		"POINT-LOAD          -           -     1       1  point_loads",
	} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	// With the built-in defaults the demo's BEAM-DROPPED layer has no role.
	_, out, _ = runCmd("layers", "--units", "ft", demoPlan)
	if !strings.Contains(out, "BEAM-DROPPED        2           -     -       -  -") || !strings.Contains(out, "units ft (--units)") {
		t.Errorf("defaults:\n%s", out)
	}
}

func TestLayersNotes(t *testing.T) {
	d := &dxfimport.Drawing{File: "x.dxf", Units: "in", InsUnits: 1,
		Layers:   []dxfimport.Layer{{Name: "WALLS", On: false}, {Name: "J1", On: true, Frozen: true}},
		Entities: []dxfimport.Entity{{Kind: dxfimport.KindLine, Pos: dxfimport.Pos{Layer: "WALLS"}}}}
	var b strings.Builder
	printLayers(&b, d, project.DefaultProject(), "")
	out := b.String()
	for _, want := range []string{
		"layer WALLS is off", "layer J1 is frozen",
		`no entities on a joist layer: layers.joists is ["JOIST*", "S-JOIS*"]`,
		`pattern matches no layer: layers.blocking: "BLOCKING*"`,
		`pattern matches no layer: [[support]] 2 (flush-beam): "BEAM-FLUSH*"`,
		"WALLS     1  support: bearing-wall",
	} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
}

func TestLayersErrors(t *testing.T) {
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.toml")
	if err := os.WriteFile(bad, []byte("[drawing]\nunits = \"yd\"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	notDXF := filepath.Join(dir, "plan.dxf")
	if err := os.WriteFile(notDXF, []byte("hello\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"layers"}, "want one PLAN.dxf, got 0"},
		{[]string{"layers", "a.dxf", "b.dxf"}, "got 2 arguments"},
		{[]string{"layers", demoPlan, "--units", "yd"}, `--units "yd"`},
		{[]string{"layers", demoPlan, "-p", bad}, bad + ":2: drawing.units: expected one of"},
		{[]string{"layers", notDXF}, "framecheck: " + notDXF + ":1:"},
		{[]string{"layers", filepath.Join(dir, "none.dxf")}, "framecheck: "},
	} {
		code, out, errs := runCmd(c.args...)
		if code != 2 || out != "" || !strings.Contains(errs, c.want) {
			t.Errorf("%q: exit %d, stdout %q, stderr %q; want 2 and %q", c.args, code, out, errs, c.want)
		}
	}
}

// TestLayersPartialRead: a plan with an entity the reader left out (error
// DXF113) still gets its layers listed with the finding among the notes;
// the exit status is 1, as check gives for a plan read in part.
func TestLayersPartialRead(t *testing.T) {
	plan := filepath.Join("testdata", "bad", "line-missing-end.dxf")
	code, out, errs := runCmd("layers", plan)
	if code != exitFail {
		t.Errorf("exit %d, want %d; stderr %q", code, exitFail, errs)
	}
	if !strings.Contains(out, "JOIST") || !strings.Contains(out, "WALL") {
		t.Errorf("layers not listed:\n%s", out)
	}
	if strings.Count(out+errs, "error DXF113") != 1 || !strings.Contains(out, "(handle 108, layer JOIST): error DXF113") {
		t.Errorf("the finding should be in the notes once:\nstdout:\n%s\nstderr:\n%s", out, errs)
	}
	if !strings.Contains(errs, "part of the drawing was not read") {
		t.Errorf("stderr lacks the partial-read line:\n%s", errs)
	}
}
