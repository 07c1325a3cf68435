package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"sync"
	"sync/atomic"
	"text/tabwriter"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/framing"
	"framecheck/pipeline"
	"framecheck/project"
	"framecheck/samples"
)

func init() {
	// check and demo lead the command list.
	commands = append([]command{
		{"check", "check every joist of a DXF plan and write the results", runCheckCmd},
		{"demo", "run check on the built-in demo plan", runDemo},
	}, commands...)
}

// Output file names inside OUTDIR.
const (
	resultsName  = "results.json"
	scheduleName = "schedule.xlsx"
	reportName   = "report.html"
)

// planGeometry gives the report the supports and zone outlines to draw.
func planGeometry(o *outcome) *export.PlanGeometry {
	g := &export.PlanGeometry{}
	for _, s := range o.Plan.Supports {
		g.Supports = append(g.Supports, export.Polyline{Layer: s.Pos.Layer,
			Points: [][2]float64{{s.A.X, s.A.Y}, {s.B.X, s.B.Y}}})
	}
	for _, z := range o.Plan.Zones {
		zo := export.ZoneOutline{Name: z.Name}
		for _, p := range z.Points {
			zo.Points = append(zo.Points, [2]float64{p.X, p.Y})
		}
		g.Zones = append(g.Zones, zo)
	}
	return g
}

// checkRun is one `check` invocation after flag parsing.
type checkRun struct {
	planPath    string
	projectPath string // "" = built-in defaults
	outDir      string
	units       string
	size        bool
	overlay     bool

	warnings int                       // warning findings, counted in the summary
	doubts   []dxfimport.Issue         // findings that make the whole run doubtful (runDoubts)
	planData []byte                    // the drawing, read once: checked and annotated from these bytes (nil once dropped: planFile)
	planFile *os.File                  // the drawing as opened for the check, kept open for an annotated copy made from the file; nil for one kept in memory
	planSize int64                     // its length in bytes
	set      atomic.Pointer[outputSet] // the output folder while the run holds it
	pkg      string                    // report's calculation package: full | governing
	pdf      bool                      // also print report.pdf with a Chromium
	verbose  bool                      // -v: every failing member and the info findings
	bad      []badGroup                // failing and error members by mark, for the summary
	scan     *export.DrawingScan       // planData scanned for the annotated copy
	layers   layerFlags                // --joists, --supports
}

// reportFlags adds --package and --pdf to f for c.
func (c *checkRun) reportFlags(f *cmdFlags) {
	f.StringVar(&c.pkg, "package", export.PackageFull, "report's calculation package: full (every check of each mark) or governing (each mark's governing check)")
	f.BoolVar(&c.pdf, "pdf", false, "also write report.pdf beside report.html (needs Chromium or Chrome)")
	f.BoolVar(&c.verbose, "v", false, "verbose: list every member that fails or is in error, and the info findings")
}

// validPackage reports whether --package names a package.
func (c *checkRun) validPackage() bool {
	return c.pkg == "" || c.pkg == export.PackageFull || c.pkg == export.PackageGoverning
}

// afterRead, when not nil, runs once the drawing is in memory (a test
// replaces the file on disk there).
var afterRead func()

