package project

import (
	"math"
	"testing"
)

// TestParseLength: the forms a length takes on the command line, as the
// trade writes them (common practice, no source), and the forms refused.
// Expected inches by hand: 1 ft = 12 in; 1 in = 25.4 mm exactly (NIST SP
// 811, appendix B).
func TestParseLength(t *testing.T) {
	for _, c := range []struct {
		in   string
		want float64
	}{
		{`14'-6"`, 174}, {`14' 6"`, 174}, {`14'6"`, 174}, {`14'6`, 174}, {`14' - 6"`, 174}, {`14ft 6in`, 174},
		{"14ft", 168}, {"14 ft", 168}, {"14'", 168}, {"14 feet", 168}, {"1.5ft", 18},
		{"168in", 168}, {`168"`, 168}, {"168 in", 168}, {`6"`, 6}, {"3.5in", 3.5}, {"3.5 in", 3.5},
		{`3 1/2"`, 3.5}, {`3-1/2"`, 3.5}, {`1/2"`, 0.5}, {`1'-4 1/2"`, 16.5}, {`6'-2 1/4"`, 74.25}, {"14’-6”", 174},
		{"4.2m", 4200 / 25.4}, {"350mm", 350 / 25.4}, {"35cm", 350 / 25.4}, {"4.2 M", 4200 / 25.4}, {"14FT", 168},
		{"0", 0}, {"0in", 0},
	} {
		got, err := ParseLength(c.in)
		if err != nil || math.Abs(got-c.want) > 1e-9 {
			t.Errorf("ParseLength(%q) = %v, %v; want %v", c.in, got, err, c.want)
		}
	}
	// A bare number names both readings.
	for _, c := range []struct{ in, want string }{
		{"14", "14 in or 14 ft? write 14ft or 14in"},
		{"168", "168 in or 168 ft? write 168ft or 168in"},
		{"3.5", "3.5 in or 3.5 ft? write 3.5ft or 3.5in"},
	} {
		if v, err := ParseLength(c.in); err == nil || err.Error() != c.want {
			t.Errorf("ParseLength(%q) = %v, %v; want %q", c.in, v, err, c.want)
		}
		if v, err := ParseLengthIn(c.in); err != nil {
			t.Errorf("ParseLengthIn(%q) = %v, %v; a bare number is inches where the key says so", c.in, v, err)
		}
	}
	for _, bad := range []string{"", "-1", "-1ft", "ft", "abc", "1e400", "1e3in", "NaN", "Inf", "14'x", "2yd", `14'-6"3`,
		"1/0in", `14'-1/0"`, "14 m 6", "14in 6in", "4.2m6", `6""`} {
		if v, err := ParseLength(bad); err == nil {
			t.Errorf("ParseLength(%q) = %v, want an error", bad, v)
		}
	}
}

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
