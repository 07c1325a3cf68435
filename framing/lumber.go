package framing

import (
	"fmt"
	"strconv"
	"strings"
)

// NominalSize splits a nominal size such as "2x10" into its nominal
// thickness and depth in inches.
func NominalSize(size string) (bIn, dIn int, err error) {
	parts := strings.Split(strings.ToLower(strings.TrimSpace(size)), "x")
	if len(parts) == 2 {
		b, e1 := strconv.Atoi(strings.TrimSpace(parts[0]))
		d, e2 := strconv.Atoi(strings.TrimSpace(parts[1]))
		if e1 == nil && e2 == nil && b > 0 && d > 0 {
			return b, d, nil
		}
	}
	return 0, 0, fmt.Errorf("size %q: want nominal thickness x depth, like 2x10", size)
}

// dressedIn returns the dressed (actual) dimension of a nominal dimension
// of dimension lumber, dry: 2->1.5, 3->2.5, 4->3.5, 6->5.5, then nominal
// minus 3/4 in from 8 in up (NDS 2018 Supplement Table 1B, section
// properties of standard dressed sawn lumber).
func dressedIn(nominal int) float64 {
	switch {
	case nominal <= 0:
		return 0
	case nominal <= 6:
		return float64(nominal) - 0.5
	default:
		return float64(nominal) - 0.75
	}
}

// DressedSize returns the dressed thickness and depth of a nominal size,
// in inches (NDS 2018 Supplement Table 1B).
func DressedSize(size string) (bIn, dIn float64, err error) {
	b, d, err := NominalSize(size)
	if err != nil {
		return 0, 0, err
	}
	return dressedIn(b), dressedIn(d), nil
}
