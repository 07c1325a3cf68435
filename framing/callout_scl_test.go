package framing

import (
	"errors"
	"strings"
	"testing"

	"framecheck/check"
	"framecheck/dxfimport"
)

// sclTestCSV is a materials file with two structural composite lumber
// materials as a manufacturer's sheet would give them (test input: common
// practice, no source): LVL of one grade, PSL of two.
const sclTestCSV = "species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source\n" +
	"LVL,2.0E,5.5,18,2600,1900,285,750,2500,2000000,1016000,SCL 0.136,test input\n" +
	"PSL,2.2E,9.25,18,2900,2025,290,750,2900,2200000,1118000,SCL 0.111,test input\n" +
	"PSL,1.8E,9.25,18,2400,1755,230,600,2500,1800000,915000,SCL 0.111,test input\n"

// sclTestMaterials returns the built-in materials with sclTestCSV's rows.
func sclTestMaterials(t testing.TB) *check.Materials {
	t.Helper()
	u, err := check.LoadMaterialsCSV(strings.NewReader(sclTestCSV), "scl.csv")
	if err != nil {
		t.Fatal(err)
	}
	return check.BuiltinMaterials().Merge(u)
}

// TestReadCalloutWithSCL: joist callouts of structural composite lumber,
// a size in actual inches followed by a material of the materials file
// (the forms of beam callouts, "3 1/2 x 11 7/8 LVL", "1 3/4 x 11 7/8 LVL
// (2)"), with the spacings and notes of any callout (common practice, no
// source: the forms of the callouts above). Each row gives the whole
// reading; sizes in actual inches are the fractions as decimals (1 3/4 =
// 1.75, 11 7/8 = 11.875, 9 1/2 = 9.5: arithmetic). A bare size, a word
// naming no material, or sawn plies words are errors, never a default.
func TestReadCalloutWithSCL(t *testing.T) {
	read := sclTestMaterials(t).ReadSCLCallout
	lvl := func(size string, plies int, sp float64) Callout {
		return Callout{Size: size, Plies: plies, SpacingIn: sp, Species: "LVL", Material: true}
	}
	ok := []struct {
		in   string
		want Callout
	}{
		{`1 3/4 x 11 7/8 LVL @ 16" o.c.`, lvl("1.75x11.875", 1, 16)},
		{`1-3/4x9-1/2 LVL @ 19.2 O.C.`, lvl("1.75x9.5", 1, 19.2)},
		{`1.75x9.5 lvl 16 OC`, lvl("1.75x9.5", 1, 16)},     // the word matched case-insensitively
		{`1.75 X 9.5 Lvl @ 1'-4"`, lvl("1.75x9.5", 1, 16)}, // 1'-4" = 16 in
		{`1 3/4 x 11 7/8 LVL`, lvl("1.75x11.875", 1, 0)},   // no spacing: the drawing's
		{`(2) 1 3/4 x 11 7/8 LVL @ 24`, lvl("1.75x11.875", 2, 24)},
		{`(2)-1.75x14 LVL`, lvl("1.75x14", 2, 0)},
		{`1 3/4 x 14 LVL (2) @ 24" TYP.`, lvl("1.75x14", 2, 24)},
		{`1 3/4 x 9 1/2 LVL JOISTS @ 16`, lvl("1.75x9.5", 1, 16)},
		{`FLOOR JOISTS: 1 3/4 x 11 7/8 LVL @ 16 U.N.O.`, lvl("1.75x11.875", 1, 16)},
		{"1 3/4 x 9 1/2 LVL\n@ 16 o.c.", lvl("1.75x9.5", 1, 16)},
		{`1 3/4 x 9 1/2 LVL@12`, lvl("1.75x9.5", 1, 12)},
		{`1 3/4 x 9 1/2 LVL 2.0E at 12 in. oc`, Callout{Size: "1.75x9.5", Plies: 1, SpacingIn: 12, Species: "LVL", Grade: "2.0E", Material: true}},
		{`3 1/2 x 11 7/8 PSL 2.2E @ 16 U.N.O.`, Callout{Size: "3.5x11.875", Plies: 1, SpacingIn: 16, Species: "PSL", Grade: "2.2E", Material: true}},
		{`3.5x11.875 psl 1.8E 12 OC`, Callout{Size: "3.5x11.875", Plies: 1, SpacingIn: 12, Species: "PSL", Grade: "1.8E", Material: true}},
		// sawn callouts read as ReadCallout reads them
		{`2x10 DF-L #2 @ 16"`, Callout{Size: "2x10", Plies: 1, SpacingIn: 16, Species: "Douglas Fir-Larch", Grade: "No.2"}},
		{`(2) 2x10`, Callout{Size: "2x10", Plies: 2}},
	}
	for _, c := range ok {
		got, err := ReadCalloutWith(c.in, read)
		if err != nil || got != c.want {
			t.Errorf("ReadCalloutWith(%q) = %+v, %v; want %+v", c.in, got, err, c.want)
			continue
		}
		// written back, it reads the same
		if back, err := ReadCalloutWith(got.String(), read); err != nil || back != got {
			t.Errorf("%q written back as %q reads %+v, %v", c.in, got.String(), back, err)
		}
		if !got.Material {
			continue
		}
		// without the project's materials it is refused, never read as sawn
		if _, err := ReadCallout(c.in); err == nil || !strings.Contains(err.Error(), "read only with the project's materials") {
			t.Errorf("ReadCallout(%q) = %v, want refused", c.in, err)
		}
	}
	bad := []struct{ in, why string }{
		{`1 3/4 x 11 7/8 @ 16`, `"1 3/4 x 11 7/8" is a size in actual inches with no material after it`},
		{`1.75x11.875`, "cannot say its material"},
		{`1.75x11.875 16 OC`, "the structural composite lumber known is LVL, PSL"},
		{`1 3/4 x 11 7/8 GLB @ 16`, `the word "GLB": material "GLB" names no user material; the structural composite lumber known is LVL, PSL`},
		{`1 3/4 x 11 7/8 MYLVL @ 16`, `material "MYLVL" names no user material`},
		{`5 1/8 x 12 GLB 24F-1.8E`, `glulam (named by its stress class, such as 5 1/8 x 12 GLB 24F-1.8E) is read on beam callouts, not on joists`},
		{`2-1.75x9.5 LVL @ 16`, `plies "2-": write the plies of a size in actual inches as (2)`},
		{`DBL 1 3/4 x 9 1/2 LVL`, `plies "DBL"`},
		{`(2) 1 3/4 x 9 1/2 LVL (2)`, "plies given twice"},
		{`(5) 1 3/4 x 9 1/2 LVL`, "built-up members of 2 to 4 plies"},
		{`1 3/4 x 9 1/2 LVL @ 16 DF-L #2`, "takes no sawn species or grade (Douglas Fir-Larch No.2)"},
		{"1 3/4 x 9 1/2 LVL @ 16\nHF", "takes no sawn species"},
		{`1 3/4 x 9 1/2 LVL @ 60`, "outside 4-48 in"},
		{`1 3/4 x 9 1/2 LVL @ 16 banana`, `"banana" not understood`},
		{"1 3/4 x 9 1/2 LVL @ 16\n1 3/4 x 11 7/8 LVL @ 16", "different sizes"},
		{`1 3/4 x 1/2 LVL`, "want actual inches"},
		{`7.0 x 14.0 PSL @ 16`, "whole inches both ways (7x14), which framecheck cannot tell from a nominal size"},
	}
	for _, c := range bad {
		got, err := ReadCalloutWith(c.in, read)
		if err == nil || !errors.Is(err, ErrBadCallout) || !strings.Contains(err.Error(), c.why) {
			t.Errorf("ReadCalloutWith(%q) = %+v, %v; want ErrBadCallout saying %q", c.in, got, err, c.why)
		}
	}
	if _, err := ReadCalloutWith(`1 3/4 x 11 7/8 LVL @ 16`, nil); err == nil || !strings.Contains(err.Error(), "read only with the project's materials") {
		t.Errorf("no materials: %v, want refused", err)
	}
}

