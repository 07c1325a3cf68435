package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"reflect"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"
)

// Tests of issue 15 items 1, 2, 3 and 8: the outputs replaced as one
// set, a lock per output folder, clean interrupts, one reading of the
// drawing, exit 3 for failures of the machine.

// outsetCase is a plan and a project file in a temporary folder, with
// an output folder beside them.
type outsetCase struct {
	dir, plan, proj, out string
}

func newOutsetCase(t *testing.T) *outsetCase {
	t.Helper()
	dir := t.TempDir()
	c := &outsetCase{dir: dir, plan: filepath.Join(dir, "plan.dxf"), proj: filepath.Join(dir, "p.toml"), out: filepath.Join(dir, "out")}
	copyBad(t, "good-r12.dxf", c.plan) // an R12 file can be annotated in place
	c.load(t, 40)
	return c
}

// load writes a project file with a floor live load of livePsf: each
// load gives other results, so two sets differ in every file.
func (c *outsetCase) load(t *testing.T, livePsf int) {
	t.Helper()
	text := fmt.Sprintf("[[zone]]\nname = \"FLOOR\"\ndead_psf = 12\nlive_psf = %d\n", livePsf)
	if err := os.WriteFile(c.proj, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
}

func (c *outsetCase) check(t *testing.T, extra ...string) (int, string) {
	t.Helper()
	return runCheck(t, append([]string{"check", c.plan, "-p", c.proj, "-o", c.out}, extra...)...)
}

// wantCompleteSet: the folder holds a manifest whose files are exactly
// the outputs beside it, with matching hashes, and nothing else.
func wantCompleteSet(t *testing.T, dir string) runManifest {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(dir, manifestName))
	if err != nil {
		t.Fatal(err)
	}
	var m runManifest
	if err := json.Unmarshal(data, &m); err != nil {
		t.Fatal(err)
	}
	names := map[string]bool{manifestName: true}
	for _, f := range m.Files {
		names[f.Name] = true
		sum, size, err := fileSHA256(filepath.Join(dir, f.Name))
		if err != nil || sum != f.SHA256 || size != f.Bytes {
			t.Errorf("%s: sha256 %s (%d bytes), manifest says %s (%d bytes), err %v", f.Name, sum, size, f.SHA256, f.Bytes, err)
		}
	}
	ents, _ := os.ReadDir(dir)
	for _, e := range ents {
		if !names[e.Name()] {
			t.Errorf("%s holds %s, which is not in its manifest", dir, e.Name())
		}
	}
	return m
}

// TestManifest: the manifest names the tool, the input as given and its
// SHA-256 (the same as results.json's), and every output.
func TestManifest(t *testing.T) {
	c := newOutsetCase(t)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("exit %d\n%s", code, stderr)
	}
	m := wantCompleteSet(t, c.out)
	data, _ := os.ReadFile(c.plan)
	want := sha256Hex(data)
	if m.Schema != ManifestSchema || m.Tool != "framecheck" || m.Version == "" || m.Input.Path != "plan.dxf" ||
		m.Input.SHA256 != want || m.Input.Bytes != int64(len(data)) || m.Project == nil || m.Project.Path != "p.toml" {
		t.Errorf("manifest %+v", m)
	}
	if len(m.Files) != 5 { // results, schedule, report, annotated drawing, marks.json
		t.Errorf("manifest lists %d files, want 5", len(m.Files))
	}
	res, _ := os.ReadFile(filepath.Join(c.out, resultsName))
	if !bytes.Contains(res, []byte(`"input_sha256": "`+want+`"`)) {
		t.Error("results.json lacks the input's sha256")
	}
}

