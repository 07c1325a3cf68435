package export

import (
	"bufio"
	"fmt"
	"os"
	"path/filepath"
	"testing"
)

// writeBigPlan writes an R12 drawing with n joists at 16 in on centre,
// the layout of bigResults.
func writeBigPlan(b *testing.B, path string, n int) {
	f, err := os.Create(path)
	if err != nil {
		b.Fatal(err)
	}
	w := bufio.NewWriter(f)
	fmt.Fprint(w, "  0\nSECTION\n  2\nHEADER\n  9\n$ACADVER\n  1\nAC1009\n  0\nENDSEC\n")
	fmt.Fprint(w, "  0\nSECTION\n  2\nTABLES\n  0\nTABLE\n  2\nLAYER\n 70\n1\n  0\nLAYER\n  2\nJOIST\n 70\n0\n 62\n3\n  6\nCONTINUOUS\n  0\nENDTAB\n  0\nENDSEC\n")
	fmt.Fprint(w, "  0\nSECTION\n  2\nENTITIES\n")
	for i := 0; i < n; i++ {
		y := float64(i) * 16
		fmt.Fprintf(w, "  0\nLINE\n  8\nJOIST\n 10\n0.0\n 20\n%g\n 30\n0.0\n 11\n144.0\n 21\n%g\n 31\n0.0\n", y, y)
	}
	fmt.Fprint(w, "  0\nENDSEC\n  0\nEOF\n")
	if err := w.Flush(); err != nil {
		b.Fatal(err)
	}
	f.Close()
}

// BenchmarkAnnotate copies a 100,000-joist drawing and adds a label per
// joist and a highlight per failing joist.
func BenchmarkAnnotate(b *testing.B) {
	const n = 100_000
	dir := b.TempDir()
	src := filepath.Join(dir, "big.dxf")
	writeBigPlan(b, src, n)
	m := MarkupFromResults(bigResults(n), 1)
	dst := filepath.Join(dir, "out.dxf")
	b.ReportAllocs()
	for b.Loop() {
		if err := Annotate(src, dst, m); err != nil {
			b.Fatal(err)
		}
	}
	if fi, err := os.Stat(dst); err == nil {
		b.ReportMetric(float64(fi.Size())/1e6, "MB/file")
	}
}
