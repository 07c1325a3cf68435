package export

import (
	"errors"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// dxfEnt is one entity or table record of a parsed test output.
type dxfEnt struct {
	Kind, Layer, Handle, Owner string
	Section, Table             string
	Values                     map[int][]string
}

// parsedDXF is what the tests read back from a DXF.
type parsedDXF struct {
	Lines      []string // raw lines, endings included
	Ents       []dxfEnt // entities (ENTITIES) and records (TABLES), in order
	LayerCount int      // group 70 of the LAYER table head; -1 when absent
	Seed       string   // $HANDSEED
}

func parseDXF(t *testing.T, path string) *parsedDXF {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	out := &parsedDXF{LayerCount: -1}
	out.Lines = strings.SplitAfter(string(data), "\n")
	if out.Lines[len(out.Lines)-1] == "" {
		out.Lines = out.Lines[:len(out.Lines)-1]
	}
	pr := newPairReader(strings.NewReader(string(data)), path)
	var ctx dxfContext
	var cur *dxfEnt
	var hvar string
	for {
		p, err := pr.next()
		if err != nil {
			t.Fatalf("%s: %v", path, err)
		}
		ctx.step(p)
		if p.Code == 0 && p.Value == "EOF" {
			break
		}
		if p.Code == 0 {
			cur = nil
			if (ctx.Section == "ENTITIES" || ctx.Section == "TABLES") && ctx.Record != "" {
				out.Ents = append(out.Ents, dxfEnt{Kind: p.Value, Section: ctx.Section, Table: ctx.Table, Values: map[int][]string{}})
				cur = &out.Ents[len(out.Ents)-1]
			}
			continue
		}
		if ctx.Section == "HEADER" {
			if p.Code == 9 {
				hvar = p.Value
			} else if hvar == "$HANDSEED" {
				out.Seed = p.Value
			}
		}
		if ctx.Table == "LAYER" && ctx.TableHead && p.Code == 70 {
			out.LayerCount, _ = strconv.Atoi(p.Value)
		}
		if cur != nil {
			cur.Values[p.Code] = append(cur.Values[p.Code], p.Value)
			switch p.Code {
			case 8:
				cur.Layer = p.Value
			case 5:
				cur.Handle = p.Value
			case 330:
				cur.Owner = p.Value
			case 2:
				if cur.Kind == "LAYER" {
					cur.Layer = p.Value
				}
			}
		}
	}
	return out
}

func (d *parsedDXF) count(kind, layer string) int {
	n := 0
	for _, e := range d.Ents {
		if e.Kind == kind && strings.EqualFold(e.Layer, layer) {
			n++
		}
	}
	return n
}

func fixtureMarkup(t *testing.T, toInch float64) Markup {
	m := MarkupFromResults(loadFixture(t), 1)
	m.ToInch = toInch
	return m
}

// isSubsequence reports whether every line of in appears in out in order.
func isSubsequence(in, out []string) (bool, int) {
	j := 0
	for i, l := range in {
		for j < len(out) && out[j] != l {
			j++
		}
		if j == len(out) {
			return false, i
		}
		j++
	}
	return true, -1
}

func TestAnnotatePlans(t *testing.T) {
	tests := []struct {
		file      string
		toInch    float64
		handles   bool
		modelOwn  string // *Model_Space block record handle, read from the fixture
		failLineY string // y of the failing member M4 (56 in) in drawing units
		newLayers int
	}{
		{"plan_r12.dxf", 1, true, "", "56", 7},
		{"plan_r2000.dxf", 12, true, "17", "4.666667", 7}, // 56 in in feet, to 1e-6 ft (dxfDecimals)
		{"plan_min_r12.dxf", 1, false, "", "56", 7},
	}
	for _, tc := range tests {
		t.Run(tc.file, func(t *testing.T) {
			src := filepath.Join("testdata", tc.file)
			dst := filepath.Join(t.TempDir(), "out.dxf")
			m := fixtureMarkup(t, tc.toInch)
			if err := Annotate(src, dst, m); err != nil {
				t.Fatal(err)
			}
			in, out := parseDXF(t, src), parseDXF(t, dst)
			// Our entities: one highlight (M4 fails), one blocking row to add
			// (B1; B2 is drawn already), three labels (one per run and mark:
			// J1, J2, J3), four ids, four uplift labels (M2's 0.8 lb is
			// listed in results.json, not flagged), the key.
			for _, c := range []struct {
				kind, layer string
				n           int
			}{{"LINE", LayerFail, 1}, {"LINE", LayerBlocking, 1}, {"TEXT", LayerLabel, 3}, {"TEXT", LayerUplift, 4},
				{"TEXT", LayerID, 4}, {"TEXT", LayerKey, 9}} {
				if got := out.count(c.kind, c.layer); got != c.n {
					t.Errorf("%d %s on %s, want %d", got, c.kind, c.layer, c.n)
				}
				if out.count("LAYER", c.layer) != 1 {
					t.Errorf("layer %s: %d table records, want 1", c.layer, out.count("LAYER", c.layer))
				}
			}
			var fail dxfEnt
			for _, e := range out.Ents {
				if e.Layer == LayerFail && e.Kind == "LINE" {
					fail = e
				}
			}
			if got := fail.Values[20]; len(got) != 1 || got[0] != tc.failLineY {
				t.Errorf("highlight y = %v, want %s", got, tc.failLineY)
			}
			if in.LayerCount >= 0 && out.LayerCount != in.LayerCount+tc.newLayers {
				t.Errorf("LAYER count %d, want %d", out.LayerCount, in.LayerCount+tc.newLayers)
			}
			// Every original line is still there, in order, except the
			// two values that must change.
			want := replaceValues(in.Lines, map[string]string{
				"$HANDSEED": out.Seed, "LAYER-COUNT": strconv.Itoa(out.LayerCount),
			})
			if ok, at := isSubsequence(want, out.Lines); !ok {
				t.Errorf("original line %d %q missing from the output", at+1, want[at])
			}
			// Handles: unique, below $HANDSEED, owned by model space.
			if tc.handles {
				seed, err := strconv.ParseUint(out.Seed, 16, 64)
				if err != nil {
					t.Fatalf("$HANDSEED %q: %v", out.Seed, err)
				}
				seen := map[string]bool{}
				for _, e := range out.Ents {
					if e.Table == "DIMSTYLE" || e.Handle == "" {
						continue
					}
					if seen[e.Handle] {
						t.Errorf("duplicate handle %s", e.Handle)
					}
					seen[e.Handle] = true
					if h, _ := strconv.ParseUint(e.Handle, 16, 64); h >= seed {
						t.Errorf("handle %s not below $HANDSEED %s", e.Handle, out.Seed)
					}
				}
				for _, e := range out.Ents {
					if strings.HasPrefix(e.Layer, "FC-") && e.Section == "ENTITIES" {
						if e.Handle == "" {
							t.Errorf("%s on %s has no handle", e.Kind, e.Layer)
						}
						if e.Owner != tc.modelOwn {
							t.Errorf("%s on %s owner %q, want %q", e.Kind, e.Layer, e.Owner, tc.modelOwn)
						}
					}
				}
			}
		})
	}
}

// replaceValues returns lines with the value of $HANDSEED and of the
// LAYER table's count (keys "$HANDSEED", "LAYER-COUNT") replaced.
func replaceValues(lines []string, vals map[string]string) []string {
	out := append([]string(nil), lines...)
	trim := func(i int) string { return strings.TrimSpace(out[i]) }
	eol := func(i int) string { return out[i][len(strings.TrimRight(out[i], "\r\n")):] }
	for i := 0; i+3 < len(out); i += 2 {
		if trim(i) == "9" && trim(i+1) == "$HANDSEED" {
			out[i+3] = vals["$HANDSEED"] + eol(i+3)
		}
		if trim(i) == "0" && trim(i+1) == "TABLE" && trim(i+3) == "LAYER" {
			for k := i + 4; k+1 < len(out) && trim(k) != "0"; k += 2 {
				if trim(k) == "70" {
					out[k+1] = vals["LAYER-COUNT"] + eol(k+1)
					break
				}
			}
		}
	}
	return out
}

func TestAnnotateKeepsCRLFAndExistingLayer(t *testing.T) {
	dir := t.TempDir()
	src := filepath.Join(dir, "crlf.dxf")
	body := "  0\nSECTION\n  2\nTABLES\n  0\nTABLE\n  2\nLAYER\n 70\n2\n" +
		"  0\nLAYER\n  2\n0\n 70\n0\n 62\n7\n  6\nCONTINUOUS\n" +
		"  0\nLAYER\n  2\nfc-label\n 70\n0\n 62\n3\n  6\nCONTINUOUS\n  0\nENDTAB\n  0\nENDSEC\n" +
		"  0\nSECTION\n  2\nENTITIES\n  0\nLINE\n  8\nJOIST\n 10\n0\n 20\n56\n 11\n144\n 21\n56\n  0\nENDSEC\n  0\nEOF\n"
	if err := os.WriteFile(src, []byte(strings.ReplaceAll(body, "\n", "\r\n")), 0o644); err != nil {
		t.Fatal(err)
	}
	dst := filepath.Join(dir, "out.dxf")
	if err := Annotate(src, dst, fixtureMarkup(t, 1)); err != nil {
		t.Fatal(err)
	}
	out := parseDXF(t, dst)
	for i, l := range out.Lines {
		if !strings.HasSuffix(l, "\r\n") {
			t.Fatalf("line %d %q does not end in CRLF", i+1, l)
		}
	}
	// The layer named fc-label exists already (names are case-insensitive):
	// six layers are added, the count goes from 2 to 8.
	if out.LayerCount != 8 || out.count("LAYER", LayerLabel) != 1 {
		t.Errorf("LAYER count %d, %d FC-LABEL records; want 8 and 1", out.LayerCount, out.count("LAYER", LayerLabel))
	}
}

func TestAnnotateRefuses(t *testing.T) {
	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	orig, err := os.ReadFile(filepath.Join("testdata", "plan_min_r12.dxf"))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(plan, orig, 0o644); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "link.dxf")
	if err := os.Symlink(plan, link); err != nil {
		t.Fatal(err)
	}
	m := fixtureMarkup(t, 1)
	for _, out := range []string{plan, filepath.Join(dir, ".", "plan.dxf"), link} {
		if err := Annotate(plan, out, m); !errors.Is(err, ErrSameFile) {
			t.Errorf("Annotate(plan, %s) = %v, want ErrSameFile", out, err)
		}
	}
	if b, _ := os.ReadFile(plan); string(b) != string(orig) {
		t.Error("input drawing changed")
	}

	write := func(name, body string) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, []byte(body), 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	bad := []struct {
		name, body string
		line       int
		want       error
	}{
		{"truncated.dxf", "  0\nSECTION\n  2\nENTITIES\n  0\nLINE\n  8\nJ\n", 0, ErrNoEOF},
		{"binary.dxf", "AutoCAD Binary DXF\r\n\x1a\x00", 1, ErrBinaryDXF},
		{"badcode.dxf", "  0\nSECTION\n  2\nENTITIES\nxx\nLINE\n  0\nEOF\n", 5, nil},
	}
	for _, b := range bad {
		src := write(b.name, b.body)
		dst := filepath.Join(dir, "out-"+b.name)
		err := Annotate(src, dst, m)
		var de *DXFError
		if !errors.As(err, &de) {
			t.Errorf("%s: err = %v, want a *DXFError", b.name, err)
			continue
		}
		if b.want != nil && !errors.Is(err, b.want) {
			t.Errorf("%s: err = %v, want %v", b.name, err, b.want)
		}
		if b.line > 0 && de.Line != b.line {
			t.Errorf("%s: line %d, want %d (%v)", b.name, de.Line, b.line, err)
		}
		if _, serr := os.Stat(dst); !os.IsNotExist(serr) {
			t.Errorf("%s: an output was written", b.name)
		}
	}
	m.ToInch = 0
	if err := Annotate(plan, filepath.Join(dir, "out.dxf"), m); err == nil {
		t.Error("inch factor 0 accepted")
	}
	noTempFiles(t, dir)
}

