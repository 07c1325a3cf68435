package main

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/xuri/excelize/v2"

	"framecheck/check"
	"framecheck/export"
	"framecheck/project"
)

// TestLoadPathOnFixture runs the pipeline on framing's load-path fixture
// (joists -> flush beam -> girder -> posts, written by ezdxf) and follows
// the loads: every beam framing found with supports of its own is checked
// with the point loads its joists pass, and the loads put on the plan reach
// the walls, posts and rigid supports load type by load type (statics:
// nothing lost, to 0.1 lb).
func TestLoadPathOnFixture(t *testing.T) {
	p, err := project.ParseProject("p.toml", []byte(loadPathProject))
	if err != nil {
		t.Fatal(err)
	}
	o, err := runPipeline(pipelineInput{planPath: "../../framing/testdata/loadpath.dxf", project: p})
	if err != nil {
		t.Fatal(err)
	}
	if o.Path == nil || len(o.Path.Beams) == 0 {
		t.Fatalf("no beams followed: %+v", o.Path)
	}
	checked := 0
	for _, b := range o.Path.Beams {
		if b.Res.Status == check.StatusError {
			continue
		}
		checked++
		if len(b.Input.PointLoads) == 0 && len(b.Beam.Carried) > 0 {
			t.Errorf("%s carries %d joists but was checked without their reactions", b.Beam.ID, len(b.Beam.Carried))
		}
	}
	if checked == 0 {
		t.Errorf("no beam checked: %+v", o.Path.Beams)
	}
	a, d := o.Path.Solved.Applied, o.Path.Solved.Delivered
	for _, c := range [][2]float64{{a.DeadLb, d.DeadLb}, {a.LiveLb, d.LiveLb}, {a.RoofLiveLb, d.RoofLiveLb}, {a.WindUpLb, d.WindUpLb}} {
		if math.Abs(c[0]-c[1]) > 0.1 {
			t.Errorf("applied %.2f lb, delivered %.2f lb: loads lost on the way (statics)", c[0], c[1])
		}
	}
	posts := 0.0
	for _, po := range o.Path.Posts {
		posts += po.Out.Loads.DeadLb + po.Out.Loads.LiveLb
	}
	if posts <= 0 {
		t.Errorf("no load reached the posts")
	}
}

// TestLoadPathOutputs: `check` on the load-path fixture writes the load
// path in every output: results.json "load_path" (read back), the Beams,
// Posts, Connections and Foundation sheets (read back with excelize), the
// report's load path section, and a label per beam in the annotated DXF.
func TestLoadPathOutputs(t *testing.T) {
	dir := t.TempDir()
	proj := filepath.Join(dir, "p.toml")
	require.NoError(t, os.WriteFile(proj, []byte(loadPathProject), 0o644))
	out := filepath.Join(dir, "out")
	code, stdout, stderr := runCmd("check", "../../framing/testdata/loadpath.dxf", "-p", proj, "-o", out)
	require.NotEqual(t, exitUsage, code, stderr)
	assert.Contains(t, stdout, "load path: ")
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	require.NoError(t, err)
	require.NotNil(t, r.LoadPath)
	lp := r.LoadPath
	assert.NotEmpty(t, lp.Beams)
	assert.NotEmpty(t, lp.Posts)
	assert.NotEmpty(t, lp.Connections)
	assert.NotEmpty(t, lp.Foundation)
	// nothing lost, load type by load type (statics)
	assert.InDelta(t, lp.Applied.DeadLb, lp.Delivered.DeadLb, 0.1)
	assert.InDelta(t, lp.Applied.LiveLb, lp.Delivered.LiveLb, 0.1)
	f, err := excelize.OpenFile(filepath.Join(out, scheduleName))
	require.NoError(t, err)
	defer f.Close()
	sheets := f.GetSheetList()
	for _, s := range export.LoadPathSheetNames {
		assert.Contains(t, sheets, s)
	}
	rows, err := f.GetRows(export.SheetBeams)
	require.NoError(t, err)
	assert.Equal(t, len(lp.Beams), len(rows)-export.HeaderRow, "one row per beam below the title rows and header")
	html, err := os.ReadFile(filepath.Join(out, reportName))
	require.NoError(t, err)
	assert.Contains(t, string(html), `id="loadpath"`)
	dxf, err := os.ReadFile(filepath.Join(out, "loadpath-checked.dxf"))
	require.NoError(t, err)
	for _, b := range lp.Beams {
		assert.Contains(t, string(dxf), b.ID+" "+b.Size, "a label for %s", b.ID)
	}
}

const loadPathProject = `[[support]]
layers = ["WALL*"]
kind = "bearing-wall"
[[support]]
layers = ["BEAM-FLUSH*"]
kind = "flush-beam"
size = "2x12"
plies = 3
[[support]]
layers = ["BEAM-DROP*"]
kind = "dropped-beam"
size = "4x12"
[[post]]
layers = ["POST*"]
size = "4x4"
height_in = 96
[[point_load]]
name = "RTU-1"
dead_lb = 450
`

// TestBeamSizingOnFixture: with --size each sawn beam of the load-path
// fixture takes the lightest of [sizing] beam_candidates with which it
// passes (the default list, PROJECT-FILE.md), or the last when none does;
// the glulam girder keeps its callout's size.
func TestBeamSizingOnFixture(t *testing.T) {
	p, err := project.ParseProject("p.toml", []byte(loadPathProject))
	require.NoError(t, err)
	o, err := runPipeline(pipelineInput{planPath: "../../framing/testdata/loadpath.dxf", project: p, size: true})
	require.NoError(t, err)
	require.NotNil(t, o.Path)
	for _, b := range o.Path.Beams {
		if b.Input.Species == check.GlulamSpecies {
			assert.Equal(t, "5.125x12", b.Res.Size, "%s keeps its glulam size", b.Beam.ID)
			continue
		}
		assert.Contains(t, p.Sizing.BeamCandidates, b.Res.Size, "%s sized from the candidates", b.Beam.ID)
		if b.Res.Status == check.StatusPass {
			continue
		}
		assert.Equal(t, p.Sizing.BeamCandidates[len(p.Sizing.BeamCandidates)-1], b.Res.Size, "%s: none passes, the last is kept", b.Beam.ID)
	}
}
