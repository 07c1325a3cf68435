package export

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
	"unsafe"
)

// ErrBinaryDXF is returned for a binary DXF input, which the annotator does
// not copy.
var ErrBinaryDXF = errors.New("binary DXF is not supported; save the drawing as ASCII DXF")

// ErrNoEOF is returned when an input drawing ends without its EOF marker.
var ErrNoEOF = errors.New("no EOF marker: the drawing looks truncated")

// DXFError reports malformed input met while copying a drawing. Line is
// 1-based and names the group-code line of the offending pair.
type DXFError struct {
	File string
	Line int
	Err  error
}

func (e *DXFError) Error() string {
	if e.Line > 0 {
		return fmt.Sprintf("%s:%d: %v", e.File, e.Line, e.Err)
	}
	return fmt.Sprintf("%s: %v", e.File, e.Err)
}

// Unwrap returns the cause.
func (e *DXFError) Unwrap() error { return e.Err }

// pair is one group-code/value pair with its raw lines, so that it can be
// written back byte for byte.
type pair struct {
	Code     int
	Value    string // trimmed of the line ending and surrounding spaces
	RawCode  string // the code line as read, line ending included
	RawValue string // the value line as read, line ending included
	Line     int    // 1-based line of the group code
	Off      int64  // byte offset of the code line in the input
}

// pairReader reads pairs from an ASCII DXF stream.
type pairReader struct {
	r    *bufio.Reader
	file string
	line int
	off  int64  // bytes read so far (the lines handed out)
	text []byte // chunk the lines are copied into (see readLine)
	// data, when mem is set, is the whole input in memory, never
	// written to: lines are handed out as strings over it, without a copy
	data []byte
	mem  bool
}

func newPairReader(r io.Reader, file string) *pairReader {
	return &pairReader{r: bufio.NewReaderSize(r, 1<<16), file: file}
}

// newBytesPairReader reads pairs from data, which must not change while
// the pairs (or strings taken from them) are in use.
func newBytesPairReader(data []byte, file string) *pairReader {
	return &pairReader{data: data, mem: true, file: file}
}

// readLine returns the next line with its ending, or io.EOF when nothing
// is left. Lines are copied into 64 KB chunks and handed out as strings
// sharing a chunk's bytes, one allocation per chunk rather than per line;
// bytes once handed out are never written again (a full chunk is
// replaced, not reused), so the strings stay immutable.
func (p *pairReader) readLine() (string, error) {
	if p.mem {
		rest := p.data[p.off:]
		if len(rest) == 0 {
			return "", io.EOF
		}
		n := len(rest)
		if i := bytes.IndexByte(rest, '\n'); i >= 0 {
			n = i + 1
		}
		p.line++
		p.off += int64(n)
		return unsafe.String(&rest[0], n), nil
	}
	b, err := p.r.ReadSlice('\n')
	if err == bufio.ErrBufferFull { // a line longer than the buffer
		long := append([]byte(nil), b...)
		for err == bufio.ErrBufferFull {
			b, err = p.r.ReadSlice('\n')
			long = append(long, b...)
		}
		b = long
	}
	if err == io.EOF && len(b) > 0 {
		err = nil
	}
	if err != nil {
		return "", err
	}
	p.line++
	p.off += int64(len(b))
	if cap(p.text)-len(p.text) < len(b) {
		p.text = make([]byte, 0, max(1<<16, len(b)))
	}
	start := len(p.text)
	p.text = append(p.text, b...)
	return unsafe.String(&p.text[start], len(b)), nil
}

// next returns the next pair; io.EOF at a clean end of input.
func (p *pairReader) next() (pair, error) {
	off := p.off
	codeLine, err := p.readLine()
	if err != nil {
		if err == io.EOF {
			return pair{}, io.EOF
		}
		return pair{}, &DXFError{File: p.file, Line: p.line + 1, Err: err}
	}
	line := p.line
	if line == 1 && strings.HasPrefix(codeLine, "AutoCAD Binary DXF") {
		return pair{}, &DXFError{File: p.file, Line: 1, Err: ErrBinaryDXF}
	}
	txt := strings.TrimSpace(strings.TrimPrefix(codeLine, "\uFEFF"))
	code, cerr := strconv.Atoi(txt)
	if cerr != nil {
		return pair{}, &DXFError{File: p.file, Line: line, Err: fmt.Errorf("group code %q: want an integer", txt)}
	}
	valueLine, err := p.readLine()
	if err != nil {
		if err == io.EOF {
			err = fmt.Errorf("group code %d has no value line", code)
		}
		return pair{}, &DXFError{File: p.file, Line: line, Err: err}
	}
	return pair{
		Code: code, Value: strings.TrimSpace(valueLine),
		RawCode: codeLine, RawValue: valueLine, Line: line, Off: off,
	}, nil
}

// dxfContext tracks where a stream of pairs is: section, table, and the
// record or entity being read. Call step with each pair in order.
type dxfContext struct {
	Section   string // upper-case section name, "" outside sections
	Table     string // upper-case table name inside TABLES, "" outside a table
	Record    string // upper-case value of the last 0 pair inside a section
	TableHead bool   // inside a TABLE before its first record
	wantSect  bool
	wantTable bool
}

func (c *dxfContext) step(p pair) {
	if p.Code == 0 {
		v := strings.ToUpper(p.Value)
		switch v {
		case "SECTION":
			c.Section, c.Table, c.Record, c.wantSect = "", "", "", true
		case "ENDSEC":
			c.Section, c.Table, c.Record, c.TableHead = "", "", "", false
		case "TABLE":
			c.Table, c.Record, c.TableHead, c.wantTable = "", "", true, true
		case "ENDTAB":
			c.Table, c.Record, c.TableHead = "", "", false
		default:
			c.Record, c.TableHead = v, false
		}
		return
	}
	if p.Code == 2 && c.wantSect {
		c.Section, c.wantSect = strings.ToUpper(p.Value), false
		return
	}
	if p.Code == 2 && c.wantTable {
		c.Table, c.wantTable = strings.ToUpper(p.Value), false
	}
}
