package export

import (
	"math"
	"path/filepath"
	"strconv"
	"testing"
)

func TestErrorReason(t *testing.T) {
	// The demo's error message and the short forms the markup prints
	// (common practice, no source: a plan note in capitals).
	for _, tc := range []struct{ msg, want string }{
		{"M14 end (256.00, 138.00) reaches no support; nearest support is 6.0 in away (plan.dxf:1965 (handle 5B, layer BEAM-FLUSH))", `NO BEARING, 6" SHORT`},
		{"M3 end (1, 2) reaches no support; nearest support is 2.3 in away", `NO BEARING, 3" SHORT`},
		{"M3 end (1, 2) reaches no support", "NO BEARING"},
		{"M9 lies outside every zone and no default zone is set", "NO LOAD ZONE"},
		{"M2 has conflicting callouts: 2x10 and 2x12", "CONFLICTING CALLOUTS"},
		{"M5 spans 1'-2\" (12 in); check the drawing units", `SPANS 1'-2"`},
		{"", "NOT CHECKED"},
	} {
		if got := ErrorReason(tc.msg); got != tc.want {
			t.Errorf("ErrorReason(%q) = %q, want %q", tc.msg, got, tc.want)
		}
	}
}

func TestBlockingNote(t *testing.T) {
	// Even spacing: span x k/(n+1) (third points of a 12 ft span are at 4
	// and 8 ft; statics of the layout, written out).
	for _, tc := range []struct {
		at    [][]float64
		spans []float64
		want  string
	}{
		{[][]float64{{72}}, []float64{144}, "ADD BLOCKING 1 ROW @ MIDSPAN"},
		{[][]float64{{48, 96}}, []float64{144}, "ADD BLOCKING 2 ROWS @ 1/3 PTS"},
		{[][]float64{{36, 72, 108}}, []float64{144}, "ADD BLOCKING 3 ROWS @ 1/4 PTS"},
		{[][]float64{{48, 96}, {40, 80}}, []float64{144, 120}, "ADD BLOCKING 2 ROWS @ 1/3 PTS EACH SPAN"},
		{[][]float64{{50, 96}}, []float64{144}, `ADD BLOCKING 2 ROWS AT 4'-2", 8'-0"`},
		{[][]float64{{72}, nil}, []float64{144, 144}, `ADD BLOCKING 1 ROW AT SPAN 1 6'-0"`},
	} {
		if got := BlockingNote(tc.at, tc.spans); got != tc.want {
			t.Errorf("BlockingNote(%v, %v) = %q, want %q", tc.at, tc.spans, got, tc.want)
		}
	}
	// positions listed from the datum (the markup's): said so, each span
	// named after its positions, so that 16'-0 1/4" is not read as a
	// distance into span 2 (common practice, no source)
	for _, tc := range []struct {
		at, face [][]float64
		spans    []float64
		want     string
	}{
		{[][]float64{{50, 96}}, [][]float64{{48.25, 94.25}}, []float64{144}, `ADD BLOCKING 2 ROWS AT 4'-0 1/4", 7'-10 1/4" FROM 1ST BEARING FACE`},
		{[][]float64{{50}, {46}}, [][]float64{{48.25}, {192.25}}, []float64{144, 120},
			`ADD BLOCKING 2 ROWS AT 4'-0 1/4" (SPAN 1); 16'-0 1/4" (SPAN 2) FROM 1ST BEARING FACE`},
	} {
		if got := blockingNote(tc.at, tc.spans, tc.face); got != tc.want {
			t.Errorf("blockingNote(%v, %v, %v) = %q, want %q", tc.at, tc.spans, tc.face, got, tc.want)
		}
	}
}

