package main

import (
	"archive/zip"
	"bufio"
	"bytes"
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"testing"

	"framecheck/export"
	"framecheck/project"
)

// The bad-input corpus: one end-to-end run of `framecheck check` per file
// of testdata/bad (see testdata/bad/README.md). Each case ends either in
// exit 2 with a message naming the file and the line or handle, or in a
// result where the bad members are `error` with a message and the good
// ones are checked; never a panic, never NaN or Inf in an output, and the
// input drawing is byte-identical afterwards.

var updateBad = flag.Bool("update-bad", false, "rewrite the generated files of testdata/bad")

const badDir = "testdata/bad"

// TestBadCorpusFilesUpToDate: the committed corpus is what the generators
// in corpus_gen_test.go write.
func TestBadCorpusFilesUpToDate(t *testing.T) {
	names := make([]string, 0, len(badFiles))
	for n := range badFiles {
		names = append(names, n)
	}
	sort.Strings(names)
	for _, n := range names {
		want := badFiles[n]()
		p := filepath.Join(badDir, n)
		if *updateBad {
			if err := os.MkdirAll(badDir, 0o755); err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(p, []byte(want), 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		got, err := os.ReadFile(p)
		if err != nil {
			t.Errorf("%v (run go test -run TestBadCorpusFilesUpToDate -update-bad)", err)
			continue
		}
		if string(got) != want {
			t.Errorf("%s differs from its generator (run go test -run TestBadCorpusFilesUpToDate -update-bad)", p)
		}
	}
}

// corpusRun is one finished run of a corpus case.
type corpusRun struct {
	code           int
	stdout, stderr string
	outDir         string
	results        *export.Results // nil when exit 2
}

// runCorpus copies plan (a file of testdata/bad, or generated text when
// planText is set) and the project file into a fresh folder, runs
// `framecheck check` on the copy and checks what every case must give:
// no panic, the input unchanged, no NaN or Inf in any output, no partial
// file, and for exit 2 no output folder and a message naming the file.
func runCorpus(t *testing.T, plan, planText, project string, extra ...string) corpusRun {
	t.Helper()
	dir := t.TempDir()
	var data []byte
	if planText != "" {
		data = []byte(planText)
	} else {
		var err error
		if data, err = os.ReadFile(filepath.Join(badDir, plan)); err != nil {
			t.Fatal(err)
		}
	}
	planPath := filepath.Join(dir, plan)
	if err := os.WriteFile(planPath, data, 0o444); err != nil {
		t.Fatal(err)
	}
	args := []string{"check", planPath}
	if project != "" {
		pd, err := os.ReadFile(filepath.Join(badDir, project))
		if err != nil {
			t.Fatal(err)
		}
		pp := filepath.Join(dir, project)
		if err := os.WriteFile(pp, pd, 0o644); err != nil {
			t.Fatal(err)
		}
		args = append(args, "-p", pp)
	}
	r := corpusRun{outDir: filepath.Join(dir, "out")}
	args = append(append(args, "-o", r.outDir), extra...)
	var stdout, stderr bytes.Buffer
	func() {
		defer func() {
			if p := recover(); p != nil {
				t.Fatalf("panic: %v\nstderr:\n%s", p, stderr.String())
			}
		}()
		r.code = run(args, &stdout, &stderr)
	}()
	r.stdout, r.stderr = stdout.String(), stderr.String()
	if after, err := os.ReadFile(planPath); err != nil || !bytes.Equal(after, data) {
		t.Errorf("the input drawing changed during the run (err %v)", err)
	}
	if bad := nonFinite(r.stdout); bad != "" {
		t.Errorf("stdout holds %q:\n%s", bad, r.stdout)
	}
	if r.code == exitUsage {
		if _, err := os.Stat(r.outDir); err == nil {
			t.Errorf("exit 2 but the output folder %s was created", r.outDir)
		}
		name := plan
		if project != "" && !strings.Contains(r.stderr, plan) {
			name = project
		}
		if !strings.Contains(r.stderr, name) {
			t.Errorf("exit 2 message does not name %s:\n%s", name, r.stderr)
		}
		return r
	}
	r.results = readResults(t, r.outDir)
	checkOutputsClean(t, r.outDir)
	checkMemberOutcomes(t, r.results)
	return r
}

func readResults(t *testing.T, dir string) *export.Results {
	t.Helper()
	res, err := export.ReadJSON(filepath.Join(dir, resultsName))
	if err != nil {
		t.Fatalf("results.json: %v", err)
	}
	return res
}

// nonFiniteRE matches the ways Go, Excel and DXF writers spell a
// non-finite number.
var nonFiniteRE = regexp.MustCompile(`(?i)\b(nan|[+-]?inf(inity)?)\b|#NUM!`)

// nonFinite returns the first spelling of a non-finite number in s, or "".
func nonFinite(s string) string { return nonFiniteRE.FindString(s) }

// checkOutputsClean: every file in the output folder is complete (no
// staging folder or temporary file left) and holds no NaN or Inf: the
// JSON as numbers, the XLSX in its sheets' XML, the DXF in its values.
func checkOutputsClean(t *testing.T, dir string) {
	t.Helper()
	ents, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range ents {
		p := filepath.Join(dir, e.Name())
		if strings.HasPrefix(e.Name(), ".") || strings.Contains(e.Name(), "tmp") {
			t.Errorf("left behind in the output folder: %s", e.Name())
			continue
		}
		data, err := os.ReadFile(p)
		if err != nil {
			t.Error(err)
			continue
		}
		switch filepath.Ext(p) {
		case ".json":
			var v any
			if err := json.Unmarshal(data, &v); err != nil {
				t.Errorf("%s: %v", e.Name(), err)
			}
		case ".xlsx":
			zr, err := zip.NewReader(bytes.NewReader(data), int64(len(data)))
			if err != nil {
				t.Errorf("%s: %v", e.Name(), err)
				continue
			}
			for _, f := range zr.File {
				if !strings.HasSuffix(f.Name, ".xml") {
					continue
				}
				rc, err := f.Open()
				if err != nil {
					t.Errorf("%s %s: %v", e.Name(), f.Name, err)
					continue
				}
				x, _ := io.ReadAll(rc)
				rc.Close()
				if bad := nonFinite(string(x)); bad != "" {
					t.Errorf("%s %s holds %q", e.Name(), f.Name, bad)
				}
			}
		case ".dxf":
			sc := bufio.NewScanner(bytes.NewReader(data))
			sc.Buffer(nil, 1<<20)
			for n := 1; sc.Scan(); n++ {
				v := strings.TrimSpace(sc.Text())
				if f, err := strconv.ParseFloat(v, 64); err == nil && (math.IsNaN(f) || math.IsInf(f, 0)) {
					t.Errorf("%s:%d: %q", e.Name(), n, v)
				}
			}
		}
	}
}

// checkMemberOutcomes: members in error say why; checked members carry
// their checks with finite ratios.
func checkMemberOutcomes(t *testing.T, r *export.Results) {
	t.Helper()
	for _, m := range r.Members {
		switch m.Status {
		case export.StatusError:
			if len(m.Messages) == 0 {
				t.Errorf("%s is in error with no message", m.ID)
			}
		case export.StatusPass, export.StatusFail:
			if len(m.Checks) == 0 {
				t.Errorf("%s is %s with no checks", m.ID, m.Status)
			}
		default:
			t.Errorf("%s has status %q", m.ID, m.Status)
		}
	}
	if r.Summary.Members != len(r.Members) || r.Summary.Pass+r.Summary.Fail+r.Summary.Error != len(r.Members) {
		t.Errorf("summary %+v does not add up to %d members", r.Summary, len(r.Members))
	}
}

// statuses counts members by status.
func statuses(r *export.Results) map[string]int {
	n := map[string]int{}
	for _, m := range r.Members {
		n[m.Status]++
	}
	return n
}

func wantStderr(t *testing.T, r corpusRun, subs ...string) {
	t.Helper()
	for _, s := range subs {
		if !strings.Contains(r.stderr, s) {
			t.Errorf("stderr lacks %q:\n%s", s, r.stderr)
		}
	}
}

func wantCode(t *testing.T, r corpusRun, code int) {
	t.Helper()
	if r.code != code {
		t.Fatalf("exit %d, want %d\nstderr:\n%s\nstdout:\n%s", r.code, code, r.stderr, r.stdout)
	}
}

// wantAll: every member has status s, and there are n of them.
func wantAll(t *testing.T, r corpusRun, s string, n int) {
	t.Helper()
	if got := statuses(r.results); got[s] != n || len(r.results.Members) != n {
		t.Errorf("statuses %v, want %d %s", got, n, s)
	}
}

// Unreadable drawings: exit 2, the file and line 1 named, the cause said.
func TestBadCorpusUnreadable(t *testing.T) {
	cases := []struct{ file, want string }{
		{"empty.dxf", "empty.dxf:1: empty file"},
		{"dwg-renamed.dxf", "dwg-renamed.dxf:1: this is a DWG file"},
		{"binary.dxf", "binary.dxf:1: binary DXF is not supported"},
	}
	for _, c := range cases {
		t.Run(c.file, func(t *testing.T) {
			r := runCorpus(t, c.file, "", "")
			wantCode(t, r, exitUsage)
			wantStderr(t, r, c.want)
		})
	}
}

// Damaged drawings: exit 2 at the line (and handle) where the damage is.
// The lines are those of the generated files (corpus_gen_test.go).
func TestBadCorpusDamaged(t *testing.T) {
	cases := []struct{ file, want string }{
		// The file stops after the group code "20" of the third joist.
		{"truncated-mid-entity.dxf", "truncated-mid-entity.dxf:83: code 20: truncated file"},
		// The lost value line puts "LINE" where a group code belongs.
		{"odd-lines.dxf", "odd-lines.dxf:75: bad group code"},
		{"nan.dxf", `nan.dxf:97 (handle 106): code 20: bad number`},
		{"inf.dxf", `inf.dxf:99 (handle 106): code 11: bad number`},
		{"overflow.dxf", `overflow.dxf:99 (handle 106): code 11: bad number`},
	}
	for _, c := range cases {
		t.Run(c.file, func(t *testing.T) {
			r := runCorpus(t, c.file, "", "")
			wantCode(t, r, exitUsage)
			wantStderr(t, r, c.want)
		})
	}
}

// The good plan itself: every joist passes. Interior joist, hand
// calculation with the built-in defaults (2x10 DF-L No.2, 16 in o.c.,
// 12 ft span, D 12 + L 40 psf):
//
//	w = 52 psf x 16/12 ft = 69.33 plf = 5.778 lb/in; M = w L^2/8 = 14,976 lb-in
//	S = 21.39 in^3 (NDS 2018 Supplement Table 1B); fb = 700.1 psi
//	Fb' = 900 x 1.1 x 1.15 = 1,138.5 psi (Fb, CF: NDS 2018 Supplement Table 4A;
//	Cr: NDS 2018 4.3.9); ratio 0.615
func TestBadCorpusGoodPlan(t *testing.T) {
	for _, f := range []string{"good.dxf", "good-r12.dxf"} {
		t.Run(f, func(t *testing.T) {
			r := runCorpus(t, f, "", "")
			wantCode(t, r, exitOK)
			wantAll(t, r, export.StatusPass, 5)
			m := memberByID(t, r.results, "M3")
			if !near(m.MaxRatio, 700.13/1138.5, 0.002) {
				t.Errorf("M3 ratio %.4f, want 0.615 (hand calculation above)", m.MaxRatio)
			}
		})
	}
	// An R13+ drawing with no TABLES section cannot be annotated: the
	// markup goes alone to the overlay, with a message, and the run stands.
	r := runCorpus(t, "good.dxf", "", "")
	wantStderr(t, r, "no annotated copy", "TABLES", "good-overlay.dxf")
	if _, err := os.Stat(filepath.Join(r.outDir, "good-overlay.dxf")); err != nil {
		t.Error(err)
	}
	r = runCorpus(t, "good-r12.dxf", "", "")
	if _, err := os.Stat(filepath.Join(r.outDir, "good-r12-checked.dxf")); err != nil {
		t.Error(err)
	}
}

// Sections the reader does not know are skipped and listed; the plan is
// checked.
func TestBadCorpusUnknownSections(t *testing.T) {
	r := runCorpus(t, "unknown-sections.dxf", "", "", "-v") // info findings are printed with -v
	wantCode(t, r, exitOK)
	wantAll(t, r, export.StatusPass, 5)
	wantStderr(t, r, "DXF102", "SECTION:FRAMECHECK_NOT_A_SECTION", "SECTION:ACDSDATA")
}

// Layer names outside ASCII match the layer patterns and come out as
// drawn, from UTF-8 (R2007+) and from code page 1252 (R12).
func TestBadCorpusNonASCIILayers(t *testing.T) {
	cases := []struct {
		file   string
		layers []string
	}{
		{"non-ascii-layers.dxf", []string{"JOIST-SOLIVE-ÉTAGE", "JOIST-梁-二階", "JOIST-🪵"}},
		{"non-ascii-layers-r12.dxf", []string{"JOIST-SOLIVE-ÉTAGE", "JOIST-SüD"}},
	}
	for _, c := range cases {
		t.Run(c.file, func(t *testing.T) {
			r := runCorpus(t, c.file, "", "")
			wantCode(t, r, exitOK)
			wantAll(t, r, export.StatusPass, 3*len(c.layers))
			seen := map[string]int{}
			for _, m := range r.results.Members {
				seen[m.Layer]++
			}
			for _, l := range c.layers {
				if seen[l] != 3 {
					t.Errorf("layer %q has %d members, want 3 (layers seen %v)", l, seen[l], seen)
				}
			}
		})
	}
}

// Project-file layer patterns outside ASCII, in another case: the 🪵
// joists and 🏠 walls match no pattern and are left out; the others are
// checked, the 梁 joists in the by-layer size.
func TestBadCorpusNonASCIIProject(t *testing.T) {
	r := runCorpus(t, "non-ascii-layers.dxf", "", "non-ascii-layers.toml")
	wantCode(t, r, exitOK)
	wantAll(t, r, export.StatusPass, 6)
	for _, m := range r.results.Members {
		want := "2x10"
		if m.Layer == "JOIST-梁-二階" {
			want = "2x12"
		}
		if m.Size != want || m.Layer == "JOIST-🪵" {
			t.Errorf("%s on %q: size %s, want %s", m.ID, m.Layer, m.Size, want)
		}
	}
}

// A plan drawn at 1e300 in: its lines are skipped with a finding naming
// each handle, an error for each joist (not checked), and the exit status
// says so; the good plan beside it is checked.
func TestBadCorpusHugeCoordinates(t *testing.T) {
	r := runCorpus(t, "coords-1e300.dxf", "", "")
	wantCode(t, r, exitFail)
	wantAll(t, r, export.StatusPass, 3)
	for _, h := range []string{"106", "107"} {
		wantStderr(t, r, fmt.Sprintf("(handle %s, layer WALL): warning FRM214", h))
	}
	for _, h := range []string{"108", "109", "10A", "10B"} {
		wantStderr(t, r, fmt.Sprintf("(handle %s, layer JOIST): error FRM214", h))
	}
	// The lines left out are listed in results.json (and the Notes sheet),
	// not only on the terminal.
	notes := strings.Join(r.results.Assumptions.Notes, "\n")
	for _, h := range []string{"106", "107", "108", "109", "10A", "10B"} {
		if !strings.Contains(notes, fmt.Sprintf("(handle %s, layer ", h)) || !strings.Contains(notes, "FRM214") {
			t.Errorf("notes do not list the line of handle %s:\n%s", h, notes)
		}
	}
}

// Joists that reach no support are errors that say so, end by end.
func TestBadCorpusUnsupported(t *testing.T) {
	t.Run("no supports", func(t *testing.T) {
		r := runCorpus(t, "no-supports.dxf", "", "")
		wantCode(t, r, exitFail)
		wantAll(t, r, export.StatusError, 4)
		for _, m := range r.results.Members {
			if !strings.Contains(strings.Join(m.Messages, "\n"), "reaches no support") {
				t.Errorf("%s messages %q", m.ID, m.Messages)
			}
		}
		wantStderr(t, r, "no-supports.dxf:19 (handle 101, layer JOIST): error FRM204")
		// A member's own findings are in its messages, not repeated in the notes.
		if notes := strings.Join(r.results.Assumptions.Notes, "\n"); strings.Contains(notes, "FRM204") {
			t.Errorf("member findings repeated in the notes:\n%s", notes)
		}
	})
	t.Run("one end", func(t *testing.T) {
		r := runCorpus(t, "one-end-unsupported.dxf", "", "")
		wantCode(t, r, exitFail)
		wantAll(t, r, export.StatusError, 4)
		for _, m := range r.results.Members {
			msg := strings.Join(m.Messages, "\n")
			if !strings.Contains(msg, "end") || !strings.Contains(msg, "reaches no support") {
				t.Errorf("%s messages %q", m.ID, m.Messages)
			}
		}
		wantStderr(t, r, "one-end-unsupported.dxf:33 (handle 102, layer JOIST): error FRM204")
	})
	t.Run("no joists", func(t *testing.T) {
		r := runCorpus(t, "no-joists.dxf", "", "")
		wantCode(t, r, exitUsage)
		wantStderr(t, r, "no-joists.dxf: no joists found on the joist layers JOIST*")
	})
}

// Blocks: nesting within the limit is expanded; deeper nesting and
// self-inserting blocks are caught and reported at the INSERT.
func TestBadCorpusBlocks(t *testing.T) {
	t.Run("nested 12 deep", func(t *testing.T) {
		r := runCorpus(t, "nested-blocks.dxf", "", "")
		wantCode(t, r, exitOK)
		wantAll(t, r, export.StatusPass, 5)
		// L1 ... L11 each insert the next 10 in to the right.
		if m := memberByID(t, r.results, "M1"); m.Start[0] != 110 || m.End[0] != 254 {
			t.Errorf("M1 from %v to %v, want x 110 to 254", m.Start, m.End)
		}
	})
	t.Run("nested 24 deep", func(t *testing.T) {
		r := runCorpus(t, "nested-too-deep.dxf", "", "")
		wantCode(t, r, exitUsage)
		wantStderr(t, r, "no joists found", "nested-too-deep.dxf:453 (handle 110, layer 0): warning DXF104", "16")
	})
	t.Run("self insert", func(t *testing.T) {
		r := runCorpus(t, "self-insert.dxf", "", "")
		wantCode(t, r, exitOK)
		wantAll(t, r, export.StatusPass, 3)
		wantStderr(t, r, `self-insert.dxf:103 (handle 106, layer 0): warning DXF104`, `"SELF"`,
			`self-insert.dxf:159 (handle 108, layer 0): warning DXF104`, `"PING"`)
		if notes := strings.Join(r.results.Assumptions.Notes, "\n"); !strings.Contains(notes, `(handle 106, layer 0): warning DXF104`) {
			t.Errorf("notes lack the self-insert finding:\n%s", notes)
		}
	})
}

// 200,000 lines on layers no role takes, and a five-joist plan: the plan
// is checked and the background ignored.
func TestBadCorpusIgnoredLayers(t *testing.T) {
	if testing.Short() {
		t.Skip("14 MB drawing")
	}
	r := runCorpus(t, "ignored-layers.dxf", ignoredLayersPlan(200_000), "")
	wantCode(t, r, exitOK)
	wantAll(t, r, export.StatusPass, 5)
}

// wantRE finds the "# want: TEXT" markers of a project file.
var wantRE = regexp.MustCompile(`#\s*want:\s*(.+)$`)

// A project file with one of every kind of mistake: every mistake is
// reported at its line, and nothing else is.
func TestBadCorpusProjectMistakes(t *testing.T) {
	const name = "project-mistakes.toml"
	data, err := os.ReadFile(filepath.Join(badDir, name))
	if err != nil {
		t.Fatal(err)
	}
	want := map[int]string{}
	for i, l := range strings.Split(string(data), "\n") {
		if m := wantRE.FindStringSubmatch(l); m != nil && !strings.HasPrefix(strings.TrimSpace(l), "#") {
			want[i+1] = strings.TrimSpace(m[1])
		}
	}
	if len(want) < 20 {
		t.Fatalf("only %d markers in %s", len(want), name)
	}
	r := runCorpus(t, "good.dxf", "", name)
	wantCode(t, r, exitUsage)
	got := map[int]string{}
	lineRE := regexp.MustCompile(regexp.QuoteMeta(name) + `:(\d+): (.*)`)
	for _, l := range strings.Split(r.stderr, "\n") {
		if m := lineRE.FindStringSubmatch(l); m != nil {
			n, _ := strconv.Atoi(m[1])
			got[n] += m[2] + "\n"
		}
	}
	for line, text := range want {
		if !strings.Contains(got[line], text) {
			t.Errorf("line %d: want a message with %q, got %q", line, text, got[line])
		}
	}
	for line, msg := range got {
		if _, ok := want[line]; !ok {
			t.Errorf("line %d: unexpected message %q", line, msg)
		}
	}
}

// A TOML syntax error is reported at its own line: the unclosed table
// name is on line 5 (the decoder itself says 6, the line after the
// newline where it noticed).
func TestBadCorpusProjectSyntax(t *testing.T) {
	r := runCorpus(t, "good.dxf", "", "project-syntax.toml")
	wantCode(t, r, exitUsage)
	wantStderr(t, r, "project-syntax.toml:5: TOML syntax")
}

// More damaged and messy drawings.
func TestBadCorpusMessy(t *testing.T) {
	t.Run("no EOF", func(t *testing.T) {
		r := runCorpus(t, "no-eof.dxf", "", "")
		wantCode(t, r, exitUsage)
		wantStderr(t, r, "no-eof.dxf:117: truncated file: no 0/EOF marker")
	})
	t.Run("zero length and duplicate", func(t *testing.T) {
		r := runCorpus(t, "zero-and-duplicate.dxf", "", "")
		wantCode(t, r, exitOK)
		wantAll(t, r, export.StatusPass, 5)
		wantStderr(t, r, "zero-and-duplicate.dxf:117 (handle 108, layer JOIST): warning FRM202",
			"zero-and-duplicate.dxf:131 (handle 109, layer JOIST): warning FRM203")
	})
	t.Run("line missing its end", func(t *testing.T) {
		// Left out with an error finding at its line and handle; the
		// plan's five joists are checked, and the run is not clean.
		r := runCorpus(t, "line-missing-end.dxf", "", "")
		wantCode(t, r, exitFail)
		wantAll(t, r, export.StatusPass, 5)
		wantStderr(t, r, "line-missing-end.dxf:", "(handle 108, layer JOIST): error DXF113: LINE without its end point (group code 11, 21 missing): left out",
			"part of the drawing was not read")
	})
	t.Run("bad callouts", func(t *testing.T) {
		// Joists y = 16, 32 under "2x10 @ banana", y = 48 under "2x99 @ 16":
		// errors naming the text and its handle, with no size (the
		// project's 2x10 is not assumed); y = 64, 80 under the readable
		// callout are checked as 2x10 DF-L No.2 and pass (the good plan's
		// hand check). Exit 1.
		r := runCorpus(t, "bad-callouts.dxf", "", "")
		wantCode(t, r, exitFail)
		wantStderr(t, r, `bad-callouts.dxf:131 (handle 109, layer FRAMING-NOTE): error FRM208: size callout not read: "2x10 @ banana": no spacing read at "banana"`,
			"the 2 joist(s) under it are in error",
			`bad-callouts.dxf:159 (handle 10B, layer FRAMING-NOTE): error FRM208: size callout not read: "2x99 @ 16": nominal size 2x99 is not dimension lumber`,
			`bad-callouts.dxf:201 (handle 10E, layer FRAMING-NOTE): warning FRM208: callout cannot be read and reaches no joist`, "spacing 96 in is outside 4-48 in")
		for _, m := range r.results.Members {
			msgs := strings.Join(m.Messages, " ")
			switch y := m.Start[1]; {
			case y < 40 && (m.Status != export.StatusError || m.Size != "" || !strings.Contains(msgs, `"2x10 @ banana" (`) || !strings.Contains(msgs, "handle 109")):
				t.Errorf("%s at y %g: %s %q %q, want error naming the callout and its handle, no size", m.ID, y, m.Status, m.Size, msgs)
			case y > 40 && y < 56 && (m.Status != export.StatusError || m.Size != "" || !strings.Contains(msgs, `"2x99 @ 16"`)):
				t.Errorf("%s at y %g: %s %q %q, want error", m.ID, y, m.Status, m.Size, msgs)
			case y > 56 && (m.Status != export.StatusPass || m.Size != "2x10" || m.Species != "Douglas Fir-Larch" || m.Grade != "No.2"):
				t.Errorf("%s at y %g: %s %s %s %s, want a pass as 2x10 DF-L No.2", m.ID, y, m.Status, m.Size, m.Species, m.Grade)
			}
		}
	})
	t.Run("outline not a rectangle", func(t *testing.T) {
		// The tapered outline (handles 108-10B) and the pointed polyline
		// (10C) are error members naming their entities; the five joists
		// and the good rectangle at y = 128 are checked and pass.
		r := runCorpus(t, "outline-not-rectangle.dxf", "", "")
		wantCode(t, r, exitFail)
		wantStderr(t, r, "(handle 108, layer JOIST): error FRM216", "not parallel",
			"(handle 10C, layer JOIST): error FRM216", "handle 10C) is a closed polyline of 5 corners, not a rectangle")
		st := statuses(r.results)
		if st[export.StatusPass] != 6 || st[export.StatusError] != 2 || len(r.results.Members) != 8 {
			t.Errorf("statuses %v, want 6 pass and 2 error", st)
		}
	})
	t.Run("unknown zone", func(t *testing.T) {
		// The upper three joists lie in the ATTIC outline; the lower two
		// take the default zone and are checked.
		r := runCorpus(t, "unknown-zone.dxf", "", "")
		wantCode(t, r, exitFail)
		for _, m := range r.results.Members {
			inAttic := m.Start[1] > 40
			switch {
			case inAttic && (m.Status != export.StatusError || !strings.Contains(strings.Join(m.Messages, " "), `"ATTIC"`)):
				t.Errorf("%s in ATTIC: %s %q", m.ID, m.Status, m.Messages)
			case !inAttic && m.Status != export.StatusPass:
				t.Errorf("%s outside ATTIC: %s %q", m.ID, m.Status, m.Messages)
			}
		}
	})
	t.Run("MINSERT bomb", func(t *testing.T) {
		// Left out whole before it is expanded: the run is quick and small,
		// the plan beside it is checked. Its lines are furniture (a layer
		// with no role), so every joist was read: a warning, exit 0
		// (issue 15 item 5).
		r := runCorpus(t, "minsert-bomb.dxf", "", "")
		wantCode(t, r, exitOK)
		wantAll(t, r, export.StatusPass, 5)
		wantStderr(t, r, "minsert-bomb.dxf:91 (handle 103, layer 0): warning DXF105", "none on a layer in use")
		if !strings.Contains(strings.Join(r.results.Assumptions.Notes, "\n"), "DXF105") {
			t.Errorf("notes lack DXF105: %q", r.results.Assumptions.Notes)
		}
	})
	t.Run("MINSERT bomb of joists", func(t *testing.T) {
		// The same bomb drawn on a joist layer: joists were left out, so
		// the exit status says that part of the drawing was not read.
		r := runCorpus(t, "minsert-bomb-joists.dxf", "", "")
		wantCode(t, r, exitFail)
		wantAll(t, r, export.StatusPass, 5)
		wantStderr(t, r, "minsert-bomb-joists.dxf:91 (handle 103, layer 0): error DXF105", "part of the drawing was not read")
	})
}

// TOML syntax errors at the end of a line, inside one and at the end of
// the file are each reported at the line that holds the mistake.
func TestProjectSyntaxLines(t *testing.T) {
	cases := []struct {
		in   string
		line int
	}{
		{"[drawing]\nunits = \"in\"\n[design\nkcr = 1.5\n", 3}, // unclosed table name
		{"a = \nb = 2\n", 1},                                // no value
		{"[drawing]\nunits = \"in\nb = 1\n", 2},             // newline inside a string
		{"[a]\nb = 1\n[a]\nc = 2\n", 3},                     // table defined twice
		{"[design]\ncombinations = [\"D\",\n\"D+L\",\n", 3}, // file ends inside an array
	}
	for _, c := range cases {
		_, err := project.ParseProject("p.toml", []byte(c.in))
		want := fmt.Sprintf("p.toml:%d: TOML syntax", c.line)
		if err == nil || !strings.HasPrefix(err.Error(), want) {
			t.Errorf("%q: got %v, want %s...", c.in, err, want)
		}
	}
}
