package export

import (
	"bufio"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"hash"
	"os"
	"path/filepath"
	"strings"
	"sync"
)

// ErrSameFile is returned when an output path names the input drawing.
var ErrSameFile = errors.New("output would overwrite the input drawing")

// writeAtomic writes path through a temporary file in the same folder:
// write, flush, fsync, close, rename. On any error the temporary file is
// removed and an existing file at path is left as it was. The SHA-256 of
// the bytes is computed as they go to the file and kept for
// WrittenSHA256, so a caller listing the outputs need not read them again.
func writeAtomic(path string, write func(w *bufio.Writer) error) (err error) {
	if path == "" {
		return errors.New("export: empty output path")
	}
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	tmpName := tmp.Name()
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmpName)
		}
	}()
	sw := &syncingWriter{f: tmp, busy: make(chan struct{}, 1), h: sha256.New()}
	bw := bufio.NewWriterSize(sw, 1<<16)
	err = write(bw)
	if err == nil {
		err = bw.Flush()
	}
	sw.busy <- struct{}{} // wait for a background sync still running
	if err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	if sw.total >= dropFromBytes {
		// a large file, dropped behind its syncs: the rest goes too, and
		// all of it when no background sync got to drop any (one still
		// running when the last bytes were written); a small one stays
		// cached, as cheap to keep as to let go
		sw.drop(sw.total)
	}
	// CreateTemp makes the file private; give it the mode of the file it
	// replaces, or the usual 0644.
	mode := os.FileMode(0o644)
	if fi, serr := os.Stat(path); serr == nil {
		mode = fi.Mode().Perm()
	}
	if err = tmp.Chmod(mode); err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	if err = os.Rename(tmpName, path); err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	recordWritten(path, sw.h, sw.total)
	// Make the rename itself durable; not every platform allows syncing a
	// folder, so a failure here is not an error.
	if d, derr := os.Open(dir); derr == nil {
		_ = d.Sync()
		d.Close()
	}
	return nil
}

// syncEveryBytes is how much syncingWriter lets pile up before it starts
// a background sync (a variable for the tests).
var syncEveryBytes int64 = 32 << 20

// dropFromBytes is how large a file grows before syncingWriter drops it
// from the page cache behind its syncs (a variable for the tests).
var dropFromBytes int64 = 64 << 20

// syncingWriter writes to f and, after every syncEveryBytes, starts an
// fsync in the background (unless one is still running), so the disk
// takes most of a large file (a 100,000-member results.json is 800 MB)
// while the rest is still being made, and the final Sync has little left
// to do. busy holds a token while a background sync runs. Errors of the
// background syncs are left to the final Sync to report.
//
// What a sync has put on disk is then dropped from the page cache
// (dropCached): the outputs are written once and not read again by the
// run, and a page cache that grows by the outputs' size costs dearly on
// a virtual machine of this project's kind, while pages it has just let
// go are taken again cheaply. Measured on the million-joist bigplan (930
// MB of outputs) on the 2-vCPU machine: 14.2 s end to end, three runs in
// a row, where letting the cache grow took 14-21 s (2.6-11.9 s of
// system time, by how much the cache had to grow); writing 500 MB
// files: 0.4 s dropped behind, 3-6.5 s growing the cache.
type syncingWriter struct {
	f    *os.File
	n    int64
	busy chan struct{}
	// h hashes every byte written to f; total counts them.
	h     hash.Hash
	total int64
	// dropped is how much of the file's start is already dropped from
	// the page cache (by the background syncs' goroutine while one runs,
	// so only under busy's token).
	dropped int64
}

// drop lets the page cache go of f's bytes up to off, which a sync has
// put on disk.
func (w *syncingWriter) drop(off int64) {
	if off > w.dropped {
		dropCached(w.f, w.dropped, off-w.dropped)
		w.dropped = off
	}
}

func (w *syncingWriter) Write(p []byte) (int, error) {
	n, err := w.f.Write(p)
	w.h.Write(p[:n])
	w.total += int64(n)
	if w.n += int64(n); w.n >= syncEveryBytes {
		w.n = 0
		select {
		case w.busy <- struct{}{}:
			off := w.total // written before the sync starts: on disk after it
			go func() {
				if w.f.Sync() == nil && off >= dropFromBytes {
					w.drop(off)
				}
				<-w.busy
			}()
		default:
		}
	}
	return n, err
}

// sameFile reports whether a and b name the same file: equal after
// cleaning to absolute paths, or (when both exist) the same inode.
func sameFile(a, b string) bool {
	aa, err1 := filepath.Abs(a)
	bb, err2 := filepath.Abs(b)
	if err1 == nil && err2 == nil && aa == bb {
		return true
	}
	sa, err1 := os.Stat(a)
	sb, err2 := os.Stat(b)
	return err1 == nil && err2 == nil && os.SameFile(sa, sb)
}

// refuseDrawing refuses to write a results file over a drawing: a .dxf
// output path for JSON or XLSX is almost surely a slip of the argument order.
func refuseDrawing(path string) error {
	if strings.EqualFold(filepath.Ext(path), ".dxf") {
		return fmt.Errorf("export: %s: %w (a .dxf path was given for a results file)", path, ErrSameFile)
	}
	return nil
}

// writtenFile is what writeAtomic wrote at a path: the SHA-256 of the
// bytes, their count, and the file as it was just after the rename (to
// tell whether it has changed since).
type writtenFile struct {
	sum  [sha256.Size]byte
	size int64
	info os.FileInfo
}

// written maps an absolute path to its writtenFile, until WrittenSHA256
// takes it.
var written sync.Map

func absPath(path string) string {
	if a, err := filepath.Abs(path); err == nil {
		return a
	}
	return filepath.Clean(path)
}

// recordWritten keeps the hash of the file just renamed to path.
func recordWritten(path string, h hash.Hash, size int64) {
	fi, err := os.Stat(path)
	if err != nil {
		written.Delete(absPath(path))
		return
	}
	wf := writtenFile{size: size, info: fi}
	h.Sum(wf.sum[:0])
	written.Store(absPath(path), wf)
}

// WrittenSHA256 returns the SHA-256 (hex) and size of the file at path as
// export's writers (WriteJSON, WriteXLSX, WriteReport, Annotate,
// WriteOverlay, ...) wrote it, computed while writing. ok is false when
// export did not write the file, or it is no longer the same file with the
// same size and modification time (the caller then hashes it itself).
// Each record is given out once: a second call for the same file gives
// ok false.
func WrittenSHA256(path string) (sum string, size int64, ok bool) {
	v, found := written.LoadAndDelete(absPath(path))
	if !found {
		return "", 0, false
	}
	wf := v.(writtenFile)
	fi, err := os.Stat(path)
	if err != nil || !os.SameFile(fi, wf.info) || fi.Size() != wf.size || !fi.ModTime().Equal(wf.info.ModTime()) {
		return "", 0, false
	}
	return hex.EncodeToString(wf.sum[:]), wf.size, true
}
