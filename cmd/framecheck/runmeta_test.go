package main

import (
	"crypto/sha256"
	"encoding/hex"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
)

// TestManifestHashesWhileWriting: the manifest's hash and size of every
// output equal the SHA-256 (crypto/sha256 on the file read back) and
// length of the file, and only marks.json, which export does not write, is
// read again to hash it; the others were hashed as they were written.
func TestManifestHashesWhileWriting(t *testing.T) {
	c := newOutsetCase(t)
	var mu sync.Mutex
	var reread []string
	old := rehashFile
	rehashFile = func(path string) (string, int64, error) {
		if strings.HasPrefix(path, c.dir) { // this run's outputs only
			mu.Lock()
			reread = append(reread, filepath.Base(path))
			mu.Unlock()
		}
		return old(path)
	}
	defer func() { rehashFile = old }()
	if code, stderr := c.check(t); code > 1 {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	m := wantCompleteSet(t, c.out)
	if len(m.Files) < 5 {
		t.Fatalf("manifest lists %d files", len(m.Files))
	}
	for _, f := range m.Files {
		data, err := os.ReadFile(filepath.Join(c.out, f.Name))
		if err != nil {
			t.Fatal(err)
		}
		sum := sha256.Sum256(data)
		if got := hex.EncodeToString(sum[:]); got != f.SHA256 || int64(len(data)) != f.Bytes {
			t.Errorf("%s: manifest %s (%d bytes), file %s (%d bytes)", f.Name, f.SHA256, f.Bytes, got, len(data))
		}
	}
	if len(reread) != 1 || reread[0] != marksName {
		t.Errorf("outputs read again to hash them: %v, want only %s", reread, marksName)
	}
}
