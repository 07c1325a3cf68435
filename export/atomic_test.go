package export

import (
	"bufio"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"os"
	"path/filepath"
	"testing"
)

func TestWriteAtomicFailureKeepsEarlierOutput(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "out.json")
	if err := os.WriteFile(path, []byte("earlier"), 0o640); err != nil {
		t.Fatal(err)
	}
	boom := errors.New("boom")
	err := writeAtomic(path, func(w *bufio.Writer) error {
		// Write more than the buffer so that part reaches the temp file.
		w.Write(make([]byte, 200_000))
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v, want boom", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "earlier" {
		t.Errorf("earlier output changed to %d bytes", len(b))
	}
	noTempFiles(t, dir)
}

func TestWriteAtomicFailureLeavesNoFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "new.xlsx")
	err := writeAtomic(path, func(w *bufio.Writer) error { return errors.New("boom") })
	if err == nil {
		t.Fatal("no error")
	}
	if _, serr := os.Stat(path); !os.IsNotExist(serr) {
		t.Errorf("partial file exists: %v", serr)
	}
	noTempFiles(t, dir)
}

func TestWriteAtomicReplacesAndKeepsMode(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "out.json")
	if err := os.WriteFile(path, []byte("earlier"), 0o640); err != nil {
		t.Fatal(err)
	}
	if err := writeAtomic(path, func(w *bufio.Writer) error { _, err := w.WriteString("new"); return err }); err != nil {
		t.Fatal(err)
	}
	b, _ := os.ReadFile(path)
	fi, _ := os.Stat(path)
	if string(b) != "new" || fi.Mode().Perm() != 0o640 {
		t.Errorf("got %q mode %v, want \"new\" mode 0640", b, fi.Mode().Perm())
	}
	fresh := filepath.Join(dir, "fresh.json")
	if err := writeAtomic(fresh, func(w *bufio.Writer) error { return nil }); err != nil {
		t.Fatal(err)
	}
	if fi, _ := os.Stat(fresh); fi.Mode().Perm() != 0o644 {
		t.Errorf("new file mode %v, want 0644", fi.Mode().Perm())
	}
	noTempFiles(t, dir)
}

func TestWriteAtomicMissingFolder(t *testing.T) {
	path := filepath.Join(t.TempDir(), "no", "such", "out.json")
	if err := WriteJSON(path, &Results{}); err == nil {
		t.Fatal("no error for a missing folder")
	}
}

// TestWrittenSHA256: the hash writeAtomic computes while writing is the
// SHA-256 of the file (crypto/sha256 on the bytes read back), given out
// once; a file changed after it was written, or never written by export,
// gives none (the caller hashes it itself).
func TestWrittenSHA256(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "results.json")
	if err := WriteJSON(path, loadFixture(t)); err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	want := sha256.Sum256(data)
	sum, size, ok := WrittenSHA256(filepath.Join(dir, ".", "results.json"))
	if !ok || sum != hex.EncodeToString(want[:]) || size != int64(len(data)) {
		t.Errorf("WrittenSHA256 = %s, %d, %v; want %x, %d", sum, size, ok, want, len(data))
	}
	if _, _, ok := WrittenSHA256(path); ok {
		t.Error("a second WrittenSHA256 of the same file gave a hash")
	}
	if err := WriteJSON(path, loadFixture(t)); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, append(data, ' '), 0o644); err != nil {
		t.Fatal(err)
	}
	if _, _, ok := WrittenSHA256(path); ok {
		t.Error("WrittenSHA256 gave a hash for a file changed after export wrote it")
	}
	if _, _, ok := WrittenSHA256(filepath.Join(dir, "other.json")); ok {
		t.Error("WrittenSHA256 gave a hash for a file export never wrote")
	}
}
