package main

import (
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"framecheck/pipeline"
	"framecheck/project"
)

// TestFramingOptionsLoadPath: the posts and point-load layers of
// project/testdata/full.toml reach framing's options.
func TestFramingOptionsLoadPath(t *testing.T) {
	p, err := project.LoadProject("../../project/testdata/full.toml")
	if err != nil {
		t.Fatal(err)
	}
	o := pipeline.FramingOptions(p)
	if !reflect.DeepEqual(o.PostLayers, []string{"COL*", "COL-6*"}) || !reflect.DeepEqual(o.PointLoadLayers, []string{"PT-LOAD"}) {
		t.Errorf("framing options: posts %q, point loads %q", o.PostLayers, o.PointLoadLayers)
	}
}

// TestCheckRunsWithLoadPath runs `framecheck check` on framing's load-path
// fixture (written by ezdxf): the point loads drawn on joists load them
// (the joist under "P: 1200 D, 800 L" and the one under RTU-1 now fail in
// bending), the joist under a point load whose text cannot be read is an
// error member, the point load on no joist is an error finding naming its
// handle, the beam with nothing under it a warning, and the run still
// writes its outputs.
func TestCheckRunsWithLoadPath(t *testing.T) {
	dir := t.TempDir()
	proj := filepath.Join(dir, "p.toml")
	toml := `[[support]]
layers = ["WALL*"]
kind = "bearing-wall"
[[support]]
layers = ["BEAM-FLUSH*"]
kind = "flush-beam"
[[support]]
layers = ["BEAM-DROP*"]
kind = "dropped-beam"
[[point_load]]
name = "RTU-1"
dead_lb = 450
`
	if err := os.WriteFile(proj, []byte(toml), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, errs := runCmd("check", "../../framing/testdata/loadpath.dxf", "-p", proj, "-o", filepath.Join(dir, "out"))
	if code != exitFail {
		t.Errorf("exit %d, want %d (error findings)", code, exitFail)
	}
	if !strings.Contains(out, "20 members: 17 pass, 2 fail, 1 error") {
		t.Errorf("summary:\n%s", out)
	}
	for _, want := range []string{"error FRM232", "error FRM231", "warning FRM234: B4"} {
		if !strings.Contains(errs, want) {
			t.Errorf("stderr lacks %q:\n%s", want, errs)
		}
	}
	if strings.Contains(errs, "RTU-1") {
		t.Errorf("the named point load RTU-1 is reported:\n%s", errs)
	}
	if _, err := os.Stat(filepath.Join(dir, "out", "results.json")); err != nil {
		t.Error(err)
	}
}

// TestLayersShowsLoadPathRoles: `framecheck layers` names the posts and
// point-load layers by their roles under the built-in patterns.
func TestLayersShowsLoadPathRoles(t *testing.T) {
	code, out, errs := runCmd("layers", "../../framing/testdata/loadpath.dxf")
	if code != exitOK {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	for _, want := range []string{"POST", "POINT-LOAD"} {
		var row string
		for _, l := range strings.Split(out, "\n") {
			if f := strings.Fields(l); len(f) > 0 && f[0] == want {
				row = l
			}
		}
		role := map[string]string{"POST": "posts", "POINT-LOAD": "point_loads"}[want]
		if !strings.HasSuffix(strings.TrimSpace(row), role) {
			t.Errorf("layer %s: row %q, want role %s\n%s", want, row, role, out)
		}
	}
}
