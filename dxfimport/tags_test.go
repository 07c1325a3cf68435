package dxfimport

import (
	"math"
	"math/rand"
	"strconv"
	"testing"
)

// fastFloat must agree bit for bit with strconv.ParseFloat (the reference)
// wherever it answers: Clinger's fast path is exact.
func TestFastFloatMatchesStrconv(t *testing.T) {
	fixed := []string{"0", "-0", "0.0", "144.000000", "-12.5", ".5", "1.", "+3.25", "0.000125",
		"123456789012345", "1234567890.12345", "0.1", "0.3", "2.675", "1e5", "1,5", ".", "-", "", "1.2.3", "9007199254740993"}
	rng := rand.New(rand.NewSource(1))
	for i := 0; i < 200000; i++ {
		x := (rng.Float64() - 0.5) * math.Pow(10, float64(rng.Intn(12)))
		fixed = append(fixed, strconv.FormatFloat(x, 'f', rng.Intn(12), 64))
	}
	for _, s := range fixed {
		got, ok := fastFloat([]byte(s))
		want, err := strconv.ParseFloat(s, 64)
		if ok && (err != nil || math.Float64bits(got) != math.Float64bits(want)) {
			t.Errorf("fastFloat(%q) = %v, strconv %v (%v)", s, got, want, err)
		}
		if p, ok2 := parseFloat([]byte(" " + s + " ")); ok2 != (err == nil) || (ok2 && math.Float64bits(p) != math.Float64bits(want)) {
			t.Errorf("parseFloat(%q) = %v %v, strconv %v %v", s, p, ok2, want, err)
		}
	}
}
