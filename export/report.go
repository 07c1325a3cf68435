package export

import (
	"bufio"
	"cmp"
	"fmt"
	"framecheck/export/internal/fmtx"
	"html/template"
	"slices"
	"strconv"
	"strings"
	"time"
)

// PlanGeometry is the drawing that Results does not carry: the support
// lines and the load-zone outlines, in inches (world coordinates after unit
// conversion, the same frame as Member.StartIn/EndIn).
type PlanGeometry struct {
	Supports []Polyline    `json:"supports"`
	Zones    []ZoneOutline `json:"zones"`
}

// Polyline is a support line (wall, beam or ledger) as drawn, in inches.
type Polyline struct {
	Layer  string       `json:"layer,omitempty"`
	Points [][2]float64 `json:"points"`
	Closed bool         `json:"closed,omitempty"`
}

// ZoneOutline is the closed outline of a load zone, in inches, with the
// zone's name as the project file gives it.
type ZoneOutline struct {
	Name   string       `json:"name"`
	Points [][2]float64 `json:"points"`
}

// WriteReport writes report.html for r to path, atomically: one
// self-contained page (inline CSS, SVG and a little JavaScript for pan,
// zoom and member details; nothing fetched from the network) with the
// summary, the plan coloured by each member's largest ratio, the framing
// schedule, the takeoff, the calculation of each mark written out from the
// check traces, the assumptions and the cautions. g may be nil (no supports
// or zones drawn). when is printed as the report's date, so a caller that
// passes a fixed time gets the same bytes for the same input.
//
// Member coordinates are StartIn/EndIn when set, else Start/End times the
// inch factor of r.DrawingUnits. Non-finite numbers are printed as "n/a"
// and a member whose coordinates are not finite is drawn nowhere but is
// still listed, so the page never shows NaN or Inf.
func WriteReport(path string, r *Results, g *PlanGeometry, when time.Time) error {
	return WriteReportWith(path, r, g, when, ReportOptions{})
}

// The calculation packages a report can print (ReportOptions.Package).
const (
	PackageFull      = "full"      // every check of each mark's governing member written out
	PackageGoverning = "governing" // only each mark's governing check written out, the others tabulated
)

// ReportOptions choose what the report prints.
type ReportOptions struct {
	// Package is PackageFull (also "") or PackageGoverning. Either way each
	// mark is calculated for its governing member (the largest ratio).
	// PackageGoverning writes out only that member's governing check and
	// lists its other checks in one table, leaves out the per-mark
	// design values (the Assumptions list them once) and the uplift list
	// by bearing (the list by support line stays): the short package for
	// review.
	Package string
}

// WriteReportWith is WriteReport with options.
func WriteReportWith(path string, r *Results, g *PlanGeometry, when time.Time, opts ReportOptions) error {
	if opts.Package != "" && opts.Package != PackageFull && opts.Package != PackageGoverning {
		return fmt.Errorf("export: %s: package %q: want %q or %q", path, opts.Package, PackageFull, PackageGoverning)
	}
	if r == nil {
		return fmt.Errorf("export: %s: no results to report", path)
	}
	if err := refuseDrawing(path); err != nil {
		return err
	}
	if g == nil {
		g = &PlanGeometry{}
	}
	page := buildReport(r, g, when)
	if opts.Package == PackageGoverning {
		page.Governing = true
		page.Calcs, page.Covered = dropCovered(r, page.Calcs)
		for i := range page.Calcs {
			governingOnly(&page.Calcs[i])
		}
		page.Uplift.Rows, page.Uplift.More = nil, 0
	}
	return writeAtomic(path, func(w *bufio.Writer) error {
		return reportTemplate.Execute(w, page)
	})
}

// reportPage is what the template renders.
type reportPage struct {
	// Governing: the short package (ReportOptions.Package).
	Governing bool
	// Project is the title block's lines (ProjectInfo.Lines), ProjectName
	// the project's name, Version the tool's, Footer what the printed
	// pages carry at their foot.
	Project     []string
	ProjectName string
	Version     string
	Footer      string
	Title       string
	Plan        string
	Date        string
	Editions    []string
	Summary     Summary
	Worst       []worstRow
	ErrorRows   []worstRow
	MoreErrors  int
	PlanSVG     template.HTML // the <svg> element, written by planSVG
	MemberJSON  template.JS   // details of every member for the hover panel
	Legend      []legendRow
	Marks       []markRow
	Takeoff     Takeoff
	Totals      TakeoffTotals
	Uplift      upliftSection
	Path        *pathSection // beams, posts, connections, foundation; nil without
	Covered     []coveredRow // PackageGoverning: marks left out, covered by another's calculation
	Calcs       []markCalc
	Assumptions Assumptions
	Combos      []string
	Cautions    []string
}

