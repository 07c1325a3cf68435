package main

// The drawing conventions of issue 14 (DOMAIN.md "Drawings as people
// draw them"), end to end: one plan drawn with single centre lines and
// clean double-line supports, and again in each convention, must give the
// same members, spans, tributary widths, marks, blocking and ratios.
// The DXF files are written here by a small generator of our own
// (convDXF), and separately by ezdxf (testdata/conventions, written by
// gen_conventions.py; conventions_ezdxf_test.go reads them).
//
// The plan, in inches before it is turned and scaled: 9 joists at 16 in
// o.c. (x = 0..128), from y = 0.5 to 305, continuous over a 3-ply dropped
// beam (y = 150..154.5) between two 2x6 walls (y = 0..5.5 and
// 300..305.5); blocking in line at y = 75 and staggered at y = 220/223.
// The reference draws each joist as its centre line, the walls and the
// beam as two lines each and the blocking on the BLOCKING layer.

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/dxfimport"
	"framecheck/project"
)

// convProject gives the walls and the dropped beam their kinds.
const convProject = `[[support]]
layers = ["WALL*"]
kind = "bearing-wall"
bearing_in = 3.5

[[support]]
layers = ["BEAM-DROP*"]
kind = "dropped-beam"
bearing_in = 4.5
`

// convVariant says how the plan is drawn.
type convVariant struct {
	joists    string // "centre", "lines4" (4 LINEs), "poly" (closed LWPOLYLINE), "pair" (2 lines, no caps), "mixed"
	supports  string // "clean" (2 lines each) or "many" (4-line beam, 4-line wall with door swings and ticks)
	blocking  string // "layer" (BLOCKING layer) or "joist" (pieces on the joist layer)
	rotDeg    float64
	mm        bool
	insunits  int
	caseLabel string
}

// convWriter is our own small DXF writer for these plans: HEADER with
// $INSUNITS and ENTITIES (LINE, LWPOLYLINE, ARC), handles from 100 (hex).
type convWriter struct {
	b      bytes.Buffer
	handle int
	rot    float64 // radians
	scale  float64 // drawing units per inch
}

func (w *convWriter) pt(x, y float64) (float64, float64) {
	c, s := math.Cos(w.rot), math.Sin(w.rot)
	return (x*c - y*s) * w.scale, (x*s + y*c) * w.scale
}

func (w *convWriter) head(kind, layer string) {
	w.handle++
	fmt.Fprintf(&w.b, "0\n%s\n5\n%X\n8\n%s\n", kind, 0x100+w.handle, layer)
}

func (w *convWriter) line(layer string, x0, y0, x1, y1 float64) {
	w.head("LINE", layer)
	a, b := w.pt(x0, y0)
	c, d := w.pt(x1, y1)
	fmt.Fprintf(&w.b, "10\n%.9g\n20\n%.9g\n11\n%.9g\n21\n%.9g\n", a, b, c, d)
}

func (w *convWriter) closedPoly(layer string, pts ...[2]float64) {
	w.head("LWPOLYLINE", layer)
	fmt.Fprintf(&w.b, "90\n%d\n70\n1\n", len(pts))
	for _, p := range pts {
		x, y := w.pt(p[0], p[1])
		fmt.Fprintf(&w.b, "10\n%.9g\n20\n%.9g\n", x, y)
	}
}

func (w *convWriter) arc(layer string, cx, cy, r, a0, a1 float64) {
	w.head("ARC", layer)
	x, y := w.pt(cx, cy)
	d := w.rot * 180 / math.Pi
	fmt.Fprintf(&w.b, "10\n%.9g\n20\n%.9g\n40\n%.9g\n50\n%.9g\n51\n%.9g\n", x, y, r*w.scale, a0+d, a1+d)
}