func runCheckCmd(args []string, stdout, stderr io.Writer) int {
	f := newFlags("check", "framecheck check PLAN.dxf [-p PROJECT.toml] [-o OUTDIR] [--units U] [--size] [--overlay] [--package full|governing] [--pdf] [-v] [--joists PATTERNS] [--supports [KIND=]PATTERNS]",
		`Reads the plan, finds the joists and their supports, checks every joist
(NDS 2018 ASD, ASCE 7-16 combinations, IBC 2018 deflection limits), decides
the blocking rows each run needs, and writes results.json, schedule.xlsx,
report.html, an annotated copy of the drawing, marks.json (the marks'
names, kept for the next run into OUTDIR) and the manifest
framecheck-run.json into OUTDIR, replacing the previous set as a whole.
Exit status: 0 every member passes, 1 a member fails or is in error or part
of the drawing could not be read or the run is doubtful (RUN401: the
spans point at wrong drawing units), 2 unusable input or usage, 3 the machine
failed the run (disk full, permission, OUTDIR locked by another run; the
previous outputs kept), 130/143 stopped by SIGINT/SIGTERM.`)
	var c checkRun
	f.StringVar(&c.projectPath, "p", "", "project file (TOML); default: built-in defaults")
	f.StringVar(&c.outDir, "o", "", "output folder (default: a folder beside the plan, named after it)")
	f.StringVar(&c.units, "units", "", "drawing units: in, ft, mm, cm or m (overrides the project file and $INSUNITS)")
	f.BoolVar(&c.size, "size", false, "pick the most economical passing size (joist board feet plus blocking) from [sizing] candidates")
	f.BoolVar(&c.overlay, "overlay", false, "also write the markup alone as an R12 overlay DXF")
	c.reportFlags(f)
	c.layers.add(f)
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if len(pos) != 1 {
		return f.usageError(stderr, "want one plan file, got %d arguments", len(pos))
	}
	c.planPath = pos[0]
	if c.units != "" && !validUnit(c.units) {
		return f.usageError(stderr, "--units %q: want in, ft, mm, cm or m", c.units)
	}
	if !c.validPackage() {
		return f.usageError(stderr, "--package %q: want full or governing", c.pkg)
	}
	if c.outDir == "" {
		base := strings.TrimSuffix(filepath.Base(c.planPath), filepath.Ext(c.planPath))
		c.outDir = filepath.Join(filepath.Dir(c.planPath), base+"-framecheck")
	}
	return c.run(stdout, stderr)
}

func validUnit(u string) bool {
	switch u {
	case "in", "ft", "mm", "cm", "m":
		return true
	}
	return false
}

func runDemo(args []string, stdout, stderr io.Writer) int {
	f := newFlags("demo", "framecheck demo [-o OUTDIR] [-v]",
		`Writes the built-in demo plan and its project file into OUTDIR and runs
check on them, so the whole job can be seen with no files at hand.`)
	c := checkRun{}
	f.StringVar(&c.outDir, "o", "framecheck-demo", "output folder")
	c.reportFlags(f)
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if !c.validPackage() {
		return f.usageError(stderr, "--package %q: want full or governing", c.pkg)
	}
	if len(pos) != 0 {
		return f.usageError(stderr, "demo takes no arguments")
	}
	c.planPath = filepath.Join(c.outDir, samples.DemoPlanName)
	c.projectPath = filepath.Join(c.outDir, "framecheck.toml")
	files := []struct {
		path string
		data []byte
	}{{c.planPath, samples.DemoPlan}, {c.projectPath, samples.DemoProject}}
	// Nothing lost: a file of the user's under either name is left alone
	// (the demo's own files from an earlier run may be written again).
	for _, w := range files {
		if old, err := os.ReadFile(w.path); err == nil && !bytes.Equal(old, w.data) {
			fmt.Fprintf(stderr, "framecheck: demo: %s exists and is not the demo's; choose another -o\n", termText(w.path))
			return exitUsage
		}
	}
	if err := os.MkdirAll(c.outDir, 0o755); err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	for _, w := range files {
		if err := os.WriteFile(w.path, w.data, 0o644); err != nil {
			fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
			return exitUsage
		}
	}
	fmt.Fprintf(stdout, "demo plan and project file written to %s\n", termText(c.outDir))
	return c.run(stdout, stderr)
}

