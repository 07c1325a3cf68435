package framing

import (
	"errors"
	"fmt"
	"math"
	"testing"

	"framecheck/check"
)

// FuzzParseCallout: ReadCallout never panics; it either wraps
// ErrBadCallout and returns nothing, or returns dimension lumber (2-4 x
// 2-16 nominal, depth no less than thickness) of 1 to 5 plies, a spacing
// of 0 or in [4, 48] in, and species and grade from the canonical lists;
// what it returns, written back by Callout.String, reads back the same;
// and ParseCallout agrees with it. ReadCalloutWith, with materials of
// structural composite lumber, reads every callout ReadCallout reads the
// same; what else it reads is a Material callout of one of them, in
// actual inches (check.ParseSize), of 1 to 4 plies, which reads back the
// same; its errors wrap ErrBadCallout.
func FuzzParseCallout(f *testing.F) {
	for _, s := range []string{`2x10 @ 16" o.c.`, "2X12@12", "2x8 at 19.2 in. oc", "2 x 6", "4x16 joists @ 24in",
		"3×14 rafters at .5 inches o c", "2x10 @ 16″ o.c.", "2x10\u00a0@\u00a016”", "2x1", "16x2", "2x10 @ 0", "2x10 @ 1e3",
		"", "@", "2x10 @ 16.0000000000000000001", `(2) 2x10 DF-L #2 @ 1'-4" O.C. TYP.`, "2-2x12 SPF No.1/No.2 @ 24 o/c CJ",
		"90x45 @ 450", "2x10 HF SEL STR 16 OC U.N.O.", "DBL 2x8\nSYP #1 & BTR\n@ 13 1/2\"", "2x10 @ 400 mm", "2x10 @ 2'",
		`1 3/4 x 11 7/8 LVL @ 16" o.c.`, "1-3/4x9-1/2 LVL @ 19.2 O.C.", "(2) 1.75x14 psl 2.2E 12 OC TYP.", "1 3/4 x 14 LVL (2)",
		"1 3/4 x 9 1/2 @ 16", "2-1.75x9.5 LVL", "1.75x9.5 GLB 24F-1.8E", "1 3/4 x 9 1/2 LVL\n@ 16\nDF-L"} {
		f.Add(s)
	}
	read := sclTestMaterials(f).ReadSCLCallout
	species := map[string]bool{"": true, "Douglas Fir-Larch": true, "Hem-Fir": true, "Spruce-Pine-Fir": true, "Southern Pine": true}
	grades := map[string]bool{"": true, "No.1": true, "No.2": true, "No.3": true, "No.1 & Btr": true, "No.1/No.2": true,
		"Select Structural": true, "Stud": true}
	f.Fuzz(func(t *testing.T, s string) {
		c, err := ReadCallout(s)
		cw, werr := ReadCalloutWith(s, read)
		switch {
		case err == nil && (werr != nil || cw != c):
			t.Fatalf("%q: ReadCallout %+v, ReadCalloutWith %+v %v", s, c, cw, werr)
		case werr != nil && (!errors.Is(werr, ErrBadCallout) || cw != (Callout{})):
			t.Fatalf("%q: ReadCalloutWith %+v %v", s, cw, werr)
		case werr == nil && err != nil:
			sec, perr := check.ParseSize(cw.Designation())
			if !cw.Material || (cw.Species != "LVL" && cw.Species != "PSL") || perr != nil || !sec.Actual ||
				cw.Plies < 1 || cw.Plies > 4 || math.IsNaN(cw.SpacingIn) ||
				cw.SpacingIn != 0 && (cw.SpacingIn < minCalloutSpacingIn || cw.SpacingIn > maxCalloutSpacingIn) {
				t.Fatalf("%q: ReadCalloutWith %+v (%v)", s, cw, perr)
			}
			if back, err := ReadCalloutWith(cw.String(), read); err != nil || back != cw {
				t.Fatalf("%q -> %+v -> %q -> %+v %v", s, cw, cw.String(), back, err)
			}
		}
		size, spacingIn, perr := ParseCallout(s)
		if (err == nil) != (perr == nil) {
			t.Fatalf("%q: ReadCallout %v, ParseCallout %v", s, err, perr)
		}
		if err != nil {
			if !errors.Is(err, ErrBadCallout) {
				t.Fatalf("%q: error %v does not wrap ErrBadCallout", s, err)
			}
			if c != (Callout{}) || size != "" || spacingIn != 0 {
				t.Fatalf("%q: error with results %+v %q %v", s, c, size, spacingIn)
			}
			return
		}
		if size != c.Designation() || spacingIn != c.SpacingIn {
			t.Fatalf("%q: ParseCallout %q %v, ReadCallout %+v", s, size, spacingIn, c)
		}
		var b, d int
		if n, _ := fmt.Sscanf(c.Size, "%dx%d", &b, &d); n != 2 || fmt.Sprintf("%dx%d", b, d) != c.Size {
			t.Fatalf("%q: size %q is not in the form BxD", s, c.Size)
		}
		if b < 2 || b > 4 || d < 2 || d > 16 || d < b || c.Plies < 1 || c.Plies > maxPlies {
			t.Fatalf("%q: %+v is not dimension lumber", s, c)
		}
		if math.IsNaN(c.SpacingIn) || c.SpacingIn != 0 && (c.SpacingIn < minCalloutSpacingIn || c.SpacingIn > maxCalloutSpacingIn) {
			t.Fatalf("%q: spacing %v in", s, c.SpacingIn)
		}
		if !species[c.Species] || !grades[c.Grade] {
			t.Fatalf("%q: species %q grade %q", s, c.Species, c.Grade)
		}
		back := c.String()
		c2, err := ReadCallout(back)
		if err != nil || c2 != c {
			t.Fatalf("%q -> %+v -> %q -> %+v %v", s, c, back, c2, err)
		}
	})
}