// convDXF draws the plan as v says.
func convDXF(v convVariant) []byte {
	w := &convWriter{rot: v.rotDeg * math.Pi / 180, scale: 1}
	units := 1
	if v.mm {
		w.scale, units = 25.4, 4
	}
	const n, oc, y0, y1, half = 9, 16.0, 0.5, 305.0, 0.75
	xl, xr := -12.0, 140.0
	// supports
	hline := func(layer string, y float64) { w.line(layer, xl, y, xr, y) }
	hline("WALL", 0)
	hline("WALL", 5.5)
	hline("BEAM-DROP", 150)
	hline("BEAM-DROP", 154.5)
	if v.supports == "many" {
		hline("BEAM-DROP", 151.5) // the plies between
		hline("BEAM-DROP", 153)
		hline("WALL", 300) // sheathing, then the plates
		hline("WALL", 300.5)
		hline("WALL", 305)
		hline("WALL", 305.5)
		// door swings and ticks on the wall layer: not supports
		w.arc("WALL", 40, 305.5, 32, 0, 90)
		w.arc("WALL", 88, 305.5, 30, 90, 180)
		w.line("WALL", 62, 301, 66, 305) // a tick across joist x=64
		w.line("WALL", 6, 299, 10, 303)
		w.line("WALL", xr, 300, xr, 305.5) // the wall's end
	} else {
		hline("WALL", 300)
		hline("WALL", 305.5)
	}
	// a 2x6 wall parallel to the joists, its mid-line 16 in west of the
	// first: that joist's edge strip bears on it (FRM221)
	w.line("WALL", -18.75, -12, -18.75, 317.5)
	w.line("WALL", -13.25, -12, -13.25, 317.5)
	// joists
	for i := 0; i < n; i++ {
		x := float64(i) * oc
		style := v.joists
		if style == "mixed" {
			style = "centre"
			if i%2 == 0 {
				style = "lines4"
			}
		}
		switch style {
		case "centre":
			w.line("JOIST", x, y0, x, y1)
		case "lines4":
			w.line("JOIST", x-half, y0, x-half, y1)
			w.line("JOIST", x-half, y1, x+half, y1)
			w.line("JOIST", x+half, y1, x+half, y0)
			w.line("JOIST", x+half, y0, x-half, y0)
		case "poly":
			w.closedPoly("JOIST", [2]float64{x - half, y0}, [2]float64{x + half, y0}, [2]float64{x + half, y1}, [2]float64{x - half, y1})
		case "pair":
			w.line("JOIST", x-half, y0, x-half, y1)
			w.line("JOIST", x+half, y1, x+half, y0)
		}
	}
	// blocking: in line at y=75, staggered at 220/223
	if v.blocking == "layer" {
		w.line("BLOCKING", -2, 75, 130, 75)
	}
	for i := 0; i < n-1; i++ {
		x := float64(i) * oc
		if v.blocking == "joist" {
			w.line("JOIST", x+half, 75, x+oc-half, 75)
		}
		layer := "BLOCKING"
		if v.blocking == "joist" {
			layer = "JOIST"
		}
		yb := 220 + 3*float64(i%2)
		w.line(layer, x+half, yb, x+oc-half, yb)
	}
	var out bytes.Buffer
	fmt.Fprintf(&out, "0\nSECTION\n2\nHEADER\n9\n$ACADVER\n1\nAC1015\n9\n$INSUNITS\n70\n%d\n0\nENDSEC\n", units)
	out.WriteString("0\nSECTION\n2\nENTITIES\n")
	out.Write(w.b.Bytes())
	out.WriteString("0\nENDSEC\n0\nEOF\n")
	return out.Bytes()
}

// convRun checks one drawing with the conventions' project file.
func convRun(t *testing.T, name string, dxf []byte) *outcome {
	t.Helper()
	dir := t.TempDir()
	plan, proj := filepath.Join(dir, name+".dxf"), filepath.Join(dir, "conv.toml")
	if err := os.WriteFile(plan, dxf, 0o644); err != nil {
		t.Fatal(err)
	}
	return convRunFile(t, plan, proj)
}

func convRunFile(t *testing.T, plan, proj string) *outcome {
	t.Helper()
	if err := os.WriteFile(proj, []byte(convProject), 0o644); err != nil {
		t.Fatal(err)
	}
	p, err := project.LoadProject(proj)
	if err != nil {
		t.Fatal(err)
	}
	o, err := runPipeline(pipelineInput{planPath: plan, project: p})
	if err != nil {
		t.Fatal(err)
	}
	return o
}

