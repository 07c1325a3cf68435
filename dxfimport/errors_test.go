package dxfimport

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// marked strips the position marker: a line that starts with "∑" is where
// the error must be reported (as encoding/csv's tests mark positions). It
// returns the input and the 1-based marked line (0 when none).
func marked(s string) (string, int) {
	lines := strings.Split(s, "\n")
	at := 0
	for i, l := range lines {
		if strings.HasPrefix(l, "∑") {
			lines[i] = strings.TrimPrefix(l, "∑")
			at = i + 1
		}
	}
	return strings.Join(lines, "\n"), at
}

// Refusals: each input is malformed in one way (DXF pair structure per the
// Autodesk DXF Reference, "DXF Format"; common practice, no source for the
// wording). Line is the marked line unless the case gives one.
func TestRefusals(t *testing.T) {
	cases := []struct {
		name string
		in   string
		err  error
		code int
		line int // used when the input has no marker
		msg  string
	}{
		{name: "binary DXF", in: "∑AutoCAD Binary DXF\r\n\x1a\x00\x00\x00SECTION\x00", err: ErrBinary, code: -1,
			msg: "bin.dxf:1: binary DXF is not supported: save the drawing as ASCII DXF"},
		{name: "DWG R2013", in: "∑AC1027\x00\x00\x00\x00\x00\x07\x01\x1f", err: ErrDWG, code: -1},
		{name: "DWG R2000", in: "∑AC1015\x00\x00", err: ErrDWG, code: -1},
		{name: "empty", in: "", err: ErrEmpty, code: -1, line: 1},
		{name: "only blank lines", in: "\n  \r\n\n", err: ErrEmpty, code: -1, line: 1},
		{name: "odd line count", in: "0\nSECTION\n2\nENTITIES\n0\nLINE\n8\n0\n∑10", err: ErrTruncated, code: 10,
			msg: "bin.dxf:9: code 10: truncated file: group code 10 has no value line"},
		{name: "odd line count with newline", in: "0\nSECTION\n2\nENTITIES\n∑0\n", err: ErrTruncated, code: 0},
		{name: "ends inside entity", in: "0\nSECTION\n2\nENTITIES\n0\nLINE\n8\nA\n∑10\n1.0\n", err: ErrTruncated, code: -1},
		{name: "ends inside header", in: "0\nSECTION\n2\nHEADER\n9\n$ACADVER\n∑1\nAC1009\n", err: ErrTruncated, code: -1},
		{name: "ends after SECTION", in: "∑0\nSECTION\n", err: ErrTruncated, code: -1},
		{name: "no EOF marker", in: "0\nSECTION\n2\nENTITIES\n∑0\nENDSEC\n", err: ErrTruncated, code: -1,
			msg: "bin.dxf:5: truncated file: no 0/EOF marker after the last section: the file is cut off"},
		{name: "bad code", in: "0\nSECTION\n∑X2\nHEADER\n0\nENDSEC\n0\nEOF\n", err: ErrBadCode, code: -1,
			msg: `bin.dxf:3: bad group code: want an integer group code, got "X2"`},
		{name: "code out of range", in: "0\nSECTION\n2\nENTITIES\n∑2000\nx\n", err: ErrBadCode, code: -1},
		{name: "float group code", in: "0\nSECTION\n2\nENTITIES\n∑10.0\nx\n", err: ErrBadCode, code: -1},
		{name: "blank code line mid-file", in: "0\nSECTION\n∑\nHEADER\n0\nENDSEC\n", err: ErrBadCode, code: -1},
		{name: "bad number", in: "0\nSECTION\n2\nENTITIES\n0\nLINE\n5\n2F\n8\nJOIST\n∑ 20\n1,5\n0\nENDSEC\n0\nEOF\n",
			err: ErrBadNumber, code: 20,
			msg: `bin.dxf:11 (handle 2F): code 20: bad number: want a number in LINE, got "1,5"`},
		{name: "nan", in: "0\nSECTION\n2\nENTITIES\n0\nCIRCLE\n∑40\nnan\n0\nENDSEC\n0\nEOF\n", err: ErrBadNumber, code: 40},
		{name: "inf", in: "0\nSECTION\n2\nENTITIES\n0\nPOINT\n∑10\n1e999\n0\nENDSEC\n0\nEOF\n", err: ErrBadNumber, code: 10},
		{name: "bad $INSUNITS", in: "0\nSECTION\n2\nHEADER\n9\n$INSUNITS\n∑70\nmm\n0\nENDSEC\n0\nEOF\n", err: ErrBadNumber, code: 70},
		{name: "bad layer colour", in: "0\nSECTION\n2\nTABLES\n0\nTABLE\n2\nLAYER\n0\nLAYER\n2\nA\n∑62\nred\n0\nENDTAB\n0\nENDSEC\n0\nEOF\n",
			err: ErrBadNumber, code: 62},
		{name: "bad MINSERT count", in: "0\nSECTION\n2\nENTITIES\n0\nINSERT\n2\nB\n∑70\n2.5\n0\nENDSEC\n0\nEOF\n", err: ErrBadNumber, code: 70},
		{name: "not a section", in: "∑0\nLINE\n0\nEOF\n", err: ErrStructure, code: 0},
		{name: "section without name", in: "0\nSECTION\n∑8\nHEADER\n", err: ErrStructure, code: 8},
		{name: "pair outside entity", in: "0\nSECTION\n2\nENTITIES\n∑8\nA\n", err: ErrStructure, code: 8},
		{name: "vertex y before x", in: "0\nSECTION\n2\nENTITIES\n0\nLWPOLYLINE\n∑20\n1\n0\nENDSEC\n0\nEOF\n", err: ErrStructure, code: 20},
		{name: "line too long", in: "0\nSECTION\n2\nHEADER\n9\n∑" + strings.Repeat("x", MaxLineBytes+10) + "\n", err: ErrLineTooLong, code: -1},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			in, line := marked(c.in)
			if line == 0 {
				line = c.line
			}
			d, err := Read(strings.NewReader(in), "bin.dxf", Options{})
			if err == nil {
				t.Fatalf("no error; read %d entities", len(d.Entities))
			}
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v is %T, want *ParseError", err, err)
			}
			if !errors.Is(err, c.err) || pe.Line != line || pe.Code != c.code || pe.File != "bin.dxf" {
				t.Errorf("got %v (line %d, code %d), want %v at line %d, code %d", err, pe.Line, pe.Code, c.err, line, c.code)
			}
			if c.msg != "" && err.Error() != c.msg {
				t.Errorf("message\n got %s\nwant %s", err, c.msg)
			}
		})
	}
}

