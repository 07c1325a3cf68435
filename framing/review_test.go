package framing

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// Plans drawn the way framers draw them. Expected values are closed-form
// geometry from DOMAIN.md "Members from a plan" (span centre-to-centre,
// trib = half the gap to each neighbour): common practice, no source.

func TestTwoLinesALumberThicknessApartAreOneMember(t *testing.T) {
	// Two joist lines 1.5 in apart are the two sides of one member's
	// outline (issue 14: "a pair of parallel lines ... whose separation
	// matches a lumber thickness ... is one member on its centre line"),
	// not two plies and not a line drawn twice. Lines at x = 0, 16,
	// 17.5, 33.5: members at 0, 16.75 and 33.5;
	//   x=0:     edge, trib 16.75/2 = 8.375
	//   x=16.75: 8.375 + 8.375 = 16.75
	//   x=33.5:  8.375
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 17.5, 33.5).group(DefaultOptions())
	if len(pl.Members) != 3 {
		t.Fatalf("members = %d, want 3 (issues %v)", len(pl.Members), pl.Issues)
	}
	if c := issueCodes(pl.Issues); c[CodeDuplicateJoist] != 0 || c[CodeThickness] != 0 {
		t.Errorf("issues %v: an outline 1.5 in thick is neither a duplicate nor the wrong thickness for a 2x10", pl.Issues)
	}
	for _, w := range []struct{ x, trib, thick float64 }{{0, 8.375, 0}, {16.75, 16.75, 1.5}, {33.5, 8.375, 0}} {
		m := member(t, pl, w.x, 72)
		checkNear(t, "trib", m.TribIn, w.trib, 1e-9)
		checkNear(t, "drawn thickness", m.DrawnThicknessIn, w.thick, 1e-9)
	}
}

func TestRowPiecesBesideAnOutlineMember(t *testing.T) {
	// a run x = 0, 16.75 (drawn as lines at 16 and 17.5), 33.5: a row
	// crosses the bays 0-16.75 and 16.75-33.5, clear 16.75 - 1.5 = 15.25
	// in each (2x dressed thickness 1.5 in, NDS 2018 Supplement Table 1B).
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 17.5, 33.5).group(DefaultOptions())
	if len(pl.Runs) != 1 {
		t.Fatalf("runs %+v, want one", pl.Runs)
	}
	rows := pl.PlaceRows(0, []float64{72})
	if len(rows) != 1 || rows[0].Pieces != 2 || len(rows[0].ClearIn) != 2 {
		t.Fatalf("rows %+v, want one row of 2 pieces", rows)
	}
	for _, c := range rows[0].ClearIn {
		checkNear(t, "clear", c, 15.25, 1e-9)
	}
	if to := BuildTakeoff(pl, rows); to.BlockingPieces != 2 {
		t.Errorf("takeoff blocking pieces %d, want 2", to.BlockingPieces)
	}
}

func TestSkewedJoistEndInsideWallIsNoOverhang(t *testing.T) {
	// Joists at 30 degrees to double-line walls 5.5 in thick (faces at
	// y = 0/5.5 and 149.5/155), drawn from outer face to outer face.
	// Along a joist a wall is 5.5 / sin 30 = 11 in wide, so each end sits
	// 5.5 in past its bearing centre-line but still inside the wall: part
	// of the bearing, no cantilever (DOMAIN.md "Members from a plan").
	// Span = (152.25 - 2.75) / sin 30 = 299 in; length 155 / sin 30 = 310.
	p := newPlan()
	for _, y := range []float64{0, 5.5, 149.5, 155} {
		p.line("WALL", -50, y, 700, y)
	}
	c := math.Cos(math.Pi / 6)
	for _, x := range []float64{0, 32, 64} {
		p.line("JOIST", x, 0, x+310*c, 155)
	}
	// a joist stopping 3 in (perpendicular) past a single-line wall at
	// y = 400 from a wall at y = 250: 6 in along the joist, within
	// (lb/2 + snap) / sin 30 = (1.75 + 1.5) / 0.5 = 6.5 in: no overhang
	p.line("WALL", -50, 250, 700, 250).line("WALL", -50, 400, 700, 400)
	p.line("JOIST", 0, 250, 153*2*c, 403)
	pl := p.group(DefaultOptions())
	for _, m := range pl.Members {
		if m.Error || m.OverhangStartIn != 0 || m.OverhangEndIn != 0 {
			t.Errorf("%s error %v overhangs %g/%g, want none (%q)", m.ID, m.Error, m.OverhangStartIn, m.OverhangEndIn, m.Messages)
		}
	}
	m := member(t, pl, 155*c, 77.5)
	if sp := m.Spans(); len(sp) != 1 || !near(sp[0], 299, 1e-6) {
		t.Errorf("spans %v, want [299]", sp)
	}
	m = member(t, pl, 153*c, 326.5)
	if sp := m.Spans(); len(sp) != 1 || !near(sp[0], 300, 1e-6) {
		t.Errorf("spans %v, want [(400 - 250) / sin 30 = 300]", sp)
	}
}

