package main

import (
	"math"
	"testing"

	"framecheck/check"
)

// TestLoadPathOnFixture runs the pipeline on framing's load-path fixture
// (joists -> flush beam -> girder -> posts, written by ezdxf) and follows
// the loads: every beam framing found with supports of its own is checked
// with the point loads its joists pass, and the loads put on the plan reach
// the walls, posts and rigid supports load type by load type (statics:
// nothing lost, to 0.1 lb).
func TestLoadPathOnFixture(t *testing.T) {
	p, err := ParseProject("p.toml", []byte(`[[support]]
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
`))
	if err != nil {
		t.Fatal(err)
	}
	o, err := runPipeline(pipelineInput{planPath: "../../framing/testdata/loadpath.dxf", project: p})
	if err != nil {
		t.Fatal(err)
	}
	if o.path == nil || len(o.path.beams) == 0 {
		t.Fatalf("no beams followed: %+v", o.path)
	}
	checked := 0
	for _, b := range o.path.beams {
		if b.res.Status == check.StatusError {
			continue
		}
		checked++
		if len(b.input.PointLoads) == 0 && len(b.beam.Carried) > 0 {
			t.Errorf("%s carries %d joists but was checked without their reactions", b.beam.ID, len(b.beam.Carried))
		}
	}
	if checked == 0 {
		t.Errorf("no beam checked: %+v", o.path.beams)
	}
	a, d := o.path.solved.Applied, o.path.solved.Delivered
	for _, c := range [][2]float64{{a.DeadLb, d.DeadLb}, {a.LiveLb, d.LiveLb}, {a.RoofLiveLb, d.RoofLiveLb}, {a.WindUpLb, d.WindUpLb}} {
		if math.Abs(c[0]-c[1]) > 0.1 {
			t.Errorf("applied %.2f lb, delivered %.2f lb: loads lost on the way (statics)", c[0], c[1])
		}
	}
	posts := 0.0
	for _, po := range o.path.posts {
		posts += po.out.Loads.DeadLb + po.out.Loads.LiveLb
	}
	if posts <= 0 {
		t.Errorf("no load reached the posts")
	}
}
