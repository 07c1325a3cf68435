package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestBinaryName(t *testing.T) {
	if got := binaryName("v1.2.0", "windows", "amd64"); got != "framecheck-v1.2.0-windows-amd64.exe" {
		t.Errorf("windows name %q", got)
	}
	if got := binaryName("v1.2.0", "darwin", "arm64"); got != "framecheck-v1.2.0-darwin-arm64" {
		t.Errorf("macOS name %q", got)
	}
}

// TestBuildsWindows cross-builds the Windows binary (pure Go, so no C
// toolchain is needed) and checks it is a PE executable ("MZ" header,
// Microsoft PE format) with the version stamped in it.
func TestBuildsWindows(t *testing.T) {
	if testing.Short() {
		t.Skip("cross-builds the command (about 20 s); run without -short")
	}
	dir := t.TempDir()
	var out, errb bytes.Buffer
	wd, _ := os.Getwd()
	if err := os.Chdir(filepath.Join(wd, "..", "..")); err != nil {
		t.Fatal(err)
	}
	defer os.Chdir(wd)
	if code := run([]string{"-o", dir, "-version", "v0.0.0-test", "-targets", "windows/amd64"}, &out, &errb); code != 0 {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	b, err := os.ReadFile(filepath.Join(dir, "framecheck-v0.0.0-test-windows-amd64.exe"))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(b, []byte("MZ")) {
		t.Errorf("not a Windows executable")
	}
	if !bytes.Contains(b, []byte("v0.0.0-test")) {
		t.Errorf("version not stamped in the binary")
	}
	sums, err := os.ReadFile(filepath.Join(dir, "SHA256SUMS"))
	if err != nil || !strings.Contains(string(sums), "framecheck-v0.0.0-test-windows-amd64.exe") {
		t.Errorf("SHA256SUMS %q, %v", sums, err)
	}
	if code := run([]string{"-targets", "windows"}, &out, &errb); code != 2 {
		t.Errorf("bad target: exit %d, want 2", code)
	}
}
