package main

import (
	"math"
	"strings"
	"testing"
)

// Keys in inches (their names end in _in) stay numbers, and also take a
// length as the trade writes it, as a string; a bare number there is
// inches, as the key says. 1 in = 25.4 mm exactly (NIST SP 811).
func TestProjectLengthKeysTakeTradeForms(t *testing.T) {
	p, err := ParseProject("p.toml", []byte(`[drawing]
snap_tolerance_in = "38.1mm"
max_wall_thickness_in = "1'-0\""
edge_distance_in = "2"

[[support]]
layers = ["WALL*"]
kind = "bearing-wall"
bearing_in = "3 1/2\""

[[support]]
layers = ["BEAM*"]
kind = "flush-beam"
bearing_in = 1.5
`))
	if err != nil {
		t.Fatal(err)
	}
	d := p.Drawing
	for _, c := range []struct {
		key       string
		got, want float64
	}{
		{"snap_tolerance_in", d.SnapToleranceIn, 1.5}, {"max_wall_thickness_in", d.MaxWallThicknessIn, 12},
		{"edge_distance_in", d.EdgeDistanceIn, 2}, {"bearing_in", p.Supports[0].BearingIn, 3.5},
		{"bearing_in (number)", p.Supports[1].BearingIn, 1.5},
	} {
		if math.Abs(c.got-c.want) > 1e-9 {
			t.Errorf("%s = %v, want %v", c.key, c.got, c.want)
		}
	}
}

// A length typed as every output prints it gives the same joist as in
// inches; a bare number is refused naming both readings, exit 2.
func TestMemberSpanTradeForms(t *testing.T) {
	var first string
	for _, span := range []string{`14'-6"`, `14' 6"`, "174in", `174"`, "14.5ft", "4419.6mm"} {
		code, out, errs := runCmd("member", "--size", "2x10", "--span", span, "--spacing", `16"`, "--bearing", `3 1/2"`)
		if code != exitOK || errs != "" {
			t.Fatalf("--span %s: exit %d, %s", span, code, errs)
		}
		// 14'-6" = 174 in = 14.5 ft; 4419.6 mm / 25.4 = 174 in
		if !strings.Contains(out, "spans 174 in (14.5 ft)") {
			t.Errorf("--span %s: %s", span, out)
		}
		if first == "" {
			first = out
		} else if out != first {
			t.Errorf("--span %s gives another result than %s", span, `14'-6"`)
		}
	}
	code, _, errs := runCmd("member", "--size", "2x10", "--span", "14")
	if code != exitUsage || !strings.Contains(errs, "--span 14: 14 in or 14 ft? write 14ft or 14in") {
		t.Errorf("bare span: exit %d, %q", code, errs)
	}
}