// failRename makes the rename that moves the staged file suffix into the
// output folder fail, as a file locked by another program does, and any
// other rename for which also says so.
func failRename(t *testing.T, suffix string, also func(old, new string) bool) {
	t.Helper()
	t.Cleanup(func() { fsRename = os.Rename })
	fsRename = func(old, new string) error {
		if strings.HasSuffix(new, string(filepath.Separator)+suffix) && strings.Contains(old, stagePrefix) ||
			also != nil && also(old, new) {
			return &os.LinkError{Op: "rename", Old: old, New: new, Err: syscall.EBUSY}
		}
		return os.Rename(old, new)
	}
}

// TestSwapFailureKeepsPreviousSet: a rename failing as any one of the
// new outputs (or the manifest) moves in leaves the previous set byte
// for byte, exit 3, no staging or aside folder behind.
func TestSwapFailureKeepsPreviousSet(t *testing.T) {
	for _, name := range []string{resultsName, scheduleName, "plan-checked.dxf", reportName, manifestName} {
		t.Run(name, func(t *testing.T) {
			c := newOutsetCase(t)
			if code, stderr := c.check(t); code != exitOK {
				t.Fatalf("first run: exit %d\n%s", code, stderr)
			}
			before := snapshot(t, c.out)
			c.load(t, 100)
			failRename(t, name, func(old, new string) bool { return false })
			code, stderr := c.check(t)
			if code != exitMachine || !strings.Contains(stderr, name) || !strings.Contains(stderr, "are as they were") {
				t.Errorf("exit %d, want 3 naming %s\n%s", code, name, stderr)
			}
			sameSnapshot(t, "after the failed swap", before, snapshot(t, c.out))
			wantCompleteSet(t, c.out)
			checkOutputsClean(t, c.out)
			// and without the failure the new run does go through
			fsRename = os.Rename
			if code, _ := c.check(t); code != exitFail {
				t.Errorf("unblocked: exit %d, want 1 (live 100 psf fails)", code)
			}
			if bytes.Equal(snapshot(t, c.out)[resultsName], before[resultsName]) {
				t.Error("the second set did not replace the first")
			}
			wantCompleteSet(t, c.out)
		})
	}
}

// TestSwapAndRollbackFail: as if the process were stopped between
// renames: the swap fails on the report and the previous report.html
// cannot be put back either. The message says what the folder holds and
// where the previous file is, and the folder has no manifest.
func TestSwapAndRollbackFail(t *testing.T) {
	c := newOutsetCase(t)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("first run: exit %d\n%s", code, stderr)
	}
	old, _ := os.ReadFile(filepath.Join(c.out, reportName))
	c.load(t, 100)
	failRename(t, reportName, func(o, n string) bool {
		return strings.Contains(o, asidePrefix) && strings.HasSuffix(o, reportName)
	})
	code, stderr := c.check(t)
	if code != exitMachine || !strings.Contains(stderr, "holds a mix") || !strings.Contains(stderr, "no "+manifestName) {
		t.Fatalf("exit %d\n%s", code, stderr)
	}
	if _, err := os.Stat(filepath.Join(c.out, manifestName)); err == nil {
		t.Error("a manifest stands beside a mixed set")
	}
	asides, _ := filepath.Glob(filepath.Join(c.out, asidePrefix+"*", reportName))
	if len(asides) != 1 {
		t.Fatalf("previous report not kept aside: %v", asides)
	}
	if kept, _ := os.ReadFile(asides[0]); !bytes.Equal(kept, old) {
		t.Error("the report kept aside is not the previous one")
	}
	if !strings.Contains(stderr, filepath.Dir(asides[0])) {
		t.Errorf("the message does not say where the previous report is:\n%s", stderr)
	}
}

// TestLockHeld: a run into a folder another run holds stops with exit 3
// and a clear message, changing nothing.
func TestLockHeld(t *testing.T) {
	c := newOutsetCase(t)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("first run: exit %d\n%s", code, stderr)
	}
	before := snapshot(t, c.out)
	f, err := tryLock(filepath.Join(c.out, lockName))
	if err != nil {
		t.Fatal(err)
	}
	defer unlock(f, filepath.Join(c.out, lockName))
	defer func(w time.Duration) { lockWait = w }(lockWait)
	lockWait = 0
	c.load(t, 100)
	code, stderr := c.check(t)
	if code != exitMachine || !strings.Contains(stderr, "another framecheck run is writing into this folder") {
		t.Errorf("exit %d, want 3 with the lock named\n%s", code, stderr)
	}
	after := snapshot(t, c.out)
	delete(after, lockName)
	sameSnapshot(t, "with the lock held", before, after)
}

