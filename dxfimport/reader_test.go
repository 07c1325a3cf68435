package dxfimport

import (
	"fmt"
	"io"
	"math"
	"strings"
	"testing"
)

// dxf builds DXF text from alternating codes and values.
func dxf(pairs ...any) string {
	var sb strings.Builder
	for i := 0; i+1 < len(pairs); i += 2 {
		fmt.Fprintf(&sb, "%3d\n%v\n", pairs[i], pairs[i+1])
	}
	return sb.String()
}

func header(pairs ...any) string {
	return dxf(0, "SECTION", 2, "HEADER") + dxf(pairs...) + dxf(0, "ENDSEC")
}

func section(name string, body ...string) string {
	return dxf(0, "SECTION", 2, name) + strings.Join(body, "") + dxf(0, "ENDSEC")
}

func read(t *testing.T, s string, opt Options) *Drawing {
	t.Helper()
	d, err := Read(strings.NewReader(s), "t.dxf", opt)
	if err != nil {
		t.Fatal(err)
	}
	return d
}

func issueCodes(d *Drawing) string {
	var c []string
	for _, i := range d.Issues {
		c = append(c, i.Code)
	}
	return strings.Join(c, ",")
}

func findIssue(d *Drawing, code string) *Issue {
	for i := range d.Issues {
		if d.Issues[i].Code == code {
			return &d.Issues[i]
		}
	}
	return nil
}

func TestTagReaderLinesCRLFAndPadding(t *testing.T) {
	in := "  0\r\nSECTION\r\n999\r\ncomment\r\n  2\r\n  HEADER\r\n0\nENDSEC\n  0\nEOF\n\n\n"
	tr := NewTagReader(strings.NewReader(in), "x.dxf")
	var got []Tag
	for {
		tg, err := tr.Next()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		got = append(got, tg)
	}
	// The tag layer keeps 999 comments and string values as written
	// (leading spaces of a value are significant in DXF).
	want := []Tag{{0, "SECTION", 1}, {999, "comment", 3}, {2, "  HEADER", 5}, {0, "ENDSEC", 7}, {0, "EOF", 9}}
	if fmt.Sprint(got) != fmt.Sprint(want) {
		t.Errorf("got %v\nwant %v", got, want)
	}
}

func TestByteOrderMark(t *testing.T) {
	d := read(t, "\xef\xbb\xbf"+section("ENTITIES", dxf(0, "POINT", 8, "P", 10, 1, 20, 2))+dxf(0, "EOF"), Options{Units: "in"})
	if len(d.Entities) != 1 || d.Entities[0].Pos.Line != 5 {
		t.Errorf("got %+v", d.Entities)
	}
}

func TestUnits(t *testing.T) {
	line := section("ENTITIES", dxf(0, "LINE", 8, "J", 10, 0, 20, 0, 11, 1, 21, 2))
	cases := []struct {
		name      string
		head      string
		opt       Options
		units     string
		toInch    float64 // exact by definition of the inch (25.4 mm)
		issueCode string
	}{
		{"mm header", header(9, "$INSUNITS", 70, 4), Options{}, "mm", 1 / 25.4, ""},
		{"ft header", header(9, "$INSUNITS", 70, 2), Options{}, "ft", 12, ""},
		{"m header", header(9, "$INSUNITS", 70, 6), Options{}, "m", 1000 / 25.4, ""},
		{"cm header", header(9, "$INSUNITS", 70, 5), Options{}, "cm", 10 / 25.4, ""},
		{"in header", header(9, "$INSUNITS", 70, 1), Options{}, "in", 1, ""},
		{"no header", "", Options{}, "", 1, "DXF101"},
		{"unitless", header(9, "$INSUNITS", 70, 0), Options{}, "", 1, "DXF101"},
		{"yards unsupported", header(9, "$INSUNITS", 70, 10), Options{}, "", 1, "DXF101"},
		{"override", header(9, "$INSUNITS", 70, 4), Options{Units: "ft"}, "ft", 12, "DXF109"},
		{"override no header", "", Options{Units: "FT"}, "ft", 12, ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			d := read(t, c.head+line+dxf(0, "EOF"), c.opt)
			if d.Units != c.units || math.Abs(d.ToInch-c.toInch) > 1e-15 {
				t.Errorf("units %q factor %g, want %q %g", d.Units, d.ToInch, c.units, c.toInch)
			}
			if got := issueCodes(d); got != c.issueCode {
				t.Errorf("issues %q, want %q", got, c.issueCode)
			}
			p := d.Entities[0].Points[1]
			if math.Abs(p.X-c.toInch) > 1e-12 || math.Abs(p.Y-2*c.toInch) > 1e-12 {
				t.Errorf("end point %v, want (%g, %g)", p, c.toInch, 2*c.toInch)
			}
		})
	}
	d := read(t, line+dxf(0, "EOF"), Options{})
	if i := findIssue(d, "DXF101"); i == nil || !strings.Contains(i.Msg, "--units") || i.Severity != SevWarning {
		t.Errorf("DXF101 must be a warning naming --units: %+v", i)
	}
}

