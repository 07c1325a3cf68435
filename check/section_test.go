package check

import (
	"errors"
	"strings"
	"testing"
)

// TestSection_NDS2018SupplementTable1B compares A, Sxx and Ixx with NDS
// 2018 Supplement Table 1B. The table prints four significant figures, so
// the tolerance is half a unit in the last printed place (0.2% relative
// covers it for every row here). Values typed from memory: verify against
// NDS 2018 Supplement Table 1B (they are also b d, b d^2/6 and b d^3/12 of
// the Table 1A dressed sizes, which the test checks independently).
func TestSection_NDS2018SupplementTable1B(t *testing.T) {
	rows := []struct {
		size    string
		b, d    float64
		a, s, i float64
	}{
		{"2x4", 1.5, 3.5, 5.250, 3.063, 5.359},
		{"2x6", 1.5, 5.5, 8.250, 7.563, 20.80},
		{"2x8", 1.5, 7.25, 10.88, 13.14, 47.63},
		{"2x10", 1.5, 9.25, 13.88, 21.39, 98.93},
		{"2x12", 1.5, 11.25, 16.88, 31.64, 178.0},
		{"2x14", 1.5, 13.25, 19.88, 43.89, 290.8},
		{"3x10", 2.5, 9.25, 23.13, 35.65, 164.9},
		{"4x12", 3.5, 11.25, 39.38, 73.83, 415.3},
	}
	const rel = 0.002
	for _, r := range rows {
		s, err := ParseSize(r.size)
		if err != nil {
			t.Fatalf("%s: %v", r.size, err)
		}
		src := "NDS 2018 Supplement Table 1B, " + r.size
		expectNear(t, r.size+" b", s.BIn, r.b, 1e-12, 0, "NDS 2018 Supplement Table 1A")
		expectNear(t, r.size+" d", s.DIn, r.d, 1e-12, 0, "NDS 2018 Supplement Table 1A")
		expectNear(t, r.size+" A", s.AreaIn2, r.a, 0, rel, src)
		expectNear(t, r.size+" S", s.SIn3, r.s, 0, rel, src)
		expectNear(t, r.size+" I", s.IIn4, r.i, 0, rel, src)
	}
}

func TestParseSize(t *testing.T) {
	for _, in := range []string{"2x10", "2X10", " 2 x 10 ", "2×10"} {
		s, err := ParseSize(in)
		if err != nil || s.Name != "2x10" {
			t.Errorf("ParseSize(%q) = %q, %v; want 2x10", in, s.Name, err)
		}
	}
	for _, in := range []string{"", "2x", "x10", "2x11", "5x4", "2x10x12", "2x3", "2x18", "two by ten"} {
		if _, err := ParseSize(in); err == nil {
			t.Errorf("ParseSize(%q): want an error", in)
		} else if !strings.Contains(err.Error(), "size") {
			t.Errorf("ParseSize(%q): error %q should name the size", in, err)
		}
	}
	s, _ := ParseSize("2x10")
	expectNear(t, "2x10 board feet per foot", s.BoardFeetPerFt(), 20.0/12, 1e-12, 0, "board measure = nominal b d / 12, common practice, no source")
}

// A built-up size of 2 to 4 plies of 2x is one member of width n b (the
// plies fastened to act together: common practice, no source); S and I of
// (3) 2x12 are three times Table 1B's 31.64 in^3 and 178.0 in^4 (NDS 2018
// Supplement Table 1B). Thicker plies or more plies are refused, never
// checked as one ply; a metric section is refused with a message saying how
// to map it, never read as a nominal US size (issue 14 items 5 and 7).
func TestParseSizeBuiltUpAndMetric(t *testing.T) {
	for _, in := range []string{"(1) 2x10", "(1)2X10"} {
		if s, err := ParseSize(in); err != nil || s.Name != "2x10" {
			t.Errorf("ParseSize(%q) = %q, %v; want 2x10", in, s.Name, err)
		}
	}
	s, err := ParseSize("(3) 2x12")
	if err != nil || s.Plies != 3 || s.Name != "(3) 2x12" {
		t.Fatalf("ParseSize((3) 2x12) = %+v, %v", s, err)
	}
	expectNear(t, "b", s.BIn, 4.5, 1e-12, 0, "3 x 1.5 in, NDS 2018 Supplement Table 1A")
	expectNear(t, "S", s.SIn3, 3*31.64, 0.01, 0, "3 x 31.64 in^3, NDS 2018 Supplement Table 1B")
	expectNear(t, "I", s.IIn4, 3*177.98, 0.01, 0, "3 x 177.98 in^4, NDS 2018 Supplement Table 1B")
	expectNear(t, "nominal thickness of the member", s.MemberNominalBIn(), 6, 0, 0, "3 x 2 in")
	for _, in := range []string{"(2)-2x8", "(4) 2x10"} {
		if s, err := ParseSize(in); err != nil || s.Plies < 2 {
			t.Errorf("ParseSize(%q) = %+v, %v; want a built-up section", in, s, err)
		}
	}
	for _, in := range []string{"(5) 2x10", "(2) 4x10", "(2) 3x12"} {
		_, err := ParseSize(in)
		if !errors.Is(err, ErrBuiltUp) || !strings.Contains(err.Error(), "plies") {
			t.Errorf("ParseSize(%q): %v, want ErrBuiltUp", in, err)
		}
	}
	for _, in := range []string{"90x45", "140x45", "190x45", "45x190", "90 x 45", "240X45"} {
		_, err := ParseSize(in)
		if !errors.Is(err, ErrMetricSection) {
			t.Errorf("ParseSize(%q): %v, want ErrMetricSection", in, err)
			continue
		}
		for _, want := range []string{"mm", "not read as a nominal US size", "user material", "own section and design values"} {
			if !strings.Contains(err.Error(), want) {
				t.Errorf("ParseSize(%q): %q should say %q", in, err, want)
			}
		}
	}
	for _, in := range []string{"(0) 2x10", "(x) 2x10", "(2 2x10", "(2) 2x11", "2x18", "2x45"} {
		_, err := ParseSize(in)
		if err == nil || errors.Is(err, ErrBuiltUp) || errors.Is(err, ErrMetricSection) {
			t.Errorf("ParseSize(%q): %v, want a plain size error", in, err)
		}
	}
}