func TestChooseColoursAvoidDrawing(t *testing.T) {
	// The demo's layer table uses 1-9 and 30: none of ours may take them,
	// nor yellow (ACI 2) ever, and no two of ours share a colour.
	used := usedSet([]int{7, 3, 4, 7, 8, 1, 6, 30, 5, 5, 2, 9, 9, 8, 7, 7, 7})
	got := chooseColours(used)
	seen := map[int]string{}
	for _, l := range markupLayers {
		c := got[l.Name]
		if used[c] || c == 2 {
			t.Errorf("%s colour %d is used by the drawing (or yellow)", l.Name, c)
		}
		if o, dup := seen[c]; dup {
			t.Errorf("%s and %s share colour %d", l.Name, o, c)
		}
		seen[c] = l.Name
	}
	// A drawing that uses nothing: each layer its first choice.
	if c := chooseColours(nil); c[LayerFail] != 1 || c[LayerError] != 6 || c[LayerBlocking] != 5 {
		t.Errorf("colours on an empty drawing %v", c)
	}
}

// TestAnnotateColoursAndKey annotates the R12 fixture, whose layers use
// colours read back here from its LAYER table, and checks that our layers
// take other colours and that the key stands right of every entity.
func TestAnnotateColoursAndKey(t *testing.T) {
	src := filepath.Join("testdata", "plan_r12.dxf")
	dst := filepath.Join(t.TempDir(), "out.dxf")
	if err := Annotate(src, dst, fixtureMarkup(t, 1)); err != nil {
		t.Fatal(err)
	}
	in, out := parseDXF(t, src), parseDXF(t, dst)
	theirs := map[string]bool{}
	maxX := math.Inf(-1)
	for _, e := range in.Ents {
		if e.Kind == "LAYER" && !isOurLayer(e.Layer) {
			for _, c := range e.Values[62] {
				theirs[c] = true
			}
		}
		for _, code := range []int{10, 11} {
			for _, v := range e.Values[code] {
				if x, err := strconv.ParseFloat(v, 64); err == nil && e.Kind != "LAYER" {
					maxX = math.Max(maxX, x)
				}
			}
		}
	}
	if len(theirs) == 0 {
		t.Fatal("fixture has no layer colours to avoid")
	}
	for _, e := range out.Ents {
		if e.Kind == "LAYER" && isOurLayer(e.Layer) && theirs[e.Values[62][0]] {
			t.Errorf("our layer %s has colour %s, which the drawing uses", e.Layer, e.Values[62][0])
		}
		if e.Kind == "TEXT" && e.Layer == LayerKey {
			if x, _ := strconv.ParseFloat(e.Values[10][0], 64); !(x > maxX) {
				t.Errorf("key text %v at x = %v, not right of the plan (max x %v)", e.Values[1], x, maxX)
			}
		}
	}
}

func TestMarkupStamp(t *testing.T) {
	r := &Results{ToolVersion: "v1.2.3", Project: ProjectInfo{Name: "Garage loft", Number: "2026-041", Revision: "B"}}
	if got, want := MarkupStamp(r), "GARAGE LOFT 2026-041 REV B, FRAMECHECK V1.2.3"; got != want {
		t.Errorf("stamp %q, want %q", got, want)
	}
	if got := MarkupStamp(&Results{}); got != "FRAMECHECK VERSION NOT STAMPED" {
		t.Errorf("stamp without version %q", got)
	}
}

// TestOverlayAvoidsPlanColours: the overlay, written apart from the plan,
// takes the plan's layer colours from Markup.UsedACI and avoids them too.
func TestOverlayAvoidsPlanColours(t *testing.T) {
	m := fixtureMarkup(t, 1)
	m.UsedACI = []int{1, 6, 5, -32} // a layer switched off still counts
	path := filepath.Join(t.TempDir(), "o.dxf")
	if err := WriteOverlay(path, m, "in"); err != nil {
		t.Fatal(err)
	}
	d := parseDXF(t, path)
	seen := 0
	for _, e := range d.Ents {
		if e.Kind != "LAYER" || !isOurLayer(e.Layer) {
			continue
		}
		seen++
		switch c := e.Values[62][0]; c {
		case "1", "6", "5", "32":
			t.Errorf("overlay layer %s has the plan's colour %s", e.Layer, c)
		}
	}
	// every layer of ours but FC-GENERATED, declared only for a plan with
	// generated members
	if seen != len(markupLayers)-1 {
		t.Errorf("%d of our layers in the overlay, want %d", seen, len(markupLayers)-1)
	}
}
