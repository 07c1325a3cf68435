package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"text/tabwriter"

	"framecheck/dxfimport"
	"framecheck/export"
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
)

// checkRun is one `check` invocation after flag parsing.
type checkRun struct {
	planPath    string
	projectPath string // "" = built-in defaults
	outDir      string
	units       string
	size        bool
	overlay     bool
}

func runCheckCmd(args []string, stdout, stderr io.Writer) int {
	f := newFlags("check", "framecheck check PLAN.dxf [-p PROJECT.toml] [-o OUTDIR] [--units U] [--size] [--overlay]",
		`Reads the plan, finds the joists and their supports, checks every joist
(NDS 2018 ASD, ASCE 7-16 combinations, IBC 2018 deflection limits), decides
the blocking rows each run needs, and writes results.json, schedule.xlsx and
an annotated copy of the drawing into OUTDIR. Exit status: 0 every member
passes, 1 a member fails or is in error, 2 unusable input or usage.`)
	var c checkRun
	f.StringVar(&c.projectPath, "p", "", "project file (TOML); default: built-in defaults")
	f.StringVar(&c.outDir, "o", "", "output folder (default: a folder beside the plan, named after it)")
	f.StringVar(&c.units, "units", "", "drawing units: in, ft, mm, cm or m (overrides the project file and $INSUNITS)")
	f.BoolVar(&c.size, "size", false, "pick the lightest passing size from [sizing] candidates")
	f.BoolVar(&c.overlay, "overlay", false, "also write the markup alone as an R12 overlay DXF")
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
	f := newFlags("demo", "framecheck demo [-o OUTDIR]",
		`Writes the built-in demo plan and its project file into OUTDIR and runs
check on them, so the whole job can be seen with no files at hand.`)
	c := checkRun{}
	f.StringVar(&c.outDir, "o", "framecheck-demo", "output folder")
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if len(pos) != 0 {
		return f.usageError(stderr, "demo takes no arguments")
	}
	if err := os.MkdirAll(c.outDir, 0o755); err != nil {
		fmt.Fprintf(stderr, "framecheck: %v\n", err)
		return exitUsage
	}
	c.planPath = filepath.Join(c.outDir, samples.DemoPlanName)
	c.projectPath = filepath.Join(c.outDir, "framecheck.toml")
	for _, w := range []struct {
		path string
		data []byte
	}{{c.planPath, samples.DemoPlan}, {c.projectPath, samples.DemoProject}} {
		if err := os.WriteFile(w.path, w.data, 0o644); err != nil {
			fmt.Fprintf(stderr, "framecheck: %v\n", err)
			return exitUsage
		}
	}
	fmt.Fprintf(stdout, "demo plan and project file written to %s\n", c.outDir)
	return c.run(stdout, stderr)
}

// run does the whole job for one plan.
func (c *checkRun) run(stdout, stderr io.Writer) int {
	proj := DefaultProject()
	if c.projectPath != "" {
		p, err := LoadProject(c.projectPath)
		if err != nil {
			fmt.Fprintf(stderr, "framecheck: %v\n", err)
			return exitUsage
		}
		proj = p
	}
	if err := c.checkPaths(); err != nil {
		fmt.Fprintf(stderr, "framecheck: %v\n", err)
		return exitUsage
	}
	o, err := runPipeline(pipelineInput{planPath: c.planPath, project: proj, units: c.units, size: c.size})
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: %v\n", err)
		return exitUsage
	}
	if len(o.plan.Members) == 0 {
		fmt.Fprintf(stderr, "framecheck: %s: no joists found on the joist layers %s (run 'framecheck layers %s' to see the drawing's layers)\n",
			c.planPath, strings.Join(proj.Layers.Joists, ", "), c.planPath)
		printIssues(stderr, o.issues)
		return exitUsage
	}
	res := exportResults(o, c.planPath)
	written, err := c.write(o, res)
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: %v\n", err)
		return exitUsage
	}
	printIssues(stderr, o.issues)
	printSummary(stdout, c, proj, res, written)
	if res.Summary.Fail+res.Summary.Error > 0 {
		return exitFail
	}
	return exitOK
}

// checkPaths refuses an output folder that is the plan itself.
func (c *checkRun) checkPaths() error {
	in, err1 := filepath.Abs(c.planPath)
	out, err2 := filepath.Abs(c.outDir)
	if err1 == nil && err2 == nil && in == out {
		return fmt.Errorf("output folder %s is the input drawing itself: choose another -o", c.outDir)
	}
	if st, err := os.Stat(c.outDir); err == nil && !st.IsDir() {
		return fmt.Errorf("output folder %s exists and is not a folder", c.outDir)
	}
	return nil
}

