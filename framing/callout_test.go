package framing

import (
	"errors"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// TestReadCallout reads callouts in the spellings drafters use on framing
// plans (common practice, no source: the forms listed in issue 14 item 5
// and those seen on plans); each row gives the whole reading.
func TestReadCallout(t *testing.T) {
	const dfl, hf, spf, sp = "Douglas Fir-Larch", "Hem-Fir", "Spruce-Pine-Fir", "Southern Pine"
	ok := []struct {
		in   string
		want Callout
	}{
		{`2x10 @ 16" o.c.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2X12@12`, Callout{Size: "2x12", Plies: 1, SpacingIn: 12}},
		{`2x8 at 19.2 in. oc`, Callout{Size: "2x8", Plies: 1, SpacingIn: 19.2}},
		{`2x6 @ 24 OC`, Callout{Size: "2x6", Plies: 1, SpacingIn: 24}},
		{`  2 x 10   @  16 ” O.C. `, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 joists @ 16" o.c.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2×10 @16in`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x12`, Callout{Size: "2x12", Plies: 1}},
		{`4x14 at 12 inches o.c.`, Callout{Size: "4x14", Plies: 1, SpacingIn: 12}},
		// issue 14 item 5: spacing spellings
		{`2x10 16" o.c.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 16 OC`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 @16"`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 @ 1'-4"`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 @ 1' 4" O.C.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x12 @ 2' o/c`, Callout{Size: "2x12", Plies: 1, SpacingIn: 24}},
		{`2x10 16 o/c`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 @ 16'' O.C.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x10 @ 13 1/2"`, Callout{Size: "2x10", Plies: 1, SpacingIn: 13.5}},
		{`2x10 @ 406.4 mm`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}}, // 406.4 / 25.4 = 16 exactly
		// issue 14 item 5: trailing notes, upper case
		{`2X8 @ 16" O.C. TYP.`, Callout{Size: "2x8", Plies: 1, SpacingIn: 16}},
		{`2x10 @ 16" U.N.O.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x8 @ 24" O.C. CJ`, Callout{Size: "2x8", Plies: 1, SpacingIn: 24}},
		{`2x10 FJ @ 16`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{`2x8 RAFTERS @ 24" O.C.`, Callout{Size: "2x8", Plies: 1, SpacingIn: 24}},
		{`2x10 @ 16 OC TYP, SEE NOTE 4`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		// species and grade
		{`2x10 DF-L #2 @ 16"`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: dfl, Grade: "No.2"}},
		{`2x10 HF No.1 @ 16 o.c.`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: hf, Grade: "No.1"}},
		{`2x8 SP #2 @ 16"`, Callout{Size: "2x8", Plies: 1, SpacingIn: 16, Species: sp, Grade: "No.2"}},
		{`2x6 SPF #2 @ 24" O.C. CJ`, Callout{Size: "2x6", Plies: 1, SpacingIn: 24, Species: spf, Grade: "No.2"}},
		{`2x12 DFL No.2 @ 12`, Callout{Size: "2x12", Plies: 1, SpacingIn: 12, Species: dfl, Grade: "No.2"}},
		{`2x10 @ 16" o.c. DF#1`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: dfl, Grade: "No.1"}},
		{`2x10 D.F.L. NO. 1 & BTR`, Callout{Size: "2x10", Plies: 1, Species: dfl, Grade: "No.1 & Btr"}},
		{`2x10 Hem-Fir Sel Str @ 16`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: hf, Grade: "Select Structural"}},
		{`2x12 SYP SS`, Callout{Size: "2x12", Plies: 1, Species: sp, Grade: "Select Structural"}},
		{`2x10 S-P-F No.1/No.2 @ 16`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: spf, Grade: "No.1/No.2"}},
		{`2x10 #2 @ 16`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Grade: "No.2"}},
		// plies of a built-up member
		{`(2) 2x10`, Callout{Size: "2x10", Plies: 2}},
		{`(3)2x12 DF-L #2`, Callout{Size: "2x12", Plies: 3, Species: dfl, Grade: "No.2"}},
		{`2-2x10`, Callout{Size: "2x10", Plies: 2}},
		{`DBL 2x10 @ 16`, Callout{Size: "2x10", Plies: 2, SpacingIn: 16}},
		// MTEXT paragraphs: the callout line counts, a species/grade or
		// note line under it adds to it or is left out
		{"2x10\n@ 16 o.c.", Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{"2x10 @ 16\" O.C.\nDF-L No.2 U.N.O.", Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: dfl, Grade: "No.2"}},
		{"FLOOR JOISTS:\n2X12 @ 12 OC\nTYP.", Callout{Size: "2x12", Plies: 1, SpacingIn: 12}},
		{"2x10 @ 16\n2x10 @ 16 o.c.", Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{"2x10 @ 16\r\nBLOCKING AT MIDSPAN", Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{"2x10 @ 16\nBLOCKING @ 8'-0\" O.C.", Callout{Size: "2x10", Plies: 1, SpacingIn: 16}},
		{"FLOOR JOISTS, LEVEL 2:\n2x10 DF-L #2", Callout{Size: "2x10", Plies: 1, Species: "Douglas Fir-Larch", Grade: "No.2"}},
	}
	for _, c := range ok {
		got, err := ReadCallout(c.in)
		if err != nil || got != c.want {
			t.Errorf("ReadCallout(%q) = %+v, %v; want %+v", c.in, got, err, c.want)
		}
		size, sp, err := ParseCallout(c.in)
		if err != nil || size != c.want.Designation() || sp != c.want.SpacingIn {
			t.Errorf("ParseCallout(%q) = %q, %g, %v", c.in, size, sp, err)
		}
	}
	bad := []struct{ in, why string }{
		{"2x10 @ 16\n2x12 @ 16", "different sizes"},
		{"2x10 @ 16\n@ 24", "two spacings"},
		{"2x10\n@ banana", `no spacing read at "banana"`},
		{"2x10\n16 bananas", `"16" not understood`},
		{"TYP. @ 2\n2x10", "outside 4-48 in"},
		{"BEDROOM 2\nCLOSET", "names no size"},
		{`2x @ 16`, ""},
		{`2x10 @`, "no spacing"},
		{`2x10 @ 0`, "outside 4-48 in"},
		{`2x10 @ 0"`, "outside 4-48 in"},
		{`2x10 @ 200"`, "outside 4-48 in"},
		{`2x10 @ 60" o.c.`, "outside 4-48 in"},
		{`2x10 200 OC`, "outside 4-48 in"},
		{`2x10 @ 2`, "outside 4-48 in"}, // 2 in o.c. is nonsense: 2' meant?
		{`2x10 @ banana`, `no spacing read at "banana"`},
		{`2x10 @ 16 banana`, `"banana" not understood`},
		{`10x2 @ 16`, "not dimension lumber"},
		{`6x10 @ 16`, "not dimension lumber"},
		{`2x10 @ 16 ft`, "outside 4-48 in"},
		{`SEE NOTE 3`, "names no size"},
		{`PROVIDE 2x10 @ 16`, "size must come first"},
		{`2x10 DF-L #2 HF @ 16`, "two species"},
		{`(9) 2x10`, "plies"},
		// a size in actual inches needs the project's materials (ReadCalloutWith)
		{`1.75x11.875 LVL`, "a size in actual inches is structural composite lumber or glulam"},
		{`1 3/4 x 9 1/2 LVL @ 16`, "read only with the project's materials"},
		{`(2) 1-3/4x11-7/8 LVL`, "read only with the project's materials"},
		{`2x10X12`, "runs into the size"},
		{`90x45 @ 450`, "metric sawn section"},
		{`140x45`, "metric sawn section"},
		{`45x190 @ 600 mm`, "metric sawn section"},
		{``, "names no size"},
	}
	for _, c := range bad {
		got, err := ReadCallout(c.in)
		if err == nil || !errors.Is(err, ErrBadCallout) || !strings.Contains(err.Error(), c.why) {
			t.Errorf("ReadCallout(%q) = %+v, %v; want ErrBadCallout saying %q", c.in, got, err, c.why)
		}
		if size, sp, err := ParseCallout(c.in); err == nil || size != "" || sp != 0 {
			t.Errorf("ParseCallout(%q) = %q, %g, %v; want an error", c.in, size, sp, err)
		}
	}
}