// sameOutcome compares a convention's outcome with the reference's: the
// tolerances are the issue's (0.25 in on lengths, 0.5 % on ratios).
func sameOutcome(t *testing.T, label string, ref, got *outcome) {
	t.Helper()
	rm, gm := ref.Plan.Members, got.Plan.Members
	if len(rm) != len(gm) {
		t.Fatalf("%s: %d members, reference %d (issues %v)", label, len(gm), len(rm), got.Plan.Issues)
	}
	for _, is := range got.Plan.Issues {
		if is.Severity == dxfimport.SevError || is.Code == "FRM217" || is.Code == "FRM204" {
			t.Errorf("%s: issue %v", label, is)
		}
	}
	const lenTol, ratioTol = 0.25, 0.005
	for k := range rm {
		r, g := &rm[k], &gm[k]
		if d := dist2(r.Start, g.Start) + dist2(r.End, g.End); d > lenTol {
			t.Errorf("%s %s: centre line %v-%v, reference %v-%v", label, g.ID, g.Start, g.End, r.Start, r.End)
		}
		rs, gs := r.Spans(), g.Spans()
		if len(rs) != len(gs) {
			t.Errorf("%s %s: spans %v, reference %v", label, g.ID, gs, rs)
			continue
		}
		for i := range rs {
			if math.Abs(rs[i]-gs[i]) > lenTol {
				t.Errorf("%s %s: spans %v, reference %v", label, g.ID, gs, rs)
			}
		}
		for i := range r.Bearings {
			if math.Abs(r.Bearings[i].LengthIn-g.Bearings[i].LengthIn) > lenTol {
				t.Errorf("%s %s: bearing %d length %.3f, reference %.3f", label, g.ID, i, g.Bearings[i].LengthIn, r.Bearings[i].LengthIn)
			}
		}
		if math.Abs(r.TribIn-g.TribIn) > lenTol {
			t.Errorf("%s %s: trib %.3f, reference %.3f", label, g.ID, g.TribIn, r.TribIn)
		}
		if r.Mark != g.Mark || g.Error != r.Error {
			t.Errorf("%s %s: mark %q error %v, reference %q %v", label, g.ID, g.Mark, g.Error, r.Mark, r.Error)
		}
		if len(r.ExistingBlockingAtIn) != len(g.ExistingBlockingAtIn) {
			t.Errorf("%s %s: blocking at %v, reference %v", label, g.ID, g.ExistingBlockingAtIn, r.ExistingBlockingAtIn)
		} else {
			for i := range r.ExistingBlockingAtIn {
				if math.Abs(r.ExistingBlockingAtIn[i]-g.ExistingBlockingAtIn[i]) > lenTol {
					t.Errorf("%s %s: blocking at %v, reference %v", label, g.ID, g.ExistingBlockingAtIn, r.ExistingBlockingAtIn)
				}
			}
		}
		rr, gr := ref.Results[k], got.Results[k]
		if rr.Status != gr.Status || rr.Governing != gr.Governing || math.Abs(rr.MaxRatio-gr.MaxRatio) > ratioTol*rr.MaxRatio {
			t.Errorf("%s %s: %s %s %.4f, reference %s %s %.4f", label, g.ID, gr.Status, gr.Governing, gr.MaxRatio, rr.Status, rr.Governing, rr.MaxRatio)
		}
	}
}

func dist2(a, b dxfimport.Point) float64 { return math.Hypot(a.X-b.X, a.Y-b.Y) }

