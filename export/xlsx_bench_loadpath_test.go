package export

import (
	"os"
	"path/filepath"
	"testing"
)

// BenchmarkWriteXLSXLoadPath writes the schedule of a 100,000-member plan
// with a load path of the size samples/bigplan -joists 100000 -beams gives
// (4,338 beams, 16,475 posts, 116,564 connections, 23,323 foundation
// lines).
func BenchmarkWriteXLSXLoadPath(b *testing.B) {
	r := bigResults(100_000)
	r.LoadPath = bigLoadPath(4338, 16475, 116564, 23323)
	path := filepath.Join(b.TempDir(), "schedule.xlsx")
	b.ReportAllocs()
	for b.Loop() {
		if err := WriteXLSX(path, r); err != nil {
			b.Fatal(err)
		}
	}
	if fi, err := os.Stat(path); err == nil {
		b.ReportMetric(float64(fi.Size())/1e6, "MB/file")
	}
}
