package check

import (
	"strconv"
	"testing"
)

func TestAppendNum(t *testing.T) {
	// Expected strings: strconv's 'f' formatting at the same precision with
	// trailing zeros dropped (common practice, no source).
	rows := []struct {
		v    float64
		want string
	}{
		{0, "0"}, {1, "1"}, {1.5, "1.5"}, {0.1234, "0.123"}, {0.0005, "0.001"}, {0.0004, "0"},
		{9.25, "9.25"}, {21.390625, "21.39"}, {113.04, "113"}, {916.289, "916.3"}, {1138.5, "1139"},
		{1600000, "1600000"}, {-2.5, "-2.5"}, {-0.0001, "0"}, {99.995, "100"}, {1e20, "1e+20"},
	}
	for _, r := range rows {
		if got := num(r.v); got != r.want {
			t.Errorf("num(%v) = %q, want %q", r.v, got, r.want)
		}
	}
	for _, v := range []float64{3.14159, 27.5207, 184.23, 0.48204, 5.5556, 12345.678} {
		p := 3
		switch {
		case v >= 1000:
			p = 0
		case v >= 100:
			p = 1
		case v >= 10:
			p = 2
		}
		want := strconv.FormatFloat(v, 'f', p, 64)
		got := num(v)
		if f1, _ := strconv.ParseFloat(want, 64); f1 != mustParse(t, got) {
			t.Errorf("num(%v) = %q, strconv gives %q", v, got, want)
		}
	}
}

func mustParse(t *testing.T, s string) float64 {
	t.Helper()
	f, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatal(err)
	}
	return f
}

// TestSubstText prints substitutions as a report shows them: each %s the
// next number, four significant figures (common practice, no source).
func TestSubstText(t *testing.T) {
	rows := []struct {
		s    Subst
		want string
	}{
		{Subst{Format: "1.63(%s) + 3(%s)", Nums: []float64{72, 9.25}}, "1.63(72) + 3(9.25)"},
		{Subst{Format: "sqrt(%s(%s) / %s^2)", Nums: []float64{145.11, 9.25, 1.5}}, "sqrt(145.1(9.25) / 1.5^2)"},
		{Subst{Format: "temperature = normal"}, "temperature = normal"},
		{Subst{Format: "%s / %s", Nums: []float64{333.23}}, "333.2 / %s"},
		{Subst{}, ""},
	}
	for _, r := range rows {
		if got := r.s.Text(); got != r.want {
			t.Errorf("%q %v: got %q, want %q", r.s.Format, r.s.Nums, got, r.want)
		}
	}
}
