package export

import (
	"bufio"
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// annotateBytes runs both passes of Annotate on in, in memory.
func annotateBytes(in []byte, m *Markup) ([]byte, error) {
	facts, err := scanDXF(bytes.NewReader(in), "fuzz.dxf")
	if err != nil {
		return nil, err
	}
	var out bytes.Buffer
	w := bufio.NewWriter(&out)
	if err := copyEdited(bytes.NewReader(in), "fuzz.dxf", w, facts, m); err != nil {
		return nil, err
	}
	if err := w.Flush(); err != nil {
		return nil, err
	}
	return out.Bytes(), nil
}

// FuzzAnnotate: never panics; every error is a *DXFError with Line >= 0;
// when it succeeds, the output reads to EOF and holds our markup.
func FuzzAnnotate(f *testing.F) {
	for _, name := range []string{"plan_r12.dxf", "plan_r2000.dxf", "plan_min_r12.dxf"} {
		b, err := os.ReadFile(filepath.Join("testdata", name))
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b)
	}
	f.Add([]byte("  0\nEOF\n"))
	f.Add([]byte("  0\nSECTION\n  2\nHEADER\n  9\n$ACADVER\n  1\nAC1015\n  0\nENDSEC\n  0\nEOF\n"))
	m := MarkupFromResults(&Results{Members: []Member{
		{ID: "M1", Start: [2]float64{0, 0}, End: [2]float64{100, 0}, Status: StatusFail, MaxRatio: 1.2},
	}}, 1)
	f.Fuzz(func(t *testing.T, in []byte) {
		out, err := annotateBytes(in, &m)
		// The range copy writes what the pair-by-pair copy wrote.
		ref, refErr := annotateBytesReference(in, &m)
		if (err == nil) != (refErr == nil) && !sectionThenEOF(in) {
			t.Fatalf("range copy error %v, pair-by-pair copy error %v", err, refErr)
		}
		if err == nil && refErr == nil && !bytes.Equal(out, ref) {
			t.Fatalf("range copy differs from the pair-by-pair copy")
		}
		// The copy from a scan that let go of the bytes (Detach), read
		// through a hash, is the same; one byte more is refused.
		if err == nil {
			scan := ScanDrawing(bytes.Clone(in), "fuzz.dxf")
			scan.Detach()
			if scan.err != nil {
				t.Fatalf("the scan ahead failed (%v) where the copy did not", scan.err)
			}
			sum := sha256.Sum256(in)
			var buf bytes.Buffer
			w := bufio.NewWriter(&buf)
			if cerr := copyChecked(bytes.NewReader(in), int64(len(in)), hex.EncodeToString(sum[:]), "fuzz.dxf", w, scan.facts, &m); cerr != nil {
				t.Fatalf("checked copy: %v", cerr)
			}
			w.Flush()
			if !bytes.Equal(buf.Bytes(), out) {
				t.Fatal("the checked copy from a detached scan differs from the copy")
			}
			scan = ScanDrawing(bytes.Clone(in), "fuzz.dxf")
			scan.Detach()
			longer := append(bytes.Clone(in), ' ')
			if cerr := copyChecked(bytes.NewReader(longer), int64(len(in)), hex.EncodeToString(sum[:]), "fuzz.dxf",
				bufio.NewWriter(io.Discard), scan.facts, &m); !errors.Is(cerr, ErrDrawingChanged) {
				t.Fatalf("a byte more: %v, want ErrDrawingChanged", cerr)
			}
		}
		if err != nil {
			var de *DXFError
			if !errors.As(err, &de) || de.Line < 0 {
				t.Fatalf("error %v (%T) is not a *DXFError", err, err)
			}
			return
		}
		pr := newPairReader(bytes.NewReader(out), "out.dxf")
		var ctx dxfContext
		ours := 0
		for {
			p, err := pr.next()
			if err == io.EOF {
				t.Fatal("output has no EOF")
			}
			if err != nil {
				t.Fatalf("output unreadable: %v", err)
			}
			ctx.step(p)
			if p.Code == 0 && strings.EqualFold(p.Value, "EOF") {
				break
			}
			if p.Code == 8 && strings.HasPrefix(p.Value, "FC-") && ctx.Section == "ENTITIES" {
				ours++
			}
		}
		// The input may hold FC- entities of its own; ours are at least 2.
		if ours < markupEntityCount(&m) {
			t.Fatalf("%d markup entities in ENTITIES, want at least %d", ours, markupEntityCount(&m))
		}
	})
}

// annotateBytesReference is annotateBytes with the pair-by-pair copy of
// annotate_ref_test.go.
func annotateBytesReference(in []byte, m *Markup) ([]byte, error) {
	facts, err := scanDXF(bytes.NewReader(in), "fuzz.dxf")
	if err != nil {
		return nil, err
	}
	var out bytes.Buffer
	w := bufio.NewWriter(&out)
	if err := copyAnnotated(newPairReader(bytes.NewReader(in), "fuzz.dxf"), w, facts, m); err != nil {
		return nil, err
	}
	if err := w.Flush(); err != nil {
		return nil, err
	}
	return out.Bytes(), nil
}

// sectionThenEOF reports whether a 0/SECTION pair is followed directly by
// the EOF pair: the pair-by-pair copy took EOF for the section's name and
// read on; the range copy reports the drawing as malformed.
func sectionThenEOF(in []byte) bool {
	pr := newPairReader(bytes.NewReader(in), "x")
	prevSection := false
	for {
		p, err := pr.next()
		if err != nil {
			return false
		}
		eof := p.Code == 0 && strings.EqualFold(p.Value, "EOF")
		if eof && prevSection {
			return true
		}
		if eof {
			return false
		}
		prevSection = p.Code == 0 && strings.EqualFold(p.Value, "SECTION")
	}
}

// TestAnnotateSameAsPairCopy: on the test plans (R12, R2000, minimal) and
// a synthetic plan of the kind samples/bigplan writes, the range copy
// writes the same bytes as the pair-by-pair copy. Common practice, no
// source.
func TestAnnotateSameAsPairCopy(t *testing.T) {
	m := fixtureMarkup(t, 1)
	for _, name := range []string{"plan_r12.dxf", "plan_r2000.dxf", "plan_min_r12.dxf"} {
		in, err := os.ReadFile(filepath.Join("testdata", name))
		if err != nil {
			t.Fatal(err)
		}
		got, err := annotateBytes(in, &m)
		if err != nil {
			t.Fatal(err)
		}
		want, err := annotateBytesReference(in, &m)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(got, want) {
			t.Errorf("%s: range copy differs from the pair-by-pair copy", name)
		}
	}
}
