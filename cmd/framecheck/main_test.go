package main

import (
	"bytes"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"framecheck/project"
)

// runCmd runs the command in-process and returns its exit code and output.
func runCmd(args ...string) (int, string, string) {
	var out, errb bytes.Buffer
	code := run(args, &out, &errb)
	return code, out.String(), errb.String()
}

func TestUsageAndExitCodes(t *testing.T) {
	cases := []struct {
		args   []string
		code   int
		stdout string // substring expected on stdout ("" = must be empty)
		stderr string // substring expected on stderr ("" = must be empty)
	}{
		{nil, 2, "", "usage: framecheck <command>"},
		{[]string{"help"}, 0, "usage: framecheck <command>", ""},
		{[]string{"--help"}, 0, "init ", ""},
		{[]string{"-h"}, 0, "Exit status", ""},
		{[]string{"help", "init"}, 0, "usage: framecheck init [-o FILE] [--force]", ""},
		{[]string{"help", "nope"}, 2, "", `framecheck: unknown command "nope"`},
		{[]string{"int"}, 2, "", `did you mean "init"?`},
		{[]string{"init", "--help"}, 0, "-force", ""},
		{[]string{"init", "-h"}, 0, "overwrite FILE", ""},
		{[]string{"init", "--bogus"}, 2, "", "framecheck: init: flag provided but not defined: -bogus"},
		{[]string{"init", "extra.toml"}, 2, "", `framecheck: init: unexpected argument "extra.toml"`},
		{[]string{"init", "-o"}, 2, "", "flag needs an argument: -o"},
	}
	for _, c := range cases {
		code, out, errs := runCmd(c.args...)
		if code != c.code {
			t.Errorf("%q: exit %d, want %d (stderr %q)", c.args, code, c.code, errs)
		}
		check := func(name, got, want string) {
			if want == "" && got != "" || !strings.Contains(got, want) {
				t.Errorf("%q: %s %q, want it to contain %q", c.args, name, got, want)
			}
		}
		check("stdout", out, c.stdout)
		check("stderr", errs, c.stderr)
	}
}

func TestInitRefusesOverwrite(t *testing.T) {
	path := filepath.Join(t.TempDir(), "p.toml")
	if err := os.WriteFile(path, []byte("# mine\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	code, _, errs := runCmd("init", "-o", path)
	if code != 2 || !strings.Contains(errs, "already exists; use --force") {
		t.Errorf("exit %d, stderr %q", code, errs)
	}
	if b, _ := os.ReadFile(path); string(b) != "# mine\n" {
		t.Errorf("file changed without --force: %q", b)
	}
	code, _, errs = runCmd("init", "--force", "-o", path)
	if b, _ := os.ReadFile(path); code != 0 || string(b) != project.StarterProject {
		t.Errorf("--force: exit %d, stderr %q, file not replaced", code, errs)
	}
}

func TestInitStdout(t *testing.T) {
	code, out, _ := runCmd("init", "-o", "-")
	if code != 0 || out != project.StarterProject {
		t.Errorf("init -o -: exit %d, %d bytes", code, len(out))
	}
}

func TestInitUnwritable(t *testing.T) {
	path := filepath.Join(t.TempDir(), "no-such-dir", "p.toml")
	code, _, errs := runCmd("init", "-o", path)
	if code != 2 || !strings.HasPrefix(errs, "framecheck: ") {
		t.Errorf("exit %d, stderr %q", code, errs)
	}
}

// TestParseInterspersed: flags may follow the file arguments; "--" ends
// the flags.
func TestParseInterspersed(t *testing.T) {
	for _, c := range []struct {
		args []string
		pos  []string
		o    string
	}{
		{[]string{"plan.dxf", "-o", "out", "b"}, []string{"plan.dxf", "b"}, "out"},
		{[]string{"-o", "out", "plan.dxf"}, []string{"plan.dxf"}, "out"},
		{[]string{"plan.dxf", "--", "-o", "x"}, []string{"plan.dxf", "-o", "x"}, ""},
		{nil, nil, ""},
	} {
		f := newFlags("t", "t", "t")
		o := f.String("o", "", "")
		pos, code := f.parse(c.args, &bytes.Buffer{}, &bytes.Buffer{})
		if code != -1 || !reflect.DeepEqual(pos, c.pos) || *o != c.o {
			t.Errorf("%q: pos %q o %q code %d", c.args, pos, *o, code)
		}
	}
}

func TestColour(t *testing.T) {
	if useColour(&bytes.Buffer{}) {
		t.Error("colour on a buffer")
	}
	t.Setenv("NO_COLOR", "1")
	if useColour(os.Stdout) {
		t.Error("colour with NO_COLOR set")
	}
	if got := paint(false, colourRed, "FAIL"); got != "FAIL" {
		t.Errorf("paint off: %q", got)
	}
	if got := paint(true, colourRed, "FAIL"); got != "\x1b[31mFAIL\x1b[0m" {
		t.Errorf("paint on: %q", got)
	}
}

// TestVersionFlag: --version prints the stamped version (set here as the
// linker's -X would) and exits 0.
func TestVersionFlag(t *testing.T) {
	old := version
	version = "v9.8.7-test"
	defer func() { version = old }()
	var out, errb strings.Builder
	if code := run([]string{"--version"}, &out, &errb); code != exitOK || out.String() != "framecheck v9.8.7-test\n" {
		t.Errorf("--version: exit %d, %q %q", code, out.String(), errb.String())
	}
	version = ""
	if v := toolVersion(); v == "" {
		t.Error("toolVersion empty without a stamp")
	}
}

// TestPackageAndPDFFlags: --package takes full or governing; --pdf with
// no browser to be found says how to get one and the run still writes its
// outputs.
func TestPackageAndPDFFlags(t *testing.T) {
	dir := t.TempDir()
	var out, errb strings.Builder
	if code := run([]string{"demo", "-o", dir, "--package", "all"}, &out, &errb); code != exitUsage ||
		!strings.Contains(errb.String(), "want full or governing") {
		t.Errorf("--package all: exit %d, %q", code, errb.String())
	}
	t.Setenv("FRAMECHECK_CHROMIUM", filepath.Join(dir, "no-such-browser"))
	out.Reset()
	errb.Reset()
	code := run([]string{"demo", "-o", dir, "--package", "governing", "--pdf"}, &out, &errb)
	if code == exitUsage || !strings.Contains(errb.String(), "--pdf:") {
		t.Errorf("--pdf without a browser: exit %d, stderr %q", code, errb.String())
	}
	if _, err := os.Stat(filepath.Join(dir, "report.html")); err != nil {
		t.Errorf("no report.html: %v", err)
	}
	if _, err := os.Stat(filepath.Join(dir, pdfName)); err == nil {
		t.Error("a report.pdf was written without a browser")
	}
}