func TestConventionsMatchCentreLines(t *testing.T) {
	for _, tr := range []struct {
		name string
		rot  float64
		mm   bool
	}{{"plain", 0, false}, {"rotated30", 30, false}, {"mm", 0, true}, {"rotated30-mm", 30, true}} {
		ref := convRun(t, "ref", convDXF(convVariant{joists: "centre", supports: "clean", blocking: "layer", rotDeg: tr.rot, mm: tr.mm}))
		// the reference itself, by hand (statics and geometry, common
		// practice, no source): spans wall mid-line 2.75 -> beam mid-line
		// 152.25 -> wall mid-line 302.75: 149.5 and 150.5; trib 16 inside
		// and at x = 0 (8 to its neighbour, 8 of the 16 in to the parallel
		// wall's mid-line), 8 at x = 128; bearings 5.0 (the end stops 0.5
		// in inside the outer face), 4.5 (the beam), 5.0
		if len(ref.Plan.Members) != 9 {
			t.Fatalf("%s: reference has %d members", tr.name, len(ref.Plan.Members))
		}
		edges := 0 // members with trib 8: only x = 128, the wall beside x = 0
		for _, m := range ref.Plan.Members {
			if math.Abs(m.TribIn-8) < 1e-5 {
				edges++
			}
		}
		if edges != 1 {
			t.Errorf("%s: %d members with trib 8, want 1 (x = 128; x = 0 has the parallel wall beside it)", tr.name, edges)
		}
		for _, m := range ref.Plan.Members {
			sp := m.Spans()
			if len(sp) == 2 && sp[0] > sp[1] { // turned 30 degrees, the member runs the other way
				sp[0], sp[1] = sp[1], sp[0]
			}
			if len(sp) != 2 || math.Abs(sp[0]-149.5) > 1e-5 || math.Abs(sp[1]-150.5) > 1e-5 {
				t.Fatalf("%s %s: reference spans %v, want [149.5 150.5]", tr.name, m.ID, sp)
			}
			if lb := []float64{m.Bearings[0].LengthIn, m.Bearings[1].LengthIn, m.Bearings[2].LengthIn}; math.Abs(lb[0]-5) > 1e-5 ||
				math.Abs(lb[1]-4.5) > 1e-5 || math.Abs(lb[2]-5) > 1e-5 {
				t.Errorf("%s %s: reference bearings %v, want [5 4.5 5]", tr.name, m.ID, lb)
			}
			if math.Abs(m.TribIn-8) > 1e-5 && math.Abs(m.TribIn-16) > 1e-5 {
				t.Errorf("%s %s: reference trib %g", tr.name, m.ID, m.TribIn)
			}
			// the row at 75 - 0.5 = 74.5 and the staggered pieces at 219.5
			// and 222.5, one of them at each edge joist
			want := 3
			if m.ID == "M1" || m.ID == "M9" {
				want = 2
			}
			if len(m.ExistingBlockingAtIn) != want {
				t.Errorf("%s %s: reference blocking %v, want the row at 74.5 and %d staggered pieces", tr.name, m.ID, m.ExistingBlockingAtIn, want-1)
			}
		}
		for _, v := range []convVariant{
			{joists: "lines4", supports: "clean", blocking: "layer"},
			{joists: "poly", supports: "clean", blocking: "layer"},
			{joists: "pair", supports: "clean", blocking: "layer"},
			{joists: "mixed", supports: "clean", blocking: "layer"},
			{joists: "centre", supports: "many", blocking: "layer"},
			{joists: "centre", supports: "clean", blocking: "joist"},
			{joists: "lines4", supports: "many", blocking: "joist"},
			{joists: "poly", supports: "many", blocking: "joist"},
		} {
			v.rotDeg, v.mm = tr.rot, tr.mm
			label := fmt.Sprintf("%s/%s-%s-%s", tr.name, v.joists, v.supports, v.blocking)
			got := convRun(t, "conv", convDXF(v))
			sameOutcome(t, label, ref, got)
			if v.joists != "centre" {
				for _, m := range got.Plan.Members {
					if v.joists != "mixed" && math.Abs(m.DrawnThicknessIn-1.5) > 1e-6 {
						t.Errorf("%s %s: drawn thickness %g, want 1.5", label, m.ID, m.DrawnThicknessIn)
					}
				}
			}
			to := got.Takeoff
			if want := 0; v.blocking == "joist" {
				want = 16 // 8 pieces in line, 8 staggered
				if to.ExistingBlockingPieces != want || len(got.Plan.DrawnBlocking) != want {
					t.Errorf("%s: existing blocking %d pieces (%d drawn), want %d", label, to.ExistingBlockingPieces, len(got.Plan.DrawnBlocking), want)
				}
				// each piece 16 - 1.5 = 14.5 in clear (2x dressed 1.5 in,
				// NDS 2018 Supplement Table 1B)
				if len(to.ExistingBlocking) != 1 || math.Abs(to.ExistingBlocking[0].TotalLengthIn-16*14.5) > 16*lenTolTakeoff {
					t.Errorf("%s: existing blocking %+v, want 16 pieces of 14.5 in", label, to.ExistingBlocking)
				}
			} else if to.ExistingBlockingPieces != want {
				t.Errorf("%s: existing blocking %d, want none", label, to.ExistingBlockingPieces)
			}
			if v.supports == "many" {
				var arcs int
				for _, is := range got.Plan.Issues {
					if is.Code == "FRM213" {
						arcs++
						if !strings.Contains(is.Msg, "2 curved entities") {
							t.Errorf("%s: %v, want a count of 2", label, is)
						}
					}
				}
				if arcs != 1 {
					t.Errorf("%s: %d FRM213 findings, want one for both door swings", label, arcs)
				}
			}
		}
	}
}

// lenTolTakeoff: a piece's clear length from the drawing, turned and
// scaled, within 0.01 in.
const lenTolTakeoff = 0.01
