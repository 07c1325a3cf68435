package dxfimport

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// writeSubset writes the LINE and LWPOLYLINE entities of d as a minimal
// R2000 ASCII DXF in inches: the subset the annotated-DXF export uses.
// Test-only; strings are written with \U+XXXX escapes for backslashes and
// control characters so that any name the reader produced reads back.
func writeSubset(w io.Writer, d *Drawing) error {
	var b bytes.Buffer
	pair := func(code int, v string) { fmt.Fprintf(&b, "%3d\n%s\n", code, v) }
	num := func(code int, f float64) { pair(code, strconv.FormatFloat(f, 'g', -1, 64)) }
	pair(0, "SECTION")
	pair(2, "HEADER")
	pair(9, "$ACADVER")
	pair(1, "AC1015")
	pair(9, "$INSUNITS")
	pair(70, "1")
	pair(0, "ENDSEC")
	pair(0, "SECTION")
	pair(2, "ENTITIES")
	for _, e := range d.Entities {
		switch e.Kind {
		case KindLine:
			pair(0, "LINE")
		case KindLWPolyline:
			pair(0, "LWPOLYLINE")
		default:
			continue
		}
		if e.Pos.Handle != "" {
			pair(5, e.Pos.Handle) // the reader keeps handles raw: no escapes
		}
		pair(8, escapeString(e.Pos.Layer))
		if e.Kind == KindLine {
			num(10, e.Points[0].X)
			num(20, e.Points[0].Y)
			num(11, e.Points[1].X)
			num(21, e.Points[1].Y)
			continue
		}
		pair(90, strconv.Itoa(len(e.Points)))
		flags := 0
		if e.Closed {
			flags = 1
		}
		pair(70, strconv.Itoa(flags))
		for i, p := range e.Points {
			num(10, p.X)
			num(20, p.Y)
			if e.Bulges != nil && e.Bulges[i] != 0 {
				num(42, e.Bulges[i])
			}
		}
	}
	pair(0, "ENDSEC")
	pair(0, "EOF")
	_, err := w.Write(b.Bytes())
	return err
}

func escapeString(s string) string {
	var sb strings.Builder
	for _, r := range s {
		if r < 0x20 || r == 0x7f || r == '\\' {
			fmt.Fprintf(&sb, `\U+%04X`, r)
		} else {
			sb.WriteRune(r)
		}
	}
	return sb.String()
}

// subset returns the LINE/LWPOLYLINE entities of d in a comparable form.
func subset(d *Drawing) []string {
	var out []string
	for _, e := range d.Entities {
		if e.Kind != KindLine && e.Kind != KindLWPolyline {
			continue
		}
		out = append(out, fmt.Sprintf("%s %q %q %v %v %v", e.Kind, e.Pos.Handle, e.Pos.Layer, e.Points, e.Bulges, e.Closed))
	}
	return out
}

func FuzzRead(f *testing.F) {
	seeds, _ := filepath.Glob("testdata/*.dxf")
	for _, s := range seeds {
		b, err := os.ReadFile(s)
		if err == nil {
			f.Add(b)
		}
	}
	f.Add([]byte(section("ENTITIES", dxf(0, "LWPOLYLINE", 8, "J", 90, 2, 70, 1, 10, 1, 20, 2, 42, 0.5, 10, 3, 20, 4)) + dxf(0, "EOF")))
	f.Add([]byte(section("BLOCKS", blockDef("B", 1, 1, dxf(0, "LINE", 8, "0", 10, 0, 20, 0, 11, 1, 21, 0), dxf(0, "INSERT", 2, "B"))) +
		section("ENTITIES", dxf(0, "INSERT", 8, "L", 2, "B", 70, 3, 71, 3, 44, 1, 45, 1, 230, -1))))
	f.Add([]byte("AutoCAD Binary DXF\r\n\x1a\x00"))
	f.Fuzz(func(t *testing.T, in []byte) {
		opt := Options{MaxEntities: 20000}
		d, err := Read(bytes.NewReader(in), "fuzz.dxf", opt)
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Line < 1 || pe.Err == nil {
				t.Fatalf("error %v (%T) is not a *ParseError with Line >= 1", err, err)
			}
			return
		}
		var buf bytes.Buffer
		if err := writeSubset(&buf, d); err != nil {
			t.Fatal(err)
		}
		d2, err := Read(&buf, "fuzz2.dxf", opt)
		if err != nil {
			t.Fatalf("re-reading our own output: %v\n%s", err, buf.String())
		}
		a, b := subset(d), subset(d2)
		if len(a) != len(b) {
			t.Fatalf("round trip: %d entities, then %d", len(a), len(b))
		}
		for i := range a {
			if a[i] != b[i] {
				t.Fatalf("round trip entity %d:\n%s\n%s", i, a[i], b[i])
			}
		}
	})
}
