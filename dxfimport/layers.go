package dxfimport

import "strings"

// MatchLayer reports whether layer matches any of the patterns. Patterns
// are case-insensitive globs: '*' matches any run of characters (including
// none) and '?' matches one character; every other character matches
// itself. An empty pattern list matches nothing.
func MatchLayer(patterns []string, layer string) bool {
	l := strings.ToUpper(layer)
	for _, p := range patterns {
		if globMatch(strings.ToUpper(p), l) {
			return true
		}
	}
	return false
}

// globMatch matches s against pattern p with '*' and '?' wildcards, using
// the usual backtracking over the last star (linear for these patterns).
func globMatch(p, s string) bool {
	pr, sr := []rune(p), []rune(s)
	pi, si := 0, 0
	star, mark := -1, 0
	for si < len(sr) {
		switch {
		case pi < len(pr) && (pr[pi] == '?' || pr[pi] == sr[si]):
			pi++
			si++
		case pi < len(pr) && pr[pi] == '*':
			star, mark = pi, si
			pi++
		case star >= 0:
			pi = star + 1
			mark++
			si = mark
		default:
			return false
		}
	}
	for pi < len(pr) && pr[pi] == '*' {
		pi++
	}
	return pi == len(pr)
}