func TestSkippedAndLenient(t *testing.T) {
	in := section("CLASSES", dxf(0, "CLASS", 1, "X")) +
		section("ENTITIES",
			dxf(0, "HATCH", 8, "A", 10, "not read"),
			dxf(0, "HATCH", 8, "A"),
			dxf(0, "DIMENSION", 8, "A"),
			dxf(0, "LINE", 8, "J", 67, 1, 10, 0, 20, 0, 11, 1, 21, 1),
			dxf(0, "LINE", 8, "J", 10, 0, 20, 0, 11, 1, 21, 1)) +
		section("OBJECTS", dxf(0, "DICTIONARY", 5, "C"))
	// Blank lines after 0/EOF are harmless.
	d := read(t, in+dxf(0, "EOF")+"\n\n", Options{Units: "in"})
	if len(d.Entities) != 1 {
		t.Fatalf("got %d entities, want the one model-space LINE", len(d.Entities))
	}
	want := map[string]int{"HATCH": 2, "DIMENSION": 1, "paper space": 1, "SECTION:CLASSES": 1, "SECTION:OBJECTS": 1}
	if fmt.Sprint(d.Skipped) != fmt.Sprint(want) {
		t.Errorf("skipped %v, want %v", d.Skipped, want)
	}
	if got := issueCodes(d); got != "DXF102" {
		t.Errorf("issues %s, want DXF102", got)
	}
	// CLASSES and OBJECTS are in every R13+ file: counted, not reported
	if i := findIssue(d, "DXF102"); i == nil || strings.Contains(i.Msg, "SECTION:") || !strings.Contains(i.Msg, "HATCH 2") {
		t.Errorf("DXF102 %+v: want the HATCHes and no routine section", i)
	}
	if d.Issues.Err() != nil {
		t.Errorf("Err() = %v, want nil", d.Issues.Err())
	}
}

// A plan holding nothing unusual but the sections every R13+ file has
// gets no DXF102 finding at all.
func TestRoutineSectionsNotReported(t *testing.T) {
	in := section("CLASSES", dxf(0, "CLASS", 1, "X")) +
		section("ENTITIES", dxf(0, "LINE", 8, "J", 10, 0, 20, 0, 11, 1, 21, 1)) +
		section("OBJECTS", dxf(0, "DICTIONARY", 5, "C"))
	d := read(t, in+dxf(0, "EOF"), Options{Units: "in"})
	if got := issueCodes(d); got != "" {
		t.Errorf("issues %s, want none", got)
	}
	if d.Skipped["SECTION:OBJECTS"] != 1 {
		t.Errorf("skipped %v: OBJECTS is still counted", d.Skipped)
	}
}

// blockDef defines a block with its entities.
func blockDef(name string, baseX, baseY float64, ents ...string) string {
	return dxf(0, "BLOCK", 8, "0", 2, name, 70, 0, 10, baseX, 20, baseY) + strings.Join(ents, "") + dxf(0, "ENDBLK", 8, "0")
}

