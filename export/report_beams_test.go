package export

import (
	"strconv"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

// TestReportPlanBeams: the load path's beams are drawn on the plan (parsed
// back with an HTML parser): one line per beam at its ends (y negated, as
// the plan is drawn), coloured as a member of the same ratio, in the band
// of that ratio, titled with its ratio, what it bears on and what it
// carries, and labelled with its id and ratio; a failing beam's label is
// the failing label's colour. A plan without a load path draws none.
func TestReportPlanBeams(t *testing.T) {
	r, g := loadReportFixture(t)
	doc, _ := repWriteParse(t, r, g)
	if n := repByID(doc, "beams"); n != nil && repFirstTag(n, "line") != nil {
		t.Fatalf("beams drawn without a load path")
	}
	r.LoadPath = &LoadPath{Beams: []PathBeam{
		{ID: "B1", Mark: "B1", Size: "(3) 2x12", StartIn: [2]float64{0, 300}, EndIn: [2]float64{240, 300},
			Supports: []string{"P1", "wall W2"}, Carries: []string{"M1", "M2"}, Governing: "bending-top", MaxRatio: 0.62, Status: StatusPass},
		{ID: "B2", Mark: "B2", Size: "4x12", StartIn: [2]float64{0, 360}, EndIn: [2]float64{0, 480},
			Supports: []string{"B1", "P2"}, Carries: []string{"M3"}, Governing: "deflection-live", MaxRatio: 1.2, Status: StatusFail},
	}}
	doc, _ = repWriteParse(t, r, g)
	beams := repByID(doc, "beams")
	if beams == nil {
		t.Fatal("no #beams group")
	}
	if repByID(doc, "carried") == nil {
		t.Error("no #carried group for the load-path view")
	}
	var lines, texts []*html.Node
	repWalk(beams, func(n *html.Node) {
		if n.Type == html.ElementNode && n.Data == "line" {
			lines = append(lines, n)
		}
		if n.Type == html.ElementNode && n.Data == "text" {
			texts = append(texts, n)
		}
	})
	if len(lines) != 2 || len(texts) != 2 {
		t.Fatalf("%d lines, %d labels, want 2 and 2", len(lines), len(texts))
	}
	for i, b := range r.LoadPath.Beams {
		l := lines[i]
		for k, want := range map[string]float64{"x1": b.StartIn[0], "y1": -b.StartIn[1], "x2": b.EndIn[0], "y2": -b.EndIn[1]} {
			got, err := strconv.ParseFloat(repAttr(l, k), 64)
			if err != nil || got != want {
				t.Errorf("%s %s = %q, want %v", b.ID, k, repAttr(l, k), want)
			}
		}
		if got, want := repAttr(l, "stroke"), ratioColour(b.MaxRatio); got != want {
			t.Errorf("%s stroke %s, want %s (the members' colour at %v)", b.ID, got, want, b.MaxRatio)
		}
		if !repHasClass(l, "beam") || !repHasClass(l, bandClass(b.MaxRatio, b.Status)) {
			t.Errorf("%s class %q", b.ID, repAttr(l, "class"))
		}
		// The load-path view's data: the beam and the members it carries
		// (report-chromium.sh clicks a beam and counts what is drawn).
		if repAttr(l, "data-beam") != b.ID || repAttr(l, "data-carries") != strings.Join(b.Carries, " ") {
			t.Errorf("%s data-beam %q data-carries %q", b.ID, repAttr(l, "data-beam"), repAttr(l, "data-carries"))
		}
		title := repText(repFirstTag(l, "title"))
		for _, want := range append([]string{b.ID, b.Size, b.Governing, strconv.FormatFloat(b.MaxRatio, 'f', 2, 64), b.Status}, append(b.Supports, b.Carries...)...) {
			if !strings.Contains(title, want) {
				t.Errorf("%s title %q lacks %q", b.ID, title, want)
			}
		}
		if got, want := repText(texts[i]), b.ID+" "+strconv.FormatFloat(b.MaxRatio, 'f', 2, 64); got != want {
			t.Errorf("label %q, want %q", got, want)
		}
		if fail := repHasClass(texts[i], "lbl-fail"); fail != (b.Status == StatusFail) {
			t.Errorf("%s label class %q", b.ID, repAttr(texts[i], "class"))
		}
	}
}
