package export

import (
	"bufio"
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"testing"
)

// TestWriteAtomicBackgroundSync writes a file large enough for several
// background syncs (threshold lowered) and reads it back whole; a failed
// write with a sync running still leaves no file.
func TestWriteAtomicBackgroundSync(t *testing.T) {
	old := syncEveryBytes
	syncEveryBytes = 64 << 10
	defer func() { syncEveryBytes = old }()
	dir := t.TempDir()
	path := filepath.Join(dir, "big.json")
	want := bytes.Repeat([]byte("0123456789abcdef"), 1<<16) // 1 MiB
	err := writeAtomic(path, func(w *bufio.Writer) error {
		for i := 0; i < len(want); i += 1000 {
			w.Write(want[i:min(i+1000, len(want))])
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if got, err := os.ReadFile(path); err != nil || !bytes.Equal(got, want) {
		t.Fatalf("read back %d bytes (%v), want %d", len(got), err, len(want))
	}
	boom := errors.New("boom")
	failed := filepath.Join(dir, "failed.json")
	err = writeAtomic(failed, func(w *bufio.Writer) error {
		w.Write(want)
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v, want boom", err)
	}
	if _, serr := os.Stat(failed); !os.IsNotExist(serr) {
		t.Errorf("failed write left a file: %v", serr)
	}
	noTempFiles(t, dir)
}