// run does the whole job for one plan.
func (c *checkRun) run(stdout, stderr io.Writer) int {
	defer c.handleSignals(stderr)()
	proj := project.DefaultProject()
	if c.projectPath != "" {
		p, err := project.LoadProject(c.projectPath)
		if err != nil {
			fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
			return exitUsage
		}
		proj = p
	}
	if err := c.layers.apply(proj); err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	if err := c.checkPaths(); err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	if _, err := runTime(); err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	// The drawing is read once: the checks and the annotated copy use
	// the same bytes, whatever happens to the file meanwhile. A large one
	// (dropDrawingFrom) is read again for the annotated copy, from the
	// file as opened here and kept open, and checked against the bytes
	// read now; a smaller one is closed at once (on Windows an open file
	// cannot be saved over).
	f, data, regular, err := openDrawing(c.planPath)
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	c.planData, c.planSize = data, int64(len(data))
	if regular && c.planSize >= dropDrawingFrom {
		c.planFile = f
		defer f.Close()
	} else {
		f.Close()
	}
	// what the annotated copy must know of the drawing, and its hash for
	// results.json, found on the core that reading it into members leaves
	// idle
	c.scan = export.ScanDrawing(data, c.planPath)
	inputHash := make(chan string, 1)
	go func() { inputHash <- sha256Hex(data) }()
	scaleMemoryLimit(int64(len(data)), 0)
	if afterRead != nil {
		afterRead()
	}
	// Inside the outputs (and the findings) the drawing is named by
	// outputName, never by an absolute path.
	known, merr := readMarks(c.outDir)
	if merr != nil {
		fmt.Fprintf(stderr, "framecheck: warning: %s: the marks are named afresh\n", termText(merr.Error()))
	}
	inputSum := ""
	parsed := func() {
		if c.planFile != nil {
			// A large drawing is read again from the file for its
			// annotated copy (every byte hashed against inputSum) rather
			// than held through the checks: at 1,000,000 joists, 194 MB
			// of the run's peak.
			inputSum = <-inputHash
			c.scan.Detach()
			c.planData, data = nil, nil
		}
	}
	o, err := runPipeline(pipelineInput{planPath: outputName(c.planPath), planData: data, project: proj, units: c.units, size: c.size,
		marks: known, pathLater: true, parsed: parsed})
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	if len(o.Plan.Members) > 0 {
		// first of the findings, before the load path adds its own
		if msg := unmatchedSupports(o); msg != "" {
			o.Issues = append(dxfimport.IssueList{{Pos: dxfimport.Pos{File: outputName(c.planPath)}, Code: CodeUnmatchedSupport,
				Severity: dxfimport.SevWarning, Msg: msg}}, o.Issues...)
		}
	}
	// The load path is followed while the members are mapped for the
	// outputs (exportResults), after a collection of what checking the
	// members left when that is a great deal (mappingGC), the collector
	// then paused until the writers.
	hasPath := pipeline.HasLoadPath(o.Plan)
	if hasPath {
		// the load path's outputs follow its beams, posts and joints
		scaleMemoryLimit(int64(len(data)), pathItems(o.Plan))
	}
	if !hasPath {
		// The summary's failing groups need the check inputs of failing
		// members only (badGroups); the rest go before the mapping, and
		// with a great deal left by the checks, in the collection before
		// it (a million joists: 240 MB). A load path reads them all. With
		// none, there is nothing to follow, and what the pipeline kept
		// for it goes too.
		o.waitPath()
		o.Inputs = failingInputs(o.Inputs, o.Results)
	}
	mappingGC(len(o.Plan.Members))
	defer pathGC(hasPath)()
	o.startPath()
	if o.MarksFresh {
		fmt.Fprintf(stderr, "framecheck: none of the %d marks kept in %s is on this plan: the marks are named afresh from J1\n",
			len(known), termText(filepath.Join(c.outDir, marksName)))
	}
	if len(o.Plan.Members) == 0 {
		layersCmd := "framecheck layers " + c.planPath
		if c.projectPath != "" {
			layersCmd += " -p " + c.projectPath
		}
		fmt.Fprintf(stderr, "framecheck: %s: no joists found on the joist layers %s (run '%s' to see the drawing's layers and the role each gets)\n",
			termText(c.planPath), termText(strings.Join(proj.Layers.Joists, ", ")), termText(layersCmd))
		if like := joistLikeLayers(o.layers); len(like) > 0 {
			fmt.Fprintf(stderr, "framecheck: the joists may be on %s: name that layer in [layers] joists of the project file, or pass --joists %s\n",
				termText(strings.Join(like, ", ")), termText(like[0]))
		}
		if f := c.unusedProjectFile(); f != "" {
			fmt.Fprintf(stderr, "framecheck: no -p given, so the built-in layer patterns applied; to use %s, add -p %s\n", termText(f), termText(f))
		}
		o.waitPath()
		printIssues(stderr, o.Issues, c.verbose)
		return exitUsage
	}
	res := exportResults(o, c.planPath, !hasPath)
	o.waitPath()
	if hasPath {
		o.Inputs = failingInputs(o.Inputs, o.Results) // the path is followed: the summary's only
	}
	if inputSum == "" {
		inputSum = <-inputHash
	}
	res.InputSHA256 = inputSum
	// From here the writers read res, the plan's supports and zones and
	// the drawing's bytes: drop the members as grouped and checked.
	o.releaseForWriters()
	// No NaN or Inf reaches any output, the summary or the exit status: a
	// member holding one is in error, saying which value (a safety net;
	// the checks should never produce one).
	res, bad := export.SanitizeNoted(res, o.finite)
	if len(bad) > 0 {
		fmt.Fprintf(stderr, "framecheck: %d non-finite values written as 0 and their members put in error: %s\n",
			len(bad), termText(strings.Join(bad[:min(len(bad), 5)], "; ")))
	}
	// The summary's failing groups (with the lightest size that would
	// pass) need the check inputs, which the writers do not: found now,
	// and the inputs dropped before the writers run.
	c.bad = badGroups(o, res, proj)
	o.Inputs = nil
	defer writersGC()()
	written, err := c.write(o, res, proj, stderr)
	if err != nil {
		// Every failure to write is one of the machine (a full disk, a
		// permission, a lock): exit 3, the previous outputs kept.
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitMachine
	}
	if c.pdf {
		if p, perr := writeReportPDF(filepath.Join(c.outDir, reportName)); perr != nil {
			fmt.Fprintf(stderr, "framecheck: --pdf: %v\n", perr)
		} else {
			written = append(written, p)
		}
	}
	printIssues(stderr, o.Issues, c.verbose)
	c.warnings, c.doubts = countWarnings(o.Issues), runDoubts(o.Issues)
	printSummary(stdout, c, proj, res, written)
	if res.LoadPath != nil {
		fmt.Fprintf(stdout, "load path: %s (Beams, Posts, Connections and Foundation sheets)\n", export.LoadPathSummary(res.LoadPath))
	}
	if res.Summary.Fail+res.Summary.Error > 0 {
		return exitFail
	}
	if f, e := pathStatus(res.LoadPath); f+e > 0 {
		fmt.Fprintf(stderr, "framecheck: %s: every joist passes, but %d beam(s) or post(s) of the load path fail or are in error (Beams and Posts sheets)\n",
			termText(c.planPath), f+e)
		return exitFail
	}
	// Every member passes, but the run itself is in doubt (RUN401: spans
	// that point at wrong drawing units): not a clean run.
	if len(c.doubts) > 0 {
		fmt.Fprintf(stderr, "framecheck: %s: every member passes, but %s: the result is doubtful until that is resolved\n",
			c.planPath, c.doubts[0].Msg)
		return exitFail
	}
	// Every member found passes, but part of the drawing was left out
	// (entities past the limit, coordinates that overflow): not a clean run.
	if n := errorFindings(o.Issues); n > 0 {
		fmt.Fprintf(stderr, "framecheck: %s: %d error finding(s) above: part of the drawing was not read, so not every joist may have been checked\n",
			termText(c.planPath), n)
		return exitFail
	}
	return exitOK
}

