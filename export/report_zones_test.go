package export

import (
	"strings"
	"testing"
	"time"
)

// TestPlanZonesOnePathPerName: the plan draws one path per zone name, a
// subpath per outline (a rectangle square to the plan as M, H, V, H, Z),
// and names each outline at its centroid; past maxZoneLabels outlines the
// names are on hover only and the legend says so.
func TestPlanZonesOnePathPerName(t *testing.T) {
	rect := func(x0, y0, x1, y1 float64) [][2]float64 {
		return [][2]float64{{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}}
	}
	r := &Results{Plan: "p.dxf", DrawingUnits: "in", Members: []Member{{ID: "M1", Start: [2]float64{0, 0}, End: [2]float64{0, 100}, Status: StatusPass}}}
	g := &PlanGeometry{Zones: []ZoneOutline{
		{Name: "FLOOR", Points: rect(0, 0, 100, 50)},
		{Name: "ROOF", Points: [][2]float64{{0, 60}, {100, 60}, {50, 90}}},
		{Name: "FLOOR", Points: rect(0, 100, 100, 150)},
	}}
	p := buildReport(r, g, time.Time{})
	svg := string(p.PlanSVG)
	if n := strings.Count(svg, `<path class="zone"`); n != 2 {
		t.Errorf("%d zone paths, want 2 (FLOOR, ROOF):\n%s", n, svg)
	}
	for _, want := range []string{
		`d="M0,0H100V-50H0ZM0,-100H100V-150H0Z"><title>zone FLOOR</title>`,
		`d="M0,-60H100L50,-90Z"><title>zone ROOF</title>`,
		`<text x="50" y="-25">FLOOR</text>`, `<text x="50" y="-125">FLOOR</text>`,
	} {
		if !strings.Contains(svg, want) {
			t.Errorf("plan has no %s", want)
		}
	}
	for _, l := range p.Legend {
		if strings.Contains(l.Label, "load zones") {
			t.Errorf("legend %q for 3 outlines", l.Label)
		}
	}

	for i := 0; len(g.Zones) <= maxZoneLabels; i++ {
		g.Zones = append(g.Zones, ZoneOutline{Name: "FLOOR", Points: rect(float64(200*i), 200, float64(200*i+100), 300)})
	}
	p = buildReport(r, g, time.Time{})
	if svg := string(p.PlanSVG); strings.Contains(svg, `class="zone-name"`) || !strings.Contains(svg, "<title>zone FLOOR</title>") {
		t.Errorf("%d outlines: want names on hover only", len(g.Zones))
	}
	said := false
	for _, l := range p.Legend {
		said = said || strings.Contains(l.Label, "each named on hover")
	}
	if !said {
		t.Errorf("legend %+v does not say the zones are named on hover", p.Legend)
	}
}
