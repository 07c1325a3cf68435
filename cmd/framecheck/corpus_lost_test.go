package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// Nothing lost: a failed run leaves earlier outputs byte-identical and no
// partial file, the output folder can never be or replace the input, and
// the input drawing is never written.

// snapshot reads every regular file of dir.
func snapshot(t *testing.T, dir string) map[string][]byte {
	t.Helper()
	ents, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	s := map[string][]byte{}
	for _, e := range ents {
		if !e.Type().IsRegular() {
			continue
		}
		data, err := os.ReadFile(filepath.Join(dir, e.Name()))
		if err != nil {
			t.Fatal(err)
		}
		s[e.Name()] = data
	}
	return s
}

func sameSnapshot(t *testing.T, what string, before, after map[string][]byte) {
	t.Helper()
	for name, data := range before {
		if got, ok := after[name]; !ok {
			t.Errorf("%s: %s is gone", what, name)
		} else if !bytes.Equal(got, data) {
			t.Errorf("%s: %s changed", what, name)
		}
	}
	for name := range after {
		if _, ok := before[name]; !ok {
			t.Errorf("%s: new file %s", what, name)
		}
	}
}

// runCheck runs framecheck with args and returns the exit code and stderr.
func runCheck(t *testing.T, args ...string) (int, string) {
	t.Helper()
	var stdout, stderr bytes.Buffer
	code := run(args, &stdout, &stderr)
	return code, stderr.String()
}

func copyBad(t *testing.T, name, dst string) {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(badDir, name))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(dst, data, 0o644); err != nil {
		t.Fatal(err)
	}
}

