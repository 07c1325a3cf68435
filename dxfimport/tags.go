package dxfimport

import (
	"bufio"
	"bytes"
	"errors"
	"io"
	"math"
	"strconv"
)

// Tag is one DXF group: a group code and its value. Line is 1-based, the
// line of the group code; the value is on Line+1.
type Tag struct {
	Code  int
	Value string
	Line  int
}

// binarySentinel starts every binary DXF file.
const binarySentinel = "AutoCAD Binary DXF"

// TagReader reads ASCII DXF group code / value pairs from a stream. It
// accepts LF and CRLF line ends and group codes padded with spaces. It
// keeps the 1-based line number of each pair. It does not buffer the
// input beyond one bufio block.
type TagReader struct {
	br     *bufio.Reader
	name   string
	line   int // lines consumed so far
	value  []byte
	code   int
	start  int // line of the last code
	long   []byte
	begun  bool
	sawAny bool
}

// NewTagReader returns a TagReader reading from r; name is used in errors.
func NewTagReader(r io.Reader, name string) *TagReader {
	return &TagReader{br: bufio.NewReaderSize(r, 64<<10), name: name}
}

// Next returns the next pair, or io.EOF after the last one. Any other
// error is a *ParseError.
func (t *TagReader) Next() (Tag, error) {
	if err := t.next(); err != nil {
		return Tag{}, err
	}
	return Tag{Code: t.code, Value: string(t.value), Line: t.start}, nil
}

// errAt returns a ParseError at line with code.
func (t *TagReader) errAt(line, code int, err error) *ParseError {
	if line < 1 {
		line = 1
	}
	return &ParseError{File: t.name, Line: line, Code: code, Err: err}
}

// readLine returns the next line without its line end. The slice is valid
// until the next call. At end of input it returns io.EOF.
func (t *TagReader) readLine() ([]byte, error) {
	b, err := t.br.ReadSlice('\n')
	if err == bufio.ErrBufferFull {
		t.long = append(t.long[:0], b...)
		for err == bufio.ErrBufferFull && len(t.long) <= MaxLineBytes {
			b, err = t.br.ReadSlice('\n')
			t.long = append(t.long, b...)
		}
		if len(t.long) > MaxLineBytes {
			return nil, t.errAt(t.line+1, -1, wrapf(ErrLineTooLong, "more than %d bytes", MaxLineBytes))
		}
		b = t.long
	}
	if err != nil && err != io.EOF {
		return nil, t.errAt(t.line+1, -1, err) // an I/O error, with its position
	}
	if len(b) == 0 && err == io.EOF {
		return nil, io.EOF
	}
	t.line++
	if n := len(b); n > 0 && b[n-1] == '\n' {
		b = b[:n-1]
	}
	if n := len(b); n > 0 && b[n-1] == '\r' {
		b = b[:n-1]
	}
	return b, nil
}

