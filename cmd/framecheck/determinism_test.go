package main

import (
	"archive/zip"
	"bytes"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"testing"
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
	p := writeBigPlan(t, dir, 5000, false)
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
	for _, name := range []string{resultsName, "big5000-checked.dxf"} {
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