func TestInsertProblems(t *testing.T) {
	blocks := section("BLOCKS",
		blockDef("SELF", 0, 0, dxf(0, "LINE", 8, "0", 10, 0, 20, 0, 11, 1, 21, 0), dxf(0, "INSERT", 8, "0", 2, "self", 10, 5, 20, 0)),
		blockDef("A1", 0, 0, dxf(0, "INSERT", 8, "0", 2, "A2")),
		blockDef("A2", 0, 0, dxf(0, "INSERT", 8, "0", 2, "A3")),
		blockDef("A3", 0, 0, dxf(0, "LINE", 8, "0", 10, 0, 20, 0, 11, 1, 21, 0)),
		blockDef("BIG", 0, 0, dxf(0, "LINE", 8, "0", 10, 0, 20, 0, 11, 1, 21, 0)),
	)
	t.Run("self insert", func(t *testing.T) {
		d := read(t, blocks+section("ENTITIES", dxf(0, "INSERT", 5, "1A", 8, "L", 2, "SELF", 10, 0, 20, 0))+dxf(0, "EOF"), Options{Units: "in"})
		if len(d.Entities) != 1 || findIssue(d, "DXF104") == nil {
			t.Errorf("got %d entities, issues %v; want 1 and DXF104", len(d.Entities), d.Issues)
		}
	})
	t.Run("depth", func(t *testing.T) {
		in := blocks + section("ENTITIES", dxf(0, "INSERT", 8, "L", 2, "A1")) + dxf(0, "EOF")
		if d := read(t, in, Options{Units: "in", MaxInsertDepth: 3}); len(d.Entities) != 1 || d.Entities[0].Pos.Layer != "L" {
			t.Errorf("depth 3: got %+v", d.Entities)
		}
		d := read(t, in, Options{Units: "in", MaxInsertDepth: 2})
		if len(d.Entities) != 0 || findIssue(d, "DXF104") == nil {
			t.Errorf("depth 2: got %d entities, issues %v", len(d.Entities), d.Issues)
		}
	})
	t.Run("undefined block", func(t *testing.T) {
		d := read(t, section("ENTITIES", dxf(0, "INSERT", 8, "L", 2, "NOPE"))+dxf(0, "EOF"), Options{Units: "in"})
		if findIssue(d, "DXF103") == nil {
			t.Errorf("issues %v, want DXF103", d.Issues)
		}
	})
	t.Run("huge MINSERT is refused, not expanded", func(t *testing.T) {
		in := blocks + section("ENTITIES",
			dxf(0, "INSERT", 5, "2B", 8, "L", 2, "BIG", 70, 30000, 71, 30000, 44, 1, 45, 1),
			dxf(0, "LINE", 8, "J", 10, 0, 20, 0, 11, 1, 21, 1)) + dxf(0, "EOF")
		d := read(t, in, Options{Units: "in", MaxEntities: 1000})
		i := findIssue(d, "DXF105")
		if len(d.Entities) != 1 || i == nil || i.Severity != SevError || i.Pos.Handle != "2B" || d.Issues.Err() == nil {
			t.Errorf("got %d entities, issue %+v", len(d.Entities), i)
		}
		// 30000 x 30000 copies pass the count's ceiling: the message says
		// "more than", not a made-up number.
		if want := fmt.Sprintf("this one adds more than %d)", HardMaxEntities); !strings.Contains(i.Msg, want) {
			t.Errorf("message %q, want %q", i.Msg, want)
		}
		// Below the ceiling the count is exact: 40 x 40 copies of one line.
		small := blocks + section("ENTITIES", dxf(0, "INSERT", 5, "2D", 8, "L", 2, "BIG", 70, 40, 71, 40, 44, 1, 45, 1)) + dxf(0, "EOF")
		if i := findIssue(read(t, small, Options{Units: "in", MaxEntities: 1000}), "DXF105"); i == nil || !strings.Contains(i.Msg, "this one adds 1600)") {
			t.Errorf("issue %+v, want DXF105 saying it adds 1600", i)
		}
		// Without a caller limit the hard limit still applies.
		d = read(t, in, Options{Units: "in"})
		if findIssue(d, "DXF105") == nil {
			t.Errorf("no DXF105 without MaxEntities")
		}
	})
	t.Run("huge grids of empty and cyclic blocks end quickly", func(t *testing.T) {
		// Found by FuzzRead: a MINSERT of a block whose only entity is
		// skipped used to loop rows x columns times.
		in := section("BLOCKS",
			blockDef("EMPTY", 0, 0, dxf(0, "ATTDEF", 8, "0")),
			blockDef("P", 0, 0, dxf(0, "INSERT", 2, "Q", 70, 1000, 71, 1000, 44, 1, 45, 1)),
			blockDef("Q", 0, 0, dxf(0, "INSERT", 2, "P", 70, 1000, 71, 1000, 44, 1, 45, 1), dxf(0, "INSERT", 2, "NONE", 70, 1000, 71, 1000, 44, 1, 45, 1))) +
			section("ENTITIES",
				dxf(0, "INSERT", 8, "L", 2, "EMPTY", 70, 30000, 71, 30000, 44, 1, 45, 1),
				dxf(0, "INSERT", 8, "L", 2, "Q"),
				dxf(0, "INSERT", 8, "L", 2, "P", 70, 1000, 71, 1000, 44, 1, 45, 1)) + dxf(0, "EOF")
		d := read(t, in, Options{Units: "in", MaxEntities: 100})
		if len(d.Entities) != 0 || d.Issues.Err() == nil {
			t.Errorf("got %d entities, issues %v", len(d.Entities), d.Issues)
		}
	})
	t.Run("blocks after entities", func(t *testing.T) {
		// Entities before blocks is out of the usual order but valid.
		in := section("ENTITIES", dxf(0, "INSERT", 8, "L", 2, "A3", 10, 10, 20, 0)) + blocks + dxf(0, "EOF")
		d := read(t, in, Options{Units: "in"})
		if len(d.Entities) != 1 || d.Entities[0].Points[1] != (Point{11, 0}) {
			t.Errorf("got %+v", d.Entities)
		}
	})
}