// write writes every output into the output folder; each file goes to a
// temporary name first and is renamed into place only when complete.
func (c *checkRun) write(o *outcome, res *export.Results) ([]string, error) {
	if err := os.MkdirAll(c.outDir, 0o755); err != nil {
		return nil, err
	}
	base := strings.TrimSuffix(filepath.Base(c.planPath), filepath.Ext(c.planPath))
	var written []string
	add := func(name string, err error) error {
		if err != nil {
			return fmt.Errorf("writing %s: %w", name, err)
		}
		written = append(written, name)
		return nil
	}
	p := filepath.Join(c.outDir, resultsName)
	if err := add(p, export.WriteJSON(p, res)); err != nil && !errors.Is(err, export.ErrNonFinite) {
		return written, err
	}
	p = filepath.Join(c.outDir, scheduleName)
	if err := add(p, export.WriteXLSX(p, res)); err != nil && !errors.Is(err, export.ErrNonFinite) {
		return written, err
	}
	toInch := o.drawing.ToInch
	if toInch <= 0 {
		toInch = 1
	}
	mk := export.MarkupFromResults(res, toInch)
	p = filepath.Join(c.outDir, base+"-checked.dxf")
	if err := add(p, export.Annotate(c.planPath, p, mk)); err != nil {
		return written, err
	}
	if c.overlay {
		p = filepath.Join(c.outDir, base+"-overlay.dxf")
		if err := add(p, export.WriteOverlay(p, mk, res.DrawingUnits)); err != nil {
			return written, err
		}
	}
	return written, nil
}

// printIssues writes the drawing and framing findings, at most 25 of them.
func printIssues(w io.Writer, issues dxfimport.IssueList) {
	const most = 25
	for i, is := range issues {
		if i == most {
			fmt.Fprintf(w, "framecheck: ... and %d more findings (see results.json messages)\n", len(issues)-most)
			break
		}
		fmt.Fprintf(w, "framecheck: %s\n", is.Error())
	}
}

// printSummary writes the run's summary: marks, failing members, blocking
// rows and takeoff totals in aligned tables.
func printSummary(w io.Writer, c *checkRun, proj *Project, r *export.Results, written []string) {
	colour := useColour(w)
	fmt.Fprintf(w, "\nframecheck %s: %d members: %d pass, %d fail, %d error\n",
		r.Plan, r.Summary.Members, r.Summary.Pass, r.Summary.Fail, r.Summary.Error)
	if used := proj.DefaultsUsed(); len(used) > 0 {
		if c.projectPath == "" {
			fmt.Fprintf(w, "no project file: built-in defaults used (%d settings; see the Inputs sheet)\n", len(used))
		} else {
			fmt.Fprintf(w, "%d settings left out of %s took their defaults (listed in the Notes sheet)\n", len(used), c.projectPath)
		}
	}
	fmt.Fprintln(w)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "mark\tcount\tsize\tgrade\tzone\tspacing\tspans\tblocking/span\tmax ratio\tstatus")
	for _, m := range r.Marks {
		fmt.Fprintf(tw, "%s\t%d\t%s\t%s %s\t%s\t%s\t%s\t%s\t%.2f\t%s\n", m.Mark, m.Count, m.Size, shortSpecies(m.Species), m.Grade,
			m.Zone, export.FtIn(m.SpacingIn), spansText(m.SpansIn), rowsText(m.BlockingRowsPerSpan), m.MaxRatio, statusText(colour, m.Status))
	}
	tw.Flush()

	var bad []export.Member
	for _, m := range r.Members {
		if m.Status != "pass" {
			bad = append(bad, m)
		}
	}
	if len(bad) > 0 {
		fmt.Fprintf(w, "\nmembers that fail or are in error (%d):\n", len(bad))
		tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "member\tmark\tsize\tgoverning\tratio\tstatus\tsource\tfirst message")
		for i, m := range bad {
			if i == 20 {
				fmt.Fprintf(tw, "...\t%d more in results.json\n", len(bad)-20)
				break
			}
			msg := ""
			if len(m.Messages) > 0 {
				msg = m.Messages[0]
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%.2f\t%s\t%s\t%s\n", m.ID, m.Mark, m.Size, m.Governing, m.MaxRatio,
				statusText(colour, m.Status), m.Source, msg)
		}
		tw.Flush()
	}
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
		fmt.Fprintf(w, "  %s\n", p)
	}
	fmt.Fprintln(w, "\nframecheck assists a qualified designer; it does not replace engineering judgement or a")
	fmt.Fprintln(w, "licensed professional's review. Check design values and code editions against local adoption.")
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

func spansText(spans []float64) string {
	var parts []string
	for _, s := range spans {
		parts = append(parts, export.FtIn(s))
	}
	if len(parts) == 0 {
		return "-"
	}
	return strings.Join(parts, " + ")
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
		return paint(colour, "32", "pass")
	case "fail":
		return paint(colour, "31", "FAIL")
	}
	return paint(colour, "33", "ERROR")
}