// worstRow is one line of the summary's list of worst members: the worst
// member of a mark, and how many members the mark has (Count 0 on the
// list of members in error).
type worstRow struct {
	ID, Mark, Size, Governing, Status, Ratio, Source string
	Messages                                         []string
	Count                                            int
}

// markRow is one line of the framing schedule.
type markRow struct {
	Mark, Anchor, Size, Species, Grade, Zone, Spacing, Spans, Rows, Ratio, Status, Band string
	Count                                                                               int
}

// worstShown is how many marks the summary lists by their worst member.
const worstShown = 10

// errorsShown is how many erroring members the summary lists by name.
const errorsShown = 50

func buildReport(r *Results, g *PlanGeometry, when time.Time) *reportPage {
	p := &reportPage{
		Title:       "framecheck report: " + r.Plan,
		Plan:        r.Plan,
		Date:        when.UTC().Format("2006-01-02 15:04 UTC"),
		Editions:    r.Assumptions.CodeEditions,
		Summary:     r.Summary,
		Takeoff:     r.Takeoff,
		Totals:      r.Takeoff.Totals,
		Assumptions: r.Assumptions,
		Combos:      r.Assumptions.Combinations,
		Cautions:    Cautions,
		Legend:      legendRows(),
		Project:     r.Project.Lines(),
		ProjectName: r.Project.Name,
		Version:     r.ToolVersion,
	}
	if p.Version == "" {
		p.Version = "version not stamped"
	}
	foot := []string{r.Plan}
	if r.Project.Name != "" {
		foot = []string{r.Project.Name, r.Plan}
	}
	if r.Project.Revision != "" {
		foot = append(foot, "rev. "+r.Project.Revision)
	}
	p.Footer = strings.Join(append(foot, "framecheck "+p.Version), " · ")
	if len(p.Combos) == 0 {
		p.Combos = defaultCombos
	}
	// Worst members: among the members that were checked.
	idx := make([]int, 0, len(r.Members))
	for i := range r.Members {
		m := &r.Members[i]
		if m.Status == StatusError {
			if len(p.ErrorRows) < errorsShown {
				p.ErrorRows = append(p.ErrorRows, newWorstRow(m))
			} else {
				p.MoreErrors++
			}
			continue
		}
		idx = append(idx, i)
	}
	// Failing members first (a member can fail with every ratio below 1,
	// when RB > 50), then by ratio, then in plan order.
	worse := func(a, b int) int {
		ma, mb := &r.Members[a], &r.Members[b]
		return cmp.Or(cmp.Compare(failRank(mb.Status), failRank(ma.Status)),
			cmp.Compare(ratioKey(mb.MaxRatio), ratioKey(ma.MaxRatio)), cmp.Compare(a, b))
	}
	// One line per mark, its worst member, so that the list shows the
	// worst kinds of joist rather than ten copies of one: a failing mark
	// fails for every member it has. Each mark's worst member is found in
	// one pass, and only those are put in order (sorting every member took
	// a seventh of the report's time on a plan of 100,000).
	type markKey struct {
		marked bool   // a mark, else a member without one
		name   string // the mark, or the member's id
	}
	keyOf := func(m *Member) markKey {
		if m.Mark != "" {
			return markKey{true, m.Mark}
		}
		return markKey{false, m.ID}
	}
	worst := map[markKey]int{}
	count := map[markKey]int{}
	for _, i := range idx {
		k := keyOf(&r.Members[i])
		count[k]++
		if w, ok := worst[k]; !ok || worse(i, w) < 0 {
			worst[k] = i
		}
	}
	reps := make([]int, 0, len(worst))
	for _, i := range worst {
		reps = append(reps, i)
	}
	slices.SortFunc(reps, worse)
	for _, i := range reps[:min(len(reps), worstShown)] {
		m := &r.Members[i]
		w := newWorstRow(m)
		w.Count = count[keyOf(m)]
		p.Worst = append(p.Worst, w)
	}
	for _, mk := range r.Marks {
		p.Marks = append(p.Marks, markRow{
			Mark: mk.Mark, Anchor: "mark-" + anchorSafe(mk.Mark), Size: mk.Size, Species: mk.Species, Grade: mk.Grade, Zone: mk.Zone,
			Spacing: inOrNA(mk.SpacingIn), Spans: SpansText(mk.SpansIn, mk.OverhangsIn), Rows: intList(mk.BlockingRowsPerSpan),
			Ratio: fmtx.Ratio(mk.MaxRatio), Status: mk.Status, Band: bandClass(mk.MaxRatio, mk.Status), Count: mk.Count,
		})
	}
	p.Uplift = buildUplift(r)
	p.Path = buildPath(r)
	p.PlanSVG, p.MemberJSON = planSVG(r, g)
	if g != nil && len(g.Zones) > maxZoneLabels {
		p.Legend = append(p.Legend, legendRow{Label: "load zones: " + strconv.Itoa(len(g.Zones)) + " outlines, each named on hover (too many to label)"})
	}
	p.Calcs = buildCalcs(r)
	return p
}

