//go:build linux && (amd64 || arm64 || riscv64 || loong64 || ppc64le)

package export

import (
	"bufio"
	"bytes"
	"os"
	"path/filepath"
	"syscall"
	"testing"
	"unsafe"
)

// residentShare is the share of path's pages in the page cache
// (mincore(2) on a mapping of the file).
func residentShare(t *testing.T, path string) float64 {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	fi, err := f.Stat()
	if err != nil {
		t.Fatal(err)
	}
	m, err := syscall.Mmap(int(f.Fd()), 0, int(fi.Size()), syscall.PROT_READ, syscall.MAP_SHARED)
	if err != nil {
		t.Fatal(err)
	}
	defer syscall.Munmap(m)
	page := os.Getpagesize()
	vec := make([]byte, (len(m)+page-1)/page)
	if _, _, e := syscall.Syscall(syscall.SYS_MINCORE, uintptr(unsafe.Pointer(&m[0])), uintptr(len(m)), uintptr(unsafe.Pointer(&vec[0]))); e != 0 {
		t.Fatalf("mincore: %v", e)
	}
	in := 0
	for _, v := range vec {
		in += int(v & 1)
	}
	return float64(in) / float64(len(vec))
}

// TestWriteAtomicDropsPageCache: a file written through writeAtomic is
// out of the page cache once written (what the syncs put on disk is
// dropped behind them), while the same bytes written plainly beside it
// stay cached. Where the folder's file system keeps its files in memory
// whatever is asked (tmpfs), the plain file's pages say nothing and the
// test is skipped.
func TestWriteAtomicDropsPageCache(t *testing.T) {
	oldSync, oldDrop := syncEveryBytes, dropFromBytes
	syncEveryBytes, dropFromBytes = 1<<20, 2<<20
	defer func() { syncEveryBytes, dropFromBytes = oldSync, oldDrop }()
	dir := t.TempDir()
	var fs syscall.Statfs_t
	if err := syscall.Statfs(dir, &fs); err == nil && fs.Type == 0x01021994 { // TMPFS_MAGIC
		t.Skip("the test folder is on tmpfs, whose pages are the files themselves")
	}
	want := bytes.Repeat([]byte("0123456789abcdef"), 1<<19) // 8 MiB
	plain := filepath.Join(dir, "plain.json")
	if err := os.WriteFile(plain, want, 0o644); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, "dropped.json")
	err := writeAtomic(path, func(w *bufio.Writer) error {
		for i := 0; i < len(want); i += 4000 {
			w.Write(want[i:min(i+4000, len(want))])
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if share := residentShare(t, plain); share < 0.9 {
		t.Skipf("only %.0f%% of a file just written plainly is in the page cache here: nothing to compare with", 100*share)
	}
	if share := residentShare(t, path); share > 0.1 {
		t.Errorf("%.0f%% of the file written by writeAtomic is still in the page cache, want at most 10%%", 100*share)
	}
	if got, err := os.ReadFile(path); err != nil || !bytes.Equal(got, want) {
		t.Fatalf("read back %d bytes (%v), want %d", len(got), err, len(want))
	}
}
