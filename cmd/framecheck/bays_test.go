package main

// Bays shown by a span symbol (issue 14 item 4, framing/bays.go), end to
// end: one bay drawn with every joist as a centre line, and again as a
// bay outline with its callout inside, as a span line with arrowheads
// and as a span line with half-arrows, must give the same members, spans,
// tributary widths, marks and ratios. These drawings are written by our
// own writer (convWriter); bays_ezdxf_test.go reads the same plans written
// by ezdxf (testdata/bays/gen_bays.py).
//
// The plan, in inches before it is turned and scaled: two 2x6 walls, each
// two lines (y = 0 and 5.5, y = 180 and 185.5) from x = 0 to 128; 9 joists
// at 16 in o.c. (x = 0..128) from y = 0 to 185.5 (on the walls' full
// thickness); the callout 2x10 @ 16" o.c. A second bay 300 in above it
// carries the bad-input cases.

import (
	"bytes"
	"fmt"
	"math"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// text writes a TEXT entity of height h (inches) at (x, y).
func (w *convWriter) text(layer string, x, y, h float64, s string) {
	w.head("TEXT", layer)
	a, b := w.pt(x, y)
	fmt.Fprintf(&w.b, "10\n%.9g\n20\n%.9g\n40\n%.9g\n1\n%s\n", a, b, h*w.scale, s)
}

// solid writes a SOLID (a filled arrowhead) with corners p, q, r.
func (w *convWriter) solid(layer string, p, q, r [2]float64) {
	w.head("SOLID", layer)
	for i, c := range [][2]float64{p, q, r, r} {
		x, y := w.pt(c[0], c[1])
		fmt.Fprintf(&w.b, "1%d\n%.9g\n2%d\n%.9g\n", i, x, i, y)
	}
}

const bayCallout = `2x10 @ 16" o.c.`

// baysDXF draws the plan: form is "ref" (centre lines), "outline",
// "arrows", "halfarrows" or "solid" (a span line with SOLID arrowheads);
// bad adds the second bay: "" none, "noside" (its outline with no wall at
// its top), "spacing" (a span line whose callout has a nonsense
// spacing), "drawn" (a span line over joists that are also drawn).
func baysDXF(form, bad string, rotDeg float64, mm bool) []byte {
	w := &convWriter{rot: rotDeg * math.Pi / 180, scale: 1}
	units := 1
	if mm {
		w.scale, units = 25.4, 4
	}
	// dy moves a drawing up: the second bay is 300 in above the first,
	// clear of it (its joists are not the first bay's neighbours)
	walls := func(dy float64, top bool) {
		w.line("WALL", 0, dy, 128, dy)
		w.line("WALL", 0, dy+5.5, 128, dy+5.5)
		if top {
			w.line("WALL", 0, dy+180, 128, dy+180)
			w.line("WALL", 0, dy+185.5, 128, dy+185.5)
		}
	}
	spanLine := func(dy float64, arrows string) {
		const x = 64
		w.line("FRAMING-NOTE", x, dy+5.5, x, dy+180)
		switch arrows {
		case "arrows":
			w.line("FRAMING-NOTE", x, dy+5.5, x-2, dy+11.5)
			w.line("FRAMING-NOTE", x, dy+5.5, x+2, dy+11.5)
			w.line("FRAMING-NOTE", x, dy+180, x-2, dy+174)
			w.line("FRAMING-NOTE", x, dy+180, x+2, dy+174)
		case "halfarrows":
			w.line("FRAMING-NOTE", x, dy+5.5, x+3, dy+11)
			w.line("FRAMING-NOTE", x, dy+180, x-3, dy+174.5)
		case "solid":
			w.solid("FRAMING-NOTE", [2]float64{x, dy + 5.5}, [2]float64{x - 2, dy + 11.5}, [2]float64{x + 2, dy + 11.5})
			w.solid("FRAMING-NOTE", [2]float64{x, dy + 180}, [2]float64{x - 2, dy + 174}, [2]float64{x + 2, dy + 174})
		}
	}
	outline := func(dy float64) {
		w.closedPoly("FRAMING-BAY", [2]float64{0, dy + 5.5}, [2]float64{128, dy + 5.5}, [2]float64{128, dy + 180}, [2]float64{0, dy + 180})
	}
	walls(0, true)
	switch form {
	case "ref":
		for i := 0; i < 9; i++ {
			x := float64(i) * 16
			w.line("JOIST", x, 0, x, 185.5)
		}
		w.line("FRAMING-NOTE", -6, 92, 134, 92)
		w.text("FRAMING-NOTE", 40, 95, 4, bayCallout)
	case "outline":
		outline(0)
		w.text("FRAMING-NOTE", 40, 95, 4, bayCallout)
	default:
		spanLine(0, form)
		w.text("FRAMING-NOTE", 67, 95, 4, bayCallout)
	}
	const dy = 300
	switch bad {
	case "noside":
		walls(dy, false)
		outline(dy)
		w.text("FRAMING-NOTE", 40, dy+95, 4, bayCallout)
	case "spacing":
		walls(dy, true)
		spanLine(dy, "arrows")
		w.text("FRAMING-NOTE", 67, dy+95, 4, `2x10 @ 99" O.C.`)
	case "drawn":
		walls(dy, true)
		for i := 0; i < 9; i++ {
			x := float64(i) * 16
			w.line("JOIST", x, dy, x, dy+185.5)
		}
		spanLine(dy, "arrows")
		w.text("FRAMING-NOTE", 67, dy+95, 4, `2x12 @ 16" o.c.`)
	}
	var out bytes.Buffer
	fmt.Fprintf(&out, "0\nSECTION\n2\nHEADER\n9\n$ACADVER\n1\nAC1015\n9\n$INSUNITS\n70\n%d\n0\nENDSEC\n", units)
	out.WriteString("0\nSECTION\n2\nENTITIES\n")
	out.Write(w.b.Bytes())
	out.WriteString("0\nENDSEC\n0\nEOF\n")
	return out.Bytes()
}

// checkBayRef checks the reference by hand (statics and geometry, common
// practice, no source): spans wall mid-line 2.75 -> wall mid-line 182.75
// = 180 in, bearings 5.5 (each joist across a wall's full thickness),
// trib 16 inside and 8 at the two edge joists, all 2x10.
func checkBayRef(t *testing.T, label string, ref *outcome) {
	t.Helper()
	if len(ref.Plan.Members) != 9 {
		t.Fatalf("%s: reference has %d members (issues %v)", label, len(ref.Plan.Members), ref.Plan.Issues)
	}
	for _, m := range ref.Plan.Members {
		sp := m.Spans()
		if len(sp) != 1 || math.Abs(sp[0]-180) > 1e-5 || m.Size != "2x10" || m.Generated {
			t.Errorf("%s %s: spans %v size %s generated %v, want [180] 2x10 drawn", label, m.ID, sp, m.Size, m.Generated)
		}
		for _, b := range m.Bearings {
			if math.Abs(b.LengthIn-5.5) > 1e-5 {
				t.Errorf("%s %s: bearing %g, want 5.5", label, m.ID, b.LengthIn)
			}
		}
		if math.Abs(m.TribIn-8) > 1e-5 && math.Abs(m.TribIn-16) > 1e-5 {
			t.Errorf("%s %s: trib %g, want 8 or 16", label, m.ID, m.TribIn)
		}
	}
}

// sameBayMembers compares got's members from first on with the
// reference's, member by member: centre lines, spans, bearings, tribs,
// marks and ratios within the issue's tolerances (0.25 in, 0.5 %); each
// is generated when gen says so. Issues are the caller's to check.
func sameBayMembers(t *testing.T, label string, ref, got *outcome, first int, gen bool) {
	t.Helper()
	rm := ref.Plan.Members
	if len(got.Plan.Members) < first+len(rm) {
		t.Fatalf("%s: %d members, want at least %d (issues %v)", label, len(got.Plan.Members), first+len(rm), got.Plan.Issues)
	}
	const lenTol, ratioTol = 0.25, 0.005
	for k := range rm {
		r, g := &rm[k], &got.Plan.Members[first+k]
		if d := dist2(r.Start, g.Start) + dist2(r.End, g.End); d > lenTol {
			t.Errorf("%s %s: centre line %v-%v, reference %v-%v", label, g.ID, g.Start, g.End, r.Start, r.End)
		}
		rs, gs := r.Spans(), g.Spans()
		if len(rs) != len(gs) || (len(rs) == 1 && math.Abs(rs[0]-gs[0]) > lenTol) {
			t.Errorf("%s %s: spans %v, reference %v", label, g.ID, gs, rs)
			continue
		}
		for i := range r.Bearings {
			if math.Abs(r.Bearings[i].LengthIn-g.Bearings[i].LengthIn) > lenTol {
				t.Errorf("%s %s: bearing %d length %.3f, reference %.3f", label, g.ID, i, g.Bearings[i].LengthIn, r.Bearings[i].LengthIn)
			}
		}
		if math.Abs(r.TribIn-g.TribIn) > lenTol || r.Size != g.Size || g.CalloutSpacingIn != r.CalloutSpacingIn {
			t.Errorf("%s %s: trib %.3f %s @ %g, reference %.3f %s @ %g", label, g.ID, g.TribIn, g.Size, g.CalloutSpacingIn, r.TribIn, r.Size, r.CalloutSpacingIn)
		}
		if r.Mark != g.Mark || g.Error != r.Error || g.Generated != gen {
			t.Errorf("%s %s: mark %q error %v generated %v, reference %q %v, want generated %v", label, g.ID, g.Mark, g.Error, g.Generated, r.Mark, r.Error, gen)
		}
		rr, gr := ref.Results[k], got.Results[first+k]
		if rr.Status != gr.Status || rr.Governing != gr.Governing || math.Abs(rr.MaxRatio-gr.MaxRatio) > ratioTol*rr.MaxRatio {
			t.Errorf("%s %s: %s %s %.4f, reference %s %s %.4f", label, g.ID, gr.Status, gr.Governing, gr.MaxRatio, rr.Status, rr.Governing, rr.MaxRatio)
		}
	}
	if got.Takeoff.Joists == nil && ref.Takeoff.Joists != nil {
		t.Errorf("%s: no joists in the takeoff", label)
	}
}

// noErrors fails on any error issue, or a bay finding.
func noErrors(t *testing.T, label string, o *outcome) {
	t.Helper()
	for _, is := range o.Plan.Issues {
		if is.Severity == dxfimport.SevError || strings.HasPrefix(is.Code, "FRM2") && (is.Code == "FRM219" || is.Code == "FRM211" || is.Code == "FRM204") {
			t.Errorf("%s: issue %v", label, is)
		}
	}
}

func TestBaysMatchCentreLines(t *testing.T) {
	for _, tr := range []struct {
		name string
		rot  float64
		mm   bool
	}{{"plain", 0, false}, {"rotated30-mm", 30, true}} {
		ref := convRun(t, "ref", baysDXF("ref", "", tr.rot, tr.mm))
		checkBayRef(t, tr.name+"/ref", ref)
		for _, form := range []string{"outline", "arrows", "halfarrows", "solid"} {
			label := tr.name + "/" + form
			got := convRun(t, form, baysDXF(form, "", tr.rot, tr.mm))
			noErrors(t, label, got)
			if len(got.Plan.Members) != 9 {
				t.Fatalf("%s: %d members, want 9 (issues %v)", label, len(got.Plan.Members), got.Plan.Issues)
			}
			sameBayMembers(t, label, ref, got, 0, true)
		}
	}
}

// handleOf returns the handle of the first entity of that kind on that
// layer at or after y (drawing units), as the writer gave it.
func handleOf(t *testing.T, d *dxfimport.Drawing, layer string, kind dxfimport.Kind, minY float64) string {
	t.Helper()
	for _, e := range d.Entities {
		if e.Pos.Layer == layer && e.Kind == kind && e.Points[0].Y >= minY {
			return e.Pos.Handle
		}
	}
	t.Fatalf("no %v on %s above %g", kind, layer, minY)
	return ""
}

// checkBadBays checks the three bad-input cases against the reference:
// the first bay is checked as in the reference whatever the second one
// is; the second is one clear error naming its handle (no support on one
// side; a nonsense spacing), or (joists drawn too) its drawn joists with
// its callout and nothing generated.
func checkBadBays(t *testing.T, label string, ref *outcome, got map[string]*outcome) {
	t.Helper()
	for _, bad := range []string{"noside", "spacing", "drawn"} {
		o := got[bad]
		l := label + "/" + bad
		// the drawing read again: the run drops its entities once grouped
		d, err := dxfimport.ReadFile(o.drawing.File, dxfimport.Options{})
		if err != nil {
			t.Fatal(err)
		}
		var code, handle, want string
		switch bad {
		case "noside":
			code, want = "FRM219", "no support on its end side"
			handle = handleOf(t, d, "FRAMING-BAY", dxfimport.KindLWPolyline, -1e9)
		case "spacing":
			code, want = "FRM219", "spacing 99"
			handle = handleOf(t, d, "FRAMING-NOTE", dxfimport.KindLine, 250)
		case "drawn":
			code, want = "FRM220", "9 joists are drawn in it"
			handle = handleOf(t, d, "FRAMING-NOTE", dxfimport.KindLine, 250)
		}
		var found []string
		for _, is := range o.Plan.Issues {
			if is.Code == code {
				found = append(found, is.Error())
			}
		}
		if len(found) != 1 || !strings.Contains(found[0], "handle "+handle) || !strings.Contains(found[0], want) {
			t.Errorf("%s: %s findings %q, want one naming handle %s and saying %q", l, code, found, handle, want)
		}
		if bad == "drawn" {
			if len(o.Plan.Members) != 18 {
				t.Fatalf("%s: %d members, want 9 + 9 drawn", l, len(o.Plan.Members))
			}
			for _, m := range o.Plan.Members[9:] {
				if m.Generated || m.Size != "2x12" || m.Error {
					t.Errorf("%s %s: generated %v size %s error %v, want drawn 2x12 from the bay's callout", l, m.ID, m.Generated, m.Size, m.Error)
				}
			}
		} else if len(o.Plan.Members) != 9 {
			t.Fatalf("%s: %d members, want the first bay's 9 (issues %v)", l, len(o.Plan.Members), o.Plan.Issues)
		}
		sameBayMembers(t, l, ref, o, 0, false)
	}
}

func TestBaysBadInput(t *testing.T) {
	ref := convRun(t, "ref", baysDXF("ref", "", 0, false))
	got := map[string]*outcome{}
	for _, bad := range []string{"noside", "spacing", "drawn"} {
		got[bad] = convRun(t, bad, baysDXF("ref", bad, 0, false))
	}
	checkBadBays(t, "ours", ref, got)
}