func TestHeaderFramingIntoTrimmerIsNotItsBearing(t *testing.T) {
	// A stair opening: a flush-beam header at y = 100 hangs between the
	// trimmers (each drawn as two lines 1.5 in apart, x = 48/49.5 and
	// 96/97.5: one member's outline, centre lines 48.75 and 96.75) and carries
	// tail joists at x = 64 and 80 running to the wall at y = 144. The
	// header ends on the trimmers: they carry it, it does not carry
	// them, so it is not one of their bearings (each keeps its single
	// 144 in span). The header's reaction is a point load, outside the
	// tool's scope (DOMAIN.md "Cautions"): the trimmers are error members
	// saying so. The tail joists span 144 - 100 = 44 in and hang from the
	// header at their start.
	p := newPlan().walls(-10, 200, 0, 144)
	p.joists(0, 144, 0, 16, 32, 48, 49.5, 96, 97.5, 112, 128)
	p.line("BEAM-FLUSH", 49.5, 100, 96, 100)
	p.joists(100, 144, 64, 80)
	pl := p.group(DefaultOptions())
	for _, x := range []float64{48.75, 96.75} {
		m := member(t, pl, x, 72)
		if sp := m.Spans(); len(sp) != 1 || !near(sp[0], 144, 1e-9) || !m.Error {
			t.Errorf("trimmer x=%g spans %v error %v, want [144] and an error", x, sp, m.Error)
		}
		if len(m.Messages) != 1 || !strings.Contains(m.Messages[0], "carries the end of a flush beam") {
			t.Errorf("trimmer x=%g messages %q, want one about the header it carries", x, m.Messages)
		}
	}
	if c := issueCodes(pl.Issues); c[CodeCarriesBeam] != 2 {
		t.Errorf("issues %v, want 2 x %s", pl.Issues, CodeCarriesBeam)
	}
	for _, x := range []float64{64, 80} {
		m := member(t, pl, x, 122)
		if sp := m.Spans(); len(sp) != 1 || !near(sp[0], 44, 1e-9) || !m.HangersStart || m.HangersEnd || m.Error {
			t.Errorf("tail x=%g spans %v hangers %v/%v error %v, want [44] and a hanger at the header", x, sp, m.HangersStart, m.HangersEnd, m.Error)
		}
	}
	// a flush beam a joist ends on is still its bearing, even where the
	// beam's own end is there too (the last joist along the beam)
	if m := member(t, pl, 16, 72); m.Error {
		t.Errorf("x=16: %q", m.Messages)
	}
	q := newPlan().walls(-10, 100, 0).line("BEAM-FLUSH", 0, 144, 100, 144).joists(0, 144, 0, 16)
	for _, m := range q.group(DefaultOptions()).Members {
		if m.Error || !m.HangersEnd {
			t.Errorf("%s error %v hangers %v: %q", m.ID, m.Error, m.HangersEnd, m.Messages)
		}
	}
}

func TestCalloutWithoutSpacingAgreesWithOneThatGivesIt(t *testing.T) {
	// `2x12` on one span line and `2x12 @ 16" o.c.` on another over the
	// same joists say the same thing: no conflict; the joists take 2x12
	// and the 16 in nominal spacing (measured 16 in: no warning).
	// `2x10` against `2x12 @ 16` still conflicts (sizes differ).
	pl := calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60). // crosses x = 0, 16, 32
		text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 2, 61, 3).
		line("FRAMING-NOTE", -4, 90, 20, 90). // crosses x = 0, 16
		text("FRAMING-NOTE", "2x12", 2, 91, 3).
		group(DefaultOptions())
	for _, m := range pl.Members {
		if m.Error || len(pl.Issues) != 0 {
			t.Errorf("%s error %v, issues %v", m.ID, m.Error, pl.Issues)
		}
		if m.Start.X <= 32 && (m.Size != "2x12" || m.CalloutSpacingIn != 16) {
			t.Errorf("%s size %s callout spacing %g, want 2x12 @ 16", m.ID, m.Size, m.CalloutSpacingIn)
		}
	}
	pl = calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60).
		text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 2, 61, 3).
		line("FRAMING-NOTE", -4, 90, 20, 90).
		text("FRAMING-NOTE", "2x10", 2, 91, 3).
		group(DefaultOptions())
	if c := issueCodes(pl.Issues); c[CodeCalloutConflict] != 2 {
		t.Errorf("issues %v, want 2 conflicts (x = 0, 16)", pl.Issues)
	}
}

