//go:build linux

package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
	"unsafe"
)

// openPty opens a pseudo-terminal pair through /dev/ptmx (Linux pty(7):
// unlock with TIOCSPTLCK, find the slave's number with TIOCGPTN).
func openPty(t *testing.T) (master, slave *os.File) {
	t.Helper()
	m, err := os.OpenFile("/dev/ptmx", os.O_RDWR, 0)
	if err != nil {
		t.Skipf("no pseudo-terminal here: %v", err)
	}
	var unlock int32
	if _, _, e := syscall.Syscall(syscall.SYS_IOCTL, m.Fd(), syscall.TIOCSPTLCK, uintptr(unsafe.Pointer(&unlock))); e != 0 {
		m.Close()
		t.Skipf("TIOCSPTLCK: %v", e)
	}
	var n uint32
	if _, _, e := syscall.Syscall(syscall.SYS_IOCTL, m.Fd(), syscall.TIOCGPTN, uintptr(unsafe.Pointer(&n))); e != 0 {
		m.Close()
		t.Skipf("TIOCGPTN: %v", e)
	}
	s, err := os.OpenFile(fmt.Sprintf("/dev/pts/%d", n), os.O_RDWR|syscall.O_NOCTTY, 0)
	if err != nil {
		m.Close()
		t.Skipf("open slave: %v", err)
	}
	return m, s
}

// checkGoodPlanTo runs `framecheck check` on the corpus's good plan with
// stdout going to out and returns what reached it, read back by read.
func checkGoodPlanTo(t *testing.T, out *os.File, read func() string) string {
	t.Helper()
	dir := t.TempDir()
	data, err := os.ReadFile(filepath.Join("testdata", "bad", "good.dxf"))
	if err != nil {
		t.Fatal(err)
	}
	plan := filepath.Join(dir, "good.dxf")
	if err := os.WriteFile(plan, data, 0o644); err != nil {
		t.Fatal(err)
	}
	var stderr bytes.Buffer
	if code := run([]string{"check", plan, "-o", filepath.Join(dir, "out")}, out, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	return read()
}

// reader drains f in the background; the returned func closes w (the
// writing end) and waits for everything written.
func reader(f, w *os.File) func() string {
	var buf bytes.Buffer
	done := make(chan struct{})
	go func() {
		io.Copy(&buf, f) // ends with EIO (pty) or EOF (pipe) once w is closed
		close(done)
	}()
	return func() string {
		w.Close()
		<-done
		return buf.String()
	}
}

// On a terminal the status column is coloured with the ANSI colour codes
// (ECMA-48 SGR 32 green, 31 red, 33 yellow, 0 reset), not printed with
// the bare number in front; with NO_COLOR set (https://no-color.org) or
// through a pipe there are no escape codes at all.
func TestStatusColourOnTerminalOnly(t *testing.T) {
	t.Run("terminal", func(t *testing.T) {
		t.Setenv("NO_COLOR", "")
		m, s := openPty(t)
		defer m.Close()
		if !useColour(s) {
			t.Fatal("useColour(pty) = false")
		}
		out := checkGoodPlanTo(t, s, reader(m, s))
		if !strings.Contains(out, "\x1b[32mpass\x1b[0m") {
			t.Errorf("no green pass on the terminal:\n%q", out)
		}
		if strings.Contains(out, "32pass") && !strings.Contains(out, "\x1b[32mpass") {
			t.Errorf("colour number printed as text:\n%q", out)
		}
	})
	t.Run("NO_COLOR", func(t *testing.T) {
		t.Setenv("NO_COLOR", "1")
		m, s := openPty(t)
		defer m.Close()
		out := checkGoodPlanTo(t, s, reader(m, s))
		if strings.Contains(out, "\x1b[") || !strings.Contains(out, " pass") {
			t.Errorf("NO_COLOR: escape codes or no status:\n%q", out)
		}
	})
	t.Run("pipe", func(t *testing.T) {
		t.Setenv("NO_COLOR", "")
		r, w, err := os.Pipe()
		if err != nil {
			t.Fatal(err)
		}
		defer r.Close()
		if useColour(w) {
			t.Error("useColour(pipe) = true")
		}
		out := checkGoodPlanTo(t, w, reader(r, w))
		if strings.Contains(out, "\x1b[") || !strings.Contains(out, " pass") {
			t.Errorf("pipe: escape codes or no status:\n%q", out)
		}
	})
}

// statusText gives each status its own colour constant.
func TestStatusTextColours(t *testing.T) {
	for _, c := range []struct{ status, want string }{
		{"pass", "\x1b[32mpass\x1b[0m"}, {"fail", "\x1b[31mFAIL\x1b[0m"}, {"error", "\x1b[33mERROR\x1b[0m"},
	} {
		if got := statusText(true, c.status); got != c.want {
			t.Errorf("statusText(true, %q) = %q, want %q", c.status, got, c.want)
		}
		if got := statusText(false, c.status); strings.Contains(got, "\x1b") {
			t.Errorf("statusText(false, %q) = %q", c.status, got)
		}
	}
}
