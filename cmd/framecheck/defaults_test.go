package main

import (
	"bytes"
	"strings"
	"testing"

	"framecheck/project"
)

// TestEngineeringDefaultsOnTerminal: without a project file, the loads,
// limits, lumber and design switches taken by default are printed, not
// only counted (issue 15 item 6); the layer patterns are only counted.
func TestEngineeringDefaultsOnTerminal(t *testing.T) {
	var b bytes.Buffer
	printDefaults(&b, &checkRun{planPath: "/nonexistent/plan.dxf"}, project.DefaultProject())
	out := b.String()
	for _, want := range []string{
		"D 12 psf, L 40 psf", // the built-in FLOOR zone, PROJECT-FILE.md
		"L/360 live, L/240 total",
		`lumber: species = "Douglas Fir-Larch", grade = "No.2", size = "2x10"`,
		"kcr = 1.5",
		"bearing 3.5 in",
		"settings of the drawing, layers and sizing (listed in the Notes sheet)",
	} {
		if !strings.Contains(out, want) {
			t.Errorf("summary lacks %q:\n%s", want, out)
		}
	}
	if strings.Contains(out, "JOIST*") {
		t.Errorf("layer patterns listed among the engineering values:\n%s", out)
	}
}

func TestGroupDefaults(t *testing.T) {
	got := groupDefaults([]string{"drawing.units: from the DXF header ($INSUNITS)", "design.kcr = 1.5",
		"design.incised = false", "[[zone]] A: snow_psf = 0", "[[zone]] A: wind_up_psf = 0", "[[zone]] B: snow_psf = 0"})
	want := []string{"drawing.units: from the DXF header ($INSUNITS)", "design: kcr = 1.5, incised = false",
		"[[zone]] A: snow_psf = 0, wind_up_psf = 0", "[[zone]] B: snow_psf = 0"}
	if strings.Join(got, "\n") != strings.Join(want, "\n") {
		t.Errorf("got %q, want %q", got, want)
	}
}
