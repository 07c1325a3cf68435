package main

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// Terminal text. Every string that comes from a drawing or a project file
// (layer, zone, block and file names, text, messages that quote them)
// goes through termText or termCell before it is printed on standard
// output or standard error, so that a hostile file cannot retitle or
// clear the terminal, move the cursor over a FAIL row, or flood it with a
// megabyte-long name. The output files keep the full text.

// maxTermLine bounds one printed line (a message quoting a name); a cell
// of a table has its own, smaller width.
const maxTermLine = 2000

// termText returns s with every control character (C0 but tab, DEL, C1),
// every bidirectional override and every byte that is not UTF-8 escaped
// as Go writes them (\x1b, \u202e, \xff), cut to maxTermLine runes with an
// ellipsis. Newlines are kept, each line cut on its own: callers print
// multi-line messages (every mistake of a project file, one a line).
func termText(s string) string {
	if !strings.Contains(s, "\n") {
		return escapeTerm(s, maxTermLine)
	}
	lines := strings.Split(s, "\n")
	for i, l := range lines {
		lines[i] = escapeTerm(l, maxTermLine)
	}
	return strings.Join(lines, "\n")
}

// termCell is termText for one table cell: newlines and tabs (which would
// break the columns) are escaped too, and
// the text is cut to width runes (at least 2) with an ellipsis.
func termCell(s string, width int) string {
	return escapeTerm(strings.ReplaceAll(s, "\t", `\x09`), max(width, 2))
}

// escapeTerm escapes s, newlines included, and cuts it to width runes of
// output.
func escapeTerm(s string, width int) string {
	clean := true
	for i := 0; i < len(s); i++ {
		if b := s[i]; b < 0x20 && b != '\t' || b == 0x7f || b >= 0x80 {
			clean = false
			break
		}
	}
	if clean && len(s) <= width {
		return s
	}
	var b strings.Builder
	n := 0
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		var piece string
		switch {
		case r == utf8.RuneError && size == 1:
			piece = fmt.Sprintf(`\x%02x`, s[i])
		case r == '\t':
			piece = "\t"
		case r < 0x20 || r == 0x7f:
			piece = fmt.Sprintf(`\x%02x`, r)
		case r >= 0x80 && r < 0xa0, isBidiControl(r):
			piece = fmt.Sprintf(`\u%04x`, r)
		default:
			piece = s[i : i+size]
		}
		pn := utf8.RuneCountInString(piece)
		if n+pn > width-1 && (n+pn > width || i+size < len(s)) {
			b.WriteString("…")
			return b.String()
		}
		b.WriteString(piece)
		n += pn
		i += size
	}
	return b.String()
}

// isBidiControl reports the Unicode bidirectional embedding, override and
// isolate characters, which reorder what the terminal shows.
func isBidiControl(r rune) bool {
	return r >= 0x202a && r <= 0x202e || r >= 0x2066 && r <= 0x2069 || r == 0x200e || r == 0x200f || r == 0x061c
}

// Widths of table cells on the terminal, in runes: names and sizes, the
// source position of a member, its first message.
const (
	cellWidth = 40
	// lastCellWidth bounds a table's last column (writeTable): long
	// enough for a formula with its numbers and reference, still a bound
	// against a hostile text
	lastCellWidth = 400
	sourceWidth   = 72
	messageWidth  = 120
)