func TestText(t *testing.T) {
	cases := []struct {
		f        func(string) string
		in, want string
	}{
		// MTEXT inline codes as the DXF Reference ("MTEXT inline codes")
		// lists them; expected plain text as ezdxf's plain_mtext gives.
		{plainMText, `\A1;{\fArial|b1|i0;Joist} \H2.5x;span\P2nd line\~x`, "Joist span\n2nd line x"},
		{plainMText, `a\\b\{c\}`, `a\b{c}`},
		{plainMText, `\S1^ 2; \S3/4; \S5#8;`, "1^2 3/4 5#8"},
		{plainMText, `\LUnder\l \Oover\o\P`, "Under over"},
		{plainMText, `x\P\Py`, "x\n\ny"},
		{plainMText, `tab^Iend`, "tab    end"},
		{plainMText, `\C1;red\c255;`, "red"},
		{plainText, "45%%d %%p1/8 %%c6 %%uund%%u 100%%%", "45° ±1/8 Ø6 und 100%"},
		{decodeEscapes, `\U+00D8 \U+2265 \U+zz`, `Ø ≥ \U+zz`},
		{decodeEscapes, `end\U+00E`, `end\U+00E`},
	}
	for _, c := range cases {
		if got := c.f(c.in); got != c.want {
			t.Errorf("%q -> %q, want %q", c.in, got, c.want)
		}
	}
}