// dropDrawingFrom is the size of drawing from which a run drops its bytes
// once checked and makes the annotated copy from the file
// (export.AnnotateScanFrom): about 170,000 joists of the synthetic plans.
// Smaller drawings are kept, so that a file written over in place during
// the run still gets its copy. A variable for the tests.
var dropDrawingFrom int64 = 32 << 20

// openDrawing opens the drawing at path and reads it whole, returning the
// file still open (its reading position at the end) and whether it is a
// regular file (one that can be read again: not a pipe or a device).
func openDrawing(path string) (f *os.File, data []byte, regular bool, err error) {
	f, err = os.Open(path)
	if err != nil {
		return nil, nil, false, err
	}
	var size int
	if fi, err := f.Stat(); err == nil && fi.Mode().IsRegular() {
		regular = true
		if fi.Size() < math.MaxInt32 {
			size = int(fi.Size())
		}
	}
	data = make([]byte, 0, size+1)
	for {
		n, err := f.Read(data[len(data):cap(data)])
		data = data[:len(data)+n]
		if err == io.EOF {
			return f, data, regular, nil
		}
		if err != nil {
			f.Close()
			return nil, nil, false, err
		}
		if len(data) == cap(data) {
			data = append(data, 0)[:len(data)]
		}
	}
}

