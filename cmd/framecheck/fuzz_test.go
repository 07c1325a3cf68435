package main

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/project"
	"framecheck/samples"
)

// upliftProject turns every design switch from its default and loads a
// roof zone (named FLOOR, as richPlan's outline is) with net uplift.
const upliftProject = `
[drawing]
snap_tolerance_in = 3
edge_distance_in = 6
[design]
top_edge_braced = false
shear_at_d = true
wet_service = true
temperature = "hot"
incised = true
add_self_weight = true
pattern_live_loads = false
[[zone]]
name = "FLOOR"
use = "roof"
dead_psf = 5
roof_live_psf = 20
snow_psf = 40
wind_down_psf = 20
wind_up_psf = 60
ceiling = "plaster"
ceiling_braces_bottom = false
[sizing]
candidates = ["2x6", "2x8", "3x10", "4x12", "2x14"]
`

// richPlan is a small plan that reaches most of the pipeline: a
// two-span continuous run, a cantilever past the last wall, a flush beam
// with hangers, a drawn blocking row, a size callout, a load-zone outline
// with its name, and a joist drawn as a 2-vertex LWPOLYLINE.
func richPlan() string {
	var d dxfText
	d.header("AC1009", 1)
	d.section("ENTITIES")
	d.line("WALL", 0, 0, 0, 100)
	d.line("WALL", 144, 0, 144, 100)
	d.line("WALL", 288, 0, 288, 100)
	d.line("BEAM-FLUSH", 432, 0, 432, 100)
	for i := 1; i <= 4; i++ {
		y := float64(i) * 19.2
		d.line("JOIST", 0, y, 330, y)
		d.line("JOIST", 288, y, 432, y)
	}
	d.pair(0, "LWPOLYLINE")
	d.pair(8, "JOIST")
	d.pair(90, "2")
	d.pair(70, "0")
	d.num(10, 0)
	d.num(20, 96)
	d.num(10, 144)
	d.num(20, 96)
	d.line("BLOCKING", 72, 0, 72, 100)
	d.pair(0, "TEXT")
	d.pair(8, "FRAMING-NOTE")
	d.num(10, 20)
	d.num(20, 30)
	d.num(40, 4)
	d.pair(1, `2x12 @ 19.2" o.c.`)
	d.pair(0, "LWPOLYLINE")
	d.pair(8, "LOAD-ZONE")
	d.pair(90, "4")
	d.pair(70, "1")
	for _, p := range [][2]float64{{-10, -10}, {450, -10}, {450, 110}, {-10, 110}} {
		d.num(10, p[0])
		d.num(20, p[1])
	}
	d.pair(0, "TEXT")
	d.pair(8, "LOAD-ZONE")
	d.num(10, 200)
	d.num(20, 50)
	d.num(40, 6)
	d.pair(1, "FLOOR")
	d.endsec()
	d.eof()
	return d.String()
}

// withLines puts a joist line and a wall line, with coordinates the fuzzer
// picks, before the last ENDSEC of plan (when it has one).
func withLines(plan []byte, j, w [4]float64) []byte {
	i := bytes.LastIndex(plan, []byte("\n  0\nENDSEC"))
	if i < 0 {
		return plan
	}
	var d dxfText
	d.line("JOIST", j[0], j[1], j[2], j[3])
	d.line("WALL", w[0], w[1], w[2], w[3])
	out := append([]byte(nil), plan[:i+1]...)
	out = append(out, d.String()...)
	return append(out, plan[i+1:]...)
}

// FuzzCheckPlan runs the whole check (read, group, check, blocking rows,
// marks, takeoff, results) on a mutated small plan, with one joist and one
// wall at coordinates the fuzzer picks. It must never panic; an unusable
// drawing is a *dxfimport.ParseError at a line of the file; a usable one
// gives results with no NaN or Inf anywhere, members in error that say
// why, and checked members with their checks.
func FuzzCheckPlan(f *testing.F) {
	seeds := []string{smallPlan(), smallPlanR12(), richPlan(), badFiles["self-insert.dxf"](),
		badFiles["nested-blocks.dxf"](), badFiles["one-end-unsupported.dxf"](), badFiles["coords-1e300.dxf"]()}
	for i, s := range seeds {
		f.Add([]byte(s), 0.0, 40.0, 144.0, 40.0, 72.0, -10.0, 72.0, 200.0, i%2 == 0, uint8(i))
	}
	f.Add([]byte(richPlan()), 0.0, 1e-300, 1e300, 1e-300, -1e308, 0.0, 1e308, 0.0, false, uint8(1))
	f.Add([]byte(smallPlan()), 144.0, 16.0, 144.0, 16.0, 144.0, 0.0, 144.0, 0.0, true, uint8(2))
	// The projects a plan is checked with: the built-in defaults, the
	// demo's (several zones, by-layer sizes, three support kinds), and a
	// roof under uplift with every design switch turned from its default.
	projects := []*project.Project{project.DefaultProject()}
	for _, text := range []string{string(samples.DemoProject), upliftProject} {
		p, err := project.ParseProject("fuzz.toml", []byte(text))
		if err != nil {
			f.Fatal(err)
		}
		projects = append(projects, p)
	}
	// A worker process runs one input at a time: one file serves them all.
	path := filepath.Join(f.TempDir(), "plan.dxf")
	f.Fuzz(func(t *testing.T, plan []byte, jx1, jy1, jx2, jy2, wx1, wy1, wx2, wy2 float64, size bool, which uint8) {
		if len(plan) > 1<<16 {
			return
		}
		data := withLines(plan, [4]float64{jx1, jy1, jx2, jy2}, [4]float64{wx1, wy1, wx2, wy2})
		if err := os.WriteFile(path, data, 0o644); err != nil {
			t.Fatal(err)
		}
		o, err := runPipeline(pipelineInput{planPath: path, project: projects[int(which)%len(projects)], size: size})
		if err != nil {
			var pe *dxfimport.ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error of type %T: %v", err, err)
			}
			if n := bytes.Count(data, []byte("\n")) + 1; pe.Line < 1 || pe.Line > n {
				t.Fatalf("error at line %d of a %d-line file: %v", pe.Line, n, err)
			}
			return
		}
		// every other input mapped as check maps a plan with no load
		// path: the results and the grouped members dropped as mapped
		release := which/2%2 == 1
		res := exportResults(o, path, release)
		if release && (o.Results != nil || o.Plan.Members != nil) {
			t.Fatal("released outcome still holds its results or members")
		}
		if _, fields := export.Sanitize(res); len(fields) > 0 {
			t.Fatalf("non-finite values in results: %s", strings.Join(fields, "; "))
		}
		checkMemberOutcomes(t, res)
		export.MarkupFromResults(res, o.drawing.ToInch)
	})
}
