// Demogen writes framecheck's demo framing plan, plan.dxf, for the made-up
// Dunmarrow Rigging Loft on Pellgrove Quay.
//
// Usage:
//
//	go run ./samples/demogen -o samples/demo
//
// The flag:
//
//	-o DIR   folder to write plan.dxf into (created if missing; default ".")
//
// The output is an ASCII DXF R2000 (AC1015) in inches ($INSUNITS = 1) with
// a LAYER table, a handle on every object, $HANDSEED and $EXTMIN/$EXTMAX.
// It is deterministic: samples/samples_test.go regenerates it and fails
// when the committed samples/demo/plan.dxf differs. The geometry is data in
// plan.go (runs of joists, support lines, zones, callouts); retune it
// there, regenerate, and commit both.
package main

import (
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"

	"framecheck/samples/internal/dxfw"
)

// planFileName is the name of the file demogen writes.
const planFileName = "plan.dxf"

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// run is main without the process: exit code 0 on success, 2 on a usage
// or write error.
func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("demogen", flag.ContinueOnError)
	fs.SetOutput(stderr)
	dir := fs.String("o", ".", "folder to write "+planFileName+" into")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if fs.NArg() != 0 {
		fmt.Fprintf(stderr, "demogen: unexpected argument %q\n", fs.Arg(0))
		return 2
	}
	if err := os.MkdirAll(*dir, 0o755); err != nil {
		fmt.Fprintf(stderr, "demogen: %v\n", err)
		return 2
	}
	out := filepath.Join(*dir, planFileName)
	if err := os.WriteFile(out, buildDXF(), 0o644); err != nil {
		fmt.Fprintf(stderr, "demogen: %v\n", err)
		return 2
	}
	fmt.Fprintf(stdout, "wrote %s\n", out)
	return 0
}

// buildDXF draws both plans and the title block and returns the file.
func buildDXF() []byte {
	w := dxfw.New(planLayers)
	for _, p := range []plan{floorPlan(), roofPlan()} {
		drawPlan(w, p)
	}
	// Title block border around both plans and the sheet title.
	w.ClosedPolyline(lyTitle, [][2]float64{{-120, -190}, {1150, -190}, {1150, 620}, {-120, 620}})
	w.Text(lyTitle, -100, -176, 14, 0, "DUNMARROW RIGGING LOFT - PELLGROVE QUAY - FRAMING PLANS")
	return w.Bytes()
}

// drawPlan writes one plan's entities, shifted by its offset: joists run
// by run, then lines, zone outlines with their names, then labels.
func drawPlan(w *dxfw.Writer, p plan) {
	dx := p.OffsetXIn
	for _, r := range p.Runs {
		for i := 0; i < r.Count; i++ {
			x1, y1, x2, y2 := r.joist(i)
			w.Line(r.Layer, x1+dx, y1, x2+dx, y2)
		}
	}
	for _, s := range p.Lines {
		w.Line(s.Layer, s.X1+dx, s.Y1, s.X2+dx, s.Y2)
	}
	for _, z := range p.Zones {
		pts := make([][2]float64, len(z.Pts))
		for i, pt := range z.Pts {
			pts[i] = [2]float64{pt[0] + dx, pt[1]}
		}
		w.ClosedPolyline(z.Layer, pts)
		w.Text(z.Layer, z.TextX+dx, z.TextY, 8, 0, z.Name)
	}
	for _, l := range p.Labels {
		w.Text(l.Layer, l.X+dx, l.Y, l.HeightIn, l.RotDeg, l.Text)
	}
	for _, c := range p.Circles {
		w.Circle(c.Layer, c.X+dx, c.Y, c.RIn)
	}
}

// joist returns the end points of joist i of the run, plan-local.
func (r joistRun) joist(i int) (x1, y1, x2, y2 float64) {
	length := r.LengthIn - r.ShortIn[i]
	step := float64(i) * r.SpacingIn
	if r.AlongX {
		return r.X0In, r.Y0In + step, r.X0In + length, r.Y0In + step
	}
	return r.X0In + step, r.Y0In, r.X0In + step, r.Y0In + length
}