// CodeUnmatchedSupport is the warning that a support layer pattern matches
// no layer while joists reach no support: the likely cause of their errors.
const CodeUnmatchedSupport = "RUN402"

// unmatchedSupports returns a warning naming the [[support]] layer
// patterns that match no layer of the drawing, when some joist end
// reaches no support; "" otherwise.
func unmatchedSupports(o *outcome) string {
	lost := false
	for _, is := range o.Issues {
		lost = lost || is.Code == framing.CodeNoSupport
	}
	if !lost {
		return ""
	}
	var pats []string
	for _, u := range unusedPatterns(o.layers, o.Project) {
		if strings.HasPrefix(u, "[[support]]") {
			pats = append(pats, u)
		}
	}
	if len(pats) == 0 {
		return ""
	}
	return fmt.Sprintf("joist ends reach no support, and these support patterns match no layer of the drawing: %s; "+
		"check the layer names with 'framecheck layers'", strings.Join(pats, "; "))
}

// projectFileName is the name `framecheck init` gives the project file.
const projectFileName = "framecheck.toml"

// unusedProjectFile returns the path of a framecheck.toml in the working
// folder or beside the plan when check runs without -p (the file was most
// likely meant to be used), else "".
func (c *checkRun) unusedProjectFile() string {
	if c.projectPath != "" {
		return ""
	}
	for _, f := range []string{projectFileName, filepath.Join(filepath.Dir(c.planPath), projectFileName)} {
		if st, err := os.Stat(f); err == nil && st.Mode().IsRegular() {
			return f
		}
	}
	return ""
}

// errorFindings counts the error-severity findings.
func errorFindings(l dxfimport.IssueList) int {
	n := 0
	for _, is := range l {
		if is.Severity == dxfimport.SevError {
			n++
		}
	}
	return n
}

// checkPaths refuses an output folder that is the plan itself, or one
// whose outputs would replace the plan or the project file.
func (c *checkRun) checkPaths() error {
	in, err1 := filepath.Abs(c.planPath)
	out, err2 := filepath.Abs(c.outDir)
	if err1 == nil && err2 == nil && in == out {
		return fmt.Errorf("output folder %s is the input drawing itself: choose another -o", c.outDir)
	}
	if st, err := os.Stat(c.outDir); err == nil && !st.IsDir() {
		return fmt.Errorf("output folder %s exists and is not a folder", c.outDir)
	}
	for _, name := range c.outputNames() {
		p := filepath.Join(c.outDir, name)
		for _, src := range []string{c.planPath, c.projectPath} {
			if src != "" && sameFile(src, p) {
				return fmt.Errorf("output %s would replace the input %s: choose another -o", p, src)
			}
		}
	}
	return nil
}

