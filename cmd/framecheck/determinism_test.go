package main

import (
	"archive/zip"
	"bytes"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"testing"

	"framecheck/samples/bigplan/synth"
)

// TestOutputsSameOnAnyCoreCount runs check on a 5,000-joist synthetic plan
// with one core and with two: the member checks, the Members sheet's row
// blocks (three of them) and the four writers run in parallel, and every
// output must come out the same, byte for byte, in the same order (issue
// 8: "keep output order deterministic"). The spreadsheet is compared part
// by part, uncompressed, and the report without its date line.
func TestOutputsSameOnAnyCoreCount(t *testing.T) {
	if testing.Short() {
		t.Skip("-short: writes a 5,000-joist plan twice")
	}
	dir := t.TempDir()
	outputsSameOnAnyCoreCount(t, dir, writeBigPlan(t, dir, 5000, false))
}

// TestLoadPathOutputsSameOnAnyCoreCount is TestOutputsSameOnAnyCoreCount
// on the same joists with posts under every beam (synth.Options.Beams):
// the load path is solved a batch at a time on both cores, its posts and
// joints worked out in parallel, its connections ordered and grouped, and
// results.json, the grouped sheets and the report must still come out
// the same whatever the number of cores.
func TestLoadPathOutputsSameOnAnyCoreCount(t *testing.T) {
	if testing.Short() {
		t.Skip("-short: writes a 5,000-joist plan with its beams twice")
	}
	dir := t.TempDir()
	outputsSameOnAnyCoreCount(t, dir, writeBeamPlan(t, dir, synth.Options{Joists: 5000, Beams: true}))
}

// outputsSameOnAnyCoreCount runs check on p with one core and with two
// and compares every output: results.json and the annotated drawing byte
// for byte, the report without its date lines, the spreadsheet part by
// part, uncompressed.
func outputsSameOnAnyCoreCount(t *testing.T, dir string, p bigPlan) {
	t.Helper()
	outs := map[int]string{}
	for _, procs := range []int{1, 2} {
		old := runtime.GOMAXPROCS(procs)
		out := filepath.Join(dir, "out", string(rune('0'+procs)))
		var stdout, stderr bytes.Buffer
		code := run([]string{"check", p.dxf, "-p", p.toml, "-o", out}, &stdout, &stderr)
		runtime.GOMAXPROCS(old)
		if code != exitFail { // the plan has failing and error members by design
			t.Fatalf("GOMAXPROCS %d: exit %d\n%s", procs, code, stderr.String())
		}
		outs[procs] = out
	}
	checked := strings.TrimSuffix(filepath.Base(p.dxf), filepath.Ext(p.dxf)) + "-checked.dxf"
	for _, name := range []string{resultsName, checked} {
		a, b := readFile(t, filepath.Join(outs[1], name)), readFile(t, filepath.Join(outs[2], name))
		if !bytes.Equal(a, b) {
			t.Errorf("%s differs between one core and two", name)
		}
	}
	a, b := readFile(t, filepath.Join(outs[1], reportName)), readFile(t, filepath.Join(outs[2], reportName))
	if !bytes.Equal(dropDateLines(a), dropDateLines(b)) {
		t.Errorf("%s differs between one core and two (date lines aside)", reportName)
	}
	pa, pb := xlsxParts(t, filepath.Join(outs[1], scheduleName)), xlsxParts(t, filepath.Join(outs[2], scheduleName))
	if len(pa) != len(pb) || len(pa) < 6 {
		t.Fatalf("schedule parts: %d and %d", len(pa), len(pb))
	}
	for name, data := range pa {
		if name == "docProps/core.xml" { // creation time
			continue
		}
		if !bytes.Equal(data, pb[name]) {
			t.Errorf("schedule.xlsx part %s differs between one core and two", name)
		}
	}
}

func readFile(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// dropDateLines removes the lines of an HTML report that carry the time
// of the run.
func dropDateLines(b []byte) []byte {
	var out [][]byte
	for _, l := range bytes.Split(b, []byte("\n")) {
		if !bytes.Contains(l, []byte(" UTC")) {
			out = append(out, l)
		}
	}
	return bytes.Join(out, []byte("\n"))
}

// xlsxParts returns the uncompressed parts of a workbook by name.
func xlsxParts(t *testing.T, path string) map[string][]byte {
	t.Helper()
	zr, err := zip.OpenReader(path)
	if err != nil {
		t.Fatal(err)
	}
	defer zr.Close()
	parts := map[string][]byte{}
	for _, f := range zr.File {
		rc, err := f.Open()
		if err != nil {
			t.Fatal(err)
		}
		parts[f.Name], err = io.ReadAll(rc)
		rc.Close()
		if err != nil {
			t.Fatalf("%s: %v", f.Name, err)
		}
	}
	return parts
}

// TestRunsByteIdentical (issue 15 item 7): the same drawing and project
// file, checked from two different folders given as absolute paths,
// with SOURCE_DATE_EPOCH set, give byte-identical files, the manifest
// included: the spreadsheet's parts are in a fixed order with fixed
// times, and no output holds an absolute path. Without SOURCE_DATE_EPOCH
// the report's date line and the manifest's "time" are the only
// differences (the report states the minute of the run).
func TestRunsByteIdentical(t *testing.T) {
	t.Setenv("SOURCE_DATE_EPOCH", "1767225600") // 2026-01-01T00:00:00Z
	var outs []string
	for i := 0; i < 2; i++ {
		c := newOutsetCase(t)
		if code, stderr := c.check(t); code != exitOK {
			t.Fatalf("run %d: exit %d\n%s", i, code, stderr)
		}
		outs = append(outs, c.out)
	}
	for _, name := range []string{resultsName, scheduleName, reportName, "plan-checked.dxf", manifestName} {
		a, b := readFile(t, filepath.Join(outs[0], name)), readFile(t, filepath.Join(outs[1], name))
		if !bytes.Equal(a, b) {
			t.Errorf("%s differs between two runs", name)
		}
		if bytes.Contains(a, []byte(filepath.Dir(outs[0]))) {
			t.Errorf("%s holds the absolute path of the run's folder", name)
		}
	}
	report := readFile(t, filepath.Join(outs[0], reportName))
	if !bytes.Contains(report, []byte("2026-01-01 00:00 UTC")) {
		t.Error("the report's date is not SOURCE_DATE_EPOCH")
	}
	m := wantCompleteSet(t, outs[0])
	if m.Time != "2026-01-01T00:00:00Z" {
		t.Errorf("manifest time %s", m.Time)
	}
}

// TestSourceDateEpochBad: a SOURCE_DATE_EPOCH that is not a number of
// seconds is refused rather than ignored.
func TestSourceDateEpochBad(t *testing.T) {
	t.Setenv("SOURCE_DATE_EPOCH", "yesterday")
	c := newOutsetCase(t)
	code, stderr := c.check(t)
	if code != exitUsage || !bytes.Contains([]byte(stderr), []byte("SOURCE_DATE_EPOCH")) {
		t.Errorf("exit %d\n%s", code, stderr)
	}
}
