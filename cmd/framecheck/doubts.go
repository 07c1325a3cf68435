package main

import (
	"fmt"
	"strings"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/framing"
)

// CodeSpanDoubt is the warning on a member whose design span is outside
// the range of sawn joists: most likely a drawing misread (units, a
// stray line taken as a bearing), else a member to look at by hand.
const CodeSpanDoubt = "FRM290"

// Design spans outside these bounds are warned about on the member
// (issue 16: under 2 ft or over 40 ft). Common practice, no source: sawn
// joists do not span under 2 ft between bearings, and the longest sawn
// lumber sold is about 24 ft, so over 40 ft a member is not a sawn joist.
const (
	memberMinSpanIn = 24.0
	memberMaxSpanIn = 480.0
)

// spanWarnings adds a warning to every member with a design span under
// 2 ft or over 40 ft: in its messages (results.json, the sheets) and as a
// finding at its position.
func spanWarnings(plan *framing.Plan, issues *dxfimport.IssueList) {
	for k := range plan.Members {
		m := &plan.Members[k]
		for i, s := range m.Spans() {
			if s >= memberMinSpanIn && s <= memberMaxSpanIn {
				continue
			}
			what := "under 2'-0\""
			if s > memberMaxSpanIn {
				what = "over 40'-0\""
			}
			msg := fmt.Sprintf("%s: design span %d is %s, %s: not a sawn joist span; check the drawing units and its bearings",
				m.ID, i+1, export.FtIn(s), what)
			m.Messages = append(m.Messages, msg)
			issues.Add(m.Pos, CodeSpanDoubt, dxfimport.SevWarning, "%s", msg)
			break // one warning per member
		}
	}
}

// runDoubtLabel names, for the summary's first line, each finding that
// makes the whole run doubtful.
var runDoubtLabel = map[string]string{
	CodeUnitsDoubt:       "the drawing units look wrong",
	CodeUnmatchedSupport: "support layers match no layer",
}

// runDoubts returns the findings that make the whole run doubtful: every
// RUN4xx warning or error (spans pointing at wrong drawing units, support
// patterns matching nothing). Any of them makes the exit status 1, even
// when every member passes.
func runDoubts(issues dxfimport.IssueList) []dxfimport.Issue {
	var out []dxfimport.Issue
	for _, is := range issues {
		if is.Severity >= dxfimport.SevWarning && strings.HasPrefix(is.Code, "RUN4") {
			out = append(out, is)
		}
	}
	return out
}

// countWarnings counts the warning findings (drawing, framing and the
// run's).
func countWarnings(issues dxfimport.IssueList) int {
	n := 0
	for _, is := range issues {
		if is.Severity == dxfimport.SevWarning {
			n++
		}
	}
	return n
}

// doubtText is the summary's first-line note on the run: "; RUN
// DOUBTFUL: RUN401 the drawing units look wrong (...)", or "".
func doubtText(doubts []dxfimport.Issue) string {
	if len(doubts) == 0 {
		return ""
	}
	var parts []string
	seen := map[string]bool{}
	for _, d := range doubts {
		if seen[d.Code] {
			continue
		}
		seen[d.Code] = true
		p := d.Code
		if l := runDoubtLabel[d.Code]; l != "" {
			p += " " + l
		}
		parts = append(parts, p)
	}
	return "; RUN DOUBTFUL: " + strings.Join(parts, ", ") + " (see the findings above)"
}

// plural is "1 warning", "2 warnings".
func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return fmt.Sprintf("%d %ss", n, word)
}