func failRank(status string) int {
	if status == StatusFail {
		return 1
	}
	return 0
}

// ratioKey orders non-finite ratios last among the worst.
func ratioKey(v float64) float64 {
	if !finite(v) {
		return -1
	}
	return v
}

func newWorstRow(m *Member) worstRow {
	w := worstRow{ID: m.ID, Mark: m.Mark, Size: m.Size, Governing: m.Governing, Status: m.Status, Source: placeOf(m), Messages: m.Messages}
	if m.Status == StatusError {
		w.Ratio = "n/a"
	} else {
		w.Ratio = fmtx.Ratio(m.MaxRatio)
	}
	return w
}

// ratioText prints a ratio to three decimals, as the schedule does.
func ratioText(v float64) string {
	if !finite(v) {
		return "n/a"
	}
	return strconv.FormatFloat(v, 'f', 3, 64)
}

// inOrNA prints a length in inches as 16 in, or "n/a" when unknown.
func inOrNA(v float64) string {
	if !finite(v) || v <= 0 {
		return "n/a"
	}
	return fmtNum(v) + " in"
}

// defaultCombos are the ASCE 7-16 2.4.1 ASD combinations (1 to 7, the
// loads framecheck knows), shown when Results names none.
var defaultCombos = []string{
	"D", "D+L", "D+(Lr or S)", "D+0.75L+0.75(Lr or S)", "D+0.6W",
	"D+0.75L+0.75(0.6W)+0.75(Lr or S)", "0.6D+0.6W",
}

// governingOnly keeps the governing check of c written out (the one with
// the largest ratio, the first on a tie) and moves the others to
// c.Others, tabulated; the per-mark design values go (the Assumptions
// list them).
func governingOnly(c *markCalc) {
	if len(c.Checks) == 0 {
		return
	}
	g := 0
	for i := range c.Checks {
		if c.Checks[i].ratio > c.Checks[g].ratio {
			g = i
		}
	}
	for i := range c.Checks {
		if i != g {
			c.Others = append(c.Others, c.Checks[i])
		}
	}
	c.Checks = []checkCalc{c.Checks[g]}
	c.DesignValues = nil
	// the datum is stated once, in the summary
	inputs := c.Inputs[:0:0]
	for _, kv := range c.Inputs {
		if kv.Key != "Positions along the member" {
			inputs = append(inputs, kv)
		}
	}
	c.Inputs = inputs
	// the factors on one line, their sources after them
	var parts, srcs []string
	seen := map[string]bool{}
	for _, f := range c.Factors {
		parts = append(parts, f.Name+" = "+f.Value)
		if f.Source != "" && !seen[f.Source] {
			seen[f.Source] = true
			srcs = append(srcs, f.Source)
		}
	}
	if len(parts) > 0 {
		c.FactorLine = strings.Join(parts, "; ")
		if len(srcs) > 0 {
			c.FactorLine += " (" + strings.Join(srcs, "; ") + ")"
		}
		c.Factors = nil
	}
	// the combinations table keeps the governing combination's rows
	base := comboBase(c.Checks[0].Combo)
	var keep []comboLoad
	for _, cl := range c.Combos {
		if comboBase(cl.Combo) == base {
			keep = append(keep, cl)
		}
	}
	if len(keep) > 0 {
		c.Combos = keep
	}
}

// comboBase is a combination's name without what the engine appends
// (", span 1", " (live-type loads on span 2)") and with no spaces.
func comboBase(s string) string {
	if i := strings.IndexAny(s, ", "); i >= 0 {
		s = s[:i]
	}
	s = strings.ReplaceAll(s, "(up)", "")
	s = strings.ReplaceAll(s, "(down)", "")
	return strings.ReplaceAll(s, " ", "")
}