// sameFile reports whether a and b name one file: the same absolute path,
// or (both existing) the same file through a link.
func sameFile(a, b string) bool {
	aa, err1 := filepath.Abs(a)
	bb, err2 := filepath.Abs(b)
	if err1 == nil && err2 == nil && aa == bb {
		return true
	}
	sa, err1 := os.Stat(a)
	sb, err2 := os.Stat(b)
	return err1 == nil && err2 == nil && os.SameFile(sa, sb)
}

// outputNames are the files a run may write into the output folder.
func (c *checkRun) outputNames() []string {
	base := strings.TrimSuffix(filepath.Base(c.planPath), filepath.Ext(c.planPath))
	return []string{resultsName, scheduleName, base + "-checked.dxf", base + "-overlay.dxf", reportName, marksName}
}

// write writes every output into the output folder as one set (see
// outset.go): each file complete into a staging folder, then the whole
// set swapped in, the manifest last. A failure leaves the folder's
// previous set as it was and no partial file behind (a folder that the
// run created is removed again). Every error is a machineError.
func (c *checkRun) write(o *outcome, res *export.Results, proj *project.Project, stderr io.Writer) (written []string, err error) {
	when, err := runTime()
	if err != nil {
		return nil, err
	}
	set, err := openOutputSet(c.outDir, func(s *outputSet) { c.set.Store(s) })
	if err != nil {
		return nil, err
	}
	defer func() {
		if err != nil {
			set.abort()
		} else {
			set.close()
		}
	}()
	names := c.outputNames()
	var staged []string
	add := func(name string, werr error) error {
		if werr != nil && !errors.Is(werr, export.ErrNonFinite) {
			return machine(fmt.Errorf("writing %s: %w", filepath.Join(c.outDir, name), werr))
		}
		staged = append(staged, name)
		return nil
	}
	toInch := o.drawing.ToInch
	if toInch <= 0 {
		toInch = 1
	}
	// The four outputs only read res and the plan: write them at once,
	// then take their errors in this order, as when they were written one
	// after another. The markup is made in the annotated copy's goroutine
	// (the overlay, when written, takes it after all are done).
	var mk export.Markup
	jobs := []func() error{
		// res as sanitized: what exportResults noted still holds for it
		// when sanitizing changed nothing (the same results)
		func() error { return export.WriteJSONNoted(set.path(names[0]), res, o.finite) },
		func() error { return export.WriteXLSX(set.path(names[1]), res) },
		func() error {
			return export.WriteReportWith(set.path(names[4]), res, planGeometry(o), when,
				export.ReportOptions{Package: c.pkg})
		},
		func() error {
			mk = export.MarkupFromResults(res, toInch)
			if c.planData == nil {
				return export.AnnotateScanFrom(io.NewSectionReader(c.planFile, 0, math.MaxInt64), c.planSize, res.InputSHA256,
					c.planPath, set.path(names[2]), mk, c.scan)
			}
			return export.AnnotateScanned(c.planData, c.planPath, set.path(names[2]), mk, c.scan)
		},
	}
	// One goroutine each: on a large plan they take about the same time
	// (100,000 joists: spreadsheet 0.7 s, results 0.4 s, annotated
	// drawing 0.4 s, report 0.4 s), and sharing the cores among the four
	// finished sooner than two lanes of two in measured runs.
	errs := make([]error, len(jobs))
	var wg sync.WaitGroup
	for i, job := range jobs {
		wg.Add(1)
		go func() {
			defer wg.Done()
			errs[i] = job()
		}()
	}
	wg.Wait()
	if err := add(names[0], errs[0]); err != nil {
		return nil, err
	}
	if err := add(names[1], errs[1]); err != nil {
		return nil, err
	}
	if err := add(names[4], errs[2]); err != nil {
		return nil, err
	}
	overlay := c.overlay
	aerr := errs[3]
	var dxfErr *export.DXFError
	switch {
	case errors.As(aerr, &dxfErr):
		// The drawing was read, but its copy cannot be annotated (an R13+
		// file without TABLES, no 0/EOF): the markup goes alone to the
		// overlay instead, and the check results stand.
		fmt.Fprintf(stderr, "framecheck: no annotated copy of %s: %s; the markup is written alone to %s instead\n",
			termText(c.planPath), termText(aerr.Error()), termText(filepath.Join(c.outDir, names[3])))
		overlay = true
	default:
		if err := add(names[2], aerr); err != nil {
			return nil, err
		}
	}
	// the marks' names, for the next run into this folder
	mdata, err := marksJSON(o.Marks)
	if err == nil {
		err = writeSynced(set.path(marksName), mdata)
	}
	if err := add(marksName, err); err != nil {
		return nil, err
	}
	if overlay {
		// The overlay's layers avoid the plan's colours too (when readable).
		// From the scan of the bytes checked: the file named may be a
		// pipe, or have changed since.
		if c.scan != nil {
			mk.UsedACI = c.scan.LayerColours()
		} else {
			mk.UsedACI, _ = export.DrawingLayerColours(c.planPath)
		}
		if err := add(names[3], export.WriteOverlay(set.path(names[3]), mk, res.DrawingUnits)); err != nil {
			return nil, err
		}
	}
	in := &manifestInput{Path: outputName(c.planPath), SHA256: res.InputSHA256, Bytes: c.planSize}
	var pj *manifestInput
	if c.projectPath != "" {
		pj = &manifestInput{Path: outputName(c.projectPath), SHA256: proj.FileSHA256(), Bytes: proj.FileSize()}
	}
	manifest, err := buildManifest(set, staged, in, pj, when)
	if err != nil {
		return nil, machine(fmt.Errorf("hashing the outputs in %s: %w", set.stage, err))
	}
	if beforeSwap != nil {
		beforeSwap(set.stage)
	}
	return set.commit(staged, names, manifest)
}

