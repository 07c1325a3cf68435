package export

import (
	"math"
	"testing"
)

func TestFtIn(t *testing.T) {
	// 12 in to the foot; nearest 1/16 in (common practice, no source).
	tests := []struct {
		in   float64
		want string
	}{
		{0, `0'-0"`},
		{8, `0'-8"`},
		{144, `12'-0"`},
		{150.5, `12'-6 1/2"`},
		{14.5, `1'-2 1/2"`},
		{0.0625, `0'-0 1/16"`},
		{33.75, `2'-9 3/4"`},
		{11.99, `1'-0"`}, // rounds up to the next foot
		{-18, `-1'-6"`},
		{math.NaN(), "n/a"},
		{math.Inf(1), "n/a"},
	}
	for _, tc := range tests {
		if got := FtIn(tc.in); got != tc.want {
			t.Errorf("FtIn(%v) = %s, want %s", tc.in, got, tc.want)
		}
	}
}

func TestUnitToInch(t *testing.T) {
	// 1 in = 25.4 mm exactly (international inch, 1959).
	tests := []struct {
		unit string
		want float64
	}{{"in", 1}, {"ft", 12}, {"mm", 1 / 25.4}, {"cm", 1 / 2.54}, {"M", 1 / 0.0254}}
	for _, tc := range tests {
		got, ok := UnitToInch(tc.unit)
		if !ok || math.Abs(got-tc.want) > 1e-12*tc.want {
			t.Errorf("UnitToInch(%q) = %v %v, want %v", tc.unit, got, ok, tc.want)
		}
	}
	if _, ok := UnitToInch("yd"); ok {
		t.Error("yd accepted")
	}
}

// numList prints lengths to 0.01 in without float noise (common practice,
// no source): values that came out of arithmetic like 119.25000000000003.
func TestNumListRounds(t *testing.T) {
	got := numList([]float64{-0.7500000000000001, 120.00000000000003, 14.5, 0, -0.001, 3.14159})
	want := "-0.75, 120, 14.5, 0, 0, 3.14"
	if got != want {
		t.Errorf("numList = %q, want %q", got, want)
	}
}

// TestSpansText: spans in order with each cantilever at its end, as a
// framing schedule lists them (common practice, no source).
func TestSpansText(t *testing.T) {
	rows := []struct {
		spans []float64
		ovh   [2]float64
		want  string
	}{
		{[]float64{144}, [2]float64{}, `12'-0"`},
		{[]float64{144}, [2]float64{42, 0}, `3'-6" cantilever + 12'-0"`},
		{[]float64{144, 150}, [2]float64{0, 24}, `12'-0" + 12'-6" + 2'-0" cantilever`},
		{[]float64{120}, [2]float64{0.004, 0}, `10'-0"`},
		{nil, [2]float64{}, ""},
	}
	for _, r := range rows {
		if got := SpansText(r.spans, r.ovh); got != r.want {
			t.Errorf("SpansText(%v, %v) = %q, want %q", r.spans, r.ovh, got, r.want)
		}
	}
}
