package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// Corpus cases of issue 15: hostile text, bounded inputs.

// Layer names holding terminal escape sequences: an OSC that retitles the
// terminal (ESC ] 0 ; ... BEL), a clear screen (ESC [ 2 J) and a cursor
// move home (ESC [ H). One joist end reaches no wall, so its layer is
// printed in the table of members in error too.
const (
	hostileJoistLayer = "JOIST-\x1b]0;owned\x07\x1b[2J\x1b[H"
	hostileWallLayer  = "WALL-\x1b[31mRED"
)

func init() {
	// minsert-bomb.dxf with its one line on a joist layer.
	badFiles["minsert-bomb-joists.dxf"] = func() string {
		return strings.Replace(badFiles["minsert-bomb.dxf"](), "A-FURN", "JOIST-X", 1)
	}
	badFiles["escape-layers.dxf"] = func() string {
		var d dxfText
		d.header("AC1032", 1)
		d.section("ENTITIES")
		d.plan(hostileWallLayer, hostileJoistLayer, 4, 0, 0)
		d.line(hostileJoistLayer, 0, 90, 100, 90) // ends in the air
		d.endsec()
		d.eof()
		return d.String()
	}
}

// TestBadCorpusEscapeLayers: no control character of the drawing reaches
// the terminal, on stdout or stderr, from check or layers; they are shown
// escaped, while results.json keeps the layer name as drawn.
func TestBadCorpusEscapeLayers(t *testing.T) {
	t.Setenv("NO_COLOR", "1")
	r := runCorpus(t, "escape-layers.dxf", "", "")
	wantCode(t, r, exitFail)
	for name, out := range map[string]string{"stdout": r.stdout, "stderr": r.stderr} {
		if i := strings.IndexAny(out, "\x1b\x07"); i >= 0 {
			t.Errorf("%s holds a raw control character at %d: %q", name, i, out[max(0, i-40):min(len(out), i+40)])
		}
	}
	if !strings.Contains(r.stdout+r.stderr, `JOIST-\x1b]0;owned\x07\x1b[2J\x1b[H`) {
		t.Errorf("the joist layer is not shown escaped:\n%s\n%s", r.stdout, r.stderr)
	}
	found := false
	for _, m := range r.results.Members {
		found = found || m.Layer == hostileJoistLayer
	}
	if !found {
		t.Error("results.json does not keep the layer name as drawn")
	}

	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	if err := os.WriteFile(plan, []byte(badFiles["escape-layers.dxf"]()), 0o644); err != nil {
		t.Fatal(err)
	}
	var stdout, stderr bytes.Buffer
	if code := run([]string{"layers", plan}, &stdout, &stderr); code != exitOK {
		t.Fatalf("layers: exit %d\n%s", code, stderr.String())
	}
	if strings.ContainsAny(stdout.String()+stderr.String(), "\x1b\x07") {
		t.Errorf("layers prints raw control characters:\n%q", stdout.String())
	}
	if !strings.Contains(stdout.String(), `WALL-\x1b[31mRED`) {
		t.Errorf("layers does not show the wall layer escaped:\n%s", stdout.String())
	}
}

// TestHugeLayerNameIsCut: a 1 MB layer name (too large to commit; written
// here) prints a few kilobytes at most, not megabytes.
func TestHugeLayerNameIsCut(t *testing.T) {
	t.Setenv("NO_COLOR", "1")
	huge := "JOIST-" + strings.Repeat("\x1b[2J", 250_000)
	var d dxfText
	d.header("AC1032", 1)
	d.section("ENTITIES")
	d.plan("WALL", huge, 3, 0, 0)
	d.line(huge, 0, 70, 100, 70)
	d.endsec()
	d.eof()
	r := runCorpus(t, "huge-layer.dxf", d.String(), "")
	wantCode(t, r, exitFail)
	if n := len(r.stdout) + len(r.stderr); n > 64<<10 {
		t.Errorf("a 1 MB layer name printed %d bytes to the terminal", n)
	}
	if strings.Contains(r.stdout+r.stderr, "\x1b") {
		t.Error("raw ESC on the terminal")
	}
}

// TestProjectFileBounded: -p /dev/zero and a 5 MiB project file are
// refused with the limit stated, exit 2, before anything is read into
// memory past the limit (issue 15 item 5).
func TestProjectFileBounded(t *testing.T) {
	dir := t.TempDir()
	big := filepath.Join(dir, "big.toml")
	f, err := os.Create(big)
	if err != nil {
		t.Fatal(err)
	}
	if err := f.Truncate(5 << 20); err != nil {
		t.Fatal(err)
	}
	f.Close()
	projects := []string{big}
	if _, err := os.Stat("/dev/zero"); err == nil {
		projects = append(projects, "/dev/zero")
	}
	for _, p := range projects {
		var stdout, stderr bytes.Buffer
		out := filepath.Join(dir, "out")
		code := run([]string{"check", filepath.Join(badDir, "good.dxf"), "-p", p, "-o", out}, &stdout, &stderr)
		if code != exitUsage || !strings.Contains(stderr.String(), "project file "+p) || !strings.Contains(stderr.String(), "the limit is 4 MiB") {
			t.Errorf("-p %s: exit %d\n%s", p, code, stderr.String())
		}
		if _, err := os.Stat(out); err == nil {
			t.Errorf("-p %s: output folder created", p)
		}
	}
	var stdout, stderr bytes.Buffer
	if code := run([]string{"layers", filepath.Join(badDir, "good.dxf"), "-p", big}, &stdout, &stderr); code != exitUsage ||
		!strings.Contains(stderr.String(), "the limit is 4 MiB") {
		t.Errorf("layers -p big: exit %d\n%s", code, stderr.String())
	}
}
