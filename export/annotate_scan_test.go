package export

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"
)

// The annotated copy made with the drawing scanned ahead (ScanDrawing) is
// the one AnnotateBytes makes, byte for byte, for each fixture flavour; a
// scan of other bytes, or one used already, is not trusted: the drawing
// is scanned again (common practice, no source: the same bytes in, the
// same file out).
func TestAnnotateScannedAsAnnotateBytes(t *testing.T) {
	for _, tc := range []struct {
		file   string
		toInch float64
	}{{"plan_r12.dxf", 1}, {"plan_r2000.dxf", 12}, {"plan_min_r12.dxf", 1}} {
		t.Run(tc.file, func(t *testing.T) {
			src := filepath.Join("testdata", tc.file)
			input, err := os.ReadFile(src)
			if err != nil {
				t.Fatal(err)
			}
			dir := t.TempDir()
			want, got := filepath.Join(dir, "want.dxf"), filepath.Join(dir, "got.dxf")
			if err := AnnotateBytes(input, src, want, fixtureMarkup(t, tc.toInch)); err != nil {
				t.Fatal(err)
			}
			same := func(what string) {
				t.Helper()
				if !bytes.Equal(mustReadFile(t, want), mustReadFile(t, got)) {
					t.Fatalf("%s: the copy differs from AnnotateBytes'", what)
				}
			}
			scan := ScanDrawing(input, src)
			if err := AnnotateScanned(input, src, got, fixtureMarkup(t, tc.toInch), scan); err != nil {
				t.Fatal(err)
			}
			same("scanned ahead")
			// used once: the second copy scans again
			if err := AnnotateScanned(input, src, got, fixtureMarkup(t, tc.toInch), scan); err != nil {
				t.Fatal(err)
			}
			same("scan used twice")
			// a scan of other bytes (the drawing's first half) is not used
			other := bytes.Clone(input)
			if err := AnnotateScanned(input, src, got, fixtureMarkup(t, tc.toInch), ScanDrawing(other[:len(other)/2], src)); err != nil {
				t.Fatal(err)
			}
			same("scan of other bytes")
			if err := AnnotateScanned(input, src, got, fixtureMarkup(t, tc.toInch), nil); err != nil {
				t.Fatal(err)
			}
			same("no scan")
		})
	}
	// the input named as the output is refused before any scan is waited for
	input, _ := os.ReadFile(filepath.Join("testdata", "plan_r12.dxf"))
	src := filepath.Join("testdata", "plan_r12.dxf")
	if err := AnnotateScanned(input, src, src, fixtureMarkup(t, 1), ScanDrawing(input, src)); err == nil {
		t.Fatal("the input drawing as the output was not refused")
	}
}

func mustReadFile(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// The pairs read from a drawing in memory, without a copy, are those read
// through a reader (common practice, no source): every fixture, a file
// ending without a newline, CR LF endings and a line longer than the
// reader's buffer.
func TestBytesPairReaderAsReader(t *testing.T) {
	inputs := map[string][]byte{
		"no final newline": []byte("  0\nSECTION\n  2\nENTITIES\n  0\nENDSEC\n  0\nEOF"),
		"crlf":             []byte("  0\r\nSECTION\r\n  2\r\nHEADER\r\n  0\r\nENDSEC\r\n  0\r\nEOF\r\n"),
		"long line":        []byte("  0\nSECTION\n  1\n" + string(bytes.Repeat([]byte("x"), 200_000)) + "\n  0\nEOF\n"),
		"empty":            nil,
		"odd":              []byte("  0\nSECTION\n  2\n"),
	}
	for _, f := range []string{"plan_r12.dxf", "plan_r2000.dxf", "plan_min_r12.dxf"} {
		inputs[f] = mustReadFile(t, filepath.Join("testdata", f))
	}
	for name, in := range inputs {
		a, b := newPairReader(bytes.NewReader(in), name), newBytesPairReader(in, name)
		for i := 0; ; i++ {
			pa, ea := a.next()
			pb, eb := b.next()
			if pa != pb || (ea == nil) != (eb == nil) || (ea != nil && ea.Error() != eb.Error()) {
				t.Fatalf("%s: pair %d: %+v, %v from the reader; %+v, %v from memory", name, i, pa, ea, pb, eb)
			}
			if ea != nil {
				break
			}
		}
	}
}
