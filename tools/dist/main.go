// Dist cross-builds the framecheck command for the platforms designers
// use, into dist/, with the version stamped into each binary.
//
// Usage:
//
//	go run ./tools/dist [-o DIR] [-version V] [-targets LIST]
//
// Each binary is dist/framecheck-VERSION-OS-ARCH (.exe on Windows), built
// with CGO off (framecheck is pure Go) and -trimpath, and with
// -ldflags "-X main.version=VERSION" so that `framecheck --version` and
// every output name the build. VERSION defaults to `git describe --tags
// --always --dirty` of the working tree, or "dev" outside a git checkout.
// A SHA256SUMS file lists every binary's digest.
//
//	-o DIR         output folder (default dist)
//	-version V     version to stamp
//	-targets LIST  comma-separated OS/ARCH pairs (default: windows, macOS
//	               and Linux on amd64 and arm64)
package main

import (
	"crypto/sha256"
	"encoding/hex"
	"flag"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"sort"
	"strings"
)

// defaultTargets are the platforms built by default.
var defaultTargets = []string{
	"windows/amd64", "windows/arm64",
	"darwin/amd64", "darwin/arm64",
	"linux/amd64", "linux/arm64",
}

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("dist", flag.ContinueOnError)
	fs.SetOutput(stderr)
	out := fs.String("o", "dist", "output `folder`")
	ver := fs.String("version", "", "`version` to stamp (default: git describe)")
	targets := fs.String("targets", strings.Join(defaultTargets, ","), "comma-separated `OS/ARCH` pairs")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	v := *ver
	if v == "" {
		v = gitVersion()
	}
	if strings.ContainsAny(v, " \t'\"") {
		fmt.Fprintf(stderr, "dist: version %q: want no spaces or quotes\n", v)
		return 2
	}
	if err := os.MkdirAll(*out, 0o755); err != nil {
		fmt.Fprintf(stderr, "dist: %v\n", err)
		return 1
	}
	var sums []string
	for _, t := range strings.Split(*targets, ",") {
		goos, goarch, ok := strings.Cut(strings.TrimSpace(t), "/")
		if !ok || goos == "" || goarch == "" {
			fmt.Fprintf(stderr, "dist: target %q: want OS/ARCH, such as windows/amd64\n", t)
			return 2
		}
		name := binaryName(v, goos, goarch)
		path := filepath.Join(*out, name)
		cmd := exec.Command("go", "build", "-trimpath", "-ldflags", "-s -w -X main.version="+v, "-o", path, "./cmd/framecheck")
		cmd.Env = append(os.Environ(), "GOOS="+goos, "GOARCH="+goarch, "CGO_ENABLED=0")
		cmd.Stdout, cmd.Stderr = stderr, stderr
		if err := cmd.Run(); err != nil {
			fmt.Fprintf(stderr, "dist: building %s/%s: %v\n", goos, goarch, err)
			return 1
		}
		sum, err := fileSHA256(path)
		if err != nil {
			fmt.Fprintf(stderr, "dist: %v\n", err)
			return 1
		}
		sums = append(sums, sum+"  "+name)
		fmt.Fprintln(stdout, path)
	}
	sort.Strings(sums)
	if err := os.WriteFile(filepath.Join(*out, "SHA256SUMS"), []byte(strings.Join(sums, "\n")+"\n"), 0o644); err != nil {
		fmt.Fprintf(stderr, "dist: %v\n", err)
		return 1
	}
	return 0
}

// binaryName is framecheck-VERSION-OS-ARCH, with .exe on Windows.
func binaryName(version, goos, goarch string) string {
	n := "framecheck-" + version + "-" + goos + "-" + goarch
	if goos == "windows" {
		n += ".exe"
	}
	return n
}

// gitVersion describes the working tree, or "dev" without git.
func gitVersion() string {
	b, err := exec.Command("git", "describe", "--tags", "--always", "--dirty").Output()
	if err != nil {
		return "dev"
	}
	return strings.TrimSpace(string(b))
}

func fileSHA256(path string) (string, error) {
	f, err := os.Open(path)
	if err != nil {
		return "", err
	}
	defer f.Close()
	h := sha256.New()
	if _, err := io.Copy(h, f); err != nil {
		return "", err
	}
	return hex.EncodeToString(h.Sum(nil)), nil
}