// TestSCLCalloutOnJoists: a callout of structural composite lumber on a
// span line gives the joists it crosses the material, its size in actual
// inches and the callout's spacing; the layer's sawn grade is not kept
// (the material's only grade is the check's to take), the layer's grade
// is when the layer names the same material. A word naming no material
// makes the joists under it errors naming the text's handle and the
// materials known, with no size: the project's is not assumed.
func TestSCLCalloutOnJoists(t *testing.T) {
	mats := sclTestMaterials(t)
	opt := DefaultOptions()
	opt.MaterialCallout = mats.ReadSCLCallout
	pl := calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60). // crosses x = 0, 16, 32
		text("FRAMING-NOTE", `1 3/4 x 11 7/8 LVL @ 16" o.c.`, 2, 61, 3).
		group(opt)
	for _, m := range pl.Members {
		want := [3]string{"2x10", "Douglas Fir-Larch", "No.2"}
		if m.Start.X <= 32 {
			want = [3]string{"1.75x11.875", "LVL", ""}
		}
		if got := [3]string{m.Size, m.Species, m.Grade}; got != want || m.Error {
			t.Errorf("%s at x=%g: %v error %v %q, want %v", m.ID, m.Start.X, got, m.Error, m.Messages, want)
		}
	}

	opt.ByLayer = []LumberRule{{Layers: []string{"JOIST"}, Species: "lvl", Grade: "2.0E"}}
	pl = calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60).
		text("FRAMING-NOTE", `1 3/4 x 11 7/8 LVL @ 16" o.c.`, 2, 61, 3).
		group(opt)
	for _, m := range pl.Members {
		if m.Start.X <= 32 && (m.Species != "LVL" || m.Grade != "2.0E") {
			t.Errorf("%s: %s %s, want the layer's grade 2.0E of the same material", m.ID, m.Species, m.Grade)
		}
	}

	opt.ByLayer = nil
	p := calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60).
		text("FRAMING-NOTE", `1 3/4 x 11 7/8 GLB @ 16`, 2, 61, 3)
	handle := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	if handle == "" {
		t.Fatal("the test plan's text has no handle")
	}
	pl = p.group(opt)
	var bad int
	for _, m := range pl.Members {
		if m.Start.X > 32 {
			continue
		}
		bad++
		msg := strings.Join(m.Messages, " ")
		if !m.Error || m.Size != "" || !strings.Contains(msg, "handle "+handle) ||
			!strings.Contains(msg, `the word "GLB": material "GLB" names no user material; the structural composite lumber known is LVL, PSL`) {
			t.Errorf("%s: error %v size %q messages %q", m.ID, m.Error, m.Size, m.Messages)
		}
	}
	if c := issueCodes(pl.Issues); bad != 3 || c[CodeBadCallout] != 1 {
		t.Errorf("%d members in error, issues %v", bad, pl.Issues)
	}

	// without the project's materials the callout is an error too
	pl = calloutPlan().
		line("FRAMING-NOTE", -4, 60, 36, 60).
		text("FRAMING-NOTE", `1 3/4 x 11 7/8 LVL @ 16`, 2, 61, 3).
		group(DefaultOptions())
	for _, m := range pl.Members {
		if m.Start.X <= 32 && (!m.Error || m.Size != "") {
			t.Errorf("%s without materials: error %v size %q", m.ID, m.Error, m.Size)
		}
	}
}

