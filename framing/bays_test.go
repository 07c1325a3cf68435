package framing

import (
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// Bays of framing/bays.go, one rule at a time, on small plans of single
// wall lines (geometry written out by hand, common practice, no source).

// generated counts the generated members of a plan.
func generated(pl *Plan) int {
	n := 0
	for _, m := range pl.Members {
		if m.Generated {
			n++
		}
	}
	return n
}

// A span line between two long walls takes the stretch between the
// nearest parallel supports on each side (side beams at x = 20 and 68):
// joists at 20, 36, 52 and 68, each from y = 0 to 120, at the callout's
// 16 in; the 2x12 of the callout on each.
func TestBaySpanLineCutAtSideSupports(t *testing.T) {
	p := newPlan().walls(-100, 300, 0, 120)
	p.line("WALL", 20, 0, 20, 120).line("WALL", 68, 0, 68, 120)
	p.line("FRAMING-NOTE", 44, 0, 44, 120)
	p.line("FRAMING-NOTE", 44, 0, 42, 6).line("FRAMING-NOTE", 44, 0, 46, 6)
	p.text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 46, 60, 3)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 4 || generated(pl) != 4 {
		t.Fatalf("%d members, %d generated, want 4 and 4 (issues %v)", len(pl.Members), generated(pl), pl.Issues)
	}
	for i, x := range []float64{20, 36, 52, 68} {
		m := member(t, pl, x, 60)
		checkNear(t, m.ID+" length", m.LengthIn, 120, 1e-9)
		if m.Size != "2x12" || m.CalloutSpacingIn != 16 || m.Error {
			t.Errorf("joist %d: size %s @ %g error %v %v", i, m.Size, m.CalloutSpacingIn, m.Error, m.Messages)
		}
		if len(m.Spans()) != 1 {
			t.Errorf("joist %d: spans %v", i, m.Spans())
		}
	}
}

// The last joist sits on the far edge when the bay is not a whole number
// of spacings: a bay outline 0..40 across at 16 in gives 0, 16, 32, 40.
func TestBayOutlineLastJoistAtEdge(t *testing.T) {
	p := newPlan().walls(-10, 50, 0, 144)
	p.poly("FRAMING-BAY", true, Point{X: 0, Y: 0}, Point{X: 40, Y: 0}, Point{X: 40, Y: 144}, Point{X: 0, Y: 144})
	p.text("FRAMING-BAY", `2x8 @ 16" o.c.`, 10, 70, 3) // the callout on the bay layer itself
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 4 || generated(pl) != 4 {
		t.Fatalf("%d members, %d generated, want 4 (issues %v)", len(pl.Members), generated(pl), pl.Issues)
	}
	for _, x := range []float64{0, 16, 32, 40} {
		if m := member(t, pl, x, 72); m.Size != "2x8" {
			t.Errorf("joist at %g: size %s", x, m.Size)
		}
	}
	if n := issueCodes(pl.Issues)[CodeCalloutSpacing]; n != 0 {
		t.Errorf("%d spacing warnings on the layout's own last gap", n)
	}
}

// A span line with an arrowhead at one end only and the other end in the
// open is a leader, not a span symbol: nothing generated, no bay error
// (the callout reaches no joist, as before bays were read). A callout
// line drawn along a beam is the beam's, not a span line.
func TestBayLeaderAndBeamCalloutAreNotSpanLines(t *testing.T) {
	p := newPlan().walls(-10, 200, 0, 120)
	p.line("FRAMING-NOTE", 44, 0, 44, 80).line("FRAMING-NOTE", 44, 0, 42, 6).line("FRAMING-NOTE", 44, 0, 46, 6)
	p.text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 46, 40, 3)
	p.line("BEAM-FLUSH", 100, 0, 100, 120).line("FRAMING-NOTE", 104, 0, 104, 120)
	p.text("FRAMING-NOTE", `(3) 2x12 @ 16"`, 106, 60, 3)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 0 || issueCodes(pl.Issues)[CodeBay] != 0 {
		t.Errorf("%d members, issues %v; want none and no %s", len(pl.Members), pl.Issues, CodeBay)
	}
}