func TestCodePage(t *testing.T) {
	// "Café €" in code page 1252: é = 0xE9, € = 0x80 (Unicode CP1252.TXT).
	raw := "Caf\xe9 \x80"
	ent := section("ENTITIES", dxf(0, "TEXT", 8, "T", 10, 0, 20, 0, 40, 1, 1, raw))
	d := read(t, header(9, "$ACADVER", 1, "AC1015", 9, "$DWGCODEPAGE", 3, "ANSI_1252")+ent+dxf(0, "EOF"), Options{Units: "in"})
	if d.Entities[0].Text != "Café €" || findIssue(d, "DXF106") != nil {
		t.Errorf("ANSI_1252: %q, issues %v", d.Entities[0].Text, d.Issues)
	}
	// An AC1021+ file is UTF-8: bytes that are not valid UTF-8 are read
	// as 1252 with a warning.
	d = read(t, header(9, "$ACADVER", 1, "AC1032", 9, "$DWGCODEPAGE", 3, "ANSI_1252")+ent+dxf(0, "EOF"), Options{Units: "in"})
	if d.Entities[0].Text != "Café €" || findIssue(d, "DXF106") == nil {
		t.Errorf("invalid UTF-8: %q, issues %v", d.Entities[0].Text, d.Issues)
	}
	d = read(t, header(9, "$ACADVER", 1, "AC1032")+section("ENTITIES", dxf(0, "TEXT", 8, "T", 1, "Café"))+dxf(0, "EOF"), Options{Units: "in"})
	if d.Entities[0].Text != "Café" || findIssue(d, "DXF106") != nil {
		t.Errorf("UTF-8: %q, issues %v", d.Entities[0].Text, d.Issues)
	}
	for i := 0; i < 32; i++ {
		if r := cp1252High[i]; r == 0 {
			t.Errorf("cp1252 0x%X unmapped", 0x80+i)
		}
	}
}

func TestFixtureR12Units(t *testing.T) {
	d, err := ReadFile("testdata/r12_nounits.dxf", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if d.Units != "" || findIssue(d, "DXF101") == nil {
		t.Errorf("R12 without $INSUNITS: units %q, issues %v", d.Units, d.Issues)
	}
	d, err = ReadFile("testdata/r2000_mm.dxf", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if d.Units != "mm" || d.Issues.Err() != nil || findIssue(d, "DXF101") != nil {
		t.Errorf("R2000 mm: units %q, issues %v", d.Units, d.Issues)
	}
}

// TestLineMissingPoint: a LINE without one of its four coordinates is left
// out with an error finding naming its line, handle and the missing codes;
// the whole lines beside it are read. (DXF gives missing coordinates a
// default of 0; common practice, no source, for refusing that here.)
func TestLineMissingPoint(t *testing.T) {
	in := section("ENTITIES",
		dxf(0, "LINE", 5, "A1", 8, "J", 10, 0, 20, 0, 11, 96, 21, 0),
		dxf(0, "LINE", 5, "A2", 8, "J", 10, 0, 20, 16),
		dxf(0, "LINE", 5, "A3", 8, "J", 20, 32, 11, 96, 21, 32),
		dxf(0, "LINE", 5, "A4", 8, "J", 10, 0, 20, 48, 11, 96, 21, 48)) + dxf(0, "EOF")
	d := read(t, in, Options{Units: "in"})
	if len(d.Entities) != 2 || d.Entities[0].Pos.Handle != "A1" || d.Entities[1].Pos.Handle != "A4" {
		t.Fatalf("entities %+v, want A1 and A4 only", d.Entities)
	}
	want := map[string]string{"A2": "end point (group code 11, 21 missing)", "A3": "start point (group code 10 missing)"}
	n := 0
	for _, is := range d.Issues {
		if is.Code != "DXF113" {
			continue
		}
		n++
		if is.Severity != SevError || !strings.Contains(is.Msg, want[is.Pos.Handle]) || is.Pos.Line == 0 {
			t.Errorf("DXF113 %+v: want an error at its line saying %q", is, want[is.Pos.Handle])
		}
	}
	if n != 2 {
		t.Errorf("%d DXF113 findings, want 2 (%s)", n, issueCodes(d))
	}
}