// A bay outline called out in structural composite lumber lays out its
// joists at the callout's spacing (0, 16, 32, 40 across a 40 in bay, as
// for sawn callouts), each of the material and size in actual inches; a
// bay whose callout names no material is an error naming its handle, with
// no joists laid out.
func TestSCLBayOutline(t *testing.T) {
	opt := DefaultOptions()
	opt.MaterialCallout = sclTestMaterials(t).ReadSCLCallout
	p := newPlan().walls(-10, 50, 0, 144)
	p.poly("FRAMING-BAY", true, Point{X: 0, Y: 0}, Point{X: 40, Y: 0}, Point{X: 40, Y: 144}, Point{X: 0, Y: 144})
	p.text("FRAMING-BAY", `1 3/4 x 9 1/2 PSL 2.2E @ 16" o.c.`, 10, 70, 3)
	pl := p.group(opt)
	if len(pl.Members) != 4 || generated(pl) != 4 {
		t.Fatalf("%d members, %d generated, want 4 (issues %v)", len(pl.Members), generated(pl), pl.Issues)
	}
	for _, x := range []float64{0, 16, 32, 40} {
		if m := member(t, pl, x, 72); m.Size != "1.75x9.5" || m.Species != "PSL" || m.Grade != "2.2E" || m.CalloutSpacingIn != 16 || m.Error {
			t.Errorf("joist at %g: %s %s %s @ %g error %v", x, m.Size, m.Species, m.Grade, m.CalloutSpacingIn, m.Error)
		}
	}

	p = newPlan().walls(-10, 50, 0, 144)
	p.poly("FRAMING-BAY", true, Point{X: 0, Y: 0}, Point{X: 40, Y: 0}, Point{X: 40, Y: 144}, Point{X: 0, Y: 144})
	p.text("FRAMING-BAY", `1 3/4 x 9 1/2 @ 16" o.c.`, 10, 70, 3)
	handle := p.d.Entities[len(p.d.Entities)-1].Pos.Handle
	pl = p.group(opt)
	var said bool
	for _, is := range pl.Issues {
		said = said || is.Code == CodeBay && is.Severity == dxfimport.SevError && strings.Contains(is.Error(), "(handle "+handle+") cannot be read") &&
			strings.Contains(is.Error(), "no material after it")
	}
	if len(pl.Members) != 0 || !said {
		t.Errorf("%d members, issues %v; want none and a bay error naming handle %s", len(pl.Members), pl.Issues, handle)
	}
}
