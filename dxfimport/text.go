package dxfimport

import (
	"strings"
	"unicode/utf8"
)

// cp1252High maps bytes 0x80..0x9F of Windows code page 1252 to Unicode
// (Unicode Consortium mapping table CP1252.TXT; checked against Python's
// cp1252 codec). The five bytes the code page leaves undefined map to the
// C1 control of the same value, as Windows' own conversion does. Bytes
// 0xA0..0xFF equal their Latin-1 code points.
var cp1252High = [32]rune{
	0x20AC, 0x0081, 0x201A, 0x0192, 0x201E, 0x2026, 0x2020, 0x2021,
	0x02C6, 0x2030, 0x0160, 0x2039, 0x0152, 0x008D, 0x017D, 0x008F,
	0x0090, 0x2018, 0x2019, 0x201C, 0x201D, 0x2022, 0x2013, 0x2014,
	0x02DC, 0x2122, 0x0161, 0x203A, 0x0153, 0x009D, 0x017E, 0x0178,
}

// decodeCP1252 converts Windows-1252 bytes to a UTF-8 string.
func decodeCP1252(b []byte) string {
	var sb strings.Builder
	sb.Grow(len(b) + 8)
	for _, c := range b {
		switch {
		case c < 0x80:
			sb.WriteByte(c)
		case c < 0xA0:
			sb.WriteRune(cp1252High[c-0x80])
		default:
			sb.WriteRune(rune(c))
		}
	}
	return sb.String()
}

// isASCII reports whether b holds only 7-bit bytes.
func isASCII(b []byte) bool {
	for _, c := range b {
		if c >= 0x80 {
			return false
		}
	}
	return true
}

// decodeEscapes replaces the DXF escapes \U+XXXX (four hex digits, a
// Unicode code point) with the character itself.
func decodeEscapes(s string) string {
	i := strings.Index(s, `\U+`)
	if i < 0 {
		return s
	}
	var sb strings.Builder
	for i >= 0 {
		sb.WriteString(s[:i])
		if r, ok := hex4(s[i+3:]); ok {
			sb.WriteRune(r)
			s = s[i+7:]
		} else {
			sb.WriteString(`\U+`)
			s = s[i+3:]
		}
		i = strings.Index(s, `\U+`)
	}
	sb.WriteString(s)
	return sb.String()
}

// hex4 parses four hex digits at the start of s.
func hex4(s string) (rune, bool) {
	if len(s) < 4 {
		return 0, false
	}
	var r rune
	for i := 0; i < 4; i++ {
		c := s[i]
		switch {
		case c >= '0' && c <= '9':
			r = r<<4 | rune(c-'0')
		case c >= 'a' && c <= 'f':
			r = r<<4 | rune(c-'a'+10)
		case c >= 'A' && c <= 'F':
			r = r<<4 | rune(c-'A'+10)
		default:
			return 0, false
		}
	}
	if !utf8.ValidRune(r) {
		r = utf8.RuneError
	}
	return r, true
}

// plainText returns the text of a TEXT entity with the %% control codes
// resolved: %%d degree, %%p plus/minus, %%c diameter (shown as Ø, as
// ezdxf does), %%% a percent sign; the toggles %%u, %%o, %%k are removed.
func plainText(s string) string {
	if !strings.Contains(s, "%%") {
		return s
	}
	var sb strings.Builder
	for i := 0; i < len(s); i++ {
		if s[i] == '%' && i+2 < len(s) && s[i+1] == '%' {
			switch s[i+2] | 0x20 {
			case 'd':
				sb.WriteString("°")
				i += 2
				continue
			case 'p':
				sb.WriteString("±")
				i += 2
				continue
			case 'c':
				sb.WriteString("Ø")
				i += 2
				continue
			case 'u', 'o', 'k':
				i += 2
				continue
			}
			if s[i+2] == '%' {
				sb.WriteByte('%')
				i += 2
				continue
			}
		}
		sb.WriteByte(s[i])
	}
	return sb.String()
}

// plainMText strips MTEXT inline formatting: \P and \N become "\n", \~ a
// space, ^I four spaces; \L \l \O \o \K \k \X are dropped; codes with an
// argument (\A \C \c \F \f \H \Q \T \W \p) are dropped up to their ';';
// a stack \Sup^ low; (AutoCAD writes a space after ^) becomes "up^low",
// \Sup/low; "up/low" (the divider kept); braces are
// removed; \\ \{ \} give the character. A paragraph break at the very
// end gives no trailing newline (as ezdxf's plain_mtext).
func plainMText(s string) string {
	if !strings.ContainsAny(s, `\{}^`) {
		return s
	}
	var sb strings.Builder
	endsWithBreak := false
	for i := 0; i < len(s); i++ {
		c := s[i]
		endsBreakHere := false
		switch {
		case c == '{' || c == '}':
			endsBreakHere = endsWithBreak
		case c == '^' && i+1 < len(s):
			switch s[i+1] {
			case 'I':
				sb.WriteString("    ")
			case 'J':
				sb.WriteByte('\n')
			case ' ':
				sb.WriteByte('^')
			default:
				sb.WriteByte('^')
				sb.WriteByte(s[i+1])
			}
			i++
		case c == '\\' && i+1 < len(s):
			i++
			switch d := s[i]; d {
			case 'P', 'N':
				sb.WriteByte('\n')
				endsBreakHere = true
			case '~':
				sb.WriteByte(' ')
			case '\\', '{', '}':
				sb.WriteByte(d)
			case 'L', 'l', 'O', 'o', 'K', 'k', 'X':
				endsBreakHere = endsWithBreak
			case 'A', 'C', 'c', 'F', 'f', 'H', 'Q', 'T', 'W', 'p':
				j := strings.IndexByte(s[i:], ';')
				if j < 0 {
					i = len(s)
				} else {
					i += j
				}
				endsBreakHere = endsWithBreak
			case 'S':
				j := strings.IndexByte(s[i:], ';')
				if j < 0 {
					j = len(s) - i
				}
				stack := s[i+1 : i+j]
				stack = strings.NewReplacer("^ ", "^", `\^`, "^", `\/`, "/", `\#`, "#").Replace(stack)
				sb.WriteString(stack)
				i += j
			default:
				sb.WriteByte(d)
			}
		default:
			sb.WriteByte(c)
		}
		endsWithBreak = endsBreakHere
	}
	out := sb.String()
	if endsWithBreak {
		out = out[:len(out)-1]
	}
	return out
}