// A run that fails, for any reason, leaves the outputs of the run before
// it exactly as they were, with no partial file beside them.
func TestNothingLostFailedRunKeepsOutputs(t *testing.T) {
	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	copyBad(t, "good-r12.dxf", plan)
	out := filepath.Join(dir, "out")
	if code, stderr := runCheck(t, "check", plan, "-o", out); code != exitOK {
		t.Fatalf("first run: exit %d\n%s", code, stderr)
	}
	before := snapshot(t, out)
	for _, name := range []string{resultsName, scheduleName, "plan-checked.dxf"} {
		if len(before[name]) == 0 {
			t.Fatalf("first run wrote no %s", name)
		}
	}

	// The plan becomes unusable.
	copyBad(t, "truncated-mid-entity.dxf", plan)
	if code, stderr := runCheck(t, "check", plan, "-o", out); code != exitUsage {
		t.Errorf("truncated plan: exit %d, want 2\n%s", code, stderr)
	}
	sameSnapshot(t, "truncated plan", before, snapshot(t, out))
	copyBad(t, "good-r12.dxf", plan)

	// The project file becomes unusable.
	proj := filepath.Join(dir, "framecheck.toml")
	if err := os.WriteFile(proj, []byte("[[zone]]\nname = \"FLOOR\"\nlive_psf = -40\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if code, stderr := runCheck(t, "check", plan, "-p", proj, "-o", out); code != exitUsage {
		t.Errorf("bad project: exit %d, want 2\n%s", code, stderr)
	}
	sameSnapshot(t, "bad project", before, snapshot(t, out))

	// A heavier floor load changes every result, and writing fails on the
	// last output (a folder stands where the overlay goes): nothing of the
	// new run may replace the old files.
	if err := os.WriteFile(proj, []byte("[[zone]]\nname = \"FLOOR\"\ndead_psf = 12\nlive_psf = 100\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	block := filepath.Join(out, "plan-overlay.dxf")
	if err := os.Mkdir(block, 0o755); err != nil {
		t.Fatal(err)
	}
	code, stderr := runCheck(t, "check", plan, "-p", proj, "-o", out, "--overlay")
	if code != exitMachine || !strings.Contains(stderr, "plan-overlay.dxf") {
		t.Errorf("blocked output: exit %d, want 3 naming plan-overlay.dxf\n%s", code, stderr)
	}
	sameSnapshot(t, "blocked output", before, snapshot(t, out))
	ents, _ := os.ReadDir(out)
	if len(ents) != len(before)+1 {
		t.Errorf("output folder holds %d entries, want the %d outputs and the blocking folder", len(ents), len(before))
	}

	// Without the obstacle the same run goes through and does change the
	// results, so the checks above could have failed.
	if err := os.Remove(block); err != nil {
		t.Fatal(err)
	}
	if code, stderr := runCheck(t, "check", plan, "-p", proj, "-o", out, "--overlay"); code == exitUsage {
		t.Fatalf("unblocked run: exit 2\n%s", stderr)
	}
	after := snapshot(t, out)
	if bytes.Equal(after[resultsName], before[resultsName]) {
		t.Error("the heavier load did not change results.json")
	}
	checkOutputsClean(t, out)
}

// The output folder may not be the input drawing, nor put an output in
// its place (by name or through a link); the drawing is left as it was.
func TestNothingLostOutputIsInput(t *testing.T) {
	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	copyBad(t, "good-r12.dxf", plan)
	orig, _ := os.ReadFile(plan)

	code, stderr := runCheck(t, "check", plan, "-o", plan)
	if code != exitUsage || !strings.Contains(stderr, "is the input drawing itself") {
		t.Errorf("-o the plan: exit %d\n%s", code, stderr)
	}

	// A drawing saved as results.json, written into its own folder.
	odd := filepath.Join(dir, resultsName)
	copyBad(t, "good-r12.dxf", odd)
	code, stderr = runCheck(t, "check", odd, "-o", dir)
	if code != exitUsage || !strings.Contains(stderr, "would replace the input") {
		t.Errorf("plan named results.json: exit %d\n%s", code, stderr)
	}
	if data, _ := os.ReadFile(odd); !bytes.Equal(data, orig) {
		t.Error("the plan named results.json was overwritten")
	}

	// schedule.xlsx in the output folder is a link to the plan.
	out := filepath.Join(dir, "out")
	if err := os.Mkdir(out, 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(plan, filepath.Join(out, scheduleName)); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	code, stderr = runCheck(t, "check", plan, "-o", out)
	if code != exitUsage || !strings.Contains(stderr, "would replace the input") {
		t.Errorf("output linked to the plan: exit %d\n%s", code, stderr)
	}
	if data, _ := os.ReadFile(plan); !bytes.Equal(data, orig) {
		t.Error("the plan was overwritten through the link")
	}
}

// The drawing is only read: a read-only plan is checked, and its bytes
// and modification time are unchanged.
func TestNothingLostInputReadOnly(t *testing.T) {
	dir := t.TempDir()
	plan := filepath.Join(dir, "plan.dxf")
	copyBad(t, "good-r12.dxf", plan)
	if err := os.Chmod(plan, 0o444); err != nil {
		t.Fatal(err)
	}
	st0, _ := os.Stat(plan)
	orig, _ := os.ReadFile(plan)
	if code, stderr := runCheck(t, "check", plan, "-o", filepath.Join(dir, "out")); code != exitOK {
		t.Fatalf("exit %d\n%s", code, stderr)
	}
	st1, _ := os.Stat(plan)
	data, _ := os.ReadFile(plan)
	if !bytes.Equal(data, orig) || !st1.ModTime().Equal(st0.ModTime()) || st1.Mode() != st0.Mode() {
		t.Errorf("plan changed: mode %v -> %v, time %v -> %v", st0.Mode(), st1.Mode(), st0.ModTime(), st1.ModTime())
	}
}

// demo writes its plan and project file into OUTDIR: files of the user's
// under those names are never replaced, while the demo's own files from
// an earlier run are.
func TestNothingLostDemoKeepsUserFiles(t *testing.T) {
	dir := t.TempDir()
	if code, stderr := runCheck(t, "demo", "-o", dir); code == exitUsage {
		t.Fatalf("first demo: exit 2\n%s", stderr)
	}
	if code, stderr := runCheck(t, "demo", "-o", dir); code == exitUsage {
		t.Fatalf("second demo in the same folder: exit 2\n%s", stderr)
	}
	for _, name := range []string{"framecheck.toml", "plan.dxf"} {
		t.Run(name, func(t *testing.T) {
			dir := t.TempDir()
			mine := []byte("# the user's own file\n")
			p := filepath.Join(dir, name)
			if err := os.WriteFile(p, mine, 0o644); err != nil {
				t.Fatal(err)
			}
			code, stderr := runCheck(t, "demo", "-o", dir)
			if code != exitUsage || !strings.Contains(stderr, "exists and is not the demo's") {
				t.Errorf("exit %d\n%s", code, stderr)
			}
			if data, _ := os.ReadFile(p); !bytes.Equal(data, mine) {
				t.Errorf("%s was replaced", name)
			}
			if ents, _ := os.ReadDir(dir); len(ents) != 1 {
				t.Errorf("the folder holds %d entries, want only the user's file", len(ents))
			}
		})
	}
}