// A metric section is refused with a message saying how to map it, not
// read as a nominal size.
func TestMetricCalloutSaysHowToMap(t *testing.T) {
	_, err := ReadCallout("90x45 @ 450")
	for _, want := range []string{"90x45", "not NDS dimension lumber", "user material", "own section and design values"} {
		if err == nil || !strings.Contains(err.Error(), want) {
			t.Errorf("error %v should say %q", err, want)
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

// Built-up sizes in the takeoff: n plies add their thicknesses, nominal
// and dressed (NDS 2018 Supplement Table 1A: 2x dresses to 1.5 in, 10 in
// to 9.25 in; board measure nominal b d / 12, common practice).
func TestBuiltUpSizeThickness(t *testing.T) {
	for _, c := range []struct {
		size         string
		nb, nd       int
		db, dd       float64
		boardFtPer12 float64
	}{
		{"2x10", 2, 10, 1.5, 9.25, 20},
		{"(2) 2x10", 4, 10, 3.0, 9.25, 40},
		{"(3) 2x12", 6, 12, 4.5, 11.25, 72},
	} {
		b, d, err := NominalSize(c.size)
		db, dd, err2 := DressedSize(c.size)
		if err != nil || err2 != nil || b != c.nb || d != c.nd || db != c.db || dd != c.dd {
			t.Errorf("%s: nominal %dx%d dressed %gx%g (%v %v); want %dx%d, %gx%g", c.size, b, d, db, dd, err, err2, c.nb, c.nd, c.db, c.dd)
		}
		if bf := boardFeet(c.size, 12); bf != c.boardFtPer12 {
			t.Errorf("%s: %g bf in 12 ft, want %g", c.size, bf, c.boardFtPer12)
		}
	}
	for _, s := range []string{"(0) 2x10", "(x) 2x10", "(2 2x10"} {
		if _, _, err := NominalSize(s); err == nil {
			t.Errorf("NominalSize(%q): want an error", s)
		}
		if _, _, err := DressedSize(s); err == nil {
			t.Errorf("DressedSize(%q): want an error", s)
		}
	}
}
