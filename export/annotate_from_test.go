package export

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"os"
	"path/filepath"
	"runtime"
	"testing"
	"time"
)

// The annotated copy made from the file once the scan has let go of the
// drawing's bytes (Detach, AnnotateScanFrom) is the one AnnotateBytes
// makes, byte for byte; a file written over in place since it was checked
// (other bytes of the same length, or a byte more) gets no copy and the
// error says so (common practice, no source: the same bytes in, the same
// file out; a changed input is never annotated as the checked one).
func TestAnnotateScanFromFile(t *testing.T) {
	for _, tc := range []struct {
		file   string
		toInch float64
	}{{"plan_r12.dxf", 1}, {"plan_r2000.dxf", 12}, {"plan_min_r12.dxf", 1}} {
		t.Run(tc.file, func(t *testing.T) {
			input := mustReadFile(t, filepath.Join("testdata", tc.file))
			dir := t.TempDir()
			src := filepath.Join(dir, "plan.dxf")
			if err := os.WriteFile(src, input, 0o644); err != nil {
				t.Fatal(err)
			}
			sum := sha256.Sum256(input)
			hexSum := hex.EncodeToString(sum[:])
			want, got := filepath.Join(dir, "want.dxf"), filepath.Join(dir, "got.dxf")
			if err := AnnotateBytes(input, src, want, fixtureMarkup(t, tc.toInch)); err != nil {
				t.Fatal(err)
			}
			f, err := os.Open(src)
			if err != nil {
				t.Fatal(err)
			}
			defer f.Close()
			scan := ScanDrawing(bytes.Clone(input), src)
			scan.Detach()
			if err := AnnotateScanFrom(f, int64(len(input)), hexSum, src, got, fixtureMarkup(t, tc.toInch), scan); err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(mustReadFile(t, want), mustReadFile(t, got)) {
				t.Fatal("the copy from the file differs from AnnotateBytes'")
			}
			// the scan used: the file is scanned again, from its start
			if _, err := f.Seek(0, 0); err != nil {
				t.Fatal(err)
			}
			os.Remove(got)
			if err := AnnotateScanFrom(f, int64(len(input)), hexSum, src, got, fixtureMarkup(t, tc.toInch), scan); err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(mustReadFile(t, want), mustReadFile(t, got)) {
				t.Fatal("the copy from the file, scanned again, differs from AnnotateBytes'")
			}
			os.Remove(got)
			// written over in place: one letter of a layer name changed,
			// a byte added at the end, the drawing cut in half (the copy
			// fails midway: still said to be a changed drawing, not one
			// that cannot be annotated)
			changed := bytes.Clone(input)
			i := bytes.Index(changed, []byte("\nJOIST"))
			if i < 0 {
				t.Fatal("no JOIST layer name in the fixture")
			}
			changed[i+1] = 'K'
			for _, other := range [][]byte{changed, append(bytes.Clone(input), '\n'), input[:len(input)/2]} {
				if err := os.WriteFile(src, other, 0o644); err != nil {
					t.Fatal(err)
				}
				if _, err := f.Seek(0, 0); err != nil {
					t.Fatal(err)
				}
				scan := ScanDrawing(bytes.Clone(input), src)
				scan.Detach()
				err := AnnotateScanFrom(f, int64(len(input)), hexSum, src, got, fixtureMarkup(t, tc.toInch), scan)
				if !errors.Is(err, ErrDrawingChanged) {
					t.Fatalf("drawing written over: error %v, want ErrDrawingChanged", err)
				}
				if _, err := os.Stat(got); !os.IsNotExist(err) {
					t.Fatalf("drawing written over: a copy was written (%v)", err)
				}
				if ents, _ := os.ReadDir(dir); len(ents) != 2 {
					t.Fatalf("drawing written over: %d files left in the folder, want the plan and want.dxf", len(ents))
				}
			}
		})
	}
}

// Detach lets go of the drawing's bytes: nothing the scan keeps points
// into them (the scan of bytes in memory takes its strings from them
// without copying), so they are collected once the caller drops them
// (common practice, no source).
func TestDetachFreesDrawing(t *testing.T) {
	input := bytes.Clone(mustReadFile(t, filepath.Join("testdata", "plan_r2000.dxf")))
	freed := make(chan struct{})
	runtime.AddCleanup(&input[0], func(ch chan struct{}) { close(ch) }, freed)
	scan := ScanDrawing(input, "plan_r2000.dxf")
	scan.Detach()
	input = nil
	for i := 0; i < 50; i++ {
		runtime.GC()
		select {
		case <-freed:
			if scan.facts == nil || len(scan.facts.Layers) == 0 {
				t.Fatal("the scan lost its facts")
			}
			for k := range scan.facts.Layers {
				_ = k + scan.facts.Version // still readable
			}
			return
		case <-time.After(10 * time.Millisecond):
		}
	}
	t.Fatal("the drawing's bytes are still held after Detach")
}