func TestBlockingDrawnPieceByPiece(t *testing.T) {
	// drawn blocking as one short line per bay at y = 72 (each piece ends
	// on the joists either side): every joist is braced once at 72 in
	// from its start, not once per piece touching it
	p := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 32, 48)
	for _, x := range []float64{0, 16, 32} {
		p.line("BLOCKING", x, 72, x+16, 72)
	}
	pl := p.group(DefaultOptions())
	for _, m := range pl.Members {
		if len(m.ExistingBlockingAtIn) != 1 || !near(m.ExistingBlockingAtIn[0], 72, 1e-9) {
			t.Errorf("%s drawn blocking at %v, want [72]", m.ID, m.ExistingBlockingAtIn)
		}
	}
}

// mmDXF writes a minimal DXF in millimetres ($INSUNITS 4) of LINEs,
// closed LWPOLYLINEs and TEXTs, each point mapped through f (in mm).
func mmDXF(f func(x, y float64) (float64, float64), lines [][5]any, polys [][]float64, texts [][4]any) string {
	var b strings.Builder
	h := 0x100
	num := func(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }
	ent := func(kind, layer string) {
		h++
		fmt.Fprintf(&b, "0\n%s\n5\n%X\n8\n%s\n", kind, h, layer)
	}
	b.WriteString("0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n70\n4\n0\nENDSEC\n0\nSECTION\n2\nENTITIES\n")
	for _, l := range lines {
		ent("LINE", l[0].(string))
		x0, y0 := f(l[1].(float64), l[2].(float64))
		x1, y1 := f(l[3].(float64), l[4].(float64))
		fmt.Fprintf(&b, "10\n%s\n20\n%s\n30\n0\n11\n%s\n21\n%s\n31\n0\n", num(x0), num(y0), num(x1), num(y1))
	}
	for _, p := range polys {
		ent("LWPOLYLINE", "WALL")
		fmt.Fprintf(&b, "90\n%d\n70\n1\n", len(p)/2)
		for i := 0; i < len(p); i += 2 {
			x, y := f(p[i], p[i+1])
			fmt.Fprintf(&b, "10\n%s\n20\n%s\n", num(x), num(y))
		}
	}
	for _, t := range texts {
		ent("TEXT", "FRAMING-NOTE")
		x, y := f(t[0].(float64), t[1].(float64))
		fmt.Fprintf(&b, "10\n%s\n20\n%s\n30\n0\n40\n%s\n1\n%s\n", num(x), num(y), num(t[2].(float64)), t[3].(string))
	}
	b.WriteString("0\nENDSEC\n0\nEOF\n")
	return b.String()
}

