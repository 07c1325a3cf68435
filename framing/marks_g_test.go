package framing

import (
	"math"
	"strconv"
	"testing"
)

// TestAppendG: appendG writes what strconv's 'g' with the shortest
// precision writes, for the whole numbers it formats itself and around
// the limits where it hands over (Go strconv documentation, format 'g').
func TestAppendG(t *testing.T) {
	for _, v := range []float64{0, math.Copysign(0, -1), 1, -1, 12, -7, 120.5, 0.25, 999999, -999999, 1e6, -1e6, 1e7, 123456.5, 1e-5, math.Ceil(-0.5), math.Round(-0.2)} {
		want := strconv.FormatFloat(v, 'g', -1, 64)
		if got := string(appendG(nil, v)); got != want {
			t.Errorf("appendG(%v) = %q, want %q", v, got, want)
		}
	}
}