// sniff refuses binary DXF, DWG and empty input before the first pair.
// A UTF-8 byte-order mark, which some text tools add when they save a
// DXF, is skipped.
func (t *TagReader) sniff() error {
	if bom, _ := t.br.Peek(3); bytes.Equal(bom, []byte("\xef\xbb\xbf")) {
		t.br.Discard(3)
	}
	head, _ := t.br.Peek(len(binarySentinel))
	if bytes.HasPrefix(head, []byte(binarySentinel)) {
		return t.errAt(1, -1, ErrBinary)
	}
	if len(head) >= 6 && bytes.HasPrefix(head, []byte("AC10")) && isDigit(head[4]) && isDigit(head[5]) {
		return t.errAt(1, -1, wrapf(ErrDWG, "file starts with %q", head[:6]))
	}
	return nil
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

// next reads one pair into t.code, t.value (bytes, valid until the next
// call) and t.start.
func (t *TagReader) next() error {
	if !t.begun {
		t.begun = true
		if err := t.sniff(); err != nil {
			return err
		}
	}
	var cl []byte
	var err error
	for {
		cl, err = t.readLine()
		if err == io.EOF {
			if !t.sawAny {
				return t.errAt(1, -1, ErrEmpty)
			}
			return io.EOF
		}
		if err != nil {
			return err
		}
		// Blank lines at the very end of a file (after EOF) are common;
		// a blank code line elsewhere is an error, found below.
		if t.sawAny || len(bytes.TrimSpace(cl)) > 0 {
			break
		}
	}
	t.start = t.line
	code, ok := parseCode(cl)
	if !ok {
		if len(bytes.TrimSpace(cl)) == 0 {
			// Trailing white space after the last pair is harmless.
			if t.restIsBlank() {
				return io.EOF
			}
		}
		return t.errAt(t.start, -1, wrapf(ErrBadCode, "want an integer group code, got %q", clip(cl)))
	}
	t.sawAny = true
	t.code = code
	v, err := t.readLine()
	if err == io.EOF {
		return t.errAt(t.start, code, wrapf(ErrTruncated, "group code %d has no value line", code))
	}
	if err != nil {
		return err
	}
	t.value = v
	return nil
}

// restIsBlank consumes the rest of the input and reports whether it is
// only white space.
func (t *TagReader) restIsBlank() bool {
	for {
		l, err := t.readLine()
		if err != nil {
			return errors.Is(err, io.EOF)
		}
		if len(bytes.TrimSpace(l)) > 0 {
			return false
		}
	}
}

// parseCode parses a group-code line: an integer in -5..1071 with optional
// surrounding spaces.
func parseCode(b []byte) (int, bool) {
	i, j := 0, len(b)
	for i < j && (b[i] == ' ' || b[i] == '\t') {
		i++
	}
	for j > i && (b[j-1] == ' ' || b[j-1] == '\t') {
		j--
	}
	if i == j || j-i > 5 {
		return 0, false
	}
	neg := false
	if b[i] == '-' {
		neg = true
		i++
		if i == j {
			return 0, false
		}
	}
	n := 0
	for ; i < j; i++ {
		c := b[i]
		if !isDigit(c) {
			return 0, false
		}
		n = n*10 + int(c-'0')
	}
	if neg {
		n = -n
	}
	if n < -5 || n > 1071 {
		return 0, false
	}
	return n, true
}

// clip shortens b for an error message.
func clip(b []byte) string {
	if len(b) > 40 {
		return string(b[:40]) + "..."
	}
	return string(b)
}

// parseFloat parses a finite numeric value, allowing surrounding spaces.
func parseFloat(b []byte) (float64, bool) {
	b = bytes.TrimSpace(b)
	if f, ok := fastFloat(b); ok {
		return f, true
	}
	f, err := strconv.ParseFloat(string(b), 64)
	if err != nil || math.IsNaN(f) || math.IsInf(f, 0) {
		return 0, false
	}
	return f, true
}

// parseInt parses an integer value, allowing surrounding spaces. Some
// writers put a float such as "1.0" in an integer group; that is refused.
func parseInt(b []byte) (int, bool) {
	b = bytes.TrimSpace(b)
	n, err := strconv.ParseInt(string(b), 10, 64)
	if err != nil || n > 1<<31-1 || n < -(1<<31) {
		return 0, false
	}
	return int(n), true
}

// pow10 holds the powers of ten that float64 represents exactly.
var pow10 = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// fastFloat parses the plain decimals CAD programs write ("-12.500000")
// when they have at most 15 significant digits and 22 decimals: the
// mantissa and the power of ten are then exact in float64 and one
// correctly rounded division gives the same result as strconv.ParseFloat
// (Clinger's fast path). Anything else reports false and goes to strconv.
func fastFloat(s []byte) (float64, bool) {
	if len(s) == 0 {
		return 0, false
	}
	k, neg := 0, false
	if s[0] == '-' || s[0] == '+' {
		neg, k = s[0] == '-', 1
	}
	var mant uint64
	digits, frac := 0, 0
	dot, any := false, false
	for ; k < len(s); k++ {
		c := s[k]
		switch {
		case c >= '0' && c <= '9':
			any = true
			if dot {
				frac++
			}
			if mant == 0 && c == '0' {
				continue
			}
			if digits == 15 {
				return 0, false
			}
			mant = mant*10 + uint64(c-'0')
			digits++
		case c == '.' && !dot:
			dot = true
		default:
			return 0, false
		}
	}
	if !any || frac >= len(pow10) {
		return 0, false
	}
	f := float64(mant) / pow10[frac]
	if neg {
		f = -f
	}
	return f, true
}
