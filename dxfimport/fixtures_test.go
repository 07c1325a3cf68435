package dxfimport

import (
	"bufio"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// The fixtures in testdata are written by testdata/gen_fixtures.py with
// ezdxf 0.18.1; each *.json beside a DXF is ezdxf's own reading of it
// (block references expanded by ezdxf's multi_insert/virtual_entities,
// world inches). See the script's doc string for the two rules it adds.

// ezdxfDump is the JSON the generator writes.
type ezdxfDump struct {
	Version  string  `json:"version"`
	InsUnits int     `json:"insunits"`
	Units    string  `json:"units"`
	ToInch   float64 `json:"to_inch"`
	Layers   []struct {
		Name   string `json:"name"`
		Color  int    `json:"color"`
		On     bool   `json:"on"`
		Frozen bool   `json:"frozen"`
	} `json:"layers"`
	Entities []struct {
		Type     string       `json:"type"`
		Layer    string       `json:"layer"`
		Handle   string       `json:"handle"`
		From     string       `json:"from"`
		Points   [][2]float64 `json:"points"`
		Bulges   []float64    `json:"bulges"`
		Closed   bool         `json:"closed"`
		Text     *string      `json:"text"`
		Height   float64      `json:"height"`
		Rotation float64      `json:"rotation"`
		Radius   float64      `json:"radius"`
		Start    float64      `json:"start"`
		End      float64      `json:"end"`
	} `json:"entities"`
}

// Tolerances. Both sides compute the same transforms in float64 and the
// dump is rounded to 1e-9, so agreement is far tighter than these; they
// are set well below anything that matters for framing (a 1/64 in
// drafting error is 0.016 in) and well above rounding.
const (
	tolIn  = 1e-6 // coordinates, radii, heights, inches
	tolDeg = 1e-6 // angles, degrees
)

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

// nearDeg compares angles modulo 360.
func nearDeg(a, b float64) bool {
	d := math.Mod(math.Abs(a-b), 360)
	return d <= tolDeg || 360-d <= tolDeg
}

func TestFixturesMatchEzdxf(t *testing.T) {
	files, _ := filepath.Glob("testdata/*.dxf")
	if len(files) < 3 {
		t.Fatalf("want the ezdxf fixtures in testdata, found %v", files)
	}
	for _, path := range files {
		name := strings.TrimSuffix(filepath.Base(path), ".dxf")
		jpath := strings.TrimSuffix(path, ".dxf") + ".json"
		if _, err := os.Stat(jpath); err != nil {
			continue // not an ezdxf fixture
		}
		t.Run(name, func(t *testing.T) {
			var want ezdxfDump
			b, err := os.ReadFile(jpath)
			if err != nil {
				t.Fatal(err)
			}
			if err := json.Unmarshal(b, &want); err != nil {
				t.Fatal(err)
			}
			d, err := ReadFile(path, Options{})
			if err != nil {
				t.Fatal(err)
			}
			compareDump(t, d, &want)
			checkLines(t, path, d)
		})
	}
}

func compareDump(t *testing.T, d *Drawing, want *ezdxfDump) {
	t.Helper()
	if d.Version != want.Version || d.InsUnits != want.InsUnits || d.Units != want.Units || !near(d.ToInch, want.ToInch, 1e-9) {
		t.Errorf("header: got %s/%d/%q/%g, ezdxf %s/%d/%q/%g", d.Version, d.InsUnits, d.Units, d.ToInch,
			want.Version, want.InsUnits, want.Units, want.ToInch)
	}
	layers := map[string]Layer{}
	for _, l := range d.Layers {
		layers[l.Name] = l
	}
	if len(layers) != len(want.Layers) {
		t.Errorf("got %d layers, ezdxf %d", len(layers), len(want.Layers))
	}
	for _, wl := range want.Layers {
		l, ok := layers[wl.Name]
		if !ok || l.Color != wl.Color || l.On != wl.On || l.Frozen != wl.Frozen {
			t.Errorf("layer %q: got %+v, ezdxf %+v", wl.Name, l, wl)
		}
	}
	if len(d.Entities) != len(want.Entities) {
		t.Fatalf("got %d entities, ezdxf %d", len(d.Entities), len(want.Entities))
	}
	for i, w := range want.Entities {
		e := d.Entities[i]
		errorf := func(format string, args ...any) {
			t.Helper()
			t.Errorf("entity %d (%s %s, ezdxf %s from %q): "+format,
				append([]any{i, e.Kind, e.Pos, w.Type, w.From}, args...)...)
		}
		from := ""
		if e.From != nil {
			from = e.From.Handle
		}
		if e.Kind.String() != w.Type || e.Pos.Layer != w.Layer || from != w.From {
			errorf("kind/layer/from: got %s/%s/%q", e.Kind, e.Pos.Layer, from)
			continue
		}
		if w.From == "" && e.Pos.Handle != w.Handle {
			errorf("handle %q, ezdxf %q", e.Pos.Handle, w.Handle)
		}
		if len(e.Points) != len(w.Points) {
			errorf("got %d points, ezdxf %d", len(e.Points), len(w.Points))
			continue
		}
		for j, p := range w.Points {
			if !near(e.Points[j].X, p[0], tolIn) || !near(e.Points[j].Y, p[1], tolIn) {
				errorf("point %d: got %v, ezdxf %v", j, e.Points[j], p)
			}
		}
		switch e.Kind {
		case KindLWPolyline, KindPolyline:
			if e.Closed != w.Closed {
				errorf("closed %v, ezdxf %v", e.Closed, w.Closed)
			}
			if (e.Bulges == nil) != (w.Bulges == nil) {
				errorf("bulges %v, ezdxf %v", e.Bulges, w.Bulges)
			}
			for j := range w.Bulges {
				if j >= len(e.Bulges) || !near(e.Bulges[j], w.Bulges[j], 1e-9) {
					errorf("bulges %v, ezdxf %v", e.Bulges, w.Bulges)
					break
				}
			}
		case KindText, KindMText:
			if w.Text == nil || e.Text != *w.Text {
				errorf("text %q, ezdxf %q", e.Text, deref(w.Text))
			}
			if !near(e.HeightIn, w.Height, tolIn) || !nearDeg(e.RotationDeg, w.Rotation) {
				errorf("height/rotation %g/%g, ezdxf %g/%g", e.HeightIn, e.RotationDeg, w.Height, w.Rotation)
			}
		case KindCircle, KindArc:
			if !near(e.RadiusIn, w.Radius, tolIn) {
				errorf("radius %g, ezdxf %g", e.RadiusIn, w.Radius)
			}
			if e.Kind == KindArc && (!nearDeg(e.StartDeg, w.Start) || !nearDeg(e.EndDeg, w.End)) {
				errorf("angles %g..%g, ezdxf %g..%g", e.StartDeg, e.EndDeg, w.Start, w.End)
			}
		}
	}
}

func deref(s *string) string {
	if s == nil {
		return "<none>"
	}
	return *s
}

// checkLines verifies Pos.Line against the file itself: the line holds the
// group code 0, the next one the entity type, and the entity's handle
// follows within its group (common practice, no source: DXF pair layout).
func checkLines(t *testing.T, path string, d *Drawing) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var lines []string
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		lines = append(lines, strings.TrimRight(sc.Text(), "\r"))
	}
	for _, e := range d.Entities {
		ps := []Pos{e.Pos}
		if e.From != nil {
			ps = append(ps, *e.From)
		}
		for _, p := range ps {
			if p.Line == 0 && p.Handle == "" {
				continue
			}
			if p.Line < 1 || p.Line+3 >= len(lines) || strings.TrimSpace(lines[p.Line-1]) != "0" {
				t.Errorf("%s: line %d is not a 0 group code", p, p.Line)
				continue
			}
			if strings.TrimSpace(lines[p.Line+1]) != "5" || lines[p.Line+2] != p.Handle {
				t.Errorf("%s: handle not at lines %d-%d", p, p.Line+2, p.Line+3)
			}
		}
	}
}