func TestCleanText(t *testing.T) {
	// A Unicode character in DXF text is written \U+XXXX (from memory: verify
	// against the AutoCAD DXF reference, TEXT group 1).
	for _, tc := range []struct{ in, want string }{
		{"J1 0.52", "J1 0.52"},
		{"J1\n0.52", "J1 0.52"},
		{"Ø 1.00", `\U+00D8 1.00`},
	} {
		if got := cleanText(tc.in); got != tc.want {
			t.Errorf("cleanText(%q) = %q, want %q", tc.in, got, tc.want)
		}
	}
}

func TestAnnotateTablesWithoutLayerTable(t *testing.T) {
	dir := t.TempDir()
	src := filepath.Join(dir, "nolayer.dxf")
	body := "  0\nSECTION\n  2\nTABLES\n  0\nTABLE\n  2\nLTYPE\n 70\n1\n  0\nLTYPE\n  2\nCONTINUOUS\n 70\n0\n  3\nSolid\n 72\n65\n 73\n0\n 40\n0.0\n  0\nENDTAB\n  0\nENDSEC\n" +
		"  0\nSECTION\n  2\nENTITIES\n  0\nLINE\n  8\nJOIST\n 10\n0\n 20\n56\n 11\n144\n 21\n56\n  0\nENDSEC\n  0\nEOF\n"
	if err := os.WriteFile(src, []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
	dst := filepath.Join(dir, "out.dxf")
	if err := Annotate(src, dst, fixtureMarkup(t, 1)); err != nil {
		t.Fatal(err)
	}
	out := parseDXF(t, dst)
	if out.LayerCount != 7 || out.count("LAYER", LayerFail) != 1 || out.count("TEXT", LayerLabel) != 3 {
		t.Errorf("LAYER count %d, FC-FAIL records %d, labels %d; want 7, 1, 3",
			out.LayerCount, out.count("LAYER", LayerFail), out.count("TEXT", LayerLabel))
	}
	if ok, at := isSubsequence(strings.SplitAfter(body, "\n")[:len(strings.SplitAfter(body, "\n"))-1], out.Lines); !ok {
		t.Errorf("input line %d missing", at+1)
	}
}

func TestAnnotateUnclosedEntities(t *testing.T) {
	dir := t.TempDir()
	src := filepath.Join(dir, "open.dxf")
	body := "  0\nSECTION\n  2\nENTITIES\n  0\nLINE\n  8\nJ\n 10\n0\n 20\n0\n 11\n1\n 21\n0\n  0\nEOF\n"
	if err := os.WriteFile(src, []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
	err := Annotate(src, filepath.Join(dir, "out.dxf"), fixtureMarkup(t, 1))
	var de *DXFError
	if !errors.As(err, &de) || de.Line != 17 {
		t.Errorf("err = %v, want a *DXFError at line 17 (the EOF)", err)
	}
}