func TestMillimetrePlanAt45DegreesThroughDxfimport(t *testing.T) {
	// A plan drawn in mm, rotated 45 degrees, read by dxfimport.Read:
	// a 2x6 exterior wall drawn as a closed outline 139.7 mm (5.5 in)
	// thick with its inner face on y = 0, a single-line wall at
	// y = 3657.6 mm (144 in); joists at 406.4 mm (16 in) o.c., drawn
	// alternately up and down, from the outer face (y = -5.5 in) to
	// 19.05 mm (0.75 in) past the single-line wall. By hand, in inches:
	//   bearings: mid-line of the outline, y = -2.75 (lb 5.5), and the
	//   single line, y = 144 (lb 3.5); span 144 + 2.75 = 146.75;
	//   length 5.5 + 144 + 0.75 = 150.25; no overhang (start 2.75 past
	//   its bearing centre <= 2.75 + 1.5; end 0.75 <= 1.75 + 1.5);
	//   trib 16 inside, 8 at the two edge joists.
	// The callout `2x12 @ 16" o.c.` on a span line across all four sets
	// their size; measured spacing 16 in: no warning.
	const mm = 25.4
	c, s := math.Cos(math.Pi/4), math.Sin(math.Pi/4)
	rot := func(x, y float64) (float64, float64) { return c*x - s*y, s*x + c*y }
	lines := [][5]any{{"WALL", -500.0, 144 * mm, 2000.0, 144 * mm}}
	for i, x := range []float64{0, 16, 32, 48} {
		y0, y1 := -5.5*mm, 144.75*mm
		if i%2 == 1 {
			y0, y1 = y1, y0
		}
		lines = append(lines, [5]any{"JOIST", x * mm, y0, x * mm, y1})
	}
	lines = append(lines, [5]any{"FRAMING-NOTE", -4 * mm, 60 * mm, 52 * mm, 60 * mm})
	polys := [][]float64{{-500, -5.5 * mm, 2000, -5.5 * mm, 2000, 0, -500, 0}}
	texts := [][4]any{{2 * mm, 61 * mm, 3 * mm, `2x12 @ 16" o.c.`}}
	d, err := dxfimport.Read(strings.NewReader(mmDXF(rot, lines, polys, texts)), "mm.dxf", dxfimport.Options{})
	if err != nil {
		t.Fatal(err)
	}
	pl := Group(d, DefaultOptions())
	if len(pl.Members) != 4 || len(pl.Runs) != 1 || len(pl.Issues) != 0 {
		t.Fatalf("members %d runs %d issues %v, want 4 in one run and no issues", len(pl.Members), len(pl.Runs), pl.Issues)
	}
	for _, m := range pl.Members {
		if sp := m.Spans(); len(sp) != 1 || !near(sp[0], 146.75, 1e-6) {
			t.Errorf("%s spans %v, want [146.75]", m.ID, sp)
		}
		checkNear(t, m.ID+" length", m.LengthIn, 150.25, 1e-6)
		// Start is the end lower along the group direction (doc.go): at
		// 45 degrees that is the end at the single-line wall
		checkNear(t, m.ID+" lb at the single line", m.Bearings[0].LengthIn, 3.5, 1e-9)
		checkNear(t, m.ID+" lb at the outline", m.Bearings[1].LengthIn, 5.5, 1e-6)
		if m.Error || m.OverhangStartIn != 0 || m.OverhangEndIn != 0 || m.Size != "2x12" {
			t.Errorf("%s error %v overhangs %g/%g size %s", m.ID, m.Error, m.OverhangStartIn, m.OverhangEndIn, m.Size)
		}
	}
	var tribs []float64
	for _, k := range pl.Runs[0].Members {
		tribs = append(tribs, math.Round(pl.Members[k].TribIn*1e6)/1e6)
	}
	if fmt.Sprint(tribs) != "[8 16 16 8]" {
		t.Errorf("tribs across the run %v, want [8 16 16 8]", tribs)
	}
}

func TestCalloutSpacingIgnoresDoubledJoistPlies(t *testing.T) {
	// `2x10 @ 16" o.c.` over joists at x = 0, 16, 17.5 (one member's
	// outline, centre line 16.75), 33.5, 49.5: the 1.5 in between the
	// two lines is not a spacing, and 16.75 in is within 1 in of the
	// callout, so no FRM210 warning. The member's measured spacing is
	// (16.75 + 16.75) / 2 (half the gap each side, DOMAIN.md).
	pl := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 17.5, 33.5, 49.5).
		line("FRAMING-NOTE", -4, 60, 54, 60).
		text("FRAMING-NOTE", `2x10 @ 16" o.c.`, 2, 61, 3).
		group(DefaultOptions())
	if c := issueCodes(pl.Issues); c[CodeCalloutSpacing] != 0 {
		t.Errorf("issues %v: no spacing warning for the plies of a doubled joist", pl.Issues)
	}
	checkNear(t, "outline member spacing", member(t, pl, 16.75, 72).SpacingIn, 16.75, 1e-9)
	// a real mismatch is still reported: joists at 24 in under a 16 in callout
	pl = newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 24, 48).
		line("FRAMING-NOTE", -4, 60, 54, 60).
		text("FRAMING-NOTE", `2x10 @ 16" o.c.`, 2, 61, 3).
		group(DefaultOptions())
	if c := issueCodes(pl.Issues); c[CodeCalloutSpacing] != 3 {
		t.Errorf("issues %v, want 3 spacing warnings (24 in measured)", pl.Issues)
	}
}