// TestTwoRunsOneFolder: two runs at once into one folder, with other
// loads: the second waits for the first's lock, and the folder ends as
// one run's complete set (every hash in its manifest matches).
func TestTwoRunsOneFolder(t *testing.T) {
	for round := 0; round < 5; round++ {
		c := newOutsetCase(t)
		proj2 := filepath.Join(c.dir, "p2.toml")
		if err := os.WriteFile(proj2, []byte("[[zone]]\nname = \"FLOOR\"\ndead_psf = 12\nlive_psf = 100\n"), 0o644); err != nil {
			t.Fatal(err)
		}
		var wg sync.WaitGroup
		codes := make([]int, 2)
		for i, p := range []string{c.proj, proj2} {
			wg.Add(1)
			go func() {
				defer wg.Done()
				var o, e bytes.Buffer
				codes[i] = run([]string{"check", c.plan, "-p", p, "-o", c.out}, &o, &e)
			}()
		}
		wg.Wait()
		if codes[0] != exitOK || codes[1] != exitFail {
			t.Fatalf("exits %v, want [0 1]", codes)
		}
		m := wantCompleteSet(t, c.out)
		res, _ := os.ReadFile(filepath.Join(c.out, resultsName))
		fail := bytes.Contains(res, []byte(`"status":"fail"`))
		if (m.Project.Path == "p2.toml") != fail {
			t.Errorf("manifest names %s but results.json has fail = %v", m.Project.Path, fail)
		}
		checkOutputsClean(t, c.out)
	}
}

// TestStaleStagingRemoved: a staging folder a killed run left is removed
// by the next run; a folder of previous outputs is not.
func TestStaleStagingRemoved(t *testing.T) {
	c := newOutsetCase(t)
	stale := filepath.Join(c.out, stagePrefix+"123")
	kept := filepath.Join(c.out, asidePrefix+"456")
	for _, d := range []string{stale, kept} {
		if err := os.MkdirAll(d, 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(d, resultsName), []byte("{}"), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("exit %d\n%s", code, stderr)
	}
	if _, err := os.Stat(stale); err == nil {
		t.Error("stale staging folder left")
	}
	if _, err := os.Stat(kept); err != nil {
		t.Error("a folder of previous outputs was removed")
	}
}

// TestDanglingOutputLink: an OUTDIR that is a link to nothing is named
// as such, exit 3.
func TestDanglingOutputLink(t *testing.T) {
	c := newOutsetCase(t)
	if err := os.Symlink(filepath.Join(c.dir, "gone"), c.out); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	code, stderr := c.check(t)
	if code != exitMachine || !strings.Contains(stderr, "dangling") {
		t.Errorf("exit %d\n%s", code, stderr)
	}
}

// TestMarkupFromCheckedBytes: the drawing replaced on disk right after it
// was read (as a CAD program's save does) changes nothing: the annotated
// copy is made from the bytes that were checked, and the manifest and
// results.json carry their hash.
func TestMarkupFromCheckedBytes(t *testing.T) {
	c := newOutsetCase(t)
	orig, _ := os.ReadFile(c.plan)
	other := strings.ReplaceAll(string(orig), "\nJOIST\n", "\nOTHER-LAYER\n")
	if other == string(orig) {
		t.Fatal("no JOIST layer in the plan")
	}
	t.Cleanup(func() { afterRead = nil })
	afterRead = replaceAfterRead(t, c.plan, other)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("exit %d\n%s", code, stderr)
	}
	annotated, _ := os.ReadFile(filepath.Join(c.out, "plan-checked.dxf"))
	if !bytes.Contains(annotated, []byte("\nJOIST\n")) || bytes.Contains(annotated, []byte("OTHER-LAYER")) {
		t.Error("the annotated copy is not made from the drawing that was checked")
	}
	m := wantCompleteSet(t, c.out)
	if m.Input.SHA256 != sha256Hex(orig) {
		t.Errorf("manifest input hash %s, want that of the bytes checked", m.Input.SHA256)
	}
}

