package export

import (
	"bufio"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
)

// ErrSameFile is returned when an output path names the input drawing.
var ErrSameFile = errors.New("output would overwrite the input drawing")

// writeAtomic writes path through a temporary file in the same folder:
// write, flush, fsync, close, rename. On any error the temporary file is
// removed and an existing file at path is left as it was.
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
	sw := &syncingWriter{f: tmp, busy: make(chan struct{}, 1)}
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

// syncingWriter writes to f and, after every syncEveryBytes, starts an
// fsync in the background (unless one is still running), so the disk
// takes most of a large file (a 100,000-member results.json is 800 MB)
// while the rest is still being made, and the final Sync has little left
// to do. busy holds a token while a background sync runs. Errors of the
// background syncs are left to the final Sync to report.
type syncingWriter struct {
	f    *os.File
	n    int64
	busy chan struct{}
}

func (w *syncingWriter) Write(p []byte) (int, error) {
	n, err := w.f.Write(p)
	if w.n += int64(n); w.n >= syncEveryBytes {
		w.n = 0
		select {
		case w.busy <- struct{}{}:
			go func() {
				_ = w.f.Sync()
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
