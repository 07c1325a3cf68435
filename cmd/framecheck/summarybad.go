package main

import (
	"fmt"
	"io"
	"sort"
	"strings"
	"text/tabwriter"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/project"
)

// badGroup is one line of the summary's table of members that fail or
// are in error: the members of one mark (or, for error members that got
// no mark, all of them) that share a status.
type badGroup struct {
	Mark   string // "" for error members without a mark
	Status string // fail | error
	Count  int
	Size   string
	// Worst is the member with the largest ratio (the first one for
	// members in error), Governing its governing check and Ratio its
	// largest ratio.
	Worst     string
	Governing string
	Ratio     float64
	Reason    string // error groups: the worst member's first message
	// Alternative is the lightest [sizing] candidate with which the worst
	// member passes, "" when none passes (Tried says so) or for errors.
	Alternative      string
	AlternativeRatio float64
	Tried            bool // the candidates were tried
}

// badGroups groups the failing and error members of r by mark and status,
// in mark order (unmarked error members last), and finds for each failing
// group the lightest [sizing] candidate with which its worst member
// passes, by checking that member again at each candidate size
// (check.Size with its blocking rows; nothing is assumed).
func badGroups(o *outcome, r *export.Results, proj *project.Project) []badGroup {
	index := map[string]int{}
	var groups []badGroup
	for i := range r.Members {
		m := &r.Members[i]
		if m.Status != export.StatusFail && m.Status != export.StatusError {
			continue
		}
		key := m.Mark + "\x00" + m.Status
		gi, ok := index[key]
		if !ok {
			gi = len(groups)
			index[key] = gi
			groups = append(groups, badGroup{Mark: m.Mark, Status: m.Status, Size: m.Size, Worst: m.ID,
				Governing: m.Governing, Ratio: m.MaxRatio, Reason: firstMessage(m)})
		}
		g := &groups[gi]
		g.Count++
		if m.Status == export.StatusFail && m.MaxRatio > g.Ratio {
			g.Size, g.Worst, g.Governing, g.Ratio = m.Size, m.ID, m.Governing, m.MaxRatio
		}
	}
	sort.SliceStable(groups, func(i, j int) bool {
		a, b := groups[i], groups[j]
		if (a.Mark == "") != (b.Mark == "") {
			return b.Mark == ""
		}
		if a.Mark != b.Mark {
			return markLess(a.Mark, b.Mark)
		}
		return a.Status == export.StatusFail && b.Status != export.StatusFail
	})
	if o == nil {
		return groups
	}
	// Found among the check inputs (which carry the member ids): the
	// plan's members are released before the writers run. Only the
	// failing groups' worst members are looked for.
	member := map[string]int{}
	for i := range groups {
		if groups[i].Status == export.StatusFail {
			member[groups[i].Worst] = -1
		}
	}
	if len(member) > 0 {
		for k := range o.Inputs {
			if _, ok := member[o.Inputs[k].ID]; ok {
				member[o.Inputs[k].ID] = k
			}
		}
	}
	for i := range groups {
		g := &groups[i]
		k, ok := member[g.Worst]
		if g.Status != export.StatusFail || !ok || k < 0 {
			continue
		}
		g.Alternative, g.AlternativeRatio = lightestPassing(o.Inputs[k], o.Settings, proj.Sizing)
		g.Tried = true
	}
	return groups
}

// lightestPassing checks m at every [sizing] candidate, each with the
// blocking rows it needs (check.Size), and returns the size --size would
// pick, with its largest ratio: the most economical that passes (the
// joist's board feet and its blocking pieces, [sizing]
// blocking_piece_weight_bf each; ties to the lighter joist), or "" when
// none passes. The summary and --size so never name different sizes (an
// audit found the summary naming the lightest section, 2x10 with 7 rows,
// where --size picked 2x12 with 3).
func lightestPassing(m check.Member, s check.Settings, sz project.Sizing) (string, float64) {
	res := check.Size(m, s, sz.Candidates, sz.BlockingPieceWeightBf)
	if res.Chosen.Status != check.StatusPass {
		return "", 0
	}
	return res.Chosen.Size, res.Chosen.MaxRatio
}

func firstMessage(m *export.Member) string {
	if len(m.Messages) > 0 {
		return m.Messages[0]
	}
	return ""
}

// alternativeText is the table's "passes with" cell of g.
func (g *badGroup) alternativeText() string {
	switch {
	case g.Status == export.StatusError:
		return "not checked: " + g.Reason
	case g.Alternative != "":
		return fmt.Sprintf("%s (ratio %.2f)", g.Alternative, g.AlternativeRatio)
	case g.Tried:
		return "no [sizing] candidate passes"
	}
	return "-"
}

