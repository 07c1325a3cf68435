package project

import (
	"fmt"
	"strconv"
	"strings"

	"framecheck/check"
)

// keyLines scans TOML text and maps each key and table header to the
// 1-based line it is written on. The TOML library reports positions only
// for syntax errors, so the loader uses this map to name the line of an
// unknown key or a bad value.
//
// Paths are dotted; an element of an array of tables carries its 0-based
// index, as in "zone[1].dead_psf" or "lumber.by_layer[0].size". Keys inside
// inline tables are not mapped; lineOf falls back to the enclosing key.
// The scanner skips the contents of multi-line strings and multi-line
// arrays, so text in them never passes for a key. It assumes the text
// parsed as TOML; on anything else it maps what it can and never fails.
func keyLines(data string) map[string]int {
	lines := map[string]int{}
	arrays := map[string]int{} // array-table path (with parent indices) -> element count
	current := ""
	var sc valueScanner
	for i, line := range strings.Split(data, "\n") {
		n := i + 1
		if sc.inValue() {
			sc.scan(line)
			continue
		}
		s := strings.TrimSpace(line)
		switch {
		case s == "" || s[0] == '#':
			continue
		case strings.HasPrefix(s, "[["):
			parts, _ := parseKey(s[2:])
			current = resolveTable(parts, arrays, true)
			setLine(lines, current, n)
		case s[0] == '[':
			parts, _ := parseKey(s[1:])
			current = resolveTable(parts, arrays, false)
			setLine(lines, current, n)
		default:
			parts, rest := parseKey(s)
			rest = strings.TrimSpace(rest)
			if len(parts) == 0 || !strings.HasPrefix(rest, "=") {
				continue
			}
			p := current
			for _, k := range parts {
				p = joinPath(p, k)
				setLine(lines, p, n)
			}
			sc.scan(rest[1:])
		}
	}
	return lines
}

// resolveTable returns the internal path of a table header, adding the
// index of the last element to every array-table prefix. For an
// array-table header it first counts the new element.
func resolveTable(parts []string, arrays map[string]int, array bool) string {
	p := ""
	for i, k := range parts {
		p = joinPath(p, k)
		if array && i == len(parts)-1 {
			arrays[p]++
		}
		if c := arrays[p]; c > 0 {
			p += "[" + strconv.Itoa(c-1) + "]"
		}
	}
	return p
}

func joinPath(parent, key string) string {
	if parent == "" {
		return key
	}
	return parent + "." + key
}

func setLine(lines map[string]int, path string, n int) {
	if _, ok := lines[path]; !ok {
		lines[path] = n
	}
}

// parseKey reads a dotted key (bare, "basic" or 'literal' parts) from the
// start of s and returns its parts and the text after it. It stops at the
// first character that cannot continue a key.
func parseKey(s string) (parts []string, rest string) {
	for {
		s = strings.TrimLeft(s, " \t")
		if s == "" {
			return parts, s
		}
		var part string
		switch s[0] {
		case '"', '\'':
			end := strings.IndexByte(s[1:], s[0])
			if end < 0 {
				return parts, s
			}
			part, s = s[1:1+end], s[2+end:]
		default:
			end := 0
			for end < len(s) && isBareKeyChar(s[end]) {
				end++
			}
			if end == 0 {
				return parts, s
			}
			part, s = s[:end], s[end:]
		}
		parts = append(parts, part)
		s = strings.TrimLeft(s, " \t")
		if !strings.HasPrefix(s, ".") {
			return parts, s
		}
		s = s[1:]
	}
}

func isBareKeyChar(c byte) bool {
	return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_' || c == '-'
}

// valueScanner follows a value across lines: open brackets and braces, and
// multi-line strings.
type valueScanner struct {
	depth int    // open [ and { outside strings
	quote string // `"""` or `'''` while inside a multi-line string
}

func (v *valueScanner) inValue() bool { return v.depth > 0 || v.quote != "" }

// scan consumes one line (or the rest of one) of a value.
func (v *valueScanner) scan(s string) {
	for i := 0; i < len(s); i++ {
		if v.quote != "" {
			if strings.HasPrefix(s[i:], v.quote) {
				i += len(v.quote) - 1
				v.quote = ""
			} else if s[i] == '\\' && v.quote == `"""` {
				i++
			}
			continue
		}
		switch c := s[i]; c {
		case '#':
			return
		case '[', '{':
			v.depth++
		case ']', '}':
			if v.depth > 0 {
				v.depth--
			}
		case '"', '\'':
			q := strings.Repeat(string(c), 3)
			if strings.HasPrefix(s[i:], q) {
				v.quote = q
				i += 2
				continue
			}
			for i++; i < len(s) && s[i] != c; i++ {
				if c == '"' && s[i] == '\\' {
					i++
				}
			}
		}
	}
}

// lineOf returns the line of an internal key path, falling back to its
// closest enclosing key or table; 0 when none is known.
func lineOf(lines map[string]int, path string) int {
	for path != "" {
		if n, ok := lines[path]; ok {
			return n
		}
		switch i := strings.LastIndexAny(path, ".["); {
		case i < 0:
			path = ""
		default:
			path = path[:i]
		}
	}
	return 0
}

// displayKey turns an internal path into the key as the file writes it:
// "zone[1].dead_psf" becomes "zone.dead_psf".
func displayKey(path string) string {
	var b strings.Builder
	skip := false
	for _, r := range path {
		switch {
		case r == '[':
			skip = true
		case r == ']':
			skip = false
		case !skip:
			b.WriteRune(r)
		}
	}
	return b.String()
}

// suggest returns the advice for an unknown key: the closest valid key of
// its table when one is near, the table the key belongs in when it is
// valid elsewhere, or the list of valid keys.
func suggest(key string, valid []knownKey, tableShow string) string {
	best, bestD := "", 1<<30
	lk := strings.ToLower(key)
	for _, v := range valid {
		d := check.EditDistance(lk, v.name)
		if strings.HasPrefix(v.name, lk+"_") || strings.HasPrefix(lk, v.name+"_") || allWordsIn(lk, v.name) {
			d = min(d, 1)
		}
		if d < bestD {
			best, bestD = v.show, d
		}
	}
	if best != "" && bestD <= max(2, len(key)/3) {
		return fmt.Sprintf("did you mean %s?", best)
	}
	if home, ok := keyHome[lk]; ok && home != tableShow {
		return fmt.Sprintf("%s is a key of %s", lk, home)
	}
	names := make([]string, len(valid))
	for i, v := range valid {
		names[i] = v.show
	}
	return "valid keys in " + tableShow + ": " + strings.Join(names, ", ")
}

// allWordsIn reports whether every '_'-separated word of key is a word of
// name: "blocking_weight" and "blocking_piece_weight_bf".
func allWordsIn(key, name string) bool {
	words := strings.Split(name, "_")
	for _, w := range strings.Split(key, "_") {
		if !Contains(words, w) {
			return false
		}
	}
	return true
}
