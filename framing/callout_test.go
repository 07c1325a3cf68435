package framing

import (
	"errors"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

func TestParseCallout(t *testing.T) {
	// Spellings drafters use on framing plans (common practice, no source).
	cases := []struct {
		in        string
		size      string
		spacingIn float64
		bad       bool
	}{
		{in: `2x10 @ 16" o.c.`, size: "2x10", spacingIn: 16},
		{in: `2X12@12`, size: "2x12", spacingIn: 12},
		{in: `2x8 at 19.2 in. oc`, size: "2x8", spacingIn: 19.2},
		{in: `2x6 @ 24 OC`, size: "2x6", spacingIn: 24},
		{in: `  2 x 10   @  16 ” O.C. `, size: "2x10", spacingIn: 16},
		{in: `2x10 joists @ 16" o.c.`, size: "2x10", spacingIn: 16},
		{in: `2×10 @16in`, size: "2x10", spacingIn: 16},
		{in: "2x10\n@ 16 o.c.", size: "2x10", spacingIn: 16}, // MTEXT line break
		{in: `2x12`, size: "2x12", spacingIn: 0},
		// MTEXT paragraphs: the callout line counts, a species/grade or
		// note line under it does not stop it; two disagreeing lines do
		{in: "2x10 @ 16\" O.C.\nDF-L No.2 U.N.O.", size: "2x10", spacingIn: 16},
		{in: "FLOOR JOISTS:\n2X12 @ 12 OC\nTYP.", size: "2x12", spacingIn: 12},
		{in: "2x10 @ 16\n2x10 @ 16 o.c.", size: "2x10", spacingIn: 16},
		{in: "2x10 @ 16\n2x12 @ 16", bad: true},
		{in: "BEDROOM 2\nCLOSET", bad: true},
		{in: `4x14 at 12 inches o.c.`, size: "4x14", spacingIn: 12},
		{in: `2x @ 16`, bad: true},
		{in: `2x10 @`, bad: true},
		{in: `2x10 @ 0`, bad: true},
		{in: `2x10 @ 60" o.c.`, bad: true},
		{in: `10x2 @ 16`, bad: true},
		{in: `6x10 @ 16`, bad: true},
		{in: `2x10 @ 16 ft`, bad: true},
		{in: `SEE NOTE 3`, bad: true},
		{in: `(2) 2x10`, bad: true},
		{in: ``, bad: true},
	}
	for _, c := range cases {
		size, sp, err := ParseCallout(c.in)
		if c.bad {
			if err == nil || !errors.Is(err, ErrBadCallout) {
				t.Errorf("ParseCallout(%q) = %q, %g, %v; want ErrBadCallout", c.in, size, sp, err)
			}
			continue
		}
		if err != nil || size != c.size || sp != c.spacingIn {
			t.Errorf("ParseCallout(%q) = %q, %g, %v; want %q, %g", c.in, size, sp, err, c.size, c.spacingIn)
		}
	}
}

func calloutPlan() *plan {
	return newPlan().walls(-10, 200, 0, 144).joists(0, 144, 0, 16, 32, 48, 64)
}

func TestCalloutOnSpanLine(t *testing.T) {
	opt := DefaultOptions()
	opt.ByLayer = []LumberRule{{Layers: []string{"JOIST"}, Size: "2x8", Grade: "No.1"}}
	pl := calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60). // crosses x = 0, 16, 32
		text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 2, 61, 3).
		group(opt)
	for _, m := range pl.Members {
		want := "2x8"
		if m.Start.X <= 32 {
			want = "2x12"
		}
		if m.Size != want || m.Grade != "No.1" || m.Species != "Douglas Fir-Larch" {
			t.Errorf("%s at x=%g: %s %s %s, want %s No.1 (callout > by_layer > default)", m.ID, m.Start.X, m.Size, m.Grade, m.Species, want)
		}
	}
}

func TestCalloutWithoutSpanLineTakesRun(t *testing.T) {
	pl := calloutPlan().
		walls(-10, 200, 300).joists(144, 300, 0, 16). // a second run
		text("FRAMING-NOTE", "2X12@12", 20, 70, 3).   // over the first run
		group(DefaultOptions())
	for _, m := range pl.Members {
		want := "2x10"
		if m.Start.Y < 100 {
			want = "2x12"
		}
		if m.Size != want {
			t.Errorf("%s size %s, want %s", m.ID, m.Size, want)
		}
	}
	// measured 16 in, callout 12 in: more than 1 in apart
	if c := issueCodes(pl.Issues); c[CodeCalloutSpacing] != 5 {
		t.Errorf("issues %v, want five spacing warnings", pl.Issues)
	}
}

func TestCalloutConflictAndBadText(t *testing.T) {
	pl := calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60).
		text("FRAMING-NOTE", `2x12 @ 16" o.c.`, 2, 61, 3).
		line("FRAMING-NOTE", 8, 90, 60, 90). // crosses x = 16 .. 48
		text("FRAMING-NOTE", `2x10 @ 16" o.c.`, 20, 91, 3).
		text("FRAMING-NOTE", "BLOCK @ MID", 500, 500, 3).
		text("FRAMING-NOTE", "2x10 @ 16", 900, 900, 3). // near nothing
		group(DefaultOptions())
	var conflicted int
	for _, m := range pl.Members {
		if m.Error {
			conflicted++
			if !strings.Contains(m.Messages[0], "conflicting size callouts") {
				t.Errorf("%s messages %q", m.ID, m.Messages)
			}
		}
	}
	c := issueCodes(pl.Issues)
	if conflicted != 2 || c[CodeCalloutConflict] != 2 || c[CodeBadCallout] != 1 || c[CodeCalloutUnused] != 1 {
		t.Errorf("conflicted %d, issues %v", conflicted, pl.Issues)
	}
	for _, i := range pl.Issues {
		if i.Code == CodeBadCallout && !strings.Contains(i.Msg, "BLOCK @ MID") {
			t.Errorf("bad callout message %q should quote the text", i.Msg)
		}
	}
}

// Room names and notes on a label layer are not callouts and are reported
// once, as information; text that tries to be a callout and fails is
// warned about by itself (common practice, no source).
func TestLabelLayerRoomNamesAreOneInfo(t *testing.T) {
	pl := calloutPlan().
		text("FRAMING-NOTE", "BEDROOM 2", 500, 500, 3).
		text("FRAMING-NOTE", "CLOSET", 520, 500, 3).
		text("FRAMING-NOTE", "2-10 @ 16", 900, 900, 3).
		group(DefaultOptions())
	var info, warn []string
	for _, i := range pl.Issues {
		if i.Code != CodeBadCallout {
			continue
		}
		switch i.Severity {
		case dxfimport.SevInfo:
			info = append(info, i.Msg)
		case dxfimport.SevWarning:
			warn = append(warn, i.Msg)
		}
	}
	if len(info) != 1 || !strings.Contains(info[0], "2 label-layer text(s)") || !strings.Contains(info[0], `"BEDROOM 2"`) {
		t.Errorf("info %q, want one naming 2 texts and the first", info)
	}
	if len(warn) != 1 || !strings.Contains(warn[0], `"2-10 @ 16"`) {
		t.Errorf("warnings %q, want one about 2-10 @ 16", warn)
	}
}
