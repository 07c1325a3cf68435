package framing

import (
	"fmt"
	"strconv"
	"strings"
)

// NominalSize splits a nominal size such as "2x10" into its nominal
// thickness and depth in inches. A built-up size "(2) 2x10" (Callout.
// Designation) has n times the thickness of one ply.
func NominalSize(size string) (bIn, dIn int, err error) {
	plies, ply := splitPlies(size)
	parts := strings.Split(strings.ToLower(strings.TrimSpace(ply)), "x")
	if len(parts) == 2 && plies > 0 {
		b, e1 := strconv.Atoi(strings.TrimSpace(parts[0]))
		d, e2 := strconv.Atoi(strings.TrimSpace(parts[1]))
		if e1 == nil && e2 == nil && b > 0 && d > 0 {
			return plies * b, d, nil
		}
	}
	return 0, 0, fmt.Errorf("size %q: want nominal thickness x depth, like 2x10", size)
}

// splitPlies splits "(n) 2x10" into n and "2x10"; a size without a ply
// count is one ply; a bad count gives 0.
func splitPlies(size string) (int, string) {
	rest, ok := strings.CutPrefix(strings.TrimSpace(size), "(")
	if !ok {
		return 1, size
	}
	n, ply, ok := strings.Cut(rest, ")")
	plies, err := strconv.Atoi(strings.TrimSpace(n))
	if !ok || err != nil || plies < 1 {
		return 0, size
	}
	return plies, strings.TrimPrefix(strings.TrimSpace(ply), "-")
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
// in inches (NDS 2018 Supplement Table 1B); a built-up member's is its
// plies' thicknesses added ("(2) 2x10": 3.0 x 9.25 in).
func DressedSize(size string) (bIn, dIn float64, err error) {
	plies, ply := splitPlies(size)
	b, d, err := NominalSize(ply)
	if err != nil || plies < 1 {
		return 0, 0, fmt.Errorf("size %q: want nominal thickness x depth, like 2x10", size)
	}
	return float64(plies) * dressedIn(b), dressedIn(d), nil
}