// beforeSwap, when not nil, runs when the whole set is staged, before it
// is swapped in (a test interrupts the run there).
var beforeSwap func(stage string)

// maxDefaultsListed: up to this many settings a project file left out are
// named in the summary; more are only counted (the Notes sheet lists all).
const maxDefaultsListed = 5

// printSummary writes the run's summary: marks, failing members, blocking
// rows and takeoff totals in aligned tables.
func printSummary(w io.Writer, c *checkRun, proj *project.Project, r *export.Results, written []string) {
	colour := useColour(w)
	fmt.Fprintf(w, "\nframecheck %s: %d members: %d pass, %d fail, %d error, %s%s\n",
		termText(r.Plan), r.Summary.Members, r.Summary.Pass, r.Summary.Fail, r.Summary.Error, plural(c.warnings, "warning"), doubtText(c.doubts))
	printDefaults(w, c, proj)
	if c.size {
		fmt.Fprintln(w, termText(sizingLine(proj, r)))
	}
	fmt.Fprintln(w)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	// the tributary width beside the spacing: an edge joist has the same
	// spacing as its neighbours but half their load
	trib := map[string]float64{}
	for _, m := range r.Members {
		if _, ok := trib[m.Mark]; !ok && m.Mark != "" {
			trib[m.Mark] = m.TribIn
		}
	}
	fmt.Fprintln(tw, "mark\tcount\tsize\tgrade\tzone\tspacing\ttrib\tspans\tblocking/span\tmax ratio\tstatus")
	for _, m := range r.Marks {
		fmt.Fprintf(tw, "%s\t%d\t%s\t%s %s\t%s\t%s\t%s\t%s\t%s\t%.2f\t%s\n", termCell(m.Mark, cellWidth), m.Count,
			termCell(m.Size, cellWidth), termCell(shortSpecies(m.Species), cellWidth), termCell(m.Grade, cellWidth),
			termCell(m.Zone, cellWidth), inchText(m.SpacingIn), inchText(trib[m.Mark]), spansText(m.SpansIn, m.OverhangsIn), rowsText(m.BlockingRowsPerSpan),
			m.MaxRatio, statusText(colour, m.Status))
	}
	tw.Flush()

	printBadGroups(w, c.bad, r.Members, colour, c.verbose)
	t := r.Takeoff.Totals
	fmt.Fprintf(w, "\nblocking rows to add: %d (%d pieces)\n", len(r.BlockingRows), t.BlockingPieces)
	fmt.Fprintln(w, "takeoff:")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintf(tw, "  joists\t%d pieces\t%.0f bf\n", t.JoistCount, t.JoistBoardFeet)
	fmt.Fprintf(tw, "  blocking\t%d pieces\t%.0f bf\n", t.BlockingPieces, t.BlockingBoardFeet)
	fmt.Fprintf(tw, "  hangers\t%d\t\n", t.Hangers)
	fmt.Fprintf(tw, "  total\t\t%.0f bf\n", t.BoardFeet)
	tw.Flush()
	fmt.Fprintln(w, "\nwritten:")
	for _, p := range written {
		fmt.Fprintf(w, "  %s\n", termText(p))
	}
	fmt.Fprintln(w, "\nframecheck assists a qualified designer; it does not replace engineering judgement or a")
	fmt.Fprintln(w, "licensed professional's review. Check design values and code editions against local adoption.")
}