// printBadGroups writes the failing and error members grouped by mark:
// count, worst member, governing check, ratio and the lightest candidate
// size that passes; with verbose, every member after it, one a line.
func printBadGroups(w io.Writer, groups []badGroup, members []export.Member, colour, verbose bool) {
	n := 0
	for _, g := range groups {
		n += g.Count
	}
	if n == 0 {
		return
	}
	more := " (-v lists each member)"
	if verbose {
		more = ""
	}
	fmt.Fprintf(w, "\nmembers that fail or are in error: %d, by mark%s:\n", n, more)
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	// status last: its colour codes would shift the columns after it
	fmt.Fprintln(tw, "mark\tcount\tsize\tworst\tgoverning\tratio\tpasses with (--size)\tstatus")
	for _, g := range groups {
		mark, gov, ratio := g.Mark, g.Governing, fmt.Sprintf("%.2f", g.Ratio)
		if mark == "" {
			mark = "-"
		}
		if g.Status == export.StatusError {
			gov, ratio = "-", "-" // not checked: no ratio
		}
		if gov == "" {
			gov = "-"
		}
		fmt.Fprintf(tw, "%s\t%d\t%s\t%s\t%s\t%s\t%s\t%s\n", termCell(mark, cellWidth), g.Count, termCell(g.Size, cellWidth),
			termCell(g.Worst, cellWidth), termCell(gov, cellWidth), ratio, termCell(g.alternativeText(), reasonWidth),
			statusText(colour, g.Status))
	}
	tw.Flush()
	if !verbose {
		return
	}
	fmt.Fprintln(w, "\neach member that fails or is in error:")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "member\tmark\tsize\tgoverning\tratio\tsource\tfirst message\tstatus")
	for i := range members {
		m := &members[i]
		if m.Status != export.StatusFail && m.Status != export.StatusError {
			continue
		}
		ratio := fmt.Sprintf("%.2f", m.MaxRatio)
		if m.Status == export.StatusError {
			ratio = "-"
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", termCell(m.ID, cellWidth), termCell(m.Mark, cellWidth),
			termCell(m.Size, cellWidth), termCell(m.Governing, cellWidth), ratio, termCell(m.Source, sourceWidth),
			termCell(firstMessage(m), messageWidth), statusText(colour, m.Status))
	}
	tw.Flush()
}

// printIssues writes the drawing and framing findings, at most 25 of
// them. Findings of severity info (a member crossing zone edges, joists
// drawn in a bay) are written only with verbose; otherwise one line
// counts them by code.
func printIssues(w io.Writer, issues dxfimport.IssueList, verbose bool) {
	const most = 25
	hidden := map[string]int{}
	var codes []string
	var shown dxfimport.IssueList
	for _, is := range issues {
		if !verbose && is.Severity == dxfimport.SevInfo {
			if hidden[is.Code] == 0 {
				codes = append(codes, is.Code)
			}
			hidden[is.Code]++
			continue
		}
		shown = append(shown, is)
	}
	for i, is := range shown {
		if i == most {
			fmt.Fprintf(w, "framecheck: ... and %d more findings (see results.json messages)\n", len(shown)-most)
			break
		}
		fmt.Fprintf(w, "framecheck: %s\n", termText(is.Error()))
	}
	if len(codes) == 0 {
		return
	}
	n := 0
	parts := make([]string, len(codes))
	for i, c := range codes {
		n += hidden[c]
		parts[i] = fmt.Sprintf("%s %d", c, hidden[c])
	}
	fmt.Fprintf(w, "framecheck: %s not shown (%s); -v shows them\n", plural(n, "info finding"), termText(strings.Join(parts, ", ")))
}

// reasonWidth bounds the "passes with (--size)" cell, which holds an
// error member's reason.
const reasonWidth = 64

// failingInputs returns the check inputs of the members whose results
// fail, in order, in a slice of their own (badGroups looks the failing
// groups' worst members up among them by ID).
func failingInputs(inputs []check.Member, results []check.Result) []check.Member {
	failing := func(k int) bool { return k < len(results) && results[k].Status == check.StatusFail }
	n := 0
	for k := range inputs {
		if failing(k) {
			n++
		}
	}
	out := make([]check.Member, 0, n)
	for k := range inputs {
		if failing(k) {
			out = append(out, inputs[k])
		}
	}
	return out
}
