//go:build unix

package main

import (
	"bytes"
	"os"
	"path/filepath"
	"syscall"
	"testing"
)

// TestDrawingFromPipe: a drawing read from a named pipe cannot be read
// again, so it is kept in memory whatever its size and annotated from the
// bytes checked (common practice, no source: the same copy as from the
// file).
func TestDrawingFromPipe(t *testing.T) {
	c := newOutsetCase(t)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("from the file: exit %d\n%s", code, stderr)
	}
	want := mustRead(t, filepath.Join(c.out, "plan-checked.dxf"))
	fifo := filepath.Join(c.dir, "pipe.dxf")
	if err := syscall.Mkfifo(fifo, 0o600); err != nil {
		t.Skip("no named pipes here:", err)
	}
	plan := mustRead(t, c.plan)
	go func() {
		f, err := os.OpenFile(fifo, os.O_WRONLY, 0)
		if err != nil {
			t.Error(err)
			return
		}
		f.Write(plan)
		f.Close()
	}()
	defer func(v int64) { dropDrawingFrom = v }(dropDrawingFrom)
	dropDrawingFrom = 0
	out := filepath.Join(c.dir, "out-pipe")
	code, stderr := runCheck(t, "check", fifo, "-p", c.proj, "-o", out)
	if code != exitOK {
		t.Fatalf("from a pipe: exit %d\n%s", code, stderr)
	}
	if got := mustRead(t, filepath.Join(out, "pipe-checked.dxf")); !bytes.Equal(got, want) {
		t.Error("from a pipe: the annotated copy differs from the one made from the file")
	}
}