func mustRead(t *testing.T, p string) []byte {
	t.Helper()
	b, err := os.ReadFile(p)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// replaceAfterRead returns an afterRead hook that replaces the drawing at
// path with other as a CAD program saves: a new file renamed over it.
func replaceAfterRead(t *testing.T, path, other string) func() {
	return func() {
		tmp := path + ".new"
		if err := os.WriteFile(tmp, []byte(other), 0o644); err != nil {
			t.Error(err)
		}
		if err := os.Rename(tmp, path); err != nil {
			t.Error(err)
		}
	}
}

// TestInterruptChild runs framecheck in a child process (this test
// binary, re-entered in TestChildProcess), stops it with SIGINT or
// SIGTERM once its outputs are staged, and checks: exit 130 or 143, one
// line saying the previous outputs are untouched, no staging folder, the
// previous set byte for byte; and an OUTDIR the run created is removed.
func TestInterruptChild(t *testing.T) {
	if testing.Short() {
		t.Skip("runs a child process")
	}
	exe, err := os.Executable()
	if err != nil {
		t.Skipf("cannot find the test binary to run as the child: %v", err)
	}
	for _, tc := range []struct {
		sig  syscall.Signal
		code int
		prev bool
	}{{syscall.SIGINT, exitSIGINT, true}, {syscall.SIGTERM, exitSIGTERM, true}, {syscall.SIGINT, exitSIGINT, false}} {
		t.Run(fmt.Sprintf("%v previous=%v", tc.sig, tc.prev), func(t *testing.T) {
			c := newOutsetCase(t)
			var before map[string][]byte
			if tc.prev {
				if code, stderr := c.check(t); code != exitOK {
					t.Fatalf("first run: exit %d\n%s", code, stderr)
				}
				before = snapshot(t, c.out)
			}
			cmd := exec.Command(exe, "-test.run=^TestChildProcess$")
			cmd.Env = append(os.Environ(), "FRAMECHECK_CHILD_ARGS="+strings.Join([]string{"check", c.plan, "-p", c.proj, "-o", c.out}, "\x1f"))
			var stderr bytes.Buffer
			stdout, err := cmd.StdoutPipe()
			if err != nil {
				t.Fatal(err)
			}
			cmd.Stderr = &stderr
			if err := cmd.Start(); err != nil {
				t.Fatal(err)
			}
			buf := make([]byte, 64)
			var got []byte
			for !bytes.Contains(got, []byte("STAGED")) {
				n, err := stdout.Read(buf)
				got = append(got, buf[:n]...)
				if err != nil {
					cmd.Process.Kill()
					t.Fatalf("child ended before staging: %v\n%s", err, stderr.String())
				}
			}
			if err := cmd.Process.Signal(tc.sig); err != nil {
				t.Fatal(err)
			}
			err = cmd.Wait()
			var ee *exec.ExitError
			if !errors.As(err, &ee) || ee.ExitCode() != tc.code {
				t.Fatalf("child: %v, want exit %d\n%s", err, tc.code, stderr.String())
			}
			lines := strings.Split(strings.TrimSpace(stderr.String()), "\n")
			if last := lines[len(lines)-1]; !strings.Contains(last, "previous outputs in "+c.out+" are untouched") {
				t.Errorf("last line %q", last)
			}
			if tc.prev {
				after := snapshot(t, c.out)
				sameSnapshot(t, "after the interrupt", before, after)
				checkOutputsClean(t, c.out)
			} else if _, err := os.Stat(c.out); err == nil {
				ents, _ := os.ReadDir(c.out)
				t.Errorf("the output folder the run created is left, holding %v", ents)
			}
		})
	}
}

// TestInterruptLargePlan: SIGINT to a child checking a 5,000-joist plan
// as soon as its staging folder appears, while the outputs are being
// written: exit 130, no staging folder left, the previous set intact.
func TestInterruptLargePlan(t *testing.T) {
	if testing.Short() {
		t.Skip("runs a child process on a large plan")
	}
	exe, err := os.Executable()
	if err != nil {
		t.Skipf("cannot find the test binary to run as the child: %v", err)
	}
	dir := t.TempDir()
	p := writeBigPlan(t, dir, 5000, false)
	out := filepath.Join(dir, "out")
	if code, stderr := runCheck(t, "check", p.dxf, "-p", p.toml, "-o", out); code != exitFail {
		t.Fatalf("first run: exit %d\n%s", code, stderr)
	}
	before := snapshot(t, out)
	cmd := exec.Command(exe, "-test.run=^TestChildProcess$")
	cmd.Env = append(os.Environ(), "FRAMECHECK_CHILD_ARGS="+strings.Join([]string{"check", p.dxf, "-p", p.toml, "-o", out}, "\x1f"),
		"FRAMECHECK_CHILD_NOHOOK=1")
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	exited := make(chan error, 1)
	go func() { exited <- cmd.Wait() }()
	var werr error
	for sent := false; ; {
		if !sent {
			if m, _ := filepath.Glob(filepath.Join(out, stagePrefix+"*")); len(m) > 0 {
				if err := cmd.Process.Signal(syscall.SIGINT); err != nil {
					t.Fatal(err)
				}
				sent = true
			}
		}
		select {
		case werr = <-exited:
		case <-time.After(time.Millisecond):
			continue
		}
		if !sent {
			t.Skip("the run ended before its staging folder was seen")
		}
		break
	}
	var ee *exec.ExitError
	if !errors.As(werr, &ee) || ee.ExitCode() != exitSIGINT {
		if werr == nil || ee != nil && ee.ExitCode() == exitFail {
			t.Skip("the run ended before the signal arrived")
		}
		t.Fatalf("child: %v\n%s", werr, stderr.String())
	}
	sameSnapshot(t, "after the interrupt", before, snapshot(t, out))
	checkOutputsClean(t, out)
}

// TestChildProcess is the child of TestInterruptChild: it runs the
// command given in FRAMECHECK_CHILD_ARGS, says STAGED on stdout when the
// set is staged and waits there to be stopped.
func TestChildProcess(t *testing.T) {
	args := os.Getenv("FRAMECHECK_CHILD_ARGS")
	if args == "" {
		t.Skip("only run as TestInterruptChild's child")
	}
	if os.Getenv("FRAMECHECK_CHILD_NOHOOK") != "" {
		var out bytes.Buffer
		os.Exit(run(strings.Split(args, "\x1f"), &out, os.Stderr))
	}
	beforeSwap = func(stage string) {
		fmt.Println("STAGED")
		os.Stdout.Sync()
		time.Sleep(time.Minute)
	}
	var out bytes.Buffer
	os.Exit(run(strings.Split(args, "\x1f"), &out, os.Stderr))
}

// TestPermissionDenied: an output folder that cannot be made is a
// failure of the machine, exit 3, with the reason. (Skipped as root,
// whom permissions do not stop; TestOutputUnderFile makes the same failure
// in a way that stops root too, so CI, which runs as root, covers it.)
func TestPermissionDenied(t *testing.T) {
	if os.Geteuid() == 0 {
		t.Skip("running as root, whom permissions do not refuse (TestOutputUnderFile covers the failure)")
	}
	c := newOutsetCase(t)
	ro := filepath.Join(c.dir, "ro")
	if err := os.Mkdir(ro, 0o555); err != nil {
		t.Fatal(err)
	}
	c.out = filepath.Join(ro, "out")
	code, stderr := c.check(t)
	if code != exitMachine || !strings.Contains(stderr, "permission denied") {
		t.Errorf("exit %d, want 3 saying permission denied\n%s", code, stderr)
	}
}

// TestOutputUnderFile: an output folder whose parent is a file cannot be
// made by anyone, root included: a failure of the machine, exit 3, naming
// the reason, and the file is left as it was.
func TestOutputUnderFile(t *testing.T) {
	c := newOutsetCase(t)
	parent := filepath.Join(c.dir, "not-a-folder")
	if err := os.WriteFile(parent, []byte("keep"), 0o644); err != nil {
		t.Fatal(err)
	}
	c.out = filepath.Join(parent, "out")
	code, stderr := c.check(t)
	if code != exitMachine || !strings.Contains(stderr, "not a directory") {
		t.Errorf("exit %d, want 3 saying not a directory\n%s", code, stderr)
	}
	if b, err := os.ReadFile(parent); err != nil || string(b) != "keep" {
		t.Errorf("the file in the way was changed: %q, %v", b, err)
	}
}

// TestDroppedDrawing: with the drawing's bytes dropped once read (as for
// a large drawing, dropDrawingFrom), the annotated copy is made from the
// file as opened: the same copy as from the bytes kept; a drawing replaced
// on disk meanwhile (a CAD program's save) still gives the copy of the
// bytes checked; one written over in place gives no outputs, exit 3 and a
// message saying why, the previous set untouched (common practice, no
// source: never an annotated copy of a drawing other than the one
// checked).
func TestDroppedDrawing(t *testing.T) {
	kept := newOutsetCase(t)
	if code, stderr := kept.check(t); code != exitOK {
		t.Fatalf("bytes kept: exit %d\n%s", code, stderr)
	}
	want := mustRead(t, filepath.Join(kept.out, "plan-checked.dxf"))
	defer func(v int64) { dropDrawingFrom = v }(dropDrawingFrom)
	dropDrawingFrom = 0
	c := newOutsetCase(t)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("bytes dropped: exit %d\n%s", code, stderr)
	}
	if got := mustRead(t, filepath.Join(c.out, "plan-checked.dxf")); !bytes.Equal(got, want) {
		t.Error("bytes dropped: the annotated copy differs from the one made from the bytes kept")
	}
	prev := wantCompleteSet(t, c.out)
	orig := mustRead(t, c.plan)
	other := strings.ReplaceAll(string(orig), "\nJOIST\n", "\nJOISU\n") // the same length
	if other == string(orig) {
		t.Fatal("no JOIST layer in the plan")
	}
	t.Cleanup(func() { afterRead = nil })
	// replaced: a new file renamed over the drawing
	afterRead = replaceAfterRead(t, c.plan, other)
	if code, stderr := c.check(t); code != exitOK {
		t.Fatalf("replaced: exit %d\n%s", code, stderr)
	}
	if got := mustRead(t, filepath.Join(c.out, "plan-checked.dxf")); !bytes.Equal(got, want) {
		t.Error("replaced: the annotated copy is not made from the drawing that was checked")
	}
	prev = wantCompleteSet(t, c.out)
	// written over in place, after it was read
	if err := os.WriteFile(c.plan, orig, 0o644); err != nil {
		t.Fatal(err)
	}
	afterRead = func() {
		if err := os.WriteFile(c.plan, []byte(other), 0o644); err != nil {
			t.Error(err)
		}
	}
	code, stderr := c.check(t)
	if code != exitMachine || !strings.Contains(stderr, "changed on disk while it was being checked") {
		t.Errorf("written over: exit %d, want %d and the reason\n%s", code, exitMachine, stderr)
	}
	if now := wantCompleteSet(t, c.out); !reflect.DeepEqual(now, prev) {
		t.Error("written over: the previous outputs changed")
	}
}