// Bad bays, each one error naming its handle, the rest of the plan kept:
// a callout with no spacing; an outline on supports on all four sides
// with no span line (which way it spans cannot be told); a span line with
// arrowheads at both ends and no support at one; an outline with no
// callout; loose lines on a bay layer (a warning, with their handles).
func TestBayErrorsNameTheHandle(t *testing.T) {
	p := newPlan().walls(-10, 300, 0, 120)
	p.joists(0, 120, 200, 216, 232) // the drawn part of the plan
	// no spacing
	p.poly("FRAMING-BAY", true, Point{X: 0, Y: 0}, Point{X: 40, Y: 0}, Point{X: 40, Y: 120}, Point{X: 0, Y: 120})
	noSpacing := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	p.text("FRAMING-NOTE", `2x10`, 10, 60, 3)
	// supports on four sides, no span line
	p.line("WALL", 60, 0, 60, 120).line("WALL", 100, 0, 100, 120)
	p.poly("FRAMING-BAY", true, Point{X: 60, Y: 0}, Point{X: 100, Y: 0}, Point{X: 100, Y: 120}, Point{X: 60, Y: 120})
	noDir := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	p.text("FRAMING-NOTE", `2x10 @ 16" o.c.`, 70, 60, 3)
	// arrowheads at both ends, the far one 40 in past the wall
	p.line("FRAMING-NOTE", 150, 0, 150, 160)
	noSide := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	p.line("FRAMING-NOTE", 150, 0, 148, 6).line("FRAMING-NOTE", 150, 160, 152, 154)
	p.text("FRAMING-NOTE", `2x10 @ 16" o.c.`, 152, 80, 3)
	p.line("FRAMING-BAY", 250, 0, 250, 120)
	loose := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	// no callout at all (a room name inside)
	p.poly("FRAMING-BAY", true, Point{X: 260, Y: 0}, Point{X: 290, Y: 0}, Point{X: 290, Y: 120}, Point{X: 260, Y: 120})
	noCallout := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	p.text("FRAMING-NOTE", "STORAGE", 265, 60, 3)
	pl := p.group(DefaultOptions())
	var msgs []string
	for _, is := range pl.Issues {
		if is.Code == CodeBay {
			msgs = append(msgs, is.Error())
		}
	}
	all := strings.Join(msgs, "\n")
	for _, want := range []string{
		"bay outline (handle " + noSpacing + "): its callout \"2x10\"",
		"gives no spacing",
		"bay outline (handle " + noDir + "): cannot tell which way it spans",
		"span line (handle " + noSide + "): no support at its end near (150.00, 160.00)",
		"1 entities on bay layers left out (handles " + loose + ")",
		"bay outline (handle " + noCallout + "): no size callout",
	} {
		if !strings.Contains(all, want) {
			t.Errorf("no finding saying %q in:\n%s", want, all)
		}
	}
	if len(pl.Members) != 3 || generated(pl) != 0 {
		t.Errorf("%d members, %d generated; want the 3 drawn", len(pl.Members), generated(pl))
	}
	errs := 0
	for _, is := range pl.Issues {
		if is.Code == CodeBay && is.Severity == dxfimport.SevError {
			errs++
		}
	}
	if errs != 4 {
		t.Errorf("%d %s errors, want 4 (the loose line is a warning)", errs, CodeBay)
	}
}

// A bay outline in a plan with no support lines at all is one error, not
// a crash.
func TestBayWithoutAnySupport(t *testing.T) {
	p := newPlan().poly("FRAMING-BAY", true, Point{X: 0, Y: 0}, Point{X: 40, Y: 0}, Point{X: 40, Y: 120}, Point{X: 0, Y: 120})
	p.line("FRAMING-NOTE", 20, 0, 20, 120).text("FRAMING-NOTE", `2x10 @ 16" o.c.`, 22, 60, 3)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 0 || issueCodes(pl.Issues)[CodeBay] != 1 || pl.Issues.Err() == nil {
		t.Errorf("%d members, issues %v; want none and one %s error", len(pl.Members), pl.Issues, CodeBay)
	}
}

// A bay outline with a span line inside it takes its direction from the
// span line (here across the outline's long side: joists 96 in long at
// y = 0, 16, 32, 40, between walls at x = 0 and 96), and the callout
// written beside the span line just outside the outline.
func TestBayOutlineWithSpanLine(t *testing.T) {
	p := newPlan()
	p.line("WALL", 0, -10, 0, 50).line("WALL", 96, -10, 96, 50)
	p.poly("FRAMING-BAY", true, Point{X: 0, Y: 0}, Point{X: 96, Y: 0}, Point{X: 96, Y: 40}, Point{X: 0, Y: 40})
	p.line("FRAMING-NOTE", 0, 20, 96, 20)
	p.text("FRAMING-NOTE", `2X8 @ 16" O.C. TYP.`, 100, 22, 3)
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 4 || generated(pl) != 4 || pl.Issues.Err() != nil {
		t.Fatalf("%d members, %d generated (issues %v), want 4", len(pl.Members), generated(pl), pl.Issues)
	}
	for _, y := range []float64{0, 16, 32, 40} {
		m := member(t, pl, 48, y)
		checkNear(t, m.ID+" length", m.LengthIn, 96, 1e-9)
		if m.Size != "2x8" {
			t.Errorf("joist at y %g: size %q", y, m.Size)
		}
	}
}

// A callout written nearer an arrowhead than the span line is the span
// line's: the bay is laid out once, and a finding about it names the span
// line, not the arrowhead.
func TestBayCalloutNearArrowhead(t *testing.T) {
	p := newPlan().walls(20, 68, 0, 120)
	p.line("FRAMING-NOTE", 44, 0, 44, 120)
	span := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	p.line("FRAMING-NOTE", 44, 0, 42, 6).line("FRAMING-NOTE", 44, 0, 46, 6)
	p.line("FRAMING-NOTE", 44, 120, 42, 114).line("FRAMING-NOTE", 44, 120, 46, 114)
	p.text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 47, 8, 3)
	p.text("FRAMING-NOTE", `2x12 @ 99" o.c.`, 47, 112, 3) // the same line's: the bay is in error
	pl := p.group(DefaultOptions())
	if len(pl.Members) != 0 || issueCodes(pl.Issues)[CodeBay] != 1 {
		t.Fatalf("%d members, issues %v; want none and one %s", len(pl.Members), pl.Issues, CodeBay)
	}
	if msg := pl.Issues[0].Error(); !strings.Contains(msg, "span line (handle "+span+")") || !strings.Contains(msg, "spacing 99") {
		t.Errorf("finding %q, want the span line's handle %s and the spacing", msg, span)
	}
	p.d.Entities = p.d.Entities[:len(p.d.Entities)-1]
	pl = p.group(DefaultOptions())
	if len(pl.Members) != 4 || generated(pl) != 4 || pl.Issues.Err() != nil {
		t.Errorf("%d members, %d generated, issues %v; want 4 laid out", len(pl.Members), generated(pl), pl.Issues)
	}
}