// sizingLine tells what --size did: the candidates tried and how many
// checked members got each size.
func sizingLine(proj *project.Project, r *export.Results) string {
	count := map[string]int{}
	for _, m := range r.Members {
		if m.Status != "error" {
			count[m.Size]++
		}
	}
	var got []string
	for _, sz := range proj.Sizing.Candidates {
		if n := count[sz]; n > 0 {
			got = append(got, fmt.Sprintf("%s for %d", sz, n))
			delete(count, sz)
		}
	}
	for sz, n := range count { // sizes outside the candidates: failing members keep theirs
		got = append(got, fmt.Sprintf("%s for %d", sz, n))
	}
	sort.Strings(got[len(got)-len(count):])
	same := "one size per run (the deepest any member needs)"
	switch proj.Sizing.SameDepth {
	case "zone":
		same = "one size per zone (the deepest any member needs)"
	case "none":
		same = "each member its own"
	}
	return fmt.Sprintf("sizes picked by --size from [sizing] candidates %s, %s: %s members",
		strings.Join(proj.Sizing.Candidates, ", "), same, strings.Join(got, ", "))
}

// inchText writes a spacing or tributary width in inches, as framers
// give them ("16 in", "8.75 in"), to 0.01 in.
func inchText(in float64) string {
	return strconv.FormatFloat(math.Round(in*100)/100, 'f', -1, 64) + " in"
}

func shortSpecies(s string) string {
	switch s {
	case "Douglas Fir-Larch":
		return "DF-L"
	case "Hem-Fir":
		return "HF"
	case "Spruce-Pine-Fir":
		return "SPF"
	case "Southern Pine":
		return "SP"
	}
	return s
}

func spansText(spans []float64, overhangs [2]float64) string {
	if t := export.SpansText(spans, overhangs); t != "" {
		return t
	}
	return "-"
}

func rowsText(rows []int) string {
	n := 0
	for _, r := range rows {
		if r > n {
			n = r
		}
	}
	if n == 0 {
		return "-"
	}
	return fmt.Sprint(n)
}

func statusText(colour bool, s string) string {
	switch s {
	case "pass":
		return paint(colour, colourGreen, "pass")
	case "fail":
		return paint(colour, colourRed, "FAIL")
	}
	return paint(colour, colourYellow, "ERROR")
}