func TestBadUnitsOption(t *testing.T) {
	_, err := Read(strings.NewReader("0\nEOF\n"), "u.dxf", Options{Units: "yd"})
	if !errors.Is(err, ErrUnits) {
		t.Errorf("got %v, want ErrUnits", err)
	}
}

// errReader fails after its data, as a broken disk or network file would.
type errReader struct{ data string }

func (e *errReader) Read(p []byte) (int, error) {
	if e.data == "" {
		return 0, errors.New("disk on fire")
	}
	n := copy(p, e.data)
	e.data = e.data[n:]
	return n, nil
}

func TestReadErrorHasPosition(t *testing.T) {
	_, err := Read(&errReader{data: "0\nSECTION\n2\nENTITIES\n"}, "io.dxf", Options{})
	var pe *ParseError
	if !errors.As(err, &pe) || pe.Line != 5 || err.Error() != "io.dxf:5: disk on fire" {
		t.Errorf("got %v", err)
	}
}

// TestCutFixtures cuts each ezdxf fixture after every line before its
// final 0/EOF pair: every prefix must be refused as truncated (and never
// read as a smaller drawing), with the error at a line of the prefix.
func TestCutFixtures(t *testing.T) {
	files, _ := filepath.Glob("testdata/*.dxf")
	for _, path := range files {
		b, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		lines := strings.SplitAfter(string(b), "\n")
		for len(lines) > 0 && strings.TrimSpace(lines[len(lines)-1]) == "" {
			lines = lines[:len(lines)-1]
		}
		end := 0
		for k := 0; k < len(lines)-2; k++ {
			end += len(lines[k])
			_, err := Read(bytes.NewReader(b[:end]), "cut.dxf", Options{})
			var pe *ParseError
			if !errors.Is(err, ErrTruncated) || !errors.As(err, &pe) || pe.Line < 1 || pe.Line > k+1 {
				t.Fatalf("%s cut after line %d: got %v", path, k+1, err)
			}
		}
	}
}

// TestPosString: a place is written file:line (handle H, layer L), each
// part only when known, as the findings and the outputs name it. Common
// practice, no source.
func TestPosString(t *testing.T) {
	for _, c := range []struct {
		p    Pos
		want string
	}{
		{Pos{}, ""},
		{Pos{File: "plan.dxf"}, "plan.dxf"},
		{Pos{File: "plan.dxf", Line: 1233}, "plan.dxf:1233"},
		{Pos{File: "plan.dxf", Line: -4}, "plan.dxf"},
		{Pos{File: "plan.dxf", Line: 7, Handle: "3E"}, "plan.dxf:7 (handle 3E)"},
		{Pos{File: "plan.dxf", Line: 7, Layer: "JOIST-FLOOR"}, "plan.dxf:7 (layer JOIST-FLOOR)"},
		{Pos{File: "a b.dxf", Line: 1233, Handle: "3E", Layer: "JOIST-FLOOR"}, "a b.dxf:1233 (handle 3E, layer JOIST-FLOOR)"},
		{Pos{Handle: "1F", Layer: "L"}, " (handle 1F, layer L)"},
	} {
		if got := c.p.String(); got != c.want {
			t.Errorf("%#v: %q, want %q", c.p, got, c.want)
		}
	}
}
